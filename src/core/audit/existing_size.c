/* existing_size.c - approach temperatures and areas of today's units. */
#include <math.h>
#include <stdio.h>

#include "exchanger.h"
#include "existing_int.h"

/* Heat-weighted film coefficient of a stream over [lo, hi]:
 * 1/h = Σ(q_j/h_j) / Σq_j over its segments there (series resistances
 * along the unit, as the area target weights them: Townsend & Linnhoff
 * 1984). */
static double
stream_h(const hl_case *c, const hl_stream *s, double lo, double hi,
	 int *assumed)
{
	double q = 0.0, qh = 0.0, near_h = NAN, near_d = HUGE_VAL;
	int near_assumed = 0;
	size_t j;

	for (j = 0; j < s->nseg; j++) {
		const hl_segment *g = &s->seg[j];
		double a = fmin(g->supply, g->target);
		double b = fmax(g->supply, g->target);
		double h = isnan(g->h) ? c->set.h_default : g->h;
		double ov = fmin(b, hi) - fmax(a, lo);
		double d = fmax(a - hi, lo - b);

		if (ov > 0.0) {
			q += g->cp * ov;
			qh += g->cp * ov / h;
			*assumed |= isnan(g->h);
		}
		if (d < near_d) {
			near_d = d;
			near_h = h;
			near_assumed = isnan(g->h);
		}
	}
	if (q > 0.0)
		return q / qh;
	/* No width (or outside the stream): the nearest segment's. */
	*assumed |= near_assumed;
	return near_h;
}

static void
side_h(const hl_case *c, hl_side *sd)
{
	if (sd->stream >= 0) {
		sd->h = stream_h(c, &c->stream[sd->stream],
				 fmin(sd->t_in, sd->t_out),
				 fmax(sd->t_in, sd->t_out), &sd->h_assumed);
	} else if (sd->util >= 0) {
		sd->h = c->util[sd->util].h;
		sd->h_assumed = isnan(sd->h);
		if (sd->h_assumed)
			sd->h = c->set.h_default;
	}
}

static const char *
side_name(const hl_case *c, const hl_side *sd)
{
	return sd->stream >= 0 ? c->stream[sd->stream].name :
	       sd->util >= 0 ? c->util[sd->util].name : "";
}

static double
side_shift(const hl_case *c, const hl_side *sd)
{
	if (sd->stream >= 0)
		return hl_stream_shift(&c->stream[sd->stream], c->set.dtmin);
	return hl_utility_shift(&c->util[sd->util], c->set.dtmin);
}

/* Both ends must be positive; below the two contributions is a note. */
static hl_status
approach(hl_existing_work *w, hl_existing_unit *u)
{
	const hl_case *c = w->c;
	double d1 = u->hot.t_in - u->cold.t_out;
	double d2 = u->hot.t_out - u->cold.t_in;
	double need = side_shift(c, &u->hot) + side_shift(c, &u->cold);
	int rc = 0;

	u->approach = fmin(d1, d2);
	if (!(u->approach > 0.0))
		return hl_error_set(w->err, HL_EINPUT, u->file, u->line,
			"unit '%s': its hot side (%.1f → %.1f °C) is not above "
			"its cold side (%.1f → %.1f °C) at both ends, as read "
			"along the streams; check its temperatures and duty and "
			"those of the units before it", u->name, u->hot.t_in,
			u->hot.t_out, u->cold.t_in, u->cold.t_out);
	if (u->approach < need * (1.0 - 1e-9)) {
		char why[64];

		if (fabs(need - c->set.dtmin) <= 1e-9 * (1.0 + need))
			snprintf(why, sizeof why, "ΔTmin %.1f K", need);
		else
			snprintf(why, sizeof why, "the minimum %.1f K of its "
				 "sides' ΔT contributions", need);
		rc = hl_existing_warn(w->net, u->file, u->line, "unit '%s': "
			"approach %.1f K at its %s end is below %s",
			u->name, u->approach, d1 <= d2 ? "hot" : "cold", why);
	}
	return rc < 0 ? hl_error_nomem(w->err) : HL_OK;
}

/* The sizing API's spec for unit u (its type's law and limits). */
static void
unit_spec(const hl_existing_work *w, const hl_existing_unit *u, int series,
	  hl_exchanger_spec *s)
{
	hl_exchanger_spec_type(s, &w->c->set, u->type);
	s->hot_in = u->hot.t_in;
	s->hot_out = u->hot.t_out;
	s->cold_in = u->cold.t_in;
	s->cold_out = u->cold.t_out;
	s->duty = u->duty;
	s->u = u->u;
	s->series = series;
}

/* Through hl_exchanger_size: the given shells (sections) if they can do
 * the duty, else the fewest the rules allow (Xp rule of Ahmad, Linnhoff &
 * Smith 1988 for shell-and-tube), else counterflow. Only an estimate is
 * worth a warning: a given area stands whatever its shells. */
