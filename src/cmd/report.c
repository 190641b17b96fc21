/* report.c - `heatloom report`: the whole study as one HTML file. */
#include "config.h"

#include <getopt.h>
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
#include "sensitivity.h"
#include "sweep.h"
#include "tables.h"
#include "targets_out.h"
#include "utility_lp.h"

/* Points of the retrofit curve, as `heatloom audit` takes them, so that the
 * two agree number for number. */
#define RETROFIT_POINTS 11

static void
help(FILE *fp)
{
	fprintf(fp,
"Usage: heatloom report CASE -o FILE.html [options]\n"
"\n"
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
"payback. Charts and styles are inline: the file needs no network, script\n"
"or other file, and prints on A4 and Letter. Every number is the rounding\n"
"of the one in the XML results of the same command (targets, sweep,\n"
"matches, design, audit).\n"
"\n"
"Options:\n"
"  --dtmin K          ΔTmin of the study (default: the case's, or 10)\n"
"  --utilities FILE   utility table (CSV) to add to the case\n"
"  --network FILE     today's network (CSV), instead of the case's own\n"
"  --from K           first ΔTmin of the trade-off (default 2)\n"
"  --to K             last ΔTmin of the trade-off (default 40)\n"
"  --step K           its grid step (default 1)\n"
"  --no-sweep         leave the trade-off over ΔTmin out\n"
"  --emat K           exchanger minimum approach of the network, at most\n"
"                     ΔTmin (default: the case's, or ΔTmin)\n"
"  --time-limit S     seconds per subnetwork for the match MILP (default:\n"
"                     the case's, or 10)\n"
"  --no-design        leave the matches and the network out\n"
"  --title TEXT       title of the report (default: from the case file name)\n"
"  --author TEXT      name shown as \"prepared by\"\n"
"  --date TEXT        date shown (default: today, or SOURCE_DATE_EPOCH)\n"
HL_HELP_UNITS
"  -o, --output FILE  write to FILE instead of standard output\n"
"  --verbose          show the LP solver's messages on standard error\n"
"  -h, --help         show this help\n"
"\n"
"%s\n", hl_caution);
}

enum { OPT_FROM = 256, OPT_TO, OPT_STEP, OPT_EMAT, OPT_TIME, OPT_NOSWEEP,
       OPT_NODESIGN, OPT_TITLE, OPT_AUTHOR, OPT_DATE, OPT_NETWORK };

typedef struct {
	hl_common o;
	double from, to, step;
	double emat, time_limit;   /* NaN unless given */
	int sweep, design;
	const char *title, *author, *date;
	const char *network;
} report_opts;

/* The report's own options; 0, or 1 after a usage error. */
static int
own_option(int ch, const char *arg, report_opts *s)
{
	static const char *const names[] = { "--from", "--to", "--step",
		"--emat", "--time-limit" };
	static const double lo[] = { 0.0, 0.0, 1e-3, 0.0, 0.0 };
	static const double hi[] = { 500.0, 500.0, 500.0, 500.0, 86400.0 };
	double *dst[] = { &s->from, &s->to, &s->step, &s->emat,
			  &s->time_limit };
	int k = ch - OPT_FROM;

	switch (ch) {
	case OPT_NOSWEEP:
		s->sweep = 0;
		return 0;
	case OPT_NODESIGN:
		s->design = 0;
		return 0;
	case OPT_TITLE:
		s->title = arg;
		return 0;
	case OPT_AUTHOR:
		s->author = arg;
		return 0;
	case OPT_DATE:
		s->date = arg;
		return 0;
	case OPT_NETWORK:
		s->network = arg;
		return 0;
	default:
		return hl_cmd_parse_double("report", names[k], arg, lo[k],
					   hi[k], dst[k]) != 0;
	}
}

