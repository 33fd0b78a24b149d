/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-sizing"

#include "config.h"

#include "sw-sizing.h"

#include "sw-budget.h"

#include <glib/gi18n-lib.h>
#include <gsl/gsl_errno.h>
#include <gsl/gsl_roots.h>
#include <math.h>

void
sw_stage_set_from_design (SwStageSet *set, const SwDesign *design)
{
  g_return_if_fail (set != NULL && design != NULL);

  set->n_stages = MIN (design->n_stages, SW_MAX_STAGES);
  for (guint i = 0; i < set->n_stages; i++)
    {
      set->exhaust_velocity_m_s[i] = design->stages[i].isp_vac_s * SW_G0;
      set->structural_coefficient[i] = design->stages[i].structural_coefficient;
      set->share[i] = design->stages[i].delta_v_share;
    }
}

void
sw_stage_set_extend (SwStageSet *set, const SwDesign *design, guint n_stages)
{
  g_return_if_fail (set != NULL && design != NULL && design->n_stages > 0);

  n_stages = CLAMP (n_stages, 1, SW_MAX_STAGES);
  set->n_stages = n_stages;
  for (guint k = 0; k < n_stages; k++)
    {
      const SwStage *src = &design->stages[MIN (k, design->n_stages - 1)];
      set->exhaust_velocity_m_s[k] = src->isp_vac_s * SW_G0;
      set->structural_coefficient[k] = src->structural_coefficient;
      set->share[k] = 1.0 / n_stages;
    }
}

static double
stage_limit (double c, double eps)
{
  return c * log (1.0 / eps);
}

/* Optimal split, Lagrange-multiplier method (H. D. Curtis, Orbital Mechanics
 * for Engineering Students, sec. 11.6).  With c_i = Isp_i g0 and eps_i the
 * structural coefficient, minimising ln(m0/m_payload) under sum c_i ln n_i = dv
 * gives for every stage that fires
 *     n_i = (c_i eta - 1) / (c_i eps_i eta).
 * We solve in x = 1/eta (m/s), where n_i = (1 - x/c_i) / eps_i falls with x.
 * The objective is convex in ln n_i, so the Karush-Kuhn-Tucker conditions give
 * the boundary case: a stage whose n_i would fall below 1 takes no delta-v
 * (n_i = 1, no propellant).  F(x) = sum c_i ln max(1, n_i(x)) - dv is then
 * continuous and decreasing, positive at x = 0 (the vehicle's limit minus dv)
 * and equal to -dv at x = max c_i (1 - eps_i); Brent's method brackets it. */
typedef struct {
  const SwStageSet *set;
  double delta_v;
} OptimalParams;

static double
optimal_delta_v_at (const SwStageSet *set, double x, double *stage_dv)
{
  double sum = 0.0;

  for (guint i = 0; i < set->n_stages; i++)
    {
      double c = set->exhaust_velocity_m_s[i];
      double n = (1.0 - x / c) / set->structural_coefficient[i];
      double dv = n > 1.0 ? c * log (n) : 0.0;
      if (stage_dv != NULL)
        stage_dv[i] = dv;
      sum += dv;
    }
  return sum;
}

static double
optimal_residual (double x, void *data)
{
  const OptimalParams *p = data;
  return optimal_delta_v_at (p->set, x, NULL) - p->delta_v;
}

static double
vehicle_limit (const SwStageSet *set)
{
  double limit = 0.0;
  for (guint i = 0; i < set->n_stages; i++)
    limit += stage_limit (set->exhaust_velocity_m_s[i], set->structural_coefficient[i]);
  return limit;
}

