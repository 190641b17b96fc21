/* sensitivity.h - how the energy targets move with each measured datum.
 *
 * For every process stream: its supply and target temperature and the cp of
 * each segment (or its duty, when the stream table gave the duty and cp was
 * derived from it), plus ΔTmin itself, this module gives the one-sided
 * derivatives of the minimum hot utility QHmin and the minimum cold utility
 * QCmin at the case's ΔTmin, exactly, from the active pinch constraints of the
 * problem table (Linnhoff & Flower 1978). The targets are piecewise smooth in
 * the data, so where a pinch changes the derivative from the left ("minus")
 * and from the right ("plus") differ, and the row says so.
 *
 * With a tolerance per datum (the stream's cp_tol and t_tol, else the
 * settings' defaults) it also gives how far each target can move when that
 * datum is off by its tolerance, a ranking of the data by that effect, and
 * the band of each target when every datum may be off at once: exactly, by
 * re-solving the problem table at the two corners of the tolerance box that
 * the targets' monotonicity in each datum singles out, and as the first-order
 * estimate at the same corners.
 *
 * With utilities it gives the one-sided derivatives of the utility cost as
 * well: with one hot and one cold utility from the priced targets, with
 * several levels from the utility LP (sensitivity_cost.c), and then also
 * with respect to each utility's own temperatures.
 *
 * Units: derivatives in kW per K (temperatures, ΔTmin), kW per kW/K (cp),
 * kW per kW (duty); tolerances in the datum's unit; cost derivatives in
 * currency per year per unit of the datum.
 *
 * Ownership: hl_sensitivity_free() frees everything the result holds. The
 * result refers to the case's streams by index only.
 */
#ifndef HL_SENSITIVITY_H
#define HL_SENSITIVITY_H

#include <stddef.h>

#include "cascade.h"
#include "case.h"
#include "status.h"

typedef enum {
	HL_SENS_SUPPLY = 0, /* the stream's supply temperature, °C */
	HL_SENS_TARGET = 1, /* the stream's target temperature, °C */
	HL_SENS_CP = 2,     /* one segment's cp, kW/K (duty follows) */
	HL_SENS_DUTY = 3,   /* one segment's duty, kW, for a segment given by
			       duty (cp = duty / span follows) */
	HL_SENS_DTMIN = 4,  /* ΔTmin, K */
	HL_SENS_LEVEL = 5   /* an isothermal utility's temperature, °C
			       (supply and target move together) */
} hl_sens_quantity;

/* Whether the rows carry a utility cost derivative. */
typedef enum {
	HL_SENS_COST_NONE = 0,   /* the case has no utilities */
	HL_SENS_COST_SINGLE = 1, /* one hot and one cold utility: the cost is
				    (price_hot·QHmin + price_cold·QCmin)·hours */
	HL_SENS_COST_LEVELS = 2  /* several levels: the cost is the utility
				    LP's optimum, cost_* its one-sided
				    derivatives (NaN when the LP cannot
				    serve the process at all) */
} hl_sens_cost_basis;

typedef struct {
	size_t stream;      /* index into the case's streams (0 for ΔTmin) */
	size_t segment;     /* segment index for cp and duty, else 0 */
	hl_sens_quantity q;
	double value;       /* the datum as given */
	double tol;         /* ± tolerance in the datum's unit (0 for ΔTmin) */
	double hot_minus, hot_plus;   /* dQHmin/dx from the left, the right */
	double cold_minus, cold_plus; /* dQCmin/dx from the left, the right */
	double cost_minus, cost_plus; /* d(utility cost)/dx, NaN when unknown;
					 +inf (plus) or -inf (minus): a step
					 that way leaves the utilities unable
					 to serve the process */
	/* First-order moves of the targets with the datum anywhere within
	 * ±tol (kW, >= 0): how far each can fall and rise. */
	double hot_down, hot_up;
	double cold_down, cold_up;
	int kink;           /* 1: the one-sided derivatives differ (a pinch
			       changes at this datum's value) */
	size_t rank;        /* 1 for the largest effect, 0 for ΔTmin */
} hl_sens_row;

/* A utility's temperature as a datum. The problem-table targets do not
 * depend on it; the utility LP's cost does. */
typedef struct {
	size_t util;        /* index into the case's utilities */
	hl_sens_quantity q; /* HL_SENS_SUPPLY, HL_SENS_TARGET (a utility with
			       a range) or HL_SENS_LEVEL (an isothermal one) */
	double value;       /* °C as given */
	double tol;         /* ± K: the settings' t_tol */
	double cost_minus, cost_plus; /* d(utility cost)/dx, currency per
					 year per K; NaN, ±inf as above */
} hl_sens_urow;

/* A target over the whole tolerance box. */
typedef struct {
	double nominal;     /* kW, the target at the data as given */
	double low, high;   /* kW, re-solved at the box's extreme corners:
			       exact over the whole box */
	double lin_low, lin_high; /* kW, the first-order estimate at the same
				     corners */
} hl_sens_band;

typedef struct {
	double dtmin;       /* K */
	size_t nrow;
	hl_sens_row *row;   /* streams in case order: supply, target, then
			       each segment's cp or duty */
	size_t *rank;       /* row indices, largest effect first */
	hl_sens_row dt;     /* ΔTmin (tol 0, moves 0) */
	hl_sens_band hot, cold;
	size_t nactive;     /* boundaries on which the targets rest: the
			       pinches, plus the top when no hot utility is
			       needed and the bottom when no cold one is */
	hl_sens_cost_basis cost;
	size_t collapsed;   /* segments whose tolerance box would turn them
			       inside out: shrunk to nothing at a corner */
	size_t nurow;
	hl_sens_urow *urow; /* utilities in case order (none without
			       utilities): supply and target, or level */
} hl_sensitivity;

/* Derivatives, ranking and bands of c's targets at cas->dtmin; cas must be
 * hl_cascade_compute(c, dtmin). Fails with HL_EINPUT (naming the stream's
 * file and line) when a tolerance is out of range: cp_tol in [0, 1), t_tol in
 * [0, 100] K. The core of the method is O(P·S·A) for P data, S segments and A
 * active ends; the bands cost four more problem tables. */
hl_status hl_sensitivity_compute(const hl_case *c, const hl_cascade *cas,
				 hl_sensitivity **out, hl_error *err);
void hl_sensitivity_free(hl_sensitivity *s);

/* The effect used for ranking: with a known utility cost, how far it moves
 * (first order) over ±tol, currency per year (+inf when a step within the
 * tolerance leaves the utilities unable to serve); else the largest of the
 * row's four moves, kW. */
double hl_sensitivity_effect(const hl_sens_row *r);

/* The one-sided derivatives of R(t), the process heat surplus above the
 * shifted temperature t (kW): Σ hot heat above t − Σ cold heat above t, in
 * kW per unit of r's datum (r needs only stream, segment and q). 'tied'
 * nonzero: t is a segment end that r's datum moves, and t moves with it; 0:
 * t is fixed (a utility level). The cost derivatives with several levels
 * use the same model end by end (sensitivity_cost.c). Fails only for want of
 * memory. */
hl_status hl_sensitivity_surplus(const hl_case *c, double dtmin,
				 const hl_sens_row *r, double t, int tied,
				 double *minus, double *plus, hl_error *err);

/* The quantity's name as written in the results: supply, target, cp, duty,
 * dtmin, level. */
const char *hl_sensitivity_quantity_name(hl_sens_quantity q);

#endif
