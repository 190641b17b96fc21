/* retrofit_out.c - retrofit proposals for an engineer (text), for programs
 * (XML, with each proposal's network for `check`) and for spreadsheets. */
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "display.h"
#include "network_write.h"
#include "result_xml.h"
#include "retrofit_out.h"
#include "text_out.h"

static const char *
cur(const hl_case *c)
{
	return c->set.currency ? c->set.currency : "";
}

/* A quantity in the display units (display.h): width characters (0: as
 * wide as it is), the SI writer's decimals, its unit after a space. */
static void
show(FILE *fp, hl_qty q, double v, int width, int si_digits)
{
	fprintf(fp, "%*.*f %s", width, hl_show_digits(q, si_digits),
	    hl_show(q, v), hl_show_unit(q));
}

/* Heat rates and areas of the tables: wider where Btu/h and ft² are. */
static int
wide(int si_width)
{
	return hl_display_get() == HL_UNITS_US ? si_width + 3 : si_width;
}

static void
limits(FILE *fp, const hl_case *c, const hl_rfit_out *w)
{
	const hl_rfit_opts *o = w->o;

	fprintf(fp, "Limits: ");
	if (!isnan(o->payback))
		fprintf(fp, "simple payback at most %.3g years", o->payback);
	if (!isnan(o->payback) && !isnan(o->budget))
		fprintf(fp, ", ");
	if (!isnan(o->budget))
		fprintf(fp, "investment at most %.0f %s", o->budget, cur(c));
	fprintf(fp, "; at most %d change%s.\n", o->max_changes,
	    o->max_changes == 1 ? "" : "s");
	fprintf(fp, "Fixed costs: a re-pipe %.0f %s (%s), a new unit %.0f %s "
	    "on top of its shells (%s); area and shells by the law a + "
	    "b·A^c%s per shell of each unit's type, or of its utility where "
	    "that gives its own.\n", o->repipe_cost, cur(c), w->repipe_given ?
	    "from the case" : "illustrative default: set <cost repipe>",
	    o->unit_cost, cur(c), w->unit_given ? "from the case" :
	    "illustrative default: set <cost new-unit>",
	    hl_display_get() == HL_UNITS_US ? " (A in m², Q in MW, as the "
	    "laws are given)" : "");
}

static void
mod_text(FILE *fp, const hl_case *c, const hl_rfit_mod *m)
{
	fprintf(fp, "    %-18s %s", hl_rfit_kind_name(m->kind), m->unit);
	if (m->from[0] != '\0' && strcmp(m->from, m->to) != 0)
		fprintf(fp, ": %s ->", m->from);
	else if (m->to[0] != '\0')
		fprintf(fp, ":");
	if (m->to[0] != '\0')
		fprintf(fp, " %s", m->to);
	if (m->area_added > 0.0) {
		fprintf(fp, "; +");
		show(fp, HL_QTY_AREA, m->area_added, 0, 1);
		fprintf(fp, " in %d shell%s", m->shells_added,
		    m->shells_added == 1 ? "" : "s");
	}
	if (m->duty_added > 0.0) {
		fprintf(fp, "; +");
		show(fp, HL_QTY_POWER, m->duty_added, 0, 1);
		fprintf(fp, " of firing in %d heater%s", m->shells_added,
		    m->shells_added == 1 ? "" : "s");
	}
	fprintf(fp, "; %.0f %s\n", m->cost, cur(c));
}

