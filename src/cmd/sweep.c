/* sweep.c - `heatloom sweep`: energy against capital over ΔTmin. */
#include <getopt.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>

#include "cmd.h"
#include "output.h"
#include "result_xml.h"
#include "sweep.h"
#include "sweep_out.h"

static void
help(FILE *fp)
{
	fprintf(fp,
"Usage: heatloom sweep CASE [options]\n"
"\n"
"Supertargets over a grid of ΔTmin: hot and cold utility, area, units,\n"
"shells, capital, energy and total annual cost at each value, and the ΔTmin\n"
"of least total annual cost (grid best refined by golden-section search).\n"
"Area by the vertical-transfer formula on the balanced composite curves,\n"
"shells by the Xp rule, capital from the case's cost law annualised over its\n"
"interest and life, energy from the utility prices and operating hours.\n"
"\n"
"Options:\n"
"  --from K           first ΔTmin (default 2)\n"
"  --to K             last ΔTmin (default 40)\n"
"  --step K           grid step (default 1)\n"
"  --utilities FILE   utility table (CSV) to add to the case\n"
"  --format FMT       text (default), xml, or csv\n"
HL_HELP_UNITS
"  -o, --output FILE  write to FILE instead of standard output\n"
"  --cost-svg FILE    chart of annual cost against ΔTmin\n"
"  --area-svg FILE    chart of area against hot utility\n"
"  -h, --help         show this help\n"
"\n"
"%s\n", hl_caution);
}

enum { OPT_FROM = 256, OPT_TO, OPT_STEP, OPT_COST, OPT_AREA };

typedef struct {
	hl_common o;
	double from, to, step;
	const char *cost_svg, *area_svg;
} sweep_opts;

static int
parse_range(int ch, const char *arg, sweep_opts *s)
{
	static const char *const names[] = { "--from", "--to", "--step" };
	double *dst[] = { &s->from, &s->to, &s->step };
	int k = ch - OPT_FROM;

	return hl_cmd_parse_double("sweep", names[k], arg, k == 2 ? 1e-3 : 0.0,
				   500.0, dst[k]);
}

static int
parse(int argc, char **argv, sweep_opts *s)
{
	static const struct option opts[] = {
		{ "from", required_argument, NULL, OPT_FROM },
		{ "to", required_argument, NULL, OPT_TO },
		{ "step", required_argument, NULL, OPT_STEP },
		{ "utilities", required_argument, NULL, HL_OPT_UTIL },
		{ "format", required_argument, NULL, HL_OPT_FORMAT },
		{ "cost-svg", required_argument, NULL, OPT_COST },
		{ "area-svg", required_argument, NULL, OPT_AREA },
		{ "output", required_argument, NULL, 'o' },
		{ "units", required_argument, NULL, HL_OPT_UNITS },
		{ "help", no_argument, NULL, 'h' },
		{ NULL, 0, NULL, 0 }
	};
	const unsigned formats = HL_FMT_BIT(HL_FMT_TEXT) |
				 HL_FMT_BIT(HL_FMT_XML) | HL_FMT_BIT(HL_FMT_CSV);
	int ch, rc;

	hl_common_init(&s->o);
	s->from = 2.0;
	s->to = 40.0;
	s->step = 1.0;
	s->cost_svg = s->area_svg = NULL;
	optind = 1;
	opterr = 0;
	while ((ch = getopt_long(argc, argv, ":o:h", opts, NULL)) != -1) {
		if (hl_cmd_common_opt("sweep", ch, argv, formats, help, &s->o,
				      &rc)) {
			if (rc != 0)
				return rc;
		} else if (ch == OPT_COST) {
			s->cost_svg = optarg;
		} else if (ch == OPT_AREA) {
			s->area_svg = optarg;
		} else if (parse_range(ch, optarg, s) != 0) {
			return 1;
		}
	}
	if ((rc = hl_cmd_one_input("sweep", argc, argv, &s->o)) != 0)
		return rc;
	if (s->to < s->from)
		return hl_cmd_usage("sweep", "--to %g is below --from %g",
				    s->to, s->from);
	if ((s->to - s->from) / s->step > 10000.0)
		return hl_cmd_usage("sweep", "more than 10001 grid points; "
				    "use a larger --step");
	return 0;
}

static hl_status
write_main(const sweep_opts *s, const hl_case *c, const hl_sweep *sw,
	   hl_error *err)
{
	hl_output out;
	hl_status st = hl_output_open(&out, s->o.output, err);
	hl_xml_out *x = NULL;

	if (st != HL_OK)
		return st;
	if (s->o.format == HL_FMT_CSV) {
		hl_sweep_csv(out.fp, c, sw);
	} else if (s->o.format == HL_FMT_TEXT) {
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
write_chart(const char *path, hl_svg_chart *ch, hl_error *err)
{
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
	return st;
}

static hl_status
run_sweep(const sweep_opts *s, hl_error *err)
{
	hl_case *c = NULL;
	hl_sweep *sw = NULL;
	hl_svg_chart *cost = NULL, *area = NULL;
	hl_status st;

	st = hl_cmd_load_case(&s->o, &c, err);
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
		st = write_chart(s->cost_svg, cost, err);
	if (st == HL_OK && area != NULL)
		st = write_chart(s->area_svg, area, err);
	if (st == HL_OK)
		st = write_main(s, c, sw, err);
	hl_svg_chart_free(cost);
	hl_svg_chart_free(area);
	hl_sweep_free(sw);
	hl_case_free(c);
	return st;
}

static int
run(int argc, char **argv)
{
	sweep_opts s;
	hl_error err;
	int rc = parse(argc, argv, &s);

	if (rc != 0)
		return rc < 0 ? 0 : rc;
	hl_error_clear(&err);
	if (run_sweep(&s, &err) != HL_OK)
		return hl_cmd_fail(&err);
	return 0;
}

const hl_command hl_cmd_sweep = {
	"sweep", "CASE [--from K --to K --step K] [--format text|xml|csv] "
	"[-o FILE] [--cost-svg FILE] [--area-svg FILE]",
	"area, units, shells and cost targets over ΔTmin, and the optimum",
	run, help
};
