/* test_sensitivity.c - derivatives and bands of the targets against finite
 * differences and corner re-solves of the problem table, hand-derived
 * values, and facts of the trade. */
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
#include "sensitivity.h"
#include "utility_lp.h"

/* Hand-derived values are exact sums of a few products: 1e-9 relative. */
#define HAND 1e-9
/* Analytic derivative against a central finite difference (issue 11). */
#define FD_REL 1e-6

static hl_sensitivity *
sens(const hl_case *c, double dtmin)
{
	hl_cascade *cas;
	hl_sensitivity *s;
	hl_error err;

	assert_int_equal(hl_cascade_compute(c, dtmin, &cas, NULL), HL_OK);
	if (hl_sensitivity_compute(c, cas, &s, &err) != HL_OK) {
		print_error("%s\n", err.text);
		fail();
	}
	hl_cascade_free(cas);
	return s;
}

/* The row of stream 'name' and quantity q (segment seg for cp and duty). */
static const hl_sens_row *
row_of(const hl_case *c, const hl_sensitivity *s, const char *name,
       hl_sens_quantity q, size_t seg)
{
	size_t i;

	for (i = 0; i < s->nrow; i++)
		if (strcmp(c->stream[s->row[i].stream].name, name) == 0 &&
		    s->row[i].q == q && s->row[i].segment == seg)
			return &s->row[i];
	fail_msg("no row %s/%d", name, (int)q);
	return NULL;
}

static void
assert_row(const hl_sens_row *r, double hm, double hp, double cm, double cp)
{
	assert_rel(r->hot_minus, hm, HAND);
	assert_rel(r->hot_plus, hp, HAND);
	assert_rel(r->cold_minus, cm, HAND);
	assert_rel(r->cold_plus, cp, HAND);
}

/* The four-stream problem (hl_gen_kemp4: Linnhoff et al., User Guide on
 * Process Integration, IChemE 1982; Kemp, Pinch Analysis and Process
 * Integration, 2nd ed. 2007, ch. 2; from memory, targets confirmed by a hand
 * cascade): ΔTmin 10 K, QHmin 20 kW, QCmin 60 kW, pinch at 85 °C shifted,
 * C2's shifted supply.
 * Derived by hand from QHmin = cold heat above 85 °C shifted − hot heat
 * above it = (2·55 + 4·60) − (3·80 + 1.5·60), and QCmin = QHmin + Σ hot −
 * Σ cold duty. */
static void
test_kemp4_by_hand(void **state)
{
	hl_case *c = hl_gen_kemp4();
	hl_sensitivity *s = sens(c, 10.0);

	(void)state;
	assert_int_equal(s->nrow, 12);
	assert_int_equal(s->nactive, 1);
	/* Above the pinch a cp counts its span above it; below, in QCmin. */
	assert_row(row_of(c, s, "C1", HL_SENS_CP, 0), 55, 55, -60, -60);
	assert_row(row_of(c, s, "H1", HL_SENS_CP, 0), -80, -80, 30, 30);
	assert_row(row_of(c, s, "C2", HL_SENS_CP, 0), 60, 60, 0, 0);
	assert_row(row_of(c, s, "H2", HL_SENS_CP, 0), -60, -60, 60, 60);
	/* An end away from the pinch moves one target by the stream's cp. */
	assert_row(row_of(c, s, "C1", HL_SENS_SUPPLY, 0), 0, 0, 2, 2);
	assert_row(row_of(c, s, "C1", HL_SENS_TARGET, 0), 2, 2, 0, 0);
	assert_row(row_of(c, s, "H1", HL_SENS_SUPPLY, 0), -3, -3, 0, 0);
	assert_row(row_of(c, s, "H1", HL_SENS_TARGET, 0), 0, 0, -3, -3);
	assert_row(row_of(c, s, "C2", HL_SENS_TARGET, 0), 4, 4, 0, 0);
	assert_row(row_of(c, s, "H2", HL_SENS_SUPPLY, 0), -1.5, -1.5, 0, 0);
	assert_row(row_of(c, s, "H2", HL_SENS_TARGET, 0), 0, 0, -1.5, -1.5);
	/* C2's supply is the pinch and carries it along: C2 loses 4 kW/K of
	 * duty above it while the others' net cp across it, 3 + 1.5 − 2 =
	 * 2.5 kW/K, moves from below to above: −4 + 2.5 = −1.5 for QHmin;
	 * QCmin gains the 4 kW/K C2 no longer takes: −1.5 + 4 = 2.5. */
	assert_row(row_of(c, s, "C2", HL_SENS_SUPPLY, 0), -1.5, -1.5, 2.5, 2.5);
	/* ΔTmin: every hot cp crossing the pinch, 3 + 1.5 = 4.5 kW/K. The
	 * targets at 20 K, 65 / 105 kW (doc/references.md, derived by hand
	 * cascade), agree: (65 − 20)/10 = (105 − 60)/10 = 4.5. */
	assert_row(&s->dt, 4.5, 4.5, 4.5, 4.5);
	assert_false(s->dt.kink);
	/* Bands with the defaults (±5 % cp, ±1 K), derived by hand cascades at
	 * the corners. QHmin high: cold C1 19→136 cp 2.1, C2 79→141 cp 4.2,
	 * hot H1 169→61 cp 2.85, H2 149→31 cp 1.425: the pinch stays at C2's
	 * supply, QHmin = 2.1·57 + 4.2·62 − 2.85·80 − 1.425·60 = 66.6 kW,
	 * QCmin there 66.6 + 475.95 − 506.1 = 36.45 kW. The other corner needs
	 * no hot utility at all: QHmin 0, QCmin = Σ hot − Σ cold = 109.85 kW. */
	assert_rel(s->hot.high, 66.6, HAND);
	assert_rel(s->hot.low, 0.0, HAND);
	assert_rel(s->cold.low, 36.45, HAND);
	assert_rel(s->cold.high, 109.85, HAND);
	/* First order at the high corner: 20 + Σ |derivative|·tolerance =
	 * 20 + 5.5 + 2 + 12 + 3 + 12 + 1.5 + 4 + 4.5 + 1.5 = 66 kW; the
	 * re-solve exceeds it by the cp × temperature cross terms. */
	assert_rel(s->hot.lin_high, 66.0, HAND);
	assert_true(s->hot.high > s->hot.lin_high);
	/* The ranking: H1 cp and C2 cp each move QHmin by 12 kW (0.15·80 and
	 * 0.2·60), the largest effects, tied and so kept in case order. */
	assert_int_equal(s->row[s->rank[0]].stream, 1);
	assert_int_equal(s->row[s->rank[1]].stream, 2);
	assert_int_equal(s->row[s->rank[0]].q, HL_SENS_CP);
	assert_rel(hl_sensitivity_effect(&s->row[s->rank[0]]), 12.0, HAND);
	assert_int_equal(s->row[s->rank[0]].rank, 1);
	hl_sensitivity_free(s);
	hl_case_free(c);
}

