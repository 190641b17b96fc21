/* sweep_out.h - the ΔTmin trade-off and the supertargets as text, XML, CSV
 * and SVG charts.
 *
 * XML (doc/results.md): <supertargets dtmin area area-shell-and-tube units
 * shells capital-cost energy-cost total-cost .../> for one ΔTmin;
 * <sweep from to step> with one <point .../> per ΔTmin (the same attributes,
 * or ok="no" with a note) and <optimum dtmin total-cost .../>.
 * CSV: dtmin, hot_utility, cold_utility, area (shell-and-tube or
 * counterflow per the exchanger setting), units, shells, capital_cost,
 * energy_cost, total_cost (annual figures: capital_cost is the annualised
 * capital), one row per ΔTmin; a ΔTmin without an answer has empty cells.
 */
#ifndef HL_SWEEP_OUT_H
#define HL_SWEEP_OUT_H

#include <stdio.h>

#include <libxml/xmlwriter.h>

#include "case.h"
#include "svg.h"
#include "sweep.h"

void hl_supertargets_text(FILE *fp, const hl_case *c,
			  const hl_supertargets *st);
int hl_supertargets_xml(xmlTextWriterPtr w, const char *element,
			const hl_supertargets *st);

void hl_sweep_text(FILE *fp, const hl_case *c, const hl_sweep *sw);
int hl_sweep_xml(xmlTextWriterPtr w, const hl_sweep *sw, double from,
		 double to, double step);
void hl_sweep_csv(FILE *fp, const hl_case *c, const hl_sweep *sw);

/* Total annual cost, its energy and capital parts against ΔTmin, the
 * optimum marked; and area against hot utility. NULL when out of memory. */
hl_svg_chart *hl_sweep_chart_cost(const hl_case *c, const hl_sweep *sw);
hl_svg_chart *hl_sweep_chart_area(const hl_case *c, const hl_sweep *sw);

#endif
