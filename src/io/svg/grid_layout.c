/* grid_layout.c - rows, branches and columns of a grid diagram.
 *
 * Rows: hot streams from the top in the network's order, then the cold
 * streams, each tall enough for its widest split. Columns: the units in an
 * order that every stream respects (left is upstream on a hot stream,
 * downstream on a cold one, so left is always hotter): a topological order
 * of "must stand left of", ties broken by the region between pinches, then
 * by the unit's mean shifted temperature, hottest first (a cycle, possible
 * only in odd networks, is broken at its hottest unit). A heater or cooler
 * joins the column before it when its mark fits beside what is there.
 */
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "grid_int.h"
#include "utf8.h"

#define ROW 38.0      /* between stream lines */
#define BRANCH 22.0   /* between the branches of a split */
#define SQUARE_ROOM 12.0 /* more below a line with a heater or cooler */
#define GAP 30.0      /* between the hot and the cold block */
#define TOP 104.0     /* first stream line */
#define COL_EASY 30.0 /* a column wide enough for every label */
#define COL_MIN 22.0  /* the narrowest column that stays legible */
#define END_ROOM 104.0/* from a line's end to the nearest column */
#define END_UNIT 48.0 /* from a line's end to a heater or cooler there */
#define WIDE 1028.0   /* 257 mm: A4 landscape inside its margins */
#define NAME_LINE 14  /* characters of a stream name before it wraps */

double
hl_grid_text_width(const char *s, double fs)
{
	return 0.58 * fs * (double)hl_utf8_chars(s);
}

void
hl_grid_layout_free(hl_grid_layout *L)
{
	free(L->row);
	free(L->nbranch);
	free(L->x);
	free(L->yh);
	free(L->yc);
	free(L->branch_hot);
	free(L->branch_cold);
	free(L->region);
	free(L->pinch_x);
	memset(L, 0, sizeof *L);
}

static int
is_utility_unit(const hl_network *net, const hl_network_unit *u)
{
	return net->party[u->hot].utility || net->party[u->cold].utility;
}

/* Mean shifted temperature of the process side(s) of unit u. */
static double
level(const hl_network *net, const hl_network_unit *u)
{
	const hl_network_party *h = &net->party[u->hot];
	const hl_network_party *c = &net->party[u->cold];
	double th = 0.5 * (u->hot_in + u->hot_out) -
	    hl_network_shift(&net->set, h);
	double tc = 0.5 * (u->cold_in + u->cold_out) +
	    hl_network_shift(&net->set, c);

	if (h->utility)
		return tc;
	if (c->utility)
		return th;
	return 0.5 * (th + tc);
}

/* Stage of unit u on party p, 0 when it is not on p's lane. */
static int
stage_on(const hl_network *net, const hl_network_unit *u, size_t p)
{
	if (u->hot == p && !net->party[p].utility)
		return u->hot_stage;
	if (u->cold == p && !net->party[p].utility)
		return u->cold_stage;
	return 0;
}

/* left[a * n + b]: unit a must stand left of unit b. */
static void
precedence(const hl_network *net, unsigned char *left)
{
	size_t n = net->nunit, p, a, b;

	for (p = 0; p < net->nparty; p++) {
		int hot = net->party[p].kind == HL_HOT;

		if (net->party[p].utility)
			continue;
		for (a = 0; a < n; a++)
			for (b = 0; b < n; b++) {
				int sa = stage_on(net, &net->unit[a], p);
				int sb = stage_on(net, &net->unit[b], p);

				if (sa > 0 && sb > 0 && (hot ? sb == sa + 1 :
				    sa == sb + 1))
					left[a * n + b] = 1;
			}
	}
}

/* Units in column order (Kahn's algorithm with priorities). */
static void
order_units(const hl_network *net, const unsigned char *left,
	    const int *region, const double *lev, size_t *order)
{
	size_t n = net->nunit, k, a, b;
	unsigned char *done = calloc(n + 1, 1);

	for (k = 0; k < n; k++) {
		long pick = -1, any = -1;

		for (a = 0; a < n; a++) {
			int free_ = 1;

			if (done != NULL && done[a])
				continue;
			for (b = 0; b < n && free_; b++)
				if (left[b * n + a] && !(done != NULL &&
				    done[b]))
					free_ = 0;
			if (any < 0 || region[a] < region[any] ||
			    (region[a] == region[any] && lev[a] > lev[any]))
				any = (long)a;
			if (free_ && (pick < 0 || region[a] < region[pick] ||
			    (region[a] == region[pick] && lev[a] > lev[pick])))
				pick = (long)a;
		}
		if (pick < 0)
			pick = any;
		order[k] = (size_t)pick;
		if (done != NULL)
			done[pick] = 1;
	}
	free(done);
}

