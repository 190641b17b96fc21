#!/bin/sh
# report_browser.sh - a browser reads the report: Debian's chromium, headless,
# renders it to PNG and to PDF on A4 and on Letter, within the expected
# number of pages, and fetches nothing: every host name fails to resolve
# (--host-resolver-rules) and the net log shows no request made by the page
# and no TCP connection attempted at all. A control run of a copy with one
# planted external image proves that the net-log check sees such a request.
. "$TOP_SRCDIR/tests/cli/lib.sh"

CHROMIUM=${CHROMIUM:-}
[ -n "$CHROMIUM" ] || CHROMIUM=$(command -v chromium || command -v chromium-browser || true)
if [ -z "$CHROMIUM" ]; then
	echo "SKIP: chromium is not installed (Debian package chromium: apt-get install chromium)"
	exit 77
fi

# browse NAME ARGS...: one headless run with a fresh profile; its net log is
# $WORK/NAME.netlog, its messages $WORK/NAME.err.
browse() {
	name=$1
	shift
	mkdir -p "$WORK/profile-$name"
	timeout 60 "$CHROMIUM" --headless --no-sandbox --disable-gpu \
		--disable-quic --no-first-run --disable-background-networking \
		--disable-component-update --disable-sync \
		--user-data-dir="$WORK/profile-$name" \
		--host-resolver-rules="MAP * ~NOTFOUND" \
		--log-net-log="$WORK/$name.netlog" --net-log-capture-mode=Default \
		"$@" >"$WORK/$name.err" 2>&1
}

# The URLs the page itself asked for: requests with an initiator (the
# browser's own service requests have "not an origin"), file: and data:
# excepted. One event per line in a net log.
page_requests() {
	grep '"initiator":' "$1" | grep -v '"initiator":"not an origin"' |
		grep -o '"url":"[^"]*"' | grep -v '"url":"\(file\|data\):' || true
}

# TCP connection attempts: the event type's number is in the log's constants.
tcp_attempts() {
	t=$(grep -o '"TCP_CONNECT_ATTEMPT":[0-9]*' "$1" | head -1 | cut -d: -f2)
	[ -n "$t" ] || { echo "no-constant"; return; }
	grep -c "\"type\":$t}" "$1" || true
}

# pages FILE.pdf: pdfinfo's count, else the /Type /Page objects.
pages() {
	if [ -n "${PDFINFO:-}" ] || PDFINFO=$(command -v pdfinfo); then
		"$PDFINFO" "$1" | awk '/^Pages:/ { print $2 }'
	else
		grep -ao '/Type */Pages\{0,1\}' "$1" | grep -c 'Page$'
	fi
}

check_exit 0 hl report "$CASES/demo.xml" --network "$CASES/demo-network.csv" \
	--title "Marlow Bay resin plant" \
	--date 2026-01-15 -o "$WORK/r.html"
# One copy per paper size; the report itself leaves the size to the printer.
sed 's|</style>|@page{size:A4}</style>|' "$WORK/r.html" >"$WORK/a4.html"
sed 's|</style>|@page{size:letter}</style>|' "$WORK/r.html" >"$WORK/letter.html"

browse png --window-size=1280,2000 --screenshot="$WORK/r.png" "file://$WORK/r.html"
browse a4 --no-pdf-header-footer --print-to-pdf="$WORK/a4.pdf" "file://$WORK/a4.html"
browse letter --no-pdf-header-footer --print-to-pdf="$WORK/letter.pdf" "file://$WORK/letter.html"

# The PNG: a PNG signature, 1280 px wide.
if [ -s "$WORK/r.png" ]; then
	[ "$(head -c 8 "$WORK/r.png" | od -An -tx1 | tr -d ' \n')" = 89504e470d0a1a0a ] \
		&& pass || fail "r.png is not a PNG"
	w=$(od -An -tu1 -j16 -N4 "$WORK/r.png" | awk '{ print $1 * 16777216 + $2 * 65536 + $3 * 256 + $4 }')
	[ "$w" -eq 1280 ] && pass || fail "r.png is $w px wide"
else
	fail "no screenshot: $(tail -2 "$WORK/png.err")"
fi

# The PDFs: the demo's 12 sections, each from a new page, the data, cascade,
# match and exchanger tables and six figures (five charts and the grid
# diagram) take 16 to 24 pages on either paper (19 on A4 and 21 on Letter
# when this was written).
for paper in a4 letter; do
	if [ ! -s "$WORK/$paper.pdf" ]; then
		fail "no $paper PDF: $(tail -2 "$WORK/$paper.err")"
		continue
	fi
	head -c 5 "$WORK/$paper.pdf" | grep -q '%PDF-' && pass || fail "$paper.pdf is not a PDF"
	n=$(pages "$WORK/$paper.pdf")
	echo "$paper.pdf: $n pages"
	[ "$n" -ge 16 ] && [ "$n" -le 24 ] && pass || fail "$paper.pdf has $n pages, want 16 to 24"
done
if [ -n "${PDFINFO:-}" ]; then
	"$PDFINFO" "$WORK/a4.pdf" | grep -q '^Page size:.*(A4)' && pass || fail "a4.pdf is not A4"
	"$PDFINFO" "$WORK/letter.pdf" | grep -q '^Page size:.*(letter)' && pass || fail "letter.pdf is not Letter"
fi
# No page left nearly empty after the summary: page 2 holds the summary's
# tail and the stream data (pdftotext, poppler-utils).
if command -v pdftotext >/dev/null 2>&1; then
	for paper in a4 letter; do
		n=$(pdftotext -f 2 -l 2 -layout "$WORK/$paper.pdf" - | grep -c .)
		[ "$n" -ge 15 ] && pass || fail "$paper.pdf page 2 has only $n lines"
	done
fi

# Nothing left the machine.
for run in png a4 letter; do
	req=$(page_requests "$WORK/$run.netlog")
	[ -z "$req" ] && pass || fail "$run: the page made requests: $(echo "$req" | head -3)"
	n=$(tcp_attempts "$WORK/$run.netlog")
	[ "$n" = 0 ] && pass || fail "$run: $n TCP connection attempts in the net log"
done

# Control: the same check on a copy with a planted image finds its request,
# and the resolver rule made it fail (ERR_NAME_NOT_RESOLVED, -105).
sed 's|<body>|<body><img src="http://heatloom-probe.invalid/x.png" alt=""/>|' \
	"$WORK/r.html" >"$WORK/leak.html"
browse leak --screenshot="$WORK/leak.png" "file://$WORK/leak.html"
page_requests "$WORK/leak.netlog" | grep -q 'heatloom-probe.invalid' && pass \
	|| fail "control: the net log does not show the planted request"
grep -q '"net_error":-105' "$WORK/leak.netlog" && pass \
	|| fail "control: the planted request did not fail to resolve"
[ "$(tcp_attempts "$WORK/leak.netlog")" = 0 ] && pass || fail "control: a TCP connection was attempted"

finish
