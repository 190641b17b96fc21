/* network_opt.c - the optimiser's driver: starts, walks over threads in a
 * fixed assignment, the deterministic combination, the network out, and
 * what the limits cost. */
#include <math.h>
#include <pthread.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "network_opt_int.h"

/* Walks per round (fixed: the result must not depend on the threads). */
#define WALKS 4
#define ROUNDS 4

void
hl_opt_options_default(hl_opt_options *o)
{
	memset(o, 0, sizeof *o);
	o->seed = 1;
	o->threads = 2;
	o->time_limit = 60.0;
	o->effort = 1.0;
}

int
hl_network_optimise_fits(const hl_case *c)
{
	int hot = 0, cold = 0;
	size_t i;

	for (i = 0; i < c->nutil; i++) {
		if (isnan(c->util[i].price))
			return 0;
		if (c->util[i].kind == HL_HOT)
			hot = 1;
		else
			cold = 1;
	}
	return hot && cold;
}

double
hl_opt_auto_min_duty(const hl_case *c)
{
	double m = 0.0;
	size_t i;

	for (i = 0; i < c->nstream; i++)
		m = fmax(m, hl_stream_duty(&c->stream[i]));
	return 0.01 * m;
}

void
hl_opt_result_free(hl_opt_result *r)
{
	if (r == NULL)
		return;
	hl_network_free(r->net);
	free(r->change);
	free(r);
}

typedef struct {
	const hl_opt_problem *P;
	hl_opt_state s, best;
	uint64_t seed;
	size_t max, spent;
	double deadline;
	int capped;
} walk_job;

typedef struct {
	walk_job *job;
	size_t njob, first, step;
} worker;

static void *
work(void *arg)
{
	worker *w = arg;
	size_t i;

	for (i = w->first; i < w->njob; i += w->step) {
		walk_job *j = &w->job[i];

		j->spent = hl_opt_walk(j->P, &j->s, &j->best, j->seed, j->max,
		    j->deadline, &j->capped);
	}
	return NULL;
}

/* Run the jobs on up to `threads` threads: job i on thread i mod T. */
static void
run_jobs(walk_job *job, size_t n, int threads)
{
	pthread_t tid[16];
	worker w[16];
	size_t t, nt = threads < 1 ? 1 : threads > 16 ? 16 : (size_t)threads;
	size_t started = 0;

	if (nt > n)
		nt = n;
	for (t = 0; t < nt; t++) {
		w[t].job = job;
		w[t].njob = n;
		w[t].first = t;
		w[t].step = nt;
	}
	for (t = 1; t < nt; t++)
		if (pthread_create(&tid[t], NULL, work, &w[t]) == 0)
			started = t;
		else
			break;
	/* Whatever could not start runs here, in the same order. */
	if (started + 1 < nt) {
		for (t = started + 1; t < nt; t++)
			w[t].step = nt;
		for (t = started + 1; t < nt; t++)
			work(&w[t]);
	}
	work(&w[0]);
	for (t = 1; t <= started; t++)
		pthread_join(tid[t], NULL);
}

/* A random structure: each allowed pair one unit with probability
 * min(½, 2/max(hot, cold streams)) at a random stage, with a random part of
 * what both streams hold. */
static void
random_start(const hl_opt_problem *P, hl_opt_state *s, uint64_t seed)
{
	uint64_t x = seed;
	size_t a, b, m = P->nh > P->nc ? P->nh : P->nc;
	double p = fmin(0.5, 2.0 / (double)(m > 0 ? m : 1));

	for (a = 0; a < P->nh; a++)
		for (b = 0; b < P->nc; b++) {
			double u, q;
			size_t k;

			x = x * 6364136223846793005ull + 1442695040888963407ull;
			u = (double)(x >> 11) / 9007199254740992.0;
			if (!P->allow[a * P->nc + b] || u >= p)
				continue;
			k = (size_t)(x >> 33) % P->S;
			q = fmin(hl_stream_duty(&P->c->stream[P->hot[a]]),
			    hl_stream_duty(&P->c->stream[P->cold[b]]));
			s->q[HL_OPT_CELL(P, k, a, b)] = q * u / p;
		}
	hl_opt_eval_all(P, s);
}

