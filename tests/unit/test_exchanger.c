/* test_exchanger.c - exchanger sizing against published formulas and values.
 *
 * Outside references (each check names its own):
 *   Kern, Process Heat Transfer (McGraw-Hill 1950): eq. 7.41 (the F formula of
 *     Bowman, Mueller & Nagle 1940) and Example 11.1;
 *   Incropera & DeWitt, Fundamentals of Heat and Mass Transfer, table 11.3
 *     (ε-NTU), from memory;
 *   Ahmad, Linnhoff & Smith, J. Heat Transfer 110 (1988) 304-309 (Xp rule).
 * The formulas are transcribed literally below (naive_*), away from the points
 * where they cancel, so that the module's rearranged forms are checked against
 * the published ones rather than against themselves.
 */
#include <stdarg.h>
#include <stddef.h>
#include <stdint.h>
#include <setjmp.h>
#include <cmocka.h>

#include <math.h>
#include <string.h>

#include "exchanger.h"

/* Tolerances, named for what they allow. */
#define TOL_ROUND 1e-12      /* rounding only, well-conditioned evaluation */
#define TOL_CANCEL 1e-9      /* a literal formula with some cancellation */
#define TOL_AREA 1e-9        /* two routes to one area (brief: 1e-9 relative) */
#define TOL_PRINT3 1e-3      /* a value printed to three decimals */
#define TOL_CHART 0.01       /* a value read from a chart (Kern: 0.885 vs 0.878) */

/* Fail with both numbers when got is not within rel·|want| (abs when want is 0). */
static void
check_rel(double got, double want, double tol, const char *what)
{
	double scale = want == 0.0 ? 1.0 : fabs(want);

	if (!(fabs(got - want) <= tol * scale))
		fail_msg("%s: got %.17g, want %.17g (tolerance %g)", what,
		    got, want, tol);
}

static void
check_abs(double got, double want, double tol, const char *what)
{
	if (!(fabs(got - want) <= tol))
		fail_msg("%s: got %.17g, want %.17g (+- %g)", what, got, want,
		    tol);
}

static void
check_ok(hl_status st, const hl_error *err)
{
	if (st != HL_OK)
		fail_msg("status %d: %s", (int)st,
		    err != NULL ? err->text : "(no message asked for)");
}

/* The call must fail with status want and a message containing text. */
static void
check_fails(hl_status st, const hl_error *err, hl_status want,
	    const char *text)
{
	if (st != want)
		fail_msg("status %d, want %d (message: %s)", (int)st,
		    (int)want, err->text);
	if (strstr(err->text, text) == NULL)
		fail_msg("message \"%s\" lacks \"%s\"", err->text, text);
	assert_int_equal(err->status, want);
}

/* Kern (1950) eq. 7.41, literally: S = √(R²+1),
 * F = [S/(R−1)]·ln[(1−P)/(1−PR)] / ln{[2−P(R+1−S)]/[2−P(R+1+S)]}. */
static double
naive_f(double p, double r)
{
	double s = sqrt(r * r + 1.0);

	return s / (r - 1.0) * log((1.0 - p) / (1.0 - p * r)) /
	    log((2.0 - p * (r + 1.0 - s)) / (2.0 - p * (r + 1.0 + s)));
}

/* Kern (1950) eq. 7.41 at R = 1 (its limit, as quoted in doc/references.md):
 * F = [P√2/(1−P)] / ln{[2−P(2−√2)]/[2−P(2+√2)]}. */
static double
naive_f_r1(double p)
{
	double s = sqrt(2.0);

	return p * s / (1.0 - p) /
	    log((2.0 - p * (2.0 - s)) / (2.0 - p * (2.0 + s)));
}

/* Per-shell P of N shells in series, literally (doc/references.md, from memory):
 * Z = [(1−PR)/(1−P)]^(1/N), P1 = (Z−1)/(Z−R); R = 1: P1 = P/(N − (N−1)P). */
static double
naive_p_shell(double p, double r, int n)
{
	double z;

	if (r == 1.0)
		return p / (n - (n - 1) * p);
	z = pow((1.0 - p * r) / (1.0 - p), 1.0 / n);
	return (z - 1.0) / (z - r);
}

/* Incropera & DeWitt, table 11.3 (from memory), one shell pass, 2, 4, … tube
 * passes: ε1 = 2{1 + Cr + √(1+Cr²)·[1+exp(−NTU√(1+Cr²))]/[1−exp(−NTU√(1+Cr²))]}⁻¹. */
static double
naive_eps1(double ntu, double cr)
{
	double s = sqrt(1.0 + cr * cr);
	double e = exp(-ntu * s);

	return 2.0 / (1.0 + cr + s * (1.0 + e) / (1.0 - e));
}

/* Incropera & DeWitt, table 11.3 (from memory), n shells:
 * ε = [((1−ε1Cr)/(1−ε1))ⁿ − 1]/[((1−ε1Cr)/(1−ε1))ⁿ − Cr], ε1 at NTU/n;
 * Cr = 1: ε = nε1/(1 + (n−1)ε1). */
static double
naive_eps_n(double ntu, double cr, int n)
{
	double e1 = naive_eps1(ntu / n, cr), q;

	if (cr == 1.0)
		return n * e1 / (1.0 + (n - 1) * e1);
	q = pow((1.0 - e1 * cr) / (1.0 - e1), n);
	return (q - 1.0) / (q - cr);
}

/* Incropera & DeWitt, table 11.3 (from memory), counterflow:
 * ε = [1 − exp(−NTU(1−Cr))]/[1 − Cr·exp(−NTU(1−Cr))]; Cr = 1: NTU/(1+NTU). */
static double
naive_eps_cf(double ntu, double cr)
{
	double e;

	if (cr == 1.0)
		return ntu / (1.0 + ntu);
	e = exp(-ntu * (1.0 - cr));
	return (1.0 - e) / (1.0 - cr * e);
}

/* NTU with eps(NTU) = target by bisection (eps rises with NTU);
 * HUGE_VAL when no finite NTU reaches the target. */
static double
invert_eps(double (*eps)(double, double, int), double target, double cr,
	   int n)
{
	double lo = 0.0, hi = 1.0, mid;
	int i;

	while (eps(hi, cr, n) < target) {
		if (hi > 1e9)
			return HUGE_VAL;
		hi *= 2.0;
	}
	for (i = 0; i < 200 && hi - lo > 1e-16 * hi; i++) {
		mid = 0.5 * (lo + hi);
		if (eps(mid, cr, n) < target)
			lo = mid;
		else
			hi = mid;
	}
	return 0.5 * (lo + hi);
}

/* The module's n-shell ε as a plain function, for invert_eps. */
static double
module_eps_n(double ntu, double cr, int n)
{
	double e = NAN;

	assert_int_equal(hl_exchanger_eps_shells(ntu, cr, n, &e, NULL), HL_OK);
	return e;
}

/* Counterflow NTU referred to the cold side, ln[(1−PR)/(1−P)]/(1−R), R = 1:
 * P/(1−P) (doc/references.md, ε-NTU link). */
static double
naive_ntu_cf(double p, double r)
{
	if (r == 1.0)
		return p / (1.0 - p);
	return log((1.0 - p * r) / (1.0 - p)) / (1.0 - r);
}

/* ---- LMTD ---- */

/* Kern (1950) Example 11.1: 340→240 °F against 200→230 °F. Kern prints
 * 69.3 °F; the log mean of 110 and 40 is 69.197, so his slide-rule value is
 * allowed 0.15 °F. The definition (Δt1 − Δt2)/ln(Δt1/Δt2) is checked tightly. */
