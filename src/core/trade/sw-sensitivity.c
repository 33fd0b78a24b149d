/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-sensitivity"

#include "config.h"

#include "sw-sensitivity.h"

#include "sw-booster-sizing.h"
#include "sw-fixed-vehicle.h"
#include "sw-phases.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

/* With m0 = P prod_i f_i(n_i), f = n (1 - eps) / (1 - n eps) and
 * n_i = exp(dv_i / c_i) (Tsiolkovsky, each stage carrying all above it):
 *   d ln m0 / d eps_i = (n_i - 1) / ((1 - eps_i) (1 - n_i eps_i))     (n_i fixed)
 *   d ln m0 / d c_i   = -dv_i / (c_i^2 (1 - n_i eps_i))               (dv_i fixed)
 *   d ln m0 / d dv    = sum_i share_i / (c_i (1 - n_i eps_i))          (shares fixed)
 *   d ln m0 / d P     = 1 / P.
 * At the Lagrange optimum every firing stage has 1/(c_i (1 - n_i eps_i)) =
 * eta, the multiplier (Curtis, Orbital Mechanics for Engineering Students,
 * sec. 11.6), so d ln m0 / d dv = eta; by the envelope theorem the partials at
 * the fixed optimal split equal the total derivatives. */
void
sw_sensitivity_analytic (const SwStageSet *set, const SwSizing *sizing, double *d_payload,
                         double *d_delta_v, double *d_isp, double *d_eps)
{
  double m0 = sizing->liftoff_mass_kg, dlnm_ddv = 0.0;

  g_return_if_fail (set != NULL && sizing != NULL && sizing->feasible);

  for (guint i = 0; i < set->n_stages; i++)
    {
      const SwStageResult *r = &sizing->stages[i];
      double c = set->exhaust_velocity_m_s[i], eps = set->structural_coefficient[i];
      double n = r->mass_ratio, denom = 1.0 - n * eps;

      if (d_eps != NULL)
        d_eps[i] = m0 * (n - 1.0) / ((1.0 - eps) * denom);
      if (d_isp != NULL)
        d_isp[i] = -m0 * r->delta_v_m_s / (c * c * denom) * SW_G0;
      dlnm_ddv += r->delta_v_share / (c * denom);
    }
  if (d_delta_v != NULL)
    *d_delta_v = m0 * dlnm_ddv;
  if (d_payload != NULL)
    *d_payload = m0 / sizing->payload_kg;
}

/* @fixed_kg (NULL: none) the design's fixed loads, as sw_size_design takes
 * them (sw_size_with_fixed). */
static double
perturbed_mass_fixed (const SwStageSet *set, const double *fixed_kg, double payload, double dv,
                      SwSplitMode split, SwSensParam param, int stage, double factor)
{
  SwStageSet s = *set;
  SwSizing sizing;

  switch (param)
    {
    case SW_SENS_PAYLOAD:
      payload *= factor;
      break;
    case SW_SENS_DELTA_V:
      dv *= factor;
      break;
    case SW_SENS_ISP:
      s.exhaust_velocity_m_s[stage] *= factor;
      break;
    case SW_SENS_STRUCTURAL_COEFFICIENT:
    default:
      s.structural_coefficient[stage] *= factor;
      break;
    }
  if (!(s.structural_coefficient[MAX (stage, 0)] < 1.0))
    return NAN;
  if (fixed_kg != NULL)
    sw_size_with_fixed (&s, fixed_kg, payload, dv, split, &sizing);
  else
    sw_size (&s, payload, dv, split, &sizing);
  return sizing.feasible ? sizing.liftoff_mass_kg : NAN;
}

static double
perturbed_mass (const SwStageSet *set, double payload, double dv, SwSplitMode split,
                SwSensParam param, int stage, double factor)
{
  return perturbed_mass_fixed (set, NULL, payload, dv, split, param, stage, factor);
}

static double
nominal_value (const SwStageSet *set, double payload, double dv, SwSensParam param, int stage)
{
  switch (param)
    {
    case SW_SENS_PAYLOAD:
      return payload;
    case SW_SENS_DELTA_V:
      return dv;
    case SW_SENS_ISP:
      return set->exhaust_velocity_m_s[stage] / SW_G0;
    case SW_SENS_STRUCTURAL_COEFFICIENT:
    default:
      return set->structural_coefficient[stage];
    }
}

