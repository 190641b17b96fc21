/* network_opt_walk.c - the search over loads and structure: a random walk
 * with unit creation and removal and compulsive acceptance of slightly
 * worse states (random walk with compulsive evolution, Xiao, Cui et al.
 * 2017-2019), and a coordinate search on the loads of one structure
 * (compass search, Kolda, Lewis & Torczon 2003, SIAM Review 45, 385). */
#include <math.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#include "network_opt_int.h"

/* Compulsive acceptance: a worse state within this fraction of the cost is
 * taken with this probability. */
#define ACCEPT_WORSE 0.3
#define ACCEPT_PROB 0.02

double
hl_opt_now(void)
{
	struct timespec ts;

	clock_gettime(CLOCK_MONOTONIC, &ts);
	return (double)ts.tv_sec + 1e-9 * (double)ts.tv_nsec;
}

typedef struct {
	uint64_t s;
} rng;

/* splitmix64 (Steele, Lea & Flood 2014, OOPSLA): a full-period 64-bit
 * generator; fixed, so walks repeat across platforms. */
static uint64_t
next(rng *r)
{
	uint64_t z = (r->s += 0x9E3779B97F4A7C15ull);

	z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9ull;
	z = (z ^ (z >> 27)) * 0x94D049BB133111EBull;
	return z ^ (z >> 31);
}

static double
unif(rng *r)
{
	return (double)(next(r) >> 11) * (1.0 / 9007199254740992.0);
}

static size_t
pick(rng *r, size_t n)
{
	return n == 0 ? 0 : (size_t)(next(r) % n);
}

/* What a move touched, kept to undo it: the cells of up to two hot and
 * two cold streams that have a unit (or will: cells added by hand) and
 * those streams' data. */
typedef struct {
	size_t i;
	double q, c, v, wh, wc;
	unsigned char act;
} cell_save;

/* One stream's data: its boundary temperatures (S + 1), then per stage the
 * temperature after the process units, the heat before, the weights' sum
 * and the utility inside; its utilities; its scalars. */
#define ROW(P) (5 * (P)->S + 1)
typedef struct {
	double *d;
	long *m;
	double x[6];
	long util;
} row_save;

typedef struct {
	size_t na, nb, A[2], B[2];
	cell_save *cs;
	size_t ncs;
	row_save h[2], c[2];
	double v, tac, ccap, cvsum;
	size_t nact;
	hl_opt_state *full;  /* the whole state, for a move on every load */
} snap;

static int
snap_init(const hl_opt_problem *P, snap *z)
{
	int ok = 1, i;

	memset(z, 0, sizeof *z);
	z->cs = malloc((2 * P->S * (P->nc + P->nh) + 8) * sizeof *z->cs);
	for (i = 0; i < 2; i++) {
		z->h[i].d = malloc(ROW(P) * sizeof *z->h[i].d);
		z->c[i].d = malloc(ROW(P) * sizeof *z->c[i].d);
		z->h[i].m = malloc((P->S + 1) * sizeof *z->h[i].m);
		z->c[i].m = malloc((P->S + 1) * sizeof *z->c[i].m);
		ok &= z->h[i].d != NULL && z->c[i].d != NULL &&
		    z->h[i].m != NULL && z->c[i].m != NULL;
	}
	return z->cs != NULL && ok;
}

static void
snap_free(snap *z)
{
	int i;

	free(z->cs);
	for (i = 0; i < 2; i++) {
		free(z->h[i].d);
		free(z->c[i].d);
		free(z->h[i].m);
		free(z->c[i].m);
	}
}

static void
add_a(snap *z, size_t a)
{
	if (z->na == 0 || (z->A[0] != a && z->na < 2))
		z->A[z->na++] = a;
}

static void
add_b(snap *z, size_t b)
{
	if (z->nb == 0 || (z->B[0] != b && z->nb < 2))
		z->B[z->nb++] = b;
}

static void
keep_cell(snap *z, const hl_opt_state *s, size_t i)
{
	cell_save *c = &z->cs[z->ncs++];

	c->i = i;
	c->q = s->q[i];
	c->c = s->ccost[i];
	c->v = s->cviol[i];
	c->wh = s->wh[i];
	c->wc = s->wc[i];
	c->act = s->act[i];
}