static uint64_t
mix(uint64_t seed, uint64_t w)
{
	uint64_t z = seed * 0x9E3779B97F4A7C15ull + w * 0xD1B54A32D192ED03ull;

	return z ^ (z >> 29);
}

/* The best of the jobs: fewest limits missed, least cost, lowest index. */
static size_t
best_job(const walk_job *job, size_t n)
{
	size_t i, b = 0;

	for (i = 1; i < n; i++)
		if (hl_opt_better(&job[i].best, &job[b].best))
			b = i;
	return b;
}

/* The walk that did worst (highest index among equals): it restarts from
 * the best, the others go on from their own best. */
static size_t
worst_job(const walk_job *job, size_t n)
{
	size_t i, w = 0;

	for (i = 1; i < n; i++)
		if (!hl_opt_better(&job[i].best, &job[w].best))
			w = i;
	return w;
}

static void
free_jobs(walk_job *job, size_t n)
{
	size_t i;

	for (i = 0; i < n; i++) {
		hl_opt_state_free(&job[i].s);
		hl_opt_state_free(&job[i].best);
	}
}

/* Evaluations the whole search may spend: grows with the streams, and
 * every problem gets at least what a 25-stream one does (FLOOR_STREAMS):
 * a small problem's evaluations are cheap and its walks need the length.
 * Over seeds 1-4 the floor lowered the mean ratio to the best published
 * of aromatics9 from 1.0104 to 1.0086 and of bp15 from 1.0191 to 1.0161;
 * a floor of 40 streams did no better and took 1.7 times as long
 * (doc/performance.md). */
#define FLOOR_STREAMS 25.0
static size_t
budget(const hl_opt_problem *P, const hl_opt_options *o)
{
	double n = fmax((double)(P->nh + P->nc), FLOOR_STREAMS);
	double e = 60000.0 * (n + 2.0) * o->effort;

	return e < 1000.0 ? 1000 : (size_t)e;
}

/* One more walk from the best of all rounds, a fifth of the evaluations:
 * the rounds end with walks that restarted from their own bests. */
static hl_status
last_walk(const hl_opt_problem *P, const hl_opt_options *o,
	  hl_opt_state *out, size_t total, double deadline, hl_opt_result *r)
{
	hl_opt_state s, best;
	int capped = 0;

	if (hl_opt_state_init(P, &s) != HL_OK)
		return HL_EIO;
	if (hl_opt_state_init(P, &best) != HL_OK) {
		hl_opt_state_free(&s);
		return HL_EIO;
	}
	hl_opt_state_copy(P, &s, out);
	r->evals += hl_opt_walk(P, &s, &best, mix(o->seed, 4099), total / 5,
	    deadline, &capped);
	r->capped |= capped;
	if (hl_opt_better(&best, out))
		hl_opt_state_copy(P, out, &best);
	hl_opt_state_free(&s);
	hl_opt_state_free(&best);
	return HL_OK;
}

/* ROUNDS rounds of WALKS walks: the first from the start (when given), the
 * network of utilities only and random structures; each later one from the
 * best so far. The best, polished once more and taken down the structure
 * descent, goes to *out. */
