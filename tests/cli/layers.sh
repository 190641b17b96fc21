#!/bin/sh
# layers.sh - the source folders keep their order (doc/design.md, "Layout"):
# core never includes io or cmd, io never includes cmd, and each core stage
# includes only headers of its own stage or of the stages before it.
. "$TOP_SRCDIR/tests/cli/lib.sh"

SRC="$TOP_SRCDIR/src"
# The core stages in pipeline order: a stage may use those before it.
STAGES="base case exchanger targets sensitivity match network audit study"

# "header folder" for every header in src, folder relative to src.
(cd "$SRC" && find . -name '*.h' | sed 's|^\./||' |
	awk -F/ '{ f = $1; for (i = 2; i < NF; i++) f = f "/" $i; print $NF, f }') \
	>"$WORK/headers"
# The generated schema source's header lives beside it.
grep -q '^case_rng.h ' "$WORK/headers" || fail "case_rng.h not found"

rank() {
	r=0
	for s in $STAGES; do
		r=$((r + 1))
		[ "$s" = "$1" ] && { echo "$r"; return; }
	done
	echo 0
}

# Every stage folder of src/core is in STAGES.
for d in "$SRC"/core/*/; do
	s=$(basename "$d")
	[ "$(rank "$s")" -gt 0 ] && pass ||
		fail "src/core/$s is not a stage of layers.sh's order"
done

bad=0
for f in $(cd "$SRC" && find core io -name '*.[ch]' | sort); do
	layer=${f%%/*}
	stage=$(echo "$f" | cut -d/ -f2)
	for h in $(sed -n 's/^[[:space:]]*#[[:space:]]*include[[:space:]]*"\([^"]*\)".*/\1/p' "$SRC/$f"); do
		[ "$h" = config.h ] && continue
		dir=$(awk -v h="$(basename "$h")" '$1 == h { print $2; exit }' "$WORK/headers")
		if [ -z "$dir" ]; then
			fail "src/$f includes \"$h\", found nowhere in src"
			bad=1
			continue
		fi
		case "$layer:$dir" in
		core:io/* | core:cmd* | io:cmd*)
			fail "src/$f includes \"$h\" of src/$dir: $layer must not use it"
			bad=1
			continue ;;
		esac
		if [ "$layer" = core ] && [ "${dir#core/}" != "$dir" ]; then
			to=${dir#core/}
			if [ "$(rank "$to")" -gt "$(rank "$stage")" ]; then
				fail "src/$f ($stage) includes \"$h\" of the later stage $to"
				bad=1
				continue
			fi
		fi
		pass
	done
done
[ "$bad" -eq 0 ] || echo "order of the core stages: $STAGES" >&2
finish
