/* lp_guard.c - GLPK error and terminal hooks. */
#include <glpk.h>

#include "lp_guard.h"

static void
on_error(void *info)
{
	hl_lp_guard *g = info;

	longjmp(g->jb, 1);
}

static int
on_text(void *info, const char *s)
{
	hl_lp_guard *g = info;

	if (g->log != NULL)
		g->log(g->ctx, s);
	return 1; /* never GLPK's own printing */
}

void
hl_lp_guard_begin(hl_lp_guard *g, hl_lp_log log, void *ctx)
{
	g->log = log;
	g->ctx = ctx;
	glp_error_hook(on_error, g);
	glp_term_hook(on_text, g);
	glp_term_out(log != NULL ? GLP_ON : GLP_OFF);
}

void
hl_lp_guard_end(hl_lp_guard *g)
{
	(void)g;
	glp_error_hook(NULL, NULL);
	glp_term_hook(NULL, NULL);
	glp_term_out(GLP_OFF);
}

hl_status
hl_lp_guard_failed(hl_lp_guard *g, hl_error *err)
{
	glp_error_hook(NULL, NULL);
	glp_free_env();
	hl_lp_guard_end(g);
	return hl_error_set(err, HL_ENOSOLUTION, NULL, 0,
		"the solver (GLPK) stopped on an internal error; run with "
		"--verbose to see its messages");
}

int
hl_lp_guard_msg_lev(const hl_lp_guard *g)
{
	return g->log != NULL ? GLP_MSG_ON : GLP_MSG_OFF;
}
