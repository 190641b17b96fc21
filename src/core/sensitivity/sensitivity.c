/* sensitivity.c - one-sided derivatives of the energy targets, and bands.
 *
 * The data model. For a segment with shifted ends lo < hi write
 * φ(T) = (hi − max(lo, T))⁺, the part of its range above the shifted
 * temperature T, and R(T) = Σ_hot cp·φ(T) − Σ_cold cp·φ(T), the process heat
 * surplus above T. The problem table (Linnhoff & Flower 1978) gives
 * QHmin = max_T −R(T), attained at segment ends (the cascade's boundaries),
 * and QCmin = QHmin + Σ hot duty − Σ cold duty. So QHmin is the largest of
 * finitely many functions f_e = −R(T_e), one per segment end e, each
 * bilinear in the data (cp times temperature) while no two ends cross.
 *
 * Along a direction d of the data, the one-sided derivative of a maximum is
 * the largest one-sided derivative among the functions that attain it (the
 * max rule of Danskin 1967):  QH'(d) = max over active ends e of f_e'(d),
 * an end being active when its boundary's lifted cascade flow is zero. f_e'
 * lets the end move with the data (a supply temperature is itself a
 * boundary), and φ's kinks at hi and lo handle ends that coincide. The
 * derivative from the right is QH'(+e_x); from the left it is −QH'(−e_x),
 * which for smooth f_e is the smallest slope among the active ends.
 *
 * Bands. For a fixed T every term of R is monotone in each datum of its
 * segment, in a direction that does not depend on T (table in corner_sign).
 * Hence QHmin = max_T −R is monotone in every datum, its extremes over the
 * tolerance box lie at two corners known in advance, and one problem table at
 * each gives the exact band; the same holds for QCmin = max_T of the heat
 * deficit below T. The first-order estimate at the same corner takes every
 * boundary's linear model, f_e + f_e'(d), and their maximum, so it sees a
 * pinch that another boundary would take over inside the box (QHmin >= 0
 * among them) but not the cross terms of cp and temperature.
 */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "sensitivity_int.h"
#include "sorted.h"

void
hl_sens_work_free(hl_sens_work *w)
{
	free(w->g);
	free(w->first);
	free(w->d);
	free(w->end);
}

/* Flatten c's segments with the same shifted ends as the cascade's. */
hl_status
hl_sens_work_init(hl_sens_work *w, const hl_case *c, double dtmin, hl_error *err)
{
	size_t i, j, n = 0;

	memset(w, 0, sizeof *w);
	w->c = c;
	w->dtmin = dtmin;
	for (i = 0; i < c->nstream; i++)
		n += c->stream[i].nseg;
	w->n = n;
	w->g = malloc((n ? n : 1) * sizeof *w->g);
	w->d = calloc(n ? n : 1, sizeof *w->d);
	w->first = malloc((c->nstream ? c->nstream : 1) * sizeof *w->first);
	if (w->g == NULL || w->d == NULL || w->first == NULL) {
		hl_sens_work_free(w);
		return hl_error_nomem(err);
	}
	for (i = 0, n = 0; i < c->nstream; i++) {
		const hl_stream *s = &c->stream[i];
		double sh = hl_stream_shift(s, dtmin);

		sh = s->kind == HL_HOT ? -sh : sh;
		w->first[i] = n;
		for (j = 0; j < s->nseg; j++, n++) {
			const hl_segment *g = &s->seg[j];

			w->g[n].sign = s->kind == HL_HOT ? 1.0 : -1.0;
			w->g[n].hi = fmax(g->supply, g->target) + sh;
			w->g[n].lo = fmin(g->supply, g->target) + sh;
			w->g[n].cp = g->cp;
		}
	}
	return HL_OK;
}

/* Every segment end with its −R, the active ones (zero lifted flow) first. */
static hl_status
work_ends(hl_sens_work *w, const hl_cascade *cas, hl_error *err)
{
	size_t i, e, pass, n = 0;

	w->qh = cas->qh;
	w->end = malloc(2 * (w->n ? w->n : 1) * sizeof *w->end);
	if (w->end == NULL)
		return hl_error_nomem(err);
	for (pass = 0; pass < 2; pass++) {
		for (i = 0; i < w->n; i++) {
			for (e = 0; e < 2; e++) {
				double t = e ? w->g[i].lo : w->g[i].hi;
				size_t k = hl_sorted_find_desc(cas->t, cas->nb,
							       t);
				double flow = k < cas->nb && cas->t[k] == t ?
					      cas->flow[k] : 0.0;
				int act = flow <= cas->tol;

				if (act != (pass == 0))
					continue;
				w->end[n].g = i;
				w->end[n].lo = (int)e;
				w->end[n].t = t;
				w->end[n].f = cas->qh - flow;
				n++;
			}
		}
		if (pass == 0)
			w->nact = n;
	}
	w->nend = n;
	return HL_OK;
}

