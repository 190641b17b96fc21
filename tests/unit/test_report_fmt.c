/* test_report_fmt.c - the report's numbers: rounding, digit groups, units,
 * signs; and the HTML writer's end tags. */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <cmocka.h>

#include "html.h"
#include "report_fmt.h"

#define NN HL_NNBSP
#define NB HL_NBSP

static char buf[128];

/* Three significant figures, at most one decimal for duties: rounding to
 * significant figures is common practice, no source. */
static void
test_sig(void **state)
{
	(void)state;
	assert_string_equal(hl_report_fmt_sig(buf, sizeof buf, 978, 3, 1), "978");
	assert_string_equal(hl_report_fmt_sig(buf, sizeof buf, 5837, 3, 1), "5840");
	assert_string_equal(hl_report_fmt_sig(buf, sizeof buf, 464.25, 3, 1), "464");
	assert_string_equal(hl_report_fmt_sig(buf, sizeof buf, 33.76, 3, 1), "33.8");
	assert_string_equal(hl_report_fmt_sig(buf, sizeof buf, 0.4249, 3, 1), "0.4");
	assert_string_equal(hl_report_fmt_sig(buf, sizeof buf, 999.6, 3, 1), "1000");
	assert_string_equal(hl_report_fmt_sig(buf, sizeof buf, 20, 3, 1), "20.0");
	assert_string_equal(hl_report_fmt_sig(buf, sizeof buf, 0, 3, 1), "0");
	assert_string_equal(hl_report_fmt_sig(buf, sizeof buf, NAN, 3, 1), "0");
	assert_string_equal(hl_report_fmt_sig(buf, sizeof buf, 0.0123, 3, 4),
			    "0.0123");
}

/* Groups of three from five digits on, none for four: BIPM, The
 * International System of Units, 9th ed. (2019), §5.4.4. */
static void
test_groups(void **state)
{
	(void)state;
	assert_string_equal(hl_report_fmt_sig(buf, sizeof buf, 4050, 3, 0), "4050");
	assert_string_equal(hl_report_fmt_sig(buf, sizeof buf, 49200, 3, 0),
			    "49" NN "200");
	assert_string_equal(hl_report_fmt_sig(buf, sizeof buf, 196726, 3, 0),
			    "197" NN "000");
	assert_string_equal(hl_report_fmt_sig(buf, sizeof buf, 1234567, 3, 0),
			    "1" NN "230" NN "000");
	assert_string_equal(hl_report_fmt_fixed(buf, sizeof buf, 12345.678, 1),
			    "12" NN "345.7");
}

/* A minus sign, never "-0". */
static void
test_signs(void **state)
{
	(void)state;
	assert_string_equal(hl_report_fmt_fixed(buf, sizeof buf, -389.5, 2),
			    HL_MINUS "389.50");
	assert_string_equal(hl_report_fmt_fixed(buf, sizeof buf, -0.04, 1), "0.0");
	assert_string_equal(hl_report_fmt_sig(buf, sizeof buf, -12345, 3, 1),
			    HL_MINUS "12" NN "300");
}

static void
test_units(void **state)
{
	(void)state;
	assert_string_equal(hl_report_fmt_temp(buf, sizeof buf, 158), "158.0" NB "°C");
	assert_string_equal(hl_report_fmt_dt(buf, sizeof buf, 5.49), "5.5" NB "K");
	/* Duties and areas share one rule: 3 significant figures, at
	 * most one decimal, whole digits kept. */
	assert_string_equal(hl_report_fmt_duty(buf, sizeof buf, 5837), "5837" NB "kW");
	assert_string_equal(hl_report_fmt_duty(buf, sizeof buf, 12165.04), "12" HL_NNBSP "165" NB "kW");
	assert_string_equal(hl_report_fmt_duty(buf, sizeof buf, 33.84), "33.8" NB "kW");
	assert_string_equal(hl_report_fmt_area(buf, sizeof buf, 868.5967), "869" NB "m²");
	assert_string_equal(hl_report_fmt_area(buf, sizeof buf, 1.714), "1.7" NB "m²");
	assert_string_equal(hl_report_fmt_money(buf, sizeof buf, 311208.66, "EUR", 1),
			    "311" NN "000" NB "EUR/yr");
	assert_string_equal(hl_report_fmt_money(buf, sizeof buf, 703446.4, "EUR", 0),
			    "703" NN "000" NB "EUR");
	assert_string_equal(hl_report_fmt_money(buf, sizeof buf, 1500, "", 1),
			    "1500" NB "per year");
}

/* Non-void elements get an end tag even when empty (an HTML parser reads
 * "<td/>" as an open tag); void ones are self-closed; text is escaped. */
static void
test_html(void **state)
{
	hl_html *h = hl_html_create("en");
	char *out = NULL;
	size_t len = 0;
	FILE *fp = open_memstream(&out, &len);

	(void)state;
	assert_non_null(h);
	assert_non_null(fp);
	hl_html_start(h, "body", NULL);
	hl_html_elem(h, "td", "num", "");
	hl_html_void(h, "br", NULL, NULL);
	hl_html_elem(h, "p", NULL, "a < b & c");
	hl_html_end(h);
	hl_html_end(h);
	assert_int_equal(hl_html_finish(h, fp, NULL), HL_OK);
	fclose(fp);
	assert_non_null(strstr(out, "<!DOCTYPE html>"));
	assert_non_null(strstr(out, "<td class=\"num\"></td>"));
	assert_non_null(strstr(out, "<br/>"));
	assert_non_null(strstr(out, "<p>a &lt; b &amp; c</p>"));
	assert_null(strstr(out, "<?xml"));
	free(out);
	hl_html_free(h);
	hl_html_free(NULL);
}

int
main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_sig),
		cmocka_unit_test(test_groups),
		cmocka_unit_test(test_signs),
		cmocka_unit_test(test_units),
		cmocka_unit_test(test_html),
	};

	return cmocka_run_group_tests(tests, NULL, NULL);
}
