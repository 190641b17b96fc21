/* curves_out.c - charts and CSV points of the composite curves. */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "curves_out.h"
#include "display.h"
#include "result_xml.h"

/* Heat axis unit: kW, or MW past 20 000 kW; MMBtu/h in US units. */
typedef struct {
	double f;          /* multiply kW by f */
	const char *unit;
} heat_scale;

static heat_scale
scale_for(double max_kw)
{
	heat_scale s = { 1.0, "kW" };

	if (hl_display_get() == HL_UNITS_US) {
		s.f = hl_show_q(1.0) * 1e-6;
		s.unit = "MMBtu/h";
	} else if (max_kw > 20000.0) {
		s.f = 1e-3;
		s.unit = "MW";
	}
	return s;
}

/* A whole number with thin spaces between thousands: "2 200 000". */
static void
grouped(char *buf, size_t size, double v)
{
	char num[64], *p = buf;
	size_t i, n;

	snprintf(num, sizeof num, "%.0f", fabs(v));
	n = strlen(num);
	if (v <= -0.5 && size > 2)
		*p++ = '-';
	for (i = 0; i < n && (size_t)(p - buf) + 5 < size; i++) {
		if (i > 0 && (n - i) % 3 == 0)
			p += snprintf(p, 4, "\xe2\x80\x89");
		*p++ = num[i];
	}
	*p = '\0';
}

/* "1 552 kW", "20.0 kW", "7.50 MW". */
static void
heat_text(char *buf, size_t size, double kw, heat_scale s)
{
	char num[64];

	if (s.f != 1.0)
		snprintf(buf, size, "%.2f %s", kw * s.f, s.unit);
	else if (fabs(kw) < 100.0)
		snprintf(buf, size, "%.1f kW", kw);
	else {
		grouped(num, sizeof num, kw);
		snprintf(buf, size, "%.56s kW", num);
	}
}

static const char *
case_name(const hl_case *c)
{
	const char *s = c->source ? c->source : "case", *slash;

	slash = strrchr(s, '/');
	return slash ? slash + 1 : s;
}

static int
add_curve(hl_svg_chart *ch, const char *label, const hl_curve *cv,
	  heat_scale s, hl_svg_colour col, hl_svg_dash dash, double width)
{
	hl_svg_style st = { col, dash, width, HL_SVG_MARK_NONE,
			    HL_SVG_STEP_NONE };
	double *h = malloc((cv->n + 1) * sizeof *h);
	double *t = malloc((cv->n + 1) * sizeof *t);
	size_t i;
	int rc = -1;

	for (i = 0; h != NULL && t != NULL && i < cv->n; i++) {
		h[i] = cv->h[i] * s.f;
		t[i] = hl_show_t(cv->t[i]);
	}
	if (h != NULL && t != NULL)
		rc = hl_svg_chart_add_series(ch, label, h, t, cv->n, &st);
	free(h);
	free(t);
	return rc;
}

static hl_svg_chart *
new_chart(const char *title, const char *ylabel, const char *xname,
	  heat_scale s)
{
	char xl[64];
	hl_svg_chart *ch;

	snprintf(xl, sizeof xl, "%s (%s)", xname, s.unit);
	ch = hl_svg_chart_create(title, xl, ylabel);
	if (ch != NULL && hl_svg_chart_set_footnote(ch, hl_svg_caution) < 0) {
		hl_svg_chart_free(ch);
		return NULL;
	}
	return ch;
}

static double
last_t(const hl_curve *cv)
{
	return cv->n ? cv->t[cv->n - 1] : 0.0;
}

static double
first_t(const hl_curve *cv)
{
	return cv->n ? cv->t[0] : 0.0;
}

static double
last_h(const hl_curve *cv)
{
	return cv->n ? cv->h[cv->n - 1] : 0.0;
}

