/* table.c - header mapping and typed cells over the CSV reader. */
#include <math.h>
#include <string.h>
#include <strings.h>

#include "number.h"
#include "table.h"

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
		const char *h = hl_csv_field(t->csv, i);

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
	}
	return HL_OK;
}

static hl_status
open_common(hl_table *t, const char *what, const char *const *names,
	    size_t nnames, hl_error *err)
{
	hl_status st;

	t->names = names;
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
	      const char *const *names, size_t nnames, hl_error *err)
{
	hl_status st;

	memset(t, 0, sizeof *t);
	st = hl_csv_open(path, &t->csv, err);
	if (st != HL_OK)
		return st;
	return open_common(t, what, names, nnames, err);
}

hl_status
hl_table_open_mem(hl_table *t, const char *name, const char *data, size_t len,
		  const char *what, const char *const *names, size_t nnames,
		  hl_error *err)
{
	hl_status st;

	memset(t, 0, sizeof *t);
	st = hl_csv_open_mem(name, data, len, &t->csv, err);
	if (st != HL_OK)
		return st;
	return open_common(t, what, names, nnames, err);
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
	if (hl_parse_number(s, dc, out))
		return HL_OK;
	if (!dc && strchr(s, ',') != NULL && hl_parse_number(s, 1, out))
		return hl_error_set(err, HL_EINPUT, hl_table_file(t),
			hl_table_line(t), "column '%s': '%.40s' has a decimal "
			"comma; write numbers with a point (1.5, not 1,5)",
			t->names[k], s);
	return hl_error_set(err, HL_EINPUT, hl_table_file(t), hl_table_line(t),
		"column '%s': '%.40s' is not a number; give a plain decimal "
		"value in the column's unit, without the unit", t->names[k], s);
}

hl_status
hl_table_require(const hl_table *t, size_t k, hl_error *err)
{
	if (hl_table_has(t, k))
		return HL_OK;
	return hl_error_set(err, HL_EINPUT, hl_table_file(t), t->header_line,
		"missing column '%s' in the %s header", t->names[k], t->what);
}
