/* match_model.c - the expanded transshipment MILP of one group of
 * subnetworks (Papoulias & Grossmann 1983), in its tightened form.
 *
 * Per subnetwork: y[a][b] binary (a unit between hot a and cold b),
 * q[a][b][k] >= 0 the heat b takes from a in interval k, R[a][k] >= 0 the
 * heat of a passed below interval k.
 *   hot  a, k:  sum_b q[a][b][k] + R[a][k] - R[a][k-1] <= heat[a][k]
 *   cold b, k:  sum_a q[a][b][k] = heat[b][k]
 *   pair a, b:  sum_k q[a][b][k] <= U[a][b] y[a][b]
 * (the hot rows are inequalities only so that rounding in a balanced
 * subnetwork cannot make it infeasible; the totals force equality).
 * Tightening, each valid for every integer solution:
 *  - U[a][b] is the most heat a can give b here: a greedy pass down the
 *    intervals, carrying at most the cascade's residual across a boundary;
 *    q and R get per-interval bounds from the same pass;
 *  - q[a][b][k] <= ub[a][b][k] y[a][b] when ub < U;
 *  - each party needs as many matches as its largest U's take to cover it;
 *  - sum y >= N - S, S the most balanced parts (match_bound.c);
 *  - identical parties are ordered: y[a1][b*] >= y[a2][b*].
 * The textbook form keeps only U = the smaller of the two heats.
 */
#include <ctype.h>
#include <math.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "match_int.h"
#include "sorted.h"

static double
heat(const hl_match_problem *p, size_t i, size_t k)
{
	double h = HL_MATCH_HEAT(p, i, k);

	return h > p->tol ? h : 0.0;
}

/* Heat of the subnetwork's parties crossing its boundary kk. */
static double
resid(const hl_match_sd *sd, size_t kk)
{
	return fmax(0.0, sd->res[kk]);
}

void
hl_match_sd_clear(hl_match_sd *sd)
{
	free(sd->active);
	free(sd->total);
	free(sd->res);
	free(sd->bit);
	free(sd->seed);
	hl_match_balanced_clear(&sd->bal);
	free(sd->U);
	free(sd->ub);
	free(sd->rub);
	free(sd->ycol);
	free(sd->qcol);
	free(sd->rcol);
	memset(sd, 0, sizeof *sd);
}

/* Most heat of hot a present in each interval (its own plus what may be
 * carried from above), and the most it can pass below each interval. */
static void
hot_reach(const hl_match_problem *p, const hl_match_sd *sd, size_t a,
	  double *reach, double *rub)
{
	size_t kk, i = p->hot[a];
	double prev = 0.0;

	for (kk = 0; kk < sd->nk; kk++) {
		size_t k = sd->first + kk;
		double carry = kk == 0 ? 0.0 : fmin(resid(sd, kk), prev);

		reach[kk] = heat(p, i, k) + carry;
		rub[kk] = kk + 1 < sd->nk ? fmin(resid(sd, kk + 1), reach[kk]) :
			0.0;
		prev = reach[kk];
	}
}

/* Most heat a can give b alone: serve b's demand as early as heat allows
 * (optimal for one source and one sink on a chain). */
static double
pair_capacity(const hl_match_problem *p, const hl_match_sd *sd, size_t a,
	      size_t b)
{
	double avail = 0.0, u = 0.0;
	size_t kk;

	for (kk = 0; kk < sd->nk; kk++) {
		size_t k = sd->first + kk;
		double use;

		avail = (kk == 0 ? 0.0 : fmin(avail, resid(sd, kk))) +
			heat(p, p->hot[a], k);
		use = fmin(avail, heat(p, p->cold[b], k));
		u += use;
		avail -= use;
	}
	return u;
}

/* The balanced subsets of the active parties and the plain Euler bound
 * over their partitions (each part |part| - 1 units). */
