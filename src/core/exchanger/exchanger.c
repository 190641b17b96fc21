/* exchanger.c - LMTD, F correction, shells in series, ε-NTU, area and cost.
 *
 * Everything near R = 1 (and Cr = 1) goes through one quantity, the NTU a
 * pure counterflow unit would need for the same P and R,
 *	NTU_cf = ln[(1 − PR)/(1 − P)]/(1 − R) = [P/(1 − P)]·L(x),
 *	x = P(1 − R)/(1 − P),  L(x) = log1p(x)/x,  L(0) = 1,
 * and its inverse, the counterflow effectiveness P = E/(1 + E) with
 * E = NTU·M((1 − R)·NTU), M(z) = expm1(z)/z, M(0) = 1. Both are smooth
 * through R = 1, so the R = 1 limits of the textbook formulas come out of the
 * general case with no branch and no loss of digits on either side of it.
 */
#include <math.h>

#include "exchanger.h"

/* log1p(x)/x, continued by its limit 1 at x = 0. */
static double
log1p_ratio(double x)
{
	return x == 0.0 ? 1.0 : log1p(x) / x;
}

/* expm1(z)/z, continued by its limit 1 at z = 0. */
static double
expm1_ratio(double z)
{
	return z == 0.0 ? 1.0 : expm1(z) / z;
}

/* Counterflow NTU referred to the P side, NTU_cf = ln[(1−PR)/(1−P)]/(1−R)
 * (Kern 1950, eq. 7.41 numerator), in log1p form; needs p < 1 and p·r < 1. */
double
hl_exchanger_ntu_counterflow(double p, double r)
{
	double x = p * (1.0 - r) / (1.0 - p);

	return p / (1.0 - p) * log1p_ratio(x);
}

/* Counterflow effectiveness of the reference side at ratio r >= 0
 * (Incropera & DeWitt, table 11.3, counterflow row) as E/(1 + E). */
double
hl_exchanger_eps_cf(double ntu, double r)
{
	double e = ntu * expm1_ratio((1.0 - r) * ntu);

	if (isinf(e))
		return 1.0;
	return e / (1.0 + e);
}

/* Logarithmic mean of dt1, dt2 (counterflow LMTD, Incropera & DeWitt ch. 11,
 * from memory) as mean·u/atanh(u), u = (dt1−dt2)/(dt1+dt2); Taylor series of
 * u/atanh(u) for |u| < 1e-3 (derived; first omitted term ~u⁸). */
hl_status
hl_exchanger_lmtd(double dt1, double dt2, double *lmtd, hl_error *err)
{
	double mean, u, s;

	if (!(dt1 > 0.0 && dt2 > 0.0 && isfinite(dt1) && isfinite(dt2)))
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "end temperature differences %.6g K and %.6g K must both "
		    "be positive: the hot stream must stay above the cold "
		    "stream at both ends", dt1, dt2);
	mean = 0.5 * dt1 + 0.5 * dt2;
	u = (dt1 - dt2) / (dt1 + dt2);
	if (fabs(u) < 1e-3) {
		s = u * u;
		*lmtd = mean * (1.0 - s * (1.0 / 3.0 + s * (4.0 / 45.0 +
		    s * (44.0 / 945.0))));
	} else
		*lmtd = mean * u / atanh(u);
	return HL_OK;
}

/* The checks every terminal-temperature set must pass, in the order that
 * gives the most useful message. */
static hl_status
check_temperatures(double hot_in, double hot_out, double cold_in,
		   double cold_out, hl_error *err)
{
	if (!(isfinite(hot_in) && isfinite(hot_out) && isfinite(cold_in) &&
	    isfinite(cold_out)))
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "a terminal temperature is not a finite number "
		    "(hot %g -> %g °C, cold %g -> %g °C): give all four in °C",
		    hot_in, hot_out, cold_in, cold_out);
	if (hot_out > hot_in)
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "hot outlet %.6g °C is above the hot inlet %.6g °C: a hot "
		    "stream cools down; check the order of its temperatures",
		    hot_out, hot_in);
	if (cold_out < cold_in)
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "cold outlet %.6g °C is below the cold inlet %.6g °C: a "
		    "cold stream heats up; check the order of its temperatures",
		    cold_out, cold_in);
	if (hot_in <= cold_out)
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "hot inlet %.6g °C is not above the cold outlet %.6g °C: "
		    "not even a counterflow unit can do this; lower the cold "
		    "outlet or raise the hot inlet", hot_in, cold_out);
	if (hot_out <= cold_in)
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "hot outlet %.6g °C is not above the cold inlet %.6g °C: "
		    "not even a counterflow unit can do this; raise the hot "
		    "outlet or lower the cold inlet", hot_out, cold_in);
	return HL_OK;
}

/* P and R as defined for the F charts (Bowman, Mueller & Nagle 1940; Kern
 * 1950, ch. 7), with the isothermal limits spelt out. */
