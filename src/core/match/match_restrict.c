/* match_restrict.c - restricted-match energy targets.
 *
 * Method: the transshipment LP of Papoulias & Grossmann (1983) without
 * binaries, with the utility loads free (within each utility's capacity) and
 * only the allowed pairs exchanging heat (restricted matches: Cerda &
 * Westerberg 1983). Stage 1 minimises the total hot utility; stage 2 keeps
 * that total and stays as close (in kW, summed) to the given loads as it can,
 * so loads that are still feasible come back unchanged. Each restriction's
 * share of the rise is the stage-1 target with all restrictions minus the
 * target with that one left out.
 */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "match_int.h"

typedef struct {
	glp_prob *P;
	int *lcol;   /* per party: load column (utilities), 0 none */
	int *qcol;   /* per pair and interval */
	int *rcol;   /* per hot index and interval: heat leaving it downwards */
} tlp;

static void
tlp_free(tlp *m)
{
	if (m->P != NULL)
		glp_delete_prob(m->P);
	free(m->lcol);
	free(m->qcol);
	free(m->rcol);
	memset(m, 0, sizeof *m);
}

static double
unit(const hl_match_problem *p, size_t i, size_t k)
{
	return p->unit[i * p->nint + k];
}

static size_t
first_unit(const hl_match_problem *p, size_t i)
{
	size_t k;

	for (k = 0; k < p->nint && unit(p, i, k) <= 0.0; k++)
		;
	return k;
}

static void
add_columns(const hl_match_problem *p, const hl_match_pair *pair, tlp *m)
{
	size_t i, a, b, k, nk = p->nint;

	for (i = 0; i < p->np; i++) {
		const hl_match_party *q = &p->party[i];
		double cap = HUGE_VAL;

		if (q->type == HL_PARTY_STREAM || first_unit(p, i) == nk)
			continue;
		if (q->type == HL_PARTY_UTILITY &&
		    !isnan(p->c->util[q->index].max_load))
			cap = p->c->util[q->index].max_load;
		m->lcol[i] = hl_match_add_col(m->P, GLP_CV, 0.0, cap,
					      q->kind == HL_HOT ? 1.0 : 0.0);
	}
	for (a = 0; a < p->nhot; a++) {
		size_t fa = first_unit(p, p->hot[a]);

		for (k = fa; k + 1 < nk; k++)
			m->rcol[a * nk + k] = hl_match_add_col(m->P, GLP_CV,
						0.0, HUGE_VAL, 0.0);
		for (b = 0; b < p->ncold; b++) {
			const hl_match_pair *q = &pair[HL_MATCH_PAIR(p, a, b)];

			if (!q->allowed)
				continue;
			for (k = fa; k < nk; k++)
				if (unit(p, p->cold[b], k) > 0.0)
					m->qcol[(a * p->ncold + b) * nk + k] =
						hl_match_add_col(m->P, GLP_CV,
							0.0, HUGE_VAL, 0.0);
		}
	}
}

/* Heat balance of every hot party and interval, demand of every cold one. */
static void
add_balances(const hl_match_problem *p, tlp *m, hl_match_mat *mat)
{
	size_t a, b, k, nk = p->nint;

	for (a = 0; a < p->nhot; a++) {
		size_t i = p->hot[a], fa = first_unit(p, i);
		int stream = p->party[i].type == HL_PARTY_STREAM;

		if (!stream && m->lcol[i] == 0)
			continue;
		for (k = fa; k < nk; k++) {
			double u = unit(p, i, k);
			int r = hl_match_add_row(m->P, GLP_FX, stream ? u : 0.0,
						 stream ? u : 0.0);

			hl_match_mat_add(mat, r, m->rcol[a * nk + k], 1.0);
			if (k > fa)
				hl_match_mat_add(mat, r, m->rcol[a * nk + k - 1],
						 -1.0);
			for (b = 0; b < p->ncold; b++)
				hl_match_mat_add(mat, r,
					m->qcol[(a * p->ncold + b) * nk + k], 1.0);
			if (!stream)
				hl_match_mat_add(mat, r, m->lcol[i], -u);
		}
	}
	for (b = 0; b < p->ncold; b++) {
		size_t j = p->cold[b];
		int stream = p->party[j].type == HL_PARTY_STREAM;

		for (k = 0; k < nk; k++) {
			double u = unit(p, j, k);
			int r;

			if (u <= 0.0 || (!stream && m->lcol[j] == 0))
				continue;
			r = hl_match_add_row(m->P, GLP_FX, stream ? u : 0.0,
					     stream ? u : 0.0);
			for (a = 0; a < p->nhot; a++)
				hl_match_mat_add(mat, r,
					m->qcol[(a * p->ncold + b) * nk + k], 1.0);
			if (!stream)
				hl_match_mat_add(mat, r, m->lcol[j], -u);
		}
	}
}

