/* case_xml.h - the XML case file (schema doc/case.rng).
 *
 * The file is validated against the RelaxNG schema before it is read; errors
 * name the file and line. Streams, utilities and the existing network may be
 * inline or referenced as CSV tables relative to the case file. Entity
 * substitution and network access are off.
 */
#ifndef HL_CASE_XML_H
#define HL_CASE_XML_H

#include <stddef.h>

#include "case.h"
#include "status.h"

/* Read the case file at path into c (settings, streams, utilities, rules,
 * existing network). */
hl_status hl_case_xml_read(hl_case *c, const char *path, hl_error *err);

/* Same from a buffer; CSV references are resolved against base_dir. */
hl_status hl_case_xml_read_mem(hl_case *c, const char *name, const char *data,
			       size_t len, const char *base_dir,
			       hl_error *err);

#endif
