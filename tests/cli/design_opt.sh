#!/bin/sh
# design_opt.sh - `heatloom design`'s least-cost search end to end: every
# network passes `check` and the schema, each limit the engineer sets is
# kept, a start from a file, units marked to stay, the same seed gives the
# same document, bad options. The demo plant is invented (cases/); the
# facts checked are the tool's own contract (doc/case-file.md, design).
. "$TOP_SRCDIR/tests/cli/lib.sh"

if [ -z "${XMLLINT:-}" ]; then
	echo "SKIP: xmllint not found (Debian package libxml2-utils)"
	exit 77
fi

X="$WORK/n.xml"
Q="--effort 0.1 --quiet"

valid() {
	if "$XMLLINT" --noout --relaxng "$TOP_SRCDIR/doc/results.rng" "$1" \
	    2>"$WORK/lint"; then
		pass
	else
		fail "$1 does not match doc/results.rng"; cat "$WORK/lint" >&2
	fi
}

net() {
	xpath "string(/results/network/@$1)" "$X"
}

# least VALUE XPATH-OF-A-SET: every value of the set is at least VALUE.
least() {
	n=$(xpath "count($2[. < $1])" "$X")
	[ "$n" = 0 ] && pass || fail "$n values of $2 below $1"
}

# The demo plant under the limits its fewest-units start keeps (no smallest
# unit): sound, in the schema, and no dearer than the start it reports.
check_exit 0 hl design "$CASES/demo.xml" $Q --min-duty 0 --format xml -o "$X"
valid "$X"
check_exit 0 hl check "$X"
check_grep "sound" "$WORK/stdout"
awk -v t="$(net total-cost)" -v s="$(xpath 'string(/results/least-cost/@start-cost)' "$X")" \
	'BEGIN { exit !(t <= s * (1 + 1e-12)) }' && pass || fail "dearer than the start"

# By default no unit of the demo below 1 % of its largest stream duty (the
# text names the value): the start's 6 to 12 kW units and its three-way
# reboiler split go. At a tenth of the effort the walk after the repair is
# too short to bring the default within 3 % of the search's own result (a
# tenth of it is kept then), so this runs at 0.3. When the time cap cut the
# search short (valgrind), only the limit in force is checked.
D="--effort 0.3 --quiet"
check_exit 0 hl design "$CASES/demo.xml" $D --format xml -o "$X"
check_exit 0 hl check "$X"
m=$(xpath 'string(/results/least-cost/@smallest-unit)' "$X")
least "$m" "/results/network/exchanger/@duty"
if [ "$(xpath 'string(/results/least-cost/@time-capped)' "$X")" = yes ]; then
	echo "demo: the time cap stopped the search; the default's tier not compared"
else
	[ "$(xpath 'string(/results/least-cost/@smallest-unit-rule)' "$X")" = default ] &&
		pass || fail "the demo's smallest-unit-rule is not 'default'"
	awk -v m="$m" 'BEGIN { exit !(m > 10) }' && pass || fail "default smallest unit '$m'"
	check_exit 0 hl design "$CASES/demo.xml" $D
	check_grep "kW: 1 % of the largest stream duty, the default" "$WORK/stdout"
	t=$(sed -n 's/.*smallest unit \([0-9.]*\) kW: 1 %.*/\1/p' "$WORK/stdout")
	check_near "$t" "$m" 0.06 "the text's smallest unit"
fi
# Each unit of the start the network dropped says what it would do back.
n=$(xpath "count(/results/least-cost/dropped)" "$X")
w=$(xpath "count(/results/least-cost/dropped[@cost-with and @energy-with])" "$X")
[ "$n" -ge 1 ] && [ "$w" -ge 1 ] && pass || fail "dropped units: $w of $n say what they would do back"

# Rules on stream-utility pairs: C2 takes HP steam though LP steam is
# cheaper; H2 gives river water at most 20 kW (the case's <require> and
# <limit>).
check_exit 0 hl design "$DATA/good/kemp4-utility-rules.xml" $Q --format xml -o "$X"
check_exit 0 hl check "$X"
hp=$(xpath "sum(/results/network/exchanger[@hot='HP steam' and @cold='C2']/@duty)" "$X")
awk -v d="$hp" 'BEGIN { exit !(d > 0.01) }' && pass || fail "C2 takes no HP steam ($hp kW)"
check_lim=$(xpath "sum(/results/network/exchanger[@hot='H2' and @cold='river water']/@duty)" "$X")
awk -v d="$check_lim" 'BEGIN { exit !(d <= 20 * (1 + 1e-9)) }' && pass ||
	fail "H2 gives river water $check_lim kW, above its 20 kW"

