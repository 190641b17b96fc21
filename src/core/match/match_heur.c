/* match_heur.c - a first incumbent for the match MILP.
 *
 * Method: the support of any feasible flow of the transshipment model is a
 * feasible set of matches, so the heuristic searches for small supports:
 *  1. reweighted LP relaxations (iteratively reweighted l1: Candès, Wakin &
 *     Boyd 2008) concentrate the heat on few pairs;
 *  2. tick-off dives, after the tick-off rule of pinch design (Linnhoff &
 *     Hindmarsh 1983: each match satisfies one stream): a party becomes a
 *     leaf by keeping one match to the parties still in play, the one that
 *     the min-cost transshipment (cost = 1 / capacity) already sends most of
 *     its heat over. A dive that makes every party a leaf leaves N - 1
 *     matches per subnetwork, the Euler bound. Dives restart with perturbed
 *     preferences until one reaches the proven lower bound.
 * Every set is then pruned, smallest duty first, to a minimal one. A
 * max-flow test (match_flow.c) rejects infeasible sets before any LP.
 */
#include <math.h>
#include <stdint.h>
#include <stdlib.h>
#include <string.h>

#include "match_int.h"

#define ROUNDS 6         /* reweighted relaxations */
#define MAX_DIVES 200
#define DIVE_EFFORT 3000 /* per dive: a flow test costs 1, an LP 10 */

typedef struct {
	int col;        /* y column */
	size_t si, pi;  /* subnetwork (in the group) and pair */
	double cost;
	double duty;    /* heat in the last LP read */
	int in;         /* in the current set (pruning) */
	int open;       /* not closed (diving) */
} ycand;

typedef struct {
	const hl_match_problem *p;
	hl_match_model_t *m;
	glp_prob *Q;            /* the relaxation: y continuous */
	glp_prob *G;            /* min-cost transshipment, guides the dives */
	ycand *y;
	size_t ny;
	hl_match_flow **flow;   /* per subnetwork of the group */
	unsigned char *open;    /* pairs, for the flow test */
	int flow_exact;         /* the flow test decides feasibility alone */
	long effort;
	double deadline;
} heur;

/* ---- setup ---- */

static int
list_y(heur *h)
{
	size_t si, pi, n = 0;

	for (si = 0; si < h->m->ns; si++)
		n += h->m->sd[si].npairs;
	h->y = calloc(n + 1, sizeof *h->y);
	if (h->y == NULL)
		return -1;
	for (si = 0; si < h->m->ns; si++)
		for (pi = 0; pi < h->p->nhot * h->p->ncold; pi++) {
			int j = h->m->sd[si].ycol[pi];

			if (j == 0)
				continue;
			h->y[h->ny].col = j;
			h->y[h->ny].si = si;
			h->y[h->ny].pi = pi;
			h->y[h->ny].cost = glp_get_obj_coef(h->m->P, j);
			h->ny++;
		}
	return 0;
}

static int
has_prefix(const char *name, const char *const *pre)
{
	for (; name != NULL && *pre != NULL; pre++)
		if (strncmp(name, *pre, strlen(*pre)) == 0)
			return 1;
	return 0;
}

/* Delete the rows whose names start with one of pre. */
static void
drop_rows(glp_prob *P, const char *const *pre)
{
	int i, n = glp_get_num_rows(P), nd = 0;
	int *del = malloc((size_t)(n + 1) * sizeof *del);

	if (del == NULL)
		return;
	for (i = 1; i <= n; i++)
		if (has_prefix(glp_get_row_name(P, i), pre))
			del[++nd] = i;
	if (nd > 0)
		glp_del_rows(P, nd, del);
	free(del);
}

/* The relaxation without the rows that only count units (they hold for
 * any integer solution, and at the bound they leave the LP's flows
 * arbitrary) or order identical parties (solutions are relabelled). */
static void
make_relaxation(heur *h)
{
	static const char *const pre[] = { "sym_", "units_", "n_", "w_", NULL };
	size_t k;

	h->Q = glp_create_prob();
	glp_copy_prob(h->Q, h->m->P, GLP_ON);
	for (k = 0; k < h->ny; k++)
		glp_set_col_kind(h->Q, h->y[k].col, GLP_CV);
	drop_rows(h->Q, pre);
}

