/* report_case.c - the summary of the study and the data as given. */
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
summary_job(hl_report *r)
{
	const hl_report_data *d = r->d;
	const hl_case *c = d->c;
	size_t hot = count_hot(c);
	char a[B], b[B];

	hl_html_start(r->h, "p", "lead");
	hl_html_textf(r->h, "This study screens the heat recovery of the %zu "
		      "process streams of %s: %zu hot streams that give %s "
		      "and %zu cold streams that take %s", c->nstream,
		      hl_report_case_name(c), hot,
		      hl_report_fmt_duty(a, B, d->cas->hot_total),
		      c->nstream - hot,
		      hl_report_fmt_duty(b, B, d->cas->cold_total));
	if (c->nutil > 0)
		hl_html_textf(r->h, ", served by %zu utility levels", c->nutil);
	hl_html_text(r->h, ". It finds how much heating and cooling the "
		     "process needs at least, where the pinch lies, which "
		     "utility levels are cheapest");
	if (d->sw != NULL)
		hl_html_text(r->h, ", and how the minimum approach temperature "
			     "ΔTmin trades energy against exchanger capital");
	hl_html_text(r->h, ".");
	hl_html_end(r->h);
}

static void
summary_pinch(hl_report *r, char *buf)
{
	const hl_cascade *cas = r->d->cas;
	char a[B], b[B];
	double s;

	if (cas->npinch == 0) {
		snprintf(buf, 2 * B, "none (a threshold problem)");
		return;
	}
	s = cas->t[cas->pinch[0]];
	snprintf(buf, 2 * B, "%s hot / %s cold%s",
		 hl_report_fmt_temp(a, B, hl_cascade_hot_temp(cas, s)),
		 hl_report_fmt_temp(b, B, hl_cascade_cold_temp(cas, s)),
		 cas->npinch > 1 ? " and more (see the energy targets)" : "");
}

static void
summary_facts(hl_report *r)
{
	const hl_report_data *d = r->d;
	const char *cur = hl_report_currency(d->c);
	char v[2 * B];

	hl_report_facts_start(r, "Key figures");
	hl_report_fact(r, "ΔTmin used", hl_report_fmt_dt(v, B, d->cas->dtmin),
		       "sum-dtmin");
	hl_report_fact(r, "Minimum hot utility",
		       hl_report_fmt_duty(v, B, d->cas->qh), "sum-qh");
	hl_report_fact(r, "Minimum cold utility",
		       hl_report_fmt_duty(v, B, d->cas->qc), "sum-qc");
	hl_report_fact(r, "Heat recovery at these targets",
		       hl_report_fmt_duty(v, B,
			d->cas->hot_total - d->cas->qc), "sum-recovery");
	summary_pinch(r, v);
	hl_report_fact(r, "Pinch", v, "sum-pinch");
	if (d->lp != NULL)
		hl_report_fact(r, "Utility cost at least cost",
			       hl_report_fmt_money(v, B, d->lp->cost, cur, 1),
			       "sum-ucost");
	if (d->st != NULL) {
		hl_report_fact(r, "Exchanger area target", hl_report_fmt_area(v,
			       B, d->c->set.exchanger == HL_EXCH_SHELL_TUBE ?
			       d->st->area_st : d->st->area), "sum-area");
		snprintf(v, sizeof v, "%d units, %d shells", d->st->units,
			 d->st->shells);
		hl_report_fact(r, "Units and shells target", v, "sum-units");
		hl_report_fact(r, "Total annual cost target",
			       hl_report_fmt_money(v, B, d->st->total_cost,
						   cur, 1), "sum-tac");
	}
	if (d->sw != NULL && d->sw->have_optimum) {
		char a[B], b[B];

		snprintf(v, sizeof v, "%s (%s)",
			 hl_report_fmt_dt(a, B, d->sw->optimum.dtmin),
			 hl_report_fmt_money(b, B, d->sw->optimum.total_cost,
					     cur, 1));
		hl_report_fact(r, "ΔTmin of least total annual cost", v,
			       "sum-optimum");
	}
	hl_report_facts_end(r);
}

/* The three measurements that move the targets most. */
static void
summary_check_first(hl_report *r)
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
	hl_html_start(r->h, "p", NULL);
	hl_html_text(r->h, "Measure first: ");
	for (i = 0; i < n; i++) {
		const hl_sens_row *row = &sv->row[sv->rank[i]];

		hl_html_textf(r->h, "%s%s %s", i == 0 ? "" : i + 1 == n ?
			      " and " : ", ", r->d->c->stream[row->stream].name,
			      row->q == HL_SENS_SUPPLY ? "supply temperature" :
			      row->q == HL_SENS_TARGET ? "target temperature" :
			      hl_sensitivity_quantity_name(row->q));
	}
	hl_html_text(r->h, " move the targets most within their tolerances "
		     "(section on sensitivity).");
	hl_html_end(r->h);
}

static void
write_summary(hl_report *r)
{
	summary_job(r);
	summary_facts(r);
	summary_check_first(r);
	hl_report_note(r, "Targets are what the stream data allow at best, "
		       "before any exchanger is designed; a network that "
		       "meets them needs the detailed design that the caution "
		       "at the end of this report describes.");
}

const hl_report_section hl_report_sec_summary = {
	"summary", "Summary", always, write_summary
};

/* cp as given: up to four significant figures, trailing zeros cut. */
static char *
cp_text(char *buf, size_t size, double cp)
{
	snprintf(buf, size, "%.4g", cp);
	return buf;
}

static char *
h_text(char *buf, size_t size, double h, double h_default)
{
	if (isnan(h))
		snprintf(buf, size, "%.4g (default)", h_default);
	else
		snprintf(buf, size, "%.4g", h);
	return buf;
}