static void
add_max_duties(const hl_match_problem *p, const hl_match_pair *pair, tlp *m,
	       hl_match_mat *mat)
{
	size_t a, b, k, nk = p->nint;

	for (a = 0; a < p->nhot; a++)
		for (b = 0; b < p->ncold; b++) {
			const hl_match_pair *q = &pair[HL_MATCH_PAIR(p, a, b)];
			int r;

			if (!q->allowed || isinf(q->maxduty))
				continue;
			r = hl_match_add_row(m->P, GLP_UP, 0.0, q->maxduty);
			for (k = 0; k < nk; k++)
				hl_match_mat_add(mat, r,
					m->qcol[(a * p->ncold + b) * nk + k], 1.0);
		}
}

static hl_status
tlp_build(const hl_match_problem *p, const hl_match_pair *pair, tlp *m,
	  hl_error *err)
{
	size_t cells = p->nhot * p->ncold * p->nint;
	hl_match_mat mat = { 0 };

	memset(m, 0, sizeof *m);
	m->lcol = calloc(p->np, sizeof *m->lcol);
	m->qcol = calloc(cells + 1, sizeof *m->qcol);
	m->rcol = calloc(p->nhot * p->nint + 1, sizeof *m->rcol);
	if (m->lcol == NULL || m->qcol == NULL || m->rcol == NULL) {
		tlp_free(m);
		return hl_error_nomem(err);
	}
	m->P = glp_create_prob();
	glp_set_obj_dir(m->P, GLP_MIN);
	add_columns(p, pair, m);
	add_balances(p, m, &mat);
	add_max_duties(p, pair, m, &mat);
	if (hl_match_mat_load(&mat, m->P) != 0) {
		hl_match_mat_free(&mat);
		tlp_free(m);
		return hl_error_nomem(err);
	}
	hl_match_mat_free(&mat);
	return HL_OK;
}

/* A party whose every possible partner is forbidden, for the message. */
static hl_status
explain_infeasible(const hl_match_problem *p, const hl_match_pair *pair,
		   hl_error *err)
{
	size_t a, b;

	for (b = 0; b < p->ncold; b++) {
		int any = 0;

		for (a = 0; a < p->nhot; a++)
			any |= pair[HL_MATCH_PAIR(p, a, b)].allowed;
		if (!any)
			return hl_error_set(err, HL_ENOSOLUTION, NULL, 0,
				"no network meets the match rules: nothing "
				"may heat cold stream '%s'; allow at least one "
				"hot stream or utility for it",
				p->party[p->cold[b]].name);
	}
	for (a = 0; a < p->nhot; a++) {
		int any = 0;

		for (b = 0; b < p->ncold; b++)
			any |= pair[HL_MATCH_PAIR(p, a, b)].allowed;
		if (!any)
			return hl_error_set(err, HL_ENOSOLUTION, NULL, 0,
				"no network meets the match rules: nothing "
				"may cool hot stream '%s'; allow at least one "
				"cold stream or utility for it",
				p->party[p->hot[a]].name);
	}
	return hl_error_set(err, HL_ENOSOLUTION, NULL, 0,
		"no network meets the match rules and utility capacities, "
		"even with any amount of utility; relax a forbidden match or "
		"a maximum duty");
}

/* Stage 1: the least total hot utility with these pairs. */
static hl_status
min_hot(const hl_match_problem *p, const hl_match_pair *pair, double *qh,
	tlp *keep, hl_error *err)
{
	tlp m;
	hl_status st = tlp_build(p, pair, &m, err);
	int rc;

	if (st != HL_OK)
		return st;
	rc = hl_match_simplex(m.P, p->msg_lev, 0.0);
	if (rc == 1) {
		tlp_free(&m);
		return explain_infeasible(p, pair, err);
	}
	if (rc != 0) {
		tlp_free(&m);
		return hl_error_set(err, HL_ENOSOLUTION, NULL, 0,
			"the restricted-match targets LP failed (numerical "
			"trouble); run with --verbose to see GLPK's messages");
	}
	*qh = glp_get_obj_val(m.P);
	if (keep != NULL)
		*keep = m;
	else
		tlp_free(&m);
	return HL_OK;
}

/* Stage 2: hot total at most cap, loads as near the given ones as can be:
 * L - d+ + d- = given, minimise the sum of d+ and d-. */
static hl_status
nearest_loads(hl_match_problem *p, tlp *m, double cap, hl_error *err)
{
	int *ind = malloc((p->np + 1) * sizeof *ind);
	double *val = malloc((p->np + 1) * sizeof *val);
	int j, n = glp_get_num_cols(m->P), len = 0, r;
	size_t i;

	if (ind == NULL || val == NULL) {
		free(ind);
		free(val);
		return hl_error_nomem(err);
	}
	for (j = 1; j <= n; j++)
		glp_set_obj_coef(m->P, j, 0.0);
	for (i = 0; i < p->np; i++) {
		int lc = m->lcol[i], cols[4];
		double vals[4] = { 0.0, 1.0, -1.0, 1.0 };
		double g = p->party[i].given_load;

		if (lc == 0)
			continue;
		if (p->party[i].kind == HL_HOT) {
			ind[++len] = lc;
			val[len] = 1.0;
		}
		cols[1] = lc;
		cols[2] = hl_match_add_col(m->P, GLP_CV, 0.0, HUGE_VAL, 1.0);
		cols[3] = hl_match_add_col(m->P, GLP_CV, 0.0, HUGE_VAL, 1.0);
		r = hl_match_add_row(m->P, GLP_FX, g, g);
		glp_set_mat_row(m->P, r, 3, cols, vals);
	}
	r = hl_match_add_row(m->P, GLP_UP, 0.0, cap);
	glp_set_mat_row(m->P, r, len, ind, val);
	free(ind);
	free(val);
	if (hl_match_simplex(m->P, p->msg_lev, 0.0) != 0)
		return hl_error_set(err, HL_ENOSOLUTION, NULL, 0,
			"the restricted-match targets LP failed (numerical "
			"trouble); run with --verbose to see GLPK's messages");
	for (i = 0; i < p->np; i++)
		if (p->party[i].type != HL_PARTY_STREAM)
			p->party[i].load = m->lcol[i] ? fmax(0.0,
				glp_get_col_prim(m->P, m->lcol[i])) : 0.0;
	return HL_OK;
}

