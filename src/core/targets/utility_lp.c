/* utility_lp.c - least-cost utility loads, transshipment LP of Papoulias &
 * Grossmann (1983) over shifted temperature intervals (see utility_lp.h).
 *
 * The model is built in three steps: the merged boundaries and the process
 * surplus of each interval (a difference array, as in the problem table),
 * the place of every utility on those boundaries, and the LP itself. Before
 * GLPK sees the model, two necessary conditions are checked so that an
 * impossible case gets a sentence naming the temperature range without a
 * utility rather than a bare "infeasible".
 */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include <glpk.h>

#include "utility_lp.h"
#include "sorted.h"

#include "utility_lp_int.h"

static void
model_free(model *m)
{
	free(m->t);
	free(m->dh);
	free(m->hk);
	free(m->ck);
	free(m->hi);
	free(m->lo);
	free(m->bhi);
	free(m->blo);
	free(m->cap);
}

static double
stream_sign_shift(const hl_stream *s, double dtmin)
{
	double sh = hl_stream_shift(s, dtmin);

	return s->kind == HL_HOT ? -sh : sh;
}

static void
utility_ends(const hl_utility *u, double dtmin, double *hi, double *lo)
{
	double sh = hl_utility_shift(u, dtmin);

	sh = u->kind == HL_HOT ? -sh : sh;
	*hi = fmax(u->supply, u->target) + sh;
	*lo = fmin(u->supply, u->target) + sh;
}

/* Latent heat is a zero-width interval between two copies of its boundary
 * (as in the problem table, cascade.h): give each such boundary twice. */
static int
double_latent(model *m)
{
	const hl_case *c = m->c;
	size_t i, j, k, n = m->nb, extra = 0;
	char *mark = calloc(m->nb, 1);
	double *t;

	if (mark == NULL)
		return 0;
	for (i = 0; i < c->nstream; i++)
		for (j = 0; j < c->stream[i].nseg; j++)
			if (hl_segment_latent(&c->stream[i].seg[j]))
				mark[hl_sorted_find_desc(m->t, m->nb,
				     c->stream[i].seg[j].supply +
				     stream_sign_shift(&c->stream[i],
						       m->dtmin))] = 1;
	for (k = 0; k < n; k++)
		extra += (size_t)mark[k];
	t = extra ? malloc((n + extra) * sizeof *t) : NULL;
	if (extra && t == NULL) {
		free(mark);
		return 0;
	}
	for (k = 0, i = 0; extra && k < n; k++) {
		if (mark[k])
			t[i++] = m->t[k];
		t[i++] = m->t[k];
	}
	if (extra) {
		free(m->t);
		m->t = t;
		m->nb = n + extra;
	}
	free(mark);
	return 1;
}

/* Whether latent heat lies at the hottest hot or the coldest cold shifted
 * temperature (a utility exactly there can still take or give it). */
static void
latent_ends(model *m)
{
	const hl_case *c = m->c;
	size_t i, j;

	for (i = 0; i < c->nstream; i++) {
		const hl_stream *s = &c->stream[i];
		double t;

		for (j = 0; j < s->nseg; j++) {
			if (!hl_segment_latent(&s->seg[j]))
				continue;
			t = s->seg[j].supply + stream_sign_shift(s, m->dtmin);
			if (s->kind == HL_HOT && t == m->hot_max)
				m->hot_latent_max = 1;
			if (s->kind == HL_COLD && t == m->cold_min)
				m->cold_latent_min = 1;
		}
	}
}

/* Every shifted end temperature, sorted and unique; the process span. */
static int
build_boundaries(model *m)
{
	const hl_case *c = m->c;
	size_t i, j, n = 0, cap = 2 * m->nu, u;

	for (i = 0; i < c->nstream; i++)
		cap += 2 * c->stream[i].nseg;
	m->t = malloc(cap * sizeof *m->t);
	if (m->t == NULL)
		return 0;
	m->pmax = -HUGE_VAL;
	m->pmin = m->cold_min = HUGE_VAL;
	m->hot_max = -HUGE_VAL;
	for (i = 0; i < c->nstream; i++) {
		const hl_stream *s = &c->stream[i];
		double sh = stream_sign_shift(s, m->dtmin);

		for (j = 0; j < s->nseg; j++) {
			double a = s->seg[j].supply + sh, b = s->seg[j].target + sh;

			m->t[n++] = a;
			m->t[n++] = b;
			m->pmax = fmax(m->pmax, fmax(a, b));
			m->pmin = fmin(m->pmin, fmin(a, b));
			if (s->kind == HL_HOT)
				m->hot_max = fmax(m->hot_max, fmax(a, b));
			else
				m->cold_min = fmin(m->cold_min, fmin(a, b));
		}
	}
	latent_ends(m);
	for (u = 0; u < m->nu; u++) {
		m->t[n++] = m->hi[u];
		m->t[n++] = m->lo[u];
	}
	m->nb = hl_sorted_unique_desc(m->t, n);
	return double_latent(m);
}

