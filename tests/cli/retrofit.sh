#!/bin/sh
# retrofit.sh - `heatloom retrofit`: modifications to today's plant.
#
# The four-stream problem (Linnhoff et al., User Guide on Process
# Integration, IChemE 1982; Kemp, Pinch Analysis and Process Integration,
# 2007, ch. 2; from memory) with the hand-built network of audit.sh, and the
# demo plant. Checks are the definitions of the output (doc/results.md,
# "Retrofit") and the first law (common practice, no source): every
# proposal passes `heatloom check`, its saving is today's utility cost less
# its own, its payback is investment over saving, no proposal breaks the
# limits, and hot minus cold utility does not change.
. "$TOP_SRCDIR/tests/cli/lib.sh"

K4="$DATA/good/kemp4.csv"
U4="$DATA/good/kemp4-utilities.csv"
N4="$DATA/good/kemp4-network.csv"

# Text: proposals, the constant-α comparison, the fixed costs marked as
# illustrative, the caution.
check_exit 0 hl retrofit "$K4" --utilities "$U4" --network "$N4"
for s in "Proposal 1:" "constant-α screening promises" \
	"illustrative default" "qualified engineers" "add-shell-series"; do
	check_grep "$s" "$WORK/stdout"
done

# Proposals as XML: schema, check of every proposal's network, savings,
# paybacks and the limits recomputed (xmllint prints what it computes to
# about 6 digits: 1e-5).
if [ -n "${XMLLINT:-}" ]; then
	for lim in "--payback 3" "--budget 40000" "--payback 1.5 --max-changes 1"; do
		# shellcheck disable=SC2086
		check_exit 0 hl retrofit "$K4" --utilities "$U4" --network "$N4" \
			$lim --format xml -o "$WORK/r.xml"
		check_exit 0 "$XMLLINT" --noout --relaxng \
			"$TOP_SRCDIR/doc/results.rng" "$WORK/r.xml"
		r=/results/retrofit
		n=$(xpath "count($r/proposal)" "$WORK/r.xml")
		[ "$n" -ge 1 ] && pass || fail "no proposal with $lim"
		before=$(xpath "string($r/@utility-cost)" "$WORK/r.xml")
		dq=$(xpath "$r/@hot-utility - $r/@cold-utility" "$WORK/r.xml")
		i=1
		while [ "$i" -le "$n" ]; do
			p="$r/proposal[$i]"
			{
				echo '<results generator="test">'
				xpath "$p/network" "$WORK/r.xml"
				echo '</results>'
			} >"$WORK/p$i.xml"
			check_exit 0 hl check "$WORK/p$i.xml"
			check_grep "sound, 0 problems" "$WORK/stdout"
			check_near "$(xpath "string($p/@saving)" "$WORK/r.xml")" \
				"$(xpath "$before - $p/@utility-cost" "$WORK/r.xml")" 1e-5 \
				"saving $i ($lim)"
			check_near "$(xpath "string($p/@utility-cost)" "$WORK/r.xml")" \
				"$(xpath "string($p/network/@energy-cost)" "$WORK/r.xml")" 1e-9 \
				"utility cost of the network $i"
			check_near "$(xpath "string($p/@payback)" "$WORK/r.xml")" \
				"$(xpath "$p/@investment div $p/@saving" "$WORK/r.xml")" 1e-5 \
				"payback $i ($lim)"
			check_near "$(xpath "string($p/@investment)" "$WORK/r.xml")" \
				"$(xpath "sum($p/modification/@cost)" "$WORK/r.xml")" 1e-5 \
				"investment $i ($lim)"
			check_near "$(xpath "$p/@hot-utility - $p/@cold-utility" "$WORK/r.xml")" \
				"$dq" 1e-5 "first law $i"
			case $lim in
			--payback\ 3)
				[ "$(xpath "$p/@payback <= 3" "$WORK/r.xml")" = true ] &&
					pass || fail "payback limit $i" ;;
			--budget*)
				[ "$(xpath "$p/@investment <= 40000" "$WORK/r.xml")" = true ] &&
					pass || fail "budget $i" ;;
			*)
				[ "$(xpath "$p/@payback <= 1.5 and $p/@changes = 1" "$WORK/r.xml")" = true ] &&
					pass || fail "one change within 1.5 years $i" ;;
			esac
			# A reused unit names today's unit and holds today's area.
			m=$(xpath "count($p/network/exchanger[@reuses and @area-today + @area-added < @area * 0.999999])" "$WORK/r.xml")
			[ "$m" = 0 ] && pass || fail "area needed beyond today + added in $i"
			i=$((i + 1))
		done
	done
	# `check` reads the best proposal's network from the whole document.
	check_exit 0 hl check "$WORK/r.xml"

	# A tampered area: check names the unit that needs more than it has.
	check_exit 0 hl retrofit "$K4" --utilities "$U4" --network "$N4" \
		--format xml -o "$WORK/t.xml"
	sed 's/area-added="\([0-9.]*\)" shells-added="1"/area-added="0.5" shells-added="1"/' \
		"$WORK/t.xml" >"$WORK/t2.xml"
	if ! cmp -s "$WORK/t.xml" "$WORK/t2.xml"; then
		check_exit 2 hl check "$WORK/t2.xml"
		check_grep "m² added: add" "$WORK/stderr"
	fi
	# A reused unit without its area today is refused with its line.
	sed 's/ area-today="[0-9.]*"//' "$WORK/t.xml" >"$WORK/t3.xml"
	check_exit 2 hl check "$WORK/t3.xml"
	check_grep "reuses with area-today" "$WORK/stderr"
