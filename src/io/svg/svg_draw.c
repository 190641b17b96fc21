/* svg_draw.c - layout and drawing of a chart (model in svg_int.h).
 *
 * The look: white page, a slate accent bar beside a left-aligned title,
 * the legend as a row of line samples under the title, hairline grid, axes
 * on the left and bottom only with ticks pointing out, annotations in dark
 * slate with a white halo so they stay readable where they cross a line.
 */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "svg_int.h"
#include "utf8.h"

#define INK "#2b2f36"
#define INK_SOFT "#5b616b"
#define GRID "#e3e6ea"
#define FONT "'DejaVu Sans', 'Liberation Sans', Arial, Helvetica, sans-serif"
#define FS_TITLE 17.0
#define FS_SUB 12.5
#define FS_AXIS 13.0
#define FS_TICK 12.0
#define FS_LEGEND 12.5
#define FS_NOTE 11.5
#define FS_FOOT 10.5
#define LEGEND_ROW 19.0
#define RIGHT_MARGIN 26.0

typedef struct {
	double x0, x1, xstep;   /* data range and tick step */
	double y0, y1, ystep;
	double left, right, top, bottom;  /* plot area, chart units */
	double legend_top;
	int legend_rows;
} layout;

/* Width of a text in chart units: a fair average for sans-serif fonts. */
static double
text_width(const char *s, double size)
{
	return s ? 0.58 * size * (double)hl_utf8_chars(s) : 0.0;
}

/* Heckbert (1990), "Nice numbers for graph labels": the nice number
 * (1, 2, 5 × 10^k) closest to x (round) or not below it. */
static double
nice_number(double x, int round)
{
	double e = floor(log10(x)), f = x / pow(10.0, e), nf;

	if (round)
		nf = f < 1.5 ? 1 : f < 3 ? 2 : f < 7 ? 5 : 10;
	else
		nf = f <= 1 ? 1 : f <= 2 ? 2 : f <= 5 ? 5 : 10;
	return nf * pow(10.0, e);
}

/* Axis range widened to whole ticks of a nice step (Heckbert 1990, with
 * the step taken straight from the span so that the axis is not padded by
 * more than one step at either end), unless fixed by the caller. */
static void
nice_axis(double lo, double hi, double want_lo, double want_hi, int ticks,
	  double *a, double *b, double *step)
{
	if (!isnan(want_lo))
		lo = want_lo;
	if (!isnan(want_hi))
		hi = want_hi;
	if (!(hi > lo)) {
		double m = fabs(lo) > 0 ? fabs(lo) * 0.1 : 1.0;

		lo -= m;
		hi += m;
	}
	*step = nice_number((hi - lo) / (ticks - 1), 1);
	*a = isnan(want_lo) ? floor(lo / *step + 1e-9) * *step : lo;
	*b = isnan(want_hi) ? ceil(hi / *step - 1e-9) * *step : hi;
}

static void
grow(double v, double *lo, double *hi)
{
	if (!isfinite(v))
		return;
	*lo = fmin(*lo, v);
	*hi = fmax(*hi, v);
}

static void
data_range(const hl_svg_chart *ch, double *xl, double *xh, double *yl,
	   double *yh)
{
	size_t i, j;

	*xl = *yl = HUGE_VAL;
	*xh = *yh = -HUGE_VAL;
	for (i = 0; i < ch->nitem; i++) {
		const hl_svg_item *it = &ch->item[i];

		switch (it->kind) {
		case HL_SVG_IT_SERIES:
			for (j = 0; j < it->n; j++) {
				grow(it->x[j], xl, xh);
				grow(it->y[j], yl, yh);
			}
			break;
		case HL_SVG_IT_HLINE:
			grow(it->a, yl, yh);
			break;
		case HL_SVG_IT_VLINE:
			grow(it->a, xl, xh);
			break;
		case HL_SVG_IT_SPAN:
			grow(it->a, xl, xh);
			grow(it->b, xl, xh);
			grow(it->c, yl, yh);
			break;
		default:
			grow(it->a, xl, xh);
			grow(it->b, yl, yh);
		}
	}
	if (*xl > *xh)
		*xl = 0, *xh = 1;
	if (*yl > *yh)
		*yl = 0, *yh = 1;
}

