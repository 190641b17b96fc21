/* text_out.h - the pieces every text and CSV writer shares: names padded
 * to a column in characters, and CSV fields as RFC 4180 and our own reader
 * (csv.h: '#' starts a comment, blanks around a field are trimmed) take
 * them back. */
#ifndef HL_TEXT_OUT_H
#define HL_TEXT_OUT_H

#include <stddef.h>
#include <stdio.h>

/* s padded with spaces to w characters; a longer s is cut to w. */
void hl_text_pad(FILE *fp, const char *s, int w);

/* s broken at blanks (spaces and line breaks) into lines of at most width
 * characters, the first led by first, the others by next; a word longer
 * than a line stands alone on its line. Ends with a line break. */
void hl_text_wrap(FILE *fp, const char *s, const char *first,
		  const char *next, size_t width);

/* A CSV text field (no comma before it), quoted when it holds a comma, a
 * quote or a line break, or starts with '#' or a blank or ends with one. */
void hl_csv_text(FILE *fp, const char *s);
/* A comma, then v (result_xml.h's hl_format_number); nothing after the
 * comma for NaN or an infinity. */
void hl_csv_num(FILE *fp, double v);
/* The same, but an infinity is written ("inf", "-inf"): for values where
 * an infinite answer means something (sensitivity.h). */
void hl_csv_value(FILE *fp, double v);

#endif
