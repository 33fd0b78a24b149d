/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-vehicle-shape"

#include "config.h"

#include "sw-vehicle-shape.h"

#include "sw-phases.h"

#include <glib/gi18n-lib.h>

#include <math.h>
#include <string.h>

double
sw_frustum_side_area (double d1, double d2, double length)
{
  double r1 = d1 / 2.0, r2 = d2 / 2.0;

  return G_PI * (r1 + r2) * sqrt ((r1 - r2) * (r1 - r2) + length * length);
}

double
sw_tank_surface_area (double diameter, double length, double aspect)
{
  double a = diameter / 2.0;
  double dome_height = a / aspect;
  double cylinder = MAX (length - 2.0 * dome_height, 0.0);
  double spheroid;

  if (aspect <= 1.0)
    spheroid = 4.0 * G_PI * a * a;   /* a sphere (a prolate dome is not ours) */
  else
    {
      double e = sqrt (1.0 - 1.0 / (aspect * aspect));
      spheroid = 2.0 * G_PI * a * a * (1.0 + (1.0 - e * e) * atanh (e) / e);
    }
  return G_PI * diameter * cylinder + spheroid;
}

void
sw_vehicle_shape_compute (const SwDesign *design, const SwSizing *sizing, SwVehicleShape *out)
{
  double z = 0.0;

  g_return_if_fail (design != NULL && sizing != NULL && out != NULL);

  memset (out, 0, sizeof *out);
  out->fairing_diameter_m = out->fairing_cylinder_m = NAN;
  out->fairing_length_m = out->fairing_base_m = out->height_m = NAN;
  out->max_diameter_m = NAN;
  out->width_m = NAN;
  out->booster_diameter_m = out->booster_length_m = NAN;
  out->n_stages = MIN (design->n_stages, sizing->n_stages);
  out->complete = out->n_stages > 0 && sizing->feasible;
  if (out->n_stages == 0)
    g_strlcpy (out->reason, _("The design has no sized stages."), sizeof out->reason);
  else if (!sizing->feasible)
    g_strlcpy (out->reason, _("The vehicle has no shape: the sizing is not feasible."),
               sizeof out->reason);

  for (guint i = 0; i < out->n_stages; i++)
    {
      SwStageGeometry *g = &out->stages[i];
      const SwStage *st = &design->stages[i];

      g->diameter_m = sw_stage_effective_diameter (design, i);
      g->diameter_inherited = isfinite (g->diameter_m) && !st->propulsion.has_diameter;
      g->base_m = NAN;
      g->interstage_top_diameter_m = NAN;
      sw_sizing_stage_shape (design, sizing, i, &g->shape);
      g->has_shape = g->shape.valid && g->shape.has_length;
      if (out->complete && !g->has_shape)
        {
          out->complete = FALSE;
          if (!g->shape.valid)
            g_snprintf (out->reason, sizeof out->reason,
                        _("Stage %u (%s) has no propellant type chosen: choose one to see "
                          "its tanks and the vehicle to scale."), i + 1, st->name);
          else
            g_snprintf (out->reason, sizeof out->reason,
                        _("Stage %u (%s) has no diameter (nor has any stage below it): give one "
                          "to see the vehicle to scale."), i + 1, st->name);
        }
    }
  /* The boosters: their tanks from their propellant, their own diameter or
   * half the core's (the rule of their drag area). */
  if (out->complete && design->boosters.count > 0 && sizing->boosters.present)
    {
      SwStageShape bs;
      double d = design->boosters.has_diameter ? design->boosters.diameter_m
                                               : 0.5 * out->stages[0].diameter_m;

      sw_stage_shape (&design->boosters.propellant, sizing->boosters.propellant_mass_kg, d, &bs);
      if (!bs.valid || !bs.has_length)
        {
          out->complete = FALSE;
          g_strlcpy (out->reason,
                     _("The boosters have no propellant: choose one to see their tanks and "
                       "the vehicle to scale."), sizeof out->reason);
        }
      else
        {
          out->n_boosters = design->boosters.count;
          out->booster_diameter_m = d;
          out->booster_length_m = bs.length_m;
        }
    }
  if (!out->complete)
    return;

  out->max_diameter_m = 0.0;
  for (guint i = 0; i < out->n_stages; i++)
    {
      SwStageGeometry *g = &out->stages[i];

      g->base_m = z;
      z += g->shape.length_m;
      out->max_diameter_m = MAX (out->max_diameter_m, g->diameter_m);
      if (i + 1 < out->n_stages)
        {
          double up = out->stages[i + 1].diameter_m;
          g->interstage_top_diameter_m = up;
          g->interstage_length_m = SW_INTERSTAGE_PER_DIAMETER * MAX (g->diameter_m, up);
          z += g->interstage_length_m;
        }
    }
  out->fairing_diameter_m = out->stages[out->n_stages - 1].diameter_m;
  out->fairing_cylinder_m = SW_FAIRING_CYLINDER_PER_DIAMETER * out->fairing_diameter_m;
  out->fairing_length_m = SW_FAIRING_LENGTH_PER_DIAMETER * out->fairing_diameter_m;
  out->fairing_base_m = z;
  out->height_m = z + out->fairing_length_m;
  out->width_m = out->max_diameter_m;
  if (out->n_boosters > 0)
    out->width_m = MAX (out->width_m, out->stages[0].diameter_m
                                        + (out->n_boosters >= 2 ? 2.0 : 1.0)
                                          * out->booster_diameter_m);
}
