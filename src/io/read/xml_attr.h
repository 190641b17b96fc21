/* xml_attr.h - typed attributes of one XML element, checked against a table.
 *
 * The case file schema (doc/case.rng) decides whether a document is valid,
 * but libxml2's RelaxNG messages seldom say which attribute is wrong. Each
 * element reader therefore describes its attributes once, in a table of
 * hl_xattr, and hl_xattr_check() reports the first unknown, missing or
 * malformed attribute in words an engineer can act on, naming the unit.
 *
 * hl_xattr_check() also normalises every value in the tree (blanks trimmed,
 * inner runs of blanks collapsed, as the schema's token type reads it), so
 * the getters afterwards return exactly what was checked. Strings returned
 * by hl_xattr_text() belong to the document and live as long as it.
 */
#ifndef HL_XML_ATTR_H
#define HL_XML_ATTR_H

#include <stddef.h>
#include <libxml/tree.h>

#include "status.h"

typedef enum {
	HL_XATTR_NUMBER,  /* signed plain decimal */
	HL_XATTR_AMOUNT,  /* plain decimal >= 0 */
	HL_XATTR_COUNT,   /* whole number from 1 to HL_COUNT_MAX (tables.h) */
	HL_XATTR_LABEL,   /* non-empty name, blanks collapsed */
	HL_XATTR_PATH,    /* non-empty file name, blanks trimmed */
	HL_XATTR_TEXT,    /* free text, kept as written */
	HL_XATTR_CHOICE   /* one of the words in `choices` ("hot|cold") */
} hl_xattr_type;

typedef struct {
	const char *name;
	hl_xattr_type type;
	int required;
	const char *unit;    /* "kW/K", "°C", …; NULL when it has none */
	const char *choices; /* for HL_XATTR_CHOICE, words separated by '|' */
} hl_xattr;

/* Check the attributes of element n against the table: none unknown, every
 * required one present, each value of its type. Errors (HL_EINPUT) name file
 * and the element's line; HL_EIO when out of memory. */
hl_status hl_xattr_check(xmlNodePtr n, const hl_xattr *spec, size_t nspec,
			 const char *file, hl_error *err);

/* After hl_xattr_check: the value, or NULL when the attribute is absent. */
const char *hl_xattr_text(xmlNodePtr n, const char *name);
/* After hl_xattr_check: the number (NUMBER, AMOUNT or COUNT), NaN when
 * absent. */
double hl_xattr_number(xmlNodePtr n, const char *name);

/* Line of an element (where its start tag ends) or of a text node. */
long hl_xattr_line(xmlNodePtr n);

#endif
