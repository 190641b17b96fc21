/* test_case_xml.c - the XML case file reader, its schema, and the network
 * table. Runs in tests/data ($TOP_SRCDIR/tests/data), so that file names in
 * messages read "good/…" and "bad/…" as on the command line. */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>
#include <cmocka.h>

#include <libxml/parser.h>
#include <libxml/relaxng.h>

#include "cascade.h"
#include "case_rng.h"
#include "case_xml.h"
#include "tables.h"

/* Exact decimal inputs read back: strtod's round trip is exact. */
#define assert_num(got, want) assert_true((got) == (want))

static hl_case *
read_ok(const char *path)
{
	hl_case *c = hl_case_create();
	hl_error err;

	assert_non_null(c);
	hl_error_clear(&err);
	if (hl_case_xml_read(c, path, &err) != HL_OK)
		fail_msg("%s: %s:%ld: %s", path, err.file, err.line, err.text);
	return c;
}

/* Read a file that must fail; returns the error for further checks. */
static hl_error
read_bad(const char *path, hl_status want)
{
	hl_case *c = hl_case_create();
	hl_error err;

	assert_non_null(c);
	hl_error_clear(&err);
	assert_int_equal(hl_case_xml_read(c, path, &err), want);
	assert_int_equal(err.status, want);
	hl_case_free(c);
	return err;
}

static void
assert_error(const hl_error *e, const char *file, long line, const char *text)
{
	assert_string_equal(e->file, file);
	assert_int_equal(e->line, line);
	if (strstr(e->text, text) == NULL)
		fail_msg("message '%s' lacks '%s'", e->text, text);
	assert_null(strchr(e->text, '\n'));
}

static void
test_inline_settings(void **state)
{
	hl_case *c = read_ok("good/case-inline.xml");
	const hl_settings *s = &c->set;

	(void)state;
	assert_num(s->dtmin, 12.5);
	assert_num(s->emat, 7.5);
	assert_num(s->hours, 8400.0);
	assert_num(s->h_default, 0.35);
	assert_num(s->fmin, 0.75);
	assert_num(s->xp, 0.85);
	assert_int_equal(s->exchanger, HL_EXCH_COUNTERFLOW);
	assert_num(s->interest, 0.08);
	assert_num(s->life, 15.0);
	assert_num(s->cp_tol, 0.1);
	assert_num(s->t_tol, 2.0);
	assert_num(s->time_limit, 30.0);
	assert_string_equal(s->currency, "GBP");
	assert_num(s->cost_a, 12000.0);
	assert_num(s->cost_b, 950.0);
	assert_num(s->cost_c, 0.81);
	assert_int_equal(s->area_policy, HL_AREAS_PENALISE);
	assert_num(s->area_penalty, 2.5);
	assert_null(c->source);
	hl_case_free(c);
}

static void
test_inline_streams(void **state)
{
	hl_case *c = read_ok("good/case-inline.xml");
	const hl_stream *s;

	(void)state;
	assert_int_equal(c->nstream, 4);
	/* An element's line is where its start tag ends (libxml2's). */
	s = &c->stream[0];
	assert_string_equal(s->name, "C1");
	assert_int_equal(s->kind, HL_COLD);
	assert_int_equal(s->nseg, 1);
	assert_num(s->seg[0].supply, 20.0);
	assert_num(s->seg[0].target, 135.0);
	assert_num(s->seg[0].cp, 2.0);
	assert_num(s->seg[0].h, 0.6);
	assert_string_equal(s->area, "north");
	assert_num(s->cp_tol, 0.02);
	assert_true(isnan(s->t_tol) && isnan(s->dt_contrib));
	assert_string_equal(s->file, "good/case-inline.xml");
	assert_int_equal(s->line, 14);
	s = &c->stream[1];
	assert_int_equal(s->kind, HL_HOT);
	assert_num(s->dt_contrib, 4.0);
	assert_num(s->t_tol, 0.5);
	assert_true(isnan(s->seg[0].h));
	assert_int_equal(s->line, 16);
	/* cp and duty together: they agree (4 kW/K x 60 K = 240 kW). */
	assert_num(c->stream[2].seg[0].cp, 4.0);
	assert_null(c->stream[2].area);
	/* A segmented stream: the stream's h fills in where a segment has
	 * none; cp of the second segment is its duty over its span. */
	s = &c->stream[3];
	assert_string_equal(s->name, "H2");
	assert_int_equal(s->kind, HL_HOT);
	assert_int_equal(s->nseg, 2);
	assert_int_equal(s->line, 18);
	assert_num(s->seg[0].supply, 150.0);
	assert_num(s->seg[0].target, 100.0);
	assert_num(s->seg[0].h, 1.1);
	assert_int_equal(s->seg[0].line, 19);
	assert_num(s->seg[1].supply, 100.0);
	assert_num(s->seg[1].target, 30.0);
	assert_num(s->seg[1].cp, 105.0 / 70.0);
	assert_num(s->seg[1].h, 0.9);
	assert_int_equal(s->seg[1].line, 20);
	hl_case_free(c);
}

