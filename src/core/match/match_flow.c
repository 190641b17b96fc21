/* match_flow.c - is a set of matches feasible? A max-flow test.
 *
 * With the loads fixed, a subnetwork's transshipment model is a network:
 * source -> (hot a, interval k) with a's heat there; (a, k) -> (a, k+1) the
 * heat a passes down; (a, k) -> (cold b, k) when the pair is open; (b, k)
 * -> sink with b's demand there. The matches are feasible exactly when the
 * maximum flow meets every demand (Papoulias & Grossmann 1983 note the
 * transshipment structure). Maximum flow by Dinic's algorithm (Dinic 1970):
 * breadth-first levels, then blocking flows by depth-first search.
 */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "match_int.h"

typedef struct {
	int to, next;
	double cap, flow;
	long pair;      /* the pair an exchange arc belongs to, -1 otherwise */
} arc;

struct hl_match_flow {
	int nn, na, cap;
	int *head, *level, *it, *queue;
	arc *a;
	double demand, eps;
	size_t npair;
};

static int
add_arc(hl_match_flow *f, int u, int v, double cap, long pair)
{
	if (f->na + 2 > f->cap) {
		int nc = f->cap ? 2 * f->cap : 1024;
		arc *n = realloc(f->a, (size_t)nc * sizeof *n);

		if (n == NULL)
			return -1;
		f->a = n;
		f->cap = nc;
	}
	f->a[f->na] = (arc){ v, f->head[u], cap, 0.0, pair };
	f->head[u] = f->na++;
	f->a[f->na] = (arc){ u, f->head[v], 0.0, 0.0, pair };
	f->head[v] = f->na++;
	return 0;
}

static double
heat(const hl_match_problem *p, size_t i, size_t k)
{
	double h = HL_MATCH_HEAT(p, i, k);

	return h > p->tol ? h : 0.0;
}

/* Node of party side index x at interval kk: hot nodes first. */
static int
node(const hl_match_problem *p, const hl_match_sd *sd, int cold, size_t x,
     size_t kk)
{
	return 2 + (int)(((cold ? p->nhot : 0) + x) * sd->nk + kk);
}

static int
build(hl_match_flow *f, const hl_match_problem *p, const hl_match_sd *sd)
{
	size_t a, b, kk, nk = sd->nk;
	int rc = 0;

	for (a = 0; a < p->nhot; a++) {
		if (!sd->active[p->hot[a]])
			continue;
		for (kk = 0; kk < nk && rc == 0; kk++) {
			double h = heat(p, p->hot[a], sd->first + kk);

			if (h > 0.0)
				rc |= add_arc(f, 0, node(p, sd, 0, a, kk), h, -1);
			if (kk + 1 < nk && sd->rub[a * nk + kk] > 0.0)
				rc |= add_arc(f, node(p, sd, 0, a, kk),
					      node(p, sd, 0, a, kk + 1),
					      sd->rub[a * nk + kk], -1);
		}
	}
	for (b = 0; b < p->ncold; b++)
		for (kk = 0; kk < nk && rc == 0 && sd->active[p->cold[b]]; kk++) {
			double h = heat(p, p->cold[b], sd->first + kk);

			if (h <= 0.0)
				continue;
			rc |= add_arc(f, node(p, sd, 1, b, kk), 1, h, -1);
			f->demand += h;
			for (a = 0; a < p->nhot; a++) {
				size_t pi = HL_MATCH_PAIR(p, a, b);
				double ub = sd->ub[pi * nk + kk];

				if (ub > 0.0)
					rc |= add_arc(f, node(p, sd, 0, a, kk),
						      node(p, sd, 1, b, kk), ub,
						      (long)pi);
			}
		}
	return rc;
}

hl_match_flow *
hl_match_flow_create(const hl_match_problem *p, const hl_match_sd *sd)
{
	hl_match_flow *f = calloc(1, sizeof *f);
	int i;

	if (f == NULL)
		return NULL;
	f->nn = 2 + (int)((p->nhot + p->ncold) * sd->nk);
	f->head = malloc((size_t)f->nn * sizeof *f->head);
	f->level = malloc((size_t)f->nn * sizeof *f->level);
	f->it = malloc((size_t)f->nn * sizeof *f->it);
	f->queue = malloc((size_t)f->nn * sizeof *f->queue);
	f->eps = 1e-9 * p->scale;
	f->npair = p->nhot * p->ncold;
	if (!f->head || !f->level || !f->it || !f->queue) {
		hl_match_flow_free(f);
		return NULL;
	}
	for (i = 0; i < f->nn; i++)
		f->head[i] = -1;
	if (build(f, p, sd) != 0) {
		hl_match_flow_free(f);
		return NULL;
	}
	return f;
}

void
hl_match_flow_free(hl_match_flow *f)
{
	if (f == NULL)
		return;
	free(f->head);
	free(f->level);
	free(f->it);
	free(f->queue);
	free(f->a);
	free(f);
}

static double
residual(const hl_match_flow *f, int e, const unsigned char *open)
{
	const arc *x = &f->a[e];

	if (x->pair >= 0 && !open[x->pair])
		return 0.0;
	return x->cap - x->flow;
}

static int
levels(hl_match_flow *f, const unsigned char *open)
{
	int qh = 0, qt = 0, e, u;

	for (u = 0; u < f->nn; u++)
		f->level[u] = -1;
	f->level[0] = 0;
	f->queue[qt++] = 0;
	while (qh < qt) {
		u = f->queue[qh++];
		for (e = f->head[u]; e >= 0; e = f->a[e].next) {
			int v = f->a[e].to;

			if (f->level[v] < 0 && residual(f, e, open) > f->eps) {
				f->level[v] = f->level[u] + 1;
				f->queue[qt++] = v;
			}
		}
	}
	return f->level[1] >= 0;
}

static double
push(hl_match_flow *f, int u, double lim, const unsigned char *open)
{
	double done = 0.0;

	if (u == 1)
		return lim;
	for (; f->it[u] >= 0; f->it[u] = f->a[f->it[u]].next) {
		int e = f->it[u], v = f->a[e].to;
		double r = residual(f, e, open), d;

		if (r <= f->eps || f->level[v] != f->level[u] + 1)
			continue;
		d = push(f, v, fmin(lim - done, r), open);
		if (d <= 0.0)
			continue;
		f->a[e].flow += d;
		f->a[e ^ 1].flow -= d;
		done += d;
		if (lim - done <= f->eps)
			break;
	}
	return done;
}

int
hl_match_flow_feasible(hl_match_flow *f, const unsigned char *open)
{
	double total = 0.0;
	int e, u;

	for (e = 0; e < f->na; e++)
		f->a[e].flow = 0.0;
	while (levels(f, open)) {
		double d;

		for (u = 0; u < f->nn; u++)
			f->it[u] = f->head[u];
		while ((d = push(f, 0, HUGE_VAL, open)) > f->eps)
			total += d;
	}
	return total >= f->demand - 1e-7 * fmax(f->demand, 1.0);
}
