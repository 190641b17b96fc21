#!/bin/sh
# published.sh - targets of published worked examples through the command
# line, read back from the XML results.
. "$TOP_SRCDIR/tests/cli/lib.sh"

if [ -z "${XMLLINT:-}" ]; then
	echo "SKIP: xmllint not found (Debian package libxml2-utils)"
	exit 77
fi

# targets FILE DTMIN QH QC PINCH_HOT PINCH_COLD
targets() {
	check_exit 0 hl targets "$1" --dtmin "$2" --format xml -o "$WORK/r.xml"
	check_near "$(xpath 'string(/results/targets/@hot-utility)' "$WORK/r.xml")" "$3" 1e-9 "$1 QH"
	check_near "$(xpath 'string(/results/targets/@cold-utility)' "$WORK/r.xml")" "$4" 1e-9 "$1 QC"
	if [ -n "$5" ]; then
		check_near "$(xpath 'string(/results/targets/pinch[1]/@hot)' "$WORK/r.xml")" "$5" 1e-9 "$1 pinch hot"
		check_near "$(xpath 'string(/results/targets/pinch[1]/@cold)' "$WORK/r.xml")" "$6" 1e-9 "$1 pinch cold"
	fi
	if "$XMLLINT" --noout --relaxng "$TOP_SRCDIR/doc/results.rng" "$WORK/r.xml" 2>"$WORK/lint"; then
		pass
	else
		fail "results of $1 do not match doc/results.rng"; cat "$WORK/lint" >&2
	fi
}

# Linnhoff et al. (1982) / Kemp (2007) ch. 2, from memory, hand-checked.
targets "$DATA/good/kemp4.csv" 10 20 60 90 80
# Same problem at 20 K: 65 / 105 kW (derived by hand cascade, doc/references.md).
targets "$DATA/good/kemp4.csv" 20 65 105 "" ""
# Written with duties, kind and a segmented stream; BOM, CRLF, comments;
# semicolons with decimal commas: all read as the same problem.
targets "$DATA/good/kemp4-duty-segmented.csv" 10 20 60 90 80
targets "$DATA/good/kemp4-bom-crlf.csv" 10 20 60 90 80
targets "$DATA/good/kemp4-semicolon.csv" 10 20 60 90 80
# Smith (2005) ch. 16, in kW: 7500 / 10000 kW, pinch 150/140 °C.
targets "$DATA/good/smith4.csv" 10 7500 10000 150 140
targets "$DATA/good/smith4.csv" 20 11500 14000 "" ""

# The cascade as CSV: the top flow is QH, the bottom one QC.
check_exit 0 hl targets "$DATA/good/kemp4.csv" --format csv -o "$WORK/c.csv"
check_grep "shifted,hot,cold,net_cp,surplus,heat_flow,pinch" "$WORK/c.csv"
check_grep "165,170,160,3,60,20,0" "$WORK/c.csv"
check_grep "85,90,80,2.5,75,0,1" "$WORK/c.csv"
check_grep "25,30,20,,,60,0" "$WORK/c.csv"
finish
