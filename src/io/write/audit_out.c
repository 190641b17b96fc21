/* audit_out.c - the audit as XML, CSV and an SVG chart. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "audit_out.h"
#include "display.h"
#include "result_xml.h"

/* A number that may be undefined: left out when NaN or infinite. */
static int
num_opt(xmlTextWriterPtr w, const char *name, double v)
{
	return isfinite(v) ? hl_xml_num(w, name, v) : 0;
}

static int
audit_attrs(xmlTextWriterPtr w, const hl_case *c, const hl_audit *a)
{
	int rc = 0;

	rc |= hl_xml_num(w, "dtmin", a->dtmin);
	rc |= hl_xml_num(w, "hot-utility-now", a->net->hot_now);
	rc |= hl_xml_num(w, "cold-utility-now", a->net->cold_now);
	rc |= hl_xml_num(w, "hot-utility-target", a->hot_target);
	rc |= hl_xml_num(w, "cold-utility-target", a->cold_target);
	rc |= hl_xml_num(w, "saving", a->saving);
	rc |= hl_xml_num(w, "saving-cold", a->saving_cold);
	rc |= hl_xml_num(w, "saving-cost", a->saving_cost);
	rc |= hl_xml_num(w, "utility-cost-now", a->net->cost_now);
	rc |= hl_xml_num(w, "utility-cost-target", a->cost_target);
	rc |= hl_xml_num(w, "price-hot", a->price_hot);
	rc |= hl_xml_num(w, "price-cold", a->price_cold);
	rc |= hl_xml_num(w, "violations", a->violations);
	rc |= hl_xml_num(w, "upward", a->upward);
	rc |= hl_xml_str(w, "pinch", a->pinch_kind == 'P' ? "pinch" :
			 a->pinch_kind == 'B' ? "bottom" : "top");
	rc |= hl_xml_num(w, "pinch-shifted", a->pinch);
	rc |= hl_xml_num(w, "pinch-hot", a->pinch_hot);
	rc |= hl_xml_num(w, "pinch-cold", a->pinch_cold);
	rc |= num_opt(w, "dtmin-now", a->dtmin_now);
	rc |= hl_xml_str(w, "basis", hl_exchanger_type_name(c->set.exchanger));
	rc |= hl_xml_num(w, "area-existing", a->area_existing);
	if (a->have_now)
		rc |= hl_xml_num(w, "area-target-now", a->area_target_now);
	rc |= num_opt(w, "alpha", a->alpha);
	if (a->note[0] != '\0')
		rc |= hl_xml_str(w, "note", a->note);
	return rc;
}

static int
side_attrs(xmlTextWriterPtr w, const hl_case *c, const hl_side *s,
	   const char *side)
{
	char n[32];
	int rc = 0;

	rc |= hl_xml_str(w, side, hl_existing_side_name(c, s));
	snprintf(n, sizeof n, "%s-in", side);
	rc |= num_opt(w, n, s->t_in);
	snprintf(n, sizeof n, "%s-out", side);
	rc |= num_opt(w, n, s->t_out);
	snprintf(n, sizeof n, "%s-share", side);
	rc |= hl_xml_num(w, n, s->share);
	return rc;
}

static int
exchanger(xmlTextWriterPtr w, const hl_case *c, const hl_audit *a, size_t i)
{
	const hl_existing_unit *u = &a->net->unit[i];
	int rc = 0;

	rc |= xmlTextWriterStartElement(w, BAD_CAST "exchanger");
	rc |= hl_xml_str(w, "id", u->name);
	if (u->line > 0)
		rc |= hl_xml_int(w, "line", u->line);
	rc |= hl_xml_str(w, "role", hl_existing_role_name(u->role));
	if (u->implied)
		rc |= hl_xml_str(w, "implied", "yes");
	rc |= hl_xml_num(w, "duty", u->duty);
	rc |= side_attrs(w, c, &u->hot, "hot");
	rc |= side_attrs(w, c, &u->cold, "cold");
	if (!isnan(u->lmtd)) {
		rc |= hl_xml_num(w, "u", u->u);
		rc |= hl_xml_num(w, "lmtd", u->lmtd);
		rc |= hl_xml_num(w, "ft", u->f);
		rc |= hl_xml_int(w, "shells", u->shells);
		rc |= hl_xml_num(w, "approach", u->approach);
		rc |= hl_xml_str(w, "type", hl_exchanger_type_name(u->type));
		if (u->parallel > 1)
			rc |= hl_xml_int(w, "parallel", u->parallel);
	}
	if (!isnan(u->area)) {
		rc |= hl_xml_num(w, "area", u->area);
		rc |= hl_xml_str(w, "area-estimated", u->area_estimated ?
				 "yes" : "no");
	}
	rc |= num_opt(w, "vertical-area", a->vertical[i]);
	rc |= num_opt(w, "alpha", a->unit_alpha[i]);
	rc |= xmlTextWriterEndElement(w);
	return rc;
}

