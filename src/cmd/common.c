/* common.c - option helpers, case loading and error printing. */
#include <math.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "case_load.h"
#include "cmd.h"
#include "display.h"
#include "number.h"
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
	if (st == HL_OK && !o->exact_latent && hl_case_has_latent(*out)) {
		hl_case *spread = hl_case_spread_latent(*out, HL_LATENT_SPAN);

		hl_case_free(*out);
		*out = spread;
		if (spread == NULL)
			st = hl_error_nomem(err);
	}
	if (st != HL_OK) {
		hl_case_free(*out);
		*out = NULL;
	}
	return st;
}

int
hl_cmd_parse_units(const char *cmd, const char *arg)
{
	hl_unit_system s;

	if (hl_display_parse(arg, &s) != 0)
		return hl_cmd_usage(cmd, "--units wants si or us, not '%s'",
				    arg);
	hl_display_set(s);
	return 0;
}

int
hl_cmd_check_grid(const char *cmd, double from, double to, double step)
{
	if (to < from)
		return hl_cmd_usage(cmd, "--to %g is below --from %g", to,
				    from);
	if ((to - from) / step > 10000.0)
		return hl_cmd_usage(cmd, "more than 10001 grid points; use a "
				    "larger --step");
	return 0;
}

hl_status
hl_cmd_set_emat(const char *cmd, hl_case *c, double emat, hl_error *err)
{
	if (isnan(emat))
		return HL_OK;
	if (emat > c->set.dtmin || !(emat > 0.0))
		return hl_error_set(err, HL_EUSAGE, NULL, 0, "%s: --emat %g K "
		    "must lie above 0 and not above ΔTmin %g K", cmd, emat,
		    c->set.dtmin);
	c->set.emat = emat;
	return HL_OK;
}

void
hl_cmd_print_warnings(const hl_existing *net)
{
	size_t i;

	for (i = 0; net != NULL && i < net->nwarn; i++) {
		const hl_error *w = &net->warn[i];

		fprintf(stderr, "heatloom: ");
		if (w->file[0] != '\0' && w->line > 0)
			fprintf(stderr, "%s:%ld: ", w->file, w->line);
		else if (w->file[0] != '\0')
			fprintf(stderr, "%s: ", w->file);
		fprintf(stderr, "warning: %s\n", w->text);
	}
}

hl_status
hl_cmd_write_chart(const char *path, const hl_svg_chart *ch, hl_error *err)
{
	hl_output out;
	hl_status st;

	if (ch == NULL)
		return hl_error_nomem(err);
	st = hl_output_open(&out, path, err);
	if (st == HL_OK)
		st = hl_svg_chart_write_file(ch, out.fp, err);
	if (st == HL_OK)
		st = hl_output_commit(&out, err);
	hl_output_abort(&out);
	return st;
}
