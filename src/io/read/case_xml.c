/* case_xml.c - parsing and validating a case file with libxml2.
 *
 * Steps: parse without network, DTD loading or entity substitution, and stop
 * at the first entity declaration (an entity can expand without bound, the
 * "billion laughs", or read another file); validate against the RelaxNG
 * schema compiled into the program (case_rng.h); read the tree into the case
 * (case_tree.c). libxml2 reports through a structured error handler that is
 * installed for the duration of the call and keeps one message, so nothing
 * reaches stderr. When the schema refuses a document, the tree readers run
 * once more without touching CSV files: their message names the attribute
 * and its unit, where libxml2's often names only an enclosing element.
 */
#include <errno.h>
#include <limits.h>
#include <stddef.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include <libxml/parser.h>
#include <libxml/parserInternals.h>
#include <libxml/relaxng.h>
#include <libxml/SAX2.h>
#include <libxml/xmlerror.h>

#include "case_rng.h"
#include "case_tree.h"
#include "case_xml.h"
#include "xml_attr.h"

/* The file size a case file may have; referenced CSV tables may be larger. */
#define CASE_XML_MAX ((size_t)256 << 20)

/* The one message kept from libxml2's reports. */
typedef struct {
	int have;
	int rank;         /* a later report replaces a lower-ranked one */
	long line;
	char text[HL_ERROR_TEXT];
	startElementNsSAX2Func start; /* libxml2's own element handler */
	long *lines;      /* line of every element, in document order */
	size_t nlines, cap;
	int nomem;
	int entity;       /* an entity declaration was refused */
	long entity_line;
	char entity_name[64];
} diag;

/* How much a RelaxNG report says: the summaries that only name an enclosing
 * element rank below the reports that name what is wrong. */
static int
rank_of(const xmlError *e)
{
	int r;

	if (e->domain != XML_FROM_RELAXNGV)
		return 0;
	switch (e->code) {
	case XML_RELAXNG_ERR_ATTRVALID:
	case XML_RELAXNG_ERR_CONTENTVALID:
	case XML_RELAXNG_ERR_INTEREXTRA:
		r = 1;
		break;
	case XML_RELAXNG_ERR_EXTRACONTENT:
	case XML_RELAXNG_ERR_NOELEM:
		r = 2;
		break;
	default:
		r = 3;
		break;
	}
	return 2 * r + (e->line > 0 || e->node != NULL);
}

/* libxml2's message on one line: line breaks become blanks. */
static void
copy_message(char *dst, size_t size, const char *msg)
{
	size_t n;
	char *p;

	snprintf(dst, size, "%s", msg ? msg : "unknown error");
	for (p = dst; *p != '\0'; p++)
		if (*p == '\n' || *p == '\r' || *p == '\t')
			*p = ' ';
	n = strlen(dst);
	while (n > 0 && dst[n - 1] == ' ')
		dst[--n] = '\0';
}

static void
parse_message(char *dst, size_t size, const char *msg)
{
	static const char utf8[] = "Input is not proper UTF-8";

	if (strncmp(msg, utf8, sizeof utf8 - 1) == 0)
		snprintf(dst, size, "the file is not UTF-8 text; save it as "
			"UTF-8, or name its encoding in the first line, e.g. "
			"<?xml version=\"1.0\" encoding=\"ISO-8859-1\"?>");
	else
		snprintf(dst, size, "not well-formed XML: %s; check the markup "
			"on or before this line", msg);
}

static void
on_error(void *data, xmlErrorPtr e)
{
	diag *d = data;
	char msg[HL_ERROR_TEXT - 96];
	int rank;

	if (d == NULL || e == NULL || e->level < XML_ERR_ERROR)
		return;
	rank = rank_of(e);
	if (d->have && rank <= d->rank)
		return;
	d->have = 1;
	d->rank = rank;
	d->line = e->line;
	if (d->line <= 0 && e->node != NULL)
		d->line = hl_xattr_line((xmlNodePtr)e->node);
	copy_message(msg, sizeof msg, e->message);
	if (e->domain == XML_FROM_RELAXNGV)
		snprintf(d->text, sizeof d->text, "the case file does not "
			"follow its schema: %s (see doc/case-file.md)", msg);
	else
		parse_message(d->text, sizeof d->text, msg);
}