static void
test_lmtd_kern_example(void **state)
{
	hl_error err;
	double l;

	(void)state;
	check_ok(hl_exchanger_lmtd(340.0 - 230.0, 240.0 - 200.0, &l, &err),
	    &err);
	check_abs(l, 69.3, 0.15, "Kern Ex. 11.1 LMTD as printed");
	check_rel(l, 70.0 / log(110.0 / 40.0), TOL_ROUND, "LMTD definition");
}

/* The log mean lies strictly between the geometric and the arithmetic mean
 * (Carlson, "The logarithmic mean", Amer. Math. Monthly 79 (1972) 615-618,
 * from memory), so strictly between the end differences; it is symmetric and
 * equals the common value when they meet (common practice, no source). */
static void
test_lmtd_bounds(void **state)
{
	static const double d[] = { 1e-3, 0.5, 1.0, 1.0005, 1.002, 3.0, 10.0,
		99.0, 1e4 };
	size_t i, j;
	double l, l2, lo, hi;

	(void)state;
	for (i = 0; i < sizeof d / sizeof d[0]; i++)
		for (j = 0; j < sizeof d / sizeof d[0]; j++) {
			if (i == j)
				continue;
			check_ok(hl_exchanger_lmtd(d[i], d[j], &l, NULL), NULL);
			check_ok(hl_exchanger_lmtd(d[j], d[i], &l2, NULL),
			    NULL);
			lo = fmin(d[i], d[j]);
			hi = fmax(d[i], d[j]);
			assert_true(l > lo && l < hi);
			assert_true(l > sqrt(d[i] * d[j]));
			assert_true(l < 0.5 * (d[i] + d[j]));
			check_rel(l2, l, TOL_ROUND, "LMTD symmetric");
		}
	check_ok(hl_exchanger_lmtd(7.25, 7.25, &l, NULL), NULL);
	assert_true(l == 7.25);
}

/* Near equality the naive ratio form loses about half its digits; the module
 * must stay within 1e-12 of the arithmetic mean (its distance from the mean
 * there is ~1e-21 relative: mean·u²/3 with u = 5e-11, derived). */
static void
test_lmtd_near_equal(void **state)
{
	static const double base[] = { 1e-2, 1.0, 37.5, 250.0 };
	size_t i;
	double a, b, l;

	(void)state;
	for (i = 0; i < sizeof base / sizeof base[0]; i++) {
		a = base[i] * (1.0 + 1e-10);
		b = base[i];
		check_ok(hl_exchanger_lmtd(a, b, &l, NULL), NULL);
		check_rel(l, 0.5 * (a + b), 1e-12, "LMTD near equality");
	}
}

/* The series used for |u| < 1e-3 must match the closed form there:
 * ln(a/b) = 2·atanh(u), u = (a−b)/(a+b), so LMTD = mean·u/atanh(u) (derived),
 * evaluated here directly; dropping the u⁴ term would show as ~9e-14. */
static void
test_lmtd_series(void **state)
{
	static const double uu[] = { 0.999e-3, 0.5e-3, 1e-4, 1.001e-3, 1e-2 };
	size_t i;
	double a, b = 40.0, u, l;

	(void)state;
	for (i = 0; i < sizeof uu / sizeof uu[0]; i++) {
		a = b * (1.0 + uu[i]) / (1.0 - uu[i]);
		check_ok(hl_exchanger_lmtd(a, b, &l, NULL), NULL);
		u = (a - b) / (a + b);
		check_rel(l, 0.5 * (a + b) * u / atanh(u), 3e-15,
		    "LMTD series against mean·u/atanh(u)");
	}
}

/* ---- P, R and F ---- */

/* Kern (1950) Example 11.1: R = 3.33, S (his P) = 0.214; eq. 7.41 gives
 * F = 0.878 (three decimals) and his chart 0.885 (±0.01). */
static void
test_f_kern_example(void **state)
{
	hl_error err;
	double p, r, f;

	(void)state;
	check_ok(hl_exchanger_pr(340.0, 240.0, 200.0, 230.0, &p, &r, &err),
	    &err);
	check_abs(r, 3.33, 0.005, "Kern Ex. 11.1 R");
	check_abs(p, 0.214, 0.0005, "Kern Ex. 11.1 S");
	check_ok(hl_exchanger_f(p, r, &f, &err), &err);
	check_abs(f, 0.878, TOL_PRINT3, "Kern Ex. 11.1 F by eq. 7.41");
	check_abs(f, 0.885, TOL_CHART, "Kern Ex. 11.1 F from the chart");
}

/* The module's rearranged F equals Kern (1950) eq. 7.41 as printed, over a
 * grid of R away from 1 and P up to 0.99 of P_max. */
static void
test_f_matches_eq741(void **state)
{
	static const double rr[] = { 0.05, 0.2, 0.5, 0.8, 0.95, 1.05, 1.5,
		2.0, 10.0 / 3.0, 5.0, 20.0 };
	static const double q[] = { 0.01, 0.1, 0.3, 0.5, 0.7, 0.9, 0.99 };
	size_t i, j;
	double p, f;

	(void)state;
	for (i = 0; i < sizeof rr / sizeof rr[0]; i++)
		for (j = 0; j < sizeof q / sizeof q[0]; j++) {
			p = q[j] * hl_exchanger_pmax(rr[i]);
			check_ok(hl_exchanger_f(p, rr[i], &f, NULL), NULL);
			check_rel(f, naive_f(p, rr[i]), TOL_CANCEL,
			    "F against Kern eq. 7.41");
			assert_true(f > 0.0 && f < 1.0);
		}
}

/* F = 1 at P = 0 or R = 0 and tends to 1 as either goes to 0 (Kern 1950,
 * eq. 7.41, limit; an isothermal side makes the flow pattern irrelevant:
 * common practice, no source). */
static void
test_f_limits(void **state)
{
	static const double rr[] = { 0.0, 0.3, 1.0, 2.5, 40.0 };
	size_t i;
	double f;

	(void)state;
	for (i = 0; i < sizeof rr / sizeof rr[0]; i++) {
		check_ok(hl_exchanger_f(0.0, rr[i], &f, NULL), NULL);
		assert_true(f == 1.0);
		check_ok(hl_exchanger_f(1e-9 * hl_exchanger_pmax(rr[i]),
		    rr[i], &f, NULL), NULL);
		check_abs(f, 1.0, 1e-8, "F as P -> 0");
	}
	check_ok(hl_exchanger_f(0.0, HUGE_VAL, &f, NULL), NULL);
	assert_true(f == 1.0);
	check_ok(hl_exchanger_f(0.7, 0.0, &f, NULL), NULL);
	assert_true(f == 1.0);
	check_ok(hl_exchanger_f(0.7, 1e-9, &f, NULL), NULL);
	check_abs(f, 1.0, 1e-8, "F as R -> 0");
}

/* Reciprocity F(P, R) = F(P·R, 1/R) (common practice; stated by Ahmad,
 * Linnhoff & Smith 1988). */
static void
test_f_reciprocity(void **state)
{
	static const double rr[] = { 0.1, 0.4, 0.75, 1.0, 1.3, 2.0, 6.0 };
	static const double q[] = { 0.05, 0.25, 0.5, 0.75, 0.95 };
	size_t i, j;
	double p, f, g;

	(void)state;
	for (i = 0; i < sizeof rr / sizeof rr[0]; i++)
		for (j = 0; j < sizeof q / sizeof q[0]; j++) {
			p = q[j] * hl_exchanger_pmax(rr[i]);
			check_ok(hl_exchanger_f(p, rr[i], &f, NULL), NULL);
			check_ok(hl_exchanger_f(p * rr[i], 1.0 / rr[i], &g,
			    NULL), NULL);
			check_rel(g, f, 1e-11, "F reciprocity");
		}
}

