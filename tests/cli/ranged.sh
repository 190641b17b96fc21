#!/bin/sh
# ranged.sh - a hot utility with a temperature range that ends below the
# pinch (a fired heater's flue gas with a stack temperature): the rise of
# hot and cold utility above the minimum is named, and targets, design,
# check, the grand composite and the report keep one accounting.
. "$TOP_SRCDIR/tests/cli/lib.sh"

S="$DATA/good/flue-stack.csv"
U="$DATA/good/flue-stack-utilities.csv"

# Hand cascade at ΔTmin 10 K (problem table, Linnhoff & Flower 1978; the
# numbers are this invented case's, derived by hand):
#   shifted   net cp  surplus   cascade   (hot −5 K, cold +5 K)
#   375-365     8       80        0 → 80
#   365-295    −2     −140       80 → −60
#   295-115     3      540      −60 → 480
#   115-105    −5      −50      480 → 430
#   105-35      5      350      430 → 780
# QHmin = 60 kW, QCmin = 840 kW, pinch at 295 °C shifted (300 / 290 °C).
# The furnace (1000 → 250 °C, shifted 995 → 245) gives its heat evenly over
# 750 K; only the 700 K above the pinch can serve the deficit above it, so
# its load is 60 × 750 / 700 = 64.2857 kW, of which 64.2857 × 50 / 750 =
# 4.2857 kW falls below the pinch and goes to cooling water: 844.2857 kW.
check_exit 0 hl targets "$S" --utilities "$U"
check_grep "Minimum hot utility    60.0 kW" "$WORK/stdout"
check_grep "Hot utility            64.3 kW" "$WORK/stdout"
check_grep "Above the targets      4.3 kW more hot and cold utility than the minimum (60.0 / 840.0 kW):" "$WORK/stdout"
check_grep "furnace gives 4.3 kW below the pinch: it must cool to 250.0 °C, the end of its range (a stack temperature)" "$WORK/stdout"

if [ -n "${XMLLINT:-}" ]; then
	check_exit 0 hl targets "$S" --utilities "$U" --format xml -o "$WORK/t.xml"
	check_exit 0 "$XMLLINT" --noout --relaxng "$TOP_SRCDIR/doc/results.rng" "$WORK/t.xml"
	check_near "$(xpath 'string(/results/targets/utility[@name="furnace"]/@load)' "$WORK/t.xml")" 64.2857142857 1e-9 "furnace load"
	check_near "$(xpath 'string(/results/targets/utility[@name="furnace"]/@across-pinch)' "$WORK/t.xml")" 4.28571428571 1e-9 "furnace across"
	check_near "$(xpath 'string(/results/targets/utility-summary/@range-rise)' "$WORK/t.xml")" 4.28571428571 1e-9 "range rise"
	check_near "$(xpath 'string(/results/targets/utility[@name="cooling water"]/@load)' "$WORK/t.xml")" 844.285714286 1e-9 "cooling water"

	# The network: the rise is the utility range's, not a match rule's.
	check_exit 0 hl design "$S" --utilities "$U" --format xml -o "$WORK/n.xml"
	check_exit 0 "$XMLLINT" --noout --relaxng "$TOP_SRCDIR/doc/results.rng" "$WORK/n.xml"
	check_near "$(xpath 'string(/results/network/@range-rise)' "$WORK/n.xml")" 4.28571428571 1e-6 "design range rise"
	check_near "$(xpath 'string(/results/network/@rule-penalty)' "$WORK/n.xml")" 0 1e-9 "no rule rise"
	check_exit 0 hl check "$WORK/n.xml"
	check_grep "sound, 0 problems" "$WORK/stdout"
	check_grep "utility ranges 4.3 kW" "$WORK/stdout"
	# The least-cost network may buy more energy than that (its own
	# choice, energy-penalty); the fewest-units network is at the
	# targets plus the rise exactly.
	check_exit 0 hl design "$S" --utilities "$U" --method units --format xml -o "$WORK/n.xml"
	check_exit 0 hl check "$WORK/n.xml"
	check_grep "Utilities: 64.3 kW hot, 844.3 kW cold, 4.3 kW hot and 4.3 kW cold above the targets (7.1 % hot); utility ranges 4.3 kW" "$WORK/stdout"