static hl_status
search(const hl_opt_problem *P, const hl_opt_options *o, hl_opt_state *out,
       hl_opt_result *r)
{
	walk_job job[WALKS];
	size_t total = budget(P, o), i, b, round, worst = 0;
	double t0 = hl_opt_now();
	double deadline = o->time_limit > 0.0 ? t0 + o->time_limit : 0.0;
	hl_status st = HL_OK;

	memset(job, 0, sizeof job);
	for (i = 0; i < WALKS; i++)
		if (hl_opt_state_init(P, &job[i].s) != HL_OK ||
		    hl_opt_state_init(P, &job[i].best) != HL_OK) {
			free_jobs(job, WALKS);
			return HL_EIO;
		}
	for (round = 0; round < ROUNDS && st == HL_OK; round++) {
		for (i = 0; i < WALKS; i++) {
			walk_job *j = &job[i];

			j->P = P;
			j->seed = mix(o->seed, round * WALKS + i + 1);
			j->max = total * 9 / 10 / ROUNDS / WALKS;
			j->deadline = deadline;
			if (round > 0) {
				hl_opt_state_copy(P, &j->s, i == worst ? out :
				    &j->best);
				continue;
			}
			if (i == 0 && o->start != NULL)
				st = hl_opt_from_network(P, o->start, o->keep,
				    &j->s);
			else if (i == 3)
				random_start(P, &j->s, j->seed);
			else {
				hl_opt_eval_all(P, &j->s);
				r->evals += hl_opt_greedy(P, &j->s, total / 8,
				    i == 1 ? 2.0 : 1.0);
			}
			if (o->start != NULL && o->keep != NULL && i != 0)
				memcpy(j->s.keep, job[0].s.keep,
				    P->S * P->nh * P->nc);
			if (o->start_only && i != 0 && st == HL_OK)
				hl_opt_state_copy(P, &j->s, &job[0].s);
			if (st == HL_OK)
				hl_opt_eval_all(P, &j->s);
		}
		if (st != HL_OK)
			break;
		run_jobs(job, WALKS, o->threads);
		b = best_job(job, WALKS);
		worst = worst_job(job, WALKS);
		hl_opt_state_copy(P, out, &job[b].best);
		for (i = 0; i < WALKS; i++) {
			r->evals += job[i].spent;
			r->capped |= job[i].capped;
		}
		r->walks += WALKS;
		if (o->progress != NULL)
			o->progress(o->ctx, 0.9 * (round + 1) / ROUNDS, out->v >
			    1e-9 ? NAN : out->tac);
	}
	free_jobs(job, WALKS);
	if (st == HL_OK && !(deadline > 0.0 && hl_opt_now() > deadline))
		st = last_walk(P, o, out, total, deadline, r);
	if (st == HL_OK && !(deadline > 0.0 && hl_opt_now() > deadline))
		r->evals += hl_opt_polish(P, out, total / 10);
	if (st == HL_OK)
		r->evals += hl_opt_descend(P, out, total / 4, deadline,
		    &r->capped);
	return st;
}

/* A repair's job from the relaxed result: the process units below the
 * smallest duty out, smallest first (their heat to the utilities), then a
 * polish; the job's walk, under the limit, follows. */
static void
repair_job(const hl_opt_problem *P, const hl_opt_options *o,
	   const hl_opt_state *from, walk_job *j, double deadline,
	   hl_opt_result *r)
{
	size_t m = P->S * P->nh * P->nc, i, pickd, total = budget(P, o);
	hl_opt_state *s = &j->s;

	hl_opt_state_copy(P, s, from);
	do {
		pickd = m;
		for (i = 0; i < m; i++)
			if (s->q[i] > HL_OPT_QEPS && s->q[i] <
			    hl_opt_min_duty_for(P, P->hot[(i / P->nc) % P->nh],
			    P->cold[i % P->nc]) && !s->keep[i] &&
			    (pickd == m || s->q[i] < s->q[pickd]))
				pickd = i;
		if (pickd < m)
			s->q[pickd] = 0.0;
	} while (pickd < m);
	hl_opt_eval_all(P, s);
	r->evals += hl_opt_trims(P, s);
	r->evals += hl_opt_polish(P, s, total / 20);
	j->P = P;
	j->seed = mix(o->seed, 977);
	j->max = total / 5;
	j->deadline = deadline;
}

/* The default smallest unit stays only while it adds at most this part
 * of the total annual cost to the search's result without it. */
#define AUTO_MIN_DUTY_COST 0.03

static int
repaired(double v, const hl_opt_state *best, const hl_opt_state *relaxed)
{
	return v <= 1e-9 && (relaxed->v > 1e-9 || best->tac <=
	    relaxed->tac + AUTO_MIN_DUTY_COST * fabs(relaxed->tac));
}

