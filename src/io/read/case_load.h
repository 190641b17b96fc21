/* case_load.h - a case from the file named on the command line. */
#ifndef HL_CASE_LOAD_H
#define HL_CASE_LOAD_H

#include "case.h"
#include "status.h"

/* path is an XML case file (its first non-blank character is '<') or a bare
 * stream table (CSV); utilities, when not NULL, a utility table added to it.
 * The case is not yet validated. */
hl_status hl_case_load(const char *path, const char *utilities, hl_case **out,
		       hl_error *err);

#endif
