/* match_pool.c - the groups of subnetworks as jobs, solved on one or two
 * threads (GLPK keeps its environment per thread), each collecting into
 * its own partial result, merged in subnetwork order. */
#include <math.h>
#include <pthread.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "match_int.h"

static hl_status
record(const hl_match_runner *R, const hl_match_model_t *m,
       const hl_match_outcome *out, hl_match_job *J, hl_error *err)
{
	hl_match_result *r = R->r;
	size_t si, i, lower_units = 0, units = 0;

	for (si = 0; si < m->ns; si++)
		lower_units += m->sd[si].subset_bound;
	if (!R->p->penalised)
		lower_units = (size_t)fmax((double)lower_units, out->bound);
	for (si = 0; si < m->ns; si++) {
		/* Each job writes only its own subnetworks. */
		hl_match_sub *b = &r->sub[m->sd[si].sub];
		const hl_match_pair *pair = R->p->pair;

		b->nparty = m->sd[si].nactive;
		b->euler = b->nparty > 0 ? b->nparty - 1 : 0;
		b->subset_bound = m->sd[si].subset_bound;
		b->units = 0;
		b->objective = 0.0;
		for (i = 0; i < J->part.nmatch; i++) {
			const hl_match *mt = &J->part.match[i];

			if (mt->sub != m->sd[si].sub)
				continue;
			b->units++;
			b->objective += pair[HL_MATCH_PAIR(R->p,
				R->p->sidx[mt->hot],
				R->p->sidx[mt->cold])].cost;
		}
		b->lower = m->ns == 1 ? lower_units : b->subset_bound;
		b->optimal = out->optimal;
		b->bound = m->ns == 1 ? out->bound : 0.0;
		b->seconds = out->seconds;
		b->group = m->sd[0].sub;
		units += b->units;
	}
	/* A proven bound above the network found means a wrong bound. */
	if (units < lower_units)
		return hl_error_set(err, HL_ENOSOLUTION, NULL, 0,
			"internal check failed: %zu units found below the "
			"proven bound %zu in subnetwork %s; please report this "
			"case", units, lower_units, r->sub[m->sd[0].sub].label);
	J->lower = lower_units;
	J->bound = out->bound;
	J->seconds = out->seconds;
	J->optimal = out->optimal;
	return HL_OK;
}

static hl_status
solve_group(const hl_match_runner *R, hl_match_job *J, hl_error *err)
{
	hl_match_model_t m;
	hl_match_outcome out;
	hl_status st;
	double t0 = hl_match_now(), limit = R->o->time_limit * (double)J->ns;

	memset(&m, 0, sizeof m);
	memset(&out, 0, sizeof out);
	J->part.nint = R->p->nint;
	m.P = glp_create_prob();
	st = hl_match_prepare_group(R, J->subs, J->ns, &m, t0 + limit / 4.0,
				    err);
	if (st == HL_OK)
		st = hl_match_build(R->p, R->o->textbook, &m, err);
	if (st == HL_OK) {
		out.x = calloc((size_t)glp_get_num_cols(m.P) + 1,
			       sizeof *out.x);
		if (out.x == NULL)
			st = hl_error_nomem(err);
	}
	if (st == HL_OK)
		st = hl_match_search(R, &m, R->p->sub[J->subs[0]].label,
				     t0 + limit, 0, &out, err);
	if (st == HL_OK)
		st = hl_match_loads(R->p, &m, out.x, R->msg_lev, &J->part, err);
	if (st == HL_OK)
		st = record(R, &m, &out, J, err);
	free(out.x);
	hl_match_model_clear(&m);
	glp_delete_prob(m.P);
	return st;
}

/* ---- the groups, on one or two threads ---- */


static int
take(hl_match_pool *pl, size_t *i)
{
	hl_match_lock(pl->R);
	*i = pl->next++;
	hl_match_unlock(pl->R);
	return *i < pl->njobs;
}

static void
run_jobs(hl_match_pool *pl, int helper)
{
	size_t i;

	while (take(pl, &i)) {
		if (helper)
			pl->cur = i;
		hl_error_clear(&pl->jobs[i].err);
		pl->jobs[i].st = solve_group(pl->R, &pl->jobs[i],
					     &pl->jobs[i].err);
		hl_match_lock(pl->R);
		pl->R->done++;
		hl_match_unlock(pl->R);
	}
}

/* The second thread: its own GLPK environment and guard (GLPK keeps its
 * environment per thread). */
