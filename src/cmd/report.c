/* report.c - `heatloom report`: the whole study as one HTML file. */
#include "config.h"

#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#include "audit.h"
#include "cascade.h"
#include "cmd.h"
#include "curves.h"
#include "match_milp.h"
#include "netcheck.h"
#include "network_match.h"
#include "output.h"
#include "report_html.h"
#include "retrofit.h"
#include "rfit.h"
#include "sensitivity.h"
#include "study.h"
#include "sweep.h"
#include "tables.h"
#include "targets_out.h"
#include "utility_lp.h"

/* Points of the retrofit curve, as `heatloom audit` takes them, so that the
 * two agree number for number. */
#define RETROFIT_POINTS 11

typedef struct {
	hl_common c;
	double from, to, step;
	double emat, time_limit;   /* NaN unless given */
	int sweep, design;
	const char *title, *author, *date;
	const char *network;
} report_opts;
HL_COMMON_FIRST(report_opts);

#define NUMBER(name, arg, member, lo, hi, text) \
	HL_ROW_NUMBER(name, arg, report_opts, member, lo, hi, text)
#define TEXT(name, arg, member, text) \
	HL_ROW_TEXT(name, arg, report_opts, member, text)
#define OFF(name, member, text) HL_ROW_FLAG(name, report_opts, member, 0, text)

static const hl_option option_rows[] = {
	HL_ROW_DTMIN("ΔTmin of the study (default: the case's, or 10)"),
	HL_ROW_UTILITIES,
	TEXT("network", "FILE", network, "today's network (CSV), instead of "
	     "the case's own"),
	NUMBER("from", "K", from, 0.0, 500.0, "first ΔTmin of the trade-off "
	       "(default 2)"),
	NUMBER("to", "K", to, 0.0, 500.0, "last ΔTmin of the trade-off "
	       "(default 40)"),
	NUMBER("step", "K", step, 1e-3, 500.0, "its grid step (default 1)"),
	OFF("no-sweep", sweep, "leave the trade-off over ΔTmin out"),
	NUMBER("emat", "K", emat, 0.0, 500.0, "exchanger minimum approach of "
	       "the network, at most\nΔTmin (default: the case's, or ΔTmin)"),
	NUMBER("time-limit", "S", time_limit, 0.0, 86400.0, "seconds per "
	       "subnetwork for the match MILP (default:\nthe case's, or 10)"),
	OFF("no-design", design, "leave the matches and the network out"),
	TEXT("title", "TEXT", title, "title of the report (default: from the "
	     "case file name)"),
	TEXT("author", "TEXT", author, "name shown as \"prepared by\""),
	TEXT("date", "TEXT", date, "date shown (default: today, or "
	     "SOURCE_DATE_EPOCH)"),
	HL_ROW_UNITS(HL_UNITS_HELP),
	HL_ROW_OUTPUT("FILE", "write to FILE instead of standard output"),
	HL_ROW_VERBOSE("show the LP solver's messages on standard error"),
	HL_ROW_HELP,
	HL_ROW_END
};

static void
init(void *opts)
{
	report_opts *s = opts;

	s->from = 2.0;
	s->to = 40.0;
	s->step = 1.0;
	s->sweep = 1;
	s->design = 1;
	s->emat = s->time_limit = NAN;
}

static int
check(void *opts)
{
	const report_opts *s = opts;

	return hl_cmd_check_grid("report", s->from, s->to, s->step);
}

/* Everything the report shows, computed before the file is opened. */
typedef struct {
	hl_case *c;
	hl_study y;         /* problem table, utility LP, matches, network */
	hl_threshold th;
	hl_curves *cv;
	hl_supertargets st;
	int have_st;
	hl_sweep *sw;
	hl_sensitivity *sv;
	double pinch[64];
	size_t npinch;
	double emat_hint;
	size_t findings;
	hl_audit *audit;
	hl_retrofit *retrofit;
	hl_rfit_opts rfo;
	hl_network *rfit_today;
	hl_rfit *rfit;
	double *rfit_promise;
	char st_note[HL_ERROR_TEXT], sw_note[HL_ERROR_TEXT];
	char mr_note[HL_ERROR_TEXT], net_note[HL_ERROR_TEXT];
	char audit_note[HL_ERROR_TEXT], rfit_note[HL_ERROR_TEXT];
	char date[32];
} study;

