/* html.c - an HTML document through libxml2's text writer. */
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "html.h"

struct hl_html {
	xmlBufferPtr buf;
	xmlTextWriterPtr w;
	int failed;
};

static void
check(hl_html *h, int rc)
{
	if (rc < 0)
		h->failed = 1;
}

hl_html *
hl_html_create(const char *lang)
{
	hl_html *h = calloc(1, sizeof *h);

	if (h == NULL)
		return NULL;
	h->buf = xmlBufferCreate();
	if (h->buf != NULL)
		h->w = xmlNewTextWriterMemory(h->buf, 0);
	if (h->w == NULL) {
		hl_html_free(h);
		return NULL;
	}
	/* No XML declaration: an HTML parser would take it for a comment
	 * before the doctype. */
	check(h, xmlTextWriterWriteDTD(h->w, BAD_CAST "html", NULL, NULL,
				       NULL));
	check(h, xmlTextWriterWriteRaw(h->w, BAD_CAST "\n"));
	hl_html_start(h, "html", NULL);
	hl_html_attr(h, "xmlns", "http://www.w3.org/1999/xhtml");
	hl_html_attr(h, "lang", lang);
	if (h->failed) {
		hl_html_free(h);
		return NULL;
	}
	return h;
}

void
hl_html_free(hl_html *h)
{
	if (h == NULL)
		return;
	if (h->w != NULL)
		xmlFreeTextWriter(h->w);
	if (h->buf != NULL)
		xmlBufferFree(h->buf);
	free(h);
}

xmlTextWriterPtr
hl_html_writer(hl_html *h)
{
	return h->w;
}

void
hl_html_fail(hl_html *h)
{
	h->failed = 1;
}

int
hl_html_failed(const hl_html *h)
{
	return h->failed;
}

void
hl_html_start(hl_html *h, const char *tag, const char *cls)
{
	if (h->failed)
		return;
	check(h, xmlTextWriterStartElement(h->w, BAD_CAST tag));
	if (cls != NULL)
		hl_html_attr(h, "class", cls);
}

void
hl_html_attr(hl_html *h, const char *name, const char *value)
{
	if (h->failed || value == NULL)
		return;
	check(h, xmlTextWriterWriteAttribute(h->w, BAD_CAST name,
					     BAD_CAST value));
}

void
hl_html_end(hl_html *h)
{
	if (h->failed)
		return;
	check(h, xmlTextWriterFullEndElement(h->w));
}

void
hl_html_end_void(hl_html *h)
{
	if (h->failed)
		return;
	check(h, xmlTextWriterEndElement(h->w));
}

void
hl_html_void(hl_html *h, const char *tag, const char *name, const char *value)
{
	if (h->failed)
		return;
	check(h, xmlTextWriterStartElement(h->w, BAD_CAST tag));
	if (name != NULL)
		hl_html_attr(h, name, value);
	if (!h->failed)
		check(h, xmlTextWriterEndElement(h->w));
}

void
hl_html_text(hl_html *h, const char *text)
{
	if (h->failed || text == NULL)
		return;
	check(h, xmlTextWriterWriteString(h->w, BAD_CAST text));
}

void
hl_html_textf(hl_html *h, const char *fmt, ...)
{
	char buf[2048];
	va_list ap;

	va_start(ap, fmt);
	vsnprintf(buf, sizeof buf, fmt, ap);
	va_end(ap);
	hl_html_text(h, buf);
}

void
hl_html_elem(hl_html *h, const char *tag, const char *cls, const char *text)
{
	hl_html_start(h, tag, cls);
	hl_html_text(h, text);
	hl_html_end(h);
}

void
hl_html_elemf(hl_html *h, const char *tag, const char *cls, const char *fmt,
	      ...)
{
	char buf[2048];
	va_list ap;

	va_start(ap, fmt);
	vsnprintf(buf, sizeof buf, fmt, ap);
	va_end(ap);
	hl_html_elem(h, tag, cls, buf);
}

void
hl_html_raw(hl_html *h, const char *text)
{
	if (h->failed)
		return;
	check(h, xmlTextWriterWriteRaw(h->w, BAD_CAST text));
}

hl_status
hl_html_finish(hl_html *h, FILE *fp, hl_error *err)
{
	size_t len;

	if (!h->failed)
		check(h, xmlTextWriterEndDocument(h->w));
	if (h->failed)
		return hl_error_set(err, HL_EIO, NULL, 0,
			"cannot build the report (out of memory?)");
	xmlFreeTextWriter(h->w);
	h->w = NULL;
	len = (size_t)xmlBufferLength(h->buf);
	if (fwrite(xmlBufferContent(h->buf), 1, len, fp) != len ||
	    fputc('\n', fp) == EOF)
		return hl_error_set(err, HL_EIO, NULL, 0, "write error");
	return HL_OK;
}
