/* exchanger.h - thermal sizing of one heat exchanger: LMTD, F, shells, area, cost.
 *
 * Pure numerics: nothing here allocates, prints or touches a file.
 *
 * Every command sizes through one entry point, hl_exchanger_size ("Sizing
 * by type" below): the type, duty, temperatures, U and the settings in;
 * shells in series and in parallel, F, area, cost and warnings out. The
 * rest are its parts (F, shells, crossflow, ε-NTU), usable on their own.
 *
 * Units: temperatures in °C (differences in K), duties in kW, heat capacity
 * flow rates in kW/K, film and overall coefficients in kW/(m²·K), areas in m²,
 * cost in the case's currency; a fired heater's cost law takes its duty in
 * MW, as published furnace laws do.
 *
 * Notation (Kern 1950, ch. 7): T1 → T2 is the hot side, t1 → t2 the cold side.
 * P = (t2 − t1)/(T1 − t1) is the cold side's temperature effectiveness and
 * R = (T1 − T2)/(t2 − t1) the ratio of the cold to the hot heat capacity flow
 * rate. F for a one-shell-pass, even-tube-pass shell does not depend on which
 * fluid is in the shell, so "cold side" need not be the tube side.
 *
 * Errors: functions return HL_OK, HL_EINPUT (an argument is outside the
 * stated domain; nothing useful can be computed) or HL_ENOSOLUTION (the
 * arguments are valid but no exchanger of the kind asked for can do the job,
 * e.g. P above what one shell can reach). On error the outputs are left
 * untouched and err (which may be NULL) holds one sentence saying what is
 * wrong and what to do; err->file is empty and err->line 0, for the caller to
 * fill with the position of the exchanger in its input. No function returns
 * a NaN on HL_OK.
 *
 * All results are screening estimates, not a thermal or mechanical design.
 */
#ifndef HL_EXCHANGER_H
#define HL_EXCHANGER_H

#include <stddef.h>

#include "case.h"
#include "status.h"

/* More shells than this in series is taken as "not a shell-and-tube job". */
#define HL_EXCHANGER_MAX_SHELLS 50

/* Counterflow log-mean temperature difference (K) from the two end
 * differences dt1, dt2 (K). Domain: both finite and > 0 (equal is fine: the
 * result is then their common value). HL_EINPUT otherwise. */
hl_status hl_exchanger_lmtd(double dt1, double dt2, double *lmtd,
			    hl_error *err);

/* P and R of a unit with hot side hot_in → hot_out and cold side cold_in →
 * cold_out (°C). Domain: all finite, hot_out <= hot_in, cold_out >= cold_in,
 * hot_in > cold_out and hot_out > cold_in (a counterflow unit could do it).
 * Then 0 <= P < 1 and 0 <= P·R < 1. R = 0 when the hot side is isothermal
 * (both sides isothermal: P = 0, R = 0); R = +infinity (HUGE_VAL) when only
 * the cold side is (P = 0 then). HL_EINPUT otherwise, naming the numbers. */
hl_status hl_exchanger_pr(double hot_in, double hot_out, double cold_in,
			  double cold_out, double *p, double *r, hl_error *err);

/* Largest P one shell (1 shell pass, 2, 4, … tube passes) can reach at ratio
 * r: 2/(r + 1 + √(r² + 1)). Domain r >= 0 (+infinity gives 0); NaN for r < 0
 * or NaN. */
double hl_exchanger_pmax(double r);

/* F correction factor of one shell with 1 shell pass and 2, 4, … tube passes.
 * Domain: 0 <= p < 1, r >= 0 (p = 0 allows r = +infinity), p·r < 1.
 * F = 1 when p = 0 or r = 0. HL_ENOSOLUTION when p >= hl_exchanger_pmax(r):
 * no real F exists and the duty needs more shells. HL_EINPUT outside the
 * domain. */
hl_status hl_exchanger_f(double p, double r, double *f, hl_error *err);

/* Per-shell P of n identical shells in series that together reach the
 * overall p at ratio r (each shell has the same R). Domain: n >= 1,
 * 0 <= p < 1, r >= 0 finite, p·r < 1. Result in [0, p]. HL_EINPUT otherwise. */
hl_status hl_exchanger_p_shell(double p, double r, int n, double *p1,
			       hl_error *err);

/* Overall F of n identical shells in series at overall p, r: F(p1, r) with
 * p1 from hl_exchanger_p_shell. Domain as hl_exchanger_p_shell;
 * HL_ENOSOLUTION when p1 >= pmax(r) (too few shells). */
hl_status hl_exchanger_f_shells(double p, double r, int n, double *f,
				hl_error *err);

/* Real-valued number of shells at which each shell's P is exactly
 * xp·pmax(r); round up for a first guess. Domain: 0 <= p < 1, r >= 0 finite,
 * p·r < 1, 0 < xp <= 1; NaN outside it. */
