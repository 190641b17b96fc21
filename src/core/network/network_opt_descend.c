/* network_opt_descend.c - a descent over the structure whose every
 * neighbour is judged at its own polished loads: add one unit (any allowed
 * pair, any stage where it can meet EMAT), take one out, move one to
 * another stage (variable neighbourhood descent, Mladenović & Hansen
 * 1997, Comput. Oper. Res. 24, 1097). The walk judges a new unit at the
 * load it drew, so a unit that pays only once the loads around it have
 * moved is lost to it; here it is not. */
#include <math.h>

#include "network_opt_int.h"

/* A neighbour's polish: this many evaluations per unit, and a floor. */
#define POLISH_PER_UNIT 30
#define POLISH_FLOOR 150

typedef struct {
	const hl_opt_problem *P;
	hl_opt_state *cur;   /* the descent's state */
	hl_opt_state t;      /* a neighbour */
	size_t evals, max;
	double deadline;
	int capped;
} descent;

static int
out_of_budget(descent *d)
{
	if (d->deadline > 0.0 && hl_opt_now() > d->deadline)
		d->capped = 1;
	return d->evals >= d->max || d->capped;
}

/* Polish the neighbour d->t and take it when it beats the state. */
static int
judge(descent *d)
{
	const hl_opt_problem *P = d->P;

	hl_opt_eval_all(P, &d->t);
	d->evals++;
	d->evals += hl_opt_polish(P, &d->t, POLISH_FLOOR + POLISH_PER_UNIT *
	    d->t.nact);
	if (!hl_opt_better(&d->t, d->cur) || d->t.tac > d->cur->tac *
	    (1.0 - 1e-9))
		return 0;
	hl_opt_state_copy(P, d->cur, &d->t);
	return 1;
}

/* Whether a unit of (a, b) in stage k can keep EMAT at the temperatures
 * the state has around the stage: the hot stream's inlet to the stage
 * against the cold stream's. */
static int
can_meet(const hl_opt_problem *P, const hl_opt_state *s, size_t k, size_t a,
	 size_t b)
{
	return s->th[a * (P->S + 1) + k] - s->tc[b * (P->S + 1) + k + 1] >
	    hl_opt_emat(P, a, b);
}

/* Add a unit in cell i: a tenth of the smaller stream's duty, or the
 * smallest duty where that is more; the polish finds its load. */
static int
try_add(descent *d, size_t i)
{
	const hl_opt_problem *P = d->P;
	size_t a = (i / P->nc) % P->nh, b = i % P->nc;
	double q = 0.1 * fmin(hl_stream_duty(&P->c->stream[P->hot[a]]),
	    hl_stream_duty(&P->c->stream[P->cold[b]]));

	q = fmax(q, hl_opt_min_duty_for(P, P->hot[a], P->cold[b]));
	hl_opt_state_copy(P, &d->t, d->cur);
	d->t.q[i] = q;
	d->t.wh[i] = d->t.wc[i] = 1.0;
	return judge(d);
}

/* Take unit i out, or move it (all its load) to stage k2 of its pair. */
static int
try_move(descent *d, size_t i, long k2)
{
	const hl_opt_problem *P = d->P;
	size_t j = i % (P->nh * P->nc);

	hl_opt_state_copy(P, &d->t, d->cur);
	if (k2 >= 0) {
		size_t i2 = (size_t)k2 * P->nh * P->nc + j;

		d->t.q[i2] += d->t.q[i];
		d->t.wh[i2] = d->t.wc[i2] = 1.0;
	}
	d->t.q[i] = 0.0;
	return judge(d);
}

/* One pass over the neighbourhood, first improvement taken; 1 when
 * something improved. */
static int
pass(descent *d)
{
	const hl_opt_problem *P = d->P;
	size_t m = P->S * P->nh * P->nc, i, k;
	int better = 0;

	for (i = 0; i < m && !out_of_budget(d); i++) {
		if (d->cur->q[i] > HL_OPT_QEPS || !P->allow[i % (P->nh *
		    P->nc)] || !can_meet(P, d->cur, i / (P->nh * P->nc),
		    (i / P->nc) % P->nh, i % P->nc))
			continue;
		better |= try_add(d, i);
	}
	for (i = 0; i < m && !out_of_budget(d); i++) {
		if (!(d->cur->q[i] > HL_OPT_QEPS) || d->cur->keep[i])
			continue;
		if (try_move(d, i, -1))
			better = 1;
		for (k = 0; k < P->S && d->cur->q[i] > HL_OPT_QEPS &&
		    !out_of_budget(d); k++)
			if (k != i / (P->nh * P->nc))
				better |= try_move(d, i, (long)k);
	}
	return better;
}

/* What one pass costs at most: every neighbour's polish. */
static double
pass_cost(const hl_opt_problem *P, const hl_opt_state *s)
{
	double per = POLISH_FLOOR + POLISH_PER_UNIT * (double)s->nact;
	double n = (double)(P->S * P->nh * P->nc) + (double)s->nact *
	    (double)P->S;

	return n * per;
}

size_t
hl_opt_descend(const hl_opt_problem *P, hl_opt_state *s, size_t max,
	       double deadline, int *capped)
{
	descent d = { P, s, { 0 }, 0, max, deadline, 0 };

	/* a part of a pass would search the first stages only */
	if (s->v > 1e-9 || pass_cost(P, s) > (double)max ||
	    hl_opt_state_init(P, &d.t) != HL_OK)
		return 0;
	while (!out_of_budget(&d) && pass(&d))
		;
	hl_opt_state_free(&d.t);
	*capped |= d.capped;
	return d.evals;
}
