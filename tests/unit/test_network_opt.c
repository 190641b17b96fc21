/* test_network_opt.c - the least-cost search on generated problems: every
 * network passes the independent check, every limit the engineer sets is
 * kept, the result never costs more than its start, and the same seed gives
 * the same network whatever the thread count. These are the optimiser's own
 * contract (network_opt.h); the published benchmarks are in
 * tests/cli/published_opt.sh. */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <cmocka.h>

#include "cascade.h"
#include "gen.h"
#include "match_milp.h"
#include "netcheck.h"
#include "network.h"
#include "network_match.h"
#include "network_opt.h"
#include "network_opt_int.h"
#include "utility_lp.h"

/* A generated case with a steam and a cooling-water level (invented
 * prices) and a cost law of the usual form. */
static hl_case *
priced_case(hl_rng *r, int nh, int nc)
{
	hl_case *c = hl_gen_case(r, nh, nc);

	c->set.dtmin = 10.0;
	c->set.cost_a = 10000.0;
	c->set.cost_b = 800.0;
	c->set.cost_c = 0.8;
	hl_gen_add_utility(c, "steam", HL_HOT, 330.0, 330.0, 30.0, NAN);
	hl_gen_add_utility(c, "water", HL_COLD, 5.0, 15.0, 2.0, NAN);
	return c;
}

static void
sound(const hl_network *net)
{
	hl_netcheck *chk = NULL;
	size_t i;

	assert_int_equal(hl_netcheck_run(net, &chk, NULL), HL_OK);
	for (i = 0; i < chk->n; i++)
		print_error("%s: %s\n", chk->f[i].what, chk->f[i].text);
	assert_int_equal(chk->n, 0);
	hl_netcheck_free(chk);
}

/* The search at a small effort; NULL when it says no network keeps the
 * limits (only allowed where the caller says so). */
static hl_opt_result *
run_may_fail(const hl_case *c, hl_opt_options *o, int may_fail)
{
	hl_opt_result *r = NULL;
	hl_error err;
	hl_status st;

	o->effort = 0.05;
	o->time_limit = 0.0;
	st = hl_network_optimise(c, o, &r, &err);
	if (st == HL_ENOSOLUTION && may_fail)
		return NULL;
	if (st != HL_OK) {
		print_error("%s\n", err.text);
		fail();
	}
	sound(r->net);
	return r;
}

static hl_opt_result *
run(const hl_case *c, hl_opt_options *o)
{
	return run_may_fail(c, o, 0);
}

/* Units on process stream p in its stage `stage`. */
static int
branches(const hl_network *net, size_t p, int stage)
{
	size_t i;
	int n = 0;

	for (i = 0; i < net->nunit; i++)
		n += (net->unit[i].hot == p && net->unit[i].hot_stage == stage) ||
		    (net->unit[i].cold == p && net->unit[i].cold_stage == stage);
	return n;
}

static int
most_branches(const hl_network *net)
{
	size_t i;
	int m = 1;

	for (i = 0; i < net->nunit; i++) {
		const hl_network_unit *u = &net->unit[i];

		if (!net->party[u->hot].utility)
			m = fmax(m, branches(net, u->hot, u->hot_stage));
		if (!net->party[u->cold].utility)
			m = fmax(m, branches(net, u->cold, u->cold_stage));
	}
	return m;
}

static void
test_limits(void **state)
{
	hl_rng r;
	int trial, areas = 0;

	(void)state;
	hl_rng_seed(&r, 11);
	for (trial = 0; trial < 6; trial++) {
		hl_case *c = priced_case(&r, 3 + trial % 2, 3 + trial / 3);
		hl_opt_options o;
		hl_opt_result *res;
		size_t i;

		hl_opt_options_default(&o);
		o.no_splits = 1;
		res = run(c, &o);
		assert_int_equal(most_branches(res->net), 1);
		assert_int_equal(res->net->nsplit, 0);
		hl_opt_result_free(res);

		hl_opt_options_default(&o);
		o.max_branches = 2;
		res = run(c, &o);
		assert_true(most_branches(res->net) <= 2);
		hl_opt_result_free(res);

		/* A small utility unit may miss the area however the network
		 * is built: then "no network" is the right answer; when one
		 * comes back it keeps both limits. */
		hl_opt_options_default(&o);
		o.min_area = 1.0;
		o.max_shells = 2;
		res = run_may_fail(c, &o, 1);
		for (i = 0; res != NULL && i < res->net->nunit; i++) {
			assert_true(res->net->unit[i].area >= 1.0 - 1e-9);
			assert_true(res->net->unit[i].shells <= 2);
		}
		areas += res != NULL;
		hl_opt_result_free(res);

		/* Half the smallest stream duty: a network of utility units
		 * alone keeps it, so a network always exists. */
		hl_opt_options_default(&o);
		o.min_duty = HUGE_VAL;
		for (i = 0; i < c->nstream; i++)
			o.min_duty = fmin(o.min_duty,
			    0.5 * hl_stream_duty(&c->stream[i]));
		res = run(c, &o);
		for (i = 0; i < res->net->nunit; i++)
			assert_true(res->net->unit[i].duty >= o.min_duty *
			    (1 - 1e-9));
		hl_opt_result_free(res);

		/* Twice the smallest stream duty: that stream cannot keep it
		 * and needs a unit of its own size; no unit is smaller than
		 * the limit or than a process stream it serves (a network
		 * exists, the search must find one). */
		o.min_duty *= 4.0;
		res = run(c, &o);
		for (i = 0; i < res->net->nunit; i++) {
			const hl_network_unit *u = &res->net->unit[i];
			double d = o.min_duty;

			if (u->hot < c->nstream)
				d = fmin(d, hl_stream_duty(&c->stream[u->hot]));
			if (u->cold < c->nstream)
				d = fmin(d, hl_stream_duty(&c->stream[u->cold]));
			assert_true(u->duty >= d * (1 - 1e-9));
		}
		hl_opt_result_free(res);
		hl_case_free(c);
	}
	assert_true(areas >= 3);  /* the area limit was really exercised */
}

