/* check.c - `heatloom check`: verify a network file on its own.
 *
 * The file (what `design --format xml` writes, or a hand-edited copy) is
 * read back and every balance, approach and size recomputed from the
 * streams, utilities and settings it carries (netcheck.h). Each problem is
 * one line on stderr naming the file, the line and the exchanger (or
 * stream); the run exits 0 when there is none and 2 when there is any.
 */
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "cmd.h"
#include "display.h"
#include "netcheck.h"
#include "network_read.h"
#include "output.h"

static const hl_option option_rows[] = {
	HL_ROW_QUIET("no summary on standard output"),
	HL_ROW_UNITS(HL_UNITS_HELP
	    "\n(the summary; the problems stay in SI units)"),
	HL_ROW_HELP,
	HL_ROW_END
};

static void
report(const char *file, const hl_netcheck *r)
{
	size_t i;

	for (i = 0; i < r->n; i++) {
		const hl_netcheck_finding *f = &r->f[i];

		if (f->line > 0)
			fprintf(stderr, "heatloom: %s:%ld: %s: %s\n", file,
			    f->line, f->what, f->text);
		else
			fprintf(stderr, "heatloom: %s: %s: %s\n", file,
			    f->what, f->text);
	}
}

/* A heat rate in the display unit: "12.3 kW" or "42 000 Btu/h". */
static void
put_q(const char *before, double kw)
{
	printf("%s%.*f %s", before, HL_DIG_Q(1), hl_show_q(kw), HL_SYM_Q);
}

/* Sound is not the same as at target: say how far the utilities are above
 * the targets, and what the network itself declares as the reason. */
static void
above_targets(const hl_network *net, const hl_netcheck *r)
{
	double qh = 0.0, qc = 0.0, over;
	size_t i;

	for (i = 0; i < net->nparty; i++)
		if (net->party[i].utility && net->party[i].kind == HL_HOT)
			qh += net->party[i].load;
		else if (net->party[i].utility)
			qc += net->party[i].load;
	over = qh - r->qh_min;
	put_q("Utilities: ", qh);
	put_q(" hot, ", qc);
	printf(" cold");
	if (over < -1e-6 * fmax(1.0, r->qh_min)) {
		put_q(", ", -over);
		printf(" hot and cold below the targets (approaches under "
		    "ΔTmin, down to EMAT)\n");
		return;
	}
	if (over <= 1e-6 * fmax(1.0, r->qh_min)) {
		printf(", at the targets\n");
		return;
	}
	put_q(", ", over);
	put_q(" hot and ", qc - r->qc_min);
	printf(" cold above the targets");
	if (r->qh_min > 0.0)
		printf(" (%.1f %% hot)", 100.0 * over / r->qh_min);
	if (net->range_rise > 0.0)
		put_q(hl_network_has_credit(net) ? "; utility choice (credits, "
		    "ranges) " : "; utility ranges ", net->range_rise);
	if (net->restriction > 0.0)
		put_q("; match rules ", net->restriction);
	if (net->penalty > 0.0)
		put_q("; placement or least-cost choice ", net->penalty);
	printf("\n");
}

/* HL_EINPUT with err clear when the network has problems: they are on
 * stderr already. */
static hl_status
run_check(void *opts, hl_error *err)
{
	const hl_common *o = opts;
	hl_network *net = NULL;
	hl_netcheck *r = NULL;
	size_t i, nstream = 0;
	hl_status st;

	st = hl_network_xml_read(o->input, &net, err);
	if (st == HL_OK)
		st = hl_netcheck_run(net, &r, err);
	if (st != HL_OK) {
		hl_network_free(net);
		return st;
	}
	for (i = 0; i < net->nparty; i++)
		nstream += !net->party[i].utility;
	report(o->input, r);
	if (!o->quiet) {
		printf("%s: %zu exchangers, %zu streams, %zu utilities: "
		    "%s%zu problem%s (targets from the streams: %.*f %s "
		    "hot, %.*f %s cold)\n", o->input, net->nunit, nstream,
		    net->nparty - nstream, r->n == 0 ? "sound, " : "",
		    r->n, r->n == 1 ? "" : "s", HL_DIG_Q(1),
		    hl_show_q(r->qh_min), HL_SYM_Q, HL_DIG_Q(1),
		    hl_show_q(r->qc_min), HL_SYM_Q);
		above_targets(net, r);
	}
	st = r->n == 0 ? HL_OK : HL_EINPUT;
	hl_netcheck_free(r);
	hl_network_free(net);
	return st;
}

const hl_command hl_cmd_check = {
	"check", "NETWORK.xml [--quiet]",
	"verify a network file: balances, EMAT, utilities, sizing",
	"Verify a heat exchanger network on its own, whoever made it: the heat\n"
	"balance of every exchanger and stream, the order and splits along each\n"
	"stream, the minimum approach (EMAT) at both ends of every exchanger and\n"
	"inside it where a stream's cp changes, the utilities used against the\n"
	"targets recomputed from the streams in the file, and the sizing (U, LMTD,\n"
	"F, shells, area, cost). NETWORK.xml is what `heatloom design --format xml`\n"
	"writes (doc/results.md, \"Network\").\n"
	"\n"
	"Each problem is reported on standard error as FILE:LINE: EXCHANGER: what is\n"
	"wrong. Exit status 0: the network is sound; 2: it is not (or the file\n"
	"cannot be read as a network).\n",
	NULL, option_rows, sizeof(hl_common),
	"give one network file (XML)", "give one network file, not several",
	NULL, NULL, run_check
};
