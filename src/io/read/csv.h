/* csv.h - an RFC 4180 record reader with the tolerances plant data needs.
 *
 * Reads a whole file (or a memory buffer) and hands out one record at a time
 * with the line it started on. Tolerated: a UTF-8 byte-order mark, CRLF or LF
 * line ends, blank lines, lines whose first character is '#' (comments),
 * leading and trailing blanks around unquoted fields. A file whose header line
 * holds semicolons and no commas is read as semicolon-separated with decimal
 * commas (a common spreadsheet export in Europe): hl_csv_decimal_comma() tells.
 * Refused with a message: a file that is not text (NUL bytes, invalid UTF-8),
 * an unterminated quote, text after a closing quote, a field longer than
 * HL_CSV_FIELD_MAX.
 *
 * Ownership: fields returned by hl_csv_field() belong to the reader and stay
 * valid until the next hl_csv_next() call.
 */
#ifndef HL_CSV_H
#define HL_CSV_H

#include <stddef.h>

#include "status.h"

#define HL_CSV_FIELD_MAX 4096
#define HL_CSV_FILE_MAX ((size_t)1 << 31)

typedef struct hl_csv hl_csv;

/* Read the file at path; err names path on failure (HL_EIO or HL_EINPUT). */
hl_status hl_csv_open(const char *path, hl_csv **out, hl_error *err);
/* Read from a buffer (copied); name is used in messages. */
hl_status hl_csv_open_mem(const char *name, const char *data, size_t len,
			  hl_csv **out, hl_error *err);
void hl_csv_free(hl_csv *r);

/* Advance to the next record: 1 when there is one, 0 at the end, -1 on an
 * error (filled into err). */
int hl_csv_next(hl_csv *r, hl_error *err);

size_t hl_csv_nfields(const hl_csv *r);
const char *hl_csv_field(const hl_csv *r, size_t i); /* "" past the end */
long hl_csv_line(const hl_csv *r);                   /* line of the record */
const char *hl_csv_name(const hl_csv *r);
int hl_csv_decimal_comma(const hl_csv *r);

#endif
