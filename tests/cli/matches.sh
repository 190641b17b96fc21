#!/bin/sh
# matches.sh - `heatloom matches` through the command line: the published
# four-stream problem, the formats, the model file, solver control.
. "$TOP_SRCDIR/tests/cli/lib.sh"

K4="$DATA/good/kemp4.csv"
HARD="$DATA/good/gen-10x10-seed8.csv"

# Linnhoff et al. (1982) / Kemp (2007) ch. 2, ΔTmin 10 K: the fewest units
# meeting the targets is 6, three on each side of the pinch (derived by hand
# from the Euler rule, doc/references.md).
check_exit 0 hl matches "$K4" --dtmin 10
check_grep "Units                  6 (proven optimal)" "$WORK/stdout"
check_grep "above-pinch-1" "$WORK/stdout"
check_grep "Screening estimates" "$WORK/stdout"
check_grep "qualified" "$WORK/stdout"

if [ -n "${XMLLINT:-}" ]; then
	check_exit 0 hl matches "$K4" --format xml -o "$WORK/m.xml"
	check_exit 0 "$XMLLINT" --noout --relaxng "$TOP_SRCDIR/doc/results.rng" "$WORK/m.xml"
	check_near "$(xpath 'string(/results/matches/@units)' "$WORK/m.xml")" 6 0 "units"
	check_near "$(xpath 'string(/results/matches/@lower-bound)' "$WORK/m.xml")" 6 0 "bound"
	check_near "$(xpath 'count(/results/matches/match)' "$WORK/m.xml")" 6 0 "matches"
	check_near "$(xpath 'string(/results/matches/subnetwork[@region="above-pinch-1"]/@units)' "$WORK/m.xml")" 3 0 "above"
	check_near "$(xpath 'string(/results/matches/subnetwork[@region="below-pinch-1"]/@units)' "$WORK/m.xml")" 3 0 "below"
	check_near "$(xpath 'string(/results/matches/@hot-utility)' "$WORK/m.xml")" 20 1e-9 "QH"
	# The independent subset above the pinch is one 240 kW unit (same
	# derivation).
	check_near "$(xpath 'string(/results/matches/match[@hot="H1" and @cold="C2"]/@duty)' "$WORK/m.xml")" 240 1e-9 "H1-C2"
	[ "$(xpath 'string(/results/matches/@optimal)' "$WORK/m.xml")" = true ] && pass || fail "not optimal"
	# The demo plant too.
	check_exit 0 hl matches "$CASES/demo-streams.csv" --format xml -o "$WORK/d.xml"
	check_exit 0 "$XMLLINT" --noout --relaxng "$TOP_SRCDIR/doc/results.rng" "$WORK/d.xml"
fi

check_exit 0 hl matches "$K4" --format csv -o "$WORK/m.csv"
check_grep "hot,cold,duty,region,hot_from,hot_to,cold_from,cold_to" "$WORK/m.csv"
check_grep "H1,C2,240,above-pinch-1," "$WORK/m.csv"
[ "$(wc -l <"$WORK/m.csv")" -eq 7 ] && pass || fail "csv: want 6 matches"

# The model file: LP by default, MPS by name; another solver (glpsol, from
# the file alone) finds the same 6 units.
check_exit 0 hl matches "$K4" --export-model "$WORK/m.lp" -o "$WORK/r.txt"
check_grep "Minimize" "$WORK/m.lp"
check_exit 0 hl matches "$K4" --export-model "$WORK/m.mps" -o "$WORK/r.txt"
check_grep "ROWS" "$WORK/m.mps"
if command -v glpsol >/dev/null 2>&1; then
	check_exit 0 glpsol --lp "$WORK/m.lp" -o "$WORK/sol.txt"
	check_grep "INTEGER OPTIMAL" "$WORK/sol.txt"
	check_grep "Objective:  units = 6 (MINimum)" "$WORK/sol.txt"
	check_exit 0 glpsol --freemps "$WORK/m.mps" -o "$WORK/sol2.txt"
	check_grep "INTEGER OPTIMAL" "$WORK/sol2.txt"
fi

