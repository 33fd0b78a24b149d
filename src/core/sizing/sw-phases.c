/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-phases"

#include "config.h"

#include "sw-phases.h"

#include <math.h>
#include <string.h>

guint
sw_sizing_phases (const SwDesign *design, const SwSizing *sizing, SwPhase *phases)
{
  guint n = 0;

  g_return_val_if_fail (design != NULL && sizing != NULL && phases != NULL, 0);

  if (!sizing->feasible)
    return 0;
  for (guint i = 0; i < sizing->n_stages && i < design->n_stages; i++)
    {
      const SwStageResult *r = &sizing->stages[i];
      const SwStage *st = &design->stages[i];
      SwPhase *p = &phases[n++];
      guint engines = st->reliability.has_engine_count ? st->reliability.engine_count : 0;
      double thrust = sw_stage_thrust_vac_n (&st->propulsion, engines);

      p->stage = i;
      p->delta_v_m_s = r->delta_v_m_s;
      p->exhaust_velocity_m_s = r->exhaust_velocity_m_s;
      p->initial_mass_kg = r->initial_mass_kg;
      p->final_mass_kg = r->burnout_mass_kg;
      p->duration_s = isfinite (thrust) && thrust > 0.0
                        ? r->propellant_mass_kg / sw_propulsion_mass_flow (thrust, st->isp_vac_s)
                        : NAN;
    }
  return n;
}

double
sw_stage_effective_diameter (const SwDesign *design, guint stage)
{
  g_return_val_if_fail (design != NULL, NAN);

  for (int i = (int) MIN (stage, design->n_stages - 1); i >= 0; i--)
    if (design->stages[i].propulsion.has_diameter)
      return design->stages[i].propulsion.diameter_m;
  return NAN;
}

void
sw_sizing_stage_shape (const SwDesign *design, const SwSizing *sizing, guint stage,
                       SwStageShape *out)
{
  g_return_if_fail (design != NULL && sizing != NULL && out != NULL);
  g_return_if_fail (stage < design->n_stages && stage < sizing->n_stages);

  sw_stage_shape (&design->stages[stage].propellant, sizing->stages[stage].propellant_mass_kg,
                  sw_stage_effective_diameter (design, stage), out);
}
