/* match_prep.c - parties, shifted intervals, heat profiles and pinches of
 * the matches problem (Papoulias & Grossmann 1983, the transshipment
 * model's temperature intervals). */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "cascade.h"
#include "match_int.h"
#include "sorted.h"

/* Above this many party-interval cells the MILP is out of reach anyway. */
#define MAX_CELLS 20000000u

static const char implicit_hot[] = "hot utility";
static const char implicit_cold[] = "cold utility";

static int
uses_case_utilities(const hl_case *c, const double *util_load)
{
	return util_load != NULL && c->nutil > 0;
}

/* A name for an implicit utility that no stream already has. */
static char *
implicit_name(const hl_case *c, const char *base)
{
	size_t n = strlen(base) + 16;
	char *s = malloc(n);
	int i;

	if (s == NULL)
		return NULL;
	snprintf(s, n, "%s", base);
	for (i = 2; hl_case_find_stream(c, s) >= 0; i++)
		snprintf(s, n, "%s %d", base, i);
	return s;
}

static hl_status
add_stream_party(hl_match_problem *p, size_t i)
{
	const hl_stream *s = &p->c->stream[i];
	hl_match_party *q = &p->party[p->np];
	double sh = hl_stream_shift(s, p->dtmin);
	double hi = fmax(hl_stream_supply(s), hl_stream_target(s));
	double lo = fmin(hl_stream_supply(s), hl_stream_target(s));

	q->name = strdup(s->name);
	if (q->name == NULL)
		return HL_EIO;
	q->kind = s->kind;
	q->type = HL_PARTY_STREAM;
	q->index = (long)i;
	q->load = q->given_load = hl_stream_duty(s);
	q->shift = sh;
	q->top = s->kind == HL_HOT ? hi - sh : hi + sh;
	q->bottom = s->kind == HL_HOT ? lo - sh : lo + sh;
	q->supply = hl_stream_supply(s);
	q->target = hl_stream_target(s);
	p->area[p->np] = s->area;
	p->np++;
	return HL_OK;
}

static hl_status
add_utility_party(hl_match_problem *p, size_t u, double load)
{
	const hl_utility *ut = &p->c->util[u];
	hl_match_party *q = &p->party[p->np];
	double sh = hl_utility_shift(ut, p->dtmin);
	double hi = fmax(ut->supply, ut->target);
	double lo = fmin(ut->supply, ut->target);

	q->name = strdup(ut->name);
	if (q->name == NULL)
		return HL_EIO;
	q->kind = ut->kind;
	q->type = HL_PARTY_UTILITY;
	q->index = (long)u;
	q->load = q->given_load = load;
	q->shift = sh;
	q->top = ut->kind == HL_HOT ? hi - sh : hi + sh;
	q->bottom = ut->kind == HL_HOT ? lo - sh : lo + sh;
	q->supply = ut->supply;
	q->target = ut->target;
	p->area[p->np] = NULL;
	p->np++;
	return HL_OK;
}

static hl_status
add_implicit_party(hl_match_problem *p, hl_kind kind, double shifted,
		   double load)
{
	hl_match_party *q = &p->party[p->np];

	q->name = implicit_name(p->c, kind == HL_HOT ? implicit_hot :
				implicit_cold);
	if (q->name == NULL)
		return HL_EIO;
	q->kind = kind;
	q->type = HL_PARTY_IMPLICIT;
	q->index = -1;
	q->load = q->given_load = load;
	q->shift = p->dtmin / 2.0;
	q->top = q->bottom = shifted;
	q->supply = q->target = kind == HL_HOT ? shifted + q->shift :
		shifted - q->shift;
	p->area[p->np] = NULL;
	p->np++;
	return HL_OK;
}

/* Shifted boundaries: every stream segment end, and every utility end when
 * the case's utilities take part; falling, without duplicates. */
