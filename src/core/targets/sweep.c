/* sweep.c - the targeting chain over a ΔTmin grid, golden-section refined. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "cascade.h"
#include "sorted.h"
#include "sweep.h"
#include "utility_lp.h"

/* Process and utility pinches of the LP, falling and without repeats. */
static double *
lp_pinches(const hl_utility_lp *lp, size_t *n)
{
	double *p = malloc((lp->nproc + lp->npinch + 1) * sizeof *p);
	size_t i, k = 0;

	*n = 0;
	if (p == NULL)
		return NULL;
	for (i = 0; i < lp->nproc; i++)
		p[k++] = lp->proc[i].shifted;
	for (i = 0; i < lp->npinch; i++)
		p[k++] = lp->pinch[i].shifted;
	*n = hl_sorted_unique_desc(p, k);
	return p;
}

hl_status
hl_sweep_point_from(const hl_case *c, const hl_cascade *cas,
		    const hl_utility_lp *lp, hl_supertargets *st,
		    hl_error *err)
{
	double *load = NULL, *pinch = NULL;
	size_t np = 0;
	hl_status s;

	if (lp == NULL)
		return hl_supertarget_compute(c, cas, NULL, NULL, 0, st, err);
	load = malloc(c->nutil * sizeof *load);
	pinch = lp_pinches(lp, &np);
	if (load == NULL || pinch == NULL) {
		s = hl_error_nomem(err);
	} else {
		hl_utility_lp_copy_loads(lp, load);
		s = hl_supertarget_compute(c, cas, load, pinch, np, st, err);
	}
	free(load);
	free(pinch);
	return s;
}

hl_status
hl_sweep_point_eval(const hl_case *c, double dtmin, hl_supertargets *st,
		    hl_error *err)
{
	hl_cascade *cas = NULL;
	hl_status s;

	hl_utility_lp *lp = NULL;

	s = hl_cascade_compute(c, dtmin, &cas, err);
	if (s == HL_OK && c->nutil > 0)
		s = hl_utility_lp_solve(c, dtmin, NULL, &lp, err);
	if (s == HL_OK)
		s = hl_sweep_point_from(c, cas, lp, st, err);
	hl_utility_lp_free(lp);
	hl_cascade_free(cas);
	return s;
}

/* A point that fails for want of an answer is kept and explained; any
 * other failure (memory) stops the sweep. */
static hl_status
eval_point(const hl_case *c, double dt, hl_sweep_point *p, size_t *evals,
	   hl_error *err)
{
	hl_error e;
	hl_status s;

	hl_error_clear(&e);
	memset(p, 0, sizeof *p);
	p->st.dtmin = dt;
	s = hl_sweep_point_eval(c, dt, &p->st, &e);
	(*evals)++;
	if (s == HL_OK) {
		p->ok = 1;
		return HL_OK;
	}
	if (s == HL_ENOSOLUTION) {
		snprintf(p->note, sizeof p->note, "%.190s", e.text);
		p->st.dtmin = dt;
		return HL_OK;
	}
	if (err != NULL)
		*err = e;
	return s;
}

/* Golden-section search for the least total cost in [a, b]; returns the
 * best point seen (Kiefer 1953). */
static hl_status
refine(const hl_case *c, double a, double b, hl_supertargets *best,
       size_t *evals, hl_error *err)
{
	const double g = (sqrt(5.0) - 1.0) / 2.0;
	hl_sweep_point p1, p2;
	double x1 = b - g * (b - a), x2 = a + g * (b - a);
	hl_status s;
	int it;

	s = eval_point(c, x1, &p1, evals, err);
	if (s == HL_OK)
		s = eval_point(c, x2, &p2, evals, err);
	for (it = 0; s == HL_OK && it < 40 && b - a > 1e-4 * (1.0 + b); it++) {
		double f1 = p1.ok ? p1.st.total_cost : HUGE_VAL;
		double f2 = p2.ok ? p2.st.total_cost : HUGE_VAL;

		if (p1.ok && f1 < best->total_cost)
			*best = p1.st;
		if (p2.ok && f2 < best->total_cost)
			*best = p2.st;
		if (f1 <= f2) {
			b = x2;
			x2 = x1;
			p2 = p1;
			x1 = b - g * (b - a);
			s = eval_point(c, x1, &p1, evals, err);
		} else {
			a = x1;
			x1 = x2;
			p1 = p2;
			x2 = a + g * (b - a);
			s = eval_point(c, x2, &p2, evals, err);
		}
	}
	return s;
}

hl_status
hl_sweep_run(const hl_case *c, double from, double to, double step,
	     hl_sweep **out, hl_error *err)
{
	hl_sweep *sw;
	size_t n, i;
	hl_status s = HL_OK;

	*out = NULL;
	if (!(from >= 0.0 && to >= from && step > 0.0) ||
	    (to - from) / step > 10000.0)
		return hl_error_set(err, HL_EUSAGE, NULL, 0, "the ΔTmin grid "
			"needs 0 <= from <= to, step > 0 and at most 10001 "
			"points");
	n = (size_t)floor((to - from) / step + 1e-9) + 1;
	sw = calloc(1, sizeof *sw);
	if (sw == NULL || (sw->pt = calloc(n, sizeof *sw->pt)) == NULL) {
		free(sw);
		return hl_error_nomem(err);
	}
	sw->n = n;
	for (i = 0; i < n && s == HL_OK; i++) {
		s = eval_point(c, from + (double)i * step, &sw->pt[i],
			       &sw->evaluations, err);
		if (s == HL_OK && sw->pt[i].ok && (!sw->have_optimum ||
		    sw->pt[i].st.total_cost < sw->pt[sw->best].st.total_cost)) {
			sw->best = i;
			sw->have_optimum = 1;
		}
	}
	if (s == HL_OK && !sw->have_optimum)
		s = hl_error_set(err, HL_ENOSOLUTION, c->source, 0,
			"no ΔTmin from %g to %g K has an answer: %s", from, to,
			sw->pt[0].note);
	if (s == HL_OK) {
		size_t lo = sw->best > 0 ? sw->best - 1 : 0;
		size_t hi = sw->best + 1 < n ? sw->best + 1 : n - 1;

		sw->optimum = sw->pt[sw->best].st;
		if (hi > lo)
			s = refine(c, sw->pt[lo].st.dtmin, sw->pt[hi].st.dtmin,
				   &sw->optimum, &sw->evaluations, err);
	}
	if (s != HL_OK) {
		hl_sweep_free(sw);
		return s;
	}
	*out = sw;
	return HL_OK;
}

void
hl_sweep_free(hl_sweep *sw)
{
	if (sw == NULL)
		return;
	free(sw->pt);
	free(sw);
}
