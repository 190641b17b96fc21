/* model_out.h - a GLPK model written to a file, whole or not at all.
 *
 * The format follows the name: ".mps" gives free MPS, anything else CPLEX
 * LP. The file goes through hl_output (temporary file, then rename); "-"
 * (standard output) is refused, since GLPK writes only to named files.
 */
#ifndef HL_MODEL_OUT_H
#define HL_MODEL_OUT_H

#include <glpk.h>

#include "status.h"

/* Call inside an hl_glpk_guard. */
hl_status hl_model_write(glp_prob *P, const char *path, hl_error *err);

#endif
