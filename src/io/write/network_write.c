/* network_write.c - writers of a designed network (network_write.h). */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "display.h"
#include "network_write.h"
#include "text_out.h"
#include "utf8.h"
#include "profile.h"
#include "result_xml.h"

/* Short tag of a type after the shell count in the text table. */
static const char *
type_tag(hl_exchanger_type t)
{
	static const char *const tag[HL_EXCH_NTYPES] = {
		"", " CF", " PL", " DP", " AC", " FH"
	};

	return (int)t >= 0 && t < HL_EXCH_NTYPES ? tag[t] : "";
}

#define NCOL 16
#define CELL 96

static const char *const head[2][NCOL] = {
	{ "unit", "hot", "cold", "duty", "hot in", "hot out", "cold in",
	  "cold out", "hot", "cold", "U", "LMTD", "F", "shells", "area",
	  "cost" },
	{ "", "", "", "kW", "°C", "°C", "°C", "°C", "share", "share",
	  "kW/(m²K)", "K", "", "", "m²", "" }
};

/* The quantity of each column, for display units other than SI. */
static const hl_qty head_qty[NCOL] = {
	HL_QTY_NONE, HL_QTY_NONE, HL_QTY_NONE, HL_QTY_POWER, HL_QTY_TEMP,
	HL_QTY_TEMP, HL_QTY_TEMP, HL_QTY_TEMP, HL_QTY_NONE, HL_QTY_NONE,
	HL_QTY_HTC, HL_QTY_DTEMP, HL_QTY_NONE, HL_QTY_NONE, HL_QTY_AREA,
	HL_QTY_NONE
};

static const char *
head_text(size_t k, size_t j)
{
	if (k == 0 || hl_display_get() == HL_UNITS_SI ||
	    head_qty[j] == HL_QTY_NONE)
		return head[k][j];
	return hl_show_unit(head_qty[j]);
}

static void
cells(const hl_network *net, const hl_network_unit *u, char c[NCOL][CELL])
{
	snprintf(c[0], CELL, "%s", u->id);
	snprintf(c[1], CELL, "%s", net->party[u->hot].name);
	snprintf(c[2], CELL, "%s", net->party[u->cold].name);
	snprintf(c[3], CELL, "%.*f", HL_DIG_Q(1), hl_show_q(u->duty));
	snprintf(c[4], CELL, "%.1f", hl_show_t(u->hot_in));
	snprintf(c[5], CELL, "%.1f", hl_show_t(u->hot_out));
	snprintf(c[6], CELL, "%.1f", hl_show_t(u->cold_in));
	snprintf(c[7], CELL, "%.1f", hl_show_t(u->cold_out));
	snprintf(c[8], CELL, "%.3f", u->hot_share);
	snprintf(c[9], CELL, "%.3f", u->cold_share);
	snprintf(c[10], CELL, "%.*f%s", HL_DIG_H(3), hl_show_h(u->u),
	    u->assumed ? "*" : "");
	snprintf(c[11], CELL, "%.2f", hl_show_dt(u->lmtd));
	snprintf(c[12], CELL, "%.3f", u->ft);
	if (u->parallel > 1)
		snprintf(c[13], CELL, "%d×%d%s", u->shells, u->parallel,
		    type_tag(u->type));
	else
		snprintf(c[13], CELL, "%d%s", u->shells, type_tag(u->type));
	if (u->type == HL_EXCH_FIRED_HEATER)
		snprintf(c[14], CELL, "by duty");
	else
		snprintf(c[14], CELL, "%.2f", hl_show_a(u->area));
	snprintf(c[15], CELL, "%.0f", u->cost);
}

/* One line of the table: text columns left, numbers right; no blanks at
 * the end. */
static void
row(FILE *fp, char c[NCOL][CELL], const size_t *w)
{
	char line[NCOL * (CELL + 2) + 1];
	size_t i, n = 0, end;

	for (i = 0; i < NCOL; i++) {
		size_t pad = w[i] - hl_utf8_chars(c[i]), k;
		int left = i < 3;

		if (i > 0)
			n += (size_t)snprintf(line + n, sizeof line - n, "  ");
		for (k = 0; !left && k < pad; k++)
			line[n++] = ' ';
		n += (size_t)snprintf(line + n, sizeof line - n, "%s", c[i]);
		for (k = 0; left && k < pad; k++)
			line[n++] = ' ';
	}
	line[n] = '\0';
	for (end = n; end > 0 && line[end - 1] == ' '; end--)
		;
	line[end] = '\0';
	fprintf(fp, "%s\n", line);
}