static void
test_inline_utilities_rules_units(void **state)
{
	hl_case *c = read_ok("good/case-inline.xml");
	const hl_utility *u;
	const hl_match_rule *r;
	const hl_unit *x;

	(void)state;
	assert_int_equal(c->nutil, 2);
	u = &c->util[0];
	assert_string_equal(u->name, "steam");
	assert_int_equal(u->kind, HL_HOT);
	assert_num(u->supply, 180.0);
	assert_num(u->target, 180.0);
	assert_num(u->price, 31.5);
	assert_num(u->h, 4.0);
	assert_num(u->dt_contrib, 2.0);
	assert_true(isnan(u->max_load));
	assert_int_equal(u->line, 25);
	u = &c->util[1];
	assert_string_equal(u->name, "cooling water");
	assert_int_equal(u->kind, HL_COLD);
	assert_num(u->max_load, 500.0);
	assert_true(isnan(u->h));

	assert_int_equal(c->nrule, 3);
	r = &c->rule[0];
	assert_int_equal(r->kind, HL_RULE_FORBID);
	assert_string_equal(r->hot, "H2");
	assert_string_equal(r->cold, "C2");
	assert_string_equal(r->reason, "keep the H2 loop apart");
	assert_true(isnan(r->max_duty));
	assert_string_equal(r->file, "good/case-inline.xml");
	assert_int_equal(r->line, 30);
	r = &c->rule[1];
	assert_int_equal(r->kind, HL_RULE_REQUIRE);
	assert_string_equal(r->cold, "*");
	assert_null(r->reason);
	r = &c->rule[2];
	assert_int_equal(r->kind, HL_RULE_MAX_DUTY);
	assert_string_equal(r->hot, "*");
	assert_num(r->max_duty, 150.0);
	assert_int_equal(r->line, 32);

	assert_int_equal(c->nunit, 2);
	x = &c->unit[0];
	assert_string_equal(x->name, "E1");
	assert_string_equal(x->hot, "H1");
	assert_string_equal(x->cold, "C2");
	assert_num(x->duty, 240.0);
	assert_num(x->hot_in, 170.0);
	assert_num(x->hot_out, 90.0);
	assert_num(x->cold_in, 80.0);
	assert_num(x->cold_out, 140.0);
	assert_num(x->area, 31.5);
	assert_int_equal(x->shells, 2);
	assert_int_equal(x->line, 36);
	x = &c->unit[1];
	assert_true(isnan(x->hot_in) && isnan(x->cold_out) && isnan(x->area));
	assert_int_equal(x->shells, 0);
	hl_case_free(c);
}

/* The four-stream problem read from a case file with a segmented stream:
 * at dtmin 10 K, QHmin 20 kW and QCmin 60 kW (Linnhoff et al., User Guide
 * on Process Integration, IChemE 1982; Kemp, Pinch Analysis and Process
 * Integration, 2nd ed., 2007, ch. 2; from memory, confirmed by a hand
 * cascade, as in tests/data/good/kemp4.csv). */
