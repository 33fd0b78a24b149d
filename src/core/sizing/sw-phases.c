/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-phases"

#include "config.h"

#include "sw-phases.h"
#include "sw-format.h"

#include "sw-booster-sizing.h"
#include "sw-fixed-vehicle.h"

#include <glib/gi18n-lib.h>

#include <math.h>
#include <string.h>

guint
sw_sizing_phases (const SwDesign *design, const SwSizing *sizing, SwPhase *phases)
{
  guint n = 0;

  g_return_val_if_fail (design != NULL && sizing != NULL && phases != NULL, 0);

  if (!sizing->feasible)
    return 0;
  if (sizing->boosters.present)
    {
      const SwBoosterResult *b = &sizing->boosters;
      SwPhase *p = &phases[n++];

      memset (p, 0, sizeof *p);
      p->stage = 0;
      p->boosters = TRUE;
      p->delta_v_m_s = b->phase_delta_v_m_s;
      p->exhaust_velocity_m_s = b->mixed_exhaust_velocity_m_s;
      p->initial_mass_kg = b->phase_initial_mass_kg;
      p->final_mass_kg = b->phase_final_mass_kg;
      p->duration_s = b->phase_duration_s;
      p->fairing_mass_kg = b->fairing_phase == 1 ? b->fairing_mass_kg : NAN;
      p->fairing_drop_mass_kg = b->fairing_phase == 1 ? b->fairing_drop_mass_kg : NAN;
      p = &phases[n++];
      memset (p, 0, sizeof *p);
      p->stage = 0;
      p->delta_v_m_s = b->core_phase_delta_v_m_s;
      p->exhaust_velocity_m_s = sizing->stages[0].exhaust_velocity_m_s;
      p->initial_mass_kg = b->core_phase_initial_mass_kg;
      p->final_mass_kg = sizing->stages[0].burnout_mass_kg;
      p->duration_s = b->core_phase_duration_s;
      p->fairing_mass_kg = b->fairing_phase == 2 ? b->fairing_mass_kg : NAN;
      p->fairing_drop_mass_kg = b->fairing_phase == 2 ? b->fairing_drop_mass_kg : NAN;
    }
  for (guint i = sizing->boosters.present ? 1 : 0;
       i < sizing->n_stages && i < design->n_stages; i++)
    {
      const SwStageResult *r = &sizing->stages[i];
      const SwStage *st = &design->stages[i];
      SwPhase *p = &phases[n++];

      p->boosters = FALSE;
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
      p->fairing_mass_kg = p->fairing_drop_mass_kg = NAN;
      /* The stage that drops the fairing during its burn (after the
       * sizing's fraction of its propellant). */
      if (sizing->fairing.mass_kg > 0.0 && sizing->fairing.stage == i
          && !(sizing->boosters.present && i == 0))
        {
          p->fairing_mass_kg = sizing->fairing.mass_kg;
          p->fairing_drop_mass_kg = r->initial_mass_kg
                                    - sizing->fairing.fraction * r->propellant_mass_kg;
        }
    }
  return n;
}

char *
sw_phase_dup_name (const SwDesign *design, const SwPhase *phase)
{
  g_return_val_if_fail (design != NULL && phase != NULL, NULL);
  g_return_val_if_fail (phase->stage < design->n_stages, NULL);

  if (phase->boosters)
    /* TRANSLATORS: phase 0 of a vehicle with strap-on boosters: "Boosters + Stage 1". */
    return g_strdup_printf (_("%s + %s"), design->boosters.name,
                            design->stages[phase->stage].name);
  return g_strdup (design->stages[phase->stage].name);
}

