/* sensitivity_cost.c - one-sided derivatives of the utility LP's optimum.
 *
 * The model. The transshipment LP of utility_lp.c (Papoulias & Grossmann
 * 1983) written in cumulative form: with loads Q_u, the heat flowing down
 * through a shifted temperature t is
 *
 *	h(t) = R(t) + Σ_u σ_u·F_u(t)·Q_u,
 *
 * R(t) the process surplus above t (sensitivity.c), σ_u = +1 for a hot and
 * −1 for a cold utility, F_u(t) the fraction of u's heat exchanged above t
 * (for an isothermal level a step, for a range the part of the range above
 * t). h is linear between the ends of segments and utilities, so the LP is
 *
 *	V = min Σ p_u·Q_u  s.t.  h(t_e) >= 0 at every end e,
 *	    Σ_u σ_u·Q_u = −R(−∞),  0 <= Q_u <= max_load_u,
 *
 * one row per end (coinciding ends keep a row each), the same optimum as the
 * interval form. A datum x moves R, the ends t_e (a supply temperature is
 * an end) and, through them, F_u(t_e): both the right-hand sides β_e =
 * −R(t_e) and the coefficients a_eu = σ_u·F_u(t_e) depend on x.
 *
 * The derivative. Along a direction d, for a step s -> 0+, every row is a
 * smooth function of s once its coefficients take their values just after
 * the step (an isothermal step function switched the way the end crosses
 * the level: this only weakens a row that duplicates the level's own row,
 * so V is unchanged). The one-sided derivative of an LP whose matrix and
 * right-hand side move is then (Mills 1956, "Marginal values of matrix
 * games and linear programs", Annals of Math. Studies 38, 183-193; see also
 * Freund 1985, Math. Programming Study 24, 1-13)
 *
 *	V'(d) = min_{Q ∈ X*} max_{y ∈ Y*} Σ_e y_e·(β_e' − a_e'·Q),
 *
 * over the primal and dual optimal faces X*, Y*. Y* is the set of dual
 * solutions complementary to a point of the relative interior of X*; the
 * inner maximum, dualised (LP duality, Bertsimas & Tsitsiklis, Introduction
 * to Linear Optimization, 1997, ch. 4-5), is min p·δ over the directions δ
 * that keep the rows active on all of X* satisfied to first order,
 * a_e·δ + a_e'·Q >= β_e', with the sign of δ_u fixed where all of X* sits on
 * a bound. Together with Q ∈ X* this is one LP (no finite step). When no
 * coefficient moves (a_e' = 0) it is the classical max over the dual face of
 * y·β'. Three LPs per direction: the optimum V, a point of X* where every
 * row that can be slack is (the largest sum of capped slacks), and the
 * derivative LP. A derivative LP without a feasible point means the step
 * leaves the utilities unable to serve: +inf.
 */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include <glpk.h>

#include "glpk_guard.h"
#include "sensitivity_int.h"

/* A utility on the shifted scale, with the velocity of its ends. */
typedef struct {
	double hi, lo;
	double vhi, vlo;
	double price, cap;  /* cap HUGE_VAL when unlimited */
	int hot, iso;
	int col;            /* its column among the serving utilities, or -1 */
} ucol;

/* A row position: a segment or utility end, and its velocity. */
typedef struct {
	double t, vt;
	long g;             /* flat segment, -1 for a utility end */
	int lo;
	long u;             /* utility, -1 for a segment end */
} rowpos;

typedef struct {
	const hl_case *c;
	hl_sens_work w;
	size_t nu, ncol;    /* utilities, serving ones */
	ucol *u;
	size_t nrow;        /* ends; the balance row comes after them */
	rowpos *pos;
	double *beta, *dbeta;   /* nrow + 1 */
	double *a, *da;         /* (nrow + 1) × ncol */
	double scale;       /* kW: Σ |segment duty| + 1 */
	double pmax;
	double tlim;
} costlp;

static void
costlp_free(costlp *m)
{
	hl_sens_work_free(&m->w);
	free(m->u);
	free(m->pos);
	free(m->beta);
	free(m->dbeta);
	free(m->a);
	free(m->da);
}

