/* network_case.c - an empty network on a case's parties (network.h,
 * hl_network_of_case): what a search that builds its own units sizes them
 * against, with the utilities' types and cost laws and the case's exchanger
 * type rules, so that hl_network_unit_type and hl_network_size_unit price
 * its units as the placement prices its own. */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "network.h"

hl_status
hl_network_add_streams(const hl_case *c, hl_network *net, hl_error *err)
{
	size_t i;
	hl_status st = HL_OK;

	for (i = 0; i < c->nstream && st == HL_OK; i++) {
		const hl_stream *s = &c->stream[i];
		hl_network_party q;

		memset(&q, 0, sizeof q);
		q.name = s->name;
		q.kind = s->kind;
		q.supply = hl_stream_supply(s);
		q.target = hl_stream_target(s);
		q.nseg = s->nseg;
		q.seg = s->seg;
		q.h = NAN;
		q.dt_contrib = s->dt_contrib;
		q.load = hl_stream_duty(s);
		q.price = NAN;
		q.max_load = NAN;
		st = hl_network_add_party(net, &q, err);
	}
	return st;
}

static hl_status
add_utilities(const hl_case *c, const double *util_load, hl_network *net,
	      hl_error *err)
{
	size_t i;
	hl_status st = HL_OK;

	for (i = 0; i < c->nutil && st == HL_OK; i++) {
		const hl_utility *u = &c->util[i];
		hl_network_party q;

		memset(&q, 0, sizeof q);
		q.name = u->name;
		q.kind = u->kind;
		q.utility = 1;
		q.supply = u->supply;
		q.target = u->target;
		q.h = u->h;
		q.dt_contrib = u->dt_contrib;
		q.load = util_load != NULL ? util_load[i] : 0.0;
		q.price = u->price;
		q.max_load = u->max_load;
		q.type = hl_utility_type(&c->set, u);
		q.type_given = q.type >= 0;
		q.cost_given = u->cost_given;
		q.cost_a = u->cost_a;
		q.cost_b = u->cost_b;
		q.cost_c = u->cost_c;
		st = hl_network_add_party(net, &q, err);
	}
	return st;
}

/* Index of the party named name (-1 for "*"), -2 when none has it. */
static long
party_index(const hl_network *net, const char *name)
{
	size_t i;

	if (strcmp(name, "*") == 0)
		return -1;
	for (i = 0; i < net->nparty; i++)
		if (strcmp(net->party[i].name, name) == 0)
			return (long)i;
	return -2;
}

/* The case's type rules on the network's parties, in the case's order. */
static hl_status
add_typed(const hl_case *c, hl_network *net, hl_error *err)
{
	size_t i;

	net->typed = calloc(c->ntyped + 1, sizeof *net->typed);
	if (net->typed == NULL)
		return hl_error_nomem(err);
	for (i = 0; i < c->ntyped; i++) {
		hl_network_typed *t = &net->typed[net->ntyped];

		t->hot = party_index(net, c->typed[i].hot);
		t->cold = party_index(net, c->typed[i].cold);
		t->type = c->typed[i].type;
		if (t->hot != -2 && t->cold != -2)
			net->ntyped++;
	}
	return HL_OK;
}

hl_status
hl_network_of_case(const hl_case *c, const double *util_load,
		   hl_network **out, hl_error *err)
{
	hl_network *net = hl_network_create();
	hl_status st;

	*out = NULL;
	if (net == NULL)
		return hl_error_nomem(err);
	net->set = c->set;
	net->set.currency = strdup(c->set.currency != NULL ?
	    c->set.currency : "EUR");
	net->total_cost = NAN;
	net->qh_target = net->qc_target = NAN;
	st = net->set.currency == NULL ? hl_error_nomem(err) :
	    hl_network_add_streams(c, net, err);
	if (st == HL_OK)
		st = add_utilities(c, util_load, net, err);
	if (st == HL_OK)
		st = add_typed(c, net, err);
	if (st != HL_OK) {
		hl_network_free(net);
		return st;
	}
	*out = net;
	return HL_OK;
}