/* libxml2's unstructured reports (rare, from deep inside) are dropped: the
 * structured handler has already kept the message that matters. */
static void
on_generic(void *data, const char *fmt, ...)
{
	(void)data;
	(void)fmt;
}

static void
refuse_entity(void *ctx, const xmlChar *name)
{
	xmlParserCtxtPtr p = ctx;
	diag *d = p->_private;

	if (!d->entity) {
		d->entity = 1;
		d->entity_line = xmlSAX2GetLineNumber(ctx);
		snprintf(d->entity_name, sizeof d->entity_name, "%s",
			 name ? (const char *)name : "");
	}
	xmlStopParser(p);
}

static void
on_entity_decl(void *ctx, const xmlChar *name, int type,
	       const xmlChar *public_id, const xmlChar *system_id,
	       xmlChar *content)
{
	(void)type;
	(void)public_id;
	(void)system_id;
	(void)content;
	refuse_entity(ctx, name);
}

static void
on_unparsed_entity_decl(void *ctx, const xmlChar *name,
			const xmlChar *public_id, const xmlChar *system_id,
			const xmlChar *notation)
{
	(void)public_id;
	(void)system_id;
	(void)notation;
	refuse_entity(ctx, name);
}

/* libxml2 stores element lines in 16 bits, so the parser notes each
 * element's line here, in document order; the RelaxNG validator uses psvi
 * for its own ends, so the lines go there only after it is done. */
static void
on_start_element(void *ctx, const xmlChar *name, const xmlChar *prefix,
		 const xmlChar *uri, int nns, const xmlChar **ns, int nattr,
		 int ndefault, const xmlChar **attr)
{
	xmlParserCtxtPtr p = ctx;
	diag *d = p->_private;

	d->start(ctx, name, prefix, uri, nns, ns, nattr, ndefault, attr);
	if (d->nlines == d->cap) {
		size_t ncap = d->cap ? 2 * d->cap : 256;
		long *l = realloc(d->lines, ncap * sizeof *l);

		if (l == NULL) {
			d->nomem = 1;
			xmlStopParser(p);
			return;
		}
		d->lines = l;
		d->cap = ncap;
	}
	d->lines[d->nlines++] = p->input ? (long)p->input->line : 0;
}

/* Hand the big line numbers to hl_xattr_line(); returns the next index. */
static size_t
restore_lines(xmlNodePtr n, const diag *d, size_t i)
{
	for (; n != NULL; n = n->next) {
		if (n->type != XML_ELEMENT_NODE)
			continue;
		if (i < d->nlines)
			n->psvi = d->lines[i] >= 65535 ?
				  (void *)(ptrdiff_t)d->lines[i] : NULL;
		i = restore_lines(n->children, d, i + 1);
	}
	return i;
}

/* The libxml2 handlers in force before the call, put back after it. */
typedef struct {
	xmlStructuredErrorFunc serror;
	void *sdata;
	xmlGenericErrorFunc gerror;
	void *gdata;
} handlers;

static void
handlers_install(handlers *h, diag *d)
{
	h->serror = xmlStructuredError;
	h->sdata = xmlStructuredErrorContext;
	h->gerror = xmlGenericError;
	h->gdata = xmlGenericErrorContext;
	xmlSetStructuredErrorFunc(d, on_error);
	xmlSetGenericErrorFunc(NULL, on_generic);
}

static void
handlers_restore(const handlers *h)
{
	xmlSetStructuredErrorFunc(h->sdata, h->serror);
	xmlSetGenericErrorFunc(h->gdata, h->gerror);
}

