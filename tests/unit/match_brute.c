/* match_brute.c - fewest units by exhaustive search (see the header). */
#include <glpk.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "match_brute.h"

#define MAXP 16
#define MAXK 64

typedef struct {
	const char *name;
	int hot;
	double heat[MAXK];
} party;

typedef struct {
	size_t np, nk;
	party p[MAXP];
	double t[MAXK + 1];
} problem;

static int
cmp_desc(const void *a, const void *b)
{
	double x = *(const double *)a, y = *(const double *)b;

	return (x < y) - (x > y);
}

static int
setup(const hl_case *c, double dtmin, problem *pb, hl_brute *out)
{
	double t[2 * MAXP], r, rmin = 0.0;
	size_t i, k, n = 0, u = 0;

	if (c->nstream + 2 > MAXP)
		return -1;
	for (i = 0; i < c->nstream; i++) {
		const hl_stream *s = &c->stream[i];
		double sh = s->kind == HL_HOT ? -dtmin / 2 : dtmin / 2;

		t[n++] = s->seg[0].supply + sh;
		t[n++] = s->seg[0].target + sh;
	}
	qsort(t, n, sizeof *t, cmp_desc);
	for (i = 0; i < n; i++)
		if (u == 0 || pb->t[u - 1] - t[i] > 1e-9)
			pb->t[u++] = t[i];
	pb->nk = u - 1;
	for (i = 0; i < c->nstream; i++) {
		const hl_stream *s = &c->stream[i];
		double sh = s->kind == HL_HOT ? -dtmin / 2 : dtmin / 2;
		double hi = fmax(s->seg[0].supply, s->seg[0].target) + sh;
		double lo = fmin(s->seg[0].supply, s->seg[0].target) + sh;

		pb->p[i].name = s->name;
		pb->p[i].hot = s->kind == HL_HOT;
		for (k = 0; k < pb->nk; k++) {
			double o = fmin(hi, pb->t[k]) - fmax(lo, pb->t[k + 1]);

			pb->p[i].heat[k] = o > 0 ? s->seg[0].cp * o : 0.0;
		}
	}
	/* The cascade: the largest deficit is the hot utility. */
	for (k = 0, r = 0.0; k < pb->nk; k++) {
		for (i = 0; i < c->nstream; i++)
			r += (pb->p[i].hot ? 1 : -1) * pb->p[i].heat[k];
		rmin = fmin(rmin, r);
	}
	out->qh = -rmin;
	out->qc = r - rmin;
	pb->np = c->nstream + 2;
	memset(&pb->p[c->nstream], 0, 2 * sizeof(party));
	pb->p[c->nstream].name = "hot utility";
	pb->p[c->nstream].hot = 1;
	pb->p[c->nstream].heat[0] = out->qh;
	pb->p[c->nstream + 1].name = "cold utility";
	pb->p[c->nstream + 1].heat[pb->nk - 1] = out->qc;
	return 0;
}

/* Does the subset of pairs (a[i], b[i]) carry all heat of intervals
 * k0..k1? Transportation LP, feasibility only. */
static int
feasible(const problem *pb, size_t k0, size_t k1, const size_t *a,
	 const size_t *b, size_t n)
{
	glp_prob *P = glp_create_prob();
	int row[MAXP][MAXK], ok, ne = 0;
	int *ia = malloc(4 * MAXK * MAXK * (n + 1) * sizeof *ia);
	int *ja = malloc(4 * MAXK * MAXK * (n + 1) * sizeof *ja);
	double *ar = malloc(4 * MAXK * MAXK * (n + 1) * sizeof *ar);
	size_t i, k, kk, p;
	glp_smcp parm;

	for (p = 0; p < pb->np; p++)
		for (k = k0; k <= k1; k++) {
			double h = pb->p[p].heat[k];

			row[p][k] = 0;
			if (h <= 1e-12)
				continue;
			row[p][k] = glp_add_rows(P, 1);
			glp_set_row_bnds(P, row[p][k], GLP_FX, h, h);
		}
	for (i = 0; i < n; i++)
		for (k = k0; k <= k1; k++)
			for (kk = k; kk <= k1; kk++) {
				int j;

				if (!row[a[i]][k] || !row[b[i]][kk])
					continue;
				j = glp_add_cols(P, 1);
				glp_set_col_bnds(P, j, GLP_LO, 0.0, 0.0);
				ia[++ne] = row[a[i]][k];
				ja[ne] = j;
				ar[ne] = 1.0;
				ia[++ne] = row[b[i]][kk];
				ja[ne] = j;
				ar[ne] = 1.0;
			}
	/* Without a single column the heat cannot go anywhere. */
	ok = ne > 0;
	if (ok) {
		glp_load_matrix(P, ne, ia, ja, ar);
		glp_init_smcp(&parm);
		parm.msg_lev = GLP_MSG_OFF;
		ok = glp_simplex(P, &parm) == 0 && glp_get_status(P) == GLP_OPT;
	}
	free(ia);
	free(ja);
	free(ar);
	glp_delete_prob(P);
	return ok;
}

