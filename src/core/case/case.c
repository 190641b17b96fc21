/* case.c - building, checking and freeing a case. */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "case.h"

static const char *const type_names[HL_EXCH_NTYPES] = {
	"shell-and-tube", "counterflow", "plate", "double-pipe", "air-cooler",
	"fired-heater"
};

const char *
hl_exchanger_type_name(hl_exchanger_type t)
{
	return (int)t >= 0 && t < HL_EXCH_NTYPES ? type_names[t] : "unknown";
}

int
hl_exchanger_type_parse(const char *s)
{
	int i;

	for (i = 0; s != NULL && i < HL_EXCH_NTYPES; i++)
		if (strcmp(s, type_names[i]) == 0)
			return i;
	return -1;
}

/* Illustrative cost laws and size limits per type, invented to be of the
 * order of published ones (doc/methods.md, "Exchanger types"); a case sets
 * its own. Shell-and-tube and counterflow take the process law cost_a,
 * cost_b, cost_c. Largest shells and hairpins: common practice, no
 * source. */
void
hl_settings_default_laws(hl_settings *set)
{
	static const hl_exchanger_law def[HL_EXCH_NTYPES] = {
		/* a, b, c, largest, smallest */
		[HL_EXCH_SHELL_TUBE] = { NAN, NAN, NAN, 1000.0, 0.5, 0 },
		[HL_EXCH_COUNTERFLOW] = { NAN, NAN, NAN, HUGE_VAL, 0.05, 0 },
		[HL_EXCH_PLATE] = { 5000.0, 500.0, 0.85, 1500.0, 0.5, 0 },
		[HL_EXCH_DOUBLE_PIPE] = { 1500.0, 1200.0, 0.9, 50.0, 0.1, 0 },
		[HL_EXCH_AIR_COOLER] = { 30000.0, 1500.0, 0.8, 1500.0, 5.0,
					 0 },
		[HL_EXCH_FIRED_HEATER] = { 80000.0, 110000.0, 0.8, 60.0, 0.1,
					   0 },
	};
	int i;

	for (i = 0; i < HL_EXCH_NTYPES; i++)
		set->law[i] = def[i];
}

void
hl_settings_default(hl_settings *set)
{
	set->dtmin = 10.0;
	set->emat = NAN;
	set->hours = 8000.0;
	set->h_default = 0.5;
	set->fmin = 0.80;
	set->xp = 0.9;
	/* Illustrative shell-and-tube cost law (currency, m²): users set their own. */
	set->cost_a = 10000.0;
	set->cost_b = 800.0;
	set->cost_c = 0.8;
	set->repipe_cost = NAN;
	set->unit_cost = NAN;
	set->interest = 0.10;
	set->life = 10.0;
	set->cp_tol = 0.05;
	set->t_tol = 1.0;
	set->time_limit = 10.0;
	set->exchanger = HL_EXCH_SHELL_TUBE;
	set->kind_type[HL_HOT] = set->kind_type[HL_COLD] = -1;
	hl_settings_default_laws(set);
	set->area_policy = HL_AREAS_ALLOW;
	set->area_penalty = 1.0;
	set->currency = NULL;
}

hl_case *
hl_case_create(void)
{
	hl_case *c = calloc(1, sizeof *c);

	if (c == NULL)
		return NULL;
	hl_settings_default(&c->set);
	c->set.currency = strdup("EUR");
	if (c->set.currency == NULL) {
		free(c);
		return NULL;
	}
	return c;
}

static void
stream_clear(hl_stream *s)
{
	free(s->name);
	free(s->seg);
	free(s->area);
	free(s->file);
}

static void
utility_clear(hl_utility *u)
{
	free(u->name);
	free(u->file);
}

static void
rule_clear(hl_match_rule *r)
{
	free(r->hot);
	free(r->cold);
	free(r->reason);
	free(r->file);
}

