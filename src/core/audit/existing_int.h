/* existing_int.h - shared by existing.c, existing_walk.c and
 * existing_size.c; not part of the library's contract. */
#ifndef HL_EXISTING_INT_H
#define HL_EXISTING_INT_H

#include "existing.h"

typedef enum { HL_GAP_HOLE = 0, HL_GAP_END, HL_GAP_WHOLE } hl_gap_kind;

/* A stretch of a stream that no row covers. */
typedef struct {
	long stream;
	double q0, q1;                 /* kW from the supply end */
	hl_gap_kind kind;
	const hl_existing_unit *prev;  /* the unit before it, NULL when none */
	const hl_existing_unit *next;  /* the unit after it (a hole), or NULL */
} hl_gap;

typedef struct {
	const hl_case *c;
	hl_existing *net;
	hl_error *err;
	hl_gap *gap;
	size_t ngap, gap_cap;
} hl_existing_work;

/* Append a warning; -1 when out of memory. */
int hl_existing_warn(hl_existing *net, const char *file, long line,
		     const char *fmt, ...)
	__attribute__((format(printf, 4, 5)));

/* The stream's own tolerances, else the settings'. */
double hl_existing_t_tol(const hl_case *c, const hl_stream *s);
double hl_existing_cp_tol(const hl_case *c, const hl_stream *s);

/* Duties against the given temperatures of every row unit. */
hl_status hl_existing_balance(hl_existing_work *w);
/* Place every row unit on its streams and record the gaps. */
hl_status hl_existing_walk(hl_existing_work *w);
/* Approach, U, F, shells and area of unit u (row: its row, NULL for a
 * gap). */
hl_status hl_existing_size(hl_existing_work *w, hl_existing_unit *u,
			   const hl_unit *row);

#endif