/* Derived by hand: hot 150→50 and cold 40→140 °C, both cp 1 kW/K, at ΔTmin
 * 10 K lie on one line in shifted temperatures (145→45), so every
 * temperature is a pinch and QHmin = QCmin = 0. Raising ΔTmin by δ lifts the
 * cold line above the hot one by δ: QHmin = QCmin = δ; lowering it changes
 * nothing. Lowering the cold supply by δ leaves δ kW of cold demand below
 * all hot heat (QHmin = δ, QCmin = 0); raising it leaves δ kW of hot heat
 * with nothing to take it (QHmin = 0, QCmin = δ). */
static void
test_kink_by_hand(void **state)
{
	hl_case *c = hl_case_create();
	hl_sensitivity *s;

	(void)state;
	hl_gen_add(c, "H", 150, 50, 1.0);
	hl_gen_add(c, "C", 40, 140, 1.0);
	s = sens(c, 10.0);
	assert_int_equal(s->nactive, 2);
	assert_row(&s->dt, 0, 1, 0, 1);
	assert_true(s->dt.kink);
	assert_row(row_of(c, s, "C", HL_SENS_SUPPLY, 0), -1, 0, 0, 1);
	assert_true(row_of(c, s, "C", HL_SENS_SUPPLY, 0)->kink);
	/* The hot supply likewise: lowering it by δ leaves the top δ kW of
	 * cold demand without hot heat (QHmin = δ, QCmin = 0); raising it
	 * leaves δ kW of hot heat above all cold demand (QHmin 0, QCmin δ). */
	assert_row(row_of(c, s, "H", HL_SENS_SUPPLY, 0), -1, 0, 0, 1);
	hl_sensitivity_free(s);
	hl_case_free(c);
}

/* ---- generated cases ---- */

/* A generated case made more varied: some streams given by duty, one cut
 * into two segments of different cp, some with their own ΔT contribution.
 * Temperatures stay on a 0.5 K grid and cp on a 0.05 kW/K grid, so distinct
 * boundaries and distinct flows never come closer than the steps below. */
static hl_case *
varied_case(hl_rng *r, int nhot, int ncold)
{
	hl_case *g = hl_gen_case(r, nhot, ncold), *c = hl_case_create();
	size_t i;

	for (i = 0; i < g->nstream; i++) {
		hl_stream s = g->stream[i];
		hl_segment seg[2];
		double u = hl_rng_uniform(r, 0, 1);
		double span = fabs(s.seg[0].supply - s.seg[0].target);

		seg[0] = s.seg[0];
		seg[0].by_duty = u < 0.3;
		s.seg = seg;
		if (u > 0.8)
			s.dt_contrib = 2.5 + floor(hl_rng_uniform(r, 0, 3));
		if (u > 0.55 && u < 0.8 && span >= 4.0) {
			double mid = seg[0].supply + (seg[0].target >
				     seg[0].supply ? 1.0 : -1.0) * floor(span / 2);

			seg[1] = seg[0];
			seg[0].target = mid;
			seg[1].supply = mid;
			seg[1].cp = seg[0].cp + 1.5;
			seg[1].by_duty = u < 0.65;
			s.nseg = 2;
		}
		assert_int_equal(hl_case_add_stream(c, &s, NULL), HL_OK);
	}
	hl_case_free(g);
	return c;
}

/* A copy of c with r's datum changed by delta, written from the meaning of
 * the data, not from the module: a segment given by duty keeps its duty when
 * an end moves, so its cp becomes duty / new span. */
