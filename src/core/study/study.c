/* study.c - the stage chain of a design study (study.h). */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "study.h"

hl_status
hl_study_targets(const hl_case *c, const hl_study_opts *o, hl_study *s,
		 hl_error *err)
{
	hl_utility_lp_opts lo = { o->verbose, o->log, NULL, NAN };
	hl_status st;

	st = hl_cascade_compute(c, c->set.dtmin, &s->cas, err);
	if (st == HL_OK && c->nutil > 0)
		st = hl_utility_lp_solve(c, c->set.dtmin, &lo, &s->lp, err);
	return st;
}

hl_status
hl_study_matches(const hl_case *c, const hl_study_opts *o, hl_study *s,
		 hl_error *err)
{
	hl_match_options mo;
	double *loads = NULL;
	hl_status st;

	st = hl_utility_lp_loads(s->lp, &loads, err);
	if (st != HL_OK)
		return st;
	hl_match_options_default(&mo, c);
	if (!isnan(o->time_limit))
		mo.time_limit = o->time_limit;
	if (o->verbose && o->match_log) {
		mo.log = o->log;
		mo.ctx = NULL;
	}
	st = hl_match_solve(c, c->set.dtmin, loads, &mo, &s->mr, err);
	free(loads);
	return st;
}

hl_status
hl_study_network(const hl_case *c, hl_study *s, hl_error *err)
{
	hl_status st;

	st = hl_network_from_matches(c, s->mr, s->cas->qh, s->cas->qc,
				     &s->feed, err);
	if (st == HL_OK)
		st = hl_network_place(&s->feed.in, &s->net, err);
	return st;
}

void
hl_study_free(hl_study *s)
{
	hl_network_free(s->net);
	hl_network_feed_free(&s->feed);
	hl_match_result_free(s->mr);
	hl_utility_lp_free(s->lp);
	hl_cascade_free(s->cas);
	memset(s, 0, sizeof *s);
}