/* The fewest-units network of design's other path, as a start. */
static hl_network *
fewest_units(const hl_case *c, hl_match_result **mr, hl_network_feed *feed)
{
	hl_utility_lp_opts lo = { 0, NULL, NULL, NAN };
	hl_utility_lp *lp = NULL;
	hl_match_options mo;
	hl_network *net = NULL;
	double qh, qc, load[2];
	hl_error err;

	assert_int_equal(hl_cascade_targets(c, 10.0, &qh, &qc, NULL), HL_OK);
	assert_int_equal(hl_utility_lp_solve(c, 10.0, &lo, &lp, &err), HL_OK);
	load[0] = lp->util[0].load;
	load[1] = lp->util[1].load;
	hl_utility_lp_free(lp);
	hl_match_options_default(&mo, c);
	mo.time_limit = 2.0;
	assert_int_equal(hl_match_solve(c, 10.0, load, &mo, mr, &err), HL_OK);
	assert_int_equal(hl_network_from_matches(c, *mr, qh, qc, feed, &err),
	    HL_OK);
	assert_int_equal(hl_network_place(&feed->in, &net, &err), HL_OK);
	return net;
}

/* Never dearer than the start; the units marked to stay stay. */
static void
test_start(void **state)
{
	hl_rng r;
	int trial;

	(void)state;
	hl_rng_seed(&r, 23);
	for (trial = 0; trial < 6; trial++) {
		hl_case *c = priced_case(&r, 3 + trial % 3, 3 + trial % 2);
		hl_match_result *mr = NULL;
		hl_network_feed feed;
		hl_network *start = fewest_units(c, &mr, &feed);
		unsigned char *keep = calloc(start->nunit + 1, 1);
		hl_opt_options o;
		hl_opt_result *res;
		size_t i, k = start->nunit;

		assert_non_null(keep);
		hl_opt_options_default(&o);
		o.start = start;
		res = run(c, &o);
		assert_true(res->net->total_cost <= start->total_cost *
		    (1 + 1e-12));
		hl_opt_result_free(res);

		for (i = 0; i < start->nunit && k == start->nunit; i++)
			if (!start->party[start->unit[i].hot].utility &&
			    !start->party[start->unit[i].cold].utility)
				k = i;
		if (k < start->nunit) {
			int found = 0;

			keep[k] = 1;
			o.keep = keep;
			res = run(c, &o);
			for (i = 0; i < res->net->nunit; i++)
				found |= res->net->unit[i].hot ==
				    start->unit[k].hot && res->net->unit[i].cold
				    == start->unit[k].cold;
			assert_true(found);
			hl_opt_result_free(res);
		}
		free(keep);
		hl_network_free(start);
		hl_network_feed_free(&feed);
		hl_match_result_free(mr);
		hl_case_free(c);
	}
}

/* A generated case, its fewest-units start, and that start laid into the
 * superstructure as the search's state. */
typedef struct {
	hl_case *c;
	hl_match_result *mr;
	hl_network_feed feed;
	hl_network *start;
	hl_opt_options o;
	hl_opt_problem P;
	hl_opt_state s;
} laid_start;

