/* network_opt_model.c - the superstructure of a case (which pairs may
 * meet, which utilities each stream may use, the stages) and the
 * conversions between its loads and a network. */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "network_opt_int.h"
#include "supertarget.h"

static int
name_is(const char *rule, const char *name)
{
	return strcmp(rule, "*") == 0 || strcmp(rule, name) == 0;
}

/* Match rules and plant areas on the pair of parties (hp, cp). */
static void
pair_rules(const hl_opt_problem *P, size_t hp, size_t cp, int *allow,
	   int *require, double *maxduty)
{
	const hl_case *c = P->c;
	const char *hn = P->base->party[hp].name, *cn = P->base->party[cp].name;
	size_t r;

	if (hp < c->nstream && cp < c->nstream &&
	    c->set.area_policy == HL_AREAS_FORBID &&
	    c->stream[hp].area != NULL && c->stream[cp].area != NULL &&
	    strcmp(c->stream[hp].area, c->stream[cp].area) != 0)
		*allow = 0;
	for (r = 0; r < c->nrule; r++) {
		const hl_match_rule *m = &c->rule[r];

		if (!name_is(m->hot, hn) || !name_is(m->cold, cn))
			continue;
		if (m->kind == HL_RULE_FORBID)
			*allow = 0;
		else if (m->kind == HL_RULE_REQUIRE)
			*require = 1;
		else
			*maxduty = fmin(*maxduty, m->max_duty);
	}
}

/* Plant areas with policy penalise: a unit between two areas counts as
 * `penalty` units in the match MILP; the search weighs it as penalty - 1
 * more units' fixed cost a year (the process law's a, annualised). */
static double
area_weight(const hl_opt_problem *P, size_t hp, size_t cp)
{
	const hl_case *c = P->c;
	const char *ha = c->stream[hp].area, *ca = c->stream[cp].area;

	if (c->set.area_policy != HL_AREAS_PENALISE || ha == NULL ||
	    ca == NULL || strcmp(ha, ca) == 0 || !(c->set.cost_a > 0.0))
		return 0.0;
	return fmax(0.0, c->set.area_penalty - 1.0) * c->set.cost_a *
	    hl_supertarget_crf(c->set.interest, c->set.life);
}

/* The case's parties with their types and cost laws (network_case.c):
 * every unit of the search is sized and priced against it. */
static hl_status
base_network(hl_opt_problem *P, hl_error *err)
{
	return hl_network_of_case(P->c, NULL, &P->base, err);
}

/* Stages of a layering of net's process units: each unit one stage after
 * the last of its two streams, in order of the hot end's temperatures. */
typedef struct {
	double key;
	size_t i;
} keyed;

static int
cmp_key(const void *x, const void *y)
{
	const keyed *a = x, *b = y;

	if (a->key != b->key)
		return a->key > b->key ? -1 : 1;
	return a->i < b->i ? -1 : 1;
}

/* 1 when u comes before v along a stream they share, in the start's own
 * stage numbers: along a hot stream hotter first, along a cold stream
 * hotter first too (the superstructure's stage 1 is the hot end). */
static int
before(const hl_network_unit *u, const hl_network_unit *v)
{
	return (u->hot == v->hot && u->hot_stage > 0 && v->hot_stage > 0 &&
	    u->hot_stage < v->hot_stage) || (u->cold == v->cold &&
	    u->cold_stage > 0 && v->cold_stage > 0 &&
	    u->cold_stage > v->cold_stage);
}

/* u and v are branches of one split (one stage of a stream they share). */
static int
siblings(const hl_network_unit *u, const hl_network_unit *v)
{
	return (u->hot == v->hot && u->hot_stage > 0 &&
	    u->hot_stage == v->hot_stage) || (u->cold == v->cold &&
	    u->cold_stage > 0 && u->cold_stage == v->cold_stage);
}

/* Stages for net's process units as the longest chain of units before
 * each, the branches of a split in one stage (label-correcting longest
 * paths, Bellman 1958): 1 when it settles, 0 when the order has a cycle
 * or a process unit has no stage numbers (a network table). */
