/* network_idle.c - units that carry next to no heat, taken out of a
 * placement.
 *
 * Why: a match MILP can give a pair a sliver of heat (latent heat spread
 * over 0.01 K leaves a few hundredths of a kW on the far side of a pinch),
 * and a relaxation cut can leave as little on a heater or cooler. Such a
 * unit costs a whole shell and does nothing. A unit is idle when its duty is
 * at most HL_NET_IDLE of the smaller duty of its process streams (a rule of
 * this program, no source); at most HL_NET_ZERO of it, the heat is below
 * every tolerance of the check and the unit is simply dropped.
 *
 * An idle unit's heat d must go elsewhere for every stream to balance: along
 * a path of units that alternately carry d more and d less (the path method
 * of energy relaxation, turned round: Linnhoff & Hindmarsh 1983 [from
 * memory]), from each of its process streams to a utility, or round a loop
 * from its hot stream back to its cold one (then no utility changes). The
 * plans of paths up to IDLE_DEPTH units a side are ranked by the utility
 * they add, then the energy cost, and evaluated in full in that order (at
 * most IDLE_MAX_PLANS); the first rank with a plan that keeps every
 * approach gives the one of least capital (or area). A plan below the
 * targets, or one that makes the mix dearer with no penalty to show for
 * it, is refused; an idle unit that no plan relieves stays. Stages are
 * renumbered by the evaluation.
 */
#include <math.h>
#include <stdint.h>
#include <stdlib.h>
#include <string.h>

#include "network_int.h"

/* Units a path may change on one side of the idle unit. */
#define IDLE_DEPTH 3
/* Plans evaluated per idle unit, the most promising first. */
#define IDLE_MAX_PLANS 256
/* Paths kept per side (the plans are their pairs). */
#define IDLE_MAX_PATHS 64

typedef struct {
	size_t n;
	size_t u[IDLE_DEPTH];
	int sign[IDLE_DEPTH];   /* +1: d more, -1: d less */
	int loop;               /* 1: ends on the idle unit's cold stream */
} idle_path;

typedef struct {
	size_t n, cap;
	idle_path *p;
} idle_paths;

typedef struct {
	idle_path a, b;         /* hot side, cold side (b.n = 0: none) */
	double dq;              /* kW of hot utility added */
	double dcost;           /* energy cost added, currency/year */
} idle_plan;

/* The duty of the smaller process stream of a pair (a utility's load is
 * not a reference: it follows from the units). */
static double
reference(const hl_network *net, size_t hot, size_t cold)
{
	const hl_network_party *h = &net->party[hot];
	const hl_network_party *c = &net->party[cold];
	double r = HUGE_VAL;

	if (!h->utility)
		r = fabs(h->load);
	if (!c->utility)
		r = fmin(r, fabs(c->load));
	return isfinite(r) ? r : 0.0;
}

double
hl_net_idle_limit(const hl_network *net, size_t hot, size_t cold)
{
	return HL_NET_IDLE * reference(net, hot, cold);
}

static double
zero_limit(const hl_network *net, const hl_network_unit *u)
{
	return HL_NET_ZERO * reference(net, u->hot, u->cold);
}

static void
drop_unit(hl_net_place *P, size_t k)
{
	hl_network_unit *u = &P->net->unit[k];

	u->duty = 0.0;
	hl_net_lane_remove(&P->lane[u->hot], k);
	hl_net_lane_remove(&P->lane[u->cold], k);
}

/* Units whose heat is below every tolerance: out as they are. */
static void
drop_zero(hl_net_place *P)
{
	size_t k;

	for (k = 0; k < P->net->nunit; k++) {
		const hl_network_unit *u = &P->net->unit[k];

		if (u->duty > 0.0 && u->duty <= zero_limit(P->net, u))
			drop_unit(P, k);
	}
}

static int
path_has(const idle_path *w, size_t u)
{
	size_t i;

	for (i = 0; i < w->n; i++)
		if (w->u[i] == u)
			return 1;
	return 0;
}

static hl_status
paths_push(idle_paths *S, const idle_path *w)
{
	if (S->n == S->cap) {
		size_t cap = S->cap ? 2 * S->cap : 16;
		idle_path *p = realloc(S->p, cap * sizeof *p);

		if (p == NULL)
			return HL_EIO;
		S->p = p;
		S->cap = cap;
	}
	S->p[S->n++] = *w;
	return HL_OK;
}

