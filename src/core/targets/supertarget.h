/* supertarget.h - area, units, shells and cost targets before any design.
 *
 * Area: the vertical-transfer formula of Townsend & Linnhoff (1984),
 * "Surface area targets for heat exchanger networks", IChemE Annual Research
 * Meeting, Bath: over the enthalpy intervals k of the balanced composite
 * curves, A = Σ_k (1/ΔT_LM,k) Σ_i q_i,k/h_i. Streams without h use the
 * setting h_default. A true minimum only when all h are equal (Linnhoff &
 * Ahmad 1990).
 *
 * Shell-and-tube: per enthalpy interval the real number of Xp-limited shells
 * N_k of Ahmad, Linnhoff & Smith (1988) is additive along the curves; the
 * shell target is Σ_k N_k·(S_k − 1) with S_k the streams present (Ahmad &
 * Smith 1989, from memory), rounded up and never below the units target; the
 * interval's area is divided by the F of ceil(N_k) shells in series.
 *
 * Units: N − 1 per subnetwork (Hohmann 1971), the subnetworks lying between
 * the pinches given by the caller.
 *
 * Cost: capital from the per-shell law a + b·A^c with the area spread evenly
 * over the shells (or units, for counterflow units), annualised with the
 * capital recovery factor i(1+i)^n/((1+i)^n − 1); energy from the utility
 * loads, prices (per MWh) and operating hours.
 *
 * Utilities: util_load gives each case utility's load (kW). With utilities
 * the curves are balanced (utilities included as streams). Without them
 * (util_load NULL or no utilities), only the process composites' overlap is
 * counted and the energy cost is zero.
 */
#ifndef HL_SUPERTARGET_H
#define HL_SUPERTARGET_H

#include <stddef.h>

#include "cascade.h"
#include "case.h"
#include "status.h"

typedef struct {
	double dtmin;          /* K */
	double hot_utility;    /* kW */
	double cold_utility;   /* kW */
	double area;           /* m², counterflow (vertical transfer) */
	double area_st;        /* m², shell-and-tube with F per interval */
	int units;             /* N − 1 per subnetwork */
	int shells;            /* shell target */
	double shells_real;    /* Σ_k N_k (S_k − 1) before rounding */
	double capital;        /* installed capital, currency */
	double capital_annual; /* capital × CRF, currency per year */
	double energy_cost;    /* currency per year */
	double total_cost;     /* annual: capital_annual + energy_cost */
	int balanced;          /* 1 when the utilities were included */
	int assumed_h;         /* streams or utilities that used h_default */
	size_t nsub;           /* subnetworks */
} hl_supertargets;

/* Capital recovery factor for interest i (per year, >= 0) over n years
 * (> 0): i(1+i)^n/((1+i)^n − 1), 1/n at i = 0 (standard annuity formula). */
double hl_supertarget_crf(double i, double n);

/* Supertargets of c at cas's ΔTmin. util_load: one load per case utility
 * (kW) or NULL; pinch: shifted temperatures of the pinches that split the
 * network (process and utility pinches), hottest first, npinch of them
 * (NULL with 0 uses the cascade's own pinches). HL_ENOSOLUTION when the
 * area is unbounded (a zero driving force, as at ΔTmin 0). */
hl_status hl_supertarget_compute(const hl_case *c, const hl_cascade *cas,
				 const double *util_load, const double *pinch,
				 size_t npinch, hl_supertargets *out,
				 hl_error *err);

#endif
