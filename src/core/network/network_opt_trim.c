/* network_opt_trim.c - utility trims below the smallest duty, repaired
 * before the repair's walk: a cooler or heater at a stream's end that
 * carries less than the smallest duty goes into the stream's last process
 * unit (the trim disappears) or, when that is no better, takes what it
 * lacks from that unit (the trim grows to the smallest duty); a utility
 * inside a stream below it goes back to the end; each step kept only when
 * the state is better for it. The walk finds these
 * moves only by chance: a load step of the right size at the right unit. */
#include <math.h>

#include "network_opt_int.h"

/* The largest unit of stream x of a side (hot: 0) in the stage nearest its
 * end (hot: the highest stage with a unit, cold: the lowest); m when none. */
static size_t
last_unit(const hl_opt_problem *P, const hl_opt_state *s, int side,
	  size_t x)
{
	size_t m = P->S * P->nh * P->nc, best = m, r, j;

	for (r = 0; r < P->S && best == m; r++) {
		size_t k = side == 0 ? P->S - 1 - r : r;
		size_t np = side == 0 ? P->nc : P->nh;

		for (j = 0; j < np; j++) {
			size_t i = side == 0 ? HL_OPT_CELL(P, k, x, j) :
			    HL_OPT_CELL(P, k, j, x);

			if (s->q[i] > HL_OPT_QEPS && (best == m ||
			    s->q[i] > s->q[best]))
				best = i;
		}
	}
	return best;
}

/* t, a changed copy of s, evaluated; s takes it when better. */
static int
take(const hl_opt_problem *P, hl_opt_state *s, hl_opt_state *t,
     size_t *evals)
{
	hl_opt_eval_all(P, t);
	(*evals)++;
	if (!hl_opt_better(t, s))
		return 0;
	hl_opt_state_copy(P, s, t);
	return 1;
}

/* Cell i at load q; s takes it when better. */
static int
try_load(const hl_opt_problem *P, hl_opt_state *s, hl_opt_state *t,
	 size_t i, double q, size_t *evals)
{
	hl_opt_state_copy(P, t, s);
	t->q[i] = q;
	return take(P, s, t, evals);
}

/* The end of stream x of a side, when it is a trim below d. */
static void
fix_end(const hl_opt_problem *P, hl_opt_state *s, hl_opt_state *t, int side,
	size_t x, double d, size_t *evals)
{
	double e = side == 0 ? s->hend[x] : s->cend[x];
	size_t i = last_unit(P, s, side, x);

	d = fmin(d, hl_stream_duty(&P->c->stream[side == 0 ? P->hot[x] :
	    P->cold[x]]));
	if (!(e > 0.0 && e < d * (1.0 - 1e-9)) || i == P->S * P->nh * P->nc)
		return;
	if (!try_load(P, s, t, i, s->q[i] + e, evals) && s->q[i] > d - e)
		try_load(P, s, t, i, s->q[i] - (d - e), evals);
}

/* Utilities inside stream x of a side below d back to its end. */
static void
fix_mid(const hl_opt_problem *P, hl_opt_state *s, hl_opt_state *t, int side,
	size_t x, double d, size_t *evals)
{
	size_t k, o = x * P->S;

	for (k = 0; k < P->S; k++) {
		double u = side == 0 ? s->uh[o + k] : s->uc[o + k];

		if (!(u > 0.0 && u < d))
			continue;
		hl_opt_state_copy(P, t, s);
		*(side == 0 ? &t->uh[o + k] : &t->uc[o + k]) = 0.0;
		take(P, s, t, evals);
	}
}

size_t
hl_opt_trims(const hl_opt_problem *P, hl_opt_state *s)
{
	double d = P->o->min_duty;
	size_t x, evals = 0;
	hl_opt_state t;
	int side;

	if (!(d > 0.0) || hl_opt_state_init(P, &t) != HL_OK)
		return 0;
	for (side = 0; side < 2; side++)
		for (x = 0; x < (side == 0 ? P->nh : P->nc); x++) {
			fix_mid(P, s, &t, side, x, d, &evals);
			fix_end(P, s, &t, side, x, d, &evals);
		}
	hl_opt_state_free(&t);
	return evals;
}