fi

# Utilities with their own type and cost law (kemp4-utilities-typed.csv):
# each proposal's network carries them, so that `check` prices its units
# again by the same laws.
if [ -n "${XMLLINT:-}" ]; then
	check_exit 0 hl retrofit "$K4" --utilities "$DATA/good/kemp4-utilities-typed.csv" \
		--network "$N4" --format xml -o "$WORK/typed.xml"
	r=/results/retrofit
	n=$(xpath "count($r/proposal)" "$WORK/typed.xml")
	[ "$n" -ge 1 ] && pass || fail "no proposal with typed utilities"
	[ "$(xpath "count($r/proposal/network/utility[@name='steam' and @cost-b = 1200]) = $n and count($r/proposal/network/utility[@name='cooling water' and @type='plate']) = $n" "$WORK/typed.xml")" = true ] &&
		pass || fail "the utilities' laws and types in the proposals' networks"
	i=1
	while [ "$i" -le "$n" ]; do
		{
			echo '<results generator="test">'
			xpath "$r/proposal[$i]/network" "$WORK/typed.xml"
			echo '</results>'
		} >"$WORK/typed$i.xml"
		check_exit 0 hl check "$WORK/typed$i.xml"
		check_grep "sound, 0 problems" "$WORK/stdout"
		i=$((i + 1))
	done
fi

# A fired heater today (S-1 on invented flue gas, its own cost law) is
# rated for today's duty: each proposal's network says so and passes
# `check`; rated below what it fires, `check` names the firing to add.
if [ -n "${XMLLINT:-}" ]; then
	cat >"$WORK/fired-u.csv" <<-EOF
	name,kind,supply,target,price,type,cost_a,cost_b,cost_c
	flue gas,hot,800,300,30,fired-heater,50000,150000,0.75
	cooling water,cold,15,25,1.2,,,,
	EOF
	sed 's/^S-1,steam,/S-1,flue gas,/' "$N4" >"$WORK/fired-n.csv"
	check_exit 0 hl retrofit "$K4" --utilities "$WORK/fired-u.csv" \
		--network "$WORK/fired-n.csv" --format xml -o "$WORK/fired.xml"
	check_exit 0 "$XMLLINT" --noout --relaxng \
		"$TOP_SRCDIR/doc/results.rng" "$WORK/fired.xml"
	r=/results/retrofit
	n=$(xpath "count($r/proposal)" "$WORK/fired.xml")
	[ "$n" -ge 1 ] && pass || fail "no proposal with a fired heater"
	[ "$(xpath "count($r/proposal/network/exchanger[@reuses='S-1' and @type='fired-heater' and @duty-today = 140 and @duty <= @duty-today + @duty-added]) = $n" "$WORK/fired.xml")" = true ] &&
		pass || fail "the fired heater rated at today's 140 kW in every proposal"
	check_exit 0 hl check "$WORK/fired.xml"
	check_grep "sound, 0 problems" "$WORK/stdout"
	sed 's/duty-today="140"/duty-today="1"/' "$WORK/fired.xml" >"$WORK/fired2.xml"
	check_exit 2 hl check "$WORK/fired2.xml"
	check_grep "but is rated 1 kW today with 0 kW added: add" "$WORK/stderr"
	# A rating on a unit that is not a fired heater is refused.
	sed 's/reuses="E1"/reuses="E1" duty-today="240"/' "$WORK/fired.xml" >"$WORK/fired3.xml"
	check_exit 2 hl check "$WORK/fired3.xml"
	check_grep "belong to a fired heater only" "$WORK/stderr"
