/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-staging"

#include "config.h"

#include "sw-staging.h"

#include "sw-cost.h"
#include "sw-economics.h"
#include "sw-fixed-vehicle.h"
#include "sw-reliability.h"
#include "sw-reuse.h"
#include "sw-sizing.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

static void
row_costs (const SwDesign *design, const SwSizing *sizing, gboolean recovered, double *dev,
           double *per_flight)
{
  SwCostVehicle vehicle;
  SwCost cost;

  sw_cost_vehicle_from_sizing (&vehicle, sizing, design);
  vehicle.recovered_first_stage = recovered;
  sw_cost_compute (design, &vehicle, &cost);
  *dev = cost.development_work_years;
  *per_flight = cost.cost_per_flight_work_years;
}

/* The best value of one criterion over the feasible rows (NAN if none). */
static double
best_of (const SwStaging *s, gsize offset)
{
  double best = NAN;

  for (guint i = 0; i < s->n_rows; i++)
    {
      double v = *(const double *) ((const char *) &s->rows[i] + offset);
      if (s->rows[i].feasible && isfinite (v) && !(v >= best))
        best = v;
    }
  return best;
}

static void
append_weight (GString *text, double weight, const char *what)
{
  if (weight <= 0.0)
    return;
  if (text->len > 0)
    g_string_append (text, ", ");
  g_string_append_printf (text, "%s %g", what, weight);
}

