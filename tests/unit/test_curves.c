/* test_curves.c - composite, grand composite and balanced curves against
 * hand values and the relations between them that every correct set has. */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <cmocka.h>

#include "cascade.h"
#include "curves.h"
#include "gen.h"
#include "near.h"
#include "utility_lp.h"

#define REL 1e-9

/* The four-stream problems and their sources: tests/unit/gen.c. */
static hl_curves *
curves_of(const hl_case *c, double dt, hl_cascade **cas, hl_utility_lp **lp)
{
	hl_curves *cv;

	assert_int_equal(hl_cascade_compute(c, dt, cas, NULL), HL_OK);
	*lp = NULL;
	if (c->nutil > 0)
		assert_int_equal(hl_utility_lp_solve(c, dt, NULL, lp, NULL),
				 HL_OK);
	assert_int_equal(hl_curves_compute(c, *cas, *lp, &cv, NULL), HL_OK);
	return cv;
}

static double
first_h(const hl_curve *cv)
{
	return cv->h[0];
}

static double
last_h(const hl_curve *cv)
{
	return cv->h[cv->n - 1];
}

/* Kemp's composites, by hand: the hot curve runs 0 -> 510 kW (330 + 180),
 * the cold one from QCmin = 60 to 60 + 470 = 530 kW (QHmin 20 beyond); at
 * the pinch both stand at 180 kW (hot 90 °C: 3·30 + 1.5·60; cold 80 °C:
 * 60 + 2·60), so the overlap, 450 kW, is the heat recovered. */
static void
test_kemp_composites(void **state)
{
	hl_case *c = hl_gen_kemp4();
	hl_cascade *cas;
	hl_utility_lp *lp;
	hl_curves *cv = curves_of(c, 10.0, &cas, &lp);

	(void)state;
	assert_rel(first_h(&cv->hot), 0.0, REL);
	assert_rel(last_h(&cv->hot), 510.0, REL);
	assert_rel(first_h(&cv->cold), 60.0, REL);
	assert_rel(last_h(&cv->cold), 530.0, REL);
	assert_rel(cv->recovery, 450.0, REL);
	assert_rel(hl_curve_heat_at(&cv->hot, 90.0), 180.0, REL);
	assert_rel(hl_curve_heat_at(&cv->cold, 80.0), 180.0, REL);
	assert_rel(cv->hot.t[0], 30.0, REL);
	assert_rel(cv->hot.t[cv->hot.n - 1], 170.0, REL);
	assert_rel(cv->cold.t[cv->cold.n - 1], 140.0, REL);
	/* On shifted temperatures the curves touch at 85 °C. */
	assert_rel(hl_curve_heat_at(&cv->shifted_hot, 85.0), 180.0, REL);
	assert_rel(hl_curve_heat_at(&cv->shifted_cold, 85.0), 180.0, REL);
	/* No utilities: no utility curves, no balanced curves. */
	assert_int_equal(cv->bal_hot.n, 0);
	assert_int_equal(cv->hot_util.n, 0);
	/* The grand composite is the cascade, top first. */
	assert_int_equal(cv->grand.n, 6);
	assert_rel(cv->grand.h[0], 20.0, REL);
	assert_rel(cv->grand.t[3], 85.0, REL);
	assert_rel(cv->grand.h[3], 0.0, REL);
	hl_curves_free(cv);
	hl_cascade_free(cas);
	hl_case_free(c);
}

/* The grand composite is the horizontal distance between the shifted
 * composites at every temperature (Linnhoff et al. 1982; Kemp 2007,
 * ch. 2, from memory), checked at every cascade boundary of random
 * problems: two independent routes to the same numbers. */
