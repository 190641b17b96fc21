/* network_read.c - a network read back from XML (network_read.h). */
#include <errno.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include <libxml/parser.h>
#include <libxml/xmlerror.h>

#include "network_read.h"
#include "xml_attr.h"

/* The size a network file may have. */
#define NETWORK_XML_MAX ((size_t)64 << 20)

#define N(x) (sizeof (x) / sizeof (x)[0])

static const hl_xattr network_attr[] = {
	{ "dtmin", HL_XATTR_AMOUNT, 1, "K", NULL },
	{ "emat", HL_XATTR_AMOUNT, 1, "K", NULL },
	{ "exchanger", HL_XATTR_CHOICE, 1, NULL, HL_EXCH_TYPE_CHOICES },
	{ "fmin", HL_XATTR_AMOUNT, 1, NULL, NULL },
	{ "xp", HL_XATTR_AMOUNT, 1, NULL, NULL },
	{ "h-default", HL_XATTR_AMOUNT, 1, "kW/(m²·K)", NULL },
	{ "cost-a", HL_XATTR_AMOUNT, 1, NULL, NULL },
	{ "cost-b", HL_XATTR_AMOUNT, 1, NULL, NULL },
	{ "cost-c", HL_XATTR_AMOUNT, 1, NULL, NULL },
	{ "interest", HL_XATTR_AMOUNT, 1, NULL, NULL },
	{ "life", HL_XATTR_AMOUNT, 1, "years", NULL },
	{ "hours", HL_XATTR_AMOUNT, 1, "h/year", NULL },
	{ "currency", HL_XATTR_LABEL, 0, NULL, NULL },
	{ "hot-target", HL_XATTR_AMOUNT, 1, "kW", NULL },
	{ "cold-target", HL_XATTR_AMOUNT, 1, "kW", NULL },
	{ "hot-utility", HL_XATTR_AMOUNT, 1, "kW", NULL },
	{ "cold-utility", HL_XATTR_AMOUNT, 1, "kW", NULL },
	{ "rule-penalty", HL_XATTR_AMOUNT, 1, "kW", NULL },
	{ "energy-penalty", HL_XATTR_NUMBER, 1, "kW", NULL },
	{ "range-rise", HL_XATTR_AMOUNT, 0, "kW", NULL },
	{ "matches", HL_XATTR_AMOUNT, 1, NULL, NULL },
	{ "units", HL_XATTR_AMOUNT, 1, NULL, NULL },
	{ "splits", HL_XATTR_AMOUNT, 1, NULL, NULL },
	{ "area", HL_XATTR_AMOUNT, 1, "m²", NULL },
	{ "capital-cost", HL_XATTR_AMOUNT, 1, NULL, NULL },
	{ "crf", HL_XATTR_AMOUNT, 1, "1/year", NULL },
	{ "annual-capital-cost", HL_XATTR_AMOUNT, 1, NULL, NULL },
	{ "energy-cost", HL_XATTR_NUMBER, 1, NULL, NULL },
	{ "total-cost", HL_XATTR_NUMBER, 1, NULL, NULL },
};

static const hl_xattr stream_attr[] = {
	{ "name", HL_XATTR_LABEL, 1, NULL, NULL },
	{ "kind", HL_XATTR_CHOICE, 1, NULL, "hot|cold" },
	{ "supply", HL_XATTR_NUMBER, 1, "°C", NULL },
	{ "target", HL_XATTR_NUMBER, 1, "°C", NULL },
	{ "cp", HL_XATTR_AMOUNT, 0, "kW/K", NULL },
	{ "h", HL_XATTR_AMOUNT, 0, "kW/(m²·K)", NULL },
	{ "dt-contrib", HL_XATTR_AMOUNT, 0, "K", NULL },
};

