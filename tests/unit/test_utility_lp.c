/* test_utility_lp.c - the utility LP against the problem table, against hand
 * cascades with known answers, and against an independent check of every
 * answer: the heat cascaded with the chosen loads never flows upward, and
 * no load can move to a cheaper level. */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <cmocka.h>

#include <glpk.h>

#include "cascade.h"
#include "gen.h"
#include "glpk_guard.h"
#include "near.h"
#include "utility_lp.h"

/* Agreement demanded between the LP and the problem table: both are exact
 * up to rounding. */
#define REL 1e-9

/* The four-stream problems and their sources: tests/unit/gen.c. */
static hl_utility_lp *
solve(const hl_case *c, double dtmin)
{
	hl_utility_lp *lp = NULL;
	hl_error err;

	hl_error_clear(&err);
	if (hl_utility_lp_solve(c, dtmin, NULL, &lp, &err) != HL_OK) {
		print_error("%s\n", err.text);
		fail();
	}
	return lp;
}

/* --- The independent check ---------------------------------------------
 * Heat flowing down through shifted temperature T, integrated directly from
 * the streams and the loads (no intervals, no shared code with the LP):
 * everything hot above T minus everything cold above T. An isothermal hot
 * utility at T counts below it, an isothermal cold one at T above it. */
static double
heat_above(const hl_case *c, double dtmin, const double *load, double T)
{
	double r = 0.0;
	size_t i, j;

	for (i = 0; i < c->nstream; i++) {
		const hl_stream *s = &c->stream[i];
		double sh = s->kind == HL_HOT ? -dtmin / 2 : dtmin / 2;

		for (j = 0; j < s->nseg; j++) {
			double hi = fmax(s->seg[j].supply, s->seg[j].target) + sh;
			double lo = fmin(s->seg[j].supply, s->seg[j].target) + sh;
			double q = hi > T ? s->seg[j].cp * (hi - fmax(lo, T)) : 0;

			r += s->kind == HL_HOT ? q : -q;
		}
	}
	for (i = 0; i < c->nutil; i++) {
		const hl_utility *u = &c->util[i];
		double sh = u->kind == HL_HOT ? -dtmin / 2 : dtmin / 2;
		double hi = fmax(u->supply, u->target) + sh;
		double lo = fmin(u->supply, u->target) + sh, f;

		if (hi == lo)
			f = u->kind == HL_HOT ? (hi > T) : (hi >= T);
		else
			f = fmin(1.0, fmax(0.0, (hi - T) / (hi - lo)));
		r += (u->kind == HL_HOT ? 1.0 : -1.0) * f * load[i];
	}
	return r;
}

static double
scale_of(const hl_case *c)
{
	double s = 1.0;
	size_t i;

	for (i = 0; i < c->nstream; i++)
		s += hl_stream_duty(&c->stream[i]);
	return s;
}

/* The most negative heat flow over every end temperature, and the heat
 * left below everything (must be zero: the first law). */
static double
worst_flow(const hl_case *c, double dtmin, const double *load, double *left)
{
	double worst = HUGE_VAL, tmin = HUGE_VAL;
	size_t i, j;

	for (i = 0; i < c->nstream; i++) {
		const hl_stream *s = &c->stream[i];
		double sh = s->kind == HL_HOT ? -dtmin / 2 : dtmin / 2;

		for (j = 0; j < s->nseg; j++) {
			double a = s->seg[j].supply + sh, b = s->seg[j].target + sh;

			worst = fmin(worst, heat_above(c, dtmin, load, a));
			worst = fmin(worst, heat_above(c, dtmin, load, b));
			tmin = fmin(tmin, fmin(a, b));
		}
	}
	for (i = 0; i < c->nutil; i++) {
		const hl_utility *u = &c->util[i];
		double sh = u->kind == HL_HOT ? -dtmin / 2 : dtmin / 2;

		worst = fmin(worst, heat_above(c, dtmin, load, u->supply + sh));
		worst = fmin(worst, heat_above(c, dtmin, load, u->target + sh));
		tmin = fmin(tmin, fmin(u->supply, u->target) + sh);
	}
	*left = heat_above(c, dtmin, load, tmin - 1.0);
	return worst;
}