static hl_case *
perturbed(const hl_case *c, const hl_sens_row *r, double delta)
{
	hl_case *d = hl_case_create();
	size_t i, j;

	for (i = 0; i < c->nstream; i++) {
		hl_stream s = c->stream[i];
		hl_segment seg[8];

		memcpy(seg, s.seg, s.nseg * sizeof *seg);
		s.seg = seg;
		j = r->q == HL_SENS_SUPPLY ? 0 : r->q == HL_SENS_TARGET ?
			s.nseg - 1 : r->segment;
		if (i == r->stream && r->q != HL_SENS_DTMIN) {
			double q = seg[j].cp * fabs(seg[j].supply - seg[j].target);

			if (r->q == HL_SENS_SUPPLY)
				seg[j].supply += delta;
			else if (r->q == HL_SENS_TARGET)
				seg[j].target += delta;
			else if (r->q == HL_SENS_CP)
				seg[j].cp += delta;
			else
				q += delta;
			if (seg[j].by_duty)
				seg[j].cp = q / fabs(seg[j].supply - seg[j].target);
		}
		assert_int_equal(hl_case_add_stream(d, &s, NULL), HL_OK);
	}
	return d;
}

static void
targets_at(const hl_case *c, const hl_sens_row *r, double dtmin, double delta,
	   double *qh, double *qc)
{
	hl_case *d = perturbed(c, r, delta);
	double dt = r->q == HL_SENS_DTMIN ? dtmin + delta : dtmin;

	assert_int_equal(hl_cascade_targets(d, dt, qh, qc, NULL), HL_OK);
	hl_case_free(d);
}

/* Steps: 1e-4 K moves no boundary onto another (0.5 K grid) nor a flow onto
 * another (at most ~50 kW/K · 1e-4 K < 0.05 kW); 1e-5 kW/K on cp or kW on
 * duty likewise (at most 300 K · 1e-5). */
static double
step_of(const hl_sens_row *r)
{
	return r->q == HL_SENS_CP || r->q == HL_SENS_DUTY ? 1e-5 : 1e-4;
}

/* One derivative pair against the finite differences: without a kink the
 * central difference equals it; with one, the forward and backward ones
 * equal the right and left derivatives and the central one lies between. */
static int
check_fd(double minus, double plus, int kink, double q0, double qp, double qm,
	 double h, const char *what)
{
	double central = (qp - qm) / (2 * h);
	double fwd = (qp - q0) / h, bwd = (q0 - qm) / h;
	double lo = fmin(minus, plus), hi = fmax(minus, plus);
	double slack = FD_REL * fmax(1.0, fmax(fabs(lo), fabs(hi)));

	if (!kink && hl_near(central, plus, FD_REL))
		return 0;
	if (kink && hl_near(fwd, plus, FD_REL) && hl_near(bwd, minus, FD_REL) &&
	    central >= lo - slack && central <= hi + slack)
		return 1;
	print_error("%s: minus %.12g plus %.12g, fd back %.12g fwd %.12g "
		    "central %.12g\n", what, minus, plus, bwd, fwd, central);
	fail();
	return 0;
}

static int
check_row_fd(const hl_case *c, const hl_sens_row *r, double dtmin, double qh0,
	     double qc0)
{
	double h = step_of(r), qhp, qcp, qhm, qcm;
	int k;

	targets_at(c, r, dtmin, h, &qhp, &qcp);
	targets_at(c, r, dtmin, -h, &qhm, &qcm);
	k = check_fd(r->hot_minus, r->hot_plus, r->kink, qh0, qhp, qhm, h,
		     "QHmin");
	check_fd(r->cold_minus, r->cold_plus, r->kink, qc0, qcp, qcm, h,
		 "QCmin");
	return k;
}

/* Where the pinch sits on one end only, ties are rare: give every other
 * case a stream with an end exactly at the pinch, so that ends coincide
 * there and the one-sided derivatives part. */
static void
add_pinch_end(hl_case *c, double dtmin, int n)
{
	hl_cascade *cas;
	double tp;

	assert_int_equal(hl_cascade_compute(c, dtmin, &cas, NULL), HL_OK);
	if (cas->npinch > 0) {
		tp = cas->t[cas->pinch[0]];
		if (n % 4 == 1)
			hl_gen_add(c, "Cpinch", tp - dtmin / 2,
				   tp - dtmin / 2 + 10 + n % 20, 0.5);
		else
			hl_gen_add(c, "Hpinch", tp + dtmin / 2 + 5 + n % 30,
				   tp + dtmin / 2, 0.5);
	}
	hl_cascade_free(cas);
}

/* Every analytic derivative agrees with a central finite difference of the
 * problem table where no pinch changes within the step, and the one-sided
 * pair brackets it where one does (issue 11). */
static void
test_finite_differences(void **state)
{
	hl_rng rng;
	int n, kinks = 0, rows = 0;

	(void)state;
	hl_rng_seed(&rng, 11);
	for (n = 0; n < 120; n++) {
		hl_case *c = varied_case(&rng, 1 + n % 5, 1 + n % 4);
		double dtmin = n % 3 == 0 ? 10.0 : floor(hl_rng_uniform(&rng, 0,
			       40));
		hl_sensitivity *s;
		double qh0, qc0;
		size_t i;

		if (n % 2)
			add_pinch_end(c, dtmin, n);
		s = sens(c, dtmin);
		assert_int_equal(hl_cascade_targets(c, dtmin, &qh0, &qc0, NULL),
				 HL_OK);
		for (i = 0; i < s->nrow; i++, rows++)
			kinks += check_row_fd(c, &s->row[i], dtmin, qh0, qc0);
		kinks += check_row_fd(c, &s->dt, dtmin, qh0, qc0);
		hl_sensitivity_free(s);
		hl_case_free(c);
	}
	/* Both branches were exercised. */
	assert_true(rows > 1000);
	print_message("%d rows, %d kinks\n", rows, kinks);
	assert_true(kinks > 30);
}

