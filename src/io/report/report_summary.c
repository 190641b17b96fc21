/* report_summary.c - the first page: what the study is, the headline
 * figures, and what they mean in a few sentences. */
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "report_sec.h"

#define B 64

static int
always(const hl_report_data *d)
{
	(void)d;
	return 1;
}

static size_t
count_hot(const hl_case *c)
{
	size_t i, n = 0;

	for (i = 0; i < c->nstream; i++)
		n += c->stream[i].kind == HL_HOT;
	return n;
}

static void
job(hl_report *r)
{
	const hl_report_data *d = r->d;
	const hl_case *c = d->c;
	size_t hot = count_hot(c);
	char a[B], b[B];

	hl_html_start(r->h, "p", "lead");
	hl_html_textf(r->h, "This study screens the heat recovery between the "
		      "%zu process streams of case %s: %zu hot stream%s that "
		      "must give up %s and %zu cold stream%s that must take "
		      "up %s", c->nstream, hl_report_case_name(c), hot,
		      hot == 1 ? "" : "s",
		      hl_report_fmt_duty(a, B, d->cas->hot_total),
		      c->nstream - hot, c->nstream - hot == 1 ? "" : "s",
		      hl_report_fmt_duty(b, B, d->cas->cold_total));
	if (c->nutil > 0)
		hl_html_textf(r->h, ", with %zu utility levels to choose from",
			      c->nutil);
	hl_html_text(r->h, ". It sets the least heating and cooling any "
		     "network of exchangers would need, where the pinch lies "
		     "and");
	if (c->nutil > 0)
		hl_html_text(r->h, " which utility levels are cheapest, and");
	hl_html_text(r->h, " what the heat recovery may cost.");
	hl_html_end(r->h);
}

/* A headline figure: the number large, its unit (from the no-break space
 * that report_fmt puts before it) smaller, the name below. */
static void
tile(hl_report *r, const char *value, const char *name, const char *id)
{
	const char *unit = strstr(value, HL_NBSP);
	char num[B];

	snprintf(num, sizeof num, "%.*s", unit ? (int)(unit - value) :
		 (int)strlen(value), value);
	hl_html_start(r->h, "div", "tile");
	hl_html_start(r->h, "span", "tile-value");
	hl_html_attr(r->h, "id", id);
	hl_html_text(r->h, num);
	if (unit != NULL)
		hl_html_elem(r->h, "span", "tile-unit", unit);
	hl_html_end(r->h);
	hl_html_elem(r->h, "span", "tile-name", name);
	hl_html_end(r->h);
}

static void
tiles(hl_report *r)
{
	const hl_report_data *d = r->d;
	char v[B];

	hl_html_start(r->h, "div", "tiles");
	tile(r, hl_report_fmt_duty(v, B, d->cas->qh), "minimum heating "
	     "(hot utility)", "sum-qh");
	tile(r, hl_report_fmt_duty(v, B, d->cas->qc), "minimum cooling "
	     "(cold utility)", "sum-qc");
	tile(r, hl_report_fmt_duty(v, B, d->cas->hot_total - d->cas->qc),
	     "heat recovered between streams", "sum-recovery");
	if (d->lp != NULL)
		tile(r, hl_report_fmt_money(v, B, d->lp->cost,
		     hl_report_currency(d->c), 1), "utility cost at the "
		     "targets", "sum-ucost");
	hl_html_end(r->h);
}

/* A finding: one list item, its figure marked by id for links and tests. */
static void
finding_start(hl_report *r)
{
	hl_html_start(r->h, "li", NULL);
}

static void
figure_span(hl_report *r, const char *text, const char *id)
{
	hl_html_start(r->h, "strong", NULL);
	hl_html_attr(r->h, "id", id);
	hl_html_text(r->h, text);
	hl_html_end(r->h);
}