/* P_max = 2/(R+1+√(R²+1)): P_max(1) = 2 − √2, P_max(0) = 1 (derived from
 * Kern 1950 eq. 7.41); F has no real value from P_max on, and falls towards
 * 0 just below it (its denominator log diverges; derived). */
static void
test_pmax(void **state)
{
	static const double rr[] = { 0.2, 1.0, 3.0 };
	hl_error err;
	size_t i;
	double pm, f;

	(void)state;
	check_rel(hl_exchanger_pmax(1.0), 2.0 - sqrt(2.0), 1e-15, "P_max(1)");
	assert_true(hl_exchanger_pmax(0.0) == 1.0);
	assert_true(hl_exchanger_pmax(HUGE_VAL) == 0.0);
	assert_true(isnan(hl_exchanger_pmax(-0.5)));
	assert_true(isnan(hl_exchanger_pmax(NAN)));
	for (i = 0; i < sizeof rr / sizeof rr[0]; i++) {
		pm = hl_exchanger_pmax(rr[i]);
		f = -1.0;
		check_fails(hl_exchanger_f(pm, rr[i], &f, &err), &err,
		    HL_ENOSOLUTION, "use more shells");
		assert_true(f == -1.0);
		check_fails(hl_exchanger_f(pm * 1.01, rr[i], &f, &err), &err,
		    HL_ENOSOLUTION, "most one shell can reach");
		check_ok(hl_exchanger_f(pm * (1.0 - 1e-6), rr[i], &f, NULL),
		    NULL);
		assert_true(f > 0.0 && f < 0.3);
	}
}

/* At R = 1 the module agrees with Kern's R = 1 limit of eq. 7.41 and with
 * eq. 7.41 itself near R = 1 where that is still well conditioned
 * (δ >= 1e-3). Through R = 1 F is smooth: F(P, 1 ± δ) = F(P, 1) ± F'·δ to
 * within 1e-3·δ plus rounding for δ down to 1e-12, F' taken from δ = 1e-4
 * (derived); a branch or a cancelling form near R = 1 would break this. */
static void
test_f_r1_continuity(void **state)
{
	static const double pp[] = { 0.05, 0.2, 0.4, 0.5, 0.55, 0.58 };
	size_t i;
	int k;
	double f1, f, fa, fb, d, slope;

	(void)state;
	for (i = 0; i < sizeof pp / sizeof pp[0]; i++) {
		check_ok(hl_exchanger_f(pp[i], 1.0, &f1, NULL), NULL);
		check_rel(f1, naive_f_r1(pp[i]), TOL_ROUND * 10,
		    "F at R = 1 against Kern's limit");
		for (k = 1; k <= 3; k++) {
			d = pow(10.0, -k);
			if (pp[i] >= hl_exchanger_pmax(1.0 + d))
				continue;
			check_ok(hl_exchanger_f(pp[i], 1.0 + d, &f, NULL),
			    NULL);
			check_rel(f, naive_f(pp[i], 1.0 + d), 1e-10,
			    "F near R = 1 against eq. 7.41");
			check_ok(hl_exchanger_f(pp[i], 1.0 - d, &f, NULL),
			    NULL);
			check_rel(f, naive_f(pp[i], 1.0 - d), 1e-10,
			    "F near R = 1 against eq. 7.41");
		}
		check_ok(hl_exchanger_f(pp[i], 1.0 + 1e-4, &fa, NULL), NULL);
		check_ok(hl_exchanger_f(pp[i], 1.0 - 1e-4, &fb, NULL), NULL);
		slope = (fa - fb) / 2e-4;
		for (k = 5; k <= 12; k++) {
			d = pow(10.0, -k);
			check_ok(hl_exchanger_f(pp[i], 1.0 + d, &f, NULL),
			    NULL);
			check_abs(f, f1 + slope * d, 1e-3 * d + 4e-16,
			    "F smooth as R -> 1+");
			check_ok(hl_exchanger_f(pp[i], 1.0 - d, &f, NULL),
			    NULL);
			check_abs(f, f1 - slope * d, 1e-3 * d + 4e-16,
			    "F smooth as R -> 1-");
		}
	}
}

/* ---- shells in series ---- */

/* The stable per-shell P equals the literal Z formula (doc/references.md, from
 * memory; confirmed against ε-NTU in test_area_two_routes) and its R = 1
 * form, and is continuous through R = 1. */
static void
test_p_shell_formula(void **state)
{
	static const double rr[] = { 0.0, 0.3, 0.9, 1.0, 1.2, 3.0 };
	static const double q[] = { 0.1, 0.5, 0.9, 0.99 };
	static const int nn[] = { 1, 2, 3, 7 };
	size_t i, j, k;
	double p, p1, lim;

	(void)state;
	for (i = 0; i < sizeof rr / sizeof rr[0]; i++)
		for (j = 0; j < sizeof q / sizeof q[0]; j++)
			for (k = 0; k < sizeof nn / sizeof nn[0]; k++) {
				lim = rr[i] > 1.0 ? 1.0 / rr[i] : 1.0;
				p = q[j] * lim;
				check_ok(hl_exchanger_p_shell(p, rr[i], nn[k],
				    &p1, NULL), NULL);
				check_rel(p1, naive_p_shell(p, rr[i], nn[k]),
				    TOL_CANCEL, "per-shell P, Z formula");
				if (nn[k] == 1)
					check_rel(p1, p, TOL_ROUND,
					    "one shell keeps P");
			}
	for (k = 0; k < sizeof nn / sizeof nn[0]; k++) {
		check_ok(hl_exchanger_p_shell(0.7, 1.0 + 1e-9, nn[k], &p1, NULL),
		    NULL);
		check_abs(p1, naive_p_shell(0.7, 1.0, nn[k]), 1e-8,
		    "per-shell P as R -> 1");
	}
}

/* Values [derived] in doc/references.md with Xp 0.9 (Ahmad, Linnhoff & Smith
 * 1988 closed form, from memory) and an F floor of 0.80. A second route
 * checks F and the per-shell P: the NTU from inverting the literal
 * Incropera & DeWitt n-shell ε-NTU relation, F = NTU_cf/NTU, P1 = ε1 at NTU/N. */