static const hl_xattr segment_attr[] = {
	{ "supply", HL_XATTR_NUMBER, 1, "°C", NULL },
	{ "target", HL_XATTR_NUMBER, 1, "°C", NULL },
	{ "cp", HL_XATTR_AMOUNT, 1, "kW/K", NULL },
	{ "h", HL_XATTR_AMOUNT, 0, "kW/(m²·K)", NULL },
};

static const hl_xattr utility_attr[] = {
	{ "name", HL_XATTR_LABEL, 1, NULL, NULL },
	{ "kind", HL_XATTR_CHOICE, 1, NULL, "hot|cold" },
	{ "supply", HL_XATTR_NUMBER, 1, "°C", NULL },
	{ "target", HL_XATTR_NUMBER, 1, "°C", NULL },
	{ "load", HL_XATTR_AMOUNT, 1, "kW", NULL },
	{ "price", HL_XATTR_NUMBER, 0, "per MWh", NULL },
	{ "h", HL_XATTR_AMOUNT, 0, "kW/(m²·K)", NULL },
	{ "max-load", HL_XATTR_AMOUNT, 0, "kW", NULL },
	{ "dt-contrib", HL_XATTR_AMOUNT, 0, "K", NULL },
	{ "implicit", HL_XATTR_CHOICE, 0, NULL, "yes|no" },
	{ "type", HL_XATTR_CHOICE, 0, NULL, HL_EXCH_TYPE_CHOICES },
	{ "cost-a", HL_XATTR_AMOUNT, 0, NULL, NULL },
	{ "cost-b", HL_XATTR_AMOUNT, 0, NULL, NULL },
	{ "cost-c", HL_XATTR_AMOUNT, 0, NULL, NULL },
};

static const hl_xattr unit_attr[] = {
	{ "id", HL_XATTR_LABEL, 1, NULL, NULL },
	{ "hot", HL_XATTR_LABEL, 1, NULL, NULL },
	{ "cold", HL_XATTR_LABEL, 1, NULL, NULL },
	{ "type", HL_XATTR_CHOICE, 1, NULL, HL_EXCH_TYPE_CHOICES },
	{ "duty", HL_XATTR_NUMBER, 1, "kW", NULL },
	{ "hot-in", HL_XATTR_NUMBER, 1, "°C", NULL },
	{ "hot-out", HL_XATTR_NUMBER, 1, "°C", NULL },
	{ "cold-in", HL_XATTR_NUMBER, 1, "°C", NULL },
	{ "cold-out", HL_XATTR_NUMBER, 1, "°C", NULL },
	{ "hot-share", HL_XATTR_NUMBER, 1, NULL, NULL },
	{ "cold-share", HL_XATTR_NUMBER, 1, NULL, NULL },
	{ "u", HL_XATTR_NUMBER, 1, "kW/(m²·K)", NULL },
	{ "lmtd", HL_XATTR_NUMBER, 1, "K", NULL },
	{ "ft", HL_XATTR_NUMBER, 1, NULL, NULL },
	{ "shells", HL_XATTR_COUNT, 1, NULL, NULL },
	{ "parallel", HL_XATTR_COUNT, 0, NULL, NULL },
	{ "area", HL_XATTR_NUMBER, 1, "m²", NULL },
	{ "area-shell", HL_XATTR_NUMBER, 1, "m²", NULL },
	{ "cost", HL_XATTR_NUMBER, 1, NULL, NULL },
	{ "hot-stage", HL_XATTR_COUNT, 0, NULL, NULL },
	{ "cold-stage", HL_XATTR_COUNT, 0, NULL, NULL },
	{ "approach", HL_XATTR_NUMBER, 0, "K", NULL },
	{ "required", HL_XATTR_NUMBER, 0, "K", NULL },
	{ "match", HL_XATTR_COUNT, 0, NULL, NULL },
	{ "assumed", HL_XATTR_TEXT, 0, NULL, NULL },
	{ "note", HL_XATTR_TEXT, 0, NULL, NULL },
	{ "reuses", HL_XATTR_TEXT, 0, NULL, NULL },
	{ "area-today", HL_XATTR_AMOUNT, 0, "m²", NULL },
	{ "area-added", HL_XATTR_AMOUNT, 0, "m²", NULL },
	{ "shells-added", HL_XATTR_AMOUNT, 0, NULL, NULL },
	{ "duty-today", HL_XATTR_AMOUNT, 0, "kW", NULL },
	{ "duty-added", HL_XATTR_AMOUNT, 0, "kW", NULL },
	{ "warning", HL_XATTR_TEXT, 0, NULL, NULL },
};

