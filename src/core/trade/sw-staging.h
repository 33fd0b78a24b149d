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
 * Fixed propellant loads of the stages are not applied (fixed_note says so).
 *
 * A design with strap-on boosters has two sets of rows: the serial rows
 * (1..n stages, no boosters) and the booster rows (1..n stages as core and
 * upper stages with the design's boosters beside the core, sized as
 * sw_size_design sizes the design: sw_size_parallel, the boosters' fixed
 * load kept, the stage-count curve's rule for the stages).  The booster row
 * of the design's stage count is this design (design_index).  Booster rows:
 *   - costs include the boosters (sw-cost.h);
 *   - the payload of the fixed-size vehicle is the root of the sizing
 *     (sw_parallel_payload_at_mass, GSL Brent), not the linear ratio;
 *   - mission success counts the boosters as perfect (they have no
 *     reliability keys), so it is the serial figure of the same stages;
 *   - the recovered columns recover the core (stage 1) as a serial first
 *     stage is recovered, and the boosters when the design recovers them
 *     (economics "booster_mode"), else expend them (sw_reuse_compute_parallel);
 *     a design that recovers its boosters only has its core expended there
 *     (and its serial rows' recovered columns equal the expendable ones).
 * The sizing is the rocket equation; the thrust is checked after it: a row
 * whose liftoff weight the design's thrust (first stage, vacuum, and the
 * boosters in a booster row) does not exceed is no candidate for the best
 * row, and the weighting says so; without its boosters the core may not
 * lift a serial row, and boosters_note then says so with the core's vacuum
 * thrust over the serial rows' liftoff weight.
 * The score divides each criterion by its best value over every row that
 * closes, serial and with boosters alike, so both sets are weighed on the
 * same criteria and the best row is the lowest sum over both. */
#pragma once

#include "sw-curves.h"
#include "sw-cost.h"
#include "sw-design.h"
#include "sw-reuse.h"
#include "sw-types.h"

G_BEGIN_DECLS

#define SW_STAGING_MAX_STAGES 6
#define SW_STAGING_MAX_ROWS (2 * SW_STAGING_MAX_STAGES)
#define SW_STAGING_WEIGHTING_MAX 320

typedef enum {
  SW_ARRANGEMENT_SERIAL,          /* stages one above the other */
  SW_ARRANGEMENT_BOOSTERS,        /* core and upper stages with the design's boosters */
} SwArrangement;

typedef struct {
  guint    n_stages;
  SwArrangement arrangement;
  gboolean feasible;                     /* the expendable vehicle closes */
  gboolean reused_feasible;              /* the vehicle with recovery closes */
  char     reason[SW_REASON_MAX];        /* "" when feasible */
  char     reused_reason[SW_REASON_MAX]; /* why the recovered vehicle does not close; "" */
  double   liftoff_mass_kg;              /* NAN when infeasible, as every figure below */
  double   liftoff_mass_reused_kg;
  double   payload_penalty_fraction;     /* recovery, at the same liftoff mass */
  double   recovery_propellant_kg;       /* the recovered first stage's; NAN when it is
                                          * expended in the recovered columns */
  double   booster_recovery_propellant_kg; /* per recovered booster; NAN otherwise */
  double   development_work_years;
  double   development_reused_work_years;
  double   cost_per_flight_work_years;
  double   cost_per_flight_reused_work_years;
  double   success_probability;          /* NAN without reliability keys */
  double   payload_fixed_size_kg;        /* at the design's liftoff mass */
  double   score;                        /* lower is better */
  /* The design's liftoff thrust (the first stage's vacuum thrust, and the
   * boosters' in a booster row) over the row's liftoff weight; NAN when the
   * design gives no first-stage thrust or the row does not close.  A row
   * below 1 cannot leave the pad with that thrust: it is no candidate for
   * the best row. */
  double   liftoff_thrust_to_weight;
  /* A booster row whose sized boosters the optimum leaves empty: the row
   * does not close (it is no vehicle with boosters, see sw-booster-sizing.h)
   * and boosters_note names its stage count. */
  gboolean boosters_optimised_away;
} SwStagingRow;

typedef struct {
  guint    n_rows;                       /* every row: the serial rows, then the
                                          * booster rows (a design with boosters) */
  guint    n_counts;                     /* stage counts 1..n_counts in each set */
  SwStagingRow rows[SW_STAGING_MAX_ROWS];
  guint    design_stages;                /* the design's own stage count */
  guint    design_row;                   /* the stage count of the row that is this
                                          * design (its arrangement below) */
  SwArrangement design_arrangement;      /* boosters for a design with boosters */
  int      design_index;                 /* index of that row; -1 beyond n_counts */
  guint    booster_count;                /* the design's boosters; 0: serial rows only */
  int      best;                         /* index of the best row, -1 if none closes */
  SwRecoveryMode reuse_mode;             /* the first stage's in the recovered columns: the
                                          * design's; downrange for a design that recovers
                                          * nothing; none for one that recovers its boosters
                                          * only */
  SwRecoveryMode booster_reuse_mode;     /* the boosters' in the recovered columns: the
                                          * design's (none without boosters) */
  gboolean design_reuses;                /* the design recovers its first stage or boosters */
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
  char     fixed_note[SW_FIXED_NOTE_MAX];
  char     reuse_note[SW_REASON_MAX];
  /* With boosters: which rows are which, and what the booster rows leave
   * out (the boosters' reliability); that no row checks the thrust, with
   * the core's thrust-to-weight at liftoff when it lifts not every serial
   * row; "" without boosters. */
  char     boosters_note[4 * SW_REASON_MAX];
  /* With boosters: the core's vacuum thrust over the liftoff weight of the
   * serial rows that close, least and most; NAN otherwise. */
  double   core_thrust_to_weight_min;
  double   core_thrust_to_weight_max;
  /* A design whose losses come from the simulated ascent: which losses
   * every row is sized with (no ascent is flown for a row).  From
   * sw_staging_compute, the first-guess allowance (its own row may then
   * differ from the closed loop's sizing); from sw_staging_compute_looped,
   * the closed loop's losses of the design's own vehicle (its own row is
   * the closed loop's sizing); "" otherwise. */
  char     losses_note[SW_REASON_MAX];
} SwStaging;

/* The row of @n_stages in @arrangement, or NULL. */
const SwStagingRow *sw_staging_row (const SwStaging *staging, SwArrangement arrangement,
                                    guint n_stages);
/* The rows that close expendable but have no recovered figures, and why,
 * in one sentence each for the views; NULL when there is none. */
char *sw_staging_dup_unrecovered_note (const SwStaging *staging);

/* This design's payload penalty of recovery, in one sentence for the views
 * ("Recovered (first stage lands downrange), this design's vehicle carries
 * 10.9 % less payload at the same liftoff mass."); NULL without a figure. */
char *sw_staging_dup_penalty_note (const SwStaging *staging);

/* What the recovered columns recover, in words for the views ("first stage
 * lands downrange, boosters expended"; the boosters named only when the
 * design has some); translated, owned. */
char       *sw_staging_dup_recovery_words (const SwStaging *staging);
/* "serial" or "boosters", the CLI's and the CSV's word. */
const char *sw_arrangement_to_string (SwArrangement arrangement);

/* The decision table for 1..@max_stages (clamped to 1..6).  FALSE (with
 * @error) only when the design's mission has no delta-v. */
gboolean sw_staging_compute (const SwDesign *design, guint max_stages, SwStaging *out,
                             GError **error);
/* The same for a design made the closed loop's vehicle (a copy given the
 * loop's losses and fairing point by sw_ascent_apply_loop, as the analysis
 * does for its trade studies: sw_analysis_staging); only the losses note
 * differs.  This design's row is then the closed loop's sizing. */
gboolean sw_staging_compute_looped (const SwDesign *looped, guint max_stages, SwStaging *out,
                                    GError **error);

G_END_DECLS
