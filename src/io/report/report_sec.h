/* report_sec.h - what the sections of the report share (private to the
 * report_*.c files).
 *
 * A section is a row of the table in report_html.c: its anchor id, its
 * heading, whether the case's stages produced it, and the function that
 * writes its body. The frame writes <div class="section" id> and the
 * numbered heading; the body writes paragraphs, tables and figures through
 * the helpers below, which number the tables and figures of the whole
 * report in order.
 */
#ifndef HL_REPORT_SEC_H
#define HL_REPORT_SEC_H

#include <stddef.h>

#include "html.h"
#include "report_fmt.h"
#include "report_html.h"
#include "svg.h"

typedef struct {
	hl_html *h;
	const hl_report_data *d;
	int figures;     /* figures written so far */
	int tables;      /* numbered tables written so far */
	size_t charts;   /* inline charts, for their id prefixes */
} hl_report;

typedef struct {
	const char *id;
	const char *title;
	int (*present)(const hl_report_data *d);
	void (*write)(hl_report *r);
} hl_report_section;

/* The case's currency label, "" when none. */
const char *hl_report_currency(const hl_case *c);
/* The file name part of the case's source path ("demo.xml"), of any path. */
const char *hl_report_case_name(const hl_case *c);
const char *hl_report_base(const char *path);

/* A paragraph; a note in smaller type; a paragraph that says why a part is
 * missing. */
void hl_report_para(hl_report *r, const char *text);
void hl_report_note(hl_report *r, const char *text);
void hl_report_missing(hl_report *r, const char *what, const char *why);

/* A numbered table "Table N. caption" with one header row: each column a
 * heading and a unit (NULL or "" for none); numeric columns (num[i] != 0)
 * are right-aligned. Rows follow, then hl_report_table_end. */
void hl_report_table_start(hl_report *r, const char *cls,
			   const char *caption, size_t ncol,
			   const char *const *head, const char *const *unit,
			   const int *num);
void hl_report_table_end(hl_report *r);
/* A row of cells; cls of the <tr> may be NULL. */
void hl_report_row_start(hl_report *r, const char *cls);
void hl_report_row_end(hl_report *r);
void hl_report_cell(hl_report *r, const char *text);
void hl_report_cell_num(hl_report *r, const char *text);

/* A two-column table of named values (unnumbered): "Minimum hot utility |
 * 978 kW". id, when not NULL, marks the value's cell for the tests and for
 * links. */
void hl_report_facts_start(hl_report *r, const char *caption);
void hl_report_fact(hl_report *r, const char *name, const char *value,
		    const char *id);
void hl_report_facts_end(hl_report *r);

/* A numbered figure: the chart inline, then "Figure N. caption". The chart
 * gets the report's height and, when subtitle is not NULL, that subtitle
 * (numbers rounded as in the text); its own footnote is dropped, since
 * every page carries the caution. The chart is written and freed here
 * (NULL: out of memory, the report fails). */
#define HL_REPORT_CHART_HEIGHT 400.0
void hl_report_figure(hl_report *r, hl_svg_chart *chart, const char *subtitle,
		      const char *caption);

/* "245.0 → 158.0": a temperature range at 0.1 K, without its unit (the
 * column heading gives it). */
char *hl_report_range(char *buf, size_t size, double from, double to);
/* A table column's SI unit label ("°C", "kW", "EUR/MWh") in the display
 * units (display.h); the cells must be converted alike. */
const char *hl_report_unit(char *buf, size_t size, const char *si);

/* A numbered figure of another kind (the grid diagram): _open starts its
 * <div class="figure" id> and returns the id it chose ("figN", in id);
 * the caller writes the picture; _close adds "Figure N. caption". */
const char *hl_report_figure_open(hl_report *r, char *id, size_t size);
void hl_report_figure_close(hl_report *r, const char *caption);

/* Shared by the sensitivity section and its chart (report_sensitivity.c):
 * the datum's name ("target temperature", "cp, segment 1 of 2"), its
 * tolerance ("±1.0 K", "±5 %"), and how far the utility cost can fall and
 * rise (first order, >= 0, +inf where a step leaves no utility able to
 * serve) with the datum anywhere within ±tol, NaN when unknown. */
void hl_report_sens_datum(char *buf, size_t size, const hl_case *c,
			  const hl_sens_row *row);
void hl_report_sens_tol(char *buf, size_t size, const hl_sens_row *row);
void hl_report_sens_cost_range(double minus, double plus, double tol,
			       double *down, double *up);
/* The ranked data as bars (report_sens_chart.c): the first top of them. */
void hl_report_sens_chart(hl_report *r, size_t top);

/* The network's hot utility above the minimum and its causes (ranges,
 * rules, layout), as part of a sentence. */
void hl_report_rise_text(hl_report *r, const hl_network *n);

/* The sections (one file each). */
extern const hl_report_section hl_report_sec_summary;
extern const hl_report_section hl_report_sec_streams;
extern const hl_report_section hl_report_sec_targets;
extern const hl_report_section hl_report_sec_choice;
extern const hl_report_section hl_report_sec_audit;
extern const hl_report_section hl_report_sec_retrofit;
extern const hl_report_section hl_report_sec_curves;
extern const hl_report_section hl_report_sec_tradeoff;
extern const hl_report_section hl_report_sec_matches;
extern const hl_report_section hl_report_sec_network;
extern const hl_report_section hl_report_sec_sensitivity;
extern const hl_report_section hl_report_sec_assumptions;
extern const hl_report_section hl_report_sec_methods;
extern const hl_report_section hl_report_sec_caution;

/* The stylesheet (report_css.c). */
extern const char hl_report_css[];

#endif
