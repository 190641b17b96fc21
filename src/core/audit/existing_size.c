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

/* F and shells: the given count if it can do the duty, else the Xp rule
 * (Ahmad, Linnhoff & Smith 1988), else counterflow. Only an estimate is
 * worth a warning: a given area stands whatever its shells. */
static hl_status
shells_f(hl_existing_work *w, hl_existing_unit *u, int given, int quiet)
{
	const hl_settings *set = &w->c->set;
	double p, r;
	int n, rc = 0;

	u->f = 1.0;
	u->shells = given > 0 ? given : 1;
	if (set->exchanger == HL_EXCH_COUNTERFLOW ||
	    hl_exchanger_pr(u->hot.t_in, u->hot.t_out, u->cold.t_in,
			    u->cold.t_out, &p, &r, NULL) != HL_OK ||
	    p == 0.0 || r == 0.0 || !isfinite(r))
		return HL_OK;
	if (given > 0 && hl_exchanger_f_shells(p, r, given, &u->f, NULL) ==
	    HL_OK)
		return HL_OK;
	if (hl_exchanger_shells(p, r, set->fmin, set->xp, &n, &u->f, NULL,
				NULL) == HL_OK) {
		if (given > 0 && quiet)
			n = given;
		else if (given > 0)
			rc = hl_existing_warn(w->net, u->file, u->line,
				"unit '%s': %d shell%s in series cannot do "
				"this duty at these temperatures; its area is "
				"estimated with %d", u->name, given,
				given == 1 ? "" : "s", n);
		u->shells = n;
	} else if (!quiet) {
		u->f = 1.0;
		rc = hl_existing_warn(w->net, u->file, u->line, "unit '%s': no "
			"shell-and-tube unit of up to %d shells in series fits "
			"these temperatures; its area is estimated as "
			"counterflow", u->name, HL_EXCHANGER_MAX_SHELLS);
	}
	return rc < 0 ? hl_error_nomem(w->err) : HL_OK;
}

hl_status
hl_existing_size(hl_existing_work *w, hl_existing_unit *u, const hl_unit *row)
{
	hl_status st;

	u->lmtd = u->u = u->f = NAN;
	if ((u->hot.stream < 0 && u->hot.util < 0) ||
	    (u->cold.stream < 0 && u->cold.util < 0))
		return HL_OK; /* a gap that no utility serves */
	st = approach(w, u);
	if (st != HL_OK)
		return st;
	side_h(w->c, &u->hot);
	side_h(w->c, &u->cold);
	hl_exchanger_u(u->hot.h, u->cold.h, &u->u, NULL);
	hl_exchanger_lmtd(u->hot.t_in - u->cold.t_out,
			  u->hot.t_out - u->cold.t_in, &u->lmtd, NULL);
	st = shells_f(w, u, row ? row->shells : 0,
		      row != NULL && !isnan(row->area));
	if (st != HL_OK)
		return st;
	if (row != NULL && !isnan(row->area)) {
		u->area = row->area;
		return HL_OK;
	}
	/* Q = U·A·F·LMTD (Kern 1950, eq. 7.41 for F). */
	u->area = u->duty / (u->u * u->f * u->lmtd);
	u->area_estimated = 1;
	return HL_OK;
}
