/* cascade.c - problem table algorithm, Linnhoff & Flower (1978). */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "cascade.h"
#include "sorted.h"

static size_t
count_segments(const hl_case *c)
{
	size_t i, n = 0;

	for (i = 0; i < c->nstream; i++)
		n += c->stream[i].nseg;
	return n;
}

/* Sorted, duplicate-free shifted temperatures of every segment end. */
static double *
shifted_boundaries(const hl_case *c, double dtmin, size_t *nb)
{
	size_t nseg = count_segments(c), i, j, n = 0;
	double *t = malloc(2 * nseg * sizeof *t);

	if (t == NULL)
		return NULL;
	for (i = 0; i < c->nstream; i++) {
		const hl_stream *s = &c->stream[i];
		double sh = hl_stream_shift(s, dtmin);

		sh = s->kind == HL_HOT ? -sh : sh;
		for (j = 0; j < s->nseg; j++) {
			t[n++] = s->seg[j].supply + sh;
			t[n++] = s->seg[j].target + sh;
		}
	}
	*nb = hl_sorted_unique_desc(t, n);
	return t;
}

/* Net cp of every interval by a difference array over boundary indices. */
static void
interval_cp(const hl_case *c, double dtmin, const double *t, size_t nb,
	    double *netcp)
{
	size_t i, j, k;
	double run = 0.0;

	memset(netcp, 0, nb * sizeof *netcp);
	for (i = 0; i < c->nstream; i++) {
		const hl_stream *s = &c->stream[i];
		double sh = hl_stream_shift(s, dtmin);
		double sign = s->kind == HL_HOT ? 1.0 : -1.0;

		sh = s->kind == HL_HOT ? -sh : sh;
		for (j = 0; j < s->nseg; j++) {
			const hl_segment *g = &s->seg[j];
			double hi = fmax(g->supply, g->target) + sh;
			double lo = fmin(g->supply, g->target) + sh;

			netcp[hl_sorted_find_desc(t, nb, hi)] += sign * g->cp;
			netcp[hl_sorted_find_desc(t, nb, lo)] -= sign * g->cp;
		}
	}
	for (k = 0; k + 1 < nb; k++) {
		run += netcp[k];
		netcp[k] = run;
	}
	netcp[nb - 1] = 0.0;
}

/* Latent heat at each boundary: hot (condensing) positive, cold negative;
 * *any is set when some latent segment lies there. */
static void
boundary_latent(const hl_case *c, double dtmin, const double *t, size_t nb,
		double *lat, int *any)
{
	size_t i, j, b;

	memset(lat, 0, nb * sizeof *lat);
	memset(any, 0, nb * sizeof *any);
	for (i = 0; i < c->nstream; i++) {
		const hl_stream *s = &c->stream[i];
		double sh = hl_stream_shift(s, dtmin);

		sh = s->kind == HL_HOT ? -sh : sh;
		for (j = 0; j < s->nseg; j++) {
			if (!hl_segment_latent(&s->seg[j]))
				continue;
			b = hl_sorted_find_desc(t, nb, s->seg[j].supply + sh);
			lat[b] += s->kind == HL_HOT ? s->seg[j].latent :
						     -s->seg[j].latent;
			any[b] = 1;
		}
	}
}

/* A boundary with latent heat becomes two at the same temperature with a
 * zero-width interval between them whose surplus is the latent heat (hot
 * condensing there may boil a cold stream there: ΔT = ΔTmin exactly).
 * Linnhoff & Flower (1978) with latent heat as a step of the cascade. */
static int
add_latent_steps(const hl_case *c, hl_cascade *cas, double **step)
{
	size_t nb = cas->nb, n = 0, k;
	double *lat = malloc(nb * sizeof *lat), *t, *cp, *st;
	int *any = malloc(nb * sizeof *any);

	*step = NULL;
	if (lat == NULL || any == NULL) {
		free(lat);
		free(any);
		return 0;
	}
	boundary_latent(c, cas->dtmin, cas->t, nb, lat, any);
	for (k = 0; k < nb; k++)
		n += 1 + (size_t)any[k];
	t = malloc(n * sizeof *t);
	cp = malloc(n * sizeof *cp);
	st = calloc(n, sizeof *st);
	if (t == NULL || cp == NULL || st == NULL) {
		free(t), free(cp), free(st), free(lat), free(any);
		return 0;
	}
	for (k = 0, n = 0; k < nb; k++) {
		if (any[k]) {
			t[n] = cas->t[k];
			cp[n] = 0.0;
			st[n++] = lat[k];
		}
		t[n] = cas->t[k];
		cp[n++] = cas->netcp[k];
	}
	free(cas->t);
	free(cas->netcp);
	cas->t = t;
	cas->netcp = cp;
	cas->nb = n;
	*step = st;
	free(lat);
	free(any);
	return 1;
}

static void
totals(const hl_case *c, double *hot, double *cold)
{
	size_t i;

	*hot = *cold = 0.0;
	for (i = 0; i < c->nstream; i++) {
		if (c->stream[i].kind == HL_HOT)
			*hot += hl_stream_duty(&c->stream[i]);
		else
			*cold += hl_stream_duty(&c->stream[i]);
	}
}

