/* utility_table.c - reading utility levels from a CSV table. */
#include <math.h>
#include <stdlib.h>
#include <string.h>
#include <strings.h>

#include "plausible.h"
#include "read_warn.h"
#include "table.h"
#include "tables.h"

enum { U_NAME, U_KIND, U_SUPPLY, U_TARGET, U_PRICE, U_H, U_MAX, U_DTC,
       U_TYPE, U_COST_A, U_COST_B, U_COST_C, U_COUNT };

static const char *const columns[U_COUNT] = {
	"name", "kind", "supply", "target", "price", "h", "max_load",
	"dt_contrib", "type", "cost_a", "cost_b", "cost_c"
};

static const hl_qty qty[U_COUNT] = {
	HL_QTY_NONE, HL_QTY_NONE, HL_QTY_TEMP, HL_QTY_TEMP, HL_QTY_PRICE,
	HL_QTY_HTC, HL_QTY_POWER, HL_QTY_DTEMP, HL_QTY_NONE, HL_QTY_NONE,
	HL_QTY_NONE, HL_QTY_NONE
};

/* The optional exchanger type and cost law of the units on a utility. */
static hl_status
read_equipment(hl_table *t, hl_utility *u, hl_error *err)
{
	const char *ty = hl_table_text(t, U_TYPE);
	double *dst[] = { &u->cost_a, &u->cost_b, &u->cost_c };
	int given = 0;
	size_t i;
	hl_status st = HL_OK;

	if (ty[0] != '\0') {
		u->type = hl_exchanger_type_parse(ty);
		if (u->type < 0)
			return hl_error_set(err, HL_EINPUT, u->file, u->line,
				"utility '%s': type '%.40s' is not one of "
				"shell-and-tube, counterflow, plate, "
				"double-pipe, air-cooler, fired-heater",
				u->name, ty);
		u->type_given = 1;
	}
	for (i = 0; st == HL_OK && i < 3; i++) {
		st = hl_table_number(t, U_COST_A + i, dst[i], err);
		given += st == HL_OK && !isnan(*dst[i]);
	}
	if (st != HL_OK)
		return st;
	if (given != 0 && given != 3)
		return hl_error_set(err, HL_EINPUT, u->file, u->line,
			"utility '%s': give all three of cost_a, cost_b, "
			"cost_c (cost a + b·X^c of each unit on it) or none",
			u->name);
	u->cost_given = given == 3;
	return HL_OK;
}

static hl_status
read_kind(hl_table *t, hl_utility *u, hl_error *err)
{
	const char *k = hl_table_text(t, U_KIND);

	if (strcasecmp(k, "hot") == 0)
		u->kind = HL_HOT;
	else if (strcasecmp(k, "cold") == 0)
		u->kind = HL_COLD;
	else
		return hl_error_set(err, HL_EINPUT, hl_table_file(t),
			hl_table_line(t), "utility '%s': kind '%.40s' is "
			"neither 'hot' (heats the process) nor 'cold' (cools "
			"it)", u->name, k);
	return HL_OK;
}

static hl_status
read_utility(hl_table *t, hl_utility *u, hl_error *err)
{
	static const int which[] = { U_SUPPLY, U_TARGET, U_PRICE, U_H, U_MAX,
				     U_DTC };
	double *dst[] = { &u->supply, &u->target, &u->price, &u->h,
			  &u->max_load, &u->dt_contrib };
	size_t i;
	hl_status st;

	memset(u, 0, sizeof *u);
	u->name = (char *)hl_table_text(t, U_NAME);
	u->file = (char *)hl_table_file(t);
	u->line = hl_table_line(t);
	if (u->name[0] == '\0')
		return hl_error_set(err, HL_EINPUT, u->file, u->line,
			"utility without a name");
	st = read_kind(t, u, err);
	for (i = 0; st == HL_OK && i < sizeof which / sizeof which[0]; i++)
		st = hl_table_number(t, (size_t)which[i], dst[i], err);
	if (st != HL_OK)
		return st;
	if (isnan(u->supply) || isnan(u->target))
		return hl_error_set(err, HL_EINPUT, u->file, u->line,
			"utility '%s': supply and target temperatures are both "
			"required (equal for condensing steam or a boiling "
			"refrigerant)", u->name);
	if (isnan(u->price))
		return hl_error_set(err, HL_EINPUT, u->file, u->line,
			"utility '%s': price is missing (currency per MWh; 0 "
			"for a free utility)", u->name);
	hl_doubt_htc(u->file, u->line, "h", u->h);
	hl_doubt_duty(u->file, u->line, "max_load", u->max_load);
	return read_equipment(t, u, err);
}

/* A price header's currency word ("price [USD/MMBtu]") labels the case's
 * money. It replaces the default label; beside another label the case set,
 * the table wins with a warning, since its prices are in its currency. */
static hl_status
take_currency(hl_case *c, const hl_table *t, hl_error *err)
{
	const char *now = c->set.currency;
	char *d;

	if (t->currency[0] == '\0' ||
	    (now != NULL && strcmp(now, t->currency) == 0))
		return HL_OK;
	if (now != NULL && strcmp(now, "EUR") != 0)
		hl_read_warn(hl_table_file(t), t->header_line, "prices are in "
			"%s but the case's currency is %s: money is shown in "
			"%s", t->currency, now, t->currency);
	d = strdup(t->currency);
	if (d == NULL)
		return hl_error_nomem(err);
	free(c->set.currency);
	c->set.currency = d;
	return HL_OK;
}

static hl_status
read_table(hl_case *c, hl_table *t, hl_error *err)
{
	static const int required[] = { U_NAME, U_KIND, U_SUPPLY, U_TARGET,
					U_PRICE };
	hl_status st = HL_OK;
	size_t i;
	int rc, rows = 0;

	for (i = 0; i < 5 && st == HL_OK; i++)
		st = hl_table_require(t, (size_t)required[i], err);
	if (st == HL_OK)
		st = take_currency(c, t, err);
	while (st == HL_OK && (rc = hl_table_next(t, err)) != 0) {
		hl_utility u;

		if (rc < 0) {
			st = err ? err->status : HL_EINPUT;
			break;
		}
		rows++;
		st = read_utility(t, &u, err);
		if (st == HL_OK)
			st = hl_case_add_utility(c, &u, err);
	}
	if (st == HL_OK && rows == 0)
		st = hl_error_set(err, HL_EINPUT, hl_table_file(t),
			t->header_line, "the utility table has a header but no "
			"utilities");
	hl_table_close(t);
	return st;
}

hl_status
hl_utility_table_read(hl_case *c, const char *path, hl_error *err)
{
	hl_table t;
	hl_status st;

	st = hl_table_open(&t, path, "utility table", columns, qty, U_COUNT,
			   err);
	if (st != HL_OK)
		return st;
	return read_table(c, &t, err);
}

hl_status
hl_utility_table_read_mem(hl_case *c, const char *name, const char *data,
			  size_t len, hl_error *err)
{
	hl_table t;
	hl_status st;

	st = hl_table_open_mem(&t, name, data, len, "utility table", columns,
			       qty, U_COUNT, err);
	if (st != HL_OK)
		return st;
	return read_table(c, &t, err);
}
