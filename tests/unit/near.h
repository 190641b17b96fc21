/* near.h - the one closeness test of the unit tests.
 *
 * assert_rel(got, want, rel) fails the test, naming the caller's line,
 * unless |got - want| <= rel * max(1, |want|): relative to want, absolute
 * below 1. A NaN never passes. Include after <cmocka.h>.
 */
#ifndef HL_TEST_NEAR_H
#define HL_TEST_NEAR_H

#include <math.h>

static inline int
hl_near(double got, double want, double rel)
{
	double scale = fabs(want) > 1.0 ? fabs(want) : 1.0;

	return fabs(got - want) <= rel * scale;
}

static inline void
hl_assert_rel(double got, double want, double rel, const char *file,
	      int line)
{
	if (!hl_near(got, want, rel)) {
		print_error("got %.15g, want %.15g (within %g)\n", got, want,
			    rel);
		_fail(file, line);
	}
}

#define assert_rel(got, want, rel) \
	hl_assert_rel((got), (want), (rel), __FILE__, __LINE__)

#endif