static void
test_shells_reference(void **state)
{
	static const struct {
		double p, r, est;
		int n;
		double f;
	} c[] = {
		{ 0.6, 1.0, 1.345, 2, 0.898 },
		{ 0.8, 1.0, 3.587, 4, 0.802 },
		{ 0.4, 2.0, 1.481, 2, 0.888 },
		{ 0.9, 0.8, 4.156, 5, 0.837 },
	};
	hl_error err;
	size_t i;
	int n;
	double f, p1, est, eps, cr, ntu_min, ntu_cold, e1, p1_alt, f_alt;

	(void)state;
	for (i = 0; i < sizeof c / sizeof c[0]; i++) {
		check_ok(hl_exchanger_shells(c[i].p, c[i].r, 0.80, 0.9, &n, &f,
		    &p1, &err), &err);
		assert_int_equal(n, c[i].n);
		check_abs(f, c[i].f, TOL_PRINT3, "shells: F as tabulated");
		est = hl_exchanger_shells_estimate(c[i].p, c[i].r, 0.9);
		check_abs(est, c[i].est, TOL_PRINT3, "Xp closed form");
		assert_int_equal((int)ceil(est), c[i].n);

		/* ε-NTU route: with R <= 1 the cold side is Cmin, ε = P,
		 * Cr = R; with R > 1 the hot side is, ε = P·R, Cr = 1/R. */
		eps = c[i].r <= 1.0 ? c[i].p : c[i].p * c[i].r;
		cr = c[i].r <= 1.0 ? c[i].r : 1.0 / c[i].r;
		ntu_min = invert_eps(naive_eps_n, eps, cr, c[i].n);
		ntu_cold = c[i].r <= 1.0 ? ntu_min : ntu_min / c[i].r;
		f_alt = naive_ntu_cf(c[i].p, c[i].r) / ntu_cold;
		check_rel(f, f_alt, TOL_CANCEL, "shells: F by eps-NTU");
		e1 = naive_eps1(ntu_min / c[i].n, cr);
		p1_alt = c[i].r <= 1.0 ? e1 : e1 / c[i].r;
		check_rel(p1, p1_alt, TOL_CANCEL, "shells: P1 by eps-NTU");
		assert_true(p1_alt <= 0.9 * hl_exchanger_pmax(c[i].r));
		/* One shell fewer breaks the Xp rule (the closed form says
		 * so; checked here on the ε-NTU route). */
		ntu_min = invert_eps(naive_eps_n, eps, cr, c[i].n - 1);
		e1 = naive_eps1(ntu_min / (c[i].n - 1), cr);
		p1_alt = c[i].r <= 1.0 ? e1 : e1 / c[i].r;
		assert_true(p1_alt > 0.9 * hl_exchanger_pmax(c[i].r));
	}
}

/* Does n shells pass both rules (evaluated through the public functions)? */
static int
passes(double p, double r, int n, double fmin, double xp)
{
	double p1, f;

	if (hl_exchanger_p_shell(p, r, n, &p1, NULL) != HL_OK)
		fail_msg("p_shell failed at P %g R %g n %d", p, r, n);
	if (p1 > xp * hl_exchanger_pmax(r))
		return 0;
	if (hl_exchanger_f_shells(p, r, n, &f, NULL) != HL_OK)
		return 0;
	return f >= fmin;
}

/* Minimality on a grid: the returned N meets the F floor and the Xp rule,
 * N − 1 fails one of them (Ahmad, Linnhoff & Smith 1988: the count is the
 * smallest meeting both). A temperature cross needs several shells. */
static void
test_shells_minimal(void **state)
{
	static const double rr[] = { 0.1, 0.5, 0.9, 1.0, 1.1, 2.0, 4.0 };
	static const double q[] = { 0.1, 0.3, 0.5, 0.7, 0.85, 0.95, 0.99 };
	static const double fm[] = { 0.0, 0.75, 0.80, 0.90 };
	static const double xx[] = { 0.8, 0.9, 1.0 };
	size_t i, j, k, m;
	int n, several = 0, capped = 0;
	double p, lim, f, p1;
	hl_status st;

	(void)state;
	for (i = 0; i < sizeof rr / sizeof rr[0]; i++)
	for (j = 0; j < sizeof q / sizeof q[0]; j++)
	for (k = 0; k < sizeof fm / sizeof fm[0]; k++)
	for (m = 0; m < sizeof xx / sizeof xx[0]; m++) {
		lim = rr[i] > 1.0 ? 1.0 / rr[i] : 1.0;
		p = q[j] * lim;
		st = hl_exchanger_shells(p, rr[i], fm[k], xx[m], &n, &f, &p1,
		    NULL);
		if (st == HL_ENOSOLUTION) {
			assert_false(passes(p, rr[i], HL_EXCHANGER_MAX_SHELLS,
			    fm[k], xx[m]));
			capped++;
			continue;
		}
		check_ok(st, NULL);
		assert_true(n >= 1 && n <= HL_EXCHANGER_MAX_SHELLS);
		assert_true(passes(p, rr[i], n, fm[k], xx[m]));
		assert_true(f >= fm[k]);
		assert_true(p1 <= xx[m] * hl_exchanger_pmax(rr[i]));
		if (n > 1) {
			assert_false(passes(p, rr[i], n - 1, fm[k], xx[m]));
			several++;
		}
	}
	assert_true(several > 100);
	assert_true(capped > 0);
}

/* Beyond HL_EXCHANGER_MAX_SHELLS the count is an error, not a number; an
 * isothermal side needs one shell whatever P (F ≡ 1; common practice). */
static void
test_shells_limits(void **state)
{
	hl_error err;
	int n = -1;
	double f, p1;

	(void)state;
	check_fails(hl_exchanger_shells(0.99999, 1.0, 0.8, 0.9, &n, &f, &p1,
	    &err), &err, HL_ENOSOLUTION, "more than 50 shells");
	assert_int_equal(n, -1);
	check_ok(hl_exchanger_shells(0.95, 0.0, 0.8, 0.9, &n, NULL, NULL,
	    &err), &err);
	assert_int_equal(n, 1);
	check_ok(hl_exchanger_shells(0.0, HUGE_VAL, 0.8, 0.9, &n, &f, NULL,
	    &err), &err);
	assert_int_equal(n, 1);
	assert_true(f == 1.0);
	check_fails(hl_exchanger_shells(0.5, 1.0, 1.0, 0.9, &n, &f, &p1,
	    &err), &err, HL_EINPUT, "F floor");
	check_fails(hl_exchanger_shells(0.5, 1.0, 0.8, 0.0, &n, &f, &p1,
	    &err), &err, HL_EINPUT, "Xp");
	check_fails(hl_exchanger_shells(0.5, 1.0, 0.8, 1.5, &n, &f, &p1,
	    &err), &err, HL_EINPUT, "Xp");
	assert_true(isnan(hl_exchanger_shells_estimate(0.5, 1.0, 0.0)));
	assert_true(isnan(hl_exchanger_shells_estimate(1.0, 1.0, 0.9)));
}

/* ---- ε-NTU ---- */

/* Incropera & DeWitt (from memory): one shell pass, NTU = 2, Cr = 0.5 →
 * ε = 0.693. */
static void
test_eps_worked_value(void **state)
{
	double e;

	(void)state;
	check_ok(hl_exchanger_eps_shells(2.0, 0.5, 1, &e, NULL), NULL);
	check_abs(e, 0.693, 5e-4, "Incropera 1-2 worked value");
}

/* The module's ε-NTU against the literal table 11.3 formulas (Incropera &
 * DeWitt, from memory); with Cr = 0 every arrangement gives 1 − exp(−NTU)
 * (Incropera & DeWitt, ch. 11, from memory); NTU = 0 gives ε = 0. */
static void
test_eps_table(void **state)
{
	static const double cc[] = { 0.0, 0.25, 0.5, 0.75, 0.9, 1.0 };
	static const double tt[] = { 0.05, 0.5, 1.0, 2.0, 5.0, 12.0 };
	static const int nn[] = { 1, 2, 3, 5 };
	size_t i, j, k;
	double e;

	(void)state;
	for (i = 0; i < sizeof cc / sizeof cc[0]; i++)
		for (j = 0; j < sizeof tt / sizeof tt[0]; j++) {
			for (k = 0; k < sizeof nn / sizeof nn[0]; k++) {
				check_ok(hl_exchanger_eps_shells(tt[j], cc[i],
				    nn[k], &e, NULL), NULL);
				check_rel(e, naive_eps_n(tt[j], cc[i], nn[k]),
				    TOL_CANCEL, "eps n shells");
				if (cc[i] == 0.0)
					check_rel(e, -expm1(-tt[j]), TOL_ROUND,
					    "eps at Cr = 0");
			}
			check_ok(hl_exchanger_eps_counterflow(tt[j], cc[i], &e,
			    NULL), NULL);
			check_rel(e, naive_eps_cf(tt[j], cc[i]), TOL_CANCEL,
			    "eps counterflow");
		}
	check_ok(hl_exchanger_eps_shells(0.0, 0.5, 2, &e, NULL), NULL);
	assert_true(e == 0.0);
	check_ok(hl_exchanger_eps_counterflow(0.0, 1.0, &e, NULL), NULL);
	assert_true(e == 0.0);
}

