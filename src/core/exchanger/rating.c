/* rating.c - duty and outlets of a unit of known area and shells (rating.h):
 * the closed ε-NTU forms where each side keeps one cp and one h, else the
 * duty at which the piecewise area sizing needs exactly the area given. */
#include <math.h>

#include "profile.h"
#include "rating.h"

/* Bisection steps: the interval halves each time, 200 reach the last bit. */
#define BISECT_MAX 200

/* n crossflow sections (both fluids unmixed) in series, counter-current
 * between them: the series rule of Incropera & DeWitt, table 11.3 (from
 * memory) with the crossflow ε per section (crossflow.c). */
static hl_status
eps_sections(double ntu, double cr, int n, double *eps, hl_error *err)
{
	double e1;
	hl_status st;

	if (n < 1)
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "%d sections in series: the count must be at least 1", n);
	if (ntu / n > HL_CROSSFLOW_NTU_MAX)
		ntu = n * HL_CROSSFLOW_NTU_MAX;
	st = hl_exchanger_eps_crossflow(ntu / n, cr, &e1, err);
	if (st != HL_OK)
		return st;
	if (e1 >= 1.0 || cr == 0.0 || n == 1) {
		*eps = n == 1 ? e1 : -expm1(-ntu);
		return HL_OK;
	}
	*eps = hl_exchanger_eps_cf(n * hl_exchanger_ntu_counterflow(e1, cr),
	    cr);
	return HL_OK;
}


/* ε by table 11.3 of Incropera & DeWitt (counterflow for counterflow, plate
 * and double pipe; 1-2 shell, n shells in series; crossflow sections)
 * through exchanger.h, which holds the cancellation-free forms. */
hl_status
hl_rating_eps(hl_exchanger_type type, int shells, double ntu, double cr,
	      double *eps, hl_error *err)
{
	if (type == HL_EXCH_COUNTERFLOW || type == HL_EXCH_PLATE ||
	    type == HL_EXCH_DOUBLE_PIPE)
		return hl_exchanger_eps_counterflow(ntu, cr, eps, err);
	if (type == HL_EXCH_SHELL_TUBE)
		return hl_exchanger_eps_shells(ntu, cr, shells, eps, err);
	if (type == HL_EXCH_AIR_COOLER) {
		if (!(ntu >= 0.0 && isfinite(ntu) && cr >= 0.0 && cr <= 1.0))
			return hl_error_set(err, HL_EINPUT, NULL, 0,
			    "NTU %.6g and Cr %.6g: give NTU >= 0 and "
			    "0 <= Cr <= 1", ntu, cr);
		return eps_sections(ntu, cr, shells, eps, err);
	}
	if (type == HL_EXCH_FIRED_HEATER)
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "a fired heater is sized by duty and is not rated");
	return hl_error_set(err, HL_EINPUT, NULL, 0,
	    "unknown exchanger type %d", (int)type);
}

/* Heat (kW, whole flow) the side's stream has exchanged at t. */
static double
heat_at(const hl_rating_side *s, double t)
{
	return hl_profile_heat(s->seg, s->nseg, s->kind, t);
}

/* Outlet temperature after the side exchanges duty kW. */
static double
outlet(const hl_rating_side *s, double duty)
{
	return hl_profile_temp(s->seg, s->nseg, s->kind,
	    heat_at(s, s->t_in) + duty / s->share);
}

/* Index of the segment holding heat q (the end segments continue). */
static size_t
segment_at(const hl_rating_side *s, double q)
{
	double qb = 0.0;
	size_t i;

	for (i = 0; i + 1 < s->nseg; i++) {
		qb += s->seg[i].cp * fabs(s->seg[i].target - s->seg[i].supply);
		if (q < qb)
			return i;
	}
	return s->nseg - 1;
}

static double
seg_h(const hl_rating_side *s, size_t i)
{
	return isnan(s->seg[i].h) ? s->h_default : s->seg[i].h;
}

double
hl_rating_duty_max(const hl_rating_spec *spec)
{
	const hl_rating_side *h = &spec->hot, *c = &spec->cold;
	double qh = h->share * (heat_at(h, c->t_in) - heat_at(h, h->t_in));
	double qc = c->share * (heat_at(c, h->t_in) - heat_at(c, c->t_in));

	return fmax(0.0, fmin(qh, qc));
}

/* F of exactly n shells (sections) in series at the per-shell P: Bowman,
 * Mueller & Nagle (1940) for shell and tube, the unmixed crossflow F for an
 * air cooler (crossflow.c); 1 where a side is isothermal. */
static hl_status
f_at(hl_exchanger_type type, int n, double p, double r, double *f)
{
	double p1;
	hl_status st;

	*f = 1.0;
	if (p == 0.0 || r == 0.0 || !isfinite(r))
		return HL_OK;
	if (type == HL_EXCH_SHELL_TUBE)
		return hl_exchanger_f_shells(p, r, n, f, NULL);
	st = hl_exchanger_p_shell(p, r, n, &p1, NULL);
	return st == HL_OK ? hl_exchanger_f_crossflow(p1, r, f, NULL) : st;
}

