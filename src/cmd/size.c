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

/* Which settings the command line gave. */
enum { GIVEN_TYPE = 1, GIVEN_FMIN = 2, GIVEN_XP = 4, GIVEN_COST_A = 8,
       GIVEN_COST_B = 16, GIVEN_COST_C = 32, GIVEN_LARGEST = 64 };
#define GIVEN_COST (GIVEN_COST_A | GIVEN_COST_B | GIVEN_COST_C)

typedef struct {
	hl_common c;
	hl_settings set;  /* defaults, overridden by the options */
	hl_settings defaults;
	double largest;   /* --largest, NaN when not given */
	unsigned given;
	int strict;
} options;
HL_COMMON_FIRST(options);

static int
parse_type(void *opts, const char *arg)
{
	options *o = opts;
	int t = hl_exchanger_type_parse(arg);

	if (t < 0)
		return hl_cmd_usage("size", "--type wants shell-and-tube, "
		    "counterflow, plate, double-pipe, air-cooler or "
		    "fired-heater, not '%s'", arg);
	o->set.exchanger = (hl_exchanger_type)t;
	return 0;
}

static const hl_option option_rows[] = {
	{ "type", 0, "T", "shell-and-tube (default: 1 shell pass, 2, 4, … tube\n"
	  "passes per shell), counterflow (F = 1), plate\n"
	  "(F = 1), double-pipe (hairpins, F = 1), air-cooler\n"
	  "(crossflow, both fluids unmixed) or fired-heater\n"
	  "(sized and costed by duty)", HL_ARG_CALL, 0, 0, 0, parse_type },
	HL_ROW_NUMBER("fmin", "F", options, set.fmin, 0.0, 0.999,
	    "F floor for the shell count (default 0.80)"),
	HL_ROW_NUMBER("xp", "X", options, set.xp, 0.01, 1.0,
	    "largest share of the maximum P per shell (default 0.9)"),
	HL_ROW_NUMBER("largest", "X", options, largest, 1e-6, 1e9,
	    "largest shell: m² (MW for a fired heater); beyond it\n"
	    "shells go in parallel (default per type, illustrative)"),
	/* The three cost options share one help line. */
	HL_ROW_NUMBER("cost-a", "A", options, set.cost_a, 0.0, 1e12, NULL),
	HL_ROW_NUMBER("cost-b", "B", options, set.cost_b, 0.0, 1e12, NULL),
	HL_ROW_NUMBER("cost-c", "C", options, set.cost_c, 0.01, 10.0,
	    "cost per shell A + B·X^C, X the area of one shell in\n"
	    "m² or a fired heater's duty in MW (default: the type's\n"
	    "illustrative law, e.g. 10000 + 800·A^0.8 for\n"
	    "shell-and-tube); all three together"),
	HL_ROW_FLAG("strict", options, strict, 1,
	    "a unit that cannot be built is an error (exit 3)\n"
	    "instead of a unit reported as not sized"),
	HL_ROW_FORMAT("text (default), xml, or csv"),
	HL_ROW_UNITS(HL_UNITS_HELP),
	HL_ROW_OUTPUT("FILE", "write to FILE instead of standard output"),
	HL_ROW_HELP,
	HL_ROW_END
};

extern const hl_command hl_cmd_size;

static void
init(void *opts)
{
	options *o = opts;

	hl_settings_default(&o->set);
	o->defaults = o->set;
	o->largest = NAN;
}

static int
check(void *opts)
{
	static const char *const names[] = { "type", "fmin", "xp", "cost-a",
		"cost-b", "cost-c", "largest" };
	options *o = opts;
	size_t i;

	for (i = 0; i < sizeof names / sizeof names[0]; i++)
		if (hl_cmd_given(&hl_cmd_size, o, names[i]))
			o->given |= 1u << i;
	if ((o->given & GIVEN_COST) != 0 && (o->given & GIVEN_COST) !=
	    GIVEN_COST)
		return hl_cmd_usage("size", "give --cost-a, --cost-b and "
		    "--cost-c together (cost per shell a + b·A^c)");
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
	if (u->type < 0 && !(o->given & GIVEN_TYPE))
		row->assumed |= HL_ASSUMED_TYPE;
	/* The type first: it chooses the default law and shell limits. */
	hl_exchanger_spec_type(s, &o->set, u->type >= 0 ?
	    (hl_exchanger_type)u->type : o->set.exchanger);
	if (o->given & GIVEN_COST) {
		s->cost_a = o->set.cost_a;
		s->cost_b = o->set.cost_b;
		s->cost_c = o->set.cost_c;
	}
	s->largest = pick(u->largest, isnan(o->largest) ? s->largest :
	    o->largest, o->given, GIVEN_LARGEST, HL_ASSUMED_LARGEST,
	    &row->assumed);
	s->hot_in = u->hot_in;
	s->hot_out = u->hot_out;
	s->cold_in = u->cold_in;
	s->cold_out = u->cold_out;
	s->duty = u->duty;
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
	if (s->type != HL_EXCH_SHELL_TUBE)
		row->assumed &= ~(unsigned)HL_ASSUMED_XP;
	if (s->type != HL_EXCH_SHELL_TUBE && s->type != HL_EXCH_AIR_COOLER)
		row->assumed &= ~(unsigned)HL_ASSUMED_FMIN;
	if (isinf(s->largest))
		row->assumed &= ~(unsigned)HL_ASSUMED_LARGEST;
	resolve_u(u, o, row);
	if (s->type == HL_EXCH_FIRED_HEATER)
		row->assumed &= ~(unsigned)(HL_ASSUMED_H_HOT |
		    HL_ASSUMED_H_COLD);
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
	/* A default largest shell is an assumption only where it bites. */
	if (st == HL_OK && row->size.parallel == 1 &&
	    (s->type != HL_EXCH_DOUBLE_PIPE || row->size.shells == 1))
		row->assumed &= ~(unsigned)HL_ASSUMED_LARGEST;
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
run_size(void *opts, hl_error *err)
{
	const options *o = opts;
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

const hl_command hl_cmd_size = {
	"size", "UNITS.csv [options]",
	"size a list of exchangers: LMTD, F, shells, area, cost",
	"Size every exchanger of a list: LMTD, P, R, F correction, shells in series,\n"
	"area, area per shell and cost. UNITS.csv has one row per exchanger: name,\n"
	"hot_in, hot_out, cold_in, cold_out (°C); duty (kW) or hot_cp/cold_cp (kW/K);\n"
	"u, or h_hot and h_cold (kW/(m²·K)); optional type, fmin, xp, cost_a, cost_b,\n"
	"cost_c, largest. A row's own values win over the options below.\n",
	NULL, option_rows, sizeof(options),
	"give one exchanger list (CSV)", "give one exchanger list, not several",
	init, check, run_size
};