/* QHmin between the tops of the curves, QCmin between their feet. */
static int
target_spans(hl_svg_chart *ch, const hl_curve *hot, const hl_curve *cold,
	     const hl_curves *cv, heat_scale s)
{
	double top = hl_show_t(fmax(last_t(hot), last_t(cold)));
	double foot = hl_show_t(fmin(first_t(hot), first_t(cold)));
	double pad = 0.04 * (top - foot);
	char a[64], b[96];
	int rc = 0;

	if (cv->qh > 0.0) {
		heat_text(a, sizeof a, cv->qh, s);
		snprintf(b, sizeof b, "QHmin %s", a);
		rc |= hl_svg_chart_add_span(ch, last_h(hot) * s.f,
			(last_h(hot) + cv->qh) * s.f, top + pad, b,
			HL_SVG_VERMILION);
	}
	if (cv->qc > 0.0) {
		heat_text(a, sizeof a, cv->qc, s);
		snprintf(b, sizeof b, "QCmin %s", a);
		rc |= hl_svg_chart_add_span(ch, 0.0, cv->qc * s.f, foot - pad,
			b, HL_SVG_BLUE);
	}
	return rc;
}

static void
target_subtitle(char *buf, size_t size, const hl_case *c,
		const hl_curves *cv, heat_scale s)
{
	char a[64], b[64], r[64];

	heat_text(a, sizeof a, cv->qh, s);
	heat_text(b, sizeof b, cv->qc, s);
	heat_text(r, sizeof r, cv->recovery, s);
	snprintf(buf, size, "%.120s \xc2\xb7 \xce\x94Tmin %g %s \xc2\xb7 QHmin "
		 "%s \xc2\xb7 QCmin %s \xc2\xb7 heat recovery %s", case_name(c),
		 hl_show_dt(cv->dtmin), HL_SYM_DT, a, b, r);
}

static int
composite_pinches(hl_svg_chart *ch, const hl_cascade *cas,
		  const hl_curves *cv, int shifted, heat_scale s)
{
	char b[96];
	size_t i;
	int rc = 0;

	for (i = 0; i < cas->npinch; i++) {
		double t = cas->t[cas->pinch[i]];
		double th = hl_cascade_hot_temp(cas, t);
		double tc = hl_cascade_cold_temp(cas, t);

		if (shifted) {
			snprintf(b, sizeof b, "pinch %.1f %s shifted",
				 hl_show_t(t), HL_SYM_T);
			rc |= hl_svg_chart_add_hline(ch, hl_show_t(t), b,
						     HL_SVG_GREY,
						     HL_SVG_DOTTED, HL_SVG_START);
		} else {
			snprintf(b, sizeof b, "pinch %.1f / %.1f %s",
				 hl_show_t(th), hl_show_t(tc), HL_SYM_T);
			rc |= hl_svg_chart_add_vline(ch,
				hl_curve_heat_at(&cv->hot, th) * s.f, b,
				HL_SVG_GREY, HL_SVG_DOTTED);
		}
	}
	return rc;
}

hl_svg_chart *
hl_curves_chart_composite(const hl_case *c, const hl_cascade *cas,
			  const hl_curves *cv, int shifted)
{
	const hl_curve *hot = shifted ? &cv->shifted_hot : &cv->hot;
	const hl_curve *cold = shifted ? &cv->shifted_cold : &cv->cold;
	heat_scale s = scale_for(fmax(last_h(hot), last_h(cold)));
	hl_svg_chart *ch;
	char sub[512], yl[64];
	int rc = 0;

	snprintf(yl, sizeof yl, "%s (%s)", shifted ? "Shifted temperature" :
		 "Temperature", HL_SYM_T);
	ch = new_chart(shifted ? "Shifted composite curves" :
		       "Composite curves", yl, "Heat load", s);
	if (ch == NULL)
		return NULL;
	target_subtitle(sub, sizeof sub, c, cv, s);
	rc |= hl_svg_chart_set_subtitle(ch, sub);
	rc |= hl_svg_chart_set_id(ch, shifted ? "shifted" : "composite");
	rc |= add_curve(ch, "Hot composite curve", hot, s, HL_SVG_VERMILION,
			HL_SVG_SOLID, 2.6);
	rc |= add_curve(ch, "Cold composite curve", cold, s, HL_SVG_BLUE,
			HL_SVG_DASHED, 2.6);
	rc |= composite_pinches(ch, cas, cv, shifted, s);
	rc |= target_spans(ch, hot, cold, cv, s);
	hl_svg_chart_set_xrange(ch, 0.0, NAN);
	if (rc < 0) {
		hl_svg_chart_free(ch);
		return NULL;
	}
	return ch;
}

static double max_h(const hl_curve *cv);

/* Heat flow of the grand composite at shifted t (linear between
 * boundaries). */
