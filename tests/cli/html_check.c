/* html_check.c - parse a report with libxml2's HTML parser and say what a
 * reader's browser would have to fetch.
 *
 * Usage: html_check FILE
 *        html_check --table CLASS FILE
 * The second form prints the body rows of every <table> whose class list
 * holds CLASS, one line per row, the cells' text separated by tabs.
 * The first prints one line per finding on standard output:
 *   section ID         a <div class="section"> of the report, in order
 *   figure ID          a <div class="figure"> holding an inline <svg>
 *   external WHERE V   a reference to anything outside the file: a src,
 *                      a non-fragment href, a url() or @import in a style
 * and every parser error on standard error. Exit 0 when the parser reported
 * no error, 1 when it did, 2 when the file cannot be read.
 *
 * libxml2 2.9 parses HTML 4.01 and reports the elements of inline SVG as
 * unknown tags ("Tag svg invalid"); HTML5 makes SVG foreign content of an
 * HTML document (WHATWG HTML Living Standard, §13.1.2.4 "Foreign
 * elements"), so that error, for SVG element names only, is no error here.
 * Any other error is.
 */
#include <stdio.h>
#include <string.h>
#include <strings.h>

#include <libxml/HTMLparser.h>
#include <libxml/tree.h>
#include <libxml/xmlerror.h>
#include <libxml/xmlversion.h>

/* The error a structured handler gets became const in libxml2 2.12. */
#if LIBXML_VERSION >= 21200
typedef const xmlError *error_ptr;
#else
typedef xmlErrorPtr error_ptr;
#endif

static int errors;

static const char *const svg_names[] = {
	"svg", "g", "defs", "clippath", "desc", "line", "polyline",
	"polygon", "path", "rect", "circle", "ellipse", "text", "tspan",
	"title", "marker", "use", "symbol", NULL
};

static int
is_svg_name(const char *name)
{
	size_t i;

	for (i = 0; name != NULL && svg_names[i] != NULL; i++)
		if (strcasecmp(name, svg_names[i]) == 0)
			return 1;
	return 0;
}

static void
on_error(void *ctx, error_ptr e)
{
	(void)ctx;
	if (e->code == XML_HTML_UNKNOWN_TAG && is_svg_name(e->str1))
		return;
	errors++;
	fprintf(stderr, "html_check: line %d: %s", e->line,
		e->message ? e->message : "error\n");
}

/* A style text refers outside when it holds @import or a url() that is
 * not a fragment ("url(#clip)"). */
static void
check_style(const char *where, const char *css)
{
	const char *p;

	if (strstr(css, "@import") != NULL)
		printf("external %s @import\n", where);
	for (p = strstr(css, "url("); p != NULL; p = strstr(p + 4, "url(")) {
		const char *q = p + 4;

		while (*q == ' ' || *q == '\'' || *q == '"')
			q++;
		if (*q != '#')
			printf("external %s %.60s\n", where, p);
	}
}

/* cls is one of the space-separated names of n's class attribute. */
static int
has_class(xmlNodePtr n, const char *cls)
{
	xmlChar *v = xmlGetProp(n, BAD_CAST "class");
	const char *p = (const char *)v;
	size_t len = strlen(cls);
	int yes = 0;

	while (p != NULL && *p != '\0' && !yes) {
		size_t k = strcspn(p, " ");

		yes = k == len && strncmp(p, cls, len) == 0;
		p += k;
		p += strspn(p, " ");
	}
	xmlFree(v);
	return yes;
}

static void
print_cell(xmlNodePtr td)
{
	xmlChar *t = xmlNodeGetContent(td);
	char *p;

	for (p = (char *)t; p != NULL && *p != '\0'; p++)
		if (*p == '\t' || *p == '\n')
			*p = ' ';
	fputs(t ? (char *)t : "", stdout);
	xmlFree(t);
}

