/* network_place.c - one placement of a set of matches.
 *
 * Steps (doc/methods.md, "Network placement"):
 *  1. every match becomes a unit; on each process stream the units stand
 *     in series in the order of where in temperature they exchange (from
 *     the per-interval loads, else the windows, else the partner's range);
 *  2. if an approach is broken: insertion moves on the series orders, then
 *     splits of runs of stages with searched shares, until none helps;
 *  3. if still broken: relaxation (network_relax.c) moves heat to
 *     utilities and reports the energy penalty; units of next to no heat
 *     are taken out (network_idle.c);
 *  4. improvement: splits that series can do without are undone, then the
 *     series orders and split shares are searched for the least cost (or
 *     area);
 *  5. every unit is sized, named and the totals are summed.
 * network_refine.c decides between relaxation and more units.
 */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "network_int.h"

/* Real temperature of a shifted one on party q's side. */
static double
unshift(const hl_settings *set, const hl_network_party *q, double t)
{
	double sh = hl_network_shift(set, q);

	return q->kind == HL_HOT ? t + sh : t - sh;
}

/* Heat-weighted mean temperature where a match works on one side, from
 * its per-interval loads: each interval's heat at the middle of the part of
 * the interval inside the party's own range. NaN without loads. */
static double
key_from_loads(const hl_network_input *in, const hl_network_party *q,
	       const double *load)
{
	double lo_q, hi_q, sum = 0.0, w = 0.0, sh;
	size_t k;

	if (load == NULL || in->t == NULL || in->nint == 0)
		return NAN;
	if (q->supply == q->target)
		return q->supply;
	sh = hl_network_shift(in->set, q);
	lo_q = fmin(q->supply, q->target) + (q->kind == HL_HOT ? -sh : sh);
	hi_q = fmax(q->supply, q->target) + (q->kind == HL_HOT ? -sh : sh);
	for (k = 0; k < in->nint; k++) {
		double hi = fmin(in->t[k], hi_q), lo = fmax(in->t[k + 1], lo_q);

		if (!(load[k] > 0.0))
			continue;
		if (hi < lo)
			hi = lo = 0.5 * (in->t[k] + in->t[k + 1]);
		sum += load[k] * 0.5 * (hi + lo);
		w += load[k];
	}
	return w > 0.0 ? unshift(in->set, q, sum / w) : NAN;
}

static double
mid(double a, double b)
{
	return 0.5 * (a + b);
}

/* Where match m works on its hot (side 0) and cold (side 1) party. */
static void
match_keys(const hl_network_input *in, const hl_network_match *m,
	   double *kh, double *kc)
{
	const hl_network_party *h = &in->party[m->hot];
	const hl_network_party *c = &in->party[m->cold];
	double r = hl_network_required(in->set, h, c);

	*kh = key_from_loads(in, h, m->give);
	*kc = key_from_loads(in, c, m->take);
	if (isnan(*kh) && !isnan(m->hot_hi) && !isnan(m->hot_lo))
		*kh = mid(m->hot_hi, m->hot_lo);
	if (isnan(*kc) && !isnan(m->cold_hi) && !isnan(m->cold_lo))
		*kc = mid(m->cold_hi, m->cold_lo);
	/* Unknown: where the two ranges overlap, r apart. */
	if (isnan(*kh) || isnan(*kc)) {
		double hhi = fmax(h->supply, h->target);
		double hlo = fmin(h->supply, h->target);
		double chi = fmax(c->supply, c->target) + r;
		double clo = fmin(c->supply, c->target) + r;
		double hi = fmin(hhi, chi), lo = fmax(hlo, clo);
		double t = hi >= lo ? mid(hi, lo) : mid(hhi, hlo);

		if (isnan(*kh))
			*kh = isnan(*kc) ? t : fmin(fmax(*kc + r, hlo), hhi);
		if (isnan(*kc))
			*kc = fmin(fmax(*kh - r, clo - r), chi - r);
	}
}