static const hl_xattr law_attr[] = {
	{ "type", HL_XATTR_CHOICE, 1, NULL, HL_EXCH_TYPE_CHOICES },
	{ "a", HL_XATTR_AMOUNT, 1, NULL, NULL },
	{ "b", HL_XATTR_AMOUNT, 1, NULL, NULL },
	{ "c", HL_XATTR_AMOUNT, 1, NULL, NULL },
	{ "x", HL_XATTR_CHOICE, 1, NULL, "area|duty" },
	{ "largest", HL_XATTR_AMOUNT, 0, NULL, NULL },
	{ "smallest", HL_XATTR_AMOUNT, 1, NULL, NULL },
	{ "source", HL_XATTR_CHOICE, 1, NULL, "case|illustrative" },
};

static int
is(xmlNodePtr n, const char *name)
{
	return n->type == XML_ELEMENT_NODE &&
	    strcmp((const char *)n->name, name) == 0;
}

static double
num(xmlNodePtr n, const char *name)
{
	return hl_xattr_number(n, name);
}

static hl_status
read_settings(hl_network *net, xmlNodePtr n, const char *file,
	      hl_error *err)
{
	hl_settings *s = &net->set;
	const char *cur;
	hl_status st = hl_xattr_check(n, network_attr, N(network_attr), file,
	    err);

	if (st != HL_OK)
		return st;
	s->dtmin = num(n, "dtmin");
	s->emat = num(n, "emat");
	s->exchanger = (hl_exchanger_type)hl_exchanger_type_parse(
	    hl_xattr_text(n, "exchanger"));
	hl_settings_default_laws(s);
	s->fmin = num(n, "fmin");
	s->xp = num(n, "xp");
	s->h_default = num(n, "h-default");
	s->cost_a = num(n, "cost-a");
	s->cost_b = num(n, "cost-b");
	s->cost_c = num(n, "cost-c");
	s->interest = num(n, "interest");
	s->life = num(n, "life");
	s->hours = num(n, "hours");
	cur = hl_xattr_text(n, "currency");
	free(s->currency);
	s->currency = strdup(cur != NULL ? cur : "");
	if (s->currency == NULL)
		return hl_error_nomem(err);
	net->qh_target = num(n, "hot-target");
	net->qc_target = num(n, "cold-target");
	net->qh = num(n, "hot-utility");
	net->qc = num(n, "cold-utility");
	net->restriction = num(n, "rule-penalty");
	net->penalty = num(n, "energy-penalty");
	net->range_rise = num(n, "range-rise");
	if (isnan(net->range_rise))
		net->range_rise = 0.0;
	net->nmatch = (size_t)num(n, "matches");
	net->nsplit = (size_t)num(n, "splits");
	net->area = num(n, "area");
	net->capital = num(n, "capital-cost");
	net->crf = num(n, "crf");
	net->capital_annual = num(n, "annual-capital-cost");
	net->energy_cost = num(n, "energy-cost");
	net->total_cost = num(n, "total-cost");
	return HL_OK;
}

