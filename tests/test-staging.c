/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Tests of the staging decision: every column against the module that owns
 * that figure, and the payload of the fixed-size vehicle against the
 * fixed-vehicle root finder (GSL Brent), an independent route. */
#include "config.h"

#include "sw-booster-sizing.h"
#include "sw-cost.h"
#include "sw-curves.h"
#include "sw-design.h"
#include "sw-fixed-vehicle.h"
#include "sw-format.h"
#include "sw-reliability.h"
#include "sw-staging.h"

#include <math.h>
#include <string.h>

static const char *design_json =
  "{ \"format\": \"stagewright-design\", \"version\": 1, \"name\": \"staging test\",\n"
  "  \"payload_kg\": 2000, \"mission\": { \"delta_v_m_s\": 9300 }, \"split\": \"optimal\",\n"
  "  \"stages\": [\n"
  "    { \"name\": \"A\", \"isp_vac_s\": 310, \"structural_coefficient\": 0.06,\n"
  "      \"engine_count\": 9, \"engine_reliability\": 0.995, \"engine_failures_tolerated\": 1,\n"
  "      \"ignition_reliability\": 0.999, \"separation_reliability\": 0.9995 },\n"
  "    { \"name\": \"B\", \"isp_vac_s\": 345, \"structural_coefficient\": 0.09,\n"
  "      \"engine_reliability\": 0.993, \"ignition_reliability\": 0.998 } ],\n"
  "  \"economics\": { \"production_run\": 30, \"work_year_cost\": 200000,\n"
  "    \"engine_types\": [ { \"name\": \"E1\", \"dry_mass_kg\": 900, \"on_stages\": [0, 1] } ],\n"
  "    \"recovery\": { \"mode\": \"downrange\" } } }";

static SwDesign *
load (const char *json)
{
  g_autoptr (GError) error = NULL;
  SwDesign *d = sw_design_load_data (json, -1, "test.stagewright", NULL, &error);

  g_assert_no_error (error);
  return d;
}

