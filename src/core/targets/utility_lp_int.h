/* utility_lp_int.h - what the utility LP's files share: the model of one
 * solve (boundaries, process heat per interval, utilities on them). */
#ifndef HL_UTILITY_LP_INT_H
#define HL_UTILITY_LP_INT_H

#include <stddef.h>

#include <glpk.h>

#include "case.h"

typedef struct {
	const hl_case *c;
	double dtmin;
	size_t nb;
	double *t;        /* boundaries, falling */
	double *dh;       /* process surplus of interval k, kW */
	double *hk, *ck;  /* heat the hot / cold process streams give / take
			     in interval k, kW (dh = hk - ck) */
	int credit;       /* some utility has a negative price */
	size_t nu;
	double *hi, *lo;  /* shifted ends of each utility */
	size_t *bhi, *blo;
	double *cap;      /* max_load, HUGE_VAL when unlimited */
	double pmax, pmin;       /* span of the process, shifted */
	double cold_min;         /* lowest shifted cold-stream temperature */
	double hot_max;          /* highest shifted hot-stream temperature */
	int hot_latent_max;      /* latent heat at hot_max (a cold utility
				    there can take it), likewise at */
	int cold_latent_min;     /* cold_min for a hot utility */
	double tol;
} model;

/* Shared helpers, with the module prefix in the library's symbol table. */
#define is_hot hl_utility_lp_is_hot
#define coef hl_utility_lp_coef
#define rows_of hl_utility_lp_rows_of
#define serves hl_utility_lp_serves

/* 1 when utility u heats the process. */
int is_hot(const model *m, size_t u);
/* Heat utility u adds to interval k per kW of load (negative: takes). */
double coef(const model *m, size_t u, size_t k);
/* First and one-past-last interval utility u touches. */
void rows_of(const model *m, size_t u, size_t *k0, size_t *k1);
/* 1 when utility u touches any interval. */
int serves(const model *m, size_t u);

/* With credits (a negative price), the model in three kinds of heat: heat
 * of the hot process streams, of the priced hot utilities and of the
 * credit hot utilities, each cascading on its own. A credit cold utility
 * takes only process heat and a credit hot utility gives only to cold
 * process streams, so the LP stays bounded: a credit can earn no more than
 * the process can give or take. Columns after the nb + nu of the plain
 * model; hl_utility_credit_ncol and _nrow give the sizes. */
int hl_utility_credit_ncol(const model *m);
int hl_utility_credit_nrow(const model *m);
/* Load the credit model into P (rows and columns already added), with its
 * bounds and costs; 0 when out of memory. */
int hl_utility_credit_load(glp_prob *P, const model *m);

#endif
