/* opt_out.c - the least-cost search in words and in XML. */
#include <math.h>
#include <string.h>

#include "display.h"
#include "opt_out.h"
#include "result_xml.h"

static const char *
cur_of(const hl_network *net)
{
	return net->set.currency != NULL ? net->set.currency : "";
}

/* The energy against the targets, in the display units (display.h). */
static void
text_energy(FILE *fp, const hl_network *net)
{
	double d = net->qh - net->qh_target;

	if (fabs(d) < 0.05)
		fprintf(fp, "  energy at the targets of ΔTmin %.1f %s\n",
		    hl_show_dt(net->set.dtmin), HL_SYM_DT);
	else
		fprintf(fp, "  energy %.*f %s %s the targets of ΔTmin %.1f %s "
		    "(hot %.*f %s against %.*f %s): the search found it "
		    "cheaper %s\n", HL_DIG_Q(1), hl_show_q(fabs(d)), HL_SYM_Q,
		    d > 0 ? "above" : "below", hl_show_dt(net->set.dtmin),
		    HL_SYM_DT, HL_DIG_Q(1), hl_show_q(net->qh), HL_SYM_Q,
		    HL_DIG_Q(1), hl_show_q(net->qh_target), HL_SYM_Q, d > 0 ?
		    "to buy this energy than the area to save it" :
		    "to recover this heat with approaches below ΔTmin "
		    "(down to EMAT)");
}

/* Units of party p in stage `stage`. */
static int
stage_units(const hl_network *net, size_t p, int stage, size_t before)
{
	size_t j;
	int n = 0;

	for (j = 0; j < net->nunit && j < before; j++) {
		const hl_network_unit *v = &net->unit[j];

		if ((v->hot == p && v->hot_stage == stage) ||
		    (v->cold == p && v->cold_stage == stage))
			n++;
	}
	return n;
}

static void
text_split(FILE *fp, const hl_network *net, size_t p, int stage)
{
	int n = stage_units(net, p, stage, net->nunit);
	size_t j;

	fprintf(fp, "  split: %s, stage %d, %d branches (", net->party[p].name,
	    stage, n);
	for (j = 0; j < net->nunit; j++) {
		const hl_network_unit *v = &net->unit[j];

		if ((v->hot == p && v->hot_stage == stage) ||
		    (v->cold == p && v->cold_stage == stage))
			fprintf(fp, "%s %.0f %%%s", v->id, 100.0 * (v->hot == p ?
			    v->hot_share : v->cold_share), --n > 0 ? ", " : "");
	}
	fprintf(fp, ")\n");
}

static void
text_splits(FILE *fp, const hl_network *net)
{
	size_t i;

	for (i = 0; i < net->nunit; i++) {
		const hl_network_unit *u = &net->unit[i];

		if (!net->party[u->hot].utility && u->hot_share < 1.0 &&
		    stage_units(net, u->hot, u->hot_stage, i) == 0)
			text_split(fp, net, u->hot, u->hot_stage);
		if (!net->party[u->cold].utility && u->cold_share < 1.0 &&
		    stage_units(net, u->cold, u->cold_stage, i) == 0)
			text_split(fp, net, u->cold, u->cold_stage);
	}
}

