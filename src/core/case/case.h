/* case.h - the validated model of one heat-integration study.
 *
 * A case holds process streams, utilities and settings. Readers build it; every
 * stage reads it and never changes it. Units are fixed throughout the core:
 * temperatures in °C, heat capacity flow rates (cp) in kW/K, duties and loads
 * in kW, film coefficients in kW/(m²·K), prices in currency per MWh.
 *
 * A process stream is a chain of one or more segments from its supply end to
 * its target end; each segment has its own constant cp (a segmented stream
 * approximates a curved temperature-enthalpy line). A segment whose supply
 * equals its target is latent heat (condensing, boiling): its heat, given as
 * a duty, is all at one temperature and its cp is infinite; it is stored as
 * latent (kW) with cp 0, and hl_segment_duty gives the heat of any segment.
 *
 * Ownership: hl_case_free() frees everything reachable from the case; strings
 * and arrays inside it belong to it. Adders copy what they are given.
 */
#ifndef HL_CASE_H
#define HL_CASE_H

#include <stddef.h>

#include "status.h"

/* Exchanger types. The numbers are stable (tables index by them). */
typedef enum {
	HL_EXCH_SHELL_TUBE = 0,  /* 1 shell pass, 2, 4, … tube passes per shell */
	HL_EXCH_COUNTERFLOW = 1, /* pure counterflow, F = 1 (ideal) */
	HL_EXCH_PLATE = 2,       /* gasketed plate unit, counterflow, F = 1 */
	HL_EXCH_DOUBLE_PIPE = 3, /* hairpins in series, counterflow, F = 1 */
	HL_EXCH_AIR_COOLER = 4,  /* crossflow, both fluids unmixed, per bay */
	HL_EXCH_FIRED_HEATER = 5,/* sized and costed by duty, not by area */
	HL_EXCH_NTYPES = 6
} hl_exchanger_type;

/* Name of a type as inputs and outputs spell it ("shell-and-tube",
 * "counterflow", "plate", "double-pipe", "air-cooler", "fired-heater"). */
const char *hl_exchanger_type_name(hl_exchanger_type t);
/* The type named s; -1 when s names none. */
int hl_exchanger_type_parse(const char *s);
/* The names, '|'-separated, for messages and choice lists. */
#define HL_EXCH_TYPE_CHOICES \
	"shell-and-tube|counterflow|plate|double-pipe|air-cooler|fired-heater"

/* Cost law and size limits of one exchanger type (illustrative defaults
 * in hl_settings_default). X is the area of one shell, plate unit, hairpin
 * or bay in m², or a fired heater's duty in MW. */
#define HL_LAW_COST 1u     /* given bits: the case set a, b, c */
#define HL_LAW_LARGEST 2u  /* the case set largest */
#define HL_LAW_SMALLEST 4u /* the case set smallest */
typedef struct {
	double a, b, c;   /* cost of one shell (unit) a + b·X^c; NaN a: the
			     settings' cost_a, cost_b, cost_c (process law) */
	double largest;   /* X of the largest shell; beyond it shells go in
			     parallel (double pipe: more hairpins in series);
			     +infinity: no limit */
	double smallest;  /* X below which a shell is implausible (warning) */
	unsigned given;   /* HL_LAW_* the case set */
} hl_exchanger_law;

typedef enum { HL_HOT = 0, HL_COLD = 1 } hl_kind;

/* Unset optional numbers are NaN (test with isnan). */
typedef struct {
	double supply;  /* °C, inlet end of this segment */
	double target;  /* °C, outlet end of this segment; equal to supply
			   for latent heat (condensing, boiling) */
	double cp;      /* kW/K, > 0; 0 for a latent segment */
	double h;       /* kW/(m²·K) including fouling, NaN when not given */
	long line;      /* source line, 0 when none */
	int by_duty;    /* 1 when the input gave the duty only and cp was
			   derived from it (the duty is the measured datum) */
	double latent;  /* kW, > 0 for a latent segment (supply = target:
			   all its heat at one temperature), else 0 */
	int spread;     /* 1: latent heat spread over HL_LATENT_SPAN by
			   hl_case_spread_latent (cp = heat / span) */
} hl_segment;

typedef struct {
	char *name;
	hl_kind kind;
	size_t nseg;
	hl_segment *seg;   /* supply end first */
	double dt_contrib; /* K, this stream's ΔT contribution, NaN = ΔTmin/2 */
	double cp_tol;     /* relative uncertainty of cp (0.05 = 5 %), NaN = default */
	double t_tol;      /* K, uncertainty of the temperatures, NaN = default */
	char *area;        /* plant area tag, NULL when none */
	char *file;        /* source file of the stream */
	long line;         /* source line of its first segment */
} hl_stream;