/* Utilities on the shifted scale; which of them can carry load at all (as
 * utility_lp.c decides: an isothermal hot level needs an end below it, a
 * cold one an end above it; max_load 0 carries none). */
static void
place_utilities(costlp *m)
{
	size_t u, e;

	for (u = 0; u < m->nu; u++) {
		const hl_utility *x = &m->c->util[u];
		double sh = hl_utility_shift(x, m->w.dtmin);
		ucol *q = &m->u[u];

		sh = x->kind == HL_HOT ? -sh : sh;
		q->hi = fmax(x->supply, x->target) + sh;
		q->lo = fmin(x->supply, x->target) + sh;
		q->hot = x->kind == HL_HOT;
		q->iso = q->hi == q->lo;
		q->price = x->price;
		q->cap = isnan(x->max_load) ? HUGE_VAL : x->max_load;
		m->pmax = fmax(m->pmax, fabs(x->price));
	}
	for (u = 0; u < m->nu; u++) {
		ucol *q = &m->u[u];
		int serves = !q->iso;
		size_t v;

		for (e = 0; !serves && e < m->nrow; e++)
			serves = q->hot ? m->pos[e].t < q->hi :
					  m->pos[e].t > q->hi;
		for (v = 0; !serves && v < m->nu; v++)
			serves = q->hot ? m->u[v].lo < q->hi : m->u[v].hi > q->hi;
		q->col = serves && q->cap > 0.0 ? (int)m->ncol++ : -1;
	}
}

static hl_status
costlp_init(costlp *m, const hl_case *c, double dtmin, hl_error *err)
{
	size_t i, e = 0, u, nr;
	hl_status st;

	memset(m, 0, sizeof *m);
	m->c = c;
	m->nu = c->nutil;
	m->tlim = c->set.time_limit;
	st = hl_sens_work_init(&m->w, c, dtmin, err);
	if (st != HL_OK)
		return st;
	nr = 2 * m->w.n + 2 * m->nu;
	m->u = calloc(m->nu + 1, sizeof *m->u);
	m->pos = calloc(nr + 1, sizeof *m->pos);
	if (m->u == NULL || m->pos == NULL)
		return hl_error_nomem(err);
	for (i = 0; i < m->w.n; i++) {
		m->pos[e].g = (long)i, m->pos[e].u = -1, m->pos[e].lo = 0;
		m->pos[e++].t = m->w.g[i].hi;
		m->pos[e].g = (long)i, m->pos[e].u = -1, m->pos[e].lo = 1;
		m->pos[e++].t = m->w.g[i].lo;
		m->scale += m->w.g[i].cp * (m->w.g[i].hi - m->w.g[i].lo);
	}
	m->scale += 1.0;
	m->nrow = e;
	place_utilities(m);
	for (u = 0; u < m->nu; u++) {
		m->pos[e].g = -1, m->pos[e].u = (long)u, m->pos[e].lo = 0;
		m->pos[e++].t = m->u[u].hi;
		if (m->u[u].iso)
			continue;
		m->pos[e].g = -1, m->pos[e].u = (long)u, m->pos[e].lo = 1;
		m->pos[e++].t = m->u[u].lo;
	}
	m->nrow = e;
	m->beta = calloc(e + 1, sizeof *m->beta);
	m->dbeta = calloc(e + 1, sizeof *m->dbeta);
	m->a = calloc((e + 1) * (m->ncol + 1), sizeof *m->a);
	m->da = calloc((e + 1) * (m->ncol + 1), sizeof *m->da);
	if (!m->beta || !m->dbeta || !m->a || !m->da)
		return hl_error_nomem(err);
	return HL_OK;
}

