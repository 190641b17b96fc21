/* grid_svg.c - drawing the grid diagram (grid_svg.h) from its layout
 * (grid_layout.c).
 *
 * The look matches the charts of svg_draw.c: white page, a slate accent bar
 * beside a left-aligned title, dark slate text with a white halo where it
 * may cross a line.
 */
#include <math.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include <libxml/xmlwriter.h>

#include "display.h"
#include "grid_int.h"
#include "profile.h"
#include "svg.h"

#define INK "#2b2f36"
#define INK_SOFT "#5b616b"
#define FONT "'DejaVu Sans', 'Liberation Sans', Arial, Helvetica, sans-serif"
#define FS_TITLE 17.0
#define FS_SUB 12.5
#define FS_NAME 12.0
#define FS_ID 11.0
#define FS_T 10.5
#define FS_FOOT 10.5
#define MARK_R 7.5
#define KEY_ROW 18.0

typedef xmlTextWriterPtr W;

static int
start(W w, const char *name)
{
	return xmlTextWriterStartElement(w, BAD_CAST name);
}

static int
end(W w)
{
	return xmlTextWriterEndElement(w);
}

static int
attr(W w, const char *name, const char *v)
{
	return xmlTextWriterWriteAttribute(w, BAD_CAST name, BAD_CAST v);
}

static int
num(W w, const char *name, double v)
{
	char b[32];

	snprintf(b, sizeof b, "%.2f", v);
	return attr(w, name, b);
}

static const char *
hex(hl_svg_colour c)
{
	return hl_svg_colour_hex(c);
}

static int
line(W w, double x1, double y1, double x2, double y2, const char *colour,
     double width, const char *dash)
{
	int rc = start(w, "line");

	rc |= num(w, "x1", x1);
	rc |= num(w, "y1", y1);
	rc |= num(w, "x2", x2);
	rc |= num(w, "y2", y2);
	rc |= attr(w, "stroke", colour);
	rc |= num(w, "stroke-width", width);
	if (dash != NULL)
		rc |= attr(w, "stroke-dasharray", dash);
	return rc | end(w);
}

/* Text at (x, y); anchor "start", "middle" or "end"; halo for legibility
 * over lines. */
static int
text(W w, double x, double y, double fs, const char *anchor, int bold,
     int halo, const char *colour, const char *fmt, ...)
	__attribute__((format(printf, 9, 10)));

static int
text(W w, double x, double y, double fs, const char *anchor, int bold,
     int halo, const char *colour, const char *fmt, ...)
{
	char buf[512];
	va_list ap;
	int rc;

	va_start(ap, fmt);
	vsnprintf(buf, sizeof buf, fmt, ap);
	va_end(ap);
	rc = start(w, "text");
	rc |= num(w, "x", x);
	rc |= num(w, "y", y);
	rc |= num(w, "font-size", fs);
	if (strcmp(anchor, "start") != 0)
		rc |= attr(w, "text-anchor", anchor);
	if (bold)
		rc |= attr(w, "font-weight", "bold");
	rc |= attr(w, "fill", colour);
	if (halo) {
		rc |= attr(w, "stroke", "#ffffff");
		rc |= attr(w, "stroke-width", "3");
		rc |= attr(w, "paint-order", "stroke");
	}
	rc |= xmlTextWriterWriteString(w, BAD_CAST buf);
	return rc | end(w);
}

/* A duty as the grid shows it: whole kW, or MMBtu/h to 0.01. */
static void
duty(char *b, size_t n, double q)
{
	if (hl_display_get() == HL_UNITS_SI)
		snprintf(b, n, "%.0f", q);
	else
		snprintf(b, n, "%.2f", hl_show_q(q) * 1e-6);
}

static const char *
duty_unit(void)
{
	return hl_display_get() == HL_UNITS_SI ? "kW" : "MMBtu/h";
}

/* A temperature in the display unit without a needless decimal. */
static void
temp(char *b, size_t n, double t)
{
	t = hl_show_t(t);
	if (fabs(t - nearbyint(t)) < 0.05)
		snprintf(b, n, "%.0f", t);
	else
		snprintf(b, n, "%.1f", t);
}

static const char *
stream_colour(hl_kind k)
{
	return hex(k == HL_HOT ? HL_SVG_VERMILION : HL_SVG_BLUE);
}

