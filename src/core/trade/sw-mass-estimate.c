/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-mass-estimate"

#include "config.h"

#include "sw-mass-estimate.h"

#include "sw-design-edit.h"
#include "sw-phases.h"
#include "sw-stage-thrust.h"
#include "sw-vehicle-shape.h"

#include <glib/gi18n-lib.h>

#include <math.h>
#include <string.h>

/* Akin, "Mass Estimating Relations", University of Maryland lecture notes
 * (2016), for every relationship below. */
#define TANK_KG_PER_M3 12.158
#define TANK_LH2_KG_PER_M3 9.0911
#define INSULATION_LH2_KG_PER_M2 2.88
#define INSULATION_LOX_KG_PER_M2 1.123
#define MOTOR_CASE_PER_PROPELLANT 0.135

double
sw_mer_tank_mass (double tank_volume_m3, gboolean hydrogen)
{
  return (hydrogen ? TANK_LH2_KG_PER_M3 : TANK_KG_PER_M3) * tank_volume_m3;
}

double
sw_mer_engine_mass (double thrust_n, double area_ratio)
{
  return 7.81e-4 * thrust_n + 3.37e-5 * thrust_n * sqrt (area_ratio) + 59.0;
}

double
sw_mer_thrust_structure_mass (double thrust_n)
{
  return 2.55e-4 * thrust_n;
}

double
sw_mer_shroud_mass (double wetted_area_m2)
{
  return wetted_area_m2 > 0.0 ? 4.95 * pow (wetted_area_m2, 1.15) : 0.0;
}

double
sw_mer_avionics_mass (double gross_mass_kg)
{
  return gross_mass_kg > 0.0 ? 10.0 * pow (gross_mass_kg, 0.361) : 0.0;
}

double
sw_mer_wiring_mass (double gross_mass_kg, double length_m)
{
  return gross_mass_kg > 0.0 && length_m > 0.0
         ? 1.058 * sqrt (gross_mass_kg) * pow (length_m, 0.25) : 0.0;
}

const char *
sw_mer_item_key (SwMerItem item)
{
  static const char *const keys[SW_N_MER] = {
    "tanks", "insulation", "engines", "thrust_structure", "interstage", "avionics", "wiring",
    "motor_case", "nose_cone", "attachment",
  };
  g_return_val_if_fail (item < SW_N_MER, "");
  return keys[item];
}

const char *
sw_mer_item_label (SwMerItem item)
{
  switch (item)
    {
    case SW_MER_TANKS: return _("Tanks");
    case SW_MER_INSULATION: return _("Insulation");
    case SW_MER_ENGINES: return _("Engines");
    case SW_MER_THRUST_STRUCTURE: return _("Thrust structure");
    case SW_MER_INTERSTAGE: return _("Interstage");
    case SW_MER_AVIONICS: return _("Avionics");
    case SW_MER_WIRING: return _("Wiring");
    case SW_MER_MOTOR_CASE: return _("Motor case");
    case SW_MER_NOSE_CONE: return _("Nose cone");
    case SW_MER_ATTACHMENT: return _("Attachment");
    case SW_N_MER: default: break;
    }
  return "";
}

const char *
sw_mer_item_source (SwMerItem item)
{
  switch (item)
    {
    case SW_MER_TANKS:
      return _("Akin, Mass Estimating Relations (U. Maryland, 2016): 12.158 kg/m^3 of tank, "
               "9.0911 for hydrogen");
    case SW_MER_INSULATION:
      return _("Akin (2016): 2.88 kg/m^2 on hydrogen tanks, 1.123 on oxygen (methane: the oxygen "
               "figure, our assumption)");
    case SW_MER_ENGINES:
      return _("Akin (2016): 7.81e-4 T + 3.37e-5 T sqrt(Ae/At) + 59 per engine (area ratio "
               "assumed)");
    case SW_MER_THRUST_STRUCTURE:
      return _("Akin (2016): 2.55e-4 T");
    case SW_MER_INTERSTAGE:
      return _("Akin (2016): 4.95 A^1.15 of its side area");
    case SW_MER_AVIONICS:
      return _("Akin (2016): 10 M0^0.361 of the stage's gross mass");
    case SW_MER_WIRING:
      return _("Akin (2016): 1.058 sqrt(M0) L^0.25");
    case SW_MER_MOTOR_CASE:
      return _("Akin (2016): 0.135 of the solid propellant");
    case SW_MER_NOSE_CONE:
      return _("Akin (2016): 4.95 A^1.15, the fairing relationship, of the side area of a cone "
               "1.2 diameters long (our assumption)");
    case SW_MER_ATTACHMENT:
      return _("Akin (2016): 2.55e-4 F of the booster's thrust, the thrust-structure "
               "relationship (our assumption: the fittings carry that thrust into the core)");
    case SW_N_MER: default: break;
    }
  return "";
}