/* Latent heat of each zero-width interval (the first copy of its boundary,
 * see double_latent): lat[2k] hot, lat[2k+1] cold, kW. */
static void
latent_steps(const model *m, double *lat)
{
	const hl_case *c = m->c;
	size_t i, j, b;

	for (i = 0; i < c->nstream; i++) {
		const hl_stream *s = &c->stream[i];

		for (j = 0; j < s->nseg; j++) {
			if (!hl_segment_latent(&s->seg[j]))
				continue;
			b = hl_sorted_find_desc(m->t, m->nb, s->seg[j].supply +
						stream_sign_shift(s, m->dtmin));
			lat[2 * b + (s->kind == HL_HOT ? 0 : 1)] +=
				s->seg[j].latent;
		}
	}
}

/* Surplus of every interval: net cp by a difference array over boundary
 * indices (Linnhoff & Flower 1978), times the interval's width. */
static int
build_surplus(model *m)
{
	const hl_case *c = m->c;
	size_t i, j, k;
	double run = 0.0, runh = 0.0, runc = 0.0, scale = 0.0, *lat;

	m->dh = calloc(m->nb, sizeof *m->dh);
	m->hk = calloc(m->nb, sizeof *m->hk);
	m->ck = calloc(m->nb, sizeof *m->ck);
	lat = calloc(2 * m->nb, sizeof *lat);
	if (m->dh == NULL || m->hk == NULL || m->ck == NULL || lat == NULL) {
		free(lat);
		return 0;
	}
	for (i = 0; i < c->nstream; i++) {
		const hl_stream *s = &c->stream[i];
		double sh = stream_sign_shift(s, m->dtmin);
		double sign = s->kind == HL_HOT ? 1.0 : -1.0;

		for (j = 0; j < s->nseg; j++) {
			const hl_segment *g = &s->seg[j];

			size_t a = hl_sorted_find_desc(m->t, m->nb,
					fmax(g->supply, g->target) + sh);
			size_t b = hl_sorted_find_desc(m->t, m->nb,
					fmin(g->supply, g->target) + sh);
			double *side = s->kind == HL_HOT ? m->hk : m->ck;

			m->dh[a] += sign * g->cp;
			m->dh[b] -= sign * g->cp;
			side[a] += g->cp;
			side[b] -= g->cp;
		}
	}
	latent_steps(m, lat);
	for (k = 0; k + 1 < m->nb; k++) {
		double w = m->t[k] - m->t[k + 1];

		run += m->dh[k];
		runh += m->hk[k];
		runc += m->ck[k];
		m->dh[k] = run * w + lat[2 * k] - lat[2 * k + 1];
		m->hk[k] = runh * w + lat[2 * k];
		m->ck[k] = runc * w + lat[2 * k + 1];
		scale += fabs(m->dh[k]);
	}
	free(lat);
	m->dh[m->nb - 1] = m->hk[m->nb - 1] = m->ck[m->nb - 1] = 0.0;
	m->tol = 1e-9 * (scale > 0.0 ? scale : 1.0);
	return 1;
}

static int
place_utilities(model *m)
{
	size_t u;

	m->hi = malloc((m->nu + 1) * sizeof *m->hi);
	m->lo = malloc((m->nu + 1) * sizeof *m->lo);
	m->cap = malloc((m->nu + 1) * sizeof *m->cap);
	m->bhi = malloc((m->nu + 1) * sizeof *m->bhi);
	m->blo = malloc((m->nu + 1) * sizeof *m->blo);
	if (!m->hi || !m->lo || !m->cap || !m->bhi || !m->blo)
		return 0;
	for (u = 0; u < m->nu; u++) {
		const hl_utility *x = &m->c->util[u];

		utility_ends(x, m->dtmin, &m->hi[u], &m->lo[u]);
		m->cap[u] = isnan(x->max_load) ? HUGE_VAL : x->max_load;
		m->credit |= x->price < 0.0;
	}
	return 1;
}

