/* report_audit.c - today's network against the targets: the saving, the
 * culprits (pinch rules broken), the units as read, the area efficiency
 * and the retrofit at constant α with its payback (the numbers of
 * `heatloom audit --format xml`). */
#include <math.h>
#include <stdio.h>

#include "audit_out.h"
#include "display.h"
#include "report_sec.h"

#define B 64

static int
present(const hl_report_data *d)
{
	return d->audit != NULL || d->audit_note != NULL;
}

static const char *
rule_name(hl_violation_kind k)
{
	static const char *const n[] = { "process heat across the pinch",
		"hot utility below the pinch", "cold utility above the pinch",
		"heat passed up across the pinch" };

	return (unsigned)k < 4 ? n[k] : "";
}

static void
energy_table(hl_report *r)
{
	static const char *const head[] = { "", "Today", "Target", "Saving" };
	static const char *const unit[] = { "", "kW", "kW", "kW" };
	static const int num[] = { 0, 1, 1, 1 };
	const hl_audit *a = r->d->audit;
	const double v[2][3] = {
		{ a->net->hot_now, a->hot_target, a->saving },
		{ a->net->cold_now, a->cold_target, a->saving_cold } };
	const char *const name[2] = { "Hot utility", "Cold utility" };
	const char *const id[2] = { "a-hot", "a-cold" };
	char s[B];
	size_t i, k;

	hl_report_table_start(r, "data energy", "Utility use today against "
			      "the targets at the same ΔTmin.", 4, head, unit,
			      num);
	for (i = 0; i < 2; i++) {
		hl_html_start(r->h, "tr", NULL);
		hl_html_attr(r->h, "id", id[i]);
		hl_report_cell(r, name[i]);
		for (k = 0; k < 3; k++)
			hl_report_cell_num(r, hl_report_fmt_qty(s, B, hl_show_q(v[i][k])));
		hl_report_row_end(r);
	}
	hl_report_table_end(r);
}

static void
energy_facts(hl_report *r)
{
	const hl_case *c = r->d->c;
	const hl_audit *a = r->d->audit;
	const char *cur = hl_report_currency(c);
	char v[2 * B], x[B];

	hl_report_facts_start(r, NULL);
	hl_report_fact(r, "Saving potential at today's prices",
		       hl_report_fmt_money(v, B, a->saving_cost, cur, 1),
		       "a-saving-cost");
	hl_report_fact(r, "Utility bill today", hl_report_fmt_money(v, B,
		       a->net->cost_now, cur, 1), "a-cost-now");
	if (c->nutil > 0)
		hl_report_fact(r, "Utility bill at the targets (least-cost "
			       "levels)", hl_report_fmt_money(v, B,
			       a->cost_target, cur, 1), "a-cost-target");
	if (isnan(a->dtmin_now))
		snprintf(v, sizeof v, "none: even at 0 K the targets need more");
	else if (isinf(a->dtmin_now))
		snprintf(v, sizeof v, "none: today's plant recovers no heat");
	else
		snprintf(v, sizeof v, "%s (the targets equal today's hot "
			 "utility there)", hl_report_fmt_dt(x, B,
			 a->dtmin_now));
	hl_report_fact(r, "ΔTmin of today's energy", v, "a-dtmin-now");
	hl_report_facts_end(r);
}

static void
culprit_row(hl_report *r, const hl_violation *vi, size_t rank)
{
	const hl_existing_unit *u = &r->d->audit->net->unit[vi->unit];
	char v[B];

	hl_report_row_start(r, NULL);
	snprintf(v, B, "%zu", rank);
	hl_report_cell_num(r, v);
	hl_report_cell(r, u->name);
	hl_html_start(r->h, "td", NULL);
	hl_html_text(r->h, rule_name(vi->kind));
	hl_html_elemf(r->h, "span", "action", ": %s",
		      hl_audit_action(vi->kind));
	hl_html_end(r->h);
	hl_report_cell_num(r, hl_report_fmt_qty(v, B, hl_show_q(vi->duty)));
	hl_report_cell_num(r, hl_report_fmt_sig(v, B, vi->saving, 3, 0));
	hl_report_row_end(r);
}

