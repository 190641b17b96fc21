/* existing_walk.c - placing today's units on their streams.
 *
 * Each stream's units are ordered (given temperatures first, else the row
 * order) and walked from the supply end: a unit starts where its given
 * temperature puts it, or where the one before it ends, and runs for its
 * duty. The rules and tolerances are in existing.h.
 */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "existing_int.h"

/* One unit's side on the stream being walked. */
typedef struct {
	hl_existing_unit *u;
	hl_side *side;
	size_t row;
	double key;    /* kW from the supply end where the row puts it; NaN */
	double order;  /* sort key */
} entry;

/* How far a temperature at t may stray from the reading. */
static double
temp_tol(const hl_case *c, const hl_stream *s, double t)
{
	return 2.0 * hl_existing_t_tol(c, s) + hl_existing_cp_tol(c, s) *
	       fabs(t - hl_stream_supply(s));
}

static hl_side *
side_on(hl_existing_unit *u, long si)
{
	if (u->hot.stream == si)
		return &u->hot;
	if (u->cold.stream == si)
		return &u->cold;
	return NULL;
}

/* Another unit on the stream gives an inlet within 2·t_tol of this one's:
 * the two are branches, and cp × ΔT is not the duty of either. */
static int
branch_like(const hl_existing_work *w, size_t self, long si, double t_in)
{
	const hl_stream *s = &w->c->stream[si];
	double tol = 2.0 * hl_existing_t_tol(w->c, s);
	size_t i;

	for (i = 0; i < w->c->nunit; i++) {
		hl_side *o = side_on(&w->net->unit[i], si);

		if (i != self && o != NULL && !isnan(o->given_in) &&
		    fabs(o->given_in - t_in) <= tol)
			return 1;
	}
	return 0;
}

/* The stream's heat between a side's given inlet and outlet; NaN when
 * that is no check (a utility side, a temperature missing, a branch). */
static double
given_heat(const hl_existing_work *w, size_t i, const hl_side *sd)
{
	const hl_stream *s;

	if (sd->stream < 0 || isnan(sd->given_in) || isnan(sd->given_out) ||
	    branch_like(w, i, sd->stream, sd->given_in))
		return NAN;
	s = &w->c->stream[sd->stream];
	return fabs(hl_stream_heat_at(s, sd->given_out) -
		    hl_stream_heat_at(s, sd->given_in));
}

/* cp_tol of the larger plus cp × 2·t_tol. */
static double
duty_tol(const hl_existing_work *w, const hl_side *sd, double q, double duty)
{
	const hl_stream *s = &w->c->stream[sd->stream];
	double dt = fabs(sd->given_out - sd->given_in);
	double cp = dt > 0.0 ? q / dt : s->seg[0].cp;

	return hl_existing_cp_tol(w->c, s) * fmax(q, duty) +
	       cp * 2.0 * hl_existing_t_tol(w->c, s);
}

static int
warn_side(hl_existing_work *w, const hl_existing_unit *u, const hl_side *sd,
	  double q)
{
	const hl_stream *s = &w->c->stream[sd->stream];

	return hl_existing_warn(w->net, u->file, u->line, "unit '%s': duty "
		"%.1f kW, but stream '%s' changes by %.1f kW between the given "
		"%.1f and %.1f °C (cp × ΔT); using the duty", u->name, u->duty,
		s->name, q, sd->given_in, sd->given_out);
}

/* Linnhoff et al. (1982) energy balance of one unit: Q = cp·ΔT per side. */
static hl_status
balance_unit(hl_existing_work *w, size_t i)
{
	hl_existing_unit *u = &w->net->unit[i];
	double qh = given_heat(w, i, &u->hot), qc = given_heat(w, i, &u->cold);
	double th = isnan(qh) ? 0.0 : duty_tol(w, &u->hot, qh, u->duty);
	double tc = isnan(qc) ? 0.0 : duty_tol(w, &u->cold, qc, u->duty);
	int bad_h = !isnan(qh) && fabs(qh - u->duty) > th;
	int bad_c = !isnan(qc) && fabs(qc - u->duty) > tc;
	int rc = 0;

	if (bad_h && bad_c && fabs(qh - qc) <= fmax(th, tc)) {
		double q = 0.5 * (qh + qc);

		rc = hl_existing_warn(w->net, u->file, u->line, "unit '%s': "
			"duty %.1f kW, but both sides' temperatures give "
			"%.1f kW (cp × ΔT: hot %.1f, cold %.1f kW); using "
			"%.1f kW", u->name, u->duty, q, qh, qc, q);
		u->duty = q;
	} else {
		if (bad_h)
			rc |= warn_side(w, u, &u->hot, qh);
		if (bad_c)
			rc |= warn_side(w, u, &u->cold, qc);
	}
	return rc < 0 ? hl_error_nomem(w->err) : HL_OK;
}