# Plant areas, policy penalise: allowed, the least-cost network has a unit
# across the areas; weighed as 50 units, it has none.
cross="count(/results/network/exchanger[(@hot='H1' and @cold='C1') or (@hot='H2' and @cold='C2')])"
sed 's/policy="penalise" penalty="50"/policy="allow"/' "$DATA/good/kemp4-areas.xml" >"$WORK/areas.xml"
cp "$DATA/good/kemp4-utilities.csv" "$WORK/"
check_exit 0 hl design "$WORK/areas.xml" $Q --format xml -o "$X"
[ "$(xpath "$cross" "$X")" -ge 1 ] && pass || fail "no unit across the areas when allowed"
check_exit 0 hl design "$DATA/good/kemp4-areas.xml" $Q --format xml -o "$X"
check_exit 0 hl check "$X"
check_near "$(xpath "$cross" "$X")" 0 0 "units across penalised areas"

# No splits anywhere; none on one stream.
check_exit 0 hl design "$CASES/demo.xml" $Q --no-splits --format xml -o "$X"
check_near "$(net splits)" 0 0 "--no-splits"
check_exit 0 hl check "$X"
check_exit 0 hl design "$CASES/demo.xml" $Q --no-split "reactor feed" --format xml -o "$X"
check_near "$(xpath "count(/results/network/exchanger[@cold='reactor feed' and @cold-share < 1])" "$X")" 0 0 "--no-split NAME"
check_exit 0 hl check "$X"

# Smallest duty and area, most shells in series.
check_exit 0 hl design "$CASES/demo.xml" $Q --min-duty 10 --min-area 3 --max-shells 3 --format xml -o "$X"
least 10 "/results/network/exchanger/@duty"
least 3 "/results/network/exchanger/@area"
n=$(xpath "count(/results/network/exchanger[@shells > 3])" "$X")
[ "$n" = 0 ] && pass || fail "$n units above 3 shells"
check_exit 0 hl check "$X"

# At most two branches per split.
check_exit 0 hl design "$CASES/demo.xml" $Q --max-branches 2 --format text -o "$WORK/t.txt"
grep -q "3 branches\|4 branches" "$WORK/t.txt" && fail "a split of more than 2 branches" || pass
check_grep "Least-cost search" "$WORK/t.txt"
check_grep "screening estimates" "$WORK/t.txt"

# The same seed, the same document, on one thread or two.
check_exit 0 hl design "$CASES/demo.xml" $Q --seed 7 --threads 1 --format xml -o "$WORK/a.xml"
check_exit 0 hl design "$CASES/demo.xml" $Q --seed 7 --threads 2 --format xml -o "$WORK/b.xml"
# A search the time cap cut short (valgrind) may differ from run to run,
# and says so in the document.
if [ "$(xpath 'string(/results/least-cost/@time-capped)' "$WORK/a.xml")" = yes ] ||
	[ "$(xpath 'string(/results/least-cost/@time-capped)' "$WORK/b.xml")" = yes ]; then
	echo "--seed 7: the time cap stopped a search; documents not compared"
else
	cmp -s "$WORK/a.xml" "$WORK/b.xml" && pass || fail "--seed 7: documents differ"
fi

# A start from a network design wrote, one unit marked to stay; and from a
# network table (pairs and duties only).
check_exit 0 hl design "$DATA/good/kemp4.csv" --utilities "$DATA/good/kemp4-utilities.csv" --method units --format xml -o "$WORK/start.xml"
check_exit 0 hl design "$DATA/good/kemp4.csv" --utilities "$DATA/good/kemp4-utilities.csv" $Q --from "$WORK/start.xml" --keep E1 --format xml -o "$X"
check_exit 0 hl check "$X"
h=$(xpath "string(/results/network/exchanger[@id='E1']/@hot)" "$WORK/start.xml")
c=$(xpath "string(/results/network/exchanger[@id='E1']/@cold)" "$WORK/start.xml")
check_near "$(xpath "count(/results/network/exchanger[@hot='$h' and @cold='$c'])" "$X")" 1 0 "kept unit $h-$c"
awk -v t="$(net total-cost)" -v s="$(xpath 'string(/results/network/@total-cost)' "$WORK/start.xml")" \
	'BEGIN { exit !(t <= s * (1 + 1e-12)) }' && pass || fail "dearer than --from"
printf 'name,hot,cold,duty\nX1,H1,C2,200\nX2,H2,C1,80\n' >"$WORK/start.csv"
check_exit 0 hl design "$DATA/good/kemp4.csv" --utilities "$DATA/good/kemp4-utilities.csv" $Q --from "$WORK/start.csv" --keep X2 --format xml -o "$X"
check_exit 0 hl check "$X"
check_near "$(xpath "count(/results/network/exchanger[@hot='H2' and @cold='C1'])" "$X")" 1 0 "kept X2"

# The same limits as case settings (<settings><design>, doc/case-file.md).
cp "$CASES"/demo-streams.csv "$CASES"/demo-utilities.csv "$WORK/"
sed 's|<cost a="10000" b="800" c="0.8"/>|<cost a="10000" b="800" c="0.8"/><design min-duty="10" max-branches="2"><no-split stream="reboiler"/></design>|' \
	"$CASES/demo.xml" >"$WORK/lim.xml"
