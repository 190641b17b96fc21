/* sorted.h - sorting and searching the temperature arrays of the stages.
 *
 * Every stage builds a duplicate-free array of temperatures, rising or
 * falling, then finds segment ends in it by binary search: O(n log n) in all.
 */
#ifndef HL_SORTED_H
#define HL_SORTED_H

#include <stddef.h>

/* qsort comparators on doubles. */
int hl_sorted_cmp_asc(const void *a, const void *b);
int hl_sorted_cmp_desc(const void *a, const void *b);

/* Sort t[0..n) rising (or falling) and drop repeats; returns the new n. */
size_t hl_sorted_unique_asc(double *t, size_t n);
size_t hl_sorted_unique_desc(double *t, size_t n);

/* Index of the first element not below (asc) / not above (desc) v: the
 * index of v itself when present. */
size_t hl_sorted_find_asc(const double *t, size_t n, double v);
size_t hl_sorted_find_desc(const double *t, size_t n, double v);

#endif
