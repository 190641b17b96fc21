/* case_tree.c - the elements of a case file, read into a case.
 *
 * One reader per element of doc/case.rng. Each checks its own attributes
 * through a table (xml_attr.h), its children by name and order, and fills
 * the case; every stream, utility, rule and unit keeps the case file's name
 * and its element's line, so later stages can point back at it.
 */
#include <errno.h>
#include <math.h>
#include <stdarg.h>
#include <stddef.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "case_tree.h"
#include "plausible.h"
#include "tables.h"
#include "xml_attr.h"

#define NELEM(a) (sizeof (a) / sizeof (a)[0])

#define U_T "°C"
#define U_H "kW/(m²·K)"

typedef struct {
	hl_case *c;
	const hl_case_tree_opts *o;
	hl_error *err;
} walk;

static int
is_elem(xmlNodePtr n, const char *name)
{
	return n->type == XML_ELEMENT_NODE && n->ns == NULL &&
	       strcmp((const char *)n->name, name) == 0;
}

static const char *
name_of(xmlNodePtr n)
{
	return (const char *)n->name;
}

static hl_status
fail(walk *w, xmlNodePtr n, hl_status st, const char *fmt, ...)
	__attribute__((format(printf, 4, 5)));

static hl_status
fail(walk *w, xmlNodePtr n, hl_status st, const char *fmt, ...)
{
	char text[HL_ERROR_TEXT];
	va_list ap;

	va_start(ap, fmt);
	vsnprintf(text, sizeof text, fmt, ap);
	va_end(ap);
	return hl_error_set(w->err, st, w->o->file, n ? hl_xattr_line(n) : 0,
			    "%s", text);
}

static hl_status
check(walk *w, xmlNodePtr n, const hl_xattr *spec, size_t nspec)
{
	return hl_xattr_check(n, spec, nspec, w->o->file, w->err);
}

static int
blank(char ch)
{
	return ch == ' ' || ch == '\t' || ch == '\r' || ch == '\n';
}

/* The first words of a text node, on one line, and the line they start on:
 * libxml2 dates a text node by the line where it ends. */
static long
text_start(xmlNodePtr t, char *snip, size_t size)
{
	const char *p = (const char *)t->content;
	long line = hl_xattr_line(t);
	size_t k = 0;
	int gap = 0;

	while (blank(*p))
		p++;
	for (; *p != '\0'; p++) {
		if (*p == '\n')
			line--;
		if (blank(*p)) {
			gap = 1;
			continue;
		}
		if (k + 2 < size) {
			if (gap && k > 0)
				snip[k++] = ' ';
			snip[k++] = *p;
		}
		gap = 0;
	}
	snip[k] = '\0';
	return line;
}

/* Only blanks may sit between the child elements of n. */
static hl_status
check_text(walk *w, xmlNodePtr n)
{
	xmlNodePtr ch;
	char snip[32];

	for (ch = n->children; ch != NULL; ch = ch->next) {
		if (ch->type != XML_TEXT_NODE &&
		    ch->type != XML_CDATA_SECTION_NODE)
			continue;
		if (xmlIsBlankNode(ch))
			continue;
		return hl_error_set(w->err, HL_EINPUT, w->o->file,
			text_start(ch, snip, sizeof snip), "text '%s' inside "
			"<%s>; values belong in attributes (see "
			"doc/case-file.md)", snip, name_of(n));
	}
	return HL_OK;
}

static hl_status
unknown_child(walk *w, xmlNodePtr n, xmlNodePtr ch, const char *holds)
{
	if (ch->ns != NULL)
		return fail(w, ch, HL_EINPUT, "element <%s> in <%s> belongs to "
			"the namespace '%.80s'; case files use no namespace",
			name_of(ch), name_of(n), (const char *)ch->ns->href);
	return fail(w, ch, HL_EINPUT, "unknown element <%s> in <%s>; <%s> "
		"holds %s", name_of(ch), name_of(n), name_of(n), holds);
}

/* An element with attributes only. */
static hl_status
check_leaf(walk *w, xmlNodePtr n, const hl_xattr *spec, size_t nspec)
{
	xmlNodePtr ch;
	hl_status st = check(w, n, spec, nspec);

	if (st == HL_OK)
		st = check_text(w, n);
	for (ch = n->children; st == HL_OK && ch != NULL; ch = ch->next)
		if (ch->type == XML_ELEMENT_NODE)
			st = fail(w, ch, HL_EINPUT, "<%s> takes no child "
				"elements; remove <%s> or move it out",
				name_of(n), name_of(ch));
	return st;
}

static double
num(xmlNodePtr n, const char *name)
{
	return hl_xattr_number(n, name);
}

/* ---- settings ---- */

