/* size_out.h - the exchanger list as sized by `heatloom size`: text, XML, CSV.
 *
 * The writers take what the command worked out, row by row, and print it;
 * they compute nothing but totals. doc/results.md describes the XML and CSV.
 */
#ifndef HL_SIZE_OUT_H
#define HL_SIZE_OUT_H

#include <stdio.h>

#include "case.h"
#include "exchanger.h"
#include "result_xml.h"
#include "units_table.h"

/* Inputs to the sizing that came from the built-in defaults, neither from
 * the row nor from the command line: reports mark them as assumed. */
enum {
	HL_ASSUMED_TYPE = 1u << 0,
	HL_ASSUMED_FMIN = 1u << 1,
	HL_ASSUMED_XP = 1u << 2,
	HL_ASSUMED_COST = 1u << 3,
	HL_ASSUMED_H_HOT = 1u << 4,
	HL_ASSUMED_H_COLD = 1u << 5,
	HL_ASSUMED_LARGEST = 1u << 6
};

/* One exchanger of the list and what became of it. */
typedef struct {
	const hl_unit_spec *unit;  /* the row as read */
	hl_exchanger_spec spec;    /* what was sized: row, options, defaults */
	double h_hot, h_cold;      /* kW/(m²·K) behind spec.u, NaN when u given */
	unsigned assumed;          /* HL_ASSUMED_* bits */
	hl_status status;          /* HL_OK sized; HL_ENOSOLUTION not sized */
	hl_exchanger_sizing size;  /* all of it on HL_OK; else lmtd, p, r only */
	char note[HL_ERROR_TEXT];  /* why it was not sized */
} hl_size_row;

typedef struct {
	const char *source;          /* the exchanger list's file name */
	const hl_size_row *row;
	size_t n;
	const hl_settings *defaults; /* the values behind "assumed" */
	const char *caution;         /* closes the text report, may be NULL */
} hl_size_result;



/* A table for an engineer: units in the header, marks for assumed values,
 * notes per unit, totals, the caution. */
void hl_size_text(FILE *fp, const hl_size_result *r);

/* <units count sized> with one <exchanger/> per row (doc/results.md).
 * Returns < 0 on a writer failure, like libxml2. */
int hl_size_xml(xmlTextWriterPtr w, const hl_size_result *r);

/* One row per exchanger under a header row. */
void hl_size_csv(FILE *fp, const hl_size_result *r);

#endif
