/* netcheck.c - the independent verification of a network (netcheck.h). */
#include <math.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "cascade.h"
#include "netcheck.h"
#include "profile.h"
#include "supertarget.h"
#include "utility_lp.h"

#define REL 1e-6

static int
differ(double a, double b)
{
	return !(fabs(a - b) <= REL * fmax(1.0, fmax(fabs(a), fabs(b))));
}

static hl_status
add(hl_netcheck *r, const char *what, long line, const char *fmt, ...)
	__attribute__((format(printf, 4, 5)));

static hl_status
add(hl_netcheck *r, const char *what, long line, const char *fmt, ...)
{
	hl_netcheck_finding *f;
	va_list ap;

	if (r->n == r->cap) {
		size_t cap = r->cap ? 2 * r->cap : 16;

		f = realloc(r->f, cap * sizeof *f);
		if (f == NULL)
			return HL_EIO;
		r->f = f;
		r->cap = cap;
	}
	f = &r->f[r->n++];
	snprintf(f->what, sizeof f->what, "%s", what);
	f->line = line;
	va_start(ap, fmt);
	vsnprintf(f->text, sizeof f->text, fmt, ap);
	va_end(ap);
	return HL_OK;
}

void
hl_netcheck_free(hl_netcheck *r)
{
	if (r == NULL)
		return;
	free(r->f);
	free(r);
}

/* Heat (kW) a stream side exchanges between two temperatures. */
static double
side_heat(const hl_network_party *p, double t_in, double t_out)
{
	return hl_profile_heat(p->seg, p->nseg, p->kind, t_out) -
	    hl_profile_heat(p->seg, p->nseg, p->kind, t_in);
}

static hl_status
check_process_side(hl_netcheck *r, const hl_network_unit *u,
		   const hl_network_party *p, int hot)
{
	double tin = hot ? u->hot_in : u->cold_in;
	double tout = hot ? u->hot_out : u->cold_out;
	double share = hot ? u->hot_share : u->cold_share;
	double q;

	if (!(share > 0.0 && share <= 1.0 + REL))
		return add(r, u->id, u->line, "%s share %.6g must lie in "
		    "(0, 1]", hot ? "hot" : "cold", share);
	q = share * side_heat(p, tin, tout);
	/* A steep segment (latent heat spread over a tiny span) turns the
	 * last digits of a temperature into heat: the balance is held to
	 * REL of the unit's duty, or a tenth of REL of the stream's. */
	if (differ(q, u->duty) &&
	    fabs(q - u->duty) > 0.1 * REL * p->load)
		return add(r, u->id, u->line, "heat balance of the %s side: "
		    "%.4g of the cp of '%s' from %.6g to %.6g °C carries "
		    "%.6g kW, not the duty %.6g kW", hot ? "hot" : "cold",
		    share, p->name, tin, tout, q, u->duty);
	return HL_OK;
}

/* A utility side: from the supply towards the target, not past it. */
static hl_status
check_utility_side(hl_netcheck *r, const hl_network_unit *u,
		   const hl_network_party *p, int hot)
{
	double tin = hot ? u->hot_in : u->cold_in;
	double tout = hot ? u->hot_out : u->cold_out;
	double lo = fmin(p->supply, p->target), hi = fmax(p->supply, p->target);

	if (differ(tin, p->supply))
		return add(r, u->id, u->line, "the %s side enters at %.6g "
		    "°C, but utility '%s' is supplied at %.6g °C",
		    hot ? "hot" : "cold", tin, p->name, p->supply);
	if (p->supply == p->target ? differ(tout, p->supply) :
	    (tout < lo - REL * fmax(1.0, fabs(lo)) ||
	    tout > hi + REL * fmax(1.0, fabs(hi)) || !differ(tout, tin)))
		return add(r, u->id, u->line, "the %s side leaves at %.6g "
		    "°C, outside the range %.6g to %.6g °C of utility '%s' "
		    "(or at its supply)", hot ? "hot" : "cold", tout,
		    p->supply, p->target, p->name);
	return HL_OK;
}