double
hl_sens_phi(const hl_sens_flat *g, double t)
{
	if (t >= g->hi)
		return 0.0;
	return t <= g->lo ? g->hi - g->lo : g->hi - t;
}

/* One-sided derivative of φ = (hi − max(lo, T))⁺ along (dhi, dlo, dt): the
 * max terms switch branch exactly at T = hi and T = lo. */
double
hl_sens_dphi(const hl_sens_flat *g, double t, double dhi, double dlo, double dt)
{
	if (t > g->hi)
		return 0.0;
	if (t == g->hi)
		return fmax(0.0, dhi - dt);
	if (t > g->lo)
		return dhi - dt;
	if (t == g->lo)
		return dhi - fmax(dlo, dt);
	return dhi - dlo;
}

/* R'(t) along s times the work direction, t moving at s·vt. */
double
hl_sens_surplus_dir(const hl_sens_work *w, double t, double vt, double s)
{
	double sum = 0.0;
	size_t i;

	for (i = 0; i < w->n; i++) {
		const hl_sens_flat *g = &w->g[i];
		const hl_sens_vel *d = &w->d[i];

		sum += g->sign * (s * d->dcp * hl_sens_phi(g, t) + g->cp *
			hl_sens_dphi(g, t, s * d->dhi, s * d->dlo, s * vt));
	}
	return sum;
}

/* The largest first-order model max_e [f_e − QH + f_e'(s·d)] over the
 * active ends (all = 0: QH'(s·d) by the max rule) or over every end
 * (all = 1: the linear model of every boundary, for the bands). */
static double
max_model(const hl_sens_work *w, double s, int all)
{
	double best = -HUGE_VAL;
	size_t a, n = all ? w->nend : w->nact;

	for (a = 0; a < n; a++) {
		const hl_sens_end *e = &w->end[a];
		double vt = e->lo ? w->d[e->g].dlo : w->d[e->g].dhi;
		double f = -hl_sens_surplus_dir(w, e->t, vt, s);

		if (all)
			f += e->f - w->qh;
		if (f > best)
			best = f;
	}
	return n ? best : 0.0;
}

static double
qh_dir(const hl_sens_work *w, double s)
{
	return max_model(w, s, 0);
}

/* d(Σ hot duty − Σ cold duty) along the work direction: smooth. */
double
hl_sens_balance_dir(const hl_sens_work *w)
{
	double sum = 0.0;
	size_t i;

	for (i = 0; i < w->n; i++) {
		const hl_sens_flat *g = &w->g[i];
		const hl_sens_vel *d = &w->d[i];

		sum += g->sign * (d->dcp * (g->hi - g->lo) +
				  g->cp * (d->dhi - d->dlo));
	}
	return sum;
}

void
hl_sens_dir_clear(hl_sens_work *w)
{
	memset(w->d, 0, w->n * sizeof *w->d);
}

/* Add k times the unit step of r's datum to the work direction. A segment
 * given by duty keeps its duty while a temperature moves, so its cp moves by
 * −cp/span per kelvin of span. */
void
hl_sens_dir_add(hl_sens_work *w, const hl_sens_row *r, double k)
{
	const hl_stream *s;
	const hl_segment *seg;
	size_t i, j, g;

	if (r->q == HL_SENS_DTMIN) {
		for (i = 0; i < w->c->nstream; i++) {
			double v = w->c->stream[i].kind == HL_HOT ? -0.5 : 0.5;

			s = &w->c->stream[i];
			if (!isnan(s->dt_contrib))
				continue;
			for (j = 0; j < s->nseg; j++) {
				g = w->first[i] + j;
				w->d[g].dhi += k * v;
				w->d[g].dlo += k * v;
			}
		}
		return;
	}
	s = &w->c->stream[r->stream];
	if (r->q == HL_SENS_CP || r->q == HL_SENS_DUTY) {
		g = w->first[r->stream] + r->segment;
		seg = &s->seg[r->segment];
		w->d[g].dcp += r->q == HL_SENS_CP ? k :
			k / fabs(seg->supply - seg->target);
		return;
	}
	j = r->q == HL_SENS_SUPPLY ? 0 : s->nseg - 1;
	g = w->first[r->stream] + j;
	seg = &s->seg[j];
	/* The supply is the upper end of a hot segment, the lower of a cold. */
	if ((r->q == HL_SENS_SUPPLY) == (s->kind == HL_HOT)) {
		w->d[g].dhi += k;
		if (seg->by_duty)
			w->d[g].dcp -= k * seg->cp / (w->g[g].hi - w->g[g].lo);
	} else {
		w->d[g].dlo += k;
		if (seg->by_duty)
			w->d[g].dcp += k * seg->cp / (w->g[g].hi - w->g[g].lo);
	}
}

