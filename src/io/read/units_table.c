/* units_table.c - reading and checking the exchanger list (units_table.h).
 *
 * Every check names the unit and its line. Temperature feasibility is the
 * exchanger module's own test (hl_exchanger_pr), so the reader and the
 * sizing can never disagree about what a counterflow unit could do.
 */
#include <ctype.h>
#include <math.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <strings.h>

#include "case.h"
#include "exchanger.h"
#include "plausible.h"
#include "table.h"
#include "units_table.h"

enum { C_NAME, C_HOT_IN, C_HOT_OUT, C_COLD_IN, C_COLD_OUT, C_DUTY, C_HOT_CP,
       C_COLD_CP, C_U, C_H_HOT, C_H_COLD, C_TYPE, C_FMIN, C_XP, C_COST_A,
       C_COST_B, C_COST_C, C_LARGEST, C_COUNT };

static const char *const columns[C_COUNT] = {
	"name", "hot_in", "hot_out", "cold_in", "cold_out", "duty", "hot_cp",
	"cold_cp", "u", "h_hot", "h_cold", "type", "fmin", "xp", "cost_a",
	"cost_b", "cost_c", "largest"
};

static const hl_qty qty[C_COUNT] = {
	HL_QTY_NONE, HL_QTY_TEMP, HL_QTY_TEMP, HL_QTY_TEMP, HL_QTY_TEMP,
	HL_QTY_POWER, HL_QTY_CP, HL_QTY_CP, HL_QTY_HTC, HL_QTY_HTC,
	HL_QTY_HTC, HL_QTY_NONE, HL_QTY_NONE, HL_QTY_NONE, HL_QTY_NONE,
	HL_QTY_NONE, HL_QTY_NONE,
	/* largest: m² per shell or MW per fired heater, by the type */
	HL_QTY_NONE
};

/* The row being checked: where it is and what it is called. */
typedef struct {
	hl_table *t;
	const char *name;
} ctx;

/* Fail with "unit 'NAME': …" at the row's file and line. */
static hl_status
fail(const ctx *c, hl_error *err, const char *fmt, ...)
	__attribute__((format(printf, 3, 4)));

static hl_status
fail(const ctx *c, hl_error *err, const char *fmt, ...)
{
	char text[HL_ERROR_TEXT];
	va_list ap;

	va_start(ap, fmt);
	vsnprintf(text, sizeof text, fmt, ap);
	va_end(ap);
	return hl_error_set(err, HL_EINPUT, hl_table_file(c->t),
	    hl_table_line(c->t), "unit '%.64s': %s", c->name, text);
}

/* Put the row's position and name in front of a message from elsewhere. */
static hl_status
reword(const ctx *c, hl_error *err, hl_status st)
{
	char text[HL_ERROR_TEXT];

	if (err == NULL)
		return st;
	snprintf(text, sizeof text, "%s", err->text);
	hl_error_set(err, st, hl_table_file(c->t), hl_table_line(c->t),
	    "unit '%.64s': %s", c->name, text);
	return st;
}

/* All numeric cells; NaN where empty. */
static hl_status
read_numbers(const ctx *c, double *v, hl_error *err)
{
	hl_status st;
	size_t k;

	for (k = 0; k < C_COUNT; k++) {
		v[k] = NAN;
		if (k == C_NAME || k == C_TYPE)
			continue;
		st = hl_table_number(c->t, k, &v[k], err);
		if (st != HL_OK)
			return reword(c, err, st);
		if (!isnan(v[k]) && !isfinite(v[k]))
			return fail(c, err, "column '%s' is out of range",
			    columns[k]);
	}
	return HL_OK;
}

static int
temp_ok(double t)
{
	return t >= HL_T_MIN && t <= HL_T_MAX;
}

/* The four terminal temperatures: present, sane, and within what a
 * counterflow unit can do. */
