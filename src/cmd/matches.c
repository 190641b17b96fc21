/* matches.c - `heatloom matches`: the fewest exchanger units and their
 * duties. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "cascade.h"
#include "cmd.h"
#include "glpk_guard.h"
#include "match_milp.h"
#include "matches_out.h"
#include "model_out.h"
#include "output.h"
#include "result_xml.h"
#include "utility_lp.h"

typedef struct {
	hl_common c;
	double time_limit;  /* NaN unless --time-limit */
	const char *export_model;
} options;
HL_COMMON_FIRST(options);

static const hl_option option_rows[] = {
	HL_ROW_DTMIN("minimum approach temperature (default: the case's, or 10)"),
	HL_ROW_UTILITIES,
	HL_ROW_FORMAT("text (default), xml, or csv (the match table)"),
	HL_ROW_UNITS(HL_UNITS_HELP),
	HL_ROW_OUTPUT("FILE", "write to FILE instead of standard output"),
	HL_ROW_NUMBER("time-limit", "S", options, time_limit, 0.0, 1e6,
	    "solver time per subnetwork in s (default: the case's,\n"
	    "or 10); at the limit the best network found is given\n"
	    "with its gap to the proven bound; 0: heuristic only"),
	HL_ROW_TEXT("export-model", "FILE", options, export_model,
	    "also write the MILP (CPLEX LP, or free MPS when FILE\n"
	    "ends in .mps) to solve it with another solver"),
	HL_ROW_QUIET("no progress on the terminal"),
	HL_ROW_VERBOSE("show the solver's own messages on standard error"),
	HL_ROW_HELP,
	HL_ROW_END
};

static void
init(void *opts)
{
	((options *)opts)->time_limit = NAN;
}

/* ---- terminal feedback ---- */

typedef struct {
	int shown;          /* a progress line is on the terminal */
} feedback;

static void
on_progress(void *ctx, const hl_match_progress *p)
{
	feedback *f = ctx;

	if (isinf(p->incumbent))
		fprintf(stderr, "\rheatloom: matches: %s (%zu of %zu): "
			"searching, bound %.0f, %.0f s   ", p->label, p->done + 1,
			p->total, p->bound, p->elapsed);
	else
		fprintf(stderr, "\rheatloom: matches: %s (%zu of %zu): best "
			"%.0f, bound %.0f, %.0f s   ", p->label, p->done + 1,
			p->total, p->incumbent, p->bound, p->elapsed);
	fflush(stderr);
	f->shown = 1;
}

static void
clear_progress(feedback *f)
{
	if (f->shown)
		fprintf(stderr, "\r%72s\r", "");
	f->shown = 0;
}

/* ---- the run ---- */

static hl_status
export_model(const hl_match_problem *p, const options *o,
	     const hl_match_options *mo, hl_error *err)
{
	hl_glpk_guard g;
	glp_prob *P = NULL;
	hl_status st;

	hl_glpk_guard_begin(&g, o->c.verbose ? hl_cmd_log_stderr : NULL, NULL,
			    o->c.verbose);
	if (HL_GLPK_CRASHED(&g))
		return hl_glpk_guard_crash(&g, "writing the model", err);
	st = hl_match_model(p, mo, &P, err);
	if (st == HL_OK)
		st = hl_model_write(P, o->export_model, err);
	if (P != NULL)
		glp_delete_prob(P);
	hl_glpk_guard_end(&g);
	return st;
}

static hl_status
write_result(const options *o, const hl_case *c, const hl_match_result *r,
	     hl_error *err)
{
	hl_output out;
	hl_status st = hl_output_open(&out, o->c.output, err);

	if (st != HL_OK)
		return st;
	if (o->c.format == HL_FMT_XML) {
		hl_xml_out *x = hl_xml_out_begin(c->source);

		if (x == NULL)
			st = hl_error_nomem(err);
		else if (hl_matches_xml(hl_xml_out_writer(x), c, r,
					c->set.dtmin) < 0)
			st = hl_error_set(err, HL_EIO, NULL, 0,
					  "cannot build XML");
		else
			st = hl_xml_out_finish(x, out.fp, err);
		hl_xml_out_free(x);
	} else if (o->c.format == HL_FMT_CSV) {
		hl_matches_csv(out.fp, r);
	} else {
		hl_cascade *cas = NULL;

		/* the process pinches, to tell them from utility pinches */
		if (hl_cascade_compute(c, c->set.dtmin, &cas, NULL) != HL_OK)
			cas = NULL;
		hl_matches_text(out.fp, c, r, c->set.dtmin, cas);
		hl_cascade_free(cas);
	}
	st = st == HL_OK ? hl_output_commit(&out, err) : st;
	hl_output_abort(&out);
	return st;
}

