/* report_notes.c - the assumptions (each setting and whether it is the
 * built-in default), the methods with their references, and the caution. */
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "display.h"
#include "report_sec.h"

#define B 96

static int
always(const hl_report_data *d)
{
	(void)d;
	return 1;
}

static const char DEFAULT_TEXT[] = "built-in default";
static const char CASE_TEXT[] = "differs from the default: set for this case";

static const char GIVEN_TEXT[] = "set for this case";
static const char GIVEN_DEFAULT_TEXT[] = "set for this case (the same as "
	"the built-in default)";

/* Where a setting's value comes from: the case file (whether or not it
 * equals the default), or the built-in default. */
static const char *
source_of(const hl_settings *s, unsigned bit, int is_default)
{
	if (s->given & bit)
		return is_default ? GIVEN_DEFAULT_TEXT : GIVEN_TEXT;
	return is_default ? DEFAULT_TEXT : CASE_TEXT;
}

/* A setting that equals its built-in default is named as the default: the
 * reader then knows it was not chosen for the plant. */
static void
setting(hl_report *r, const char *name, const char *value,
	const char *source)
{
	hl_report_row_start(r, strncmp(source, DEFAULT_TEXT,
				       sizeof DEFAULT_TEXT - 1) == 0 ?
			    "default" : NULL);
	hl_report_cell(r, name);
	hl_report_cell(r, value);
	hl_report_cell(r, source);
	hl_report_row_end(r);
}

/* Whether the case uses type t anywhere (settings, utilities, rules,
 * today's units) or sets its law. */
static int
type_used(const hl_case *c, hl_exchanger_type t)
{
	size_t i;

	if (c->set.exchanger == t || c->set.law[t].given != 0 ||
	    c->set.kind_type[HL_HOT] == (int)t ||
	    c->set.kind_type[HL_COLD] == (int)t)
		return 1;
	for (i = 0; i < c->nutil; i++)
		if (hl_utility_type(&c->set, &c->util[i]) == (int)t)
			return 1;
	for (i = 0; i < c->ntyped; i++)
		if (c->typed[i].type == t)
			return 1;
	for (i = 0; i < c->nunit; i++)
		if (c->unit[i].type_given && c->unit[i].type == (int)t)
			return 1;
	return 0;
}

/* A row per exchanger type the case uses beyond shell-and-tube, and per
 * utility with its own cost law. */
static void
type_laws(hl_report *r, const hl_settings *s)
{
	const hl_case *c = r->d->c;
	char v[300], name[B];
	size_t i;
	int t;

	for (t = HL_EXCH_COUNTERFLOW; t < HL_EXCH_NTYPES; t++) {
		if (!type_used(c, (hl_exchanger_type)t))
			continue;
		hl_exchanger_law_text(s, (hl_exchanger_type)t, v, sizeof v);
		/* The source column says where the law comes from. */
		if (strrchr(v, '(') != NULL && strrchr(v, '(') > v)
			strrchr(v, '(')[-1] = '\0';
		snprintf(name, B, "Cost law, %s",
			 hl_exchanger_type_name((hl_exchanger_type)t));
		setting(r, name, strchr(v, ':') != NULL ? strchr(v, ':') + 2 :
			v, hl_exchanger_law_illustrative(s,
			(hl_exchanger_type)t) ? "built-in default: "
			"illustrative, not a price" : CASE_TEXT);
	}
	for (i = 0; i < c->nutil; i++) {
		const hl_utility *u = &c->util[i];

		if (!u->cost_given && hl_utility_type(s, u) < 0)
			continue;
		snprintf(name, B, "Units on %s", u->name);
		if (u->cost_given)
			snprintf(v, sizeof v, "%s, %g + %g·X^%g each",
				 hl_exchanger_type_name(hl_utility_type(s, u) >=
				 0 ? (hl_exchanger_type)hl_utility_type(s, u) :
				 s->exchanger),
				 u->cost_a, u->cost_b, u->cost_c);
		else
			snprintf(v, sizeof v, "%s",
				 hl_exchanger_type_name((hl_exchanger_type)
				 hl_utility_type(s, u)));
		setting(r, name, v, CASE_TEXT);
	}
}

