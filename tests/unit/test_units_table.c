/* test_units_table.c - the exchanger list reader of `heatloom size`. */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>
#include <stdio.h>
#include <string.h>
#include <cmocka.h>

#include "case.h"
#include "units_table.h"

#define HEAD "name,hot_in,hot_out,cold_in,cold_out,duty,hot_cp,cold_cp,u," \
	"h_hot,h_cold,type,fmin,xp,cost_a,cost_b,cost_c\n"

static hl_status
read_str(const char *s, hl_units_table **t, hl_error *err)
{
	hl_error_clear(err);
	return hl_units_table_read_mem("u.csv", s, strlen(s), t, err);
}

/* One row that must be refused at line 2 with words from its message. */
static void
refused(const char *row, const char *words)
{
	char buf[1024];
	hl_units_table *t = NULL;
	hl_error err;

	snprintf(buf, sizeof buf, "%s%s\n", HEAD, row);
	assert_int_equal(read_str(buf, &t, &err), HL_EINPUT);
	assert_null(t);
	assert_int_equal(err.line, 2);
	assert_string_equal(err.file, "u.csv");
	if (strstr(err.text, words) == NULL)
		fail_msg("'%s' not in '%s'", words, err.text);
	if (strncmp(err.text, "unit 'E1': ", 11) != 0)
		fail_msg("unit not named: '%s'", err.text);
}

static void
test_duty_routes(void **state)
{
	hl_units_table *t = NULL;
	hl_error err;
	const char *s = HEAD
		"# given duty; hot_cp only; both cp (600 and 602.5 kW)\n"
		"E1,150,90,30,80,500,,,0.4,,,,,,,,\n"
		"E2,150,90,30,80,,10,,0.4,,,counterflow,,,,,\n"
		"E3,150,90,30,80,,10,12.05,,1.0,,,0.75,0.8,1,2,0.5\n"
		"E4,150,150,30,80,500,,10,,1.0,2.0,,,,,,\n";

	(void)state;
	assert_int_equal(read_str(s, &t, &err), HL_OK);
	assert_int_equal(t->n, 4);
	assert_true(t->unit[0].duty == 500.0);
	assert_true(isnan(t->unit[0].duty_hot) && isnan(t->unit[0].duty_cold));
	assert_int_equal(t->unit[0].type, -1);
	assert_true(isnan(t->unit[0].fmin) && isnan(t->unit[0].cost_a));
	assert_true(t->unit[1].duty == 600.0);
	assert_int_equal(t->unit[1].type, HL_EXCH_COUNTERFLOW);
	/* Within 1 %: the mean of the two sides. */
	assert_true(fabs(t->unit[2].duty - 601.25) < 1e-9);
	assert_true(t->unit[2].duty_hot == 600.0);
	assert_true(fabs(t->unit[2].duty_cold - 602.5) < 1e-9);
	/* One h without u is left for the caller's default. */
	assert_true(isnan(t->unit[2].u) && t->unit[2].h_hot == 1.0 &&
	    isnan(t->unit[2].h_cold));
	assert_true(t->unit[2].fmin == 0.75 && t->unit[2].xp == 0.8);
	assert_true(t->unit[2].cost_c == 0.5);
	assert_int_equal(t->unit[2].line, 5);
	/* A condensing hot side with a duty and the cold side's cp. */
	assert_true(t->unit[3].duty == 500.0);
	assert_string_equal(t->unit[3].name, "E4");
	hl_units_table_free(t);
	hl_units_table_free(NULL);
}

/* The 1 % balance tolerance, on either side of it. */
static void
test_balance_tolerance(void **state)
{
	hl_units_table *t = NULL;
	hl_error err;

	(void)state;
	assert_int_equal(read_str(HEAD "E1,150,90,30,80,606,10,,0.4,,,,,,,,\n",
	    &t, &err), HL_OK);
	hl_units_table_free(t);
	refused("E1,150,90,30,80,606.1,10,,0.4,,,,,,,,", "600 kW");
	refused("E1,150,90,30,80,,10,11.8,0.4,,,,,,,,", "cold_cp 11.8 kW/K over 50 K");
	refused("E1,150,90,30,80,,,,0.4,,,,,,,,", "no duty");
	refused("E1,150,150,30,80,,10,,0.4,,,,,,,,", "does not change temperature");
	refused("E1,150,90,30,80,-5,,,0.4,,,,,,,,", "must be > 0");
}

