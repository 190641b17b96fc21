/* match_int.h - what the files of the match module share (not a contract).
 *
 * Data model. Parties are the process streams (case order), then the
 * utilities. hot[] and cold[] list party indices by side; a pair is (a, b)
 * with a < nhot, b < ncold, stored at a * ncold + b. Intervals k = 0..nint-1
 * lie between shifted boundaries t[k] (upper) and t[k+1]; resid[k] is the
 * heat crossing boundary k downwards. unit[p][k] is a stream's heat in
 * interval k (kW) or a utility's share of its load there (a fraction);
 * heat[p][k] is the heat at the loads in use.
 */
#ifndef HL_MATCH_INT_H
#define HL_MATCH_INT_H

#include <pthread.h>
#include <stddef.h>
#include <stdint.h>

#include "match_milp.h"

/* A pair's rules and standing. */
typedef struct {
	unsigned char potential; /* heat could flow from a to b at all */
	unsigned char allowed;   /* no rule or area forbids it */
	unsigned char required;  /* a rule requires it */
	unsigned char cross;     /* joins two plant areas */
	double maxduty;          /* kW over all its units, HUGE_VAL when free */
	double cost;             /* objective weight of one unit */
	long forbid_rule;        /* the first rule forbidding it, -1 none */
} hl_match_pair;

struct hl_match_problem {
	const hl_case *c;
	double dtmin;
	size_t np;
	hl_match_party *party;   /* names owned here */
	const char **area;       /* per party, borrowed from the case */
	size_t nhot, ncold;
	size_t *hot, *cold;      /* party indices */
	size_t *sidx;            /* per party: its index in hot[] or cold[] */
	size_t nint;
	double *t;               /* nint + 1 */
	double *unit;            /* np * nint */
	double *heat;            /* np * nint */
	double *film;            /* np * nint, kW/(m²·K) */
	double *resid;           /* nint + 1 */
	hl_match_pair *pair;     /* nhot * ncold */
	size_t nsub;
	hl_match_sub *sub;
	double qh0, qc0, qh, qc;
	int restricted, implicit, penalised;
	size_t ncause;
	hl_match_cause *cause;
	double scale;            /* kW: the larger of the hot and cold totals */
	int msg_lev;             /* GLPK message level while preparing */
	double tol;              /* kW: heat at or below it counts as none */
};

#define HL_MATCH_HEAT(p, i, k) ((p)->heat[(i) * (p)->nint + (k)])

/* Feasible balanced proper subsets of n parties (bit i = party i). */
typedef struct {
	size_t n, nk;
	double tol;
	uint32_t *set;
	size_t nset;
	int complete;            /* every subset was examined */
} hl_match_balanced;

/* v: net heats (hot > 0); prof: n * nk interval heats (hot > 0). */
void hl_match_balanced_find(size_t n, const double *v, const double *prof,
			    size_t nk, double tol, hl_match_balanced *b);
void hl_match_balanced_clear(hl_match_balanced *b);
/* Least sum of w[set] over the partitions into sets of b, whole being the
 * weight of not splitting; a valid lower bound on the units when w[s] is
 * one on the units of set s alone as one connected network. */
double hl_match_partition_bound(const hl_match_balanced *b, const double *w,
				double whole);
/* The partition into two or more sets of b with the least sum of w; its
 * sets into parts[] (up to 32), HUGE_VAL when there is none. */
double hl_match_partition_best(const hl_match_balanced *b, const double *w,
			       uint32_t *parts, size_t *nparts);
double hl_match_set_size(uint32_t s);

