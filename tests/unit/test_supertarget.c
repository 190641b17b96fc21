/* test_supertarget.c - area, units, shells and cost targets. */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>
#include <string.h>
#include <cmocka.h>

#include "cascade.h"
#include "exchanger.h"
#include "gen.h"
#include "supertarget.h"

static void
add_h(hl_case *c, const char *name, double ts, double tt, double cp, double h)
{
	hl_gen_add(c, name, ts, tt, cp);
	c->stream[c->nstream - 1].seg[0].h = h;
}

static void
targets(const hl_case *c, double dt, const double *load, hl_supertargets *st)
{
	hl_cascade *cas;

	assert_int_equal(hl_cascade_compute(c, dt, &cas, NULL), HL_OK);
	assert_int_equal(hl_supertarget_compute(c, cas, load, NULL, 0, st,
						NULL), HL_OK);
	hl_cascade_free(cas);
}

/* Hand checks of the vertical-transfer formula, doc/references.md [derived]:
 * hot 100->50, cold 20->70, both CP 1 kW/K and h 1 kW/(m²K): 3.333 m²;
 * cold 20->60 CP 1.25 instead: 2.877 m². Two streams in counterflow with
 * uniform h: the target equals Q/(U·LMTD) (common practice, no source). */
static void
test_two_streams(void **state)
{
	hl_case *c = hl_case_create();
	hl_supertargets st;
	double lmtd;

	(void)state;
	add_h(c, "H", 100, 50, 1.0, 1.0);
	add_h(c, "C", 20, 70, 1.0, 1.0);
	targets(c, 10.0, NULL, &st);
	assert_true(fabs(st.area - 50.0 / 15.0) < 1e-9);
	assert_int_equal(st.units, 1);
	hl_case_free(c);

	c = hl_case_create();
	add_h(c, "H", 100, 50, 1.0, 1.0);
	add_h(c, "C", 20, 60, 1.25, 1.0);
	targets(c, 10.0, NULL, &st);
	assert_int_equal(hl_exchanger_lmtd(40.0, 30.0, &lmtd, NULL), HL_OK);
	assert_true(fabs(st.area - 50.0 / (0.5 * lmtd)) < 1e-9);
	assert_true(fabs(st.area - 2.877) < 5e-4);
	/* One 1-2 shell at P = 40/80 = 0.5, R = 1.25 (F from Bowman et al.
	 * 1940 through the exchanger module): the shell-and-tube target is
	 * the counterflow area over F. */
	{
		double f;
		int n;

		assert_int_equal(hl_exchanger_shells(0.5, 1.25, 0.0, 0.9, &n,
						     &f, NULL, NULL), HL_OK);
		assert_true(fabs(st.area_st - st.area / f) < 1e-9 * st.area);
	}
	hl_case_free(c);
}

/* Capital recovery factor: i = 10 %, n = 10 years gives 0.16275 (standard
 * annuity formula i(1+i)^n/((1+i)^n − 1)). */
static void
test_crf(void **state)
{
	(void)state;
	assert_true(fabs(hl_supertarget_crf(0.10, 10) - 0.16275) < 5e-6);
	assert_true(fabs(hl_supertarget_crf(0.0, 8) - 0.125) < 1e-15);
}

/* Units target of the four-stream problem (Linnhoff et al. 1982; Kemp 2007,
 * ch. 2): N − 1 per side of the pinch gives 4 above (4 streams + hot
 * utility) and 3 below (3 streams + cold utility), 7 in all (doc/references.md
 * [derived]); the MILP finds 6 because of an independent subset. */
static void
test_units_four_stream(void **state)
{
	hl_case *c = hl_case_create();
	hl_supertargets st;

	(void)state;
	hl_gen_add(c, "C1", 20, 135, 2.0);
	hl_gen_add(c, "H1", 170, 60, 3.0);
	hl_gen_add(c, "C2", 80, 140, 4.0);
	hl_gen_add(c, "H2", 150, 30, 1.5);
	targets(c, 10.0, NULL, &st);
	assert_int_equal(st.units, 7);
	assert_int_equal(st.nsub, 2);
	assert_true(st.shells >= st.units);
	assert_true(st.area_st >= st.area);
	hl_case_free(c);
}

/* With utilities the curves are balanced: a hot utility at 200 °C and cold
 * water 10->20 °C carry the targets, and the energy cost is load × price ×
 * hours / 1000 (price per MWh). */
static void
test_balanced_cost(void **state)
{
	hl_case *c = hl_case_create();
	hl_utility u;
	hl_supertargets st;
	double load[2] = { 20.0, 60.0 };

	(void)state;
	hl_gen_add(c, "C1", 20, 135, 2.0);
	hl_gen_add(c, "H1", 170, 60, 3.0);
	hl_gen_add(c, "C2", 80, 140, 4.0);
	hl_gen_add(c, "H2", 150, 30, 1.5);
	memset(&u, 0, sizeof u);
	u.name = "steam";
	u.kind = HL_HOT;
	u.supply = u.target = 200;
	u.price = 30;
	u.h = NAN;
	u.max_load = NAN;
	u.dt_contrib = NAN;
	hl_case_add_utility(c, &u, NULL);
	u.name = "water";
	u.kind = HL_COLD;
	u.supply = 10;
	u.target = 20;
	u.price = 5;
	hl_case_add_utility(c, &u, NULL);
	targets(c, 10.0, load, &st);
	assert_int_equal(st.balanced, 1);
	assert_true(fabs(st.energy_cost - (20 * 30 + 60 * 5) * 8000 / 1000.0) <
		    1e-9);
	assert_int_equal(st.units, 7);
	/* Balanced curves include the utility exchangers' area too. */
	{
		hl_supertargets bare;

		targets(c, 10.0, NULL, &bare);
		assert_true(st.area > bare.area);
	}
	hl_case_free(c);
}

/* The area target grows as ΔTmin shrinks (common practice, no source). */
static void
test_area_monotone(void **state)
{
	hl_rng r;
	int n;

	(void)state;
	hl_rng_seed(&r, 11);
	for (n = 0; n < 60; n++) {
		hl_case *c = hl_gen_case(&r, 2 + n % 4, 2 + n % 3);
		double dt, prev = HUGE_VAL;

		for (dt = 2.0; dt <= 40.0; dt += 2.0) {
			hl_supertargets st;

			targets(c, dt, NULL, &st);
			assert_true(st.area <= prev * (1 + 1e-9));
			prev = st.area;
		}
		hl_case_free(c);
	}
}

static void
test_zero_dtmin(void **state)
{
	hl_case *c = hl_case_create();
	hl_cascade *cas;
	hl_supertargets st;
	hl_error err;

	(void)state;
	hl_gen_add(c, "H", 100, 50, 1.0);
	hl_gen_add(c, "C", 50, 100, 1.0);
	assert_int_equal(hl_cascade_compute(c, 0.0, &cas, NULL), HL_OK);
	assert_int_equal(hl_supertarget_compute(c, cas, NULL, NULL, 0, &st,
						&err), HL_ENOSOLUTION);
	assert_non_null(strstr(err.text, "unbounded"));
	hl_cascade_free(cas);
	hl_case_free(c);
}

int
main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_two_streams),
		cmocka_unit_test(test_crf),
		cmocka_unit_test(test_units_four_stream),
		cmocka_unit_test(test_balanced_cost),
		cmocka_unit_test(test_area_monotone),
		cmocka_unit_test(test_zero_dtmin),
	};

	return cmocka_run_group_tests(tests, NULL, NULL);
}
