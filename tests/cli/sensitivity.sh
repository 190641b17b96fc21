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
	# ΔTmin: (65 − 20)/10 from the 20 K targets of doc/references.md.
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
	# Several utility levels: every row carries the utility LP's cost
	# derivatives, and each utility's temperatures have a row of their own.
	[ "$(xpath 'string(/results/sensitivity-summary/@cost)' "$WORK/d.xml")" = levels ] && pass ||
		fail "cost basis is not 'levels'"
	check_near "$(xpath 'count(/results/sensitivity[@cost-plus and @cost-minus])' "$WORK/d.xml")" \
		"$(xpath 'count(/results/sensitivity)' "$WORK/d.xml")" 0 "rows with cost derivatives"
	check_near "$(xpath 'count(/results/sensitivity-utility)' "$WORK/d.xml")" 7 0 "utility rows"

	# The demo plant (several levels). Checks derived by hand from the
	# demo's data (demo-streams.csv, demo-utilities.csv) and the method:
	check_exit 0 hl targets "$CASES/demo.xml" --sensitivity --format xml -o "$WORK/demo.xml"
	if "$XMLLINT" --noout --relaxng "$TOP_SRCDIR/doc/results.rng" "$WORK/demo.xml" 2>"$WORK/lint"; then
		pass
	else
		fail "demo sensitivity XML does not match doc/results.rng"; cat "$WORK/lint" >&2
	fi
	# Three steam levels, two water loops with a range: 3 + 2·2 rows.
	check_near "$(xpath 'count(/results/sensitivity-utility)' "$WORK/demo.xml")" 7 0 "demo utility rows"
	check_near "$(xpath 'count(/results/sensitivity-utility[@quantity="level"])' "$WORK/demo.xml")" 3 0 "level rows"
	# The reboiler's top (150 → 152 °C, cp 400 kW/K) lies above LP steam's
	# reach (160 − ΔTmin = 150 °C): each kelvin more on its target needs
	# 400 kW more hot utility (dQHmin = 400, above) and only MP or HP steam
	# can give it; MP is the cheaper: 400 kW × 30 EUR/MWh × 8000 h/yr =
	# 96 000 EUR a year per K (derived by hand).
	row='/results/sensitivity[@stream="reboiler" and @quantity="target"]'
	check_near "$(xpath "string($row/@cost-plus)" "$WORK/demo.xml")" 96000 1e-9 "reboiler target dcost+"
	check_near "$(xpath "string($row/@cost-minus)" "$WORK/demo.xml")" 96000 1e-9 "reboiler target dcost-"
	# Chilled water (5 °C, ΔT contribution 1.5 K) cools the vent condenser
	# (ΔT contribution 1.5 K) to exactly 5 + 1.5 + 1.5 = 8 °C, its target:
	# no utility can take it lower, nor serve it with chilled water any
	# warmer. Those sides are infinite ("-inf", "inf"); the other sides are
	# finite, and the infinite side ranks the vent condenser's target first.
	row='/results/sensitivity[@stream="vent condenser" and @quantity="target"]'
	[ "$(xpath "string($row/@cost-minus)" "$WORK/demo.xml")" = "-inf" ] && pass ||
		fail "vent condenser target cost-minus is not -inf"
	check_near "$(xpath "string($row/@rank)" "$WORK/demo.xml")" 1 0 "vent condenser target rank"
	row='/results/sensitivity-utility[@utility="chilled water" and @quantity="supply"]'
	[ "$(xpath "string($row/@cost-plus)" "$WORK/demo.xml")" = "inf" ] && pass ||
		fail "chilled water supply cost-plus is not inf"
	check_near "$(xpath "string($row/@cost-minus)" "$WORK/demo.xml")" 0 0 "chilled water supply dcost-"
	# HP steam carries no load at the optimum: its level moves nothing.
	row='/results/sensitivity-utility[@utility="HP steam"]'
	check_near "$(xpath "string($row/@cost-plus)" "$WORK/demo.xml")" 0 0 "HP steam level dcost+"
	# The unchanged contract: <sensitivity stream quantity hot-minus
	# hot-plus cold-minus cold-plus/> on every row, numbers only.
	[ "$(xpath 'count(/results/sensitivity[@hot-minus="inf" or @hot-plus="inf" or @cold-minus="inf" or @cold-plus="inf"])' "$WORK/demo.xml")" = 0 ] && pass ||
		fail "an infinite target derivative"
