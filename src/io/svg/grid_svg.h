/* grid_svg.h - the grid diagram of a network as SVG.
 *
 * The picture engineers draw of a heat exchanger network: every process
 * stream a horizontal line, hot streams above running left to right, cold
 * streams below running right to left, so that temperature falls from left
 * to right on both; each exchanger a pair of round marks on its two streams
 * joined by a vertical link, heaters and coolers square marks on their one
 * stream; splits as parallel branches between a split and a mixing point;
 * the pinches as dashed vertical lines; temperatures at the stream ends and
 * between stages. Columns follow the order of the units along every stream
 * (left is hotter); heaters and coolers share a column when nothing stands
 * in their way.
 *
 * Drawn at 170 mm wide (the width of an A4 page inside its margins, 1 unit
 * = 0.25 mm) with 8-12 pt text; streams in vermilion and blue, heaters in
 * orange and coolers in sky blue from the Okabe & Ito (2008) palette
 * (svg.h), each also told apart by position and shape for grey print.
 */
#ifndef HL_GRID_SVG_H
#define HL_GRID_SVG_H

#include <stdio.h>

#include <libxml/xmlwriter.h>

#include "cascade.h"
#include "network.h"
#include "status.h"

typedef struct {
	const char *title;     /* NULL: "Heat exchanger network" */
	const char *subtitle;  /* NULL: ΔTmin, utilities, units from net */
	const char *footnote;  /* small print (the caution), NULL for none */
	size_t npinch;
	const double *pinch;   /* shifted °C of the pinches, hottest first */
	const hl_cascade *cas; /* the process pinches among them; the others
				  are utility pinches, drawn apart (NULL:
				  all process pinches) */
} hl_grid_opts;

/* Write the diagram of net as a complete SVG document to fp. HL_EIO when
 * memory runs out or the writer fails. */
hl_status hl_grid_svg_write(const hl_network *net, const hl_grid_opts *o,
			    FILE *fp, hl_error *err);

/* The same diagram as one <svg> element into w (inline in an HTML or XML
 * document that the caller owns). */
hl_status hl_grid_svg_write_into(const hl_network *net, const hl_grid_opts *o,
				 xmlTextWriterPtr w, hl_error *err);

#endif