static void
culprits(hl_report *r)
{
	static const char *const head[] = { "#", "Unit", ("Rule broken and "
		"what to do"), "Duty", "Saving" };
	const hl_audit *a = r->d->audit;
	const char *cur = hl_report_currency(r->d->c);
	static const int num[] = { 1, 0, 0, 1, 1 };
	char cu[64], x[B], y[B];
	const char *unit[5] = { "", "", "", "kW", cu };
	size_t i;

	snprintf(cu, sizeof cu, "%s/yr", *cur ? cur : "per");
	hl_html_elem(r->h, "h3", NULL, "The culprits");
	if (a->nviol == 0) {
		hl_report_para(r, "Today's network breaks no pinch rule.");
		return;
	}
	hl_report_para(r, "Each kW that a unit moves across the pinch, or a "
		       "heater below it, or a cooler above it, costs a kW of "
		       "heating and a kW of cooling (Linnhoff et al. 1982). "
		       "The units that do so, largest first:");
	hl_report_table_start(r, "data culprits", "Pinch rules broken by "
			      "today's units, with the saving each would bring "
			      "at today's prices.", 5, head, unit, num);
	for (i = 0; i < a->nviol; i++)
		culprit_row(r, &a->viol[i], i + 1);
	hl_report_table_end(r);
	hl_html_start(r->h, "p", "note");
	hl_html_textf(r->h, "The rules broken add up to %s, against today's %s "
		      "above the hot utility target.", hl_report_fmt_duty(x, B,
		      a->violations), hl_report_fmt_duty(y, B, a->saving));
	hl_html_end(r->h);
}

static void
side_temps(char *buf, size_t size, const hl_side *s)
{
	char a[B / 2], b[B / 2];

	snprintf(buf, size, "%s → %s", hl_report_fmt_fixed(a, sizeof a,
		 hl_show_t(s->t_in), 1), hl_report_fmt_fixed(b, sizeof b,
		 hl_show_t(s->t_out), 1));
}

static void
unit_row(hl_report *r, size_t i)
{
	const hl_case *c = r->d->c;
	const hl_audit *a = r->d->audit;
	const hl_existing_unit *u = &a->net->unit[i];
	char v[2 * B], ar[B];

	hl_report_row_start(r, u->implied ? "implied" : NULL);
	hl_report_cell(r, u->implied ? "(gap)" : u->name);
	hl_report_cell(r, hl_existing_side_name(c, &u->hot));
	hl_report_cell(r, hl_existing_side_name(c, &u->cold));
	hl_report_cell_num(r, hl_report_fmt_qty(v, B, hl_show_q(u->duty)));
	side_temps(v, sizeof v, &u->hot);
	hl_report_cell_num(r, v);
	side_temps(v, sizeof v, &u->cold);
	hl_report_cell_num(r, v);
	if (isnan(u->area))
		v[0] = '\0';
	else
		snprintf(v, sizeof v, "%s%s", u->area_estimated ? "*" : "",
			 hl_report_fmt_qty(ar, B, hl_show_a(u->area)));
	hl_report_cell_num(r, v);
	snprintf(v, B, "%d", u->shells);
	hl_report_cell_num(r, v);
	if (isnan(a->unit_alpha[i]))
		v[0] = '\0';
	else
		snprintf(v, B, "%.2f", a->unit_alpha[i]);
	hl_report_cell_num(r, v);
	hl_report_row_end(r);
}

static void
units(hl_report *r)
{
	static const char *const head[] = { "Unit", "Hot side", "Cold side",
		"Duty", "Hot in → out", "Cold in → out", "Area", "Shells",
		"α unit" };
	static const char *const unit[] = { "", "", "", "kW", "°C", "°C",
		"m²", "", "" };
	static const int num[] = { 0, 0, 0, 1, 1, 1, 1, 1, 1 };
	const hl_existing *net = r->d->audit->net;
	size_t i;

	hl_html_elem(r->h, "h3", NULL, "Today's units as read");
	hl_report_table_start(r, "data units", "Today's exchangers, heaters "
			      "and coolers, with the temperatures filled in "
			      "along each stream from its supply end. * area "
			      "estimated from film coefficients; α unit: the "
			      "area vertical transfer would need over its "
			      "stretch of the composites, divided by its "
			      "area.", 9, head, unit, num);
	for (i = 0; i < net->nunit; i++)
		unit_row(r, i);
	hl_report_table_end(r);
}

