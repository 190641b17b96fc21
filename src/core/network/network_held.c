/* network_held.c - sizing a retrofit unit whose hardware is held: today's
 * shells (plus any bought) fix the series count, so F follows from them and
 * the area its duty needs is checked against the area it has. */
#include <math.h>

#include "network.h"

/* Q = U·A·F·LMTD (Kern 1950, ch. 7) with F of the unit's own n shells in
 * series (Bowman, Mueller & Nagle 1940, per-shell P); cost of the shells
 * bought by the case's law a + b·A_shell^c per shell. */
hl_status
hl_network_size_held(const hl_network *net, hl_network_unit *u, double p,
		     double r, double lmtd, hl_error *err)
{
	const hl_settings *set = &net->set;
	double f = 1.0;
	hl_status st;

	/* An isothermal side (P or R nil, R infinite) needs no F. */
	if (u->type == HL_EXCH_SHELL_TUBE && p > 0.0 && r > 0.0 &&
	    isfinite(r)) {
		st = hl_exchanger_f_shells(p, r, u->shells, &f, err);
		if (st != HL_OK)
			return hl_error_set(err, HL_ENOSOLUTION, NULL, 0,
			    "its %d shells in series cannot reach P %.6g at R "
			    "%.6g: it needs more shells", u->shells, p, r);
	}
	u->ft = f;
	u->lmtd = lmtd;
	u->area = u->duty / (u->u * f * lmtd);
	u->area_shell = u->area / (u->shells > 0 ? u->shells : 1);
	u->cost = 0.0;
	if (u->shells_added > 0 && u->area_added > 0.0)
		u->cost = u->shells_added * (set->cost_a + set->cost_b *
		    pow(u->area_added / u->shells_added, set->cost_c));
	if (!isfinite(u->area))
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "its area overflows (duty %.6g kW, U %.6g, LMTD %.6g K)",
		    u->duty, u->u, lmtd);
	return HL_OK;
}
