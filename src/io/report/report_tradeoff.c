/* report_tradeoff.c - the supertargets at the chosen ΔTmin and the
 * energy-capital trade-off over the sweep (the numbers of `heatloom targets
 * --supertargets` and `heatloom sweep`). */
#include <math.h>
#include <stdio.h>

#include "display.h"
#include "report_sec.h"
#include "sweep_out.h"

#define B 64
/* More sweep points than this are thinned to every k-th in the table. */
#define MAX_ROWS 14

static int
present(const hl_report_data *d)
{
	return d->st != NULL || d->st_note != NULL || d->sw != NULL ||
	       d->sw_note != NULL;
}

static double
area_of(const hl_case *c, const hl_supertargets *s)
{
	return c->set.exchanger == HL_EXCH_SHELL_TUBE ? s->area_st : s->area;
}

static void
super_facts(hl_report *r)
{
	const hl_case *c = r->d->c;
	const hl_supertargets *st = r->d->st;
	const char *cur = hl_report_currency(c);
	char v[2 * B], a[B];

	hl_report_facts_start(r, NULL);
	snprintf(v, sizeof v, "%s (source: %s)", hl_report_fmt_dt(a, B,
		 st->dtmin), r->d->meta.dtmin_from ? r->d->meta.dtmin_from :
		 "the case");
	hl_report_fact(r, "Chosen ΔTmin", v, "s-dtmin");
	hl_report_fact(r, "Area target, counterflow",
		       hl_report_fmt_area(v, B, st->area), "s-area");
	hl_report_fact(r, "Area target, shell-and-tube",
		       hl_report_fmt_area(v, B, st->area_st), "s-area-st");
	snprintf(v, sizeof v, "%d (N − 1 in each of %zu subnetwork%s)",
		 st->units, st->nsub, st->nsub == 1 ? "" : "s");
	hl_report_fact(r, "Units target", v, "s-units");
	snprintf(v, sizeof v, "%d", st->shells);
	hl_report_fact(r, "Shells target", v, "s-shells");
	hl_report_fact(r, "Capital cost", hl_report_fmt_money(v, B,
		       st->capital, cur, 0), "s-capital");
	snprintf(v, sizeof v, "%s (capital recovery factor %.3f)",
		 hl_report_fmt_money(a, B, st->capital_annual, cur, 1),
		 hl_supertarget_crf(c->set.interest, c->set.life));
	hl_report_fact(r, "Annualised capital", v, "s-capital-annual");
	hl_report_fact(r, "Energy cost", hl_report_fmt_money(v, B,
		       st->energy_cost, cur, 1), "s-energy");
	hl_report_fact(r, "Total annual cost", hl_report_fmt_money(v, B,
		       st->total_cost, cur, 1), "s-total");
	hl_report_facts_end(r);
}

static void
optimum_text(hl_report *r)
{
	const hl_report_data *d = r->d;
	const hl_supertargets *o = &d->sw->optimum;
	const char *cur = hl_report_currency(d->c);
	char a[B], b[B], c[B], e[B];

	hl_html_start(r->h, "p", NULL);
	hl_html_textf(r->h, "Over ΔTmin from %s to %s in steps of %s, the "
		      "total annual cost is least at ΔTmin ",
		      hl_report_fmt_dt(a, B, d->sw_from),
		      hl_report_fmt_dt(b, B, d->sw_to),
		      hl_report_fmt_dt(c, B, d->sw_step));
	hl_html_start(r->h, "strong", NULL);
	hl_html_start(r->h, "span", NULL);
	hl_html_attr(r->h, "id", "w-optimum");
	hl_html_text(r->h, hl_report_fmt_dt(a, B, o->dtmin));
	hl_html_end(r->h);
	hl_html_end(r->h);
	hl_html_textf(r->h, ": %s (energy %s, annualised capital %s), %d "
		      "units, %d shells, %s.",
		      hl_report_fmt_money(a, B, o->total_cost, cur, 1),
		      hl_report_fmt_money(b, B, o->energy_cost, cur, 1),
		      hl_report_fmt_money(c, B, o->capital_annual, cur, 1),
		      o->units, o->shells, hl_report_fmt_area(e, B,
		      area_of(d->c, o)));
	if (d->st != NULL)
		hl_html_textf(r->h, " The chosen ΔTmin of %s costs %s a year "
			      "in total by the same targets.",
			      hl_report_fmt_dt(a, B, d->st->dtmin),
			      hl_report_fmt_money(b, B, d->st->total_cost,
						  cur, 0));
	hl_html_end(r->h);
	hl_report_note(r, "The total cost steps where the number of units or "
		       "shells changes, so the curve has jumps and flat "
		       "stretches: a ΔTmin near the optimum that suits the "
		       "plant's layout and operability is as good a choice.");
}

static hl_svg_chart *
cost_chart(const hl_report_data *d)
{
	hl_svg_chart *ch = hl_sweep_chart_cost(d->c, d->sw);

	if (ch != NULL && d->st != NULL &&
	    hl_svg_chart_add_vline(ch, d->st->dtmin, "chosen",
				   HL_SVG_GREY, HL_SVG_DASHED) < 0) {
		hl_svg_chart_free(ch);
		return NULL;
	}
	return ch;
}

static int
shown(const hl_report_data *d, size_t i, size_t every)
{
	const hl_sweep *sw = d->sw;

	return i % every == 0 || i + 1 == sw->n || i == sw->best ||
	       (d->st != NULL && fabs(sw->pt[i].st.dtmin - d->st->dtmin) <
		1e-9);
}

