/* check.c - `heatloom check`: verify a network file on its own.
 *
 * The file (what `design --format xml` writes, or a hand-edited copy) is
 * read back and every balance, approach and size recomputed from the
 * streams, utilities and settings it carries (netcheck.h). Each problem is
 * one line on stderr naming the file, the line and the exchanger (or
 * stream); the run exits 0 when there is none and 2 when there is any.
 */
#include <getopt.h>
#include <stdio.h>
#include <string.h>

#include "cmd.h"
#include "display.h"
#include "netcheck.h"
#include "network_xml.h"
#include "output.h"

static void
help(FILE *fp)
{
	fprintf(fp,
"Usage: heatloom check NETWORK.xml [--quiet]\n"
"\n"
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
"cannot be read as a network).\n"
"\n"
"Options:\n"
"  --quiet            no summary on standard output\n"
HL_HELP_UNITS
"                     (the summary; the problems stay in SI units)\n"
"  -h, --help         show this help\n"
"\n"
"%s\n", hl_caution);
}

static int
parse(int argc, char **argv, hl_common *o)
{
	static const struct option opts[] = {
		{ "quiet", no_argument, NULL, HL_OPT_QUIET },
		{ "units", required_argument, NULL, HL_OPT_UNITS },
		{ "help", no_argument, NULL, 'h' },
		{ NULL, 0, NULL, 0 }
	};
	int ch, rc;

	hl_common_init(o);
	optind = 1;
	opterr = 0;
	while ((ch = getopt_long(argc, argv, ":h", opts, NULL)) != -1)
		if (hl_cmd_common_opt("check", ch, argv, 0, help, o, &rc) &&
		    rc != 0)
			return rc;
	if (optind != argc - 1)
		return hl_cmd_usage("check", optind >= argc ?
		    "give one network file (XML)" :
		    "give one network file, not several");
	o->input = argv[optind];
	return 0;
}

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

static int
run(int argc, char **argv)
{
	hl_network *net = NULL;
	hl_netcheck *r = NULL;
	hl_common o;
	hl_error err;
	size_t i, nstream = 0;
	int rc;

	rc = parse(argc, argv, &o);
	if (rc != 0)
		return rc < 0 ? 0 : rc;
	hl_error_clear(&err);
	if (hl_network_xml_read(o.input, &net, &err) != HL_OK)
		return hl_cmd_fail(&err);
	if (hl_netcheck_run(net, &r, &err) != HL_OK) {
		hl_network_free(net);
		return hl_cmd_fail(&err);
	}
	for (i = 0; i < net->nparty; i++)
		nstream += !net->party[i].utility;
	report(o.input, r);
	if (!o.quiet)
		printf("%s: %zu exchangers, %zu streams, %zu utilities: "
		    "%s%zu problem%s (targets from the streams: %.*f %s "
		    "hot, %.*f %s cold)\n", o.input, net->nunit, nstream,
		    net->nparty - nstream, r->n == 0 ? "sound, " : "",
		    r->n, r->n == 1 ? "" : "s", HL_DIG_Q(1),
		    hl_show_q(r->qh_min), HL_SYM_Q, HL_DIG_Q(1),
		    hl_show_q(r->qc_min), HL_SYM_Q);
	rc = r->n == 0 ? 0 : HL_EINPUT;
	hl_netcheck_free(r);
	hl_network_free(net);
	return rc;
}

const hl_command hl_cmd_check = {
	"check", "NETWORK.xml [--quiet]",
	"verify a network file: balances, EMAT, utilities, sizing",
	run, help
};