static int
differ(double a, double b)
{
	return fabs(a - b) > 1e-9 * (1.0 + fabs(a) + fabs(b));
}

/* The four one-sided derivatives of a row, and its moves within ±tol. */
static void
row_derivatives(hl_sens_work *w, hl_sens_row *r)
{
	double bal;

	hl_sens_dir_clear(w);
	hl_sens_dir_add(w, r, 1.0);
	bal = hl_sens_balance_dir(w);
	r->hot_plus = qh_dir(w, 1.0);
	r->hot_minus = -qh_dir(w, -1.0);
	r->cold_plus = r->hot_plus + bal;
	r->cold_minus = r->hot_minus + bal;
	r->kink = differ(r->hot_plus, r->hot_minus);
	r->hot_up = fmax(0.0, fmax(r->hot_plus * r->tol,
				   -r->hot_minus * r->tol));
	r->hot_down = fmax(0.0, fmax(-r->hot_plus * r->tol,
				     r->hot_minus * r->tol));
	r->cold_up = fmax(0.0, fmax(r->cold_plus * r->tol,
				    -r->cold_minus * r->tol));
	r->cold_down = fmax(0.0, fmax(-r->cold_plus * r->tol,
				      r->cold_minus * r->tol));
}

const char *
hl_sensitivity_quantity_name(hl_sens_quantity q)
{
	static const char *const names[] = { "supply", "target", "cp", "duty",
					     "dtmin", "level" };

	return (unsigned)q < 6 ? names[q] : "?";
}

double
hl_sensitivity_effect(const hl_sens_row *r)
{
	if (!isnan(r->cost_plus) && !isnan(r->cost_minus))
		return r->tol > 0.0 ? fmax(fabs(r->cost_plus),
					   fabs(r->cost_minus)) * r->tol : 0.0;
	return fmax(fmax(r->hot_down, r->hot_up), fmax(r->cold_down, r->cold_up));
}

static hl_status
check_tolerances(const hl_case *c, hl_error *err)
{
	size_t i;

	if (!(c->set.cp_tol >= 0.0 && c->set.cp_tol < 1.0) ||
	    !(c->set.t_tol >= 0.0 && c->set.t_tol <= 100.0))
		return hl_error_set(err, HL_EINPUT, c->source, 0, "the default "
			"cp_tol must lie in [0, 1) and t_tol between 0 and "
			"100 K");
	for (i = 0; i < c->nstream; i++) {
		const hl_stream *s = &c->stream[i];

		if (!isnan(s->cp_tol) && !(s->cp_tol >= 0.0 && s->cp_tol < 1.0))
			return hl_error_set(err, HL_EINPUT, s->file, s->line,
				"stream '%s': cp_tol %g is a fraction and must "
				"lie in [0, 1) (0.05 means ±5 %%)", s->name,
				s->cp_tol);
		if (!isnan(s->t_tol) && !(s->t_tol >= 0.0 && s->t_tol <= 100.0))
			return hl_error_set(err, HL_EINPUT, s->file, s->line,
				"stream '%s': t_tol must lie between 0 and 100 "
				"K", s->name);
	}
	return HL_OK;
}

