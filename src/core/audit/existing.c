/* existing.c - today's exchangers: names resolved, gaps served, totals.
 *
 * The stages: resolve each row's names into stream or utility sides,
 * check duties against given temperatures (existing_walk.c), place the
 * units on their streams (existing_walk.c), turn the gaps into implied
 * utility units, size every unit (existing_size.c), add up today's
 * utilities and areas.
 */
#include <math.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "existing_int.h"

const char *
hl_existing_role_name(hl_unit_role r)
{
	static const char *const names[] = { "recovery", "heater", "cooler" };

	return (unsigned)r < 3 ? names[r] : "?";
}

const char *
hl_existing_side_name(const hl_case *c, const hl_side *s)
{
	if (s->stream >= 0)
		return c->stream[s->stream].name;
	if (s->util >= 0)
		return c->util[s->util].name;
	return "(no utility)";
}

double
hl_existing_t_tol(const hl_case *c, const hl_stream *s)
{
	return isnan(s->t_tol) ? c->set.t_tol : s->t_tol;
}

double
hl_existing_cp_tol(const hl_case *c, const hl_stream *s)
{
	return isnan(s->cp_tol) ? c->set.cp_tol : s->cp_tol;
}

int
hl_existing_warn(hl_existing *net, const char *file, long line,
		 const char *fmt, ...)
{
	hl_error *w = realloc(net->warn, (net->nwarn + 1) * sizeof *w);
	va_list ap;

	if (w == NULL)
		return -1;
	net->warn = w;
	w = &net->warn[net->nwarn++];
	hl_error_clear(w);
	snprintf(w->file, sizeof w->file, "%s", file ? file : "");
	w->line = line;
	va_start(ap, fmt);
	vsnprintf(w->text, sizeof w->text, fmt, ap);
	va_end(ap);
	return 0;
}

void
hl_existing_free(hl_existing *net)
{
	size_t i;

	if (net == NULL)
		return;
	for (i = 0; i < net->nunit; i++)
		free(net->unit[i].name);
	free(net->unit);
	free(net->util_load);
	free(net->warn);
	free(net);
}

static void
side_init(hl_side *s, double in, double out)
{
	memset(s, 0, sizeof *s);
	s->stream = s->util = -1;
	s->given_in = in;
	s->given_out = out;
	s->t_in = s->t_out = s->q_in = s->q_out = NAN;
	s->share = 1.0;
	s->h = NAN;
}

/* One side's name: a stream or utility of the right kind. */
static hl_status
resolve_side(const hl_case *c, const hl_unit *row, const char *name,
	     hl_kind want, hl_side *s, hl_error *err)
{
	const char *col = want == HL_HOT ? "hot" : "cold";
	long i = hl_case_find_stream(c, name);

	if (i >= 0) {
		if (c->stream[i].kind != want)
			return hl_error_set(err, HL_EINPUT, row->file,
				row->line, "unit '%s': '%s' in column '%s' is "
				"a %s stream; name the stream or utility that "
				"%s the heat", row->name, name, col,
				want == HL_HOT ? "cold" : "hot",
				want == HL_HOT ? "gives" : "takes");
		s->stream = i;
		return HL_OK;
	}
	i = hl_case_find_utility(c, name);
	if (i < 0)
		return hl_error_set(err, HL_EINPUT, row->file, row->line,
			"unit '%s': '%s' in column '%s' is no stream or "
			"utility of the case; check the spelling (names are "
			"case-sensitive) or add it", row->name, name, col);
	if (c->util[i].kind != want)
		return hl_error_set(err, HL_EINPUT, row->file, row->line,
			"unit '%s': '%s' in column '%s' is a %s utility; name "
			"the stream or utility that %s the heat", row->name,
			name, col, want == HL_HOT ? "cold" : "hot",
			want == HL_HOT ? "gives" : "takes");
	s->util = i;
	return HL_OK;
}

/* A side whose given temperatures run the wrong way has no reading. */
static hl_status
check_direction(const hl_unit *row, const hl_side *s, hl_kind kind,
		hl_error *err)
{
	double d = s->given_out - s->given_in;

	if (isnan(d) || (kind == HL_HOT ? d <= 0.0 : d >= 0.0))
		return HL_OK;
	return hl_error_set(err, HL_EINPUT, row->file, row->line,
		"unit '%s': its %s side %s from %.1f to %.1f °C; swap %s_in "
		"and %s_out", row->name, kind == HL_HOT ? "hot" : "cold",
		kind == HL_HOT ? "warms" : "cools", s->given_in, s->given_out,
		kind == HL_HOT ? "hot" : "cold",
		kind == HL_HOT ? "hot" : "cold");
}