static void
test_kemp4_targets(void **state)
{
	hl_case *c = read_ok("good/kemp4.xml");
	hl_error err;
	double qh, qc;

	(void)state;
	hl_error_clear(&err);
	assert_int_equal(hl_case_validate(c, &err), HL_OK);
	assert_int_equal(hl_cascade_targets(c, c->set.dtmin, &qh, &qc, &err),
			 HL_OK);
	assert_true(fabs(qh - 20.0) <= 1e-9);
	assert_true(fabs(qc - 60.0) <= 1e-9);
	assert_int_equal(c->stream[3].nseg, 2);
	assert_num(hl_stream_duty(&c->stream[3]), 180.0);
	hl_case_free(c);
}

/* Tables referenced by the case file are found beside it, and each row
 * keeps the table's own file and line. */
static void
test_referenced_tables(void **state)
{
	hl_case *c = read_ok("good/case-tables.xml");
	hl_case *csv = hl_case_create();
	size_t i;

	(void)state;
	assert_int_equal(hl_stream_table_read(csv, "good/kemp4.csv", NULL),
			 HL_OK);
	assert_int_equal(c->nstream, csv->nstream);
	for (i = 0; i < c->nstream; i++) {
		assert_string_equal(c->stream[i].name, csv->stream[i].name);
		assert_num(hl_stream_duty(&c->stream[i]),
			   hl_stream_duty(&csv->stream[i]));
		assert_string_equal(c->stream[i].file, "good/kemp4.csv");
		assert_int_equal(c->stream[i].line, csv->stream[i].line);
	}
	assert_int_equal(c->nutil, 2);
	assert_string_equal(c->util[1].file, "good/kemp4-utilities.csv");
	assert_num(c->util[1].max_load, 500.0);
	assert_int_equal(c->nunit, 5);
	assert_string_equal(c->unit[0].file, "good/kemp4-network.csv");
	assert_int_equal(c->unit[0].line, 6);
	assert_int_equal(c->unit[0].shells, 2);
	assert_true(isnan(c->unit[1].area));
	assert_int_equal(c->unit[1].shells, 0);
	assert_string_equal(c->unit[4].hot, "steam");
	assert_num(c->unit[4].area, 8.25);
	hl_case_free(csv);
	hl_case_free(c);
}

static void
test_mem_base_dir(void **state)
{
	static const char doc[] =
		"<case version='1'>\n"
		"  <streams file='kemp4.csv'/>\n"
		"  <streams>\n"
		"    <stream name='  steam   trace ' supply=' 95 ' target='94'"
		" cp='1e1'/>\n"
		"  </streams>\n"
		"</case>\n";
	hl_case *c = hl_case_create();
	hl_error err;

	(void)state;
	hl_error_clear(&err);
	assert_int_equal(hl_case_xml_read_mem(c, "mem.xml", doc,
		sizeof doc - 1, "good", &err), HL_OK);
	assert_int_equal(c->nstream, 5);
	assert_string_equal(c->stream[0].file, "good/kemp4.csv");
	/* Blanks are trimmed and collapsed, as the schema's tokens are. */
	assert_string_equal(c->stream[4].name, "steam trace");
	assert_num(c->stream[4].seg[0].supply, 95.0);
	assert_num(c->stream[4].seg[0].cp, 10.0);
	assert_int_equal(c->stream[4].line, 4);
	assert_string_equal(c->stream[4].file, "mem.xml");
	hl_case_free(c);
}

/* Schema errors, reported at the element with the attribute and unit. */
static void
test_schema_errors(void **state)
{
	hl_error e;

	(void)state;
	e = read_bad("bad/xml-unknown-element.xml", HL_EINPUT);
	assert_error(&e, "bad/xml-unknown-element.xml", 8,
		     "unknown element <forbidden> in <matches>");
	e = read_bad("bad/xml-unknown-attribute.xml", HL_EINPUT);
	assert_error(&e, "bad/xml-unknown-attribute.xml", 4,
		     "<stream> has no attribute 'fouling'");
	e = read_bad("bad/xml-missing-attribute.xml", HL_EINPUT);
	assert_error(&e, "bad/xml-missing-attribute.xml", 8,
		     "<utility> lacks the attribute 'price' (currency per MWh)");
	e = read_bad("bad/xml-non-numeric.xml", HL_EINPUT);
	assert_error(&e, "bad/xml-non-numeric.xml", 4,
		     "attribute 'cp' of <stream>: 'three' is not a number");
	assert_non_null(strstr(e.text, "kW/K"));
	e = read_bad("bad/xml-unit-in-number.xml", HL_EINPUT);
	assert_error(&e, "bad/xml-unit-in-number.xml", 3, "'10 K' is not a "
		     "number");
	e = read_bad("bad/xml-order.xml", HL_EINPUT);
	assert_error(&e, "bad/xml-order.xml", 6, "<streams> after <utilities>");
	e = read_bad("bad/xml-version.xml", HL_EINPUT);
	assert_error(&e, "bad/xml-version.xml", 2, "version '2' is not "
		     "supported");
}