fi
check_exit 0 hl design "$S" --utilities "$U"
check_grep "Utility ranges add        4.3 kW to each" "$WORK/stdout"
grep -q "Match rules add" "$WORK/stdout" && fail "design blames match rules" || pass

# The grand composite: the furnace line starts at the pinch, and the grand
# composite with the furnace's heat below the pinch ends at the cold load.
check_exit 0 hl curves "$S" --utilities "$U" -o "$WORK/cv"
awk -F, '$1 == "hot-utilities" && $2 == 0 { print $3 }' "$WORK/cv/grand-composite.csv" >"$WORK/start"
check_near "$(cat "$WORK/start")" 295 1e-9 "furnace line starts at the pinch"
foot=$(awk -F, '$1 == "grand-with-utility-ranges" { h = $2 } END { print h }' "$WORK/cv/grand-composite.csv")
check_near "$foot" 844.285714286 1e-9 "grand composite with the range ends at the cold load"
cmax=$(awk -F, '$1 == "cold-utilities" && $2 > m { m = $2 } END { print m }' "$WORK/cv/grand-composite.csv")
check_near "$cmax" "$foot" 1e-9 "cooling-water line ends with the curve"

# The report gives the same rise and its cause.
check_exit 0 hl report "$S" --utilities "$U" -o "$WORK/r.html"
check_grep "because a hot utility" "$WORK/r.html"

# The audit of today's plant (flue-stack-network.csv) counts the same
# target: 64.2857 kW of hot utility, not the problem table's 60; and its
# area–energy curve never doubles back (hot utility rises with ΔTmin).
if [ -n "${XMLLINT:-}" ]; then
	check_exit 0 hl audit "$S" --utilities "$U" --network "$DATA/good/flue-stack-network.csv" --format xml -o "$WORK/a.xml"
	check_exit 0 "$XMLLINT" --noout --relaxng "$TOP_SRCDIR/doc/results.rng" "$WORK/a.xml"
	check_near "$(xpath 'string(//audit/@hot-utility-target)' "$WORK/a.xml")" 64.2857142857 1e-9 "audit hot target"
	check_near "$(xpath 'string(//audit/@cold-utility-target)' "$WORK/a.xml")" 844.285714286 1e-9 "audit cold target"
	"$XMLLINT" --xpath '//area-target/@hot-utility' "$WORK/a.xml" | tr ' ' '\n' |
		sed -n 's/^hot-utility="\(.*\)"$/\1/p' >"$WORK/curve"
	[ "$(wc -l <"$WORK/curve")" -ge 20 ] && pass || fail "area-energy curve too short"
	awk 'NR > 1 && $1 < prev - 1e-9 { bad = 1 } { prev = $1 } END { exit bad }' "$WORK/curve" &&
		pass || fail "the area-energy curve doubles back: $(tr '\n' ' ' <"$WORK/curve")"
	last=$(xpath 'string(//retrofit/point[last()]/@hot-utility)' "$WORK/a.xml")
	check_near "$last" 64.2857142857 1e-9 "retrofit curve ends at the target"
fi

# An independent LP: the transportation model (Cerda et al. 1983) in GNU
# MathProg, on the intervals of the hand cascade above (flue-stack.dat).
if command -v glpsol >/dev/null 2>&1; then
	check_exit 0 glpsol -m "$TOP_SRCDIR/tests/cli/transport.mod" -d "$DATA/good/flue-stack.dat"
	check_near "$(awk '$1 == "load" && $2 == "furnace" { print $3 }' "$WORK/stdout")" 64.2857142857 1e-6 "glpsol furnace"
	check_near "$(awk '$1 == "load" && $2 == "cw" { print $3 }' "$WORK/stdout")" 844.285714286 1e-6 "glpsol cooling water"
else
	echo "glpsol not found (glpk-utils): transportation LP check skipped"
fi
finish