static hl_status
read_segments(xmlNodePtr n, hl_network_party *p, hl_segment *seg,
	      size_t max, const char *file, hl_error *err)
{
	xmlNodePtr c;
	hl_status st;

	for (c = n->children; c != NULL; c = c->next) {
		if (c->type != XML_ELEMENT_NODE)
			continue;
		if (!is(c, "segment"))
			return hl_error_set(err, HL_EINPUT, file,
			    hl_xattr_line(c), "<stream> holds <segment> "
			    "elements only, not <%s>", (const char *)c->name);
		if (p->nseg == max)
			return hl_error_set(err, HL_EINPUT, file,
			    hl_xattr_line(c), "more than %zu segments in one "
			    "stream", max);
		st = hl_xattr_check(c, segment_attr, N(segment_attr), file,
		    err);
		if (st != HL_OK)
			return st;
		seg[p->nseg].supply = num(c, "supply");
		seg[p->nseg].target = num(c, "target");
		seg[p->nseg].cp = num(c, "cp");
		seg[p->nseg].h = num(c, "h");
		seg[p->nseg].line = hl_xattr_line(c);
		seg[p->nseg].by_duty = 0;
		p->nseg++;
	}
	return HL_OK;
}

#define MAX_SEG 256

/* A process stream: one segment from its own cp, or its <segment>s. */
static hl_status
read_stream(hl_network *net, xmlNodePtr n, const char *file, hl_error *err)
{
	hl_segment seg[MAX_SEG];
	hl_network_party p;
	size_t k;
	hl_status st = hl_xattr_check(n, stream_attr, N(stream_attr), file,
	    err);

	memset(seg, 0, sizeof seg);   /* latent and spread: 0, sensible */
	if (st != HL_OK)
		return st;
	memset(&p, 0, sizeof p);
	p.name = (char *)hl_xattr_text(n, "name");
	p.kind = strcmp(hl_xattr_text(n, "kind"), "hot") == 0 ? HL_HOT :
	    HL_COLD;
	p.supply = num(n, "supply");
	p.target = num(n, "target");
	p.h = NAN;
	p.dt_contrib = num(n, "dt-contrib");
	p.price = p.max_load = NAN;
	p.line = hl_xattr_line(n);
	p.seg = seg;
	st = read_segments(n, &p, seg, MAX_SEG, file, err);
	if (st != HL_OK)
		return st;
	if ((p.nseg == 0) == isnan(num(n, "cp")))
		return hl_error_set(err, HL_EINPUT, file, p.line, "stream "
		    "'%s' needs either a cp or <segment> elements, not both",
		    p.name);
	if (p.nseg == 0) {
		seg[0].supply = p.supply;
		seg[0].target = p.target;
		seg[0].cp = num(n, "cp");
		seg[0].h = num(n, "h");
		seg[0].line = p.line;
		seg[0].by_duty = 0;
		p.nseg = 1;
	} else if (!isnan(num(n, "h"))) {
		return hl_error_set(err, HL_EINPUT, file, p.line, "stream "
		    "'%s' has segments: give h on each segment", p.name);
	}
	if (seg[0].cp <= 0.0 || p.supply == p.target ||
	    (p.kind == HL_HOT) != (p.supply > p.target) ||
	    seg[0].supply != p.supply || seg[p.nseg - 1].target != p.target)
		return hl_error_set(err, HL_EINPUT, file, p.line, "stream "
		    "'%s': a %s stream runs %s from supply to target, its "
		    "segments chained from the supply end, each with cp > 0",
		    p.name, p.kind == HL_HOT ? "hot" : "cold",
		    p.kind == HL_HOT ? "down" : "up");
	for (k = 0, p.load = 0.0; k < p.nseg; k++) {
		if (seg[k].cp <= 0.0 || (k > 0 && seg[k].supply !=
		    seg[k - 1].target) || (p.kind == HL_HOT) !=
		    (seg[k].supply > seg[k].target))
			return hl_error_set(err, HL_EINPUT, file, seg[k].line,
			    "segment %zu of stream '%s' does not continue the "
			    "one before it in the stream's direction, or has "
			    "no cp", k + 1, p.name);
		p.load += seg[k].cp * fabs(seg[k].target - seg[k].supply);
	}
	return hl_network_add_party(net, &p, err);
}

