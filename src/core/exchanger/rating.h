/* rating.h - an exchanger of known area and shells in new conditions: its
 * duty and outlet temperatures.
 *
 * Sizing (exchanger.h) goes from temperatures to area; rating goes back:
 * given the inlet temperatures, the flows (a share of each stream's cp),
 * the area and the shells in series, what does the unit do?
 *
 * Method. Where both sides keep one cp and one film coefficient across the
 * unit, the closed ε-NTU forms (Incropera & DeWitt, Fundamentals of Heat and
 * Mass Transfer, table 11.3; Shah & Sekulić, Fundamentals of Heat Exchanger
 * Design, 2003, table 3.3):
 *  - counterflow: ε = (1 − e^{−NTU(1−Cr)})/(1 − Cr·e^{−NTU(1−Cr)}),
 *    ε = NTU/(1 + NTU) at Cr = 1;
 *  - one shell pass, 2, 4, … tube passes (the 1-2 shell):
 *    ε1 = 2{1 + Cr + √(1+Cr²)·(1 + e^{−NTU1·√(1+Cr²)})/(1 − e^{−NTU1·√(1+Cr²)})}⁻¹;
 *  - n such shells in series, NTU1 = NTU/n:
 *    ε = {[(1−ε1Cr)/(1−ε1)]ⁿ − 1}/{[(1−ε1Cr)/(1−ε1)]ⁿ − Cr}
 *    (ε = nε1/(1 + (n−1)ε1) at Cr = 1);
 * NTU = U·A/Cmin, Cr = Cmin/Cmax, duty = ε·Cmin·(T_hot,in − T_cold,in).
 * These are the same model as sizing's Q = U·A·F·LMTD with F of Bowman,
 * Mueller & Nagle (1940) for the per-shell P (Kakaç & Liu, Heat Exchangers:
 * Selection, Rating and Thermal Design, ch. 2): rating a unit at the area
 * sizing gave returns the sizing's temperatures.
 *
 * The other types: plate and double pipe are counterflow (the double
 * pipe's hairpins in series are one counterflow path); an air cooler is
 * `shells` crossflow sections, both fluids unmixed (Incropera & DeWitt,
 * table 11.3, the unmixed-unmixed row), in series counter-current between
 * sections, F of the sections as sizing has it (crossflow.c). A fired
 * heater is sized by duty and is not rated (HL_EINPUT). This is the one
 * rating entry point of the project.
 *
 * Where a side changes cp (a segmented stream) or film coefficient inside
 * the unit, the duty is the one at which the area sizing needs, piece by
 * piece (profile.h) with the F of the terminal temperatures at the given
 * shell count, equals the area given; found by regula falsi with the
 * Illinois change on a bracket of the duty (the area needed rises with the
 * duty). The closed form is this same equation for one piece.
 *
 * Shells in parallel: identical parallel trains of the same series count
 * each take an equal part of both flows and of the area, so they rate as
 * one train of the whole area (NTU and Cr unchanged): a shell added in
 * parallel, or a larger bundle, is "more area at the same series count".
 * The film coefficients are held: a lower velocity in parallel shells is
 * not modelled (screening).
 *
 * Units: °C, kW, kW/K, kW/(m²·K), m². Pure numerics: nothing allocates.
 * Errors: HL_EINPUT for arguments outside the stated domain, with one
 * sentence in err (which may be NULL).
 */
#ifndef HL_RATING_H
#define HL_RATING_H

#include <stddef.h>

#include "case.h"
#include "exchanger.h"
#include "status.h"

/* ε of a unit: counterflow, plate, double pipe (shells ignored); n >= 1
 * shells in series of the 1-2 kind; n >= 1 crossflow sections of an air
 * cooler. Domain: ntu >= 0 finite, 0 <= cr <= 1; a fired heater HL_EINPUT. */
hl_status hl_rating_eps(hl_exchanger_type type, int shells, double ntu,
			double cr, double *eps, hl_error *err);

/* One side: a stretch of a process stream from t_in, carrying the fraction
 * share (0 < share <= 1) of its cp. h_default stands in for segments without
 * a film coefficient. */
typedef struct {
	const hl_segment *seg;
	size_t nseg;          /* >= 1 */
	hl_kind kind;
	double share;
	double t_in;          /* °C */
	double h_default;     /* kW/(m²·K) */
} hl_rating_side;

typedef struct {
	hl_rating_side hot, cold;
	hl_exchanger_type type;
	int shells;           /* in series, >= 1: shells, air-cooler
				 sections (counterflow types: ignored) */
	double area;          /* m², total, >= 0 */
} hl_rating_spec;

typedef struct {
	double duty;          /* kW */
	double hot_out;       /* °C */
	double cold_out;      /* °C */
	double u;             /* kW/(m²·K) (the pieces' effective U) */
	double lmtd;          /* K, counterflow mean (pieces) */
	double ft;            /* F at the given shells, 1 for counterflow */
	int closed_form;      /* 1: ε-NTU closed form, 0: found by search */
} hl_rating_result;

/* Area (m²) a unit of spec's sides, type and shells needs to transfer duty
 * (kW, >= 0): duty/(U·F·LMTD) with the pieces of profile.h. HUGE_VAL where
 * no such unit can do it (a temperature cross counterflow cannot hold, or F
 * undefined at that shell count); 0 at duty 0. u, lmtd, ft (may be NULL)
 * receive the parts. */
double hl_rating_area_needed(const hl_rating_spec *spec, double duty,
			     double *u, double *lmtd, double *ft);

/* Most heat the two sides could exchange (kW): the smaller of what brings
 * the hot side down to the cold inlet and the cold side up to the hot
 * inlet. */
double hl_rating_duty_max(const hl_rating_spec *spec);

/* Rate the unit. Domain: hot.t_in >= cold.t_in, shares in (0, 1], area >= 0
 * finite, shells >= 1 for shell-and-tube and air cooler, not a fired
 * heater, nseg >= 1 on both sides, every
 * number finite. */
hl_status hl_rating_run(const hl_rating_spec *spec, hl_rating_result *out,
			hl_error *err);

#endif
