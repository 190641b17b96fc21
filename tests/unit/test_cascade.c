/* test_cascade.c - the problem table against published examples and
 * properties every correct cascade has. */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <cmocka.h>

#include "cascade.h"
#include "gen.h"
#include "near.h"

/* Relative agreement demanded of published targets (issue: 1e-9). */
#define REL 1e-9

/* Linnhoff et al., User Guide on Process Integration for the Efficient Use of
 * Energy (IChemE 1982); also Kemp, Pinch Analysis and Process Integration,
 * 2nd ed. (2007), ch. 2. From memory, confirmed by a hand cascade. */
static hl_case *
four_stream(void)
{
	hl_case *c = hl_case_create();

	hl_gen_add(c, "C1", 20, 135, 2.0);
	hl_gen_add(c, "H1", 170, 60, 3.0);
	hl_gen_add(c, "C2", 80, 140, 4.0);
	hl_gen_add(c, "H2", 150, 30, 1.5);
	return c;
}

static void
test_four_stream_targets(void **state)
{
	static const double t[] = { 165, 145, 140, 85, 55, 25 };
	static const double flow[] = { 20, 80, 82.5, 0, 75, 60 };
	hl_case *c = four_stream();
	hl_cascade *cas;
	size_t k;

	(void)state;
	assert_int_equal(hl_cascade_compute(c, 10.0, &cas, NULL), HL_OK);
	assert_rel(cas->qh, 20.0, REL);
	assert_rel(cas->qc, 60.0, REL);
	assert_int_equal(cas->npinch, 1);
	assert_rel(cas->t[cas->pinch[0]], 85.0, REL);
	assert_rel(hl_cascade_hot_temp(cas, 85.0), 90.0, REL);
	assert_rel(hl_cascade_cold_temp(cas, 85.0), 80.0, REL);
	/* The cascade itself (shifted T: heat), same source. */
	assert_int_equal(cas->nb, 6);
	for (k = 0; k < 6; k++) {
		assert_rel(cas->t[k], t[k], REL);
		assert_rel(cas->flow[k], flow[k], REL);
	}
	hl_cascade_free(cas);
	/* ΔTmin 20 K: 65 / 105 kW (derived by hand cascade, doc/references.md). */
	assert_int_equal(hl_cascade_compute(c, 20.0, &cas, NULL), HL_OK);
	assert_rel(cas->qh, 65.0, REL);
	assert_rel(cas->qc, 105.0, REL);
	hl_cascade_free(cas);
	hl_case_free(c);
}

/* Smith, Chemical Process Design and Integration (Wiley 2005), ch. 16; from
 * memory, confirmed by a hand cascade. CP in MW/K, so targets in MW. */
static void
test_smith_targets(void **state)
{
	static const double t[] = { 245, 235, 195, 185, 145, 75, 35, 25 };
	static const double flow[] = { 7.5, 9.0, 3.0, 4.0, 0, 14, 12, 10 };
	hl_case *c = hl_case_create();
	hl_cascade *cas;
	size_t k;

	(void)state;
	hl_gen_add(c, "C1", 20, 180, 0.20);
	hl_gen_add(c, "H1", 250, 40, 0.15);
	hl_gen_add(c, "C2", 140, 230, 0.30);
	hl_gen_add(c, "H2", 200, 80, 0.25);
	assert_int_equal(hl_cascade_compute(c, 10.0, &cas, NULL), HL_OK);
	assert_rel(cas->qh, 7.5, REL);
	assert_rel(cas->qc, 10.0, REL);
	assert_int_equal(cas->npinch, 1);
	assert_rel(hl_cascade_hot_temp(cas, cas->t[cas->pinch[0]]), 150.0, REL);
	assert_rel(hl_cascade_cold_temp(cas, cas->t[cas->pinch[0]]), 140.0, REL);
	assert_int_equal(cas->nb, 8);
	for (k = 0; k < 8; k++) {
		assert_rel(cas->t[k], t[k], REL);
		assert_rel(cas->flow[k], flow[k], REL);
	}
	hl_cascade_free(cas);
	/* ΔTmin 20 K: 11.5 / 14.0 MW (derived, doc/references.md). */
	assert_int_equal(hl_cascade_compute(c, 20.0, &cas, NULL), HL_OK);
	assert_rel(cas->qh, 11.5, REL);
	assert_rel(cas->qc, 14.0, REL);
	hl_cascade_free(cas);
	hl_case_free(c);
}

/* Threshold problem, constructed by hand: hot 200->100 cp 1 can heat cold
 * 50->90 cp 1 whenever ΔTmin <= 110 K (hot heat above T+ΔTmin, 200-T-ΔTmin,
 * must cover the cold demand above T, 90-T), so no hot utility is needed up
 * to 110 K; the cold utility is 100 - 40 = 60 kW. */
