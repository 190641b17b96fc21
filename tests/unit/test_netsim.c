/* test_netsim.c - a network of fixed areas simulated.
 *
 * Checks against the project's own sizing: a network placed and sized by
 * hl_network_place, simulated at its own areas and shells, returns its own
 * temperatures and duties (rating and sizing are one model: Incropera &
 * DeWitt, table 11.3, against Q = U·A·F·LMTD of Kern 1950, ch. 7). After a
 * change of area the heat balances close: every process stream exchanges
 * its duty, and hot minus cold utility is the process's net heat (the first
 * law; common practice, no source).
 */
#include <stdarg.h>
#include <stddef.h>
#include <stdint.h>
#include <setjmp.h>
#include <cmocka.h>

#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "gen.h"
#include "near.h"
#include "netcheck.h"
#include "netfix.h"
#include "netsim.h"
#include "network.h"
#include "profile.h"

#define TOL_TRIP 1e-8   /* sized then simulated, relative to the duty */
#define TOL_BAL 1e-6    /* a balance after the sweeps settle, kW relative */

/* near.h's test, with the quantity named. */
static void
near(double got, double want, double tol, const char *what)
{
	if (!hl_near(got, want, tol))
		fail_msg("%s: got %.12g, want %.12g", what, got, want);
}

static hl_network *
place(const netfix *f)
{
	hl_network_input in;
	hl_network *net = NULL;
	hl_error err;

	netfix_input(f, &in);
	if (hl_network_place(&in, &net, &err) != HL_OK)
		fail_msg("placement failed: %s", err.text);
	return net;
}

/* Every process stream exchanges its duty; hot − cold utility is the net. */
static void
assert_balanced(const hl_network *net, const hl_netsim *r)
{
	double net_heat = 0.0, trim = 0.0;
	size_t p, i;

	for (p = 0; p < net->nparty; p++) {
		const hl_network_party *pp = &net->party[p];
		double sum = 0.0, load;

		if (pp->utility)
			continue;
		load = hl_profile_heat(pp->seg, pp->nseg, pp->kind, pp->target);
		for (i = 0; i < net->nunit; i++)
			if (net->unit[i].hot == p || net->unit[i].cold == p)
				sum += net->unit[i].duty;
		near(sum + r->shortfall[p], load, TOL_BAL, "stream balance");
		net_heat += pp->kind == HL_HOT ? -load : load;
		trim += pp->kind == HL_HOT ? -r->shortfall[p] :
		    r->shortfall[p];
	}
	near(r->qh - r->qc + trim, net_heat, TOL_BAL, "hot − cold utility");
}

/* Placed networks of generated problems come back from the simulation with
 * their own duties and temperatures. */
static void
test_round_trip(void **state)
{
	hl_rng rng;
	int trial, n = 0;

	(void)state;
	hl_rng_seed(&rng, 20261203);
	for (trial = 0; trial < 40; trial++) {
		hl_case *c = hl_gen_case(&rng, 1 + trial % 4, 1 + trial / 4 % 4);
		netfix *f = calloc(1, sizeof *f);
		hl_network *net, *sim;
		hl_netsim *r = NULL;
		hl_error err;
		size_t i;

		assert_non_null(f);
		netfix_cascade(f, c, 10.0);
		net = place(f);
		sim = hl_network_copy(net);
		assert_non_null(sim);
		if (hl_netsim_run(sim, &r, &err) != HL_OK)
			fail_msg("simulation: %s", err.text);
		assert_true(r->sound);
		for (i = 0; i < net->nunit; i++) {
			const hl_network_unit *a = &net->unit[i];
			const hl_network_unit *b = &sim->unit[i];
			double s = fmax(1.0, a->duty);

			near(b->duty / s, a->duty / s, TOL_TRIP, "duty");
			near(b->hot_in, a->hot_in, TOL_TRIP, "hot in");
			near(b->hot_out, a->hot_out, TOL_TRIP, "hot out");
			near(b->cold_in, a->cold_in, TOL_TRIP, "cold in");
			near(b->cold_out, a->cold_out, TOL_TRIP, "cold out");
		}
		near(r->qh, net->qh, TOL_TRIP, "hot utility");
		near(r->qc, net->qc, TOL_TRIP, "cold utility");
		assert_balanced(sim, r);
		n += (int)net->nunit;
		hl_netsim_free(r);
		hl_network_free(sim);
		hl_network_free(net);
		free(f);
		hl_case_free(c);
	}
	print_message("round trip: %d units in 40 networks\n", n);
}

/* 1 when u joins two process streams. */
static int
recovery(const hl_network *net, const hl_network_unit *u)
{
	return !net->party[u->hot].utility && !net->party[u->cold].utility;
}

