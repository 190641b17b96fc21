/* rfit_search.c - the search over modifications (rfit.h): every single
 * modification from today with its area tuned, then greedy chains from the
 * best of them, each step the modification that saves most within the
 * limits. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "netcheck.h"
#include "netsim.h"
#include "rfit_int.h"

/* Area factors tried on a modification's reference area, then refined. */
static const double GRID[] = { 0.125, 0.25, 0.5, 1.0, 2.0, 4.0 };
#define NGRID (sizeof GRID / sizeof GRID[0])
/* Shares of the first branch tried for a new split. */
static const double SHARES[] = { 0.2, 0.35, 0.5, 0.65, 0.8 };
#define NSHARES (sizeof SHARES / sizeof SHARES[0])
#define REFINE 3
/* Chains start from this many of the best single modifications. */
#define CHAINS 3

typedef struct {
	hl_rfit_kind kind;
	size_t unit;            /* in the base network */
	size_t hot, cold;       /* parties */
	int hot_pos, cold_pos;
	unsigned long ord;      /* enumeration order, for ties */
} rf_move;

const char *
hl_rfit_kind_name(hl_rfit_kind k)
{
	static const char *const name[] = {
		"add-shell-series", "add-shell-parallel", "re-pipe",
		"resequence", "add-unit", "remove-unit", "utility-area",
		"add-trim", "add-split", "drop-split", "heater-duty"
	};

	return (size_t)k < sizeof name / sizeof name[0] ? name[k] : "?";
}

int
hl_rfit_kind_derived(hl_rfit_kind k)
{
	return k == HL_RFIT_UTILITY_AREA || k == HL_RFIT_TRIM ||
	    k == HL_RFIT_HEATER_DUTY;
}

void
hl_rfit_opts_default(hl_rfit_opts *o)
{
	o->payback = 3.0;
	o->budget = NAN;
	o->max_changes = 4;
	o->time_limit = 60.0;
	o->seed = 1;
	o->repipe_cost = 20000.0;
	o->unit_cost = 30000.0;
	o->nproposal = 10;
}

/* A mixing hash of the seed and the move's order (splitmix64 finaliser,
 * Steele, Lea & Flood 2014): ties go to the smaller. */
static unsigned long long
tie(unsigned long seed, unsigned long ord)
{
	unsigned long long z = (unsigned long long)seed * 0x9E3779B97F4A7C15ULL
			       + ord;

	z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9ULL;
	z = (z ^ (z >> 27)) * 0x94D049BB133111EBULL;
	return z ^ (z >> 31);
}

/* a saves more than b (within the limits); seeded ties. */
static int
better(const rf_ctx *x, const rf_cand *a, unsigned long oa, const rf_cand *b,
       unsigned long ob)
{
	double d;

	if (!rf_within(x, a))
		return 0;
	if (b == NULL || !rf_within(x, b))
		return 1;
	d = a->saving - b->saving;
	if (fabs(d) > 1e-9 * (1.0 + fabs(b->saving)))
		return d > 0.0;
	if (fabs(a->investment - b->investment) > 1e-9 *
	    (1.0 + b->investment))
		return a->investment < b->investment;
	return tie(x->o->seed, oa) < tie(x->o->seed, ob);
}

static void
mod_init(hl_rfit_mod *m, hl_rfit_kind kind, const hl_network_unit *u)
{
	memset(m, 0, sizeof *m);
	m->kind = kind;
	snprintf(m->unit, sizeof m->unit, "%s",
	    u->reuses[0] != '\0' ? u->reuses : u->id);
}

/* A new unit between parties hot and cold, area a, in series. */
static int
add_new(hl_network *net, const rf_move *mv, double a)
{
	hl_network_unit u;
	int n = 0;
	size_t i;

	for (i = 0; i < net->nunit; i++)
		n += net->unit[i].id[0] == 'N';
	memset(&u, 0, sizeof u);
	snprintf(u.id, sizeof u.id, "N%d", n + 1);
	u.match = -1;
	u.hot = mv->hot;
	u.cold = mv->cold;
	u.hot_in = u.hot_out = rf_temp_at(net, mv->hot, mv->hot_pos);
	u.cold_in = u.cold_out = rf_temp_at(net, mv->cold, mv->cold_pos);
	u.hot_share = u.cold_share = 1.0;
	u.type = hl_network_unit_type(net, mv->hot, mv->cold);
	u.shells = u.shells_added = u.parallel = 1;
	u.held = 1;
	u.area_added = a;
	if (hl_network_add_unit(net, &u, NULL) != HL_OK)
		return -1;
	return rf_move_place(net, net->nunit - 1, mv->hot_pos, mv->cold_pos);
}