static void
proposal_text(FILE *fp, const hl_case *c, const hl_rfit *r, size_t i,
	      const hl_rfit_out *w)
{
	const hl_rfit_proposal *p = &r->p[i];
	size_t k;

	fprintf(fp, "\nProposal %zu: saves %.0f %s a year for %.0f %s "
	    "(payback %.2f years)\n", i + 1, p->saving, cur(c),
	    p->investment, cur(c), p->payback);
	fprintf(fp, "  hot utility %.*f -> ", HL_DIG_Q(1),
	    hl_show_q(p->hot_before));
	show(fp, HL_QTY_POWER, p->hot_after, 0, 1);
	fprintf(fp, ", cold utility %.*f -> ", HL_DIG_Q(1),
	    hl_show_q(p->cold_before));
	show(fp, HL_QTY_POWER, p->cold_after, 0, 1);
	fprintf(fp, ", utility cost %.0f -> %.0f %s a year\n",
	    p->cost_before, p->cost_after, cur(c));
	if (w->screen != NULL && !isnan(w->screen[i]))
		fprintf(fp, "  the constant-α screening promises %.0f %s a "
		    "year at this investment (this proposal: %+.0f %%)\n",
		    w->screen[i], cur(c), w->screen[i] > 0.0 ?
		    100.0 * (p->saving / w->screen[i] - 1.0) : 0.0);
	if (w->screen != NULL && p->saving < w->screen[i]) {
		double fixed = 0.0;

		for (k = 0; k < p->nmod; k++)
			fixed += p->mod[k].kind == HL_RFIT_REPIPE ||
			    p->mod[k].kind == HL_RFIT_RESEQUENCE ||
			    p->mod[k].kind == HL_RFIT_ADD_SPLIT ||
			    p->mod[k].kind == HL_RFIT_DROP_SPLIT ?
			    w->o->repipe_cost : p->mod[k].kind ==
			    HL_RFIT_NEW_UNIT || p->mod[k].kind == HL_RFIT_TRIM ?
			    w->o->unit_cost : 0.0;
		fprintf(fp, "  (short of it: the screening knows no fixed "
		    "costs, %.0f %s here, no trims, and no limit on\n  "
		    "structure; this search adds no splits and keeps the "
		    "EMAT at every unit)\n", fixed, cur(c));
	}
	for (k = 0; k < p->nmod; k++)
		mod_text(fp, c, &p->mod[k]);
}

static void
changed_units(FILE *fp, const hl_rfit_proposal *p)
{
	size_t i;

	fprintf(fp, "  units after the change (area today + added = area "
	    "there; needed at the new duty; a fired heater: rated duty today "
	    "+ firing added):\n");
	for (i = 0; i < p->net->nunit; i++) {
		const hl_network_unit *u = &p->net->unit[i];
		int fired = u->type == HL_EXCH_FIRED_HEATER;
		hl_qty q = fired ? HL_QTY_POWER : HL_QTY_AREA;

		if (!(u->area_added > 0.0 || u->duty_added > 0.0))
			continue;
		fprintf(fp, "    %-6s ", u->id);
		hl_text_pad(fp, u->reuses[0] ? u->reuses : "(new)", 26);
		fprintf(fp, " ");
		show(fp, HL_QTY_POWER, u->duty, wide(8), 1);
		fprintf(fp, "  %*.*f + ", wide(7), hl_show_digits(q, 1),
		    hl_show(q, fired ? u->duty_today : u->area_today));
		show(fp, q, fired ? u->duty_added : u->area_added, wide(7), 1);
		if (fired) {
			fprintf(fp, " rated, %d heater%s bought\n",
			    u->shells_added, u->shells_added == 1 ? "" : "s");
			continue;
		}
		fprintf(fp, "; needs ");
		show(fp, HL_QTY_AREA, u->area, wide(7), 1);
		fprintf(fp, ", %d shell%s\n", u->shells,
		    u->shells == 1 ? "" : "s");
	}
}