/* Per-subnetwork bounds and the columns of its part of a model. */
typedef struct {
	size_t sub, first, nk;   /* intervals first..first+nk-1 */
	unsigned char *active;   /* per party: heat in this subnetwork */
	size_t nactive;
	double *total;           /* per party: its heat here, kW */
	double *res;             /* nk + 1: heat of the active parties crossing
				    each boundary (first..first+nk) */
	double *U;               /* per pair: most it can exchange here */
	double *ub;              /* per pair and interval: most in that interval */
	double *rub;             /* per hot side index and interval: most heat
				    it can pass below that interval */
	hl_match_balanced bal;   /* over the active parties, in party order */
	size_t *bit;             /* party of each bit of bal */
	size_t subset_bound;     /* least units by the partitions (Euler) */
	unsigned char *seed;     /* per pair: a feasible network from parts,
				    NULL when none */
	int *ycol, *qcol, *rcol; /* GLPK columns, 0 when absent */
	size_t npairs;           /* pairs with a y column */
} hl_match_sd;

#define HL_MATCH_PAIR(p, a, b) ((a) * (p)->ncold + (b))

/* Subnetwork s, all its parties or those with mask[party] set (mask may be
 * NULL). light: bounds U only, no balanced subsets. */
hl_status hl_match_sd_init(const hl_match_problem *p, size_t s,
			   const unsigned char *mask, int light,
			   hl_match_sd *sd);
void hl_match_sd_clear(hl_match_sd *sd);
/* Column maps of sd (before hl_match_build). */
int hl_match_alloc_cols(const hl_match_problem *p, hl_match_sd *sd);

/* A model of some subnetworks solved together (one group). */
typedef struct {
	glp_prob *P;
	size_t ns;
	hl_match_sd *sd;
	int textbook;
	int *sym;                /* triples (sub index, side, party a, party b):
				    a and b identical, a listed first */
	size_t nsym;
	int *sym_rows;           /* rows of the symmetry constraints */
	size_t nsym_rows;
} hl_match_model_t;

/* Build the MILP of the subnetworks whose data m->sd[0..m->ns) holds into
 * m->P (already created; other groups' rows and columns stay). */
hl_status hl_match_build(const hl_match_problem *p, int textbook,
			 hl_match_model_t *m, hl_error *err);
/* Fill m->sd for subnetworks subs[0..ns). */
hl_status hl_match_model_init(const hl_match_problem *p, const size_t *subs,
			      size_t ns, hl_match_model_t *m, hl_error *err);
void hl_match_model_clear(hl_match_model_t *m);

/* Max-flow test of a match set in one subnetwork (loads fixed). */
typedef struct hl_match_flow hl_match_flow;
hl_match_flow *hl_match_flow_create(const hl_match_problem *p,
				    const hl_match_sd *sd);
/* 1 when the pairs with open[pi] != 0 can meet every demand. */
int hl_match_flow_feasible(hl_match_flow *f, const unsigned char *open);
void hl_match_flow_free(hl_match_flow *f);

/* Seconds on a monotonic clock. */
double hl_match_now(void);

/* A growing list of matrix entries for glp_load_matrix (1-based). */
typedef struct {
	int *ia, *ja;
	double *ar;
	size_t n, cap;
	int failed;
} hl_match_mat;

void hl_match_mat_add(hl_match_mat *m, int row, int col, double v);
/* Load into P (replacing its matrix) and free the list; -1 when memory
 * ran out while adding. */
int hl_match_mat_load(hl_match_mat *m, glp_prob *P);
void hl_match_mat_free(hl_match_mat *m);

/* Add n columns or rows and return the index of the first. */
int hl_match_add_col(glp_prob *P, int kind, double lo, double hi,
		     double obj);
int hl_match_add_row(glp_prob *P, int type, double lo, double hi);

/* Primal simplex from the current basis (a fresh one on trouble), with a
 * time limit in s (<= 0: none). 0 optimal, 1 infeasible, 2 failure, 3 the
 * time limit. */
int hl_match_simplex(glp_prob *P, int msg_lev, double limit);
/* Seconds the root LP may take when the time limit is 0 (heuristic only). */
#define HL_MATCH_ROOT_CAP 60.0