/* The stream data of hot stream a (side 0) or cold stream b: pointers to
 * its rows and scalars in s, so that save and restore share one list. */
typedef struct {
	double *t, *rows[4], *x[6];
	long *m, *util;
} stream_view;

static stream_view
view(const hl_opt_problem *P, hl_opt_state *s, int side, size_t j)
{
	stream_view v;
	size_t S = P->S, o = j * S;

	if (side == 0) {
		v = (stream_view){ &s->th[j * (S + 1)], { &s->thm[o], &s->hq[o],
		    &s->swh[o], &s->uh[o] }, { &s->hviol[j], &s->hend[j],
		    &s->hecost[j], &s->heviol[j], &s->hmc[j], &s->hmv[j] },
		    &s->muh[o], &s->hutil[j] };
	} else {
		v = (stream_view){ &s->tc[j * (S + 1)], { &s->tcm[o], &s->cq[o],
		    &s->swc[o], &s->uc[o] }, { &s->cvs[j], &s->cend[j],
		    &s->cecost[j], &s->ceviol[j], &s->cmc[j], &s->cmv[j] },
		    &s->muc[o], &s->cutil[j] };
	}
	return v;
}

static void
row_copy(const hl_opt_problem *P, hl_opt_state *s, int side, size_t j,
	 row_save *r, int out)
{
	stream_view v = view(P, s, side, j);
	size_t S = P->S, k;

	if (out) {
		memcpy(r->d, v.t, (S + 1) * sizeof *r->d);
		for (k = 0; k < 4; k++)
			memcpy(r->d + S + 1 + k * S, v.rows[k], S * sizeof *r->d);
		memcpy(r->m, v.m, S * sizeof *r->m);
		for (k = 0; k < 6; k++)
			r->x[k] = *v.x[k];
		r->util = *v.util;
	} else {
		memcpy(v.t, r->d, (S + 1) * sizeof *r->d);
		for (k = 0; k < 4; k++)
			memcpy(v.rows[k], r->d + S + 1 + k * S, S * sizeof *r->d);
		memcpy(v.m, r->m, S * sizeof *r->m);
		for (k = 0; k < 6; k++)
			*v.x[k] = r->x[k];
		*v.util = r->util;
	}
}

static void
save(const hl_opt_problem *P, const hl_opt_state *s, snap *z)
{
	size_t i, k, x, S = P->S;

	z->ncs = 0;
	for (i = 0; i < z->na; i++) {
		size_t a = z->A[i];

		for (k = 0; k < S; k++)
			for (x = 0; x < P->nc; x++) {
				size_t j = HL_OPT_CELL(P, k, a, x);

				if (s->act[j] || s->q[j] > 0.0 || s->keep[j])
					keep_cell(z, s, j);
			}
		row_copy(P, (hl_opt_state *)s, 0, a, &z->h[i], 1);
	}
	for (i = 0; i < z->nb; i++) {
		size_t b = z->B[i];

		for (k = 0; k < S; k++)
			for (x = 0; x < P->nh; x++) {
				size_t j = HL_OPT_CELL(P, k, x, b);

				if (s->act[j] || s->q[j] > 0.0 || s->keep[j])
					keep_cell(z, s, j);
			}
		row_copy(P, (hl_opt_state *)s, 1, b, &z->c[i], 1);
	}
	z->v = s->v;
	z->tac = s->tac;
	z->ccap = s->ccap;
	z->cvsum = s->cvsum;
	z->nact = s->nact;
}

static void
restore(const hl_opt_problem *P, hl_opt_state *s, const snap *z)
{
	size_t i;

	for (i = z->ncs; i-- > 0;) {
		const cell_save *c = &z->cs[i];

		s->q[c->i] = c->q;
		s->ccost[c->i] = c->c;
		s->cviol[c->i] = c->v;
		s->wh[c->i] = c->wh;
		s->wc[c->i] = c->wc;
		s->act[c->i] = c->act;
	}
	for (i = 0; i < z->na; i++)
		row_copy(P, s, 0, z->A[i], (row_save *)&z->h[i], 0);
	for (i = 0; i < z->nb; i++)
		row_copy(P, s, 1, z->B[i], (row_save *)&z->c[i], 0);
	s->v = z->v;
	s->tac = z->tac;
	s->ccap = z->ccap;
	s->cvsum = z->cvsum;
	s->nact = z->nact;
}