gboolean
sw_staging_compute (const SwDesign *design, guint max_stages, SwStaging *out, GError **error)
{
  const SwEconomics *e;
  SwReliabilityCurve rel;
  SwSizing own;
  double dv, failure_best, best_score = INFINITY;
  double best_mass, best_dev, best_cost;
  g_autoptr (GString) text = g_string_new (NULL);

  g_return_val_if_fail (design != NULL && out != NULL && design->n_stages > 0, FALSE);

  if (!sw_design_required_delta_v (design, &dv, error))
    return FALSE;
  e = &design->economics;
  memset (out, 0, sizeof *out);
  out->n_rows = CLAMP (max_stages, 1, SW_STAGING_MAX_STAGES);
  out->design_stages = design->n_stages;
  out->design_row = design->boosters.count > 0 ? 0 : design->n_stages;
  out->design_reuses = e->recovery_mode != SW_RECOVERY_NONE;
  out->reuse_mode = out->design_reuses ? e->recovery_mode : SW_RECOVERY_DOWNRANGE;
  out->weight_liftoff_mass = e->weight_liftoff_mass;
  out->weight_development = e->weight_development;
  out->weight_cost_per_flight = e->weight_cost_per_flight;
  out->weight_failure = e->weight_failure;
  out->has_money = e->has_work_year_cost;
  out->work_year_cost = e->has_work_year_cost ? e->work_year_cost : NAN;
  out->best = -1;

  if (!sw_size_design (design, &own, error))
    return FALSE;
  out->design_liftoff_mass_kg = own.feasible ? own.liftoff_mass_kg : NAN;

  if (design->boosters.count > 0)
    /* Translators: %u is the number of strap-on boosters */
    g_snprintf (out->fixed_note, sizeof out->fixed_note,
                g_dngettext (GETTEXT_PACKAGE,
                             "Every row is a serial vehicle without this design's %u strap-on "
                             "booster, so no row is this design.",
                             "Every row is a serial vehicle without this design's %u strap-on "
                             "boosters, so no row is this design.",
                             design->boosters.count),
                design->boosters.count);
  sw_reliability_curve_compute (design, out->n_rows, &rel);
  out->reliability_given = rel.given;
  for (guint i = 0; i < design->n_stages; i++)
    if (design->stages[i].propellant.has_propellant_kg)
      {
        /* Translators: %u is a stage number, %s its name */
        char fixed[SW_REASON_MAX];

        g_snprintf (fixed, sizeof fixed,
                    _("Every stage count is sized from the payload up, this design's own "
                      "included: the fixed propellant load of stage %u (%s) is not applied."),
                    i + 1, design->stages[i].name);
        if (out->fixed_note[0] != '\0')
          g_strlcat (out->fixed_note, " ", sizeof out->fixed_note);
        g_strlcat (out->fixed_note, fixed, sizeof out->fixed_note);
        g_strlcpy (out->reuse_note, _("The recovered columns resize every stage too."),
                   sizeof out->reuse_note);
        break;
      }

  for (guint n = 1; n <= out->n_rows; n++)
    {
      SwStagingRow *row = &out->rows[n - 1];
      SwStageSet set;
      SwReuse reuse;

      row->n_stages = n;
      row->arrangement = SW_ARRANGEMENT_SERIAL;
      row->liftoff_mass_kg = row->liftoff_mass_reused_kg = NAN;
      row->payload_penalty_fraction = NAN;
      row->development_work_years = row->development_reused_work_years = NAN;
      row->cost_per_flight_work_years = row->cost_per_flight_reused_work_years = NAN;
      row->success_probability = rel.given ? rel.mission[n - 1] : NAN;
      row->payload_fixed_size_kg = NAN;
      row->score = NAN;

      /* The design's own stages as they are (a manual split keeps its
       * shares); other counts with the stage-count curve's rule. */
      if (n == design->n_stages)
        sw_stage_set_from_design (&set, design);
      else
        sw_stage_set_extend (&set, design, n);
      sw_reuse_compute (&set, design->payload_kg, dv,
                        n == design->n_stages || design->split != SW_SPLIT_MANUAL
                          ? design->split : SW_SPLIT_OPTIMAL,
                        e, out->reuse_mode, &reuse);
      row->feasible = reuse.expendable.feasible;
      /* A vehicle that does not close flies no mission: no success figure. */
      if (!row->feasible)
        row->success_probability = NAN;
      row->reused_feasible = reuse.reusable.feasible;
      g_strlcpy (row->reason, reuse.expendable.reason, sizeof row->reason);
      if (row->feasible)
        {
          row->liftoff_mass_kg = reuse.expendable.liftoff_mass_kg;
          row_costs (design, &reuse.expendable, FALSE, &row->development_work_years,
                     &row->cost_per_flight_work_years);
          /* Sizing is linear in the payload: the vehicle of the design's
           * liftoff mass carries payload times the ratio of the masses.
           * The fixed-vehicle root finder gives the same (tests check). */
          if (isfinite (out->design_liftoff_mass_kg))
            row->payload_fixed_size_kg = design->payload_kg * out->design_liftoff_mass_kg
                                         / row->liftoff_mass_kg;
        }
      if (row->reused_feasible)
        {
          SwCostVehicle vehicle;
          SwCost cost;

          row->liftoff_mass_reused_kg = reuse.reusable.liftoff_mass_kg;
          row->payload_penalty_fraction = reuse.payload_penalty_fraction;
          sw_cost_vehicle_from_sizing (&vehicle, &reuse.reusable, design);
          /* The cost model takes the landed dry mass, not the recovery
           * propellant the sizing carries as inert mass. */
          vehicle.dry_mass_kg[0] = reuse.first_stage_dry_kg;
          vehicle.recovered_first_stage = TRUE;
          sw_cost_compute (design, &vehicle, &cost);
          row->development_reused_work_years = cost.development_work_years;
          row->cost_per_flight_reused_work_years = cost.cost_per_flight_work_years;
        }
    }

  /* The score: each criterion relative to its best stage count. */
  best_mass = best_of (out, G_STRUCT_OFFSET (SwStagingRow, liftoff_mass_kg));
  best_dev = best_of (out, out->design_reuses
                             ? G_STRUCT_OFFSET (SwStagingRow, development_reused_work_years)
                             : G_STRUCT_OFFSET (SwStagingRow, development_work_years));
  best_cost = best_of (out, out->design_reuses
                              ? G_STRUCT_OFFSET (SwStagingRow, cost_per_flight_reused_work_years)
                              : G_STRUCT_OFFSET (SwStagingRow, cost_per_flight_work_years));
  failure_best = NAN;
  if (rel.given)
    for (guint i = 0; i < out->n_rows; i++)
      if (out->rows[i].feasible && !(1.0 - out->rows[i].success_probability >= failure_best))
        failure_best = 1.0 - out->rows[i].success_probability;
  for (guint i = 0; i < out->n_rows; i++)
    {
      SwStagingRow *row = &out->rows[i];
      double dev = out->design_reuses ? row->development_reused_work_years
                                      : row->development_work_years;
      double cost = out->design_reuses ? row->cost_per_flight_reused_work_years
                                       : row->cost_per_flight_work_years;
      double score = 0.0;

      if (!row->feasible || (out->design_reuses && !row->reused_feasible))
        continue;
      if (best_mass > 0.0)
        score += out->weight_liftoff_mass * row->liftoff_mass_kg / best_mass;
      if (best_dev > 0.0)
        score += out->weight_development * dev / best_dev;
      if (best_cost > 0.0)
        score += out->weight_cost_per_flight * cost / best_cost;
      if (rel.given && failure_best > 0.0)
        score += out->weight_failure * (1.0 - row->success_probability) / failure_best;
      row->score = score;
      if (score < best_score)
        {
          best_score = score;
          out->best = (int) i;
        }
    }

  append_weight (text, out->weight_liftoff_mass, _("liftoff mass"));
  append_weight (text, out->weight_development, _("development effort"));
  append_weight (text, out->weight_cost_per_flight,
                 out->design_reuses ? _("cost per flight (first stage reused)")
                                    : _("cost per flight (expendable)"));
  if (rel.given)
    append_weight (text, out->weight_failure, _("failure probability"));
  if (text->len == 0)
    g_string_append (text, _("no criterion weighted"));
  g_snprintf (out->weighting, sizeof out->weighting,
              _("Weights: %s; each criterion divided by its best stage count, the lowest sum wins"),
              text->str);
  return TRUE;
}
