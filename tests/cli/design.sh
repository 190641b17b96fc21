#!/bin/sh
# design.sh - `heatloom design` end to end: the four-stream network, a
# forced split, the demo plant, the formats, the grid diagram, bad options.
. "$TOP_SRCDIR/tests/cli/lib.sh"

if [ -z "${XMLLINT:-}" ]; then
	echo "SKIP: xmllint not found (Debian package libxml2-utils)"
	exit 77
fi

X="$WORK/n.xml"

valid() {
	if "$XMLLINT" --noout --relaxng "$TOP_SRCDIR/doc/results.rng" "$1" \
	    2>"$WORK/lint"; then
		pass
	else
		fail "$1 does not match doc/results.rng"; cat "$WORK/lint" >&2
	fi
}

# at ID ATTR: an attribute of one exchanger of $X.
at() {
	xpath "string(/results/network/exchanger[@id='$1']/@$2)" "$X"
}

net() {
	xpath "string(/results/network/@$1)" "$X"
}

# Every exchanger of $X keeps its required approach.
approaches() {
	n=$(xpath 'count(/results/network/exchanger)' "$X")
	i=1
	while [ "$i" -le "$n" ]; do
		a=$(xpath "string(/results/network/exchanger[$i]/@approach)" "$X")
		r=$(xpath "string(/results/network/exchanger[$i]/@required)" "$X")
		awk -v a="$a" -v r="$r" 'BEGIN { exit !(a >= r - 1e-6) }' \
			&& pass || fail "exchanger $i: approach $a below $r"
		i=$((i + 1))
	done
}

# The four-stream problem (Linnhoff et al., User Guide on Process
# Integration, IChemE 1982; Kemp, Pinch Analysis and Process Integration,
# 2007, ch. 2; from memory, targets confirmed by a hand cascade): at ΔTmin
# 10 K, 20 / 60 kW and six units (doc/references.md). The temperatures are those
# of the network the pinch design rules give (derived by hand: H1-C2 240 kW
# from 170 to 90 °C against 80 to 140 °C, H2-C1 90 kW 150 -> 90 against
# 80 -> 125, H1-C1 90 kW 90 -> 60 against 35 -> 80, H2-C1 30 kW 90 -> 70
# against 20 -> 35, steam on C1 from 125 °C, cooling water on H2 to 30 °C).
check_exit 0 hl design "$DATA/good/kemp4.csv" --utilities "$DATA/good/kemp4-utilities.csv" --method units --format xml -o "$X"
valid "$X"
check_near "$(net hot-utility)" 20 1e-9 "kemp4 hot utility"
check_near "$(net cold-utility)" 60 1e-9 "kemp4 cold utility"
check_near "$(net units)" 6 0 "kemp4 units"
check_near "$(net matches)" 6 0 "kemp4 matches"
check_near "$(net energy-penalty)" 0 0 "kemp4 penalty"
check_near "$(at E1 hot-in)" 170 1e-9 "E1 hot in"
check_near "$(at E1 cold-out)" 140 1e-9 "E1 cold out"
check_near "$(at E2 cold-out)" 125 1e-9 "E2 cold out"
check_near "$(at E3 cold-in)" 35 1e-9 "E3 cold in"
check_near "$(at E4 hot-out)" 70 1e-9 "E4 hot out"
check_near "$(xpath "string(/results/network/exchanger[@hot='steam']/@cold-in)" "$X")" 125 1e-9 "heater in"
approaches
# Counterflow area of H1-C2 by hand: U = 1/(1/0.5 + 1/0.5) (both h assumed),
# LMTD of 30 and 10 K = 20/ln 3 (Kern 1950, ch. 5), over F.
check_near "$(at E1 area)" "$(awk -v f="$(at E1 ft)" 'BEGIN { printf "%.15g", 240 / (0.25 * 20 / log(3) * f) }')" 1e-9 "E1 area"
check_exit 0 hl check "$X"
check_grep "sound" "$WORK/stdout"

