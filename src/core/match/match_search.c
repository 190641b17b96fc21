/* match_search.c - one group's search: root LP, first incumbent, then
 * GLPK's branch and bound (Papoulias & Grossmann 1983, expanded
 * transshipment MILP; the incumbent from match_heur.c), with progress
 * reports from every stage. */
#include <math.h>
#include <pthread.h>
#include <stdlib.h>
#include <string.h>

#include "match_int.h"

void
hl_match_lock(const hl_match_runner *R)
{
	if (R->lock != NULL)
		pthread_mutex_lock(R->lock);
}

void
hl_match_unlock(const hl_match_runner *R)
{
	if (R->lock != NULL)
		pthread_mutex_unlock(R->lock);
}

/* Report progress at most twice a second, from any stage of a group. */
void
hl_match_tick(const hl_match_runner *R, const char *label, double t0,
	      double incumbent, double bound)
{
	hl_match_progress pg;
	double now = hl_match_now();

	if (R->o->progress == NULL || R->last == NULL)
		return;
	hl_match_lock(R);
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
	hl_match_unlock(R);
}

typedef struct {
	const hl_match_runner *R;
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

		double inc = st == GLP_FEAS || st == GLP_OPT ?
			glp_mip_obj_val(P) : s->x != NULL ? s->xobj : HUGE_VAL;

		hl_match_tick(s->R, s->label, s->t0, inc, s->bound);
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
		double a = 0.0, lo = glp_get_row_lb(P, i);
		double hi = glp_get_row_ub(P, i);
		double tol = 1e-7 * (1.0 + fmax(fabs(lo), fabs(hi)));
		int t = glp_get_row_type(P, i);

		len = glp_get_mat_row(P, i, ind, val);
		for (k = 1; k <= len; k++)
			a += val[k] * x[ind[k]];
		int has_lo = t == GLP_LO || t == GLP_DB || t == GLP_FX;
		int has_hi = t == GLP_UP || t == GLP_DB || t == GLP_FX;

		if ((has_lo && a < lo - tol) || (has_hi && a > hi + tol))
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
branch_and_bound(const hl_match_runner *R, hl_match_model_t *m, search *s,
		 double deadline, int have, double hobj, hl_match_outcome *out,
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

/* Seconds the root LP may take: what is left of the subnetwork's time but
 * at least a second (a tiny limit still gets the heuristic's network of a
 * small problem), or, with time limit 0 (heuristic only),
 * HL_MATCH_ROOT_CAP. */
static double
root_limit(const hl_match_runner *R, double deadline)
{
	if (!(R->o->time_limit > 0.0))
		return HL_MATCH_ROOT_CAP;
	return fmax(deadline - hl_match_now(), 1.0);
}

/* Root LP, heuristic (up to half of the time: on generated 15 x 15 seed 1
 * and 12 x 12 seed 3 it then finds 31 and 33 units where a third gave 40
 * and 34; eight other sizes came out the same), then branch and bound until
 * the deadline. */
hl_status
hl_match_search(const hl_match_runner *R, hl_match_model_t *m,
		const char *label, double deadline, int quiet,
		hl_match_outcome *out, hl_error *err)
{
	const hl_match_problem *p = R->p;
	int integral = integral_costs(m), rc, have = 0;
	double t0 = hl_match_now(), hobj = HUGE_VAL;
	search s;

	/* Scaling cuts the root LP of a 40-stream problem from about 100 s to
	 * about 20 s (measured). */
	glp_scale_prob(m->P, GLP_SF_AUTO);
	rc = hl_match_simplex(m->P, R->msg_lev, root_limit(R, deadline));
	if (rc == 3)
		return hl_error_set(err, HL_ENOSOLUTION, NULL, 0, "subnetwork "
			"%s is too large to solve in the time limit: its LP "
			"relaxation alone (%d rows, %d columns) needs more; "
			"raise --time-limit, or give the streams plant areas "
			"and forbid cross-area matches, or forbid pairs that "
			"cannot be matched (match rules)", label,
			glp_get_num_rows(m->P), glp_get_num_cols(m->P));
	if (rc != 0)
		return hl_error_set(err, HL_ENOSOLUTION, NULL, 0, rc == 1 ?
			"no network meets the match rules in subnetwork %s" :
			"the LP relaxation failed in subnetwork %s; run with "
			"--verbose to see GLPK's messages", label);
	out->bound = lower_bound(glp_get_obj_val(m->P), integral);
	out->obj = HUGE_VAL;
	if (!m->textbook && hl_match_heuristic(p, m, t0 + (deadline - t0) / 2.0,
			out->bound, out->x, &hobj) == 0 &&
	    point_ok(m->P, out->x)) {
		have = 1;
		out->obj = hobj;
	}
	if (!quiet)
		hl_match_tick(R, label, t0, hobj, out->bound);
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

