/* match_milp.h - the fewest exchanger units and the heat load of each match.
 *
 * Method: the expanded transshipment MILP of Papoulias & Grossmann (1983),
 * Comput. Chem. Eng. 7, 707-721. The shifted temperature intervals of the
 * process streams and utilities are the nodes; every hot party (hot stream
 * or hot utility) puts its heat into the intervals it spans and passes what
 * it does not give away down to the next interval; every cold party takes
 * its heat in the intervals it spans. Utilities enter at fixed loads: the
 * loads of the utility LP, or, without them, one implicit hot utility above
 * every temperature and one implicit cold utility below, at the problem-table
 * targets. A binary per allowed hot/cold pair counts the units.
 *
 * Every boundary that carries no heat (a process or utility pinch) splits
 * the problem into subnetworks that are solved separately; a pair working on
 * both sides of a pinch is two units. The model is tightened (per-interval
 * and per-pair bounds from the heat cascade, a lower bound on the units from
 * the balanced subsets of the subnetwork, at-least-k-matches rows, symmetry
 * rows for identical parties) and GLPK starts from an incumbent found by an
 * LP-based heuristic: see doc/methods.md. Among the solutions with the
 * fewest units, a second LP chooses the loads that minimise an area estimate.
 *
 * Match rules (c->rule) forbid, require or bound pairs; plant areas forbid or
 * penalise cross-area pairs (c->set.area_policy). When restrictions keep the
 * utility targets out of reach, a transshipment LP without binaries finds the
 * restricted-match targets first, and each restriction's share of the rise.
 *
 * Ownership: a problem borrows the case (which must outlive it); a result
 * owns everything in it. All free functions accept NULL.
 * Errors: HL_EINPUT for rules that name unknown streams or contradict each
 * other, HL_ENOSOLUTION when no network meets the rules or the solver fails,
 * HL_EIO when memory runs out. Units: °C, kW, s.
 */
#ifndef HL_MATCH_MILP_H
#define HL_MATCH_MILP_H

#include <stddef.h>

#include <glpk.h>

#include "case.h"
#include "glpk_guard.h"
#include "status.h"

/* The largest model hl_match_solve takes, in pair-intervals (allowed
 * hot/cold pairs, plus each stream with a utility, times twice the parties:
 * an upper bound on the model's heat columns). About 150 streams without
 * plant areas; GLPK would need minutes for the root LP alone well below it,
 * where the time limit stops the solve instead. */
#define HL_MATCH_MAX_SIZE 2.0e6

/* Who takes part: a process stream, a case utility, or an implicit one. */
typedef enum {
	HL_PARTY_STREAM = 0,
	HL_PARTY_UTILITY = 1,
	HL_PARTY_IMPLICIT = 2
} hl_party_type;

typedef struct {
	char *name;
	hl_kind kind;
	hl_party_type type;
	long index;         /* into c->stream or c->util; -1 when implicit */
	double load;        /* kW: stream duty, or utility load used */
	double given_load;  /* kW: utility load as given (before restrictions) */
	double shift;       /* K: shifted = real - shift (hot), + shift (cold) */
	double top, bottom; /* shifted °C of its range; equal when isothermal */
	double supply, target; /* real °C */
	int isolated;       /* process stream none of whose pairs with process
			       streams is allowed: its duty goes to utilities */
	double utility_duty; /* process streams: kW exchanged with utilities */
} hl_match_party;

typedef struct {
	size_t hot, cold;   /* indices into hl_match_result.party */
	size_t sub;         /* index into hl_match_result.sub */
	double duty;        /* kW */
	double *give;       /* per interval: kW leaving the hot side there */
	double *take;       /* per interval: kW entering the cold side there */
	double hot_from, hot_to;   /* real °C: hot side, hottest first */
	double cold_from, cold_to; /* real °C: cold side, coldest first */
	int required;       /* set by a require rule */
	int cross_area;     /* joins two plant areas */
} hl_match;

