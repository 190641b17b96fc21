/* test_audit.c - reading today's network, the pinch-rule violations, ΔTmin
 * now, the area efficiency and the retrofit curve.
 *
 * The stream data is the four-stream problem of Linnhoff et al., User Guide
 * on Process Integration for the Efficient Use of Energy (IChemE 1982),
 * also Kemp, Pinch Analysis and Process Integration, 2nd ed. (2007), ch. 2
 * (from memory; targets confirmed by a hand cascade): at ΔTmin 10 K QHmin
 * 20 kW, QCmin 60 kW, pinch 90/80 °C. The networks below are constructed by
 * hand in this file; the utility levels and prices are invented for the
 * test.
 */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <cmocka.h>

#include "audit.h"
#include "cascade.h"
#include "curves.h"
#include "existing.h"
#include "gen.h"
#include "retrofit.h"
#include "tables.h"
#include "utility_lp.h"

static const char streams[] =
	"name,supply,target,cp\n"
	"C1,20,135,2.0\n"
	"H1,170,60,3.0\n"
	"C2,80,140,4.0\n"
	"H2,150,30,1.5\n";
static const char utilities[] =
	"name,kind,supply,target,price\n"
	"steam,hot,180,180,30\n"
	"cooling water,cold,15,25,2\n";

#define NET_HEAD "name,hot,cold,duty,hot_in,hot_out,cold_in,cold_out\n"

/* A minimum-energy network at ΔTmin 10 K, constructed by hand: above the
 * pinch H1-C2 240 kW and H2-C1 90 kW with 20 kW of steam on C1; below it
 * H1-C1 90 kW, H2-C1 30 kW and 60 kW of cooling on H2. Every unit lies on
 * one side of the pinch (hot 90 °C, cold 80 °C). */
static const char mer[] = NET_HEAD
	"E1,H1,C2,240,170,90,80,140\n"
	"E2,H2,C1,90,150,90,80,125\n"
	"E3,H1,C1,90,90,60,35,80\n"
	"E4,H2,C1,30,90,70,20,35\n"
	"S1,steam,C1,20,,,125,135\n"
	"CW1,H2,cooling water,60,70,30,,\n";

/* The same plant with 15 kW moved across the pinch, constructed by hand:
 * EX cools H2 from 100 to 90 °C (above the pinch: shifted 95 → 85 °C) and
 * heats C1 from 27.5 to 35 °C (below it). E2 gives 15 kW less above the
 * pinch, so the steam grows by 15 kW; E4 gives 15 kW less below it, so the
 * cooling grows by 15 kW. */
static const char cross15[] = NET_HEAD
	"E1,H1,C2,240,170,90,80,140\n"
	"E2,H2,C1,75,150,100,80,117.5\n"
	"EX,H2,C1,15,100,90,27.5,35\n"
	"E4,H2,C1,15,90,80,20,27.5\n"
	"E3,H1,C1,90,90,60,35,80\n"
	"S1,steam,C1,35,,,117.5,135\n"
	"CW1,H2,cooling water,75,80,30,,\n";

static hl_case *
load(const char *net, int with_utilities)
{
	hl_case *c = hl_case_create();
	hl_error e;

	assert_non_null(c);
	c->source = strdup("kemp4");
	assert_int_equal(hl_stream_table_read_mem(c, "s.csv", streams,
		strlen(streams), &e), HL_OK);
	if (with_utilities)
		assert_int_equal(hl_utility_table_read_mem(c, "u.csv",
			utilities, strlen(utilities), &e), HL_OK);
	if (net != NULL)
		assert_int_equal(hl_network_table_read_mem(c, "n.csv", net,
			strlen(net), &e), HL_OK);
	assert_int_equal(hl_case_validate(c, &e), HL_OK);
	return c;
}

static hl_audit *
audit(const hl_case *c)
{
	hl_audit *a = NULL;
	hl_error e;

	hl_error_clear(&e);
	if (hl_audit_run(c, &a, &e) != HL_OK)
		fail_msg("audit failed: %s:%ld: %s", e.file, e.line, e.text);
	return a;
}

static const hl_existing_unit *
unit_named(const hl_audit *a, const char *name)
{
	size_t i;

	for (i = 0; i < a->net->nunit; i++)
		if (strcmp(a->net->unit[i].name, name) == 0)
			return &a->net->unit[i];
	fail_msg("no unit '%s'", name);
	return NULL;
}

