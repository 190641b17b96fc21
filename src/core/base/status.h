/* status.h - the one status enum and error record of the heatloom core.
 *
 * Every core function that can fail returns an hl_status and, when it fails,
 * fills the caller's hl_error (which may be NULL when the caller does not care).
 * The core never prints, never exits, never aborts: the command layer turns an
 * hl_error into the one-line message "heatloom: FILE:LINE: text" and the exit
 * code of its status.
 */
#ifndef HL_STATUS_H
#define HL_STATUS_H

#include <stddef.h>

/* The numeric values are the process exit codes (doc/design.md,
 * "Contracts"). */
typedef enum {
	HL_OK = 0,
	HL_EUSAGE = 1,      /* bad command line */
	HL_EINPUT = 2,      /* invalid input data */
	HL_ENOSOLUTION = 3, /* no feasible answer, or the solver failed */
	HL_EIO = 4,         /* cannot read or write a file, or out of memory */
} hl_status;

#define HL_ERROR_TEXT 512
#define HL_ERROR_FILE 256

typedef struct {
	hl_status status;
	char file[HL_ERROR_FILE]; /* "" when the error has no file */
	long line;                /* 0 when the error has no line */
	char text[HL_ERROR_TEXT]; /* what is wrong and what to do, no newline */
} hl_error;

/* Record an error (printf-style text) and return its status. NULL err is fine. */
hl_status hl_error_set(hl_error *err, hl_status status, const char *file,
		       long line, const char *fmt, ...)
	__attribute__((format(printf, 5, 6)));

/* Record an out-of-memory error. */
hl_status hl_error_nomem(hl_error *err);

/* Clear an error record to HL_OK. */
void hl_error_clear(hl_error *err);

/* Format err as "FILE:LINE: text" (or "FILE: text", or "text") into buf. */
void hl_error_format(const hl_error *err, char *buf, size_t size);

#endif
