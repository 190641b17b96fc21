/* network_search.c - local searches over the free choices of a placement:
 * the series order of each stream's stages, the shares of each split, and
 * which stages to split (doc/methods.md, "Network placement"). Every move
 * changes one lane; it is scored on the whole network (the other lanes'
 * units keep their cached scores) and kept only when it is better: first
 * less missing approach, then, once every approach holds, less cost. */
#include <math.h>
#include <stdlib.h>

#include "network_int.h"

static int
budget_left(const hl_net_place *P)
{
	return P->evals < P->max_evals;
}

/* One pass of insertion moves over lane p; returns 1 when one was kept. */
static int
order_pass(hl_net_place *P, size_t p, hl_net_score *cur, hl_net_snap *snap,
	   hl_status *st)
{
	hl_net_lane *L = &P->lane[p];
	size_t i, j;
	int kept = 0;

	if ((*st = hl_net_snap_take(P, p, snap)) != HL_OK)
		return 0;
	for (i = 0; i < L->n && budget_left(P); i++)
		for (j = 0; j < L->n && budget_left(P); j++) {
			hl_net_score s;

			if (i == j)
				continue;
			hl_net_lane_move(L, i, j);
			s = hl_net_rescore(P, p);
			if (hl_net_better(s, *cur)) {
				*cur = s;
				kept = 1;
				if ((*st = hl_net_snap_take(P, p, snap)) !=
				    HL_OK)
					return 0;
			} else {
				hl_net_lane_move(L, j, i);
				hl_net_snap_restore(P, snap);
			}
		}
	return kept;
}

/* Insertion moves (take a stage out, put it back elsewhere) on every lane
 * until none helps. */
hl_net_score
hl_net_search_order(hl_net_place *P, hl_net_score cur, hl_status *st)
{
	hl_net_snap snap = { 0 };
	size_t p, round;
	int kept = 1;

	*st = HL_OK;
	for (round = 0; kept && round < 30 && budget_left(P) &&
	     *st == HL_OK; round++) {
		kept = 0;
		for (p = 0; p < P->net->nparty && *st == HL_OK; p++)
			if (P->lane[p].n > 1)
				kept |= order_pass(P, p, &cur, &snap, st);
	}
	hl_net_snap_free(&snap);
	return cur;
}

/* Pattern search on the shares of block b of lane p: move `step` of the
 * flow from one branch to another, halving the step when no move helps. */
hl_net_score
hl_net_search_shares(hl_net_place *P, size_t p, size_t b, hl_net_score cur,
		     hl_status *st)
{
	hl_net_block *B = &P->lane[p].b[b];
	hl_net_snap snap = { 0 };
	double step = 0.1, sum = 0.0;
	size_t i, j;

	if ((*st = hl_net_snap_take(P, p, &snap)) != HL_OK)
		return cur;
	while (step >= 1e-4 && budget_left(P)) {
		int kept = 0;

		for (i = 0; i < B->n; i++)
			for (j = 0; j < B->n; j++) {
				hl_net_score s;

				if (i == j || B->share[j] - step < HL_NET_SMIN)
					continue;
				B->share[i] += step;
				B->share[j] -= step;
				s = hl_net_rescore(P, p);
				if (hl_net_better(s, cur)) {
					cur = s;
					kept = 1;
					*st = hl_net_snap_take(P, p, &snap);
					if (*st != HL_OK)
						goto out;
				} else {
					B->share[i] -= step;
					B->share[j] += step;
					hl_net_snap_restore(P, &snap);
				}
			}
		if (!kept)
			step *= 0.5;
	}
	for (i = 0; i < B->n; i++)
		sum += B->share[i];
	for (i = 0; i < B->n; i++)
		B->share[i] /= sum;
	cur = hl_net_rescore(P, p);
out:
	hl_net_snap_free(&snap);
	return cur;
}

/* Shares that give every branch the temperature change of its partner
 * across the unit (the cp of each branch equal to its partner's); 0 when
 * some partner does not change temperature. Partners lie on other lanes,
 * so the series layout's temperatures still hold for them. */
static int
partner_shares(const hl_net_place *P, hl_net_block *B, int hot_lane)
{
	double w[64], sum = 0.0;
	size_t k;

	if (B->n > 64)
		return 0;
	for (k = 0; k < B->n; k++) {
		const hl_network_unit *u = &P->net->unit[B->u[k]];
		double dt = hot_lane ? u->cold_out - u->cold_in :
		    u->hot_in - u->hot_out;

		if (!(dt > 1e-6))
			return 0;
		w[k] = u->duty / dt;
		sum += w[k];
	}
	for (k = 0; k < B->n; k++)
		B->share[k] = fmax(HL_NET_SMIN, w[k] / sum);
	return 1;
}

static int
lane_violates(const hl_net_place *P, const hl_net_lane *L)
{
	size_t b, k;

	for (b = 0; b < L->n; b++)
		for (k = 0; k < L->b[b].n; k++)
			if (hl_net_unit_violation(P, L->b[b].u[k]) >
			    HL_NET_VTOL)
				return 1;
	return 0;
}

/* Try stages i..j of lane p as one split, with shares by heat and by the
 * partners' cp; keep the best found in *keep. */