static void
test_temperatures(void **state)
{
	(void)state;
	refused("E1,120,60,40,130,500,,,0.4,,,,,,,,", "not even a counterflow");
	refused("E1,150,30,40,100,500,,,0.4,,,,,,,,", "not even a counterflow");
	refused("E1,100,100,40,100,500,,,0.4,,,,,,,,", "not even a counterflow");
	refused("E1,60,120,20,40,500,,,0.4,,,,,,,,", "a hot stream cools");
	refused("E1,150,90,80,40,500,,,0.4,,,,,,,,", "a cold stream heats");
	refused("E1,150,,30,80,500,,,0.4,,,,,,,,", "'hot_out' is empty");
	refused("E1,150,90,-300,80,500,,,0.4,,,,,,,,", "outside -273.15..2000");
	refused("E1,150,90,3O,80,500,,,0.4,,,,,,,,", "'3O' is not a number");
}

static void
test_coefficients_and_rules(void **state)
{
	(void)state;
	refused("E1,150,90,30,80,500,,,,,,,,,,,", "no heat transfer coefficient");
	refused("E1,150,90,30,80,500,,,0.4,1,,,,,,,", "only one film coefficient");
	refused("E1,150,90,30,80,500,,,0.4,1,1,,,,,,", "20.0 % apart");
	refused("E1,150,90,30,80,500,,,0,,,,,,,,", "must be > 0");
	refused("E1,150,90,30,80,500,,,0.4,,,spiral,,,,,", "type 'spiral'");
	refused("E1,150,90,30,80,500,,,0.4,,,,1,,,,", "fmin 1");
	refused("E1,150,90,30,80,500,,,0.4,,,,,0,,,", "xp 0");
	refused("E1,150,90,30,80,500,,,0.4,,,,,,1,2,", "all three");
	refused("E1,150,90,30,80,500,,,0.4,,,,,,1,2,0", "cost_c > 0");
}

static void
test_list_errors(void **state)
{
	hl_units_table *t = NULL;
	hl_error err;

	(void)state;
	assert_int_equal(read_str(HEAD "A,150,90,30,80,500,,,0.4,,,,,,,,\n"
	    "B,150,90,30,80,500,,,0.4,,,,,,,,\nB,150,90,30,80,500,,,0.4,,,,,,,,\n"
	    "A,150,90,30,80,500,,,0.4,,,,,,,,\n", &t, &err), HL_EINPUT);
	assert_int_equal(err.line, 4);
	assert_non_null(strstr(err.text, "'B' appears again (first at line 3)"));
	assert_int_equal(read_str(HEAD, &t, &err), HL_EINPUT);
	assert_non_null(strstr(err.text, "no exchangers"));
	assert_int_equal(read_str("name,hot_in,hot_out,cold_in,u\nE1,1,2,3,4\n",
	    &t, &err), HL_EINPUT);
	assert_non_null(strstr(err.text, "missing column 'cold_out'"));
	assert_int_equal(read_str("name,hot_in,hot_out,cold_in,cold_out,duty\n"
	    "E1,150,90,30,80,500\n", &t, &err), HL_EINPUT);
	assert_non_null(strstr(err.text, "missing column 'u'"));
	assert_int_equal(read_str(HEAD ",150,90,30,80,500,,,0.4,,,,,,,,\n", &t,
	    &err), HL_EINPUT);
	assert_non_null(strstr(err.text, "without a name"));
	assert_null(t);
}

int
main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_duty_routes),
		cmocka_unit_test(test_balance_tolerance),
		cmocka_unit_test(test_temperatures),
		cmocka_unit_test(test_coefficients_and_rules),
		cmocka_unit_test(test_list_errors),
	};

	return cmocka_run_group_tests(tests, NULL, NULL);
}
