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

# The same heuristics on an XML case's own streams.
printf '<?xml version="1.0"?>\n<case version="1"><streams>\n<stream name="a" supply="180" target="60" cp="2" h="800"/>\n<stream name="b" supply="20" target="150" cp="3"/></streams></case>\n' >"$WORK/slip.xml"
check_exit 0 hl targets "$WORK/slip.xml"
check_grep "warning: $WORK/slip.xml:3: h 800 kW/(m²·K) is above 20" "$WORK/stderr"

# The invented crude preheat train keeps working: targets, design, audit
# of today's 17 units, all from tables with units in their headers.
check_exit 0 hl targets "$CASES/crude.xml" --format xml -o "$WORK/crude.xml"
check_grep 'currency' "$CASES/crude.xml"
check_exit 0 hl targets "$CASES/crude.xml" -o "$WORK/crude.txt"
check_grep "Minimum hot utility    10450.0 kW" "$WORK/crude.txt"
check_grep "USD/year" "$WORK/crude.txt"
check_exit 0 hl audit "$CASES/crude.xml" -o "$WORK/crude-audit.txt"
# The audit's target counts what the fired heater's 250 °C stack adds above
# the problem-table minimum (1247.8 kW, as `targets` says): 11697.8 kW.
check_grep "hot utility   kW      14800.0     11697.8" "$WORK/crude-audit.txt"
check_grep "fired heater gives 1247.8 kW below the pinch" "$WORK/crude.txt"
check_exit 0 hl design "$CASES/crude.xml" -o "$WORK/crude-design.txt"
check_grep "Heat exchanger network" "$WORK/crude-design.txt"

# --units us: every CSV equals the SI one after conversion back with the
# NIST SP 811 (2008) App. B.8 factors (tests/cli/us_csv.awk); XML stays SI.
AWK_US="$TOP_SRCDIR/tests/cli/us_csv.awk"
us_same() {
	what=$1
	shift
	if hl "$@" --format csv -o "$WORK/a.csv" 2>/dev/null &&
	   hl "$@" --format csv --units us -o "$WORK/b.csv" 2>/dev/null &&
	   grep -q '\[' "$WORK/b.csv" &&
	   awk -f "$AWK_US" "$WORK/a.csv" "$WORK/b.csv" >"$WORK/diff"; then
		pass
	else
		fail "--units us $what differs from SI: $(head -3 "$WORK/diff")"
	fi
}
us_same "targets (demo)" targets "$CASES/demo.xml"
us_same "targets (crude)" targets "$CASES/crude.xml"
us_same "sweep" sweep "$CASES/demo.xml" --from 5 --to 20 --step 5
us_same "design (demo)" design "$CASES/demo.xml"
us_same "design (crude)" design "$CASES/crude.xml"
us_same "size" size "$CASES/demo-exchangers.csv"
us_same "matches" matches "$CASES/demo.xml"
us_same "audit" audit "$CASES/crude.xml"
K4R="$DATA/good/kemp4.csv --utilities $DATA/good/kemp4-utilities.csv --network $DATA/good/kemp4-network.csv"
# shellcheck disable=SC2086
us_same "retrofit" retrofit $K4R
# The retrofit's text: today's 140.0 kW of hot utility is 477 700 Btu/h
# (2.930 711e-4 kW per Btu/h, NIST SP 811 App. B.8), ΔTmin 10 K is 18 °F.
# shellcheck disable=SC2086
check_exit 0 hl retrofit $K4R --units us -o "$WORK/rfit-us.txt"
check_grep "Today (simulated): hot utility 477700 Btu/h" "$WORK/rfit-us.txt"
check_grep "targets at ΔTmin 18 °F" "$WORK/rfit-us.txt"
check_grep "Hot Btu/h" "$WORK/rfit-us.txt"
if grep -qE "[0-9] (kW|m²|K)\b" "$WORK/rfit-us.txt"; then
	fail "SI quantities left in the US retrofit text: $(grep -E "[0-9] (kW|m²|K)\b" "$WORK/rfit-us.txt" | head -2)"
else
	pass
fi
check_exit 0 hl curves "$CASES/demo.xml" -o "$WORK/si"
check_exit 0 hl curves "$CASES/demo.xml" -o "$WORK/us" --units us
for f in composite shifted-composite grand-composite balanced-composite; do
	if awk -f "$AWK_US" "$WORK/si/$f.csv" "$WORK/us/$f.csv" >"$WORK/diff"; then
		pass
	else
		fail "curves $f.csv in US units differ: $(head -3 "$WORK/diff")"
	fi
done
check_grep "Temperature (°F)" "$WORK/us/composite.svg"
check_grep "Heat load (MMBtu/h)" "$WORK/us/composite.svg"
check_exit 0 hl targets "$CASES/demo.xml" --format xml -o "$WORK/si.xml"
check_exit 0 hl targets "$CASES/demo.xml" --format xml --units us -o "$WORK/us.xml"
if cmp -s "$WORK/si.xml" "$WORK/us.xml"; then pass; else fail "XML changed with --units us"; fi
# The text: 978.0 kW of hot utility is 3 337 075 Btu/h (2.930 711e-4 kW per
# Btu/h, NIST SP 811 App. B.8), printed to the whole Btu/h.
check_exit 0 hl targets "$CASES/demo.xml" --units us -o "$WORK/us.txt"
qh=$(awk '/^Minimum hot utility/ { print $4 }' "$WORK/us.txt")
check_near "$(awk -v q="$qh" 'BEGIN { print q * 1055.05585262 / 3.6e6 }')" 978.0 1e-6 "hot utility in Btu/h"
check_grep "Pinch                  316.4 °F hot / 298.4 °F cold" "$WORK/us.txt"
check_grep "ΔTmin                  18.0 °F" "$WORK/us.txt"
# The report: 978 kW in Btu/h by the one rule for duties (whole digits
# kept, report_fmt.h); the pinch in °F
# (t/°F = 1.8 t/°C + 32, NIST SP 811 App. B.8); table units converted.
check_exit 0 hl report "$CASES/demo.xml" --units us --no-sweep -o "$WORK/us.html"
nn=$(printf '\342\200\257')   # U+202F between digit groups
nb=$(printf '\302\240')        # U+00A0 between number and unit
check_grep "id=\"t-qh\">3${nn}337${nn}075${nb}Btu/h<" "$WORK/us.html"
check_grep "id=\"t-pinch1\">316.4${nb}°F hot / 298.4${nb}°F cold (307.4${nb}°F shifted)<" "$WORK/us.html"
check_grep '<span class="unit">Btu/(h·°F)</span>' "$WORK/us.html"
if grep -q '<span class="unit">°C</span>\|<span class="unit">kW</span>' "$WORK/us.html"; then
	fail "the US report still labels a column in °C or kW"
else
	pass
fi
# The sensitivity text: d(QHmin)/d(cp) is a temperature difference, so
# reactor effluent's -62 K reads -111.60 °F (1 K = 1.8 °F).
check_exit 0 hl targets "$CASES/demo.xml" --sensitivity --units us -o "$WORK/sens.txt"
check_grep "QHmin 3337075 Btu/h lies within" "$WORK/sens.txt"
check_grep "±1.8 °F on temperatures" "$WORK/sens.txt"
check_grep "reactor effluent     cp     22748 Btu/(h·°F)   ±5 %      ±126932      ±159688    -111.60" "$WORK/sens.txt"
check_exit 1 hl targets "$CASES/demo.xml" --units imperial
check_grep "--units wants si or us, not 'imperial'" "$WORK/stderr"

finish
