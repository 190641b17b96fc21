/* report_matches.c - the fewest units and the heat of every match (the
 * numbers of `heatloom matches --format xml`). */
#include <stdio.h>

#include "matches_out.h"
#include "display.h"
#include "report_sec.h"

#define B 64

static int
present(const hl_report_data *d)
{
	return d->mr != NULL || d->mr_note != NULL;
}

static void
summary(hl_report *r)
{
	const hl_match_result *m = r->d->mr;

	hl_html_start(r->h, "p", NULL);
	hl_html_text(r->h, "The fewest exchanger units that meet the utility "
		     "loads above: ");
	hl_html_start(r->h, "strong", NULL);
	hl_html_attr(r->h, "id", "m-units");
	hl_html_textf(r->h, "%zu units", m->units);
	hl_html_end(r->h);
	if (m->optimal)
		hl_html_text(r->h, ", proven the fewest");
	else
		hl_html_textf(r->h, ", the best found within the time limit "
			      "(at least %zu are needed)", m->lower);
	hl_html_textf(r->h, ", against %zu by the count of N − 1 in each of "
		      "the %zu subnetworks that the process and utility "
		      "pinches split the problem into.", m->euler, m->nsub);
	if (m->restricted)
		hl_html_textf(r->h, " The match rules raise the utility loads: "
			      "%.1f kW of hot utility is used where %.1f kW "
			      "would do without them.", m->qh, m->qh0);
	hl_html_end(r->h);
}

static void
sub_table(hl_report *r)
{
	static const char *const head[] = { "Subnetwork", "From", "To",
		"Streams", "Units", "N − 1", "Status" };
	static const char *const unit[] = { "", "shifted °C", "shifted °C", "",
		"", "", "" };
	static const int num[] = { 0, 1, 1, 1, 1, 1, 0 };
	const hl_match_result *m = r->d->mr;
	char v[B];
	size_t i;

	hl_report_table_start(r, "data subnetworks", "Subnetworks between the "
			      "temperatures where no heat crosses, hottest "
			      "first.", 7, head, unit, num);
	for (i = 0; i < m->nsub; i++) {
		const hl_match_sub *s = &m->sub[i];

		hl_report_row_start(r, NULL);
		hl_report_cell(r, s->label);
		hl_report_cell_num(r, hl_report_fmt_fixed(v, B,
				   hl_show_t(s->top), 1));
		hl_report_cell_num(r, hl_report_fmt_fixed(v, B,
				   hl_show_t(s->bottom), 1));
		snprintf(v, B, "%zu", s->nparty);
		hl_report_cell_num(r, v);
		snprintf(v, B, "%zu", s->units);
		hl_report_cell_num(r, v);
		snprintf(v, B, "%zu", s->euler);
		hl_report_cell_num(r, v);
		hl_report_cell(r, s->optimal ? "proven fewest" : "best found");
		hl_report_row_end(r);
	}
	hl_report_table_end(r);
}

static void
match_table(hl_report *r)
{
	static const char *const head[] = { "#", "Hot side", "Cold side",
		"Duty", "Subnetwork", "Hot side works", "Cold side works" };
	static const char *const unit[] = { "", "", "", "kW", "", "°C", "°C" };
	static const int num[] = { 1, 0, 0, 1, 0, 1, 1 };
	const hl_match_result *m = r->d->mr;
	char v[B];
	size_t i;

	hl_report_table_start(r, "data matches", "The matches: each pair "
			      "exchanges the duty shown in one unit, over the "
			      "temperatures its heat leaves the hot side and "
			      "enters the cold side.", 7, head, unit, num);
	for (i = 0; i < m->nmatch; i++) {
		const hl_match *x = &m->match[i];

		hl_report_row_start(r, NULL);
		snprintf(v, B, "%zu", i + 1);
		hl_report_cell_num(r, v);
		hl_report_cell(r, m->party[x->hot].name);
		hl_report_cell(r, m->party[x->cold].name);
		hl_report_cell_num(r, hl_report_fmt_qty(v, B, hl_show_q(x->duty)));
		hl_report_cell(r, m->sub[x->sub].label);
		hl_report_range(v, B, x->hot_from, x->hot_to);
		hl_report_cell_num(r, v);
		hl_report_range(v, B, x->cold_from, x->cold_to);
		hl_report_cell_num(r, v);
		hl_report_row_end(r);
	}
	hl_report_table_end(r);
}

static void
rules(hl_report *r)
{
	const hl_match_result *m = r->d->mr;
	char text[512];
	size_t i;

	if (m->ncause == 0)
		return;
	hl_html_start(r->h, "ul", "rules");
	for (i = 0; i < m->ncause; i++) {
		const hl_match_cause *k = &m->cause[i];
		char a[B];

		if (k->rule >= 0)
			hl_matches_rule_text(r->d->c, k->rule, text,
					     sizeof text);
		else
			snprintf(text, sizeof text, "the plant-area policy");
		hl_html_start(r->h, "li", NULL);
		hl_html_textf(r->h, "%s: %zu pair%s, ", text, k->pairs,
			      k->pairs == 1 ? "" : "s");
		if (k->rise > 0.05)
			hl_html_textf(r->h, "adds %s of hot utility on its own",
				      hl_report_fmt_duty(a, B, k->rise));
		else
			hl_html_text(r->h, "costs no energy");
		hl_html_end(r->h);
	}
	hl_html_end(r->h);
}

static void
write_matches(hl_report *r)
{
	if (r->d->mr == NULL) {
		hl_report_missing(r, "No matches", r->d->mr_note);
		return;
	}
	summary(r);
	sub_table(r);
	match_table(r);
	rules(r);
	hl_report_note(r, "Each match becomes one exchanger when the network "
		       "is laid out on the streams; a match listed in two "
		       "subnetworks is two units, one on each side of a pinch. "
		       "Among the answers with the fewest units the duties are "
		       "those of least estimated area (expanded transshipment "
		       "MILP).");
}

const hl_report_section hl_report_sec_matches = {
	"matches", "Exchanger matches", present, write_matches
};
