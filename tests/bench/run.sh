#!/bin/sh
# run.sh - make bench: reproducible benchmarks on generated problems.
# Usage: run.sh BUILDDIR SRCDIR. Writes BUILDDIR/bench-results.md and copies
# it to SRCDIR/doc/performance.md.
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
	echo
	echo "## sweep: 200 ΔTmin points on 50 streams with five utility levels"
	echo
	"$build/tests/bench/gen_streams" 50 42 >"$work/s50.csv"
	cat >"$work/u.csv" <<-EOF
	name,kind,supply,target,price
	HP steam,hot,450,450,38
	MP steam,hot,300,300,30
	LP steam,hot,180,180,22
	cooling water,cold,10,15,2
	brine,cold,-40,-35,25
	EOF
	/usr/bin/time -f '%e %M' -o "$work/time" "$build/heatloom" sweep "$work/s50.csv" \
		--utilities "$work/u.csv" --from 0.2 --to 40 --step 0.2 --format csv -o "$work/sw.csv"
	set -- $(cat "$work/time")
	echo "| points | wall time (s) | per point (ms) | peak RSS (MiB) |"
	echo "|--:|--:|--:|--:|"
	printf '| %s | %s | %s | %s |\n' "$(($(wc -l <"$work/sw.csv") - 1))" "$1" \
		"$(awk -v t="$1" 'BEGIN { printf "%.2f", 1000 * t / 200 }')" "$(($2 / 1024))"
	echo
	echo "## matches (fewest units MILP) on generated problems"
	echo
	echo "N hot and N cold streams from gen_streams (2N streams, seeds 1-3), ΔTmin 10 K, implicit"
	echo "utilities at the targets, time limit ${MATCH_LIMIT:=30} s per subnetwork. 'lower' is the proven"
	echo "bound, 'N-1' the Euler count summed over the subnetworks; time is wall-clock for the run."
	echo "The textbook columns solve the plain model (big-M = the smaller heat, nothing else) with the"
	echo "same limit, for N up to ${TEXTBOOK_MAX:=10}."
	echo
	echo "| N x N | seed | parts | units | lower | N-1 | optimal | gap | time (s) | textbook: units | optimal | gap | time (s) |"
	echo "|--:|--:|--:|--:|--:|--:|:-:|--:|--:|--:|:-:|--:|--:|"
	for n in 4 5 6 7 8 9 10 11 12 13 14 15; do
		for seed in 1 2 3; do
			"$build/tests/bench/gen_streams" $((2 * n)) "$seed" >"$work/m.csv"
			set -- $("$build/tests/bench/bench_matches" "$work/m.csv" "$MATCH_LIMIT")
			row="| $n | $seed | $2 | $3 | $4 | $5 | $6 | $7 | $8"
			if [ "$n" -le "$TEXTBOOK_MAX" ]; then
				set -- $("$build/tests/bench/bench_matches" "$work/m.csv" "$MATCH_LIMIT" textbook)
				row="$row | $3 | $6 | $7 | $8 |"
			else
				row="$row | | | | |"
			fi
			echo "$row"
		done
	done
	echo
	echo "## design: match MILP, placement and check on generated problems"
	echo
	echo "n hot and n cold streams (tests/unit/gen.c, seeds 1 to 3), ΔTmin 10 K, no utilities (the"
	echo "implicit pair at the targets), MILP time limit 10 s per subnetwork. Times are means per case;"
	echo "matches, units and splits are summed over the three cases; the penalty is the largest heat"
	echo "any of them moved to utilities."
	echo
	echo "| streams | MILP (s) | placement (s) | check (s) | matches | units | splits | largest penalty (kW) | MILP proven |"
	echo "|--:|--:|--:|--:|--:|--:|--:|--:|--:|"
	for n in 3 5 8 10 12 15; do
		set -- $("$build/tests/bench/bench_design" "$n" 3 10 2>/dev/null)
		printf '| %s × %s | %s | %s | %s | %s | %s | %s | %s | %s of 3 |\n' "$1" "$1" "$3" \
			"$4" "$5" "$6" "$7" "$9" "$8" "${10}"
	done
	echo
	echo "Reproduce with \`make bench\` (tests/bench/run.sh); figures vary with the machine."
} | tee "$out"
cp "$out" "$src/doc/performance.md"
echo "written to $out and $src/doc/performance.md"