static void
study_free(study *s)
{
	free(s->rfit_promise);
	hl_rfit_free(s->rfit);
	hl_network_free(s->rfit_today);
	hl_retrofit_free(s->retrofit);
	hl_audit_free(s->audit);
	hl_sensitivity_free(s->sv);
	hl_sweep_free(s->sw);
	hl_curves_free(s->cv);
	hl_study_free(&s->y);
	hl_case_free(s->c);
}

/* A stage whose failure leaves its section with the reason instead of
 * failing the report: only "no answer" (exit 3) counts as such. */
static hl_status
optional(hl_status st, const hl_error *e, char *note, size_t size)
{
	if (st != HL_ENOSOLUTION)
		return st;
	snprintf(note, size, "%s", e->text);
	return HL_OK;
}

static hl_status
compute_optional(const report_opts *o, study *s, hl_error *err)
{
	hl_error e;
	hl_status st;

	hl_error_clear(&e);
	st = hl_sweep_point_from(s->c, s->y.cas, s->y.lp, &s->st, &e);
	s->have_st = st == HL_OK;
	st = optional(st, &e, s->st_note, sizeof s->st_note);
	if (st == HL_OK && o->sweep) {
		st = hl_sweep_run(s->c, o->from, o->to, o->step, &s->sw, &e);
		st = optional(st, &e, s->sw_note, sizeof s->sw_note);
	}
	if (st != HL_OK)
		*err = e;
	return st;
}

/* The fewest units at the utility LP's loads (the implicit pair at the
 * problem-table targets without utilities), as `heatloom matches` runs it;
 * no answer within the rules leaves a note, bad rules fail the report. */
static hl_status
compute_matches(const report_opts *o, study *s, hl_error *err)
{
	hl_study_opts so = { 0, NULL, 0, o->time_limit };
	hl_error e;
	hl_status st;

	hl_error_clear(&e);
	st = hl_study_matches(s->c, &so, &s->y, &e);
	if (st == HL_ENOSOLUTION) {
		snprintf(s->mr_note, sizeof s->mr_note, "%s", e.text);
		return HL_OK;
	}
	if (st != HL_OK)
		*err = e;
	return st;
}

/* The matches laid out and sized as `heatloom design` does, with its
 * independent check; a layout that cannot be found leaves a note. */
static hl_status
compute_network(study *s, hl_error *err)
{
	hl_netcheck *chk = NULL;
	hl_error e;
	hl_status st;

	s->emat_hint = NAN;
	if (s->y.mr == NULL)
		return HL_OK;
	hl_error_clear(&e);
	st = hl_study_network(s->c, &s->y, &e);
	if (st == HL_OK)
		st = hl_netcheck_run(s->y.net, &chk, &e);
	if (st == HL_ENOSOLUTION || st == HL_EINPUT) {
		snprintf(s->net_note, sizeof s->net_note, "%s", e.text);
		hl_network_free(s->y.net);
		s->y.net = NULL;
		return HL_OK;
	}
	if (st != HL_OK) {
		*err = e;
		return st;
	}
	s->findings = chk->n;
	hl_netcheck_free(chk);
	s->npinch = hl_network_pinches(s->y.cas, s->y.lp, s->pinch, 64);
	if (s->y.net->penalty > 0.0)
		s->emat_hint = hl_network_emat_hint(&s->y.feed.in);
	return HL_OK;
}

/* The audit, when the case has today's network: bad network rows fail the
 * report as they fail `heatloom audit`; no answer leaves a note. */
static hl_status
compute_audit(study *s, hl_error *err)
{
	hl_error e;
	hl_status st;

	if (s->c->nunit == 0)
		return HL_OK;
	hl_error_clear(&e);
	st = hl_audit_run(s->c, &s->audit, &e);
	hl_cmd_print_warnings(s->audit ? s->audit->net : NULL);
	if (st == HL_OK)
		st = hl_retrofit_screen(s->c, s->audit, RETROFIT_POINTS,
					&s->retrofit, &e);
	if (st == HL_ENOSOLUTION) {
		hl_retrofit_free(s->retrofit);
		s->retrofit = NULL;
		hl_audit_free(s->audit);
		s->audit = NULL;
		snprintf(s->audit_note, sizeof s->audit_note, "%s", e.text);
		return HL_OK;
	}
	if (st != HL_OK)
		*err = e;
	return st;
}

/* Retrofit proposals as `heatloom retrofit --max-changes 2` makes them,
 * each checked; a plant that cannot be simulated, or a proposal that fails
 * its check, leaves a note instead. */