/* The rows in case order, with their values and tolerances. */
static hl_status
make_rows(const hl_case *c, hl_sensitivity *sv, hl_error *err)
{
	size_t i, j, n = 0;

	for (i = 0; i < c->nstream; i++)
		n += 2 + c->stream[i].nseg;
	sv->row = calloc(n ? n : 1, sizeof *sv->row);
	sv->rank = malloc((n ? n : 1) * sizeof *sv->rank);
	if (sv->row == NULL || sv->rank == NULL)
		return hl_error_nomem(err);
	for (i = 0, n = 0; i < c->nstream; i++) {
		const hl_stream *s = &c->stream[i];
		double tt = isnan(s->t_tol) ? c->set.t_tol : s->t_tol;
		double kt = isnan(s->cp_tol) ? c->set.cp_tol : s->cp_tol;

		sv->row[n].stream = i;
		sv->row[n].q = HL_SENS_SUPPLY;
		sv->row[n].value = hl_stream_supply(s);
		sv->row[n++].tol = tt;
		sv->row[n].stream = i;
		sv->row[n].q = HL_SENS_TARGET;
		sv->row[n].value = hl_stream_target(s);
		sv->row[n++].tol = tt;
		for (j = 0; j < s->nseg; j++, n++) {
			const hl_segment *g = &s->seg[j];

			sv->row[n].stream = i;
			sv->row[n].segment = j;
			sv->row[n].q = g->by_duty ? HL_SENS_DUTY : HL_SENS_CP;
			sv->row[n].value = g->by_duty ?
				g->cp * fabs(g->supply - g->target) : g->cp;
			sv->row[n].tol = kt * sv->row[n].value;
		}
	}
	sv->nrow = n;
	return HL_OK;
}

/* Utility cost per year = (price_hot·QHmin + price_cold·QCmin)·hours/1000
 * (price per MWh, loads in kW), when there is one level of each. */
static void
cost_derivatives(const hl_case *c, hl_sensitivity *sv)
{
	size_t i, nh = 0, nc = 0;
	double ph = 0.0, pc = 0.0, k = c->set.hours / 1000.0;
	hl_sens_row *r;

	for (i = 0; i < c->nutil; i++) {
		if (c->util[i].kind == HL_HOT) {
			nh++;
			ph = c->util[i].price;
		} else {
			nc++;
			pc = c->util[i].price;
		}
	}
	sv->cost = c->nutil == 0 ? HL_SENS_COST_NONE : nh == 1 && nc == 1 ?
		HL_SENS_COST_SINGLE : HL_SENS_COST_LEVELS;
	for (i = 0; i <= sv->nrow; i++) {
		r = i < sv->nrow ? &sv->row[i] : &sv->dt;
		if (sv->cost != HL_SENS_COST_SINGLE) {
			r->cost_minus = r->cost_plus = NAN;
			continue;
		}
		r->cost_minus = k * (ph * r->hot_minus + pc * r->cold_minus);
		r->cost_plus = k * (ph * r->hot_plus + pc * r->cold_plus);
	}
}

typedef struct {
	double effect;
	size_t i;
} ranked;

static int
cmp_ranked(const void *a, const void *b)
{
	const ranked *x = a, *y = b;

	if (x->effect != y->effect)
		return x->effect < y->effect ? 1 : -1;
	return (x->i > y->i) - (x->i < y->i);
}

static hl_status
rank_rows(hl_sensitivity *sv, hl_error *err)
{
	ranked *r = malloc((sv->nrow ? sv->nrow : 1) * sizeof *r);
	size_t i;

	if (r == NULL)
		return hl_error_nomem(err);
	for (i = 0; i < sv->nrow; i++) {
		r[i].effect = hl_sensitivity_effect(&sv->row[i]);
		r[i].i = i;
	}
	qsort(r, sv->nrow, sizeof *r, cmp_ranked);
	for (i = 0; i < sv->nrow; i++) {
		sv->rank[i] = r[i].i;
		sv->row[r[i].i].rank = i + 1;
	}
	free(r);
	return HL_OK;
}

/* The direction of r's datum that raises QHmin (cold = 0) or QCmin
 * (cold = 1), from the sign of ∂R/∂x at every fixed T. A segment given by
 * cp: a wider, larger cold segment and a narrower, smaller hot one need more
 * hot utility. A segment given by duty: its heat fraction above T grows with
 * both its ends, so a warmer, larger cold segment and a cooler, smaller hot
 * one need more. The deficit below T that sets QCmin mirrors both. */
