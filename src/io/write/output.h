/* output.h - all-or-nothing output files.
 *
 * A result is written to a temporary file in the destination's folder and
 * renamed over the destination only when complete, so a failed or interrupted
 * run leaves no partial file (SIGINT and SIGTERM remove the temporary file).
 * A destination that names one of the run's input files is refused. A
 * destination that is not a regular file (a device such as /dev/null, a
 * FIFO, a socket) is written in place: it holds no file to lose.
 * A NULL or "-" path means standard output.
 */
#ifndef HL_OUTPUT_H
#define HL_OUTPUT_H

#include <stdio.h>

#include "status.h"

typedef struct {
	FILE *fp;
	char *path;  /* destination, NULL for stdout */
	char *tmp;   /* temporary file, NULL for stdout */
} hl_output;

/* Remember an input file so that no output may overwrite it. */
void hl_output_protect(const char *input);

/* Install the SIGINT/SIGTERM handler that removes temporary files. */
void hl_output_install_signals(void);

hl_status hl_output_open(hl_output *o, const char *path, hl_error *err);
/* Flush, close and rename into place. */
hl_status hl_output_commit(hl_output *o, hl_error *err);
/* Close and delete the temporary file (harmless after commit). */
void hl_output_abort(hl_output *o);

/* Check that path may be written (not an input); for use before work. */
hl_status hl_output_check(const char *path, hl_error *err);

#endif