static hl_status
build_boundaries(hl_match_problem *p, int with_util)
{
	const hl_case *c = p->c;
	size_t i, j, n = 0, cap = 2 * c->nutil + 2, u;
	double *t;

	for (i = 0; i < c->nstream; i++)
		cap += 2 * c->stream[i].nseg;
	t = malloc(cap * sizeof *t);
	if (t == NULL)
		return HL_EIO;
	for (i = 0; i < c->nstream; i++) {
		const hl_stream *s = &c->stream[i];
		double sh = hl_stream_shift(s, p->dtmin);

		sh = s->kind == HL_HOT ? -sh : sh;
		for (j = 0; j < s->nseg; j++) {
			t[n++] = s->seg[j].supply + sh;
			t[n++] = s->seg[j].target + sh;
		}
	}
	for (i = 0; with_util && i < c->nutil; i++) {
		double sh = hl_utility_shift(&c->util[i], p->dtmin);

		sh = c->util[i].kind == HL_HOT ? -sh : sh;
		t[n++] = c->util[i].supply + sh;
		t[n++] = c->util[i].target + sh;
	}
	qsort(t, n, sizeof *t, hl_sorted_cmp_desc);
	for (i = 1, u = 1; i < n; i++)
		if (t[u - 1] - t[i] > 1e-9 * (1.0 + fabs(t[i])))
			t[u++] = t[i];
	if (u < 2)
		u = 2, t[1] = t[0] - 1.0; /* cannot happen: streams change T */
	p->t = t;
	p->nint = u - 1;
	return HL_OK;
}

/* Interval index whose upper boundary is v (closest), for isothermal ends. */
static size_t
boundary_index(const hl_match_problem *p, double v)
{
	size_t k, best = 0;

	for (k = 1; k <= p->nint; k++)
		if (fabs(p->t[k] - v) < fabs(p->t[best] - v))
			best = k;
	return best;
}

/* Add cp * overlap of [lo, hi] with each interval to row (kW per K of cp). */
static void
spread(const hl_match_problem *p, double hi, double lo, double cp,
       double *row)
{
	size_t k;

	for (k = 0; k < p->nint; k++) {
		double o = fmin(hi, p->t[k]) - fmax(lo, p->t[k + 1]);

		if (o > 0.0)
			row[k] += cp * o;
	}
}

static void
stream_profile(const hl_match_problem *p, size_t i, double *row, double *film)
{
	const hl_stream *s = &p->c->stream[p->party[i].index];
	double sh = hl_stream_shift(s, p->dtmin), hdef = p->c->set.h_default;
	size_t j, k;

	sh = s->kind == HL_HOT ? -sh : sh;
	for (j = 0; j < s->nseg; j++) {
		const hl_segment *g = &s->seg[j];
		double hi = fmax(g->supply, g->target) + sh;
		double lo = fmin(g->supply, g->target) + sh;

		spread(p, hi, lo, g->cp, row);
		for (k = 0; k < p->nint; k++)
			if (p->t[k] <= hi + 1e-9 && p->t[k + 1] >= lo - 1e-9)
				film[k] = isnan(g->h) ? hdef : g->h;
	}
	for (k = 0; k < p->nint; k++)
		if (film[k] == 0.0)
			film[k] = hdef;
}

/* A utility's share of its load in each interval; an isothermal one sits
 * just below (hot) or just above (cold) its shifted temperature. */
static void
utility_profile(const hl_match_problem *p, size_t i, double h, double *row,
		double *film)
{
	const hl_match_party *q = &p->party[i];
	size_t k;

	for (k = 0; k < p->nint; k++)
		film[k] = isnan(h) ? p->c->set.h_default : h;
	if (q->top - q->bottom > 1e-9 * (1.0 + fabs(q->top))) {
		spread(p, q->top, q->bottom, 1.0 / (q->top - q->bottom), row);
		return;
	}
	k = boundary_index(p, q->top);
	if (q->kind == HL_HOT && k < p->nint)
		row[k] = 1.0;
	else if (q->kind == HL_COLD && k > 0)
		row[k - 1] = 1.0;
}