static int
layering_splits(const hl_network *net, size_t ns, size_t *stage,
		size_t *nstage)
{
	size_t n = net->nunit, i, j, round;
	int changed = 1;

	for (i = 0; i < n; i++) {
		const hl_network_unit *u = &net->unit[i];

		stage[i] = u->hot < ns && u->cold < ns;
		if (stage[i] && (u->hot_stage <= 0 || u->cold_stage <= 0))
			return 0;
	}
	for (round = 0; changed && round <= n; round++) {
		changed = 0;
		for (i = 0; i < n; i++)
			for (j = 0; j < n && stage[i] > 0; j++) {
				const hl_network_unit *u = &net->unit[i];
				const hl_network_unit *v = &net->unit[j];
				size_t want = stage[j] == 0 ? 0 : before(v, u) ?
				    stage[j] + 1 : siblings(u, v) ? stage[j] : 0;

				if (want > stage[i]) {
					stage[i] = want;
					changed = 1;
				}
			}
	}
	*nstage = 0;
	for (i = 0; i < n; i++)
		if (stage[i] > *nstage)
			*nstage = stage[i];
	return !changed;
}

/* Stages for net's process units: the longest chain of units before each
 * (in the start's stage order on both its streams; Kahn's topological
 * order, ties by the hot-end temperatures), so that every stream meets its
 * units in the order the start has them; a unit caught in a cycle (or a
 * start without stage numbers) goes one stage after the last of its two
 * streams in temperature order. */
static size_t *
layering(const hl_opt_problem *P, const hl_network *net, size_t *nstage)
{
	size_t ns = P->c->nstream, i, j, t, n = net->nunit;
	keyed *order = malloc((n + 1) * sizeof *order);
	size_t *stage = calloc(n + 1, sizeof *stage);
	size_t *last = calloc(ns + 1, sizeof *last);
	unsigned char *done = calloc(n + 1, 1);

	*nstage = 0;
	if (order == NULL || stage == NULL || last == NULL || done == NULL) {
		free(order);
		free(last);
		free(stage);
		free(done);
		return NULL;
	}
	for (i = 0; i < n; i++) {
		const hl_network_unit *u = &net->unit[i];

		order[i].i = i;
		order[i].key = 0.0;
		if (u->hot < net->nparty && u->cold < net->nparty)
			order[i].key = (isnan(u->hot_in) ?
			    net->party[u->hot].supply : u->hot_in) +
			    (isnan(u->cold_out) ? net->party[u->cold].target :
			    u->cold_out);
		if (u->hot >= ns || u->cold >= ns)
			done[i] = 1;
	}
	if (layering_splits(net, ns, stage, nstage)) {
		free(order);
		free(last);
		free(done);
		return stage;
	}
	memset(stage, 0, (n + 1) * sizeof *stage);
	*nstage = 0;
	qsort(order, n, sizeof *order, cmp_key);
	for (t = 0; t < n; t++) {
		size_t pick = n, k = 0;
		int cycle;

		/* the first unit in key order with all its predecessors set */
		for (i = 0; i < n && pick == n; i++) {
			size_t v = order[i].i;

			if (done[v])
				continue;
			for (j = 0; j < n; j++)
				if (!done[j] && j != v &&
				    net->unit[j].hot < ns &&
				    net->unit[j].cold < ns &&
				    before(&net->unit[j], &net->unit[v]))
					break;
			if (j == n)
				pick = v;
		}
		cycle = pick == n;
		if (cycle)      /* the first left in key order */
			for (i = 0; i < n && pick == n; i++)
				if (!done[order[i].i])
					pick = order[i].i;
		if (pick == n)
			break;
		if (cycle) {
			k = (last[net->unit[pick].hot] >
			    last[net->unit[pick].cold] ?
			    last[net->unit[pick].hot] :
			    last[net->unit[pick].cold]) + 1;
		} else {
			for (j = 0; j < n; j++)
				if (stage[j] > k && before(&net->unit[j],
				    &net->unit[pick]))
					k = stage[j];
			k++;
		}
		stage[pick] = k;
		last[net->unit[pick].hot] = last[net->unit[pick].cold] = k;
		done[pick] = 1;
		if (k > *nstage)
			*nstage = k;
	}
	free(order);
	free(last);
	free(done);
	return stage;
}

