/* network_opt_net.c - the optimiser's loads as a network (hl_network):
 * stages numbered along each stream, branch shares from the loads and
 * weights, utility units inside the streams and at their ends, every unit
 * sized by hl_network_size_unit. */
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

/* Stage numbers along each stream, 1 from the supply end: process units
 * of superstructure stage k get num[k], the utility inside the stream after
 * them mid[k]; *last is the last number. Side 0: hot stream a (stages in
 * order), side 1: cold stream b (from stage S - 1 down). */
static void
numbers(const hl_opt_problem *P, const hl_opt_state *s, int side, size_t j,
	int *num, int *mid, int *last)
{
	size_t k, x, S = P->S;
	int n = 0;

	for (k = 0; k < S; k++) {
		size_t kk = side == 0 ? k : S - 1 - k;
		int any = 0;

		for (x = 0; x < (side == 0 ? P->nc : P->nh) && !any; x++)
			any = s->q[side == 0 ? HL_OPT_CELL(P, kk, j, x) :
			    HL_OPT_CELL(P, kk, x, j)] > HL_OPT_QEPS;
		num[kk] = any ? ++n : 0;
		mid[kk] = (side == 0 ? s->uh[j * S + kk] : s->uc[j * S + kk]) >
		    0.0 ? ++n : 0;
	}
	*last = n;
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
	      hl_network *net, const int *hnum, const int *cnum,
	      hl_error *err)
{
	unsigned n = 0;
	size_t a, b, k, S = P->S;
	hl_status st = HL_OK;

	for (a = 0; a < P->nh && st == HL_OK; a++)
		for (k = 0; k < S && st == HL_OK; k++)
			for (b = 0; b < P->nc && st == HL_OK; b++) {
				size_t i = HL_OPT_CELL(P, k, a, b);
				hl_network_unit u;

				if (!(s->q[i] > HL_OPT_QEPS))
					continue;
				memset(&u, 0, sizeof u);
				u.hot = P->hot[a];
				u.cold = P->cold[b];
				u.duty = s->q[i];
				u.hot_in = s->th[a * (S + 1) + k];
				u.hot_out = hl_opt_branch_out(P, s, 0, k, a,
				    u.duty, s->wh[i], &u.hot_share);
				u.cold_in = s->tc[b * (S + 1) + k + 1];
				u.cold_out = hl_opt_branch_out(P, s, 1, k, b,
				    u.duty, s->wc[i], &u.cold_share);
				u.hot_stage = hnum[a * S + k];
				u.cold_stage = cnum[b * S + k];
				st = add(net, &u, 'E', &n, err);
			}
	net->nmatch = n;
	return st;
}

/* The utility units inside stream j (side 0 hot, 1 cold). */
static hl_status
mid_units(const hl_opt_problem *P, const hl_opt_state *s, hl_network *net,
	  int side, size_t j, const int *mid, unsigned *n, hl_error *err)
{
	size_t k, S = P->S;
	hl_status st = HL_OK;

	for (k = 0; k < S && st == HL_OK; k++) {
		double d = side == 0 ? s->uh[j * S + k] : s->uc[j * S + k], v;
		hl_network_unit u;
		long which;

		if (!(d > 0.0))
			continue;
		memset(&u, 0, sizeof u);
		hl_opt_util_unit(P, side == 0 ? P->hot[j] : P->cold[j],
		    side == 0 ? s->thm[j * S + k] : s->tcm[j * S + k],
		    side == 0 ? s->th[j * (S + 1) + k + 1] :
		    s->tc[j * (S + 1) + k], d, &u, &which, &v);
		if (which < 0)
			return hl_error_set(err, HL_ENOSOLUTION, NULL, 0, "no "
			    "utility may serve stream '%s' inside it",
			    net->party[side == 0 ? P->hot[j] : P->cold[j]].name);
		u.hot_share = u.cold_share = 1.0;
		if (side == 0)
			u.hot_stage = mid[j * S + k];
		else
			u.cold_stage = mid[j * S + k];
		st = add(net, &u, side == 0 ? 'C' : 'H', n, err);
	}
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

/* Every unit of the state: process units, utilities inside streams, the
 * stream ends' utilities; stage numbers along each stream. */
static hl_status
all_units(const hl_opt_problem *P, const hl_opt_state *s, hl_network *net,
	  hl_error *err)
{
	size_t S = P->S, a, b;
	int *hnum = calloc(P->nh * S + 1, sizeof *hnum);
	int *hmid = calloc(P->nh * S + 1, sizeof *hmid);
	int *cnum = calloc(P->nc * S + 1, sizeof *cnum);
	int *cmid = calloc(P->nc * S + 1, sizeof *cmid);
	int *hlast = calloc(P->nh + 1, sizeof *hlast);
	int *clast = calloc(P->nc + 1, sizeof *clast);
	unsigned nh = 0, nc = 0;
	hl_status st = HL_OK;

	if (hnum == NULL || hmid == NULL || cnum == NULL || cmid == NULL ||
	    hlast == NULL || clast == NULL)
		st = hl_error_nomem(err);
	for (a = 0; a < P->nh && st == HL_OK; a++)
		numbers(P, s, 0, a, &hnum[a * S], &hmid[a * S], &hlast[a]);
	for (b = 0; b < P->nc && st == HL_OK; b++)
		numbers(P, s, 1, b, &cnum[b * S], &cmid[b * S], &clast[b]);
	if (st == HL_OK)
		st = process_units(P, s, net, hnum, cnum, err);
	for (b = 0; b < P->nc && st == HL_OK; b++)
		st = mid_units(P, s, net, 1, b, cmid, &nh, err);
	for (b = 0; b < P->nc && st == HL_OK; b++)
		if (s->cend[b] > 0.0)
			st = end_units(P, net, P->cold[b], s->tc[b * (S + 1)],
			    s->cend[b], clast[b] + 1, 'H', &nh, err);
	for (a = 0; a < P->nh && st == HL_OK; a++)
		st = mid_units(P, s, net, 0, a, hmid, &nc, err);
	for (a = 0; a < P->nh && st == HL_OK; a++)
		if (s->hend[a] > 0.0)
			st = end_units(P, net, P->hot[a],
			    s->th[a * (S + 1) + S], s->hend[a], hlast[a] + 1,
			    'C', &nc, err);
	free(hnum);
	free(hmid);
	free(cnum);
	free(cmid);
	free(hlast);
	free(clast);
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
	st = all_units(P, s, net, err);
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
