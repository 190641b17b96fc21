/* bench_matches.c - time the fewest-units MILP on a generated problem.
 *
 * Usage: bench_matches FILE.csv TIME_LIMIT [textbook] [-t THREADS]
 *                      [-x MODEL]
 * Prints one line:
 *   streams subnetworks units lower euler optimal gap seconds
 * with the implicit utilities at the problem-table targets (ΔTmin 10 K) and
 * TIME_LIMIT seconds per subnetwork; "textbook" solves the plain model
 * (big-M = the smaller heat, no bounds, cuts or heuristic) for comparison.
 * -t: subnetworks solved at once (default 2). -x: also write the model to
 * MODEL (.lp or .mps) by the calls `matches --export-model` makes, before
 * solving and outside the timed part. seconds is the wall-clock time of
 * preparing and solving.
 */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#include "match_milp.h"
#include "model_out.h"
#include "tables.h"

static double
now(void)
{
	struct timespec ts;

	clock_gettime(CLOCK_MONOTONIC, &ts);
	return (double)ts.tv_sec + 1e-9 * (double)ts.tv_nsec;
}

/* The model as `matches --export-model` writes it. */
static hl_status
export(const hl_match_problem *p, const hl_match_options *o,
       const char *path, hl_error *err)
{
	hl_glpk_guard g;
	glp_prob *P = NULL;
	hl_status st;

	hl_glpk_guard_begin(&g, NULL, NULL, 0);
	if (HL_GLPK_CRASHED(&g))
		return hl_glpk_guard_crash(&g, "writing the model", err);
	st = hl_match_model(p, o, &P, err);
	if (st == HL_OK)
		st = hl_model_write(P, path, err);
	if (P != NULL)
		glp_delete_prob(P);
	hl_glpk_guard_end(&g);
	return st;
}

static int
usage(void)
{
	fprintf(stderr, "usage: bench_matches FILE.csv TIME_LIMIT "
		"[textbook] [-t THREADS] [-x MODEL]\n");
	return 1;
}

int
main(int argc, char **argv)
{
	hl_case *c;
	hl_match_options o;
	hl_match_problem *p = NULL;
	hl_match_result *r = NULL;
	hl_error err;
	const char *model = NULL;
	double t0, t1, t2;
	hl_status st;
	int i;

	if (argc < 3)
		return usage();
	c = hl_case_create();
	if (hl_stream_table_read(c, argv[1], &err) != HL_OK ||
	    hl_case_validate(c, &err) != HL_OK) {
		fprintf(stderr, "bench_matches: %s:%ld: %s\n", err.file,
			err.line, err.text);
		return 2;
	}
	hl_match_options_default(&o, c);
	o.time_limit = atof(argv[2]);
	for (i = 3; i < argc; i++) {
		if (strcmp(argv[i], "textbook") == 0)
			o.textbook = 1;
		else if (strcmp(argv[i], "-t") == 0 && i + 1 < argc)
			o.threads = atoi(argv[++i]);
		else if (strcmp(argv[i], "-x") == 0 && i + 1 < argc)
			model = argv[++i];
		else
			return usage();
	}
	t0 = now();
	st = hl_match_prepare(c, 10.0, NULL, NULL, NULL, &p, &err);
	t1 = t2 = now();
	if (st == HL_OK && model != NULL) {
		st = export(p, &o, model, &err);
		t2 = now();
	}
	if (st == HL_OK)
		st = hl_match_run(p, &o, &r, &err);
	if (st != HL_OK) {
		printf("%zu - - - - failed - %.2f\n", c->nstream,
		       now() - t2 + t1 - t0);
		fprintf(stderr, "bench_matches: %s\n", err.text);
		hl_match_problem_free(p);
		hl_case_free(c);
		return 0;
	}
	printf("%zu %zu %zu %zu %zu %s %.3f %.2f\n", c->nstream, r->nsub,
	       r->units, r->lower, r->euler, r->optimal ? "yes" : "no",
	       r->gap, now() - t2 + t1 - t0);
	hl_match_result_free(r);
	hl_match_problem_free(p);
	hl_case_free(c);
	return 0;
}
