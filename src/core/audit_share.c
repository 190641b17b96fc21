/* audit_share.c - each unit's share of the area efficiency: its area
 * against the vertical-transfer area its duty would need (audit.h). */
#include <math.h>
#include <stdlib.h>

#include "audit_private.h"
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

void
hl_audit_shares(const hl_case *c, hl_audit *a, const hl_curves *cv)
{
	int bal = cv->bal_hot.n > 0 && cv->bal_cold.n > 0;
	const hl_curve *hot = bal ? &cv->bal_hot : &cv->hot;
	const hl_curve *cold = bal ? &cv->bal_cold : &cv->cold;
	double lo_h, hi_h;
	size_t i;

	(void)c;
	if (hot->n < 2 || cold->n < 2)
		return;
	/* Where the two curves face each other. */
	lo_h = fmax(hot->h[0], cold->h[0]);
	hi_h = fmin(hot->h[hot->n - 1], cold->h[cold->n - 1]);
	for (i = 0; i < a->net->nunit; i++) {
		const hl_existing_unit *u = &a->net->unit[i];
		const hl_side *sd = u->role == HL_ROLE_HEATER ? &u->cold :
				    &u->hot;
		const hl_curve *own = u->role == HL_ROLE_HEATER ? cold : hot;
		double ha, hb, inv;

		if (isnan(u->area) || isnan(u->u) ||
		    (!bal && u->role != HL_ROLE_RECOVERY))
			continue;
		ha = hl_curve_heat_at(own, fmin(sd->t_in, sd->t_out));
		hb = hl_curve_heat_at(own, fmax(sd->t_in, sd->t_out));
		inv = mean_inverse_dt(hot, cold, fmax(ha, lo_h),
				      fmin(hb, hi_h));
		if (isnan(inv))
			continue;
		a->vertical[i] = u->duty * inv / (u->u * u->f);
		a->unit_alpha[i] = a->vertical[i] / u->area;
	}
}