static void
finding_pinch(hl_report *r)
{
	const hl_cascade *cas = r->d->cas;
	char v[2 * B], a[B], b[B];
	double s;

	finding_start(r);
	if (cas->npinch == 0) {
		hl_html_text(r->h, "There is no pinch: the process is a "
			     "threshold problem that needs ");
		hl_html_text(r->h, r->d->th->kind == 'H' ? "no heating "
			     "utility" : r->d->th->kind == 'C' ? "no cooling "
			     "utility" : "no utility at all");
		hl_html_text(r->h, " at this ΔTmin.");
		hl_html_end(r->h);
		return;
	}
	s = cas->t[cas->pinch[0]];
	snprintf(v, sizeof v, "%s hot / %s cold",
		 hl_report_fmt_temp(a, B, hl_cascade_hot_temp(cas, s)),
		 hl_report_fmt_temp(b, B, hl_cascade_cold_temp(cas, s)));
	hl_html_textf(r->h, "The pinch%s lies at ", cas->npinch > 1 ?
		      " (the hottest of several)" : "");
	figure_span(r, v, "sum-pinch");
	hl_html_textf(r->h, " at ΔTmin %s. A design that meets the targets "
		      "transfers no heat across it, heats only above it and "
		      "cools only below it.", hl_report_fmt_dt(a, B,
		      cas->dtmin));
	hl_html_end(r->h);
}

static void
finding_audit(hl_report *r)
{
	const hl_audit *a = r->d->audit;
	const hl_existing_unit *u;
	char x[B], y[B], z[B];

	if (a == NULL)
		return;
	finding_start(r);
	hl_html_textf(r->h, "Today the plant uses %s of heating, %s more than "
		      "the target", hl_report_fmt_duty(x, B, a->net->hot_now),
		      hl_report_fmt_duty(y, B, a->saving));
	if (a->nviol > 0) {
		u = &a->net->unit[a->viol[0].unit];
		hl_html_textf(r->h, "; %zu unit%s break%s the pinch rules, the "
			      "largest %s (%s, %s)", a->nviol, a->nviol == 1 ?
			      "" : "s", a->nviol == 1 ? "s" : "", u->name,
			      a->viol[0].kind == HL_VIOL_ACROSS ? "heat across "
			      "the pinch" : a->viol[0].kind == HL_VIOL_HOT_BELOW ?
			      "heating below the pinch" : a->viol[0].kind ==
			      HL_VIOL_COLD_ABOVE ? "cooling above the pinch" :
			      "heat passed up", hl_report_fmt_duty(z, B,
			      a->viol[0].duty));
	}
	hl_html_text(r->h, ".");
	hl_html_end(r->h);
}

static void
finding_utilities(hl_report *r)
{
	const hl_case *c = r->d->c;
	const hl_utility_lp *lp = r->d->lp;
	size_t i, n = 0, used = 0;
	char a[B];

	if (lp == NULL)
		return;
	for (i = 0; i < c->nutil; i++)
		used += lp->util[i].use == HL_UTIL_USED;
	finding_start(r);
	hl_html_text(r->h, "The cheapest utility mix is ");
	for (i = 0; i < c->nutil; i++) {
		if (lp->util[i].use != HL_UTIL_USED)
			continue;
		hl_html_textf(r->h, "%s%s of %s", n == 0 ? "" : n + 1 == used ?
			      " and " : ", ", hl_report_fmt_duty(a, B,
			      lp->util[i].load), c->util[i].name);
		n++;
	}
	if (n == 0)
		hl_html_text(r->h, "none at all");
	hl_html_text(r->h, ".");
	hl_html_end(r->h);
}

static void
finding_tradeoff(hl_report *r)
{
	const hl_report_data *d = r->d;
	const char *cur = hl_report_currency(d->c);
	char v[2 * B], a[B], b[B];

	if (d->sw == NULL || !d->sw->have_optimum)
		return;
	finding_start(r);
	hl_html_text(r->h, "Energy against capital: the total annual cost "
		     "target is least at ΔTmin ");
	snprintf(v, sizeof v, "%s (%s)", hl_report_fmt_dt(a, B,
		 d->sw->optimum.dtmin), hl_report_fmt_money(b, B,
		 d->sw->optimum.total_cost, cur, 1));
	figure_span(r, v, "sum-optimum");
	if (d->st != NULL)
		hl_html_textf(r->h, ", against %s at the ΔTmin of %s used in "
			      "this report", hl_report_fmt_money(a, B,
			      d->st->total_cost, cur, 1),
			      hl_report_fmt_dt(b, B, d->st->dtmin));
	hl_html_text(r->h, ".");
	hl_html_end(r->h);
}

