/* targets.c - `heatloom targets`: minimum utilities and pinches. */
#include <getopt.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>

#include "cascade.h"
#include "cmd.h"
#include "output.h"
#include "result_xml.h"
#include "sensitivity.h"
#include "sensitivity_out.h"
#include "sweep.h"
#include "sweep_out.h"
#include "targets_out.h"
#include "utility_lp.h"
#include "utility_out.h"

static void
help(FILE *fp)
{
	fprintf(fp,
"Usage: heatloom targets CASE [options]\n"
"\n"
"Minimum hot and cold utility, pinch temperatures and the heat cascade of\n"
"the process streams (problem table algorithm). When the case has utilities,\n"
"also the load and yearly cost of each utility level at least total cost\n"
"(transshipment LP) and the utility pinches. CASE is an XML case file or a\n"
"stream table (CSV).\n"
"\n"
"Options:\n"
"  --dtmin K          minimum approach temperature (default: the case's, or 10)\n"
"  --utilities FILE   utility table (CSV) to add to the case\n"
"  --format FMT       text (default), xml, or csv (the cascade)\n"
"  --sensitivity      how far each stream datum and ΔTmin move the targets,\n"
"                     ranked, with the band from the cp_tol and t_tol\n"
"                     tolerances (csv: one row per datum)\n"
"  --supertargets     also the area, units, shells and cost targets at this\n"
"                     ΔTmin (text and xml)\n"
HL_HELP_UNITS
"  -o, --output FILE  write to FILE instead of standard output\n"
"  --verbose          show the LP solver's messages on standard error\n"
"  -h, --help         show this help\n"
"\n"
"%s\n", hl_caution);
}

enum { OPT_SENS = 256, OPT_SUPER };

/* --sensitivity: replaces the text and CSV outputs, adds to the XML. */
static int want_sensitivity;
/* --supertargets: adds to the text and the XML. */
static int want_super;

static int
parse(int argc, char **argv, hl_common *o)
{
	static const struct option opts[] = {
		{ "dtmin", required_argument, NULL, HL_OPT_DTMIN },
		{ "utilities", required_argument, NULL, HL_OPT_UTIL },
		{ "format", required_argument, NULL, HL_OPT_FORMAT },
		{ "sensitivity", no_argument, NULL, OPT_SENS },
		{ "supertargets", no_argument, NULL, OPT_SUPER },
		{ "output", required_argument, NULL, 'o' },
		{ "verbose", no_argument, NULL, HL_OPT_VERBOSE },
		{ "units", required_argument, NULL, HL_OPT_UNITS },
		{ "help", no_argument, NULL, 'h' },
		{ NULL, 0, NULL, 0 }
	};
	const unsigned formats = HL_FMT_BIT(HL_FMT_TEXT) |
				 HL_FMT_BIT(HL_FMT_XML) | HL_FMT_BIT(HL_FMT_CSV);
	int ch, rc;

	hl_common_init(o);
	want_sensitivity = 0;
	want_super = 0;
	optind = 1;
	opterr = 0;
	while ((ch = getopt_long(argc, argv, ":o:h", opts, NULL)) != -1) {
		if (hl_cmd_common_opt("targets", ch, argv, formats, help, o,
				      &rc)) {
			if (rc != 0)
				return rc;
			continue;
		}
		if (ch == OPT_SENS)
			want_sensitivity = 1;
		else if (ch == OPT_SUPER)
			want_super = 1;
	}
	return hl_cmd_one_input("targets", argc, argv, o);
}

