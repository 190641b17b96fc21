#!/bin/sh
# credits.sh - a utility with a negative price (steam raised and sold):
# accepted, the utility LP stays bounded (a credit takes only heat the
# process gives), and the credit is reported as such.
. "$TOP_SRCDIR/tests/cli/lib.sh"

S="$DATA/good/credit.csv"
U="$DATA/good/credit-utilities.csv"

# Hand cascade at ΔTmin 10 K (problem table, Linnhoff & Flower 1978, on this
# invented case; hot −5 K, cold +5 K):
#   shifted   H1   C1   C2   surplus   cascade
#   195-185   10             +100      0 → 100
#   185-155   10         5   +150      → 250
#   155-145   10         5    +50      → 300
#   145-125   10             +200      → 500
#   125-95    10    5        +150      → 650
#   95-55           5        −200      → 450
# QHmin = 0 (a threshold problem), QCmin = 450 kW.
# Steam raising (150 °C, shifted 155) can only take the heat H1 gives above
# 155 °C shifted: 10 × (195 − 155) = 400 kW. It earns 30 per MWh and HP
# steam costs 20, so buying HP steam for the 150 kW C2 needs above 155 °C
# shifted (5 × 30) frees 150 kW of H1's heat for steam raising: 400 kW raised,
# 150 kW of HP steam, cooling water 1000 + 150 − 550 − 400 = 200 kW.
# Cost per year = (20 × 150 − 30 × 400 + 1 × 200) × 8000 / 1000 = −70 400.
# Without the rule that a credit takes only process heat, HP steam bought
# at 20 to raise steam sold at 30 would make the LP unbounded.
check_exit 0 hl targets "$S" --utilities "$U"
check_grep "Utility cost           −70 400 EUR per year (net of the credits, which earn 96 000)" "$WORK/stdout"
check_grep "Credit                 steam raising earns 96 000 EUR per year on 400.0 kW it takes from the process" "$WORK/stdout"
check_grep "Bought for credits     150.0 kW of hot utility beyond the minimum" "$WORK/stdout"
check_grep "  steam raising  cold    150.0    150.0    -30.00       400.0       −96 000" "$WORK/stdout"

if [ -n "${XMLLINT:-}" ]; then
	check_exit 0 hl targets "$S" --utilities "$U" --format xml -o "$WORK/t.xml"
	check_exit 0 "$XMLLINT" --noout --relaxng "$TOP_SRCDIR/doc/results.rng" "$WORK/t.xml"
	load() { xpath "string(/results/targets/utility[@name='$1']/@load)" "$WORK/t.xml"; }
	check_near "$(load 'HP steam')" 150 1e-9 "HP steam"
	check_near "$(load 'steam raising')" 400 1e-9 "steam raising"
	check_near "$(load 'cooling water')" 200 1e-9 "cooling water"
	check_near "$(xpath 'string(/results/targets/utility-summary/@cost)' "$WORK/t.xml")" -70400 1e-9 "net cost"
	check_near "$(xpath 'string(/results/targets/utility-summary/@credit)' "$WORK/t.xml")" 96000 1e-9 "credit"
	check_near "$(xpath 'string(/results/targets/utility-summary/@credit-rise)' "$WORK/t.xml")" 150 1e-9 "credit rise"

	# The same case as an XML case file, and a network that check accepts.
	check_exit 0 hl design "$S" --utilities "$U" --format xml -o "$WORK/n.xml"
	check_exit 0 "$XMLLINT" --noout --relaxng "$TOP_SRCDIR/doc/results.rng" "$WORK/n.xml"
	check_near "$(xpath 'string(/results/network/@energy-cost)' "$WORK/n.xml")" -70400 1e-9 "design energy cost"
	check_exit 0 hl check "$WORK/n.xml"
	check_grep "utility choice (credits, ranges) 150.0 kW" "$WORK/stdout"
fi

# Steam raising alone (no priced hot utility to buy): all 400 kW of H1's heat
# above 155 °C shifted, less the 150 kW C2 needs there, is raised: 250 kW,
# and QCmin − 250 = 200 kW goes to cooling water.
grep -v '^HP steam' "$U" >"$WORK/no-hp.csv"
check_exit 0 hl targets "$S" --utilities "$WORK/no-hp.csv" --format csv
check_exit 0 hl targets "$S" --utilities "$WORK/no-hp.csv"
check_grep "  steam raising  cold    150.0    150.0    -30.00       250.0       −60 000" "$WORK/stdout"

# The report marks the credit.
check_exit 0 hl report "$S" --utilities "$U" -o "$WORK/r.html"
check_grep "Utility cost, net of credits" "$WORK/r.html"
check_grep "Bought for credits" "$WORK/r.html"

# An independent LP: the transportation model (Cerda et al. 1983) in GNU
# MathProg, on the intervals of the hand cascade (credit.dat).
if command -v glpsol >/dev/null 2>&1; then
	check_exit 0 glpsol -m "$TOP_SRCDIR/tests/cli/transport.mod" -d "$DATA/good/credit.dat"
	check_near "$(awk '$1 == "load" && $2 == "hp" { print $3 }' "$WORK/stdout")" 150 1e-6 "glpsol HP steam"
	check_near "$(awk '$1 == "load" && $2 == "sr" { print $3 }' "$WORK/stdout")" 400 1e-6 "glpsol steam raising"
	check_near "$(awk '$1 == "load" && $2 == "cw" { print $3 }' "$WORK/stdout")" 200 1e-6 "glpsol cooling water"
	check_near "$(awk '$1 == "cost" { print $2 * 8 }' "$WORK/stdout")" -70400 1e-6 "glpsol cost"
else
	echo "glpsol not found (glpk-utils): transportation LP check skipped"
fi
finish
