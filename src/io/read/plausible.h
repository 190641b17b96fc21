/* plausible.h - warnings for values that look like another unit.
 *
 * A table value can be read but be in a unit other than the column's: a cp
 * in W/K in a kW/K column, a film coefficient in W/(m²·K), temperatures in
 * kelvin. These rules warn (hl_read_warn) and never refuse: they are
 * heuristics, common practice, no source, chosen with wide margins:
 *   - film coefficient above HL_DOUBT_HTC_HIGH kW/(m²·K) (above condensing
 *     steam): probably W/(m²·K); below HL_DOUBT_HTC_LOW kW/(m²·K) (below
 *     free convection in a gas): probably kW given under a W header;
 *   - cp above HL_DOUBT_CP kW/K over a range of HL_DOUBT_SPAN K or more
 *     (a latent load over a few kelvin may have a large cp): probably W/K;
 *   - duty or load above HL_DOUBT_DUTY kW for one stream: probably W;
 *   - every supply and target temperature of the stream table at or above
 *     HL_DOUBT_KELVIN with no unit in the header: probably kelvin.
 */
#ifndef HL_PLAUSIBLE_H
#define HL_PLAUSIBLE_H

#define HL_DOUBT_HTC_HIGH 20.0   /* kW/(m²·K) */
#define HL_DOUBT_HTC_LOW 0.005   /* kW/(m²·K) */
#define HL_DOUBT_CP 5000.0       /* kW/K */
#define HL_DOUBT_SPAN 10.0       /* K */
#define HL_DOUBT_DUTY 2.0e6      /* kW */
#define HL_DOUBT_DUTY_OUT 1.0e12 /* kW: beyond, other checks refuse it */
#define HL_DOUBT_KELVIN 250.0    /* °C */

/* Values past the hard limits of case.h (HL_CP_MAX, HL_H_MAX) are refused
 * by the checks that follow and get no warning besides the error.
 * Each warns about column col of the row at file:line when the value (in
 * the canonical unit; NaN: not given) looks like another unit. */
void hl_doubt_htc(const char *file, long line, const char *col, double h);
void hl_doubt_cp(const char *file, long line, const char *col, double cp,
		 double span);
void hl_doubt_duty(const char *file, long line, const char *col, double q);

#endif