static int
violation(xmlTextWriterPtr w, const hl_audit *a, size_t i)
{
	const hl_violation *v = &a->viol[i];
	int rc = 0;

	rc |= xmlTextWriterStartElement(w, BAD_CAST "violation");
	rc |= hl_xml_str(w, "exchanger", a->net->unit[v->unit].name);
	rc |= hl_xml_str(w, "kind", hl_violation_kind_name(v->kind));
	rc |= hl_xml_num(w, "duty", v->duty);
	rc |= hl_xml_num(w, "saving", v->saving);
	rc |= hl_xml_int(w, "rank", (long)i + 1);
	rc |= xmlTextWriterEndElement(w);
	return rc;
}

static int
retrofit(xmlTextWriterPtr w, const hl_retrofit *r)
{
	size_t i;
	int rc = 0;

	rc |= xmlTextWriterStartElement(w, BAD_CAST "retrofit");
	rc |= num_opt(w, "alpha", r->alpha);
	rc |= num_opt(w, "shell-area", r->shell_area);
	rc |= num_opt(w, "shell-cost", r->shell_cost);
	for (i = 0; i < r->n && rc >= 0; i++) {
		const hl_retrofit_point *p = &r->pt[i];

		rc |= xmlTextWriterStartElement(w, BAD_CAST "point");
		rc |= hl_xml_num(w, "hot-utility", p->hot_utility);
		rc |= hl_xml_num(w, "cold-utility", p->cold_utility);
		rc |= hl_xml_num(w, "dtmin", p->dtmin);
		rc |= hl_xml_num(w, "area-target", p->area_target);
		if (!isnan(p->area_sweep))
			rc |= hl_xml_num(w, "area-sweep", p->area_sweep);
		rc |= hl_xml_num(w, "area-retrofit", p->area_retrofit);
		rc |= hl_xml_num(w, "new-area", p->new_area);
		rc |= num_opt(w, "shell-area", p->shell_area);
		rc |= num_opt(w, "shell-cost", p->shell_cost);
		rc |= hl_xml_num(w, "investment", p->investment);
		rc |= hl_xml_num(w, "saving", p->saving);
		rc |= num_opt(w, "payback", p->payback);
		rc |= xmlTextWriterEndElement(w);
	}
	for (i = 0; i < r->ncurve && rc >= 0; i++) {
		rc |= xmlTextWriterStartElement(w, BAD_CAST "area-target");
		rc |= hl_xml_num(w, "dtmin", r->curve[i].dtmin);
		rc |= hl_xml_num(w, "hot-utility", r->curve[i].hot_utility);
		rc |= hl_xml_num(w, "area", r->curve[i].area);
		rc |= xmlTextWriterEndElement(w);
	}
	rc |= xmlTextWriterEndElement(w);
	return rc;
}

static int
warning(xmlTextWriterPtr w, const hl_error *e)
{
	int rc = 0;

	rc |= xmlTextWriterStartElement(w, BAD_CAST "warning");
	if (e->file[0] != '\0')
		rc |= hl_xml_str(w, "file", e->file);
	if (e->line > 0)
		rc |= hl_xml_int(w, "line", e->line);
	rc |= hl_xml_str(w, "text", e->text);
	rc |= xmlTextWriterEndElement(w);
	return rc;
}

int
hl_audit_xml(xmlTextWriterPtr w, const hl_case *c, const hl_audit *a,
	     const hl_retrofit *r)
{
	size_t i;
	int rc = 0;

	rc |= xmlTextWriterStartElement(w, BAD_CAST "audit");
	rc |= audit_attrs(w, c, a);
	for (i = 0; i < a->net->nunit && rc >= 0; i++)
		rc |= exchanger(w, c, a, i);
	for (i = 0; i < a->nviol && rc >= 0; i++)
		rc |= violation(w, a, i);
	if (r != NULL && rc >= 0)
		rc |= retrofit(w, r);
	for (i = 0; i < a->net->nwarn && rc >= 0; i++)
		rc |= warning(w, &a->net->warn[i]);
	rc |= xmlTextWriterEndElement(w);
	return rc < 0 ? -1 : 0;
}

void
hl_audit_csv(FILE *fp, const hl_retrofit *r)
{
	static const char *const name[] = { "hot_utility", "cold_utility",
		"dtmin", "area_target", "area_retrofit", "new_area" };
	static const hl_qty qty[] = { HL_QTY_POWER, HL_QTY_POWER,
		HL_QTY_DTEMP, HL_QTY_AREA, HL_QTY_AREA, HL_QTY_AREA };
	char h[64];
	size_t i, k;

	for (k = 0; k < sizeof qty / sizeof qty[0]; k++)
		fprintf(fp, "%s,", hl_show_header(h, sizeof h, name[k],
						  qty[k]));
	fprintf(fp, "investment,saving,payback\n");
	for (i = 0; r != NULL && i < r->n; i++) {
		const hl_retrofit_point *p = &r->pt[i];
		double v[] = { hl_show_q(p->hot_utility),
			       hl_show_q(p->cold_utility), hl_show_dt(p->dtmin),
			       hl_show_a(p->area_target),
			       hl_show_a(p->area_retrofit),
			       hl_show_a(p->new_area), p->investment, p->saving,
			       p->payback };

		for (k = 0; k < sizeof v / sizeof v[0]; k++) {
			char b[64] = "";

			if (isfinite(v[k]))
				hl_format_number(b, sizeof b, v[k]);
			fprintf(fp, "%s%s", k ? "," : "", b);
		}
		fputc('\n', fp);
	}
}