/* A stream that lies entirely above the pinch (and stays so) has
 * ∂QHmin/∂cp = +span for a cold stream, −span for a hot one, and
 * ∂QCmin/∂cp = 0, from the cascade and QC − QH = Σ hot − Σ cold; below the
 * pinch the mirror: ∂QHmin/∂cp = 0, ∂QCmin/∂cp = +span hot, −span cold
 * (common practice, no source). A duty moves the target by ±1 kW per kW. */
static void
test_above_below_pinch(void **state)
{
	hl_rng rng;
	int n, above = 0, below = 0;

	(void)state;
	hl_rng_seed(&rng, 12);
	for (n = 0; n < 200; n++) {
		hl_case *c = varied_case(&rng, 2 + n % 4, 2 + n % 3);
		hl_cascade *cas;
		hl_sensitivity *s;
		double tp;
		size_t i;

		assert_int_equal(hl_cascade_compute(c, 10.0, &cas, NULL), HL_OK);
		if (cas->npinch != 1 || cas->qh == 0.0 || cas->qc == 0.0) {
			hl_cascade_free(cas);
			hl_case_free(c);
			continue;
		}
		tp = cas->t[cas->pinch[0]];
		s = sens(c, 10.0);
		for (i = 0; i < s->nrow; i++) {
			const hl_sens_row *r = &s->row[i];
			const hl_stream *st = &c->stream[r->stream];
			const hl_segment *g = &st->seg[r->segment];
			double sh = hl_stream_shift(st, 10.0);
			double lo = fmin(hl_stream_supply(st), hl_stream_target(st));
			double hi = fmax(hl_stream_supply(st), hl_stream_target(st));
			double sign = st->kind == HL_HOT ? -1.0 : 1.0;
			double per = r->q == HL_SENS_DUTY ? 1.0 :
				     fabs(g->supply - g->target);

			if (r->q != HL_SENS_CP && r->q != HL_SENS_DUTY)
				continue;
			lo += st->kind == HL_HOT ? -sh : sh;
			hi += st->kind == HL_HOT ? -sh : sh;
			if (lo >= tp) {
				assert_rel(r->hot_plus, sign * per, HAND);
				assert_rel(r->hot_minus, sign * per, HAND);
				assert_rel(r->cold_plus, 0.0, HAND);
				assert_rel(r->cold_minus, 0.0, HAND);
				above++;
			} else if (hi <= tp) {
				assert_rel(r->hot_plus, 0.0, HAND);
				assert_rel(r->hot_minus, 0.0, HAND);
				assert_rel(r->cold_plus, -sign * per, HAND);
				assert_rel(r->cold_minus, -sign * per, HAND);
				below++;
			}
		}
		hl_sensitivity_free(s);
		hl_cascade_free(cas);
		hl_case_free(c);
	}
	assert_true(above > 20 && below > 20);
}

/* A small case whose corners can all be re-solved: four streams, one given
 * by duty, tolerances random but well inside every span. */
static hl_case *
corner_case(hl_rng *r)
{
	hl_case *c = varied_case(r, 2, 2);
	size_t i;

	c->set.cp_tol = 0.05;
	for (i = 0; i < c->nstream; i++) {
		hl_stream *s = &c->stream[i];
		double span = fabs(s->seg[0].supply - s->seg[0].target);

		span = fmin(span, fabs(s->seg[s->nseg - 1].supply -
				       s->seg[s->nseg - 1].target));
		s->t_tol = fmin(hl_rng_uniform(r, 0, 3), span / 3);
		if (i % 2)
			s->cp_tol = hl_rng_uniform(r, 0, 0.2);
	}
	return c;
}

/* The targets with every datum moved by signs[i]·tol of row i (signs in
 * [−1, 1]), again from the meaning of the data. */
static void
targets_moved(const hl_case *c, const hl_sensitivity *s, const double *sg,
	      double *qh, double *qc)
{
	hl_case *d = hl_case_create();
	size_t i, j, ri = 0;

	for (i = 0; i < c->nstream; i++) {
		hl_stream st = c->stream[i];
		hl_segment seg[8];
		double q[8];

		memcpy(seg, st.seg, st.nseg * sizeof *seg);
		for (j = 0; j < st.nseg; j++)
			q[j] = seg[j].cp * fabs(seg[j].supply - seg[j].target);
		st.seg = seg;
		seg[0].supply += sg[ri] * s->row[ri].tol;
		seg[st.nseg - 1].target += sg[ri + 1] * s->row[ri + 1].tol;
		for (j = 0; j < st.nseg; j++) {
			const hl_sens_row *r = &s->row[ri + 2 + j];

			if (seg[j].by_duty)
				seg[j].cp = (q[j] + sg[ri + 2 + j] * r->tol) /
					fabs(seg[j].supply - seg[j].target);
			else
				seg[j].cp += sg[ri + 2 + j] * r->tol;
		}
		ri += 2 + st.nseg;
		assert_int_equal(hl_case_add_stream(d, &st, NULL), HL_OK);
	}
	assert_int_equal(hl_cascade_targets(d, s->dtmin, qh, qc, NULL), HL_OK);
	hl_case_free(d);
}

/* The band contains the re-solve at every corner of the tolerance box (and
 * at random points inside it), and its ends are attained at corners: the
 * targets are monotone in every datum, so the band is exact. */