static void
test_columns (void)
{
  g_autoptr (SwDesign) d = load (design_json);
  SwStaging s;
  SwStageCurve curve;
  SwReliabilityCurve rel;
  SwSizing own;
  g_autoptr (GError) error = NULL;

  g_assert_true (sw_staging_compute (d, 6, &s, &error));
  g_assert_no_error (error);
  g_assert_cmpuint (s.n_rows, ==, 6);
  g_assert_true (s.design_reuses);
  g_assert_true (s.reliability_given);
  sw_stage_curve_compute (d, 9300.0, 6, &curve);
  sw_reliability_curve_compute (d, 6, &rel);
  g_assert_true (sw_size_design (d, &own, NULL));
  for (guint i = 0; i < 6; i++)
    {
      const SwStagingRow *row = &s.rows[i];

      g_assert_cmpuint (row->n_stages, ==, i + 1);
      g_assert_cmpint (row->feasible, ==, curve.points[i].feasible);
      if (!row->feasible)
        {
          g_assert_true (isnan (row->liftoff_mass_kg));
          g_assert_true (isnan (row->score));
          /* No mission flown, so no success figure. */
          g_assert_true (isnan (row->success_probability));
          continue;
        }
      g_assert_cmpfloat_with_epsilon (row->liftoff_mass_kg / curve.points[i].liftoff_mass_kg, 1.0,
                                      1e-12);
      g_assert_cmpfloat_with_epsilon (row->success_probability, rel.mission[i], 1e-15);
      /* Recovery costs liftoff mass; from five stages up the split gives
       * the recovered first stage no delta-v at all, and such a vehicle has
       * no first stage to recover: no recovered figures, and why. */
      if (i < 4)
        g_assert_cmpfloat (row->liftoff_mass_reused_kg, >, row->liftoff_mass_kg);
      else
        {
          g_assert_false (row->reused_feasible);
          g_assert_nonnull (strstr (row->reused_reason, "optimised away"));
          g_assert_true (isnan (row->score));
        }
      g_assert_cmpfloat (row->development_work_years, >, 0.0);
      /* The fixed-size vehicle: the row's vehicle scaled to the design's
       * liftoff mass, its payload found by the root finder. */
      {
        SwStageSet set = { 0 };
        SwSizing sz;
        SwFixedVehicle fv;
        double payload, scale = own.liftoff_mass_kg / row->liftoff_mass_kg;

        sw_stage_set_extend (&set, d, i + 1);
        sw_size (&set, d->payload_kg, 9300.0, SW_SPLIT_OPTIMAL, &sz);
        g_assert_true (sw_fixed_vehicle_from_sizing (&fv, &sz));
        for (guint k = 0; k < fv.n_stages; k++)
          {
            fv.propellant_mass_kg[k] *= scale;
            fv.structural_mass_kg[k] *= scale;
          }
        g_assert_true (sw_fixed_vehicle_payload (&fv, 9300.0, &payload));
        g_assert_cmpfloat_with_epsilon (row->payload_fixed_size_kg / payload, 1.0, 1e-6);
      }
    }
  /* The window's sentence on this design's payload penalty: the row's own
   * figure, formatted. */
  {
    g_autofree char *note = sw_staging_dup_penalty_note (&s);
    g_autofree char *pct = sw_format_percent (s.rows[s.design_index].payload_penalty_fraction, 1);

    g_assert_cmpint (s.design_index, ==, 1);
    g_assert_true (s.rows[1].payload_penalty_fraction > 0.0);
    g_assert_nonnull (note);
    g_assert_nonnull (strstr (note, pct));
    g_assert_nonnull (strstr (note, "less payload"));
  }
  /* One stage does not reach 9.3 km/s with eps 0.06 and 310 s (c ln(1/eps)
   * = 8553 m/s); two and more do. */
  g_assert_false (s.rows[0].feasible);
  g_assert_true (s.rows[1].feasible);
  /* The design's own stage count carries its own payload at its own mass. */
  g_assert_cmpfloat_with_epsilon (s.rows[1].payload_fixed_size_kg, 2000.0, 1e-9);
  /* More stages are lighter here, and less reliable. */
  g_assert_cmpfloat (s.rows[2].liftoff_mass_kg, <, s.rows[1].liftoff_mass_kg);
  g_assert_cmpfloat (s.rows[2].success_probability, <, s.rows[1].success_probability);
}

/* The best stage count under a weighting is the argmin of the criterion
 * when only that criterion is weighted. */
static void
test_best_under_weighting (void)
{
  g_autoptr (SwDesign) d = load (design_json);
  SwStaging s;
  int argmin = -1;

  d->economics.weight_development = 0.0;
  d->economics.weight_cost_per_flight = 0.0;
  d->economics.weight_failure = 0.0;
  g_assert_true (sw_staging_compute (d, 6, &s, NULL));
  for (guint i = 0; i < s.n_rows; i++)
    if (s.rows[i].feasible && s.rows[i].reused_feasible
        && (argmin < 0 || s.rows[i].liftoff_mass_kg < s.rows[argmin].liftoff_mass_kg))
      argmin = (int) i;
  g_assert_cmpint (s.best, ==, argmin);
  g_assert_cmpint (s.best, >, 1);
  g_assert_cmpstr (s.weighting, ==,
                   "Weights: liftoff mass 1; each criterion divided by its best stage count, "
                   "the lowest sum wins");

  /* Failure probability alone: the fewest feasible stages. */
  d->economics.weight_liftoff_mass = 0.0;
  d->economics.weight_failure = 1.0;
  g_assert_true (sw_staging_compute (d, 6, &s, NULL));
  g_assert_cmpint (s.best, ==, 1);
  g_assert_cmpstr (s.weighting, ==,
                   "Weights: failure probability 1; each criterion divided by its best stage "
                   "count, the lowest sum wins");

  /* The default weighting, stated. */
  d->economics.weight_liftoff_mass = d->economics.weight_development = 1.0;
  d->economics.weight_cost_per_flight = 2.0;
  g_assert_true (sw_staging_compute (d, 4, &s, NULL));
  g_assert_cmpstr (s.weighting, ==,
                   "Weights: liftoff mass 1, development effort 1, cost per flight (first stage "
                   "reused) 2, failure probability 1; each criterion divided by its best stage "
                   "count, the lowest sum wins");
  g_assert_cmpint (s.best, >=, 1);
  g_assert_true (isfinite (s.rows[s.best].score));
  for (guint i = 0; i < s.n_rows; i++)
    if (isfinite (s.rows[i].score))
      g_assert_cmpfloat (s.rows[i].score, >=, s.rows[s.best].score);
}

