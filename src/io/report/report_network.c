/* report_network.c - the designed network: its grid diagram and every
 * exchanger sized (the numbers of `heatloom design --format xml`). */
#include <math.h>
#include <stdio.h>

#include "grid_svg.h"
#include "display.h"
#include "report_sec.h"

#define B 64

static int
present(const hl_report_data *d)
{
	return d->net != NULL || d->net_note != NULL;
}

static const char *
party_name(const hl_network *n, size_t i)
{
	return n->party[i].name;
}

/* One accounting of the network's utility above the minimum: the ranges of
 * the utilities (a flue gas cooled below the pinch), the match rules and
 * the layout; the same sentence wherever the report gives the rise. */
void
hl_report_rise_text(hl_report *r, const hl_network *n)
{
	double rise = n->qh - n->qh_target;
	char a[B], b[B], c[B];
	int k = 0;

	if (isnan(n->qh_target) || rise <= 1e-6 * fmax(1.0, n->qh_target)) {
		hl_html_text(r->h, "it uses the minimum hot and cold utility");
		return;
	}
	hl_html_textf(r->h, "it uses %s of hot utility, %s above the minimum "
		      "%s (and as much more cold utility): ",
		      hl_report_fmt_duty(a, B, n->qh),
		      hl_report_fmt_duty(b, B, rise),
		      hl_report_fmt_duty(c, B, n->qh_target));
	if (n->range_rise > 0.0 && hl_network_has_credit(n) && ++k)
		hl_html_textf(r->h, "%s of hot utility bought because a credit "
			      "(a utility with a negative price) pays more for "
			      "the process heat it frees",
			      hl_report_fmt_duty(a, B, n->range_rise));
	else if (n->range_rise > 0.0 && ++k)
		hl_html_textf(r->h, "%s because a hot utility's range ends "
			      "below the pinch (a flue gas must give heat "
			      "below it to reach its stack temperature)",
			      hl_report_fmt_duty(a, B, n->range_rise));
	if (n->restriction > 0.0)
		hl_html_textf(r->h, "%s%s from the match rules", k++ ? ", " :
			      "", hl_report_fmt_duty(a, B, n->restriction));
	if (n->penalty > 0.0)
		hl_html_textf(r->h, "%s%s from the layout of the matches",
			      k++ ? ", " : "",
			      hl_report_fmt_duty(a, B, n->penalty));
}

static void
summary(hl_report *r)
{
	const hl_network *n = r->d->net;
	char a[B], b[B];

	hl_html_start(r->h, "p", NULL);
	hl_html_text(r->h, "The matches above laid out on the streams: ");
	hl_html_start(r->h, "strong", NULL);
	hl_html_textf(r->h, "%zu exchangers", n->nunit);
	hl_html_end(r->h);
	hl_html_textf(r->h, " for %zu matches, with %zu stream split%s, "
		      "%s of area in all. ", n->nmatch, n->nsplit,
		      n->nsplit == 1 ? "" : "s",
		      hl_report_fmt_area(a, B, n->area));
	hl_html_text(r->h, "In all, ");
	hl_report_rise_text(r, n);
	hl_html_text(r->h, ". ");
	if (n->penalty > 0.0) {
		hl_html_text(r->h, "No order of the matches keeps every "
			     "approach at the utility loads of the matches ");
		if (!isnan(r->d->net_emat_hint))
			hl_html_textf(r->h, "(with an exchanger minimum "
				      "approach of %s instead of %s the same "
				      "matches place at the targets). ",
				      hl_report_fmt_dt(b, B,
						       r->d->net_emat_hint),
				      hl_report_fmt_dt(a, B, isnan(n->set.emat)
						       ? n->set.dtmin :
						       n->set.emat));
		else
			hl_html_text(r->h, "(see the notes below). ");
	}
	if (r->d->net_findings == 0)
		hl_html_text(r->h, "The network passes heatloom's independent "
			     "check: every heat balance, stage, approach and "
			     "size recomputed from the stream data.");
	else
		hl_html_textf(r->h, "Its independent check reports %zu "
			      "finding%s: treat the network with care.",
			      r->d->net_findings,
			      r->d->net_findings == 1 ? "" : "s");
	hl_html_text(r->h, " It is the network of the fewest units, a "
		     "starting point: with priced utilities, heatloom "
		     "design searches from it for the network of least "
		     "total annual cost (capital and energy), which may "
		     "have other matches, more units and more energy.");
	hl_html_end(r->h);
}

