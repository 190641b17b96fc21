/* display.h - the units results are shown in: SI (canonical) or US.
 *
 * The core computes in the canonical units of measure.h. A writer that
 * prints a quantity passes it through hl_show() and labels it with
 * hl_show_unit(), so that `--units us` changes every text, CSV, SVG and
 * report output at once; XML results stay canonical and never call these.
 *
 *	quantity                 SI          US customary
 *	temperature              °C          °F
 *	temperature difference   K           °F (5/9 K each)
 *	heat rate                kW          Btu/h
 *	heat capacity flow rate  kW/K        Btu/(h·°F)
 *	coefficient              kW/(m²·K)   Btu/(h·ft²·°F)
 *	area                     m²          ft²
 *	price of heat            per MWh     per MMBtu
 *
 * Factors are measure.c's (NIST SP 811, 2008, Appendix B.8). The setting is
 * one per process, made once by the command before it writes anything.
 */
#ifndef HL_DISPLAY_H
#define HL_DISPLAY_H

#include <stddef.h>
#include <stdio.h>

#include "measure.h"

typedef enum { HL_UNITS_SI, HL_UNITS_US } hl_unit_system;

void hl_display_set(hl_unit_system s);
hl_unit_system hl_display_get(void);
/* "si" or "us" to the system; 0 on success, -1 for another word. */
int hl_display_parse(const char *word, hl_unit_system *out);

/* A canonical value of q in the display unit. */
double hl_show(hl_qty q, double v);
/* A display value of q back to the canonical unit (for the tests). */
double hl_unshow(hl_qty q, double v);
/* The display unit's symbol: "°C", "Btu/h", "per MWh", … */
const char *hl_show_unit(hl_qty q);
/* Decimals to print: the SI writer's count, fewer where the US unit is
 * much smaller (Btu/h is 1/3412 kW), never below 0. */
int hl_show_digits(hl_qty q, int si_digits);
/* A CSV header cell: name in SI (the contract of doc/formats.md); "name
 * [unit]" in US, which heatloom's own readers take back. */
const char *hl_show_header(char *buf, size_t size, const char *name,
			   hl_qty q);

/* Print s right-aligned in width characters (not bytes: "°F" is two). */
void hl_show_col(FILE *fp, const char *s, int width);
/* The same left-aligned. */
void hl_show_left(FILE *fp, const char *s, int width);

/* Shorthands for the writers: a value and its unit symbol per quantity. */
static inline double hl_show_t(double v) { return hl_show(HL_QTY_TEMP, v); }
static inline double hl_show_dt(double v) { return hl_show(HL_QTY_DTEMP, v); }
static inline double hl_show_q(double v) { return hl_show(HL_QTY_POWER, v); }
static inline double hl_show_cp(double v) { return hl_show(HL_QTY_CP, v); }
static inline double hl_show_h(double v) { return hl_show(HL_QTY_HTC, v); }
static inline double hl_show_a(double v) { return hl_show(HL_QTY_AREA, v); }
static inline double hl_show_p(double v) { return hl_show(HL_QTY_PRICE, v); }
#define HL_SYM_T hl_show_unit(HL_QTY_TEMP)
#define HL_SYM_DT hl_show_unit(HL_QTY_DTEMP)
#define HL_SYM_Q hl_show_unit(HL_QTY_POWER)
#define HL_SYM_CP hl_show_unit(HL_QTY_CP)
#define HL_SYM_H hl_show_unit(HL_QTY_HTC)
#define HL_SYM_A hl_show_unit(HL_QTY_AREA)
#define HL_SYM_P hl_show_unit(HL_QTY_PRICE)
/* Decimals for a heat rate the SI writer prints with d decimals. */
#define HL_DIG_Q(d) hl_show_digits(HL_QTY_POWER, (d))
#define HL_DIG_CP(d) hl_show_digits(HL_QTY_CP, (d))
#define HL_DIG_H(d) hl_show_digits(HL_QTY_HTC, (d))

#endif