static void
point_row(hl_report *r, size_t i)
{
	const hl_report_data *d = r->d;
	const hl_sweep_point *p = &d->sw->pt[i];
	int chosen = d->st != NULL && fabs(p->st.dtmin - d->st->dtmin) < 1e-9;
	char v[B];

	hl_report_row_start(r, i == d->sw->best ? "best" : chosen ? "chosen" :
			    NULL);
	hl_report_cell_num(r, hl_report_fmt_fixed(v, B, hl_show_dt(p->st.dtmin),
			   1));
	if (!p->ok) {
		hl_html_start(r->h, "td", "why");
		hl_html_attr(r->h, "colspan", "8");
		hl_html_textf(r->h, "no answer: %s", p->note);
		hl_html_end(r->h);
		hl_report_row_end(r);
		return;
	}
	hl_report_cell_num(r, hl_report_fmt_qty(v, B, hl_show_q(p->st.hot_utility)));
	hl_report_cell_num(r, hl_report_fmt_qty(v, B, hl_show_q(p->st.cold_utility)));
	hl_report_cell_num(r, hl_report_fmt_qty(v, B, hl_show_a(area_of(d->c, &p->st))));
	snprintf(v, B, "%d", p->st.units);
	hl_report_cell_num(r, v);
	snprintf(v, B, "%d", p->st.shells);
	hl_report_cell_num(r, v);
	hl_report_cell_num(r, hl_report_fmt_sig(v, B, p->st.capital_annual, 3,
			   0));
	hl_report_cell_num(r, hl_report_fmt_sig(v, B, p->st.energy_cost, 3,
			   0));
	hl_report_cell_num(r, hl_report_fmt_sig(v, B, p->st.total_cost, 3,
			   0));
	hl_report_row_end(r);
}

static void
sweep_table(hl_report *r)
{
	static const char *const head[] = { "ΔTmin", "Hot utility",
		"Cold utility", "Area", "Units", "Shells", "Capital",
		"Energy", "Total" };
	static const int num[] = { 1, 1, 1, 1, 1, 1, 1, 1, 1 };
	const hl_sweep *sw = r->d->sw;
	const char *cur = hl_report_currency(r->d->c);
	char cu[64], cap[384], thin[128];
	const char *unit[9] = { "K", "kW", "kW", "m²", "", "", cu, cu, cu };
	size_t i, every = (sw->n + MAX_ROWS - 1) / MAX_ROWS;

	snprintf(cu, sizeof cu, "%s/yr", *cur ? cur : "per");
	if (every < 1)
		every = 1;
	snprintf(thin, sizeof thin, "; one grid point in %zu, the last, the "
		 "least-cost and the chosen one are shown", every);
	snprintf(cap, sizeof cap, "Supertargets over ΔTmin (%s area; capital "
		 "annualised)%s. Shaded: the grid's least total cost (orange) "
		 "and the chosen ΔTmin (blue-grey).", 
		 hl_exchanger_type_name(r->d->c->set.exchanger),
		 every > 1 ? thin : "");
	hl_report_table_start(r, "data sweep", cap, 9, head, unit, num);
	for (i = 0; i < sw->n; i++)
		if (shown(r->d, i, every))
			point_row(r, i);
	hl_report_table_end(r);
}

static void
sweep_subtitle(const hl_report_data *d, char *buf, size_t size)
{
	char a[B], b[B], c[B];

	snprintf(buf, size, "optimum ΔTmin %s, %s%s%s",
		 hl_report_fmt_dt(a, B, d->sw->optimum.dtmin),
		 hl_report_fmt_money(b, B, d->sw->optimum.total_cost,
				     hl_report_currency(d->c), 1),
		 d->st ? " · chosen " : "",
		 d->st ? hl_report_fmt_dt(c, B, d->st->dtmin) : "");
}

static void
write_tradeoff(hl_report *r)
{
	const hl_report_data *d = r->d;
	char sub[4 * B];

	hl_report_para(r, "A smaller ΔTmin recovers more heat and so saves "
		       "energy, but needs more exchanger area. The "
		       "supertargets put a cost on both before any network "
		       "is designed: the area from the balanced composite "
		       "curves, the units and shells, the capital annualised "
		       "over the plant life, and the utility cost.");
	hl_html_elem(r->h, "h3", NULL, "At the chosen ΔTmin");
	if (d->st != NULL)
		super_facts(r);
	else
		hl_report_missing(r, "No supertargets at this ΔTmin",
				  d->st_note);
	hl_html_elem(r->h, "h3", NULL, "Over a range of ΔTmin");
	if (d->sw == NULL) {
		hl_report_missing(r, "No sweep", d->sw_note);
		return;
	}
	optimum_text(r);
	sweep_subtitle(d, sub, sizeof sub);
	hl_report_figure(r, cost_chart(d), sub, "Total annual cost and its "
			 "parts against ΔTmin; the optimum and the chosen value "
			 "are marked.");
	hl_report_figure(r, hl_sweep_chart_area(d->c, d->sw), sub, "Area "
			 "target against the hot utility target over the same "
			 "range of ΔTmin: each kW saved costs more area as "
			 "ΔTmin shrinks.");
	sweep_table(r);
}

const hl_report_section hl_report_sec_tradeoff = {
	"tradeoff", "ΔTmin trade-off", present, write_tradeoff
};