hl_status
hl_existing_balance(hl_existing_work *w)
{
	size_t i;
	hl_status st = HL_OK;

	for (i = 0; i < w->net->nunit && st == HL_OK; i++)
		st = balance_unit(w, i);
	return st;
}

static int
cmp_entry(const void *a, const void *b)
{
	const entry *x = a, *y = b;

	if (x->order != y->order)
		return x->order < y->order ? -1 : 1;
	return (x->row > y->row) - (x->row < y->row);
}

/* The stream's units in walking order; NULL with *n = 0 when none. */
static entry *
collect(hl_existing_work *w, long si, size_t *n, int *nomem)
{
	const hl_stream *s = &w->c->stream[si];
	entry *e = malloc((w->net->nunit + 1) * sizeof *e);
	double last = -HUGE_VAL;
	size_t i, k = 0;

	*n = 0;
	*nomem = e == NULL;
	if (e == NULL)
		return NULL;
	for (i = 0; i < w->net->nunit; i++) {
		hl_side *sd = side_on(&w->net->unit[i], si);

		if (sd == NULL)
			continue;
		e[k].u = &w->net->unit[i];
		e[k].side = sd;
		e[k].row = i;
		if (!isnan(sd->given_in))
			e[k].key = hl_stream_heat_at(s, sd->given_in);
		else if (!isnan(sd->given_out))
			e[k].key = hl_stream_heat_at(s, sd->given_out) -
				   e[k].u->duty;
		else
			e[k].key = NAN;
		/* A unit without temperatures follows the row before it. */
		e[k].order = isnan(e[k].key) ? last : e[k].key;
		last = e[k].order;
		k++;
	}
	qsort(e, k, sizeof *e, cmp_entry);
	*n = k;
	return e;
}

static hl_status
add_gap(hl_existing_work *w, long si, double q0, double q1, hl_gap_kind kind,
	const hl_existing_unit *prev, const hl_existing_unit *next)
{
	hl_gap *g;

	if (w->ngap == w->gap_cap) {
		size_t cap = w->gap_cap ? 2 * w->gap_cap : 8;

		g = realloc(w->gap, cap * sizeof *g);
		if (g == NULL)
			return hl_error_nomem(w->err);
		w->gap = g;
		w->gap_cap = cap;
	}
	g = &w->gap[w->ngap++];
	g->stream = si;
	g->q0 = q0;
	g->q1 = q1;
	g->kind = kind;
	g->prev = prev;
	g->next = next;
	return HL_OK;
}

/* Units e[0..m) start together at q0 and end, mixed, at q1. */
static hl_status
close_group(hl_existing_work *w, const hl_stream *s, entry *e, size_t m,
	    double q0, double q1)
{
	double t0 = hl_stream_temp_at(s, q0), tmix = hl_stream_temp_at(s, q1);
	double sum = 0.0;
	size_t i;
	int bad = 0;

	for (i = 0; i < m; i++) {
		hl_side *sd = e[i].side;
		double span;

		sd->q_in = q0;
		sd->t_in = t0;
		sd->t_out = m == 1 || isnan(sd->given_out) ? tmix :
			    sd->given_out;
		sd->q_out = m == 1 ? q1 : hl_stream_heat_at(s, sd->t_out);
		span = sd->q_out - sd->q_in;
		if (m > 1 && !(span > 0.0)) {
			/* An outlet at or before the inlet: mixed instead. */
			sd->t_out = tmix;
			sd->q_out = q1;
			span = q1 - q0;
			bad = 1;
		}
		sd->share = m == 1 ? 1.0 : e[i].u->duty / span;
		sum += sd->share;
	}
	if (m > 1 && (bad || fabs(sum - 1.0) > hl_existing_cp_tol(w->c, s)) &&
	    hl_existing_warn(w->net, e[0].u->file, e[0].u->line, "unit '%s' "
		"and %zu more in parallel on stream '%s' from %.1f °C take "
		"%.3f of its cp between them (duty / cp × ΔT of each); the "
		"shares should add up to 1: check their outlets and duties",
		e[0].u->name, m - 1, s->name, t0, sum) < 0)
		return hl_error_nomem(w->err);
	return HL_OK;
}

