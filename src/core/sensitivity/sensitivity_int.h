/* sensitivity_int.h - what sensitivity.c shares with sensitivity_cost.c: the
 * process model on shifted segments and its one-sided derivatives along a
 * direction of the data (see the essay atop sensitivity.c). Not a public
 * contract. */
#ifndef HL_SENSITIVITY_INT_H
#define HL_SENSITIVITY_INT_H

#include "sensitivity.h"

/* One segment in the cascade's terms. */
typedef struct {
	double sign;    /* +1 hot, -1 cold: its sign in R */
	double hi, lo;  /* shifted ends, °C, hi > lo */
	double cp;      /* kW/K */
} hl_sens_flat;

/* How a segment's shifted ends and cp move per unit step of the data. */
typedef struct {
	double dhi, dlo, dcp;
} hl_sens_vel;

/* A segment end: one of the cascade's boundaries. */
typedef struct {
	size_t g;       /* flat segment */
	int lo;         /* 1: its lower end, 0: its upper end */
	double t;       /* its shifted temperature */
	double f;       /* −R(t) = QHmin − lifted flow there, kW */
} hl_sens_end;

typedef struct {
	const hl_case *c;
	double dtmin;
	size_t n;
	hl_sens_flat *g;
	size_t *first;  /* first flat segment of each stream */
	hl_sens_vel *d;         /* the direction being evaluated */
	size_t nend;    /* 2n ends, the active ones (zero flow) first */
	size_t nact;
	hl_sens_end *end;
	double qh;
} hl_sens_work;

/* Flatten c's segments with the cascade's shifted ends; zero direction. */
hl_status hl_sens_work_init(hl_sens_work *w, const hl_case *c, double dtmin,
			    hl_error *err);
void hl_sens_work_free(hl_sens_work *w);
/* Clear the direction; add k times the unit step of r's datum to it (the
 * process streams only: utilities are sensitivity_cost.c's). */
void hl_sens_dir_clear(hl_sens_work *w);
void hl_sens_dir_add(hl_sens_work *w, const hl_sens_row *r, double k);
/* φ(T) = (hi − max(lo, T))⁺ and its one-sided derivative along
 * (dhi, dlo, dT). */
double hl_sens_phi(const hl_sens_flat *g, double t);
double hl_sens_dphi(const hl_sens_flat *g, double t, double dhi, double dlo,
		    double dt);
/* R'(t) along s times the direction, t moving at s·vt. */
double hl_sens_surplus_dir(const hl_sens_work *w, double t, double vt,
			   double s);
/* d(Σ hot duty − Σ cold duty) along the direction. */
double hl_sens_balance_dir(const hl_sens_work *w);

/* The utility cost's one-sided derivatives with several utility levels
 * (sensitivity_cost.c): fills cost_minus and cost_plus of every row and of
 * sv->dt when levels is nonzero, and sv->urow for every case with
 * utilities. */
hl_status hl_sens_cost_lp(const hl_case *c, hl_sensitivity *sv, int levels,
			  hl_error *err);

#endif