static double *
loads_of(const hl_utility_lp *lp)
{
	double *l = malloc((lp->nutil + 1) * sizeof *l);
	size_t i;

	assert_non_null(l);
	for (i = 0; i < lp->nutil; i++)
		l[i] = lp->util[i].load;
	return l;
}

/* Feasible: no flow below zero, nothing left at the bottom, max_load kept. */
static void
check_feasible(const hl_case *c, double dtmin, const hl_utility_lp *lp)
{
	double *l = loads_of(lp), left, tol = 1e-9 * scale_of(c);
	size_t i;

	assert_true(worst_flow(c, dtmin, l, &left) >= -tol);
	assert_true(fabs(left) <= tol);
	for (i = 0; i < c->nutil; i++) {
		assert_true(l[i] >= 0.0);
		if (!isnan(c->util[i].max_load))
			assert_true(l[i] <= c->util[i].max_load * (1 + 1e-12));
	}
	free(l);
}

/* Moving a little load from any used level to a cheaper one of the same kind
 * (within its capacity) must make some flow negative: otherwise the LP
 * missed a cheaper answer. */
static void
check_no_cheaper_move(const hl_case *c, double dtmin, const hl_utility_lp *lp)
{
	double *l = loads_of(lp), left, tol = 1e-9 * scale_of(c);
	size_t a, b;

	for (b = 0; b < c->nutil; b++) {
		for (a = 0; a < c->nutil; a++) {
			double room, d;

			if (c->util[a].kind != c->util[b].kind || l[b] <= 0 ||
			    c->util[a].price >= c->util[b].price)
				continue;
			room = isnan(c->util[a].max_load) ? HUGE_VAL :
			       c->util[a].max_load - l[a];
			d = fmin(1e-3 * l[b], room);
			if (d <= 1e3 * tol)
				continue;
			l[a] += d;
			l[b] -= d;
			if (worst_flow(c, dtmin, l, &left) >= -1e-3 * d) {
				print_error("moving %g kW from '%s' to cheaper "
					    "'%s' stays feasible\n", d,
					    c->util[b].name, c->util[a].name);
				fail();
			}
			l[a] -= d;
			l[b] += d;
		}
	}
	free(l);
}

static void
check_answer(const hl_case *c, double dtmin, const hl_utility_lp *lp)
{
	check_feasible(c, dtmin, lp);
	check_no_cheaper_move(c, dtmin, lp);
}

/* --- One hot and one cold utility beyond all temperatures --------------
 * The LP must give the problem table's targets and pinches exactly. */
static void
compare_with_cascade(hl_case *c, double dtmin)
{
	hl_cascade *cas;
	hl_utility_lp *lp;
	double tol = REL * scale_of(c);
	size_t k;

	assert_int_equal(hl_cascade_compute(c, dtmin, &cas, NULL), HL_OK);
	lp = solve(c, dtmin);
	assert_true(fabs(lp->hot_load - cas->qh) <= tol);
	assert_true(fabs(lp->cold_load - cas->qc) <= tol);
	assert_true(fabs(lp->util[0].load - cas->qh) <= tol);
	assert_int_equal(lp->nproc, cas->npinch);
	for (k = 0; k < cas->npinch; k++)
		assert_true(lp->proc[k].shifted == cas->t[cas->pinch[k]]);
	/* At minimum utility the LP flows are the problem table's. */
	assert_int_equal(lp->npinch, 0);
	for (k = 0; k < cas->nb; k++) {
		size_t b = 0;

		while (lp->t[b] != cas->t[k])
			b++;
		assert_true(fabs(lp->flow[b] - cas->flow[k]) <= tol);
	}
	check_answer(c, dtmin, lp);
	hl_utility_lp_free(lp);
	hl_cascade_free(cas);
}