/* Where unit e starts: its given place, or pos; records a hole. */
static hl_status
start_of(hl_existing_work *w, long si, const entry *e, const entry *prev,
	 double pos, double *start)
{
	const hl_stream *s = &w->c->stream[si];
	double tw, tp;

	*start = pos;
	if (isnan(e->key))
		return HL_OK;
	tw = hl_stream_temp_at(s, e->key);
	tp = hl_stream_temp_at(s, pos);
	if (fabs(tw - tp) <= temp_tol(w->c, s, tp))
		return HL_OK;
	if (e->key > pos) {
		*start = e->key;
		return add_gap(w, si, pos, e->key, HL_GAP_HOLE,
			       prev ? prev->u : NULL, e->u);
	}
	if (hl_existing_warn(w->net, e->u->file, e->u->line, "unit '%s': "
		"given at %.1f °C on stream '%s', but %s leave%s it at %.1f °C; "
		"using %.1f °C (check the duties before it, or the "
		"temperatures)", e->u->name, tw, s->name,
		prev ? "the units before it" : "its supply",
		prev ? "" : "s", tp, tp) < 0)
		return hl_error_nomem(w->err);
	return HL_OK;
}

/* Past the target by more than the tolerance: no reading. */
static hl_status
check_end(hl_existing_work *w, const hl_stream *s, const entry *e,
	  double pos)
{
	double total = hl_stream_duty(s), t = hl_stream_temp_at(s, pos);
	double tt = hl_stream_target(s);

	if (pos <= total || fabs(t - tt) <= temp_tol(w->c, s, tt))
		return HL_OK;
	return hl_error_set(w->err, HL_EINPUT, e->u->file, e->u->line,
		"unit '%s' takes stream '%s' to %.1f °C, past its target "
		"%.1f °C: the units on it carry %.1f kW of its %.1f kW up to "
		"here; correct the duties or the stream data", e->u->name,
		s->name, t, tt, pos, total);
}

static hl_status
walk_entries(hl_existing_work *w, long si, entry *e, size_t n)
{
	const hl_stream *s = &w->c->stream[si];
	double tol = 2.0 * hl_existing_t_tol(w->c, s);
	double pos = 0.0, gstart = 0.0, gin = NAN;
	size_t i, g0 = 0;
	hl_status st = HL_OK;

	for (i = 0; i < n && st == HL_OK; i++) {
		double gi = e[i].side->given_in, start = pos;

		/* A branch starts where the group started, not where the
		 * units before it left the stream. */
		if (i > 0 && !isnan(gi) && !isnan(gin) &&
		    fabs(gi - gin) <= tol &&
		    fabs(gi - gin) < fabs(gi - hl_stream_temp_at(s, pos))) {
			pos += e[i].u->duty;
			st = check_end(w, s, &e[i], pos);
			continue;
		}
		if (i > 0)
			st = close_group(w, s, e + g0, i - g0, gstart, pos);
		if (st == HL_OK)
			st = start_of(w, si, &e[i], i > 0 ? &e[i - 1] : NULL,
				      pos, &start);
		if (st != HL_OK)
			break;  /* start is unset: nothing below may read it */
		g0 = i;
		gstart = start;
		gin = gi;
		pos = start + e[i].u->duty;
		st = check_end(w, s, &e[i], pos);
	}
	if (st == HL_OK)
		st = close_group(w, s, e + g0, n - g0, gstart, pos);
	if (st == HL_OK && pos < hl_stream_duty(s) * (1.0 - 1e-9))
		st = add_gap(w, si, pos, hl_stream_duty(s), HL_GAP_END,
			     e[n - 1].u, NULL);
	return st;
}

hl_status
hl_existing_walk(hl_existing_work *w)
{
	size_t i, n;
	hl_status st = HL_OK;

	for (i = 0; i < w->c->nstream && st == HL_OK; i++) {
		int nomem;
		entry *e = collect(w, (long)i, &n, &nomem);

		if (nomem)
			st = hl_error_nomem(w->err);
		else if (n == 0)
			st = add_gap(w, (long)i, 0.0,
				     hl_stream_duty(&w->c->stream[i]),
				     HL_GAP_WHOLE, NULL, NULL);
		else
			st = walk_entries(w, (long)i, e, n);
		free(e);
	}
	return st;
}