/* The default smallest unit (hl_opt_auto_min_duty) as a repair, not a
 * limit of the walks: a walk that must step over small loads to move heat
 * between units settles in worse basins. The search runs without it, then
 * a repair under it (repair_job and its walk); when that misses a limit or
 * costs too much the default is dropped and r says so. */
static hl_status
search_then_repair(hl_opt_problem *P, const hl_opt_options *o,
		   hl_opt_options *relaxed_out, hl_opt_state *out,
		   hl_opt_result *r)
{
	hl_opt_options relaxed = *o, opts[2];
	hl_opt_problem tier[2];
	walk_job job[2];
	double deadline = o->time_limit > 0.0 ? hl_opt_now() + o->time_limit :
	    0.0;
	hl_status st;
	int t, pick = -1;

	relaxed.min_duty = 0.0;
	relaxed.min_duty_auto = 0;
	P->o = &relaxed;
	st = search(P, &relaxed, out, r);
	P->o = o;
	if (st != HL_OK)
		return st;
	if (out->v <= 1e-9)
		r->relaxed_tac = out->tac;
	/* The default for every unit, else a tenth of it (no trims of a
	 * fraction of a kW; common practice, no source), else none: a
	 * preference kept only where it costs little (AUTO_MIN_DUTY_COST).
	 * Both are repaired, side by side on two threads, and always both,
	 * so that the evaluations do not depend on the thread count. */
	memset(job, 0, sizeof job);
	for (t = 0; t < 2; t++) {
		opts[t] = *o;
		opts[t].min_duty = t == 0 ? o->min_duty : o->min_duty / 10.0;
		tier[t] = *P;
		tier[t].o = &opts[t];
		if (hl_opt_state_init(P, &job[t].s) != HL_OK ||
		    hl_opt_state_init(P, &job[t].best) != HL_OK) {
			free_jobs(job, 2);
			return HL_EIO;
		}
		repair_job(&tier[t], &opts[t], out, &job[t], deadline, r);
	}
	run_jobs(job, 2, o->threads);
	for (t = 0; t < 2; t++) {
		r->evals += job[t].spent;
		r->capped |= job[t].capped;
		if (pick < 0 && repaired(job[t].best.v, &job[t].best, out))
			pick = t;
	}
	r->min_duty_dropped = pick < 0;
	r->min_duty_tenth = pick == 1;
	r->smallest = pick < 0 ? 0.0 : opts[pick].min_duty;
	*relaxed_out = pick < 0 ? relaxed : opts[pick];
	P->o = relaxed_out;
	if (pick >= 0)
		hl_opt_state_copy(P, out, &job[pick].best);
	else
		hl_opt_eval_all(P, out);
	free_jobs(job, 2);
	return HL_OK;
}

static hl_network *
clone(const hl_network *src, hl_error *err)
{
	hl_network *net = hl_network_create();
	size_t i;

	if (net == NULL)
		return NULL;
	net->set = src->set;
	net->set.currency = strdup(src->set.currency != NULL ?
	    src->set.currency : "EUR");
	if (net->set.currency == NULL)
		goto fail;
	for (i = 0; i < src->nparty; i++)
		if (hl_network_add_party(net, &src->party[i], err) != HL_OK)
			goto fail;
	for (i = 0; i < src->nunit; i++)
		if (hl_network_add_unit(net, &src->unit[i], err) != HL_OK)
			goto fail;
	for (i = 0; i < src->nnote; i++)
		if (hl_network_add_note(net, err, "%s", src->note[i]) != HL_OK)
			goto fail;
	if (src->source != NULL && (net->source = strdup(src->source)) == NULL)
		goto fail;
	net->nmatch = src->nmatch;
	net->qh_target = src->qh_target;
	net->qc_target = src->qc_target;
	net->restriction = src->restriction;
	net->penalty = src->penalty;
	hl_network_totals(net);
	return net;
fail:
	hl_network_free(net);
	return NULL;
}

static hl_status add_change(hl_opt_result *r, hl_opt_change_kind kind,
			    double de, double dt, const char *fmt, ...)
	__attribute__((format(printf, 5, 6)));