hl_status
hl_net_check_input(const hl_network_input *in, hl_error *err)
{
	const hl_settings *set = in->set;
	double *sum, qh = 0.0, qc = 0.0;
	size_t i;

	if (!(set->dtmin > 0.0) || (!isnan(set->emat) && !(set->emat > 0.0)))
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "a network needs ΔTmin and EMAT above 0 K (ΔTmin %g K, "
		    "EMAT %g K%s): a zero approach needs infinite area",
		    set->dtmin, isnan(set->emat) ? set->dtmin : set->emat,
		    isnan(set->emat) ? ", as ΔTmin" : "");
	for (i = 0; i < in->nmatch; i++) {
		const hl_network_match *m = &in->match[i];

		if (m->hot >= in->nparty || m->cold >= in->nparty ||
		    in->party[m->hot].kind != HL_HOT ||
		    in->party[m->cold].kind != HL_COLD ||
		    (in->party[m->hot].utility &&
		    in->party[m->cold].utility) ||
		    !(m->duty > 0.0 && isfinite(m->duty)))
			return hl_error_set(err, HL_EINPUT, NULL, 0,
			    "match %zu must join a hot and a cold party, not "
			    "two utilities, with a duty above 0 kW", i + 1);
	}
	sum = calloc(in->nparty + 1, sizeof *sum);
	if (sum == NULL)
		return hl_error_nomem(err);
	for (i = 0; i < in->nmatch; i++) {
		sum[in->match[i].hot] += in->match[i].duty;
		sum[in->match[i].cold] += in->match[i].duty;
	}
	for (i = 0; i < in->nparty; i++) {
		const hl_network_party *q = &in->party[i];

		if (q->utility)
			(q->kind == HL_HOT ? &qh : &qc)[0] += sum[i];
		if (!q->utility && fabs(sum[i] - q->load) >
		    1e-6 * fmax(1.0, q->load)) {
			hl_error_set(err, HL_EINPUT, NULL, 0,
			    "the matches give stream '%s' %.6g kW, but it "
			    "exchanges %.6g kW: every stream's heat must be "
			    "matched", q->name, sum[i], q->load);
			free(sum);
			return HL_EINPUT;
		}
	}
	free(sum);
	if (!isnan(in->qh_target) && (qh < in->qh_target - 1e-6 *
	    fmax(1.0, in->qh_target) || qc < in->qc_target - 1e-6 *
	    fmax(1.0, in->qc_target)))
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "the matches use %.6g kW of hot and %.6g kW of cold "
		    "utility, below the targets %.6g / %.6g kW: no network "
		    "can exchange that much heat at this ΔTmin", qh, qc,
		    in->qh_target, in->qc_target);
	return HL_OK;
}

/* Sort each process lane by where its units work: a hot stream from its
 * hottest unit down, a cold stream from its coldest up; ties by the
 * partner's side the same way. */
static void
sort_lanes(hl_net_place *P)
{
	size_t p, i, j;

	for (p = 0; p < P->net->nparty; p++) {
		hl_net_lane *L = &P->lane[p];
		int hot = P->net->party[p].kind == HL_HOT;
		const double *own = hot ? P->key_hot : P->key_cold;
		const double *other = hot ? P->key_cold : P->key_hot;

		for (i = 1; i < L->n; i++)
			for (j = i; j > 0; j--) {
				size_t a = L->b[j - 1].u[0], b = L->b[j].u[0];
				double da = own[a], db = own[b];
				int swap;

				if (da == db)
					swap = hot ? other[b] > other[a] :
					    other[b] < other[a];
				else
					swap = hot ? db > da : db < da;
				if (!swap)
					break;
				hl_net_lane_move(L, j, j - 1);
			}
	}
}