/* Without economics or reliability keys: expendable, downrange for the
 * reused column, no failure criterion. */
static void
test_defaults (void)
{
  g_autoptr (SwDesign) d = sw_design_new_default ();
  SwStaging s;

  g_assert_true (sw_staging_compute (d, 3, &s, NULL));
  g_assert_false (s.design_reuses);
  g_assert_cmpint (s.reuse_mode, ==, SW_RECOVERY_DOWNRANGE);
  g_assert_false (s.reliability_given);
  g_assert_true (isnan (s.rows[1].success_probability));
  g_assert_false (s.has_money);
  g_assert_cmpstr (s.weighting, ==,
                   "Weights: liftoff mass 1, development effort 1, cost per flight (expendable) "
                   "1; each criterion divided by its best stage count, the lowest sum wins");
}

/* A fixed propellant load is not applied (every row is sized): the
 * staging table says so; a design without one says nothing. */
static void
test_staging_fixed_note (void)
{
  g_autoptr (GError) error = NULL;
  g_autofree char *path = g_build_filename (g_getenv ("SW_SOURCE_ROOT"), "data", "designs",
                                            "sallowmere-kestrune-upper-stage.stagewright", NULL);
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, &error);
  SwStaging st;

  g_assert_no_error (error);
  g_assert_true (sw_staging_compute (d, 6, &st, NULL));
  g_assert_nonnull (strstr (st.fixed_note, "stage 2 (Kestrune upper stage) is not applied"));
  d->stages[1].propellant.has_propellant_kg = FALSE;
  g_assert_true (sw_staging_compute (d, 6, &st, NULL));
  g_assert_cmpstr (st.fixed_note, ==, "");
}

/* A design with strap-on boosters has its serial rows and, after them, its
 * booster rows, sized as sw_size_design sizes the design; the booster row
 * of its stage count is the design.  Each figure against the module that
 * owns it: the stage-count curve's booster points (sw-curves.c), the cost
 * model on the row's sizing (boosters included), the parallel sizing at the
 * payload the root finder gives; the serial design keeps its one set. */