static void
type_rule_clear(hl_type_rule *r)
{
	free(r->hot);
	free(r->cold);
	free(r->file);
}

static void
unit_clear(hl_unit *u)
{
	free(u->name);
	free(u->hot);
	free(u->cold);
	free(u->file);
}

void
hl_case_free(hl_case *c)
{
	size_t i;

	if (c == NULL)
		return;
	for (i = 0; i < c->nstream; i++)
		stream_clear(&c->stream[i]);
	for (i = 0; i < c->nutil; i++)
		utility_clear(&c->util[i]);
	for (i = 0; i < c->nrule; i++)
		rule_clear(&c->rule[i]);
	for (i = 0; i < c->nunit; i++)
		unit_clear(&c->unit[i]);
	for (i = 0; i < c->ntyped; i++)
		type_rule_clear(&c->typed[i]);
	free(c->typed);
	free(c->stream);
	free(c->util);
	free(c->rule);
	free(c->unit);
	for (i = 0; i < c->nnosplit; i++)
		free(c->nosplit[i]);
	free(c->nosplit);
	free(c->nosplit_line);
	free(c->source);
	free(c->set.currency);
	free(c);
}

/* strdup that keeps NULL as NULL and reports failure through *ok. */
static char *
dup_or_null(const char *s, int *ok)
{
	char *d;

	if (s == NULL)
		return NULL;
	d = strdup(s);
	if (d == NULL)
		*ok = 0;
	return d;
}

/* Grow an array of elem-sized items to hold at least one more. */
static int
grow(void **arr, size_t *cap, size_t n, size_t elem)
{
	size_t ncap;
	void *p;

	if (n < *cap)
		return 1;
	ncap = *cap ? *cap * 2 : 16;
	p = realloc(*arr, ncap * elem);
	if (p == NULL)
		return 0;
	*arr = p;
	*cap = ncap;
	return 1;
}

hl_status
hl_case_add_stream(hl_case *c, const hl_stream *s, hl_error *err)
{
	hl_stream *d;
	int ok = 1;

	if (!grow((void **)&c->stream, &c->stream_cap, c->nstream, sizeof *d))
		return hl_error_nomem(err);
	d = &c->stream[c->nstream];
	*d = *s;
	d->name = dup_or_null(s->name, &ok);
	d->area = dup_or_null(s->area, &ok);
	d->file = dup_or_null(s->file, &ok);
	d->seg = malloc((s->nseg ? s->nseg : 1) * sizeof *d->seg);
	if (d->seg == NULL)
		ok = 0;
	else
		memcpy(d->seg, s->seg, s->nseg * sizeof *d->seg);
	if (!ok) {
		stream_clear(d);
		return hl_error_nomem(err);
	}
	c->nstream++;
	return HL_OK;
}

hl_status
hl_case_add_utility(hl_case *c, const hl_utility *u, hl_error *err)
{
	hl_utility *d;
	int ok = 1;

	if (!grow((void **)&c->util, &c->util_cap, c->nutil, sizeof *d))
		return hl_error_nomem(err);
	d = &c->util[c->nutil];
	*d = *u;
	d->name = dup_or_null(u->name, &ok);
	d->file = dup_or_null(u->file, &ok);
	if (!ok) {
		utility_clear(d);
		return hl_error_nomem(err);
	}
	c->nutil++;
	return HL_OK;
}

hl_status
hl_case_add_rule(hl_case *c, const hl_match_rule *r, hl_error *err)
{
	hl_match_rule *d;
	int ok = 1;

	if (!grow((void **)&c->rule, &c->rule_cap, c->nrule, sizeof *d))
		return hl_error_nomem(err);
	d = &c->rule[c->nrule];
	*d = *r;
	d->hot = dup_or_null(r->hot, &ok);
	d->cold = dup_or_null(r->cold, &ok);
	d->reason = dup_or_null(r->reason, &ok);
	d->file = dup_or_null(r->file, &ok);
	if (!ok) {
		rule_clear(d);
		return hl_error_nomem(err);
	}
	c->nrule++;
	return HL_OK;
}