double
sw_sensitivity_finite (const SwStageSet *set, double payload_kg, double delta_v_m_s,
                       SwSplitMode split, SwSensParam param, int stage, double h)
{
  double x = nominal_value (set, payload_kg, delta_v_m_s, param, stage);
  double up = perturbed_mass (set, payload_kg, delta_v_m_s, split, param, stage, 1.0 + h);
  double down = perturbed_mass (set, payload_kg, delta_v_m_s, split, param, stage, 1.0 - h);

  g_return_val_if_fail (set != NULL && h > 0.0, NAN);
  return (up - down) / (2.0 * h * x);
}

/* ---- designs with strap-on boosters: the phased vehicle re-sized ------- */

static double
parallel_value (const SwParallelVehicle *v, double payload, double dv, SwSensParam param,
                int stage)
{
  switch (param)
    {
    case SW_SENS_PAYLOAD:
      return payload;
    case SW_SENS_DELTA_V:
      return dv;
    case SW_SENS_ISP:
      return v->set.exhaust_velocity_m_s[stage] / SW_G0;
    case SW_SENS_STRUCTURAL_COEFFICIENT:
      return v->set.structural_coefficient[stage];
    case SW_SENS_BOOSTER_ISP:
      return v->booster_exhaust_velocity_m_s / SW_G0;
    case SW_SENS_BOOSTER_STRUCTURAL_COEFFICIENT:
    default:
      return v->booster_structural_coefficient;
    }
}

/* One input of the parallel vehicle @w (or the payload or delta-v) times
 * @factor; FALSE when a structural coefficient reaches 1. */
static gboolean
perturb_parallel (SwParallelVehicle *w, double *payload, double *dv, SwSensParam param,
                  int stage, double factor)
{
  double eps = 0.0;

  switch (param)
    {
    case SW_SENS_PAYLOAD:
      *payload *= factor;
      break;
    case SW_SENS_DELTA_V:
      *dv *= factor;
      break;
    case SW_SENS_ISP:
      w->set.exhaust_velocity_m_s[stage] *= factor;
      break;
    case SW_SENS_STRUCTURAL_COEFFICIENT:
      eps = w->set.structural_coefficient[stage] *= factor;
      break;
    case SW_SENS_BOOSTER_ISP:
      w->booster_exhaust_velocity_m_s *= factor;
      break;
    case SW_SENS_BOOSTER_STRUCTURAL_COEFFICIENT:
    default:
      eps = w->booster_structural_coefficient *= factor;
      break;
    }
  return eps < 1.0;
}

/* The liftoff mass re-sized with one input times @factor; NAN when no
 * vehicle closes. */
static double
parallel_mass (const SwParallelVehicle *v, double payload, double dv, SwSplitMode split,
               SwSensParam param, int stage, double factor)
{
  SwParallelVehicle w = *v;
  SwSizing sizing;

  if (!perturb_parallel (&w, &payload, &dv, param, stage, factor))
    return NAN;
  sw_size_parallel (&w, payload, dv, split, &sizing);
  return sizing.feasible ? sizing.liftoff_mass_kg : NAN;
}

/* Payload lost per kg of dry mass on each stage of the vehicle as sized,
 * every load fixed (the boosters' too); the dry mass is added by raising
 * the stage's structural coefficient, since the phased vehicle takes each
 * structure as load x eps / (1 - eps). */
static void
parallel_exchange_ratios (const SwParallelVehicle *v, const SwSizing *sizing, double *ratios)
{
  SwParallelVehicle f = *v;
  double p0, added = 1e-4 * sizing->liftoff_mass_kg;

  for (guint i = 0; i < SW_MAX_STAGES; i++)
    ratios[i] = NAN;
  for (guint i = 0; i < sizing->n_stages; i++)
    {
      f.fixed_kg[i] = sizing->stages[i].propellant_mass_kg;
      if (f.fixed_kg[i] > 0.0)
        added = MIN (added, 0.01 * sizing->stages[i].structural_mass_kg);
    }
  added = MAX (added, 1e-6 * sizing->liftoff_mass_kg);
  if (f.count > 0)
    f.booster_fixed_kg = sizing->boosters.propellant_mass_kg;
  if (!sw_parallel_payload (&f, sizing->delta_v_m_s, &p0, NULL))
    return;
  for (guint i = 0; i < sizing->n_stages; i++)
    {
      SwParallelVehicle g = f;
      double s = sizing->stages[i].structural_mass_kg + added, p;

      if (!(f.fixed_kg[i] > 0.0))
        continue;
      g.set.structural_coefficient[i] = s / (s + f.fixed_kg[i]);
      if (sw_parallel_payload (&g, sizing->delta_v_m_s, &p, NULL))
        ratios[i] = (p0 - p) / added;
    }
}