/* σ_u·F_u at t just after a step s (t moving at vt), and its derivative. */
static void
fraction(const ucol *q, double t, double vt, double s, double *f,
	 double *df)
{
	double sg = q->hot ? 1.0 : -1.0;

	if (q->iso) {
		double rel = s * (vt - q->vhi);

		if (t != q->hi)
			*f = t < q->hi;
		else /* a hot level heats below itself, a cold one cools
			at and above itself: utility_lp.c's convention */
			*f = q->hot ? rel < 0.0 : rel <= 0.0;
		*df = 0.0;
	} else {
		hl_sens_flat g = { 1.0, q->hi, q->lo, 1.0 };
		double span = q->hi - q->lo, ph = hl_sens_phi(&g, t);
		double dph = hl_sens_dphi(&g, t, s * q->vhi, s * q->vlo, s * vt);

		*f = ph / span;
		*df = (dph * span - ph * s * (q->vhi - q->vlo)) / (span * span);
	}
	*f *= sg;
	*df *= sg;
}

/* −R(t) at an end and its one-sided derivative along s·d. */
static void
surplus_row(const costlp *m, double t, double vt, double s, double *beta,
	    double *dbeta)
{
	double r = 0.0;
	size_t i;

	for (i = 0; i < m->w.n; i++)
		r += m->w.g[i].sign * m->w.g[i].cp * hl_sens_phi(&m->w.g[i], t);
	*beta = -r;
	*dbeta = -hl_sens_surplus_dir(&m->w, t, vt, s);
}

/* Every row's data for the direction s·d (the velocities already set). */
static void
fill_rows(costlp *m, double s)
{
	size_t e, u, nc = m->ncol;
	double tot = 0.0;

	for (e = 0; e < m->nrow; e++) {
		rowpos *p = &m->pos[e];

		if (p->g >= 0)
			p->vt = p->lo ? m->w.d[p->g].dlo : m->w.d[p->g].dhi;
		else
			p->vt = p->lo ? m->u[p->u].vlo : m->u[p->u].vhi;
		surplus_row(m, p->t, p->vt, s, &m->beta[e], &m->dbeta[e]);
		for (u = 0; u < m->nu; u++)
			if (m->u[u].col >= 0)
				fraction(&m->u[u], p->t, p->vt, s,
					 &m->a[e * nc + m->u[u].col],
					 &m->da[e * nc + m->u[u].col]);
	}
	for (e = 0; e < m->w.n; e++)
		tot += m->w.g[e].sign * m->w.g[e].cp *
		       (m->w.g[e].hi - m->w.g[e].lo);
	m->beta[m->nrow] = -tot;
	m->dbeta[m->nrow] = -s * hl_sens_balance_dir(&m->w);
	for (u = 0; u < m->nu; u++)
		if (m->u[u].col >= 0) {
			m->a[m->nrow * nc + m->u[u].col] = m->u[u].hot ? 1 : -1;
			m->da[m->nrow * nc + m->u[u].col] = 0.0;
		}
}

/* Set GLPK row i to Σ_j v[j]·x[col0 + j] (j over the serving utilities). */
static void
set_row(glp_prob *P, int i, int col0, const double *v, size_t n)
{
	int ind[n + 1];
	double val[n + 1];
	size_t j;
	int k = 0;

	for (j = 0; j < n; j++) {
		if (v[j] == 0.0)
			continue;
		k++;
		ind[k] = col0 + (int)j;
		val[k] = v[j];
	}
	glp_set_mat_row(P, i, k, ind, val);
}

/* The rows Q ∈ feasible set (rows 1 .. nrow+1), columns 1 .. ncol. */
static void
add_feasible(glp_prob *P, const costlp *m)
{
	size_t e, u, nc = m->ncol;
	int r0 = glp_add_rows(P, (int)m->nrow + 1);

	for (e = 0; e <= m->nrow; e++) {
		set_row(P, r0 + (int)e, 1, &m->a[e * nc], nc);
		glp_set_row_bnds(P, r0 + (int)e, e < m->nrow ? GLP_LO : GLP_FX,
				 m->beta[e], m->beta[e]);
	}
	for (u = 0; u < m->nu; u++) {
		const ucol *q = &m->u[u];

		if (q->col < 0)
			continue;
		if (isinf(q->cap))
			glp_set_col_bnds(P, q->col + 1, GLP_LO, 0.0, 0.0);
		else
			glp_set_col_bnds(P, q->col + 1, GLP_DB, 0.0, q->cap);
	}
}