static hl_status
compute_rfit(study *s, hl_error *err)
{
	hl_error e;
	hl_status st;
	size_t i;

	if (s->audit == NULL || s->retrofit == NULL)
		return HL_OK;
	hl_rfit_opts_default(&s->rfo);
	s->rfo.max_changes = 2;
	if (!isnan(s->c->set.repipe_cost))
		s->rfo.repipe_cost = s->c->set.repipe_cost;
	if (!isnan(s->c->set.unit_cost))
		s->rfo.unit_cost = s->c->set.unit_cost;
	hl_error_clear(&e);
	st = hl_rfit_today(s->c, s->audit->net, &s->rfit_today, &e);
	if (st == HL_OK)
		st = hl_rfit_run(s->c, s->rfit_today, &s->rfo, &s->rfit, &e);
	for (i = 0; st == HL_OK && i < s->rfit->nproposal; i++) {
		hl_netcheck *k = NULL;

		st = hl_netcheck_run(s->rfit->p[i].net, &k, &e);
		if (st == HL_OK && k->n > 0)
			st = hl_error_set(&e, HL_ENOSOLUTION, NULL, 0,
			    "proposal %zu fails its check (%s: %s)", i + 1,
			    k->f[0].what, k->f[0].text);
		hl_netcheck_free(k);
	}
	if (st == HL_OK && (s->rfit_promise = malloc((s->rfit->nproposal +
	    1) * sizeof *s->rfit_promise)) == NULL)
		st = hl_error_nomem(&e);
	for (i = 0; st == HL_OK && i < s->rfit->nproposal; i++)
		s->rfit_promise[i] = hl_retrofit_saving_at(s->retrofit,
		    s->rfit->p[i].investment);
	if (st == HL_EIO) {
		*err = e;
		return st;
	}
	if (st != HL_OK) {
		hl_rfit_free(s->rfit);
		s->rfit = NULL;
		snprintf(s->rfit_note, sizeof s->rfit_note, "%s", e.text);
	}
	return HL_OK;
}

static hl_status
load(const report_opts *o, study *s, hl_error *err)
{
	hl_status st;

	hl_output_protect(o->network);
	st = hl_cmd_load_case(&o->c, &s->c, err);
	if (st == HL_OK && o->network != NULL) {
		hl_case_clear_units(s->c);
		st = hl_network_table_read(s->c, o->network, err);
	}
	if (st == HL_OK)
		st = hl_cmd_set_emat("report", s->c, o->emat, err);
	return st;
}

static hl_status
compute(const report_opts *o, study *s, hl_error *err)
{
	hl_study_opts so = { o->c.verbose, hl_cmd_log_stderr, 0,
			     o->time_limit };
	hl_status st;

	memset(s, 0, sizeof *s);
	st = load(o, s, err);
	if (st == HL_OK)
		st = hl_study_targets(s->c, &so, &s->y, err);
	if (st == HL_OK) {
		s->th.kind = hl_cascade_threshold_kind(s->y.cas);
		st = hl_cascade_threshold_dtmin(s->c, s->y.cas, &s->th.dtmin,
						err);
	}
	if (st == HL_OK)
		st = hl_curves_compute(s->c, s->y.cas, s->y.lp, &s->cv, err);
	if (st == HL_OK)
		st = hl_sensitivity_compute(s->c, s->y.cas, &s->sv, err);
	if (st == HL_OK)
		st = compute_optional(o, s, err);
	if (st == HL_OK && o->design)
		st = compute_matches(o, s, err);
	if (st == HL_OK && o->design)
		st = compute_network(s, err);
	if (st == HL_OK)
		st = compute_audit(s, err);
	if (st == HL_OK)
		st = compute_rfit(s, err);
	return st;
}

/* Today, or the time SOURCE_DATE_EPOCH fixes (reproducible output). */
static const char *
date_of(const report_opts *o, char *buf, size_t size)
{
	const char *env = getenv("SOURCE_DATE_EPOCH");
	time_t t = time(NULL);
	struct tm tm;

	if (o->date != NULL)
		return *o->date ? o->date : NULL;
	if (env != NULL && *env != '\0')
		t = (time_t)strtoll(env, NULL, 10);
	if (gmtime_r(&t, &tm) == NULL || strftime(buf, size, "%Y-%m-%d",
						  &tm) == 0)
		return NULL;
	return buf;
}