/* Branch of each unit in a split stage: by where it works, hottest first. */
static void
branches(const hl_network *net, const double *lev, hl_grid_layout *L)
{
	size_t i, j, n = net->nunit;

	for (i = 0; i < n; i++) {
		const hl_network_unit *u = &net->unit[i];

		L->branch_hot[i] = L->branch_cold[i] = 0;
		for (j = 0; j < n; j++) {
			const hl_network_unit *v = &net->unit[j];
			int earlier = lev[j] > lev[i] || (lev[j] == lev[i] &&
			    j < i);

			if (j == i || !earlier)
				continue;
			if (!net->party[u->hot].utility && v->hot == u->hot &&
			    v->hot_stage == u->hot_stage)
				L->branch_hot[i]++;
			if (!net->party[u->cold].utility && v->cold == u->cold &&
			    v->cold_stage == u->cold_stage)
				L->branch_cold[i]++;
		}
		if (L->branch_hot[i] + 1 > L->nbranch[u->hot])
			L->nbranch[u->hot] = L->branch_hot[i] + 1;
		if (L->branch_cold[i] + 1 > L->nbranch[u->cold])
			L->nbranch[u->cold] = L->branch_cold[i] + 1;
	}
}

/* Party p carries a heater or a cooler. */
static int
has_square(const hl_network *net, size_t p)
{
	size_t i;

	for (i = 0; i < net->nunit; i++) {
		const hl_network_unit *u = &net->unit[i];

		if ((u->hot == p && net->party[u->cold].utility) ||
		    (u->cold == p && net->party[u->hot].utility))
			return 1;
	}
	return 0;
}

static void
rows(const hl_network *net, hl_grid_layout *L)
{
	double y = TOP;
	size_t p;
	int kind, first = 1;

	for (kind = HL_HOT; kind <= HL_COLD; kind++) {
		if (kind == HL_COLD)
			y += GAP;
		for (p = 0; p < net->nparty; p++) {
			const hl_network_party *q = &net->party[p];

			if (q->utility || (int)q->kind != kind) {
				if (q->utility)
					L->row[p] = NAN;
				continue;
			}
			if (first)
				L->top = y;
			first = 0;
			L->row[p] = y;
			L->bottom = y + (L->nbranch[p] - 1) * BRANCH;
			y += ROW + (L->nbranch[p] - 1) * BRANCH;
			/* A heater's or cooler's id and duty stand below its
			 * line: room for them above the next line's end
			 * temperatures. */
			if (has_square(net, p))
				y += SQUARE_ROOM;
		}
	}
	if (first)
		L->top = L->bottom = TOP;
}

/* The vertical extent of a unit's marks (a process exchanger's link spans
 * from its hot mark to its cold one). */
static void
span(const hl_grid_layout *L, size_t i, double *lo, double *hi)
{
	double a = isnan(L->yh[i]) ? L->yc[i] : L->yh[i];
	double b = isnan(L->yc[i]) ? L->yh[i] : L->yc[i];

	*lo = fmin(a, b) - 12.0;
	*hi = fmax(a, b) + 12.0;
}

/* A heater or cooler that is the last stage of its stream, alone: drawn
 * at the stream's target end, outside the columns. */
static int
end_unit(const hl_network *net, size_t i)
{
	const hl_network_unit *u = &net->unit[i];
	size_t p, j;
	int g, last = 0;

	if (!is_utility_unit(net, u))
		return 0;
	p = net->party[u->hot].utility ? u->cold : u->hot;
	g = p == u->hot ? u->hot_stage : u->cold_stage;
	for (j = 0; j < net->nunit; j++) {
		int h = stage_on(net, &net->unit[j], p);

		if (h > last)
			last = h;
		if (j != i && h == g)
			return 0;
	}
	return g == last;
}

/* Columns: each unit in order, a heater or cooler into the last column
 * when its predecessors are all further left and its mark fits there;
 * col[u] = SIZE_MAX for one drawn at its stream's end. */
