/* network_refine.c - when the matches cannot be placed as they are.
 *
 * Two ways out keep a network feasible: relaxation (network_relax.c: heat
 * to utilities, an energy penalty) and more units: the match that breaks
 * its approach most is cut in two by heat, its hotter half on both sides
 * (from its per-interval loads, or its windows) becoming one unit and the
 * rest another, and the whole placement runs again. Up to a few such cuts
 * are tried (two in a row without gain end it); the network kept is the
 * one of least total annual cost when every utility it uses has a price,
 * else the one of least energy penalty where each added unit must save 1 %
 * of the recovered heat. See doc/methods.md, "Network placement".
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

/* Cut match i in two: its hotter x kW on both sides, and the rest. */
static hl_status
mlist_split(mlist *L, size_t i)
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
		x = cut_heat(&a, L->nint);
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
		x = 0.5 * a.duty;
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

/* a better than b: by total annual cost when both are priced; else each
 * unit a adds must save at least 1 % of the recovered heat in penalty
 * (a rule of thumb of this program, no source). */
static int
prefer(const hl_network *a, const hl_network *b)
{
	double tol = 1e-6 * fmax(1.0, fmax(a->qh, b->qh));
	double more = (double)a->nunit - (double)b->nunit;

	if (priced(a) && priced(b))
		return a->total_cost < b->total_cost * (1.0 - 1e-9);
	if (a->penalty < b->penalty - tol)
		return more <= 0.0 || b->penalty - a->penalty >=
		    0.01 * recovery(b) * more;
	if (a->penalty <= b->penalty + tol)
		return a->nunit < b->nunit || (a->nunit == b->nunit &&
		    a->capital < b->capital);
	return 0;
}

static hl_status
attempt(const hl_network_input *in, const mlist *L, hl_network **out,
	long *worst, hl_error *err)
{
	hl_network_input sub = *in;
	hl_status st;
	long w;
	size_t i;

	sub.match = L->m;
	sub.nmatch = L->n;
	st = hl_net_attempt(&sub, out, &w, err);
	if (st != HL_OK)
		return st;
	*worst = w;
	for (i = 0; i < (*out)->nunit; i++)
		if ((*out)->unit[i].match >= 0)
			(*out)->unit[i].match = L->origin[(*out)->unit[i].match];
	(*out)->nmatch = in->nmatch;
	return HL_OK;
}

/* What the network changed against the input's matches, in notes. */
static hl_status
note_changes(hl_network *net, const hl_network_input *in, hl_error *err)
{
	size_t i, k;
	hl_status st = HL_OK;

	for (k = 0; k < in->nmatch && st == HL_OK; k++) {
		const hl_network_match *m = &in->match[k];
		char ids[128] = "";
		double sum = 0.0;
		size_t n = 0, len;

		for (i = 0; i < net->nunit; i++)
			if (net->unit[i].match == (long)k) {
				len = strlen(ids);
				snprintf(ids + len, sizeof ids - len, "%s%s",
				    n ? ", " : "", net->unit[i].id);
				sum += net->unit[i].duty;
				n++;
			}
		if (n == 0)
			st = hl_network_add_note(net, err, "the match %s to %s "
			    "(%.1f kW) is dropped: no placement keeps its "
			    "approach", in->party[m->hot].name,
			    in->party[m->cold].name, m->duty);
		else if (n > 1)
			st = hl_network_add_note(net, err, "the match %s to %s "
			    "(%.1f kW) is placed as %zu units (%s): as one unit "
			    "it cannot keep the approach", in->party[m->hot].name,
			    in->party[m->cold].name, m->duty, n, ids);
		if (st == HL_OK && n > 0 && fabs(sum - m->duty) > 1e-6 *
		    fmax(1.0, m->duty))
			st = hl_network_add_note(net, err, "%s (%s to %s) "
			    "carries %.1f kW instead of the match's %.1f kW",
			    ids, in->party[m->hot].name,
			    in->party[m->cold].name, sum, m->duty);
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
	if (st == HL_OK && net->penalty > 1e-9 * fmax(1.0, net->qh))
		st = hl_network_add_note(net, err, "the placement needs "
		    "%.1f kW more hot and cold utility than the matches: "
		    "their loads allow no placement that keeps every approach",
		    net->penalty);
	return st;
}

hl_status
hl_network_place(const hl_network_input *in, hl_network **out,
		 hl_error *err)
{
	hl_network *best = NULL, *net;
	size_t cuts, idle, limit = 8;
	mlist L;
	long worst;
	hl_status st;

	st = hl_net_check_input(in, err);
	if (st != HL_OK)
		return st;
	if (mlist_from_input(&L, in) != HL_OK) {
		mlist_free(&L);
		return hl_error_nomem(err);
	}
	st = attempt(in, &L, &best, &worst, err);
	for (cuts = 0, idle = 0; st == HL_OK && worst >= 0 && cuts < limit &&
	     idle < 2; cuts++) {
		if ((size_t)worst >= L.n || mlist_split(&L, (size_t)worst) !=
		    HL_OK)
			break;
		if (attempt(in, &L, &net, &worst, err) != HL_OK)
			break;
		if (prefer(net, best)) {
			hl_network_free(best);
			best = net;
			idle = 0;
		} else {
			hl_network_free(net);
			idle++;
		}
	}
	mlist_free(&L);
	if (st == HL_OK)
		st = note_changes(best, in, err);
	if (st != HL_OK) {
		hl_network_free(best);
		return st;
	}
	*out = best;
	return HL_OK;
}
