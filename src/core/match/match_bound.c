/* match_bound.c - a lower bound on the units from balanced subsets.
 *
 * Method: the Euler rule for networks (Hohmann 1971; Linnhoff et al. 1982):
 * a network whose graph has S components over N streams and utilities has
 * at least N - S units, since each component is connected. Each component
 * exchanges heat only within itself, so its hot and cold heats balance and
 * its own cascade never runs negative. So the units are at least the least
 * sum of w(part) over the partitions of the parties into such sets, with
 * w(part) = |part| - 1, or more when a part is known to need more units on
 * its own (match_milp.c solves the parts). The balanced subsets are
 * enumerated by Gray code (one addition per subset) up to 24 parties, and
 * partitions by depth-first search; beyond those limits the bound falls
 * back to N - floor(N / 2) (each part needs a hot and a cold party), which
 * is always valid.
 */
#include <math.h>
#include <stdint.h>
#include <stdlib.h>
#include <string.h>

#include "match_int.h"

#define MAX_ENUM 24
#define MAX_SETS 4096
#define MAX_STEPS 200000L

/* The subset's own cascade never runs negative (heat only flows down). */
static int
feasible(const hl_match_balanced *b, const double *prof, uint32_t mask)
{
	double r = 0.0;
	size_t i, j;

	for (j = 0; j < b->nk; j++) {
		for (i = 0; i < b->n; i++)
			if (mask & (1u << i))
				r += prof[i * b->nk + j];
		if (r < -b->tol)
			return 0;
	}
	return 1;
}

void
hl_match_balanced_find(size_t n, const double *v, const double *prof,
		       size_t nk, double tol, hl_match_balanced *b)
{
	uint32_t full, g, prev = 0, m;
	double sum = 0.0;

	memset(b, 0, sizeof b[0]);
	b->n = n;
	b->nk = nk;
	b->tol = tol;
	if (n > MAX_ENUM)
		return;
	b->set = malloc(MAX_SETS * sizeof *b->set);
	if (b->set == NULL)
		return;
	full = (uint32_t)((1u << n) - 1u);
	for (m = 1; m <= full; m++) {
		uint32_t bit;
		int i = 0;

		g = m ^ (m >> 1);
		bit = g ^ prev;
		while (!(bit & (1u << i)))
			i++;
		sum += (g & bit) ? v[i] : -v[i];
		prev = g;
		if (g == full || fabs(sum) > tol || !feasible(b, prof, g))
			continue;
		if (b->nset == MAX_SETS) {
			free(b->set);
			b->set = NULL;
			b->nset = 0;
			return;
		}
		b->set[b->nset++] = g;
	}
	b->complete = 1;
}

void
hl_match_balanced_clear(hl_match_balanced *b)
{
	free(b->set);
	memset(b, 0, sizeof *b);
}

typedef struct {
	const hl_match_balanced *b;
	const double *w;
	double whole;
	uint32_t full;
	long steps;
	int overflow;
} packer;

static double
weight_of(const packer *k, uint32_t s)
{
	size_t i;

	if (s == k->full)
		return k->whole;
	for (i = 0; i < k->b->nset; i++)
		if (k->b->set[i] == s)
			return k->w[i];
	return HUGE_VAL; /* not a feasible balanced set */
}

/* Least sum of weights over the partitions of rem into sets. */
static double
pack(packer *k, uint32_t rem)
{
	uint32_t low = rem & (~rem + 1u);
	double best = weight_of(k, rem);
	size_t i;

	if (++k->steps > MAX_STEPS) {
		k->overflow = 1;
		return best;
	}
	for (i = 0; i < k->b->nset && !k->overflow; i++) {
		uint32_t s = k->b->set[i];
		double rest;

		if (!(s & low) || (s & ~rem) || s == rem || isinf(k->w[i]))
			continue;
		rest = pack(k, rem & ~s);
		if (k->w[i] + rest < best)
			best = k->w[i] + rest;
	}
	return best;
}

double
hl_match_partition_bound(const hl_match_balanced *b, const double *w,
			 double whole)
{
	packer k;
	double best;
	double fallback = (double)(b->n - b->n / 2);

	if (b->n < 4)
		return whole;
	if (!b->complete)
		return fmin(whole, fallback);
	memset(&k, 0, sizeof k);
	k.b = b;
	k.w = w;
	k.whole = whole;
	k.full = (uint32_t)((1u << b->n) - 1u);
	best = pack(&k, k.full);
	return k.overflow ? fmin(whole, fallback) : best;
}

double
hl_match_set_size(uint32_t s)
{
	double n = 0.0;

	for (; s != 0; s &= s - 1)
		n += 1.0;
	return n;
}

/* Rebuild the least partition found by pack(): a set s whose weight plus
 * the best of the rest gives the best. */
double
hl_match_partition_best(const hl_match_balanced *b, const double *w,
			uint32_t *parts, size_t *nparts)
{
	packer k;
	uint32_t rem;
	double best, left;
	size_t i;

	*nparts = 0;
	if (!b->complete || b->nset == 0)
		return HUGE_VAL;
	memset(&k, 0, sizeof k);
	k.b = b;
	k.w = w;
	k.whole = HUGE_VAL;
	k.full = (uint32_t)((1u << b->n) - 1u);
	best = left = pack(&k, k.full);
	if (k.overflow || isinf(best))
		return HUGE_VAL;
	for (rem = k.full; rem != 0 && *nparts < 32;) {
		uint32_t low = rem & (~rem + 1u), pick = 0;

		for (i = 0; i < b->nset && pick == 0; i++) {
			uint32_t s = b->set[i];
			double rest;

			if (!(s & low) || (s & ~rem) || isinf(w[i]))
				continue;
			rest = s == rem ? 0.0 : pack(&k, rem & ~s);
			if (fabs(w[i] + rest - left) <= 1e-9 * (1.0 + left))
				pick = s;
		}
		if (pick == 0)
			return HUGE_VAL;
		parts[(*nparts)++] = pick;
		left -= weight_of(&k, pick);
		rem &= ~pick;
	}
	return rem == 0 ? best : HUGE_VAL;
}