static void
facts(hl_report *r)
{
	const hl_network *n = r->d->net;
	const char *cur = hl_report_currency(r->d->c);
	char v[2 * B], a[B], b[B];

	hl_report_facts_start(r, NULL);
	snprintf(v, sizeof v, "%s (target %s)", hl_report_fmt_duty(a, B, n->qh),
		 hl_report_fmt_duty(b, B, n->qh_target));
	hl_report_fact(r, "Hot utility", v, "n-qh");
	snprintf(v, sizeof v, "%s (target %s)", hl_report_fmt_duty(a, B, n->qc),
		 hl_report_fmt_duty(b, B, n->qc_target));
	hl_report_fact(r, "Cold utility", v, "n-qc");
	snprintf(v, sizeof v, "%zu", n->nunit);
	hl_report_fact(r, "Exchangers", v, "n-units");
	hl_report_fact(r, "Area", hl_report_fmt_area(a, B, n->area), "n-area");
	hl_report_fact(r, "Capital", hl_report_fmt_money(a, B, n->capital, cur,
			0), "n-capital");
	hl_report_fact(r, "Annualised capital", hl_report_fmt_money(a, B,
			n->capital_annual, cur, 1), "n-annual");
	hl_report_fact(r, "Utility cost", hl_report_fmt_money(a, B,
			n->energy_cost, cur, 1), "n-energy");
	hl_report_fact(r, "Total annual cost", hl_report_fmt_money(a, B,
			n->total_cost, cur, 1), "n-total");
	hl_report_facts_end(r);
}

static void
grid(hl_report *r)
{
	const hl_report_data *d = r->d;
	hl_grid_opts go = { "Heat exchanger network", NULL, NULL,
			    d->net_npinch, d->net_pinch, d->cas };
	char id[32];

	hl_report_figure_open(r, id, sizeof id);
	if (!hl_html_failed(r->h) && hl_grid_svg_write_into(d->net, &go,
	    hl_html_writer(r->h), NULL) != HL_OK)
		hl_html_fail(r->h);
	hl_report_figure_close(r, "The network on its streams: hot streams "
			       "above, cold below, temperature falling from "
			       "left to right; each exchanger a linked pair of "
			       "marks, heaters and coolers square marks; "
			       "dashed lines at the pinches (dotted, orange: "
			       "utility pinches).");
}

static void
unit_row(hl_report *r, const hl_network_unit *u)
{
	const hl_network *n = r->d->net;
	char v[B];

	hl_report_row_start(r, NULL);
	hl_report_cell(r, u->id);
	hl_report_cell(r, party_name(n, u->hot));
	hl_report_cell(r, party_name(n, u->cold));
	hl_report_cell_num(r, hl_report_fmt_qty(v, B, hl_show_q(u->duty)));
	hl_report_range(v, B, u->hot_in, u->hot_out);
	hl_report_cell_num(r, v);
	hl_report_range(v, B, u->cold_in, u->cold_out);
	hl_report_cell_num(r, v);
	hl_report_cell_num(r, hl_report_fmt_sig(v, B, hl_show_h(u->u), 3, 3));
	hl_report_cell_num(r, hl_report_fmt_fixed(v, B, hl_show_dt(u->lmtd),
			   1));
	hl_report_cell_num(r, hl_report_fmt_fixed(v, B, u->ft, 3));
	hl_report_cell(r, hl_exchanger_type_name(u->type));
	if (u->parallel > 1)
		snprintf(v, B, "%d × %d", u->shells, u->parallel);
	else
		snprintf(v, B, "%d", u->shells);
	hl_report_cell_num(r, v);
	if (u->type == HL_EXCH_FIRED_HEATER)
		hl_report_cell_num(r, "by duty");
	else
		hl_report_cell_num(r, hl_report_fmt_qty(v, B, hl_show_a(u->area)));
	hl_report_cell_num(r, hl_report_fmt_sig(v, B, u->cost, 3, 0));
	hl_report_row_end(r);
}