static void
test_band_contains_corners(void **state)
{
	hl_rng rng;
	int n;

	(void)state;
	hl_rng_seed(&rng, 13);
	for (n = 0; n < 12; n++) {
		hl_case *c = corner_case(&rng);
		hl_sensitivity *s = sens(c, 10.0);
		double sg[32], qh, qc, hmax = -1, hmin = HUGE_VAL;
		double cmax = -1, cmin = HUGE_VAL, eps = 1e-9 * (1 + s->hot.high +
			      s->cold.high);
		unsigned long m, corners;
		size_t i;

		assert_true(s->nrow <= 16);
		assert_int_equal(s->collapsed, 0);
		corners = 1ul << s->nrow;
		for (m = 0; m < corners + 200; m++) {
			for (i = 0; i < s->nrow; i++)
				sg[i] = m < corners ? ((m >> i) & 1 ? 1.0 : -1.0)
						    : hl_rng_uniform(&rng, -1, 1);
			targets_moved(c, s, sg, &qh, &qc);
			assert_true(qh >= s->hot.low - eps &&
				    qh <= s->hot.high + eps);
			assert_true(qc >= s->cold.low - eps &&
				    qc <= s->cold.high + eps);
			hmax = fmax(hmax, qh);
			hmin = fmin(hmin, qh);
			cmax = fmax(cmax, qc);
			cmin = fmin(cmin, qc);
		}
		assert_rel(hmax, s->hot.high, 1e-9);
		assert_rel(hmin, s->hot.low, 1e-9);
		assert_rel(cmax, s->cold.high, 1e-9);
		assert_rel(cmin, s->cold.low, 1e-9);
		/* The derivatives never point against the corner chosen. */
		for (i = 0; i < s->nrow; i++) {
			const hl_sens_row *r = &s->row[i];

			assert_true(r->hot_plus * r->hot_minus >= -1e-12);
			assert_true(r->cold_plus * r->cold_minus >= -1e-12);
		}
		hl_sensitivity_free(s);
		hl_case_free(c);
	}
}

/* In a tiny box nothing but the linear terms survive: the first-order
 * estimate at the corners meets the re-solve to second order. */
static void
test_linear_band_small_box(void **state)
{
	hl_rng rng;
	int n;

	(void)state;
	hl_rng_seed(&rng, 14);
	for (n = 0; n < 100; n++) {
		hl_case *c = varied_case(&rng, 1 + n % 4, 1 + n % 5);
		hl_sensitivity *s;
		size_t i;

		c->set.cp_tol = 1e-7;
		c->set.t_tol = 1e-6;
		s = sens(c, 10.0);
		for (i = 0; i < 2; i++) {
			const hl_sens_band *b = i ? &s->cold : &s->hot;
			double w = 1e-3 * (b->high - b->low) + 1e-8;

			assert_true(fabs(b->lin_high - b->high) <= w);
			assert_true(fabs(b->lin_low - b->low) <= w);
		}
		hl_sensitivity_free(s);
		hl_case_free(c);
	}
}

/* The surplus above a fixed shifted temperature, summed from its meaning. */
static double
surplus_above(const hl_case *c, double dtmin, double t)
{
	double r = 0.0;
	size_t i, j;

	for (i = 0; i < c->nstream; i++) {
		const hl_stream *s = &c->stream[i];
		double sh = hl_stream_shift(s, dtmin) * (s->kind == HL_HOT ? -1 : 1);

		for (j = 0; j < s->nseg; j++) {
			double hi = fmax(s->seg[j].supply, s->seg[j].target) + sh;
			double lo = fmin(s->seg[j].supply, s->seg[j].target) + sh;
			double q = s->seg[j].cp * fmax(0.0, hi - fmax(lo, t));

			r += s->kind == HL_HOT ? q : -q;
		}
	}
	return r;
}

/* The hook for the utility LP: dR(t)/dx at a fixed temperature against a
 * central finite difference (t off the 0.5 K grid: no kink). */
static void
test_surplus_hook(void **state)
{
	hl_rng rng;
	int n;

	(void)state;
	hl_rng_seed(&rng, 15);
	for (n = 0; n < 40; n++) {
		hl_case *c = varied_case(&rng, 2, 2);
		hl_sensitivity *s = sens(c, 10.0);
		double t = floor(hl_rng_uniform(&rng, 20, 300)) + 0.25;
		size_t i;

		for (i = 0; i < s->nrow; i++) {
			double minus, plus, h = step_of(&s->row[i]);
			hl_case *p = perturbed(c, &s->row[i], h);
			hl_case *m = perturbed(c, &s->row[i], -h);
			double fd = (surplus_above(p, 10.0, t) -
				     surplus_above(m, 10.0, t)) / (2 * h);

			assert_int_equal(hl_sensitivity_surplus(c, 10.0,
				&s->row[i], t, 0, &minus, &plus, NULL), HL_OK);
			assert_rel(plus, fd, FD_REL);
			assert_rel(minus, fd, FD_REL);
			hl_case_free(p);
			hl_case_free(m);
		}
		hl_sensitivity_free(s);
		hl_case_free(c);
	}
}

/* The hook with t tied to the supply end that the row moves: the surplus
 * at the moving end, against finite differences that move both. */