static void
text_table(FILE *fp, const hl_network *net)
{
	char c[NCOL][CELL];
	size_t w[NCOL], i, k;

	for (k = 0; k < NCOL; k++) {
		size_t top = hl_utf8_chars(head[0][k]);
		size_t unit = hl_utf8_chars(head_text(1, k));

		w[k] = top > unit ? top : unit;
	}
	for (i = 0; i < net->nunit; i++) {
		cells(net, &net->unit[i], c);
		for (k = 0; k < NCOL; k++)
			if (hl_utf8_chars(c[k]) > w[k])
				w[k] = hl_utf8_chars(c[k]);
	}
	for (k = 0; k < 2; k++) {
		char h[NCOL][CELL];
		size_t j;

		for (j = 0; j < NCOL; j++)
			snprintf(h[j], CELL, "%s", head_text(k, j));
		row(fp, h, w);
	}
	for (i = 0; i < net->nunit; i++) {
		cells(net, &net->unit[i], c);
		row(fp, c, w);
	}
}

/* "C1  20.0 → E5 → 35.0 → [E1 0.57 | E2 0.43] → 80.0": the stages of a
 * process stream from its supply end. */
static void
text_chain(FILE *fp, const hl_network *net, size_t p)
{
	const hl_network_party *s = &net->party[p];
	char buf[2048];
	size_t n, i;
	int stage, last = 0;

	for (i = 0; i < net->nunit; i++) {
		const hl_network_unit *u = &net->unit[i];
		int g = u->hot == p ? u->hot_stage : u->cold == p ?
		    u->cold_stage : 0;

		if (g > last)
			last = g;
	}
	n = (size_t)snprintf(buf, sizeof buf, "%.1f", hl_show_t(s->supply));
	for (stage = 1; stage <= last && n < sizeof buf; stage++) {
		size_t count = 0;
		double out = s->supply;

		for (i = 0; i < net->nunit; i++) {
			const hl_network_unit *u = &net->unit[i];

			if ((u->hot == p ? u->hot_stage : u->cold == p ?
			    u->cold_stage : 0) == stage)
				count++;
		}
		n += (size_t)snprintf(buf + n, sizeof buf - n, " → %s",
		    count > 1 ? "[" : "");
		for (i = 0, count = 0; i < net->nunit && n < sizeof buf; i++) {
			const hl_network_unit *u = &net->unit[i];
			int hot = u->hot == p;
			double share = hot ? u->hot_share : u->cold_share;

			if ((hot ? u->hot_stage : u->cold == p ? u->cold_stage :
			    0) != stage)
				continue;
			if (share < 1.0)
				n += (size_t)snprintf(buf + n, sizeof buf - n,
				    "%s%s %.2f", count ? " | " : "", u->id,
				    share);
			else
				n += (size_t)snprintf(buf + n, sizeof buf - n,
				    "%s", u->id);
			out = hot ? u->hot_out : u->cold_out;
			count++;
		}
		/* After a split the branches mix: show the mixed outlet. */
		if (count > 1) {
			double q = 0.0;

			if (n < sizeof buf)
				n += (size_t)snprintf(buf + n, sizeof buf - n,
				    "]");
			for (i = 0; i < net->nunit; i++) {
				const hl_network_unit *u = &net->unit[i];

				if ((u->hot == p ? u->hot_stage : u->cold == p ?
				    u->cold_stage : 0) <= stage &&
				    (u->hot == p || u->cold == p))
					q += u->duty;
			}
			out = hl_profile_temp(s->seg, s->nseg, s->kind, q);
		}
		if (n < sizeof buf && !isnan(out))
			n += (size_t)snprintf(buf + n, sizeof buf - n,
			    " → %.1f", hl_show_t(out));
	}
	fprintf(fp, "  %s (%s): ", s->name, s->kind == HL_HOT ? "hot" :
	    "cold");
	hl_text_wrap(fp, buf, "", "      ", 72);
}

