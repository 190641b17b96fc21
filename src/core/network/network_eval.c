/* network_eval.c - the placement's state: lanes of blocks, and the
 * evaluation of every temperature from the order and shares. */
#include <math.h>
#include <stdint.h>
#include <stdlib.h>
#include <string.h>

#include "network_int.h"
#include "profile.h"

hl_net_place *
hl_net_place_create(hl_network *net)
{
	hl_net_place *P = calloc(1, sizeof *P);

	if (P == NULL)
		return NULL;
	P->net = net;
	P->lane = calloc(net->nparty > 0 ? net->nparty : 1, sizeof *P->lane);
	if (P->lane == NULL) {
		free(P);
		return NULL;
	}
	P->by_area = net->set.cost_a <= 0.0 && net->set.cost_b <= 0.0;
	P->max_evals = 200000;
	return P;
}

void
hl_net_lane_clear(hl_net_lane *L)
{
	size_t i;

	for (i = 0; i < L->n; i++) {
		free(L->b[i].u);
		free(L->b[i].share);
	}
	free(L->b);
	memset(L, 0, sizeof *L);
}

void
hl_net_place_free(hl_net_place *P)
{
	size_t i;

	if (P == NULL)
		return;
	for (i = 0; i < P->net->nparty; i++)
		hl_net_lane_clear(&P->lane[i]);
	free(P->lane);
	free(P->key_hot);
	free(P->key_cold);
	free(P->viol);
	free(P->cost);
	free(P->group);
	free(P);
}

static hl_status
block_init(hl_net_block *B, size_t cap)
{
	B->n = 0;
	B->cap = cap;
	B->u = malloc(cap * sizeof *B->u);
	B->share = malloc(cap * sizeof *B->share);
	if (B->u == NULL || B->share == NULL) {
		free(B->u);
		free(B->share);
		B->u = NULL;
		B->share = NULL;
		return HL_EIO;
	}
	return HL_OK;
}

/* Append a unit to a lane as its own block at index pos. */
static hl_status
lane_insert(hl_net_lane *L, size_t pos, size_t unit)
{
	hl_net_block B;

	if (L->n == L->cap) {
		size_t cap = L->cap ? 2 * L->cap : 4;
		hl_net_block *b = realloc(L->b, cap * sizeof *b);

		if (b == NULL)
			return HL_EIO;
		L->b = b;
		L->cap = cap;
	}
	if (block_init(&B, 2) != HL_OK)
		return HL_EIO;
	B.u[0] = unit;
	B.share[0] = 1.0;
	B.n = 1;
	if (pos > L->n)
		pos = L->n;
	memmove(&L->b[pos + 1], &L->b[pos], (L->n - pos) * sizeof *L->b);
	L->b[pos] = B;
	L->n++;
	return HL_OK;
}

void
hl_net_lane_move(hl_net_lane *L, size_t i, size_t j)
{
	hl_net_block B = L->b[i];

	if (i == j)
		return;
	if (i < j)
		memmove(&L->b[i], &L->b[i + 1], (j - i) * sizeof *L->b);
	else
		memmove(&L->b[j + 1], &L->b[j], (i - j) * sizeof *L->b);
	L->b[j] = B;
}

hl_status
hl_net_lane_merge(hl_net_lane *L, size_t i, size_t j, const hl_network *net)
{
	hl_net_block B;
	size_t k, m, n = 0;
	double total = 0.0;

	for (k = i; k <= j; k++)
		n += L->b[k].n;
	if (block_init(&B, n) != HL_OK)
		return HL_EIO;
	for (k = i; k <= j; k++)
		for (m = 0; m < L->b[k].n; m++) {
			B.u[B.n++] = L->b[k].u[m];
			total += net->unit[L->b[k].u[m]].duty;
		}
	for (k = 0; k < B.n; k++)
		B.share[k] = net->unit[B.u[k]].duty / total;
	for (k = i; k <= j; k++) {
		free(L->b[k].u);
		free(L->b[k].share);
	}
	L->b[i] = B;
	memmove(&L->b[i + 1], &L->b[j + 1], (L->n - j - 1) * sizeof *L->b);
	L->n -= j - i;
	return HL_OK;
}

