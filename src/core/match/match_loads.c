/* match_loads.c - heat loads of the chosen matches.
 *
 * The fewest units rarely fix the loads. With the matches fixed, a second LP
 * in transportation form (Cerda & Westerberg 1983) sends each hot party's
 * heat from the interval where it is released (k') to the interval where a
 * matched cold party takes it (k >= k'), and minimises the area estimate
 *     sum  x[a][k'][b][k] * (1/h_a + 1/h_b) / dT(k', k)
 * where dT is the difference between the real temperatures of a and b at
 * the middles of the two intervals (at least 0.1 K): the heat-transfer
 * area the loads would need if each parcel crossed that difference
 * (Q = U A dT with 1/U = 1/h_a + 1/h_b). Heat sent far down the cascade
 * finds a larger dT and costs less area, so the LP prefers loads that leave
 * the exchangers room; doc/methods.md.
 */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "match_int.h"

#define DT_FLOOR 0.1 /* K, keeps dT = 0 at ΔTmin 0 from dividing by zero */

typedef struct {
	size_t si, pi, kh, kc;  /* subnetwork in group, pair, intervals */
	int col;
} parcel;

typedef struct {
	const hl_match_problem *p;
	const hl_match_model_t *m;
	const double *x;
	glp_prob *P;
	parcel *pc;
	size_t npc, cap;
	hl_match_mat mat;
} loads;

static double
heat(const hl_match_problem *p, size_t i, size_t k)
{
	double h = HL_MATCH_HEAT(p, i, k);

	return h > p->tol ? h : 0.0;
}

/* Real temperature of party i in the middle of interval k. */
static double
real_temp(const hl_match_problem *p, size_t i, size_t k)
{
	const hl_match_party *q = &p->party[i];
	double mid = 0.5 * (p->t[k] + p->t[k + 1]);

	if (q->top == q->bottom)
		return q->supply;
	mid = fmin(fmax(mid, q->bottom), q->top);
	return q->kind == HL_HOT ? mid + q->shift : mid - q->shift;
}

static double
weight(const hl_match_problem *p, size_t a, size_t b, size_t kh, size_t kc)
{
	size_t i = p->hot[a], j = p->cold[b];
	double dt = fmax(real_temp(p, i, kh) - real_temp(p, j, kc), DT_FLOOR);

	return (1.0 / p->film[i * p->nint + kh] +
		1.0 / p->film[j * p->nint + kc]) / dt;
}

static int
used(const loads *L, size_t si, size_t pi)
{
	int j = L->m->sd[si].ycol[pi];

	return j != 0 && L->x[j] > 0.5;
}

static int
add_parcel(loads *L, size_t si, size_t pi, size_t kh, size_t kc, double ub)
{
	const hl_match_problem *p = L->p;
	parcel *c;

	if (L->npc == L->cap) {
		size_t cap = L->cap ? 2 * L->cap : 256;
		parcel *n = realloc(L->pc, cap * sizeof *n);

		if (n == NULL)
			return -1;
		L->pc = n;
		L->cap = cap;
	}
	c = &L->pc[L->npc++];
	c->si = si;
	c->pi = pi;
	c->kh = kh;
	c->kc = kc;
	c->col = hl_match_add_col(L->P, GLP_CV, 0.0, ub,
		weight(p, pi / p->ncold, pi % p->ncold, kh, kc));
	return 0;
}

static int
add_parcels(loads *L)
{
	const hl_match_problem *p = L->p;
	size_t si, pi, kh, kc;

	for (si = 0; si < L->m->ns; si++) {
		const hl_match_sd *sd = &L->m->sd[si];
		size_t end = sd->first + sd->nk;

		for (pi = 0; pi < p->nhot * p->ncold; pi++) {
			size_t a = pi / p->ncold, b = pi % p->ncold;

			if (!used(L, si, pi))
				continue;
			for (kh = sd->first; kh < end; kh++) {
				double ha = heat(p, p->hot[a], kh);

				if (ha <= 0.0)
					continue;
				for (kc = kh; kc < end; kc++) {
					double hb = heat(p, p->cold[b], kc);

					if (hb > 0.0 && add_parcel(L, si, pi, kh,
					    kc, fmin(fmin(ha, hb),
					    p->pair[pi].maxduty)) != 0)
						return -1;
				}
			}
		}
	}
	return 0;
}