static hl_status
build_profiles(hl_match_problem *p)
{
	size_t i, cells = p->np * p->nint;

	if (p->nint > 0 && cells / p->nint != p->np)
		return HL_EIO;
	p->unit = calloc(cells, sizeof(double));
	p->heat = calloc(cells, sizeof(double));
	p->film = calloc(cells, sizeof(double));
	if (p->unit == NULL || p->heat == NULL || p->film == NULL)
		return HL_EIO;
	for (i = 0; i < p->np; i++) {
		double *row = p->unit + i * p->nint, *film = p->film + i * p->nint;
		const hl_match_party *q = &p->party[i];

		if (q->type == HL_PARTY_STREAM)
			stream_profile(p, i, row, film);
		else
			utility_profile(p, i, q->type == HL_PARTY_UTILITY ?
					p->c->util[q->index].h : NAN, row,
					film);
	}
	return HL_OK;
}

static hl_status
build_parties(hl_match_problem *p, const double *util_load, hl_error *err)
{
	const hl_case *c = p->c;
	int with_util = uses_case_utilities(c, util_load);
	size_t i, n = c->nstream + (with_util ? c->nutil : 2);
	double qh = 0.0, qc = 0.0;
	hl_status st;

	p->party = calloc(n, sizeof *p->party);
	p->area = calloc(n, sizeof *p->area);
	if (p->party == NULL || p->area == NULL)
		return hl_error_nomem(err);
	for (i = 0; i < c->nstream; i++)
		if (add_stream_party(p, i) != HL_OK)
			return hl_error_nomem(err);
	if (build_boundaries(p, with_util) != HL_OK)
		return hl_error_nomem(err);
	if (with_util) {
		for (i = 0; i < c->nutil; i++) {
			if (!isfinite(util_load[i]) || util_load[i] < 0.0)
				return hl_error_set(err, HL_EINPUT,
					c->util[i].file, c->util[i].line,
					"utility '%s': load must be a number "
					">= 0 kW", c->util[i].name);
			if (add_utility_party(p, i, util_load[i]) != HL_OK)
				return hl_error_nomem(err);
		}
	} else {
		st = hl_cascade_targets(c, p->dtmin, &qh, &qc, err);
		if (st != HL_OK)
			return st;
		if (add_implicit_party(p, HL_HOT, p->t[0], qh) != HL_OK ||
		    add_implicit_party(p, HL_COLD, p->t[p->nint], qc) != HL_OK)
			return hl_error_nomem(err);
		p->implicit = 1;
	}
	if (p->np * (p->nint + 1) > MAX_CELLS)
		return hl_error_set(err, HL_EINPUT, c->source, 0,
			"%zu streams are too many for the matches MILP; study "
			"one plant area at a time", c->nstream);
	return build_profiles(p) == HL_OK ? HL_OK : hl_error_nomem(err);
}

static hl_status
index_sides(hl_match_problem *p, hl_error *err)
{
	size_t i;

	p->hot = malloc(p->np * sizeof *p->hot);
	p->cold = malloc(p->np * sizeof *p->cold);
	p->sidx = malloc(p->np * sizeof *p->sidx);
	if (p->hot == NULL || p->cold == NULL || p->sidx == NULL)
		return hl_error_nomem(err);
	for (i = 0; i < p->np; i++) {
		if (p->party[i].kind == HL_HOT) {
			p->sidx[i] = p->nhot;
			p->hot[p->nhot++] = i;
		} else {
			p->sidx[i] = p->ncold;
			p->cold[p->ncold++] = i;
		}
	}
	p->pair = calloc(p->nhot * p->ncold + 1, sizeof *p->pair);
	return p->pair == NULL ? hl_error_nomem(err) : HL_OK;
}

/* Rule names must be "*" or a stream or utility of the right side. */
static hl_status
check_rule_name(const hl_case *c, const hl_match_rule *r, const char *name,
		hl_kind side, hl_error *err)
{
	long i;
	hl_kind k;

	if (strcmp(name, "*") == 0)
		return HL_OK;
	if ((i = hl_case_find_stream(c, name)) >= 0)
		k = c->stream[i].kind;
	else if ((i = hl_case_find_utility(c, name)) >= 0)
		k = c->util[i].kind;
	else
		return hl_error_set(err, HL_EINPUT, r->file, r->line,
			"match rule names '%s', which is no stream or utility "
			"of the case; check the spelling (names are "
			"case-sensitive)", name);
	if (k != side)
		return hl_error_set(err, HL_EINPUT, r->file, r->line,
			"match rule: '%s' is %s, but it is given as the %s "
			"side; give the hot side first", name,
			k == HL_HOT ? "hot" : "cold",
			side == HL_HOT ? "hot" : "cold");
	return HL_OK;
}