static void
test_surplus_hook_tied(void **state)
{
	hl_rng rng;
	int n, checked = 0;

	(void)state;
	hl_rng_seed(&rng, 16);
	for (n = 0; n < 40; n++) {
		hl_case *c = varied_case(&rng, 2, 3);
		hl_sensitivity *s = sens(c, 10.0);
		size_t i;

		for (i = 0; i < s->nrow; i++) {
			const hl_sens_row *r = &s->row[i];
			const hl_stream *st = &c->stream[r->stream];
			double h = 1e-4, minus, plus, t, r0, rp, rm;
			hl_case *p, *m;

			if (r->q != HL_SENS_SUPPLY)
				continue;
			t = hl_stream_supply(st) + hl_stream_shift(st, 10.0) *
			    (st->kind == HL_HOT ? -1 : 1);
			p = perturbed(c, r, h);
			m = perturbed(c, r, -h);
			r0 = surplus_above(c, 10.0, t);
			rp = surplus_above(p, 10.0, t + h);
			rm = surplus_above(m, 10.0, t - h);
			assert_int_equal(hl_sensitivity_surplus(c, 10.0, r, t, 1,
				&minus, &plus, NULL), HL_OK);
			check_fd(minus, plus, !hl_near(minus, plus, 1e-12), r0, rp,
				 rm, h, "surplus at the moving end");
			checked++;
			hl_case_free(p);
			hl_case_free(m);
		}
		hl_sensitivity_free(s);
		hl_case_free(c);
	}
	assert_true(checked > 100);
}

/* One hot and one cold utility: the cost (price·load·hours, per MWh) has
 * the derivative of 8000/1000·(40·QHmin + 5·QCmin) by a finite difference
 * of re-solved targets; several levels leave it to the utility LP. */
static void
test_cost(void **state)
{
	hl_case *c = hl_gen_kemp4();
	hl_sensitivity *s;
	size_t i;

	(void)state;
	s = sens(c, 10.0);
	assert_int_equal(s->cost, HL_SENS_COST_NONE);
	assert_true(isnan(s->row[0].cost_plus));
	hl_sensitivity_free(s);
	hl_gen_add_utility(c, "steam", HL_HOT, 200, 200, 40, NAN);
	hl_gen_add_utility(c, "water", HL_COLD, 20, 20, 5, NAN);
	s = sens(c, 10.0);
	assert_int_equal(s->cost, HL_SENS_COST_SINGLE);
	for (i = 0; i < s->nrow; i++) {
		double h = step_of(&s->row[i]), qhp, qcp, qhm, qcm;

		targets_at(c, &s->row[i], 10.0, h, &qhp, &qcp);
		targets_at(c, &s->row[i], 10.0, -h, &qhm, &qcm);
		assert_rel(s->row[i].cost_plus, 8.0 * (40 * (qhp - qhm) +
			    5 * (qcp - qcm)) / (2 * h), FD_REL);
	}
	hl_sensitivity_free(s);
	hl_gen_add_utility(c, "LP steam", HL_HOT, 140, 140, 20, NAN);
	s = sens(c, 10.0);
	assert_int_equal(s->cost, HL_SENS_COST_LEVELS);
	assert_false(isnan(s->row[0].cost_plus) || isnan(s->dt.cost_minus));
	hl_sensitivity_free(s);
	hl_case_free(c);
}

/* ---- several utility levels: the utility LP's cost ---- */

/* c's utilities appended to d, utility ui's temperature moved by delta
 * (q: supply, target, or level = both). */
static void
copy_utilities(hl_case *d, const hl_case *c, size_t ui, hl_sens_quantity q,
	       double delta)
{
	size_t u;

	for (u = 0; u < c->nutil; u++) {
		hl_utility x = c->util[u];

		if (u == ui && (q == HL_SENS_SUPPLY || q == HL_SENS_LEVEL))
			x.supply += delta;
		if (u == ui && (q == HL_SENS_TARGET || q == HL_SENS_LEVEL))
			x.target += delta;
		assert_int_equal(hl_case_add_utility(d, &x, NULL), HL_OK);
	}
}

/* The utility LP's yearly cost, re-solved; NAN when it has no answer. */
static double
lp_cost(const hl_case *c, double dtmin)
{
	hl_utility_lp *lp;
	double v;

	if (hl_utility_lp_solve(c, dtmin, NULL, &lp, NULL) != HL_OK)
		return NAN;
	v = lp->cost;
	hl_utility_lp_free(lp);
	return v;
}

static double
cost_at(const hl_case *c, const hl_sens_row *r, double dtmin, double delta)
{
	hl_case *d = perturbed(c, r, delta);
	double v;

	copy_utilities(d, c, (size_t)-1, HL_SENS_SUPPLY, 0.0);
	v = lp_cost(d, r->q == HL_SENS_DTMIN ? dtmin + delta : dtmin);
	hl_case_free(d);
	return v;
}

static double
cost_at_utility(const hl_case *c, const hl_sens_urow *r, double dtmin,
		double delta)
{
	hl_case *d = perturbed(c, &(hl_sens_row){ .q = HL_SENS_DTMIN }, 0.0);
	double v;

	copy_utilities(d, c, r->util, r->q, delta);
	v = lp_cost(d, dtmin);
	hl_case_free(d);
	return v;
}

/* Cost derivatives are compared within FD_REL of their size plus 1e-10 of
 * the yearly cost per unit: GLPK holds the optimal face to about that, and a
 * derivative of 1e-10 of the whole bill per kelvin is zero for any use. */
static int
near_cost(double got, double want, double c0)
{
	return fabs(got - want) <= FD_REL * fmax(1.0, fabs(want)) +
	       1e-10 * fabs(c0);
}