/* The rows of every tbody below n, cells tab-separated. */
static void
print_rows(xmlNodePtr n)
{
	xmlNodePtr tr, td;

	for (; n != NULL; n = n->next) {
		if (n->type != XML_ELEMENT_NODE)
			continue;
		if (strcmp((char *)n->name, "tbody") != 0) {
			print_rows(n->children);
			continue;
		}
		for (tr = n->children; tr != NULL; tr = tr->next) {
			int first = 1;

			if (tr->type != XML_ELEMENT_NODE)
				continue;
			for (td = tr->children; td != NULL; td = td->next) {
				if (td->type != XML_ELEMENT_NODE)
					continue;
				if (!first)
					putchar('\t');
				print_cell(td);
				first = 0;
			}
			putchar('\n');
		}
	}
}

static void
tables(xmlNodePtr n, const char *cls)
{
	for (; n != NULL; n = n->next) {
		if (n->type != XML_ELEMENT_NODE)
			continue;
		if (strcmp((char *)n->name, "table") == 0 && has_class(n, cls))
			print_rows(n->children);
		else
			tables(n->children, cls);
	}
}

static void
check_attrs(xmlNodePtr n)
{
	static const char *const fetch[] = { "src", "srcset", "poster",
		"data", "action", "formaction", "background", "manifest",
		"codebase", "cite", "longdesc", NULL };
	xmlAttrPtr a;
	size_t i;

	for (a = n->properties; a != NULL; a = a->next) {
		xmlChar *v = xmlNodeGetContent((xmlNodePtr)a);
		const char *name = (const char *)a->name;

		for (i = 0; fetch[i] != NULL; i++)
			if (strcasecmp(name, fetch[i]) == 0)
				printf("external %s@%s %s\n", n->name, name,
				       v ? (char *)v : "");
		if (strcasecmp(name, "href") == 0 && (v == NULL || v[0] != '#'))
			printf("external %s@href %s\n", n->name,
			       v ? (char *)v : "");
		if (strcasecmp(name, "style") == 0 && v != NULL)
			check_style("style-attribute", (char *)v);
		xmlFree(v);
	}
}

static void
walk(xmlNodePtr n)
{
	for (; n != NULL; n = n->next) {
		if (n->type != XML_ELEMENT_NODE)
			continue;
		check_attrs(n);
		if (strcasecmp((char *)n->name, "style") == 0) {
			xmlChar *css = xmlNodeGetContent(n);

			check_style("style", css ? (char *)css : "");
			xmlFree(css);
		}
		if (strcasecmp((char *)n->name, "script") == 0 ||
		    strcasecmp((char *)n->name, "link") == 0 ||
		    strcasecmp((char *)n->name, "iframe") == 0 ||
		    strcasecmp((char *)n->name, "object") == 0)
			printf("external element %s\n", n->name);
		if (strcmp((char *)n->name, "div") == 0) {
			xmlChar *id = xmlGetProp(n, BAD_CAST "id");

			if (has_class(n, "section"))
				printf("section %s\n", id ? (char *)id : "");
			if (has_class(n, "figure"))
				printf("figure %s\n", id ? (char *)id : "");
			xmlFree(id);
		}
		walk(n->children);
	}
}

int
main(int argc, char **argv)
{
	const char *file = argv[argc - 1], *cls = NULL;
	htmlDocPtr doc;

	if (argc == 4 && strcmp(argv[1], "--table") == 0) {
		cls = argv[2];
	} else if (argc != 2) {
		fprintf(stderr, "usage: html_check [--table CLASS] FILE\n");
		return 2;
	}
	xmlSetStructuredErrorFunc(NULL, on_error);
	doc = htmlReadFile(file, "UTF-8", HTML_PARSE_NONET);
	if (doc == NULL) {
		fprintf(stderr, "html_check: cannot parse %s\n", file);
		return 2;
	}
	if (cls != NULL)
		tables(xmlDocGetRootElement(doc), cls);
	else
		walk(xmlDocGetRootElement(doc));
	xmlFreeDoc(doc);
	xmlCleanupParser();
	return errors > 0;
}
