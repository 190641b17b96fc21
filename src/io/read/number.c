/* number.c - one strict reading of decimal numbers (number.h). */
#include <errno.h>
#include <stdlib.h>

#include "number.h"

/* Exact powers of ten up to 10^22, all representable in a double. */
static const double pow10_exact[] = {
	1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12,
	1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22
};

/* Clinger's fast path (Clinger 1990, "How to read floating point numbers
 * accurately", PLDI): a decimal with at most 15 significant digits and a
 * power of ten within 10^±22 is one exact integer times or over one exact
 * power of ten, so one correctly rounded operation gives the correctly
 * rounded double that strtod would. tmp is already checked: [+-]d*[.d*]
 * [e[+-]d+]. Returns 0 when the fast path does not apply. */
static int
fast_decimal(const char *tmp, double *out)
{
	unsigned long long m = 0;
	int digits = 0, scale = 0, neg = 0, e = 0, eneg = 0;
	const char *p = tmp;
	double v;

	if (*p == '+' || *p == '-')
		neg = *p++ == '-';
	for (; *p >= '0' && *p <= '9'; p++) {
		if (m == 0 && *p == '0')
			continue;
		if (++digits > 15)
			return 0;
		m = m * 10 + (unsigned)(*p - '0');
	}
	if (*p == '.') {
		for (p++; *p >= '0' && *p <= '9'; p++) {
			scale--;
			if (m == 0 && *p == '0')
				continue;
			if (++digits > 15)
				return 0;
			m = m * 10 + (unsigned)(*p - '0');
		}
	}
	if (*p == 'e' || *p == 'E') {
		p++;
		if (*p == '+' || *p == '-')
			eneg = *p++ == '-';
		for (; *p >= '0' && *p <= '9'; p++) {
			e = e * 10 + (*p - '0');
			if (e > 400)
				return 0;
		}
	}
	scale += eneg ? -e : e;
	if (scale < -22 || scale > 22)
		return 0;
	v = (double)m;
	v = scale < 0 ? v / pow10_exact[-scale] : v * pow10_exact[scale];
	*out = neg ? -v : v;
	return 1;
}

int
hl_parse_number(const char *s, int decimal_comma, double *out)
{
	char tmp[128];
	size_t n = 0, i = 0;
	int digits = 0;
	char *end;

	while (s[i] == ' ' || s[i] == '\t')
		i++;
	if (s[i] == '+' || s[i] == '-')
		tmp[n++] = s[i++];
	while (s[i] >= '0' && s[i] <= '9' && n < sizeof tmp - 8) {
		tmp[n++] = s[i++];
		digits++;
	}
	if (s[i] == '.' || (decimal_comma && s[i] == ',')) {
		tmp[n++] = '.';
		i++;
		while (s[i] >= '0' && s[i] <= '9' && n < sizeof tmp - 8) {
			tmp[n++] = s[i++];
			digits++;
		}
	}
	if (digits == 0)
		return 0;
	if (s[i] == 'e' || s[i] == 'E') {
		int ed = 0;

		tmp[n++] = s[i++];
		if (s[i] == '+' || s[i] == '-')
			tmp[n++] = s[i++];
		while (s[i] >= '0' && s[i] <= '9' && n < sizeof tmp - 1) {
			tmp[n++] = s[i++];
			ed++;
		}
		if (ed == 0)
			return 0;
	}
	while (s[i] == ' ' || s[i] == '\t')
		i++;
	if (s[i] != '\0' || n >= sizeof tmp - 1)
		return 0;
	tmp[n] = '\0';
	if (fast_decimal(tmp, out))
		return 1;
	errno = 0;
	*out = strtod(tmp, &end);
	if (errno == ERANGE && (*out > 1.0 || *out < -1.0))
		return 0;
	return *end == '\0';
}
