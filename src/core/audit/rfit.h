/* rfit.h - retrofit proposals: concrete modifications to today's plant,
 * each simulated with the rating model, priced, checked and ranked.
 *
 * Today's plant (hl_rfit_today) becomes a network of held units
 * (network.h): every row of the existing network with its shells, placed on
 * its streams in stages (parallel branches as splits), its area taken as
 * what the model needs for today's duty (so that the simulation of today
 * returns today; the data-sheet area stands beside it in the unit's note),
 * and EMAT lowered to the smallest approach today's units already run at
 * when that is below the case's.
 *
 * Modifications (hl_rfit_kind), each applied to a copy of a network:
 *  - more area on a recovery unit: a shell in series (the series count
 *    rises by one) or shells in parallel (one per shell in series; the
 *    series count stays); the added area is tuned;
 *  - a re-pipe: a recovery unit moved, with its area and shells, to
 *    another place on its own streams ("resequence" when it only changes
 *    place with its neighbour on one stream) or to another pair;
 *  - a new unit between a hot and a cold stream at any place on each; its
 *    area tuned, its shells by the Xp rule at the conditions it meets;
 *  - a unit taken out;
 *  - a split added: two recovery units that follow each other on a
 *    process stream become the two branches of a split there, the share
 *    tuned; or dropped: the two branches of a split put in series, in
 *    either order (each a re-pipe's fixed cost);
 *  - more area on a heater or cooler whose new duty needs it, more firing
 *    on a fired heater whose new duty passes its rating (today's duty),
 *    and a trim heater or cooler where a stream would end short of its
 *    target: these follow from the others and are priced with them.
 * Splits of more than two branches, and splits of a heater or cooler, stay
 * as they are.
 *
 * Each candidate is simulated (netsim.h): recovery units do what their area
 * allows, heaters and coolers make up the rest to their set points. It is
 * kept when every stream reaches its target, every approach keeps the EMAT
 * and every unit can be sized at its shells. Prices: bought shells by the
 * case's cost law per shell, a + b·A_shell^c (a utility's own law on its
 * heaters and coolers), firing bought by the fired-heater law on its duty
 * (network_held.c); each re-pipe and each new
 * unit (trims included) a fixed cost on top (hl_rfit_opts, with illustrative
 * defaults); saving = today's utility cost − the new one (each utility's
 * load × price × hours); simple payback = investment / saving.
 *
 * Search: every single modification from today, its area tuned on a
 * geometric grid and refined by golden-section steps, for the largest
 * saving within the limits (payback, budget); the best of them are the
 * one-change proposals; from each of the best few a greedy chain adds the
 * modification that raises the saving most within the limits, up to
 * max_changes (Asante & Zhu 1997: relieve the network's bottleneck one
 * modification at a time; Akpomiemie & Smith 2015: added area only).
 * Deterministic: moves are tried in a fixed order; seed breaks ties
 * between equal savings and orders the chains' starts; a time limit ends
 * the search early and says so.
 *
 * Ownership: hl_rfit_free(NULL) is fine; proposals own their networks.
 */
#ifndef HL_RFIT_H
#define HL_RFIT_H

#include <stddef.h>

#include "case.h"
#include "existing.h"
#include "network.h"
#include "status.h"

typedef enum {
	HL_RFIT_SHELL_SERIES = 0,  /* area added as a shell in series */
	HL_RFIT_SHELL_PARALLEL,    /* area added as shells in parallel */
	HL_RFIT_REPIPE,            /* moved to another place or pair */
	HL_RFIT_RESEQUENCE,        /* swapped with its neighbour on a stream */
	HL_RFIT_NEW_UNIT,          /* a new exchanger */
	HL_RFIT_REMOVE,            /* taken out */
	HL_RFIT_UTILITY_AREA,      /* a heater or cooler needs more area */
	HL_RFIT_TRIM,              /* a new heater or cooler at a stream end */
	HL_RFIT_ADD_SPLIT,         /* two units in series on a stream made
				      parallel branches */
	HL_RFIT_DROP_SPLIT,        /* two branches of a split put in series */
	HL_RFIT_HEATER_DUTY        /* a fired heater fires beyond its rating */
} hl_rfit_kind;

/* "add-shell-series", "add-shell-parallel", "re-pipe", "resequence",
 * "add-unit", "remove-unit", "utility-area", "add-trim", "add-split",
 * "drop-split", "heater-duty". */
const char *hl_rfit_kind_name(hl_rfit_kind k);