static void
test_grand_is_gap(void **state)
{
	hl_rng r;
	int n;

	(void)state;
	hl_rng_seed(&r, 21);
	for (n = 0; n < 200; n++) {
		hl_case *c = hl_gen_case(&r, 1 + n % 6, 1 + n % 5);
		hl_cascade *cas;
		hl_utility_lp *lp;
		hl_curves *cv = curves_of(c, floor(hl_rng_uniform(&r, 0, 30)),
					  &cas, &lp);
		double tol = 1e-9 * (cas->hot_total + cas->cold_total + 1);
		size_t k;

		for (k = 0; k < cas->nb; k++) {
			double t = cas->t[k];
			double gap = hl_curve_heat_at(&cv->shifted_cold, t) -
				     hl_curve_heat_at(&cv->shifted_hot, t);

			/* Below (above) a curve's range its heat is its first
			 * (last) point: the formula still holds there. */
			if (fabs(gap - cas->flow[k]) > tol) {
				print_error("T %g: gap %.12g, flow %.12g\n", t,
					    gap, cas->flow[k]);
				fail();
			}
		}
		/* Overlap = heat recovery. */
		assert_true(fabs(last_h(&cv->hot) - first_h(&cv->cold) -
				 cv->recovery) <= tol);
		hl_curves_free(cv);
		hl_cascade_free(cas);
		hl_case_free(c);
	}
}

/* Lowest temperature at which a rising curve reaches heat h. */
static double
t_low(const hl_curve *cv, double h)
{
	size_t i;

	for (i = 0; i < cv->n; i++)
		if (cv->h[i] >= h)
			break;
	if (i == 0)
		return cv->t[0];
	if (i == cv->n)
		return cv->t[cv->n - 1];
	return cv->t[i - 1] + (cv->t[i] - cv->t[i - 1]) *
	       (h - cv->h[i - 1]) / (cv->h[i] - cv->h[i - 1]);
}

/* Highest temperature at which a rising curve still has heat h. */
static double
t_high(const hl_curve *cv, double h)
{
	size_t i;

	for (i = cv->n; i-- > 0;)
		if (cv->h[i] <= h)
			break;
	if (i == (size_t)-1)
		return cv->t[0];
	if (i + 1 == cv->n)
		return cv->t[cv->n - 1];
	return cv->t[i] + (cv->t[i + 1] - cv->t[i]) *
	       (h - cv->h[i]) / (cv->h[i + 1] - cv->h[i]);
}

/* Balanced curves: both span the same heat, and the hot one lies at least
 * ΔTmin above the cold one everywhere (the LP's feasibility in the real
 * temperatures; common practice, no source). */
static void
check_balanced(const hl_curves *cv, double dt, double tol)
{
	size_t i;

	assert_true(fabs(last_h(&cv->bal_hot) - last_h(&cv->bal_cold)) <= tol);
	assert_true(fabs(first_h(&cv->bal_hot)) <= tol);
	for (i = 0; i < cv->bal_cold.n; i++) {
		double h = cv->bal_cold.h[i];

		assert_true(t_low(&cv->bal_hot, h + tol) - cv->bal_cold.t[i] >=
			    dt - 1e-6);
	}
	for (i = 0; i < cv->bal_hot.n; i++) {
		double h = cv->bal_hot.h[i];

		assert_true(cv->bal_hot.t[i] - t_high(&cv->bal_cold, h - tol) >=
			    dt - 1e-6);
	}
}

/* Smith's problem with HP steam and a cheaper MP level at 200 °C: MP takes
 * 3000 kW (see test_utility_lp.c). The hot-utility curve touches the grand
 * composite at 195 °C shifted and ends at QHmin at the top; the cold one
 * gives all 10000 kW at its level. */
