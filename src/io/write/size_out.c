/* size_out.c - writers of the sized exchanger list (size_out.h).
 *
 * The text table is laid out in two passes over the same cell strings: one
 * to measure every column, one to print, so that long names and large
 * numbers never break the alignment. Widths count UTF-8 characters, not
 * bytes, because the headers carry °C and m².
 */
#include <math.h>
#include <stdarg.h>
#include <stdio.h>
#include <string.h>

#include "display.h"
#include "size_out.h"
#include "text_out.h"
#include "utf8.h"

/* Short tag of a type for the text table. */
static const char *
type_tag(hl_exchanger_type t)
{
	static const char *const tag[HL_EXCH_NTYPES] = {
		"S&T", "CF", "PL", "DP", "AC", "FH"
	};

	return (int)t >= 0 && t < HL_EXCH_NTYPES ? tag[t] : "?";
}

/* Whether the unit's cold outlet is above its hot outlet; a fired heater
 * has no cross to speak of: it is sized by duty. */
static int
row_cross(const hl_size_row *row)
{
	return row->spec.type != HL_EXCH_FIRED_HEATER &&
	    row->spec.cold_out > row->spec.hot_out;
}

/* A line that holds back its spaces until something follows them, so that
 * no line of the table ends in blanks. */
typedef struct {
	FILE *fp;
	size_t pending;
} line;

static void
put(line *l, const char *s)
{
	for (; *s != '\0'; s++) {
		if (*s == ' ') {
			l->pending++;
			continue;
		}
		for (; l->pending > 0; l->pending--)
			fputc(' ', l->fp);
		fputc(*s, l->fp);
	}
}

static void
pad(line *l, size_t n)
{
	l->pending += n;
}

static void
end_line(line *l)
{
	l->pending = 0;
	fputc('\n', l->fp);
}

/* The columns after the unit's name. */
enum { K_TYPE, K_DUTY, K_HIN, K_HOUT, K_CIN, K_COUT, K_U, K_LMTD, K_P, K_R,
       K_F, K_SHELLS, K_AREA, K_ASHELL, K_COST, K_NOTE, K_COUNT };

static const struct {
	const char *head;
	const char *unit;  /* in SI */
	hl_qty qty;        /* for the other display units */
} column[K_COUNT] = {
	{ "type", "", HL_QTY_NONE }, { "duty", "kW", HL_QTY_POWER },
	{ "hot in", "°C", HL_QTY_TEMP }, { "hot out", "°C", HL_QTY_TEMP },
	{ "cold in", "°C", HL_QTY_TEMP }, { "cold out", "°C", HL_QTY_TEMP },
	{ "U", "kW/(m²K)", HL_QTY_HTC }, { "LMTD", "K", HL_QTY_DTEMP },
	{ "P", "", HL_QTY_NONE }, { "R", "", HL_QTY_NONE },
	{ "F", "", HL_QTY_NONE }, { "shells", "", HL_QTY_NONE },
	{ "area", "m²", HL_QTY_AREA }, { "per shell", "m²", HL_QTY_AREA },
	{ "cost", "", HL_QTY_NONE }, { "note", "", HL_QTY_NONE }
};

static const char *
unit_text(size_t k)
{
	if (hl_display_get() == HL_UNITS_SI || column[k].qty == HL_QTY_NONE)
		return column[k].unit;
	return hl_show_unit(column[k].qty);
}

/* Left-aligned columns; the others are numbers, right-aligned. */
static int
left_aligned(size_t k)
{
	return k == K_TYPE || k == K_NOTE;
}

#define CELL 32

/* One table row as strings, with a '*' or ' ' after each value. */
typedef struct {
	char text[K_COUNT][CELL];
	char mark[K_COUNT];
} cells;

/* Rounded for display, never "-0.0". */
static void
number(char *buf, int decimals, double v)
{
	snprintf(buf, CELL, "%.*f", decimals, v);
	if (buf[0] == '-' && strspn(buf + 1, "0.") == strlen(buf + 1))
		memmove(buf, buf + 1, strlen(buf));
}

