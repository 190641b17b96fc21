#!/bin/sh
# curves.sh - `heatloom curves`: the files, their XML, the curves inside
# them, and CSV points that reproduce the energy targets.
. "$TOP_SRCDIR/tests/cli/lib.sh"

if [ -z "${XMLLINT:-}" ]; then
	echo "SKIP: xmllint not found (Debian package libxml2-utils)"
	exit 77
fi

svgq() {
	"$XMLLINT" --xpath "$1" "$2" 2>/dev/null
}

# Kemp's four streams with one hot and one cold utility: Linnhoff et al.
# (1982) / Kemp (2007) ch. 2, from memory, hand-checked: QH 20, QC 60 kW,
# heat recovery 510 - 60 = 450 kW, pinch 90 / 80 °C.
out="$WORK/k"
check_exit 0 hl curves "$DATA/good/kemp4.csv" --utilities "$DATA/good/kemp4-span-utilities.csv" -o "$out"
for f in composite shifted-composite grand-composite balanced-composite; do
	[ -s "$out/$f.svg" ] && pass || fail "$f.svg missing"
	[ -s "$out/$f.csv" ] && pass || fail "$f.csv missing"
	check_exit 0 "$XMLLINT" --noout "$out/$f.svg"
	[ "$(svgq "name(/*)" "$out/$f.svg")" = svg ] && pass || fail "$f.svg is not SVG"
	[ "$(svgq "namespace-uri(/*)" "$out/$f.svg")" = "http://www.w3.org/2000/svg" ] \
		&& pass || fail "$f.svg has no SVG namespace"
done
[ "$(ls "$out" | grep -c tmp)" -eq 0 ] && pass || fail "temporary file left"
[ "$(ls "$out" | wc -l)" -eq 8 ] && pass || fail "not 8 files"

# The expected curves, by their legend titles.
series() {
	svgq "count(//*[local-name()='g'][@class='series'][*[local-name()='title']='$1'])" "$2"
}
[ "$(series 'Hot composite curve' "$out/composite.svg")" = 1 ] && pass || fail "no hot composite"
[ "$(series 'Cold composite curve' "$out/composite.svg")" = 1 ] && pass || fail "no cold composite"
[ "$(series 'Grand composite curve' "$out/grand-composite.svg")" = 1 ] && pass || fail "no grand composite"
[ "$(series 'Hot utilities' "$out/grand-composite.svg")" = 1 ] && pass || fail "no hot utilities"
[ "$(series 'Cold utilities' "$out/grand-composite.svg")" = 1 ] && pass || fail "no cold utilities"
[ "$(series 'Hot streams and hot utilities' "$out/balanced-composite.svg")" = 1 ] && pass || fail "no balanced hot"
check_grep "pinch 90.0 / 80.0 °C" "$out/composite.svg"
check_grep "pinch 85.0 °C shifted" "$out/shifted-composite.svg"
check_grep "steam 20.0 kW" "$out/grand-composite.svg"
check_grep "screening estimate" "$out/composite.svg"

# CSV points reproduce the targets: the hot curve ends where the cold one
# has run QHmin further; the overlap is the heat recovery.
col() {
	awk -F, -v c="$1" -v f="$2" -v w="$3" 'NR > 1 && $1 == c {
		v = $f; if (n == 0 || (w == "max" ? v > m : v < m)) m = v; n++ }
		END { printf "%.10g\n", m }' "$4"
}
hmax=$(col hot 2 max "$out/composite.csv")
cmin=$(col cold 2 min "$out/composite.csv")
cmax=$(col cold 2 max "$out/composite.csv")
check_near "$cmin" 60 1e-9 "cold curve starts at QCmin"
check_near "$(awk -v a="$hmax" -v b="$cmin" 'BEGIN { print a - b }')" 450 1e-9 "overlap = heat recovery"
check_near "$(awk -v a="$cmax" -v b="$hmax" 'BEGIN { print a - b }')" 20 1e-9 "cold beyond hot = QHmin"
check_grep "curve,heat,temperature" "$out/composite.csv"
check_grep "curve,heat,shifted" "$out/grand-composite.csv"
# The grand composite starts at QHmin at the top, touches 0 at 85 °C.
check_grep "grand,20,165" "$out/grand-composite.csv"
check_grep "grand,0,85" "$out/grand-composite.csv"
# The balanced curves span the same heat: 510 + 20 = 470 + 60.
check_near "$(col hot 2 max "$out/balanced-composite.csv")" 530 1e-9 "balanced hot"
check_near "$(col cold 2 max "$out/balanced-composite.csv")" 530 1e-9 "balanced cold"
# The same targets as `targets` says.
check_exit 0 hl targets "$DATA/good/kemp4.csv" --format xml -o "$WORK/t.xml"
check_near "$(xpath 'string(/results/targets/@cold-utility)' "$WORK/t.xml")" "$cmin" 1e-9 "targets QC"

# Without utilities: three charts and a note; an existing folder is fine.
out2="$WORK/plain"
mkdir "$out2"
check_exit 0 hl curves "$DATA/good/smith4.csv" -o "$out2"
[ "$(ls "$out2" | wc -l)" -eq 6 ] && pass || fail "not 6 files"
check_grep "no balanced composite curves" "$WORK/stderr"
[ ! -e "$out2/balanced-composite.svg" ] && pass || fail "balanced without utilities"
# Smith (2005) ch. 16 in kW (from memory, hand-checked): QCmin 10000 kW;
# past 20 000 kW the charts count in MW.
check_near "$(col cold 2 min "$out2/composite.csv")" 10000 1e-9 "smith4 QC"
check_grep "Heat load (MW)" "$out2/composite.svg"

# Usage and failures write nothing.
check_exit 1 hl curves "$DATA/good/kemp4.csv"
check_grep "give the folder to write into with -o DIR" "$WORK/stderr"
: >"$WORK/afile"
check_exit 1 hl curves "$DATA/good/kemp4.csv" -o "$WORK/afile"
check_grep "is a file, not a folder" "$WORK/stderr"
printf 'name,kind,supply,target,price\nsteam,hot,250,250,30\n' >"$WORK/nocold.csv"
check_exit 3 hl curves "$DATA/good/kemp4.csv" --utilities "$WORK/nocold.csv" -o "$WORK/never"
[ ! -e "$WORK/never" ] && pass || fail "folder made on exit 3"
check_exit 4 hl curves "$DATA/good/kemp4.csv" -o "$WORK/no/such/dir"
check_exit 0 hl help curves
check_grep "Usage: heatloom curves CASE -o DIR" "$WORK/stdout"
check_grep "screening estimates" "$WORK/stdout"

# The demo plant draws all four.
check_exit 0 hl curves "$CASES/demo-streams.csv" --utilities "$CASES/demo-utilities.csv" -o "$WORK/demo"
check_grep "LP steam 773 kW" "$WORK/demo/grand-composite.svg"
check_grep "HP steam: unused" "$WORK/demo/grand-composite.svg"
finish
