/* match_check.c - independent check of a matches result (see the header). */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "match_check.h"

typedef struct {
	const hl_case *c;
	double dtmin;
	const hl_match_result *r;
	double tol;
	double *heat;   /* party x interval, kW */
} checker;

static double
overlap(double hi, double lo, double top, double bottom)
{
	double o = fmin(hi, top) - fmax(lo, bottom);

	return o > 0.0 ? o : 0.0;
}

/* Shifted ends of a stream segment: hot down, cold up by its shift. */
static void
segment_range(const hl_stream *s, const hl_segment *g, double dtmin,
	      double *hi, double *lo)
{
	double sh = isnan(s->dt_contrib) ? dtmin / 2.0 : s->dt_contrib;

	sh = s->kind == HL_HOT ? -sh : sh;
	*hi = fmax(g->supply, g->target) + sh;
	*lo = fmin(g->supply, g->target) + sh;
}

static int
has_boundary(const hl_match_result *r, double v)
{
	size_t k;

	for (k = 0; k <= r->nint; k++)
		if (fabs(r->t[k] - v) <= 1e-7 * (1.0 + fabs(v)))
			return 1;
	return 0;
}

/* Every stream of the case takes part exactly once. */
static int
check_parties(const checker *ck)
{
	size_t i, j, n;

	for (i = 0; i < ck->c->nstream; i++) {
		for (j = 0, n = 0; j < ck->r->nparty; j++)
			n += ck->r->party[j].type == HL_PARTY_STREAM &&
				ck->r->party[j].index == (long)i;
		if (n != 1) {
			printf("check: stream %s appears %zu times\n",
			       ck->c->stream[i].name, n);
			return -1;
		}
	}
	return 0;
}

static int
check_boundaries(const checker *ck)
{
	size_t i, j;

	for (i = 0; i < ck->c->nstream; i++) {
		const hl_stream *s = &ck->c->stream[i];

		for (j = 0; j < s->nseg; j++) {
			double hi, lo;

			segment_range(s, &s->seg[j], ck->dtmin, &hi, &lo);
			if (!has_boundary(ck->r, hi) || !has_boundary(ck->r, lo)) {
				printf("check: stream %s: %g or %g is no "
				       "interval boundary\n", s->name, hi, lo);
				return -1;
			}
		}
	}
	return 0;
}

static void
stream_heat(const checker *ck, const hl_stream *s, double *row)
{
	size_t j, k;

	for (j = 0; j < s->nseg; j++) {
		double hi, lo;

		segment_range(s, &s->seg[j], ck->dtmin, &hi, &lo);
		for (k = 0; k < ck->r->nint; k++)
			row[k] += s->seg[j].cp * overlap(hi, lo, ck->r->t[k],
							 ck->r->t[k + 1]);
	}
}

/* A utility's load: spread over its shifted range, or just below (hot) or
 * above (cold) its temperature when it condenses or boils. The implicit
 * ones sit at the top and bottom boundaries. */
static void
utility_heat(const checker *ck, const hl_match_party *q, double *row)
{
	const hl_match_result *r = ck->r;
	double hi = q->top, lo = q->bottom;
	size_t k;

	if (q->type == HL_PARTY_UTILITY) {
		const hl_utility *u = &ck->c->util[q->index];
		double sh = isnan(u->dt_contrib) ? ck->dtmin / 2.0 : u->dt_contrib;

		sh = u->kind == HL_HOT ? -sh : sh;
		hi = fmax(u->supply, u->target) + sh;
		lo = fmin(u->supply, u->target) + sh;
	}
	if (hi - lo > 1e-9) {
		for (k = 0; k < r->nint; k++)
			row[k] += q->load * overlap(hi, lo, r->t[k], r->t[k + 1]) /
				(hi - lo);
		return;
	}
	for (k = 0; k < r->nint; k++) {
		if (q->kind == HL_HOT && fabs(r->t[k] - hi) < 1e-7 * (1 + fabs(hi)))
			row[k] += q->load;
		if (q->kind == HL_COLD &&
		    fabs(r->t[k + 1] - hi) < 1e-7 * (1 + fabs(hi)))
			row[k] += q->load;
	}
}

static int
fill_heat(checker *ck)
{
	const hl_match_result *r = ck->r;
	size_t i;
	double big = 0.0;

	ck->heat = calloc(r->nparty * r->nint + 1, sizeof *ck->heat);
	if (ck->heat == NULL)
		return -1;
	for (i = 0; i < r->nparty; i++) {
		const hl_match_party *q = &r->party[i];
		double *row = ck->heat + i * r->nint, sum = 0.0;
		size_t k;

		if (q->type == HL_PARTY_STREAM)
			stream_heat(ck, &ck->c->stream[q->index], row);
		else
			utility_heat(ck, q, row);
		for (k = 0; k < r->nint; k++)
			sum += row[k];
		big = fmax(big, sum);
	}
	ck->tol *= fmax(big, 1.0);
	return 0;
}