static void
unit_table(hl_report *r)
{
	static const char *const head[] = { "Unit", "Hot side", "Cold side",
		"Duty", "Hot in → out", "Cold in → out", "U", "LMTD", "F",
		"Type", "Shells", "Area", "Cost" };
	const char *unit[] = { "", "", "", "kW", "°C", "°C", "kW/(m²·K)", "K",
		"", "", "series × parallel", "m²",
		hl_report_currency(r->d->c) };
	static const int num[] = { 0, 0, 0, 1, 1, 1, 1, 1, 1, 0, 1, 1, 1 };
	const hl_network *n = r->d->net;
	size_t i;

	hl_report_table_start(r, "data exchangers", "The exchangers: duty, "
			      "terminal temperatures, overall coefficient U "
			      "from the film coefficients, counterflow mean "
			      "temperature difference, F of all shells, "
			      "exchanger type, shells in series (× trains in "
			      "parallel beyond the largest shell), area (a "
			      "fired heater is sized by duty) and installed "
			      "cost by the type's law.",
			      13, head, unit, num);
	for (i = 0; i < n->nunit; i++)
		unit_row(r, &n->unit[i]);
	hl_report_table_end(r);
}

/* What the placement changed and what each unit's sizing assumed. */
static void
notes(hl_report *r)
{
	const hl_network *n = r->d->net;
	size_t i, k = n->nnote;

	for (i = 0; i < n->nunit; i++)
		k += n->unit[i].note != NULL || n->unit[i].assumed != 0 ||
		    n->unit[i].warn != 0;
	if (k == 0)
		return;
	hl_html_start(r->h, "ul", "network-notes");
	for (i = 0; i < n->nnote; i++)
		hl_html_elem(r->h, "li", NULL, n->note[i]);
	for (i = 0; i < n->nunit; i++) {
		const hl_network_unit *u = &n->unit[i];

		if (u->note != NULL)
			hl_html_elemf(r->h, "li", NULL, "%s: %s", u->id,
				      u->note);
		if (u->warn != 0) {
			char why[300];

			hl_network_unit_warning(n, u, why, sizeof why);
			hl_html_elemf(r->h, "li", NULL, "%s: check: %s.",
				      u->id, why);
		}
		if (u->assumed != 0)
			hl_html_elemf(r->h, "li", NULL, "%s: no film "
				      "coefficient given for the %s side; U "
				      "assumes the default h.", u->id,
				      u->assumed == (HL_NETWORK_H_HOT |
				      HL_NETWORK_H_COLD) ? "hot and the cold" :
				      u->assumed == HL_NETWORK_H_HOT ? "hot" :
				      "cold");
	}
	hl_html_end(r->h);
}

static void
write_network(hl_report *r)
{
	if (r->d->net == NULL) {
		hl_report_missing(r, "No network", r->d->net_note);
		return;
	}
	summary(r);
	facts(r);
	grid(r);
	unit_table(r);
	notes(r);
	hl_report_note(r, "A first layout for screening, not a design: the "
		       "film coefficients, fouling, pressure drops, materials "
		       "and the mechanical design of every exchanger are for "
		       "its detailed design; each match needs a safety review "
		       "of what a leak between its two streams would do.");
}

const hl_report_section hl_report_sec_network = {
	"network", "Heat exchanger network", present, write_network
};
