/* sensitivity_out.c - writers of the sensitivity of the targets. */
#include <math.h>
#include <string.h>

#include "display.h"
#include "sensitivity_out.h"
#include "text_out.h"
#include "utf8.h"

/* Below this a change in kW prints as zero, never as "-0.0". */
#define SHOWN_ZERO 0.05

static double
tidy(double v)
{
	return fabs(v) < SHOWN_ZERO ? 0.0 : v;
}

static void
put_padded(FILE *fp, const char *s, size_t width)
{
	size_t n = hl_utf8_chars(s);

	fputs(s, fp);
	for (; n < width; n++)
		fputc(' ', fp);
}

/* Two numbers print differently with this many decimals. */
static int
differ_shown(double a, double b, int decimals)
{
	char x[64], y[64];

	snprintf(x, sizeof x, "%.*f", decimals, fabs(a) < 0.5 * pow(10.0,
		 -decimals) ? 0.0 : a);
	snprintf(y, sizeof y, "%.*f", decimals, fabs(b) < 0.5 * pow(10.0,
		 -decimals) ? 0.0 : b);
	return strcmp(x, y) != 0;
}

static int
is_temperature(hl_sens_quantity q)
{
	return q == HL_SENS_SUPPLY || q == HL_SENS_TARGET;
}

/* One unit of datum q in the display units (1 in SI): 1 K is 1.8 °F. */
static double
per_unit(hl_sens_quantity q)
{
	if (is_temperature(q) || q == HL_SENS_DTMIN)
		return hl_show_dt(1.0);
	return q == HL_SENS_CP ? hl_show_cp(1.0) : hl_show_q(1.0);
}

/* A derivative of a heat rate by datum q, SI to display units. */
static double
deriv_factor(hl_sens_quantity q)
{
	return hl_show_q(1.0) / per_unit(q);
}

/* "kelvin" in words, or the display unit of a temperature difference. */
static const char *
degree_word(void)
{
	return hl_display_get() == HL_UNITS_SI ? "kelvin" : HL_SYM_DT;
}

/* "target", "cp", "cp 2/3" for a segment of a segmented stream. */
static void
datum_label(char *buf, size_t size, const hl_case *c, const hl_sens_row *r)
{
	const hl_stream *s = &c->stream[r->stream];

	if (!is_temperature(r->q) && s->nseg > 1)
		snprintf(buf, size, "%s %zu/%zu",
			 hl_sensitivity_quantity_name(r->q), r->segment + 1,
			 s->nseg);
	else
		snprintf(buf, size, "%s", hl_sensitivity_quantity_name(r->q));
}

static void
value_text(char *buf, size_t size, const hl_sens_row *r)
{
	double cp = hl_show_cp(r->value);

	if (is_temperature(r->q))
		snprintf(buf, size, "%.1f %s", hl_show_t(r->value), HL_SYM_T);
	else if (r->q == HL_SENS_CP)
		snprintf(buf, size, "%.*f %s", cp >= 100.0 ? 0 : cp >= 10.0 ?
			 1 : 2, cp, HL_SYM_CP);
	else
		snprintf(buf, size, "%.*f %s", HL_DIG_Q(1), hl_show_q(r->value),
			 HL_SYM_Q);
}

static void
tol_text(char *buf, size_t size, const hl_sens_row *r)
{
	if (is_temperature(r->q))
		snprintf(buf, size, "±%.1f %s", hl_show_dt(r->tol), HL_SYM_DT);
	else
		snprintf(buf, size, "±%.3g %%", r->value > 0.0 ?
			 100.0 * r->tol / r->value : 0.0);
}

/* A derivative, or "left|right" where a pinch changes; f converts it to the
 * display units. */
static void
deriv_text(char *buf, size_t size, double minus, double plus, int kink,
	   double f)
{
	minus *= f;
	plus *= f;
	if (kink)
		snprintf(buf, size, "%.2f|%.2f", minus + 0.0, plus + 0.0);
	else
		snprintf(buf, size, "%.2f", fabs(plus) < 5e-3 ? 0.0 : plus);
}

/* How far a target moves with the datum off by its tolerance: "±Y" when the
 * move is symmetric, else "+a/−b", the changes at +tol and at −tol; scale
 * converts the move to the display units (1 for money). */