static void
finding_measure(hl_report *r)
{
	const hl_sensitivity *sv = r->d->sv;
	size_t i, n = 0;

	if (sv == NULL)
		return;
	for (i = 0; i < sv->nrow && n < 3; i++)
		if (hl_sensitivity_effect(&sv->row[sv->rank[i]]) >= 0.05)
			n++;
	if (n == 0)
		return;
	finding_start(r);
	hl_html_text(r->h, "Measure first: ");
	for (i = 0; i < n; i++) {
		const hl_sens_row *row = &sv->row[sv->rank[i]];

		hl_html_textf(r->h, "%s%s %s", i == 0 ? "" : i + 1 == n ?
			      " and " : ", ", r->d->c->stream[row->stream].name,
			      row->q == HL_SENS_SUPPLY ? "supply temperature" :
			      row->q == HL_SENS_TARGET ? "target temperature" :
			      hl_sensitivity_quantity_name(row->q));
	}
	hl_html_textf(r->h, ": within their tolerances they move the %s most.",
		      sv->cost != HL_SENS_COST_NONE ? "utility cost" :
		      "targets");
	hl_html_end(r->h);
}

static void
finding_network(hl_report *r)
{
	const hl_network *n = r->d->net;
	const char *cur = hl_report_currency(r->d->c);
	char v[2 * B], a[B], b[B];

	if (n == NULL)
		return;
	finding_start(r);
	hl_html_text(r->h, "A first network: ");
	snprintf(v, sizeof v, "%zu exchangers, %s", n->nunit,
		 hl_report_fmt_area(a, B, n->area));
	figure_span(r, v, "sum-net");
	hl_html_textf(r->h, ", %s installed, a total annual cost of %s",
		      hl_report_fmt_money(a, B, n->capital, cur, 0),
		      hl_report_fmt_money(b, B, n->total_cost, cur, 1));
	hl_html_text(r->h, "; ");
	hl_report_rise_text(r, n);
	hl_html_text(r->h, ".");
	hl_html_end(r->h);
}

/* For a site with today's network: where it stands and what a retrofit
 * would pay, in place of the capital targets of a new design. */
static void
audit_tiles(hl_report *r)
{
	const hl_report_data *d = r->d;
	const hl_audit *a = d->audit;
	const char *cur = hl_report_currency(d->c);
	const hl_retrofit_point *t = d->retrofit && d->retrofit->n > 0 ?
		&d->retrofit->pt[d->retrofit->n - 1] : NULL;
	char v[B], y[B];

	hl_html_start(r->h, "div", "tiles capital");
	tile(r, hl_report_fmt_duty(v, B, a->net->hot_now), "heating today",
	     "sum-hot-now");
	tile(r, hl_report_fmt_money(v, B, a->saving_cost, cur, 1),
	     "saving potential at today's prices", "sum-saving");
	if (t != NULL) {
		tile(r, hl_report_fmt_area(v, B, t->new_area), "new area to "
		     "reach the targets", "sum-new-area");
		snprintf(v, sizeof v, "%s" HL_NBSP "years", isnan(t->payback) ? "–" :
			 hl_report_fmt_fixed(y, B, t->payback, 1));
		tile(r, v, "simple payback of that retrofit", "sum-payback");
	}
	hl_html_end(r->h);
}

/* The capital side, when the supertargets ran: a second row of tiles. */
static void
capital_tiles(hl_report *r)
{
	const hl_report_data *d = r->d;
	const char *cur = hl_report_currency(d->c);
	char v[B], name[B];

	if (d->st == NULL)
		return;
	hl_html_start(r->h, "div", "tiles capital");
	tile(r, hl_report_fmt_area(v, B, d->c->set.exchanger ==
	     HL_EXCH_SHELL_TUBE ? d->st->area_st : d->st->area),
	     "exchanger area target", "sum-area");
	snprintf(v, sizeof v, "%d / %d", d->st->units, d->st->shells);
	tile(r, v, "units / shells target", "sum-units");
	tile(r, hl_report_fmt_money(v, B, d->st->capital, cur, 0),
	     "capital cost target", "sum-capital");
	snprintf(name, sizeof name, "total annual cost at ΔTmin %s",
		 hl_report_fmt_dt(v, B, d->st->dtmin));
	tile(r, hl_report_fmt_money(v, B, d->st->total_cost, cur, 1), name,
	     "sum-tac");
	hl_html_end(r->h);
}

static void
write_summary(hl_report *r)
{
	job(r);
	tiles(r);
	if (r->d->audit != NULL)
		audit_tiles(r);
	else
		capital_tiles(r);
	hl_html_start(r->h, "ul", "findings");
	finding_audit(r);
	finding_pinch(r);
	finding_utilities(r);
	finding_tradeoff(r);
	finding_network(r);
	finding_measure(r);
	hl_html_end(r->h);
}

const hl_report_section hl_report_sec_summary = {
	"summary", "Summary", always, write_summary
};