static int
parse(int argc, char **argv, report_opts *s)
{
	static const struct option opts[] = {
		{ "dtmin", required_argument, NULL, HL_OPT_DTMIN },
		{ "utilities", required_argument, NULL, HL_OPT_UTIL },
		{ "from", required_argument, NULL, OPT_FROM },
		{ "to", required_argument, NULL, OPT_TO },
		{ "step", required_argument, NULL, OPT_STEP },
		{ "no-sweep", no_argument, NULL, OPT_NOSWEEP },
		{ "emat", required_argument, NULL, OPT_EMAT },
		{ "time-limit", required_argument, NULL, OPT_TIME },
		{ "no-design", no_argument, NULL, OPT_NODESIGN },
		{ "title", required_argument, NULL, OPT_TITLE },
		{ "author", required_argument, NULL, OPT_AUTHOR },
		{ "date", required_argument, NULL, OPT_DATE },
		{ "network", required_argument, NULL, OPT_NETWORK },
		{ "output", required_argument, NULL, 'o' },
		{ "units", required_argument, NULL, HL_OPT_UNITS },
		{ "verbose", no_argument, NULL, HL_OPT_VERBOSE },
		{ "help", no_argument, NULL, 'h' },
		{ NULL, 0, NULL, 0 }
	};
	int ch, rc;

	memset(s, 0, sizeof *s);
	hl_common_init(&s->o);
	s->from = 2.0;
	s->to = 40.0;
	s->step = 1.0;
	s->sweep = 1;
	s->design = 1;
	s->emat = s->time_limit = NAN;
	optind = 1;
	opterr = 0;
	while ((ch = getopt_long(argc, argv, ":o:h", opts, NULL)) != -1) {
		if (hl_cmd_common_opt("report", ch, argv, 0, help, &s->o,
				      &rc)) {
			if (rc != 0)
				return rc;
		} else if (own_option(ch, optarg, s) != 0) {
			return 1;
		}
	}
	if ((rc = hl_cmd_one_input("report", argc, argv, &s->o)) != 0)
		return rc;
	if (s->to < s->from)
		return hl_cmd_usage("report", "--to %g is below --from %g",
				    s->to, s->from);
	if ((s->to - s->from) / s->step > 10000.0)
		return hl_cmd_usage("report", "more than 10001 grid points; "
				    "use a larger --step");
	return 0;
}

/* Everything the report shows, computed before the file is opened. */
typedef struct {
	hl_case *c;
	hl_cascade *cas;
	hl_threshold th;
	hl_utility_lp *lp;
	hl_curves *cv;
	hl_supertargets st;
	int have_st;
	hl_sweep *sw;
	hl_sensitivity *sv;
	hl_match_result *mr;
	hl_network_feed feed;
	hl_network *net;
	double pinch[64];
	size_t npinch;
	double emat_hint;
	size_t findings;
	hl_audit *audit;
	hl_retrofit *retrofit;
	char st_note[HL_ERROR_TEXT], sw_note[HL_ERROR_TEXT];
	char mr_note[HL_ERROR_TEXT], net_note[HL_ERROR_TEXT];
	char audit_note[HL_ERROR_TEXT];
	char date[32];
} study;

static void
study_free(study *s)
{
	hl_retrofit_free(s->retrofit);
	hl_audit_free(s->audit);
	hl_network_free(s->net);
	hl_network_feed_free(&s->feed);
	hl_match_result_free(s->mr);
	hl_sensitivity_free(s->sv);
	hl_sweep_free(s->sw);
	hl_curves_free(s->cv);
	hl_utility_lp_free(s->lp);
	hl_cascade_free(s->cas);
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
	st = hl_sweep_point_from(s->c, s->cas, s->lp, &s->st, &e);
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
	hl_match_options mo;
	double *loads = NULL;
	hl_error e;
	hl_status st = HL_OK;
	size_t i;

	if (s->lp != NULL &&
	    (loads = malloc(s->c->nutil * sizeof *loads)) == NULL)
		return hl_error_nomem(err);
	for (i = 0; loads != NULL && i < s->c->nutil; i++)
		loads[i] = s->lp->util[i].load;
	hl_match_options_default(&mo, s->c);
	if (!isnan(o->time_limit))
		mo.time_limit = o->time_limit;
	hl_error_clear(&e);
	st = hl_match_solve(s->c, s->c->set.dtmin, loads, &mo, &s->mr, &e);
	free(loads);
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
	if (s->mr == NULL)
		return HL_OK;
	hl_error_clear(&e);
	st = hl_network_from_matches(s->c, s->mr, s->cas->qh, s->cas->qc,
				     &s->feed, &e);
	if (st == HL_OK)
		st = hl_network_place(&s->feed.in, &s->net, &e);
	if (st == HL_OK)
		st = hl_netcheck_run(s->net, &chk, &e);
	if (st == HL_ENOSOLUTION || st == HL_EINPUT) {
		snprintf(s->net_note, sizeof s->net_note, "%s", e.text);
		hl_network_free(s->net);
		s->net = NULL;
		return HL_OK;
	}
	if (st != HL_OK) {
		*err = e;
		return st;
	}
	s->findings = chk->n;
	hl_netcheck_free(chk);
	s->npinch = hl_network_pinches(s->cas, s->lp, s->pinch, 64);
	if (s->net->penalty > 0.0)
		s->emat_hint = hl_network_emat_hint(&s->feed.in);
	return HL_OK;
}

/* "heatloom: FILE:LINE: warning: text" for each warning of the reading of
 * today's network, as `heatloom audit` prints them. */
