/* design.c - `heatloom design`: from a case to a sized, checked network.
 *
 * Stages: the problem table (targets, pinches), the utility LP when the
 * case has utilities (their loads), the match MILP (fewest units and the
 * heat of every match), the placement and sizing of the network, then the
 * independent check of the network as written (the XML is read back and
 * verified by netcheck.h): a network that fails it is never written.
 */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "cascade.h"
#include "cmd.h"
#include "grid_svg.h"
#include "match_milp.h"
#include "matches_out.h"
#include "netcheck.h"
#include "network.h"
#include "network_match.h"
#include "network_write.h"
#include "network_read.h"
#include "output.h"
#include "result_xml.h"
#include "study.h"
#include "targets_out.h"
#include "utility_lp.h"
#include "utility_out.h"

typedef struct {
	hl_common c;
	double emat;        /* NaN unless --emat */
	double time_limit;  /* NaN unless --time-limit */
	const char *svg;
} options;
HL_COMMON_FIRST(options);

static const hl_option option_rows[] = {
	HL_ROW_DTMIN("minimum approach temperature for the targets (default:\n"
		     "the case's, or 10)"),
	HL_ROW_NUMBER("emat", "K", options, emat, 0.0, 500.0,
	    "exchanger minimum approach, at most ΔTmin (default:\n"
	    "the case's, or ΔTmin)"),
	HL_ROW_UTILITIES,
	HL_ROW_FORMAT("text (default), xml (what `heatloom check` reads), csv"),
	HL_ROW_UNITS(HL_UNITS_HELP),
	HL_ROW_OUTPUT("FILE", "write to FILE instead of standard output"),
	HL_ROW_TEXT("svg", "FILE", options, svg,
	    "also draw the grid diagram into FILE (SVG)"),
	HL_ROW_NUMBER("time-limit", "S", options, time_limit, 0.0, 86400.0,
	    "seconds per subnetwork for the match MILP (default:\n"
	    "the case's, or 10); the best network found is used"),
	HL_ROW_QUIET("no warnings on standard error"),
	HL_ROW_VERBOSE("the solvers' messages on standard error"),
	HL_ROW_HELP,
	HL_ROW_END
};

static void
init(void *opts)
{
	options *o = opts;

	o->emat = o->time_limit = NAN;
}

static int
check(void *opts)
{
	const options *o = opts;

	if (o->svg != NULL && o->c.output != NULL &&
	    strcmp(o->svg, o->c.output) == 0)
		return hl_cmd_usage("design", "--svg and -o name the same "
		    "file '%s'", o->svg);
	return 0;
}

/* What the stages give, freed together. */
typedef struct {
	hl_case *c;
	hl_cascade *cas;
	hl_utility_lp *lp;
	hl_match_result *mr;
	hl_network_feed feed;
	hl_network *net;
	char *xml;          /* the results document, as it will be written */
	size_t xml_len;
} run_state;

static void
state_free(run_state *s)
{
	free(s->xml);
	hl_network_free(s->net);
	hl_network_feed_free(&s->feed);
	hl_match_result_free(s->mr);
	hl_utility_lp_free(s->lp);
	hl_cascade_free(s->cas);
	hl_case_free(s->c);
}

static hl_status
load(const options *o, run_state *s, hl_error *err)
{
	hl_status st = hl_cmd_load_case(&o->c, &s->c, err);

	if (st == HL_OK && o->svg != NULL)
		st = hl_output_check(o->svg, err);
	if (st != HL_OK)
		return st;
	if (!isnan(o->emat)) {
		if (o->emat > s->c->set.dtmin || !(o->emat > 0.0))
			return hl_error_set(err, HL_EUSAGE, NULL, 0, "design: "
			    "--emat %g K must lie above 0 and not above ΔTmin "
			    "%g K", o->emat, s->c->set.dtmin);
		s->c->set.emat = o->emat;
	}
	if (!(s->c->set.dtmin > 0.0))
		return hl_error_set(err, HL_EINPUT, s->c->source, 0, "a "
		    "network needs ΔTmin above 0 K (a zero approach needs "
		    "infinite area): give --dtmin");
	return HL_OK;
}