/* 1 for the kinds that follow from the moves (utility area, trims, heater
 * duty) and do not count as changes. */
int hl_rfit_kind_derived(hl_rfit_kind k);

typedef struct {
	hl_rfit_kind kind;
	char unit[96];       /* today's tag, or the new unit's id */
	char from[200];      /* where it was ("" for a new unit) */
	char to[200];        /* where it is ("" when taken out) */
	double area_added;   /* m² */
	int shells_added;    /* shells bought; heaters for a fired heater */
	double duty_added;   /* kW of firing bought (fired heaters) */
	double cost;         /* currency: shells bought + fixed cost */
} hl_rfit_mod;

typedef struct {
	size_t nmod;
	hl_rfit_mod *mod;
	double hot_before, cold_before;   /* kW */
	double hot_after, cold_after;     /* kW */
	double cost_before, cost_after;   /* utility cost per year */
	double saving;                    /* per year */
	double investment;                /* currency */
	double payback;                   /* years */
	hl_network *net;                  /* the plant after the changes */
} hl_rfit_proposal;

typedef struct {
	double payback;      /* years, > 0; NaN: no limit */
	double budget;       /* currency, > 0; NaN: no limit */
	int max_changes;     /* >= 1 (trims and utility area not counted) */
	double time_limit;   /* s, > 0 */
	unsigned long seed;
	double repipe_cost;  /* currency per re-pipe, >= 0 */
	double unit_cost;    /* currency per new unit on top of its shells */
	size_t nproposal;    /* at most this many proposals, >= 1 */
} hl_rfit_opts;

/* Illustrative fixed costs (invented round figures, currency units; the
 * output marks them as such): a re-pipe 20 000, a new unit 30 000 on top
 * of its shells. Limits: payback 3 years, no budget, 4 changes, 60 s,
 * seed 1, 10 proposals. */
void hl_rfit_opts_default(hl_rfit_opts *o);

typedef struct {
	hl_network *today;   /* today's plant as simulated */
	double emat;         /* K, the approach every unit keeps */
	double emat_case;    /* K, the case's */
	size_t nproposal;
	hl_rfit_proposal *p; /* ranked: largest saving first */
	size_t evaluated;    /* candidates simulated */
	size_t singles;      /* single modifications within the limits */
	size_t refused;      /* candidates whose network failed the check */
	int timed_out;       /* the time limit ended the search */
} hl_rfit;

/* Today's plant from the audit's reading ex of case c. HL_EINPUT when a
 * stretch of a stream has no utility that could serve it, or a unit cannot
 * be sized at all. */
hl_status hl_rfit_today(const hl_case *c, const hl_existing *ex,
			hl_network **out, hl_error *err);

/* Search retrofits of today (from hl_rfit_today; the result keeps a copy)
 * within o. An empty proposal list is a valid answer (nothing pays back
 * within the limits). Errors: HL_EIO memory; HL_ENOSOLUTION when today's
 * plant itself does not settle. */
hl_status hl_rfit_run(const hl_case *c, const hl_network *today,
		      const hl_rfit_opts *o, hl_rfit **out, hl_error *err);
void hl_rfit_free(hl_rfit *r);

/* One given modification of today, for checks and for callers with their
 * own search: kind (a search move, not utility-area, add-trim or
 * heater-duty); unit,
 * an index into today->unit (more area, re-pipe, resequence, remove);
 * hot, cold, hot_pos, cold_pos, the pair and places (re-pipe,
 * resequence, new unit; places counted once the unit is lifted off);
 * area (m², more area and new unit). A split: hot is the process stream,
 * hot_pos the stage (add-split: the first of the two units in series,
 * area the first one's share in (0, 1); drop-split: the split's stage,
 * cold_pos 0 or 1, which branch goes first). */
typedef struct {
	hl_rfit_kind kind;
	size_t unit;
	size_t hot, cold;
	int hot_pos, cold_pos;
	double area;
} hl_rfit_move;

/* Simulate and price mv on today. *out receives a proposal (its net NULL
 * and *valid 0 when the plant would not run: a stream past its target, an
 * approach below the EMAT, a place that does not exist); the limits of o
 * are not applied. Free out->mod and out->net. HL_EIO memory. */
hl_status hl_rfit_try(const hl_case *c, const hl_network *today,
		      const hl_rfit_opts *o, const hl_rfit_move *mv,
		      hl_rfit_proposal *out, int *valid, hl_error *err);

#endif