static hl_status
read_utility(hl_network *net, xmlNodePtr n, const char *file, hl_error *err)
{
	hl_network_party p;
	const char *imp;
	hl_status st = hl_xattr_check(n, utility_attr, N(utility_attr), file,
	    err);

	if (st != HL_OK)
		return st;
	memset(&p, 0, sizeof p);
	p.name = (char *)hl_xattr_text(n, "name");
	p.kind = strcmp(hl_xattr_text(n, "kind"), "hot") == 0 ? HL_HOT :
	    HL_COLD;
	p.utility = 1;
	imp = hl_xattr_text(n, "implicit");
	p.implicit = imp != NULL && strcmp(imp, "yes") == 0;
	p.supply = num(n, "supply");
	p.target = num(n, "target");
	p.load = num(n, "load");
	p.price = num(n, "price");
	p.h = num(n, "h");
	p.max_load = num(n, "max-load");
	p.dt_contrib = num(n, "dt-contrib");
	p.type = hl_exchanger_type_parse(hl_xattr_text(n, "type"));
	p.type_given = p.type >= 0;
	if (!p.type_given)
		p.type = HL_EXCH_SHELL_TUBE;
	p.cost_a = num(n, "cost-a");
	p.cost_b = num(n, "cost-b");
	p.cost_c = num(n, "cost-c");
	p.cost_given = !isnan(p.cost_a) && !isnan(p.cost_b) &&
	    !isnan(p.cost_c);
	p.line = hl_xattr_line(n);
	if (p.kind == HL_HOT ? p.target > p.supply : p.target < p.supply)
		return hl_error_set(err, HL_EINPUT, file, p.line, "utility "
		    "'%s': a %s utility's target may not be %s its supply",
		    p.name, p.kind == HL_HOT ? "hot" : "cold",
		    p.kind == HL_HOT ? "above" : "below");
	return hl_network_add_party(net, &p, err);
}

static long
find_party(const hl_network *net, const char *name)
{
	size_t i;

	for (i = 0; i < net->nparty; i++)
		if (strcmp(net->party[i].name, name) == 0)
			return (long)i;
	return -1;
}

/* A held fired heater's rating and the firing bought: without them, a
 * reused one is rated at its duty and nothing is bought. */
static hl_status
read_firing(hl_network_unit *u, xmlNodePtr n, const char *file,
	    hl_error *err)
{
	double today = num(n, "duty-today"), added = num(n, "duty-added");

	if (u->type != HL_EXCH_FIRED_HEATER) {
		if (!isnan(today) || !isnan(added))
			return hl_error_set(err, HL_EINPUT, file,
			    hl_xattr_line(n), "exchanger %s: duty-today and "
			    "duty-added belong to a fired heater only", u->id);
		return HL_OK;
	}
	if (!isnan(today) && u->reuses[0] == '\0')
		return hl_error_set(err, HL_EINPUT, file, hl_xattr_line(n),
		    "exchanger %s: duty-today belongs to a unit that reuses "
		    "one of today's", u->id);
	u->duty_today = !isnan(today) ? today : u->reuses[0] != '\0' ?
	    u->duty : 0.0;
	u->duty_added = isnan(added) ? 0.0 : added;
	return HL_OK;
}

