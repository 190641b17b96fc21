/* fuzz_network.c - libFuzzer harness for the existing-network table: what
 * the reader accepts is read against the four-stream problem by the audit
 * (placement on the streams, gaps, sizing, pinch rules, α). */
#include <stddef.h>
#include <stdint.h>
#include <string.h>

#include "audit.h"
#include "tables.h"

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size);

static const char streams[] =
	"name,supply,target,cp\n"
	"C1,20,135,2.0\nH1,170,60,3.0\nC2,80,140,4.0\nH2,150,30,1.5\n";
static const char utilities[] =
	"name,kind,supply,target,price\n"
	"steam,hot,180,180,30\ncooling water,cold,15,25,2\n";

int
LLVMFuzzerTestOneInput(const uint8_t *data, size_t size)
{
	hl_case *c = hl_case_create();
	hl_audit *a = NULL;
	hl_error err;

	if (c == NULL)
		return 0;
	if (hl_stream_table_read_mem(c, "s.csv", streams, strlen(streams),
				     &err) == HL_OK &&
	    hl_utility_table_read_mem(c, "u.csv", utilities,
				      strlen(utilities), &err) == HL_OK &&
	    hl_network_table_read_mem(c, "fuzz.csv", (const char *)data, size,
				      &err) == HL_OK &&
	    hl_case_validate(c, &err) == HL_OK)
		hl_audit_run(c, &a, &err);
	hl_audit_free(a);
	hl_case_free(c);
	return 0;
}