/* Party on the far side of unit u from party p. */
static size_t
other(const hl_network_unit *u, size_t p)
{
	return u->hot == p ? u->cold : u->hot;
}

/* Extend path w from party p, which must exchange d more (sign +1) or less
 * (-1) through another unit than w's last (or than the idle unit k), and
 * keep the paths of exactly `want` units. A path ends at a utility, or,
 * from the hot side, on `close` (the idle unit's cold stream, which needs d
 * more). Process streams w passed (seen) are not visited again. */
static hl_status
walk(const hl_net_place *P, size_t k, size_t p, int sign, size_t close,
     double d, size_t want, idle_path *w, size_t *seen, size_t nseen,
     idle_paths *out)
{
	const hl_network *net = P->net;
	size_t e, i;

	for (e = 0; e < net->nunit && out->n < IDLE_MAX_PATHS; e++) {
		const hl_network_unit *u = &net->unit[e];
		size_t q;
		int loop, end, again = 0;
		hl_status st = HL_OK;

		if (e == k || u->duty <= 0.0 || (u->hot != p && u->cold != p) ||
		    path_has(w, e))
			continue;
		if (sign < 0 && u->duty < d - zero_limit(net, u))
			continue;
		q = other(u, p);
		for (i = 0; i < nseen; i++)
			again |= seen[i] == q;
		loop = q == close && sign > 0;
		end = loop || net->party[q].utility;
		if (again && !end)
			continue;
		w->u[w->n] = e;
		w->sign[w->n] = sign;
		w->n++;
		w->loop = loop;
		if (end && w->n == want)
			st = paths_push(out, w);
		else if (!end && w->n < want) {
			seen[nseen] = q;
			st = walk(P, k, q, -sign, close, d, want, w, seen,
			    nseen + 1, out);
		}
		w->n--;
		w->loop = 0;
		if (st != HL_OK)
			return st;
	}
	return HL_OK;
}

/* The paths from party p (the idle unit's hot or cold party) that give it
 * d more exchange, shortest first, at most IDLE_MAX_PATHS; one empty path
 * when p is a utility (its load simply changes). */
static hl_status
side_paths(const hl_net_place *P, size_t k, size_t p, size_t close,
	   idle_paths *out)
{
	const hl_network_unit *u = &P->net->unit[k];
	size_t seen[IDLE_DEPTH + 2], want;
	idle_path w;
	hl_status st = HL_OK;

	memset(&w, 0, sizeof w);
	if (P->net->party[p].utility)
		return paths_push(out, &w);
	for (want = 1; want <= IDLE_DEPTH && st == HL_OK; want++) {
		seen[0] = u->hot;
		seen[1] = u->cold;
		st = walk(P, k, p, +1, close, u->duty, want, &w, seen, 2, out);
	}
	return st;
}

/* Kilowatts of utility of the given kind added when the units of
 * path w change by d each (the idle unit's own loss comes separately). */
static void
path_utility(const hl_network *net, const idle_path *w, double d,
	     double *dq, double *dcost)
{
	size_t i;

	for (i = 0; i < w->n; i++) {
		const hl_network_unit *u = &net->unit[w->u[i]];
		const hl_network_party *h = &net->party[u->hot];
		const hl_network_party *c = &net->party[u->cold];
		double x = w->sign[i] * d;

		if (h->utility) {
			*dq += x;
			*dcost += (isnan(h->price) ? 0.0 : h->price) * x;
		}
		if (c->utility)
			*dcost += (isnan(c->price) ? 0.0 : c->price) * x;
	}
}

static void
plan_rate(const hl_network *net, size_t k, idle_plan *pl)
{
	const hl_network_unit *u = &net->unit[k];
	const hl_network_party *h = &net->party[u->hot];
	const hl_network_party *c = &net->party[u->cold];

	pl->dq = 0.0;
	pl->dcost = 0.0;
	if (h->utility) {
		pl->dq -= u->duty;
		pl->dcost -= (isnan(h->price) ? 0.0 : h->price) * u->duty;
	}
	if (c->utility)
		pl->dcost -= (isnan(c->price) ? 0.0 : c->price) * u->duty;
	path_utility(net, &pl->a, u->duty, &pl->dq, &pl->dcost);
	path_utility(net, &pl->b, u->duty, &pl->dq, &pl->dcost);
	pl->dcost *= net->set.hours / 1000.0;
}