/* Cascade the surpluses, lift by the largest deficit, mark the pinches. */
static hl_status
run_cascade(hl_cascade *cas, const double *step, hl_error *err)
{
	size_t k, nb = cas->nb;
	double r = 0.0, rmin = 0.0, scale = 0.0;

	cas->flow[0] = 0.0;
	for (k = 0; k + 1 < nb; k++) {
		cas->dh[k] = cas->netcp[k] * (cas->t[k] - cas->t[k + 1]) +
			     (step != NULL ? step[k] : 0.0);
		scale += fabs(cas->dh[k]);
		r += cas->dh[k];
		cas->flow[k + 1] = r;
		if (r < rmin)
			rmin = r;
	}
	cas->qh = -rmin;
	cas->tol = 1e-9 * (scale > 0.0 ? scale : 1.0);
	cas->npinch = 0;
	cas->pinch = malloc(nb * sizeof *cas->pinch);
	if (cas->pinch == NULL)
		return hl_error_nomem(err);
	for (k = 0; k < nb; k++) {
		cas->flow[k] += cas->qh;
		if (cas->flow[k] <= cas->tol) {
			cas->flow[k] = 0.0;
			if (k > 0 && k + 1 < nb)
				cas->pinch[cas->npinch++] = k;
		}
	}
	if (cas->qh <= cas->tol)
		cas->qh = 0.0;
	cas->qc = cas->flow[nb - 1];
	return HL_OK;
}

hl_status
hl_cascade_compute(const hl_case *c, double dtmin, hl_cascade **out,
		   hl_error *err)
{
	hl_cascade *cas;
	double *step = NULL;
	hl_status st;

	*out = NULL;
	if (c->nstream == 0)
		return hl_error_set(err, HL_EINPUT, c->source, 0,
			"no process streams to cascade");
	cas = calloc(1, sizeof *cas);
	if (cas == NULL)
		return hl_error_nomem(err);
	cas->dtmin = dtmin;
	cas->t = shifted_boundaries(c, dtmin, &cas->nb);
	if (cas->t != NULL)
		cas->netcp = malloc(cas->nb * sizeof(double));
	if (cas->t == NULL || cas->netcp == NULL) {
		hl_cascade_free(cas);
		return hl_error_nomem(err);
	}
	interval_cp(c, dtmin, cas->t, cas->nb, cas->netcp);
	if (hl_case_has_latent(c) && !add_latent_steps(c, cas, &step)) {
		hl_cascade_free(cas);
		return hl_error_nomem(err);
	}
	cas->dh = calloc(cas->nb, sizeof(double));
	cas->flow = malloc(cas->nb * sizeof(double));
	if (cas->dh == NULL || cas->flow == NULL) {
		free(step);
		hl_cascade_free(cas);
		return hl_error_nomem(err);
	}
	totals(c, &cas->hot_total, &cas->cold_total);
	st = run_cascade(cas, step, err);
	free(step);
	if (st != HL_OK) {
		hl_cascade_free(cas);
		return st;
	}
	*out = cas;
	return HL_OK;
}

void
hl_cascade_free(hl_cascade *cas)
{
	if (cas == NULL)
		return;
	free(cas->t);
	free(cas->netcp);
	free(cas->dh);
	free(cas->flow);
	free(cas->pinch);
	free(cas);
}

hl_status
hl_cascade_targets(const hl_case *c, double dtmin, double *qh, double *qc,
		   hl_error *err)
{
	hl_cascade *cas;
	hl_status st = hl_cascade_compute(c, dtmin, &cas, err);

	if (st != HL_OK)
		return st;
	*qh = cas->qh;
	*qc = cas->qc;
	hl_cascade_free(cas);
	return HL_OK;
}

char
hl_cascade_threshold_kind(const hl_cascade *cas)
{
	if (cas->npinch > 0)
		return 0;
	if (cas->qh == 0.0 && cas->qc == 0.0)
		return 'N';
	if (cas->qh == 0.0)
		return 'H';
	if (cas->qc == 0.0)
		return 'C';
	return 0;
}

/* Bisection on ΔTmin: the missing utility is zero below the threshold and
 * positive above it; the target is monotone in ΔTmin (Linnhoff et al. 1982). */
hl_status
hl_cascade_threshold_dtmin(const hl_case *c, const hl_cascade *cas, double *dt,
			   hl_error *err)
{
	char kind = hl_cascade_threshold_kind(cas);
	double lo = cas->dtmin, hi, tmax = HL_T_MIN, tmin = HL_T_MAX;
	double qh, qc, need;
	size_t i, it;
	hl_status st;

	*dt = HUGE_VAL;
	if (kind != 'H' && kind != 'C')
		return HL_OK;
	if ((kind == 'H' && cas->cold_total == 0.0) ||
	    (kind == 'C' && cas->hot_total == 0.0))
		return HL_OK;
	for (i = 0; i < c->nstream; i++) {
		tmax = fmax(tmax, fmax(hl_stream_supply(&c->stream[i]),
				       hl_stream_target(&c->stream[i])));
		tmin = fmin(tmin, fmin(hl_stream_supply(&c->stream[i]),
				       hl_stream_target(&c->stream[i])));
	}
	/* Past twice the whole span no shifted hot and cold ranges overlap. */
	hi = lo + 2.0 * (tmax - tmin) + 1.0;
	st = hl_cascade_targets(c, hi, &qh, &qc, err);
	if (st != HL_OK)
		return st;
	if ((kind == 'H' ? qh : qc) <= cas->tol)
		return HL_OK; /* fixed contributions: never needed */
	for (it = 0; it < 100 && hi - lo > 1e-10 * (1.0 + hi); it++) {
		double mid = 0.5 * (lo + hi);

		st = hl_cascade_targets(c, mid, &qh, &qc, err);
		if (st != HL_OK)
			return st;
		need = kind == 'H' ? qh : qc;
		if (need > cas->tol)
			hi = mid;
		else
			lo = mid;
	}
	*dt = 0.5 * (lo + hi);
	return HL_OK;
}

double
hl_cascade_hot_temp(const hl_cascade *cas, double shifted)
{
	return shifted + cas->dtmin / 2.0;
}

double
hl_cascade_cold_temp(const hl_cascade *cas, double shifted)
{
	return shifted - cas->dtmin / 2.0;
}