static void
test_kemp_one_each(void **state)
{
	hl_case *c = hl_gen_kemp4();
	hl_utility_lp *lp;

	(void)state;
	hl_gen_add_utility(c, "steam", HL_HOT, 250, 250, 30, NAN);
	hl_gen_add_utility(c, "water", HL_COLD, 5, 5, 5, NAN);
	compare_with_cascade(c, 10.0);
	compare_with_cascade(c, 20.0);
	lp = solve(c, 10.0);
	assert_rel(lp->util[0].load, 20.0, REL);
	assert_rel(lp->util[1].load, 60.0, REL);
	/* Yearly cost: price per MWh × kW × h / 1000. */
	assert_rel(lp->util[0].cost, 30.0 * 20.0 * 8000.0 / 1000.0, REL);
	assert_rel(lp->cost, (30.0 * 20 + 5.0 * 60) * 8.0, REL);
	assert_int_equal(lp->nproc, 1);
	assert_rel(lp->proc[0].shifted, 85.0, REL);
	assert_rel(lp->proc[0].hot, 90.0, REL);
	assert_rel(lp->proc[0].cold, 80.0, REL);
	assert_int_equal(lp->util[0].use, HL_UTIL_USED);
	assert_true(lp->optimal);
	hl_utility_lp_free(lp);
	hl_case_free(c);
}

/* Utilities with a range that still lie beyond every process temperature
 * change nothing: hot oil 320->300 °C, cooling water 5->15 °C. */
static void
test_smith_one_each_ranged(void **state)
{
	hl_case *c = hl_gen_smith4();

	(void)state;
	hl_gen_add_utility(c, "hot oil", HL_HOT, 320, 300, 25, NAN);
	hl_gen_add_utility(c, "cooling water", HL_COLD, 5, 15, 2, NAN);
	compare_with_cascade(c, 10.0);
	compare_with_cascade(c, 20.0);
	hl_case_free(c);
}

static void
test_random_one_each(void **state)
{
	hl_rng r;
	int n;

	(void)state;
	hl_rng_seed(&r, 11);
	for (n = 0; n < 150; n++) {
		hl_case *c = hl_gen_case(&r, 1 + n % 6, 1 + n % 5);

		hl_gen_add_utility(c, "top", HL_HOT, 400, n % 2 ? 400 : 380, 20, NAN);
		hl_gen_add_utility(c, "bottom", HL_COLD, -50, n % 3 ? -50 : -40, 3,
			 NAN);
		compare_with_cascade(c, floor(hl_rng_uniform(&r, 0, 40)));
		hl_case_free(c);
	}
}

/* --- Several levels, answers known by hand -------------------------------
 * Smith's problem with a second, cheaper hot utility condensing at 200 °C
 * (195 °C shifted): the cascade carries 3.0 MW past 195 °C, so the level can
 * take at most 3000 kW of the 7500 kW (doc/references.md, derived by hand). */
static void
test_smith_second_level(void **state)
{
	hl_case *c = hl_gen_smith4();
	hl_utility_lp *lp;

	(void)state;
	hl_gen_add_utility(c, "HP steam", HL_HOT, 270, 270, 40, NAN);
	hl_gen_add_utility(c, "MP steam", HL_HOT, 200, 200, 25, NAN);
	hl_gen_add_utility(c, "cooling water", HL_COLD, 15, 15, 2, NAN);
	lp = solve(c, 10.0);
	assert_rel(lp->util[0].load, 4500.0, REL);
	assert_rel(lp->util[1].load, 3000.0, REL);
	assert_rel(lp->util[2].load, 10000.0, REL);
	assert_rel(lp->cost, (40.0 * 4500 + 25.0 * 3000 + 2.0 * 10000) * 8, REL);
	/* MP steam now pinches the cascade at its level. */
	assert_int_equal(lp->npinch, 1);
	assert_rel(lp->pinch[0].shifted, 195.0, REL);
	assert_int_equal(lp->pinch[0].util, 1);
	assert_int_equal(lp->nproc, 1);
	assert_rel(lp->proc[0].shifted, 145.0, REL);
	check_answer(c, 10.0, lp);
	hl_utility_lp_free(lp);

	/* Its capacity limited to 2000 kW: HP steam takes the rest. */
	c->util[1].max_load = 2000.0;
	lp = solve(c, 10.0);
	assert_rel(lp->util[0].load, 5500.0, REL);
	assert_rel(lp->util[1].load, 2000.0, REL);
	assert_int_equal(lp->npinch, 0);
	check_answer(c, 10.0, lp);
	hl_utility_lp_free(lp);

	/* Dearer than HP steam: not used, reported as idle, not as an error. */
	c->util[1].max_load = NAN;
	c->util[1].price = 45.0;
	lp = solve(c, 10.0);
	assert_rel(lp->util[0].load, 7500.0, REL);
	assert_true(lp->util[1].load == 0.0);
	assert_int_equal(lp->util[1].use, HL_UTIL_IDLE);
	assert_string_equal(hl_utility_use_name(lp->util[1].use), "unused");
	check_answer(c, 10.0, lp);
	hl_utility_lp_free(lp);
	hl_case_free(c);
}

