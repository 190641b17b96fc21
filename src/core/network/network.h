/* network.h - a network of heat exchangers: matches placed on their streams,
 * split where they must be, every temperature known, every unit sized.
 *
 * Data model. A network has parties (process streams and utilities) and
 * units (exchangers). Each unit joins one hot and one cold party. Along a
 * process stream the units stand in stages, numbered 1, 2, … from the supply
 * end: a stage of one unit is plain series; a stage of several units is a
 * split, the stream divided into parallel branches (one unit each, carrying
 * the fraction `share` of the stream's cp; the shares of a stage sum to 1)
 * that mix again after the stage. Every branch of a stage enters at the
 * stage's inlet temperature; the mixed outlet follows from the heat balance.
 * A utility serves its units in parallel, each from the utility's supply
 * temperature to an outlet between supply and target (equal to both when it
 * condenses or boils).
 *
 * The approach a unit must keep at every point is
 *	required = min(EMAT, ΔT_hot + ΔT_cold)
 * where EMAT (exchanger minimum approach temperature) is the case's `emat`
 * or ΔTmin, and ΔT_hot, ΔT_cold are the two parties' ΔT contributions
 * (their dt_contrib, or ΔTmin/2): without stream contributions this is EMAT.
 *
 * Placement (hl_network_place): see doc/methods.md, "Network placement".
 * The input is a set of matches (hot party, cold party, duty, and where in
 * temperature each exchanges its heat: per-interval loads or windows), as a
 * match MILP gives them or as built by hand.
 *
 * Sizing: U from 1/U = 1/h_hot + 1/h_cold (h_default where a party has no
 * h, reported as assumed), LMTD, F, shells, area and cost by exchanger.h;
 * a unit whose side crosses a change of cp is sized piece by piece
 * (profile.h) with the F of its terminal temperatures.
 *
 * Ownership: a network owns all its strings and arrays; hl_network_free
 * accepts NULL. Units: °C, kW, kW/K, kW/(m²·K), m², currency.
 * Errors: HL_EINPUT for an input that contradicts itself (a match on two
 * parties of one kind, a duty above what its streams hold), HL_ENOSOLUTION
 * when no feasible network exists even with relaxed loads, HL_EIO when
 * memory runs out.
 */
#ifndef HL_NETWORK_H
#define HL_NETWORK_H

#include <stddef.h>

#include "case.h"
#include "exchanger.h"
#include "status.h"

typedef struct {
	char *name;
	hl_kind kind;
	int utility;        /* 1: a utility, 0: a process stream */
	int implicit;       /* utility not in the case (a bare stream table) */
	double supply;      /* °C */
	double target;      /* °C */
	size_t nseg;        /* process streams: segments, supply end first;
			       utilities: 0 */
	hl_segment *seg;
	double h;           /* utilities: kW/(m²·K), NaN: not given (h_default
			       used); process streams give h per segment */
	double dt_contrib;  /* K as given, NaN: ΔTmin/2 */
	double load;        /* kW: a process stream's duty; a utility's load
			       (in a network: the Σ of its units' duties) */
	double price;       /* utilities: currency per MWh, NaN: none */
	double max_load;    /* utilities: kW, NaN: unlimited */
	int type_given;     /* utilities: 1 when type below was given */
	int type;           /* hl_exchanger_type of units on this utility */
	int cost_given;     /* utilities: 1 when their units cost */
	double cost_a, cost_b, cost_c;  /* a + b·X^c (X as the type's law) */
	long line;          /* line in the network file, 0 when built */
} hl_network_party;

/* The exchanger type the engineer fixed for a pair of parties (indices;
 * -1 on a side: any party of that side). */
typedef struct {
	long hot, cold;
	hl_exchanger_type type;
} hl_network_typed;

/* A match to place. Where it exchanges: either per-interval loads give[k]
 * (heat leaving the hot party in interval k) and take[k] (heat entering the
 * cold party there) over the input's shifted intervals, or a window of real
 * temperatures on each side; NaN windows and NULL loads leave the position
 * to the search. */
typedef struct {
	size_t hot, cold;   /* party indices */
	double duty;        /* kW, > 0 */
	const double *give; /* nint values or NULL */
	const double *take;
	double hot_hi, hot_lo;   /* °C, hot side window, NaN unknown */
	double cold_lo, cold_hi; /* °C, cold side window */
} hl_network_match;

