#!/bin/sh
# units.sh - units in table headers, the unit warnings, the invented crude
# preheat train, and `--units us` against the SI output.
. "$TOP_SRCDIR/tests/cli/lib.sh"

# The demo stream and utility tables in °F, Btu/(h·°F), Btu/(h·ft²·°F),
# EUR/MMBtu and Btu/h (tests/data/good/demo-us-*.csv, converted with NIST
# SP 811 (2008) App. B.8 factors to 12 figures) give the SI targets.
check_exit 0 hl targets "$CASES/demo-streams.csv" --utilities "$CASES/demo-utilities.csv" --format csv -o "$WORK/si.csv"
check_exit 0 hl targets "$DATA/good/demo-us-streams.csv" --utilities "$DATA/good/demo-us-utilities.csv" --format csv -o "$WORK/us.csv"
if [ -s "$WORK/stderr" ]; then fail "the US twin warns: $(cat "$WORK/stderr")"; else pass; fi
# Row by row, every number within 1e-9 relative (12-figure inputs).
if awk -F, 'NR == FNR { a[FNR] = $0; next }
	{ n = split(a[FNR], x, ","); split($0, y, ",");
	  for (i = 1; i <= n; i++) { d = x[i] - y[i]; if (d < 0) d = -d;
	    s = x[i] < 0 ? -x[i] : x[i]; if (s < 1) s = 1;
	    if (d > 1e-9 * s) { print FNR ": " a[FNR] " vs " $0; bad = 1 } } }
	END { exit bad }' "$WORK/si.csv" "$WORK/us.csv" >"$WORK/diff"; then
	pass
else
	fail "US twin's problem table differs: $(head -3 "$WORK/diff")"
fi
check_exit 0 hl targets "$CASES/demo-streams.csv" --utilities "$CASES/demo-utilities.csv" -o "$WORK/si.txt"
check_exit 0 hl targets "$DATA/good/demo-us-streams.csv" --utilities "$DATA/good/demo-us-utilities.csv" -o "$WORK/us.txt"
for what in "Minimum hot utility" "Minimum cold utility" "Utility cost" "Pinch "; do
	if [ "$(grep "^$what" "$WORK/si.txt")" = "$(grep "^$what" "$WORK/us.txt")" ]; then
		pass
	else
		fail "'$what' differs between the SI and US twins"
	fi
done

# An unknown unit: exit 2 naming the file, the line and the column.
printf '# plant\nname,supply [°R],target,cp\nH1,600,500,2\nC1,480,560,3\n' >"$WORK/rankine.csv"
check_exit 2 hl targets "$WORK/rankine.csv"
check_grep "rankine.csv:2: column 2 'supply [°R]': unknown unit '°R' for a temperature; known: °C, K, °F" "$WORK/stderr"
printf 'name,kind,supply,target,price [EUR/therm]\nsteam,hot,200,200,30\n' >"$WORK/therm.csv"
check_exit 2 hl targets "$CASES/demo-streams.csv" --utilities "$WORK/therm.csv"
check_grep "therm.csv:1: column 5 'price [EUR/therm]': unknown unit" "$WORK/stderr"

# The warnings (heuristics of src/io/read/plausible.h, common practice, no
# source): kelvin without a bracket, cp in W/K, h in W/(m²·K).
printf 'name,supply,target,cp,h\nH1,453,333,2000,800\nC1,293,423,3000,0.6\n' >"$WORK/slips.csv"
check_exit 0 hl targets "$WORK/slips.csv"
check_grep "warning: $WORK/slips.csv:1: every supply and target temperature is 250 or above" "$WORK/stderr"
check_grep "warning: $WORK/slips.csv:2: h 800 kW/(m²·K) is above 20" "$WORK/stderr"
printf 'name,supply,target,cp\nH1,180,60,12000\nC1,20,150,9\n' >"$WORK/wk.csv"
check_exit 0 hl targets "$WORK/wk.csv"
check_grep "warning: $WORK/wk.csv:2: cp 12000 kW/K over 120 K" "$WORK/stderr"

# The invented crude preheat train keeps working: targets, design, audit
# of today's 17 units, all from tables with units in their headers.
check_exit 0 hl targets "$CASES/crude.xml" --format xml -o "$WORK/crude.xml"
check_grep 'currency' "$CASES/crude.xml"
check_exit 0 hl targets "$CASES/crude.xml" -o "$WORK/crude.txt"
check_grep "Minimum hot utility    10450.0 kW" "$WORK/crude.txt"
check_grep "USD/year" "$WORK/crude.txt"
check_exit 0 hl audit "$CASES/crude.xml" -o "$WORK/crude-audit.txt"
check_grep "hot utility   kW      14800.0     10450.0" "$WORK/crude-audit.txt"
check_exit 0 hl design "$CASES/crude.xml" -o "$WORK/crude-design.txt"
check_grep "Heat exchanger network" "$WORK/crude-design.txt"

finish