static double
grand_at(const hl_cascade *cas, double t)
{
	size_t k;

	for (k = 0; k + 1 < cas->nb; k++)
		if (t <= cas->t[k] && t >= cas->t[k + 1])
			return cas->flow[k] + (cas->flow[k + 1] - cas->flow[k]) *
			       (cas->t[k] - t) / (cas->t[k] - cas->t[k + 1]);
	return t > cas->t[0] ? cas->flow[0] : cas->flow[cas->nb - 1];
}

/* A level's label sits over the middle of its line; when the line is
 * shorter than the label (about 6.7 chart units a character on a plot some
 * 600 units wide), beside its far end instead. */
static int
level_labels(hl_svg_chart *ch, const hl_case *c, const hl_curves *cv,
	     const hl_utility_lp *lp, heat_scale s, double xmax)
{
	char a[64], b[192];
	size_t i;
	int rc = 0;

	for (i = 0; i < cv->nlevel; i++) {
		const hl_curve_level *l = &cv->level[i];
		double load = lp->util[l->util].load;
		double line = load / (xmax > 0 ? xmax : 1) * 600.0;

		heat_text(a, sizeof a, load, s);
		snprintf(b, sizeof b, "%s %s", c->util[l->util].name, a);
		if (line >= 6.7 * (double)strlen(b))
			rc |= hl_svg_chart_add_text(ch, l->h * s.f,
						    hl_show_t(l->t), b,
						    HL_SVG_MIDDLE, 0.0, -7.0);
		else
			rc |= hl_svg_chart_add_text(ch, (l->h + load / 2) * s.f,
						    hl_show_t(l->t), b, HL_SVG_START, 8.0,
						    4.0);
	}
	for (i = 0; i < c->nutil; i++) {
		const hl_utility_load *u = &lp->util[i];

		if (u->use == HL_UTIL_USED)
			continue;
		snprintf(b, sizeof b, "%s: %s", c->util[i].name,
			 hl_utility_use_name(u->use));
		rc |= hl_svg_chart_add_hline(ch, hl_show_t(
			c->util[i].kind == HL_HOT ? u->t_hi : u->t_lo), b, HL_SVG_GREY, HL_SVG_DOTTED,
			HL_SVG_END);
	}
	return rc;
}

/* Pinches as marker series, so that the legend names them and no label
 * competes with the curves for room near the pinch. */
static int
grand_pinches(hl_svg_chart *ch, const hl_case *c, const hl_cascade *cas,
	      const hl_utility_lp *lp, heat_scale s)
{
	hl_svg_style ps = { HL_SVG_BLACK, HL_SVG_NOLINE, 0, HL_SVG_MARK_DIAMOND,
			    HL_SVG_STEP_NONE };
	hl_svg_style us = { HL_SVG_ORANGE, HL_SVG_NOLINE, 0, HL_SVG_MARK_CIRCLE,
			    HL_SVG_STEP_NONE };
	size_t i, n = cas->npinch + (lp ? lp->npinch : 0), len;
	double *x = malloc((n + 1) * sizeof *x), *y = malloc((n + 1) * sizeof *y);
	char b[256];
	int rc = 0;

	if (x == NULL || y == NULL) {
		free(x);
		free(y);
		return -1;
	}
	for (i = 0; i < cas->npinch; i++) {
		x[i] = 0.0;
		y[i] = hl_show_t(cas->t[cas->pinch[i]]);
	}
	if (cas->npinch == 1)
		snprintf(b, sizeof b, "Process pinch %.1f %s shifted", y[0],
			 HL_SYM_T);
	else
		snprintf(b, sizeof b, "Process pinches");
	if (cas->npinch > 0)
		rc |= hl_svg_chart_add_series(ch, b, x, y, cas->npinch, &ps);
	len = (size_t)snprintf(b, sizeof b, "Utility pinch%s at",
			       lp && lp->npinch > 1 ? "es" : "");
	for (i = 0; lp != NULL && i < lp->npinch; i++) {
		const hl_utility_pinch *p = &lp->pinch[i];

		x[i] = grand_at(cas, p->shifted) * s.f;
		y[i] = hl_show_t(p->shifted);
		if (len + 64 >= sizeof b)
			continue;
		if (p->util >= 0)
			len += (size_t)snprintf(b + len, sizeof b - len,
				"%s %.40s level", i ? "," : "",
				c->util[p->util].name);
		else
			len += (size_t)snprintf(b + len, sizeof b - len,
				"%s %.1f %s shifted", i ? "," : "",
				hl_show_t(p->shifted), HL_SYM_T);
	}
	if (lp != NULL && lp->npinch > 0)
		rc |= hl_svg_chart_add_series(ch, b, x, y, lp->npinch, &us);
	free(x);
	free(y);
	return rc;
}

