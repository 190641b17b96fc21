/* audit_text.c - the audit as a report to discuss with a client. */
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "audit_out.h"
#include "text_out.h"
#include "utf8.h"

/* Whole currency with spaces between thousands, sign kept. */
static const char *
money(char *buf, size_t size, double v)
{
	char num[64], *p = buf;
	size_t i, n;

	if (!isfinite(v)) {
		snprintf(buf, size, "-");
		return buf;
	}
	snprintf(num, sizeof num, "%.0f", fabs(v));
	n = strlen(num);
	if (v < 0.0 && strcmp(num, "0") != 0)
		*p++ = '-';
	for (i = 0; i < n && (size_t)(p - buf) + 5 < size; i++) {
		if (i > 0 && (n - i) % 3 == 0)
			*p++ = ' ';
		*p++ = num[i];
	}
	*p = '\0';
	return buf;
}

static const char *
cur(const hl_case *c)
{
	return c->set.currency ? c->set.currency : "";
}

const char *
hl_audit_action(hl_violation_kind k)
{
	switch (k) {
	case HL_VIOL_ACROSS:
		return "re-pipe or move it so that it works on one side of the "
		       "pinch";
	case HL_VIOL_HOT_BELOW:
		return "move this heating above the pinch: heat the stream "
		       "below it by recovery instead";
	case HL_VIOL_COLD_ABOVE:
		return "add recovery to a cold stream above the pinch in place "
		       "of this cooling";
	default:
		return "closer than ΔTmin: it lowers today's use, keep it in "
		       "mind when re-piping";
	}
}

static const char *
rule_name(hl_violation_kind k)
{
	static const char *const n[] = { "process heat across the pinch",
		"hot utility below the pinch", "cold utility above the pinch",
		"heat passed up across it" };

	return (unsigned)k < 4 ? n[k] : "?";
}

static void
header(FILE *fp, const hl_case *c, const char *network, const hl_audit *a)
{
	fprintf(fp, "Audit of the existing network of %s", c->source);
	if (network != NULL)
		fprintf(fp, " (network: %s)", network);
	fprintf(fp, "\nScreening estimate: see the caution at the end.\n\n");
	fprintf(fp, "ΔTmin %.1f K, %g h/year; ", a->dtmin, c->set.hours);
	if (a->pinch_kind == 'P')
		fprintf(fp, "pinch %.1f °C hot / %.1f °C cold (%.1f °C "
			"shifted)\n", a->pinch_hot, a->pinch_cold, a->pinch);
	else
		fprintf(fp, "no pinch: the problem needs no %s utility at "
			"this ΔTmin (the rules refer to the %s of the "
			"cascade)\n", a->pinch_kind == 'B' ? "cold" : "hot",
			a->pinch_kind == 'B' ? "bottom" : "top");
}

static void
energy(FILE *fp, const hl_case *c, const hl_audit *a)
{
	char m1[64], m2[64], m3[64];

	fprintf(fp, "\nEnergy                     today      target      "
		"saving\n");
	fprintf(fp, "  hot utility   kW   %10.1f  %10.1f  %10.1f\n",
		a->net->hot_now, a->hot_target, a->saving);
	fprintf(fp, "  cold utility  kW   %10.1f  %10.1f  %10.1f\n",
		a->net->cold_now, a->cold_target, a->saving_cold);
	if (c->nutil == 0) {
		fprintf(fp, "\nNo utility table: no prices, so no money "
			"figures.\n");
		return;
	}
	fprintf(fp, "\nSaving potential: %s %s/year at today's prices "
		"(hot utility %.2f, cold %.2f %s/MWh on average).\n",
		money(m1, sizeof m1, a->saving_cost), cur(c), a->price_hot,
		a->price_cold, cur(c));
	fprintf(fp, "Utility bill today %s %s/year; at the targets with the "
		"least-cost utility levels %s %s/year\n(%s less: the saving "
		"above and the cheaper mix of levels).\n",
		money(m1, sizeof m1, a->net->cost_now), cur(c),
		money(m2, sizeof m2, a->cost_target), cur(c),
		money(m3, sizeof m3, a->net->cost_now - a->cost_target));
}

static int
unit_width(const hl_audit *a)
{
	int w = 4;
	size_t i;

	for (i = 0; i < a->net->nunit; i++)
		if ((int)hl_utf8_chars(a->net->unit[i].name) > w)
			w = (int)hl_utf8_chars(a->net->unit[i].name);
	return w > 28 ? 28 : w;
}

