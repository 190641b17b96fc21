/* supertarget.c - Townsend & Linnhoff (1984) area target on the balanced
 * composites, Ahmad & Smith (1989) shell target, Hohmann (1971) units.
 *
 * Each side (hot: hot streams and hot utilities; cold: cold streams and cold
 * utilities) becomes a composite: a list of segments along the enthalpy axis
 * that rise in temperature, each with the heat-weighted film resistance
 * Σ(q_i/h_i)/Σq_i of what is in it and the number of streams present. The
 * two lists are then walked together; every piece of enthalpy lying in one
 * segment of each side is a vertical-transfer interval.
 */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "exchanger.h"
#include "sorted.h"
#include "supertarget.h"

typedef struct {
	double t_lo, t_hi; /* °C, t_lo == t_hi for an isothermal utility */
	double q;          /* kW */
	double h;          /* kW/(m²·K) */
} piece;

typedef struct {
	double h0, h1;     /* kW along the composite */
	double t0, t1;     /* °C at h0 and h1 */
	double res;        /* Σ(q/h)/Σq, m²·K/kW */
	int n;             /* streams present */
} seg;

typedef struct {
	piece *p;
	size_t n, cap;
} pieces;

static int
push_piece(pieces *ps, double t_lo, double t_hi, double q, double h)
{
	if (q <= 0.0)
		return 1;
	if (ps->n == ps->cap) {
		size_t ncap = ps->cap ? 2 * ps->cap : 64;
		piece *p = realloc(ps->p, ncap * sizeof *p);

		if (p == NULL)
			return 0;
		ps->p = p;
		ps->cap = ncap;
	}
	ps->p[ps->n].t_lo = t_lo;
	ps->p[ps->n].t_hi = t_hi;
	ps->p[ps->n].q = q;
	ps->p[ps->n].h = h;
	ps->n++;
	return 1;
}

static double
h_or_default(double h, double dflt, int *assumed)
{
	if (isnan(h)) {
		(*assumed)++;
		return dflt;
	}
	return h;
}

/* The pieces of both sides; returns 0 on allocation failure. */
static int
collect(const hl_case *c, const double *util_load, pieces *hot, pieces *cold,
	int *assumed)
{
	size_t i, j;

	for (i = 0; i < c->nstream; i++) {
		const hl_stream *s = &c->stream[i];
		pieces *ps = s->kind == HL_HOT ? hot : cold;
		int seen = 0;

		for (j = 0; j < s->nseg; j++) {
			const hl_segment *g = &s->seg[j];
			double lo = fmin(g->supply, g->target);
			double hi = fmax(g->supply, g->target);

			seen |= isnan(g->h);
			if (!push_piece(ps, lo, hi, g->cp * (hi - lo),
					isnan(g->h) ? c->set.h_default : g->h))
				return 0;
		}
		*assumed += seen;
	}
	for (i = 0; util_load != NULL && i < c->nutil; i++) {
		const hl_utility *u = &c->util[i];
		double h;

		if (!(util_load[i] > 0.0))
			continue;
		h = h_or_default(u->h, c->set.h_default, assumed);
		if (!push_piece(u->kind == HL_HOT ? hot : cold,
				fmin(u->supply, u->target),
				fmax(u->supply, u->target), util_load[i], h))
			return 0;
	}
	return 1;
}

/* Per boundary j: sloped sums over interval j..j+1 and steps at j. */
typedef struct {
	double *cp, *cph, *step_q, *step_qh;
	int *cnt, *step_n;
} sums;

static void
add_pieces(const pieces *ps, const double *t, size_t nt, sums *s)
{
	size_t i;

	for (i = 0; i < ps->n; i++) {
		const piece *p = &ps->p[i];
		size_t a = hl_sorted_find_asc(t, nt, p->t_lo);

		if (p->t_hi == p->t_lo) {
			s->step_q[a] += p->q;
			s->step_qh[a] += p->q / p->h;
			s->step_n[a]++;
		} else {
			size_t b = hl_sorted_find_asc(t, nt, p->t_hi);
			double cp = p->q / (p->t_hi - p->t_lo);

			s->cp[a] += cp;
			s->cp[b] -= cp;
			s->cph[a] += cp / p->h;
			s->cph[b] -= cp / p->h;
			s->cnt[a]++;
			s->cnt[b]--;
		}
	}
}

