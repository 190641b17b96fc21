/* table.c - header mapping and typed cells over the CSV reader. */
#include <math.h>
#include <stdio.h>
#include <string.h>
#include <strings.h>

#include "number.h"
#include "table.h"

/* Split a header cell "supply [°F]" into its name and unit text (NULL when
 * the cell has no bracket); 0 when the brackets are malformed. */
static int
split_header(const char *cell, char *name, size_t nsize, char *unit,
	     size_t usize, const char **unit_out)
{
	const char *open = strchr(cell, '['), *close;
	size_t n;

	*unit_out = NULL;
	if (open == NULL) {
		snprintf(name, nsize, "%s", cell);
		return strchr(cell, ']') == NULL;
	}
	close = strchr(open, ']');
	if (close == NULL || close[1] != '\0' || strchr(open + 1, '[') != NULL)
		return 0;
	n = (size_t)(open - cell);
	while (n > 0 && (cell[n - 1] == ' ' || cell[n - 1] == '\t'))
		n--;
	snprintf(name, nsize, "%.*s", (int)n, cell);
	snprintf(unit, usize, "%.*s", (int)(close - open - 1), open + 1);
	*unit_out = unit;
	return 1;
}

/* The unit of known column k from the text in its brackets. */
static hl_status
header_unit(hl_table *t, size_t i, size_t k, const char *cell,
	    const char *text, hl_error *err)
{
	hl_qty q = t->qty != NULL ? t->qty[k] : HL_QTY_NONE;
	char known[160], cur[sizeof t->currency];
	const hl_measure *m;

	if (q == HL_QTY_NONE)
		return hl_error_set(err, HL_EINPUT, hl_csv_name(t->csv),
			hl_csv_line(t->csv), "column %zu '%.64s': '%s' takes "
			"no unit; remove the brackets", i + 1, cell,
			t->names[k]);
	m = hl_measure_find(q, text, cur, sizeof cur);
	if (m == NULL) {
		hl_measure_list(q, known, sizeof known);
		return hl_error_set(err, HL_EINPUT, hl_csv_name(t->csv),
			hl_csv_line(t->csv), "column %zu '%.64s': unknown unit "
			"'%.32s' for a %s; known%s: %s", i + 1, cell, text,
			hl_measure_what(q), q == HL_QTY_PRICE ?
			" (after a currency word, as in USD/MMBtu)" : "",
			known);
	}
	if (q == HL_QTY_PRICE)
		memcpy(t->currency, cur, sizeof cur);
	t->unit[k] = m;
	return HL_OK;
}

static hl_status
read_header(hl_table *t, const char *what, hl_error *err)
{
	size_t i, k;
	int rc;

	for (k = 0; k < t->nnames; k++)
		t->col[k] = -1;
	rc = hl_csv_next(t->csv, err);
	if (rc < 0)
		return err ? err->status : HL_EINPUT;
	if (rc == 0)
		return hl_error_set(err, HL_EINPUT, hl_csv_name(t->csv), 0,
			"empty %s: expected a header row and at least one "
			"data row", what);
	t->nheader = hl_csv_nfields(t->csv);
	t->header_line = hl_csv_line(t->csv);
	for (i = 0; i < t->nheader; i++) {
		const char *cell = hl_csv_field(t->csv, i), *utext;
		char h[HL_CSV_FIELD_MAX + 1], ubuf[HL_CSV_FIELD_MAX + 1];

		if (!split_header(cell, h, sizeof h, ubuf, sizeof ubuf, &utext))
			return hl_error_set(err, HL_EINPUT,
				hl_csv_name(t->csv), hl_csv_line(t->csv),
				"column %zu '%.64s': write a unit as "
				"'name [unit]', one pair of brackets at the "
				"end", i + 1, cell);

		for (k = 0; k < t->nnames; k++)
			if (strcasecmp(h, t->names[k]) == 0)
				break;
		if (k == t->nnames) {
			char known[512] = "";

			for (k = 0; k < t->nnames; k++) {
				strncat(known, k ? ", " : "",
					sizeof known - strlen(known) - 1);
				strncat(known, t->names[k],
					sizeof known - strlen(known) - 1);
			}
			return hl_error_set(err, HL_EINPUT,
				hl_csv_name(t->csv), hl_csv_line(t->csv),
				"unknown column '%.64s' in the %s; known "
				"columns: %s", h, what, known);
		}
		if (t->col[k] >= 0)
			return hl_error_set(err, HL_EINPUT,
				hl_csv_name(t->csv), hl_csv_line(t->csv),
				"column '%s' appears twice in the header",
				t->names[k]);
		t->col[k] = (long)i;
		if (utext != NULL) {
			hl_status st = header_unit(t, i, k, cell, utext, err);

			if (st != HL_OK)
				return st;
		}
	}
	return HL_OK;
}

