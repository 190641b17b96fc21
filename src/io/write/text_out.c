/* text_out.c - shared pieces of the text and CSV writers (text_out.h). */
#include <math.h>
#include <string.h>

#include "result_xml.h"
#include "text_out.h"
#include "utf8.h"

void
hl_text_pad(FILE *fp, const char *s, int w)
{
	int n = 0;

	for (; *s && (n < w || HL_UTF8_CONT(*s)); s++) {
		n += !HL_UTF8_CONT(*s);
		fputc(*s, fp);
	}
	for (; n < w; n++)
		fputc(' ', fp);
}

void
hl_text_wrap(FILE *fp, const char *s, const char *first, const char *next,
	     size_t width)
{
	const char *lead = first;
	size_t col = 0, n, w;

	for (;;) {
		s += strspn(s, " \n");
		if (*s == '\0')
			break;
		n = strcspn(s, " \n");
		w = hl_utf8_chars_n(s, n);
		if (col > 0 && col + 1 + w > width) {
			fputc('\n', fp);
			col = 0;
			lead = next;
		}
		if (col == 0) {
			fputs(lead, fp);
			col = hl_utf8_chars(lead);
		} else {
			fputc(' ', fp);
			col++;
		}
		fwrite(s, 1, n, fp);
		col += w;
		s += n;
	}
	fputc('\n', fp);
}

void
hl_csv_text(FILE *fp, const char *s)
{
	const char *p;

	if (strpbrk(s, ",\"\r\n") == NULL && s[0] != ' ' && s[0] != '#' &&
	    (s[0] == '\0' || s[strlen(s) - 1] != ' ')) {
		fputs(s, fp);
		return;
	}
	fputc('"', fp);
	for (p = s; *p != '\0'; p++) {
		if (*p == '"')
			fputc('"', fp);
		fputc(*p, fp);
	}
	fputc('"', fp);
}

void
hl_csv_value(FILE *fp, double v)
{
	char b[64];

	fputc(',', fp);
	if (isnan(v))
		return;
	hl_format_number(b, sizeof b, v);
	fputs(b, fp);
}

void
hl_csv_num(FILE *fp, double v)
{
	if (isfinite(v))
		hl_csv_value(fp, v);
	else
		fputc(',', fp);
}