static const char *
tag(const hl_network_unit *u)
{
	return u->reuses[0] != '\0' ? u->reuses : u->id;
}

/* A split added (share s of the first branch) or dropped on a copy. */
static int
apply_split(hl_network *net, const rf_move *mv, double s, hl_rfit_mod *m)
{
	const char *name = net->party[mv->hot].name;
	size_t a, b;
	int k = mv->hot_pos;

	memset(m, 0, sizeof *m);
	m->kind = mv->kind;
	if (mv->kind == HL_RFIT_ADD_SPLIT) {
		if (rf_move_split(net, mv->hot, k, s, &a, &b) != 0)
			return -1;
		snprintf(m->from, sizeof m->from, "%s #%d, #%d", name, k,
		    k + 1);
		snprintf(m->to, sizeof m->to, "%s #%d split %.3g : %.3g",
		    name, k, s, 1.0 - s);
	} else {
		if (rf_move_unsplit(net, mv->hot, k, mv->cold_pos, &a, &b))
			return -1;
		snprintf(m->from, sizeof m->from, "%s #%d split", name, k);
		snprintf(m->to, sizeof m->to, "%s #%d, #%d", name, k, k + 1);
	}
	snprintf(m->unit, sizeof m->unit, "%.40s + %.40s", tag(&net->unit[a]),
	    tag(&net->unit[b]));
	net->unit[a].moved = net->unit[b].moved = 1;
	return 0;
}

/* Apply mv with area a to a copy of base (out); -1 when it cannot be. */
static int
apply(const rf_cand *base, const rf_move *mv, double a, rf_cand *out)
{
	hl_network *net;
	hl_network_unit *u;
	hl_rfit_mod *m;
	int rc = 0;

	if (base->nmove + 1 > RFIT_MAX_MODS / 2 || rf_cand_copy(out, base))
		return -1;
	net = out->net;
	out->nmod = out->nmove;
	m = &out->mod[out->nmove];
	if (mv->kind == HL_RFIT_ADD_SPLIT || mv->kind == HL_RFIT_DROP_SPLIT) {
		rc = apply_split(net, mv, a, m);
	} else if (mv->kind == HL_RFIT_NEW_UNIT) {
		rc = add_new(net, mv, a);
		if (rc == 0) {
			u = &net->unit[net->nunit - 1];
			mod_init(m, mv->kind, u);
			rf_place_text(net, u, m->to, sizeof m->to);
		}
	} else {
		u = &net->unit[mv->unit];
		mod_init(m, mv->kind, u);
		rf_place_text(net, u, m->from, sizeof m->from);
		if (mv->kind == HL_RFIT_SHELL_SERIES) {
			u->area_added += a;
			u->shells_added += 1;
			u->shells += 1;
		} else if (mv->kind == HL_RFIT_SHELL_PARALLEL) {
			u->area_added += a;
			u->shells_added += u->shells;
			u->parallel = (u->parallel > 0 ? u->parallel : 1) + 1;
		} else if (mv->kind == HL_RFIT_REMOVE) {
			rc = rf_move_remove(net, mv->unit);
		} else {
			rc = rf_move_repipe(net, mv->unit, mv->hot, mv->cold,
			    mv->hot_pos, mv->cold_pos);
			u->moved = 1;
		}
		if (rc == 0 && mv->kind != HL_RFIT_REMOVE)
			rf_place_text(net, u, m->to, sizeof m->to);
	}
	out->nmove++;
	out->nmod = out->nmove;
	if (rc != 0)
		rf_cand_clear(out);
	return rc;
}

/* The modification mv at its best area within the limits; out->net NULL
 * when none is. */
