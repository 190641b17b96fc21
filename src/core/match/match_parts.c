/* match_parts.c - balanced parts of a subnetwork, each solved alone: a
 * sharper Euler bound (match_bound.c) and a network to start from. */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "match_int.h"

#define MAX_REFINE 64   /* balanced subsets worth a solve each */

/* The parties in mask on their own (a small MILP): a proven lower bound on
 * their units (HUGE_VAL when they cannot be matched alone), and the best
 * network found, its units in *obj and its pairs in used[] (HUGE_VAL when
 * none). */
static double
part_solve(const hl_match_runner *R, size_t sub, const unsigned char *mask,
	   double deadline, double *obj, unsigned char *used)
{
	hl_match_model_t m;
	hl_match_outcome out;
	hl_error err;
	double lb = 0.0;
	size_t pi;

	*obj = HUGE_VAL;
	memset(&m, 0, sizeof m);
	memset(&out, 0, sizeof out);
	m.P = glp_create_prob();
	m.sd = calloc(1, sizeof *m.sd);
	if (m.sd != NULL && hl_match_sd_init(R->p, sub, mask, 0, &m.sd[0]) ==
	    HL_OK) {
		m.ns = 1;
		if (hl_match_alloc_cols(R->p, &m.sd[0]) == 0 &&
		    hl_match_build(R->p, 0, &m, &err) == HL_OK &&
		    (out.x = calloc((size_t)glp_get_num_cols(m.P) + 1,
				    sizeof *out.x)) != NULL) {
			hl_status st = hl_match_search(R, &m, "part",
						       deadline, 1, &out, &err);

			lb = st == HL_OK ? out.bound : st == HL_ENOSOLUTION &&
				strstr(err.text, "no network meets") != NULL ?
				HUGE_VAL : 0.0;
			if (st == HL_OK && !isinf(out.obj)) {
				*obj = out.obj;
				size_t np = R->p->nhot * R->p->ncold;

				for (pi = 0; pi < np; pi++)
					used[pi] = m.sd[0].ycol[pi] != 0 &&
						out.x[m.sd[0].ycol[pi]] > 0.5;
			}
		}
	}
	free(out.x);
	hl_match_model_clear(&m);
	glp_delete_prob(m.P);
	return lb;
}

typedef struct {
	double *lo, *hi;        /* per set: lower bound, units found */
	unsigned char *used;    /* per set: its pairs (npair each) */
	unsigned char *mask;
} parts;

static void
parts_free(parts *q)
{
	free(q->lo);
	free(q->hi);
	free(q->used);
	free(q->mask);
}

/* The pairs of the best partition of found networks, as the heuristic's
 * first candidate: a feasible network for the whole subnetwork. */
static void
seed_from_parts(const hl_match_problem *p, hl_match_sd *sd, const parts *q)
{
	uint32_t chosen[32];
	size_t n = 0, i, pi, npair = p->nhot * p->ncold;

	if (isinf(hl_match_partition_best(&sd->bal, q->hi, chosen, &n)))
		return;
	sd->seed = calloc(npair + 1, 1);
	for (i = 0; sd->seed != NULL && i < sd->bal.nset; i++) {
		size_t k;

		for (k = 0; k < n && sd->bal.set[i] != chosen[k]; k++)
			;
		if (k == n)
			continue;
		for (pi = 0; pi < npair; pi++)
			sd->seed[pi] |= q->used[i * npair + pi];
	}
}

/* Each balanced subset, solved alone, may need more than |set| - 1 units;
 * then every partition using it needs more too (match_bound.c). The parts'
 * own networks, put together along the best partition, seed the search.
 * Skipped with area penalties, whose objective is no unit count. */
static void
refine_bound(const hl_match_runner *R, hl_match_sd *sd, double deadline)
{
	const hl_match_problem *p = R->p;
	const hl_match_balanced *b = &sd->bal;
	size_t i, j, npair = p->nhot * p->ncold;
	double t0 = hl_match_now(), whole;
	parts q;

	if (p->penalised || R->o->textbook || !b->complete || b->nset == 0 ||
	    b->nset > MAX_REFINE)
		return;
	q.lo = malloc(b->nset * sizeof *q.lo);
	q.hi = malloc(b->nset * sizeof *q.hi);
	q.used = calloc(b->nset * npair + 1, 1);
	q.mask = malloc(p->np + 1);
	if (q.lo == NULL || q.hi == NULL || q.used == NULL || q.mask == NULL) {
		parts_free(&q);
		return;
	}
	for (i = 0; i < b->nset; i++) {
		double size = hl_match_set_size(b->set[i]), left;

		q.lo[i] = size - 1.0;
		q.hi[i] = HUGE_VAL;
		left = (deadline - hl_match_now()) / (double)(b->nset - i);
		if (left <= 0.0)
			continue;
		memset(q.mask, 0, p->np);
		for (j = 0; j < b->n; j++)
			if (b->set[i] & (1u << j))
				q.mask[sd->bit[j]] = 1;
		q.lo[i] = fmax(q.lo[i], part_solve(R, sd->sub, q.mask,
			hl_match_now() + left, &q.hi[i], q.used + i * npair));
		hl_match_tick(R, p->sub[sd->sub].label, t0, HUGE_VAL,
		     (double)sd->subset_bound);
	}
	whole = (double)sd->nactive - 1.0;
	sd->subset_bound = (size_t)fmax((double)sd->subset_bound,
		ceil(hl_match_partition_bound(b, q.lo, whole) - 1e-9));
	seed_from_parts(p, sd, &q);
	parts_free(&q);
}

/* Model data of a group, with the bounds refined. */
hl_status
hl_match_prepare_group(const hl_match_runner *R, const size_t *subs, size_t ns,
	      hl_match_model_t *m, double deadline, hl_error *err)
{
	size_t si;
	hl_status st = hl_match_model_init(R->p, subs, ns, m, err);

	for (si = 0; si < m->ns && st == HL_OK; si++)
		refine_bound(R, &m->sd[si], deadline);
	return st;
}

