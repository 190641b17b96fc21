/* fuzz_units.c - libFuzzer harness for the exchanger list of `size`.
 *
 * A list that reads is sized row by row with the built-in settings, so the
 * exchanger module sees whatever numbers the reader lets through; the
 * reader's promise is that none of them is outside the sizing's domain
 * (only HL_OK or HL_ENOSOLUTION may come back).
 */
#include <math.h>
#include <stddef.h>
#include <stdint.h>
#include <stdlib.h>

#include "exchanger.h"
#include "units_table.h"

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size);

static void
size_row(const hl_unit_spec *u, const hl_settings *set)
{
	hl_exchanger_spec s;
	hl_exchanger_sizing z;
	hl_status st;

	/* The row's type chooses its law and shell limits, as in `size`. */
	hl_exchanger_spec_type(&s, set, u->type >= 0 ?
	    (hl_exchanger_type)u->type : set->exchanger);
	if (!isnan(u->largest))
		s.largest = u->largest;
	s.hot_in = u->hot_in;
	s.hot_out = u->hot_out;
	s.cold_in = u->cold_in;
	s.cold_out = u->cold_out;
	s.duty = u->duty;
	s.u = u->u;
	if (isnan(s.u) && hl_exchanger_u(isnan(u->h_hot) ? set->h_default :
	    u->h_hot, isnan(u->h_cold) ? set->h_default : u->h_cold, &s.u,
	    NULL) != HL_OK)
		abort();
	st = hl_exchanger_size(&s, &z, NULL);
	/* Area or cost overflow is the one input error left to the sizing. */
	if (st != HL_OK && st != HL_ENOSOLUTION && st != HL_EINPUT)
		abort();
}

int
LLVMFuzzerTestOneInput(const uint8_t *data, size_t size)
{
	hl_units_table *t = NULL;
	hl_settings set;
	hl_error err;
	size_t i;

	hl_settings_default(&set);
	if (hl_units_table_read_mem("fuzz.csv", (const char *)data, size, &t,
	    &err) != HL_OK)
		return 0;
	for (i = 0; i < t->n; i++)
		size_row(&t->unit[i], &set);
	hl_units_table_free(t);
	return 0;
}