static void
subset_bound(const hl_match_problem *p, hl_match_sd *sd)
{
	size_t n = 0, i, kk;
	double *v = malloc(p->np * sizeof *v), *w = NULL, tot = 0.0;
	double *prof = malloc(p->np * sd->nk * sizeof *prof);

	sd->bit = malloc((p->np + 1) * sizeof *sd->bit);
	sd->subset_bound = sd->nactive - sd->nactive / 2;
	if (v == NULL || prof == NULL || sd->bit == NULL)
		goto out;
	for (i = 0; i < p->np; i++) {
		double sign = p->party[i].kind == HL_HOT ? 1.0 : -1.0;

		if (!sd->active[i])
			continue;
		v[n] = sign * sd->total[i];
		for (kk = 0; kk < sd->nk; kk++)
			prof[n * sd->nk + kk] = sign * heat(p, i, sd->first + kk);
		tot += sd->total[i];
		sd->bit[n++] = i;
	}
	hl_match_balanced_find(n, v, prof, sd->nk, 1e-6 * fmax(tot, 1e-12),
			       &sd->bal);
	w = malloc((sd->bal.nset + 1) * sizeof *w);
	if (w == NULL)
		goto out;
	for (i = 0; i < sd->bal.nset; i++)
		w[i] = hl_match_set_size(sd->bal.set[i]) - 1.0;
	sd->subset_bound = (size_t)ceil(hl_match_partition_bound(&sd->bal, w,
		(double)n - 1.0) - 1e-9);
out:
	free(v);
	free(w);
	free(prof);
}

/* Residual cascade of the chosen parties across the subnetwork. */
static void
own_cascade(const hl_match_problem *p, hl_match_sd *sd)
{
	size_t kk, i;

	sd->res[0] = 0.0;
	for (kk = 0; kk < sd->nk; kk++) {
		double r = sd->res[kk];

		for (i = 0; i < p->np; i++)
			if (sd->active[i])
				r += (p->party[i].kind == HL_HOT ? 1.0 : -1.0) *
					heat(p, i, sd->first + kk);
		sd->res[kk + 1] = r;
	}
}

hl_status
hl_match_sd_init(const hl_match_problem *p, size_t s,
		 const unsigned char *mask, int light, hl_match_sd *sd)
{
	size_t i, kk, a, b, nk, npair = p->nhot * p->ncold;
	double *reach;

	memset(sd, 0, sizeof *sd);
	sd->sub = s;
	sd->first = p->sub[s].first;
	sd->nk = nk = p->sub[s].last - p->sub[s].first + 1;
	sd->active = calloc(p->np, 1);
	sd->total = calloc(p->np, sizeof *sd->total);
	sd->U = calloc(npair + 1, sizeof *sd->U);
	sd->ub = calloc(npair * nk + 1, sizeof *sd->ub);
	sd->rub = calloc(p->nhot * nk + 1, sizeof *sd->rub);
	sd->res = calloc(nk + 1, sizeof *sd->res);
	reach = calloc(p->nhot * nk + 1, sizeof *reach);
	if (!sd->active || !sd->total || !sd->U || !sd->ub || !sd->rub ||
	    !sd->res || !reach) {
		free(reach);
		hl_match_sd_clear(sd);
		return HL_EIO;
	}
	for (i = 0; i < p->np; i++) {
		for (kk = 0; kk < nk; kk++)
			sd->total[i] += heat(p, i, sd->first + kk);
		sd->active[i] = sd->total[i] > p->tol &&
			(mask == NULL || mask[i]);
		sd->nactive += sd->active[i];
	}
	own_cascade(p, sd);
	for (a = 0; a < p->nhot; a++)
		if (sd->active[p->hot[a]])
			hot_reach(p, sd, a, reach + a * nk, sd->rub + a * nk);
	for (a = 0; a < p->nhot; a++) {
		for (b = 0; b < p->ncold; b++) {
			const hl_match_pair *q = &p->pair[HL_MATCH_PAIR(p, a, b)];
			size_t pi = HL_MATCH_PAIR(p, a, b);
			double u;

			if (!q->allowed || !sd->active[p->hot[a]] ||
			    !sd->active[p->cold[b]])
				continue;
			u = fmin(pair_capacity(p, sd, a, b), q->maxduty);
			if (u <= p->tol)
				continue;
			sd->U[pi] = u;
			for (kk = 0; kk < nk; kk++) {
				double d = heat(p, p->cold[b], sd->first + kk);

				sd->ub[pi * nk + kk] =
					fmin(fmin(reach[a * nk + kk], d), u);
			}
		}
	}
	free(reach);
	if (!light)
		subset_bound(p, sd);
	return HL_OK;
}

