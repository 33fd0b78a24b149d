/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-reuse"

#include "config.h"

#include "sw-reuse.h"

#include "sw-booster-sizing.h"
#include "sw-economics.h"
#include "sw-fixed-vehicle.h"

#include <glib/gi18n-lib.h>
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

/* One recovered element (the first stage, or one booster): its recovery
 * delta-v, the ratio m_rec / m_dry and the raised structural coefficient;
 * SW_RECOVERY_NONE gives delta-v 0, ratio 0 and eps unchanged. */
typedef struct {
  double delta_v_m_s;
  double hardware_fraction;
  double propellant_ratio;
  double eps_effective;
} Recovery;

static void
recovery_of (SwRecoveryMode mode, double delta_v_in_force, double hardware_fraction, double eps,
             double exhaust_velocity_m_s, Recovery *r)
{
  r->delta_v_m_s = mode == SW_RECOVERY_NONE ? 0.0 : delta_v_in_force;
  r->hardware_fraction = mode == SW_RECOVERY_NONE ? 0.0 : hardware_fraction;
  r->propellant_ratio = sw_reuse_propellant_ratio (r->delta_v_m_s, exhaust_velocity_m_s);
  /* Expended: the coefficient itself, not its round trip through k. */
  r->eps_effective = mode == SW_RECOVERY_NONE
                       ? eps
                       : sw_reuse_effective_eps (eps, r->hardware_fraction, r->delta_v_m_s,
                                                 exhaust_velocity_m_s);
}

/* The inert mass the sizing gave a recovered element split into its landed
 * dry mass (structure and landing hardware), the recovery propellant and
 * the landing hardware: I = m_dry (1 + ratio), hardware = m_dry h / (1 + h). */
static void
inert_split (double inert_kg, const Recovery *r, double *dry_kg, double *propellant_kg,
             double *hardware_kg)
{
  *dry_kg = inert_kg / (1.0 + r->propellant_ratio);
  *propellant_kg = inert_kg - *dry_kg;
  *hardware_kg = *dry_kg * r->hardware_fraction / (1.0 + r->hardware_fraction);
}

/* What both paths share before sizing: the first stage's recovery. */
static void
begin (SwReuse *out, SwRecoveryMode mode, const SwEconomics *econ, double eps,
       double exhaust_velocity_m_s, Recovery *core)
{
  SwEconomics tmp = *econ;

  memset (out, 0, sizeof *out);
  out->mode = mode;
  /* The mode's default recovery delta-v unless the design sets one. */
  tmp.recovery_mode = mode;
  recovery_of (mode, sw_economics_recovery_delta_v (&tmp), econ->landing_hardware_fraction, eps,
               exhaust_velocity_m_s, core);
  out->delta_v_m_s = core->delta_v_m_s;
  out->exhaust_velocity_m_s = exhaust_velocity_m_s;
  out->propellant_ratio = core->propellant_ratio;
  out->eps_expendable = eps;
  out->eps_effective = core->eps_effective;
  out->liftoff_mass_increase = NAN;
  out->payload_same_liftoff_kg = NAN;
  out->payload_penalty_fraction = NAN;
  out->payload_same_tanks_kg = NAN;
  out->first_stage_dry_kg = NAN;
  out->landing_hardware_kg = NAN;
  out->recovery_propellant_kg = NAN;
  out->booster_mode = SW_RECOVERY_NONE;
  out->booster_dry_kg = NAN;
  out->booster_landing_hardware_kg = NAN;
  out->booster_recovery_propellant_kg = NAN;
}

/* What both paths share after sizing: the first stage's inert split and
 * the liftoff mass increase; FALSE when either vehicle does not close. */
static gboolean
finish (SwReuse *out, const Recovery *core)
{
  /* A recovered first stage that the split leaves without delta-v is no
   * first stage: nothing is recovered, and such a vehicle is not the one
   * the recovered columns describe. */
  if (out->reusable.feasible && out->mode != SW_RECOVERY_NONE
      && (out->reusable.stages[0].unused || !(out->reusable.stages[0].delta_v_m_s > 0.0)))
    {
      out->reusable.feasible = FALSE;
      g_strlcpy (out->reusable.reason,
                 _("the recovered first stage is optimised away (it would give no delta-v), "
                   "so there is no first stage to recover"),
                 sizeof out->reusable.reason);
    }
  if (out->reusable.feasible)
    inert_split (out->reusable.stages[0].structural_mass_kg, core, &out->first_stage_dry_kg,
                 &out->recovery_propellant_kg, &out->landing_hardware_kg);
  if (!out->expendable.feasible || !out->reusable.feasible)
    return FALSE;
  out->liftoff_mass_increase = out->reusable.liftoff_mass_kg / out->expendable.liftoff_mass_kg
                               - 1.0;
  return TRUE;
}

