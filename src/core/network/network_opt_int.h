/* network_opt_int.h - the optimiser's working state (private to
 * network_opt*.c): the superstructure of a case, the loads of one walk and
 * their evaluation, incremental by stream. */
#ifndef HL_NETWORK_OPT_INT_H
#define HL_NETWORK_OPT_INT_H

#include <stddef.h>
#include <stdint.h>

#include "network_opt.h"

/* Loads below this (kW) are no unit. */
#define HL_OPT_QEPS 1e-7

typedef struct {
	const hl_case *c;
	const hl_opt_options *o;
	hl_network *base;         /* parties and settings only: for sizing */
	size_t nh, nc, S;         /* hot and cold process streams, stages */
	size_t *hot, *cold;       /* their party indices */
	size_t nu;                /* utilities: parties nstream + u */
	unsigned char *allow;     /* nh·nc: the pair may meet */
	unsigned char *require;   /* nh·nc: the pair must meet */
	double *maxduty;          /* nh·nc: kW, HUGE_VAL none */
	double *xarea;            /* nh·nc: annual weight of a unit across
				     plant areas (policy penalise), 0 none */
	unsigned char *uallow;    /* nstream·nu: the stream may use it */
	unsigned char *ureq;      /* nstream·nu: the stream must use it */
	double *umax;             /* nstream·nu: kW at most, HUGE_VAL none */
	int urules;               /* some stream-utility pair has either */
	unsigned char *nosplit;   /* nstream */
	double crf;
	double qscale;            /* kW: a typical stream duty */
	int rules;                /* some pair has require or maxduty */
	int has_max_load;         /* some utility has a capacity: one
				     utility per stream end */
	double t_top, t_bot;      /* °C: hottest hot supply, coldest cold
				     supply (stages spread between them) */
} hl_opt_problem;

#define HL_OPT_CELL(P, k, a, b) (((k) * (P)->nh + (a)) * (P)->nc + (b))

typedef struct {
	double *q;        /* S·nh·nc loads, kW */
	unsigned char *keep;  /* S·nh·nc: the cell must keep a unit */
	unsigned char *act;   /* S·nh·nc: the cell had a unit when evaluated */
	double *ccost;    /* per cell: annual capital, 0 when empty */
	double *cviol;    /* per cell: limits missed, 0 when met */
	double *th;       /* nh·(S+1): hot temperatures at the boundaries */
	double *tc;       /* nc·(S+1) */
	double *hviol;    /* nh: stream limits missed (overshoot, splits) */
	double *cvs;      /* nc */
	double *hend;     /* nh: cooler duty, kW */
	double *cend;     /* nc: heater duty */
	double *hecost;   /* nh: the cooler's capital and energy a year */
	double *cecost;
	double *heviol, *ceviol;
	long *hutil, *cutil;  /* utility of each end, -1 none */
	/* Non-isothermal mixing: a branch's share of its stream's flow in a
	 * split is q·w over the stage's Σ q·w (all w equal: isothermal). */
	double *wh, *wc;  /* S·nh·nc: branch weights on the hot, cold side */
	double *swh, *swc;  /* nh·S, nc·S: Σ q·w of the stage's branches */
	/* Utilities inside a stream: a unit after the process units of
	 * stage k, in the stream's flow direction. */
	double *uh, *uc;  /* nh·S, nc·S: their loads, kW */
	long *muh, *muc;  /* nh·S, nc·S: the utility each uses, -1 none */
	double *thm, *tcm;  /* nh·S, nc·S: after the process units of k */
	double *hq, *cq;  /* nh·S, nc·S: heat exchanged before stage k */
	double *hmc, *cmc;  /* per stream: the mid units' annual cost */
	double *hmv, *cmv;  /* per stream: the limits they miss */
	double ccap, cvsum;  /* Σ ccost, Σ cviol, kept up by each cell */
	size_t nact;      /* cells with a unit */
	double v, tac;    /* limits missed; total annual cost */
} hl_opt_state;

hl_status hl_opt_problem_init(hl_opt_problem *P, const hl_case *c,
			      const hl_opt_options *o, hl_error *err);
void hl_opt_problem_free(hl_opt_problem *P);

hl_status hl_opt_state_init(const hl_opt_problem *P, hl_opt_state *s);
void hl_opt_state_free(hl_opt_state *s);
void hl_opt_state_copy(const hl_opt_problem *P, hl_opt_state *dst,
		       const hl_opt_state *src);

/* Evaluate everything. */
void hl_opt_eval_all(const hl_opt_problem *P, hl_opt_state *s);
/* Re-evaluate after the loads of hot streams A[0..na) and cold streams
 * B[0..nb) changed (indices among the hot and the cold streams). */
void hl_opt_eval_set(const hl_opt_problem *P, hl_opt_state *s,
		     const size_t *A, size_t na, const size_t *B, size_t nb);
