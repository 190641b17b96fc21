/* audit.c - `heatloom audit`: today's network against the targets, the
 * culprits, the area efficiency and a retrofit screened at constant α. */
#include <getopt.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>

#include "audit.h"
#include "audit_out.h"
#include "cmd.h"
#include "output.h"
#include "result_xml.h"
#include "retrofit.h"
#include "tables.h"

/* Points of the retrofit curve, today's and the targets' included. */
#define RETROFIT_POINTS 11

static void
help(FILE *fp)
{
	fprintf(fp,
"Usage: heatloom audit CASE [options]\n"
"\n"
"Audit of an existing heat-recovery network: today's hot and cold utility\n"
"beside the targets at ΔTmin and the saving in kW and per year; every\n"
"violation of the pinch rules with its duty (process heat across the\n"
"pinch, hot utility below it, cold utility above it), ranked, with what to\n"
"do and what each would save; the ΔTmin at which the targets equal\n"
"today's energy; the area efficiency α (area target at today's energy /\n"
"existing area) and each unit's share; and a retrofit screened at\n"
"constant α: new area, investment, saving and simple payback from today\n"
"to the targets.\n"
"\n"
"The network comes from the case file's <network> or from --network: one\n"
"row per unit (name, hot, cold, duty; optional hot_in, hot_out, cold_in,\n"
"cold_out, area, shells), heaters and coolers naming a utility on one side.\n"
"Missing temperatures are walked along each stream from its supply end;\n"
"missing areas are estimated from film coefficients. Inconsistent rows are\n"
"warned about on standard error with their line and read sensibly;\n"
"rows that make no sense stop the run (exit 2).\n"
"\n"
"Options:\n"
"  --network FILE     the existing network (CSV), instead of the case's own\n"
"  --dtmin K          ΔTmin of the targets (default: the case's, or 10)\n"
"  --utilities FILE   utility table (CSV) to add to the case\n"
"  --format FMT       text (default), xml, or csv (the retrofit curve)\n"
HL_HELP_UNITS
"  -o, --output FILE  write to FILE instead of standard output\n"
"  --svg FILE         chart of area against energy: the targets, today's\n"
"                     point and the retrofit curve\n"
"  -h, --help         show this help\n"
"\n"
"The retrofit figures are screening estimates for a first discussion, not\n"
"a retrofit design.\n"
"\n"
"%s\n", hl_caution);
}

enum { OPT_NETWORK = 256, OPT_SVG };

typedef struct {
	hl_common o;
	const char *network;
	const char *svg;
} audit_opts;

static int
parse(int argc, char **argv, audit_opts *s)
{
	static const struct option opts[] = {
		{ "network", required_argument, NULL, OPT_NETWORK },
		{ "dtmin", required_argument, NULL, HL_OPT_DTMIN },
		{ "utilities", required_argument, NULL, HL_OPT_UTIL },
		{ "format", required_argument, NULL, HL_OPT_FORMAT },
		{ "svg", required_argument, NULL, OPT_SVG },
		{ "output", required_argument, NULL, 'o' },
		{ "units", required_argument, NULL, HL_OPT_UNITS },
		{ "help", no_argument, NULL, 'h' },
		{ NULL, 0, NULL, 0 }
	};
	const unsigned formats = HL_FMT_BIT(HL_FMT_TEXT) |
				 HL_FMT_BIT(HL_FMT_XML) | HL_FMT_BIT(HL_FMT_CSV);
	int ch, rc;

	hl_common_init(&s->o);
	s->network = s->svg = NULL;
	optind = 1;
	opterr = 0;
	while ((ch = getopt_long(argc, argv, ":o:h", opts, NULL)) != -1) {
		if (hl_cmd_common_opt("audit", ch, argv, formats, help, &s->o,
				      &rc)) {
			if (rc != 0)
				return rc;
		} else if (ch == OPT_NETWORK) {
			s->network = optarg;
		} else {
			s->svg = optarg;
		}
	}
	return hl_cmd_one_input("audit", argc, argv, &s->o);
}

/* "heatloom: FILE:LINE: warning: text" for each warning. */
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

static hl_status
load(const audit_opts *s, hl_case **c, hl_error *err)
{
	hl_status st;

	hl_output_protect(s->network);
	st = hl_cmd_load_case(&s->o, c, err);
	if (st == HL_OK)
		st = hl_output_check(s->svg, err);
	if (st == HL_OK && s->network != NULL) {
		hl_case_clear_units(*c);
		st = hl_network_table_read(*c, s->network, err);
	}
	return st;
}

static hl_status
write_main(const audit_opts *s, const hl_case *c, const hl_audit *a,
	   const hl_retrofit *r, hl_error *err)
{
	hl_output out;
	hl_status st = hl_output_open(&out, s->o.output, err);
	hl_xml_out *x;

	if (st != HL_OK)
		return st;
	if (s->o.format == HL_FMT_CSV) {
		hl_audit_csv(out.fp, r);
	} else if (s->o.format == HL_FMT_TEXT) {
		hl_audit_text(out.fp, c, s->network, a, r, hl_caution);
	} else {
		x = hl_xml_out_begin(c->source);
		if (x == NULL)
			st = hl_error_nomem(err);
		else if (hl_audit_xml(hl_xml_out_writer(x), c, a, r) < 0)
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

static hl_status
write_chart(const char *path, const hl_case *c, const hl_audit *a,
	    const hl_retrofit *r, hl_error *err)
{
	hl_svg_chart *ch = hl_audit_chart(c, a, r);
	hl_output out;
	hl_status st;

	if (ch == NULL)
		return hl_error_nomem(err);
	st = hl_output_open(&out, path, err);
	if (st == HL_OK)
		st = hl_svg_chart_write_file(ch, out.fp, err);
	if (st == HL_OK)
		st = hl_output_commit(&out, err);
	hl_output_abort(&out);
	hl_svg_chart_free(ch);
	return st;
}

static hl_status
run_audit(const audit_opts *s, hl_error *err)
{
	hl_case *c = NULL;
	hl_audit *a = NULL;
	hl_retrofit *r = NULL;
	hl_status st;

	st = load(s, &c, err);
	if (st == HL_OK) {
		st = hl_audit_run(c, &a, err);
		print_warnings(a ? a->net : NULL);
	}
	if (st == HL_OK)
		st = hl_retrofit_screen(c, a, RETROFIT_POINTS, &r, err);
	/* Everything is computed before any file is written. */
	if (st == HL_OK && s->svg != NULL)
		st = write_chart(s->svg, c, a, r, err);
	if (st == HL_OK)
		st = write_main(s, c, a, r, err);
	hl_retrofit_free(r);
	hl_audit_free(a);
	hl_case_free(c);
	return st;
}

static int
run(int argc, char **argv)
{
	audit_opts s;
	hl_error err;
	int rc = parse(argc, argv, &s);

	if (rc != 0)
		return rc < 0 ? 0 : rc;
	hl_error_clear(&err);
	if (run_audit(&s, &err) != HL_OK)
		return hl_cmd_fail(&err);
	return 0;
}

const hl_command hl_cmd_audit = {
	"audit", "CASE [--network FILE] [--dtmin K] [--utilities FILE] "
	"[--format text|xml|csv] [-o FILE] [--svg FILE]",
	"today's network against the targets, culprits, area efficiency, "
	"retrofit payback",
	run, help
};