/* ---- names ---- */

/* A party's name reduced to letters, digits and '_' for LP/MPS files. */
static void
token(const hl_match_problem *p, size_t i, char *buf, size_t size)
{
	const char *s = p->party[i].name;
	size_t n = 0;

	for (; *s != '\0' && n + 1 < size && n < 24; s++)
		buf[n++] = isalnum((unsigned char)*s) ? *s : '_';
	buf[n] = '\0';
	if (n == 0)
		snprintf(buf, size, "p");
}

/* Two names may reduce to one token: the later ones get their number. */
static void
unique_tokens(const hl_match_problem *p, char (*tok)[40])
{
	size_t i, j;

	for (i = 1; i < p->np; i++)
		for (j = 0; j < i; j++)
			if (strcmp(tok[i], tok[j]) == 0) {
				size_t n = strlen(tok[i]);

				snprintf(tok[i] + n, 40 - n, "_%zu", i + 1);
				break;
			}
}

static void
name_col(glp_prob *P, int j, const char *fmt, ...)
	__attribute__((format(printf, 3, 4)));
static void
name_col(glp_prob *P, int j, const char *fmt, ...)
{
	char buf[200];
	va_list ap;

	va_start(ap, fmt);
	vsnprintf(buf, sizeof buf, fmt, ap);
	va_end(ap);
	glp_set_col_name(P, j, buf);
}

static void
name_row(glp_prob *P, int i, const char *fmt, ...)
	__attribute__((format(printf, 3, 4)));
static void
name_row(glp_prob *P, int i, const char *fmt, ...)
{
	char buf[200];
	va_list ap;

	va_start(ap, fmt);
	vsnprintf(buf, sizeof buf, fmt, ap);
	va_end(ap);
	glp_set_row_name(P, i, buf);
}

/* ---- one subnetwork ---- */

typedef struct {
	const hl_match_problem *p;
	hl_match_model_t *m;
	hl_match_mat mat;
	char (*tok)[40];
	int textbook;
} builder;

/* In how many of the group's subnetworks pair pi can work. */
static size_t
pair_subs(const hl_match_model_t *m, size_t pi)
{
	size_t s, n = 0;

	for (s = 0; s < m->ns; s++)
		n += m->sd[s].U[pi] > 0.0;
	return n;
}

static double
textbook_U(const hl_match_sd *sd, const hl_match_problem *p, size_t a,
	   size_t b)
{
	return fmin(sd->total[p->hot[a]], sd->total[p->cold[b]]);
}

static void
add_pair_cols(builder *bd, hl_match_sd *sd)
{
	const hl_match_problem *p = bd->p;
	glp_prob *P = bd->m->P;
	size_t a, b, kk, nk = sd->nk, S = sd->sub + 1;

	for (a = 0; a < p->nhot; a++)
		for (b = 0; b < p->ncold; b++) {
			size_t pi = HL_MATCH_PAIR(p, a, b);
			const hl_match_pair *q = &p->pair[pi];
			int j;

			if (sd->U[pi] <= 0.0)
				continue;
			j = hl_match_add_col(P, GLP_BV, 0.0, 1.0, q->cost);
			if (q->required && pair_subs(bd->m, pi) == 1)
				glp_set_col_bnds(P, j, GLP_FX, 1.0, 1.0);
			name_col(P, j, "y_s%zu_%s_%s", S, bd->tok[p->hot[a]],
				 bd->tok[p->cold[b]]);
			sd->ycol[pi] = j;
			sd->npairs++;
			for (kk = 0; kk < nk; kk++) {
				double ub = sd->ub[pi * nk + kk];

				if (ub <= 0.0)
					continue;
				j = hl_match_add_col(P, GLP_CV, 0.0,
					bd->textbook ? HUGE_VAL : ub, 0.0);
				name_col(P, j, "q_s%zu_%s_%s_%zu", S,
					 bd->tok[p->hot[a]], bd->tok[p->cold[b]],
					 sd->first + kk + 1);
				sd->qcol[pi * nk + kk] = j;
			}
		}
}