/* A tick value as text: as many decimals as the step needs, a thin space
 * between thousands from 10 000 on, a true minus sign. */
static void
tick_text(char *buf, size_t size, double v, double step)
{
	int dec = (int)fmax(0.0, -floor(log10(step) + 1e-9));
	char num[64], *dot, *p = buf;
	size_t len, i, intlen;

	if (fabs(v) < step * 1e-9)
		v = 0.0;
	snprintf(num, sizeof num, "%.*f", dec, fabs(v));
	dot = strchr(num, '.');
	intlen = dot ? (size_t)(dot - num) : strlen(num);
	if (v < 0.0 && size > 4)
		p += snprintf(p, size, "\xe2\x88\x92");
	len = strlen(num);
	for (i = 0; i < len && (size_t)(p - buf) + 5 < size; i++) {
		if (i > 0 && i < intlen && fabs(v) >= 1e4 &&
		    (intlen - i) % 3 == 0)
			p += snprintf(p, 4, "\xe2\x80\x89");
		*p++ = num[i];
	}
	*p = '\0';
}

/* Number of ticks from a to b by step (counted, not accumulated, so that
 * rounding never drops the last one). */
static int
nticks(double a, double b, double step)
{
	return (int)floor((b - a) / step + 1e-6) + 1;
}

static double
widest_ytick(const layout *L)
{
	char buf[64];
	double w = 0.0;
	int i, n = nticks(L->y0, L->y1, L->ystep);

	for (i = 0; i < n; i++) {
		tick_text(buf, sizeof buf, L->y0 + i * L->ystep, L->ystep);
		w = fmax(w, text_width(buf, FS_TICK));
	}
	return w;
}

static double
legend_entry_width(const hl_svg_item *it)
{
	return 34.0 + text_width(it->label, FS_LEGEND) + 20.0;
}

static int
count_legend_rows(const hl_svg_chart *ch, double left, double right)
{
	double x = left;
	int rows = 0;
	size_t i;

	for (i = 0; i < ch->nitem; i++) {
		const hl_svg_item *it = &ch->item[i];
		double w;

		if (it->kind != HL_SVG_IT_SERIES || it->label == NULL)
			continue;
		w = legend_entry_width(it);
		if (rows == 0 || x + w > right + 20.0) {
			rows++;
			x = left;
		}
		x += w;
	}
	return rows;
}

#define FOOT_LINES 3
#define FOOT_LEADING 13.0

/* Break the footnote into lines that fit the page width: the start of each
 * line in starts[], the length in lens[]; returns the number of lines. */
static int
foot_lines(const hl_svg_chart *ch, size_t *starts, size_t *lens)
{
	const char *s = ch->footnote;
	double room = ch->width - 48.0;
	size_t pos = 0, len = s ? strlen(s) : 0;
	int n = 0;

	while (s != NULL && pos < len && n < FOOT_LINES) {
		size_t end = pos, brk = 0;
		double wd = 0.0;

		while (end < len) {
			if (!HL_UTF8_CONT(s[end]))
				wd += 0.58 * FS_FOOT;
			if (wd > room && brk > pos)
				break;
			if (s[end] == ' ')
				brk = end;
			end++;
		}
		if (end < len && brk > pos)
			end = brk;
		starts[n] = pos;
		lens[n] = end - pos;
		n++;
		pos = end < len && s[end] == ' ' ? end + 1 : end;
	}
	return n;
}

static void
make_layout(const hl_svg_chart *ch, layout *L)
{
	double xl, xh, yl, yh, header;

	data_range(ch, &xl, &xh, &yl, &yh);
	nice_axis(xl, xh, ch->xlo, ch->xhi, 8, &L->x0, &L->x1, &L->xstep);
	nice_axis(yl, yh, ch->ylo, ch->yhi, 7, &L->y0, &L->y1, &L->ystep);
	L->left = 24.0 + (ch->ylabel ? FS_AXIS + 12.0 : 0.0) +
		  widest_ytick(L) + 10.0;
	L->right = ch->width - RIGHT_MARGIN;
	header = ch->subtitle ? 62.0 : 44.0;
	L->legend_top = header;
	L->legend_rows = count_legend_rows(ch, L->left, L->right);
	L->top = header + L->legend_rows * LEGEND_ROW + 12.0;
	{
		size_t st[FOOT_LINES], ln[FOOT_LINES];
		int nf = foot_lines(ch, st, ln);

		L->bottom = ch->height - (ch->xlabel ? 50.0 : 30.0) -
			    nf * FOOT_LEADING;
	}
}

