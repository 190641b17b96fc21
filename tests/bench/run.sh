#!/bin/sh
# run.sh - make bench: reproducible benchmarks on generated problems.
# Usage: run.sh BUILDDIR SRCDIR. Writes BUILDDIR/bench-results.md and copies
# it to SRCDIR/doc/performance.md. Knobs (environment): MATCH_LIMIT (s per
# subnetwork, default 10 as in heatloom), MATCH_SIZES (default "4 6 8 10 12
# 15"), DESIGN_LIMIT (s per subnetwork, default 10).
set -eu
build=$1
src=$2
work=$(mktemp -d "${TMPDIR:-/tmp}/heatloom-bench.XXXXXX")
trap 'rm -rf "$work"' EXIT
out="$build/bench-results.md"
bin="$build/tests/bench"
started=$(date +%s)
: "${MATCH_LIMIT:=10}" "${MATCH_SIZES:=4 6 8 10 12 15}" "${DESIGN_LIMIT:=10}"

# rss CMD...: CMD's standard output with its peak RSS (MiB) appended.
rss() {
	_o=$(/usr/bin/time -f '%M' -o "$work/rss" "$@")
	echo "$_o $(($(tail -n 1 "$work/rss") / 1024))"
}

# run_cbc MODEL LIMIT: "units optimal gap seconds rss" of CBC on MODEL.
run_cbc() {
	/usr/bin/time -f '%e %M' -o "$work/tref" cbc "$1" -timeMode elapsed \
		-sec "$2" -solve -quit >"$work/cbc.log" 2>&1 || true
	awk -v tf="$work/tref" '
		/^Result - / { res = $0 }
		/^Objective value:/ { obj = $3 }
		/^Lower bound:/ { lb = $3 }
		END {
			getline tl <tf; split(tl, t, " ")
			opt = res ~ /Optimal solution found/ ? "yes" : "no"
			if (obj == "" || obj + 0 > 1e20) { u = "-"; g = "-" }
			else {
				if (opt == "yes") lb = obj
				u = sprintf("%.0f", obj)
				g = lb == "" ? "-" : sprintf("%.3f", (obj - lb) / obj)
			}
			printf "%s %s %s %.2f %d\n", u, opt, g, t[1], t[2] / 1024
		}' "$work/cbc.log"
}

# run_glpsol DAT LIMIT: the same for glpsol on transship.mod with DAT; the
# bound is the last one of glpsol's branch-and-bound log.
run_glpsol() {
	rm -f "$work/g.sol"
	/usr/bin/time -f '%e %M' -o "$work/tref" glpsol \
		-m "$src/tests/bench/transship.mod" -d "$1" --tmlim "$2" \
		-o "$work/g.sol" >"$work/g.log" 2>&1 || true
	touch "$work/g.sol"
	awk -v tf="$work/tref" -v sol="$work/g.sol" '
		/^\+ .*(mip =|>>>>>)/ { n = split($0, f, ">="); split(f[n], b, " "); lb = b[1] }
		END {
			while ((getline l <sol) > 0) {
				if (l ~ /^Status:/) st = l
				if (l ~ /^Objective:/) { split(l, o, " "); obj = o[4] }
			}
			getline tl <tf; split(tl, t, " ")
			opt = st ~ /INTEGER OPTIMAL/ ? "yes" : "no"
			if (obj == "" || st !~ /INTEGER/ || st ~ /UNDEFINED|EMPTY/) {
				u = "-"; g = "-"
			} else {
				if (opt == "yes" || lb == "tree") lb = obj
				u = sprintf("%.0f", obj)
				g = (lb == "" || lb == "-inf") ? "-" : sprintf("%.3f", (obj - lb) / obj)
			}
			printf "%s %s %s %.2f %d\n", u, opt, g, t[1], t[2] / 1024
		}' "$work/g.log"
}

# remark HL_UNITS HL_OPT HL_TIME REF_UNITS REF_OPT REF_TIME NAME: where the
# reference did better than heatloom, say so (faster: by more than 10 % and
# 0.02 s, beyond the clock's noise).
remark() {
	awk -v hu="$1" -v ho="$2" -v ht="$3" -v ru="$4" -v ro="$5" -v rt="$6" \
	    -v nm="$7" 'BEGIN {
		r = ""
		if (ru == "-") r = nm " found none"
		else if (ru + 0 < hu + 0) r = "**" nm " fewer units**"
		else if (ro == "yes" && ho != "yes") r = "**" nm " proved, heatloom not**"
		else if (ro == "yes" && rt + 0.02 < 0.9 * ht) r = "**" nm " faster**"
		else if (ro != "yes" && ho != "yes" && ru + 0 == hu + 0) r = "same units, neither proved"
		else if (ru + 0 > hu + 0) r = nm " more units"
		print r
	}'
}