static int
path_cmp(const idle_path *a, const idle_path *b)
{
	size_t i;

	if (a->n != b->n)
		return a->n < b->n ? -1 : 1;
	for (i = 0; i < a->n; i++)
		if (a->u[i] != b->u[i])
			return a->u[i] < b->u[i] ? -1 : 1;
	return 0;
}

/* Least utility added, then least energy cost. */
static int
plan_cmp(const void *x, const void *y)
{
	const idle_plan *a = x, *b = y;
	double tol = 1e-9 * fmax(1.0, fmax(fabs(a->dq), fabs(b->dq)));

	if (fabs(a->dq - b->dq) > tol)
		return a->dq < b->dq ? -1 : 1;
	if (a->dcost != b->dcost)
		return a->dcost < b->dcost ? -1 : 1;
	/* Shorter paths first: fewer units change; then by unit index, so
	 * that every C library sorts alike. */
	if (a->a.n + a->b.n != b->a.n + b->b.n)
		return a->a.n + a->b.n < b->a.n + b->b.n ? -1 : 1;
	return path_cmp(&a->a, &b->a) ? path_cmp(&a->a, &b->a) :
	    path_cmp(&a->b, &b->b);
}

/* Plans alike in utility and energy cost: capital decides. */
static int
same_class(const idle_plan *a, const idle_plan *b)
{
	return fabs(a->dq - b->dq) <= 1e-9 * fmax(1.0, fabs(b->dq)) &&
	    fabs(a->dcost - b->dcost) <= 1e-9 * fmax(1.0, fabs(b->dcost));
}

/* Every plan for idle unit k: loops from its hot side, else a path on each
 * side to a utility; sorted, the best first. */
static hl_status
plans_of(const hl_net_place *P, size_t k, idle_plan **out, size_t *n)
{
	const hl_network_unit *u = &P->net->unit[k];
	idle_paths A = { 0 }, B = { 0 };
	idle_plan *pl = NULL;
	size_t i, j, m = 0, cap;
	hl_status st;

	st = side_paths(P, k, u->hot, u->cold, &A);
	if (st == HL_OK)
		st = side_paths(P, k, u->cold, SIZE_MAX, &B);
	cap = A.n * (B.n + 1) + 1;
	if (st == HL_OK && (pl = malloc(cap * sizeof *pl)) == NULL)
		st = HL_EIO;
	for (i = 0; st == HL_OK && i < A.n; i++) {
		if (A.p[i].loop) {
			memset(&pl[m], 0, sizeof pl[m]);
			pl[m++].a = A.p[i];
			continue;
		}
		for (j = 0; j < B.n; j++) {
			pl[m].a = A.p[i];
			pl[m++].b = B.p[j];
		}
	}
	for (i = 0; i < m; i++)
		plan_rate(P->net, k, &pl[i]);
	if (m > 1)
		qsort(pl, m, sizeof *pl, plan_cmp);
	free(A.p);
	free(B.p);
	if (st != HL_OK) {
		free(pl);
		return st;
	}
	*out = pl;
	*n = m;
	return HL_OK;
}

/* The units and lanes as they were, to try plans from. */
typedef struct {
	hl_network_unit *u;
	hl_net_lane *lane;
	double penalty;
} idle_snap;

static void
snap_free(const hl_net_place *P, idle_snap *s)
{
	size_t i;

	if (s->lane != NULL)
		for (i = 0; i < P->net->nparty; i++)
			hl_net_lane_clear(&s->lane[i]);
	free(s->lane);
	free(s->u);
	memset(s, 0, sizeof *s);
}

static hl_status
snap_take(const hl_net_place *P, idle_snap *s)
{
	const hl_network *net = P->net;
	size_t i;

	s->penalty = net->penalty;
	s->u = malloc((net->nunit + 1) * sizeof *s->u);
	s->lane = calloc(net->nparty + 1, sizeof *s->lane);
	if (s->u == NULL || s->lane == NULL)
		return HL_EIO;
	memcpy(s->u, net->unit, net->nunit * sizeof *s->u);
	for (i = 0; i < net->nparty; i++)
		if (hl_net_lane_copy(&s->lane[i], &P->lane[i]) != HL_OK)
			return HL_EIO;
	return HL_OK;
}

