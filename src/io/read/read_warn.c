/* read_warn.c - where reader warnings go (read_warn.h). */
#include <stdarg.h>
#include <stdio.h>

#include "read_warn.h"

static hl_read_warn_fn handler;
static void *handler_ctx;

void
hl_read_warn_handler(hl_read_warn_fn fn, void *ctx)
{
	handler = fn;
	handler_ctx = ctx;
}

void
hl_read_warn(const char *file, long line, const char *fmt, ...)
{
	char text[512];
	va_list ap;

	va_start(ap, fmt);
	vsnprintf(text, sizeof text, fmt, ap);
	va_end(ap);
	if (handler != NULL) {
		handler(handler_ctx, file, line, text);
		return;
	}
	if (file != NULL && line > 0)
		fprintf(stderr, "heatloom: warning: %s:%ld: %s\n", file, line,
			text);
	else
		fprintf(stderr, "heatloom: warning: %s\n", text);
}
