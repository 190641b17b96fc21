/* report_targets.c - the energy targets, the pinch and the heat cascade;
 * the utility levels chosen at least cost. */
#include <math.h>
#include <stdio.h>

#include "display.h"
#include "report_sec.h"

#define B 64
/* A cascade with more boundaries than this is left to the CSV results: as
 * pages of a report it would bury the rest. */
#define MAX_CASCADE_ROWS 80

static int
always(const hl_report_data *d)
{
	(void)d;
	return 1;
}

static void
threshold_facts(hl_report *r)
{
	const hl_threshold *th = r->d->th;
	const char *none = th->kind == 'H' ? "hot" : "cold";
	char v[2 * B], a[B];

	if (th->kind == 'N') {
		hl_report_fact(r, "Pinch", "none: the process needs no utility "
			       "at all", "t-pinch");
		return;
	}
	snprintf(v, sizeof v, "none: a threshold problem, no %s utility is "
		 "needed", none);
	hl_report_fact(r, "Pinch", v, "t-pinch");
	if (isinf(th->dtmin))
		snprintf(v, sizeof v, "none: %s utility is never needed", none);
	else
		snprintf(v, sizeof v, "%s (%s utility is needed above it)",
			 hl_report_fmt_dt(a, B, th->dtmin), none);
	hl_report_fact(r, "Threshold ΔTmin", v, "t-threshold");
}

static void
pinch_facts(hl_report *r)
{
	const hl_cascade *cas = r->d->cas;
	char v[3 * B], a[B], b[B], c[B], id[32];
	size_t i;

	for (i = 0; i < cas->npinch; i++) {
		double s = cas->t[cas->pinch[i]];

		snprintf(v, sizeof v, "%s hot / %s cold (%s shifted)",
			 hl_report_fmt_temp(a, B, hl_cascade_hot_temp(cas, s)),
			 hl_report_fmt_temp(b, B, hl_cascade_cold_temp(cas, s)),
			 hl_report_fmt_temp(c, B, s));
		snprintf(id, sizeof id, "t-pinch%zu", i + 1);
		hl_report_fact(r, cas->npinch > 1 ? "Pinch (one of several)" :
			       "Pinch", v, id);
	}
}

static void
target_facts(hl_report *r)
{
	const hl_cascade *cas = r->d->cas;
	char v[B];

	hl_report_facts_start(r, NULL);
	hl_report_fact(r, "ΔTmin", hl_report_fmt_dt(v, B, cas->dtmin),
		       "t-dtmin");
	hl_report_fact(r, "Hot stream duty (heat to remove)",
		       hl_report_fmt_duty(v, B, cas->hot_total), "t-hot");
	hl_report_fact(r, "Cold stream duty (heat to supply)",
		       hl_report_fmt_duty(v, B, cas->cold_total), "t-cold");
	hl_report_fact(r, "Minimum hot utility QHmin",
		       hl_report_fmt_duty(v, B, cas->qh), "t-qh");
	hl_report_fact(r, "Minimum cold utility QCmin",
		       hl_report_fmt_duty(v, B, cas->qc), "t-qc");
	hl_report_fact(r, "Heat recovery at the targets",
		       hl_report_fmt_duty(v, B, cas->hot_total - cas->qc),
		       "t-recovery");
	if (cas->npinch == 0)
		threshold_facts(r);
	else
		pinch_facts(r);
	hl_report_facts_end(r);
}

static void
cascade_table(hl_report *r)
{
	static const char *const head[] = { "Shifted", "Hot", "Cold",
		"Net cp below", "Surplus below", "Heat flow" };
	static const char *const unit[] = { "°C", "°C", "°C", "kW/K", "kW",
		"kW" };
	static const int num[] = { 1, 1, 1, 1, 1, 1 };
	const hl_cascade *cas = r->d->cas;
	char v[B];
	size_t k;

	hl_report_table_start(r, "data cascade", "Problem table: the heat "
			      "cascade on shifted temperatures (hot = shifted "
			      "+ ΔTmin/2, cold = shifted − ΔTmin/2). Net cp "
			      "and surplus are those of the interval below each "
			      "boundary; the heat flow passes down through it "
			      "with QHmin added at the top; the pinch row is "
			      "marked. Full precision: heatloom targets "
			      "--format csv.", 6, head, unit, num);
	for (k = 0; k < cas->nb; k++) {
		int pinch = cas->flow[k] == 0.0 && k > 0 && k + 1 < cas->nb;

		hl_report_row_start(r, pinch ? "pinch" : NULL);
		hl_report_cell_num(r, hl_report_fmt_fixed(v, B,
				   hl_show_t(cas->t[k]), 1));
		hl_report_cell_num(r, hl_report_fmt_fixed(v, B,
				   hl_show_t(hl_cascade_hot_temp(cas, cas->t[k])),
				   1));
		hl_report_cell_num(r, hl_report_fmt_fixed(v, B,
				   hl_show_t(hl_cascade_cold_temp(cas,
				   cas->t[k])), 1));
		hl_report_cell_num(r, k + 1 < cas->nb ? hl_report_fmt_fixed(v,
				   B, hl_show_cp(cas->netcp[k]), HL_DIG_CP(2)) :
				   "");
		hl_report_cell_num(r, k + 1 < cas->nb ? hl_report_fmt_qty(v, B, hl_show_q(cas->dh[k])) : "");
		hl_report_fmt_qty(v, B, hl_show_q(cas->flow[k]));
		hl_report_cell_num(r, v);
		hl_report_row_end(r);
	}
	hl_report_table_end(r);
}