static void
efficiency(hl_report *r)
{
	const hl_audit *a = r->d->audit;
	char v[2 * B], x[B];

	hl_html_elem(r->h, "h3", NULL, "Area efficiency");
	hl_report_facts_start(r, NULL);
	hl_report_fact(r, "Existing area", hl_report_fmt_area(v, B,
		       a->area_existing), "a-area-existing");
	hl_report_fact(r, "Area target at today's energy",
		       hl_report_fmt_area(v, B, a->area_target_now),
		       "a-area-target-now");
	if (isnan(a->alpha)) {
		hl_report_fact(r, "Area efficiency α", a->note[0] ? a->note :
			       "not defined", "a-alpha");
	} else {
		snprintf(v, sizeof v, "%s (area target at today's energy / "
			 "existing area)", hl_report_fmt_sig(x, B, a->alpha, 3,
			 3));
		hl_report_fact(r, "Area efficiency α", v, "a-alpha");
	}
	hl_report_facts_end(r);
}

static void
retrofit_row(hl_report *r, const hl_retrofit_point *p, size_t i, size_t n)
{
	char v[B];

	hl_report_row_start(r, i == 0 ? "chosen" : i + 1 == n ? "best" : NULL);
	hl_report_cell_num(r, hl_report_fmt_qty(v, B, hl_show_q(p->hot_utility)));
	hl_report_cell_num(r, hl_report_fmt_fixed(v, B, hl_show_dt(p->dtmin),
			   1));
	hl_report_cell_num(r, hl_report_fmt_qty(v, B, hl_show_a(p->area_retrofit)));
	hl_report_cell_num(r, hl_report_fmt_qty(v, B, hl_show_a(p->new_area)));
	hl_report_cell_num(r, hl_report_fmt_sig(v, B, p->investment, 3, 0));
	hl_report_cell_num(r, hl_report_fmt_sig(v, B, p->saving, 3, 0));
	if (isnan(p->payback))
		hl_report_cell_num(r, i == 0 ? "today" : "");
	else
		hl_report_cell_num(r, hl_report_fmt_fixed(v, B, p->payback, 1));
	hl_report_row_end(r);
}

static void
retrofit_sentence(hl_report *r)
{
	const hl_retrofit *rf = r->d->retrofit;
	const hl_retrofit_point *t = &rf->pt[rf->n - 1];
	const char *cur = hl_report_currency(r->d->c);
	char a[B], b[B], c[B], e[B];

	hl_html_start(r->h, "p", NULL);
	hl_html_textf(r->h, "To reach the targets at today's area efficiency: "
		      "%s of new area for about %s, saving %s: simple payback ",
		      hl_report_fmt_area(a, B, t->new_area),
		      hl_report_fmt_money(b, B, t->investment, cur, 0),
		      hl_report_fmt_money(c, B, t->saving, cur, 1));
	hl_html_start(r->h, "strong", NULL);
	hl_html_attr(r->h, "id", "a-payback");
	hl_html_textf(r->h, "%s years", isnan(t->payback) ? "–" :
		      hl_report_fmt_fixed(e, B, t->payback, 1));
	hl_html_end(r->h);
	hl_html_text(r->h, ".");
	hl_html_end(r->h);
}

/* Why the area targets here are not those of the trade-off section at the
 * same ΔTmin: the mix of utility levels. */
static void
sweep_gap_note(hl_report *r, const hl_retrofit *rf)
{
	const hl_retrofit_point *w = NULL;
	char a[B], b[B], t[B], v[8 * B];
	size_t i;

	for (i = 0; i < rf->n; i++)
		if (!isnan(rf->pt[i].area_sweep) && (w == NULL ||
		    fabs(rf->pt[i].area_target - rf->pt[i].area_sweep) >
		    fabs(w->area_target - w->area_sweep)))
			w = &rf->pt[i];
	if (w == NULL || fabs(w->area_target - w->area_sweep) < 0.05)
		return;
	snprintf(v, sizeof v, "The area targets of this curve keep today's mix "
		 "of utility levels, moving linearly to the least-cost mix at "
		 "the targets; the ΔTmin sweep takes the least-cost mix at "
		 "every ΔTmin, so its area target differs at the same ΔTmin "
		 "(largest gap: %s here, %s there, at %s).",
		 hl_report_fmt_area(a, B, w->area_target),
		 hl_report_fmt_area(b, B, w->area_sweep),
		 hl_report_fmt_dt(t, B, w->dtmin));
	hl_report_note(r, v);
}

