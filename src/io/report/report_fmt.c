/* report_fmt.c - rounding and units of the report's numbers. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "display.h"
#include "report_fmt.h"

/* Copy a plain "%.*f" number into buf with the minus sign and digit groups
 * of report_fmt.h. */
static char *
group(char *buf, size_t size, const char *plain)
{
	const char *p = plain, *dot;
	size_t n, i, o = 0;
	int neg = 0;

	if (*p == '-') {
		neg = 1;
		p++;
	}
	/* "-0.0" after rounding is zero. */
	if (neg && strspn(p, "0.") == strlen(p))
		neg = 0;
	dot = strchr(p, '.');
	n = dot ? (size_t)(dot - p) : strlen(p);
	buf[0] = '\0';
	if (neg)
		o += (size_t)snprintf(buf + o, size - o, "%s", HL_MINUS);
	for (i = 0; i < n && o + 4 < size; i++) {
		if (n >= 5 && i > 0 && (n - i) % 3 == 0)
			o += (size_t)snprintf(buf + o, size - o, "%s",
					      HL_NNBSP);
		buf[o++] = p[i];
	}
	buf[o < size ? o : size - 1] = '\0';
	if (dot != NULL && o < size)
		snprintf(buf + o, size - o, "%s", dot);
	return buf;
}

char *
hl_report_fmt_fixed(char *buf, size_t size, double v, int decimals)
{
	char plain[400];

	if (!isfinite(v))
		v = 0.0;
	snprintf(plain, sizeof plain, "%.*f", decimals, v);
	return group(buf, size, plain);
}

/* Round to sig significant figures but to no more than maxdec decimals:
 * decimals while the leading digit allows, else a whole number rounded to
 * tens, hundreds … Both ways round by printf's "%.0f" on the scaled value,
 * so that a test can repeat the rounding exactly. */
char *
hl_report_fmt_sig(char *buf, size_t size, double v, int sig, int maxdec)
{
	char tmp[400];
	int mag, decimals;
	double q;

	if (!isfinite(v) || v == 0.0)
		return group(buf, size, "0");
	mag = (int)floor(log10(fabs(v)));
	decimals = sig - 1 - mag;
	if (decimals > maxdec)
		decimals = maxdec;
	if (decimals >= 0)
		return hl_report_fmt_fixed(buf, size, v, decimals);
	q = pow(10.0, -decimals);
	snprintf(tmp, sizeof tmp, "%.0f", v / q);
	return hl_report_fmt_fixed(buf, size, strtod(tmp, NULL) * q, 0);
}

static char *
with_unit(char *buf, size_t size, const char *unit)
{
	size_t n = strlen(buf);

	if (unit != NULL && *unit != '\0')
		snprintf(buf + n, size - n, "%s%s", HL_NBSP, unit);
	return buf;
}

/* Duties and areas alike: 3 significant figures and at most one decimal,
 * but whole digits are never rounded away (12 165 stays 12 165). */
char *
hl_report_fmt_qty(char *buf, size_t size, double v)
{
	if (fabs(v) >= 1000.0)
		return hl_report_fmt_fixed(buf, size, v, 0);
	return hl_report_fmt_sig(buf, size, v, 3, 1);
}

char *
hl_report_fmt_temp(char *buf, size_t size, double celsius)
{
	hl_report_fmt_fixed(buf, size, hl_show_t(celsius), 1);
	return with_unit(buf, size, HL_SYM_T);
}

char *
hl_report_fmt_dt(char *buf, size_t size, double kelvin)
{
	hl_report_fmt_fixed(buf, size, hl_show_dt(kelvin), 1);
	return with_unit(buf, size, HL_SYM_DT);
}

char *
hl_report_fmt_duty(char *buf, size_t size, double kw)
{
	hl_report_fmt_qty(buf, size, hl_show_q(kw));
	return with_unit(buf, size, HL_SYM_Q);
}

char *
hl_report_fmt_area(char *buf, size_t size, double m2)
{
	hl_report_fmt_qty(buf, size, hl_show_a(m2));
	return with_unit(buf, size, HL_SYM_A);
}

char *
hl_report_fmt_money(char *buf, size_t size, double v, const char *currency,
		    int per_year)
{
	char unit[64];

	hl_report_fmt_sig(buf, size, v, 3, 0);
	if (currency == NULL || *currency == '\0')
		return per_year ? with_unit(buf, size, "per year") : buf;
	snprintf(unit, sizeof unit, "%.40s%s", currency, per_year ? "/yr" : "");
	return with_unit(buf, size, unit);
}