static hl_status
add_change(hl_opt_result *r, hl_opt_change_kind kind, double de, double dt,
	   const char *fmt, ...)
{
	hl_opt_change *c = realloc(r->change, (r->nchange + 1) * sizeof *c);
	va_list ap;

	if (c == NULL)
		return HL_EIO;
	r->change = c;
	c = &c[r->nchange++];
	c->kind = kind;
	va_start(ap, fmt);
	vsnprintf(c->text, sizeof c->text, fmt, ap);
	va_end(ap);
	c->d_energy = de;
	c->d_tac = dt;
	c->d_hot = NAN;
	return HL_OK;
}

/* kW of hot utility a state buys: the cold streams' ends and the
 * utilities inside them. */
static double
hot_utility(const hl_opt_problem *P, const hl_opt_state *s)
{
	double q = 0.0;
	size_t b, k;

	for (b = 0; b < P->nc; b++) {
		q += s->cend[b];
		for (k = 0; k < P->S; k++)
			q += s->uc[b * P->S + k];
	}
	return q;
}

/* The pair (a, b) back in fin at duty d, in the stage where that costs
 * least: its heat from both streams' utilities (a path from the hot to the
 * cold utility) or, where they have too little, the other loads polished
 * to make room (the unit kept, its duty free to move). The change of TAC
 * (HUGE_VAL when no stage keeps every limit) and of hot utility. */
static void
back_at(const hl_opt_problem *P0, const hl_opt_state *fin, size_t a,
	size_t b, double d, hl_opt_state *t, double *dtac, double *dhot)
{
	/* a smallest duty the start's unit is below does not apply: the
	 * question is what the unit itself would do */
	hl_opt_problem Q = *P0, *P = &Q;
	hl_opt_options x = *P0->o;
	size_t k;

	x.min_duty = 0.0;
	x.min_duty_auto = 0;
	Q.o = &x;
	*dtac = HUGE_VAL;
	*dhot = 0.0;
	for (k = 0; k < P->S; k++) {
		size_t i = HL_OPT_CELL(P, k, a, b);

		hl_opt_state_copy(P, t, fin);
		t->q[i] = d;
		t->wh[i] = t->wc[i] = 1.0;
		t->keep[i] = 1;
		hl_opt_eval_all(P, t);
		if (t->v > 1e-9)   /* other loads make room, the unit stays */
			hl_opt_polish(P, t, 200 + 40 * t->nact);
		if (t->v <= 1e-9 && t->tac - fin->tac < *dtac) {
			*dtac = t->tac - fin->tac;
			*dhot = hot_utility(P, t) - hot_utility(P, fin);
		}
	}
}

/* Pairs of the start that the result no longer has, each with what adding
 * it back at its start duty would do (back_at). */
static hl_status
dropped(const hl_opt_problem *P, const hl_opt_state *fin,
	hl_opt_result *r)
{
	const hl_network *st = P->o->start;
	size_t i, k;
	hl_opt_state t;

	if (st == NULL)
		return HL_OK;
	if (hl_opt_state_init(P, &t) != HL_OK)
		return HL_EIO;
	for (i = 0; i < st->nunit; i++) {
		const hl_network_unit *u = &st->unit[i];
		size_t a, b, j;
		double sum = 0.0, dtac, dhot;

		if (u->hot >= P->c->nstream || u->cold >= P->c->nstream)
			continue;
		for (j = 0; j < i; j++)
			if (st->unit[j].hot == u->hot &&
			    st->unit[j].cold == u->cold)
				break;
		if (j < i)
			continue;
		for (a = 0; P->hot[a] != u->hot; a++)
			;
		for (b = 0; P->cold[b] != u->cold; b++)
			;
		for (k = 0; k < P->S; k++)
			sum += fin->q[HL_OPT_CELL(P, k, a, b)];
		if (sum > HL_OPT_QEPS)
			continue;
		back_at(P, fin, a, b, u->duty, &t, &dtac, &dhot);
		if (add_change(r, HL_OPT_DROPPED, u->duty, dtac, "%s - %s",
		    st->party[u->hot].name, st->party[u->cold].name) !=
		    HL_OK) {
			hl_opt_state_free(&t);
			return HL_EIO;
		}
		r->change[r->nchange - 1].d_hot = dhot;
	}
	hl_opt_state_free(&t);
	return HL_OK;
}

