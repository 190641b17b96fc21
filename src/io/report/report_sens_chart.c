/* report_sens_chart.c - the ranked sensitivity as bars: for each of the top
 * data, how far its tolerance can move the yearly utility cost (or, for a
 * case without prices, QHmin and QCmin) down and up, on one scale around
 * zero, ranked as the table beside it.
 *
 * Drawn at 170 mm wide like the other figures (1 unit = 0.25 mm): data
 * names on the left, alternate rows shaded, bars in the Okabe & Ito (2008)
 * vermilion (hot utility) and blue (cold utility), or in dark ink for the
 * cost. A side that no step can take (the cost derivative is infinite) runs
 * to the edge and ends in an arrow marked ∞.
 */
#include <math.h>
#include <stdio.h>
#include <string.h>

#include <libxml/xmlwriter.h>

#include "display.h"
#include "report_sec.h"

#define W 680.0
#define LABEL_RIGHT 262.0
#define PLOT_LEFT 272.0
#define PLOT_RIGHT 650.0
#define TOP 78.0
#define FS 11.0
#define INK "#2b2f36"
#define INK_SOFT "#5b616b"
#define SHADE "#f1f3f5"
#define GRID "#d5d9de"
#define FONT "'DejaVu Sans', 'Liberation Sans', Arial, Helvetica, sans-serif"
#define B 96

typedef struct {
	double down[2], up[2];  /* per series, >= 0, +inf possible */
} row_bars;

typedef struct {
	xmlTextWriterPtr w;
	int rc;
	size_t nseries;
	double scale;           /* units per unit of value */
	double zero;            /* x of 0 */
} chart;

static void
attrf(chart *c, const char *name, double v)
{
	char buf[64];

	snprintf(buf, sizeof buf, "%.2f", v);
	c->rc |= xmlTextWriterWriteAttribute(c->w, BAD_CAST name,
					     BAD_CAST buf);
}

static void
attr(chart *c, const char *name, const char *v)
{
	c->rc |= xmlTextWriterWriteAttribute(c->w, BAD_CAST name, BAD_CAST v);
}

static void
start(chart *c, const char *tag)
{
	c->rc |= xmlTextWriterStartElement(c->w, BAD_CAST tag);
}

static void
end(chart *c)
{
	c->rc |= xmlTextWriterEndElement(c->w);
}

static void
rect(chart *c, double x, double y, double w, double h, const char *fill)
{
	start(c, "rect");
	attrf(c, "x", x);
	attrf(c, "y", y);
	attrf(c, "width", w);
	attrf(c, "height", h);
	attr(c, "fill", fill);
	end(c);
}

static void
line(chart *c, double x1, double y1, double x2, double y2, const char *stroke,
     double width)
{
	start(c, "line");
	attrf(c, "x1", x1);
	attrf(c, "y1", y1);
	attrf(c, "x2", x2);
	attrf(c, "y2", y2);
	attr(c, "stroke", stroke);
	attrf(c, "stroke-width", width);
	end(c);
}

static void
text(chart *c, double x, double y, double fs, const char *anchor,
     const char *fill, const char *s)
{
	start(c, "text");
	attrf(c, "x", x);
	attrf(c, "y", y);
	attrf(c, "font-size", fs);
	attr(c, "text-anchor", anchor);
	attr(c, "fill", fill);
	c->rc |= xmlTextWriterWriteString(c->w, BAD_CAST s);
	end(c);
}

/* The bars of one row: the cost's fall and rise, or QHmin's and QCmin's. */
static row_bars
bars_of(const hl_sensitivity *sv, const hl_sens_row *r)
{
	row_bars b;

	memset(&b, 0, sizeof b);
	if (sv->cost != HL_SENS_COST_NONE) {
		hl_report_sens_cost_range(r->cost_minus, r->cost_plus, r->tol,
					  &b.down[0], &b.up[0]);
		if (isnan(b.down[0]))
			b.down[0] = b.up[0] = 0.0;
	} else {
		b.down[0] = hl_show_q(r->hot_down);
		b.up[0] = hl_show_q(r->hot_up);
		b.down[1] = hl_show_q(r->cold_down);
		b.up[1] = hl_show_q(r->cold_up);
	}
	return b;
}