/* An infinite one-sided derivative says the LP has no answer a step that
 * way; otherwise the pair against the finite differences: without a kink
 * the central difference equals the derivative, with one the forward and
 * backward differences equal the right and left ones and the central one
 * lies between. Returns 1 for a kink, 2 for an infinite side. */
static int
check_cost_fd(double minus, double plus, double c0, double cp, double cm,
	      double h, const char *what)
{
	double central = (cp - cm) / (2 * h), fwd = (cp - c0) / h;
	double bwd = (c0 - cm) / h;
	int k = !near_cost(minus, plus, c0);

	if (isinf(plus) || isinf(minus)) {
		assert_true(isinf(plus) ? plus > 0 && isnan(cp) : !isnan(cp));
		assert_true(isinf(minus) ? minus < 0 && isnan(cm) : !isnan(cm));
		return 2;
	}
	if (isnan(cp) || isnan(cm) || isnan(minus) || isnan(plus)) {
		print_error("%s: minus %.12g plus %.12g, cost at -h %.12g, at "
			    "+h %.12g\n", what, minus, plus, cm, cp);
		fail();
	}
	if (!k && near_cost(central, plus, c0))
		return 0;
	/* One-sided differences err by O(h) where the pieces curve (cp times
	 * a moving end): 1e-5 for them, 1e-6 for the central one. */
	if (k && fabs(fwd - plus) <= 10 * FD_REL * fmax(1.0, fabs(plus)) +
	    1e-10 * fabs(c0) && fabs(bwd - minus) <= 10 * FD_REL *
	    fmax(1.0, fabs(minus)) + 1e-10 * fabs(c0) &&
	    central >= fmin(minus, plus) - 1e-10 * fabs(c0) - FD_REL &&
	    central <= fmax(minus, plus) + 1e-10 * fabs(c0) + FD_REL)
		return 1;
	print_error("%s: minus %.12g plus %.12g, fd back %.12g fwd %.12g "
		    "central %.12g\n", what, minus, plus, bwd, fwd, central);
	fail();
	return 0;
}

/* A generated case with utilities at off-grid temperatures (0.3 K off the
 * streams' 0.5 K grid): a high-pressure level for anything, a cheaper
 * middle level with a random cap, a hot oil with a range, cooling water
 * with a range, a cheap cold level that raises steam, and a refrigerant as
 * the last resort. */
static hl_case *
levels_case(hl_rng *r)
{
	hl_case *c = varied_case(r, 3, 3);
	double mp = floor(hl_rng_uniform(r, 120, 230)) + 0.3;
	double oil = floor(hl_rng_uniform(r, 200, 290)) + 0.3;
	double raise = floor(hl_rng_uniform(r, 90, 170)) + 0.3;

	hl_gen_add_utility(c, "HP", HL_HOT, 330.3, 330.3, 40, NAN);
	hl_gen_add_utility(c, "MP", HL_HOT, mp, mp, 22, floor(
		hl_rng_uniform(r, 0, 400)) + 0.5);
	hl_gen_add_utility(c, "oil", HL_HOT, oil, oil - 60, 30, NAN);
	hl_gen_add_utility(c, "CW", HL_COLD, 20.3, 35.3, 3, NAN);
	hl_gen_add_utility(c, "raise", HL_COLD, raise, raise, 1, floor(
		hl_rng_uniform(r, 0, 300)) + 0.5);
	hl_gen_add_utility(c, "refrigerant", HL_COLD, -10.3, -10.3, 25, NAN);
	return c;
}

/* Every analytic cost derivative against a central finite difference of
 * the re-solved utility LP (issue 11): equal where no basis changes within
 * the step, the one-sided pair bracketing it where one does. */
static void
test_cost_levels_fd(void **state)
{
	hl_rng rng;
	int n, rows = 0, kinks = 0, urows = 0;

	(void)state;
	hl_rng_seed(&rng, 21);
	for (n = 0; n < 30; n++) {
		hl_case *c = levels_case(&rng);
		double c0 = lp_cost(c, 10.0);
		hl_sensitivity *s;
		size_t i;

		/* HP and the refrigerant, both unlimited, always serve: the
		 * LP has an answer here and a step away (a re-solve that
		 * failed once was GLPK's presolver, hl_glpk_simplex_direct). */
		assert_false(isnan(c0));
		s = sens(c, 10.0);
		assert_int_equal(s->cost, HL_SENS_COST_LEVELS);
		for (i = 0; i <= s->nrow; i++) {
			const hl_sens_row *r = i < s->nrow ? &s->row[i] : &s->dt;
			double h = step_of(r);

			char what[96];

			snprintf(what, sizeof what, "case %d, cost by %s of "
				 "stream %zu", n, hl_sensitivity_quantity_name(
				 r->q), r->stream);
			kinks += check_cost_fd(r->cost_minus, r->cost_plus, c0,
				cost_at(c, r, 10.0, h), cost_at(c, r, 10.0, -h),
				h, what) == 1;
			rows++;
		}
		assert_int_equal(s->nurow, 8);
		for (i = 0; i < s->nurow; i++) {
			const hl_sens_urow *u = &s->urow[i];

			kinks += check_cost_fd(u->cost_minus, u->cost_plus, c0,
				cost_at_utility(c, u, 10.0, 1e-4),
				cost_at_utility(c, u, 10.0, -1e-4), 1e-4,
				"utility cost") == 1;
			urows++;
		}
		hl_sensitivity_free(s);
		hl_case_free(c);
	}
	print_message("cost derivatives: %d stream rows, %d utility rows, "
		      "%d kinks\n", rows, urows, kinks);
	assert_true(rows > 300 && urows > 100);
}

