#!/bin/sh
# bad_inputs.sh - the bad-input catalogue: every file under tests/data/bad
# with a NAME.expect beside it. The .expect file holds the exit code on its
# first line, the exact first line of stderr on its second, and optionally a
# third line "args: ..." with the command line, '@' standing for the file
# (default "targets @"). Each run must also leave no output file behind.
. "$TOP_SRCDIR/tests/cli/lib.sh"

cd "$DATA"
n=0
for expect in $(find bad -name '*.expect' | sort); do
	file=${expect%.expect}
	want_rc=$(sed -n 1p "$expect")
	want_err=$(sed -n 2p "$expect")
	args=$(sed -n 's/^args: //p' "$expect")
	[ -n "$args" ] || args="targets @"
	args=$(printf '%s' "$args" | sed "s|@|$file|g")
	out="$WORK/out-$n"
	set +e
	# shellcheck disable=SC2086
	hl $args -o "$out" >/dev/null 2>"$WORK/stderr"
	rc=$?
	set -e
	got_err=$(head -n 1 "$WORK/stderr")
	if [ "$rc" != "$want_rc" ]; then
		fail "$file: exit $rc, want $want_rc ($got_err)"
	elif [ "$got_err" != "$want_err" ]; then
		fail "$file: stderr '$got_err', want '$want_err'"
	elif [ -e "$out" ] || ls "$WORK" | grep -q "out-$n.tmp"; then
		fail "$file: an output file was written"
	else
		pass
	fi
	n=$((n + 1))
done
# Every bad file has its expectation.
for f in $(find bad -type f ! -name '*.expect' ! -path 'bad/gen/*' | sort); do
	[ -f "$f.expect" ] || fail "$f has no $f.expect"
done
[ "$n" -ge 20 ] || fail "only $n bad-input cases"
finish