# The exported model against general-purpose solvers from Debian's packages
# (GLPK's glpsol, glpk-utils; COIN-OR CBC, coinor-cbc), and against the plain
# expanded transshipment model of Papoulias & Grossmann, Comput. Chem. Eng. 7
# (1983) 707-721, written independently in MathProg (tests/bench/
# transship.mod, data from match_dat): on small generated problems each
# proves the same fewest units that heatloom proves. Skipped for a solver
# that is not installed.
GEN="$TOP_BUILDDIR/tests/bench/gen_streams"
MDAT="$TOP_BUILDDIR/tests/bench/match_dat"
for nseed in 4:1 4:2 4:3 5:1 5:2 5:3 6:2 6:3; do
	n=${nseed%:*}
	seed=${nseed#*:}
	"$GEN" $((2 * n)) "$seed" >"$WORK/g.csv"
	check_exit 0 hl matches "$WORK/g.csv" --time-limit 60 --quiet \
		--export-model "$WORK/g.lp" -o "$WORK/g.txt"
	check_grep "(proven optimal)" "$WORK/g.txt"
	units=$(sed -n 's/^Units *\([0-9]*\) .*/\1/p' "$WORK/g.txt")
	check_exit 0 hl matches "$WORK/g.csv" --time-limit 0 --quiet \
		--export-model "$WORK/g.mps" -o "$WORK/g0.txt"
	if command -v glpsol >/dev/null 2>&1; then
		check_exit 0 glpsol --lp "$WORK/g.lp" -o "$WORK/g.sol"
		check_grep "INTEGER OPTIMAL" "$WORK/g.sol"
		check_grep "Objective:  units = $units (MINimum)" "$WORK/g.sol"
		check_exit 0 "$MDAT" "$WORK/g.csv"
		mv "$WORK/stdout" "$WORK/g.dat"
		check_exit 0 glpsol -m "$TOP_SRCDIR/tests/bench/transship.mod" \
			-d "$WORK/g.dat" -o "$WORK/t.sol"
		check_grep "INTEGER OPTIMAL" "$WORK/t.sol"
		check_grep "Objective:  units = $units (MINimum)" "$WORK/t.sol"
	fi
	if command -v cbc >/dev/null 2>&1; then
		check_exit 0 cbc "$WORK/g.mps" -solve -quit
		check_grep "Result - Optimal solution found" "$WORK/stdout"
		got=$(awk '/^Objective value:/ { printf "%.0f", $3 }' "$WORK/stdout")
		[ "$got" = "$units" ] && pass ||
			fail "cbc: $got units, heatloom $units (${n}x$n seed $seed)"
	fi
done

check_exit 1 hl matches "$K4" --export-model -
check_grep "needs a file name" "$WORK/stderr"
check_exit 1 hl matches "$K4" --export-model "$WORK/same" -o "$WORK/same"
check_exit 1 hl matches "$K4" --export-model "$K4"
check_grep "refusing to overwrite an input file" "$WORK/stderr"

# Match rules from a case file: both hot streams forbidden for C1 send its
# 230 kW to the hot utility; targets 230 / 270 kW, 180 kW per rule (derived
# by hand, see the file's comment).
R4="$DATA/good/kemp4-rules.xml"
check_exit 0 hl matches "$R4"
check_grep "hot utility 20.0 -> 230.0 kW (+210.0)" "$WORK/stdout"
check_grep "cold stream 'C1' may not be matched with any hot process stream: its whole duty, 230.0 kW, goes to utilities" "$WORK/stdout"
check_grep "forbid H1-C1 ($R4:17: H1 may leak into the C1 product): 1 pair; without it the hot utility would be 180.0 kW lower" "$WORK/stdout"
if [ -n "${XMLLINT:-}" ]; then
	check_exit 0 hl matches "$R4" --format xml -o "$WORK/r4.xml"
	check_exit 0 "$XMLLINT" --noout --relaxng "$TOP_SRCDIR/doc/results.rng" "$WORK/r4.xml"
	check_near "$(xpath 'string(/results/matches/@hot-utility)' "$WORK/r4.xml")" 230 1e-9 "rules QH"
	check_near "$(xpath 'string(/results/matches/@cold-utility)' "$WORK/r4.xml")" 270 1e-9 "rules QC"
	check_near "$(xpath 'string(/results/matches/rule[1]/@hot-utility-rise)' "$WORK/r4.xml")" 180 1e-9 "rise 1"
	check_near "$(xpath 'string(/results/matches/isolated[@stream="C1"]/@utility-duty)' "$WORK/r4.xml")" 230 1e-9 "C1 to utilities"
	check_near "$(xpath 'count(/results/matches/match[@cold="C1" and (@hot="H1" or @hot="H2")])' "$WORK/r4.xml")" 0 0 "no forbidden match"
fi

# Utility levels: the utility LP's loads split the network at its utility
# pinch. smith4-levels.csv: MP steam at 200 °C takes 3000 kW, HP steam the
# other 4500 kW above 195 °C shifted (doc/references.md, derived), so HP steam
# works above the utility pinch and MP steam between it and the process
# pinch (145 °C shifted).
if [ -n "${XMLLINT:-}" ]; then
	check_exit 0 hl matches "$DATA/good/smith4.csv" --utilities "$DATA/good/smith4-levels.csv" \
		--format xml -o "$WORK/s4.xml"
	check_exit 0 "$XMLLINT" --noout --relaxng "$TOP_SRCDIR/doc/results.rng" "$WORK/s4.xml"
	check_near "$(xpath 'count(/results/matches/subnetwork)' "$WORK/s4.xml")" 3 0 "smith4 parts"
	check_near "$(xpath 'string(/results/matches/subnetwork[2]/@top)' "$WORK/s4.xml")" 195 1e-9 "utility pinch"
	check_near "$(xpath 'string(/results/matches/subnetwork[3]/@top)' "$WORK/s4.xml")" 145 1e-9 "process pinch"
	check_near "$(xpath 'sum(/results/matches/match[@hot="HP steam" and @region="above-pinch-1"]/@duty)' "$WORK/s4.xml")" 4500 1e-9 "HP steam"
	check_near "$(xpath 'sum(/results/matches/match[@hot="MP steam" and @region="between-pinch-1-2"]/@duty)' "$WORK/s4.xml")" 3000 1e-9 "MP steam"
	check_near "$(xpath 'string(/results/matches/utility[@name="LP steam"]/@load)' "$WORK/s4.xml")" 0 0 "LP steam"
fi

# Solver control. A tiny time limit on a hard problem: the best network
# found with its gap, or exit 3 with a sentence; never a hang.
set +e
hl matches "$HARD" --time-limit 0.01 --format xml -o "$WORK/h.xml" 2>"$WORK/herr"
rc=$?
set -e
if [ "$rc" -eq 0 ]; then
	pass
	if [ -n "${XMLLINT:-}" ]; then
		[ "$(xpath 'string(/results/matches/@optimal)' "$WORK/h.xml")" = false ] && pass ||
			fail "tiny limit: claims optimal"
		awk -v g="$(xpath 'string(/results/matches/@gap)' "$WORK/h.xml")" \
			'BEGIN { exit !(g > 0) }' && pass || fail "tiny limit: no gap"
	fi
elif [ "$rc" -eq 3 ]; then
	check_grep "time limit" "$WORK/herr"
else
	fail "tiny limit: exit $rc"
fi
# The text says so too; a root LP slower than its floor of 1 s (as under
# valgrind) is the other allowed answer: exit 3 with the size and the advice.
set +e
hl matches "$HARD" --time-limit 0.01 >"$WORK/hout" 2>"$WORK/herr"
rc=$?
set -e
case $rc in
0) check_grep "best found in the time limit" "$WORK/hout" ;;
3) check_grep "too large to solve in the time limit" "$WORK/herr" ;;
*) fail "tiny limit, text: exit $rc" ;;
esac
check_exit 0 hl matches "$K4" --time-limit 0
check_grep "Units                  6" "$WORK/stdout"
check_exit 1 hl matches "$K4" --time-limit -1
check_exit 1 hl matches "$K4" --time-limit soon
check_grep "--time-limit wants a number" "$WORK/stderr"

