/* audit_out.h - the audit of an existing network as text, XML, CSV and an
 * SVG chart (doc/results.md, "Audit").
 *
 * Text: a report to discuss with a client: energy today against the
 * targets and the saving, the culprits ranked (pinch-rule violations with
 * what to do and what each would save), today's units as read, the area
 * efficiency, the retrofit curve with investment and payback, the caution.
 * XML: <audit …> with <exchanger/>, <violation/>, <retrofit> and <warning/>
 * children. CSV: the retrofit curve, one row per point. Chart: area against
 * hot utility, with the target curve, today's point, the constant-α
 * retrofit curve and the targets at ΔTmin.
 *
 * network names the network table for the report (NULL: the case's own);
 * caution is the sentence the report ends with.
 */
#ifndef HL_AUDIT_OUT_H
#define HL_AUDIT_OUT_H

#include <stdio.h>

#include <libxml/xmlwriter.h>

#include "audit.h"
#include "case.h"
#include "retrofit.h"
#include "svg.h"

void hl_audit_text(FILE *fp, const hl_case *c, const char *network,
		   const hl_audit *a, const hl_retrofit *r,
		   const char *caution);
int hl_audit_xml(xmlTextWriterPtr w, const hl_case *c, const hl_audit *a,
		 const hl_retrofit *r);
void hl_audit_csv(FILE *fp, const hl_retrofit *r);
/* NULL when out of memory. */
hl_svg_chart *hl_audit_chart(const hl_case *c, const hl_audit *a,
			     const hl_retrofit *r);

/* What to do about a violation, one short phrase. */
const char *hl_audit_action(hl_violation_kind k);

#endif
