/* matches_out.c - writers of the matches stage. */
#include <math.h>
#include <string.h>

#include "display.h"
#include "matches_out.h"
#include "text_out.h"
#include "utf8.h"

static const char *
kind_name(hl_kind k)
{
	return k == HL_HOT ? "hot" : "cold";
}

static const char *
rule_kind(hl_rule_kind k)
{
	switch (k) {
	case HL_RULE_FORBID:
		return "forbid";
	case HL_RULE_REQUIRE:
		return "require";
	case HL_RULE_MAX_DUTY:
		return "max-duty";
	}
	return "rule";
}

void
hl_matches_rule_text(const hl_case *c, long rule, char *buf, size_t size)
{
	const hl_match_rule *r;
	char where[300] = "";

	if (rule < 0) {
		snprintf(buf, size, "%s matches across plant areas",
			 c->set.area_policy == HL_AREAS_FORBID ? "forbid" :
			 "penalise");
		return;
	}
	r = &c->rule[rule];
	if (r->file != NULL && r->line > 0)
		snprintf(where, sizeof where, " (%s:%ld%s%s)", r->file, r->line,
			 r->reason ? ": " : "", r->reason ? r->reason : "");
	else if (r->reason != NULL)
		snprintf(where, sizeof where, " (%s)", r->reason);
	if (r->kind == HL_RULE_MAX_DUTY)
		snprintf(buf, size, "at most %.*f %s %s-%s%s", HL_DIG_Q(1),
			 hl_show_q(r->max_duty), HL_SYM_Q, r->hot, r->cold,
			 where);
	else
		snprintf(buf, size, "%s %s-%s%s", rule_kind(r->kind), r->hot,
			 r->cold, where);
}

/* ---- text ---- */

/* s right-aligned (left = 0) or left-aligned in width characters. */
static void
pad(FILE *fp, const char *s, int width, int left)
{
	int n = width - (int)hl_utf8_chars(s);

	if (left)
		fputs(s, fp);
	while (n-- > 0)
		fputc(' ', fp);
	if (!left)
		fputs(s, fp);
}

static int
name_width(const hl_match_result *r, int side)
{
	size_t i;
	int w = side ? 4 : 3;

	for (i = 0; i < r->nmatch; i++) {
		const char *n = r->party[side ? r->match[i].cold :
					 r->match[i].hot].name;
		int l = (int)strlen(n);

		if (l > w)
			w = l;
	}
	return w > 40 ? 40 : w;
}

static void
text_status(FILE *fp, const hl_match_result *r)
{
	if (r->optimal)
		fprintf(fp, "Units                  %zu (proven optimal)\n",
			r->units);
	else
		fprintf(fp, "Units                  %zu (best found in the time "
			"limit; proven lower bound %zu, gap %.1f %%)\n", r->units,
			r->lower, 100.0 * r->gap);
	if (r->penalised)
		fprintf(fp, "Objective              %.4g (cross-area units "
			"counted at their penalty), lower bound %.4g\n",
			r->objective, r->bound);
	fprintf(fp, "Euler bound (N - 1)    %zu, summed over the subnetworks\n",
		r->euler);
}

static void
text_utilities(FILE *fp, const hl_case *c, const hl_match_result *r)
{
	size_t i;

	fprintf(fp, "Hot utility            %.*f %s\n", HL_DIG_Q(1),
		hl_show_q(r->qh), HL_SYM_Q);
	fprintf(fp, "Cold utility           %.*f %s\n", HL_DIG_Q(1),
		hl_show_q(r->qc), HL_SYM_Q);
	if (r->implicit_utilities)
		fprintf(fp, "                       (one hot utility above every "
			"stream and one cold utility below,\n"
			"                        at the problem-table targets%s)\n",
			c->nutil > 0 ? "; the case's utility\n"
			"                        levels are not apportioned here" :
			"");
	for (i = 0; i < r->nparty && !r->implicit_utilities; i++) {
		const hl_match_party *q = &r->party[i];

		if (q->type != HL_PARTY_UTILITY || q->load <= 0.0)
			continue;
		fprintf(fp, "  %-20s %s, %.*f %s\n", q->name,
			kind_name(q->kind), HL_DIG_Q(1), hl_show_q(q->load),
			HL_SYM_Q);
	}
}