/* Sum the parts into s->v and s->tac. */
void hl_opt_sum(const hl_opt_problem *P, hl_opt_state *s);

/* 1 when x is better than y: fewer limits missed, then lower cost. */
int hl_opt_better(const hl_opt_state *x, const hl_opt_state *y);

/* Walk w (seeded from seed and w) from s for evals evaluations; the best
 * state found goes to best. deadline: monotonic seconds, 0 none. Returns
 * the evaluations spent; *capped set when the deadline stopped it. */
size_t hl_opt_walk(const hl_opt_problem *P, hl_opt_state *s,
		   hl_opt_state *best, uint64_t seed, size_t evals,
		   double deadline, int *capped);
/* Greedy construction from s, candidates scored by the cost they save over
 * their mean approach to the power `power`; returns evaluations. */
size_t hl_opt_greedy(const hl_opt_problem *P, hl_opt_state *s, size_t max,
		     double power);
/* Coordinate search on the loads of s's units; returns evaluations. */
size_t hl_opt_polish(const hl_opt_problem *P, hl_opt_state *s,
		     size_t evals);
/* Utility units below the smallest duty where it binds them
 * (network_opt_trim.c): an end's trim into or out of the stream's last
 * process unit, a utility inside a stream back to the end, each when
 * better. Returns evaluations. */
size_t hl_opt_trims(const hl_opt_problem *P, hl_opt_state *s);
/* Descent over the structure (network_opt_descend.c): add, take out or
 * move one unit, each neighbour judged after a polish of its loads; first
 * improvement, until no neighbour improves. Skipped when one pass would
 * need more than max evaluations; stops at the deadline (monotonic s, 0
 * none), *capped then set. Returns the evaluations spent. */
size_t hl_opt_descend(const hl_opt_problem *P, hl_opt_state *s, size_t max,
		      double deadline, int *capped);

double hl_opt_now(void);

/* The cheapest utility unit for a stream end: process party p from t_in
 * to its target, duty d, on the utilities p may use. Fills *best (when
 * non-NULL) and *which (-1: none can) and *viol (limits missed); returns
 * the annual cost (capital and energy). */
/* A stream end at least cost: one utility unit (hl_opt_end_unit) or
 * several levels in series, cheapest first; *which -2 for the latter.
 * out (NULL, or room for one unit per utility) gets the units, *n their
 * count. */
double hl_opt_end(const hl_opt_problem *P, size_t p, double t_in, double d,
		  hl_network_unit *out, size_t *n, long *which, double *viol);
double hl_opt_end_unit(const hl_opt_problem *P, size_t p, double t_in,
		       double d, hl_network_unit *best, long *which,
		       double *viol);
/* The same for a utility unit inside the stream, from t_in to t_out. */
double hl_opt_util_unit(const hl_opt_problem *P, size_t p, double t_in,
			double t_out, double d, hl_network_unit *best,
			long *which, double *viol);
/* A branch's outlet on hot stream x (side 0) or cold stream x (side 1) in
 * stage k, load q, weight w (the share q·w over the stage's Σ q·w), mixing
 * by enthalpy (Björk & Westerlund 2002): the branch takes q as the whole
 * stream would take q/share from the heat before the stage; *share gets
 * the share. */
double hl_opt_branch_out(const hl_opt_problem *P, const hl_opt_state *s,
			 int side, size_t k, size_t x, double q, double w,
			 double *share);

/* Size unit u of net by its type (hl_network_unit_type, so the case's
 * per-type and per-utility cost laws apply); with fallback, a type that
 * would need too many shells in series is sized as counterflow and
 * u->note (a static text) says so. */
hl_status hl_opt_size(const hl_network *net, hl_network_unit *u,
		      int fallback, hl_error *err);

/* The exchanger minimum approach of hot stream a and cold stream b
 * (indices among the hot and the cold streams): the case's EMAT or the
 * match's own. */
double hl_opt_emat(const hl_opt_problem *P, size_t a, size_t b);
/* The smallest duty a unit of parties (hot, cold) must carry, 0 none;
 * never more than the whole duty of a process stream it serves (a stream
 * smaller than the limit needs a unit of its own size). */
double hl_opt_min_duty_for(const hl_opt_problem *P, size_t hot,
			   size_t cold);

/* The state as a network (sized by hl_network_size_unit). */
hl_status hl_opt_to_network(const hl_opt_problem *P, const hl_opt_state *s,
			    hl_network **out, hl_error *err);
/* A network of the case's parties as loads of S stages (a layering of its
 * units in temperature order); keep (per unit or NULL) marks cells. */
hl_status hl_opt_from_network(const hl_opt_problem *P, const hl_network *net,
			      const unsigned char *keep, hl_opt_state *s);

#endif
