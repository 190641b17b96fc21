/* test_measure.c - units of measure: factors, spellings, table headers and
 * the warnings for values that look like another unit. */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <cmocka.h>

#include "display.h"
#include "measure.h"
#include "read_warn.h"
#include "tables.h"
#include "units_table.h"

/* A factor printed to 7 significant figures agrees with ours within half
 * its last digit. */
static void
assert_printed(double ours, double printed)
{
	assert_true(fabs(ours - printed) <= 0.5e-6 * fabs(printed));
}

static double
factor(hl_qty q, const char *unit)
{
	const hl_measure *m = hl_measure_find(q, unit, NULL, 0);

	assert_non_null(m);
	return m->scale;
}

/* NIST Special Publication 811 (Thompson and Taylor, 2008), Appendix B.8,
 * "Factors for units listed alphabetically":
 *   British thermal unit_IT per hour -> watt          2.930 711 E-01
 *   Btu_IT per hour square foot degree Fahrenheit
 *                       -> watt per square meter kelvin 5.678 263 E+00
 *   square foot -> square meter                        9.290 304 E-02
 *   British thermal unit_IT -> joule                   1.055 056 E+03
 *   degree Fahrenheit (interval) -> kelvin             5.555 556 E-01
 *   watt hour -> joule                                 3.6 E+03
 * The rows are quoted from memory; the Btu_IT (1055.055 852 62 J exactly)
 * and the 5.678 263 row agree with secondary sources consulted. */
static void
test_nist_factors(void **state)
{
	(void)state;
	assert_printed(factor(HL_QTY_POWER, "Btu/h") * 1e3, 2.930711e-1);
	assert_printed(factor(HL_QTY_HTC, "Btu/(h·ft²·°F)") * 1e3, 5.678263);
	assert_printed(factor(HL_QTY_AREA, "ft²"), 9.290304e-2);
	assert_printed(HL_BTU_IT_J, 1.055056e3);
	assert_printed(factor(HL_QTY_DTEMP, "°F"), 5.555556e-1);
	/* Btu_IT/(h·°F): the Btu/h row divided by the °F interval row. */
	assert_printed(factor(HL_QTY_CP, "Btu/(h·°F)") * 1e3,
		       2.930711e-1 / 5.555556e-1);
	/* Per GJ to per MWh: one MWh is 3.6 E+03 J/(W·h) x 1e6 W·h = 3.6 GJ. */
	assert_true(factor(HL_QTY_PRICE, "EUR/GJ") == 3.6);
	/* Per MMBtu to per MWh: 3.6e9 J / 1.055 056e9 J = 3.412 142 MMBtu. */
	assert_printed(factor(HL_QTY_PRICE, "USD/MMBtu"), 3.412142);
	assert_true(factor(HL_QTY_POWER, "MW") == 1e3);
	assert_true(factor(HL_QTY_CP, "W/K") == 1e-3);
	assert_true(factor(HL_QTY_HTC, "W/(m²·K)") == 1e-3);
}

/* NIST SP 811 (2008), Appendix B.8: t/°C = (t/°F − 32)/1.8 and
 * t/°C = T/K − 273.15; a °F difference is 5/9 K, no offset. */
static void
test_temperatures(void **state)
{
	const hl_measure *f = hl_measure_find(HL_QTY_TEMP, "°F", NULL, 0);
	const hl_measure *k = hl_measure_find(HL_QTY_TEMP, "K", NULL, 0);
	const hl_measure *df = hl_measure_find(HL_QTY_DTEMP, "degF", NULL, 0);

	(void)state;
	assert_true(fabs(hl_measure_to_canonical(f, 212.0) - 100.0) < 1e-12);
	assert_true(fabs(hl_measure_to_canonical(f, -40.0) + 40.0) < 1e-12);
	assert_true(fabs(hl_measure_to_canonical(k, 273.15)) < 1e-12);
	assert_true(fabs(hl_measure_to_canonical(df, 18.0) - 10.0) < 1e-12);
	assert_true(fabs(hl_measure_from_canonical(f, 100.0) - 212.0) < 1e-12);
}