gboolean
sw_optimal_split (const SwStageSet *set, double delta_v_m_s,
                  double *stage_delta_v, double *multiplier_s_m)
{
  OptimalParams params = { set, delta_v_m_s };
  gsl_function fn = { optimal_residual, &params };
  gsl_root_fsolver *solver;
  double lo = 0.0, hi = 0.0, x = 0.0, sum;
  int status = GSL_CONTINUE;

  g_return_val_if_fail (set != NULL && set->n_stages > 0, FALSE);
  g_return_val_if_fail (stage_delta_v != NULL, FALSE);

  if (!(delta_v_m_s < vehicle_limit (set)))
    return FALSE;

  for (guint i = 0; i < set->n_stages; i++)
    hi = MAX (hi, set->exhaust_velocity_m_s[i] * (1.0 - set->structural_coefficient[i]));

  if (delta_v_m_s <= 0.0)
    {
      for (guint i = 0; i < set->n_stages; i++)
        stage_delta_v[i] = 0.0;
      if (multiplier_s_m != NULL)
        *multiplier_s_m = 1.0 / hi;
      return TRUE;
    }

  solver = gsl_root_fsolver_alloc (gsl_root_fsolver_brent);
  gsl_root_fsolver_set (solver, &fn, lo, hi);
  for (int iter = 0; iter < 200 && status == GSL_CONTINUE; iter++)
    {
      gsl_root_fsolver_iterate (solver);
      lo = gsl_root_fsolver_x_lower (solver);
      hi = gsl_root_fsolver_x_upper (solver);
      status = gsl_root_test_interval (lo, hi, 1e-9, 1e-10);
    }
  x = gsl_root_fsolver_root (solver);
  gsl_root_fsolver_free (solver);

  /* Close the last rounding gap so the split delivers exactly delta_v. */
  sum = optimal_delta_v_at (set, x, stage_delta_v);
  if (sum > 0.0)
    for (guint i = 0; i < set->n_stages; i++)
      stage_delta_v[i] *= delta_v_m_s / sum;

  if (multiplier_s_m != NULL)
    *multiplier_s_m = x > 0.0 ? 1.0 / x : NAN;
  return TRUE;
}

double
sw_liftoff_mass_for_split (const SwStageSet *set, double payload_kg, const double *stage_delta_v)
{
  double m = payload_kg;

  for (int i = (int) set->n_stages - 1; i >= 0; i--)
    {
      double eps = set->structural_coefficient[i];
      double n = exp (stage_delta_v[i] / set->exhaust_velocity_m_s[i]);
      if (!(stage_delta_v[i] >= 0.0) || !(n * eps < 1.0))
        return NAN;
      m *= n * (1.0 - eps) / (1.0 - n * eps);
    }
  return m;
}

static void
stage_label (const SwDesign *design, guint index, char *buf, gsize size)
{
  if (design != NULL && index < design->n_stages && design->stages[index].name[0] != '\0')
    g_snprintf (buf, size, _("stage %u (%s)"), index + 1, design->stages[index].name);
  else
    g_snprintf (buf, size, _("stage %u"), index + 1);
}

