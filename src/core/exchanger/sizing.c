/* sizing.c - one exchanger sized and priced by its type: shells in series
 * and in parallel, F, area, cost, and warnings for implausible numbers.
 * The contract is in exchanger.h ("Sizing by type").
 */
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "exchanger.h"

void
hl_exchanger_law_of(const hl_settings *set, hl_exchanger_type t, double *a,
		    double *b, double *c)
{
	const hl_exchanger_law *l = &set->law[t];

	if (isnan(l->a)) {
		*a = set->cost_a;
		*b = set->cost_b;
		*c = set->cost_c;
	} else {
		*a = l->a;
		*b = l->b;
		*c = l->c;
	}
}

void
hl_exchanger_spec_type(hl_exchanger_spec *spec, const hl_settings *set,
		       hl_exchanger_type type)
{
	spec->type = type;
	spec->fmin = set->fmin;
	spec->xp = set->xp;
	hl_exchanger_law_of(set, type, &spec->cost_a, &spec->cost_b,
	    &spec->cost_c);
	spec->largest = set->law[type].largest;
	spec->smallest = set->law[type].smallest;
	spec->series = 0;
}

void
hl_exchanger_spec_settings(hl_exchanger_spec *spec, const hl_settings *set)
{
	hl_exchanger_spec_type(spec, set, set->exchanger);
}

/* Everything but the temperatures, which hl_exchanger_pr covers. */
static hl_status
check_spec(const hl_exchanger_spec *s, hl_error *err)
{
	if (!(s->duty > 0.0 && isfinite(s->duty)))
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "duty %.6g kW is not a positive number: give the heat "
		    "the exchanger transfers, in kW", s->duty);
	if ((int)s->type < 0 || s->type >= HL_EXCH_NTYPES)
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "unknown exchanger type %d", (int)s->type);
	if (s->type != HL_EXCH_FIRED_HEATER && !(s->u > 0.0 && isfinite(s->u)))
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "overall coefficient U %.6g kW/(m²·K) is not a positive "
		    "number: check the film coefficients", s->u);
	if (!(s->cost_a >= 0.0 && s->cost_b >= 0.0 && s->cost_c > 0.0 &&
	    isfinite(s->cost_a) && isfinite(s->cost_b) && isfinite(s->cost_c)))
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "cost law a + b·X^c needs a >= 0, b >= 0, c > 0 "
		    "(got a %.6g, b %.6g, c %.6g)",
		    s->cost_a, s->cost_b, s->cost_c);
	if (s->series < 0 || s->series > 1000)
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "%d shells in series: give 1 to 1000, or 0 to choose",
		    s->series);
	/* 0 (a spec filled by hand) means no limit on either side. */
	if (!(s->largest >= 0.0 && s->smallest >= 0.0 &&
	    (s->largest == 0.0 || s->smallest < s->largest)))
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "largest shell %.6g must be >= 0 and above the smallest "
		    "%.6g", s->largest, s->smallest);
	return HL_OK;
}

/* Units needed so that none exceeds largest (at least one). */
static int
count_for(double total, double largest)
{
	double n = isinf(largest) || !(largest > 0.0) ? 1.0 :
	    ceil(total / largest * (1.0 - 1e-12));

	if (!(n >= 1.0))
		return 1;
	return n > 1e6 ? 1000000 : (int)n;
}

/* Series × parallel split and cost (common practice, no source: the
 * largest shell caps each shell; trains in parallel share the duty at the
 * same temperatures, so F holds; a double pipe adds hairpins in series). */
void
hl_exchanger_price(const hl_exchanger_spec *spec, hl_exchanger_sizing *z)
{
	double units;

	z->warn = 0;
	if (spec->type == HL_EXCH_FIRED_HEATER) {
		double mw = spec->duty / 1000.0;

		z->area = z->area_shell = 0.0;
		z->shells = 1;
		z->parallel = count_for(mw, spec->largest);
		z->x = mw / z->parallel;
	} else {
		if (spec->type == HL_EXCH_DOUBLE_PIPE) {
			if (spec->series <= 0)
				z->shells = count_for(z->area, spec->largest);
			z->parallel = 1;
		} else
			z->parallel = count_for(z->area / z->shells,
			    spec->largest);
		z->area_shell = z->area / (z->shells * z->parallel);
		z->x = z->area_shell;
		if (spec->u < HL_EXCH_U_LOW)
			z->warn |= HL_EXCH_WARN_U_LOW;
		if (spec->u > HL_EXCH_U_HIGH)
			z->warn |= HL_EXCH_WARN_U_HIGH;
	}
	if (z->x < spec->smallest)
		z->warn |= HL_EXCH_WARN_SMALL;
	units = (double)z->shells * z->parallel;
	z->cost = units * (spec->cost_a + spec->cost_b * pow(z->x,
	    spec->cost_c));
}

/* F of exactly n in series: each shell (section) at the per-shell P. */
static hl_status
series_given(const hl_exchanger_spec *spec, hl_exchanger_sizing *z,
	     hl_error *err)
{
	double p1;
	hl_status st;

	z->shells = spec->series;
	z->f = 1.0;
	if (z->p == 0.0 || z->r == 0.0 || !isfinite(z->r))
		return HL_OK;
	if (spec->type == HL_EXCH_SHELL_TUBE)
		return hl_exchanger_f_shells(z->p, z->r, spec->series, &z->f,
		    err);
	if (spec->type != HL_EXCH_AIR_COOLER)
		return HL_OK;
	st = hl_exchanger_p_shell(z->p, z->r, spec->series, &p1, err);
	return st == HL_OK ? hl_exchanger_f_crossflow(p1, z->r, &z->f, err) :
	    st;
}