static void
test_staging_booster_rows (void)
{
  g_autoptr (GError) error = NULL;
  g_autofree char *path = g_build_filename (g_getenv ("SW_SOURCE_ROOT"), "data", "designs",
                                            "four-booster-cargo.stagewright", NULL);
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, &error);
  g_autoptr (SwDesign) serial = load (design_json);
  SwStaging st;
  SwSizing own;
  SwStageCurve curve;
  SwParallelVehicle pv;
  double dv;
  int argmin = -1;

  g_assert_no_error (error);
  g_assert_cmpuint (d->boosters.count, ==, 4);
  g_assert_true (sw_staging_compute (d, 6, &st, NULL));
  g_assert_cmpuint (st.n_counts, ==, 6);
  g_assert_cmpuint (st.n_rows, ==, 12);
  g_assert_cmpuint (st.booster_count, ==, 4);
  g_assert_cmpuint (st.design_stages, ==, d->n_stages);
  g_assert_cmpuint (st.design_row, ==, d->n_stages);
  g_assert_cmpint (st.design_arrangement, ==, SW_ARRANGEMENT_BOOSTERS);
  g_assert_cmpint (st.design_index, ==, 6 + (int) d->n_stages - 1);
  g_assert_true (sw_staging_row (&st, SW_ARRANGEMENT_BOOSTERS, 2) == &st.rows[st.design_index]);
  g_assert_cmpstr (sw_arrangement_to_string (st.rows[0].arrangement), ==, "serial");
  g_assert_cmpstr (sw_arrangement_to_string (st.rows[6].arrangement), ==, "boosters");
  g_assert_nonnull (strstr (st.boosters_note, "the one of 2 stages is this design"));
  g_assert_nonnull (strstr (st.boosters_note, "counts the boosters as perfect"));
  g_assert_nonnull (strstr (st.weighting, "serial and with boosters alike"));
  /* No row checks the thrust: the core's 1,300 kN (vacuum, the demo's key)
   * over the lightest closing serial row's weight, by hand. */
  {
    double lightest = INFINITY;
    for (guint i = 0; i < 6; i++)
      if (st.rows[i].feasible)
        lightest = MIN (lightest, st.rows[i].liftoff_mass_kg);
    g_assert_cmpfloat_with_epsilon (st.core_thrust_to_weight_max,
                                    1300e3 / (lightest * 9.80665), 1e-12);
    g_assert_cmpfloat (st.core_thrust_to_weight_max, <, 1.0);
    g_assert_nonnull (strstr (st.boosters_note, "The core's engines alone lift none of the "
                                                "serial rows"));
    /* Those rows are no candidates: each row's thrust over its weight by
     * hand (the core's 1,300 kN, and the boosters' 4 x 800 kN in a booster
     * row), and the best row one that lifts off. */
    for (guint i = 0; i < st.n_rows; i++)
      if (st.rows[i].feasible)
        g_assert_cmpfloat_with_epsilon (st.rows[i].liftoff_thrust_to_weight,
                                        (st.rows[i].arrangement == SW_ARRANGEMENT_BOOSTERS
                                           ? 1300e3 + 4 * 800e3 : 1300e3)
                                        / (st.rows[i].liftoff_mass_kg * 9.80665), 1e-12);
    g_assert_cmpint (st.best, >=, 0);
    g_assert_cmpfloat (st.rows[st.best].liftoff_thrust_to_weight, >=, 1.0);
    g_assert_nonnull (strstr (st.weighting, "are not candidates"));
  }

  /* A simulate design: the rows use its first-guess allowance, said so. */
  g_assert_nonnull (strstr (st.losses_note, "loss allowance of 2,500 m/s, the design's first "
                                            "guess for its closed loop"));

  /* The design's row is the design, at its own liftoff mass and payload. */
  g_assert_true (sw_size_design (d, &own, NULL));
  g_assert_true (own.boosters.present);
  g_assert_cmpfloat_with_epsilon (st.rows[st.design_index].liftoff_mass_kg / own.liftoff_mass_kg,
                                  1.0, 1e-12);
  g_assert_cmpfloat_with_epsilon (st.design_liftoff_mass_kg, own.liftoff_mass_kg, 1e-6);
  g_assert_cmpfloat_with_epsilon (st.rows[st.design_index].payload_fixed_size_kg,
                                  d->payload_kg, 1e-6);
  /* The serial row of the same count is another vehicle. */
  g_assert_cmpfloat (fabs (st.rows[d->n_stages - 1].liftoff_mass_kg - own.liftoff_mass_kg), >,
                     1000.0);

  /* Every booster row against the stage-count curve's booster points (the
   * design's split is optimal, as the curve's). */
  g_assert_true (sw_design_required_delta_v (d, &dv, NULL));
  sw_stage_curve_compute (d, dv, 6, &curve);
  g_assert_true (sw_parallel_vehicle_from_design (&pv, d, NULL));
  for (guint i = 0; i < SW_MAX_STAGES; i++)
    pv.fixed_kg[i] = 0.0;
  for (guint n = 1; n <= 6; n++)
    {
      const SwStagingRow *r = sw_staging_row (&st, SW_ARRANGEMENT_BOOSTERS, n);
      SwSizing sizing, check;
      SwCostVehicle v;
      SwCost cost, bare;

      g_assert_nonnull (r);
      g_assert_cmpint (r->feasible, ==, curve.booster_points[n - 1].feasible);
      if (!r->feasible)
        {
          g_assert_true (isnan (r->liftoff_mass_kg));
          g_assert_true (isnan (r->payload_fixed_size_kg));
          continue;
        }
      g_assert_cmpfloat_with_epsilon (r->liftoff_mass_kg / curve.booster_points[n - 1].liftoff_mass_kg,
                                      1.0, 1e-9);
      /* Costs: the cost model on the row's sizing, boosters included. */
      sw_stage_set_extend (&pv.set, d, n);
      sw_size_parallel (&pv, d->payload_kg, dv, SW_SPLIT_OPTIMAL, &sizing);
      sw_cost_vehicle_from_sizing (&v, &sizing, d);
      g_assert_cmpuint (v.booster_count, ==, 4);
      sw_cost_compute (d, &v, &cost);
      g_assert_cmpfloat_with_epsilon (r->development_work_years / cost.development_work_years,
                                      1.0, 1e-9);
      g_assert_cmpfloat_with_epsilon (r->cost_per_flight_work_years
                                        / cost.cost_per_flight_work_years, 1.0, 1e-9);
      v.booster_count = 0;
      sw_cost_compute (d, &v, &bare);
      g_assert_cmpfloat (r->development_work_years, >, bare.development_work_years);
      g_assert_cmpfloat (r->cost_per_flight_work_years, >, bare.cost_per_flight_work_years);
      /* The fixed-size payload: the vehicle sized for it weighs the
       * design's liftoff mass. */
      sw_size_parallel (&pv, r->payload_fixed_size_kg, dv, SW_SPLIT_OPTIMAL, &check);
      g_assert_true (check.feasible);
      g_assert_cmpfloat_with_epsilon (check.liftoff_mass_kg / own.liftoff_mass_kg, 1.0, 1e-7);
      /* Mission success: the boosters counted as perfect, so the serial
       * figure of the same stages (here none: no reliability keys). */
      g_assert_true (isnan (r->success_probability));
      /* The core recovered: heavier, a payload penalty. */
      if (r->reused_feasible)
        {
          g_assert_cmpfloat (r->liftoff_mass_reused_kg, >, r->liftoff_mass_kg);
          g_assert_cmpfloat (r->payload_penalty_fraction, >, 0.0);
          g_assert_cmpfloat (r->payload_penalty_fraction, <, 1.0);
        }
    }
  /* Not linear in the payload: at three stages the root differs from the
   * ratio of the masses. */
  {
    const SwStagingRow *r = sw_staging_row (&st, SW_ARRANGEMENT_BOOSTERS, 3);
    double linear = d->payload_kg * own.liftoff_mass_kg / r->liftoff_mass_kg;
    g_assert_cmpfloat (fabs (r->payload_fixed_size_kg - linear), >, 1.0);
  }

  /* The best row is the lowest score over both sets, among the rows the
   * liftoff thrust lifts. */
  for (guint i = 0; i < st.n_rows; i++)
    if (isfinite (st.rows[i].score) && !(st.rows[i].liftoff_thrust_to_weight < 1.0)
        && (argmin < 0 || st.rows[i].score < st.rows[argmin].score))
      argmin = (int) i;
  g_assert_cmpint (st.best, ==, argmin);

  /* With reliability keys the booster rows carry the serial figure. */
  for (guint i = 0; i < d->n_stages; i++)
    {
      d->stages[i].reliability.present = TRUE;
      d->stages[i].reliability.has_engine_reliability = TRUE;
      d->stages[i].reliability.engine_reliability = 0.99;
    }
  g_assert_true (sw_staging_compute (d, 6, &st, NULL));
  g_assert_true (st.reliability_given);
  g_assert_true (isfinite (sw_staging_row (&st, SW_ARRANGEMENT_BOOSTERS, 2)->success_probability));
  for (guint n = 2; n <= 6; n++)
    if (sw_staging_row (&st, SW_ARRANGEMENT_BOOSTERS, n)->feasible)
      g_assert_cmpfloat (sw_staging_row (&st, SW_ARRANGEMENT_BOOSTERS, n)->success_probability,
                         ==, sw_staging_row (&st, SW_ARRANGEMENT_SERIAL, n)->success_probability);

  /* A serial design: one set of rows, its own count the design. */
  g_assert_true (sw_staging_compute (serial, 6, &st, NULL));
  g_assert_cmpuint (st.n_rows, ==, 6);
  g_assert_cmpuint (st.design_row, ==, serial->n_stages);
  g_assert_cmpint (st.design_index, ==, (int) serial->n_stages - 1);
  g_assert_cmpint (st.design_arrangement, ==, SW_ARRANGEMENT_SERIAL);
  g_assert_cmpstr (st.boosters_note, ==, "");
  g_assert_cmpstr (st.fixed_note, ==, "");
  g_assert_cmpstr (st.losses_note, ==, "");
  g_assert_true (isnan (st.core_thrust_to_weight_max));
}