static int
arrow(W w, double x, double y, int right, const char *colour)
{
	char pts[128];
	double d = right ? 1.0 : -1.0;
	int rc = start(w, "polygon");

	snprintf(pts, sizeof pts, "%.2f,%.2f %.2f,%.2f %.2f,%.2f", x, y,
	    x - d * 9.0, y - 4.5, x - d * 9.0, y + 4.5);
	rc |= attr(w, "points", pts);
	rc |= attr(w, "fill", colour);
	return rc | end(w);
}

static int
draw_header(W w, const hl_network *net, const hl_grid_opts *o)
{
	char sub[256];
	int rc = start(w, "rect");

	rc |= attr(w, "x", "12");
	rc |= attr(w, "y", "11");
	rc |= attr(w, "width", "4");
	rc |= attr(w, "height", "38");
	rc |= attr(w, "fill", INK);
	rc |= end(w);
	rc |= text(w, 24, 27, FS_TITLE, "start", 1, 0, INK, "%s",
	    o != NULL && o->title != NULL ? o->title :
	    "Heat exchanger network");
	if (o != NULL && o->subtitle != NULL)
		snprintf(sub, sizeof sub, "%s", o->subtitle);
	else
		snprintf(sub, sizeof sub, "ΔTmin %g %s · hot utility %.*f %s · "
		    "cold utility %.*f %s · %zu units, %zu split%s",
		    hl_show_dt(net->set.dtmin), HL_SYM_DT, HL_DIG_Q(1),
		    hl_show_q(net->qh), HL_SYM_Q, HL_DIG_Q(1),
		    hl_show_q(net->qc), HL_SYM_Q, net->nunit, net->nsplit,
		    net->nsplit == 1 ? "" : "s");
	rc |= text(w, 24, 45, FS_SUB, "start", 0, 0, INK_SOFT, "%s", sub);
	return rc;
}

static int utility_pinch(const hl_grid_opts *o, double t);

static int
any_utility_pinch(const hl_grid_opts *o)
{
	size_t i;

	for (i = 0; i < o->npinch; i++)
		if (utility_pinch(o, o->pinch[i]))
			return 1;
	return 0;
}

/* A pinch that the process alone does not have: a utility level's. */
static int
utility_pinch(const hl_grid_opts *o, double t)
{
	size_t i;

	if (o->cas == NULL)
		return 0;
	for (i = 0; i < o->cas->npinch; i++)
		if (fabs(o->cas->t[o->cas->pinch[i]] - t) <= 1e-9)
			return 0;
	return 1;
}

static int
draw_pinches(W w, const hl_grid_layout *L, const hl_network *net,
	     const hl_grid_opts *o)
{
	double last_end = -HUGE_VAL;
	size_t i;
	int rc = 0, up = 0;

	for (i = 0; i < L->npinch; i++) {
		char h[32], c[32], label[96];
		double x = L->pinch_x[i], half = net->set.dtmin / 2.0, wd;

		if (isnan(x))
			continue;
		int util = utility_pinch(o, o->pinch[i]);

		temp(h, sizeof h, o->pinch[i] + half);
		temp(c, sizeof c, o->pinch[i] - half);
		snprintf(label, sizeof label, "%spinch %s / %s %s", util ?
		    "utility " : "", h, c, HL_SYM_T);
		wd = hl_grid_text_width(label, FS_T);
		/* A label that would touch the one before it goes a row up. */
		up = x - 0.5 * wd < last_end + 6.0 ? !up : 0;
		last_end = x + 0.5 * wd;
		rc |= line(w, x, L->top - (up ? 38 : 26), x, L->bottom + 14,
		    hex(util ? HL_SVG_ORANGE : HL_SVG_GREY), 1.4,
		    util ? "2 3" : "6 4");
		rc |= text(w, x, L->top - (up ? 42 : 30), FS_T, "middle", 0, 1,
		    INK_SOFT, "%s", label);
	}
	return rc;
}

/* Temperature of party p after stage g, where its branches mix: the
 * profile at the heat of stages 1..g. */
static double
stage_out(const hl_network *net, size_t p, int g)
{
	const hl_network_party *s = &net->party[p];
	double q = 0.0;
	size_t i;

	for (i = 0; i < net->nunit; i++) {
		const hl_network_unit *u = &net->unit[i];

		if ((u->hot == p && u->hot_stage >= 1 && u->hot_stage <= g) ||
		    (u->cold == p && u->cold_stage >= 1 && u->cold_stage <= g))
			q += u->duty;
	}
	return hl_profile_temp(s->seg, s->nseg, s->kind, q);
}

