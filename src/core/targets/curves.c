/* curves.c - composite, grand composite and balanced composite curves
 * (see curves.h for the definitions and sources). */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "curves.h"
#include "sorted.h"

static void
curve_clear(hl_curve *cv)
{
	free(cv->h);
	free(cv->t);
	cv->h = cv->t = NULL;
	cv->n = 0;
}

static int
curve_alloc(hl_curve *cv, size_t n)
{
	cv->n = 0;
	cv->h = malloc((n ? n : 1) * sizeof *cv->h);
	cv->t = malloc((n ? n : 1) * sizeof *cv->t);
	if (cv->h == NULL || cv->t == NULL) {
		curve_clear(cv);
		return 0;
	}
	return 1;
}

static void
push(hl_curve *cv, double h, double t)
{
	cv->h[cv->n] = h;
	cv->t[cv->n] = t;
	cv->n++;
}

/* Sorted unique end temperatures of the pieces that carry heat. */
static double *
piece_temps(const hl_curve_piece *p, size_t n, size_t *m)
{
	double *t = malloc((2 * n + 1) * sizeof *t);
	size_t i, k = 0;

	if (t == NULL)
		return NULL;
	for (i = 0; i < n; i++) {
		if (!(p[i].q > 0.0))
			continue;
		t[k++] = p[i].t_hi;
		t[k++] = p[i].t_lo;
	}
	*m = hl_sorted_unique_asc(t, k);
	return t;
}

/* Walk up the temperatures adding each interval's cp and each step. */
static void
walk(const double *t, size_t m, const double *dcp, const double *jump,
     double h0, hl_curve *out)
{
	double h = h0, cp = 0.0;
	size_t i;

	push(out, h, t[0]);
	for (i = 0; i < m; i++) {
		if (jump[i] > 0.0) {
			h += jump[i];
			push(out, h, t[i]);
		}
		if (i + 1 < m) {
			cp += dcp[i];
			h += cp * (t[i + 1] - t[i]);
			push(out, h, t[i + 1]);
		}
	}
}

/* Composite curve by a difference array of cp over the sorted end
 * temperatures (Linnhoff et al. 1982): O(n log n). */
hl_status
hl_curves_composite(const hl_curve_piece *p, size_t n, double h0,
		    hl_curve *out, hl_error *err)
{
	double *t, *dcp = NULL, *jump = NULL;
	size_t m = 0, i;

	memset(out, 0, sizeof *out);
	t = piece_temps(p, n, &m);
	if (t != NULL) {
		dcp = calloc(m + 1, sizeof *dcp);
		jump = calloc(m + 1, sizeof *jump);
	}
	if (t == NULL || dcp == NULL || jump == NULL ||
	    !curve_alloc(out, 2 * m + 1)) {
		free(t);
		free(dcp);
		free(jump);
		return hl_error_nomem(err);
	}
	for (i = 0; i < n; i++) {
		size_t a, b;

		if (!(p[i].q > 0.0))
			continue;
		a = hl_sorted_find_asc(t, m, p[i].t_lo);
		b = hl_sorted_find_asc(t, m, p[i].t_hi);
		if (a == b) {
			jump[a] += p[i].q;
		} else {
			dcp[a] += p[i].q / (p[i].t_hi - p[i].t_lo);
			dcp[b] -= p[i].q / (p[i].t_hi - p[i].t_lo);
		}
	}
	if (m > 0)
		walk(t, m, dcp, jump, h0, out);
	free(t);
	free(dcp);
	free(jump);
	return HL_OK;
}

double
hl_curve_heat_at(const hl_curve *cv, double t)
{
	size_t lo = 0, hi = cv->n;

	if (cv->n == 0)
		return 0.0;
	while (lo < hi) {
		size_t mid = lo + (hi - lo) / 2;

		if (cv->t[mid] < t)
			lo = mid + 1;
		else
			hi = mid;
	}
	if (lo == 0)
		return cv->h[0];
	if (lo == cv->n)
		return cv->h[cv->n - 1];
	if (cv->t[lo] == t)
		return cv->h[lo];
	return cv->h[lo - 1] + (cv->h[lo] - cv->h[lo - 1]) *
	       (t - cv->t[lo - 1]) / (cv->t[lo] - cv->t[lo - 1]);
}

