/* network_refine.c - choices beyond one placement of the matches.
 *
 * Fewer units: two matches of one pair (a MILP gives a pair on both sides
 * of a pinch as two) become one unit when the network that results keeps
 * every approach with no more energy and is cheaper (or, unpriced, has
 * fewer units); smallest pairs first.
 *
 * When the matches cannot be placed as they are, two ways out keep a
 * network feasible: relaxation (network_relax.c: heat
 * to utilities, an energy penalty) and more units: the match that breaks
 * its approach most is cut in two by heat, its hotter half on both sides
 * (from its per-interval loads, or its windows) becoming one unit and the
 * rest another, and the whole placement runs again. Up to a few such cuts
 * are tried (two in a row without gain end it); a cut is kept only when it
 * saves energy, and then when it lowers the total annual cost (every
 * utility used has a price) or saves 1 % of the recovered heat per unit it
 * adds. See doc/methods.md, "Network placement".
 */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "network_int.h"

typedef struct {
	size_t n, cap, nint;
	hl_network_match *m;
	long *origin;        /* the input match each comes from */
	double **own;        /* loads owned here (2 arrays per match), or NULL */
	size_t nin;
	long *also;          /* per input match: the input match whose unit
				took its heat too, -1 when none */
} mlist;

static void
mlist_free(mlist *L)
{
	size_t i;

	for (i = 0; i < 2 * L->n; i++)
		free(L->own[i]);
	free(L->own);
	free(L->m);
	free(L->origin);
	free(L->also);
	memset(L, 0, sizeof *L);
}

static hl_status
mlist_grow(mlist *L)
{
	size_t cap = L->cap ? 2 * L->cap : 16;
	hl_network_match *m = realloc(L->m, cap * sizeof *m);
	long *o;
	double **w;

	if (m == NULL)
		return HL_EIO;
	L->m = m;
	o = realloc(L->origin, cap * sizeof *o);
	if (o == NULL)
		return HL_EIO;
	L->origin = o;
	w = realloc(L->own, 2 * cap * sizeof *w);
	if (w == NULL)
		return HL_EIO;
	L->own = w;
	L->cap = cap;
	return HL_OK;
}

static hl_status
mlist_from_input(mlist *L, const hl_network_input *in)
{
	size_t i;

	memset(L, 0, sizeof *L);
	L->nint = in->t != NULL ? in->nint : 0;
	L->nin = in->nmatch;
	L->also = malloc((in->nmatch + 1) * sizeof *L->also);
	if (L->also == NULL)
		return HL_EIO;
	for (i = 0; i < in->nmatch; i++)
		L->also[i] = -1;
	for (i = 0; i < in->nmatch; i++) {
		if (L->n == L->cap && mlist_grow(L) != HL_OK)
			return HL_EIO;
		L->m[L->n] = in->match[i];
		L->origin[L->n] = (long)i;
		L->own[2 * L->n] = L->own[2 * L->n + 1] = NULL;
		L->n++;
	}
	return HL_OK;
}

/* The first x kW of loads a (hottest interval first) into up, the rest
 * into down. */
static void
cut_loads(const double *a, size_t n, double x, double *up, double *down)
{
	size_t k;

	for (k = 0; k < n; k++) {
		double v = a[k] > 0.0 ? a[k] : 0.0, u = fmin(v, fmax(x, 0.0));

		up[k] = u;
		down[k] = v - u;
		x -= u;
	}
}

/* Heat at the hot-side interval boundary nearest half the duty. */
static double
cut_heat(const hl_network_match *m, size_t nint)
{
	double sum = 0.0, best = 0.5 * m->duty, gap = HUGE_VAL;
	size_t k;

	for (k = 0; k + 1 < nint; k++) {
		sum += m->give[k] > 0.0 ? m->give[k] : 0.0;
		if (sum > 0.05 * m->duty && sum < 0.95 * m->duty &&
		    fabs(sum - 0.5 * m->duty) < gap) {
			gap = fabs(sum - 0.5 * m->duty);
			best = sum;
		}
	}
	return best;
}

/* Cut match i in two: its hotter x kW on both sides, and the rest; x is
 * frac of its duty, or (frac NaN) at the interval boundary nearest half. */