static const hl_xattr settings_attrs[] = {
	{ "dtmin", HL_XATTR_AMOUNT, 0, "K", NULL },
	{ "emat", HL_XATTR_AMOUNT, 0, "K", NULL },
	{ "hours", HL_XATTR_AMOUNT, 0, "hours per year", NULL },
	{ "h-default", HL_XATTR_AMOUNT, 0, U_H, NULL },
	{ "fmin", HL_XATTR_AMOUNT, 0, NULL, NULL },
	{ "xp", HL_XATTR_AMOUNT, 0, NULL, NULL },
	{ "exchanger", HL_XATTR_CHOICE, 0, NULL, HL_EXCH_TYPE_CHOICES },
	{ "heater-type", HL_XATTR_CHOICE, 0, NULL, HL_EXCH_TYPE_CHOICES },
	{ "cooler-type", HL_XATTR_CHOICE, 0, NULL, HL_EXCH_TYPE_CHOICES },
	{ "interest", HL_XATTR_AMOUNT, 0, NULL, NULL },
	{ "life", HL_XATTR_AMOUNT, 0, "years", NULL },
	{ "cp-tol", HL_XATTR_AMOUNT, 0, NULL, NULL },
	{ "t-tol", HL_XATTR_AMOUNT, 0, "K", NULL },
	{ "time-limit", HL_XATTR_AMOUNT, 0, "s", NULL },
	{ "currency", HL_XATTR_LABEL, 0, NULL, NULL },
};

static const struct {
	const char *name;
	size_t off;
	unsigned bit;
} settings_numbers[] = {
	{ "dtmin", offsetof(hl_settings, dtmin), HL_GIVEN_DTMIN },
	{ "emat", offsetof(hl_settings, emat), HL_GIVEN_EMAT },
	{ "hours", offsetof(hl_settings, hours), HL_GIVEN_HOURS },
	{ "h-default", offsetof(hl_settings, h_default), HL_GIVEN_H_DEFAULT },
	{ "fmin", offsetof(hl_settings, fmin), HL_GIVEN_FMIN },
	{ "xp", offsetof(hl_settings, xp), HL_GIVEN_XP },
	{ "interest", offsetof(hl_settings, interest), HL_GIVEN_INTEREST },
	{ "life", offsetof(hl_settings, life), HL_GIVEN_LIFE },
	{ "cp-tol", offsetof(hl_settings, cp_tol), HL_GIVEN_CP_TOL },
	{ "t-tol", offsetof(hl_settings, t_tol), HL_GIVEN_T_TOL },
	{ "time-limit", offsetof(hl_settings, time_limit),
	  HL_GIVEN_TIME_LIMIT },
};

static hl_status
read_cost(walk *w, xmlNodePtr n)
{
	static const hl_xattr attrs[] = {
		{ "a", HL_XATTR_AMOUNT, 0, "currency", NULL },
		{ "b", HL_XATTR_AMOUNT, 0, NULL, NULL },
		{ "c", HL_XATTR_AMOUNT, 0, NULL, NULL },
		{ "repipe", HL_XATTR_AMOUNT, 0, "currency", NULL },
		{ "new-unit", HL_XATTR_AMOUNT, 0, "currency", NULL },
	};
	hl_settings *s = &w->c->set;
	hl_status st = check_leaf(w, n, attrs, NELEM(attrs));

	if (st != HL_OK)
		return st;
	s->given |= HL_GIVEN_COST;
	if (!isnan(num(n, "a")))
		s->cost_a = num(n, "a");
	if (!isnan(num(n, "b")))
		s->cost_b = num(n, "b");
	if (!isnan(num(n, "c")))
		s->cost_c = num(n, "c");
	s->repipe_cost = num(n, "repipe");
	s->unit_cost = num(n, "new-unit");
	if (!(s->cost_c > 0.0))
		return fail(w, n, HL_EINPUT, "cost exponent c must be > 0 "
			"(cost per shell = a + b·A^c, A in m²)");
	return HL_OK;
}

/* <equipment type=… a b c largest smallest>: one type's law and limits. */
static hl_status
read_equipment(walk *w, xmlNodePtr n)
{
	static const hl_xattr attrs[] = {
		{ "type", HL_XATTR_CHOICE, 1, NULL, HL_EXCH_TYPE_CHOICES },
		{ "a", HL_XATTR_AMOUNT, 0, "currency", NULL },
		{ "b", HL_XATTR_AMOUNT, 0, NULL, NULL },
		{ "c", HL_XATTR_AMOUNT, 0, NULL, NULL },
		{ "largest", HL_XATTR_AMOUNT, 0, NULL, NULL },
		{ "smallest", HL_XATTR_AMOUNT, 0, NULL, NULL },
	};
	hl_exchanger_law *l;
	double a, b, c;
	int ncost;
	hl_status st = check_leaf(w, n, attrs, NELEM(attrs));

	if (st != HL_OK)
		return st;
	l = &w->c->set.law[hl_exchanger_type_parse(hl_xattr_text(n, "type"))];
	if (l->given != 0)
		return fail(w, n, HL_EINPUT, "a second <equipment type=\"%s\">"
			"; give each type once", hl_xattr_text(n, "type"));
	a = num(n, "a");
	b = num(n, "b");
	c = num(n, "c");
	ncost = !isnan(a) + !isnan(b) + !isnan(c);
	if (ncost != 0 && ncost != 3)
		return fail(w, n, HL_EINPUT, "give all three of a, b, c (cost "
			"of one shell a + b·X^c) or none");
	if (ncost == 3) {
		l->a = a;
		l->b = b;
		l->c = c;
		l->given |= HL_LAW_COST;
	}
	if (!isnan(num(n, "largest"))) {
		l->largest = num(n, "largest");
		l->given |= HL_LAW_LARGEST;
	}
	if (!isnan(num(n, "smallest"))) {
		l->smallest = num(n, "smallest");
		l->given |= HL_LAW_SMALLEST;
	}
	if (!(l->largest > l->smallest) || (ncost == 3 && !(c > 0.0)))
		return fail(w, n, HL_EINPUT, "largest must be above smallest "
			"and c > 0");
	return HL_OK;
}