/* A recovered first stage the split leaves without delta-v: the
 * four-booster demo's serial six-stage row (its first stage recovered in
 * the recovered columns) has no recovered figures, says why, and the
 * other rows keep theirs. */
static void
test_staging_unrecovered_row (void)
{
  g_autoptr (GError) error = NULL;
  g_autofree char *path = g_build_filename (g_getenv ("SW_SOURCE_ROOT"), "data", "designs",
                                            "four-booster-cargo.stagewright", NULL);
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, &error);
  g_autofree char *note = NULL;
  SwStaging st;
  guint gone = 0;

  g_assert_no_error (error);
  g_assert_true (sw_staging_compute (d, 6, &st, NULL));
  for (guint i = 0; i < st.n_rows; i++)
    {
      const SwStagingRow *r = &st.rows[i];

      if (!r->feasible)
        continue;
      if (r->reused_feasible)
        {
          g_assert_true (isfinite (r->liftoff_mass_reused_kg));
          g_assert_cmpstr (r->reused_reason, ==, "");
          continue;
        }
      gone++;
      g_assert_nonnull (strstr (r->reused_reason, "optimised away"));
      g_assert_false (isfinite (r->development_reused_work_years));
    }
  g_assert_cmpuint (gone, >=, 1);
  note = sw_staging_dup_unrecovered_note (&st);
  g_assert_nonnull (note);
  g_assert_nonnull (strstr (note, "6 serial stages"));
}