static hl_status
check_rules(const hl_case *c, hl_error *err)
{
	size_t i;
	hl_status st;

	for (i = 0; i < c->nrule; i++) {
		const hl_match_rule *r = &c->rule[i];

		if (r->hot == NULL || r->cold == NULL)
			return hl_error_set(err, HL_EINPUT, r->file, r->line,
				"match rule needs a hot and a cold name");
		st = check_rule_name(c, r, r->hot, HL_HOT, err);
		if (st == HL_OK)
			st = check_rule_name(c, r, r->cold, HL_COLD, err);
		if (st != HL_OK)
			return st;
		if (r->kind == HL_RULE_MAX_DUTY &&
		    !(isfinite(r->max_duty) && r->max_duty >= 0.0))
			return hl_error_set(err, HL_EINPUT, r->file, r->line,
				"maximum duty of a match must be a number >= 0 "
				"kW");
	}
	if (c->set.area_policy == HL_AREAS_PENALISE &&
	    !(isfinite(c->set.area_penalty) && c->set.area_penalty >= 0.0))
		return hl_error_set(err, HL_EINPUT, c->source, 0,
			"area penalty must be a number of units >= 0");
	return HL_OK;
}

/* Heat in use and the cascade of residuals; the loads must be feasible. */
static hl_status
apply_loads(hl_match_problem *p, hl_error *err)
{
	size_t i, k;
	double hot = 0.0, cold = 0.0, r;

	for (i = 0; i < p->np; i++) {
		const hl_match_party *q = &p->party[i];
		double f = q->type == HL_PARTY_STREAM ? 1.0 : q->load, sum = 0.0;

		for (k = 0; k < p->nint; k++) {
			HL_MATCH_HEAT(p, i, k) = f * p->unit[i * p->nint + k];
			sum += HL_MATCH_HEAT(p, i, k);
		}
		if (q->type != HL_PARTY_STREAM && q->load > 0.0 && sum == 0.0)
			return hl_error_set(err, HL_ENOSOLUTION, NULL, 0,
				"utility '%s' (%g kW) lies outside the "
				"temperatures of every stream it could serve",
				q->name, q->load);
		if (q->kind == HL_HOT)
			hot += sum;
		else
			cold += sum;
	}
	p->scale = fmax(fmax(hot, cold), 1e-12);
	p->tol = 1e-9 * p->scale;
	p->resid = malloc((p->nint + 1) * sizeof *p->resid);
	if (p->resid == NULL)
		return hl_error_nomem(err);
	p->resid[0] = r = 0.0;
	for (k = 0; k < p->nint; k++) {
		for (i = 0; i < p->np; i++)
			r += (p->party[i].kind == HL_HOT ? 1.0 : -1.0) *
				HL_MATCH_HEAT(p, i, k);
		p->resid[k + 1] = r;
		if (r < -1e-6 * p->scale)
			return hl_error_set(err, HL_ENOSOLUTION, NULL, 0,
				"the utility loads leave %.6g kW short at %g °C "
				"(shifted): heat cannot flow upwards; the "
				"loads do not meet the targets", -r, p->t[k + 1]);
	}
	if (fabs(hot - cold) > 1e-6 * p->scale)
		return hl_error_set(err, HL_ENOSOLUTION, NULL, 0,
			"the heat does not balance: %.6g kW from hot streams "
			"and utilities, %.6g kW taken by cold ones; the utility "
			"loads do not meet the targets", hot, cold);
	return HL_OK;
}

static int
interval_has_heat(const hl_match_problem *p, size_t k)
{
	size_t i;

	for (i = 0; i < p->np; i++)
		if (HL_MATCH_HEAT(p, i, k) > p->tol)
			return 1;
	return 0;
}

