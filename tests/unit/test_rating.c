/* test_rating.c - rating a unit of known area against sizing and against a
 * published effectiveness table.
 *
 * Outside references (each check names its own):
 *   Kays & London, Compact Heat Exchangers, 3rd ed. (McGraw-Hill 1984),
 *     the ε-NTU tables for counterflow and for one shell pass with 2, 4, …
 *     tube passes, three decimals (from memory);
 *   Incropera & DeWitt, Fundamentals of Heat and Mass Transfer, table 11.3
 *     (the ε-NTU formulas; from memory);
 *   Kern, Process Heat Transfer (1950), ch. 7: Q = U·A·F·LMTD, the route
 *     sizing takes.
 * Round trips use the project's own sizing (exchanger.h): size a unit, rate
 * it at the area found, get its temperatures back.
 */
#include <stdarg.h>
#include <stddef.h>
#include <stdint.h>
#include <setjmp.h>
#include <cmocka.h>

#include <math.h>
#include <string.h>

#include "exchanger.h"
#include "rating.h"

#define TOL_TRIP 1e-9     /* size then rate: the brief's round trip */
#define TOL_TABLE 5e-4    /* a value printed to three decimals */

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
		fail_msg("status %d: %s", (int)st, err->text);
}

/* A side on a one-segment stream. */
static hl_rating_side
side(hl_segment *seg, hl_kind kind, double supply, double target, double cp,
     double h, double share, double t_in)
{
	hl_rating_side s;

	memset(seg, 0, sizeof *seg);
	seg->supply = supply;
	seg->target = target;
	seg->cp = cp;
	seg->h = h;
	s.seg = seg;
	s.nseg = 1;
	s.kind = kind;
	s.share = share;
	s.t_in = t_in;
	s.h_default = 0.5;
	return s;
}

/* Kays & London (1984) ε-NTU tables, three decimals (from memory; they
 * agree with the formulas of Incropera & DeWitt table 11.3). */
static void
test_eps_published(void **state)
{
	static const struct {
		hl_exchanger_type type;
		int shells;
		double ntu, cr, eps;
	} t[] = {
		{ HL_EXCH_COUNTERFLOW, 1, 1.0, 0.5, 0.565 },
		{ HL_EXCH_COUNTERFLOW, 1, 2.0, 0.5, 0.775 },
		{ HL_EXCH_COUNTERFLOW, 1, 2.0, 0.75, 0.722 },
		{ HL_EXCH_COUNTERFLOW, 1, 1.0, 1.0, 0.500 },
		{ HL_EXCH_COUNTERFLOW, 1, 5.0, 1.0, 0.833 },
		{ HL_EXCH_COUNTERFLOW, 1, 3.0, 0.0, 0.950 },
		{ HL_EXCH_SHELL_TUBE, 1, 1.0, 0.5, 0.540 },
		{ HL_EXCH_SHELL_TUBE, 1, 2.0, 0.5, 0.693 },
		{ HL_EXCH_SHELL_TUBE, 1, 1.0, 1.0, 0.463 },
		{ HL_EXCH_SHELL_TUBE, 1, 3.0, 1.0, 0.579 },
		{ HL_EXCH_SHELL_TUBE, 1, 5.0, 0.75, 0.666 },
	};
	size_t i;
	hl_error err;
	double e;

	(void)state;
	for (i = 0; i < sizeof t / sizeof t[0]; i++) {
		check_ok(hl_rating_eps(t[i].type, t[i].shells, t[i].ntu,
		    t[i].cr, &e, &err), &err);
		check_abs(e, t[i].eps, TOL_TABLE, "Kays & London table");
	}
}

/* n shells in series at Cr = 1: ε = nε1/(1 + (n−1)ε1) (Incropera & DeWitt,
 * table 11.3, the Cr = 1 limit of the series formula; from memory). */
static void
test_eps_series_cr1(void **state)
{
	static const int nn[] = { 2, 3, 4, 6 };
	size_t k;
	hl_error err;

	(void)state;
	for (k = 0; k < sizeof nn / sizeof nn[0]; k++) {
		double e1, e, n = nn[k], ntu = 3.0;

		check_ok(hl_rating_eps(HL_EXCH_SHELL_TUBE, 1, ntu / n, 1.0,
		    &e1, &err), &err);
		check_ok(hl_rating_eps(HL_EXCH_SHELL_TUBE, nn[k], ntu, 1.0, &e,
		    &err), &err);
		check_abs(e, n * e1 / (1.0 + (n - 1.0) * e1), 1e-12,
		    "series at Cr = 1");
	}
}

/* Size by exchanger.h (LMTD, F, shells by the Xp rule or crossflow
 * sections, by type), rate at that area and shell count: the temperatures
 * come back to 1e-9 for every type rating covers [derived: ε-NTU and
 * F·LMTD are one relation, Kakaç & Liu ch. 2]. */