static size_t
columns(const hl_network *net, const unsigned char *left, const size_t *order,
	hl_grid_layout *L, size_t *col)
{
	size_t n = net->nunit, k, j, ncol = 0;

	for (k = 0; k < n; k++) {
		size_t u = order[k];
		int join = ncol > 0 && is_utility_unit(net, &net->unit[u]);
		double lo, hi;

		if (end_unit(net, u)) {
			col[u] = SIZE_MAX;
			continue;
		}
		span(L, u, &lo, &hi);
		for (j = 0; j < k && join; j++) {
			size_t v = order[j];
			double vlo, vhi;

			if (col[v] != ncol - 1)
				continue;
			span(L, v, &vlo, &vhi);
			if (left[v * n + u] || L->region[v] != L->region[u] ||
			    (lo < vhi && vlo < hi))
				join = 0;
		}
		col[u] = join ? ncol - 1 : ncol++;
	}
	return ncol;
}

size_t
hl_grid_name_break(const char *name)
{
	size_t n = strlen(name), best = n, i;
	double mid = 0.5 * (double)n;

	if (n <= NAME_LINE)
		return n;
	for (i = 1; i + 1 < n; i++)
		if (name[i] == ' ' && (best == n || fabs((double)i - mid) <
		    fabs((double)best - mid)))
			best = i;
	return best;
}

/* The widest stream name, on two lines where it is long. */
static double
name_margin(const hl_network *net)
{
	char a[256];
	double w = 40.0;
	size_t p, k;

	for (p = 0; p < net->nparty; p++) {
		const char *s = net->party[p].name;

		if (net->party[p].utility)
			continue;
		k = hl_grid_name_break(s);
		snprintf(a, sizeof a, "%.*s", (int)k, s);
		w = fmax(w, hl_grid_text_width(a, 12.0));
		if (s[k] != '\0')
			w = fmax(w, hl_grid_text_width(s + k + 1, 12.0));
	}
	return fmin(w, 150.0) + 20.0;
}

/* Most of a column more on each side of a split's columns, for the split and
 * mixing points and their labels: extra[c] is the room before column c. */
static void
split_room(const hl_network *net, const size_t *col, size_t ncol,
	   double *extra)
{
	size_t i, j;

	for (i = 0; i < net->nunit; i++) {
		const hl_network_unit *u = &net->unit[i];
		size_t lo = col[i], hi = col[i];
		int split = 0;

		if (col[i] == SIZE_MAX)
			continue;
		for (j = 0; j < net->nunit; j++) {
			const hl_network_unit *v = &net->unit[j];

			if (j == i || col[j] == SIZE_MAX)
				continue;
			if ((!net->party[u->hot].utility && v->hot == u->hot &&
			    v->hot_stage == u->hot_stage) ||
			    (!net->party[u->cold].utility &&
			    v->cold == u->cold && v->cold_stage ==
			    u->cold_stage)) {
				split = 1;
				lo = col[j] < lo ? col[j] : lo;
				hi = col[j] > hi ? col[j] : hi;
			}
		}
		if (!split)
			continue;
		if (lo > 0)
			extra[lo] = fmax(extra[lo], 0.8);
		if (hi + 1 < ncol)
			extra[hi + 1] = fmax(extra[hi + 1], 0.8);
	}
}

/* The column step: as wide as an A4 page allows, at least COL_EASY, the
 * page widening to A4 landscape before the step shrinks to COL_MIN. */
static double
column_step(double slots, double fixed)
{
	double span = fmax(slots - 1.0, 1.0);
	double step = (GRID_WIDTH - fixed) / span;

	if (step >= COL_EASY)
		return step;
	step = (WIDE - fixed) / span;
	if (step >= COL_EASY)
		return COL_EASY;
	return fmax(step, COL_MIN);
}

/* x of every column, a wider gap where a pinch falls between two, and of
 * the units drawn at the stream ends. */
