/* network_opt_eval.c - evaluation of the stage-wise superstructure with
 * isothermal mixing (Yee & Grossmann 1990): temperatures from the energy
 * balances along each stream, every unit sized by hl_network_size_unit,
 * the utilities at the stream ends, the limits missed as a sum. */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "network_opt_int.h"

/* Approach shortfalls count per this many K, other misses per unit. */
#define VIOL_K 10.0
/* K: an approach this far below EMAT still keeps it (rounding). */
#define APPROACH_TOL 1e-9

static double
tol_of(double x)
{
	return 1e-9 * fmax(1.0, fabs(x));
}

/* Stream x of a side (hot: 0, cold: 1) in its flow direction: the hot
 * stream enters at stage 0, the cold one at stage S - 1. Temperatures at
 * the stage boundaries and after each stage's process units, the heat
 * before each stage, the branch weights' sums, the end utility's duty, and
 * the limits the stream's loads miss (overshoot, splits). */
static void
stream_pass(const hl_opt_problem *P, hl_opt_state *s, int side, size_t x)
{
	size_t p = side == 0 ? P->hot[x] : P->cold[x];
	const hl_stream *st = &P->c->stream[p];
	double duty = hl_stream_duty(st), q = 0.0, v = 0.0;
	double *t = side == 0 ? &s->th[x * (P->S + 1)] : &s->tc[x * (P->S + 1)];
	double *tm = side == 0 ? &s->thm[x * P->S] : &s->tcm[x * P->S];
	double *hq = side == 0 ? &s->hq[x * P->S] : &s->cq[x * P->S];
	double *swo = side == 0 ? &s->swh[x * P->S] : &s->swc[x * P->S];
	double *end = side == 0 ? &s->hend[x] : &s->cend[x];
	const double *mid = side == 0 ? &s->uh[x * P->S] : &s->uc[x * P->S];
	const double *w = side == 0 ? s->wh : s->wc;
	/* the stream's cells in a stage: from base, partners step apart */
	size_t base = side == 0 ? x * P->nc : x, step = side == 0 ? 1 : P->nc;
	size_t np = side == 0 ? P->nc : P->nh, j, r, k;
	int mb = P->o->max_branches;

	t[side == 0 ? 0 : P->S] = hl_stream_supply(st);
	for (r = 0; r < P->S; r++) {
		size_t i0;
		double sum = 0.0, sw = 0.0;
		int n = 0;

		k = side == 0 ? r : P->S - 1 - r;
		i0 = k * P->nh * P->nc + base;
		for (j = 0; j < np; j++) {
			size_t i = i0 + j * step;

			if (s->q[i] > HL_OPT_QEPS) {
				sum += s->q[i];
				sw += s->q[i] * w[i];
				n++;
			}
		}
		hq[k] = q;
		swo[k] = sw;
		q += sum;
		tm[k] = q >= duty ? hl_stream_target(st) :
		    hl_stream_temp_at(st, q);
		q += mid[k];
		t[side == 0 ? k + 1 : k] = mid[k] > 0.0 ? (q >= duty ?
		    hl_stream_target(st) : hl_stream_temp_at(st, q)) : tm[k];
		if (n > 1 && P->nosplit[p])
			v += n - 1;
		if (mb > 0 && n > mb)
			v += n - mb;
	}
	*end = duty - q;
	if (*end < -tol_of(duty))
		v += -*end / P->qscale + 1.0;
	if (*end < tol_of(duty))
		*end = 0.0;
	*(side == 0 ? &s->hviol[x] : &s->cvs[x]) = v;
}

/* Mixing of branches by enthalpy (non-isothermal mixing, Björk &
 * Westerlund 2002): a branch of share phi takes load q as the whole stream
 * would take q/phi, from the heat before the stage. */
double
hl_opt_branch_out(const hl_opt_problem *P, const hl_opt_state *s, int side,
		  size_t k, size_t x, double q, double w, double *share)
{
	size_t o = x * P->S + k;
	double sw = side == 0 ? s->swh[o] : s->swc[o];
	double phi = sw > 0.0 ? q * w / sw : 1.0;

	*share = phi >= 1.0 - 1e-12 ? 1.0 : phi;
	if (*share == 1.0)
		return side == 0 ? s->thm[o] : s->tcm[o];
	return hl_stream_temp_at(&P->c->stream[side == 0 ? P->hot[x] :
	    P->cold[x]], (side == 0 ? s->hq[o] : s->cq[o]) + q / phi);
}

