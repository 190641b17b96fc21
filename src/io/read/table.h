/* table.h - a CSV table with a header row of known column names.
 *
 * Column names are matched case-insensitively after trimming; their order is
 * free. An unknown column, a repeated column, or a row whose field count
 * differs from the header's is an error naming the file and line.
 *
 * A header cell may carry its unit in brackets, "supply [°F]", when the
 * reader gives the column a quantity (measure.h); hl_table_number() then
 * hands back values in the canonical unit. A unit the quantity does not know,
 * or a unit on a column that takes none, is an error naming the file, the
 * header line and the column.
 */
#ifndef HL_TABLE_H
#define HL_TABLE_H

#include <stddef.h>

#include "csv.h"
#include "measure.h"
#include "status.h"

typedef struct {
	hl_csv *csv;
	const char *const *names; /* the known columns */
	size_t nnames;
	long col[32];             /* file column of each known name, -1 absent */
	size_t nheader;           /* fields in the header row */
	long header_line;
	const char *what;         /* "stream table", for messages */
	const hl_qty *qty;        /* quantity of each known name, or NULL */
	const hl_measure *unit[32]; /* unit in the header, NULL: none given */
	char currency[32];        /* currency word of a price unit, or "" */
} hl_table;

/* Open path and read its header. `what` names the table in messages
 * ("stream table"); qty (NULL: no column takes a unit) gives the quantity
 * of each of the nnames columns. */
hl_status hl_table_open(hl_table *t, const char *path, const char *what,
			const char *const *names, const hl_qty *qty,
			size_t nnames, hl_error *err);
/* Same over a memory buffer (fuzzing, tests). */
hl_status hl_table_open_mem(hl_table *t, const char *name, const char *data,
			    size_t len, const char *what,
			    const char *const *names, const hl_qty *qty,
			    size_t nnames, hl_error *err);
void hl_table_close(hl_table *t);

/* Next data row: 1, 0 at the end, -1 on error. */
int hl_table_next(hl_table *t, hl_error *err);

int hl_table_has(const hl_table *t, size_t k);          /* column present */
const char *hl_table_text(const hl_table *t, size_t k); /* "" when absent */
int hl_table_empty(const hl_table *t, size_t k);        /* absent or blank */
long hl_table_line(const hl_table *t);
const char *hl_table_file(const hl_table *t);

/* The unit the header gave column k, NULL when none was given. */
const hl_measure *hl_table_unit(const hl_table *t, size_t k);

/* The number in column k, in the canonical unit of its quantity: NaN when the cell is empty or the column absent;
 * an error naming the column when the cell is not a plain number. */
hl_status hl_table_number(const hl_table *t, size_t k, double *out,
			  hl_error *err);

/* Fail unless column k is in the header. */
hl_status hl_table_require(const hl_table *t, size_t k, hl_error *err);

#endif
