/* fuzz_network.c - libFuzzer harness for the existing-network table. */
#include <stddef.h>
#include <stdint.h>

#include "tables.h"

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size);

int
LLVMFuzzerTestOneInput(const uint8_t *data, size_t size)
{
	hl_case *c = hl_case_create();
	hl_error err;

	if (c == NULL)
		return 0;
	hl_network_table_read_mem(c, "fuzz.csv", (const char *)data, size, &err);
	hl_case_free(c);
	return 0;
}