static void
locate_utilities(model *m)
{
	size_t u;

	for (u = 0; u < m->nu; u++) {
		m->bhi[u] = hl_sorted_find_desc(m->t, m->nb, m->hi[u]);
		m->blo[u] = hl_sorted_find_desc(m->t, m->nb, m->lo[u]);
		/* an isothermal cold utility takes from the interval above its
		 * level: at a latent step, the step itself (the last copy) */
		if (m->hi[u] == m->lo[u] && !is_hot(m, u))
			while (m->bhi[u] + 1 < m->nb &&
			       m->t[m->bhi[u] + 1] == m->t[m->bhi[u]])
				m->blo[u] = ++m->bhi[u];
	}
}

static hl_status
build_model(model *m, const hl_case *c, double dtmin, hl_error *err)
{
	memset(m, 0, sizeof *m);
	m->c = c;
	m->dtmin = dtmin;
	m->nu = c->nutil;
	if (!place_utilities(m) || !build_boundaries(m) || !build_surplus(m)) {
		model_free(m);
		return hl_error_nomem(err);
	}
	locate_utilities(m);
	return HL_OK;
}

int
is_hot(const model *m, size_t u)
{
	return m->c->util[u].kind == HL_HOT;
}

/* Fraction of utility u's heat exchanged above boundary b (a hot utility's
 * heat enters below its level, a cold one's leaves above it). */
static double
frac_above(const model *m, size_t u, size_t b)
{
	if (m->bhi[u] == m->blo[u]) {
		if (is_hot(m, u))
			return m->bhi[u] < b ? 1.0 : 0.0;
		return m->bhi[u] <= b ? 1.0 : 0.0;
	}
	return fmin(1.0, fmax(0.0, (m->hi[u] - m->t[b]) /
				(m->hi[u] - m->lo[u])));
}

/* Heat utility u adds to interval k per kW of load (negative for a cold
 * utility); 0 outside its range. */
double
coef(const model *m, size_t u, size_t k)
{
	double sign = is_hot(m, u) ? 1.0 : -1.0;

	if (m->bhi[u] == m->blo[u]) {
		if (is_hot(m, u))
			return m->bhi[u] == k ? 1.0 : 0.0;
		return m->bhi[u] == k + 1 ? -1.0 : 0.0;
	}
	if (k < m->bhi[u] || k >= m->blo[u])
		return 0.0;
	return sign * (m->t[k] - m->t[k + 1]) / (m->hi[u] - m->lo[u]);
}

/* First and one-past-last interval utility u touches. */
void
rows_of(const model *m, size_t u, size_t *k0, size_t *k1)
{
	if (m->bhi[u] != m->blo[u]) {
		*k0 = m->bhi[u];
		*k1 = m->blo[u];
	} else if (is_hot(m, u)) {
		*k0 = m->bhi[u];
		*k1 = m->bhi[u] + 1 < m->nb ? m->bhi[u] + 1 : m->bhi[u];
	} else {
		*k0 = m->bhi[u] > 0 ? m->bhi[u] - 1 : 0;
		*k1 = m->bhi[u] > 0 ? m->bhi[u] : 0;
	}
}

static const char *
utility_file(const hl_case *c)
{
	return c->nutil > 0 && c->util[0].file ? c->util[0].file : c->source;
}

static const char *
hottest_hot(const model *m, size_t *which)
{
	size_t u;
	long best = -1;

	for (u = 0; u < m->nu; u++)
		if (is_hot(m, u) && (best < 0 || m->hi[u] > m->hi[best]))
			best = (long)u;
	*which = best < 0 ? 0 : (size_t)best;
	return best < 0 ? NULL : m->c->util[best].name;
}

static const char *
coldest_cold(const model *m, size_t *which)
{
	size_t u;
	long best = -1;

	for (u = 0; u < m->nu; u++)
		if (!is_hot(m, u) && (best < 0 || m->lo[u] < m->lo[best]))
			best = (long)u;
	*which = best < 0 ? 0 : (size_t)best;
	return best < 0 ? NULL : m->c->util[best].name;
}

/* Heat the hot utilities can give above boundary b, and whether any reaches
 * above it at all. */