/* Back to the snapshot (the units' notes are shared, never freed here). */
static hl_status
snap_restore(hl_net_place *P, const idle_snap *s)
{
	hl_network *net = P->net;
	size_t i;

	net->penalty = s->penalty;
	memcpy(net->unit, s->u, net->nunit * sizeof *s->u);
	for (i = 0; i < net->nparty; i++) {
		hl_net_lane_clear(&P->lane[i]);
		if (hl_net_lane_copy(&P->lane[i], &s->lane[i]) != HL_OK)
			return HL_EIO;
	}
	return HL_OK;
}

static void
path_apply(hl_net_place *P, const idle_path *w, double d)
{
	size_t i;

	for (i = 0; i < w->n; i++) {
		hl_network_unit *u = &P->net->unit[w->u[i]];

		u->duty = fmax(0.0, u->duty + w->sign[i] * d);
		if (u->duty <= zero_limit(P->net, u) && u->duty > 0.0)
			u->duty = 0.0;
		if (u->duty == 0.0)
			drop_unit(P, w->u[i]);
	}
}

/* Apply plan pl for idle unit k; its score (V > 0: not feasible). */
static hl_net_score
plan_apply(hl_net_place *P, size_t k, const idle_plan *pl)
{
	double d = P->net->unit[k].duty;

	drop_unit(P, k);
	path_apply(P, &pl->a, d);
	path_apply(P, &pl->b, d);
	P->net->penalty = fmax(0.0, P->net->penalty + pl->dq);
	return hl_net_score_now(P);
}

/* Below the targets is not a placement's to choose; nor a dearer mix of
 * the same utility total: that would leave the least-cost mix unannounced
 * (the check compares a network with no penalty against it). */
static int
allowed(const hl_network *net, const idle_plan *pl)
{
	double tol = 1e-9 * fmax(1.0, fmax(net->qh_target, net->penalty));

	if (net->penalty + pl->dq < -tol)
		return 0;
	return !(net->penalty + pl->dq <= tol && pl->dcost > 1e-9);
}

/* Relieve idle unit k by the best feasible plan; *done = 1 when one was
 * applied. */
static hl_status
relieve(hl_net_place *P, size_t k, int *done)
{
	idle_plan *pl = NULL;
	idle_snap s = { 0 };
	size_t n = 0, i, tried = 0;
	long best = -1;
	double best_cost = HUGE_VAL;
	hl_status st;

	*done = 0;
	st = plans_of(P, k, &pl, &n);
	if (st == HL_OK && n > 0)
		st = snap_take(P, &s);
	for (i = 0; st == HL_OK && i < n && tried < IDLE_MAX_PLANS; i++) {
		hl_net_score sc;

		if (!allowed(P->net, &pl[i]))
			continue;
		if (best >= 0 && !same_class(&pl[i], &pl[best]))
			break;
		tried++;
		sc = plan_apply(P, k, &pl[i]);
		if (sc.v <= HL_NET_VTOL && (best < 0 || sc.cost < best_cost)) {
			best = (long)i;
			best_cost = sc.cost;
		}
		st = snap_restore(P, &s);
	}
	if (st == HL_OK && best >= 0) {
		plan_apply(P, k, &pl[best]);
		*done = 1;
	}
	if (st == HL_OK)
		hl_net_score_now(P);
	snap_free(P, &s);
	free(pl);
	return st;
}

/* The idle unit of least duty relative to its reference, not yet tried;
 * -1 when none. */
static long
next_idle(const hl_net_place *P, const unsigned char *tried)
{
	const hl_network *net = P->net;
	double least = HUGE_VAL;
	long pick = -1;
	size_t k;

	for (k = 0; k < net->nunit; k++) {
		const hl_network_unit *u = &net->unit[k];
		double lim = hl_net_idle_limit(net, u->hot, u->cold);

		if (tried[k] || !(u->duty > 0.0) || u->duty > lim)
			continue;
		if (u->duty / lim < least) {
			least = u->duty / lim;
			pick = (long)k;
		}
	}
	return pick;
}

hl_status
hl_net_drop_idle(hl_net_place *P, hl_error *err)
{
	unsigned char *tried = calloc(P->net->nunit + 1, 1);
	hl_status st = HL_OK;
	long k;
	int done;

	if (tried == NULL)
		return hl_error_nomem(err);
	drop_zero(P);
	while (st == HL_OK && (k = next_idle(P, tried)) >= 0) {
		tried[k] = 1;
		st = relieve(P, (size_t)k, &done);
		drop_zero(P);
	}
	free(tried);
	hl_net_score_now(P);
	return st == HL_OK ? HL_OK : hl_error_nomem(err);
}