/* The demo with strap-ons, its boosters sized (no propellant_kg): from
 * three stages up the optimum gives them no propellant.  Those booster rows
 * are no vehicle with boosters: they do not close, carry no thrust-to-weight
 * (the boosters' thrust is never counted for boosters that burn nothing),
 * are named in the note and are never the best row.  The evidence that the
 * boosters do not pay there comes from another route: the same stages with a
 * small fixed booster load (1 % of the serial vehicle over the boosters)
 * weigh more than the serial vehicle. */
static void
test_staging_boosters_optimised_away (void)
{
  g_autoptr (GError) error = NULL;
  g_autofree char *path = g_build_filename (g_getenv ("SW_SOURCE_ROOT"), "data", "designs",
                                            "four-booster-cargo.stagewright", NULL);
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, &error);
  SwStaging st;
  SwParallelVehicle pv;
  double dv;
  guint away = 0;

  g_assert_no_error (error);
  d->boosters.propellant.has_propellant_kg = FALSE;
  d->mission.loss_model = SW_LOSS_ALLOWANCE;
  g_assert_true (sw_design_validate (d, NULL, NULL));
  g_assert_cmpuint (d->n_stages, ==, 2);
  g_assert_true (sw_staging_compute (d, 6, &st, NULL));
  g_assert_true (sw_design_required_delta_v (d, &dv, NULL));
  g_assert_true (sw_parallel_vehicle_from_design (&pv, d, NULL));
  for (guint i = 0; i < SW_MAX_STAGES; i++)
    pv.fixed_kg[i] = 0.0;
  for (guint n = 2; n <= 6; n++)
    {
      const SwStagingRow *r = sw_staging_row (&st, SW_ARRANGEMENT_BOOSTERS, n);
      SwParallelVehicle bare, small;
      SwSizing s0, s1;

      sw_stage_set_extend (&pv.set, d, n);
      bare = small = pv;
      bare.count = 0;
      sw_size_parallel (&bare, d->payload_kg, dv, SW_SPLIT_OPTIMAL, &s0);
      g_assert_true (s0.feasible);
      small.booster_fixed_kg = 0.01 * s0.liftoff_mass_kg / pv.count;
      sw_size_parallel (&small, d->payload_kg, dv, SW_SPLIT_OPTIMAL, &s1);
      g_test_message ("%u stages: away %d; without boosters %.1f kg, with 1 %% boosters %.1f kg",
                      n, r->boosters_optimised_away, s0.liftoff_mass_kg, s1.liftoff_mass_kg);
      if (r->boosters_optimised_away)
        {
          away++;
          g_assert_false (r->feasible);
          g_assert_true (isnan (r->liftoff_mass_kg));
          g_assert_true (isnan (r->liftoff_thrust_to_weight));
          g_assert_true (isnan (r->score));
          g_assert_nonnull (strstr (r->reason, "optimised away"));
          g_assert_true (s1.feasible);
          g_assert_cmpfloat (s1.liftoff_mass_kg, >, s0.liftoff_mass_kg);
        }
      else
        {
          /* A closing booster row carries boosters with a real load. */
          SwSizing sz;
          g_assert_true (r->feasible);
          sw_size_parallel (&pv, d->payload_kg, dv, SW_SPLIT_OPTIMAL, &sz);
          g_assert_true (sz.feasible);
          g_assert_cmpfloat (sz.boosters.total_mass_kg, >, 1e-3 * sz.liftoff_mass_kg);
        }
    }
  g_assert_cmpuint (away, >=, 1);
  g_assert_false (sw_staging_row (&st, SW_ARRANGEMENT_BOOSTERS, 2)->boosters_optimised_away);
  g_assert_nonnull (strstr (st.boosters_note, "optimised away"));
  g_assert_nonnull (strstr (st.boosters_note, "no candidates"));
  /* The best row is a vehicle that lifts off, and never an emptied one. */
  g_assert_cmpint (st.best, >=, 0);
  g_assert_false (st.rows[st.best].boosters_optimised_away);
  g_assert_true (st.rows[st.best].feasible);
  g_assert_cmpfloat (st.rows[st.best].liftoff_thrust_to_weight, >=, 1.0);
  for (guint i = 0; i < st.n_rows; i++)
    if (st.rows[i].boosters_optimised_away)
      g_assert_cmpint (st.best, !=, (int) i);
  /* Serial rows are never marked so. */
  for (guint i = 0; i < st.n_counts; i++)
    g_assert_false (st.rows[i].boosters_optimised_away);
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/core/staging/columns", test_columns);
  g_test_add_func ("/core/staging/best-under-weighting", test_best_under_weighting);
  g_test_add_func ("/core/staging/defaults", test_defaults);
  g_test_add_func ("/core/staging/fixed-load-note", test_staging_fixed_note);
  g_test_add_func ("/core/staging/booster-rows", test_staging_booster_rows);
  g_test_add_func ("/core/staging/unrecovered-row", test_staging_unrecovered_row);
  g_test_add_func ("/core/staging/boosters-optimised-away", test_staging_boosters_optimised_away);
  return g_test_run ();
}
