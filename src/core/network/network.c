/* network.c - the network as data: building, freeing, sizing, totals. */
#include <math.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "network.h"
#include "profile.h"
#include "supertarget.h"

hl_network *
hl_network_create(void)
{
	hl_network *net = calloc(1, sizeof *net);

	if (net == NULL)
		return NULL;
	hl_settings_default(&net->set);
	return net;
}

void
hl_network_party_free(hl_network_party *p)
{
	if (p == NULL)
		return;
	free(p->name);
	free(p->seg);
	p->name = NULL;
	p->seg = NULL;
}

int
hl_network_has_credit(const hl_network *net)
{
	size_t i;

	for (i = 0; i < net->nparty; i++)
		if (net->party[i].utility && net->party[i].price < 0.0 &&
		    net->party[i].load > 0.0)
			return 1;
	return 0;
}

void
hl_network_free(hl_network *net)
{
	size_t i;

	if (net == NULL)
		return;
	for (i = 0; i < net->nparty; i++)
		hl_network_party_free(&net->party[i]);
	for (i = 0; i < net->nunit; i++)
		free(net->unit[i].note);
	for (i = 0; i < net->nnote; i++)
		free(net->note[i]);
	free(net->party);
	free(net->unit);
	free(net->note);
	free(net->typed);
	free(net->set.currency);
	free(net->source);
	free(net);
}

static hl_status
party_copy(hl_network_party *dst, const hl_network_party *src)
{
	*dst = *src;
	dst->name = strdup(src->name != NULL ? src->name : "");
	dst->seg = NULL;
	if (src->nseg > 0) {
		dst->seg = malloc(src->nseg * sizeof *dst->seg);
		if (dst->seg != NULL)
			memcpy(dst->seg, src->seg, src->nseg * sizeof *src->seg);
	}
	if (dst->name == NULL || (src->nseg > 0 && dst->seg == NULL)) {
		hl_network_party_free(dst);
		return HL_EIO;
	}
	return HL_OK;
}

hl_status
hl_network_add_party(hl_network *net, const hl_network_party *p,
		     hl_error *err)
{
	hl_network_party *a = realloc(net->party,
	    (net->nparty + 1) * sizeof *a);

	if (a == NULL)
		return hl_error_nomem(err);
	net->party = a;
	if (party_copy(&a[net->nparty], p) != HL_OK)
		return hl_error_nomem(err);
	net->nparty++;
	return HL_OK;
}

hl_status
hl_network_add_unit(hl_network *net, const hl_network_unit *u, hl_error *err)
{
	hl_network_unit *a = realloc(net->unit, (net->nunit + 1) * sizeof *a);

	if (a == NULL)
		return hl_error_nomem(err);
	net->unit = a;
	a[net->nunit] = *u;
	a[net->nunit].note = NULL;
	if (u->note != NULL && (a[net->nunit].note = strdup(u->note)) == NULL)
		return hl_error_nomem(err);
	net->nunit++;
	return HL_OK;
}

hl_status
hl_network_add_note(hl_network *net, hl_error *err, const char *fmt, ...)
{
	char buf[512], **a;
	va_list ap;

	va_start(ap, fmt);
	vsnprintf(buf, sizeof buf, fmt, ap);
	va_end(ap);
	a = realloc(net->note, (net->nnote + 1) * sizeof *a);
	if (a == NULL)
		return hl_error_nomem(err);
	net->note = a;
	if ((a[net->nnote] = strdup(buf)) == NULL)
		return hl_error_nomem(err);
	net->nnote++;
	return HL_OK;
}

double
hl_network_shift(const hl_settings *set, const hl_network_party *p)
{
	return isnan(p->dt_contrib) ? set->dtmin / 2.0 : p->dt_contrib;
}

double
hl_network_required(const hl_settings *set, const hl_network_party *hot,
		    const hl_network_party *cold)
{
	double emat = isnan(set->emat) ? set->dtmin : set->emat;

	return fmin(emat, hl_network_shift(set, hot) +
	    hl_network_shift(set, cold));
}

