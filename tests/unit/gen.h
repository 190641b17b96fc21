/* gen.h - random stream problems for property tests (fixed seeds). */
#ifndef HL_TEST_GEN_H
#define HL_TEST_GEN_H

#include <stdint.h>

#include "case.h"

/* A small deterministic generator (xorshift64*), so runs are reproducible. */
typedef struct { uint64_t s; } hl_rng;
void hl_rng_seed(hl_rng *r, uint64_t seed);
double hl_rng_uniform(hl_rng *r, double lo, double hi);

/* A case of nhot hot and ncold cold single-segment streams with supply and
 * target in 20..300 °C rounded to 1 K and cp in 0.5..10 kW/K. */
hl_case *hl_gen_case(hl_rng *r, int nhot, int ncold);

/* Add one stream to c. */
void hl_gen_add(hl_case *c, const char *name, double ts, double tt, double cp);

/* Add one utility (h and dt_contrib not given); max_load NaN = unlimited.
 * Aborts the test program when the case cannot take it. */
void hl_gen_add_utility(hl_case *c, const char *name, hl_kind kind,
			double supply, double target, double price,
			double max_load);

/* The four-stream problem of Linnhoff et al. (IChemE 1982) / Kemp (2007),
 * ch. 2, and that of Smith (2005), ch. 16 with CP in kW/K (MW/K × 1000):
 * the sources and their targets are given beside the tests that use them. */
hl_case *hl_gen_kemp4(void);
hl_case *hl_gen_smith4(void);

#endif
