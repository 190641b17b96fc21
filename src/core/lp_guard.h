/* lp_guard.h - GLPK calls that never abort the process or print.
 *
 * GLPK calls abort() after an internal error unless its error hook leaves by
 * longjmp; after that every GLPK object is gone (glp_free_env). A guarded
 * section therefore looks like this, with all GLPK work inside work():
 *
 *	hl_lp_guard g;
 *
 *	hl_lp_guard_begin(&g, log, ctx);
 *	if (setjmp(g.jb) != 0)
 *		return hl_lp_guard_failed(&g, err);   (every glp_prob is gone)
 *	st = work(...);
 *	hl_lp_guard_end(&g);
 *
 * While a guard is active GLPK's terminal output goes to log (when not NULL)
 * and nowhere otherwise. Guards do not nest.
 */
#ifndef HL_LP_GUARD_H
#define HL_LP_GUARD_H

#include <setjmp.h>

#include "status.h"

typedef void (*hl_lp_log)(void *ctx, const char *text);

typedef struct {
	jmp_buf jb;
	hl_lp_log log;
	void *ctx;
} hl_lp_guard;

void hl_lp_guard_begin(hl_lp_guard *g, hl_lp_log log, void *ctx);
void hl_lp_guard_end(hl_lp_guard *g);
/* After the longjmp: free GLPK's environment, remove the hooks, and record
 * the failure in err (HL_ENOSOLUTION). */
hl_status hl_lp_guard_failed(hl_lp_guard *g, hl_error *err);

/* GLPK message level for a guard: everything when logging, else nothing. */
int hl_lp_guard_msg_lev(const hl_lp_guard *g);

#endif