/* A warning at file:line holding words. */
static void
has_warning(const hl_existing *net, const char *file, long line,
	    const char *words)
{
	size_t i;

	for (i = 0; i < net->nwarn; i++)
		if (strcmp(net->warn[i].file, file) == 0 &&
		    net->warn[i].line == line &&
		    strstr(net->warn[i].text, words) != NULL)
			return;
	for (i = 0; i < net->nwarn; i++)
		print_message("  %s:%ld: %s\n", net->warn[i].file,
			      net->warn[i].line, net->warn[i].text);
	fail_msg("no warning at %s:%ld with '%s'", file, line, words);
}

/* Heat along a segmented stream, derived by hand: hot 200 → 100 °C at
 * 2 kW/K then 100 → 50 °C at 4 kW/K. */
static void
test_stream_heat(void **state)
{
	hl_segment seg[2] = {
		{ 200, 100, 2.0, NAN, 0, 0, 0.0, 0 }, { 100, 50, 4.0, NAN, 0, 0, 0.0, 0 }
	};
	hl_stream s;
	double t[] = { 210, 200, 150, 100, 75, 50, 40 };
	double q[] = { -20, 0, 100, 200, 300, 400, 440 };
	size_t i;

	(void)state;
	memset(&s, 0, sizeof s);
	s.kind = HL_HOT;
	s.nseg = 2;
	s.seg = seg;
	for (i = 0; i < 7; i++) {
		assert_true(fabs(hl_stream_heat_at(&s, t[i]) - q[i]) < 1e-12);
		assert_true(fabs(hl_stream_temp_at(&s, q[i]) - t[i]) < 1e-12);
	}
}

/* The constructed 15 kW across the pinch: found on EX, and today's hot
 * and cold utility both exceed the targets by exactly 15 kW (each kW
 * across the pinch costs a kW of heating and of cooling: Linnhoff et al.
 * 1982, from memory; a textbook rule). */
static void
test_cross_pinch(void **state)
{
	hl_case *c = load(cross15, 1);
	hl_audit *a = audit(c);

	(void)state;
	assert_true(fabs(a->hot_target - 20.0) < 1e-9);
	assert_true(fabs(a->cold_target - 60.0) < 1e-9);
	assert_true(a->pinch_kind == 'P' && fabs(a->pinch - 85.0) < 1e-9);
	assert_int_equal(a->nviol, 1);
	assert_string_equal(a->net->unit[a->viol[0].unit].name, "EX");
	assert_int_equal(a->viol[0].kind, HL_VIOL_ACROSS);
	assert_true(fabs(a->viol[0].duty - 15.0) < 1e-9);
	assert_true(fabs(a->net->hot_now - 35.0) < 1e-9);
	assert_true(fabs(a->net->cold_now - 75.0) < 1e-9);
	assert_true(fabs(a->saving - 15.0) < 1e-9);
	assert_true(fabs(a->saving_cold - 15.0) < 1e-9);
	/* 15 kW of steam at 30 and of cooling at 2 per MWh, 8000 h (the
	 * formula of audit.h, worked by hand). */
	assert_true(fabs(a->saving_cost - 15.0 * 32.0 * 8.0) < 1e-6);
	assert_true(fabs(a->viol[0].saving - 15.0 * 32.0 * 8.0) < 1e-6);
	assert_int_equal(a->net->nwarn, 0);
	hl_audit_free(a);
	hl_case_free(c);
}

/* A unit spanning the pinch on both sides: kemp4-network.csv of the
 * tests, built by hand. E2 cools H2 150 → 90 °C (above) and heats C1
 * 20 → 65 °C (below): 90 kW across. S-1 heats C1 65 → 135 °C: the part
 * 65 → 80 °C is below the pinch, 2.0 × 15 = 30 kW. 90 + 30 = 120 kW =
 * (140 − 20) kW of steam = (180 − 60) kW of cooling. */
