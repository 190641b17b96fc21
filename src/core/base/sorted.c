/* sorted.c - shared sort and binary search over temperature arrays. */
#include <stdlib.h>

#include "sorted.h"

int
hl_sorted_cmp_asc(const void *a, const void *b)
{
	double x = *(const double *)a, y = *(const double *)b;

	return (x > y) - (x < y);
}

int
hl_sorted_cmp_desc(const void *a, const void *b)
{
	double x = *(const double *)a, y = *(const double *)b;

	return (x < y) - (x > y);
}

static size_t
unique(double *t, size_t n)
{
	size_t i, u = 0;

	for (i = 0; i < n; i++)
		if (u == 0 || t[i] != t[u - 1])
			t[u++] = t[i];
	return u;
}

size_t
hl_sorted_unique_asc(double *t, size_t n)
{
	qsort(t, n, sizeof *t, hl_sorted_cmp_asc);
	return unique(t, n);
}

size_t
hl_sorted_unique_desc(double *t, size_t n)
{
	qsort(t, n, sizeof *t, hl_sorted_cmp_desc);
	return unique(t, n);
}

size_t
hl_sorted_find_asc(const double *t, size_t n, double v)
{
	size_t lo = 0, hi = n;

	while (lo < hi) {
		size_t mid = lo + (hi - lo) / 2;

		if (t[mid] < v)
			lo = mid + 1;
		else
			hi = mid;
	}
	return lo;
}

size_t
hl_sorted_find_desc(const double *t, size_t n, double v)
{
	size_t lo = 0, hi = n;

	while (lo < hi) {
		size_t mid = lo + (hi - lo) / 2;

		if (t[mid] > v)
			lo = mid + 1;
		else
			hi = mid;
	}
	return lo;
}