/* The row p·Q <= V + eps (Q ∈ X*). */
static void
add_optimal(glp_prob *P, const costlp *m, double v)
{
	double p[m->ncol + 1];
	int r = glp_add_rows(P, 1);
	size_t u;

	for (u = 0; u < m->nu; u++)
		if (m->u[u].col >= 0)
			p[m->u[u].col] = m->u[u].price;
	set_row(P, r, 1, p, m->ncol);
	glp_set_row_bnds(P, r, GLP_UP, 0.0, v + 1e-9 * (fabs(v) + m->pmax));
}

/* The three LPs of one direction. act[e]: row e active on all of X*;
 * bnd[j]: -1 all of X* at 0, +1 at max_load, 0 neither. */
typedef struct {
	double v;           /* the optimum, price·kW */
	double dv;          /* its derivative, price·kW per unit */
	char *act;
	int *bnd;
} face;

static hl_status
solve_value(glp_prob *P, costlp *m, hl_glpk_guard *g, face *f, hl_error *err)
{
	size_t u;
	hl_status st;

	glp_add_cols(P, (int)m->ncol);
	add_feasible(P, m);
	for (u = 0; u < m->nu; u++)
		if (m->u[u].col >= 0)
			glp_set_obj_coef(P, m->u[u].col + 1, m->u[u].price);
	glp_set_obj_dir(P, GLP_MIN);
	st = hl_glpk_simplex_direct(P, g, m->tlim, "the utility cost sensitivity LP",
			     err);
	if (st == HL_OK)
		f->v = glp_get_obj_val(P);
	return st;
}

/* A point of X* where every row and bound that can be slack is, by at
 * least κ where the face allows: max Σ capped slacks. */
static hl_status
solve_interior(glp_prob *P, costlp *m, hl_glpk_guard *g, face *f,
	       hl_error *err)
{
	size_t e, u, nc = m->ncol, ne = m->nrow;
	double kappa = 1e-6 * m->scale;
	int c0, r;
	hl_status st;

	glp_add_cols(P, (int)nc);
	add_feasible(P, m);
	add_optimal(P, m, f->v);
	c0 = glp_add_cols(P, (int)(ne + 2 * nc));
	for (e = 0; e < ne + 2 * nc; e++) {
		glp_set_col_bnds(P, c0 + (int)e, GLP_DB, 0.0, kappa);
		glp_set_obj_coef(P, c0 + (int)e, 1.0);
	}
	for (e = 0; e < ne; e++) { /* a_e·Q − t_e >= β_e */
		int ind[nc + 2];
		double val[nc + 2];
		int k = 0;

		for (u = 0; u < nc; u++)
			if (m->a[e * nc + u] != 0.0)
				k++, ind[k] = (int)u + 1, val[k] = m->a[e * nc + u];
		k++, ind[k] = c0 + (int)e, val[k] = -1.0;
		r = glp_add_rows(P, 1);
		glp_set_mat_row(P, r, k, ind, val);
		glp_set_row_bnds(P, r, GLP_LO, m->beta[e], 0.0);
	}
	for (u = 0; u < nc; u++) { /* Q − t >= 0, Q + t <= cap */
		int ind[3] = { 0, (int)u + 1, c0 + (int)(ne + 2 * u) };
		double val[3] = { 0.0, 1.0, -1.0 };
		size_t k;
		double cap = HUGE_VAL;

		r = glp_add_rows(P, 1);
		glp_set_mat_row(P, r, 2, ind, val);
		glp_set_row_bnds(P, r, GLP_LO, 0.0, 0.0);
		for (k = 0; k < m->nu; k++)
			if (m->u[k].col == (int)u)
				cap = m->u[k].cap;
		ind[2] = c0 + (int)(ne + 2 * u + 1), val[2] = 1.0;
		r = glp_add_rows(P, 1);
		glp_set_mat_row(P, r, 2, ind, val);
		if (isinf(cap))
			glp_set_row_bnds(P, r, GLP_FR, 0.0, 0.0);
		else
			glp_set_row_bnds(P, r, GLP_UP, 0.0, cap);
	}
	glp_set_obj_dir(P, GLP_MAX);
	st = hl_glpk_simplex_direct(P, g, m->tlim, "the utility cost sensitivity LP",
			     err);
	if (st != HL_OK)
		return st;
	for (e = 0; e < ne; e++)
		f->act[e] = glp_get_col_prim(P, c0 + (int)e) < kappa / 8.0;
	for (u = 0; u < nc; u++)
		f->bnd[u] = glp_get_col_prim(P, c0 + (int)(ne + 2 * u)) <
			    kappa / 8.0 ? -1 : glp_get_col_prim(P, c0 +
			    (int)(ne + 2 * u + 1)) < kappa / 8.0 ? 1 : 0;
	return HL_OK;
}