static void
test_partial_spans(void **state)
{
	static const char net[] =
		"name,hot,cold,duty,hot_in,hot_out,cold_in,cold_out,area,"
		"shells\n"
		"E1,H1,C2,240,170,90,80,140,31.5,2\n"
		"E2,H2,C1,90,150,90,20,65,,\n"
		"C-1,H1,cooling water,90,90,60,15,25,12,1\n"
		"C-2,H2,cooling water,90,90,30,,,,\n"
		"S-1,steam,C1,140,180,180,65,135,8.25,1\n";
	hl_case *c = load(net, 1);
	hl_audit *a = audit(c);

	(void)state;
	assert_int_equal(a->nviol, 2);
	assert_string_equal(a->net->unit[a->viol[0].unit].name, "E2");
	assert_int_equal(a->viol[0].kind, HL_VIOL_ACROSS);
	assert_true(fabs(a->viol[0].duty - 90.0) < 1e-9);
	assert_string_equal(a->net->unit[a->viol[1].unit].name, "S-1");
	assert_int_equal(a->viol[1].kind, HL_VIOL_HOT_BELOW);
	assert_true(fabs(a->viol[1].duty - 30.0) < 1e-9);
	assert_true(fabs(a->saving - 120.0) < 1e-9);
	assert_true(fabs(a->saving_cold - 120.0) < 1e-9);
	/* Given areas stay; the others are estimated. */
	assert_true(unit_named(a, "E1")->area == 31.5);
	assert_int_equal(unit_named(a, "E1")->area_estimated, 0);
	assert_int_equal(unit_named(a, "E2")->area_estimated, 1);
	hl_audit_free(a);
	hl_case_free(c);
}

/* A cooler above the pinch: H1 cooled from 120 °C, shifted 115 °C, so
 * 3.0 × 30 = 90 kW of cooling above the pinch (by hand). */
static void
test_cold_above(void **state)
{
	static const char net[] = NET_HEAD
		"E1,H1,C2,150,170,120,80,117.5\n"
		"CW,H1,cooling water,180,120,60,,\n"
		"E2,H2,C1,180,150,30,20,110\n"
		"S1,steam,C1,50,,,110,135\n"
		"S2,steam,C2,90,,,117.5,140\n";
	hl_case *c = load(net, 1);
	hl_audit *a = audit(c);
	const hl_violation *v = NULL;
	size_t i;

	(void)state;
	for (i = 0; i < a->nviol; i++)
		if (a->viol[i].kind == HL_VIOL_COLD_ABOVE)
			v = &a->viol[i];
	assert_non_null(v);
	assert_string_equal(a->net->unit[v->unit].name, "CW");
	assert_true(fabs(v->duty - 90.0) < 1e-9);
	/* The balance closes: the rules broken, less heat passed up. */
	assert_true(fabs(a->violations - a->upward - a->saving) < 1e-9);
	assert_true(fabs(a->saving - (140.0 - 20.0)) < 1e-9);
	hl_audit_free(a);
	hl_case_free(c);
}

/* The minimum-energy network: no violation, no saving, and ΔTmin now is
 * the ΔTmin of the targets. */
static void
test_meets_targets(void **state)
{
	hl_case *c = load(mer, 1);
	hl_audit *a = audit(c);

	(void)state;
	assert_int_equal(a->nviol, 0);
	assert_true(fabs(a->saving) < 1e-9 && fabs(a->saving_cold) < 1e-9);
	assert_true(fabs(a->saving_cost) < 1e-6);
	assert_true(fabs(a->dtmin_now - 10.0) < 1e-6);
	assert_int_equal(a->net->nwarn, 0);
	hl_audit_free(a);
	hl_case_free(c);
}

/* Temperatures left out are walked from the supply end with cp (the MER
 * network above, rows ordered as they meet each stream). */