static void
emit(seg *out, size_t *n, double *h, double t0, double t1, double q,
     double qh, int cnt)
{
	if (q <= 0.0)
		return;
	out[*n].h0 = *h;
	out[*n].h1 = *h + q;
	out[*n].t0 = t0;
	out[*n].t1 = t1;
	out[*n].res = qh / q;
	out[*n].n = cnt;
	*h += q;
	(*n)++;
}

/* The composite of one side, rising in temperature from enthalpy h0. */
static seg *
composite(const pieces *ps, double h0, size_t *nseg)
{
	size_t nt = 0, i, k, u = 0;
	double *t = malloc((2 * ps->n + 1) * sizeof *t), h = h0;
	double run_cp = 0, run_cph = 0;
	int run_n = 0;
	sums s;
	seg *out = NULL;

	*nseg = 0;
	if (t == NULL)
		return NULL;
	for (i = 0; i < ps->n; i++) {
		t[nt++] = ps->p[i].t_lo;
		t[nt++] = ps->p[i].t_hi;
	}
	u = hl_sorted_unique_asc(t, nt);
	s.cp = calloc(u + 1, sizeof(double));
	s.cph = calloc(u + 1, sizeof(double));
	s.step_q = calloc(u + 1, sizeof(double));
	s.step_qh = calloc(u + 1, sizeof(double));
	s.cnt = calloc(u + 1, sizeof(int));
	s.step_n = calloc(u + 1, sizeof(int));
	out = malloc((2 * u + 1) * sizeof *out);
	if (s.cp && s.cph && s.step_q && s.step_qh && s.cnt && s.step_n && out) {
		add_pieces(ps, t, u, &s);
		for (k = 0; k < u; k++) {
			emit(out, nseg, &h, t[k], t[k], s.step_q[k],
			     s.step_qh[k], s.step_n[k]);
			run_cp += s.cp[k];
			run_cph += s.cph[k];
			run_n += s.cnt[k];
			if (k + 1 < u && run_n > 0)
				emit(out, nseg, &h, t[k], t[k + 1],
				     run_cp * (t[k + 1] - t[k]),
				     run_cph * (t[k + 1] - t[k]), run_n);
		}
	} else {
		free(out);
		out = NULL;
	}
	free(t);
	free(s.cp);
	free(s.cph);
	free(s.step_q);
	free(s.step_qh);
	free(s.cnt);
	free(s.step_n);
	return out;
}

static double
temp_at(const seg *g, double h)
{
	if (g->h1 == g->h0)
		return g->t0;
	return g->t0 + (g->t1 - g->t0) * (h - g->h0) / (g->h1 - g->h0);
}

