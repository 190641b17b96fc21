/* cmd.h - the command table and what every command shares.
 *
 * Each command lives in its own file and exports one hl_command; main.c lists
 * them. A command declares its options in a table (hl_option), calls the
 * stages and picks a writer; options.c parses, prints the help and turns
 * the result into the process exit code.
 */
#ifndef HL_CMD_H
#define HL_CMD_H

#include <stddef.h>
#include <stdio.h>

#include "case.h"
#include "existing.h"
#include "svg.h"
#include "status.h"

/* How an option's value is taken and where it goes. */
typedef enum {
	HL_ARG_FLAG,    /* no value: stores (int)lo */
	HL_ARG_TEXT,    /* a file name or a text: stores the const char * */
	HL_ARG_NUMBER,  /* a number from lo to hi: stores a double */
	HL_ARG_FORMAT,  /* text, xml or csv: stores an hl_format */
	HL_ARG_UNITS,   /* si or us: sets the display units (display.h) */
	HL_ARG_CALL,    /* the command's own parser, call */
	HL_ARG_HELP     /* prints the help; the command ends with exit 0 */
} hl_arg_kind;

/* One row of a command's option table: the parser, the help and the test
 * against the man page (tests/cli/options.sh) all read it. */
typedef struct {
	const char *name;   /* long name without the dashes */
	char letter;        /* short name, or 0 */
	const char *arg;    /* the value's name in the help ("K"), NULL: none */
	const char *help;   /* '\n' starts an indented line; NULL: shown on the
			       line of the next row (options given together) */
	hl_arg_kind kind;
	size_t at;          /* offset of the value in the command's options */
	double lo, hi;      /* NUMBER: the accepted range; FLAG: lo is stored */
	int (*call)(void *opts, const char *arg);  /* CALL: 0 or exit code */
} hl_option;

/* Rows of a command's own options: type is its options struct, member the
 * field the value goes to. */
#define HL_ROW_NUMBER(name, arg, type, member, lo, hi, text) { name, 0, \
	arg, text, HL_ARG_NUMBER, offsetof(type, member), lo, hi, NULL }
#define HL_ROW_TEXT(name, arg, type, member, text) { name, 0, arg, text, \
	HL_ARG_TEXT, offsetof(type, member), 0, 0, NULL }
#define HL_ROW_FLAG(name, type, member, value, text) { name, 0, NULL, text, \
	HL_ARG_FLAG, offsetof(type, member), value, 0, NULL }

/* The options shared by many commands; they live in hl_common, which is the
 * first member of every command's options (HL_COMMON_FIRST checks it). */
#define HL_COMMON_FIRST(type) _Static_assert(offsetof(type, c) == 0, \
	#type " must begin with its hl_common c")
#define HL_ROW_DTMIN(text) \
	HL_ROW_NUMBER("dtmin", "K", hl_common, dtmin, 0.0, 500.0, text)
#define HL_ROW_UTILITIES HL_ROW_TEXT("utilities", "FILE", hl_common, \
	utilities, "utility table (CSV) to add to the case")
#define HL_ROW_FORMAT(text) { "format", 0, "FMT", text, HL_ARG_FORMAT, \
	offsetof(hl_common, format), 0, 0, NULL }
#define HL_ROW_OUTPUT(arg, text) { "output", 'o', arg, text, HL_ARG_TEXT, \
	offsetof(hl_common, output), 0, 0, NULL }
#define HL_ROW_VERBOSE(text) HL_ROW_FLAG("verbose", hl_common, verbose, 1, text)
#define HL_ROW_QUIET(text) HL_ROW_FLAG("quiet", hl_common, quiet, 1, text)
/* --units si|us: sets the display units (display.h) at once. */
#define HL_UNITS_HELP "si (default) or us: text, CSV, SVG and the report " \
	"in\n°F, Btu/h, Btu/(h·°F), ft², Btu/(h·ft²·°F); XML stays SI"