static void
test_missing_csv(void **state)
{
	hl_error e = read_bad("bad/xml-missing-csv.xml", HL_EINPUT);

	(void)state;
	assert_error(&e, "bad/xml-missing-csv.xml", 7, "utility table "
		     "'no-such-utilities.csv' not found (looked for "
		     "bad/no-such-utilities.csv)");
	/* An error inside a referenced table points into that table. */
	e = read_bad("bad/xml-bad-csv-row.xml", HL_EINPUT);
	assert_error(&e, "bad/unit-in-cell.csv", 2, "column 'supply'");
}

/* The "billion laughs" (ten levels of tenfold entities) and an external
 * entity are refused at their declaration, before anything is expanded or
 * read: common practice, no source. */
static void
test_entities_refused(void **state)
{
	hl_error e;

	(void)state;
	e = read_bad("bad/xml-bomb.xml", HL_EINPUT);
	assert_error(&e, "bad/xml-bomb.xml", 3, "declares the entity 'a'");
	e = read_bad("bad/xml-external-entity.xml", HL_EINPUT);
	assert_error(&e, "bad/xml-external-entity.xml", 3,
		     "declares the entity 'secret'");
	assert_null(strstr(e.text, "root:"));
	e = read_bad("bad/xml-parameter-entity.xml", HL_EINPUT);
	assert_error(&e, "bad/xml-parameter-entity.xml", 3,
		     "declares the entity 'remote'");
}

static void
test_not_well_formed(void **state)
{
	static const char trailing[] = "<case version='1'/>\n<case/>";
	hl_case *c = hl_case_create();
	hl_error e;

	(void)state;
	e = read_bad("bad/xml-not-well-formed.xml", HL_EINPUT);
	assert_error(&e, "bad/xml-not-well-formed.xml", 6,
		     "not well-formed XML: Opening and ending tag mismatch");
	e = read_bad("bad/xml-not-utf8.xml", HL_EINPUT);
	assert_error(&e, "bad/xml-not-utf8.xml", 4, "not UTF-8");
	e = read_bad("no-such-case.xml", HL_EINPUT);
	assert_error(&e, "no-such-case.xml", 0, "cannot open");
	assert_int_equal(hl_case_xml_read_mem(c, "t.xml", trailing,
		sizeof trailing - 1, NULL, &e), HL_EINPUT);
	assert_error(&e, "t.xml", 2, "Extra content");
	assert_int_equal(hl_case_xml_read_mem(c, "t.xml", "", 0, NULL, &e),
			 HL_EINPUT);
	assert_error(&e, "t.xml", 0, "empty");
	hl_case_free(c);
}

/* libxml2 dates elements past line 65535 only with XML_PARSE_BIG_LINES. */
static void
test_big_line_numbers(void **state)
{
	const size_t blank = 70000;
	const char head[] = "<case version='1'>";
	const char tail[] = "<streams><stream name='a' cp='x'/></streams></case>";
	size_t len = sizeof head - 1 + blank + sizeof tail - 1;
	char *doc = malloc(len);
	hl_case *c = hl_case_create();
	hl_error e;

	(void)state;
	assert_non_null(doc);
	memcpy(doc, head, sizeof head - 1);
	memset(doc + sizeof head - 1, '\n', blank);
	memcpy(doc + sizeof head - 1 + blank, tail, sizeof tail - 1);
	assert_int_equal(hl_case_xml_read_mem(c, "big.xml", doc, len, NULL,
					      &e), HL_EINPUT);
	assert_error(&e, "big.xml", 70001, "attribute 'cp' of <stream>");
	free(doc);
	hl_case_free(c);
}