double hl_exchanger_shells_estimate(double p, double r, double xp);

/* Fewest identical shells in series with overall F >= fmin and each shell's
 * P <= xp·pmax(r). Domain: p, r as hl_exchanger_p_shell (r may be +infinity
 * when p = 0), 0 <= fmin < 1, 0 < xp <= 1. On HL_OK *n is the count, *f the
 * overall F and *p1 the per-shell P (f and p1 may be NULL). HL_ENOSOLUTION when
 * more than HL_EXCHANGER_MAX_SHELLS would be needed. */
hl_status hl_exchanger_shells(double p, double r, double fmin, double xp,
			      int *n, double *f, double *p1, hl_error *err);

/* Effectiveness of a pure counterflow unit. Domain: ntu >= 0 finite,
 * 0 <= cr <= 1. HL_EINPUT otherwise. */
hl_status hl_exchanger_eps_counterflow(double ntu, double cr, double *eps,
				       hl_error *err);

/* Effectiveness of n identical shells in series, each with 1 shell pass and
 * 2, 4, … tube passes; ntu = UA/Cmin of the whole unit, cr = Cmin/Cmax.
 * Domain: n >= 1, ntu >= 0 finite, 0 <= cr <= 1. HL_EINPUT otherwise. */
hl_status hl_exchanger_eps_shells(double ntu, double cr, int n, double *eps,
				  hl_error *err);

/* Overall coefficient from the two film coefficients (fouling included),
 * thin wall: 1/U = 1/h_hot + 1/h_cold. Domain: both finite and > 0. */
hl_status hl_exchanger_u(double h_hot, double h_cold, double *u,
			 hl_error *err);

/* Counterflow NTU referred to the P side at P, R (domain of
 * hl_exchanger_p_shell); and the counterflow effectiveness of that side at
 * ntu >= 0, ratio r >= 0 finite (the inverse). No checks: callers hold the
 * domain. */
double hl_exchanger_ntu_counterflow(double p, double r);
double hl_exchanger_eps_cf(double ntu, double r);

/* ---- Crossflow, both fluids unmixed (crossflow.c) ---- */

/* Largest NTU (referred to Cmin) the crossflow functions go to. */
#define HL_CROSSFLOW_NTU_MAX 60.0

/* Effectiveness of a single-pass crossflow unit with both fluids unmixed.
 * Domain: 0 <= ntu <= HL_CROSSFLOW_NTU_MAX, 0 <= cr <= 1. HL_EINPUT
 * otherwise. */
hl_status hl_exchanger_eps_crossflow(double ntu, double cr, double *eps,
				     hl_error *err);

/* F of one such crossflow unit at the cold side's P and R = C_cold/C_hot
 * (the arrangement is symmetric in the two fluids). Domain as
 * hl_exchanger_f; F = 1 when p = 0 or r = 0. HL_ENOSOLUTION when P needs
 * more than HL_CROSSFLOW_NTU_MAX. */
hl_status hl_exchanger_f_crossflow(double p, double r, double *f,
				   hl_error *err);

/* Fewest identical crossflow sections in series (counter-current
 * between sections) whose overall F >= fmin; *f their F. Domain: as
 * hl_exchanger_p_shell, 0 <= fmin < 1. HL_ENOSOLUTION beyond
 * HL_EXCHANGER_MAX_SHELLS sections. */
hl_status hl_exchanger_sections_crossflow(double p, double r, double fmin,
					  int *n, double *f, hl_error *err);

/* ---- Sizing by type (sizing.c): the one entry point every command uses ----
 *
 * Given the type, the duty, the four terminal temperatures, U and the
 * settings (F floor, Xp, the type's cost law and its largest and smallest
 * shell), hl_exchanger_size returns shells in series, shells in parallel,
 * F, area and cost:
 *   shell-and-tube  shells in series by the F floor and the Xp rule, F of
 *                   Bowman, Mueller & Nagle (1940); A = Q/(U·F·LMTD)
 *   counterflow     F = 1, one unit
 *   plate           F = 1 (counterflow plates), one unit
 *   double-pipe     F = 1; hairpins in series, each at most `largest` m²
 *   air-cooler      crossflow, both fluids unmixed; sections in series
 *                   until F >= fmin
 *   fired-heater    by duty: no area, no F, no U; X = duty in MW
 * Every type but double pipe puts shells (units) in parallel once one
 * shell would exceed `largest`; the cost is
 *   series · parallel · (a + b · X^c),
 * X the area of one shell (m²), or the duty of one fired heater (MW). */

