/* sweep.h - the energy–capital trade-off over ΔTmin.
 *
 * Each point runs the whole targeting chain at one ΔTmin: the problem table,
 * the utility LP when the case has utilities (loads, process and utility
 * pinches), and the supertargets (area, units, shells, capital, energy and
 * total annual cost). The optimum is the grid point of least total annual
 * cost, refined by golden-section search (Kiefer 1953) between its two
 * neighbours; the total cost is discontinuous where units or shells step,
 * so the refinement never reports a point worse than the grid's best.
 *
 * Ownership: the result owns its points; hl_sweep_free(NULL) is fine.
 */
#ifndef HL_SWEEP_H
#define HL_SWEEP_H

#include <stddef.h>

#include "case.h"
#include "status.h"
#include "supertarget.h"
#include "utility_lp.h"

typedef struct {
	hl_supertargets st;
	int ok;             /* 0: no answer at this ΔTmin (see note) */
	char note[200];     /* why, when !ok */
} hl_sweep_point;

typedef struct {
	size_t n;
	hl_sweep_point *pt;    /* rising ΔTmin */
	int have_optimum;      /* at least one point had an answer */
	size_t best;           /* grid index of the least total cost */
	hl_supertargets optimum; /* refined */
	size_t evaluations;    /* targeting chains run, grid and refinement */
} hl_sweep;

/* The supertargets from a cascade and the utility LP already solved at its
 * ΔTmin (lp NULL: no utilities): loads and pinches taken from the LP. */
hl_status hl_sweep_point_from(const hl_case *c, const hl_cascade *cas,
			      const hl_utility_lp *lp, hl_supertargets *st,
			      hl_error *err);

/* One point: the whole chain at dtmin (K), quietly. */
hl_status hl_sweep_point_eval(const hl_case *c, double dtmin,
			      hl_supertargets *st, hl_error *err);

/* The grid from, from + step, … up to to (K; 0 <= from <= to, step > 0, at
 * most 10001 points). A point without an answer (ΔTmin 0: unbounded area;
 * no utility can serve) is kept with ok = 0; the run fails only when none
 * has an answer (HL_ENOSOLUTION) or on an input or memory error. */
hl_status hl_sweep_run(const hl_case *c, double from, double to, double step,
		       hl_sweep **out, hl_error *err);
void hl_sweep_free(hl_sweep *sw);

#endif