/* Tanks, insulation, engines and thrust structure, or a solid's motor case,
 * of a stage or booster with the shape @shape (valid, with a length) of
 * diameter @d carrying @mp; e->thrust_n, engine_count and area_ratio set. */
static void
propulsion_items (const SwStagePropellant *prop, const SwStageShape *shape, double d, double mp,
                  SwStageEstimate *e)
{
  gboolean hydrogen = prop->kind == SW_PROPELLANT_LOX_HYDROGEN;
  gboolean lox = prop->kind == SW_PROPELLANT_LOX_KEROSENE
                 || prop->kind == SW_PROPELLANT_LOX_HYDROGEN
                 || prop->kind == SW_PROPELLANT_LOX_METHANE;

  e->tank_volume_m3 = shape->tank_volume_m3;
  e->length_m = shape->length_m;
  if (shape->solid)
    {
      e->tank_area_m2 = 0.0;
      e->item_kg[SW_MER_MOTOR_CASE] = MOTOR_CASE_PER_PROPELLANT * mp;
    }
  else
    {
      double ox_area = sw_tank_surface_area (d, shape->oxidizer_tank_length_m,
                                             SW_DOME_ASPECT_RATIO);
      double fuel_area = sw_tank_surface_area (d, shape->fuel_tank_length_m,
                                               SW_DOME_ASPECT_RATIO);
      double per_engine = e->thrust_n / e->engine_count;

      e->tank_area_m2 = ox_area + fuel_area;
      /* The oxidizer tank is never a hydrogen tank. */
      e->item_kg[SW_MER_TANKS] = sw_mer_tank_mass (shape->oxidizer_tank_m3, FALSE)
                                 + sw_mer_tank_mass (shape->fuel_tank_m3, hydrogen);
      if (lox)
        e->item_kg[SW_MER_INSULATION] += INSULATION_LOX_KG_PER_M2 * ox_area;
      if (hydrogen)
        e->item_kg[SW_MER_INSULATION] += INSULATION_LH2_KG_PER_M2 * fuel_area;
      else if (prop->kind == SW_PROPELLANT_LOX_METHANE)
        e->item_kg[SW_MER_INSULATION] += INSULATION_LOX_KG_PER_M2 * fuel_area;
      e->item_kg[SW_MER_ENGINES] = e->engine_count * sw_mer_engine_mass (per_engine,
                                                                          e->area_ratio);
      e->item_kg[SW_MER_THRUST_STRUCTURE] = sw_mer_thrust_structure_mass (e->thrust_n);
    }
}

/* What keeps a stage or booster from being estimated (FALSE and e->reason),
 * from its shape and load. */
static gboolean
can_estimate (const SwStageShape *shape, double mp, double eps, gboolean booster,
              SwStageEstimate *e)
{
  if (!shape->valid)
    g_snprintf (e->reason, sizeof e->reason,
                _("no propellant given: the tanks cannot be estimated; keeps %g"), eps);
  else if (!shape->has_length && booster)
    g_snprintf (e->reason, sizeof e->reason,
                _("no diameter given (nor has the core one): the tank and nose cone areas "
                  "cannot be estimated; keeps %g"), eps);
  else if (!shape->has_length)
    g_snprintf (e->reason, sizeof e->reason,
                _("no diameter given: the tank and interstage areas cannot be estimated; "
                  "keeps %g"), eps);
  else if (!(mp > 0.0))
    g_snprintf (e->reason, sizeof e->reason,
                _("carries no propellant in this sizing; keeps %g"), eps);
  else
    return TRUE;
  return FALSE;
}

static void
estimate_init (SwStageEstimate *e, double design_eps, double mp, double ms)
{
  memset (e->item_kg, 0, sizeof e->item_kg);
  e->estimated = FALSE;
  e->reason[0] = '\0';
  e->propellant_mass_kg = mp;
  e->design_coefficient = design_eps;
  e->gross_mass_kg = mp + ms;
  e->tank_volume_m3 = e->tank_area_m2 = e->interstage_area_m2 = e->length_m = NAN;
  e->nose_area_m2 = 0.0;
}