static double
px(const layout *L, double x)
{
	return L->left + (x - L->x0) / (L->x1 - L->x0) * (L->right - L->left);
}

static double
py(const layout *L, double y)
{
	return L->bottom - (y - L->y0) / (L->y1 - L->y0) * (L->bottom - L->top);
}

/* --- Writer helpers: each returns < 0 on failure, like libxml2. ------- */

static int
start(xmlTextWriterPtr w, const char *name)
{
	return xmlTextWriterStartElement(w, BAD_CAST name);
}

static int
end(xmlTextWriterPtr w)
{
	return xmlTextWriterEndElement(w);
}

static int
attr(xmlTextWriterPtr w, const char *name, const char *v)
{
	return xmlTextWriterWriteAttribute(w, BAD_CAST name, BAD_CAST v);
}

/* A coordinate or length with two decimals, no trailing zeros. */
static void
fmt_num(char *buf, size_t size, double v)
{
	char *e;

	snprintf(buf, size, "%.2f", fabs(v) < 0.005 ? 0.0 : v);
	e = buf + strlen(buf) - 1;
	while (*e == '0')
		*e-- = '\0';
	if (*e == '.')
		*e = '\0';
}

static int
attr_num(xmlTextWriterPtr w, const char *name, double v)
{
	char buf[48];

	fmt_num(buf, sizeof buf, v);
	return attr(w, name, buf);
}

static const char *
dash_array(hl_svg_dash d)
{
	switch (d) {
	case HL_SVG_DASHED:
		return "9 5";
	case HL_SVG_DOTTED:
		return "0.5 5";
	case HL_SVG_DASHDOT:
		return "11 4 1 4";
	case HL_SVG_LONGDASH:
		return "18 6";
	default:
		return NULL;
	}
}

static int
stroke(xmlTextWriterPtr w, hl_svg_colour c, hl_svg_dash d, double width)
{
	int rc = 0;

	rc |= attr(w, "fill", "none");
	rc |= attr(w, "stroke", hl_svg_colour_hex(c));
	rc |= attr_num(w, "stroke-width", width);
	if (dash_array(d) != NULL)
		rc |= attr(w, "stroke-dasharray", dash_array(d));
	rc |= attr(w, "stroke-linecap", d == HL_SVG_DOTTED || d == HL_SVG_DASHDOT ?
		   "round" : "butt");
	rc |= attr(w, "stroke-linejoin", "round");
	return rc;
}

static int
line(xmlTextWriterPtr w, double x1, double y1, double x2, double y2)
{
	int rc = start(w, "line");

	rc |= attr_num(w, "x1", x1);
	rc |= attr_num(w, "y1", y1);
	rc |= attr_num(w, "x2", x2);
	rc |= attr_num(w, "y2", y2);
	return rc | end(w);
}

static const char *
anchor_name(hl_svg_anchor a)
{
	return a == HL_SVG_END ? "end" : a == HL_SVG_MIDDLE ? "middle" : "start";
}

/* Text at (x, y); halo: a white outline under the glyphs. */
static int
text(xmlTextWriterPtr w, double x, double y, const char *s, double size,
     hl_svg_anchor a, const char *fill, int halo)
{
	int rc = start(w, "text");

	rc |= attr_num(w, "x", x);
	rc |= attr_num(w, "y", y);
	rc |= attr_num(w, "font-size", size);
	if (a != HL_SVG_START)
		rc |= attr(w, "text-anchor", anchor_name(a));
	rc |= attr(w, "fill", fill);
	if (halo) {
		rc |= attr(w, "stroke", "#ffffff");
		rc |= attr(w, "stroke-width", "3.2");
		rc |= attr(w, "stroke-linejoin", "round");
		rc |= attr(w, "paint-order", "stroke");
	}
	rc |= xmlTextWriterWriteString(w, BAD_CAST s);
	return rc | end(w);
}