/* Two routes to one area: UA = Q/(F_N·LMTD) (Kern 1950 eq. 7.41 with the
 * per-shell P) against UA = NTU·Cmin from inverting the n-shell ε-NTU
 * relation (Incropera & DeWitt, table 11.3), to 1e-9 relative. */
static void
test_area_two_routes(void **state)
{
	static const double rr[] = { 0.1, 0.5, 0.8, 1.0, 1.25, 2.0, 5.0 };
	static const double q[] = { 0.1, 0.3, 0.5, 0.7, 0.85, 0.95 };
	static const int nn[] = { 1, 2, 3, 4, 6, 10 };
	const double t_hot = 180.0, t_cold = 30.0, c_cold = 2.5;
	size_t i, j, k;
	int checked = 0;
	double r, p, p1, f, lmtd, duty, ua_f, c_hot, cmin, cr, eps, ua_e;

	(void)state;
	for (i = 0; i < sizeof rr / sizeof rr[0]; i++)
	for (j = 0; j < sizeof q / sizeof q[0]; j++)
	for (k = 0; k < sizeof nn / sizeof nn[0]; k++) {
		r = rr[i];
		p = q[j] * (r > 1.0 ? 1.0 / r : 1.0);
		check_ok(hl_exchanger_p_shell(p, r, nn[k], &p1, NULL), NULL);
		/* Too close to P_max the inversion, not the formula, limits. */
		if (p1 > 0.95 * hl_exchanger_pmax(r))
			continue;
		check_ok(hl_exchanger_f_shells(p, r, nn[k], &f, NULL), NULL);
		duty = c_cold * p * (t_hot - t_cold);
		c_hot = c_cold / r;
		check_ok(hl_exchanger_lmtd(t_hot - (t_cold + duty / c_cold),
		    (t_hot - duty / c_hot) - t_cold, &lmtd, NULL), NULL);
		ua_f = duty / (f * lmtd);
		cmin = fmin(c_hot, c_cold);
		cr = cmin / fmax(c_hot, c_cold);
		eps = duty / (cmin * (t_hot - t_cold));
		ua_e = cmin * invert_eps(module_eps_n, eps, cr, nn[k]);
		check_rel(ua_f, ua_e, TOL_AREA, "UA by LMTD-F and by eps-NTU");
		checked++;
	}
	assert_true(checked > 150);
}

/* ---- U ---- */

/* 1/U = 1/h_hot + 1/h_cold (series resistances, thin wall: common practice,
 * no source): 0.5 and 2 give 0.4; equal h give h/2. */
static void
test_u(void **state)
{
	hl_error err;
	double u = -1.0;

	(void)state;
	check_ok(hl_exchanger_u(0.5, 2.0, &u, &err), &err);
	check_rel(u, 0.4, TOL_ROUND, "U of 0.5 and 2");
	check_ok(hl_exchanger_u(1.2, 1.2, &u, &err), &err);
	check_rel(u, 0.6, TOL_ROUND, "U of equal h");
	u = -1.0;
	check_fails(hl_exchanger_u(0.0, 2.0, &u, &err), &err, HL_EINPUT,
	    "must both be positive");
	check_fails(hl_exchanger_u(1.0, -2.0, &u, &err), &err, HL_EINPUT,
	    "must both be positive");
	check_fails(hl_exchanger_u(NAN, 2.0, &u, &err), &err, HL_EINPUT,
	    "must both be positive");
	assert_true(u == -1.0);
}

/* ---- sizing and rating ---- */

static hl_exchanger_spec
spec_of(double hi, double ho, double ci, double co, double duty, double u,
	hl_exchanger_type type)
{
	hl_exchanger_spec s;

	memset(&s, 0, sizeof s);
	s.hot_in = hi;
	s.hot_out = ho;
	s.cold_in = ci;
	s.cold_out = co;
	s.duty = duty;
	s.u = u;
	s.type = type;
	s.fmin = 0.80;
	s.xp = 0.9;
	s.cost_a = 10000.0;
	s.cost_b = 800.0;
	s.cost_c = 0.8;
	return s;
}

/* A counterflow unit: Q = U·A·LMTD (F = 1, one unit); rating it back is
 * test_rating.c's (test_size_then_rate). */
static void
test_size_counterflow(void **state)
{
	hl_exchanger_spec s = spec_of(150.0, 90.0, 30.0, 80.0, 300.0, 0.5,
	    HL_EXCH_COUNTERFLOW);
	hl_exchanger_sizing z;
	hl_error err;
	double lmtd = 10.0 / log(70.0 / 60.0);

	(void)state;
	check_ok(hl_exchanger_size(&s, &z, &err), &err);
	check_rel(z.lmtd, lmtd, TOL_ROUND, "LMTD of 70 and 60 K");
	assert_true(z.f == 1.0);
	assert_int_equal(z.shells, 1);
	check_rel(z.area, 300.0 / (0.5 * lmtd), TOL_ROUND, "area");
	check_rel(z.area_shell, z.area, TOL_ROUND, "area per unit");
	check_rel(z.cost, 10000.0 + 800.0 * pow(z.area, 0.8), TOL_ROUND,
	    "cost a + b·A^c");
}

/* Kern (1950) Example 11.1 temperatures as a shell-and-tube unit: one shell
 * (P below 0.9 P_max, F 0.878 above 0.80), area from Q = U·A·F·LMTD. */
static void
test_size_kern_example(void **state)
{
	hl_exchanger_spec s = spec_of(340.0, 240.0, 200.0, 230.0, 1000.0, 0.4,
	    HL_EXCH_SHELL_TUBE);
	hl_exchanger_sizing z;
	hl_error err;

	(void)state;
	check_ok(hl_exchanger_size(&s, &z, &err), &err);
	assert_int_equal(z.shells, 1);
	check_abs(z.f, 0.878, TOL_PRINT3, "Kern Ex. 11.1 F");
	check_abs(z.lmtd, 69.3, 0.15, "Kern Ex. 11.1 LMTD as printed");
	check_rel(z.area, 1000.0 / (0.4 * z.f * z.lmtd), TOL_ROUND, "area");
}

/* A temperature cross (cold outlet 150 above hot outlet 100) is normal for
 * shell-and-tube and takes several shells (rated back in test_rating.c). */
static void
test_size_cross(void **state)
{
	hl_exchanger_spec s = spec_of(200.0, 100.0, 80.0, 150.0, 700.0, 0.3,
	    HL_EXCH_SHELL_TUBE);
	hl_exchanger_sizing z;
	hl_error err;
	int n;

	(void)state;
	check_ok(hl_exchanger_size(&s, &z, &err), &err);
	check_ok(hl_exchanger_shells(z.p, z.r, 0.80, 0.9, &n, NULL, NULL,
	    &err), &err);
	assert_int_equal(z.shells, n);
	assert_true(z.shells >= 2);
	check_rel(z.area_shell * z.shells, z.area, TOL_ROUND, "area split");
	check_rel(z.cost, z.shells * (10000.0 + 800.0 * pow(z.area_shell,
	    0.8)), TOL_ROUND, "cost per shell");
}

/* A condensing or boiling side gives F = 1 and one shell (common practice,
 * no source); both sides isothermal: LMTD is the one difference. */
