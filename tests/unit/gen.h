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

#endif
