#!/bin/sh
# opt.sh - make bench, the least-cost search of `design`: the total annual
# cost (TAC) against the best published on four benchmarks
# (tests/data/published, sources in each case file and in Roetzel, Luo &
# Chen 2020, ch. 6), and time and TAC against the supertarget on generated
# problems of 20, 30 and 40 streams. Usage: opt.sh BUILDDIR SRCDIR; prints
# a Markdown section. Knob: OPT_SIZES (default "20 30 40").
set -eu
build=$1
src=$2
work=$(mktemp -d "${TMPDIR:-/tmp}/heatloom-opt.XXXXXX")
trap 'rm -rf "$work"' EXIT
hl="$build/heatloom"
: "${OPT_SIZES:=20 30 40}"

# run CASE: "seconds tac evaluations capped" of design's default search.
run() {
	/usr/bin/time -f '%e' -o "$work/t" "$hl" design "$1" --quiet \
		--format xml -o "$work/n.xml" >/dev/null 2>&1 || { echo "- - - -"; return; }
	t=$(xmllint --xpath 'string(/results/network/@total-cost)' "$work/n.xml")
	e=$(xmllint --xpath 'string(/results/least-cost/@evaluations)' "$work/n.xml")
	c=$(xmllint --xpath 'string(/results/least-cost/@time-capped)' "$work/n.xml")
	echo "$(cat "$work/t") $t $e $c"
}

echo "## design: the least-cost search"
echo
echo "Default search (\`heatloom design CASE\`: seed 1, two threads, time cap 60 s), on this"
echo "machine as loaded at the time. Published problems priced as their sources price them"
echo "(annual cost law, counterflow, EMAT 1 K; tests/data/published; yg4's heaters at 1200·A^0.6"
echo "by the steam's own cost law, its other units at 1000·A^0.6, as its source prices them)."
echo
echo "| problem | streams | best published TAC | heatloom TAC | ratio | time (s) | evaluations | time cap bound |"
echo "|---|--:|--:|--:|--:|--:|--:|---|"
for p in yg4:4:77964 cf7:7:105426 aromatics9:9:2892924 bp15:15:1497252; do
	n=${p%%:*}; r=${p#*:}; k=${r%%:*}; b=${r#*:}
	set -- $(run "$src/tests/data/published/$n.xml")
	printf '| %s | %s | %s | %s | %s | %s | %s | %s |\n' "$n" "$k" "$b" \
		"$(awk -v t="$2" 'BEGIN { if (t == "-") print "-"; else printf "%.0f", t }')" \
		"$(awk -v t="$2" -v b="$b" 'BEGIN { if (t == "-") print "-"; else printf "%.4f", t / b }')" \
		"$1" "$3" "$4"
done
echo
echo "Generated problems (tests/bench/gen_streams N 1: half hot, half cold), steam at 450 °C"
echo "(40 per MWh) and cooling water 10 → 20 °C (5 per MWh), ΔTmin 10 K, cost per shell"
echo "10000 + 800·A^0.8, 10 % over 10 years, shell-and-tube. The supertarget is \`targets"
echo "--supertargets\` at ΔTmin 10 K (a target, not a network: a ratio near 1 is the goal)."
echo
echo "| streams | time (s) | evaluations | time cap bound | TAC | supertarget TAC | ratio |"
echo "|--:|--:|--:|---|--:|--:|--:|"
printf 'name,kind,supply,target,price,h\nsteam,hot,450,450,40,5\ncooling water,cold,10,20,5,2.5\n' >"$work/u.csv"
for n in $OPT_SIZES; do
	"$build/tests/bench/gen_streams" "$n" 1 >"$work/g$n.csv"
	cat >"$work/g$n.xml" <<XML
<?xml version="1.0" encoding="UTF-8"?>
<case version="1">
  <settings dtmin="10"><cost a="10000" b="800" c="0.8"/></settings>
  <streams file="g$n.csv"/>
  <utilities file="u.csv"/>
</case>
XML
	st=$("$hl" targets "$work/g$n.xml" --supertargets --format xml |
		xmllint --xpath 'string(//supertargets/@total-cost)' -)
	set -- $(run "$work/g$n.xml")
	printf '| %s | %s | %s | %s | %.0f | %.0f | %s |\n' "$n" "$1" "$3" "$4" "$2" "$st" \
		"$(awk -v t="$2" -v s="$st" 'BEGIN { printf "%.2f", t / s }')"
done
echo
