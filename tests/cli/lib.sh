# lib.sh - shared setup of the command-line tests (sourced by each test).
#
# Environment from make check: HEATLOOM (the program), TOP_SRCDIR,
# TOP_BUILDDIR, XMLLINT, RSVG_CONVERT, VALGRIND_BIN; HEATLOOM_VALGRIND=1 runs
# every heatloom call under valgrind memcheck and fails on any error or leak.
set -eu

: "${HEATLOOM:?run through make check}"
: "${TOP_SRCDIR:?run through make check}"
DATA="$TOP_SRCDIR/tests/data"
CASES="$TOP_SRCDIR/cases"
WORK=$(mktemp -d "${TMPDIR:-/tmp}/heatloom-test.XXXXXX")
trap 'rm -rf "$WORK"' EXIT
failures=0
checks=0

hl() {
	if [ "${HEATLOOM_VALGRIND:-0}" = 1 ] && [ -n "${VALGRIND_BIN:-}" ]; then
		"$VALGRIND_BIN" -q --error-exitcode=99 --leak-check=full \
			--show-leak-kinds=definite,indirect,possible \
			--errors-for-leak-kinds=definite,indirect,possible \
			"$HEATLOOM" "$@"
	else
		"$HEATLOOM" "$@"
	fi
}

fail() {
	echo "FAIL: $*" >&2
	failures=$((failures + 1))
}

pass() {
	checks=$((checks + 1))
}

# check_exit WANT CMD...: run CMD, compare its exit status.
check_exit() {
	want=$1
	shift
	set +e
	"$@" >"$WORK/stdout" 2>"$WORK/stderr"
	got=$?
	set -e
	if [ "$got" -ne "$want" ]; then
		fail "exit $got, want $want: $*"
		sed 's/^/  stderr: /' "$WORK/stderr" | head -5 >&2
		return 0
	fi
	pass
}

# check_grep PATTERN FILE: FILE holds a line matching PATTERN (fixed string).
check_grep() {
	if grep -qF -- "$1" "$2"; then pass; else fail "no '$1' in $2"; fi
}

# xpath EXPR FILE: print the value of an XPath expression (needs xmllint).
xpath() {
	"$XMLLINT" --xpath "$1" "$2" 2>/dev/null
}

# near GOT WANT REL: |GOT - WANT| <= REL * max(1, |WANT|)
near() {
	awk -v g="$1" -v w="$2" -v r="$3" 'BEGIN {
		d = g - w; if (d < 0) d = -d; s = w < 0 ? -w : w; if (s < 1) s = 1;
		exit !(d <= r * s) }'
}

check_near() {
	if near "$1" "$2" "$3"; then pass; else fail "$4: got '$1', want $2"; fi
}

finish() {
	echo "$checks passed, $failures failed"
	[ "$failures" -eq 0 ]
}