/* The exchanger types rating covers: a placed network whose recovery units
 * are resized as plate, double-pipe and air-cooler units comes back from
 * the simulation with its own duties (rating.h covers every type with the
 * model sizing uses: counterflow for plate and double pipe, unmixed
 * crossflow sections for the air cooler; Incropera & DeWitt, table 11.3,
 * from memory). */
static void
test_types_round_trip(void **state)
{
	static const hl_exchanger_type ty[] = {
		HL_EXCH_PLATE, HL_EXCH_DOUBLE_PIPE, HL_EXCH_AIR_COOLER
	};
	hl_rng rng;
	int trial, n[3] = { 0, 0, 0 };

	(void)state;
	hl_rng_seed(&rng, 20261204);
	for (trial = 0; trial < 20; trial++) {
		hl_case *c = hl_gen_case(&rng, 1 + trial % 4, 1 + trial / 4 % 4);
		netfix *f = calloc(1, sizeof *f);
		hl_network *net, *sim;
		hl_netsim *r = NULL;
		hl_error err;
		size_t i;

		assert_non_null(f);
		netfix_cascade(f, c, 10.0);
		net = place(f);
		for (i = 0; i < net->nunit; i++) {
			hl_network_unit *u = &net->unit[i];

			if (!recovery(net, u))
				continue;
			u->type = ty[i % 3];
			if (hl_network_size_unit(net, u, &err) != HL_OK)
				fail_msg("sizing as %s: %s",
				    hl_exchanger_type_name(u->type), err.text);
			n[i % 3]++;
		}
		hl_network_totals(net);
		sim = hl_network_copy(net);
		assert_non_null(sim);
		if (hl_netsim_run(sim, &r, &err) != HL_OK)
			fail_msg("simulation: %s", err.text);
		assert_true(r->sound);
		for (i = 0; i < net->nunit; i++) {
			const hl_network_unit *a = &net->unit[i];
			const hl_network_unit *b = &sim->unit[i];
			double s = fmax(1.0, a->duty);

			near(b->duty / s, a->duty / s, TOL_TRIP, "duty");
			near(b->hot_out, a->hot_out, TOL_TRIP, "hot out");
			near(b->cold_out, a->cold_out, TOL_TRIP, "cold out");
		}
		hl_netsim_free(r);
		hl_network_free(sim);
		hl_network_free(net);
		free(f);
		hl_case_free(c);
	}
	print_message("typed round trip: %d plate, %d double pipe, %d air "
	    "cooler\n", n[0], n[1], n[2]);
	assert_true(n[0] > 0 && n[1] > 0 && n[2] > 0);
}

/* A held unit (retrofit hardware) keeps its type and its shells in
 * series: its area is the free sizing's at that count; the area bought is
 * priced by its type's law per shell bought, and bought shells split in
 * parallel so that none passes the type's largest (common practice, no
 * source; the law a + b·A^c per shell as exchanger.h). */
static void
test_held_typed(void **state)
{
	static const hl_exchanger_type ty[] = {
		HL_EXCH_SHELL_TUBE, HL_EXCH_PLATE, HL_EXCH_AIR_COOLER
	};
	hl_rng rng;
	size_t t;

	(void)state;
	hl_rng_seed(&rng, 5);
	for (t = 0; t < sizeof ty / sizeof ty[0]; t++) {
		hl_case *c = hl_gen_case(&rng, 3, 3);
		netfix *f = calloc(1, sizeof *f);
		hl_network *net;
		hl_network_unit u, h;
		hl_error err;
		double a, b, cc, per;
		size_t i, k = SIZE_MAX;

		assert_non_null(f);
		netfix_cascade(f, c, 10.0);
		net = place(f);
		for (i = 0; i < net->nunit; i++)
			if (recovery(net, &net->unit[i]) && (k == SIZE_MAX ||
			    net->unit[i].duty > net->unit[k].duty))
				k = i;
		assert_true(k != SIZE_MAX);
		net->set.law[ty[t]].a = 1000.0 * (double)(t + 2);
		net->set.law[ty[t]].b = 300.0 * (double)(t + 1);
		net->set.law[ty[t]].c = 0.7;
		net->set.law[ty[t]].largest = HUGE_VAL;
		net->set.law[ty[t]].smallest = 0.0;
		u = net->unit[k];
		u.note = NULL;
		u.type = ty[t];
		if (hl_network_size_unit(net, &u, &err) != HL_OK)
			fail_msg("free sizing: %s", err.text);
		h = u;
		h.held = 1;
		snprintf(h.reuses, sizeof h.reuses, "E1");
		h.area_today = 0.6 * u.area;
		h.area_added = 0.4 * u.area;
		h.shells_added = 1;
		h.parallel = 1;
		if (hl_network_size_unit(net, &h, &err) != HL_OK)
			fail_msg("held sizing: %s", err.text);
		assert_int_equal(h.type, ty[t]);
		assert_int_equal(h.shells, u.shells);
		near(h.area, u.area, 1e-12, "held area at the same count");
		near(h.ft, u.ft, 1e-12, "held F");
		hl_exchanger_law_of(&net->set, ty[t], &a, &b, &cc);
		assert_true(a == 1000.0 * (double)(t + 2));
		near(h.cost, a + b * pow(h.area_added, cc), 1e-12,
		    "bought shell by the type's law");
		/* A largest shell a third of the area bought: 3 shells. */
		net->set.law[ty[t]].largest = h.area_added / 2.5;
		h.shells_added = 1;
		if (hl_network_size_unit(net, &h, &err) != HL_OK)
			fail_msg("held sizing: %s", err.text);
		assert_int_equal(h.shells_added, 3);
		per = h.area_added / 3.0;
		assert_true(per <= net->set.law[ty[t]].largest);
		near(h.cost, 3.0 * (a + b * pow(per, cc)), 1e-12,
		    "bought shells in parallel, each within the largest");
		/* A new unit's trains are the bought ones. */
		h.reuses[0] = '\0';
		h.shells_added = h.shells;
		if (hl_network_size_unit(net, &h, &err) != HL_OK)
			fail_msg("held sizing: %s", err.text);
		assert_int_equal(h.parallel, h.shells_added / h.shells);
		assert_true(h.area_added / h.shells_added <=
		    net->set.law[ty[t]].largest * (1.0 + 1e-12));
		hl_network_free(net);
		free(f);
		hl_case_free(c);
	}
}

