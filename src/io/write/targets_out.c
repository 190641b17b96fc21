/* targets_out.c - writers of the problem table results. */
#include <math.h>

#include "display.h"
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
		fprintf(fp, "Threshold ΔTmin        %.1f %s (%s utility is "
			"needed above it)\n", hl_show_dt(th->dtmin), HL_SYM_DT,
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
	fprintf(fp, "Hot stream duty        %.*f %s\n", HL_DIG_Q(1),
		hl_show_q(cas->hot_total), HL_SYM_Q);
	fprintf(fp, "Cold stream duty       %.*f %s\n", HL_DIG_Q(1),
		hl_show_q(cas->cold_total), HL_SYM_Q);
	fprintf(fp, "ΔTmin                  %.1f %s\n", hl_show_dt(cas->dtmin),
		HL_SYM_DT);
	fprintf(fp, "Minimum hot utility    %.*f %s\n", HL_DIG_Q(1),
		hl_show_q(cas->qh), HL_SYM_Q);
	fprintf(fp, "Minimum cold utility   %.*f %s\n", HL_DIG_Q(1),
		hl_show_q(cas->qc), HL_SYM_Q);
	fprintf(fp, "Heat recovery          %.*f %s\n", HL_DIG_Q(1),
		hl_show_q(cas->hot_total - cas->qc), HL_SYM_Q);
	if (cas->npinch == 0)
		text_threshold(fp, th);
	for (i = 0; i < cas->npinch; i++) {
		double s = cas->t[cas->pinch[i]];

		fprintf(fp, "Pinch                  %.1f %s hot / %.1f %s cold "
			"(%.1f %s shifted)\n",
			hl_show_t(hl_cascade_hot_temp(cas, s)), HL_SYM_T,
			hl_show_t(hl_cascade_cold_temp(cas, s)), HL_SYM_T,
			hl_show_t(s), HL_SYM_T);
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
	fprintf(fp, " ");
	hl_show_col(fp, HL_SYM_T, 10);
	hl_show_col(fp, HL_SYM_T, 10);
	hl_show_col(fp, HL_SYM_T, 10);
	hl_show_col(fp, HL_SYM_CP, 12);
	hl_show_col(fp, HL_SYM_Q, 12);
	hl_show_col(fp, HL_SYM_Q, 12);
	fputc('\n', fp);
	for (k = 0; k < cas->nb; k++) {
		fprintf(fp, "  %9.1f %9.1f %9.1f %11s %11s %11.*f%s\n",
			hl_show_t(cas->t[k]),
			hl_show_t(hl_cascade_hot_temp(cas, cas->t[k])),
			hl_show_t(hl_cascade_cold_temp(cas, cas->t[k])), "", "",
			HL_DIG_Q(1), hl_show_q(cas->flow[k]),
			cas->flow[k] == 0.0 && k > 0 &&
			k + 1 < cas->nb ? "  pinch" : "");
		if (k + 1 < cas->nb && cas->t[k] == cas->t[k + 1])
			fprintf(fp, "  %9s %9s %9s %11s %11.*f\n", "", "", "",
				"latent", HL_DIG_Q(1), hl_show_q(cas->dh[k]));
		else if (k + 1 < cas->nb)
			fprintf(fp, "  %9s %9s %9s %11.*f %11.*f\n", "", "", "",
				HL_DIG_CP(3), hl_show_cp(cas->netcp[k]),
				HL_DIG_Q(1), hl_show_q(cas->dh[k]));
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
	static const char *const name[6] = { "shifted", "hot", "cold",
		"net_cp", "surplus", "heat_flow" };
	static const hl_qty qty[6] = { HL_QTY_TEMP, HL_QTY_TEMP, HL_QTY_TEMP,
		HL_QTY_CP, HL_QTY_POWER, HL_QTY_POWER };
	char a[64], b[64], c[64], d[64], e[64], f[64], h[64];
	size_t k;

	for (k = 0; k < 6; k++)
		fprintf(fp, "%s,", hl_show_header(h, sizeof h, name[k],
						  qty[k]));
	fprintf(fp, "pinch\n");
	for (k = 0; k < cas->nb; k++) {
		hl_format_number(a, sizeof a, hl_show_t(cas->t[k]));
		hl_format_number(b, sizeof b,
			hl_show_t(hl_cascade_hot_temp(cas, cas->t[k])));
		hl_format_number(c, sizeof c,
			hl_show_t(hl_cascade_cold_temp(cas, cas->t[k])));
		if (k + 1 < cas->nb) {
			hl_format_number(d, sizeof d,
					 hl_show_cp(cas->netcp[k]));
			hl_format_number(e, sizeof e, hl_show_q(cas->dh[k]));
		} else {
			d[0] = e[0] = '\0';
		}
		hl_format_number(f, sizeof f, hl_show_q(cas->flow[k]));
		fprintf(fp, "%s,%s,%s,%s,%s,%s,%d\n", a, b, c, d, e, f,
			cas->flow[k] == 0.0 && k > 0 && k + 1 < cas->nb);
	}
}
