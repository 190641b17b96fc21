/* netsim.c - the plant of fixed areas run to its steady state (netsim.h):
 * Gauss–Seidel sweeps over the streams' stages, each recovery unit rated
 * (rating.h) at the latest inlets, each utility stage holding its set
 * point. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "netsim.h"
#include "profile.h"
#include "rating.h"

typedef struct {
	size_t n;
	size_t *u;        /* units of the stage */
	int util;         /* a utility unit in it: the stage holds `hold` */
	double hold;      /* °C, the set point */
} stage;

typedef struct {
	size_t n;
	stage *st;        /* 1-based stage k at st[k - 1] */
	double end;       /* °C after the last stage */
} lane;

typedef struct {
	hl_network *net;
	lane *lane;       /* per party (empty for utilities) */
	double *weight;   /* per unit: duty on entry */
} sim;

static double
heat(const hl_network_party *p, double t)
{
	return hl_profile_heat(p->seg, p->nseg, p->kind, t);
}

static double
temp(const hl_network_party *p, double q)
{
	return hl_profile_temp(p->seg, p->nseg, p->kind, q);
}

static int
is_recovery(const hl_network *net, const hl_network_unit *u)
{
	return !net->party[u->hot].utility && !net->party[u->cold].utility;
}

/* The unit's stage on party p (0 when p is not one of its sides). */
static int
stage_on(const hl_network_unit *u, size_t p)
{
	return u->hot == p ? u->hot_stage : u->cold == p ? u->cold_stage : 0;
}

static double
share_on(const hl_network_unit *u, size_t p)
{
	return u->hot == p ? u->hot_share : u->cold_share;
}

static double
inlet_on(const hl_network_unit *u, size_t p)
{
	return u->hot == p ? u->hot_in : u->cold_in;
}

static void
lanes_free(sim *s)
{
	size_t p, k;

	for (p = 0; s->lane != NULL && p < s->net->nparty; p++) {
		for (k = 0; k < s->lane[p].n; k++)
			free(s->lane[p].st[k].u);
		free(s->lane[p].st);
	}
	free(s->lane);
	free(s->weight);
}

/* Stage k of party p with its units; the set point from the entry state. */
static hl_status
fill_stage(sim *s, size_t p, size_t k, hl_error *err)
{
	const hl_network *net = s->net;
	const hl_network_party *pp = &net->party[p];
	stage *st = &s->lane[p].st[k];
	double q0 = NAN, sum = 0.0;
	size_t i;

	for (i = 0; i < net->nunit; i++)
		if (stage_on(&net->unit[i], p) == (int)k + 1)
			st->n++;
	if (st->n == 0)
		return hl_error_set(err, HL_EINPUT, NULL, 0, "stream '%s' has "
		    "no unit in its stage %zu", pp->name, k + 1);
	st->u = malloc(st->n * sizeof *st->u);
	if (st->u == NULL)
		return hl_error_nomem(err);
	st->n = 0;
	for (i = 0; i < net->nunit; i++) {
		const hl_network_unit *u = &net->unit[i];

		if (stage_on(u, p) != (int)k + 1)
			continue;
		st->u[st->n++] = i;
		if (!is_recovery(net, u))
			st->util = 1;
		if (isnan(q0))
			q0 = heat(pp, inlet_on(u, p));
		sum += u->duty;
	}
	st->hold = temp(pp, q0 + sum);
	return HL_OK;
}