static hl_status
tables(hl_opt_problem *P, hl_error *err)
{
	const hl_case *c = P->c;
	size_t i, a, b, j, np = c->nstream;

	P->hot = calloc(np + 1, sizeof *P->hot);
	P->cold = calloc(np + 1, sizeof *P->cold);
	P->nosplit = calloc(np + 1, 1);
	P->uallow = calloc(np * (c->nutil + 1) + 1, 1);
	P->ureq = calloc(np * (c->nutil + 1) + 1, 1);
	P->umax = calloc(np * (c->nutil + 1) + 1, sizeof *P->umax);
	if (P->hot == NULL || P->cold == NULL || P->nosplit == NULL ||
	    P->uallow == NULL || P->ureq == NULL || P->umax == NULL)
		return hl_error_nomem(err);
	for (i = 0; i < np; i++) {
		if (c->stream[i].kind == HL_HOT)
			P->hot[P->nh++] = i;
		else
			P->cold[P->nc++] = i;
		P->nosplit[i] = P->o->no_splits || (P->o->no_split != NULL &&
		    P->o->no_split[i]);
		P->qscale += hl_stream_duty(&c->stream[i]) / (double)np;
	}
	P->nu = c->nutil;
	for (j = 0; j < P->nu; j++)
		if (!isnan(c->util[j].max_load))
			P->has_max_load = 1;
	P->t_top = -HUGE_VAL;
	P->t_bot = HUGE_VAL;
	for (i = 0; i < np; i++)
		if (c->stream[i].kind == HL_HOT)
			P->t_top = fmax(P->t_top, hl_stream_supply(&c->stream[i]));
		else
			P->t_bot = fmin(P->t_bot, hl_stream_supply(&c->stream[i]));
	P->allow = calloc(P->nh * P->nc + 1, 1);
	P->require = calloc(P->nh * P->nc + 1, 1);
	P->maxduty = calloc(P->nh * P->nc + 1, sizeof *P->maxduty);
	P->xarea = calloc(P->nh * P->nc + 1, sizeof *P->xarea);
	if (P->allow == NULL || P->require == NULL || P->maxduty == NULL ||
	    P->xarea == NULL)
		return hl_error_nomem(err);
	for (a = 0; a < P->nh; a++)
		for (b = 0; b < P->nc; b++) {
			const hl_network_party *h = &P->base->party[P->hot[a]];
			const hl_network_party *k = &P->base->party[P->cold[b]];
			int allow = h->supply - k->supply >=
			    hl_network_required(&c->set, h, k), req = 0;
			double md = HUGE_VAL;

			pair_rules(P, P->hot[a], P->cold[b], &allow, &req, &md);
			P->allow[a * P->nc + b] = (unsigned char)(allow || req);
			P->require[a * P->nc + b] = (unsigned char)req;
			P->maxduty[a * P->nc + b] = md;
			P->xarea[a * P->nc + b] = area_weight(P, P->hot[a],
			    P->cold[b]);
			if (req || !isinf(md))
				P->rules = 1;
		}
	for (i = 0; i < np; i++)
		for (j = 0; j < P->nu; j++) {
			size_t up = np + j;
			int allow = 1, req = 0;
			double md = HUGE_VAL;

			if (c->util[j].kind == c->stream[i].kind)
				continue;
			if (c->stream[i].kind == HL_HOT)
				pair_rules(P, i, up, &allow, &req, &md);
			else
				pair_rules(P, up, i, &allow, &req, &md);
			P->uallow[i * P->nu + j] = (unsigned char)(allow || req);
			P->ureq[i * P->nu + j] = (unsigned char)req;
			P->umax[i * P->nu + j] = md;
			if (req || !isinf(md))
				P->urules = 1;
		}
	return HL_OK;
}

hl_status
hl_opt_problem_init(hl_opt_problem *P, const hl_case *c,
		    const hl_opt_options *o, hl_error *err)
{
	hl_status st;

	memset(P, 0, sizeof *P);
	P->c = c;
	P->o = o;
	st = base_network(P, err);
	if (st == HL_OK)
		st = tables(P, err);
	if (st != HL_OK)
		return st;
	P->crf = hl_supertarget_crf(c->set.interest, c->set.life);
	if (!(P->qscale > 0.0))
		P->qscale = 1.0;
	P->S = (P->nh > P->nc ? P->nh : P->nc) + 2;
	if (P->S < 2)
		P->S = 2;
	if (o->start != NULL) {
		size_t ns, *stage = layering(P, o->start, &ns);

		if (stage == NULL)
			return hl_error_nomem(err);
		free(stage);
		if (ns > P->S)
			P->S = ns;
	}
	return HL_OK;
}

