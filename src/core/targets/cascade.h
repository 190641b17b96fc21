/* cascade.h - the problem table: energy targets and pinches.
 *
 * Method: Linnhoff & Flower (1978), problem table algorithm. Hot streams are
 * shifted down and cold streams up by their ΔT contribution (ΔTmin/2 unless a
 * stream gives its own). The shifted temperatures are sorted once; each
 * segment adds its cp to the intervals it spans by a difference array, so the
 * whole cascade costs O(n log n) in the number of segments.
 *
 * Boundaries are indexed from the hottest (0) down to the coldest (nb-1);
 * interval k lies between boundaries k and k+1. Heat flows down the cascade.
 * Latent heat (a segment with supply = target) is a step: its boundary is
 * given twice, and the zero-width interval between the two copies (net cp
 * 0) carries the latent surplus (hot condensing minus cold boiling there).
 */
#ifndef HL_CASCADE_H
#define HL_CASCADE_H

#include <stddef.h>

#include "case.h"
#include "status.h"

typedef struct {
	double dtmin;       /* K, the ΔTmin the cascade was built for */
	size_t nb;          /* boundaries (>= 2) */
	double *t;          /* shifted temperature of each boundary, °C, falling */
	double *netcp;      /* per interval: Σ cp hot − Σ cp cold, kW/K */
	double *dh;         /* per interval: heat surplus, kW (< 0 deficit);
			       a zero-width interval: the latent heat there */
	double *flow;       /* per boundary: heat flowing down with the minimum
			       hot utility added at the top, kW (>= 0) */
	double qh;          /* minimum hot utility, kW */
	double qc;          /* minimum cold utility, kW */
	double hot_total;   /* Σ duty of the hot streams, kW */
	double cold_total;  /* Σ duty of the cold streams, kW */
	size_t npinch;
	size_t *pinch;      /* boundary index of each pinch, hottest first */
	double tol;         /* kW: flows at or below this count as zero */
} hl_cascade;

/* Build the problem table of c's process streams at dtmin (K, >= 0). */
hl_status hl_cascade_compute(const hl_case *c, double dtmin, hl_cascade **out,
			     hl_error *err);
void hl_cascade_free(hl_cascade *cas);

/* Minimum hot and cold utility only (same method, nothing kept). */
hl_status hl_cascade_targets(const hl_case *c, double dtmin, double *qh,
			     double *qc, hl_error *err);

/* A threshold problem needs only one utility: 'H' when no hot utility is
 * needed, 'C' when no cold utility is needed, 0 when it is a pinched problem
 * (or needs neither: then 'N'). */
char hl_cascade_threshold_kind(const hl_cascade *cas);

/* For a threshold problem: the ΔTmin above which the missing utility becomes
 * needed, found by bisection on the monotone, piecewise-linear target
 * (HUGE_VAL when it is never needed, e.g. no cold streams at all). */
hl_status hl_cascade_threshold_dtmin(const hl_case *c, const hl_cascade *cas,
				     double *dt, hl_error *err);

/* The real temperatures of the hot and cold side at a shifted temperature,
 * with the default contributions ΔTmin/2. */
double hl_cascade_hot_temp(const hl_cascade *cas, double shifted);
double hl_cascade_cold_temp(const hl_cascade *cas, double shifted);

#endif
