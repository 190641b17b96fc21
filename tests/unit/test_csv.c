/* test_csv.c - the CSV reader and the stream and utility tables. */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <cmocka.h>

#include "csv.h"
#include "number.h"
#include "tables.h"

static hl_csv *
open_str(const char *s)
{
	hl_csv *r = NULL;

	assert_int_equal(hl_csv_open_mem("t.csv", s, strlen(s), &r, NULL),
			 HL_OK);
	return r;
}

/* RFC 4180 (Shafranovich 2005), section 2: quoted fields may hold commas,
 * line breaks and doubled quotes. */
static void
test_rfc4180_quoting(void **state)
{
	hl_csv *r = open_str("a,\"b,c\",\"say \"\"hi\"\"\"\r\n\"two\nlines\",x,y\r\nlast,1,2");

	(void)state;
	assert_int_equal(hl_csv_next(r, NULL), 1);
	assert_int_equal(hl_csv_nfields(r), 3);
	assert_string_equal(hl_csv_field(r, 1), "b,c");
	assert_string_equal(hl_csv_field(r, 2), "say \"hi\"");
	assert_int_equal(hl_csv_next(r, NULL), 1);
	assert_string_equal(hl_csv_field(r, 0), "two\nlines");
	assert_int_equal(hl_csv_line(r), 2);
	assert_int_equal(hl_csv_next(r, NULL), 1);
	assert_int_equal(hl_csv_line(r), 4);
	assert_string_equal(hl_csv_field(r, 2), "2");
	assert_int_equal(hl_csv_next(r, NULL), 0);
	hl_csv_free(r);
}

static void
test_bom_comments_blank(void **state)
{
	hl_csv *r = open_str("\xef\xbb\xbf# plant data\n\nname , supply\n,,\n  H1 ,  150 \n");

	(void)state;
	assert_int_equal(hl_csv_next(r, NULL), 1);
	assert_string_equal(hl_csv_field(r, 0), "name");
	assert_int_equal(hl_csv_line(r), 3);
	assert_int_equal(hl_csv_next(r, NULL), 1);
	assert_string_equal(hl_csv_field(r, 0), "H1");
	assert_string_equal(hl_csv_field(r, 1), "150");
	assert_int_equal(hl_csv_line(r), 5);
	assert_int_equal(hl_csv_next(r, NULL), 0);
	hl_csv_free(r);
}

static void
test_semicolon_decimal_comma(void **state)
{
	hl_csv *r = open_str("name;supply;cp\nH1;150,5;2,25\n");
	double v;

	(void)state;
	assert_int_equal(hl_csv_decimal_comma(r), 1);
	assert_int_equal(hl_csv_next(r, NULL), 1);
	assert_int_equal(hl_csv_next(r, NULL), 1);
	assert_true(hl_parse_number(hl_csv_field(r, 1), 1, &v));
	assert_true(v == 150.5);
	hl_csv_free(r);
}

static void
test_errors(void **state)
{
	hl_csv *r = NULL;
	hl_error err;

	(void)state;
	r = open_str("a,\"open\n");
	assert_int_equal(hl_csv_next(r, &err), -1);
	assert_non_null(strstr(err.text, "never closed"));
	hl_csv_free(r);
	r = open_str("a,\"x\"y\n");
	assert_int_equal(hl_csv_next(r, &err), -1);
	assert_non_null(strstr(err.text, "after a closing quote"));
	hl_csv_free(r);
	assert_int_equal(hl_csv_open_mem("b.csv", "a\0b", 3, &r, &err),
			 HL_EINPUT);
	assert_non_null(strstr(err.text, "not a text file"));
	assert_int_equal(hl_csv_open_mem("b.csv", "a\xff", 2, &r, &err),
			 HL_EINPUT);
}

/* Plain decimals only: C99 strtod would also take inf, nan and hex. */
static void
test_parse_number(void **state)
{
	double v;

	(void)state;
	assert_true(hl_parse_number("-12.5e2", 0, &v) && v == -1250.0);
	assert_true(hl_parse_number(" 7 ", 0, &v) && v == 7.0);
	assert_true(hl_parse_number(".5", 0, &v) && v == 0.5);
	assert_false(hl_parse_number("inf", 0, &v));
	assert_false(hl_parse_number("nan", 0, &v));
	assert_false(hl_parse_number("0x10", 0, &v));
	assert_false(hl_parse_number("150 C", 0, &v));
	assert_false(hl_parse_number("1,5", 0, &v));
	assert_false(hl_parse_number("1e999", 0, &v));
	assert_false(hl_parse_number("", 0, &v));
	assert_false(hl_parse_number("-", 0, &v));
	assert_false(hl_parse_number("1e", 0, &v));
}

/* The fast path for short decimals must give exactly what glibc's strtod
 * gives (a correctly rounded reference: Debian's libc6); Clinger (1990)
 * proves the path exact, this checks the implementation. */