static void
sized_cells(const hl_size_row *row, cells *c)
{
	const hl_exchanger_sizing *z = &row->size;
	int st = row->spec.type == HL_EXCH_SHELL_TUBE;
	size_t k;

	if (row->status != HL_OK) {
		for (k = K_F; k <= K_COST; k++)
			snprintf(c->text[k], CELL, "—");
		snprintf(c->text[K_NOTE], CELL, "NOT SIZED");
		return;
	}
	number(c->text[K_F], 3, z->f);
	if (z->parallel > 1)
		snprintf(c->text[K_SHELLS], CELL, "%d×%d", z->shells,
		    z->parallel);
	else
		snprintf(c->text[K_SHELLS], CELL, "%d", z->shells);
	if ((st && (row->assumed & (HL_ASSUMED_FMIN | HL_ASSUMED_XP))) ||
	    (row->assumed & HL_ASSUMED_LARGEST))
		c->mark[K_SHELLS] = '*';
	if (row->spec.type == HL_EXCH_FIRED_HEATER) {
		snprintf(c->text[K_AREA], CELL, "by duty");
		snprintf(c->text[K_ASHELL], CELL, "—");
	} else {
		number(c->text[K_AREA], 2, hl_show_a(z->area));
		number(c->text[K_ASHELL], 2,
		    hl_show_a(z->area_shell));
	}
	number(c->text[K_COST], 0, z->cost);
	if (row->assumed & HL_ASSUMED_COST)
		c->mark[K_COST] = '*';
	snprintf(c->text[K_NOTE], CELL, "%s%s%s",
	    row_cross(row) ? "cross" : "",
	    row_cross(row) && z->warn ? ", " : "",
	    z->warn ? "CHECK" : "");
}

static void
row_cells(const hl_size_row *row, cells *c)
{
	const hl_exchanger_spec *s = &row->spec;
	const hl_exchanger_sizing *z = &row->size;
	size_t k;

	for (k = 0; k < K_COUNT; k++)
		c->mark[k] = ' ';
	snprintf(c->text[K_TYPE], CELL, "%s", type_tag(s->type));
	if (row->assumed & HL_ASSUMED_TYPE)
		c->mark[K_TYPE] = '*';
	number(c->text[K_DUTY], HL_DIG_Q(1), hl_show_q(s->duty));
	number(c->text[K_HIN], 1, hl_show_t(s->hot_in));
	number(c->text[K_HOUT], 1, hl_show_t(s->hot_out));
	number(c->text[K_CIN], 1, hl_show_t(s->cold_in));
	number(c->text[K_COUT], 1, hl_show_t(s->cold_out));
	if (s->type == HL_EXCH_FIRED_HEATER)
		snprintf(c->text[K_U], CELL, "—");
	else
		number(c->text[K_U], HL_DIG_H(3), hl_show_h(s->u));
	if (row->assumed & (HL_ASSUMED_H_HOT | HL_ASSUMED_H_COLD))
		c->mark[K_U] = '*';
	number(c->text[K_LMTD], 2, hl_show_dt(z->lmtd));
	number(c->text[K_P], 3, z->p);
	if (isinf(z->r))
		snprintf(c->text[K_R], CELL, "∞");
	else
		number(c->text[K_R], 3, z->r);
	sized_cells(row, c);
}

typedef struct {
	size_t name;
	size_t col[K_COUNT];
} widths;

static size_t
wider(size_t w, const char *s)
{
	size_t n = hl_utf8_chars(s);

	return n > w ? n : w;
}

static void
measure(const hl_size_result *r, widths *w)
{
	cells c;
	size_t i, k;

	w->name = hl_utf8_chars("unit");
	for (k = 0; k < K_COUNT; k++)
		w->col[k] = wider(hl_utf8_chars(column[k].head), unit_text(k));
	for (i = 0; i < r->n; i++) {
		w->name = wider(w->name, r->row[i].unit->name);
		row_cells(&r->row[i], &c);
		for (k = 0; k < K_COUNT; k++)
			w->col[k] = wider(w->col[k], c.text[k]);
	}
}

