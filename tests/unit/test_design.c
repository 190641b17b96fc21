/* test_design.c - the match MILP's matches placed: generated problems. */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>
#include <stdio.h>
#include <string.h>
#include <cmocka.h>

#include "cascade.h"
#include "gen.h"
#include "match_milp.h"
#include "netcheck.h"
#include "network.h"
#include "network_match.h"

/* Generated problems (gen.h, fixed seeds) at ΔTmin 10 K, matches from the
 * MILP at the problem-table targets (implicit utilities): every network
 * passes the independent check (netcheck.h), keeps every approach, uses
 * the targets plus exactly the energy penalty it declares, and either has
 * one unit per match with no penalty or says in a note why not (a fact of
 * the placement's contract, network.h). */
static void
test_generated(void **state)
{
	hl_rng r;
	int trial, same = 0, clean = 0;

	(void)state;
	hl_rng_seed(&r, 7);
	for (trial = 0; trial < 24; trial++) {
		int nh = 2 + trial % 4, nc = 2 + (trial / 4) % 4;
		hl_case *c = hl_gen_case(&r, nh, nc);
		hl_match_options mo;
		hl_match_result *mr = NULL;
		hl_network_feed feed;
		hl_network *net = NULL;
		hl_netcheck *chk = NULL;
		hl_error err;
		double qh, qc;
		size_t i;

		c->set.dtmin = 10.0;
		assert_int_equal(hl_cascade_targets(c, 10.0, &qh, &qc, NULL),
		    HL_OK);
		hl_match_options_default(&mo, c);
		mo.time_limit = 2.0;
		assert_int_equal(hl_match_solve(c, 10.0, NULL, &mo, &mr, &err),
		    HL_OK);
		assert_int_equal(hl_network_from_matches(c, mr, qh, qc, &feed,
		    &err), HL_OK);
		if (hl_network_place(&feed.in, &net, &err) != HL_OK) {
			print_error("trial %d: %s\n", trial, err.text);
			fail();
		}
		assert_int_equal(hl_netcheck_run(net, &chk, NULL), HL_OK);
		for (i = 0; i < chk->n; i++)
			print_error("trial %d: %s: %s\n", trial, chk->f[i].what,
			    chk->f[i].text);
		assert_int_equal(chk->n, 0);
		for (i = 0; i < net->nunit; i++)
			assert_true(net->unit[i].approach >=
			    net->unit[i].required - 1e-6);
		assert_true(fabs(net->qh - (qh + net->penalty)) <=
		    1e-6 * fmax(1.0, qh));
		assert_true(fabs(net->qc - (qc + net->penalty)) <=
		    1e-6 * fmax(1.0, qc));
		if (net->nunit != mr->nmatch || net->penalty > 0.0)
			assert_true(net->nnote > 0);
		same += net->nunit == mr->nmatch;
		clean += net->penalty == 0.0;
		hl_netcheck_free(chk);
		hl_network_free(net);
		hl_network_feed_free(&feed);
		hl_match_result_free(mr);
		hl_case_free(c);
	}
	print_message("MILP matches: %d of 24 with one unit per match, %d of "
	    "24 at the targets\n", same, clean);
}

/* The four-stream problem (Linnhoff et al. 1982; Kemp 2007, ch. 2; from
 * memory, see tests/data/good/kemp4.csv): the MILP's six matches place as
 * six units at the targets, 20 / 60 kW, with the pinch design network's
 * temperatures (derived by hand; also checked in tests/cli/design.sh). */
static void
test_kemp4(void **state)
{
	hl_case *c = hl_gen_kemp4();
	hl_match_options mo;
	hl_match_result *mr = NULL;
	hl_network_feed feed;
	hl_network *net = NULL;
	size_t i;
	int found = 0;

	(void)state;
	c->set.dtmin = 10.0;
	hl_match_options_default(&mo, c);
	assert_int_equal(hl_match_solve(c, 10.0, NULL, &mo, &mr, NULL), HL_OK);
	assert_int_equal(mr->nmatch, 6);
	assert_int_equal(hl_network_from_matches(c, mr, 20.0, 60.0, &feed,
	    NULL), HL_OK);
	assert_int_equal(hl_network_place(&feed.in, &net, NULL), HL_OK);
	assert_int_equal(net->nunit, 6);
	assert_true(fabs(net->qh - 20.0) < 1e-9);
	assert_true(fabs(net->qc - 60.0) < 1e-9);
	for (i = 0; i < net->nunit; i++) {
		const hl_network_unit *u = &net->unit[i];

		if (strcmp(net->party[u->hot].name, "H1") == 0 &&
		    strcmp(net->party[u->cold].name, "C2") == 0) {
			assert_true(fabs(u->hot_out - 90.0) < 1e-9);
			assert_true(fabs(u->cold_out - 140.0) < 1e-9);
			found = 1;
		}
	}
	assert_true(found);
	hl_network_free(net);
	hl_network_feed_free(&feed);
	hl_match_result_free(mr);
	hl_case_free(c);
}

int
main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_kemp4),
		cmocka_unit_test(test_generated),
	};

	return cmocka_run_group_tests(tests, NULL, NULL);
}
