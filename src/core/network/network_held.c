/* network_held.c - sizing a retrofit unit whose hardware is held: today's
 * shells (plus any bought) fix the series count, so F follows from them and
 * the area its duty needs is checked against the area it has. The sizing
 * itself is hl_exchanger_size's at the held series count (the unit keeps
 * its type); only the price differs: a held unit costs the shells bought. */
#include <math.h>

#include "network.h"

/* Shells of one bought lot so that none passes the type's largest shell:
 * the lot's shells split further in parallel (common practice, no
 * source). */
static int
lot_for(double area_per_shell, double largest)
{
	double k;

	if (!(largest > 0.0) || isinf(largest) || !(area_per_shell > 0.0))
		return 1;
	k = ceil(area_per_shell / largest * (1.0 - 1e-12));
	return k < 1.0 ? 1 : k > 1e6 ? 1000000 : (int)k;
}

/* Heaters bought for duty_added kW beyond a fired heater's rating, each at
 * most the type's largest (MW), priced by the type's law on duty per
 * heater (exchanger.h), n·(a + b·(Q/n)^c) (common practice, no source:
 * firing beyond a heater's rated duty is new firing capacity, bought as
 * area beyond a shell's is). */
static void
heaters_bought(hl_network_unit *u, const hl_exchanger_spec *spec)
{
	double mw;
	int k;

	u->cost = 0.0;
	if (!(u->shells_added > 0 && u->duty_added > 0.0))
		return;
	k = lot_for(u->duty_added / 1000.0 / u->shells_added, spec->largest);
	u->shells_added *= k;
	if (u->reuses[0] == '\0')
		u->parallel = u->shells_added;
	mw = u->duty_added / 1000.0 / u->shells_added;
	u->cost = u->shells_added * (spec->cost_a + spec->cost_b *
	    pow(mw, spec->cost_c));
}

/* Q = U·A·F·LMTD (Kern 1950, ch. 7) with F of the unit's own shells in
 * series by its type (exchanger.h); cost of the shells bought by the
 * type's law per shell, shells_added·(a + b·(area_added/shells_added)^c),
 * each bought shell at most the type's largest. */
hl_status
hl_network_size_held(const hl_network *net, hl_network_unit *u,
		     const hl_exchanger_spec *spec,
		     const hl_exchanger_sizing *z, hl_error *err)
{
	int par = u->parallel > 0 ? u->parallel : 1, k;

	(void)net;
	u->ft = z->f;
	u->lmtd = z->lmtd;
	u->area = z->area;
	u->parallel = par;
	u->area_shell = u->area / ((u->shells > 0 ? u->shells : 1) * par);
	u->warn = z->warn;
	u->cost = 0.0;
	if (spec->type == HL_EXCH_FIRED_HEATER)
		heaters_bought(u, spec);
	else if (u->shells_added > 0 && u->area_added > 0.0 &&
	    spec->type != HL_EXCH_FIRED_HEATER) {
		k = lot_for(u->area_added / u->shells_added, spec->largest);
		/* The bought shells go in parallel; a new unit's trains are
		 * all bought ones. */
		u->shells_added *= k;
		if (u->reuses[0] == '\0')
			par = u->shells_added / (u->shells > 0 ? u->shells : 1);
		u->parallel = par = par < 1 ? 1 : par;
		u->area_shell = u->area / ((u->shells > 0 ? u->shells : 1) *
		    par);
		u->cost = u->shells_added * (spec->cost_a + spec->cost_b *
		    pow(u->area_added / u->shells_added, spec->cost_c));
	}
	if (!isfinite(u->area) || !isfinite(u->cost))
		return hl_error_set(err, HL_EINPUT, NULL, 0,
		    "its area overflows (duty %.6g kW, U %.6g, LMTD %.6g K)",
		    u->duty, u->u, u->lmtd);
	return HL_OK;
}
