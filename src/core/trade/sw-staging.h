/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-staging.h: the staging decision.  For one to six serial stages (stage k
 * taking the keys of design stage min(k, n - 1), the rule of the stage-count
 * curve), each sized with the design's split, payload and delta-v:
 *   - liftoff mass, expendable and with the first stage recovered;
 *   - development effort and cost per flight (sw-cost.h), expendable and reused;
 *   - mission success probability (sw-reliability.h), when the design has
 *     reliability keys;
 *   - payload of a vehicle of the design's own liftoff mass with that stage
 *     count (a fixed-size vehicle, sw-fixed-vehicle.h);
 *   - a score under the design's weighting: each criterion divided by its
 *     best value over the feasible stage counts, times its weight, summed;
 *     the lowest score is the best stage count.
 * Fixed propellant loads are not applied (fixed_note says so).
 * Boosters are not modelled yet: a row is a serial vehicle.  The row type
 * has room for the vehicle's arrangement so that booster rows can be added. */
#pragma once

#include "sw-cost.h"
#include "sw-design.h"
#include "sw-reuse.h"
#include "sw-types.h"

G_BEGIN_DECLS

#define SW_STAGING_MAX_STAGES 6
#define SW_STAGING_WEIGHTING_MAX 320

typedef enum {
  SW_ARRANGEMENT_SERIAL,          /* stages one above the other */
} SwArrangement;

typedef struct {
  guint    n_stages;
  SwArrangement arrangement;
  gboolean feasible;                     /* the expendable vehicle closes */
  gboolean reused_feasible;              /* the vehicle with recovery closes */
  char     reason[SW_REASON_MAX];        /* "" when feasible */
  double   liftoff_mass_kg;              /* NAN when infeasible, as every figure below */
  double   liftoff_mass_reused_kg;
  double   payload_penalty_fraction;     /* recovery, at the same liftoff mass */
  double   development_work_years;
  double   development_reused_work_years;
  double   cost_per_flight_work_years;
  double   cost_per_flight_reused_work_years;
  double   success_probability;          /* NAN without reliability keys */
  double   payload_fixed_size_kg;        /* at the design's liftoff mass */
  double   score;                        /* lower is better */
} SwStagingRow;

typedef struct {
  guint    n_rows;                       /* stage counts 1..n_rows */
  SwStagingRow rows[SW_STAGING_MAX_STAGES];
  guint    design_stages;                /* the design's own stage count */
  guint    design_row;                   /* the stage count of the row that is this
                                          * design; 0 when no row is (a design with
                                          * strap-on boosters: every row is serial) */
  int      best;                         /* index of the best row, -1 if none closes */
  SwRecoveryMode reuse_mode;             /* the design's, or downrange when expendable */
  gboolean design_reuses;                /* the design recovers its first stage */
  gboolean reliability_given;
  double   design_liftoff_mass_kg;       /* NAN when the design does not close */
  double   weight_liftoff_mass;
  double   weight_development;
  double   weight_cost_per_flight;
  double   weight_failure;
  gboolean has_money;
  double   work_year_cost;               /* NAN unless has_money */
  char     weighting[SW_STAGING_WEIGHTING_MAX]; /* the weighting, stated in words */
  /* A design with a fixed propellant load (propellant_kg): every row, the
   * design's own count and the recovered columns included, sizes every
   * stage (the stage-count curve's rule); these say so plainly ("" when the
   * design has no fixed load).  fixed_note: the stage counts; reuse_note:
   * the recovered columns (sw-reuse.h resizes every stage too). */
  char     fixed_note[SW_REASON_MAX];
  char     reuse_note[SW_REASON_MAX];
} SwStaging;

/* The decision table for 1..@max_stages (clamped to 1..6).  FALSE (with
 * @error) only when the design's mission has no delta-v. */
gboolean sw_staging_compute (const SwDesign *design, guint max_stages, SwStaging *out,
                             GError **error);

G_END_DECLS
