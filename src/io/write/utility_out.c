/* utility_out.c - writers of the utility LP result. */
#include <math.h>
#include <string.h>

#include "display.h"
#include "result_xml.h"
#include "text_out.h"
#include "utility_out.h"
#include "utf8.h"

/* Whole currency with thin spaces between thousands. */
static void
money(char *buf, size_t size, double v)
{
	char num[64], *p = buf;
	size_t i, n;

	snprintf(num, sizeof num, "%.0f", fabs(v));
	n = strlen(num);
	/* A credit (negative cost) keeps its sign: U+2212. */
	if (v < 0.0 && strcmp(num, "0") != 0 && size > 4) {
		memcpy(p, "\xe2\x88\x92", 3);
		p += 3;
	}
	for (i = 0; i < n && (size_t)(p - buf) + 5 < size; i++) {
		if (i > 0 && (n - i) % 3 == 0)
			*p++ = ' ';
		*p++ = num[i];
	}
	*p = '\0';
}

static int
name_width(const hl_case *c)
{
	int w = 7;
	size_t i;

	for (i = 0; i < c->nutil; i++)
		if ((int)hl_utf8_chars(c->util[i].name) > w)
			w = (int)hl_utf8_chars(c->util[i].name);
	return w > 28 ? 28 : w;
}

static void
text_rows(FILE *fp, const hl_case *c, const hl_utility_lp *lp, int w)
{
	char m[64];
	size_t i;

	for (i = 0; i < c->nutil; i++) {
		const hl_utility *u = &c->util[i];
		const hl_utility_load *l = &lp->util[i];

		fprintf(fp, "  ");
		hl_text_pad(fp, u->name, w);
		fprintf(fp, "  %-4s  %7.1f  %7.1f  %8.2f  %10.*f  ",
			u->kind == HL_HOT ? "hot" : "cold", hl_show_t(u->supply),
			hl_show_t(u->target), hl_show_p(u->price), HL_DIG_Q(1),
			hl_show_q(l->load));
		if (l->use == HL_UTIL_USED) {
			money(m, sizeof m, l->cost);
			/* a minus sign is one character in three bytes */
			fprintf(fp, "%*s\n", l->cost < 0.0 ? 14 : 12, m);
		} else {
			fprintf(fp, "%12s\n", hl_utility_use_name(l->use));
		}
	}
}

static void
text_pinches(FILE *fp, const hl_case *c, const hl_utility_lp *lp)
{
	size_t i;

	if (lp->npinch == 0)
		fprintf(fp, "Utility pinches        none\n");
	for (i = 0; i < lp->npinch; i++) {
		const hl_utility_pinch *p = &lp->pinch[i];

		fprintf(fp, "Utility pinch          %.1f %s hot / %.1f %s cold "
			"(%.1f %s shifted", hl_show_t(p->hot), HL_SYM_T,
			hl_show_t(p->cold), HL_SYM_T, hl_show_t(p->shifted),
			HL_SYM_T);
		if (p->util >= 0)
			fprintf(fp, "; the %s level", c->util[p->util].name);
		fprintf(fp, ")\n");
	}
}

/* Credits: what each earns, and hot utility bought because they pay. */
static void
text_credit(FILE *fp, const hl_case *c, const hl_utility_lp *lp)
{
	const char *cur = c->set.currency ? c->set.currency : "";
	char m[64];
	size_t i;

	for (i = 0; i < c->nutil; i++) {
		if (c->util[i].price >= 0.0 || lp->util[i].load <= 0.0)
			continue;
		money(m, sizeof m, -lp->util[i].cost);
		fprintf(fp, "Credit                 %s earns %s %s per year on "
			"%.*f %s it %s the process\n", c->util[i].name, m, cur,
			HL_DIG_Q(1), hl_show_q(lp->util[i].load), HL_SYM_Q,
			c->util[i].kind == HL_COLD ? "takes from" : "gives to");
	}
	if (lp->credit_rise > 0.0)
		fprintf(fp, "Bought for credits     %.*f %s of hot utility "
			"beyond the minimum: it frees process heat that a "
			"credit pays more for\n", HL_DIG_Q(1),
			hl_show_q(lp->credit_rise), HL_SYM_Q);
}

/* Why the loads exceed the process targets when a utility with a range
 * must exchange heat across the pinch (a flue gas cooled to its stack). */
static void
text_range_rise(FILE *fp, const hl_case *c, const hl_utility_lp *lp)
{
	size_t i;

	if (lp->range_rise <= 0.0)
		return;
	/* The credit LP reports its own rise (text_credit). */
	fprintf(fp, "Above the targets      %.*f %s more hot and cold utility "
		"than the minimum (%.*f / %.*f %s):\n", HL_DIG_Q(1),
		hl_show_q(lp->range_rise), HL_SYM_Q, HL_DIG_Q(1),
		hl_show_q(lp->qh_min), HL_DIG_Q(1), hl_show_q(lp->qc_min),
		HL_SYM_Q);
	for (i = 0; i < c->nutil; i++) {
		const hl_utility *u = &c->util[i];
		int hot = u->kind == HL_HOT;

		if (lp->util[i].across <= 0.0)
			continue;
		fprintf(fp, "                       %s %s %.*f %s %s the pinch: "
			"it must %s %.1f %s, the end of its range%s\n", u->name,
			hot ? "gives" : "takes", HL_DIG_Q(1),
			hl_show_q(lp->util[i].across), HL_SYM_Q,
			hot ? "below" : "above", hot ? "cool to" : "heat to",
			hl_show_t(hot ? fmin(u->supply, u->target) :
				  fmax(u->supply, u->target)), HL_SYM_T,
			hot ? " (a stack temperature)" : "");
	}
	if (lp->nproc == 0)
		fprintf(fp, "                       (no process pinch: the "
			"utility ranges and prices set the loads)\n");
}

