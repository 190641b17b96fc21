/* csv.c - RFC 4180 records with file and line for every message. */
#include <errno.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "csv.h"

struct hl_csv {
	char *name;
	char *buf;      /* the whole input, NUL-terminated */
	size_t len;
	size_t pos;
	long line;      /* line of the next unread character */
	long rec_line;  /* line where the current record started */
	char sep;
	int decimal_comma;
	/* current record: fields stored back to back in text */
	char *text;
	size_t text_len, text_cap;
	size_t *off;
	size_t nfield, field_cap;
};

/* Reject what cannot be a text table: NUL bytes and invalid UTF-8. */
static int
is_text(const unsigned char *p, size_t n, size_t *bad)
{
	size_t i = 0, k, need;

	while (i < n) {
		unsigned char c = p[i];

		if (c == 0) {
			*bad = i;
			return 0;
		}
		if (c < 0x80) {
			i++;
			continue;
		}
		if (c >= 0xc2 && c <= 0xdf)
			need = 1;
		else if (c >= 0xe0 && c <= 0xef)
			need = 2;
		else if (c >= 0xf0 && c <= 0xf4)
			need = 3;
		else {
			*bad = i;
			return 0;
		}
		for (k = 1; k <= need; k++) {
			if (i + k >= n || (p[i + k] & 0xc0) != 0x80) {
				*bad = i;
				return 0;
			}
		}
		i += need + 1;
	}
	return 1;
}

static long
line_of(const char *buf, size_t off)
{
	long line = 1;
	size_t i;

	for (i = 0; i < off; i++)
		if (buf[i] == '\n')
			line++;
	return line;
}

/* Choose the separator from the first non-comment line. */
static void
detect_separator(hl_csv *r)
{
	size_t i = r->pos;
	int commas = 0, semis = 0;

	while (i < r->len) {
		size_t start = i;

		while (i < r->len && r->buf[i] != '\n')
			i++;
		if (r->buf[start] == '#' || i == start ||
		    (i == start + 1 && r->buf[start] == '\r')) {
			i++;
			continue;
		}
		for (size_t k = start; k < i; k++) {
			commas += r->buf[k] == ',';
			semis += r->buf[k] == ';';
		}
		break;
	}
	r->sep = (semis > 0 && commas == 0) ? ';' : ',';
	r->decimal_comma = r->sep == ';';
}

/* The reader over buf (len bytes plus a NUL), which it takes over. */
static hl_status
open_owned(const char *name, char *buf, size_t len, hl_csv **out,
	   hl_error *err);

hl_status
hl_csv_open_mem(const char *name, const char *data, size_t len, hl_csv **out,
		hl_error *err)
{
	char *buf;

	*out = NULL;
	if (len > HL_CSV_FILE_MAX)
		return hl_error_set(err, HL_EINPUT, name, 0,
			"file is larger than %zu bytes; split the table",
			HL_CSV_FILE_MAX);
	buf = malloc(len + 1);
	if (buf == NULL)
		return hl_error_nomem(err);
	memcpy(buf, data, len);
	buf[len] = '\0';
	return open_owned(name, buf, len, out, err);
}

static hl_status
open_owned(const char *name, char *buf, size_t len, hl_csv **out,
	   hl_error *err)
{
	hl_csv *r;
	size_t bad;

	*out = NULL;
	r = calloc(1, sizeof *r);
	if (r == NULL) {
		free(buf);
		return hl_error_nomem(err);
	}
	r->buf = buf;
	r->name = strdup(name);
	if (r->name == NULL) {
		hl_csv_free(r);
		return hl_error_nomem(err);
	}
	r->len = len;
	r->line = 1;
	if (len >= 3 && memcmp(r->buf, "\xef\xbb\xbf", 3) == 0)
		r->pos = 3;
	if (!is_text((const unsigned char *)r->buf, len, &bad)) {
		hl_error_set(err, HL_EINPUT, name, line_of(r->buf, bad),
			"not a text file (a NUL byte or invalid UTF-8); save "
			"the table as CSV text in UTF-8");
		hl_csv_free(r);
		return HL_EINPUT;
	}
	detect_separator(r);
	*out = r;
	return HL_OK;
}

