/* rfit_today.c - today's plant as a network of held units (rfit.h): the
 * audit's reading of each row placed in stages along its streams. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "rfit.h"
#include "rfit_int.h"

/* One unit's side on a stream, for ordering. */
typedef struct {
	size_t unit;
	double q_in, q_out, share;
} entry;

static int
cmp_entry(const void *a, const void *b)
{
	const entry *x = a, *y = b;

	if (x->q_in != y->q_in)
		return x->q_in < y->q_in ? -1 : 1;
	if (x->q_out != y->q_out)
		return x->q_out < y->q_out ? -1 : 1;
	return (x->unit > y->unit) - (x->unit < y->unit);
}

/* Stage numbers on stream si: by where each side starts; branches (shares
 * below 1 starting at one point) share a stage. */
static hl_status
stages(const hl_existing *ex, long si, hl_network *net, hl_error *err)
{
	entry *e = malloc((ex->nunit + 1) * sizeof *e);
	size_t i, n = 0;
	int k = 0;

	if (e == NULL)
		return hl_error_nomem(err);
	for (i = 0; i < ex->nunit; i++) {
		const hl_existing_unit *u = &ex->unit[i];
		const hl_side *s = u->hot.stream == si ? &u->hot :
		    u->cold.stream == si ? &u->cold : NULL;

		if (s != NULL)
			e[n++] = (entry){ i, s->q_in, s->q_out, s->share };
	}
	qsort(e, n, sizeof *e, cmp_entry);
	for (i = 0; i < n; i++) {
		hl_network_unit *u = &net->unit[e[i].unit];
		int same = i > 0 && e[i].share < 1.0 && e[i - 1].share < 1.0 &&
		    fabs(e[i].q_in - e[i - 1].q_in) <= 1e-6 *
		    (1.0 + fabs(e[i].q_in));

		if (!same)
			k++;
		if (u->hot == (size_t)si)
			u->hot_stage = k;
		else
			u->cold_stage = k;
	}
	free(e);
	return HL_OK;
}

/* Party index of a side; SIZE_MAX for a gap no utility serves. */
static size_t
party_of(const hl_case *c, const hl_side *s)
{
	if (s->stream >= 0)
		return (size_t)s->stream;
	return s->util >= 0 ? c->nstream + (size_t)s->util : (size_t)-1;
}

static void
unit_id(const hl_existing_unit *x, size_t *count, char *id, size_t n)
{
	const char *pre = x->role == HL_ROLE_HEATER ? "H" :
	    x->role == HL_ROLE_COOLER ? "C" : "E";
	size_t k = x->role == HL_ROLE_HEATER ? 1 :
	    x->role == HL_ROLE_COOLER ? 2 : 0;

	snprintf(id, n, "%s%zu", pre, ++count[k]);
}

/* The outlet of a utility side: the row's where it lies inside a ranged
 * utility's range (a fired heater's flue gas leaves its convection section
 * well above the stack), else the utility's target. */
static double
utility_out(const hl_network_party *p, const hl_side *s)
{
	double lo = fmin(p->supply, p->target), hi = fmax(p->supply, p->target);

	if (p->supply != p->target && isfinite(s->t_out) && s->t_out >= lo &&
	    s->t_out <= hi && s->t_out != p->supply)
		return s->t_out;
	return p->target;
}

