/* transport.mod - least-cost utility loads as a transportation problem
 * (Cerda, Westerberg, Mason & Linnhoff 1983, "Minimum utility usage in heat
 * exchanger network synthesis: a transportation problem", Chem. Eng. Sci.
 * 38, 373-387; citation from memory), in GNU MathProg for glpsol. An
 * independent check of
 * heatloom's cascade (transshipment) LP: heat moves from a hot party in one
 * shifted interval straight to a cold party in the same or a colder
 * interval; no cascade, no residual flows.
 *
 * The data (a .dat file written by hand from the test's hand cascade) give
 * the heat of every process stream in every interval, and for each utility
 * the fraction of its load in each interval. A credit utility (negative
 * price: steam raising, heat sold) may only take heat from process streams,
 * and a credit hot utility only give heat to process streams: otherwise a
 * hot utility could be bought to be sold again without limit.
 */
set K;                          /* shifted intervals */
param ord{K};                   /* 1 = hottest */
set HP;                         /* hot process streams */
set CP;                         /* cold process streams */
set HU;                         /* hot utilities */
set CU;                         /* cold utilities */
param hp{HP, K} default 0;      /* kW a hot stream gives in an interval */
param cp{CP, K} default 0;      /* kW a cold stream takes in an interval */
param fu{HU, K} default 0;      /* fraction of a hot utility's load there */
param fc{CU, K} default 0;      /* fraction of a cold utility's load there */
param price{HU union CU};       /* per MWh; only its sign and ratio matter */

set H := HP union HU;
set C := CP union CU;
set ARC := {h in H, i in K, c in C, k in K:
	ord[i] <= ord[k] and
	not (h in HU and c in CU and (price[h] < 0 or price[c] < 0))};

var L{HU union CU} >= 0;
var x{ARC} >= 0;

minimize cost: sum{u in HU union CU} price[u] * L[u];

s.t. give_p{h in HP, i in K}:
	sum{(h, i, c, k) in ARC} x[h, i, c, k] = hp[h, i];
s.t. give_u{h in HU, i in K}:
	sum{(h, i, c, k) in ARC} x[h, i, c, k] = fu[h, i] * L[h];
s.t. take_p{c in CP, k in K}:
	sum{(h, i, c, k) in ARC} x[h, i, c, k] = cp[c, k];
s.t. take_u{c in CU, k in K}:
	sum{(h, i, c, k) in ARC} x[h, i, c, k] = fc[c, k] * L[c];

solve;
printf{u in HU union CU} "load %s %.9g\n", u, L[u];
printf "cost %.9g\n", cost;
end;