static hl_status
check_unit(hl_netcheck *r, const hl_network *net, const hl_network_unit *u)
{
	const hl_network_party *h, *c;
	hl_network_unit z;
	hl_status st;
	hl_error e;

	if (u->hot >= net->nparty || u->cold >= net->nparty)
		return add(r, u->id, u->line, "names a stream that is not in "
		    "the network");
	h = &net->party[u->hot];
	c = &net->party[u->cold];
	if (h->kind != HL_HOT || c->kind != HL_COLD)
		return add(r, u->id, u->line, "its hot side '%s' must be a hot "
		    "stream or utility and its cold side '%s' a cold one",
		    h->name, c->name);
	if (h->utility && c->utility)
		return add(r, u->id, u->line, "joins two utilities");
	if (!(u->duty > 0.0 && isfinite(u->duty)))
		return add(r, u->id, u->line, "duty %.6g kW must be above "
		    "0", u->duty);
	st = h->utility ? check_utility_side(r, u, h, 1) :
	    check_process_side(r, u, h, 1);
	if (st == HL_OK)
		st = c->utility ? check_utility_side(r, u, c, 0) :
		    check_process_side(r, u, c, 0);
	if (st != HL_OK)
		return st;
	z = *u;
	z.note = NULL;
	if (hl_network_size_unit(net, &z, &e) != HL_OK)
		return add(r, u->id, u->line, "cannot be sized: %s", e.text);
	if (z.approach < z.required - REL * fmax(1.0, z.required)) {
		double dh = u->hot_in - u->cold_out, dc = u->hot_out - u->cold_in;
		const char *where = dh <= dc && dh <= z.approach + REL ?
		    "at the hot end" : dc <= z.approach + REL ?
		    "at the cold end" : "inside the unit";

		if (add(r, u->id, u->line, "EMAT violated %s: approach %.6g "
		    "K (hot end %.6g K, cold end %.6g K) is below the "
		    "required %.6g K", where, z.approach, dh, dc,
		    z.required) != HL_OK)
			return HL_EIO;
	}
	if (u->held && z.area > (u->area_today + u->area_added) *
	    (1.0 + REL))
		return add(r, u->id, u->line, "needs %.10g m² but has %.10g "
		    "m² today and %.10g m² added: add %.10g m² more",
		    z.area, u->area_today, u->area_added,
		    z.area - u->area_today - u->area_added);
	if (u->held && u->type == HL_EXCH_FIRED_HEATER && u->duty >
	    (u->duty_today + u->duty_added) * (1.0 + REL))
		return add(r, u->id, u->line, "fires %.10g kW but is rated "
		    "%.10g kW today with %.10g kW added: add %.10g kW more",
		    u->duty, u->duty_today, u->duty_added,
		    u->duty - u->duty_today - u->duty_added);
	if (differ(z.u, u->u) || differ(z.lmtd, u->lmtd) ||
	    differ(z.ft, u->ft) || z.shells != u->shells ||
	    differ(z.area, u->area) || differ(z.cost, u->cost))
		return add(r, u->id, u->line, "sizing does not follow from its "
		    "temperatures: U %.6g, LMTD %.6g K, F %.6g, %d shells, "
		    "%.6g m², cost %.6g (the file has U %.6g, LMTD %.6g, F "
		    "%.6g, %d, %.6g, %.6g)", z.u, z.lmtd, z.ft, z.shells,
		    z.area, z.cost, u->u, u->lmtd, u->ft, u->shells, u->area,
		    u->cost);
	return HL_OK;
}

/* The stages of process stream p, in order: branches enter at the
 * temperature the previous stage mixes to, shares sum to 1, the last
 * stage mixes to the target. */
static hl_status
check_stream(hl_netcheck *r, const hl_network *net, size_t p)
{
	const hl_network_party *s = &net->party[p];
	double q = 0.0, total = 0.0;
	int stage, last = 0;
	size_t i, seen = 0;

	for (i = 0; i < net->nunit; i++) {
		const hl_network_unit *u = &net->unit[i];
		int g = u->hot == p ? u->hot_stage : u->cold_stage;

		if (u->hot != p && u->cold != p)
			continue;
		if (g < 1)
			return add(r, u->id, u->line, "has no stage on stream "
			    "'%s' (stages count from 1 at its supply end)",
			    s->name);
		if (g > last)
			last = g;
		seen++;
	}
	for (stage = 1; stage <= last; stage++) {
		double tin = hl_profile_temp(s->seg, s->nseg, s->kind, q);
		double sum = 0.0, share = 0.0;
		size_t n = 0;

		for (i = 0; i < net->nunit; i++) {
			const hl_network_unit *u = &net->unit[i];
			int hot = u->hot == p;
			double t;

			if ((hot ? u->hot_stage : u->cold == p ? u->cold_stage :
			    -1) != stage)
				continue;
			t = hot ? u->hot_in : u->cold_in;
			if (differ(t, tin) && add(r, u->id, u->line, "enters "
			    "stream '%s' at %.6g °C, but stage %d of the "
			    "stream begins at %.6g °C", s->name, t, stage,
			    tin) != HL_OK)
				return HL_EIO;
			sum += u->duty;
			share += hot ? u->hot_share : u->cold_share;
			n++;
		}
		if (n == 0)
			return add(r, s->name, s->line, "stage %d of stream "
			    "'%s' has no unit (%d stages in all)", stage,
			    s->name, last);
		if (differ(share, 1.0))
			return add(r, s->name, s->line, "the shares of stage %d "
			    "of stream '%s' sum to %.6g, not 1", stage,
			    s->name, share);
		q += sum;
		total += sum;
	}
	(void)seen;
	if (differ(total, s->load))
		return add(r, s->name, s->line, "energy balance: the units on "
		    "stream '%s' exchange %.6g kW, but it carries %.6g kW "
		    "from %.6g to %.6g °C", s->name, total, s->load,
		    s->supply, s->target);
	return HL_OK;
}