/* Targets, utility loads, matches, placement (study.h). */
static hl_status
solve(const options *o, run_state *s, hl_error *err)
{
	hl_study_opts so = { o->c.verbose, hl_cmd_log_stderr, 1,
			     o->time_limit };
	hl_study y;
	hl_status st;

	memset(&y, 0, sizeof y);
	st = hl_study_targets(s->c, &so, &y, err);
	if (st == HL_OK)
		st = hl_study_matches(s->c, &so, &y, err);
	if (st == HL_OK)
		st = hl_study_network(s->c, &y, err);
	/* run_state owns what the stages gave from here (state_free). */
	s->cas = y.cas;
	s->lp = y.lp;
	s->mr = y.mr;
	s->feed = y.feed;
	s->net = y.net;
	if (st == HL_OK && (s->net->source = strdup(s->c->source != NULL ?
	    s->c->source : o->c.input)) == NULL)
		st = hl_error_nomem(err);
	return st;
}

/* The results document: targets (with the utility levels), the matches
 * and the network, in memory. */
static hl_status
build_xml(run_state *s, hl_error *err)
{
	hl_threshold th = { hl_cascade_threshold_kind(s->cas), HUGE_VAL };
	hl_xml_out *x = hl_xml_out_begin(s->c->source);
	FILE *fp;
	long n;
	hl_status st;

	if (x == NULL)
		return hl_error_nomem(err);
	if (th.kind != 0)
		hl_cascade_threshold_dtmin(s->c, s->cas, &th.dtmin, NULL);
	if (hl_targets_xml_begin(hl_xml_out_writer(x), s->cas, &th) < 0 ||
	    (s->lp != NULL && hl_utility_lp_xml(hl_xml_out_writer(x), s->c,
	    s->lp) < 0) || hl_targets_xml_end(hl_xml_out_writer(x)) < 0 ||
	    hl_matches_xml(hl_xml_out_writer(x), s->c, s->mr,
	    s->c->set.dtmin) < 0 ||
	    hl_network_xml(hl_xml_out_writer(x), s->net) < 0) {
		hl_xml_out_free(x);
		return hl_error_set(err, HL_EIO, NULL, 0, "cannot build the "
		    "network document");
	}
	fp = tmpfile();
	if (fp == NULL) {
		hl_xml_out_free(x);
		return hl_error_set(err, HL_EIO, NULL, 0, "no temporary file "
		    "for the network document");
	}
	st = hl_xml_out_finish(x, fp, err);
	hl_xml_out_free(x);
	n = ftell(fp);
	if (st == HL_OK && (n < 0 || (s->xml = malloc((size_t)n + 1)) ==
	    NULL))
		st = hl_error_nomem(err);
	if (st == HL_OK) {
		rewind(fp);
		if (fread(s->xml, 1, (size_t)n, fp) != (size_t)n)
			st = hl_error_set(err, HL_EIO, NULL, 0, "cannot read "
			    "back the network document");
		s->xml[n] = '\0';
		s->xml_len = (size_t)n;
	}
	fclose(fp);
	return st;
}

/* The check of `heatloom check` on the document as written. */
static hl_status
self_check(run_state *s, hl_error *err)
{
	hl_network *back = NULL;
	hl_netcheck *r = NULL;
	hl_status st;

	st = hl_network_xml_read_mem(s->c->source != NULL ? s->c->source :
	    "design", s->xml, s->xml_len, &back, err);
	if (st == HL_OK)
		st = hl_netcheck_run(back, &r, err);
	if (st == HL_OK && r->n > 0)
		st = hl_error_set(err, HL_ENOSOLUTION, NULL, 0, "the designed "
		    "network fails its own check (%s: %s); nothing was "
		    "written: please report this case", r->f[0].what,
		    r->f[0].text);
	else if (st == HL_EINPUT) {
		char why[HL_ERROR_TEXT];

		snprintf(why, sizeof why, "%s", err->text);
		st = hl_error_set(err, HL_ENOSOLUTION, NULL, 0, "the designed "
		    "network cannot be read back (%s); nothing was written: "
		    "please report this case", why);
	}
	hl_netcheck_free(r);
	hl_network_free(back);
	return st;
}