static void
side_of(const hl_network *net, const hl_network_party *p, double t_in,
	double t_out, hl_profile_side *s)
{
	s->seg = p->seg;
	s->nseg = p->utility ? 0 : p->nseg;
	s->kind = p->kind;
	s->t_in = t_in;
	s->t_out = t_out;
	s->h = p->utility && !isnan(p->h) ? p->h : net->set.h_default;
}

hl_exchanger_type
hl_network_unit_type(const hl_network *net, size_t hot, size_t cold)
{
	const hl_network_party *h = &net->party[hot], *c = &net->party[cold];
	size_t i;
	int pass;

	/* Pass 0: pairs named on both sides; pass 1: with a wildcard. */
	for (pass = 0; pass < 2; pass++)
		for (i = 0; i < net->ntyped; i++) {
			const hl_network_typed *t = &net->typed[i];

			if ((t->hot < 0 || t->cold < 0) == pass &&
			    (t->hot < 0 || (size_t)t->hot == hot) &&
			    (t->cold < 0 || (size_t)t->cold == cold))
				return t->type;
		}
	if (h->utility && h->type_given)
		return (hl_exchanger_type)h->type;
	if (c->utility && c->type_given)
		return (hl_exchanger_type)c->type;
	return net->set.exchanger;
}

/* The spec of unit u: its type's law, or its utility's own cost law. */
static void
unit_spec(const hl_network *net, const hl_network_unit *u,
	  hl_exchanger_spec *spec)
{
	const hl_network_party *h = &net->party[u->hot];
	const hl_network_party *c = &net->party[u->cold];
	const hl_network_party *util = h->utility && h->cost_given ? h :
	    c->utility && c->cost_given ? c : NULL;

	hl_exchanger_spec_type(spec, &net->set, u->type);
	if (util != NULL) {
		spec->cost_a = util->cost_a;
		spec->cost_b = util->cost_b;
		spec->cost_c = util->cost_c;
	}
	spec->hot_in = u->hot_in;
	spec->hot_out = u->hot_out;
	spec->cold_in = u->cold_in;
	spec->cold_out = u->cold_out;
	spec->duty = u->duty;
	spec->u = u->u;
}

/* Sizing through hl_exchanger_size; a unit whose sides change cp inside it
 * takes the piecewise counterflow mean and U of hl_profile_unit_eval with
 * the F and shells of its terminal temperatures. */
hl_status
hl_network_size_unit(const hl_network *net, hl_network_unit *u,
		     hl_error *err)
{
	const hl_network_party *h = &net->party[u->hot];
	const hl_network_party *c = &net->party[u->cold];
	hl_profile_side hs, cs;
	hl_profile_unit pu;
	hl_exchanger_spec spec;
	hl_exchanger_sizing z;
	hl_status st;

	u->required = hl_network_required(&net->set, h, c);
	side_of(net, h, u->hot_in, u->hot_out, &hs);
	side_of(net, c, u->cold_in, u->cold_out, &cs);
	hl_profile_unit_eval(&hs, &cs, u->duty, &pu);
	u->approach = pu.approach;
	u->assumed = 0;
	if (h->utility ? isnan(h->h) : pu.assumed_hot)
		u->assumed |= HL_NETWORK_H_HOT;
	if (c->utility ? isnan(c->h) : pu.assumed_cold)
		u->assumed |= HL_NETWORK_H_COLD;
	st = hl_exchanger_u(pu.h_hot, pu.h_cold, &u->u, err);
	if (st != HL_OK)
		return st;
	unit_spec(net, u, &spec);
	if (u->held)
		spec.series = u->shells > 0 ? u->shells : 1;
	st = hl_exchanger_size(&spec, &z, err);
	if (st != HL_OK && u->held) {
		/* Its data are sound when the free count can size it. */
		hl_exchanger_spec free_count = spec;

		free_count.series = 0;
		if (hl_exchanger_size(&free_count, &z, err) == HL_OK)
			return hl_error_set(err, HL_ENOSOLUTION, NULL, 0,
			    "its %d %s in series cannot reach P %.6g at R "
			    "%.6g: it needs more", spec.series,
			    u->type == HL_EXCH_AIR_COOLER ? "sections" :
			    u->type == HL_EXCH_DOUBLE_PIPE ? "hairpins" :
			    "shells", z.p, z.r);
	}
	if (st != HL_OK)
		return st;
	if (pu.pieces > 1 && u->type != HL_EXCH_FIRED_HEATER) {
		if (!(pu.lmtd > 0.0 && pu.u > 0.0))
			return hl_error_set(err, HL_EINPUT, NULL, 0,
			    "the hot side falls to the cold side inside the "
			    "unit (approach %.6g K)", pu.approach);
		u->u = spec.u = pu.u;
		z.lmtd = pu.lmtd;
		z.area = u->duty / (u->u * z.f * z.lmtd);
		hl_exchanger_price(&spec, &z);
	}
	if (u->held)
		return hl_network_size_held(net, u, &spec, &z, err);
	u->lmtd = z.lmtd;
	u->ft = z.f;
	u->shells = z.shells;
	u->parallel = z.parallel;
	u->area = z.area;
	u->area_shell = z.area_shell;
	u->cost = z.cost;
	u->warn = z.warn;
	return HL_OK;
}