void
hl_rfit_text(FILE *fp, const hl_case *c, const hl_rfit *r,
	     const hl_rfit_out *w, const char *caution)
{
	const hl_network *t = r->today;
	size_t i;

	fprintf(fp, "Retrofit proposals: %s%s%s\n\n", c->source ? c->source :
	    "(case)", w->network ? ", network " : "",
	    w->network ? w->network : "");
	fprintf(fp, "Today (simulated): hot utility ");
	show(fp, HL_QTY_POWER, t->qh, 0, 1);
	fprintf(fp, ", cold utility ");
	show(fp, HL_QTY_POWER, t->qc, 0, 1);
	fprintf(fp, ", utility cost %.0f %s a year; targets at ΔTmin %.3g "
	    "%s: %.*f / ", t->energy_cost, cur(c), hl_show_dt(t->set.dtmin),
	    HL_SYM_DT, HL_DIG_Q(1), hl_show_q(t->qh_target));
	show(fp, HL_QTY_POWER, t->qc_target, 0, 1);
	fprintf(fp, ".\n");
	fprintf(fp, "Approach kept by every unit (EMAT): %.3g %s",
	    hl_show_dt(r->emat), HL_SYM_DT);
	if (r->emat < r->emat_case * (1.0 - 1e-6))
		fprintf(fp, " (the case asks %.3g %s; today's plant already "
		    "runs closer)", hl_show_dt(r->emat_case), HL_SYM_DT);
	fprintf(fp, ".\n");
	limits(fp, c, w);
	fprintf(fp, "Search: %zu candidates simulated, %zu single changes "
	    "within the limits%s.\n", r->evaluated, r->singles, r->timed_out ?
	    "; stopped by the time limit (raise --time-limit)" : "");
	if (r->refused > 0)
		fprintf(fp, "%zu candidate%s left out: %s network failed the "
		    "check.\n", r->refused, r->refused == 1 ? "" : "s",
		    r->refused == 1 ? "its" : "their");
	if (r->nproposal == 0)
		fprintf(fp, "\nNo modification pays back within the limits.\n");
	else {
		char hot[32], cold[32];

		snprintf(hot, sizeof hot, "Hot %s", HL_SYM_Q);
		snprintf(cold, sizeof cold, "Cold %s", HL_SYM_Q);
		fprintf(fp, "\n%-5s %-7s %12s %12s %8s ", "Rank", "Changes",
		    "Investment", "Saving/yr", "Payback");
		hl_show_col(fp, hot, wide(10));
		fputc(' ', fp);
		hl_show_col(fp, cold, wide(10));
		fputc('\n', fp);
	}
	for (i = 0; i < r->nproposal; i++) {
		const hl_rfit_proposal *p = &r->p[i];
		size_t moves = 0, k;

		for (k = 0; k < p->nmod; k++)
			moves += !hl_rfit_kind_derived(p->mod[k].kind);
		fprintf(fp, "%-5zu %-7zu %12.0f %12.0f %8.2f %*.*f %*.*f\n",
		    i + 1, moves, p->investment, p->saving, p->payback,
		    wide(10), HL_DIG_Q(1), hl_show_q(p->hot_after), wide(10),
		    HL_DIG_Q(1), hl_show_q(p->cold_after));
	}
	for (i = 0; i < r->nproposal; i++) {
		proposal_text(fp, c, r, i, w);
		changed_units(fp, &r->p[i]);
	}
	fprintf(fp, "\nToday's areas are what the model needs for today's "
	    "duties (each unit's note gives its data-sheet area); units are "
	    "rated by ε-NTU at their area and shells; heaters and coolers "
	    "hold their set points. Film coefficients are held: velocity "
	    "changes, pressure drop and fouling of the changed units are not "
	    "in it.\n");
	if (caution != NULL)
		fprintf(fp, "\n%s\n", caution);
}

static int
xml_mod(xmlTextWriterPtr x, const hl_rfit_mod *m)
{
	int rc = xmlTextWriterStartElement(x, BAD_CAST "modification");

	rc |= hl_xml_str(x, "kind", hl_rfit_kind_name(m->kind));
	rc |= hl_xml_str(x, "unit", m->unit);
	if (m->from[0] != '\0')
		rc |= hl_xml_str(x, "from", m->from);
	if (m->to[0] != '\0')
		rc |= hl_xml_str(x, "to", m->to);
	rc |= hl_xml_num(x, "area-added", m->area_added);
	rc |= hl_xml_int(x, "shells-added", m->shells_added);
	if (m->duty_added > 0.0)
		rc |= hl_xml_num(x, "duty-added", m->duty_added);
	rc |= hl_xml_num(x, "cost", m->cost);
	rc |= xmlTextWriterEndElement(x);
	return rc;
}

static size_t
moves_of(const hl_rfit_proposal *p)
{
	size_t k, n = 0;

	for (k = 0; k < p->nmod; k++)
		n += !hl_rfit_kind_derived(p->mod[k].kind);
	return n;
}