check_exit 0 hl design "$WORK/lim.xml" $Q --format xml -o "$X"
least 10 "/results/network/exchanger/@duty"
check_near "$(xpath "count(/results/network/exchanger[@cold='reboiler' and @cold-share < 1])" "$X")" 0 0 "<no-split>"
check_exit 0 hl check "$X"
sed 's|stream="reboiler"|stream="nosuch"|' "$WORK/lim.xml" >"$WORK/bad.xml"
check_exit 2 hl design "$WORK/bad.xml"
grep -q "bad.xml:[0-9]*: <no-split> names 'nosuch'" "$WORK/stderr" && pass || fail "no file:line for <no-split>"

# Latent heat, a credit and a type rule at once (tests/data/good/latent.xml,
# invented; latent-utilities.csv raises steam at a negative price): design
# works on the latent-spread copy of the case, which must keep the type rule
# (every unit of oil a plate unit) and <no-split>; the network is sound, its
# energy cost counts the credit, and it costs no more than the fewest-units
# network.
sed 's|<settings dtmin="10"/>|<settings dtmin="10"><design><no-split stream="feed"/></design></settings>|; s|</streams>|</streams><matches><exchanger hot="oil" cold="*" type="plate"/></matches>|' \
	"$DATA/good/latent.xml" >"$WORK/lat.xml"
LU="$DATA/good/latent-utilities.csv"
check_exit 0 hl design "$WORK/lat.xml" --utilities "$LU" $Q --format xml -o "$X"
check_exit 0 hl check "$X"
check_grep "sound, 0 problems" "$WORK/stdout"
n=$(xpath "count(/results/network/exchanger[@hot='oil'])" "$X")
m=$(xpath "count(/results/network/exchanger[@hot='oil'][@type='plate'])" "$X")
[ "$n" -ge 1 ] && [ "$n" = "$m" ] && pass || fail "latent case: $m of $n oil units are plate"
check_near "$(xpath "count(/results/network/exchanger[@cold='feed' and @cold-share < 1])" "$X")" 0 0 "<no-split> on a latent case"
xpath "/results/network/exchanger[@cold='raise']" "$X" >/dev/null && pass || fail "no steam raised for the credit"
t=$(xpath "string(/results/network/@total-cost)" "$X")
check_exit 0 hl design "$WORK/lat.xml" --utilities "$LU" --method units --quiet --format xml -o "$WORK/u.xml"
u=$(xpath "string(/results/network/@total-cost)" "$WORK/u.xml")
awk -v t="$t" -v u="$u" 'BEGIN { a = u < 0 ? -u : u; exit !(t <= u + 1e-9 * a + 1e-6) }' && pass || fail "latent case: least cost $t above fewest units $u"

# EMAT 1 K under ΔTmin 10 K (tests/data/published/yg4.xml): the search may
# recover more than the ΔTmin targets allow, and check says so instead of
# calling it "at the targets".
check_exit 0 hl design "$TOP_SRCDIR/tests/data/published/yg4.xml" --dtmin 10 $Q --format xml -o "$X"
check_exit 0 hl check "$X"
if [ "$(awk -v p="$(xpath "string(/results/network/@energy-penalty)" "$X")" 'BEGIN { print (p < -0.01) }')" = 1 ]; then
	check_grep "below the targets (approaches under ΔTmin, down to EMAT)" "$WORK/stdout"
else
	grep -q "below the targets" "$WORK/stdout" && fail "check: below the targets at a penalty >= 0" || pass
fi

# --units us: the least-cost section in Btu/h like the rest of the text.
check_exit 0 hl design "$DATA/good/kemp4.csv" --utilities "$DATA/good/kemp4-utilities.csv" $Q --units us
sed -n '/^Least-cost search/,$p' "$WORK/stdout" >"$WORK/lc.txt"
check_grep "Btu/h (its heat to the utilities)" "$WORK/lc.txt"
grep -q ' kW' "$WORK/lc.txt" && fail "kW in the least-cost section with --units us" || pass

# Bad options: usage errors, nothing written.
check_exit 1 hl design "$CASES/demo.xml" --method fastest
check_exit 1 hl design "$CASES/demo.xml" --keep E1
check_exit 1 hl design "$CASES/demo.xml" --no-split nosuch -o "$WORK/none.txt"
[ -e "$WORK/none.txt" ] && fail "a failed design wrote its output" || pass
check_exit 1 hl design "$CASES/demo.xml" --max-shells 0
check_exit 1 hl design "$DATA/good/kemp4.csv" --utilities "$DATA/good/kemp4-utilities.csv" --from "$WORK/start.csv" --keep nosuch
printf 'name,hot,cold,duty\nX1,H1,nosuch,200\n' >"$WORK/bad.csv"
check_exit 2 hl design "$DATA/good/kemp4.csv" --utilities "$DATA/good/kemp4-utilities.csv" --from "$WORK/bad.csv"
# The limits need priced utilities (the search trades energy for capital).
check_exit 2 hl design "$DATA/good/kemp4.csv" --no-splits
check_exit 1 hl design "$DATA/good/kemp4.csv" --utilities "$DATA/good/kemp4-utilities.csv" --method units --min-duty 5
finish