/* F and series count by type: Bowman, Mueller & Nagle (1940) shells by the
 * Xp rule; crossflow sections; 1 for the counterflow types. */
static hl_status
series(const hl_exchanger_spec *spec, hl_exchanger_sizing *z, hl_error *err)
{
	z->f = 1.0;
	z->shells = 1;
	if (spec->series > 0 && spec->type != HL_EXCH_FIRED_HEATER)
		return series_given(spec, z, err);
	if (spec->type == HL_EXCH_SHELL_TUBE)
		return hl_exchanger_shells(z->p, z->r, spec->fmin, spec->xp,
		    &z->shells, &z->f, NULL, err);
	if (spec->type == HL_EXCH_AIR_COOLER)
		return hl_exchanger_sections_crossflow(z->p, z->r, spec->fmin,
		    &z->shells, &z->f, err);
	return HL_OK;
}

/* Q = U·A·F·LMTD (Kern 1950, ch. 7) with F and shells by type; a fired
 * heater by duty alone. */
hl_status
hl_exchanger_size(const hl_exchanger_spec *spec, hl_exchanger_sizing *out,
		  hl_error *err)
{
	hl_exchanger_sizing z;
	hl_status st;

	memset(&z, 0, sizeof z);
	st = hl_exchanger_pr(spec->hot_in, spec->hot_out, spec->cold_in,
	    spec->cold_out, &z.p, &z.r, err);
	if (st == HL_OK)
		st = check_spec(spec, err);
	if (st == HL_OK)
		st = hl_exchanger_lmtd(spec->hot_in - spec->cold_out,
		    spec->hot_out - spec->cold_in, &z.lmtd, err);
	if (st == HL_OK)
		st = series(spec, &z, err);
	if (st != HL_OK)
		return st;
	z.area = spec->type == HL_EXCH_FIRED_HEATER ? 0.0 :
	    spec->duty / (spec->u * z.f * z.lmtd);
	hl_exchanger_price(spec, &z);
	if (!isfinite(z.area) || !isfinite(z.cost))
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "area or cost overflows (duty %.6g kW, U %.6g, LMTD "
		    "%.6g K): check the units of duty and U",
		    spec->duty, spec->u, z.lmtd);
	*out = z;
	return HL_OK;
}

void
hl_exchanger_warning(const hl_exchanger_spec *spec,
		     const hl_exchanger_sizing *z, char *buf, size_t n)
{
	int fh = spec->type == HL_EXCH_FIRED_HEATER;
	size_t k = 0;

	buf[0] = '\0';
	if (z->warn & (HL_EXCH_WARN_U_LOW | HL_EXCH_WARN_U_HIGH))
		k += (size_t)snprintf(buf + k, n - k, "U %.3g kW/(m²·K) is "
		    "%s the plausible %g to %g; check its units and the film "
		    "coefficients", spec->u, z->warn & HL_EXCH_WARN_U_LOW ?
		    "below" : "above", HL_EXCH_U_LOW, HL_EXCH_U_HIGH);
	if (k >= n)
		return;
	if (z->warn & HL_EXCH_WARN_SMALL)
		snprintf(buf + k, n - k, "%s%s %.3g %s is below the smallest "
		    "plausible %.3g %s; check U, the duty and the type",
		    k > 0 ? "; " : "", fh ? "a fired heater of" :
		    "a shell of", z->x, fh ? "MW" : "m²", spec->smallest,
		    fh ? "MW" : "m²");
}

int
hl_exchanger_law_illustrative(const hl_settings *set, hl_exchanger_type t)
{
	hl_settings d;

	if (set->law[t].given & HL_LAW_COST)
		return 0;
	if (!isnan(set->law[t].a))
		return 1;
	hl_settings_default(&d);
	return set->cost_a == d.cost_a && set->cost_b == d.cost_b &&
	    set->cost_c == d.cost_c;
}

/* What one shell (unit) is called for a type. */
static const char *
shell_word(hl_exchanger_type t)
{
	switch (t) {
	case HL_EXCH_SHELL_TUBE:
		return "shell";
	case HL_EXCH_DOUBLE_PIPE:
		return "hairpin";
	case HL_EXCH_AIR_COOLER:
		return "bay";
	case HL_EXCH_FIRED_HEATER:
		return "heater";
	default:
		return "unit";
	}
}

void
hl_exchanger_law_text(const hl_settings *set, hl_exchanger_type t,
		      char *buf, size_t n)
{
	double a, b, c;
	int fh = t == HL_EXCH_FIRED_HEATER;
	int dflt = hl_exchanger_law_illustrative(set, t);
	char lim[64] = "";

	hl_exchanger_law_of(set, t, &a, &b, &c);
	if (isfinite(set->law[t].largest))
		snprintf(lim, sizeof lim, ", largest %.4g %s",
		    set->law[t].largest, fh ? "MW" : "m²");
	snprintf(buf, n, "%s: %.6g + %.6g·%s^%.3g per %s, %s%s (%s)",
	    hl_exchanger_type_name(t), a, b, fh ? "Q" : "A", c, shell_word(t),
	    fh ? "Q in MW of duty" : "A in m²", lim, dflt ?
	    "illustrative default, not a price" : "set by the case");
}
