/* rfit_eval.c - one retrofit candidate simulated, trimmed, sized and
 * priced (rfit.h): what the plant would do and what it would cost. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#include "cascade.h"
#include "netsim.h"
#include "profile.h"
#include "rfit_int.h"

/* Rounds of simulate, then add trims or fix new units' shells. */
#define EVAL_ROUNDS 4

double
rf_now(void)
{
	struct timespec ts;

	clock_gettime(CLOCK_MONOTONIC, &ts);
	return (double)ts.tv_sec + 1e-9 * (double)ts.tv_nsec;
}

int
rf_recovery(const hl_network *net, const hl_network_unit *u)
{
	return !net->party[u->hot].utility && !net->party[u->cold].utility;
}

void
rf_cand_clear(rf_cand *c)
{
	hl_network_free(c->net);
	c->net = NULL;
}

int
rf_cand_copy(rf_cand *dst, const rf_cand *src)
{
	*dst = *src;
	dst->net = hl_network_copy(src->net);
	return dst->net != NULL ? 0 : -1;
}

int
rf_within(const rf_ctx *x, const rf_cand *c)
{
	const hl_rfit_opts *o = x->o;

	return c->ok && c->saving > 0.0 &&
	       (isnan(o->payback) || c->payback <= o->payback) &&
	       (isnan(o->budget) || c->investment <= o->budget) &&
	       (int)c->nmove <= o->max_changes;
}

/* A new unit whose shells follow the Xp rule (Ahmad, Linnhoff & Smith
 * 1988) at the conditions it meets: the count it should have. */
static int
xp_shells(const hl_network *net, const hl_network_unit *u)
{
	hl_network_unit z = *u;

	z.note = NULL;
	z.held = 0;
	if (hl_network_size_unit(net, &z, NULL) != HL_OK)
		return u->shells;
	return z.shells;
}

/* The flow of utility p unit u takes, up to a common factor: its duty,
 * over its own temperature change on a ranged utility (units may leave it
 * at different outlets), as netcheck.h counts it. */
static double
utility_flow(const hl_network *net, const hl_network_unit *u, size_t p)
{
	const hl_network_party *s = &net->party[p];
	double dt = u->hot == p ? u->hot_in - u->hot_out :
	    u->cold_out - u->cold_in;

	return s->supply == s->target ? u->duty :
	    u->duty / fmax(fabs(dt), 1e-300);
}

static void
utility_shares(hl_network *net)
{
	size_t p, i;

	for (p = 0; p < net->nparty; p++) {
		double flow = 0.0;

		if (!net->party[p].utility)
			continue;
		for (i = 0; i < net->nunit; i++)
			if (net->unit[i].hot == p || net->unit[i].cold == p)
				flow += utility_flow(net, &net->unit[i], p);
		for (i = 0; i < net->nunit; i++) {
			hl_network_unit *u = &net->unit[i];
			double s = flow > 0.0 ? utility_flow(net, u, p) / flow :
			    1.0;

			if (u->hot == p)
				u->hot_share = s;
			else if (u->cold == p)
				u->cold_share = s;
		}
	}
}

/* Size u at its shells; a new unit falls back on the Xp count; a held unit
 * whose duty needs more than it has gets the rest as added area (shells in
 * parallel for a reused unit, the unit's own for a new one), a fired
 * heater the firing beyond its rating (a heater beside it). */
static hl_status
size_one(hl_network *net, hl_network_unit *u, hl_error *err)
{
	hl_status st = hl_network_size_unit(net, u, err);

	if (st != HL_OK && u->reuses[0] == '\0') {
		u->shells = xp_shells(net, u);
		st = hl_network_size_unit(net, u, err);
	}
	if (st != HL_OK)
		return st;
	if (u->reuses[0] == '\0')
		u->shells_added = u->shells;
	if (u->type == HL_EXCH_FIRED_HEATER) {
		if (u->duty > (u->duty_today + u->duty_added) * (1.0 + 1e-9)) {
			u->duty_added = u->duty - u->duty_today;
			if (u->shells_added == 0)
				u->shells_added = 1;
		}
	} else if (u->area > (u->area_today + u->area_added) *
	    (1.0 + 1e-9)) {
		u->area_added = u->area - u->area_today;
		if (u->shells_added == 0)
			u->shells_added = u->shells;
	}
	return hl_network_size_unit(net, u, err);
}

hl_status
rf_finish(hl_network *net, double qh_target, double qc_target,
	  hl_error *err)
{
	size_t i;

	utility_shares(net);
	for (i = 0; i < net->nunit; i++) {
		hl_error e;
		hl_status st = size_one(net, &net->unit[i], &e);

		if (st != HL_OK)
			return hl_error_set(err, st, NULL, 0, "%s: %s",
			    net->unit[i].id, e.text);
	}
	hl_network_totals(net);
	net->qh_target = qh_target;
	net->qc_target = qc_target;
	net->restriction = 0.0;
	net->penalty = net->qh - qh_target;
	return HL_OK;
}