static void
label_subs(hl_match_problem *p)
{
	size_t s, m = p->nsub;

	for (s = 0; s < m; s++) {
		hl_match_sub *b = &p->sub[s];

		if (m == 1)
			snprintf(b->label, sizeof b->label, "whole");
		else if (s == 0)
			snprintf(b->label, sizeof b->label, "above-pinch-1");
		else if (s == m - 1)
			snprintf(b->label, sizeof b->label, "below-pinch-%zu",
				 m - 1);
		else
			snprintf(b->label, sizeof b->label,
				 "between-pinch-%u-%u", (unsigned)s,
				 (unsigned)(s + 1));
		b->top = p->t[b->first];
		b->bottom = p->t[b->last + 1];
	}
}

/* Split at every boundary without heat flow; keep the parts with heat. */
static hl_status
split(hl_match_problem *p, hl_error *err)
{
	double ptol = 1e-7 * p->scale;
	size_t k, start = 0, s;
	int heat = 0;

	p->sub = calloc(p->nint + 1, sizeof *p->sub);
	if (p->sub == NULL)
		return hl_error_nomem(err);
	for (k = 0; k < p->nint; k++) {
		heat |= interval_has_heat(p, k);
		if (k + 1 == p->nint || p->resid[k + 1] <= ptol) {
			if (heat) {
				p->sub[p->nsub].first = start;
				p->sub[p->nsub].last = k;
				p->nsub++;
			}
			start = k + 1;
			heat = 0;
		}
	}
	for (s = 0; s < p->nsub; s++) {
		/* Trim empty intervals at either end. */
		hl_match_sub *b = &p->sub[s];

		while (b->first < b->last && !interval_has_heat(p, b->first))
			b->first++;
		while (b->last > b->first && !interval_has_heat(p, b->last))
			b->last--;
	}
	label_subs(p);
	return HL_OK;
}

static void
mark_isolated(hl_match_problem *p)
{
	size_t a, b;

	for (a = 0; a < p->nhot; a++)
		for (b = 0; b < p->ncold; b++) {
			const hl_match_pair *q = &p->pair[HL_MATCH_PAIR(p, a, b)];
			hl_match_party *h = &p->party[p->hot[a]];
			hl_match_party *k = &p->party[p->cold[b]];

			if (h->type != HL_PARTY_STREAM ||
			    k->type != HL_PARTY_STREAM || !q->potential)
				continue;
			/* 2: has a process partner it could use; 1: only
			   forbidden ones so far. */
			if (q->allowed)
				h->isolated = k->isolated = 2;
			else {
				if (h->isolated == 0)
					h->isolated = 1;
				if (k->isolated == 0)
					k->isolated = 1;
			}
		}
	for (a = 0; a < p->np; a++)
		p->party[a].isolated = p->party[a].isolated == 1;
}

void
hl_match_problem_free(hl_match_problem *p)
{
	size_t i;

	if (p == NULL)
		return;
	for (i = 0; i < p->np; i++)
		free(p->party[i].name);
	free(p->party);
	free(p->area);
	free(p->hot);
	free(p->cold);
	free(p->sidx);
	free(p->t);
	free(p->unit);
	free(p->heat);
	free(p->film);
	free(p->resid);
	free(p->pair);
	free(p->sub);
	free(p->cause);
	free(p);
}

static hl_status
prepare(hl_match_problem *p, const double *util_load, hl_glpk_log log,
	void *ctx, hl_error *err)
{
	hl_glpk_guard g;
	hl_status st;
	size_t i;

	st = check_rules(p->c, err);
	if (st == HL_OK)
		st = build_parties(p, util_load, err);
	if (st == HL_OK)
		st = index_sides(p, err);
	if (st == HL_OK)
		st = hl_match_rules(p, -1, p->pair, err);
	if (st != HL_OK)
		return st;
	for (i = 0; i < p->np; i++) {
		if (p->party[i].type == HL_PARTY_STREAM)
			continue;
		if (p->party[i].kind == HL_HOT)
			p->qh0 += p->party[i].load;
		else
			p->qc0 += p->party[i].load;
	}
	p->qh = p->qh0;
	p->qc = p->qc0;
	hl_glpk_guard_begin(&g, log, ctx, log != NULL);
	if (HL_GLPK_CRASHED(&g))
		return hl_glpk_guard_crash(&g, "the restricted-match targets",
					   err);
	p->msg_lev = g.verbose ? GLP_MSG_ON : GLP_MSG_OFF;
	st = hl_match_restrict(p, err);
	hl_glpk_guard_end(&g);
	if (st == HL_OK)
		st = apply_loads(p, err);
	if (st == HL_OK)
		st = split(p, err);
	mark_isolated(p);
	return st;
}

