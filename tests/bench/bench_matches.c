/* bench_matches.c - time the fewest-units MILP on a generated problem.
 *
 * Usage: bench_matches FILE.csv TIME_LIMIT [textbook]. Prints one line:
 *   streams subnetworks units lower euler optimal gap seconds
 * with the implicit utilities at the problem-table targets (ΔTmin 10 K) and
 * TIME_LIMIT seconds per subnetwork; "textbook" solves the plain model
 * (big-M = the smaller heat, no bounds, cuts or heuristic) for comparison.
 * seconds is the wall-clock time of the whole run.
 */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#include "match_milp.h"
#include "tables.h"

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
	hl_case *c;
	hl_match_options o;
	hl_match_result *r;
	hl_error err;
	double t0;

	if (argc < 3) {
		fprintf(stderr, "usage: bench_matches FILE.csv TIME_LIMIT "
			"[textbook]\n");
		return 1;
	}
	c = hl_case_create();
	if (hl_stream_table_read(c, argv[1], &err) != HL_OK ||
	    hl_case_validate(c, &err) != HL_OK) {
		fprintf(stderr, "bench_matches: %s:%ld: %s\n", err.file,
			err.line, err.text);
		return 2;
	}
	hl_match_options_default(&o, c);
	o.time_limit = atof(argv[2]);
	o.textbook = argc > 3 && strcmp(argv[3], "textbook") == 0;
	t0 = now();
	if (hl_match_solve(c, 10.0, NULL, &o, &r, &err) != HL_OK) {
		printf("%zu - - - - failed - %.2f\n", c->nstream, now() - t0);
		fprintf(stderr, "bench_matches: %s\n", err.text);
		hl_case_free(c);
		return 0;
	}
	printf("%zu %zu %zu %zu %zu %s %.3f %.2f\n", c->nstream, r->nsub,
	       r->units, r->lower, r->euler, r->optimal ? "yes" : "no",
	       r->gap, now() - t0);
	hl_match_result_free(r);
	hl_case_free(c);
	return 0;
}