static void
write_targets(hl_report *r)
{
	hl_report_para(r, "The problem table (Linnhoff & Flower 1978) gives the "
		       "least heating and cooling that any network of these "
		       "streams needs at this ΔTmin, whatever its design. At "
		       "the pinch no heat flows down the cascade: above it "
		       "the process is a net heat sink, below it a net heat "
		       "source. Heat moved across the pinch, a cooler above "
		       "it or a heater below it each add their duty to both "
		       "the hot and the cold utility.");
	target_facts(r);
	if (r->d->cas->nb <= MAX_CASCADE_ROWS) {
		cascade_table(r);
		return;
	}
	hl_html_start(r->h, "p", "note");
	hl_html_textf(r->h, "The problem table has %zu boundaries, too many "
		      "to print here; heatloom targets --format csv writes it "
		      "in full.", r->d->cas->nb);
	hl_html_end(r->h);
}

const hl_report_section hl_report_sec_targets = {
	"targets", "Energy targets and pinch", always, write_targets
};

/* ---------------------------------------------------------------------- */

static int
have_lp(const hl_report_data *d)
{
	return d->lp != NULL;
}

static void
choice_sentence(hl_report *r)
{
	const hl_case *c = r->d->c;
	const hl_utility_lp *lp = r->d->lp;
	size_t i, n = 0, used = 0;
	char a[B];

	for (i = 0; i < c->nutil; i++)
		used += lp->util[i].use == HL_UTIL_USED;
	hl_html_start(r->h, "p", NULL);
	hl_html_text(r->h, "At least utility cost the process takes ");
	for (i = 0; i < c->nutil; i++) {
		if (lp->util[i].use != HL_UTIL_USED)
			continue;
		hl_html_textf(r->h, "%s%s of %s", n == 0 ? "" : n + 1 == used ?
			      " and " : ", ", hl_report_fmt_duty(a, B,
			      lp->util[i].load), c->util[i].name);
		n++;
	}
	if (n == 0)
		hl_html_text(r->h, "no utility at all");
	hl_html_textf(r->h, ", for %s a year at %g operating hours.",
		      hl_report_fmt_money(a, B, lp->cost, hl_report_currency(c),
					  0), lp->hours);
	hl_html_text(r->h, " A colder hot utility or a warmer cold utility is "
		     "taken wherever the grand composite curve allows it, "
		     "since it is the cheaper one.");
	hl_html_end(r->h);
}

static void
choice_table(hl_report *r)
{
	static const char *const head[] = { "Utility", "Kind", "Supply",
		"Target", "Price", "Load", "Cost", "Use" };
	static const int num[] = { 0, 0, 1, 1, 1, 1, 1, 0 };
	const hl_case *c = r->d->c;
	const hl_utility_lp *lp = r->d->lp;
	const char *cur = hl_report_currency(c);
	char pu[64], cu[64], v[B];
	const char *unit[8] = { "", "", "°C", "°C", pu, "kW", cu, "" };
	size_t i;

	snprintf(pu, sizeof pu, "%s/MWh", *cur ? cur : "per");
	snprintf(cu, sizeof cu, "%s/yr", *cur ? cur : "per");
	hl_report_table_start(r, "data choice", "Utility loads at least total "
			      "utility cost (transshipment LP).", 8, head, unit,
			      num);
	for (i = 0; i < c->nutil; i++) {
		const hl_utility_load *l = &lp->util[i];

		hl_report_row_start(r, l->use == HL_UTIL_USED ? NULL : "idle");
		hl_report_cell(r, c->util[i].name);
		hl_report_cell(r, c->util[i].kind == HL_HOT ? "hot" : "cold");
		hl_report_cell_num(r, hl_report_fmt_fixed(v, B,
				   hl_show_t(c->util[i].supply), 1));
		hl_report_cell_num(r, hl_report_fmt_fixed(v, B,
				   hl_show_t(c->util[i].target), 1));
		snprintf(v, B, "%.2f", hl_show_p(c->util[i].price));
		hl_report_cell_num(r, v);
		hl_report_cell_num(r, hl_report_fmt_qty(v, B, hl_show_q(l->load)));
		hl_report_cell_num(r, hl_report_fmt_sig(v, B, l->cost, 3, 0));
		hl_report_cell(r, hl_utility_use_name(l->use));
		hl_report_row_end(r);
	}
	hl_report_row_start(r, "total");
	hl_report_cell(r, "Total");
	hl_report_cell(r, "");
	hl_report_cell(r, "");
	hl_report_cell(r, "");
	hl_report_cell(r, "");
	hl_report_cell(r, "");
	hl_report_cell_num(r, hl_report_fmt_sig(v, B, lp->cost, 3, 0));
	hl_report_cell(r, "");
	hl_report_row_end(r);
	hl_report_table_end(r);
}