static void
test_threshold(void **state)
{
	hl_case *c = hl_case_create();
	hl_cascade *cas;
	double dt;

	(void)state;
	hl_gen_add(c, "H", 200, 100, 1.0);
	hl_gen_add(c, "C", 50, 90, 1.0);
	assert_int_equal(hl_cascade_compute(c, 10.0, &cas, NULL), HL_OK);
	assert_true(cas->qh == 0.0);
	assert_rel(cas->qc, 60.0, REL);
	assert_int_equal(cas->npinch, 0);
	assert_int_equal(hl_cascade_threshold_kind(cas), 'H');
	assert_int_equal(hl_cascade_threshold_dtmin(c, cas, &dt, NULL), HL_OK);
	assert_rel(dt, 110.0, 1e-8);
	hl_cascade_free(cas);
	/* Just above the threshold the hot utility appears. */
	assert_int_equal(hl_cascade_compute(c, 112.0, &cas, NULL), HL_OK);
	assert_rel(cas->qh, 2.0, REL);
	hl_cascade_free(cas);
	hl_case_free(c);
}

/* With only hot streams no hot utility is ever needed (common practice, no
 * source): the threshold is reported as never. */
static void
test_threshold_never(void **state)
{
	hl_case *c = hl_case_create();
	hl_cascade *cas;
	double dt;

	(void)state;
	hl_gen_add(c, "H", 200, 100, 1.0);
	assert_int_equal(hl_cascade_compute(c, 10.0, &cas, NULL), HL_OK);
	assert_int_equal(hl_cascade_threshold_kind(cas), 'H');
	assert_int_equal(hl_cascade_threshold_dtmin(c, cas, &dt, NULL), HL_OK);
	assert_true(isinf(dt));
	hl_cascade_free(cas);
	hl_case_free(c);
}

/* A stream's own ΔT contribution replaces ΔTmin/2 (Linnhoff et al. 1982):
 * giving every stream 5 K at ΔTmin 0 equals the default at ΔTmin 10. */
static void
test_dt_contrib(void **state)
{
	hl_case *c = four_stream();
	double qh, qc;
	size_t i;

	(void)state;
	for (i = 0; i < c->nstream; i++)
		c->stream[i].dt_contrib = 5.0;
	assert_int_equal(hl_cascade_targets(c, 0.0, &qh, &qc, NULL), HL_OK);
	assert_rel(qh, 20.0, REL);
	assert_rel(qc, 60.0, REL);
	hl_case_free(c);
}

/* Properties on random problems with fixed seeds. */
#define NCASES 300

static void
targets(const hl_case *c, double dt, double *qh, double *qc)
{
	assert_int_equal(hl_cascade_targets(c, dt, qh, qc, NULL), HL_OK);
}

static double
scale_of(const hl_case *c)
{
	double s = 1.0;
	size_t i;

	for (i = 0; i < c->nstream; i++)
		s += hl_stream_duty(&c->stream[i]);
	return s;
}

/* QC − QH = Σ hot duty − Σ cold duty: the first law over the cascade. */
static void
test_prop_balance(void **state)
{
	hl_rng r;
	int n;

	(void)state;
	hl_rng_seed(&r, 1);
	for (n = 0; n < NCASES; n++) {
		hl_case *c = hl_gen_case(&r, 1 + n % 7, 1 + n % 5);
		double qh, qc, hot = 0, cold = 0;
		size_t i;

		for (i = 0; i < c->nstream; i++) {
			if (c->stream[i].kind == HL_HOT)
				hot += hl_stream_duty(&c->stream[i]);
			else
				cold += hl_stream_duty(&c->stream[i]);
		}
		targets(c, hl_rng_uniform(&r, 0, 40), &qh, &qc);
		assert_true(qh >= 0.0 && qc >= 0.0);
		assert_true(fabs((qc - qh) - (hot - cold)) <= 1e-9 * scale_of(c));
		hl_case_free(c);
	}
}

/* QH never decreases as ΔTmin grows (common practice, no source). */
static void
test_prop_monotone(void **state)
{
	hl_rng r;
	int n;

	(void)state;
	hl_rng_seed(&r, 2);
	for (n = 0; n < NCASES / 3; n++) {
		hl_case *c = hl_gen_case(&r, 2 + n % 5, 2 + n % 4);
		double prev = -1.0, qh, qc, dt;

		for (dt = 0.0; dt <= 60.0; dt += 2.5) {
			targets(c, dt, &qh, &qc);
			assert_true(qh >= prev - 1e-9 * scale_of(c));
			prev = qh;
		}
		hl_case_free(c);
	}
}

/* Reversing the stream order, scaling every cp by k and shifting every
 * temperature by a constant change the targets only as they should. */