static void
settings_rows(hl_report *r, const hl_settings *s, const hl_settings *def)
{
	char v[B], a[B];
	int cost_default = s->cost_a == def->cost_a &&
			   s->cost_b == def->cost_b && s->cost_c == def->cost_c;
	const char *cur = hl_report_currency(r->d->c);

	setting(r, "ΔTmin", hl_report_fmt_dt(v, B, s->dtmin),
		r->d->meta.dtmin_from ? r->d->meta.dtmin_from :
		source_of(s, HL_GIVEN_DTMIN, s->dtmin == def->dtmin));
	if (isnan(s->emat))
		setting(r, "Exchanger minimum approach (EMAT)", "equal to ΔTmin",
			DEFAULT_TEXT);
	else
		setting(r, "Exchanger minimum approach (EMAT)",
			hl_report_fmt_dt(v, B, s->emat), s->given &
			HL_GIVEN_EMAT ? GIVEN_TEXT : CASE_TEXT);
	snprintf(v, B, "%g h/yr", s->hours);
	setting(r, "Operating hours", v, source_of(s, HL_GIVEN_HOURS,
		s->hours == def->hours));
	snprintf(v, B, "%.4g %s", hl_show_h(s->h_default), HL_SYM_H);
	setting(r, "Film coefficient where none is given", v,
		source_of(s, HL_GIVEN_H_DEFAULT,
			  s->h_default == def->h_default));
	setting(r, "Exchanger type", s->exchanger == HL_EXCH_SHELL_TUBE ?
		"shell-and-tube, one shell pass, 2, 4, … tube passes" :
		hl_exchanger_type_name(s->exchanger),
		source_of(s, HL_GIVEN_EXCHANGER,
		s->exchanger == def->exchanger));
	snprintf(v, B, "%.2f", s->fmin);
	setting(r, "F floor per shell", v, source_of(s, HL_GIVEN_FMIN,
		s->fmin == def->fmin));
	snprintf(v, B, "%.2f of the maximum P", s->xp);
	setting(r, "Xp rule", v, source_of(s, HL_GIVEN_XP,
		s->xp == def->xp));
	snprintf(v, B, "%g + %g·A^%g %s per shell, A in m²", s->cost_a,
		 s->cost_b, s->cost_c, cur);
	setting(r, "Exchanger cost law", v, s->given & HL_GIVEN_COST ?
		GIVEN_TEXT : cost_default ?
		"built-in default: illustrative, not a price" : CASE_TEXT);
	type_laws(r, s);
	snprintf(v, B, "%g %% a year", 100.0 * s->interest);
	setting(r, "Interest rate", v, source_of(s, HL_GIVEN_INTEREST,
		s->interest == def->interest));
	snprintf(v, B, "%g years", s->life);
	setting(r, "Plant life", v, source_of(s, HL_GIVEN_LIFE,
		s->life == def->life));
	snprintf(v, B, "±%g %%", 100.0 * s->cp_tol);
	setting(r, "cp and duty tolerance", v,
		source_of(s, HL_GIVEN_CP_TOL, s->cp_tol == def->cp_tol));
	snprintf(v, B, "±%s", hl_report_fmt_dt(a, sizeof a, s->t_tol));
	setting(r, "Temperature tolerance", v,
		source_of(s, HL_GIVEN_T_TOL, s->t_tol == def->t_tol));
	setting(r, "Currency", *cur ? cur : "none", source_of(s,
		HL_GIVEN_CURRENCY, strcmp(cur, "EUR") == 0));
}

static size_t
defaulted_h(const hl_case *c)
{
	size_t i, k, n = 0;

	for (i = 0; i < c->nstream; i++)
		for (k = 0; k < c->stream[i].nseg; k++)
			if (isnan(c->stream[i].seg[k].h)) {
				n++;
				break;
			}
	for (i = 0; i < c->nutil; i++)
		n += isnan(c->util[i].h) != 0;
	return n;
}

