/* sweep.c - `heatloom sweep`: energy against capital over ΔTmin. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>

#include "cmd.h"
#include "output.h"
#include "result_xml.h"
#include "sweep.h"
#include "sweep_out.h"

typedef struct {
	hl_common c;
	double from, to, step;
	const char *cost_svg, *area_svg;
} sweep_opts;
HL_COMMON_FIRST(sweep_opts);

static const hl_option option_rows[] = {
	HL_ROW_NUMBER("from", "K", sweep_opts, from, 0.0, 500.0,
	    "first ΔTmin (default 2)"),
	HL_ROW_NUMBER("to", "K", sweep_opts, to, 0.0, 500.0,
	    "last ΔTmin (default 40)"),
	HL_ROW_NUMBER("step", "K", sweep_opts, step, 1e-3, 500.0,
	    "grid step (default 1)"),
	HL_ROW_UTILITIES,
	HL_ROW_FORMAT("text (default), xml, or csv"),
	HL_ROW_UNITS(HL_UNITS_HELP),
	HL_ROW_OUTPUT("FILE", "write to FILE instead of standard output"),
	HL_ROW_TEXT("cost-svg", "FILE", sweep_opts, cost_svg,
	    "chart of annual cost against ΔTmin"),
	HL_ROW_TEXT("area-svg", "FILE", sweep_opts, area_svg,
	    "chart of area against hot utility"),
	HL_ROW_HELP,
	HL_ROW_END
};

static void
init(void *opts)
{
	sweep_opts *s = opts;

	s->from = 2.0;
	s->to = 40.0;
	s->step = 1.0;
}

static int
check(void *opts)
{
	const sweep_opts *s = opts;

	return hl_cmd_check_grid("sweep", s->from, s->to, s->step);
}

static hl_status
write_main(const sweep_opts *s, const hl_case *c, const hl_sweep *sw,
	   hl_error *err)
{
	hl_output out;
	hl_status st = hl_output_open(&out, s->c.output, err);
	hl_xml_out *x = NULL;

	if (st != HL_OK)
		return st;
	if (s->c.format == HL_FMT_CSV) {
		hl_sweep_csv(out.fp, c, sw);
	} else if (s->c.format == HL_FMT_TEXT) {
		hl_sweep_text(out.fp, c, sw);
	} else {
		x = hl_xml_out_begin(c->source);
		if (x == NULL)
			st = hl_error_nomem(err);
		else if (hl_sweep_xml(hl_xml_out_writer(x), sw, s->from,
				      s->to, s->step) < 0)
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
run_sweep(void *opts, hl_error *err)
{
	const sweep_opts *s = opts;
	hl_case *c = NULL;
	hl_sweep *sw = NULL;
	hl_svg_chart *cost = NULL, *area = NULL;
	hl_status st;

	st = hl_cmd_load_case(&s->c, &c, err);
	if (st == HL_OK)
		st = hl_output_check(s->cost_svg, err);
	if (st == HL_OK)
		st = hl_output_check(s->area_svg, err);
	if (st == HL_OK)
		st = hl_sweep_run(c, s->from, s->to, s->step, &sw, err);
	/* Build every chart before writing any file. */
	if (st == HL_OK && s->cost_svg != NULL &&
	    (cost = hl_sweep_chart_cost(c, sw)) == NULL)
		st = hl_error_nomem(err);
	if (st == HL_OK && s->area_svg != NULL &&
	    (area = hl_sweep_chart_area(c, sw)) == NULL)
		st = hl_error_nomem(err);
	if (st == HL_OK && cost != NULL)
		st = hl_cmd_write_chart(s->cost_svg, cost, err);
	if (st == HL_OK && area != NULL)
		st = hl_cmd_write_chart(s->area_svg, area, err);
	if (st == HL_OK)
		st = write_main(s, c, sw, err);
	hl_svg_chart_free(cost);
	hl_svg_chart_free(area);
	hl_sweep_free(sw);
	hl_case_free(c);
	return st;
}

const hl_command hl_cmd_sweep = {
	"sweep", "CASE [options]",
	"area, units, shells and cost targets over ΔTmin, and the optimum",
	"Supertargets over a grid of ΔTmin: hot and cold utility, area, units,\n"
	"shells, capital, energy and total annual cost at each value, and the ΔTmin\n"
	"of least total annual cost (grid best refined by golden-section search).\n"
	"Area by the vertical-transfer formula on the balanced composite curves,\n"
	"shells by the Xp rule, capital from the case's cost law annualised over its\n"
	"interest and life, energy from the utility prices and operating hours.\n",
	NULL, option_rows, sizeof(sweep_opts),
	"give one CASE file", "give one CASE file, not several",
	init, check, run_sweep
};