/* min p·δ s.t. a_e·δ + a_e'·Q >= β_e' on the active rows (= on the
 * balance), δ's sign fixed on the bounds, Q ∈ X*: columns Q then δ. */
static hl_status
solve_derivative(glp_prob *P, costlp *m, hl_glpk_guard *g, const face *f,
		 double *dv, hl_error *err)
{
	size_t e, u, j, nc = m->ncol;
	int d0, r;
	hl_status st;

	glp_add_cols(P, (int)nc);
	add_feasible(P, m);
	add_optimal(P, m, f->v);
	d0 = glp_add_cols(P, (int)nc);
	for (u = 0; u < m->nu; u++) {
		int j0 = m->u[u].col;

		if (j0 < 0)
			continue;
		glp_set_obj_coef(P, d0 + j0, m->u[u].price);
		glp_set_col_bnds(P, d0 + j0, f->bnd[j0] < 0 ? GLP_LO :
				 f->bnd[j0] > 0 ? GLP_UP : GLP_FR, 0.0, 0.0);
	}
	for (e = 0; e <= m->nrow; e++) {
		int ind[2 * nc + 1];
		double val[2 * nc + 1];
		int k = 0;

		if (e < m->nrow && !f->act[e])
			continue;
		for (j = 0; j < nc; j++) {
			if (m->da[e * nc + j] != 0.0)
				k++, ind[k] = (int)j + 1, val[k] = m->da[e * nc + j];
			if (m->a[e * nc + j] != 0.0)
				k++, ind[k] = d0 + (int)j, val[k] = m->a[e * nc + j];
		}
		if (k == 0 && (e == m->nrow ? fabs(m->dbeta[e]) :
			       m->dbeta[e]) <= 1e-12 * m->scale)
			continue; /* 0 >= β' holds (GLPK refuses empty rows
				     no more than it needs them) */
		r = glp_add_rows(P, 1);
		glp_set_mat_row(P, r, k, ind, val);
		glp_set_row_bnds(P, r, e < m->nrow ? GLP_LO : GLP_FX,
				 m->dbeta[e], m->dbeta[e]);
	}
	glp_set_obj_dir(P, GLP_MIN);
	st = hl_glpk_simplex_direct(P, g, m->tlim, "the utility cost sensitivity LP",
			     err);
	if (st == HL_OK)
		*dv = glp_get_obj_val(P);
	else if (g->infeasible)
		*dv = HUGE_VAL, st = HL_OK;
	return st;
}

/* The three LPs, each in its own problem (GLPK frees them all itself if
 * it crashes and jumps back to directional). */
static hl_status
run_stages(costlp *m, hl_glpk_guard *g, face *f)
{
	hl_status st = HL_OK;
	int stage;

	for (stage = 0; st == HL_OK && stage < 3; stage++) {
		glp_prob *P = glp_create_prob();

		if (stage == 0)
			st = solve_value(P, m, g, f, NULL);
		else if (stage == 1)
			st = solve_interior(P, m, g, f, NULL);
		else
			st = solve_derivative(P, m, g, f, &f->dv, NULL);
		glp_delete_prob(P);
	}
	return st;
}

/* V'(s·d) for the velocities set in m (price·kW per unit of the datum);
 * NaN when the LP itself has no answer or GLPK fails. */