/* Kemp's problem below the pinch, constructed by hand: the cascade falls
 * from 0 at 85 °C to 75 kW at 55 °C shifted (2.5 kW/K) and 60 kW at 25 °C.
 * A cheap cold level boiling at 60 °C (65 shifted, where 50 kW flow) can take
 * 50 kW; a dear one at 10 °C takes the other 10 kW. */
static void
test_kemp_two_cold_levels(void **state)
{
	hl_case *c = hl_gen_kemp4();
	hl_utility_lp *lp;

	(void)state;
	hl_gen_add_utility(c, "steam", HL_HOT, 250, 250, 30, NAN);
	hl_gen_add_utility(c, "warm", HL_COLD, 60, 60, 1, NAN);
	hl_gen_add_utility(c, "cold", HL_COLD, 10, 10, 8, NAN);
	lp = solve(c, 10.0);
	assert_rel(lp->util[0].load, 20.0, REL);
	assert_rel(lp->util[1].load, 50.0, REL);
	assert_rel(lp->util[2].load, 10.0, REL);
	assert_int_equal(lp->npinch, 1);
	assert_rel(lp->pinch[0].shifted, 65.0, REL);
	check_answer(c, 10.0, lp);
	hl_utility_lp_free(lp);
	hl_case_free(c);
}

/* A cooling water range 60->80 °C (65->85 shifted) on the same slope of
 * 2.5 kW/K: its cp Q/20 may not exceed it, so Q <= 50 kW (constructed by
 * hand); the dear level takes 10 kW. */
static void
test_ranged_cold(void **state)
{
	hl_case *c = hl_gen_kemp4();
	hl_utility_lp *lp;

	(void)state;
	hl_gen_add_utility(c, "steam", HL_HOT, 250, 250, 30, NAN);
	hl_gen_add_utility(c, "cooling water", HL_COLD, 60, 80, 1, NAN);
	hl_gen_add_utility(c, "chilled water", HL_COLD, 10, 10, 8, NAN);
	lp = solve(c, 10.0);
	assert_rel(lp->util[1].load, 50.0, 1e-8);
	assert_rel(lp->util[2].load, 10.0, 1e-8);
	check_answer(c, 10.0, lp);
	hl_utility_lp_free(lp);
	hl_case_free(c);
}

/* Flue gas from 300 °C to a 60 °C stack (295->55 shifted) as the only hot
 * utility, constructed by hand: the 30 K of its 240 K range below the 85 °C
 * pinch carry 1/8 of its heat there, so 7/8 Q = 20 kW above the pinch:
 * Q = 160/7 kW, and the cold utility grows by Q/8 = 20/7 kW. */
static void
test_ranged_hot_across_pinch(void **state)
{
	hl_case *c = hl_gen_kemp4();
	hl_utility_lp *lp;

	(void)state;
	hl_gen_add_utility(c, "flue gas", HL_HOT, 300, 60, 20, NAN);
	hl_gen_add_utility(c, "water", HL_COLD, 10, 10, 5, NAN);
	lp = solve(c, 10.0);
	assert_rel(lp->util[0].load, 160.0 / 7.0, REL);
	assert_rel(lp->util[1].load, 60.0 + 20.0 / 7.0, REL);
	/* The rise is the heat the flue gas gives below the pinch (85 °C
	 * shifted): 160/7 × (85 − 55) / 240 = 20/7 kW. */
	assert_rel(lp->util[0].across, 20.0 / 7.0, REL);
	assert_rel(lp->range_rise, 20.0 / 7.0, REL);
	assert_rel(lp->qh_min, 20.0, REL);
	check_answer(c, 10.0, lp);
	hl_utility_lp_free(lp);
	hl_case_free(c);
}

/* Equal prices: the colder hot level and the hotter cold level are taken
 * (the documented tie-break), whatever the order of the table. */
