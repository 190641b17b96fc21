/* case_tree.h - filling a case from the parsed tree of a case file.
 *
 * The element readers behind hl_case_xml_read(). They check every element
 * and attribute against what doc/case.rng allows, in document order, so that
 * the first problem is reported with a message that names the attribute and
 * its unit; the RelaxNG validation stays the final word on validity. Values
 * are normalised in the tree as a side effect (xml_attr.h).
 */
#ifndef HL_CASE_TREE_H
#define HL_CASE_TREE_H

#include <libxml/tree.h>

#include "case.h"
#include "status.h"

typedef struct {
	const char *file;   /* the case file as named in messages and sources */
	const char *prefix; /* put before relative CSV paths ("" for none) */
	int load_tables;    /* 0: check the tree only, leave CSV files alone */
} hl_case_tree_opts;

/* Read the document rooted at <case> into c. */
hl_status hl_case_tree_read(hl_case *c, xmlDocPtr doc,
			    const hl_case_tree_opts *o, hl_error *err);

#endif
