/* test_match.c - the fewest-units MILP against published and hand-derived
 * answers, an exhaustive search, and an independent heat-balance check. */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>
#include <cmocka.h>

#include <libxml/parser.h>
#include <libxml/relaxng.h>

#include "gen.h"
#include "match_brute.h"
#include "match_check.h"
#include "match_milp.h"
#include "matches_out.h"
#include "near.h"
#include "result_xml.h"

/* Heat balances hold to this share of the largest party heat (LP
 * tolerances are 1e-7 relative). */
#define BAL 1e-6
/* Published and hand-derived duties, kW: GLPK solutions to 1e-6 relative. */
#define REL 1e-6

/* Linnhoff et al., User Guide on Process Integration for the Efficient Use
 * of Energy (IChemE 1982); also Kemp, Pinch Analysis and Process
 * Integration, 2nd ed. (2007), ch. 2. Streams from memory, targets confirmed
 * by a hand cascade (doc/references.md): ΔTmin 10 K, 20 / 60 kW, pinch
 * 90/80 °C. */
static hl_case *
four_stream(void)
{
	return hl_gen_kemp4();
}

static void
add_rule(hl_case *c, hl_rule_kind kind, const char *hot, const char *cold,
	 double max_duty, long line)
{
	hl_match_rule r = { kind, (char *)hot, (char *)cold, max_duty,
			    (char *)"test", (char *)"rules.xml", line };

	assert_int_equal(hl_case_add_rule(c, &r, NULL), HL_OK);
}

static hl_match_result *
solve(const hl_case *c, const double *loads, double limit)
{
	hl_match_options o;
	hl_match_result *r = NULL;
	hl_error err;

	hl_match_options_default(&o, c);
	o.time_limit = limit;
	hl_error_clear(&err);
	if (hl_match_solve(c, c->set.dtmin, loads, &o, &r, &err) != HL_OK) {
		print_error("solve: %s\n", err.text);
		fail();
	}
	assert_int_equal(hl_check_matches(c, c->set.dtmin, r, BAL), 0);
	return r;
}

static const hl_match *
find(const hl_match_result *r, const char *hot, const char *cold,
     const char *region)
{
	size_t i;

	for (i = 0; i < r->nmatch; i++) {
		const hl_match *m = &r->match[i];

		if (strcmp(r->party[m->hot].name, hot) == 0 &&
		    strcmp(r->party[m->cold].name, cold) == 0 &&
		    (region == NULL || strcmp(r->sub[m->sub].label, region) == 0))
			return m;
	}
	return NULL;
}

/* Fewest units meeting the targets: 6, three on each side of the pinch.
 * Derived by hand from the Euler rule (doc/references.md): above the pinch H1
 * and C2 both carry 240 kW and form an independent subset, so 5 parties in
 * 2 subsets need 3 units; below, 4 parties need 3. */
static void
test_four_stream_units(void **state)
{
	hl_case *c = four_stream();
	hl_match_result *r = solve(c, NULL, 10.0);
	const hl_match *m;

	(void)state;
	assert_int_equal(r->units, 6);
	assert_true(r->optimal);
	assert_int_equal(r->lower, 6);
	assert_int_equal(r->nsub, 2);
	assert_string_equal(r->sub[0].label, "above-pinch-1");
	assert_string_equal(r->sub[1].label, "below-pinch-1");
	assert_int_equal(r->sub[0].units, 3);
	assert_int_equal(r->sub[1].units, 3);
	/* N - 1 per side would say 4 + 3 (doc/references.md). */
	assert_int_equal(r->sub[0].euler, 4);
	assert_int_equal(r->sub[1].euler, 3);
	assert_rel(r->sub[0].top, 165.0, REL);
	assert_rel(r->sub[0].bottom, 85.0, REL);
	assert_rel(r->qh, 20.0, REL);
	assert_rel(r->qc, 60.0, REL);
	/* The independent subset is one unit of 240 kW (same derivation). */
	m = find(r, "H1", "C2", "above-pinch-1");
	assert_non_null(m);
	assert_rel(m->duty, 240.0, REL);
	hl_match_result_free(r);
	hl_case_free(c);
}

