/* case_load.c - choose the reader by the file's first character. */
#include <errno.h>
#include <stdio.h>
#include <string.h>

#include "case_load.h"
#include "case_xml.h"
#include "tables.h"

/* 1 when the file looks like XML, 0 when not, -1 when it cannot be read. */
static int
looks_like_xml(const char *path, hl_error *err)
{
	FILE *f = fopen(path, "rb");
	unsigned char b[4];
	int c, first = 1;

	if (f == NULL) {
		hl_error_set(err, errno == ENOENT ? HL_EINPUT : HL_EIO, path, 0,
			"cannot open: %s", strerror(errno));
		return -1;
	}
	if (fread(b, 1, 3, f) != 3 || memcmp(b, "\xef\xbb\xbf", 3) != 0)
		rewind(f);
	while ((c = getc(f)) != EOF) {
		if (c == ' ' || c == '\t' || c == '\r' || c == '\n')
			continue;
		first = c;
		break;
	}
	fclose(f);
	return first == '<';
}

hl_status
hl_case_load(const char *path, const char *utilities, hl_case **out,
	     hl_error *err)
{
	hl_case *c;
	hl_status st;
	int xml;

	*out = NULL;
	xml = looks_like_xml(path, err);
	if (xml < 0)
		return err ? err->status : HL_EIO;
	c = hl_case_create();
	if (c == NULL || (c->source = strdup(path)) == NULL) {
		hl_case_free(c);
		return hl_error_nomem(err);
	}
	st = xml ? hl_case_xml_read(c, path, err) :
		   hl_stream_table_read(c, path, err);
	if (st == HL_OK && utilities != NULL)
		st = hl_utility_table_read(c, utilities, err);
	if (st != HL_OK) {
		hl_case_free(c);
		return st;
	}
	*out = c;
	return HL_OK;
}
