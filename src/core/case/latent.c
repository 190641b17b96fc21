/* latent.c - a case with its latent heat spread over a tiny span, for the
 * stages that work along temperatures (see hl_case_spread_latent). The
 * targets, the cascade and the curves take latent heat exactly, as a step
 * at one temperature; placement, sizing and the audit follow a stream's
 * temperature as its heat changes, which a step cannot give, so they see
 * the step as a very steep segment (common practice, no source: a phase
 * change entered as a small temperature change). */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "case.h"

static int
copy_nosplit(hl_case *d, const hl_case *c)
{
	size_t i;

	if (c->nnosplit == 0)
		return 1;
	d->nosplit = calloc(c->nnosplit, sizeof *d->nosplit);
	d->nosplit_line = calloc(c->nnosplit, sizeof *d->nosplit_line);
	if (d->nosplit == NULL || d->nosplit_line == NULL)
		return 0;
	for (i = 0; i < c->nnosplit; i++, d->nnosplit++) {
		if ((d->nosplit[i] = strdup(c->nosplit[i])) == NULL)
			return 0;
		d->nosplit_line[i] = c->nosplit_line[i];
	}
	return 1;
}

/* Everything but the streams and settings, copied deeply. */
static int
copy_rest(hl_case *d, const hl_case *c)
{
	size_t i;
	hl_error err;

	for (i = 0; i < c->nutil; i++)
		if (hl_case_add_utility(d, &c->util[i], &err) != HL_OK)
			return 0;
	for (i = 0; i < c->nrule; i++)
		if (hl_case_add_rule(d, &c->rule[i], &err) != HL_OK)
			return 0;
	for (i = 0; i < c->nunit; i++)
		if (hl_case_add_unit(d, &c->unit[i], &err) != HL_OK)
			return 0;
	for (i = 0; i < c->ntyped; i++)
		if (hl_case_add_type_rule(d, &c->typed[i], &err) != HL_OK)
			return 0;
	return copy_nosplit(d, c);
}

static int
copy_settings(hl_case *d, const hl_case *c)
{
	char *cur = c->set.currency ? strdup(c->set.currency) : NULL;

	if (c->set.currency != NULL && cur == NULL)
		return 0;
	free(d->set.currency);
	d->set = c->set;
	d->set.currency = cur;
	if (c->source != NULL && (d->source = strdup(c->source)) == NULL)
		return 0;
	return 1;
}

/* A latent segment at T becomes a segment from T ± span (towards the
 * stream's supply end: hotter for a condensing stream, colder for a boiling
 * one) to T with cp = latent / span. The segment before it gives up that
 * span and keeps its heat. Heat on the target side of T stays where it was,
 * so a pinch at a latent temperature (a common place for one) is kept
 * exactly; only within span of T is the heat a little early. */
static void
spread(hl_stream *s, double span)
{
	double d = s->kind == HL_HOT ? 1.0 : -1.0;
	size_t j;

	for (j = 0; j < s->nseg; j++) {
		hl_segment *g = &s->seg[j], *p = j > 0 ? &s->seg[j - 1] : NULL;
		double t = g->supply;

		if (!hl_segment_latent(g))
			continue;
		if (p != NULL && !p->spread &&
		    fabs(p->supply - p->target) > 2.0 * span) {
			double q = hl_segment_duty(p);

			p->target = t + d * span;
			p->cp = q / fabs(p->supply - p->target);
		} else if (p != NULL) {
			continue;  /* too short to give up the span: left as
				      it was (its heat already at T) */
		}
		g->supply = t + d * span;
		g->cp = g->latent / span;
		g->latent = 0.0;
		g->spread = 1;
	}
}

hl_case *
hl_case_spread_latent(const hl_case *c, double span)
{
	hl_case *d = hl_case_create();
	hl_segment *seg = NULL;
	size_t i;
	int ok = d != NULL && copy_settings(d, c);

	for (i = 0; ok && i < c->nstream; i++) {
		hl_stream s = c->stream[i];
		hl_error err;

		seg = malloc(s.nseg * sizeof *seg);
		ok = seg != NULL;
		if (!ok)
			break;
		memcpy(seg, s.seg, s.nseg * sizeof *seg);
		s.seg = seg;
		spread(&s, span);
		ok = hl_case_add_stream(d, &s, &err) == HL_OK;
		free(seg);
		seg = NULL;
	}
	if (ok)
		ok = copy_rest(d, c);
	if (!ok) {
		hl_case_free(d);
		return NULL;
	}
	return d;
}