static hl_status
check_temperatures(const ctx *c, const double *v, hl_error *err)
{
	double p, r;
	size_t k;

	for (k = C_HOT_IN; k <= C_COLD_OUT; k++) {
		if (isnan(v[k]))
			return fail(c, err, "'%s' is empty: give all four "
			    "terminal temperatures in °C", columns[k]);
		if (!temp_ok(v[k]))
			return fail(c, err, "%s %g °C is outside %g..%g °C; "
			    "temperatures are in °C (not K or °F)", columns[k],
			    v[k], HL_T_MIN, HL_T_MAX);
	}
	if (hl_exchanger_pr(v[C_HOT_IN], v[C_HOT_OUT], v[C_COLD_IN],
	    v[C_COLD_OUT], &p, &r, err) != HL_OK)
		return reword(c, err, HL_EINPUT);
	return HL_OK;
}

static hl_status
parse_type(const ctx *c, int *type, hl_error *err)
{
	const char *s = hl_table_text(c->t, C_TYPE);

	*type = -1;
	if (s[0] == '\0')
		return HL_OK;
	{
		char low[48];
		size_t i;

		for (i = 0; s[i] != '\0' && i + 1 < sizeof low; i++)
			low[i] = (char)tolower((unsigned char)s[i]);
		low[i] = '\0';
		*type = hl_exchanger_type_parse(low);
	}
	if (*type < 0)
		return fail(c, err, "type '%.40s' is unknown; give "
		    "shell-and-tube, counterflow, plate, double-pipe, "
		    "air-cooler or fired-heater", s);
	return HL_OK;
}

/* Whether a and b, both positive, agree within the balance tolerance. */
static int
agree(double a, double b)
{
	return fabs(a - b) <= HL_UNITS_BALANCE_TOL * fmax(a, b);
}

static double
gap_percent(double a, double b)
{
	return 100.0 * fabs(a - b) / fmax(a, b);
}

/* Heat one side carries from its cp; NaN when no cp is given. */
static hl_status
side_duty(const ctx *c, const char *col, double cp, double dt, double *q,
	  hl_error *err)
{
	*q = NAN;
	if (isnan(cp))
		return HL_OK;
	if (!(cp > 0.0 && cp <= HL_CP_MAX))
		return fail(c, err, "%s %g kW/K must be > 0 and at most %g "
		    "kW/K (cp is in kW/K)", col, cp, HL_CP_MAX);
	if (dt == 0.0)
		return fail(c, err, "%s is given but that side does not "
		    "change temperature (condensing or boiling?); give the "
		    "duty in kW instead", col);
	*q = cp * dt;
	return HL_OK;
}

/* A side's heat as the reader shows it: "hot_cp 10 kW/K over 60 K gives
 * 600 kW". */
static void
side_text(char *buf, size_t size, const char *col, double cp, double dt)
{
	snprintf(buf, size, "%s %g kW/K over %g K gives %g kW", col, cp, dt,
	    cp * dt);
}

static hl_status
check_side(const ctx *c, const char *col, double cp, double dt, double duty,
	   hl_error *err)
{
	char side[128];

	if (isnan(cp) || agree(cp * dt, duty))
		return HL_OK;
	side_text(side, sizeof side, col, cp, dt);
	return fail(c, err, "duty %g kW but %s (%.1f %% apart, more than "
	    "%g %%): check the temperatures, the cp and the duty", duty, side,
	    gap_percent(cp * dt, duty), 100.0 * HL_UNITS_BALANCE_TOL);
}

static hl_status
check_sides(const ctx *c, const double *v, double qh, double qc,
	    hl_error *err)
{
	char hot[128], cold[128];

	if (isnan(qh) || isnan(qc) || agree(qh, qc))
		return HL_OK;
	side_text(hot, sizeof hot, "hot_cp", v[C_HOT_CP],
	    v[C_HOT_IN] - v[C_HOT_OUT]);
	side_text(cold, sizeof cold, "cold_cp", v[C_COLD_CP],
	    v[C_COLD_OUT] - v[C_COLD_IN]);
	return fail(c, err, "%s but %s (%.1f %% apart, more than %g %%): "
	    "check the temperatures and the cp", hot, cold,
	    gap_percent(qh, qc), 100.0 * HL_UNITS_BALANCE_TOL);
}