/* The utility LP's load of each case utility, or NULL without utilities. */
static hl_status
utility_loads(const hl_case *c, const options *o, double **out,
	      hl_error *err)
{
	hl_utility_lp_opts uo = { o->c.verbose, hl_cmd_log_stderr, NULL, NAN };
	hl_utility_lp *u = NULL;
	hl_status st;

	*out = NULL;
	if (c->nutil == 0)
		return HL_OK;
	st = hl_utility_lp_solve(c, c->set.dtmin, &uo, &u, err);
	if (st == HL_OK)
		st = hl_utility_lp_loads(u, out, err);
	hl_utility_lp_free(u);
	return st;
}

static hl_status
check_outputs(const options *o, hl_error *err)
{
	hl_status st = hl_output_check(o->export_model, err);

	if (st == HL_OK && o->export_model != NULL && o->c.output != NULL &&
	    strcmp(o->export_model, o->c.output) == 0)
		st = hl_error_set(err, HL_EUSAGE, o->export_model, 0,
			"the model and the results cannot go to one file");
	return st;
}

static hl_status
run_matches(void *opts, hl_error *err)
{
	const options *o = opts;
	hl_case *c = NULL;
	hl_match_problem *p = NULL;
	hl_match_result *r = NULL;
	hl_match_options mo;
	feedback fb = { 0 };
	double *loads = NULL;
	hl_status st;

	st = hl_cmd_load_case(&o->c, &c, err);
	if (st == HL_OK)
		st = check_outputs(o, err);
	if (st != HL_OK) {
		hl_case_free(c);
		return st;
	}
	hl_match_options_default(&mo, c);
	if (!isnan(o->time_limit))
		mo.time_limit = o->time_limit;
	mo.log = o->c.verbose ? hl_cmd_log_stderr : NULL;
	if (!o->c.quiet && !o->c.verbose && isatty(STDERR_FILENO))
		mo.progress = on_progress;
	mo.ctx = &fb;
	/* With utilities, the least-cost loads of the utility LP (their
	   utility pinches split the network too); without, the core's
	   implicit pair at the problem-table targets. */
	st = utility_loads(c, o, &loads, err);
	if (st == HL_OK)
		st = hl_match_prepare(c, c->set.dtmin, loads, mo.log, mo.ctx, &p,
				      err);
	if (st == HL_OK && o->export_model != NULL)
		st = export_model(p, o, &mo, err);
	if (st == HL_OK)
		st = hl_match_run(p, &mo, &r, err);
	clear_progress(&fb);
	if (st == HL_OK)
		st = write_result(o, c, r, err);
	hl_match_result_free(r);
	hl_match_problem_free(p);
	free(loads);
	hl_case_free(c);
	return st;
}

const hl_command hl_cmd_matches = {
	"matches", "CASE [options]",
	"fewest exchanger matches and their duties (MILP)",
	"Which hot stream should heat which cold stream, with what duty, using as\n"
	"few exchanger units as possible while meeting the utility targets (the\n"
	"expanded transshipment MILP of Papoulias & Grossmann, 1983, solved with\n"
	"GLPK). The problem is split at every pinch; a pair working on both sides\n"
	"of a pinch counts as two units. With the case's utilities the network meets\n"
	"the least-cost loads of the utility LP (see targets); without, one hot\n"
	"utility above every stream and one cold utility below, at the targets.\n"
	"Match rules and plant areas of an XML case file are obeyed; when they raise\n"
	"the utility targets the report says by how much and because of which rule.\n"
	"CASE is an XML case file or a stream table (CSV).\n",
	NULL, option_rows, sizeof(options),
	"give one CASE file", "give one CASE file, not several",
	init, NULL, run_matches
};