static void
test_size_isothermal(void **state)
{
	hl_exchanger_spec s = spec_of(180.0, 180.0, 50.0, 120.0, 500.0, 1.0,
	    HL_EXCH_SHELL_TUBE);
	hl_exchanger_sizing z;
	hl_error err;

	(void)state;
	check_ok(hl_exchanger_size(&s, &z, &err), &err);
	assert_true(z.r == 0.0 && z.f == 1.0);
	assert_int_equal(z.shells, 1);
	s = spec_of(200.0, 150.0, 100.0, 100.0, 500.0, 1.0, HL_EXCH_SHELL_TUBE);
	check_ok(hl_exchanger_size(&s, &z, &err), &err);
	assert_true(z.p == 0.0 && isinf(z.r) && z.f == 1.0);
	assert_int_equal(z.shells, 1);
	s = spec_of(180.0, 180.0, 100.0, 100.0, 400.0, 1.0, HL_EXCH_SHELL_TUBE);
	check_ok(hl_exchanger_size(&s, &z, &err), &err);
	assert_true(z.lmtd == 80.0 && z.f == 1.0);
	check_rel(z.area, 5.0, TOL_ROUND, "400 kW / (1 · 80 K)");
}

/* Every rejected sizing says what is wrong, by status and text, and leaves
 * the result untouched. */
static void
test_size_errors(void **state)
{
	static const struct {
		double hi, ho, ci, co, duty, u;
		hl_status st;
		const char *text;
	} c[] = {
		{ 150, 160, 30, 80, 300, 0.5, HL_EINPUT,
		    "hot outlet 160 °C is above the hot inlet 150 °C" },
		{ 150, 90, 80, 30, 300, 0.5, HL_EINPUT,
		    "cold outlet 30 °C is below the cold inlet 80 °C" },
		{ 150, 90, 30, 150, 300, 0.5, HL_EINPUT,
		    "hot inlet 150 °C is not above the cold outlet 150 °C" },
		{ 150, 30, 40, 80, 300, 0.5, HL_EINPUT,
		    "hot outlet 30 °C is not above the cold inlet 40 °C" },
		{ 150, 90, 30, 80, 0, 0.5, HL_EINPUT, "duty 0 kW" },
		{ 150, 90, 30, 80, -5, 0.5, HL_EINPUT, "not a positive" },
		{ 150, 90, 30, 80, 300, 0, HL_EINPUT, "overall coefficient U" },
		{ 150, 90, 30, NAN, 300, 0.5, HL_EINPUT, "not a finite number" },
		{ 100, 20.001, 20, 99.999, 300, 0.5, HL_ENOSOLUTION,
		    "more than 50 shells" },
	};
	hl_exchanger_spec s;
	hl_exchanger_sizing z, before;
	hl_error err;
	size_t i;

	(void)state;
	memset(&before, 0x5a, sizeof before);
	for (i = 0; i < sizeof c / sizeof c[0]; i++) {
		s = spec_of(c[i].hi, c[i].ho, c[i].ci, c[i].co, c[i].duty,
		    c[i].u, HL_EXCH_SHELL_TUBE);
		memcpy(&z, &before, sizeof z);
		hl_error_clear(&err);
		check_fails(hl_exchanger_size(&s, &z, &err), &err, c[i].st,
		    c[i].text);
		assert_memory_equal(&z, &before, sizeof z);
		assert_int_equal(hl_exchanger_size(&s, &z, NULL), c[i].st);
	}
	s = spec_of(150, 90, 30, 80, 300, 0.5, HL_EXCH_SHELL_TUBE);
	s.fmin = 1.0;
	check_fails(hl_exchanger_size(&s, &z, &err), &err, HL_EINPUT,
	    "F floor");
	s = spec_of(150, 90, 30, 80, 300, 0.5, HL_EXCH_SHELL_TUBE);
	s.xp = 0.0;
	check_fails(hl_exchanger_size(&s, &z, &err), &err, HL_EINPUT, "Xp");
	s = spec_of(150, 90, 30, 80, 300, 0.5, HL_EXCH_SHELL_TUBE);
	s.cost_c = 0.0;
	check_fails(hl_exchanger_size(&s, &z, &err), &err, HL_EINPUT,
	    "cost law");
	s = spec_of(150, 90, 30, 80, 300, 0.5, (hl_exchanger_type)7);
	check_fails(hl_exchanger_size(&s, &z, &err), &err, HL_EINPUT,
	    "unknown exchanger type");
	/* The counterflow unit ignores the shell rules, not the cost law. */
	s = spec_of(100, 20.001, 20, 99.999, 300, 0.5, HL_EXCH_COUNTERFLOW);
	s.fmin = 1.0;
	check_ok(hl_exchanger_size(&s, &z, &err), &err);
}

/* Domain errors of the building blocks, by status and text. */
static void
test_function_errors(void **state)
{
	hl_error err;
	double v = -1.0, w = -1.0;

	(void)state;
	check_fails(hl_exchanger_lmtd(0.0, 5.0, &v, &err), &err, HL_EINPUT,
	    "must both be positive");
	check_fails(hl_exchanger_lmtd(5.0, -1.0, &v, &err), &err, HL_EINPUT,
	    "must both be positive");
	check_fails(hl_exchanger_lmtd(NAN, 5.0, &v, &err), &err, HL_EINPUT,
	    "must both be positive");
	check_fails(hl_exchanger_lmtd(HUGE_VAL, 5.0, &v, &err), &err,
	    HL_EINPUT, "must both be positive");
	check_fails(hl_exchanger_pr(150, 160, 30, 80, &v, &w, &err), &err,
	    HL_EINPUT, "hot outlet");
	check_fails(hl_exchanger_f(1.0, 0.5, &v, &err), &err, HL_EINPUT,
	    "outside 0 <= P < 1");
	check_fails(hl_exchanger_f(-0.1, 0.5, &v, &err), &err, HL_EINPUT,
	    "outside 0 <= P < 1");
	check_fails(hl_exchanger_f(0.3, -1.0, &v, &err), &err, HL_EINPUT,
	    "R >= 0");
	check_fails(hl_exchanger_f(0.5, 2.0, &v, &err), &err, HL_EINPUT,
	    "P·R >= 1");
	check_fails(hl_exchanger_p_shell(0.5, 1.0, 0, &v, &err), &err,
	    HL_EINPUT, "at least 1");
	check_fails(hl_exchanger_p_shell(0.0, HUGE_VAL, 2, &v, &err), &err,
	    HL_EINPUT, "R is infinite");
	check_fails(hl_exchanger_f_shells(0.9, 1.0, 1, &v, &err), &err,
	    HL_ENOSOLUTION, "use more shells");
	check_fails(hl_exchanger_eps_shells(-1.0, 0.5, 1, &v, &err), &err,
	    HL_EINPUT, "NTU >= 0");
	check_fails(hl_exchanger_eps_shells(1.0, 1.5, 1, &v, &err), &err,
	    HL_EINPUT, "0 <= Cr <= 1");
	check_fails(hl_exchanger_eps_shells(1.0, 0.5, 0, &v, &err), &err,
	    HL_EINPUT, "at least 1");
	check_fails(hl_exchanger_eps_counterflow(1.0, NAN, &v, &err), &err,
	    HL_EINPUT, "0 <= Cr <= 1");
	assert_true(v == -1.0 && w == -1.0);
}