hl_status
hl_opt_size(const hl_network *net, hl_network_unit *u, int fallback,
	    hl_error *err)
{
	hl_status st;

	u->type = hl_network_unit_type(net, u->hot, u->cold);
	st = hl_network_size_unit(net, u, err);
	if (st == HL_ENOSOLUTION && fallback &&
	    u->type != HL_EXCH_COUNTERFLOW) {
		u->note = (char *)(u->type == HL_EXCH_AIR_COOLER ?
		    "would need more sections in series than an air cooler "
		    "sensibly has: sized as pure counterflow (double pipe or "
		    "plate)" : "would need more shells in series than its "
		    "type sensibly has: sized as pure counterflow (double "
		    "pipe or plate)");
		u->type = HL_EXCH_COUNTERFLOW;
		if (err != NULL)
			hl_error_clear(err);
		st = hl_network_size_unit(net, u, err);
	}
	return st;
}

double
hl_opt_emat(const hl_opt_problem *P, size_t a, size_t b)
{
	return hl_network_required(&P->base->set, &P->base->party[P->hot[a]],
	    &P->base->party[P->cold[b]]);
}

double
hl_opt_min_duty_for(const hl_opt_problem *P, size_t hot, size_t cold)
{
	size_t ns = P->c->nstream;
	double d = P->o->min_duty;

	if (!(d > 0.0))
		return 0.0;
	if (hot < ns)
		d = fmin(d, hl_stream_duty(&P->c->stream[hot]));
	if (cold < ns)
		d = fmin(d, hl_stream_duty(&P->c->stream[cold]));
	return d * (1.0 - 1e-9);
}

/* Size u by its type (hl_opt_size; counterflow beyond the shells a type
 * sensibly has, as the placement does, unless a shell limit is set).
 * Returns the limits missed. A fired heater is sized by duty and has no
 * area, so the smallest area does not apply to it. */
static double
size_unit(const hl_opt_problem *P, hl_network_unit *u)
{
	const hl_opt_options *o = P->o;
	double d1 = u->hot_in - u->cold_out, d2 = u->hot_out - u->cold_in;
	double req = hl_network_required(&P->base->set,
	    &P->base->party[u->hot], &P->base->party[u->cold]), v = 0.0;
	double dmin;

	/* APPROACH_TOL: the placement's temperatures, recomputed here from
	 * the loads, may fall short of EMAT in the last digits. */
	if (d1 < req - APPROACH_TOL || d2 < req - APPROACH_TOL)
		return (fmax(0.0, req - d1) + fmax(0.0, req - d2)) / VIOL_K +
		    1e-3;
	if (hl_opt_size(P->base, u, o->max_shells <= 0, NULL) != HL_OK)
		return 1.0;
	u->note = NULL;
	if (u->approach < req - APPROACH_TOL)
		v += (req - u->approach) / VIOL_K + 1e-3;
	if (u->duty < (dmin = hl_opt_min_duty_for(P, u->hot, u->cold)))
		v += 1.0 - u->duty / dmin + 1e-3;
	if (o->min_area > 0.0 && u->type != HL_EXCH_FIRED_HEATER &&
	    u->area < o->min_area)
		v += 1.0 - u->area / o->min_area + 1e-3;
	if (o->max_shells > 0 && u->shells > o->max_shells)
		v += u->shells - o->max_shells;
	return v;
}

static void
cell(const hl_opt_problem *P, hl_opt_state *s, size_t k, size_t a, size_t b)
{
	size_t i = HL_OPT_CELL(P, k, a, b);
	const double *th = &s->th[a * (P->S + 1)];
	const double *tc = &s->tc[b * (P->S + 1)];
	double oc = s->ccost[i], ov = s->cviol[i];
	int was = s->act[i];
	hl_network_unit u;

	s->ccost[i] = s->cviol[i] = 0.0;
	if (!(s->q[i] > HL_OPT_QEPS)) {
		if (s->keep[i])
			s->cviol[i] = 1.0;
		s->ccap += -oc;
		s->cvsum += s->cviol[i] - ov;
		s->nact -= (size_t)was;
		s->act[i] = 0;
		return;
	}
	memset(&u, 0, sizeof u);
	u.hot = P->hot[a];
	u.cold = P->cold[b];
	u.duty = s->q[i];
	u.hot_in = th[k];
	u.hot_out = hl_opt_branch_out(P, s, 0, k, a, u.duty, s->wh[i],
	    &u.hot_share);
	u.cold_in = tc[k + 1];
	u.cold_out = hl_opt_branch_out(P, s, 1, k, b, u.duty, s->wc[i],
	    &u.cold_share);
	s->cviol[i] = size_unit(P, &u);
	if (s->cviol[i] == 0.0)
		s->ccost[i] = P->crf * u.cost + P->xarea[a * P->nc + b];
	s->act[i] = 1;
	s->ccap += s->ccost[i] - oc;
	s->cvsum += s->cviol[i] - ov;
	s->nact += (size_t)!was;
}

