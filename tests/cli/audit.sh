#!/bin/sh
# audit.sh - `heatloom audit`: today's network against the targets.
#
# The four-stream problem (Linnhoff et al., User Guide on Process
# Integration, IChemE 1982; Kemp, Pinch Analysis and Process Integration,
# 2007, ch. 2; from memory, confirmed by a hand cascade): at ΔTmin 10 K
# QHmin 20 kW, QCmin 60 kW, pinch 90/80 °C. The networks are constructed by
# hand (tests/data/good/kemp4-network.csv and below); utilities invented.
. "$TOP_SRCDIR/tests/cli/lib.sh"

K4="$DATA/good/kemp4.csv"
U4="$DATA/good/kemp4-utilities.csv"
N4="$DATA/good/kemp4-network.csv"

# The demo plant: a saving, the culprits and a payback, no warnings.
check_exit 0 hl audit "$CASES/demo.xml" --network "$CASES/demo-network.csv" \
	--svg "$WORK/demo.svg"
for s in "Saving potential" "Culprits" "simple payback" "α  " \
	"qualified engineers" "screening only"; do
	check_grep "$s" "$WORK/stdout"
done
[ ! -s "$WORK/stderr" ] && pass || fail "demo audit warns: $(head -n 1 "$WORK/stderr")"

# kemp4-network.csv, by hand: E2 passes 90 kW across the pinch (H2 150 ->
# 90 °C above it, C1 20 -> 65 °C below it); S-1 puts 2.0 x (80 - 65) =
# 30 kW of steam below it. Today's steam 140 kW = 20 + 90 + 30; cooling
# 180 kW = 60 + 120 (each kW across costs a kW of both: Linnhoff et al.
# 1982, from memory).
if [ -n "${XMLLINT:-}" ]; then
	check_exit 0 hl audit "$K4" --utilities "$U4" --network "$N4" \
		--format xml -o "$WORK/k4.xml"
	check_exit 0 "$XMLLINT" --noout --relaxng "$TOP_SRCDIR/doc/results.rng" \
		"$WORK/k4.xml"
	a=/results/audit
	check_near "$(xpath "string($a/@hot-utility-now)" "$WORK/k4.xml")" 140 1e-9 "steam today"
	check_near "$(xpath "string($a/@cold-utility-now)" "$WORK/k4.xml")" 180 1e-9 "cooling today"
	check_near "$(xpath "string($a/@hot-utility-target)" "$WORK/k4.xml")" 20 1e-9 "QHmin"
	check_near "$(xpath "string($a/@saving)" "$WORK/k4.xml")" 120 1e-9 "saving"
	check_near "$(xpath "string($a/@saving-cold)" "$WORK/k4.xml")" 120 1e-9 "cold saving"
	check_near "$(xpath "string($a/violation[@exchanger='E2']/@duty)" "$WORK/k4.xml")" 90 1e-9 "E2 across"
	[ "$(xpath "string($a/violation[@exchanger='E2']/@kind)" "$WORK/k4.xml")" = across ] &&
		pass || fail "E2 kind"
	check_near "$(xpath "string($a/violation[@exchanger='S-1']/@duty)" "$WORK/k4.xml")" 30 1e-9 "S-1 below"
	[ "$(xpath "string($a/violation[@exchanger='S-1']/@kind)" "$WORK/k4.xml")" = hot-below ] &&
		pass || fail "S-1 kind"
	check_near "$(xpath "sum($a/violation/@duty)" "$WORK/k4.xml")" 120 1e-9 "sum of violations"
	# Today's point is on the retrofit curve: A_target(E_now)/α = A_existing.
	check_near "$(xpath "string($a/retrofit/point[1]/@area-retrofit)" "$WORK/k4.xml")" \
		"$(xpath "string($a/@area-existing)" "$WORK/k4.xml")" 1e-9 "retrofit start"
	# The same network from the case file's <network file=...>.
	check_exit 0 hl audit "$DATA/good/case-tables.xml" --format xml -o "$WORK/ct.xml"
	check_near "$(xpath "string($a/@alpha)" "$WORK/ct.xml")" \
		"$(xpath "string($a/@alpha)" "$WORK/k4.xml")" 1e-12 "alpha from the case file"

	# A minimum-energy network, constructed by hand: every unit on one
	# side of the pinch; no violation and no saving.
	cat >"$WORK/mer.csv" <<-EOF
	name,hot,cold,duty,hot_in,hot_out,cold_in,cold_out
	E1,H1,C2,240,170,90,80,140
	E2,H2,C1,90,150,90,80,125
	E3,H1,C1,90,90,60,35,80
	E4,H2,C1,30,90,70,20,35
	S1,steam,C1,20,,,125,135
	CW1,H2,cooling water,60,70,30,,
	EOF
	check_exit 0 hl audit "$K4" --utilities "$U4" --network "$WORK/mer.csv" \
		--format xml -o "$WORK/mer.xml"
	check_exit 0 "$XMLLINT" --noout --relaxng "$TOP_SRCDIR/doc/results.rng" "$WORK/mer.xml"
	[ "$(xpath "count($a/violation)" "$WORK/mer.xml")" = 0 ] && pass || fail "MER violations"
	check_near "$(xpath "string($a/@saving)" "$WORK/mer.xml")" 0 1e-9 "MER saving"
	check_near "$(xpath "string($a/@dtmin-now)" "$WORK/mer.xml")" 10 1e-6 "MER ΔTmin now"
	[ "$(xpath "count($a/retrofit/point)" "$WORK/mer.xml")" = 0 ] && pass || fail "MER retrofit"

	check_exit 0 hl audit "$CASES/demo.xml" --network "$CASES/demo-network.csv" \
		--format xml -o "$WORK/demo.xml"
	check_exit 0 "$XMLLINT" --noout --relaxng "$TOP_SRCDIR/doc/results.rng" "$WORK/demo.xml"
	check_exit 0 "$XMLLINT" --noout "$WORK/demo.svg"
	# doc/results.md's example runs as printed: every attribute it shows
	# is in the program's output, on the element it shows it on.
	sed -n '/^From `heatloom audit cases\/demo.xml/,/^## CSV/p' \
		"$TOP_SRCDIR/doc/results.md" | sed -n 's/^    //p' | tr '\n' ' ' |
		sed 's|/> *|/>\n|g; s|"> *|">\n|' >"$WORK/doc-elems"
	[ "$(grep -c 'exchanger=' "$WORK/doc-elems")" -eq 6 ] && pass ||
		fail "doc/results.md audit example not found"
	while read -r line; do
		case $line in
		"<violation "*) x=$(printf '%s' "$line" | sed 's/.*exchanger="\([^"]*\)".*/\1/')
			el="$a/violation[@exchanger='$x']" what="violation '$x'" ;;
		"<audit "*) el=$a what="<audit>" ;;
		*) continue ;;
		esac
		for at in $(printf '%s' "$line" | grep -o '[a-z-]*="[^"]*"' |
			    sed 's/ /_/g'); do
			n=${at%%=*}
			v=$(printf '%s' "${at#*=}" | tr -d '"' | sed 's/_/ /g')
			[ "$(xpath "string($el/@$n)" "$WORK/demo.xml")" = "$v" ] && pass ||
				fail "doc/results.md shows $n=\"$v\" on $what"
		done
	done <"$WORK/doc-elems"
