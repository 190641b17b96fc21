/* xml_attr.c - checking and reading the attributes of one element. */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "number.h"
#include "tables.h"
#include "xml_attr.h"

#define STR_(x) #x
#define STR(x) STR_(x)

static int
is_blank(char ch)
{
	return ch == ' ' || ch == '\t' || ch == '\r' || ch == '\n';
}

/* Trim blanks in place; with collapse, also reduce inner runs to one space
 * (the whitespace rule of the schema's token type). */
static void
normalise(char *s, int collapse)
{
	char *r = s, *w = s;
	int pending = 0;

	while (is_blank(*r))
		r++;
	for (; *r != '\0'; r++) {
		if (is_blank(*r)) {
			pending = 1;
			if (!collapse)
				*w++ = *r;
			continue;
		}
		if (pending && collapse)
			*w++ = ' ';
		pending = 0;
		*w++ = *r;
	}
	*w = '\0';
	while (w > s && is_blank(w[-1]))
		*--w = '\0';
}

static const hl_xattr *
find_spec(const hl_xattr *spec, size_t nspec, const char *name)
{
	size_t i;

	for (i = 0; i < nspec; i++)
		if (strcmp(spec[i].name, name) == 0)
			return &spec[i];
	return NULL;
}

static void
list_names(const hl_xattr *spec, size_t nspec, char *buf, size_t size)
{
	size_t i;

	buf[0] = '\0';
	for (i = 0; i < nspec; i++) {
		strncat(buf, i ? ", " : "", size - strlen(buf) - 1);
		strncat(buf, spec[i].name, size - strlen(buf) - 1);
	}
}

static int
choice_ok(const char *choices, const char *v)
{
	size_t n = strlen(v);
	const char *p = choices;

	while (p != NULL && *p != '\0') {
		const char *bar = strchr(p, '|');
		size_t len = bar ? (size_t)(bar - p) : strlen(p);

		if (len == n && strncmp(p, v, n) == 0)
			return 1;
		p = bar ? bar + 1 : NULL;
	}
	return 0;
}

/* Why v is not a value of type a, or NULL when it is. */
static const char *
value_problem(const hl_xattr *a, const char *v)
{
	double d;
	long k;

	switch (a->type) {
	case HL_XATTR_NUMBER:
	case HL_XATTR_AMOUNT:
		if (!hl_parse_number(v, 0, &d))
			return "is not a number";
		if (!isfinite(d))
			return "is out of range";
		if (a->type == HL_XATTR_AMOUNT && (d < 0.0 || v[0] == '-'))
			return "is negative";
		return NULL;
	case HL_XATTR_COUNT:
		return hl_parse_count(v, &k) ? NULL : "is not a whole number "
			"from 1 to " STR(HL_COUNT_MAX);
	case HL_XATTR_LABEL:
	case HL_XATTR_PATH:
		return v[0] == '\0' ? "is empty" : NULL;
	case HL_XATTR_CHOICE:
		return choice_ok(a->choices, v) ? NULL : "is not allowed";
	case HL_XATTR_TEXT:
		break;
	}
	return NULL;
}

static hl_status
value_error(xmlNodePtr n, const hl_xattr *a, const char *v, const char *why,
	    const char *file, hl_error *err)
{
	char hint[160];

	if (a->type == HL_XATTR_CHOICE) {
		const char *p;
		size_t k = 0;

		k = (size_t)snprintf(hint, sizeof hint, "give one of: ");
		for (p = a->choices; *p != '\0' && k + 3 < sizeof hint; p++) {
			if (*p == '|') {
				hint[k++] = ',';
				hint[k++] = ' ';
			} else {
				hint[k++] = *p;
			}
		}
		hint[k] = '\0';
	} else if (a->type == HL_XATTR_LABEL || a->type == HL_XATTR_PATH) {
		snprintf(hint, sizeof hint, "give a %s",
			 a->type == HL_XATTR_PATH ? "file name" : "name");
	} else if (a->type == HL_XATTR_COUNT) {
		snprintf(hint, sizeof hint, "give a count such as 2");
	} else {
		snprintf(hint, sizeof hint, "give a plain decimal%s%s%s%s",
			 a->type == HL_XATTR_AMOUNT ? " >= 0" : "",
			 a->unit ? " in " : "", a->unit ? a->unit : "",
			 a->unit ? ", without the unit" : "");
	}
	return hl_error_set(err, HL_EINPUT, file, hl_xattr_line(n),
		"attribute '%s' of <%s>: '%.40s' %s; %s", a->name,
		(const char *)n->name, v, why, hint);
}

