/* curves.c - `heatloom curves`: the composite, shifted composite, grand
 * composite and balanced composite curves as SVG charts and CSV points. */
#include <errno.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>

#include "cascade.h"
#include "cmd.h"
#include "curves.h"
#include "curves_out.h"
#include "output.h"
#include "svg.h"
#include "utility_lp.h"

typedef struct {
	hl_common c;
	const char *dir;  /* -o names the folder here */
} options;
HL_COMMON_FIRST(options);

static const hl_option option_rows[] = {
	HL_ROW_DTMIN("minimum approach temperature (default: the case's, or 10)"),
	HL_ROW_UTILITIES,
	HL_ROW_UNITS(HL_UNITS_HELP),
	HL_ROW_OUTPUT("DIR", "the folder to write into (required)"),
	HL_ROW_VERBOSE("show the LP solver's messages on standard error"),
	HL_ROW_HELP,
	HL_ROW_END
};

static int
check(void *opts)
{
	options *o = opts;

	o->dir = o->c.output;
	o->c.output = NULL;
	if (o->dir == NULL || *o->dir == '\0')
		return hl_cmd_usage("curves", "give the folder to write into "
				    "with -o DIR");
	return 0;
}

/* Everything the files are made of, computed before any is written. */
typedef struct {
	hl_case *c;
	hl_cascade *cas;
	hl_utility_lp *lp;
	hl_curves *cv;
	hl_svg_chart *chart[4];
} study;

static void
study_free(study *s)
{
	size_t i;

	for (i = 0; i < 4; i++)
		hl_svg_chart_free(s->chart[i]);
	hl_curves_free(s->cv);
	hl_utility_lp_free(s->lp);
	hl_cascade_free(s->cas);
	hl_case_free(s->c);
}

static hl_status
compute(const hl_common *o, study *s, hl_error *err)
{
	hl_utility_lp_opts lo = { o->verbose, hl_cmd_log_stderr, NULL, NAN };
	hl_status st;
	size_t i;

	hl_common exact = *o;

	memset(s, 0, sizeof *s);
	exact.exact_latent = 1;   /* the curves show latent heat as steps */
	st = hl_cmd_load_case(&exact, &s->c, err);
	if (st == HL_OK)
		st = hl_cascade_compute(s->c, s->c->set.dtmin, &s->cas, err);
	if (st == HL_OK && s->c->nutil > 0)
		st = hl_utility_lp_solve(s->c, s->c->set.dtmin, &lo, &s->lp,
					 err);
	if (st == HL_OK)
		st = hl_curves_compute(s->c, s->cas, s->lp, &s->cv, err);
	if (st != HL_OK)
		return st;
	s->chart[0] = hl_curves_chart_composite(s->c, s->cas, s->cv, 0);
	s->chart[1] = hl_curves_chart_composite(s->c, s->cas, s->cv, 1);
	s->chart[2] = hl_curves_chart_grand(s->c, s->cas, s->cv, s->lp);
	if (s->lp != NULL)
		s->chart[3] = hl_curves_chart_balanced(s->c, s->cv, s->lp);
	for (i = 0; i < (s->lp ? 4u : 3u); i++)
		if (s->chart[i] == NULL)
			return hl_error_nomem(err);
	return HL_OK;
}

static hl_status
make_dir(const char *dir, hl_error *err)
{
	struct stat sb;

	if (stat(dir, &sb) == 0) {
		if (!S_ISDIR(sb.st_mode))
			return hl_error_set(err, HL_EUSAGE, dir, 0,
				"is a file, not a folder; give a folder "
				"with -o");
		return HL_OK;
	}
	if (mkdir(dir, 0777) != 0)
		return hl_error_set(err, HL_EIO, dir, 0,
			"cannot make the folder: %s", strerror(errno));
	return HL_OK;
}

enum { F_SVG, F_CSV };

static hl_status
write_one(const study *s, const char *dir, size_t which, int kind,
	  hl_error *err)
{
	static const char *const names[] = { "composite", "shifted-composite",
		"grand-composite", "balanced-composite" };
	char path[4096];
	hl_output out;
	hl_status st;

	snprintf(path, sizeof path, "%s/%s.%s", dir, names[which],
		 kind == F_SVG ? "svg" : "csv");
	st = hl_output_open(&out, path, err);
	if (st != HL_OK)
		return st;
	if (kind == F_SVG)
		st = hl_svg_chart_write_file(s->chart[which], out.fp, err);
	else if (which <= 1)
		hl_curves_csv_composite(out.fp, s->cv, (int)which);
	else if (which == 2)
		hl_curves_csv_grand(out.fp, s->cv);
	else
		hl_curves_csv_balanced(out.fp, s->cv);
	if (st == HL_OK)
		st = hl_output_commit(&out, err);
	hl_output_abort(&out);
	return st;
}

static hl_status
run_curves(void *opts, hl_error *err)
{
	const char *dir = ((const options *)opts)->dir;
	study s;
	hl_status st = compute(opts, &s, err);
	size_t i, n = s.lp ? 4 : 3;

	if (st == HL_OK)
		st = make_dir(dir, err);
	for (i = 0; st == HL_OK && i < n; i++) {
		st = write_one(&s, dir, i, F_SVG, err);
		if (st == HL_OK)
			st = write_one(&s, dir, i, F_CSV, err);
	}
	if (st == HL_OK && s.lp == NULL)
		fprintf(stderr, "heatloom: note: no utilities in the case, so "
			"no balanced composite curves; add a utility table "
			"with --utilities FILE\n");
	study_free(&s);
	return st;
}

const hl_command hl_cmd_curves = {
	"curves", "CASE -o DIR [options]",
	"composite, grand composite and balanced curves as SVG and CSV",
	"Draw the curves of a pinch study into the folder DIR (made if absent):\n"
	"  composite.svg           hot and cold composite curves\n"
	"  shifted-composite.svg   the same on shifted temperatures\n"
	"  grand-composite.svg     grand composite curve with the least-cost utility\n"
	"                          levels drawn against it\n"
	"  balanced-composite.svg  composites with the utilities at their loads\n"
	"                          (only when the case has utilities)\n"
	"and the points of each as CSV (composite.csv, ...; kW and °C).\n"
	"CASE is an XML case file or a stream table (CSV).\n",
	NULL, option_rows, sizeof(options),
	"give one CASE file", "give one CASE file, not several",
	NULL, check, run_curves
};
