/* match_milp.c - the fewest units, subnetwork by subnetwork.
 *
 * Method: Papoulias & Grossmann (1983), expanded transshipment MILP, solved
 * by GLPK's branch and bound after the root LP and an LP-based incumbent
 * (match_heur.c). Subnetworks that a required or duty-limited pair links
 * are solved together, so that "at least one unit" and "at most this duty"
 * hold over the pair's units on both sides of a pinch.
 */
#include <math.h>
#include <pthread.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "match_int.h"

void
hl_match_options_default(hl_match_options *o, const hl_case *c)
{
	memset(o, 0, sizeof *o);
	o->time_limit = 10.0;
	o->threads = 2;
	if (c != NULL && isfinite(c->set.time_limit) && c->set.time_limit >= 0.0)
		o->time_limit = c->set.time_limit;
}

/* ---- groups ---- */

static size_t
find_root(size_t *up, size_t s)
{
	while (up[s] != s)
		s = up[s] = up[up[s]];
	return s;
}

/* group[s]: the lowest subnetwork of s's group. Also refuses required
 * pairs that can work in no subnetwork. */
static hl_status
group_subs(const hl_match_problem *p, size_t *group, hl_error *err)
{
	size_t npair = p->nhot * p->ncold, s, pi;
	hl_match_sd *sd = calloc(p->nsub + 1, sizeof *sd);
	hl_status st = HL_OK;

	if (sd == NULL)
		return hl_error_nomem(err);
	for (s = 0; s < p->nsub; s++) {
		group[s] = s;
		if (hl_match_sd_init(p, s, NULL, 1, &sd[s]) != HL_OK)
			st = hl_error_nomem(err);
	}
	for (pi = 0; pi < npair && st == HL_OK; pi++) {
		const hl_match_pair *q = &p->pair[pi];
		size_t first = p->nsub, n = 0;

		if (!q->allowed || (!q->required && isinf(q->maxduty)))
			continue;
		for (s = 0; s < p->nsub; s++) {
			if (sd[s].U[pi] <= 0.0)
				continue;
			n++;
			if (first == p->nsub)
				first = s;
			else
				group[find_root(group, s)] = find_root(group, first);
		}
		if (q->required && n == 0)
			st = hl_error_set(err, HL_ENOSOLUTION, NULL, 0,
				"required match '%s'-'%s' cannot exchange heat "
				"at these utility loads: its heat would have to "
				"cross a pinch; drop the rule or change ΔTmin",
				p->party[p->hot[pi / p->ncold]].name,
				p->party[p->cold[pi % p->ncold]].name);
	}
	for (s = 0; s < p->nsub; s++) {
		group[s] = find_root(group, s);
		hl_match_sd_clear(&sd[s]);
	}
	/* Roots are the lowest member once every member points at one. */
	for (s = 0; s < p->nsub; s++) {
		size_t t;

		for (t = 0; t < s; t++)
			if (group[t] == group[s]) {
				group[s] = t;
				break;
			}
		if (t == s)
			group[s] = s;
	}
	free(sd);
	return st;
}

/* ---- the search ---- */

typedef struct {
	const hl_match_problem *p;
	const hl_match_options *o;
	hl_match_result *r;
	int msg_lev;
	size_t done, total;
	double *last;        /* time of the last progress report */
	pthread_mutex_t *lock; /* guards last, done and progress; NULL when
				  one thread solves everything */
} runner;

static void
lock(const runner *R)
{
	if (R->lock != NULL)
		pthread_mutex_lock(R->lock);
}

static void
unlock(const runner *R)
{
	if (R->lock != NULL)
		pthread_mutex_unlock(R->lock);
}

/* Report progress at most twice a second, from any stage of a group. */
static void
tick(const runner *R, const char *label, double t0, double incumbent,
     double bound)
{
	hl_match_progress pg;
	double now = hl_match_now();

	if (R->o->progress == NULL || R->last == NULL)
		return;
	lock(R);
	if (now - *R->last >= 0.5) {
		*R->last = now;
		pg.label = label;
		pg.done = R->done;
		pg.total = R->total;
		pg.elapsed = now - t0;
		pg.incumbent = incumbent;
		pg.bound = bound;
		R->o->progress(R->o->ctx, &pg);
	}
	unlock(R);
}