/* Start a move on cell i: the snapshot of its two streams. */
static void
begin(const hl_opt_problem *P, const hl_opt_state *s, snap *z, size_t i)
{
	size_t b = i % P->nc, a = (i / P->nc) % P->nh;

	z->na = z->nb = 0;
	add_a(z, a);
	add_b(z, b);
	save(P, s, z);
	keep_cell(z, s, i);
}

static void
apply(const hl_opt_problem *P, hl_opt_state *s, const snap *z)
{
	hl_opt_eval_set(P, s, z->A, z->na, z->B, z->nb);
}

static size_t
count_active(const hl_opt_problem *P, const hl_opt_state *s)
{
	(void)P;
	return s->nact;
}

/* A cell with a unit, uniformly: by rejection while units are not too
 * rare, else by a scan. */
static size_t
any_active(const hl_opt_problem *P, const hl_opt_state *s, rng *r)
{
	size_t i, m = P->S * P->nh * P->nc, t, nth;

	for (t = 0; t < 64 * (m / (s->nact + 1) + 1); t++) {
		i = pick(r, m);
		if (s->q[i] > HL_OPT_QEPS)
			return i;
	}
	nth = pick(r, s->nact);
	for (i = 0; i < m; i++)
		if (s->q[i] > HL_OPT_QEPS && nth-- == 0)
			return i;
	return 0;
}

/* The last stage with a unit on hot stream a (-1: none) and the first on
 * cold stream b (S: none): a unit between them takes heat from a's cold end
 * to b's hot end, where the two streams' utilities work. */
static long
last_hot(const hl_opt_problem *P, const hl_opt_state *s, size_t a)
{
	size_t k, b;

	for (k = P->S; k-- > 0;)
		for (b = 0; b < P->nc; b++)
			if (s->q[HL_OPT_CELL(P, k, a, b)] > HL_OPT_QEPS)
				return (long)k;
	return -1;
}

static long
first_cold(const hl_opt_problem *P, const hl_opt_state *s, size_t b)
{
	size_t k, a;

	for (k = 0; k < P->S; k++)
		for (a = 0; a < P->nh; a++)
			if (s->q[HL_OPT_CELL(P, k, a, b)] > HL_OPT_QEPS)
				return (long)k;
	return (long)P->S;
}

/* The most a unit between hot stream a's cold end and cold stream b's hot
 * end (after all their units) can exchange at the required approach, at
 * most what their utilities still carry. */
static double
end_load(const hl_opt_problem *P, const hl_opt_state *s, size_t a, size_t b)
{
	const hl_stream *hs = &P->c->stream[P->hot[a]];
	const hl_stream *cs = &P->c->stream[P->cold[b]];
	double th = s->th[a * (P->S + 1) + P->S], tc = s->tc[b * (P->S + 1)];
	double e = hl_opt_emat(P, a, b);
	double qh, qc;

	if (s->hend[a] <= 0.0 || s->cend[b] <= 0.0 || th - tc <= e)
		return 0.0;
	qh = hl_stream_heat_at(hs, fmax(tc + e, hl_stream_target(hs))) -
	    hl_stream_heat_at(hs, th);
	qc = hl_stream_heat_at(cs, fmin(th - e, hl_stream_target(cs))) -
	    hl_stream_heat_at(cs, tc);
	return fmax(0.0, fmin(fmin(qh, qc), fmin(s->hend[a], s->cend[b])));
}

/* The stage whose place in the temperature span matches t: stages spread
 * evenly from the hottest supply to the coldest, so that units placed by
 * their temperatures fall into one order on every stream. */
static long
temp_stage(const hl_opt_problem *P, double t)
{
	double x = (P->t_top - t) / fmax(P->t_top - P->t_bot, 1e-9);
	long k = (long)floor(x * (double)P->S);

	return k < 0 ? 0 : k >= (long)P->S ? (long)P->S - 1 : k;
}

/* The first stage with a unit on hot stream a (S: none). */
static long
first_hot(const hl_opt_problem *P, const hl_opt_state *s, size_t a)
{
	size_t k, b;

	for (k = 0; k < P->S; k++)
		for (b = 0; b < P->nc; b++)
			if (s->q[HL_OPT_CELL(P, k, a, b)] > HL_OPT_QEPS)
				return (long)k;
	return (long)P->S;
}

