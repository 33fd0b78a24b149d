/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-stage-thrust"

#include "config.h"

#include "sw-stage-thrust.h"

#include "sw-design-fields.h"
#include "sw-sizing.h"

#include <glib/gi18n-lib.h>
#include <math.h>

double
sw_default_ignition_tw (guint stage)
{
  return stage == 0 ? SW_DEFAULT_LIFTOFF_TW : SW_DEFAULT_UPPER_TW;
}

static gboolean
ignition_mass (const SwDesign *design, guint stage, double *mass_kg, GError **error)
{
  SwSizing sizing;

  if (!sw_size_design (design, &sizing, error))
    return FALSE;
  if (!sizing.feasible || stage >= sizing.n_stages
      || !isfinite (sizing.stages[stage].initial_mass_kg))
    {
      g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                   _("stages[%u]: the vehicle cannot be sized as it stands (%s), so its mass "
                     "at ignition is not known"), stage,
                   sizing.reason[0] ? sizing.reason : _("infeasible"));
      return FALSE;
    }
  *mass_kg = sizing.stages[stage].initial_mass_kg;
  return TRUE;
}

gboolean
sw_design_set_thrust_for_tw (SwDesign *design, guint stage, double tw, GError **error)
{
  const SwStagePropulsion *p;
  double mass, thrust_kn;

  g_return_val_if_fail (design != NULL, FALSE);
  if (stage >= design->n_stages)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_USAGE, _("stages[%u]: the design has %u stages"),
                   stage, design->n_stages);
      return FALSE;
    }
  if (!isfinite (tw) || !(tw > 0.0) || tw > SW_TW_MAX)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_RANGE,
                   _("stages[%u]: a thrust-to-weight of %g is outside the accepted range above "
                     "0 to %g"), stage, tw, SW_TW_MAX);
      return FALSE;
    }
  if (!ignition_mass (design, stage, &mass, error))
    return FALSE;
  thrust_kn = tw * SW_G0 * mass / 1000.0;
  p = &design->stages[stage].propulsion;
  if (p->has_engine_thrust)
    {
      const SwStageReliability *r = &design->stages[stage].reliability;
      guint n = r->has_engine_count && r->engine_count > 0 ? r->engine_count : 1;
      return sw_design_field_set (design, SW_FIELD_ENGINE_THRUST_VAC, stage, thrust_kn / n,
                                  error);
    }
  return sw_design_field_set (design, SW_FIELD_THRUST_VAC, stage, thrust_kn, error);
}

double
sw_design_stage_tw (const SwDesign *design, guint stage, double *with_boosters)
{
  const SwStage *s;
  double mass, thrust_n;

  g_return_val_if_fail (design != NULL, NAN);
  if (with_boosters != NULL)
    *with_boosters = NAN;
  if (stage >= design->n_stages)
    return NAN;
  s = &design->stages[stage];
  thrust_n = sw_stage_thrust_vac_n (&s->propulsion, s->reliability.has_engine_count
                                                      ? s->reliability.engine_count : 1);
  /* One sizing for both figures. */
  if (!isfinite (thrust_n) || !ignition_mass (design, stage, &mass, NULL))
    return NAN;
  if (with_boosters != NULL && stage == 0 && design->boosters.count > 0)
    *with_boosters = (thrust_n + design->boosters.count * design->boosters.thrust_vac_kn * 1000.0)
                     / (SW_G0 * mass);
  return thrust_n / (SW_G0 * mass);
}

double
sw_design_ignition_tw (const SwDesign *design, guint stage)
{
  return sw_design_stage_tw (design, stage, NULL);
}

double
sw_design_liftoff_tw_with_boosters (const SwDesign *design)
{
  double with;

  g_return_val_if_fail (design != NULL, NAN);
  sw_design_stage_tw (design, 0, &with);
  return with;
}