/* A utility's load and its units' shares. */
static hl_status
check_utility(hl_netcheck *r, const hl_network *net, size_t p)
{
	const hl_network_party *s = &net->party[p];
	double sum = 0.0, flow = 0.0;
	size_t i;

	for (i = 0; i < net->nunit; i++) {
		const hl_network_unit *u = &net->unit[i];
		double dt;

		if (u->hot != p && u->cold != p)
			continue;
		dt = u->hot == p ? u->hot_in - u->hot_out :
		    u->cold_out - u->cold_in;
		sum += u->duty;
		flow += s->supply == s->target ? u->duty :
		    u->duty / fmax(fabs(dt), 1e-300);
	}
	if (differ(sum, s->load))
		return add(r, s->name, s->line, "energy balance: the units on "
		    "utility '%s' exchange %.6g kW, but its load is %.6g kW",
		    s->name, sum, s->load);
	for (i = 0; i < net->nunit && flow > 0.0; i++) {
		const hl_network_unit *u = &net->unit[i];
		double dt, want, got;

		if (u->hot != p && u->cold != p)
			continue;
		dt = u->hot == p ? u->hot_in - u->hot_out :
		    u->cold_out - u->cold_in;
		want = (s->supply == s->target ? u->duty :
		    u->duty / fmax(fabs(dt), 1e-300)) / flow;
		got = u->hot == p ? u->hot_share : u->cold_share;
		if (differ(want, got) && add(r, u->id, u->line, "takes %.6g "
		    "of the flow of utility '%s', not the %.6g its share "
		    "says", want, s->name, got) != HL_OK)
			return HL_EIO;
	}
	return HL_OK;
}

/* A case of the network's own streams and utilities, for the targets. */
static hl_status
to_case(const hl_network *net, hl_case **out)
{
	hl_case *c = hl_case_create();
	size_t i;

	if (c == NULL)
		return HL_EIO;
	c->set.dtmin = net->set.dtmin;
	c->set.hours = net->set.hours;
	for (i = 0; i < net->nparty; i++) {
		const hl_network_party *p = &net->party[i];
		hl_status st;

		if (!p->utility) {
			hl_stream s;

			memset(&s, 0, sizeof s);
			s.name = p->name;
			s.kind = p->kind;
			s.nseg = p->nseg;
			s.seg = p->seg;
			s.dt_contrib = p->dt_contrib;
			s.cp_tol = s.t_tol = NAN;
			st = hl_case_add_stream(c, &s, NULL);
		} else if (!p->implicit) {
			hl_utility u;

			memset(&u, 0, sizeof u);
			u.name = p->name;
			u.kind = p->kind;
			u.supply = p->supply;
			u.target = p->target;
			u.price = isnan(p->price) ? 0.0 : p->price;
			u.h = p->h;
			u.max_load = p->max_load;
			u.dt_contrib = p->dt_contrib;
			st = hl_case_add_utility(c, &u, NULL);
		} else {
			st = HL_OK;
		}
		if (st != HL_OK) {
			hl_case_free(c);
			return st;
		}
	}
	*out = c;
	return HL_OK;
}

/* The least-cost mix, when the network uses only priced case utilities
 * and declares no penalty. */
static hl_status
check_mix(hl_netcheck *r, const hl_network *net, const hl_case *c)
{
	hl_utility_lp_opts o = { 0, NULL, NULL, NAN };
	hl_utility_lp *lp = NULL;
	double cost = 0.0;
	size_t i;
	hl_status st = HL_OK;

	for (i = 0; i < net->nparty; i++) {
		const hl_network_party *p = &net->party[i];

		if (p->utility && (p->implicit || isnan(p->price)))
			return HL_OK;
		if (p->utility)
			cost += p->price * p->load * net->set.hours / 1000.0;
	}
	if (c->nutil == 0 || net->restriction > 0.0 || net->penalty > 0.0)
		return HL_OK;
	if (hl_utility_lp_solve(c, net->set.dtmin, &o, &lp, NULL) != HL_OK)
		return HL_OK;
	if (cost > lp->cost + REL * fmax(1.0, lp->cost))
		st = add(r, "utilities", 0, "the utility mix costs %.6g a "
		    "year; the least-cost mix at ΔTmin %.6g K costs %.6g",
		    cost, net->set.dtmin, lp->cost);
	hl_utility_lp_free(lp);
	return st;
}

