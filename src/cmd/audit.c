/* audit.c - `heatloom audit`: today's network against the targets, the
 * culprits, the area efficiency and a retrofit screened at constant α. */
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

typedef struct {
	hl_common c;
	const char *network;
	const char *svg;
} audit_opts;
HL_COMMON_FIRST(audit_opts);

static const hl_option option_rows[] = {
	HL_ROW_TEXT("network", "FILE", audit_opts, network,
	    "the existing network (CSV), instead of the case's own"),
	HL_ROW_DTMIN("ΔTmin of the targets (default: the case's, or 10)"),
	HL_ROW_UTILITIES,
	HL_ROW_FORMAT("text (default), xml, or csv (the retrofit curve)"),
	HL_ROW_UNITS(HL_UNITS_HELP),
	HL_ROW_OUTPUT("FILE", "write to FILE instead of standard output"),
	HL_ROW_TEXT("svg", "FILE", audit_opts, svg,
	    "chart of area against energy: the targets, today's\n"
	    "point and the retrofit curve"),
	HL_ROW_HELP,
	HL_ROW_END
};

static hl_status
load(const audit_opts *s, hl_case **c, hl_error *err)
{
	hl_status st;

	hl_output_protect(s->network);
	st = hl_cmd_load_case(&s->c, c, err);
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
	hl_status st = hl_output_open(&out, s->c.output, err);
	hl_xml_out *x;

	if (st != HL_OK)
		return st;
	if (s->c.format == HL_FMT_CSV) {
		hl_audit_csv(out.fp, r);
	} else if (s->c.format == HL_FMT_TEXT) {
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
run_audit(void *opts, hl_error *err)
{
	const audit_opts *s = opts;
	hl_case *c = NULL;
	hl_audit *a = NULL;
	hl_retrofit *r = NULL;
	hl_status st;

	st = load(s, &c, err);
	if (st == HL_OK) {
		st = hl_audit_run(c, &a, err);
		hl_cmd_print_warnings(a ? a->net : NULL);
	}
	if (st == HL_OK)
		st = hl_retrofit_screen(c, a, RETROFIT_POINTS, &r, err);
	/* Everything is computed before any file is written. */
	if (st == HL_OK && s->svg != NULL) {
		hl_svg_chart *ch = hl_audit_chart(c, a, r);

		st = hl_cmd_write_chart(s->svg, ch, err);
		hl_svg_chart_free(ch);
	}
	if (st == HL_OK)
		st = write_main(s, c, a, r, err);
	hl_retrofit_free(r);
	hl_audit_free(a);
	hl_case_free(c);
	return st;
}

const hl_command hl_cmd_audit = {
	"audit", "CASE [options]",
	"today's network against the targets, culprits, area efficiency, "
	"retrofit payback",
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
	"rows that make no sense stop the run (exit 2).\n",
	"The retrofit figures are screening estimates for a first discussion, not\n"
	"a retrofit design.\n",
	option_rows, sizeof(audit_opts),
	"give one CASE file", "give one CASE file, not several",
	NULL, NULL, run_audit
};