hl_status
hl_case_add_type_rule(hl_case *c, const hl_type_rule *r, hl_error *err)
{
	hl_type_rule *d;
	int ok = 1;

	if (!grow((void **)&c->typed, &c->typed_cap, c->ntyped, sizeof *d))
		return hl_error_nomem(err);
	d = &c->typed[c->ntyped];
	*d = *r;
	d->hot = dup_or_null(r->hot, &ok);
	d->cold = dup_or_null(r->cold, &ok);
	d->file = dup_or_null(r->file, &ok);
	if (!ok) {
		type_rule_clear(d);
		return hl_error_nomem(err);
	}
	c->ntyped++;
	return HL_OK;
}

static int
names(const char *pattern, const char *name)
{
	return strcmp(pattern, "*") == 0 || strcmp(pattern, name) == 0;
}

int
hl_utility_type(const hl_settings *set, const hl_utility *u)
{
	if (u->type_given)
		return u->type;
	return set->kind_type[u->kind];
}

hl_exchanger_type
hl_case_pair_type(const hl_case *c, const char *hot, const char *cold)
{
	size_t i;
	long u;
	int pass;

	/* Pass 0: rules naming both sides; pass 1: rules with a "*". */
	for (pass = 0; pass < 2; pass++)
		for (i = 0; i < c->ntyped; i++) {
			const hl_type_rule *r = &c->typed[i];
			int wild = strcmp(r->hot, "*") == 0 ||
				   strcmp(r->cold, "*") == 0;

			if (wild == pass && names(r->hot, hot) &&
			    names(r->cold, cold))
				return r->type;
		}
	u = hl_case_find_utility(c, hot);
	if (u < 0)
		u = hl_case_find_utility(c, cold);
	if (u >= 0 && hl_utility_type(&c->set, &c->util[u]) >= 0)
		return (hl_exchanger_type)hl_utility_type(&c->set,
		    &c->util[u]);
	return c->set.exchanger;
}

hl_status
hl_case_add_unit(hl_case *c, const hl_unit *u, hl_error *err)
{
	hl_unit *d;
	int ok = 1;

	if (!grow((void **)&c->unit, &c->unit_cap, c->nunit, sizeof *d))
		return hl_error_nomem(err);
	d = &c->unit[c->nunit];
	*d = *u;
	d->name = dup_or_null(u->name, &ok);
	d->hot = dup_or_null(u->hot, &ok);
	d->cold = dup_or_null(u->cold, &ok);
	d->file = dup_or_null(u->file, &ok);
	if (!ok) {
		unit_clear(d);
		return hl_error_nomem(err);
	}
	c->nunit++;
	return HL_OK;
}

double
hl_stream_supply(const hl_stream *s)
{
	return s->seg[0].supply;
}

double
hl_stream_target(const hl_stream *s)
{
	return s->seg[s->nseg - 1].target;
}

double
hl_stream_duty(const hl_stream *s)
{
	double q = 0.0;
	size_t i;

	for (i = 0; i < s->nseg; i++)
		q += hl_segment_duty(&s->seg[i]);
	return q;
}

double
hl_segment_duty(const hl_segment *g)
{
	return g->latent > 0.0 ? g->latent : g->cp * fabs(g->supply -
							   g->target);
}

int
hl_segment_latent(const hl_segment *g)
{
	return g->latent > 0.0;
}

int
hl_case_has_latent(const hl_case *c)
{
	size_t i, j;

	for (i = 0; i < c->nstream; i++)
		for (j = 0; j < c->stream[i].nseg; j++)
			if (hl_segment_latent(&c->stream[i].seg[j]))
				return 1;
	return 0;
}