static void
text_summary(FILE *fp, const hl_network *net)
{
	const hl_settings *set = &net->set;
	double emat = isnan(set->emat) ? set->dtmin : set->emat;
	const char *cur = set->currency != NULL ? set->currency : "";

	fprintf(fp, "Heat exchanger network: %s\n\n", net->source != NULL ?
	    net->source : "");
	fprintf(fp, "ΔTmin %.1f %s, EMAT %.1f %s; ", hl_show_dt(set->dtmin),
	    HL_SYM_DT, hl_show_dt(emat), HL_SYM_DT);
	if (set->exchanger == HL_EXCH_SHELL_TUBE)
		fprintf(fp, "shell-and-tube units, F floor %.2f, Xp %.2f\n",
		    set->fmin, set->xp);
	else
		fprintf(fp, "%s units%s\n", hl_exchanger_type_name(
		    set->exchanger), set->exchanger == HL_EXCH_AIR_COOLER ?
		    "" : " (F = 1)");
	fprintf(fp, "Hot utility        %10.*f %s (target %.*f %s)\n",
	    HL_DIG_Q(1), hl_show_q(net->qh), HL_SYM_Q, HL_DIG_Q(1),
	    hl_show_q(net->qh_target), HL_SYM_Q);
	fprintf(fp, "Cold utility       %10.*f %s (target %.*f %s)\n",
	    HL_DIG_Q(1), hl_show_q(net->qc), HL_SYM_Q, HL_DIG_Q(1),
	    hl_show_q(net->qc_target), HL_SYM_Q);
	if (net->range_rise > 0.0 && hl_network_has_credit(net))
		fprintf(fp, "Utility choice adds %9.*f %s to each (hot utility "
		    "bought frees process heat for a credit, or a utility's "
		    "range crosses the pinch)\n", HL_DIG_Q(1),
		    hl_show_q(net->range_rise), HL_SYM_Q);
	else if (net->range_rise > 0.0)
		fprintf(fp, "Utility ranges add %10.*f %s to each (a hot "
		    "utility's range ends below the pinch)\n", HL_DIG_Q(1),
		    hl_show_q(net->range_rise), HL_SYM_Q);
	if (net->restriction > 0.0)
		fprintf(fp, "Match rules add    %10.*f %s to each\n",
		    HL_DIG_Q(1), hl_show_q(net->restriction), HL_SYM_Q);
	/* The placement explains its rise in notes (a sliver, the heat of
	 * matches left out as idle, shows its digits); a least-cost network
	 * has none: its rise is energy bought instead of area and units. */
	if (net->penalty > 0.0 && net->nnote > 0)
		fprintf(fp, "Placement adds     %10.*f %s to each (see the "
		    "notes)\n", HL_DIG_Q(net->penalty < 0.05 ? 3 : 1),
		    hl_show_q(net->penalty), HL_SYM_Q);
	else if (net->penalty > 0.0)
		fprintf(fp, "Energy traded      %10.*f %s more of each (cheaper "
		    "than the area and units to save it)\n", HL_DIG_Q(1),
		    hl_show_q(net->penalty), HL_SYM_Q);
	fprintf(fp, "Units              %10zu for %zu matches, %zu stream "
	    "split%s\n", net->nunit, net->nmatch, net->nsplit,
	    net->nsplit == 1 ? "" : "s");
	fprintf(fp, "Area               %10.1f %s\n", hl_show_a(net->area),
	    HL_SYM_A);
	fprintf(fp, "Capital            %10.0f %s (annualised %.0f %s/year, "
	    "CRF %.4f: %.3g %% over %.3g years)\n", net->capital, cur,
	    net->capital_annual, cur, net->crf, 100.0 * set->interest,
	    set->life);
	fprintf(fp, "Energy             %10.0f %s/year (%.0f h/year)\n",
	    net->energy_cost, cur, set->hours);
	fprintf(fp, "Total annual cost  %10.0f %s/year\n\n", net->total_cost,
	    cur);
}

static void
text_notes(FILE *fp, const hl_network *net)
{
	char buf[640];
	size_t i;
	int any = net->nnote > 0;

	for (i = 0; i < net->nunit; i++)
		any |= net->unit[i].note != NULL;
	if (!any)
		return;
	fprintf(fp, "\nNotes\n");
	for (i = 0; i < net->nnote; i++)
		hl_text_wrap(fp, net->note[i], "  ", "      ", 78);
	for (i = 0; i < net->nunit; i++)
		if (net->unit[i].note != NULL) {
			snprintf(buf, sizeof buf, "%s: %s", net->unit[i].id,
			    net->unit[i].note);
			hl_text_wrap(fp, buf, "  ", "      ", 78);
		}
}

