/* utility_credit.c - the utility LP when a utility earns money (a negative
 * price: steam raised, heat sold): the transshipment model of Papoulias &
 * Grossmann (1983) with the heat split by origin, so that a credit can only
 * be earned on heat the process gives (or takes) and the LP stays bounded.
 *
 * Heat of three origins cascades on its own (R^P process, R^U priced hot
 * utilities, R^C credit hot utilities). In interval k:
 *
 *   P: R^P_k - R^P_k+1 + H_k + Σ_cold u coef·Q_u + xU_k + xC_k + zU_k = C_k
 *   U: R^U_k - R^U_k+1 + Σ_priced hot u coef·Q_u - xU_k - zU_k       = 0
 *   C: R^C_k - R^C_k+1 + Σ_credit hot u coef·Q_u - xC_k              = 0
 *      xU_k + xC_k <= C_k                 (the cold streams' demand)
 *      zU_k + Σ_priced cold u coef·Q_u <= 0  (U heat only to priced cold)
 *
 * H_k and C_k are the heat the hot and cold process streams give and take
 * in k; xU, xC the utility heat that reaches the cold streams; zU the
 * priced hot utility heat that goes to priced cold utilities. All cold
 * utilities take their heat from P except zU, so a credit cold utility
 * takes process heat only; credit hot heat reaches cold streams only.
 * Columns: R^P (nb), Q (nu), R^U (nb), R^C (nb), xU, xC, zU (nb - 1 each);
 * rows: P, U, C, demand, zU cap (nb - 1 each). */
#include <math.h>
#include <stdlib.h>

#include "utility_lp.h"
#include "utility_lp_int.h"

enum { R_P, R_U, R_C, R_DEM, R_Z };   /* row blocks */

int
hl_utility_credit_ncol(const model *m)
{
	return (int)(3 * m->nb + m->nu + 3 * (m->nb - 1));
}

int
hl_utility_credit_nrow(const model *m)
{
	return (int)(5 * (m->nb - 1));
}

static int
row(const model *m, int block, size_t k)
{
	return block * (int)(m->nb - 1) + (int)k + 1;
}

/* Column of R^P_b (o 0), R^U_b (o 1), R^C_b (o 2). */
static int
rcol(const model *m, int o, size_t b)
{
	return o == 0 ? (int)b + 1 : (int)(m->nb + m->nu + (size_t)(o - 1) *
					   m->nb + b) + 1;
}

/* Column of xU_k (o 0), xC_k (o 1), zU_k (o 2). */
static int
xcol(const model *m, int o, size_t k)
{
	return (int)(3 * m->nb + m->nu + (size_t)o * (m->nb - 1) + k) + 1;
}

typedef struct {
	int *ia, *ja;
	double *ar;
	int ne;
} entries;

static void
put(entries *e, int i, int j, double v)
{
	e->ne++;
	e->ia[e->ne] = i;
	e->ja[e->ne] = j;
	e->ar[e->ne] = v;
}

static int
credit_util(const model *m, size_t u)
{
	return m->c->util[u].price < 0.0;
}

/* The row block a utility's heat enters. */
static int
util_block(const model *m, size_t u)
{
	if (!is_hot(m, u))
		return R_P;
	return credit_util(m, u) ? R_C : R_U;
}

static void
cascade_entries(const model *m, entries *e)
{
	size_t k;
	int o;

	for (k = 0; k + 1 < m->nb; k++) {
		for (o = 0; o < 3; o++) {
			put(e, row(m, o, k), rcol(m, o, k), 1.0);
			put(e, row(m, o, k), rcol(m, o, k + 1), -1.0);
		}
		put(e, row(m, R_P, k), xcol(m, 0, k), 1.0);
		put(e, row(m, R_P, k), xcol(m, 1, k), 1.0);
		put(e, row(m, R_P, k), xcol(m, 2, k), 1.0);
		put(e, row(m, R_U, k), xcol(m, 0, k), -1.0);
		put(e, row(m, R_U, k), xcol(m, 2, k), -1.0);
		put(e, row(m, R_C, k), xcol(m, 1, k), -1.0);
		put(e, row(m, R_DEM, k), xcol(m, 0, k), 1.0);
		put(e, row(m, R_DEM, k), xcol(m, 1, k), 1.0);
		put(e, row(m, R_Z, k), xcol(m, 2, k), 1.0);
	}
}

static void
utility_entries(const model *m, entries *e)
{
	size_t u, k, k0, k1;

	for (u = 0; u < m->nu; u++) {
		int j = (int)(m->nb + u) + 1;

		rows_of(m, u, &k0, &k1);
		for (k = k0; k < k1; k++) {
			double a = coef(m, u, k);

			put(e, row(m, util_block(m, u), k), j, a);
			if (!is_hot(m, u) && !credit_util(m, u))
				put(e, row(m, R_Z, k), j, a);
		}
	}
}

static void
credit_bounds(glp_prob *P, const model *m)
{
	size_t k, b, u;
	int o;

	for (k = 0; k + 1 < m->nb; k++) {
		double dem = m->ck[k];

		glp_set_row_bnds(P, row(m, R_P, k), GLP_FX, dem - m->hk[k],
				 dem - m->hk[k]);
		glp_set_row_bnds(P, row(m, R_U, k), GLP_FX, 0.0, 0.0);
		glp_set_row_bnds(P, row(m, R_C, k), GLP_FX, 0.0, 0.0);
		glp_set_row_bnds(P, row(m, R_DEM, k), GLP_UP, 0.0, dem);
		glp_set_row_bnds(P, row(m, R_Z, k), GLP_UP, 0.0, 0.0);
		for (o = 0; o < 3; o++)
			glp_set_col_bnds(P, xcol(m, o, k), GLP_LO, 0.0, 0.0);
	}
	for (b = 0; b < m->nb; b++)
		for (o = 0; o < 3; o++)
			glp_set_col_bnds(P, rcol(m, o, b), b == 0 ||
					 b + 1 == m->nb ? GLP_FX : GLP_LO,
					 0.0, 0.0);
	for (u = 0; u < m->nu; u++) {
		int j = (int)(m->nb + u) + 1;

		if (!serves(m, u) || m->cap[u] == 0.0)
			glp_set_col_bnds(P, j, GLP_FX, 0.0, 0.0);
		else if (isinf(m->cap[u]))
			glp_set_col_bnds(P, j, GLP_LO, 0.0, 0.0);
		else
			glp_set_col_bnds(P, j, GLP_DB, 0.0, m->cap[u]);
		glp_set_obj_coef(P, j, m->c->util[u].price);
	}
}

int
hl_utility_credit_load(glp_prob *P, const model *m)
{
	size_t n = 16 * m->nb + 1, u, k0, k1;
	entries e;

	for (u = 0; u < m->nu; u++) {
		rows_of(m, u, &k0, &k1);
		n += 2 * (k1 - k0);
	}
	e.ia = malloc(n * sizeof *e.ia);
	e.ja = malloc(n * sizeof *e.ja);
	e.ar = malloc(n * sizeof *e.ar);
	e.ne = 0;
	if (e.ia == NULL || e.ja == NULL || e.ar == NULL) {
		free(e.ia);
		free(e.ja);
		free(e.ar);
		return 0;
	}
	cascade_entries(m, &e);
	utility_entries(m, &e);
	glp_load_matrix(P, e.ne, e.ia, e.ja, e.ar);
	credit_bounds(P, m);
	free(e.ia);
	free(e.ja);
	free(e.ar);
	return 1;
}