/* The energy and cost of removing each unit of the result (its heat to
 * the utilities), for the report: what each unit is worth. */
static hl_status
worth(const hl_opt_problem *P, const hl_opt_state *fin, hl_opt_result *r)
{
	hl_opt_state t;
	size_t m = P->S * P->nh * P->nc, i;
	hl_status st = HL_OK;

	if (hl_opt_state_init(P, &t) != HL_OK)
		return HL_EIO;
	for (i = 0; i < m && st == HL_OK; i++) {
		size_t a = (i / P->nc) % P->nh, b = i % P->nc;
		double q = fin->q[i];

		if (!(q > HL_OPT_QEPS))
			continue;
		hl_opt_state_copy(P, &t, fin);
		t.q[i] = 0.0;
		t.keep[i] = 0;
		hl_opt_eval_all(P, &t);
		/* The text names the pair; the writers add the duty in
		 * their units (display.h). */
		st = add_change(r, HL_OPT_WORTH, q, t.v > 1e-9 ? HUGE_VAL :
		    t.tac - fin->tac, "%s - %s",
		    P->base->party[P->hot[a]].name,
		    P->base->party[P->cold[b]].name);
	}
	hl_opt_state_free(&t);
	return st;
}

/* A cell's stream has no unit in stage k (hot row a or cold column b). */
static int
free_stage(const hl_opt_problem *P, const hl_opt_state *s, size_t k,
	   size_t a, size_t b)
{
	size_t x;

	for (x = 0; x < P->nc; x++)
		if (s->q[HL_OPT_CELL(P, k, a, x)] > HL_OPT_QEPS)
			return 0;
	for (x = 0; x < P->nh; x++)
		if (s->q[HL_OPT_CELL(P, k, x, b)] > HL_OPT_QEPS)
			return 0;
	return 1;
}

/* Each split of the result against series: every branch but the largest
 * moved to the nearest stage free on both its streams, the loads polished;
 * what that costs (or that it misses a limit) is why the split is there. */
static hl_status
splits_why(const hl_opt_problem *P, const hl_opt_state *fin,
	   hl_opt_result *r)
{
	hl_opt_state t;
	size_t k, p, x, nb, big, S = P->S;
	hl_status st = HL_OK;

	if (hl_opt_state_init(P, &t) != HL_OK)
		return HL_EIO;
	for (p = 0; p < P->nh + P->nc && st == HL_OK; p++) {
		int hot = p < P->nh;
		size_t n = hot ? P->nc : P->nh, sp = hot ? p : p - P->nh;

		for (k = 0; k < S && st == HL_OK; k++) {
			double qh0, qh1;

			nb = 0;
			big = 0;
			for (x = 0; x < n; x++) {
				size_t i = hot ? HL_OPT_CELL(P, k, sp, x) :
				    HL_OPT_CELL(P, k, x, sp);

				if (!(fin->q[i] > HL_OPT_QEPS))
					continue;
				if (nb++ == 0 || fin->q[i] > fin->q[big])
					big = i;
			}
			if (nb < 2)
				continue;
			hl_opt_state_copy(P, &t, fin);
			for (x = 0; x < n; x++) {
				size_t i = hot ? HL_OPT_CELL(P, k, sp, x) :
				    HL_OPT_CELL(P, k, x, sp);
				size_t a = (i / P->nc) % P->nh, b = i % P->nc, d;

				if (i == big || !(t.q[i] > HL_OPT_QEPS))
					continue;
				for (d = 1; d < S; d++) {
					size_t kk = k + d < S ? k + d : S;

					if (kk < S && free_stage(P, &t, kk, a, b))
						break;
					if (d <= k && free_stage(P, &t, k - d, a,
					    b)) {
						kk = k - d;
						break;
					}
				}
				if (d < S) {
					size_t kk = k + d < S && free_stage(P, &t,
					    k + d, a, b) ? k + d : k - d;

					t.q[HL_OPT_CELL(P, kk, a, b)] = t.q[i];
					t.q[i] = 0.0;
				}
			}
			hl_opt_eval_all(P, &t);
			hl_opt_polish(P, &t, 2000);
			qh0 = qh1 = 0.0;
			for (x = 0; x < P->nc; x++) {
				qh0 += fin->cend[x];
				qh1 += t.cend[x];
			}
			st = add_change(r, HL_OPT_SPLIT, qh1 - qh0, t.v > 1e-9 ?
			    HUGE_VAL : t.tac - fin->tac, "%s, %zu branches",
			    P->base->party[hot ? P->hot[sp] :
			    P->cold[sp]].name, nb);
		}
	}
	hl_opt_state_free(&t);
	return st;
}