/* The tornado's bar of @it from the liftoff masses with the input at
 * 1 - step (@m_minus) and 1 + step (@m_plus), NAN where the vehicle does
 * not close (the effect is then infinite). */
static void
set_swing (SwSensitivity *it, double m_minus, double m_plus, double liftoff_mass_kg)
{
  it->minus_feasible = isfinite (m_minus);
  it->plus_feasible = isfinite (m_plus);
  it->minus_kg = m_minus - liftoff_mass_kg;
  it->plus_kg = m_plus - liftoff_mass_kg;
  it->effect_kg = it->minus_feasible && it->plus_feasible
                    ? MAX (fabs (it->minus_kg), fabs (it->plus_kg)) : INFINITY;
}

static gboolean
compute_with_boosters (const SwDesign *design, const SwSizing *sizing, double step,
                       SwSensitivityTable *out, GError **error)
{
  SwParallelVehicle v;
  double payload = sizing->payload_kg, dv = sizing->delta_v_m_s, h = SW_SENSITIVITY_FD_STEP;

  if (!sw_parallel_vehicle_from_design (&v, design, error))
    return FALSE;
  for (int k = -2; k < 2 * (int) v.set.n_stages + 2; k++)
    {
      SwSensitivity *it = &out->items[out->n_items++];
      double m_minus, m_plus;

      it->stage = -1;
      if (k == -2)
        it->param = SW_SENS_PAYLOAD;
      else if (k == -1)
        it->param = SW_SENS_DELTA_V;
      else if (k < 2 * (int) v.set.n_stages)
        {
          it->stage = k / 2;
          it->param = k % 2 == 0 ? SW_SENS_ISP : SW_SENS_STRUCTURAL_COEFFICIENT;
        }
      else
        it->param = k % 2 == 0 ? SW_SENS_BOOSTER_ISP : SW_SENS_BOOSTER_STRUCTURAL_COEFFICIENT;
      it->value = parallel_value (&v, payload, dv, it->param, it->stage);
      it->derivative = (parallel_mass (&v, payload, dv, design->split, it->param, it->stage,
                                       1.0 + h)
                        - parallel_mass (&v, payload, dv, design->split, it->param, it->stage,
                                         1.0 - h))
                       / (2.0 * h * it->value);
      it->elasticity = it->value / sizing->liftoff_mass_kg * it->derivative;
      m_minus = parallel_mass (&v, payload, dv, design->split, it->param, it->stage, 1.0 - step);
      m_plus = parallel_mass (&v, payload, dv, design->split, it->param, it->stage, 1.0 + step);
      set_swing (it, m_minus, m_plus, sizing->liftoff_mass_kg);
    }
  parallel_exchange_ratios (&v, sizing, out->exchange_ratio);
  return TRUE;
}

/* ---- a serial design with a fixed propellant load ------------------------ */

/* Re-sized as sw_size_design sizes it; derivatives by central differences
 * (the analytic forms assume every stage sized). */
