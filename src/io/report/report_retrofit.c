/* report_retrofit.c - the retrofit proposals (rfit.h): the ranked list,
 * the best proposal's modifications and its grid diagram with the changes
 * ringed. */
#include <math.h>
#include <stdio.h>

#include "display.h"
#include "grid_svg.h"
#include "report_sec.h"

#define B 64

static int
present(const hl_report_data *d)
{
	return d->rfit != NULL || d->rfit_note != NULL;
}

static size_t
changes(const hl_rfit_proposal *p)
{
	size_t k, n = 0;

	for (k = 0; k < p->nmod; k++)
		n += !hl_rfit_kind_derived(p->mod[k].kind);
	return n;
}

static void
ranked(hl_report *r)
{
	static const char *const head[] = { "Rank", "Changes", "Investment",
		"Saving", "Payback", "Hot utility", "Constant-α promise" };
	static const char *const unit[] = { NULL, NULL, NULL, "per year",
		"years", "kW", "per year" };
	static const int num[] = { 1, 1, 1, 1, 1, 1, 1 };
	const hl_rfit *rf = r->d->rfit;
	char v[B];
	size_t i;

	hl_report_table_start(r, "data rfit", "Proposals ranked by saving "
			      "within the limits; the last column is what "
			      "the constant-α screening of the audit promises "
			      "at the same investment.", 7, head, unit, num);
	for (i = 0; i < rf->nproposal; i++) {
		const hl_rfit_proposal *p = &rf->p[i];

		hl_report_row_start(r, i == 0 ? "best" : NULL);
		hl_report_cell_num(r, hl_report_fmt_fixed(v, B, (double)i + 1,
		    0));
		hl_report_cell_num(r, hl_report_fmt_fixed(v, B,
		    (double)changes(p), 0));
		hl_report_cell_num(r, hl_report_fmt_sig(v, B, p->investment, 3,
		    0));
		hl_report_cell_num(r, hl_report_fmt_sig(v, B, p->saving, 3, 0));
		hl_report_cell_num(r, hl_report_fmt_fixed(v, B, p->payback, 2));
		hl_report_cell_num(r, hl_report_fmt_sig(v, B,
		    hl_show_q(p->hot_after), 3, 1));
		hl_report_cell_num(r, r->d->rfit_promise != NULL &&
		    !isnan(r->d->rfit_promise[i]) ? hl_report_fmt_sig(v, B,
		    r->d->rfit_promise[i], 3, 0) : "");
		hl_report_row_end(r);
	}
	hl_report_table_end(r);
}

static void
modifications(hl_report *r, const hl_rfit_proposal *p)
{
	static const char *const head[] = { "Kind", "Unit", "From", "To",
		"Area added", "Shells", "Cost" };
	static const char *const unit[] = { NULL, NULL, NULL, NULL, "m²",
		NULL, NULL };
	static const int num[] = { 0, 0, 0, 0, 1, 1, 1 };
	char v[B];
	size_t k;

	hl_report_table_start(r, "data rfit-mods", "The best proposal's "
			      "modifications: places as stream #stage; cost "
			      "the shells bought by the cost law of the unit's type "
			      "(a fired heater's: the heaters bought for the "
			      "firing beyond its rating, by its law on duty) plus "
			      "the fixed cost of a re-pipe or a new unit.", 7,
			      head, unit, num);
	for (k = 0; k < p->nmod; k++) {
		const hl_rfit_mod *m = &p->mod[k];

		hl_report_row_start(r, NULL);
		hl_report_cell(r, hl_rfit_kind_name(m->kind));
		hl_report_cell(r, m->unit);
		hl_report_cell(r, m->from);
		hl_report_cell(r, m->to);
		hl_report_cell_num(r, m->area_added > 0.0 ?
		    hl_report_fmt_fixed(v, B, hl_show_a(m->area_added), 1) :
		    "");
		hl_report_cell_num(r, hl_report_fmt_fixed(v, B,
		    (double)m->shells_added, 0));
		hl_report_cell_num(r, hl_report_fmt_sig(v, B, m->cost, 3, 0));
		hl_report_row_end(r);
	}
	hl_report_table_end(r);
}

static void
grid(hl_report *r, const hl_rfit_proposal *p)
{
	hl_grid_opts go = { .title = "Best retrofit proposal" };
	char id[32];

	hl_report_figure_open(r, id, sizeof id);
	if (!hl_html_failed(r->h) && hl_grid_svg_write_into(p->net, &go,
	    hl_html_writer(r->h), NULL) != HL_OK)
		hl_html_fail(r->h);
	hl_report_figure_close(r, "The plant after the best proposal: new "
			       "units, units with added area and re-piped "
			       "units are ringed.");
}

static void
write_rfit(hl_report *r)
{
	const hl_rfit *rf = r->d->rfit;
	const char *cur = hl_report_currency(r->d->c);
	char a[B], b[B], c[B], e[B], f[B];

	if (rf == NULL) {
		hl_report_missing(r, "No retrofit proposals", r->d->rfit_note);
		return;
	}
	hl_html_start(r->h, "p", NULL);
	hl_html_textf(r->h, "Concrete modifications to today's plant, each "
		      "simulated with the rating model (every unit rated by "
		      "ε-NTU at its area and shells, heaters and coolers "
		      "making up the rest), priced and checked: %zu "
		      "proposals within a simple payback of %s years and at "
		      "most %d changes; %zu candidates simulated.",
		      rf->nproposal, hl_report_fmt_fixed(a, B,
		      r->d->rfit_payback, 1), r->d->rfit_changes,
		      rf->evaluated);
	hl_html_end(r->h);
	if (rf->timed_out)
		hl_report_para(r, "The search stopped at its time limit: a "
			       "longer --time-limit may find more.");
	if (rf->nproposal == 0) {
		hl_report_para(r, "No modification pays back within these "
			       "limits.");
		return;
	}
	hl_html_start(r->h, "p", NULL);
	hl_html_textf(r->h, "The best saves %s for %s (payback %s years), "
		      "taking hot utility from %s to %s.",
		      hl_report_fmt_money(a, B, rf->p[0].saving, cur, 1),
		      hl_report_fmt_money(b, B, rf->p[0].investment, cur, 0),
		      hl_report_fmt_fixed(c, B, rf->p[0].payback, 2),
		      hl_report_fmt_duty(e, B, rf->p[0].hot_before),
		      hl_report_fmt_duty(f, B, rf->p[0].hot_after));
	hl_html_end(r->h);
	ranked(r);
	modifications(r, &rf->p[0]);
	grid(r, &rf->p[0]);
	hl_report_note(r, r->d->rfit_costs_given ? "Fixed costs of a re-pipe "
		       "and a new unit from the case." : "Fixed costs of a "
		       "re-pipe (20 000) and a new unit (30 000) are "
		       "illustrative defaults: set the case's <cost repipe "
		       "new-unit>.");
	hl_report_note(r, "Pressure drop, velocities and fouling of changed "
		       "units, layout and the safety of each new match are "
		       "for a detailed study.");
}

const hl_report_section hl_report_sec_retrofit = {
	"retrofit", "Retrofit proposals", present, write_rfit
};