/* One cell after a blank, aligned in its width, then its mark. */
static void
put_cell(line *l, size_t k, size_t w, const char *s, char mark)
{
	size_t n = hl_utf8_chars(s);
	char m[2] = { mark, '\0' };

	pad(l, 1);
	if (!left_aligned(k))
		pad(l, w - n);
	put(l, s);
	put(l, m);
	if (left_aligned(k))
		pad(l, w - n);
}

static void
put_name(line *l, const char *s, size_t w)
{
	put(l, s);
	pad(l, w - hl_utf8_chars(s));
}

static void
text_table(FILE *fp, const hl_size_result *r)
{
	line l = { fp, 0 };
	widths w;
	cells c;
	size_t i, k;

	measure(r, &w);
	put_name(&l, "unit", w.name);
	for (k = 0; k < K_COUNT; k++)
		put_cell(&l, k, w.col[k], column[k].head, ' ');
	end_line(&l);
	put_name(&l, "", w.name);
	for (k = 0; k < K_COUNT; k++)
		put_cell(&l, k, w.col[k], unit_text(k), ' ');
	end_line(&l);
	for (i = 0; i < r->n; i++) {
		row_cells(&r->row[i], &c);
		put_name(&l, r->row[i].unit->name, w.name);
		for (k = 0; k < K_COUNT; k++)
			put_cell(&l, k, w.col[k], c.text[k], c.mark[k]);
		end_line(&l);
	}
}

static void
text_totals(FILE *fp, const hl_size_result *r)
{
	double area = 0.0, cost = 0.0;
	size_t i, sized = 0;
	long shells = 0;

	for (i = 0; i < r->n; i++) {
		if (r->row[i].status != HL_OK)
			continue;
		sized++;
		shells += (long)r->row[i].size.shells *
		    r->row[i].size.parallel;
		area += r->row[i].size.area;
		cost += r->row[i].size.cost;
	}
	fprintf(fp, "\nTotal: %zu of %zu exchangers sized, %ld shells, "
	    "%.2f %s, cost %.0f%s\n", sized, r->n, shells, hl_show_a(area),
	    HL_SYM_A, cost,
	    sized < r->n ? " (of the sized ones)" : "");
}

#define NOTE_WIDTH 78

/* "  NAME (line L): text", wrapped. */
static void
note(FILE *fp, const hl_size_row *row, const char *fmt, ...)
	__attribute__((format(printf, 3, 4)));

static void
note(FILE *fp, const hl_size_row *row, const char *fmt, ...)
{
	char text[HL_ERROR_TEXT], buf[HL_ERROR_TEXT + 256];
	va_list ap;

	va_start(ap, fmt);
	vsnprintf(text, sizeof text, fmt, ap);
	va_end(ap);
	snprintf(buf, sizeof buf, "%.200s (line %ld): %s", row->unit->name,
	    row->unit->line, text);
	hl_text_wrap(fp, buf, "  ", "      ", NOTE_WIDTH);
}

static void
note_cross(FILE *fp, const hl_size_row *row)
{
	const hl_exchanger_spec *s = &row->spec;
	char tail[64] = "";

	if (!row_cross(row))
		return;
	if (s->type != HL_EXCH_SHELL_TUBE && s->type != HL_EXCH_AIR_COOLER)
		snprintf(tail, sizeof tail, "; a counterflow unit can do it");
	else if (row->status == HL_OK)
		snprintf(tail, sizeof tail, "; %d shell%s in series",
		    row->size.shells, row->size.shells == 1 ? "" : "s");
	note(fp, row, "temperature cross: the cold outlet %.1f %s is %.1f %s "
	    "above the hot outlet %.1f %s%s", hl_show_t(s->cold_out),
	    HL_SYM_T, hl_show_dt(s->cold_out - s->hot_out), HL_SYM_DT,
	    hl_show_t(s->hot_out), HL_SYM_T, tail);
}

