/* network_opt_net.c - the optimiser's loads as a network (hl_network):
 * stages numbered along each stream, branch shares from the loads
 * (isothermal mixing), utility units at the stream ends, every unit sized
 * by hl_network_size_unit. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "cascade.h"
#include "network_opt_int.h"

/* The parties, settings and type rules of base, no units (a copy). */
static hl_network *
empty_like(const hl_network *base)
{
	hl_network *net = hl_network_copy(base);
	size_t i;

	for (i = 0; net != NULL && i < net->nparty; i++)
		if (net->party[i].utility)
			net->party[i].load = 0.0;
	return net;
}

/* Active stages of hot stream a in [k0, k1). */
static int
hot_stages(const hl_opt_problem *P, const hl_opt_state *s, size_t a,
	   size_t k0, size_t k1)
{
	size_t k, b;
	int n = 0;

	for (k = k0; k < k1; k++)
		for (b = 0; b < P->nc; b++)
			if (s->q[HL_OPT_CELL(P, k, a, b)] > HL_OPT_QEPS) {
				n++;
				break;
			}
	return n;
}

static int
cold_stages(const hl_opt_problem *P, const hl_opt_state *s, size_t b,
	    size_t k0, size_t k1)
{
	size_t k, a;
	int n = 0;

	for (k = k0; k < k1; k++)
		for (a = 0; a < P->nh; a++)
			if (s->q[HL_OPT_CELL(P, k, a, b)] > HL_OPT_QEPS) {
				n++;
				break;
			}
	return n;
}

static double
stage_load_hot(const hl_opt_problem *P, const hl_opt_state *s, size_t k,
	       size_t a)
{
	double sum = 0.0;
	size_t b;

	for (b = 0; b < P->nc; b++)
		if (s->q[HL_OPT_CELL(P, k, a, b)] > HL_OPT_QEPS)
			sum += s->q[HL_OPT_CELL(P, k, a, b)];
	return sum;
}

static double
stage_load_cold(const hl_opt_problem *P, const hl_opt_state *s, size_t k,
		size_t b)
{
	double sum = 0.0;
	size_t a;

	for (a = 0; a < P->nh; a++)
		if (s->q[HL_OPT_CELL(P, k, a, b)] > HL_OPT_QEPS)
			sum += s->q[HL_OPT_CELL(P, k, a, b)];
	return sum;
}

static hl_status
add(hl_network *net, hl_network_unit *u, char kind, unsigned *n,
    hl_error *err)
{
	hl_status st;

	snprintf(u->id, sizeof u->id, "%c%u", kind, ++*n % 100000000u);
	u->match = -1;
	st = hl_opt_size(net, u, 1, err);
	if (st != HL_OK) {
		char why[HL_ERROR_TEXT];

		snprintf(why, sizeof why, "%s", err != NULL ? err->text : "");
		return hl_error_set(err, HL_ENOSOLUTION, NULL, 0, "unit %s "
		    "cannot be sized: %s", u->id, why);
	}
	return hl_network_add_unit(net, u, err);
}

static hl_status
process_units(const hl_opt_problem *P, const hl_opt_state *s,
	      hl_network *net, hl_error *err)
{
	unsigned n = 0;
	size_t a, b, k;
	hl_status st = HL_OK;

	for (a = 0; a < P->nh && st == HL_OK; a++)
		for (k = 0; k < P->S && st == HL_OK; k++)
			for (b = 0; b < P->nc && st == HL_OK; b++) {
				double q = s->q[HL_OPT_CELL(P, k, a, b)];
				hl_network_unit u;

				if (!(q > HL_OPT_QEPS))
					continue;
				memset(&u, 0, sizeof u);
				u.hot = P->hot[a];
				u.cold = P->cold[b];
				u.duty = q;
				u.hot_in = s->th[a * (P->S + 1) + k];
				u.hot_out = s->th[a * (P->S + 1) + k + 1];
				u.cold_in = s->tc[b * (P->S + 1) + k + 1];
				u.cold_out = s->tc[b * (P->S + 1) + k];
				u.hot_share = q / stage_load_hot(P, s, k, a);
				u.cold_share = q / stage_load_cold(P, s, k, b);
				u.hot_stage = hot_stages(P, s, a, 0, k + 1);
				u.cold_stage = cold_stages(P, s, b, k, P->S);
				st = add(net, &u, 'E', &n, err);
			}
	net->nmatch = n;
	return st;
}

