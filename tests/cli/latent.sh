#!/bin/sh
# latent.sh - latent heat (condensing, boiling): a stream or a segment with
# supply = target and a duty is heat at one temperature in the problem
# table, the utility LP, the composite curves, and through matches, design
# and sizing; CSV and XML cases.
. "$TOP_SRCDIR/tests/cli/lib.sh"

L="$DATA/good/latent.csv"
LU="$DATA/good/latent-utilities.csv"
LS="$DATA/good/latent-segments.csv"

# Hand cascade of latent.csv at ΔTmin 10 K (problem table, Linnhoff &
# Flower 1978, latent heat as a step at its shifted temperature; hot −5 K,
# cold +5 K; the numbers are this invented case's):
#   145 step  vapour condenses          +300      0 → 300
#   145-115   feed 3 kW/K               −90       → 210
#   115 step  reboiler boils            −300      → −90
#   115-55    oil 4 − feed 3            +60       → −30
#   55-35     oil 4                     +80       → 50
# QHmin = 90 kW, QCmin = 90 + 50 = 140 kW, pinch at the foot of the
# reboiler's step: 115 °C shifted (120 / 110 °C).
check_exit 0 hl targets "$L"
check_grep "Minimum hot utility    90.0 kW" "$WORK/stdout"
check_grep "Minimum cold utility   140.0 kW" "$WORK/stdout"
check_grep "Pinch                  120.0 °C hot / 110.0 °C cold (115.0 °C shifted)" "$WORK/stdout"
check_grep "Hot stream duty        620.0 kW" "$WORK/stdout"
check_grep "                                     latent      -300.0" "$WORK/stdout"

# The same heat as the middle segment of a stream (latent-segments.csv):
# desuperheating 180 → 150 (30 kW), 300 kW at 150 °C, subcooling 150 → 120
# (60 kW): 175-145 +30, step +300, 145-115 (2 − 3) × 30 = −30, step −300,
# 115-55 +60, 55-35 +80: cascade 0 30 330 300 0 60 140, so QHmin = 0,
# QCmin = 140 kW, pinch at 115 °C shifted.
check_exit 0 hl targets "$LS"
check_grep "Minimum hot utility    0.0 kW" "$WORK/stdout"
check_grep "Minimum cold utility   140.0 kW" "$WORK/stdout"
check_grep "Pinch                  120.0 °C hot / 110.0 °C cold (115.0 °C shifted)" "$WORK/stdout"
# The XML case file says the same.
check_exit 0 hl targets "$DATA/good/latent.xml"
check_grep "Minimum cold utility   140.0 kW" "$WORK/stdout"
check_grep "Hot stream duty        710.0 kW" "$WORK/stdout"

# The utility LP: raising steam at 140 °C (shifted 145, ΔT = ΔTmin to the
# condensing vapour) earns 40 per MWh and HP steam costs 30, so all 300 kW
# of the vapour go to steam raising and HP steam heats the feed instead:
# 90 + 300 = 390 kW of HP steam, cooling water 140 kW. Cost per year:
# (30 × 390 − 40 × 300 + 2 × 140) × 8 = −160.
if [ -n "${XMLLINT:-}" ]; then
	check_exit 0 hl targets "$L" --utilities "$LU" --format xml -o "$WORK/t.xml"
	check_exit 0 "$XMLLINT" --noout --relaxng "$TOP_SRCDIR/doc/results.rng" "$WORK/t.xml"
	load() { xpath "string(/results/targets/utility[@name='$1']/@load)" "$WORK/t.xml"; }
	check_near "$(load 'HP steam')" 390 1e-9 "HP steam"
	check_near "$(load raise)" 300 1e-9 "raise"
	check_near "$(load cw)" 140 1e-9 "cw"
	check_near "$(xpath 'string(/results/targets/utility-summary/@cost)' "$WORK/t.xml")" -160 1e-9 "net cost"