/* Q = U·A·F·LMTD per piece (Kern 1950, ch. 7; pieces as profile.h) at the
 * spec's shell count, F of Bowman, Mueller & Nagle (1940) per shell. */
double
hl_rating_area_needed(const hl_rating_spec *spec, double duty, double *u,
		      double *lmtd, double *ft)
{
	hl_profile_side hs, cs;
	hl_profile_unit pu;
	double uu, lm, f = 1.0, p, r;

	if (!(duty > 0.0))
		return 0.0;
	hs.seg = spec->hot.seg;
	hs.nseg = spec->hot.nseg;
	hs.kind = HL_HOT;
	hs.t_in = spec->hot.t_in;
	hs.t_out = outlet(&spec->hot, duty);
	hs.h = spec->hot.h_default;
	cs.seg = spec->cold.seg;
	cs.nseg = spec->cold.nseg;
	cs.kind = HL_COLD;
	cs.t_in = spec->cold.t_in;
	cs.t_out = outlet(&spec->cold, duty);
	cs.h = spec->cold.h_default;
	hl_profile_unit_eval(&hs, &cs, duty, &pu);
	if (!(pu.approach > 0.0))
		return HUGE_VAL;
	if (pu.pieces > 1) {
		uu = pu.u;
		lm = pu.lmtd;
	} else if (hl_exchanger_u(pu.h_hot, pu.h_cold, &uu, NULL) != HL_OK ||
		   hl_exchanger_lmtd(pu.dt_hot, pu.dt_cold, &lm, NULL) !=
		   HL_OK) {
		return HUGE_VAL;
	}
	if ((spec->type == HL_EXCH_SHELL_TUBE ||
	     spec->type == HL_EXCH_AIR_COOLER) &&
	    (hl_exchanger_pr(hs.t_in, hs.t_out, cs.t_in, cs.t_out, &p, &r,
			     NULL) != HL_OK ||
	     f_at(spec->type, spec->shells, p, r, &f) != HL_OK || !(f > 0.0)))
		return HUGE_VAL;
	if (!(uu > 0.0 && lm > 0.0))
		return HUGE_VAL;
	if (u != NULL)
		*u = uu;
	if (lmtd != NULL)
		*lmtd = lm;
	if (ft != NULL)
		*ft = f;
	return duty / (uu * f * lm);
}

static hl_status
check_side(const hl_rating_side *s, const char *which, hl_error *err)
{
	size_t i;

	if (s->seg == NULL || s->nseg < 1 || !(s->share > 0.0 &&
	    s->share <= 1.0) || !isfinite(s->t_in) ||
	    !(s->h_default > 0.0 && isfinite(s->h_default)))
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "the %s side needs a stream, a share in (0, 1], a finite "
		    "inlet and a positive default h", which);
	for (i = 0; i < s->nseg; i++)
		if (!(s->seg[i].cp > 0.0 && isfinite(s->seg[i].cp)))
			return hl_error_set(err, HL_EINPUT, NULL, 0,
			    "the %s side has a segment of cp %.6g kW/K: "
			    "cp must be positive", which, s->seg[i].cp);
	return HL_OK;
}

static hl_status
check_spec(const hl_rating_spec *s, hl_error *err)
{
	hl_status st = check_side(&s->hot, "hot", err);

	if (st == HL_OK)
		st = check_side(&s->cold, "cold", err);
	if (st != HL_OK)
		return st;
	if (!(s->hot.t_in >= s->cold.t_in))
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "hot inlet %.6g °C is below the cold inlet %.6g °C",
		    s->hot.t_in, s->cold.t_in);
	if (!(s->area >= 0.0 && isfinite(s->area)))
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "area %.6g m² must be a number not below 0", s->area);
	if ((s->type == HL_EXCH_SHELL_TUBE || s->type == HL_EXCH_AIR_COOLER) &&
	    (s->shells < 1 || s->shells > HL_EXCHANGER_MAX_SHELLS))
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "%d %s in series: give 1 to %d", s->shells,
		    s->type == HL_EXCH_AIR_COOLER ? "sections" : "shells",
		    HL_EXCHANGER_MAX_SHELLS);
	if (s->type == HL_EXCH_FIRED_HEATER)
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "a fired heater is sized by duty and is not rated");
	if ((int)s->type < 0 || s->type >= HL_EXCH_NTYPES)
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "unknown exchanger type %d", (int)s->type);
	return HL_OK;
}