static hl_status
parse(const char *name, const char *data, size_t len, diag *d,
      xmlDocPtr *out, hl_error *err)
{
	xmlParserCtxtPtr p;
	xmlDocPtr doc;
	int ok;

	*out = NULL;
	p = xmlCreateMemoryParserCtxt(data, (int)len);
	if (p == NULL)
		return hl_error_nomem(err);
	xmlCtxtUseOptions(p, XML_PARSE_NONET | XML_PARSE_BIG_LINES);
	/* Whatever libxml2's process-wide defaults: no external subset, no
	 * DTD validation, entities left unexpanded. */
	p->loadsubset = 0;
	p->validate = 0;
	p->replaceEntities = 0;
	p->_private = d;
	p->sax->entityDecl = on_entity_decl;
	p->sax->unparsedEntityDecl = on_unparsed_entity_decl;
	d->start = p->sax->startElementNs;
	if (d->start != NULL)
		p->sax->startElementNs = on_start_element;
	xmlParseDocument(p);
	doc = p->myDoc;
	ok = p->wellFormed && !d->entity && !d->nomem;
	p->myDoc = NULL;
	xmlFreeParserCtxt(p);
	if (ok && doc != NULL) {
		*out = doc;
		return HL_OK;
	}
	xmlFreeDoc(doc);
	if (d->nomem)
		return hl_error_nomem(err);
	if (d->entity)
		return hl_error_set(err, HL_EINPUT, name, d->entity_line,
			"the DOCTYPE declares the entity '%s'; case files may "
			"not declare entities (they can expand without bound or "
			"read other files): remove the DOCTYPE", d->entity_name);
	if (d->have)
		return hl_error_set(err, HL_EINPUT, name, d->line, "%s",
				    d->text);
	return hl_error_set(err, HL_EINPUT, name, 0, "not well-formed XML");
}

/* The compiled schema, built on first use and kept for the process: a
 * program that reads many cases (the tests, the fuzzer) would otherwise
 * compile it per file, at twice the cost of parsing the demo case (callgrind:
 * 2.5 M instructions against 1.2 M; validating it takes 14 M). The readers
 * are single-threaded. */
static xmlRelaxNGPtr
schema_once(void)
{
	static xmlRelaxNGPtr schema;
	xmlRelaxNGParserCtxtPtr pc;
	diag scratch;

	if (schema != NULL)
		return schema;
	memset(&scratch, 0, sizeof scratch);
	pc = xmlRelaxNGNewMemParserCtxt(hl_case_rng, (int)hl_case_rng_len);
	if (pc == NULL)
		return NULL;
	xmlRelaxNGSetParserStructuredErrors(pc, on_error, &scratch);
	schema = xmlRelaxNGParse(pc);
	xmlRelaxNGFreeParserCtxt(pc);
	return schema;
}

/* 1 valid, 0 invalid (the reason in d), -1 when the schema itself fails. */
static int
validate(xmlDocPtr doc, diag *d)
{
	xmlRelaxNGPtr schema = schema_once();
	xmlRelaxNGValidCtxtPtr vc;
	int rc = -1;

	if (schema == NULL)
		return -1;
	vc = xmlRelaxNGNewValidCtxt(schema);
	if (vc != NULL) {
		d->have = 0;
		d->rank = 0;
		d->line = 0;
		d->text[0] = '\0';
		xmlRelaxNGSetValidStructuredErrors(vc, on_error, d);
		rc = xmlRelaxNGValidateDoc(vc, doc);
		rc = rc == 0 ? 1 : rc > 0 ? 0 : -1;
		xmlRelaxNGFreeValidCtxt(vc);
	}
	return rc;
}

/* The tree readers' message for an invalid document, or libxml2's when
 * they find nothing wrong. */
static hl_status
explain_invalid(xmlDocPtr doc, const hl_case_tree_opts *o, const diag *d,
		hl_error *err)
{
	hl_case_tree_opts dry = *o;
	hl_case *scratch = hl_case_create();
	hl_status st;

	if (scratch == NULL)
		return hl_error_nomem(err);
	dry.load_tables = 0;
	st = hl_case_tree_read(scratch, doc, &dry, err);
	hl_case_free(scratch);
	if (st != HL_OK)
		return st;
	return hl_error_set(err, HL_EINPUT, o->file, d->line, "%s", d->text);
}