static hl_status
write_xml(FILE *fp, const hl_case *c, const hl_cascade *cas,
	  const hl_threshold *th, const hl_utility_lp *lp,
	  const hl_sensitivity *sv, const hl_supertargets *sup, hl_error *err)
{
	hl_xml_out *x = hl_xml_out_begin(c->source);
	hl_status st;

	if (x == NULL)
		return hl_error_nomem(err);
	if (hl_targets_xml_begin(hl_xml_out_writer(x), cas, th) < 0 ||
	    (lp != NULL && hl_utility_lp_xml(hl_xml_out_writer(x), c, lp) < 0) ||
	    hl_targets_xml_end(hl_xml_out_writer(x)) < 0 ||
	    (sv != NULL && hl_sensitivity_xml(hl_xml_out_writer(x), c, sv) < 0) ||
	    (sup != NULL && hl_supertargets_xml(hl_xml_out_writer(x),
						"supertargets", sup) < 0))
		st = hl_error_set(err, HL_EIO, NULL, 0, "cannot build XML");
	else
		st = hl_xml_out_finish(x, fp, err);
	hl_xml_out_free(x);
	return st;
}

static void
write_text(FILE *fp, const hl_case *c, const hl_cascade *cas,
	   const hl_threshold *th, const hl_utility_lp *lp,
	   const hl_supertargets *sup)
{
	hl_targets_text_summary(fp, c, cas, th);
	if (lp != NULL)
		hl_utility_lp_text(fp, c, lp);
	if (sup != NULL)
		hl_supertargets_text(fp, c, sup);
	hl_targets_text_table(fp, cas);
	hl_targets_text_caution(fp);
}

static hl_status
run_targets(const hl_common *o, hl_error *err)
{
	hl_utility_lp_opts lo = { o->verbose, hl_cmd_log_stderr, NULL, NAN };
	hl_case *c = NULL;
	hl_cascade *cas = NULL;
	hl_utility_lp *lp = NULL;
	hl_sensitivity *sv = NULL;
	hl_threshold th = { 0, HUGE_VAL };
	hl_supertargets sup;
	hl_output out;
	hl_status st;

	st = hl_cmd_load_case(o, &c, err);
	if (st == HL_OK)
		st = hl_output_check(o->output, err);
	if (st == HL_OK)
		st = hl_cascade_compute(c, c->set.dtmin, &cas, err);
	if (st == HL_OK) {
		th.kind = hl_cascade_threshold_kind(cas);
		st = hl_cascade_threshold_dtmin(c, cas, &th.dtmin, err);
	}
	if (st == HL_OK && c->nutil > 0)
		st = hl_utility_lp_solve(c, c->set.dtmin, &lo, &lp, err);
	if (st == HL_OK && want_sensitivity)
		st = hl_sensitivity_compute(c, cas, &sv, err);
	if (st == HL_OK && want_super)
		st = hl_sweep_point_from(c, cas, lp, &sup, err);
	if (st == HL_OK)
		st = hl_output_open(&out, o->output, err);
	if (st == HL_OK) {
		if (o->format == HL_FMT_XML)
			st = write_xml(out.fp, c, cas, &th, lp, sv,
				       want_super ? &sup : NULL, err);
		else if (sv != NULL && o->format == HL_FMT_CSV)
			hl_sensitivity_csv(out.fp, c, sv);
		else if (sv != NULL)
			hl_sensitivity_text(out.fp, c, cas, sv);
		else if (o->format == HL_FMT_CSV)
			hl_targets_csv(out.fp, cas);
		else
			write_text(out.fp, c, cas, &th, lp,
				   want_super ? &sup : NULL);
		st = st == HL_OK ? hl_output_commit(&out, err) : st;
		hl_output_abort(&out);
	}
	hl_sensitivity_free(sv);
	hl_utility_lp_free(lp);
	hl_cascade_free(cas);
	hl_case_free(c);
	return st;
}

static int
run(int argc, char **argv)
{
	hl_common o;
	hl_error err;
	int rc = parse(argc, argv, &o);

	if (rc != 0)
		return rc < 0 ? 0 : rc;
	hl_error_clear(&err);
	if (run_targets(&o, &err) != HL_OK)
		return hl_cmd_fail(&err);
	return 0;
}

const hl_command hl_cmd_targets = {
	"targets", "CASE [--dtmin K] [--utilities FILE] [--format text|xml|csv] "
	"[--sensitivity] [--supertargets] [-o FILE] [--verbose]",
	"energy targets, pinches, heat cascade, least-cost utility levels",
	run, help
};
