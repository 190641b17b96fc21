/* match_rules.c - which hot/cold pairs may be matched, and at what weight.
 *
 * A pair has potential when some heat of the hot party lies at or above some
 * demand of the cold party in the shifted intervals (heat only flows down).
 * Plant areas apply first, then the rules in file order: forbid, require (a
 * require rule overrides the area policy, never a forbid rule), max-duty
 * (the smallest one wins). With penalised plant areas a unit joining two
 * areas counts as area_penalty units (case.h). Two utilities are never
 * matched.
 */
#include <math.h>
#include <string.h>

#include "match_int.h"

static int
name_matches(const char *pattern, const char *name)
{
	return strcmp(pattern, "*") == 0 || strcmp(pattern, name) == 0;
}

/* First interval with heat of party i (nint when none); last one (or -1). */
static size_t
first_heat(const hl_match_problem *p, size_t i)
{
	size_t k;

	for (k = 0; k < p->nint; k++)
		if (p->unit[i * p->nint + k] > 0.0)
			return k;
	return p->nint;
}

static long
last_heat(const hl_match_problem *p, size_t i)
{
	size_t k;

	for (k = p->nint; k > 0; k--)
		if (p->unit[i * p->nint + k - 1] > 0.0)
			return (long)k - 1;
	return -1;
}

static void
base_pair(const hl_match_problem *p, size_t a, size_t b, long skip,
	  hl_match_pair *q)
{
	const hl_match_party *h = &p->party[p->hot[a]];
	const hl_match_party *k = &p->party[p->cold[b]];
	const char *ha = p->area[p->hot[a]], *ka = p->area[p->cold[b]];

	memset(q, 0, sizeof *q);
	q->maxduty = HUGE_VAL;
	q->cost = 1.0;
	q->forbid_rule = -1;
	if (h->type != HL_PARTY_STREAM && k->type != HL_PARTY_STREAM)
		return; /* two utilities */
	q->potential = (long)first_heat(p, p->hot[a]) <= last_heat(p,
							p->cold[b]);
	q->allowed = q->potential;
	q->cross = ha != NULL && ka != NULL && strcmp(ha, ka) != 0;
	if (!q->cross || skip == -2)
		return;
	if (p->c->set.area_policy == HL_AREAS_FORBID) {
		q->allowed = 0;
		q->forbid_rule = -2;
	} else if (p->c->set.area_policy == HL_AREAS_PENALISE) {
		q->cost = p->c->set.area_penalty; /* counts as that many units */
	}
}

static hl_status
apply_rule(const hl_match_problem *p, size_t r, size_t a, size_t b,
	   hl_match_pair *q, hl_error *err)
{
	const hl_match_rule *rule = &p->c->rule[r];
	int exact = strcmp(rule->hot, "*") != 0 && strcmp(rule->cold, "*") != 0;
	const char *hn = p->party[p->hot[a]].name;
	const char *cn = p->party[p->cold[b]].name;

	switch (rule->kind) {
	case HL_RULE_FORBID:
		if (q->required)
			goto conflict;
		q->allowed = 0;
		if (q->forbid_rule < 0)
			q->forbid_rule = (long)r;
		break;
	case HL_RULE_REQUIRE:
		if (q->forbid_rule >= 0)
			goto conflict;
		if (!q->potential) {
			if (!exact)
				break;
			return hl_error_set(err, HL_ENOSOLUTION, rule->file,
				rule->line, "required match '%s'-'%s' cannot "
				"exchange heat: at ΔTmin %g K '%s' is nowhere "
				"hot enough to heat '%s'", hn, cn, p->dtmin,
				hn, cn);
		}
		q->required = 1;
		q->allowed = 1;
		break;
	case HL_RULE_MAX_DUTY:
		q->maxduty = fmin(q->maxduty, rule->max_duty);
		break;
	}
	return HL_OK;
conflict:
	return hl_error_set(err, HL_EINPUT, rule->file, rule->line,
		"match '%s'-'%s' is both forbidden and required; drop one of "
		"the two rules", hn, cn);
}

hl_status
hl_match_rules(hl_match_problem *p, long skip, hl_match_pair *pair,
	       hl_error *err)
{
	size_t a, b, r;
	hl_status st;

	for (a = 0; a < p->nhot; a++) {
		for (b = 0; b < p->ncold; b++) {
			hl_match_pair *q = &pair[HL_MATCH_PAIR(p, a, b)];

			base_pair(p, a, b, skip, q);
			if (p->party[p->hot[a]].type != HL_PARTY_STREAM &&
			    p->party[p->cold[b]].type != HL_PARTY_STREAM)
				continue;
			for (r = 0; r < p->c->nrule; r++) {
				const hl_match_rule *rule = &p->c->rule[r];

				if ((long)r == skip ||
				    !name_matches(rule->hot,
						  p->party[p->hot[a]].name) ||
				    !name_matches(rule->cold,
						  p->party[p->cold[b]].name))
					continue;
				st = apply_rule(p, r, a, b, q, err);
				if (st != HL_OK)
					return st;
			}
		}
	}
	return HL_OK;
}
