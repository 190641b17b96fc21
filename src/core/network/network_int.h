/* network_int.h - the placement's working state (private to network_*.c).
 *
 * Every process stream has a lane: its stages from the supply end, each a
 * block of one unit (series) or several (a split, with shares). The units
 * live in net->unit with their duties and parties; an evaluation walks the
 * lanes and writes every terminal temperature and share, then scores the
 * whole network by its violation V (Σ over units of the approach missing
 * below the required one, in K) and, when V is nil, its cost (capital by the
 * cost law, or area when the case gives no cost).
 */
#ifndef HL_NETWORK_INT_H
#define HL_NETWORK_INT_H

#include <stddef.h>

#include "network.h"

/* V at or below this (K) counts as feasible. */
#define HL_NET_VTOL 1e-6
/* The smallest branch share a split may give. */
#define HL_NET_SMIN 0.02
/* A unit is idle at or below this fraction of the duty of the smaller of
 * its process streams, and its heat nil at or below HL_NET_ZERO of it
 * (network_idle.c). */
#define HL_NET_IDLE 1e-3
#define HL_NET_ZERO 1e-9

typedef struct {
	size_t n, cap;
	size_t *u;        /* units, indices into net->unit */
	double *share;
} hl_net_block;

typedef struct {
	size_t n, cap;
	hl_net_block *b;  /* stages from the supply end */
} hl_net_lane;

typedef struct {
	double v;         /* K of approach missing, summed over units */
	double cost;      /* objective when v is nil, HUGE_VAL otherwise */
} hl_net_score;

typedef struct {
	hl_network *net;      /* parties, units (duty, ends, temperatures) */
	hl_net_lane *lane;    /* one per party; utility lanes stay empty */
	double *key_hot;      /* per unit: where it works on each side, °C */
	double *key_cold;
	double *viol;         /* per unit: missing approach, K */
	double *cost;         /* per unit: objective, NaN until computed */
	long *group;          /* per unit: its match's group, -1: none */
	size_t cap;           /* units allocated in the arrays above */
	int by_area;          /* no cost law: the objective is area */
	size_t evals;         /* evaluations so far */
	size_t max_evals;     /* budget for the improvement searches */
} hl_net_place;

/* The units of one lane as they were, to undo a move on it. */
typedef struct {
	size_t n, cap;
	size_t *idx;
	hl_network_unit *u;
	double *viol, *cost;
} hl_net_snap;

hl_net_place *hl_net_place_create(hl_network *net);
void hl_net_place_free(hl_net_place *P);

/* Add a unit (process or utility ends) in its own new block at the end of
 * each process lane it touches, or at position pos (SIZE_MAX: the end). */
hl_status hl_net_place_add_unit(hl_net_place *P, const hl_network_unit *u,
				double key_hot, double key_cold);
/* Move block i of L to index j (the others keep their order). */
void hl_net_lane_move(hl_net_lane *L, size_t i, size_t j);
/* Merge blocks i..j of L into block i; shares by heat. */
hl_status hl_net_lane_merge(hl_net_lane *L, size_t i, size_t j,
			    const hl_network *net);
/* Split block i of L into single blocks in the order given by key. */
hl_status hl_net_lane_unmerge(hl_net_lane *L, size_t i, const double *key,
			      int falling);
/* Deep copies, for undo. */
hl_status hl_net_lane_copy(hl_net_lane *dst, const hl_net_lane *src);
void hl_net_lane_clear(hl_net_lane *L);
/* Drop unit index u from whatever block of L holds it (shares rescaled). */
void hl_net_lane_remove(hl_net_lane *L, size_t u);

/* Temperatures, shares and stages of every unit; returns V (K). */
double hl_net_eval(hl_net_place *P);
/* Missing approach (K) of one unit after hl_net_eval. */
double hl_net_unit_violation(const hl_net_place *P, size_t u);
/* Score the current state (evaluates it). */
hl_net_score hl_net_score_now(hl_net_place *P);
/* Score after a change to lane p only (re-evaluates its units). */
hl_net_score hl_net_rescore(hl_net_place *P, size_t p);
/* Score after a change to lanes p and q (either may be a utility's). */
hl_net_score hl_net_rescore2(hl_net_place *P, size_t p, size_t q);
/* Remember the units of lanes p and q. */
hl_status hl_net_snap_take2(const hl_net_place *P, size_t p, size_t q,
			    hl_net_snap *s);
/* Remember lane p's units; put them back as they were. */
hl_status hl_net_snap_take(const hl_net_place *P, size_t p, hl_net_snap *s);
void hl_net_snap_restore(hl_net_place *P, const hl_net_snap *s);
void hl_net_snap_free(hl_net_snap *s);
/* a better than b. */
int hl_net_better(hl_net_score a, hl_net_score b);

/* Searches (network_search.c); each leaves the state at its best. */
hl_net_score hl_net_search_order(hl_net_place *P, hl_net_score cur,
				 hl_status *st);
hl_net_score hl_net_search_shares(hl_net_place *P, size_t p, size_t b,
				  hl_net_score cur, hl_status *st);
hl_net_score hl_net_search_splits(hl_net_place *P, hl_net_score cur,
				  hl_status *st);
hl_net_score hl_net_search_unsplit(hl_net_place *P, hl_net_score cur,
				   hl_status *st);
/* Shift heat between two units of one group (pieces of one match: all
 * balances keep). */
hl_net_score hl_net_search_pairs(hl_net_place *P, hl_net_score cur,
				 hl_status *st);

/* Check a placement input: parties, duties, stream balances, targets. */
hl_status hl_net_check_input(const hl_network_input *in, hl_error *err);
/* One placement of in's matches (network_place.c), relaxed where it must
 * be; *worst: the match that broke the approach most before relaxing, -1
 * when none did, and *keep the fraction of its duty its place allowed.
 * Units keep in's match indices; no notes. */
hl_status hl_net_attempt(const hl_network_input *in, hl_network **out,
			 long *worst, double *keep, hl_error *err);

/* Relaxation (network_relax.c): cut the duty of violating units and move
 * the heat to utilities until V is nil. */
hl_status hl_net_relax(hl_net_place *P, hl_error *err);
/* Largest duty (kW) unit k can carry where it stands (after hl_net_eval). */
double hl_net_max_duty(const hl_net_place *P, size_t k);

/* Idle units (network_idle.c): take out every unit of nil heat, and every
 * idle one whose heat a path of other units can carry with every approach
 * kept (net->penalty grows by the utility that adds); stages renumbered,
 * the state evaluated. Errors: HL_EIO. */
hl_status hl_net_drop_idle(hl_net_place *P, hl_error *err);
/* kW at or below which a unit between parties hot and cold is idle. */
double hl_net_idle_limit(const hl_network *net, size_t hot, size_t cold);

#endif