/* Every party gives or takes exactly its heat in every interval. */
static int
check_balances(const checker *ck)
{
	const hl_match_result *r = ck->r;
	size_t i, k, m;

	for (i = 0; i < r->nparty; i++)
		for (k = 0; k < r->nint; k++) {
			double got = 0.0, want = ck->heat[i * r->nint + k];

			for (m = 0; m < r->nmatch; m++) {
				const hl_match *x = &r->match[m];

				if (x->hot == i)
					got += x->give[k];
				if (x->cold == i)
					got += x->take[k];
			}
			if (fabs(got - want) > ck->tol) {
				printf("check: %s, interval %zu (%g..%g): "
				       "exchanges %.9g kW, has %.9g kW\n",
				       r->party[i].name, k, r->t[k], r->t[k + 1],
				       got, want);
				return -1;
			}
		}
	return 0;
}

/* Heat only flows down; a match works inside its subnetwork. */
static int
check_matches(const checker *ck)
{
	const hl_match_result *r = ck->r;
	size_t m, k;

	for (m = 0; m < r->nmatch; m++) {
		const hl_match *x = &r->match[m];
		const hl_match_sub *b = &r->sub[x->sub];
		double gave = 0.0, took = 0.0;

		if (r->party[x->hot].kind != HL_HOT ||
		    r->party[x->cold].kind != HL_COLD) {
			printf("check: match %zu does not join hot to cold\n", m);
			return -1;
		}
		for (k = 0; k < r->nint; k++) {
			if ((x->give[k] < -ck->tol || x->take[k] < -ck->tol) ||
			    ((k < b->first || k > b->last) &&
			     (x->give[k] > ck->tol || x->take[k] > ck->tol))) {
				printf("check: %s-%s works outside %s\n",
				       r->party[x->hot].name,
				       r->party[x->cold].name, b->label);
				return -1;
			}
			gave += x->give[k];
			took += x->take[k];
			if (took > gave + ck->tol) {
				printf("check: %s-%s takes heat above where it "
				       "is given (interval %zu)\n",
				       r->party[x->hot].name,
				       r->party[x->cold].name, k);
				return -1;
			}
		}
		if (fabs(gave - x->duty) > ck->tol || fabs(took - x->duty) > ck->tol) {
			printf("check: %s-%s duty %.9g, gives %.9g, takes %.9g\n",
			       r->party[x->hot].name, r->party[x->cold].name,
			       x->duty, gave, took);
			return -1;
		}
	}
	return 0;
}

/* The whole cascade carries no heat across a subnetwork boundary, and the
 * units add up. */
static int
check_subs(const checker *ck)
{
	const hl_match_result *r = ck->r;
	size_t s, i, k, m, units = 0;

	for (s = 0; s < r->nsub; s++) {
		const hl_match_sub *b = &r->sub[s];
		size_t n = 0;

		for (k = 0; k < 2; k++) {
			size_t edge = k == 0 ? b->first : b->last + 1, j;
			double flow = 0.0;

			for (j = 0; j < edge; j++)
				for (i = 0; i < r->nparty; i++)
					flow += (r->party[i].kind == HL_HOT ? 1.0 :
						 -1.0) * ck->heat[i * r->nint + j];
			if (fabs(flow) > ck->tol) {
				printf("check: %.9g kW cross the %s boundary of "
				       "%s\n", flow, k == 0 ? "top" : "bottom",
				       b->label);
				return -1;
			}
		}
		for (m = 0; m < r->nmatch; m++)
			n += r->match[m].sub == s;
		if (n != b->units) {
			printf("check: %s has %zu matches, reports %zu units\n",
			       b->label, n, b->units);
			return -1;
		}
		units += n;
	}
	if (units != r->units) {
		printf("check: %zu matches, %zu units reported\n", units,
		       r->units);
		return -1;
	}
	return 0;
}

int
hl_check_matches(const hl_case *c, double dtmin, const hl_match_result *r,
		 double rel)
{
	checker ck = { c, dtmin, r, rel, NULL };
	int rc = check_parties(&ck);

	if (rc == 0)
		rc = check_boundaries(&ck);
	if (rc == 0)
		rc = fill_heat(&ck);
	if (rc == 0)
		rc = check_balances(&ck);
	if (rc == 0)
		rc = check_matches(&ck);
	if (rc == 0)
		rc = check_subs(&ck);
	free(ck.heat);
	return rc;
}