static void
move_text(char *buf, size_t size, double minus, double plus, double tol,
	  int decimals, double scale)
{
	double up = tidy(plus * tol) * scale, down = tidy(-minus * tol) * scale;

	if (!differ_shown(up, -down, decimals))
		snprintf(buf, size, "±%.*f", decimals, fabs(up));
	else
		snprintf(buf, size, "%s%.*f/%s%.*f", up >= 0.0 ? "+" : "",
			 decimals, up, down >= 0.0 ? "+" : "", decimals, down);
}

/* The case has a utility cost, and r's derivatives of it are known. */
static int
has_cost(const hl_sensitivity *sv, double minus, double plus)
{
	return sv->cost != HL_SENS_COST_NONE && !isnan(minus) && !isnan(plus);
}

/* "+12", "-3", "0", "+inf", "-inf": a change in whole currency units. */
static void
signed_text(char *buf, size_t size, double v)
{
	if (isinf(v))
		snprintf(buf, size, "%s", v > 0.0 ? "+inf" : "-inf");
	else if (fabs(v) < 0.5)
		snprintf(buf, size, "0");
	else
		snprintf(buf, size, "%+.0f", v);
}

/* How far the utility cost moves with the datum off by tol: as move_text,
 * whole currency units, "+inf"/"-inf" for a side where a step leaves no
 * utility able to serve the process. */
static void
cost_move_text(char *buf, size_t size, double minus, double plus, double tol)
{
	char up[32], down[32];

	if (tol <= 0.0 || (!isinf(minus) && !isinf(plus))) {
		move_text(buf, size, tol > 0.0 ? minus : 0.0, tol > 0.0 ? plus :
			  0.0, tol, 0, 1.0);
		return;
	}
	signed_text(up, sizeof up, plus * tol);
	signed_text(down, sizeof down, -minus * tol);
	snprintf(buf, size, "%s/%s", up, down);
}

/* A cost derivative per degree of a utility temperature, "left|right"
 * when they differ, "inf" for a side that no utility can serve. */
static void
cost_deriv_text(char *buf, size_t size, double minus, double plus)
{
	minus /= hl_show_dt(1.0);
	plus /= hl_show_dt(1.0);
	if (minus == plus || (!isinf(minus) && !isinf(plus) &&
			      !differ_shown(minus, plus, 0)))
		snprintf(buf, size, "%.0f", fabs(plus) < 0.5 ? 0.0 : plus);
	else
		snprintf(buf, size, "%.0f|%.0f", fabs(minus) < 0.5 ? 0.0 : minus,
			 fabs(plus) < 0.5 ? 0.0 : plus);
}

static const char *
currency(const hl_case *c)
{
	return c->set.currency ? c->set.currency : "currency units";
}

/* "the utility cost by ±Y EUR a year" in words, and which way a step
 * leaves no utility able to serve; up and down name the steps (+1.0 K). */
static void
cost_words(FILE *fp, const hl_case *c, double minus, double plus, double tol,
	   const char *up, const char *down)
{
	char m[64];
	int inf_up = isinf(plus), inf_down = isinf(minus);

	if (inf_up && inf_down) {
		fprintf(fp, "a step either way leaves no utility able to serve "
			"the process");
		return;
	}
	if (!inf_up && !inf_down) {
		move_text(m, sizeof m, minus, plus, tol, 0, 1.0);
		fprintf(fp, "the utility cost by %s %s a year", m, currency(c));
		return;
	}
	fprintf(fp, "the utility cost by %+.0f %s a year at %s; any %s value "
		"leaves no utility able to serve the process", inf_up ?
		-minus * tol : plus * tol, currency(c), inf_up ? down : up,
		inf_up ? "higher" : "lower");
}

/* "+1.0 K" / "-5 %": one tolerance step up or down, for words. */
static void
step_text(char *buf, size_t size, int temperature, double value, double tol,
	  int sign)
{
	if (temperature)
		snprintf(buf, size, "%c%.1f %s", sign > 0 ? '+' : '-',
			 hl_show_dt(tol), HL_SYM_DT);
	else
		snprintf(buf, size, "%c%.3g %%", sign > 0 ? '+' : '-',
			 value > 0.0 ? 100.0 * tol / value : 0.0);
}