double
hl_opt_end_unit(const hl_opt_problem *P, size_t p, double t_in, double d,
		hl_network_unit *best, long *which, double *viol)
{
	return hl_opt_util_unit(P, p, t_in, P->base->party[p].target, d, best,
	    which, viol);
}

/* A unit on utility j for process party p from t_in to t_out, duty d:
 * 0 when the temperatures rule it out, else 1 with *u filled. */
static int
util_try(const hl_opt_problem *P, size_t p, size_t j, double t_in,
	 double t_out, double d, hl_network_unit *u)
{
	const hl_network *net = P->base;
	const hl_network_party *sp = &net->party[p];
	size_t up = P->c->nstream + j;
	const hl_network_party *ut = &net->party[up];
	int hot = sp->kind == HL_HOT;
	double req = hl_network_required(&net->set, hot ? sp : ut,
	    hot ? ut : sp), uout = ut->target;

	memset(u, 0, sizeof *u);
	u->duty = d;
	if (hot) {
		if (t_out - ut->supply < req)
			return 0;
		if (t_in - uout < req) {
			if (ut->supply == ut->target)
				return 0;
			uout = t_in - req;
			if (uout <= ut->supply + 1e-6)
				return 0;
		}
		u->hot = p;
		u->cold = up;
		u->hot_in = t_in;
		u->hot_out = t_out;
		u->cold_in = ut->supply;
		u->cold_out = uout;
	} else {
		if (ut->supply - t_out < req)
			return 0;
		if (uout - t_in < req) {
			if (ut->supply == ut->target)
				return 0;
			uout = t_in + req;
			if (uout >= ut->supply - 1e-6)
				return 0;
		}
		u->hot = up;
		u->cold = p;
		u->hot_in = ut->supply;
		u->hot_out = uout;
		u->cold_in = t_in;
		u->cold_out = t_out;
	}
	return 1;
}

double
hl_opt_util_unit(const hl_opt_problem *P, size_t p, double t_in,
		 double t_out, double d, hl_network_unit *best, long *which,
		 double *viol)
{
	const hl_network *net = P->base;
	double cost = HUGE_VAL, bv = HUGE_VAL;
	size_t j, n = P->nu;
	int pass;

	*which = -1;
	/* A utility the stream must use (a require rule) first; the others
	 * only when none of those can serve. */
	for (pass = P->urules ? 0 : 1; pass < 2; pass++) {
		for (j = 0; j < n; j++) {
			const hl_network_party *ut = &net->party[P->c->nstream + j];
			hl_network_unit u;
			double c, v;

			if (ut->kind == net->party[p].kind ||
			    !P->uallow[p * n + j] ||
			    (pass == 0 && !P->ureq[p * n + j]) ||
			    d > P->umax[p * n + j] * (1.0 + 1e-12) ||
			    !util_try(P, p, j, t_in, t_out, d, &u))
				continue;
			v = size_unit(P, &u);
			c = P->crf * u.cost + (isnan(ut->price) ? 0.0 :
			    ut->price) * d * net->set.hours / 1000.0;
			if (v < bv || (v == bv && c < cost)) {
				bv = v;
				cost = v == 0.0 ? c : 0.0;
				*which = (long)j;
				if (best != NULL)
					*best = u;
			}
		}
		if (bv == 0.0)
			break;
	}
	*viol = *which < 0 ? d / P->qscale + 1.0 : bv;
	return *which < 0 ? 0.0 : cost;
}

/* Utilities of the other kind that party p may use, cheapest first (ties
 * in case order); returns their count. */
static size_t
by_price(const hl_opt_problem *P, size_t p, size_t *ord)
{
	const hl_network *net = P->base;
	size_t j, k, n = 0;

	for (j = 0; j < P->nu; j++) {
		const hl_network_party *ut = &net->party[P->c->nstream + j];
		double pj = isnan(ut->price) ? 0.0 : ut->price;

		if (ut->kind == net->party[p].kind || !P->uallow[p * P->nu + j])
			continue;
		for (k = n; k > 0; k--) {
			const hl_network_party *w =
			    &net->party[P->c->nstream + ord[k - 1]];

			if ((isnan(w->price) ? 0.0 : w->price) <= pj)
				break;
			ord[k] = ord[k - 1];
		}
		ord[k] = j;
		n++;
	}
	return n;
}