/* LP-based incumbent for the model m: x[1..ncols] on success; it stops
 * early on reaching lower. Returns 0 when found, -1 when not. */
int hl_match_heuristic(const hl_match_problem *p, hl_match_model_t *m,
		       double deadline, double lower, double *x, double *obj);

/* Restricted-match targets: sets party loads, qh, qc, restricted and
 * the causes. Called from hl_match_prepare. */
hl_status hl_match_restrict(hl_match_problem *p, hl_error *err);

/* Fill pair rules with rule `skip' (or the area policy when skip == -2)
 * left out; skip == -1 leaves nothing out. */
hl_status hl_match_rules(hl_match_problem *p, long skip, hl_match_pair *pair,
			 hl_error *err);

/* The second LP: loads of the chosen matches (x: the MILP's column values,
 * y > 0.5 means used) minimising the area estimate; appends the matches
 * to r (whose party, t and sub arrays are filled). */
hl_status hl_match_loads(const hl_match_problem *p, const hl_match_model_t *m,
			 const double *x, int msg_lev, hl_match_result *r,
			 hl_error *err);

/* ---- solving (match_search.c, match_parts.c, match_pool.c) ---- */

/* What every group's solve shares. */
typedef struct {
	const hl_match_problem *p;
	const hl_match_options *o;
	hl_match_result *r;
	int msg_lev;
	size_t done, total;
	double *last;        /* time of the last progress report */
	pthread_mutex_t *lock; /* guards last, done and progress; NULL when
				  one thread solves everything */
} hl_match_runner;

void hl_match_lock(const hl_match_runner *R);
void hl_match_unlock(const hl_match_runner *R);
/* Report progress at most twice a second, from any stage of a group. */
void hl_match_tick(const hl_match_runner *R, const char *label, double t0,
		   double incumbent, double bound);

/* What one group's solve found. */
typedef struct {
	double *x;
	double obj, bound, seconds;
	int optimal;
} hl_match_outcome;

/* Root LP, heuristic (up to half of the time), then branch and bound
 * until the deadline; quiet: no progress (a part's solve). out->x must
 * hold the model's columns. */
hl_status hl_match_search(const hl_match_runner *R, hl_match_model_t *m,
			  const char *label, double deadline, int quiet,
			  hl_match_outcome *out, hl_error *err);

/* Model data of a group, with the balanced-subset bounds refined by
 * solving the parts until the deadline. */
hl_status hl_match_prepare_group(const hl_match_runner *R, const size_t *subs,
				 size_t ns, hl_match_model_t *m,
				 double deadline, hl_error *err);

/* group[s]: the lowest subnetwork of s's group (linked by required or
 * duty-limited pairs); refuses required pairs that can work nowhere. */
hl_status hl_match_group_subs(const hl_match_problem *p, size_t *group,
			      hl_error *err);

/* One group of subnetworks to solve, with what it found. */
typedef struct {
	size_t *subs, ns;
	hl_match_result part;   /* its matches (nint, match, nmatch only) */
	size_t lower;           /* proven least units */
	double bound, seconds;
	int optimal;
	hl_status st;
	hl_error err;
} hl_match_job;

/* The groups to solve and the threads solving them. */
typedef struct {
	hl_match_runner *R;
	hl_match_job *jobs;
	size_t njobs;
	size_t next;            /* the next job to take (under lock) */
	size_t cur;             /* the helper's job, for a crash */
	pthread_mutex_t mutex;
	pthread_t helper;
	int helper_running;
} hl_match_pool;

/* Make the jobs, solve them (two at a time when R->o->threads allows),
 * and merge their matches into R->r. */
hl_status hl_match_solve_all(hl_match_runner *R, hl_match_pool *pl,
			     hl_error *err);
/* Wait for the helper thread, if one runs (also after a GLPK crash). */
void hl_match_join_helper(hl_match_pool *pl);
void hl_match_jobs_free(hl_match_pool *pl);

#endif