static size_t
count_rule_pairs(const hl_match_problem *p, long r)
{
	size_t a, b, n = 0;

	for (a = 0; a < p->nhot; a++)
		for (b = 0; b < p->ncold; b++) {
			const hl_match_pair *q = &p->pair[HL_MATCH_PAIR(p, a, b)];
			const hl_match_rule *rule;

			if (!q->potential)
				continue;
			if (r < 0) {
				n += q->cross;
				continue;
			}
			rule = &p->c->rule[r];
			if ((strcmp(rule->hot, "*") == 0 ||
			     strcmp(rule->hot, p->party[p->hot[a]].name) == 0) &&
			    (strcmp(rule->cold, "*") == 0 ||
			     strcmp(rule->cold, p->party[p->cold[b]].name) == 0))
				n++;
		}
	return n;
}

static hl_status
list_causes(hl_match_problem *p, hl_error *err)
{
	size_t r, n = p->c->nrule;
	int areas = p->c->set.area_policy != HL_AREAS_ALLOW;

	p->cause = calloc(n + 1, sizeof *p->cause);
	if (p->cause == NULL)
		return hl_error_nomem(err);
	for (r = 0; r < n; r++) {
		p->cause[p->ncause].rule = (long)r;
		p->cause[p->ncause].pairs = count_rule_pairs(p, (long)r);
		p->ncause++;
	}
	if (areas) {
		p->cause[p->ncause].rule = -1;
		p->cause[p->ncause].pairs = count_rule_pairs(p, -1);
		p->ncause++;
	}
	return HL_OK;
}

static int
restricts(const hl_match_problem *p)
{
	size_t i;

	for (i = 0; i < p->nhot * p->ncold; i++)
		if (p->pair[i].potential &&
		    (!p->pair[i].allowed || !isinf(p->pair[i].maxduty)))
			return 1;
	return 0;
}

/* Each forbidding or limiting restriction's share of the rise. */
static hl_status
attribute(hl_match_problem *p, double qh_all, hl_error *err)
{
	hl_match_pair *pair = malloc((p->nhot * p->ncold + 1) * sizeof *pair);
	size_t i;
	hl_status st = HL_OK;

	if (pair == NULL)
		return hl_error_nomem(err);
	for (i = 0; i < p->ncause && st == HL_OK; i++) {
		hl_match_cause *cs = &p->cause[i];
		double qh;

		if (cs->pairs == 0 || (cs->rule >= 0 &&
		    p->c->rule[cs->rule].kind == HL_RULE_REQUIRE) ||
		    (cs->rule < 0 && p->c->set.area_policy != HL_AREAS_FORBID))
			continue;
		st = hl_match_rules(p, cs->rule >= 0 ? cs->rule : -2, pair, err);
		if (st == HL_OK)
			st = min_hot(p, pair, &qh, NULL, err);
		if (st == HL_ENOSOLUTION) {
			/* Still infeasible without it: no share of its own. */
			hl_error_clear(err);
			st = HL_OK;
			continue;
		}
		if (st == HL_OK)
			cs->rise = fmax(0.0, qh_all - qh);
	}
	free(pair);
	return st;
}

hl_status
hl_match_restrict(hl_match_problem *p, hl_error *err)
{
	double qh, tol;
	size_t i;
	tlp m;
	hl_status st = list_causes(p, err);

	if (st != HL_OK || !restricts(p))
		return st;
	st = min_hot(p, p->pair, &qh, &m, err);
	if (st != HL_OK)
		return st;
	tol = 1e-7 * fmax(1.0, p->qh0 + p->qc0 + qh);
	st = nearest_loads(p, &m, fmax(qh, p->qh0) + tol, err);
	tlp_free(&m);
	if (st != HL_OK)
		return st;
	p->qh = p->qc = 0.0;
	for (i = 0; i < p->np; i++) {
		if (p->party[i].type == HL_PARTY_STREAM)
			continue;
		if (p->party[i].kind == HL_HOT)
			p->qh += p->party[i].load;
		else
			p->qc += p->party[i].load;
	}
	p->restricted = qh > p->qh0 + tol;
	if (p->restricted)
		st = attribute(p, qh, err);
	return st;
}