/* A retrofit unit (rfit.h): held hardware with today's and added area. */
static hl_status
read_held(hl_network_unit *u, xmlNodePtr n, const char *file, hl_error *err)
{
	const char *tag = hl_xattr_text(n, "reuses");
	double today = num(n, "area-today"), added = num(n, "area-added");
	double sa = num(n, "shells-added");

	if (tag == NULL && isnan(today) && isnan(added) && isnan(sa)) {
		if (!isnan(num(n, "duty-today")) || !isnan(num(n,
		    "duty-added")))
			return hl_error_set(err, HL_EINPUT, file,
			    hl_xattr_line(n), "exchanger %s: duty-today and "
			    "duty-added belong to a retrofit unit (with "
			    "area-added)", u->id);
		return HL_OK;
	}
	if (isnan(added) || (tag != NULL && isnan(today)) ||
	    (tag == NULL && !isnan(today)))
		return hl_error_set(err, HL_EINPUT, file, hl_xattr_line(n),
		    "exchanger %s: a retrofit unit gives area-added, and "
		    "reuses with area-today (or neither for a new unit)",
		    u->id);
	if (tag != NULL && strlen(tag) >= sizeof u->reuses)
		return hl_error_set(err, HL_EINPUT, file, hl_xattr_line(n),
		    "exchanger %s: reuses '%.40s…' is longer than %zu bytes",
		    u->id, tag, sizeof u->reuses - 1);
	if (!isnan(sa) && sa != floor(sa))
		return hl_error_set(err, HL_EINPUT, file, hl_xattr_line(n),
		    "exchanger %s: shells-added %.6g must be a whole number",
		    u->id, sa);
	u->held = 1;
	snprintf(u->reuses, sizeof u->reuses, "%s", tag != NULL ? tag : "");
	u->area_today = isnan(today) ? 0.0 : today;
	u->area_added = added;
	u->shells_added = isnan(sa) ? 0 : (int)sa;
	return read_firing(u, n, file, err);
}

static hl_status
read_unit(hl_network *net, xmlNodePtr n, const char *file, hl_error *err)
{
	hl_network_unit u;
	const char *id, *as, *note;
	long h, c;
	hl_status st = hl_xattr_check(n, unit_attr, N(unit_attr), file, err);

	if (st != HL_OK)
		return st;
	memset(&u, 0, sizeof u);
	id = hl_xattr_text(n, "id");
	if (strlen(id) >= sizeof u.id)
		return hl_error_set(err, HL_EINPUT, file, hl_xattr_line(n),
		    "exchanger id '%.40s' is longer than %zu characters", id,
		    sizeof u.id - 1);
	snprintf(u.id, sizeof u.id, "%s", id);
	h = find_party(net, hl_xattr_text(n, "hot"));
	c = find_party(net, hl_xattr_text(n, "cold"));
	if (h < 0 || c < 0)
		return hl_error_set(err, HL_EINPUT, file, hl_xattr_line(n),
		    "exchanger %s: no stream or utility '%s' in the network "
		    "(list it before the exchangers)", u.id, h < 0 ?
		    hl_xattr_text(n, "hot") : hl_xattr_text(n, "cold"));
	u.hot = (size_t)h;
	u.cold = (size_t)c;
	u.type = (hl_exchanger_type)hl_exchanger_type_parse(
	    hl_xattr_text(n, "type"));
	u.parallel = isnan(num(n, "parallel")) ? 1 : (int)num(n, "parallel");
	u.duty = num(n, "duty");
	u.hot_in = num(n, "hot-in");
	u.hot_out = num(n, "hot-out");
	u.cold_in = num(n, "cold-in");
	u.cold_out = num(n, "cold-out");
	u.hot_share = num(n, "hot-share");
	u.cold_share = num(n, "cold-share");
	u.u = num(n, "u");
	u.lmtd = num(n, "lmtd");
	u.ft = num(n, "ft");
	u.shells = (int)num(n, "shells");
	u.area = num(n, "area");
	u.area_shell = num(n, "area-shell");
	u.cost = num(n, "cost");
	u.hot_stage = isnan(num(n, "hot-stage")) ? 0 : (int)num(n,
	    "hot-stage");
	u.cold_stage = isnan(num(n, "cold-stage")) ? 0 : (int)num(n,
	    "cold-stage");
	u.approach = num(n, "approach");
	u.required = num(n, "required");
	u.match = isnan(num(n, "match")) ? -1 : (long)num(n, "match") - 1;
	as = hl_xattr_text(n, "assumed");
	if (as != NULL) {
		u.assumed |= strstr(as, "h-hot") ? HL_NETWORK_H_HOT : 0;
		u.assumed |= strstr(as, "h-cold") ? HL_NETWORK_H_COLD : 0;
	}
	st = read_held(&u, n, file, err);
	if (st != HL_OK)
		return st;
	note = hl_xattr_text(n, "note");
	u.note = (char *)note;
	u.line = hl_xattr_line(n);
	if (!net->party[h].utility && u.hot_stage == 0)
		u.hot_stage = -1;
	if (!net->party[c].utility && u.cold_stage == 0)
		u.cold_stage = -1;
	return hl_network_add_unit(net, &u, err);
}