static hl_status
read_plant_areas(walk *w, xmlNodePtr n)
{
	static const hl_xattr attrs[] = {
		{ "policy", HL_XATTR_CHOICE, 1, NULL,
		  "allow|forbid|penalise" },
		{ "penalty", HL_XATTR_AMOUNT, 0, NULL, NULL },
	};
	hl_settings *s = &w->c->set;
	const char *p;
	hl_status st = check_leaf(w, n, attrs, NELEM(attrs));

	if (st != HL_OK)
		return st;
	p = hl_xattr_text(n, "policy");
	s->area_policy = strcmp(p, "forbid") == 0 ? HL_AREAS_FORBID :
			 strcmp(p, "penalise") == 0 ? HL_AREAS_PENALISE :
			 HL_AREAS_ALLOW;
	if (isnan(num(n, "penalty")))
		return HL_OK;
	if (s->area_policy != HL_AREAS_PENALISE)
		return fail(w, n, HL_EINPUT, "a penalty applies only with "
			"policy=\"penalise\"; remove it or change the policy");
	s->area_penalty = num(n, "penalty");
	return HL_OK;
}

/* The most shells a case may allow (exchanger.h's bound). */
#define HL_EXCHANGER_MAX_SHELLS_CASE 50

static hl_status
add_nosplit(walk *w, xmlNodePtr n)
{
	static const hl_xattr attrs[] = {
		{ "stream", HL_XATTR_LABEL, 1, NULL, NULL },
	};
	hl_case *c = w->c;
	char **a;
	long *l;
	hl_status st = check_leaf(w, n, attrs, NELEM(attrs));

	if (st != HL_OK)
		return st;
	a = realloc(c->nosplit, (c->nnosplit + 1) * sizeof *a);
	if (a == NULL)
		return hl_error_nomem(w->err);
	c->nosplit = a;
	l = realloc(c->nosplit_line, (c->nnosplit + 1) * sizeof *l);
	if (l == NULL)
		return hl_error_nomem(w->err);
	c->nosplit_line = l;
	if ((a[c->nnosplit] = strdup(hl_xattr_text(n, "stream"))) == NULL)
		return hl_error_nomem(w->err);
	l[c->nnosplit++] = hl_xattr_line(n);
	return HL_OK;
}

/* <design>: the limits of the least-cost design, <no-split> children. */
static hl_status
read_design(walk *w, xmlNodePtr n)
{
	static const hl_xattr attrs[] = {
		{ "no-splits", HL_XATTR_CHOICE, 0, NULL, "yes|no" },
		{ "max-branches", HL_XATTR_COUNT, 0, NULL, NULL },
		{ "max-shells", HL_XATTR_COUNT, 0, NULL, NULL },
		{ "min-duty", HL_XATTR_AMOUNT, 0, "kW", NULL },
		{ "min-area", HL_XATTR_AMOUNT, 0, "m²", NULL },
	};
	hl_settings *s = &w->c->set;
	const char *ns;
	xmlNodePtr ch;
	hl_status st = check(w, n, attrs, NELEM(attrs));

	if (st == HL_OK)
		st = check_text(w, n);
	if (st != HL_OK)
		return st;
	ns = hl_xattr_text(n, "no-splits");
	s->no_splits = ns != NULL && strcmp(ns, "yes") == 0;
	if (!isnan(num(n, "max-branches")))
		s->max_branches = (int)num(n, "max-branches");
	if (!isnan(num(n, "max-shells")))
		s->max_shells = (int)num(n, "max-shells");
	if (!isnan(num(n, "min-duty"))) {
		s->min_duty = num(n, "min-duty");
		s->given |= HL_GIVEN_MIN_DUTY;
	}
	if (!isnan(num(n, "min-area")))
		s->min_area = num(n, "min-area");
	if (s->max_branches == 1)
		return fail(w, n, HL_EINPUT, "max-branches must be at least 2 "
			"(for no splits give no-splits=\"yes\")");
	if (s->max_shells > HL_EXCHANGER_MAX_SHELLS_CASE)
		return fail(w, n, HL_EINPUT, "max-shells must be at most %d",
			HL_EXCHANGER_MAX_SHELLS_CASE);
	for (ch = n->children; st == HL_OK && ch != NULL; ch = ch->next) {
		if (ch->type != XML_ELEMENT_NODE)
			continue;
		if (!is_elem(ch, "no-split"))
			return unknown_child(w, n, ch, "<no-split stream=...>");
		st = add_nosplit(w, ch);
	}
	return st;
}

