/* test_network_idle.c - units of next to no heat taken out of a placement
 * (network_idle.c): stages renumbered, shares and balances kept, and the
 * independent check (netcheck.h) passing on what is left.
 *
 * The cases are built by hand; every heat below is cp × ΔT of a stream of
 * constant cp, and every target comes from the problem table (common
 * practice, no source), worked in the comments.
 */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <cmocka.h>

#include "near.h"
#include "netcheck.h"
#include "netfix.h"
#include "network.h"
#include "network_int.h"

#define TOL 1e-9

static netfix *
fix_new(double dtmin)
{
	netfix *f = calloc(1, sizeof *f);

	assert_non_null(f);
	netfix_init(f, dtmin);
	return f;
}

static void
assert_sound(const hl_network *net)
{
	hl_netcheck *r = NULL;
	size_t i;

	assert_int_equal(hl_netcheck_run(net, &r, NULL), HL_OK);
	for (i = 0; i < r->n; i++)
		print_error("finding: %s: %s\n", r->f[i].what, r->f[i].text);
	assert_int_equal(r->n, 0);
	hl_netcheck_free(r);
}

static const hl_network_unit *
unit_of(const hl_network *net, const char *hot, const char *cold)
{
	size_t i;

	for (i = 0; i < net->nunit; i++) {
		const hl_network_unit *u = &net->unit[i];

		if (strcmp(net->party[u->hot].name, hot) == 0 &&
		    strcmp(net->party[u->cold].name, cold) == 0)
			return u;
	}
	return NULL;
}

static size_t
notes_with(const hl_network *net, const char *text)
{
	size_t i, n = 0;

	for (i = 0; i < net->nnote; i++)
		n += strstr(net->note[i], text) != NULL;
	return n;
}

/* Two hot and two cold streams (ΔTmin 10 K, all cp 1 kW/K): H1 200 -> 100
 * °C (100 kW), H2 180 -> 100 °C (80 kW), C1 50 -> 170 °C (120 kW), C2 40
 * -> 120 °C (80 kW), steam at 250 °C. Problem table (shifted ±5 K):
 * 195-175 +20, 175-125 +50, 125-95 0, 95-55 -80, 55-45 -10 kW; cascade
 * 20, 70, 70, -10, -20: 20 kW of hot utility, none cold. The matches meet
 * those targets but give H1-C2 and H2-C1 0.05 kW each, placed mid-stream
 * by their windows: C1 has H1-C1, H2-C1, steam in stages 1, 2, 3. The
 * loop H1-C2 (-d), H1-C1 (+d), H2-C1 (-d), H2-C2 (+d) takes both slivers
 * out with no utility added; the steam heater moves to stage 2 of C1 and
 * H2-C2 to stage 1 of H2 and of C2. */
static void
test_loop_renumbers(void **state)
{
	netfix *f = fix_new(10.0);
	size_t h1 = netfix_stream(f, "H1", 200, 100, 1.0, NAN);
	size_t h2 = netfix_stream(f, "H2", 180, 100, 1.0, NAN);
	size_t c1 = netfix_stream(f, "C1", 50, 170, 1.0, NAN);
	size_t c2 = netfix_stream(f, "C2", 40, 120, 1.0, NAN);
	size_t st = netfix_utility(f, "steam", HL_HOT, 250, 250, NAN, NAN);
	hl_network_input in;
	hl_network *net = NULL;
	const hl_network_unit *a, *b, *s;
	hl_error err;
	size_t i;

	(void)state;
	f->qh = 20;
	f->qc = 0;
	netfix_match(f, h1, c1, 99.95, 200, 100.05, 50, 149.95);
	netfix_match(f, h1, c2, 0.05, 100.05, 100, 40, 40.05);
	netfix_match(f, h2, c1, 0.05, 180, 179.95, 149.95, 150);
	netfix_match(f, h2, c2, 79.95, 179.95, 100, 40.05, 120);
	netfix_match(f, st, c1, 20, 250, 250, 150, 170);
	netfix_input(f, &in);
	assert_int_equal(hl_network_place(&in, &net, &err), HL_OK);
	assert_int_equal(net->nunit, 3);
	assert_int_equal(net->nmatch, 5);
	a = unit_of(net, "H1", "C1");
	b = unit_of(net, "H2", "C2");
	s = unit_of(net, "steam", "C1");
	assert_non_null(a);
	assert_non_null(b);
	assert_non_null(s);
	assert_null(unit_of(net, "H1", "C2"));
	assert_null(unit_of(net, "H2", "C1"));
	assert_rel(a->duty, 100, TOL);
	assert_rel(b->duty, 80, TOL);
	assert_rel(s->duty, 20, TOL);
	assert_int_equal(a->hot_stage, 1);
	assert_int_equal(a->cold_stage, 1);
	assert_int_equal(s->cold_stage, 2);
	assert_int_equal(b->hot_stage, 1);
	assert_int_equal(b->cold_stage, 1);
	assert_rel(s->cold_in, 150, TOL);
	assert_rel(b->hot_in, 180, TOL);
	assert_rel(b->cold_in, 40, TOL);
	for (i = 0; i < net->nunit; i++)
		assert_true(net->unit[i].duty > 1.0);
	assert_rel(net->qh, 20, TOL);
	assert_true(net->penalty == 0.0);
	assert_int_equal(notes_with(net, "is left out"), 2);
	assert_sound(net);
	hl_network_free(net);
	free(f);
}