static void
size_with_names (const SwStageSet *set, const SwDesign *names, double payload_kg,
                 double delta_v_m_s, SwSplitMode split, SwSizing *out)
{
  double dv[SW_MAX_STAGES] = { 0 };
  double m_above;
  guint n = set->n_stages;
  char label[SW_NAME_MAX + 32];

  memset (out, 0, sizeof *out);
  out->split = split;
  out->n_stages = n;
  out->payload_kg = payload_kg;
  out->delta_v_m_s = delta_v_m_s;
  out->feasible = TRUE;
  out->infeasible_stage = -1;
  out->liftoff_mass_kg = NAN;
  out->payload_fraction = NAN;
  out->multiplier_s_m = NAN;
  out->delta_v_limit_m_s = vehicle_limit (set);
  out->margin_m_s = out->delta_v_limit_m_s - delta_v_m_s;

  for (guint i = 0; i < n; i++)
    {
      SwStageResult *r = &out->stages[i];
      r->exhaust_velocity_m_s = set->exhaust_velocity_m_s[i];
      r->delta_v_limit_m_s = stage_limit (r->exhaust_velocity_m_s, set->structural_coefficient[i]);
      r->feasible = TRUE;
    }

  switch (split)
    {
    case SW_SPLIT_EQUAL:
      for (guint i = 0; i < n; i++)
        dv[i] = delta_v_m_s / n;
      break;
    case SW_SPLIT_MANUAL:
      for (guint i = 0; i < n; i++)
        dv[i] = set->share[i] * delta_v_m_s;
      break;
    case SW_SPLIT_OPTIMAL:
    default:
      if (!sw_optimal_split (set, delta_v_m_s, dv, &out->multiplier_s_m))
        {
          out->feasible = FALSE;
          g_snprintf (out->reason, sizeof out->reason,
                      _("The required delta-v of %.0f m/s is at or beyond the limit of "
                        "%.0f m/s that these %u stages reach even when empty of payload "
                        "(the sum of c ln(1/eps) over the stages)."),
                      delta_v_m_s, out->delta_v_limit_m_s, n);
          /* No split exists: every per-stage figure is undefined (NAN, never
           * the zeros of the memset). */
          for (guint i = 0; i < n; i++)
            {
              SwStageResult *r = &out->stages[i];
              r->feasible = FALSE;
              r->delta_v_m_s = r->delta_v_share = r->mass_ratio = NAN;
              r->propellant_mass_kg = r->structural_mass_kg = r->stage_mass_kg = NAN;
              r->payload_mass_kg = r->initial_mass_kg = r->burnout_mass_kg = NAN;
            }
          return;
        }
      break;
    }

  for (guint i = 0; i < n; i++)
    {
      SwStageResult *r = &out->stages[i];
      r->delta_v_m_s = dv[i];
      r->delta_v_share = delta_v_m_s > 0.0 ? dv[i] / delta_v_m_s : 0.0;
      r->mass_ratio = exp (dv[i] / r->exhaust_velocity_m_s);
      r->unused = split == SW_SPLIT_OPTIMAL && dv[i] <= 0.0;
      if (r->unused)
        out->n_unused++;
      if (!(dv[i] < r->delta_v_limit_m_s))
        {
          r->feasible = FALSE;
          if (out->feasible)
            {
              out->feasible = FALSE;
              out->infeasible_stage = (int) i;
              stage_label (names, i, label, sizeof label);
              g_snprintf (out->reason, sizeof out->reason,
                          _("%s must give %.0f m/s but cannot give more than %.0f m/s: its "
                            "mass ratio would reach 1/eps = %.2f even with no payload."),
                          label, dv[i], r->delta_v_limit_m_s,
                          1.0 / set->structural_coefficient[i]);
            }
        }
    }

  if (!out->feasible)
    {
      if (out->infeasible_stage >= 0 && !(out->margin_m_s > 0.0))
        {
          size_t len = strlen (out->reason);
          g_snprintf (out->reason + len, sizeof out->reason - len,
                      _(" The whole vehicle reaches at most %.0f m/s."),
                      out->delta_v_limit_m_s);
        }
      for (guint i = 0; i < n; i++)
        {
          SwStageResult *r = &out->stages[i];
          r->propellant_mass_kg = r->structural_mass_kg = r->stage_mass_kg = NAN;
          r->payload_mass_kg = r->initial_mass_kg = r->burnout_mass_kg = NAN;
        }
      return;
    }

  m_above = payload_kg;
  for (int i = (int) n - 1; i >= 0; i--)
    {
      SwStageResult *r = &out->stages[i];
      double eps = set->structural_coefficient[i];
      double nr = r->mass_ratio;
      double m0 = m_above * nr * (1.0 - eps) / (1.0 - nr * eps);

      r->payload_mass_kg = m_above;
      r->initial_mass_kg = m0;
      r->burnout_mass_kg = m0 / nr;
      r->propellant_mass_kg = m0 - r->burnout_mass_kg;
      r->structural_mass_kg = r->unused ? 0.0 : r->burnout_mass_kg - m_above;
      r->stage_mass_kg = r->propellant_mass_kg + r->structural_mass_kg;
      m_above = m0;
    }
  out->liftoff_mass_kg = m_above;
  out->payload_fraction = payload_kg / m_above;

  if (out->n_unused > 0)
    {
      for (guint i = 0; i < n; i++)
        if (out->stages[i].unused)
          {
            stage_label (names, i, label, sizeof label);
            g_snprintf (out->reason, sizeof out->reason,
                        _("At the optimum %s gets no delta-v and carries no propellant: "
                          "the vehicle is lighter without it."),
                        label);
            break;
          }
    }
}

