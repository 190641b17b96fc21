/* crossflow.c - single-pass crossflow with both fluids unmixed: ε-NTU, F,
 * and sections in series (an air cooler's tube passes or bays).
 *
 * The effectiveness is the exact series solution (Mason 1954, as tabulated
 * by Kays & London, Compact Heat Exchangers, 3rd ed. 1984, from memory),
 *	ε = 1/(Cr·NTU) · Σ_{n>=0} A_n(NTU) · A_n(Cr·NTU),
 *	A_n(x) = 1 − e^{−x} Σ_{m=0}^{n} x^m/m!  = P(N > n), N ~ Poisson(x),
 * each A_n summed from the Poisson terms above n (no cancellation, so a
 * small Cr·NTU keeps its digits). tests/unit/test_exchanger.c checks it
 * against a finite-difference solution of the crossflow equations and
 * published values.
 */
#include <math.h>

#include "exchanger.h"

/* Terms enough for x up to HL_CROSSFLOW_NTU_MAX: the Poisson mass past
 * x + 12·√x + 40 is below 1e-30. */
#define TERMS 256

/* tail[n] = P(N > n) for N ~ Poisson(x), n = 0 … TERMS − 1. */
static void
poisson_tails(double x, double *tail)
{
	double pmf[TERMS + 1], sum = 0.0, lp = -x, lx = log(x);
	int m;

	/* log pmf(m) = −x + m·ln x − ln m!, built up term by term. */
	for (m = 0; m <= TERMS; m++) {
		if (m > 0)
			lp += lx - log((double)m);
		pmf[m] = exp(lp);
	}
	for (m = TERMS; m >= 1; m--) {
		sum += pmf[m];
		tail[m - 1] = sum;
	}
}

/* The series above; cr·ntu = 0 is the limit 1 − e^{−NTU}. */
static double
eps_unmixed(double ntu, double cr)
{
	double ta[TERMS], tb[TERMS], y = cr * ntu, sum = 0.0;
	int n;

	if (ntu == 0.0)
		return 0.0;
	if (y == 0.0)
		return -expm1(-ntu);
	poisson_tails(ntu, ta);
	poisson_tails(y, tb);
	for (n = TERMS - 1; n >= 0; n--)
		sum += ta[n] * tb[n];
	return fmin(sum / y, 1.0);
}

/* Crossflow ε-NTU, both fluids unmixed: the series of Mason (1954). */
hl_status
hl_exchanger_eps_crossflow(double ntu, double cr, double *eps, hl_error *err)
{
	if (!(ntu >= 0.0 && ntu <= HL_CROSSFLOW_NTU_MAX && cr >= 0.0 &&
	      cr <= 1.0))
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "crossflow NTU = %.6g and Cr = %.6g are outside "
		    "0 <= NTU <= %g, 0 <= Cr <= 1", ntu, cr,
		    HL_CROSSFLOW_NTU_MAX);
	*eps = eps_unmixed(ntu, cr);
	return HL_OK;
}

/* NTU (referred to Cmin) at which the series reaches eps, by bisection
 * (ε rises with NTU); -1 when it would exceed HL_CROSSFLOW_NTU_MAX. */
static double
ntu_unmixed(double eps, double cr)
{
	double lo = 0.0, hi = HL_CROSSFLOW_NTU_MAX;
	int k;

	if (eps >= eps_unmixed(hi, cr))
		return -1.0;
	for (k = 0; k < 200 && hi - lo > 1e-14 * hi; k++) {
		double mid = 0.5 * (lo + hi);

		if (eps_unmixed(mid, cr) < eps)
			lo = mid;
		else
			hi = mid;
	}
	return 0.5 * (lo + hi);
}

/* F = NTU_counterflow / NTU_crossflow at the same P and R, both NTUs
 * referred to the cold side (the LMTD method's F as the ratio of the
 * UA a counterflow unit needs to the UA the crossflow unit needs;
 * Bowman, Mueller & Nagle 1940 define F this way). */
static hl_status
f_cross(double p, double r, double *f, hl_error *err)
{
	double ntu_cold;

	if (p == 0.0 || r == 0.0 || !isfinite(r)) {
		*f = 1.0;
		return HL_OK;
	}
	/* The side with the smaller C is the cold one when r <= 1. */
	if (r <= 1.0)
		ntu_cold = ntu_unmixed(p, r);
	else {
		ntu_cold = ntu_unmixed(p * r, 1.0 / r);
		if (ntu_cold > 0.0)
			ntu_cold /= r;
	}
	if (!(ntu_cold > 0.0))
		return hl_error_set(err, HL_ENOSOLUTION, NULL, 0,
		    "P = %.6g at R = %.6g is beyond what one crossflow "
		    "section reaches: use more sections in series", p, r);
	*f = fmin(hl_exchanger_ntu_counterflow(p, r) / ntu_cold, 1.0);
	return HL_OK;
}

hl_status
hl_exchanger_f_crossflow(double p, double r, double *f, hl_error *err)
{
	/* Same domain as the shell F: 0 <= p < 1, r >= 0, p·r < 1. */
	if (!(p >= 0.0 && p < 1.0 && r >= 0.0) ||
	    !(p * r < 1.0 || (p == 0.0 && isinf(r))))
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "P = %.6g and R = %.6g are outside 0 <= P < 1, R >= 0, "
		    "P·R < 1", p, r);
	return f_cross(p, r, f, err);
}

/* Sections in series in counter-current order: each section sees the
 * per-section P of hl_exchanger_p_shell (the series rule does not depend
 * on the kind of unit); the first count whose F >= fmin. */
hl_status
hl_exchanger_sections_crossflow(double p, double r, double fmin, int *n,
				double *f, hl_error *err)
{
	double fv = 1.0, p1;
	int k;

	if (!(fmin >= 0.0 && fmin < 1.0))
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "F floor %.6g is outside [0, 1): a usual floor is 0.80",
		    fmin);
	if (p == 0.0 || r == 0.0 || !isfinite(r)) {
		*n = 1;
		return hl_exchanger_f_crossflow(p, r, f, err);
	}
	for (k = 1; k <= HL_EXCHANGER_MAX_SHELLS; k++) {
		hl_status st = hl_exchanger_p_shell(p, r, k, &p1, err);

		if (st != HL_OK)
			return st;
		if (f_cross(p1, r, &fv, NULL) == HL_OK && fv >= fmin) {
			*n = k;
			*f = fv;
			return HL_OK;
		}
	}
	return hl_error_set(err, HL_ENOSOLUTION, NULL, 0,
	    "P = %.6g at R = %.6g needs more than %d crossflow sections in "
	    "series for F >= %.6g: the approach is too close for an air "
	    "cooler; widen it", p, r, HL_EXCHANGER_MAX_SHELLS, fmin);
}