static int
max_stage(const hl_network *net, size_t p)
{
	int last = 0;
	size_t i;

	for (i = 0; i < net->nunit; i++) {
		const hl_network_unit *u = &net->unit[i];

		if (u->hot == p && u->hot_stage > last)
			last = u->hot_stage;
		if (u->cold == p && u->cold_stage > last)
			last = u->cold_stage;
	}
	return last;
}

/* x range of the units of stage g of party p. */
static int
stage_x(const hl_network *net, const hl_grid_layout *L, size_t p, int g,
	double *lo, double *hi, size_t *count)
{
	size_t i;

	*lo = HUGE_VAL;
	*hi = -HUGE_VAL;
	*count = 0;
	for (i = 0; i < net->nunit; i++) {
		const hl_network_unit *u = &net->unit[i];

		if ((u->hot == p && u->hot_stage == g) ||
		    (u->cold == p && u->cold_stage == g)) {
			*lo = fmin(*lo, L->x[i]);
			*hi = fmax(*hi, L->x[i]);
			(*count)++;
		}
	}
	return *count > 0;
}

/* A split: parallel branches between a split and a mixing point; each
 * branch's share just outside the split point and its outlet temperature
 * just outside the mixing point, under the branch. */
static int
draw_split(W w, const hl_network *net, const hl_grid_layout *L, size_t p,
	   int g, double lo, double hi)
{
	const hl_network_party *s = &net->party[p];
	const char *col = stream_colour(s->kind);
	double y = L->row[p], xl = lo - 18.0, xr = hi + 18.0, ylast = y;
	int hot = s->kind == HL_HOT, rc = 0;
	/* Hot streams split on the left, cold ones on the right. */
	double xs = hot ? xl : xr, xm = hot ? xr : xl, d = hot ? -4.0 : 4.0;
	size_t i;
	char t[32];

	for (i = 0; i < net->nunit; i++) {
		const hl_network_unit *u = &net->unit[i];
		double yb;

		if (!((u->hot == p && u->hot_stage == g) ||
		    (u->cold == p && u->cold_stage == g)))
			continue;
		yb = hot ? L->yh[i] : L->yc[i];
		ylast = fmax(ylast, yb);
		if (yb > y)
			rc |= line(w, xl, yb, xr, yb, col, 2.0, NULL);
		rc |= text(w, xs + d, yb + 12, FS_T - 1, hot ? "end" : "start",
		    0, 1, INK_SOFT, "%.2f", hot ? u->hot_share :
		    u->cold_share);
		temp(t, sizeof t, hot ? u->hot_out : u->cold_out);
		rc |= text(w, xm - d, yb + 12, FS_T - 1, hot ? "start" : "end",
		    0, 1, INK_SOFT, "%s", t);
	}
	rc |= line(w, xl, y, xl, ylast, col, 2.0, NULL);
	rc |= line(w, xr, y, xr, ylast, col, 2.0, NULL);
	return rc;
}

/* One process stream: its line and arrow, name, end temperatures, its
 * splits and the temperatures between its stages. */
