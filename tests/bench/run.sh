#!/bin/sh
# run.sh - make bench: reproducible benchmarks on generated problems.
# Usage: run.sh BUILDDIR SRCDIR. Writes BUILDDIR/bench-results.md.
set -eu
build=$1
src=$2
work=$(mktemp -d "${TMPDIR:-/tmp}/heatloom-bench.XXXXXX")
trap 'rm -rf "$work"' EXIT
out="$build/bench-results.md"
{
	echo "# heatloom benchmarks"
	echo
	echo "Machine: $(uname -m), $(nproc) cores, $(awk '/model name/ {sub(/.*: /, ""); print; exit}' /proc/cpuinfo 2>/dev/null || echo unknown cpu)."
	echo "Date: $(date -u +%Y-%m-%d). Generator: tests/bench/gen_streams (seed 42)."
	echo
	echo "## targets (problem table) against the floor: read the CSV and sort its temperatures"
	echo
	echo "| streams | floor (s) | targets (s) | ratio | peak RSS (MiB) |"
	echo "|--:|--:|--:|--:|--:|"
	for n in 1000 10000 100000 1000000; do
		"$build/tests/bench/gen_streams" "$n" 42 >"$work/s.csv"
		set -- $("$build/tests/bench/bench_targets" "$work/s.csv" 3)
		printf '| %s | %s | %s | %s | %s |\n' "$1" "$2" "$3" "$4" "$(($5 / 1024))"
	done
	echo
	echo "## utility LP (five levels) against the problem table on the same streams"
	echo
	echo "| streams | problem table (s) | utility LP (s) | ratio |"
	echo "|--:|--:|--:|--:|"
	for n in 1000 10000 100000; do
		"$build/tests/bench/gen_streams" "$n" 42 >"$work/s.csv"
		set -- $("$build/tests/bench/bench_utility_lp" "$work/s.csv" 3)
		printf '| %s | %s | %s | %s |\n' "$1" "$2" "$3" "$4"
	done
} | tee "$out"
echo "written to $out"