/* Direction of a stream's temperature from its supply end: +1 warms. */
static double
stream_dir(const hl_stream *s)
{
	return s->kind == HL_HOT ? -1.0 : 1.0;
}

double
hl_stream_heat_at(const hl_stream *s, double t)
{
	double d = stream_dir(s), q = 0.0;
	size_t i;

	/* A latent segment is a step: at its temperature the heat counts
	 * from the segment's start (the stream's heat before it). */
	if (d * (t - s->seg[0].supply) <= 0.0)
		return s->seg[0].cp * d * (t - s->seg[0].supply);
	for (i = 0; i < s->nseg; i++) {
		const hl_segment *g = &s->seg[i];

		if (hl_segment_latent(g)) {
			q += g->latent;
			continue;
		}
		if (d * (t - g->target) <= 0.0 || i + 1 == s->nseg)
			return q + g->cp * d * (t - g->supply);
		q += g->cp * d * (g->target - g->supply);
	}
	return q;
}

double
hl_stream_temp_at(const hl_stream *s, double q)
{
	double d = stream_dir(s), at = 0.0;
	size_t i;

	for (i = 0; i < s->nseg; i++) {
		const hl_segment *g = &s->seg[i];
		double span = hl_segment_duty(g);

		if (hl_segment_latent(g) && (q <= at + span ||
					    i + 1 == s->nseg))
			return g->supply;
		if (q <= at + span || i + 1 == s->nseg)
			return g->supply + d * (q - at) / g->cp;
		at += span;
	}
	return hl_stream_target(s);
}

void
hl_case_clear_units(hl_case *c)
{
	size_t i;

	for (i = 0; i < c->nunit; i++)
		unit_clear(&c->unit[i]);
	c->nunit = 0;
}

double
hl_stream_shift(const hl_stream *s, double dtmin)
{
	return isnan(s->dt_contrib) ? dtmin / 2.0 : s->dt_contrib;
}

double
hl_utility_shift(const hl_utility *u, double dtmin)
{
	return isnan(u->dt_contrib) ? dtmin / 2.0 : u->dt_contrib;
}

long
hl_case_find_stream(const hl_case *c, const char *name)
{
	size_t i;

	for (i = 0; i < c->nstream; i++)
		if (strcmp(c->stream[i].name, name) == 0)
			return (long)i;
	return -1;
}

long
hl_case_find_utility(const hl_case *c, const char *name)
{
	size_t i;

	for (i = 0; i < c->nutil; i++)
		if (strcmp(c->util[i].name, name) == 0)
			return (long)i;
	return -1;
}

static int
temp_ok(double t)
{
	return isfinite(t) && t >= HL_T_MIN && t <= HL_T_MAX;
}

/* Latent heat at one temperature: a duty, no cp (it would be infinite). */
static hl_status
validate_latent(const hl_stream *s, const hl_segment *g, hl_error *err)
{
	if (!isfinite(g->latent) || g->latent <= 0.0)
		return hl_error_set(err, HL_EINPUT, s->file, g->line,
			"stream '%s': supply equals target (%g °C): give the "
			"latent heat as a duty (kW) and the kind (hot: "
			"condensing, cold: boiling)", s->name, g->supply);
	if (g->latent > HL_CP_MAX * HL_T_MAX)
		return hl_error_set(err, HL_EINPUT, s->file, g->line,
			"stream '%s': duty %g kW is beyond any process stream; "
			"duty is in kW", s->name, g->latent);
	if (!isnan(g->h) && (!isfinite(g->h) || g->h <= 0.0 || g->h > HL_H_MAX))
		return hl_error_set(err, HL_EINPUT, s->file, g->line,
			"stream '%s': h must be > 0 and at most %g kW/(m²·K)",
			s->name, HL_H_MAX);
	return HL_OK;
}