/* Add "WHAT binds: without it [about] X a year (Y %) less" to r->binding
 * when tac is below the result's by more than 0.1 %. */
static void
add_binding(hl_opt_result *r, size_t *len, const char *what, int about,
	    double tac, double fin)
{
	if (!(tac < fin * (1.0 - 1e-3)))
		return;
	*len += (size_t)snprintf(r->binding + *len, *len < sizeof r->binding ?
	    sizeof r->binding - *len : 0, "%s%s binds: without it %s%.4g a "
	    "year (%.1f %%) less", *len > 0 ? "; " : "", what, about ?
	    "about " : "", fin - tac, 100.0 * (fin - tac) / fin);
	if (*len >= sizeof r->binding)
		*len = sizeof r->binding - 1;
}

/* Which limits bind: each limit set, relaxed, with a short walk from the
 * result; what it saves is what the limit costs. */
static void
binding(const hl_case *c, const hl_opt_options *o, const hl_opt_problem *P,
	const hl_opt_state *fin, hl_opt_result *r)
{
	static const char *const what[] = { "no splits", "the most branches "
	    "per split", "the smallest duty", "the smallest area", "the most "
	    "shells in series" };
	size_t k, len = 0;

	for (k = 0; k < 5; k++) {
		hl_opt_options x = *o;
		hl_opt_problem Q;
		hl_opt_state s, best;
		int capped = 0, on;

		on = k == 0 ? (o->no_splits || o->no_split != NULL) : k == 1 ?
		    o->max_branches > 0 : k == 2 ? o->min_duty > 0.0 : k == 3 ?
		    o->min_area > 0.0 : o->max_shells > 0;
		if (!on)
			continue;
		if (k == 2 && o->min_duty_auto && !isnan(r->relaxed_tac)) {
			/* the search ran without it: its own result is the
			 * cost without the limit */
			add_binding(r, &len, what[k], 0, r->relaxed_tac,
			    fin->tac);
			continue;
		}
		x.no_splits = k == 0 ? 0 : o->no_splits;
		x.no_split = k == 0 ? NULL : o->no_split;
		x.max_branches = k == 1 ? 0 : o->max_branches;
		x.min_duty = k == 2 ? 0.0 : o->min_duty;
		x.min_area = k == 3 ? 0.0 : o->min_area;
		x.max_shells = k == 4 ? 0 : o->max_shells;
		if (hl_opt_problem_init(&Q, c, &x, NULL) != HL_OK ||
		    Q.S != P->S || hl_opt_state_init(&Q, &s) != HL_OK) {
			hl_opt_problem_free(&Q);
			continue;
		}
		if (hl_opt_state_init(&Q, &best) == HL_OK) {
			/* the whole state (loads, branch weights, utilities
			 * inside streams): Q has P's layout */
			hl_opt_state_copy(&Q, &s, fin);
			hl_opt_eval_all(&Q, &s);
			hl_opt_walk(&Q, &s, &best, o->seed + 17 * k,
			    budget(P, o) / 40, 0.0, &capped);
			if (best.v <= 1e-9)
				add_binding(r, &len, what[k], 1, best.tac,
				    fin->tac);
			hl_opt_state_free(&best);
		}
		hl_opt_state_free(&s);
		hl_opt_problem_free(&Q);
	}
}

/* Whether net keeps the limits of o (splits, branches, duty, area,
 * shells): only then may it stand in for the search's result. */
