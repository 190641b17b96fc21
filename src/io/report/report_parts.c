/* report_parts.c - paragraphs, tables and figures of the report. */
#include <stdio.h>
#include <string.h>

#include "display.h"
#include "report_sec.h"

const char *
hl_report_currency(const hl_case *c)
{
	return c->set.currency ? c->set.currency : "";
}

const char *
hl_report_base(const char *path)
{
	const char *slash = path ? strrchr(path, '/') : NULL;

	return slash ? slash + 1 : path;
}

const char *
hl_report_case_name(const hl_case *c)
{
	return hl_report_base(c->source ? c->source : "case");
}

void
hl_report_para(hl_report *r, const char *text)
{
	hl_html_elem(r->h, "p", NULL, text);
}

void
hl_report_note(hl_report *r, const char *text)
{
	hl_html_elem(r->h, "p", "note", text);
}

void
hl_report_missing(hl_report *r, const char *what, const char *why)
{
	const char *text = why ? why : "not computed";
	size_t n = strlen(text);

	hl_html_start(r->h, "p", "missing");
	hl_html_textf(r->h, "%s: %s%s", what, text, n > 0 &&
		      text[n - 1] == '.' ? "" : ".");
	hl_html_end(r->h);
}

static void
caption(hl_report *r, const char *kind, int n, const char *text)
{
	hl_html_start(r->h, "span", "label");
	hl_html_textf(r->h, "%s %d.", kind, n);
	hl_html_end(r->h);
	hl_html_textf(r->h, " %s", text);
}

void
hl_report_table_start(hl_report *r, const char *cls, const char *cap,
		      size_t ncol, const char *const *head,
		      const char *const *unit, const int *num)
{
	size_t i;
	char u[64];

	hl_html_start(r->h, "table", cls);
	if (cap != NULL) {
		hl_html_start(r->h, "caption", NULL);
		caption(r, "Table", ++r->tables, cap);
		hl_html_end(r->h);
	}
	hl_html_start(r->h, "thead", NULL);
	hl_html_start(r->h, "tr", NULL);
	for (i = 0; i < ncol; i++) {
		hl_html_start(r->h, "th", num && num[i] ? "num" : NULL);
		hl_html_text(r->h, head[i]);
		if (unit != NULL && unit[i] != NULL && *unit[i] != '\0') {
			hl_html_void(r->h, "br", NULL, NULL);
			hl_html_elem(r->h, "span", "unit",
				     hl_report_unit(u, sizeof u, unit[i]));
		}
		hl_html_end(r->h);
	}
	hl_html_end(r->h);
	hl_html_end(r->h);
	hl_html_start(r->h, "tbody", NULL);
}

void
hl_report_table_end(hl_report *r)
{
	hl_html_end(r->h);	/* tbody */
	hl_html_end(r->h);	/* table */
}

void
hl_report_row_start(hl_report *r, const char *cls)
{
	hl_html_start(r->h, "tr", cls);
}

void
hl_report_row_end(hl_report *r)
{
	hl_html_end(r->h);
}

void
hl_report_cell(hl_report *r, const char *text)
{
	hl_html_elem(r->h, "td", NULL, text);
}

void
hl_report_cell_num(hl_report *r, const char *text)
{
	hl_html_elem(r->h, "td", "num", text);
}

void
hl_report_facts_start(hl_report *r, const char *cap)
{
	hl_html_start(r->h, "table", "facts");
	if (cap != NULL)
		hl_html_elem(r->h, "caption", NULL, cap);
	hl_html_start(r->h, "tbody", NULL);
}

void
hl_report_fact(hl_report *r, const char *name, const char *value,
	       const char *id)
{
	hl_html_start(r->h, "tr", NULL);
	hl_html_elem(r->h, "th", NULL, name);
	hl_html_start(r->h, "td", NULL);
	hl_html_attr(r->h, "id", id);
	hl_html_text(r->h, value);
	hl_html_end(r->h);
	hl_html_end(r->h);
}

void
hl_report_facts_end(hl_report *r)
{
	hl_html_end(r->h);
	hl_html_end(r->h);
}

const char *
hl_report_figure_open(hl_report *r, char *id, size_t size)
{
	snprintf(id, size, "fig%zu", ++r->charts);
	hl_html_start(r->h, "div", "figure");
	hl_html_attr(r->h, "id", id);
	return id;
}

void
hl_report_figure_close(hl_report *r, const char *cap)
{
	hl_html_start(r->h, "p", "caption");
	caption(r, "Figure", ++r->figures, cap);
	hl_html_end(r->h);
	hl_html_end(r->h);
}

void
hl_report_figure(hl_report *r, hl_svg_chart *chart, const char *subtitle,
		 const char *cap)
{
	char id[32];

	if (chart == NULL) {
		hl_html_fail(r->h);
		return;
	}
	hl_report_figure_open(r, id, sizeof id);
	hl_svg_chart_set_height(chart, HL_REPORT_CHART_HEIGHT);
	if (hl_svg_chart_set_id(chart, id) < 0 ||
	    hl_svg_chart_set_footnote(chart, NULL) < 0 ||
	    (subtitle != NULL && hl_svg_chart_set_subtitle(chart,
							   subtitle) < 0))
		hl_html_fail(r->h);
	if (!hl_html_failed(r->h) &&
	    hl_svg_chart_write(chart, hl_html_writer(r->h), NULL) != HL_OK)
		hl_html_fail(r->h);
	hl_report_figure_close(r, cap);
	hl_svg_chart_free(chart);
}

/* A table's SI unit label in the display units: the tables name their
 * columns' units in SI and convert their cells with hl_show(). */
const char *
hl_report_unit(char *buf, size_t size, const char *si)
{
	static const struct { const char *si; hl_qty q; } map[] = {
		{ "°C", HL_QTY_TEMP }, { "K", HL_QTY_DTEMP },
		{ "kW", HL_QTY_POWER }, { "kW/K", HL_QTY_CP },
		{ "kW/(m²·K)", HL_QTY_HTC }, { "m²", HL_QTY_AREA },
	};
	const char *slash = strstr(si, "/MWh");
	size_t i;

	snprintf(buf, size, "%s", si);
	if (hl_display_get() == HL_UNITS_SI)
		return buf;
	if (slash != NULL && slash[4] == '\0') {
		snprintf(buf, size, "%.*s/MMBtu", (int)(slash - si), si);
		return buf;
	}
	if (strncmp(si, "shifted ", 8) == 0 && strcmp(si + 8, "°C") == 0) {
		snprintf(buf, size, "shifted %s", HL_SYM_T);
		return buf;
	}
	for (i = 0; i < sizeof map / sizeof map[0]; i++)
		if (strcmp(si, map[i].si) == 0)
			snprintf(buf, size, "%s", hl_show_unit(map[i].q));
	return buf;
}

char *
hl_report_range(char *buf, size_t size, double from, double to)
{
	char a[64], b[64];

	snprintf(buf, size, "%s → %s", hl_report_fmt_fixed(a, sizeof a,
		 hl_show_t(from), 1), hl_report_fmt_fixed(b, sizeof b,
		 hl_show_t(to), 1));
	return buf;
}
