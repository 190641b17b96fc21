/* audit_pinch.c - which units break the pinch rules, and by how much.
 *
 * Linnhoff et al. (1982), User Guide on Process Integration for the
 * Efficient Use of Energy (IChemE): each kW of process heat across the
 * pinch, of hot utility below it or of cold utility above it adds a kW to
 * both utilities. Each unit's part comes from its terminal temperatures on
 * the shifted scale and the heat of its stream between them (audit.h).
 */
#include <math.h>
#include <stdlib.h>

#include "audit_int.h"

/* The heat a stream side exchanges above the shifted temperature p: the
 * side's duty times the part of its stream's heat between its terminal
 * temperatures that lies above the pinch on that stream's own shift. */
static double
above(const hl_case *c, const hl_side *sd, double p, double dtmin,
      double duty)
{
	const hl_stream *s = &c->stream[sd->stream];
	double sh = hl_stream_shift(s, dtmin);
	double x = s->kind == HL_HOT ? p + sh : p - sh;
	double lo = fmin(sd->t_in, sd->t_out), hi = fmax(sd->t_in, sd->t_out);
	double xc = fmin(fmax(x, lo), hi);
	double full = fabs(hl_stream_heat_at(s, hi) - hl_stream_heat_at(s, lo));

	if (!(full > 0.0))
		return lo > x ? duty : 0.0;
	return duty * fabs(hl_stream_heat_at(s, hi) -
			   hl_stream_heat_at(s, xc)) / full;
}

static double
util_price(const hl_case *c, long util, double mean)
{
	return util >= 0 ? c->util[util].price : mean;
}

static int
add(hl_audit *a, size_t unit, hl_violation_kind kind, double duty,
    double price_sum, double hours)
{
	hl_violation *v = realloc(a->viol, (a->nviol + 1) * sizeof *v);

	if (v == NULL)
		return -1;
	a->viol = v;
	v = &a->viol[a->nviol++];
	v->unit = unit;
	v->kind = kind;
	v->duty = duty;
	v->saving = kind == HL_VIOL_UP ? 0.0 : duty * price_sum * hours /
					       1000.0;
	if (kind == HL_VIOL_UP)
		a->upward += duty;
	else
		a->violations += duty;
	return 0;
}

/* The one violation unit i can have, if any. */
static int
unit_violation(const hl_case *c, hl_audit *a, size_t i)
{
	const hl_existing_unit *u = &a->net->unit[i];
	double tol = 1e-7 * (1.0 + u->duty), x, hours = c->set.hours;
	double ph = a->price_hot, pc = a->price_cold;

	switch (u->role) {
	case HL_ROLE_RECOVERY:
		x = above(c, &u->hot, a->pinch, a->dtmin, u->duty) -
		    above(c, &u->cold, a->pinch, a->dtmin, u->duty);
		if (x > tol)
			return add(a, i, HL_VIOL_ACROSS, x, ph + pc, hours);
		if (x < -tol)
			return add(a, i, HL_VIOL_UP, -x, 0.0, hours);
		return 0;
	case HL_ROLE_HEATER:
		x = u->duty - above(c, &u->cold, a->pinch, a->dtmin, u->duty);
		if (x > tol)
			return add(a, i, HL_VIOL_HOT_BELOW, x,
				   util_price(c, u->hot.util, ph) + pc, hours);
		return 0;
	default:
		x = above(c, &u->hot, a->pinch, a->dtmin, u->duty);
		if (x > tol)
			return add(a, i, HL_VIOL_COLD_ABOVE, x,
				   ph + util_price(c, u->cold.util, pc), hours);
		return 0;
	}
}

/* Rules broken first, largest duty first; then the upward transfers; row
 * order breaks ties. */
static int
cmp_viol(const void *pa, const void *pb)
{
	const hl_violation *x = pa, *y = pb;
	int ux = x->kind == HL_VIOL_UP, uy = y->kind == HL_VIOL_UP;

	if (ux != uy)
		return ux - uy;
	if (x->duty != y->duty)
		return x->duty > y->duty ? -1 : 1;
	return (x->unit > y->unit) - (x->unit < y->unit);
}

hl_status
hl_audit_violations(const hl_case *c, hl_audit *a, hl_error *err)
{
	size_t i;

	for (i = 0; i < a->net->nunit; i++)
		if (unit_violation(c, a, i) < 0)
			return hl_error_nomem(err);
	if (a->nviol > 1)
		qsort(a->viol, a->nviol, sizeof *a->viol, cmp_viol);
	return HL_OK;
}
