/* profile.h - temperature against heat along one stream, and what one
 * exchanger sees between two such profiles.
 *
 * A process stream is a chain of segments of constant cp (case.h), so its
 * temperature is a piecewise-linear function of the heat it has exchanged
 * since its supply end. The heat q is counted on the whole stream's flow
 * (kW, >= 0 in the direction the stream runs: released by a hot stream,
 * taken by a cold one); a branch carrying the fraction s of the flow that
 * exchanges d kW moves the stream coordinate by d/s. Outside the stream's
 * own range the end segments' cp continue, so a branch of a split stream may
 * leave above a cold stream's target (or below a hot stream's) before it
 * mixes back.
 *
 * A side of an exchanger is either a stretch of a process stream (segments,
 * share, inlet) or a utility (linear between its inlet and outlet, or
 * isothermal). Between two sides in counterflow the approach (hot minus cold
 * temperature at the same point of the unit) is piecewise linear with
 * corners only where either side changes cp, so its minimum lies at an end
 * or a corner, and the unit's area is the sum over the pieces between
 * corners of q_k/(U·LMTD_k).
 *
 * Pure numerics: nothing here allocates, prints or fails.
 */
#ifndef HL_PROFILE_H
#define HL_PROFILE_H

#include <stddef.h>

#include "case.h"

/* Heat (kW, whole flow) a stream of nseg segments (supply end first) has
 * exchanged on reaching temperature t (°C); negative before the supply end,
 * above the duty past the target end. */
double hl_profile_heat(const hl_segment *seg, size_t nseg, hl_kind kind,
		       double t);

/* The inverse: temperature (°C) after exchanging q kW (whole flow). */
double hl_profile_temp(const hl_segment *seg, size_t nseg, hl_kind kind,
		       double q);

/* One side of an exchanger, from its inlet t_in to its outlet t_out (°C).
 * For a process stream (nseg >= 1) the unit covers the stretch of the
 * stream's profile between the two temperatures, whatever share of the flow
 * passes (the share only scales the heat); for a utility (nseg = 0) the
 * temperature is linear in the heat, constant when t_in = t_out. */
typedef struct {
	const hl_segment *seg;
	size_t nseg;
	hl_kind kind;
	double t_in, t_out;
	double h;       /* kW/(m²·K): a utility's film coefficient, or the one
			   for segments that give none (h_default) */
} hl_profile_side;

/* What a unit of duty d (kW, > 0) sees between its hot and cold side in
 * counterflow. */
typedef struct {
	double approach;  /* K: the smallest hot − cold difference anywhere */
	double dt_hot;    /* K: hot_in − cold_out */
	double dt_cold;   /* K: hot_out − cold_in */
	double lmtd;      /* K: d / Σ_k (q_k / LMTD_k) over the pieces between
			     cp changes; NaN when some difference is <= 0 */
	double u;         /* kW/(m²·K): the U that with lmtd gives the sum of
			     the pieces' areas, Σ_k q_k/(U_k·LMTD_k), U_k from
			     the h of the segments piece k lies in */
	size_t pieces;    /* 1 when both sides are linear across the unit */
	double h_hot;     /* kW/(m²·K) of the hottest piece, each side (the */
	double h_cold;    /* unit's own when it is one piece) */
	int assumed_hot;  /* a piece of a process side used side->h because */
	int assumed_cold; /* its segment gives no h */
} hl_profile_unit;

/* Counterflow mean of the pieces between the corners of both profiles,
 * each by the log mean of its end differences (Kern 1950, ch. 5, per
 * piece of constant cp), with 1/U_k = 1/h_hot,k + 1/h_cold,k. */
void hl_profile_unit_eval(const hl_profile_side *hot,
			  const hl_profile_side *cold, double d,
			  hl_profile_unit *out);

#endif