static void
text_subs(FILE *fp, const hl_match_result *r)
{
	char h[32];
	size_t i;

	fprintf(fp, "\nSubnetworks (split where no heat crosses: process and "
		"utility pinches)\n\n");
	fprintf(fp, "  %-20s ", "region");
	snprintf(h, sizeof h, "shifted %s", HL_SYM_T);
	pad(fp, h, 17, 0);
	fprintf(fp, " %8s %6s %6s %6s  %-8s %8s\n", "streams", "units",
		"N - 1", "bound", "status", "time s");
	for (i = 0; i < r->nsub; i++) {
		const hl_match_sub *b = &r->sub[i];
		char range[40];

		snprintf(range, sizeof range, "%.1f to %.1f",
			 hl_show_t(b->top), hl_show_t(b->bottom));
		fprintf(fp, "  %-20s %17s %8zu %6zu %6zu %6zu  %-8s %8.2f\n",
			b->label, range, b->nparty, b->units, b->euler, b->lower,
			b->optimal ? "optimal" : "best", b->seconds);
	}
}

static void
text_matches(FILE *fp, const hl_match_result *r)
{
	int wh = name_width(r, 0), wc = name_width(r, 1);
	char h[3][32];
	size_t i;

	snprintf(h[0], sizeof h[0], "duty %s", HL_SYM_Q);
	snprintf(h[1], sizeof h[1], "hot %s", HL_SYM_T);
	snprintf(h[2], sizeof h[2], "cold %s", HL_SYM_T);
	fprintf(fp, "\nMatches (where each works: the temperature intervals of "
		"its heat, real %s)\n\n", HL_SYM_T);
	fprintf(fp, "  %-*s  %-*s %10s  %-20s ", wh, "hot", wc, "cold",
		h[0], "region");
	pad(fp, h[1], 17, 0);
	fputc(' ', fp);
	pad(fp, h[2], 17, 0);
	fputc('\n', fp);
	for (i = 0; i < r->nmatch; i++) {
		const hl_match *m = &r->match[i];
		char ht[40], ct[40];

		snprintf(ht, sizeof ht, "%.1f -> %.1f", hl_show_t(m->hot_from),
			 hl_show_t(m->hot_to));
		snprintf(ct, sizeof ct, "%.1f -> %.1f", hl_show_t(m->cold_from),
			 hl_show_t(m->cold_to));
		fprintf(fp, "  %-*.*s  %-*.*s %10.*f  %-20s %17s %17s%s%s\n", wh,
			wh, r->party[m->hot].name, wc, wc, r->party[m->cold].name,
			HL_DIG_Q(1), hl_show_q(m->duty), r->sub[m->sub].label, ht, ct,
			m->required ? "  required" : "",
			m->cross_area ? "  cross-area" : "");
	}
}