static int
mark(xmlTextWriterPtr w, hl_svg_mark m, double x, double y,
     hl_svg_colour c)
{
	char d[160], a[48], b[48];
	double r = 4.2;
	int rc;

	if (m == HL_SVG_MARK_NONE)
		return 0;
	if (m == HL_SVG_MARK_CIRCLE) {
		rc = start(w, "circle");
		rc |= attr_num(w, "cx", x);
		rc |= attr_num(w, "cy", y);
		rc |= attr_num(w, "r", r);
	} else {
		fmt_num(a, sizeof a, x);
		fmt_num(b, sizeof b, y);
		if (m == HL_SVG_MARK_SQUARE)
			snprintf(d, sizeof d, "M%s %sm-3.6 -3.6h7.2v7.2h-7.2z", a, b);
		else if (m == HL_SVG_MARK_TRIANGLE)
			snprintf(d, sizeof d, "M%s %sm0 -5l4.6 8h-9.2z", a, b);
		else
			snprintf(d, sizeof d, "M%s %sm0 -5l5 5l-5 5l-5 -5z", a, b);
		rc = start(w, "path");
		rc |= attr(w, "d", d);
	}
	rc |= attr(w, "fill", hl_svg_colour_hex(c));
	rc |= attr(w, "stroke", "#ffffff");
	rc |= attr(w, "stroke-width", "1.2");
	return rc | end(w);
}

/* --- Pieces of the chart --------------------------------------------- */

static int
draw_header(const hl_svg_chart *ch, xmlTextWriterPtr w)
{
	double bar = ch->subtitle ? 36.0 : 20.0;
	int rc = 0;

	rc |= start(w, "rect");
	rc |= attr(w, "x", "24");
	rc |= attr(w, "y", "14");
	rc |= attr(w, "width", "4");
	rc |= attr_num(w, "height", bar);
	rc |= attr(w, "fill", INK);
	rc |= end(w);
	if (ch->title != NULL) {
		rc |= start(w, "text");
		rc |= attr(w, "x", "36");
		rc |= attr(w, "y", "29");
		rc |= attr_num(w, "font-size", FS_TITLE);
		rc |= attr(w, "font-weight", "bold");
		rc |= attr(w, "fill", INK);
		rc |= xmlTextWriterWriteString(w, BAD_CAST ch->title);
		rc |= end(w);
	}
	if (ch->subtitle != NULL)
		rc |= text(w, 36, 48, ch->subtitle, FS_SUB, HL_SVG_START,
			   INK_SOFT, 0);
	return rc;
}

static int
draw_grid(const layout *L, xmlTextWriterPtr w)
{
	int rc = start(w, "g"), i;
	int nx = nticks(L->x0, L->x1, L->xstep);
	int ny = nticks(L->y0, L->y1, L->ystep);

	rc |= attr(w, "class", "grid");
	rc |= attr(w, "stroke", GRID);
	rc |= attr(w, "stroke-width", "0.8");
	for (i = 0; i < nx; i++) {
		double x = px(L, L->x0 + i * L->xstep);

		rc |= line(w, x, L->top, x, L->bottom);
	}
	for (i = 0; i < ny; i++) {
		double y = py(L, L->y0 + i * L->ystep);

		rc |= line(w, L->left, y, L->right, y);
	}
	return rc | end(w);
}

static int
draw_tick_marks(const layout *L, xmlTextWriterPtr w)
{
	int rc = 0, i;
	int nx = nticks(L->x0, L->x1, L->xstep);
	int ny = nticks(L->y0, L->y1, L->ystep);

	for (i = 0; i < nx; i++) {
		double x = px(L, L->x0 + i * L->xstep);

		rc |= line(w, x, L->bottom, x, L->bottom + 5);
	}
	for (i = 0; i < ny; i++) {
		double y = py(L, L->y0 + i * L->ystep);

		rc |= line(w, L->left - 5, y, L->left, y);
	}
	return rc;
}