/* Check one attribute and write its normalised value back into the tree. */
static hl_status
check_one(xmlNodePtr n, xmlAttrPtr at, const hl_xattr *spec, size_t nspec,
	  const char *file, hl_error *err)
{
	const char *name = (const char *)at->name;
	const hl_xattr *a = at->ns ? NULL : find_spec(spec, nspec, name);
	xmlChar *raw;
	const char *why;
	hl_status st = HL_OK;

	if (a == NULL) {
		char known[400];

		list_names(spec, nspec, known, sizeof known);
		return hl_error_set(err, HL_EINPUT, file, hl_xattr_line(n),
			"<%s> has no attribute '%s%s%.40s'; it takes %s",
			(const char *)n->name,
			at->ns && at->ns->prefix ? (const char *)at->ns->prefix
						 : "",
			at->ns && at->ns->prefix ? ":" : "", name,
			nspec ? known : "none");
	}
	raw = xmlNodeListGetString(n->doc, at->children, 1);
	if (raw == NULL)
		raw = xmlStrdup(BAD_CAST "");
	if (raw == NULL)
		return hl_error_nomem(err);
	if (a->type != HL_XATTR_TEXT) {
		normalise((char *)raw, a->type != HL_XATTR_PATH);
		why = value_problem(a, (const char *)raw);
		if (why != NULL)
			st = value_error(n, a, (const char *)raw, why, file, err);
	}
	if (st == HL_OK && xmlSetProp(n, at->name, raw) == NULL)
		st = hl_error_nomem(err);
	xmlFree(raw);
	return st;
}

hl_status
hl_xattr_check(xmlNodePtr n, const hl_xattr *spec, size_t nspec,
	       const char *file, hl_error *err)
{
	xmlAttrPtr at;
	size_t i;
	hl_status st;

	for (at = n->properties; at != NULL; at = at->next) {
		st = check_one(n, at, spec, nspec, file, err);
		if (st != HL_OK)
			return st;
	}
	for (i = 0; i < nspec; i++) {
		if (!spec[i].required || hl_xattr_text(n, spec[i].name))
			continue;
		return hl_error_set(err, HL_EINPUT, file, hl_xattr_line(n),
			"<%s> lacks the attribute '%s'%s%s%s",
			(const char *)n->name, spec[i].name,
			spec[i].unit ? " (" : "",
			spec[i].unit ? spec[i].unit : "",
			spec[i].unit ? ")" : "");
	}
	return HL_OK;
}

const char *
hl_xattr_text(xmlNodePtr n, const char *name)
{
	xmlAttrPtr at = xmlHasNsProp(n, BAD_CAST name, NULL);
	xmlNodePtr t;

	if (at == NULL || at->type != XML_ATTRIBUTE_NODE)
		return NULL;
	t = at->children;
	/* hl_xattr_check left exactly one text node in every attribute. */
	if (t == NULL || t->type != XML_TEXT_NODE || t->content == NULL)
		return "";
	return (const char *)t->content;
}

double
hl_xattr_number(xmlNodePtr n, const char *name)
{
	const char *v = hl_xattr_text(n, name);
	double d;
	long k;

	if (v == NULL)
		return NAN;
	if (hl_parse_number(v, 0, &d))
		return d;
	return hl_parse_count(v, &k) ? (double)k : NAN;
}

long
hl_xattr_line(xmlNodePtr n)
{
	/* An element holds at most 65535 in its line field; the parser of
	 * case_xml.c keeps larger lines in psvi, unused by libxml2's tree. */
	if (n->type == XML_ELEMENT_NODE && n->line == 65535 && n->psvi != NULL)
		return (long)(ptrdiff_t)n->psvi;
	return xmlGetLineNo(n);
}