static size_t
name_width(const hl_case *c)
{
	size_t i, w = 6;

	for (i = 0; i < c->nstream; i++)
		if (hl_utf8_chars(c->stream[i].name) > w)
			w = hl_utf8_chars(c->stream[i].name);
	return w > 40 ? 40 : w;
}

static const char *
long_quantity(hl_sens_quantity q)
{
	switch (q) {
	case HL_SENS_SUPPLY:
		return "supply temperature";
	case HL_SENS_TARGET:
		return "target temperature";
	case HL_SENS_DUTY:
		return "duty";
	default:
		return "cp";
	}
}

static void
text_headline(FILE *fp, const hl_case *c, const hl_cascade *cas)
{
	size_t i;

	fprintf(fp, "Sensitivity of the energy targets for %s\n\n",
		c->source ? c->source : "");
	fprintf(fp, "At ΔTmin %.1f %s: minimum hot utility %.*f %s, minimum "
		"cold utility %.*f %s;\n", hl_show_dt(cas->dtmin), HL_SYM_DT,
		HL_DIG_Q(1), hl_show_q(cas->qh), HL_SYM_Q, HL_DIG_Q(1),
		hl_show_q(cas->qc), HL_SYM_Q);
	for (i = 0; i < cas->npinch; i++) {
		double s = cas->t[cas->pinch[i]];

		fprintf(fp, "%s %.1f %s hot / %.1f %s cold", i ? "," :
			"pinch at", hl_show_t(hl_cascade_hot_temp(cas, s)),
			HL_SYM_T, hl_show_t(hl_cascade_cold_temp(cas, s)),
			HL_SYM_T);
	}
	if (cas->npinch == 0)
		fprintf(fp, "no pinch (a threshold problem)");
	fprintf(fp, ".\nTolerances: each stream's cp_tol and t_tol where the "
		"table gives them,\nelse ±%.3g %% on cp and duty and ±%.1f %s on "
		"temperatures.\n", 100.0 * c->set.cp_tol,
		hl_show_dt(c->set.t_tol), HL_SYM_DT);
}

static void
text_first(FILE *fp, const hl_case *c, const hl_sensitivity *sv)
{
	size_t i, n = 0;

	fprintf(fp, "\nCheck these measurements first (largest effect on the "
		"%s within their tolerances):\n", sv->cost !=
		HL_SENS_COST_NONE ? "utility cost" : "targets");
	for (i = 0; i < sv->nrow && n < 3; i++) {
		const hl_sens_row *r = &sv->row[sv->rank[i]];
		char v[48], t[32], h[48], k[48];

		if (hl_sensitivity_effect(r) < SHOWN_ZERO)
			break;
		value_text(v, sizeof v, r);
		tol_text(t, sizeof t, r);
		move_text(h, sizeof h, r->hot_minus, r->hot_plus, r->tol,
			  HL_DIG_Q(1), hl_show_q(1.0));
		move_text(k, sizeof k, r->cold_minus, r->cold_plus, r->tol,
			  HL_DIG_Q(1), hl_show_q(1.0));
		fprintf(fp, "  %zu. %s %s", ++n, c->stream[r->stream].name,
			long_quantity(r->q));
		if (!is_temperature(r->q) && c->stream[r->stream].nseg > 1)
			fprintf(fp, " (segment %zu)", r->segment + 1);
		fprintf(fp, " (%s): a %s error in it moves QHmin by %s %s and "
			"QCmin by %s %s", v, t, h, HL_SYM_Q, k, HL_SYM_Q);
		if (has_cost(sv, r->cost_minus, r->cost_plus)) {
			step_text(h, sizeof h, is_temperature(r->q), r->value,
				  r->tol, 1);
			step_text(k, sizeof k, is_temperature(r->q), r->value,
				  r->tol, -1);
			fprintf(fp, ",\n     ");
			cost_words(fp, c, r->cost_minus, r->cost_plus, r->tol,
				   h, k);
		}
		fputc('\n', fp);
	}
	if (n == 0)
		fprintf(fp, "  none: no datum moves the %s within its "
			"tolerance\n", sv->cost != HL_SENS_COST_NONE ?
			"utility cost by a unit or the targets by 0.05 kW" :
			"targets by 0.05 kW or more");
}

