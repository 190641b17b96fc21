/* report_fmt.h - the numbers of the report, rounded and with their units.
 *
 * One rule per kind of quantity, so that every number of one kind reads
 * alike and a test can recompute it from the XML results:
 *
 *   temperature   0.1 K                     "158.0 °C", "10.0 K"
 *   duty, load,   one rule for both: 3      "978 kW", "33.8 kW", "0.4 kW",
 *   area          significant figures, at   "5837 kW", "12 165 kW",
 *                 most one decimal, whole   "869 m²", "1.7 m²"
 *                 digits never rounded away
 *   money         3 significant figures,    "197 000 EUR", "49 200 EUR/yr"
 *                 whole units at most (cost laws are rough estimates:
 *                 more figures would claim a precision they lack)
 *
 * Whole numbers of five or more digits are grouped in threes with a narrow
 * no-break space (U+202F); four-digit numbers are not grouped (BIPM, The
 * International System of Units, 9th ed. 2019, §5.4.4). A number and its
 * unit are joined by a no-break space (U+00A0). A value that rounds to zero
 * prints as "0", never "-0". The minus sign is U+2212.
 *
 * Every function writes into buf (size >= 64 holds any result) and
 * returns buf, so that calls nest in a printf argument list.
 */
#ifndef HL_REPORT_FMT_H
#define HL_REPORT_FMT_H

#include <stddef.h>

#define HL_NBSP "\xc2\xa0"      /* U+00A0 between a number and its unit */
#define HL_NNBSP "\xe2\x80\xaf" /* U+202F between digit groups */
#define HL_MINUS "\xe2\x88\x92" /* U+2212 */

/* v rounded to sig significant figures (sig >= 1) but to no more than
 * maxdec decimals, grouped. */
char *hl_report_fmt_sig(char *buf, size_t size, double v, int sig,
			int maxdec);
/* A duty or an area: 3 significant figures, at most one decimal, whole
 * digits kept. */
char *hl_report_fmt_qty(char *buf, size_t size, double v);
/* v with a fixed number of decimals, grouped. */
char *hl_report_fmt_fixed(char *buf, size_t size, double v, int decimals);

/* "158.0 °C" */
char *hl_report_fmt_temp(char *buf, size_t size, double celsius);
/* "10.0 K" (a temperature difference) */
char *hl_report_fmt_dt(char *buf, size_t size, double kelvin);
/* "978 kW", "12 165 kW" (hl_report_fmt_qty) */
char *hl_report_fmt_duty(char *buf, size_t size, double kw);
/* "869 m²" (hl_report_fmt_qty) */
char *hl_report_fmt_area(char *buf, size_t size, double m2);
/* "197 000 EUR" and, with per_year, "197 000 EUR/yr"; currency may be
 * NULL or empty (no unit). */
char *hl_report_fmt_money(char *buf, size_t size, double v,
			  const char *currency, int per_year);

#endif
