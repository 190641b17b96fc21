/* bench_design.c - time `design` stage by stage on generated problems.
 *
 * Usage: bench_design N [SEEDS [TIME_LIMIT]]. For SEEDS generated cases of
 * N hot and N cold streams (tests/unit/gen.h, seeds 1..SEEDS) at ΔTmin
 * 10 K, without utilities (the implicit pair at the problem-table targets):
 * the match MILP (at most TIME_LIMIT s per subnetwork, default 10), the
 * placement and sizing, and the check of the network. Prints one line:
 *   n seeds milp_s place_s check_s matches units penalty_kw splits proven
 * with times the mean per case, counts summed over the cases, penalty the
 * largest, proven the cases whose MILP was proven optimal.
 */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <time.h>

#include "cascade.h"
#include "gen.h"
#include "match_milp.h"
#include "netcheck.h"
#include "network.h"
#include "network_match.h"

static double
now(void)
{
	struct timespec ts;

	clock_gettime(CLOCK_MONOTONIC, &ts);
	return (double)ts.tv_sec + 1e-9 * (double)ts.tv_nsec;
}

typedef struct {
	double milp, place, check, penalty;
	size_t matches, units, splits, proven, bad;
} totals;

static int
one(int n, unsigned seed, double limit, totals *t)
{
	hl_rng r;
	hl_case *c;
	hl_match_options mo;
	hl_match_result *mr = NULL;
	hl_network_feed feed;
	hl_network *net = NULL;
	hl_netcheck *chk = NULL;
	hl_error err;
	double qh, qc, t0, t1, t2, t3;

	hl_rng_seed(&r, seed);
	c = hl_gen_case(&r, n, n);
	c->set.dtmin = 10.0;
	if (hl_cascade_targets(c, 10.0, &qh, &qc, &err) != HL_OK)
		goto fail;
	hl_match_options_default(&mo, c);
	mo.time_limit = limit;
	t0 = now();
	if (hl_match_solve(c, 10.0, NULL, &mo, &mr, &err) != HL_OK)
		goto fail;
	t1 = now();
	if (hl_network_from_matches(c, mr, qh, qc, &feed, &err) != HL_OK)
		goto fail;
	if (hl_network_place(&feed.in, &net, &err) != HL_OK) {
		hl_network_feed_free(&feed);
		goto fail;
	}
	t2 = now();
	if (hl_netcheck_run(net, &chk, &err) != HL_OK)
		goto fail_net;
	t3 = now();
	t->milp += t1 - t0;
	t->place += t2 - t1;
	t->check += t3 - t2;
	t->matches += mr->nmatch;
	t->units += net->nunit;
	t->splits += net->nsplit;
	t->proven += mr->optimal;
	t->penalty = fmax(t->penalty, net->penalty);
	t->bad += chk->n > 0;
	hl_netcheck_free(chk);
	hl_network_free(net);
	hl_network_feed_free(&feed);
	hl_match_result_free(mr);
	hl_case_free(c);
	return 0;
fail_net:
	hl_network_free(net);
	hl_network_feed_free(&feed);
fail:
	fprintf(stderr, "bench_design: %dx%d seed %u: %s\n", n, n, seed,
	    err.text);
	hl_match_result_free(mr);
	hl_case_free(c);
	return -1;
}

int
main(int argc, char **argv)
{
	int n = argc > 1 ? atoi(argv[1]) : 0;
	int seeds = argc > 2 ? atoi(argv[2]) : 3, s;
	double limit = argc > 3 ? atof(argv[3]) : 10.0;
	totals t = { 0 };

	if (n < 1 || seeds < 1) {
		fprintf(stderr, "usage: bench_design N [SEEDS [TIME_LIMIT]]\n");
		return 1;
	}
	for (s = 1; s <= seeds; s++)
		if (one(n, (unsigned)s, limit, &t) != 0)
			return 2;
	printf("%d %d %.3f %.3f %.3f %zu %zu %.1f %zu %zu\n", n, seeds,
	    t.milp / seeds, t.place / seeds, t.check / seeds, t.matches,
	    t.units, t.penalty, t.splits, t.proven);
	return t.bad > 0 ? 3 : 0;
}