typedef struct {
	const runner *R;
	const double *x;     /* heuristic incumbent, NULL when none */
	double xobj;         /* its objective */
	int quiet;           /* no progress reports (a part's solve) */
	int given;
	double bound;
	double t0;
	const char *label;
} search;

static void
on_tree(glp_tree *T, void *info)
{
	search *s = info;
	int b;

	if (glp_ios_reason(T) == GLP_IHEUR && s->x != NULL && !s->given) {
		s->given = 1;
		glp_ios_heur_sol(T, s->x);
	}
	/* Node bounds only grow down the tree, so the best active bound is
	   a lower bound that never falls. */
	b = glp_ios_best_node(T);
	if (b != 0)
		s->bound = fmax(s->bound, glp_ios_node_bound(T, b));
	if (!s->quiet) {
		glp_prob *P = glp_ios_get_prob(T);
		int st = glp_mip_status(P);

		tick(s->R, s->label, s->t0, st == GLP_FEAS || st == GLP_OPT ?
		     glp_mip_obj_val(P) : s->x != NULL ? s->xobj : HUGE_VAL,
		     s->bound);
	}
}

/* Every row and column bound holds at x (GLPK takes a heuristic solution
 * on trust). */
static int
point_ok(glp_prob *P, const double *x)
{
	int i, j, n = glp_get_num_cols(P), m = glp_get_num_rows(P), len, k;
	int *ind = malloc((size_t)(n + 1) * sizeof *ind);
	double *val = malloc((size_t)(n + 1) * sizeof *val);
	int ok = ind != NULL && val != NULL;

	for (j = 1; j <= n && ok; j++) {
		double lo = glp_get_col_lb(P, j), hi = glp_get_col_ub(P, j);
		int t = glp_get_col_type(P, j);

		if (((t == GLP_LO || t == GLP_DB || t == GLP_FX) &&
		     x[j] < lo - 1e-9 * (1.0 + fabs(lo))) ||
		    ((t == GLP_UP || t == GLP_DB || t == GLP_FX) &&
		     x[j] > hi + 1e-9 * (1.0 + fabs(hi))))
			ok = 0;
		if (glp_get_col_kind(P, j) != GLP_CV && x[j] != floor(x[j]))
			ok = 0;
	}
	for (i = 1; i <= m && ok; i++) {
		double a = 0.0, lo = glp_get_row_lb(P, i), hi = glp_get_row_ub(P, i);
		double tol = 1e-7 * (1.0 + fmax(fabs(lo), fabs(hi)));
		int t = glp_get_row_type(P, i);

		len = glp_get_mat_row(P, i, ind, val);
		for (k = 1; k <= len; k++)
			a += val[k] * x[ind[k]];
		if (((t == GLP_LO || t == GLP_DB || t == GLP_FX) && a < lo - tol) ||
		    ((t == GLP_UP || t == GLP_DB || t == GLP_FX) && a > hi + tol))
			ok = 0;
	}
	free(ind);
	free(val);
	return ok;
}

static int
integral_costs(const hl_match_model_t *m)
{
	int j, n = glp_get_num_cols(m->P);

	for (j = 1; j <= n; j++) {
		double c = glp_get_obj_coef(m->P, j);

		if (c != floor(c))
			return 0;
	}
	return 1;
}

/* What one group's solve found. */
typedef struct {
	double *x;
	double obj, bound, seconds;
	int optimal;
} outcome;

static double
lower_bound(double v, int integral)
{
	return integral ? ceil(v - 1e-6) : v;
}

static void
read_mip(glp_prob *P, double *x)
{
	int j, n = glp_get_num_cols(P);

	for (j = 1; j <= n; j++)
		x[j] = glp_mip_col_val(P, j);
}

