/* design.c - `heatloom design`: from a case to a sized, checked network.
 *
 * Stages: the problem table (targets, pinches), the utility LP when the
 * case has utilities (their loads), then either the least-cost search
 * (network_opt.h, the default when the utilities carry prices: it starts
 * from the fewest-units network or --from) or the fewest-units network
 * alone (match MILP and placement, study.h), then the independent check of
 * the network as written (the XML is read back and verified by
 * netcheck.h): a network that fails it is never written.
 */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>
#include <unistd.h>

#include "cascade.h"
#include "cmd.h"
#include "grid_svg.h"
#include "match_milp.h"
#include "matches_out.h"
#include "netcheck.h"
#include "network.h"
#include "network_match.h"
#include "network_opt.h"
#include "network_read.h"
#include "network_write.h"
#include "opt_out.h"
#include "output.h"
#include "result_xml.h"
#include "study.h"
#include "tables.h"
#include "targets_out.h"
#include "utility_lp.h"
#include "utility_out.h"

#define MAX_NOSPLIT 64

typedef struct {
	hl_common c;
	double emat;        /* NaN unless --emat */
	double time_limit;  /* NaN unless --time-limit */
	const char *svg;
	int units;          /* --method units */
	double seed, threads, effort, branches, min_duty, min_area, shells;
	int no_splits;
	size_t nnosplit;
	const char *nosplit[MAX_NOSPLIT];
	const char *from;
	const char *keep;
} options;
HL_COMMON_FIRST(options);

static int
parse_method(void *opts, const char *arg)
{
	options *o = opts;

	if (strcmp(arg, "units") != 0 && strcmp(arg, "cost") != 0)
		return hl_cmd_usage("design", "--method wants cost or units, "
		    "not '%s'", arg);
	o->units = strcmp(arg, "units") == 0;
	return 0;
}

static int
add_nosplit(void *opts, const char *arg)
{
	options *o = opts;

	if (o->nnosplit == MAX_NOSPLIT)
		return hl_cmd_usage("design", "at most %d --no-split options",
		    MAX_NOSPLIT);
	o->nosplit[o->nnosplit++] = arg;
	return 0;
}

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
	    "seconds for the whole search (default 60); the search\n"
	    "is sized by evaluations and normally ends before; the\n"
	    "output says when this cap cut it short. With --method\n"
	    "units: seconds per subnetwork for the match MILP\n"
	    "(default: the case's, or 10)"),
	{ "method", 0, "M", "cost (default): least total annual cost; units: the\n"
	  "fewest-units network alone (match MILP and placement)",
	  HL_ARG_CALL, 0, 0, 0, parse_method },
	HL_ROW_NUMBER("seed", "N", options, seed, 0.0, 4294967295.0,
	    "seed of the search (default 1); the same case, seed\n"
	    "and options give the same network"),
	HL_ROW_NUMBER("threads", "N", options, threads, 1.0, 16.0,
	    "threads (default 2); the result does not depend on it"),
	HL_ROW_NUMBER("effort", "X", options, effort, 0.01, 1000.0,
	    "multiply the search's evaluations by X (default 1)"),
	HL_ROW_FLAG("no-splits", options, no_splits, 1, "no stream splits"),
	{ "no-split", 0, "NAME", "no split of stream NAME (repeat for several)",
	  HL_ARG_CALL, 0, 0, 0, add_nosplit },
	HL_ROW_NUMBER("max-branches", "N", options, branches, 2.0, 1000.0,
	    "at most N branches per split"),
	HL_ROW_NUMBER("min-duty", "KW", options, min_duty, 0.0, 1e9,
	    "no unit (utility units too) below KW kW, or below\n"
	    "its stream's whole duty if less (default: 1 % of the\n"
	    "largest stream duty where that costs at most 3 %,\n"
	    "else a tenth of it; 0 for none)"),
	HL_ROW_NUMBER("min-area", "M2", options, min_area, 0.0, 1e7,
	    "no unit below M2 m² (a fired heater has no area)"),
	HL_ROW_NUMBER("max-shells", "N", options, shells, 1.0,
	    HL_EXCHANGER_MAX_SHELLS, "at most N shells in series per unit"),
	HL_ROW_TEXT("from", "FILE", options, from,
	    "start from this network: an XML network as design\n"
	    "writes it, or a network table (CSV: name, hot, cold,\n"
	    "duty; temperatures optional)"),
	HL_ROW_TEXT("keep", "NAMES", options, keep,
	    "units of --from (comma-separated names) that stay"),
	HL_ROW_QUIET("no warnings or progress on standard error"),
	HL_ROW_VERBOSE("the solvers' messages on standard error"),
	HL_ROW_HELP,
	HL_ROW_END
};

