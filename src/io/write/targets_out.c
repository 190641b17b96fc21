/* targets_out.c - writers of the problem table results. */
#include <math.h>

#include "targets_out.h"

static const char *
missing_utility(char kind)
{
	return kind == 'H' ? "hot" : "cold";
}

static void
text_threshold(FILE *fp, const hl_threshold *th)
{
	if (th->kind == 'N') {
		fprintf(fp, "Pinch                  none: the process needs "
			"no utility at all\n");
		return;
	}
	fprintf(fp, "Pinch                  none: a threshold problem, no "
		"%s utility is needed\n", missing_utility(th->kind));
	if (isinf(th->dtmin))
		fprintf(fp, "Threshold ΔTmin        none: %s utility is never "
			"needed\n", missing_utility(th->kind));
	else
		fprintf(fp, "Threshold ΔTmin        %.1f K (%s utility is "
			"needed above it)\n", th->dtmin,
			missing_utility(th->kind));
}

static void
text_summary(FILE *fp, const hl_case *c, const hl_cascade *cas,
	     const hl_threshold *th)
{
	size_t i, nhot = 0;

	for (i = 0; i < c->nstream; i++)
		nhot += c->stream[i].kind == HL_HOT;
	fprintf(fp, "Energy targets for %s\n\n", c->source ? c->source : "");
	fprintf(fp, "Streams                %zu hot, %zu cold\n", nhot,
		c->nstream - nhot);
	fprintf(fp, "Hot stream duty        %.1f kW\n", cas->hot_total);
	fprintf(fp, "Cold stream duty       %.1f kW\n", cas->cold_total);
	fprintf(fp, "ΔTmin                  %.1f K\n", cas->dtmin);
	fprintf(fp, "Minimum hot utility    %.1f kW\n", cas->qh);
	fprintf(fp, "Minimum cold utility   %.1f kW\n", cas->qc);
	fprintf(fp, "Heat recovery          %.1f kW\n",
		cas->hot_total - cas->qc);
	if (cas->npinch == 0)
		text_threshold(fp, th);
	for (i = 0; i < cas->npinch; i++) {
		double s = cas->t[cas->pinch[i]];

		fprintf(fp, "Pinch                  %.1f °C hot / %.1f °C cold "
			"(%.1f °C shifted)\n", hl_cascade_hot_temp(cas, s),
			hl_cascade_cold_temp(cas, s), s);
	}
}

void
hl_targets_text_summary(FILE *fp, const hl_case *c, const hl_cascade *cas,
			const hl_threshold *th)
{
	text_summary(fp, c, cas, th);
}

void
hl_targets_text_table(FILE *fp, const hl_cascade *cas)
{
	size_t k;

	fprintf(fp, "\nProblem table (shifted temperatures; hot = shifted + "
		"ΔTmin/2, cold = shifted − ΔTmin/2)\n\n");
	fprintf(fp, "  %9s %9s %9s %11s %11s %11s\n", "shifted", "hot",
		"cold", "net cp", "surplus", "heat flow");
	fprintf(fp, "  %9s %9s %9s %11s %11s %11s\n", "°C", "°C", "°C",
		"kW/K", "kW", "kW");
	for (k = 0; k < cas->nb; k++) {
		fprintf(fp, "  %9.1f %9.1f %9.1f %11s %11s %11.1f%s\n",
			cas->t[k], hl_cascade_hot_temp(cas, cas->t[k]),
			hl_cascade_cold_temp(cas, cas->t[k]), "", "",
			cas->flow[k], cas->flow[k] == 0.0 && k > 0 &&
			k + 1 < cas->nb ? "  pinch" : "");
		if (k + 1 < cas->nb)
			fprintf(fp, "  %9s %9s %9s %11.3f %11.1f\n", "", "", "",
				cas->netcp[k], cas->dh[k]);
	}
}

void
hl_targets_text_caution(FILE *fp)
{
	fprintf(fp, "\nScreening estimates: detailed design and the safety "
		"review of each match belong to qualified engineers under "
		"local codes.\n");
}

int
hl_targets_xml_begin(xmlTextWriterPtr w, const hl_cascade *cas,
		     const hl_threshold *th)
{
	size_t i;
	int rc = 0;

	rc |= xmlTextWriterStartElement(w, BAD_CAST "targets");
	rc |= hl_xml_num(w, "dtmin", cas->dtmin);
	rc |= hl_xml_num(w, "hot-utility", cas->qh);
	rc |= hl_xml_num(w, "cold-utility", cas->qc);
	if (th->kind == 'H' || th->kind == 'C') {
		rc |= hl_xml_str(w, "threshold", missing_utility(th->kind));
		if (!isinf(th->dtmin))
			rc |= hl_xml_num(w, "threshold-dtmin", th->dtmin);
	}
	for (i = 0; i < cas->npinch; i++) {
		double s = cas->t[cas->pinch[i]];

		rc |= xmlTextWriterStartElement(w, BAD_CAST "pinch");
		rc |= hl_xml_num(w, "shifted", s);
		rc |= hl_xml_num(w, "hot", hl_cascade_hot_temp(cas, s));
		rc |= hl_xml_num(w, "cold", hl_cascade_cold_temp(cas, s));
		rc |= xmlTextWriterEndElement(w);
	}
	return rc < 0 ? -1 : 0;
}

int
hl_targets_xml_end(xmlTextWriterPtr w)
{
	return xmlTextWriterEndElement(w) < 0 ? -1 : 0;
}

void
hl_targets_csv(FILE *fp, const hl_cascade *cas)
{
	char a[64], b[64], c[64], d[64], e[64], f[64];
	size_t k;

	fprintf(fp, "shifted,hot,cold,net_cp,surplus,heat_flow,pinch\n");
	for (k = 0; k < cas->nb; k++) {
		hl_format_number(a, sizeof a, cas->t[k]);
		hl_format_number(b, sizeof b, hl_cascade_hot_temp(cas, cas->t[k]));
		hl_format_number(c, sizeof c, hl_cascade_cold_temp(cas, cas->t[k]));
		if (k + 1 < cas->nb) {
			hl_format_number(d, sizeof d, cas->netcp[k]);
			hl_format_number(e, sizeof e, cas->dh[k]);
		} else {
			d[0] = e[0] = '\0';
		}
		hl_format_number(f, sizeof f, cas->flow[k]);
		fprintf(fp, "%s,%s,%s,%s,%s,%s,%d\n", a, b, c, d, e, f,
			cas->flow[k] == 0.0 && k > 0 && k + 1 < cas->nb);
	}
}
