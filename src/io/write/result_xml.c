/* result_xml.c - the <results> document through libxml2's text writer. */
#include "config.h"

#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "result_xml.h"

struct hl_xml_out {
	xmlBufferPtr buf;
	xmlTextWriterPtr w;
};

static const char caution[] =
	" Screening estimates only: detailed thermal and mechanical design, "
	"pressure equipment codes and the safety review of each match belong "
	"to qualified engineers under local codes. ";

hl_xml_out *
hl_xml_out_begin(const char *source)
{
	hl_xml_out *x = calloc(1, sizeof *x);

	if (x == NULL)
		return NULL;
	x->buf = xmlBufferCreate();
	if (x->buf != NULL)
		x->w = xmlNewTextWriterMemory(x->buf, 0);
	if (x->w == NULL) {
		hl_xml_out_free(x);
		return NULL;
	}
	xmlTextWriterSetIndent(x->w, 1);
	xmlTextWriterSetIndentString(x->w, BAD_CAST "  ");
	if (xmlTextWriterStartDocument(x->w, "1.0", "UTF-8", NULL) < 0 ||
	    xmlTextWriterWriteComment(x->w, BAD_CAST caution) < 0 ||
	    xmlTextWriterStartElement(x->w, BAD_CAST "results") < 0 ||
	    hl_xml_str(x->w, "generator", PACKAGE_STRING) < 0 ||
	    (source != NULL && hl_xml_str(x->w, "source", source) < 0)) {
		hl_xml_out_free(x);
		return NULL;
	}
	return x;
}

xmlTextWriterPtr
hl_xml_out_writer(hl_xml_out *x)
{
	return x->w;
}

hl_status
hl_xml_out_finish(hl_xml_out *x, FILE *fp, hl_error *err)
{
	if (xmlTextWriterEndDocument(x->w) < 0)
		return hl_error_set(err, HL_EIO, NULL, 0,
			"cannot build the results document");
	xmlFreeTextWriter(x->w);
	x->w = NULL;
	if (fwrite(xmlBufferContent(x->buf), 1, (size_t)xmlBufferLength(x->buf),
		   fp) != (size_t)xmlBufferLength(x->buf))
		return hl_error_set(err, HL_EIO, NULL, 0, "write error");
	return HL_OK;
}

void
hl_xml_out_free(hl_xml_out *x)
{
	if (x == NULL)
		return;
	if (x->w != NULL)
		xmlFreeTextWriter(x->w);
	if (x->buf != NULL)
		xmlBufferFree(x->buf);
	free(x);
}

void
hl_format_number(char *buf, size_t size, double v)
{
	int decimals;
	char *end;

	if (fabs(v) < 1e-28 || !isfinite(v)) {
		snprintf(buf, size, "%s", isnan(v) ? "NaN" : isinf(v) ?
			 (v > 0.0 ? "inf" : "-inf") : "0");
		return;
	}
	snprintf(buf, size, "%.12g", v);
	if (strchr(buf, 'e') == NULL)
		return;
	/* Plain decimal always (doc/design.md, "Contracts"): 12 significant
	   digits. */
	decimals = 11 - (int)floor(log10(fabs(v)));
	if (decimals < 0)
		decimals = 0;
	if (decimals > 40)
		decimals = 40;
	snprintf(buf, size, "%.*f", decimals, v);
	if (strchr(buf, '.') != NULL) {
		end = buf + strlen(buf) - 1;
		while (*end == '0')
			*end-- = '\0';
		if (*end == '.')
			*end = '\0';
	}
}

int
hl_xml_num(xmlTextWriterPtr w, const char *name, double v)
{
	char b[64];

	hl_format_number(b, sizeof b, v);
	return xmlTextWriterWriteAttribute(w, BAD_CAST name, BAD_CAST b);
}

int
hl_xml_str(xmlTextWriterPtr w, const char *name, const char *v)
{
	return xmlTextWriterWriteAttribute(w, BAD_CAST name, BAD_CAST v);
}

int
hl_xml_int(xmlTextWriterPtr w, const char *name, long v)
{
	char b[32];

	snprintf(b, sizeof b, "%ld", v);
	return xmlTextWriterWriteAttribute(w, BAD_CAST name, BAD_CAST b);
}
