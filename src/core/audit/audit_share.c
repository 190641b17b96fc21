/* audit_share.c - each unit's share of the area efficiency: its area
 * against the vertical-transfer area its duty would need (audit.h). */
#include <math.h>
#include <stdlib.h>

#include "audit_int.h"
#include "exchanger.h"

/* Temperature of a rising polyline at heat h: the right-hand limit
 * (side > 0) or the left-hand one (side < 0) where the curve jumps. */
static double
t_at(const hl_curve *cv, double h, int side)
{
	size_t k;

	if (h <= cv->h[0])
		return cv->t[0];
	for (k = 0; k + 1 < cv->n; k++) {
		double a = cv->h[k], b = cv->h[k + 1];

		if (!(b > a))
			continue;
		if (side > 0 ? (h >= a && h < b) : (h > a && h <= b))
			return cv->t[k] + (cv->t[k + 1] - cv->t[k]) *
			       (h - a) / (b - a);
	}
	return cv->t[cv->n - 1];
}

static int
cmp_up(const void *a, const void *b)
{
	double x = *(const double *)a, y = *(const double *)b;

	return (x > y) - (x < y);
}

/* Mean of 1/ΔT over heat in [ha, hb] between the two curves: exact per
 * piece where both are straight, as the log mean (Townsend & Linnhoff
 * 1984). NaN when the curves touch or the range is empty. */
static double
mean_inverse_dt(const hl_curve *hot, const hl_curve *cold, double ha,
		double hb)
{
	size_t n = 0, k;
	double *x = malloc((hot->n + cold->n + 2) * sizeof *x), sum = 0.0;

	if (x == NULL || !(hb > ha)) {
		free(x);
		return NAN;
	}
	x[n++] = ha;
	x[n++] = hb;
	for (k = 0; k < hot->n; k++)
		if (hot->h[k] > ha && hot->h[k] < hb)
			x[n++] = hot->h[k];
	for (k = 0; k < cold->n; k++)
		if (cold->h[k] > ha && cold->h[k] < hb)
			x[n++] = cold->h[k];
	qsort(x, n, sizeof *x, cmp_up);
	for (k = 0; k + 1 < n && !isnan(sum); k++) {
		double w = x[k + 1] - x[k], d0, d1, lm;

		if (!(w > 1e-12 * (1.0 + fabs(hb))))
			continue;
		d0 = t_at(hot, x[k], 1) - t_at(cold, x[k], 1);
		d1 = t_at(hot, x[k + 1], -1) - t_at(cold, x[k + 1], -1);
		if (hl_exchanger_lmtd(d0, d1, &lm, NULL) != HL_OK)
			sum = NAN;
		else
			sum += w / lm;
	}
	free(x);
	return sum / (hb - ha);
}

/* The composite of one side: its streams' segments and, with loads, its
 * utilities at them; rising from heat h0. */
static hl_status
side_curve(const hl_case *c, hl_kind kind, const double *load, double h0,
	   hl_curve *out, hl_error *err)
{
	size_t n = 0, i, j, cap = c->nutil + 1;
	hl_curve_piece *p;
	hl_status st;

	for (i = 0; i < c->nstream; i++)
		cap += c->stream[i].nseg;
	p = malloc(cap * sizeof *p);
	if (p == NULL)
		return hl_error_nomem(err);
	for (i = 0; i < c->nstream; i++) {
		const hl_stream *s = &c->stream[i];

		for (j = 0; s->kind == kind && j < s->nseg; j++) {
			const hl_segment *g = &s->seg[j];

			p[n].t_hi = fmax(g->supply, g->target);
			p[n].t_lo = fmin(g->supply, g->target);
			p[n].q = g->cp * (p[n].t_hi - p[n].t_lo);
			n++;
		}
	}
	for (i = 0; load != NULL && i < c->nutil; i++) {
		if (c->util[i].kind != kind || !(load[i] > 0.0))
			continue;
		p[n].t_hi = fmax(c->util[i].supply, c->util[i].target);
		p[n].t_lo = fmin(c->util[i].supply, c->util[i].target);
		p[n++].q = load[i];
	}
	st = hl_curves_composite(p, n, h0, out, err);
	free(p);
	return st;
}

static void
unit_share(hl_audit *a, size_t i, const hl_curve *hot, const hl_curve *cold,
	   int bal)
{
	const hl_existing_unit *u = &a->net->unit[i];
	const hl_side *sd = u->role == HL_ROLE_HEATER ? &u->cold : &u->hot;
	const hl_curve *own = u->role == HL_ROLE_HEATER ? cold : hot;
	double lo_h = fmax(hot->h[0], cold->h[0]);
	double hi_h = fmin(hot->h[hot->n - 1], cold->h[cold->n - 1]);
	double ha, hb, inv;

	if (isnan(u->area) || isnan(u->u) ||
	    (!bal && u->role != HL_ROLE_RECOVERY))
		return;
	ha = hl_curve_heat_at(own, fmin(sd->t_in, sd->t_out));
	hb = hl_curve_heat_at(own, fmax(sd->t_in, sd->t_out));
	inv = mean_inverse_dt(hot, cold, fmax(ha, lo_h), fmin(hb, hi_h));
	if (isnan(inv))
		return;
	a->vertical[i] = u->duty * inv / (u->u * u->f);
	a->unit_alpha[i] = a->vertical[i] / u->area;
}

hl_status
hl_audit_shares(const hl_case *c, hl_audit *a, hl_error *err)
{
	int bal = c->nutil > 0;
	double *load = malloc((c->nutil + 1) * sizeof *load);
	hl_curve hot = { 0, NULL, NULL }, cold = { 0, NULL, NULL };
	hl_status st = load ? HL_OK : hl_error_nomem(err);
	size_t i;

	if (st == HL_OK) {
		hl_audit_loads(c, a, a->net->hot_now, load);
		st = side_curve(c, HL_HOT, bal ? load : NULL, 0.0, &hot, err);
	}
	/* Without utilities the cold curve starts at today's cooling. */
	if (st == HL_OK)
		st = side_curve(c, HL_COLD, bal ? load : NULL,
				bal ? 0.0 : a->net->cold_now, &cold, err);
	for (i = 0; st == HL_OK && hot.n >= 2 && cold.n >= 2 &&
	     i < a->net->nunit; i++)
		unit_share(a, i, &hot, &cold, bal);
	free(hot.h);
	free(hot.t);
	free(cold.h);
	free(cold.t);
	free(load);
	return st;
}