/* A segmented stream is one party: splitting H1 at 120 °C changes nothing
 * (same derivation as above). */
static void
test_segmented_stream(void **state)
{
	hl_case *c = hl_case_create();
	hl_segment g[2] = {
		{ .supply = 170, .target = 120, .cp = 3.0, .h = NAN },
		{ .supply = 120, .target = 60, .cp = 3.0, .h = NAN }
	};
	hl_stream s;
	hl_match_result *r;

	(void)state;
	memset(&s, 0, sizeof s);
	s.name = (char *)"H1";
	s.kind = HL_HOT;
	s.nseg = 2;
	s.seg = g;
	s.dt_contrib = s.cp_tol = s.t_tol = NAN;
	hl_gen_add(c, "C1", 20, 135, 2.0);
	assert_int_equal(hl_case_add_stream(c, &s, NULL), HL_OK);
	hl_gen_add(c, "C2", 80, 140, 4.0);
	hl_gen_add(c, "H2", 150, 30, 1.5);
	r = solve(c, NULL, 10.0);
	assert_int_equal(r->units, 6);
	hl_match_result_free(r);
	hl_case_free(c);
}

/* One small random problem: the MILP's count equals the exhaustive
 * search's, part by part; 0 when the search could not run. */
static int
compare_brute(int nh, int nc, uint64_t seed, int *above_bound)
{
	hl_rng rng;
	hl_case *c;
	hl_match_result *r;
	hl_brute b;
	size_t s;

	hl_rng_seed(&rng, seed);
	c = hl_gen_case(&rng, nh, nc);
	if (hl_brute_units(c, 10.0, &b) != 0) {
		hl_case_free(c);
		return 0;
	}
	r = solve(c, NULL, 10.0);
	assert_true(r->optimal);
	assert_rel(r->qh, b.qh, 1e-9);
	assert_int_equal(r->nsub, b.nsub);
	for (s = 0; s < r->nsub; s++) {
		assert_int_equal(r->sub[s].units, b.units[s]);
		*above_bound |= b.units[s] > r->sub[s].subset_bound;
	}
	hl_match_result_free(r);
	hl_case_free(c);
	return 1;
}

/* The MILP's count equals an exhaustive search over match subsets, part by
 * part, on small random problems (fixed seeds); the second list holds
 * problems whose optimum lies above the Euler and subset bounds, so that
 * the branch and bound itself is tried, not only the bound. */
static void
test_brute_force(void **state)
{
	static const int shape[][2] = { { 2, 2 }, { 2, 3 }, { 3, 2 }, { 3, 3 } };
	static const int above[][3] = {
		{ 2, 2, 2202 }, { 2, 2, 2241 }, { 2, 3, 2304 }, { 2, 3, 2308 },
		{ 2, 3, 2311 }, { 3, 2, 3225 }, { 3, 2, 3284 }
	};
	int seed, k, compared = 0, over = 0, over_each;

	(void)state;
	for (k = 0; k < 4; k++)
		for (seed = 1; seed <= 6; seed++)
			compared += compare_brute(shape[k][0], shape[k][1],
						  (uint64_t)(100 * k + seed), &over);
	assert_true(compared >= 18);
	for (k = 0; k < 7; k++) {
		over_each = 0;
		assert_int_equal(compare_brute(above[k][0], above[k][1],
					       (uint64_t)above[k][2], &over_each), 1);
		assert_true(over_each);
	}
}

/* The textbook model (big-M = the smaller heat, nothing else) reaches the
 * same optimum on the same problems: the tightening cuts no solution off. */
static void
test_textbook_agrees(void **state)
{
	int seed;

	(void)state;
	for (seed = 1; seed <= 6; seed++) {
		hl_rng rng;
		hl_case *c;
		hl_match_options o;
		hl_match_result *tight, *plain;
		hl_error err;

		hl_rng_seed(&rng, (uint64_t)(300 + seed));
		c = hl_gen_case(&rng, 3, 3);
		tight = solve(c, NULL, 10.0);
		hl_match_options_default(&o, c);
		o.textbook = 1;
		assert_int_equal(hl_match_solve(c, 10.0, NULL, &o, &plain, &err),
				 HL_OK);
		assert_int_equal(hl_check_matches(c, 10.0, plain, BAL), 0);
		assert_true(plain->optimal);
		assert_int_equal(plain->units, tight->units);
		hl_match_result_free(tight);
		hl_match_result_free(plain);
		hl_case_free(c);
	}
}