fi

# Today's network from the case file, fixed costs from its <cost>: the
# output says they were given and prices with them.
if [ -n "${XMLLINT:-}" ]; then
	G="$DATA/good"
	cat >"$WORK/costs.xml" <<-EOF
	<?xml version="1.0" encoding="UTF-8"?>
	<case version="1">
	  <settings><cost repipe="5000" new-unit="7000"/></settings>
	  <streams file="$G/kemp4.csv"/>
	  <utilities file="$G/kemp4-utilities.csv"/>
	  <network file="$G/kemp4-network.csv"/>
	</case>
	EOF
	check_exit 0 hl retrofit "$WORK/costs.xml" --format xml -o "$WORK/c.xml"
	r=/results/retrofit
	[ "$(xpath "string($r/@fixed-costs)" "$WORK/c.xml")" = given ] &&
		pass || fail "fixed costs from the case"
	check_near "$(xpath "string($r/@repipe-cost)" "$WORK/c.xml")" 5000 1e-12 "repipe cost"
	check_near "$(xpath "string($r/@unit-cost)" "$WORK/c.xml")" 7000 1e-12 "unit cost"
	n=$(xpath "count($r/proposal/modification[@kind='add-unit' and @shells-added = 1])" "$WORK/c.xml")
	if [ "$n" -gt 0 ]; then
		# One shell of A m²: a + b·A^c + the new unit's 7000 (cost law
		# as the case's defaults: 10000 + 800·A^0.8).
		m="($r/proposal/modification[@kind='add-unit' and @shells-added = 1])[1]"
		a=$(xpath "string($m/@area-added)" "$WORK/c.xml")
		want=$(awk -v a="$a" 'BEGIN { printf "%.10g", 10000 + 800 * a ^ 0.8 + 7000 }')
		check_near "$(xpath "string($m/@cost)" "$WORK/c.xml")" "$want" 1e-9 "new unit's cost"
	fi
fi

# Same input and seed: the same bytes.
check_exit 0 hl retrofit "$K4" --utilities "$U4" --network "$N4" --seed 7 \
	--format csv -o "$WORK/a.csv"
check_exit 0 hl retrofit "$K4" --utilities "$U4" --network "$N4" --seed 7 \
	--format csv -o "$WORK/b.csv"
cmp -s "$WORK/a.csv" "$WORK/b.csv" && pass || fail "two runs differ"
check_grep "rank,investment,saving,payback" "$WORK/a.csv"

# The demo plant, two changes at most: proposals and a grid diagram.
check_exit 0 hl retrofit "$CASES/demo.xml" --network "$CASES/demo-network.csv" \
	--max-changes 2 --quiet --svg "$WORK/demo.svg" -o "$WORK/demo.txt"
check_grep "Proposal 1:" "$WORK/demo.txt"
check_grep "<svg" "$WORK/demo.svg"

# The invented crude train: its fired heater's flue gas leaves at the
# row's 450 °C, not the utility's 250 °C stack, which lies below the
# crude's inlet; every proposal passed `check` or nothing is written.
check_exit 0 hl retrofit "$CASES/crude.xml" --max-changes 1 --quiet -o "$WORK/crude.txt"
check_grep "Today (simulated): hot utility 14800.0 kW" "$WORK/crude.txt"

# Misuse and bad data.
check_exit 1 hl retrofit "$K4" --payback -1
check_exit 1 hl retrofit "$K4" --max-changes 0
check_exit 1 hl retrofit "$K4" --max-changes 1.5
check_exit 1 hl retrofit "$K4" --budget
check_exit 1 hl retrofit "$K4" --format html
check_exit 1 hl retrofit "$K4" --utilities "$U4" --network "$N4" -o "$N4"
check_exit 2 hl retrofit "$K4" --utilities "$U4"
check_exit 2 hl retrofit "$K4" --utilities "$U4" --network "$WORK/missing.csv"
check_exit 0 hl help retrofit
check_grep "--max-changes" "$WORK/stdout"

finish