static size_t
count_segments(const hl_case *c)
{
	size_t i, n = 0;

	for (i = 0; i < c->nstream; i++)
		n += c->stream[i].nseg;
	return n;
}

/* Pieces of one kind of stream (and, with lp, of utility), real or shifted
 * temperatures. */
static size_t
gather(const hl_case *c, hl_kind kind, double dtmin, int shifted,
       const hl_utility_lp *lp, hl_curve_piece *p)
{
	size_t i, j, n = 0;

	for (i = 0; i < c->nstream; i++) {
		const hl_stream *s = &c->stream[i];
		double sh = shifted ? hl_stream_shift(s, dtmin) : 0.0;

		if (s->kind != kind)
			continue;
		sh = kind == HL_HOT ? -sh : sh;
		for (j = 0; j < s->nseg; j++) {
			const hl_segment *g = &s->seg[j];

			p[n].t_hi = fmax(g->supply, g->target) + sh;
			p[n].t_lo = fmin(g->supply, g->target) + sh;
			p[n].q = hl_segment_duty(g);
			n++;
		}
	}
	for (i = 0; lp != NULL && i < c->nutil; i++) {
		const hl_utility *u = &c->util[i];

		if (u->kind != kind || lp->util[i].load <= 0.0)
			continue;
		p[n].t_hi = fmax(u->supply, u->target);
		p[n].t_lo = fmin(u->supply, u->target);
		p[n].q = lp->util[i].load;
		n++;
	}
	return n;
}

static hl_status
composites(const hl_case *c, const hl_cascade *cas, const hl_utility_lp *lp,
	   hl_curves *cv, hl_curve_piece *p, hl_error *err)
{
	double dt = cas->dtmin;
	hl_status st;
	size_t n;

	n = gather(c, HL_HOT, dt, 0, NULL, p);
	st = hl_curves_composite(p, n, 0.0, &cv->hot, err);
	n = gather(c, HL_COLD, dt, 0, NULL, p);
	if (st == HL_OK)
		st = hl_curves_composite(p, n, cas->qc, &cv->cold, err);
	n = gather(c, HL_HOT, dt, 1, NULL, p);
	if (st == HL_OK)
		st = hl_curves_composite(p, n, 0.0, &cv->shifted_hot, err);
	n = gather(c, HL_COLD, dt, 1, NULL, p);
	if (st == HL_OK)
		st = hl_curves_composite(p, n, cas->qc, &cv->shifted_cold, err);
	if (st != HL_OK || lp == NULL)
		return st;
	n = gather(c, HL_HOT, dt, 0, lp, p);
	st = hl_curves_composite(p, n, 0.0, &cv->bal_hot, err);
	n = gather(c, HL_COLD, dt, 0, lp, p);
	if (st == HL_OK)
		st = hl_curves_composite(p, n, 0.0, &cv->bal_cold, err);
	return st;
}

static hl_status
grand(const hl_cascade *cas, hl_curves *cv, hl_error *err)
{
	size_t k;

	if (!curve_alloc(&cv->grand, cas->nb))
		return hl_error_nomem(err);
	for (k = 0; k < cas->nb; k++)
		push(&cv->grand, cas->flow[k], cas->t[k]);
	return HL_OK;
}

/* Used utilities of one kind as pieces on shifted temperatures. */
static size_t
utility_pieces(const hl_case *c, const hl_utility_lp *lp, hl_kind kind,
	       hl_curve_piece *p, double *total)
{
	size_t i, n = 0;

	*total = 0.0;
	for (i = 0; i < c->nutil; i++) {
		if (c->util[i].kind != kind || lp->util[i].load <= 0.0)
			continue;
		p[n].t_hi = lp->util[i].t_hi;
		p[n].t_lo = lp->util[i].t_lo;
		p[n].q = lp->util[i].load - lp->util[i].across;
		/* The part across the pinch is drawn into the grand
		 * composite (see grand_util), not beyond the pinch. */
		if (lp->util[i].across > 0.0 && kind == HL_HOT)
			p[n].t_lo = fmin(p[n].t_hi, lp->proc[0].shifted);
		else if (lp->util[i].across > 0.0)
			p[n].t_hi = fmax(p[n].t_lo,
					 lp->proc[lp->nproc - 1].shifted);
		*total += p[n].q;
		n++;
	}
	return n;
}