static void
test_prop_invariance(void **state)
{
	hl_rng r;
	int n;

	(void)state;
	hl_rng_seed(&r, 3);
	for (n = 0; n < NCASES; n++) {
		hl_case *c = hl_gen_case(&r, 1 + n % 6, 1 + n % 6);
		hl_case *d = hl_case_create(), *e = hl_case_create();
		double qh, qc, qh2, qc2, qh3, qc3, k = 0.5 + n % 4, dt = 10.0;
		double tol = 1e-9 * scale_of(c) * k;
		size_t i;

		for (i = c->nstream; i-- > 0;) {
			const hl_stream *s = &c->stream[i];

			hl_gen_add(d, s->name, s->seg[0].supply,
				   s->seg[0].target, s->seg[0].cp * k);
			hl_gen_add(e, s->name, s->seg[0].supply + 137.25,
				   s->seg[0].target + 137.25, s->seg[0].cp);
		}
		targets(c, dt, &qh, &qc);
		targets(d, dt, &qh2, &qc2);
		targets(e, dt, &qh3, &qc3);
		assert_true(fabs(qh2 - k * qh) <= tol);
		assert_true(fabs(qc2 - k * qc) <= tol);
		assert_true(fabs(qh3 - qh) <= tol);
		assert_true(fabs(qc3 - qc) <= tol);
		hl_case_free(c);
		hl_case_free(d);
		hl_case_free(e);
	}
}

/* A stream cut into segments of equal cp gives the same targets as the whole
 * stream (common practice, no source). */
static void
test_prop_segments(void **state)
{
	hl_rng r;
	int n;

	(void)state;
	hl_rng_seed(&r, 4);
	for (n = 0; n < NCASES; n++) {
		hl_case *c = hl_gen_case(&r, 1 + n % 4, 1 + n % 4);
		hl_case *d = hl_case_create();
		double qh, qc, qh2, qc2;
		size_t i;

		for (i = 0; i < c->nstream; i++) {
			const hl_stream *s = &c->stream[i];
			hl_segment g[3];
			hl_stream t = *s;
			double a = s->seg[0].supply, b = s->seg[0].target;
			double m1 = a + (b - a) * 0.3, m2 = a + (b - a) * 0.71;

			g[0] = s->seg[0];
			g[0].target = m1;
			g[1] = s->seg[0];
			g[1].supply = m1;
			g[1].target = m2;
			g[2] = s->seg[0];
			g[2].supply = m2;
			t.seg = g;
			t.nseg = 3;
			assert_int_equal(hl_case_add_stream(d, &t, NULL), HL_OK);
		}
		targets(c, 10.0, &qh, &qc);
		targets(d, 10.0, &qh2, &qc2);
		assert_true(fabs(qh2 - qh) <= 1e-9 * scale_of(c));
		assert_true(fabs(qc2 - qc) <= 1e-9 * scale_of(c));
		hl_case_free(c);
		hl_case_free(d);
	}
}

/* Every pinch has zero heat flow and the flows are never negative. */
static void
test_prop_flows(void **state)
{
	hl_rng r;
	int n;

	(void)state;
	hl_rng_seed(&r, 5);
	for (n = 0; n < NCASES; n++) {
		hl_case *c = hl_gen_case(&r, 1 + n % 5, 1 + n % 5);
		hl_cascade *cas;
		size_t k;

		assert_int_equal(hl_cascade_compute(c, 10.0, &cas, NULL), HL_OK);
		for (k = 0; k < cas->nb; k++)
			assert_true(cas->flow[k] >= 0.0);
		for (k = 0; k < cas->npinch; k++)
			assert_true(cas->flow[cas->pinch[k]] == 0.0);
		assert_true(cas->flow[0] == cas->qh);
		assert_true(cas->flow[cas->nb - 1] == cas->qc);
		hl_cascade_free(cas);
		hl_case_free(c);
	}
}

/* A stream of latent heat only: duty kW at temperature t. */
static void
add_latent(hl_case *c, const char *name, hl_kind kind, double t, double duty)
{
	hl_segment g = { t, t, 0.0, NAN, 0, 1, duty, 0 };
	hl_stream s;

	memset(&s, 0, sizeof s);
	s.name = (char *)name;
	s.kind = kind;
	s.nseg = 1;
	s.seg = &g;
	s.dt_contrib = NAN;
	s.cp_tol = NAN;
	s.t_tol = NAN;
	hl_case_add_stream(c, &s, NULL);
}