static void
compute_with_fixed (const SwDesign *design, const SwSizing *sizing, double step,
                    SwSensitivityTable *out)
{
  SwStageSet set;
  double fixed_kg[SW_MAX_STAGES] = { 0 };
  double payload = sizing->payload_kg, dv = sizing->delta_v_m_s, h = SW_SENSITIVITY_FD_STEP;

  sw_stage_set_from_design (&set, design);
  for (guint i = 0; i < design->n_stages; i++)
    fixed_kg[i] = design->stages[i].propellant.has_propellant_kg
                    ? design->stages[i].propellant.propellant_kg : 0.0;
  for (int k = -2; k < 2 * (int) set.n_stages; k++)
    {
      SwSensitivity *it = &out->items[out->n_items++];
      double m_minus, m_plus;

      it->stage = -1;
      if (k == -2)
        it->param = SW_SENS_PAYLOAD;
      else if (k == -1)
        it->param = SW_SENS_DELTA_V;
      else
        {
          it->stage = k / 2;
          it->param = k % 2 == 0 ? SW_SENS_ISP : SW_SENS_STRUCTURAL_COEFFICIENT;
        }
      it->value = nominal_value (&set, payload, dv, it->param, it->stage);
      it->derivative = (perturbed_mass_fixed (&set, fixed_kg, payload, dv, design->split,
                                              it->param, it->stage, 1.0 + h)
                        - perturbed_mass_fixed (&set, fixed_kg, payload, dv, design->split,
                                                it->param, it->stage, 1.0 - h))
                       / (2.0 * h * it->value);
      it->elasticity = it->value / sizing->liftoff_mass_kg * it->derivative;
      m_minus = perturbed_mass_fixed (&set, fixed_kg, payload, dv, design->split, it->param,
                                      it->stage, 1.0 - step);
      m_plus = perturbed_mass_fixed (&set, fixed_kg, payload, dv, design->split, it->param,
                                     it->stage, 1.0 + step);
      set_swing (it, m_minus, m_plus, sizing->liftoff_mass_kg);
    }
}

/* ---- a vehicle that exists: the payload capability ---------------------- */

/* The capability with one input times @factor; NAN when it is not positive
 * (the vehicle then carries no payload to the mission). */
static double
capability_of (const SwParallelVehicle *v, double dv, SwSensParam param, int stage,
               double factor)
{
  SwParallelVehicle w = *v;
  double payload = 0.0, p;   /* the payload is what is found, not an input */

  if (!perturb_parallel (&w, &payload, &dv, param, stage, factor))
    return NAN;
  p = sw_fixed_loads_payload (&w, dv);
  return p > 0.0 ? p : NAN;
}

static gboolean
compute_capability (const SwDesign *design, double step, SwSensitivityTable *out,
                    GError **error)
{
  SwParallelVehicle v;
  SwPerformance perf;
  SwSizing at_cap;
  SwFixedVehicle vehicle;
  double dv, cap, h = SW_SENSITIVITY_FD_STEP;
  int n_items;

  if (!sw_design_performance (design, &perf, error)
      || !sw_parallel_vehicle_from_design (&v, design, error))
    return FALSE;
  out->capability = TRUE;
  out->feasible = perf.reachable;
  /* Defined whether or not the nominal payload fits. */
  out->liftoff_mass_kg = sw_fixed_loads_liftoff_mass (&v, design->payload_kg);
  out->payload_capability_kg = perf.payload_kg;
  dv = out->delta_v_m_s = perf.delta_v_m_s;
  if (!perf.reachable)
    return TRUE;
  cap = perf.payload_kg;
  /* The delta-v, each stage's Isp and eps, the boosters' two. */
  n_items = 1 + 2 * (int) v.set.n_stages + (v.count > 0 ? 2 : 0);
  for (int k = 0; k < n_items; k++)
    {
      SwSensitivity *it = &out->items[out->n_items++];
      double p_minus, p_plus;

      it->stage = -1;
      if (k == 0)
        it->param = SW_SENS_DELTA_V;
      else if (k - 1 < 2 * (int) v.set.n_stages)
        {
          it->stage = (k - 1) / 2;
          it->param = (k - 1) % 2 == 0 ? SW_SENS_ISP : SW_SENS_STRUCTURAL_COEFFICIENT;
        }
      else
        it->param = (k - 1) % 2 == 0 ? SW_SENS_BOOSTER_ISP
                                     : SW_SENS_BOOSTER_STRUCTURAL_COEFFICIENT;
      it->value = parallel_value (&v, design->payload_kg, dv, it->param, it->stage);
      it->derivative = (capability_of (&v, dv, it->param, it->stage, 1.0 + h)
                        - capability_of (&v, dv, it->param, it->stage, 1.0 - h))
                       / (2.0 * h * it->value);
      it->elasticity = it->value / cap * it->derivative;
      p_minus = capability_of (&v, dv, it->param, it->stage, 1.0 - step);
      p_plus = capability_of (&v, dv, it->param, it->stage, 1.0 + step);
      it->minus_feasible = isfinite (p_minus);
      it->plus_feasible = isfinite (p_plus);
      it->minus_kg = p_minus - cap;
      it->plus_kg = p_plus - cap;
      it->effect_kg = it->minus_feasible && it->plus_feasible
                        ? MAX (fabs (it->minus_kg), fabs (it->plus_kg)) : INFINITY;
    }
  /* The exchange ratios at the capability (the payload that just reaches
   * the required delta-v), as for any vehicle with its loads fixed; sized a
   * hair below it, so that the sizing closes whatever the root's last bit. */
  if (v.count > 0)
    sw_size_parallel (&v, cap * (1.0 - 1e-9), dv, design->split, &at_cap);
  else
    sw_size_with_fixed (&v.set, v.fixed_kg, cap * (1.0 - 1e-9), dv, design->split, &at_cap);
  if (!at_cap.feasible)
    return TRUE;
  if (v.count > 0)
    parallel_exchange_ratios (&v, &at_cap, out->exchange_ratio);
  else if (sw_fixed_vehicle_from_sizing (&vehicle, &at_cap))
    {
      double added = 1e-4 * at_cap.liftoff_mass_kg;

      for (guint i = 0; i < vehicle.n_stages; i++)
        added = MIN (added, 0.01 * vehicle.structural_mass_kg[i]);
      added = MAX (added, 1e-6 * at_cap.liftoff_mass_kg);
      if (!sw_fixed_vehicle_exchange_ratios (&vehicle, dv, added, out->exchange_ratio))
        for (guint i = 0; i < SW_MAX_STAGES; i++)
          out->exchange_ratio[i] = NAN;
    }
  return TRUE;
}

