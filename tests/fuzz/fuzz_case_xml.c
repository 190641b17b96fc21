/* fuzz_case_xml.c - libFuzzer harness for the XML case reader.
 *
 * CSV references resolve against a folder that does not exist, so the
 * harness exercises the XML parsing, the entity refusal, the schema and the
 * element readers; a case that reads and validates is also cascaded.
 */
#include <stddef.h>
#include <stdint.h>

#include "cascade.h"
#include "case_xml.h"

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size);

int
LLVMFuzzerTestOneInput(const uint8_t *data, size_t size)
{
	hl_case *c = hl_case_create();
	hl_cascade *cas = NULL;
	hl_error err;

	if (c == NULL)
		return 0;
	if (hl_case_xml_read_mem(c, "fuzz.xml", (const char *)data, size,
				 "/nonexistent-heatloom-fuzz", &err) == HL_OK &&
	    hl_case_validate(c, &err) == HL_OK &&
	    hl_cascade_compute(c, c->set.dtmin, &cas, &err) == HL_OK)
		hl_cascade_free(cas);
	hl_case_free(c);
	return 0;
}
