/* curves_out.h - the curves as charts (svg.h) and as CSV points.
 *
 * Each chart function returns a new chart the caller writes and frees (NULL
 * when out of memory). Heat is drawn in kW, or in MW when the curves pass
 * 20 000 kW; the CSV files are always in kW and °C.
 *
 * CSV columns (header row first): composite.csv and balanced-composite.csv
 * "curve,heat,temperature" with curve hot|cold; shifted-composite.csv
 * "curve,heat,shifted"; grand-composite.csv "curve,heat,shifted" with curve
 * grand|hot-utilities|cold-utilities. Points in drawing order.
 */
#ifndef HL_CURVES_OUT_H
#define HL_CURVES_OUT_H

#include <stdio.h>

#include "cascade.h"
#include "case.h"
#include "curves.h"
#include "svg.h"
#include "utility_lp.h"

hl_svg_chart *hl_curves_chart_composite(const hl_case *c,
					const hl_cascade *cas,
					const hl_curves *cv, int shifted);
/* lp may be NULL: the grand composite alone. */
hl_svg_chart *hl_curves_chart_grand(const hl_case *c, const hl_cascade *cas,
				    const hl_curves *cv,
				    const hl_utility_lp *lp);
/* Needs the utility result. */
hl_svg_chart *hl_curves_chart_balanced(const hl_case *c,
				       const hl_curves *cv,
				       const hl_utility_lp *lp);

void hl_curves_csv_composite(FILE *fp, const hl_curves *cv, int shifted);
void hl_curves_csv_grand(FILE *fp, const hl_curves *cv);
void hl_curves_csv_balanced(FILE *fp, const hl_curves *cv);

#endif