static void
init(void *opts)
{
	options *o = opts;

	o->emat = o->time_limit = o->min_duty = NAN;
	o->seed = 1;
	o->threads = 2;
	o->effort = 1;
}

static int
whole(const char *name, double v)
{
	if (v == floor(v))
		return 0;
	return hl_cmd_usage("design", "--%s wants a whole number, not %g",
	    name, v);
}

static int
check(void *opts)
{
	const options *o = opts;

	if (whole("seed", o->seed) || whole("threads", o->threads) ||
	    whole("max-branches", o->branches) ||
	    whole("max-shells", o->shells))
		return 1;
	if (o->keep != NULL && o->from == NULL)
		return hl_cmd_usage("design", "--keep names units of --from");
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
	hl_network *start;  /* the optimiser's start (owned), NULL: none */
	unsigned char *keep;     /* per unit of start */
	unsigned char *nosplit;  /* per case stream */
	hl_opt_options oo;
	hl_opt_result *opt; /* the least-cost search, NULL: not run */
	int no_prices;      /* --method cost on a case without prices */
	int milp_failed;    /* the fewest-units start could not be found */
	char *xml;          /* the results document, as it will be written */
	size_t xml_len;
} run_state;

static void
state_free(run_state *s)
{
	free(s->xml);
	if (s->opt != NULL)
		s->opt->net = NULL;
	if (s->net != s->start)
		hl_network_free(s->net);
	hl_network_free(s->start);
	free(s->keep);
	free(s->nosplit);
	hl_opt_result_free(s->opt);
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
	if (hl_cmd_set_emat("design", s->c, o->emat, err) != HL_OK)
		return HL_EUSAGE;
	if (!(s->c->set.dtmin > 0.0))
		return hl_error_set(err, HL_EINPUT, s->c->source, 0, "a "
		    "network needs ΔTmin above 0 K (a zero approach needs "
		    "infinite area): give --dtmin");
	return HL_OK;
}

/* The fewest-units network: match MILP and placement (study.h) at the
 * targets already in s. time: seconds per MILP subnetwork, NaN for the
 * case's. */
static hl_status
fewest_units(const options *o, run_state *s, double time, hl_error *err)
{
	hl_study_opts so = { o->c.verbose, hl_cmd_log_stderr, 1, time };
	hl_study y;
	hl_status st;

	memset(&y, 0, sizeof y);
	y.cas = s->cas;
	y.lp = s->lp;
	st = hl_study_matches(s->c, &so, &y, err);
	if (st == HL_OK)
		st = hl_study_network(s->c, &y, err);
	/* run_state owns what the stages gave from here (state_free). */
	s->mr = y.mr;
	s->feed = y.feed;
	s->net = y.net;
	return st;
}

/* Party of the case named name: stream index, or nstream + utility. */
static long
case_party(const hl_case *c, const char *name)
{
	long i = hl_case_find_stream(c, name);

	if (i >= 0)
		return i;
	i = hl_case_find_utility(c, name);
	return i < 0 ? -1 : (long)c->nstream + i;
}

static int
is_csv(const char *path)
{
	size_t n = strlen(path);

	return n > 4 && (strcmp(path + n - 4, ".csv") == 0 ||
	    strcmp(path + n - 4, ".CSV") == 0);
}

/* Unit i of the network table tab or the network file, as a unit to add:
 * its parties' names into *hn, *cn. */
static void
from_unit(const hl_case *tab, const hl_network *file, size_t i,
	  hl_network_unit *u, const char **hn, const char **cn, long *line)
{
	memset(u, 0, sizeof *u);
	if (tab != NULL) {
		const hl_unit *t = &tab->unit[i];

		*hn = t->hot;
		*cn = t->cold;
		*line = t->line;
		snprintf(u->id, sizeof u->id, "%s", t->name);
		u->duty = t->duty;
		u->hot_in = t->hot_in;
		u->hot_out = t->hot_out;
		u->cold_in = t->cold_in;
		u->cold_out = t->cold_out;
	} else {
		*u = file->unit[i];
		u->note = NULL;
		*hn = file->party[u->hot].name;
		*cn = file->party[u->cold].name;
		*line = u->line;
	}
}

/* 1 when the network file's parties and units are net's, in order. */
static int
same_parties(const hl_network *file, const hl_network *net)
{
	size_t i;

	if (file->nparty != net->nparty || file->nunit != net->nunit)
		return 0;
	for (i = 0; i < file->nunit; i++)
		if (net->unit[i].hot != file->unit[i].hot ||
		    net->unit[i].cold != file->unit[i].cold)
			return 0;
	for (i = 0; i < file->nparty; i++)
		if (strcmp(file->party[i].name, net->party[i].name) != 0)
			return 0;
	return 1;
}

