/* retrofit.c - `heatloom retrofit`: concrete modifications to today's
 * plant, each simulated, priced, checked and ranked by saving within the
 * payback or budget. */
#include <getopt.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "audit.h"
#include "cmd.h"
#include "grid_svg.h"
#include "netcheck.h"
#include "output.h"
#include "result_xml.h"
#include "retrofit.h"
#include "retrofit_out.h"
#include "rfit.h"
#include "tables.h"

/* Points of the constant-α curve the proposals are compared with. */
#define SCREEN_POINTS 41

static void
help(FILE *fp)
{
	fprintf(fp,
"Usage: heatloom retrofit CASE [options]\n"
"\n"
"Retrofit proposals for an existing heat-recovery network: sets of\n"
"concrete modifications (more area on a unit as a shell in series or in\n"
"parallel, a unit re-piped to another place or pair, units resequenced on\n"
"a stream, a new unit, a unit taken out), each simulated with the rating\n"
"model (ε-NTU at the units' areas and shells; heaters and coolers make up\n"
"the rest), priced (bought shells by the case's cost law, each re-pipe and\n"
"new unit a fixed cost) and ranked by the saving on utilities within the\n"
"payback or budget. Each proposal's network passes `heatloom check`.\n"
"\n"
"Today's network comes from the case file's <network> or from --network\n"
"(the same rows as `heatloom audit`).\n"
"\n"
"Options:\n"
"  --network FILE     the existing network (CSV), instead of the case's own\n"
"  --utilities FILE   utility table (CSV) to add to the case\n"
"  --payback YEARS    longest simple payback (default 3 unless --budget)\n"
"  --budget MONEY     largest investment (default: none)\n"
"  --max-changes N    modifications per proposal, 1 to 12 (default 4)\n"
"  --format FMT       text (default), xml, or csv\n"
"  -o, --output FILE  write to FILE instead of standard output\n"
"  --svg FILE         grid diagram of the best proposal, changes marked\n"
"  --time-limit S     stop the search after S seconds (default 60)\n"
"  --seed N           breaks ties between equal proposals (default 1)\n"
"  --quiet            no warnings on standard error\n"
"  -h, --help         show this help\n"
"\n"
"Fixed costs of a re-pipe and of a new unit come from the case's <cost\n"
"repipe new-unit>; without them illustrative defaults (20 000 and 30 000)\n"
"are used and the output says so.\n"
"\n"
"%s\n", hl_caution);
}

enum { OPT_NETWORK = 256, OPT_SVG, OPT_PAYBACK, OPT_BUDGET, OPT_CHANGES,
       OPT_TIME, OPT_SEED };

typedef struct {
	hl_common c;
	const char *network;
	const char *svg;
	double payback, budget, changes, time_limit, seed;
} options;

static int
own_opt(int ch, options *o)
{
	static const struct {
		int ch;
		const char *name;
		double lo, hi;
		size_t off;
	} num[] = {
		{ OPT_PAYBACK, "--payback", 0.01, 100.0,
		  offsetof(options, payback) },
		{ OPT_BUDGET, "--budget", 1.0, 1e12, offsetof(options, budget) },
		{ OPT_CHANGES, "--max-changes", 1.0, 12.0,
		  offsetof(options, changes) },
		{ OPT_TIME, "--time-limit", 0.1, 86400.0,
		  offsetof(options, time_limit) },
		{ OPT_SEED, "--seed", 0.0, 4294967295.0,
		  offsetof(options, seed) },
	};
	size_t i;

	if (ch == OPT_NETWORK) {
		o->network = optarg;
		return 0;
	}
	if (ch == OPT_SVG) {
		o->svg = optarg;
		return 0;
	}
	for (i = 0; i < sizeof num / sizeof num[0]; i++) {
		double *v = (double *)((char *)o + num[i].off);

		if (num[i].ch != ch)
			continue;
		if (hl_cmd_parse_double("retrofit", num[i].name, optarg,
		    num[i].lo, num[i].hi, v) != 0)
			return 1;
		if ((ch == OPT_CHANGES || ch == OPT_SEED) && *v != floor(*v))
			return hl_cmd_usage("retrofit", "%s wants a whole "
			    "number, not '%s'", num[i].name, optarg);
		return 0;
	}
	return 1;
}

