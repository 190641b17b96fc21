/* report_html.c - the frame of the report: head, title block, contents, and
 * the section table.
 *
 * The order of the table is the order of the report. A new stage adds its
 * section as one file (report_NAME.c with one hl_report_section) and one
 * row here; its present() decides from the data whether it appears.
 */
#include <stdio.h>
#include <string.h>

#include "report_sec.h"

static const hl_report_section *const sections[] = {
	&hl_report_sec_summary,
	&hl_report_sec_streams,
	&hl_report_sec_targets,
	&hl_report_sec_choice,
	&hl_report_sec_audit,
	&hl_report_sec_retrofit,
	&hl_report_sec_curves,
	&hl_report_sec_tradeoff,
	&hl_report_sec_matches,
	&hl_report_sec_network,
	&hl_report_sec_sensitivity,
	&hl_report_sec_assumptions,
	&hl_report_sec_methods,
	&hl_report_sec_caution,
};
#define NSECTIONS (sizeof sections / sizeof sections[0])

static void
title_of(const hl_report_data *d, char *buf, size_t size)
{
	if (d->meta.title != NULL)
		snprintf(buf, size, "%s", d->meta.title);
	else
		snprintf(buf, size, "Heat recovery study: %s",
			 hl_report_case_name(d->c));
}

static void
head(hl_html *h, const hl_report_data *d)
{
	char title[512];

	title_of(d, title, sizeof title);
	hl_html_start(h, "head", NULL);
	hl_html_void(h, "meta", "charset", "utf-8");
	hl_html_start(h, "meta", NULL);
	hl_html_attr(h, "name", "viewport");
	hl_html_attr(h, "content", "width=device-width, initial-scale=1");
	hl_html_end_void(h);
	hl_html_start(h, "meta", NULL);
	hl_html_attr(h, "name", "generator");
	hl_html_attr(h, "content", d->meta.generator);
	hl_html_end_void(h);
	hl_html_elem(h, "title", NULL, title);
	hl_html_start(h, "style", NULL);
	hl_html_raw(h, hl_report_css);
	hl_html_end(h);
	hl_html_end(h);
}

static void
masthead(hl_html *h, const hl_report_data *d)
{
	char title[512];

	title_of(d, title, sizeof title);
	hl_html_start(h, "div", "masthead");
	hl_html_elem(h, "p", "kicker", "Heat recovery screening study");
	hl_html_elem(h, "h1", NULL, title);
	hl_html_start(h, "p", "byline");
	hl_html_textf(h, "Case %s", hl_report_case_name(d->c));
	if (d->meta.author != NULL)
		hl_html_textf(h, " \xc2\xb7 prepared by %s", d->meta.author);
	if (d->meta.date != NULL)
		hl_html_textf(h, " \xc2\xb7 %s", d->meta.date);
	hl_html_textf(h, " \xc2\xb7 %s", d->meta.generator);
	hl_html_end(h);
	hl_html_start(h, "p", "caution-banner");
	hl_html_elem(h, "strong", NULL, "Caution. ");
	hl_html_text(h, d->meta.caution);
	hl_html_end(h);
	hl_html_end(h);
}

static void
contents(hl_html *h, const hl_report_data *d)
{
	size_t i;
	char href[64];

	hl_html_start(h, "div", "contents");
	hl_html_elem(h, "p", "contents-title", "Contents");
	hl_html_start(h, "ol", NULL);
	for (i = 0; i < NSECTIONS; i++) {
		if (!sections[i]->present(d))
			continue;
		snprintf(href, sizeof href, "#%s", sections[i]->id);
		hl_html_start(h, "li", NULL);
		hl_html_start(h, "a", NULL);
		hl_html_attr(h, "href", href);
		hl_html_text(h, sections[i]->title);
		hl_html_end(h);
		hl_html_end(h);
	}
	hl_html_end(h);
	hl_html_end(h);
}

static void
section(hl_report *r, const hl_report_section *s, int number)
{
	hl_html_start(r->h, "div", "section");
	hl_html_attr(r->h, "id", s->id);
	hl_html_start(r->h, "h2", NULL);
	hl_html_elemf(r->h, "span", "secno", "%d", number);
	hl_html_text(r->h, s->title);
	hl_html_end(r->h);
	s->write(r);
	hl_html_end(r->h);
}

static void
footer(hl_html *h, const hl_report_data *d)
{
	hl_html_start(h, "div", "footer");
	hl_html_textf(h, "%s \xc2\xb7 %s \xc2\xb7 screening estimate, not a "
		      "design", d->meta.generator, hl_report_case_name(d->c));
	hl_html_end(h);
}

hl_status
hl_report_html_write(FILE *fp, const hl_report_data *d, hl_error *err)
{
	hl_html *h = hl_html_create("en");
	hl_report r;
	hl_status st;
	size_t i;
	int number = 0;

	if (h == NULL)
		return hl_error_nomem(err);
	memset(&r, 0, sizeof r);
	r.h = h;
	r.d = d;
	head(h, d);
	hl_html_start(h, "body", NULL);
	masthead(h, d);
	contents(h, d);
	for (i = 0; i < NSECTIONS; i++)
		if (sections[i]->present(d))
			section(&r, sections[i], ++number);
	footer(h, d);
	hl_html_end(h);		/* body */
	hl_html_end(h);		/* html */
	st = hl_html_finish(h, fp, err);
	hl_html_free(h);
	return st;
}
