/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-cost"

#include "config.h"

#include "sw-cost.h"

#include "sw-design.h"
#include "sw-economics.h"
#include "sw-stage-reliability.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

double
sw_cost_development (double a, double x, double mass_kg)
{
  return mass_kg > 0.0 ? a * pow (mass_kg, x) : 0.0;
}

double
sw_cost_first_unit (double b, double y, double mass_kg)
{
  return mass_kg > 0.0 ? b * pow (mass_kg, y) : 0.0;
}

double
sw_cost_systems_factor (double base, guint n_elements)
{
  return pow (base, (double) n_elements);
}

static double
learning_exponent (double learning_rate)
{
  return log (learning_rate) / log (2.0);
}

double
sw_cost_learning_unit (double learning_rate, double unit)
{
  return pow (unit, learning_exponent (learning_rate));
}

/* Units summed one by one up to here; beyond, the midpoint integral of q^B
 * (relative error below 1e-9 at this size). */
#define EXACT_UNITS 2000u

double
sw_cost_learning_total (double learning_rate, guint units)
{
  double b = learning_exponent (learning_rate), sum = 0.0;
  guint exact = MIN (units, EXACT_UNITS);

  for (guint q = 1; q <= exact; q++)
    sum += pow ((double) q, b);
  if (units > exact)
    {
      double lo = exact + 0.5, hi = units + 0.5;
      sum += fabs (b + 1.0) < 1e-12 ? log (hi / lo)
                                    : (pow (hi, b + 1.0) - pow (lo, b + 1.0)) / (b + 1.0);
    }
  return sum;
}

void
sw_cost_vehicle_from_sizing (SwCostVehicle *vehicle, const SwSizing *sizing,
                             const SwDesign *design)
{
  g_return_if_fail (vehicle != NULL && sizing != NULL && design != NULL && design->n_stages > 0);

  memset (vehicle, 0, sizeof *vehicle);
  vehicle->n_stages = sizing->n_stages;
  for (guint k = 0; k < sizing->n_stages; k++)
    {
      SwReliabilityInputs in;

      sw_reliability_inputs (&design->stages[MIN (k, design->n_stages - 1)].reliability, &in);
      vehicle->dry_mass_kg[k] = sizing->stages[k].structural_mass_kg;
      vehicle->engine_count[k] = MAX (in.engine_count, 1);
    }
  if (sizing->boosters.present && sizing->boosters.count > 0
      && isfinite (sizing->boosters.structural_mass_kg))
    {
      vehicle->booster_count = sizing->boosters.count;
      vehicle->booster_dry_mass_kg = sizing->boosters.structural_mass_kg;
    }
}

/* The design stage whose economics keys stage @k of the trade takes. */
static guint
source_stage (const SwDesign *design, guint k)
{
  return MIN (k, design->n_stages - 1);
}