/* The utility units of one stream end, in series after its last stage
 * (stage numbers from `stage`). */
static hl_status
end_units(const hl_opt_problem *P, hl_network *net, size_t p, double t_in,
	  double d, int stage, char kind, unsigned *n, hl_error *err)
{
	hl_network_unit *u = calloc(P->nu + 1, sizeof *u);
	size_t k, m = 0;
	long which;
	double v;
	hl_status st = HL_OK;

	if (u == NULL)
		return hl_error_nomem(err);
	hl_opt_end(P, p, t_in, d, u, &m, &which, &v);
	if (m == 0)
		st = hl_error_set(err, HL_ENOSOLUTION, NULL, 0, "no utility "
		    "may take stream '%s' to its target", net->party[p].name);
	for (k = 0; k < m && st == HL_OK; k++) {
		u[k].hot_share = u[k].cold_share = 1.0;
		if (kind == 'H')
			u[k].cold_stage = stage + (int)k;
		else
			u[k].hot_stage = stage + (int)k;
		st = add(net, &u[k], kind, n, err);
	}
	free(u);
	return st;
}

static hl_status
utility_units(const hl_opt_problem *P, const hl_opt_state *s,
	      hl_network *net, hl_error *err)
{
	unsigned nh = 0, nc = 0;
	size_t a, b;
	hl_status st = HL_OK;

	for (b = 0; b < P->nc && st == HL_OK; b++)
		if (s->cend[b] > 0.0)
			st = end_units(P, net, P->cold[b],
			    s->tc[b * (P->S + 1)], s->cend[b],
			    cold_stages(P, s, b, 0, P->S) + 1, 'H', &nh, err);
	for (a = 0; a < P->nh && st == HL_OK; a++)
		if (s->hend[a] > 0.0)
			st = end_units(P, net, P->hot[a],
			    s->th[a * (P->S + 1) + P->S], s->hend[a],
			    hot_stages(P, s, a, 0, P->S) + 1, 'C', &nc, err);
	return st;
}

/* A utility's units take shares of its flow in proportion to duty over
 * their temperature change (all the duty when it condenses or boils). */
static void
utility_shares(hl_network *net)
{
	size_t p, i;

	for (p = 0; p < net->nparty; p++) {
		const hl_network_party *s = &net->party[p];
		double flow = 0.0;

		if (!s->utility)
			continue;
		for (i = 0; i < net->nunit; i++) {
			const hl_network_unit *u = &net->unit[i];
			double dt;

			if (u->hot != p && u->cold != p)
				continue;
			dt = u->hot == p ? u->hot_in - u->hot_out :
			    u->cold_out - u->cold_in;
			flow += s->supply == s->target ? u->duty :
			    u->duty / fmax(fabs(dt), 1e-300);
		}
		for (i = 0; i < net->nunit && flow > 0.0; i++) {
			hl_network_unit *u = &net->unit[i];
			double dt, w;

			if (u->hot != p && u->cold != p)
				continue;
			dt = u->hot == p ? u->hot_in - u->hot_out :
			    u->cold_out - u->cold_in;
			w = (s->supply == s->target ? u->duty :
			    u->duty / fmax(fabs(dt), 1e-300)) / flow;
			if (u->hot == p)
				u->hot_share = w;
			else
				u->cold_share = w;
		}
	}
}

hl_status
hl_opt_to_network(const hl_opt_problem *P, const hl_opt_state *s,
		  hl_network **out, hl_error *err)
{
	hl_network *net = empty_like(P->base);
	double qh, qc;
	hl_status st;

	if (net == NULL)
		return hl_error_nomem(err);
	st = process_units(P, s, net, err);
	if (st == HL_OK)
		st = utility_units(P, s, net, err);
	if (st == HL_OK)
		st = hl_cascade_targets(P->c, P->c->set.dtmin, &qh, &qc, err);
	if (st != HL_OK) {
		hl_network_free(net);
		return st;
	}
	utility_shares(net);
	hl_network_totals(net);
	net->qh_target = qh;
	net->qc_target = qc;
	net->restriction = 0.0;
	net->penalty = net->qh - qh;
	if (fabs(net->penalty) < 1e-9 * fmax(1.0, qh))
		net->penalty = 0.0;
	*out = net;
	return HL_OK;
}