static int
draw_stream(W w, const hl_network *net, const hl_grid_layout *L, size_t p)
{
	const hl_network_party *s = &net->party[p];
	const char *col = stream_colour(s->kind);
	double y = L->row[p], prev_hi = NAN, prev_lo = NAN;
	int hot = s->kind == HL_HOT, g, last = max_stage(net, p), rc = 0;
	char t[32];
	size_t k;

	rc |= line(w, L->left, y, L->right, y, col, 2.4, NULL);
	rc |= arrow(w, hot ? L->right + 2 : L->left - 2, y, hot, col);
	k = hl_grid_name_break(s->name);
	if (s->name[k] == '\0')
		rc |= text(w, L->left - 14, y + 4, FS_NAME, "end", 0, 0, INK,
		    "%s", s->name);
	else {
		rc |= text(w, L->left - 14, y - 2, FS_NAME, "end", 0, 0, INK,
		    "%.*s", (int)k, s->name);
		rc |= text(w, L->left - 14, y + 11, FS_NAME, "end", 0, 0, INK,
		    "%s", s->name + k + 1);
	}
	temp(t, sizeof t, s->supply);
	rc |= text(w, hot ? L->left + 3 : L->right - 3, y - 6, FS_T,
	    hot ? "start" : "end", 1, 1, col, "%s %s", t, HL_SYM_T);
	temp(t, sizeof t, s->target);
	rc |= text(w, hot ? L->right - 3 : L->left + 3, y - 6, FS_T,
	    hot ? "end" : "start", 1, 1, col, "%s %s", t, HL_SYM_T);
	for (g = 1; g <= last; g++) {
		double lo, hi, out;
		size_t count;

		if (!stage_x(net, L, p, g, &lo, &hi, &count))
			continue;
		if (count > 1)
			rc |= draw_split(w, net, L, p, g, lo, hi);
		/* The temperature between this stage and the one before it,
		 * midway between them. */
		if (g > 1 && !isnan(prev_lo)) {
			double x = hot ? 0.5 * (prev_hi + lo) :
			    0.5 * (hi + prev_lo);

			out = stage_out(net, p, g - 1);
			temp(t, sizeof t, out);
			/* Where no label stands at the columns: below a hot
			 * line (ids above it), above a cold one (duties below
			 * it). */
			if (!isnan(out))
				rc |= text(w, x, hot ? y + 15 : y - 6, FS_T,
				    "middle", 0, 1, INK_SOFT, "%s", t);
		}
		prev_lo = lo;
		prev_hi = hi;
	}
	return rc;
}

static int
circle(W w, double x, double y, const char *fill)
{
	int rc = start(w, "circle");

	rc |= num(w, "cx", x);
	rc |= num(w, "cy", y);
	rc |= num(w, "r", MARK_R);
	rc |= attr(w, "fill", fill);
	rc |= attr(w, "stroke", INK);
	rc |= attr(w, "stroke-width", "1.6");
	return rc | end(w);
}

static int
square(W w, double x, double y, const char *fill)
{
	int rc = start(w, "rect");

	rc |= num(w, "x", x - MARK_R);
	rc |= num(w, "y", y - MARK_R);
	rc |= num(w, "width", 2 * MARK_R);
	rc |= num(w, "height", 2 * MARK_R);
	rc |= attr(w, "fill", fill);
	rc |= attr(w, "stroke", INK);
	rc |= attr(w, "stroke-width", "1.6");
	return rc | end(w);
}

/* A retrofit change: new, with area (firing) added, or re-piped. */
static int
changed(const hl_network_unit *u)
{
	return u->held && (u->reuses[0] == '\0' || u->area_added > 0.0 ||
	    u->duty_added > 0.0 || u->moved);
}

/* The ring around a changed unit's mark (drawn under it). */
static int
ring(W w, double x, double y)
{
	int rc = start(w, "circle");

	rc |= num(w, "cx", x);
	rc |= num(w, "cy", y);
	rc |= num(w, "r", MARK_R + 4.5);
	rc |= attr(w, "fill", "none");
	rc |= attr(w, "stroke", INK);
	rc |= attr(w, "stroke-width", "1.2");
	rc |= attr(w, "stroke-dasharray", "3 2");
	return rc | end(w);
}

/* A unit: linked round marks with the id above and the duty (kW) below;
 * a heater or cooler a square on its one process stream; a retrofit
 * change ringed. */
static int
draw_unit(W w, const hl_network *net, const hl_grid_layout *L, size_t i)
{
	const hl_network_unit *u = &net->unit[i];
	double x = L->x[i], yh = L->yh[i], yc = L->yc[i], y;
	char d[32];
	int rc = 0;

	if (changed(u)) {
		if (!isnan(yh))
			rc |= ring(w, x, yh);
		if (!isnan(yc))
			rc |= ring(w, x, yc);
	}
	if (!isnan(yh) && !isnan(yc)) {
		rc |= line(w, x, yh, x, yc, INK, 1.3, NULL);
		rc |= circle(w, x, yh, "#ffffff");
		rc |= circle(w, x, yc, "#ffffff");
		rc |= text(w, x, yh - 11, FS_ID, "middle", 1, 1, INK, "%s",
		    u->id);
		duty(d, sizeof d, u->duty);
		rc |= text(w, x, yc + 19, FS_T, "middle", 0, 1, INK, "%s", d);
		return rc;
	}
	/* Id over duty below the line: two short lines fit between close
	 * columns, and a hot line's end temperature stays clear above. */
	y = isnan(yh) ? yc : yh;
	rc |= square(w, x, y, hex(isnan(yh) ? HL_SVG_ORANGE : HL_SVG_SKY));
	rc |= text(w, x, y + 20, FS_ID, "middle", 1, 1, INK, "%s", u->id);
	duty(d, sizeof d, u->duty);
	rc |= text(w, x, y + 31, FS_T, "middle", 0, 1, INK, "%s", d);
	return rc;
}

