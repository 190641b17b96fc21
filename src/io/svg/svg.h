/* svg.h - line charts as SVG, written with libxml2's xmlTextWriter.
 *
 * A chart has a title (and optional subtitle and footnote), an x and a y
 * axis with labels that carry their units ("Heat flow (kW)"), and any number
 * of items drawn in the order they were added:
 *
 *   series   a polyline through (x, y) points, optionally as steps and
 *            with a marker at every point; labelled series form the legend
 *   hline    a horizontal reference line across the plot (a pinch, a level)
 *   vline    a vertical reference line
 *   marker   one symbol at a point, with an optional label beside it
 *   text     a note at a point, offset in chart units
 *   span     a dimension line between two x values at one y, label above
 *            (a heat load: "QCmin 60 kW")
 *
 * Axes get "nice" ticks (1, 2, 5 × 10^k; Heckbert, "Nice numbers for graph
 * labels", Graphics Gems, 1990) over the range of all items unless a range
 * is set. The chart is 680 × 440 units drawn at 170 mm wide, the width of
 * an A4 page inside its margins (1 unit = 0.25 mm); fonts are 11-17 units
 * (8-12 pt) so that a printed chart stays legible.
 *
 * Colours are the Okabe & Ito (2008) palette ("Color universal design",
 * J*FLY), distinguishable by readers with the common colour-vision
 * deficiencies; every series also has a dash pattern and may have a marker
 * so that lines differ in grey print too.
 *
 * Errors: the add and set functions return 0, or -1 when memory runs out;
 * the chart remembers the failure and hl_svg_chart_write* then returns
 * HL_EIO, so a caller may add everything and check once.
 * Ownership: the chart copies every string and array it is given.
 */
#ifndef HL_SVG_H
#define HL_SVG_H

#include <stddef.h>
#include <stdio.h>

#include <libxml/xmlwriter.h>

#include "status.h"

typedef struct hl_svg_chart hl_svg_chart;

/* Palette indices (Okabe & Ito 2008), then a neutral grey. */
typedef enum {
	HL_SVG_BLACK = 0,
	HL_SVG_ORANGE,
	HL_SVG_SKY,
	HL_SVG_GREEN,
	HL_SVG_YELLOW,   /* weak on white paper: for fills, not lines */
	HL_SVG_BLUE,
	HL_SVG_VERMILION,
	HL_SVG_PURPLE,
	HL_SVG_GREY,
	HL_SVG_NCOLOURS
} hl_svg_colour;

typedef enum {
	HL_SVG_SOLID = 0,
	HL_SVG_DASHED,
	HL_SVG_DOTTED,
	HL_SVG_DASHDOT,
	HL_SVG_LONGDASH,
	HL_SVG_NOLINE     /* markers only (a series of points) */
} hl_svg_dash;

typedef enum {
	HL_SVG_MARK_NONE = 0,
	HL_SVG_MARK_CIRCLE,
	HL_SVG_MARK_SQUARE,
	HL_SVG_MARK_TRIANGLE,
	HL_SVG_MARK_DIAMOND
} hl_svg_mark;

/* How consecutive points of a series are joined. */
typedef enum {
	HL_SVG_STEP_NONE = 0, /* straight lines */
	HL_SVG_STEP_HV,       /* horizontal first, then vertical */
	HL_SVG_STEP_VH        /* vertical first, then horizontal */
} hl_svg_step;

typedef enum { HL_SVG_START = 0, HL_SVG_MIDDLE, HL_SVG_END } hl_svg_anchor;

typedef struct {
	hl_svg_colour colour;
	hl_svg_dash dash;
	double width;         /* stroke width in chart units; 0: 2.2 */
	hl_svg_mark mark;     /* at every point */
	hl_svg_step step;
} hl_svg_style;

/* The hex colour "#rrggbb" of a palette index. */
const char *hl_svg_colour_hex(hl_svg_colour c);

/* title, xlabel, ylabel may be NULL. NULL when out of memory. */
hl_svg_chart *hl_svg_chart_create(const char *title, const char *xlabel,
				  const char *ylabel);
void hl_svg_chart_free(hl_svg_chart *ch);

/* A line under the title (the case, the ΔTmin, the targets). */
int hl_svg_chart_set_subtitle(hl_svg_chart *ch, const char *text);
/* Small print at the foot (the screening-estimate caution). */
int hl_svg_chart_set_footnote(hl_svg_chart *ch, const char *text);
/* The caution every standalone chart carries as its footnote. */
extern const char hl_svg_caution[];
/* Prefix of the ids inside the SVG (default "chart"): give each chart of
 * one HTML page its own, letters, digits and '-' only. */
int hl_svg_chart_set_id(hl_svg_chart *ch, const char *prefix);
/* Height in chart units (width stays 680); default 440. */
void hl_svg_chart_set_height(hl_svg_chart *ch, double height);
/* Fix an axis range; NaN for either end keeps it automatic. */
void hl_svg_chart_set_xrange(hl_svg_chart *ch, double lo, double hi);
void hl_svg_chart_set_yrange(hl_svg_chart *ch, double lo, double hi);

/* A series of n points (copied); label NULL keeps it out of the legend.
 * Non-finite points are skipped. */
int hl_svg_chart_add_series(hl_svg_chart *ch, const char *label,
			    const double *x, const double *y, size_t n,
			    const hl_svg_style *style);
/* side: where the label sits along the line (start = left end). */
int hl_svg_chart_add_hline(hl_svg_chart *ch, double y, const char *label,
			   hl_svg_colour colour, hl_svg_dash dash,
			   hl_svg_anchor side);
int hl_svg_chart_add_vline(hl_svg_chart *ch, double x, const char *label,
			   hl_svg_colour colour, hl_svg_dash dash);
int hl_svg_chart_add_marker(hl_svg_chart *ch, double x, double y,
			    hl_svg_mark mark, hl_svg_colour colour,
			    const char *label, hl_svg_anchor anchor);
/* Text at (x, y) in data coordinates moved by (dx, dy) chart units (dy > 0
 * moves down). */
int hl_svg_chart_add_text(hl_svg_chart *ch, double x, double y,
			  const char *text, hl_svg_anchor anchor, double dx,
			  double dy);
int hl_svg_chart_add_span(hl_svg_chart *ch, double x0, double x1, double y,
			  const char *label, hl_svg_colour colour);

/* Write the chart as one <svg> element into w (inline in a larger XML or
 * XHTML document). */
hl_status hl_svg_chart_write(const hl_svg_chart *ch, xmlTextWriterPtr w,
			     hl_error *err);
/* Write a complete SVG document to fp. */
hl_status hl_svg_chart_write_file(const hl_svg_chart *ch, FILE *fp,
				  hl_error *err);

#endif