/* The most a unit at hot stream a's hot end (before all its units) and cold
 * stream b's hot end can exchange at the required approach, at most what
 * both streams' utilities carry (a's other units then work lower). */
static double
top_load(const hl_opt_problem *P, const hl_opt_state *s, size_t a, size_t b)
{
	const hl_stream *hs = &P->c->stream[P->hot[a]];
	const hl_stream *cs = &P->c->stream[P->cold[b]];
	double th = hl_stream_supply(hs), tc = s->tc[b * (P->S + 1)];
	double e = hl_opt_emat(P, a, b);
	double qh, qc;

	if (s->hend[a] <= 0.0 || s->cend[b] <= 0.0 || th - tc <= e)
		return 0.0;
	qh = hl_stream_heat_at(hs, fmax(tc + e, hl_stream_target(hs)));
	qc = hl_stream_heat_at(cs, fmin(th - e, hl_stream_target(cs))) -
	    hl_stream_heat_at(cs, tc);
	return fmax(0.0, fmin(fmin(qh, qc), fmin(s->hend[a], s->cend[b])));
}

/* A stage for a new unit of (a, b): by the temperature where a's cold end
 * is, kept between a's last and b's first unit when there is room;
 * sometimes anywhere in that room, or at random. */
static size_t
new_stage(const hl_opt_problem *P, const hl_opt_state *s, size_t a, size_t b,
	  double u)
{
	long lo = last_hot(P, s, a) + 1, hi = first_cold(P, s, b) - 1;
	long k = temp_stage(P, s->th[a * (P->S + 1) + P->S]);

	if (u < 0.2 || lo > hi)
		return u < 0.1 ? (size_t)(10.0 * u * (double)P->S) % P->S :
		    (size_t)k;
	if (u < 0.6)
		return (size_t)(k < lo ? lo : k > hi ? hi : k);
	return (size_t)lo + (size_t)(u * (double)(hi - lo + 1)) %
	    (size_t)(hi - lo + 1);
}

/* Set cell i to q (0 removes the unit, unless it must stay); a new unit
 * starts as an isothermal branch. */
static void
set_load(hl_opt_state *s, size_t i, double q)
{
	if (!(q > HL_OPT_QEPS))
		q = s->keep[i] ? s->q[i] : 0.0;
	if (!(s->q[i] > HL_OPT_QEPS))
		s->wh[i] = s->wc[i] = 1.0;
	s->q[i] = q;
}

/* Branches in stage k of cell i's hot (side 0) or cold stream. */
static int
branches(const hl_opt_problem *P, const hl_opt_state *s, size_t i, int side)
{
	size_t k = i / (P->nh * P->nc), a = (i / P->nc) % P->nh, b = i % P->nc;
	size_t x;
	int n = 0;

	if (side == 0) {
		for (x = 0; x < P->nc; x++)
			n += s->q[HL_OPT_CELL(P, k, a, x)] > HL_OPT_QEPS;
	} else {
		for (x = 0; x < P->nh; x++)
			n += s->q[HL_OPT_CELL(P, k, x, b)] > HL_OPT_QEPS;
	}
	return n;
}

/* Start a move on one stream only (hot a: side 0, cold b: side 1). */
static void
begin_stream(const hl_opt_problem *P, const hl_opt_state *s, snap *z,
	     int side, size_t j)
{
	z->na = z->nb = 0;
	if (side == 0)
		add_a(z, j);
	else
		add_b(z, j);
	save(P, s, z);
}

/* The utility inside cell i's hot (side 0) or cold stream after stage k's
 * process units: its load, and the end utility it would take from. */
static double *
mid_of(const hl_opt_problem *P, hl_opt_state *s, size_t i, int side,
       double *end)
{
	size_t k = i / (P->nh * P->nc), a = (i / P->nc) % P->nh, b = i % P->nc;

	*end = side == 0 ? s->hend[a] : s->cend[b];
	return side == 0 ? &s->uh[a * P->S + k] : &s->uc[b * P->S + k];
}

/* Move a utility inside a stream: a part of the end's utility after a
 * stage's process units, or back to the end, or a change of its load. */