static hl_status
try_split(hl_net_place *P, size_t p, size_t i, size_t j, hl_net_score *best,
	  hl_net_lane *keep, size_t *keep_p)
{
	hl_net_lane *L = &P->lane[p], save;
	hl_net_snap snap = { 0 };
	hl_status st = HL_OK;
	int variant;

	if (hl_net_snap_take(P, p, &snap) != HL_OK)
		return HL_EIO;
	for (variant = 0; variant < 2 && st == HL_OK; variant++) {
		hl_net_score s;

		if (hl_net_lane_copy(&save, L) != HL_OK) {
			st = HL_EIO;
			break;
		}
		if (hl_net_lane_merge(L, i, j, P->net) != HL_OK) {
			hl_net_lane_clear(&save);
			st = HL_EIO;
			break;
		}
		if (variant == 0 || partner_shares(P, &L->b[i],
		    P->net->party[p].kind == HL_HOT)) {
			s = hl_net_rescore(P, p);
			s = hl_net_search_shares(P, p, i, s, &st);
			if (st == HL_OK && hl_net_better(s, *best)) {
				*best = s;
				hl_net_lane_clear(keep);
				st = hl_net_lane_copy(keep, L);
				*keep_p = p;
			}
		}
		hl_net_lane_clear(L);
		*L = save;
		hl_net_snap_restore(P, &snap);
	}
	hl_net_snap_free(&snap);
	return st;
}

/* Where series placement breaks an approach, try each run of up to four
 * consecutive stages of a lane holding a violating unit as one split, and
 * keep the single best split over all lanes. */
hl_net_score
hl_net_search_splits(hl_net_place *P, hl_net_score cur, hl_status *st)
{
	hl_net_lane keep = { 0, 0, NULL };
	size_t p, i, j, keep_p = (size_t)-1;
	hl_net_score best = cur;

	*st = HL_OK;
	for (p = 0; p < P->net->nparty && *st == HL_OK; p++) {
		hl_net_lane *L = &P->lane[p];

		if (L->n < 2 || !lane_violates(P, L))
			continue;
		for (i = 0; i + 1 < L->n && *st == HL_OK; i++)
			for (j = i + 1; j < L->n && j <= i + 3 &&
			    *st == HL_OK && budget_left(P); j++)
				*st = try_split(P, p, i, j, &best, &keep,
				    &keep_p);
	}
	if (*st == HL_OK && keep_p != (size_t)-1) {
		hl_net_lane_clear(&P->lane[keep_p]);
		P->lane[keep_p] = keep;
		cur = hl_net_rescore(P, keep_p);
	} else {
		hl_net_lane_clear(&keep);
	}
	return cur;
}

/* An engineer prefers series to a split: undo any split whose units keep
 * every approach in series (in the order of where they work). */
hl_net_score
hl_net_search_unsplit(hl_net_place *P, hl_net_score cur, hl_status *st)
{
	hl_net_snap snap = { 0 };
	size_t p, b;

	*st = HL_OK;
	for (p = 0; p < P->net->nparty && *st == HL_OK; p++) {
		hl_net_lane *L = &P->lane[p];
		int hot = P->net->party[p].kind == HL_HOT;

		for (b = 0; b < L->n && *st == HL_OK; b++) {
			hl_net_lane save;
			hl_net_score s;

			if (L->b[b].n < 2)
				continue;
			if (hl_net_snap_take(P, p, &snap) != HL_OK ||
			    hl_net_lane_copy(&save, L) != HL_OK) {
				*st = HL_EIO;
				break;
			}
			if (hl_net_lane_unmerge(L, b, hot ? P->key_hot :
			    P->key_cold, hot) != HL_OK) {
				hl_net_lane_clear(&save);
				*st = HL_EIO;
				break;
			}
			s = hl_net_rescore(P, p);
			if (s.v <= HL_NET_VTOL) {
				hl_net_lane_clear(&save);
				cur = s;
			} else {
				hl_net_lane_clear(L);
				*L = save;
				hl_net_snap_restore(P, &snap);
			}
		}
	}
	hl_net_snap_free(&snap);
	return cur;
}

/* Pattern search on the heat of two pieces of one match (same parties):
 * a step of their sum moves from one to the other, halving from a tenth
 * to 10⁻⁴ when no move helps. Both streams' balances keep, and so does
 * every utility load. No unit falls below 2 % of the pair's heat. */
static hl_net_score
pair_shift(hl_net_place *P, size_t a, size_t b, hl_net_score cur,
	   hl_status *st)
{
	hl_network_unit *ua = &P->net->unit[a], *ub = &P->net->unit[b];
	size_t h = ua->hot, c = ua->cold;
	double sum = ua->duty + ub->duty, step = 0.1;
	hl_net_snap snap = { 0 };

	if ((*st = hl_net_snap_take2(P, h, c, &snap)) != HL_OK)
		return cur;
	while (step >= 1e-4 && budget_left(P)) {
		int kept = 0, dir;

		for (dir = -1; dir <= 1; dir += 2) {
			double d = dir * step * sum;
			hl_net_score s;

			if (ua->duty + d < HL_NET_SMIN * sum ||
			    ub->duty - d < HL_NET_SMIN * sum)
				continue;
			ua->duty += d;
			ub->duty -= d;
			s = hl_net_rescore2(P, h, c);
			if (hl_net_better(s, cur)) {
				cur = s;
				kept = 1;
				if ((*st = hl_net_snap_take2(P, h, c, &snap)) !=
				    HL_OK)
					goto out;
			} else {
				hl_net_snap_restore(P, &snap);
			}
		}
		if (!kept)
			step *= 0.5;
	}
out:
	hl_net_snap_free(&snap);
	return cur;
}

hl_net_score
hl_net_search_pairs(hl_net_place *P, hl_net_score cur, hl_status *st)
{
	hl_network *net = P->net;
	size_t a, b;

	*st = HL_OK;
	for (a = 0; a < net->nunit && *st == HL_OK; a++)
		for (b = a + 1; b < net->nunit && *st == HL_OK; b++) {
			if (net->unit[a].duty <= 0.0 ||
			    net->unit[b].duty <= 0.0 || P->group[a] < 0 ||
			    P->group[a] != P->group[b])
				continue;
			cur = pair_shift(P, a, b, cur, st);
		}
	return cur;
}
