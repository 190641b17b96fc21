/* report_case.c - the data of the case as given: streams, utilities, match
 * rules. */
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "display.h"
#include "report_sec.h"

#define B 64

static int
always(const hl_report_data *d)
{
	(void)d;
	return 1;
}

/* cp as given: up to four significant figures, trailing zeros cut. */
static char *
cp_text(char *buf, size_t size, double cp)
{
	snprintf(buf, size, "%.4g", hl_show_cp(cp));
	return buf;
}

static char *
h_text(char *buf, size_t size, double h, double h_default)
{
	if (isnan(h))
		snprintf(buf, size, "%.4g (default)", hl_show_h(h_default));
	else
		snprintf(buf, size, "%.4g", hl_show_h(h));
	return buf;
}

static char *
contrib_text(char *buf, size_t size, double dt)
{
	if (isnan(dt))
		snprintf(buf, size, "ΔTmin/2");
	else
		hl_report_fmt_fixed(buf, size, hl_show_dt(dt), 1);
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
		hl_report_cell_num(r, hl_report_fmt_fixed(v, B,
				   hl_show_t(g->supply), 1));
		/* latent heat: one temperature, no cp (case.h) */
		hl_report_cell_num(r, hl_report_fmt_fixed(v, B,
				   hl_show_t(g->spread ? g->supply : g->target),
				   1));
		hl_report_cell_num(r, g->spread ? "latent" : cp_text(v, B,
				   g->cp));
		hl_report_cell_num(r, hl_report_fmt_qty(v, B, hl_show_q(g->cp *
				   fabs(g->supply - g->target))));
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
	hl_html_textf(r->h, "%s as read from %s", what, first ?
		      hl_report_base(first) : "the case");
	if (other != NULL && (first == NULL || strcmp(other, first) != 0))
		hl_html_textf(r->h, " and %s", hl_report_base(other));
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
		hl_report_fmt_qty(buf, size, hl_show_q(max_load));
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
		hl_report_cell_num(r, hl_report_fmt_fixed(v, B,
				   hl_show_t(u->supply), 1));
		hl_report_cell_num(r, hl_report_fmt_fixed(v, B,
				   hl_show_t(u->target), 1));
		snprintf(v, B, "%.2f", hl_show_p(u->price));
		hl_report_cell_num(r, v);
		hl_report_cell_num(r, h_text(v, B, u->h, c->set.h_default));
		hl_report_cell_num(r, max_text(v, B, u->max_load));
		hl_report_cell_num(r, contrib_text(v, B, u->dt_contrib));
		hl_report_row_end(r);
	}
	hl_report_table_end(r);
	sources(r, "Utilities", c->util[0].file, c->util[c->nutil - 1].file);
}

static const char *
rule_kind(hl_rule_kind k)
{
	return k == HL_RULE_FORBID ? "forbidden" : k == HL_RULE_REQUIRE ?
	       "required" : "at most";
}

static void
rule_table(hl_report *r)
{
	static const char *const head[] = { "Rule", "Hot side", "Cold side",
		"Duty limit", "Reason" };
	static const char *const unit[] = { "", "", "", "kW", "" };
	static const int num[] = { 0, 0, 0, 1, 0 };
	const hl_case *c = r->d->c;
	char v[B];
	size_t i;

	hl_report_table_start(r, "data rules", "Match rules of the case: pairs "
			      "that the network design must avoid, include or "
			      "limit (“*” is any stream or utility of that "
			      "side).", 5, head, unit, num);
	for (i = 0; i < c->nrule; i++) {
		const hl_match_rule *m = &c->rule[i];

		hl_report_row_start(r, NULL);
		hl_report_cell(r, rule_kind(m->kind));
		hl_report_cell(r, m->hot);
		hl_report_cell(r, m->cold);
		hl_report_cell_num(r, m->kind == HL_RULE_MAX_DUTY ?
				   hl_report_fmt_qty(v, B, hl_show_q(m->max_duty)) :
				   "");
		hl_report_cell(r, m->reason ? m->reason : "");
		hl_report_row_end(r);
	}
	hl_report_table_end(r);
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
	if (r->d->c->nrule > 0)
		rule_table(r);
}

const hl_report_section hl_report_sec_streams = {
	"data", "Stream and utility data", always, write_data
};