static int
draw_tick_labels(const layout *L, xmlTextWriterPtr w)
{
	char buf[64];
	double v;
	int rc = start(w, "g"), i;
	int nx = nticks(L->x0, L->x1, L->xstep);
	int ny = nticks(L->y0, L->y1, L->ystep);

	rc |= attr(w, "class", "ticks");
	for (i = 0; i < nx; i++) {
		v = L->x0 + i * L->xstep;
		tick_text(buf, sizeof buf, v, L->xstep);
		rc |= text(w, px(L, v), L->bottom + 19, buf, FS_TICK,
			   HL_SVG_MIDDLE, INK, 0);
	}
	for (i = 0; i < ny; i++) {
		v = L->y0 + i * L->ystep;
		tick_text(buf, sizeof buf, v, L->ystep);
		rc |= text(w, L->left - 9, py(L, v) + 4.2, buf, FS_TICK,
			   HL_SVG_END, INK, 0);
	}
	return rc | end(w);
}

static int
draw_axes(const hl_svg_chart *ch, const layout *L, xmlTextWriterPtr w)
{
	char tr[96];
	int rc = start(w, "g");

	rc |= attr(w, "class", "axes");
	rc |= attr(w, "stroke", INK);
	rc |= attr(w, "stroke-width", "1.2");
	rc |= line(w, L->left, L->top, L->left, L->bottom);
	rc |= line(w, L->left, L->bottom, L->right, L->bottom);
	rc |= draw_tick_marks(L, w);
	rc |= end(w);
	rc |= draw_tick_labels(L, w);
	if (ch->xlabel != NULL)
		rc |= text(w, 0.5 * (L->left + L->right), L->bottom + 40,
			   ch->xlabel, FS_AXIS, HL_SVG_MIDDLE, INK, 0);
	if (ch->ylabel != NULL) {
		double x = 24.0 + FS_AXIS, y = 0.5 * (L->top + L->bottom);

		rc |= start(w, "text");
		snprintf(tr, sizeof tr, "rotate(-90 %.2f %.2f)", x, y);
		rc |= attr(w, "transform", tr);
		rc |= attr_num(w, "x", x);
		rc |= attr_num(w, "y", y);
		rc |= attr_num(w, "font-size", FS_AXIS);
		rc |= attr(w, "text-anchor", "middle");
		rc |= attr(w, "fill", INK);
		rc |= xmlTextWriterWriteString(w, BAD_CAST ch->ylabel);
		rc |= end(w);
	}
	return rc;
}

/* Append "x,y " to a growing buffer; NULL on failure. */
static char *
append_point(char *buf, size_t *len, size_t *cap, double x, double y)
{
	char a[48], b[48];
	size_t need;

	fmt_num(a, sizeof a, x);
	fmt_num(b, sizeof b, y);
	need = strlen(a) + strlen(b) + 3;
	if (*len + need > *cap) {
		size_t ncap = (*cap + need) * 2;
		char *p = realloc(buf, ncap);

		if (p == NULL) {
			free(buf);
			return NULL;
		}
		buf = p;
		*cap = ncap;
	}
	*len += (size_t)sprintf(buf + *len, "%s%s,%s", *len ? " " : "", a, b);
	return buf;
}

static char *
series_points(const hl_svg_item *it, const layout *L)
{
	size_t len = 0, cap = 64, i;
	char *buf = malloc(cap);

	if (buf == NULL)
		return NULL;
	buf[0] = '\0';
	for (i = 0; buf != NULL && i < it->n; i++) {
		double x = px(L, it->x[i]), y = py(L, it->y[i]);

		if (i > 0 && it->style.step == HL_SVG_STEP_HV)
			buf = append_point(buf, &len, &cap, x,
					   py(L, it->y[i - 1]));
		else if (i > 0 && it->style.step == HL_SVG_STEP_VH)
			buf = append_point(buf, &len, &cap,
					   px(L, it->x[i - 1]), y);
		if (buf != NULL)
			buf = append_point(buf, &len, &cap, x, y);
	}
	return buf;
}

static double
width_of(const hl_svg_style *s)
{
	return s->width > 0.0 ? s->width : 2.2;
}

