/* bench_targets.c - time `targets` against the floor any method must pay.
 *
 * Usage: bench_targets FILE.csv [REPEATS]. Prints one line:
 *   streams floor_s targets_s ratio peak_rss_kib
 * floor: read the stream table and sort its temperatures once;
 * targets: read the table and run the problem table (which sorts too).
 * Each figure is the best of REPEATS runs.
 */
#include <stdio.h>
#include <stdlib.h>
#include <sys/resource.h>
#include <time.h>

#include "cascade.h"
#include "tables.h"

static double
now(void)
{
	struct timespec ts;

	clock_gettime(CLOCK_MONOTONIC, &ts);
	return (double)ts.tv_sec + 1e-9 * (double)ts.tv_nsec;
}

static int
cmp(const void *a, const void *b)
{
	double x = *(const double *)a, y = *(const double *)b;

	return (x > y) - (x < y);
}

static hl_case *
load(const char *path)
{
	hl_case *c = hl_case_create();
	hl_error err;

	if (hl_stream_table_read(c, path, &err) != HL_OK) {
		fprintf(stderr, "bench_targets: %s:%ld: %s\n", err.file,
			err.line, err.text);
		exit(2);
	}
	return c;
}

static double
run_floor(const char *path, size_t *n)
{
	double t0 = now(), *t;
	hl_case *c = load(path);
	size_t i, k = 0;

	t = malloc(2 * c->nstream * sizeof *t);
	for (i = 0; i < c->nstream; i++) {
		t[k++] = c->stream[i].seg[0].supply;
		t[k++] = c->stream[i].seg[0].target;
	}
	qsort(t, k, sizeof *t, cmp);
	*n = c->nstream;
	free(t);
	hl_case_free(c);
	return now() - t0;
}

static double
run_targets(const char *path)
{
	double t0 = now(), dt;
	hl_case *c = load(path);
	hl_cascade *cas;

	if (hl_case_validate(c, NULL) != HL_OK ||
	    hl_cascade_compute(c, 10.0, &cas, NULL) != HL_OK) {
		fprintf(stderr, "bench_targets: targets failed\n");
		exit(3);
	}
	dt = now() - t0;
	hl_cascade_free(cas);
	hl_case_free(c);
	return dt;
}

int
main(int argc, char **argv)
{
	int reps = argc > 2 ? atoi(argv[2]) : 3, r;
	double best_floor = 1e30, best_targets = 1e30;
	struct rusage ru;
	size_t n = 0;

	if (argc < 2) {
		fprintf(stderr, "usage: bench_targets FILE.csv [REPEATS]\n");
		return 1;
	}
	for (r = 0; r < reps; r++) {
		double f = run_floor(argv[1], &n), t = run_targets(argv[1]);

		best_floor = f < best_floor ? f : best_floor;
		best_targets = t < best_targets ? t : best_targets;
	}
	getrusage(RUSAGE_SELF, &ru);
	printf("%zu %.4f %.4f %.2f %ld\n", n, best_floor, best_targets,
	       best_targets / best_floor, ru.ru_maxrss);
	return 0;
}