/* The units of --from on the case's parties. A network file on exactly the
 * case's parties is taken as it is (sized: the result will not cost more);
 * otherwise its units only place the start. */
static hl_status
read_from(const options *o, run_state *s, hl_error *err)
{
	hl_case *tab = NULL;
	hl_network *file = NULL, *net = NULL;
	size_t n, i;
	hl_status st;

	if (is_csv(o->from)) {
		tab = hl_case_create();
		st = tab == NULL ? hl_error_nomem(err) :
		    hl_network_table_read(tab, o->from, err);
	} else {
		st = hl_network_xml_read(o->from, &file, err);
	}
	if (st == HL_OK)
		st = hl_network_of_case(s->c, NULL, &net, err);
	n = tab != NULL ? tab->nunit : file != NULL ? file->nunit : 0;
	for (i = 0; st == HL_OK && i < n; i++) {
		hl_network_unit u;
		const char *hn, *cn;
		long hp, cp, line;

		from_unit(tab, file, i, &u, &hn, &cn, &line);
		hp = case_party(s->c, hn);
		cp = case_party(s->c, cn);
		if (hp < 0 || cp < 0)
			st = hl_error_set(err, HL_EINPUT, o->from, line, "unit "
			    "'%s' joins '%s', which the case does not have",
			    u.id, hp < 0 ? hn : cn);
		else {
			u.hot = (size_t)hp;
			u.cold = (size_t)cp;
			st = hl_network_add_unit(net, &u, err);
		}
	}
	if (st == HL_OK && file != NULL && same_parties(file, net)) {
		hl_network_free(net);
		net = file;
		file = NULL;
	}
	hl_case_free(tab);
	hl_network_free(file);
	if (st != HL_OK) {
		hl_network_free(net);
		return st;
	}
	s->start = net;
	return HL_OK;
}

/* --keep: the named units of the start stay. */
static hl_status
mark_keep(const options *o, run_state *s, hl_error *err)
{
	char *list, *tok, *save = NULL;
	hl_status st = HL_OK;

	if (o->keep == NULL)
		return HL_OK;
	s->keep = calloc(s->start->nunit + 1, 1);
	list = strdup(o->keep);
	if (s->keep == NULL || list == NULL) {
		free(list);
		return hl_error_nomem(err);
	}
	for (tok = strtok_r(list, ",", &save); tok != NULL && st == HL_OK;
	    tok = strtok_r(NULL, ",", &save)) {
		size_t i;

		for (i = 0; i < s->start->nunit; i++)
			if (strcmp(s->start->unit[i].id, tok) == 0)
				break;
		if (i == s->start->nunit)
			st = hl_error_set(err, HL_EUSAGE, NULL, 0, "design: "
			    "--keep names '%s', which %s has no unit of",
			    tok, o->from);
		else
			s->keep[i] = 1;
	}
	free(list);
	return st;
}

static double
now(void)
{
	struct timespec ts;

	clock_gettime(CLOCK_MONOTONIC, &ts);
	return (double)ts.tv_sec + 1e-9 * (double)ts.tv_nsec;
}

static void
progress(void *ctx, double done, double best)
{
	const char *cur = ctx;

	fprintf(stderr, "\rdesign: least-cost search %3.0f %%, best %.0f "
	    "%s/year   ", 100.0 * done, best, cur);
	fflush(stderr);
}

/* The streams that must not split: the case's <no-split> and --no-split. */
static hl_status
no_split_streams(const options *o, run_state *s, hl_error *err)
{
	size_t i;

	if (o->nnosplit + s->c->nnosplit == 0)
		return HL_OK;
	s->nosplit = calloc(s->c->nstream + 1, 1);
	if (s->nosplit == NULL)
		return hl_error_nomem(err);
	s->oo.no_split = s->nosplit;
	for (i = 0; i < s->c->nnosplit; i++) {
		long k = hl_case_find_stream(s->c, s->c->nosplit[i]);

		if (k < 0)
			return hl_error_set(err, HL_EINPUT, s->c->source,
			    s->c->nosplit_line[i], "<no-split> names '%s', "
			    "which is no stream of the case",
			    s->c->nosplit[i]);
		s->nosplit[k] = 1;
	}
	for (i = 0; i < o->nnosplit; i++) {
		long k = hl_case_find_stream(s->c, o->nosplit[i]);

		if (k < 0)
			return hl_error_set(err, HL_EUSAGE, NULL, 0, "design: "
			    "--no-split names '%s', which is no stream of the "
			    "case", o->nosplit[i]);
		s->nosplit[k] = 1;
	}
	return HL_OK;
}

