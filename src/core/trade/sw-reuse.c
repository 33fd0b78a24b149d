/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-reuse"

#include "config.h"

#include "sw-reuse.h"

#include "sw-booster-sizing.h"
#include "sw-economics.h"
#include "sw-fixed-vehicle.h"

#include <math.h>
#include <string.h>

double
sw_reuse_propellant_ratio (double delta_v_m_s, double exhaust_velocity_m_s)
{
  g_return_val_if_fail (exhaust_velocity_m_s > 0.0, NAN);
  return expm1 (delta_v_m_s / exhaust_velocity_m_s);
}

double
sw_reuse_effective_eps (double eps, double hardware_fraction, double delta_v_m_s,
                        double exhaust_velocity_m_s)
{
  double k;

  g_return_val_if_fail (eps > 0.0 && eps < 1.0, NAN);
  k = eps / (1.0 - eps) * (1.0 + hardware_fraction)
      * (1.0 + sw_reuse_propellant_ratio (delta_v_m_s, exhaust_velocity_m_s));
  return k / (1.0 + k);
}

gboolean
sw_reuse_compute (const SwStageSet *set, double payload_kg, double delta_v_m_s,
                  SwSplitMode split, const SwEconomics *econ, SwRecoveryMode mode, SwReuse *out)
{
  SwStageSet reused;
  SwEconomics def;
  SwFixedVehicle fixed;
  double h, ratio, ms, mp;

  g_return_val_if_fail (set != NULL && out != NULL && set->n_stages > 0, FALSE);

  if (econ == NULL)
    {
      sw_economics_init (&def);
      econ = &def;
    }
  memset (out, 0, sizeof *out);
  out->mode = mode;
  /* The mode's default recovery delta-v unless the design sets one. */
  {
    SwEconomics tmp = *econ;
    tmp.recovery_mode = mode;
    out->delta_v_m_s = mode == SW_RECOVERY_NONE ? 0.0 : sw_economics_recovery_delta_v (&tmp);
  }
  h = mode == SW_RECOVERY_NONE ? 0.0 : econ->landing_hardware_fraction;
  out->exhaust_velocity_m_s = set->exhaust_velocity_m_s[0];
  ratio = sw_reuse_propellant_ratio (out->delta_v_m_s, out->exhaust_velocity_m_s);
  out->propellant_ratio = ratio;
  out->eps_expendable = set->structural_coefficient[0];
  out->eps_effective = sw_reuse_effective_eps (out->eps_expendable, h, out->delta_v_m_s,
                                               out->exhaust_velocity_m_s);

  sw_size (set, payload_kg, delta_v_m_s, split, &out->expendable);
  reused = *set;
  reused.structural_coefficient[0] = out->eps_effective;
  sw_size (&reused, payload_kg, delta_v_m_s, split, &out->reusable);

  out->liftoff_mass_increase = NAN;
  out->payload_same_liftoff_kg = NAN;
  out->payload_penalty_fraction = NAN;
  out->payload_same_tanks_kg = NAN;
  out->first_stage_dry_kg = NAN;
  out->landing_hardware_kg = NAN;
  out->recovery_propellant_kg = NAN;
  if (out->reusable.feasible)
    {
      /* The sized inert mass holds the landed dry mass and the recovery
       * propellant: I = m_dry (1 + ratio). */
      double inert = out->reusable.stages[0].structural_mass_kg;
      out->first_stage_dry_kg = inert / (1.0 + ratio);
      out->recovery_propellant_kg = inert - out->first_stage_dry_kg;
      out->landing_hardware_kg = out->first_stage_dry_kg * h / (1.0 + h);
    }
  if (!out->expendable.feasible || !out->reusable.feasible)
    return FALSE;

  out->liftoff_mass_increase = out->reusable.liftoff_mass_kg / out->expendable.liftoff_mass_kg
                               - 1.0;
  out->payload_same_liftoff_kg = payload_kg * out->expendable.liftoff_mass_kg
                                 / out->reusable.liftoff_mass_kg;
  out->payload_penalty_fraction = 1.0 - out->payload_same_liftoff_kg / payload_kg;

  /* The expendable tanks: the landing hardware added to the structure, the
   * recovery propellant taken out of the ascent load. */
  if (sw_fixed_vehicle_from_sizing (&fixed, &out->expendable))
    {
      double rec, payload;

      ms = fixed.structural_mass_kg[0];
      mp = fixed.propellant_mass_kg[0];
      rec = ms * (1.0 + h) * ratio;
      if (rec < mp)
        {
          fixed.structural_mass_kg[0] = ms * (1.0 + h) + rec;
          fixed.propellant_mass_kg[0] = mp - rec;
          if (sw_fixed_vehicle_payload (&fixed, delta_v_m_s, &payload))
            out->payload_same_tanks_kg = payload;
        }
    }
  return TRUE;
}