typedef struct {
	char *name;
	hl_kind kind;      /* HL_HOT heats the process, HL_COLD cools it */
	double supply;     /* °C */
	double target;     /* °C, equal to supply for condensing/boiling */
	double price;      /* currency per MWh of heat delivered or removed */
	double h;          /* kW/(m²·K), NaN when not given */
	double max_load;   /* kW, NaN = unlimited */
	double dt_contrib; /* K, NaN = ΔTmin/2 */
	int type_given;    /* 1: type below was given; 0: the case's exchanger */
	int type;          /* hl_exchanger_type of the units on this utility */
	int cost_given;    /* 1: the units on this utility cost */
	double cost_a, cost_b, cost_c; /* a + b·X^c each (X as the type's law) */
	char *file;
	long line;
} hl_utility;

/* A constraint on which hot/cold pairs may be matched (matches stage).
 * hot or cold may be "*" for any stream or utility of that side. */
typedef enum {
	HL_RULE_FORBID = 0,   /* never match this pair */
	HL_RULE_REQUIRE = 1,  /* the pair must exchange heat */
	HL_RULE_MAX_DUTY = 2  /* the pair may exchange at most max_duty kW */
} hl_rule_kind;

/* The exchanger type the engineer fixes for a pair (hot or cold may be
 * "*"); kept apart from the match rules, which the match stage reads. */
typedef struct {
	char *hot;
	char *cold;
	hl_exchanger_type type;
	char *file;
	long line;
} hl_type_rule;

typedef struct {
	hl_rule_kind kind;
	char *hot;
	char *cold;
	double max_duty;   /* kW, for HL_RULE_MAX_DUTY */
	char *reason;      /* free text shown in reports, NULL when none */
	char *file;
	long line;
} hl_match_rule;

/* Matches between streams tagged with different plant areas. */
typedef enum {
	HL_AREAS_ALLOW = 0,
	HL_AREAS_FORBID = 1,
	HL_AREAS_PENALISE = 2 /* each cross-area unit costs area_penalty units */
} hl_area_policy;

/* One unit of an existing network (audit stage), in the order it meets
 * each stream from its supply end. hot or cold may name a utility. */
typedef struct {
	char *name;
	char *hot;
	char *cold;
	double duty;                  /* kW */
	double hot_in, hot_out;       /* °C, NaN when not given */
	double cold_in, cold_out;     /* °C, NaN when not given */
	double area;                  /* m², NaN when not given */
	int shells;                   /* 0 when not given */
	int type_given;               /* 1: type below was given */
	int type;                     /* hl_exchanger_type */
	char *file;
	long line;
} hl_unit;

/* Settings with their defaults (hl_settings_default). */
typedef struct {
	double dtmin;        /* K, 10 */
	double emat;         /* K, exchanger minimum approach, NaN = dtmin */
	double hours;        /* operating hours per year, 8000 */
	double h_default;    /* kW/(m²·K) for streams without h, 0.5 */
	double fmin;         /* F floor, 0.80 */
	double xp;           /* fraction of the maximum P per shell, 0.9 */
	double cost_a;       /* process units' cost per shell: a + b·A^c
				(currency, m²); shell-and-tube and
				counterflow laws default to it */
	double cost_b;
	double cost_c;
	double repipe_cost;  /* retrofit: fixed cost of a re-pipe, NaN = the
				illustrative default (rfit.h) */
	double unit_cost;    /* retrofit: fixed cost of a new unit on top of
				its shells, NaN = the illustrative default */
	double interest;     /* per year, 0.10 */
	double life;         /* years, 10 */
	double cp_tol;       /* default relative cp uncertainty, 0.05 */
	double t_tol;        /* default temperature uncertainty, K, 1.0 */
	double time_limit;   /* s per MILP subnetwork, 10 */
	hl_exchanger_type exchanger; /* process units and utilities without one */
	hl_exchanger_law law[HL_EXCH_NTYPES]; /* per type */
	int kind_type[2];    /* default type of the units on a utility of
				each kind (HL_HOT: heaters, HL_COLD:
				coolers) that names none; -1: exchanger */
	hl_area_policy area_policy; /* HL_AREAS_ALLOW */
	double area_penalty; /* units per cross-area match, 1 */
	/* Limits of the least-cost design (0: none): */
	int no_splits;       /* 1: no stream splits */
	int max_branches;    /* most branches per split */
	int max_shells;      /* most shells in series per unit */
	double min_duty;     /* kW, smallest unit */
	double min_area;     /* m², smallest unit */
	char *currency;      /* label only, "EUR" by default */
	unsigned given;      /* HL_GIVEN_* bits: what the case file sets (a
				value it sets may equal the default) */
} hl_settings;

/* Bits of hl_settings.given, one per setting a case file can give. */
enum {
	HL_GIVEN_DTMIN = 1u << 0, HL_GIVEN_EMAT = 1u << 1,
	HL_GIVEN_HOURS = 1u << 2, HL_GIVEN_H_DEFAULT = 1u << 3,
	HL_GIVEN_FMIN = 1u << 4, HL_GIVEN_XP = 1u << 5,
	HL_GIVEN_INTEREST = 1u << 6, HL_GIVEN_LIFE = 1u << 7,
	HL_GIVEN_CP_TOL = 1u << 8, HL_GIVEN_T_TOL = 1u << 9,
	HL_GIVEN_TIME_LIMIT = 1u << 10, HL_GIVEN_EXCHANGER = 1u << 11,
	HL_GIVEN_CURRENCY = 1u << 12, HL_GIVEN_COST = 1u << 13,
	HL_GIVEN_MIN_DUTY = 1u << 14
};