void
hl_utility_lp_text(FILE *fp, const hl_case *c, const hl_utility_lp *lp)
{
	const char *cur = c->set.currency ? c->set.currency : "";
	int w = name_width(c);
	char m[64];

	fprintf(fp, "\nUtility levels at least cost (transshipment LP, "
		"%.0f h/year)\n\n", lp->hours);
	fprintf(fp, "  %-*s  %-4s  %7s  %7s  %8s  %10s  %12s\n", w, "utility",
		"kind", "supply", "target", "price", "load", "cost");
	/* "°C" is two characters in three bytes: widths count bytes. */
	fprintf(fp, "  %-*s  %-4s  %8s  %8s  %8s  %10s  %7.7s/year\n", w, "",
		"", HL_SYM_T, HL_SYM_T, hl_display_get() == HL_UNITS_US ?
		"/MMBtu" : HL_SYM_P, HL_SYM_Q, cur);
	text_rows(fp, c, lp, w);
	money(m, sizeof m, lp->cost);
	fprintf(fp, "\nHot utility            %.*f %s\n", HL_DIG_Q(1),
		hl_show_q(lp->hot_load), HL_SYM_Q);
	fprintf(fp, "Cold utility           %.*f %s\n", HL_DIG_Q(1),
		hl_show_q(lp->cold_load), HL_SYM_Q);
	text_range_rise(fp, c, lp);
	fprintf(fp, "Utility cost           %s %s per year", m, cur);
	if (lp->credit > 0.0) {
		money(m, sizeof m, lp->credit);
		fprintf(fp, " (net of the credits, which earn %s)", m);
	}
	fprintf(fp, "\n");
	text_credit(fp, c, lp);
	text_pinches(fp, c, lp);
	fprintf(fp, "Solver                 GLPK simplex, %s\n", lp->optimal ?
		"proven optimal" : "not proven optimal");
}

static int
xml_utility(xmlTextWriterPtr w, const hl_utility *u, const hl_utility_load *l)
{
	int rc = xmlTextWriterStartElement(w, BAD_CAST "utility");

	rc |= hl_xml_str(w, "name", u->name);
	rc |= hl_xml_str(w, "kind", u->kind == HL_HOT ? "hot" : "cold");
	rc |= hl_xml_num(w, "supply", u->supply);
	rc |= hl_xml_num(w, "target", u->target);
	rc |= hl_xml_num(w, "price", u->price);
	rc |= hl_xml_num(w, "load", l->load);
	rc |= hl_xml_num(w, "cost", l->cost);
	if (l->across > 0.0)
		rc |= hl_xml_num(w, "across-pinch", l->across);
	if (l->use == HL_UTIL_IDLE)
		rc |= hl_xml_str(w, "use", "unused");
	else if (l->use == HL_UTIL_REACH)
		rc |= hl_xml_str(w, "use", "out-of-reach");
	return rc | xmlTextWriterEndElement(w);
}

int
hl_utility_lp_xml(xmlTextWriterPtr w, const hl_case *c,
		  const hl_utility_lp *lp)
{
	size_t i;
	int rc = xmlTextWriterStartElement(w, BAD_CAST "utility-summary");

	rc |= hl_xml_num(w, "hot", lp->hot_load);
	rc |= hl_xml_num(w, "cold", lp->cold_load);
	rc |= hl_xml_num(w, "cost", lp->cost);
	rc |= hl_xml_num(w, "hours", lp->hours);
	rc |= hl_xml_str(w, "optimal", lp->optimal ? "true" : "false");
	rc |= hl_xml_num(w, "gap", lp->gap);
	rc |= hl_xml_num(w, "range-rise", lp->range_rise);
	if (lp->credit > 0.0) {
		rc |= hl_xml_num(w, "credit", lp->credit);
		rc |= hl_xml_num(w, "credit-rise", lp->credit_rise);
	}
	rc |= xmlTextWriterEndElement(w);
	for (i = 0; i < c->nutil; i++)
		rc |= xml_utility(w, &c->util[i], &lp->util[i]);
	for (i = 0; i < lp->npinch; i++) {
		const hl_utility_pinch *p = &lp->pinch[i];

		rc |= xmlTextWriterStartElement(w, BAD_CAST "utility-pinch");
		rc |= hl_xml_num(w, "shifted", p->shifted);
		rc |= hl_xml_num(w, "hot", p->hot);
		rc |= hl_xml_num(w, "cold", p->cold);
		if (p->util >= 0)
			rc |= hl_xml_str(w, "utility", c->util[p->util].name);
		rc |= xmlTextWriterEndElement(w);
	}
	return rc < 0 ? -1 : 0;
}
