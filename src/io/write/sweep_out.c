/* sweep_out.c - writers of the supertargets and the ΔTmin sweep. */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "display.h"
#include "result_xml.h"
#include "sweep_out.h"

static const char *
currency(const hl_case *c)
{
	return c->set.currency ? c->set.currency : "";
}

/* The area the costs rest on: shell-and-tube or counterflow. */
static double
area_of(const hl_case *c, const hl_supertargets *s)
{
	return c->set.exchanger == HL_EXCH_SHELL_TUBE ? s->area_st : s->area;
}

static const char *
basis(const hl_case *c)
{
	return c->set.exchanger == HL_EXCH_SHELL_TUBE ?
	       "shell-and-tube shell" : "counterflow unit";
}

void
hl_supertargets_text(FILE *fp, const hl_case *c, const hl_supertargets *st)
{
	const char *cur = currency(c);

	fprintf(fp, "\nSupertargets at ΔTmin %.1f %s%s\n\n",
		hl_show_dt(st->dtmin), HL_SYM_DT,
		st->balanced ? " (balanced composites, utilities included)" :
		" (process composites only: no utility table)");
	fprintf(fp, "Area, counterflow       %.1f %s\n", hl_show_a(st->area),
		HL_SYM_A);
	fprintf(fp, "Area, shell-and-tube    %.1f %s\n",
		hl_show_a(st->area_st), HL_SYM_A);
	fprintf(fp, "Units                   %d (N − 1 in each of %zu "
		"subnetworks)\n", st->units, st->nsub);
	fprintf(fp, "Shells                  %d\n", st->shells);
	fprintf(fp, "Capital cost            %.0f %s (cost law per %s)\n",
		st->capital, cur, basis(c));
	fprintf(fp, "Annualised capital      %.0f %s/yr (%.3f capital "
		"recovery factor: %g %% over %g years)\n", st->capital_annual,
		cur, hl_supertarget_crf(c->set.interest, c->set.life),
		100.0 * c->set.interest, c->set.life);
	fprintf(fp, "Energy cost             %.0f %s/yr (%g h/yr)\n",
		st->energy_cost, cur, c->set.hours);
	fprintf(fp, "Total annual cost       %.0f %s/yr\n", st->total_cost, cur);
	if (st->assumed_h > 0)
		fprintf(fp, "Assumed: h = %g %s for %d streams or "
			"utilities without one (setting h-default)\n",
			hl_show_h(c->set.h_default), HL_SYM_H, st->assumed_h);
}

int
hl_supertargets_xml(xmlTextWriterPtr w, const char *element,
		    const hl_supertargets *st)
{
	int rc = 0;

	rc |= xmlTextWriterStartElement(w, BAD_CAST element);
	rc |= hl_xml_num(w, "dtmin", st->dtmin);
	rc |= hl_xml_num(w, "hot-utility", st->hot_utility);
	rc |= hl_xml_num(w, "cold-utility", st->cold_utility);
	rc |= hl_xml_num(w, "area", st->area);
	rc |= hl_xml_num(w, "area-shell-and-tube", st->area_st);
	rc |= hl_xml_int(w, "units", st->units);
	rc |= hl_xml_int(w, "shells", st->shells);
	rc |= hl_xml_num(w, "capital-cost", st->capital);
	rc |= hl_xml_num(w, "annual-capital-cost", st->capital_annual);
	rc |= hl_xml_num(w, "energy-cost", st->energy_cost);
	rc |= hl_xml_num(w, "total-cost", st->total_cost);
	rc |= hl_xml_str(w, "balanced", st->balanced ? "yes" : "no");
	rc |= xmlTextWriterEndElement(w);
	return rc < 0 ? -1 : 0;
}