static hl_status
validate_segment(const hl_stream *s, const hl_segment *g, hl_error *err)
{
	const char *f = s->file;

	if (!temp_ok(g->supply) || !temp_ok(g->target))
		return hl_error_set(err, HL_EINPUT, f, g->line,
			"stream '%s': temperature %g °C is outside %.2f..%.0f "
			"°C; temperatures are in °C (not K or °F)", s->name,
			temp_ok(g->supply) ? g->target : g->supply, HL_T_MIN,
			HL_T_MAX);
	if (g->supply == g->target)
		return validate_latent(s, g, err);
	if ((s->kind == HL_HOT) != (g->supply > g->target))
		return hl_error_set(err, HL_EINPUT, f, g->line,
			"stream '%s': segment runs %g -> %g °C but the stream "
			"is %s", s->name, g->supply, g->target,
			s->kind == HL_HOT ? "hot" : "cold");
	if (!isfinite(g->cp) || g->cp <= 0.0)
		return hl_error_set(err, HL_EINPUT, f, g->line,
			"stream '%s': cp must be > 0 kW/K", s->name);
	if (g->cp > HL_CP_MAX)
		return hl_error_set(err, HL_EINPUT, f, g->line,
			"stream '%s': cp %g kW/K is above %g kW/K; cp is in "
			"kW/K (was it given in W/K?)", s->name, g->cp,
			HL_CP_MAX);
	if (!isnan(g->h) && (!isfinite(g->h) || g->h <= 0.0 || g->h > HL_H_MAX))
		return hl_error_set(err, HL_EINPUT, f, g->line,
			"stream '%s': h must be > 0 and at most %g kW/(m²·K)",
			s->name, HL_H_MAX);
	return HL_OK;
}

static hl_status
validate_stream(const hl_stream *s, double dtmin, hl_error *err)
{
	size_t i;
	hl_status st;

	if (s->nseg == 0)
		return hl_error_set(err, HL_EINPUT, s->file, s->line,
			"stream '%s' has no temperatures", s->name);
	for (i = 0; i < s->nseg; i++) {
		st = validate_segment(s, &s->seg[i], err);
		if (st != HL_OK)
			return st;
		if (i > 0 && s->seg[i].supply != s->seg[i - 1].target)
			return hl_error_set(err, HL_EINPUT, s->file,
				s->seg[i].line, "stream '%s': segment starts at "
				"%g °C but the previous one ended at %g °C",
				s->name, s->seg[i].supply, s->seg[i - 1].target);
	}
	if (!isnan(s->dt_contrib) && (!isfinite(s->dt_contrib) ||
	    s->dt_contrib < 0.0 || s->dt_contrib > 500.0))
		return hl_error_set(err, HL_EINPUT, s->file, s->line,
			"stream '%s': dt_contrib must be between 0 and 500 K",
			s->name);
	/* Tolerances feed the sensitivity bands; 1 or more would let a cp
	 * vanish, and a fraction given in per cent is a common slip. */
	if (!isnan(s->cp_tol) && !(s->cp_tol >= 0.0 && s->cp_tol < 1.0))
		return hl_error_set(err, HL_EINPUT, s->file, s->line,
			"stream '%s': cp_tol %g is a fraction and must lie in "
			"[0, 1) (0.05 means ±5 %%)", s->name, s->cp_tol);
	if (!isnan(s->t_tol) && !(s->t_tol >= 0.0 && s->t_tol <= 100.0))
		return hl_error_set(err, HL_EINPUT, s->file, s->line,
			"stream '%s': t_tol must lie between 0 and 100 K",
			s->name);
	(void)dtmin;
	return HL_OK;
}