# --verbose shows GLPK's own messages (its simplex iterations) on stderr;
# without it stderr stays empty (not a terminal here, so no progress).
check_exit 0 hl matches "$K4" --verbose
check_grep "obj =" "$WORK/stderr"
check_exit 0 hl matches "$K4" --quiet
[ ! -s "$WORK/stderr" ] && pass || fail "--quiet wrote to stderr"
check_exit 0 hl matches "$K4"
[ ! -s "$WORK/stderr" ] && pass || fail "progress without a terminal"

# Progress appears when stderr is a terminal (script(1) gives one), and
# --quiet silences it.
if command -v script >/dev/null 2>&1 && script -qc true /dev/null >/dev/null 2>&1; then
	script -qc "\"$HEATLOOM\" matches \"$HARD\" --time-limit 1.2 -o \"$WORK/p.txt\"" \
		"$WORK/typescript" >/dev/null 2>&1 || true
	check_grep "heatloom: matches: " "$WORK/typescript"
	script -qc "\"$HEATLOOM\" matches \"$HARD\" --time-limit 1.2 --quiet -o \"$WORK/p.txt\"" \
		"$WORK/typescript2" >/dev/null 2>&1 || true
	if grep -q "heatloom: matches: " "$WORK/typescript2"; then
		fail "--quiet showed progress"
	else
		pass
	fi
fi

# Help and usage.
check_exit 0 hl help matches
check_grep "Usage: heatloom matches CASE" "$WORK/stdout"
check_grep "--export-model" "$WORK/stdout"
check_grep "screening estimates" "$WORK/stdout"
check_exit 1 hl matches
check_exit 1 hl matches "$K4" --format svg
check_exit 1 hl matches "$K4" --bogus
# The demo's subnetworks are split at its process pinch (153 °C shifted)
# and at two utility pinches; the text tells them apart.
check_exit 0 hl matches "$CASES/demo.xml"
check_grep "pinch 2 at 153.0 °C shifted: process pinch" "$WORK/stdout"
check_grep "pinch 1 at 155.0 °C shifted: utility pinch" "$WORK/stdout"
finish
