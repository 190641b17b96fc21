/* svg.c - building a chart (the drawing is in svg_draw.c). */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "svg_int.h"

/* Okabe & Ito (2008), "Color universal design", J*FLY; grey added. */
static const char *const palette[HL_SVG_NCOLOURS] = {
	"#000000", "#e69f00", "#56b4e9", "#009e73", "#f0e442", "#0072b2",
	"#d55e00", "#cc79a7", "#6b7280"
};

const char hl_svg_caution[] =
	"heatloom \xc2\xb7 screening estimate: detailed design and the safety "
	"review of each match belong to qualified engineers under local codes";

const char *
hl_svg_colour_hex(hl_svg_colour c)
{
	return (unsigned)c < HL_SVG_NCOLOURS ? palette[c] : palette[0];
}

static int
set_text(hl_svg_chart *ch, char **dst, const char *s)
{
	char *d = NULL;

	if (s != NULL && (d = strdup(s)) == NULL) {
		ch->failed = 1;
		return -1;
	}
	free(*dst);
	*dst = d;
	return 0;
}

hl_svg_chart *
hl_svg_chart_create(const char *title, const char *xlabel, const char *ylabel)
{
	hl_svg_chart *ch = calloc(1, sizeof *ch);

	if (ch == NULL)
		return NULL;
	ch->width = 680.0;
	ch->height = 440.0;
	ch->xlo = ch->xhi = ch->ylo = ch->yhi = NAN;
	if (set_text(ch, &ch->title, title) < 0 ||
	    set_text(ch, &ch->xlabel, xlabel) < 0 ||
	    set_text(ch, &ch->ylabel, ylabel) < 0 ||
	    set_text(ch, &ch->id, "chart") < 0) {
		hl_svg_chart_free(ch);
		return NULL;
	}
	return ch;
}

void
hl_svg_chart_free(hl_svg_chart *ch)
{
	size_t i;

	if (ch == NULL)
		return;
	for (i = 0; i < ch->nitem; i++) {
		free(ch->item[i].label);
		free(ch->item[i].x);
		free(ch->item[i].y);
	}
	free(ch->item);
	free(ch->title);
	free(ch->subtitle);
	free(ch->footnote);
	free(ch->xlabel);
	free(ch->ylabel);
	free(ch->id);
	free(ch);
}

int
hl_svg_chart_set_subtitle(hl_svg_chart *ch, const char *text)
{
	return set_text(ch, &ch->subtitle, text);
}

int
hl_svg_chart_set_footnote(hl_svg_chart *ch, const char *text)
{
	return set_text(ch, &ch->footnote, text);
}

int
hl_svg_chart_set_id(hl_svg_chart *ch, const char *prefix)
{
	return set_text(ch, &ch->id, prefix);
}

void
hl_svg_chart_set_height(hl_svg_chart *ch, double height)
{
	if (height >= 200.0 && height <= 2000.0)
		ch->height = height;
}

void
hl_svg_chart_set_xrange(hl_svg_chart *ch, double lo, double hi)
{
	ch->xlo = lo;
	ch->xhi = hi;
}

void
hl_svg_chart_set_yrange(hl_svg_chart *ch, double lo, double hi)
{
	ch->ylo = lo;
	ch->yhi = hi;
}

/* A new item of the given kind with its label, or NULL (chart failed). */
static hl_svg_item *
new_item(hl_svg_chart *ch, hl_svg_item_kind kind, const char *label)
{
	hl_svg_item *it;

	if (ch->nitem == ch->cap) {
		size_t ncap = ch->cap ? 2 * ch->cap : 16;
		hl_svg_item *p = realloc(ch->item, ncap * sizeof *p);

		if (p == NULL) {
			ch->failed = 1;
			return NULL;
		}
		ch->item = p;
		ch->cap = ncap;
	}
	it = &ch->item[ch->nitem];
	memset(it, 0, sizeof *it);
	it->kind = kind;
	it->style.colour = HL_SVG_GREY;
	it->style.dash = HL_SVG_DASHED;
	if (label != NULL && (it->label = strdup(label)) == NULL) {
		ch->failed = 1;
		return NULL;
	}
	ch->nitem++;
	return it;
}

int
hl_svg_chart_add_series(hl_svg_chart *ch, const char *label, const double *x,
			const double *y, size_t n, const hl_svg_style *style)
{
	hl_svg_item *it = new_item(ch, HL_SVG_IT_SERIES, label);
	size_t i;

	if (it == NULL)
		return -1;
	it->style = *style;
	it->x = malloc((n ? n : 1) * sizeof *it->x);
	it->y = malloc((n ? n : 1) * sizeof *it->y);
	if (it->x == NULL || it->y == NULL) {
		ch->failed = 1;
		return -1;
	}
	for (i = 0; i < n; i++) {
		if (!isfinite(x[i]) || !isfinite(y[i]))
			continue;
		it->x[it->n] = x[i];
		it->y[it->n] = y[i];
		it->n++;
	}
	return 0;
}

int
hl_svg_chart_add_hline(hl_svg_chart *ch, double y, const char *label,
		       hl_svg_colour colour, hl_svg_dash dash,
		       hl_svg_anchor side)
{
	hl_svg_item *it = new_item(ch, HL_SVG_IT_HLINE, label);

	if (it == NULL)
		return -1;
	it->a = y;
	it->anchor = side;
	it->style.colour = colour;
	it->style.dash = dash;
	return 0;
}

int
hl_svg_chart_add_vline(hl_svg_chart *ch, double x, const char *label,
		       hl_svg_colour colour, hl_svg_dash dash)
{
	hl_svg_item *it = new_item(ch, HL_SVG_IT_VLINE, label);

	if (it == NULL)
		return -1;
	it->a = x;
	it->style.colour = colour;
	it->style.dash = dash;
	return 0;
}

int
hl_svg_chart_add_marker(hl_svg_chart *ch, double x, double y,
			hl_svg_mark mark, hl_svg_colour colour,
			const char *label, hl_svg_anchor anchor)
{
	hl_svg_item *it = new_item(ch, HL_SVG_IT_MARKER, label);

	if (it == NULL)
		return -1;
	it->a = x;
	it->b = y;
	it->style.mark = mark;
	it->style.colour = colour;
	it->anchor = anchor;
	return 0;
}

int
hl_svg_chart_add_text(hl_svg_chart *ch, double x, double y, const char *text,
		      hl_svg_anchor anchor, double dx, double dy)
{
	hl_svg_item *it = new_item(ch, HL_SVG_IT_TEXT, text);

	if (it == NULL)
		return -1;
	it->a = x;
	it->b = y;
	it->dx = dx;
	it->dy = dy;
	it->anchor = anchor;
	return 0;
}

int
hl_svg_chart_add_span(hl_svg_chart *ch, double x0, double x1, double y,
		      const char *label, hl_svg_colour colour)
{
	hl_svg_item *it = new_item(ch, HL_SVG_IT_SPAN, label);

	if (it == NULL)
		return -1;
	it->a = fmin(x0, x1);
	it->b = fmax(x0, x1);
	it->c = y;
	it->style.colour = colour;
	it->style.dash = HL_SVG_SOLID;
	return 0;
}