fi
check_grep "retrofit at constant" "$WORK/demo.svg"
if [ -n "${RSVG_CONVERT:-}" ]; then
	check_exit 0 "$RSVG_CONVERT" -o "$WORK/demo.png" "$WORK/demo.svg"
fi

# CSV: the retrofit curve (columns are a contract), today's point first.
check_exit 0 hl audit "$K4" --utilities "$U4" --network "$N4" --format csv -o "$WORK/r.csv"
[ "$(head -n 1 "$WORK/r.csv")" = "hot_utility,cold_utility,dtmin,area_target,area_retrofit,new_area,investment,saving,payback" ] &&
	pass || fail "csv header"
[ "$(wc -l <"$WORK/r.csv")" -eq 12 ] && pass || fail "csv rows"
awk -F, 'NR == 2 { exit !($1 == 140 && $6 == 0 && $9 == "") }' "$WORK/r.csv" &&
	pass || fail "csv first row"
awk -F, 'END { exit !($1 == 20 && $3 == 10) }' "$WORK/r.csv" && pass || fail "csv last row"

# Inconsistent data is warned with its line and read on: a duty against
# both sides' temperatures (3.0 x 80 = 4.0 x 60 = 240 kW, not 300).
sed 's/^E1,H1,C2,240,/E1,H1,C2,300,/' "$N4" >"$WORK/bad-duty.csv"
check_exit 0 hl audit "$K4" --utilities "$U4" --network "$WORK/bad-duty.csv"
check_grep "heatloom: $WORK/bad-duty.csv:6: warning: unit 'E1': duty 300.0 kW, but both sides' temperatures give 240.0 kW" "$WORK/stderr"
# A stream whose units stop short: the heater's row left out.
grep -v '^S-1' "$N4" >"$WORK/short.csv"
check_exit 0 hl audit "$K4" --utilities "$U4" --network "$WORK/short.csv"
check_grep "heatloom: $K4:6: warning: stream 'C1': its units stop at 65.0 °C" "$WORK/stderr"
check_grep "gap on C1" "$WORK/stdout"
# The case file's inline network covers two units: the rest are gaps.
check_exit 0 hl audit "$DATA/good/case-inline.xml"
check_grep "warning: stream 'H1': its units stop at 90.0 °C" "$WORK/stderr"