hl_status
hl_rfit_finish(const hl_case *c, hl_network *net, hl_error *err)
{
	double qh, qc;
	hl_status st = hl_cascade_targets(c, net->set.dtmin, &qh, &qc, err);

	return st != HL_OK ? st : rf_finish(net, qh, qc, err);
}

/* The cheapest utility of the other kind that can serve party p from
 * t_end to its target; SIZE_MAX when none. */
static size_t
trim_utility(const hl_network *net, size_t p, double t_end)
{
	const hl_network_party *s = &net->party[p];
	size_t k, best = (size_t)-1;
	double best_price = HUGE_VAL;

	for (k = 0; k < net->nparty; k++) {
		const hl_network_party *u = &net->party[k];
		double req, price;
		int fits;

		if (!u->utility || u->kind == s->kind)
			continue;
		req = s->kind == HL_COLD ? hl_network_required(&net->set, u, s) :
		    hl_network_required(&net->set, s, u);
		fits = s->kind == HL_COLD ?
		    u->supply - s->target >= req && u->target - t_end >= req :
		    t_end - u->target >= req && s->target - u->supply >= req;
		price = isnan(u->price) ? 0.0 : u->price;
		if (fits && price < best_price) {
			best = k;
			best_price = price;
		}
	}
	return best;
}

static int
count_prefix(const hl_network *net, char c)
{
	size_t i;
	int n = 0;

	for (i = 0; i < net->nunit; i++)
		n += net->unit[i].id[0] == c;
	return n;
}

/* A trim heater or cooler at the end of stream p for gap kW. */
static int
add_trim(hl_network *net, size_t p, double gap, char *why, size_t nwhy)
{
	const hl_network_party *s = &net->party[p];
	double t_end = hl_profile_temp(s->seg, s->nseg, s->kind,
	    hl_profile_heat(s->seg, s->nseg, s->kind, s->target) - gap);
	size_t k = trim_utility(net, p, t_end);
	hl_network_unit u;

	if (k == (size_t)-1) {
		snprintf(why, nwhy, "stream '%s' would end %.4g kW short of its "
		    "target and no utility can serve it", s->name, gap);
		return -1;
	}
	memset(&u, 0, sizeof u);
	snprintf(u.id, sizeof u.id, "T%d", count_prefix(net, 'T') + 1);
	u.match = -1;
	u.hot = s->kind == HL_HOT ? p : k;
	u.cold = s->kind == HL_HOT ? k : p;
	u.duty = gap;
	u.hot_in = s->kind == HL_HOT ? t_end : net->party[k].supply;
	u.hot_out = s->kind == HL_HOT ? s->target : net->party[k].target;
	u.cold_in = s->kind == HL_HOT ? net->party[k].supply : t_end;
	u.cold_out = s->kind == HL_HOT ? net->party[k].target : s->target;
	u.hot_share = u.cold_share = 1.0;
	if (s->kind == HL_HOT)
		u.hot_stage = rf_stages(net, p) + 1;
	else
		u.cold_stage = rf_stages(net, p) + 1;
	/* The type the case fixes for the pair, else the utility's own. */
	u.type = hl_network_unit_type(net, u.hot, u.cold);
	u.shells = 1;
	u.held = 1;
	return hl_network_add_unit(net, &u, NULL) == HL_OK ? 0 : -1;
}

/* Trims for the streams that end short; new units' shells by the Xp rule.
 * 1 when something changed, 0 when not, -1 when the candidate fails. */
static int
adjust(rf_cand *cd, const hl_netsim *r)
{
	hl_network *net = cd->net;
	size_t p, i, n0 = net->nunit;
	int changed = 0;

	for (p = 0; p < net->nparty; p++) {
		double gap = r->shortfall[p];
		double tol = 1e-7 * (1.0 + net->party[p].load);

		if (net->party[p].utility || fabs(gap) <= tol)
			continue;
		if (gap < 0.0) {
			snprintf(cd->why, sizeof cd->why, "stream '%s' would "
			    "pass its target", net->party[p].name);
			return -1;
		}
		if (add_trim(net, p, gap, cd->why, sizeof cd->why) != 0)
			return -1;
		changed = 1;
	}
	for (i = 0; i < n0; i++) {
		hl_network_unit *u = &net->unit[i];
		int n;

		if (u->reuses[0] != '\0' || !rf_recovery(net, u))
			continue;
		n = xp_shells(net, u);
		if (n != u->shells) {
			u->shells = n;
			u->shells_added = n;
			changed = 1;
		}
	}
	return changed;
}

static hl_status
simulate(rf_cand *cd)
{
	int round;

	for (round = 0; round < EVAL_ROUNDS; round++) {
		hl_netsim *r = NULL;
		hl_error e;
		hl_status st = hl_netsim_run(cd->net, &r, &e);
		int a;

		if (st == HL_EIO)
			return st;
		if (st != HL_OK) {
			snprintf(cd->why, sizeof cd->why, "%.250s", e.text);
			return HL_OK;
		}
		a = adjust(cd, r);
		if (a == 0 && !r->sound)
			snprintf(cd->why, sizeof cd->why, "%s", r->why);
		cd->ok = a == 0 && r->sound;
		hl_netsim_free(r);
		if (a <= 0)
			return HL_OK;
	}
	cd->ok = 0;
	snprintf(cd->why, sizeof cd->why, "no steady state with its trims");
	return HL_OK;
}

