/* audit.c - today's network against the targets: energy, pinch rules,
 * ΔTmin now and area efficiency (definitions and sources in audit.h). */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "audit_int.h"
#include "cascade.h"
#include "utility_lp.h"

const char *
hl_violation_kind_name(hl_violation_kind k)
{
	static const char *const names[] = { "across", "hot-below",
					     "cold-above", "up" };

	return (unsigned)k < 4 ? names[k] : "?";
}

double
hl_audit_area_basis(const hl_case *c, const hl_supertargets *st)
{
	return c->set.exchanger == HL_EXCH_SHELL_TUBE ? st->area_st : st->area;
}

/* Σ loads of one kind. */
static double
kind_sum(const hl_case *c, const double *load, hl_kind kind)
{
	double s = 0.0;
	size_t i;

	for (i = 0; i < c->nutil; i++)
		if (c->util[i].kind == kind)
			s += load[i];
	return s;
}

/* Scale one kind's loads to total want (or, when they are all 0, spread
 * want like the target loads). */
static void
rescale(const hl_case *c, const hl_audit *a, double *load, hl_kind kind,
	double want)
{
	double have = kind_sum(c, load, kind);
	double base = kind_sum(c, a->target_load, kind);
	size_t i;

	for (i = 0; i < c->nutil; i++) {
		if (c->util[i].kind != kind)
			continue;
		if (have > 0.0)
			load[i] *= want / have;
		else if (base > 0.0)
			load[i] = a->target_load[i] * want / base;
	}
}

void
hl_audit_loads(const hl_case *c, const hl_audit *a, double e, double *load)
{
	double e0 = a->hot_target, e1 = a->net->hot_now;
	double t = e1 - e0 > 1e-9 * (1.0 + e1) ? (e - e0) / (e1 - e0) : 1.0;
	size_t i;

	for (i = 0; i < c->nutil; i++) {
		load[i] = a->target_load[i] + t * (a->net->util_load[i] -
						   a->target_load[i]);
		if (load[i] < 0.0)
			load[i] = 0.0;
	}
	/* The energy balance: QC = QH + Σ hot duty − Σ cold duty. */
	rescale(c, a, load, HL_HOT, e);
	rescale(c, a, load, HL_COLD, e + a->cold_target - a->hot_target);
}

hl_status
hl_audit_area_at(const hl_case *c, const hl_audit *a, double e, double dt,
		 hl_supertargets *st, hl_error *err)
{
	hl_cascade *cas = NULL;
	double *load = malloc((c->nutil + 1) * sizeof *load);
	hl_status s;

	if (load == NULL)
		return hl_error_nomem(err);
	s = hl_cascade_compute(c, dt, &cas, err);
	if (s == HL_OK) {
		hl_audit_loads(c, a, e, load);
		s = hl_supertarget_compute(c, cas, c->nutil ? load : NULL,
					   NULL, 0, st, err);
	}
	hl_cascade_free(cas);
	free(load);
	return s;
}

void
hl_audit_free(hl_audit *a)
{
	if (a == NULL)
		return;
	hl_existing_free(a->net);
	free(a->viol);
	free(a->target_load);
	free(a->vertical);
	free(a->unit_alpha);
	free(a);
}

/* Bisection on the monotone, piecewise-linear QHmin(ΔTmin) of the problem
 * table (Linnhoff & Flower 1978). */
hl_status
hl_audit_dtmin_at(const hl_case *c, double qh, double *dt, hl_error *err)
{
	double lo = 0.0, hi, q, qc, tmax = HL_T_MIN, tmin = HL_T_MAX;
	double tol = 1e-9 * (1.0 + fabs(qh));
	size_t i, it;
	hl_status st;

	for (i = 0; i < c->nstream; i++) {
		tmax = fmax(tmax, fmax(hl_stream_supply(&c->stream[i]),
				       hl_stream_target(&c->stream[i])));
		tmin = fmin(tmin, fmin(hl_stream_supply(&c->stream[i]),
				       hl_stream_target(&c->stream[i])));
	}
	*dt = NAN;
	st = hl_cascade_targets(c, 0.0, &q, &qc, err);
	if (st != HL_OK || q > qh + tol)
		return st;
	/* Past twice the whole span no shifted ranges overlap. */
	hi = 2.0 * (tmax - tmin) + 1.0;
	st = hl_cascade_targets(c, hi, &q, &qc, err);
	if (st != HL_OK)
		return st;
	if (q <= qh + tol) {
		*dt = HUGE_VAL;
		return HL_OK;
	}
	for (it = 0; it < 200 && hi - lo > 1e-9 * (1.0 + hi); it++) {
		double mid = 0.5 * (lo + hi);

		st = hl_cascade_targets(c, mid, &q, &qc, err);
		if (st != HL_OK)
			return st;
		if (q <= qh + tol)
			lo = mid;
		else
			hi = mid;
	}
	*dt = lo;
	return HL_OK;
}

/* The pinch the rules refer to (audit.h). */
static void
choose_pinch(const hl_cascade *cas, hl_audit *a)
{
	size_t b;
	char kind = hl_cascade_threshold_kind(cas);

	if (cas->npinch > 0) {
		b = cas->pinch[0];
		a->pinch_kind = 'P';
	} else if (kind == 'C') {
		b = cas->nb - 1;
		a->pinch_kind = 'B';
	} else {
		b = 0;
		a->pinch_kind = 'T';
	}
	a->pinch = cas->t[b];
	a->pinch_hot = hl_cascade_hot_temp(cas, a->pinch);
	a->pinch_cold = hl_cascade_cold_temp(cas, a->pinch);
}