static const char *
dtmin_from(const report_opts *o, const hl_case *c)
{
	hl_settings def;

	if (!isnan(o->c.dtmin))
		return "the command line, --dtmin";
	hl_settings_default(&def);
	if (c->set.given & HL_GIVEN_DTMIN)
		return c->set.dtmin == def.dtmin ? "set for this case (the "
		       "same as the built-in default)" : "set for this case";
	return c->set.dtmin == def.dtmin ? "built-in default" :
	       "differs from the default: set for this case";
}

static void
fill(const report_opts *o, study *s, hl_report_data *d)
{
	memset(d, 0, sizeof *d);
	d->meta.title = o->title;
	d->meta.author = o->author;
	d->meta.date = date_of(o, s->date, sizeof s->date);
	d->meta.generator = PACKAGE_STRING;
	d->meta.dtmin_from = dtmin_from(o, s->c);
	d->meta.caution = hl_caution;
	d->c = s->c;
	d->cas = s->y.cas;
	d->th = &s->th;
	d->lp = s->y.lp;
	d->cv = s->cv;
	d->st = s->have_st ? &s->st : NULL;
	d->st_note = s->st_note[0] ? s->st_note : NULL;
	d->sw = s->sw;
	d->sw_note = s->sw_note[0] ? s->sw_note : NULL;
	d->sw_from = o->from;
	d->sw_to = o->to;
	d->sw_step = o->step;
	d->sv = s->sv;
	d->mr = s->y.mr;
	d->mr_note = s->mr_note[0] ? s->mr_note : NULL;
	d->audit = s->audit;
	d->retrofit = s->retrofit;
	d->audit_note = s->audit_note[0] ? s->audit_note : NULL;
	d->rfit = s->rfit;
	d->rfit_promise = s->rfit_promise;
	d->rfit_note = s->rfit_note[0] ? s->rfit_note : NULL;
	d->rfit_payback = s->rfo.payback;
	d->rfit_changes = s->rfo.max_changes;
	d->rfit_costs_given = !isnan(s->c->set.repipe_cost) &&
	    !isnan(s->c->set.unit_cost);
	d->network_file = o->network;
	d->net = s->y.net;
	d->net_note = s->net_note[0] ? s->net_note : NULL;
	d->net_npinch = s->npinch;
	d->net_pinch = s->pinch;
	d->net_emat_hint = s->emat_hint;
	d->net_findings = s->findings;
}

static hl_status
run_report(void *opts, hl_error *err)
{
	const report_opts *o = opts;
	study s;
	hl_report_data d;
	hl_output out;
	hl_status st = compute(o, &s, err);

	if (st == HL_OK) {
		fill(o, &s, &d);
		st = hl_output_open(&out, o->c.output, err);
	}
	if (st == HL_OK) {
		st = hl_report_html_write(out.fp, &d, err);
		if (st == HL_OK)
			st = hl_output_commit(&out, err);
		hl_output_abort(&out);
	}
	study_free(&s);
	return st;
}

const hl_command hl_cmd_report = {
	"report", "CASE -o FILE.html [options]",
	"the whole study as one self-contained HTML report for a client",
	"The study as one self-contained HTML file for a client: the case and its\n"
	"stream and utility data, the energy targets and pinch with the heat\n"
	"cascade, the utility levels chosen at least cost, the composite, grand\n"
	"composite and balanced curves, the supertargets at the chosen ΔTmin and\n"
	"the trade-off over a range of ΔTmin, the fewest-units matches and the\n"
	"network laid out and sized from them (grid diagram, every exchanger), the\n"
	"stream data ranked by their effect on the targets, the settings (defaults\n"
	"named as such), the methods with references, and the caution. For a site\n"
	"with an existing network (the case's <network> or --network) also the\n"
	"audit: energy today against the targets and the saving, the culprits, the\n"
	"units as read, the area efficiency and a retrofit at constant α with its\n"
	"payback, and the retrofit proposals of `heatloom retrofit --max-changes\n"
	"2`. Charts and styles are inline: the file needs no network, script\n"
	"or other file, and prints on A4 and Letter. Every number is the rounding\n"
	"of the one in the XML results of the same command (targets, sweep,\n"
	"matches, design, audit, retrofit).\n",
	NULL, option_rows, sizeof(report_opts),
	"give one CASE file", "give one CASE file, not several",
	init, check, run_report
};