/* A stream end served by several utility levels in series, cheapest first,
 * each taking the stream as far as its temperature allows at the required
 * approach (the cheaper level where it can, the dearer only where it
 * must). Fills out[0..*n) when out is non-NULL; returns the annual cost. */
static double
cascade(const hl_opt_problem *P, size_t p, double t_in, double d,
	hl_network_unit *out, size_t *n, double *viol)
{
	const hl_network *net = P->base;
	const hl_network_party *sp = &net->party[p];
	const hl_stream *st = &P->c->stream[p];
	int hot = sp->kind == HL_HOT;
	size_t ord[64], m, i, cnt = 0;
	double t = t_in, left = d, cost = 0.0, v = 0.0;

	m = P->nu <= 64 ? by_price(P, p, ord) : 0;
	for (i = 0; i < m && left > 1e-9 * fmax(1.0, d); i++) {
		size_t up = P->c->nstream + ord[i];
		const hl_network_party *ut = &net->party[up];
		double req = hl_network_required(&net->set, hot ? sp : ut,
		    hot ? ut : sp);
		double tend, uout = ut->target, q;
		hl_network_unit u;

		tend = hot ? fmax(sp->target, ut->supply + req) :
		    fmin(sp->target, ut->supply - req);
		if (hot ? tend >= t - 1e-9 : tend <= t + 1e-9)
			continue;
		if (hot ? t - uout < req : uout - t < req) {
			if (ut->supply == ut->target)
				continue;
			uout = hot ? t - req : t + req;
			if (hot ? uout <= ut->supply + 1e-6 :
			    uout >= ut->supply - 1e-6)
				continue;
		}
		q = hl_stream_heat_at(st, tend) - hl_stream_heat_at(st, t);
		if (q >= left - 1e-9 * fmax(1.0, d)) {
			q = left;
			tend = sp->target;
		}
		memset(&u, 0, sizeof u);
		u.duty = q;
		u.hot = hot ? p : up;
		u.cold = hot ? up : p;
		u.hot_in = hot ? t : ut->supply;
		u.hot_out = hot ? tend : uout;
		u.cold_in = hot ? ut->supply : t;
		u.cold_out = hot ? uout : tend;
		v += size_unit(P, &u);
		cost += P->crf * u.cost + (isnan(ut->price) ? 0.0 :
		    ut->price) * q * net->set.hours / 1000.0;
		if (out != NULL)
			out[cnt] = u;
		cnt++;
		t = tend;
		left -= q;
	}
	if (left > 1e-9 * fmax(1.0, d))
		v += left / P->qscale + 1.0;
	*n = cnt;
	*viol = v;
	return cost;
}

double
hl_opt_end(const hl_opt_problem *P, size_t p, double t_in, double d,
	   hl_network_unit *out, size_t *n, long *which, double *viol)
{
	hl_network_unit one;
	double c1, c2, v2;
	size_t n2 = 0;

	c1 = hl_opt_end_unit(P, p, t_in, d, out != NULL ? &one : NULL, which,
	    viol);
	*n = *which >= 0;
	/* Capacities and stream-utility rules count a unit per end (levels
	 * in series there would bypass them; inside the stream they may). */
	if (P->has_max_load || P->urules)
		goto single;
	c2 = cascade(P, p, t_in, d, NULL, &n2, &v2);
	if (n2 < 2 || v2 > *viol || (v2 == *viol && c2 >= c1))
		goto single;
	*which = -2;
	*viol = v2;
	if (out != NULL)
		cascade(P, p, t_in, d, out, n, &v2);
	else
		*n = n2;
	return c2;
single:
	if (out != NULL && *n > 0)
		out[0] = one;
	return c1;
}

/* The utility units inside hot stream a (side 0) or cold stream b: their
 * annual cost and limits missed, summed per stream. */
