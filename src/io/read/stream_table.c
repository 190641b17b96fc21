/* stream_table.c - reading process streams from a CSV table. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <strings.h>

#include "plausible.h"
#include "read_warn.h"
#include "table.h"
#include "tables.h"

enum { C_NAME, C_SUPPLY, C_TARGET, C_CP, C_DUTY, C_H, C_DTC, C_KIND, C_AREA,
       C_CPTOL, C_TTOL, C_COUNT };

static const char *const columns[C_COUNT] = {
	"name", "supply", "target", "cp", "duty", "h", "dt_contrib", "kind",
	"area", "cp_tol", "t_tol"
};

static const hl_qty qty[C_COUNT] = {
	HL_QTY_NONE, HL_QTY_TEMP, HL_QTY_TEMP, HL_QTY_CP, HL_QTY_POWER,
	HL_QTY_HTC, HL_QTY_DTEMP, HL_QTY_NONE, HL_QTY_NONE, HL_QTY_NONE,
	HL_QTY_DTEMP
};

/* One row as read, before it joins a stream. */
typedef struct {
	double supply, target, cp, duty, h, dtc, cptol, ttol;
	int kind; /* -1 not given */
	int by_duty; /* cp derived from the duty */
	double latent; /* kW at one temperature (supply = target), else 0 */
} row;

static hl_status
read_numbers(hl_table *t, row *r, hl_error *err)
{
	static const int which[] = { C_SUPPLY, C_TARGET, C_CP, C_DUTY, C_H,
				     C_DTC, C_CPTOL, C_TTOL };
	double *dst[] = { &r->supply, &r->target, &r->cp, &r->duty, &r->h,
			  &r->dtc, &r->cptol, &r->ttol };
	size_t i;
	hl_status st;

	for (i = 0; i < sizeof which / sizeof which[0]; i++) {
		st = hl_table_number(t, (size_t)which[i], dst[i], err);
		if (st != HL_OK)
			return st;
		if (isnan(*dst[i]))
			continue;
		if (!isfinite(*dst[i]))
			return hl_error_set(err, HL_EINPUT, hl_table_file(t),
				hl_table_line(t), "column '%s' is out of range",
				columns[which[i]]);
	}
	return HL_OK;
}

static hl_status
parse_kind(hl_table *t, int *kind, hl_error *err)
{
	const char *k = hl_table_text(t, C_KIND);

	*kind = -1;
	if (k[0] == '\0')
		return HL_OK;
	if (strcasecmp(k, "hot") == 0)
		*kind = HL_HOT;
	else if (strcasecmp(k, "cold") == 0)
		*kind = HL_COLD;
	else
		return hl_error_set(err, HL_EINPUT, hl_table_file(t),
			hl_table_line(t), "column 'kind': '%.40s' is neither "
			"'hot' nor 'cold'", k);
	return HL_OK;
}

/* Latent heat (supply = target): a duty, no cp (it would be infinite). */
static hl_status
row_latent(const char *f, long l, const char *name, row *r, hl_error *err)
{
	if (!isnan(r->cp))
		return hl_error_set(err, HL_EINPUT, f, l, "stream '%s': supply "
			"equals target (%g °C), so cp would be infinite; give "
			"the latent heat as a duty (kW) instead of cp", name,
			r->supply);
	if (!(r->duty > 0.0))
		return hl_error_set(err, HL_EINPUT, f, l, "stream '%s': supply "
			"equals target (%g °C): give the latent heat as a duty "
			"(kW, > 0)", name, r->supply);
	r->latent = r->duty;
	r->cp = 0.0;
	r->by_duty = 1;
	return HL_OK;
}

/* cp from the row: cp, or duty over the temperature change; both must agree. */
static hl_status
row_cp(hl_table *t, const char *name, row *r, hl_error *err)
{
	double span = fabs(r->supply - r->target);
	const char *f = hl_table_file(t);
	long l = hl_table_line(t);

	r->latent = 0.0;
	if (isnan(r->supply) || isnan(r->target))
		return hl_error_set(err, HL_EINPUT, f, l, "stream '%s': supply "
			"and target temperatures are both required", name);
	if (span == 0.0)
		return row_latent(f, l, name, r, err);
	if (!isnan(r->duty) && !(r->duty > 0.0))
		return hl_error_set(err, HL_EINPUT, f, l, "stream '%s': duty "
			"must be > 0 kW", name);
	if (!isnan(r->cp) && !(r->cp > 0.0))
		return hl_error_set(err, HL_EINPUT, f, l, "stream '%s': cp "
			"must be > 0 kW/K", name);
	if (isnan(r->cp) && isnan(r->duty))
		return hl_error_set(err, HL_EINPUT, f, l, "stream '%s': give "
			"cp (kW/K) or duty (kW)", name);
	r->by_duty = isnan(r->cp);
	if (isnan(r->cp))
		r->cp = r->duty / span;
	else if (!isnan(r->duty) &&
		 fabs(r->cp * span - r->duty) > 1e-6 * r->duty)
		return hl_error_set(err, HL_EINPUT, f, l, "stream '%s': cp %g "
			"kW/K over %g K is %g kW, but duty says %g kW; give "
			"one of them or make them agree", name, r->cp, span,
			r->cp * span, r->duty);
	return HL_OK;
}