static void *
helper_main(void *arg)
{
	hl_match_pool *pl = arg;
	const hl_match_options *o = pl->R->o;
	hl_glpk_guard g;

	pl->cur = pl->njobs;
	hl_glpk_guard_begin(&g, o->log, o->ctx, o->log != NULL);
	if (HL_GLPK_CRASHED(&g)) {
		hl_match_job *J = &pl->jobs[pl->cur < pl->njobs ? pl->cur : 0];

		J->st = hl_glpk_guard_crash(&g, "the match MILP", &J->err);
		return NULL;
	}
	run_jobs(pl, 1);
	hl_glpk_guard_end(&g);
	glp_free_env();
	return NULL;
}

/* Threads to use: the options' count, at most one per group and per
 * processor online. */
static int
threads(const hl_match_runner *R, size_t njobs)
{
	long cpus = sysconf(_SC_NPROCESSORS_ONLN);
	int n = R->o->threads < 1 ? 1 : R->o->threads;

	if (cpus > 0 && n > cpus)
		n = (int)cpus;
	if ((size_t)n > njobs)
		n = (int)njobs;
	return n > 2 ? 2 : n;
}

/* Wait for the helper (also after a GLPK crash of this thread). */
void
hl_match_join_helper(hl_match_pool *pl)
{
	if (!pl->helper_running)
		return;
	pthread_join(pl->helper, NULL);
	pl->helper_running = 0;
	pl->R->lock = NULL;
	pthread_mutex_destroy(&pl->mutex);
}

static void
run_pool(hl_match_pool *pl)
{
	if (threads(pl->R, pl->njobs) == 2 &&
	    pthread_mutex_init(&pl->mutex, NULL) == 0) {
		pl->R->lock = &pl->mutex;
		if (pthread_create(&pl->helper, NULL, helper_main, pl) == 0) {
			pl->helper_running = 1;
		} else {
			pl->R->lock = NULL;
			pthread_mutex_destroy(&pl->mutex);
		}
	}
	run_jobs(pl, 0);
	hl_match_join_helper(pl);
}

/* The jobs' matches into the result, in subnetwork order. */
static hl_status
merge(hl_match_runner *R, hl_match_pool *pl, hl_error *err)
{
	hl_match_result *r = R->r;
	size_t i, n = 0;

	for (i = 0; i < pl->njobs; i++) {
		if (pl->jobs[i].st != HL_OK) {
			if (err != NULL)
				*err = pl->jobs[i].err;
			return pl->jobs[i].st;
		}
		n += pl->jobs[i].part.nmatch;
	}
	r->match = calloc(n + 1, sizeof *r->match);
	if (r->match == NULL)
		return hl_error_nomem(err);
	for (i = 0; i < pl->njobs; i++) {
		hl_match_job *J = &pl->jobs[i];

		memcpy(r->match + r->nmatch, J->part.match,
		       J->part.nmatch * sizeof *r->match);
		r->nmatch += J->part.nmatch;
		free(J->part.match);
		J->part.match = NULL;
		J->part.nmatch = 0;
		r->lower += J->lower;
		r->bound += J->bound;
		r->seconds += J->seconds;
		if (!J->optimal)
			r->optimal = 0;
	}
	return HL_OK;
}

void
hl_match_jobs_free(hl_match_pool *pl)
{
	size_t i, k;

	for (i = 0; i < pl->njobs; i++) {
		hl_match_job *J = &pl->jobs[i];

		for (k = 0; k < J->part.nmatch; k++) {
			free(J->part.match[k].give);
			free(J->part.match[k].take);
		}
		free(J->part.match);
		free(J->subs);
	}
	free(pl->jobs);
}

static hl_status
make_jobs(const hl_match_problem *p, hl_match_pool *pl, hl_error *err)
{
	size_t *group = malloc((p->nsub + 1) * sizeof *group);
	size_t s, t;
	hl_status st;

	pl->jobs = calloc(p->nsub + 1, sizeof *pl->jobs);
	if (group == NULL || pl->jobs == NULL) {
		free(group);
		return hl_error_nomem(err);
	}
	st = hl_match_group_subs(p, group, err);
	for (s = 0; s < p->nsub && st == HL_OK; s++) {
		hl_match_job *J;

		if (group[s] != s)
			continue;
		J = &pl->jobs[pl->njobs++];
		J->subs = malloc((p->nsub + 1) * sizeof *J->subs);
		if (J->subs == NULL) {
			st = hl_error_nomem(err);
			break;
		}
		for (t = s; t < p->nsub; t++)
			if (group[t] == s)
				J->subs[J->ns++] = t;
	}
	free(group);
	return st;
}

hl_status
hl_match_solve_all(hl_match_runner *R, hl_match_pool *pl, hl_error *err)
{
	hl_status st = make_jobs(R->p, pl, err);

	if (st != HL_OK)
		return st;
	R->total = pl->njobs;
	run_pool(pl);
	return merge(R, pl, err);
}