static void
text_rules(FILE *fp, const hl_case *c, const hl_match_result *r)
{
	size_t i;
	char buf[512];

	if (r->ncause == 0)
		return;
	fprintf(fp, "\nMatch rules\n\n");
	for (i = 0; i < r->ncause; i++) {
		const hl_match_cause *cs = &r->cause[i];

		hl_matches_rule_text(c, cs->rule, buf, sizeof buf);
		if (cs->pairs == 0)
			fprintf(fp, "  %s: applies to no pair that could exchange "
				"heat\n", buf);
		else if (r->restricted && cs->rise > 0.0)
			fprintf(fp, "  %s: %zu pair%s; without it the hot utility "
				"would be %.*f %s lower\n", buf, cs->pairs,
				cs->pairs == 1 ? "" : "s", HL_DIG_Q(1),
				hl_show_q(cs->rise), HL_SYM_Q);
		else
			fprintf(fp, "  %s: %zu pair%s\n", buf, cs->pairs,
				cs->pairs == 1 ? "" : "s");
	}
	if (!r->restricted)
		return;
	fprintf(fp, "\nThe match rules raise the utility targets: hot utility "
		"%.*f -> %.*f %s (+%.*f), cold utility %.*f -> %.*f %s "
		"(+%.*f).\n", HL_DIG_Q(1), hl_show_q(r->qh0), HL_DIG_Q(1),
		hl_show_q(r->qh), HL_SYM_Q, HL_DIG_Q(1),
		hl_show_q(r->qh - r->qh0), HL_DIG_Q(1), hl_show_q(r->qc0),
		HL_DIG_Q(1), hl_show_q(r->qc), HL_SYM_Q, HL_DIG_Q(1),
		hl_show_q(r->qc - r->qc0));
	fprintf(fp, "(Restricted-match targets; the rise of each rule is the "
		"target with it minus the\ntarget without it, so the shares "
		"need not add up.)\n");
}

static void
text_isolated(FILE *fp, const hl_match_result *r)
{
	size_t i;

	for (i = 0; i < r->nparty; i++) {
		const hl_match_party *q = &r->party[i];

		if (!q->isolated)
			continue;
		fprintf(fp, "\nNote: %s stream '%s' may not be matched with any "
			"%s process stream: its whole duty, %.*f %s, goes to "
			"utilities.\n", kind_name(q->kind), q->name,
			q->kind == HL_HOT ? "cold" : "hot", HL_DIG_Q(1),
			hl_show_q(q->load), HL_SYM_Q);
	}
}

/* Which of the splits between subnetworks are process pinches and which
 * utility pinches (the labels number them alike). */
static void
text_pinch_kinds(FILE *fp, const hl_match_result *r, const hl_cascade *cas)
{
	size_t s, k;

	if (cas == NULL || r->nsub < 2)
		return;
	for (s = 0; s + 1 < r->nsub; s++) {
		double t = r->sub[s].bottom;
		int proc = 0;

		for (k = 0; k < cas->npinch; k++)
			proc |= fabs(cas->t[cas->pinch[k]] - t) <= 1e-9 *
				(1.0 + fabs(t));
		fprintf(fp, "%s  pinch %zu at %.1f %s shifted: %s\n", s ? "" :
			"\n", s + 1, hl_show_t(t), HL_SYM_T, proc ?
			"process pinch" : "utility pinch (a utility level used "
			"to its limit there)");
	}
}

void
hl_matches_text(FILE *fp, const hl_case *c, const hl_match_result *r,
		double dtmin, const hl_cascade *cas)
{
	fprintf(fp, "Matches for %s (fewest units: transshipment MILP)\n\n",
		c->source ? c->source : "");
	fprintf(fp, "ΔTmin                  %.1f %s\n", hl_show_dt(dtmin),
		HL_SYM_DT);
	text_utilities(fp, c, r);
	text_status(fp, r);
	text_subs(fp, r);
	text_pinch_kinds(fp, r, cas);
	text_matches(fp, r);
	text_rules(fp, c, r);
	text_isolated(fp, r);
	fprintf(fp, "\nScreening estimates: the matches and duties are a "
		"starting point for design.\nDetailed design and the safety "
		"review of each match belong to qualified\nengineers under local "
		"codes.\n");
}

/* ---- XML ---- */

static int
xml_bool(xmlTextWriterPtr w, const char *name, int v)
{
	return hl_xml_str(w, name, v ? "true" : "false");
}