static double
corner_sign(const hl_case *c, const hl_sens_row *r, int cold)
{
	const hl_stream *s = &c->stream[r->stream];
	size_t j = r->q == HL_SENS_SUPPLY ? 0 : r->q == HL_SENS_TARGET ?
		s->nseg - 1 : r->segment;
	int hot = s->kind == HL_HOT;
	double sg;

	if (r->q == HL_SENS_CP || r->q == HL_SENS_DUTY)
		sg = hot ? -1.0 : 1.0;
	else if (s->seg[j].by_duty)
		sg = hot ? -1.0 : 1.0;
	else
		sg = r->q == HL_SENS_SUPPLY ? -1.0 : 1.0;
	if (!cold)
		return sg;
	/* QCmin, the deficit below T: cp, duty and the ends of a cp segment
	 * turn round (a larger, wider hot segment, a smaller, narrower cold
	 * one); the ends of a duty segment keep their direction (a cooler hot
	 * segment puts more of its heat low, a warmer cold one less of its
	 * demand). */
	if (r->q == HL_SENS_CP || r->q == HL_SENS_DUTY)
		return -sg;
	return s->seg[j].by_duty ? sg : -sg;
}

/* The segments of stream s moved to the corner sg·(corner_sign) of the
 * tolerance box; a segment the box turns inside out shrinks to nothing (a
 * duty segment to 1e-6 K, keeping its duty). */
static void
corner_segments(const hl_case *c, const hl_sensitivity *sv, size_t *ri,
		size_t si, int cold, double sg, hl_segment *seg,
		size_t *collapsed)
{
	const hl_stream *s = &c->stream[si];
	size_t j, n = s->nseg;
	const hl_sens_row *r = &sv->row[*ri];

	memcpy(seg, s->seg, n * sizeof *seg);
	seg[0].supply += sg * corner_sign(c, &r[0], cold) * r[0].tol;
	seg[n - 1].target += sg * corner_sign(c, &r[1], cold) * r[1].tol;
	for (j = 0; j < n; j++) {
		const hl_sens_row *rj = &r[2 + j];
		const hl_segment *o = &s->seg[j];
		double f = 1.0 + sg * corner_sign(c, rj, cold) * rj->tol /
			   rj->value;
		double span = fabs(seg[j].supply - seg[j].target);
		int inside_out = (s->kind == HL_HOT) !=
				 (seg[j].supply > seg[j].target);

		if (inside_out || span == 0.0) {
			double m = n == 1 ? 0.5 * (seg[j].supply + seg[j].target)
				 : j == 0 ? seg[j].target : seg[j].supply;
			double eps = o->by_duty ? 1e-6 : 0.0;

			(*collapsed)++;
			eps = s->kind == HL_HOT ? eps : -eps;
			if (j == 0 && n > 1) {
				seg[j].supply = m + eps;
			} else if (n > 1) {
				seg[j].target = m - eps;
			} else {
				seg[j].supply = m + eps / 2;
				seg[j].target = m - eps / 2;
			}
			span = fabs(seg[j].supply - seg[j].target);
		}
		if (o->by_duty)
			seg[j].cp = o->cp * fabs(o->supply - o->target) * f /
				    span;
		else
			seg[j].cp = o->cp * f;
	}
	*ri += 2 + n;
}

/* The target (QHmin or QCmin) re-solved at one corner of the box. */
static hl_status
corner_target(const hl_case *c, const hl_sensitivity *sv, int cold, double sg,
	      double *value, size_t *collapsed, hl_error *err)
{
	hl_case *cc = hl_case_create();
	hl_segment *seg = NULL;
	size_t i, ri = 0, most = 1, n = 0;
	double qh, qc;
	hl_status st = HL_OK;

	for (i = 0; i < c->nstream; i++)
		if (c->stream[i].nseg > most)
			most = c->stream[i].nseg;
	if (cc != NULL)
		seg = malloc(most * sizeof *seg);
	if (cc == NULL || seg == NULL)
		st = hl_error_nomem(err);
	for (i = 0; st == HL_OK && i < c->nstream; i++) {
		hl_stream s = c->stream[i];

		corner_segments(c, sv, &ri, i, cold, sg, seg, &n);
		s.seg = seg;
		st = hl_case_add_stream(cc, &s, err);
	}
	if (st == HL_OK)
		st = hl_cascade_targets(cc, sv->dtmin, &qh, &qc, err);
	if (st == HL_OK)
		*value = cold ? qc : qh;
	if (n > *collapsed)
		*collapsed = n;
	free(seg);
	hl_case_free(cc);
	return st;
}