/* The heat balances and max-duty rows only; a unit of heat over pair ab
 * costs cost / U, the relaxation's price of a unit's capacity. */
static void
make_guide(heur *h)
{
	static const char *const pre[] = { "sym_", "units_", "n_", "w_", "d_",
					   "u_", "min_", "req_", NULL };
	size_t i, kk;

	h->G = glp_create_prob();
	glp_copy_prob(h->G, h->m->P, GLP_ON);
	drop_rows(h->G, pre);
	for (i = 0; i < h->ny; i++) {
		const hl_match_sd *sd = &h->m->sd[h->y[i].si];
		double w = h->y[i].cost / sd->U[h->y[i].pi];

		glp_set_col_kind(h->G, h->y[i].col, GLP_CV);
		glp_set_obj_coef(h->G, h->y[i].col, 0.0);
		for (kk = 0; kk < sd->nk; kk++) {
			int j = sd->qcol[h->y[i].pi * sd->nk + kk];

			if (j)
				glp_set_obj_coef(h->G, j, w);
		}
	}
}

/* A required pair that can only work in one subnetwork: fixed at 1. */
static int
forced(const heur *h, size_t i)
{
	return glp_get_col_type(h->m->P, h->y[i].col) == GLP_FX ||
		h->p->pair[h->y[i].pi].required;
}

/* Heat of each candidate in L's current solution. */
static void
read_duties(heur *h, glp_prob *L)
{
	size_t i, kk;

	for (i = 0; i < h->ny; i++) {
		const hl_match_sd *sd = &h->m->sd[h->y[i].si];
		double d = 0.0;

		for (kk = 0; kk < sd->nk; kk++) {
			int j = sd->qcol[h->y[i].pi * sd->nk + kk];

			if (j)
				d += fmax(0.0, glp_get_col_prim(L, j));
		}
		h->y[i].duty = d;
	}
}

static double
support(heur *h, unsigned char *set)
{
	double eps = 1e-9 * h->p->scale, cost = 0.0;
	size_t i;

	for (i = 0; i < h->ny; i++) {
		set[i] = h->y[i].duty > eps || forced(h, i);
		cost += set[i] ? h->y[i].cost : 0.0;
	}
	return cost;
}

static int
lp(heur *h, glp_prob *L)
{
	h->effort -= 10;
	/* Past the deadline an LP may still finish, but never run on. */
	return hl_match_simplex(L, GLP_MSG_OFF, fmax(h->deadline -
						     hl_match_now(), 1.0));
}

/* The cheap test: can the candidates with on[] set meet every demand of
 * subnetwork si? 1 yes, 0 no. */
static int
flow_ok(heur *h, size_t si, int use_in)
{
	size_t i;

	h->effort -= 1;
	if (h->flow == NULL || h->flow[si] == NULL)
		return 1;
	memset(h->open, 0, h->p->nhot * h->p->ncold);
	for (i = 0; i < h->ny; i++)
		if (h->y[i].si == si && (use_in ? h->y[i].in : h->y[i].open))
			h->open[h->y[i].pi] = 1;
	return hl_match_flow_feasible(h->flow[si], h->open);
}

/* ---- 1. reweighted relaxations ---- */

static int
reweight(heur *h, unsigned char *best)
{
	unsigned char *set = malloc(h->ny + 1);
	double best_cost = HUGE_VAL;
	size_t i;
	int round;

	if (set == NULL)
		return -1;
	for (round = 0; round < ROUNDS; round++) {
		double c;

		if (round > 0 && hl_match_now() > h->deadline)
			break;
		if (lp(h, h->Q) != 0)
			break;
		read_duties(h, h->Q);
		c = support(h, set);
		if (c < best_cost) {
			best_cost = c;
			memcpy(best, set, h->ny);
		}
		for (i = 0; i < h->ny; i++) {
			double U = h->m->sd[h->y[i].si].U[h->y[i].pi];

			glp_set_obj_coef(h->Q, h->y[i].col, h->y[i].cost /
					 (h->y[i].duty / U + 0.02));
		}
	}
	free(set);
	return isinf(best_cost) ? -1 : 0;
}

/* ---- pruning to a minimal set ---- */