static hl_status
branch_and_bound(const runner *R, hl_match_model_t *m, search *s,
		 double deadline, int have, double hobj, outcome *out,
		 hl_error *err)
{
	glp_iocp parm;
	int ret, ms;
	double left = deadline - hl_match_now();

	glp_init_iocp(&parm);
	parm.msg_lev = R->msg_lev;
	parm.presolve = GLP_OFF;
	parm.tm_lim = left * 1000.0 > 2e9 ? 2000000000 :
		(int)fmax(1.0, ceil(left * 1000.0));
	parm.cb_func = on_tree;
	parm.cb_info = s;
	if (!m->textbook) {
		/* Pseudocost branching, best bound first; Gomory cuts and
		   proximity search (which improves the heuristic's incumbent)
		   did best on generated problems (tests/bench). */
		parm.br_tech = GLP_BR_PCH;
		parm.bt_tech = GLP_BT_BLB;
		parm.gmi_cuts = GLP_ON;
		parm.ps_heur = GLP_ON;
		parm.ps_tm_lim = (int)fmin(fmax(1000.0, 250.0 * left), 2e9);
	}
	ret = glp_intopt(m->P, &parm);
	ms = glp_mip_status(m->P);
	if (ms == GLP_OPT || ms == GLP_FEAS) {
		double obj = glp_mip_obj_val(m->P);

		if (!have || obj < hobj - 1e-9) {
			read_mip(m->P, out->x);
			out->obj = obj;
		}
		out->optimal = ms == GLP_OPT;
		if (ms == GLP_OPT)
			out->bound = out->obj;
		else
			out->bound = fmax(out->bound, s->bound);
		return HL_OK;
	}
	if (ms == GLP_NOFEAS)
		return hl_error_set(err, HL_ENOSOLUTION, NULL, 0,
			"no network meets the match rules in subnetwork %s",
			s->label);
	if (have)
		return HL_OK;
	return hl_error_set(err, HL_ENOSOLUTION, NULL, 0, ret == GLP_ETMLIM ?
		"no network found for subnetwork %s within the time limit; "
		"raise --time-limit" : "the MILP solver failed on subnetwork "
		"%s; run with --verbose to see GLPK's messages", s->label);
}

/* Root LP, heuristic (up to a third of the time), then branch and bound
 * until the deadline. */
static hl_status
search_group(const runner *R, hl_match_model_t *m, const char *label,
	     double deadline, int quiet, outcome *out, hl_error *err)
{
	const hl_match_problem *p = R->p;
	int integral = integral_costs(m), rc, have = 0;
	double t0 = hl_match_now(), hobj = HUGE_VAL;
	search s;

	rc = hl_match_simplex(m->P, R->msg_lev, 0.0);
	if (rc != 0)
		return hl_error_set(err, HL_ENOSOLUTION, NULL, 0, rc == 1 ?
			"no network meets the match rules in subnetwork %s" :
			"the LP relaxation failed in subnetwork %s; run with "
			"--verbose to see GLPK's messages", label);
	out->bound = lower_bound(glp_get_obj_val(m->P), integral);
	out->obj = HUGE_VAL;
	if (!m->textbook && hl_match_heuristic(p, m, t0 + (deadline - t0) / 3.0,
			out->bound, out->x, &hobj) == 0 &&
	    point_ok(m->P, out->x)) {
		have = 1;
		out->obj = hobj;
	}
	if (!quiet)
		tick(R, label, t0, hobj, out->bound);
	memset(&s, 0, sizeof s);
	s.R = R;
	s.x = have ? out->x : NULL;
	s.xobj = hobj;
	s.quiet = quiet;
	s.bound = out->bound;
	s.t0 = t0;
	s.label = label;
	rc = HL_OK;
	if (have && hobj <= out->bound + 1e-9)
		out->optimal = 1;
	else if (R->o->time_limit > 0.0 && hl_match_now() < deadline)
		rc = branch_and_bound(R, m, &s, deadline, have, hobj, out, err);
	else if (!have)
		rc = hl_error_set(err, HL_ENOSOLUTION, NULL, 0,
			"no network found for subnetwork %s within the time "
			"limit; raise --time-limit", label);
	out->bound = lower_bound(out->bound, integral);
	if (out->bound >= out->obj - 1e-9) {
		out->bound = out->obj;
		out->optimal = 1;
	}
	out->seconds = hl_match_now() - t0;
	return rc;
}

/* ---- parts of a subnetwork ---- */

#define MAX_REFINE 64   /* balanced subsets worth a solve each */