/* First-order estimate at the corners: the direction Σ sign·tol·step. */
static void
linear_band(hl_sens_work *w, const hl_sensitivity *sv, int cold, hl_sens_band *b)
{
	size_t i;
	double bal;

	hl_sens_dir_clear(w);
	for (i = 0; i < sv->nrow; i++)
		hl_sens_dir_add(w, &sv->row[i],
			corner_sign(w->c, &sv->row[i], cold) * sv->row[i].tol);
	bal = cold ? hl_sens_balance_dir(w) : 0.0;
	b->lin_high = b->nominal + max_model(w, 1.0, 1) + bal;
	b->lin_low = b->nominal + max_model(w, -1.0, 1) - bal;
}

static hl_status
bands(hl_sens_work *w, const hl_case *c, hl_sensitivity *sv, hl_error *err)
{
	hl_status st;
	int cold;

	for (cold = 0; cold < 2; cold++) {
		hl_sens_band *b = cold ? &sv->cold : &sv->hot;

		linear_band(w, sv, cold, b);
		st = corner_target(c, sv, cold, 1.0, &b->high, &sv->collapsed,
				   err);
		if (st == HL_OK)
			st = corner_target(c, sv, cold, -1.0, &b->low,
					   &sv->collapsed, err);
		if (st != HL_OK)
			return st;
	}
	return HL_OK;
}

static size_t
count_active_boundaries(const hl_cascade *cas)
{
	size_t k, n = 0;

	for (k = 0; k < cas->nb; k++)
		n += cas->flow[k] <= cas->tol;
	return n;
}

static hl_status
compute(hl_sens_work *w, const hl_case *c, const hl_cascade *cas, hl_sensitivity *sv,
	hl_error *err)
{
	hl_status st;
	size_t i;

	st = check_tolerances(c, err);
	if (st == HL_OK)
		st = make_rows(c, sv, err);
	if (st == HL_OK)
		st = work_ends(w, cas, err);
	if (st != HL_OK)
		return st;
	sv->nactive = count_active_boundaries(cas);
	for (i = 0; i < sv->nrow; i++)
		row_derivatives(w, &sv->row[i]);
	sv->dt.q = HL_SENS_DTMIN;
	sv->dt.value = cas->dtmin;
	row_derivatives(w, &sv->dt);
	cost_derivatives(c, sv);
	if (c->nutil > 0)
		st = hl_sens_cost_lp(c, sv, sv->cost == HL_SENS_COST_LEVELS,
				     err);
	if (st != HL_OK)
		return st;
	sv->hot.nominal = cas->qh;
	sv->cold.nominal = cas->qc;
	st = rank_rows(sv, err);
	return st == HL_OK ? bands(w, c, sv, err) : st;
}

hl_status
hl_sensitivity_compute(const hl_case *c, const hl_cascade *cas,
		       hl_sensitivity **out, hl_error *err)
{
	hl_sensitivity *sv;
	hl_sens_work w;
	hl_status st;

	*out = NULL;
	sv = calloc(1, sizeof *sv);
	if (sv == NULL)
		return hl_error_nomem(err);
	sv->dtmin = cas->dtmin;
	st = hl_sens_work_init(&w, c, cas->dtmin, err);
	if (st == HL_OK) {
		st = compute(&w, c, cas, sv, err);
		hl_sens_work_free(&w);
	}
	if (st != HL_OK) {
		hl_sensitivity_free(sv);
		return st;
	}
	*out = sv;
	return HL_OK;
}

void
hl_sensitivity_free(hl_sensitivity *s)
{
	if (s == NULL)
		return;
	free(s->row);
	free(s->rank);
	free(s->urow);
	free(s);
}

hl_status
hl_sensitivity_surplus(const hl_case *c, double dtmin, const hl_sens_row *r,
		       double t, int tied, double *minus, double *plus,
		       hl_error *err)
{
	hl_sens_work w;
	double vt = 0.0;
	size_t i;
	hl_status st = hl_sens_work_init(&w, c, dtmin, err);

	if (st != HL_OK)
		return st;
	hl_sens_dir_add(&w, r, 1.0);
	for (i = 0; tied && i < w.n; i++) {
		if (w.g[i].hi == t && w.d[i].dhi != 0.0)
			vt = w.d[i].dhi;
		else if (w.g[i].lo == t && w.d[i].dlo != 0.0)
			vt = w.d[i].dlo;
	}
	*plus = hl_sens_surplus_dir(&w, t, vt, 1.0);
	*minus = -hl_sens_surplus_dir(&w, t, vt, -1.0);
	hl_sens_work_free(&w);
	return HL_OK;
}