static void
test_ties(void **state)
{
	hl_case *c = hl_gen_kemp4();
	hl_utility_lp *lp;

	(void)state;
	hl_gen_add_utility(c, "HP", HL_HOT, 250, 250, 30, NAN);
	hl_gen_add_utility(c, "LP", HL_HOT, 180, 180, 30, NAN);
	hl_gen_add_utility(c, "chilled", HL_COLD, 5, 5, 4, NAN);
	hl_gen_add_utility(c, "water", HL_COLD, 12, 12, 4, NAN);
	lp = solve(c, 10.0);
	assert_true(lp->util[0].load == 0.0);
	assert_rel(lp->util[1].load, 20.0, REL);
	assert_true(lp->util[2].load == 0.0);
	assert_rel(lp->util[3].load, 60.0, REL);
	hl_utility_lp_free(lp);
	hl_case_free(c);
}

/* A hot utility colder than every cold stream, and a cold one hotter than
 * every hot stream, can serve nothing (heat flows only down the
 * temperature scale: common practice, no source): reported, not an
 * error. */
static void
test_out_of_reach(void **state)
{
	hl_case *c = hl_gen_kemp4();
	hl_utility_lp *lp;

	(void)state;
	hl_gen_add_utility(c, "steam", HL_HOT, 250, 250, 30, NAN);
	hl_gen_add_utility(c, "warm water", HL_HOT, 25, 25, 0, NAN);
	hl_gen_add_utility(c, "water", HL_COLD, 10, 10, 5, NAN);
	hl_gen_add_utility(c, "hot sink", HL_COLD, 200, 200, 0, NAN);
	lp = solve(c, 10.0);
	assert_true(lp->util[1].load == 0.0);
	assert_int_equal(lp->util[1].use, HL_UTIL_REACH);
	assert_true(lp->util[3].load == 0.0);
	assert_int_equal(lp->util[3].use, HL_UTIL_REACH);
	assert_rel(lp->util[0].load, 20.0, REL);
	check_answer(c, 10.0, lp);
	hl_utility_lp_free(lp);
	hl_case_free(c);
}

/* --- Impossible cases: exit 3 with a sentence ---------------------------- */
static void
expect_fail(const hl_case *c, const char *part1, const char *part2)
{
	hl_utility_lp *lp = NULL;
	hl_error err;

	hl_error_clear(&err);
	assert_int_equal(hl_utility_lp_solve(c, 10.0, NULL, &lp, &err),
			 HL_ENOSOLUTION);
	assert_null(lp);
	if (strstr(err.text, part1) == NULL ||
	    strstr(err.text, part2) == NULL) {
		print_error("message: %s\n", err.text);
		fail();
	}
}

static void
test_infeasible(void **state)
{
	hl_case *c = hl_gen_kemp4();

	(void)state;
	/* Steam condensing at 85 °C (80 shifted) lies below the 85 °C shifted
	 * pinch, above which the process needs its 20 kW. */
	hl_gen_add_utility(c, "LP steam", HL_HOT, 85, 85, 30, NAN);
	hl_gen_add_utility(c, "water", HL_COLD, 10, 10, 5, NAN);
	expect_fail(c, "no hot utility is hot enough: the process needs 20.0 "
		    "kW of heat above 85.0 °C shifted (cold streams at 80.0 °C)",
		    "the hottest hot utility, 'LP steam', supplies at 85.0 °C");
	/* Enough temperature, not enough capacity. */
	c->util[0].supply = c->util[0].target = 200;
	c->util[0].max_load = 15;
	expect_fail(c, "can give at most 15.0 kW", "needs 20.0 kW");
	hl_case_free(c);

	/* No cold utility at all for the 60 kW below the pinch. */
	c = hl_gen_kemp4();
	hl_gen_add_utility(c, "steam", HL_HOT, 250, 250, 30, NAN);
	expect_fail(c, "must reject 60.0 kW", "has no cold utility");
	hl_case_free(c);

	/* Cooling only at 100 °C (105 shifted): the 60 kW released below the
	 * pinch cannot reach it. */
	c = hl_gen_kemp4();
	hl_gen_add_utility(c, "steam", HL_HOT, 250, 250, 30, NAN);
	hl_gen_add_utility(c, "hot well", HL_COLD, 100, 100, 1, NAN);
	expect_fail(c, "no cold utility is cold enough: the process must "
		    "reject 60.0 kW of heat below 85.0 °C shifted",
		    "the coldest cold utility, 'hot well', starts at 100.0 °C");
	hl_case_free(c);

	/* Flue gas down to -5 °C shifted would release heat below the only
	 * cold level (15 shifted), where nothing can take it: each condition
	 * alone holds, their combination does not (constructed by hand). */
	c = hl_gen_kemp4();
	hl_gen_add_utility(c, "flue gas", HL_HOT, 300, 0, 20, NAN);
	hl_gen_add_utility(c, "water", HL_COLD, 10, 10, 5, NAN);
	expect_fail(c, "cannot meet the process", "temperature range");
	hl_case_free(c);
}