/* The key: what the marks mean, then every heater and cooler with its
 * utility, then the small print. Returns the y below it. */
static int
draw_key(W w, const hl_network *net, const hl_grid_layout *L,
	 const hl_grid_opts *o, double *bottom)
{
	char what[64];
	double y = L->key_top, x = 30.0, col_w = (L->width - 48.0) / 2.0;
	size_t i, k = 0;
	int rc = 0;

	snprintf(what, sizeof what, "exchanger (id above, duty in %s below)",
	    duty_unit());
	rc |= line(w, x, y, x + 26, y, INK, 1.3, NULL);
	rc |= circle(w, x, y, "#ffffff");
	rc |= circle(w, x + 26, y, "#ffffff");
	rc |= text(w, x + 40, y + 4, FS_T, "start", 0, 0, INK, "%s", what);
	x += 40 + hl_grid_text_width(what, FS_T) + 30;
	rc |= square(w, x, y, hex(HL_SVG_ORANGE));
	rc |= text(w, x + 13, y + 4, FS_T, "start", 0, 0, INK, "heater");
	x += 13 + hl_grid_text_width("heater", FS_T) + 30;
	rc |= square(w, x, y, hex(HL_SVG_SKY));
	rc |= text(w, x + 13, y + 4, FS_T, "start", 0, 0, INK, "cooler");
	x += 13 + hl_grid_text_width("cooler", FS_T) + 30;
	rc |= line(w, x, y - 8, x, y + 8, hex(HL_SVG_GREY), 1.4, "6 4");
	rc |= text(w, x + 8, y + 4, FS_T, "start", 0, 0, INK, "pinch");
	if (any_utility_pinch(o)) {
		x += 8 + hl_grid_text_width("pinch", FS_T) + 30;
		rc |= line(w, x, y - 8, x, y + 8, hex(HL_SVG_ORANGE), 1.4,
		    "2 3");
		rc |= text(w, x + 8, y + 4, FS_T, "start", 0, 0, INK,
		    "utility pinch");
	}
	for (i = 0; i < net->nunit && !changed(&net->unit[i]); i++)
		;
	if (i < net->nunit) {
		x += 8 + hl_grid_text_width(any_utility_pinch(o) ? "utility pinch" : "pinch", FS_T) + 30;
		rc |= ring(w, x, y);
		rc |= text(w, x + 16, y + 4, FS_T, "start", 0, 0, INK,
		    "new or changed");
	}
	y += KEY_ROW;
	rc |= text(w, 24, y + 4, FS_T, "start", 0, 0, INK_SOFT, "Hot streams "
	    "run left to right, cold streams right to left (%s between "
	    "stages); split branches: share and outlet %s.", HL_SYM_T,
	    HL_SYM_T);
	y += KEY_ROW;
	for (i = 0; i < net->nunit; i++) {
		const hl_network_unit *u = &net->unit[i];
		const hl_network_party *h = &net->party[u->hot];
		const hl_network_party *c = &net->party[u->cold];

		if (!h->utility && !c->utility)
			continue;
		rc |= text(w, 24 + (double)(k % 2) * col_w, y + 4, FS_T,
		    "start", 0, 0, INK, "%s: %s %s %s, %.*f %s", u->id,
		    h->utility ? h->name : c->name, h->utility ? "heats" :
		    "cools", h->utility ? c->name : h->name, HL_DIG_Q(1),
		    hl_show_q(u->duty), HL_SYM_Q);
		if (k++ % 2 == 1)
			y += KEY_ROW - 2;
	}
	if (k % 2 == 1)
		y += KEY_ROW - 2;
	if (o != NULL && o->footnote != NULL) {
		/* Two lines at most, broken at a space near the middle; the
		 * text's own line breaks are blanks. */
		char f[1024];
		size_t n, cut, m;

		snprintf(f, sizeof f, "%s", o->footnote);
		for (m = 0; f[m] != '\0'; m++)
			if (f[m] == '\n')
				f[m] = ' ';
		n = strlen(f);
		cut = n;

		y += 8;
		if (hl_grid_text_width(f, FS_FOOT) > L->width - 48) {
			for (cut = n / 2; cut < n && f[cut] != ' '; cut++)
				;
		}
		rc |= text(w, 24, y, FS_FOOT, "start", 0, 0, INK_SOFT, "%.*s",
		    (int)cut, f);
		if (cut < n) {
			y += 14;
			rc |= text(w, 24, y, FS_FOOT, "start", 0, 0, INK_SOFT,
			    "%s", f + cut + 1);
		}
	}
	*bottom = y + 16;
	return rc;
}