static hl_status
read_doc(hl_case *c, const char *name, const char *data, size_t len,
	 const char *prefix, hl_error *err)
{
	hl_case_tree_opts o = { name, prefix, 1 };
	diag d;
	handlers h;
	xmlDocPtr doc;
	hl_status st;
	int valid;

	if (len == 0)
		return hl_error_set(err, HL_EINPUT, name, 0, "the case file is "
			"empty; a case file starts with <case version=\"1\">");
	if (len > CASE_XML_MAX || len > INT_MAX)
		return hl_error_set(err, HL_EINPUT, name, 0, "the case file is "
			"larger than %zu bytes; keep large tables in CSV files "
			"that the case file names", CASE_XML_MAX);
	xmlInitParser();
	memset(&d, 0, sizeof d);
	handlers_install(&h, &d);
	st = parse(name, data, len, &d, &doc, err);
	if (st == HL_OK) {
		valid = validate(doc, &d);
		restore_lines(doc->children, &d, 0);
		if (valid < 0)
			st = hl_error_set(err, HL_EIO, name, 0, "internal "
				"error: the built-in case schema cannot be "
				"used (out of memory?)");
		else if (valid == 0)
			st = explain_invalid(doc, &o, &d, err);
		else
			st = hl_case_tree_read(c, doc, &o, err);
		xmlFreeDoc(doc);
	}
	handlers_restore(&h);
	free(d.lines);
	return st;
}

/* The whole file in memory, for the parser and for size checks. */
static hl_status
slurp(const char *path, char **out, size_t *len, hl_error *err)
{
	FILE *f = fopen(path, "rb");
	char *buf = NULL;
	size_t cap = 0, n;

	*out = NULL;
	*len = 0;
	if (f == NULL)
		return hl_error_set(err, errno == ENOENT ? HL_EINPUT : HL_EIO,
			path, 0, "cannot open: %s", strerror(errno));
	for (;;) {
		if (*len == cap) {
			char *p;

			cap = cap ? 2 * cap : 65536;
			if (cap > CASE_XML_MAX + 65536 ||
			    (p = realloc(buf, cap)) == NULL) {
				free(buf);
				fclose(f);
				return cap > CASE_XML_MAX + 65536 ?
					hl_error_set(err, HL_EINPUT, path, 0,
						"the case file is larger than "
						"%zu bytes", CASE_XML_MAX) :
					hl_error_nomem(err);
			}
			buf = p;
		}
		n = fread(buf + *len, 1, cap - *len, f);
		*len += n;
		if (n == 0)
			break;
	}
	if (ferror(f)) {
		free(buf);
		fclose(f);
		return hl_error_set(err, HL_EIO, path, 0, "read error");
	}
	fclose(f);
	*out = buf;
	return HL_OK;
}

hl_status
hl_case_xml_read(hl_case *c, const char *path, hl_error *err)
{
	const char *slash = strrchr(path, '/');
	char *data, *prefix;
	size_t len, n = slash ? (size_t)(slash - path) + 1 : 0;
	hl_status st;

	st = slurp(path, &data, &len, err);
	if (st != HL_OK)
		return st;
	prefix = malloc(n + 1);
	if (prefix == NULL) {
		free(data);
		return hl_error_nomem(err);
	}
	memcpy(prefix, path, n);
	prefix[n] = '\0';
	st = read_doc(c, path, data ? data : "", len, prefix, err);
	free(prefix);
	free(data);
	return st;
}

hl_status
hl_case_xml_read_mem(hl_case *c, const char *name, const char *data,
		     size_t len, const char *base_dir, hl_error *err)
{
	size_t n = base_dir ? strlen(base_dir) : 0;
	char *prefix;
	hl_status st;

	prefix = malloc(n + 2);
	if (prefix == NULL)
		return hl_error_nomem(err);
	memcpy(prefix, base_dir ? base_dir : "", n);
	if (n > 0 && prefix[n - 1] != '/')
		prefix[n++] = '/';
	prefix[n] = '\0';
	st = read_doc(c, name, data, len, prefix, err);
	free(prefix);
	return st;
}