static void
add_resid_cols(builder *bd, hl_match_sd *sd)
{
	const hl_match_problem *p = bd->p;
	size_t a, kk, nk = sd->nk;

	for (a = 0; a < p->nhot; a++) {
		int seen = 0;

		if (!sd->active[p->hot[a]])
			continue;
		for (kk = 0; kk + 1 < nk; kk++) {
			double ub = sd->rub[a * nk + kk];
			int j;

			seen |= heat(p, p->hot[a], sd->first + kk) > 0.0;
			if (bd->textbook ? !seen : ub <= 0.0)
				continue;
			j = hl_match_add_col(bd->m->P, GLP_CV, 0.0,
					     bd->textbook ? HUGE_VAL : ub, 0.0);
			name_col(bd->m->P, j, "r_s%zu_%s_%zu", sd->sub + 1,
				 bd->tok[p->hot[a]], sd->first + kk + 1);
			sd->rcol[a * nk + kk] = j;
		}
	}
}

static void
add_hot_rows(builder *bd, const hl_match_sd *sd)
{
	const hl_match_problem *p = bd->p;
	size_t a, b, kk, nk = sd->nk;

	for (a = 0; a < p->nhot; a++) {
		size_t i = p->hot[a];

		if (!sd->active[i])
			continue;
		for (kk = 0; kk < nk; kk++) {
			int r, any = sd->rcol[a * nk + kk] != 0 ||
				(kk > 0 && sd->rcol[a * nk + kk - 1] != 0);

			for (b = 0; b < p->ncold && !any; b++)
				any = sd->qcol[HL_MATCH_PAIR(p, a, b) * nk + kk];
			if (!any)
				continue;
			r = hl_match_add_row(bd->m->P, GLP_UP, 0.0,
					     heat(p, i, sd->first + kk));
			name_row(bd->m->P, r, "hb_s%zu_%s_%zu", sd->sub + 1,
				 bd->tok[i], sd->first + kk + 1);
			hl_match_mat_add(&bd->mat, r, sd->rcol[a * nk + kk], 1.0);
			if (kk > 0)
				hl_match_mat_add(&bd->mat, r,
						 sd->rcol[a * nk + kk - 1], -1.0);
			for (b = 0; b < p->ncold; b++) {
				int j = sd->qcol[HL_MATCH_PAIR(p, a, b) * nk + kk];

				if (j)
					hl_match_mat_add(&bd->mat, r, j, 1.0);
			}
		}
	}
}

static void
add_cold_rows(builder *bd, const hl_match_sd *sd)
{
	const hl_match_problem *p = bd->p;
	size_t a, b, kk, nk = sd->nk;

	for (b = 0; b < p->ncold; b++) {
		size_t j = p->cold[b];

		for (kk = 0; kk < nk && sd->active[j]; kk++) {
			double h = heat(p, j, sd->first + kk);
			int r;

			if (h <= 0.0)
				continue;
			r = hl_match_add_row(bd->m->P, GLP_FX, h, h);
			name_row(bd->m->P, r, "cb_s%zu_%s_%zu", sd->sub + 1,
				 bd->tok[j], sd->first + kk + 1);
			for (a = 0; a < p->nhot; a++) {
				int c = sd->qcol[HL_MATCH_PAIR(p, a, b) * nk + kk];

				if (c)
					hl_match_mat_add(&bd->mat, r, c, 1.0);
			}
		}
	}
}

/* sum_k q <= U y, q <= ub y where ub < U, and a required pair's least
 * duty (a thousandth of what it could carry) when it is used. */