void
hl_opt_problem_free(hl_opt_problem *P)
{
	hl_network_free(P->base);
	free(P->hot);
	free(P->cold);
	free(P->nosplit);
	free(P->uallow);
	free(P->ureq);
	free(P->umax);
	free(P->allow);
	free(P->require);
	free(P->maxduty);
	free(P->xarea);
	memset(P, 0, sizeof *P);
}

/* The state's arrays: per cell, per hot and cold stream-stage, per hot
 * and cold stream; one table so that init, free and copy agree. */
typedef enum { PER_CELL, PER_HS, PER_CS, PER_H, PER_C, PER_HB, PER_CB } per;

#define STATE_ARRAYS(X) \
	X(q, PER_CELL) X(ccost, PER_CELL) X(cviol, PER_CELL) \
	X(wh, PER_CELL) X(wc, PER_CELL) \
	X(th, PER_HB) X(tc, PER_CB) \
	X(hviol, PER_H) X(cvs, PER_C) X(hend, PER_H) X(cend, PER_C) \
	X(hecost, PER_H) X(cecost, PER_C) X(heviol, PER_H) X(ceviol, PER_C) \
	X(hmc, PER_H) X(cmc, PER_C) X(hmv, PER_H) X(cmv, PER_C) \
	X(hutil, PER_H) X(cutil, PER_C) \
	X(swh, PER_HS) X(swc, PER_CS) X(uh, PER_HS) X(uc, PER_CS) \
	X(muh, PER_HS) X(muc, PER_CS) X(thm, PER_HS) X(tcm, PER_CS) \
	X(hq, PER_HS) X(cq, PER_CS)

static size_t
count_of(const hl_opt_problem *P, per w)
{
	switch (w) {
	case PER_CELL:
		return P->S * P->nh * P->nc;
	case PER_HS:
		return P->nh * P->S;
	case PER_CS:
		return P->nc * P->S;
	case PER_H:
		return P->nh;
	case PER_C:
		return P->nc;
	case PER_HB:
		return P->nh * (P->S + 1);
	default:
		return P->nc * (P->S + 1);
	}
}

hl_status
hl_opt_state_init(const hl_opt_problem *P, hl_opt_state *s)
{
	size_t n = P->S * P->nh * P->nc, i;
	int ok = 1;

	memset(s, 0, sizeof *s);
#define ALLOC(f, w) \
	s->f = calloc(count_of(P, w) + 1, sizeof *s->f); \
	ok &= s->f != NULL;
	STATE_ARRAYS(ALLOC)
#undef ALLOC
	s->keep = calloc(n + 1, 1);
	s->act = calloc(n + 1, 1);
	if (!ok || s->keep == NULL || s->act == NULL) {
		hl_opt_state_free(s);
		return HL_EIO;
	}
	for (i = 0; i < n; i++)
		s->wh[i] = s->wc[i] = 1.0;
	for (i = 0; i < P->nh * P->S; i++)
		s->muh[i] = -1;
	for (i = 0; i < P->nc * P->S; i++)
		s->muc[i] = -1;
	return HL_OK;
}

void
hl_opt_state_free(hl_opt_state *s)
{
#define FREE(f, w) free(s->f);
	STATE_ARRAYS(FREE)
#undef FREE
	free(s->keep);
	free(s->act);
	memset(s, 0, sizeof *s);
}

void
hl_opt_state_copy(const hl_opt_problem *P, hl_opt_state *d,
		  const hl_opt_state *s)
{
	size_t n = P->S * P->nh * P->nc;

#define COPY(f, w) memcpy(d->f, s->f, count_of(P, w) * sizeof *d->f);
	STATE_ARRAYS(COPY)
#undef COPY
	memcpy(d->keep, s->keep, n);
	memcpy(d->act, s->act, n);
	d->ccap = s->ccap;
	d->cvsum = s->cvsum;
	d->nact = s->nact;
	d->v = s->v;
	d->tac = s->tac;
}