static int
add_curves(hl_svg_chart *ch, const hl_retrofit *r)
{
	hl_svg_style target = { HL_SVG_GREEN, HL_SVG_SOLID, 2.4,
				HL_SVG_MARK_NONE, HL_SVG_STEP_NONE };
	hl_svg_style retro = { HL_SVG_BLUE, HL_SVG_DASHED, 2.4,
			       HL_SVG_MARK_CIRCLE, HL_SVG_STEP_NONE };
	size_t n = r->ncurve > r->n ? r->ncurve : r->n, i;
	double *x = malloc((n + 1) * sizeof *x), *y = malloc((n + 1) * sizeof *y);
	int rc = 0;

	if (x == NULL || y == NULL) {
		free(x);
		free(y);
		return -1;
	}
	for (i = 0; i < r->ncurve; i++) {
		x[i] = hl_show_q(r->curve[i].hot_utility);
		y[i] = hl_show_a(r->curve[i].area);
	}
	rc |= hl_svg_chart_add_series(ch, "area target over ΔTmin", x, y,
				      r->ncurve, &target);
	for (i = 0; i < r->n; i++) {
		x[i] = hl_show_q(r->pt[i].hot_utility);
		y[i] = hl_show_a(r->pt[i].area_retrofit);
	}
	rc |= hl_svg_chart_add_series(ch, "retrofit at constant α", x, y,
				      r->n, &retro);
	free(x);
	free(y);
	return rc;
}

static hl_svg_chart *
chart_create(const hl_case *c, const hl_audit *a)
{
	const char *src = c->source ? c->source : "case", *slash;
	hl_svg_chart *ch;
	char sub[256], xl[64], yl[64], dt[64], sv[64];

	snprintf(xl, sizeof xl, "Hot utility (%s)", HL_SYM_Q);
	snprintf(yl, sizeof yl, "%s area (%s)", c->set.exchanger ==
		 HL_EXCH_SHELL_TUBE ? "Shell-and-tube" : "Counterflow",
		 HL_SYM_A);
	ch = hl_svg_chart_create("Existing network: area against energy", xl,
				 yl);
	if (ch == NULL)
		return NULL;
	slash = strrchr(src, '/');
	snprintf(dt, sizeof dt, "ΔTmin %.1f %s", hl_show_dt(a->dtmin),
		 HL_SYM_DT);
	snprintf(sv, sizeof sv, "saving %.0f %s", hl_show_q(a->saving),
		 HL_SYM_Q);
	if (isnan(a->alpha))
		snprintf(sub, sizeof sub, "%s · %s · %s",
			 slash ? slash + 1 : src, dt, sv);
	else
		snprintf(sub, sizeof sub, "%s · %s · %s · α = %.2f",
			 slash ? slash + 1 : src, dt, sv, a->alpha);
	if (hl_svg_chart_set_subtitle(ch, sub) < 0 ||
	    hl_svg_chart_set_footnote(ch, hl_svg_caution) < 0) {
		hl_svg_chart_free(ch);
		return NULL;
	}
	return ch;
}

hl_svg_chart *
hl_audit_chart(const hl_case *c, const hl_audit *a, const hl_retrofit *r)
{
	hl_svg_chart *ch = chart_create(c, a);
	char lab[96];
	int rc = 0;

	if (ch == NULL)
		return NULL;
	if (r != NULL)
		rc |= add_curves(ch, r);
	snprintf(lab, sizeof lab, "today (%.0f %s)",
		 hl_show_a(a->area_existing), HL_SYM_A);
	rc |= hl_svg_chart_add_marker(ch, hl_show_q(a->net->hot_now),
				      hl_show_a(a->area_existing),
				      HL_SVG_MARK_SQUARE, HL_SVG_VERMILION,
				      lab, HL_SVG_START);
	if (r != NULL && r->n > 0) {
		const hl_retrofit_point *t = &r->pt[r->n - 1];

		/* Short and above right: between the target curve and the
		 * retrofit curve (the subtitle gives the ΔTmin). */
		rc |= hl_svg_chart_add_marker(ch, hl_show_q(t->hot_utility),
					      hl_show_a(t->area_target),
					      HL_SVG_MARK_DIAMOND,
					      HL_SVG_BLACK, NULL, HL_SVG_START);
		rc |= hl_svg_chart_add_text(ch, hl_show_q(t->hot_utility),
					    hl_show_a(t->area_target),
					    "targets", HL_SVG_START, 10.0, -10.0);
	}
	hl_svg_chart_set_yrange(ch, 0.0, NAN);
	if (rc < 0) {
		hl_svg_chart_free(ch);
		return NULL;
	}
	return ch;
}
