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
#define ACCEPT_PROB 0.05

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
	double q, c, v;
	unsigned char act;
} cell_save;

typedef struct {
	size_t na, nb, A[2], B[2];
	cell_save *cs;
	size_t ncs;
	double *ta, *tb;  /* temperatures */
	double hs[2][4], cs2[2][4];
	long hu[2], cu[2];
	double v, tac, ccap, cvsum;
	size_t nact;
	hl_opt_state *full;  /* the whole state, for a move on every load */
} snap;

static int
snap_init(const hl_opt_problem *P, snap *z)
{
	memset(z, 0, sizeof *z);
	z->cs = malloc((2 * P->S * (P->nc + P->nh) + 8) * sizeof *z->cs);
	z->ta = malloc((2 * (P->S + 1)) * sizeof *z->ta);
	z->tb = malloc((2 * (P->S + 1)) * sizeof *z->tb);
	return z->cs != NULL && z->ta != NULL && z->tb != NULL;
}

static void
snap_free(snap *z)
{
	free(z->cs);
	free(z->ta);
	free(z->tb);
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
	c->act = s->act[i];
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
		memcpy(z->ta + i * (S + 1), s->th + a * (S + 1),
		    (S + 1) * sizeof *z->ta);
		z->hs[i][0] = s->hviol[a];
		z->hs[i][1] = s->hend[a];
		z->hs[i][2] = s->hecost[a];
		z->hs[i][3] = s->heviol[a];
		z->hu[i] = s->hutil[a];
	}
	for (i = 0; i < z->nb; i++) {
		size_t b = z->B[i];

		for (k = 0; k < S; k++)
			for (x = 0; x < P->nh; x++) {
				size_t j = HL_OPT_CELL(P, k, x, b);

				if (s->act[j] || s->q[j] > 0.0 || s->keep[j])
					keep_cell(z, s, j);
			}
		memcpy(z->tb + i * (S + 1), s->tc + b * (S + 1),
		    (S + 1) * sizeof *z->tb);
		z->cs2[i][0] = s->cvs[b];
		z->cs2[i][1] = s->cend[b];
		z->cs2[i][2] = s->cecost[b];
		z->cs2[i][3] = s->ceviol[b];
		z->cu[i] = s->cutil[b];
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
	size_t i, S = P->S;

	for (i = z->ncs; i-- > 0;) {
		const cell_save *c = &z->cs[i];

		s->q[c->i] = c->q;
		s->ccost[c->i] = c->c;
		s->cviol[c->i] = c->v;
		s->act[c->i] = c->act;
	}
	for (i = 0; i < z->na; i++) {
		size_t a = z->A[i];

		memcpy(s->th + a * (S + 1), z->ta + i * (S + 1),
		    (S + 1) * sizeof *z->ta);
		s->hviol[a] = z->hs[i][0];
		s->hend[a] = z->hs[i][1];
		s->hecost[a] = z->hs[i][2];
		s->heviol[a] = z->hs[i][3];
		s->hutil[a] = z->hu[i];
	}
	for (i = 0; i < z->nb; i++) {
		size_t b = z->B[i];

		memcpy(s->tc + b * (S + 1), z->tb + i * (S + 1),
		    (S + 1) * sizeof *z->tb);
		s->cvs[b] = z->cs2[i][0];
		s->cend[b] = z->cs2[i][1];
		s->cecost[b] = z->cs2[i][2];
		s->ceviol[b] = z->cs2[i][3];
		s->cutil[b] = z->cu[i];
	}
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
	double e = hl_network_required(&P->base->set,
	    &P->base->party[P->hot[a]], &P->base->party[P->cold[b]]);
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
	double e = hl_network_required(&P->base->set,
	    &P->base->party[P->hot[a]], &P->base->party[P->cold[b]]);
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

/* Set cell i to q (0 removes the unit, unless it must stay). */
static void
set_load(hl_opt_state *s, size_t i, double q)
{
	if (!(q > HL_OPT_QEPS))
		q = s->keep[i] ? s->q[i] : 0.0;
	s->q[i] = q;
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
	i = any_active(P, s, r);
	begin(P, s, z, i);
	if (u < 0.3) {                    /* remove */
		set_load(s, i, 0.0);
	} else if (u < 0.4) {             /* close an end */
		ends_of(P, s, i, &he, &ce);
		set_load(s, i, s->q[i] + (unif(r) < 0.5 ? he : ce));
	} else if (u < 0.5) {             /* to the next stage */
		size_t k = i / (P->nh * P->nc), j;

		k = unif(r) < 0.5 ? (k == 0 ? 1 : k - 1) :
		    (k + 1 == P->S ? k - 1 : k + 1);
		j = HL_OPT_CELL(P, k, (i / P->nc) % P->nh, i % P->nc);
		if (s->keep[i])
			return 0;
		keep_cell(z, s, j);
		s->q[j] += s->q[i];
		s->q[i] = 0.0;
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

/* Try cell i at load q; keep it when better. */
static int
try_load(const hl_opt_problem *P, hl_opt_state *s, snap *z, size_t i,
	 double q, size_t *evals)
{
	begin(P, s, z, i);
	set_load(s, i, q);
	apply(P, s, z);
	(*evals)++;
	if (z->v > 1e-9 ? s->v < z->v - 1e-9 || (s->v <= z->v + 1e-9 &&
	    s->tac < z->tac - 1e-9 * fabs(z->tac)) : s->v <= 1e-9 &&
	    s->tac < z->tac - 1e-9 * fmax(1.0, fabs(z->tac)))
		return 1;
	restore(P, s, z);
	return 0;
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
	size_t m = P->S * P->nh * P->nc, i, evals = 0;
	double *h = calloc(m + 1, sizeof *h), hmax;
	snap z;

	if (h == NULL || !snap_init(P, &z)) {
		free(h);
		return 0;
	}
	for (i = 0; i < m; i++)
		h[i] = 0.1 * s->q[i];
	do {
		hmax = 0.0;
		for (i = 0; i < m && evals < max; i++) {
			double he, ce, q = s->q[i];

			if (!(q > HL_OPT_QEPS))
				continue;
			ends_of(P, s, i, &he, &ce);
			if ((he > 0.0 && try_load(P, s, &z, i, q + he,
			    &evals)) || (ce > 0.0 && ce != he &&
			    try_load(P, s, &z, i, q + ce, &evals)))
				continue;
			if (h[i] < 1e-9 * P->qscale)
				continue;
			if (try_load(P, s, &z, i, q + h[i], &evals) ||
			    try_load(P, s, &z, i, q - h[i], &evals))
				h[i] *= 2.0;
			else
				h[i] *= 0.5;
			hmax = fmax(hmax, h[i]);
		}
	} while (hmax >= 1e-9 * P->qscale && evals < max);
	snap_free(&z);
	free(h);
	return evals;
}

size_t
hl_opt_walk(const hl_opt_problem *P, hl_opt_state *s, hl_opt_state *best,
	    uint64_t seed, size_t max, double deadline, int *capped)
{
	rng r = { seed };
	size_t evals = 0, stall = 0;
	size_t restart = 200 + 20 * (P->nh + P->nc);
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
			stall = 0;
		}
	}
	snap_free(&z);
	hl_opt_state_free(&full);
	return evals;
}