static int
draw(W w, const hl_network *net, const hl_grid_layout *L,
     const hl_grid_opts *o, double height)
{
	char buf[64];
	double bottom;
	size_t i;
	int rc = start(w, "svg");

	rc |= attr(w, "xmlns", "http://www.w3.org/2000/svg");
	rc |= attr(w, "version", "1.1");
	snprintf(buf, sizeof buf, "%gmm", L->width / 4.0);
	rc |= attr(w, "width", buf);
	snprintf(buf, sizeof buf, "%gmm", height / 4.0);
	rc |= attr(w, "height", buf);
	snprintf(buf, sizeof buf, "0 0 %g %g", L->width, height);
	rc |= attr(w, "viewBox", buf);
	rc |= attr(w, "font-family", FONT);
	rc |= attr(w, "role", "img");
	rc |= start(w, "title");
	rc |= xmlTextWriterWriteString(w, BAD_CAST(o != NULL &&
	    o->title != NULL ? o->title : "Heat exchanger network"));
	rc |= end(w);
	rc |= start(w, "rect");
	rc |= attr(w, "width", "100%");
	rc |= attr(w, "height", "100%");
	rc |= attr(w, "fill", "#ffffff");
	rc |= end(w);
	rc |= draw_header(w, net, o);
	if (o != NULL)
		rc |= draw_pinches(w, L, net, o);
	for (i = 0; i < net->nparty; i++)
		if (!net->party[i].utility)
			rc |= draw_stream(w, net, L, i);
	for (i = 0; i < net->nunit; i++)
		rc |= draw_unit(w, net, L, i);
	rc |= draw_key(w, net, L, o, &bottom);
	return rc | end(w);
}

/* Height of the key: marks, one sentence, heaters and coolers two to a
 * row, the small print. */
static double
key_height(const hl_network *net, const hl_grid_opts *o)
{
	size_t i, k = 0;

	for (i = 0; i < net->nunit; i++)
		k += net->party[net->unit[i].hot].utility ||
		    net->party[net->unit[i].cold].utility;
	return 2 * KEY_ROW + (double)((k + 1) / 2) * (KEY_ROW - 2) +
	    (o != NULL && o->footnote != NULL ? 44.0 : 16.0);
}

hl_status
hl_grid_svg_write_into(const hl_network *net, const hl_grid_opts *o, W w,
		       hl_error *err)
{
	hl_grid_layout L;
	int rc;

	if (hl_grid_layout_make(net, o, &L) != 0)
		return hl_error_nomem(err);
	rc = draw(w, net, &L, o, L.key_top + key_height(net, o));
	hl_grid_layout_free(&L);
	if (rc < 0)
		return hl_error_set(err, HL_EIO, NULL, 0, "cannot write the "
		    "grid diagram");
	return HL_OK;
}

hl_status
hl_grid_svg_write(const hl_network *net, const hl_grid_opts *o, FILE *fp,
		  hl_error *err)
{
	xmlBufferPtr buf = xmlBufferCreate();
	W w = buf != NULL ? xmlNewTextWriterMemory(buf, 0) : NULL;
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
	    hl_error_set(err, HL_EIO, NULL, 0, "cannot write the grid "
	    "diagram") : hl_grid_svg_write_into(net, o, w, err);
	if (st == HL_OK && xmlTextWriterEndDocument(w) < 0)
		st = hl_error_set(err, HL_EIO, NULL, 0, "cannot write the "
		    "grid diagram");
	xmlFreeTextWriter(w);
	len = (size_t)xmlBufferLength(buf);
	if (st == HL_OK && fwrite(xmlBufferContent(buf), 1, len, fp) != len)
		st = hl_error_set(err, HL_EIO, NULL, 0, "cannot write the "
		    "grid diagram");
	xmlBufferFree(buf);
	return st;
}
