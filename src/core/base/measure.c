/* measure.c - the units heatloom reads and shows, and their factors.
 *
 * Every factor is built from exact definitions in NIST Special Publication
 * 811, 2008 edition (A. Thompson and B. N. Taylor, "Guide for the Use of the
 * International System of Units (SI)"), Appendix B.8 ("Factors for units
 * listed alphabetically"):
 *   - British thermal unit_IT: 1.055 055 852 62 E+03 J (footnote to B.8: the
 *     IT calorie 4.1868 J times 453.592 37 g/lb times 5/9 K/°F, exact);
 *   - square foot: 9.290 304 E-02 m² (exact);
 *   - degree Fahrenheit, temperature interval: 5/9 K (exact);
 *     temperature: t/°C = (t/°F − 32)/1.8; kelvin: t/°C = T/K − 273.15;
 *   - hour: 3.6 E+03 s; watt hour: 3.6 E+03 J (exact).
 * From these (SP 811, B.8 rows the tests check against): Btu_IT/h =
 * 2.930 711 E-01 W; Btu_IT/(h·ft²·°F) = 5.678 263 E+00 W/(m²·K). The
 * printed 7-figure values are quoted from memory; each agrees with the
 * exact definitions above to its last digit, which is what the tests
 * check.
 * MMBtu is 10^6 Btu_IT: the gas trade's unit, common practice, no source.
 */
#include <ctype.h>
#include <string.h>
#include <strings.h>

#include "measure.h"

#define BTU_H_KW (HL_BTU_IT_J / 3600.0 / 1000.0)     /* kW per Btu/h */
#define MWH_MMBTU (3.6e9 / (HL_BTU_IT_J * 1.0e6))     /* MMBtu per MWh */

/* Rows of one symbol are contiguous; the first row of a quantity is its
 * canonical unit. */
static const hl_measure table[] = {
	{ "°C", "c", HL_QTY_TEMP, 1.0, 0.0 },
	{ "°C", "celsius", HL_QTY_TEMP, 1.0, 0.0 },
	{ "K", "k", HL_QTY_TEMP, 1.0, -273.15 },
	{ "K", "kelvin", HL_QTY_TEMP, 1.0, -273.15 },
	{ "°F", "f", HL_QTY_TEMP, HL_DEGF_K, -32.0 * HL_DEGF_K },
	{ "°F", "fahrenheit", HL_QTY_TEMP, HL_DEGF_K, -32.0 * HL_DEGF_K },

	{ "K", "k", HL_QTY_DTEMP, 1.0, 0.0 },
	{ "K", "kelvin", HL_QTY_DTEMP, 1.0, 0.0 },
	{ "°C", "c", HL_QTY_DTEMP, 1.0, 0.0 },
	{ "°F", "f", HL_QTY_DTEMP, HL_DEGF_K, 0.0 },

	{ "kW", "kw", HL_QTY_POWER, 1.0, 0.0 },
	{ "MW", "mw", HL_QTY_POWER, 1.0e3, 0.0 },
	{ "W", "w", HL_QTY_POWER, 1.0e-3, 0.0 },
	{ "Btu/h", "btu/h", HL_QTY_POWER, BTU_H_KW, 0.0 },
	{ "MMBtu/h", "mmbtu/h", HL_QTY_POWER, 1.0e6 * BTU_H_KW, 0.0 },

	{ "kW/K", "kw/k", HL_QTY_CP, 1.0, 0.0 },
	{ "kW/K", "kw/c", HL_QTY_CP, 1.0, 0.0 },
	{ "MW/K", "mw/k", HL_QTY_CP, 1.0e3, 0.0 },
	{ "MW/K", "mw/c", HL_QTY_CP, 1.0e3, 0.0 },
	{ "W/K", "w/k", HL_QTY_CP, 1.0e-3, 0.0 },
	{ "W/K", "w/c", HL_QTY_CP, 1.0e-3, 0.0 },
	{ "Btu/(h·°F)", "btu/hf", HL_QTY_CP, BTU_H_KW / HL_DEGF_K, 0.0 },
	{ "MMBtu/(h·°F)", "mmbtu/hf", HL_QTY_CP, 1.0e6 * BTU_H_KW / HL_DEGF_K,
	  0.0 },

	{ "kW/(m²·K)", "kw/m2k", HL_QTY_HTC, 1.0, 0.0 },
	{ "kW/(m²·K)", "kw/m2c", HL_QTY_HTC, 1.0, 0.0 },
	{ "W/(m²·K)", "w/m2k", HL_QTY_HTC, 1.0e-3, 0.0 },
	{ "W/(m²·K)", "w/m2c", HL_QTY_HTC, 1.0e-3, 0.0 },
	{ "Btu/(h·ft²·°F)", "btu/hft2f", HL_QTY_HTC,
	  BTU_H_KW / HL_FT2_M2 / HL_DEGF_K, 0.0 },

	{ "m²", "m2", HL_QTY_AREA, 1.0, 0.0 },
	{ "ft²", "ft2", HL_QTY_AREA, HL_FT2_M2, 0.0 },
	{ "ft²", "sqft", HL_QTY_AREA, HL_FT2_M2, 0.0 },

	/* A price per MWh is canonical: per GJ is 3.6 times as much per MWh. */
	{ "/MWh", "/mwh", HL_QTY_PRICE, 1.0, 0.0 },
	{ "/kWh", "/kwh", HL_QTY_PRICE, 1.0e3, 0.0 },
	{ "/GJ", "/gj", HL_QTY_PRICE, 3.6, 0.0 },
	{ "/MMBtu", "/mmbtu", HL_QTY_PRICE, MWH_MMBTU, 0.0 },
};