static void
fix_y(heur *h, size_t i, int on)
{
	h->y[i].in = on || forced(h, i);
	glp_set_col_bnds(h->Q, h->y[i].col, GLP_FX, h->y[i].in ? 1.0 : 0.0,
			 h->y[i].in ? 1.0 : 0.0);
}

static int
by_duty(const void *a, const void *b)
{
	const ycand *x = *(const ycand *const *)a, *y = *(const ycand *const *)b;

	return (x->duty > y->duty) - (x->duty < y->duty);
}

/* Drop matches while the rest stays feasible, smallest duty (in the LP
 * that gave the set) first; the set's cost. */
static double
prune(heur *h, const unsigned char *set)
{
	ycand **order = malloc((h->ny + 1) * sizeof *order);
	size_t i, n = 0;
	double cost = 0.0;

	if (order == NULL)
		return HUGE_VAL;
	for (i = 0; i < h->ny; i++) {
		fix_y(h, i, set[i]);
		if (h->y[i].in)
			order[n++] = &h->y[i];
	}
	qsort(order, n, sizeof *order, by_duty);
	for (i = 0; i < n && hl_match_now() < h->deadline; i++) {
		size_t at = (size_t)(order[i] - h->y);

		if (forced(h, at))
			continue;
		fix_y(h, at, 0);
		if (!flow_ok(h, h->y[at].si, 1) ||
		    (!h->flow_exact && lp(h, h->Q) != 0))
			fix_y(h, at, 1);
	}
	free(order);
	for (i = 0; i < h->ny; i++)
		cost += h->y[i].in ? h->y[i].cost : 0.0;
	return cost;
}

static void
swap_cols(double *x, int a, int b)
{
	double t;

	if (a == 0 && b == 0)
		return;
	t = a ? x[a] : 0.0;
	if (a)
		x[a] = b ? x[b] : 0.0;
	if (b)
		x[b] = t;
}

/* Exchange the columns of identical parties a and b (side: 1 cold). */
static void
swap_parties(const hl_match_problem *p, const hl_match_sd *sd, int side,
	     size_t a, size_t b, double *x)
{
	size_t o, kk, no = side ? p->nhot : p->ncold;

	for (o = 0; o < no; o++) {
		size_t pa = side ? HL_MATCH_PAIR(p, o, a) : HL_MATCH_PAIR(p, a, o);
		size_t pb = side ? HL_MATCH_PAIR(p, o, b) : HL_MATCH_PAIR(p, b, o);

		swap_cols(x, sd->ycol[pa], sd->ycol[pb]);
		for (kk = 0; kk < sd->nk; kk++)
			swap_cols(x, sd->qcol[pa * sd->nk + kk],
				  sd->qcol[pb * sd->nk + kk]);
	}
	for (kk = 0; !side && kk < sd->nk; kk++)
		swap_cols(x, sd->rcol[a * sd->nk + kk], sd->rcol[b * sd->nk + kk]);
}

/* Relabel identical parties so that the symmetry rows hold. */
static void
order_identical(heur *h, double *x)
{
	const hl_match_problem *p = h->p;
	size_t pass, e;
	int changed = 1;

	for (pass = 0; pass <= h->m->nsym && changed; pass++) {
		changed = 0;
		for (e = 0; e < h->m->nsym; e++) {
			const int *s = h->m->sym + 5 * e;
			const hl_match_sd *sd = &h->m->sd[s[0]];
			int side = s[1];
			size_t a = (size_t)s[2], b = (size_t)s[3];
			size_t o = (size_t)s[4], ia, ib;

			ia = side ? HL_MATCH_PAIR(p, o, a) : HL_MATCH_PAIR(p, a, o);
			ib = side ? HL_MATCH_PAIR(p, o, b) : HL_MATCH_PAIR(p, b, o);

			if (x[sd->ycol[ia]] >= x[sd->ycol[ib]] - 0.5)
				continue;
			swap_parties(p, sd, side, a, b, x);
			changed = 1;
		}
	}
}