void
hl_network_unit_warning(const hl_network *net, const hl_network_unit *u,
			char *buf, size_t n)
{
	hl_exchanger_spec spec;
	hl_exchanger_sizing z;

	unit_spec(net, u, &spec);
	memset(&z, 0, sizeof z);
	z.warn = u->warn;
	z.x = u->type == HL_EXCH_FIRED_HEATER ? u->duty / 1000.0 /
	    (u->parallel > 0 ? u->parallel : 1) : u->area_shell;
	hl_exchanger_warning(&spec, &z, buf, n);
}

void
hl_network_totals(hl_network *net)
{
	size_t i;

	net->qh = net->qc = 0.0;
	net->area = net->capital = net->energy_cost = 0.0;
	for (i = 0; i < net->nparty; i++)
		if (net->party[i].utility)
			net->party[i].load = 0.0;
	for (i = 0; i < net->nunit; i++) {
		const hl_network_unit *u = &net->unit[i];
		hl_network_party *h = &net->party[u->hot];
		hl_network_party *c = &net->party[u->cold];

		if (h->utility) {
			h->load += u->duty;
			net->qh += u->duty;
		}
		if (c->utility) {
			c->load += u->duty;
			net->qc += u->duty;
		}
		net->area += u->area;
		net->capital += u->cost;
	}
	for (i = 0; i < net->nparty; i++) {
		const hl_network_party *p = &net->party[i];

		if (p->utility && !isnan(p->price))
			net->energy_cost += p->price * p->load *
			    net->set.hours / 1000.0;
	}
	net->nsplit = 0;
	for (i = 0; i < net->nunit; i++) {
		const hl_network_unit *u = &net->unit[i];
		size_t j;
		int first = 1;

		if (u->hot_share >= 1.0 && u->cold_share >= 1.0)
			continue;
		/* Count each split stage once: at its first unit. */
		for (j = 0; j < i && first; j++) {
			const hl_network_unit *v = &net->unit[j];

			if (u->hot_share < 1.0 && !net->party[u->hot].utility &&
			    v->hot == u->hot && v->hot_stage == u->hot_stage)
				first = 0;
		}
		if (u->hot_share < 1.0 && !net->party[u->hot].utility && first)
			net->nsplit++;
		first = 1;
		for (j = 0; j < i && first; j++) {
			const hl_network_unit *v = &net->unit[j];

			if (v->cold == u->cold && v->cold_stage == u->cold_stage)
				first = 0;
		}
		if (u->cold_share < 1.0 && !net->party[u->cold].utility &&
		    first)
			net->nsplit++;
	}
	net->crf = hl_supertarget_crf(net->set.interest, net->set.life);
	net->capital_annual = net->capital * net->crf;
	net->total_cost = net->capital_annual + net->energy_cost;
}