static int
draw_series(const hl_svg_chart *ch, const hl_svg_item *it, size_t k,
	    const layout *L, xmlTextWriterPtr w)
{
	char id[96], clip[96], *pts;
	size_t i;
	int rc;

	pts = series_points(it, L);
	if (pts == NULL)
		return -1;
	snprintf(id, sizeof id, "%s-series-%zu", ch->id, k);
	snprintf(clip, sizeof clip, "url(#%s-plot)", ch->id);
	rc = start(w, "g");
	rc |= attr(w, "id", id);
	rc |= attr(w, "class", "series");
	rc |= attr(w, "clip-path", clip);
	if (it->label != NULL) {
		rc |= start(w, "title");
		rc |= xmlTextWriterWriteString(w, BAD_CAST it->label);
		rc |= end(w);
	}
	if (it->style.dash != HL_SVG_NOLINE) {
		rc |= start(w, "polyline");
		rc |= stroke(w, it->style.colour, it->style.dash,
			     width_of(&it->style));
		rc |= attr(w, "points", pts);
		rc |= end(w);
	}
	free(pts);
	for (i = 0; i < it->n && it->style.mark != HL_SVG_MARK_NONE; i++)
		rc |= mark(w, it->style.mark, px(L, it->x[i]), py(L, it->y[i]),
			   it->style.colour);
	return rc | end(w);
}

/* nth: the how-manieth labelled vertical line, to stagger their labels. */
static int
draw_refline(const hl_svg_item *it, const layout *L, int nth,
	     xmlTextWriterPtr w)
{
	int rc = start(w, "g");

	rc |= attr(w, "class", it->kind == HL_SVG_IT_HLINE ? "hline" : "vline");
	rc |= start(w, "g");
	rc |= stroke(w, it->style.colour, it->style.dash, 1.3);
	if (it->kind == HL_SVG_IT_HLINE)
		rc |= line(w, L->left, py(L, it->a), L->right, py(L, it->a));
	else
		rc |= line(w, px(L, it->a), L->top, px(L, it->a), L->bottom);
	rc |= end(w);
	if (it->label != NULL && it->kind == HL_SVG_IT_HLINE) {
		double x = it->anchor == HL_SVG_START ? L->left + 6 :
			   it->anchor == HL_SVG_END ? L->right - 4 :
			   0.5 * (L->left + L->right);

		rc |= text(w, x, py(L, it->a) - 5, it->label, FS_NOTE,
			   it->anchor, INK, 1);
	}
	else if (it->label != NULL) {
		int right = px(L, it->a) > 0.5 * (L->left + L->right);

		rc |= text(w, px(L, it->a) + (right ? -5 : 5),
			   L->top + 14 + 15 * (nth % 4), it->label, FS_NOTE, right ? HL_SVG_END : HL_SVG_START,
			   INK, 1);
	}
	return rc | end(w);
}

static int
draw_span(const hl_svg_item *it, const layout *L, xmlTextWriterPtr w)
{
	double x0 = px(L, it->a), x1 = px(L, it->b), y = py(L, it->c);
	int rc = start(w, "g");

	rc |= attr(w, "class", "span");
	rc |= start(w, "g");
	rc |= stroke(w, it->style.colour, HL_SVG_SOLID, 1.3);
	rc |= line(w, x0, y, x1, y);
	rc |= line(w, x0, y - 5, x0, y + 5);
	rc |= line(w, x1, y - 5, x1, y + 5);
	rc |= end(w);
	if (it->label != NULL) {
		double half = 0.5 * text_width(it->label, FS_NOTE);
		double mid = 0.5 * (x0 + x1);

		/* Keep the label inside the plot: against the nearer end. */
		if (mid - half < L->left)
			rc |= text(w, fmax(x0, L->left) + 2, y - 6, it->label,
				   FS_NOTE, HL_SVG_START, INK, 1);
		else if (mid + half > L->right)
			rc |= text(w, fmin(x1, L->right) - 2, y - 6, it->label,
				   FS_NOTE, HL_SVG_END, INK, 1);
		else
			rc |= text(w, mid, y - 6, it->label, FS_NOTE,
				   HL_SVG_MIDDLE, INK, 1);
	}
	return rc | end(w);
}