static void
retrofit(hl_report *r)
{
	static const char *const head[] = { "Hot utility", "ΔTmin", ("Area "
		"needed"), "New area", "Investment", "Saving", "Payback" };
	static const int num[] = { 1, 1, 1, 1, 1, 1, 1 };
	const hl_retrofit *rf = r->d->retrofit;
	const char *cur = hl_report_currency(r->d->c);
	char cu[64], cy[64];
	const char *unit[7] = { "kW", "K", "m²", "m²", cu, cy, "years" };
	size_t i;

	hl_html_elem(r->h, "h3", NULL, "Retrofit at constant area efficiency");
	if (rf == NULL || rf->n == 0) {
		hl_report_para(r, "No retrofit curve: the area efficiency is "
			       "not defined, or today's energy is already at "
			       "the targets.");
		return;
	}
	snprintf(cu, sizeof cu, "%s", *cur ? cur : "");
	snprintf(cy, sizeof cy, "%s/yr", *cur ? cur : "per");
	retrofit_sentence(r);
	hl_report_figure(r, hl_audit_chart(r->d->c, r->d->audit, rf), NULL,
			 "Area against hot utility: the area target curve, "
			 "today's plant and the retrofit curve at today's "
			 "area efficiency down to the targets.");
	hl_report_table_start(r, "data retrofit", "From today (first row) to "
			      "the targets (last row): the area a retrofit "
			      "keeping today's α needs, the new area, its "
			      "investment (shells of the shell target's mean "
			      "size, by the cost law of the case's exchanger type), the saving at "
			      "today's prices and the simple payback.", 7, head, unit, num);
	for (i = 0; i < rf->n; i++)
		retrofit_row(r, &rf->pt[i], i, rf->n);
	hl_report_table_end(r);
	sweep_gap_note(r, rf);
	hl_report_note(r, "Which units to re-pipe, where new shells go, "
		       "pressure drop, layout and plant constraints are not in "
		       "these figures: they are for a detailed retrofit "
		       "study.");
}

static void
warnings(hl_report *r)
{
	const hl_existing *net = r->d->audit->net;
	size_t i;

	if (net->nwarn == 0)
		return;
	hl_html_elem(r->h, "h3", NULL, "Notes on reading the network");
	hl_html_start(r->h, "ul", "warnings");
	for (i = 0; i < net->nwarn; i++) {
		const hl_error *w = &net->warn[i];

		hl_html_start(r->h, "li", NULL);
		if (w->file[0] != '\0' && w->line > 0)
			hl_html_textf(r->h, "%s, line %ld: ",
				      hl_report_base(w->file), w->line);
		hl_html_text(r->h, w->text);
		hl_html_end(r->h);
	}
	hl_html_end(r->h);
}

static void
write_audit(hl_report *r)
{
	const hl_audit *a = r->d->audit;
	char x[B], y[B], z[B];

	if (a == NULL) {
		hl_report_missing(r, "No audit", r->d->audit_note);
		return;
	}
	hl_html_start(r->h, "p", NULL);
	hl_html_textf(r->h, "Today's network (%zu units%s%s) uses %s of "
		      "heating, %s more than the target at ΔTmin %s.",
		      a->net->nrow, r->d->network_file ? " in " : "",
		      r->d->network_file ? hl_report_base(r->d->network_file) :
		      "", hl_report_fmt_duty(x, B, a->net->hot_now),
		      hl_report_fmt_duty(y, B, a->saving),
		      hl_report_fmt_dt(z, B, a->dtmin));
	hl_html_end(r->h);
	energy_table(r);
	energy_facts(r);
	culprits(r);
	efficiency(r);
	retrofit(r);
	units(r);
	warnings(r);
}

const hl_report_section hl_report_sec_audit = {
	"audit", "Audit of today's network", present, write_audit
};