void
hl_sweep_text(FILE *fp, const hl_case *c, const hl_sweep *sw)
{
	const char *cur = currency(c);
	size_t i;

	fprintf(fp, "Energy against capital over ΔTmin for %s\n\n",
		c->source ? c->source : "");
	fprintf(fp, "%7s %9s %9s %9s %5s %6s %11s %11s %11s\n", "ΔTmin",
		"hot", "cold", "area", "units", "shells", "capital", "energy",
		"total");
	hl_show_col(fp, HL_SYM_DT, 7);
	hl_show_col(fp, HL_SYM_Q, 10);
	hl_show_col(fp, HL_SYM_Q, 10);
	hl_show_col(fp, HL_SYM_A, 10);
	fprintf(fp, " %5s %6s %11s %11s %11s\n", "", "", "/yr", "/yr", "/yr");
	for (i = 0; i < sw->n; i++) {
		const hl_sweep_point *p = &sw->pt[i];

		if (!p->ok) {
			fprintf(fp, "%7.2f   no answer: %s\n",
				hl_show_dt(p->st.dtmin), p->note);
			continue;
		}
		fprintf(fp, "%7.2f %9.*f %9.*f %9.1f %5d %6d %11.0f %11.0f "
			"%11.0f%s\n", hl_show_dt(p->st.dtmin), HL_DIG_Q(1),
			hl_show_q(p->st.hot_utility), HL_DIG_Q(1),
			hl_show_q(p->st.cold_utility),
			hl_show_a(area_of(c, &p->st)), p->st.units,
			p->st.shells, p->st.capital_annual,
			p->st.energy_cost, p->st.total_cost,
			i == sw->best ? "  <- least on the grid" : "");
	}
	fprintf(fp, "\nArea is %s area; costs in %s per year (capital "
		"annualised).\n", hl_exchanger_type_name(c->set.exchanger), cur);
	fprintf(fp, "Optimum ΔTmin %.2f %s: total annual cost %.0f %s/yr "
		"(energy %.0f, capital %.0f), %d units, %d shells, %.1f %s\n",
		hl_show_dt(sw->optimum.dtmin), HL_SYM_DT,
		sw->optimum.total_cost, cur, sw->optimum.energy_cost,
		sw->optimum.capital_annual, sw->optimum.units,
		sw->optimum.shells, hl_show_a(area_of(c, &sw->optimum)),
		HL_SYM_A);
	fprintf(fp, "(grid best refined by golden-section search; %zu "
		"targeting runs)\n", sw->evaluations);
	fprintf(fp, "\nScreening estimates: detailed design and the safety "
		"review of each match belong to qualified engineers under "
		"local codes.\n");
}

int
hl_sweep_xml(xmlTextWriterPtr w, const hl_sweep *sw, double from, double to,
	     double step)
{
	size_t i;
	int rc = 0;

	rc |= xmlTextWriterStartElement(w, BAD_CAST "sweep");
	rc |= hl_xml_num(w, "from", from);
	rc |= hl_xml_num(w, "to", to);
	rc |= hl_xml_num(w, "step", step);
	for (i = 0; i < sw->n && rc >= 0; i++) {
		const hl_sweep_point *p = &sw->pt[i];

		if (p->ok) {
			rc |= hl_supertargets_xml(w, "point", &p->st);
			continue;
		}
		rc |= xmlTextWriterStartElement(w, BAD_CAST "point");
		rc |= hl_xml_num(w, "dtmin", p->st.dtmin);
		rc |= hl_xml_str(w, "ok", "no");
		rc |= hl_xml_str(w, "note", p->note);
		rc |= xmlTextWriterEndElement(w);
	}
	rc |= hl_supertargets_xml(w, "optimum", &sw->optimum);
	rc |= xmlTextWriterEndElement(w);
	return rc < 0 ? -1 : 0;
}

void
hl_sweep_csv(FILE *fp, const hl_case *c, const hl_sweep *sw)
{
	static const char *const name[4] = { "dtmin", "hot_utility",
		"cold_utility", "area" };
	static const hl_qty qty[4] = { HL_QTY_DTEMP, HL_QTY_POWER,
		HL_QTY_POWER, HL_QTY_AREA };
	char h[64];
	size_t i;

	for (i = 0; i < 4; i++)
		fprintf(fp, "%s,", hl_show_header(h, sizeof h, name[i],
						  qty[i]));
	fprintf(fp, "units,shells,capital_cost,energy_cost,total_cost\n");
	for (i = 0; i < sw->n; i++) {
		const hl_supertargets *s = &sw->pt[i].st;
		char v[7][64];

		hl_format_number(v[0], sizeof v[0], hl_show_dt(s->dtmin));
		if (!sw->pt[i].ok) {
			fprintf(fp, "%s,,,,,,,,\n", v[0]);
			continue;
		}
		hl_format_number(v[1], sizeof v[1], hl_show_q(s->hot_utility));
		hl_format_number(v[2], sizeof v[2],
				 hl_show_q(s->cold_utility));
		hl_format_number(v[3], sizeof v[3], hl_show_a(area_of(c, s)));
		hl_format_number(v[4], sizeof v[4], s->capital_annual);
		hl_format_number(v[5], sizeof v[5], s->energy_cost);
		hl_format_number(v[6], sizeof v[6], s->total_cost);
		fprintf(fp, "%s,%s,%s,%s,%d,%d,%s,%s,%s\n", v[0], v[1], v[2],
			v[3], s->units, s->shells, v[4], v[5], v[6]);
	}
}

/* The ok points' values of one field, NaN elsewhere (skipped by the chart). */
static int
column(const hl_case *c, const hl_sweep *sw, size_t field, double *out)
{
	size_t i;

	for (i = 0; i < sw->n; i++) {
		const hl_supertargets *s = &sw->pt[i].st;
		double v[] = { hl_show_dt(s->dtmin), s->total_cost,
			       s->energy_cost, s->capital_annual,
			       hl_show_a(area_of(c, s)),
			       hl_show_q(s->hot_utility) };

		out[i] = sw->pt[i].ok || field == 0 ? v[field] : NAN;
	}
	return 0;
}