static int
xml_proposal(xmlTextWriterPtr x, const hl_rfit *r, size_t i,
	     const hl_rfit_out *w)
{
	const hl_rfit_proposal *p = &r->p[i];
	int rc = xmlTextWriterStartElement(x, BAD_CAST "proposal");
	size_t k;

	rc |= hl_xml_int(x, "rank", (long)i + 1);
	rc |= hl_xml_num(x, "investment", p->investment);
	rc |= hl_xml_num(x, "saving", p->saving);
	rc |= hl_xml_num(x, "payback", p->payback);
	rc |= hl_xml_num(x, "hot-utility", p->hot_after);
	rc |= hl_xml_num(x, "cold-utility", p->cold_after);
	rc |= hl_xml_num(x, "utility-cost", p->cost_after);
	rc |= hl_xml_int(x, "changes", (long)moves_of(p));
	if (w->screen != NULL && !isnan(w->screen[i]))
		rc |= hl_xml_num(x, "screening-saving", w->screen[i]);
	for (k = 0; k < p->nmod; k++)
		rc |= xml_mod(x, &p->mod[k]);
	rc |= hl_network_xml(x, p->net);
	rc |= xmlTextWriterEndElement(x);
	return rc;
}

int
hl_rfit_xml(xmlTextWriterPtr x, const hl_rfit *r, const hl_rfit_out *w)
{
	const hl_rfit_opts *o = w->o;
	int rc = xmlTextWriterStartElement(x, BAD_CAST "retrofit");
	size_t i;

	rc |= hl_xml_num(x, "hot-utility", r->today->qh);
	rc |= hl_xml_num(x, "cold-utility", r->today->qc);
	rc |= hl_xml_num(x, "utility-cost", r->today->energy_cost);
	rc |= hl_xml_num(x, "emat", r->emat);
	rc |= hl_xml_num(x, "emat-case", r->emat_case);
	if (!isnan(o->payback))
		rc |= hl_xml_num(x, "payback-limit", o->payback);
	if (!isnan(o->budget))
		rc |= hl_xml_num(x, "budget", o->budget);
	rc |= hl_xml_int(x, "max-changes", o->max_changes);
	rc |= hl_xml_num(x, "repipe-cost", o->repipe_cost);
	rc |= hl_xml_num(x, "unit-cost", o->unit_cost);
	rc |= hl_xml_str(x, "fixed-costs", w->repipe_given && w->unit_given ?
	    "given" : "illustrative");
	rc |= hl_xml_int(x, "seed", (long)o->seed);
	rc |= hl_xml_int(x, "evaluated", (long)r->evaluated);
	rc |= hl_xml_int(x, "single-changes", (long)r->singles);
	rc |= hl_xml_str(x, "timed-out", r->timed_out ? "true" : "false");
	for (i = 0; i < r->nproposal && rc >= 0; i++)
		rc |= xml_proposal(x, r, i, w);
	rc |= xmlTextWriterEndElement(x);
	return rc;
}

void
hl_rfit_csv(FILE *fp, const hl_rfit *r, const hl_rfit_out *w)
{
	size_t i, k;
	char hu[64], cu[64], aa[64], da[64];

	fprintf(fp, "rank,investment,saving,payback,%s,%s,screening_saving,"
	    "kind,unit,from,to,%s,shells_added,cost,%s\n",
	    hl_show_header(hu, sizeof hu, "hot_utility", HL_QTY_POWER),
	    hl_show_header(cu, sizeof cu, "cold_utility", HL_QTY_POWER),
	    hl_show_header(aa, sizeof aa, "area_added", HL_QTY_AREA),
	    hl_show_header(da, sizeof da, "duty_added", HL_QTY_POWER));
	for (i = 0; i < r->nproposal; i++) {
		const hl_rfit_proposal *p = &r->p[i];

		for (k = 0; k < p->nmod; k++) {
			const hl_rfit_mod *m = &p->mod[k];

			fprintf(fp, "%zu", i + 1);
			hl_csv_num(fp, p->investment);
			hl_csv_num(fp, p->saving);
			hl_csv_num(fp, p->payback);
			hl_csv_num(fp, hl_show_q(p->hot_after));
			hl_csv_num(fp, hl_show_q(p->cold_after));
			hl_csv_num(fp, w->screen != NULL ? w->screen[i] : NAN);
			fprintf(fp, ",%s,", hl_rfit_kind_name(m->kind));
			hl_csv_text(fp, m->unit);
			fputc(',', fp);
			hl_csv_text(fp, m->from);
			fputc(',', fp);
			hl_csv_text(fp, m->to);
			hl_csv_num(fp, hl_show_a(m->area_added));
			fprintf(fp, ",%d", m->shells_added);
			hl_csv_num(fp, m->cost);
			hl_csv_num(fp, hl_show_q(m->duty_added));
			fputc('\n', fp);
		}
	}
}