/* The relationships for stage @i of @design as sized in @sizing. */
static void
estimate_stage (const SwDesign *design, const SwSizing *sizing, guint i, SwStageEstimate *e)
{
  const SwStage *st = &design->stages[i];
  const SwStageResult *r = &sizing->stages[i];
  SwStageShape shape;
  double d = sw_stage_effective_diameter (design, i);
  double mp = r->propellant_mass_kg;

  estimate_init (e, st->structural_coefficient, mp, r->structural_mass_kg);
  e->diameter_m = d;
  e->area_ratio = i == 0 ? SW_MER_AREA_RATIO_FIRST : SW_MER_AREA_RATIO_UPPER;
  e->engine_count = st->reliability.has_engine_count ? st->reliability.engine_count : 1;
  e->thrust_n = sw_stage_thrust_vac_n (&st->propulsion, e->engine_count);
  e->thrust_assumed = !(isfinite (e->thrust_n) && e->thrust_n > 0.0);
  if (e->thrust_assumed)
    e->thrust_n = sw_default_ignition_tw (i) * SW_G0 * r->initial_mass_kg;

  sw_sizing_stage_shape (design, sizing, i, &shape);
  if (!can_estimate (&shape, mp, st->structural_coefficient, FALSE, e))
    return;
  propulsion_items (&st->propellant, &shape, d, mp, e);
  if (i + 1 < design->n_stages)
    {
      double up = sw_stage_effective_diameter (design, i + 1);
      double len = SW_INTERSTAGE_PER_DIAMETER * MAX (d, up);
      e->interstage_area_m2 = sw_frustum_side_area (d, up, len);
      e->item_kg[SW_MER_INTERSTAGE] = sw_mer_shroud_mass (e->interstage_area_m2);
    }
  else
    e->interstage_area_m2 = 0.0;
  e->item_kg[SW_MER_AVIONICS] = sw_mer_avionics_mass (e->gross_mass_kg);
  e->item_kg[SW_MER_WIRING] = sw_mer_wiring_mass (e->gross_mass_kg, e->length_m);
  e->estimated = TRUE;
}

/* The relationships for one booster of @design as sized in @sizing (see
 * the header: a nose cone and the attachment in place of the interstage). */
static void
estimate_booster (const SwDesign *design, const SwSizing *sizing, SwStageEstimate *e)
{
  const SwBoosters *b = &design->boosters;
  const SwBoosterResult *r = &sizing->boosters;
  SwStageShape shape;
  double d = b->has_diameter ? b->diameter_m : 0.5 * sw_stage_effective_diameter (design, 0);
  double mp = r->propellant_mass_kg;

  estimate_init (e, b->structural_coefficient, mp, r->structural_mass_kg);
  e->diameter_m = d;
  e->area_ratio = SW_MER_AREA_RATIO_FIRST;
  e->engine_count = 1;
  e->thrust_n = r->thrust_vac_n;
  e->thrust_assumed = FALSE;
  e->interstage_area_m2 = 0.0;

  sw_stage_shape (&b->propellant, mp, d, &shape);
  if (!can_estimate (&shape, mp, b->structural_coefficient, TRUE, e))
    return;
  propulsion_items (&b->propellant, &shape, d, mp, e);
  e->nose_area_m2 = sw_frustum_side_area (d, 0.0, SW_MER_BOOSTER_NOSE_PER_DIAMETER * d);
  e->item_kg[SW_MER_NOSE_CONE] = sw_mer_shroud_mass (e->nose_area_m2);
  e->item_kg[SW_MER_ATTACHMENT] = sw_mer_thrust_structure_mass (e->thrust_n);
  e->item_kg[SW_MER_AVIONICS] = sw_mer_avionics_mass (e->gross_mass_kg);
  e->item_kg[SW_MER_WIRING] = sw_mer_wiring_mass (e->gross_mass_kg, e->length_m);
  e->estimated = TRUE;
}

/* eps = Ms / (Ms + Mp) of an estimated @e (its structure the sum of its
 * items); the change from @eps_now. */
static double
settle_coefficient (SwStageEstimate *e, double eps_now)
{
  double ms = 0.0;

  for (guint k = 0; k < SW_N_MER; k++)
    ms += e->item_kg[k];
  e->structural_mass_kg = ms;
  e->structural_coefficient = ms / (ms + e->propellant_mass_kg);
  return fabs (e->structural_coefficient - eps_now);
}