void
hl_opt_text(FILE *fp, const hl_opt_result *r, const hl_opt_options *o)
{
	const hl_network *net = r->net;
	const char *cur = cur_of(net);
	size_t i;

	fprintf(fp, "\nLeast-cost search\n");
	fprintf(fp, "  seed %lu, %zu walks, %zu evaluations, %zu stages%s\n",
	    o->seed, r->walks, r->evals, r->stages, r->capped ?
	    "; the time limit cut the search short (the result may differ "
	    "from run to run: give a larger --time-limit)" : "");
	fprintf(fp, "  total annual cost %.0f %s/year = capital %.0f + energy "
	    "%.0f\n", net->total_cost, cur, net->capital_annual,
	    net->energy_cost);
	if (!isnan(r->start_tac))
		fprintf(fp, "  the start network costs %.0f %s/year%s\n",
		    r->start_tac, cur, r->kept_start ? ": nothing cheaper was "
		    "found, the start is kept" : "");
	text_energy(fp, net);
	if (o->min_duty_auto && r->min_duty_dropped)
		fprintf(fp, "  smallest unit: none; the default (1 %% of the "
		    "largest stream duty), and a tenth of it, would add more "
		    "than 3 %% to the cost (--min-duty sets one)\n");
	else if (o->min_duty_auto && r->min_duty_tenth)
		fprintf(fp, "  smallest unit %.*f %s: a tenth of the default "
		    "(1 %% of the largest stream duty would add more than "
		    "3 %% to the cost; --min-duty sets it)\n", HL_DIG_Q(1),
		    hl_show_q(r->smallest), HL_SYM_Q);
	else if (o->min_duty_auto)
		fprintf(fp, "  smallest unit %.*f %s: 1 %% of the largest "
		    "stream duty, the default (--min-duty sets it, 0 for "
		    "none)\n", HL_DIG_Q(1), hl_show_q(o->min_duty),
		    HL_SYM_Q);
	if (r->binding[0] != '\0')
		fprintf(fp, "  limits: %s\n", r->binding);
	else if (o->no_splits || o->no_split != NULL || o->max_branches > 0 ||
	    o->min_duty > 0 || o->min_area > 0 || o->max_shells > 0)
		fprintf(fp, "  limits: none binds (relaxing each saves less "
		    "than 0.1 %%)\n");
	text_splits(fp, net);
	for (i = 0; i < r->nchange; i++) {
		const hl_opt_change *c = &r->change[i];

		if (c->kind == HL_OPT_DROPPED && isfinite(c->d_tac))
			fprintf(fp, "  dropped: %s: the start's unit of %.*f %s; "
			    "with it back (about that duty, other loads "
			    "making room): %+.0f %s/year, %+.*f %s of hot "
			    "utility\n", c->text, HL_DIG_Q(1),
			    hl_show_q(c->d_energy), HL_SYM_Q, c->d_tac, cur,
			    HL_DIG_Q(1), hl_show_q(c->d_hot), HL_SYM_Q);
		else if (c->kind == HL_OPT_DROPPED)
			fprintf(fp, "  dropped: %s: the start's unit of %.*f %s; "
			    "no network with it back keeps every limit\n",
			    c->text, HL_DIG_Q(1), hl_show_q(c->d_energy),
			    HL_SYM_Q);
		else if (c->kind == HL_OPT_SPLIT && isinf(c->d_tac))
			fprintf(fp, "  split of %s: in series the loads miss "
			    "EMAT or a limit\n", c->text);
		else if (c->kind == HL_OPT_SPLIT)
			fprintf(fp, "  split of %s: in series (the smaller "
			    "branches moved to free stages, loads polished) "
			    "%+.0f %s/year, %+.*f %s of hot utility\n",
			    c->text, c->d_tac, cur, HL_DIG_Q(1),
			    hl_show_q(c->d_energy), HL_SYM_Q);
		else if (isinf(c->d_tac))
			fprintf(fp, "  unit: %s: the unit of %.*f %s cannot go "
			    "(its streams could not reach their targets)\n",
			    c->text, HL_DIG_Q(1), hl_show_q(c->d_energy),
			    HL_SYM_Q);
		else
			fprintf(fp, "  unit: %s: without the unit of %.*f %s "
			    "(its heat to the utilities): %+.*f %s of hot "
			    "utility, %+.0f %s/year\n", c->text, HL_DIG_Q(1),
			    hl_show_q(c->d_energy), HL_SYM_Q, HL_DIG_Q(1),
			    hl_show_q(c->d_energy), HL_SYM_Q, c->d_tac, cur);
	}
}

int
hl_opt_xml(xmlTextWriterPtr w, const hl_opt_result *r,
	   const hl_opt_options *o)
{
	size_t i;
	int rc = 0;

	rc |= xmlTextWriterStartElement(w, BAD_CAST "least-cost");
	rc |= hl_xml_int(w, "seed", (long)o->seed);
	rc |= hl_xml_int(w, "walks", (long)r->walks);
	rc |= hl_xml_int(w, "evaluations", (long)r->evals);
	rc |= hl_xml_int(w, "stages", (long)r->stages);
	rc |= hl_xml_str(w, "time-capped", r->capped ? "yes" : "no");
	if (!isnan(r->start_tac))
		rc |= hl_xml_num(w, "start-cost", r->start_tac);
	rc |= hl_xml_str(w, "kept-start", r->kept_start ? "yes" : "no");
	rc |= hl_xml_num(w, "above-target", r->net->qh - r->net->qh_target);
	if (o->min_duty > 0.0 && !r->min_duty_dropped)
		rc |= hl_xml_num(w, "smallest-unit", o->min_duty_auto ?
		    r->smallest : o->min_duty);
	if (o->min_duty > 0.0)
		rc |= hl_xml_str(w, "smallest-unit-rule", !o->min_duty_auto ?
		    "set" : r->min_duty_dropped ? "default-dropped" :
		    r->min_duty_tenth ? "default-tenth" : "default");
	if (r->binding[0] != '\0')
		rc |= xmlTextWriterWriteElement(w, BAD_CAST "limits",
		    BAD_CAST r->binding);
	for (i = 0; i < r->nchange && rc >= 0; i++) {
		const hl_opt_change *c = &r->change[i];

		rc |= xmlTextWriterStartElement(w, BAD_CAST (c->kind ==
		    HL_OPT_DROPPED ? "dropped" : c->kind == HL_OPT_WORTH ?
		    "unit-worth" : "split-why"));
		if (c->kind == HL_OPT_SPLIT) {
			if (isfinite(c->d_tac)) {
				rc |= hl_xml_num(w, "series-cost", c->d_tac);
				rc |= hl_xml_num(w, "series-energy",
				    c->d_energy);
			}
		} else if (c->kind == HL_OPT_DROPPED) {
			rc |= hl_xml_num(w, "duty", c->d_energy);
			if (isfinite(c->d_tac)) {
				rc |= hl_xml_num(w, "cost-with", c->d_tac);
				rc |= hl_xml_num(w, "energy-with", c->d_hot);
			}
		} else {
			rc |= hl_xml_num(w, "duty", c->d_energy);
			if (isfinite(c->d_tac))
				rc |= hl_xml_num(w, "cost-without", c->d_tac);
		}
		rc |= xmlTextWriterWriteString(w, BAD_CAST c->text);
		rc |= xmlTextWriterEndElement(w);
	}
	rc |= xmlTextWriterEndElement(w);
	return rc < 0 ? -1 : 0;
}