fi

# CSV: one row per stream and quantity, then ΔTmin.
check_exit 0 hl targets "$K4" --sensitivity --format csv -o "$WORK/s.csv"
check_grep "rank,stream,quantity,segment,value,tolerance,hot_minus,hot_plus,cold_minus,cold_plus" "$WORK/s.csv"
check_grep ",C2,supply,,80,1,-1.5,-1.5,2.5,2.5,1.5,1.5,2.5,2.5,,,0" "$WORK/s.csv"
check_grep ",,dtmin,,10,,4.5,4.5,4.5,4.5," "$WORK/s.csv"
[ "$(wc -l <"$WORK/s.csv")" -eq 14 ] && pass || fail "CSV rows: $(wc -l <"$WORK/s.csv")"

# CSV with utility levels: the utility column, one row per utility datum
# after ΔTmin, "inf"/"-inf" for the infinite sides (see the XML checks).
check_exit 0 hl targets "$CASES/demo.xml" --sensitivity --format csv -o "$WORK/demo.csv"
check_grep "rank,stream,quantity,segment,value,tolerance,hot_minus,hot_plus,cold_minus,cold_plus,hot_down,hot_up,cold_down,cold_up,cost_minus,cost_plus,pinch_change,utility" "$WORK/demo.csv"
check_grep ",reboiler,target,,152,1,400,400,0,0,400,400,0,0,96000,96000,0," "$WORK/demo.csv"
check_grep ",vent condenser,target,,8,1,0,0,-2.5,-2.5,0,0,2.5,2.5,-inf,-300,0," "$WORK/demo.csv"
check_grep ",,supply,,5,1,0,0,0,0,0,0,0,0,0,inf,0,chilled water" "$WORK/demo.csv"
check_grep ",,level,,250,1,0,0,0,0,0,0,0,0,0,0,0,HP steam" "$WORK/demo.csv"
# 40 stream data + ΔTmin + 7 utility data + the header; 18 fields each.
[ "$(wc -l <"$WORK/demo.csv")" -eq 49 ] && pass || fail "demo CSV rows: $(wc -l <"$WORK/demo.csv")"
awk -F, 'NR > 1 && $1 != "" && NF != 18 { bad = 1 } END { exit bad }' "$WORK/demo.csv" && pass ||
	fail "demo CSV rows without 18 fields"

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
# With its utilities: the cost beside the kW moves, the infinite side in
# words, the utility table.
check_exit 0 hl targets "$CASES/demo.xml" --sensitivity
check_grep "  1. vent condenser target temperature (8.0 °C): a ±1.0 K error in it moves QHmin by ±0.0 kW and QCmin by ±2.5 kW," "$WORK/stdout"
check_grep "     the utility cost by -300 EUR a year at +1.0 K; any lower value leaves no utility able to serve the process" "$WORK/stdout"
check_grep "     the utility cost by ±96000 EUR a year" "$WORK/stdout"
check_grep "The utilities' temperatures" "$WORK/stdout"
check_grep "chilled water  supply     5.0 °C ±1.0 K         +inf/0          0|inf" "$WORK/stdout"
check_grep "and the utility cost " "$WORK/stdout"
check_exit 0 hl help targets
check_grep "--sensitivity" "$WORK/stdout"
# The ranking says why a row with an infinite cost move stands first.
check_exit 0 hl targets "$CASES/demo.xml" --sensitivity
check_grep "A row whose cost moves by +inf or -inf ranks first: a step of its tolerance that" "$WORK/stdout"
# --supertargets beside --sensitivity: both, the supertargets after.
check_exit 0 hl targets "$CASES/demo.xml" --sensitivity --supertargets
check_grep "Every datum, largest effect first" "$WORK/stdout"
check_grep "Supertargets" "$WORK/stdout"
finish