/* The parties in mask on their own (a small MILP): a proven lower bound on
 * their units (HUGE_VAL when they cannot be matched alone), and the best
 * network found, its units in *obj and its pairs in used[] (HUGE_VAL when
 * none). */
static double
part_solve(const runner *R, size_t sub, const unsigned char *mask,
	   double deadline, double *obj, unsigned char *used)
{
	hl_match_model_t m;
	outcome out;
	hl_error err;
	double lb = 0.0;
	size_t pi;

	*obj = HUGE_VAL;
	memset(&m, 0, sizeof m);
	memset(&out, 0, sizeof out);
	m.P = glp_create_prob();
	m.sd = calloc(1, sizeof *m.sd);
	if (m.sd != NULL && hl_match_sd_init(R->p, sub, mask, 0, &m.sd[0]) ==
	    HL_OK) {
		m.ns = 1;
		if (hl_match_alloc_cols(R->p, &m.sd[0]) == 0 &&
		    hl_match_build(R->p, 0, &m, &err) == HL_OK &&
		    (out.x = calloc((size_t)glp_get_num_cols(m.P) + 1,
				    sizeof *out.x)) != NULL) {
			hl_status st = search_group(R, &m, "part", deadline, 1,
						    &out, &err);

			lb = st == HL_OK ? out.bound : st == HL_ENOSOLUTION &&
				strstr(err.text, "no network meets") != NULL ?
				HUGE_VAL : 0.0;
			if (st == HL_OK && !isinf(out.obj)) {
				*obj = out.obj;
				for (pi = 0; pi < R->p->nhot * R->p->ncold; pi++)
					used[pi] = m.sd[0].ycol[pi] != 0 &&
						out.x[m.sd[0].ycol[pi]] > 0.5;
			}
		}
	}
	free(out.x);
	hl_match_model_clear(&m);
	glp_delete_prob(m.P);
	return lb;
}

typedef struct {
	double *lo, *hi;        /* per set: lower bound, units found */
	unsigned char *used;    /* per set: its pairs (npair each) */
	unsigned char *mask;
} parts;

static void
parts_free(parts *q)
{
	free(q->lo);
	free(q->hi);
	free(q->used);
	free(q->mask);
}

/* The pairs of the best partition of found networks, as the heuristic's
 * first candidate: a feasible network for the whole subnetwork. */
static void
seed_from_parts(const hl_match_problem *p, hl_match_sd *sd, const parts *q)
{
	uint32_t chosen[32];
	size_t n = 0, i, pi, npair = p->nhot * p->ncold;

	if (isinf(hl_match_partition_best(&sd->bal, q->hi, chosen, &n)))
		return;
	sd->seed = calloc(npair + 1, 1);
	for (i = 0; sd->seed != NULL && i < sd->bal.nset; i++) {
		size_t k;

		for (k = 0; k < n && sd->bal.set[i] != chosen[k]; k++)
			;
		if (k == n)
			continue;
		for (pi = 0; pi < npair; pi++)
			sd->seed[pi] |= q->used[i * npair + pi];
	}
}

/* Each balanced subset, solved alone, may need more than |set| - 1 units;
 * then every partition using it needs more too (match_bound.c). The parts'
 * own networks, put together along the best partition, seed the search.
 * Skipped with area penalties, whose objective is no unit count. */
static void
refine_bound(const runner *R, hl_match_sd *sd, double deadline)
{
	const hl_match_problem *p = R->p;
	const hl_match_balanced *b = &sd->bal;
	size_t i, j, npair = p->nhot * p->ncold;
	double t0 = hl_match_now();
	parts q;

	if (p->penalised || R->o->textbook || !b->complete || b->nset == 0 ||
	    b->nset > MAX_REFINE)
		return;
	q.lo = malloc(b->nset * sizeof *q.lo);
	q.hi = malloc(b->nset * sizeof *q.hi);
	q.used = calloc(b->nset * npair + 1, 1);
	q.mask = malloc(p->np + 1);
	if (q.lo == NULL || q.hi == NULL || q.used == NULL || q.mask == NULL) {
		parts_free(&q);
		return;
	}
	for (i = 0; i < b->nset; i++) {
		double size = hl_match_set_size(b->set[i]), left;

		q.lo[i] = size - 1.0;
		q.hi[i] = HUGE_VAL;
		left = (deadline - hl_match_now()) / (double)(b->nset - i);
		if (left <= 0.0)
			continue;
		memset(q.mask, 0, p->np);
		for (j = 0; j < b->n; j++)
			if (b->set[i] & (1u << j))
				q.mask[sd->bit[j]] = 1;
		q.lo[i] = fmax(q.lo[i], part_solve(R, sd->sub, q.mask,
			hl_match_now() + left, &q.hi[i], q.used + i * npair));
		tick(R, p->sub[sd->sub].label, t0, HUGE_VAL,
		     (double)sd->subset_bound);
	}
	sd->subset_bound = (size_t)fmax((double)sd->subset_bound,
		ceil(hl_match_partition_bound(b, q.lo,
					      (double)sd->nactive - 1.0) - 1e-9));
	seed_from_parts(p, sd, &q);
	parts_free(&q);
}

