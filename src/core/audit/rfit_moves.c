/* rfit_moves.c - structural changes to a retrofit candidate: a unit
 * lifted off its streams, placed at another stage, or taken out; the
 * stages of the streams renumbered so that they stay 1, 2, … */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "rfit_int.h"

int
rf_stages(const hl_network *net, size_t p)
{
	size_t i;
	int n = 0;

	for (i = 0; i < net->nunit; i++) {
		const hl_network_unit *u = &net->unit[i];

		if (u->hot == p && u->hot_stage > n)
			n = u->hot_stage;
		if (u->cold == p && u->cold_stage > n)
			n = u->cold_stage;
	}
	return n;
}

/* Stages >= from on party p move by delta (unit skip left alone). */
static void
shift(hl_network *net, size_t p, int from, int delta, size_t skip)
{
	size_t i;

	for (i = 0; i < net->nunit; i++) {
		hl_network_unit *u = &net->unit[i];

		if (i == skip)
			continue;
		if (u->hot == p && u->hot_stage >= from)
			u->hot_stage += delta;
		if (u->cold == p && u->cold_stage >= from)
			u->cold_stage += delta;
	}
}

/* Units other than skip at stage k of party p. */
static int
others_at(const hl_network *net, size_t p, int k, size_t skip)
{
	size_t i;
	int n = 0;

	for (i = 0; i < net->nunit; i++) {
		const hl_network_unit *u = &net->unit[i];

		if (i != skip && ((u->hot == p && u->hot_stage == k) ||
		    (u->cold == p && u->cold_stage == k)))
			n++;
	}
	return n;
}

/* Lift unit i off its process streams (stages closed up behind it); -1
 * when it is a branch of a split. */
static int
detach(hl_network *net, size_t i)
{
	hl_network_unit *u = &net->unit[i];

	if (!rf_recovery(net, u))
		return -1;
	if (others_at(net, u->hot, u->hot_stage, i) > 0 ||
	    others_at(net, u->cold, u->cold_stage, i) > 0)
		return -1;
	shift(net, u->hot, u->hot_stage + 1, -1, i);
	shift(net, u->cold, u->cold_stage + 1, -1, i);
	u->hot_stage = u->cold_stage = 0;
	return 0;
}

int
rf_move_remove(hl_network *net, size_t i)
{
	if (detach(net, i) != 0)
		return -1;
	free(net->unit[i].note);
	memmove(&net->unit[i], &net->unit[i + 1],
	    (net->nunit - i - 1) * sizeof *net->unit);
	net->nunit--;
	return 0;
}

/* Put unit i (lifted off or new, stages 0) in series before stage hot_pos
 * of its hot stream and cold_pos of its cold one (1 … stages + 1). */
static int
attach(hl_network *net, size_t i, int hot_pos, int cold_pos)
{
	hl_network_unit *u = &net->unit[i];

	if (hot_pos < 1 || hot_pos > rf_stages(net, u->hot) + 1 ||
	    cold_pos < 1 || cold_pos > rf_stages(net, u->cold) + 1)
		return -1;
	shift(net, u->hot, hot_pos, 1, i);
	shift(net, u->cold, cold_pos, 1, i);
	u->hot_stage = hot_pos;
	u->cold_stage = cold_pos;
	u->hot_share = u->cold_share = 1.0;
	return 0;
}

/* Move unit i to hot_pos, cold_pos (positions counted once it is lifted
 * off; a new unit has stages 0 and is only attached). */
int
rf_move_place(hl_network *net, size_t i, int hot_pos, int cold_pos)
{
	hl_network_unit *u = &net->unit[i];

	if ((u->hot_stage > 0 || u->cold_stage > 0) && detach(net, i) != 0)
		return -1;
	return attach(net, i, hot_pos, cold_pos);
}

void
rf_place_text(const hl_network *net, const hl_network_unit *u, char *buf,
	      size_t n)
{
	const hl_network_party *h = &net->party[u->hot];
	const hl_network_party *c = &net->party[u->cold];
	char hs[24] = "", cs[24] = "";

	if (!h->utility)
		snprintf(hs, sizeof hs, " #%d", u->hot_stage);
	if (!c->utility)
		snprintf(cs, sizeof cs, " #%d", u->cold_stage);
	snprintf(buf, n, "%s%s / %s%s", h->name, hs, c->name, cs);
}