static int
xml_sub(xmlTextWriterPtr w, const hl_match_sub *b)
{
	int rc = 0;

	rc |= xmlTextWriterStartElement(w, BAD_CAST "subnetwork");
	rc |= hl_xml_str(w, "region", b->label);
	rc |= hl_xml_num(w, "top", b->top);
	rc |= hl_xml_num(w, "bottom", b->bottom);
	rc |= hl_xml_int(w, "streams", (long)b->nparty);
	rc |= hl_xml_int(w, "units", (long)b->units);
	rc |= hl_xml_int(w, "euler", (long)b->euler);
	rc |= hl_xml_int(w, "lower-bound", (long)b->lower);
	rc |= xml_bool(w, "optimal", b->optimal);
	rc |= hl_xml_num(w, "seconds", round(b->seconds * 1000.0) / 1000.0);
	rc |= xmlTextWriterEndElement(w);
	return rc;
}

static int
xml_match(xmlTextWriterPtr w, const hl_match_result *r, const hl_match *m)
{
	int rc = 0;

	rc |= xmlTextWriterStartElement(w, BAD_CAST "match");
	rc |= hl_xml_str(w, "hot", r->party[m->hot].name);
	rc |= hl_xml_str(w, "cold", r->party[m->cold].name);
	rc |= hl_xml_num(w, "duty", m->duty);
	rc |= hl_xml_str(w, "region", r->sub[m->sub].label);
	rc |= hl_xml_num(w, "hot-from", m->hot_from);
	rc |= hl_xml_num(w, "hot-to", m->hot_to);
	rc |= hl_xml_num(w, "cold-from", m->cold_from);
	rc |= hl_xml_num(w, "cold-to", m->cold_to);
	if (m->required)
		rc |= xml_bool(w, "required", 1);
	if (m->cross_area)
		rc |= xml_bool(w, "cross-area", 1);
	rc |= xmlTextWriterEndElement(w);
	return rc;
}

static int
xml_utilities(xmlTextWriterPtr w, const hl_match_result *r)
{
	size_t i;
	int rc = 0;

	for (i = 0; i < r->nparty; i++) {
		const hl_match_party *q = &r->party[i];

		if (q->type == HL_PARTY_STREAM)
			continue;
		rc |= xmlTextWriterStartElement(w, BAD_CAST "utility");
		rc |= hl_xml_str(w, "name", q->name);
		rc |= hl_xml_str(w, "kind", kind_name(q->kind));
		rc |= hl_xml_num(w, "load", q->load);
		rc |= hl_xml_num(w, "given-load", q->given_load);
		if (q->type == HL_PARTY_IMPLICIT)
			rc |= xml_bool(w, "implicit", 1);
		rc |= xmlTextWriterEndElement(w);
	}
	return rc;
}

static int
xml_rule(xmlTextWriterPtr w, const hl_case *c, const hl_match_result *r,
	 const hl_match_cause *cs)
{
	int rc = 0;

	rc |= xmlTextWriterStartElement(w, BAD_CAST "rule");
	if (cs->rule < 0) {
		rc |= hl_xml_str(w, "kind", c->set.area_policy ==
				 HL_AREAS_FORBID ? "forbid-areas" :
				 "penalise-areas");
	} else {
		const hl_match_rule *m = &c->rule[cs->rule];

		rc |= hl_xml_str(w, "kind", rule_kind(m->kind));
		rc |= hl_xml_str(w, "hot", m->hot);
		rc |= hl_xml_str(w, "cold", m->cold);
		if (m->kind == HL_RULE_MAX_DUTY)
			rc |= hl_xml_num(w, "max-duty", m->max_duty);
		if (m->file != NULL)
			rc |= hl_xml_str(w, "file", m->file);
		if (m->line > 0)
			rc |= hl_xml_int(w, "line", m->line);
		if (m->reason != NULL)
			rc |= hl_xml_str(w, "reason", m->reason);
	}
	rc |= hl_xml_int(w, "pairs", (long)cs->pairs);
	rc |= hl_xml_num(w, "hot-utility-rise", r->restricted ? cs->rise : 0.0);
	rc |= xmlTextWriterEndElement(w);
	return rc;
}

