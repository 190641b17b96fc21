/* netfix.h - building placement inputs in tests: parties, hand-built
 * matches, and matches from a greedy heat cascade on generated problems. */
#ifndef HL_TEST_NETFIX_H
#define HL_TEST_NETFIX_H

#include <stddef.h>

#include "case.h"
#include "network.h"

#define NETFIX_MAX 96

typedef struct {
	hl_settings set;
	size_t np;
	hl_network_party p[NETFIX_MAX];
	hl_segment seg[NETFIX_MAX][4];
	size_t nm;
	hl_network_match m[4 * NETFIX_MAX];
	double give[4 * NETFIX_MAX][2 * NETFIX_MAX];
	double take[4 * NETFIX_MAX][2 * NETFIX_MAX];
	size_t nint;
	double t[2 * NETFIX_MAX + 1];
	double qh, qc;    /* targets, kW */
} netfix;

void netfix_init(netfix *f, double dtmin);
/* A process stream of one segment; returns its index. */
size_t netfix_stream(netfix *f, const char *name, double supply,
		     double target, double cp, double h);
/* A utility; returns its index. */
size_t netfix_utility(netfix *f, const char *name, hl_kind kind,
		      double supply, double target, double price, double h);
/* A match with windows (NaN for unknown). */
void netfix_match(netfix *f, size_t hot, size_t cold, double duty,
		  double hot_hi, double hot_lo, double cold_lo,
		  double cold_hi);
/* The input for hl_network_place. */
void netfix_input(const netfix *f, hl_network_input *in);

/* The streams of c with an implicit hot utility above and a cold utility
 * below everything, and matches with per-interval loads from a greedy
 * cascade: down the shifted intervals, each cold stream takes the heat
 * nearest above it first (that of its own interval, then the heat passed
 * down, the hot utility's last). It meets the problem-table targets. */
void netfix_cascade(netfix *f, const hl_case *c, double dtmin);

#endif