hl_status
hl_net_lane_unmerge(hl_net_lane *L, size_t i, const double *key, int falling)
{
	hl_net_block B = L->b[i];
	size_t k, m, n = B.n;

	/* Insertion sort of the block's units by key, in lane order. */
	for (k = 1; k < n; k++)
		for (m = k; m > 0; m--) {
			double a = key[B.u[m - 1]], b = key[B.u[m]];
			size_t t;

			if (falling ? a >= b : a <= b)
				break;
			t = B.u[m];
			B.u[m] = B.u[m - 1];
			B.u[m - 1] = t;
		}
	L->b[i].n = 1;
	L->b[i].share[0] = 1.0;
	for (k = 1; k < n; k++) {
		if (lane_insert(L, i + k, B.u[k]) != HL_OK)
			return HL_EIO;
	}
	L->b[i].u[0] = B.u[0];
	return HL_OK;
}

hl_status
hl_net_lane_copy(hl_net_lane *dst, const hl_net_lane *src)
{
	size_t i;

	memset(dst, 0, sizeof *dst);
	if (src->n == 0)
		return HL_OK;
	dst->b = calloc(src->n, sizeof *dst->b);
	if (dst->b == NULL)
		return HL_EIO;
	dst->cap = src->n;
	for (i = 0; i < src->n; i++) {
		if (block_init(&dst->b[i], src->b[i].n) != HL_OK) {
			dst->n = i;
			hl_net_lane_clear(dst);
			return HL_EIO;
		}
		dst->b[i].n = src->b[i].n;
		memcpy(dst->b[i].u, src->b[i].u, src->b[i].n * sizeof(size_t));
		memcpy(dst->b[i].share, src->b[i].share,
		    src->b[i].n * sizeof(double));
	}
	dst->n = src->n;
	return HL_OK;
}

void
hl_net_lane_remove(hl_net_lane *L, size_t u)
{
	size_t i, k;

	for (i = 0; i < L->n; i++) {
		hl_net_block *B = &L->b[i];
		double left;

		for (k = 0; k < B->n && B->u[k] != u; k++)
			;
		if (k == B->n)
			continue;
		left = 1.0 - B->share[k];
		memmove(&B->u[k], &B->u[k + 1], (B->n - k - 1) * sizeof *B->u);
		memmove(&B->share[k], &B->share[k + 1],
		    (B->n - k - 1) * sizeof *B->share);
		B->n--;
		if (B->n == 0) {
			free(B->u);
			free(B->share);
			memmove(&L->b[i], &L->b[i + 1],
			    (L->n - i - 1) * sizeof *L->b);
			L->n--;
			return;
		}
		for (k = 0; k < B->n; k++)
			B->share[k] = B->n == 1 ? 1.0 :
			    (left > 0.0 ? B->share[k] / left : 1.0 / B->n);
		return;
	}
}

hl_status
hl_net_place_add_unit(hl_net_place *P, const hl_network_unit *u,
		      double key_hot, double key_cold)
{
	hl_network *net = P->net;
	size_t k = net->nunit;

	if (k == P->cap) {
		size_t cap = P->cap ? 2 * P->cap : 16;
		double **arr[4] = { &P->key_hot, &P->key_cold, &P->viol,
		    &P->cost };
		long *g;
		int i;

		for (i = 0; i < 4; i++) {
			double *a = realloc(*arr[i], cap * sizeof *a);

			if (a == NULL)
				return HL_EIO;
			*arr[i] = a;
		}
		g = realloc(P->group, cap * sizeof *g);
		if (g == NULL)
			return HL_EIO;
		P->group = g;
		P->cap = cap;
	}
	P->viol[k] = 0.0;
	P->cost[k] = NAN;
	P->group[k] = -1;
	if (hl_network_add_unit(net, u, NULL) != HL_OK)
		return HL_EIO;
	net->unit[k].required = hl_network_required(&net->set,
	    &net->party[u->hot], &net->party[u->cold]);
	P->key_hot[k] = key_hot;
	P->key_cold[k] = key_cold;
	if (!net->party[u->hot].utility &&
	    lane_insert(&P->lane[u->hot], SIZE_MAX, k) != HL_OK)
		return HL_EIO;
	if (!net->party[u->cold].utility &&
	    lane_insert(&P->lane[u->cold], SIZE_MAX, k) != HL_OK)
		return HL_EIO;
	return HL_OK;
}