/* Column values of Q within P's bounds; y exactly 0 or 1. */
static double
extract(heur *h, double *x)
{
	int j, n = glp_get_num_cols(h->Q);
	size_t i;
	double obj = 0.0;

	x[0] = 0.0;
	for (j = 1; j <= n; j++) {
		double v = glp_get_col_prim(h->Q, j);
		int t = glp_get_col_type(h->m->P, j);

		if (t == GLP_LO || t == GLP_DB || t == GLP_FX)
			v = fmax(v, glp_get_col_lb(h->m->P, j));
		if (t == GLP_UP || t == GLP_DB || t == GLP_FX)
			v = fmin(v, glp_get_col_ub(h->m->P, j));
		x[j] = v;
	}
	for (i = 0; i < h->ny; i++)
		x[h->y[i].col] = h->y[i].in ? 1.0 : 0.0;
	order_identical(h, x);
	for (i = 0; i < h->ny; i++)
		obj += x[h->y[i].col] * h->y[i].cost;
	return obj;
}

/* Prune set to a minimal one; its cost, HUGE_VAL when that fails. */
/* Prune set to a minimal one; when it beats best, its column values (an
 * LP with the matches fixed) into x and its cost; else HUGE_VAL. */
static double
minimal(heur *h, const unsigned char *set, double best, double *x)
{
	int j, ncol = glp_get_num_cols(h->Q);
	double cost = prune(h, set);

	if (cost >= best)
		return HUGE_VAL;
	for (j = 1; j <= ncol; j++)
		glp_set_obj_coef(h->Q, j, 0.0);
	if (lp(h, h->Q) != 0)
		return HUGE_VAL;
	return extract(h, x);
}

/* ---- 2. tick-off dives ---- */

static size_t
cand_party(const heur *h, size_t i, int cold)
{
	size_t pi = h->y[i].pi;

	return cold ? h->p->cold[pi % h->p->ncold] : h->p->hot[pi / h->p->ncold];
}

typedef struct {
	int side;       /* 0: the hot party becomes a leaf, 1: the cold one */
	size_t cand;    /* the one match it keeps among the living */
	double score;   /* share of the leaf's heat on that match (+ noise) */
} tick;

typedef struct {
	unsigned char *alive;   /* per subnetwork and party */
	uint64_t rng;           /* 0: follow the LP exactly */
	tick *t;
} diver;

static int
by_score(const void *a, const void *b)
{
	const tick *x = a, *y = b;

	return (x->score < y->score) - (x->score > y->score);
}

/* xorshift64* (Vigna 2016): reproducible on every machine. */
static double
noise(uint64_t *s)
{
	uint64_t x = *s;

	x ^= x >> 12;
	x ^= x << 25;
	x ^= x >> 27;
	*s = x;
	return (double)((x * 0x2545f4914f6cdd1dull) >> 11) / 9007199254740992.0;
}

/* Candidate i is open and joins two living parties. */
static int
living(const heur *h, const diver *d, size_t i)
{
	size_t np = h->p->np, si = h->y[i].si;

	return h->y[i].open && d->alive[si * np + cand_party(h, i, 0)] &&
		d->alive[si * np + cand_party(h, i, 1)];
}

/* The living matches of candidate i's party on one side: their heat. */
static double
living_heat(const heur *h, const diver *d, size_t i, int side, size_t *count)
{
	size_t j, si = h->y[i].si, me = cand_party(h, i, side);
	double tot = 0.0;

	*count = 0;
	for (j = 0; j < h->ny; j++)
		if (h->y[j].si == si && cand_party(h, j, side) == me &&
		    living(h, d, j)) {
			tot += h->y[j].duty;
			(*count)++;
		}
	return tot;
}

/* Parties with one living match are leaves already: they leave play. */
static void
free_ticks(heur *h, diver *d)
{
	size_t i, cnt, np = h->p->np;
	int side, again = 1;

	while (again) {
		again = 0;
		for (side = 0; side < 2; side++)
			for (i = 0; i < h->ny; i++) {
				if (!living(h, d, i))
					continue;
				living_heat(h, d, i, side, &cnt);
				if (cnt != 1)
					continue;
				d->alive[h->y[i].si * np +
					 cand_party(h, i, side)] = 0;
				again = 1;
			}
	}
}

