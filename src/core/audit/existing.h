/* existing.h - today's exchangers read against the case's streams.
 *
 * The rows of the existing network (hl_unit) are placed on the streams they
 * serve. Each side of a unit on a process stream covers a stretch of that
 * stream, counted as heat from the stream's supply end (kW): where a row
 * gives a temperature on that stream it fixes where the stretch starts, the
 * duty fixes its length, and what the rows leave out is walked from the
 * supply end with the stream's cp. That is "the reading" every later stage
 * uses; temperatures given in the rows are checks on it.
 *
 * Order along a stream: units that give an inlet (or outlet) temperature on
 * the stream by that temperature, from the supply end; a unit that gives
 * none follows the row before it on the same stream. Without temperatures
 * that is the row order, which must then list the units as they meet each
 * stream from its supply end. (One row order cannot follow every stream:
 * when two streams meet twice, the hot one meets the two units from its hot
 * end and the cold one from its cold end; temperatures settle it.)
 *
 * Parallel branches (a split stream): consecutive units whose given inlets
 * on the stream agree within 2·t_tol (and lie nearer each other than the
 * outlet the first ones leave) start at the same point; together they
 * take the sum of their duties; each takes the share duty / (heat of the
 * whole stream between its inlet and outlet) of the stream's cp, and a
 * branch without a given outlet leaves at the mixed temperature.
 *
 * Tolerances, per stream (its t_tol and cp_tol, else the settings'): a
 * temperature agrees with the reading within 2·t_tol + cp_tol × its
 * distance from the supply temperature (the walk adds up cp errors); a duty
 * agrees with cp × ΔT within cp_tol of the larger plus cp × 2·t_tol.
 *
 * Warnings (the reading goes on; each names the row's file and line):
 *  - a duty that disagrees with cp × ΔT between a unit's given inlet and
 *    outlet on a stream: when both sides' temperatures agree with each other
 *    and not with the duty, the duty is taken from them; otherwise the
 *    duty stands;
 *  - a given inlet beyond where the units before it leave the stream: the
 *    stretch between is a gap; one short of it: the units overlap and the
 *    duties win;
 *  - branch shares that do not add up to 1 within cp_tol;
 *  - a stream whose units stop short of its target: the rest is a gap;
 *  - an approach below the minimum (the two sides' ΔT contributions: ΔTmin
 *    by default);
 *  - a unit that cannot be estimated with its given shells (the Xp rule's
 *    count is used) or at all as shell-and-tube (counterflow is used).
 * Every gap becomes an implied utility unit (implied = 1), served by the
 * cheapest utility of the needed kind that can reach it (or none: util -1).
 *
 * Errors (HL_EINPUT, no sensible reading): a name that is no stream or
 * utility; a side naming the wrong kind (a cold stream as hot side); both
 * sides utilities; units that take a stream past its target by more than
 * its tolerance; a unit whose hot side is not above its cold side at both
 * ends as read.
 *
 * Areas: given, or estimated as duty / (U·F·LMTD) with 1/U = 1/h_hot +
 * 1/h_cold (film coefficients of the streams over the unit's stretch,
 * heat-weighted, or of the utility; h_default where none) and F of the given
 * shells or of the Xp rule (Ahmad, Linnhoff & Smith 1988; F = 1 for the
 * counterflow setting).
 *
 * Ownership: the result owns everything in it; hl_existing_free(NULL) is
 * fine. It points into the case (file names), which must outlive it.
 */
#ifndef HL_EXISTING_H
#define HL_EXISTING_H

#include <stddef.h>

#include "case.h"
#include "status.h"

typedef enum {
	HL_ROLE_RECOVERY = 0,  /* process stream to process stream */
	HL_ROLE_HEATER = 1,    /* hot utility to a cold stream */
	HL_ROLE_COOLER = 2     /* hot stream to a cold utility */
} hl_unit_role;

/* One side of a unit as read. */
typedef struct {
	long stream;        /* process stream index, -1 for a utility side */
	long util;          /* utility index, -1 for a stream side (and for
			       a gap that no utility can serve) */
	double given_in;    /* °C from the row, NaN when not given */
	double given_out;
	double t_in, t_out; /* °C as read */
	double q_in, q_out; /* kW of the whole stream from its supply end at
			       t_in and t_out (stream sides only) */
	double share;       /* fraction of the stream's cp (1 unless split) */
	double h;           /* kW/(m²·K) used for U */
	int h_assumed;      /* 1 when h_default stood in */
} hl_side;

typedef struct {
	char *name;
	hl_unit_role role;
	int implied;        /* 1: a gap the rows leave, not a row */
	hl_side hot, cold;
	double duty;        /* kW as read */
	double u;           /* kW/(m²·K) from the film coefficients */
	double lmtd;        /* K, counterflow, from the ends as read */
	double f;           /* F of its shells (1 for counterflow) */
	hl_exchanger_type type; /* its row's, else hl_case_pair_type */
	int shells;         /* in series: given, else estimated */
	int parallel;       /* trains in parallel (estimated area), 1 */
	unsigned warn;      /* HL_EXCH_WARN_* of an estimated area */
	double area;        /* m², given or estimated; NaN when neither */
	int area_estimated; /* 1: estimated, not given */
	double approach;    /* K, the smaller end difference */
	const char *file;   /* the row's (the stream's for a gap) */
	long line;
} hl_existing_unit;

typedef struct {
	size_t nunit;             /* rows first, in row order, then gaps */
	size_t nrow;
	hl_existing_unit *unit;
	size_t nutil;
	double *util_load;        /* kW today, per case utility */
	double hot_now;           /* kW: heaters and cold-stream gaps */
	double cold_now;          /* kW: coolers and hot-stream gaps */
	double cost_now;          /* per year: each utility's load × price ×
				     hours / 1000 */
	double area;              /* m², Σ of the units with an area */
	double area_recovery;     /* m², process-to-process units only */
	int shells;               /* Σ shells of the units with an area */
	size_t nestimated;        /* units whose area was estimated */
	size_t nwarn;
	hl_error *warn;           /* warnings in the order found */
} hl_existing;

/* Read c's existing network (c->unit) against its streams and utilities at
 * c->set.dtmin. On HL_EINPUT *out still holds the warnings found before the
 * error (the caller shows and frees them); on other errors *out is NULL.
 * An empty network is HL_EINPUT. */
hl_status hl_existing_build(const hl_case *c, hl_existing **out,
			    hl_error *err);
void hl_existing_free(hl_existing *net);

/* The name of a side: its stream's or utility's, "(no utility)" for a gap
 * none can serve. */
const char *hl_existing_side_name(const hl_case *c, const hl_side *s);

/* Role names: "recovery", "heater", "cooler". */
const char *hl_existing_role_name(hl_unit_role r);

#endif