/* Which parties lent h_default to the U of some unit. */
/* The cost law of every type the network uses. */
static void
text_laws(FILE *fp, const hl_network *net)
{
	char buf[400];
	int t;
	size_t i;

	for (i = 0; i < net->nunit; i++)
		if (net->unit[i].warn != 0) {
			char why[300];

			hl_network_unit_warning(net, &net->unit[i], why,
			    sizeof why);
			snprintf(buf, sizeof buf, "Warning: %s: %s",
			    net->unit[i].id, why);
			hl_text_wrap(fp, buf, "", "  ", 78);
		}
	fprintf(fp, "Cost laws:\n");
	for (t = 0; t < HL_EXCH_NTYPES; t++) {
		for (i = 0; i < net->nunit; i++)
			if ((int)net->unit[i].type == t)
				break;
		if (i == net->nunit)
			continue;
		hl_exchanger_law_text(&net->set, (hl_exchanger_type)t, buf,
		    sizeof buf);
		hl_text_wrap(fp, buf, "  ", "    ", 78);
	}
	for (i = 0; i < net->nparty; i++)
		if (net->party[i].utility && net->party[i].cost_given) {
			snprintf(buf, sizeof buf, "units on %s: %.6g + "
			    "%.6g·X^%.3g each (set by the case)",
			    net->party[i].name, net->party[i].cost_a,
			    net->party[i].cost_b, net->party[i].cost_c);
			hl_text_wrap(fp, buf, "  ", "    ", 78);
		}
}

static void
text_assumed(FILE *fp, const hl_network *net)
{
	char buf[1024];
	size_t i, j, n = 0;

	buf[0] = '\0';
	for (i = 0; i < net->nparty; i++) {
		int used = 0;

		for (j = 0; j < net->nunit && !used; j++) {
			const hl_network_unit *u = &net->unit[j];

			used = (u->hot == i && (u->assumed & HL_NETWORK_H_HOT)) ||
			    (u->cold == i && (u->assumed & HL_NETWORK_H_COLD));
		}
		if (used && n < sizeof buf)
			n += (size_t)snprintf(buf + n, sizeof buf - n, "%s%s",
			    n ? ", " : "", net->party[i].name);
	}
	fprintf(fp, "\n");
	if (n > 0) {
		char line[1200];

		snprintf(line, sizeof line, "* U assumes h = %.3g %s "
		    "(the setting h_default) for: %s. Give each stream its "
		    "h (film coefficient with fouling) for a better "
		    "estimate.", hl_show_h(net->set.h_default),
		    hl_display_get() == HL_UNITS_SI ? "kW/(m²K)" : HL_SYM_H,
		    buf);
		hl_text_wrap(fp, line, "", "  ", 78);
	}
	text_laws(fp, net);
	snprintf(buf, sizeof buf, "Shells: in series the fewest with F at or "
	    "above the floor and each shell's P within Xp of its maximum "
	    "(Ahmad, Linnhoff & Smith 1988); s×p: s in series, p such trains "
	    "in parallel where one shell would pass the largest. Tags: CF "
	    "counterflow, PL plate, DP double pipe (hairpins), AC air cooler "
	    "(crossflow sections), FH fired heater (sized by duty). Shares: "
	    "the fraction of a stream's flow through the unit (1 unless the "
	    "stream is split).");
	hl_text_wrap(fp, buf, "", "", 78);
}

void
hl_network_text(FILE *fp, const hl_network *net, const char *caution)
{
	size_t i;

	text_summary(fp, net);
	text_table(fp, net);
	fprintf(fp, "\nStreams, stage by stage from the supply end (%s)\n",
	    HL_SYM_T);
	for (i = 0; i < net->nparty; i++)
		if (!net->party[i].utility)
			text_chain(fp, net, i);
	text_notes(fp, net);
	text_assumed(fp, net);
	if (caution != NULL) {
		fputc('\n', fp);
		hl_text_wrap(fp, caution, "", "", 78);
	}
}

static int
xml_opt(xmlTextWriterPtr w, const char *name, double v)
{
	return isnan(v) ? 0 : hl_xml_num(w, name, v);
}