static void
test_walk_fills(void **state)
{
	static const char net[] = NET_HEAD
		"E1,H1,C2,240,,,,\n"
		"E4,H2,C1,30,90,70,20,35\n"
		"E3,H1,C1,90,,,,\n"
		"E2,H2,C1,90,150,90,80,125\n"
		"S1,steam,C1,20,,,,\n"
		"CW1,H2,cooling water,60,70,,,\n";
	hl_case *c = load(net, 1);
	hl_audit *a = audit(c);
	const hl_existing_unit *e3 = unit_named(a, "E3");
	const hl_existing_unit *e1 = unit_named(a, "E1");
	const hl_existing_unit *s1 = unit_named(a, "S1");

	(void)state;
	assert_true(fabs(e1->hot.t_out - 90.0) < 1e-9);
	assert_true(fabs(e1->cold.t_out - 140.0) < 1e-9);
	assert_true(fabs(e3->hot.t_in - 90.0) < 1e-9);
	assert_true(fabs(e3->hot.t_out - 60.0) < 1e-9);
	assert_true(fabs(e3->cold.t_in - 35.0) < 1e-9);
	assert_true(fabs(e3->cold.t_out - 80.0) < 1e-9);
	assert_true(fabs(s1->cold.t_in - 125.0) < 1e-9);
	assert_true(fabs(unit_named(a, "CW1")->hot.t_out - 30.0) < 1e-9);
	assert_int_equal(a->nviol, 0);
	assert_int_equal(a->net->nunit, 6);
	hl_audit_free(a);
	hl_case_free(c);
}

/* A duty that disagrees with both sides' temperatures (3.0 × 80 = 4.0 ×
 * 60 = 240 kW, not 300): warned at its line, taken from them. */
static void
test_duty_disagrees(void **state)
{
	static const char net[] = NET_HEAD
		"E1,H1,C2,300,170,90,80,140\n"
		"E2,H2,C1,90,150,90,80,125\n"
		"E3,H1,C1,90,90,60,35,80\n"
		"E4,H2,C1,30,90,70,20,35\n"
		"S1,steam,C1,20,,,125,135\n"
		"CW1,H2,cooling water,60,70,30,,\n";
	hl_case *c = load(net, 1);
	hl_audit *a = audit(c);

	(void)state;
	has_warning(a->net, "n.csv", 2, "both sides' temperatures give "
		    "240.0 kW");
	assert_true(fabs(unit_named(a, "E1")->duty - 240.0) < 1e-9);
	hl_audit_free(a);
	hl_case_free(c);
}

/* A duty that disagrees with one side only stands; the side is warned. */
static void
test_duty_one_side(void **state)
{
	static const char net[] = NET_HEAD
		"E1,H1,C2,240,170,90,80,140\n"
		"E2,H2,C1,120,150,90,65,125\n"
		"E3,H1,C1,90,90,60,20,65\n"
		"S1,steam,C1,20,,,125,\n"
		"CW1,H2,cooling water,60,,,,\n";
	hl_case *c = load(net, 1);
	hl_audit *a = NULL;
	hl_error e;

	(void)state;
	/* E2: 120 kW, but H2 gives 1.5 × 60 = 90 kW between 150 and 90 °C;
	 * C1 takes 2.0 × 60 = 120 kW: the duty stands. */
	assert_int_equal(hl_audit_run(c, &a, &e), HL_OK);
	has_warning(a->net, "n.csv", 3, "stream 'H2' changes by 90.0 kW");
	assert_true(unit_named(a, "E2")->duty == 120.0);
	hl_audit_free(a);
	hl_case_free(c);
}

/* A stream whose units stop short of its target: the rest is counted as
 * the cheapest utility that can serve it and warned at the stream's line
 * (C1 is line 2 of s.csv; 230 − 90 = 140 kW from 65 to 135 °C). */
static void
test_stream_short(void **state)
{
	static const char net[] =
		"name,hot,cold,duty,hot_in,hot_out,cold_in,cold_out\n"
		"E1,H1,C2,240,170,90,80,140\n"
		"E2,H2,C1,90,150,90,20,65\n"
		"C-1,H1,cooling water,90,90,60,15,25\n"
		"C-2,H2,cooling water,90,90,30,,\n";
	hl_case *c = load(net, 1);
	hl_audit *a = audit(c);
	const hl_existing_unit *g = unit_named(a, "gap on C1");

	(void)state;
	has_warning(a->net, "s.csv", 2, "stop at 65.0 °C, short of its "
		    "target 135.0 °C");
	assert_int_equal(g->implied, 1);
	assert_true(fabs(g->duty - 140.0) < 1e-9);
	assert_string_equal(hl_existing_side_name(c, &g->hot), "steam");
	assert_true(fabs(a->net->hot_now - 140.0) < 1e-9);
	hl_audit_free(a);
	hl_case_free(c);
}