hl_status
hl_csv_open(const char *path, hl_csv **out, hl_error *err)
{
	FILE *f;
	char *data = NULL;
	size_t len = 0, cap = 0, n;

	*out = NULL;
	f = fopen(path, "rb");
	if (f == NULL)
		return hl_error_set(err, errno == ENOENT ? HL_EINPUT : HL_EIO,
			path, 0, "cannot open: %s", strerror(errno));
	for (;;) {
		if (len + 65536 > cap) {
			char *p;

			cap = cap ? cap * 2 : 65536 * 2;
			if (cap > HL_CSV_FILE_MAX + 65536 * 2) {
				free(data);
				fclose(f);
				return hl_error_set(err, HL_EINPUT, path, 0,
					"file is larger than %zu bytes; split "
					"the table", HL_CSV_FILE_MAX);
			}
			p = realloc(data, cap);
			if (p == NULL) {
				free(data);
				fclose(f);
				return hl_error_nomem(err);
			}
			data = p;
		}
		n = fread(data + len, 1, cap - len, f);
		len += n;
		if (n == 0)
			break;
	}
	if (ferror(f)) {
		free(data);
		fclose(f);
		return hl_error_set(err, HL_EIO, path, 0, "read error");
	}
	fclose(f);
	if (data == NULL && (data = malloc(1)) == NULL)
		return hl_error_nomem(err);
	data[len] = '\0';
	return open_owned(path, data, len, out, err);
}

void
hl_csv_free(hl_csv *r)
{
	if (r == NULL)
		return;
	free(r->name);
	free(r->buf);
	free(r->text);
	free(r->off);
	free(r);
}

static int
push_char(hl_csv *r, char c)
{
	if (r->text_len + 1 >= r->text_cap) {
		size_t ncap = r->text_cap ? r->text_cap * 2 : 256;
		char *p = realloc(r->text, ncap);

		if (p == NULL)
			return 0;
		r->text = p;
		r->text_cap = ncap;
	}
	r->text[r->text_len++] = c;
	return 1;
}

static int
start_field(hl_csv *r)
{
	if (r->nfield == r->field_cap) {
		size_t ncap = r->field_cap ? r->field_cap * 2 : 16;
		size_t *o = realloc(r->off, ncap * sizeof *o);

		if (o == NULL)
			return 0;
		r->off = o;
		r->field_cap = ncap;
	}
	r->off[r->nfield] = r->text_len;
	r->nfield++;
	return 1;
}

/* Trim blanks at the end of the current (unquoted) field. */
static void
trim_field_end(hl_csv *r)
{
	size_t start = r->off[r->nfield - 1];

	while (r->text_len > start && (r->text[r->text_len - 1] == ' ' ||
	       r->text[r->text_len - 1] == '\t'))
		r->text_len--;
}

static int
at_line_end(const hl_csv *r)
{
	return r->pos >= r->len || r->buf[r->pos] == '\n' ||
	       (r->buf[r->pos] == '\r' &&
		(r->pos + 1 >= r->len || r->buf[r->pos + 1] == '\n'));
}

/* Skip blank and comment lines; return 0 at end of input. */
static int
skip_ignorable(hl_csv *r)
{
	for (;;) {
		size_t i = r->pos;

		if (r->pos >= r->len)
			return 0;
		if (r->buf[i] == '#') {
			while (i < r->len && r->buf[i] != '\n')
				i++;
		} else {
			/* Stop at the first character that makes it a row. */
			while (i < r->len && r->buf[i] != '\n') {
				if (r->buf[i] != ' ' && r->buf[i] != '\t' &&
				    r->buf[i] != '\r' && r->buf[i] != r->sep)
					return 1;
				i++;
			}
		}
		r->pos = i < r->len ? i + 1 : i;
		r->line++;
	}
}

/* Read a quoted field body; r->pos is just after the opening quote. */
static int
read_quoted(hl_csv *r, hl_error *err)
{
	long start_line = r->line;

	for (;;) {
		char c;

		if (r->pos >= r->len) {
			hl_error_set(err, HL_EINPUT, r->name, start_line,
				"quoted field is never closed; add the "
				"closing '\"'");
			return -1;
		}
		c = r->buf[r->pos++];
		if (c == '"') {
			if (r->pos < r->len && r->buf[r->pos] == '"') {
				r->pos++;
			} else {
				break;
			}
		}
		if (c == '\n')
			r->line++;
		if (r->text_len - r->off[r->nfield - 1] >= HL_CSV_FIELD_MAX) {
			hl_error_set(err, HL_EINPUT, r->name, start_line,
				"field longer than %d characters",
				HL_CSV_FIELD_MAX);
			return -1;
		}
		if (!push_char(r, c)) {
			hl_error_nomem(err);
			return -1;
		}
	}
	while (r->pos < r->len && (r->buf[r->pos] == ' ' ||
	       r->buf[r->pos] == '\t'))
		r->pos++;
	if (!at_line_end(r) && r->buf[r->pos] != r->sep) {
		hl_error_set(err, HL_EINPUT, r->name, r->line,
			"text after a closing quote; quote the whole field "
			"and double any '\"' inside it");
		return -1;
	}
	return 0;
}