static hl_status
settings_values(walk *w, xmlNodePtr n)
{
	hl_settings *s = &w->c->set;
	const char *cur = hl_xattr_text(n, "currency");
	const char *ex = hl_xattr_text(n, "exchanger");
	size_t i;

	for (i = 0; i < NELEM(settings_numbers); i++) {
		double v = num(n, settings_numbers[i].name);

		if (isnan(v))
			continue;
		*(double *)((char *)s + settings_numbers[i].off) = v;
		s->given |= settings_numbers[i].bit;
	}
	s->given |= (ex != NULL ? HL_GIVEN_EXCHANGER : 0u) |
		    (cur != NULL ? HL_GIVEN_CURRENCY : 0u);
	if (ex != NULL)
		s->exchanger = (hl_exchanger_type)hl_exchanger_type_parse(ex);
	if (hl_xattr_text(n, "heater-type") != NULL)
		s->kind_type[HL_HOT] = hl_exchanger_type_parse(
			hl_xattr_text(n, "heater-type"));
	if (hl_xattr_text(n, "cooler-type") != NULL)
		s->kind_type[HL_COLD] = hl_exchanger_type_parse(
			hl_xattr_text(n, "cooler-type"));
	if (cur != NULL) {
		char *d = strdup(cur);

		if (d == NULL)
			return hl_error_nomem(w->err);
		free(s->currency);
		s->currency = d;
	}
	if (!(s->h_default > 0.0 && s->h_default <= HL_H_MAX))
		return fail(w, n, HL_EINPUT, "h-default must be > 0 and at "
			"most %g " U_H, HL_H_MAX);
	if (!(s->life > 0.0) || !(s->time_limit > 0.0))
		return fail(w, n, HL_EINPUT, "%s must be > 0",
			    s->life > 0.0 ? "time-limit (s)" : "life (years)");
	return HL_OK;
}

static hl_status
read_settings(walk *w, xmlNodePtr n)
{
	xmlNodePtr ch;
	int seen_cost = 0, seen_areas = 0, seen_design = 0;
	hl_status st = check(w, n, settings_attrs, NELEM(settings_attrs));

	if (st == HL_OK)
		st = check_text(w, n);
	if (st == HL_OK)
		st = settings_values(w, n);
	for (ch = n->children; st == HL_OK && ch != NULL; ch = ch->next) {
		int *seen;

		if (ch->type != XML_ELEMENT_NODE)
			continue;
		if (is_elem(ch, "equipment")) {
			st = read_equipment(w, ch);
			continue;
		}
		if (is_elem(ch, "cost"))
			seen = &seen_cost;
		else if (is_elem(ch, "plant-areas"))
			seen = &seen_areas;
		else if (is_elem(ch, "design"))
			seen = &seen_design;
		else
			return unknown_child(w, n, ch, "<cost>, <equipment>, "
				"<plant-areas> and <design>, besides "
				"attributes");
		if (*seen)
			return fail(w, ch, HL_EINPUT, "a second <%s> in "
				"<settings>; give it once", name_of(ch));
		*seen = 1;
		st = seen == &seen_cost ? read_cost(w, ch) :
		    seen == &seen_design ? read_design(w, ch) :
		    read_plant_areas(w, ch);
	}
	return st;
}

/* ---- streams ---- */

static const hl_xattr stream_attrs[] = {
	{ "name", HL_XATTR_LABEL, 1, NULL, NULL },
	{ "kind", HL_XATTR_CHOICE, 0, NULL, "hot|cold" },
	{ "supply", HL_XATTR_NUMBER, 0, U_T, NULL },
	{ "target", HL_XATTR_NUMBER, 0, U_T, NULL },
	{ "cp", HL_XATTR_AMOUNT, 0, "kW/K", NULL },
	{ "duty", HL_XATTR_AMOUNT, 0, "kW", NULL },
	{ "h", HL_XATTR_AMOUNT, 0, U_H, NULL },
	{ "dt-contrib", HL_XATTR_AMOUNT, 0, "K", NULL },
	{ "area", HL_XATTR_LABEL, 0, NULL, NULL },
	{ "cp-tol", HL_XATTR_AMOUNT, 0, NULL, NULL },
	{ "t-tol", HL_XATTR_AMOUNT, 0, "K", NULL },
};

static const hl_xattr segment_attrs[] = {
	{ "supply", HL_XATTR_NUMBER, 1, U_T, NULL },
	{ "target", HL_XATTR_NUMBER, 1, U_T, NULL },
	{ "cp", HL_XATTR_AMOUNT, 0, "kW/K", NULL },
	{ "duty", HL_XATTR_AMOUNT, 0, "kW", NULL },
	{ "h", HL_XATTR_AMOUNT, 0, U_H, NULL },
};

/* One segment from the attributes of n; cp follows from duty when only
 * that is given, and the two must agree when both are. */
