/* curves.h - the points of the curves an engineer reads a pinch study from.
 *
 * Composite curves (Linnhoff et al. 1982, User Guide on Process Integration
 * for the Efficient Use of Energy, IChemE): the heat of all
 * hot streams, and of all cold streams, against temperature, each built by
 * adding the cp of every stream present in each temperature interval. The
 * hot curve starts at 0 kW; the cold one at QCmin, so their horizontal
 * overlap is the heat recovered and the cold curve ends QHmin beyond the hot
 * one. The shifted composites are the same on shifted temperatures; there
 * the two curves touch at the pinch.
 *
 * Grand composite curve: shifted temperature against the heat flowing down
 * the problem table cascade (Linnhoff & Flower 1978). Against it are drawn
 * the utility composites at the LP's loads: at each shifted temperature T
 * the hot-utility curve gives the heat the hot utilities deliver at or below
 * T, the cold-utility curve the heat the cold utilities take at or above T;
 * each stays left of the grand composite and touches it at a utility pinch.
 * A utility whose range crosses the process pinch (a flue gas with a stack
 * temperature below it) is drawn up to the pinch only; the heat it gives
 * beyond is added to the grand composite (grand_util), so that chart and
 * loads keep one accounting.
 *
 * Balanced composite curves: the composites with the utilities added as
 * streams at their LP loads (an isothermal utility is a horizontal step);
 * both curves then span the same heat.
 *
 * Each curve is built in O(n log n): the end temperatures are sorted once
 * and the cp of every interval comes from a difference array.
 *
 * Units: heat in kW, temperatures in °C. Ownership: the result owns all
 * arrays; hl_curves_free(NULL) is fine.
 */
#ifndef HL_CURVES_H
#define HL_CURVES_H

#include <stddef.h>

#include "cascade.h"
#include "case.h"
#include "status.h"
#include "utility_lp.h"

/* A polyline in the order it is drawn (heat h, temperature t). */
typedef struct {
	size_t n;
	double *h;  /* kW */
	double *t;  /* °C */
} hl_curve;

/* A piece of heat spread evenly over [t_lo, t_hi] (t_lo = t_hi: all of it
 * at one temperature). */
typedef struct {
	double t_hi, t_lo;  /* °C */
	double q;           /* kW, >= 0 */
} hl_curve_piece;

/* Where a utility's level lies on the grand composite picture: the middle
 * of its part of a utility composite. */
typedef struct {
	size_t util;        /* index into the case's utilities */
	double h, t;        /* kW, shifted °C */
} hl_curve_level;

typedef struct {
	double dtmin;                    /* K */
	double qh, qc;                   /* problem table targets, kW */
	double recovery;                 /* Σ hot stream duty − QCmin, kW */
	hl_curve hot, cold;              /* composite curves, real °C */
	hl_curve shifted_hot, shifted_cold;
	hl_curve grand;                  /* heat flow vs shifted °C, top first */
	hl_curve grand_util;             /* grand plus the heat utility ranges
					    put across the pinch (a flue gas
					    cooled below it); n = 0 when none */
	hl_curve hot_util, cold_util;    /* utility composites (n = 0 without
					    a utility result) */
	size_t nlevel;
	hl_curve_level *level;           /* one per used utility */
	hl_curve bal_hot, bal_cold;      /* balanced composites, real °C (n = 0
					    without a utility result) */
} hl_curves;

/* The curves of c at the cascade's ΔTmin; lp (may be NULL) adds the utility
 * composites and the balanced curves. Errors: HL_EIO out of memory. */
hl_status hl_curves_compute(const hl_case *c, const hl_cascade *cas,
			    const hl_utility_lp *lp, hl_curves **out,
			    hl_error *err);
void hl_curves_free(hl_curves *cv);

/* The composite of n pieces, rising in temperature from heat h0: a point at
 * every end temperature, two at a step. out->n = 0 when n = 0. */
hl_status hl_curves_composite(const hl_curve_piece *p, size_t n, double h0,
			      hl_curve *out, hl_error *err);

/* The heat of a rising composite at temperature t (the first point when t
 * lies on a step; clamped to the ends). */
double hl_curve_heat_at(const hl_curve *cv, double t);

#endif