static size_t
list_ticks(heur *h, diver *d)
{
	size_t n = 0, i, cnt;
	int side;

	for (side = 0; side < 2; side++)
		for (i = 0; i < h->ny; i++) {
			double tot;

			if (!living(h, d, i))
				continue;
			tot = living_heat(h, d, i, side, &cnt);
			d->t[n].side = side;
			d->t[n].cand = i;
			d->t[n].score = tot > 0.0 ? h->y[i].duty / tot : 0.0;
			if (d->rng != 0)
				d->t[n].score += 0.5 * noise(&d->rng);
			n++;
		}
	qsort(d->t, n, sizeof *d->t, by_score);
	return n;
}

static void
set_open(heur *h, size_t i, int open)
{
	const hl_match_sd *sd = &h->m->sd[h->y[i].si];
	size_t kk;

	h->y[i].open = open;
	for (kk = 0; kk < sd->nk; kk++) {
		int j = sd->qcol[h->y[i].pi * sd->nk + kk];

		if (j)
			glp_set_col_bnds(h->G, j, open ? GLP_DB : GLP_FX, 0.0,
				open ? glp_get_col_ub(h->m->P, j) : 0.0);
	}
}

/* Make the tick's party a leaf: close its other living matches. Keeps the
 * guide LP solved; 1 when accepted. */
static int
try_tick(heur *h, diver *d, const tick *t, int *closed)
{
	size_t i = t->cand, si = h->y[i].si, j, n = 0;
	size_t me = cand_party(h, i, t->side);
	double moved = 0.0;

	for (j = 0; j < h->ny; j++) {
		if (j == i || h->y[j].si != si ||
		    cand_party(h, j, t->side) != me || !living(h, d, j))
			continue;
		if (forced(h, j))
			return 0;
		closed[n++] = (int)j;
	}
	for (j = 0; j < n; j++) {
		set_open(h, (size_t)closed[j], 0);
		moved += h->y[closed[j]].duty;
	}
	/* Closing matches that carry nothing leaves the LP optimal. */
	if (moved <= 1e-9 * h->p->scale)
		return 1;
	if (flow_ok(h, si, 0) && lp(h, h->G) == 0) {
		read_duties(h, h->G);
		return 1;
	}
	while (n > 0)
		set_open(h, (size_t)closed[--n], 1);
	return 0;
}

/* Price of heat on each pair in the guide LP: cost / U, times a random
 * factor in 0.25..4 after the first dive so that the dives differ. */
static void
guide_costs(heur *h, uint64_t *rng)
{
	size_t i, kk;

	for (i = 0; i < h->ny; i++) {
		const hl_match_sd *sd = &h->m->sd[h->y[i].si];
		double w = h->y[i].cost / sd->U[h->y[i].pi];

		if (*rng != 0)
			w *= pow(4.0, 2.0 * noise(rng) - 1.0);
		for (kk = 0; kk < sd->nk; kk++) {
			int j = sd->qcol[h->y[i].pi * sd->nk + kk];

			if (j)
				glp_set_obj_coef(h->G, j, w);
		}
	}
}

/* One dive: ticks until none is left or none is feasible. */
static int
dive(heur *h, unsigned char *set, uint64_t seed)
{
	size_t np = h->p->np, ns = h->m->ns, i, si;
	int *closed = malloc((h->ny + 1) * sizeof *closed), rc = -1;
	diver d;

	d.alive = calloc(ns * np + 1, 1);
	d.t = malloc((2 * h->ny + 1) * sizeof *d.t);
	d.rng = seed;
	if (d.alive == NULL || d.t == NULL || closed == NULL)
		goto out;
	for (si = 0; si < ns; si++)
		for (i = 0; i < np; i++)
			d.alive[si * np + i] = h->m->sd[si].active[i];
	for (i = 0; i < h->ny; i++)
		set_open(h, i, 1);
	guide_costs(h, &d.rng);
	h->effort = DIVE_EFFORT + 20 * (long)h->ny;
	if (lp(h, h->G) != 0)
		goto out;
	read_duties(h, h->G);
	for (;;) {
		size_t k, n;
		int done = 0;

		free_ticks(h, &d);
		n = list_ticks(h, &d);
		for (k = 0; k < n && !done; k++) {
			if (h->effort <= 0 || hl_match_now() > h->deadline)
				break;
			done = try_tick(h, &d, &d.t[k], closed);
			if (done) {
				size_t c = d.t[k].cand;

				d.alive[h->y[c].si * np +
					cand_party(h, c, d.t[k].side)] = 0;
			}
		}
		if (!done)
			break;
	}
	support(h, set);
	rc = 0;
out:
	free(d.alive);
	free(d.t);
	free(closed);
	return rc;
}

