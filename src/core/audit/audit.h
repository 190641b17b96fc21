/* audit.h - how far today's network is from the targets, and why.
 *
 * Energy: today's hot and cold utility (existing.h) beside the minimum
 * utilities at the case's ΔTmin (problem table, Linnhoff & Flower 1978) and
 * the least-cost utility bill there (utility LP, when the case has
 * utilities).
 *
 * Pinch rules (Linnhoff et al. 1982, User Guide on Process Integration for
 * the Efficient Use of Energy, IChemE): no process heat across the pinch,
 * no hot utility below it, no cold utility above it. Every kW that breaks a
 * rule costs a kW of heating and a kW of cooling: with X the process heat a
 * unit's hot side gives above the pinch less what its cold side takes above
 * it (summed), HB the hot utility a cold stream takes below the pinch and
 * CA the cold utility a hot stream gives above it,
 *
 *	QH_now − QH_min = QC_now − QC_min = X + HB + CA
 *
 * exactly, when the network's units cover every stream (gaps included).
 * Each unit's part comes from its terminal temperatures on the shifted
 * scale (hot side shifted down, cold side up by its ΔT contribution) and
 * the heat of its stream between them. A unit whose cold side takes more
 * above the pinch than its hot side gives there passes heat up across the
 * pinch (possible only with an approach below ΔTmin): kind HL_VIOL_UP, not
 * a rule broken, but it enters X with its sign so that the balance closes.
 * The pinch is the hottest pinch of the cascade (with several, the balance
 * closes at each: the choice moves blame, not the sum); a problem that
 * needs no hot utility puts it at the top of the cascade, one that needs
 * no cold utility at the bottom.
 *
 * ΔTmin now: the largest ΔTmin whose minimum hot utility is at most today's
 * (bisection on the monotone problem-table target, Linnhoff & Flower 1978).
 *
 * The area–energy curve (α, the unit shares, the retrofit curve): the area
 * target at hot utility E is the vertical-transfer area of the balanced
 * composites with each utility level's load interpolated linearly in E
 * between its least-cost load at the targets (utility LP at ΔTmin) and its
 * load today (negative loads clipped, each side rescaled to its total). At
 * today's energy that is the area target with today's utility levels. (An
 * LP at the larger ΔTmin would shift each level out of reach of stream ends
 * that today's plant does serve.) Without utilities: the process
 * composites at the ΔTmin of E.
 *
 * Area efficiency (Tjoe & Linnhoff 1986, Chem. Eng. 93, 47–60, from
 * memory): α = A_target(today's energy) / A_existing, the area target
 * (Townsend & Linnhoff 1984, vertical transfer on the balanced composites)
 * at ΔTmin now, on the basis of the case's exchanger setting (counterflow,
 * or shell-and-tube with F per interval); A_existing sums the units' areas
 * (given or estimated), utility units included when the case has
 * utilities, process-to-process units only when it has none.
 *
 * Each unit's share: α_u = A_vt / A_u, A_vt = Q / (U·F·ΔT_vt), with U and F
 * the unit's own and ΔT_vt the vertical temperature difference of the
 * balanced composites at today's energy over the stretch of heat where the
 * unit's process side lies on its composite (hot side for a recovery unit
 * or cooler, cold side for a heater), as the harmonic mean over heat
 * (1/ΔT_vt = mean of 1/ΔT, which is how the area target weights it). α_u =
 * 1: the unit works with the driving force vertical transfer would give
 * it; below 1, it uses more area than that (criss-cross).
 *
 * Money: today's cost from each utility row's price; the saving at today's
 * prices, each kW saved valued at today's duty-weighted mean price of the
 * hot (resp. cold) utility rows (the cheapest level's price when there are
 * none); each violation's saving likewise, with the heater's or cooler's own
 * price for its own side. Screening estimates only.
 *
 * Ownership: the result owns its arrays and net; hl_audit_free(NULL) is
 * fine.
 */
#ifndef HL_AUDIT_H
#define HL_AUDIT_H

#include <stddef.h>

#include "case.h"
#include "existing.h"
#include "status.h"
#include "supertarget.h"