/* The law of one type, as the design used it. */
static hl_status
read_law(hl_network *net, xmlNodePtr n, const char *file, hl_error *err)
{
	hl_exchanger_law *l;
	hl_status st = hl_xattr_check(n, law_attr, N(law_attr), file, err);

	if (st != HL_OK)
		return st;
	l = &net->set.law[hl_exchanger_type_parse(hl_xattr_text(n, "type"))];
	l->a = num(n, "a");
	l->b = num(n, "b");
	l->c = num(n, "c");
	l->largest = isnan(num(n, "largest")) ? HUGE_VAL : num(n, "largest");
	l->smallest = num(n, "smallest");
	l->given = strcmp(hl_xattr_text(n, "source"), "case") == 0 ?
	    HL_LAW_COST | HL_LAW_LARGEST | HL_LAW_SMALLEST : 0;
	if (!(l->c > 0.0 && l->largest > l->smallest))
		return hl_error_set(err, HL_EINPUT, file, hl_xattr_line(n),
		    "<law type=\"%s\">: c must be > 0 and largest above "
		    "smallest", hl_xattr_text(n, "type"));
	return HL_OK;
}

static hl_status
read_network(hl_network *net, xmlNodePtr n, const char *file, hl_error *err)
{
	xmlNodePtr c;
	hl_status st = read_settings(net, n, file, err);

	for (c = n->children; c != NULL && st == HL_OK; c = c->next) {
		if (c->type != XML_ELEMENT_NODE)
			continue;
		if (is(c, "stream"))
			st = read_stream(net, c, file, err);
		else if (is(c, "utility"))
			st = read_utility(net, c, file, err);
		else if (is(c, "exchanger"))
			st = read_unit(net, c, file, err);
		else if (is(c, "law"))
			st = read_law(net, c, file, err);
		else if (is(c, "note")) {
			xmlChar *t = xmlNodeGetContent(c);

			st = hl_network_add_note(net, err, "%s", t ?
			    (const char *)t : "");
			xmlFree(t);
		} else
			st = hl_error_set(err, HL_EINPUT, file,
			    hl_xattr_line(c), "<network> holds <law>, <stream>, "
			    "<utility>, <exchanger> and <note>, not <%s>",
			    (const char *)c->name);
	}
	if (st == HL_OK && net->nparty == 0)
		st = hl_error_set(err, HL_EINPUT, file, hl_xattr_line(n),
		    "the network lists no streams");
	return st;
}

/* libxml2's first message, kept for the error. */
typedef struct {
	int have;
	long line;
	char text[300];
} diag;

static void
on_error(void *data, xmlErrorPtr e)
{
	diag *d = data;
	size_t n;

	if (d->have || e == NULL || e->level < XML_ERR_ERROR)
		return;
	d->have = 1;
	d->line = e->line;
	snprintf(d->text, sizeof d->text, "%s", e->message ? e->message : "");
	n = strlen(d->text);
	while (n > 0 && (d->text[n - 1] == '\n' || d->text[n - 1] == ' '))
		d->text[--n] = '\0';
}

static int
has_doctype(const char *data, size_t len)
{
	size_t i;

	for (i = 0; i + 9 <= len; i++)
		if (data[i] == '<' && memcmp(data + i, "<!DOCTYPE", 9) == 0)
			return 1;
	return 0;
}

static xmlNodePtr
child(xmlNodePtr r, const char *name)
{
	xmlNodePtr c;

	for (c = r != NULL ? r->children : NULL; c != NULL; c = c->next)
		if (is(c, name))
			return c;
	return NULL;
}