static hl_status
open_common(hl_table *t, const char *what, const char *const *names,
	    const hl_qty *qty, size_t nnames, hl_error *err)
{
	hl_status st;

	t->names = names;
	t->qty = qty;
	t->what = what;
	t->nnames = nnames < 32 ? nnames : 32;
	st = read_header(t, what, err);
	if (st != HL_OK) {
		hl_csv_free(t->csv);
		t->csv = NULL;
	}
	return st;
}

hl_status
hl_table_open(hl_table *t, const char *path, const char *what,
	      const char *const *names, const hl_qty *qty, size_t nnames,
	      hl_error *err)
{
	hl_status st;

	memset(t, 0, sizeof *t);
	st = hl_csv_open(path, &t->csv, err);
	if (st != HL_OK)
		return st;
	return open_common(t, what, names, qty, nnames, err);
}

hl_status
hl_table_open_mem(hl_table *t, const char *name, const char *data, size_t len,
		  const char *what, const char *const *names, const hl_qty *qty,
		  size_t nnames, hl_error *err)
{
	hl_status st;

	memset(t, 0, sizeof *t);
	st = hl_csv_open_mem(name, data, len, &t->csv, err);
	if (st != HL_OK)
		return st;
	return open_common(t, what, names, qty, nnames, err);
}

void
hl_table_close(hl_table *t)
{
	hl_csv_free(t->csv);
	t->csv = NULL;
}

int
hl_table_next(hl_table *t, hl_error *err)
{
	int rc = hl_csv_next(t->csv, err);
	size_t n;

	if (rc <= 0)
		return rc;
	n = hl_csv_nfields(t->csv);
	if (n != t->nheader) {
		hl_error_set(err, HL_EINPUT, hl_csv_name(t->csv),
			hl_csv_line(t->csv), "row has %zu fields but the header "
			"has %zu%s", n, t->nheader,
			n > t->nheader && !hl_csv_decimal_comma(t->csv) ?
			"; a decimal comma? write numbers with a point "
			"(1.5, not 1,5)" : "");
		return -1;
	}
	return 1;
}

int
hl_table_has(const hl_table *t, size_t k)
{
	return k < t->nnames && t->col[k] >= 0;
}

const char *
hl_table_text(const hl_table *t, size_t k)
{
	if (!hl_table_has(t, k))
		return "";
	return hl_csv_field(t->csv, (size_t)t->col[k]);
}

int
hl_table_empty(const hl_table *t, size_t k)
{
	return hl_table_text(t, k)[0] == '\0';
}

long
hl_table_line(const hl_table *t)
{
	return hl_csv_line(t->csv);
}

const char *
hl_table_file(const hl_table *t)
{
	return hl_csv_name(t->csv);
}

hl_status
hl_table_number(const hl_table *t, size_t k, double *out, hl_error *err)
{
	const char *s = hl_table_text(t, k);
	int dc = hl_csv_decimal_comma(t->csv);

	*out = NAN;
	if (s[0] == '\0')
		return HL_OK;
	if (hl_parse_number(s, dc, out)) {
		if (k < t->nnames && t->unit[k] != NULL)
			*out = hl_measure_to_canonical(t->unit[k], *out);
		return HL_OK;
	}
	if (!dc && strchr(s, ',') != NULL && hl_parse_number(s, 1, out))
		return hl_error_set(err, HL_EINPUT, hl_table_file(t),
			hl_table_line(t), "column '%s': '%.40s' has a decimal "
			"comma; write numbers with a point (1.5, not 1,5)",
			t->names[k], s);
	return hl_error_set(err, HL_EINPUT, hl_table_file(t), hl_table_line(t),
		"column '%s': '%.40s' is not a number; give a plain decimal "
		"value in the column's unit, without the unit", t->names[k], s);
}

const hl_measure *
hl_table_unit(const hl_table *t, size_t k)
{
	return k < t->nnames ? t->unit[k] : NULL;
}

hl_status
hl_table_require(const hl_table *t, size_t k, hl_error *err)
{
	if (hl_table_has(t, k))
		return HL_OK;
	return hl_error_set(err, HL_EINPUT, hl_table_file(t), t->header_line,
		"missing column '%s' in the %s header", t->names[k], t->what);
}