#define HL_ROW_UNITS(text) { "units", 0, "SYS", text, HL_ARG_UNITS, 0, 0, 0, \
	NULL }
#define HL_ROW_HELP { "help", 'h', NULL, "show this help", HL_ARG_HELP, \
	0, 0, 0, NULL }
#define HL_ROW_END { NULL, 0, NULL, NULL, HL_ARG_FLAG, 0, 0, 0, NULL }

/* A command: its option table, its help texts and what it runs. The
 * parsing, the help and the exit code are shared (options.c). */
typedef struct {
	const char *name;
	const char *usage;     /* "CASE [options]", after "heatloom NAME" */
	const char *summary;   /* one line for heatloom --help */
	const char *about;     /* the help before the option list */
	const char *after;     /* the help after the option list, or NULL */
	const hl_option *opt;  /* ends with HL_ROW_END */
	size_t size;           /* of the options; hl_common comes first */
	const char *missing;   /* usage error without the operand */
	const char *several;   /* usage error with more than one */
	void (*init)(void *opts);   /* defaults beyond hl_common's, or NULL */
	int (*check)(void *opts);   /* after parsing: 0 or exit code; NULL */
	/* Does the work; a status other than HL_OK with err cleared is an
	 * exit code whose reason the command has already printed. */
	hl_status (*run)(void *opts, hl_error *err);
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
extern const hl_command hl_cmd_retrofit;

/* Output formats a command may accept. */
typedef enum { HL_FMT_TEXT, HL_FMT_XML, HL_FMT_CSV } hl_format;

/* Options most commands share (the HL_ROW_ rows below fill them). */
typedef struct {
	const char *input;
	const char *utilities;
	const char *output;
	hl_format format;
	double dtmin;       /* NaN unless --dtmin */
	int verbose;
	int quiet;
	unsigned long long given;  /* bit i: the table's row i was given */
	int exact_latent;   /* keep latent heat as steps (targets, curves);
			       else it is spread over HL_LATENT_SPAN */
} hl_common;

void hl_common_init(hl_common *o);

/* Print "heatloom: <formatted error>" on stderr; return its exit code. */
int hl_cmd_fail(const hl_error *err);
/* Print a usage error with a hint; return 1. */
int hl_cmd_usage(const char *cmd, const char *fmt, ...)
	__attribute__((format(printf, 2, 3)));

/* The help of `heatloom help CMD` and `heatloom CMD --help`. */
void hl_cmd_help(const hl_command *cmd, FILE *fp);
/* Parse, check, run and turn the result into the exit code. */
int hl_cmd_main(const hl_command *cmd, int argc, char **argv);
/* Usage error unless from <= to with at most 10001 points of step. */
int hl_cmd_check_grid(const char *cmd, double from, double to, double step);
/* Set the case's EMAT from --emat (NaN: not given): a usage error unless
 * 0 < emat <= ΔTmin. */
hl_status hl_cmd_set_emat(const char *cmd, hl_case *c, double emat,
			  hl_error *err);
/* Whether the option called name was given on the command line. */
int hl_cmd_given(const hl_command *cmd, const void *opts, const char *name);

/* Parse --units and set the display units; 0 on success. */
int hl_cmd_parse_units(const char *cmd, const char *arg);

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

/* "heatloom: FILE:LINE: warning: text" on stderr for each warning of the
 * reading of today's network (net may be NULL). */
void hl_cmd_print_warnings(const hl_existing *net);

/* Write chart ch (NULL: out of memory) to path, whole or not at all. */
hl_status hl_cmd_write_chart(const char *path, const hl_svg_chart *ch,
			     hl_error *err);

/* Solver messages (--verbose) to standard error; ctx unused. */
void hl_cmd_log_stderr(void *ctx, const char *text);

/* The caution every report carries. */
extern const char hl_caution[];

#endif