static void
write_assumptions(hl_report *r)
{
	static const char *const head[] = { "Setting", "Value", "Source" };
	const hl_case *c = r->d->c;
	hl_settings def;
	size_t nh = defaulted_h(c);

	hl_settings_default(&def);
	hl_report_para(r, "Every result rests on the settings below. A value "
		       "that equals heatloom's built-in default is named so: "
		       "it is a general starting value that may not have been "
		       "chosen for this plant. Confirm it, or replace it with "
		       "the site's own where it matters (the cost law above "
		       "all).");
	hl_report_table_start(r, "data settings", "Settings of the study.", 3,
			      head, NULL, NULL);
	settings_rows(r, &c->set, &def);
	hl_report_table_end(r);
	if (nh > 0) {
		hl_html_start(r->h, "p", NULL);
		hl_html_textf(r->h, "%zu stream%s or utilit%s give%s no film "
			      "coefficient; the area targets use %.4g %s "
			      "for %s.", nh, nh == 1 ? "" : "s",
			      nh == 1 ? "y" : "ies", nh == 1 ? "s" : "",
			      hl_show_h(c->set.h_default), HL_SYM_H,
			      nh == 1 ? "it" : "them");
		hl_html_end(r->h);
	}
	hl_html_elem(r->h, "h3", NULL, "Assumptions of the methods");
	hl_html_start(r->h, "ul", NULL);
	hl_html_elem(r->h, "li", NULL, "Each segment of a stream has a "
		     "constant cp; a stream whose cp changes with temperature "
		     "is given as several segments.");
	hl_html_elem(r->h, "li", NULL, "Streams shift by their ΔT contribution, "
		     "ΔTmin/2 unless the table gives one, so that every match "
		     "keeps at least ΔTmin between its hot and cold sides.");
	hl_html_elem(r->h, "li", NULL, "Film coefficients include fouling; "
		     "U follows from 1/U = 1/h_hot + 1/h_cold, the wall "
		     "neglected.");
	hl_html_elem(r->h, "li", NULL, "The area target assumes vertical heat "
		     "transfer between the balanced composite curves (a "
		     "minimum only when all film coefficients are equal); the "
		     "shell-and-tube target divides each interval's area by "
		     "the F of its shells.");
	hl_html_elem(r->h, "li", NULL, "Capital is the cost law per shell with "
		     "the area spread evenly over the shells, annualised by the "
		     "capital recovery factor; piping, pumping, civil work, "
		     "controls and downtime are not included.");
	hl_html_elem(r->h, "li", NULL, "Energy cost is price × load × "
		     "operating hours; utility prices are taken as constant.");
	if (c->nrule > 0)
		hl_html_elem(r->h, "li", NULL, "Match rules of the case "
			     "(forbidden, required or limited pairs, listed "
			     "with the data) do not change the energy targets; "
			     "they bind the design of the network.");
	hl_html_end(r->h);
}

const hl_report_section hl_report_sec_assumptions = {
	"assumptions", "Assumptions", always, write_assumptions
};

/* ---------------------------------------------------------------------- */

typedef struct {
	const char *use;       /* what the method does in this report */
	const char *ref;       /* the reference */
	int needs;             /* the stage it needs: NEED_* */
} method;

enum { NEED_NONE = 0, NEED_AUDIT = 1, NEED_MATCHES = 2, NEED_NETWORK = 3 };

static int
method_shown(const method *m, const hl_report_data *d)
{
	return m->needs == NEED_NONE ||
	       (m->needs == NEED_AUDIT && d->audit != NULL) ||
	       (m->needs == NEED_MATCHES && d->mr != NULL) ||
	       (m->needs == NEED_NETWORK && d->net != NULL);
}

