#!/bin/sh
# run.sh - make fuzz: build each libFuzzer harness with clang, ASan and UBSan,
# and run it for a bounded time on its seed corpus. A crash fails the run.
# Usage: run.sh SRCDIR BUILDDIR SECONDS [HARNESS...]
set -eu
src=$1
build=$2
seconds=$3
shift 3
harnesses=${*:-csv}
CLANG=${CLANG:-clang}
command -v "$CLANG" >/dev/null || { echo "make fuzz needs clang (Debian clang, libclang-rt-dev)"; exit 1; }
out="$build/tests/fuzz"
mkdir -p "$out"
# The schema source is generated into the build tree (the same folder as
# the sources in an in-tree build): take it from there, once.
libsrc="$(ls "$src"/src/core/*/*.c "$src"/src/io/*/*.c | grep -v '/case_rng\.c$') $build/src/io/read/case_rng.c"
flags="-g -O1 -fsanitize=fuzzer,address,undefined -fno-sanitize-recover=undefined -I$build $(for d in "$src"/src/core/*/ "$src"/src/io/*/; do printf -- "-I%s " "$d"; done) $(pkg-config --cflags libxml-2.0)"
libs="$(pkg-config --libs libxml-2.0) -lglpk -lm"
status=0
for h in $harnesses; do
	bin="$out/fuzz_$h"
	echo "building $bin"
	# shellcheck disable=SC2086
	"$CLANG" $flags -o "$bin" "$src/tests/fuzz/fuzz_$h.c" $libsrc $libs
	corpus="$out/corpus-$h"
	mkdir -p "$corpus"
	cp "$src"/tests/fuzz/corpus/"$h"/* "$corpus"/ 2>/dev/null || true
	echo "running fuzz_$h for $seconds s"
	if ! "$bin" -max_total_time="$seconds" -max_len=65536 -rss_limit_mb=2048 \
		-artifact_prefix="$out/crash-$h-" "$corpus" 2>"$out/fuzz_$h.log"; then
		echo "fuzz_$h FAILED: see $out/fuzz_$h.log"; tail -40 "$out/fuzz_$h.log"
		status=1
	fi
	grep -E '^#[0-9]+.*(DONE|pulse)' "$out/fuzz_$h.log" | tail -1
	grep -E 'stat::number_of_executed_units|cov:' "$out/fuzz_$h.log" | tail -1 || true
done
exit $status
