#!/bin/sh
# png.sh - a chart converts to PNG with rsvg-convert (Debian librsvg2-bin),
# so a chart that only an XML parser accepts still fails the build.
. "$TOP_SRCDIR/tests/cli/lib.sh"

if [ -z "${RSVG_CONVERT:-}" ]; then
	echo "SKIP: rsvg-convert not found (Debian package librsvg2-bin)"
	exit 77
fi

check_exit 0 hl curves "$CASES/demo-streams.csv" --utilities "$CASES/demo-utilities.csv" -o "$WORK/c"
for f in composite grand-composite; do
	check_exit 0 "$RSVG_CONVERT" -d 96 -p 96 -o "$WORK/$f.png" "$WORK/c/$f.svg"
	# A PNG signature and the chart's size: 170 mm at 96 dpi is 642 px.
	[ "$(head -c 8 "$WORK/$f.png" | od -An -tx1 | tr -d ' \n')" = 89504e470d0a1a0a ] \
		&& pass || fail "$f.png is not a PNG"
	w=$(od -An -tu1 -j16 -N4 "$WORK/$f.png" | awk '{ print $1 * 16777216 + $2 * 65536 + $3 * 256 + $4 }')
	[ "$w" -ge 640 ] && [ "$w" -le 644 ] && pass || fail "$f.png is $w px wide"
done
finish