static void
test_spellings(void **state)
{
	static const struct { hl_qty q; const char *text, *symbol; } ok[] = {
		{ HL_QTY_TEMP, "degC", "°C" }, { HL_QTY_TEMP, "C", "°C" },
		{ HL_QTY_TEMP, " °F ", "°F" }, { HL_QTY_TEMP, "kelvin", "K" },
		{ HL_QTY_HTC, "W/m2K", "W/(m²·K)" },
		{ HL_QTY_HTC, "w/m^2/K", "W/(m²·K)" },
		{ HL_QTY_HTC, "BTU/hr-ft2-F", "Btu/(h·ft²·°F)" },
		{ HL_QTY_HTC, "kW/(m2.K)", "kW/(m²·K)" },
		{ HL_QTY_CP, "Btu/(hr*degF)", "Btu/(h·°F)" },
		{ HL_QTY_CP, "KW/K", "kW/K" },
		{ HL_QTY_POWER, "MMBtu/hr", "MMBtu/h" },
		{ HL_QTY_AREA, "sq ft", "ft²" },
	};
	char cur[32];
	size_t i;

	(void)state;
	for (i = 0; i < sizeof ok / sizeof ok[0]; i++) {
		const hl_measure *m = hl_measure_find(ok[i].q, ok[i].text,
						      NULL, 0);

		assert_non_null(m);
		assert_string_equal(m->symbol, ok[i].symbol);
	}
	assert_null(hl_measure_find(HL_QTY_TEMP, "°R", NULL, 0));
	assert_null(hl_measure_find(HL_QTY_CP, "kW", NULL, 0));
	assert_null(hl_measure_find(HL_QTY_NONE, "kW", NULL, 0));
	assert_non_null(hl_measure_find(HL_QTY_PRICE, " US dollar / MMBtu",
					cur, sizeof cur));
	assert_string_equal(cur, "US dollar");
	assert_non_null(hl_measure_find(HL_QTY_PRICE, "EUR per GJ", cur,
					sizeof cur));
	assert_string_equal(cur, "EUR");
	assert_non_null(hl_measure_find(HL_QTY_PRICE, "per MWh", cur,
					sizeof cur));
	assert_string_equal(cur, "");
	assert_non_null(hl_measure_find(HL_QTY_PRICE, "MMBtu", NULL, 0));
}

static const char us[] =
	"name,supply [°F],target [°F],cp [Btu/(h·°F)],h [W/(m²·K)],"
	"dt_contrib [°F]\n"
	"H1,356,140,3790.5,800,9\n";

static void
test_stream_table_units(void **state)
{
	hl_case *c = hl_case_create();
	hl_error err;

	(void)state;
	assert_int_equal(hl_stream_table_read_mem(c, "s.csv", us,
						  sizeof us - 1, &err), HL_OK);
	assert_true(fabs(c->stream[0].seg[0].supply - 180.0) < 1e-12);
	assert_true(fabs(c->stream[0].seg[0].target - 60.0) < 1e-12);
	/* 3790.5 Btu/(h·°F) x 5.275 279e-4 kW/K = 2.000 kW/K. */
	assert_true(fabs(c->stream[0].seg[0].cp - 2.0) < 1e-3);
	assert_true(fabs(c->stream[0].seg[0].h - 0.8) < 1e-12);
	assert_true(fabs(c->stream[0].dt_contrib - 5.0) < 1e-12);
	hl_case_free(c);
}

static void
test_unknown_unit(void **state)
{
	static const char t[] = "# plant\nname,supply [°R],target,cp\n"
		"H1,600,100,2\n";
	static const char kind[] = "name,supply,target,cp,kind [K]\n"
		"H1,150,100,2,hot\n";
	hl_case *c = hl_case_create();
	hl_error err;

	(void)state;
	assert_int_equal(hl_stream_table_read_mem(c, "s.csv", t, sizeof t - 1,
						  &err), HL_EINPUT);
	assert_string_equal(err.file, "s.csv");
	assert_int_equal(err.line, 2);
	assert_non_null(strstr(err.text, "column 2 'supply [°R]'"));
	assert_non_null(strstr(err.text, "°C, K, °F"));
	hl_case_free(c);
	c = hl_case_create();
	assert_int_equal(hl_stream_table_read_mem(c, "s.csv", kind,
						  sizeof kind - 1, &err),
			 HL_EINPUT);
	assert_non_null(strstr(err.text, "takes no unit"));
	hl_case_free(c);
}

/* Collects warnings for the tests. */
static char warned[4096];

static void
collect(void *ctx, const char *file, long line, const char *text)
{
	size_t n = strlen(warned);

	(void)ctx;
	snprintf(warned + n, sizeof warned - n, "%s:%ld: %s\n", file, line,
		 text);
}

static void
read_warnings(const char *t)
{
	hl_case *c = hl_case_create();
	hl_error err;

	warned[0] = '\0';
	hl_read_warn_handler(collect, NULL);
	assert_int_equal(hl_stream_table_read_mem(c, "s.csv", t, strlen(t),
						  &err), HL_OK);
	hl_read_warn_handler(NULL, NULL);
	hl_case_free(c);
}

/* The heuristics of plausible.h (common practice, no source). */
static void
test_warnings(void **state)
{
	(void)state;
	read_warnings("name,supply,target,cp,h\nH1,180,60,2000,0.8\n"
		      "C1,20,150,14000,800\n");
	assert_null(strstr(warned, "s.csv:2:"));
	assert_non_null(strstr(warned, "s.csv:3: cp 14000 kW/K"));
	assert_non_null(strstr(warned, "s.csv:3: h 800 kW/(m²·K)"));
	/* Kelvin: every temperature at 250 or above, no unit given. */
	read_warnings("name,supply,target,cp\nH1,453,333,2\nC1,293,423,3\n");
	assert_non_null(strstr(warned, "s.csv:1: every supply and target"));
	/* The same with the unit written: no doubt left. */
	read_warnings("name,supply [K],target [K],cp\nH1,453,333,2\n"
		      "C1,293,423,3\n");
	assert_string_equal(warned, "");
	/* A latent load over 2 K may have a large cp; a kW value under a W
	 * header is far too small. */
	read_warnings("name,supply,target,cp,h [W/m2K]\nC1,148,150,9000,0.8\n");
	assert_null(strstr(warned, "cp 9000"));
	assert_non_null(strstr(warned, "h 0.0008 kW/(m²·K)"));
	/* A duty in W. */
	read_warnings("name,supply,target,duty\nH1,180,60,5e9\n");
	assert_non_null(strstr(warned, "duty 5e+09 kW"));
}