static double
directional(costlp *m, double s, face *f)
{
	hl_glpk_guard g;
	hl_status st;

	fill_rows(m, s);
	hl_glpk_guard_begin(&g, NULL, NULL, 0);
	if (HL_GLPK_CRASHED(&g)) {
		hl_glpk_guard_crash(&g, "the utility cost sensitivity LP",
				    NULL);
		return NAN;
	}
	st = run_stages(m, &g, f);
	hl_glpk_guard_end(&g);
	return st == HL_OK ? f->dv : NAN;
}

static void
utility_velocity(costlp *m, const hl_sens_urow *ur)
{
	size_t u;

	for (u = 0; u < m->nu; u++)
		m->u[u].vhi = m->u[u].vlo = 0.0;
	if (ur == NULL)
		return;
	if (ur->q == HL_SENS_LEVEL)
		m->u[ur->util].vhi = m->u[ur->util].vlo = 1.0;
	else if ((ur->q == HL_SENS_SUPPLY) == m->u[ur->util].hot)
		m->u[ur->util].vhi = 1.0;
	else
		m->u[ur->util].vlo = 1.0;
}

/* ΔTmin moves utilities without their own contribution by ∓½ too. */
static void
dtmin_velocity(costlp *m)
{
	size_t u;

	for (u = 0; u < m->nu; u++) {
		double v = m->u[u].hot ? -0.5 : 0.5;

		if (!isnan(m->c->util[u].dt_contrib))
			v = 0.0;
		m->u[u].vhi = m->u[u].vlo = v;
	}
}

/* Both one-sided derivatives, currency per year per unit of the datum. */
static void
both_sides(costlp *m, face *f, double *minus, double *plus)
{
	double k = m->c->set.hours / 1000.0;
	double dp = directional(m, 1.0, f), dm = directional(m, -1.0, f);

	*plus = k * dp;
	*minus = -k * dm;
}

static hl_status
make_urows(const hl_case *c, hl_sensitivity *sv, hl_error *err)
{
	size_t u, n = 0;

	sv->urow = calloc(2 * c->nutil + 1, sizeof *sv->urow);
	if (sv->urow == NULL)
		return hl_error_nomem(err);
	for (u = 0; u < c->nutil; u++) {
		const hl_utility *x = &c->util[u];
		int iso = x->supply == x->target;
		int k;

		for (k = 0; k < (iso ? 1 : 2); k++, n++) {
			sv->urow[n].util = u;
			sv->urow[n].q = iso ? HL_SENS_LEVEL : k ? HL_SENS_TARGET :
					HL_SENS_SUPPLY;
			sv->urow[n].value = k ? x->target : x->supply;
			sv->urow[n].tol = c->set.t_tol;
		}
	}
	sv->nurow = n;
	return HL_OK;
}

hl_status
hl_sens_cost_lp(const hl_case *c, hl_sensitivity *sv, int levels,
		hl_error *err)
{
	costlp m;
	face f = { 0.0, 0.0, NULL, NULL };
	size_t i;
	hl_status st = make_urows(c, sv, err);

	memset(&m, 0, sizeof m);
	if (st == HL_OK)
		st = costlp_init(&m, c, sv->dtmin, err);
	if (st == HL_OK) {
		f.act = calloc(m.nrow + 1, 1);
		f.bnd = calloc(m.ncol + 1, sizeof *f.bnd);
		if (f.act == NULL || f.bnd == NULL)
			st = hl_error_nomem(err);
	}
	for (i = 0; st == HL_OK && levels && i <= sv->nrow; i++) {
		hl_sens_row *r = i < sv->nrow ? &sv->row[i] : &sv->dt;

		hl_sens_dir_clear(&m.w);
		hl_sens_dir_add(&m.w, r, 1.0);
		if (r->q == HL_SENS_DTMIN)
			dtmin_velocity(&m);
		else
			utility_velocity(&m, NULL);
		both_sides(&m, &f, &r->cost_minus, &r->cost_plus);
	}
	for (i = 0; st == HL_OK && i < sv->nurow; i++) {
		hl_sens_dir_clear(&m.w);
		utility_velocity(&m, &sv->urow[i]);
		both_sides(&m, &f, &sv->urow[i].cost_minus,
			   &sv->urow[i].cost_plus);
	}
	free(f.act);
	free(f.bnd);
	costlp_free(&m);
	return st;
}