static hl_status
check_targets(hl_netcheck *r, const hl_network *net)
{
	hl_case *c = NULL;
	double qh = 0.0, qc = 0.0, extra = net->restriction + net->penalty +
	    net->range_rise;
	size_t i;
	hl_status st;

	if (to_case(net, &c) != HL_OK)
		return HL_EIO;
	if (c->nstream == 0 || hl_cascade_targets(c, net->set.dtmin,
	    &r->qh_min, &r->qc_min, NULL) != HL_OK) {
		hl_case_free(c);
		return add(r, "targets", 0, "the problem table of the "
		    "network's streams cannot be computed");
	}
	for (i = 0; i < net->nparty; i++) {
		const hl_network_party *p = &net->party[i];

		if (p->utility && p->kind == HL_HOT)
			qh += p->load;
		else if (p->utility)
			qc += p->load;
	}
	st = HL_OK;
	if (!isnan(net->qh_target) && (differ(net->qh_target, r->qh_min) ||
	    differ(net->qc_target, r->qc_min)))
		st = add(r, "targets", 0, "the network states targets of "
		    "%.6g / %.6g kW, but its streams give %.6g / %.6g kW "
		    "at ΔTmin %.6g K", net->qh_target, net->qc_target,
		    r->qh_min, r->qc_min, net->set.dtmin);
	if (st == HL_OK && (differ(qh, r->qh_min + extra) ||
	    differ(qc, r->qc_min + extra)))
		st = add(r, "utilities", 0, "the network uses %.6g kW of hot "
		    "and %.6g kW of cold utility; the targets %.6g / %.6g "
		    "kW plus the %.6g kW it declares above them give "
		    "%.6g / %.6g kW", qh, qc, r->qh_min, r->qc_min, extra,
		    r->qh_min + extra, r->qc_min + extra);
	if (st == HL_OK)
		st = check_mix(r, net, c);
	hl_case_free(c);
	return st;
}

static hl_status
check_totals(hl_netcheck *r, const hl_network *net)
{
	double area = 0.0, capital = 0.0, energy = 0.0, crf;
	size_t i;

	for (i = 0; i < net->nunit; i++) {
		area += net->unit[i].area;
		capital += net->unit[i].cost;
	}
	for (i = 0; i < net->nparty; i++) {
		const hl_network_party *p = &net->party[i];

		if (p->utility && !isnan(p->price))
			energy += p->price * p->load * net->set.hours / 1000.0;
	}
	crf = hl_supertarget_crf(net->set.interest, net->set.life);
	if (differ(area, net->area) || differ(capital, net->capital) ||
	    differ(energy, net->energy_cost) || differ(crf, net->crf) ||
	    differ(capital * crf, net->capital_annual) ||
	    differ(capital * crf + energy, net->total_cost))
		return add(r, "totals", 0, "the totals do not add up: area "
		    "%.6g m², capital %.6g, annual capital %.6g, energy "
		    "%.6g, total %.6g a year (the file has %.6g, %.6g, "
		    "%.6g, %.6g, %.6g)", area, capital, capital * crf,
		    energy, capital * crf + energy, net->area, net->capital,
		    net->capital_annual, net->energy_cost, net->total_cost);
	return HL_OK;
}

hl_status
hl_netcheck_run(const hl_network *net, hl_netcheck **out, hl_error *err)
{
	hl_netcheck *r = calloc(1, sizeof *r);
	hl_status st = HL_OK;
	size_t i;

	if (r == NULL)
		return hl_error_nomem(err);
	r->qh_min = r->qc_min = NAN;
	for (i = 0; i < net->nunit && st == HL_OK; i++, r->checked++)
		st = check_unit(r, net, &net->unit[i]);
	for (i = 0; i < net->nparty && st == HL_OK; i++)
		st = net->party[i].utility ? check_utility(r, net, i) :
		    check_stream(r, net, i);
	if (st == HL_OK)
		st = check_targets(r, net);
	if (st == HL_OK)
		st = check_totals(r, net);
	if (st != HL_OK) {
		hl_netcheck_free(r);
		return hl_error_nomem(err);
	}
	*out = r;
	return HL_OK;
}
