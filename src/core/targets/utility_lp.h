/* utility_lp.h - the cheapest mix of utility levels.
 *
 * Method: the transshipment LP of Papoulias & Grossmann (1983), "A structural
 * optimization approach in process synthesis - II: Heat recovery networks",
 * Comput. Chem. Eng. 7, 707-721, over shifted temperature intervals.
 *
 * Process streams and utilities are shifted alike (hot down, cold up, by
 * their ΔT contribution or ΔTmin/2); every shifted end temperature, of a
 * stream or a utility, is an interval boundary. Boundaries are indexed from
 * the hottest (0) to the coldest (nb-1); interval k lies between boundaries
 * k and k+1. Each utility u has one load Q_u (kW, 0 <= Q_u <= max_load):
 *
 *  - an isothermal utility (supply = target: condensing steam, a boiling
 *    refrigerant) exchanges all of it at its boundary: a hot one heats the
 *    interval below, a cold one cools the interval above;
 *  - a utility with a range (hot oil, flue gas down to a stack temperature,
 *    cooling water up to its return limit) has cp = Q_u / range, so interval
 *    k receives (or gives) Q_u times the fraction of the range inside k.
 *
 * R_b >= 0 is the heat flowing down through boundary b, after isothermal
 * cold utilities at b have taken theirs and before isothermal hot utilities
 * at b add theirs (no heat passes between two utilities at zero driving
 * force). R_0 = R_{nb-1} = 0. Per interval k:
 *
 *	R_k + Σ hot heat into k + surplus_k = R_{k+1} + Σ cold heat out of k
 *
 * The objective is Σ price_u · Q_u. A negative price is a credit (steam
 * raised, heat sold); then the heat is split by origin (utility_credit.c)
 * so that a credit utility takes only heat the process gives, or gives
 * only heat the process takes, and the LP stays bounded. Among answers of
 * equal cost (within 1e-9 relative) a second solve picks, deterministically, the one of least
 * weighted utility use, weighting each kW by 1 + its level's rank: the
 * colder hot utility and the hotter cold utility are preferred (the cheaper
 * level in exergy; LP steam before HP steam at the same price).
 *
 * Ownership: the result owns its arrays; hl_utility_lp_free(NULL) is fine.
 */
#ifndef HL_UTILITY_LP_H
#define HL_UTILITY_LP_H

#include <stddef.h>

#include "case.h"
#include "glpk_guard.h"
#include "status.h"

typedef enum {
	HL_UTIL_USED = 0,    /* carries load */
	HL_UTIL_IDLE = 1,    /* could serve the process, but others are cheaper
				(or its max_load is 0) */
	HL_UTIL_REACH = 2    /* cannot serve at all: a hot utility too cold to
				heat any cold stream, a cold one too hot to
				cool any hot stream */
} hl_utility_use;

typedef struct {
	double load;        /* kW */
	double cost;        /* currency per year: price × load × hours / 1000 */
	hl_utility_use use;
	double t_hi, t_lo;  /* shifted temperatures of its ends, °C */
	double across;      /* kW of the load a hot utility gives below the
			       process pinch (a cold one takes above it):
			       a utility with a range must exchange over all
			       of it, so a flue gas with a stack temperature
			       below the pinch heats the process below it too */
} hl_utility_load;

/* A boundary where no heat flows down. */
typedef struct {
	double shifted;     /* °C */
	double hot, cold;   /* shifted ± ΔTmin/2, °C */
	long util;          /* the utility whose supply level lies here, -1 */
} hl_utility_pinch;

typedef struct {
	double dtmin;           /* K */
	double hours;           /* h per year used for the costs */
	size_t nutil;
	hl_utility_load *util;  /* one per case utility, same order */
	double hot_load;        /* Σ hot utility loads, kW */
	double cold_load;       /* Σ cold utility loads, kW */
	double cost;            /* Σ yearly costs */
	double qh_min, qc_min;  /* kW, the process targets (problem table) */
	double range_rise;      /* kW: hot_load − qh_min owed to utility
				   ranges (Σ across of the hot utilities when
				   the process has a pinch), 0 when none */
	double credit_rise;     /* kW of hot utility bought beyond that
				   because a credit pays for it (it frees
				   process heat for a credit cold utility) */
	double credit;          /* currency per year the credits earn (>= 0;
				   cost is net of it) */
	size_t nb;
	double *t;              /* boundaries, shifted °C, falling */
	double *flow;           /* R_b with the chosen loads, kW (>= 0) */
	size_t nproc;
	hl_utility_pinch *proc; /* pinches of the process alone (problem table
				   on these boundaries), hottest first */
	size_t npinch;
	hl_utility_pinch *pinch; /* utility pinches: R_b = 0 where the process
				    alone would pass heat, hottest first */
	int optimal;            /* 1: GLPK proved the optimum */
	double gap;             /* relative optimality gap (0 for an LP) */
	double tol;             /* kW: loads and flows below it count as 0 */
} hl_utility_lp;

typedef struct {
	int verbose;            /* pass GLPK's messages to log */
	hl_glpk_log log;        /* NULL: discard */
	void *log_ctx;
	double time_limit;      /* s; NaN or <= 0: the case's time_limit */
} hl_utility_lp_opts;

/* Solve for c's utilities at dtmin (K). opt may be NULL (quiet, the case's
 * time limit). Errors: HL_EINPUT when c has no streams or no utilities;
 * HL_ENOSOLUTION when no loads can meet the process (the sentence names the
 * temperature range without a utility; file and line are those of the
 * hottest hot / coldest cold utility when it is too cold / too hot, else
 * the first utility's file),
 * or GLPK fails or times out; HL_EIO out of memory. */
hl_status hl_utility_lp_solve(const hl_case *c, double dtmin,
			      const hl_utility_lp_opts *opt,
			      hl_utility_lp **out, hl_error *err);
void hl_utility_lp_free(hl_utility_lp *r);

/* The load of each case utility (kW, case order) into load[r->nutil]. */
void hl_utility_lp_copy_loads(const hl_utility_lp *r, double *load);
/* The same in a new array (free it); *out is NULL when r is NULL. */
hl_status hl_utility_lp_loads(const hl_utility_lp *r, double **out,
			      hl_error *err);

/* Name of a use ("used", "unused", "out of reach"). */
const char *hl_utility_use_name(hl_utility_use use);

#endif