static void
text_row(FILE *fp, const hl_case *c, const hl_sensitivity *sv, size_t rank,
	 size_t nw)
{
	const hl_sens_row *r = &sv->row[sv->rank[rank]];
	char d[32], v[48], t[32], dh[48], dc[48], mh[48], mc[48], co[64];

	datum_label(d, sizeof d, c, r);
	value_text(v, sizeof v, r);
	tol_text(t, sizeof t, r);
	deriv_text(dh, sizeof dh, r->hot_minus, r->hot_plus, r->kink,
		   deriv_factor(r->q));
	deriv_text(dc, sizeof dc, r->cold_minus, r->cold_plus, r->kink,
		   deriv_factor(r->q));
	move_text(mh, sizeof mh, r->hot_minus, r->hot_plus, r->tol,
		  HL_DIG_Q(1), hl_show_q(1.0));
	move_text(mc, sizeof mc, r->cold_minus, r->cold_plus, r->tol,
		  HL_DIG_Q(1), hl_show_q(1.0));
	fprintf(fp, "%4zu  ", rank + 1);
	put_padded(fp, c->stream[r->stream].name, nw);
	fprintf(fp, "  ");
	put_padded(fp, d, 7);
	fprintf(fp, "%11s %7s %13s %13s %10s%s %10s", v, t, mh, mc, dh,
		r->kink ? "*" : " ", dc);
	if (sv->cost != HL_SENS_COST_NONE) {
		if (has_cost(sv, r->cost_minus, r->cost_plus))
			cost_move_text(co, sizeof co, r->cost_minus,
				       r->cost_plus, r->tol);
		else
			snprintf(co, sizeof co, "unknown");
		fprintf(fp, " %14s", co);
	}
	fputc('\n', fp);
}

static size_t count_infinite(const hl_sensitivity *sv);

static void
text_table(FILE *fp, const hl_case *c, const hl_sensitivity *sv)
{
	size_t i, nw = name_width(c);

	fprintf(fp, "\nEvery datum, largest effect first: how far each target "
		"moves (%s, first order) with\nthe datum off by its tolerance, "
		"and the derivatives (%s per %s for temperatures,\nper %s for "
		"cp, per %s for duty).", HL_SYM_Q, HL_SYM_Q, HL_SYM_DT,
		HL_SYM_CP, HL_SYM_Q);
	if (sv->cost != HL_SENS_COST_NONE)
		fprintf(fp, " The last column: how far the utility cost\nmoves "
			"(%s a year, first order), at +tol/-tol when the two "
			"differ.", currency(c));
	if (count_infinite(sv) > 0)
		fprintf(fp, "\nA row whose cost moves by +inf or -inf ranks "
			"first: a step of its tolerance that\nway leaves no "
			"utility able to serve the process, so no finite cost "
			"can be given\nand the datum is the first to check.");
	fputs("\n\n", fp);
	fprintf(fp, "%4s  ", "rank");
	put_padded(fp, "stream", nw);
	fprintf(fp, "  %-7s%11s %7s %13s %13s %10s  %10s", "datum", "value",
		"tol", "QHmin moves", "QCmin moves", "dQHmin/dx", "dQCmin/dx");
	if (sv->cost != HL_SENS_COST_NONE)
		fprintf(fp, " %14s", "cost/yr moves");
	fputc('\n', fp);
	for (i = 0; i < sv->nrow; i++)
		text_row(fp, c, sv, i, nw);
}

static void
text_urow(FILE *fp, const hl_case *c, const hl_sens_urow *u, size_t nw)
{
	char v[48], t[32], mv[64], d[64];

	snprintf(v, sizeof v, "%.1f %s", hl_show_t(u->value), HL_SYM_T);
	snprintf(t, sizeof t, "±%.1f %s", hl_show_dt(u->tol), HL_SYM_DT);
	cost_move_text(mv, sizeof mv, u->cost_minus, u->cost_plus, u->tol);
	cost_deriv_text(d, sizeof d, u->cost_minus, u->cost_plus);
	if (isnan(u->cost_minus) || isnan(u->cost_plus))
		snprintf(mv, sizeof mv, "unknown"), snprintf(d, sizeof d, "-");
	fprintf(fp, "      ");
	put_padded(fp, c->util[u->util].name, nw);
	fprintf(fp, "  ");
	put_padded(fp, hl_sensitivity_quantity_name(u->q), 7);
	fprintf(fp, "%11s %7s %14s %14s\n", v, t, mv, d);
}

/* The utilities' own temperatures: the targets do not depend on them, the
 * cost of the utility mix may. */
