/* network_table.c - reading today's exchangers from a CSV table. */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "plausible.h"
#include "table.h"
#include "tables.h"

enum { N_NAME, N_HOT, N_COLD, N_DUTY, N_HOT_IN, N_HOT_OUT, N_COLD_IN,
       N_COLD_OUT, N_AREA, N_SHELLS, N_TYPE, N_COUNT };

static const char *const columns[N_COUNT] = {
	"name", "hot", "cold", "duty", "hot_in", "hot_out", "cold_in",
	"cold_out", "area", "shells", "type"
};

static const hl_qty qty[N_COUNT] = {
	HL_QTY_NONE, HL_QTY_NONE, HL_QTY_NONE, HL_QTY_POWER, HL_QTY_TEMP,
	HL_QTY_TEMP, HL_QTY_TEMP, HL_QTY_TEMP, HL_QTY_AREA, HL_QTY_NONE,
	HL_QTY_NONE
};

int
hl_parse_count(const char *s, long *out)
{
	long v = 0;
	int digits = 0;

	while (*s == ' ' || *s == '\t')
		s++;
	if (*s == '+')
		s++;
	for (; *s >= '0' && *s <= '9'; s++) {
		v = v * 10 + (*s - '0');
		if (v > HL_COUNT_MAX)
			return 0;
		digits++;
	}
	while (*s == ' ' || *s == '\t')
		s++;
	if (digits == 0 || *s != '\0' || v < 1)
		return 0;
	*out = v;
	return 1;
}

/* The name, hot and cold columns must not be blank. */
static hl_status
read_names(hl_table *t, hl_unit *u, hl_error *err)
{
	u->name = (char *)hl_table_text(t, N_NAME);
	u->hot = (char *)hl_table_text(t, N_HOT);
	u->cold = (char *)hl_table_text(t, N_COLD);
	if (u->name[0] == '\0')
		return hl_error_set(err, HL_EINPUT, u->file, u->line,
			"exchanger without a name; give each unit a name in "
			"column 'name'");
	if (u->hot[0] == '\0' || u->cold[0] == '\0')
		return hl_error_set(err, HL_EINPUT, u->file, u->line,
			"unit '%s': column '%s' is empty; name the %s stream or "
			"utility the unit serves", u->name,
			u->hot[0] == '\0' ? "hot" : "cold",
			u->hot[0] == '\0' ? "hot" : "cold");
	return HL_OK;
}

static hl_status
read_numbers(hl_table *t, hl_unit *u, hl_error *err)
{
	static const int which[] = { N_DUTY, N_HOT_IN, N_HOT_OUT, N_COLD_IN,
				     N_COLD_OUT, N_AREA };
	double *dst[] = { &u->duty, &u->hot_in, &u->hot_out, &u->cold_in,
			  &u->cold_out, &u->area };
	size_t i;
	hl_status st;

	for (i = 0; i < sizeof which / sizeof which[0]; i++) {
		st = hl_table_number(t, (size_t)which[i], dst[i], err);
		if (st != HL_OK)
			return st;
		if (!isnan(*dst[i]) && !isfinite(*dst[i]))
			return hl_error_set(err, HL_EINPUT, u->file, u->line,
				"column '%s' is out of range",
				columns[which[i]]);
	}
	if (isnan(u->duty))
		return hl_error_set(err, HL_EINPUT, u->file, u->line,
			"unit '%s': duty is missing; give the heat it "
			"exchanges today in kW", u->name);
	if (!(u->duty > 0.0))
		return hl_error_set(err, HL_EINPUT, u->file, u->line,
			"unit '%s': duty must be > 0 kW", u->name);
	hl_doubt_duty(u->file, u->line, "duty", u->duty);
	if (!isnan(u->area) && !(u->area > 0.0))
		return hl_error_set(err, HL_EINPUT, u->file, u->line,
			"unit '%s': area must be > 0 m² (leave the cell empty "
			"when unknown)", u->name);
	return HL_OK;
}

static hl_status
read_shells(hl_table *t, hl_unit *u, hl_error *err)
{
	const char *s = hl_table_text(t, N_SHELLS);
	long n;

	u->shells = 0;
	if (s[0] == '\0')
		return HL_OK;
	if (!hl_parse_count(s, &n))
		return hl_error_set(err, HL_EINPUT, u->file, u->line,
			"unit '%s': shells '%.40s' is not a whole number from "
			"1 to %d; give the number of shells in series, or "
			"leave the cell empty", u->name, s, HL_COUNT_MAX);
	u->shells = (int)n;
	return HL_OK;
}

/* The optional exchanger type of the unit. */
static hl_status
read_type(hl_table *t, hl_unit *u, hl_error *err)
{
	const char *s = hl_table_text(t, N_TYPE);

	if (s[0] == '\0')
		return HL_OK;
	u->type = hl_exchanger_type_parse(s);
	if (u->type < 0)
		return hl_error_set(err, HL_EINPUT, u->file, u->line,
			"unit '%s': type '%.40s' is not one of shell-and-tube, "
			"counterflow, plate, double-pipe, air-cooler, "
			"fired-heater", u->name, s);
	u->type_given = 1;
	return HL_OK;
}

static hl_status
read_unit(hl_table *t, hl_unit *u, hl_error *err)
{
	hl_status st;

	memset(u, 0, sizeof *u);
	u->file = (char *)hl_table_file(t);
	u->line = hl_table_line(t);
	st = read_names(t, u, err);
	if (st == HL_OK)
		st = read_numbers(t, u, err);
	if (st == HL_OK)
		st = read_shells(t, u, err);
	if (st == HL_OK)
		st = read_type(t, u, err);
	return st;
}

static hl_status
read_table(hl_case *c, hl_table *t, hl_error *err)
{
	static const int required[] = { N_NAME, N_HOT, N_COLD, N_DUTY };
	hl_status st = HL_OK;
	size_t i;
	int rc, rows = 0;

	for (i = 0; i < 4 && st == HL_OK; i++)
		st = hl_table_require(t, (size_t)required[i], err);
	while (st == HL_OK && (rc = hl_table_next(t, err)) != 0) {
		hl_unit u;

		if (rc < 0) {
			st = err ? err->status : HL_EINPUT;
			break;
		}
		rows++;
		st = read_unit(t, &u, err);
		if (st == HL_OK)
			st = hl_case_add_unit(c, &u, err);
	}
	if (st == HL_OK && rows == 0)
		st = hl_error_set(err, HL_EINPUT, hl_table_file(t),
			t->header_line, "the network table has a header but no "
			"exchangers");
	hl_table_close(t);
	return st;
}

hl_status
hl_network_table_read(hl_case *c, const char *path, hl_error *err)
{
	hl_table t;
	hl_status st;

	st = hl_table_open(&t, path, "network table", columns, qty, N_COUNT,
			   err);
	if (st != HL_OK)
		return st;
	return read_table(c, &t, err);
}

hl_status
hl_network_table_read_mem(hl_case *c, const char *name, const char *data,
			  size_t len, hl_error *err)
{
	hl_table t;
	hl_status st;

	st = hl_table_open_mem(&t, name, data, len, "network table", columns,
			       qty, N_COUNT, err);
	if (st != HL_OK)
		return st;
	return read_table(c, &t, err);
}