static void
test_size_then_rate(void **state)
{
	static const double tt[][4] = {
		/* hot in, hot out, cold in, cold out */
		{ 150.0, 90.0, 30.0, 80.0 },
		{ 340.0, 240.0, 200.0, 230.0 },
		{ 200.0, 100.0, 80.0, 150.0 },   /* a cross: several shells */
		{ 220.0, 120.0, 40.0, 190.0 },   /* a deep cross */
		{ 120.0, 60.0, 50.0, 100.0 },
		{ 180.0, 130.0, 60.0, 110.0 },   /* Cr = 1 */
		{ 150.0, 60.0, 30.0, 45.0 },     /* an air cooler's */
		{ 150.0, 60.0, 30.0, 100.0 },    /* sections in series */
	};
	static const double share[] = { 1.0, 0.4 };
	static const hl_exchanger_type ty[] = {
		HL_EXCH_COUNTERFLOW, HL_EXCH_SHELL_TUBE, HL_EXCH_PLATE,
		HL_EXCH_DOUBLE_PIPE, HL_EXCH_AIR_COOLER
	};
	const size_t nty = sizeof ty / sizeof ty[0];
	size_t i, j, k;
	hl_error err;

	(void)state;
	for (i = 0; i < sizeof tt / sizeof tt[0]; i++)
		for (j = 0; j < nty; j++)
			for (k = 0; k < 2; k++) {
				const double *t = tt[i];
				double duty = 700.0, hh = 0.8, hc = 0.6;
				hl_exchanger_spec sp;
				hl_exchanger_sizing z;
				hl_rating_spec rs;
				hl_rating_result g;
				hl_segment sh, sc;

				memset(&sp, 0, sizeof sp);
				sp.hot_in = t[0];
				sp.hot_out = t[1];
				sp.cold_in = t[2];
				sp.cold_out = t[3];
				sp.duty = duty;
				sp.type = ty[j];
				sp.fmin = 0.8;
				sp.xp = 0.9;
				sp.cost_b = 800.0;
				sp.cost_c = 0.8;
				check_ok(hl_exchanger_u(hh, hc, &sp.u, &err),
				    &err);
				check_ok(hl_exchanger_size(&sp, &z, &err),
				    &err);
				/* The stream carries 1/share of the unit's
				 * cp; the unit takes the share. */
				rs.hot = side(&sh, HL_HOT, t[0] + 50.0, 0.0,
				    duty / (t[0] - t[1]) / share[k], hh,
				    share[k], t[0]);
				rs.cold = side(&sc, HL_COLD, t[2] - 20.0,
				    t[3] + 300.0,
				    duty / (t[3] - t[2]) / share[k], hc,
				    share[k], t[2]);
				rs.type = ty[j];
				rs.shells = z.shells;
				rs.area = z.area;
				check_ok(hl_rating_run(&rs, &g, &err), &err);
				assert_int_equal(g.closed_form, 1);
				check_abs(g.duty, duty, TOL_TRIP * duty,
				    "rated duty");
				check_abs(g.hot_out, t[1], TOL_TRIP * t[0],
				    "rated hot outlet");
				check_abs(g.cold_out, t[3], TOL_TRIP * t[0],
				    "rated cold outlet");
				check_abs(g.ft, z.f, 1e-9, "F at the rating");
			}
}

/* The types beyond counterflow and shell-and-tube: plate and double pipe
 * rate as counterflow (Kays & London counterflow table, as above); one
 * air-cooler section is the unmixed crossflow ε; at Cr = 0 every
 * arrangement gives ε = 1 − e^{−NTU} (Incropera & DeWitt, table 11.3,
 * from memory); n sections at Cr = 1 follow the series rule nε1/(1 +
 * (n−1)ε1) (same table). A fired heater is not rated. */
static void
test_eps_types(void **state)
{
	hl_error err;
	double e, e1, x;
	int n;

	(void)state;
	check_ok(hl_rating_eps(HL_EXCH_PLATE, 7, 2.0, 0.5, &e, &err), &err);
	check_abs(e, 0.775, TOL_TABLE, "plate as counterflow");
	check_ok(hl_rating_eps(HL_EXCH_DOUBLE_PIPE, 3, 5.0, 1.0, &e, &err),
	    &err);
	check_abs(e, 0.833, TOL_TABLE, "double pipe as counterflow");
	check_ok(hl_rating_eps(HL_EXCH_AIR_COOLER, 1, 1.5, 0.6, &e, &err),
	    &err);
	check_ok(hl_exchanger_eps_crossflow(1.5, 0.6, &x, &err), &err);
	check_abs(e, x, 1e-15, "one section is one crossflow pass");
	check_ok(hl_rating_eps(HL_EXCH_AIR_COOLER, 3, 2.0, 0.0, &e, &err),
	    &err);
	check_abs(e, 1.0 - exp(-2.0), 1e-12, "Cr = 0");
	for (n = 2; n <= 4; n++) {
		check_ok(hl_rating_eps(HL_EXCH_AIR_COOLER, 1, 3.0 / n, 1.0,
		    &e1, &err), &err);
		check_ok(hl_rating_eps(HL_EXCH_AIR_COOLER, n, 3.0, 1.0, &e,
		    &err), &err);
		check_abs(e, n * e1 / (1.0 + (n - 1.0) * e1), 1e-12,
		    "sections in series at Cr = 1");
		assert_true(e > e1);
	}
	assert_int_equal(hl_rating_eps(HL_EXCH_AIR_COOLER, 0, 1.0, 0.5, &e,
	    &err), HL_EINPUT);
	assert_int_equal(hl_rating_eps(HL_EXCH_AIR_COOLER, 1, 1.0, 1.5, &e,
	    &err), HL_EINPUT);
	assert_int_equal(hl_rating_eps(HL_EXCH_FIRED_HEATER, 1, 1.0, 0.5, &e,
	    &err), HL_EINPUT);
	assert_non_null(strstr(err.text, "not rated"));
}

