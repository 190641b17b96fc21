/* measure.h - units of measure: the canonical ones and the others accepted.
 *
 * heatloom computes in one canonical set (case.h): temperatures in °C,
 * temperature differences in K, heat rates in kW, heat capacity flow rates in
 * kW/K, film coefficients in kW/(m²·K), areas in m², prices in currency per
 * MWh. A table column may give another unit of the same quantity
 * ("supply [°F]"); this module names the units it knows, converts a value to
 * the canonical unit and back, and holds every conversion factor with its
 * source in one place (measure.c).
 *
 * Spellings: a unit is matched after folding case, dropping blanks, the
 * multiplication dots (·, *, .), the hyphen, parentheses, a second '/', the
 * degree sign or the word "deg", and writing ² or ^2 as 2, so "W/(m²·K)",
 * "W/m2K" and "w/m^2/K" are one unit, and "°F", "degF" and "F" another.
 * A price unit is "CURRENCY/ENERGY" ("USD/MMBtu", "EUR/GJ", "/MWh"): the
 * currency word is free text and is handed back for display.
 *
 * The tables are static; nothing here allocates, prints or fails.
 */
#ifndef HL_MEASURE_H
#define HL_MEASURE_H

#include <stddef.h>

typedef enum {
	HL_QTY_NONE,   /* a count, a ratio, a name: takes no unit */
	HL_QTY_TEMP,   /* temperature, canonical °C */
	HL_QTY_DTEMP,  /* temperature difference, canonical K */
	HL_QTY_POWER,  /* heat rate (duty, load), canonical kW */
	HL_QTY_CP,     /* heat capacity flow rate, canonical kW/K */
	HL_QTY_HTC,    /* film or overall coefficient, canonical kW/(m²·K) */
	HL_QTY_AREA,   /* heat-transfer area, canonical m² */
	HL_QTY_PRICE,  /* price of heat, canonical currency per MWh */
	HL_QTY_COUNT
} hl_qty;

/* One unit: canonical = value · scale + offset. */
typedef struct {
	const char *symbol;  /* as shown: "°F", "Btu/(h·ft²·°F)" */
	const char *ascii;   /* folded spelling it is matched by */
	hl_qty qty;
	double scale;
	double offset;
} hl_measure;

/* The unit whose spelling text denotes for quantity q, or NULL. For a price
 * the currency word before the '/' is skipped; *currency (when not NULL)
 * receives it, blanks trimmed, "" when there is none. */
const hl_measure *hl_measure_find(hl_qty q, const char *text, char *currency,
				  size_t currency_size);

/* The canonical unit of q (scale 1, offset 0); NULL for HL_QTY_NONE. */
const hl_measure *hl_measure_canonical(hl_qty q);

/* The symbols accepted for q, as "°C, K, °F", into buf. */
void hl_measure_list(hl_qty q, char *buf, size_t size);

/* A word for q in messages: "temperature", "heat rate", … */
const char *hl_measure_what(hl_qty q);

/* value in unit m to the canonical unit, and back. */
double hl_measure_to_canonical(const hl_measure *m, double value);
double hl_measure_from_canonical(const hl_measure *m, double value);

/* Factors exported for the tests and the display layer: the exact
 * definitions the others are built from (measure.c cites them). */
#define HL_BTU_IT_J 1055.05585262   /* J per Btu_IT */
#define HL_FT2_M2 0.09290304        /* m² per ft² */
#define HL_DEGF_K (5.0 / 9.0)       /* K per °F of difference */

#endif