/* The stage sum of the loads on hot stream a (side 0) or cold stream b. */
static double
stage_sum(const hl_opt_problem *P, const hl_opt_state *s, size_t k,
	  size_t a, size_t b, int side)
{
	double sum = 0.0;
	size_t x;

	if (side == 0)
		for (x = 0; x < P->nc; x++)
			sum += s->q[HL_OPT_CELL(P, k, a, x)];
	else
		for (x = 0; x < P->nh; x++)
			sum += s->q[HL_OPT_CELL(P, k, x, b)];
	return sum;
}

/* A branch weight that gives share phi to load q of a stage loaded sum
 * (1: the isothermal share). */
static double
weight_of(double phi, double q, double sum)
{
	return phi > 0.0 && phi <= 1.0 && q > 0.0 && sum > 0.0 ?
	    phi * sum / q : 1.0;
}

/* Utility unit i of net inside a process stream (process units after it
 * along the stream) goes after the process units of the stage of the one
 * before it; a utility at a stream's end is the residual's. */
static void
mid_utility(const hl_opt_problem *P, const hl_network *net,
	    const size_t *stage, const size_t *pos, size_t i, hl_opt_state *s)
{
	const hl_network_unit *u = &net->unit[i];
	size_t ns = P->c->nstream, j, prev = net->nunit;
	int hot = u->hot < ns, later = 0, at;
	size_t p = hot ? u->hot : u->cold;

	if ((u->hot < ns) == (u->cold < ns))
		return;
	at = hot ? u->hot_stage : u->cold_stage;
	for (j = 0; j < net->nunit; j++) {
		const hl_network_unit *v = &net->unit[j];
		int vs = hot ? v->hot_stage : v->cold_stage;

		if ((hot ? v->hot : v->cold) != p || stage[j] == 0)
			continue;
		if (vs > at)
			later = 1;
		else if (vs < at && (prev == net->nunit || vs > (hot ?
		    net->unit[prev].hot_stage : net->unit[prev].cold_stage)))
			prev = j;
	}
	if (!later || prev == net->nunit)
		return;
	if (hot)
		s->uh[pos[p] * P->S + stage[prev] - 1] += u->duty;
	else
		s->uc[pos[p] * P->S + stage[prev] - 1] += u->duty;
}

hl_status
hl_opt_from_network(const hl_opt_problem *P, const hl_network *net,
		    const unsigned char *keep, hl_opt_state *s)
{
	size_t ns, i, *stage = layering(P, net, &ns);
	size_t *pos = calloc(P->c->nstream + 1, sizeof *pos);

	if (stage == NULL || pos == NULL) {
		free(stage);
		free(pos);
		return HL_EIO;
	}
	for (i = 0; i < P->nh; i++)
		pos[P->hot[i]] = i;
	for (i = 0; i < P->nc; i++)
		pos[P->cold[i]] = i;
	for (i = 0; i < net->nunit; i++) {
		const hl_network_unit *u = &net->unit[i];
		size_t k;

		if (stage[i] == 0 || stage[i] > P->S) {
			mid_utility(P, net, stage, pos, i, s);
			continue;
		}
		k = HL_OPT_CELL(P, stage[i] - 1, pos[u->hot], pos[u->cold]);
		s->q[k] += u->duty;
		if (keep != NULL && keep[i])
			s->keep[k] = 1;
	}
	for (i = 0; i < net->nunit; i++) {
		const hl_network_unit *u = &net->unit[i];
		size_t k, a, b;

		if (stage[i] == 0 || stage[i] > P->S)
			continue;
		a = pos[u->hot];
		b = pos[u->cold];
		k = HL_OPT_CELL(P, stage[i] - 1, a, b);
		s->wh[k] = weight_of(u->hot_share, s->q[k],
		    stage_sum(P, s, stage[i] - 1, a, b, 0));
		s->wc[k] = weight_of(u->cold_share, s->q[k],
		    stage_sum(P, s, stage[i] - 1, a, b, 1));
	}
	free(stage);
	free(pos);
	hl_opt_eval_all(P, s);
	return HL_OK;
}