/* Walk one process lane from the supply end. */
static void
eval_lane(hl_net_place *P, size_t p)
{
	const hl_network_party *s = &P->net->party[p];
	const hl_net_lane *L = &P->lane[p];
	double q = 0.0;
	size_t b, k;

	for (b = 0; b < L->n; b++) {
		const hl_net_block *B = &L->b[b];
		double tin = hl_profile_temp(s->seg, s->nseg, s->kind, q);
		double sum = 0.0;

		for (k = 0; k < B->n; k++) {
			hl_network_unit *u = &P->net->unit[B->u[k]];
			double tout = hl_profile_temp(s->seg, s->nseg, s->kind,
			    q + u->duty / B->share[k]);

			if (s->kind == HL_HOT) {
				u->hot_in = tin;
				u->hot_out = tout;
				u->hot_share = B->share[k];
				u->hot_stage = (int)b + 1;
			} else {
				u->cold_in = tin;
				u->cold_out = tout;
				u->cold_share = B->share[k];
				u->cold_stage = (int)b + 1;
			}
			sum += u->duty;
		}
		q += sum;
	}
}

/* A utility side runs from the utility's supply to its target, or to a
 * nearer outlet where its full range would break the approach. */
static void
eval_utility_side(hl_network *net, hl_network_unit *u)
{
	const hl_network_party *h = &net->party[u->hot];
	const hl_network_party *c = &net->party[u->cold];

	if (h->utility) {
		u->hot_in = h->supply;
		u->hot_out = h->target;
		u->hot_stage = 0;
		if (h->supply > h->target && c->kind == HL_COLD &&
		    !c->utility && u->cold_in + u->required > h->target &&
		    u->cold_in + u->required < h->supply)
			u->hot_out = u->cold_in + u->required;
	}
	if (c->utility) {
		u->cold_in = c->supply;
		u->cold_out = c->target;
		u->cold_stage = 0;
		if (c->target > c->supply && !h->utility &&
		    u->hot_in - u->required < c->target &&
		    u->hot_in - u->required > c->supply)
			u->cold_out = u->hot_in - u->required;
	}
}

/* Shares of a utility's units: their fraction of its flow (of its heat
 * when it is isothermal). */
static void
utility_shares(hl_network *net)
{
	size_t i, p;

	for (p = 0; p < net->nparty; p++) {
		const hl_network_party *q = &net->party[p];
		double sum = 0.0;

		if (!q->utility)
			continue;
		for (i = 0; i < net->nunit; i++) {
			hl_network_unit *u = &net->unit[i];
			double w;

			if (u->duty <= 0.0 || (u->hot != p && u->cold != p))
				continue;
			w = q->supply == q->target ? u->duty : u->duty /
			    fabs(u->hot == p ? u->hot_in - u->hot_out :
			    u->cold_out - u->cold_in);
			sum += w;
			if (u->hot == p)
				u->hot_share = w;
			else
				u->cold_share = w;
		}
		for (i = 0; i < net->nunit; i++) {
			hl_network_unit *u = &net->unit[i];

			if (u->duty <= 0.0 || sum <= 0.0)
				continue;
			if (u->hot == p)
				u->hot_share /= sum;
			else if (u->cold == p)
				u->cold_share /= sum;
		}
	}
}

static double
approach(const hl_network *net, const hl_network_unit *u)
{
	const hl_network_party *h = &net->party[u->hot];
	const hl_network_party *c = &net->party[u->cold];
	hl_profile_side hs = { h->seg, h->utility ? 0 : h->nseg, h->kind,
	    u->hot_in, u->hot_out, 1.0 };
	hl_profile_side cs = { c->seg, c->utility ? 0 : c->nseg, c->kind,
	    u->cold_in, u->cold_out, 1.0 };
	hl_profile_unit pu;

	if (hs.nseg <= 1 && cs.nseg <= 1)
		return fmin(u->hot_in - u->cold_out, u->hot_out - u->cold_in);
	hl_profile_unit_eval(&hs, &cs, u->duty, &pu);
	return pu.approach;
}