static int
keeps_limits(const hl_opt_problem *P, const hl_network *net)
{
	const hl_opt_options *o = P->o;
	size_t i, j;

	for (i = 0; i < net->nunit; i++) {
		const hl_network_unit *u = &net->unit[i];
		int side;

		if (u->duty < hl_opt_min_duty_for(P, u->hot, u->cold) ||
		    u->area < o->min_area ||
		    (o->max_shells > 0 && u->shells > o->max_shells))
			return 0;
		for (side = 0; side < 2; side++) {
			size_t p = side == 0 ? u->hot : u->cold;
			int stage = side == 0 ? u->hot_stage : u->cold_stage;
			int n = 0;

			if (net->party[p].utility || p >= P->c->nstream)
				continue;
			for (j = 0; j < net->nunit; j++)
				n += (net->unit[j].hot == p &&
				    net->unit[j].hot_stage == stage) ||
				    (net->unit[j].cold == p &&
				    net->unit[j].cold_stage == stage);
			if ((n > 1 && P->nosplit[p]) ||
			    (o->max_branches > 0 && n > o->max_branches))
				return 0;
		}
	}
	return 1;
}

static hl_status
finish(const hl_case *c, const hl_opt_options *o, const hl_opt_problem *P,
       const hl_opt_state *fin, hl_opt_result *r, hl_error *err)
{
	hl_status st;

	int sized = o->start != NULL && !isnan(o->start->total_cost) &&
	    keeps_limits(P, o->start);

	if (fin->v > 1e-9) {
		if (!sized)
			return hl_error_set(err, HL_ENOSOLUTION, NULL, 0,
			    "no network found that keeps every limit (splits, "
			    "smallest duty or area, shells, match rules, the "
			    "utilities each stream may use): relax one");
		r->kept_start = 1;
	} else {
		st = hl_opt_to_network(P, fin, &r->net, err);
		if (st != HL_OK)
			return st;
		if (sized && !(r->net->total_cost <
		    o->start->total_cost)) {
			hl_network_free(r->net);
			r->net = NULL;
			r->kept_start = 1;
		}
	}
	if (r->kept_start) {
		r->net = clone(o->start, err);
		return r->net == NULL ? hl_error_nomem(err) : HL_OK;
	}
	if (dropped(P, fin, r) != HL_OK || worth(P, fin, r) != HL_OK ||
	    splits_why(P, fin, r) != HL_OK)
		return hl_error_nomem(err);
	binding(c, o, P, fin, r);
	return HL_OK;
}

hl_status
hl_network_optimise(const hl_case *c, const hl_opt_options *o,
		    hl_opt_result **out, hl_error *err)
{
	hl_opt_problem P;
	hl_opt_options relaxed;
	hl_opt_state fin;
	hl_opt_result *r = calloc(1, sizeof *r);
	double t0 = hl_opt_now();
	hl_status st;

	if (r == NULL)
		return hl_error_nomem(err);
	r->start_tac = o->start != NULL ? o->start->total_cost : NAN;
	r->relaxed_tac = NAN;
	st = hl_opt_problem_init(&P, c, o, err);
	if (st == HL_OK && P.nh + P.nc == 0)
		st = hl_error_set(err, HL_EINPUT, c->source, 0, "the case has "
		    "no process streams to design a network for");
	if (st == HL_OK && hl_opt_state_init(&P, &fin) != HL_OK)
		st = hl_error_nomem(err);
	if (st == HL_OK) {
		r->stages = P.S;
		st = o->min_duty_auto ? search_then_repair(&P, o, &relaxed,
		    &fin, r) : search(&P, o, &fin, r);
		if (st == HL_EIO)
			hl_error_nomem(err);
		if (st == HL_OK)
			st = finish(c, o->min_duty_auto ? &relaxed : o, &P,
			    &fin, r, err);
		hl_opt_state_free(&fin);
	}
	hl_opt_problem_free(&P);
	r->seconds = hl_opt_now() - t0;
	if (st != HL_OK) {
		hl_opt_result_free(r);
		return st;
	}
	*out = r;
	return HL_OK;
}