/* Heat of the other utilities of u's kind that lie below (hot) or above
 * (cold) u's level, the earlier ones of the same level included. */
static double
stacked_before(const hl_case *c, const hl_utility_lp *lp, size_t u)
{
	const hl_utility_load *a = &lp->util[u];
	int hot = c->util[u].kind == HL_HOT;
	double h = 0.0, t = a->t_hi;
	size_t v;

	for (v = 0; v < c->nutil; v++) {
		const hl_utility_load *b = &lp->util[v];

		if (v == u || c->util[v].kind != c->util[u].kind ||
		    b->load <= 0.0)
			continue;
		if (b->t_hi == b->t_lo) {
			if (b->t_hi == t ? v < u : (hot ? b->t_hi < t : b->t_hi > t))
				h += b->load;
		} else if (hot) {
			h += b->load * fmin(1, fmax(0, (t - b->t_lo) /
						    (b->t_hi - b->t_lo)));
		} else {
			h += b->load * fmin(1, fmax(0, (b->t_hi - t) /
						    (b->t_hi - b->t_lo)));
		}
	}
	return h;
}

static void
place_levels(const hl_case *c, const hl_utility_lp *lp, hl_curves *cv,
	     double cold_total, const hl_curve *below)
{
	size_t u;

	for (u = 0; u < c->nutil; u++) {
		const hl_utility_load *a = &lp->util[u];
		hl_curve_level *l = &cv->level[cv->nlevel];
		double mid = 0.5 * (a->t_hi + a->t_lo);

		if (a->load <= 0.0)
			continue;
		l->util = u;
		l->t = mid;
		if (a->t_hi == a->t_lo)
			l->h = stacked_before(c, lp, u) + a->load / 2.0;
		else if (c->util[u].kind == HL_HOT)
			l->h = hl_curve_heat_at(&cv->hot_util, mid);
		else
			l->h = cold_total - hl_curve_heat_at(below, mid);
		cv->nlevel++;
	}
}

/* Heat utility u exchanges on the far side of the pinch between the pinch
 * and shifted t (hot: below the hottest pinch, cold: above the coldest). */
static double
across_part(const hl_case *c, const hl_utility_lp *lp, size_t u, double t)
{
	const hl_utility_load *a = &lp->util[u];
	double span = a->t_hi - a->t_lo, pin, lo, hi;

	if (a->across <= 0.0 || lp->nproc == 0)
		return 0.0;
	if (c->util[u].kind == HL_HOT) {
		pin = lp->proc[0].shifted;
		if (span <= 0.0)
			return t < a->t_hi ? a->load : 0.0;
		lo = fmax(t, a->t_lo);
		hi = fmin(pin, a->t_hi);
	} else {
		pin = lp->proc[lp->nproc - 1].shifted;
		if (span <= 0.0)
			return t > a->t_lo ? a->load : 0.0;
		lo = fmax(pin, a->t_lo);
		hi = fmin(t, a->t_hi);
	}
	return hi > lo ? a->load * (hi - lo) / span : 0.0;
}

static double
curve_value(const hl_curve *g, double t)
{
	size_t k;

	for (k = 0; k + 1 < g->n; k++)
		if (t <= g->t[k] && t >= g->t[k + 1])
			return g->t[k] == g->t[k + 1] ? g->h[k + 1] : g->h[k] +
			       (g->h[k + 1] - g->h[k]) * (g->t[k] - t) /
			       (g->t[k] - g->t[k + 1]);
	return g->n == 0 ? 0.0 : t > g->t[0] ? g->h[0] : g->h[g->n - 1];
}

/* The grand composite with the heat the utility ranges put across the
 * pinch: one accounting with the LP's loads (its foot is the cold load
 * when only hot ranges cross). Empty when no utility crosses. */