/* More area on a recovery unit: it does at least its old duty, balances
 * close, the utilities fall by what recovery gains (when the streams reach
 * their targets). */
static void
test_more_area(void **state)
{
	hl_rng rng;
	int trial, changed = 0;

	(void)state;
	hl_rng_seed(&rng, 7);
	for (trial = 0; trial < 30; trial++) {
		hl_case *c = hl_gen_case(&rng, 2 + trial % 3, 2 + trial / 3 % 3);
		netfix *f = calloc(1, sizeof *f);
		hl_network *net, *sim;
		hl_netsim *r = NULL;
		hl_error err;
		size_t i, k = SIZE_MAX;
		double rec0 = 0.0, rec1 = 0.0;

		assert_non_null(f);
		netfix_cascade(f, c, 10.0);
		net = place(f);
		for (i = 0; i < net->nunit; i++) {
			const hl_network_unit *u = &net->unit[i];

			if (net->party[u->hot].utility ||
			    net->party[u->cold].utility)
				continue;
			rec0 += u->duty;
			if (k == SIZE_MAX || u->duty > net->unit[k].duty)
				k = i;
		}
		if (k == SIZE_MAX)
			goto next;
		sim = hl_network_copy(net);
		assert_non_null(sim);
		sim->unit[k].area *= 1.5;
		if (hl_netsim_run(sim, &r, &err) != HL_OK)
			fail_msg("simulation: %s", err.text);
		assert_true(sim->unit[k].duty >= net->unit[k].duty * (1 - 1e-9));
		assert_balanced(sim, r);
		for (i = 0; i < sim->nunit; i++) {
			const hl_network_unit *u = &sim->unit[i];

			if (!sim->party[u->hot].utility &&
			    !sim->party[u->cold].utility)
				rec1 += u->duty;
		}
		if (r->sound)
			near(r->qh, net->qh - (rec1 - rec0), TOL_BAL,
			    "hot utility falls by the recovery gained");
		changed += rec1 > rec0 + 1e-6;
		hl_netsim_free(r);
		hl_network_free(sim);
next:
		hl_network_free(net);
		free(f);
		hl_case_free(c);
	}
	print_message("more area: recovery rose in %d of 30\n", changed);
	assert_true(changed > 0);
}

/* A unit without an area cannot be simulated. */
static void
test_no_area(void **state)
{
	netfix *f = calloc(1, sizeof *f);
	size_t h, c;
	hl_network *net;
	hl_netsim *r = NULL;
	hl_error err;

	(void)state;
	assert_non_null(f);
	netfix_init(f, 10.0);
	h = netfix_stream(f, "H", 200, 100, 1.0, NAN);
	c = netfix_stream(f, "C", 50, 150, 1.0, NAN);
	netfix_match(f, h, c, 100, NAN, NAN, NAN, NAN);
	f->qh = f->qc = 0.0;
	net = place(f);
	net->unit[0].area = NAN;
	assert_int_equal(hl_netsim_run(net, &r, &err), HL_EINPUT);
	assert_non_null(strstr(err.text, "no area"));
	assert_null(r);
	hl_network_free(net);
	free(f);
}

int
main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_round_trip),
		cmocka_unit_test(test_types_round_trip),
		cmocka_unit_test(test_held_typed),
		cmocka_unit_test(test_more_area),
		cmocka_unit_test(test_no_area),
	};

	return cmocka_run_group_tests(tests, NULL, NULL);
}