typedef struct {
	const hl_settings *set;   /* dtmin, emat, sizing and cost settings */
	size_t nparty;
	const hl_network_party *party;
	size_t nmatch;
	const hl_network_match *match;
	size_t nint;              /* shifted intervals of give/take, 0: none */
	const double *t;          /* nint + 1 shifted boundaries, falling */
	const long *group;        /* per match, or NULL: matches of one group
				     are pieces of one match, and the
				     placement may shift heat between them */
	double qh_target;         /* kW, minimum hot utility (problem table) */
	double qc_target;
	double restriction;       /* kW of hot utility the match rules added */
	size_t ntyped;            /* exchanger types fixed per pair, */
	const hl_network_typed *typed; /* first match wins; NULL: none */
	double range_rise;        /* kW above the target the utility loads
				     carry (a ranged utility exchanging heat
				     across the pinch) */
} hl_network_input;

/* assumed h flags of a unit */
#define HL_NETWORK_H_HOT 1u
#define HL_NETWORK_H_COLD 2u

typedef struct {
	char id[16];        /* "E1"…, heaters "H1"…, coolers "C1"… */
	size_t hot, cold;   /* party indices */
	long match;         /* input match, -1: added by the placement */
	double duty;        /* kW */
	double hot_in, hot_out, cold_in, cold_out;  /* °C */
	double hot_share, cold_share;  /* fraction of the party's flow */
	int hot_stage, cold_stage;     /* 1-based along a process stream,
					  0 on a utility */
	hl_exchanger_type type;  /* hl_network_unit_type, or counterflow
				    when that type cannot do the duty */
	double u;           /* kW/(m²·K) */
	unsigned assumed;   /* HL_NETWORK_H_* where h_default was used */
	double required;    /* K, the approach the unit must keep */
	double approach;    /* K, its smallest hot − cold difference */
	double lmtd;        /* K, effective counterflow mean (pieces) */
	double ft;          /* F of all shells, 1 for counterflow */
	int shells;         /* in series (hairpins, air-cooler sections) */
	int parallel;       /* trains of `shells` in parallel */
	double area;        /* m², total (0 for a fired heater) */
	double area_shell;  /* m² */
	double cost;        /* currency, shells·parallel·(a + b·X^c) */
	unsigned warn;      /* HL_EXCH_WARN_* of its sizing */
	char *note;         /* NULL or one sentence for the report */
	long line;          /* line in the network file, 0 when built */
	/* Retrofit (network_held.c): a held unit is hardware, today's or
	 * bought: its shells in series are fixed, the area its duty needs
	 * must fit in area_today + area_added, and its cost is that of the
	 * shells bought only. A fired heater, sized by duty, has no area:
	 * its rating plays the part, its duty must fit in duty_today +
	 * duty_added, and shells_added counts the heaters bought. */
	int held;           /* 1: a retrofit unit, 0: a design unit */
	char reuses[96];    /* today's tag it reuses, "" for a new unit */
	double area_today;  /* m², the area it has today (0 for a new unit) */
	double area_added;  /* m², area bought */
	int shells_added;   /* shells bought (in series or in parallel) */
	double duty_today;  /* kW, a reused fired heater's rated duty (its
			       duty today); 0 for a new one and other types */
	double duty_added;  /* kW, firing bought beyond it (fired heaters) */
	int moved;          /* re-piped or resequenced (not in files) */
} hl_network_unit;

typedef struct {
	hl_settings set;           /* a copy; set.currency is owned */
	size_t nparty;
	hl_network_party *party;
	size_t nunit;
	hl_network_unit *unit;
	size_t nmatch;             /* matches the placement was given */
	double qh, qc;             /* kW of hot and cold utility used */
	double qh_target, qc_target;
	double restriction;        /* kW above the targets from match rules */
	double range_rise;         /* kW above them from utility ranges */
	double penalty;            /* kW above them from the placement */
	size_t nsplit;             /* split stages */
	double area, capital;      /* m², currency */
	double crf;                /* capital recovery factor, 1/year */
	double capital_annual, energy_cost, total_cost;  /* currency/year */
	size_t nnote;
	char **note;               /* what the placement had to change */
	size_t ntyped;             /* the input's types per pair (a copy) */
	hl_network_typed *typed;
	char *source;              /* the case or network file, NULL */
} hl_network;

