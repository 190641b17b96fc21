/* options.c - what every command shares around its option table: the
 * parsing (getopt_long built from the table), the help and the exit code.
 */
#include <getopt.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "cmd.h"

/* getopt_long's code for row i; letters keep their own code. */
#define ROW_CODE(i) (256 + (int)(i))
/* Rows of one table at most: hl_common.given has a bit per row. A longer
 * table stops the command at once (and so fails tests/cli/options.sh). */
#define MAX_ROWS 63

static size_t
count_rows(const hl_command *cmd)
{
	size_t n = 0;

	while (cmd->opt[n].name != NULL)
		n++;
	return n;
}

/* The getopt_long table and short-option string of the command. */
static void
build(const hl_command *cmd, struct option *lo, char *so)
{
	size_t i, n = count_rows(cmd);
	char *s = so;

	*s++ = ':';
	for (i = 0; i < n && i < MAX_ROWS; i++) {
		const hl_option *r = &cmd->opt[i];

		lo[i].name = r->name;
		lo[i].has_arg = r->arg != NULL ? required_argument :
			no_argument;
		lo[i].flag = NULL;
		lo[i].val = r->letter != 0 ? r->letter : ROW_CODE(i);
		if (r->letter != 0) {
			*s++ = r->letter;
			if (r->arg != NULL)
				*s++ = ':';
		}
	}
	memset(&lo[i], 0, sizeof lo[i]);
	*s = '\0';
}

static long
row_of(const hl_command *cmd, int code)
{
	size_t i;

	if (code >= 256)
		return code - 256;
	for (i = 0; cmd->opt[i].name != NULL; i++)
		if (cmd->opt[i].letter == code)
			return (long)i;
	return -1;
}

/* Store one option's value; 0, -1 after --help, or an exit code. */
static int
apply(const hl_command *cmd, size_t i, const char *arg, void *opts)
{
	const hl_option *r = &cmd->opt[i];
	char *at = (char *)opts + r->at;
	char dashed[64];

	((hl_common *)opts)->given |= 1ull << i;
	switch (r->kind) {
	case HL_ARG_FLAG:
		*(int *)at = (int)r->lo;
		return 0;
	case HL_ARG_TEXT:
		*(const char **)at = arg;
		return 0;
	case HL_ARG_NUMBER:
		snprintf(dashed, sizeof dashed, "--%s", r->name);
		return hl_cmd_parse_double(cmd->name, dashed, arg, r->lo, r->hi,
					   (double *)at) != 0;
	case HL_ARG_FORMAT:
		return hl_cmd_parse_format(cmd->name, arg,
		    HL_FMT_BIT(HL_FMT_TEXT) | HL_FMT_BIT(HL_FMT_XML) |
		    HL_FMT_BIT(HL_FMT_CSV), (hl_format *)at) != 0;
	case HL_ARG_UNITS:
		return hl_cmd_parse_units(cmd->name, arg) != 0;
	case HL_ARG_CALL:
		return r->call(opts, arg);
	default:
		hl_cmd_help(cmd, stdout);
		return -1;
	}
}

/* Parse the options of argv (argv[0] the command's name) into opts by the
 * table, and the one operand into opts' hl_common input. 0, -1 after
 * --help (exit 0), or the exit code of a usage error (printed). */
static int
parse(const hl_command *cmd, int argc, char **argv, void *opts)
{
	struct option lo[MAX_ROWS + 1];
	char so[2 * MAX_ROWS + 2];
	hl_common *c = opts;
	int ch, rc;
	long i;

	build(cmd, lo, so);
	optind = 1;
	opterr = 0;
	while ((ch = getopt_long(argc, argv, so, lo, NULL)) != -1) {
		if (ch == ':')
			return hl_cmd_usage(cmd->name, "option '%s' needs a "
					    "value", argv[optind - 1]);
		i = row_of(cmd, ch);
		if (ch == '?' || i < 0)
			return hl_cmd_usage(cmd->name, "unknown option '%s'",
					    argv[optind - 1]);
		if ((rc = apply(cmd, (size_t)i, optarg, opts)) != 0)
			return rc;
	}
	if (optind != argc - 1)
		return hl_cmd_usage(cmd->name, "%s", optind >= argc ?
				    cmd->missing : cmd->several);
	c->input = argv[optind];
	return 0;
}