static int
move_mid(const hl_opt_problem *P, hl_opt_state *s, snap *z, rng *r)
{
	size_t i = any_active(P, s, r);
	int side = unif(r) < 0.5;
	size_t j = side == 0 ? (i / P->nc) % P->nh : i % P->nc;
	double end, *u, x = unif(r);

	begin_stream(P, s, z, side, j);
	u = mid_of(P, s, i, side, &end);
	if (*u > 0.0 && x < 0.3)
		*u = 0.0;
	else if (*u > 0.0 && x < 0.5)
		*u += end;
	else if (*u > 0.0)
		*u = fmax(0.0, *u * (1.0 + (2.0 * unif(r) - 1.0) *
		    pow(10.0, -2.0 * unif(r))));
	else if (end > 0.0)
		*u = end * sqrt(unif(r));
	else
		return 0;
	return 1;
}

/* Change the flow shares of a split: one branch's weight by up to a
 * factor of 3 either way. */
static int
move_weight(const hl_opt_problem *P, hl_opt_state *s, snap *z, rng *r)
{
	size_t i = any_active(P, s, r);
	int side = unif(r) < 0.5;
	double f = pow(3.0, 2.0 * unif(r) - 1.0);

	if (branches(P, s, i, side) < 2)
		return 0;
	begin(P, s, z, i);
	if (side == 0)
		s->wh[i] *= f;
	else
		s->wc[i] *= f;
	return 1;
}

/* The utility left at the two ends of cell i's streams (kW). */
static void
ends_of(const hl_opt_problem *P, const hl_opt_state *s, size_t i,
	double *hend, double *cend)
{
	*hend = s->hend[(i / P->nc) % P->nh];
	*cend = s->cend[i % P->nc];
}

/* One random move; returns 0 when none applies. */
static int
move(const hl_opt_problem *P, hl_opt_state *s, snap *z, rng *r)
{
	size_t n = count_active(P, s), i;
	double u = unif(r), he, ce;

	if (n > 1 && u > 0.95) {          /* every load at once */
		size_t m = P->S * P->nh * P->nc;
		double step = 0.05 * P->qscale * pow(10.0, -2.0 * unif(r));

		z->na = z->nb = 0;
		hl_opt_state_copy(P, z->full, s);
		for (i = 0; i < m; i++)
			if (s->q[i] > HL_OPT_QEPS)
				set_load(s, i, s->q[i] + (2.0 * unif(r) - 1.0) *
				    step);
		return 2;
	}
	if (n == 0 || u < 0.2) {          /* a new unit */
		size_t a = pick(r, P->nh), b = pick(r, P->nc), k;

		if (!P->allow[a * P->nc + b])
			return 0;
		k = new_stage(P, s, a, b, unif(r));
		i = HL_OPT_CELL(P, k, a, b);
		he = end_load(P, s, a, b);
		begin(P, s, z, i);
		set_load(s, i, s->q[i] + (he > HL_OPT_QEPS ? he *
		    sqrt(unif(r)) : 0.1 * P->qscale * unif(r)));
		return 1;
	}
	if (u < 0.28)
		return move_weight(P, s, z, r);
	if (u < 0.36)
		return move_mid(P, s, z, r);
	i = any_active(P, s, r);
	begin(P, s, z, i);
	if (u < 0.46) {                   /* remove */
		set_load(s, i, 0.0);
	} else if (u < 0.54) {            /* close an end */
		ends_of(P, s, i, &he, &ce);
		set_load(s, i, s->q[i] + (unif(r) < 0.5 ? he : ce));
	} else if (u < 0.62) {            /* to the next stage */
		size_t k = i / (P->nh * P->nc), j;

		k = unif(r) < 0.5 ? (k == 0 ? 1 : k - 1) :
		    (k + 1 == P->S ? k - 1 : k + 1);
		j = HL_OPT_CELL(P, k, (i / P->nc) % P->nh, i % P->nc);
		if (s->keep[i])
			return 0;
		keep_cell(z, s, j);
		if (!(s->q[j] > HL_OPT_QEPS)) {
			s->wh[j] = s->wh[i];
			s->wc[j] = s->wc[i];
		}
		s->q[j] += s->q[i];
		s->q[i] = 0.0;
	} else if (u < 0.70) {            /* part of it to another stage */
		size_t k = i / (P->nh * P->nc), kk = pick(r, P->S), j;
		double f = 0.1 + 0.8 * unif(r);

		if (kk == k)
			return 0;
		j = HL_OPT_CELL(P, kk, (i / P->nc) % P->nh, i % P->nc);
		keep_cell(z, s, j);
		if (!(s->q[j] > HL_OPT_QEPS))
			s->wh[j] = s->wc[j] = 1.0;
		s->q[j] += f * s->q[i];
		s->q[i] -= f * s->q[i];
	} else {                          /* perturb the load */
		double step = 0.5 * P->qscale * pow(10.0, -3.0 * unif(r));

		set_load(s, i, s->q[i] + (2.0 * unif(r) - 1.0) * step);
	}
	return 1;
}