# ratio A B: A / B, each at least 0.01 s (the resolution of the clock).
ratio() {
	awk -v a="$1" -v b="$2" 'BEGIN { printf "%.1f", (a > 0.01 ? a : 0.01) / (b > 0.01 ? b : 0.01) }'
}

# Every generated matches problem: heatloom against CBC on the exported
# model (table A), and the textbook model in heatloom and in glpsol (B).
matches_rows() {
	have_cbc=0
	have_glpsol=0
	command -v cbc >/dev/null 2>&1 && have_cbc=1
	command -v glpsol >/dev/null 2>&1 && have_glpsol=1
	: >"$work/ta"
	: >"$work/tb"
	for n in $MATCH_SIZES; do
		for seed in 1 2 3; do
			"$bin/gen_streams" $((2 * n)) "$seed" >"$work/m.csv"
			set -- $(rss "$bin/bench_matches" "$work/m.csv" "$MATCH_LIMIT" \
				-t 1 -x "$work/m.mps")
			parts=$2 hu=$3 hlow=$4 heul=$5 ho=$6 hg=$7 ht=$8 hr=$9
			lim=$((MATCH_LIMIT * parts))
			ref="not installed | | | | | | |"
			if [ "$have_cbc" = 1 ]; then
				set -- $(run_cbc "$work/m.mps" "$lim")
				ref="$1 | $2 | $3 | $4 | $(ratio "$4" "$ht") | $5 | $(remark "$hu" "$ho" "$ht" "$1" "$2" "$4" CBC) |"
			fi
			echo "| $n | $seed | $parts | $hu | $hlow | $heul | $ho | $hg | $ht | $hr | $ref" >>"$work/ta"
			set -- $(rss "$bin/bench_matches" "$work/m.csv" "$MATCH_LIMIT" \
				textbook -t 1)
			tu=$3 to=$6 tg=$7 tt=$8 tr=$9
			ref="not installed | | | | | | |"
			if [ "$have_glpsol" = 1 ]; then
				"$bin/match_dat" "$work/m.csv" >"$work/m.dat"
				set -- $(run_glpsol "$work/m.dat" "$lim")
				ref="$1 | $2 | $3 | $4 | $(ratio "$4" "$tt") | $(ratio "$4" "$ht") | $5 | $(remark "$hu" "$ho" "$ht" "$1" "$2" "$4" glpsol)"
			fi
			# heatloom's own textbook run may beat its tightened one.
			if [ "$tu" != - ] && [ "$hu" != - ] && [ "$tu" -lt "$hu" ]; then
				ref="$ref **textbook fewer units**"
			fi
			ref="$ref |"
			echo "| $n | $seed | $hu | $ho | $ht | $tu | $to | $tg | $tt | $tr | $ref" >>"$work/tb"
		done
	done
}

matches_tables() {
	matches_rows
	echo "## matches (fewest units MILP) against CBC on the same model"
	echo
	echo "N hot and N cold streams from gen_streams (2N streams, seeds 1-3), ΔTmin 10 K, implicit"
	echo "utilities at the targets. heatloom: time limit $MATCH_LIMIT s per subnetwork, one thread (every solver"
	echo "here runs on one core; heatloom's default is two). 'lower' is heatloom's proven bound, 'N-1' the"
	echo "Euler count summed over the subnetworks. CBC ($(cbc -quit 2>/dev/null | awk '/^Version/ { print $2 }')) solves the model that"
	echo "\`matches --export-model\` writes (free MPS: heatloom's tightened model, every subnetwork in one"
	echo "file, without heatloom's starting solution) with a wall-clock limit of $MATCH_LIMIT s times the number of"
	echo "subnetworks, the budget heatloom had. Times are wall-clock of the whole process (CBC's includes"
	echo "reading the file); ratio = CBC's time / heatloom's (above 1: heatloom faster; when both stop at"
	echo "the limit, compare units and gaps instead). Peak RSS in MiB. Bold notes: CBC did better."
	echo
	echo "| N x N | seed | parts | units | lower | N-1 | optimal | gap | time (s) | RSS | CBC: units | optimal | gap | time (s) | ratio | RSS | note |"
	echo "|--:|--:|--:|--:|--:|--:|:-:|--:|--:|--:|--:|:-:|--:|--:|--:|--:|:--|"
	cat "$work/ta"
	echo
	echo "## matches: the textbook model in heatloom and in glpsol"
	echo
	echo "**Not heatloom's model.** Both solve the plain expanded transshipment model of Papoulias &"
	echo "Grossmann (1983): big-M of a pair = the smaller of the two heats, no further bounds, cuts,"
	echo "symmetry rows or starting solution. glpsol (GLPK $(glpsol --version 2>/dev/null | awk 'NR == 1 { print $NF }')) reads it from"
	echo "tests/bench/transship.mod, written from the paper, with the data tests/bench/match_dat writes"
	echo "for each case; heatloom solves its own textbook form (bench_matches ... textbook). The first"
	echo "columns repeat heatloom's result on its tightened model from the table above. Same limits"
	echo "(glpsol --tmlim, which leaves out the MathProg translation; the time shown includes it)."
	echo "Ratios: glpsol's time over heatloom's textbook time and over heatloom's own time. Bold notes:"
	echo "glpsol, or heatloom's textbook run, did better than heatloom's own model; 'failed': no"
	echo "network within the limit."
	echo
	echo "| N x N | seed | heatloom: units | optimal | time (s) | textbook: units | optimal | gap | time (s) | RSS | glpsol: units | optimal | gap | time (s) | / textbook | / heatloom | RSS | note |"
	echo "|--:|--:|--:|:-:|--:|--:|:-:|--:|--:|--:|--:|:-:|--:|--:|--:|--:|--:|:--|"
	cat "$work/tb"
	echo
}