/* Row per (subnetwork, party, interval): hot gives at most its heat,
 * cold takes exactly its demand. */
static int
add_balances(loads *L)
{
	const hl_match_problem *p = L->p;
	size_t ns = L->m->ns, n = ns * p->np * p->nint, e;
	int *row = calloc(n + 1, sizeof *row);

	if (row == NULL)
		return -1;
	for (e = 0; e < L->npc; e++) {
		const parcel *c = &L->pc[e];
		size_t a = p->hot[c->pi / p->ncold], b = p->cold[c->pi % p->ncold];
		size_t rh = (c->si * p->np + a) * p->nint + c->kh;
		size_t rc = (c->si * p->np + b) * p->nint + c->kc;

		if (row[rh] == 0) {
			double h = heat(p, a, c->kh);

			row[rh] = hl_match_add_row(L->P, GLP_UP, 0.0, h);
		}
		if (row[rc] == 0) {
			double h = heat(p, b, c->kc);

			row[rc] = hl_match_add_row(L->P, GLP_FX, h, h);
		}
		hl_match_mat_add(&L->mat, row[rh], c->col, 1.0);
		hl_match_mat_add(&L->mat, row[rc], c->col, 1.0);
	}
	free(row);
	return 0;
}

/* Required pairs keep their least duty; max-duty holds over all units. */
static void
add_rules(loads *L)
{
	const hl_match_problem *p = L->p;
	size_t pi, si, e;

	for (pi = 0; pi < p->nhot * p->ncold; pi++) {
		const hl_match_pair *q = &p->pair[pi];
		int r;

		for (si = 0; si < L->m->ns && q->required; si++) {
			if (!used(L, si, pi))
				continue;
			r = hl_match_add_row(L->P, GLP_LO,
					     1e-3 * L->m->sd[si].U[pi], 0.0);
			for (e = 0; e < L->npc; e++)
				if (L->pc[e].pi == pi && L->pc[e].si == si)
					hl_match_mat_add(&L->mat, r, L->pc[e].col,
							 1.0);
		}
		if (isinf(q->maxduty))
			continue;
		r = hl_match_add_row(L->P, GLP_UP, 0.0, q->maxduty);
		for (e = 0; e < L->npc; e++)
			if (L->pc[e].pi == pi)
				hl_match_mat_add(&L->mat, r, L->pc[e].col, 1.0);
	}
}

static hl_match *
find_match(hl_match_result *r, size_t first, size_t sub, size_t hot,
	   size_t cold)
{
	size_t i;

	for (i = first; i < r->nmatch; i++)
		if (r->match[i].sub == sub && r->match[i].hot == hot &&
		    r->match[i].cold == cold)
			return &r->match[i];
	return NULL;
}

static hl_status
append_match(hl_match_result *r, size_t sub, size_t hot, size_t cold,
	     hl_match **out)
{
	hl_match *n = realloc(r->match, (r->nmatch + 1) * sizeof *n);

	if (n == NULL)
		return HL_EIO;
	r->match = n;
	n = &r->match[r->nmatch];
	memset(n, 0, sizeof *n);
	n->sub = sub;
	n->hot = hot;
	n->cold = cold;
	n->give = calloc(r->nint, sizeof *n->give);
	n->take = calloc(r->nint, sizeof *n->take);
	if (n->give == NULL || n->take == NULL) {
		free(n->give);
		free(n->take);
		return HL_EIO;
	}
	r->nmatch++;
	*out = n;
	return HL_OK;
}