static double
hot_capacity_above(const model *m, size_t b, int *reach)
{
	double h = 0.0, f;
	size_t u;

	*reach = 0;
	for (u = 0; u < m->nu; u++) {
		if (!is_hot(m, u) || (f = frac_above(m, u, b)) <= 0.0)
			continue;
		*reach = 1;
		h += f * m->cap[u];
	}
	return h;
}

static double
cold_capacity_below(const model *m, size_t b, int *reach)
{
	double h = 0.0, f;
	size_t u;

	*reach = 0;
	for (u = 0; u < m->nu; u++) {
		if (is_hot(m, u) || (f = 1.0 - frac_above(m, u, b)) <= 0.0)
			continue;
		*reach = 1;
		h += f * m->cap[u];
	}
	return h;
}

static hl_status
hot_shortage(const model *m, size_t b, double need, double avail, int reach,
	     hl_error *err)
{
	const hl_case *c = m->c;
	double ts = m->t[b], tc = ts - m->dtmin / 2.0;
	size_t w;
	const char *name = hottest_hot(m, &w);

	if (name == NULL)
		return hl_error_set(err, HL_ENOSOLUTION, utility_file(c), 0,
			"the process needs %.1f kW of heat above %.1f °C "
			"shifted (cold streams at %.1f °C) but the case has no "
			"hot utility; add one to the utility table", need, ts, tc);
	if (!reach)
		return hl_error_set(err, HL_ENOSOLUTION, c->util[w].file,
			c->util[w].line, "no hot utility is hot enough: the "
			"process needs %.1f kW of heat above %.1f °C shifted "
			"(cold streams at %.1f °C) and the hottest hot "
			"utility, '%s', supplies at %.1f °C; add a hotter "
			"utility level", need, ts, tc, name,
			c->util[w].supply);
	return hl_error_set(err, HL_ENOSOLUTION, utility_file(c), 0,
		"the hot utilities hot enough to heat above %.1f °C shifted "
		"(cold streams at %.1f °C) can give at most %.1f kW there "
		"(their max_load) but the process needs %.1f kW; raise a "
		"max_load or add a hotter level", ts, tc, avail, need);
}

static hl_status
cold_excess(const model *m, size_t b, double need, double avail, int reach,
	    hl_error *err)
{
	const hl_case *c = m->c;
	double ts = m->t[b], th = ts + m->dtmin / 2.0;
	size_t w;
	const char *name = coldest_cold(m, &w);

	if (name == NULL)
		return hl_error_set(err, HL_ENOSOLUTION, utility_file(c), 0,
			"the process must reject %.1f kW of heat below %.1f °C "
			"shifted (hot streams at %.1f °C) but the case has no "
			"cold utility; add one to the utility table", need, ts,
			th);
	if (!reach)
		return hl_error_set(err, HL_ENOSOLUTION, c->util[w].file,
			c->util[w].line, "no cold utility is cold enough: the "
			"process must reject %.1f kW of heat below %.1f °C "
			"shifted (hot streams at %.1f °C) and the coldest cold "
			"utility, '%s', starts at %.1f °C; add a colder "
			"utility level", need, ts, th, name,
			c->util[w].supply);
	return hl_error_set(err, HL_ENOSOLUTION, utility_file(c), 0,
		"the cold utilities cold enough to cool below %.1f °C shifted "
		"(hot streams at %.1f °C) can take at most %.1f kW there "
		"(their max_load) but the process must reject %.1f kW; raise "
		"a max_load or add a colder level", ts, th, avail, need);
}

/* Necessary conditions: the deficit above every boundary must be coverable
 * by the hot utilities that reach above it, the surplus below it by the
 * cold utilities that reach below it. The worst violation is reported. */
static hl_status
diagnose(const model *m, hl_error *err)
{
	double s = 0.0, total = 0.0, worst = m->tol, need = 0, avail = 0;
	size_t b, wb = 0, k;
	int reach, wreach = 0, hot = 0;

	for (k = 0; k + 1 < m->nb; k++)
		total += m->dh[k];
	for (b = 0; b < m->nb; b++) {
		double h, below = total - s;

		h = hot_capacity_above(m, b, &reach);
		if (-s - h > worst) {
			worst = -s - h, wb = b, wreach = reach, hot = 1;
			need = -s, avail = h;
		}
		h = cold_capacity_below(m, b, &reach);
		if (below - h > worst && !hot) {
			worst = below - h, wb = b, wreach = reach;
			need = below, avail = h;
		}
		if (b + 1 < m->nb)
			s += m->dh[b];
	}
	if (worst <= m->tol)
		return HL_OK;
	return hot ? hot_shortage(m, wb, need, avail, wreach, err)
		   : cold_excess(m, wb, need, avail, wreach, err);
}