/* The duty from duty, hot_cp and cold_cp, every pair agreeing. */
static hl_status
resolve_duty(const ctx *c, const double *v, hl_unit_spec *u, hl_error *err)
{
	hl_status st;
	double qh, qc;

	st = side_duty(c, "hot_cp", v[C_HOT_CP], v[C_HOT_IN] - v[C_HOT_OUT],
	    &qh, err);
	if (st == HL_OK)
		st = side_duty(c, "cold_cp", v[C_COLD_CP],
		    v[C_COLD_OUT] - v[C_COLD_IN], &qc, err);
	if (st != HL_OK)
		return st;
	u->duty_hot = qh;
	u->duty_cold = qc;
	u->duty = v[C_DUTY];
	if (!isnan(u->duty)) {
		if (!(u->duty > 0.0))
			return fail(c, err, "duty %g kW must be > 0", u->duty);
		st = check_side(c, "hot_cp", v[C_HOT_CP],
		    v[C_HOT_IN] - v[C_HOT_OUT], u->duty, err);
		return st == HL_OK ? check_side(c, "cold_cp", v[C_COLD_CP],
		    v[C_COLD_OUT] - v[C_COLD_IN], u->duty, err) : st;
	}
	if (isnan(qh) && isnan(qc))
		return fail(c, err, "no duty: give duty (kW), or hot_cp or "
		    "cold_cp (kW/K)");
	st = check_sides(c, v, qh, qc, err);
	if (st != HL_OK)
		return st;
	u->duty = isnan(qh) ? qc : isnan(qc) ? qh : 0.5 * qh + 0.5 * qc;
	return HL_OK;
}

static hl_status
check_coefficient(const ctx *c, const char *col, double h, hl_error *err)
{
	if (isnan(h) || (h > 0.0 && h <= HL_H_MAX))
		return HL_OK;
	return fail(c, err, "%s %g must be > 0 and at most %g kW/(m²·K)", col,
	    h, HL_H_MAX);
}

/* u, or the film coefficients; both when they agree. */
static hl_status
resolve_u(const ctx *c, const double *v, hl_unit_spec *u, hl_error *err)
{
	hl_status st;
	double both;

	u->u = v[C_U];
	u->h_hot = v[C_H_HOT];
	u->h_cold = v[C_H_COLD];
	st = check_coefficient(c, "u", u->u, err);
	if (st == HL_OK)
		st = check_coefficient(c, "h_hot", u->h_hot, err);
	if (st == HL_OK)
		st = check_coefficient(c, "h_cold", u->h_cold, err);
	if (st != HL_OK)
		return st;
	/* A fired heater is sized by duty: no coefficient needed. */
	if (isnan(u->u) && isnan(u->h_hot) && isnan(u->h_cold) &&
	    u->type != HL_EXCH_FIRED_HEATER)
		return fail(c, err, "no heat transfer coefficient: give u, or "
		    "h_hot and h_cold (kW/(m²·K), fouling included)");
	if (isnan(u->u))
		return HL_OK;
	if (isnan(u->h_hot) != isnan(u->h_cold))
		return fail(c, err, "u and only one film coefficient are "
		    "given: give u alone, or h_hot and h_cold");
	if (isnan(u->h_hot))
		return HL_OK;
	both = 1.0 / (1.0 / u->h_hot + 1.0 / u->h_cold);
	if (!agree(both, u->u))
		return fail(c, err, "u %g kW/(m²·K) but h_hot and h_cold give "
		    "%g (%.1f %% apart, more than %g %%): give u or the film "
		    "coefficients, or make them agree", u->u, both,
		    gap_percent(both, u->u), 100.0 * HL_UNITS_BALANCE_TOL);
	return HL_OK;
}