static void
text_utilities(FILE *fp, const hl_case *c, const hl_sensitivity *sv)
{
	size_t i, nw = 7; /* "utility" */

	if (sv->nurow == 0)
		return;
	for (i = 0; i < c->nutil; i++)
		if (hl_utf8_chars(c->util[i].name) > nw)
			nw = hl_utf8_chars(c->util[i].name);
	nw = nw > 40 ? 40 : nw;
	fprintf(fp, "\nThe utilities' temperatures (the energy targets do not "
		"depend on them; the\nutility cost does): how far the cost "
		"moves with each off by ±%.1f %s, and\nits derivative (%s a "
		"year per %s).\n\n", hl_show_dt(c->set.t_tol), HL_SYM_DT,
		currency(c), HL_SYM_DT);
	fprintf(fp, "      ");
	put_padded(fp, "utility", nw);
	fprintf(fp, "  %-7s%11s %7s %14s %14s\n", "datum", "value", "tol",
		"cost/yr moves", "dcost/dx");
	for (i = 0; i < sv->nurow; i++)
		text_urow(fp, c, &sv->urow[i], nw);
}

static void
text_band(FILE *fp, const char *name, const hl_sens_band *b)
{
	int d = HL_DIG_Q(1);

	fprintf(fp, "  %s %.*f %s lies within %.*f … %.*f %s (first-order "
		"estimate %.*f … %.*f %s)\n", name, d, hl_show_q(b->nominal),
		HL_SYM_Q, d, hl_show_q(b->low), d, hl_show_q(b->high), HL_SYM_Q,
		d, hl_show_q(b->lin_low), d, hl_show_q(b->lin_high), HL_SYM_Q);
}

/* The first-order estimate misses the re-solve by more than 1 % of the
 * band's width plus a tenth of a kW. */
static int
band_differs(const hl_sens_band *b)
{
	double slack = 0.01 * (b->high - b->low) + 0.1;

	return fabs(b->lin_high - b->high) > slack ||
	       fabs(b->lin_low - b->low) > slack;
}

/* Data (streams, ΔTmin, utilities) with an infinite cost derivative. */
static size_t
count_infinite(const hl_sensitivity *sv)
{
	size_t i, n = 0;

	for (i = 0; i <= sv->nrow; i++) {
		const hl_sens_row *r = i < sv->nrow ? &sv->row[i] : &sv->dt;

		n += isinf(r->cost_minus) || isinf(r->cost_plus);
	}
	for (i = 0; i < sv->nurow; i++)
		n += isinf(sv->urow[i].cost_minus) ||
		     isinf(sv->urow[i].cost_plus);
	return n;
}

static size_t
count_kinks(const hl_sensitivity *sv)
{
	size_t i, n = 0;

	for (i = 0; i < sv->nrow; i++)
		n += sv->row[i].kink;
	return n;
}

/* For the data to check first: a temperature of a stream given by cp over a
 * short span changes its duty by tol/span, often the real reason it ranks
 * high; say so once per stream. */
static void
text_short_spans(FILE *fp, const hl_case *c, const hl_sensitivity *sv)
{
	size_t i, j, shown[3], n = 0;

	for (i = 0; i < sv->nrow && i < 3; i++) {
		const hl_sens_row *r = &sv->row[sv->rank[i]];
		const hl_stream *s = &c->stream[r->stream];
		const hl_segment *g = &s->seg[r->q == HL_SENS_SUPPLY ? 0 :
					      s->nseg - 1];
		double span = fabs(g->supply - g->target);
		int seen = 0;

		if (!is_temperature(r->q) || g->by_duty ||
		    r->tol < 0.05 * span || hl_sensitivity_effect(r) < SHOWN_ZERO)
			continue;
		for (j = 0; j < n; j++)
			seen |= shown[j] == r->stream;
		if (seen)
			continue;
		shown[n++] = r->stream;
		fprintf(fp, "\n'%s' is given by cp over %.1f %s: a ±%.1f %s "
			"error in one end changes its duty by\n±%.0f %%. If its "
			"duty is what was measured, give 'duty' instead of 'cp' "
			"for it.\n", s->name, hl_show_dt(span), HL_SYM_DT,
			hl_show_dt(r->tol), HL_SYM_DT, 100.0 * r->tol / span);
	}
}