hl_network *hl_network_create(void);
void hl_network_free(hl_network *net);

/* 1 when a utility with a negative price (a credit) carries load: the rise
 * above the targets (range_rise) is then hot utility bought because the
 * credit pays for the process heat it frees, not only utility ranges. */
int hl_network_has_credit(const hl_network *net);

/* Copy a party into the network (deep copy). */
/* The case's process streams as parties, in case order, each carrying its
 * whole duty as its load. */
hl_status hl_network_add_streams(const hl_case *c, hl_network *net,
				 hl_error *err);
hl_status hl_network_add_party(hl_network *net, const hl_network_party *p,
			       hl_error *err);
/* Append a unit (note copied); its id is kept when set. */
hl_status hl_network_add_unit(hl_network *net, const hl_network_unit *u,
			      hl_error *err);
/* Append a note (printf-style). */
hl_status hl_network_add_note(hl_network *net, hl_error *err,
			      const char *fmt, ...)
	__attribute__((format(printf, 3, 4)));
void hl_network_party_free(hl_network_party *p);

/* Required approach (K) between two parties under the settings. */
double hl_network_required(const hl_settings *set, const hl_network_party *hot,
			   const hl_network_party *cold);

/* ΔT contribution (K) of a party at set->dtmin. */
double hl_network_shift(const hl_settings *set, const hl_network_party *p);

/* Exchanger type of a unit between parties hot and cold: the first of
 * net->typed naming the pair, else the utility's own type, else the
 * settings' exchanger (hl_case_pair_type's order). */
hl_exchanger_type hl_network_unit_type(const hl_network *net, size_t hot,
				       size_t cold);

/* Size unit u of net in place from its duty, terminal temperatures and
 * u->type, through hl_exchanger_size with the type's law (a utility's own
 * cost law when it gives one): U (and assumed flags), required approach,
 * approach, LMTD, F, shells in series and parallel, area, cost, warnings.
 * HL_ENOSOLUTION when the type would need more shells in series than
 * HL_EXCHANGER_MAX_SHELLS (callers then size it as counterflow, with a
 * note). Errors: HL_EINPUT (naming the unit) when its temperatures cannot
 * exchange heat. */
hl_status hl_network_size_unit(const hl_network *net, hl_network_unit *u,
			       hl_error *err);

/* Size a held unit (held = 1) at its own shell count from the sizing z of
 * hl_exchanger_size at spec (series = its shells, its type's law): F at
 * those shells, the area its duty needs, the cost of the shells bought by
 * the type's law, shells_added·(a + b·(area_added / shells_added)^c), the
 * bought shells split in parallel so that none passes the type's largest
 * (shells_added counts them; a new unit's parallel follows). A fired
 * heater's bought heaters cost shells_added·(a + b·Q^c), Q the MW of
 * duty_added each carries, none above the type's largest. */
hl_status hl_network_size_held(const hl_network *net, hl_network_unit *u,
			       const hl_exchanger_spec *spec,
			       const hl_exchanger_sizing *z, hl_error *err);

/* An empty network on the parties of case c: its process streams in case
 * order, then its utilities (party nstream + k is utility k) with loads
 * util_load (kW each, NULL: 0), types and cost laws, the case's settings
 * and its exchanger type rules; no units, no totals (network_case.c). */
hl_status hl_network_of_case(const hl_case *c, const double *util_load,
			     hl_network **out, hl_error *err);

/* A deep copy of net (NULL when memory runs out). */
hl_network *hl_network_copy(const hl_network *net);

/* The sentence of hl_exchanger_warning for unit u (empty when none). */
void hl_network_unit_warning(const hl_network *net,
			     const hl_network_unit *u, char *buf, size_t n);

/* Fill the totals: utility use, splits, area, capital, CRF, annual costs. */
void hl_network_totals(hl_network *net);

/* Place and size the matches of in. On HL_OK *out is a network that closes
 * every balance and keeps every required approach; where the loads allow no
 * such placement, heat moved to utilities (net->penalty, with notes) or
 * units added or dropped say what changed. */
hl_status hl_network_place(const hl_network_input *in, hl_network **out,
			   hl_error *err);

#endif