void
sw_mass_estimate_design (const SwDesign *design, SwMassEstimate *out)
{
  g_autoptr (SwDesign) copy = NULL;
  g_autoptr (GError) error = NULL;
  SwSizing sizing;
  gboolean used[SW_MAX_STAGES] = { FALSE };

  g_return_if_fail (design != NULL && out != NULL);

  memset (out, 0, sizeof *out);
  out->liftoff_mass_kg = out->residual = NAN;
  out->n_stages = design->n_stages;
  copy = sw_design_copy (design);
  for (guint it = 1; it <= SW_MER_MAX_ITERATIONS; it++)
    {
      double step = 0.0;

      out->iterations = it;
      if (!sw_size_design (copy, &sizing, &error))
        {
          g_strlcpy (out->reason, error->message, sizeof out->reason);
          return;
        }
      if (!sizing.feasible)
        {
          if (it == 1)
            g_snprintf (out->reason, sizeof out->reason,
                        _("The sizing with the estimated coefficients is not feasible: %s"),
                        sizing.reason);
          else
            /* Translators: %s is the sizing's reason */
            g_snprintf (out->reason, sizeof out->reason,
                        _("The sizing with the estimated coefficients, the split (and any "
                          "boosters' load) held at the design's own sizing, is not "
                          "feasible: %s"), sizing.reason);
          return;
        }
      out->any_estimated = FALSE;
      if (it == 1)
        {
          double shares[SW_MAX_STAGES];
          guint n = sw_sizing_get_shares (&sizing, shares);

          for (guint i = 0; i < design->n_stages; i++)
            used[i] = !sizing.stages[i].unused;
          /* Hold the split of the design's own sizing: re-optimising it with
           * coefficients that fall as a stage grows runs away (the optimum
           * piles delta-v onto the stage that gets lighter, which gets
           * lighter still). */
          if (n == design->n_stages)
            sw_design_take_manual_shares (copy, shares, n);
          /* Sized boosters keep the load of that sizing, for the same
           * reason: re-choosing it with a coefficient that rises as the
           * booster shrinks (its engine and fittings do not) runs away to
           * no booster at all. */
          if (sizing.boosters.present && !sizing.boosters.fixed
              && sizing.boosters.propellant_mass_kg > 0.0)
            {
              copy->boosters.propellant.propellant_kg = sizing.boosters.propellant_mass_kg;
              copy->boosters.propellant.has_propellant_kg = TRUE;
              out->boosters_load_held = TRUE;
            }
        }
      for (guint i = 0; i < design->n_stages; i++)
        {
          SwStageEstimate *e = &out->stages[i];

          estimate_stage (copy, &sizing, i, e);
          e->design_coefficient = design->stages[i].structural_coefficient;
          if (!e->estimated && sizing.stages[i].unused && used[i])
            {
              /* The estimate pushed the stage out of the optimum: masses that
               * do not shrink with it (engines for the thrust given, thrust
               * structure) outweigh what it would carry.  No fixed point. */
              g_snprintf (out->reason, sizeof out->reason,
                          _("Stage %u (%s) shrinks to nothing as its coefficient is "
                            "estimated: its engines and thrust structure are too heavy for "
                            "the share it would carry. Check its thrust."),
                          i + 1, design->stages[i].name);
              return;
            }
          if (!e->estimated)
            {
              e->structural_coefficient = design->stages[i].structural_coefficient;
              e->structural_mass_kg = sizing.stages[i].structural_mass_kg;
              continue;
            }
          out->any_estimated = TRUE;
          step = MAX (step, settle_coefficient (e, copy->stages[i].structural_coefficient));
          copy->stages[i].structural_coefficient = e->structural_coefficient;
        }
      out->has_boosters = sizing.boosters.present && design->boosters.count > 0;
      if (out->has_boosters)
        {
          SwStageEstimate *e = &out->boosters;

          estimate_booster (copy, &sizing, e);
          e->design_coefficient = design->boosters.structural_coefficient;
          if (!e->estimated)
            {
              e->structural_coefficient = design->boosters.structural_coefficient;
              e->structural_mass_kg = sizing.boosters.structural_mass_kg;
            }
          else
            {
              out->any_estimated = TRUE;
              step = MAX (step, settle_coefficient (e, copy->boosters.structural_coefficient));
              copy->boosters.structural_coefficient = e->structural_coefficient;
            }
        }
      out->residual = step;
      out->liftoff_mass_kg = sizing.liftoff_mass_kg;
      if (!out->any_estimated)
        {
          g_strlcpy (out->reason, _("No stage (nor the boosters) has both a propellant and a "
                                    "diameter: nothing to estimate."), sizeof out->reason);
          return;
        }
      if (step <= SW_MER_TOLERANCE)
        {
          /* The masses of the last sizing used the coefficients it just
           * reproduced: that is the fixed point. */
          out->ok = TRUE;
          return;
        }
    }
  g_snprintf (out->reason, sizeof out->reason,
              _("The estimate did not settle in %u rounds (last change %.2g)."),
              SW_MER_MAX_ITERATIONS, out->residual);
}