# The same network in text and CSV.
check_exit 0 hl design "$DATA/good/kemp4.csv" --utilities "$DATA/good/kemp4-utilities.csv" --method units
check_grep "Units                       6 for 6 matches, 0 stream splits" "$WORK/stdout"
check_grep "C1 (cold): 20.0 → E4 → 35.0 → E3 → 80.0 → E2 → 125.0 → E5 → 135.0" "$WORK/stdout"
check_grep "screening estimates" "$WORK/stdout"
check_exit 0 hl design "$DATA/good/kemp4.csv" --utilities "$DATA/good/kemp4-utilities.csv" --method units --format csv -o "$WORK/n.csv"
[ "$(wc -l <"$WORK/n.csv")" -eq 7 ] && pass || fail "CSV: not a header and 6 rows"
check_grep "id,hot,cold,type,duty,hot_in,hot_out,cold_in,cold_out" "$WORK/n.csv"
check_grep "E1,H1,C2,shell-and-tube,240,170,90,80,140,1,1,1,1," "$WORK/n.csv"

# The file check reads is what design writes.
check_exit 0 hl design "$DATA/good/kemp4.csv" --utilities "$DATA/good/kemp4-utilities.csv" --method units --format xml
grep -v 'source=' "$WORK/stdout" | grep '<exchanger' >"$WORK/a"
grep '<exchanger' "$DATA/good/kemp4-designed.xml" >"$WORK/b"
cmp -s "$WORK/a" "$WORK/b" && pass || fail "kemp4-designed.xml is not what design writes"

# Without utilities: the implicit pair at the targets.
check_exit 0 hl design "$DATA/good/kemp4.csv" --format xml -o "$X"
valid "$X"
check_near "$(xpath 'count(/results/network/utility[@implicit="yes"])' "$X")" 2 0 "implicit utilities"
check_near "$(net hot-utility)" 20 1e-9 "implicit hot utility"
check_exit 0 hl check "$X"

# Segmented H2 (two segments of equal cp, one by duty): the same targets.
check_exit 0 hl design "$DATA/good/kemp4.xml" --format xml -o "$X"
valid "$X"
check_near "$(net hot-utility)" 20 1e-9 "segmented hot utility"
check_exit 0 hl check "$X"

# A forbidden pair raises the utilities above the targets: the network
# declares the rise (hot-utility = hot-target + rule-penalty), no H1-C2 unit
# is built, and the check accepts it.
check_exit 0 hl design "$DATA/good/kemp4-forbid.xml" --format xml -o "$X"
valid "$X"
check_near "$(net hot-target)" 20 1e-9 "forbid target"
check_near "$(net hot-utility)" "$(awk -v t="$(net hot-target)" -v r="$(net rule-penalty)" 'BEGIN { printf "%.15g", t + r }')" 1e-9 "forbid rise"
awk -v r="$(net rule-penalty)" 'BEGIN { exit !(r > 0) }' && pass || fail "no rule penalty"
check_near "$(xpath "count(/results/network/exchanger[@hot='H1' and @cold='C2'])" "$X")" 0 0 "forbidden pair"
check_exit 0 hl check "$X"

# A stream that must split (tests/data/good/split3.csv, built by hand): C
# splits between H1 and H2, both branches enter at 80 °C, shares sum to 1.
check_exit 0 hl design "$DATA/good/split3.csv" --utilities "$DATA/good/split3-utilities.csv" --method units --format xml -o "$X"
valid "$X"
check_near "$(net splits)" 1 0 "split3 splits"
check_near "$(net units)" 3 0 "split3 units"
check_near "$(net hot-utility)" 70 1e-9 "split3 hot utility"
s1=$(xpath "string(/results/network/exchanger[@hot='H1']/@cold-share)" "$X")
s2=$(xpath "string(/results/network/exchanger[@hot='H2']/@cold-share)" "$X")
check_near "$(awk -v a="$s1" -v b="$s2" 'BEGIN { printf "%.15g", a + b }')" 1 1e-9 "split3 shares"
check_near "$(xpath "string(/results/network/exchanger[@hot='H2']/@cold-in)" "$X")" 80 1e-9 "split3 branch inlet"
approaches
check_exit 0 hl check "$X"