static hl_status
mlist_split(mlist *L, size_t i, double frac)
{
	hl_network_match a = L->m[i], b = L->m[i];
	double x, f;
	size_t j = L->n;

	if (L->n == L->cap && mlist_grow(L) != HL_OK)
		return HL_EIO;
	L->own[2 * j] = L->own[2 * j + 1] = NULL;
	if (a.give != NULL && a.take != NULL && L->nint > 0) {
		double *g[4];
		int k;

		for (k = 0; k < 4; k++)
			if ((g[k] = calloc(L->nint, sizeof **g)) == NULL) {
				while (k-- > 0)
					free(g[k]);
				return HL_EIO;
			}
		x = isnan(frac) ? cut_heat(&a, L->nint) : frac * a.duty;
		cut_loads(L->m[i].give, L->nint, x, g[0], g[1]);
		cut_loads(L->m[i].take, L->nint, x, g[2], g[3]);
		free(L->own[2 * i]);
		free(L->own[2 * i + 1]);
		L->own[2 * i] = g[0];
		L->own[2 * i + 1] = g[2];
		L->own[2 * j] = g[1];
		L->own[2 * j + 1] = g[3];
		a.give = g[0];
		a.take = g[2];
		b.give = g[1];
		b.take = g[3];
	} else {
		x = (isnan(frac) ? 0.5 : frac) * a.duty;
	}
	f = x / a.duty;
	a.duty = x;
	b.duty -= x;
	/* Windows shrink in proportion: hot side from its top, cold side
	 * from its top (counterflow: the hot end of both). */
	a.hot_lo = b.hot_hi = a.hot_hi - f * (a.hot_hi - a.hot_lo);
	a.cold_lo = b.cold_hi = a.cold_hi - f * (a.cold_hi - a.cold_lo);
	L->m[i] = a;
	L->m[j] = b;
	L->origin[j] = L->origin[i];
	L->n++;
	return HL_OK;
}

static hl_status
mlist_copy(mlist *dst, const mlist *src)
{
	size_t i;

	memset(dst, 0, sizeof *dst);
	dst->nint = src->nint;
	dst->nin = src->nin;
	dst->also = malloc((src->nin + 1) * sizeof *dst->also);
	if (dst->also == NULL)
		return HL_EIO;
	memcpy(dst->also, src->also, src->nin * sizeof *src->also);
	for (i = 0; i < src->n; i++) {
		int k;

		if (dst->n == dst->cap && mlist_grow(dst) != HL_OK)
			return HL_EIO;
		dst->m[i] = src->m[i];
		dst->origin[i] = src->origin[i];
		for (k = 0; k < 2; k++) {
			const double *a = src->own[2 * i + k];
			double *b = NULL;

			if (a != NULL) {
				b = malloc((src->nint + 1) * sizeof *b);
				if (b == NULL)
					return HL_EIO;
				memcpy(b, a, src->nint * sizeof *b);
			}
			dst->own[2 * i + k] = b;
		}
		if (dst->own[2 * i] != NULL)
			dst->m[i].give = dst->own[2 * i];
		if (dst->own[2 * i + 1] != NULL)
			dst->m[i].take = dst->own[2 * i + 1];
		dst->n++;
	}
	return HL_OK;
}

/* Sum of two load arrays (either may be NULL), owned by the result. */
static double *
add_loads(const double *a, const double *b, size_t n)
{
	double *s;
	size_t k;

	if (a == NULL || b == NULL || n == 0)
		return NULL;
	s = malloc(n * sizeof *s);
	for (k = 0; s != NULL && k < n; k++)
		s[k] = a[k] + b[k];
	return s;
}

/* Match j's heat into match i (one unit for both), j dropped. */
static hl_status
mlist_merge(mlist *L, size_t i, size_t j)
{
	hl_network_match *a = &L->m[i], *b = &L->m[j];
	double *g = add_loads(a->give, b->give, L->nint);
	double *t = add_loads(a->take, b->take, L->nint);
	long root = L->origin[i];

	if ((a->give != NULL && b->give != NULL && L->nint > 0) &&
	    (g == NULL || t == NULL)) {
		free(g);
		free(t);
		return HL_EIO;
	}
	a->duty += b->duty;
	a->hot_hi = fmax(a->hot_hi, b->hot_hi);
	a->hot_lo = fmin(a->hot_lo, b->hot_lo);
	a->cold_hi = fmax(a->cold_hi, b->cold_hi);
	a->cold_lo = fmin(a->cold_lo, b->cold_lo);
	free(L->own[2 * i]);
	free(L->own[2 * i + 1]);
	L->own[2 * i] = g;
	L->own[2 * i + 1] = t;
	a->give = g;
	a->take = t;
	while (L->also[root] >= 0)
		root = L->also[root];
	L->also[L->origin[j]] = root;
	free(L->own[2 * j]);
	free(L->own[2 * j + 1]);
	memmove(&L->m[j], &L->m[j + 1], (L->n - j - 1) * sizeof *L->m);
	memmove(&L->origin[j], &L->origin[j + 1],
	    (L->n - j - 1) * sizeof *L->origin);
	memmove(&L->own[2 * j], &L->own[2 * j + 2],
	    2 * (L->n - j - 1) * sizeof *L->own);
	L->n--;
	return HL_OK;
}

