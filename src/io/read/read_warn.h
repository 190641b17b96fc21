/* read_warn.h - warnings from the readers: the reading goes on.
 *
 * A reader that finds a value it can read but doubts (a temperature that
 * looks like kelvin, a cp that looks like W/K) says so through
 * hl_read_warn(). By default the warning goes to standard error as one line,
 * "heatloom: warning: FILE:LINE: text"; a caller may send warnings elsewhere
 * (the tests collect them) with hl_read_warn_handler().
 */
#ifndef HL_READ_WARN_H
#define HL_READ_WARN_H

typedef void (*hl_read_warn_fn)(void *ctx, const char *file, long line,
				const char *text);

/* Send warnings to fn (NULL: back to standard error). */
void hl_read_warn_handler(hl_read_warn_fn fn, void *ctx);

void hl_read_warn(const char *file, long line, const char *fmt, ...)
	__attribute__((format(printf, 3, 4)));

#endif