static int
acceptable(const hl_opt_state *t, const hl_opt_state *cur, rng *r)
{
	if (hl_opt_better(t, cur))
		return 1;
	if (t->v > 1e-9 || cur->v > 1e-9)
		return 0;
	return t->tac < cur->tac * (1.0 + ACCEPT_WORSE) &&
	    unif(r) < ACCEPT_PROB;
}

/* Keep the state a move made when better than the snapshot's, else undo
 * it. */
static int
keep_if_better(const hl_opt_problem *P, hl_opt_state *s, snap *z,
	       size_t *evals)
{
	apply(P, s, z);
	(*evals)++;
	if (z->v > 1e-9 ? s->v < z->v - 1e-9 || (s->v <= z->v + 1e-9 &&
	    s->tac < z->tac - 1e-9 * fabs(z->tac)) : s->v <= 1e-9 &&
	    s->tac < z->tac - 1e-9 * fmax(1.0, fabs(z->tac)))
		return 1;
	restore(P, s, z);
	return 0;
}

/* Try cell i at load q; keep it when better. */
static int
try_load(const hl_opt_problem *P, hl_opt_state *s, snap *z, size_t i,
	 double q, size_t *evals)
{
	begin(P, s, z, i);
	set_load(s, i, q);
	return keep_if_better(P, s, z, evals);
}

/* The polish's variables, one index space: loads (m cells), hot and cold
 * branch weights (m each), then the utilities inside the hot and the cold
 * streams (S per stream). */
enum { VAR_LOAD, VAR_WH, VAR_WC, VAR_UH, VAR_UC };
#define IS_WEIGHT(k) ((k) == VAR_WH || (k) == VAR_WC)
static double *
var_at(const hl_opt_problem *P, hl_opt_state *s, size_t v, int *kind,
       size_t *cellp)
{
	size_t m = P->S * P->nh * P->nc;

	*cellp = v % m;
	if (v < 3 * m) {
		*kind = (int)(v / m);
		return v < m ? &s->q[v] : v < 2 * m ? &s->wh[v - m] :
		    &s->wc[v - 2 * m];
	}
	v -= 3 * m;
	*kind = v < P->nh * P->S ? VAR_UH : VAR_UC;
	*cellp = v < P->nh * P->S ? v / P->S : (v - P->nh * P->S) / P->S;
	return v < P->nh * P->S ? &s->uh[v] : &s->uc[v - P->nh * P->S];
}

/* Try variable v at x; keep it when better. */
static int
try_var(const hl_opt_problem *P, hl_opt_state *s, snap *z, size_t v,
	double x, size_t *evals)
{
	size_t j;
	int kind;

	var_at(P, s, v, &kind, &j);
	if (kind == VAR_LOAD)
		return try_load(P, s, z, j, x, evals);
	if (IS_WEIGHT(kind))
		begin(P, s, z, j);
	else
		begin_stream(P, s, z, kind == VAR_UH ? 0 : 1, j);
	*var_at(P, s, v, &kind, &j) = x;
	return keep_if_better(P, s, z, evals);
}

/* One compass step on variable v with step h[v]: loads first try to take
 * all their ends' utility, utilities inside a stream to take all of the
 * end's or to leave; weights step by a factor. */