static void
place_columns(const hl_network *net, const size_t *col, size_t ncol,
	      hl_grid_layout *L)
{
	double *cx = calloc(ncol + 1, sizeof *cx), slots = 0.0, step, x0, x1;
	double *extra = calloc(ncol + 1, sizeof *extra), fixed;
	int *creg = calloc(ncol + 1, sizeof *creg);
	size_t i, c;

	if (cx == NULL || creg == NULL || extra == NULL) {
		free(cx);
		free(creg);
		free(extra);
		return;
	}
	for (i = 0; i < net->nunit; i++)
		if (col[i] != SIZE_MAX)
			creg[col[i]] = L->region[i];
	split_room(net, col, ncol, extra);
	for (c = 0; c < ncol; c++) {
		if (c > 0 && creg[c] != creg[c - 1])
			extra[c] += 0.6;
		slots += 1.0 + (c > 0 ? extra[c] : 0.0);
	}
	/* Room at both ends of the lines for the end temperatures and the
	 * heaters and coolers there. */
	L->left = name_margin(net);
	x0 = L->left + END_ROOM;
	fixed = x0 + END_ROOM + 16.0;
	step = column_step(slots, fixed);
	if (ncol == 1)
		x0 = 0.5 * (x0 + GRID_WIDTH - 16.0 - END_ROOM);
	for (c = 0, x1 = x0; c < ncol; c++) {
		if (c > 0)
			x1 += step * (1.0 + extra[c]);
		cx[c] = x1;
	}
	L->width = fmax(GRID_WIDTH, (ncol > 0 ? cx[ncol - 1] : x0) + 16.0 +
	    END_ROOM);
	L->right = L->width - 16.0;
	for (i = 0; i < net->nunit; i++) {
		if (col[i] != SIZE_MAX)
			L->x[i] = cx[col[i]];
		else
			L->x[i] = isnan(L->yh[i]) ? L->left + END_UNIT :
			    L->right - END_UNIT;
	}
	/* A pinch line between the last column above it and the first
	 * below. */
	for (i = 0; i < L->npinch; i++) {
		double lo = NAN, hi = NAN;

		for (c = 0; c < ncol; c++) {
			if (creg[c] <= (int)i)
				lo = cx[c];
			else if (isnan(hi))
				hi = cx[c];
		}
		L->pinch_x[i] = !isnan(lo) && !isnan(hi) ? 0.5 * (lo + hi) :
		    NAN;
	}
	free(cx);
	free(creg);
	free(extra);
}

int
hl_grid_layout_make(const hl_network *net, const hl_grid_opts *o,
		    hl_grid_layout *L)
{
	size_t n = net->nunit, i, *order, *col;
	unsigned char *left;
	double *lev;
	int rc = -1;

	memset(L, 0, sizeof *L);
	L->npinch = o != NULL ? o->npinch : 0;
	L->row = calloc(net->nparty + 1, sizeof *L->row);
	L->nbranch = calloc(net->nparty + 1, sizeof *L->nbranch);
	L->x = calloc(n + 1, sizeof *L->x);
	L->yh = calloc(n + 1, sizeof *L->yh);
	L->yc = calloc(n + 1, sizeof *L->yc);
	L->branch_hot = calloc(n + 1, sizeof *L->branch_hot);
	L->branch_cold = calloc(n + 1, sizeof *L->branch_cold);
	L->region = calloc(n + 1, sizeof *L->region);
	L->pinch_x = calloc(L->npinch + 1, sizeof *L->pinch_x);
	order = calloc(n + 1, sizeof *order);
	col = calloc(n + 1, sizeof *col);
	lev = calloc(n + 1, sizeof *lev);
	left = calloc(n * n + 1, 1);
	if (L->row == NULL || L->nbranch == NULL || L->x == NULL ||
	    L->yh == NULL || L->yc == NULL || L->branch_hot == NULL ||
	    L->branch_cold == NULL || L->region == NULL ||
	    L->pinch_x == NULL || order == NULL || col == NULL ||
	    lev == NULL || left == NULL)
		goto out;
	for (i = 0; i < net->nparty; i++)
		L->nbranch[i] = 1;
	for (i = 0; i < n; i++) {
		size_t k;

		lev[i] = level(net, &net->unit[i]);
		for (k = 0; k < L->npinch; k++)
			L->region[i] += lev[i] < o->pinch[k];
	}
	branches(net, lev, L);
	rows(net, L);
	for (i = 0; i < n; i++) {
		const hl_network_unit *u = &net->unit[i];

		L->yh[i] = net->party[u->hot].utility ? NAN :
		    L->row[u->hot] + BRANCH * L->branch_hot[i];
		L->yc[i] = net->party[u->cold].utility ? NAN :
		    L->row[u->cold] + BRANCH * L->branch_cold[i];
	}
	precedence(net, left);
	order_units(net, left, L->region, lev, order);
	L->ncol = columns(net, left, order, L, col);
	place_columns(net, col, L->ncol, L);
	L->key_top = L->bottom + 44.0;
	rc = 0;
out:
	free(order);
	free(col);
	free(lev);
	free(left);
	if (rc != 0)
		hl_grid_layout_free(L);
	return rc;
}