static void
lay_start(laid_start *f, hl_rng *r, int nh, int nc)
{
	f->c = priced_case(r, nh, nc);
	f->mr = NULL;
	f->start = fewest_units(f->c, &f->mr, &f->feed);
	hl_opt_options_default(&f->o);
	f->o.start = f->start;
	assert_int_equal(hl_opt_problem_init(&f->P, f->c, &f->o, NULL), HL_OK);
	assert_int_equal(hl_opt_state_init(&f->P, &f->s), HL_OK);
	assert_int_equal(hl_opt_from_network(&f->P, f->start, NULL, &f->s),
	    HL_OK);
}

static void
lay_free(laid_start *f)
{
	hl_opt_state_free(&f->s);
	hl_opt_problem_free(&f->P);
	hl_network_free(f->start);
	hl_network_feed_free(&f->feed);
	hl_match_result_free(f->mr);
	hl_case_free(f->c);
}

/* The fewest-units start laid into the superstructure (split shares as
 * branch weights, utilities between process units inside the streams)
 * costs in the model what it costs as a network: the search starts from
 * it, not from a repaired copy. */
static void
test_start_exact(void **state)
{
	hl_rng r;
	int trial, exact = 0, splits = 0, mids = 0;

	(void)state;
	hl_rng_seed(&r, 41);
	for (trial = 0; trial < 8; trial++) {
		laid_start f;
		const hl_opt_problem *P = &f.P;
		const hl_opt_state *s = &f.s;
		const hl_network *start;
		size_t i;

		lay_start(&f, &r, 4 + trial % 3, 4 + trial % 2);
		start = f.start;
		if (s->v <= 1e-9 && fabs(s->tac - start->total_cost) <= 1e-6 *
		    start->total_cost)
			exact++;
		else
			print_error("trial %d: model %.6g (limits missed %g), "
			    "network %.6g\n", trial, s->tac, s->v,
			    start->total_cost);
		splits += start->nsplit > 0;
		for (i = 0; i < P->nh * P->S; i++)
			mids += s->uh[i] > 0.0;
		for (i = 0; i < P->nc * P->S; i++)
			mids += s->uc[i] > 0.0;
		lay_free(&f);
	}
	print_message("exact %d of 8, %d with splits, %d utilities inside\n",
	    exact, splits, mids);
	assert_int_equal(exact, 8);
}

/* The structure descent from the fewest-units start: it keeps every
 * limit, never costs more, its network passes the check, and a second
 * descent from its result finds no neighbour better (a local optimum of
 * the add/take-out/move neighbourhood; Mladenović & Hansen 1997). */
static void
test_descend(void **state)
{
	hl_rng r;
	int trial, better = 0;

	(void)state;
	hl_rng_seed(&r, 43);
	for (trial = 0; trial < 6; trial++) {
		laid_start f;
		hl_opt_state *s = &f.s;
		hl_network *net = NULL;
		double t0, t1;
		int capped = 0;

		lay_start(&f, &r, 3 + trial % 3, 3 + trial % 2);
		t0 = s->tac;
		assert_true(hl_opt_descend(&f.P, s, 50000000, 0.0, &capped) > 0);
		assert_true(s->v <= 1e-9);
		assert_true(s->tac <= t0);
		better += s->tac < t0 * (1.0 - 1e-6);
		t1 = s->tac;
		hl_opt_descend(&f.P, s, 50000000, 0.0, &capped);
		assert_true(s->tac == t1);
		assert_int_equal(capped, 0);
		assert_int_equal(hl_opt_to_network(&f.P, s, &net, NULL), HL_OK);
		sound(net);
		hl_network_free(net);
		lay_free(&f);
	}
	print_message("descent: %d of 6 starts made cheaper\n", better);
	assert_true(better >= 3);
}

/* Same seed: the same network on one thread and on two. */
static void
test_repeat(void **state)
{
	hl_rng r;
	hl_case *c;
	hl_opt_options o;
	hl_opt_result *a, *b;
	size_t i;

	(void)state;
	hl_rng_seed(&r, 5);
	c = priced_case(&r, 4, 4);
	hl_opt_options_default(&o);
	o.seed = 42;
	o.threads = 1;
	a = run(c, &o);
	o.threads = 2;
	b = run(c, &o);
	assert_int_equal(a->net->nunit, b->net->nunit);
	assert_true(a->net->total_cost == b->net->total_cost);
	for (i = 0; i < a->net->nunit; i++) {
		assert_string_equal(a->net->unit[i].id, b->net->unit[i].id);
		assert_true(a->net->unit[i].duty == b->net->unit[i].duty);
	}
	hl_opt_result_free(a);
	hl_opt_result_free(b);
	hl_case_free(c);
}

int
main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_limits),
		cmocka_unit_test(test_start),
		cmocka_unit_test(test_start_exact),
		cmocka_unit_test(test_descend),
		cmocka_unit_test(test_repeat),
	};

	return cmocka_run_group_tests(tests, NULL, NULL);
}