/* A hole in the middle of a stream, found from the temperatures. */
static void
test_hole(void **state)
{
	static const char net[] = NET_HEAD
		"E1,H1,C2,240,170,90,80,140\n"
		"E2,H2,C1,90,150,90,80,125\n"
		"E4,H2,C1,30,90,70,20,35\n"
		"S1,steam,C1,20,,,125,135\n"
		"CW1,H2,cooling water,60,70,30,,\n";
	hl_case *c = load(net, 1);
	hl_audit *a = audit(c);

	(void)state;
	/* E3 is missing: C1 has no unit from 35 to 80 °C (90 kW), H1 none
	 * from 90 to 60 °C (its end). */
	has_warning(a->net, "n.csv", 3, "leaves 90.0 kW from 35.0 °C");
	has_warning(a->net, "s.csv", 3, "stop at 90.0 °C");
	assert_true(fabs(a->net->hot_now - 110.0) < 1e-9);
	assert_true(fabs(a->net->cold_now - 150.0) < 1e-9);
	hl_audit_free(a);
	hl_case_free(c);
}

/* Readings that make no sense stop with the row's line. */
static void
refused(const char *row, long line, const char *words)
{
	char net[1024];
	hl_case *c;
	hl_audit *a = NULL;
	hl_error e;

	snprintf(net, sizeof net, "%sE1,H1,C2,240,170,90,80,140\n%s\n",
		 NET_HEAD, row);
	c = load(net, 1);
	hl_error_clear(&e);
	assert_int_equal(hl_audit_run(c, &a, &e), HL_EINPUT);
	assert_int_equal(e.line, line);
	assert_string_equal(e.file, "n.csv");
	if (strstr(e.text, words) == NULL)
		fail_msg("'%s' not in '%s'", words, e.text);
	hl_audit_free(a);
	hl_case_free(c);
}

static void
test_refused(void **state)
{
	(void)state;
	refused("E2,H9,C1,90,,,,", 3, "'H9' in column 'hot' is no stream");
	refused("E2,C1,H2,90,,,,", 3, "'C1' in column 'hot' is a cold stream");
	refused("E2,steam,cooling water,90,,,,", 3, "both sides are "
		"utilities");
	refused("E2,cooling water,C1,90,,,,", 3, "a cold utility");
	/* H2 has 180 kW. */
	refused("E2,H2,C1,250,,,,", 3, "past its target");
	refused("E2,H2,C1,90,90,30,75,120", 3, "not above its cold side");
	refused("E2,H2,C1,90,90,150,20,65", 3, "swap hot_in and hot_out");
}

/* The largest ΔTmin at a given QHmin: 20 kW at 10 K (Linnhoff et al.
 * 1982, from memory) and 65 kW at 20 K (derived by a hand cascade). */
static void
test_dtmin_at(void **state)
{
	hl_case *c = load(NULL, 0);
	double dt;

	(void)state;
	assert_int_equal(hl_audit_dtmin_at(c, 20.0, &dt, NULL), HL_OK);
	assert_true(fabs(dt - 10.0) < 1e-6);
	assert_int_equal(hl_audit_dtmin_at(c, 65.0, &dt, NULL), HL_OK);
	assert_true(fabs(dt - 20.0) < 1e-6);
	/* All cold duty from utility: no ΔTmin needs that much. */
	assert_int_equal(hl_audit_dtmin_at(c, 470.0, &dt, NULL), HL_OK);
	assert_true(isinf(dt));
	hl_case_free(c);
}

/* ---- a vertical-transfer (spaghetti) network, constructed here ---- */

static double
curve_t(const hl_curve *cv, double h, int side)
{
	size_t k;

	for (k = 0; k + 1 < cv->n; k++) {
		double a = cv->h[k], b = cv->h[k + 1];

		if (b > a && (side > 0 ? (h >= a && h < b) : (h > a && h <= b)))
			return cv->t[k] + (cv->t[k + 1] - cv->t[k]) *
			       (h - a) / (b - a);
	}
	return side > 0 ? cv->t[0] : cv->t[cv->n - 1];
}

typedef struct {
	const char *name;
	double q;
} member;

/* What lies on one side of one enthalpy interval, from tlo to thi:
 * streams of that kind spanning it, and utilities at their loads. */
