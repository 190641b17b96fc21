#!/bin/sh
# utilities.sh - least-cost utility levels through `heatloom targets`, read
# back from the XML results and the text report.
. "$TOP_SRCDIR/tests/cli/lib.sh"

if [ -z "${XMLLINT:-}" ]; then
	echo "SKIP: xmllint not found (Debian package libxml2-utils)"
	exit 77
fi

valid() {
	if "$XMLLINT" --noout --relaxng "$TOP_SRCDIR/doc/results.rng" "$1" 2>"$WORK/lint"; then
		pass
	else
		fail "$1 does not match doc/results.rng"; cat "$WORK/lint" >&2
	fi
}

load() {
	xpath "string(/results/targets/utility[@name='$1']/@load)" "$2"
}

# One hot and one cold utility beyond all temperatures give the problem
# table targets: Linnhoff et al. (1982) / Kemp (2007) ch. 2, from memory,
# hand-checked: 20 / 60 kW.
check_exit 0 hl targets "$DATA/good/kemp4.csv" --utilities "$DATA/good/kemp4-span-utilities.csv" --format xml -o "$WORK/k.xml"
valid "$WORK/k.xml"
check_near "$(load steam "$WORK/k.xml")" 20 1e-9 "kemp4 steam"
check_near "$(load water "$WORK/k.xml")" 60 1e-9 "kemp4 water"
check_near "$(xpath 'string(/results/targets/@hot-utility)' "$WORK/k.xml")" 20 1e-9 "kemp4 QH"
# Yearly cost = price × load × hours / 1000: 30 × 20 × 8 + 5 × 60 × 8.
check_near "$(xpath 'string(/results/targets/utility-summary/@cost)' "$WORK/k.xml")" 7200 1e-9 "kemp4 cost"
check_near "$(xpath 'string(/results/targets/utility[@name="steam"]/@cost)' "$WORK/k.xml")" 4800 1e-9 "steam cost"
check_grep 'optimal="true"' "$WORK/k.xml"

# Smith (2005) ch. 16 with a cheaper MP level at 200 °C: 3000 kW there,
# 4500 kW of HP steam (doc/references.md, derived by hand); LP steam at 120 °C
# lies below the 150/140 °C pinch and stays unused.
check_exit 0 hl targets "$DATA/good/smith4.csv" --utilities "$DATA/good/smith4-levels.csv" --format xml -o "$WORK/s.xml"
valid "$WORK/s.xml"
check_near "$(load 'HP steam' "$WORK/s.xml")" 4500 1e-9 "smith4 HP"
check_near "$(load 'MP steam' "$WORK/s.xml")" 3000 1e-9 "smith4 MP"
check_near "$(load 'cooling water' "$WORK/s.xml")" 10000 1e-9 "smith4 CW"
check_near "$(load 'LP steam' "$WORK/s.xml")" 0 1e-9 "smith4 LP"
check_grep 'name="LP steam" kind="hot" supply="120" target="120" price="10" load="0" cost="0" use="unused"' "$WORK/s.xml"
check_near "$(xpath 'string(/results/targets/utility-pinch/@shifted)' "$WORK/s.xml")" 195 1e-9 "utility pinch"
check_grep '<utility-pinch shifted="195" hot="200" cold="190" utility="MP steam"/>' "$WORK/s.xml"

# max_load: MP steam limited to 2000 kW, HP steam takes 5500 kW.
sed 's/^MP steam,hot,200,200,25,$/MP steam,hot,200,200,25,2000/' \
	"$DATA/good/smith4-levels.csv" >"$WORK/capped.csv"
check_exit 0 hl targets "$DATA/good/smith4.csv" --utilities "$WORK/capped.csv" --format xml -o "$WORK/c.xml"
check_near "$(load 'MP steam' "$WORK/c.xml")" 2000 1e-9 "capped MP"
check_near "$(load 'HP steam' "$WORK/c.xml")" 5500 1e-9 "capped HP"

# The text report: the table, unused levels, the pinch, the caution.
check_exit 0 hl targets "$DATA/good/smith4.csv" --utilities "$DATA/good/smith4-levels.csv" -o "$WORK/s.txt"
check_grep "Utility levels at least cost" "$WORK/s.txt"
check_grep "  MP steam       hot     200.0    200.0     25.00      3000.0       600 000" "$WORK/s.txt"
check_grep "unused" "$WORK/s.txt"
check_grep "Utility pinch          200.0 °C hot / 190.0 °C cold (195.0 °C shifted; the MP steam level)" "$WORK/s.txt"
check_grep "Utility cost           2 200 000 EUR per year" "$WORK/s.txt"
check_grep "Screening estimates" "$WORK/s.txt"

# --verbose shows the solver on stderr and leaves the results alone.
check_exit 0 hl targets "$DATA/good/smith4.csv" --utilities "$DATA/good/smith4-levels.csv" --verbose -o "$WORK/v.txt"
check_grep "obj =" "$WORK/stderr"
cmp -s "$WORK/s.txt" "$WORK/v.txt" && pass || fail "--verbose changed the report"
# Without it, nothing on stderr (GLPK stays silent).
check_exit 0 hl targets "$DATA/good/smith4.csv" --utilities "$DATA/good/smith4-levels.csv"
[ ! -s "$WORK/stderr" ] && pass || fail "GLPK wrote to stderr"
grep -q "obj =" "$WORK/stdout" && fail "GLPK wrote to stdout" || pass

# No utility can serve: the process targets still print (they need no
# utility: kemp4 at 10 K, 20 / 60 kW, pinch 90/80 °C, see kemp4.csv), then
# the reason, and the command exits 3.
printf 'name,kind,supply,target,price\nsteam,hot,250,250,30\n' >"$WORK/nocold.csv"
check_exit 3 hl targets "$DATA/good/kemp4.csv" --utilities "$WORK/nocold.csv" -o "$WORK/none.txt"
check_grep "the process must reject 60.0 kW of heat below 85.0 °C shifted (hot streams at 90.0 °C) but the case has no cold utility" "$WORK/stderr"
check_grep "Minimum hot utility    20.0 kW" "$WORK/none.txt"
check_grep "Minimum cold utility   60.0 kW" "$WORK/none.txt"
check_grep "Pinch                  90.0 °C hot / 80.0 °C cold" "$WORK/none.txt"
check_grep "Utility levels         none: the utilities cannot serve the process." "$WORK/none.txt"
check_grep "but the case has no cold utility" "$WORK/none.txt"
check_exit 3 hl targets "$DATA/good/kemp4.csv" --utilities "$WORK/nocold.csv"
check_grep "Minimum cold utility   60.0 kW" "$WORK/stdout"
check_exit 3 hl targets "$DATA/good/kemp4.csv" --utilities "$WORK/nocold.csv" --format xml -o "$WORK/none.xml"
valid "$WORK/none.xml"
check_near "$(xpath 'string(/results/targets/@cold-utility)' "$WORK/none.xml")" 60 1e-9 "no-utility XML QCmin"

# The demo plant: three steam levels, cooling and chilled water.
check_exit 0 hl targets "$CASES/demo-streams.csv" --utilities "$CASES/demo-utilities.csv" --format xml -o "$WORK/d.xml"
valid "$WORK/d.xml"
check_near "$(xpath 'sum(/results/targets/utility[@kind="hot"]/@load)' "$WORK/d.xml")" \
	"$(xpath 'string(/results/targets/@hot-utility)' "$WORK/d.xml")" 1e-9 "demo hot total"
finish
