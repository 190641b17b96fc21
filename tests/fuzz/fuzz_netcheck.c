/* fuzz_netcheck.c - libFuzzer harness for the network file reader and the
 * independent check: whatever a file holds, reading and checking it must
 * end in findings or an error, never a crash. */
#include <stddef.h>
#include <stdint.h>

#include "netcheck.h"
#include "network_read.h"

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size);

int
LLVMFuzzerTestOneInput(const uint8_t *data, size_t size)
{
	hl_network *net = NULL;
	hl_netcheck *r = NULL;
	hl_error err;

	if (hl_network_xml_read_mem("fuzz.xml", (const char *)data, size, &net,
				    &err) == HL_OK &&
	    hl_netcheck_run(net, &r, &err) == HL_OK)
		hl_netcheck_free(r);
	hl_network_free(net);
	return 0;
}
