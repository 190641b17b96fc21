/* targets.c - `heatloom targets`: minimum utilities and pinches. */
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

typedef struct {
	hl_common c;
	int sensitivity;  /* replaces the text and CSV outputs, adds to XML */
	int super;        /* adds to the text and the XML */
} options;
HL_COMMON_FIRST(options);

static const hl_option option_rows[] = {
	HL_ROW_DTMIN("minimum approach temperature (default: the case's, or 10)"),
	HL_ROW_UTILITIES,
	HL_ROW_FORMAT("text (default), xml, or csv (the cascade)"),
	HL_ROW_FLAG("sensitivity", options, sensitivity, 1,
	    "how far each stream datum and ΔTmin move the targets,\n"
	    "ranked, with the band from the cp_tol and t_tol\n"
	    "tolerances (csv: one row per datum); with\n"
	    "--supertargets the supertargets follow it"),
	HL_ROW_FLAG("supertargets", options, super, 1,
	    "also the area, units, shells and cost targets at this\n"
	    "ΔTmin (text and xml)"),
	HL_ROW_UNITS(HL_UNITS_HELP),
	HL_ROW_OUTPUT("FILE", "write to FILE instead of standard output"),
	HL_ROW_VERBOSE("show the LP solver's messages on standard error"),
	HL_ROW_HELP,
	HL_ROW_END
};

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

/* The process targets need no utility: when the utilities cannot serve,
 * they are still printed, with the reason (the command then exits 3). */
static void
text_no_utility(FILE *fp, const hl_error *why)
{
	char buf[HL_ERROR_TEXT + HL_ERROR_FILE + 32];

	hl_error_format(why, buf, sizeof buf);
	fprintf(fp, "\nUtility levels         none: the utilities cannot "
		"serve the process.\n                       %s\n", buf);
}

static void
write_text(FILE *fp, const hl_case *c, const hl_cascade *cas,
	   const hl_threshold *th, const hl_utility_lp *lp,
	   const hl_supertargets *sup, const hl_error *why)
{
	hl_targets_text_summary(fp, c, cas, th);
	if (lp != NULL)
		hl_utility_lp_text(fp, c, lp);
	else if (why != NULL)
		text_no_utility(fp, why);
	if (sup != NULL)
		hl_supertargets_text(fp, c, sup);
	hl_targets_text_table(fp, cas);
	hl_targets_text_caution(fp);
}

/* --sensitivity text, followed by the supertargets when both are asked. */
static void
sens_text(FILE *fp, const hl_case *c, const hl_cascade *cas,
	  const hl_sensitivity *sv, const hl_supertargets *sup)
{
	hl_sensitivity_text(fp, c, cas, sv);
	if (sup != NULL)
		hl_supertargets_text(fp, c, sup);
}

static hl_status
run_targets(void *opts, hl_error *err)
{
	const options *oo = opts;
	const hl_common *o = &oo->c;
	hl_utility_lp_opts lo = { o->verbose, hl_cmd_log_stderr, NULL, NAN };
	hl_case *c = NULL;
	hl_cascade *cas = NULL;
	hl_utility_lp *lp = NULL;
	hl_sensitivity *sv = NULL;
	hl_threshold th = { 0, HUGE_VAL };
	hl_supertargets sup;
	hl_error why;
	hl_output out;
	hl_status st;

	hl_common exact = *o;

	/* Latent heat as steps; the sensitivity and the supertargets work
	 * along temperatures and take it spread (case.h). */
	exact.exact_latent = !oo->sensitivity && !oo->super;
	hl_error_clear(&why);
	st = hl_cmd_load_case(&exact, &c, err);
	if (st == HL_OK)
		st = hl_output_check(o->output, err);
	if (st == HL_OK)
		st = hl_cascade_compute(c, c->set.dtmin, &cas, err);
	if (st == HL_OK) {
		th.kind = hl_cascade_threshold_kind(cas);
		st = hl_cascade_threshold_dtmin(c, cas, &th.dtmin, err);
	}
	if (st == HL_OK && c->nutil > 0) {
		st = hl_utility_lp_solve(c, c->set.dtmin, &lo, &lp, err);
		if (st == HL_ENOSOLUTION) {
			why = *err;
			st = HL_OK;
		}
	}
	if (st == HL_OK && oo->sensitivity)
		st = hl_sensitivity_compute(c, cas, &sv, err);
	if (st == HL_OK && oo->super && why.status == HL_OK)
		st = hl_sweep_point_from(c, cas, lp, &sup, err);
	if (st == HL_OK)
		st = hl_output_open(&out, o->output, err);
	if (st == HL_OK) {
		const hl_supertargets *ps = oo->super && why.status == HL_OK ?
					    &sup : NULL;

		if (o->format == HL_FMT_XML)
			st = write_xml(out.fp, c, cas, &th, lp, sv, ps, err);
		else if (sv != NULL && o->format == HL_FMT_CSV)
			hl_sensitivity_csv(out.fp, c, sv);
		else if (sv != NULL)
			sens_text(out.fp, c, cas, sv, ps);
		else if (o->format == HL_FMT_CSV)
			hl_targets_csv(out.fp, cas);
		else
			write_text(out.fp, c, cas, &th, lp, ps,
				   why.status != HL_OK ? &why : NULL);
		st = st == HL_OK ? hl_output_commit(&out, err) : st;
		hl_output_abort(&out);
	}
	if (st == HL_OK && why.status != HL_OK) {
		*err = why;
		st = why.status;
	}
	hl_sensitivity_free(sv);
	hl_utility_lp_free(lp);
	hl_cascade_free(cas);
	hl_case_free(c);
	return st;
}

const hl_command hl_cmd_targets = {
	"targets", "CASE [options]",
	"energy targets, pinches, heat cascade, least-cost utility levels",
	"Minimum hot and cold utility, pinch temperatures and the heat cascade of\n"
	"the process streams (problem table algorithm). When the case has utilities,\n"
	"also the load and yearly cost of each utility level at least total cost\n"
	"(transshipment LP) and the utility pinches; when the utilities cannot\n"
	"serve the process, the process targets still print, then the reason,\n"
	"and the exit status is 3. CASE is an XML case file or a stream table\n"
	"(CSV).\n",
	NULL, option_rows, sizeof(options),
	"give one CASE file", "give one CASE file, not several",
	NULL, NULL, run_targets
};
