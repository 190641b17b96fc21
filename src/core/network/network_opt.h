/* network_opt.h - the least-cost network: total annual cost minimised over
 * structure, loads, splits and the energy level.
 *
 * Model: the stage-wise superstructure of Yee & Grossmann (1990) with
 * isothermal mixing. Every process stream passes S stages (stage 1 at the
 * hot end); in a stage a hot and a cold stream may meet in one unit; the
 * units of a stream in one stage are the branches of a split, which all
 * leave at the stage's outlet temperature, so that a branch's share of the
 * flow is its load over the stage's load. Utilities serve the stream ends
 * only: a cooler after the last stage of a hot stream, a heater after the
 * first stage of a cold stream, each on the cheapest utility the stream may
 * use. The variables are the loads q(stage, hot, cold); temperatures follow
 * from the energy balances along each stream.
 *
 * Objective: total annual cost, the capital of every unit priced by
 * hl_network_size_unit (the sizing the rest of the code uses: U, LMTD, F,
 * shells, the case's cost law per shell) times the capital recovery factor,
 * plus the utilities at the case's prices. Every unit keeps its required
 * approach (network.h; EMAT, not ΔTmin) at both ends and inside it.
 *
 * Search: a random walk over the loads with creation and removal of units
 * and compulsive acceptance of slightly worse states (after Xiao, Cui et al.
 * 2017-2019), each improvement polished by a coordinate search on the loads;
 * several walks from different starts (the given network, the network of
 * utilities only, random ones), a fixed number of evaluations each, spread
 * over threads. Walks are independent and combine by cost then walk number,
 * so the result depends on the input and the seed, not on the thread count
 * or timing, unless the time cap binds (then hl_opt_result.capped says so).
 *
 * Ownership: the result owns its network and its log; hl_opt_result_free
 * accepts NULL. Errors: HL_EINPUT for options that contradict the case,
 * HL_ENOSOLUTION when no network keeps every limit, HL_EIO for memory.
 */
#ifndef HL_NETWORK_OPT_H
#define HL_NETWORK_OPT_H

#include <stddef.h>

#include "case.h"
#include "network.h"
#include "status.h"

typedef void (*hl_opt_progress)(void *ctx, double done, double best_tac);

typedef struct {
	unsigned long seed;       /* 1 */
	int threads;              /* 2; the result does not depend on it */
	double time_limit;        /* s for the whole search, 60 */
	double effort;            /* multiplies the evaluations, 1 */
	int no_splits;            /* 1: no stream splits */
	const unsigned char *no_split;  /* per case stream or NULL */
	int max_branches;         /* most branches per split, 0: no limit */
	double min_duty;          /* kW per unit (utilities too), 0 */
	int min_duty_auto;        /* 1: min_duty is hl_opt_auto_min_duty's:
				     kept by every unit where a network
				     can, else by process units only, else
				     dropped (the result says which) */
	double min_area;          /* m² per unit, 0 */
	int max_shells;           /* in series per unit, 0: no limit */
	const hl_network *start;  /* a network of the case's parties, NULL */
	const unsigned char *keep;  /* per unit of start: must stay, NULL */
	int start_only;           /* walk from start only (no other starts) */
	hl_opt_progress progress; /* NULL or called now and then */
	void *ctx;
} hl_opt_options;

void hl_opt_options_default(hl_opt_options *o);

/* What the search changed and why, one line each. */
typedef enum {
	HL_OPT_DROPPED = 0,       /* a pair of the start the result lacks */
	HL_OPT_WORTH = 1,         /* a unit of the result and its worth */
	HL_OPT_SPLIT = 2          /* a split of the result against series */
} hl_opt_change_kind;

typedef struct {
	hl_opt_change_kind kind;
	char text[200];
	double d_energy;          /* kW: the unit's duty (dropped, worth) or
				     the hot utility series adds (split) */
	double d_tac;             /* currency/year: the total without the
				     unit, or with the split in series, or
				     (dropped) with the unit back at its
				     duty; HUGE_VAL: not possible; NaN:
				     unknown */
	double d_hot;             /* kW of hot utility a dropped unit back
				     changes (negative: saves), NaN else */
} hl_opt_change;

typedef struct {
	hl_network *net;          /* the network, sized, totals filled */
	double start_tac;         /* of opts.start, NaN when none */
	int kept_start;           /* 1: no better network than the start */
	size_t evals;             /* evaluations of the whole search */
	size_t walks;
	size_t stages;            /* S of the superstructure */
	int capped;               /* 1: the time limit stopped the search */
	double seconds;
	size_t nchange;
	hl_opt_change *change;
	char binding[400];        /* the limits that bind, "" when none */
	int min_duty_dropped;     /* 1: no network kept the default smallest
				     unit (min_duty_auto): it is dropped */
	int min_duty_tenth;       /* 1: the default would have cost too
				     much; a tenth of it, every unit, did
				     not */
	double smallest;          /* kW: the smallest duty in force under
				     the default, 0 none */
	double relaxed_tac;       /* the search's best without the default
				     smallest unit, NaN when not run */
} hl_opt_result;

/* Optimise the network of case c (its utilities must carry prices; a case
 * without utilities has nothing to trade energy against). */
hl_status hl_network_optimise(const hl_case *c, const hl_opt_options *o,
			      hl_opt_result **out, hl_error *err);
void hl_opt_result_free(hl_opt_result *r);

/* The smallest unit when the engineer sets none: 1 % of the largest
 * process stream duty (kW). Below it a unit's piping, instruments and
 * plot space outweigh its heat; common practice, no source. */
double hl_opt_auto_min_duty(const hl_case *c);

/* 1 when c suits the optimiser: utilities with prices of both kinds. */
int hl_network_optimise_fits(const hl_case *c);

#endif