/* Subnetworks solved on two threads (each with its own GLPK environment)
 * give what one thread gives. */
static void
test_threads_agree(void **state)
{
	int seed;

	(void)state;
	for (seed = 1; seed <= 4; seed++) {
		hl_rng rng;
		hl_case *c;
		hl_match_options o;
		hl_match_result *two, *one;
		hl_error err;
		size_t s;

		hl_rng_seed(&rng, (uint64_t)(500 + seed));
		c = hl_gen_case(&rng, 4, 4);
		two = solve(c, NULL, 10.0);
		hl_match_options_default(&o, c);
		o.threads = 1;
		assert_int_equal(hl_match_solve(c, 10.0, NULL, &o, &one, &err),
				 HL_OK);
		assert_int_equal(one->nsub, two->nsub);
		for (s = 0; s < one->nsub; s++)
			assert_int_equal(one->sub[s].units, two->sub[s].units);
		assert_int_equal(one->optimal, two->optimal);
		hl_match_result_free(one);
		hl_match_result_free(two);
		hl_case_free(c);
	}
}

/* Two identical hot streams (parallel trains): the symmetry rows keep the
 * exhaustive search's count. */
static void
test_identical_streams(void **state)
{
	hl_case *c = hl_case_create();
	hl_match_result *r;
	hl_brute b;
	size_t s;

	(void)state;
	hl_gen_add(c, "H1", 180, 60, 2.0);
	hl_gen_add(c, "H2", 180, 60, 2.0);
	hl_gen_add(c, "C1", 30, 150, 3.0);
	hl_gen_add(c, "C2", 90, 160, 1.0);
	assert_int_equal(hl_brute_units(c, 10.0, &b), 0);
	r = solve(c, NULL, 10.0);
	assert_true(r->optimal);
	assert_int_equal(r->nsub, b.nsub);
	for (s = 0; s < r->nsub; s++)
		assert_int_equal(r->sub[s].units, b.units[s]);
	hl_match_result_free(r);
	hl_case_free(c);
}

/* The exhaustive search finds exactly one 3-unit network above the pinch,
 * and it uses H1-C2. Forbidding H1-C2 must change the answer: C2 can then
 * only take H2's 90 kW above the pinch, so the hot utility rises to 150 kW
 * and the cold utility to 190 kW (derived by hand from the cascade). */
static void
test_forbid_unique_optimum(void **state)
{
	hl_case *c = four_stream();
	hl_match_result *r;
	hl_brute b;
	size_t i;
	int uses = 0;

	(void)state;
	assert_int_equal(hl_brute_units(c, 10.0, &b), 0);
	assert_int_equal(b.optima[0], 1);
	for (i = 0; b.best[0][i][0][0] != '\0'; i++)
		uses |= strcmp(b.best[0][i][0], "H1") == 0 &&
			strcmp(b.best[0][i][1], "C2") == 0;
	assert_true(uses);
	add_rule(c, HL_RULE_FORBID, "H1", "C2", NAN, 7);
	r = solve(c, NULL, 10.0);
	assert_null(find(r, "H1", "C2", NULL));
	assert_true(r->restricted);
	assert_rel(r->qh0, 20.0, REL);
	assert_rel(r->qh, 150.0, REL);
	assert_rel(r->qc, 190.0, REL);
	assert_int_equal(r->ncause, 1);
	assert_int_equal(r->cause[0].pairs, 1);
	assert_rel(r->cause[0].rise, 130.0, REL);
	hl_match_result_free(r);
	hl_case_free(c);
}

/* Forbid both hot streams for C1: its whole 230 kW comes from the hot
 * utility (hot utility 230 kW, cold 270 kW, derived by hand), and the
 * report says so. */