# Usage and protection of the inputs.
check_exit 1 hl audit
check_exit 1 hl audit "$K4" --network
check_exit 1 hl audit "$K4" --format html
check_exit 1 hl audit "$K4" --utilities "$U4" --network "$N4" -o "$N4"
check_grep "refusing to overwrite an input file" "$WORK/stderr"
check_exit 1 hl audit "$K4" --utilities "$U4" --network "$N4" --svg "$N4"
check_exit 0 hl help audit
check_grep "qualified engineers" "$WORK/stdout"
check_exit 0 hl --help
check_grep "audit" "$WORK/stdout"

# Today's units by their type: E2 a plate unit (F = 1), C-2 an air cooler
# (crossflow F below 1); the estimated area is duty/(U·F·LMTD) (Kern 1950,
# ch. 7) [derived].
NT="$DATA/good/kemp4-network-types.csv"
if [ -n "${XMLLINT:-}" ]; then
	check_exit 0 hl audit "$K4" --utilities "$U4" --network "$NT" \
		--format xml -o "$WORK/kt.xml"
	check_exit 0 "$XMLLINT" --noout --relaxng "$TOP_SRCDIR/doc/results.rng" \
		"$WORK/kt.xml"
	e() { xpath "string(/results/audit/exchanger[@id='$1']/@$2)" "$WORK/kt.xml"; }
	[ "$(e E2 type)" = plate ] && pass || fail "E2 not plate"
	check_near "$(e E2 ft)" 1 0 "plate F"
	check_near "$(e E2 area)" "$(awk -v u="$(e E2 u)" -v l="$(e E2 lmtd)" 'BEGIN { printf "%.15g", 90/(u*l) }')" 1e-9 "plate area"
	[ "$(e C-2 type)" = air-cooler ] && pass || fail "C-2 not an air cooler"
	awk -v f="$(e C-2 ft)" 'BEGIN { exit !(f > 0.8 && f < 1) }' && pass || fail "air cooler F"
	check_near "$(e C-2 area)" "$(awk -v u="$(e C-2 u)" -v l="$(e C-2 lmtd)" -v f="$(e C-2 ft)" 'BEGIN { printf "%.15g", 90/(u*f*l) }')" 1e-9 "air cooler area"
	[ "$(e E1 type)" = shell-and-tube ] && pass || fail "E1 default type"
fi
# A fired heater needs a hot utility on its hot side.
sed 's/^E1,H1,C2,240,170,90,80,140,31.5,2,$/E1,H1,C2,240,170,90,80,140,31.5,2,fired-heater/' \
	"$NT" >"$WORK/bad-type.csv"
check_exit 2 hl audit "$K4" --utilities "$U4" --network "$WORK/bad-type.csv"
check_grep "unit 'E1': a fired-heater needs a hot utility" "$WORK/stderr"

# The retrofit curve's area target keeps today's mix of utility levels;
# `sweep` takes the least-cost mix: the output says so, and the figure it
# quotes for `sweep` is sweep's own at that ΔTmin.
check_exit 0 hl audit "$CASES/demo.xml" --network "$CASES/demo-network.csv"
check_grep "The target area keeps today's mix of utility levels" "$WORK/stdout"
check_grep "so its area target differs: at ΔTmin" "$WORK/stdout"
if [ -n "${XMLLINT:-}" ]; then
	check_exit 0 hl audit "$CASES/demo.xml" --network "$CASES/demo-network.csv" --format xml -o "$WORK/gap.xml"
	dt=$(xpath 'string(//retrofit/point[4]/@dtmin)' "$WORK/gap.xml")
	as=$(xpath 'string(//retrofit/point[4]/@area-sweep)' "$WORK/gap.xml")
	check_exit 0 hl sweep "$CASES/demo.xml" --from "$dt" --to "$dt" --format xml -o "$WORK/one.xml"
	check_near "$as" "$(xpath 'string(//sweep/point/@area-shell-and-tube)' "$WORK/one.xml")" 1e-9 "area-sweep is sweep's"
fi
finish
