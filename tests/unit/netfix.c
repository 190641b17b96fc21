/* netfix.c - placement inputs for tests (netfix.h). */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "cascade.h"
#include "netfix.h"

void
netfix_init(netfix *f, double dtmin)
{
	memset(f, 0, sizeof *f);
	hl_settings_default(&f->set);
	f->set.dtmin = dtmin;
	f->qh = f->qc = NAN;
}

size_t
netfix_stream(netfix *f, const char *name, double supply, double target,
	      double cp, double h)
{
	hl_network_party *p = &f->p[f->np];
	hl_segment *g = f->seg[f->np];

	memset(p, 0, sizeof *p);
	g->supply = supply;
	g->target = target;
	g->cp = cp;
	g->h = h;
	p->name = (char *)name;
	p->kind = supply > target ? HL_HOT : HL_COLD;
	p->supply = supply;
	p->target = target;
	p->nseg = 1;
	p->seg = g;
	p->h = NAN;
	p->dt_contrib = NAN;
	p->load = cp * fabs(supply - target);
	p->price = NAN;
	p->max_load = NAN;
	return f->np++;
}

size_t
netfix_utility(netfix *f, const char *name, hl_kind kind, double supply,
	       double target, double price, double h)
{
	hl_network_party *p = &f->p[f->np];

	memset(p, 0, sizeof *p);
	p->name = (char *)name;
	p->kind = kind;
	p->utility = 1;
	p->supply = supply;
	p->target = target;
	p->h = h;
	p->dt_contrib = NAN;
	p->price = price;
	p->max_load = NAN;
	return f->np++;
}

void
netfix_match(netfix *f, size_t hot, size_t cold, double duty, double hot_hi,
	     double hot_lo, double cold_lo, double cold_hi)
{
	hl_network_match *m = &f->m[f->nm++];

	memset(m, 0, sizeof *m);
	m->hot = hot;
	m->cold = cold;
	m->duty = duty;
	m->hot_hi = hot_hi;
	m->hot_lo = hot_lo;
	m->cold_lo = cold_lo;
	m->cold_hi = cold_hi;
}

void
netfix_input(const netfix *f, hl_network_input *in)
{
	memset(in, 0, sizeof *in);
	in->set = &f->set;
	in->nparty = f->np;
	in->party = f->p;
	in->nmatch = f->nm;
	in->match = f->m;
	in->nint = f->nint;
	in->t = f->nint > 0 ? f->t : NULL;
	in->qh_target = f->qh;
	in->qc_target = f->qc;
}

static int
falling(const void *a, const void *b)
{
	double x = *(const double *)a, y = *(const double *)b;

	return (x < y) - (x > y);
}

/* The match (hot, cold) of subnetwork sub, made when new. */
static size_t
match_of(netfix *f, size_t hot, size_t cold, size_t sub, size_t *subs)
{
	size_t i;

	for (i = 0; i < f->nm; i++)
		if (f->m[i].hot == hot && f->m[i].cold == cold && subs[i] == sub)
			return i;
	netfix_match(f, hot, cold, 0.0, NAN, NAN, NAN, NAN);
	f->m[i].give = f->give[i];
	f->m[i].take = f->take[i];
	subs[i] = sub;
	return i;
}

static void
move_heat(netfix *f, size_t hot, size_t kh, size_t cold, size_t kc,
	  size_t sub, size_t *subs, double x)
{
	size_t m = match_of(f, hot, cold, sub, subs);

	f->give[m][kh] += x;
	f->take[m][kc] += x;
	f->m[m].duty += x;
}

void
netfix_cascade(netfix *f, const hl_case *c, double dtmin)
{
	size_t i, k, n = 0, np = 0, hu, cu, sub = 0, subs[4 * NETFIX_MAX];
	size_t pp[4 * NETFIX_MAX], pk[4 * NETFIX_MAX];
	double t[2 * NETFIX_MAX], pq[4 * NETFIX_MAX], sh = dtmin / 2.0;

	netfix_init(f, dtmin);
	for (i = 0; i < c->nstream; i++) {
		const hl_segment *g = &c->stream[i].seg[0];
		double d = c->stream[i].kind == HL_HOT ? -sh : sh;

		netfix_stream(f, c->stream[i].name, g->supply, g->target,
		    g->cp, g->h);
		t[n++] = g->supply + d;
		t[n++] = g->target + d;
	}
	hl_cascade_targets(c, dtmin, &f->qh, &f->qc, NULL);
	qsort(t, n, sizeof *t, falling);
	for (i = 0, k = 0; i < n; i++)
		if (k == 0 || t[i] < f->t[k - 1])
			f->t[k++] = t[i];
	f->nint = k - 1;
	hu = netfix_utility(f, "hot utility", HL_HOT, f->t[0] + sh,
	    f->t[0] + sh, NAN, NAN);
	cu = netfix_utility(f, "cold utility", HL_COLD, f->t[k - 1] - sh,
	    f->t[k - 1] - sh, NAN, NAN);
	f->p[hu].implicit = f->p[cu].implicit = 1;
	if (f->qh > 0.0) {
		pp[np] = hu;
		pk[np] = 0;
		pq[np++] = f->qh;
	}
	for (k = 0; k < f->nint; k++) {
		double hi = f->t[k], lo = f->t[k + 1], left = 0.0;

		for (i = 0; i < c->nstream; i++) {
			const hl_network_party *p = &f->p[i];
			double a = fmax(p->supply, p->target) + (p->kind ==
			    HL_HOT ? -sh : sh);
			double b = fmin(p->supply, p->target) + (p->kind ==
			    HL_HOT ? -sh : sh);

			if (p->kind != HL_HOT || a < hi || b > lo)
				continue;
			pp[np] = i;
			pk[np] = k;
			pq[np++] = p->seg[0].cp * (hi - lo);
		}
		for (i = 0; i < c->nstream; i++) {
			const hl_network_party *p = &f->p[i];
			double need;

			if (p->kind != HL_COLD || p->target + sh < hi ||
			    p->supply + sh > lo)
				continue;
			need = p->seg[0].cp * (hi - lo);
			while (need > 1e-12 && np > 0) {
				double x = fmin(need, pq[np - 1]);

				move_heat(f, pp[np - 1], pk[np - 1], i, k, sub,
				    subs, x);
				pq[np - 1] -= x;
				need -= x;
				if (pq[np - 1] <= 1e-12)
					np--;
			}
		}
		for (i = 0; i < np; i++)
			left += pq[i];
		if (left <= 1e-9 && k + 1 < f->nint) {
			np = 0;
			sub++;
		}
	}
	for (i = 0; i < np; i++)
		move_heat(f, pp[i], pk[i], cu, f->nint - 1, sub, subs, pq[i]);
	/* Drop slivers below rounding (their loads stay where they are). */
	for (i = 0, k = 0; i < f->nm; i++)
		if (f->m[i].duty > 1e-9)
			f->m[k++] = f->m[i];
	f->nm = k;
}