static int handler_calls;

static void
my_handler(void *data, xmlErrorPtr e)
{
	(void)data;
	(void)e;
	handler_calls++;
}

/* Nothing reaches stderr, and the caller's libxml2 handler is back after
 * the call. */
static void
test_quiet_and_restored(void **state)
{
	static const char *const bad[] = {
		"bad/xml-bomb.xml", "bad/xml-not-well-formed.xml",
		"bad/xml-unknown-element.xml", "bad/xml-not-utf8.xml",
		"bad/xml-namespace.xml", "bad/xml-second-settings.xml",
	};
	char path[] = "/tmp/heatloom-stderr-XXXXXX";
	int fd = mkstemp(path), saved;
	size_t i;
	long size;
	FILE *f;

	(void)state;
	assert_true(fd >= 0);
	fflush(stderr);
	saved = dup(2);
	assert_true(saved >= 0 && dup2(fd, 2) == 2);
	xmlSetStructuredErrorFunc(NULL, my_handler);
	for (i = 0; i < sizeof bad / sizeof bad[0]; i++)
		read_bad(bad[i], HL_EINPUT);
	assert_true(xmlStructuredError == my_handler);
	xmlSetStructuredErrorFunc(NULL, NULL);
	fflush(stderr);
	dup2(saved, 2);
	close(saved);
	close(fd);
	f = fopen(path, "rb");
	assert_non_null(f);
	fseek(f, 0, SEEK_END);
	size = ftell(f);
	fclose(f);
	unlink(path);
	assert_int_equal(size, 0);
	assert_int_equal(handler_calls, 0);
}

static void
quiet_handler(void *data, xmlErrorPtr e)
{
	(void)data;
	(void)e;
}

static int
schema_accepts(const char *path)
{
	xmlRelaxNGParserCtxtPtr pc;
	xmlRelaxNGPtr schema;
	xmlRelaxNGValidCtxtPtr vc;
	xmlDocPtr doc;
	int rc;

	pc = xmlRelaxNGNewMemParserCtxt(hl_case_rng, (int)hl_case_rng_len);
	schema = xmlRelaxNGParse(pc);
	xmlRelaxNGFreeParserCtxt(pc);
	assert_non_null(schema);
	doc = xmlReadFile(path, NULL, XML_PARSE_NONET | XML_PARSE_NOERROR |
			  XML_PARSE_NOWARNING);
	assert_non_null(doc);
	vc = xmlRelaxNGNewValidCtxt(schema);
	xmlRelaxNGSetValidStructuredErrors(vc, quiet_handler, NULL);
	rc = xmlRelaxNGValidateDoc(vc, doc);
	xmlRelaxNGFreeValidCtxt(vc);
	xmlFreeDoc(doc);
	xmlRelaxNGFree(schema);
	assert_true(rc >= 0);
	return rc == 0;
}

/* The schema and the element readers agree: what the readers refuse as a
 * matter of form, the schema refuses too; what the schema lets through is
 * left to the readers' checks of content. */
static void
test_schema_agrees(void **state)
{
	static const char *const good[] = {
		"good/kemp4.xml", "good/case-inline.xml", "good/case-tables.xml",
	};
	static const char *const form[] = {
		"bad/xml-unknown-element.xml", "bad/xml-unknown-attribute.xml",
		"bad/xml-missing-attribute.xml", "bad/xml-non-numeric.xml",
		"bad/xml-unit-in-number.xml", "bad/xml-version.xml",
		"bad/xml-wrong-root.xml", "bad/xml-order.xml",
		"bad/xml-text-content.xml", "bad/xml-empty-streams.xml",
		"bad/xml-bad-choice.xml", "bad/xml-negative-amount.xml",
		"bad/xml-shells-fraction.xml", "bad/xml-file-and-children.xml",
		"bad/xml-namespace.xml", "bad/xml-second-settings.xml",
		"bad/xml-no-streams.xml",
	};
	static const char *const content[] = {
		"bad/xml-segments-and-ends.xml", "bad/xml-cp-duty-disagree.xml",
		"bad/xml-no-cp-duty.xml", "bad/xml-kind-contradicts.xml",
		"bad/xml-penalty-without-penalise.xml",
		"bad/xml-missing-csv.xml", "bad/xml-duplicate-stream.xml",
	};
	size_t i;

	(void)state;
	for (i = 0; i < sizeof good / sizeof good[0]; i++)
		if (!schema_accepts(good[i]))
			fail_msg("schema refuses %s", good[i]);
	for (i = 0; i < sizeof form / sizeof form[0]; i++) {
		if (schema_accepts(form[i]))
			fail_msg("schema accepts %s", form[i]);
		read_bad(form[i], HL_EINPUT);
	}
	for (i = 0; i < sizeof content / sizeof content[0]; i++)
		if (!schema_accepts(content[i]))
			fail_msg("schema refuses %s", content[i]);
}

