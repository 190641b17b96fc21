/* html_check.c - parse a report with libxml2's HTML parser and say what a
 * reader's browser would have to fetch.
 *
 * Usage: html_check FILE
 * Prints one line per finding on standard output:
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

static int
has_class(xmlNodePtr n, const char *cls)
{
	xmlChar *v = xmlGetProp(n, BAD_CAST "class");
	int yes = v != NULL && strcmp((char *)v, cls) == 0;

	xmlFree(v);
	return yes;
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
	htmlDocPtr doc;

	if (argc != 2) {
		fprintf(stderr, "usage: html_check FILE\n");
		return 2;
	}
	xmlSetStructuredErrorFunc(NULL, on_error);
	doc = htmlReadFile(argv[1], "UTF-8", HTML_PARSE_NONET);
	if (doc == NULL) {
		fprintf(stderr, "html_check: cannot parse %s\n", argv[1]);
		return 2;
	}
	walk(xmlDocGetRootElement(doc));
	xmlFreeDoc(doc);
	xmlCleanupParser();
	return errors > 0;
}