/* Per-row overrides of the sizing rules. */
static hl_status
resolve_rules(const ctx *c, const double *v, hl_unit_spec *u, hl_error *err)
{
	int ncost = !isnan(v[C_COST_A]) + !isnan(v[C_COST_B]) +
	    !isnan(v[C_COST_C]);

	u->fmin = v[C_FMIN];
	u->xp = v[C_XP];
	u->cost_a = v[C_COST_A];
	u->cost_b = v[C_COST_B];
	u->cost_c = v[C_COST_C];
	u->largest = v[C_LARGEST];
	if (!isnan(u->largest) && !(u->largest > 0.0))
		return fail(c, err, "largest %g must be > 0 (m² per shell, MW "
		    "per fired heater)", u->largest);
	if (!isnan(u->fmin) && !(u->fmin >= 0.0 && u->fmin < 1.0))
		return fail(c, err, "fmin %g is outside [0, 1): a usual F "
		    "floor is 0.80", u->fmin);
	if (!isnan(u->xp) && !(u->xp > 0.0 && u->xp <= 1.0))
		return fail(c, err, "xp %g is outside (0, 1]: a usual value "
		    "is 0.9", u->xp);
	if (ncost != 0 && ncost != 3)
		return fail(c, err, "give all three of cost_a, cost_b, cost_c "
		    "(cost per shell a + b·A^c) or none of them");
	if (ncost == 3 && !(u->cost_a >= 0.0 && u->cost_b >= 0.0 &&
	    u->cost_c > 0.0))
		return fail(c, err, "cost law a + b·A^c needs cost_a >= 0, "
		    "cost_b >= 0 and cost_c > 0");
	return HL_OK;
}

/* Values that look like another unit (plausible.h). */
static void
row_doubts(const hl_table *t, const double *v)
{
	const char *f = hl_table_file(t);
	long l = hl_table_line(t);
	size_t k;

	for (k = C_U; k <= C_H_COLD; k++)
		hl_doubt_htc(f, l, columns[k], v[k]);
	hl_doubt_duty(f, l, "duty", v[C_DUTY]);
	hl_doubt_cp(f, l, "hot_cp", v[C_HOT_CP], fabs(v[C_HOT_IN] -
	    v[C_HOT_OUT]));
	hl_doubt_cp(f, l, "cold_cp", v[C_COLD_CP], fabs(v[C_COLD_OUT] -
	    v[C_COLD_IN]));
}

static hl_status
read_row(hl_table *t, hl_unit_spec *u, hl_error *err)
{
	double v[C_COUNT];
	ctx c = { t, hl_table_text(t, C_NAME) };
	hl_status st;

	if (c.name[0] == '\0')
		return hl_error_set(err, HL_EINPUT, hl_table_file(t),
		    hl_table_line(t), "exchanger without a name; give each "
		    "row a name");
	st = read_numbers(&c, v, err);
	if (st == HL_OK)
		row_doubts(t, v);
	if (st == HL_OK)
		st = check_temperatures(&c, v, err);
	if (st == HL_OK)
		st = parse_type(&c, &u->type, err);
	if (st == HL_OK)
		st = resolve_duty(&c, v, u, err);
	if (st == HL_OK)
		st = resolve_u(&c, v, u, err);
	if (st == HL_OK)
		st = resolve_rules(&c, v, u, err);
	if (st != HL_OK)
		return st;
	u->hot_in = v[C_HOT_IN];
	u->hot_out = v[C_HOT_OUT];
	u->cold_in = v[C_COLD_IN];
	u->cold_out = v[C_COLD_OUT];
	u->line = hl_table_line(t);
	u->name = strdup(c.name);
	return u->name == NULL ? hl_error_nomem(err) : HL_OK;
}

static hl_status
append(hl_units_table *ut, hl_table *t, hl_error *err)
{
	hl_status st;

	if (ut->n == ut->cap) {
		size_t ncap = ut->cap ? 2 * ut->cap : 16;
		hl_unit_spec *p = realloc(ut->unit, ncap * sizeof *p);

		if (p == NULL)
			return hl_error_nomem(err);
		ut->unit = p;
		ut->cap = ncap;
	}
	st = read_row(t, &ut->unit[ut->n], err);
	if (st == HL_OK)
		ut->n++;
	return st;
}

static int
by_name(const void *a, const void *b)
{
	const hl_unit_spec *x = *(const hl_unit_spec *const *)a;
	const hl_unit_spec *y = *(const hl_unit_spec *const *)b;
	int d = strcmp(x->name, y->name);

	return d != 0 ? d : (x->line > y->line) - (x->line < y->line);
}

/* Names are the units' ids in the results: each once. Sorted, so that a
 * long list costs n log n; the repeat met first in the file is reported. */
