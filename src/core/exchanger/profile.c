/* profile.c - piecewise-linear temperature-heat profiles of streams. */
#include <math.h>
#include <stdlib.h>

#include "exchanger.h"
#include "profile.h"
#include "sorted.h"

/* Distance (K) run from the supply end: a hot stream runs down, a cold one
 * up. */
static double
run(hl_kind kind, double from, double to)
{
	return kind == HL_HOT ? from - to : to - from;
}

double
hl_profile_heat(const hl_segment *seg, size_t nseg, hl_kind kind, double t)
{
	double x = run(kind, seg[0].supply, t), q = 0.0, x0 = 0.0;
	size_t i;

	if (x <= 0.0)
		return seg[0].cp * x;
	for (i = 0; i < nseg; i++) {
		double len = fabs(seg[i].target - seg[i].supply);

		if (x <= x0 + len || i + 1 == nseg)
			return q + seg[i].cp * (x - x0);
		q += seg[i].cp * len;
		x0 += len;
	}
	return q;
}

double
hl_profile_temp(const hl_segment *seg, size_t nseg, hl_kind kind, double q)
{
	double sign = kind == HL_HOT ? -1.0 : 1.0, t = seg[0].supply, q0 = 0.0;
	size_t i;

	if (q <= 0.0)
		return t + sign * q / seg[0].cp;
	for (i = 0; i < nseg; i++) {
		double dq = seg[i].cp * fabs(seg[i].target - seg[i].supply);

		if (q <= q0 + dq || i + 1 == nseg)
			return seg[i].supply + sign * (q - q0) / seg[i].cp;
		q0 += dq;
		t = seg[i].target;
	}
	return t;
}

/* Temperature of a side at position p (kW from the unit's hot end, 0..d).
 * The hot side enters at p = 0, the cold side leaves there. */
static double
side_temp(const hl_profile_side *s, int hot, double p, double d)
{
	double f = hot ? p / d : 1.0 - p / d, q0, q1;

	if (s->nseg == 0 || s->t_in == s->t_out)
		return s->t_in + (s->t_out - s->t_in) * f;
	q0 = hl_profile_heat(s->seg, s->nseg, s->kind, s->t_in);
	q1 = hl_profile_heat(s->seg, s->nseg, s->kind, s->t_out);
	if (f <= 0.0)
		return s->t_in;
	if (f >= 1.0)
		return s->t_out;
	return hl_profile_temp(s->seg, s->nseg, s->kind, q0 + (q1 - q0) * f);
}

/* Add the positions (0 < p < d) where the side's cp changes. */
static size_t
corners(const hl_profile_side *s, int hot, double d, double *p, size_t n)
{
	double q0, q1, qb = 0.0;
	size_t i;

	if (s->nseg < 2 || s->t_in == s->t_out)
		return n;
	q0 = hl_profile_heat(s->seg, s->nseg, s->kind, s->t_in);
	q1 = hl_profile_heat(s->seg, s->nseg, s->kind, s->t_out);
	for (i = 0; i + 1 < s->nseg; i++) {
		double f;

		qb += s->seg[i].cp * fabs(s->seg[i].target - s->seg[i].supply);
		f = (qb - q0) / (q1 - q0);
		if (f > 1e-12 && f < 1.0 - 1e-12)
			p[n++] = d * (hot ? f : 1.0 - f);
	}
	return n;
}

/* The film coefficient of the side where its temperature is t. */
static double
side_h(const hl_profile_side *s, double t, int *assumed)
{
	size_t i;

	if (s->nseg == 0)
		return s->h;
	for (i = 0; i + 1 < s->nseg; i++)
		if (s->kind == HL_HOT ? t > s->seg[i].target :
		    t < s->seg[i].target)
			break;
	if (isnan(s->seg[i].h)) {
		*assumed = 1;
		return s->h;
	}
	return s->seg[i].h;
}

#define MAX_CORNERS 64

void
hl_profile_unit_eval(const hl_profile_side *hot, const hl_profile_side *cold,
		     double d, hl_profile_unit *out)
{
	double p[MAX_CORNERS + 2], dt[MAX_CORNERS + 2], sum = 0.0, rsum = 0.0;
	size_t n = 0, i, k = 0;
	int bad = 0;

	out->dt_hot = hot->t_in - cold->t_out;
	out->dt_cold = hot->t_out - cold->t_in;
	out->assumed_hot = out->assumed_cold = 0;
	out->h_hot = hot->h;
	out->h_cold = cold->h;
	p[n++] = 0.0;
	if (hot->nseg + cold->nseg <= MAX_CORNERS) {
		n = corners(hot, 1, d, p, n);
		n = corners(cold, 0, d, p, n);
	}
	p[n++] = d;
	qsort(p + 1, n - 2, sizeof *p, hl_sorted_cmp_asc);
	for (i = 1; i + 1 < n; i++)
		dt[i] = side_temp(hot, 1, p[i], d) - side_temp(cold, 0, p[i],
							     d);
	dt[0] = out->dt_hot;
	dt[n - 1] = out->dt_cold;
	out->approach = dt[0];
	for (i = 1; i < n; i++) {
		double lm, mid = 0.5 * (p[i - 1] + p[i]), hh, hc;

		if (dt[i] < out->approach)
			out->approach = dt[i];
		if (p[i] - p[i - 1] <= 0.0)
			continue;
		hh = side_h(hot, side_temp(hot, 1, mid, d), &out->assumed_hot);
		hc = side_h(cold, side_temp(cold, 0, mid, d),
		    &out->assumed_cold);
		if (k == 0) {
			out->h_hot = hh;
			out->h_cold = hc;
		}
		if (hl_exchanger_lmtd(dt[i - 1], dt[i], &lm, NULL) != HL_OK) {
			bad = 1;
			continue;
		}
		sum += (p[i] - p[i - 1]) / lm;
		rsum += (p[i] - p[i - 1]) / lm * (1.0 / hh + 1.0 / hc);
		k++;
	}
	out->pieces = k > 0 ? k : 1;
	out->lmtd = bad || sum <= 0.0 ? NAN : d / sum;
	out->u = bad || rsum <= 0.0 ? NAN : sum / rsum;
}
