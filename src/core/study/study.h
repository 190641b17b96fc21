/* study.h - the stages of a design study chained once: the problem table,
 * the utility LP (when the case has utilities), the match MILP at the LP's
 * loads, and the placement and sizing of the network from the matches.
 *
 * `design`, `report` (and the retrofit to come) each need the chain; they
 * differ in what a stage without an answer means (a failure, or a note in a
 * section), so each stage is its own call and the caller decides.
 *
 * Ownership: every pointer in hl_study is owned by it; hl_study_free frees
 * them all (a zeroed hl_study is empty and fine to free). The case is the
 * caller's and must outlive the study.
 */
#ifndef HL_STUDY_H
#define HL_STUDY_H

#include "cascade.h"
#include "case.h"
#include "match_milp.h"
#include "network.h"
#include "network_match.h"
#include "utility_lp.h"

typedef struct {
	int verbose;            /* the solvers' messages to log */
	hl_glpk_log log;        /* NULL: discard */
	int match_log;          /* also the match MILP's messages */
	double time_limit;      /* s per subnetwork of the match MILP; NaN:
				   the case's */
} hl_study_opts;

typedef struct {
	hl_cascade *cas;        /* the problem table at the case's ΔTmin */
	hl_utility_lp *lp;      /* NULL without utilities */
	hl_match_result *mr;    /* after hl_study_matches */
	hl_network_feed feed;   /* after hl_study_network: its input */
	hl_network *net;        /* after hl_study_network */
} hl_study;

/* The problem table and, with utilities, the utility LP at c's ΔTmin. */
hl_status hl_study_targets(const hl_case *c, const hl_study_opts *o,
			   hl_study *s, hl_error *err);
/* The fewest units at the LP's loads (without utilities, the implicit
 * pair at the problem-table targets). */
hl_status hl_study_matches(const hl_case *c, const hl_study_opts *o,
			   hl_study *s, hl_error *err);
/* The matches placed on their streams and every unit sized. */
hl_status hl_study_network(const hl_case *c, hl_study *s, hl_error *err);
void hl_study_free(hl_study *s);

#endif