/* Values that look like another unit (plausible.h). */
static void
row_doubts(const hl_table *t, const row *r)
{
	const char *f = hl_table_file(t);
	long l = hl_table_line(t);

	hl_doubt_htc(f, l, "h", r->h);
	if (r->by_duty)
		hl_doubt_duty(f, l, "duty", r->duty);
	else
		hl_doubt_cp(f, l, "cp", r->cp, fabs(r->supply - r->target));
}

/* Every temperature at or above HL_DOUBT_KELVIN with no unit in the
 * header: kelvin written as °C? */
static void
kelvin_doubt(const hl_table *t, double coolest, double hottest)
{
	if (coolest < HL_DOUBT_KELVIN || hottest > HL_T_MAX ||
	    hl_table_unit(t, C_SUPPLY) != NULL ||
	    hl_table_unit(t, C_TARGET) != NULL)
		return;
	hl_read_warn(hl_table_file(t), t->header_line, "every supply and "
		"target temperature is %g or above (the coolest is %g): in "
		"kelvin? °C is assumed; write the unit in the header, "
		"'supply [K]' and 'target [K]'", HL_DOUBT_KELVIN, coolest);
}

static hl_status
read_row(hl_table *t, row *r, hl_error *err)
{
	hl_status st;

	if (hl_table_empty(t, C_NAME))
		return hl_error_set(err, HL_EINPUT, hl_table_file(t),
			hl_table_line(t), "stream without a name");
	st = read_numbers(t, r, err);
	if (st == HL_OK)
		st = parse_kind(t, &r->kind, err);
	if (st == HL_OK)
		st = row_cp(t, hl_table_text(t, C_NAME), r, err);
	if (st == HL_OK)
		row_doubts(t, r);
	return st;
}

/* The stream being built from consecutive rows of one name. */
typedef struct {
	hl_stream s;
	size_t cap;
	char name[HL_CSV_FIELD_MAX + 1];
	char area[HL_CSV_FIELD_MAX + 1];
	int open;
} builder;

static hl_status
builder_flush(hl_case *c, builder *b, hl_error *err)
{
	hl_status st = HL_OK;

	if (b->open)
		st = hl_case_add_stream(c, &b->s, err);
	b->open = 0;
	b->s.nseg = 0;
	return st;
}

static hl_status
builder_start(builder *b, hl_table *t, const row *r, hl_error *err)
{
	/* Fields are at most HL_CSV_FIELD_MAX long, the size of both. */
	strcpy(b->name, hl_table_text(t, C_NAME));
	strcpy(b->area, hl_table_text(t, C_AREA));
	b->s.name = b->name;
	b->s.area = b->area[0] ? b->area : NULL;
	b->s.kind = r->supply > r->target ? HL_HOT : HL_COLD;
	if (r->supply == r->target && r->kind < 0)
		return hl_error_set(err, HL_EINPUT, hl_table_file(t),
			hl_table_line(t), "stream '%s' starts with latent heat "
			"at %g °C: give its kind (hot: condensing, cold: "
			"boiling)", b->name, r->supply);
	if (r->supply == r->target)
		b->s.kind = (hl_kind)r->kind;
	if (r->kind >= 0 && r->kind != (int)b->s.kind)
		return hl_error_set(err, HL_EINPUT, hl_table_file(t),
			hl_table_line(t), "stream '%s' is marked %s but runs "
			"from %g to %g °C", b->name, r->kind == HL_HOT ? "hot" :
			"cold", r->supply, r->target);
	b->s.dt_contrib = r->dtc;
	b->s.cp_tol = r->cptol;
	b->s.t_tol = r->ttol;
	b->s.line = hl_table_line(t);
	b->open = 1;
	return HL_OK;
}

