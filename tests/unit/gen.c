/* gen.c - random stream problems for property tests. */
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "gen.h"

void
hl_rng_seed(hl_rng *r, uint64_t seed)
{
	r->s = seed ? seed : 0x9e3779b97f4a7c15ull;
}

/* xorshift64* (Vigna 2016): fast, reproducible, good enough for tests. */
double
hl_rng_uniform(hl_rng *r, double lo, double hi)
{
	uint64_t x = r->s;

	x ^= x >> 12;
	x ^= x << 25;
	x ^= x >> 27;
	r->s = x;
	x *= 0x2545f4914f6cdd1dull;
	return lo + (hi - lo) * (double)(x >> 11) / 9007199254740992.0;
}

void
hl_gen_add(hl_case *c, const char *name, double ts, double tt, double cp)
{
	hl_segment g = { ts, tt, cp, NAN, 0, 0 };
	hl_stream s;

	memset(&s, 0, sizeof s);
	s.name = (char *)name;
	s.kind = ts > tt ? HL_HOT : HL_COLD;
	s.nseg = 1;
	s.seg = &g;
	s.dt_contrib = NAN;
	s.cp_tol = NAN;
	s.t_tol = NAN;
	hl_case_add_stream(c, &s, NULL);
}

hl_case *
hl_gen_case(hl_rng *r, int nhot, int ncold)
{
	hl_case *c = hl_case_create();
	char name[32];
	int i;

	for (i = 0; i < nhot + ncold; i++) {
		double a = floor(hl_rng_uniform(r, 20, 300));
		double b = floor(hl_rng_uniform(r, 20, 300));
		double cp = floor(hl_rng_uniform(r, 0.5, 10) * 10) / 10 + 0.5;

		if (a == b)
			b = a + 15;
		if ((i < nhot) != (a > b)) {
			double t = a;

			a = b;
			b = t;
		}
		snprintf(name, sizeof name, "%c%d", i < nhot ? 'H' : 'C', i);
		hl_gen_add(c, name, a, b, cp);
	}
	return c;
}