static void
add_logic_rows(builder *bd, const hl_match_sd *sd)
{
	const hl_match_problem *p = bd->p;
	size_t a, b, kk, nk = sd->nk, S = sd->sub + 1;

	for (a = 0; a < p->nhot; a++)
		for (b = 0; b < p->ncold; b++) {
			size_t pi = HL_MATCH_PAIR(p, a, b);
			const char *ht = bd->tok[p->hot[a]];
			const char *ct = bd->tok[p->cold[b]];
			double U = bd->textbook ? textbook_U(sd, p, a, b) :
				sd->U[pi];
			int r, y = sd->ycol[pi];

			if (y == 0)
				continue;
			r = hl_match_add_row(bd->m->P, GLP_UP, 0.0, 0.0);
			name_row(bd->m->P, r, "u_s%zu_%s_%s", S, ht, ct);
			for (kk = 0; kk < nk; kk++)
				hl_match_mat_add(&bd->mat, r,
						 sd->qcol[pi * nk + kk], 1.0);
			hl_match_mat_add(&bd->mat, r, y, -U);
			if (p->pair[pi].required) {
				r = hl_match_add_row(bd->m->P, GLP_LO, 0.0, 0.0);
				name_row(bd->m->P, r, "min_s%zu_%s_%s", S, ht, ct);
				for (kk = 0; kk < nk; kk++)
					hl_match_mat_add(&bd->mat, r,
						sd->qcol[pi * nk + kk], 1.0);
				hl_match_mat_add(&bd->mat, r, y, -1e-3 * U);
			}
			for (kk = 0; kk < nk && !bd->textbook; kk++) {
				double ub = sd->ub[pi * nk + kk];

				if (ub <= 0.0 || ub >= U * (1.0 - 1e-9))
					continue;
				r = hl_match_add_row(bd->m->P, GLP_UP, 0.0, 0.0);
				name_row(bd->m->P, r, "d_s%zu_%s_%s_%zu", S, ht,
					 ct, sd->first + kk + 1);
				hl_match_mat_add(&bd->mat, r,
						 sd->qcol[pi * nk + kk], 1.0);
				hl_match_mat_add(&bd->mat, r, y, -ub);
			}
		}
}

/* Fewest matches of party i: how many of its largest U's cover its heat. */
static size_t
cover_count(const hl_match_problem *p, const hl_match_sd *sd, size_t i,
	    double *buf)
{
	size_t n = 0, m, o;
	double need = sd->total[i] * (1.0 - 1e-7), sum = 0.0;

	for (o = 0; o < p->nhot * p->ncold; o++)
		if (sd->ycol[o] != 0 && (p->hot[o / p->ncold] == i ||
		    p->cold[o % p->ncold] == i))
			buf[n++] = sd->U[o];
	qsort(buf, n, sizeof *buf, hl_sorted_cmp_desc);
	for (m = 0; m < n && sum < need; m++)
		sum += buf[m];
	return m;
}

/* Most heat hot a can give cold b using only intervals lo..hi of the
 * subnetwork (its heat there, b's demand there): the greedy pass of
 * pair_capacity on a window. */
static double
window_capacity(const hl_match_problem *p, const hl_match_sd *sd, size_t a,
		size_t b, size_t lo, size_t hi)
{
	double avail = 0.0, u = 0.0;
	size_t kk;

	for (kk = lo; kk <= hi; kk++) {
		size_t k = sd->first + kk;
		double use;

		avail = (kk == lo ? 0.0 : fmin(avail, resid(sd, kk))) +
			heat(p, p->hot[a], k);
		use = fmin(avail, heat(p, p->cold[b], k));
		u += use;
		avail -= use;
	}
	return fmin(u, sd->U[HL_MATCH_PAIR(p, a, b)]);
}

/* Fewest partners whose window capacities cover need; partners with none
 * are left out of the row (flag 0 in in[]). */
static size_t
window_count(double *cap, size_t n, double need)
{
	size_t m;
	double sum = 0.0;

	qsort(cap, n, sizeof *cap, hl_sorted_cmp_desc);
	for (m = 0; m < n && sum < need; m++)
		sum += cap[m];
	return m;
}

/* For cold party b, the demand in its intervals from the top of the
 * subnetwork down to kk can only come from hot parties with heat at or
 * above; for hot a, its heat from kk to the bottom only goes to cold
 * parties below. Each window gives sum y >= m over the partners that can
 * serve it, m from their capacities on the window. A row is added when it
 * differs from the previous window's. */
