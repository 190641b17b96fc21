/* case.c - building, checking and freeing a case. */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "case.h"

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
	set->interest = 0.10;
	set->life = 10.0;
	set->cp_tol = 0.05;
	set->t_tol = 1.0;
	set->time_limit = 10.0;
	set->exchanger = HL_EXCH_SHELL_TUBE;
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
	free(c->stream);
	free(c->util);
	free(c->rule);
	free(c->unit);
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
		q += s->seg[i].cp * fabs(s->seg[i].supply - s->seg[i].target);
	return q;
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

	if (d * (t - s->seg[0].supply) <= 0.0)
		return s->seg[0].cp * d * (t - s->seg[0].supply);
	for (i = 0; i < s->nseg; i++) {
		const hl_segment *g = &s->seg[i];

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
		double span = g->cp * fabs(g->target - g->supply);

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
		return hl_error_set(err, HL_EINPUT, f, g->line,
			"stream '%s': supply equals target (%g °C); a process "
			"stream must change temperature", s->name, g->supply);
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
	if (!isfinite(u->price) || u->price < 0.0)
		return hl_error_set(err, HL_EINPUT, u->file, u->line,
			"utility '%s': price must be a number >= 0 (per MWh)",
			u->name);
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
	return HL_OK;
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
	return HL_OK;
}

const char *
hl_exchanger_type_name(hl_exchanger_type t)
{
	return t == HL_EXCH_COUNTERFLOW ? "counterflow" : "shell-and-tube";
}