double
hl_net_unit_violation(const hl_net_place *P, size_t k)
{
	return P->net->unit[k].duty > 0.0 ? P->viol[k] : 0.0;
}

/* A unit's utility side, approach and violation; its cost goes stale. */
static void
eval_unit(hl_net_place *P, size_t k)
{
	hl_network_unit *u = &P->net->unit[k];

	P->cost[k] = NAN;
	if (u->duty <= 0.0) {
		P->viol[k] = 0.0;
		return;
	}
	eval_utility_side(P->net, u);
	u->approach = approach(P->net, u);
	P->viol[k] = fmax(0.0, u->required - u->approach);
}

double
hl_net_eval(hl_net_place *P)
{
	hl_network *net = P->net;
	double v = 0.0;
	size_t i;

	P->evals++;
	for (i = 0; i < net->nparty; i++)
		if (!net->party[i].utility)
			eval_lane(P, i);
	for (i = 0; i < net->nunit; i++) {
		eval_unit(P, i);
		v += P->viol[i];
	}
	utility_shares(net);
	return v;
}

/* Objective of one unit: cost (or area); a unit beyond the shell limit is
 * costed as counterflow at twice the price, to steer away. */
static double
unit_objective(hl_net_place *P, size_t k)
{
	hl_network *net = P->net;
	hl_network_unit u = net->unit[k];
	hl_status st;
	double w = 1.0;

	u.type = hl_network_unit_type(net, u.hot, u.cold);
	u.note = NULL;
	st = hl_network_size_unit(net, &u, NULL);
	if (st == HL_ENOSOLUTION) {
		u.type = HL_EXCH_COUNTERFLOW;
		st = hl_network_size_unit(net, &u, NULL);
		w = 2.0;
	}
	if (st != HL_OK)
		return HUGE_VAL;
	return w * (P->by_area ? u.area : u.cost);
}

/* The score from the cached violations, costing the stale units when
 * every approach holds. */
static hl_net_score
score_cached(hl_net_place *P)
{
	hl_network *net = P->net;
	hl_net_score s = { 0.0, 0.0 };
	size_t i;

	for (i = 0; i < net->nunit; i++)
		s.v += hl_net_unit_violation(P, i);
	if (s.v > HL_NET_VTOL) {
		s.cost = HUGE_VAL;
		return s;
	}
	for (i = 0; i < net->nunit; i++) {
		if (net->unit[i].duty <= 0.0)
			continue;
		if (isnan(P->cost[i]))
			P->cost[i] = unit_objective(P, i);
		s.cost += P->cost[i];
	}
	if (!isfinite(s.cost))
		s.v = 1.0;
	return s;
}

hl_net_score
hl_net_score_now(hl_net_place *P)
{
	hl_net_eval(P);
	return score_cached(P);
}

hl_net_score
hl_net_rescore(hl_net_place *P, size_t p)
{
	const hl_net_lane *L = &P->lane[p];
	size_t b, k;

	P->evals++;
	eval_lane(P, p);
	for (b = 0; b < L->n; b++)
		for (k = 0; k < L->b[b].n; k++)
			eval_unit(P, L->b[b].u[k]);
	return score_cached(P);
}

/* Re-evaluate lane p's units without scoring. */
static void
touch_lane(hl_net_place *P, size_t p)
{
	const hl_net_lane *L = &P->lane[p];
	size_t b, k;

	if (P->net->party[p].utility)
		return;
	eval_lane(P, p);
	for (b = 0; b < L->n; b++)
		for (k = 0; k < L->b[b].n; k++)
			eval_unit(P, L->b[b].u[k]);
}