static size_t
members(const hl_case *c, const hl_utility_lp *lp, hl_kind kind, double tlo,
	double thi, member *m)
{
	const double eps = 1e-9;
	size_t i, n = 0;

	for (i = 0; i < c->nstream; i++) {
		const hl_stream *s = &c->stream[i];
		double lo = fmin(hl_stream_supply(s), hl_stream_target(s));
		double hi = fmax(hl_stream_supply(s), hl_stream_target(s));

		if (s->kind == kind && thi > tlo && lo <= tlo + eps &&
		    hi >= thi - eps) {
			m[n].name = s->name;
			m[n++].q = s->seg[0].cp * (thi - tlo);
		}
	}
	for (i = 0; i < c->nutil; i++) {
		const hl_utility *u = &c->util[i];
		double lo = fmin(u->supply, u->target);
		double hi = fmax(u->supply, u->target);

		if (u->kind != kind || !(lp->util[i].load > 0.0))
			continue;
		if (hi == lo && thi == tlo && fabs(lo - tlo) < eps) {
			m[n].name = u->name;
			m[n++].q = -1.0; /* the whole interval, filled below */
		} else if (hi > lo && thi > tlo && lo <= tlo + eps &&
			   hi >= thi - eps) {
			m[n].name = u->name;
			m[n++].q = lp->util[i].load * (thi - tlo) / (hi - lo);
		}
	}
	return n;
}

/* Split every enthalpy interval of the balanced composites among its
 * stream pairs in proportion to their heats, q_i·q_j/Q (vertical
 * transfer); each pair is a unit with the interval's temperatures. */
static void
add_spaghetti(hl_case *c, const hl_utility_lp *lp, const hl_curves *cv)
{
	double *x = malloc((cv->bal_hot.n + cv->bal_cold.n) * sizeof *x);
	size_t n = 0, k, i, j, a, b;
	int units = 0;

	for (k = 0; k < cv->bal_hot.n; k++)
		x[n++] = cv->bal_hot.h[k];
	for (k = 0; k < cv->bal_cold.n; k++)
		x[n++] = cv->bal_cold.h[k];
	for (a = 0; a < n; a++)         /* insertion sort, tiny n */
		for (b = a + 1; b < n; b++)
			if (x[b] < x[a]) {
				double t = x[a];
				x[a] = x[b];
				x[b] = t;
			}
	for (k = 0; k + 1 < n; k++) {
		double ha = x[k], hb = x[k + 1], q = hb - ha, sh = 0, sc = 0;
		double th0 = curve_t(&cv->bal_hot, ha, 1);
		double th1 = curve_t(&cv->bal_hot, hb, -1);
		double tc0 = curve_t(&cv->bal_cold, ha, 1);
		double tc1 = curve_t(&cv->bal_cold, hb, -1);
		member hm[8], cm[8];
		size_t nh, nc;

		if (!(q > 1e-9))
			continue;
		nh = members(c, lp, HL_HOT, th0, th1, hm);
		nc = members(c, lp, HL_COLD, tc0, tc1, cm);
		for (i = 0; i < nh; i++)
			sh += hm[i].q = hm[i].q < 0 ? q : hm[i].q;
		for (j = 0; j < nc; j++)
			sc += cm[j].q = cm[j].q < 0 ? q : cm[j].q;
		assert_true(fabs(sh - q) < 1e-9 && fabs(sc - q) < 1e-9);
		for (i = 0; i < nh; i++)
			for (j = 0; j < nc; j++) {
				char name[32];
				hl_unit u;

				snprintf(name, sizeof name, "V%d", ++units);
				memset(&u, 0, sizeof u);
				u.name = name;
				u.hot = (char *)hm[i].name;
				u.cold = (char *)cm[j].name;
				u.duty = hm[i].q * cm[j].q / q;
				u.hot_in = th1;
				u.hot_out = th0;
				u.cold_in = tc0;
				u.cold_out = tc1;
				u.area = NAN;
				u.file = (char *)"built";
				u.line = units;
				assert_int_equal(hl_case_add_unit(c, &u, NULL),
						 HL_OK);
			}
	}
	assert_true(units > 6);
	free(x);
}

/* α of a vertical-transfer network with one h everywhere is 1, and so is
 * each unit's share: each unit has exactly the area the Townsend &
 * Linnhoff (1984) formula gives its interval (the area target is the sum
 * over intervals of the vertical-transfer areas). */
