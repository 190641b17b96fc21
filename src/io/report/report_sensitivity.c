/* report_sensitivity.c - which measurements matter most: the ranked
 * sensitivity of the energy targets (the numbers of `heatloom targets
 * --sensitivity`). */
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "display.h"
#include "report_sec.h"

#define B 64
/* Rows of the ranking shown; the rest are in the XML and CSV results. */
#define TOP 12
/* Moves below this (kW) print as no effect. */
#define SHOWN_ZERO 0.05

static int
present(const hl_report_data *d)
{
	return d->sv != NULL || d->sv_note != NULL;
}

static int
is_temperature(hl_sens_quantity q)
{
	return q == HL_SENS_SUPPLY || q == HL_SENS_TARGET;
}

void
hl_report_sens_datum(char *buf, size_t size, const hl_case *c,
		     const hl_sens_row *row)
{
	const hl_stream *s = &c->stream[row->stream];
	const char *q = row->q == HL_SENS_SUPPLY ? "supply temperature" :
			row->q == HL_SENS_TARGET ? "target temperature" :
			hl_sensitivity_quantity_name(row->q);

	if (!is_temperature(row->q) && s->nseg > 1)
		snprintf(buf, size, "%s, segment %zu of %zu", q,
			 row->segment + 1, s->nseg);
	else
		snprintf(buf, size, "%s", q);
}

static void
value_text(char *buf, size_t size, const hl_sens_row *row)
{
	if (is_temperature(row->q))
		hl_report_fmt_temp(buf, size, row->value);
	else if (row->q == HL_SENS_CP)
		snprintf(buf, size, "%.4g" HL_NBSP "%s",
			 hl_show_cp(row->value), HL_SYM_CP);
	else
		hl_report_fmt_duty(buf, size, row->value);
}

void
hl_report_sens_tol(char *buf, size_t size, const hl_sens_row *row)
{
	char a[B];

	if (is_temperature(row->q))
		snprintf(buf, size, "±%s", hl_report_fmt_dt(a, B, row->tol));
	else
		snprintf(buf, size, "±%.3g" HL_NBSP "%%", row->value > 0.0 ?
			 100.0 * row->tol / row->value : 0.0);
}

/* "±37.2 kW" when both ways alike, else "−a / +b kW"; "none" below the
 * shown zero. */
static void
move_text(char *buf, size_t size, double down, double up)
{
	char a[B / 2], b[B / 2];

	if (down < SHOWN_ZERO && up < SHOWN_ZERO) {
		snprintf(buf, size, "none");
		return;
	}
	hl_report_fmt_qty(a, sizeof a, hl_show_q(down));
	hl_report_fmt_qty(b, sizeof b, hl_show_q(up));
	if (strcmp(a, b) == 0)
		snprintf(buf, size, "±%s", a);
	else
		snprintf(buf, size, "%s%s / +%s", HL_MINUS, a, b);
}

/* The case has a utility cost (its derivatives are known). */
static int
has_cost(const hl_sensitivity *sv)
{
	return sv->cost != HL_SENS_COST_NONE;
}

void
hl_report_sens_cost_range(double minus, double plus, double tol, double *down,
			  double *up)
{
	double at_up, at_down;

	if (isnan(minus) || isnan(plus)) {
		*down = *up = NAN;
		return;
	}
	if (tol <= 0.0) {
		*down = *up = 0.0;
		return;
	}
	at_up = plus * tol;
	at_down = -minus * tol;
	*down = fmax(0.0, fmax(-at_up, -at_down));
	*up = fmax(0.0, fmax(at_up, at_down));
}

/* "±96 000", "−300 / +∞", "none" below a unit, "unknown". */
static void
cost_move_text(char *buf, size_t size, double minus, double plus, double tol)
{
	char a[B / 2], b[B / 2];
	double down, up;

	hl_report_sens_cost_range(minus, plus, tol, &down, &up);
	if (isnan(down)) {
		snprintf(buf, size, "unknown");
		return;
	}
	if (down < 0.5 && up < 0.5) {
		snprintf(buf, size, "none");
		return;
	}
	if (isinf(down))
		snprintf(a, sizeof a, "∞");
	else
		hl_report_fmt_sig(a, sizeof a, down, 3, 0);
	if (isinf(up))
		snprintf(b, sizeof b, "∞");
	else
		hl_report_fmt_sig(b, sizeof b, up, 3, 0);
	if (strcmp(a, b) == 0)
		snprintf(buf, size, "±%s", a);
	else
		snprintf(buf, size, "%s%s / +%s", down < 0.5 ? "" : HL_MINUS,
			 down < 0.5 ? "0" : a, up < 0.5 ? "0" : b);
}