void
sw_size (const SwStageSet *set, double payload_kg, double delta_v_m_s,
         SwSplitMode split, SwSizing *out)
{
  g_return_if_fail (set != NULL && out != NULL && set->n_stages > 0);
  size_with_names (set, NULL, payload_kg, delta_v_m_s, split, out);
}

guint
sw_sizing_get_shares (const SwSizing *sizing, double *shares)
{
  g_return_val_if_fail (sizing != NULL && shares != NULL, 0);

  if (!(sizing->delta_v_m_s > 0.0) || sizing->n_stages == 0 || sizing->n_stages > SW_MAX_STAGES)
    return 0;
  for (guint i = 0; i < sizing->n_stages; i++)
    {
      shares[i] = sizing->stages[i].delta_v_share;
      if (!isfinite (shares[i]) || shares[i] < 0.0)
        return 0;
    }
  return sizing->n_stages;
}

gboolean
sw_size_design (const SwDesign *design, SwSizing *out, GError **error)
{
  SwStageSet set;
  double dv;

  g_return_val_if_fail (design != NULL && out != NULL, FALSE);

  if (design->n_stages == 0)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_RANGE, _("The design has no stages."));
      return FALSE;
    }
  if (!sw_design_required_delta_v (design, &dv, error))
    return FALSE;
  sw_stage_set_from_design (&set, design);
  size_with_names (&set, design, design->payload_kg, dv, design->split, out);
  return TRUE;
}

double
sw_eps_to_form (double eps, SwEpsForm form)
{
  switch (form)
    {
    case SW_EPS_STRUCTURE_RATIO:
      return eps / (1.0 - eps);
    case SW_EPS_WET_DRY_RATIO:
      return 1.0 / eps;
    case SW_EPS_PROPELLANT_FRACTION:
      return 1.0 - eps;
    case SW_EPS_COEFFICIENT:
    default:
      return eps;
    }
}

double
sw_eps_from_form (double value, SwEpsForm form)
{
  switch (form)
    {
    case SW_EPS_STRUCTURE_RATIO:
      return value / (1.0 + value);
    case SW_EPS_WET_DRY_RATIO:
      return 1.0 / value;
    case SW_EPS_PROPELLANT_FRACTION:
      return 1.0 - value;
    case SW_EPS_COEFFICIENT:
    default:
      return value;
    }
}

void
sw_eps_form_range (SwEpsForm form, double eps_min, double eps_max, double *lo, double *hi)
{
  double a = sw_eps_to_form (eps_min, form);
  double b = sw_eps_to_form (eps_max, form);
  *lo = MIN (a, b);
  *hi = MAX (a, b);
}

const char *
sw_eps_form_to_string (SwEpsForm form)
{
  switch (form)
    {
    case SW_EPS_STRUCTURE_RATIO:
      return "structure-ratio";
    case SW_EPS_WET_DRY_RATIO:
      return "wet-dry-ratio";
    case SW_EPS_PROPELLANT_FRACTION:
      return "propellant-fraction";
    case SW_EPS_COEFFICIENT:
    default:
      return "coefficient";
    }
}
