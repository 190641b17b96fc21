/* report_html.h - the study report: one self-contained HTML file.
 *
 * The report is the document an engineer hands to a client: the job and the
 * case, the data as given, the targets, the utility choice, the curves, the
 * ΔTmin trade-off, the sensitivity of the targets to the data, the
 * assumptions, the methods with their references and the caution. Charts are
 * inline SVG and the stylesheet is inline, so the file needs nothing else to
 * be read or printed: no script, no font, no image, no network.
 *
 * Each section is one function in its own file (report_*.c) and one row of
 * the section table in report_html.c; a section appears when the stage it
 * shows has run (its pointer below is not NULL). A stage that was run and
 * failed may leave its pointer NULL and give its reason in *_note: the
 * section then says why it is missing instead of disappearing silently.
 *
 * Every number shown is the rounding (report_fmt.h) of the value the same
 * stage writes to its XML results.
 */
#ifndef HL_REPORT_HTML_H
#define HL_REPORT_HTML_H

#include <stdio.h>

#include "audit.h"
#include "cascade.h"
#include "case.h"
#include "curves.h"
#include "match_milp.h"
#include "network.h"
#include "retrofit.h"
#include "rfit.h"
#include "sensitivity.h"
#include "status.h"
#include "supertarget.h"
#include "sweep.h"
#include "targets_out.h"
#include "utility_lp.h"

typedef struct {
	const char *title;        /* NULL: "Heat recovery study" + case name */
	const char *author;       /* "Prepared by", NULL: left out */
	const char *date;         /* "2026-12-02", NULL: left out */
	const char *generator;    /* "heatloom 0.1.0" */
	const char *dtmin_from;   /* where ΔTmin came from, as the Source
				     column of the settings says it */
	const char *caution;      /* the safety wording */
} hl_report_meta;

typedef struct {
	hl_report_meta meta;
	const hl_case *c;                 /* required */
	const hl_cascade *cas;            /* required: at c->set.dtmin */
	const hl_threshold *th;           /* required */
	const hl_utility_lp *lp;          /* NULL: the case has no utilities */
	const hl_curves *cv;              /* required */
	const hl_supertargets *st;        /* at c->set.dtmin, NULL: not run */
	const char *st_note;              /* why st is missing */
	const hl_sweep *sw;               /* NULL: not run */
	const char *sw_note;
	double sw_from, sw_to, sw_step;   /* K, the grid asked for */
	const hl_sensitivity *sv;         /* NULL: not run */
	const char *sv_note;
	const hl_match_result *mr;        /* NULL: not run */
	const char *mr_note;
	const hl_audit *audit;            /* NULL: no existing network */
	const hl_retrofit *retrofit;      /* with audit, NULL: not run */
	const char *audit_note;
	const hl_rfit *rfit;              /* with audit: retrofit proposals,
					     NULL: not run */
	const double *rfit_promise;       /* per proposal, the constant-α
					     saving at its investment */
	const char *rfit_note;            /* why rfit is missing */
	double rfit_payback;              /* years, the limit used */
	int rfit_changes;                 /* the most changes asked for */
	int rfit_costs_given;             /* fixed costs from the case */
	const char *network_file;         /* --network, NULL: the case's */
	const hl_network *net;            /* the designed network, NULL: not
					     run */
	const char *net_note;             /* why net is missing */
	size_t net_npinch;                /* pinches for its grid diagram */
	const double *net_pinch;          /* shifted °C, hottest first */
	double net_emat_hint;             /* K, EMAT at which the matches
					     place at the targets, NaN */
	size_t net_findings;              /* findings of its check (0) */
} hl_report_data;

/* Write the whole report to fp. Errors: HL_EIO when memory runs out or a
 * write fails; nothing partial matters because the caller writes through
 * hl_output (a temporary file renamed when complete). */
hl_status hl_report_html_write(FILE *fp, const hl_report_data *d,
			       hl_error *err);

#endif