/* The case's <design> limits, each replaced by its option when given. */
static hl_status
opt_options(const options *o, run_state *s, hl_error *err)
{
	hl_opt_options *x = &s->oo;
	const hl_settings *set = &s->c->set;

	hl_opt_options_default(x);
	x->seed = (unsigned long)o->seed;
	x->threads = (int)o->threads;
	x->effort = o->effort;
	x->no_splits = o->no_splits || set->no_splits;
	x->max_branches = o->branches > 0 ? (int)o->branches :
	    set->max_branches;
	if (!isnan(o->min_duty))
		x->min_duty = o->min_duty;
	else if (set->given & HL_GIVEN_MIN_DUTY)
		x->min_duty = set->min_duty;
	else {
		x->min_duty = hl_opt_auto_min_duty(s->c);
		x->min_duty_auto = 1;
	}
	x->min_area = o->min_area > 0 ? o->min_area : set->min_area;
	x->max_shells = o->shells > 0 ? (int)o->shells : set->max_shells;
	if (!isnan(o->time_limit))
		x->time_limit = o->time_limit;
	if (!o->c.quiet && isatty(STDERR_FILENO)) {
		x->progress = progress;
		x->ctx = s->c->set.currency != NULL ? s->c->set.currency : "";
	}
	return no_split_streams(o, s, err);
}

/* The fewest-units start in its share of the time; a MILP without an
 * answer in it leaves the search to start without it. */
static hl_status
fewest_units_start(const options *o, run_state *s, hl_error *err)
{
	double share = fmin(s->c->set.time_limit, s->oo.time_limit / 6.0);
	hl_status st;
	size_t k;

	if (s->oo.progress != NULL)
		fprintf(stderr, "design: fewest-units start…\r");
	st = fewest_units(o, s, share, err);
	if (st == HL_ENOSOLUTION) {
		s->milp_failed = 1;
		hl_error_clear(err);
		hl_network_free(s->net);
		s->net = NULL;
		return HL_OK;
	}
	if (st != HL_OK)
		return st;
	s->start = s->net;
	s->net = NULL;
	/* The document must repeat byte for byte: the start's solver times
	 * are written as 0. */
	s->mr->seconds = 0.0;
	for (k = 0; k < s->mr->nsub; k++)
		s->mr->sub[k].seconds = 0.0;
	return HL_OK;
}

/* The least-cost network: a start (--from, or the fewest-units network
 * when the MILP finds one in its share of the time), then the search. */
static hl_status
least_cost(const options *o, run_state *s, hl_error *err)
{
	double t0 = now();
	hl_status st = opt_options(o, s, err);

	if (st == HL_OK && o->from != NULL)
		st = read_from(o, s, err);
	else if (st == HL_OK)
		st = fewest_units_start(o, s, err);
	if (st == HL_OK)
		st = mark_keep(o, s, err);
	if (st != HL_OK)
		return st;
	s->oo.start = s->start;
	s->oo.keep = s->keep;
	s->oo.time_limit = fmax(s->oo.time_limit - (now() - t0),
	    s->oo.time_limit / 3.0);
	st = hl_network_optimise(s->c, &s->oo, &s->opt, err);
	if (s->oo.progress != NULL)
		fprintf(stderr, "\r%60s\r", "");
	if (st != HL_OK)
		return st;
	s->net = s->opt->net;
	s->opt->net = NULL;
	if (s->opt->kept_start && s->start != NULL) {
		hl_network_free(s->net);
		s->net = s->start;
	}
	s->opt->net = s->net;
	return HL_OK;
}

/* The energy of a least-cost network above the targets split as the
 * fewest-units path splits it: the rise the utility ranges force (the
 * utility LP's, never more than the whole excess) first, the rest the
 * network's own choice (energy-penalty; negative below the targets, which
 * EMAT below ΔTmin allows). */
static void
split_rise(const run_state *s)
{
	hl_network *net = s->net;
	double rise;

	if (s->opt == NULL || s->lp == NULL || net == s->start)
		return;
	rise = fmin(s->lp->range_rise, net->penalty);
	if (!(rise > 0.0))
		return;
	net->range_rise = rise;
	net->penalty -= rise;
	if (fabs(net->penalty) < 1e-9 * fmax(1.0, net->qh_target))
		net->penalty = 0.0;
}

