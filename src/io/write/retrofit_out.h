/* retrofit_out.h - retrofit proposals as text, XML and CSV.
 *
 * The writers print what the proposals hold; screen[i] (may be NULL, NaN
 * where it has no value) is the saving the audit's constant-α curve
 * promises at proposal i's investment, shown beside it. The XML element
 * <retrofit> is described in doc/results.md, "Retrofit".
 */
#ifndef HL_RETROFIT_OUT_H
#define HL_RETROFIT_OUT_H

#include <stdio.h>

#include <libxml/xmlwriter.h>

#include "case.h"
#include "rfit.h"

/* What the run was asked for: limits, fixed costs and whether those came
 * from the case (given) or are the illustrative defaults. */
typedef struct {
	const hl_rfit_opts *o;
	int repipe_given;
	int unit_given;
	const char *network;   /* the network file, NULL: the case's */
	const double *screen;  /* per proposal, or NULL */
} hl_rfit_out;

void hl_rfit_text(FILE *fp, const hl_case *c, const hl_rfit *r,
		  const hl_rfit_out *w, const char *caution);
int hl_rfit_xml(xmlTextWriterPtr x, const hl_rfit *r, const hl_rfit_out *w);
/* One row per modification (proposal columns repeated). */
void hl_rfit_csv(FILE *fp, const hl_rfit *r, const hl_rfit_out *w);

#endif