static hl_status
validate_utility(const hl_utility *u, hl_error *err)
{
	if (!temp_ok(u->supply) || !temp_ok(u->target))
		return hl_error_set(err, HL_EINPUT, u->file, u->line,
			"utility '%s': temperature %g °C is outside %.2f..%.0f "
			"°C; temperatures are in °C (not K or °F)", u->name,
			temp_ok(u->supply) ? u->target : u->supply, HL_T_MIN,
			HL_T_MAX);
	if (u->kind == HL_HOT && u->target > u->supply)
		return hl_error_set(err, HL_EINPUT, u->file, u->line,
			"hot utility '%s' warms from %g to %g °C; a hot utility "
			"cools down (or condenses at one temperature)",
			u->name, u->supply, u->target);
	if (u->kind == HL_COLD && u->target < u->supply)
		return hl_error_set(err, HL_EINPUT, u->file, u->line,
			"cold utility '%s' cools from %g to %g °C; a cold "
			"utility warms up (or boils at one temperature)",
			u->name, u->supply, u->target);
	if (!isfinite(u->price))
		return hl_error_set(err, HL_EINPUT, u->file, u->line,
			"utility '%s': price must be a number (per MWh; "
			"negative for a credit)", u->name);
	if (!isnan(u->max_load) && (!isfinite(u->max_load) || u->max_load < 0.0))
		return hl_error_set(err, HL_EINPUT, u->file, u->line,
			"utility '%s': maximum load must be >= 0 kW", u->name);
	if (!isnan(u->h) && (!isfinite(u->h) || u->h <= 0.0 || u->h > HL_H_MAX))
		return hl_error_set(err, HL_EINPUT, u->file, u->line,
			"utility '%s': h must be > 0 and at most %g kW/(m²·K)",
			u->name, HL_H_MAX);
	if (!isnan(u->dt_contrib) && (!isfinite(u->dt_contrib) ||
	    u->dt_contrib < 0.0 || u->dt_contrib > 500.0))
		return hl_error_set(err, HL_EINPUT, u->file, u->line,
			"utility '%s': dt_contrib must be between 0 and 500 K",
			u->name);
	if (u->type_given && (u->type == HL_EXCH_FIRED_HEATER) !=
	    (u->kind == HL_HOT) && (u->type == HL_EXCH_FIRED_HEATER ||
	    u->type == HL_EXCH_AIR_COOLER))
		return hl_error_set(err, HL_EINPUT, u->file, u->line,
			"utility '%s': a %s utility cannot have type %s; a "
			"fired heater heats the process, an air cooler cools it",
			u->name, u->kind == HL_HOT ? "hot" : "cold",
			hl_exchanger_type_name((hl_exchanger_type)u->type));
	if (u->cost_given && !(u->cost_a >= 0.0 && u->cost_b >= 0.0 &&
	    u->cost_c > 0.0 && isfinite(u->cost_a) && isfinite(u->cost_b) &&
	    isfinite(u->cost_c)))
		return hl_error_set(err, HL_EINPUT, u->file, u->line,
			"utility '%s': cost law a + b·X^c needs a >= 0, "
			"b >= 0 and c > 0", u->name);
	return HL_OK;
}

/* Each type's law: a, b >= 0, c > 0 (or a NaN a: the process law), and
 * 0 <= smallest < largest. */
static hl_status
validate_laws(const hl_case *c, hl_error *err)
{
	int i;

	for (i = 0; i < HL_EXCH_NTYPES; i++) {
		const hl_exchanger_law *l = &c->set.law[i];
		const char *name = hl_exchanger_type_name((hl_exchanger_type)i);

		if (!isnan(l->a) && !(l->a >= 0.0 && l->b >= 0.0 &&
		    l->c > 0.0 && isfinite(l->a) && isfinite(l->b) &&
		    isfinite(l->c)))
			return hl_error_set(err, HL_EINPUT, c->source, 0,
				"%s cost law a + b·X^c needs a >= 0, b >= 0 "
				"and c > 0", name);
		if (!(l->smallest >= 0.0 && l->largest > l->smallest))
			return hl_error_set(err, HL_EINPUT, c->source, 0,
				"%s: the largest shell must be above the "
				"smallest (and the smallest >= 0)", name);
	}
	return HL_OK;
}