/* What to size. */
typedef struct {
	double hot_in, hot_out;   /* °C */
	double cold_in, cold_out; /* °C */
	double duty;              /* kW, > 0 */
	double u;                 /* kW/(m²·K), > 0; ignored for fired heaters */
	hl_exchanger_type type;
	double fmin;              /* F floor, [0, 1); shell-and-tube, air cooler */
	double xp;                /* (0, 1]; shell-and-tube */
	double cost_a;            /* cost per shell a + b·X^c; a, b >= 0 */
	double cost_b;
	double cost_c;            /* > 0 */
	double largest;           /* X of the largest shell; HUGE_VAL or 0:
				     no limit */
	double smallest;          /* X below which a shell is implausible;
				     0: none */
	int series;               /* 0: the fewest shells (sections,
				     hairpins) in series the rules allow;
				     n > 0: exactly n, as an existing unit
				     has (HL_ENOSOLUTION when n cannot do
				     the duty) */
} hl_exchanger_spec;

/* Warnings: the sizing stands, but a number looks wrong. */
#define HL_EXCH_WARN_SMALL 1u   /* a shell below the smallest plausible */
#define HL_EXCH_WARN_U_LOW 2u   /* U below HL_EXCH_U_LOW */
#define HL_EXCH_WARN_U_HIGH 4u  /* U above HL_EXCH_U_HIGH */
/* Plausible overall coefficients, kW/(m²·K): gas to gas at low pressure
 * to condensing steam against boiling water (common practice, no source). */
#define HL_EXCH_U_LOW 0.01
#define HL_EXCH_U_HIGH 10.0

/* What sizing gives. */
typedef struct {
	double lmtd;       /* K, counterflow LMTD of the terminal temperatures */
	double p, r;       /* as hl_exchanger_pr */
	double f;          /* overall F (1 for counterflow, plate, double
			      pipe, fired heater) */
	int shells;        /* shells in series: hairpins (double pipe),
			      sections (air cooler); 1 otherwise */
	int parallel;      /* trains of `shells` in parallel, >= 1 */
	double area;       /* m², total: duty/(u·f·lmtd); 0 fired heater */
	double area_shell; /* m², area/(shells·parallel) */
	double x;          /* the cost law's X for one shell: area_shell, or
			      MW per fired heater */
	double cost;       /* shells·parallel·(a + b·x^c) */
	unsigned warn;     /* HL_EXCH_WARN_* */
} hl_exchanger_sizing;

/* Fill the type, F floor, Xp, cost law and shell limits of spec for the
 * case's exchanger type (hl_exchanger_spec_type for another type), series
 * 0 (the fewest); the temperatures, duty and U are left as they are. */
void hl_exchanger_spec_settings(hl_exchanger_spec *spec,
				const hl_settings *set);
void hl_exchanger_spec_type(hl_exchanger_spec *spec, const hl_settings *set,
			    hl_exchanger_type type);

/* The law of type t under set: its own a, b, c, or (a NaN) the process
 * law cost_a, cost_b, cost_c. */
void hl_exchanger_law_of(const hl_settings *set, hl_exchanger_type t,
			 double *a, double *b, double *c);

/* Size one exchanger. HL_EINPUT (with a sentence naming the offending
 * numbers) for: a non-finite number; a hot outlet above its inlet; a cold
 * outlet below its inlet; a hot inlet not above the cold outlet or a hot
 * outlet not above the cold inlet (no exchanger of any kind can do that);
 * duty or U not positive; fmin, xp, the cost law or the shell limits
 * outside their domains. HL_ENOSOLUTION when a shell-and-tube unit or an
 * air cooler would need more than HL_EXCHANGER_MAX_SHELLS in series. A
 * temperature cross (cold outlet above hot outlet) is normal for
 * shell-and-tube and only raises the shell count. */
hl_status hl_exchanger_size(const hl_exchanger_spec *spec,
			    hl_exchanger_sizing *out, hl_error *err);

/* Redo the area-dependent part of z (area, parallel, area per shell, X,
 * cost, warnings) for the total area z->area with z->shells in series:
 * for a caller with a better mean than the terminal LMTD (a unit across a
 * change of cp). spec as for hl_exchanger_size, already checked. */
void hl_exchanger_price(const hl_exchanger_spec *spec,
			hl_exchanger_sizing *z);

/* One phrase naming the cost law and shell limits of type t under set,
 * and whether the case set them or they are the illustrative defaults,
 * into buf of size n; e.g. "plate: 5000 + 500·A^0.85 per unit, A in m²,
 * largest 1500 m² (illustrative default, not a price)". */
void hl_exchanger_law_text(const hl_settings *set, hl_exchanger_type t,
			   char *buf, size_t n);

/* 1 when the cost law of type t is the built-in illustrative one: the
 * case set neither the type's law nor (for the types that use it) a
 * process law other than the default. */
int hl_exchanger_law_illustrative(const hl_settings *set,
				  hl_exchanger_type t);

/* One sentence for z->warn (empty when none) into buf of size n. */
void hl_exchanger_warning(const hl_exchanger_spec *spec,
			  const hl_exchanger_sizing *z, char *buf, size_t n);

/* Rating (a unit of known area in new conditions) is rating.h's: one
 * entry point, hl_rating_run, for every type but the fired heater. */

#endif
