/* retrofit.c - `heatloom retrofit`: concrete modifications to today's
 * plant, each simulated, priced, checked and ranked by saving within the
 * payback or budget. */
#include <math.h>
#include <stddef.h>
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

typedef struct {
	hl_common c;
	const char *network;
	const char *svg;
	double payback, budget, changes, time_limit, seed;
} options;

static const hl_option option_rows[] = {
	HL_ROW_TEXT("network", "FILE", options, network,
	    "the existing network (CSV), instead of the case's own"),
	HL_ROW_UTILITIES,
	HL_ROW_NUMBER("payback", "YEARS", options, payback, 0.01, 100.0,
	    "longest simple payback (default 3 unless --budget)"),
	HL_ROW_NUMBER("budget", "MONEY", options, budget, 1.0, 1e12,
	    "largest investment (default: none)"),
	HL_ROW_NUMBER("max-changes", "N", options, changes, 1.0, 12.0,
	    "modifications per proposal, 1 to 12 (default 4)"),
	HL_ROW_FORMAT("text (default), xml, or csv"),
	HL_ROW_UNITS(HL_UNITS_HELP),
	HL_ROW_OUTPUT("FILE", "write to FILE instead of standard output"),
	HL_ROW_TEXT("svg", "FILE", options, svg,
	    "grid diagram of the best proposal, changes ringed"),
	HL_ROW_NUMBER("time-limit", "S", options, time_limit, 0.1, 86400.0,
	    "stop the search after S seconds (default 60)"),
	HL_ROW_NUMBER("seed", "N", options, seed, 0.0, 4294967295.0,
	    "breaks ties between equal candidates (default 1)"),
	HL_ROW_QUIET("no warnings on standard error"),
	HL_ROW_HELP,
	HL_ROW_END
};

static void
init(void *opts)
{
	options *o = opts;

	o->payback = o->budget = o->changes = o->time_limit = o->seed = NAN;
}

static int
check(void *opts)
{
	const options *o = opts;

	if (!isnan(o->changes) && o->changes != floor(o->changes))
		return hl_cmd_usage("retrofit", "--max-changes wants a whole "
		    "number, not %g", o->changes);
	if (!isnan(o->seed) && o->seed != floor(o->seed))
		return hl_cmd_usage("retrofit", "--seed wants a whole number, "
		    "not %g", o->seed);
	if (o->svg != NULL && o->c.output != NULL &&
	    strcmp(o->svg, o->c.output) == 0)
		return hl_cmd_usage("retrofit", "--svg and -o name the same "
		    "file '%s'", o->svg);
	return 0;
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
			hl_cmd_print_warnings(s->a ? s->a->net : NULL);
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
	hl_grid_opts go = { .footnote = hl_caution };
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

static hl_status
run_retrofit(void *opts, hl_error *err)
{
	const options *o = opts;
	run_state s;
	hl_rfit_opts ro;
	hl_rfit_out w;
	hl_status st;

	memset(&s, 0, sizeof s);
	memset(&w, 0, sizeof w);
	st = load(o, &s, err);
	if (st == HL_OK) {
		set_opts(o, s.c, &ro, &w);
		st = compute(&ro, &s, err);
	}
	w.screen = s.promise;
	/* Everything is computed and checked before any file is written. */
	if (st == HL_OK && o->svg != NULL)
		st = write_svg(o, &s, err);
	if (st == HL_OK)
		st = write_main(o, &s, &w, err);
	state_free(&s);
	return st;
}

const hl_command hl_cmd_retrofit = {
	"retrofit", "CASE [options]",
	"modifications to today's plant, simulated, priced and ranked by "
	"payback",
	"Retrofit proposals for an existing heat-recovery network: sets of\n"
	"concrete modifications (more area on a unit as a shell in series or in\n"
	"parallel, a unit re-piped to another place or pair, units resequenced on\n"
	"a stream, a new unit, a unit taken out, a split added or dropped), each\n"
	"simulated with the rating model (ε-NTU at the units' areas and shells;\n"
	"heaters and coolers make up the rest), priced (bought shells by the\n"
	"cost law of each unit's type, each re-pipe and new unit a fixed cost)\n"
	"and ranked by\n"
	"the saving on utilities within the payback or budget. Each proposal's network passes `heatloom check`.\n"
	"\n"
	"Today's network comes from the case file's <network> or from --network\n"
	"(the same rows as `heatloom audit`).\n",
	"Fixed costs of a re-pipe and of a new unit come from the case's <cost\n"
	"repipe new-unit>; without them illustrative defaults (20 000 and 30 000)\n"
	"are used and the output says so. The proposals are screening estimates\n"
	"for a first discussion, not a retrofit design.\n",
	option_rows, sizeof(options),
	"give one CASE file", "give one CASE file, not several",
	init, check, run_retrofit
};