/* Invented (tests/data/good/latent.csv), cascade by hand at ΔTmin 10 K
 * with latent heat as a step (Linnhoff & Flower 1978): vapour condensing
 * at 150 °C (shifted 145) 300 kW, feed 50 -> 140 cp 3, oil 120 -> 40 cp 4,
 * reboiler boiling at 110 °C (shifted 115) 300 kW:
 *   145 step +300 | 145-115 -90 | 115 step -300 | 115-55 +60 | 55-35 +80
 * cascade 0 300 210 -90 -30 50: QHmin 90, QCmin 140, pinch at the foot of
 * the reboiler's step (115 shifted). */
static void
test_latent_step(void **state)
{
	static const double t[] = { 145, 145, 115, 115, 55, 35 };
	static const double flow[] = { 90, 390, 300, 0, 60, 140 };
	hl_case *c = hl_case_create();
	hl_cascade *cas;
	size_t k;

	(void)state;
	add_latent(c, "vapour", HL_HOT, 150, 300);
	hl_gen_add(c, "feed", 50, 140, 3.0);
	hl_gen_add(c, "oil", 120, 40, 4.0);
	add_latent(c, "reboiler", HL_COLD, 110, 300);
	assert_int_equal(hl_case_validate(c, NULL), HL_OK);
	assert_int_equal(hl_cascade_compute(c, 10.0, &cas, NULL), HL_OK);
	assert_rel(cas->qh, 90.0, REL);
	assert_rel(cas->qc, 140.0, REL);
	assert_rel(cas->hot_total, 620.0, REL);
	assert_int_equal(cas->nb, 6);
	for (k = 0; k < 6; k++) {
		assert_rel(cas->t[k], t[k], REL);
		assert_rel(cas->flow[k], flow[k], REL);
	}
	assert_int_equal(cas->npinch, 1);
	assert_int_equal(cas->pinch[0], 3);
	hl_cascade_free(cas);
	hl_case_free(c);
}

/* Latent heat is the limit of a sensible segment whose span goes to zero
 * (common practice, no source): on random problems with latent streams,
 * the step's targets and those of the spread copy (hl_case_spread_latent)
 * differ by at most Σcp × span, and both balance. */
static void
test_latent_limit(void **state)
{
	hl_rng r;
	int it;

	(void)state;
	hl_rng_seed(&r, 41);
	for (it = 0; it < 200; it++) {
		hl_case *c = hl_gen_case(&r, 3, 3), *d;
		double qh, qc, qh2, qc2, span = 1e-6, cpsum = 0.0;
		size_t i;

		add_latent(c, "cond", HL_HOT, floor(hl_rng_uniform(&r, 40, 200)),
			   floor(hl_rng_uniform(&r, 10, 500)));
		add_latent(c, "boil", HL_COLD, floor(hl_rng_uniform(&r, 30, 190)),
			   floor(hl_rng_uniform(&r, 10, 500)));
		for (i = 0; i < c->nstream; i++)
			cpsum += c->stream[i].seg[0].cp;
		assert_int_equal(hl_case_validate(c, NULL), HL_OK);
		d = hl_case_spread_latent(c, span);
		assert_non_null(d);
		assert_int_equal(hl_cascade_targets(c, 10.0, &qh, &qc, NULL),
				 HL_OK);
		assert_int_equal(hl_cascade_targets(d, 10.0, &qh2, &qc2, NULL),
				 HL_OK);
		assert_true(fabs(qh - qh2) <= cpsum * span * 2 + 1e-6);
		assert_true(fabs(qc - qc2) <= cpsum * span * 2 + 1e-6);
		hl_case_free(d);
		hl_case_free(c);
	}
}

static void
test_validate(void **state)
{
	hl_case *c = four_stream();
	hl_error err;

	(void)state;
	assert_int_equal(hl_case_validate(c, &err), HL_OK);
	hl_gen_add(c, "C1", 30, 40, 1.0);
	assert_int_equal(hl_case_validate(c, &err), HL_EINPUT);
	assert_non_null(strstr(err.text, "appears twice"));
	hl_case_free(c);
	c = hl_case_create();
	hl_gen_add(c, "X", -300, 40, 1.0);
	assert_int_equal(hl_case_validate(c, &err), HL_EINPUT);
	assert_non_null(strstr(err.text, "temperature -300 °C is outside"));
	hl_case_free(c);
}

int
main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_four_stream_targets),
		cmocka_unit_test(test_smith_targets),
		cmocka_unit_test(test_threshold),
		cmocka_unit_test(test_threshold_never),
		cmocka_unit_test(test_dt_contrib),
		cmocka_unit_test(test_prop_balance),
		cmocka_unit_test(test_prop_monotone),
		cmocka_unit_test(test_prop_invariance),
		cmocka_unit_test(test_prop_segments),
		cmocka_unit_test(test_prop_flows),
		cmocka_unit_test(test_latent_step),
		cmocka_unit_test(test_latent_limit),
		cmocka_unit_test(test_validate),
	};

	return cmocka_run_group_tests(tests, NULL, NULL);
}