static hl_status
build(sim *s, hl_error *err)
{
	hl_network *net = s->net;
	size_t p, i, k;
	hl_status st = HL_OK;

	s->lane = calloc(net->nparty, sizeof *s->lane);
	s->weight = calloc(net->nunit + 1, sizeof *s->weight);
	if (s->lane == NULL || s->weight == NULL)
		return hl_error_nomem(err);
	for (i = 0; i < net->nunit; i++) {
		const hl_network_unit *u = &net->unit[i];

		double a = u->held ? u->area_today + u->area_added : u->area;

		s->weight[i] = u->duty;
		if (is_recovery(net, u) && !(a >= 0.0 && isfinite(a) &&
		    u->shells >= 1))
			return hl_error_set(err, HL_EINPUT, NULL, 0, "unit %s "
			    "has no area or shells to simulate", u->id);
	}
	for (p = 0; p < net->nparty && st == HL_OK; p++) {
		size_t n = 0;

		if (net->party[p].utility)
			continue;
		for (i = 0; i < net->nunit; i++) {
			int k1 = stage_on(&net->unit[i], p);

			if (k1 > 0 && (size_t)k1 > n)
				n = (size_t)k1;
		}
		if (n == 0)
			continue;
		s->lane[p].st = calloc(n, sizeof *s->lane[p].st);
		if (s->lane[p].st == NULL)
			return hl_error_nomem(err);
		s->lane[p].n = n;
		for (k = 0; k < n && st == HL_OK; k++)
			st = fill_stage(s, p, k, err);
	}
	return st;
}

/* What the unit's area does at its inlets, held by the bypass to what its
 * streams have left before their targets. */
static double
rate(const hl_network *net, const hl_network_unit *u)
{
	const hl_network_party *h = &net->party[u->hot];
	const hl_network_party *c = &net->party[u->cold];
	hl_rating_spec rs;
	hl_rating_result g;
	double cap_h, cap_c;

	if (!(u->hot_in > u->cold_in))
		return 0.0;
	rs.hot.seg = h->seg;
	rs.hot.nseg = h->nseg;
	rs.hot.kind = HL_HOT;
	rs.hot.share = u->hot_share;
	rs.hot.t_in = u->hot_in;
	rs.hot.h_default = net->set.h_default;
	rs.cold.seg = c->seg;
	rs.cold.nseg = c->nseg;
	rs.cold.kind = HL_COLD;
	rs.cold.share = u->cold_share;
	rs.cold.t_in = u->cold_in;
	rs.cold.h_default = net->set.h_default;
	rs.type = u->type;
	rs.shells = u->shells;
	rs.area = u->held ? u->area_today + u->area_added : u->area;
	if (hl_rating_run(&rs, &g, NULL) != HL_OK)
		return 0.0;
	/* A branch may pass the target before it mixes (profile.h); the
	 * bypass only holds the unit to what the whole stream has left. */
	cap_h = heat(h, h->target) - heat(h, u->hot_in);
	cap_c = heat(c, c->target) - heat(c, u->cold_in);
	return fmax(0.0, fmin(g.duty, fmin(cap_h, cap_c)));
}

/* The make-up of a utility stage, shared by the weights on entry. */
static void
make_up(sim *s, const stage *st, double rest)
{
	hl_network *net = s->net;
	double wsum = 0.0;
	size_t j, nu = 0;

	for (j = 0; j < st->n; j++)
		if (!is_recovery(net, &net->unit[st->u[j]])) {
			wsum += s->weight[st->u[j]];
			nu++;
		}
	for (j = 0; j < st->n; j++) {
		hl_network_unit *u = &net->unit[st->u[j]];

		if (is_recovery(net, u))
			continue;
		u->duty = fmax(0.0, rest) * (wsum > 0.0 ?
		    s->weight[st->u[j]] / wsum : 1.0 / (double)nu);
	}
}

/* One stage of party p entered at t; returns the mixed outlet. Sets *moved
 * to the largest change of a recovery duty. */
static double
run_stage(sim *s, size_t p, const stage *st, double t, double *moved)
{
	hl_network *net = s->net;
	const hl_network_party *pp = &net->party[p];
	double q0 = heat(pp, t), rec = 0.0, tot = 0.0;
	size_t j;

	for (j = 0; j < st->n; j++) {
		hl_network_unit *u = &net->unit[st->u[j]];

		if (u->hot == p)
			u->hot_in = t;
		else
			u->cold_in = t;
		if (is_recovery(net, u)) {
			double d = rate(net, u);

			*moved = fmax(*moved, fabs(d - u->duty));
			u->duty = d;
			rec += d;
		}
	}
	if (st->util)
		make_up(s, st, heat(pp, st->hold) - q0 - rec);
	for (j = 0; j < st->n; j++) {
		hl_network_unit *u = &net->unit[st->u[j]];
		double out = temp(pp, q0 + u->duty / share_on(u, p));

		if (u->hot == p)
			u->hot_out = out;
		else
			u->cold_out = out;
		tot += u->duty;
	}
	return temp(pp, q0 + tot);
}