/* Whether a side's cp gives a duty other than the one sized for (within
 * the reader's tolerance, or it would have been refused). */
static int
balance_differs(const hl_size_row *row)
{
	const hl_unit_spec *u = row->unit;
	double q = row->spec.duty, tol = 1e-9 * q;

	return fabs(u->duty_hot - q) > tol || fabs(u->duty_cold - q) > tol;
}

static void
note_balance(FILE *fp, const hl_size_row *row)
{
	const hl_unit_spec *u = row->unit;
	char hot[48] = "", cold[48] = "";

	if (!balance_differs(row))
		return;
	if (!isnan(u->duty_hot))
		snprintf(hot, sizeof hot, " hot side %.*f %s", HL_DIG_Q(1),
		    hl_show_q(u->duty_hot), HL_SYM_Q);
	if (!isnan(u->duty_cold))
		snprintf(cold, sizeof cold, "%s cold side %.*f %s",
		    hot[0] ? "," : "", HL_DIG_Q(1), hl_show_q(u->duty_cold),
		    HL_SYM_Q);
	note(fp, row, "heat balance:%s%s; sized for %.*f %s", hot, cold,
	    HL_DIG_Q(1), hl_show_q(row->spec.duty), HL_SYM_Q);
}

static void
note_h(FILE *fp, const hl_size_row *row, const hl_settings *d)
{
	if (!(row->assumed & (HL_ASSUMED_H_HOT | HL_ASSUMED_H_COLD)))
		return;
	note(fp, row, "no %s given: assumed %g %s",
	    (row->assumed & HL_ASSUMED_H_HOT) ? "h_hot" : "h_cold",
	    hl_show_h(d->h_default), HL_SYM_H);
}

/* An implausible U or shell size (hl_exchanger_warning). */
static void
note_warn(FILE *fp, const hl_size_row *row)
{
	char why[300];

	if (row->status != HL_OK || row->size.warn == 0)
		return;
	hl_exchanger_warning(&row->spec, &row->size, why, sizeof why);
	note(fp, row, "CHECK: %s", why);
}

static int
has_note(const hl_size_row *row)
{
	return row->status != HL_OK || row_cross(row) ||
	    (row->status == HL_OK && row->size.warn != 0) ||
	    (row->assumed & (HL_ASSUMED_H_HOT | HL_ASSUMED_H_COLD)) ||
	    balance_differs(row);
}

static void
text_notes(FILE *fp, const hl_size_result *r)
{
	const hl_size_row *row;
	size_t i;
	int any = 0;

	for (i = 0; i < r->n; i++) {
		row = &r->row[i];
		if (!has_note(row))
			continue;
		if (!any)
			fprintf(fp, "\nNotes\n");
		any = 1;
		if (row->status != HL_OK)
			note(fp, row, "NOT SIZED: %s", row->note);
		note_cross(fp, row);
		note_warn(fp, row);
		note_balance(fp, row);
		note_h(fp, row, r->defaults);
	}
}

static unsigned
assumed_all(const hl_size_result *r)
{
	unsigned a = 0;
	size_t i;

	for (i = 0; i < r->n; i++)
		a |= r->row[i].assumed;
	return a;
}

/* The illustrative law of each type a row took by default. */
static void
text_laws(FILE *fp, const hl_size_result *r)
{
	char buf[300];
	unsigned done = 0;
	size_t i;

	for (i = 0; i < r->n; i++) {
		const hl_size_row *row = &r->row[i];

		if (!(row->assumed & HL_ASSUMED_COST) ||
		    (done & (1u << row->spec.type)))
			continue;
		done |= 1u << row->spec.type;
		hl_exchanger_law_text(r->defaults, row->spec.type, buf,
		    sizeof buf);
		hl_text_wrap(fp, buf, "  cost ", "    ", NOTE_WIDTH);
	}
	hl_text_wrap(fp, "(give your own: columns cost_a, cost_b, cost_c; "
	    "--cost-a, --cost-b, --cost-c)", "  ", "    ", NOTE_WIDTH);
}