gboolean
sw_reuse_compute (const SwStageSet *set, double payload_kg, double delta_v_m_s,
                  SwSplitMode split, const SwEconomics *econ, SwRecoveryMode mode, SwReuse *out)
{
  SwStageSet reused;
  SwEconomics def;
  SwFixedVehicle fixed;
  Recovery core;
  double ms, mp;

  g_return_val_if_fail (set != NULL && out != NULL && set->n_stages > 0, FALSE);

  if (econ == NULL)
    {
      sw_economics_init (&def);
      econ = &def;
    }
  begin (out, mode, econ, set->structural_coefficient[0], set->exhaust_velocity_m_s[0], &core);

  sw_size (set, payload_kg, delta_v_m_s, split, &out->expendable);
  reused = *set;
  reused.structural_coefficient[0] = out->eps_effective;
  sw_size (&reused, payload_kg, delta_v_m_s, split, &out->reusable);
  if (!finish (out, &core))
    return FALSE;

  out->payload_same_liftoff_kg = payload_kg * out->expendable.liftoff_mass_kg
                                 / out->reusable.liftoff_mass_kg;
  out->payload_penalty_fraction = 1.0 - out->payload_same_liftoff_kg / payload_kg;

  /* The expendable tanks: the landing hardware added to the structure, the
   * recovery propellant taken out of the ascent load. */
  if (sw_fixed_vehicle_from_sizing (&fixed, &out->expendable))
    {
      double rec, payload, h = core.hardware_fraction;

      ms = fixed.structural_mass_kg[0];
      mp = fixed.propellant_mass_kg[0];
      rec = ms * (1.0 + h) * core.propellant_ratio;
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
  Recovery core, booster = { 0 };

  g_return_val_if_fail (v != NULL && out != NULL && v->set.n_stages > 0, FALSE);

  if (econ == NULL)
    {
      sw_economics_init (&def);
      econ = &def;
    }
  begin (out, mode, econ, v->set.structural_coefficient[0], v->set.exhaust_velocity_m_s[0],
         &core);
  reused = *v;
  /* The core's structure is inert through both of its phases, with the
   * boosters and alone, so the recovery propellant and hardware enter as
   * for a serial first stage: through its structural coefficient. */
  reused.set.structural_coefficient[0] = out->eps_effective;
  /* Each booster's structure is inert through its one phase: the same. */
  if (v->count > 0)
    {
      out->booster_mode = econ->booster_recovery_mode;
      recovery_of (out->booster_mode, sw_economics_booster_recovery_delta_v (econ),
                   econ->landing_hardware_fraction, v->booster_structural_coefficient,
                   v->booster_exhaust_velocity_m_s, &booster);
      out->booster_delta_v_m_s = booster.delta_v_m_s;
      out->booster_exhaust_velocity_m_s = v->booster_exhaust_velocity_m_s;
      out->booster_propellant_ratio = booster.propellant_ratio;
      out->booster_eps_expendable = v->booster_structural_coefficient;
      out->booster_eps_effective = booster.eps_effective;
      reused.booster_structural_coefficient = booster.eps_effective;
    }

  sw_size_parallel (v, payload_kg, delta_v_m_s, split, &out->expendable);
  sw_size_parallel (&reused, payload_kg, delta_v_m_s, split, &out->reusable);
  if (v->count > 0 && out->reusable.feasible && out->reusable.boosters.present)
    inert_split (out->reusable.boosters.structural_mass_kg, &booster, &out->booster_dry_kg,
                 &out->booster_recovery_propellant_kg, &out->booster_landing_hardware_kg);
  if (!finish (out, &core))
    return FALSE;

  /* Not linear in the payload with boosters: the root of the sizing. */
  if (mode == SW_RECOVERY_NONE && out->booster_mode == SW_RECOVERY_NONE)
    out->payload_same_liftoff_kg = payload_kg;
  else
    sw_parallel_payload_at_mass (&reused, delta_v_m_s, split, out->expendable.liftoff_mass_kg,
                                 payload_kg * out->expendable.liftoff_mass_kg
                                   / out->reusable.liftoff_mass_kg,
                                 &out->payload_same_liftoff_kg);
  out->payload_penalty_fraction = 1.0 - out->payload_same_liftoff_kg / payload_kg;
  return TRUE;
}
