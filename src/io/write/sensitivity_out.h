/* sensitivity_out.h - the sensitivity of the targets as text, XML and CSV
 * (doc/results.md). */
#ifndef HL_SENSITIVITY_OUT_H
#define HL_SENSITIVITY_OUT_H

#include <stdio.h>

#include "cascade.h"
#include "case.h"
#include "result_xml.h"
#include "sensitivity.h"

/* The ranked report: the three data to check first, every datum with its
 * derivatives and moves (and the utility cost's, with utilities), ΔTmin,
 * the utilities' temperatures, the bands, and the caution. */
void hl_sensitivity_text(FILE *fp, const hl_case *c, const hl_cascade *cas,
			 const hl_sensitivity *sv);

/* <sensitivity/> per datum, <sensitivity-dtmin/>, <sensitivity-utility/>
 * per utility temperature, <sensitivity-band/> per target and
 * <sensitivity-summary/>, as children of the open <results>. Returns < 0 on
 * a writer failure. */
int hl_sensitivity_xml(xmlTextWriterPtr w, const hl_case *c,
		       const hl_sensitivity *sv);

/* One row per stream and quantity in case order, then ΔTmin, then one per
 * utility temperature. */
void hl_sensitivity_csv(FILE *fp, const hl_case *c, const hl_sensitivity *sv);

#endif