/* Area and shells of one vertical interval [ha, hb]. */
static hl_status
interval(const hl_settings *set, const seg *hs, const seg *cs, double ha,
	 double hb, hl_supertargets *st, hl_error *err)
{
	double th_a = temp_at(hs, ha), th_b = temp_at(hs, hb);
	double tc_a = temp_at(cs, ha), tc_b = temp_at(cs, hb);
	double q = hb - ha, lmtd, a, p, r, f = 1.0, nreal = 0.0;
	hl_status s;

	s = hl_exchanger_lmtd(th_b - tc_b, th_a - tc_a, &lmtd, NULL);
	if (s != HL_OK)
		return hl_error_set(err, HL_ENOSOLUTION, NULL, 0,
			"the composite curves touch (no driving force near "
			"%.1f °C): the area target is unbounded; use a ΔTmin "
			"above 0", th_a);
	a = q * (hs->res + cs->res) / lmtd;
	st->area += a;
	/* Hot side from th_b down to th_a, cold from tc_a up to tc_b. */
	if (hl_exchanger_pr(th_b, th_a, tc_a, tc_b, &p, &r, NULL) == HL_OK &&
	    p > 0.0 && r > 0.0 && isfinite(r)) {
		int n;

		nreal = hl_exchanger_shells_estimate(p, r, set->xp);
		if (!isfinite(nreal) || nreal < 0.0)
			nreal = 0.0;
		n = (int)ceil(nreal - 1e-9);
		if (n < 1)
			n = 1;
		if (n > HL_EXCHANGER_MAX_SHELLS ||
		    hl_exchanger_f_shells(p, r, n, &f, NULL) != HL_OK)
			f = 1.0;
	}
	st->area_st += a / f;
	st->shells_real += nreal * (double)(hs->n + cs->n - 1);
	return HL_OK;
}

/* Walk both composites over their common enthalpy range. */
static hl_status
integrate(const hl_settings *set, const seg *hs, size_t nh, const seg *cs,
	  size_t nc, hl_supertargets *st, hl_error *err)
{
	size_t i = 0, j = 0;
	double lo, hi, h;

	if (nh == 0 || nc == 0)
		return HL_OK;
	lo = fmax(hs[0].h0, cs[0].h0);
	hi = fmin(hs[nh - 1].h1, cs[nc - 1].h1);
	h = lo;
	while (i < nh && hs[i].h1 <= h)
		i++;
	while (j < nc && cs[j].h1 <= h)
		j++;
	while (i < nh && j < nc && h < hi) {
		double next = fmin(fmin(hs[i].h1, cs[j].h1), hi);
		hl_status s;

		if (next > h * (1 + 1e-14) + 1e-12) {
			s = interval(set, &hs[i], &cs[j], h, next, st, err);
			if (s != HL_OK)
				return s;
		}
		h = next;
		if (hs[i].h1 <= h)
			i++;
		if (cs[j].h1 <= h)
			j++;
	}
	return HL_OK;
}

/* 1 when the shifted range [lo, hi] has heat inside subnetwork (a, b). */
static int
in_sub(double lo, double hi, double a, double b)
{
	return fmin(hi, a) - fmax(lo, b) > 1e-9 * (1.0 + fabs(lo) + fabs(hi));
}

/* N − 1 per subnetwork; pinch[] falling shifted temperatures. */
static int
units_target(const hl_case *c, const double *util_load,
	     const hl_cascade *cas, const double *pinch, size_t np,
	     size_t *nsub)
{
	double dtmin = cas->dtmin;
	size_t s, i;
	int units = 0;

	*nsub = np + 1;
	for (s = 0; s <= np; s++) {
		double a = s == 0 ? HUGE_VAL : pinch[s - 1];
		double b = s == np ? -HUGE_VAL : pinch[s];
		int n = 0;

		for (i = 0; i < c->nstream; i++) {
			const hl_stream *st = &c->stream[i];
			double sh = hl_stream_shift(st, dtmin);
			double t1 = hl_stream_supply(st), t2 = hl_stream_target(st);

			sh = st->kind == HL_HOT ? -sh : sh;
			n += in_sub(fmin(t1, t2) + sh, fmax(t1, t2) + sh, a, b);
		}
		for (i = 0; util_load != NULL && i < c->nutil; i++) {
			const hl_utility *u = &c->util[i];
			double sh = hl_utility_shift(u, dtmin);
			double lo = fmin(u->supply, u->target);
			double hi = fmax(u->supply, u->target);

			if (!(util_load[i] > 0.0))
				continue;
			sh = u->kind == HL_HOT ? -sh : sh;
			lo += sh;
			hi += sh;
			/* An isothermal hot utility heats below its level, a
			 * cold one cools above it. */
			if (lo == hi) {
				if (u->kind == HL_HOT)
					lo -= 1e-6 * (1.0 + fabs(lo));
				else
					hi += 1e-6 * (1.0 + fabs(hi));
			}
			n += in_sub(lo, hi, a, b);
		}
		/* Without a utility table: one implicit hot utility above
		 * everything and one cold utility below. */
		if (util_load == NULL) {
			n += s == 0 && cas->qh > 0.0;
			n += s == np && cas->qc > 0.0;
		}
		if (n > 1)
			units += n - 1;
	}
	return units;
}

