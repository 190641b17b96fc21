/* html.h - HTML that is also well-formed XML, written with libxml2.
 *
 * The document is built in memory by an xmlTextWriter, so every element is
 * closed and every attribute and text escaped: the result parses as XML
 * (XHTML) and as HTML. Two HTML rules the XML writer does not know are kept
 * here: a non-void element is always written with an end tag ("<td></td>",
 * never "<td/>", which an HTML parser would read as an open tag), and only
 * the void elements (br, col, hr, img, meta) are written self-closed.
 *
 * Errors: the writer remembers the first failure (out of memory, a writer
 * error); every later call does nothing and hl_html_finish then returns
 * HL_EIO. A caller may therefore write a whole section and check once.
 * Ownership: hl_html_free(NULL) is fine; strings are copied by libxml2.
 */
#ifndef HL_HTML_H
#define HL_HTML_H

#include <stdio.h>

#include <libxml/xmlwriter.h>

#include "status.h"

typedef struct hl_html hl_html;

/* A new document: the doctype and an open <html lang> element. NULL when
 * out of memory. */
hl_html *hl_html_create(const char *lang);
void hl_html_free(hl_html *h);

/* The underlying writer, for a part written by another module (an inline
 * SVG chart); report its failure with hl_html_fail. */
xmlTextWriterPtr hl_html_writer(hl_html *h);
void hl_html_fail(hl_html *h);
int hl_html_failed(const hl_html *h);

/* <tag class="cls"> (cls may be NULL); then attributes, content, _end. */
void hl_html_start(hl_html *h, const char *tag, const char *cls);
void hl_html_attr(hl_html *h, const char *name, const char *value);
void hl_html_end(hl_html *h);
/* Close a void element opened with hl_html_start ("<img .../>"). */
void hl_html_end_void(hl_html *h);
/* A void element with one optional attribute pair: <meta charset="utf-8"/>. */
void hl_html_void(hl_html *h, const char *tag, const char *name,
		  const char *value);

/* Text content (escaped). */
void hl_html_text(hl_html *h, const char *text);
void hl_html_textf(hl_html *h, const char *fmt, ...)
	__attribute__((format(printf, 2, 3)));
/* <tag class>text</tag> in one call. */
void hl_html_elem(hl_html *h, const char *tag, const char *cls,
		  const char *text);
void hl_html_elemf(hl_html *h, const char *tag, const char *cls,
		   const char *fmt, ...)
	__attribute__((format(printf, 4, 5)));
/* Text kept as written: the content of <style> (no markup characters
 * that need escaping may be in it). */
void hl_html_raw(hl_html *h, const char *text);

/* Close every open element and write the document to fp. */
hl_status hl_html_finish(hl_html *h, FILE *fp, hl_error *err);

#endif