static void
add_window_rows(builder *bd, const hl_match_sd *sd, int side, size_t x,
		double *cap, unsigned char *in, unsigned char *prev)
{
	const hl_match_problem *p = bd->p;
	size_t no = side ? p->nhot : p->ncold, nk = sd->nk, kk, o, n, m;
	size_t me = side ? p->cold[x] : p->hot[x], pm = 0;
	int r;

	memset(prev, 0, no);
	for (kk = 0; kk < nk; kk++) {
		size_t lo = side ? 0 : nk - 1 - kk, hi = side ? kk : nk - 1;
		double need = 0.0;
		size_t j;
		int same = 1;

		for (j = lo; j <= hi; j++)
			need += heat(p, me, sd->first + j);
		if (need <= 1e-9 * sd->total[me])
			continue;
		for (o = 0, n = 0; o < no; o++) {
			size_t pi = side ? HL_MATCH_PAIR(p, o, x) :
				HL_MATCH_PAIR(p, x, o);
			double c = sd->ycol[pi] == 0 ? 0.0 : side ?
				window_capacity(p, sd, o, x, lo, hi) :
				window_capacity(p, sd, x, o, lo, hi);

			in[o] = c > p->tol;
			if (in[o])
				cap[n++] = c;
			same &= in[o] == prev[o];
		}
		m = window_count(cap, n, need * (1.0 - 1e-7));
		if (m == 0 || (same && m == pm))
			continue;
		memcpy(prev, in, no);
		pm = m;
		r = hl_match_add_row(bd->m->P, GLP_LO, (double)m, 0.0);
		name_row(bd->m->P, r, "w_s%zu_%s_%zu", sd->sub + 1, bd->tok[me],
			 sd->first + (side ? hi : lo) + 1);
		for (o = 0; o < no; o++)
			if (in[o])
				hl_match_mat_add(&bd->mat, r, sd->ycol[side ?
					HL_MATCH_PAIR(p, o, x) :
					HL_MATCH_PAIR(p, x, o)], 1.0);
	}
}

static void
add_count_rows(builder *bd, const hl_match_sd *sd, double *buf)
{
	const hl_match_problem *p = bd->p;
	size_t i, o, S = sd->sub + 1;
	int r;

	for (i = 0; i < p->np; i++) {
		size_t m;

		if (!sd->active[i])
			continue;
		m = cover_count(p, sd, i, buf);
		r = hl_match_add_row(bd->m->P, GLP_LO, (double)m, 0.0);
		name_row(bd->m->P, r, "n_s%zu_%s", S, bd->tok[i]);
		for (o = 0; o < p->nhot * p->ncold; o++) {
			size_t a = o / p->ncold, b = o % p->ncold;

			if (sd->ycol[o] != 0 && (p->hot[a] == i ||
			    p->cold[b] == i))
				hl_match_mat_add(&bd->mat, r, sd->ycol[o], 1.0);
		}
	}
	{
		size_t no = p->nhot > p->ncold ? p->nhot : p->ncold, x;
		double *cap = malloc((no + 1) * sizeof *cap);
		unsigned char *in = malloc(no + 1), *prev = malloc(no + 1);

		for (x = 0; cap && in && prev && x < p->ncold; x++)
			if (sd->active[p->cold[x]])
				add_window_rows(bd, sd, 1, x, cap, in, prev);
		for (x = 0; cap && in && prev && x < p->nhot; x++)
			if (sd->active[p->hot[x]])
				add_window_rows(bd, sd, 0, x, cap, in, prev);
		free(cap);
		free(in);
		free(prev);
	}
	if (sd->subset_bound < 2)
		return;
	r = hl_match_add_row(bd->m->P, GLP_LO, (double)sd->subset_bound, 0.0);
	name_row(bd->m->P, r, "units_s%zu", S);
	for (o = 0; o < p->nhot * p->ncold; o++)
		if (sd->ycol[o] != 0)
			hl_match_mat_add(&bd->mat, r, sd->ycol[o], 1.0);
}

/* ---- symmetry ---- */

/* Pair index of (x, o) where x is on side (0 hot, 1 cold). */
static size_t
side_pair(const hl_match_problem *p, int side, size_t x, size_t o)
{
	return side ? HL_MATCH_PAIR(p, o, x) : HL_MATCH_PAIR(p, x, o);
}