static int
draw_point_item(const hl_svg_item *it, const layout *L, xmlTextWriterPtr w)
{
	double x = px(L, it->a), y = py(L, it->b);
	int rc = 0;

	if (it->kind == HL_SVG_IT_TEXT)
		return text(w, x + it->dx, y + it->dy, it->label, FS_NOTE,
			    it->anchor, INK, 1);
	rc |= start(w, "g");
	rc |= attr(w, "class", "marker");
	rc |= mark(w, it->style.mark, x, y, it->style.colour);
	if (it->label != NULL) {
		double dx = it->anchor == HL_SVG_START ? 9 :
			    it->anchor == HL_SVG_END ? -9 : 0;
		double dy = it->anchor == HL_SVG_MIDDLE ? -10 : 4;

		rc |= text(w, x + dx, y + dy, it->label, FS_NOTE, it->anchor,
			   INK, 1);
	}
	return rc | end(w);
}

static int
draw_items(const hl_svg_chart *ch, const layout *L, xmlTextWriterPtr w)
{
	size_t i, k = 0;
	int rc = 0, nv = 0;

	for (i = 0; i < ch->nitem; i++) {
		const hl_svg_item *it = &ch->item[i];

		switch (it->kind) {
		case HL_SVG_IT_SERIES:
			rc |= draw_series(ch, it, k++, L, w);
			break;
		case HL_SVG_IT_HLINE:
		case HL_SVG_IT_VLINE:
			rc |= draw_refline(it, L, nv, w);
			nv += it->kind == HL_SVG_IT_VLINE && it->label;
			break;
		case HL_SVG_IT_SPAN:
			rc |= draw_span(it, L, w);
			break;
		default:
			rc |= draw_point_item(it, L, w);
		}
	}
	return rc;
}

static int
legend_entry(const hl_svg_item *it, double x, double y, xmlTextWriterPtr w)
{
	int rc = start(w, "g");

	if (it->style.dash != HL_SVG_NOLINE) {
		rc |= start(w, "g");
		rc |= stroke(w, it->style.colour, it->style.dash,
			     width_of(&it->style));
		rc |= line(w, x, y - 4, x + 28, y - 4);
		rc |= end(w);
	}
	rc |= mark(w, it->style.mark, x + 14, y - 4, it->style.colour);
	rc |= text(w, x + 34, y, it->label, FS_LEGEND, HL_SVG_START, INK, 0);
	return rc | end(w);
}

static int
draw_legend(const hl_svg_chart *ch, const layout *L, xmlTextWriterPtr w)
{
	double x = L->left, y = L->legend_top;
	int rc, row = 0;
	size_t i;

	if (L->legend_rows == 0)
		return 0;
	rc = start(w, "g");
	rc |= attr(w, "class", "legend");
	for (i = 0; i < ch->nitem; i++) {
		const hl_svg_item *it = &ch->item[i];
		double wd;

		if (it->kind != HL_SVG_IT_SERIES || it->label == NULL)
			continue;
		wd = legend_entry_width(it);
		if (row == 0 || x + wd > L->right + 20.0) {
			row++;
			x = L->left;
			y = L->legend_top + row * LEGEND_ROW - 4.0;
		}
		rc |= legend_entry(it, x, y, w);
		x += wd;
	}
	return rc | end(w);
}

static int
draw_footnote(const hl_svg_chart *ch, xmlTextWriterPtr w)
{
	size_t st[FOOT_LINES], ln[FOOT_LINES];
	int n = foot_lines(ch, st, ln), i, rc = 0;
	char buf[512];

	for (i = 0; i < n; i++) {
		snprintf(buf, sizeof buf, "%.*s", (int)ln[i], ch->footnote + st[i]);
		rc |= text(w, 24, ch->height - 9 - (n - 1 - i) * FOOT_LEADING,
			   buf, FS_FOOT, HL_SVG_START, INK_SOFT, 0);
	}
	return rc;
}