static double
max_h(const hl_curve *cv)
{
	double m = 0.0;
	size_t i;

	for (i = 0; i < cv->n; i++)
		m = fmax(m, cv->h[i]);
	return m;
}

hl_svg_chart *
hl_curves_chart_grand(const hl_case *c, const hl_cascade *cas,
		      const hl_curves *cv, const hl_utility_lp *lp)
{
	heat_scale s = scale_for(fmax(max_h(&cv->grand),
				      max_h(&cv->grand_util)));
	hl_svg_chart *ch;
	char sub[512], a[64], yl[64];
	int rc = 0;

	snprintf(yl, sizeof yl, "Shifted temperature (%s)", HL_SYM_T);
	ch = new_chart("Grand composite curve", yl, "Net heat flow", s);
	if (ch == NULL)
		return NULL;
	if (lp != NULL) {
		grouped(a, sizeof a, lp->cost);
		snprintf(sub, sizeof sub, "%.120s \xc2\xb7 \xce\x94Tmin %g %s "
			 "\xc2\xb7 utility levels at least cost: %s %s per "
			 "year", case_name(c), hl_show_dt(cv->dtmin),
			 HL_SYM_DT, a,
			 c->set.currency ? c->set.currency : "");
	} else {
		snprintf(sub, sizeof sub, "%.120s \xc2\xb7 \xce\x94Tmin %g %s",
			 case_name(c), hl_show_dt(cv->dtmin), HL_SYM_DT);
	}
	rc |= hl_svg_chart_set_subtitle(ch, sub);
	rc |= hl_svg_chart_set_id(ch, "grand");
	rc |= add_curve(ch, "Grand composite curve", &cv->grand, s,
			HL_SVG_BLACK, HL_SVG_SOLID, 2.6);
	if (lp != NULL && cv->grand_util.n > 0)
		rc |= add_curve(ch, "With the heat utility ranges give across "
				"the pinch", &cv->grand_util, s, HL_SVG_GREY,
				HL_SVG_DOTTED, 2.2);
	if (lp != NULL && cv->hot_util.n > 0)
		rc |= add_curve(ch, "Hot utilities", &cv->hot_util, s,
				HL_SVG_VERMILION, HL_SVG_DASHED, 2.2);
	if (lp != NULL && cv->cold_util.n > 0)
		rc |= add_curve(ch, "Cold utilities", &cv->cold_util, s,
				HL_SVG_BLUE, HL_SVG_DASHDOT, 2.2);
	if (lp != NULL)
		rc |= level_labels(ch, c, cv, lp, s, max_h(&cv->grand));
	rc |= grand_pinches(ch, c, cas, lp, s);
	hl_svg_chart_set_xrange(ch, 0.0, NAN);
	if (rc < 0) {
		hl_svg_chart_free(ch);
		return NULL;
	}
	return ch;
}

static int
balanced_pinches(hl_svg_chart *ch, const hl_case *c, const hl_curves *cv,
		 const hl_utility_lp *lp, heat_scale s)
{
	char b[192];
	size_t i;
	int rc = 0;

	for (i = 0; i < lp->nproc; i++) {
		snprintf(b, sizeof b, "process pinch %.1f / %.1f %s",
			 hl_show_t(lp->proc[i].hot),
			 hl_show_t(lp->proc[i].cold), HL_SYM_T);
		rc |= hl_svg_chart_add_vline(ch, hl_curve_heat_at(&cv->bal_cold,
			lp->proc[i].cold) * s.f, b, HL_SVG_GREY, HL_SVG_DOTTED);
	}
	for (i = 0; i < lp->npinch; i++) {
		const hl_utility_pinch *p = &lp->pinch[i];
		int cold_util = p->util >= 0 && c->util[p->util].kind == HL_COLD;
		double h = cold_util ? hl_curve_heat_at(&cv->bal_hot, p->hot) :
			   hl_curve_heat_at(&cv->bal_cold, p->cold);

		if (p->util >= 0)
			snprintf(b, sizeof b, "utility pinch (%s)",
				 c->util[p->util].name);
		else
			snprintf(b, sizeof b, "utility pinch %.1f / %.1f %s",
				 hl_show_t(p->hot), hl_show_t(p->cold),
				 HL_SYM_T);
		rc |= hl_svg_chart_add_vline(ch, h * s.f, b, HL_SVG_ORANGE,
					     HL_SVG_DASHED);
	}
	return rc;
}