static void
choice_facts(hl_report *r)
{
	const hl_case *c = r->d->c;
	const hl_utility_lp *lp = r->d->lp;
	char v[4 * B], a[B], b[B], s[B], id[32];
	size_t i;

	hl_report_facts_start(r, NULL);
	hl_report_fact(r, "Hot utility", hl_report_fmt_duty(v, B,
		       lp->hot_load), "u-hot");
	hl_report_fact(r, "Cold utility", hl_report_fmt_duty(v, B,
		       lp->cold_load), "u-cold");
	hl_report_fact(r, lp->credit > 0.0 ? "Utility cost, net of credits" :
		       "Utility cost", hl_report_fmt_money(v, B, lp->cost,
		       hl_report_currency(c), 1), "u-cost");
	if (lp->credit > 0.0)
		hl_report_fact(r, "Credits", hl_report_fmt_money(v, B,
			       lp->credit, hl_report_currency(c), 1),
			       "u-credit");
	if (lp->credit_rise > 0.0) {
		snprintf(v, sizeof v, "%s of hot utility beyond the minimum: "
			 "it frees process heat that a credit pays more for",
			 hl_report_fmt_duty(a, B, lp->credit_rise));
		hl_report_fact(r, "Bought for credits", v, NULL);
	}
	for (i = 0; i < c->nutil; i++) {
		const hl_utility *u = &c->util[i];

		if (lp->util[i].across <= 0.0)
			continue;
		snprintf(v, sizeof v, "%s %s the pinch: %s must %s %s, the "
			 "end of its range; hot and cold utility rise by as "
			 "much above the minimum",
			 hl_report_fmt_duty(a, B, lp->util[i].across),
			 u->kind == HL_HOT ? "given below" : "taken above",
			 u->name, u->kind == HL_HOT ? "cool to" : "heat to",
			 hl_report_fmt_temp(b, B, u->kind == HL_HOT ?
				fmin(u->supply, u->target) :
				fmax(u->supply, u->target)));
		hl_report_fact(r, "Above the minimum", v, NULL);
	}
	for (i = 0; i < lp->npinch; i++) {
		const hl_utility_pinch *p = &lp->pinch[i];

		snprintf(v, sizeof v, "%s hot / %s cold (%s shifted)%s%s",
			 hl_report_fmt_temp(a, B, p->hot),
			 hl_report_fmt_temp(b, B, p->cold),
			 hl_report_fmt_temp(s, B, p->shifted),
			 p->util >= 0 ? ", the level of " : "",
			 p->util >= 0 ? c->util[p->util].name : "");
		snprintf(id, sizeof id, "u-pinch%zu", i + 1);
		hl_report_fact(r, "Utility pinch", v, id);
	}
	if (lp->npinch == 0)
		hl_report_fact(r, "Utility pinches", "none", NULL);
	hl_report_fact(r, "Solver", lp->optimal ? "GLPK simplex, proven "
		       "optimal" : "GLPK simplex, not proven optimal", NULL);
	hl_report_facts_end(r);
}

static void
write_choice(hl_report *r)
{
	choice_sentence(r);
	choice_table(r);
	choice_facts(r);
	hl_report_note(r, "A utility pinch is a temperature where, with these "
		       "loads, no heat flows down the cascade although the "
		       "process alone would pass heat there: the network is "
		       "split there as at a process pinch. Unused levels could "
		       "serve but cost more; a level out of reach cannot serve "
		       "any stream at this ΔTmin.");
}

const hl_report_section hl_report_sec_choice = {
	"utility-choice", "Utility choice", have_lp, write_choice
};