void
sw_sizing_booster_shape (const SwDesign *design, const SwSizing *sizing, SwStageShape *out)
{
  g_return_if_fail (design != NULL && sizing != NULL && out != NULL);

  sw_stage_shape (&design->boosters.propellant,
                  sizing->boosters.present ? sizing->boosters.propellant_mass_kg : NAN,
                  design->boosters.has_diameter ? design->boosters.diameter_m : NAN, out);
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

gboolean
sw_design_performance (const SwDesign *design, SwPerformance *out, GError **error)
{
  SwFixedVehicle v;
  SwStageSet set;
  double fixed_kg[SW_MAX_STAGES] = { 0 };
  double dv, payload;

  g_return_val_if_fail (design != NULL && out != NULL, FALSE);

  memset (out, 0, sizeof *out);
  out->payload_kg = NAN;
  if (design->n_stages == 0 || design->n_stages > SW_MAX_STAGES)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_RANGE, _("The design has no stages."));
      return FALSE;
    }
  for (guint i = 0; i < design->n_stages; i++)
    if (!design->stages[i].propellant.has_propellant_kg)
      {
        g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                     _("stages[%u].propellant_kg: the payload capability needs a vehicle that "
                       "exists, with a fixed propellant load on every stage"), i);
        return FALSE;
      }
  if (!sw_design_required_delta_v (design, &dv, error))
    return FALSE;
  out->delta_v_m_s = dv;

  /* Boosters: their load must be fixed too; the phases' rocket equation. */
  if (design->boosters.count > 0)
    {
      SwParallelVehicle pv;

      if (!design->boosters.propellant.has_propellant_kg)
        {
          g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                       _("boosters.propellant_kg: the payload capability needs a vehicle that "
                         "exists, with a fixed propellant load on the boosters too"));
          return FALSE;
        }
      if (!sw_parallel_vehicle_from_design (&pv, design, error))
        return FALSE;
      if (!sw_parallel_payload (&pv, dv, &payload, &out->empty_delta_v_m_s) || !(payload > 0.0))
        {
          g_snprintf (out->reason, sizeof out->reason,
                      _("The vehicle cannot reach the %s required even with no payload: "
                        "empty, it gives %s."),
                      SW_SPEED (dv), SW_SPEED (out->empty_delta_v_m_s));
          sw_size_parallel (&pv, 0.0, dv, design->split, &out->sizing);
          return TRUE;
        }
      out->reachable = TRUE;
      out->payload_kg = payload;
      sw_size_parallel (&pv, payload, dv, design->split, &out->sizing);
      return TRUE;
    }

  memset (&v, 0, sizeof v);
  v.n_stages = design->n_stages;
  sw_fairing_carry_default (design, design->n_stages, &v.fairing);
  for (guint i = 0; i < design->n_stages; i++)
    {
      const SwStage *st = &design->stages[i];
      fixed_kg[i] = st->propellant.propellant_kg;
      v.exhaust_velocity_m_s[i] = st->isp_vac_s * SW_G0;
      v.propellant_mass_kg[i] = st->propellant.propellant_kg;
      v.structural_mass_kg[i] = st->propellant.propellant_kg * st->structural_coefficient
                                / (1.0 - st->structural_coefficient);
    }
  out->empty_delta_v_m_s = sw_fixed_vehicle_delta_v (&v, 0.0);
  sw_stage_set_from_design (&set, design);
  if (!sw_fixed_vehicle_payload (&v, dv, &payload) || !(payload > 0.0))
    {
      g_snprintf (out->reason, sizeof out->reason,
                  _("The vehicle cannot reach the %s required even with no payload: "
                    "empty, it gives %s."),
                  SW_SPEED (dv), SW_SPEED (out->empty_delta_v_m_s));
      sw_size_with_fixed (&set, fixed_kg, 0.0, dv, design->split, &out->sizing);
      return TRUE;
    }
  out->reachable = TRUE;
  out->payload_kg = payload;
  sw_size_with_fixed (&set, fixed_kg, payload, dv, design->split, &out->sizing);
  return TRUE;
}

gboolean
sw_design_all_fixed (const SwDesign *design)
{
  g_return_val_if_fail (design != NULL, FALSE);

  if (design->n_stages == 0)
    return FALSE;
  for (guint i = 0; i < design->n_stages; i++)
    if (!design->stages[i].propellant.has_propellant_kg)
      return FALSE;
  return design->boosters.count == 0 || design->boosters.propellant.has_propellant_kg;
}

static gboolean
serial_of_fixed_loads (const SwParallelVehicle *v, SwFixedVehicle *out)
{
  memset (out, 0, sizeof *out);
  out->n_stages = v->set.n_stages;
  out->fairing = v->set.fairing;
  for (guint i = 0; i < v->set.n_stages; i++)
    {
      double eps = v->set.structural_coefficient[i];

      if (!(v->fixed_kg[i] > 0.0) || !(eps < 1.0))
        return FALSE;
      out->exhaust_velocity_m_s[i] = v->set.exhaust_velocity_m_s[i];
      out->propellant_mass_kg[i] = v->fixed_kg[i];
      out->structural_mass_kg[i] = v->fixed_kg[i] * eps / (1.0 - eps);
    }
  return TRUE;
}

double
sw_fixed_loads_payload (const SwParallelVehicle *v, double delta_v_m_s)
{
  SwFixedVehicle f;
  double p = NAN;

  g_return_val_if_fail (v != NULL, NAN);

  if (v->count > 0)
    return sw_parallel_payload (v, delta_v_m_s, &p, NULL) ? p : NAN;
  if (!serial_of_fixed_loads (v, &f) || !sw_fixed_vehicle_payload (&f, delta_v_m_s, &p))
    return NAN;
  return p;
}

double
sw_fixed_loads_delta_v (const SwParallelVehicle *v, double payload_kg)
{
  SwFixedVehicle f;
  double dv = NAN;

  g_return_val_if_fail (v != NULL, NAN);

  if (v->count > 0)
    {
      if (!(v->booster_fixed_kg > 0.0) || !(v->fixed_kg[0] > 0.0)
          || !isfinite (sw_parallel_liftoff_mass (v, payload_kg, v->booster_fixed_kg,
                                                  v->fixed_kg[0], 0.0, &dv)))
        return NAN;
      for (guint i = 1; i < v->set.n_stages; i++)
        if (!(v->fixed_kg[i] > 0.0))
          return NAN;
      return dv;
    }
  if (!serial_of_fixed_loads (v, &f))
    return NAN;
  return sw_fixed_vehicle_delta_v (&f, payload_kg);
}

double
sw_fixed_loads_liftoff_mass (const SwParallelVehicle *v, double payload_kg)
{
  double m = payload_kg + MAX (v->set.fairing.mass_kg, 0.0);

  g_return_val_if_fail (v != NULL, NAN);

  for (guint i = 0; i < v->set.n_stages; i++)
    {
      if (!(v->fixed_kg[i] > 0.0))
        return NAN;
      m += v->fixed_kg[i] / (1.0 - v->set.structural_coefficient[i]);
    }
  if (v->count > 0)
    {
      if (!(v->booster_fixed_kg > 0.0))
        return NAN;
      m += v->count * v->booster_fixed_kg / (1.0 - v->booster_structural_coefficient);
    }
  return m;
}