static hl_svg_chart *
chart(const char *title, const char *xl, const char *yl, const hl_case *c,
      const hl_sweep *sw)
{
	hl_svg_chart *ch = hl_svg_chart_create(title, xl, yl);
	char sub[256];
	const char *src = c->source ? c->source : "case", *slash;

	if (ch == NULL)
		return NULL;
	slash = strrchr(src, '/');
	snprintf(sub, sizeof sub, "%s · optimum ΔTmin %.1f %s, %.0f %s/yr",
		 slash ? slash + 1 : src, hl_show_dt(sw->optimum.dtmin),
		 HL_SYM_DT, sw->optimum.total_cost, currency(c));
	if (hl_svg_chart_set_subtitle(ch, sub) < 0 ||
	    hl_svg_chart_set_footnote(ch, hl_svg_caution) < 0) {
		hl_svg_chart_free(ch);
		return NULL;
	}
	return ch;
}

hl_svg_chart *
hl_sweep_chart_cost(const hl_case *c, const hl_sweep *sw)
{
	static const struct {
		const char *label;
		hl_svg_style style;
	} lines[] = {
		{ "total", { HL_SVG_BLACK, HL_SVG_SOLID, 2.6, HL_SVG_MARK_NONE,
			     HL_SVG_STEP_NONE } },
		{ "energy", { HL_SVG_ORANGE, HL_SVG_DASHED, 2.2,
			      HL_SVG_MARK_NONE, HL_SVG_STEP_NONE } },
		{ "capital (annualised)", { HL_SVG_BLUE, HL_SVG_DASHDOT, 2.2,
					    HL_SVG_MARK_NONE,
					    HL_SVG_STEP_NONE } },
	};
	char yl[64], xl[64];
	double *x = malloc(sw->n * sizeof *x), *y = malloc(sw->n * sizeof *y);
	hl_svg_chart *ch = NULL;
	size_t k;
	int rc = 0;

	snprintf(yl, sizeof yl, "Annual cost (%s/yr)", currency(c));
	snprintf(xl, sizeof xl, "ΔTmin (%s)", HL_SYM_DT);
	if (x != NULL && y != NULL)
		ch = chart("Total annual cost against ΔTmin", xl, yl, c, sw);
	if (ch != NULL) {
		column(c, sw, 0, x);
		for (k = 0; k < 3; k++) {
			column(c, sw, k + 1, y);
			rc |= hl_svg_chart_add_series(ch, lines[k].label, x, y,
						      sw->n, &lines[k].style);
		}
		rc |= hl_svg_chart_add_vline(ch, hl_show_dt(sw->optimum.dtmin),
					     "optimum",
					     HL_SVG_VERMILION, HL_SVG_DOTTED);
		rc |= hl_svg_chart_add_marker(ch,
					      hl_show_dt(sw->optimum.dtmin),
					      sw->optimum.total_cost,
					      HL_SVG_MARK_DIAMOND,
					      HL_SVG_VERMILION, NULL,
					      HL_SVG_START);
		hl_svg_chart_set_yrange(ch, 0.0, NAN);
	}
	free(x);
	free(y);
	if (rc < 0) {
		hl_svg_chart_free(ch);
		return NULL;
	}
	return ch;
}

hl_svg_chart *
hl_sweep_chart_area(const hl_case *c, const hl_sweep *sw)
{
	hl_svg_style st = { HL_SVG_GREEN, HL_SVG_SOLID, 2.4,
			    HL_SVG_MARK_CIRCLE, HL_SVG_STEP_NONE };
	double *x = malloc(sw->n * sizeof *x), *y = malloc(sw->n * sizeof *y);
	hl_svg_chart *ch = NULL;
	char xl[64], yl[64];
	int rc = 0;

	snprintf(xl, sizeof xl, "Hot utility (%s)", HL_SYM_Q);
	snprintf(yl, sizeof yl, "%s area (%s)",
		 c->set.exchanger == HL_EXCH_SHELL_TUBE ? "Shell-and-tube" :
		 "Counterflow", HL_SYM_A);
	if (x != NULL && y != NULL)
		ch = chart("Area against energy", xl, yl, c, sw);
	if (ch != NULL) {
		column(c, sw, 5, x);
		column(c, sw, 4, y);
		rc |= hl_svg_chart_add_series(ch, "area target over ΔTmin", x,
					      y, sw->n, &st);
		rc |= hl_svg_chart_add_marker(ch,
					      hl_show_q(sw->optimum.hot_utility),
					      hl_show_a(area_of(c, &sw->optimum)),
					      HL_SVG_MARK_DIAMOND,
					      HL_SVG_VERMILION,
					      "cost optimum", HL_SVG_START);
	}
	free(x);
	free(y);
	if (rc < 0) {
		hl_svg_chart_free(ch);
		return NULL;
	}
	return ch;
}
