/* test_svg.c - the chart writer: valid XML in the SVG namespace, every
 * item drawn where its data says, nice ticks, failures reported. */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <cmocka.h>

#include <libxml/parser.h>
#include <libxml/xpath.h>
#include <libxml/xpathInternals.h>

#include "svg.h"

/* Write ch to memory and parse it back. */
static xmlDocPtr
render(const hl_svg_chart *ch)
{
	char *buf = NULL;
	size_t len = 0;
	FILE *fp = open_memstream(&buf, &len);
	xmlDocPtr doc;

	assert_non_null(fp);
	assert_int_equal(hl_svg_chart_write_file(ch, fp, NULL), HL_OK);
	fclose(fp);
	doc = xmlReadMemory(buf, (int)len, "chart.svg", NULL, XML_PARSE_NONET);
	free(buf);
	assert_non_null(doc);
	return doc;
}

static xmlXPathObjectPtr
query(xmlDocPtr doc, const char *expr)
{
	xmlXPathContextPtr ctx = xmlXPathNewContext(doc);
	xmlXPathObjectPtr r;

	assert_non_null(ctx);
	xmlXPathRegisterNs(ctx, BAD_CAST "s", BAD_CAST "http://www.w3.org/2000/svg");
	r = xmlXPathEvalExpression(BAD_CAST expr, ctx);
	xmlXPathFreeContext(ctx);
	assert_non_null(r);
	return r;
}

static double
number(xmlDocPtr doc, const char *expr)
{
	xmlXPathObjectPtr r = query(doc, expr);
	double v = xmlXPathCastToNumber(r);

	xmlXPathFreeObject(r);
	return v;
}

static char *
string(xmlDocPtr doc, const char *expr)
{
	xmlXPathObjectPtr r = query(doc, expr);
	char *s = (char *)xmlXPathCastToString(r);

	xmlXPathFreeObject(r);
	return s;
}

static hl_svg_chart *
sample(void)
{
	static const double x[] = { 0, 100, 250, 530 };
	static const double y[] = { 30, 60, 150, 170 };
	static const double y2[] = { 20, 80, 125, 140 };
	hl_svg_style hot = { HL_SVG_VERMILION, HL_SVG_SOLID, 0,
			     HL_SVG_MARK_NONE, HL_SVG_STEP_NONE };
	hl_svg_style cold = { HL_SVG_BLUE, HL_SVG_DASHED, 0,
			      HL_SVG_MARK_CIRCLE, HL_SVG_STEP_HV };
	hl_svg_chart *ch = hl_svg_chart_create("Test & chart", "Heat (kW)",
					       "Temperature (°C)");

	assert_non_null(ch);
	assert_int_equal(hl_svg_chart_set_subtitle(ch, "a <subtitle>"), 0);
	assert_int_equal(hl_svg_chart_set_footnote(ch, "screening estimate"), 0);
	assert_int_equal(hl_svg_chart_set_id(ch, "t1"), 0);
	assert_int_equal(hl_svg_chart_add_series(ch, "hot", x, y, 4, &hot), 0);
	assert_int_equal(hl_svg_chart_add_series(ch, "cold", x, y2, 4, &cold), 0);
	assert_int_equal(hl_svg_chart_add_hline(ch, 85, "pinch 85 °C",
						HL_SVG_GREY, HL_SVG_DOTTED,
						HL_SVG_START), 0);
	assert_int_equal(hl_svg_chart_add_vline(ch, 180, "v", HL_SVG_GREY,
						HL_SVG_DOTTED), 0);
	assert_int_equal(hl_svg_chart_add_marker(ch, 0, 85, HL_SVG_MARK_DIAMOND,
						 HL_SVG_BLACK, "m", HL_SVG_START), 0);
	assert_int_equal(hl_svg_chart_add_span(ch, 0, 60, 10, "QCmin 60 kW",
					       HL_SVG_BLUE), 0);
	assert_int_equal(hl_svg_chart_add_text(ch, 250, 150, "note",
					       HL_SVG_MIDDLE, 0, -6), 0);
	return ch;
}

static void
test_structure(void **state)
{
	hl_svg_chart *ch = sample();
	xmlDocPtr doc = render(ch);
	char *s;

	(void)state;
	/* An SVG document, A4-width, with its title escaped correctly. */
	assert_int_equal(number(doc, "count(/s:svg)"), 1);
	s = string(doc, "string(/s:svg/@width)");
	assert_string_equal(s, "170mm");
	xmlFree(s);
	s = string(doc, "string(/s:svg/s:title)");
	assert_string_equal(s, "Test & chart");
	xmlFree(s);
	/* Two series, each a polyline with its legend title. */
	assert_int_equal(number(doc, "count(//s:g[@class='series'])"), 2);
	assert_int_equal(number(doc, "count(//s:g[@class='series']/s:polyline)"), 2);
	s = string(doc, "string(//s:g[@id='t1-series-1']/s:title)");
	assert_string_equal(s, "cold");
	xmlFree(s);
	/* The step series: 4 points become 7 (a corner between each pair),
	 * with a marker at each of the 4 data points. */
	s = string(doc, "string(//s:g[@id='t1-series-1']/s:polyline/@points)");
	{
		int n = 1;
		char *p;

		for (p = s; *p; p++)
			n += *p == ' ';
		assert_int_equal(n, 7);
	}
	xmlFree(s);
	assert_int_equal(number(doc, "count(//s:g[@id='t1-series-1']/s:circle)"), 4);
	/* Dashes tell the series apart without colour. */
	s = string(doc, "string(//s:g[@id='t1-series-1']/s:polyline/@stroke-dasharray)");
	assert_true(strlen(s) > 0);
	xmlFree(s);
	assert_int_equal(number(doc, "count(//s:g[@id='t1-series-0']/s:polyline/@stroke-dasharray)"), 0);
	/* Legend, reference lines, span, marker, note. */
	assert_int_equal(number(doc, "count(//s:g[@class='legend']/s:g)"), 2);
	assert_int_equal(number(doc, "count(//s:g[@class='hline'])"), 1);
	assert_int_equal(number(doc, "count(//s:g[@class='vline'])"), 1);
	assert_int_equal(number(doc, "count(//s:g[@class='span'])"), 1);
	assert_int_equal(number(doc, "count(//s:g[@class='marker']/s:path)"), 1);
	assert_int_equal(number(doc, "count(//s:text[.='note'])"), 1);
	assert_int_equal(number(doc, "count(//s:clipPath[@id='t1-plot'])"), 1);
	xmlFreeDoc(doc);
	hl_svg_chart_free(ch);
}