static int
any_infinite(const hl_sensitivity *sv)
{
	size_t i;

	for (i = 0; i < sv->nrow; i++)
		if (isinf(sv->row[i].cost_minus) || isinf(sv->row[i].cost_plus))
			return 1;
	for (i = 0; i < sv->nurow; i++)
		if (isinf(sv->urow[i].cost_minus) ||
		    isinf(sv->urow[i].cost_plus))
			return 1;
	return 0;
}

static void
rank_row(hl_report *r, const hl_sens_row *row)
{
	char v[2 * B];

	hl_report_row_start(r, row->kink ? "kink" : NULL);
	snprintf(v, sizeof v, "%zu", row->rank);
	hl_report_cell_num(r, v);
	hl_report_cell(r, r->d->c->stream[row->stream].name);
	hl_report_sens_datum(v, sizeof v, r->d->c, row);
	hl_report_cell(r, v);
	value_text(v, sizeof v, row);
	hl_report_cell_num(r, v);
	hl_report_sens_tol(v, sizeof v, row);
	hl_report_cell_num(r, v);
	move_text(v, sizeof v, row->hot_down, row->hot_up);
	hl_report_cell_num(r, v);
	move_text(v, sizeof v, row->cold_down, row->cold_up);
	hl_report_cell_num(r, v);
	if (has_cost(r->d->sv)) {
		cost_move_text(v, sizeof v, row->cost_minus, row->cost_plus,
			       row->tol);
		hl_report_cell_num(r, v);
	}
	hl_report_row_end(r);
}

static void
rank_table(hl_report *r)
{
	static const char *const head[] = { "Rank", "Stream", "Datum",
		"Value", "Tolerance", "QHmin moves", "QCmin moves",
		"Utility cost moves" };
	const char *unit[] = { "", "", "", "", "", "kW", "kW", "" };
	static const int num[] = { 1, 0, 0, 1, 1, 1, 1, 1 };
	const hl_sensitivity *sv = r->d->sv;
	size_t i, n = sv->nrow < TOP ? sv->nrow : TOP;
	char cap[256], cur[B];

	snprintf(cur, sizeof cur, "%s/yr", hl_report_currency(r->d->c));
	unit[7] = cur;
	snprintf(cap, sizeof cap, "The %zu stream data with the largest effect "
		 "on the %s within their tolerances, largest first.", n,
		 has_cost(sv) ? "utility cost" : "targets");
	hl_report_table_start(r, "data ranking", cap, has_cost(sv) ? 8 : 7,
			      head, unit, num);
	for (i = 0; i < n; i++)
		rank_row(r, &sv->row[sv->rank[i]]);
	hl_report_table_end(r);
}

static void
utility_row(hl_report *r, const hl_sens_urow *u)
{
	char v[2 * B], a[B];

	hl_report_row_start(r, NULL);
	hl_report_cell(r, r->d->c->util[u->util].name);
	hl_report_cell(r, u->q == HL_SENS_LEVEL ? "level" : u->q ==
		       HL_SENS_SUPPLY ? "supply temperature" :
		       "target temperature");
	hl_report_cell_num(r, hl_report_fmt_temp(v, sizeof v, u->value));
	snprintf(v, sizeof v, "±%s", hl_report_fmt_dt(a, B, u->tol));
	hl_report_cell_num(r, v);
	cost_move_text(v, sizeof v, u->cost_minus, u->cost_plus, u->tol);
	hl_report_cell_num(r, v);
	hl_report_row_end(r);
}

/* The utilities' own temperatures: the targets do not depend on them, the
 * cost of the utility mix may. */
static void
utility_table(hl_report *r)
{
	static const char *const head[] = { "Utility", "Datum", "Value",
		"Tolerance", "Utility cost moves" };
	const char *unit[] = { "", "", "", "", "" };
	static const int num[] = { 0, 0, 1, 1, 1 };
	const hl_sensitivity *sv = r->d->sv;
	char cur[B];
	size_t i;

	if (sv->nurow == 0 || !has_cost(sv))
		return;
	snprintf(cur, sizeof cur, "%s/yr", hl_report_currency(r->d->c));
	unit[4] = cur;
	hl_report_table_start(r, "data utility-temperatures", "The utilities' "
			      "temperatures: the energy targets do not depend "
			      "on them, the cost of the utility mix may.", 5,
			      head, unit, num);
	for (i = 0; i < sv->nurow; i++)
		utility_row(r, &sv->urow[i]);
	hl_report_table_end(r);
}

