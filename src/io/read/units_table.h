/* units_table.h - the exchanger list (CSV) that `heatloom size` reads.
 *
 * One row per exchanger, columns in any order, names case-insensitive
 * (doc/formats.md, "Exchanger list"):
 *	name, hot_in, hot_out, cold_in, cold_out      required, °C
 *	duty (kW) and/or hot_cp, cold_cp (kW/K)        at least one of them
 *	u, or h_hot and h_cold (kW/(m²·K))            at least one of them
 *	type (shell-and-tube | counterflow | plate | double-pipe |
 *	air-cooler | fired-heater), fmin, xp, cost_a, cost_b, cost_c,
 *	largest (m² per shell, MW per fired heater)    optional
 * An empty cell means "not given". The reader checks every row as data: the
 * numbers, the four temperatures (a counterflow unit must be able to do the
 * job), the heat balance, the coefficients, the options; the first bad row
 * ends the read with HL_EINPUT and a message "unit 'NAME': …" carrying the
 * file and line. Whether a shell-and-tube unit can be built is for the
 * sizing to say, not the reader.
 *
 * Heat balance: the duty follows from duty, hot_cp·(hot_in − hot_out) or
 * cold_cp·(cold_out − cold_in); every pair given must agree within
 * HL_UNITS_BALANCE_TOL of the larger. With no duty and both cp the duty is
 * the mean of the two sides. A cp on an isothermal side (condensing,
 * boiling) is refused: only duty can say how much heat that is.
 *
 * Coefficients: u when given; h_hot with h_cold then must agree with it
 * (same tolerance) and one h alone beside u is refused as ambiguous. Without
 * u, one missing h is left NaN for the caller to fill with its default.
 *
 * Ownership: hl_units_table_free() frees the table and every name in it.
 */
#ifndef HL_UNITS_TABLE_H
#define HL_UNITS_TABLE_H

#include <stddef.h>

#include "status.h"

/* Relative gap allowed between two statements of one duty or one U: room
 * for data-sheet rounding; a larger gap is a wrong temperature or cp. */
#define HL_UNITS_BALANCE_TOL 0.01

/* One row as given; optional numbers are NaN when not given. */
typedef struct {
	char *name;
	long line;
	double hot_in, hot_out;    /* °C */
	double cold_in, cold_out;  /* °C */
	double duty;               /* kW, > 0: given or from the cp */
	double duty_hot;           /* kW, hot_cp·(hot_in − hot_out), or NaN */
	double duty_cold;          /* kW, cold_cp·(cold_out − cold_in), or NaN */
	double u;                  /* kW/(m²·K), or NaN */
	double h_hot, h_cold;      /* kW/(m²·K), or NaN */
	int type;                  /* hl_exchanger_type, -1 when not given */
	double fmin;               /* [0, 1), or NaN */
	double xp;                 /* (0, 1], or NaN */
	double cost_a, cost_b, cost_c; /* all three, or all NaN */
	double largest;            /* > 0, or NaN */
} hl_unit_spec;

typedef struct {
	char *file;     /* the file the rows came from */
	size_t n, cap;
	hl_unit_spec *unit; /* in file order, names unique */
} hl_units_table;

/* Read and check the list at path. On HL_OK *out holds at least one row. */
hl_status hl_units_table_read(const char *path, hl_units_table **out,
			      hl_error *err);
/* The same over a buffer; name is used in messages. */
hl_status hl_units_table_read_mem(const char *name, const char *data,
				  size_t len, hl_units_table **out,
				  hl_error *err);
void hl_units_table_free(hl_units_table *t);

#endif
