/* targets_out.h - energy targets as text, XML and CSV. */
#ifndef HL_TARGETS_OUT_H
#define HL_TARGETS_OUT_H

#include <stdio.h>

#include "cascade.h"
#include "case.h"
#include "result_xml.h"

/* What a threshold problem adds to the targets. */
typedef struct {
	char kind;        /* hl_cascade_threshold_kind() */
	double dtmin;     /* threshold ΔTmin, HUGE_VAL when never needed */
} hl_threshold;

/* The text report: the summary and the problem table, for a note or a
 * terminal, then the caution (targets.c adds the utility levels between). */
void hl_targets_text_summary(FILE *fp, const hl_case *c,
			     const hl_cascade *cas, const hl_threshold *th);
void hl_targets_text_table(FILE *fp, const hl_cascade *cas);
void hl_targets_text_caution(FILE *fp);

/* Opens <targets dtmin hot-utility cold-utility> and writes its <pinch/>
 * children; the caller may add <utility/> children, then calls _end. */
int hl_targets_xml_begin(xmlTextWriterPtr w, const hl_cascade *cas,
			 const hl_threshold *th);
int hl_targets_xml_end(xmlTextWriterPtr w);

/* The cascade, one row per boundary. */
void hl_targets_csv(FILE *fp, const hl_cascade *cas);

#endif