static hl_status
tune(rf_ctx *x, const rf_cand *base, const rf_move *mv, double ref,
     rf_cand *out)
{
	int area = mv->kind == HL_RFIT_SHELL_SERIES ||
	    mv->kind == HL_RFIT_SHELL_PARALLEL || mv->kind == HL_RFIT_NEW_UNIT;
	int share = mv->kind == HL_RFIT_ADD_SPLIT;
	double best_a = NAN, step = log(2.0);
	size_t g, n = area ? NGRID : share ? NSHARES : 1;
	int r;
	hl_status st;

	out->net = NULL;
	for (g = 0; g < n + (area ? 2 * REFINE : 0); g++) {
		rf_cand c;
		double a;

		if (rf_now() > x->t_end) {
			x->timed_out = 1;
			break;
		}
		if (g < n) {
			a = area ? GRID[g] * ref : share ? SHARES[g] : 0.0;
		} else {
			if (isnan(best_a))
				break;
			r = (int)(g - n);
			if (r % 2 == 0)
				step *= 0.5;
			a = best_a * exp(r % 2 == 0 ? -step : step);
		}
		if (apply(base, mv, a, &c) != 0)
			continue;
		st = rf_eval(x, &c);
		if (st != HL_OK) {
			rf_cand_clear(&c);
			rf_cand_clear(out);
			return st;
		}
		/* The smallest area first: a move that does not help (or
		 * breaks an approach) there only gets worse with more. */
		if (g == 0 && area && !(c.ok && c.saving > 0.0)) {
			rf_cand_clear(&c);
			break;
		}
		if (better(x, &c, mv->ord, out->net ? out : NULL, mv->ord)) {
			rf_cand_clear(out);
			*out = c;
			best_a = a;
		} else {
			rf_cand_clear(&c);
		}
	}
	return HL_OK;
}

/* A unit of base the search may still change (today's, not yet moved). */
static int
untouched(const rf_cand *base, const hl_network_unit *u)
{
	size_t k;

	if (u->reuses[0] == '\0')
		return 0;
	for (k = 0; k < base->nmove; k++)
		if (strcmp(base->mod[k].unit, u->reuses) == 0)
			return 0;
	return 1;
}

/* Could a unit at these places exchange heat at all (hot above cold by
 * the EMAT where it would begin and end)? */
static int
plausible(const hl_network *net, size_t h, int hp, size_t c, int cp)
{
	double th = rf_temp_at(net, h, hp), tc = rf_temp_at(net, c, cp);

	return th - tc > hl_network_required(&net->set, &net->party[h],
	    &net->party[c]);
}

typedef struct {
	rf_ctx *x;
	const rf_cand *base;
	rf_cand best;
	unsigned long best_ord;
	rf_cand *keep;         /* every single within the limits, or NULL */
	size_t nkeep, cap;
	unsigned long ord;
} walk;

/* Try one move; keep the best (and, for singles, all within limits). */
static hl_status
try_move(walk *w, rf_move *mv, double ref)
{
	rf_cand c;
	hl_status st;

	mv->ord = w->ord++;
	st = tune(w->x, w->base, mv, ref, &c);
	if (st != HL_OK || c.net == NULL)
		return st;
	if (w->keep != NULL && rf_within(w->x, &c)) {
		rf_cand d;

		if (w->nkeep == w->cap) {
			size_t cap = w->cap ? 2 * w->cap : 64;
			rf_cand *k = realloc(w->keep, cap * sizeof *k);

			if (k == NULL) {
				rf_cand_clear(&c);
				return HL_EIO;
			}
			w->keep = k;
			w->cap = cap;
		}
		if (rf_cand_copy(&d, &c) != 0) {
			rf_cand_clear(&c);
			return HL_EIO;
		}
		w->keep[w->nkeep++] = d;
	}
	if (better(w->x, &c, mv->ord, w->best.net ? &w->best : NULL,
	    w->best_ord)) {
		rf_cand_clear(&w->best);
		w->best = c;
		w->best_ord = mv->ord;
	} else {
		rf_cand_clear(&c);
	}
	return HL_OK;
}

static hl_status
area_moves(walk *w)
{
	const hl_network *net = w->base->net;
	size_t i;
	hl_status st = HL_OK;

	for (i = 0; i < net->nunit && st == HL_OK; i++) {
		const hl_network_unit *u = &net->unit[i];
		rf_move mv = { HL_RFIT_SHELL_SERIES, i, u->hot, u->cold, 0, 0,
			       0 };
		double ref = u->area_today > 0.0 ? u->area_today : 1.0;

		if (!rf_recovery(net, u) || !untouched(w->base, u))
			continue;
		st = try_move(w, &mv, ref);
		mv.kind = HL_RFIT_SHELL_PARALLEL;
		if (st == HL_OK && u->shells > 0)
			st = try_move(w, &mv, ref);
		mv.kind = HL_RFIT_REMOVE;
		if (st == HL_OK)
			st = try_move(w, &mv, 0.0);
	}
	return st;
}