/* Common practice, no source: a cold stream entirely above the pinch, with
 * one hot level carrying all the heat there, costs price × span × hours
 * per kW/K of cp. The four-stream
 * problem (Linnhoff et al. 1982; targets confirmed by a hand cascade): C2
 * 80→140 °C lies above the 85 °C shifted pinch (span 60 K). Steam at 250 °C (40/MWh) carries all 20 kW: the second
 * level at 100 °C costs more (45/MWh) and stays idle; water at 20 °C
 * (5/MWh) below the pinch. The same case with LP steam at 10/MWh takes 15
 * kW from it (the flow through 95 °C shifted), which `heatloom targets`
 * shows; there C2's cp costs 40·45 + 10·15 per year-hour, not this. */
static void
test_cost_levels_above_pinch(void **state)
{
	hl_case *c = hl_gen_kemp4();
	hl_sensitivity *s;

	(void)state;
	hl_gen_add_utility(c, "HP steam", HL_HOT, 250, 250, 40, NAN);
	hl_gen_add_utility(c, "LP steam", HL_HOT, 100, 100, 45, NAN);
	hl_gen_add_utility(c, "water", HL_COLD, 20, 20, 5, NAN);
	s = sens(c, 10.0);
	assert_int_equal(s->cost, HL_SENS_COST_LEVELS);
	assert_rel(row_of(c, s, "C2", HL_SENS_CP, 0)->cost_plus,
		    40 * 60 * 8.0, HAND);
	assert_rel(row_of(c, s, "C2", HL_SENS_CP, 0)->cost_minus,
		    40 * 60 * 8.0, HAND);
	/* H1 also has 30 K below the pinch, where its cp is rejected to the
	 * water: −80 kW per kW/K of steam and +30 of water. */
	assert_rel(row_of(c, s, "H1", HL_SENS_CP, 0)->cost_plus,
		    (-40 * 80 + 5 * 30) * 8.0, HAND);
	/* The idle level's temperature costs nothing either way. */
	assert_rel(s->urow[1].cost_plus, 0.0, HAND);
	assert_rel(s->urow[1].cost_minus, 0.0, HAND);
	/* H2 ends at 30 °C, 25 °C shifted, the water's own level: a lower
	 * target leaves heat below any cold utility, an infinite cost a step
	 * that way, and that datum ranks first. Next come the finite cost
	 * moves, largest first: C2's cp (8·40·60 × its ±0.2 kW/K = 3840). */
	assert_true(isinf(row_of(c, s, "H2", HL_SENS_TARGET, 0)->cost_minus));
	assert_int_equal(row_of(c, s, "H2", HL_SENS_TARGET, 0)->rank, 1);
	assert_rel(hl_sensitivity_effect(&s->row[s->rank[1]]), 3840.0, HAND);
	hl_sensitivity_free(s);
	hl_case_free(c);
}

/* Tolerances out of range are refused with the stream's name. */
static void
test_bad_tolerance(void **state)
{
	hl_case *c = hl_gen_kemp4();
	hl_cascade *cas;
	hl_sensitivity *s;
	hl_error err;

	(void)state;
	assert_int_equal(hl_cascade_compute(c, 10.0, &cas, NULL), HL_OK);
	c->stream[1].cp_tol = 5.0;
	assert_int_equal(hl_sensitivity_compute(c, cas, &s, &err), HL_EINPUT);
	assert_null(s);
	assert_non_null(strstr(err.text, "'H1': cp_tol 5 is a fraction"));
	assert_int_equal(hl_case_validate(c, &err), HL_EINPUT);
	c->stream[1].cp_tol = NAN;
	c->stream[2].t_tol = -1.0;
	assert_int_equal(hl_sensitivity_compute(c, cas, &s, &err), HL_EINPUT);
	assert_non_null(strstr(err.text, "'C2': t_tol must lie"));
	hl_cascade_free(cas);
	hl_case_free(c);
}

/* A segment narrower than twice its temperature tolerance vanishes at the
 * corner that shrinks it: a hot 100→99 °C stream (1 K, ±1 K on each end)
 * added to the four-stream problem leaves that corner as it was without it,
 * QHmin 66.6 kW (derived by hand above). */
static void
test_collapse(void **state)
{
	hl_case *c = hl_gen_kemp4();
	hl_sensitivity *s;

	(void)state;
	hl_gen_add(c, "H3", 100, 99, 50.0);
	s = sens(c, 10.0);
	assert_int_equal(s->collapsed, 1);
	assert_rel(s->hot.high, 66.6, HAND);
	hl_sensitivity_free(s);
	hl_case_free(c);
}

int
main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_kemp4_by_hand),
		cmocka_unit_test(test_kink_by_hand),
		cmocka_unit_test(test_finite_differences),
		cmocka_unit_test(test_above_below_pinch),
		cmocka_unit_test(test_band_contains_corners),
		cmocka_unit_test(test_linear_band_small_box),
		cmocka_unit_test(test_surplus_hook),
		cmocka_unit_test(test_surplus_hook_tied),
		cmocka_unit_test(test_cost),
		cmocka_unit_test(test_cost_levels_fd),
		cmocka_unit_test(test_cost_levels_above_pinch),
		cmocka_unit_test(test_bad_tolerance),
		cmocka_unit_test(test_collapse),
	};

	return cmocka_run_group_tests(tests, NULL, NULL);
}
