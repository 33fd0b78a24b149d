/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-economics.h: the optional design-level "economics" object: the cost
 * model's coefficients, the production run, the cost of a work-year, which
 * stages share an engine and which elements are already developed, the
 * recovery of the first stage and the weighting of the stage-count decision.
 *
 *   "economics": {
 *     "work_year_cost": 300000, "currency": "kEUR",
 *     "production_run": 20, "learning_rate": 0.9,
 *     "cost_coefficients": { "stage_development_factor": 100, ... },
 *     "engine_types": [ { "name": "E1", "dry_mass_kg": 1200,
 *                         "on_stages": [0, 1], "developed": false } ],
 *     "developed_stages": [ 2 ], "developed_boosters": false,
 *     "engine_mass_fraction": 0.25,
 *     "recovery": { "mode": "downrange", "recovery_delta_v_m_s": 950,
 *                   "landing_hardware_fraction": 0.1,
 *                   "refurbishment_fraction": 0.1, "flights_per_stage": 10,
 *                   "booster_mode": "downrange",
 *                   "booster_recovery_delta_v_m_s": 950 },
 *     "decision_weights": { "liftoff_mass": 1, "development": 1,
 *                           "cost_per_flight": 1, "failure": 1 }
 *   }
 *
 * "booster_mode" recovers the strap-on boosters ("expendable", the default,
 * "downrange" or "launch_site"), independently of the first stage's "mode";
 * "booster_recovery_delta_v_m_s" is their recovery delta-v, left out the
 * same defaults per mode as the first stage's (from memory).  The boosters
 * share the landing hardware fraction, the refurbishment fraction and the
 * flights per stage with the first stage.
 *
 * Stage indices are 0-based, as in the error paths (stages[0] lifts off).
 * Every key is optional; left out, the defaults below apply.  The cost model
 * that reads these values is trade/sw-cost.h; the recovery model
 * trade/sw-reuse.h. */
#pragma once

#include <json-glib/json-glib.h>

#include "sw-limits.h"
#include "sw-types.h"

G_BEGIN_DECLS

#define SW_ECONOMICS_MAX_ENGINE_TYPES SW_MAX_STAGES
/* Bytes of the currency label, room for its limit in characters. */
#define SW_ECONOMICS_CURRENCY_BYTES 72

/* The coefficients of the cost model, in one table (sw_cost_coefficient_info). */
typedef enum {
  SW_CER_STAGE_DEV_FACTOR,
  SW_CER_STAGE_DEV_EXPONENT,
  SW_CER_STAGE_UNIT_FACTOR,
  SW_CER_STAGE_UNIT_EXPONENT,
  SW_CER_ENGINE_DEV_FACTOR,
  SW_CER_ENGINE_DEV_EXPONENT,
  SW_CER_ENGINE_UNIT_FACTOR,
  SW_CER_ENGINE_UNIT_EXPONENT,
  SW_CER_SYSTEMS_BASE,
  SW_N_CER
} SwCerId;

typedef struct {
  const char *key;         /* key in "cost_coefficients" */
  double      value;       /* default */
  const char *provenance;  /* "published form, coefficient from memory", ... */
  SwLimitId   limit;
} SwCerInfo;

typedef enum {
  SW_RECOVERY_NONE,          /* expendable */
  SW_RECOVERY_DOWNRANGE,     /* entry and landing burns, landing downrange */
  SW_RECOVERY_LAUNCH_SITE,   /* a boost-back burn added, landing at the launch site */
} SwRecoveryMode;

typedef struct {
  char     name[SW_NAME_MAX];
  double   dry_mass_kg;      /* one engine */
  guint32  stage_mask;       /* bit i: stage i uses this engine */
  gboolean developed;        /* already developed: no development effort */
} SwEngineType;

typedef struct {
  gboolean present;               /* the object was given */
  gboolean has_work_year_cost;
  double   work_year_cost;        /* money per work-year; valid when has_work_year_cost */
  char     currency[SW_ECONOMICS_CURRENCY_BYTES]; /* label of the money unit, "" none */
  guint    production_run;        /* vehicles built */
  double   learning_rate;         /* S: unit cost falls to S per doubling */
  double   coefficients[SW_N_CER];
  guint64  coefficients_set;      /* bit i: coefficient i given in the file */
  guint    n_engine_types;
  SwEngineType engine_types[SW_ECONOMICS_MAX_ENGINE_TYPES];
  guint32  developed_stages;      /* bit i: stage i already developed */
  gboolean developed_boosters;    /* the strap-on boosters (and their engine) already
                                   * developed; no effect without boosters */
  double   engine_mass_fraction;  /* engines' share of a stage's dry mass, no engine type */
  SwRecoveryMode recovery_mode;
  gboolean has_recovery_delta_v;
  double   recovery_delta_v_m_s;  /* valid when has_recovery_delta_v */
  double   landing_hardware_fraction;
  double   refurbishment_fraction;
  guint    flights_per_stage;
  SwRecoveryMode booster_recovery_mode;   /* the strap-on boosters' */
  gboolean has_booster_recovery_delta_v;
  double   booster_recovery_delta_v_m_s;  /* valid when has_booster_recovery_delta_v */
  double   weight_liftoff_mass;
  double   weight_development;
  double   weight_cost_per_flight;
  double   weight_failure;
} SwEconomics;

