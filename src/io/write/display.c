/* display.c - the display unit system (display.h). */
#include <stdio.h>
#include <string.h>

#include "display.h"
#include "utf8.h"

static hl_unit_system system_now = HL_UNITS_SI;

/* The US unit of each quantity, by its symbol in measure.c. */
static const char *const us_symbol[HL_QTY_COUNT] = {
	NULL, "°F", "°F", "Btu/h", "Btu/(h·°F)", "Btu/(h·ft²·°F)", "ft²",
	"/MMBtu"
};

/* Decimals fewer than SI: about log10 of how much smaller the US unit is
 * (Btu/h: 3412 per kW; Btu/(h·°F): 1896 per kW/K; Btu/(h·ft²·°F): 176
 * per kW/(m²·K)); areas, temperatures and prices keep the SI count. */
static const int us_fewer[HL_QTY_COUNT] = { 0, 0, 0, 3, 3, 2, 0, 0 };

void
hl_display_set(hl_unit_system s)
{
	system_now = s;
}

hl_unit_system
hl_display_get(void)
{
	return system_now;
}

int
hl_display_parse(const char *word, hl_unit_system *out)
{
	if (strcmp(word, "si") == 0)
		*out = HL_UNITS_SI;
	else if (strcmp(word, "us") == 0)
		*out = HL_UNITS_US;
	else
		return -1;
	return 0;
}

static const hl_measure *
unit_of(hl_qty q)
{
	if (system_now == HL_UNITS_SI || q <= HL_QTY_NONE || q >= HL_QTY_COUNT)
		return NULL;
	return hl_measure_find(q, us_symbol[q], NULL, 0);
}

double
hl_show(hl_qty q, double v)
{
	return hl_measure_from_canonical(unit_of(q), v);
}

double
hl_unshow(hl_qty q, double v)
{
	return hl_measure_to_canonical(unit_of(q), v);
}

const char *
hl_show_unit(hl_qty q)
{
	static const char *const si_price = "per MWh", *const us_price =
		"per MMBtu";
	const hl_measure *m;

	if (q == HL_QTY_PRICE)
		return system_now == HL_UNITS_US ? us_price : si_price;
	m = system_now == HL_UNITS_US ? unit_of(q) : hl_measure_canonical(q);
	if (q == HL_QTY_DTEMP && system_now == HL_UNITS_SI)
		return "K";
	return m != NULL ? m->symbol : "";
}

int
hl_show_digits(hl_qty q, int si_digits)
{
	int d;

	if (system_now == HL_UNITS_SI || q <= HL_QTY_NONE || q >= HL_QTY_COUNT)
		return si_digits;
	d = si_digits - us_fewer[q];
	return d < 0 ? 0 : d;
}

void
hl_show_col(FILE *fp, const char *s, int width)
{
	int n = (int)hl_utf8_chars(s);

	for (; n < width; n++)
		fputc(' ', fp);
	fputs(s, fp);
}

void
hl_show_left(FILE *fp, const char *s, int width)
{
	int n = (int)hl_utf8_chars(s);

	fputs(s, fp);
	for (; n < width; n++)
		fputc(' ', fp);
}

const char *
hl_show_header(char *buf, size_t size, const char *name, hl_qty q)
{
	if (system_now == HL_UNITS_SI || q == HL_QTY_NONE)
		snprintf(buf, size, "%s", name);
	else if (q == HL_QTY_PRICE)
		snprintf(buf, size, "%s [/MMBtu]", name);
	else
		snprintf(buf, size, "%s [%s]", name, hl_show_unit(q));
	return buf;
}