static void
text_notes(FILE *fp, const hl_case *c, const hl_sensitivity *sv)
{
	size_t nk = count_kinks(sv);

	if (nk > 0)
		fprintf(fp, "\n* A pinch changes at %zu datum%s: its derivatives "
			"are shown from the left | from the right.\n", nk,
			nk == 1 ? "" : "s");
	if (sv->nactive > 1)
		fprintf(fp, "The targets rest on %zu boundaries of the cascade "
			"at once; data between them have one-sided "
			"derivatives.\n", sv->nactive);
	text_short_spans(fp, c, sv);
	if (sv->collapsed > 0)
		fprintf(fp, "%zu segment%s span%s less than twice %s "
			"temperature tolerance; the band takes %s as vanishing "
			"at the worst corner.\n", sv->collapsed,
			sv->collapsed == 1 ? "" : "s",
			sv->collapsed == 1 ? "s" : "", sv->collapsed == 1 ?
			"its" : "their", sv->collapsed == 1 ? "it" : "them");
	if (sv->cost == HL_SENS_COST_LEVELS)
		fprintf(fp, "Utility cost: the utility LP's least-cost mix of the "
			"%zu levels, %g h per year, in %s;\nits derivatives are "
			"exact and one-sided, with the loads re-chosen at "
			"least cost.\n", c->nutil, c->set.hours, currency(c));
	else if (sv->cost == HL_SENS_COST_SINGLE)
		fprintf(fp, "Cost: (hot price × QHmin + cold price × QCmin) × %g "
			"h per year, in %s.\n", c->set.hours, currency(c));
	if (count_infinite(sv) > 0)
		fprintf(fp, "inf: %zu datum%s at the edge of what the utilities "
			"can reach: a step that way,\nhowever small, leaves no "
			"utility able to serve the process.\n",
			count_infinite(sv), count_infinite(sv) == 1 ? " sits" :
			"s sit");
}

/* ", and the utility cost X a year more (Y per kelvin less)". */
static void
text_dtmin_cost(FILE *fp, const hl_case *c, const hl_sens_row *dt)
{
	if (isinf(dt->cost_plus))
		fprintf(fp, ";\nany larger ΔTmin leaves no utility able to serve "
			"the process");
	else
		fprintf(fp, ",\nand the utility cost %.0f %s a year more",
			dt->cost_plus / hl_show_dt(1.0), currency(c));
	if (isinf(dt->cost_minus))
		fprintf(fp, "; any smaller ΔTmin leaves no utility able to "
			"serve the process");
	else if (differ_shown(dt->cost_minus / hl_show_dt(1.0),
			      dt->cost_plus / hl_show_dt(1.0), 0))
		fprintf(fp, " (%.0f less per %s less)",
			dt->cost_minus / hl_show_dt(1.0), degree_word());
}

void
hl_sensitivity_text(FILE *fp, const hl_case *c, const hl_cascade *cas,
		    const hl_sensitivity *sv)
{
	text_headline(fp, c, cas);
	text_first(fp, c, sv);
	text_table(fp, c, sv);
	double f = deriv_factor(HL_SENS_DTMIN);

	fprintf(fp, "\nΔTmin: each %s more needs %.2f %s more hot and %.2f "
		"%s more cold utility", degree_word(), f * sv->dt.hot_plus,
		HL_SYM_Q, f * sv->dt.cold_plus, HL_SYM_Q);
	if (sv->dt.kink)
		fprintf(fp, " (%.2f and %.2f per %s less: a pinch changes "
			"here)", f * sv->dt.hot_minus, f * sv->dt.cold_minus,
			degree_word());
	if (has_cost(sv, sv->dt.cost_minus, sv->dt.cost_plus))
		text_dtmin_cost(fp, c, &sv->dt);
	fprintf(fp, ".\n");
	text_utilities(fp, c, sv);
	fprintf(fp, "\nWith every datum off by its tolerance at once, in the "
		"worst direction (re-solved at\nthe two corners of the "
		"tolerance box where each target is largest and smallest):\n");
	text_band(fp, "QHmin", &sv->hot);
	text_band(fp, "QCmin", &sv->cold);
	if (band_differs(&sv->hot) || band_differs(&sv->cold))
		fprintf(fp, "The first-order estimate differs from the re-solved "
			"range: within the tolerances cp\nand temperature errors "
			"compound, or the pinch moves to another boundary; the\n"
			"re-solved range is the one to quote.\n");
	text_notes(fp, c, sv);
	fprintf(fp, "\nScreening estimates: measurement plans, detailed design "
		"and the safety review of each\nmatch belong to qualified "
		"engineers under local codes.\n");
}