hl_status
hl_exchanger_pr(double hot_in, double hot_out, double cold_in,
		double cold_out, double *p, double *r, hl_error *err)
{
	hl_status st;

	st = check_temperatures(hot_in, hot_out, cold_in, cold_out, err);
	if (st != HL_OK)
		return st;
	*p = (cold_out - cold_in) / (hot_in - cold_in);
	if (hot_in == hot_out)
		*r = 0.0;
	else if (cold_out == cold_in)
		*r = HUGE_VAL;
	else
		*r = (hot_in - hot_out) / (cold_out - cold_in);
	return HL_OK;
}

/* P at which the log argument of Kern (1950) eq. 7.41 has a zero
 * denominator: 2/(R + 1 + √(R² + 1)) (derived). */
double
hl_exchanger_pmax(double r)
{
	if (!(r >= 0.0))
		return NAN;
	return 2.0 / (r + 1.0 + hypot(r, 1.0));
}

/* Domain shared by the F and shells-in-series functions. */
static hl_status
check_pr(double p, double r, hl_error *err)
{
	if (!(p >= 0.0 && p < 1.0 && r >= 0.0))
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "P = %.6g and R = %.6g are outside 0 <= P < 1, R >= 0: "
		    "check the terminal temperatures", p, r);
	if (p > 0.0 && !(p * r < 1.0))
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "P = %.6g and R = %.6g give P·R >= 1: the hot outlet would "
		    "not be above the cold inlet; check the terminal "
		    "temperatures", p, r);
	return HL_OK;
}

/* F for 0 < P, 0 < R (see hl_exchanger_f); HL_ENOSOLUTION from P_max on. */
static hl_status
f_one_shell(double p, double r, double *f, hl_error *err)
{
	double s = hypot(r, 1.0);
	double b = 2.0 - p * (r + 1.0 + s);
	double value;

	if (p >= hl_exchanger_pmax(r) || !(b > 0.0))
		return hl_error_set(err, HL_ENOSOLUTION, NULL, 0,
		    "P = %.6g is at or above %.6g, the most one shell can "
		    "reach at R = %.6g: no F exists; use more shells in series",
		    p, hl_exchanger_pmax(r), r);
	value = s * hl_exchanger_ntu_counterflow(p, r) / log1p(2.0 * p * s / b);
	/* F <= 1 holds exactly; rounding at tiny P or R may overshoot. */
	*f = value > 1.0 ? 1.0 : value;
	return HL_OK;
}

/* F of 1 shell pass, 2, 4, … tube passes: Bowman, Mueller & Nagle (1940) as
 * Kern (1950) eq. 7.41, in the form S·NTU_cf/ln(1 + 2PS/b), b = 2 − P(R+1+S). */
hl_status
hl_exchanger_f(double p, double r, double *f, hl_error *err)
{
	hl_status st;

	st = check_pr(p, r, err);
	if (st != HL_OK)
		return st;
	if (p == 0.0 || r == 0.0) {
		*f = 1.0;
		return HL_OK;
	}
	return f_one_shell(p, r, f, err);
}

/* Domain of the shells-in-series functions: finite R, n at least 1. */
static hl_status
check_series(double p, double r, int n, hl_error *err)
{
	hl_status st;

	st = check_pr(p, r, err);
	if (st != HL_OK)
		return st;
	if (!isfinite(r))
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "R is infinite (cold side isothermal): shells in series "
		    "do not apply, F is 1");
	if (n < 1)
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "%d shells in series: the count must be at least 1", n);
	return HL_OK;
}

/* Per-shell P of n equal shells in series, Z = [(1−PR)/(1−P)]^(1/N),
 * P1 = (Z−1)/(Z−R) (from memory, confirmed against ε-NTU), computed as the
 * counterflow P at NTU_cf/n. */
static double
p_shell(double p, double r, int n)
{
	return hl_exchanger_eps_cf(hl_exchanger_ntu_counterflow(p, r) / n, r);
}

/* N equal shells in series: per-shell P1 from the overall P (see p_shell). */
hl_status
hl_exchanger_p_shell(double p, double r, int n, double *p1, hl_error *err)
{
	hl_status st;

	st = check_series(p, r, n, err);
	if (st != HL_OK)
		return st;
	*p1 = p_shell(p, r, n);
	return HL_OK;
}

/* F_N(P, R) = F(P1, R) for N equal shells in series (F of Kern 1950 eq. 7.41
 * at the per-shell P). */
hl_status
hl_exchanger_f_shells(double p, double r, int n, double *f, hl_error *err)
{
	hl_status st;

	st = check_series(p, r, n, err);
	if (st != HL_OK)
		return st;
	return hl_exchanger_f(p_shell(p, r, n), r, f, err);
}

/* Ahmad, Linnhoff & Smith (1988) closed form N = ln[(1−RP)/(1−P)]/ln W (from
 * memory), as the ratio of counterflow NTUs at P and at P1 = Xp·P_max. */
double
hl_exchanger_shells_estimate(double p, double r, double xp)
{
	if (check_series(p, r, 1, NULL) != HL_OK || !(xp > 0.0 && xp <= 1.0))
		return NAN;
	return hl_exchanger_ntu_counterflow(p, r) /
	    hl_exchanger_ntu_counterflow(xp * hl_exchanger_pmax(r), r);
}