/* One sweep over every stream; returns the largest duty change. */
static double
sweep(sim *s)
{
	hl_network *net = s->net;
	double moved = 0.0;
	size_t p, k;

	for (p = 0; p < net->nparty; p++) {
		lane *l = &s->lane[p];
		double t = net->party[p].supply;

		for (k = 0; k < l->n; k++)
			t = run_stage(s, p, &l->st[k], t, &moved);
		l->end = t;
	}
	return moved;
}

/* Keep the first reason only. */
static void
say(hl_netsim *r, const char *text)
{
	if (r->sound) {
		r->sound = 0;
		snprintf(r->why, sizeof r->why, "%s", text);
	}
}

/* Shortfalls, negative make-ups, idle units, utility totals. */
static void
judge(const sim *s, hl_netsim *r)
{
	const hl_network *net = s->net;
	char buf[256];
	size_t p, i;

	r->sound = 1;
	r->approach = HUGE_VAL;
	for (p = 0; p < net->nparty; p++) {
		const hl_network_party *pp = &net->party[p];
		const lane *l = &s->lane[p];
		double gap, tol = 1e-7 * (1.0 + pp->load);

		if (pp->utility)
			continue;
		/* A stream left without units stays at its supply. */
		gap = heat(pp, pp->target) - heat(pp, l->n > 0 ? l->end :
		    pp->supply);
		if (fabs(gap) <= tol)
			continue;
		r->shortfall[p] = gap;
		snprintf(buf, sizeof buf, "stream '%s' %s its target by %.4g "
		    "kW", pp->name, gap > 0.0 ? "falls short of" : "passes",
		    fabs(gap));
		say(r, buf);
	}
	for (i = 0; i < net->nunit; i++) {
		const hl_network_unit *u = &net->unit[i];

		if (net->party[u->hot].utility)
			r->qh += u->duty;
		if (net->party[u->cold].utility)
			r->qc += u->duty;
		if (!(u->duty > 0.0)) {
			snprintf(buf, sizeof buf, "unit %s is left with no "
			    "duty", u->id);
			say(r, buf);
		}
		if (is_recovery(net, u))
			r->approach = fmin(r->approach, fmin(u->hot_in -
			    u->cold_out, u->hot_out - u->cold_in));
	}
}

void
hl_netsim_free(hl_netsim *r)
{
	if (r == NULL)
		return;
	free(r->shortfall);
	free(r);
}

hl_status
hl_netsim_run(hl_network *net, hl_netsim **out, hl_error *err)
{
	sim s = { net, NULL, NULL };
	hl_netsim *r = calloc(1, sizeof *r);
	hl_status st;
	double scale = 1.0, moved = HUGE_VAL;
	size_t i;

	*out = NULL;
	if (r == NULL || (r->shortfall = calloc(net->nparty + 1,
	    sizeof *r->shortfall)) == NULL) {
		hl_netsim_free(r);
		return hl_error_nomem(err);
	}
	st = build(&s, err);
	for (i = 0; i < net->nunit; i++)
		scale = fmax(scale, net->unit[i].duty);
	while (st == HL_OK && r->sweeps < NETSIM_MAX_SWEEPS &&
	       (r->sweeps < 2 || moved > 1e-11 * scale)) {
		moved = sweep(&s);
		r->sweeps++;
	}
	if (st == HL_OK && moved > 1e-11 * scale)
		st = hl_error_set(err, HL_ENOSOLUTION, NULL, 0, "the network "
		    "does not settle after %d sweeps (duties still move by "
		    "%.3g kW)", r->sweeps, moved);
	if (st == HL_OK)
		judge(&s, r);
	lanes_free(&s);
	if (st != HL_OK) {
		hl_netsim_free(r);
		return st;
	}
	*out = r;
	return HL_OK;
}