/* A type rule names streams or utilities of the right side, and a fired
 * heater (air cooler) only a hot (cold) utility. */
static hl_status
validate_type_rule(const hl_case *c, const hl_type_rule *r, hl_error *err)
{
	const char *side[2] = { r->hot, r->cold };
	int k;

	for (k = 0; k < 2; k++) {
		long s = hl_case_find_stream(c, side[k]);
		long u = hl_case_find_utility(c, side[k]);
		hl_kind kind = s >= 0 ? c->stream[s].kind :
			       u >= 0 ? c->util[u].kind : (hl_kind)k;

		if (strcmp(side[k], "*") != 0 && (s < 0 && u < 0))
			return hl_error_set(err, HL_EINPUT, r->file, r->line,
				"exchanger type rule: '%s' is no stream or "
				"utility of the case", side[k]);
		if ((int)kind != k)
			return hl_error_set(err, HL_EINPUT, r->file, r->line,
				"exchanger type rule: '%s' is not a %s stream "
				"or utility", side[k], k ? "cold" : "hot");
	}
	if ((r->type == HL_EXCH_FIRED_HEATER &&
	     hl_case_find_utility(c, r->hot) < 0) ||
	    (r->type == HL_EXCH_AIR_COOLER &&
	     hl_case_find_utility(c, r->cold) < 0))
		return hl_error_set(err, HL_EINPUT, r->file, r->line,
			"exchanger type rule: a %s needs a %s utility on its "
			"%s side", hl_exchanger_type_name(r->type),
			r->type == HL_EXCH_FIRED_HEATER ? "hot" : "cold",
			r->type == HL_EXCH_FIRED_HEATER ? "hot" : "cold");
	return HL_OK;
}

static hl_status
validate_settings(const hl_case *c, hl_error *err)
{
	const hl_settings *s = &c->set;

	if (!isfinite(s->dtmin) || s->dtmin < 0.0 || s->dtmin > 500.0)
		return hl_error_set(err, HL_EINPUT, c->source, 0,
			"dtmin must be between 0 and 500 K");
	if (!isnan(s->emat) && (!isfinite(s->emat) || s->emat < 0.0 ||
	    s->emat > s->dtmin))
		return hl_error_set(err, HL_EINPUT, c->source, 0,
			"emat must be between 0 K and dtmin");
	if (!(s->hours > 0.0 && s->hours <= 8784.0))
		return hl_error_set(err, HL_EINPUT, c->source, 0,
			"operating hours must be between 0 and 8784 per year");
	if (!(s->cp_tol >= 0.0 && s->cp_tol < 1.0) ||
	    !(s->t_tol >= 0.0 && s->t_tol <= 100.0))
		return hl_error_set(err, HL_EINPUT, c->source, 0,
			"the default cp_tol must lie in [0, 1) and t_tol "
			"between 0 and 100 K");
	if (!(s->fmin > 0.0 && s->fmin < 1.0) || !(s->xp > 0.0 && s->xp < 1.0))
		return hl_error_set(err, HL_EINPUT, c->source, 0,
			"fmin and xp must lie strictly between 0 and 1");
	if (s->exchanger == HL_EXCH_FIRED_HEATER ||
	    s->exchanger == HL_EXCH_AIR_COOLER)
		return hl_error_set(err, HL_EINPUT, c->source, 0,
			"exchanger=\"%s\" would make process-to-process units "
			"%ss; give it to the utility (type) or as heater-type "
			"or cooler-type", hl_exchanger_type_name(s->exchanger),
			s->exchanger == HL_EXCH_FIRED_HEATER ? "fired heater" :
			"air cooler");
	if (s->kind_type[HL_HOT] == HL_EXCH_AIR_COOLER ||
	    s->kind_type[HL_COLD] == HL_EXCH_FIRED_HEATER)
		return hl_error_set(err, HL_EINPUT, c->source, 0,
			"heater-type cannot be air-cooler nor cooler-type "
			"fired-heater");
	return validate_laws(c, err);
}

