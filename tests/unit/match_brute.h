/* match_brute.h - fewest units by exhaustive search, for small problems.
 *
 * Independent of the library: its own shifted intervals and problem-table
 * cascade (Linnhoff & Flower 1978) with one hot utility at the top and one
 * cold utility at the bottom, its own split at every boundary without heat
 * flow, and, in each part, every subset of hot/cold pairs by increasing
 * size, each tested by its own LP in transportation form (Cerda &
 * Westerberg 1983): x[a][k'][b][k] >= 0 for k' at or above k, hot heat per
 * interval given away exactly, cold heat per interval received exactly.
 * Streams have one segment and the default shift ΔTmin/2.
 */
#ifndef HL_TEST_MATCH_BRUTE_H
#define HL_TEST_MATCH_BRUTE_H

#include <stddef.h>

#include "case.h"

#define HL_BRUTE_MAX_SUB 8
#define HL_BRUTE_MAX_PAIRS 24

typedef struct {
	size_t nsub;
	size_t units[HL_BRUTE_MAX_SUB];   /* fewest units per part, top first */
	size_t optima[HL_BRUTE_MAX_SUB];  /* how many subsets reach it */
	/* One optimal subset per part: names of hot and cold, "" ends. */
	char best[HL_BRUTE_MAX_SUB][HL_BRUTE_MAX_PAIRS][2][32];
	double qh, qc;                     /* the cascade's targets, kW */
} hl_brute;

/* 0 on success, -1 when the problem is too large for the search. */
int hl_brute_units(const hl_case *c, double dtmin, hl_brute *out);

#endif