/* A sliver whose heat only utilities can take: H 200 -> 100 °C and C 40
 * -> 160 °C (cp 1 kW/K: 100 and 120 kW), S 125 -> 115 °C (cp 10 kW/K, 100
 * kW), steam at 250 °C, water 20 -> 30 °C. Problem table at ΔTmin 10 K
 * (shifted ±5 K): 195-165 H +30, 165-120 H - C 0, 120-110 H + S - C +100,
 * 110-95 0, 95-45 -C -50; cascade 30, 30, 130, 130, 80: no hot utility,
 * 80 kW cold. The matches use 19.95 kW of steam (declared as a match
 * rule's restriction, as if a rule kept S from heating C): S-C 0.05 kW at
 * C's cold end, H-C 100 kW, steam-C 19.95 kW, S-water 99.95 kW. H has one
 * unit, so no loop takes the sliver: S's cooler and C's heater take 0.05
 * kW more each, the energy penalty; the heater moves to stage 2 of C. */
static void
test_utility_path(void **state)
{
	netfix *f = fix_new(10.0);
	size_t h = netfix_stream(f, "H", 200, 100, 1.0, NAN);
	size_t c = netfix_stream(f, "C", 40, 160, 1.0, NAN);
	size_t sv = netfix_stream(f, "S", 125, 115, 10.0, NAN);
	size_t st = netfix_utility(f, "steam", HL_HOT, 250, 250, NAN, NAN);
	size_t cw = netfix_utility(f, "water", HL_COLD, 20, 30, NAN, NAN);
	hl_network_input in;
	hl_network *net = NULL;
	const hl_network_unit *u;
	hl_error err;

	(void)state;
	f->qh = 0;
	f->qc = 80;
	netfix_match(f, sv, c, 0.05, 125, 124.995, 40, 40.05);
	netfix_match(f, h, c, 100, 200, 100, 40.05, 140.05);
	netfix_match(f, st, c, 19.95, 250, 250, 140.05, 160);
	netfix_match(f, sv, cw, 99.95, 124.995, 115, 20, 30);
	netfix_input(f, &in);
	in.restriction = 19.95;
	assert_int_equal(hl_network_place(&in, &net, &err), HL_OK);
	assert_int_equal(net->nunit, 3);
	assert_null(unit_of(net, "S", "C"));
	u = unit_of(net, "H", "C");
	assert_non_null(u);
	assert_int_equal(u->cold_stage, 1);
	assert_rel(u->cold_in, 40, TOL);
	u = unit_of(net, "steam", "C");
	assert_non_null(u);
	assert_rel(u->duty, 20, TOL);
	assert_int_equal(u->cold_stage, 2);
	assert_rel(u->cold_in, 140, TOL);
	u = unit_of(net, "S", "water");
	assert_non_null(u);
	assert_rel(u->duty, 100, TOL);
	assert_int_equal(u->hot_stage, 1);
	assert_rel(u->hot_in, 125, TOL);
	assert_rel(net->penalty, 0.05, 1e-6);
	assert_rel(net->qh, 20, TOL);
	assert_rel(net->qc, 100, TOL);
	assert_int_equal(notes_with(net, "is left out"), 1);
	assert_int_equal(notes_with(net, "the heat of the matches left out"),
	    1);
	assert_sound(net);
	hl_network_free(net);
	free(f);
}

/* A sliver that only a dearer utility could take stays: C 100 -> 200 °C
 * (cp 1 kW/K, 100 kW), LP steam at 150 °C (20 per MWh, at most 0.05 kW
 * available) and HP steam at 250 °C (30 per MWh); the least-cost mix is
 * all the LP there is and HP for the rest, as the matches give. Taking
 * the LP heater out would leave the same 100 kW of steam at a dearer mix
 * with no penalty to announce it, which the check would flag: it stays,
 * and the network is sound. */