static hl_status
check_names(const hl_units_table *ut, hl_error *err)
{
	const hl_unit_spec **idx, *again = NULL, *first = NULL;
	size_t i;

	idx = malloc(ut->n * sizeof *idx);
	if (idx == NULL)
		return hl_error_nomem(err);
	for (i = 0; i < ut->n; i++)
		idx[i] = &ut->unit[i];
	qsort(idx, ut->n, sizeof *idx, by_name);
	for (i = 1; i < ut->n; i++)
		if (strcmp(idx[i]->name, idx[i - 1]->name) == 0 &&
		    (again == NULL || idx[i]->line < again->line))
			again = idx[i];
	free(idx);
	if (again == NULL)
		return HL_OK;
	for (i = 0; first == NULL; i++)
		if (strcmp(ut->unit[i].name, again->name) == 0)
			first = &ut->unit[i];
	return hl_error_set(err, HL_EINPUT, ut->file, again->line, "unit "
	    "'%.64s' appears again (first at line %ld); give each exchanger "
	    "its own name", again->name, first->line);
}

/* The header must hold the temperatures, a way to the duty and one to U. */
static hl_status
check_header(hl_table *t, hl_error *err)
{
	hl_status st = HL_OK;
	size_t k;

	for (k = C_NAME; k <= C_COLD_OUT && st == HL_OK; k++)
		st = hl_table_require(t, k, err);
	if (st != HL_OK)
		return st;
	if (!hl_table_has(t, C_DUTY) && !hl_table_has(t, C_HOT_CP) &&
	    !hl_table_has(t, C_COLD_CP))
		return hl_error_set(err, HL_EINPUT, hl_table_file(t),
		    t->header_line, "missing column 'duty' (kW) or "
		    "'hot_cp'/'cold_cp' (kW/K) in the exchanger list header");
	if (!hl_table_has(t, C_U) && !hl_table_has(t, C_H_HOT) &&
	    !hl_table_has(t, C_H_COLD))
		return hl_error_set(err, HL_EINPUT, hl_table_file(t),
		    t->header_line, "missing column 'u' or 'h_hot'/'h_cold' "
		    "(kW/(m²·K)) in the exchanger list header");
	return HL_OK;
}

static hl_status
read_table(hl_table *t, hl_units_table *ut, hl_error *err)
{
	hl_status st;
	int rc = 0;

	st = check_header(t, err);
	while (st == HL_OK && (rc = hl_table_next(t, err)) > 0)
		st = append(ut, t, err);
	if (st == HL_OK && rc < 0)
		st = err ? err->status : HL_EINPUT;
	if (st == HL_OK && ut->n == 0)
		st = hl_error_set(err, HL_EINPUT, hl_table_file(t),
		    t->header_line, "the exchanger list has a header but no "
		    "exchangers");
	if (st == HL_OK)
		st = check_names(ut, err);
	return st;
}

/* Shared by both entry points: t is open, or opening failed with st. */
static hl_status
finish(hl_table *t, hl_status st, hl_units_table **out, hl_error *err)
{
	hl_units_table *ut;

	*out = NULL;
	if (st != HL_OK)
		return st;
	ut = calloc(1, sizeof *ut);
	if (ut != NULL)
		ut->file = strdup(hl_table_file(t));
	if (ut == NULL || ut->file == NULL)
		st = hl_error_nomem(err);
	else
		st = read_table(t, ut, err);
	hl_table_close(t);
	if (st != HL_OK)
		hl_units_table_free(ut);
	else
		*out = ut;
	return st;
}

hl_status
hl_units_table_read(const char *path, hl_units_table **out, hl_error *err)
{
	hl_table t;

	return finish(&t, hl_table_open(&t, path, "exchanger list", columns,
	    qty, C_COUNT, err), out, err);
}

hl_status
hl_units_table_read_mem(const char *name, const char *data, size_t len,
			hl_units_table **out, hl_error *err)
{
	hl_table t;

	return finish(&t, hl_table_open_mem(&t, name, data, len,
	    "exchanger list", columns, qty, C_COUNT, err), out, err);
}

void
hl_units_table_free(hl_units_table *t)
{
	size_t i;

	if (t == NULL)
		return;
	for (i = 0; i < t->n; i++)
		free(t->unit[i].name);
	free(t->unit);
	free(t->file);
	free(t);
}