static void
test_forbid_all_of_cold(void **state)
{
	hl_case *c = four_stream();
	hl_match_result *r;
	char *text = NULL;
	size_t len = 0, i;
	FILE *fp;

	(void)state;
	add_rule(c, HL_RULE_FORBID, "H1", "C1", NAN, 3);
	add_rule(c, HL_RULE_FORBID, "H2", "C1", NAN, 4);
	r = solve(c, NULL, 10.0);
	assert_rel(r->qh, 230.0, REL);
	assert_rel(r->qc, 270.0, REL);
	for (i = 0; i < r->nparty; i++)
		if (strcmp(r->party[i].name, "C1") == 0) {
			assert_true(r->party[i].isolated);
			assert_rel(r->party[i].utility_duty, 230.0, REL);
		} else {
			assert_false(r->party[i].isolated);
		}
	fp = open_memstream(&text, &len);
	hl_matches_text(fp, c, r, 10.0, NULL);
	fclose(fp);
	assert_non_null(strstr(text, "cold stream 'C1' may not be matched with "
			       "any hot process stream: its whole duty, 230.0 "
			       "kW, goes to utilities"));
	assert_non_null(strstr(text, "hot utility 20.0 -> 230.0 kW"));
	assert_non_null(strstr(text, "rules.xml:3"));
	/* Either rule alone: C1 may take H1's (or H2's) heat, but below the
	   pinch that stream has 90 kW for C1's 120, so 30 kW more must come
	   down from the hot utility: 50 kW, a rise of 180 kW each (derived
	   by hand from the cascade). */
	assert_int_equal(r->ncause, 2);
	assert_rel(r->cause[0].rise, 180.0, REL);
	assert_rel(r->cause[1].rise, 180.0, REL);
	free(text);
	hl_match_result_free(r);
	hl_case_free(c);
}

/* Requiring H2-C2 joins the two subsets above the pinch: 5 parties in one
 * component need 4 units, 7 in all (Euler rule, derived by hand). */
static void
test_required_match(void **state)
{
	hl_case *c = four_stream();
	hl_match_result *r;
	const hl_match *m;

	(void)state;
	add_rule(c, HL_RULE_REQUIRE, "H2", "C2", NAN, 9);
	r = solve(c, NULL, 10.0);
	m = find(r, "H2", "C2", NULL);
	assert_non_null(m);
	assert_true(m->required);
	assert_true(m->duty > 0.0);
	assert_int_equal(r->units, 7);
	assert_true(r->optimal);
	assert_false(r->restricted);
	hl_match_result_free(r);
	hl_case_free(c);
}

/* At most 200 kW between H1 and C2: the 240 kW subset cannot close, so
 * above the pinch the network is connected (4 units), while H2's 90 kW
 * still covers C2's remaining 40 kW: no rise in the targets (derived by
 * hand). */
static void
test_max_duty(void **state)
{
	hl_case *c = four_stream();
	hl_match_result *r;
	const hl_match *m;

	(void)state;
	add_rule(c, HL_RULE_MAX_DUTY, "H1", "C2", 200.0, 5);
	r = solve(c, NULL, 10.0);
	m = find(r, "H1", "C2", NULL);
	assert_non_null(m);
	assert_true(m->duty <= 200.0 * (1.0 + 1e-9));
	assert_int_equal(r->sub[0].units, 4);
	assert_false(r->restricted);
	assert_rel(r->qh, 20.0, REL);
	hl_match_result_free(r);
	hl_case_free(c);
}

static hl_case *
four_stream_areas(hl_area_policy policy)
{
	hl_case *c = four_stream();
	size_t i;

	for (i = 0; i < c->nstream; i++)
		c->stream[i].area = strdup(c->stream[i].name[1] == '1' ? "east" :
					   "west");
	c->set.area_policy = policy;
	return c;
}

/* Areas east (H1, C1) and west (H2, C2), cross-area matches forbidden: C2
 * gets only H2's 90 kW above the pinch, so the hot utility is 150 kW and
 * the cold 190 kW (derived by hand); no match crosses. */