double
hl_supertarget_crf(double i, double n)
{
	double g;

	if (i == 0.0)
		return 1.0 / n;
	g = pow(1.0 + i, n);
	return i * g / (g - 1.0);
}

static void
costs(const hl_case *c, const double *util_load, hl_supertargets *st)
{
	const hl_settings *set = &c->set;
	size_t i;
	int shell_tube = set->exchanger == HL_EXCH_SHELL_TUBE;
	int n = shell_tube ? st->shells : st->units;
	double a = shell_tube ? st->area_st : st->area;

	st->capital = 0.0;
	if (n > 0 && a > 0.0)
		st->capital = n * (set->cost_a + set->cost_b *
				   pow(a / n, set->cost_c));
	st->capital_annual = st->capital *
			     hl_supertarget_crf(set->interest, set->life);
	st->energy_cost = 0.0;
	for (i = 0; util_load != NULL && i < c->nutil; i++)
		st->energy_cost += util_load[i] * c->util[i].price *
				   set->hours / 1000.0;
	st->total_cost = st->capital_annual + st->energy_cost;
}

static void
loads(const hl_case *c, const double *util_load, hl_supertargets *st)
{
	size_t i;

	for (i = 0; i < c->nutil; i++) {
		if (c->util[i].kind == HL_HOT)
			st->hot_utility += util_load[i];
		else
			st->cold_utility += util_load[i];
	}
}

hl_status
hl_supertarget_compute(const hl_case *c, const hl_cascade *cas,
		       const double *util_load, const double *pinch,
		       size_t npinch, hl_supertargets *out, hl_error *err)
{
	pieces hot = { 0 }, cold = { 0 };
	seg *hs = NULL, *cs = NULL;
	size_t nh = 0, nc = 0, i;
	double *pt = NULL;
	hl_status st = HL_OK;

	memset(out, 0, sizeof *out);
	out->dtmin = cas->dtmin;
	if (c->nutil == 0)
		util_load = NULL;
	out->balanced = util_load != NULL;
	if (util_load != NULL) {
		loads(c, util_load, out);
	} else {
		out->hot_utility = cas->qh;
		out->cold_utility = cas->qc;
	}
	if (!collect(c, util_load, &hot, &cold, &out->assumed_h))
		st = hl_error_nomem(err);
	if (st == HL_OK) {
		hs = composite(&hot, 0.0, &nh);
		cs = composite(&cold, out->balanced ? 0.0 : cas->qc, &nc);
		if ((hot.n && hs == NULL) || (cold.n && cs == NULL))
			st = hl_error_nomem(err);
	}
	if (st == HL_OK)
		st = integrate(&c->set, hs, nh, cs, nc, out, err);
	if (st == HL_OK && pinch == NULL) {
		pt = malloc((cas->npinch + 1) * sizeof *pt);
		if (pt == NULL)
			st = hl_error_nomem(err);
		for (i = 0; pt != NULL && i < cas->npinch; i++)
			pt[i] = cas->t[cas->pinch[i]];
		pinch = pt;
		npinch = cas->npinch;
	}
	if (st == HL_OK) {
		out->units = units_target(c, util_load, cas, pinch, npinch,
					  &out->nsub);
		out->shells = (int)ceil(out->shells_real - 1e-9);
		if (out->shells < out->units)
			out->shells = out->units;
		costs(c, util_load, out);
	}
	free(pt);
	free(hot.p);
	free(cold.p);
	free(hs);
	free(cs);
	return st;
}