/* Weight of a kW of utility u in the tie-breaking solve: 1 plus its rank in
 * [0, 1), rising with a hot level's temperature and falling with a cold
 * one's. */
static double
tie_weight(const model *m, size_t u)
{
	double tmax = -HUGE_VAL, tmin = HUGE_VAL, span;
	size_t v;

	for (v = 0; v < m->nu; v++) {
		tmax = fmax(tmax, m->hi[v]);
		tmin = fmin(tmin, m->lo[v]);
	}
	span = tmax - tmin + 1.0;
	if (is_hot(m, u))
		return 1.0 + (m->hi[u] - tmin) / span;
	return 1.0 + (tmax - m->lo[u]) / span;
}

typedef struct {
	int *ia, *ja;
	double *ar;
	int ne;
} triplets;

static void
triplets_free(triplets *tr)
{
	free(tr->ia);
	free(tr->ja);
	free(tr->ar);
}

/* The constraint matrix, 1-based for GLPK: row k+1 is interval k; column
 * b+1 is R_b, column nb+u+1 is Q_u. */
static int
build_matrix(const model *m, triplets *tr)
{
	size_t n = 2 * m->nb + 1, u, k, k0, k1;

	for (u = 0; u < m->nu; u++) {
		rows_of(m, u, &k0, &k1);
		n += k1 - k0;
	}
	tr->ia = malloc(n * sizeof *tr->ia);
	tr->ja = malloc(n * sizeof *tr->ja);
	tr->ar = malloc(n * sizeof *tr->ar);
	if (!tr->ia || !tr->ja || !tr->ar)
		return 0;
	tr->ne = 0;
	for (k = 0; k + 1 < m->nb; k++) {
		tr->ne++;
		tr->ia[tr->ne] = (int)k + 1, tr->ja[tr->ne] = (int)k + 1;
		tr->ar[tr->ne] = 1.0;
		tr->ne++;
		tr->ia[tr->ne] = (int)k + 1, tr->ja[tr->ne] = (int)k + 2;
		tr->ar[tr->ne] = -1.0;
	}
	for (u = 0; u < m->nu; u++) {
		rows_of(m, u, &k0, &k1);
		for (k = k0; k < k1; k++) {
			tr->ne++;
			tr->ia[tr->ne] = (int)k + 1;
			tr->ja[tr->ne] = (int)(m->nb + u) + 1;
			tr->ar[tr->ne] = coef(m, u, k);
		}
	}
	return 1;
}

int
serves(const model *m, size_t u)
{
	size_t k0, k1;

	rows_of(m, u, &k0, &k1);
	return k1 > k0;
}