static void
test_network_table(void **state)
{
	static const char good[] =
		"Name,HOT,cold,duty,area,shells\n"
		"E1,H1,C1,200,25.5,3\n"
		"E2,steam,C1,80,,\n";
	hl_case *c = hl_case_create();
	hl_error e;

	(void)state;
	hl_error_clear(&e);
	assert_int_equal(hl_network_table_read_mem(c, "n.csv", good,
		sizeof good - 1, &e), HL_OK);
	assert_int_equal(c->nunit, 2);
	assert_string_equal(c->unit[0].name, "E1");
	assert_num(c->unit[0].duty, 200.0);
	assert_num(c->unit[0].area, 25.5);
	assert_int_equal(c->unit[0].shells, 3);
	assert_int_equal(c->unit[0].line, 2);
	assert_string_equal(c->unit[0].file, "n.csv");
	assert_true(isnan(c->unit[0].hot_in) && isnan(c->unit[1].area));
	assert_int_equal(c->unit[1].shells, 0);
	hl_case_free(c);
}

static void
network_bad(const char *csv, long line, const char *text)
{
	hl_case *c = hl_case_create();
	hl_error e;

	hl_error_clear(&e);
	assert_int_equal(hl_network_table_read_mem(c, "n.csv", csv,
		strlen(csv), &e), HL_EINPUT);
	assert_error(&e, "n.csv", line, text);
	hl_case_free(c);
}

static void
test_network_errors(void **state)
{
	(void)state;
	network_bad("name,hot,cold,duty\nE1,H1,C1,0\n", 2, "duty must be > 0");
	network_bad("name,hot,cold,duty\nE1,H1,C1,-5\n", 2, "duty must be > 0");
	network_bad("name,hot,cold\nE1,H1,C1\n", 1, "missing column 'duty'");
	network_bad("name,hot,cold,duty,shells\nE1,H1,C1,5,2.0\n", 2,
		    "shells '2.0' is not a whole number");
	network_bad("name,hot,cold,duty,shells\nE1,H1,C1,5,1001\n", 2,
		    "shells '1001' is not a whole number from 1 to 1000");
	network_bad("name,hot,cold,duty,area\nE1,H1,C1,5,0\n", 2,
		    "area must be > 0");
	network_bad("name,hot,cold,duty\n,H1,C1,5\n", 2, "without a name");
	network_bad("name,hot,cold,duty\nE1,,C1,5\n", 2, "column 'hot' is "
		    "empty");
	network_bad("name,hot,cold,duty,hot_in\nE1,H1,C1,5,hot\n", 2,
		    "column 'hot_in': 'hot' is not a number");
	network_bad("name,hot,cold,duty\n", 1, "header but no exchangers");
}

static void
test_parse_count(void **state)
{
	long n = 0;

	(void)state;
	assert_true(hl_parse_count("1", &n) && n == 1);
	assert_true(hl_parse_count(" +12 ", &n) && n == 12);
	assert_true(hl_parse_count("1000", &n) && n == 1000);
	assert_false(hl_parse_count("0", &n));
	assert_false(hl_parse_count("1001", &n));
	assert_false(hl_parse_count("99999999999999999999", &n));
	assert_false(hl_parse_count("-1", &n));
	assert_false(hl_parse_count("2.0", &n));
	assert_false(hl_parse_count("", &n));
	assert_false(hl_parse_count("3 4", &n));
}

