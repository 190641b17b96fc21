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
	if (P->hot == NULL || P->cold == NULL || P->nosplit == NULL ||
	    P->uallow == NULL)
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
	if (P->allow == NULL || P->require == NULL || P->maxduty == NULL)
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
			P->uallow[i * P->nu + j] = (unsigned char)allow;
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
	free(P->allow);
	free(P->require);
	free(P->maxduty);
	memset(P, 0, sizeof *P);
}

hl_status
hl_opt_state_init(const hl_opt_problem *P, hl_opt_state *s)
{
	size_t n = P->S * P->nh * P->nc + 1;

	memset(s, 0, sizeof *s);
	s->q = calloc(n, sizeof *s->q);
	s->keep = calloc(n, 1);
	s->act = calloc(n, 1);
	s->ccost = calloc(n, sizeof *s->ccost);
	s->cviol = calloc(n, sizeof *s->cviol);
	s->th = calloc(P->nh * (P->S + 1) + 1, sizeof *s->th);
	s->tc = calloc(P->nc * (P->S + 1) + 1, sizeof *s->tc);
	s->hviol = calloc(P->nh + 1, sizeof *s->hviol);
	s->cvs = calloc(P->nc + 1, sizeof *s->cvs);
	s->hend = calloc(P->nh + 1, sizeof *s->hend);
	s->cend = calloc(P->nc + 1, sizeof *s->cend);
	s->hecost = calloc(P->nh + 1, sizeof *s->hecost);
	s->cecost = calloc(P->nc + 1, sizeof *s->cecost);
	s->heviol = calloc(P->nh + 1, sizeof *s->heviol);
	s->ceviol = calloc(P->nc + 1, sizeof *s->ceviol);
	s->hutil = calloc(P->nh + 1, sizeof *s->hutil);
	s->cutil = calloc(P->nc + 1, sizeof *s->cutil);
	if (s->q == NULL || s->keep == NULL || s->act == NULL || s->ccost == NULL ||
	    s->cviol == NULL || s->th == NULL || s->tc == NULL ||
	    s->hviol == NULL || s->cvs == NULL || s->hend == NULL ||
	    s->cend == NULL || s->hecost == NULL || s->cecost == NULL ||
	    s->heviol == NULL || s->ceviol == NULL || s->hutil == NULL ||
	    s->cutil == NULL) {
		hl_opt_state_free(s);
		return HL_EIO;
	}
	return HL_OK;
}

void
hl_opt_state_free(hl_opt_state *s)
{
	free(s->q);
	free(s->keep);
	free(s->act);
	free(s->ccost);
	free(s->cviol);
	free(s->th);
	free(s->tc);
	free(s->hviol);
	free(s->cvs);
	free(s->hend);
	free(s->cend);
	free(s->hecost);
	free(s->cecost);
	free(s->heviol);
	free(s->ceviol);
	free(s->hutil);
	free(s->cutil);
	memset(s, 0, sizeof *s);
}

void
hl_opt_state_copy(const hl_opt_problem *P, hl_opt_state *d,
		  const hl_opt_state *s)
{
	size_t n = P->S * P->nh * P->nc;

	memcpy(d->q, s->q, n * sizeof *d->q);
	memcpy(d->keep, s->keep, n);
	memcpy(d->act, s->act, n);
	memcpy(d->ccost, s->ccost, n * sizeof *d->ccost);
	memcpy(d->cviol, s->cviol, n * sizeof *d->cviol);
	memcpy(d->th, s->th, P->nh * (P->S + 1) * sizeof *d->th);
	memcpy(d->tc, s->tc, P->nc * (P->S + 1) * sizeof *d->tc);
#define CP(f, m) memcpy(d->f, s->f, (m) * sizeof *d->f)
	CP(hviol, P->nh);
	CP(cvs, P->nc);
	CP(hend, P->nh);
	CP(cend, P->nc);
	CP(hecost, P->nh);
	CP(cecost, P->nc);
	CP(heviol, P->nh);
	CP(ceviol, P->nc);
	CP(hutil, P->nh);
	CP(cutil, P->nc);
#undef CP
	d->ccap = s->ccap;
	d->cvsum = s->cvsum;
	d->nact = s->nact;
	d->v = s->v;
	d->tac = s->tac;
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

		if (stage[i] == 0 || stage[i] > P->S)
			continue;
		k = HL_OPT_CELL(P, stage[i] - 1, pos[u->hot], pos[u->cold]);
		s->q[k] += u->duty;
		if (keep != NULL && keep[i])
			s->keep[k] = 1;
	}
	free(stage);
	free(pos);
	hl_opt_eval_all(P, s);
	return HL_OK;
}