void
sw_cost_compute (const SwDesign *design, const SwCostVehicle *vehicle, SwCost *out)
{
  const SwEconomics *e;
  const double *c;
  guint q, stage_units[SW_MAX_STAGES], engine_units[SW_COST_MAX_ENGINES] = { 0 };
  double refurbish = 0.0;

  g_return_if_fail (design != NULL && vehicle != NULL && out != NULL && design->n_stages > 0);

  e = &design->economics;
  c = e->coefficients;
  memset (out, 0, sizeof *out);
  out->n_stages = MIN (vehicle->n_stages, SW_MAX_STAGES);
  out->booster_count = vehicle->booster_count;
  out->booster_engine = -1;
  /* The booster set is one more element of the vehicle (see the header). */
  out->systems_factor = sw_cost_systems_factor (c[SW_CER_SYSTEMS_BASE],
                                                out->n_stages + (out->booster_count > 0 ? 1 : 0));
  q = MAX (e->production_run, 1);
  out->flights = q;

  /* The design's engine types first, then a stage's own engine. */
  for (guint i = 0; i < e->n_engine_types && i < SW_ECONOMICS_MAX_ENGINE_TYPES; i++)
    {
      SwCostEngine *en = &out->engines[i];
      g_strlcpy (en->name, e->engine_types[i].name, sizeof en->name);
      en->dry_mass_kg = e->engine_types[i].dry_mass_kg;
      en->developed = e->engine_types[i].developed;
    }
  out->n_engines = MIN (e->n_engine_types, SW_ECONOMICS_MAX_ENGINE_TYPES);

  for (guint k = 0; k < out->n_stages; k++)
    {
      guint src = source_stage (design, k), n_eng = MAX (vehicle->engine_count[k], 1);
      int type = sw_economics_engine_type_of_stage (e, src);
      double dry = MAX (vehicle->dry_mass_kg[k], 0.0), engines_mass;
      SwCostEngine *en;

      if (type >= 0)
        en = &out->engines[type];
      else
        {
          type = (int) out->n_engines++;
          en = &out->engines[type];
          g_snprintf (en->name, sizeof en->name, _("Engine of stage %u"), k + 1);
          en->dry_mass_kg = e->engine_mass_fraction * dry / n_eng;
          /* A stage's own engine is as developed as the stage. */
          en->developed = k < design->n_stages && (e->developed_stages & (1u << k)) != 0;
        }
      en->used = TRUE;
      en->per_vehicle += n_eng;
      out->engine_of_stage[k] = type;
      engines_mass = n_eng * en->dry_mass_kg;
      out->stage_mass_kg[k] = MAX (dry - engines_mass, 0.0);
      /* A stage beyond the design's own (the stage-count trade) is new. */
      if (!(k < design->n_stages && (e->developed_stages & (1u << k)) != 0))
        out->stage_development_work_years[k]
          = sw_cost_development (c[SW_CER_STAGE_DEV_FACTOR], c[SW_CER_STAGE_DEV_EXPONENT],
                                 out->stage_mass_kg[k]);
      out->stage_first_unit_work_years[k]
        = sw_cost_first_unit (c[SW_CER_STAGE_UNIT_FACTOR], c[SW_CER_STAGE_UNIT_EXPONENT],
                              out->stage_mass_kg[k]);
      stage_units[k] = q;
      if (k == 0 && vehicle->recovered_first_stage)
        stage_units[k] = (q + e->flights_per_stage - 1) / MAX (e->flights_per_stage, 1);
      engine_units[type] += stage_units[k] * n_eng;
    }

  /* The boosters: one booster element and its own engine, each developed
   * once (or not at all when the design marks them developed) and built
   * count times per vehicle. */
  if (out->booster_count > 0)
    {
      double dry = MAX (vehicle->booster_dry_mass_kg, 0.0);
      SwCostEngine *en = &out->engines[out->n_engines];

      out->booster_engine = (int) out->n_engines++;
      g_strlcpy (en->name, _("Engine of the boosters"), sizeof en->name);
      en->dry_mass_kg = e->engine_mass_fraction * dry;
      en->developed = e->developed_boosters;
      en->used = TRUE;
      en->per_vehicle = out->booster_count;
      /* Recovered: each booster flies flights_per_stage times. */
      out->booster_units = out->booster_count * q;
      if (vehicle->recovered_boosters)
        out->booster_units = (out->booster_count * q + e->flights_per_stage - 1)
                             / MAX (e->flights_per_stage, 1);
      engine_units[out->booster_engine] = out->booster_units;
      out->booster_mass_kg = MAX (dry - en->dry_mass_kg, 0.0);
      out->booster_development_work_years
        = e->developed_boosters ? 0.0
                                : sw_cost_development (c[SW_CER_STAGE_DEV_FACTOR],
                                                       c[SW_CER_STAGE_DEV_EXPONENT],
                                                       out->booster_mass_kg);
      out->booster_first_unit_work_years
        = sw_cost_first_unit (c[SW_CER_STAGE_UNIT_FACTOR], c[SW_CER_STAGE_UNIT_EXPONENT],
                              out->booster_mass_kg);
    }

  for (guint i = 0; i < out->n_engines; i++)
    {
      SwCostEngine *en = &out->engines[i];
      if (!en->used)
        continue;
      if (!en->developed)
        en->development_work_years
          = sw_cost_development (c[SW_CER_ENGINE_DEV_FACTOR], c[SW_CER_ENGINE_DEV_EXPONENT],
                                 en->dry_mass_kg);
      en->first_unit_work_years
        = sw_cost_first_unit (c[SW_CER_ENGINE_UNIT_FACTOR], c[SW_CER_ENGINE_UNIT_EXPONENT],
                              en->dry_mass_kg);
    }

  /* Development: every element once. */
  for (guint k = 0; k < out->n_stages; k++)
    out->development_work_years += out->stage_development_work_years[k];
  out->development_work_years += out->booster_development_work_years;
  for (guint i = 0; i < out->n_engines; i++)
    out->development_work_years += out->engines[i].development_work_years;
  out->development_work_years *= out->systems_factor;

  /* Production: each element's units along its own learning curve. */
  for (guint k = 0; k < out->n_stages; k++)
    {
      out->first_vehicle_work_years += out->stage_first_unit_work_years[k];
      out->production_work_years += out->stage_first_unit_work_years[k]
                                    * sw_cost_learning_total (e->learning_rate, stage_units[k]);
    }
  if (out->booster_count > 0)
    {
      out->first_vehicle_work_years += out->booster_count * out->booster_first_unit_work_years;
      out->production_work_years += out->booster_first_unit_work_years
                                    * sw_cost_learning_total (e->learning_rate,
                                                              out->booster_units);
    }
  for (guint i = 0; i < out->n_engines; i++)
    {
      const SwCostEngine *en = &out->engines[i];
      out->first_vehicle_work_years += en->per_vehicle * en->first_unit_work_years;
      out->production_work_years += en->first_unit_work_years
                                    * sw_cost_learning_total (e->learning_rate, engine_units[i]);
    }
  if (vehicle->recovered_first_stage && out->n_stages > 0)
    {
      /* Every flight that does not use a new first stage readies a used one. */
      const SwCostEngine *en = &out->engines[out->engine_of_stage[0]];
      double first = out->stage_first_unit_work_years[0]
                     + MAX (vehicle->engine_count[0], 1) * en->first_unit_work_years;
      refurbish = (double) (q - stage_units[0]) * e->refurbishment_fraction * first;
    }
  if (vehicle->recovered_boosters && out->booster_count > 0)
    {
      /* Every booster flight that does not use a new booster readies a
       * used one (the element and its engine). */
      const SwCostEngine *en = &out->engines[out->booster_engine];
      double first = out->booster_first_unit_work_years + en->first_unit_work_years;
      refurbish += (double) (out->booster_count * q - out->booster_units)
                   * e->refurbishment_fraction * first;
    }
  out->production_work_years += refurbish;
  out->cost_per_flight_work_years = out->production_work_years / q;
  out->has_money = e->has_work_year_cost;
  out->work_year_cost = e->has_work_year_cost ? e->work_year_cost : NAN;
}

double
sw_cost_to_money (const SwCost *cost, double work_years)
{
  g_return_val_if_fail (cost != NULL, NAN);
  return cost->has_money ? work_years * cost->work_year_cost : NAN;
}