hl_svg_chart *
hl_curves_chart_balanced(const hl_case *c, const hl_curves *cv,
			 const hl_utility_lp *lp)
{
	heat_scale s = scale_for(last_h(&cv->bal_hot));
	hl_svg_chart *ch;
	char sub[512], a[64], b[64], yl[64];
	int rc = 0;

	snprintf(yl, sizeof yl, "Temperature (%s)", HL_SYM_T);
	ch = new_chart("Balanced composite curves", yl, "Heat load", s);
	if (ch == NULL)
		return NULL;
	heat_text(a, sizeof a, lp->hot_load, s);
	heat_text(b, sizeof b, lp->cold_load, s);
	snprintf(sub, sizeof sub, "%.120s \xc2\xb7 \xce\x94Tmin %g %s \xc2\xb7 "
		 "utilities at least cost: hot %s, cold %s", case_name(c),
		 hl_show_dt(cv->dtmin), HL_SYM_DT, a, b);
	rc |= hl_svg_chart_set_subtitle(ch, sub);
	rc |= hl_svg_chart_set_id(ch, "balanced");
	rc |= add_curve(ch, "Hot streams and hot utilities", &cv->bal_hot, s,
			HL_SVG_VERMILION, HL_SVG_SOLID, 2.6);
	rc |= add_curve(ch, "Cold streams and cold utilities", &cv->bal_cold,
			s, HL_SVG_BLUE, HL_SVG_DASHED, 2.6);
	rc |= balanced_pinches(ch, c, cv, lp, s);
	hl_svg_chart_set_xrange(ch, 0.0, NAN);
	if (rc < 0) {
		hl_svg_chart_free(ch);
		return NULL;
	}
	return ch;
}

static void
csv_curve(FILE *fp, const char *name, const hl_curve *cv)
{
	char h[64], t[64];
	size_t i;

	for (i = 0; i < cv->n; i++) {
		hl_format_number(h, sizeof h, hl_show_q(cv->h[i]));
		hl_format_number(t, sizeof t, hl_show_t(cv->t[i]));
		fprintf(fp, "%s,%s,%s\n", name, h, t);
	}
}

void
hl_curves_csv_composite(FILE *fp, const hl_curves *cv, int shifted)
{
	char a[64], b[64];

	fprintf(fp, "curve,%s,%s\n", hl_show_header(a, sizeof a, "heat",
		HL_QTY_POWER), hl_show_header(b, sizeof b, shifted ? "shifted" :
		"temperature", HL_QTY_TEMP));
	csv_curve(fp, "hot", shifted ? &cv->shifted_hot : &cv->hot);
	csv_curve(fp, "cold", shifted ? &cv->shifted_cold : &cv->cold);
}

void
hl_curves_csv_grand(FILE *fp, const hl_curves *cv)
{
	char a[64], b[64];

	fprintf(fp, "curve,%s,%s\n", hl_show_header(a, sizeof a, "heat",
		HL_QTY_POWER), hl_show_header(b, sizeof b, "shifted",
		HL_QTY_TEMP));
	csv_curve(fp, "grand", &cv->grand);
	csv_curve(fp, "grand-with-utility-ranges", &cv->grand_util);
	csv_curve(fp, "hot-utilities", &cv->hot_util);
	csv_curve(fp, "cold-utilities", &cv->cold_util);
}

void
hl_curves_csv_balanced(FILE *fp, const hl_curves *cv)
{
	char a[64], b[64];

	fprintf(fp, "curve,%s,%s\n", hl_show_header(a, sizeof a, "heat",
		HL_QTY_POWER), hl_show_header(b, sizeof b, "temperature",
		HL_QTY_TEMP));
	csv_curve(fp, "hot", &cv->bal_hot);
	csv_curve(fp, "cold", &cv->bal_cold);
}