typedef enum {
	HL_VIOL_ACROSS = 0,     /* process heat across the pinch */
	HL_VIOL_HOT_BELOW = 1,  /* hot utility below the pinch */
	HL_VIOL_COLD_ABOVE = 2, /* cold utility above the pinch */
	HL_VIOL_UP = 3          /* heat passed up across it (see above) */
} hl_violation_kind;

typedef struct {
	size_t unit;             /* index into net->unit */
	hl_violation_kind kind;
	double duty;             /* kW, > 0 */
	double saving;           /* per year at today's prices; 0 for UP */
} hl_violation;

typedef struct {
	hl_existing *net;        /* today's network as read */
	double dtmin;            /* K */
	double pinch;            /* shifted °C of the pinch the rules use */
	double pinch_hot;        /* °C, shifted + ΔTmin/2 */
	double pinch_cold;       /* °C, shifted − ΔTmin/2 */
	char pinch_kind;         /* 'P' a pinch, 'T' the top, 'B' the bottom */
	double hot_target;       /* kW, minimum hot utility with the case's
				    utilities: the problem-table minimum plus
				    range_rise */
	double cold_target;      /* kW, likewise */
	double range_rise;       /* kW the utility ranges add at ΔTmin (a flue
				    gas cooled below the pinch, utility_lp.h);
				    the area–energy curve keeps it at every
				    energy, so that its hot utility is one
				    accounting with the targets */
	double cost_target;      /* per year, least-cost bill at the targets
				    (0 without utilities) */
	double *target_load;     /* kW per utility, least cost at ΔTmin */
	double price_hot;        /* per MWh, today's mean hot utility price */
	double price_cold;
	double saving;           /* kW, hot_now − hot_target */
	double saving_cold;      /* kW, cold_now − cold_target */
	double saving_cost;      /* per year at today's prices */
	double violations;       /* kW, Σ of the rules broken (not UP) */
	double upward;           /* kW, Σ of UP */
	size_t nviol;
	hl_violation *viol;      /* largest first; UP after the others */
	double dtmin_now;        /* K; HUGE_VAL when no ΔTmin needs as much
				    (no recovery today); NaN when even 0 K
				    needs more */
	int have_now;            /* supertargets at dtmin_now computed */
	hl_supertargets now;
	double area_target_now;  /* m², basis of the exchanger setting */
	double area_existing;    /* m², the same basis (see above) */
	double alpha;            /* NaN when undefined (see note) */
	double *vertical;        /* per unit: A_vt, m², NaN when undefined */
	double *unit_alpha;      /* per unit: α_u, NaN when undefined */
	char note[400];          /* why α is missing, else "" */
} hl_audit;

/* Audit c's existing network at c->set.dtmin. On an error after the
 * network was read far enough to have warnings, *out still holds the audit
 * with net and its warnings (the rest unset: show the warnings, then free
 * it); otherwise *out is NULL. HL_EINPUT: a row with no sensible reading;
 * HL_ENOSOLUTION: the utility LP finds no answer at ΔTmin. */
hl_status hl_audit_run(const hl_case *c, hl_audit **out, hl_error *err);
void hl_audit_free(hl_audit *a);

/* The largest ΔTmin (K) at which the minimum hot utility of c is at most
 * qh (kW), by bisection to 1e-9 K relative; HUGE_VAL when qh covers all
 * cold duty with no recovery, NaN when ΔTmin 0 already needs more. */
hl_status hl_audit_dtmin_at(const hl_case *c, double qh, double *dt,
			    hl_error *err);

/* Utility loads (kW, c->nutil of them) at hot utility e on the area–energy
 * curve (see above). */
void hl_audit_loads(const hl_case *c, const hl_audit *a, double e,
		    double *load);

/* Supertargets at hot utility e, dt = hl_audit_dtmin_at(e), with the loads
 * of hl_audit_loads. HL_ENOSOLUTION when the curves touch. */
hl_status hl_audit_area_at(const hl_case *c, const hl_audit *a, double e,
			   double dt, hl_supertargets *st, hl_error *err);

/* The area the case's exchanger setting counts (area or area_st). */
double hl_audit_area_basis(const hl_case *c, const hl_supertargets *st);

/* "across", "hot-below", "cold-above", "up". */
const char *hl_violation_kind_name(hl_violation_kind k);

#endif