/* dQ/dΔTmin, or "a below / b above" where the pinch changes. */
static void
deriv_text(char *buf, size_t size, double minus, double plus, int kink)
{
	char a[B / 2], b[B / 2];

	if (kink)
		snprintf(buf, size, "%s below, %s above",
			 hl_report_fmt_sig(a, sizeof a, hl_show_cp(minus), 3,
					   2),
			 hl_report_fmt_sig(b, sizeof b, hl_show_cp(plus), 3,
					   2));
	else
		hl_report_fmt_sig(buf, size, hl_show_cp(plus), 3, 2);
}

static void
band_row(hl_report *r, const char *name, const hl_sens_band *b,
	 double minus, double plus, int kink, const char *id)
{
	char v[B];

	hl_html_start(r->h, "tr", NULL);
	hl_html_attr(r->h, "id", id);
	hl_report_cell(r, name);
	hl_report_cell_num(r, hl_report_fmt_qty(v, B, hl_show_q(b->nominal)));
	hl_report_cell_num(r, hl_report_fmt_qty(v, B, hl_show_q(b->low)));
	hl_report_cell_num(r, hl_report_fmt_qty(v, B, hl_show_q(b->high)));
	deriv_text(v, B, minus, plus, kink);
	hl_report_cell_num(r, v);
	hl_report_row_end(r);
}

static void
band_table(hl_report *r)
{
	static const char *const head[] = { "Target", "As given", "Lowest",
		"Highest", "Per K of ΔTmin" };
	static const char *const unit[] = { "", "kW", "kW", "kW", "kW/K" };
	static const int num[] = { 0, 1, 1, 1, 1 };
	const hl_sensitivity *sv = r->d->sv;

	hl_report_table_start(r, "data bands", "Each target with every datum "
			      "off by its tolerance at once (lowest and "
			      "highest, re-solved), and its change per K of "
			      "ΔTmin.", 5, head, unit, num);
	band_row(r, "Minimum hot utility QHmin", &sv->hot, sv->dt.hot_minus,
		 sv->dt.hot_plus, sv->dt.kink, "v-hot");
	band_row(r, "Minimum cold utility QCmin", &sv->cold, sv->dt.cold_minus,
		 sv->dt.cold_plus, sv->dt.kink, "v-cold");
	hl_report_table_end(r);
}

static void
write_sensitivity(hl_report *r)
{
	const hl_report_data *d = r->d;
	char a[B];

	if (d->sv == NULL) {
		hl_report_missing(r, "No sensitivity", d->sv_note);
		return;
	}
	hl_html_start(r->h, "p", NULL);
	hl_html_textf(r->h, "The targets rest on the stream data, and not all "
		      "data weigh alike: a datum near the pinch moves the "
		      "targets kW for kW, one far from it may not move them at "
		      "all. Each datum below is taken as uncertain by its "
		      "tolerance (the stream's own cp_tol and t_tol where the "
		      "table gives them, else ±%.3g" HL_NBSP "%% on cp and "
		      "duty and ±%s on temperatures) and ranked by how far it "
		      "can move %s. Measure the first rows again before "
		      "relying on the targets.",
		      100.0 * d->c->set.cp_tol,
		      hl_report_fmt_dt(a, B, d->c->set.t_tol), has_cost(d->sv) ?
		      "the yearly utility cost (the least-cost mix of the "
		      "utility levels, re-chosen as the datum moves)" :
		      "the minimum hot and cold utility");
	hl_html_end(r->h);
	hl_report_sens_chart(r, TOP);
	rank_table(r);
	utility_table(r);
	band_table(r);
	hl_report_note(r, "Moves are first order (exact derivatives from the "
		       "active pinch times the tolerance); the bands are "
		       "re-solved at the corners of the tolerance box and so "
		       "hold for all data off at once. A marked row is a "
		       "datum at which the pinch changes: its effect differs "
		       "up and down.");
	if (any_infinite(d->sv))
		hl_report_note(r, "∞: the datum sits at the edge of what the "
			       "utilities can reach; a step that way, however "
			       "small, leaves no utility able to serve the "
			       "process, so no finite cost can be given and "
			       "the ranking puts it first. Check it first.");
}

const hl_report_section hl_report_sec_sensitivity = {
	"sensitivity", "Sensitivity to the stream data", present,
	write_sensitivity
};