static hl_status
builder_add(builder *b, hl_table *t, const row *r, hl_error *err)
{
	hl_segment *g;

	if (b->s.nseg == b->cap) {
		size_t ncap = b->cap ? 2 * b->cap : 4;
		hl_segment *p = realloc(b->s.seg, ncap * sizeof *p);

		if (p == NULL)
			return hl_error_nomem(err);
		b->s.seg = p;
		b->cap = ncap;
	}
	g = &b->s.seg[b->s.nseg++];
	g->supply = r->supply;
	g->target = r->target;
	g->cp = r->cp;
	g->h = r->h;
	g->line = hl_table_line(t);
	g->by_duty = r->by_duty;
	g->latent = r->latent;
	g->spread = 0;
	return HL_OK;
}

/* A row continues the open stream when it has the same name; it must then
 * chain on and agree on the per-stream columns. */
static hl_status
builder_continue(builder *b, hl_table *t, const row *r, hl_error *err)
{
	const hl_segment *last = &b->s.seg[b->s.nseg - 1];
	const char *f = hl_table_file(t);
	long l = hl_table_line(t);
	int kind = r->supply > r->target ? HL_HOT : HL_COLD;

	if (r->supply == r->target)
		kind = (int)b->s.kind;
	if (r->supply != last->target)
		return hl_error_set(err, HL_EINPUT, f, l, "stream '%s' appears "
			"again but does not chain: this row starts at %g °C, "
			"the previous segment ended at %g °C; rename it or fix "
			"the temperatures", b->name, r->supply, last->target);
	if (kind != (int)b->s.kind || (r->kind >= 0 && r->kind != kind))
		return hl_error_set(err, HL_EINPUT, f, l, "stream '%s': a "
			"segment runs the other way (%g -> %g °C)", b->name,
			r->supply, r->target);
	if (!isnan(r->dtc) && !(r->dtc == b->s.dt_contrib))
		return hl_error_set(err, HL_EINPUT, f, l, "stream '%s': "
			"dt_contrib differs between segments; give it once",
			b->name);
	return builder_add(b, t, r, err);
}

static hl_status
read_rows(hl_case *c, hl_table *t, hl_error *err)
{
	builder b;
	hl_status st = HL_OK;
	int rc, rows = 0;
	double coolest = INFINITY, hottest = -INFINITY;

	memset(&b, 0, sizeof b);
	b.s.file = (char *)hl_table_file(t);
	while ((rc = hl_table_next(t, err)) > 0) {
		row r;

		rows++;
		st = read_row(t, &r, err);
		if (st != HL_OK)
			break;
		coolest = fmin(coolest, fmin(r.supply, r.target));
		hottest = fmax(hottest, fmax(r.supply, r.target));
		if (b.open && strcmp(b.name, hl_table_text(t, C_NAME)) == 0) {
			st = builder_continue(&b, t, &r, err);
		} else {
			st = builder_flush(c, &b, err);
			if (st == HL_OK)
				st = builder_start(&b, t, &r, err);
			if (st == HL_OK)
				st = builder_add(&b, t, &r, err);
		}
		if (st != HL_OK)
			break;
	}
	if (rc < 0)
		st = err ? err->status : HL_EINPUT;
	if (st == HL_OK && rows == 0)
		st = hl_error_set(err, HL_EINPUT, hl_table_file(t),
			t->header_line, "the stream table has a header but no "
			"streams");
	if (st == HL_OK)
		st = builder_flush(c, &b, err);
	if (st == HL_OK)
		kelvin_doubt(t, coolest, hottest);
	free(b.s.seg);
	return st;
}

static hl_status
read_table(hl_case *c, hl_table *t, hl_error *err)
{
	static const int required[] = { C_NAME, C_SUPPLY, C_TARGET };
	hl_status st = HL_OK;
	size_t i;

	for (i = 0; i < 3 && st == HL_OK; i++)
		st = hl_table_require(t, (size_t)required[i], err);
	if (st == HL_OK && !hl_table_has(t, C_CP) && !hl_table_has(t, C_DUTY))
		st = hl_error_set(err, HL_EINPUT, hl_table_file(t),
			t->header_line, "missing column 'cp' (kW/K) or 'duty' "
			"(kW) in the stream table header");
	if (st == HL_OK)
		st = read_rows(c, t, err);
	hl_table_close(t);
	return st;
}

hl_status
hl_stream_table_read(hl_case *c, const char *path, hl_error *err)
{
	hl_table t;
	hl_status st;

	st = hl_table_open(&t, path, "stream table", columns, qty, C_COUNT,
			   err);
	if (st != HL_OK)
		return st;
	return read_table(c, &t, err);
}

hl_status
hl_stream_table_read_mem(hl_case *c, const char *name, const char *data,
			 size_t len, hl_error *err)
{
	hl_table t;
	hl_status st;

	st = hl_table_open_mem(&t, name, data, len, "stream table", columns,
			       qty, C_COUNT, err);
	if (st != HL_OK)
		return st;
	return read_table(c, &t, err);
}
