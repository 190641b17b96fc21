#!/bin/sh
# check.sh - `heatloom check` on a designed network and on tampered copies:
# each tampering is caught with exit 2 and the exchanger named.
. "$TOP_SRCDIR/tests/cli/lib.sh"

if [ -z "${XMLLINT:-}" ]; then
	echo "SKIP: xmllint not found (Debian package libxml2-utils)"
	exit 77
fi

NET="$DATA/good/kemp4-designed.xml"

# The network of the four-stream problem (Linnhoff et al. 1982; Kemp 2007,
# ch. 2; targets from memory, confirmed by a hand cascade: 20 / 60 kW at
# ΔTmin 10 K) as design writes it: sound, and valid against the schema.
check_exit 0 hl check "$NET"
check_grep "sound, 0 problems" "$WORK/stdout"
check_grep "20.0 kW hot, 60.0 kW cold" "$WORK/stdout"
if "$XMLLINT" --noout --relaxng "$TOP_SRCDIR/doc/results.rng" "$NET" \
    2>"$WORK/lint"; then pass; else fail "$NET does not match the schema"; fi
check_exit 0 hl check --quiet "$NET"
[ -s "$WORK/stdout" ] && fail "--quiet printed a summary" || pass

# tamper SED-EXPR: a copy of the network edited by sed.
tamper() {
	sed "$1" "$NET" >"$WORK/t.xml"
}

# E1 is H1-C2, 240 kW, 170 -> 90 °C against 80 -> 140 °C (a 10 K approach
# at its cold end).
tamper '/id="E1"/s/duty="240"/duty="250"/'
check_exit 2 hl check "$WORK/t.xml"
check_grep ": E1: heat balance of the hot side" "$WORK/stderr"
check_grep "t.xml:" "$WORK/stderr"

tamper '/id="E1"/s/cold-out="140"/cold-out="139"/'
check_exit 2 hl check "$WORK/t.xml"
check_grep ": E1: heat balance of the cold side" "$WORK/stderr"
# Messages give numbers at a readable precision (at most 6 significant
# digits), not 10.
grep -Eq '[0-9]\.?[0-9]{7,}' "$WORK/stderr" && fail "a number with more than 6 digits: $(cat "$WORK/stderr")" || pass

# A consistent change of both ends of E1's cold side breaks C2's stages.
tamper '/id="E1"/s/cold-in="80"/cold-in="82"/'
check_exit 2 hl check "$WORK/t.xml"
check_grep ": E1:" "$WORK/stderr"

# At an EMAT (and ΔTmin) of 12 K the 10 K ends break the approach.
tamper 's/<network dtmin="10" emat="10"/<network dtmin="12" emat="12"/'
check_exit 2 hl check "$WORK/t.xml"
check_grep ": E1: EMAT violated at the cold end" "$WORK/stderr"

# An area that does not follow from the temperatures.
tamper '/id="E4"/s/ area="[0-9.]*"/ area="3"/'
check_exit 2 hl check "$WORK/t.xml"
check_grep ": E4: sizing does not follow" "$WORK/stderr"

# More hot utility than the targets without a declared penalty.
tamper '/name="steam"/s/load="20"/load="25"/'
check_exit 2 hl check "$WORK/t.xml"
check_grep "steam" "$WORK/stderr"

# A stage left out of C1.
tamper '/id="E4"/s/ cold-stage="1"//'
check_exit 2 hl check "$WORK/t.xml"
check_grep ": E4: has no stage on stream 'C1'" "$WORK/stderr"

# Files that are no network at all.
printf 'name,supply\n' >"$WORK/n.xml"
check_exit 2 hl check "$WORK/n.xml"
check_grep "not well-formed XML" "$WORK/stderr"
tamper 's/<exchanger id="E2"/<exchanger colour="red" id="E2"/'
check_exit 2 hl check "$WORK/t.xml"
check_grep "<exchanger> has no attribute 'colour'" "$WORK/stderr"
tamper 's/hot="H2" cold="C1"/hot="H9" cold="C1"/'
check_exit 2 hl check "$WORK/t.xml"
check_grep "no stream or utility 'H9'" "$WORK/stderr"
check_exit 2 hl check "$DATA/good/kemp4.xml"
check_grep "no <network> element" "$WORK/stderr"
check_exit 1 hl check
check_exit 1 hl check "$NET" "$NET"
check_exit 0 hl check --help
check_grep "screening estimates" "$WORK/stdout"
finish
