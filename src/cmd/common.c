/* common.c - option helpers, case loading and error printing. */
#include <getopt.h>
#include <math.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "case_load.h"
#include "cmd.h"
#include "csv.h"
#include "display.h"
#include "output.h"

const char hl_caution[] =
	"Results are screening estimates. Detailed thermal and mechanical\n"
	"design, pressure equipment codes and the safety review of each match\n"
	"(leaks between incompatible streams, fouling, start-up) belong to\n"
	"qualified engineers under local codes.";

void
hl_common_init(hl_common *o)
{
	memset(o, 0, sizeof *o);
	hl_display_set(HL_UNITS_SI);
	o->format = HL_FMT_TEXT;
	o->dtmin = NAN;
}

void
hl_cmd_log_stderr(void *ctx, const char *text)
{
	(void)ctx;
	fputs(text, stderr);
}

int
hl_cmd_fail(const hl_error *err)
{
	char buf[HL_ERROR_TEXT + HL_ERROR_FILE + 32];

	hl_error_format(err, buf, sizeof buf);
	fprintf(stderr, "heatloom: %s\n", buf);
	return err->status == HL_OK ? 1 : (int)err->status;
}

int
hl_cmd_usage(const char *cmd, const char *fmt, ...)
{
	va_list ap;

	fprintf(stderr, "heatloom: %s: ", cmd);
	va_start(ap, fmt);
	vfprintf(stderr, fmt, ap);
	va_end(ap);
	fprintf(stderr, " (see 'heatloom help %s')\n", cmd);
	return HL_EUSAGE;
}

int
hl_cmd_parse_double(const char *cmd, const char *opt, const char *arg,
		    double lo, double hi, double *out)
{
	if (!hl_parse_number(arg, 0, out) || *out < lo || *out > hi) {
		hl_cmd_usage(cmd, "%s wants a number from %g to %g, not '%s'",
			     opt, lo, hi, arg);
		return -1;
	}
	return 0;
}

int
hl_cmd_parse_format(const char *cmd, const char *arg, unsigned allowed,
		    hl_format *out)
{
	static const char *const names[] = { "text", "xml", "csv" };
	int f;

	for (f = 0; f < 3; f++) {
		if (strcmp(arg, names[f]) == 0 && (allowed & HL_FMT_BIT(f))) {
			*out = (hl_format)f;
			return 0;
		}
	}
	hl_cmd_usage(cmd, "unknown --format '%s'", arg);
	return -1;
}

hl_status
hl_cmd_load_case(const hl_common *o, hl_case **out, hl_error *err)
{
	hl_status st;

	hl_output_protect(o->input);
	hl_output_protect(o->utilities);
	st = hl_output_check(o->output, err);
	if (st != HL_OK)
		return st;
	st = hl_case_load(o->input, o->utilities, out, err);
	if (st != HL_OK)
		return st;
	if (!isnan(o->dtmin))
		(*out)->set.dtmin = o->dtmin;
	st = hl_case_validate(*out, err);
	if (st != HL_OK) {
		hl_case_free(*out);
		*out = NULL;
	}
	return st;
}

int
hl_cmd_common_opt(const char *cmd, int ch, char **argv, unsigned formats,
		  void (*help)(FILE *), hl_common *o, int *rc)
{
	*rc = 0;
	switch (ch) {
	case HL_OPT_DTMIN:
		if (hl_cmd_parse_double(cmd, "--dtmin", optarg, 0.0, 500.0,
					&o->dtmin) != 0)
			*rc = 1;
		return 1;
	case HL_OPT_UTIL:
		o->utilities = optarg;
		return 1;
	case HL_OPT_FORMAT:
		if (hl_cmd_parse_format(cmd, optarg, formats, &o->format) != 0)
			*rc = 1;
		return 1;
	case HL_OPT_VERBOSE:
		o->verbose = 1;
		return 1;
	case HL_OPT_QUIET:
		o->quiet = 1;
		return 1;
	case HL_OPT_UNITS: {
		hl_unit_system s;

		if (hl_display_parse(optarg, &s) != 0)
			*rc = hl_cmd_usage(cmd, "--units wants si or us, not "
					   "'%s'", optarg);
		else
			hl_display_set(s);
		return 1;
	}
	case 'o':
		o->output = optarg;
		return 1;
	case 'h':
		help(stdout);
		*rc = -1;
		return 1;
	case ':':
		*rc = hl_cmd_usage(cmd, "option '%s' needs a value",
				   argv[optind - 1]);
		return 1;
	case '?':
		*rc = hl_cmd_usage(cmd, "unknown option '%s'",
				   argv[optind - 1]);
		return 1;
	default:
		return 0;
	}
}

int
hl_cmd_one_input(const char *cmd, int argc, char **argv, hl_common *o)
{
	if (optind != argc - 1)
		return hl_cmd_usage(cmd, optind >= argc ? "give one CASE file" :
				    "give one CASE file, not several");
	o->input = argv[optind];
	return 0;
}