gboolean
sw_reuse_compute_parallel (const SwParallelVehicle *v, double payload_kg, double delta_v_m_s,
                           SwSplitMode split, const SwEconomics *econ, SwRecoveryMode mode,
                           SwReuse *out)
{
  SwParallelVehicle reused;
  SwEconomics def;
  double h, ratio;

  g_return_val_if_fail (v != NULL && out != NULL && v->set.n_stages > 0, FALSE);

  if (econ == NULL)
    {
      sw_economics_init (&def);
      econ = &def;
    }
  memset (out, 0, sizeof *out);
  out->mode = mode;
  {
    SwEconomics tmp = *econ;
    tmp.recovery_mode = mode;
    out->delta_v_m_s = mode == SW_RECOVERY_NONE ? 0.0 : sw_economics_recovery_delta_v (&tmp);
  }
  h = mode == SW_RECOVERY_NONE ? 0.0 : econ->landing_hardware_fraction;
  out->exhaust_velocity_m_s = v->set.exhaust_velocity_m_s[0];
  ratio = sw_reuse_propellant_ratio (out->delta_v_m_s, out->exhaust_velocity_m_s);
  out->propellant_ratio = ratio;
  out->eps_expendable = v->set.structural_coefficient[0];
  out->eps_effective = sw_reuse_effective_eps (out->eps_expendable, h, out->delta_v_m_s,
                                               out->exhaust_velocity_m_s);

  /* The core's structure is inert through both of its phases, with the
   * boosters and alone, so the recovery propellant and hardware enter as
   * for a serial first stage: through its structural coefficient. */
  sw_size_parallel (v, payload_kg, delta_v_m_s, split, &out->expendable);
  reused = *v;
  reused.set.structural_coefficient[0] = out->eps_effective;
  sw_size_parallel (&reused, payload_kg, delta_v_m_s, split, &out->reusable);

  out->liftoff_mass_increase = NAN;
  out->payload_same_liftoff_kg = NAN;
  out->payload_penalty_fraction = NAN;
  out->payload_same_tanks_kg = NAN;   /* not computed with boosters */
  out->first_stage_dry_kg = NAN;
  out->landing_hardware_kg = NAN;
  out->recovery_propellant_kg = NAN;
  if (out->reusable.feasible)
    {
      double inert = out->reusable.stages[0].structural_mass_kg;
      out->first_stage_dry_kg = inert / (1.0 + ratio);
      out->recovery_propellant_kg = inert - out->first_stage_dry_kg;
      out->landing_hardware_kg = out->first_stage_dry_kg * h / (1.0 + h);
    }
  if (!out->expendable.feasible || !out->reusable.feasible)
    return FALSE;

  out->liftoff_mass_increase = out->reusable.liftoff_mass_kg / out->expendable.liftoff_mass_kg
                               - 1.0;
  /* Not linear in the payload with boosters: the root of the sizing. */
  if (mode == SW_RECOVERY_NONE)
    out->payload_same_liftoff_kg = payload_kg;
  else
    sw_parallel_payload_at_mass (&reused, delta_v_m_s, split, out->expendable.liftoff_mass_kg,
                                 payload_kg * out->expendable.liftoff_mass_kg
                                   / out->reusable.liftoff_mass_kg,
                                 &out->payload_same_liftoff_kg);
  out->payload_penalty_fraction = 1.0 - out->payload_same_liftoff_kg / payload_kg;
  return TRUE;
}