/* Random problems with several levels: every answer passes the independent
 * check and never costs more than the two extreme levels alone. */
static void
test_random_levels(void **state)
{
	hl_rng r;
	int n;

	(void)state;
	hl_rng_seed(&r, 12);
	for (n = 0; n < 120; n++) {
		hl_case *c = hl_gen_case(&r, 1 + n % 5, 1 + n % 4);
		double dt = floor(hl_rng_uniform(&r, 5, 30)), qh, qc;
		hl_utility_lp *lp;
		char name[16];
		int i;

		hl_gen_add_utility(c, "top", HL_HOT, 400, 400, 40, NAN);
		hl_gen_add_utility(c, "bottom", HL_COLD, -50, -50, 12, NAN);
		for (i = 0; i < 3; i++) {
			double t = floor(hl_rng_uniform(&r, 30, 320));
			double t2 = i == 2 ? t - floor(hl_rng_uniform(&r, 0, 40)) : t;

			snprintf(name, sizeof name, "h%d", i);
			hl_gen_add_utility(c, name, HL_HOT, t, t2,
				 floor(hl_rng_uniform(&r, 5, 40)),
				 n % 3 == 0 ? hl_rng_uniform(&r, 0, 500) : NAN);
			t = floor(hl_rng_uniform(&r, 5, 250));
			snprintf(name, sizeof name, "c%d", i);
			hl_gen_add_utility(c, name, HL_COLD, t, i == 1 ? t + 10 : t,
				 floor(hl_rng_uniform(&r, 1, 12)), NAN);
		}
		lp = solve(c, dt);
		check_answer(c, dt, lp);
		assert_int_equal(hl_cascade_targets(c, dt, &qh, &qc, NULL), HL_OK);
		assert_true(lp->cost <= (40 * qh + 12 * qc) * 8 *
			    (1 + 1e-9) + 1e-6);
		hl_utility_lp_free(lp);
		hl_case_free(c);
	}
}

/* A credit (steam raised and sold above a bought hot utility's price) on
 * tests/data/good/credit.csv (invented; hand cascade in
 * tests/cli/credits.sh): steam raising takes all 400 kW H1 gives above its
 * level, HP steam 150 kW heats C2 instead, cooling water 200 kW. Without
 * the credit rule the LP would be unbounded. */
static void
test_credit(void **state)
{
	hl_case *c = hl_case_create();
	hl_utility_lp *lp;

	(void)state;
	hl_gen_add(c, "H1", 200, 100, 10.0);
	hl_gen_add(c, "C1", 50, 120, 5.0);
	hl_gen_add(c, "C2", 140, 180, 5.0);
	hl_gen_add_utility(c, "HP steam", HL_HOT, 250, 250, 20, NAN);
	hl_gen_add_utility(c, "steam raising", HL_COLD, 150, 150, -30, NAN);
	hl_gen_add_utility(c, "cooling water", HL_COLD, 20, 30, 1, NAN);
	assert_int_equal(hl_case_validate(c, NULL), HL_OK);
	lp = solve(c, 10.0);
	assert_rel(lp->util[0].load, 150.0, REL);
	assert_rel(lp->util[1].load, 400.0, REL);
	assert_rel(lp->util[2].load, 200.0, REL);
	assert_rel(lp->cost, -70400.0, REL);
	assert_rel(lp->credit, 96000.0, REL);
	assert_rel(lp->credit_rise, 150.0, REL);
	check_answer(c, 10.0, lp);
	hl_utility_lp_free(lp);
	hl_case_free(c);
}