#define NTABLE (sizeof table / sizeof table[0])

/* Append the folded form of s (see measure.h) to out. */
static void
fold(const char *s, char *out, size_t size)
{
	size_t n = 0;
	int slashes = 0;

	while (*s && n + 1 < size) {
		unsigned char c = (unsigned char)*s;

		if (c == 0xc2 && ((unsigned char)s[1] == 0xb7 ||
		    (unsigned char)s[1] == 0xb0)) {
			s += 2;                 /* middle dot, degree sign */
		} else if (c == 0xc2 && (unsigned char)s[1] == 0xb2) {
			out[n++] = '2';         /* superscript two */
			s += 2;
		} else if (strncasecmp(s, "deg", 3) == 0) {
			s += 3;
		} else if (n > 0 && out[n - 1] == '/' &&
		    strncasecmp(s, "hr", 2) == 0) {
			out[n++] = 'h';
			s += 2;
		} else if (c == '/' && slashes++ > 0) {
			s++;                    /* W/m2/K is W/(m2·K) */
		} else {
			if (!strchr(" \t*.-()^", c))
				out[n++] = (char)tolower(c);
			s++;
		}
	}
	out[n] = '\0';
}

/* Where a price's unit starts: after the '/' of "USD/MMBtu", or after
 * the word "per" of "EUR per MWh"; *cut is where the currency ends. NULL
 * when neither is there ("MWh": the unit alone). */
static const char *
unit_start(const char *text, const char **cut)
{
	const char *p = strchr(text, '/');

	if (p != NULL) {
		*cut = p;
		return p + 1;
	}
	for (p = text; *p; p++)
		if (strncasecmp(p, "per ", 4) == 0 && (p == text ||
		    p[-1] == ' ')) {
			*cut = p;
			return p + 4;
		}
	return NULL;
}

/* Split "USD/MMBtu" or "USD per MMBtu" into the currency "USD" and what
 * follows it, the unit. */
static const char *
split_currency(const char *text, char *currency, size_t size)
{
	const char *cut = NULL, *unit = unit_start(text, &cut);
	const char *a = text, *b;
	size_t n;

	if (unit == NULL) {
		if (currency != NULL && size > 0)
			currency[0] = '\0';
		return NULL;
	}
	b = cut;
	while (a < b && (*a == ' ' || *a == '\t'))
		a++;
	while (b > a && (b[-1] == ' ' || b[-1] == '\t'))
		b--;
	if (currency != NULL && size > 0) {
		n = (size_t)(b - a) < size - 1 ? (size_t)(b - a) : size - 1;
		memcpy(currency, a, n);
		currency[n] = '\0';
	}
	return unit;
}

const hl_measure *
hl_measure_find(hl_qty q, const char *text, char *currency,
		size_t currency_size)
{
	char key[128] = "";
	size_t i;

	if (currency != NULL && currency_size > 0)
		currency[0] = '\0';
	if (q == HL_QTY_PRICE) {
		const char *unit = split_currency(text, currency,
						  currency_size);

		key[0] = '/';
		fold(unit != NULL ? unit : text, key + 1, sizeof key - 1);
	} else {
		fold(text, key, sizeof key);
	}
	for (i = 0; i < NTABLE; i++)
		if (table[i].qty == q && strcmp(table[i].ascii, key) == 0)
			return &table[i];
	return NULL;
}

const hl_measure *
hl_measure_canonical(hl_qty q)
{
	size_t i;

	for (i = 0; i < NTABLE; i++)
		if (table[i].qty == q)
			return &table[i];
	return NULL;
}

void
hl_measure_list(hl_qty q, char *buf, size_t size)
{
	const char *last = NULL;
	size_t i;

	if (size == 0)
		return;
	buf[0] = '\0';
	for (i = 0; i < NTABLE; i++) {
		if (table[i].qty != q || (last && !strcmp(last, table[i].symbol)))
			continue;
		if (last != NULL)
			strncat(buf, ", ", size - strlen(buf) - 1);
		strncat(buf, table[i].symbol, size - strlen(buf) - 1);
		last = table[i].symbol;
	}
}

const char *
hl_measure_what(hl_qty q)
{
	static const char *const what[HL_QTY_COUNT] = {
		"plain number", "temperature", "temperature difference",
		"heat rate", "heat capacity flow rate",
		"heat transfer coefficient", "area", "price of heat"
	};

	return (unsigned)q < HL_QTY_COUNT ? what[q] : "quantity";
}

/* Linear conversion, canonical = value·scale + offset (NIST SP 811, 2008,
 * App. B.8 factors and temperature formulas). */
double
hl_measure_to_canonical(const hl_measure *m, double value)
{
	return m == NULL ? value : value * m->scale + m->offset;
}

/* The inverse, value = (canonical − offset)/scale. */
double
hl_measure_from_canonical(const hl_measure *m, double value)
{
	return m == NULL ? value : (value - m->offset) / m->scale;
}