static void
test_dearer_mix_stays(void **state)
{
	netfix *f = fix_new(10.0);
	size_t c = netfix_stream(f, "C", 100, 200, 1.0, NAN);
	size_t lp = netfix_utility(f, "LP", HL_HOT, 150, 150, 20, NAN);
	size_t hp = netfix_utility(f, "HP", HL_HOT, 250, 250, 30, NAN);
	hl_network_input in;
	hl_network *net = NULL;
	hl_error err;

	(void)state;
	f->p[lp].max_load = 0.05;
	f->qh = 100;
	f->qc = 0;
	netfix_match(f, lp, c, 0.05, 150, 150, 100, 100.05);
	netfix_match(f, hp, c, 99.95, 250, 250, 100.05, 200);
	netfix_input(f, &in);
	assert_int_equal(hl_network_place(&in, &net, &err), HL_OK);
	assert_int_equal(net->nunit, 2);
	assert_non_null(unit_of(net, "LP", "C"));
	assert_true(net->penalty == 0.0);
	assert_sound(net);
	hl_network_free(net);
	free(f);
}

/* The helper on a placement state by hand: C 50 -> 150 °C (cp 1, 100 kW)
 * split into two branches, H1-C (99.95 kW) and H2-C (0.05 kW); H1 200 ->
 * 60 °C (cp 1, 140 kW) then cooled by water (40.05 kW), H2 110 -> 100 °C
 * (cp 10, 100 kW) cooled by water after the sliver (99.95 kW). Taking
 * H2-C out: H2's water cooler +d, H1-C +d, H1's cooler -d (the water used
 * stays 140 kW). C is then one stage of one branch (share 1), H2's cooler
 * stage 1, and every balance closes: H1-C 100 kW heats C 50 -> 150 °C. */
static void
test_split_branch(void **state)
{
	netfix *f = fix_new(10.0);
	size_t h1 = netfix_stream(f, "H1", 200, 60, 1.0, NAN);
	size_t h2 = netfix_stream(f, "H2", 110, 100, 10.0, NAN);
	size_t c = netfix_stream(f, "C", 50, 150, 1.0, NAN);
	size_t cw = netfix_utility(f, "water", HL_COLD, 20, 30, NAN, NAN);
	double duty[4] = { 99.95, 0.05, 40.05, 99.95 };
	size_t hot[4] = { h1, h2, h1, h2 }, cold[4] = { c, c, cw, cw };
	hl_network *net = hl_network_create();
	hl_net_place *P;
	hl_error err;
	size_t i;

	(void)state;
	assert_non_null(net);
	net->set = f->set;
	net->set.currency = NULL;
	for (i = 0; i < f->np; i++)
		assert_int_equal(hl_network_add_party(net, &f->p[i], NULL),
		    HL_OK);
	P = hl_net_place_create(net);
	assert_non_null(P);
	for (i = 0; i < 4; i++) {
		hl_network_unit u = { 0 };

		u.hot = hot[i];
		u.cold = cold[i];
		u.match = (long)i;
		u.duty = duty[i];
		u.hot_share = u.cold_share = 1.0;
		u.type = HL_EXCH_COUNTERFLOW;
		assert_int_equal(hl_net_place_add_unit(P, &u, 0, 0), HL_OK);
	}
	/* C's lane: units 0 and 1 as one split stage. */
	assert_int_equal(P->lane[c].n, 2);
	assert_int_equal(hl_net_lane_merge(&P->lane[c], 0, 1, net), HL_OK);
	/* Shares that keep the H2 branch below 100 °C: 0.05/0.1 kW per
	 * kW/K, 50.5 °C out; the H1 branch leaves at 50 + 99.95/0.9. */
	P->lane[c].b[0].share[0] = 0.9;
	P->lane[c].b[0].share[1] = 0.1;
	assert_true(hl_net_eval(P) <= HL_NET_VTOL);
	assert_int_equal(net->unit[1].cold_stage, 1);
	assert_int_equal(net->unit[3].hot_stage, 2);
	assert_true(net->unit[0].cold_share < 1.0);

	assert_int_equal(hl_net_drop_idle(P, &err), HL_OK);
	assert_true(net->unit[1].duty == 0.0);
	assert_int_equal(P->lane[c].n, 1);
	assert_int_equal(P->lane[c].b[0].n, 1);
	assert_int_equal(P->lane[h2].n, 1);
	assert_rel(net->unit[0].duty, 100, TOL);
	assert_rel(net->unit[2].duty, 40, TOL);
	assert_rel(net->unit[3].duty, 100, TOL);
	assert_rel(net->unit[0].cold_share, 1.0, TOL);
	assert_int_equal(net->unit[0].cold_stage, 1);
	assert_int_equal(net->unit[3].hot_stage, 1);
	assert_rel(net->unit[0].cold_out, 150, TOL);
	assert_rel(net->unit[3].hot_in, 110, TOL);
	assert_true(net->penalty == 0.0);
	hl_net_place_free(P);
	hl_network_free(net);
	free(f);
}

int
main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_loop_renumbers),
		cmocka_unit_test(test_utility_path),
		cmocka_unit_test(test_dearer_mix_stays),
		cmocka_unit_test(test_split_branch),
	};

	return cmocka_run_group_tests(tests, NULL, NULL);
}
