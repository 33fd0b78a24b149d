/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-limits.h: the one table of accepted input ranges, read by the loader,
 * the GUI's fields and the README generator alike. */
#pragma once

#include "sw-types.h"

G_BEGIN_DECLS

typedef enum {
  SW_LIMIT_PAYLOAD,
  SW_LIMIT_DELTA_V,
  SW_LIMIT_ALTITUDE,
  SW_LIMIT_INCLINATION,
  SW_LIMIT_SITE_LATITUDE,
  SW_LIMIT_LOSSES,
  SW_LIMIT_ISP_VAC,
  SW_LIMIT_ISP_SL,
  SW_LIMIT_STRUCTURAL_COEFFICIENT,
  SW_LIMIT_DELTA_V_SHARE,
  SW_LIMIT_STAGE_COUNT,
  SW_LIMIT_NAME_LENGTH,
  SW_LIMIT_NOTES_LENGTH,
  /* reliability model (per stage) */
  SW_LIMIT_ENGINE_COUNT,
  SW_LIMIT_ENGINE_RELIABILITY,
  SW_LIMIT_ENGINE_FAILURES_TOLERATED,
  SW_LIMIT_IGNITION_RELIABILITY,
  SW_LIMIT_SEPARATION_RELIABILITY,
  /* uncertainty model (design level) */
  SW_LIMIT_MC_SAMPLES,
  SW_LIMIT_MC_SEED,
  SW_LIMIT_SPREAD_SIGMA_PERCENT,
  SW_LIMIT_SPREAD_HALF_RANGE_PERCENT,
  SW_LIMIT_LOSSES_SIGMA,
  SW_LIMIT_LOSSES_HALF_RANGE,
  SW_LIMIT_SENSITIVITY_STEP,
  /* ascent model: propulsion and aerodynamics (per stage) */
  SW_LIMIT_THRUST_VAC,
  SW_LIMIT_ENGINE_THRUST_VAC,
  SW_LIMIT_DIAMETER,
  SW_LIMIT_DRAG_POINTS,
  SW_LIMIT_DRAG_MACH,
  SW_LIMIT_DRAG_CD,
  SW_LIMIT_COAST,
  /* ascent model (design level, "ascent" object) */
  SW_LIMIT_FAIRING_MASS,
  SW_LIMIT_FAIRING_ALTITUDE,
  SW_LIMIT_FAIRING_DYNAMIC_PRESSURE,
  SW_LIMIT_PITCH_OVER_SPEED,
  SW_LIMIT_PITCH_KICK,
  SW_LIMIT_INSERTION_ALTITUDE,
  SW_LIMIT_MAX_Q_ALPHA,
  /* economics: cost model, reuse, stage-count decision (design level) */
  SW_LIMIT_WORK_YEAR_COST,
  SW_LIMIT_PRODUCTION_RUN,
  SW_LIMIT_LEARNING_RATE,
  SW_LIMIT_CER_STAGE_DEV_FACTOR,
  SW_LIMIT_CER_STAGE_DEV_EXPONENT,
  SW_LIMIT_CER_STAGE_UNIT_FACTOR,
  SW_LIMIT_CER_STAGE_UNIT_EXPONENT,
  SW_LIMIT_CER_ENGINE_DEV_FACTOR,
  SW_LIMIT_CER_ENGINE_DEV_EXPONENT,
  SW_LIMIT_CER_ENGINE_UNIT_FACTOR,
  SW_LIMIT_CER_ENGINE_UNIT_EXPONENT,
  SW_LIMIT_CER_SYSTEMS_BASE,
  SW_LIMIT_ENGINE_TYPES,
  SW_LIMIT_ENGINE_DRY_MASS,
  SW_LIMIT_ECON_STAGE_INDEX,
  SW_LIMIT_ENGINE_MASS_FRACTION,
  SW_LIMIT_RECOVERY_DELTA_V,
  SW_LIMIT_BOOSTER_RECOVERY_DELTA_V,
  SW_LIMIT_LANDING_HARDWARE,
  SW_LIMIT_REFURBISHMENT,
  SW_LIMIT_FLIGHTS_PER_STAGE,
  SW_LIMIT_DECISION_WEIGHT,
  SW_LIMIT_CURRENCY_LENGTH,
  /* propellant and fixed loads (per stage, format version 2) */
  SW_LIMIT_PROPELLANT_LOAD,
  SW_LIMIT_MIXTURE_RATIO,
  SW_LIMIT_ULLAGE,
  SW_LIMIT_COMPONENT_DENSITY,
  SW_LIMIT_PROPELLANT_NAME_LENGTH,
  /* strap-on boosters (design level, format version 2) */
  SW_LIMIT_BOOSTER_COUNT,
  SW_N_LIMITS
} SwLimitId;

struct _SwLimit {
  const char *key;     /* JSON key (last path component) */
  const char *unit;    /* unit as shown to users, "" when dimensionless */
  double      min;
  double      max;
  gboolean    min_exclusive;
  const char *why;     /* one line: why this range */
};

const SwLimit *sw_limit_get (SwLimitId id);
gboolean       sw_limit_contains (SwLimitId id, double value);
/* Markdown table of every limit, for the README. */
char          *sw_limits_dup_markdown (void);

G_END_DECLS