/* cost-minus and cost-plus where known: numbers, "inf" or "-inf". */
static int
xml_cost(xmlTextWriterPtr w, const hl_sensitivity *sv, double minus,
	 double plus)
{
	int rc = 0;

	if (sv->cost == HL_SENS_COST_NONE)
		return 0;
	if (!isnan(minus))
		rc |= hl_xml_num(w, "cost-minus", minus);
	if (!isnan(plus))
		rc |= hl_xml_num(w, "cost-plus", plus);
	return rc;
}

static int
xml_urow(xmlTextWriterPtr w, const hl_case *c, const hl_sensitivity *sv,
	 const hl_sens_urow *u)
{
	int rc = 0;

	rc |= xmlTextWriterStartElement(w, BAD_CAST "sensitivity-utility");
	rc |= hl_xml_str(w, "utility", c->util[u->util].name);
	rc |= hl_xml_str(w, "quantity", hl_sensitivity_quantity_name(u->q));
	rc |= hl_xml_num(w, "value", u->value);
	rc |= hl_xml_num(w, "tolerance", u->tol);
	rc |= xml_cost(w, sv, u->cost_minus, u->cost_plus);
	rc |= xmlTextWriterEndElement(w);
	return rc;
}

/* Attributes shared by <sensitivity> and <sensitivity-dtmin>. */
static int
xml_derivs(xmlTextWriterPtr w, const hl_sensitivity *sv, const hl_sens_row *r)
{
	int rc = 0;

	rc |= hl_xml_num(w, "hot-minus", r->hot_minus);
	rc |= hl_xml_num(w, "hot-plus", r->hot_plus);
	rc |= hl_xml_num(w, "cold-minus", r->cold_minus);
	rc |= hl_xml_num(w, "cold-plus", r->cold_plus);
	rc |= xml_cost(w, sv, r->cost_minus, r->cost_plus);
	if (r->kink)
		rc |= hl_xml_str(w, "pinch-change", "yes");
	return rc;
}

static int
xml_row(xmlTextWriterPtr w, const hl_case *c, const hl_sensitivity *sv,
	const hl_sens_row *r)
{
	int rc = 0;

	rc |= xmlTextWriterStartElement(w, BAD_CAST "sensitivity");
	rc |= hl_xml_str(w, "stream", c->stream[r->stream].name);
	rc |= hl_xml_str(w, "quantity", hl_sensitivity_quantity_name(r->q));
	if (!is_temperature(r->q) && c->stream[r->stream].nseg > 1)
		rc |= hl_xml_int(w, "segment", (long)r->segment + 1);
	rc |= hl_xml_num(w, "value", r->value);
	rc |= hl_xml_num(w, "tolerance", r->tol);
	rc |= xml_derivs(w, sv, r);
	rc |= hl_xml_num(w, "hot-down", r->hot_down);
	rc |= hl_xml_num(w, "hot-up", r->hot_up);
	rc |= hl_xml_num(w, "cold-down", r->cold_down);
	rc |= hl_xml_num(w, "cold-up", r->cold_up);
	rc |= hl_xml_int(w, "rank", (long)r->rank);
	rc |= xmlTextWriterEndElement(w);
	return rc;
}

static int
xml_band(xmlTextWriterPtr w, const char *target, const hl_sens_band *b)
{
	int rc = 0;

	rc |= xmlTextWriterStartElement(w, BAD_CAST "sensitivity-band");
	rc |= hl_xml_str(w, "target", target);
	rc |= hl_xml_num(w, "nominal", b->nominal);
	rc |= hl_xml_num(w, "low", b->low);
	rc |= hl_xml_num(w, "high", b->high);
	rc |= hl_xml_num(w, "linear-low", b->lin_low);
	rc |= hl_xml_num(w, "linear-high", b->lin_high);
	rc |= xmlTextWriterEndElement(w);
	return rc;
}

static const char *
cost_basis_name(hl_sens_cost_basis b)
{
	return b == HL_SENS_COST_SINGLE ? "single" :
	       b == HL_SENS_COST_LEVELS ? "levels" : "none";
}