/* ---- driver ---- */

/* One subnetwork without duty limits or required pairs: a set of
 * matches is feasible exactly when the flow test says so (the arcs carry
 * the model's per-interval and residual bounds; the pair bound U never
 * binds on a feasible flow, being the most the pair could carry alone). */
static int
flow_decides(const heur *h)
{
	size_t pi;

	if (h->m->ns != 1 || h->flow == NULL || h->flow[0] == NULL)
		return 0;
	for (pi = 0; pi < h->p->nhot * h->p->ncold; pi++)
		if (h->m->sd[0].ycol[pi] != 0 && (h->p->pair[pi].required ||
		    !isinf(h->p->pair[pi].maxduty)))
			return 0;
	return 1;
}

static void
setup_flows(heur *h)
{
	size_t i;

	h->flow = calloc(h->m->ns + 1, sizeof *h->flow);
	h->open = malloc(h->p->nhot * h->p->ncold + 1);
	for (i = 0; h->flow != NULL && h->open != NULL && i < h->m->ns; i++)
		h->flow[i] = hl_match_flow_create(h->p, &h->m->sd[i]);
	if (h->open == NULL && h->flow != NULL) {
		free(h->flow);
		h->flow = NULL;
	}
	h->flow_exact = flow_decides(h);
}

static void
heur_free(heur *h)
{
	size_t i;

	for (i = 0; h->flow != NULL && i < h->m->ns; i++)
		hl_match_flow_free(h->flow[i]);
	free(h->flow);
	free(h->open);
	free(h->y);
	if (h->Q != NULL)
		glp_delete_prob(h->Q);
	if (h->G != NULL)
		glp_delete_prob(h->G);
}

/* The network put together from balanced parts (match_milp.c), when
 * every subnetwork of the group has one. */
static int
seeded(heur *h, unsigned char *set)
{
	size_t i;

	for (i = 0; i < h->m->ns; i++)
		if (h->m->sd[i].seed == NULL)
			return 0;
	for (i = 0; i < h->ny; i++)
		set[i] = h->m->sd[h->y[i].si].seed[h->y[i].pi] || forced(h, i);
	return 1;
}

/* Keep x2 as the incumbent when it is better. */
static void
consider(double c, const double *x2, int n, double *best, double *x)
{
	if (c < *best) {
		*best = c;
		memcpy(x, x2, (size_t)(n + 1) * sizeof *x);
	}
}

int
hl_match_heuristic(const hl_match_problem *p, hl_match_model_t *m,
		   double deadline, double lower, double *x, double *obj)
{
	heur h;
	unsigned char *set = NULL;
	double *x2 = NULL, best = HUGE_VAL;
	uint64_t r;
	int n = glp_get_num_cols(m->P);

	memset(&h, 0, sizeof h);
	h.p = p;
	h.m = m;
	h.deadline = deadline;
	if (list_y(&h) != 0 || (set = calloc(h.ny + 1, 1)) == NULL ||
	    (x2 = malloc((size_t)(n + 1) * sizeof *x2)) == NULL)
		goto out;
	setup_flows(&h);
	make_relaxation(&h);
	h.effort = 1L << 30;
	if (seeded(&h, set))
		consider(minimal(&h, set, best, x2), x2, n, &best, x);
	if (best > lower + 1e-9 && reweight(&h, set) == 0)
		consider(minimal(&h, set, best, x2), x2, n, &best, x);
	if (best > lower + 1e-9)
		make_guide(&h);
	for (r = 0; best > lower + 1e-9 && r < MAX_DIVES; r++) {
		if (r > 0 && hl_match_now() > deadline)
			break;
		if (dive(&h, set, r == 0 ? 0 : 0x9e3779b97f4a7c15ull * r) != 0)
			break;
		h.effort = 1L << 30;
		consider(minimal(&h, set, best, x2), x2, n, &best, x);
	}
out:
	heur_free(&h);
	free(set);
	free(x2);
	*obj = best;
	return isinf(best) ? -1 : 0;
}
