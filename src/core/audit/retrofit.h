/* retrofit.h - screening a retrofit at constant area efficiency.
 *
 * Tjoe & Linnhoff (1986), "Using pinch technology for process retrofit",
 * Chem. Eng. 93, 47–60 (from memory): a retrofit that keeps today's area
 * efficiency α needs, at energy E, the area A_target(E)/α, where
 * A_target(E) is the area target (Townsend & Linnhoff 1984) at the ΔTmin
 * whose minimum hot utility is E. From today's point (E_now, A_existing)
 * the curve runs to the targets at the case's ΔTmin.
 *
 * Each point: new area = A_target(E)/α − A_existing (>= 0); investment =
 * the new area bought in shells the size of the mean shell of the shell
 * target at that energy (A_target(E) / shell target, Ahmad & Smith 1989),
 * each at the case's cost law a + b·A^c per shell, a fraction of a shell
 * pro rata (a smooth screening figure, not a count of units); where the
 * shell target is nil, today's mean shell (A_existing / today's shells).
 * Today's mean shell is not used otherwise: on a real site it mixes
 * furnaces, air coolers and exchangers of every size. Annual saving = (E_now − E) kW of hot utility at
 * today's mean hot price plus the same of cold utility at today's mean
 * cold price (audit.h), times the operating hours; simple payback =
 * investment / saving.
 *
 * A_target(E) with the utility loads of the area–energy curve (audit.h).
 *
 * The target curve (area target against hot utility over ΔTmin) is given
 * for charts on a grid from half the smaller to 1.2 times the larger of
 * ΔTmin and ΔTmin now: below ΔTmin with the least-cost utility levels (as
 * `sweep`), above it with the loads of the area–energy curve.
 *
 * Screening only: re-piping, new shells' placement, pressure drop and the
 * match constraints of a real retrofit are not in it.
 *
 * Ownership: the result owns its arrays; hl_retrofit_free(NULL) is fine.
 */
#ifndef HL_RETROFIT_H
#define HL_RETROFIT_H

#include <stddef.h>

#include "audit.h"
#include "case.h"
#include "status.h"

typedef struct {
	double hot_utility;    /* kW, E */
	double cold_utility;   /* kW */
	double dtmin;          /* K at which the targets equal E */
	double area_target;    /* m², A_target(E), exchanger-setting basis */
	double area_sweep;     /* m², the area target `sweep` gives at this
				  ΔTmin: the least-cost mix of utility
				  levels there, where area_target keeps
				  today's mix moving to the least-cost mix
				  at the targets (NaN: no answer) */
	double area_retrofit;  /* m², A_target(E)/α */
	double new_area;       /* m², >= 0 */
	double shell_area;     /* m², the size new area is bought in */
	double shell_cost;     /* currency, a + b·shell_area^c */
	double investment;     /* currency */
	double saving;         /* currency per year */
	double payback;        /* years; NaN where nothing is saved */
} hl_retrofit_point;

typedef struct {
	double dtmin;          /* K */
	double hot_utility;    /* kW */
	double area;           /* m², exchanger-setting basis */
} hl_target_point;

typedef struct {
	double alpha;
	double shell_area;     /* m², today's mean shell (for comparison; the
				  points price new area by their own) */
	double shell_cost;     /* currency, a + b·shell_area^c */
	size_t n;
	hl_retrofit_point *pt; /* today's point first, the targets last; empty
				  when α is undefined or today is at or below
				  the targets */
	size_t ncurve;
	hl_target_point *curve; /* rising ΔTmin; points without an answer are
				   left out */
} hl_retrofit;

/* The retrofit curve of audit a over npoints (>= 2) energies evenly spaced
 * from today's hot utility to the target. Errors: HL_EIO out of memory;
 * input errors of the targeting chain. */
hl_status hl_retrofit_screen(const hl_case *c, const hl_audit *a,
			     size_t npoints, hl_retrofit **out,
			     hl_error *err);
void hl_retrofit_free(hl_retrofit *r);

/* The saving per year the curve promises at an investment (currency):
 * linear between the two points whose investments bracket it, the
 * targets' saving beyond the last point; NaN without a curve. */
double hl_retrofit_saving_at(const hl_retrofit *r, double investment);

#endif
