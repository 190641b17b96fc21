/* network_relax.c - the fallback when no order or split keeps every
 * approach: cut the duty of the worst unit to what its own approach allows
 * and hand the rest to utilities at the streams' far ends.
 *
 * Why it converges: with the inlets of a unit fixed, cutting its duty raises
 * its hot outlet and lowers its cold outlet, so both of its end differences
 * grow; every unit downstream on the hot stream then sees a hotter stream
 * and every unit downstream on the cold stream a colder one, so no other
 * approach shrinks. The heat cut goes to the last stage of each stream (the
 * heater at a cold stream's target end, the cooler at a hot stream's),
 * which gains duty at its inlet end only. Each step fixes one unit and
 * breaks none, so at most one step per unit is needed. A heater or cooler
 * that misses its approach gives its excess to another utility unit at the
 * end of its stream in the same way (the mix changes, not the total).
 */
#include <math.h>
#include <stdint.h>
#include <stdio.h>

#include "network_int.h"
#include "profile.h"

/* Temperature of one side of unit u at duty x, its inlet as it is: a
 * process side along its profile (scaled by its share), a utility side at
 * the outlet its evaluation gave. */
static double
outlet_at(const hl_network_party *p, double t_in, double t_out, double share,
	  double x)
{
	if (p->utility)
		return t_out;
	return hl_profile_temp(p->seg, p->nseg, p->kind,
	    hl_profile_heat(p->seg, p->nseg, p->kind, t_in) + x / share);
}

/* Largest duty (kW) of unit k with its inlets and shares as they are that
 * keeps its required approach: bisection on the monotone approach. */
double
hl_net_max_duty(const hl_net_place *P, size_t k)
{
	const hl_network *net = P->net;
	const hl_network_unit *u = &net->unit[k];
	const hl_network_party *h = &net->party[u->hot];
	const hl_network_party *c = &net->party[u->cold];
	double lo = 0.0, hi = u->duty;
	int it;

	for (it = 0; it < 60; it++) {
		double x = 0.5 * (lo + hi);
		hl_profile_side hs = { h->seg, h->utility ? 0 : h->nseg,
		    h->kind, u->hot_in, outlet_at(h, u->hot_in, u->hot_out,
		    u->hot_share, x), 1.0 };
		hl_profile_side cs = { c->seg, c->utility ? 0 : c->nseg,
		    c->kind, u->cold_in, outlet_at(c, u->cold_in, u->cold_out,
		    u->cold_share, x), 1.0 };
		hl_profile_unit pu;

		hl_profile_unit_eval(&hs, &cs, x, &pu);
		if (pu.approach >= u->required)
			lo = x;
		else
			hi = x;
	}
	return lo;
}

/* The cheapest utility of the given kind that can serve a new last stage
 * of process stream p taking `heat` kW; -1 when none can. */
static long
end_utility(const hl_net_place *P, size_t p, double heat, hl_kind kind)
{
	const hl_network *net = P->net;
	const hl_network_party *s = &net->party[p];
	double tin = hl_profile_temp(s->seg, s->nseg, s->kind, s->load - heat);
	double best = HUGE_VAL;
	long pick = -1;
	size_t i;

	for (i = 0; i < net->nparty; i++) {
		const hl_network_party *q = &net->party[i];
		double r, price;
		int ok;

		if (!q->utility || q->kind != kind)
			continue;
		r = kind == HL_HOT ? hl_network_required(&net->set, q, s) :
		    hl_network_required(&net->set, s, q);
		/* Counterflow ends: the utility's supply faces the stream's
		 * target, its outlet (at best the stream's inlet ∓ r) must lie
		 * on the far side of its supply. */
		if (kind == HL_HOT)
			ok = q->supply - s->target >= r &&
			    (q->supply == q->target || tin + r < q->supply);
		else
			ok = s->target - q->supply >= r &&
			    (q->supply == q->target || tin - r > q->supply);
		price = isnan(q->price) ? 0.0 : q->price;
		if (ok && price < best) {
			best = price;
			pick = (long)i;
		}
	}
	return pick;
}

/* Give `heat` kW more to the last stage of process stream p: the utility
 * unit already there (unless it is unit `cut`, the one giving the heat up),
 * or a new one. */