/* Every stage sized: the analytic derivatives, the tornado by re-sizing. */
static void
analytic_items (const SwDesign *design, const SwStageSet *set, const SwSizing *sizing,
                double step, SwSensitivityTable *out)
{
  double d_payload, d_dv, d_isp[SW_MAX_STAGES], d_eps[SW_MAX_STAGES];

  sw_sensitivity_analytic (set, sizing, &d_payload, &d_dv, d_isp, d_eps);

  for (int k = -2; k < 2 * (int) set->n_stages; k++)
    {
      SwSensitivity *it = &out->items[out->n_items++];
      double m_minus, m_plus;

      if (k == -2)
        {
          it->param = SW_SENS_PAYLOAD;
          it->stage = -1;
          it->derivative = d_payload;
        }
      else if (k == -1)
        {
          it->param = SW_SENS_DELTA_V;
          it->stage = -1;
          it->derivative = d_dv;
        }
      else
        {
          it->stage = k / 2;
          it->param = k % 2 == 0 ? SW_SENS_ISP : SW_SENS_STRUCTURAL_COEFFICIENT;
          it->derivative = k % 2 == 0 ? d_isp[it->stage] : d_eps[it->stage];
        }
      it->value = nominal_value (set, sizing->payload_kg, sizing->delta_v_m_s, it->param,
                                 it->stage);
      it->elasticity = it->value / sizing->liftoff_mass_kg * it->derivative;
      m_minus = perturbed_mass (set, sizing->payload_kg, sizing->delta_v_m_s, design->split,
                                it->param, it->stage, 1.0 - step);
      m_plus = perturbed_mass (set, sizing->payload_kg, sizing->delta_v_m_s, design->split,
                               it->param, it->stage, 1.0 + step);
      set_swing (it, m_minus, m_plus, sizing->liftoff_mass_kg);
    }
}

static int
compare_effect (gconstpointer a, gconstpointer b, gpointer data)
{
  const SwSensitivityTable *t = data;
  double ea = t->items[*(const guint *) a].effect_kg, eb = t->items[*(const guint *) b].effect_kg;

  if (ea != eb)
    return ea > eb ? -1 : 1;
  /* Stable order for ties: the table order. */
  return (int) *(const guint *) a - (int) *(const guint *) b;
}