static void
test_parse_number_exact(void **state)
{
	/* %.0f %.1f %.3f %.6f %.9e %.14e %.4e %.15g, with literal formats */
	static const char conv[] = "ffffeeeg";
	static const int prec[] = { 0, 1, 3, 6, 9, 14, 4, 15 };
	unsigned long long x = 88172645463325252ull;
	int i, k;

	(void)state;
	for (i = 0; i < 20000; i++) {
		char buf[64];
		double want, got, v;

		x ^= x << 13;
		x ^= x >> 7;
		x ^= x << 17;
		v = (double)(x % 100000000000ull) /
		    (double)(1ull << (x % 40)) * ((x & 1) ? -1.0 : 1.0);
		for (k = 0; k < 8; k++) {
			if (conv[k] == 'f')
				snprintf(buf, sizeof buf, "%.*f", prec[k], v);
			else if (conv[k] == 'e')
				snprintf(buf, sizeof buf, "%.*e", prec[k], v);
			else
				snprintf(buf, sizeof buf, "%.*g", prec[k], v);
			want = strtod(buf, NULL);
			assert_true(hl_parse_number(buf, 0, &got));
			if (memcmp(&got, &want, sizeof got) != 0) {
				print_error("%s: got %.17g want %.17g\n", buf,
					    got, want);
				fail();
			}
		}
	}
}

static void
test_stream_table(void **state)
{
	static const char t[] =
		"Name,Supply,Target,CP,h,kind\n"
		"H1,170,60,3.0,0.8,hot\n"
		"C1,20,135,,,\n"
		"C1,135,160,2.0,,cold\n";
	static const char t2[] = "name,supply,target,duty\nC1,20,135,230\n";
	hl_case *c = hl_case_create();
	hl_error err;

	(void)state;
	/* C1's first row lacks cp: that row is an error. */
	assert_int_equal(hl_stream_table_read_mem(c, "s.csv", t, sizeof t - 1,
						  &err), HL_EINPUT);
	assert_int_equal(err.line, 3);
	hl_case_free(c);
	c = hl_case_create();
	assert_int_equal(hl_stream_table_read_mem(c, "s.csv", t2,
						  sizeof t2 - 1, &err), HL_OK);
	assert_int_equal(c->nstream, 1);
	assert_true(fabs(c->stream[0].seg[0].cp - 2.0) < 1e-15);
	hl_case_free(c);
}

static void
test_segmented(void **state)
{
	static const char t[] =
		"name,supply,target,cp\n"
		"C1,20,80,2.0\n"
		"C1,80,135,2.5\n"
		"H1,170,60,3\n";
	static const char bad[] =
		"name,supply,target,cp\n"
		"C1,20,80,2.0\n"
		"C1,90,135,2.5\n";
	hl_case *c = hl_case_create();
	hl_error err;

	(void)state;
	assert_int_equal(hl_stream_table_read_mem(c, "s.csv", t, sizeof t - 1,
						  &err), HL_OK);
	assert_int_equal(c->nstream, 2);
	assert_int_equal(c->stream[0].nseg, 2);
	assert_true(hl_stream_duty(&c->stream[0]) == 120.0 + 137.5);
	hl_case_free(c);
	c = hl_case_create();
	assert_int_equal(hl_stream_table_read_mem(c, "s.csv", bad,
						  sizeof bad - 1, &err),
			 HL_EINPUT);
	assert_int_equal(err.line, 3);
	assert_non_null(strstr(err.text, "does not chain"));
	hl_case_free(c);
}

static void
test_utility_table(void **state)
{
	static const char t[] =
		"name,kind,supply,target,price,max_load\n"
		"HP steam,hot,250,250,40,\n"
		"cooling water,cold,20,30,5,1000\n";
	hl_case *c = hl_case_create();
	hl_error err;

	(void)state;
	assert_int_equal(hl_utility_table_read_mem(c, "u.csv", t, sizeof t - 1,
						   &err), HL_OK);
	assert_int_equal(c->nutil, 2);
	assert_string_equal(c->util[0].name, "HP steam");
	assert_true(isnan(c->util[0].max_load));
	assert_true(c->util[1].max_load == 1000.0);
	assert_int_equal(c->util[1].kind, HL_COLD);
	hl_case_free(c);
}

int
main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_rfc4180_quoting),
		cmocka_unit_test(test_bom_comments_blank),
		cmocka_unit_test(test_semicolon_decimal_comma),
		cmocka_unit_test(test_errors),
		cmocka_unit_test(test_parse_number),
		cmocka_unit_test(test_parse_number_exact),
		cmocka_unit_test(test_stream_table),
		cmocka_unit_test(test_segmented),
		cmocka_unit_test(test_utility_table),
	};

	return cmocka_run_group_tests(tests, NULL, NULL);
}
