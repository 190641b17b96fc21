/* retrofit.c - the constant-α retrofit curve of Tjoe & Linnhoff (1986),
 * its investment, saving and payback (definitions in retrofit.h). */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "cascade.h"
#include "exchanger.h"
#include "retrofit.h"
#include "sweep.h"

void
hl_retrofit_free(hl_retrofit *r)
{
	if (r == NULL)
		return;
	free(r->pt);
	free(r->curve);
	free(r);
}

/* The target curve for charts; a ΔTmin without an answer is left out. */
static hl_status
target_curve(const hl_case *c, const hl_audit *a, hl_retrofit *r,
	     hl_error *err)
{
	enum { N = 41 };
	double now = isfinite(a->dtmin_now) && a->dtmin_now > 0.0 ?
		     a->dtmin_now : a->dtmin;
	double lo = 0.5 * fmin(a->dtmin, now), hi = 1.2 * fmax(a->dtmin, now);
	size_t i;

	r->curve = malloc(N * sizeof *r->curve);
	if (r->curve == NULL)
		return hl_error_nomem(err);
	if (!(hi > lo))
		return HL_OK;
	for (i = 0; i < N; i++) {
		double dt = lo + (hi - lo) * (double)i / (N - 1), qh, qc;
		hl_supertargets st;
		hl_status s;

		/* Below ΔTmin the least-cost levels; above it the loads of
		 * the area–energy curve (audit.h). */
		if (dt <= a->dtmin)
			s = hl_sweep_point_eval(c, dt, &st, NULL);
		else if ((s = hl_cascade_targets(c, dt, &qh, &qc, NULL)) ==
			 HL_OK)
			s = hl_audit_area_at(c, a, qh + a->range_rise, dt, &st,
					     NULL);

		if (s == HL_EIO)
			return hl_error_nomem(err);
		/* One accounting: hot utility never falls as ΔTmin rises
		 * (a point that would double back is left out). */
		if (s != HL_OK || (r->ncurve > 0 && st.hot_utility <
		    r->curve[r->ncurve - 1].hot_utility))
			continue;
		r->curve[r->ncurve].dtmin = dt;
		r->curve[r->ncurve].hot_utility = st.hot_utility;
		r->curve[r->ncurve].area = hl_audit_area_basis(c, &st);
		r->ncurve++;
	}
	return HL_OK;
}

/* Price of one shell of area a (m²) by the law of the case's exchanger
 * type (exchanger.h: its <equipment> law, else the process law). */
static double
shell_price(const hl_settings *set, double a)
{
	double ca, cb, cc;

	hl_exchanger_law_of(set, set->exchanger, &ca, &cb, &cc);
	return a > 0.0 ? ca + cb * pow(a, cc) : NAN;
}

/* The shell new area is bought in at a point: the shell target's mean
 * shell (Ahmad & Smith 1989), today's mean where that is nil; its price by
 * the cost law of the case's exchanger type per shell. */
static void
shell_at(const hl_case *c, const hl_retrofit *r, const hl_supertargets *st,
	 double area_target, hl_retrofit_point *p)
{
	const hl_settings *set = &c->set;

	p->shell_area = st->shells > 0 && area_target > 0.0 ?
	    area_target / st->shells : r->shell_area;
	p->shell_cost = shell_price(set, p->shell_area);
}

/* Investment in new area bought as shells of the point's size. */
static double
investment(const hl_retrofit_point *p, double new_area)
{
	if (!(new_area > 0.0) || !(p->shell_area > 0.0))
		return 0.0;
	return new_area / p->shell_area * p->shell_cost;
}

static hl_status
point(const hl_case *c, const hl_audit *a, hl_retrofit *r, double e,
      double dt, hl_retrofit_point *p, hl_error *err)
{
	hl_supertargets st, sw;
	hl_status s = hl_audit_area_at(c, a, e, dt, &st, err);
	double saved = a->net->hot_now - e;

	if (s != HL_OK)
		return s;
	p->hot_utility = e;
	p->cold_utility = a->net->cold_now - saved;
	p->dtmin = dt;
	p->area_target = hl_audit_area_basis(c, &st);
	p->area_sweep = hl_sweep_point_eval(c, dt, &sw, NULL) == HL_OK ?
			hl_audit_area_basis(c, &sw) : NAN;
	p->area_retrofit = p->area_target / r->alpha;
	p->new_area = fmax(0.0, p->area_retrofit - a->area_existing);
	shell_at(c, r, &st, p->area_target, p);
	p->investment = investment(p, p->new_area);
	p->saving = saved * (a->price_hot + a->price_cold) * c->set.hours /
		    1000.0;
	p->payback = p->saving > 0.0 ? p->investment / p->saving : NAN;
	return HL_OK;
}

static hl_status
curve(const hl_case *c, const hl_audit *a, hl_retrofit *r, size_t npoints,
      hl_error *err)
{
	double e0 = a->net->hot_now, e1 = a->hot_target;
	size_t i;
	hl_status s = HL_OK;

	if (isnan(r->alpha) || !(e0 - e1 > 1e-9 * (1.0 + e0)))
		return HL_OK;
	r->pt = malloc(npoints * sizeof *r->pt);
	if (r->pt == NULL)
		return hl_error_nomem(err);
	for (i = 0; i < npoints && s == HL_OK; i++) {
		double e = e0 + (e1 - e0) * (double)i / (double)(npoints - 1);
		double dt = a->dtmin_now;

		if (i + 1 == npoints)
			dt = a->dtmin;
		else if (i > 0)
			s = hl_audit_dtmin_at(c, e - a->range_rise, &dt, err);
		if (s == HL_OK)
			s = point(c, a, r, e, dt, &r->pt[i], err);
		if (s == HL_OK)
			r->n++;
	}
	return s;
}

hl_status
hl_retrofit_screen(const hl_case *c, const hl_audit *a, size_t npoints,
		   hl_retrofit **out, hl_error *err)
{
	hl_retrofit *r = calloc(1, sizeof *r);
	const hl_settings *set = &c->set;
	hl_status s;

	*out = NULL;
	if (r == NULL)
		return hl_error_nomem(err);
	r->alpha = a->alpha;
	if (a->net->shells > 0 && a->net->area > 0.0)
		r->shell_area = a->net->area / a->net->shells;
	r->shell_cost = shell_price(set, r->shell_area);
	s = target_curve(c, a, r, err);
	if (s == HL_OK)
		s = curve(c, a, r, npoints < 2 ? 2 : npoints, err);
	if (s != HL_OK) {
		hl_retrofit_free(r);
		return s;
	}
	*out = r;
	return HL_OK;
}

/* Linear interpolation along the curve's (investment, saving) points. */
double
hl_retrofit_saving_at(const hl_retrofit *r, double investment)
{
	size_t i;

	if (r == NULL || r->n == 0)
		return NAN;
	if (investment <= r->pt[0].investment)
		return r->pt[0].saving;
	for (i = 1; i < r->n; i++) {
		const hl_retrofit_point *a = &r->pt[i - 1], *b = &r->pt[i];

		if (investment <= b->investment) {
			double f = b->investment > a->investment ?
			    (investment - a->investment) /
			    (b->investment - a->investment) : 1.0;

			return a->saving + f * (b->saving - a->saving);
		}
	}
	return r->pt[r->n - 1].saving;
}
