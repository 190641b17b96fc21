/* audit_text.c - the audit as a report to discuss with a client. */
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "audit_out.h"
#include "display.h"
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
	fprintf(fp, "ΔTmin %.1f %s, %g h/year; ", hl_show_dt(a->dtmin),
		HL_SYM_DT, c->set.hours);
	if (a->pinch_kind == 'P')
		fprintf(fp, "pinch %.1f %s hot / %.1f %s cold (%.1f %s "
			"shifted)\n", hl_show_t(a->pinch_hot), HL_SYM_T,
			hl_show_t(a->pinch_cold), HL_SYM_T,
			hl_show_t(a->pinch), HL_SYM_T);
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
	int d = HL_DIG_Q(1);

	fprintf(fp, "  hot utility   %-5s%10.*f  %10.*f  %10.*f\n", HL_SYM_Q,
		d, hl_show_q(a->net->hot_now), d, hl_show_q(a->hot_target), d,
		hl_show_q(a->saving));
	fprintf(fp, "  cold utility  %-5s%10.*f  %10.*f  %10.*f\n", HL_SYM_Q,
		d, hl_show_q(a->net->cold_now), d, hl_show_q(a->cold_target),
		d, hl_show_q(a->saving_cold));
	if (c->nutil == 0) {
		fprintf(fp, "\nNo utility table: no prices, so no money "
			"figures.\n");
		return;
	}
	fprintf(fp, "\nSaving potential: %s %s/year at today's prices "
		"(hot utility %.2f, cold %.2f %s%s on average).\n",
		money(m1, sizeof m1, a->saving_cost), cur(c),
		hl_show_p(a->price_hot), hl_show_p(a->price_cold), cur(c),
		hl_display_get() == HL_UNITS_US ? "/MMBtu" : "/MWh");
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
	fprintf(fp, "  %-29s %9s %13s\n", "rule broken", HL_SYM_Q,
		c->nutil ? "saving/year" : "");
	for (i = 0; i < a->nviol; i++) {
		const hl_violation *v = &a->viol[i];

		fprintf(fp, "  %2zu  ", i + 1);
		hl_text_pad(fp, a->net->unit[v->unit].name, w);
		fprintf(fp, "  %-29s %9.*f %13s\n", rule_name(v->kind),
			HL_DIG_Q(1), hl_show_q(v->duty), c->nutil && v->kind != HL_VIOL_UP ?
			money(m, sizeof m, v->saving) : "");
		fprintf(fp, "      %*s  %s\n", w, "", hl_audit_action(v->kind));
	}
	fprintf(fp, "\nThe rules broken add up to %.*f %s", HL_DIG_Q(1),
		hl_show_q(a->violations), HL_SYM_Q);
	if (a->upward > 0.0)
		fprintf(fp, ", less %.*f %s passed up across the pinch by "
			"units closer than ΔTmin,", HL_DIG_Q(1),
			hl_show_q(a->upward), HL_SYM_Q);
	fprintf(fp, " against today's %.*f %s above the hot utility "
		"target.\n", HL_DIG_Q(1), hl_show_q(a->saving), HL_SYM_Q);
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
	fprintf(fp, " %8.*f  %6.1f→%-6.1f %6.1f→%-6.1f", HL_DIG_Q(1),
		hl_show_q(u->duty), hl_show_t(u->hot.t_in),
		hl_show_t(u->hot.t_out), hl_show_t(u->cold.t_in),
		hl_show_t(u->cold.t_out));
	if (isnan(u->area))
		fprintf(fp, " %9s   ", "-");
	else
		fprintf(fp, " %9.1f%s %2d", hl_show_a(u->area),
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
	char dq[32], th[32], tc[32], ar[32];
	size_t i;

	snprintf(dq, sizeof dq, "duty %s", HL_SYM_Q);
	snprintf(th, sizeof th, "hot %s", HL_SYM_T);
	snprintf(tc, sizeof tc, "cold %s", HL_SYM_T);
	snprintf(ar, sizeof ar, "area %s", HL_SYM_A);
	fprintf(fp, "\nToday's units as read (temperatures filled along the "
		"streams; * area estimated\nfrom film coefficients; α_u = "
		"vertical-transfer area / area)\n\n  ");
	hl_text_pad(fp, "unit", w);
	fprintf(fp, "  %-16s  %-16s", "hot", "cold");
	hl_show_col(fp, dq, 9);
	fputs("  ", fp);
	hl_show_left(fp, th, 14);
	hl_show_left(fp, tc, 13);
	hl_show_col(fp, ar, 10);
	fprintf(fp, " %3s %6s\n", "sh", "α_u");
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
		fprintf(fp, "  ΔTmin at today's energy   %.2f %s (the targets "
			"equal today's hot utility there)\n",
			hl_show_dt(a->dtmin_now), HL_SYM_DT);
	if (a->have_now)
		fprintf(fp, "  Area target there         %.1f %s (%s, "
			"vertical transfer on the %s composites)\n",
			hl_show_a(a->area_target_now), HL_SYM_A, basis, c->nutil ? "balanced" :
			"process");
	fprintf(fp, "  Existing area             %.1f %s (%s; %zu estimated "
		"from film coefficients)\n", hl_show_a(a->area_existing),
		HL_SYM_A, c->nutil ?
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
	fprintf(fp, "\nTo reach the targets: %.0f %s of new area, about %s "
		"%s, saving %s %s/year:\n  simple payback %.1f years.\n",
		hl_show_a(t->new_area), HL_SYM_A, money(m1, sizeof m1, t->investment), cur(c),
		money(m2, sizeof m2, t->saving), cur(c), t->payback);
	if (b != NULL && b != t)
		fprintf(fp, "Shortest payback on the curve: %.1f years at "
			"%.*f %s of hot utility (%.0f %s new, %s %s/year "
			"saved).\n", b->payback, HL_DIG_Q(1),
			hl_show_q(b->hot_utility), HL_SYM_Q,
			hl_show_a(b->new_area), HL_SYM_A,
			money(m2, sizeof m2, b->saving), cur(c));
}

/* Why this curve's area target is not `sweep`'s at the same ΔTmin: the
 * utility mix. Said at the point of the largest gap. */
static void
sweep_gap(FILE *fp, const hl_retrofit *r)
{
	const hl_retrofit_point *w = NULL;
	size_t i;

	for (i = 0; i < r->n; i++) {
		const hl_retrofit_point *p = &r->pt[i];

		if (!isnan(p->area_sweep) && (w == NULL ||
		    fabs(p->area_target - p->area_sweep) >
		    fabs(w->area_target - w->area_sweep)))
			w = p;
	}
	if (w == NULL || fabs(w->area_target - w->area_sweep) < 0.05)
		return;
	fprintf(fp, "  The target area keeps today's mix of utility levels, "
		"moving linearly to the\n  least-cost mix at the targets; "
		"`sweep` takes the least-cost mix at every ΔTmin,\n  so its "
		"area target differs: at ΔTmin %.2f %s %.1f %s here, %.1f %s "
		"in `sweep`\n  (the largest gap on the curve).\n",
		hl_show_dt(w->dtmin), HL_SYM_DT, hl_show_a(w->area_target),
		HL_SYM_A, hl_show_a(w->area_sweep), HL_SYM_A);
}

static void
retrofit(FILE *fp, const hl_case *c, const hl_audit *a,
	 const hl_retrofit *r)
{
	char m1[64], m2[64], h[5][32];
	size_t i;

	fprintf(fp, "\nRetrofit at constant α (screening only)\n");
	if (r == NULL || r->n == 0) {
		fprintf(fp, "  none: %s\n", isnan(a->alpha) ? "α is not "
			"defined" : "today's network is at or below the "
			"targets' energy");
		return;
	}
	snprintf(h[0], sizeof h[0], "hot %s", HL_SYM_Q);
	snprintf(h[1], sizeof h[1], "%s %s", hl_display_get() ==
		 HL_UNITS_SI ? "ΔTmin" : "ΔT", HL_SYM_DT);
	snprintf(h[2], sizeof h[2], "target %s", HL_SYM_A);
	snprintf(h[3], sizeof h[3], "needed %s", HL_SYM_A);
	snprintf(h[4], sizeof h[4], "new %s", HL_SYM_A);
	fputs(" ", fp);
	hl_show_col(fp, h[0], 10);
	hl_show_col(fp, h[1], 8);
	hl_show_col(fp, h[2], 11);
	hl_show_col(fp, h[3], 11);
	hl_show_col(fp, h[4], 10);
	fprintf(fp, " %13s %12s %8s\n", "investment", "saving/year",
		"payback");
	for (i = 0; i < r->n; i++) {
		const hl_retrofit_point *p = &r->pt[i];

		fprintf(fp, "  %9.*f %7.2f %10.1f %10.1f %9.1f %13s %12s ",
			HL_DIG_Q(1), hl_show_q(p->hot_utility),
			hl_show_dt(p->dtmin), hl_show_a(p->area_target),
			hl_show_a(p->area_retrofit), hl_show_a(p->new_area),
			money(m1, sizeof m1, p->investment),
			money(m2, sizeof m2, p->saving));
		if (isnan(p->payback))
			fprintf(fp, "%8s\n", i == 0 ? "today" : "-");
		else
			fprintf(fp, "%6.1f y\n", p->payback);
	}
	fprintf(fp, "  Needed area = area target / α; new area priced by the "
		"cost law of the case's exchanger type per shell, in\n  shells the size of the shell "
		"target's mean shell at each energy (%.1f %s, %s %s\n  each at "
		"the targets; today's mean shell is %.1f %s); saving at "
		"today's prices.\n", hl_show_a(r->n > 0 ? r->pt[r->n - 1].shell_area :
		NAN), HL_SYM_A, money(m1, sizeof m1, r->n > 0 ? r->pt[r->n - 1].shell_cost :
		NAN), cur(c), hl_show_a(r->shell_area), HL_SYM_A);
	sweep_gap(fp, r);
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