static int
parse(int argc, char **argv, options *o)
{
	static const struct option opts[] = {
		{ "network", required_argument, NULL, OPT_NETWORK },
		{ "utilities", required_argument, NULL, HL_OPT_UTIL },
		{ "payback", required_argument, NULL, OPT_PAYBACK },
		{ "budget", required_argument, NULL, OPT_BUDGET },
		{ "max-changes", required_argument, NULL, OPT_CHANGES },
		{ "format", required_argument, NULL, HL_OPT_FORMAT },
		{ "svg", required_argument, NULL, OPT_SVG },
		{ "time-limit", required_argument, NULL, OPT_TIME },
		{ "seed", required_argument, NULL, OPT_SEED },
		{ "quiet", no_argument, NULL, HL_OPT_QUIET },
		{ "output", required_argument, NULL, 'o' },
		{ "help", no_argument, NULL, 'h' },
		{ NULL, 0, NULL, 0 }
	};
	const unsigned formats = HL_FMT_BIT(HL_FMT_TEXT) |
				 HL_FMT_BIT(HL_FMT_XML) | HL_FMT_BIT(HL_FMT_CSV);
	int ch, rc;

	memset(o, 0, sizeof *o);
	hl_common_init(&o->c);
	o->payback = o->budget = o->changes = o->time_limit = o->seed = NAN;
	optind = 1;
	opterr = 0;
	while ((ch = getopt_long(argc, argv, ":o:h", opts, NULL)) != -1) {
		if (hl_cmd_common_opt("retrofit", ch, argv, formats, help,
				      &o->c, &rc)) {
			if (rc != 0)
				return rc;
		} else if (own_opt(ch, o) != 0) {
			return 1;
		}
	}
	rc = hl_cmd_one_input("retrofit", argc, argv, &o->c);
	if (rc == 0 && o->svg != NULL && o->c.output != NULL &&
	    strcmp(o->svg, o->c.output) == 0)
		return hl_cmd_usage("retrofit", "--svg and -o name the same "
		    "file '%s'", o->svg);
	return rc;
}

static void
set_opts(const options *o, const hl_case *c, hl_rfit_opts *r,
	 hl_rfit_out *w)
{
	hl_rfit_opts_default(r);
	if (!isnan(o->budget)) {
		r->budget = o->budget;
		r->payback = NAN;
	}
	if (!isnan(o->payback))
		r->payback = o->payback;
	if (!isnan(o->changes))
		r->max_changes = (int)o->changes;
	if (!isnan(o->time_limit))
		r->time_limit = o->time_limit;
	if (!isnan(o->seed))
		r->seed = (unsigned long)o->seed;
	w->repipe_given = !isnan(c->set.repipe_cost);
	w->unit_given = !isnan(c->set.unit_cost);
	if (w->repipe_given)
		r->repipe_cost = c->set.repipe_cost;
	if (w->unit_given)
		r->unit_cost = c->set.unit_cost;
	w->o = r;
	w->network = o->network;
}

static void
print_warnings(const hl_existing *net)
{
	size_t i;

	for (i = 0; net != NULL && i < net->nwarn; i++) {
		const hl_error *e = &net->warn[i];

		fprintf(stderr, "heatloom: ");
		if (e->file[0] != '\0' && e->line > 0)
			fprintf(stderr, "%s:%ld: ", e->file, e->line);
		fprintf(stderr, "warning: %s\n", e->text);
	}
}

/* Every proposal's network passes the check, or nothing is written. */
static hl_status
check_all(const hl_rfit *r, hl_error *err)
{
	size_t i;

	for (i = 0; i < r->nproposal; i++) {
		hl_netcheck *k = NULL;
		hl_status st = hl_netcheck_run(r->p[i].net, &k, err);

		if (st != HL_OK)
			return st;
		if (k->n > 0) {
			st = hl_error_set(err, HL_ENOSOLUTION, NULL, 0,
			    "proposal %zu fails its check (%s: %s); nothing "
			    "was written: please report this case", i + 1,
			    k->f[0].what, k->f[0].text);
			hl_netcheck_free(k);
			return st;
		}
		hl_netcheck_free(k);
	}
	return HL_OK;
}

typedef struct {
	hl_case *c;
	hl_audit *a;
	hl_retrofit *screen;
	hl_network *today;
	hl_rfit *r;
	double *promise;
} run_state;

static void
state_free(run_state *s)
{
	free(s->promise);
	hl_rfit_free(s->r);
	hl_network_free(s->today);
	hl_retrofit_free(s->screen);
	hl_audit_free(s->a);
	hl_case_free(s->c);
}

static hl_status
load(const options *o, run_state *s, hl_error *err)
{
	hl_status st;

	hl_output_protect(o->network);
	st = hl_cmd_load_case(&o->c, &s->c, err);
	if (st == HL_OK)
		st = hl_output_check(o->svg, err);
	if (st == HL_OK && o->network != NULL) {
		hl_case_clear_units(s->c);
		st = hl_network_table_read(s->c, o->network, err);
	}
	if (st == HL_OK) {
		st = hl_audit_run(s->c, &s->a, err);
		if (!o->c.quiet)
			print_warnings(s->a ? s->a->net : NULL);
	}
	return st;
}

