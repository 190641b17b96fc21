/* rfit_int.h - the retrofit search's working parts (private to rfit_*.c).
 *
 * A candidate is a network (a copy of today's with modifications applied
 * to its structure and areas) and the list of what was done to it. An
 * evaluation simulates it, adds the trims and utility area it needs, sizes
 * and prices it (rfit_eval.c); the moves change its structure
 * (rfit_moves.c); the search strings them together (rfit_search.c).
 */
#ifndef HL_RFIT_INT_H
#define HL_RFIT_INT_H

#include <stddef.h>

#include "network.h"
#include "rfit.h"

/* Modifications a candidate may carry (search moves plus derived). */
#define RFIT_MAX_MODS 48

typedef struct {
	hl_network *net;
	size_t nmod;              /* search moves, derived ones after them */
	size_t nmove;             /* of which search moves */
	hl_rfit_mod mod[RFIT_MAX_MODS];
	double investment, saving, payback;
	double qh, qc, cost;      /* kW, kW, utility cost per year */
	int ok;                   /* simulated, at targets, checked */
	char why[256];            /* why not */
} rf_cand;

typedef struct {
	const hl_case *c;
	const hl_rfit_opts *o;
	double cost_today;        /* utility cost per year today */
	double qh_today, qc_today;
	double area_ref;          /* m², mean area of today's recovery units */
	double qh_target, qc_target;  /* kW, the problem table's */
	size_t evaluated;
	double t_end;             /* clock time the search must stop at */
	int timed_out;
} rf_ctx;

/* Utility shares and loads, sizes at the units' own shells (area added
 * where a new duty needs it), targets and totals of net. HL_EINPUT (in
 * err) when a unit cannot be sized. */
hl_status hl_rfit_finish(const hl_case *c, hl_network *net, hl_error *err);
/* The same with the targets known (kW). */
hl_status rf_finish(hl_network *net, double qh_target, double qc_target,
		    hl_error *err);

/* Simulate, trim, size and price cand in place (cand->ok says whether it
 * is a valid plant). HL_EIO only. */
hl_status rf_eval(rf_ctx *x, rf_cand *cand);

/* A copy of src (network deep-copied); NULL-net on memory failure. */
int rf_cand_copy(rf_cand *dst, const rf_cand *src);
void rf_cand_clear(rf_cand *c);

/* Within the limits of x->o. */
int rf_within(const rf_ctx *x, const rf_cand *c);

/* Structural moves on a network; 0 on success, -1 when impossible. */
int rf_move_remove(hl_network *net, size_t i);
int rf_move_place(hl_network *net, size_t i, int hot_pos, int cold_pos);
int rf_move_repipe(hl_network *net, size_t i, size_t hot, size_t cold,
		   int hot_pos, int cold_pos);
/* Temperature of party p where its stage pos begins (its target past the
 * last). */
double rf_temp_at(const hl_network *net, size_t p, int pos);
/* The units at stages k and k + 1 of party p (one each, recovery units)
 * become branches of stage k with shares s and 1 − s; the two branches of
 * stage k put in series (swap: the second first). 0 or -1; *a, *b the
 * units (may be NULL). */
int rf_move_split(hl_network *net, size_t p, int k, double s, size_t *a,
		  size_t *b);
int rf_move_unsplit(hl_network *net, size_t p, int k, int swap, size_t *a,
		    size_t *b);
/* Take out the trims (new heaters and coolers). */
void rf_strip_trims(hl_network *net);
/* Number of stages on party p. */
int rf_stages(const hl_network *net, size_t p);
/* "stage k of NAME" style description of a unit's place. */
void rf_place_text(const hl_network *net, const hl_network_unit *u,
		   char *buf, size_t n);
/* Is unit i a recovery unit. */
int rf_recovery(const hl_network *net, const hl_network_unit *u);

/* Seconds on a monotonic clock. */
double rf_now(void);

#endif