static hl_status
read_ends(walk *w, xmlNodePtr n, const char *name, double h, hl_segment *g)
{
	double cp = num(n, "cp"), duty = num(n, "duty"), span;

	memset(g, 0, sizeof *g);
	g->by_duty = isnan(cp);
	g->supply = num(n, "supply");
	g->target = num(n, "target");
	g->h = isnan(num(n, "h")) ? h : num(n, "h");
	g->line = hl_xattr_line(n);
	if (isnan(g->supply) || isnan(g->target))
		return fail(w, n, HL_EINPUT, "stream '%s' needs supply and "
			"target (" U_T "), or <segment> children", name);
	span = fabs(g->supply - g->target);
	if (span == 0.0 && !isnan(cp))
		return fail(w, n, HL_EINPUT, "stream '%s': supply equals target "
			"(%g " U_T "), so cp would be infinite; give the latent "
			"heat as a duty (kW) instead of cp", name, g->supply);
	if (span == 0.0 && !(duty > 0.0))
		return fail(w, n, HL_EINPUT, "stream '%s': supply equals target "
			"(%g " U_T "): give the latent heat as a duty (kW, > 0)",
			name, g->supply);
	if (span == 0.0) {
		g->latent = duty;
		return HL_OK;
	}
	if (!isnan(duty) && !(duty > 0.0))
		return fail(w, n, HL_EINPUT, "stream '%s': duty must be > 0 kW",
			    name);
	if (!isnan(cp) && !(cp > 0.0))
		return fail(w, n, HL_EINPUT, "stream '%s': cp must be > 0 kW/K",
			    name);
	if (isnan(cp) && isnan(duty))
		return fail(w, n, HL_EINPUT, "stream '%s': give cp (kW/K) or "
			"duty (kW)", name);
	if (isnan(cp))
		cp = duty / span;
	else if (!isnan(duty) && fabs(cp * span - duty) > 1e-6 * duty)
		return fail(w, n, HL_EINPUT, "stream '%s': cp %g kW/K over %g K "
			"is %g kW, but duty says %g kW; give one of them or make "
			"them agree", name, cp, span, cp * span, duty);
	g->cp = cp;
	hl_doubt_htc(w->o->file, g->line, "h", g->h);
	if (g->by_duty)
		hl_doubt_duty(w->o->file, g->line, "duty", duty);
	else
		hl_doubt_cp(w->o->file, g->line, "cp", cp, span);
	return HL_OK;
}

/* The <segment> children of a stream, or an error for any other element. */
static hl_status
count_segments(walk *w, xmlNodePtr n, size_t *count)
{
	xmlNodePtr ch;

	*count = 0;
	for (ch = n->children; ch != NULL; ch = ch->next) {
		if (ch->type != XML_ELEMENT_NODE)
			continue;
		if (!is_elem(ch, "segment"))
			return unknown_child(w, n, ch, "<segment> elements "
				"only");
		(*count)++;
	}
	return HL_OK;
}

static hl_status
read_segments(walk *w, xmlNodePtr n, hl_stream *s)
{
	static const char *const ends[] = { "supply", "target", "cp", "duty" };
	double h = num(n, "h");
	xmlNodePtr ch;
	size_t i;
	hl_status st = HL_OK;

	for (i = 0; i < NELEM(ends); i++)
		if (hl_xattr_text(n, ends[i]) != NULL)
			return fail(w, n, HL_EINPUT, "stream '%s' has <segment> "
				"children, so '%s' belongs on each segment, not "
				"on <stream>", s->name, ends[i]);
	for (ch = n->children, i = 0; ch != NULL && st == HL_OK;
	     ch = ch->next) {
		if (ch->type != XML_ELEMENT_NODE)
			continue;
		st = check_leaf(w, ch, segment_attrs, NELEM(segment_attrs));
		if (st == HL_OK)
			st = read_ends(w, ch, s->name, h, &s->seg[i++]);
	}
	return st;
}

static hl_status
stream_kind(walk *w, xmlNodePtr n, hl_stream *s)
{
	const char *k = hl_xattr_text(n, "kind");
	const hl_segment *g = &s->seg[0];
	size_t i;

	s->kind = g->supply > g->target ? HL_HOT : HL_COLD;
	/* A stream of latent heat only takes its kind from the attribute;
	 * one that starts latent from its first sensible segment. */
	for (i = 0; i < s->nseg && hl_segment_latent(&s->seg[i]); i++)
		;
	if (i < s->nseg)
		s->kind = s->seg[i].supply > s->seg[i].target ? HL_HOT :
			  HL_COLD;
	else if (k == NULL)
		return fail(w, n, HL_EINPUT, "stream '%s' is latent heat at "
			"%g " U_T ": give its kind (hot: condensing, cold: "
			"boiling)", s->name, g->supply);
	else
		s->kind = strcmp(k, "hot") == 0 ? HL_HOT : HL_COLD;
	if (k == NULL || strcmp(k, s->kind == HL_HOT ? "hot" : "cold") == 0)
		return HL_OK;
	return fail(w, n, HL_EINPUT, "stream '%s' is marked %s but runs from "
		"%g to %g " U_T, s->name, k, g->supply, g->target);
}

static hl_status
read_stream(walk *w, xmlNodePtr n)
{
	hl_stream s;
	hl_segment one;
	size_t nseg;
	hl_status st = check(w, n, stream_attrs, NELEM(stream_attrs));

	if (st == HL_OK)
		st = check_text(w, n);
	if (st == HL_OK)
		st = count_segments(w, n, &nseg);
	if (st != HL_OK)
		return st;
	memset(&s, 0, sizeof s);
	s.name = (char *)hl_xattr_text(n, "name");
	s.area = (char *)hl_xattr_text(n, "area");
	s.dt_contrib = num(n, "dt-contrib");
	s.cp_tol = num(n, "cp-tol");
	s.t_tol = num(n, "t-tol");
	s.file = (char *)w->o->file;
	s.line = hl_xattr_line(n);
	s.nseg = nseg ? nseg : 1;
	s.seg = nseg ? calloc(nseg, sizeof *s.seg) : &one;
	if (s.seg == NULL)
		return hl_error_nomem(w->err);
	st = nseg ? read_segments(w, n, &s) :
		    read_ends(w, n, s.name, num(n, "h"), &one);
	if (st == HL_OK)
		st = stream_kind(w, n, &s);
	if (st == HL_OK)
		st = hl_case_add_stream(w->c, &s, w->err);
	if (nseg)
		free(s.seg);
	return st;
}