/* Whether n shells meet both rules; fills F and P1 when they do. */
static int
shells_pass(double p, double r, int n, double fmin, double xp, double *f,
	    double *p1)
{
	double q = p_shell(p, r, n);

	if (q > xp * hl_exchanger_pmax(r))
		return 0;
	if (f_one_shell(q, r, f, NULL) != HL_OK || *f < fmin)
		return 0;
	*p1 = q;
	return 1;
}

/* Fewest shells with F >= fmin and P1 <= Xp·P_max (Xp rule of Ahmad,
 * Linnhoff & Smith 1988); both rules are monotone in N, so the first N that
 * passes is the smallest. */
hl_status
hl_exchanger_shells(double p, double r, double fmin, double xp, int *n,
		    double *f, double *p1, hl_error *err)
{
	hl_status st;
	double fv = 1.0, p1v = p;
	int k;

	st = check_pr(p, r, err);
	if (st != HL_OK)
		return st;
	if (!(fmin >= 0.0 && fmin < 1.0))
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "F floor %.6g is outside [0, 1): a usual floor is 0.80",
		    fmin);
	if (!(xp > 0.0 && xp <= 1.0))
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "Xp %.6g is outside (0, 1]: a usual value is 0.9", xp);
	/* F is 1 whatever the count when either side is isothermal. */
	if (p == 0.0 || r == 0.0) {
		k = 1;
		goto found;
	}
	for (k = 1; k <= HL_EXCHANGER_MAX_SHELLS; k++)
		if (shells_pass(p, r, k, fmin, xp, &fv, &p1v))
			goto found;
	return hl_error_set(err, HL_ENOSOLUTION, NULL, 0,
	    "P = %.6g at R = %.6g needs more than %d shells in series for "
	    "F >= %.6g and Xp %.6g: the approach is too close for "
	    "shell-and-tube; use a counterflow unit or widen the approach",
	    p, r, HL_EXCHANGER_MAX_SHELLS, fmin, xp);
found:
	*n = k;
	if (f != NULL)
		*f = fv;
	if (p1 != NULL)
		*p1 = p1v;
	return HL_OK;
}

/* Domain of the ε-NTU functions. */
static hl_status
check_ntu(double ntu, double cr, hl_error *err)
{
	if (!(ntu >= 0.0 && isfinite(ntu) && cr >= 0.0 && cr <= 1.0))
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "NTU = %.6g and Cr = %.6g are outside NTU >= 0, "
		    "0 <= Cr <= 1", ntu, cr);
	return HL_OK;
}

/* Counterflow ε-NTU (Incropera & DeWitt, table 11.3, from memory). */
hl_status
hl_exchanger_eps_counterflow(double ntu, double cr, double *eps,
			     hl_error *err)
{
	hl_status st;

	st = check_ntu(ntu, cr, err);
	if (st != HL_OK)
		return st;
	*eps = hl_exchanger_eps_cf(ntu, cr);
	return HL_OK;
}

/* One shell pass, 2, 4, … tube passes, ε1 = 2{1 + Cr + √(1+Cr²)·coth(NTU
 * √(1+Cr²)/2)}⁻¹ (Incropera & DeWitt, table 11.3, from memory). */
static double
eps_one_shell(double ntu, double cr)
{
	double s = hypot(cr, 1.0);

	if (ntu == 0.0)
		return 0.0;
	return 2.0 / (1.0 + cr + s / tanh(0.5 * ntu * s));
}

/* n shells in series, ε from ((1−εCr)/(1−ε)) = ((1−ε1Cr)/(1−ε1))ⁿ
 * (Incropera & DeWitt, table 11.3, from memory), i.e. counterflow ε at n times
 * the per-shell counterflow NTU. */
hl_status
hl_exchanger_eps_shells(double ntu, double cr, int n, double *eps,
			hl_error *err)
{
	hl_status st;
	double e1;

	st = check_ntu(ntu, cr, err);
	if (st != HL_OK)
		return st;
	if (n < 1)
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "%d shells in series: the count must be at least 1", n);
	e1 = eps_one_shell(ntu / n, cr);
	/* ε1 only reaches 1 by rounding, when Cr is nil or negligible. */
	if (e1 >= 1.0 || cr == 0.0) {
		*eps = -expm1(-ntu);
		return HL_OK;
	}
	*eps = hl_exchanger_eps_cf(n * hl_exchanger_ntu_counterflow(e1, cr), cr);
	return HL_OK;
}

/* Series film resistances across a thin clean wall, fouling included in each
 * h (common practice, no source). */
hl_status
hl_exchanger_u(double h_hot, double h_cold, double *u, hl_error *err)
{
	if (!(h_hot > 0.0 && h_cold > 0.0 && isfinite(h_hot) &&
	    isfinite(h_cold)))
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "film coefficients %.6g and %.6g kW/(m²·K) must both be "
		    "positive numbers", h_hot, h_cold);
	*u = 1.0 / (1.0 / h_hot + 1.0 / h_cold);
	return HL_OK;
}