/* Re-pipes of unit i to every place on every pair it could serve. */
static hl_status
repipe_moves(walk *w, size_t i)
{
	const hl_network *net = w->base->net;
	const hl_network_unit *u = &net->unit[i];
	size_t h, c;
	hl_status st = HL_OK;

	for (h = 0; h < net->nparty && st == HL_OK; h++)
		for (c = 0; c < net->nparty && st == HL_OK; c++) {
			const hl_network_party *ph = &net->party[h];
			const hl_network_party *pc = &net->party[c];
			int same = h == u->hot && c == u->cold;
			int nh = rf_stages(net, h) + (h == u->hot ? 0 : 1);
			int nc = rf_stages(net, c) + (c == u->cold ? 0 : 1);
			int hp, cp;

			if (ph->utility || pc->utility || ph->kind != HL_HOT ||
			    pc->kind != HL_COLD)
				continue;
			for (hp = 1; hp <= nh && st == HL_OK; hp++)
				for (cp = 1; cp <= nc && st == HL_OK; cp++) {
					rf_move mv = { HL_RFIT_REPIPE, i, h, c,
						       hp, cp, 0 };
					int dh = hp - u->hot_stage;
					int dc = cp - u->cold_stage;

					if (same && dh == 0 && dc == 0)
						continue;
					if (same && abs(dh) + abs(dc) == 1)
						mv.kind = HL_RFIT_RESEQUENCE;
					if (!same && !plausible(net, h, hp, c,
					    cp))
						continue;
					st = try_move(w, &mv, 0.0);
				}
		}
	return st;
}

static hl_status
new_moves(walk *w)
{
	const hl_network *net = w->base->net;
	size_t h, c;
	hl_status st = HL_OK;

	for (h = 0; h < net->nparty && st == HL_OK; h++)
		for (c = 0; c < net->nparty && st == HL_OK; c++) {
			int hp, cp;

			if (net->party[h].utility || net->party[c].utility ||
			    net->party[h].kind != HL_HOT ||
			    net->party[c].kind != HL_COLD)
				continue;
			for (hp = 1; hp <= rf_stages(net, h) + 1 &&
			     st == HL_OK; hp++)
				for (cp = 1; cp <= rf_stages(net, c) + 1 &&
				     st == HL_OK; cp++) {
					rf_move mv = { HL_RFIT_NEW_UNIT, 0, h,
						       c, hp, cp, 0 };

					if (plausible(net, h, hp, c, cp))
						st = try_move(w, &mv,
						    w->x->area_ref);
				}
		}
	return st;
}

/* Splits added between units that follow each other on a stream, and
 * two-branch splits put in series either way round. */
static hl_status
split_moves(walk *w)
{
	const hl_network *net = w->base->net;
	size_t p;
	hl_status st = HL_OK;

	for (p = 0; p < net->nparty && st == HL_OK; p++) {
		int k, n = rf_stages(net, p), o;

		if (net->party[p].utility)
			continue;
		for (k = 1; k <= n && st == HL_OK; k++) {
			rf_move mv = { HL_RFIT_ADD_SPLIT, 0, p, p, k, 0, 0 };

			if (k < n)
				st = try_move(w, &mv, 0.0);
			mv.kind = HL_RFIT_DROP_SPLIT;
			for (o = 0; o < 2 && st == HL_OK; o++) {
				mv.cold_pos = o;
				st = try_move(w, &mv, 0.0);
			}
		}
	}
	return st;
}

/* Every move from base; w->best the best within the limits. */
static hl_status
all_moves(walk *w)
{
	const hl_network *net = w->base->net;
	size_t i;
	hl_status st = area_moves(w);

	if (st == HL_OK)
		st = split_moves(w);

	for (i = 0; i < net->nunit && st == HL_OK; i++)
		if (rf_recovery(net, &net->unit[i]) &&
		    untouched(w->base, &net->unit[i]))
			st = repipe_moves(w, i);
	if (st == HL_OK)
		st = new_moves(w);
	return st;
}

static int
cmp_saving(const void *a, const void *b)
{
	const rf_cand *x = a, *y = b;

	if (x->saving != y->saving)
		return x->saving > y->saving ? -1 : 1;
	if (x->investment != y->investment)
		return x->investment < y->investment ? -1 : 1;
	return (x->nmove > y->nmove) - (x->nmove < y->nmove);
}

