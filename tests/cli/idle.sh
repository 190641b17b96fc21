#!/bin/sh
# idle.sh - design keeps no unit of next to no heat. latent.csv spreads its
# latent heat over 0.01 K, which leaves the match MILP two slivers of
# 0.04 kW (cp 4 kW/K × 0.01 K of oil, and the vapour's share of it) on the
# far side of the pinch; placed as they were they were two shells of
# 0.0 kW at about 10 000 EUR each. The network must carry none, say in a
# note that they were left out, and pass `heatloom check`.
. "$TOP_SRCDIR/tests/cli/lib.sh"

L="$DATA/good/latent.csv"
LU="$DATA/good/latent-utilities.csv"

# The smallest duty (kW) of the units of a text network (the first number
# of each unit row), and of a CSV one (its duty column).
text_least() {
	awk '/^[EHC][0-9]+ / { for (i = 2; i <= NF; i++) if ($i ~ /^-?[0-9]+\.[0-9]+$/) { if (m == "" || $i + 0 < m) m = $i + 0; break } }
	     END { print (m == "" ? "none" : m) }' "$1"
}
csv_least() {
	awk -F, 'NR == 1 { for (i = 1; i <= NF; i++) if ($i == "duty") c = i; next }
	     c && $1 ~ /^[EHC][0-9]+$/ { if (m == "" || $c + 0 < m) m = $c + 0 }
	     END { print (m == "" ? "none" : m) }' "$1"
}
# At or above the 0.1 % of its streams' duties below which a unit is idle:
# the smallest stream here exchanges 270 kW.
above() {
	awk -v x="$1" 'BEGIN { exit !(x != "none" && x + 0 > 0.27) }'
}

# No prices: the fewest-units network (matches, then placement).
check_exit 0 hl design "$L"
least=$(text_least "$WORK/stdout")
if above "$least"; then pass; else fail "latent.csv: a unit of $least kW"; fi
check_grep "Units                       4 for 6 matches" "$WORK/stdout"
# No loop can carry the 0.04 kW with every approach kept at EMAT 10 K:
# oil to feed would take it and heat the feed to 50 + 180.01/3 = 110.0033
# °C against oil at 120 °C, 0.0033 K short; so the feed's heater and the
# oil's cooler take it, and the penalty shows its digits.
check_grep "Placement adds          0.040 kW to each (see the notes)" "$WORK/stdout"
check_grep "the placement needs 0.04 kW more hot and cold utility than the matches: the" "$WORK/stdout"
check_grep "the match vapour to feed (0.04 kW) is left out" "$WORK/stdout"
check_grep "the match oil to reboiler (0.04 kW) is left out" "$WORK/stdout"
check_exit 0 hl design "$L" --format csv -o "$WORK/n.csv"
least=$(csv_least "$WORK/n.csv")
if above "$least"; then pass; else fail "latent.csv (CSV): a unit of $least kW"; fi
check_exit 0 hl design "$L" --format xml -o "$WORK/n.xml"
check_exit 0 hl check "$WORK/n.xml"
check_grep "4 exchangers, 4 streams, 2 utilities: sound, 0 problems" "$WORK/stdout"
# At EMAT 9.99 K that loop keeps every approach: no utility is added.
check_exit 0 hl design "$L" --emat 9.99 --format xml -o "$WORK/e.xml"
check_exit 0 hl check "$WORK/e.xml"
check_grep "4 exchangers, 4 streams, 2 utilities: sound, 0 problems" "$WORK/stdout"
check_exit 0 hl design "$L" --emat 9.99
check_grep "Units                       4 for 6 matches" "$WORK/stdout"
if grep -q "Placement adds" "$WORK/stdout"; then fail "EMAT 9.99: a penalty"; else pass; fi

# With the utility table, the fewest-units path (--method units): one
# sliver (oil to reboiler) in the matches, none in the network.
check_exit 0 hl design "$L" --utilities "$LU" --method units
least=$(text_least "$WORK/stdout")
if above "$least"; then pass; else fail "latent.csv --utilities: a unit of $least kW"; fi
check_grep "the match oil to reboiler (0.04 kW) is left out" "$WORK/stdout"
check_exit 0 hl design "$L" --utilities "$LU" --method units --format xml -o "$WORK/u.xml"
check_exit 0 hl check "$WORK/u.xml"
check_grep "sound, 0 problems" "$WORK/stdout"
finish