/* <network>, <results><network>, or the best proposal's network of
 * <results><retrofit><proposal>. */
static xmlNodePtr
network_node(xmlDocPtr doc)
{
	xmlNodePtr r = xmlDocGetRootElement(doc), c;

	if (r == NULL)
		return NULL;
	if (is(r, "network"))
		return r;
	if (!is(r, "results"))
		return NULL;
	if ((c = child(r, "network")) != NULL)
		return c;
	return child(child(child(r, "retrofit"), "proposal"), "network");
}

hl_status
hl_network_xml_read_mem(const char *name, const char *data, size_t len,
			hl_network **out, hl_error *err)
{
	xmlStructuredErrorFunc old = xmlStructuredError;
	void *old_ctx = xmlStructuredErrorContext;
	diag d = { 0, 0, "" };
	xmlDocPtr doc;
	xmlNodePtr n;
	hl_network *net;
	hl_status st;

	*out = NULL;
	if (len > NETWORK_XML_MAX)
		return hl_error_set(err, HL_EINPUT, name, 0, "the file is too "
		    "large for a network");
	/* A DOCTYPE could declare entities that expand without bound or
	 * read other files: a network file has no use for one. */
	if (has_doctype(data, len))
		return hl_error_set(err, HL_EINPUT, name, 0, "a network file "
		    "may not carry a DOCTYPE: remove it");
	xmlSetStructuredErrorFunc(&d, on_error);
	doc = xmlReadMemory(data, (int)len, name, NULL, XML_PARSE_NONET |
	    XML_PARSE_BIG_LINES);
	xmlSetStructuredErrorFunc(old_ctx, old);
	if (doc == NULL)
		return hl_error_set(err, HL_EINPUT, name, d.line, "not "
		    "well-formed XML: %s", d.have ? d.text : "empty file");
	n = network_node(doc);
	if (n == NULL) {
		xmlFreeDoc(doc);
		return hl_error_set(err, HL_EINPUT, name, 0, "no <network> "
		    "element: give the XML that `heatloom design --format "
		    "xml` writes");
	}
	net = hl_network_create();
	if (net == NULL) {
		xmlFreeDoc(doc);
		return hl_error_nomem(err);
	}
	st = read_network(net, n, name, err);
	if (st == HL_OK && (net->source = strdup(name)) == NULL)
		st = hl_error_nomem(err);
	xmlFreeDoc(doc);
	if (st != HL_OK) {
		hl_network_free(net);
		return st;
	}
	*out = net;
	return HL_OK;
}

hl_status
hl_network_xml_read(const char *path, hl_network **out, hl_error *err)
{
	FILE *f = fopen(path, "rb");
	char *buf = NULL;
	size_t len = 0, cap = 0, n;
	hl_status st;

	*out = NULL;
	if (f == NULL)
		return hl_error_set(err, errno == ENOENT ? HL_EINPUT : HL_EIO,
		    path, 0, "cannot open: %s", strerror(errno));
	for (;;) {
		if (len == cap) {
			char *p;

			cap = cap ? 2 * cap : 65536;
			if (cap > NETWORK_XML_MAX + 65536 ||
			    (p = realloc(buf, cap)) == NULL) {
				free(buf);
				fclose(f);
				return cap > NETWORK_XML_MAX + 65536 ?
				    hl_error_set(err, HL_EINPUT, path, 0, "the "
				    "file is larger than %zu bytes",
				    NETWORK_XML_MAX) : hl_error_nomem(err);
			}
			buf = p;
		}
		n = fread(buf + len, 1, cap - len, f);
		len += n;
		if (n == 0)
			break;
	}
	if (ferror(f)) {
		free(buf);
		fclose(f);
		return hl_error_set(err, HL_EIO, path, 0, "read error");
	}
	fclose(f);
	st = hl_network_xml_read_mem(path, buf, len, out, err);
	free(buf);
	return st;
}