/* The proposal of candidate c (its network moves to the proposal). */
static hl_status
to_proposal(const rf_ctx *x, rf_cand *c, hl_rfit_proposal *p)
{
	memset(p, 0, sizeof *p);
	p->mod = malloc((c->nmod + 1) * sizeof *p->mod);
	if (p->mod == NULL)
		return HL_EIO;
	memcpy(p->mod, c->mod, c->nmod * sizeof *p->mod);
	p->nmod = c->nmod;
	p->hot_before = x->qh_today;
	p->cold_before = x->qc_today;
	p->hot_after = c->qh;
	p->cold_after = c->qc;
	p->cost_before = x->cost_today;
	p->cost_after = c->cost;
	p->saving = c->saving;
	p->investment = c->investment;
	p->payback = c->payback;
	p->net = c->net;
	c->net = NULL;
	return HL_OK;
}

/* A proposal already taken that saves at least as much for no more money
 * leaves c nothing to offer: an engineer would never choose it. */
static int
dominated(const hl_rfit *r, const rf_cand *c)
{
	size_t k;

	for (k = 0; k < r->nproposal; k++)
		if (r->p[k].saving >= c->saving - 1e-9 * (1.0 + c->saving) &&
		    r->p[k].investment <= c->investment + 1e-9 *
		    (1.0 + c->investment))
			return 1;
	return 0;
}

/* The simulator can leave a stretch of a stream unserved (a unit taken out
 * with no trim to replace it): such a candidate is no proposal. */
static int
sound(const hl_network *net)
{
	hl_netcheck *k = NULL;
	int ok = hl_netcheck_run(net, &k, NULL) == HL_OK && k->n == 0;

	hl_netcheck_free(k);
	return ok;
}

static hl_status
collect(const rf_ctx *x, rf_cand *pool, size_t n, hl_rfit *r)
{
	size_t i;
	hl_status st = HL_OK;

	qsort(pool, n, sizeof *pool, cmp_saving);
	r->p = calloc(x->o->nproposal + 1, sizeof *r->p);
	if (r->p == NULL)
		return HL_EIO;
	for (i = 0; i < n && r->nproposal < x->o->nproposal && st == HL_OK;
	     i++) {
		if (dominated(r, &pool[i]))
			continue;
		if (!sound(pool[i].net)) {
			r->refused++;
			continue;
		}
		st = to_proposal(x, &pool[i], &r->p[r->nproposal]);
		if (st == HL_OK)
			r->nproposal++;
	}
	return st;
}

/* A greedy chain from start: each step the best next modification. */
static hl_status
chain(rf_ctx *x, const rf_cand *start, rf_cand **pool, size_t *npool,
      size_t *cap)
{
	rf_cand cur;
	hl_status st = HL_OK;

	if (rf_cand_copy(&cur, start) != 0)
		return HL_EIO;
	while ((int)cur.nmove < x->o->max_changes && st == HL_OK &&
	       !x->timed_out) {
		walk w;

		memset(&w, 0, sizeof w);
		w.x = x;
		w.base = &cur;
		st = all_moves(&w);
		if (st != HL_OK || w.best.net == NULL ||
		    !(w.best.saving > cur.saving * (1.0 + 1e-6))) {
			rf_cand_clear(&w.best);
			break;
		}
		rf_cand_clear(&cur);
		cur = w.best;
		if (*npool == *cap) {
			rf_cand *p = realloc(*pool, 2 * *cap * sizeof *p);

			if (p == NULL) {
				st = HL_EIO;
				break;
			}
			*pool = p;
			*cap *= 2;
		}
		if (rf_cand_copy(&(*pool)[*npool], &cur) != 0)
			st = HL_EIO;
		else
			(*npool)++;
	}
	rf_cand_clear(&cur);
	return st;
}

static double
mean_recovery_area(const hl_network *net)
{
	double a = 0.0;
	size_t i, n = 0;

	for (i = 0; i < net->nunit; i++)
		if (rf_recovery(net, &net->unit[i])) {
			a += net->unit[i].area_today;
			n++;
		}
	return n > 0 ? a / (double)n : 50.0;
}