static void
polish_var(const hl_opt_problem *P, hl_opt_state *s, snap *z, size_t v,
	   double *h, size_t *evals)
{
	size_t j;
	int kind;
	double x = *var_at(P, s, v, &kind, &j), he, ce;

	if (kind == VAR_LOAD) {
		ends_of(P, s, j, &he, &ce);
		if ((he > 0.0 && try_load(P, s, z, j, x + he, evals)) ||
		    (ce > 0.0 && ce != he && try_load(P, s, z, j, x + ce,
		    evals)))
			return;
	} else if (!IS_WEIGHT(kind)) {
		double end = kind == VAR_UH ? s->hend[j] : s->cend[j];

		if ((end > 0.0 && try_var(P, s, z, v, x + end, evals)) ||
		    try_var(P, s, z, v, 0.0, evals))
			return;
	}
	if (h[v] < (IS_WEIGHT(kind) ? 1e-9 : 1e-9 * P->qscale))
		return;
	if (IS_WEIGHT(kind) ? try_var(P, s, z, v, x * (1.0 + h[v]),
	    evals) || try_var(P, s, z, v, x / (1.0 + h[v]), evals) :
	    try_var(P, s, z, v, x + h[v], evals) ||
	    try_var(P, s, z, v, fmax(0.0, x - h[v]), evals))
		h[v] = fmin(2.0 * h[v], IS_WEIGHT(kind) ? 1.0 : HUGE_VAL);
	else
		h[v] *= 0.5;
}

/* A variable the polish moves: a unit's load, the weight of a branch of a
 * split, a utility inside a stream. */
static int
var_live(const hl_opt_problem *P, hl_opt_state *s, size_t v)
{
	size_t j;
	int kind;
	double x = *var_at(P, s, v, &kind, &j);

	if (IS_WEIGHT(kind))
		return s->q[j] > HL_OPT_QEPS &&
		    branches(P, s, j, kind == VAR_WH ? 0 : 1) > 1;
	return x > (kind == VAR_LOAD ? HL_OPT_QEPS : 0.0);
}

/* What a candidate of the greedy construction is worth: the cost it saves
 * per kelvin of mean approach to the power `power`, so that heat goes where it is needed at the
 * temperature it has (a tight match leaves the hotter heat for hotter
 * needs). */
static double
score(const hl_opt_problem *P, const hl_opt_state *s, size_t i, double before,
      double power)
{
	size_t k = i / (P->nh * P->nc), a = (i / P->nc) % P->nh, b = i % P->nc;
	const double *th = &s->th[a * (P->S + 1)], *tc = &s->tc[b * (P->S + 1)];
	double dm = 0.5 * ((th[k] - tc[k]) + (th[k + 1] - tc[k + 1]));

	return (before - s->tac) / pow(fmax(dm, 1e-3), power);
}

/* Greedy construction: of the units that lower the cost (pair; the stage
 * of the hot stream's cold-end temperature, or that stage moved between the
 * hot stream's last and the cold stream's first unit, or before both
 * streams' units; all or half of what the two ends can exchange), add the
 * one of best score, until none lowers the cost. */
size_t
hl_opt_greedy(const hl_opt_problem *P, hl_opt_state *s, size_t max,
	      double power)
{
	size_t evals = 0, a, b, f, t;
	size_t ks[3];
	snap z;

	if (!snap_init(P, &z))
		return 0;
	while (evals < max) {
		size_t bi = 0;
		double bq = 0.0, bs = 0.0, bv = s->v, sc;

		for (a = 0; a < P->nh; a++)
			for (b = 0; b < P->nc; b++) {
				double m = end_load(P, s, a, b);
				double mt = top_load(P, s, a, b);
				long lo, hi, ft;

				if (!P->allow[a * P->nc + b] || (m <= HL_OPT_QEPS &&
				    mt <= HL_OPT_QEPS))
					continue;
				ft = first_hot(P, s, a);
				if (first_cold(P, s, b) < ft)
					ft = first_cold(P, s, b);
				ks[2] = (size_t)(ft > 0 ? ft - 1 : 0);
				lo = last_hot(P, s, a) + 1;
				hi = first_cold(P, s, b) - 1;
				ks[0] = (size_t)temp_stage(P,
				    s->th[a * (P->S + 1) + P->S]);
				if (lo > hi)
					lo = hi = (long)ks[0];
				ks[1] = (size_t)(ks[0] < (size_t)lo ? lo :
				    ks[0] > (size_t)hi ? hi : (long)ks[0]);
				for (t = 0; t < 3; t++)
					for (f = 0; f < 2; f++) {
						size_t i = HL_OPT_CELL(P, ks[t], a,
						    b);
						double w = t == 2 ? mt : m;
						double q = s->q[i] + (f == 0 ? w :
						    0.5 * w);

						if ((t == 1 && ks[1] == ks[0]) ||
						    w <= HL_OPT_QEPS)
							continue;
						begin(P, s, &z, i);
						set_load(s, i, q);
						apply(P, s, &z);
						evals++;
						sc = score(P, s, i, z.tac, power);
						if (s->v < bv - 1e-9 || (s->v <= bv +
						    1e-9 && s->tac < z.tac - 1e-9 *
						    fabs(z.tac) && sc > bs)) {
							bi = i + 1;
							bq = q;
							bs = sc;
							bv = s->v;
						}
						restore(P, s, &z);
					}
			}
		if (bi == 0)
			break;
		begin(P, s, &z, bi - 1);
		set_load(s, bi - 1, bq);
		apply(P, s, &z);
	}
	snap_free(&z);
	return evals;
}