/* ---- utilities ---- */

static hl_status
read_utility(walk *w, xmlNodePtr n)
{
	static const hl_xattr attrs[] = {
		{ "name", HL_XATTR_LABEL, 1, NULL, NULL },
		{ "kind", HL_XATTR_CHOICE, 1, NULL, "hot|cold" },
		{ "supply", HL_XATTR_NUMBER, 1, U_T, NULL },
		{ "target", HL_XATTR_NUMBER, 1, U_T, NULL },
		{ "price", HL_XATTR_NUMBER, 1, "currency per MWh", NULL },
		{ "h", HL_XATTR_AMOUNT, 0, U_H, NULL },
		{ "max-load", HL_XATTR_AMOUNT, 0, "kW", NULL },
		{ "dt-contrib", HL_XATTR_AMOUNT, 0, "K", NULL },
		{ "type", HL_XATTR_CHOICE, 0, NULL, HL_EXCH_TYPE_CHOICES },
		{ "cost-a", HL_XATTR_AMOUNT, 0, "currency", NULL },
		{ "cost-b", HL_XATTR_AMOUNT, 0, NULL, NULL },
		{ "cost-c", HL_XATTR_AMOUNT, 0, NULL, NULL },
	};
	hl_utility u;
	int ncost;
	hl_status st = check_leaf(w, n, attrs, NELEM(attrs));

	if (st != HL_OK)
		return st;
	memset(&u, 0, sizeof u);
	u.name = (char *)hl_xattr_text(n, "name");
	u.kind = strcmp(hl_xattr_text(n, "kind"), "hot") == 0 ? HL_HOT :
								HL_COLD;
	u.supply = num(n, "supply");
	u.target = num(n, "target");
	u.price = num(n, "price");
	u.h = num(n, "h");
	u.max_load = num(n, "max-load");
	u.dt_contrib = num(n, "dt-contrib");
	u.type = hl_exchanger_type_parse(hl_xattr_text(n, "type"));
	u.type_given = u.type >= 0;
	u.cost_a = num(n, "cost-a");
	u.cost_b = num(n, "cost-b");
	u.cost_c = num(n, "cost-c");
	ncost = !isnan(u.cost_a) + !isnan(u.cost_b) + !isnan(u.cost_c);
	if (ncost != 0 && ncost != 3)
		return fail(w, n, HL_EINPUT, "utility '%s': give all three of "
			"cost-a, cost-b, cost-c or none", u.name);
	u.cost_given = ncost == 3;
	u.file = (char *)w->o->file;
	u.line = hl_xattr_line(n);
	hl_doubt_htc(u.file, u.line, "h", u.h);
	hl_doubt_duty(u.file, u.line, "max-load", u.max_load);
	return hl_case_add_utility(w->c, &u, w->err);
}

/* ---- match rules ---- */

static hl_status
read_rule(walk *w, xmlNodePtr n, hl_rule_kind kind)
{
	static const hl_xattr attrs[] = {
		{ "hot", HL_XATTR_LABEL, 1, NULL, NULL },
		{ "cold", HL_XATTR_LABEL, 1, NULL, NULL },
		{ "reason", HL_XATTR_TEXT, 0, NULL, NULL },
		{ "max-duty", HL_XATTR_AMOUNT, 1, "kW", NULL },
	};
	hl_match_rule r;
	hl_status st;

	/* max-duty belongs to <limit> alone, the last entry of the table. */
	st = check_leaf(w, n, attrs, kind == HL_RULE_MAX_DUTY ? 4 : 3);
	if (st != HL_OK)
		return st;
	memset(&r, 0, sizeof r);
	r.kind = kind;
	r.hot = (char *)hl_xattr_text(n, "hot");
	r.cold = (char *)hl_xattr_text(n, "cold");
	r.reason = (char *)hl_xattr_text(n, "reason");
	if (r.reason != NULL && r.reason[0] == '\0')
		r.reason = NULL;
	r.max_duty = kind == HL_RULE_MAX_DUTY ? num(n, "max-duty") : NAN;
	r.file = (char *)w->o->file;
	r.line = hl_xattr_line(n);
	return hl_case_add_rule(w->c, &r, w->err);
}

/* <exchanger hot cold type>: the type the engineer fixes for a pair. */
static hl_status
read_type_rule(walk *w, xmlNodePtr n)
{
	static const hl_xattr attrs[] = {
		{ "hot", HL_XATTR_LABEL, 1, NULL, NULL },
		{ "cold", HL_XATTR_LABEL, 1, NULL, NULL },
		{ "type", HL_XATTR_CHOICE, 1, NULL, HL_EXCH_TYPE_CHOICES },
		{ "reason", HL_XATTR_TEXT, 0, NULL, NULL },
	};
	hl_type_rule r;
	hl_status st = check_leaf(w, n, attrs, NELEM(attrs));

	if (st != HL_OK)
		return st;
	memset(&r, 0, sizeof r);
	r.hot = (char *)hl_xattr_text(n, "hot");
	r.cold = (char *)hl_xattr_text(n, "cold");
	r.type = (hl_exchanger_type)hl_exchanger_type_parse(
		hl_xattr_text(n, "type"));
	r.file = (char *)w->o->file;
	r.line = hl_xattr_line(n);
	return hl_case_add_type_rule(w->c, &r, w->err);
}

