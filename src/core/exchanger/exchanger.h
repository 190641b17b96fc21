/* exchanger.h - thermal sizing of one heat exchanger: LMTD, F, shells, area, cost.
 *
 * Pure numerics: nothing here allocates, prints or touches a file.
 *
 * Units: temperatures in °C (differences in K), duties in kW, heat capacity
 * flow rates in kW/K, film and overall coefficients in kW/(m²·K), areas in m²,
 * cost in the case's currency.
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

/* What to size. */
typedef struct {
	double hot_in, hot_out;   /* °C */
	double cold_in, cold_out; /* °C */
	double duty;              /* kW, > 0 */
	double u;                 /* kW/(m²·K), > 0 */
	hl_exchanger_type type;
	double fmin;              /* F floor, [0, 1); ignored for counterflow */
	double xp;                /* (0, 1]; ignored for counterflow */
	double cost_a;            /* cost per shell a + b·A_shell^c; a, b >= 0 */
	double cost_b;
	double cost_c;            /* > 0 */
} hl_exchanger_spec;

/* What sizing gives. */
typedef struct {
	double lmtd;       /* K, counterflow LMTD of the terminal temperatures */
	double p, r;       /* as hl_exchanger_pr */
	double f;          /* overall F of all shells (1 for counterflow) */
	int shells;        /* shells in series (1 for counterflow) */
	double area;       /* m², total: duty/(u·f·lmtd) */
	double area_shell; /* m², area/shells */
	double cost;       /* shells·(a + b·area_shell^c) */
} hl_exchanger_sizing;

/* Fill the type, F floor, Xp and cost law of spec from case settings; the
 * temperatures, duty and U are left as they are. */
void hl_exchanger_spec_settings(hl_exchanger_spec *spec,
				const hl_settings *set);

/* Size one exchanger. HL_EINPUT (with a sentence naming the offending
 * numbers) for: a non-finite number; a hot outlet above its inlet; a cold
 * outlet below its inlet; a hot inlet not above the cold outlet or a hot
 * outlet not above the cold inlet (no exchanger of any kind can do that);
 * duty or U not positive; fmin, xp or the cost law outside their domains.
 * HL_ENOSOLUTION when a shell-and-tube unit would need more than
 * HL_EXCHANGER_MAX_SHELLS shells. A temperature cross (cold outlet above hot
 * outlet) is normal for shell-and-tube and only raises the shell count. */
hl_status hl_exchanger_size(const hl_exchanger_spec *spec,
			    hl_exchanger_sizing *out, hl_error *err);

/* What rating gives. */
typedef struct {
	double duty;     /* kW */
	double hot_out;  /* °C */
	double cold_out; /* °C */
	double ntu;      /* UA/Cmin */
	double eps;      /* duty/(Cmin·(hot_in − cold_in)) */
} hl_exchanger_rating;

/* Rate a given unit: from inlet temperatures (°C, hot_in >= cold_in), heat
 * capacity flow rates cp_hot, cp_cold (kW/K, > 0 finite) and ua (kW/K, >= 0),
 * the duty and outlet temperatures. type counterflow ignores shells;
 * shell-and-tube needs shells >= 1. HL_EINPUT outside that domain. */
hl_status hl_exchanger_rate(double hot_in, double cold_in, double cp_hot,
			    double cp_cold, double ua, hl_exchanger_type type,
			    int shells, hl_exchanger_rating *out,
			    hl_error *err);

#endif
