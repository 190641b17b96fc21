/* result_xml.h - the machine-readable results document (doc/results.md).
 *
 * Root <results>; each stage's writer adds its own elements. Numbers are
 * written in plain decimal with 12 significant digits.
 */
#ifndef HL_RESULT_XML_H
#define HL_RESULT_XML_H

#include <stdio.h>
#include <libxml/xmlwriter.h>

#include "status.h"

typedef struct hl_xml_out hl_xml_out;

/* Start a document whose root is <results>. */
hl_xml_out *hl_xml_out_begin(const char *source);
xmlTextWriterPtr hl_xml_out_writer(hl_xml_out *x);
/* Close the root and write the document to fp. */
hl_status hl_xml_out_finish(hl_xml_out *x, FILE *fp, hl_error *err);
void hl_xml_out_free(hl_xml_out *x);

/* Attribute helpers; they return < 0 on a writer failure like libxml2. */
int hl_xml_num(xmlTextWriterPtr w, const char *name, double v);
int hl_xml_str(xmlTextWriterPtr w, const char *name, const char *v);
int hl_xml_int(xmlTextWriterPtr w, const char *name, long v);

/* Format a number for XML/CSV: plain decimal, 12 significant digits, no
 * exponent for ordinary magnitudes, "-0" never; "inf" and "-inf" for the
 * infinities (the schema says where they may appear), "NaN" for NaN. */
void hl_format_number(char *buf, size_t size, double v);

#endif