static void
text_assumed(FILE *fp, const hl_size_result *r)
{
	const hl_settings *d = r->defaults;
	unsigned a = assumed_all(r);
	char buf[256];

	if (a == 0)
		return;
	fprintf(fp, "\n* assumed: built-in defaults (set them per row or on "
	    "the command line)\n");
	if (a & HL_ASSUMED_TYPE)
		hl_text_wrap(fp, "type shell-and-tube (column type, --type)", "  ",
		    "    ", NOTE_WIDTH);
	if (a & (HL_ASSUMED_FMIN | HL_ASSUMED_XP)) {
		snprintf(buf, sizeof buf, "shells: F floor %.2f, each shell's "
		    "P at most %g of its maximum (columns fmin, xp; --fmin, "
		    "--xp)", d->fmin, d->xp);
		hl_text_wrap(fp, buf, "  ", "    ", NOTE_WIDTH);
	}
	if (a & HL_ASSUMED_COST)
		text_laws(fp, r);
	if (a & HL_ASSUMED_LARGEST)
		hl_text_wrap(fp, "largest shell: the type's illustrative default "
		    "(column largest, --largest); beyond it shells go in "
		    "parallel (s×p: s in series, p trains in parallel)", "  ",
		    "    ", NOTE_WIDTH);
	if (a & (HL_ASSUMED_H_HOT | HL_ASSUMED_H_COLD)) {
		snprintf(buf, sizeof buf, "U from one given film coefficient "
		    "and %g kW/(m²·K) for the other (see the notes)",
		    d->h_default);
		hl_text_wrap(fp, buf, "  ", "    ", NOTE_WIDTH);
	}
}

static const char legend[] =
"\nS&T: shell-and-tube, 1 shell pass and 2, 4, … tube passes per shell,\n"
"shells in series; CF: pure counterflow (F = 1); PL: plate (F = 1); DP:\n"
"double pipe, hairpins in series (F = 1); AC: air cooler, crossflow with\n"
"both fluids unmixed, sections in series; FH: fired heater, sized and\n"
"costed by duty (Q in MW). s×p: s in series, p trains in parallel where\n"
"one shell would pass the largest. CHECK: an implausible U or shell size\n"
"(see the notes). P = (t2 − t1)/(T1 − t1),\n"
"R = (T1 − T2)/(t2 − t1), hot side T, cold side t. F: LMTD correction of\n"
"Bowman, Mueller & Nagle (1940); shells: the fewest with F at or above the\n"
"floor and each shell's P within Xp of its maximum (Ahmad, Linnhoff & Smith\n"
"1988). Area = duty/(U·F·LMTD), equal over the shells; cost a + b·X^c per\n"
"shell (X its area, or a fired heater's duty), in the law's currency.\n";

void
hl_size_text(FILE *fp, const hl_size_result *r)
{
	fprintf(fp, "Exchanger sizing: %s\n\n", r->source ? r->source : "");
	text_table(fp, r);
	text_totals(fp, r);
	text_notes(fp, r);
	text_assumed(fp, r);
	fputs(legend, fp);
	/* The caution comes with its own line breaks. */
	if (r->caution != NULL)
		fprintf(fp, "\n%s\n", r->caution);
}

/* "type fmin …": the attributes whose values were assumed. */
static void
assumed_list(unsigned a, int shell_tube, char *buf, size_t size)
{
	static const struct {
		unsigned bit;
		const char *name;
	} names[] = {
		{ HL_ASSUMED_TYPE, "type" }, { HL_ASSUMED_FMIN, "fmin" },
		{ HL_ASSUMED_XP, "xp" }, { HL_ASSUMED_COST, "cost" },
		{ HL_ASSUMED_H_HOT, "h-hot" }, { HL_ASSUMED_H_COLD, "h-cold" },
		{ HL_ASSUMED_LARGEST, "largest" }
	};
	size_t i;

	buf[0] = '\0';
	if (!shell_tube)
		a &= ~(unsigned)(HL_ASSUMED_FMIN | HL_ASSUMED_XP);
	for (i = 0; i < sizeof names / sizeof names[0]; i++)
		if (a & names[i].bit) {
			strncat(buf, buf[0] ? " " : "", size - strlen(buf) - 1);
			strncat(buf, names[i].name, size - strlen(buf) - 1);
		}
}