static int
xml_party(xmlTextWriterPtr w, const hl_network_party *p)
{
	int rc = 0;
	size_t k;

	rc |= xmlTextWriterStartElement(w, BAD_CAST(p->utility ? "utility" :
	    "stream"));
	rc |= hl_xml_str(w, "name", p->name);
	rc |= hl_xml_str(w, "kind", p->kind == HL_HOT ? "hot" : "cold");
	rc |= hl_xml_num(w, "supply", p->supply);
	rc |= hl_xml_num(w, "target", p->target);
	if (p->utility) {
		rc |= hl_xml_num(w, "load", p->load);
		rc |= xml_opt(w, "price", p->price);
		rc |= xml_opt(w, "h", p->h);
		rc |= xml_opt(w, "max-load", p->max_load);
	} else if (p->nseg == 1) {
		rc |= hl_xml_num(w, "cp", p->seg[0].cp);
		rc |= xml_opt(w, "h", p->seg[0].h);
	}
	rc |= xml_opt(w, "dt-contrib", p->dt_contrib);
	if (p->utility && p->implicit)
		rc |= hl_xml_str(w, "implicit", "yes");
	if (p->utility && p->type_given)
		rc |= hl_xml_str(w, "type",
		    hl_exchanger_type_name((hl_exchanger_type)p->type));
	if (p->utility && p->cost_given) {
		rc |= hl_xml_num(w, "cost-a", p->cost_a);
		rc |= hl_xml_num(w, "cost-b", p->cost_b);
		rc |= hl_xml_num(w, "cost-c", p->cost_c);
	}
	for (k = 0; !p->utility && p->nseg > 1 && k < p->nseg; k++) {
		rc |= xmlTextWriterStartElement(w, BAD_CAST "segment");
		rc |= hl_xml_num(w, "supply", p->seg[k].supply);
		rc |= hl_xml_num(w, "target", p->seg[k].target);
		rc |= hl_xml_num(w, "cp", p->seg[k].cp);
		rc |= xml_opt(w, "h", p->seg[k].h);
		rc |= xmlTextWriterEndElement(w);
	}
	rc |= xmlTextWriterEndElement(w);
	return rc;
}

static int
xml_unit(xmlTextWriterPtr w, const hl_network *net, const hl_network_unit *u)
{
	int rc = 0;

	rc |= xmlTextWriterStartElement(w, BAD_CAST "exchanger");
	rc |= hl_xml_str(w, "id", u->id);
	rc |= hl_xml_str(w, "hot", net->party[u->hot].name);
	rc |= hl_xml_str(w, "cold", net->party[u->cold].name);
	rc |= hl_xml_str(w, "type", hl_exchanger_type_name(u->type));
	rc |= hl_xml_num(w, "duty", u->duty);
	rc |= hl_xml_num(w, "hot-in", u->hot_in);
	rc |= hl_xml_num(w, "hot-out", u->hot_out);
	rc |= hl_xml_num(w, "cold-in", u->cold_in);
	rc |= hl_xml_num(w, "cold-out", u->cold_out);
	rc |= hl_xml_num(w, "hot-share", u->hot_share);
	rc |= hl_xml_num(w, "cold-share", u->cold_share);
	rc |= hl_xml_num(w, "u", u->u);
	rc |= hl_xml_num(w, "lmtd", u->lmtd);
	rc |= hl_xml_num(w, "ft", u->ft);
	rc |= hl_xml_int(w, "shells", u->shells);
	if (u->parallel > 1)
		rc |= hl_xml_int(w, "parallel", u->parallel);
	rc |= hl_xml_num(w, "area", u->area);
	rc |= hl_xml_num(w, "area-shell", u->area_shell);
	rc |= hl_xml_num(w, "cost", u->cost);
	if (u->warn != 0) {
		char why[400];

		hl_network_unit_warning(net, u, why, sizeof why);
		rc |= hl_xml_str(w, "warning", why);
	}
	if (u->hot_stage > 0)
		rc |= hl_xml_int(w, "hot-stage", u->hot_stage);
	if (u->cold_stage > 0)
		rc |= hl_xml_int(w, "cold-stage", u->cold_stage);
	rc |= hl_xml_num(w, "approach", u->approach);
	rc |= hl_xml_num(w, "required", u->required);
	if (u->match >= 0)
		rc |= hl_xml_int(w, "match", u->match + 1);
	if (u->assumed != 0)
		rc |= hl_xml_str(w, "assumed", u->assumed ==
		    (HL_NETWORK_H_HOT | HL_NETWORK_H_COLD) ? "h-hot h-cold" :
		    u->assumed == HL_NETWORK_H_HOT ? "h-hot" : "h-cold");
	if (u->note != NULL)
		rc |= hl_xml_str(w, "note", u->note);
	if (u->held) {
		if (u->reuses[0] != '\0') {
			rc |= hl_xml_str(w, "reuses", u->reuses);
			rc |= hl_xml_num(w, "area-today", u->area_today);
		}
		rc |= hl_xml_num(w, "area-added", u->area_added);
		rc |= hl_xml_int(w, "shells-added", u->shells_added);
		if (u->type == HL_EXCH_FIRED_HEATER) {
			if (u->reuses[0] != '\0')
				rc |= hl_xml_num(w, "duty-today",
				    u->duty_today);
			rc |= hl_xml_num(w, "duty-added", u->duty_added);
		}
	}
	rc |= xmlTextWriterEndElement(w);
	return rc;
}

