/* matches_out.h - the matches stage's results as text, XML and CSV. */
#ifndef HL_MATCHES_OUT_H
#define HL_MATCHES_OUT_H

#include <stdio.h>

#include "cascade.h"
#include "case.h"
#include "match_milp.h"
#include "result_xml.h"

/* Summary, subnetworks (which splits are process and which utility
 * pinches, when cas is given), the match table, rules and notes, for a
 * terminal or a note; ends with the caution. */
void hl_matches_text(FILE *fp, const hl_case *c, const hl_match_result *r,
		     double dtmin, const hl_cascade *cas);

/* The <matches> element (doc/results.md); < 0 on a writer failure. */
int hl_matches_xml(xmlTextWriterPtr w, const hl_case *c,
		   const hl_match_result *r, double dtmin);

/* One row per match. */
void hl_matches_csv(FILE *fp, const hl_match_result *r);

/* A sentence for rule i: "forbid H1-C2 (plant.xml:12: reason)". */
void hl_matches_rule_text(const hl_case *c, long rule, char *buf,
			  size_t size);

#endif