static hl_status
grand_util(const hl_case *c, const hl_utility_lp *lp, hl_curves *cv,
	   hl_error *err)
{
	double *t;
	size_t i, n = 0, m;

	if (lp->range_rise <= 0.0 || lp->nproc == 0)
		return HL_OK;
	t = malloc((cv->grand.n + 2 * c->nutil + 2) * sizeof *t);
	if (t == NULL || !curve_alloc(&cv->grand_util, cv->grand.n +
				      2 * c->nutil + 2)) {
		free(t);
		return hl_error_nomem(err);
	}
	for (i = 0; i < cv->grand.n; i++)
		t[n++] = cv->grand.t[i];
	for (i = 0; i < c->nutil; i++)
		if (lp->util[i].across > 0.0) {
			double top = cv->grand.t[0];
			double foot = cv->grand.t[cv->grand.n - 1];

			if (lp->util[i].t_hi < top && lp->util[i].t_hi > foot)
				t[n++] = lp->util[i].t_hi;
			if (lp->util[i].t_lo < top && lp->util[i].t_lo > foot)
				t[n++] = lp->util[i].t_lo;
		}
	m = hl_sorted_unique_desc(t, n);
	for (i = 0; i < m; i++) {
		double h = curve_value(&cv->grand, t[i]);
		size_t u;

		for (u = 0; u < c->nutil; u++)
			h += across_part(c, lp, u, t[i]);
		push(&cv->grand_util, h, t[i]);
	}
	free(t);
	return HL_OK;
}

/* The utility composites against the grand composite. The cold one is
 * built rising (heat taken below T) and turned into heat taken above T. */
static hl_status
utility_curves(const hl_case *c, const hl_utility_lp *lp, hl_curves *cv,
	       hl_curve_piece *p, hl_error *err)
{
	hl_curve below = { 0, NULL, NULL };
	double hot_total, cold_total;
	size_t n, i;
	hl_status st;

	n = utility_pieces(c, lp, HL_HOT, p, &hot_total);
	st = hl_curves_composite(p, n, 0.0, &cv->hot_util, err);
	n = utility_pieces(c, lp, HL_COLD, p, &cold_total);
	if (st == HL_OK)
		st = hl_curves_composite(p, n, 0.0, &below, err);
	if (st == HL_OK && !curve_alloc(&cv->cold_util, below.n))
		st = hl_error_nomem(err);
	if (st == HL_OK)
		cv->level = malloc((c->nutil + 1) * sizeof *cv->level);
	if (st == HL_OK && cv->level == NULL)
		st = hl_error_nomem(err);
	if (st != HL_OK) {
		curve_clear(&below);
		return st;
	}
	for (i = below.n; i-- > 0;)
		push(&cv->cold_util, cold_total - below.h[i], below.t[i]);
	place_levels(c, lp, cv, cold_total, &below);
	curve_clear(&below);
	return HL_OK;
}

hl_status
hl_curves_compute(const hl_case *c, const hl_cascade *cas,
		  const hl_utility_lp *lp, hl_curves **out, hl_error *err)
{
	hl_curves *cv = calloc(1, sizeof *cv);
	hl_curve_piece *p;
	hl_status st;

	*out = NULL;
	p = malloc((count_segments(c) + c->nutil + 1) * sizeof *p);
	if (cv == NULL || p == NULL) {
		free(cv);
		free(p);
		return hl_error_nomem(err);
	}
	cv->dtmin = cas->dtmin;
	cv->qh = cas->qh;
	cv->qc = cas->qc;
	cv->recovery = cas->hot_total - cas->qc;
	st = composites(c, cas, lp, cv, p, err);
	if (st == HL_OK)
		st = grand(cas, cv, err);
	if (st == HL_OK && lp != NULL)
		st = utility_curves(c, lp, cv, p, err);
	if (st == HL_OK && lp != NULL)
		st = grand_util(c, lp, cv, err);
	free(p);
	if (st != HL_OK) {
		hl_curves_free(cv);
		return st;
	}
	*out = cv;
	return HL_OK;
}

void
hl_curves_free(hl_curves *cv)
{
	if (cv == NULL)
		return;
	curve_clear(&cv->hot);
	curve_clear(&cv->cold);
	curve_clear(&cv->shifted_hot);
	curve_clear(&cv->shifted_cold);
	curve_clear(&cv->grand);
	curve_clear(&cv->grand_util);
	curve_clear(&cv->hot_util);
	curve_clear(&cv->cold_util);
	curve_clear(&cv->bal_hot);
	curve_clear(&cv->bal_cold);
	free(cv->level);
	free(cv);
}