static int
xml_terminals(xmlTextWriterPtr w, const hl_size_row *row)
{
	const hl_exchanger_spec *s = &row->spec;
	int rc = 0;

	rc |= hl_xml_num(w, "duty", s->duty);
	rc |= hl_xml_num(w, "hot-in", s->hot_in);
	rc |= hl_xml_num(w, "hot-out", s->hot_out);
	rc |= hl_xml_num(w, "cold-in", s->cold_in);
	rc |= hl_xml_num(w, "cold-out", s->cold_out);
	rc |= hl_xml_num(w, "hot-share", 1.0);
	rc |= hl_xml_num(w, "cold-share", 1.0);
	rc |= hl_xml_num(w, "u", s->u);
	if (!isnan(row->h_hot))
		rc |= hl_xml_num(w, "h-hot", row->h_hot);
	if (!isnan(row->h_cold))
		rc |= hl_xml_num(w, "h-cold", row->h_cold);
	return rc;
}

static int
xml_sizing(xmlTextWriterPtr w, const hl_size_row *row)
{
	const hl_exchanger_spec *s = &row->spec;
	const hl_exchanger_sizing *z = &row->size;
	int rc = 0;

	rc |= hl_xml_num(w, "lmtd", z->lmtd);
	rc |= hl_xml_num(w, "p", z->p);
	if (!isinf(z->r))
		rc |= hl_xml_num(w, "r", z->r);
	if (row->status == HL_OK) {
		rc |= hl_xml_num(w, "ft", z->f);
		rc |= hl_xml_int(w, "shells", z->shells);
		if (z->parallel > 1)
			rc |= hl_xml_int(w, "parallel", z->parallel);
		rc |= hl_xml_num(w, "area", z->area);
		rc |= hl_xml_num(w, "area-shell", z->area_shell);
		rc |= hl_xml_num(w, "cost", z->cost);
		if (z->warn != 0) {
			char why[300];

			hl_exchanger_warning(s, z, why, sizeof why);
			rc |= hl_xml_str(w, "warning", why);
		}
	}
	if (s->type == HL_EXCH_SHELL_TUBE) {
		rc |= hl_xml_num(w, "fmin", s->fmin);
		rc |= hl_xml_num(w, "xp", s->xp);
	}
	rc |= hl_xml_num(w, "cost-a", s->cost_a);
	rc |= hl_xml_num(w, "cost-b", s->cost_b);
	rc |= hl_xml_num(w, "cost-c", s->cost_c);
	if (isfinite(s->largest) && s->largest > 0.0)
		rc |= hl_xml_num(w, "largest", s->largest);
	rc |= hl_xml_num(w, "smallest", s->smallest);
	return rc;
}

static int
xml_row(xmlTextWriterPtr w, const hl_size_row *row)
{
	char assumed[96];
	int rc = 0;

	rc |= xmlTextWriterStartElement(w, BAD_CAST "exchanger");
	rc |= hl_xml_str(w, "id", row->unit->name);
	rc |= hl_xml_int(w, "line", row->unit->line);
	rc |= hl_xml_str(w, "type", hl_exchanger_type_name(row->spec.type));
	rc |= xml_terminals(w, row);
	rc |= xml_sizing(w, row);
	rc |= hl_xml_str(w, "status", row->status == HL_OK ? "sized" :
	    "too-many-shells");
	assumed_list(row->assumed, row->spec.type == HL_EXCH_SHELL_TUBE,
	    assumed, sizeof assumed);
	if (assumed[0] != '\0')
		rc |= hl_xml_str(w, "assumed", assumed);
	if (row->status != HL_OK)
		rc |= hl_xml_str(w, "note", row->note);
	rc |= xmlTextWriterEndElement(w);
	return rc;
}

