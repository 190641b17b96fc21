/* network_match.h - a placement input from the match MILP's result.
 *
 * The parties follow the result's order (process streams, then case
 * utilities, then implicit ones), so that every match's hot and cold index
 * carries over; streams take their segments and ΔT contributions from the
 * case, utilities their temperatures, prices and film coefficients; the
 * matches keep their per-interval loads (pointers into the result, which
 * must outlive the input) over the result's shifted intervals.
 *
 * Ownership: hl_network_from_matches fills a hl_network_feed that owns the
 * parties and matches; hl_network_feed_free(NULL) is fine.
 */
#ifndef HL_NETWORK_MATCH_H
#define HL_NETWORK_MATCH_H

#include "cascade.h"
#include "case.h"
#include "match_milp.h"
#include "network.h"
#include "utility_lp.h"

typedef struct {
	hl_network_input in;      /* what hl_network_place takes */
	hl_network_party *party;  /* owned, in.nparty of them */
	hl_network_match *match;  /* owned, in.nmatch of them */
	hl_network_typed *typed;  /* owned, in.ntyped: the case's type rules
				     on these parties */
} hl_network_feed;

/* qh_min, qc_min: the problem-table targets (kW) at c's dtmin; the hot
 * utility the result uses above qh_min is what the match rules added. */
hl_status hl_network_from_matches(const hl_case *c,
				  const hl_match_result *r, double qh_min,
				  double qc_min, hl_network_feed *out,
				  hl_error *err);
void hl_network_feed_free(hl_network_feed *f);

/* The largest EMAT below the one in use (in steps of ΔTmin/10, down to
 * ΔTmin/2) at which in's matches place without moving heat to utilities;
 * NaN when none does. Each step is one more placement. */
double hl_network_emat_hint(const hl_network_input *in);

/* Shifted temperatures (°C) of the process pinches and the utility LP's
 * pinches (lp may be NULL), each once, hottest first, at most max of them:
 * where a grid diagram draws its dashed lines. Returns their count. */
size_t hl_network_pinches(const hl_cascade *cas, const hl_utility_lp *lp,
			  double *t, size_t max);

#endif