static void
test_spaghetti_alpha(void **state)
{
	hl_case *c = load(NULL, 1);
	hl_cascade *cas = NULL;
	hl_utility_lp *lp = NULL;
	hl_curves *cv = NULL;
	hl_audit *a;
	size_t i;

	(void)state;
	c->set.exchanger = HL_EXCH_COUNTERFLOW;
	assert_int_equal(hl_cascade_compute(c, 10.0, &cas, NULL), HL_OK);
	assert_int_equal(hl_utility_lp_solve(c, 10.0, NULL, &lp, NULL), HL_OK);
	assert_int_equal(hl_curves_compute(c, cas, lp, &cv, NULL), HL_OK);
	add_spaghetti(c, lp, cv);
	a = audit(c);
	assert_int_equal(a->nviol, 0);
	assert_true(fabs(a->saving) < 1e-9);
	assert_true(fabs(a->dtmin_now - 10.0) < 1e-6);
	assert_true(a->have_now);
	/* Bisection to 1e-9 K moves the target area by far less than 1e-6. */
	assert_true(fabs(a->alpha - 1.0) < 1e-6);
	for (i = 0; i < a->net->nunit; i++)
		assert_true(fabs(a->unit_alpha[i] - 1.0) < 1e-6);
	hl_audit_free(a);
	hl_curves_free(cv);
	hl_utility_lp_free(lp);
	hl_cascade_free(cas);
	hl_case_free(c);
}

/* The retrofit curve starts at today's area (A_target(E_now)/α =
 * A_existing by definition), ends at the targets, and each point's
 * investment and payback follow retrofit.h's formulas. */
static void
test_retrofit_curve(void **state)
{
	hl_case *c = load(cross15, 1);
	hl_audit *a = audit(c);
	hl_retrofit *r = NULL;
	const hl_retrofit_point *p0, *p1;
	size_t i;

	(void)state;
	assert_int_equal(hl_retrofit_screen(c, a, 5, &r, NULL), HL_OK);
	assert_int_equal(r->n, 5);
	p0 = &r->pt[0];
	p1 = &r->pt[4];
	assert_true(fabs(p0->area_retrofit - a->area_existing) <
		    1e-6 * a->area_existing);
	assert_true(p0->investment < 1e-6 && p0->saving == 0.0);
	assert_true(fabs(p1->hot_utility - 20.0) < 1e-9);
	assert_true(fabs(p1->dtmin - 10.0) < 1e-12);
	assert_true(fabs(p1->saving - a->saving_cost) < 1e-6);
	for (i = 1; i < r->n; i++) {
		const hl_retrofit_point *p = &r->pt[i];

		assert_true(p->area_target >= r->pt[i - 1].area_target);
		/* New area in shells of the shell target's mean shell, each
		 * at the cost law (retrofit.h). */
		assert_true(fabs(p->shell_cost - (c->set.cost_a +
		    c->set.cost_b * pow(p->shell_area, c->set.cost_c))) <
		    1e-6 * p->shell_cost);
		assert_true(fabs(p->investment - p->new_area / p->shell_area *
				 p->shell_cost) < 1e-6);
		if (p->saving > 0.0)
			assert_true(fabs(p->payback * p->saving -
					 p->investment) < 1e-6);
	}
	assert_true(r->ncurve > 20);
	hl_retrofit_free(r);
	hl_retrofit_free(NULL);
	hl_audit_free(a);
	hl_case_free(c);
}

static void
add_row(hl_case *c, const char *name, const char *hot, const char *cold,
	double duty)
{
	hl_unit u;

	memset(&u, 0, sizeof u);
	u.name = (char *)name;
	u.hot = (char *)hot;
	u.cold = (char *)cold;
	u.duty = duty;
	u.hot_in = u.hot_out = u.cold_in = u.cold_out = u.area = NAN;
	u.file = (char *)"random";
	u.line = (long)c->nunit + 1;
	assert_int_equal(hl_case_add_unit(c, &u, NULL), HL_OK);
}

/* Random units along random streams, rows in the order they meet each
 * stream and no temperatures (the walk places them), the rest of every
 * stream on a utility that reaches everything. */