static void
set_bounds(glp_prob *P, const model *m)
{
	size_t k, b, u;

	for (k = 0; k + 1 < m->nb; k++)
		glp_set_row_bnds(P, (int)k + 1, GLP_FX, -m->dh[k], -m->dh[k]);
	for (b = 0; b < m->nb; b++)
		glp_set_col_bnds(P, (int)b + 1, b == 0 || b + 1 == m->nb ?
				 GLP_FX : GLP_LO, 0.0, 0.0);
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

/* Second solve over the optimal face only: every nonbasic column with a
 * nonzero reduced cost is held at its value (complementary slackness: all
 * rows are equalities), then the colder hot and hotter cold levels are
 * preferred. No cost slack is needed, so the cost stays exactly optimal.
 * It starts from the optimal basis, which stays primal feasible: GLPK's
 * presolver, re-deriving feasibility from rounded data, could call it
 * infeasible. */
static hl_status
break_ties(glp_prob *P, const model *m, hl_glpk_guard *g, double tlim,
	   hl_error *err)
{
	double pmax = 1.0;
	int j, ncol = glp_get_num_cols(P);
	size_t u;

	for (u = 0; u < m->nu; u++)
		pmax = fmax(pmax, fabs(m->c->util[u].price));
	for (j = 1; j <= ncol; j++) {
		double x = glp_get_col_prim(P, j);

		if (glp_get_col_stat(P, j) != GLP_BS &&
		    fabs(glp_get_col_dual(P, j)) > 1e-9 * pmax)
			glp_set_col_bnds(P, j, GLP_FX, x, x);
	}
	/* The credit model has inequality rows: those with a nonzero dual
	 * stay active on the optimal face. */
	for (j = 1; j <= glp_get_num_rows(P); j++) {
		double x = glp_get_row_prim(P, j);

		if (glp_get_row_type(P, j) != GLP_FX &&
		    glp_get_row_stat(P, j) != GLP_BS &&
		    fabs(glp_get_row_dual(P, j)) > 1e-9 * pmax)
			glp_set_row_bnds(P, j, GLP_FX, x, x);
	}
	for (u = 0; u < m->nu; u++)
		glp_set_obj_coef(P, (int)(m->nb + u) + 1, tie_weight(m, u));
	return hl_glpk_simplex_warm(P, g, tlim, "the utility LP", err);
}

static void
read_loads(glp_prob *P, const model *m, double *load)
{
	size_t u;

	for (u = 0; u < m->nu; u++)
		load[u] = glp_get_col_prim(P, (int)(m->nb + u) + 1);
}

/* The loads of P's proven optimum, tie-broken. Fixing columns at values
 * that hold rows only to the simplex's tolerance could in principle make
 * the tie-breaking LP infeasible (it did when GLPK's presolver gave the
 * first optimum, see hl_glpk_simplex_direct). The tie-break only chooses
 * among least-cost answers, so when it fails the first optimum stands. */
static void
tie_broken_loads(glp_prob *P, const model *m, hl_glpk_guard *g, double tlim,
		 double *load)
{
	read_loads(P, m, load);
	if (break_ties(P, m, g, tlim, NULL) == HL_OK)
		read_loads(P, m, load);
}

static hl_status
solve_loads(const model *m, const hl_utility_lp_opts *opt, double *load,
	    hl_error *err)
{
	hl_glpk_guard g;
	glp_prob *volatile P = NULL;
	triplets tr = { NULL, NULL, NULL, 0 };
	double tlim = opt && opt->time_limit > 0.0 ? opt->time_limit :
		      m->c->set.time_limit;
	hl_status st;

	if (!build_matrix(m, &tr)) {
		triplets_free(&tr);
		return hl_error_nomem(err);
	}
	hl_glpk_guard_begin(&g, opt ? opt->log : NULL, opt ? opt->log_ctx : NULL,
			    opt ? opt->verbose : 0);
	if (HL_GLPK_CRASHED(&g)) {
		triplets_free(&tr);
		return hl_glpk_guard_crash(&g, "the utility LP", err);
	}
	P = glp_create_prob();
	glp_set_prob_name(P, "heatloom utility levels");
	glp_set_obj_dir(P, GLP_MIN);
	if (m->credit) {
		glp_add_rows(P, hl_utility_credit_nrow(m));
		glp_add_cols(P, hl_utility_credit_ncol(m));
		st = hl_utility_credit_load(P, m) ? HL_OK : hl_error_nomem(err);
	} else {
		glp_add_rows(P, (int)m->nb - 1);
		glp_add_cols(P, (int)(m->nb + m->nu));
		glp_load_matrix(P, tr.ne, tr.ia, tr.ja, tr.ar);
		set_bounds(P, m);
		st = HL_OK;
	}
	if (st == HL_OK)
		st = hl_glpk_simplex_direct(P, &g, tlim, "the utility LP", err);
	if (st == HL_OK)
		tie_broken_loads(P, m, &g, tlim, load);
	if (st != HL_OK && g.infeasible)
		st = hl_error_set(err, HL_ENOSOLUTION, utility_file(m->c), 0,
			"the utility levels cannot meet the process at ΔTmin "
			"%g K: a utility with a temperature range gives or "
			"takes heat over all of it, and no combination of the "
			"given levels, ranges and max_load values balances "
			"every temperature interval; check the utilities' "
			"target temperatures and capacities", m->dtmin);
	glp_delete_prob(P);
	hl_glpk_guard_end(&g);
	triplets_free(&tr);
	return st;
}

/* R_b from the loads by a plain cascade, cleaned of rounding noise. */
static int
cascade_loads(const model *m, const double *load, double *flow)
{
	double *inj = calloc(m->nb, sizeof *inj);
	size_t u, k, k0, k1;

	if (inj == NULL)
		return 0;
	for (u = 0; u < m->nu; u++) {
		rows_of(m, u, &k0, &k1);
		for (k = k0; k < k1; k++)
			inj[k] += coef(m, u, k) * load[u];
	}
	flow[0] = 0.0;
	for (k = 0; k + 1 < m->nb; k++)
		flow[k + 1] = flow[k] + inj[k] + m->dh[k];
	for (k = 0; k < m->nb; k++)
		if (fabs(flow[k]) <= m->tol)
			flow[k] = 0.0;
	free(inj);
	return 1;
}

static long
utility_at(const model *m, size_t b)
{
	size_t u;

	for (u = 0; u < m->nu; u++)
		if ((is_hot(m, u) ? m->hi[u] : m->lo[u]) == m->t[b])
			return (long)u;
	for (u = 0; u < m->nu; u++)
		if (m->hi[u] == m->t[b] || m->lo[u] == m->t[b])
			return (long)u;
	return -1;
}

static void
add_pinch(const model *m, size_t b, hl_utility_pinch *p, size_t *n)
{
	p[*n].shifted = m->t[b];
	p[*n].hot = m->t[b] + m->dtmin / 2.0;
	p[*n].cold = m->t[b] - m->dtmin / 2.0;
	p[*n].util = utility_at(m, b);
	(*n)++;
}

/* Process pinches (problem table on the merged boundaries) and utility
 * pinches (zero flow where the process alone passes heat). */
static int
find_pinches(const model *m, hl_utility_lp *r)
{
	double s = 0.0, smin = 0.0, *pf;
	size_t b;

	pf = malloc(m->nb * sizeof *pf);
	r->proc = malloc(m->nb * sizeof *r->proc);
	r->pinch = malloc(m->nb * sizeof *r->pinch);
	if (pf == NULL || r->proc == NULL || r->pinch == NULL) {
		free(pf);
		return 0;
	}
	for (b = 0; b < m->nb; b++) {
		pf[b] = s;
		smin = fmin(smin, s);
		if (b + 1 < m->nb)
			s += m->dh[b];
	}
	r->qh_min = smin < 0.0 ? -smin : 0.0;
	r->qc_min = s - smin;
	for (b = 1; b + 1 < m->nb; b++) {
		int inside = m->t[b] < m->pmax && m->t[b] > m->pmin;
		int ppinch = pf[b] - smin <= m->tol;

		if (inside && ppinch)
			add_pinch(m, b, r->proc, &r->nproc);
		else if (inside && r->flow[b] == 0.0)
			add_pinch(m, b, r->pinch, &r->npinch);
	}
	free(pf);
	return 1;
}

static void
classify(const model *m, hl_utility_lp *r, const double *load)
{
	size_t u;

	for (u = 0; u < m->nu; u++) {
		const hl_utility *x = &m->c->util[u];
		hl_utility_load *l = &r->util[u];

		l->t_hi = m->hi[u];
		l->t_lo = m->lo[u];
		l->load = load[u] > m->tol ? fmin(load[u], m->cap[u]) : 0.0;
		l->cost = x->price * l->load * r->hours / 1000.0;
		if (l->load > 0.0)
			l->use = HL_UTIL_USED;
		else if (is_hot(m, u) ? m->cold_min > m->hi[u] ||
				(m->cold_min == m->hi[u] && !m->cold_latent_min)
				      : m->hot_max < m->lo[u] ||
				(m->hot_max == m->lo[u] && !m->hot_latent_max))
			l->use = HL_UTIL_REACH;
		else
			l->use = HL_UTIL_IDLE;
		if (is_hot(m, u))
			r->hot_load += l->load;
		else
			r->cold_load += l->load;
		r->cost += l->cost;
	}
}

/* Heat of utility u on the far side of shifted temperature ts: below it
 * for a hot utility, above it for a cold one. */
static double
beyond(const model *m, size_t u, double load, double ts)
{
	double f;

	if (m->hi[u] == m->lo[u])
		return is_hot(m, u) ? (m->hi[u] <= ts ? load : 0.0)
				    : (m->lo[u] >= ts ? load : 0.0);
	f = (fmin(m->hi[u], ts) - m->lo[u]) / (m->hi[u] - m->lo[u]);
	f = fmin(1.0, fmax(0.0, f));
	return load * (is_hot(m, u) ? f : 1.0 - f);
}

/* Hot utility bought beyond the minimum and the ranges because a credit
 * pays for it: it frees process heat for a credit cold utility. */
static void
credit_rise(const model *m, hl_utility_lp *r)
{
	double rise = r->hot_load - r->qh_min - r->range_rise;
	size_t u;

	r->credit_rise = m->credit && rise > m->tol ? rise : 0.0;
	r->credit = 0.0;
	for (u = 0; u < m->nu; u++)
		if (r->util[u].cost < 0.0)
			r->credit -= r->util[u].cost;
}

/* What each utility exchanges across the process pinch (the hottest for a
 * hot utility, the coldest for a cold one), and the rise of the hot
 * utility above the process target it causes. */
static void
find_across(const model *m, hl_utility_lp *r)
{
	double top, bottom, rise = 0.0;
	size_t u;

	if (r->nproc == 0) {
		rise = m->credit ? 0.0 : r->hot_load - r->qh_min;
		r->range_rise = rise > m->tol ? rise : 0.0;
		credit_rise(m, r);
		return;
	}
	top = r->proc[0].shifted;
	bottom = r->proc[r->nproc - 1].shifted;
	for (u = 0; u < m->nu; u++) {
		hl_utility_load *l = &r->util[u];
		double a = beyond(m, u, l->load, is_hot(m, u) ? top : bottom);

		l->across = a > m->tol ? a : 0.0;
		if (is_hot(m, u))
			rise += l->across;
	}
	r->range_rise = rise;
	credit_rise(m, r);
}

static hl_status
make_result(const model *m, const double *load, hl_utility_lp **out,
	    hl_error *err)
{
	hl_utility_lp *r = calloc(1, sizeof *r);

	if (r == NULL)
		return hl_error_nomem(err);
	r->dtmin = m->dtmin;
	r->hours = m->c->set.hours;
	r->nutil = m->nu;
	r->nb = m->nb;
	r->tol = m->tol;
	r->optimal = 1;
	r->gap = 0.0;
	r->util = calloc(m->nu + 1, sizeof *r->util);
	r->t = malloc(m->nb * sizeof *r->t);
	r->flow = malloc(m->nb * sizeof *r->flow);
	if (r->util == NULL || r->t == NULL || r->flow == NULL ||
	    !cascade_loads(m, load, r->flow) || !find_pinches(m, r)) {
		hl_utility_lp_free(r);
		return hl_error_nomem(err);
	}
	memcpy(r->t, m->t, m->nb * sizeof *r->t);
	classify(m, r, load);
	find_across(m, r);
	*out = r;
	return HL_OK;
}

hl_status
hl_utility_lp_solve(const hl_case *c, double dtmin,
		    const hl_utility_lp_opts *opt, hl_utility_lp **out,
		    hl_error *err)
{
	model m;
	double *load;
	hl_status st;

	*out = NULL;
	if (c->nstream == 0 || c->nutil == 0)
		return hl_error_set(err, HL_EINPUT, c->source, 0,
			c->nstream == 0 ? "no process streams to serve" :
			"no utilities to choose from: give a utility table");
	st = build_model(&m, c, dtmin, err);
	if (st != HL_OK)
		return st;
	st = diagnose(&m, err);
	load = calloc(m.nu + 1, sizeof *load);
	if (st == HL_OK && load == NULL)
		st = hl_error_nomem(err);
	if (st == HL_OK)
		st = solve_loads(&m, opt, load, err);
	if (st == HL_OK)
		st = make_result(&m, load, out, err);
	free(load);
	model_free(&m);
	return st;
}

void
hl_utility_lp_free(hl_utility_lp *r)
{
	if (r == NULL)
		return;
	free(r->util);
	free(r->t);
	free(r->flow);
	free(r->proc);
	free(r->pinch);
	free(r);
}

void
hl_utility_lp_copy_loads(const hl_utility_lp *r, double *load)
{
	size_t i;

	for (i = 0; i < r->nutil; i++)
		load[i] = r->util[i].load;
}

hl_status
hl_utility_lp_loads(const hl_utility_lp *r, double **out, hl_error *err)
{
	*out = NULL;
	if (r == NULL)
		return HL_OK;
	*out = malloc((r->nutil > 0 ? r->nutil : 1) * sizeof **out);
	if (*out == NULL)
		return hl_error_nomem(err);
	hl_utility_lp_copy_loads(r, *out);
	return HL_OK;
}

const char *
hl_utility_use_name(hl_utility_use use)
{
	switch (use) {
	case HL_UTIL_USED:
		return "used";
	case HL_UTIL_IDLE:
		return "unused";
	default:
		return "out of reach";
	}
}
