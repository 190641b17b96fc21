/* transship.mod - the fewest exchanger units, for glpsol (GNU MathProg).
 *
 * Method: the expanded transshipment MILP of Papoulias & Grossmann (1983),
 * Comput. Chem. Eng. 7, 707-721, in its plain form: big-M of a pair = the
 * smaller of the two heats in the subnetwork, no other bounds, cuts or
 * starting solution. It is the model `bench_matches ... textbook` solves
 * inside heatloom, written a second time, independently, from the paper;
 * heatloom's own (tightened) model adds the rows of
 * src/core/match/match_model.c.
 *
 * Data: a .dat file from tests/bench/match_dat (the intervals, subnetworks
 * and the heat of every party in every interval, as heatloom prepared them).
 *   glpsol -m transship.mod -d case.dat --tmlim 60 -o solution.txt
 * Units: kW.
 */

set S;                        /* subnetworks (split at every pinch) */
param first{S} integer >= 1;  /* intervals of subnetwork s: first..last */
param last{s in S} integer >= first[s];
param NK integer >= 1;        /* intervals in all */
set H;                        /* hot parties: hot streams and hot utilities */
set C;                        /* cold parties */
param qh{H, 1..NK} >= 0, default 0;  /* heat hot i gives up in interval k */
param qc{C, 1..NK} >= 0, default 0;  /* heat cold j needs in interval k */
param allowed{H, C} binary, default 1;
param cost{H, C} >= 0, default 1;    /* objective weight of one unit */

/* Heat of hot i from the top of subnetwork s down to interval k: what it
   can have on hand in k (its own heat there plus what it passed down). */
param above{s in S, i in H, k in first[s]..last[s]} :=
	sum{l in first[s]..k} qh[i, l];

/* q[s,i,j,k]: heat cold j takes from hot i in interval k, wherever i has
   heat at or above k and j needs heat in k. */
set QK{s in S} := setof{i in H, j in C, k in first[s]..last[s]:
	allowed[i, j] and qc[j, k] > 0 and above[s, i, k] > 0} (i, j, k);
set P{s in S} := setof{(i, j, k) in QK[s]} (i, j);

/* Big-M: the smaller of the two heats in the subnetwork. */
param U{s in S, (i, j) in P[s]} :=
	min(sum{k in first[s]..last[s]} qh[i, k],
	    sum{k in first[s]..last[s]} qc[j, k]);

var y{s in S, (i, j) in P[s]} binary;
var q{s in S, (i, j, k) in QK[s]} >= 0;
/* R[s,i,k]: heat of hot i passed below interval k (none below the
   subnetwork: its lower boundary carries no heat). */
var R{s in S, i in H, k in first[s]..last[s] - 1: above[s, i, k] > 0} >= 0;

minimize units: sum{s in S, (i, j) in P[s]} cost[i, j] * y[s, i, j];

/* Hot balance: what i gives and passes down in k is at most its own heat
   there plus what came from above (an inequality, as in heatloom, so that
   rounding of the data cannot make a balanced subnetwork infeasible; the
   cold rows and the totals force equality). */
s.t. hot{s in S, i in H, k in first[s]..last[s]: above[s, i, k] > 0}:
	sum{j in C: (i, j, k) in QK[s]} q[s, i, j, k]
	+ sum{l in {k}: l < last[s]} R[s, i, l]
	- sum{l in {k - 1}: l >= first[s] and above[s, i, l] > 0} R[s, i, l]
	<= qh[i, k];

/* Cold balance: j gets exactly its heat in every interval. */
s.t. cold{s in S, j in C, k in first[s]..last[s]: qc[j, k] > 0}:
	sum{i in H: (i, j, k) in QK[s]} q[s, i, j, k] = qc[j, k];

/* A pair exchanges heat only through a unit. */
s.t. logic{s in S, (i, j) in P[s]}:
	sum{k in first[s]..last[s]: (i, j, k) in QK[s]} q[s, i, j, k]
	<= U[s, i, j] * y[s, i, j];

solve;
end;
