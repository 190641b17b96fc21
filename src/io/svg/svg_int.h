/* svg_int.h - the chart model shared by svg.c (building) and
 * svg_draw.c (layout and drawing). Not part of the contract. */
#ifndef HL_SVG_INT_H
#define HL_SVG_INT_H

#include "svg.h"

typedef enum {
	HL_SVG_IT_SERIES,
	HL_SVG_IT_HLINE,
	HL_SVG_IT_VLINE,
	HL_SVG_IT_MARKER,
	HL_SVG_IT_TEXT,
	HL_SVG_IT_SPAN
} hl_svg_item_kind;

typedef struct {
	hl_svg_item_kind kind;
	char *label;
	double *x, *y;       /* series points */
	size_t n;
	double a, b, c;      /* hline: y; vline: x; marker, text: x, y;
				span: x0, x1, y */
	double dx, dy;       /* text offset, chart units */
	hl_svg_style style;
	hl_svg_anchor anchor;
} hl_svg_item;

struct hl_svg_chart {
	char *title, *subtitle, *footnote, *xlabel, *ylabel, *id;
	double width, height;
	double xlo, xhi, ylo, yhi;   /* requested ranges, NaN = automatic */
	hl_svg_item *item;
	size_t nitem, cap;
	int failed;
};

#endif
