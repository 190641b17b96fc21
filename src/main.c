/* main.c - heatloom command dispatch. */
#include "config.h"

#include <stdio.h>
#include <string.h>

#include <libxml/parser.h>

#include "cmd.h"
#include "output.h"

static const hl_command *const commands[] = {
	&hl_cmd_targets,
	&hl_cmd_size,
	&hl_cmd_curves,
	&hl_cmd_sweep,
	&hl_cmd_audit,
	&hl_cmd_retrofit,
	&hl_cmd_matches,
	&hl_cmd_design,
	&hl_cmd_check,
	&hl_cmd_report,
};
#define NCOMMANDS (sizeof commands / sizeof commands[0])

static const hl_command *
find(const char *name)
{
	size_t i;

	for (i = 0; i < NCOMMANDS; i++)
		if (strcmp(commands[i]->name, name) == 0)
			return commands[i];
	return NULL;
}

static void
usage(FILE *fp)
{
	size_t i;

	fprintf(fp,
"Usage: heatloom COMMAND [options]\n"
"       heatloom help COMMAND | --help | --version\n"
"\n"
"Heat-recovery network synthesis from hot and cold stream tables: pinch and\n"
"minimum utility targets, utility levels, exchanger matches, a sized network,\n"
"the energy-capital trade-off over ΔTmin, and an audit of an existing site.\n"
"\n"
"Commands:\n");
	for (i = 0; i < NCOMMANDS; i++)
		fprintf(fp, "  %-9s %s\n", commands[i]->name,
			commands[i]->summary);
	fprintf(fp,
"\n"
"Units: °C, kW, kW/K, kW/(m²·K), m², currency per MWh.\n"
"Exit codes: 0 done, 1 usage, 2 invalid input, 3 no feasible answer or\n"
"solver failure, 4 input/output error.\n"
"\n"
"%s\n", hl_caution);
}

static int
help_command(int argc, char **argv)
{
	const hl_command *c;

	if (argc < 2) {
		usage(stdout);
		return 0;
	}
	c = find(argv[1]);
	if (c == NULL) {
		fprintf(stderr, "heatloom: help: no command '%s' (see "
			"'heatloom --help')\n", argv[1]);
		return 1;
	}
	hl_cmd_help(c, stdout);
	return 0;
}

int
main(int argc, char **argv)
{
	const hl_command *c;
	int rc;

	if (argc < 2) {
		usage(stderr);
		return 1;
	}
	if (strcmp(argv[1], "--help") == 0 || strcmp(argv[1], "-h") == 0) {
		usage(stdout);
		return 0;
	}
	if (strcmp(argv[1], "--version") == 0) {
		printf("%s\n", PACKAGE_STRING);
		return 0;
	}
	if (strcmp(argv[1], "help") == 0)
		return help_command(argc - 1, argv + 1);
	c = find(argv[1]);
	if (c == NULL) {
		fprintf(stderr, "heatloom: unknown command '%s' (see "
			"'heatloom --help')\n", argv[1]);
		return 1;
	}
	hl_output_install_signals();
	rc = hl_cmd_main(c, argc - 1, argv + 1);
	xmlCleanupParser();
	return rc;
}