gboolean
sw_sensitivity_compute (const SwDesign *design, double step, SwSensitivityTable *out,
                        GError **error)
{
  SwStageSet set;
  SwSizing sizing;
  SwFixedVehicle vehicle;
  double added;

  g_return_val_if_fail (design != NULL && out != NULL, FALSE);

  memset (out, 0, sizeof *out);
  if (!(step > 0.0 && step < 1.0))
    {
      g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
                   _("The sensitivity step must lie between 0 and 100 percent, not %g percent."),
                   step * 100.0);
      return FALSE;
    }
  if (!sw_size_design (design, &sizing, error))
    return FALSE;
  out->step = step;
  out->feasible = sizing.feasible;
  out->liftoff_mass_kg = sizing.liftoff_mass_kg;
  out->payload_kg = sizing.payload_kg;
  out->delta_v_m_s = sizing.delta_v_m_s;
  out->n_stages = sizing.n_stages;
  out->payload_capability_kg = NAN;
  for (guint i = 0; i < SW_MAX_STAGES; i++)
    out->exchange_ratio[i] = NAN;
  if (sw_design_all_fixed (design))
    {
      if (!compute_capability (design, step, out, error))
        return FALSE;
      goto rank;
    }
  if (!sizing.feasible)
    return TRUE;

  if (design->boosters.count > 0)
    {
      if (!compute_with_boosters (design, &sizing, step, out, error))
        return FALSE;
      goto rank;
    }
  sw_stage_set_from_design (&set, design);
  if (sizing.n_fixed > 0)
    compute_with_fixed (design, &sizing, step, out);
  else
    analytic_items (design, &set, &sizing, step, out);

  /* Exchange ratios by the root finder; the step is small against every
   * stage's structure yet far above the solver's tolerance. */
  if (sw_fixed_vehicle_from_sizing (&vehicle, &sizing))
    {
      added = 1e-4 * sizing.liftoff_mass_kg;
      for (guint i = 0; i < vehicle.n_stages; i++)
        if (vehicle.propellant_mass_kg[i] > 0.0)
          added = MIN (added, 0.01 * vehicle.structural_mass_kg[i]);
      added = MAX (added, 1e-6 * sizing.liftoff_mass_kg);
      if (!sw_fixed_vehicle_exchange_ratios (&vehicle, sizing.delta_v_m_s, added,
                                             out->exchange_ratio))
        for (guint i = 0; i < SW_MAX_STAGES; i++)
          out->exchange_ratio[i] = NAN;
    }

rank:
  for (guint i = 0; i < out->n_items; i++)
    out->ranked[i] = i;
  g_qsort_with_data (out->ranked, out->n_items, sizeof out->ranked[0], compare_effect, out);
  return TRUE;
}

const char *
sw_sens_param_to_string (SwSensParam param)
{
  switch (param)
    {
    case SW_SENS_PAYLOAD:
      return "payload";
    case SW_SENS_DELTA_V:
      return "delta_v";
    case SW_SENS_ISP:
      return "isp_vac";
    case SW_SENS_BOOSTER_ISP:
      return "booster_isp_vac";
    case SW_SENS_BOOSTER_STRUCTURAL_COEFFICIENT:
      return "booster_structural_coefficient";
    case SW_SENS_STRUCTURAL_COEFFICIENT:
    default:
      return "structural_coefficient";
    }
}

char *
sw_sensitivity_dup_label (const SwDesign *design, const SwSensitivity *item)
{
  const char *what;

  switch (item->param)
    {
    case SW_SENS_PAYLOAD:
      return g_strdup (_("Payload"));
    case SW_SENS_DELTA_V:
      return g_strdup (_("Required delta-v"));
    case SW_SENS_ISP:
      what = _("Isp");
      break;
    case SW_SENS_BOOSTER_ISP:
    case SW_SENS_BOOSTER_STRUCTURAL_COEFFICIENT:
      what = item->param == SW_SENS_BOOSTER_ISP ? _("Isp") : _("Structural coeff.");
      if (design != NULL && design->boosters.name[0] != '\0')
        /* Translators: "Isp, boosters (Name)" */
        return g_strdup_printf (_("%s, boosters (%s)"), what, design->boosters.name);
      return g_strdup_printf (_("%s, boosters"), what);
    case SW_SENS_STRUCTURAL_COEFFICIENT:
    default:
      what = _("Structural coeff.");
      break;
    }
  if (design != NULL && item->stage >= 0 && (guint) item->stage < design->n_stages
      && design->stages[item->stage].name[0] != '\0')
    return g_strdup_printf (_("%s, stage %d (%s)"), what, item->stage + 1,
                            design->stages[item->stage].name);
  return g_strdup_printf (_("%s, stage %d"), what, item->stage + 1);
}
