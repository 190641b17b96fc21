/* utility_out.h - the least-cost utility levels as text and XML.
 *
 * Text: a table of every utility (kind, temperatures, price, load, yearly
 * cost; "unused" or "out of reach" in place of the cost of one that carries
 * nothing), the totals, each utility pinch, and the solver's verdict.
 *
 * XML, inside <targets> (doc/results.md):
 *   <utility-summary hot cold cost hours optimal gap/>
 *   <utility name kind supply target price load cost [use]/>  per utility,
 *       cost per year, use = "unused" | "out-of-reach" when load is 0
 *   <utility-pinch shifted hot cold [utility]/>  per utility pinch
 */
#ifndef HL_UTILITY_OUT_H
#define HL_UTILITY_OUT_H

#include <stdio.h>

#include <libxml/xmlwriter.h>

#include "case.h"
#include "utility_lp.h"

void hl_utility_lp_text(FILE *fp, const hl_case *c, const hl_utility_lp *lp);

/* Returns < 0 on a writer failure, like libxml2. */
int hl_utility_lp_xml(xmlTextWriterPtr w, const hl_case *c,
		      const hl_utility_lp *lp);

#endif