static void
test_utility_price_units(void **state)
{
	static const char t[] = "name,kind,supply [°F],target [°F],"
		"price [USD/MMBtu],max_load [MMBtu/h]\n"
		"gas,hot,1832,482,4,10\n";
	hl_case *c = hl_case_create();
	hl_error err;

	(void)state;
	assert_int_equal(hl_utility_table_read_mem(c, "u.csv", t, sizeof t - 1,
						   &err), HL_OK);
	assert_true(fabs(c->util[0].supply - 1000.0) < 1e-9);
	assert_true(fabs(c->util[0].target - 250.0) < 1e-9);
	/* 4 USD/MMBtu x 3.412 142 MMBtu/MWh = 13.648 57 USD/MWh. */
	assert_true(fabs(c->util[0].price - 13.64857) < 1e-5);
	assert_true(fabs(c->util[0].max_load - 2930.711) < 1e-3);
	assert_string_equal(c->set.currency, "USD");
	hl_case_free(c);
}

static void
test_exchanger_list_units(void **state)
{
	static const char t[] = "name,hot_in [°F],hot_out [°F],cold_in [°F],"
		"cold_out [°F],duty [Btu/h],u [Btu/(h·ft²·°F)]\n"
		"E1,392,212,86,176,3412141.6,88.055\n";
	hl_units_table *ut = NULL;
	hl_error err;

	(void)state;
	assert_int_equal(hl_units_table_read_mem("x.csv", t, sizeof t - 1, &ut,
						 &err), HL_OK);
	assert_true(fabs(ut->unit[0].hot_in - 200.0) < 1e-9);
	assert_true(fabs(ut->unit[0].cold_out - 80.0) < 1e-9);
	assert_true(fabs(ut->unit[0].duty - 1000.0) < 1e-3);
	/* 88.055 x 5.678 263e-3 = 0.5000 kW/(m²·K). */
	assert_true(fabs(ut->unit[0].u - 0.5) < 1e-4);
	hl_units_table_free(ut);
}

/* The display layer: SI passes values through untouched; US converts with
 * the same factors (NIST SP 811, 2008, App. B.8) and back. */
static void
test_display(void **state)
{
	char h[64];

	(void)state;
	hl_display_set(HL_UNITS_SI);
	assert_true(hl_show_t(158.0) == 158.0);
	assert_true(hl_show_q(978.0) == 978.0);
	assert_string_equal(HL_SYM_DT, "K");
	assert_string_equal(hl_show_header(h, sizeof h, "hot", HL_QTY_TEMP),
			    "hot");
	assert_int_equal(HL_DIG_Q(1), 1);
	hl_display_set(HL_UNITS_US);
	assert_true(fabs(hl_show_t(100.0) - 212.0) < 1e-12);
	assert_true(fabs(hl_show_dt(10.0) - 18.0) < 1e-12);
	/* 1 kW = 1/2.930 711e-4 Btu/h = 3412.142 Btu/h. */
	assert_printed(hl_show_q(1.0), 3412.142);
	/* 1 m² = 1/0.092 903 04 ft² = 10.763 91 ft². */
	assert_printed(hl_show_a(1.0), 10.76391);
	assert_printed(hl_show_h(1.0), 1e3 / 5.678263);
	assert_true(fabs(hl_unshow(HL_QTY_TEMP, hl_show_t(37.5)) - 37.5) <
		    1e-12);
	assert_string_equal(HL_SYM_T, "°F");
	assert_string_equal(HL_SYM_CP, "Btu/(h·°F)");
	assert_string_equal(hl_show_header(h, sizeof h, "duty", HL_QTY_POWER),
			    "duty [Btu/h]");
	/* What the writers print, the readers take back. */
	assert_non_null(hl_measure_find(HL_QTY_HTC, HL_SYM_H, NULL, 0));
	assert_non_null(hl_measure_find(HL_QTY_PRICE, "/MMBtu", NULL, 0));
	assert_int_equal(HL_DIG_Q(1), 0);
	hl_display_set(HL_UNITS_SI);
}

int
main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_nist_factors),
		cmocka_unit_test(test_temperatures),
		cmocka_unit_test(test_spellings),
		cmocka_unit_test(test_stream_table_units),
		cmocka_unit_test(test_unknown_unit),
		cmocka_unit_test(test_warnings),
		cmocka_unit_test(test_utility_price_units),
		cmocka_unit_test(test_exchanger_list_units),
		cmocka_unit_test(test_display),
	};

	return cmocka_run_group_tests(tests, NULL, NULL);
}