/* Random credits stay bounded: the answer balances, a credit cold utility
 * takes no more than the hot streams give, a credit hot one gives no more
 * than the cold streams take, and the cost is no higher than without the
 * credits' earnings (the credit levels at load 0 are feasible). */
static void
test_random_credits(void **state)
{
	hl_rng r;
	int n;

	(void)state;
	hl_rng_seed(&r, 77);
	for (n = 0; n < 80; n++) {
		hl_case *c = hl_gen_case(&r, 1 + n % 4, 1 + n % 3);
		double dt = floor(hl_rng_uniform(&r, 5, 25)), hot = 0, cold = 0;
		hl_utility_lp *lp, *lp0;
		size_t i;

		hl_gen_add_utility(c, "top", HL_HOT, 400, 400, 40, NAN);
		hl_gen_add_utility(c, "bottom", HL_COLD, -50, -50, 12, NAN);
		lp0 = solve(c, dt);
		hl_gen_add_utility(c, "sell", HL_COLD,
			floor(hl_rng_uniform(&r, 20, 200)), 0, -60, NAN);
		c->util[c->nutil - 1].target = c->util[c->nutil - 1].supply +
			(n % 2 ? 0 : 10);
		hl_gen_add_utility(c, "waste heat", HL_HOT,
			floor(hl_rng_uniform(&r, 60, 300)), 0, -5, NAN);
		c->util[c->nutil - 1].target = c->util[c->nutil - 1].supply;
		assert_int_equal(hl_case_validate(c, NULL), HL_OK);
		lp = solve(c, dt);
		/* Feasible; check_no_cheaper_move does not know that a credit
		 * may only serve the process (its cheaper moves may feed a
		 * credit from a utility), so optimality is left to the hand
		 * cases and the transportation LP (tests/cli/credits.sh). */
		check_feasible(c, dt, lp);
		for (i = 0; i < c->nstream; i++)
			*(c->stream[i].kind == HL_HOT ? &hot : &cold) +=
				hl_stream_duty(&c->stream[i]);
		assert_true(lp->util[2].load <= hot * (1 + 1e-9) + 1e-6);
		assert_true(lp->util[3].load <= cold * (1 + 1e-9) + 1e-6);
		assert_true(lp->cost <= lp0->cost + 1e-6 * (1 + fabs(lp0->cost)));
		hl_utility_lp_free(lp);
		hl_utility_lp_free(lp0);
		hl_case_free(c);
	}
}

/* The guard turns a GLPK API error (which would abort) into a status. */
static void
test_guard(void **state)
{
	hl_glpk_guard g;
	glp_prob *volatile P = NULL;
	hl_error err;

	(void)state;
	hl_glpk_guard_begin(&g, NULL, NULL, 0);
	if (HL_GLPK_CRASHED(&g)) {
		assert_int_equal(hl_glpk_guard_crash(&g, "the test model", &err),
				 HL_ENOSOLUTION);
		assert_non_null(strstr(err.text, "the test model failed"));
		assert_non_null(strstr(err.text, "out of range"));
		return;
	}
	P = glp_create_prob();
	glp_add_cols(P, 1);
	glp_set_col_bnds(P, 7, GLP_LO, 0.0, 0.0); /* no column 7 */
	fail_msg("GLPK did not report the bad column");
}

int
main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_kemp_one_each),
		cmocka_unit_test(test_smith_one_each_ranged),
		cmocka_unit_test(test_random_one_each),
		cmocka_unit_test(test_smith_second_level),
		cmocka_unit_test(test_kemp_two_cold_levels),
		cmocka_unit_test(test_ranged_cold),
		cmocka_unit_test(test_ranged_hot_across_pinch),
		cmocka_unit_test(test_ties),
		cmocka_unit_test(test_out_of_reach),
		cmocka_unit_test(test_infeasible),
		cmocka_unit_test(test_random_levels),
		cmocka_unit_test(test_credit),
		cmocka_unit_test(test_random_credits),
		cmocka_unit_test(test_guard),
	};

	return cmocka_run_group_tests(tests, NULL, NULL);
}