static hl_status
resolve_row(const hl_case *c, const hl_unit *row, hl_existing_unit *u,
	    hl_error *err)
{
	hl_status st;

	memset(u, 0, sizeof *u);
	u->file = row->file;
	u->line = row->line;
	u->duty = row->duty;
	u->area = NAN;
	side_init(&u->hot, row->hot_in, row->hot_out);
	side_init(&u->cold, row->cold_in, row->cold_out);
	if ((u->name = strdup(row->name)) == NULL)
		return hl_error_nomem(err);
	st = resolve_side(c, row, row->hot, HL_HOT, &u->hot, err);
	if (st == HL_OK)
		st = resolve_side(c, row, row->cold, HL_COLD, &u->cold, err);
	if (st == HL_OK && u->hot.stream < 0 && u->cold.stream < 0)
		st = hl_error_set(err, HL_EINPUT, row->file, row->line,
			"unit '%s': both sides are utilities ('%s', '%s'); "
			"the audit needs a process stream on one side at least",
			row->name, row->hot, row->cold);
	if (st == HL_OK)
		st = check_direction(row, &u->hot, HL_HOT, err);
	if (st == HL_OK)
		st = check_direction(row, &u->cold, HL_COLD, err);
	u->role = u->hot.stream < 0 ? HL_ROLE_HEATER :
		  u->cold.stream < 0 ? HL_ROLE_COOLER : HL_ROLE_RECOVERY;
	return st;
}

/* A utility side's temperatures: the row's, else the utility's own. */
static void
utility_side(const hl_case *c, hl_side *s)
{
	const hl_utility *u;

	if (s->stream >= 0 || s->util < 0)
		return;
	u = &c->util[s->util];
	s->t_in = isnan(s->given_in) ? u->supply : s->given_in;
	s->t_out = isnan(s->given_out) ? u->target : s->given_out;
}

/* The cheapest utility of the needed kind whose ends both clear the gap's
 * ends (first of equal price); -1 when none can. */
static long
gap_utility(const hl_case *c, const hl_stream *s, double t_in, double t_out)
{
	long best = -1;
	size_t i;

	for (i = 0; i < c->nutil; i++) {
		const hl_utility *u = &c->util[i];
		int ok;

		if (s->kind == HL_COLD)
			ok = u->kind == HL_HOT && u->supply > t_out &&
			     u->target > t_in;
		else
			ok = u->kind == HL_COLD && u->supply < t_out &&
			     u->target < t_in;
		if (ok && (best < 0 || u->price < c->util[best].price))
			best = (long)i;
	}
	return best;
}

static hl_status
gap_warning(hl_existing_work *w, const hl_gap *g, const hl_existing_unit *u)
{
	const hl_stream *s = &w->c->stream[g->stream];
	char serve[200];
	int rc;

	if (u->hot.util >= 0 || u->cold.util >= 0)
		snprintf(serve, sizeof serve, "counted as %s utility '%s'",
			 s->kind == HL_HOT ? "cold" : "hot",
			 hl_existing_side_name(w->c, s->kind == HL_HOT ?
					       &u->cold : &u->hot));
	else
		snprintf(serve, sizeof serve, "counted as %s utility, "
			 "unpriced: no utility of the case can serve it",
			 s->kind == HL_HOT ? "cold" : "hot");
	/* A shortfall within the temperature tolerance is rounding: the gap
	 * closes the balance, but is not worth a warning. */
	if (g->kind == HL_GAP_END &&
	    fabs(hl_stream_temp_at(s, g->q0) - hl_stream_target(s)) <=
	    2.0 * hl_existing_t_tol(w->c, s))
		return HL_OK;
	if (g->kind == HL_GAP_WHOLE)
		rc = hl_existing_warn(w->net, s->file, s->line, "stream '%s' "
			"has no unit in the network: its %.1f kW %s",
			s->name, u->duty, serve);
	else if (g->kind == HL_GAP_END)
		rc = hl_existing_warn(w->net, s->file, s->line, "stream '%s': "
			"its units stop at %.1f °C, short of its target "
			"%.1f °C; the %.1f kW left %s (add the row that serves "
			"it, or correct the duties)", s->name,
			hl_stream_temp_at(s, g->q0), hl_stream_target(s),
			u->duty, serve);
	else
		rc = hl_existing_warn(w->net, g->next->file, g->next->line,
			"unit '%s': its inlet on stream '%s' (%.1f °C) leaves "
			"%.1f kW from %.1f °C%s%s%s without a unit; %s (add the "
			"missing row, or correct the temperatures)",
			g->next->name, s->name, hl_stream_temp_at(s, g->q1),
			u->duty, hl_stream_temp_at(s, g->q0),
			g->prev ? " (after '" : "",
			g->prev ? g->prev->name : "", g->prev ? "')" : "",
			serve);
	return rc < 0 ? hl_error_nomem(w->err) : HL_OK;
}