static void
culprits(FILE *fp, const hl_case *c, const hl_audit *a)
{
	int w = unit_width(a);
	char m[64];
	size_t i;

	if (a->nviol == 0) {
		fprintf(fp, "\nNo pinch rule is broken: today's units keep "
			"process heat on its side of the pinch and the "
			"utilities on theirs.\n");
		return;
	}
	fprintf(fp, "\nCulprits: the pinch rules broken, largest first (each "
		"kW across the pinch costs\na kW of heating and a kW of "
		"cooling: Linnhoff et al. 1982)\n\n");
	fprintf(fp, "   #  ");
	hl_text_pad(fp, "unit", w);
	fprintf(fp, "  %-29s %9s %13s\n", "rule broken", "kW",
		c->nutil ? "saving/year" : "");
	for (i = 0; i < a->nviol; i++) {
		const hl_violation *v = &a->viol[i];

		fprintf(fp, "  %2zu  ", i + 1);
		hl_text_pad(fp, a->net->unit[v->unit].name, w);
		fprintf(fp, "  %-29s %9.1f %13s\n", rule_name(v->kind),
			v->duty, c->nutil && v->kind != HL_VIOL_UP ?
			money(m, sizeof m, v->saving) : "");
		fprintf(fp, "      %*s  %s\n", w, "", hl_audit_action(v->kind));
	}
	fprintf(fp, "\nThe rules broken add up to %.1f kW", a->violations);
	if (a->upward > 0.0)
		fprintf(fp, ", less %.1f kW passed up across the pinch by units "
			"closer than ΔTmin,", a->upward);
	fprintf(fp, " against today's %.1f kW above the hot utility target.\n",
		a->saving);
}

static void
unit_row(FILE *fp, const hl_case *c, const hl_audit *a, size_t i, int w)
{
	const hl_existing_unit *u = &a->net->unit[i];

	fprintf(fp, "  ");
	hl_text_pad(fp, u->name, w);
	fprintf(fp, "  ");
	hl_text_pad(fp, hl_existing_side_name(c, &u->hot), 16);
	fprintf(fp, "  ");
	hl_text_pad(fp, hl_existing_side_name(c, &u->cold), 16);
	fprintf(fp, " %8.1f  %6.1f→%-6.1f %6.1f→%-6.1f", u->duty, u->hot.t_in,
		u->hot.t_out, u->cold.t_in, u->cold.t_out);
	if (isnan(u->area))
		fprintf(fp, " %9s   ", "-");
	else
		fprintf(fp, " %9.1f%s %2d", u->area,
			u->area_estimated ? "*" : " ", u->shells);
	if (isnan(a->unit_alpha[i]))
		fprintf(fp, "     -");
	else
		fprintf(fp, "  %5.2f", a->unit_alpha[i]);
	/* A type other than shell-and-tube is named after the row. */
	if (!isnan(u->lmtd) && u->type != HL_EXCH_SHELL_TUBE)
		fprintf(fp, "  %s", hl_exchanger_type_name(u->type));
	fputc('\n', fp);
}

static void
units(FILE *fp, const hl_case *c, const hl_audit *a)
{
	int w = unit_width(a);
	size_t i;

	fprintf(fp, "\nToday's units as read (temperatures filled along the "
		"streams; * area estimated\nfrom film coefficients; α_u = "
		"vertical-transfer area / area)\n\n  ");
	hl_text_pad(fp, "unit", w);
	fprintf(fp, "  %-16s  %-16s %8s  %-13s %-13s %9s %3s %6s\n", "hot",
		"cold", "duty kW", "hot °C", "cold °C", "area m²", "sh", "α_u");
	for (i = 0; i < a->net->nunit; i++)
		unit_row(fp, c, a, i, w);
	if (a->net->nrow < a->net->nunit)
		fprintf(fp, "  (gaps: stretches no row covers, counted as "
			"utility; see the warnings)\n");
}