/* A hot stream that changes cp inside the unit (a condensing then cooling
 * overhead, two segments): the search finds the duty whose piecewise
 * area is the area given, and the area at the rated duty is that area. */
static void
test_segmented(void **state)
{
	hl_segment hs[2], cs;
	hl_rating_spec rs;
	hl_rating_result g;
	hl_error err;
	const double duty = 1300.0;
	double a;

	(void)state;
	memset(hs, 0, sizeof hs);
	hs[0].supply = 135.0;
	hs[0].target = 115.0;
	hs[0].cp = 60.0;
	hs[0].h = 1.5;
	hs[1].supply = 115.0;
	hs[1].target = 45.0;
	hs[1].cp = 8.0;
	hs[1].h = 1.2;
	rs.hot.seg = hs;
	rs.hot.nseg = 2;
	rs.hot.kind = HL_HOT;
	rs.hot.share = 1.0;
	rs.hot.t_in = 135.0;
	rs.hot.h_default = 0.5;
	rs.cold = side(&cs, HL_COLD, 30.0, 200.0, 14.0, 0.7, 1.0, 30.0);
	rs.type = HL_EXCH_SHELL_TUBE;
	rs.shells = 2;
	a = hl_rating_area_needed(&rs, duty, NULL, NULL, NULL);
	assert_true(isfinite(a) && a > 0.0);
	rs.area = a;
	check_ok(hl_rating_run(&rs, &g, &err), &err);
	assert_int_equal(g.closed_form, 0);
	check_abs(g.duty, duty, TOL_TRIP * duty, "segmented rated duty");
	/* 1200 kW in the first segment, the rest at cp 8 (by hand). */
	check_abs(g.hot_out, 115.0 - 100.0 / 8.0, 1e-7, "hot outlet");
	check_abs(g.cold_out, 30.0 + duty / 14.0, 1e-7, "cold outlet");
}

/* No area, no duty; a huge counterflow area takes Cmin to the other inlet
 * (Incropera & DeWitt ch. 11: ε → 1 for Cr < 1). Bad input fails. */
static void
test_limits(void **state)
{
	hl_segment sh, sc;
	hl_rating_spec rs;
	hl_rating_result g;
	hl_error err;

	(void)state;
	rs.hot = side(&sh, HL_HOT, 200.0, 50.0, 10.0, 1.0, 1.0, 200.0);
	rs.cold = side(&sc, HL_COLD, 20.0, 150.0, 20.0, 1.0, 1.0, 20.0);
	rs.type = HL_EXCH_COUNTERFLOW;
	rs.shells = 1;
	rs.area = 0.0;
	check_ok(hl_rating_run(&rs, &g, &err), &err);
	assert_true(g.duty == 0.0 && g.hot_out == 200.0 && g.cold_out == 20.0);
	rs.area = 1e6;
	check_ok(hl_rating_run(&rs, &g, &err), &err);
	check_abs(g.hot_out, 20.0, 1e-6, "hot side down to the cold inlet");
	check_abs(hl_rating_duty_max(&rs), 1800.0, 1e-9, "duty max");
	rs.area = -1.0;
	assert_int_equal(hl_rating_run(&rs, &g, &err), HL_EINPUT);
	assert_non_null(strstr(err.text, "area"));
	rs.area = 10.0;
	rs.type = HL_EXCH_SHELL_TUBE;
	rs.shells = 0;
	assert_int_equal(hl_rating_run(&rs, &g, &err), HL_EINPUT);
	rs.shells = 1;
	rs.hot.t_in = 10.0;
	assert_int_equal(hl_rating_run(&rs, &g, &err), HL_EINPUT);
	assert_non_null(strstr(err.text, "below the cold inlet"));
	rs.hot.t_in = 200.0;
	rs.type = HL_EXCH_AIR_COOLER;
	rs.shells = 0;
	assert_int_equal(hl_rating_run(&rs, &g, &err), HL_EINPUT);
	assert_non_null(strstr(err.text, "sections"));
	rs.type = HL_EXCH_FIRED_HEATER;
	rs.shells = 1;
	assert_int_equal(hl_rating_run(&rs, &g, &err), HL_EINPUT);
	assert_non_null(strstr(err.text, "not rated"));
}

int
main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_eps_published),
		cmocka_unit_test(test_eps_series_cr1),
		cmocka_unit_test(test_eps_types),
		cmocka_unit_test(test_size_then_rate),
		cmocka_unit_test(test_segmented),
		cmocka_unit_test(test_limits),
	};

	return cmocka_run_group_tests(tests, NULL, NULL);
}