/* Defaults (each labelled where it is defined). */
#define SW_ECONOMICS_DEFAULT_PRODUCTION_RUN 10
#define SW_ECONOMICS_DEFAULT_LEARNING_RATE 0.90
#define SW_ECONOMICS_DEFAULT_ENGINE_MASS_FRACTION 0.25
#define SW_ECONOMICS_DEFAULT_DOWNRANGE_DELTA_V 950.0
#define SW_ECONOMICS_DEFAULT_LAUNCH_SITE_DELTA_V 2750.0
#define SW_ECONOMICS_DEFAULT_LANDING_HARDWARE 0.10
#define SW_ECONOMICS_DEFAULT_REFURBISHMENT 0.10
#define SW_ECONOMICS_DEFAULT_FLIGHTS 10

extern const char *const sw_economics_design_keys[];

const SwCerInfo *sw_cer_info (SwCerId id);

/* Fills in the defaults: published-form coefficients, 10 vehicles, S = 0.9,
 * expendable, equal weights, no cost per work-year. */
void     sw_economics_init (SwEconomics *econ);
/* The recovery delta-v in force: the given one, or the mode's default. */
double   sw_economics_recovery_delta_v (const SwEconomics *econ);
/* The same for the boosters (booster_mode, booster_recovery_delta_v_m_s);
 * 0 when they are expendable and no delta-v is given. */
double   sw_economics_booster_recovery_delta_v (const SwEconomics *econ);
/* The engine type stage @stage uses, or -1. */
int      sw_economics_engine_type_of_stage (const SwEconomics *econ, guint stage);

const char *sw_recovery_mode_to_string (SwRecoveryMode mode);
gboolean    sw_recovery_mode_from_string (const char *text, SwRecoveryMode *mode);

/* The numeric keys, for the window's fields and their named edit. */
typedef enum {
  SW_ECON_WORK_YEAR_COST,
  SW_ECON_PRODUCTION_RUN,
  SW_ECON_LEARNING_RATE,
  SW_ECON_CER_FIRST,                  /* + SwCerId, SW_N_CER of them */
  SW_ECON_ENGINE_MASS_FRACTION = SW_ECON_CER_FIRST + SW_N_CER,
  SW_ECON_RECOVERY_DELTA_V,
  SW_ECON_BOOSTER_RECOVERY_DELTA_V,
  SW_ECON_LANDING_HARDWARE,
  SW_ECON_REFURBISHMENT,
  SW_ECON_FLIGHTS_PER_STAGE,
  SW_ECON_WEIGHT_LIFTOFF_MASS,
  SW_ECON_WEIGHT_DEVELOPMENT,
  SW_ECON_WEIGHT_COST_PER_FLIGHT,
  SW_ECON_WEIGHT_FAILURE,
  SW_N_ECON_NUMBERS
} SwEconNumber;

SwLimitId sw_economics_number_limit (SwEconNumber key);
/* The JSON path below "economics" ("recovery.flights_per_stage"). */
const char *sw_economics_number_path (SwEconNumber key);
gboolean sw_economics_number_is_whole (SwEconNumber key);
/* The value in force (the mode's default recovery delta-v when none is set). */
double   sw_economics_get_number (const SwEconomics *econ, SwEconNumber key);
/* The named edit: sets the key (whole numbers for whole keys), marks the
 * object present; FALSE, nothing changed, when @value is outside its limit. */
gboolean sw_economics_set_number (SwEconomics *econ, SwEconNumber key, double value);
/* The named edit of the currency label: FALSE (with @error naming the key),
 * nothing changed, when @text is longer than its limit or holds a control
 * character.  "" leaves the label out. */
gboolean sw_economics_set_currency (SwEconomics *econ, const char *text, GError **error);
/* The label to print beside money: the design's currency, or a neutral
 * "money units" (translated) when it has none. */
const char *sw_economics_currency_label (const SwEconomics *econ);
/* The one caution printed wherever money is shown. */
const char *sw_economics_money_note (void);
/* The named edit of the recovery mode. */
void     sw_economics_set_recovery_mode (SwEconomics *econ, SwRecoveryMode mode);
/* The named edit of the boosters' recovery mode. */
void     sw_economics_set_booster_recovery_mode (SwEconomics *econ, SwRecoveryMode mode);

gboolean sw_economics_load_design (JsonObject *root, const char *file, const char *prefix,
                                   SwEconomics *econ, GPtrArray *warnings, GError **error);
void     sw_economics_save_design (JsonBuilder *builder, const SwEconomics *econ);
/* Range checks in memory; @n_stages bounds the stage indices. */
gboolean sw_economics_validate (const SwEconomics *econ, guint n_stages, const char *file,
                                const char *prefix, GError **error);

G_END_DECLS
