/* netcheck.h - verify a network from its own data, whoever made it.
 *
 * Everything is recomputed from the parties (streams with their segments,
 * utilities with their loads) and the settings the network carries; nothing
 * is taken from the placement that built it:
 *
 *  - each unit joins a hot and a cold party and its duty is positive;
 *  - each side's heat balance: duty = share × the heat of the stream's
 *    profile between the side's inlet and outlet; a utility side runs from
 *    the utility's supply towards its target without passing it;
 *  - each process stream: its stages numbered 1, 2, … without gaps, every
 *    branch of a stage entering at the temperature the previous stage mixes
 *    to (the supply for stage 1), a stage's shares summing to 1, the last
 *    stage mixing to the target, so that the units exchange the duty;
 *  - each utility: its units' duties sum to its load, their shares to 1;
 *  - the approach at both ends of every unit, and inside it where a cp
 *    changes, at least min(EMAT, ΔT_hot + ΔT_cold) (network.h);
 *  - sizing: U, LMTD, F, shells, area and cost recomputed (network.h,
 *    exchanger.h); a held retrofit unit at its own shells, its area needed
 *    within the area it has today plus the area added (network_held.c),
 *    a held fired heater's duty within its rating plus the firing added;
 *  - the utilities used against the targets of the problem table recomputed
 *    from the streams, plus the penalties the network declares; with priced
 *    utilities and no penalty, the cost of the mix against the least-cost
 *    mix of the utility LP;
 *  - the network's totals (area, capital, costs).
 *
 * Tolerances: 1e-6 relative (to the larger of 1 and the quantity) for
 * heats, temperatures and sizes: far above the 12 significant digits the
 * writers keep, far below any change that matters.
 *
 * Ownership: the report owns its findings; hl_netcheck_free(NULL) is fine.
 * Errors: only HL_EIO (memory); problems with the network are findings.
 */
#ifndef HL_NETCHECK_H
#define HL_NETCHECK_H

#include <stddef.h>

#include "network.h"
#include "status.h"

typedef struct {
	char what[64];      /* the unit id, or the stream or utility name */
	long line;          /* its line in the network file, 0 when built */
	char text[400];     /* what is wrong, with the numbers */
} hl_netcheck_finding;

typedef struct {
	size_t n, cap;
	hl_netcheck_finding *f;
	double qh_min, qc_min;  /* kW: targets recomputed from the streams */
	size_t checked;         /* units checked */
} hl_netcheck;

/* Check net; *out lists the findings (none: the network is sound). */
hl_status hl_netcheck_run(const hl_network *net, hl_netcheck **out,
			  hl_error *err);
void hl_netcheck_free(hl_netcheck *r);

#endif