static int
cmp_area(const void *a, const void *b)
{
	const hl_stream *x = *(const hl_stream *const *)a;
	const hl_stream *y = *(const hl_stream *const *)b;
	int k = strcmp(x->area, y->area);

	return k != 0 ? k : (int)x->kind - (int)y->kind;
}

/* Hot/cold pairs that no plant-area rule forbids: all of them, or, with
 * cross-area pairs forbidden, those within one area or with an untagged
 * side (match_rules.c), counted over the streams sorted by area. */
static double
allowed_pairs(const hl_case *c, double hot, double cold)
{
	const hl_stream **v;
	double hn = 0.0, cn = 0.0, same = 0.0;
	size_t i, n = 0, j;

	if (c->set.area_policy != HL_AREAS_FORBID ||
	    (v = malloc((c->nstream + 1) * sizeof *v)) == NULL)
		return hot * cold;
	for (i = 0; i < c->nstream; i++) {
		if (c->stream[i].area != NULL)
			v[n++] = &c->stream[i];
		else
			*(c->stream[i].kind == HL_HOT ? &hn : &cn) += 1.0;
	}
	qsort(v, n, sizeof *v, cmp_area);
	for (i = 0; i < n; i = j) {
		double h = 0.0, k = 0.0;

		for (j = i; j < n && strcmp(v[j]->area, v[i]->area) == 0; j++)
			*(v[j]->kind == HL_HOT ? &h : &k) += 1.0;
		same += h * k;
	}
	free(v);
	return same + hn * cold + cn * hot - hn * cn;
}

/* The model's size before it is built: allowed pairs (and each stream with
 * a utility) times the shifted intervals they could share, every supply and
 * target a boundary. An upper bound on the pair-interval columns, cheap
 * enough to refuse a site-wide table before its model fills the memory. */
static double
pair_intervals(const hl_case *c)
{
	double hot = 0.0, cold = 0.0;
	size_t i;

	for (i = 0; i < c->nstream; i++)
		*(c->stream[i].kind == HL_HOT ? &hot : &cold) += 1.0;
	return (allowed_pairs(c, hot, cold) + hot + cold + 1.0) * 2.0 *
	    (double)(c->nstream + c->nutil + 1);
}

hl_status
hl_match_prepare(const hl_case *c, double dtmin, const double *util_load,
		 hl_glpk_log log, void *ctx, hl_match_problem **out,
		 hl_error *err)
{
	hl_match_problem *p;
	hl_status st;
	double size;

	*out = NULL;
	if (c->nstream == 0)
		return hl_error_set(err, HL_EINPUT, c->source, 0,
			"no process streams to match");
	size = pair_intervals(c);
	if (size > HL_MATCH_MAX_SIZE)
		return hl_error_set(err, HL_ENOSOLUTION, c->source, 0, "%zu "
		    "streams make a match MILP of up to %.2g pair-intervals, "
		    "beyond the %.2g it can solve: give each stream a plant "
		    "area and forbid cross-area matches (<plant-areas "
		    "policy=\"forbid\"/>) or run one area at a time; targets, "
		    "curves and sweep have no such limit", c->nstream, size,
		    HL_MATCH_MAX_SIZE);
	p = calloc(1, sizeof *p);
	if (p == NULL)
		return hl_error_nomem(err);
	p->c = c;
	p->dtmin = dtmin;
	p->penalised = c->set.area_policy == HL_AREAS_PENALISE &&
		c->set.area_penalty != 1.0;
	st = prepare(p, util_load, log, ctx, err);
	if (st != HL_OK) {
		hl_match_problem_free(p);
		return st;
	}
	*out = p;
	return HL_OK;
}