static hl_status
build(const hl_network_input *in, hl_network *net, hl_net_place **out,
      hl_error *err)
{
	hl_net_place *P;
	size_t i;

	for (i = 0; i < in->nparty; i++) {
		hl_network_party q = in->party[i];

		if (q.utility)
			q.load = 0.0;
		if (hl_network_add_party(net, &q, err) != HL_OK)
			return HL_EIO;
	}
	P = hl_net_place_create(net);
	if (P == NULL)
		return hl_error_nomem(err);
	for (i = 0; i < in->nmatch; i++) {
		const hl_network_match *m = &in->match[i];
		hl_network_unit u = { 0 };
		double kh, kc;

		u.hot = m->hot;
		u.cold = m->cold;
		u.match = (long)i;
		u.duty = m->duty;
		u.hot_share = u.cold_share = 1.0;
		u.type = net->set.exchanger;
		match_keys(in, m, &kh, &kc);
		if (hl_net_place_add_unit(P, &u, kh, kc) != HL_OK) {
			hl_net_place_free(P);
			return hl_error_nomem(err);
		}
		P->group[net->nunit - 1] = in->group != NULL ? in->group[i] :
		    -1;
	}
	sort_lanes(P);
	*out = P;
	return HL_OK;
}

/* The match of the unit that misses the most approach (-1 if none), and
 * the fraction of its duty its place allows. */
static long
worst_match(const hl_net_place *P, double *keep)
{
	double worst = HL_NET_VTOL;
	long pick = -1;
	size_t k, at = 0;

	for (k = 0; k < P->net->nunit; k++) {
		double v = hl_net_unit_violation(P, k);

		if (v > worst && P->net->unit[k].match >= 0) {
			worst = v;
			pick = P->net->unit[k].match;
			at = k;
		}
	}
	*keep = pick < 0 ? NAN : hl_net_max_duty(P, at) /
	    P->net->unit[at].duty;
	return pick;
}

/* Steps 2-4; *worst is the match that broke the approach most before any
 * relaxation (-1 when none did). */
static hl_status
search(hl_net_place *P, long *worst, double *keep, hl_error *err)
{
	hl_net_score cur = hl_net_score_now(P);
	hl_status st = HL_OK;
	size_t round, p, b;

	*worst = -1;
	if (cur.v > HL_NET_VTOL)
		cur = hl_net_search_order(P, cur, &st);
	if (cur.v > HL_NET_VTOL && st == HL_OK)
		cur = hl_net_search_pairs(P, cur, &st);
	for (round = 0; round < 8 && cur.v > HL_NET_VTOL && st == HL_OK;
	     round++) {
		hl_net_score before = cur;

		cur = hl_net_search_splits(P, cur, &st);
		if (st == HL_OK)
			cur = hl_net_search_order(P, cur, &st);
		if (st == HL_OK && cur.v > HL_NET_VTOL)
			cur = hl_net_search_pairs(P, cur, &st);
		if (!hl_net_better(cur, before))
			break;
	}
	if (st != HL_OK)
		return hl_error_nomem(err);
	if (cur.v > HL_NET_VTOL) {
		hl_net_eval(P);
		*worst = worst_match(P, keep);
		st = hl_net_relax(P, err);
		if (st != HL_OK)
			return st;
	}
	/* Slivers of heat, from the matches or from relaxing, are no units. */
	st = hl_net_drop_idle(P, err);
	if (st != HL_OK)
		return st;
	cur = hl_net_score_now(P);
	cur = hl_net_search_unsplit(P, cur, &st);
	if (st == HL_OK)
		cur = hl_net_search_order(P, cur, &st);
	for (p = 0; p < P->net->nparty && st == HL_OK; p++)
		for (b = 0; b < P->lane[p].n && st == HL_OK; b++)
			if (P->lane[p].b[b].n > 1)
				cur = hl_net_search_shares(P, p, b, cur, &st);
	if (st != HL_OK)
		return hl_error_nomem(err);
	cur = hl_net_score_now(P);
	return cur.v <= HL_NET_VTOL ? HL_OK : hl_error_set(err,
	    HL_ENOSOLUTION, NULL, 0, "no placement of the matches keeps "
	    "every approach (%.3g K missing)", cur.v);
}

/* Order of the final list: exchangers between process streams from the
 * hottest down, then heaters, then coolers. */
static int
category(const hl_network *net, const hl_network_unit *u)
{
	if (net->party[u->hot].utility)
		return 1;
	return net->party[u->cold].utility ? 2 : 0;
}

