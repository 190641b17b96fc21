#!/bin/sh
# robust.sh - big inputs and interrupted runs (issue: robust under bad input).
. "$TOP_SRCDIR/tests/cli/lib.sh"

GEN="$TOP_BUILDDIR/tests/bench/gen_streams"

# A large table whose very last row is bad: the error names that line.
"$GEN" 100000 7 >"$WORK/big.csv"
echo "H-last,170,60,zero,1.0" >>"$WORK/big.csv"
check_exit 2 hl targets "$WORK/big.csv" -o "$WORK/big.out"
check_grep "big.csv:100003: column 'cp': 'zero' is not a number" "$WORK/stderr"
[ ! -e "$WORK/big.out" ] && pass || fail "output written on error"

# A field longer than any sane cell is refused, not read.
awk 'BEGIN { printf "name,supply,target,cp\n"; s = ""; for (i = 0; i < 5000; i++) s = s "x"; print s ",170,60,3" }' >"$WORK/long.csv"
check_exit 2 hl targets "$WORK/long.csv"
check_grep "long.csv:2: field longer than 4096 characters" "$WORK/stderr"

# A million streams: targets in bounded time and memory (figures in bench).
"$GEN" 1000000 3 >"$WORK/m.csv"
check_exit 0 "$HEATLOOM" targets "$WORK/m.csv" --format xml -o "$WORK/m.xml"
check_grep "<targets dtmin=" "$WORK/m.xml"
rm -f "$WORK/m.xml"
check_exit 0 "$HEATLOOM" curves "$WORK/m.csv" -o "$WORK/mcurves"
[ -s "$WORK/mcurves/grand-composite.svg" ] && pass || fail "no curves for 10^6 streams"
rm -rf "$WORK/mcurves"

# The match MILP on a site-wide table: refused at once above the size it
# can solve, with the options that would help; below it, a subnetwork whose
# LP relaxation cannot finish in the time limit stops there with exit 3 and
# a sentence, never runs on.
"$GEN" 400 1 >"$WORK/s400.csv"
check_exit 3 hl matches "$WORK/s400.csv" -o "$WORK/s400.txt"
check_grep "400 streams make a match MILP of up to 3.2e+07 pair-intervals" "$WORK/stderr"
check_grep 'policy="forbid"' "$WORK/stderr"
[ ! -e "$WORK/s400.txt" ] && pass || fail "a refused MILP left output"
check_exit 3 hl design "$WORK/s400.csv" -o "$WORK/s400.txt"
"$GEN" 100 1 >"$WORK/s100.csv"
check_exit 3 hl matches "$WORK/s100.csv" --time-limit 1
check_grep "is too large to solve in the time limit" "$WORK/stderr"
check_grep "raise --time-limit" "$WORK/stderr"

# SIGINT or SIGTERM during a run leaves no partial output and no temporary
# file. The text cascade of a million streams takes long enough to write that
# a signal arrives mid-run; try a few delays until one interrupts it.
interrupted=0
for sig in INT TERM; do
	for delay in 0.3 0.6 1.0 1.5; do
		rm -f "$WORK"/m.txt*
		"$HEATLOOM" targets "$WORK/m.csv" -o "$WORK/m.txt" 2>/dev/null &
		pid=$!
		sleep "$delay"
		kill -s "$sig" "$pid" 2>/dev/null || true
		set +e
		wait "$pid"
		rc=$?
		set -e
		if [ "$rc" -gt 128 ]; then
			interrupted=$((interrupted + 1))
			if ls "$WORK" | grep -q '^m\.txt'; then
				fail "SIG$sig left $(ls "$WORK" | grep '^m\.txt')"
			else
				pass
			fi
			break
		fi
		# Finished before the signal: the output must then be whole.
		tail -n 1 "$WORK/m.txt" | grep -q "qualified engineers" && pass ||
			fail "finished run left an incomplete file"
	done
done
[ "$interrupted" -eq 2 ] && pass || fail "could not interrupt a run ($interrupted of 2)"
finish
