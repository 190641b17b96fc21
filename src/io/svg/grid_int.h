/* grid_int.h - where everything of a grid diagram goes (grid_layout.c),
 * shared with the drawing (grid_svg.c). Units: SVG user units, 0.25 mm. */
#ifndef HL_GRID_INT_H
#define HL_GRID_INT_H

#include <stddef.h>

#include "grid_svg.h"
#include "network.h"

#define GRID_WIDTH 680.0

typedef struct {
	double width, height;
	double left, right;   /* ends of the stream lines */
	double *row;          /* per party: y of its main line, NaN: utility */
	int *nbranch;         /* per party: the most branches of one stage */
	double *x;            /* per unit: x of its column */
	double *yh, *yc;      /* per unit: y of its marks, NaN on a utility */
	int *branch_hot;      /* per unit: branch index on each side (0 main) */
	int *branch_cold;
	int *region;          /* per unit: pinches above it */
	size_t ncol;
	size_t npinch;
	double *pinch_x;      /* per pinch: x, NaN when no unit lies on one side */
	double top, bottom;   /* y of the first and last stream line */
	double key_top;       /* y where the key begins */
} hl_grid_layout;

/* Lay out net; 0 on success, -1 when memory runs out. */
int hl_grid_layout_make(const hl_network *net, const hl_grid_opts *o,
			hl_grid_layout *L);
void hl_grid_layout_free(hl_grid_layout *L);

/* Where a long stream name breaks into two lines (the index of the space),
 * or its length when it fits on one. */
size_t hl_grid_name_break(const char *name);

/* Width of a text in units at font size fs: a fair sans-serif average. */
double hl_grid_text_width(const char *s, double fs);

#endif
