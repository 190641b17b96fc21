/* status.c - error records of the heatloom core. */
#include <stdarg.h>
#include <stdio.h>
#include <string.h>

#include "status.h"

hl_status
hl_error_set(hl_error *err, hl_status status, const char *file, long line,
	     const char *fmt, ...)
{
	va_list ap;

	if (err == NULL)
		return status;
	err->status = status;
	snprintf(err->file, sizeof err->file, "%s", file ? file : "");
	err->line = line;
	va_start(ap, fmt);
	vsnprintf(err->text, sizeof err->text, fmt, ap);
	va_end(ap);
	return status;
}

hl_status
hl_error_nomem(hl_error *err)
{
	return hl_error_set(err, HL_EIO, NULL, 0, "out of memory");
}

void
hl_error_clear(hl_error *err)
{
	if (err == NULL)
		return;
	memset(err, 0, sizeof *err);
}

void
hl_error_format(const hl_error *err, char *buf, size_t size)
{
	if (err->file[0] != '\0' && err->line > 0)
		snprintf(buf, size, "%s:%ld: %s", err->file, err->line, err->text);
	else if (err->file[0] != '\0')
		snprintf(buf, size, "%s: %s", err->file, err->text);
	else
		snprintf(buf, size, "%s", err->text);
}
