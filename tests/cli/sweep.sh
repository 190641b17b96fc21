#!/bin/sh
# sweep.sh - `heatloom sweep` and `targets --supertargets` on the demo plant.
. "$TOP_SRCDIR/tests/cli/lib.sh"

check_exit 0 hl sweep "$CASES/demo.xml" --from 2 --to 30 --step 2 \
	--cost-svg "$WORK/cost.svg" --area-svg "$WORK/area.svg"
check_grep "Optimum ΔTmin" "$WORK/stdout"
check_grep "qualified engineers" "$WORK/stdout"

# CSV columns are a contract (issue: supertargeting).
check_exit 0 hl sweep "$CASES/demo.xml" --from 2 --to 30 --step 2 --format csv -o "$WORK/s.csv"
[ "$(head -n 1 "$WORK/s.csv")" = "dtmin,hot_utility,cold_utility,area,units,shells,capital_cost,energy_cost,total_cost" ] &&
	pass || fail "csv header"
[ "$(wc -l <"$WORK/s.csv")" -eq 16 ] && pass || fail "csv rows"
# Each row: total = capital + energy (the annual figures add up).
awk -F, 'NR > 1 && $9 != "" { d = $7 + $8 - $9; if (d < 0) d = -d; if (d > 1e-6 * $9) bad = 1 }
	END { exit bad }' "$WORK/s.csv" && pass || fail "total != capital + energy"

if [ -n "${XMLLINT:-}" ]; then
	check_exit 0 hl sweep "$CASES/demo.xml" --from 2 --to 30 --step 2 --format xml -o "$WORK/s.xml"
	check_exit 0 "$XMLLINT" --noout --relaxng "$TOP_SRCDIR/doc/results.rng" "$WORK/s.xml"
	# The optimum costs no more than any grid point.
	opt=$(xpath 'string(/results/sweep/optimum/@total-cost)' "$WORK/s.xml")
	min=$(awk -F, 'NR > 1 && $9 != "" && (m == "" || $9 < m) { m = $9 } END { print m }' "$WORK/s.csv")
	awk -v o="$opt" -v m="$min" 'BEGIN { exit !(o <= m * (1 + 1e-12)) }' && pass ||
		fail "optimum $opt above the grid minimum $min"
	check_exit 0 "$XMLLINT" --noout "$WORK/cost.svg"
	check_exit 0 "$XMLLINT" --noout "$WORK/area.svg"
	check_grep "optimum" "$WORK/cost.svg"

	check_exit 0 hl targets "$CASES/demo.xml" --supertargets --format xml -o "$WORK/t.xml"
	check_exit 0 "$XMLLINT" --noout --relaxng "$TOP_SRCDIR/doc/results.rng" "$WORK/t.xml"
	# The same ΔTmin gives the same supertargets by both commands.
	check_exit 0 hl sweep "$CASES/demo.xml" --from 10 --to 10 --format xml -o "$WORK/one.xml"
	a=$(xpath 'string(/results/supertargets/@total-cost)' "$WORK/t.xml")
	b=$(xpath 'string(/results/sweep/point[1]/@total-cost)' "$WORK/one.xml")
	[ "$a" = "$b" ] && pass || fail "targets $a, sweep $b"
fi
if [ -n "${RSVG_CONVERT:-}" ]; then
	check_exit 0 "$RSVG_CONVERT" -o "$WORK/cost.png" "$WORK/cost.svg"
fi

check_exit 1 hl sweep "$CASES/demo.xml" --from 20 --to 10
check_exit 1 hl sweep "$CASES/demo.xml" --step 0
check_exit 0 hl targets "$CASES/demo.xml" --supertargets
check_grep "Total annual cost" "$WORK/stdout"
finish