/* Every utility the network uses has a price. */
static int
priced(const hl_network *net)
{
	size_t i;

	for (i = 0; i < net->nparty; i++) {
		const hl_network_party *p = &net->party[i];

		if (p->utility && p->load > 0.0 && (p->implicit ||
		    isnan(p->price)))
			return 0;
	}
	return 1;
}

/* Heat exchanged between process streams, kW. */
static double
recovery(const hl_network *net)
{
	double q = 0.0;
	size_t i;

	for (i = 0; i < net->nunit; i++)
		if (!net->party[net->unit[i].hot].utility &&
		    !net->party[net->unit[i].cold].utility)
			q += net->unit[i].duty;
	return q;
}

/* a better than b, for a cut: only when it saves energy, and then by
 * total annual cost when both are priced, else when each unit it adds
 * saves at least 1 % of the recovered heat (a rule of thumb of this
 * program, no source). More units for the same energy are never better:
 * the cost law does not see what each unit costs to install and pipe. */
static int
prefer(const hl_network *a, const hl_network *b)
{
	double tol = 1e-6 * fmax(1.0, fmax(a->qh, b->qh));
	double more = (double)a->nunit - (double)b->nunit;

	if (!(a->penalty < b->penalty - tol))
		return 0;
	if (priced(a) && priced(b))
		return a->total_cost < b->total_cost * (1.0 - 1e-9);
	return more <= 0.0 || b->penalty - a->penalty >=
	    0.01 * recovery(b) * more;
}

static hl_status
attempt(const hl_network_input *in, const mlist *L, hl_network **out,
	long *worst, double *keep, hl_error *err)
{
	hl_network_input sub = *in;
	hl_status st;
	long w;
	size_t i;

	sub.match = L->m;
	sub.nmatch = L->n;
	sub.group = L->origin;
	st = hl_net_attempt(&sub, out, &w, keep, err);
	if (st != HL_OK)
		return st;
	*worst = w;
	for (i = 0; i < (*out)->nunit; i++)
		if ((*out)->unit[i].match >= 0)
			(*out)->unit[i].match = L->origin[(*out)->unit[i].match];
	(*out)->nmatch = in->nmatch;
	return HL_OK;
}

/* The input match whose unit(s) carry match k's heat. */
static long
root_of(const mlist *L, long k)
{
	while (L->also[k] >= 0)
		k = L->also[k];
	return k;
}