/* The search, its check, and the constant-α promise at each proposal's
 * investment. */
static hl_status
compute(const hl_rfit_opts *ro, run_state *s, hl_error *err)
{
	hl_status st = hl_rfit_today(s->c, s->a->net, &s->today, err);
	size_t i;

	if (st == HL_OK)
		st = hl_rfit_run(s->c, s->today, ro, &s->r, err);
	if (st == HL_OK)
		st = check_all(s->r, err);
	if (st == HL_OK)
		st = hl_retrofit_screen(s->c, s->a, SCREEN_POINTS, &s->screen,
		    err);
	if (st != HL_OK)
		return st;
	s->promise = malloc((s->r->nproposal + 1) * sizeof *s->promise);
	if (s->promise == NULL)
		return hl_error_nomem(err);
	for (i = 0; i < s->r->nproposal; i++)
		s->promise[i] = hl_retrofit_saving_at(s->screen,
		    s->r->p[i].investment);
	return HL_OK;
}

static hl_status
write_main(const options *o, const run_state *s, const hl_rfit_out *w,
	   hl_error *err)
{
	hl_output out;
	hl_status st = hl_output_open(&out, o->c.output, err);
	hl_xml_out *x;

	if (st != HL_OK)
		return st;
	if (o->c.format == HL_FMT_CSV) {
		hl_rfit_csv(out.fp, s->r, w);
	} else if (o->c.format == HL_FMT_TEXT) {
		hl_rfit_text(out.fp, s->c, s->r, w, hl_caution);
	} else {
		x = hl_xml_out_begin(s->c->source);
		if (x == NULL)
			st = hl_error_nomem(err);
		else if (hl_rfit_xml(hl_xml_out_writer(x), s->r, w) < 0)
			st = hl_error_set(err, HL_EIO, NULL, 0,
			    "cannot build XML");
		else
			st = hl_xml_out_finish(x, out.fp, err);
		hl_xml_out_free(x);
	}
	if (st == HL_OK)
		st = hl_output_commit(&out, err);
	hl_output_abort(&out);
	return st;
}

/* The grid of the best proposal (today's when there is none), changed
 * units marked. */
static hl_status
write_svg(const options *o, const run_state *s, hl_error *err)
{
	const hl_network *net = s->r->nproposal > 0 ? s->r->p[0].net :
	    s->r->today;
	hl_grid_opts go = { NULL, NULL, hl_caution, 0, NULL };
	char title[300], sub[300];
	hl_output out;
	hl_status st;

	snprintf(title, sizeof title, "Retrofit: %s", s->c->source != NULL ?
	    s->c->source : o->c.input);
	if (s->r->nproposal > 0)
		snprintf(sub, sizeof sub, "Proposal 1: saves %.0f a year for "
		    "%.0f (payback %.2f years)", s->r->p[0].saving,
		    s->r->p[0].investment, s->r->p[0].payback);
	else
		snprintf(sub, sizeof sub, "Today's plant: no modification "
		    "pays back within the limits");
	go.title = title;
	go.subtitle = sub;
	st = hl_output_open(&out, o->svg, err);
	if (st != HL_OK)
		return st;
	st = hl_grid_svg_write(net, &go, out.fp, err);
	if (st == HL_OK)
		st = hl_output_commit(&out, err);
	hl_output_abort(&out);
	return st;
}

static int
run(int argc, char **argv)
{
	options o;
	run_state s;
	hl_rfit_opts ro;
	hl_rfit_out w;
	hl_error err;
	hl_status st;
	int rc = parse(argc, argv, &o);

	if (rc != 0)
		return rc < 0 ? 0 : rc;
	hl_error_clear(&err);
	memset(&s, 0, sizeof s);
	memset(&w, 0, sizeof w);
	st = load(&o, &s, &err);
	if (st == HL_OK) {
		set_opts(&o, s.c, &ro, &w);
		st = compute(&ro, &s, &err);
	}
	w.screen = s.promise;
	/* Everything is computed and checked before any file is written. */
	if (st == HL_OK && o.svg != NULL)
		st = write_svg(&o, &s, &err);
	if (st == HL_OK)
		st = write_main(&o, &s, &w, &err);
	state_free(&s);
	return st == HL_OK ? 0 : hl_cmd_fail(&err);
}

const hl_command hl_cmd_retrofit = {
	"retrofit", "CASE [--network FILE] [--payback YEARS] [--budget MONEY] "
	"[--max-changes N] [--format text|xml|csv] [-o FILE] [--svg FILE] "
	"[--time-limit S] [--seed N] [--quiet]",
	"modifications to today's plant, simulated, priced and ranked by "
	"payback",
	run, help
};
