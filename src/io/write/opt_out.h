/* opt_out.h - what the least-cost search did, as text and XML: the search
 * (seed, evaluations, whether the time cap cut it), the cost split, the
 * energy against the targets, the limits that bind, the units dropped and
 * what each unit is worth, the splits. */
#ifndef HL_OPT_OUT_H
#define HL_OPT_OUT_H

#include <stdio.h>
#include <libxml/xmlwriter.h>

#include "network_opt.h"

void hl_opt_text(FILE *fp, const hl_opt_result *r, const hl_opt_options *o);

/* The <least-cost> element (doc/results.md); 0 or -1. */
int hl_opt_xml(xmlTextWriterPtr w, const hl_opt_result *r,
	       const hl_opt_options *o);

#endif