/* Move unit i to another pair (hot, cold) at hot_pos, cold_pos. */
int
rf_move_repipe(hl_network *net, size_t i, size_t hot, size_t cold,
	       int hot_pos, int cold_pos)
{
	hl_network_unit *u = &net->unit[i];

	if (detach(net, i) != 0)
		return -1;
	u->hot = hot;
	u->cold = cold;
	return attach(net, i, hot_pos, cold_pos);
}

/* Temperature of party p where stage pos begins (pos = stages + 1: its
 * target). */
double
rf_temp_at(const hl_network *net, size_t p, int pos)
{
	size_t i;

	for (i = 0; i < net->nunit; i++) {
		const hl_network_unit *u = &net->unit[i];

		if (u->hot == p && u->hot_stage == pos)
			return u->hot_in;
		if (u->cold == p && u->cold_stage == pos)
			return u->cold_in;
	}
	return net->party[p].target;
}

/* Take out every trim (a new heater or cooler): each evaluation adds the
 * ones the plant then needs, sized afresh. */
void
rf_strip_trims(hl_network *net)
{
	size_t i = net->nunit;

	while (i-- > 0) {
		hl_network_unit *u = &net->unit[i];
		size_t p;
		int k;

		if (u->reuses[0] != '\0' || rf_recovery(net, u))
			continue;
		p = net->party[u->hot].utility ? u->cold : u->hot;
		k = p == u->hot ? u->hot_stage : u->cold_stage;
		if (others_at(net, p, k, i) == 0)
			shift(net, p, k + 1, -1, i);
		free(u->note);
		memmove(u, u + 1, (net->nunit - i - 1) * sizeof *u);
		net->nunit--;
	}
}

/* The one unit at stage k of party p, or SIZE_MAX (none or several). */
static size_t
alone_at(const hl_network *net, size_t p, int k)
{
	size_t i, found = (size_t)-1;

	for (i = 0; i < net->nunit; i++) {
		const hl_network_unit *u = &net->unit[i];

		if ((u->hot == p && u->hot_stage == k) ||
		    (u->cold == p && u->cold_stage == k)) {
			if (found != (size_t)-1)
				return (size_t)-1;
			found = i;
		}
	}
	return found;
}

static void
set_place(hl_network_unit *u, size_t p, int k, double share)
{
	if (u->hot == p) {
		u->hot_stage = k;
		u->hot_share = share;
	} else {
		u->cold_stage = k;
		u->cold_share = share;
	}
}

int
rf_move_split(hl_network *net, size_t p, int k, double s, size_t *a,
	      size_t *b)
{
	size_t x = alone_at(net, p, k), y = alone_at(net, p, k + 1);

	if (net->party[p].utility || x == (size_t)-1 || y == (size_t)-1 ||
	    !rf_recovery(net, &net->unit[x]) ||
	    !rf_recovery(net, &net->unit[y]) || !(s > 0.0 && s < 1.0))
		return -1;
	set_place(&net->unit[x], p, k, s);
	set_place(&net->unit[y], p, k, 1.0 - s);
	shift(net, p, k + 2, -1, (size_t)-1);
	if (a != NULL)
		*a = x;
	if (b != NULL)
		*b = y;
	return 0;
}

int
rf_move_unsplit(hl_network *net, size_t p, int k, int swap, size_t *a,
		size_t *b)
{
	size_t i, n = 0, u2[2] = { 0, 0 };

	if (net->party[p].utility)
		return -1;
	for (i = 0; i < net->nunit; i++) {
		const hl_network_unit *u = &net->unit[i];

		if ((u->hot == p && u->hot_stage == k) ||
		    (u->cold == p && u->cold_stage == k)) {
			if (n == 2)
				return -1;
			u2[n++] = i;
		}
	}
	if (n != 2 || !rf_recovery(net, &net->unit[u2[0]]) ||
	    !rf_recovery(net, &net->unit[u2[1]]))
		return -1;
	if (swap) {
		size_t t = u2[0];

		u2[0] = u2[1];
		u2[1] = t;
	}
	shift(net, p, k + 1, 1, (size_t)-1);
	set_place(&net->unit[u2[0]], p, k, 1.0);
	set_place(&net->unit[u2[1]], p, k + 1, 1.0);
	if (a != NULL)
		*a = u2[0];
	if (b != NULL)
		*b = u2[1];
	return 0;
}