static void
test_areas_forbid(void **state)
{
	hl_case *c = four_stream_areas(HL_AREAS_FORBID);
	hl_match_result *r;
	size_t i;

	(void)state;
	r = solve(c, NULL, 10.0);
	assert_rel(r->qh, 150.0, REL);
	assert_rel(r->qc, 190.0, REL);
	for (i = 0; i < r->nmatch; i++)
		assert_false(r->match[i].cross_area);
	assert_int_equal(r->ncause, 1);
	assert_int_equal(r->cause[0].rule, -1);
	assert_int_equal(r->cause[0].pairs, 2);
	assert_rel(r->cause[0].rise, 130.0, REL);
	hl_match_result_free(r);
	hl_case_free(c);
}

/* Penalised instead: the targets stay, and each cross-area unit counts as
 * the penalty's number of units (case.h). */
static void
test_areas_penalise(void **state)
{
	hl_case *c = four_stream_areas(HL_AREAS_PENALISE);
	hl_match_result *r;
	size_t i, cross = 0;

	(void)state;
	c->set.area_penalty = 2.0;
	r = solve(c, NULL, 10.0);
	assert_false(r->restricted);
	assert_true(r->penalised);
	assert_true(r->optimal);
	for (i = 0; i < r->nmatch; i++)
		cross += r->match[i].cross_area;
	assert_rel(r->objective, (double)(r->units - cross) + 2.0 *
		   (double)cross, 1e-12);
	assert_true(r->units >= 6);
	hl_match_result_free(r);
	hl_case_free(c);
}

static void
expect_error(hl_case *c, hl_status want, const char *text, long line)
{
	hl_match_options o;
	hl_match_result *r = NULL;
	hl_error err;

	hl_match_options_default(&o, c);
	hl_error_clear(&err);
	assert_int_equal(hl_match_solve(c, 10.0, NULL, &o, &r, &err), want);
	assert_null(r);
	if (strstr(err.text, text) == NULL) {
		print_error("message '%s' lacks '%s'\n", err.text, text);
		fail();
	}
	if (line > 0) {
		assert_string_equal(err.file, "rules.xml");
		assert_int_equal(err.line, line);
	}
}

static void
test_rule_errors(void **state)
{
	hl_case *c;

	(void)state;
	c = four_stream();
	add_rule(c, HL_RULE_FORBID, "H9", "C1", NAN, 11);
	expect_error(c, HL_EINPUT, "'H9', which is no stream", 11);
	hl_case_free(c);
	c = four_stream();
	add_rule(c, HL_RULE_FORBID, "C1", "H1", NAN, 12);
	expect_error(c, HL_EINPUT, "give the hot side first", 12);
	hl_case_free(c);
	c = four_stream();
	add_rule(c, HL_RULE_FORBID, "H1", "C1", NAN, 13);
	add_rule(c, HL_RULE_REQUIRE, "H1", "C1", NAN, 14);
	expect_error(c, HL_EINPUT, "both forbidden and required", 14);
	hl_case_free(c);
	c = four_stream();
	add_rule(c, HL_RULE_MAX_DUTY, "H1", "C1", -5.0, 15);
	expect_error(c, HL_EINPUT, "must be a number >= 0 kW", 15);
	hl_case_free(c);
	/* "*" names every hot stream and utility: nothing may heat C1. */
	c = four_stream();
	add_rule(c, HL_RULE_FORBID, "*", "C1", NAN, 16);
	expect_error(c, HL_ENOSOLUTION, "nothing may heat cold stream 'C1'", 0);
	hl_case_free(c);
	/* H3 (50 -> 40 °C) is colder than C2 (80 -> 140 °C) everywhere. */
	c = four_stream();
	hl_gen_add(c, "H3", 50, 40, 1.0);
	add_rule(c, HL_RULE_REQUIRE, "H3", "C2", NAN, 17);
	expect_error(c, HL_ENOSOLUTION, "cannot exchange heat", 17);
	hl_case_free(c);
}

/* Utility levels at given loads: HP steam at 180 °C 5 kW, LP steam at 100 °C
 * 15 kW (the deficit between 95 and 85 °C shifted), cooling water 15 -> 25 °C
 * 60 kW. LP steam makes a utility pinch at 95 °C shifted above the process
 * pinch at 85 (derived by hand from the cascade, doc/references.md): three
 * subnetworks. */
