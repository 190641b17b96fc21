/* test_sweep.c - the ΔTmin sweep and its optimum. */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>
#include <string.h>
#include <cmocka.h>

#include "gen.h"
#include "sweep.h"

/* Energy cost grows with ΔTmin and the area target shrinks (common
 * practice, no source), on generated cases with one hot and one cold
 * utility spanning every temperature. */
static void
test_monotone(void **state)
{
	hl_rng r;
	int n;

	(void)state;
	hl_rng_seed(&r, 21);
	for (n = 0; n < 30; n++) {
		hl_case *c = hl_gen_case(&r, 2 + n % 4, 2 + n % 3);
		hl_sweep *sw;
		size_t i;

		hl_gen_add_utility(c, "steam", HL_HOT, 400, 400, 30, NAN);
		hl_gen_add_utility(c, "brine", HL_COLD, -50, -40, 3, NAN);
		assert_int_equal(hl_sweep_run(c, 1, 40, 1, &sw, NULL), HL_OK);
		assert_int_equal(sw->n, 40);
		for (i = 1; i < sw->n; i++) {
			const hl_supertargets *a = &sw->pt[i - 1].st;
			const hl_supertargets *b = &sw->pt[i].st;

			assert_true(sw->pt[i].ok);
			assert_true(b->energy_cost >= a->energy_cost * (1 - 1e-9)
				    - 1e-9);
			assert_true(b->area <= a->area * (1 + 1e-9) + 1e-9);
		}
		/* The refined optimum is never worse than any grid point. */
		for (i = 0; i < sw->n; i++)
			assert_true(sw->optimum.total_cost <=
				    sw->pt[i].st.total_cost * (1 + 1e-12));
		hl_sweep_free(sw);
		hl_case_free(c);
	}
}

/* ΔTmin 0 has no bounded area: the point is kept without an answer and the
 * sweep goes on. */
static void
test_zero_point(void **state)
{
	hl_case *c = hl_case_create();
	hl_sweep *sw;

	(void)state;
	hl_gen_add(c, "H", 100, 50, 1.0);
	hl_gen_add(c, "C", 50, 100, 1.0);
	assert_int_equal(hl_sweep_run(c, 0, 4, 1, &sw, NULL), HL_OK);
	assert_false(sw->pt[0].ok);
	assert_non_null(strstr(sw->pt[0].note, "unbounded"));
	assert_true(sw->pt[1].ok);
	hl_sweep_free(sw);
	hl_case_free(c);
}

static void
test_bad_grid(void **state)
{
	hl_case *c = hl_case_create();
	hl_sweep *sw;
	hl_error err;

	(void)state;
	hl_gen_add(c, "H", 100, 50, 1.0);
	assert_int_equal(hl_sweep_run(c, 5, 1, 1, &sw, &err), HL_EUSAGE);
	assert_int_equal(hl_sweep_run(c, 0, 1e6, 1e-3, &sw, &err), HL_EUSAGE);
	hl_case_free(c);
}

int
main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_monotone),
		cmocka_unit_test(test_zero_point),
		cmocka_unit_test(test_bad_grid),
	};

	return cmocka_run_group_tests(tests, NULL, NULL);
}