/* Where each match works, from the intervals it gives and takes heat in. */
static void
temperatures(const hl_match_problem *p, hl_match *mt)
{
	const hl_match_party *h = &p->party[mt->hot], *c = &p->party[mt->cold];
	size_t k, gt = p->nint, gb = 0, tt = p->nint, tb = 0;

	for (k = 0; k < p->nint; k++) {
		if (mt->give[k] > p->tol) {
			if (gt == p->nint)
				gt = k;
			gb = k;
		}
		if (mt->take[k] > p->tol) {
			if (tt == p->nint)
				tt = k;
			tb = k;
		}
	}
	if (gt == p->nint || tt == p->nint)
		return;
	mt->hot_from = h->top == h->bottom ? h->supply :
		fmin(p->t[gt], h->top) + h->shift;
	mt->hot_to = h->top == h->bottom ? h->target :
		fmax(p->t[gb + 1], h->bottom) + h->shift;
	mt->cold_from = c->top == c->bottom ? c->supply :
		fmax(p->t[tb + 1], c->bottom) - c->shift;
	mt->cold_to = c->top == c->bottom ? c->target :
		fmin(p->t[tt], c->top) - c->shift;
}

static hl_status
collect(loads *L, hl_match_result *r)
{
	const hl_match_problem *p = L->p;
	size_t e, first = r->nmatch, i;

	for (e = 0; e < L->npc; e++) {
		const parcel *c = &L->pc[e];
		double v = glp_get_col_prim(L->P, c->col);
		size_t sub = L->m->sd[c->si].sub;
		size_t hot = p->hot[c->pi / p->ncold];
		size_t cold = p->cold[c->pi % p->ncold];
		hl_match *mt;

		if (v <= 0.0)
			continue;
		mt = find_match(r, first, sub, hot, cold);
		if (mt == NULL && append_match(r, sub, hot, cold, &mt) != HL_OK)
			return HL_EIO;
		mt->give[c->kh] += v;
		mt->take[c->kc] += v;
		mt->duty += v;
	}
	for (i = first; i < r->nmatch; i++) {
		hl_match *mt = &r->match[i];
		size_t pi = HL_MATCH_PAIR(p, p->sidx[mt->hot], p->sidx[mt->cold]);

		mt->required = p->pair[pi].required;
		mt->cross_area = p->pair[pi].cross;
		temperatures(p, mt);
	}
	return HL_OK;
}

/* Drop matches whose duty rounds to nothing (a load LP may empty a unit
 * that a best-found MILP solution kept). */
static void
drop_empty(const hl_match_problem *p, hl_match_result *r, size_t first)
{
	size_t i, n = first;

	for (i = first; i < r->nmatch; i++) {
		if (r->match[i].duty > 1e-7 * p->scale) {
			r->match[n++] = r->match[i];
		} else {
			free(r->match[i].give);
			free(r->match[i].take);
		}
	}
	r->nmatch = n;
}

hl_status
hl_match_loads(const hl_match_problem *p, const hl_match_model_t *m,
	       const double *x, int msg_lev, hl_match_result *r,
	       hl_error *err)
{
	loads L;
	size_t first = r->nmatch;
	hl_status st = HL_OK;
	int rc;

	memset(&L, 0, sizeof L);
	L.p = p;
	L.m = m;
	L.x = x;
	L.P = glp_create_prob();
	glp_set_obj_dir(L.P, GLP_MIN);
	if (add_parcels(&L) != 0 || add_balances(&L) != 0)
		st = hl_error_nomem(err);
	if (st == HL_OK) {
		add_rules(&L);
		if (hl_match_mat_load(&L.mat, L.P) != 0)
			st = hl_error_nomem(err);
	}
	if (st == HL_OK) {
		rc = hl_match_simplex(L.P, msg_lev, 0.0);
		if (rc != 0)
			st = hl_error_set(err, HL_ENOSOLUTION, NULL, 0,
				"the loads LP of the chosen matches %s; run "
				"with --verbose to see GLPK's messages",
				rc == 1 ? "found them infeasible (numerical "
				"trouble)" : "failed");
	}
	if (st == HL_OK && collect(&L, r) != HL_OK)
		st = hl_error_nomem(err);
	if (st == HL_OK)
		drop_empty(p, r, first);
	hl_match_mat_free(&L.mat);
	free(L.pc);
	glp_delete_prob(L.P);
	return st;
}