/* What the network changed against the input's matches, in notes. */
static hl_status
note_changes(hl_network *net, const hl_network_input *in, const mlist *L,
	     hl_error *err)
{
	size_t i, k, j;
	hl_status st = HL_OK;
	double idle = 0.0;      /* kW of the matches left out as idle */

	for (k = 0; k < in->nmatch && st == HL_OK; k++) {
		const hl_network_match *m = &in->match[k];
		const char *h = in->party[m->hot].name;
		const char *c = in->party[m->cold].name;
		char ids[128] = "";
		double sum = 0.0, want = 0.0;
		size_t n = 0, len, nmerged = 0;

		if (L->also[k] >= 0)
			continue;
		for (j = 0; j < in->nmatch; j++)
			if (root_of(L, (long)j) == (long)k) {
				want += in->match[j].duty;
				nmerged += j != k;
			}
		for (i = 0; i < net->nunit; i++)
			if (net->unit[i].match == (long)k) {
				len = strlen(ids);
				snprintf(ids + len, sizeof ids - len, "%s%s",
				    n ? ", " : "", net->unit[i].id);
				sum += net->unit[i].duty;
				n++;
			}
		if (n == 0 && want <= hl_net_idle_limit(net, m->hot,
		    m->cold)) {
			idle += want;
			st = hl_network_add_note(net, err, "the match %s to %s "
			    "(%.2g kW) is left out: under %g %% of its "
			    "streams' duties, too little heat for a unit; the "
			    "other units and the utilities carry it", h, c,
			    want, 100.0 * HL_NET_IDLE);
		} else if (n == 0)
			st = hl_network_add_note(net, err, "the match %s to %s "
			    "(%.1f kW) is dropped: no placement keeps its "
			    "approach", h, c, want);
		else if (nmerged > 0)
			st = hl_network_add_note(net, err, "%zu matches %s to %s "
			    "(%.1f kW in all) are one unit here (%s): it keeps "
			    "the approach and saves %s", nmerged + 1, h, c,
			    want, ids, nmerged > 1 ? "units" : "a unit");
		else if (n > 1)
			st = hl_network_add_note(net, err, "the match %s to %s "
			    "(%.1f kW) is placed as %zu units (%s): as one unit "
			    "it cannot keep the approach", h, c, want, n, ids);
		/* Differences below what the report shows are no news. */
		if (st == HL_OK && n > 0 && fabs(sum - want) > fmax(0.05,
		    1e-3 * want))
			st = hl_network_add_note(net, err, "%s (%s to %s) "
			    "carries %.1f kW instead of the match's %.1f kW",
			    ids, h, c, sum, want);
	}
	for (i = 0; i < net->nunit && st == HL_OK; i++) {
		const hl_network_unit *u = &net->unit[i];

		if (u->match < 0)
			st = hl_network_add_note(net, err, "%s (%s to %s, "
			    "%.1f kW) is added: it takes heat that no "
			    "placement of the matches could exchange", u->id,
			    net->party[u->hot].name, net->party[u->cold].name,
			    u->duty);
	}
	if (st == HL_OK && net->penalty > idle + 1e-9 * fmax(1.0, net->qh))
		st = hl_network_add_note(net, err, "the placement needs "
		    "%.1f kW more hot and cold utility than the matches: "
		    "their loads allow no placement that keeps every approach",
		    net->penalty);
	else if (st == HL_OK && net->penalty > 1e-9 * fmax(1.0, net->qh))
		st = hl_network_add_note(net, err, "the placement needs "
		    "%.2g kW more hot and cold utility than the matches: the "
		    "heat of the matches left out", net->penalty);
	return st;
}

/* A merge must not cost energy: a better than b with no more penalty,
 * by total annual cost when priced, else by fewer units, then capital. */
static int
prefer_merge(const hl_network *a, const hl_network *b)
{
	double tol = 1e-6 * fmax(1.0, fmax(a->qh, b->qh));

	if (a->penalty > b->penalty + tol)
		return 0;
	if (priced(a) && priced(b))
		return a->total_cost < b->total_cost * (1.0 - 1e-9);
	return a->nunit < b->nunit || (a->nunit == b->nunit &&
	    a->capital < b->capital);
}

/* The match that breaks the approach most in a placement of L. */
static hl_status
attempt_worst(const hl_network_input *in, const mlist *L, long *worst,
	      double *keep, hl_error *err)
{
	hl_network *net = NULL;
	hl_status st = attempt(in, L, &net, worst, keep, err);

	hl_network_free(net);
	return st;
}

/* Whether the pair of input matches (a, b) was tried already. */
static int
tried(const long *t, size_t n, long a, long b)
{
	size_t i;

	for (i = 0; i < n; i++)
		if ((t[2 * i] == a && t[2 * i + 1] == b) ||
		    (t[2 * i] == b && t[2 * i + 1] == a))
			return 1;
	return 0;
}

/* The two entries of one hot and one cold party, from different input
 * matches and not tried yet, whose smaller duty is least; 0 when none. */
static int
next_pair(const mlist *L, const long *t, size_t nt, size_t *bi, size_t *bj)
{
	double small = HUGE_VAL;
	size_t i, j;

	for (i = 0; i < L->n; i++)
		for (j = i + 1; j < L->n; j++) {
			double d = fmin(L->m[i].duty, L->m[j].duty);

			if (L->m[i].hot != L->m[j].hot ||
			    L->m[i].cold != L->m[j].cold ||
			    L->origin[i] == L->origin[j] ||
			    tried(t, nt, L->origin[i], L->origin[j]))
				continue;
			if (d < small) {
				small = d;
				*bi = i;
				*bj = j;
			}
		}
	return isfinite(small);
}

/* Try one unit for two matches of a pair (the same hot and cold party,
 * e.g. on the two sides of a pinch), smallest first; keep each merge whose
 * network is better. */