static hl_status
size_unit(hl_existing_work *w, hl_existing_unit *u, int given, int quiet,
	  hl_exchanger_sizing *z)
{
	hl_exchanger_spec s;
	int ac = u->type == HL_EXCH_AIR_COOLER;
	const char *what = ac ? "crossflow sections" : "shells";
	int rc = 0;

	unit_spec(w, u, given, &s);
	if (hl_exchanger_size(&s, z, NULL) == HL_OK)
		return HL_OK;
	s.series = 0;
	if (hl_exchanger_size(&s, z, NULL) == HL_OK) {
		if (given > 0 && quiet)
			z->shells = given;
		else if (given > 0)
			rc = hl_existing_warn(w->net, u->file, u->line,
				"unit '%s': %d %s%s in series cannot do this "
				"duty at these temperatures; its area is "
				"estimated with %d", u->name, given,
				ac ? "crossflow section" : "shell",
				given == 1 ? "" : "s", z->shells);
		return rc < 0 ? hl_error_nomem(w->err) : HL_OK;
	}
	s.type = HL_EXCH_COUNTERFLOW;
	if (hl_exchanger_size(&s, z, w->err) != HL_OK)
		return w->err != NULL ? w->err->status : HL_EINPUT;
	z->shells = given > 0 ? given : 1;
	if (!quiet)
		rc = hl_existing_warn(w->net, u->file, u->line, "unit '%s': "
			"no %s unit of up to %d %s in series fits these "
			"temperatures; its area is estimated as counterflow",
			u->name, hl_exchanger_type_name(u->type),
			HL_EXCHANGER_MAX_SHELLS, what);
	return rc < 0 ? hl_error_nomem(w->err) : HL_OK;
}

/* An implausible U or shell of an estimated area (hl_exchanger_warning). */
static hl_status
plausible(hl_existing_work *w, hl_existing_unit *u,
	  const hl_exchanger_sizing *z)
{
	hl_exchanger_spec s;
	char why[300];

	if (z->warn == 0)
		return HL_OK;
	unit_spec(w, u, 0, &s);
	hl_exchanger_warning(&s, z, why, sizeof why);
	return hl_existing_warn(w->net, u->file, u->line, "unit '%s': %s",
	    u->name, why) < 0 ? hl_error_nomem(w->err) : HL_OK;
}

hl_status
hl_existing_size(hl_existing_work *w, hl_existing_unit *u, const hl_unit *row)
{
	hl_exchanger_sizing z;
	hl_status st;

	u->lmtd = u->u = u->f = NAN;
	if ((u->hot.stream < 0 && u->hot.util < 0) ||
	    (u->cold.stream < 0 && u->cold.util < 0))
		return HL_OK; /* a gap that no utility serves */
	st = approach(w, u);
	if (st != HL_OK)
		return st;
	u->type = row != NULL && row->type_given ?
	    (hl_exchanger_type)row->type : hl_case_pair_type(w->c,
	    side_name(w->c, &u->hot), side_name(w->c, &u->cold));
	if ((u->type == HL_EXCH_FIRED_HEATER && u->hot.util < 0) ||
	    (u->type == HL_EXCH_AIR_COOLER && u->cold.util < 0))
		return hl_error_set(w->err, HL_EINPUT, u->file, u->line,
			"unit '%s': a %s needs a %s utility on its %s side",
			u->name, hl_exchanger_type_name(u->type),
			u->type == HL_EXCH_FIRED_HEATER ? "hot" : "cold",
			u->type == HL_EXCH_FIRED_HEATER ? "hot" : "cold");
	side_h(w->c, &u->hot);
	side_h(w->c, &u->cold);
	hl_exchanger_u(u->hot.h, u->cold.h, &u->u, NULL);
	hl_exchanger_lmtd(u->hot.t_in - u->cold.t_out,
			  u->hot.t_out - u->cold.t_in, &u->lmtd, NULL);
	st = size_unit(w, u, row ? row->shells : 0,
		       row != NULL && !isnan(row->area), &z);
	if (st != HL_OK)
		return st;
	u->f = z.f;
	u->shells = z.shells;
	u->parallel = 1;
	if (row != NULL && !isnan(row->area)) {
		u->area = row->area;
		return HL_OK;
	}
	u->parallel = z.parallel;
	/* Q = U·A·F·LMTD (Kern 1950, eq. 7.41 for F), by hl_exchanger_size;
	 * a fired heater's area, which the audit's area shares need, as
	 * counterflow. */
	u->area = u->type == HL_EXCH_FIRED_HEATER ?
	    u->duty / (u->u * u->lmtd) : z.area;
	u->warn = z.warn;
	st = plausible(w, u, &z);
	if (st != HL_OK)
		return st;
	u->area_estimated = 1;
	return HL_OK;
}