/* A subnetwork: the intervals between two boundaries without heat flow. */
typedef struct {
	char label[40];     /* "whole", "above-pinch-1", "between-pinch-1-2",
			       "below-pinch-1": see doc/results.md */
	size_t first, last; /* its intervals, first..last inclusive */
	double top, bottom; /* shifted °C */
	size_t nparty;      /* N: parties with heat in it */
	size_t units;       /* units found */
	size_t euler;       /* N - 1, the Euler/Hohmann count */
	size_t lower;       /* proven lower bound on its units */
	size_t subset_bound; /* N minus the most balanced subsets it splits in */
	double objective;   /* units, cross-area ones at their penalty */
	double bound;       /* proven lower bound on the objective */
	int optimal;        /* 1: proven optimal, 0: best found */
	double gap;         /* (objective - bound) / objective */
	double seconds;     /* solver time, s */
	size_t group;       /* subnetworks solved together share a group */
} hl_match_sub;

/* What one restriction (a rule or the area policy) does. */
typedef struct {
	long rule;          /* index into c->rule; -1 for the plant areas */
	size_t pairs;       /* hot/cold pairs it applies to */
	double rise;        /* kW of hot utility it alone adds: the restricted
			       target minus the target without it */
} hl_match_cause;

typedef struct {
	size_t nparty;
	hl_match_party *party;  /* process streams in case order, then utilities */
	size_t nint;
	double *t;              /* nint + 1 shifted boundaries, °C, falling */
	size_t nsub;
	hl_match_sub *sub;      /* hottest first */
	size_t nmatch;
	hl_match *match;        /* by subnetwork, then hot, then cold */
	size_t units, euler, lower;
	double objective, bound;
	int optimal;            /* every subnetwork proven optimal */
	double gap;
	double seconds;
	double qh0, qc0;        /* kW: utility totals as given */
	double qh, qc;          /* kW: utility totals used */
	int restricted;         /* the rules raised the targets */
	size_t ncause;
	hl_match_cause *cause;  /* every restriction, in rule order */
	int penalised;          /* cross-area pairs carry a penalty */
	int implicit_utilities; /* no utility loads were given */
} hl_match_result;

/* Progress of a long solve, reported about twice a second. */
typedef struct {
	const char *label;      /* subnetwork (of the group) being solved */
	size_t done, total;     /* groups finished, groups in all */
	double elapsed;         /* s in this group */
	double incumbent;       /* best objective found, HUGE_VAL when none */
	double bound;           /* proven lower bound */
} hl_match_progress;

typedef struct {
	double time_limit;      /* s per subnetwork, >= 0; 0: heuristic only */
	int textbook;           /* the plain model: big-M = the smaller heat,
				   no cuts, no heuristic (for comparison) */
	int threads;            /* subnetworks solved at once: 1 or 2 (default
				   2, never more than the processors online);
				   each thread has its own GLPK environment */
	hl_glpk_log log;        /* GLPK's own output, NULL for none */
	void (*progress)(void *ctx, const hl_match_progress *p);
	void *ctx;              /* passed to log and progress */
} hl_match_options;

void hl_match_options_default(hl_match_options *o, const hl_case *c);

typedef struct hl_match_problem hl_match_problem;

/* Check the rules, fix the utility loads (util_load: kW per case utility,
 * as c->util, or NULL for the implicit pair at the problem-table targets),
 * lift them to the restricted-match targets when the rules demand it, and
 * split the problem at its pinches. log may be NULL. */
hl_status hl_match_prepare(const hl_case *c, double dtmin,
			   const double *util_load, hl_glpk_log log, void *ctx,
			   hl_match_problem **out, hl_error *err);
void hl_match_problem_free(hl_match_problem *p);

/* The MILP that hl_match_run solves, every subnetwork in one model (rows
 * and columns named by subnetwork and party), for writing out with
 * glp_write_lp/_mps: o->textbook picks the plain form, and the balanced-
 * subset bounds are refined within a quarter of o->time_limit. The caller
 * deletes it with glp_delete_prob. Call inside an hl_glpk_guard. */
hl_status hl_match_model(const hl_match_problem *p,
			 const hl_match_options *o, glp_prob **out,
			 hl_error *err);

/* Solve every subnetwork and choose the loads. */
hl_status hl_match_run(const hl_match_problem *p, const hl_match_options *o,
		       hl_match_result **out, hl_error *err);

/* hl_match_prepare + hl_match_run. */
hl_status hl_match_solve(const hl_case *c, double dtmin,
			 const double *util_load, const hl_match_options *o,
			 hl_match_result **out, hl_error *err);

void hl_match_result_free(hl_match_result *r);

#endif