static void
random_network(hl_case *c, hl_rng *r)
{
	double pos[16] = { 0 };
	char name[32];
	size_t i, k;

	for (k = 0; k < 12; k++) {
		size_t h = (size_t)hl_rng_uniform(r, 0, (double)c->nstream);
		size_t j = (size_t)hl_rng_uniform(r, 0, (double)c->nstream);
		const hl_stream *sh = &c->stream[h], *sc = &c->stream[j];
		double d, th0, th1, tc0, tc1;

		if (h >= c->nstream || j >= c->nstream || sh->kind != HL_HOT ||
		    sc->kind != HL_COLD)
			continue;
		d = hl_rng_uniform(r, 0.2, 1.0) *
		    fmin(hl_stream_duty(sh) - pos[h], hl_stream_duty(sc) - pos[j]);
		if (!(d > 1.0))
			continue;
		th0 = hl_stream_temp_at(sh, pos[h]);
		th1 = hl_stream_temp_at(sh, pos[h] + d);
		tc0 = hl_stream_temp_at(sc, pos[j]);
		tc1 = hl_stream_temp_at(sc, pos[j] + d);
		if (th0 - tc1 < 1.0 || th1 - tc0 < 1.0)
			continue;
		snprintf(name, sizeof name, "R%zu", k);
		add_row(c, name, sh->name, sc->name, d);
		pos[h] += d;
		pos[j] += d;
	}
	for (i = 0; i < c->nstream; i++) {
		const hl_stream *s = &c->stream[i];
		double rest = hl_stream_duty(s) - pos[i];

		snprintf(name, sizeof name, "U%zu", i);
		if (rest > 1e-6 * hl_stream_duty(s))
			add_row(c, name, s->kind == HL_HOT ? s->name : "steam",
				s->kind == HL_HOT ? "brine" : s->name, rest);
	}
}

/* The balance of the pinch rules closes on any network that covers every
 * stream: QH_now − QHmin = QC_now − QCmin = Σ rules broken − Σ heat passed
 * up (derived from the energy balance above the pinch, audit.h). */
static void
test_random_identity(void **state)
{
	static const char util[] =
		"name,kind,supply,target,price\n"
		"steam,hot,400,400,30\nbrine,cold,-50,-40,3\n";
	hl_rng r;
	int n, broken = 0;

	(void)state;
	hl_rng_seed(&r, 7);
	for (n = 0; n < 40; n++) {
		hl_case *c = hl_gen_case(&r, 2 + n % 4, 2 + n % 3);
		hl_audit *a = NULL;
		hl_retrofit *rt = NULL;
		hl_error e;

		assert_int_equal(hl_utility_table_read_mem(c, "u.csv", util,
			strlen(util), &e), HL_OK);
		random_network(c, &r);
		if (hl_audit_run(c, &a, &e) != HL_OK)
			fail_msg("case %d: %s:%ld: %s", n, e.file, e.line,
				 e.text);
		assert_true(fabs(a->saving - a->saving_cold) <
			    1e-6 * (1.0 + fabs(a->saving)));
		assert_true(fabs(a->violations - a->upward - a->saving) <
			    1e-6 * (1.0 + fabs(a->saving)));
		assert_true(a->saving > -1e-6 || a->upward > 0.0);
		broken += a->nviol > 0;
		assert_int_equal(hl_retrofit_screen(c, a, 5, &rt, &e), HL_OK);
		hl_retrofit_free(rt);
		hl_audit_free(a);
		hl_case_free(c);
	}
	assert_true(broken > 20);
}

int
main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_stream_heat),
		cmocka_unit_test(test_cross_pinch),
		cmocka_unit_test(test_partial_spans),
		cmocka_unit_test(test_cold_above),
		cmocka_unit_test(test_meets_targets),
		cmocka_unit_test(test_walk_fills),
		cmocka_unit_test(test_duty_disagrees),
		cmocka_unit_test(test_duty_one_side),
		cmocka_unit_test(test_stream_short),
		cmocka_unit_test(test_hole),
		cmocka_unit_test(test_refused),
		cmocka_unit_test(test_dtmin_at),
		cmocka_unit_test(test_spaghetti_alpha),
		cmocka_unit_test(test_retrofit_curve),
		cmocka_unit_test(test_random_identity),
	};

	return cmocka_run_group_tests(tests, NULL, NULL);
}