static void
mid_units(const hl_opt_problem *P, hl_opt_state *s, int side, size_t x)
{
	const double *mid = side == 0 ? &s->uh[x * P->S] : &s->uc[x * P->S];
	const double *tm = side == 0 ? &s->thm[x * P->S] : &s->tcm[x * P->S];
	long *mu = side == 0 ? &s->muh[x * P->S] : &s->muc[x * P->S];
	size_t p = side == 0 ? P->hot[x] : P->cold[x], k;
	double cost = 0.0, v = 0.0, vk;

	for (k = 0; k < P->S; k++) {
		mu[k] = -1;
		if (!(mid[k] > 0.0))
			continue;
		cost += hl_opt_util_unit(P, p, tm[k], side == 0 ?
		    s->th[x * (P->S + 1) + k + 1] : s->tc[x * (P->S + 1) + k],
		    mid[k], NULL, &mu[k], &vk);
		v += vk;
	}
	if (side == 0) {
		s->hmc[x] = cost;
		s->hmv[x] = v;
	} else {
		s->cmc[x] = cost;
		s->cmv[x] = v;
	}
}

/* The end utility of stream x of a side (hot: 0), at least cost, and the
 * utilities inside it. */
static void
end_pass(const hl_opt_problem *P, hl_opt_state *s, int side, size_t x)
{
	double *cost = side == 0 ? &s->hecost[x] : &s->cecost[x];
	double *viol = side == 0 ? &s->heviol[x] : &s->ceviol[x];
	double d = side == 0 ? s->hend[x] : s->cend[x];
	long *util = side == 0 ? &s->hutil[x] : &s->cutil[x];
	size_t n;

	*cost = *viol = 0.0;
	*util = -1;
	if (d > 0.0)
		*cost = hl_opt_end(P, side == 0 ? P->hot[x] : P->cold[x],
		    side == 0 ? s->th[x * (P->S + 1) + P->S] :
		    s->tc[x * (P->S + 1)], d, NULL, &n, util, viol);
	mid_units(P, s, side, x);
}

/* What process stream x (hot: side 0) takes from each utility, kW, into
 * load[0..nu): its end and the utilities inside it. With stream-utility
 * rules an end has one unit (hl_opt_end), so its utility says it all. */
static void
util_loads(const hl_opt_problem *P, const hl_opt_state *s, int side,
	   size_t x, double *load)
{
	long w = side == 0 ? s->hutil[x] : s->cutil[x];
	const double *mid = side == 0 ? &s->uh[x * P->S] : &s->uc[x * P->S];
	const long *mu = side == 0 ? &s->muh[x * P->S] : &s->muc[x * P->S];
	size_t k;

	if (w >= 0)
		load[w] += side == 0 ? s->hend[x] : s->cend[x];
	for (k = 0; k < P->S; k++)
		if (mu[k] >= 0)
			load[mu[k]] += mid[k];
}

/* The least a required pair must carry to count as exchanging heat: the
 * smallest duty when one is set, else a thousandth of the stream's duty
 * (a unit of next to nothing would keep the rule's letter only). */
static double
required_least(const hl_opt_problem *P, size_t p)
{
	double d = hl_stream_duty(&P->c->stream[p]);

	return fmax(fmin(P->o->min_duty, d), 1e-3 * d);
}

/* The rules on stream-utility pairs: a utility the stream must use, the
 * most it may take from one. */
static double
util_rules(const hl_opt_problem *P, const hl_opt_state *s)
{
	double load[64], v = 0.0;
	size_t x, j, n = P->nu;
	int side;

	if (!P->urules || n > 64)
		return 0.0;
	for (side = 0; side < 2; side++)
		for (x = 0; x < (side == 0 ? P->nh : P->nc); x++) {
			size_t p = side == 0 ? P->hot[x] : P->cold[x];

			memset(load, 0, sizeof load);
			util_loads(P, s, side, x, load);
			for (j = 0; j < n; j++) {
				if (P->ureq[p * n + j] &&
				    load[j] < required_least(P, p))
					v += 1.0 - load[j] / required_least(P, p);
				if (load[j] > P->umax[p * n + j] * (1 + 1e-12))
					v += (load[j] - P->umax[p * n + j]) /
					    P->qscale + 1e-3;
			}
		}
	return v;
}

/* Limits that involve several streams: match rules, utility capacities,
 * cells that must keep a unit. */