static int
before(const hl_network *net, const hl_network_unit *x,
       const hl_network_unit *y)
{
	int cx = category(net, x), cy = category(net, y);
	double tx = cx == 1 ? x->cold_out : x->hot_in;
	double ty = cy == 1 ? y->cold_out : y->hot_in;

	if (cx != cy)
		return cx < cy;
	if (tx != ty)
		return tx > ty;
	return x->match < y->match;
}

static void
sort_units(hl_network *net)
{
	size_t i, j;

	for (i = 1; i < net->nunit; i++)
		for (j = i; j > 0 && before(net, &net->unit[j],
		    &net->unit[j - 1]); j--) {
			hl_network_unit t = net->unit[j];

			net->unit[j] = net->unit[j - 1];
			net->unit[j - 1] = t;
		}
}

/* Step 5: keep the units that carry heat, size them, name them. */
static hl_status
finish(hl_network *net, const hl_network_input *in, hl_error *err)
{
	size_t i, n = 0, ne = 0;
	hl_status st;

	for (i = 0; i < net->nunit; i++)
		if (net->unit[i].duty > 0.0)
			net->unit[n++] = net->unit[i];
		else
			free(net->unit[i].note);
	net->nunit = n;
	sort_units(net);
	for (i = 0; i < n; i++) {
		hl_network_unit *u = &net->unit[i];

		snprintf(u->id, sizeof u->id, "E%u", (unsigned)(++ne % 100000000u));
		u->type = hl_network_unit_type(net, u->hot, u->cold);
		st = hl_network_size_unit(net, u, err);
		if (st == HL_ENOSOLUTION) {
			char why[160];

			snprintf(why, sizeof why, "would need more %s in "
			    "series than a %s sensibly has: sized as pure "
			    "counterflow (double pipe or plate)",
			    u->type == HL_EXCH_AIR_COOLER ? "sections" :
			    "shells", hl_exchanger_type_name(u->type));
			u->type = HL_EXCH_COUNTERFLOW;
			st = hl_network_size_unit(net, u, err);
			free(u->note);
			u->note = strdup(why);
			if (u->note == NULL)
				return hl_error_nomem(err);
		}
		if (st != HL_OK) {
			char why[HL_ERROR_TEXT];

			snprintf(why, sizeof why, "%s", err != NULL ?
			    err->text : "");
			return hl_error_set(err, HL_ENOSOLUTION, NULL, 0,
			    "unit %s cannot be sized: %s", u->id, why);
		}
	}
	net->nmatch = in->nmatch;
	net->qh_target = in->qh_target;
	net->qc_target = in->qc_target;
	net->restriction = in->restriction;
	net->range_rise = in->range_rise;
	hl_network_totals(net);
	return HL_OK;
}

hl_status
hl_net_attempt(const hl_network_input *in, hl_network **out, long *worst,
	       double *keep, hl_error *err)
{
	hl_network *net;
	hl_net_place *P = NULL;
	hl_status st;

	*worst = -1;
	*keep = NAN;
	net = hl_network_create();
	if (net == NULL)
		return hl_error_nomem(err);
	net->set = *in->set;
	net->set.currency = strdup(in->set->currency != NULL ?
	    in->set->currency : "EUR");
	if (in->ntyped > 0 && (net->typed = malloc(in->ntyped *
	    sizeof *net->typed)) != NULL) {
		memcpy(net->typed, in->typed, in->ntyped * sizeof *net->typed);
		net->ntyped = in->ntyped;
	}
	if (net->set.currency == NULL || (in->ntyped > 0 &&
	    net->typed == NULL)) {
		hl_network_free(net);
		return hl_error_nomem(err);
	}
	st = build(in, net, &P, err);
	if (st == HL_OK)
		st = search(P, worst, keep, err);
	hl_net_place_free(P);
	if (st == HL_OK)
		st = finish(net, in, err);
	if (st != HL_OK) {
		hl_network_free(net);
		return st;
	}
	*out = net;
	return HL_OK;
}
