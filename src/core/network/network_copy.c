/* network_copy.c - a deep copy of a network, for searches that change one
 * candidate while keeping the others. */
#include <stdlib.h>
#include <string.h>

#include "network.h"

static int
copy_strings(hl_network *d, const hl_network *s)
{
	size_t i;

	if (s->set.currency != NULL &&
	    (d->set.currency = strdup(s->set.currency)) == NULL)
		return -1;
	if (s->source != NULL && (d->source = strdup(s->source)) == NULL)
		return -1;
	for (i = 0; i < s->nnote; i++)
		if (hl_network_add_note(d, NULL, "%s", s->note[i]) != HL_OK)
			return -1;
	/* A new unit on a copy takes its type from the pair rules. */
	if (s->ntyped > 0) {
		d->typed = malloc(s->ntyped * sizeof *d->typed);
		if (d->typed == NULL)
			return -1;
		memcpy(d->typed, s->typed, s->ntyped * sizeof *d->typed);
		d->ntyped = s->ntyped;
	}
	return 0;
}

hl_network *
hl_network_copy(const hl_network *s)
{
	hl_network *d = hl_network_create();
	size_t i;

	if (d == NULL)
		return NULL;
	d->set = s->set;
	d->set.currency = NULL;
	for (i = 0; i < s->nparty; i++)
		if (hl_network_add_party(d, &s->party[i], NULL) != HL_OK)
			goto fail;
	for (i = 0; i < s->nunit; i++)
		if (hl_network_add_unit(d, &s->unit[i], NULL) != HL_OK)
			goto fail;
	if (copy_strings(d, s) != 0)
		goto fail;
	d->nmatch = s->nmatch;
	d->qh = s->qh;
	d->qc = s->qc;
	d->qh_target = s->qh_target;
	d->qc_target = s->qc_target;
	d->restriction = s->restriction;
	d->range_rise = s->range_rise;
	d->penalty = s->penalty;
	d->nsplit = s->nsplit;
	d->area = s->area;
	d->capital = s->capital;
	d->crf = s->crf;
	d->capital_annual = s->capital_annual;
	d->energy_cost = s->energy_cost;
	d->total_cost = s->total_cost;
	return d;
fail:
	hl_network_free(d);
	return NULL;
}