/* Duty-weighted mean price of today's utility rows of one kind; the
 * cheapest level's price when there are none. */
static double
mean_price(const hl_case *c, const hl_existing *net, hl_kind kind)
{
	double q = 0.0, m = 0.0, cheapest = NAN;
	size_t i;

	for (i = 0; i < c->nutil; i++) {
		if (c->util[i].kind != kind)
			continue;
		q += net->util_load[i];
		m += net->util_load[i] * c->util[i].price;
		if (isnan(cheapest) || c->util[i].price < cheapest)
			cheapest = c->util[i].price;
	}
	if (q > 0.0)
		return m / q;
	return isnan(cheapest) ? 0.0 : cheapest;
}

static hl_status
energy(const hl_case *c, hl_audit *a, hl_error *err)
{
	hl_cascade *cas = NULL;
	hl_utility_lp *lp = NULL;
	hl_status st;

	st = hl_cascade_compute(c, a->dtmin, &cas, err);
	if (st == HL_OK && c->nutil > 0)
		st = hl_utility_lp_solve(c, a->dtmin, NULL, &lp, err);
	if (st == HL_OK) {
		choose_pinch(cas, a);
		a->range_rise = lp ? lp->range_rise : 0.0;
		a->hot_target = cas->qh + a->range_rise;
		a->cold_target = cas->qc + a->range_rise;
		a->cost_target = lp ? lp->cost : 0.0;
		if (lp != NULL)
			hl_utility_lp_copy_loads(lp, a->target_load);
		a->price_hot = mean_price(c, a->net, HL_HOT);
		a->price_cold = mean_price(c, a->net, HL_COLD);
		a->saving = a->net->hot_now - a->hot_target;
		a->saving_cold = a->net->cold_now - a->cold_target;
		a->saving_cost = (a->saving * a->price_hot +
				  a->saving_cold * a->price_cold) *
				 c->set.hours / 1000.0;
	}
	hl_utility_lp_free(lp);
	hl_cascade_free(cas);
	return st;
}

/* α and the unit shares at today's energy; a missing answer is a note. */
static hl_status
efficiency(const hl_case *c, hl_audit *a, hl_error *err)
{
	hl_error e;
	hl_status st;

	a->alpha = NAN;
	a->area_existing = c->nutil > 0 ? a->net->area :
			   a->net->area_recovery;
	st = hl_audit_dtmin_at(c, a->net->hot_now - a->range_rise,
			       &a->dtmin_now, err);
	if (st != HL_OK)
		return st;
	if (isnan(a->dtmin_now) || a->dtmin_now <= 0.0) {
		snprintf(a->note, sizeof a->note, "today's hot utility is at "
			 "or below the target at ΔTmin 0: no area target "
			 "exists there (check the units' approaches against "
			 "the streams' ΔT contributions)");
		return HL_OK;
	}
	if (isinf(a->dtmin_now)) {
		snprintf(a->note, sizeof a->note, "no heat is recovered "
			 "today: the area efficiency is not defined");
		return HL_OK;
	}
	hl_error_clear(&e);
	st = hl_audit_area_at(c, a, a->net->hot_now, a->dtmin_now, &a->now,
			      &e);
	if (st == HL_ENOSOLUTION) {
		snprintf(a->note, sizeof a->note, "no area target at today's "
			 "energy: %.300s", e.text);
		return HL_OK;
	}
	if (st != HL_OK) {
		if (err != NULL)
			*err = e;
		return st;
	}
	a->have_now = 1;
	a->area_target_now = hl_audit_area_basis(c, &a->now);
	if (a->area_existing > 0.0)
		a->alpha = a->area_target_now / a->area_existing;
	else
		snprintf(a->note, sizeof a->note, "no unit has an area: the "
			 "area efficiency is not defined");
	return hl_audit_shares(c, a, err);
}

hl_status
hl_audit_run(const hl_case *c, hl_audit **out, hl_error *err)
{
	hl_audit *a = calloc(1, sizeof *a);
	hl_status st;
	size_t i;

	*out = NULL;
	if (a == NULL)
		return hl_error_nomem(err);
	a->dtmin = c->set.dtmin;
	a->dtmin_now = a->alpha = NAN;
	st = hl_existing_build(c, &a->net, err);
	if (st != HL_OK) {
		if (a->net != NULL)
			*out = a;
		else
			hl_audit_free(a);
		return st;
	}
	a->vertical = malloc((a->net->nunit + 1) * sizeof *a->vertical);
	a->unit_alpha = malloc((a->net->nunit + 1) * sizeof *a->unit_alpha);
	a->target_load = calloc(c->nutil + 1, sizeof *a->target_load);
	if (a->vertical == NULL || a->unit_alpha == NULL ||
	    a->target_load == NULL) {
		hl_audit_free(a);
		return hl_error_nomem(err);
	}
	for (i = 0; i < a->net->nunit; i++)
		a->vertical[i] = a->unit_alpha[i] = NAN;
	st = energy(c, a, err);
	if (st == HL_OK)
		st = hl_audit_violations(c, a, err);
	if (st == HL_OK)
		st = efficiency(c, a, err);
	*out = a;
	return st;
}