int
hl_size_xml(xmlTextWriterPtr w, const hl_size_result *r)
{
	size_t i, sized = 0;
	int rc = 0;

	for (i = 0; i < r->n; i++)
		sized += r->row[i].status == HL_OK;
	rc |= xmlTextWriterStartElement(w, BAD_CAST "units");
	rc |= hl_xml_int(w, "count", (long)r->n);
	rc |= hl_xml_int(w, "sized", (long)sized);
	for (i = 0; i < r->n && rc >= 0; i++)
		rc |= xml_row(w, &r->row[i]);
	rc |= xmlTextWriterEndElement(w);
	return rc < 0 ? -1 : 0;
}

static void
csv_row(FILE *fp, const hl_size_row *row)
{
	const hl_exchanger_spec *s = &row->spec;
	const hl_exchanger_sizing *z = &row->size;
	int ok = row->status == HL_OK;
	char assumed[96], why[300] = "";

	hl_csv_text(fp, row->unit->name);
	fprintf(fp, ",%ld,%s", row->unit->line, hl_exchanger_type_name(s->type));
	hl_csv_num(fp, hl_show_q(s->duty));
	hl_csv_num(fp, hl_show_t(s->hot_in));
	hl_csv_num(fp, hl_show_t(s->hot_out));
	hl_csv_num(fp, hl_show_t(s->cold_in));
	hl_csv_num(fp, hl_show_t(s->cold_out));
	hl_csv_num(fp, hl_show_h(s->u));
	hl_csv_num(fp, hl_show_dt(z->lmtd));
	hl_csv_num(fp, z->p);
	hl_csv_num(fp, z->r);
	hl_csv_num(fp, ok ? z->f : NAN);
	hl_csv_num(fp, ok ? z->shells : NAN);
	hl_csv_num(fp, ok ? z->parallel : NAN);
	hl_csv_num(fp, ok ? hl_show_a(z->area) : NAN);
	hl_csv_num(fp, ok ? hl_show_a(z->area_shell) : NAN);
	hl_csv_num(fp, ok ? z->cost : NAN);
	fprintf(fp, ",%s,%d,", ok ? "sized" : "too-many-shells",
	    row_cross(row));
	assumed_list(row->assumed, s->type == HL_EXCH_SHELL_TUBE, assumed,
	    sizeof assumed);
	fputs(assumed, fp);
	fputc(',', fp);
	if (ok && z->warn != 0)
		hl_exchanger_warning(s, z, why, sizeof why);
	hl_csv_text(fp, ok ? why : row->note);
	fputc('\n', fp);
}

void
hl_size_csv(FILE *fp, const hl_size_result *r)
{
	static const char *const name[] = { "duty", "hot_in", "hot_out",
		"cold_in", "cold_out", "u", "lmtd" };
	static const hl_qty qty[] = { HL_QTY_POWER, HL_QTY_TEMP, HL_QTY_TEMP,
		HL_QTY_TEMP, HL_QTY_TEMP, HL_QTY_HTC, HL_QTY_DTEMP };
	char h[2][64];
	size_t i;

	fprintf(fp, "name,line,type,");
	for (i = 0; i < sizeof qty / sizeof qty[0]; i++)
		fprintf(fp, "%s,", hl_show_header(h[0], sizeof h[0], name[i],
						  qty[i]));
	fprintf(fp, "p,r,f,shells,parallel,%s,%s,cost,status,cross,assumed,note\n",
	    hl_show_header(h[0], sizeof h[0], "area", HL_QTY_AREA),
	    hl_show_header(h[1], sizeof h[1], "area_shell", HL_QTY_AREA));
	for (i = 0; i < r->n; i++)
		csv_row(fp, &r->row[i]);
}