static void
test_smith_levels(void **state)
{
	hl_case *c = hl_gen_smith4();
	hl_cascade *cas;
	hl_utility_lp *lp;
	hl_curves *cv;
	size_t k;

	(void)state;
	hl_gen_add_utility(c, "HP steam", HL_HOT, 270, 270, 40, NAN);
	hl_gen_add_utility(c, "MP steam", HL_HOT, 200, 200, 25, NAN);
	hl_gen_add_utility(c, "cooling water", HL_COLD, 15, 25, 2, NAN);
	cv = curves_of(c, 10.0, &cas, &lp);
	assert_rel(hl_curve_heat_at(&cv->hot_util, 195.0), 0.0, REL);
	assert_rel(hl_curve_heat_at(&cv->hot_util, 200.0), 3000.0, REL);
	assert_rel(last_h(&cv->hot_util), 7500.0, REL);
	assert_rel(cv->hot_util.t[cv->hot_util.n - 1], 265.0, REL);
	/* Left of the grand composite above the pinch. */
	for (k = 0; k < cas->nb && cas->t[k] > 145.0; k++)
		assert_true(hl_curve_heat_at(&cv->hot_util, cas->t[k]) <=
			    cas->flow[k] + 1e-6);
	/* Cold utility curve, top first: nothing taken above its range (30 °C
	 * shifted), all 10000 kW at its bottom (20 °C). */
	assert_rel(cv->cold_util.h[0], 0.0, REL);
	assert_rel(cv->cold_util.t[0], 30.0, REL);
	assert_rel(last_h(&cv->cold_util), 10000.0, REL);
	assert_rel(cv->cold_util.t[cv->cold_util.n - 1], 20.0, REL);
	/* Labels sit in the middle of each level. */
	assert_int_equal(cv->nlevel, 3);
	assert_int_equal(cv->level[0].util, 0);
	assert_rel(cv->level[0].h, 3000.0 + 2250.0, REL);
	assert_rel(cv->level[1].h, 1500.0, REL);
	assert_rel(cv->level[1].t, 195.0, REL);
	assert_rel(cv->level[2].h, 5000.0, REL);
	check_balanced(cv, 10.0, 1e-6);
	/* Σ hot duty 31500 + 30000 kW plus 7500 kW of steam. */
	assert_rel(last_h(&cv->bal_hot), 61500.0 + 7500.0, REL);
	hl_curves_free(cv);
	hl_utility_lp_free(lp);
	hl_cascade_free(cas);
	hl_case_free(c);
}

static void
test_random_balanced(void **state)
{
	hl_rng r;
	int n;

	(void)state;
	hl_rng_seed(&r, 22);
	for (n = 0; n < 100; n++) {
		hl_case *c = hl_gen_case(&r, 1 + n % 5, 1 + n % 4);
		double dt = floor(hl_rng_uniform(&r, 5, 30)), mid;
		hl_cascade *cas;
		hl_utility_lp *lp;
		hl_curves *cv;

		hl_gen_add_utility(c, "top", HL_HOT, 400, 380, 40, NAN);
		mid = floor(hl_rng_uniform(&r, 40, 300));
		hl_gen_add_utility(c, "mid", HL_HOT, mid, mid, 10, NAN);
		hl_gen_add_utility(c, "bottom", HL_COLD, -50, -50, 12, NAN);
		hl_gen_add_utility(c, "water", HL_COLD, 20, 35, 1, NAN);
		cv = curves_of(c, dt, &cas, &lp);
		check_balanced(cv, dt, 1e-7 * (cas->hot_total + 1));
		hl_curves_free(cv);
		hl_utility_lp_free(lp);
		hl_cascade_free(cas);
		hl_case_free(c);
	}
}

/* A step for an isothermal piece, a slope for the others. */
static void
test_composite_pieces(void **state)
{
	hl_curve_piece p[] = {
		{ 100, 100, 50 },  /* condensing: 50 kW at 100 °C */
		{ 120, 80, 40 },   /* 1 kW/K */
		{ 60, 40, 0 },     /* carries nothing: ignored */
	};
	hl_curve cv;

	(void)state;
	assert_int_equal(hl_curves_composite(p, 3, 5.0, &cv, NULL), HL_OK);
	assert_int_equal(cv.n, 4);
	assert_rel(cv.h[0], 5.0, REL);
	assert_rel(cv.t[0], 80.0, REL);
	assert_rel(cv.h[1], 25.0, REL);
	assert_rel(cv.t[1], 100.0, REL);
	assert_rel(cv.h[2], 75.0, REL);
	assert_rel(cv.t[2], 100.0, REL);
	assert_rel(cv.h[3], 95.0, REL);
	assert_rel(cv.t[3], 120.0, REL);
	assert_rel(hl_curve_heat_at(&cv, 100.0), 25.0, REL);
	assert_rel(hl_curve_heat_at(&cv, 110.0), 85.0, REL);
	free(cv.h);
	free(cv.t);
	assert_int_equal(hl_curves_composite(p, 0, 0.0, &cv, NULL), HL_OK);
	assert_int_equal(cv.n, 0);
	free(cv.h);
	free(cv.t);
}

int
main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_kemp_composites),
		cmocka_unit_test(test_grand_is_gap),
		cmocka_unit_test(test_smith_levels),
		cmocka_unit_test(test_random_balanced),
		cmocka_unit_test(test_composite_pieces),
	};

	return cmocka_run_group_tests(tests, NULL, NULL);
}
