/* match_dat.c - write the data of a matches problem for transship.mod.
 *
 * Usage: match_dat FILE [DTMIN]. FILE is a stream table or case file; the
 * implicit utilities stand at the problem-table targets (as `heatloom
 * matches` without a utility table). Prints GNU MathProg data on standard
 * output: the subnetworks (first and last interval), the hot and cold
 * parties, and the heat of each party in each interval, as heatloom's
 * hl_match_prepare found them, so that glpsol solves the same problem.
 * Forbidden pairs are written; required pairs and duty limits are refused
 * (transship.mod has no rows for them).
 */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>

#include "case_load.h"
#include "match_int.h"

/* A MathProg symbol: the party's name in single quotes, quotes doubled. */
static void
sym(const char *s)
{
	putchar('\'');
	for (; *s != '\0'; s++) {
		if (*s == '\'')
			putchar('\'');
		putchar(*s);
	}
	putchar('\'');
}

/* Heat of party i in interval k, with heatloom's tolerance (match_model.c:
 * heat at or below p->tol counts as none). */
static double
heat(const hl_match_problem *p, size_t i, size_t k)
{
	double h = HL_MATCH_HEAT(p, i, k);

	return h > p->tol ? h : 0.0;
}

static void
write_heat(const hl_match_problem *p, const char *param, hl_kind kind)
{
	size_t i, k;

	printf("param %s :=\n", param);
	for (i = 0; i < p->np; i++) {
		if (p->party[i].kind != kind)
			continue;
		for (k = 0; k < p->nint; k++)
			if (heat(p, i, k) > 0.0) {
				putchar(' ');
				sym(p->party[i].name);
				printf(" %zu %.17g\n", k + 1, heat(p, i, k));
			}
	}
	printf(";\n");
}

static void
write_side(const hl_match_problem *p, const char *set, const size_t *idx,
	   size_t n)
{
	size_t a;

	printf("set %s :=", set);
	for (a = 0; a < n; a++) {
		putchar(' ');
		sym(p->party[idx[a]].name);
	}
	printf(";\n");
}

static void
write_pairs(const hl_match_problem *p)
{
	size_t a, b;

	printf("param allowed :=\n");
	for (a = 0; a < p->nhot; a++)
		for (b = 0; b < p->ncold; b++)
			if (!p->pair[HL_MATCH_PAIR(p, a, b)].allowed) {
				putchar(' ');
				sym(p->party[p->hot[a]].name);
				putchar(' ');
				sym(p->party[p->cold[b]].name);
				printf(" 0\n");
			}
	printf(";\nparam cost :=\n");
	for (a = 0; a < p->nhot; a++)
		for (b = 0; b < p->ncold; b++) {
			const hl_match_pair *q = &p->pair[HL_MATCH_PAIR(p, a, b)];

			if (q->allowed && q->cost != 1.0) {
				putchar(' ');
				sym(p->party[p->hot[a]].name);
				putchar(' ');
				sym(p->party[p->cold[b]].name);
				printf(" %.17g\n", q->cost);
			}
		}
	printf(";\n");
}

static int
refuse_rules(const hl_match_problem *p)
{
	size_t pi;

	for (pi = 0; pi < p->nhot * p->ncold; pi++)
		if (p->pair[pi].allowed && (p->pair[pi].required ||
		    !isinf(p->pair[pi].maxduty))) {
			fprintf(stderr, "match_dat: required pairs and duty "
				"limits are not in transship.mod\n");
			return -1;
		}
	return 0;
}

int
main(int argc, char **argv)
{
	hl_case *c;
	hl_match_problem *p;
	hl_error err;
	size_t s;

	if (argc < 2) {
		fprintf(stderr, "usage: match_dat FILE [DTMIN]\n");
		return 1;
	}
	if (hl_case_load(argv[1], NULL, &c, &err) != HL_OK ||
	    hl_case_validate(c, &err) != HL_OK ||
	    hl_match_prepare(c, argc > 2 ? atof(argv[2]) : 10.0, NULL, NULL,
			     NULL, &p, &err) != HL_OK) {
		fprintf(stderr, "match_dat: %s:%ld: %s\n", err.file, err.line,
			err.text);
		return 2;
	}
	if (refuse_rules(p) != 0)
		return 2;
	printf("/* %s: %zu parties, %zu intervals, %zu subnetworks; heat in "
	       "kW (match_dat) */\ndata;\nset S :=", argv[1], p->np, p->nint,
	       p->nsub);
	for (s = 0; s < p->nsub; s++)
		printf(" %zu", s + 1);
	printf(";\nparam first :=");
	for (s = 0; s < p->nsub; s++)
		printf(" %zu %zu", s + 1, p->sub[s].first + 1);
	printf(";\nparam last :=");
	for (s = 0; s < p->nsub; s++)
		printf(" %zu %zu", s + 1, p->sub[s].last + 1);
	printf(";\nparam NK := %zu;\n", p->nint);
	write_side(p, "H", p->hot, p->nhot);
	write_side(p, "C", p->cold, p->ncold);
	write_heat(p, "qh", HL_HOT);
	write_heat(p, "qc", HL_COLD);
	write_pairs(p);
	printf("end;\n");
	hl_match_problem_free(p);
	hl_case_free(c);
	return fflush(stdout) == 0 ? 0 : 4;
}
