/* report_curves.c - the composite, grand composite and balanced composite
 * curves as inline charts (the charts of `heatloom curves`, with subtitles
 * rounded as the report's text). */
#include <stdio.h>

#include "curves_out.h"
#include "report_sec.h"

#define B 64

static int
always(const hl_report_data *d)
{
	(void)d;
	return 1;
}

static void
composite(hl_report *r)
{
	const hl_report_data *d = r->d;
	char sub[4 * B], a[B], b[B], c[B], e[B];

	snprintf(sub, sizeof sub, "ΔTmin %s · QHmin %s · QCmin %s · heat "
		 "recovery %s", hl_report_fmt_dt(a, B, d->cas->dtmin),
		 hl_report_fmt_duty(b, B, d->cas->qh),
		 hl_report_fmt_duty(c, B, d->cas->qc),
		 hl_report_fmt_duty(e, B, d->cas->hot_total - d->cas->qc));
	hl_report_figure(r, hl_curves_chart_composite(d->c, d->cas, d->cv, 0),
			 sub, "Hot and cold composite curves. The overlap is "
			 "the heat recovered; the cold curve extends QHmin "
			 "beyond the hot one at the top and the hot curve QCmin "
			 "beyond the cold one at the bottom.");
}

static void
grand(hl_report *r)
{
	const hl_report_data *d = r->d;
	char sub[4 * B], a[B], b[B];

	if (d->lp != NULL)
		snprintf(sub, sizeof sub, "ΔTmin %s · utility levels at least "
			 "cost: %s", hl_report_fmt_dt(a, B, d->cas->dtmin),
			 hl_report_fmt_money(b, B, d->lp->cost,
					     hl_report_currency(d->c), 1));
	else
		snprintf(sub, sizeof sub, "ΔTmin %s · no utility levels given",
			 hl_report_fmt_dt(a, B, d->cas->dtmin));
	hl_report_figure(r, hl_curves_chart_grand(d->c, d->cas, d->cv, d->lp),
			 sub, d->lp != NULL ? "Grand composite curve with the "
			 "utility levels at their least-cost loads. Each "
			 "level touches the curve where it becomes the "
			 "limit (a utility pinch)." : "Grand composite curve. "
			 "The heat flow at the top is QHmin, at the bottom "
			 "QCmin; it touches zero at the pinch.");
}

static void
balanced(hl_report *r)
{
	const hl_report_data *d = r->d;
	char sub[4 * B], a[B], b[B], c[B];

	snprintf(sub, sizeof sub, "ΔTmin %s · hot utilities %s, cold "
		 "utilities %s", hl_report_fmt_dt(a, B, d->cas->dtmin),
		 hl_report_fmt_duty(b, B, d->lp->hot_load),
		 hl_report_fmt_duty(c, B, d->lp->cold_load));
	hl_report_figure(r, hl_curves_chart_balanced(d->c, d->cv, d->lp), sub,
			 "Balanced composite curves: the utilities added as "
			 "streams at their loads, so that both curves span the "
			 "same heat. The area targets are computed on these "
			 "curves.");
}

static void
write_curves(hl_report *r)
{
	hl_report_para(r, "The composite curves add up the hot streams and the "
		       "cold streams against temperature; where they overlap "
		       "heat can be recovered, and their closest vertical "
		       "approach, ΔTmin, is at the pinch. The grand composite "
		       "curve shows the net heat the process needs or gives "
		       "at each shifted temperature: the utility levels are "
		       "placed against it.");
	composite(r);
	grand(r);
	if (r->d->lp != NULL)
		balanced(r);
}

const hl_report_section hl_report_sec_curves = {
	"curves", "Composite and grand composite curves", always,
	write_curves
};