/* Refused: the limits without the least-cost search. */
static hl_status
limits_need_search(const options *o, const run_state *s, hl_error *err)
{
	if (!(s->no_prices || o->units) || !(o->no_splits ||
	    o->nnosplit > 0 || o->branches > 0 || o->min_duty > 0 ||
	    o->min_area > 0 || o->shells > 0 || o->from != NULL))
		return HL_OK;
	return hl_error_set(err, o->units ? HL_EUSAGE : HL_EINPUT,
	    o->units ? NULL : s->c->source, 0, "%s: the limits and --from "
	    "belong to the least-cost search, which needs utilities with "
	    "prices%s", o->units ? "design --method units" : "design",
	    o->units ? "; drop --method units" : " (give a utility table "
	    "with a price column)");
}

/* Targets and utility loads (study.h), then the least-cost search or the
 * fewest-units network. */
static hl_status
solve(const options *o, run_state *s, hl_error *err)
{
	hl_study_opts so = { o->c.verbose, hl_cmd_log_stderr, 1,
			     o->time_limit };
	hl_study y;
	hl_status st;

	memset(&y, 0, sizeof y);
	st = hl_study_targets(s->c, &so, &y, err);
	s->cas = y.cas;
	s->lp = y.lp;
	s->no_prices = !o->units && !hl_network_optimise_fits(s->c);
	if (st == HL_OK)
		st = limits_need_search(o, s, err);
	if (st == HL_OK && (o->units || s->no_prices))
		st = fewest_units(o, s, o->time_limit, err);
	else if (st == HL_OK)
		st = least_cost(o, s, err);
	if (st == HL_OK)
		split_rise(s);
	if (st == HL_OK && s->net->source == NULL && (s->net->source =
	    strdup(s->c->source != NULL ? s->c->source : o->c.input)) == NULL)
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
	    (s->mr != NULL && hl_matches_xml(hl_xml_out_writer(x), s->c,
	    s->mr, s->c->set.dtmin) < 0) ||
	    hl_network_xml(hl_xml_out_writer(x), s->net) < 0 ||
	    (s->opt != NULL && hl_opt_xml(hl_xml_out_writer(x), s->opt,
	    &s->oo) < 0)) {
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
		if (s->opt != NULL)
			hl_opt_text(out.fp, s->opt, &s->oo);
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

	if (s->no_prices)
		fprintf(stderr, "heatloom: the case's utilities carry no "
		    "prices: the least-cost search needs them; this is the "
		    "fewest-units network\n");
	if (s->milp_failed)
		fprintf(stderr, "heatloom: warning: no fewest-units network "
		    "within its time: the least-cost search started without "
		    "it\n");
	if (s->opt != NULL && s->opt->capped)
		fprintf(stderr, "heatloom: warning: the time limit cut the "
		    "search short: give a larger --time-limit for a result "
		    "that repeats\n");
	if (s->opt != NULL)
		return;
	if (net->penalty > 0.0) {
		double e = hl_network_emat_hint(&s->feed.in);

		/* A sliver (the heat of idle matches) shows its digits. */
		fprintf(stderr, "heatloom: warning: the network uses %.*f kW "
		    "more hot and cold utility than the targets: no placement "
		    "of the matches keeps every approach (see the notes)\n",
		    net->penalty < 0.05 ? 3 : 1, net->penalty);
		if (!isnan(e))
			fprintf(stderr, "heatloom: with --emat %g the matches "
			    "place at the targets\n", e);
	}
	if (net->nunit > net->nmatch)
		fprintf(stderr, "heatloom: warning: %zu units for %zu matches "
		    "(see the notes)\n", net->nunit, net->nmatch);
	if (s->mr != NULL && !s->mr->optimal)
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
	"Design a heat exchanger network of least total annual cost: capital by the\n"
	"case's cost laws (per shell and per exchanger type, annualised) plus energy\n"
	"at the case's prices, over which streams meet, where, the splits, the loads\n"
	"and the energy level. Every unit keeps EMAT; ΔTmin is the reference for the\n"
	"targets. The search starts from the fewest-units network (targets, match\n"
	"MILP, placement) and from other starts, and never returns a network dearer\n"
	"than its start. A case whose utilities carry no prices, or --method units,\n"
	"gets the fewest-units network: the least-cost utility levels, the fewest\n"
	"units, the placement of every match on its streams in temperature order,\n"
	"splits where series would break the minimum approach. Each exchanger is\n"
	"sized (U from the film coefficients, LMTD, F, shells, area, cost). The\n"
	"network is checked as `heatloom check` would before it is written. CASE is\n"
	"an XML case file or a stream table (CSV).\n",
	NULL, option_rows, sizeof(options),
	"give one CASE file", "give one CASE file, not several",
	init, check, run_design
};
