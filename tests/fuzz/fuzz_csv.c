/* fuzz_csv.c - libFuzzer harness for the stream and utility tables.
 *
 * Reads the input as a stream table and, independently, as a utility table;
 * a table that reads and validates is also cascaded, so the problem table
 * sees whatever odd numbers the reader lets through.
 */
#include <stddef.h>
#include <stdint.h>

#include "cascade.h"
#include "tables.h"

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size);

int
LLVMFuzzerTestOneInput(const uint8_t *data, size_t size)
{
	hl_case *c = hl_case_create();
	hl_cascade *cas = NULL;
	hl_error err;

	if (c == NULL)
		return 0;
	if (hl_stream_table_read_mem(c, "fuzz.csv", (const char *)data, size,
				     &err) == HL_OK &&
	    hl_case_validate(c, &err) == HL_OK &&
	    hl_cascade_compute(c, 10.0, &cas, &err) == HL_OK) {
		double dt;

		hl_cascade_threshold_dtmin(c, cas, &dt, &err);
		hl_cascade_free(cas);
	}
	hl_case_free(c);
	c = hl_case_create();
	if (c == NULL)
		return 0;
	hl_utility_table_read_mem(c, "fuzz.csv", (const char *)data, size,
				  &err);
	hl_case_free(c);
	return 0;
}