static void
print_warnings(const hl_existing *net)
{
	size_t i;

	for (i = 0; net != NULL && i < net->nwarn; i++) {
		const hl_error *w = &net->warn[i];

		fprintf(stderr, "heatloom: ");
		if (w->file[0] != '\0' && w->line > 0)
			fprintf(stderr, "%s:%ld: ", w->file, w->line);
		else if (w->file[0] != '\0')
			fprintf(stderr, "%s: ", w->file);
		fprintf(stderr, "warning: %s\n", w->text);
	}
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
	print_warnings(s->audit ? s->audit->net : NULL);
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

static hl_status
load(const report_opts *o, study *s, hl_error *err)
{
	hl_status st;

	hl_output_protect(o->network);
	st = hl_cmd_load_case(&o->o, &s->c, err);
	if (st == HL_OK && o->network != NULL) {
		hl_case_clear_units(s->c);
		st = hl_network_table_read(s->c, o->network, err);
	}
	if (st == HL_OK && !isnan(o->emat)) {
		if (o->emat > s->c->set.dtmin || !(o->emat > 0.0))
			return hl_error_set(err, HL_EUSAGE, NULL, 0, "report: "
			    "--emat %g K must lie above 0 and not above ΔTmin "
			    "%g K", o->emat, s->c->set.dtmin);
		s->c->set.emat = o->emat;
	}
	return st;
}

static hl_status
compute(const report_opts *o, study *s, hl_error *err)
{
	hl_utility_lp_opts lo = { o->o.verbose, hl_cmd_log_stderr, NULL,
				  NAN };
	hl_status st;

	memset(s, 0, sizeof *s);
	st = load(o, s, err);
	if (st == HL_OK)
		st = hl_cascade_compute(s->c, s->c->set.dtmin, &s->cas, err);
	if (st == HL_OK) {
		s->th.kind = hl_cascade_threshold_kind(s->cas);
		st = hl_cascade_threshold_dtmin(s->c, s->cas, &s->th.dtmin,
						err);
	}
	if (st == HL_OK && s->c->nutil > 0)
		st = hl_utility_lp_solve(s->c, s->c->set.dtmin, &lo, &s->lp,
					 err);
	if (st == HL_OK)
		st = hl_curves_compute(s->c, s->cas, s->lp, &s->cv, err);
	if (st == HL_OK)
		st = hl_sensitivity_compute(s->c, s->cas, &s->sv, err);
	if (st == HL_OK)
		st = compute_optional(o, s, err);
	if (st == HL_OK && o->design)
		st = compute_matches(o, s, err);
	if (st == HL_OK && o->design)
		st = compute_network(s, err);
	if (st == HL_OK)
		st = compute_audit(s, err);
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

	if (!isnan(o->o.dtmin))
		return "the command line, --dtmin";
	hl_settings_default(&def);
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
	d->cas = s->cas;
	d->th = &s->th;
	d->lp = s->lp;
	d->cv = s->cv;
	d->st = s->have_st ? &s->st : NULL;
	d->st_note = s->st_note[0] ? s->st_note : NULL;
	d->sw = s->sw;
	d->sw_note = s->sw_note[0] ? s->sw_note : NULL;
	d->sw_from = o->from;
	d->sw_to = o->to;
	d->sw_step = o->step;
	d->sv = s->sv;
	d->mr = s->mr;
	d->mr_note = s->mr_note[0] ? s->mr_note : NULL;
	d->audit = s->audit;
	d->retrofit = s->retrofit;
	d->audit_note = s->audit_note[0] ? s->audit_note : NULL;
	d->network_file = o->network;
	d->net = s->net;
	d->net_note = s->net_note[0] ? s->net_note : NULL;
	d->net_npinch = s->npinch;
	d->net_pinch = s->pinch;
	d->net_emat_hint = s->emat_hint;
	d->net_findings = s->findings;
}

static hl_status
run_report(const report_opts *o, hl_error *err)
{
	study s;
	hl_report_data d;
	hl_output out;
	hl_status st = compute(o, &s, err);

	if (st == HL_OK) {
		fill(o, &s, &d);
		st = hl_output_open(&out, o->o.output, err);
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

static int
run(int argc, char **argv)
{
	report_opts o;
	hl_error err;
	int rc = parse(argc, argv, &o);

	if (rc != 0)
		return rc < 0 ? 0 : rc;
	hl_error_clear(&err);
	if (run_report(&o, &err) != HL_OK)
		return hl_cmd_fail(&err);
	return 0;
}

const hl_command hl_cmd_report = {
	"report", "CASE -o FILE.html [--dtmin K] [--utilities FILE] [--network FILE] "
	"[--from K --to K --step K] [--no-sweep] [--emat K] [--time-limit S] "
	"[--no-design] [--title TEXT] "
	"[--author TEXT] [--date TEXT] [--verbose]",
	"the whole study as one self-contained HTML report for a client",
	run, help
};
