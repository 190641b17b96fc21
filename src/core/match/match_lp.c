/* match_lp.c - small GLPK helpers of the match module. */
#include <math.h>
#include <stdlib.h>
#include <time.h>

#include "match_int.h"

double
hl_match_now(void)
{
	struct timespec ts;

	clock_gettime(CLOCK_MONOTONIC, &ts);
	return (double)ts.tv_sec + 1e-9 * (double)ts.tv_nsec;
}

void
hl_match_mat_add(hl_match_mat *m, int row, int col, double v)
{
	/* Column 0 is an absent variable: no term. */
	if (m->failed || v == 0.0 || row == 0 || col == 0)
		return;
	if (m->n + 1 >= m->cap) {
		size_t cap = m->cap ? 2 * m->cap : 1024;
		int *ia = realloc(m->ia, cap * sizeof *ia);
		int *ja = ia ? realloc(m->ja, cap * sizeof *ja) : NULL;
		double *ar = ja ? realloc(m->ar, cap * sizeof *ar) : NULL;

		if (ia != NULL)
			m->ia = ia;
		if (ja != NULL)
			m->ja = ja;
		if (ar == NULL) {
			m->failed = 1;
			return;
		}
		m->ar = ar;
		m->cap = cap;
	}
	m->n++;
	m->ia[m->n] = row;
	m->ja[m->n] = col;
	m->ar[m->n] = v;
}

int
hl_match_mat_load(hl_match_mat *m, glp_prob *P)
{
	int j, n = glp_get_num_cols(P), len, k;

	/* glp_load_matrix replaces the matrix: keep what P already holds. */
	if (glp_get_num_nz(P) > 0 && !m->failed) {
		int *ind = malloc((size_t)(glp_get_num_rows(P) + 1) * sizeof *ind);
		double *val = malloc((size_t)(glp_get_num_rows(P) + 1) *
				     sizeof *val);

		if (ind == NULL || val == NULL)
			m->failed = 1;
		for (j = 1; j <= n && !m->failed; j++) {
			len = glp_get_mat_col(P, j, ind, val);
			for (k = 1; k <= len; k++)
				hl_match_mat_add(m, ind[k], j, val[k]);
		}
		free(ind);
		free(val);
	}
	if (m->failed)
		return -1;
	if (m->n > 0)
		glp_load_matrix(P, (int)m->n, m->ia, m->ja, m->ar);
	return 0;
}

void
hl_match_mat_free(hl_match_mat *m)
{
	free(m->ia);
	free(m->ja);
	free(m->ar);
	m->ia = m->ja = NULL;
	m->ar = NULL;
	m->n = m->cap = 0;
}

static int
bounds_type(double lo, double hi)
{
	if (isinf(lo) && isinf(hi))
		return GLP_FR;
	if (isinf(hi))
		return GLP_LO;
	if (isinf(lo))
		return GLP_UP;
	return lo == hi ? GLP_FX : GLP_DB;
}

int
hl_match_add_col(glp_prob *P, int kind, double lo, double hi, double obj)
{
	int j = glp_add_cols(P, 1);

	glp_set_col_kind(P, j, kind);
	glp_set_col_bnds(P, j, bounds_type(lo, hi), isinf(lo) ? 0.0 : lo,
			 isinf(hi) ? 0.0 : hi);
	glp_set_obj_coef(P, j, obj);
	return j;
}

int
hl_match_add_row(glp_prob *P, int type, double lo, double hi)
{
	int i = glp_add_rows(P, 1);

	glp_set_row_bnds(P, i, type, lo, hi);
	return i;
}

int
hl_match_simplex(glp_prob *P, int msg_lev, double limit)
{
	glp_smcp parm;
	int ret, st;

	glp_init_smcp(&parm);
	parm.msg_lev = msg_lev;
	if (limit > 0.0)
		parm.tm_lim = limit * 1000.0 > 2e9 ? 2000000000 :
			(int)ceil(limit * 1000.0);
	ret = glp_simplex(P, &parm);
	if (ret == GLP_EBADB || ret == GLP_ESING || ret == GLP_ECOND ||
	    ret == GLP_EFAIL) {
		glp_adv_basis(P, 0);
		ret = glp_simplex(P, &parm);
	}
	if (ret == GLP_ETMLIM)
		return 3;
	if (ret != 0)
		return 2;
	st = glp_get_status(P);
	if (st == GLP_OPT)
		return 0;
	if (st == GLP_NOFEAS)
		return 1;
	return 2;
}