int
hl_cmd_given(const hl_command *cmd, const void *opts, const char *name)
{
	const hl_common *c = opts;
	size_t i;

	for (i = 0; cmd->opt[i].name != NULL; i++)
		if (strcmp(cmd->opt[i].name, name) == 0)
			return (c->given >> i) & 1u;
	return 0;
}

/* "-o, --output FILE" or "--dtmin K" into buf; its length. */
static size_t
left_part(const hl_option *r, char *buf, size_t size)
{
	int n;

	if (r->letter != 0)
		n = snprintf(buf, size, "-%c, --%s%s%s", r->letter, r->name,
			     r->arg ? " " : "", r->arg ? r->arg : "");
	else
		n = snprintf(buf, size, "--%s%s%s", r->name,
			     r->arg ? " " : "", r->arg ? r->arg : "");
	return n < 0 ? 0 : (size_t)n;
}

/* The column of the help texts: after the longest single option. */
static int
help_column(const hl_command *cmd)
{
	char buf[128];
	size_t i, w = 17, n;

	for (i = 0; cmd->opt[i].name != NULL; i++) {
		if (cmd->opt[i].help == NULL ||
		    (i > 0 && cmd->opt[i - 1].help == NULL))
			continue;
		n = left_part(&cmd->opt[i], buf, sizeof buf);
		if (n > w)
			w = n;
	}
	return (int)w + 4;
}

/* The help text of one row, its later lines indented to col. */
static void
print_text(FILE *fp, const char *text, int col)
{
	const char *nl;

	while ((nl = strchr(text, '\n')) != NULL) {
		fprintf(fp, "%.*s\n%*s", (int)(nl - text), text, col, "");
		text = nl + 1;
	}
	fprintf(fp, "%s\n", text);
}

void
hl_cmd_help(const hl_command *cmd, FILE *fp)
{
	int col = help_column(cmd);
	char left[256];
	size_t i, n = 0;

	fprintf(fp, "Usage: heatloom %s %s\n\n%s\nOptions:\n", cmd->name,
		cmd->usage, cmd->about);
	for (i = 0; cmd->opt[i].name != NULL; i++) {
		if (n > 0 && n < sizeof left - 1)
			left[n++] = ' ';
		n += left_part(&cmd->opt[i], left + n, sizeof left - n);
		if (n >= sizeof left)
			n = sizeof left - 1;
		if (cmd->opt[i].help == NULL)
			continue;
		if ((int)n + 4 > col)
			fprintf(fp, "  %s\n%*s", left, col, "");
		else
			fprintf(fp, "  %-*s", col - 2, left);
		print_text(fp, cmd->opt[i].help, col);
		n = 0;
	}
	fputc('\n', fp);
	if (cmd->after != NULL)
		fprintf(fp, "%s\n", cmd->after);
	fprintf(fp, "%s\n", hl_caution);
}

int
hl_cmd_main(const hl_command *cmd, int argc, char **argv)
{
	void *opts = calloc(1, cmd->size);
	hl_error err;
	hl_status st;
	int rc;

	if (opts == NULL) {
		fprintf(stderr, "heatloom: %s: out of memory\n", cmd->name);
		return HL_EIO;
	}
	if (count_rows(cmd) > MAX_ROWS) {
		fprintf(stderr, "heatloom: %s: more than %d options in its "
			"table\n", cmd->name, MAX_ROWS);
		free(opts);
		return HL_EUSAGE;
	}
	hl_common_init(opts);
	if (cmd->init != NULL)
		cmd->init(opts);
	rc = parse(cmd, argc, argv, opts);
	if (rc == 0 && cmd->check != NULL)
		rc = cmd->check(opts);
	if (rc != 0) {
		free(opts);
		return rc < 0 ? 0 : rc;
	}
	hl_error_clear(&err);
	st = cmd->run(opts, &err);
	free(opts);
	if (st == HL_OK)
		return 0;
	if (err.status == HL_OK && err.text[0] == '\0')
		return (int)st;
	return hl_cmd_fail(&err);
}
