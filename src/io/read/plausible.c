/* plausible.c - unit slips that deserve a warning (plausible.h). */
#include <math.h>

#include "case.h"
#include "plausible.h"
#include "read_warn.h"

void
hl_doubt_htc(const char *file, long line, const char *col, double h)
{
	if (isnan(h) || h > HL_H_MAX)
		return; /* refused later: one message is enough */
	if (h > HL_DOUBT_HTC_HIGH)
		hl_read_warn(file, line, "%s %g kW/(m²·K) is above %g, more "
			"than condensing steam gives: in W/(m²·K)? a table "
			"may name its unit in the header, '%s [W/(m²·K)]'",
			col, h, HL_DOUBT_HTC_HIGH, col);
	else if (h > 0.0 && h < HL_DOUBT_HTC_LOW)
		hl_read_warn(file, line, "%s %g kW/(m²·K) (%g W/(m²·K)) is "
			"below free convection in a gas: a kW/(m²·K) value "
			"under a W/(m²·K) header?", col, h, h * 1e3);
}

void
hl_doubt_cp(const char *file, long line, const char *col, double cp,
	    double span)
{
	if (isnan(cp) || !(cp > HL_DOUBT_CP) || !(span >= HL_DOUBT_SPAN) ||
	    cp > HL_CP_MAX)
		return;
	hl_read_warn(file, line, "%s %g kW/K over %g K (%g MW) is implausibly "
		"large for one stream: in W/K? a table may name its unit in "
		"the header, '%s [W/K]'", col, cp, span, cp * span / 1e3, col);
}

void
hl_doubt_duty(const char *file, long line, const char *col, double q)
{
	if (isnan(q) || !(q > HL_DOUBT_DUTY) || q > HL_DOUBT_DUTY_OUT)
		return;
	hl_read_warn(file, line, "%s %g kW (%g MW) is implausibly large for "
		"one stream or unit: in W? a table may name its unit in the "
		"header, '%s [W]'", col, q, q / 1e3, col);
}
