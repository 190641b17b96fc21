/* size.c - `heatloom size`: size every exchanger of a list.
 *
 * Each row is sized on its own with the values it gives; what it leaves
 * empty comes from the command line, and what neither gives from the
 * built-in defaults (hl_settings_default), marked as assumed in the report.
 * Bad data anywhere stops the run (exit 2, nothing written). A unit that is
 * valid but cannot be built as the type asked for (too many shells) does
 * not stop the others: it is reported as not sized, with a warning on
 * stderr, and the run succeeds; --strict makes it an error (exit 3).
 */
#include <getopt.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "cmd.h"
#include "exchanger.h"
#include "output.h"
#include "result_xml.h"
#include "size_out.h"
#include "units_table.h"

static void
help(FILE *fp)
{
	fprintf(fp,
"Usage: heatloom size UNITS.csv [options]\n"
"\n"
"Size every exchanger of a list: LMTD, P, R, F correction, shells in series,\n"
"area, area per shell and cost. UNITS.csv has one row per exchanger: name,\n"
"hot_in, hot_out, cold_in, cold_out (°C); duty (kW) or hot_cp/cold_cp (kW/K);\n"
"u, or h_hot and h_cold (kW/(m²·K)); optional type, fmin, xp, cost_a, cost_b,\n"
"cost_c. A row's own values win over the options below.\n"
"\n"
"Options:\n"
"  --type T           shell-and-tube (default: 1 shell pass, 2, 4, … tube\n"
"                     passes per shell) or counterflow (F = 1)\n"
"  --fmin F           F floor for the shell count (default 0.80)\n"
"  --xp X             largest share of the maximum P per shell (default 0.9)\n"
"  --cost-a A --cost-b B --cost-c C\n"
"                     cost per shell A + B·area^C, area in m² (default an\n"
"                     illustrative 10000 + 800·area^0.8); all three together\n"
"  --strict           a unit that cannot be built is an error (exit 3)\n"
"                     instead of a unit reported as not sized\n"
"  --format FMT       text (default), xml, or csv\n"
HL_HELP_UNITS
"  -o, --output FILE  write to FILE instead of standard output\n"
"  -h, --help         show this help\n"
"\n"
"%s\n", hl_caution);
}

enum { OPT_FORMAT = 256, OPT_TYPE, OPT_FMIN, OPT_XP, OPT_COST_A, OPT_COST_B,
       OPT_COST_C, OPT_STRICT };

/* Which settings the command line gave. */
enum { GIVEN_TYPE = 1, GIVEN_FMIN = 2, GIVEN_XP = 4, GIVEN_COST_A = 8,
       GIVEN_COST_B = 16, GIVEN_COST_C = 32 };
#define GIVEN_COST (GIVEN_COST_A | GIVEN_COST_B | GIVEN_COST_C)

typedef struct {
	hl_common c;
	hl_settings set;  /* defaults, overridden by the options */
	hl_settings defaults;
	unsigned given;
	int strict;
} options;

static int
parse_type(const char *arg, hl_exchanger_type *out)
{
	if (strcmp(arg, "shell-and-tube") == 0)
		*out = HL_EXCH_SHELL_TUBE;
	else if (strcmp(arg, "counterflow") == 0)
		*out = HL_EXCH_COUNTERFLOW;
	else
		return hl_cmd_usage("size", "--type wants shell-and-tube or "
		    "counterflow, not '%s'", arg);
	return 0;
}

/* One option with a value; 0 when it is fine. */
static int
parse_value(options *o, int ch, const char *arg)
{
	switch (ch) {
	case OPT_FORMAT:
		return hl_cmd_parse_format("size", arg,
		    HL_FMT_BIT(HL_FMT_TEXT) | HL_FMT_BIT(HL_FMT_XML) |
		    HL_FMT_BIT(HL_FMT_CSV), &o->c.format) ? 1 : 0;
	case OPT_TYPE:
		o->given |= GIVEN_TYPE;
		return parse_type(arg, &o->set.exchanger);
	case OPT_FMIN:
		o->given |= GIVEN_FMIN;
		return hl_cmd_parse_double("size", "--fmin", arg, 0.0, 0.999,
		    &o->set.fmin) ? 1 : 0;
	case OPT_XP:
		o->given |= GIVEN_XP;
		return hl_cmd_parse_double("size", "--xp", arg, 0.01, 1.0,
		    &o->set.xp) ? 1 : 0;
	case OPT_COST_A:
		o->given |= GIVEN_COST_A;
		return hl_cmd_parse_double("size", "--cost-a", arg, 0.0, 1e12,
		    &o->set.cost_a) ? 1 : 0;
	case OPT_COST_B:
		o->given |= GIVEN_COST_B;
		return hl_cmd_parse_double("size", "--cost-b", arg, 0.0, 1e12,
		    &o->set.cost_b) ? 1 : 0;
	default:
		o->given |= GIVEN_COST_C;
		return hl_cmd_parse_double("size", "--cost-c", arg, 0.01, 10.0,
		    &o->set.cost_c) ? 1 : 0;
	}
}

