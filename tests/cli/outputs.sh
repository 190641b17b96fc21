#!/bin/sh
# outputs.sh - all-or-nothing output files (doc/design.md, "Contracts").
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

# A destination that is not a regular file is written in place, never
# renamed over: a FIFO stays a FIFO and its reader gets the result; a
# character device (a copy of /dev/null, made only where mknod is allowed)
# stays a device.
if mkfifo "$WORK/pipe" 2>/dev/null; then
	cat "$WORK/pipe" >"$WORK/from-pipe" &
	reader=$!
	check_exit 0 hl targets "$WORK/in.csv" -o "$WORK/pipe"
	wait "$reader"
	[ -p "$WORK/pipe" ] && pass || fail "the FIFO was replaced by a file"
	check_grep "Minimum hot utility    20.0 kW" "$WORK/from-pipe"
fi
if mknod "$WORK/null" c 1 3 2>/dev/null; then
	check_exit 0 hl targets "$WORK/in.csv" -o "$WORK/null"
	[ -c "$WORK/null" ] && pass || fail "the device was replaced by a file"
	[ "$(ls "$WORK" | grep -c tmp)" -eq 0 ] && pass || fail "temporary file left"
fi

# The XML results follow doc/results.rng.
if [ -n "${XMLLINT:-}" ]; then
	check_exit 0 hl targets "$CASES/demo-streams.csv" --format xml -o "$WORK/r.xml"
	check_exit 0 "$XMLLINT" --noout --relaxng "$TOP_SRCDIR/doc/results.rng" "$WORK/r.xml"
fi
finish