/* The law of type t as used (for `check` to price the units again). */
static int
xml_law(xmlTextWriterPtr w, const hl_settings *set, hl_exchanger_type t)
{
	double a, b, c;
	int rc = 0;

	hl_exchanger_law_of(set, t, &a, &b, &c);
	rc |= xmlTextWriterStartElement(w, BAD_CAST "law");
	rc |= hl_xml_str(w, "type", hl_exchanger_type_name(t));
	rc |= hl_xml_num(w, "a", a);
	rc |= hl_xml_num(w, "b", b);
	rc |= hl_xml_num(w, "c", c);
	rc |= hl_xml_str(w, "x", t == HL_EXCH_FIRED_HEATER ? "duty" : "area");
	if (isfinite(set->law[t].largest))
		rc |= hl_xml_num(w, "largest", set->law[t].largest);
	rc |= hl_xml_num(w, "smallest", set->law[t].smallest);
	rc |= hl_xml_str(w, "source", hl_exchanger_law_illustrative(set, t) ?
	    "illustrative" : "case");
	rc |= xmlTextWriterEndElement(w);
	return rc;
}

int
hl_network_xml(xmlTextWriterPtr w, const hl_network *net)
{
	const hl_settings *set = &net->set;
	size_t i;
	int rc = 0, t;

	rc |= xmlTextWriterStartElement(w, BAD_CAST "network");
	rc |= hl_xml_num(w, "dtmin", set->dtmin);
	rc |= hl_xml_num(w, "emat", isnan(set->emat) ? set->dtmin : set->emat);
	rc |= hl_xml_str(w, "exchanger", hl_exchanger_type_name(set->exchanger));
	rc |= hl_xml_num(w, "fmin", set->fmin);
	rc |= hl_xml_num(w, "xp", set->xp);
	rc |= hl_xml_num(w, "h-default", set->h_default);
	rc |= hl_xml_num(w, "cost-a", set->cost_a);
	rc |= hl_xml_num(w, "cost-b", set->cost_b);
	rc |= hl_xml_num(w, "cost-c", set->cost_c);
	rc |= hl_xml_num(w, "interest", set->interest);
	rc |= hl_xml_num(w, "life", set->life);
	rc |= hl_xml_num(w, "hours", set->hours);
	if (set->currency != NULL)
		rc |= hl_xml_str(w, "currency", set->currency);
	rc |= hl_xml_num(w, "hot-target", net->qh_target);
	rc |= hl_xml_num(w, "cold-target", net->qc_target);
	rc |= hl_xml_num(w, "hot-utility", net->qh);
	rc |= hl_xml_num(w, "cold-utility", net->qc);
	rc |= hl_xml_num(w, "rule-penalty", net->restriction);
	rc |= hl_xml_num(w, "energy-penalty", net->penalty);
	if (net->range_rise > 0.0)
		rc |= hl_xml_num(w, "range-rise", net->range_rise);
	rc |= hl_xml_int(w, "matches", (long)net->nmatch);
	rc |= hl_xml_int(w, "units", (long)net->nunit);
	rc |= hl_xml_int(w, "splits", (long)net->nsplit);
	rc |= hl_xml_num(w, "area", net->area);
	rc |= hl_xml_num(w, "capital-cost", net->capital);
	rc |= hl_xml_num(w, "crf", net->crf);
	rc |= hl_xml_num(w, "annual-capital-cost", net->capital_annual);
	rc |= hl_xml_num(w, "energy-cost", net->energy_cost);
	rc |= hl_xml_num(w, "total-cost", net->total_cost);
	for (t = 0; t < HL_EXCH_NTYPES && rc >= 0; t++)
		rc |= xml_law(w, set, (hl_exchanger_type)t);
	for (i = 0; i < net->nparty && rc >= 0; i++)
		if (!net->party[i].utility)
			rc |= xml_party(w, &net->party[i]);
	for (i = 0; i < net->nparty && rc >= 0; i++)
		if (net->party[i].utility)
			rc |= xml_party(w, &net->party[i]);
	for (i = 0; i < net->nunit && rc >= 0; i++)
		rc |= xml_unit(w, net, &net->unit[i]);
	for (i = 0; i < net->nnote && rc >= 0; i++)
		rc |= xmlTextWriterWriteElement(w, BAD_CAST "note",
		    BAD_CAST net->note[i]);
	rc |= xmlTextWriterEndElement(w);
	return rc < 0 ? -1 : 0;
}