static hl_status
try_merges(const hl_network_input *in, mlist *L, hl_network **best,
	   hl_error *err)
{
	long *t = malloc((2 * in->nmatch * in->nmatch + 2) * sizeof *t);
	size_t nt = 0, i = 0, j = 0;
	hl_status st = HL_OK;

	if (t == NULL)
		return hl_error_nomem(err);
	while (st == HL_OK && next_pair(L, t, nt, &i, &j)) {
		hl_network *net = NULL;
		mlist trial;
		long worst;
		double keep;

		t[2 * nt] = L->origin[i];
		t[2 * nt + 1] = L->origin[j];
		nt++;
		if (mlist_copy(&trial, L) != HL_OK ||
		    mlist_merge(&trial, i, j) != HL_OK) {
			mlist_free(&trial);
			st = hl_error_nomem(err);
			break;
		}
		if (attempt(in, &trial, &net, &worst, &keep, err) == HL_OK &&
		    prefer_merge(net, *best)) {
			hl_network_free(*best);
			*best = net;
			mlist_free(L);
			*L = trial;
			continue;
		}
		hl_network_free(net);
		mlist_free(&trial);
	}
	free(t);
	return st;
}

/* Cut L's entry w in two at each of a few places (where its unit stood,
 * the complement, half by its loads) and keep the best network in *L and
 * *best when it beats *best; 1 when it did. */
static int
try_cuts(const hl_network_input *in, mlist *L, long w, double keep,
	 hl_network **best, long *worst, double *next_keep, hl_error *err)
{
	double frac[3] = { keep, 1.0 - keep, NAN };
	hl_network *top = NULL;
	mlist top_l;
	long top_w = -1;
	double top_k = NAN;
	int f, won = 0;

	memset(&top_l, 0, sizeof top_l);
	for (f = 0; f < 3; f++) {
		hl_network *net = NULL;
		mlist trial;
		long wv;
		double kv;

		if (!isnan(frac[f]) && (frac[f] < 0.05 || frac[f] > 0.95))
			continue;
		if (mlist_copy(&trial, L) != HL_OK ||
		    mlist_split(&trial, (size_t)w, frac[f]) != HL_OK ||
		    attempt(in, &trial, &net, &wv, &kv, err) != HL_OK) {
			mlist_free(&trial);
			continue;
		}
		if (top == NULL || net->penalty < top->penalty - 1e-9 ||
		    (net->penalty <= top->penalty + 1e-9 &&
		    net->nunit < top->nunit)) {
			hl_network_free(top);
			mlist_free(&top_l);
			top = net;
			top_l = trial;
			top_w = wv;
			top_k = kv;
		} else {
			hl_network_free(net);
			mlist_free(&trial);
		}
	}
	if (top == NULL)
		return 0;
	/* The next cut starts from the best of these, kept or not. */
	*worst = top_w;
	*next_keep = top_k;
	mlist_free(L);
	*L = top_l;
	if (prefer(top, *best)) {
		hl_network_free(*best);
		*best = top;
		won = 1;
	} else {
		hl_network_free(top);
	}
	return won;
}

hl_status
hl_network_place(const hl_network_input *in, hl_network **out,
		 hl_error *err)
{
	hl_network *best = NULL;
	size_t cuts, idle, limit = 8;
	mlist L;
	long worst;
	double keep;
	hl_status st;

	st = hl_net_check_input(in, err);
	if (st != HL_OK)
		return st;
	if (mlist_from_input(&L, in) != HL_OK) {
		mlist_free(&L);
		return hl_error_nomem(err);
	}
	st = attempt(in, &L, &best, &worst, &keep, err);
	if (st == HL_OK)
		st = try_merges(in, &L, &best, err);

	if (st == HL_OK && best->penalty > 0.0)
		st = attempt_worst(in, &L, &worst, &keep, err);
	for (cuts = 0, idle = 0; st == HL_OK && best->penalty > 0.0 &&
	     worst >= 0 && (size_t)worst < L.n && cuts < limit && idle < 2;
	     cuts++)
		idle = try_cuts(in, &L, worst, keep, &best, &worst, &keep,
		    err) ? 0 : idle + 1;
	if (st == HL_OK)
		st = note_changes(best, in, &L, err);
	mlist_free(&L);
	if (st != HL_OK) {
		hl_network_free(best);
		return st;
	}
	*out = best;
	return HL_OK;
}
