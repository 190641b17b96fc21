/* glpk_guard.h - running GLPK without letting it print, abort or hang.
 *
 * GLPK reports a misuse of its API (a bad index, inconsistent bounds) by
 * printing a message and calling abort(). doc/design.md forbids both in the
 * core: a guard installs glp_error_hook with a jump back into the caller,
 * sends GLPK's terminal output to a log callback (or nowhere), and maps the
 * outcome of a solver call to an hl_status with a sentence a user
 * understands.
 *
 * Use (setjmp must run in the function that owns the GLPK objects, so it is
 * a macro; variables changed after it and read after a jump must be volatile):
 *
 *	hl_glpk_guard g;
 *
 *	hl_glpk_guard_begin(&g, log, ctx, verbose);
 *	if (HL_GLPK_CRASHED(&g))
 *		return hl_glpk_guard_crash(&g, "the utility LP", err);
 *	P = glp_create_prob(); ... hl_glpk_simplex_direct(P, &g, ...) ...
 *	glp_delete_prob(P);
 *	hl_glpk_guard_end(&g);
 *
 * After a crash every GLPK object is gone (glp_free_env): never touch P
 * again. Memory the caller allocated itself must be freed by the caller.
 * GLPK's environment is per thread; one guard at a time per thread.
 */
#ifndef HL_GLPK_GUARD_H
#define HL_GLPK_GUARD_H

#include <setjmp.h>

#include <glpk.h>

#include "status.h"

/* Receives GLPK's terminal output, a piece at a time (not line-buffered). */
typedef void (*hl_glpk_log)(void *ctx, const char *text);

typedef struct {
	jmp_buf jump;
	hl_glpk_log log;   /* NULL: discard */
	void *log_ctx;
	int verbose;       /* 1: GLPK's progress messages are produced */
	int infeasible;    /* set by the simplex calls: proven infeasible */
	char last[256];    /* the last line GLPK wrote, for error messages */
	size_t lastlen;
} hl_glpk_guard;

/* Install the error and terminal hooks; verbose asks GLPK for its normal
 * messages (passed to log), otherwise it is silent. */
void hl_glpk_guard_begin(hl_glpk_guard *g, hl_glpk_log log, void *ctx,
			 int verbose);
/* Remove the hooks. */
void hl_glpk_guard_end(hl_glpk_guard *g);

/* True after GLPK hit an internal error and jumped back here. */
#define HL_GLPK_CRASHED(g) (setjmp((g)->jump) != 0)

/* After a crash: free GLPK's environment, record HL_ENOSOLUTION with what
 * failed and GLPK's own last words. */
hl_status hl_glpk_guard_crash(hl_glpk_guard *g, const char *what,
			      hl_error *err);

/* The simplex method on P with a time limit (s, > 0), scaling and the
 * guard's message level. HL_OK only when the solution is proven optimal;
 * otherwise HL_ENOSOLUTION with a sentence naming what ("the utility LP"):
 * infeasible (g->infeasible = 1), unbounded, time limit, numerical trouble.
 * The answer comes from the plain simplex on the original rows: GLPK's
 * presolver's tolerance-based reductions can return an "optimal" point of
 * the original LP that leaves heat unserved (seen: 4e-4 kW in a utility LP
 * a 0.01 kW step from a change of basis, the cost too low by half) or call
 * a feasible LP infeasible. So the presolved solve only supplies a basis:
 * the plain simplex restarts from it and keeps every row to its own
 * tolerance; when the presolved solve fails, the plain simplex starts from
 * an advanced basis (glp_adv_basis) instead. For LPs whose answers are
 * compared with each other at nearby data. */
hl_status hl_glpk_simplex_direct(glp_prob *P, hl_glpk_guard *g,
				 double time_limit, const char *what,
				 hl_error *err);
/* The same from P's current basis, without presolve or rescaling: for a
 * re-solve after a change that keeps an optimal basis primal feasible
 * (an objective, bounds fixed at the values of nonbasic columns). GLPK's
 * presolver would re-derive feasibility from the rounded data and can call
 * such a problem infeasible; the basis already proves it is not. */
hl_status hl_glpk_simplex_warm(glp_prob *P, hl_glpk_guard *g,
			       double time_limit, const char *what,
			       hl_error *err);

#endif