size_t
hl_opt_polish(const hl_opt_problem *P, hl_opt_state *s, size_t max)
{
	size_t m = P->S * P->nh * P->nc, n = 3 * m + (P->nh + P->nc) * P->S;
	size_t v, j, evals = 0;
	double *h = calloc(n + 1, sizeof *h), hmax;
	int kind;
	snap z;

	if (h == NULL || !snap_init(P, &z)) {
		free(h);
		return 0;
	}
	for (v = 0; v < n; v++) {
		double x = *var_at(P, s, v, &kind, &j);

		h[v] = IS_WEIGHT(kind) ? 0.2 : 0.1 * x;
	}
	do {
		hmax = 0.0;
		for (v = 0; v < n && evals < max; v++) {
			if (!var_live(P, s, v))
				continue;
			polish_var(P, s, &z, v, h, &evals);
			var_at(P, s, v, &kind, &j);
			hmax = fmax(hmax, IS_WEIGHT(kind) ?
			    h[v] * P->qscale : h[v]);
		}
	} while (hmax >= 1e-9 * P->qscale && evals < max);
	snap_free(&z);
	free(h);
	return evals;
}

/* A restart's kick (iterated local search, Lourenço, Martin & Stützle
 * 2003): one to three units of the best state out, their heat back to the
 * utilities, so that the walk leaves the best state's basin. */
static void
kick(const hl_opt_problem *P, hl_opt_state *s, rng *r)
{
	size_t n = 1 + pick(r, 3), t;

	for (t = 0; t < n && s->nact > 1; t++) {
		size_t i = any_active(P, s, r);

		if (!s->keep[i])
			s->q[i] = 0.0;
		hl_opt_eval_all(P, s);
	}
}

size_t
hl_opt_walk(const hl_opt_problem *P, hl_opt_state *s, hl_opt_state *best,
	    uint64_t seed, size_t max, double deadline, int *capped)
{
	rng r = { seed };
	size_t evals = 0, stall = 0;
	size_t restart = 400 + 40 * (P->nh + P->nc);
	hl_opt_state full;
	snap z;
	int kind;

	if (!snap_init(P, &z))
		return 0;
	if (hl_opt_state_init(P, &full) != HL_OK) {
		snap_free(&z);
		return 0;
	}
	z.full = &full;
	hl_opt_state_copy(P, best, s);
	while (evals < max) {
		if ((evals & 255) == 0 && deadline > 0.0 &&
		    hl_opt_now() > deadline) {
			*capped = 1;
			break;
		}
		kind = move(P, s, &z, &r);
		if (kind == 0) {
			evals++;
			continue;
		}
		if (kind == 2) {
			hl_opt_eval_all(P, s);
			z.v = z.full->v;
			z.tac = z.full->tac;
		} else {
			apply(P, s, &z);
		}
		evals++;
		if (!acceptable(s, (const hl_opt_state *)&(hl_opt_state){
		    .v = z.v, .tac = z.tac }, &r)) {
			if (kind == 2)
				hl_opt_state_copy(P, s, z.full);
			else
				restore(P, s, &z);
		} else if (hl_opt_better(s, best)) {
			evals += hl_opt_polish(P, s, 60 * count_active(P, s) +
			    100);
			hl_opt_state_copy(P, best, s);
			stall = 0;
			continue;
		}
		if (++stall > restart) {
			hl_opt_state_copy(P, s, best);
			kick(P, s, &r);
			stall = 0;
		}
	}
	snap_free(&z);
	hl_opt_state_free(&full);
	return evals;
}
