#!/bin/sh
# readme.sh - .ci/run runs the README's two commands (build and demo, then
# the whole test suite) verbatim, so that CI tries what a new user types.
. "$TOP_SRCDIR/tests/cli/lib.sh"

grep '^    \$(command -v sudo) apt-get update' "$TOP_SRCDIR/README.md" |
	sed 's/^    //' >"$WORK/commands"
[ "$(wc -l <"$WORK/commands")" -eq 2 ] && pass ||
	fail "README.md should hold two install commands, has $(wc -l <"$WORK/commands")"
while IFS= read -r line; do
	grep -qxF -- "$line" "$TOP_SRCDIR/.ci/run" && pass ||
		fail ".ci/run does not run the README's command: $line"
done <"$WORK/commands"
# The first installs what building and running need, and nothing for tests.
first=$(head -1 "$WORK/commands")
for p in libxml2-dev libglpk-dev pkg-config; do
	case "$first" in *" $p "*) pass ;; *) fail "first command lacks $p" ;; esac
done
for p in libcmocka-dev valgrind chromium; do
	case "$first" in *" $p "*) fail "first command installs $p" ;; *) pass ;; esac
done
finish
