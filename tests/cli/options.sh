#!/bin/sh
# options.sh - the man page against the option tables: each command's help
# is printed from its table (src/cmd/options.c), so every option a command
# takes must have its entry in doc/heatloom.1's OPTIONS, and an entry that
# names its commands, "(design, report)", must name exactly those that take
# it.
. "$TOP_SRCDIR/tests/cli/lib.sh"

MAN="$TOP_SRCDIR/doc/heatloom.1"
COMMANDS="targets size curves sweep audit retrofit matches design check report"

# The long options of one command, one a line, from `heatloom help CMD`.
help_options() {
	hl help "$1" | sed -n '/^Options:/,/^$/p' | grep '^  -' |
		sed -e 's/^  //' -e 's/  .*//' | grep -oE -- '--[a-z][a-z-]*' |
		sort -u
}

# The OPTIONS entries of the man page, one line each: the options of the
# entry's tag, then "|", then the commands of its "(cmd, cmd)" line if any.
man_entries() {
	sed -n '/^\.SH OPTIONS/,/^\.SH FILES/p' "$MAN" | sed 's/\\-/-/g' |
	awk '
	/^\.TP/ { tag = 1; next }
	tag == 1 { opts = $0; tag = 2; next }
	tag == 2 {
		cmds = ""
		if ($0 ~ /^\.RB \(/) { cmds = $0; gsub(/^\.RB|[(),"]/, "", cmds) }
		n = split(opts, w, /[^-a-z]+/); line = ""
		for (i = 1; i <= n; i++) if (w[i] ~ /^--[a-z]/) line = line " " w[i]
		print line " |" cmds
		tag = 0
	}'
}

man_entries >"$WORK/entries"
: >"$WORK/all"
for c in $COMMANDS; do
	check_exit 0 hl help "$c"
	help_options "$c" >"$WORK/opts.$c"
	[ -s "$WORK/opts.$c" ] && pass || fail "no options in 'help $c'"
	check_exit 0 hl "$c" --help
	hl help "$c" | cmp -s - "$WORK/stdout" && pass ||
		fail "'help $c' and '$c --help' differ"
	grep -qE "^\.BI? \"?$c " "$MAN" && pass ||
		fail "doc/heatloom.1 has no COMMANDS entry for $c"
	while read -r o; do
		echo "$o $c" >>"$WORK/all"
		line=$(grep -e " $o " "$WORK/entries" | head -1)
		if [ -z "$line" ]; then
			fail "$c $o: no entry in doc/heatloom.1 OPTIONS"
			continue
		fi
		pass
		cmds=${line#*|}
		if [ -n "$cmds" ]; then
			case " $cmds " in
			*" $c "*) pass ;;
			*) fail "$c $o: the man page gives it to ($cmds) only" ;;
			esac
		fi
	done <"$WORK/opts.$c"
done

# Each man entry is taken by some command, and by every command it names.
while IFS='|' read -r opts cmds; do
	for o in $opts; do
		grep -q -e "^$o " "$WORK/all" && pass ||
			fail "doc/heatloom.1 OPTIONS has $o, which no command takes"
		for c in $cmds; do
			grep -qx -e "$o $c" "$WORK/all" && pass ||
				fail "doc/heatloom.1 gives $o to $c, which does not take it"
		done
	done
done <"$WORK/entries"
finish