fi
if command -v glpsol >/dev/null 2>&1; then
	# The transportation LP (Cerda et al. 1983) on the hand intervals.
	check_exit 0 glpsol -m "$TOP_SRCDIR/tests/cli/transport.mod" -d "$DATA/good/latent.dat"
	check_near "$(awk '$1 == "load" && $2 == "hp" { print $3 }' "$WORK/stdout")" 390 1e-6 "glpsol HP steam"
	check_near "$(awk '$1 == "load" && $2 == "raise" { print $3 }' "$WORK/stdout")" 300 1e-6 "glpsol raise"
	check_near "$(awk '$1 == "load" && $2 == "cw" { print $3 }' "$WORK/stdout")" 140 1e-6 "glpsol cw"
else
	echo "glpsol not found (glpk-utils): transportation LP check skipped"
fi

# Composite curves: the latent heat is a horizontal run at one temperature.
check_exit 0 hl curves "$L" -o "$WORK/cv"
check_grep "hot,320,150" "$WORK/cv/composite.csv"
check_grep "hot,620,150" "$WORK/cv/composite.csv"
check_grep "cold,320,110" "$WORK/cv/composite.csv"
check_grep "cold,620,110" "$WORK/cv/composite.csv"
check_grep "grand,390,145" "$WORK/cv/grand-composite.csv"
check_grep "grand,90,145" "$WORK/cv/grand-composite.csv"

# Matches, design and sizing: the network meets the targets (within the
# 0.01 K over which those stages spread latent heat: cp × 0.01 K, 0.01 kW
# here), the
# condenser works at one temperature, and check finds it sound.
check_exit 0 hl design "$LS"
check_grep "Hot utility               0.0 kW" "$WORK/stdout"
check_grep "steam (hot): 180.0" "$WORK/stdout"
if [ -n "${XMLLINT:-}" ]; then
	check_exit 0 hl design "$L" --format xml -o "$WORK/n.xml"
	check_exit 0 "$XMLLINT" --noout --relaxng "$TOP_SRCDIR/doc/results.rng" "$WORK/n.xml"
	check_near "$(xpath 'string(/results/network/@hot-utility)' "$WORK/n.xml")" 90 1e-3 "design QH"
	check_near "$(xpath 'string(/results/network/@cold-utility)' "$WORK/n.xml")" 140 1e-3 "design QC"
	# The unit between vapour and reboiler: both sides at one temperature,
	# so LMTD = 150 − 110 = 40 K and F = 1 (common practice, no source).
	check_near "$(xpath 'string(/results/network/exchanger[@hot="vapour" and @cold="reboiler"]/@lmtd)' "$WORK/n.xml")" 40 1e-3 "isothermal LMTD"
	check_near "$(xpath 'string(/results/network/exchanger[@hot="vapour" and @cold="reboiler"]/@ft)' "$WORK/n.xml")" 1 1e-6 "isothermal F"
	check_exit 0 hl check "$WORK/n.xml"
	check_grep "sound, 0 problems" "$WORK/stdout"
fi
check_exit 0 hl matches "$L"
check_exit 0 hl report "$LS" -o "$WORK/r.html"
check_grep "latent" "$WORK/r.html"

# Latent heat needs a duty and a kind; cp would be infinite.
printf 'name,supply,target,cp,kind\nv,150,150,3,hot\nc,50,140,3,\n' >"$WORK/bad1.csv"
check_exit 2 hl targets "$WORK/bad1.csv"
check_grep "supply equals target (150 °C), so cp would be infinite; give the latent heat as a duty (kW) instead of cp" "$WORK/stderr"
printf 'name,supply,target,duty\nv,150,150,300\nc,50,140,270\n' >"$WORK/bad2.csv"
check_exit 2 hl targets "$WORK/bad2.csv"
check_grep "stream 'v' starts with latent heat at 150 °C: give its kind (hot: condensing, cold: boiling)" "$WORK/stderr"
finish