static int
draw_defs(const hl_svg_chart *ch, const layout *L, xmlTextWriterPtr w)
{
	char id[96];
	int rc = start(w, "defs");

	snprintf(id, sizeof id, "%s-plot", ch->id);
	rc |= start(w, "clipPath");
	rc |= attr(w, "id", id);
	rc |= start(w, "rect");
	rc |= attr_num(w, "x", L->left - 1);
	rc |= attr_num(w, "y", L->top - 1);
	rc |= attr_num(w, "width", L->right - L->left + 2);
	rc |= attr_num(w, "height", L->bottom - L->top + 2);
	rc |= end(w);
	rc |= end(w);
	return rc | end(w);
}

static int
draw_root(const hl_svg_chart *ch, xmlTextWriterPtr w)
{
	char buf[64];
	int rc = start(w, "svg");

	rc |= attr(w, "xmlns", "http://www.w3.org/2000/svg");
	rc |= attr(w, "version", "1.1");
	snprintf(buf, sizeof buf, "%gmm", ch->width / 4.0);
	rc |= attr(w, "width", buf);
	snprintf(buf, sizeof buf, "%gmm", ch->height / 4.0);
	rc |= attr(w, "height", buf);
	snprintf(buf, sizeof buf, "0 0 %g %g", ch->width, ch->height);
	rc |= attr(w, "viewBox", buf);
	rc |= attr(w, "font-family", FONT);
	rc |= attr(w, "role", "img");
	if (ch->title != NULL) {
		rc |= start(w, "title");
		rc |= xmlTextWriterWriteString(w, BAD_CAST ch->title);
		rc |= end(w);
	}
	if (ch->subtitle != NULL) {
		rc |= start(w, "desc");
		rc |= xmlTextWriterWriteString(w, BAD_CAST ch->subtitle);
		rc |= end(w);
	}
	return rc;
}

/* An opaque page, so that a chart pasted on a coloured background or
 * converted to PNG keeps its white paper. */
static int
draw_page(xmlTextWriterPtr w)
{
	int rc = start(w, "rect");

	rc |= attr(w, "class", "page");
	rc |= attr(w, "width", "100%");
	rc |= attr(w, "height", "100%");
	rc |= attr(w, "fill", "#ffffff");
	return rc | end(w);
}

hl_status
hl_svg_chart_write(const hl_svg_chart *ch, xmlTextWriterPtr w, hl_error *err)
{
	layout L;
	int rc;

	if (ch->failed)
		return hl_error_nomem(err);
	make_layout(ch, &L);
	rc = draw_root(ch, w);
	rc |= draw_defs(ch, &L, w);
	rc |= draw_page(w);
	rc |= draw_header(ch, w);
	rc |= draw_grid(&L, w);
	rc |= draw_axes(ch, &L, w);
	rc |= draw_items(ch, &L, w);
	rc |= draw_legend(ch, &L, w);
	rc |= draw_footnote(ch, w);
	rc |= end(w);
	if (rc < 0)
		return hl_error_set(err, HL_EIO, NULL, 0,
			"cannot build the chart '%s'",
			ch->title ? ch->title : "");
	return HL_OK;
}

hl_status
hl_svg_chart_write_file(const hl_svg_chart *ch, FILE *fp, hl_error *err)
{
	xmlBufferPtr buf = xmlBufferCreate();
	xmlTextWriterPtr w = buf ? xmlNewTextWriterMemory(buf, 0) : NULL;
	hl_status st;
	size_t len;

	if (w == NULL) {
		if (buf != NULL)
			xmlBufferFree(buf);
		return hl_error_nomem(err);
	}
	xmlTextWriterSetIndent(w, 1);
	xmlTextWriterSetIndentString(w, BAD_CAST " ");
	st = xmlTextWriterStartDocument(w, "1.0", "UTF-8", NULL) < 0 ?
	     hl_error_set(err, HL_EIO, NULL, 0, "cannot start the chart") :
	     hl_svg_chart_write(ch, w, err);
	if (st == HL_OK && xmlTextWriterEndDocument(w) < 0)
		st = hl_error_set(err, HL_EIO, NULL, 0, "cannot end the chart");
	xmlFreeTextWriter(w);
	len = (size_t)xmlBufferLength(buf);
	if (st == HL_OK && fwrite(xmlBufferContent(buf), 1, len, fp) != len)
		st = hl_error_set(err, HL_EIO, NULL, 0, "write error");
	xmlBufferFree(buf);
	return st;
}