static hl_status
add_unit(const hl_case *c, const hl_existing_unit *x, hl_network *net,
	 size_t *count, hl_error *err)
{
	hl_network_unit u;

	memset(&u, 0, sizeof u);
	u.hot = party_of(c, &x->hot);
	u.cold = party_of(c, &x->cold);
	if (u.hot == (size_t)-1 || u.cold == (size_t)-1)
		return hl_error_set(err, HL_EINPUT, x->file, x->line,
		    "'%s': no utility of the case can serve this stretch; add "
		    "one, or give the unit that serves it", x->name);
	unit_id(x, count, u.id, sizeof u.id);
	snprintf(u.reuses, sizeof u.reuses, "%s", x->name);
	u.match = -1;
	u.duty = x->duty;
	u.hot_in = x->hot.stream >= 0 ? x->hot.t_in : net->party[u.hot].supply;
	u.hot_out = x->hot.stream >= 0 ? x->hot.t_out :
	    utility_out(&net->party[u.hot], &x->hot);
	u.cold_in = x->cold.stream >= 0 ? x->cold.t_in :
	    net->party[u.cold].supply;
	u.cold_out = x->cold.stream >= 0 ? x->cold.t_out :
	    utility_out(&net->party[u.cold], &x->cold);
	u.hot_share = x->hot.share;
	u.cold_share = x->cold.share;
	u.type = x->type;
	u.shells = x->shells >= 1 ? x->shells : 1;
	u.parallel = x->parallel >= 1 ? x->parallel : 1;
	u.held = 1;
	/* A fired heater is rated for what it fires today: more needs new
	 * firing capacity (network_held.c). */
	u.duty_today = x->type == HL_EXCH_FIRED_HEATER ? x->duty : 0.0;
	u.line = x->line;
	return hl_network_add_unit(net, &u, err);
}

/* Size every unit at its own shells; a count that cannot reach the unit's
 * P gives way to the Xp rule's, then to counterflow. The model's area is
 * today's (calibration); the data sheet's goes to the note. */
static hl_status
size_today(const hl_existing *ex, hl_network *net, hl_error *err)
{
	size_t i;

	for (i = 0; i < net->nunit; i++) {
		hl_network_unit *u = &net->unit[i];
		const hl_existing_unit *x = &ex->unit[i];
		char note[300];
		hl_error e;
		hl_status st = hl_network_size_unit(net, u, NULL);

		if (st != HL_OK) {
			u->held = 0;
			st = hl_network_size_unit(net, u, NULL);
			u->held = 1;
		}
		if (st != HL_OK) {
			u->type = HL_EXCH_COUNTERFLOW;
			st = hl_network_size_unit(net, u, &e);
		}
		if (st != HL_OK)
			return hl_error_set(err, st, x->file, x->line,
			    "'%s' cannot be sized as read: %s", x->name,
			    e.text);
		u->area_today = u->area;
		if (u->type == HL_EXCH_FIRED_HEATER)
			snprintf(note, sizeof note, "a fired heater, rated for "
			    "today's %.4g kW: more firing is bought",
			    u->duty_today);
		else if (isnan(x->area))
			snprintf(note, sizeof note, "no data-sheet area; the "
			    "model's %.4g m² at today's duty stands for it",
			    u->area);
		else
			snprintf(note, sizeof note, "data sheet %.4g m², the "
			    "model needs %.4g m² for today's duty (its area "
			    "here)", x->area, u->area);
		free(u->note);
		if ((u->note = strdup(note)) == NULL)
			return hl_error_nomem(err);
	}
	return HL_OK;
}

/* EMAT of the retrofit: the case's, or below it the smallest approach a
 * unit runs at today. */
static void
set_emat(hl_network *net)
{
	double emat = isnan(net->set.emat) ? net->set.dtmin : net->set.emat;
	size_t i;

	for (i = 0; i < net->nunit; i++)
		emat = fmin(emat, net->unit[i].approach);
	net->set.emat = emat * (1.0 - 1e-9);
}

hl_status
hl_rfit_today(const hl_case *c, const hl_existing *ex, hl_network **out,
	      hl_error *err)
{
	hl_network *net = NULL;
	size_t count[3] = { 0, 0, 0 }, i;
	/* The parties, their types and cost laws and the case's type rules as
	 * design's searches build them (network_case.c), so that today's
	 * units and the ones a proposal adds are priced by the same laws. */
	hl_status st = hl_network_of_case(c, ex->util_load, &net, err);

	*out = NULL;
	if (st != HL_OK)
		return st;
	for (i = 0; i < ex->nunit && st == HL_OK; i++)
		st = add_unit(c, &ex->unit[i], net, count, err);
	for (i = 0; i < c->nstream && st == HL_OK; i++)
		st = stages(ex, (long)i, net, err);
	if (st == HL_OK)
		st = size_today(ex, net, err);
	if (st == HL_OK) {
		set_emat(net);
		st = hl_rfit_finish(c, net, err);
	}
	if (st != HL_OK) {
		hl_network_free(net);
		return st;
	}
	*out = net;
	return HL_OK;
}