static const method methods[] = {
	{ "Energy targets and pinch: the problem table on shifted "
	  "temperatures.",
	  "Linnhoff, B. & Flower, J. R. (1978). Synthesis of heat exchanger "
	  "networks: I. Systematic generation of energy optimal networks. "
	  "AIChE Journal 24(4), 633–642.", 0 },
	{ "Composite and grand composite curves, threshold problems, the "
	  "pinch rules.",
	  "Linnhoff, B. et al. (1982). A User Guide on Process Integration "
	  "for the Efficient Use of Energy. IChemE, Rugby.", 0 },
	{ "Utility levels at least cost: the transshipment linear program, "
	  "solved with GLPK.",
	  "Papoulias, S. A. & Grossmann, I. E. (1983). A structural "
	  "optimization approach in process synthesis – II: Heat recovery "
	  "networks. Computers & Chemical Engineering 7(6), 707–721.", 0 },
	{ "Area target: vertical heat transfer over the enthalpy intervals of "
	  "the balanced composite curves.",
	  "Townsend, D. W. & Linnhoff, B. (1984). Surface area targets for "
	  "heat exchanger networks. IChemE Annual Research Meeting, Bath.", 0 },
	{ "F correction of one shell pass with 2, 4, … tube passes.",
	  "Bowman, R. A., Mueller, A. C. & Nagle, W. M. (1940). Mean "
	  "temperature difference in design. Transactions of the ASME 62, "
	  "283–294.", 0 },
	{ "Shells in series by the Xp rule; the shell target.",
	  "Ahmad, S., Linnhoff, B. & Smith, R. (1988). Design of multipass "
	  "heat exchangers: an alternative approach. Journal of Heat "
	  "Transfer 110, 304–309; Ahmad, S. & Smith, R. (1989), Transactions "
	  "of the IChemE 67A.", 0 },
	{ "Units target: N − 1 in each subnetwork between pinches.",
	  "Hohmann, E. C. (1971). Optimum networks for heat exchange. PhD "
	  "thesis, University of Southern California.", 0 },
	{ "Capital annualised by the capital recovery factor "
	  "i(1+i)^n / ((1+i)^n − 1).",
	  "The standard annuity formula of engineering economics.", 0 },
	{ "Optimum ΔTmin: the best grid point refined by golden-section "
	  "search.",
	  "Kiefer, J. (1953). Sequential minimax search for a maximum. "
	  "Proceedings of the American Mathematical Society 4, 502–506.", 0 },
	{ "Sensitivity: exact one-sided derivatives of the targets from the "
	  "active pinch of the problem table; bands re-solved at the corners "
	  "of the tolerance box.",
	  "heatloom's own method on the problem table of Linnhoff & Flower "
	  "(1978), described in doc/methods.md of its source.", 0 },
	{ "Audit: each kW across the pinch costs a kW of heating and of "
	  "cooling; the pinch rules of today's units.",
	  "Linnhoff, B. et al. (1982), as above.", NEED_AUDIT },
	{ "Area efficiency α of today's network and the retrofit at constant "
	  "α.",
	  "Tjoe, T. N. & Linnhoff, B. (1986). Using pinch technology for "
	  "process retrofit. Chemical Engineering 93, 47–60.", NEED_AUDIT },
	{ "Fewest units and the duty of every match: the expanded "
	  "transshipment MILP per subnetwork between pinches, solved with "
	  "GLPK.",
	  "Papoulias, S. A. & Grossmann, I. E. (1983), as above.",
	  NEED_MATCHES },
	{ "The network: matches in temperature order on each stream, stream "
	  "splits where series would break the approach, the tick-off and "
	  "cp rules near the pinch.",
	  "Linnhoff, B. & Hindmarsh, E. (1983). The pinch design method for "
	  "heat exchanger networks. Chemical Engineering Science 38(5), "
	  "745–763; heatloom's placement search is described in "
	  "doc/methods.md of its source.", NEED_NETWORK },
	{ "Each exchanger: U from the film coefficients, the logarithmic "
	  "mean temperature difference, F and shells as above, area "
	  "Q / (U·F·LMTD).",
	  "Kern, D. Q. (1950). Process Heat Transfer. McGraw-Hill.",
	  NEED_NETWORK },
};

static void
write_methods(hl_report *r)
{
	size_t i;

	hl_report_para(r, "Published methods, each with the part of the report "
		       "it produces. The numbers of this report are those of "
		       "heatloom's XML results for the same case and "
		       "settings, rounded for reading.");
	hl_html_start(r->h, "ol", "methods");
	for (i = 0; i < sizeof methods / sizeof methods[0]; i++) {
		if (!method_shown(&methods[i], r->d))
			continue;
		hl_html_start(r->h, "li", NULL);
		hl_html_elem(r->h, "span", "use", methods[i].use);
		hl_html_text(r->h, " ");
		hl_html_elem(r->h, "span", "ref", methods[i].ref);
		hl_html_end(r->h);
	}
	hl_html_end(r->h);
}

const hl_report_section hl_report_sec_methods = {
	"methods", "Methods and references", always, write_methods
};

/* ---------------------------------------------------------------------- */

static void
write_caution(hl_report *r)
{
	hl_html_start(r->h, "div", "caution");
	hl_html_elem(r->h, "p", NULL, r->d->meta.caution);
	hl_html_end(r->h);
	hl_html_start(r->h, "ul", NULL);
	hl_html_elem(r->h, "li", NULL, "The figures of this report are targets "
		     "and screening estimates for comparing options, not a "
		     "design and not a quotation.");
	hl_html_elem(r->h, "li", NULL, "They are only as good as the stream "
		     "data: measure the data that the sensitivity ranking puts "
		     "first before a decision rests on them.");
	hl_html_elem(r->h, "li", NULL, "Before any exchanger is bought or a "
		     "stream is re-routed: detailed thermal and hydraulic "
		     "design, mechanical design to the pressure equipment codes "
		     "that apply, and a safety review of every match (leaks "
		     "between incompatible streams, fouling, start-up, "
		     "shut-down and control), by qualified engineers under "
		     "local codes.");
	hl_html_end(r->h);
}

const hl_report_section hl_report_sec_caution = {
	"caution", "Caution", always, write_caution
};