/* Every unit keeps the retrofit's required approach. */
static int
approaches(rf_cand *cd)
{
	const hl_network *net = cd->net;
	size_t i;

	for (i = 0; i < net->nunit; i++) {
		const hl_network_unit *u = &net->unit[i];

		if (u->approach < u->required - 1e-6) {
			snprintf(cd->why, sizeof cd->why, "%s would run at an "
			    "approach of %.3g K, below %.3g K", u->id,
			    u->approach, u->required);
			return 0;
		}
	}
	return 1;
}

static const hl_network_unit *
unit_named(const hl_network *net, const char *tag)
{
	size_t i;

	for (i = 0; i < net->nunit; i++)
		if (strcmp(net->unit[i].reuses, tag) == 0 ||
		    (net->unit[i].reuses[0] == '\0' &&
		     strcmp(net->unit[i].id, tag) == 0))
			return &net->unit[i];
	return NULL;
}

/* A derived modification: a trim, or area (a fired heater: firing) a held
 * unit's duty needs beyond what the moves gave it. */
static void
derive(const rf_ctx *x, rf_cand *cd)
{
	const hl_network *net = cd->net;
	size_t i, k;

	cd->nmod = cd->nmove;
	for (i = 0; i < net->nunit && cd->nmod < RFIT_MAX_MODS; i++) {
		const hl_network_unit *u = &net->unit[i];
		hl_rfit_mod *m = &cd->mod[cd->nmod];
		int moved = 0;

		for (k = 0; k < cd->nmove; k++)
			moved |= strcmp(cd->mod[k].unit, u->reuses[0] ?
			    u->reuses : u->id) == 0 &&
			    cd->mod[k].kind != HL_RFIT_REPIPE &&
			    cd->mod[k].kind != HL_RFIT_RESEQUENCE;
		if (moved || !(u->area_added > 0.0 || u->duty_added > 0.0))
			continue;
		memset(m, 0, sizeof *m);
		m->kind = u->reuses[0] == '\0' ? HL_RFIT_TRIM :
		    u->type == HL_EXCH_FIRED_HEATER ? HL_RFIT_HEATER_DUTY :
		    HL_RFIT_UTILITY_AREA;
		snprintf(m->unit, sizeof m->unit, "%s",
		    u->reuses[0] ? u->reuses : u->id);
		rf_place_text(net, u, m->to, sizeof m->to);
		if (m->kind != HL_RFIT_TRIM)
			memcpy(m->from, m->to, sizeof m->from);
		cd->nmod++;
	}
	for (k = 0; k < cd->nmod; k++) {
		hl_rfit_mod *m = &cd->mod[k];
		const hl_network_unit *u = unit_named(net, m->unit);
		int area = m->kind != HL_RFIT_REPIPE &&
		    m->kind != HL_RFIT_RESEQUENCE && m->kind != HL_RFIT_REMOVE &&
		    m->kind != HL_RFIT_ADD_SPLIT &&
		    m->kind != HL_RFIT_DROP_SPLIT;

		m->cost = 0.0;
		if (area && u != NULL) {
			m->area_added = u->area_added;
			m->shells_added = u->shells_added;
			m->duty_added = u->duty_added;
			m->cost = u->cost;
		}
		if (m->kind == HL_RFIT_REPIPE || m->kind == HL_RFIT_RESEQUENCE ||
		    m->kind == HL_RFIT_ADD_SPLIT ||
		    m->kind == HL_RFIT_DROP_SPLIT)
			m->cost += x->o->repipe_cost;
		if (m->kind == HL_RFIT_NEW_UNIT || m->kind == HL_RFIT_TRIM)
			m->cost += x->o->unit_cost;
	}
}

hl_status
rf_eval(rf_ctx *x, rf_cand *cd)
{
	hl_status st;
	hl_error e;
	size_t k;

	x->evaluated++;
	cd->ok = 0;
	cd->why[0] = '\0';
	rf_strip_trims(cd->net);
	st = simulate(cd);
	if (st != HL_OK || !cd->ok)
		return st;
	cd->ok = 0;
	st = rf_finish(cd->net, x->qh_target, x->qc_target, &e);
	if (st == HL_EIO)
		return st;
	if (st != HL_OK) {
		snprintf(cd->why, sizeof cd->why, "%.250s", e.text);
		return HL_OK;
	}
	if (!approaches(cd))
		return HL_OK;
	derive(x, cd);
	cd->qh = cd->net->qh;
	cd->qc = cd->net->qc;
	cd->cost = cd->net->energy_cost;
	cd->investment = 0.0;
	for (k = 0; k < cd->nmod; k++)
		cd->investment += cd->mod[k].cost;
	cd->saving = x->cost_today - cd->cost;
	cd->payback = cd->saving > 0.0 ? cd->investment / cd->saving :
	    HUGE_VAL;
	cd->ok = 1;
	return HL_OK;
}
