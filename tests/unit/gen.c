/* gen.c - random stream problems for property tests. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
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
	hl_segment g = { ts, tt, cp, NAN, 0, 0, 0.0, 0 };
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

void
hl_gen_add_utility(hl_case *c, const char *name, hl_kind kind, double supply,
		   double target, double price, double max_load)
{
	hl_utility u;

	memset(&u, 0, sizeof u);
	u.name = (char *)name;
	u.kind = kind;
	u.supply = supply;
	u.target = target;
	u.price = price;
	u.h = NAN;
	u.max_load = max_load;
	u.dt_contrib = NAN;
	if (hl_case_add_utility(c, &u, NULL) != HL_OK)
		abort();
}

/* Linnhoff et al., User Guide on Process Integration for the Efficient Use of
 * Energy (IChemE 1982); also Kemp, Pinch Analysis and Process Integration,
 * 2nd ed. (2007), ch. 2. From memory, confirmed by a hand cascade:
 * ΔTmin 10 K: 20 / 60 kW, pinch 85 °C shifted; cascade 165: 20, 145: 80,
 * 140: 82.5, 85: 0, 55: 75, 25: 60. */
hl_case *
hl_gen_kemp4(void)
{
	hl_case *c = hl_case_create();

	hl_gen_add(c, "C1", 20, 135, 2.0);
	hl_gen_add(c, "H1", 170, 60, 3.0);
	hl_gen_add(c, "C2", 80, 140, 4.0);
	hl_gen_add(c, "H2", 150, 30, 1.5);
	return c;
}

/* Smith, Chemical Process Design and Integration (Wiley 2005), ch. 16, CP in
 * kW/K here (MW/K there × 1000). From memory, confirmed by a hand cascade:
 * ΔTmin 10 K: 7500 / 10000 kW, pinch 145 °C shifted; cascade 245: 7.5,
 * 235: 9.0, 195: 3.0, 185: 4.0, 145: 0, 75: 14, 35: 12, 25: 10 MW. */
hl_case *
hl_gen_smith4(void)
{
	hl_case *c = hl_case_create();

	hl_gen_add(c, "C1", 20, 180, 200);
	hl_gen_add(c, "H1", 250, 40, 150);
	hl_gen_add(c, "C2", 140, 230, 300);
	hl_gen_add(c, "H2", 200, 80, 250);
	return c;
}