/* 1, 2 or 5 times a power of ten at or above v (Heckbert, "Nice numbers
 * for graph labels", Graphics Gems, 1990). */
static double
nice_above(double v)
{
	double p = pow(10.0, floor(log10(v))), f = v / p;

	return (f <= 1.0 ? 1.0 : f <= 2.0 ? 2.0 : f <= 5.0 ? 5.0 : 10.0) * p;
}

/* The largest finite side of the shown rows, rounded up nicely; 0 when
 * every bar is empty. */
static double
extent(const hl_sensitivity *sv, size_t n)
{
	double m = 0.0;
	size_t i, k;

	for (i = 0; i < n; i++) {
		row_bars b = bars_of(sv, &sv->row[sv->rank[i]]);

		for (k = 0; k < 2; k++) {
			if (isfinite(b.down[k]))
				m = fmax(m, b.down[k]);
			if (isfinite(b.up[k]))
				m = fmax(m, b.up[k]);
		}
	}
	return m > 0.0 ? nice_above(m) : 0.0;
}

static const char *
colour(const chart *c, size_t k)
{
	if (c->nseries == 1)
		return INK;
	return k == 0 ? hl_svg_colour_hex(HL_SVG_VERMILION) :
			hl_svg_colour_hex(HL_SVG_BLUE);
}

/* One side of one bar, from zero towards sign (−1 down, +1 up). */
static void
side(chart *c, double v, int sign, double y, double h, const char *fill)
{
	double edge = sign > 0 ? PLOT_RIGHT : PLOT_LEFT, x;

	if (!(v > 0.0))
		return;
	x = isinf(v) ? edge - sign * 8.0 : c->zero + sign * v * c->scale;
	rect(c, fmin(c->zero, x), y, fabs(x - c->zero), h, fill);
	if (!isinf(v))
		return;
	start(c, "path");	/* the arrow head at the edge */
	{
		char d[160];

		snprintf(d, sizeof d, "M%.2f %.2f L%.2f %.2f L%.2f %.2f Z", x,
			 y - 2.0, edge, y + h / 2.0, x, y + h + 2.0);
		attr(c, "d", d);
	}
	attr(c, "fill", fill);
	end(c);
	text(c, x - sign * 4.0, y - 2.0, FS, sign > 0 ? "end" : "start", INK,
	     "∞");
}

static void
data_row(chart *c, const hl_report_data *d, size_t i, double y, double rh)
{
	const hl_sens_row *r = &d->sv->row[d->sv->rank[i]];
	row_bars b = bars_of(d->sv, r);
	char name[2 * B], what[B], tol[B / 2];
	double h = c->nseries == 1 ? 10.0 : 8.0, y0;
	size_t k;

	if (i % 2 == 0)
		rect(c, 0.0, y, W, rh, SHADE);
	hl_report_sens_datum(what, sizeof what, d->c, r);
	hl_report_sens_tol(tol, sizeof tol, r);
	snprintf(name, sizeof name, "%s", d->c->stream[r->stream].name);
	text(c, LABEL_RIGHT, y + rh / 2.0 - 1.0, FS, "end", INK, name);
	snprintf(name, sizeof name, "%s %s", what, tol);
	text(c, LABEL_RIGHT, y + rh / 2.0 + FS, FS - 1.5, "end", INK_SOFT,
	     name);
	y0 = y + (rh - (double)c->nseries * h - (double)(c->nseries - 1) *
		  2.0) / 2.0;
	for (k = 0; k < c->nseries; k++) {
		side(c, b.down[k], -1, y0 + (double)k * (h + 2.0), h,
		     colour(c, k));
		side(c, b.up[k], +1, y0 + (double)k * (h + 2.0), h,
		     colour(c, k));
	}
}

