/* match_bound.c - a lower bound on the units from balanced subsets.
 *
 * Method: the Euler rule for networks (Hohmann 1971; Linnhoff et al. 1982):
 * a network of N streams and utilities in S separate components has at
 * least N - S units, since each component is connected. Each component
 * exchanges heat only within itself, so its hot and cold heats balance and
 * its own cascade never runs negative. The most components a subnetwork can
 * split into is found by enumerating the balanced subsets (Gray code, one
 * addition per subset) and packing them by depth-first search. Up to 24
 * parties; beyond, or when the search grows too large, floor(N / 2) (each
 * component needs a hot and a cold party) keeps the bound valid.
 */
#include <math.h>
#include <stdint.h>
#include <stdlib.h>

#include "match_int.h"

#define MAX_ENUM 24
#define MAX_SETS 4096
#define MAX_STEPS 200000L

typedef struct {
	size_t n, nk;
	const double *prof;
	double tol;
	uint32_t *set;
	size_t nset;
	long steps;
	int overflow;
} packer;

/* The subset's own cascade never runs negative (heat only flows down). */
static int
feasible(const packer *k, uint32_t mask)
{
	double r = 0.0;
	size_t i, j;

	for (j = 0; j < k->nk; j++) {
		for (i = 0; i < k->n; i++)
			if (mask & (1u << i))
				r += k->prof[i * k->nk + j];
		if (r < -k->tol)
			return 0;
	}
	return 1;
}

static void
collect(packer *k, const double *v)
{
	uint32_t full = (k->n == 32) ? 0xffffffffu : ((1u << k->n) - 1u);
	uint32_t g = 0, prev = 0, m;
	double sum = 0.0;

	for (m = 1; m <= full && !k->overflow; m++) {
		uint32_t bit;
		int i = 0;

		g = m ^ (m >> 1);
		bit = g ^ prev;
		while (!(bit & (1u << i)))
			i++;
		sum += (g & bit) ? v[i] : -v[i];
		prev = g;
		if (g == full || fabs(sum) > k->tol || !feasible(k, g))
			continue;
		if (k->nset == MAX_SETS) {
			k->overflow = 1;
			break;
		}
		k->set[k->nset++] = g;
		if (m == full)
			break;
	}
}

/* Most feasible balanced parts that rem (itself balanced) splits into;
 * 0 when it cannot be split into feasible parts at all. */
static size_t
pack(packer *k, uint32_t rem)
{
	uint32_t low = rem & (~rem + 1u);
	size_t i, best = feasible(k, rem) ? 1 : 0;

	if (++k->steps > MAX_STEPS) {
		k->overflow = 1;
		return best;
	}
	for (i = 0; i < k->nset && !k->overflow; i++) {
		uint32_t s = k->set[i];
		size_t rest;

		if (!(s & low) || (s & ~rem) || s == rem)
			continue;
		rest = pack(k, rem & ~s);
		if (rest > 0 && rest + 1 > best)
			best = rest + 1;
	}
	return best;
}

size_t
hl_match_max_parts(size_t n, const double *v, const double *prof, size_t nk,
		   double tol)
{
	packer k = { n, nk, prof, tol, NULL, 0, 0, 0 };
	size_t best;

	if (n < 4)
		return 1;
	if (n > MAX_ENUM)
		return n / 2;
	k.set = malloc(MAX_SETS * sizeof *k.set);
	if (k.set == NULL)
		return n / 2;
	collect(&k, v);
	best = k.overflow ? n / 2 : pack(&k, (uint32_t)((1u << n) - 1u));
	if (k.overflow || best == 0)
		best = n / 2;
	free(k.set);
	return best < 1 ? 1 : best;
}
