#!/bin/sh
# outputs.sh - all-or-nothing output files (design.md, "Errors").
. "$TOP_SRCDIR/tests/cli/lib.sh"

cp "$DATA/good/kemp4.csv" "$WORK/in.csv"
cp "$WORK/in.csv" "$WORK/orig.csv"

# -o writes the whole result and nothing else in the folder.
check_exit 0 hl targets "$WORK/in.csv" -o "$WORK/t.txt"
check_grep "Minimum hot utility    20.0 kW" "$WORK/t.txt"
[ "$(ls "$WORK" | grep -c tmp)" -eq 0 ] && pass || fail "temporary file left"

# -o naming an input file is refused and the input is unchanged.
check_exit 1 hl targets "$WORK/in.csv" -o "$WORK/in.csv"
check_grep "refusing to overwrite an input file" "$WORK/stderr"
cmp -s "$WORK/in.csv" "$WORK/orig.csv" && pass || fail "input was changed"
# Also through another name of the same file.
ln -s "$WORK/in.csv" "$WORK/link.csv"
check_exit 1 hl targets "$WORK/in.csv" -o "$WORK/link.csv"
cmp -s "$WORK/in.csv" "$WORK/orig.csv" && pass || fail "input was changed"
check_exit 1 hl targets "$DATA/good/kemp4.csv" --utilities "$WORK/in.csv" -o "$WORK/in.csv"

# A failed run leaves an existing output untouched and creates none.
echo "previous result" >"$WORK/keep.txt"
check_exit 2 hl targets "$DATA/bad/zero-cp.csv" -o "$WORK/keep.txt"
check_grep "previous result" "$WORK/keep.txt"
check_exit 2 hl targets "$DATA/bad/zero-cp.csv" -o "$WORK/new.txt"
[ ! -e "$WORK/new.txt" ] && pass || fail "output written on error"
# An unwritable destination is an I/O error (exit 4).
check_exit 4 hl targets "$WORK/in.csv" -o "$WORK/no/such/dir/t.txt"

# The XML results follow doc/results.rng.
if [ -n "${XMLLINT:-}" ]; then
	check_exit 0 hl targets "$CASES/demo-streams.csv" --format xml -o "$WORK/r.xml"
	check_exit 0 "$XMLLINT" --noout --relaxng "$TOP_SRCDIR/doc/results.rng" "$WORK/r.xml"
fi
finish