/* The spec takes its rules and cost law from the case settings. */
static void
test_spec_settings(void **state)
{
	hl_settings set;
	hl_exchanger_spec s = spec_of(150, 90, 30, 80, 300, 0.5,
	    HL_EXCH_SHELL_TUBE);

	(void)state;
	memset(&set, 0, sizeof set);
	hl_settings_default_laws(&set);
	set.exchanger = HL_EXCH_COUNTERFLOW;
	set.fmin = 0.75;
	set.xp = 0.85;
	set.cost_a = 1.0;
	set.cost_b = 2.0;
	set.cost_c = 0.6;
	hl_exchanger_spec_settings(&s, &set);
	assert_int_equal(s.type, HL_EXCH_COUNTERFLOW);
	assert_true(s.fmin == 0.75 && s.xp == 0.85);
	assert_true(s.cost_a == 1.0 && s.cost_b == 2.0 && s.cost_c == 0.6);
	assert_true(s.hot_in == 150.0 && s.duty == 300.0 && s.u == 0.5);
}

/* Crossflow, both fluids unmixed, by an independent route: the two
 * temperature fields marched over an n × n grid (trapezoidal rule per
 * cell), Cmin along rows [derived; converges as 1/n²]. */
static double
crossflow_grid(double ntu, double cr, int n)
{
	static double tb[2000];
	double sum = 0.0, na = ntu / n, nb = ntu * cr / n;
	int i, j;

	for (j = 0; j < n; j++)
		tb[j] = 0.0;
	for (i = 0; i < n; i++) {
		double ta = 1.0;

		for (j = 0; j < n; j++) {
			double k = (ta - tb[j]) / (1.0 + 0.5 * na + 0.5 * nb);

			ta -= na * k;
			tb[j] += nb * k;
		}
		sum += ta;
	}
	return 1.0 - sum / n;
}

static void
test_crossflow_eps(void **state)
{
	static const double pts[][2] = {
		{ 1.0, 1.0 }, { 2.5, 0.6 }, { 5.0, 1.0 }, { 2.0, 0.5 },
		{ 0.3, 0.1 }, { 8.0, 0.25 },
	};
	double e;
	size_t i;

	(void)state;
	for (i = 0; i < sizeof pts / sizeof pts[0]; i++) {
		assert_int_equal(hl_exchanger_eps_crossflow(pts[i][0],
		    pts[i][1], &e, NULL), HL_OK);
		check_abs(e, crossflow_grid(pts[i][0], pts[i][1], 1500), 2e-5,
		    "crossflow ε against the grid solution");
	}
	/* Kays & London, Compact Heat Exchangers (3rd ed. 1984), crossflow
	 * both unmixed, Cr = 1, NTU = 1: ε = 0.476 (from memory). */
	hl_exchanger_eps_crossflow(1.0, 1.0, &e, NULL);
	check_abs(e, 0.476, 6e-4, "K&L Cr 1 NTU 1");
	/* Nellis & Klein, Heat Transfer (2009), crossflow both unmixed
	 * examples: NTU 2.5, Cr 0.6 gives ε 0.7632 and ε 0.61 at Cr 0.6
	 * needs NTU 1.341 [published, by the approximate formula of
	 * Incropera & DeWitt, table 11.3, which the exact series lies within
	 * about 1 % of]. */
	hl_exchanger_eps_crossflow(2.5, 0.6, &e, NULL);
	check_rel(e, 0.7632, 0.012, "Nellis & Klein NTU 2.5 Cr 0.6");
	hl_exchanger_eps_crossflow(1.341, 0.6, &e, NULL);
	check_abs(e, 0.61, 1e-3, "Nellis & Klein ε 0.61 at NTU 1.341");
	/* Cr = 0: 1 − e^(−NTU), as for every arrangement (Incropera &
	 * DeWitt, eq. 11.35a, from memory). */
	hl_exchanger_eps_crossflow(2.0, 0.0, &e, NULL);
	check_rel(e, -expm1(-2.0), 1e-14, "Cr 0");
	assert_int_equal(hl_exchanger_eps_crossflow(-1.0, 0.5, &e, NULL),
	    HL_EINPUT);
}

/* F by its definition: the crossflow unit of NTU_cf/F reaches the same P
 * [derived]; F falls with P and is 1 at P → 0 (common practice, no
 * source). */
static void
test_crossflow_f(void **state)
{
	static const double pr[][2] = {
		{ 0.5, 1.0 }, { 0.4, 2.0 }, { 0.2, 0.5 }, { 0.6, 0.3 },
	};
	double f, e, prev = 1.0;
	size_t i;
	int n;

	(void)state;
	for (i = 0; i < sizeof pr / sizeof pr[0]; i++) {
		double p = pr[i][0], r = pr[i][1];
		double ntu_c, cr = r <= 1.0 ? r : 1.0 / r;

		assert_int_equal(hl_exchanger_f_crossflow(p, r, &f, NULL),
		    HL_OK);
		ntu_c = hl_exchanger_ntu_counterflow(p, r) / f;
		/* referred to Cmin: the cold side when r <= 1 */
		e = crossflow_grid(r <= 1.0 ? ntu_c : ntu_c * r, cr, 1500);
		check_abs(r <= 1.0 ? e : e / r, p, 3e-5, "F round trip");
	}
	for (i = 1; i <= 8; i++) {
		hl_exchanger_f_crossflow(0.1 * (double)i, 1.0, &f, NULL);
		assert_true(f <= prev && f > 0.0);
		prev = f;
	}
	hl_exchanger_f_crossflow(1e-9, 1.0, &f, NULL);
	check_abs(f, 1.0, 1e-6, "F at P -> 0");
	/* A close approach needs sections in series; each raises F. */
	assert_int_equal(hl_exchanger_sections_crossflow(0.8, 1.0, 0.8, &n,
	    &f, NULL), HL_OK);
	assert_true(n > 1 && f >= 0.8);
}

static hl_exchanger_spec
typed(hl_exchanger_type t, double hi, double ho, double ci, double co,
      double duty, double u)
{
	hl_settings set;
	hl_exchanger_spec s;

	hl_settings_default(&set);
	memset(&s, 0, sizeof s);
	hl_exchanger_spec_type(&s, &set, t);
	s.hot_in = hi;
	s.hot_out = ho;
	s.cold_in = ci;
	s.cold_out = co;
	s.duty = duty;
	s.u = u;
	return s;
}

/* Fired heater: no area, cost by duty. Towler & Sinnott, Chemical
 * Engineering Design (2nd ed. 2012), table 6.6, cylindrical furnace:
 * cost = 80000 + 109000·Q^0.8, Q in MW, 0.2 to 60 MW (from memory). */
static void
test_fired_heater(void **state)
{
	hl_exchanger_spec s = typed(HL_EXCH_FIRED_HEATER, 1000, 250, 200,
	    360, 10000.0, NAN);
	hl_exchanger_sizing z;

	(void)state;
	s.cost_a = 80000.0;
	s.cost_b = 109000.0;
	s.cost_c = 0.8;
	assert_int_equal(hl_exchanger_size(&s, &z, NULL), HL_OK);
	check_rel(z.cost, 80000.0 + 109000.0 * pow(10.0, 0.8), 1e-12,
	    "Towler & Sinnott furnace at 10 MW");
	assert_true(z.area == 0.0 && z.f == 1.0);
	assert_int_equal(z.shells, 1);
	assert_int_equal(z.parallel, 1);
	check_rel(z.x, 10.0, 1e-15, "X = duty in MW");
	/* Beyond the largest heater, heaters in parallel share the duty. */
	s.largest = 6.0;
	assert_int_equal(hl_exchanger_size(&s, &z, NULL), HL_OK);
	assert_int_equal(z.parallel, 2);
	check_rel(z.cost, 2.0 * (80000.0 + 109000.0 * pow(5.0, 0.8)), 1e-12,
	    "two heaters of 5 MW");
	assert_int_equal(z.warn, 0);
}