# The demo plant: a sound network that uses the targets plus what it says.
check_exit 0 hl design "$CASES/demo.xml" --format xml -o "$X" --svg "$WORK/grid.svg"
valid "$X"
approaches
check_exit 0 hl check "$X"
check_near "$(net hot-utility)" "$(awk -v t="$(net hot-target)" -v r="$(net rule-penalty)" -v p="$(net energy-penalty)" 'BEGIN { printf "%.15g", t + r + p }')" 1e-9 "demo hot utility"
"$XMLLINT" --noout "$WORK/grid.svg" && pass || fail "grid.svg is not XML"
check_grep "<svg" "$WORK/grid.svg"
# The demo's LP steam level makes a utility pinch at 160 / 150 °C beside the
# process pinch at 158 / 148 °C: the diagram names it apart.
check_grep ">utility pinch 160 / 150 °C<" "$WORK/grid.svg"
check_grep ">pinch 158 / 148 °C<" "$WORK/grid.svg"
check_grep ">utility pinch<" "$WORK/grid.svg"
# A cooler's duty (below its line) stays clear of the next line's end
# temperature (above that line): at least 12 units apart at 10.5-unit text.
awk '
	/<text/ && />[0-9]+<\/text>/ { match($0, /y="[0-9.]+"/); y = substr($0, RSTART + 3, RLENGTH - 4)
		match($0, /x="[0-9.]+"/); x = substr($0, RSTART + 3, RLENGTH - 4); if (x > 900) d[++n] = y }
	/<text/ && /°C<\/text>/ && /text-anchor="end"/ { match($0, /y="[0-9.]+"/); e[++m] = substr($0, RSTART + 3, RLENGTH - 4) }
	END { bad = 0; for (i = 1; i <= n; i++) for (j = 1; j <= m; j++) { g = e[j] - d[i]; if (g > 0 && g < 12) bad = 1 } exit bad }
' "$WORK/grid.svg" && pass || fail "a cooler duty runs into an end temperature in grid.svg"
if [ -n "${RSVG_CONVERT:-}" ]; then
	check_exit 0 "$RSVG_CONVERT" -o "$WORK/grid.png" "$WORK/grid.svg"
	[ "$(head -c 8 "$WORK/grid.png" | od -An -tx1 | tr -d ' \n')" = 89504e470d0a1a0a ] \
		&& pass || fail "grid.png is not a PNG"
fi
check_exit 0 hl design "$DATA/good/kemp4.csv" --utilities "$DATA/good/kemp4-utilities.csv" --svg "$WORK/k.svg" --quiet -o "$WORK/k.txt"
check_grep "pinch 90 / 80 °C" "$WORK/k.svg"
# The grid is 170 mm wide (A4 inside its margins) when it fits.
check_grep 'width="170mm"' "$WORK/k.svg"

# Options and inputs that are refused, with nothing written.
check_exit 1 hl design "$DATA/good/kemp4.csv" --emat 12
check_grep "--emat" "$WORK/stderr"
check_exit 1 hl design "$DATA/good/kemp4.csv" --svg "$WORK/same" -o "$WORK/same"
check_exit 1 hl design
check_exit 1 hl design "$DATA/good/kemp4.csv" --format svg
check_exit 2 hl design "$DATA/good/kemp4.csv" --dtmin 0 -o "$WORK/zero.txt"
[ -e "$WORK/zero.txt" ] && fail "a failed design wrote its output" || pass
check_exit 0 hl design --help
check_grep "screening estimates" "$WORK/stdout"