/* One implied utility unit per gap. */
static hl_status
add_gaps(hl_existing_work *w)
{
	hl_existing *net = w->net;
	size_t i, k;

	for (i = 0; i < w->ngap; i++) {
		const hl_gap *g = &w->gap[i];
		const hl_stream *s = &w->c->stream[g->stream];
		hl_existing_unit *u = &net->unit[net->nunit];
		hl_side *own = s->kind == HL_HOT ? &u->hot : &u->cold;
		hl_side *other = s->kind == HL_HOT ? &u->cold : &u->hot;
		char name[200];
		size_t same = 0;

		for (k = 0; k < i; k++)
			same += w->gap[k].stream == g->stream;
		if (same == 0)
			snprintf(name, sizeof name, "gap on %s", s->name);
		else
			snprintf(name, sizeof name, "gap %zu on %s", same + 1,
				 s->name);
		memset(u, 0, sizeof *u);
		side_init(&u->hot, NAN, NAN);
		side_init(&u->cold, NAN, NAN);
		if ((u->name = strdup(name)) == NULL)
			return hl_error_nomem(w->err);
		net->nunit++;
		u->implied = 1;
		u->file = s->file;
		u->line = s->line;
		u->duty = g->q1 - g->q0;
		u->area = NAN;
		u->role = s->kind == HL_HOT ? HL_ROLE_COOLER : HL_ROLE_HEATER;
		own->stream = g->stream;
		own->q_in = g->q0;
		own->q_out = g->q1;
		own->t_in = hl_stream_temp_at(s, g->q0);
		own->t_out = hl_stream_temp_at(s, g->q1);
		other->util = gap_utility(w->c, s, own->t_in, own->t_out);
		utility_side(w->c, other);
		if (gap_warning(w, g, u) != HL_OK)
			return HL_EIO;
	}
	return HL_OK;
}

static void
totals(const hl_case *c, hl_existing *net)
{
	size_t i;

	for (i = 0; i < net->nunit; i++) {
		const hl_existing_unit *u = &net->unit[i];

		if (u->hot.stream < 0)
			net->hot_now += u->duty;
		if (u->cold.stream < 0)
			net->cold_now += u->duty;
		if (u->hot.util >= 0)
			net->util_load[u->hot.util] += u->duty;
		if (u->cold.util >= 0)
			net->util_load[u->cold.util] += u->duty;
		if (isnan(u->area))
			continue;
		net->area += u->area;
		net->shells += u->shells * (u->parallel > 1 ? u->parallel : 1);
		net->nestimated += (size_t)u->area_estimated;
		if (u->role == HL_ROLE_RECOVERY)
			net->area_recovery += u->area;
	}
	for (i = 0; i < c->nutil; i++)
		net->cost_now += net->util_load[i] * c->util[i].price *
				 c->set.hours / 1000.0;
}

static hl_status
build(hl_existing_work *w)
{
	const hl_case *c = w->c;
	hl_existing *net = w->net;
	hl_status st = HL_OK;
	size_t i;

	for (i = 0; i < c->nunit && st == HL_OK; i++) {
		st = resolve_row(c, &c->unit[i], &net->unit[i], w->err);
		net->nunit++;
	}
	if (st == HL_OK)
		st = hl_existing_balance(w);
	if (st == HL_OK)
		st = hl_existing_walk(w);
	if (st != HL_OK)
		return st;
	net->nrow = net->nunit;
	for (i = 0; i < net->nrow; i++) {
		utility_side(c, &net->unit[i].hot);
		utility_side(c, &net->unit[i].cold);
	}
	/* Room for the gaps: the array was sized for the rows and gaps. */
	st = add_gaps(w);
	for (i = 0; i < net->nunit && st == HL_OK; i++)
		st = hl_existing_size(w, &net->unit[i],
				      i < net->nrow ? &c->unit[i] : NULL);
	if (st == HL_OK)
		totals(c, net);
	return st;
}

hl_status
hl_existing_build(const hl_case *c, hl_existing **out, hl_error *err)
{
	hl_existing_work w;
	hl_existing *net;
	hl_status st;

	*out = NULL;
	if (c->nunit == 0)
		return hl_error_set(err, HL_EINPUT, c->source, 0, "the case "
			"has no existing network; give one with --network "
			"FILE or a <network> in the case file");
	net = calloc(1, sizeof *net);
	if (net == NULL)
		return hl_error_nomem(err);
	memset(&w, 0, sizeof w);
	w.c = c;
	w.net = net;
	w.err = err;
	/* Each stream has at most one gap more than the units on it. */
	net->unit = calloc(3 * c->nunit + c->nstream + 1, sizeof *net->unit);
	net->nutil = c->nutil;
	net->util_load = calloc(c->nutil + 1, sizeof *net->util_load);
	if (net->unit == NULL || net->util_load == NULL)
		st = hl_error_nomem(err);
	else
		st = build(&w);
	free(w.gap);
	if (st == HL_OK || st == HL_EINPUT) {
		*out = net;
		return st;
	}
	hl_existing_free(net);
	return st;
}