static void
efficiency(FILE *fp, const hl_case *c, const hl_audit *a)
{
	const char *basis = hl_exchanger_type_name(c->set.exchanger);

	fprintf(fp, "\nArea efficiency (Tjoe & Linnhoff 1986)\n");
	if (isinf(a->dtmin_now))
		fprintf(fp, "  ΔTmin at today's energy   none: no heat is "
			"recovered today\n");
	else if (!isnan(a->dtmin_now))
		fprintf(fp, "  ΔTmin at today's energy   %.2f K (the targets "
			"equal today's hot utility there)\n", a->dtmin_now);
	if (a->have_now)
		fprintf(fp, "  Area target there         %.1f m² (%s, "
			"vertical transfer on the %s composites)\n",
			a->area_target_now, basis, c->nutil ? "balanced" :
			"process");
	fprintf(fp, "  Existing area             %.1f m² (%s; %zu estimated "
		"from film coefficients)\n", a->area_existing, c->nutil ?
		"all units" : "process-to-process units", a->net->nestimated);
	if (isnan(a->alpha))
		fprintf(fp, "  α                         not defined: %s\n",
			a->note);
	else
		fprintf(fp, "  α                         %.3f (area target at "
			"today's energy / existing area)\n", a->alpha);
}

static void
best_payback(FILE *fp, const hl_case *c, const hl_retrofit *r)
{
	const hl_retrofit_point *t = &r->pt[r->n - 1], *b = NULL;
	char m1[64], m2[64];
	size_t i;

	for (i = 1; i < r->n; i++)
		if (!isnan(r->pt[i].payback) &&
		    (b == NULL || r->pt[i].payback < b->payback))
			b = &r->pt[i];
	fprintf(fp, "\nTo reach the targets: %.0f m² of new area, about %s %s, "
		"saving %s %s/year:\n  simple payback %.1f years.\n",
		t->new_area, money(m1, sizeof m1, t->investment), cur(c),
		money(m2, sizeof m2, t->saving), cur(c), t->payback);
	if (b != NULL && b != t)
		fprintf(fp, "Shortest payback on the curve: %.1f years at %.1f "
			"kW of hot utility (%.0f m² new, %s %s/year saved).\n",
			b->payback, b->hot_utility, b->new_area,
			money(m2, sizeof m2, b->saving), cur(c));
}

static void
retrofit(FILE *fp, const hl_case *c, const hl_audit *a,
	 const hl_retrofit *r)
{
	char m1[64], m2[64];
	size_t i;

	fprintf(fp, "\nRetrofit at constant α (screening only)\n");
	if (r == NULL || r->n == 0) {
		fprintf(fp, "  none: %s\n", isnan(a->alpha) ? "α is not "
			"defined" : "today's network is at or below the "
			"targets' energy");
		return;
	}
	fprintf(fp, "  %9s %7s %10s %10s %9s %13s %12s %8s\n", "hot kW",
		"ΔTmin K", "target m²", "needed m²", "new m²", "investment",
		"saving/year", "payback");
	for (i = 0; i < r->n; i++) {
		const hl_retrofit_point *p = &r->pt[i];

		fprintf(fp, "  %9.1f %7.2f %10.1f %10.1f %9.1f %13s %12s ",
			p->hot_utility, p->dtmin, p->area_target,
			p->area_retrofit, p->new_area,
			money(m1, sizeof m1, p->investment),
			money(m2, sizeof m2, p->saving));
		if (isnan(p->payback))
			fprintf(fp, "%8s\n", i == 0 ? "today" : "-");
		else
			fprintf(fp, "%6.1f y\n", p->payback);
	}
	fprintf(fp, "  Needed area = area target / α; new area priced by the "
		"cost law of the case's exchanger type per shell, in\n  shells the size of the shell "
		"target's mean shell at each energy (%.1f m², %s %s\n  each at "
		"the targets; today's mean shell is %.1f m²); saving at "
		"today's prices.\n", r->n > 0 ? r->pt[r->n - 1].shell_area :
		NAN, money(m1, sizeof m1, r->n > 0 ? r->pt[r->n - 1].shell_cost :
		NAN), cur(c), r->shell_area);
	best_payback(fp, c, r);
	fprintf(fp, "The curve assumes the retrofit keeps today's area "
		"efficiency. Which units to re-pipe,\nwhere new shells go, "
		"pressure drop, layout and plant constraints are for a "
		"detailed study.\n");
}

void
hl_audit_text(FILE *fp, const hl_case *c, const char *network,
	      const hl_audit *a, const hl_retrofit *r, const char *caution)
{
	header(fp, c, network, a);
	energy(fp, c, a);
	culprits(fp, c, a);
	units(fp, c, a);
	efficiency(fp, c, a);
	retrofit(fp, c, a, r);
	if (a->net->nwarn > 0)
		fprintf(fp, "\n%zu warning%s about the network data (on "
			"standard error).\n", a->net->nwarn,
			a->net->nwarn == 1 ? "" : "s");
	fprintf(fp, "\n%s\n", caution);
}