static int
parse(int argc, char **argv, options *o)
{
	static const struct option opts[] = {
		{ "format", required_argument, NULL, OPT_FORMAT },
		{ "type", required_argument, NULL, OPT_TYPE },
		{ "fmin", required_argument, NULL, OPT_FMIN },
		{ "xp", required_argument, NULL, OPT_XP },
		{ "cost-a", required_argument, NULL, OPT_COST_A },
		{ "cost-b", required_argument, NULL, OPT_COST_B },
		{ "cost-c", required_argument, NULL, OPT_COST_C },
		{ "strict", no_argument, NULL, OPT_STRICT },
		{ "output", required_argument, NULL, 'o' },
		{ "units", required_argument, NULL, HL_OPT_UNITS },
		{ "help", no_argument, NULL, 'h' },
		{ NULL, 0, NULL, 0 }
	};
	int ch;

	memset(o, 0, sizeof *o);
	hl_common_init(&o->c);
	hl_settings_default(&o->set);
	o->defaults = o->set;
	optind = 1;
	opterr = 0;
	while ((ch = getopt_long(argc, argv, ":o:h", opts, NULL)) != -1) {
		switch (ch) {
		case OPT_STRICT:
			o->strict = 1;
			break;
		case 'o':
			o->c.output = optarg;
			break;
		case HL_OPT_UNITS: {
			int rc;

			hl_cmd_common_opt("size", ch, argv, 0, help, &o->c,
					  &rc);
			if (rc != 0)
				return rc;
			break;
		}
		case 'h':
			help(stdout);
			return -1;
		case ':':
			return hl_cmd_usage("size", "option '%s' needs a "
			    "value", argv[optind - 1]);
		case '?':
			return hl_cmd_usage("size", "unknown option '%s'",
			    argv[optind - 1]);
		default:
			if (parse_value(o, ch, optarg) != 0)
				return 1;
		}
	}
	if ((o->given & GIVEN_COST) != 0 && (o->given & GIVEN_COST) !=
	    GIVEN_COST)
		return hl_cmd_usage("size", "give --cost-a, --cost-b and "
		    "--cost-c together (cost per shell a + b·A^c)");
	if (optind != argc - 1)
		return hl_cmd_usage("size", optind >= argc ?
		    "give one exchanger list (CSV)" :
		    "give one exchanger list, not several");
	o->c.input = argv[optind];
	return 0;
}

/* U from the film coefficients, a missing one taken from the defaults. */
static void
resolve_u(const hl_unit_spec *u, const options *o, hl_size_row *row)
{
	row->h_hot = row->h_cold = NAN;
	if (!isnan(u->u)) {
		row->spec.u = u->u;
		return;
	}
	row->h_hot = u->h_hot;
	row->h_cold = u->h_cold;
	if (isnan(row->h_hot)) {
		row->h_hot = o->set.h_default;
		row->assumed |= HL_ASSUMED_H_HOT;
	}
	if (isnan(row->h_cold)) {
		row->h_cold = o->set.h_default;
		row->assumed |= HL_ASSUMED_H_COLD;
	}
	/* Both are in (0, HL_H_MAX]: the reader checked them. */
	hl_exchanger_u(row->h_hot, row->h_cold, &row->spec.u, NULL);
}

/* A row's own value, else the command line's, else the default (assumed). */
static double
pick(double row_value, double option, unsigned given, unsigned bit,
     unsigned assumed_bit, unsigned *assumed)
{
	if (!isnan(row_value))
		return row_value;
	if (!(given & bit))
		*assumed |= assumed_bit;
	return option;
}

/* What to size: the row, then the options, then the defaults. */
static void
resolve(const hl_unit_spec *u, const options *o, hl_size_row *row)
{
	hl_exchanger_spec *s = &row->spec;

	memset(row, 0, sizeof *row);
	row->unit = u;
	hl_exchanger_spec_settings(s, &o->set);
	s->hot_in = u->hot_in;
	s->hot_out = u->hot_out;
	s->cold_in = u->cold_in;
	s->cold_out = u->cold_out;
	s->duty = u->duty;
	if (u->type >= 0)
		s->type = (hl_exchanger_type)u->type;
	else if (!(o->given & GIVEN_TYPE))
		row->assumed |= HL_ASSUMED_TYPE;
	s->fmin = pick(u->fmin, o->set.fmin, o->given, GIVEN_FMIN,
	    HL_ASSUMED_FMIN, &row->assumed);
	s->xp = pick(u->xp, o->set.xp, o->given, GIVEN_XP, HL_ASSUMED_XP,
	    &row->assumed);
	if (!isnan(u->cost_a)) {
		s->cost_a = u->cost_a;
		s->cost_b = u->cost_b;
		s->cost_c = u->cost_c;
	} else if (!(o->given & GIVEN_COST))
		row->assumed |= HL_ASSUMED_COST;
	if (s->type == HL_EXCH_COUNTERFLOW)
		row->assumed &= ~(unsigned)(HL_ASSUMED_FMIN | HL_ASSUMED_XP);
	resolve_u(u, o, row);
}