/* The whole of a file (the manual), NUL-terminated. */
static char *
slurp(const char *path)
{
	FILE *f = fopen(path, "rb");
	char *buf;
	long n;

	assert_non_null(f);
	fseek(f, 0, SEEK_END);
	n = ftell(f);
	rewind(f);
	buf = malloc((size_t)n + 1);
	assert_non_null(buf);
	assert_int_equal(fread(buf, 1, (size_t)n, f), (size_t)n);
	buf[n] = '\0';
	fclose(f);
	return buf;
}

/* The examples of doc/case-file.md read as the manual says, so that the
 * manual cannot drift from the reader. */
static void
test_manual_examples(void **state)
{
	char *doc = slurp("../../doc/case-file.md");
	char *x = strstr(doc, "```xml\n"), *end, *csv, *p, *q;
	hl_case *c = hl_case_create();
	hl_error e;

	(void)state;
	hl_error_clear(&e);
	assert_non_null(x);
	x += 7;
	end = strstr(x, "```");
	assert_non_null(end);
	if (hl_case_xml_read_mem(c, "example.xml", x, (size_t)(end - x),
				 NULL, &e) != HL_OK ||
	    hl_case_validate(c, &e) != HL_OK)
		fail_msg("manual example: %s:%ld: %s", e.file, e.line, e.text);
	assert_int_equal(c->nstream, 5);
	assert_int_equal(c->stream[3].nseg, 2);
	assert_num(c->stream[3].seg[1].cp, 3.2);
	assert_num(c->stream[2].seg[0].cp, 20.0);
	assert_int_equal(c->nutil, 3);
	assert_int_equal(c->nrule, 3);
	assert_int_equal(c->nunit, 3);
	assert_int_equal(c->set.area_policy, HL_AREAS_PENALISE);
	hl_case_free(c);

	/* The network table: the indented block after its heading. */
	csv = strstr(doc, "## Network table (CSV)");
	assert_non_null(csv);
	csv = strstr(csv, "\n    name,");
	assert_non_null(csv);
	for (p = q = csv + 1; strncmp(p, "    ", 4) == 0; ) {
		p += 4;
		while (*p != '\n' && *p != '\0')
			*q++ = *p++;
		if (*p == '\n')
			*q++ = *p++;
	}
	c = hl_case_create();
	assert_int_equal(hl_network_table_read_mem(c, "example.csv", csv + 1,
		(size_t)(q - csv - 1), &e), HL_OK);
	assert_int_equal(c->nunit, 3);
	assert_num(c->unit[0].duty, 1008.0);
	assert_int_equal(c->unit[0].shells, 1);
	hl_case_free(c);
	free(doc);
}

static int
enter_data(void **state)
{
	const char *top = getenv("TOP_SRCDIR");
	char dir[4096];

	(void)state;
	snprintf(dir, sizeof dir, "%s/tests/data", top ? top : ".");
	return chdir(dir);
}

static int
leave(void **state)
{
	(void)state;
	xmlCleanupParser();
	return 0;
}

int
main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_inline_settings),
		cmocka_unit_test(test_inline_streams),
		cmocka_unit_test(test_inline_utilities_rules_units),
		cmocka_unit_test(test_kemp4_targets),
		cmocka_unit_test(test_referenced_tables),
		cmocka_unit_test(test_mem_base_dir),
		cmocka_unit_test(test_schema_errors),
		cmocka_unit_test(test_missing_csv),
		cmocka_unit_test(test_entities_refused),
		cmocka_unit_test(test_not_well_formed),
		cmocka_unit_test(test_big_line_numbers),
		cmocka_unit_test(test_quiet_and_restored),
		cmocka_unit_test(test_schema_agrees),
		cmocka_unit_test(test_network_table),
		cmocka_unit_test(test_network_errors),
		cmocka_unit_test(test_parse_count),
		cmocka_unit_test(test_manual_examples),
	};

	return cmocka_run_group_tests(tests, enter_data, leave);
}