/* Parties x and x2 of one side are interchangeable in this subnetwork. */
static int
identical(const hl_match_problem *p, const hl_match_sd *sd, int side,
	  size_t x, size_t x2)
{
	size_t i = side ? p->cold[x] : p->hot[x];
	size_t i2 = side ? p->cold[x2] : p->hot[x2];
	size_t kk, o, nother = side ? p->nhot : p->ncold;
	double eps = 1e-9 * p->scale;

	if (!sd->active[i] || !sd->active[i2])
		return 0;
	for (kk = 0; kk < sd->nk; kk++)
		if (fabs(heat(p, i, sd->first + kk) -
			 heat(p, i2, sd->first + kk)) > eps)
			return 0;
	for (o = 0; o < nother; o++) {
		size_t pi = side_pair(p, side, x, o);
		size_t pj = side_pair(p, side, x2, o);
		const hl_match_pair *q = &p->pair[pi], *q2 = &p->pair[pj];

		if ((sd->ycol[pi] != 0) != (sd->ycol[pj] != 0))
			return 0;
		if (sd->ycol[pi] == 0)
			continue;
		if (fabs(sd->U[pi] - sd->U[pj]) > eps || q->cost != q2->cost ||
		    q->required || q2->required || !isinf(q->maxduty) ||
		    !isinf(q2->maxduty))
			return 0;
	}
	return 1;
}

static int
add_sym(hl_match_model_t *m, int si, int side, size_t x, size_t x2, size_t o)
{
	int *n = realloc(m->sym, (m->nsym + 1) * 5 * sizeof *n);

	if (n == NULL)
		return -1;
	m->sym = n;
	n += m->nsym * 5;
	n[0] = si;
	n[1] = side;
	n[2] = (int)x;
	n[3] = (int)x2;
	n[4] = (int)o;
	m->nsym++;
	return 0;
}

/* Chains of identical parties: y[x1][o*] >= y[x2][o*] >= ..., o* the first
 * partner; any solution can be relabelled to satisfy them. */
static int
add_sym_rows(builder *bd, const hl_match_sd *sd, int si, int side)
{
	const hl_match_problem *p = bd->p;
	size_t n = side ? p->ncold : p->nhot, nother = side ? p->nhot : p->ncold;
	size_t x, x2, o;
	unsigned char *done = calloc(n + 1, 1);

	if (done == NULL)
		return -1;
	for (x = 0; x < n; x++) {
		size_t last = x;

		if (done[x])
			continue;
		for (o = 0; o < nother && sd->ycol[side_pair(p, side, x, o)] == 0;
		     o++)
			;
		if (o == nother)
			continue;
		for (x2 = x + 1; x2 < n; x2++) {
			int r;

			if (done[x2] || !identical(p, sd, side, x, x2))
				continue;
			done[x2] = 1;
			r = hl_match_add_row(bd->m->P, GLP_LO, 0.0, 0.0);
			name_row(bd->m->P, r, "sym_s%zu_%s_%s", sd->sub + 1,
				 bd->tok[side ? p->cold[last] : p->hot[last]],
				 bd->tok[side ? p->cold[x2] : p->hot[x2]]);
			hl_match_mat_add(&bd->mat, r, sd->ycol[side_pair(p, side,
					 last, o)], 1.0);
			hl_match_mat_add(&bd->mat, r, sd->ycol[side_pair(p, side,
					 x2, o)], -1.0);
			if (add_sym(bd->m, si, side, last, x2, o) != 0) {
				free(done);
				return -1;
			}
			last = x2;
		}
	}
	free(done);
	return 0;
}

/* ---- rules across the subnetworks of a group ---- */

static void
add_link_rows(builder *bd)
{
	const hl_match_problem *p = bd->p;
	hl_match_model_t *m = bd->m;
	size_t pi, s, kk;

	for (pi = 0; pi < p->nhot * p->ncold; pi++) {
		const hl_match_pair *q = &p->pair[pi];
		const char *ht = bd->tok[p->hot[pi / p->ncold]];
		const char *ct = bd->tok[p->cold[pi % p->ncold]];
		int r;

		if (pair_subs(m, pi) < 2)
			continue;
		if (q->required) {
			r = hl_match_add_row(m->P, GLP_LO, 1.0, 0.0);
			name_row(m->P, r, "req_%s_%s", ht, ct);
			for (s = 0; s < m->ns; s++)
				hl_match_mat_add(&bd->mat, r, m->sd[s].ycol[pi],
						 1.0);
		}
		if (!isinf(q->maxduty)) {
			r = hl_match_add_row(m->P, GLP_UP, 0.0, q->maxduty);
			name_row(m->P, r, "max_%s_%s", ht, ct);
			for (s = 0; s < m->ns; s++)
				for (kk = 0; kk < m->sd[s].nk; kk++) {
					size_t at = pi * m->sd[s].nk + kk;

					hl_match_mat_add(&bd->mat, r,
							 m->sd[s].qcol[at], 1.0);
				}
		}
	}
}

