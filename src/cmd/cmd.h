/* cmd.h - the command table and what every command shares.
 *
 * Each command lives in its own file and exports one hl_command; main.c lists
 * them. A command parses its own options, calls the stages, picks a writer,
 * and returns the process exit code.
 */
#ifndef HL_CMD_H
#define HL_CMD_H

#include <stdio.h>

#include "case.h"
#include "status.h"

typedef struct {
	const char *name;
	const char *synopsis;  /* "CASE [options]" */
	const char *summary;   /* one line for heatloom --help */
	int (*run)(int argc, char **argv);
	void (*help)(FILE *fp);
} hl_command;

extern const hl_command hl_cmd_targets;
extern const hl_command hl_cmd_size;
extern const hl_command hl_cmd_curves;
extern const hl_command hl_cmd_sweep;
extern const hl_command hl_cmd_audit;
extern const hl_command hl_cmd_matches;
extern const hl_command hl_cmd_design;
extern const hl_command hl_cmd_check;
extern const hl_command hl_cmd_report;

/* Output formats a command may accept. */
typedef enum { HL_FMT_TEXT, HL_FMT_XML, HL_FMT_CSV } hl_format;

/* Options most commands share; filled by hl_cmd_common_option(). */
typedef struct {
	const char *input;
	const char *utilities;
	const char *output;
	hl_format format;
	double dtmin;       /* NaN unless --dtmin */
	int verbose;
	int quiet;
} hl_common;

void hl_common_init(hl_common *o);

/* Print "heatloom: <formatted error>" on stderr; return its exit code. */
int hl_cmd_fail(const hl_error *err);
/* Print a usage error with a hint; return 1. */
int hl_cmd_usage(const char *cmd, const char *fmt, ...)
	__attribute__((format(printf, 2, 3)));

/* Option codes every command may put in its getopt_long table; the command
 * picks which ones it offers (and its own codes stay below 1000). */
enum {
	HL_OPT_DTMIN = 1000,   /* --dtmin K */
	HL_OPT_UTIL,           /* --utilities FILE */
	HL_OPT_FORMAT,         /* --format FMT */
	HL_OPT_VERBOSE,        /* --verbose */
	HL_OPT_QUIET,          /* --quiet */
	HL_OPT_UNITS           /* --units si|us: sets the display units */
};

/* The help line of --units, for the commands that offer it. */
#define HL_HELP_UNITS \
"  --units SYS        si (default) or us: text, CSV, SVG and the report in\n" \
"                     °F, Btu/h, Btu/(h·°F), ft², Btu/(h·ft²·°F); XML stays SI\n"

/* Handle getopt_long's result ch for the shared options, -o, -h and the
 * two getopt errors. Returns 1 when ch was one of them and has been applied,
 * 0 when ch is the command's own, or the exit code to return now (-1 after
 * --help: exit 0; 1 after a usage error). formats: HL_FMT_BIT set accepted
 * by --format. */
int hl_cmd_common_opt(const char *cmd, int ch, char **argv, unsigned formats,
		      void (*help)(FILE *), hl_common *o, int *rc);

/* After the options: exactly one CASE argument. 0, or 1 with a message. */
int hl_cmd_one_input(const char *cmd, int argc, char **argv, hl_common *o);

/* Parse a number option value; 0 on success. */
int hl_cmd_parse_double(const char *cmd, const char *opt, const char *arg,
			double lo, double hi, double *out);
/* Parse --format; 0 on success. */
int hl_cmd_parse_format(const char *cmd, const char *arg, unsigned allowed,
			hl_format *out);
#define HL_FMT_BIT(f) (1u << (f))

/* Load the case named on the command line (an XML case file or a bare
 * stream table), add the utility table when given, apply --dtmin, and
 * validate. Protects the inputs from being overwritten by outputs. */
hl_status hl_cmd_load_case(const hl_common *o, hl_case **out, hl_error *err);

/* Solver messages (--verbose) to standard error; ctx unused. */
void hl_cmd_log_stderr(void *ctx, const char *text);

/* The caution every report carries. */
extern const char hl_caution[];

#endif