# Exchanger types per utility and per pair; check prices them again.
TC="$DATA/good/kemp4-types.xml"
check_exit 0 hl design "$TC" --method units --format xml -o "$X"
valid "$X"
ty() { xpath "string(/results/network/exchanger[@$1]/@$2)" "$X"; }
[ "$(ty "hot='flue gas'" type)" = fired-heater ] && pass || fail "flue gas unit not a fired heater"
[ "$(ty "cold='air'" type)" = air-cooler ] && pass || fail "air unit not an air cooler"
[ "$(ty "hot='H2' and @cold='C1'" type)" = plate ] && pass || fail "H2/C1 not plate"
check_near "$(ty "hot='flue gas'" area)" 0 0 "fired heater: no area"
# 80000 + 109000·Q^0.8 at Q = 0.02 MW (the case's law) [formula check].
check_near "$(ty "hot='flue gas'" cost)" "$(awk 'BEGIN { printf "%.15g", 80000 + 109000*exp(0.8*log(0.02)) }')" 1e-9 "fired heater cost"
check_near "$(ty "hot='H2' and @cold='C1'" parallel)" 5 0 "plates in parallel beyond 5 m²"
check_grep "below the smallest plausible" "$X"
check_exit 0 hl check "$X"
check_grep "sound, 0 problems" "$WORK/stdout"

# The least-cost search prices its units by the same types and laws: every
# H2/C1 unit a plate, every cooler on air an air cooler, every unit on
# steam at 0 + 1200·A^0.6 per shell [formula check], and check agrees.
check_exit 0 hl design "$TC" --format xml -o "$X"
valid "$X"
every() {	# every EXPR-selected exchanger has type $2
	n=$(xpath "count(/results/network/exchanger[$1])" "$X")
	m=$(xpath "count(/results/network/exchanger[$1][@type='$2'])" "$X")
	[ "$n" -ge 1 ] && [ "$n" = "$m" ] && pass ||
		fail "least-cost: $m of $n units [$1] are $2"
}
every "@hot='H2' and @cold='C1'" plate
every "@cold='air'" air-cooler
n=$(xpath "count(/results/network/exchanger[@hot='steam'])" "$X")
i=1
while [ "$i" -le "$n" ]; do
	e="/results/network/exchanger[@hot='steam'][$i]"
	check_near "$(xpath "string($e/@cost)" "$X")" "$(awk \
	    -v a="$(xpath "string($e/@area-shell)" "$X")" \
	    -v s="$(xpath "string($e/@shells)" "$X")" \
	    'BEGIN { printf "%.15g", s*1200*exp(0.6*log(a)) }')" 1e-9 \
	    "least-cost heater $i at 1200·A^0.6"
	i=$((i + 1))
done
check_exit 0 hl check "$X"
check_grep "sound, 0 problems" "$WORK/stdout"


# Heaters priced apart from process units through the utility table's own
# cost law (0 + 1200·A^0.6 per shell) [formula check]; the cooler by type.
check_exit 0 hl design "$DATA/good/kemp4.csv" --utilities "$DATA/good/kemp4-utilities-typed.csv" --format xml -o "$X"
valid "$X"
A=$(ty "hot='steam'" area-shell)
check_near "$(ty "hot='steam'" cost)" "$(awk -v a="$A" -v n="$(ty "hot='steam'" shells)" 'BEGIN { printf "%.15g", n*1200*exp(0.6*log(a)) }')" 1e-9 "heater law 1200·A^0.6"
[ "$(ty "cold='cooling water'" type)" = plate ] && pass || fail "cooler not plate"
check_exit 0 hl check "$X"


# A default type per utility kind: cooler-type makes every cooler without
# its own type an air cooler; heaters stay shell-and-tube.
sed 's|<settings dtmin="10">|<settings dtmin="10" cooler-type="air-cooler">|; s| type="air-cooler"/>|/>|; s|<utility name="flue gas"[^>]*/>||' \
	"$DATA/good/kemp4-types.xml" >"$WORK/kinds.xml"
check_exit 0 hl design "$WORK/kinds.xml" --format xml -o "$X"
[ "$(ty "cold='air'" type)" = air-cooler ] && pass || fail "cooler-type not applied"
[ "$(ty "hot='steam'" type)" = shell-and-tube ] && pass || fail "heater not shell-and-tube"
check_exit 0 hl check "$X"
sed 's|<settings dtmin="10">|<settings dtmin="10" heater-type="air-cooler">|' \
	"$DATA/good/kemp4-types.xml" >"$WORK/kinds-bad.xml"
check_exit 2 hl design "$WORK/kinds-bad.xml"
check_grep "heater-type cannot be air-cooler" "$WORK/stderr"

finish
