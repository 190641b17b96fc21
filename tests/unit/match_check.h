/* match_check.h - an independent check of a matches result.
 *
 * Written apart from the library's model: it recomputes each party's heat in
 * every interval from the case's raw data (cp times the overlap of its
 * shifted range, or a utility's load) and checks the result against the
 * physics, not against the model's own rows:
 *  - the boundaries hold every shifted segment end (cp constant inside);
 *  - every cold party takes exactly its heat in every interval, every hot
 *    party gives exactly its heat;
 *  - each match gives and takes its duty, and from the top down it never
 *    has taken more than it has given (heat only flows down);
 *  - no match works outside its subnetwork, and no heat crosses a
 *    subnetwork boundary (the cascade of all parties carries none there);
 *  - each subnetwork's unit count is its number of matches.
 * The heat balance of a problem-table cascade: Linnhoff & Flower (1978).
 */
#ifndef HL_TEST_MATCH_CHECK_H
#define HL_TEST_MATCH_CHECK_H

#include "case.h"
#include "match_milp.h"

/* 0 when every check holds; otherwise prints the first failure and
 * returns -1. rel: tolerance relative to the largest party heat. */
int hl_check_matches(const hl_case *c, double dtmin,
		     const hl_match_result *r, double rel);

#endif