static hl_status
search(rf_ctx *x, const rf_cand *today, hl_rfit *r)
{
	walk w;
	size_t i, npool, cap;
	rf_cand *pool;
	hl_status st;

	memset(&w, 0, sizeof w);
	w.x = x;
	w.base = today;
	w.keep = malloc(64 * sizeof *w.keep);
	w.cap = w.keep != NULL ? 64 : 0;
	if (w.keep == NULL)
		return HL_EIO;
	st = all_moves(&w);
	rf_cand_clear(&w.best);
	r->singles = w.nkeep;
	pool = w.keep;
	npool = w.nkeep;
	cap = w.cap > npool ? w.cap : npool + 1;
	if (st == HL_OK) {
		qsort(pool, npool, sizeof *pool, cmp_saving);
		for (i = 0; i < npool && i < CHAINS && st == HL_OK; i++)
			st = chain(x, &pool[i], &pool, &npool, &cap);
	}
	if (st == HL_OK)
		st = collect(x, pool, npool, r);
	for (i = 0; i < npool; i++)
		rf_cand_clear(&pool[i]);
	free(pool);
	return st;
}

void
hl_rfit_free(hl_rfit *r)
{
	size_t i;

	if (r == NULL)
		return;
	for (i = 0; i < r->nproposal; i++) {
		free(r->p[i].mod);
		hl_network_free(r->p[i].net);
	}
	free(r->p);
	hl_network_free(r->today);
	free(r);
}

/* The context of a search from today: today simulated and priced. */
static hl_status
ctx_init(const hl_case *c, const hl_network *today, const hl_rfit_opts *o,
	 rf_ctx *x, rf_cand *t, hl_error *err)
{
	hl_status st;

	memset(t, 0, sizeof *t);
	memset(x, 0, sizeof *x);
	if ((t->net = hl_network_copy(today)) == NULL)
		return hl_error_nomem(err);
	x->c = c;
	x->o = o;
	x->t_end = rf_now() + o->time_limit;
	x->qh_target = today->qh_target;
	x->qc_target = today->qc_target;
	x->cost_today = today->energy_cost;
	st = rf_eval(x, t);
	if (st == HL_EIO)
		return hl_error_nomem(err);
	if (!t->ok)
		return hl_error_set(err, HL_ENOSOLUTION, NULL, 0, "today's "
		    "plant does not simulate to itself: %s", t->why);
	x->cost_today = t->cost;
	x->qh_today = t->qh;
	x->qc_today = t->qc;
	x->area_ref = mean_recovery_area(t->net);
	t->saving = 0.0;
	return HL_OK;
}

hl_status
hl_rfit_run(const hl_case *c, const hl_network *today, const hl_rfit_opts *o,
	    hl_rfit **out, hl_error *err)
{
	hl_rfit *r = calloc(1, sizeof *r);
	rf_ctx x;
	rf_cand t;
	hl_status st;

	*out = NULL;
	if (r == NULL)
		return hl_error_nomem(err);
	st = ctx_init(c, today, o, &x, &t, err);
	r->emat = today->set.emat;
	r->emat_case = isnan(c->set.emat) ? c->set.dtmin : c->set.emat;
	if (st == HL_OK)
		st = search(&x, &t, r);
	r->evaluated = x.evaluated;
	r->timed_out = x.timed_out;
	r->today = t.net;
	if (st == HL_EIO)
		st = hl_error_nomem(err);
	if (st != HL_OK) {
		hl_rfit_free(r);
		return st;
	}
	*out = r;
	return HL_OK;
}

hl_status
hl_rfit_try(const hl_case *c, const hl_network *today, const hl_rfit_opts *o,
	    const hl_rfit_move *mv, hl_rfit_proposal *out, int *valid,
	    hl_error *err)
{
	rf_move m = { mv->kind, mv->unit, mv->hot, mv->cold, mv->hot_pos,
		      mv->cold_pos, 0 };
	rf_ctx x;
	rf_cand t, cd;
	hl_status st = ctx_init(c, today, o, &x, &t, err);

	memset(out, 0, sizeof *out);
	*valid = 0;
	if (st == HL_OK && apply(&t, &m, mv->area, &cd) == 0) {
		st = rf_eval(&x, &cd);
		if (st == HL_OK && cd.ok) {
			*valid = 1;
			st = to_proposal(&x, &cd, out);
		}
		rf_cand_clear(&cd);
		if (st == HL_EIO)
			st = hl_error_nomem(err);
	}
	rf_cand_clear(&t);
	return st;
}