static hl_status
to_end(hl_net_place *P, size_t p, double heat, size_t cut, hl_error *err)
{
	hl_network *net = P->net;
	hl_net_lane *L = &P->lane[p];
	const hl_network_party *s = &net->party[p];
	hl_kind need = s->kind == HL_HOT ? HL_COLD : HL_HOT;
	hl_network_unit u = { 0 };
	long q;

	if (L->n > 0 && L->b[L->n - 1].n == 1 && L->b[L->n - 1].u[0] != cut) {
		hl_network_unit *last = &net->unit[L->b[L->n - 1].u[0]];
		size_t other = s->kind == HL_HOT ? last->cold : last->hot;

		if (net->party[other].utility) {
			last->duty += heat;
			return HL_OK;
		}
	}
	q = end_utility(P, p, heat, need);
	if (q < 0)
		return hl_error_set(err, HL_ENOSOLUTION, NULL, 0,
		    "no %s utility can take over %.6g kW at the %s end of "
		    "stream '%s', which a feasible placement needs: add a "
		    "utility level %s the stream's target", need == HL_HOT ?
		    "hot" : "cold", heat, s->kind == HL_HOT ? "cold" : "hot",
		    s->name, need == HL_HOT ? "hotter than" : "colder than");
	u.hot = s->kind == HL_HOT ? p : (size_t)q;
	u.cold = s->kind == HL_HOT ? (size_t)q : p;
	u.match = -1;
	u.duty = heat;
	u.hot_share = u.cold_share = 1.0;
	u.type = net->set.exchanger;
	if (hl_net_place_add_unit(P, &u, s->kind == HL_HOT ? s->target :
	    net->party[q].supply, s->kind == HL_HOT ? net->party[q].supply :
	    s->target) != HL_OK)
		return hl_error_nomem(err);
	return HL_OK;
}

/* The unit that misses the most approach; -1 if none. */
static long
worst_unit(const hl_net_place *P)
{
	const hl_network *net = P->net;
	double worst = HL_NET_VTOL;
	long pick = -1;
	size_t k;

	for (k = 0; k < net->nunit; k++) {
		const hl_network_unit *u = &net->unit[k];
		double v = hl_net_unit_violation(P, k);

		if (u->duty <= 0.0)
			continue;
		if (v > worst) {
			worst = v;
			pick = (long)k;
		}
	}
	return pick;
}

/* A unit that still misses its approach: name it. */
static hl_status
still_violated(const hl_net_place *P, hl_error *err)
{
	const hl_network *net = P->net;
	size_t k;

	for (k = 0; k < net->nunit; k++) {
		const hl_network_unit *u = &net->unit[k];

		if (hl_net_unit_violation(P, k) > HL_NET_VTOL)
			return hl_error_set(err, HL_ENOSOLUTION, NULL, 0,
			    "the match of '%s' with '%s' (%.6g kW) keeps only "
			    "%.6g K of the %.6g K approach wherever it is "
			    "placed: check the utility temperatures",
			    net->party[u->hot].name, net->party[u->cold].name,
			    u->duty, u->approach, u->required);
	}
	return HL_OK;
}

hl_status
hl_net_relax(hl_net_place *P, hl_error *err)
{
	hl_network *net = P->net;
	size_t step, limit = 2 * net->nunit + 2;
	hl_status st;

	for (step = 0; step < limit; step++) {
		double v = hl_net_eval(P), d, cut;
		long k;
		hl_network_unit *u;
		size_t hot, cold;

		if (v <= HL_NET_VTOL)
			return HL_OK;
		k = worst_unit(P);
		if (k < 0)
			return still_violated(P, err);
		u = &net->unit[k];
		hot = u->hot;
		cold = u->cold;
		d = hl_net_max_duty(P, (size_t)k);
		/* A sliver of a unit is not worth its shell. */
		if (d < 0.02 * u->duty)
			d = 0.0;
		cut = u->duty - d;
		u->duty = d;
		if (d == 0.0) {
			hl_net_lane_remove(&P->lane[hot], (size_t)k);
			hl_net_lane_remove(&P->lane[cold], (size_t)k);
		}
		/* A process pair's heat goes to utilities on both streams;
		 * a utility unit's to another utility on its stream (a change
		 * of mix, not of the total). */
		st = HL_OK;
		if (!net->party[hot].utility && !net->party[cold].utility)
			net->penalty += cut;
		if (!net->party[hot].utility)
			st = to_end(P, hot, cut, (size_t)k, err);
		if (st == HL_OK && !net->party[cold].utility)
			st = to_end(P, cold, cut, (size_t)k, err);
		if (st != HL_OK)
			return st;
	}
	hl_net_eval(P);
	return still_violated(P, err);
}