/* Each type its own law; shell-and-tube and counterflow take the process
 * law; a benchmark's 1000·A^0.6 (process) beside 1200·A^0.6 (heaters) is a
 * type law plus a utility's own (the network applies that one). */
static void
test_type_laws(void **state)
{
	hl_settings set;
	hl_exchanger_spec s;
	hl_exchanger_sizing z, zc;

	(void)state;
	hl_settings_default(&set);
	hl_exchanger_spec_type(&s, &set, HL_EXCH_SHELL_TUBE);
	assert_true(s.cost_a == set.cost_a && s.cost_b == set.cost_b);
	set.law[HL_EXCH_PLATE].a = 1.0;
	set.law[HL_EXCH_PLATE].b = 2.0;
	set.law[HL_EXCH_PLATE].c = 0.5;
	set.law[HL_EXCH_PLATE].given = HL_LAW_COST;
	hl_exchanger_spec_type(&s, &set, HL_EXCH_PLATE);
	assert_true(s.cost_a == 1.0 && s.cost_b == 2.0 && s.cost_c == 0.5);
	assert_int_equal(hl_exchanger_law_illustrative(&set, HL_EXCH_PLATE), 0);
	assert_int_equal(hl_exchanger_law_illustrative(&set,
	    HL_EXCH_AIR_COOLER), 1);
	/* Plate: counterflow, F = 1: the counterflow area, its own cost. */
	s = typed(HL_EXCH_PLATE, 150, 90, 30, 80, 300, 0.5);
	assert_int_equal(hl_exchanger_size(&s, &z, NULL), HL_OK);
	s.type = HL_EXCH_COUNTERFLOW;
	assert_int_equal(hl_exchanger_size(&s, &zc, NULL), HL_OK);
	check_rel(z.area, zc.area, 1e-15, "plate = counterflow area");
	assert_true(z.f == 1.0);
	s = typed(HL_EXCH_SHELL_TUBE, 150, 90, 30, 80, 300, 0.5);
	s.cost_a = 0.0;
	s.cost_b = 1000.0;
	s.cost_c = 0.6;
	assert_int_equal(hl_exchanger_size(&s, &z, NULL), HL_OK);
	check_rel(z.cost, z.shells * 1000.0 * pow(z.area_shell, 0.6), 1e-13,
	    "1000·A^0.6 per shell");
}

/* The largest shell: parallel trains at the same F; hairpins in series. */
static void
test_parallel(void **state)
{
	hl_exchanger_spec s = typed(HL_EXCH_SHELL_TUBE, 150, 140, 30, 40,
	    25000.0, 0.1);
	hl_exchanger_sizing z;

	(void)state;
	assert_int_equal(hl_exchanger_size(&s, &z, NULL), HL_OK);
	/* 25000/(0.1·F·110) ≈ 2276 m², one shell in series, 1000 m² max */
	check_rel(z.area, 25000.0 / (0.1 * z.f * 110.0), 1e-12, "area");
	assert_int_equal(z.shells, 1);
	assert_int_equal(z.parallel, 3);
	check_rel(z.area_shell, z.area / 3.0, 1e-15, "area per shell");
	check_rel(z.cost, 3.0 * (10000.0 + 800.0 * pow(z.area / 3.0, 0.8)),
	    1e-12, "three shells");
	s = typed(HL_EXCH_DOUBLE_PIPE, 150, 90, 30, 80, 300, 0.5);
	assert_int_equal(hl_exchanger_size(&s, &z, NULL), HL_OK);
	assert_int_equal(z.parallel, 1);
	assert_int_equal(z.shells, (int)ceil(z.area / 50.0));
	s = typed(HL_EXCH_AIR_COOLER, 150, 60, 30, 45, 3000, 0.05);
	assert_int_equal(hl_exchanger_size(&s, &z, NULL), HL_OK);
	assert_true(z.f >= 0.8 && z.f < 1.0);
	check_rel(z.area, 3000.0 / (0.05 * z.f * z.lmtd), 1e-12, "AC area");
}

/* A U typed in W/(m²·K) and a tiny shell are warned, not priced blindly. */
static void
test_implausible(void **state)
{
	hl_exchanger_spec s = typed(HL_EXCH_SHELL_TUBE, 150, 90, 30, 80, 20,
	    500.0);
	hl_exchanger_sizing z;
	char why[300];

	(void)state;
	assert_int_equal(hl_exchanger_size(&s, &z, NULL), HL_OK);
	assert_true(z.warn & HL_EXCH_WARN_U_HIGH);
	assert_true(z.warn & HL_EXCH_WARN_SMALL);
	hl_exchanger_warning(&s, &z, why, sizeof why);
	assert_non_null(strstr(why, "above the plausible"));
	assert_non_null(strstr(why, "below the smallest"));
	s.u = 0.5;
	s.duty = 2000;
	assert_int_equal(hl_exchanger_size(&s, &z, NULL), HL_OK);
	assert_int_equal(z.warn, 0);
}

/* Exactly n shells in series, as an existing unit has: the F of n shells
 * (Kern 1950, eq. 7.41 at the per-shell P), or no solution when n cannot
 * do the duty. */
static void
test_series_given(void **state)
{
	hl_exchanger_spec s = typed(HL_EXCH_SHELL_TUBE, 150, 90, 30, 110,
	    480, 0.5);
	hl_exchanger_sizing z;
	double f3;

	(void)state;
	s.series = 3;
	assert_int_equal(hl_exchanger_size(&s, &z, NULL), HL_OK);
	assert_int_equal(z.shells, 3);
	assert_int_equal(hl_exchanger_f_shells(z.p, z.r, 3, &f3, NULL), HL_OK);
	check_rel(z.f, f3, 1e-15, "F of the given shells");
	s.series = 1;
	assert_int_equal(hl_exchanger_size(&s, &z, NULL), HL_ENOSOLUTION);
	s.series = -1;
	assert_int_equal(hl_exchanger_size(&s, &z, NULL), HL_EINPUT);
}

int
main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_lmtd_kern_example),
		cmocka_unit_test(test_lmtd_bounds),
		cmocka_unit_test(test_lmtd_near_equal),
		cmocka_unit_test(test_lmtd_series),
		cmocka_unit_test(test_f_kern_example),
		cmocka_unit_test(test_f_matches_eq741),
		cmocka_unit_test(test_f_limits),
		cmocka_unit_test(test_f_reciprocity),
		cmocka_unit_test(test_pmax),
		cmocka_unit_test(test_f_r1_continuity),
		cmocka_unit_test(test_p_shell_formula),
		cmocka_unit_test(test_shells_reference),
		cmocka_unit_test(test_shells_minimal),
		cmocka_unit_test(test_shells_limits),
		cmocka_unit_test(test_eps_worked_value),
		cmocka_unit_test(test_eps_table),
		cmocka_unit_test(test_area_two_routes),
		cmocka_unit_test(test_u),
		cmocka_unit_test(test_size_counterflow),
		cmocka_unit_test(test_size_kern_example),
		cmocka_unit_test(test_size_cross),
		cmocka_unit_test(test_size_isothermal),
		cmocka_unit_test(test_size_errors),
		cmocka_unit_test(test_function_errors),
		cmocka_unit_test(test_spec_settings),
		cmocka_unit_test(test_crossflow_eps),
		cmocka_unit_test(test_crossflow_f),
		cmocka_unit_test(test_fired_heater),
		cmocka_unit_test(test_type_laws),
		cmocka_unit_test(test_parallel),
		cmocka_unit_test(test_implausible),
		cmocka_unit_test(test_series_given),
	};

	return cmocka_run_group_tests(tests, NULL, NULL);
}
