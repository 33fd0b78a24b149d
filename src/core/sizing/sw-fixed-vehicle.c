/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-fixed-vehicle"

#include "config.h"

#include "sw-fixed-vehicle.h"

#include <gsl/gsl_errno.h>
#include <gsl/gsl_roots.h>
#include <math.h>
#include <string.h>

gboolean
sw_fixed_vehicle_from_sizing (SwFixedVehicle *vehicle, const SwSizing *sizing)
{
  g_return_val_if_fail (vehicle != NULL && sizing != NULL, FALSE);

  memset (vehicle, 0, sizeof *vehicle);
  if (!sizing->feasible)
    return FALSE;
  vehicle->n_stages = sizing->n_stages;
  vehicle->fairing = sizing->fairing;
  for (guint i = 0; i < sizing->n_stages; i++)
    {
      vehicle->exhaust_velocity_m_s[i] = sizing->stages[i].exhaust_velocity_m_s;
      vehicle->propellant_mass_kg[i] = sizing->stages[i].propellant_mass_kg;
      vehicle->structural_mass_kg[i] = sizing->stages[i].structural_mass_kg;
    }
  return TRUE;
}

double
sw_fixed_vehicle_delta_v (const SwFixedVehicle *v, double payload_kg)
{
  double above = payload_kg, dv = 0.0;

  for (int i = (int) v->n_stages - 1; i >= 0; i--)
    {
      double mf = above + v->structural_mass_kg[i];
      double m0 = mf + v->propellant_mass_kg[i];

      if (v->propellant_mass_kg[i] > 0.0)
        {
          if (!(mf > 0.0))
            return NAN;
          dv += v->exhaust_velocity_m_s[i] * log (m0 / mf);
        }
      above = m0;
      /* The fairing (sw-sizing.h): the stage that drops it carries it for
       * the first share of its propellant, the stages below it all along. */
      if (v->fairing.mass_kg > 0.0 && (guint) i == v->fairing.stage)
        {
          double F = v->fairing.mass_kg, mp = v->propellant_mass_kg[i];
          double left = (1.0 - CLAMP (v->fairing.fraction, 0.0, 1.0)) * mp;

          if (mp > 0.0)
            dv += v->exhaust_velocity_m_s[i] * (log ((m0 + F) / (mf + left + F))
                                                - log (m0 / (mf + left)));
          above = m0 + F;
        }
    }
  return dv;
}

/* The smallest payload that keeps every burnout mass positive. */
static double
payload_floor (const SwFixedVehicle *v)
{
  double floor_kg = -INFINITY, above = 0.0;

  for (int i = (int) v->n_stages - 1; i >= 0; i--)
    {
      double mf = above + v->structural_mass_kg[i];
      if (v->propellant_mass_kg[i] > 0.0)
        floor_kg = MAX (floor_kg, -mf);
      above = mf + v->propellant_mass_kg[i];
    }
  return floor_kg;
}

typedef struct {
  const SwFixedVehicle *v;
  double delta_v;
} PayloadParams;

static double
payload_residual (double payload, void *data)
{
  const PayloadParams *p = data;
  return sw_fixed_vehicle_delta_v (p->v, payload) - p->delta_v;
}

gboolean
sw_fixed_vehicle_payload (const SwFixedVehicle *vehicle, double delta_v_m_s, double *payload_kg)
{
  PayloadParams params = { vehicle, delta_v_m_s };
  gsl_function fn = { payload_residual, &params };
  gsl_root_fsolver *solver;
  double lo, hi, total = 0.0, scale;
  int status = GSL_CONTINUE;

  g_return_val_if_fail (vehicle != NULL && payload_kg != NULL, FALSE);

  *payload_kg = NAN;
  lo = payload_floor (vehicle);
  if (!isfinite (lo) || !(delta_v_m_s > 0.0))
    return FALSE;
  for (guint i = 0; i < vehicle->n_stages; i++)
    total += vehicle->propellant_mass_kg[i] + vehicle->structural_mass_kg[i];

  /* delta-v falls from +infinity at the floor towards 0 for a huge payload:
   * step just above the floor, and double the upper end until it brackets. */
  scale = MAX (total, 1.0);
  lo += 1e-12 * scale;
  if (payload_residual (lo, &params) <= 0.0)
    {
      *payload_kg = lo;
      return TRUE;
    }
  hi = MAX (lo, 0.0) + 0.01 * scale;
  for (int k = 0; k < 200 && payload_residual (hi, &params) > 0.0; k++)
    hi = hi * 2.0 + scale;

  solver = gsl_root_fsolver_alloc (gsl_root_fsolver_brent);
  gsl_root_fsolver_set (solver, &fn, lo, hi);
  for (int iter = 0; iter < 200 && status == GSL_CONTINUE; iter++)
    {
      gsl_root_fsolver_iterate (solver);
      lo = gsl_root_fsolver_x_lower (solver);
      hi = gsl_root_fsolver_x_upper (solver);
      status = gsl_root_test_interval (lo, hi, 1e-9 * scale * 1e-3, 1e-12);
    }
  *payload_kg = gsl_root_fsolver_root (solver);
  gsl_root_fsolver_free (solver);
  return TRUE;
}

gboolean
sw_fixed_vehicle_exchange_ratios (const SwFixedVehicle *vehicle, double delta_v_m_s,
                                  double added_kg, double *ratios)
{
  g_return_val_if_fail (vehicle != NULL && ratios != NULL && added_kg > 0.0, FALSE);

  for (guint k = 0; k < vehicle->n_stages; k++)
    {
      SwFixedVehicle plus = *vehicle, minus = *vehicle;
      double p_plus, p_minus;

      plus.structural_mass_kg[k] += added_kg;
      minus.structural_mass_kg[k] -= added_kg;
      if (!sw_fixed_vehicle_payload (&plus, delta_v_m_s, &p_plus)
          || !sw_fixed_vehicle_payload (&minus, delta_v_m_s, &p_minus))
        return FALSE;
      ratios[k] = (p_minus - p_plus) / (2.0 * added_kg);
    }
  return TRUE;
}

void
sw_fixed_vehicle_exchange_ratios_analytic (const SwFixedVehicle *v, double payload_kg,
                                           double *ratios)
{
  double a[SW_MAX_STAGES] = { 0 }, above = payload_kg, sum = 0.0, partial = 0.0;

  for (int i = (int) v->n_stages - 1; i >= 0; i--)
    {
      double mf = above + v->structural_mass_kg[i];
      double m0 = mf + v->propellant_mass_kg[i];
      if (v->propellant_mass_kg[i] > 0.0)
        a[i] = v->exhaust_velocity_m_s[i] * (1.0 / mf - 1.0 / m0);
      sum += a[i];
      above = m0;
    }
  for (guint k = 0; k < v->n_stages; k++)
    {
      partial += a[k];
      ratios[k] = sum > 0.0 ? partial / sum : NAN;
    }
}