static int
xml_isolated(xmlTextWriterPtr w, const hl_match_result *r)
{
	size_t i;
	int rc = 0;

	for (i = 0; i < r->nparty; i++) {
		const hl_match_party *q = &r->party[i];

		if (!q->isolated)
			continue;
		rc |= xmlTextWriterStartElement(w, BAD_CAST "isolated");
		rc |= hl_xml_str(w, "stream", q->name);
		rc |= hl_xml_str(w, "kind", kind_name(q->kind));
		rc |= hl_xml_num(w, "utility-duty", q->utility_duty);
		rc |= xmlTextWriterEndElement(w);
	}
	return rc;
}

int
hl_matches_xml(xmlTextWriterPtr w, const hl_case *c,
	       const hl_match_result *r, double dtmin)
{
	size_t i;
	int rc = 0;

	rc |= xmlTextWriterStartElement(w, BAD_CAST "matches");
	rc |= hl_xml_num(w, "dtmin", dtmin);
	rc |= hl_xml_int(w, "units", (long)r->units);
	rc |= hl_xml_int(w, "euler", (long)r->euler);
	rc |= hl_xml_int(w, "lower-bound", (long)r->lower);
	rc |= xml_bool(w, "optimal", r->optimal);
	rc |= hl_xml_num(w, "gap", r->gap);
	if (r->penalised) {
		rc |= hl_xml_num(w, "objective", r->objective);
		rc |= hl_xml_num(w, "objective-bound", r->bound);
	}
	rc |= hl_xml_num(w, "hot-utility", r->qh);
	rc |= hl_xml_num(w, "cold-utility", r->qc);
	rc |= xml_bool(w, "restricted", r->restricted);
	if (r->restricted) {
		rc |= hl_xml_num(w, "unrestricted-hot-utility", r->qh0);
		rc |= hl_xml_num(w, "unrestricted-cold-utility", r->qc0);
	}
	rc |= hl_xml_num(w, "seconds", round(r->seconds * 1000.0) / 1000.0);
	for (i = 0; i < r->nsub; i++)
		rc |= xml_sub(w, &r->sub[i]);
	for (i = 0; i < r->nmatch; i++)
		rc |= xml_match(w, r, &r->match[i]);
	rc |= xml_utilities(w, r);
	for (i = 0; i < r->ncause; i++)
		rc |= xml_rule(w, c, r, &r->cause[i]);
	rc |= xml_isolated(w, r);
	rc |= xmlTextWriterEndElement(w);
	return rc < 0 ? -1 : 0;
}

/* ---- CSV ---- */

void
hl_matches_csv(FILE *fp, const hl_match_result *r)
{
	size_t i;

	char h[4][64], q[64];

	fprintf(fp, "hot,cold,%s,region,%s,%s,%s,%s\n",
		hl_show_header(q, sizeof q, "duty", HL_QTY_POWER),
		hl_show_header(h[0], sizeof h[0], "hot_from", HL_QTY_TEMP),
		hl_show_header(h[1], sizeof h[1], "hot_to", HL_QTY_TEMP),
		hl_show_header(h[2], sizeof h[2], "cold_from", HL_QTY_TEMP),
		hl_show_header(h[3], sizeof h[3], "cold_to", HL_QTY_TEMP));
	for (i = 0; i < r->nmatch; i++) {
		const hl_match *m = &r->match[i];
		char v[5][64];

		hl_format_number(v[0], sizeof v[0], hl_show_q(m->duty));
		hl_format_number(v[1], sizeof v[1], hl_show_t(m->hot_from));
		hl_format_number(v[2], sizeof v[2], hl_show_t(m->hot_to));
		hl_format_number(v[3], sizeof v[3], hl_show_t(m->cold_from));
		hl_format_number(v[4], sizeof v[4], hl_show_t(m->cold_to));
		hl_csv_text(fp, r->party[m->hot].name);
		fputc(',', fp);
		hl_csv_text(fp, r->party[m->cold].name);
		fprintf(fp, ",%s,%s,%s,%s,%s,%s\n", v[0], r->sub[m->sub].label,
			v[1], v[2], v[3], v[4]);
	}
}