typedef struct {
	hl_settings set;
	size_t nstream, stream_cap;
	hl_stream *stream;
	size_t nutil, util_cap;
	hl_utility *util;
	size_t nrule, rule_cap;
	hl_match_rule *rule;
	size_t nunit, unit_cap;
	hl_unit *unit;           /* existing network, empty when none */
	size_t ntyped, typed_cap;
	hl_type_rule *typed;     /* exchanger type per pair, empty when none */
	size_t nnosplit;
	char **nosplit;          /* streams the design must not split (names
				    as given; resolved by their user) */
	long *nosplit_line;
	char *source;        /* the file the case came from */
} hl_case;

void hl_settings_default(hl_settings *set);
/* Only the per-type laws (set->law) to their illustrative defaults. */
void hl_settings_default_laws(hl_settings *set);

hl_case *hl_case_create(void);
void hl_case_free(hl_case *c);

/* Append a stream (deep copy); returns HL_EIO on allocation failure. */
hl_status hl_case_add_stream(hl_case *c, const hl_stream *s, hl_error *err);
/* Append a utility (deep copy). */
hl_status hl_case_add_utility(hl_case *c, const hl_utility *u, hl_error *err);

/* Append a match rule (deep copy). */
hl_status hl_case_add_rule(hl_case *c, const hl_match_rule *r, hl_error *err);
/* The type of the units on utility u: its own, else its kind's default
 * (set->kind_type), else -1 (the settings' exchanger). */
int hl_utility_type(const hl_settings *set, const hl_utility *u);

/* Append an exchanger type rule (deep copy). */
hl_status hl_case_add_type_rule(hl_case *c, const hl_type_rule *r,
				hl_error *err);

/* Exchanger type of a unit between hot and cold (names of streams or
 * utilities): the first type rule naming both, else the first naming one
 * with "*" for the other, else the utility's type (a utility side), else
 * the case's exchanger setting. */
hl_exchanger_type hl_case_pair_type(const hl_case *c, const char *hot,
				    const char *cold);

/* Append a unit of the existing network (deep copy). */
hl_status hl_case_add_unit(hl_case *c, const hl_unit *u, hl_error *err);

/* Drop the existing network (to replace it by another table). */
void hl_case_clear_units(hl_case *c);

/* Check the whole case: names unique across streams and utilities, numbers in
 * range, segments chained. Errors name the file and line of the offender. */
hl_status hl_case_validate(const hl_case *c, hl_error *err);

/* Heat of one segment, kW: its latent heat, or cp times its span. */
double hl_segment_duty(const hl_segment *g);
/* 1 when the segment is latent heat at one temperature. */
int hl_segment_latent(const hl_segment *g);
/* 1 when some stream of c has a latent segment. */
int hl_case_has_latent(const hl_case *c);

/* A copy of c in which every latent segment at T is spread over span K
 * towards the stream's supply end (hot: T + span → T; cold: T − span → T)
 * with cp = latent / span, the segment before it giving up that span and
 * keeping its heat, so that a stage that works along temperatures (matches,
 * placement, sizing, supertargets, sensitivity, the audit) can take it.
 * Heat on the target side of T does not move: a pinch at a latent
 * temperature stays where it is. NULL when out of memory. */
hl_case *hl_case_spread_latent(const hl_case *c, double span);
#define HL_LATENT_SPAN 1e-2  /* K: below any reported precision, and
				 cp = latent / span stays within the
				 accuracy of the placement's temperatures */

/* Totals over a stream: duty (kW, > 0), first supply, last target. */
double hl_stream_duty(const hl_stream *s);
double hl_stream_supply(const hl_stream *s);
double hl_stream_target(const hl_stream *s);

/* Heat (kW) of stream s between its supply end and temperature t along its
 * segments; beyond its ends the end segments' cp carries on (negative
 * before the supply end). hl_stream_temp_at is its inverse: the temperature
 * q kW from the supply end. */
double hl_stream_heat_at(const hl_stream *s, double t);
double hl_stream_temp_at(const hl_stream *s, double q);

/* The shift applied to a stream's temperatures (K): its own contribution, or
 * half of dtmin; hot streams move down, cold streams up. */
double hl_stream_shift(const hl_stream *s, double dtmin);
double hl_utility_shift(const hl_utility *u, double dtmin);

/* Find a stream or utility by name (case-sensitive); -1 when absent. */
long hl_case_find_stream(const hl_case *c, const char *name);
long hl_case_find_utility(const hl_case *c, const char *name);

/* Bounds a sane value must respect; outside them a number is taken as a unit
 * mistake. */
#define HL_T_MIN (-273.15)   /* °C, absolute zero */
#define HL_T_MAX 2000.0      /* °C, above any process stream or flue gas */
#define HL_CP_MAX 1.0e6      /* kW/K, far above a site's largest stream */
#define HL_H_MAX 1.0e3       /* kW/(m²·K) */

#endif