void
hl_network_csv(FILE *fp, const hl_network *net)
{
	static const char *const name[] = { "duty", "hot_in", "hot_out",
		"cold_in", "cold_out", "hot_share", "cold_share", "hot_stage",
		"cold_stage", "u", "lmtd", "f", "shells", "parallel", "area",
		"area_shell", "cost", "approach", "required" };
	static const hl_qty qty[] = { HL_QTY_POWER, HL_QTY_TEMP, HL_QTY_TEMP,
		HL_QTY_TEMP, HL_QTY_TEMP, HL_QTY_NONE, HL_QTY_NONE,
		HL_QTY_NONE, HL_QTY_NONE, HL_QTY_HTC, HL_QTY_DTEMP,
		HL_QTY_NONE, HL_QTY_NONE, HL_QTY_NONE, HL_QTY_AREA,
		HL_QTY_AREA, HL_QTY_NONE, HL_QTY_DTEMP, HL_QTY_DTEMP };
	char h[64];
	size_t i;

	fputs("id,hot,cold,type,", fp);
	for (i = 0; i < sizeof qty / sizeof qty[0]; i++)
		fprintf(fp, "%s,", hl_show_header(h, sizeof h, name[i],
						  qty[i]));
	fputs("assumed,note\n", fp);
	for (i = 0; i < net->nunit; i++) {
		const hl_network_unit *u = &net->unit[i];

		hl_csv_text(fp, u->id);
		fputc(',', fp);
		hl_csv_text(fp, net->party[u->hot].name);
		fputc(',', fp);
		hl_csv_text(fp, net->party[u->cold].name);
		fputc(',', fp);
		hl_csv_text(fp, hl_exchanger_type_name(u->type));
		hl_csv_num(fp, hl_show_q(u->duty));
		hl_csv_num(fp, hl_show_t(u->hot_in));
		hl_csv_num(fp, hl_show_t(u->hot_out));
		hl_csv_num(fp, hl_show_t(u->cold_in));
		hl_csv_num(fp, hl_show_t(u->cold_out));
		hl_csv_num(fp, u->hot_share);
		hl_csv_num(fp, u->cold_share);
		hl_csv_num(fp, u->hot_stage > 0 ? u->hot_stage : NAN);
		hl_csv_num(fp, u->cold_stage > 0 ? u->cold_stage : NAN);
		hl_csv_num(fp, hl_show_h(u->u));
		hl_csv_num(fp, hl_show_dt(u->lmtd));
		hl_csv_num(fp, u->ft);
		hl_csv_num(fp, u->shells);
		hl_csv_num(fp, u->parallel > 0 ? u->parallel : 1);
		hl_csv_num(fp, hl_show_a(u->area));
		hl_csv_num(fp, hl_show_a(u->area_shell));
		hl_csv_num(fp, u->cost);
		hl_csv_num(fp, hl_show_dt(u->approach));
		hl_csv_num(fp, hl_show_dt(u->required));
		fputc(',', fp);
		hl_csv_text(fp, u->assumed == 0 ? "" : u->assumed ==
		    (HL_NETWORK_H_HOT | HL_NETWORK_H_COLD) ? "h-hot h-cold" :
		    u->assumed == HL_NETWORK_H_HOT ? "h-hot" : "h-cold");
		fputc(',', fp);
		hl_csv_text(fp, u->note != NULL ? u->note : "");
		fputc('\n', fp);
	}
}