static hl_status
write_svg(const options *o, const run_state *s, hl_error *err)
{
	double pin[64];
	hl_grid_opts go = { NULL, NULL, hl_caution, 0, pin, NULL };
	char title[300];
	hl_output out;
	hl_status st;

	go.npinch = hl_network_pinches(s->cas, s->lp, pin, 64);
	go.cas = s->cas;
	snprintf(title, sizeof title, "Heat exchanger network: %s",
	    s->c->source != NULL ? s->c->source : o->c.input);
	go.title = title;
	st = hl_output_open(&out, o->svg, err);
	if (st != HL_OK)
		return st;
	st = hl_grid_svg_write(s->net, &go, out.fp, err);
	if (st == HL_OK)
		st = hl_output_commit(&out, err);
	hl_output_abort(&out);
	return st;
}

static hl_status
write_main(const options *o, const run_state *s, hl_error *err)
{
	hl_output out;
	hl_status st = hl_output_open(&out, o->c.output, err);

	if (st != HL_OK)
		return st;
	if (o->c.format == HL_FMT_XML) {
		if (fwrite(s->xml, 1, s->xml_len, out.fp) != s->xml_len)
			st = hl_error_set(err, HL_EIO, o->c.output, 0,
			    "write error");
	} else if (o->c.format == HL_FMT_CSV) {
		hl_network_csv(out.fp, s->net);
	} else {
		hl_network_text(out.fp, s->net, hl_caution);
	}
	if (st == HL_OK)
		st = hl_output_commit(&out, err);
	hl_output_abort(&out);
	return st;
}

/* What an engineer must not miss, on stderr. */
static void
warn(const run_state *s)
{
	const hl_network *net = s->net;

	if (net->penalty > 0.0) {
		double e = hl_network_emat_hint(&s->feed.in);

		fprintf(stderr, "heatloom: warning: the network uses %.1f kW "
		    "more hot and cold utility than the targets: no placement "
		    "of the matches keeps every approach (see the notes)\n",
		    net->penalty);
		if (!isnan(e))
			fprintf(stderr, "heatloom: with --emat %g the matches "
			    "place at the targets\n", e);
	}
	if (net->nunit > net->nmatch)
		fprintf(stderr, "heatloom: warning: %zu units for %zu matches "
		    "(see the notes)\n", net->nunit, net->nmatch);
	if (!s->mr->optimal)
		fprintf(stderr, "heatloom: warning: the match MILP stopped at "
		    "its time limit: %zu units found, at least %zu needed "
		    "(give --time-limit)\n", s->mr->units, s->mr->lower);
}

static hl_status
run_design(void *opts, hl_error *err)
{
	const options *o = opts;
	run_state s;
	hl_status st;

	memset(&s, 0, sizeof s);
	st = load(o, &s, err);
	if (st == HL_OK)
		st = solve(o, &s, err);
	if (st == HL_OK)
		st = build_xml(&s, err);
	if (st == HL_OK)
		st = self_check(&s, err);
	if (st == HL_OK && o->svg != NULL)
		st = write_svg(o, &s, err);
	if (st == HL_OK)
		st = write_main(o, &s, err);
	if (st == HL_OK && !o->c.quiet)
		warn(&s);
	state_free(&s);
	return st;
}

const hl_command hl_cmd_design = {
	"design", "CASE [options]",
	"a sized heat exchanger network that meets the targets, checked",
	"Design a heat exchanger network that meets the energy targets: the least-\n"
	"cost utility levels, the fewest units (match MILP), the placement of every\n"
	"match on its streams in temperature order, stream splits where series\n"
	"would break the minimum approach, the cheapest order and split shares, and\n"
	"each exchanger sized (U from the film coefficients, LMTD, F, shells, area,\n"
	"cost). The network is checked as `heatloom check` would before it is\n"
	"written. CASE is an XML case file or a stream table (CSV).\n",
	NULL, option_rows, sizeof(options),
	"give one CASE file", "give one CASE file, not several",
	init, check, run_design
};
