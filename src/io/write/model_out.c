/* model_out.c - write a GLPK model as CPLEX LP or free MPS. */
#include <string.h>

#include "model_out.h"
#include "output.h"

static int
is_mps(const char *path)
{
	size_t n = strlen(path);

	return n >= 4 && (strcmp(path + n - 4, ".mps") == 0 ||
			  strcmp(path + n - 4, ".MPS") == 0);
}

hl_status
hl_model_write(glp_prob *P, const char *path, hl_error *err)
{
	hl_output o;
	hl_status st;
	int rc;

	if (path == NULL || strcmp(path, "-") == 0)
		return hl_error_set(err, HL_EUSAGE, NULL, 0,
			"--export-model needs a file name (.lp or .mps), not "
			"standard output");
	st = hl_output_open(&o, path, err);
	if (st != HL_OK)
		return st;
	/* GLPK opens the temporary file by name; o.fp stays empty. */
	rc = is_mps(path) ? glp_write_mps(P, GLP_MPS_FILE, NULL, o.tmp) :
		glp_write_lp(P, NULL, o.tmp);
	if (rc != 0) {
		hl_output_abort(&o);
		return hl_error_set(err, HL_EIO, path, 0,
			"cannot write the model");
	}
	return hl_output_commit(&o, err);
}