/* Make room for n more characters of text. */
static int
reserve(hl_csv *r, size_t n)
{
	size_t ncap;
	char *p;

	if (r->text_len + n + 1 <= r->text_cap)
		return 1;
	ncap = r->text_cap ? r->text_cap : 256;
	while (ncap < r->text_len + n + 1)
		ncap *= 2;
	p = realloc(r->text, ncap);
	if (p == NULL)
		return 0;
	r->text = p;
	r->text_cap = ncap;
	return 1;
}

/* Copy an unquoted field in one piece: the common case, worth keeping fast
 * for site-wide tables of 10^6 rows. */
static int
read_unquoted(hl_csv *r, hl_error *err)
{
	size_t start = r->pos, n;
	const char *stop;

	while (r->pos < r->len) {
		char c = r->buf[r->pos];

		if (c == r->sep || c == '\n' || c == '"' ||
		    (c == '\r' && (r->pos + 1 >= r->len ||
				   r->buf[r->pos + 1] == '\n')))
			break;
		r->pos++;
	}
	stop = r->buf + r->pos;
	if (r->pos < r->len && *stop == '"') {
		hl_error_set(err, HL_EINPUT, r->name, r->line,
			"stray '\"' inside an unquoted field; quote the "
			"whole field and double the '\"'");
		return -1;
	}
	n = r->pos - start;
	if (n > HL_CSV_FIELD_MAX) {
		hl_error_set(err, HL_EINPUT, r->name, r->line,
			"field longer than %d characters", HL_CSV_FIELD_MAX);
		return -1;
	}
	if (!reserve(r, n)) {
		hl_error_nomem(err);
		return -1;
	}
	memcpy(r->text + r->text_len, r->buf + start, n);
	r->text_len += n;
	trim_field_end(r);
	return 0;
}

static int
finish_record(hl_csv *r, hl_error *err)
{
	if (r->pos < r->len && r->buf[r->pos] == '\r')
		r->pos++;
	if (r->pos < r->len && r->buf[r->pos] == '\n') {
		r->pos++;
		r->line++;
	}
	/* Each field ends with a NUL in text: the last one here. */
	if (!push_char(r, '\0')) {
		hl_error_nomem(err);
		return -1;
	}
	return 1;
}

int
hl_csv_next(hl_csv *r, hl_error *err)
{
	r->nfield = 0;
	r->text_len = 0;
	if (!skip_ignorable(r))
		return 0;
	r->rec_line = r->line;
	for (;;) {
		while (r->pos < r->len && (r->buf[r->pos] == ' ' ||
		       r->buf[r->pos] == '\t'))
			r->pos++;
		if (r->nfield > 0 && !push_char(r, '\0')) {
			hl_error_nomem(err);
			return -1;
		}
		if (!start_field(r)) {
			hl_error_nomem(err);
			return -1;
		}
		if (r->pos < r->len && r->buf[r->pos] == '"') {
			r->pos++;
			if (read_quoted(r, err) < 0)
				return -1;
		} else if (read_unquoted(r, err) < 0) {
			return -1;
		}
		if (r->pos < r->len && r->buf[r->pos] == r->sep) {
			r->pos++;
			continue;
		}
		return finish_record(r, err);
	}
}

size_t
hl_csv_nfields(const hl_csv *r)
{
	return r->nfield;
}

const char *
hl_csv_field(const hl_csv *r, size_t i)
{
	return i < r->nfield ? r->text + r->off[i] : "";
}

long
hl_csv_line(const hl_csv *r)
{
	return r->rec_line;
}

const char *
hl_csv_name(const hl_csv *r)
{
	return r->name;
}

int
hl_csv_decimal_comma(const hl_csv *r)
{
	return r->decimal_comma;
}