static char *
contrib_text(char *buf, size_t size, double dt)
{
	if (isnan(dt))
		snprintf(buf, size, "ΔTmin/2");
	else
		hl_report_fmt_fixed(buf, size, dt, 1);
	return buf;
}

static void
stream_rows(hl_report *r, const hl_stream *s)
{
	const hl_settings *set = &r->d->c->set;
	size_t k;
	char v[B];

	for (k = 0; k < s->nseg; k++) {
		const hl_segment *g = &s->seg[k];

		hl_report_row_start(r, k > 0 ? "cont" : NULL);
		if (k == 0)
			hl_report_cell(r, s->name);
		else
			hl_report_cell(r, "\xe2\x80\x83" "continued");
		hl_report_cell(r, k == 0 ? (s->kind == HL_HOT ? "hot" :
			       "cold") : "");
		hl_report_cell_num(r, hl_report_fmt_fixed(v, B, g->supply, 1));
		hl_report_cell_num(r, hl_report_fmt_fixed(v, B, g->target, 1));
		hl_report_cell_num(r, cp_text(v, B, g->cp));
		hl_report_cell_num(r, hl_report_fmt_sig(v, B,
				   g->cp * fabs(g->supply - g->target), 3, 1));
		hl_report_cell(r, g->by_duty ? "duty" : "cp");
		hl_report_cell_num(r, h_text(v, B, g->h, set->h_default));
		hl_report_cell_num(r, k == 0 ? contrib_text(v, B,
				   s->dt_contrib) : "");
		hl_report_row_end(r);
	}
}

static void
sources(hl_report *r, const char *what, const char *first, const char *other)
{
	hl_html_start(r->h, "p", "note");
	hl_html_textf(r->h, "%s as read from %s", what, first ? first :
		      "the case");
	if (other != NULL && (first == NULL || strcmp(other, first) != 0))
		hl_html_textf(r->h, " and %s", other);
	hl_html_text(r->h, ".");
	hl_html_end(r->h);
}

static void
stream_table(hl_report *r)
{
	static const char *const head[] = { "Stream", "Kind", "Supply",
		"Target", "cp", "Duty", "Given", "h", "ΔT contribution" };
	static const char *const unit[] = { "", "", "°C", "°C", "kW/K", "kW",
		"", "kW/(m²·K)", "K" };
	static const int num[] = { 0, 0, 1, 1, 1, 1, 0, 1, 1 };
	const hl_case *c = r->d->c;
	size_t i;

	hl_report_table_start(r, "data", "Process streams as given "
			      "(one row per segment of constant cp).", 9,
			      head, unit, num);
	for (i = 0; i < c->nstream; i++)
		stream_rows(r, &c->stream[i]);
	hl_report_table_end(r);
	sources(r, "Streams", c->nstream ? c->stream[0].file : NULL,
		c->nstream ? c->stream[c->nstream - 1].file : NULL);
	hl_report_note(r, "“Given” says whether the table gave the cp or the "
		       "duty of the segment (the other follows from the "
		       "temperatures). An h marked (default) was not given; "
		       "the area targets use the case's default film "
		       "coefficient for it. A ΔT contribution of ΔTmin/2 is "
		       "the default shift of a stream.");
}

static char *
max_text(char *buf, size_t size, double max_load)
{
	if (isnan(max_load))
		snprintf(buf, size, "unlimited");
	else
		hl_report_fmt_sig(buf, size, max_load, 3, 1);
	return buf;
}

static void
utility_table(hl_report *r)
{
	static const char *const head[] = { "Utility", "Kind", "Supply",
		"Target", "Price", "h", "Max load", "ΔT contribution" };
	static const int num[] = { 0, 0, 1, 1, 1, 1, 1, 1 };
	const hl_case *c = r->d->c;
	char price_unit[64], v[B];
	const char *unit[8] = { "", "", "°C", "°C", price_unit, "kW/(m²·K)",
				"kW", "K" };
	size_t i;

	snprintf(price_unit, sizeof price_unit, "%s/MWh",
		 *hl_report_currency(c) ? hl_report_currency(c) : "per");
	hl_report_table_start(r, "data", "Utility levels as given.", 8, head,
			      unit, num);
	for (i = 0; i < c->nutil; i++) {
		const hl_utility *u = &c->util[i];

		hl_report_row_start(r, NULL);
		hl_report_cell(r, u->name);
		hl_report_cell(r, u->kind == HL_HOT ? "hot" : "cold");
		hl_report_cell_num(r, hl_report_fmt_fixed(v, B, u->supply, 1));
		hl_report_cell_num(r, hl_report_fmt_fixed(v, B, u->target, 1));
		snprintf(v, B, "%.2f", u->price);
		hl_report_cell_num(r, v);
		hl_report_cell_num(r, h_text(v, B, u->h, c->set.h_default));
		hl_report_cell_num(r, max_text(v, B, u->max_load));
		hl_report_cell_num(r, contrib_text(v, B, u->dt_contrib));
		hl_report_row_end(r);
	}
	hl_report_table_end(r);
	sources(r, "Utilities", c->util[0].file, c->util[c->nutil - 1].file);
}

static void
write_data(hl_report *r)
{
	hl_report_para(r, "The data below are the inputs of every result in "
		       "this report, as the case gives them. Check them "
		       "against the plant's own measurements before relying "
		       "on any target.");
	stream_table(r);
	if (r->d->c->nutil > 0)
		utility_table(r);
	else
		hl_report_note(r, "The case gives no utility levels: the "
			       "targets are the minimum hot and cold utility "
			       "without a choice of levels or their cost.");
}

const hl_report_section hl_report_sec_streams = {
	"data", "Stream and utility data", always, write_data
};
