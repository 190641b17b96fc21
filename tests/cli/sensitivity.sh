#!/bin/sh
# sensitivity.sh - targets --sensitivity through the command line: the
# derivatives of the four-stream problem read back from XML and CSV, the
# schema, and the ranked report.
. "$TOP_SRCDIR/tests/cli/lib.sh"

K4="$DATA/good/kemp4.csv"

# XML: Linnhoff et al. (1982) / Kemp (2007) ch. 2 four-stream problem (from
# memory, targets hand-checked); derivatives derived by hand (the unit test
# test_sensitivity.c shows the working): the pinch rides on C2's supply.
if [ -n "${XMLLINT:-}" ]; then
	check_exit 0 hl targets "$K4" --sensitivity --format xml -o "$WORK/s.xml"
	if "$XMLLINT" --noout --relaxng "$TOP_SRCDIR/doc/results.rng" "$WORK/s.xml" 2>"$WORK/lint"; then
		pass
	else
		fail "sensitivity XML does not match doc/results.rng"; cat "$WORK/lint" >&2
	fi
	row='/results/sensitivity[@stream="C2" and @quantity="supply"]'
	check_near "$(xpath "string($row/@hot-minus)" "$WORK/s.xml")" -1.5 1e-9 "C2 supply dQH-"
	check_near "$(xpath "string($row/@hot-plus)" "$WORK/s.xml")" -1.5 1e-9 "C2 supply dQH+"
	check_near "$(xpath "string($row/@cold-plus)" "$WORK/s.xml")" 2.5 1e-9 "C2 supply dQC+"
	row='/results/sensitivity[@stream="H1" and @quantity="cp"]'
	check_near "$(xpath "string($row/@hot-plus)" "$WORK/s.xml")" -80 1e-9 "H1 cp dQH"
	check_near "$(xpath "string($row/@cold-plus)" "$WORK/s.xml")" 30 1e-9 "H1 cp dQC"
	check_near "$(xpath "string($row/@rank)" "$WORK/s.xml")" 1 0 "H1 cp rank"
	# ΔTmin: (65 − 20)/10 from the 20 K targets of references.md.
	check_near "$(xpath 'string(/results/sensitivity-dtmin/@hot-plus)' "$WORK/s.xml")" 4.5 1e-9 "dQH/dΔTmin"
	# The band re-solved at the worst corner (derived by hand).
	check_near "$(xpath 'string(/results/sensitivity-band[@target="hot"]/@high)' "$WORK/s.xml")" 66.6 1e-9 "QH band high"
	check_near "$(xpath 'count(/results/sensitivity)' "$WORK/s.xml")" 12 0 "rows"
	# The targets are still there, unchanged.
	check_near "$(xpath 'string(/results/targets/@hot-utility)' "$WORK/s.xml")" 20 1e-9 "QH"

	# Given by duty, a segment reports its duty; a segmented stream its
	# segments; the schema holds with utilities and prices too.
	check_exit 0 hl targets "$DATA/good/kemp4-duty-segmented.csv" --sensitivity \
		--format xml --utilities "$CASES/demo-utilities.csv" -o "$WORK/d.xml"
	"$XMLLINT" --noout --relaxng "$TOP_SRCDIR/doc/results.rng" "$WORK/d.xml" 2>/dev/null && pass ||
		fail "duty case XML does not match the schema"
	check_near "$(xpath 'count(/results/sensitivity[@quantity="duty"])' "$WORK/d.xml")" 5 0 "duty rows"
	check_near "$(xpath 'string(/results/sensitivity[@stream="H2" and @segment="2"]/@value)' "$WORK/d.xml")" 105 1e-9 "H2 segment 2 duty"
	# Several utility levels: the cost derivatives wait for the utility LP.
	[ "$(xpath 'string(/results/sensitivity-summary/@cost)' "$WORK/d.xml")" = levels ] && pass ||
		fail "cost basis is not 'levels'"
	[ "$(xpath 'count(/results/sensitivity[@cost-plus])' "$WORK/d.xml")" = 0 ] && pass ||
		fail "cost derivatives written for several levels"
fi

# CSV: one row per stream and quantity, then ΔTmin.
check_exit 0 hl targets "$K4" --sensitivity --format csv -o "$WORK/s.csv"
check_grep "rank,stream,quantity,segment,value,tolerance,hot_minus,hot_plus,cold_minus,cold_plus" "$WORK/s.csv"
check_grep ",C2,supply,,80,1,-1.5,-1.5,2.5,2.5,1.5,1.5,2.5,2.5,,,0" "$WORK/s.csv"
check_grep ",,dtmin,,10,,4.5,4.5,4.5,4.5," "$WORK/s.csv"
[ "$(wc -l <"$WORK/s.csv")" -eq 14 ] && pass || fail "CSV rows: $(wc -l <"$WORK/s.csv")"

# Text: the three to check first, the table, the bands, the caution. H1 cp
# and C2 cp tie at 12 kW on QHmin (derived by hand) and lead.
check_exit 0 hl targets "$K4" --sensitivity -o "$WORK/s.txt"
check_grep "Check these measurements first" "$WORK/s.txt"
check_grep "  1. H1 cp (3.00 kW/K): a ±5 % error in it moves QHmin by ±12.0 kW" "$WORK/s.txt"
check_grep "  2. C2 cp (4.00 kW/K): a ±5 % error in it moves QHmin by ±12.0 kW" "$WORK/s.txt"
check_grep "QHmin 20.0 kW lies within 0.0 … 66.6 kW" "$WORK/s.txt"
check_grep "Screening estimates" "$WORK/s.txt"
# Per-stream tolerances from the table replace the defaults.
printf 'name,supply,target,cp,cp_tol,t_tol\nC1,20,135,2.0,,\nH1,170,60,3.0,0.01,\nC2,80,140,4.0,,0.5\nH2,150,30,1.5,,\n' >"$WORK/tol.csv"
check_exit 0 hl targets "$WORK/tol.csv" --sensitivity --format csv -o "$WORK/tol.out"
check_grep ",H1,cp,1,3,0.03,-80,-80,30,30,2.4,2.4,0.9,0.9," "$WORK/tol.out"
check_grep ",C2,target,,140,0.5,4,4,0,0,2,2,0,0," "$WORK/tol.out"

# The demo plant: a report that names three data to check first.
check_exit 0 hl targets "$CASES/demo-streams.csv" --sensitivity
check_grep "  3. " "$WORK/stdout"
check_exit 0 hl help targets
check_grep "--sensitivity" "$WORK/stdout"
finish