/* Model data of a group, with the bounds refined. */
static hl_status
prepare_group(const runner *R, const size_t *subs, size_t ns,
	      hl_match_model_t *m, double deadline, hl_error *err)
{
	size_t si;
	hl_status st = hl_match_model_init(R->p, subs, ns, m, err);

	for (si = 0; si < m->ns && st == HL_OK; si++)
		refine_bound(R, &m->sd[si], deadline);
	return st;
}

/* ---- results ---- */

/* One group of subnetworks to solve, with what it found. */
typedef struct {
	size_t *subs, ns;
	hl_match_result part;   /* its matches (nint, match, nmatch only) */
	size_t lower;           /* proven least units */
	double bound, seconds;
	int optimal;
	hl_status st;
	hl_error err;
} job;

static hl_status
record(const runner *R, const hl_match_model_t *m, const outcome *out,
       job *J, hl_error *err)
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
				R->p->sidx[mt->hot], R->p->sidx[mt->cold])].cost;
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
solve_group(const runner *R, job *J, hl_error *err)
{
	hl_match_model_t m;
	outcome out;
	hl_status st;
	double t0 = hl_match_now(), limit = R->o->time_limit * (double)J->ns;

	memset(&m, 0, sizeof m);
	memset(&out, 0, sizeof out);
	J->part.nint = R->p->nint;
	m.P = glp_create_prob();
	st = prepare_group(R, J->subs, J->ns, &m, t0 + limit / 4.0, err);
	if (st == HL_OK)
		st = hl_match_build(R->p, R->o->textbook, &m, err);
	if (st == HL_OK) {
		out.x = calloc((size_t)glp_get_num_cols(m.P) + 1, sizeof *out.x);
		if (out.x == NULL)
			st = hl_error_nomem(err);
	}
	if (st == HL_OK)
		st = search_group(R, &m, R->p->sub[J->subs[0]].label, t0 + limit,
				  0, &out, err);
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

typedef struct {
	runner *R;
	job *jobs;
	size_t njobs;
	size_t next;            /* the next job to take (under lock) */
	size_t cur;             /* the helper's job, for a crash */
	pthread_mutex_t mutex;
	pthread_t helper;
	int helper_running;
} pool;

static int
take(pool *pl, size_t *i)
{
	lock(pl->R);
	*i = pl->next++;
	unlock(pl->R);
	return *i < pl->njobs;
}

static void
run_jobs(pool *pl, int helper)
{
	size_t i;

	while (take(pl, &i)) {
		if (helper)
			pl->cur = i;
		hl_error_clear(&pl->jobs[i].err);
		pl->jobs[i].st = solve_group(pl->R, &pl->jobs[i],
					     &pl->jobs[i].err);
		lock(pl->R);
		pl->R->done++;
		unlock(pl->R);
	}
}

/* The second thread: its own GLPK environment and guard (GLPK keeps its
 * environment per thread). */
static void *
helper_main(void *arg)
{
	pool *pl = arg;
	const hl_match_options *o = pl->R->o;
	hl_glpk_guard g;

	pl->cur = pl->njobs;
	hl_glpk_guard_begin(&g, o->log, o->ctx, o->log != NULL);
	if (HL_GLPK_CRASHED(&g)) {
		job *J = &pl->jobs[pl->cur < pl->njobs ? pl->cur : 0];

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
threads(const runner *R, size_t njobs)
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
static void
join_helper(pool *pl)
{
	if (!pl->helper_running)
		return;
	pthread_join(pl->helper, NULL);
	pl->helper_running = 0;
	pl->R->lock = NULL;
	pthread_mutex_destroy(&pl->mutex);
}

static void
run_pool(pool *pl)
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
	join_helper(pl);
}

/* The jobs' matches into the result, in subnetwork order. */
static hl_status
merge(runner *R, pool *pl, hl_error *err)
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
		job *J = &pl->jobs[i];

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

static void
jobs_free(pool *pl)
{
	size_t i, k;

	for (i = 0; i < pl->njobs; i++) {
		job *J = &pl->jobs[i];

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
make_jobs(const hl_match_problem *p, pool *pl, hl_error *err)
{
	size_t *group = malloc((p->nsub + 1) * sizeof *group);
	size_t s, t;
	hl_status st;

	pl->jobs = calloc(p->nsub + 1, sizeof *pl->jobs);
	if (group == NULL || pl->jobs == NULL) {
		free(group);
		return hl_error_nomem(err);
	}
	st = group_subs(p, group, err);
	for (s = 0; s < p->nsub && st == HL_OK; s++) {
		job *J;

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

static hl_status
solve_all(runner *R, pool *pl, hl_error *err)
{
	hl_status st = make_jobs(R->p, pl, err);

	if (st != HL_OK)
		return st;
	R->total = pl->njobs;
	run_pool(pl);
	return merge(R, pl, err);
}

static hl_status
result_begin(const hl_match_problem *p, hl_match_result **out)
{
	hl_match_result *r = calloc(1, sizeof *r);
	size_t i;

	*out = r;
	if (r == NULL)
		return HL_EIO;
	r->party = calloc(p->np, sizeof *r->party);
	r->t = malloc((p->nint + 1) * sizeof *r->t);
	r->sub = calloc(p->nsub + 1, sizeof *r->sub);
	r->cause = calloc(p->ncause + 1, sizeof *r->cause);
	if (!r->party || !r->t || !r->sub || !r->cause)
		return HL_EIO;
	for (i = 0; i < p->np; i++) {
		r->party[i] = p->party[i];
		r->party[i].name = strdup(p->party[i].name);
		r->nparty++;
		if (r->party[i].name == NULL)
			return HL_EIO;
	}
	r->nint = p->nint;
	memcpy(r->t, p->t, (p->nint + 1) * sizeof *r->t);
	r->nsub = p->nsub;
	memcpy(r->sub, p->sub, p->nsub * sizeof *r->sub);
	r->ncause = p->ncause;
	memcpy(r->cause, p->cause, p->ncause * sizeof *r->cause);
	r->qh0 = p->qh0;
	r->qc0 = p->qc0;
	r->qh = p->qh;
	r->qc = p->qc;
	r->restricted = p->restricted;
	r->penalised = p->penalised;
	r->implicit_utilities = p->implicit;
	r->optimal = 1;
	return HL_OK;
}

static void
result_finish(hl_match_result *r)
{
	size_t i;

	for (i = 0; i < r->nsub; i++) {
		r->units += r->sub[i].units;
		r->euler += r->sub[i].euler;
		r->objective += r->sub[i].objective;
	}
	r->gap = r->objective > 0.0 ? fmax(0.0, (r->objective - r->bound) /
					   r->objective) : 0.0;
	for (i = 0; i < r->nsub; i++) {
		hl_match_sub *b = &r->sub[i];

		b->gap = b->objective > 0.0 && b->group == i &&
			b->bound > 0.0 ? fmax(0.0, (b->objective - b->bound) /
					      b->objective) : 0.0;
		if (b->optimal)
			b->gap = 0.0;
	}
	for (i = 0; i < r->nmatch; i++) {
		const hl_match *mt = &r->match[i];
		hl_match_party *h = &r->party[mt->hot], *c = &r->party[mt->cold];

		if (h->type == HL_PARTY_STREAM && c->type != HL_PARTY_STREAM)
			h->utility_duty += mt->duty;
		if (c->type == HL_PARTY_STREAM && h->type != HL_PARTY_STREAM)
			c->utility_duty += mt->duty;
	}
}

void
hl_match_result_free(hl_match_result *r)
{
	size_t i;

	if (r == NULL)
		return;
	for (i = 0; i < r->nparty; i++)
		free(r->party[i].name);
	for (i = 0; i < r->nmatch; i++) {
		free(r->match[i].give);
		free(r->match[i].take);
	}
	free(r->party);
	free(r->t);
	free(r->sub);
	free(r->match);
	free(r->cause);
	free(r);
}

static void
runner_free(runner *R, pool *pl)
{
	if (pl != NULL) {
		jobs_free(pl);
		free(pl);
	}
	if (R != NULL) {
		free(R->last);
		free(R);
	}
}

hl_status
hl_match_run(const hl_match_problem *p, const hl_match_options *o,
	     hl_match_result **out, hl_error *err)
{
	/* On the heap: both are changed after the jump point below. */
	runner *R = calloc(1, sizeof *R);
	pool *pl = calloc(1, sizeof *pl);
	hl_glpk_guard g;
	hl_status st;

	*out = NULL;
	if (R == NULL || pl == NULL || (R->last = malloc(sizeof *R->last)) ==
	    NULL || result_begin(p, &R->r) != HL_OK) {
		if (R != NULL)
			hl_match_result_free(R->r);
		runner_free(R, pl);
		return hl_error_nomem(err);
	}
	R->p = p;
	R->o = o;
	*R->last = hl_match_now();
	pl->R = R;
	hl_glpk_guard_begin(&g, o->log, o->ctx, o->log != NULL);
	if (HL_GLPK_CRASHED(&g)) {
		join_helper(pl);
		hl_match_result_free(R->r);
		runner_free(R, pl);
		return hl_glpk_guard_crash(&g, "the match MILP", err);
	}
	R->msg_lev = g.verbose ? GLP_MSG_ON : GLP_MSG_OFF;
	st = solve_all(R, pl, err);
	hl_glpk_guard_end(&g);
	if (st != HL_OK) {
		hl_match_result_free(R->r);
	} else {
		result_finish(R->r);
		*out = R->r;
	}
	runner_free(R, pl);
	return st;
}

hl_status
hl_match_solve(const hl_case *c, double dtmin, const double *util_load,
	       const hl_match_options *o, hl_match_result **out,
	       hl_error *err)
{
	hl_match_problem *p;
	hl_status st;

	*out = NULL;
	st = hl_match_prepare(c, dtmin, util_load, o->log, o->ctx, &p, err);
	if (st != HL_OK)
		return st;
	st = hl_match_run(p, o, out, err);
	hl_match_problem_free(p);
	return st;
}

hl_status
hl_match_model(const hl_match_problem *p, const hl_match_options *o,
	       glp_prob **out, hl_error *err)
{
	size_t *group = malloc((p->nsub + 1) * sizeof *group);
	size_t *subs = malloc((p->nsub + 1) * sizeof *subs);
	size_t s, t, n;
	hl_status st;
	glp_prob *P = glp_create_prob();
	runner R;

	*out = NULL;
	memset(&R, 0, sizeof R);
	R.p = p;
	R.o = o;
	R.msg_lev = GLP_MSG_OFF;
	glp_set_prob_name(P, "heatloom_matches");
	st = group == NULL || subs == NULL ? hl_error_nomem(err) :
		group_subs(p, group, err);
	for (s = 0; s < p->nsub && st == HL_OK; s++) {
		hl_match_model_t m;

		if (group[s] != s)
			continue;
		for (t = s, n = 0; t < p->nsub; t++)
			if (group[t] == s)
				subs[n++] = t;
		memset(&m, 0, sizeof m);
		m.P = P;
		st = prepare_group(&R, subs, n, &m, hl_match_now() +
				   o->time_limit * (double)n / 4.0, err);
		if (st == HL_OK)
			st = hl_match_build(p, o->textbook, &m, err);
		hl_match_model_clear(&m);
	}
	free(group);
	free(subs);
	if (st != HL_OK) {
		glp_delete_prob(P);
		return st;
	}
	*out = P;
	return HL_OK;
}