/* Next n-subset of 0..m-1 in lexicographic order. */
static int
next_subset(size_t *s, size_t n, size_t m)
{
	size_t i = n;

	while (i > 0 && s[i - 1] == m - n + i - 1)
		i--;
	if (i == 0)
		return 0;
	s[i - 1]++;
	for (; i < n; i++)
		s[i] = s[i - 1] + 1;
	return 1;
}

static int
solve_part(const problem *pb, size_t k0, size_t k1, hl_brute *out)
{
	size_t ha[MAXP * MAXP], cb[MAXP * MAXP], m = 0, i, j, n, k;
	size_t s[HL_BRUTE_MAX_PAIRS], a[HL_BRUTE_MAX_PAIRS], b[HL_BRUTE_MAX_PAIRS];
	size_t part = out->nsub;

	for (i = 0; i < pb->np; i++)
		for (j = 0; j < pb->np; j++) {
			double hi = 0, hj = 0;

			if (!pb->p[i].hot || pb->p[j].hot || (i >= pb->np - 2 &&
			    j >= pb->np - 2))
				continue;
			for (k = k0; k <= k1; k++) {
				hi += pb->p[i].heat[k];
				hj += pb->p[j].heat[k];
			}
			if (hi > 1e-12 && hj > 1e-12) {
				ha[m] = i;
				cb[m++] = j;
			}
		}
	if (m > HL_BRUTE_MAX_PAIRS || part == HL_BRUTE_MAX_SUB)
		return -1;
	for (n = 1; n <= m; n++) {
		size_t found = 0;

		for (i = 0; i < n; i++)
			s[i] = i;
		do {
			for (i = 0; i < n; i++) {
				a[i] = ha[s[i]];
				b[i] = cb[s[i]];
			}
			if (!feasible(pb, k0, k1, a, b, n))
				continue;
			if (found++ == 0) {
				memset(out->best[part], 0, sizeof out->best[part]);
				for (i = 0; i < n; i++) {
					snprintf(out->best[part][i][0], 32, "%s",
						 pb->p[a[i]].name);
					snprintf(out->best[part][i][1], 32, "%s",
						 pb->p[b[i]].name);
				}
			}
		} while (next_subset(s, n, m));
		if (found > 0) {
			out->units[part] = n;
			out->optima[part] = found;
			out->nsub++;
			return 0;
		}
	}
	return -1;
}

int
hl_brute_units(const hl_case *c, double dtmin, hl_brute *out)
{
	problem pb;
	size_t k, i, start = 0;
	double r = 0.0, scale = 0.0;
	int heat = 0;

	memset(out, 0, sizeof *out);
	if (setup(c, dtmin, &pb, out) != 0)
		return -1;
	for (k = 0; k < pb.nk; k++)
		for (i = 0; i < pb.np; i++)
			scale += pb.p[i].heat[k];
	for (k = 0; k < pb.nk; k++) {
		for (i = 0; i < pb.np; i++) {
			r += (pb.p[i].hot ? 1 : -1) * pb.p[i].heat[k];
			heat |= pb.p[i].heat[k] > 1e-12;
		}
		if (k + 1 == pb.nk || r <= 1e-9 * scale) {
			if (heat && solve_part(&pb, start, k, out) != 0)
				return -1;
			start = k + 1;
			heat = 0;
		}
	}
	return 0;
}
