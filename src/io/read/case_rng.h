/* case_rng.h - the case file schema, compiled into the program.
 *
 * The text of doc/case.rng, turned into a C string at build time (the rule
 * that makes case_rng.c is in Makefile.am), so that the program needs no
 * installed schema file and cannot read a stale one.
 */
#ifndef HL_CASE_RNG_H
#define HL_CASE_RNG_H

#include <stddef.h>

extern const char hl_case_rng[];
extern const size_t hl_case_rng_len; /* bytes, without the final NUL */

#endif