static void
axis(chart *c, double vmax, double top, double bottom, const char *unit)
{
	char v[B], lab[2 * B];
	int k;

	for (k = -2; k <= 2; k++) {
		double x = c->zero + (double)k * vmax / 2.0 * c->scale;

		line(c, x, top, x, bottom, k == 0 ? INK : GRID, k == 0 ? 1.2 :
		     0.8);
		hl_report_fmt_sig(v, sizeof v, fabs((double)k) * vmax / 2.0,
				  3, 1);
		snprintf(lab, sizeof lab, "%s%s", k < 0 ? HL_MINUS : k > 0 ?
			 "+" : "", v);
		text(c, x, bottom + 16.0, FS - 1.0, "middle", INK, lab);
	}
	text(c, c->zero, bottom + 36.0, FS, "middle", INK, unit);
}

static void
key(chart *c)
{
	static const char *const names[] = { "minimum hot utility QHmin",
		"minimum cold utility QCmin" };
	double x = PLOT_LEFT;
	size_t k;

	if (c->nseries == 1)
		return;
	for (k = 0; k < 2; k++) {
		rect(c, x, 56.0, 14.0, 9.0, colour(c, k));
		text(c, x + 20.0, 65.0, FS - 1.0, "start", INK, names[k]);
		x += 190.0;
	}
}

static void
draw(chart *c, const hl_report_data *d, size_t n, double vmax)
{
	const int cost = d->sv->cost != HL_SENS_COST_NONE;
	double rh = c->nseries == 1 ? 28.0 : 32.0;
	double bottom = TOP + (double)n * rh, height = bottom + 52.0;
	char unit[B];
	size_t i;

	start(c, "svg");
	attr(c, "xmlns", "http://www.w3.org/2000/svg");
	attr(c, "version", "1.1");
	{
		char v[64];

		snprintf(v, sizeof v, "%gmm", W / 4.0);
		attr(c, "width", v);
		snprintf(v, sizeof v, "%gmm", height / 4.0);
		attr(c, "height", v);
		snprintf(v, sizeof v, "0 0 %g %g", W, height);
		attr(c, "viewBox", v);
	}
	attr(c, "font-family", FONT);
	attr(c, "role", "img");
	start(c, "title");
	c->rc |= xmlTextWriterWriteString(c->w, BAD_CAST "Which data move the "
					  "results most");
	end(c);
	rect(c, 0.0, 0.0, W, height, "#ffffff");
	text(c, 24.0, 28.0, 15.0, "start", INK, cost ? "Which data move the "
	     "yearly utility cost most" : "Which data move the energy targets "
	     "most");
	text(c, 24.0, 46.0, FS, "start", INK_SOFT, "first-order fall and rise "
	     "with each datum off by its tolerance, largest effect at the top");
	key(c);
	for (i = 0; i < n; i++)
		data_row(c, d, i, TOP + (double)i * rh, rh);
	if (cost)
		snprintf(unit, sizeof unit, "change in the utility cost (%s/yr)",
			 hl_report_currency(d->c));
	else
		snprintf(unit, sizeof unit, "change in the target (%s)",
			 HL_SYM_Q);
	axis(c, vmax, TOP - 4.0, bottom + 2.0, unit);
	end(c);
}

void
hl_report_sens_chart(hl_report *r, size_t top)
{
	const hl_sensitivity *sv = r->d->sv;
	size_t n = sv->nrow < top ? sv->nrow : top;
	double vmax = extent(sv, n);
	chart c;
	char id[32];

	if (n == 0 || !(vmax > 0.0))
		return;
	memset(&c, 0, sizeof c);
	c.w = hl_html_writer(r->h);
	c.nseries = sv->cost != HL_SENS_COST_NONE ? 1 : 2;
	c.zero = (PLOT_LEFT + PLOT_RIGHT) / 2.0;
	c.scale = (PLOT_RIGHT - PLOT_LEFT - 20.0) / 2.0 / vmax;
	hl_report_figure_open(r, id, sizeof id);
	if (!hl_html_failed(r->h)) {
		draw(&c, r->d, n, vmax);
		if (c.rc < 0)
			hl_html_fail(r->h);
	}
	hl_report_figure_close(r, sv->cost != HL_SENS_COST_NONE ?
			       "How far each of the data ranked below can move "
			       "the yearly utility cost within its tolerance "
			       "(first order): the bar runs from the fall to "
			       "the rise." :
			       "How far each of the data ranked below can move "
			       "the minimum hot and cold utility within its "
			       "tolerance (first order): each bar runs from the "
			       "fall to the rise.");
}