{
	echo "# heatloom benchmarks"
	echo
	echo "Machine: $(uname -m), $(nproc) cores, $(awk '/model name/ {sub(/.*: /, ""); print; exit}' /proc/cpuinfo 2>/dev/null || echo unknown cpu)."
	echo "Date: $(date -u +%Y-%m-%d). Generator: tests/bench/gen_streams (seed 42 unless given)."
	echo
	echo "## targets (problem table) against the floor: read the CSV and sort its temperatures"
	echo
	echo "| streams | floor (s) | targets (s) | ratio | peak RSS (MiB) |"
	echo "|--:|--:|--:|--:|--:|"
	for n in 1000 10000 100000 1000000; do
		"$bin/gen_streams" "$n" 42 >"$work/s.csv"
		set -- $("$bin/bench_targets" "$work/s.csv" 3)
		printf '| %s | %s | %s | %s | %s |\n' "$1" "$2" "$3" "$4" "$(($5 / 1024))"
	done
	echo
	echo "## utility LP (five and ten levels) against the problem table on the same streams"
	echo
	echo "Five levels: three steam mains, cooling water, brine. Ten: a fired heater, four steam mains,"
	echo "hot water; steam raising, tempered water, cooling water, brine (tests/bench/bench_utility_lp.c)."
	echo "Best of three runs; peak RSS is the whole process (reading the table included)."
	echo
	echo "| streams | levels | problem table (s) | utility LP (s) | ratio | peak RSS (MiB) |"
	echo "|--:|--:|--:|--:|--:|--:|"
	for n in 1000 10000 100000; do
		"$bin/gen_streams" "$n" 42 >"$work/s.csv"
		for lv in 5 10; do
			set -- $(rss "$bin/bench_utility_lp" "$work/s.csv" 3 "$lv")
			printf '| %s | %s | %s | %s | %s | %s |\n' "$1" "$2" "$3" "$4" "$5" "$6"
		done
	done
	echo
	echo "## sweep: 200 ΔTmin points on 50 streams with five utility levels"
	echo
	"$bin/gen_streams" 50 42 >"$work/s50.csv"
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
	matches_tables
	echo "## design: match MILP, placement and check on generated problems"
	echo
	echo "n hot and n cold streams (tests/unit/gen.c, seeds 1 to 3), ΔTmin 10 K, no utilities (the"
	echo "implicit pair at the targets), MILP time limit $DESIGN_LIMIT s per subnetwork, two threads. Times are"
	echo "means per case; matches, units and splits are summed over the three cases; the penalty is the"
	echo "largest heat any of them moved to utilities; peak RSS is the process over the three cases."
	echo
	echo "| streams | MILP (s) | placement (s) | check (s) | matches | units | splits | largest penalty (kW) | MILP proven | peak RSS (MiB) |"
	echo "|--:|--:|--:|--:|--:|--:|--:|--:|--:|--:|"
	for n in 3 5 8 10 12 15; do
		set -- $(rss "$bin/bench_design" "$n" 3 "$DESIGN_LIMIT" 2>/dev/null)
		printf '| %s × %s | %s | %s | %s | %s | %s | %s | %s | %s of 3 | %s |\n' "$1" "$1" \
			"$3" "$4" "$5" "$6" "$7" "$9" "$8" "${10}" "${11}"
	done
	echo
	sh "$src/tests/bench/opt.sh" "$build" "$src"
	echo "Whole run: $(($(date +%s) - started)) s. Reproduce with \`make bench\` (tests/bench/run.sh);"
	echo "figures vary with the machine and its load."
} | tee "$out"
cp "$out" "$src/doc/performance.md"
echo "written to $out and $src/doc/performance.md"
