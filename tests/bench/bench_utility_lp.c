/* bench_utility_lp.c - time the utility LP against the problem table on
 * the same streams.
 *
 * Usage: bench_utility_lp FILE.csv [REPEATS [LEVELS]]. Adds LEVELS (5,
 * the default, or 10) utility levels spanning every temperature of the
 * generator (5: three hot, two cold; 10: six hot, four cold) and prints one
 * line: streams levels cascade_s lp_s ratio. Best of REPEATS runs.
 */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <time.h>

#include "cascade.h"
#include "tables.h"
#include "utility_lp.h"

static const char levels5[] =
	"name,kind,supply,target,price\n"
	"HP,hot,600,600,40\nMP,hot,200,200,30\nLP,hot,150,150,20\n"
	"CW,cold,15,25,2\nbrine,cold,-60,-60,15\n";

/* Ten levels: a fired heater, four steam mains and hot water; steam raising,
 * tempered water, cooling water and brine. Cheaper heat lower down, cheaper
 * cooling higher up, so that the LP has a real choice at every level. */
static const char levels10[] =
	"name,kind,supply,target,price\n"
	"fired,hot,700,500,45\nVHP,hot,420,420,40\nHP,hot,330,330,34\n"
	"MP,hot,250,250,28\nLP,hot,160,160,22\nHW,hot,110,90,12\n"
	"steam raising,cold,140,140,0.5\ntempered,cold,60,80,1\n"
	"CW,cold,15,25,2\nbrine,cold,-60,-60,15\n";

static double
now(void)
{
	struct timespec ts;

	clock_gettime(CLOCK_MONOTONIC, &ts);
	return (double)ts.tv_sec + 1e-9 * (double)ts.tv_nsec;
}

int
main(int argc, char **argv)
{
	hl_case *c = hl_case_create();
	hl_error err;
	double best_c = HUGE_VAL, best_l = HUGE_VAL;
	int rep = argc > 2 ? atoi(argv[2]) : 3, i;
	int ten = argc > 3 && atoi(argv[3]) == 10;
	const char *levels = ten ? levels10 : levels5;
	size_t len = ten ? sizeof levels10 - 1 : sizeof levels5 - 1;

	if (argc < 2 || hl_stream_table_read(c, argv[1], &err) != HL_OK ||
	    hl_utility_table_read_mem(c, "levels", levels, len, &err) != HL_OK) {
		fprintf(stderr, "usage: bench_utility_lp FILE.csv [REPEATS "
			"[LEVELS]]\n");
		return 1;
	}
	for (i = 0; i < rep; i++) {
		hl_cascade *cas;
		hl_utility_lp *lp;
		double t0 = now(), t1, t2;

		if (hl_cascade_compute(c, 10.0, &cas, &err) != HL_OK)
			return 1;
		t1 = now();
		if (hl_utility_lp_solve(c, 10.0, NULL, &lp, &err) != HL_OK) {
			fprintf(stderr, "%s\n", err.text);
			return 1;
		}
		t2 = now();
		best_c = fmin(best_c, t1 - t0);
		best_l = fmin(best_l, t2 - t1);
		hl_cascade_free(cas);
		hl_utility_lp_free(lp);
	}
	printf("%zu %zu %.4f %.4f %.1f\n", c->nstream, c->nutil, best_c,
	       best_l,
	       best_l / (best_c > 0 ? best_c : 1e-9));
	hl_case_free(c);
	return 0;
}