static hl_status
read_matches(walk *w, xmlNodePtr n)
{
	xmlNodePtr ch;
	hl_status st = check(w, n, NULL, 0);

	if (st == HL_OK)
		st = check_text(w, n);
	for (ch = n->children; st == HL_OK && ch != NULL; ch = ch->next) {
		if (ch->type != XML_ELEMENT_NODE)
			continue;
		if (is_elem(ch, "forbid"))
			st = read_rule(w, ch, HL_RULE_FORBID);
		else if (is_elem(ch, "require"))
			st = read_rule(w, ch, HL_RULE_REQUIRE);
		else if (is_elem(ch, "limit"))
			st = read_rule(w, ch, HL_RULE_MAX_DUTY);
		else if (is_elem(ch, "exchanger"))
			st = read_type_rule(w, ch);
		else
			st = unknown_child(w, n, ch, "<forbid>, <require> and "
				"<limit> rules and <exchanger> types");
	}
	return st;
}

/* ---- existing network ---- */

static hl_status
read_unit(walk *w, xmlNodePtr n)
{
	static const hl_xattr attrs[] = {
		{ "name", HL_XATTR_LABEL, 1, NULL, NULL },
		{ "hot", HL_XATTR_LABEL, 1, NULL, NULL },
		{ "cold", HL_XATTR_LABEL, 1, NULL, NULL },
		{ "duty", HL_XATTR_AMOUNT, 1, "kW", NULL },
		{ "hot-in", HL_XATTR_NUMBER, 0, U_T, NULL },
		{ "hot-out", HL_XATTR_NUMBER, 0, U_T, NULL },
		{ "cold-in", HL_XATTR_NUMBER, 0, U_T, NULL },
		{ "cold-out", HL_XATTR_NUMBER, 0, U_T, NULL },
		{ "area", HL_XATTR_AMOUNT, 0, "m²", NULL },
		{ "shells", HL_XATTR_COUNT, 0, NULL, NULL },
		{ "type", HL_XATTR_CHOICE, 0, NULL, HL_EXCH_TYPE_CHOICES },
	};
	hl_unit u;
	hl_status st = check_leaf(w, n, attrs, NELEM(attrs));

	if (st != HL_OK)
		return st;
	memset(&u, 0, sizeof u);
	u.name = (char *)hl_xattr_text(n, "name");
	u.hot = (char *)hl_xattr_text(n, "hot");
	u.cold = (char *)hl_xattr_text(n, "cold");
	u.duty = num(n, "duty");
	u.hot_in = num(n, "hot-in");
	u.hot_out = num(n, "hot-out");
	u.cold_in = num(n, "cold-in");
	u.cold_out = num(n, "cold-out");
	u.area = num(n, "area");
	u.shells = isnan(num(n, "shells")) ? 0 : (int)num(n, "shells");
	u.type = hl_exchanger_type_parse(hl_xattr_text(n, "type"));
	u.type_given = u.type >= 0;
	u.file = (char *)w->o->file;
	u.line = hl_xattr_line(n);
	if (!(u.duty > 0.0))
		return fail(w, n, HL_EINPUT, "unit '%s': duty must be > 0 kW",
			    u.name);
	if (!isnan(u.area) && !(u.area > 0.0))
		return fail(w, n, HL_EINPUT, "unit '%s': area must be > 0 m² "
			"(leave it out when unknown)", u.name);
	return hl_case_add_unit(w->c, &u, w->err);
}

/* ---- blocks that are inline or name a CSV table ---- */

typedef struct {
	const char *child;  /* the inline element */
	const char *table;  /* the CSV table, in messages */
	hl_status (*read_table)(hl_case *, const char *, hl_error *);
	hl_status (*read_child)(walk *, xmlNodePtr);
} block;

static const block streams_block = {
	"stream", "stream table", hl_stream_table_read, read_stream
};
static const block utilities_block = {
	"utility", "utility table", hl_utility_table_read, read_utility
};
static const block network_block = {
	"unit", "network table", hl_network_table_read, read_unit
};

/* A relative path starts from the folder of the case file. */
static char *
resolve(const char *prefix, const char *file)
{
	size_t n = strlen(prefix), m = strlen(file);
	char *p;

	if (file[0] == '/')
		n = 0;
	p = malloc(n + m + 1);
	if (p == NULL)
		return NULL;
	memcpy(p, prefix, n);
	memcpy(p + n, file, m + 1);
	return p;
}

static hl_status
load_table(walk *w, xmlNodePtr n, const block *b, const char *file)
{
	char *path;
	FILE *f;
	hl_status st;

	if (!w->o->load_tables)
		return HL_OK;
	path = resolve(w->o->prefix, file);
	if (path == NULL)
		return hl_error_nomem(w->err);
	f = fopen(path, "rb");
	if (f == NULL) {
		int e = errno;

		st = e == ENOENT ?
			fail(w, n, HL_EINPUT, "%s '%s' not found (looked for "
				"%s); a relative path starts from the case "
				"file's folder", b->table, file, path) :
			fail(w, n, HL_EIO, "cannot open the %s '%s' (%s): %s",
				b->table, file, path, strerror(e));
		free(path);
		return st;
	}
	fclose(f);
	st = b->read_table(w->c, path, w->err);
	free(path);
	return st;
}

