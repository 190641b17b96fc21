/* match_milp.c - the fewest units, subnetwork by subnetwork.
 *
 * Method: Papoulias & Grossmann (1983), expanded transshipment MILP, solved
 * by GLPK's branch and bound after the root LP and an LP-based incumbent
 * (match_heur.c). Subnetworks that a required or duty-limited pair links
 * are solved together, so that "at least one unit" and "at most this duty"
 * hold over the pair's units on both sides of a pinch.
 */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "match_int.h"

void
hl_match_options_default(hl_match_options *o, const hl_case *c)
{
	memset(o, 0, sizeof *o);
	o->time_limit = 10.0;
	o->threads = 2;
	if (c != NULL && isfinite(c->set.time_limit) &&
	    c->set.time_limit >= 0.0)
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
hl_status
hl_match_group_subs(const hl_match_problem *p, size_t *group, hl_error *err)
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
				group[find_root(group, s)] =
					find_root(group, first);
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
		hl_match_party *h = &r->party[mt->hot];
		hl_match_party *c = &r->party[mt->cold];

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
runner_free(hl_match_runner *R, hl_match_pool *pl)
{
	if (pl != NULL) {
		hl_match_jobs_free(pl);
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
	hl_match_runner *R = calloc(1, sizeof *R);
	hl_match_pool *pl = calloc(1, sizeof *pl);
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
		hl_match_join_helper(pl);
		hl_match_result_free(R->r);
		runner_free(R, pl);
		return hl_glpk_guard_crash(&g, "the match MILP", err);
	}
	R->msg_lev = g.verbose ? GLP_MSG_ON : GLP_MSG_OFF;
	st = hl_match_solve_all(R, pl, err);
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
	hl_match_runner R;

	*out = NULL;
	memset(&R, 0, sizeof R);
	R.p = p;
	R.o = o;
	R.msg_lev = GLP_MSG_OFF;
	glp_set_prob_name(P, "heatloom_matches");
	st = group == NULL || subs == NULL ? hl_error_nomem(err) :
		hl_match_group_subs(p, group, err);
	for (s = 0; s < p->nsub && st == HL_OK; s++) {
		hl_match_model_t m;

		if (group[s] != s)
			continue;
		for (t = s, n = 0; t < p->nsub; t++)
			if (group[t] == s)
				subs[n++] = t;
		memset(&m, 0, sizeof m);
		m.P = P;
		st = hl_match_prepare_group(&R, subs, n, &m, hl_match_now() +
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