static void
test_utility_levels(void **state)
{
	hl_case *c = four_stream();
	double loads[3] = { 5.0, 15.0, 60.0 };
	hl_match_result *r;

	(void)state;
	hl_gen_add_utility(c, "HP steam", HL_HOT, 180, 180, 0.0, NAN);
	hl_gen_add_utility(c, "LP steam", HL_HOT, 100, 100, 0.0, NAN);
	hl_gen_add_utility(c, "cooling water", HL_COLD, 15, 25, 0.0, NAN);
	r = solve(c, loads, 10.0);
	assert_int_equal(r->nsub, 3);
	assert_string_equal(r->sub[0].label, "above-pinch-1");
	assert_string_equal(r->sub[1].label, "between-pinch-1-2");
	assert_string_equal(r->sub[2].label, "below-pinch-2");
	assert_rel(r->sub[0].bottom, 95.0, REL);
	assert_rel(r->sub[1].bottom, 85.0, REL);
	assert_true(r->optimal);
	assert_false(r->implicit_utilities);
	assert_true(find(r, "LP steam", "C1", "between-pinch-1-2") != NULL ||
		    find(r, "LP steam", "C2", "between-pinch-1-2") != NULL);
	hl_match_result_free(r);
	/* Loads that cannot be met are refused with a sentence. */
	loads[1] = 30.0;
	{
		hl_match_options o;
		hl_error err;

		hl_match_options_default(&o, c);
		assert_int_equal(hl_match_solve(c, 10.0, loads, &o, &r, &err),
				 HL_ENOSOLUTION);
		assert_non_null(strstr(err.text, "do not meet the targets"));
	}
	hl_case_free(c);
}

/* A tiny time limit on a hard generated problem: the best network found
 * with its gap, or exit 3 with a sentence; never a hang. The problem
 * (10 x 10, seed 8) is one the search does not close in 300 s. */
static void
test_tiny_time_limit(void **state)
{
	hl_rng rng;
	hl_case *c;
	hl_match_options o;
	hl_match_result *r = NULL;
	hl_error err;
	hl_status st;

	(void)state;
	hl_rng_seed(&rng, 8);
	c = hl_gen_case(&rng, 10, 10);
	hl_match_options_default(&o, c);
	o.time_limit = 0.001;
	hl_error_clear(&err);
	st = hl_match_solve(c, 10.0, NULL, &o, &r, &err);
	if (st == HL_OK) {
		assert_false(r->optimal);
		assert_true(r->gap > 0.0);
		assert_true(r->lower < r->units);
		assert_int_equal(hl_check_matches(c, 10.0, r, BAL), 0);
	} else {
		assert_int_equal(st, HL_ENOSOLUTION);
		assert_non_null(strstr(err.text, "time limit"));
	}
	hl_match_result_free(r);
	hl_case_free(c);
}

/* The exported model, read back by GLPK from the file and solved there from
 * scratch (its own presolver and search), gives the same fewest units. */
static void
test_export_round_trip(void **state)
{
	hl_case *c = four_stream();
	hl_match_problem *p;
	glp_prob *P, *Q;
	hl_glpk_guard g;
	hl_error err;
	hl_match_options o;
	glp_iocp parm;
	char path[] = "/tmp/heatloom-model-XXXXXX";
	int fd = mkstemp(path);

	(void)state;
	assert_true(fd >= 0);
	close(fd);
	assert_int_equal(hl_match_prepare(c, 10.0, NULL, NULL, NULL, &p, &err),
			 HL_OK);
	hl_glpk_guard_begin(&g, NULL, NULL, 0);
	if (HL_GLPK_CRASHED(&g))
		fail();
	hl_match_options_default(&o, c);
	assert_int_equal(hl_match_model(p, &o, &P, &err), HL_OK);
	assert_int_equal(glp_write_lp(P, NULL, path), 0);
	Q = glp_create_prob();
	assert_int_equal(glp_read_lp(Q, NULL, path), 0);
	assert_int_equal(glp_get_num_cols(Q), glp_get_num_cols(P));
	glp_init_iocp(&parm);
	parm.presolve = GLP_ON;
	parm.msg_lev = GLP_MSG_OFF;
	assert_int_equal(glp_intopt(Q, &parm), 0);
	assert_int_equal(glp_mip_status(Q), GLP_OPT);
	assert_rel(glp_mip_obj_val(Q), 6.0, 1e-9);
	glp_delete_prob(Q);
	glp_delete_prob(P);
	hl_glpk_guard_end(&g);
	unlink(path);
	hl_match_problem_free(p);
	hl_case_free(c);
}

