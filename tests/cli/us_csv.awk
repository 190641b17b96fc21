# us_csv.awk - compare a CSV written with --units us (file 2) against the
# same output in SI (file 1): every bracketed column converted back with the
# factors of NIST SP 811 (2008), App. B.8 (Btu_IT = 1055.05585262 J exactly,
# ft² = 0.09290304 m², °F interval = 5/9 K), every other field equal.
# Prints the first mismatches; exits 1 on any.
BEGIN {
	FS = ","
	btuh = 1055.05585262 / 3600 / 1000     # kW per Btu/h
	f["°F"] = 5 / 9; o["°F"] = -32 * 5 / 9  # temperature; see dt below
	f["Btu/h"] = btuh
	f["Btu/(h·°F)"] = btuh / (5 / 9)
	f["Btu/(h·ft²·°F)"] = btuh / 0.09290304 / (5 / 9)
	f["ft²"] = 0.09290304
	f["/MMBtu"] = 3.6e9 / 1055.05585262e6
}
function num(s) { return s ~ /^-?[0-9.]+(e[-+]?[0-9]+)?$/ }
FNR == 1 && NR == 1 { next }
NR == FNR { si[FNR] = $0; next }
FNR == 1 {
	for (i = 1; i <= NF; i++) {
		fac[i] = 1; off[i] = 0
		if (match($i, /\[.*\]$/)) {
			u = substr($i, RSTART + 1, RLENGTH - 2)
			if (!(u in f)) { print "unknown unit " u; bad = 1 }
			fac[i] = f[u]
			# A difference (dtmin, lmtd, approach...) has no offset.
			if (u == "°F" && $i !~ /^(dtmin|lmtd|approach|required) /)
				off[i] = o[u]
		}
	}
	next
}
{
	n = split(si[FNR], a, ",")
	if (n != NF) { print FNR ": " n " vs " NF " fields"; bad = 1; next }
	for (i = 1; i <= NF; i++) {
		if (num($i) && num(a[i])) {
			v = $i * fac[i] + off[i]
			d = v - a[i]; if (d < 0) d = -d
			s = a[i] < 0 ? -a[i] : a[i]; if (s < 1) s = 1
			if (d > 1e-9 * s) {
				if (++shown <= 5)
					print FNR ":" i ": " $i " -> " v " vs " a[i]
				bad = 1
			}
		} else if ($i != a[i]) {
			if (++shown <= 5) print FNR ":" i ": '" $i "' vs '" a[i] "'"
			bad = 1
		}
	}
}
END { exit bad }