/* Heckbert (1990) nice ticks: x data 0..530 for about 8 ticks -> a step of
 * 75.7 rounds to 100, 0 to 600; y data 10..170 for about 7 -> 26.7 rounds
 * to 20, 0 to 180 (derived by hand from the 1-2-5 rule). */
static void
test_ticks(void **state)
{
	hl_svg_chart *ch = sample();
	xmlDocPtr doc = render(ch);

	(void)state;
	assert_int_equal(number(doc, "count(//s:g[@class='ticks']/s:text[@text-anchor='middle'])"), 7);
	assert_int_equal(number(doc, "count(//s:g[@class='ticks']/s:text[.='600'])"), 1);
	assert_int_equal(number(doc, "count(//s:g[@class='ticks']/s:text[.='180'])"), 1);
	assert_int_equal(number(doc, "count(//s:g[@class='ticks']/s:text[@text-anchor='end'])"), 10);
	assert_int_equal(number(doc, "count(//s:g[@class='ticks']/s:text[.='0'])"), 2);
	xmlFreeDoc(doc);
	hl_svg_chart_free(ch);
}

/* Where a point lands: x = 530 is 530/600 of the plot width from its left
 * edge (the vertical grid lines mark both ends). */
static void
test_mapping(void **state)
{
	hl_svg_chart *ch = sample();
	xmlDocPtr doc = render(ch);
	double left = number(doc, "//s:g[@class='grid']/s:line[1]/@x1");
	double right = number(doc, "//s:g[@class='grid']/s:line[7]/@x1");
	char *pts = string(doc, "string(//s:g[@id='t1-series-0']/s:polyline/@points)");
	char *last = strrchr(pts, ' ');
	double x = atof(last + 1);

	(void)state;
	assert_true(fabs(x - (left + (right - left) * 530.0 / 600.0)) < 0.02);
	xmlFree(pts);
	xmlFreeDoc(doc);
	hl_svg_chart_free(ch);
}

/* Large numbers get thin spaces between thousands and a true minus. */
static void
test_tick_text(void **state)
{
	static const double x[] = { -20000, 60000 };
	static const double y[] = { 0, 1 };
	hl_svg_style st = { HL_SVG_BLACK, HL_SVG_SOLID, 0, HL_SVG_MARK_NONE,
			    HL_SVG_STEP_NONE };
	hl_svg_chart *ch = hl_svg_chart_create(NULL, NULL, NULL);
	xmlDocPtr doc;

	(void)state;
	assert_int_equal(hl_svg_chart_add_series(ch, NULL, x, y, 2, &st), 0);
	doc = render(ch);
	assert_int_equal(number(doc, "count(//s:text[.='60\xe2\x80\x89" "000'])"), 1);
	assert_int_equal(number(doc, "count(//s:text[.='\xe2\x88\x92" "20\xe2\x80\x89" "000'])"), 1);
	assert_int_equal(number(doc, "count(//s:g[@class='legend'])"), 0);
	xmlFreeDoc(doc);
	hl_svg_chart_free(ch);
}

/* Inline into a larger document through the caller's writer. */
static void
test_inline(void **state)
{
	hl_svg_chart *ch = sample();
	xmlBufferPtr buf = xmlBufferCreate();
	xmlTextWriterPtr w = xmlNewTextWriterMemory(buf, 0);
	xmlDocPtr doc;

	(void)state;
	xmlTextWriterStartDocument(w, "1.0", "UTF-8", NULL);
	xmlTextWriterStartElement(w, BAD_CAST "div");
	assert_int_equal(hl_svg_chart_write(ch, w, NULL), HL_OK);
	xmlTextWriterEndElement(w);
	xmlTextWriterEndDocument(w);
	xmlFreeTextWriter(w);
	doc = xmlReadMemory((const char *)xmlBufferContent(buf),
			    xmlBufferLength(buf), "page.xml", NULL, 0);
	assert_non_null(doc);
	assert_int_equal(number(doc, "count(/div/s:svg)"), 1);
	xmlFreeDoc(doc);
	xmlBufferFree(buf);
	hl_svg_chart_free(ch);
}

int
main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_structure),
		cmocka_unit_test(test_ticks),
		cmocka_unit_test(test_mapping),
		cmocka_unit_test(test_tick_text),
		cmocka_unit_test(test_inline),
	};
	int rc = cmocka_run_group_tests(tests, NULL, NULL);

	xmlCleanupParser();
	return rc;
}