/* Size one row. HL_ENOSOLUTION leaves the row marked as not sized, with
 * what counterflow numbers there are; any other failure is the caller's. */
static hl_status
size_row(hl_size_row *row, const char *file, hl_error *err)
{
	const hl_exchanger_spec *s = &row->spec;
	hl_error e;
	hl_status st;

	hl_error_clear(&e);
	st = hl_exchanger_size(s, &row->size, &e);
	row->status = st;
	if (st == HL_ENOSOLUTION) {
		snprintf(row->note, sizeof row->note, "%s", e.text);
		hl_exchanger_pr(s->hot_in, s->hot_out, s->cold_in, s->cold_out,
		    &row->size.p, &row->size.r, NULL);
		hl_exchanger_lmtd(s->hot_in - s->cold_out,
		    s->hot_out - s->cold_in, &row->size.lmtd, NULL);
		return HL_OK;
	}
	if (st != HL_OK)
		return hl_error_set(err, st, file, row->unit->line,
		    "unit '%.64s': %s", row->unit->name, e.text);
	return HL_OK;
}

/* Units that could not be built: a warning each, or with --strict the
 * first of them as the error. */
static hl_status
report_unsized(const options *o, const hl_size_result *r, hl_error *err)
{
	size_t i;

	for (i = 0; i < r->n; i++) {
		const hl_size_row *row = &r->row[i];

		if (row->status == HL_OK)
			continue;
		if (o->strict)
			return hl_error_set(err, HL_ENOSOLUTION, r->source,
			    row->unit->line, "unit '%.64s': %s",
			    row->unit->name, row->note);
		fprintf(stderr, "heatloom: warning: %s:%ld: unit '%.64s' not "
		    "sized: %s\n", r->source, row->unit->line,
		    row->unit->name, row->note);
	}
	return HL_OK;
}

static hl_status
write_xml(FILE *fp, const hl_size_result *r, hl_error *err)
{
	hl_xml_out *x = hl_xml_out_begin(r->source);
	hl_status st;

	if (x == NULL)
		return hl_error_nomem(err);
	if (hl_size_xml(hl_xml_out_writer(x), r) < 0)
		st = hl_error_set(err, HL_EIO, NULL, 0, "cannot build XML");
	else
		st = hl_xml_out_finish(x, fp, err);
	hl_xml_out_free(x);
	return st;
}

static hl_status
write_result(const options *o, const hl_size_result *r, hl_error *err)
{
	hl_output out;
	hl_status st;

	st = hl_output_open(&out, o->c.output, err);
	if (st != HL_OK)
		return st;
	if (o->c.format == HL_FMT_XML)
		st = write_xml(out.fp, r, err);
	else if (o->c.format == HL_FMT_CSV)
		hl_size_csv(out.fp, r);
	else
		hl_size_text(out.fp, r);
	if (st == HL_OK)
		st = hl_output_commit(&out, err);
	hl_output_abort(&out);
	return st;
}

static hl_status
run_size(const options *o, hl_error *err)
{
	hl_units_table *t = NULL;
	hl_size_row *rows = NULL;
	hl_size_result r;
	hl_status st;
	size_t i;

	hl_output_protect(o->c.input);
	st = hl_output_check(o->c.output, err);
	if (st == HL_OK)
		st = hl_units_table_read(o->c.input, &t, err);
	if (st == HL_OK && (rows = calloc(t->n, sizeof *rows)) == NULL)
		st = hl_error_nomem(err);
	for (i = 0; st == HL_OK && i < t->n; i++) {
		resolve(&t->unit[i], o, &rows[i]);
		st = size_row(&rows[i], t->file, err);
	}
	if (st == HL_OK) {
		r.source = t->file;
		r.row = rows;
		r.n = t->n;
		r.defaults = &o->defaults;
		r.caution = hl_caution;
		st = report_unsized(o, &r, err);
	}
	if (st == HL_OK)
		st = write_result(o, &r, err);
	free(rows);
	hl_units_table_free(t);
	return st;
}

static int
run(int argc, char **argv)
{
	options o;
	hl_error err;
	int rc = parse(argc, argv, &o);

	if (rc != 0)
		return rc < 0 ? 0 : rc;
	hl_error_clear(&err);
	if (run_size(&o, &err) != HL_OK)
		return hl_cmd_fail(&err);
	return 0;
}

const hl_command hl_cmd_size = {
	"size", "UNITS.csv [--type T] [--fmin F] [--xp X] [--cost-a A "
	"--cost-b B --cost-c C] [--strict] [--format text|xml|csv] [-o FILE]",
	"size a list of exchangers: LMTD, F, shells, area, cost",
	run, help
};
