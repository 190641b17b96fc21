#!/bin/sh
# basics.sh - help, version, usage errors and exit codes (doc/design.md,
# "Contracts").
. "$TOP_SRCDIR/tests/cli/lib.sh"

check_exit 0 hl --help
check_grep "Usage: heatloom COMMAND" "$WORK/stdout"
check_grep "screening estimates" "$WORK/stdout"
check_exit 0 hl --version
check_grep "heatloom" "$WORK/stdout"
check_exit 0 hl help targets
check_grep "Usage: heatloom targets CASE" "$WORK/stdout"
check_exit 0 hl targets --help
check_grep "--dtmin" "$WORK/stdout"
check_exit 1 hl
check_exit 1 hl frobnicate
check_grep "unknown command 'frobnicate'" "$WORK/stderr"
check_exit 1 hl help frobnicate
check_exit 1 hl targets
check_grep "give one CASE file" "$WORK/stderr"
check_exit 1 hl targets --bogus "$CASES/demo-streams.csv"
check_grep "unknown option '--bogus'" "$WORK/stderr"
check_exit 1 hl targets --dtmin abc "$CASES/demo-streams.csv"
check_exit 1 hl targets --dtmin -3 "$CASES/demo-streams.csv"
check_exit 1 hl targets --format pdf "$CASES/demo-streams.csv"
check_exit 1 hl targets "$CASES/demo-streams.csv" --dtmin
check_grep "needs a value" "$WORK/stderr"
check_exit 2 hl targets "$WORK/missing.csv"
check_grep "cannot open" "$WORK/stderr"

# The demo case runs and shows its targets.
check_exit 0 hl targets "$CASES/demo-streams.csv" --utilities "$CASES/demo-utilities.csv"
check_grep "Minimum hot utility" "$WORK/stdout"
check_grep "Pinch " "$WORK/stdout"
# The README and the man page name every command and every option of
# targets (the docs must not drift from the program).
for cmd in targets size curves sweep audit matches design check report; do
	grep -q "heatloom $cmd " "$TOP_SRCDIR/README.md" && pass || fail "README omits $cmd"
	grep -q "^\.BI \"$cmd " "$TOP_SRCDIR/doc/heatloom.1" && pass || fail "man page omits $cmd"
done
for opt in $(hl targets --help | sed -n 's/^  \(--[a-z-]*\).*/\1/p'); do
	grep -q -- "$opt" "$TOP_SRCDIR/README.md" && pass || fail "README omits targets $opt"
	grep -q -- "$(printf '%s' "$opt" | sed 's/-/\\\\-/g')" "$TOP_SRCDIR/doc/heatloom.1" && pass || fail "man page omits $opt"
done
finish
