/* network_match.c - the match MILP's result as a placement input. */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "network_match.h"

void
hl_network_feed_free(hl_network_feed *f)
{
	size_t i;

	if (f == NULL)
		return;
	for (i = 0; f->party != NULL && i < f->in.nparty; i++)
		hl_network_party_free(&f->party[i]);
	free(f->party);
	free(f->match);
	free(f->typed);
	memset(f, 0, sizeof *f);
}

/* One party of the result as a network party (deep copy of its data). */
static hl_status
party_of(const hl_case *c, const hl_match_party *q, hl_network_party *p)
{
	hl_network_party t;

	memset(&t, 0, sizeof t);
	t.name = q->name;
	t.kind = q->kind;
	t.h = NAN;
	t.dt_contrib = NAN;
	t.price = NAN;
	t.max_load = NAN;
	t.load = q->load;
	t.supply = q->supply;
	t.target = q->target;
	if (q->type == HL_PARTY_STREAM) {
		const hl_stream *s = &c->stream[q->index];

		t.nseg = s->nseg;
		t.seg = s->seg;
		t.dt_contrib = s->dt_contrib;
		t.load = hl_stream_duty(s);
	} else if (q->type == HL_PARTY_UTILITY) {
		const hl_utility *u = &c->util[q->index];

		t.utility = 1;
		t.type = hl_utility_type(&c->set, u);
		t.type_given = t.type >= 0;
		t.cost_given = u->cost_given;
		t.cost_a = u->cost_a;
		t.cost_b = u->cost_b;
		t.cost_c = u->cost_c;
		t.h = u->h;
		t.dt_contrib = u->dt_contrib;
		t.price = u->price;
		t.max_load = u->max_load;
	} else {
		t.utility = 1;
		t.implicit = 1;
	}
	*p = t;
	p->name = strdup(t.name);
	p->seg = NULL;
	if (t.nseg > 0) {
		p->seg = malloc(t.nseg * sizeof *p->seg);
		if (p->seg != NULL)
			memcpy(p->seg, t.seg, t.nseg * sizeof *t.seg);
	}
	if (p->name == NULL || (t.nseg > 0 && p->seg == NULL)) {
		hl_network_party_free(p);
		return HL_EIO;
	}
	return HL_OK;
}

/* Index of the party named name (-1 for "*"), -2 when none has it. */
static long
party_index(const hl_network_feed *f, const char *name)
{
	size_t i;

	if (strcmp(name, "*") == 0)
		return -1;
	for (i = 0; i < f->in.nparty; i++)
		if (strcmp(f->party[i].name, name) == 0)
			return (long)i;
	return -2;
}

/* The case's exchanger type rules on the feed's parties (a rule on a party
 * the result has not got cannot apply and is left out). */
static hl_status
typed_of(const hl_case *c, hl_network_feed *f)
{
	size_t i;

	f->typed = calloc(c->ntyped + 1, sizeof *f->typed);
	if (f->typed == NULL)
		return HL_EIO;
	for (i = 0; i < c->ntyped; i++) {
		hl_network_typed *t = &f->typed[f->in.ntyped];

		t->hot = party_index(f, c->typed[i].hot);
		t->cold = party_index(f, c->typed[i].cold);
		t->type = c->typed[i].type;
		if (t->hot != -2 && t->cold != -2)
			f->in.ntyped++;
	}
	f->in.typed = f->typed;
	return HL_OK;
}

hl_status
hl_network_from_matches(const hl_case *c, const hl_match_result *r,
			double qh_min, double qc_min, hl_network_feed *out,
			hl_error *err)
{
	hl_network_feed f;
	size_t i;

	memset(&f, 0, sizeof f);
	f.party = calloc(r->nparty + 1, sizeof *f.party);
	f.match = calloc(r->nmatch + 1, sizeof *f.match);
	if (f.party == NULL || f.match == NULL) {
		hl_network_feed_free(&f);
		return hl_error_nomem(err);
	}
	for (i = 0; i < r->nparty; i++, f.in.nparty++)
		if (party_of(c, &r->party[i], &f.party[i]) != HL_OK) {
			hl_network_feed_free(&f);
			return hl_error_nomem(err);
		}
	for (i = 0; i < r->nmatch; i++) {
		const hl_match *m = &r->match[i];
		hl_network_match *n = &f.match[i];

		n->hot = m->hot;
		n->cold = m->cold;
		n->duty = m->duty;
		n->give = m->give;
		n->take = m->take;
		n->hot_hi = m->hot_from;
		n->hot_lo = m->hot_to;
		n->cold_lo = m->cold_from;
		n->cold_hi = m->cold_to;
	}
	if (typed_of(c, &f) != HL_OK) {
		hl_network_feed_free(&f);
		return hl_error_nomem(err);
	}
	f.in.set = &c->set;
	f.in.party = f.party;
	f.in.match = f.match;
	f.in.nmatch = r->nmatch;
	f.in.nint = r->nint;
	f.in.t = r->t;
	f.in.qh_target = qh_min;
	f.in.qc_target = qc_min;
	/* Loads above the target come from utility ranges (the loads given
	 * already exceed it) or from the rules (they raise the loads). */
	f.in.range_rise = fmax(0.0, r->qh0 - qh_min);
	if (f.in.range_rise <= 1e-6 * fmax(1.0, qh_min))
		f.in.range_rise = 0.0;
	f.in.restriction = fmax(0.0, r->qh - qh_min - f.in.range_rise);
	if (f.in.restriction <= 1e-6 * fmax(1.0, qh_min))
		f.in.restriction = 0.0;
	*out = f;
	return HL_OK;
}

/* Search downward from the EMAT in use, a tenth of ΔTmin at a time to half
 * of it (common practice, no source: EMAT below ΔTmin is the trade's way to
 * let a network reach its targets). */
double
hl_network_emat_hint(const hl_network_input *in0)
{
	hl_network_input in = *in0;
	hl_settings set = *in0->set;
	double used = isnan(set.emat) ? set.dtmin : set.emat, e;
	int k;

	in.set = &set;
	for (k = 1; k <= 5; k++) {
		hl_network *net = NULL;
		int clean;

		e = used - 0.1 * k * set.dtmin;
		if (e < 0.5 * set.dtmin - 1e-9)
			break;
		set.emat = e;
		if (hl_network_place(&in, &net, NULL) != HL_OK)
			continue;
		clean = net->penalty <= 0.0;
		hl_network_free(net);
		if (clean)
			return e;
	}
	return NAN;
}

size_t
hl_network_pinches(const hl_cascade *cas, const hl_utility_lp *lp, double *t,
		   size_t max)
{
	size_t n = 0, i, j;

	for (i = 0; i < cas->npinch && n < max; i++)
		t[n++] = cas->t[cas->pinch[i]];
	for (i = 0; lp != NULL && i < lp->npinch && n < max; i++) {
		for (j = 0; j < n && fabs(t[j] - lp->pinch[i].shifted) > 1e-9;
		     j++)
			;
		if (j == n)
			t[n++] = lp->pinch[i].shifted;
	}
	for (i = 1; i < n; i++)
		for (j = i; j > 0 && t[j] > t[j - 1]; j--) {
			double x = t[j];

			t[j] = t[j - 1];
			t[j - 1] = x;
		}
	return n;
}