void
hl_match_model_clear(hl_match_model_t *m)
{
	size_t s;

	for (s = 0; s < m->ns; s++)
		hl_match_sd_clear(&m->sd[s]);
	free(m->sd);
	free(m->sym);
	m->sd = NULL;
	m->sym = NULL;
	m->ns = m->nsym = 0;
}

int
hl_match_alloc_cols(const hl_match_problem *p, hl_match_sd *sd)
{
	size_t npair = p->nhot * p->ncold;

	sd->ycol = calloc(npair + 1, sizeof *sd->ycol);
	sd->qcol = calloc(npair * sd->nk + 1, sizeof *sd->qcol);
	sd->rcol = calloc(p->nhot * sd->nk + 1, sizeof *sd->rcol);
	return sd->ycol && sd->qcol && sd->rcol ? 0 : -1;
}

static int
build_subs(builder *bd)
{
	const hl_match_problem *p = bd->p;
	hl_match_model_t *m = bd->m;
	double *buf = malloc((p->np + 1) * sizeof *buf);
	size_t si;
	int rc = buf == NULL ? -1 : 0;

	for (si = 0; si < m->ns && rc == 0; si++) {
		add_pair_cols(bd, &m->sd[si]);
		add_resid_cols(bd, &m->sd[si]);
	}
	for (si = 0; si < m->ns && rc == 0; si++) {
		add_hot_rows(bd, &m->sd[si]);
		add_cold_rows(bd, &m->sd[si]);
		add_logic_rows(bd, &m->sd[si]);
		if (bd->textbook)
			continue;
		add_count_rows(bd, &m->sd[si], buf);
		if (add_sym_rows(bd, &m->sd[si], (int)si, 0) != 0 ||
		    add_sym_rows(bd, &m->sd[si], (int)si, 1) != 0)
			rc = -1;
	}
	if (rc == 0)
		add_link_rows(bd);
	free(buf);
	return rc;
}

hl_status
hl_match_model_init(const hl_match_problem *p, const size_t *subs, size_t ns,
		    hl_match_model_t *m, hl_error *err)
{
	size_t si;

	m->sd = calloc(ns + 1, sizeof *m->sd);
	if (m->sd == NULL)
		return hl_error_nomem(err);
	for (si = 0; si < ns; si++) {
		m->ns = si + 1;
		if (hl_match_sd_init(p, subs[si], NULL, 0, &m->sd[si]) != HL_OK ||
		    hl_match_alloc_cols(p, &m->sd[si]) != 0)
			return hl_error_nomem(err);
	}
	return HL_OK;
}

hl_status
hl_match_build(const hl_match_problem *p, int textbook, hl_match_model_t *m,
	       hl_error *err)
{
	builder bd;
	size_t i;
	int rc;

	memset(&bd, 0, sizeof bd);
	bd.p = p;
	bd.m = m;
	bd.textbook = textbook;
	m->textbook = textbook;
	bd.tok = malloc((p->np + 1) * sizeof *bd.tok);
	if (bd.tok == NULL)
		return hl_error_nomem(err);
	for (i = 0; i < p->np; i++)
		token(p, i, bd.tok[i], sizeof bd.tok[i]);
	unique_tokens(p, bd.tok);
	glp_set_obj_dir(m->P, GLP_MIN);
	glp_set_obj_name(m->P, "units");
	rc = build_subs(&bd);
	if (rc == 0)
		rc = hl_match_mat_load(&bd.mat, m->P);
	hl_match_mat_free(&bd.mat);
	free(bd.tok);
	return rc == 0 ? HL_OK : hl_error_nomem(err);
}
