/* netsim.h - a network of fixed areas simulated: the plant as it would run.
 *
 * Given a network's structure (units on their stages, split shares) and
 * every recovery unit's area (a held unit's: area_today + area_added),
 * shells and type, the simulation finds every
 * temperature and duty for the streams' supply temperatures and flows:
 *
 *  - a recovery unit (process stream to process stream) does what its area
 *    allows (rating.h) at the inlets its streams bring it, except that a
 *    bypass holds it to the heat its streams have left before their targets
 *    (no unit gives or takes more than its stream has left before its
 *    target: the plant's temperature control, common practice, no source);
 *  - a heater or cooler holds the temperature its stage mixes to on entry
 *    (its set point: the target when it is the stream's last stage) and its
 *    duty makes up the rest of the stage; several utility units in one stage
 *    share the make-up in proportion to their duties on entry. A utility
 *    side keeps its inlet and outlet temperatures (its flow follows).
 *
 * The recovery duties depend on each other through the streams' inlet
 * temperatures; the simulation sweeps the streams stage by stage from the
 * supply end, re-rating each unit with the latest inlets (Gauss–Seidel on
 * the units' duties), until no duty moves by more than 1e-11 of the largest
 * duty. With constant cp the relation between the duties is linear and the
 * sweep converges where the plant has a steady state; HL_ENOSOLUTION after
 * NETSIM_MAX_SWEEPS without it.
 *
 * What the result says is wrong (the network is still written through):
 *  - a stream that ends off its target (its last stage holds no utility
 *    and the recovery falls short, or a make-up had to stop at 0; a
 *    stream without units falls short by its whole load):
 *    shortfall[p] kW more heat is needed there (a trim heater or cooler),
 *    negative when the stream passes its target; the simulation does not
 *    add a trim;
 *  - a utility unit whose stage already passes its set point (its make-up
 *    would be negative): it is set to 0 and named in why;
 *  - a recovery unit left with no duty (its inlets meet).
 *
 * Units: °C, kW. Errors: HL_EINPUT for a network whose units lack an area
 * or shells, HL_ENOSOLUTION when the sweeps do not settle, HL_EIO memory.
 */
#ifndef HL_NETSIM_H
#define HL_NETSIM_H

#include <stddef.h>

#include "network.h"
#include "status.h"

#define NETSIM_MAX_SWEEPS 2000

typedef struct {
	int sound;          /* 1: every stream at its target, no negative
			       make-up, no idle unit */
	char why[256];      /* the first reason when not sound */
	double *shortfall;  /* kW per party (process streams; 0 at the
			       target, > 0 short of it, < 0 past it); owned */
	double qh, qc;      /* kW of hot and cold utility */
	double approach;    /* K, the smallest approach of any recovery unit */
	int sweeps;
} hl_netsim;

/* Simulate net in place: every unit's duty and terminal temperatures. *out
 * (free with hl_netsim_free) says how sound the result is. Areas and shells
 * are not changed; sizes (U, LMTD, F, area, cost) are not recomputed. */
hl_status hl_netsim_run(hl_network *net, hl_netsim **out, hl_error *err);
void hl_netsim_free(hl_netsim *r);

#endif