static double
global_viol(const hl_opt_problem *P, const hl_opt_state *s)
{
	double v = 0.0;
	size_t a, b, k, j;

	if (P->rules)
		for (a = 0; a < P->nh; a++)
			for (b = 0; b < P->nc; b++) {
				size_t pr = a * P->nc + b;
				double sum = 0.0, least;

				if (!P->require[pr] && isinf(P->maxduty[pr]))
					continue;
				for (k = 0; k < P->S; k++)
					sum += s->q[HL_OPT_CELL(P, k, a, b)];
				least = fmin(required_least(P, P->hot[a]),
				    required_least(P, P->cold[b]));
				if (P->require[pr] && sum < least)
					v += 1.0 - sum / least;
				if (sum > P->maxduty[pr] * (1 + 1e-12))
					v += (sum - P->maxduty[pr]) /
					    P->qscale + 1e-3;
			}
	for (j = 0; j < P->nu; j++) {
		double m = P->base->party[P->c->nstream + j].max_load, load = 0;

		if (isnan(m))
			continue;
		for (a = 0; a < P->nh; a++)
			if (s->hutil[a] == (long)j)
				load += s->hend[a];
		for (b = 0; b < P->nc; b++)
			if (s->cutil[b] == (long)j)
				load += s->cend[b];
		for (k = 0; k < P->nh * P->S; k++)
			if (s->muh[k] == (long)j)
				load += s->uh[k];
		for (k = 0; k < P->nc * P->S; k++)
			if (s->muc[k] == (long)j)
				load += s->uc[k];
		if (load > m * (1 + 1e-12))
			v += (load - m) / P->qscale + 1e-3;
	}
	return v;
}

void
hl_opt_sum(const hl_opt_problem *P, hl_opt_state *s)
{
	size_t i;
	double v = s->cvsum, tac = s->ccap;

	for (i = 0; i < P->nh; i++) {
		tac += s->hecost[i] + s->hmc[i];
		v += s->hviol[i] + s->heviol[i] + s->hmv[i];
	}
	for (i = 0; i < P->nc; i++) {
		tac += s->cecost[i] + s->cmc[i];
		v += s->cvs[i] + s->ceviol[i] + s->cmv[i];
	}
	s->v = v + global_viol(P, s) + util_rules(P, s);
	s->tac = tac;
}

/* A cell whose evaluation may change: it has or had a unit, or must. */
static int
busy(const hl_opt_state *s, size_t i)
{
	return s->q[i] > HL_OPT_QEPS || s->act[i] || s->keep[i];
}

void
hl_opt_eval_set(const hl_opt_problem *P, hl_opt_state *s, const size_t *A,
		size_t na, const size_t *B, size_t nb)
{
	size_t k, x, i;

	for (i = 0; i < na; i++)
		stream_pass(P, s, 0, A[i]);
	for (i = 0; i < nb; i++)
		stream_pass(P, s, 1, B[i]);
	for (k = 0; k < P->S; k++) {
		for (i = 0; i < na; i++)
			for (x = 0; x < P->nc; x++)
				if (busy(s, HL_OPT_CELL(P, k, A[i], x)))
					cell(P, s, k, A[i], x);
		for (i = 0; i < nb; i++)
			for (x = 0; x < P->nh; x++)
				if (busy(s, HL_OPT_CELL(P, k, x, B[i])))
					cell(P, s, k, x, B[i]);
	}
	for (i = 0; i < na; i++)
		end_pass(P, s, 0, A[i]);
	for (i = 0; i < nb; i++)
		end_pass(P, s, 1, B[i]);
	hl_opt_sum(P, s);
}

void
hl_opt_eval_all(const hl_opt_problem *P, hl_opt_state *s)
{
	size_t a, b, k;

	for (a = 0; a < P->nh; a++)
		stream_pass(P, s, 0, a);
	for (b = 0; b < P->nc; b++)
		stream_pass(P, s, 1, b);
	for (k = 0; k < P->S; k++)
		for (a = 0; a < P->nh; a++)
			for (b = 0; b < P->nc; b++)
				cell(P, s, k, a, b);
	s->ccap = s->cvsum = 0.0;
	s->nact = 0;
	for (k = 0; k < P->S * P->nh * P->nc; k++) {
		s->ccap += s->ccost[k];
		s->cvsum += s->cviol[k];
		s->nact += s->act[k];
	}
	for (a = 0; a < P->nh; a++)
		end_pass(P, s, 0, a);
	for (b = 0; b < P->nc; b++)
		end_pass(P, s, 1, b);
	hl_opt_sum(P, s);
}

int
hl_opt_better(const hl_opt_state *x, const hl_opt_state *y)
{
	double vt = 1e-9;

	if (x->v > vt || y->v > vt) {
		if (x->v < y->v - vt)
			return 1;
		if (x->v > y->v + vt)
			return 0;
	}
	return x->tac < y->tac - 1e-9 * fmax(1.0, fabs(y->tac));
}