hl_net_score
hl_net_rescore2(hl_net_place *P, size_t p, size_t q)
{
	P->evals++;
	touch_lane(P, p);
	touch_lane(P, q);
	return score_cached(P);
}

hl_status
hl_net_snap_take2(const hl_net_place *P, size_t p, size_t q, hl_net_snap *s)
{
	hl_net_snap t = { 0 };
	size_t i;

	if (P->net->party[p].utility)
		return hl_net_snap_take(P, q, s);
	if (hl_net_snap_take(P, p, s) != HL_OK)
		return HL_EIO;
	if (P->net->party[q].utility)
		return HL_OK;
	if (hl_net_snap_take(P, q, &t) != HL_OK) {
		hl_net_snap_free(&t);
		return HL_EIO;
	}
	/* Append q's units (a unit on both lanes is already in s). */
	for (i = 0; i < t.n; i++) {
		size_t j;

		for (j = 0; j < s->n && s->idx[j] != t.idx[i]; j++)
			;
		if (j < s->n)
			continue;
		if (s->n == s->cap) {
			size_t cap = 2 * s->cap + 8;
			void *a;

			if ((a = realloc(s->idx, cap * sizeof *s->idx)) == NULL)
				goto nomem;
			s->idx = a;
			if ((a = realloc(s->u, cap * sizeof *s->u)) == NULL)
				goto nomem;
			s->u = a;
			if ((a = realloc(s->viol, cap * sizeof *s->viol)) ==
			    NULL)
				goto nomem;
			s->viol = a;
			if ((a = realloc(s->cost, cap * sizeof *s->cost)) ==
			    NULL)
				goto nomem;
			s->cost = a;
			s->cap = cap;
		}
		s->idx[s->n] = t.idx[i];
		s->u[s->n] = t.u[i];
		s->viol[s->n] = t.viol[i];
		s->cost[s->n++] = t.cost[i];
	}
	hl_net_snap_free(&t);
	return HL_OK;
nomem:
	hl_net_snap_free(&t);
	return HL_EIO;
}

hl_status
hl_net_snap_take(const hl_net_place *P, size_t p, hl_net_snap *s)
{
	const hl_net_lane *L = &P->lane[p];
	size_t b, k, n = 0;

	for (b = 0; b < L->n; b++)
		n += L->b[b].n;
	if (n > s->cap) {
		size_t cap = n + 8;
		void *a = realloc(s->idx, cap * sizeof *s->idx);

		if (a == NULL)
			return HL_EIO;
		s->idx = a;
		if ((a = realloc(s->u, cap * sizeof *s->u)) == NULL)
			return HL_EIO;
		s->u = a;
		if ((a = realloc(s->viol, cap * sizeof *s->viol)) == NULL)
			return HL_EIO;
		s->viol = a;
		if ((a = realloc(s->cost, cap * sizeof *s->cost)) == NULL)
			return HL_EIO;
		s->cost = a;
		s->cap = cap;
	}
	s->n = 0;
	for (b = 0; b < L->n; b++)
		for (k = 0; k < L->b[b].n; k++) {
			size_t i = L->b[b].u[k];

			s->idx[s->n] = i;
			s->u[s->n] = P->net->unit[i];
			s->viol[s->n] = P->viol[i];
			s->cost[s->n++] = P->cost[i];
		}
	return HL_OK;
}

void
hl_net_snap_restore(hl_net_place *P, const hl_net_snap *s)
{
	size_t i;

	for (i = 0; i < s->n; i++) {
		P->net->unit[s->idx[i]] = s->u[i];
		P->viol[s->idx[i]] = s->viol[i];
		P->cost[s->idx[i]] = s->cost[i];
	}
}

void
hl_net_snap_free(hl_net_snap *s)
{
	free(s->idx);
	free(s->u);
	free(s->viol);
	free(s->cost);
	memset(s, 0, sizeof *s);
}

int
hl_net_better(hl_net_score a, hl_net_score b)
{
	if (a.v <= HL_NET_VTOL && b.v <= HL_NET_VTOL)
		return a.cost < b.cost - 1e-9 * fabs(b.cost);
	return a.v < b.v - HL_NET_VTOL;
}