/* The XML writer's <matches> follows doc/results.rng, with rules, isolated
 * streams, penalties and case utilities present (the command line cannot
 * give rules without a case file). */
static int
valid_xml(const hl_case *c, const hl_match_result *r, const char *rng)
{
	hl_xml_out *x = hl_xml_out_begin("case.xml");
	char *buf = NULL;
	size_t len = 0;
	FILE *fp = open_memstream(&buf, &len);
	xmlRelaxNGParserCtxtPtr pc = xmlRelaxNGNewParserCtxt(rng);
	xmlRelaxNGPtr schema = xmlRelaxNGParse(pc);
	xmlRelaxNGValidCtxtPtr vc = xmlRelaxNGNewValidCtxt(schema);
	xmlDocPtr doc;
	int ok;

	assert_int_equal(hl_matches_xml(hl_xml_out_writer(x), c, r, 10.0), 0);
	assert_int_equal(hl_xml_out_finish(x, fp, NULL), HL_OK);
	fclose(fp);
	doc = xmlReadMemory(buf, (int)len, "m.xml", NULL, XML_PARSE_NONET);
	ok = doc != NULL && xmlRelaxNGValidateDoc(vc, doc) == 0;
	xmlFreeDoc(doc);
	xmlRelaxNGFreeValidCtxt(vc);
	xmlRelaxNGFree(schema);
	xmlRelaxNGFreeParserCtxt(pc);
	hl_xml_out_free(x);
	free(buf);
	return ok;
}

static void
test_xml_schema(void **state)
{
	const char *top = getenv("TOP_SRCDIR");
	char rng[1024];
	hl_case *c;
	hl_match_result *r;

	(void)state;
	if (top == NULL)
		skip();
	snprintf(rng, sizeof rng, "%s/doc/results.rng", top);
	c = four_stream();
	add_rule(c, HL_RULE_FORBID, "H1", "C1", NAN, 3);
	add_rule(c, HL_RULE_FORBID, "H2", "C1", NAN, 4);
	add_rule(c, HL_RULE_MAX_DUTY, "H1", "C2", 500.0, 5);
	add_rule(c, HL_RULE_REQUIRE, "H2", "C2", NAN, 6);
	r = solve(c, NULL, 10.0);
	assert_true(valid_xml(c, r, rng));
	hl_match_result_free(r);
	hl_case_free(c);
	c = four_stream_areas(HL_AREAS_PENALISE);
	r = solve(c, NULL, 10.0);
	assert_true(valid_xml(c, r, rng));
	hl_match_result_free(r);
	hl_case_free(c);
}

int
main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_four_stream_units),
		cmocka_unit_test(test_segmented_stream),
		cmocka_unit_test(test_brute_force),
		cmocka_unit_test(test_textbook_agrees),
		cmocka_unit_test(test_threads_agree),
		cmocka_unit_test(test_identical_streams),
		cmocka_unit_test(test_forbid_unique_optimum),
		cmocka_unit_test(test_forbid_all_of_cold),
		cmocka_unit_test(test_required_match),
		cmocka_unit_test(test_max_duty),
		cmocka_unit_test(test_areas_forbid),
		cmocka_unit_test(test_areas_penalise),
		cmocka_unit_test(test_rule_errors),
		cmocka_unit_test(test_utility_levels),
		cmocka_unit_test(test_tiny_time_limit),
		cmocka_unit_test(test_export_round_trip),
		cmocka_unit_test(test_xml_schema),
	};

	return cmocka_run_group_tests(tests, NULL, NULL);
}