/* Both sides stay in one segment between inlet and outlet. */
static int
one_piece(const hl_rating_spec *s, double duty)
{
	const hl_rating_side *sd[2] = { &s->hot, &s->cold };
	int k;

	for (k = 0; k < 2; k++) {
		double q0 = heat_at(sd[k], sd[k]->t_in);
		double q1 = q0 + duty / sd[k]->share;
		double tol = 1e-12 * (1.0 + fabs(q1));

		if (segment_at(sd[k], q0 + tol) != segment_at(sd[k], q1 - tol))
			return 0;
	}
	return 1;
}

/* Closed ε-NTU form with the inlet segments' cp and h (rating.h). */
static hl_status
closed_form(const hl_rating_spec *s, hl_rating_result *z, hl_error *err)
{
	size_t ih = segment_at(&s->hot, heat_at(&s->hot, s->hot.t_in) + 1e-12);
	size_t ic = segment_at(&s->cold,
	    heat_at(&s->cold, s->cold.t_in) + 1e-12);
	double ch = s->hot.share * s->hot.seg[ih].cp;
	double cc = s->cold.share * s->cold.seg[ic].cp;
	double cmin = fmin(ch, cc), cmax = fmax(ch, cc), u, eps;
	hl_status st;

	st = hl_exchanger_u(seg_h(&s->hot, ih), seg_h(&s->cold, ic), &u, err);
	if (st == HL_OK)
		st = hl_rating_eps(s->type, s->shells, u * s->area / cmin,
		    cmin / cmax, &eps, err);
	if (st != HL_OK)
		return st;
	z->duty = eps * cmin * (s->hot.t_in - s->cold.t_in);
	z->u = u;
	z->closed_form = 1;
	return HL_OK;
}

/* φ(Q) = Q − A·Q/area_needed(Q): finite on [0, duty_max] (Q/area is
 * U·F·ΔT_mean, 0 where no unit can do Q), negative at 0, positive at the
 * top, nil at the rated duty. */
static double
phi(const hl_rating_spec *s, double q)
{
	double a;

	if (q <= 0.0) {
		double lm = s->hot.t_in - s->cold.t_in, u;
		size_t ih = segment_at(&s->hot, heat_at(&s->hot, s->hot.t_in) +
		    1e-12);
		size_t ic = segment_at(&s->cold, heat_at(&s->cold,
		    s->cold.t_in) + 1e-12);

		if (hl_exchanger_u(seg_h(&s->hot, ih), seg_h(&s->cold, ic), &u,
		    NULL) != HL_OK)
			return -1.0;
		return -s->area * u * lm;
	}
	a = hl_rating_area_needed(s, q, NULL, NULL, NULL);
	return isfinite(a) ? q - s->area * q / a : q;
}

/* Duty with area_needed(duty) = area: regula falsi with the Illinois
 * change (Dowell & Jarratt 1971) on φ, which keeps a bracket and converges
 * superlinearly; bisection steps where it stalls. */
static void
bisect(const hl_rating_spec *s, hl_rating_result *z)
{
	double lo = 0.0, hi = hl_rating_duty_max(s), flo = phi(s, lo);
	double fhi = phi(s, hi), q = 0.5 * (lo + hi), top = hi;
	int i, side = 0;

	for (i = 0; i < BISECT_MAX && hi - lo > 1e-14 * hi; i++) {
		double f;

		q = fhi - flo != 0.0 ? (lo * fhi - hi * flo) / (fhi - flo) :
		    0.5 * (lo + hi);
		if (!(q > lo && q < hi) || i % 8 == 7)
			q = 0.5 * (lo + hi);
		f = phi(s, q);
		if (fabs(f) <= 1e-15 * top) {
			lo = hi = q;
			break;
		}
		if (f < 0.0) {
			lo = q;
			flo = f;
			if (side == -1)
				fhi *= 0.5;
			side = -1;
		} else {
			hi = q;
			fhi = f;
			if (side == 1)
				flo *= 0.5;
			side = 1;
		}
	}
	z->duty = 0.5 * (lo + hi);
	z->closed_form = 0;
}

hl_status
hl_rating_run(const hl_rating_spec *spec, hl_rating_result *out,
	      hl_error *err)
{
	hl_rating_result z = { 0 };
	hl_status st = check_spec(spec, err);

	if (st != HL_OK)
		return st;
	if (spec->area == 0.0 || spec->hot.t_in == spec->cold.t_in) {
		z.duty = 0.0;
		z.closed_form = 1;
	} else {
		st = closed_form(spec, &z, err);
		if (st != HL_OK)
			return st;
		if (!one_piece(spec, z.duty))
			bisect(spec, &z);
	}
	z.hot_out = outlet(&spec->hot, z.duty);
	z.cold_out = outlet(&spec->cold, z.duty);
	z.ft = 1.0;
	z.lmtd = NAN;
	if (z.duty > 0.0)
		(void)hl_rating_area_needed(spec, z.duty, &z.u, &z.lmtd,
		    &z.ft);
	*out = z;
	return HL_OK;
}