static hl_status
read_block(walk *w, xmlNodePtr n, const block *b)
{
	static const hl_xattr attrs[] = {
		{ "file", HL_XATTR_PATH, 0, NULL, NULL },
	};
	const char *file;
	xmlNodePtr ch;
	size_t count = 0;
	hl_status st = check(w, n, attrs, NELEM(attrs));

	if (st == HL_OK)
		st = check_text(w, n);
	for (ch = n->children; st == HL_OK && ch != NULL; ch = ch->next) {
		if (ch->type != XML_ELEMENT_NODE)
			continue;
		if (!is_elem(ch, b->child)) {
			char holds[40];

			snprintf(holds, sizeof holds, "<%s> elements",
				 b->child);
			return unknown_child(w, n, ch, holds);
		}
		count++;
	}
	if (st != HL_OK)
		return st;
	file = hl_xattr_text(n, "file");
	if (file != NULL && count > 0)
		return fail(w, n, HL_EINPUT, "<%s> has a file attribute and "
			"<%s> children; use one or the other", name_of(n),
			b->child);
	if (file != NULL)
		return load_table(w, n, b, file);
	if (count == 0)
		return fail(w, n, HL_EINPUT, "<%s> is empty; give <%s> "
			"children or file=\"NAME.csv\" naming a %s",
			name_of(n), b->child, b->table);
	for (ch = n->children; st == HL_OK && ch != NULL; ch = ch->next)
		if (ch->type == XML_ELEMENT_NODE)
			st = b->read_child(w, ch);
	return st;
}

/* ---- the root ---- */

enum { S_SETTINGS, S_STREAMS, S_UTILITIES, S_MATCHES, S_NETWORK, S_COUNT };

static const char *const sections[S_COUNT] = {
	"settings", "streams", "utilities", "matches", "network"
};

static hl_status
read_section(walk *w, xmlNodePtr n, int k)
{
	switch (k) {
	case S_SETTINGS:
		return read_settings(w, n);
	case S_STREAMS:
		return read_block(w, n, &streams_block);
	case S_UTILITIES:
		return read_block(w, n, &utilities_block);
	case S_MATCHES:
		return read_matches(w, n);
	default:
		return read_block(w, n, &network_block);
	}
}

static int
section_of(xmlNodePtr n)
{
	int k;

	for (k = 0; k < S_COUNT; k++)
		if (is_elem(n, sections[k]))
			return k;
	return -1;
}

static hl_status
read_sections(walk *w, xmlNodePtr root)
{
	int seen[S_COUNT] = { 0 };
	int k, last = -1;
	xmlNodePtr ch;
	hl_status st = HL_OK;

	for (ch = root->children; st == HL_OK && ch != NULL; ch = ch->next) {
		if (ch->type != XML_ELEMENT_NODE)
			continue;
		k = section_of(ch);
		if (k < 0)
			return unknown_child(w, root, ch, "<settings>, "
				"<streams>, <utilities>, <matches> and "
				"<network>, in that order");
		if (k < last)
			return fail(w, ch, HL_EINPUT, "<%s> after <%s>; a case "
				"lists settings, streams, utilities, matches "
				"and network in that order", sections[k],
				sections[last]);
		if (seen[k] && k != S_STREAMS && k != S_UTILITIES)
			return fail(w, ch, HL_EINPUT, "a second <%s>; a case "
				"has at most one, merge them", sections[k]);
		seen[k] = 1;
		last = k;
		st = read_section(w, ch, k);
	}
	if (st == HL_OK && !seen[S_STREAMS])
		st = fail(w, root, HL_EINPUT, "the case has no <streams>; give "
			"the process streams inline or as "
			"<streams file=\"NAME.csv\"/>");
	return st;
}

hl_status
hl_case_tree_read(hl_case *c, xmlDocPtr doc, const hl_case_tree_opts *o,
		  hl_error *err)
{
	static const hl_xattr attrs[] = {
		{ "version", HL_XATTR_LABEL, 1, NULL, NULL },
	};
	walk w = { c, o, err };
	xmlNodePtr root = xmlDocGetRootElement(doc);
	const char *v;
	hl_status st;

	if (root == NULL)
		return hl_error_set(err, HL_EINPUT, o->file, 0, "the document "
			"has no elements; a case file starts with "
			"<case version=\"1\">");
	if (root->ns != NULL)
		return fail(&w, root, HL_EINPUT, "the root element <%s> belongs "
			"to the namespace '%.80s'; case files use no namespace",
			name_of(root), (const char *)root->ns->href);
	if (!is_elem(root, "case"))
		return fail(&w, root, HL_EINPUT, "the root element is <%s>, not "
			"<case>; is this a heatloom case file? (see "
			"doc/case-file.md)", name_of(root));
	st = check(&w, root, attrs, NELEM(attrs));
	if (st != HL_OK)
		return st;
	v = hl_xattr_text(root, "version");
	if (strcmp(v, "1") != 0)
		return fail(&w, root, HL_EINPUT, "case file version '%.20s' is "
			"not supported; this heatloom reads version 1", v);
	st = check_text(&w, root);
	if (st == HL_OK)
		st = read_sections(&w, root);
	return st;
}