int
hl_sensitivity_xml(xmlTextWriterPtr w, const hl_case *c,
		   const hl_sensitivity *sv)
{
	size_t i;
	int rc = 0;

	rc |= xmlTextWriterStartElement(w, BAD_CAST "sensitivity-summary");
	rc |= hl_xml_num(w, "dtmin", sv->dtmin);
	rc |= hl_xml_int(w, "boundaries", (long)sv->nactive);
	rc |= hl_xml_str(w, "cost", cost_basis_name(sv->cost));
	rc |= hl_xml_int(w, "collapsed", (long)sv->collapsed);
	rc |= xmlTextWriterEndElement(w);
	for (i = 0; i < sv->nrow && rc >= 0; i++)
		rc |= xml_row(w, c, sv, &sv->row[i]);
	rc |= xmlTextWriterStartElement(w, BAD_CAST "sensitivity-dtmin");
	rc |= hl_xml_num(w, "value", sv->dt.value);
	rc |= xml_derivs(w, sv, &sv->dt);
	rc |= xmlTextWriterEndElement(w);
	for (i = 0; i < sv->nurow && rc >= 0; i++)
		rc |= xml_urow(w, c, sv, &sv->urow[i]);
	rc |= xml_band(w, "hot", &sv->hot);
	rc |= xml_band(w, "cold", &sv->cold);
	return rc < 0 ? -1 : 0;
}

static void
csv_row(FILE *fp, const hl_case *c, const hl_sens_row *r)
{
	if (r->q == HL_SENS_DTMIN) {
		fprintf(fp, ",,dtmin,");
	} else {
		fprintf(fp, "%zu,", r->rank);
		hl_csv_text(fp, c->stream[r->stream].name);
		fprintf(fp, ",%s,", hl_sensitivity_quantity_name(r->q));
		if (!is_temperature(r->q))
			fprintf(fp, "%zu", r->segment + 1);
	}
	hl_csv_value(fp, r->value);
	hl_csv_value(fp, r->q == HL_SENS_DTMIN ? NAN : r->tol);
	hl_csv_value(fp, r->hot_minus);
	hl_csv_value(fp, r->hot_plus);
	hl_csv_value(fp, r->cold_minus);
	hl_csv_value(fp, r->cold_plus);
	hl_csv_value(fp, r->q == HL_SENS_DTMIN ? NAN : r->hot_down);
	hl_csv_value(fp, r->q == HL_SENS_DTMIN ? NAN : r->hot_up);
	hl_csv_value(fp, r->q == HL_SENS_DTMIN ? NAN : r->cold_down);
	hl_csv_value(fp, r->q == HL_SENS_DTMIN ? NAN : r->cold_up);
	hl_csv_value(fp, r->cost_minus);
	hl_csv_value(fp, r->cost_plus);
	fprintf(fp, ",%d,\n", r->kink);
}

/* A utility's temperature: the targets do not move (zero derivatives and
 * moves, no pinch change), the cost may; no rank, segment or stream. */
static void
csv_urow(FILE *fp, const hl_case *c, const hl_sens_urow *u)
{
	int i;

	fprintf(fp, ",,%s,", hl_sensitivity_quantity_name(u->q));
	hl_csv_value(fp, u->value);
	hl_csv_value(fp, u->tol);
	for (i = 0; i < 8; i++)
		hl_csv_value(fp, 0.0);
	hl_csv_value(fp, u->cost_minus);
	hl_csv_value(fp, u->cost_plus);
	fprintf(fp, ",0,");
	hl_csv_text(fp, c->util[u->util].name);
	fputc('\n', fp);
}

void
hl_sensitivity_csv(FILE *fp, const hl_case *c, const hl_sensitivity *sv)
{
	size_t i;

	fprintf(fp, "rank,stream,quantity,segment,value,tolerance,hot_minus,"
		"hot_plus,cold_minus,cold_plus,hot_down,hot_up,cold_down,"
		"cold_up,cost_minus,cost_plus,pinch_change,utility\n");
	for (i = 0; i < sv->nrow; i++)
		csv_row(fp, c, &sv->row[i]);
	csv_row(fp, c, &sv->dt);
	for (i = 0; i < sv->nurow; i++)
		csv_urow(fp, c, &sv->urow[i]);
}