static int
cmp_name_ptr(const void *a, const void *b)
{
	return strcmp(**(char *const *const *)a, **(char *const *const *)b);
}

/* Duplicate stream names by sorting pointers to them: O(n log n), since a
 * site-wide table can hold 10^6 streams. */
static hl_status
check_unique_streams(const hl_case *c, hl_error *err)
{
	char **names;
	char ***ptr;
	size_t i;
	hl_status st = HL_OK;

	names = malloc(c->nstream * sizeof *names);
	ptr = malloc(c->nstream * sizeof *ptr);
	if (names == NULL || ptr == NULL) {
		free(names);
		free(ptr);
		return hl_error_nomem(err);
	}
	for (i = 0; i < c->nstream; i++) {
		names[i] = c->stream[i].name;
		ptr[i] = &names[i];
	}
	qsort(ptr, c->nstream, sizeof *ptr, cmp_name_ptr);
	for (i = 1; i < c->nstream; i++) {
		if (strcmp(*ptr[i], *ptr[i - 1]) == 0) {
			size_t a = (size_t)(ptr[i - 1] - names);
			size_t b = (size_t)(ptr[i] - names);
			const hl_stream *s = &c->stream[a > b ? a : b];

			st = hl_error_set(err, HL_EINPUT, s->file, s->line,
				"stream '%s' appears twice; give each stream "
				"a unique name", s->name);
			break;
		}
	}
	free(names);
	free(ptr);
	return st;
}

hl_status
hl_case_validate(const hl_case *c, hl_error *err)
{
	size_t i, j;
	hl_status st;

	st = validate_settings(c, err);
	if (st != HL_OK)
		return st;
	if (c->nstream == 0)
		return hl_error_set(err, HL_EINPUT, c->source, 0,
			"no process streams: give at least one hot or cold stream");
	for (i = 0; i < c->nstream; i++) {
		st = validate_stream(&c->stream[i], c->set.dtmin, err);
		if (st != HL_OK)
			return st;
	}
	st = check_unique_streams(c, err);
	if (st != HL_OK)
		return st;
	for (i = 0; i < c->nutil; i++) {
		st = validate_utility(&c->util[i], err);
		if (st != HL_OK)
			return st;
		if (hl_case_find_stream(c, c->util[i].name) >= 0)
			return hl_error_set(err, HL_EINPUT, c->util[i].file,
				c->util[i].line, "utility '%s' has the name of a "
				"process stream; names must be unique",
				c->util[i].name);
		for (j = 0; j < i; j++)
			if (strcmp(c->util[j].name, c->util[i].name) == 0)
				return hl_error_set(err, HL_EINPUT,
					c->util[i].file, c->util[i].line,
					"utility '%s' appears twice",
					c->util[i].name);
	}
	for (i = 0; i < c->ntyped; i++) {
		st = validate_type_rule(c, &c->typed[i], err);
		if (st != HL_OK)
			return st;
	}
	for (i = 0; i < c->nunit; i++) {
		const hl_unit *u = &c->unit[i];

		if (u->type_given && ((u->type == HL_EXCH_FIRED_HEATER &&
		    hl_case_find_utility(c, u->hot) < 0) ||
		    (u->type == HL_EXCH_AIR_COOLER &&
		    hl_case_find_utility(c, u->cold) < 0)))
			return hl_error_set(err, HL_EINPUT, u->file, u->line,
				"unit '%s': a %s needs a %s utility on its %s "
				"side", u->name, hl_exchanger_type_name(
				(hl_exchanger_type)u->type), u->type ==
				HL_EXCH_FIRED_HEATER ? "hot" : "cold",
				u->type == HL_EXCH_FIRED_HEATER ? "hot" :
				"cold");
	}
	return HL_OK;
}

