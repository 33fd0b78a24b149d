/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-sizing"

#include "config.h"

#include "sw-sizing.h"
#include "sw-format.h"

#include "sw-budget.h"

#include <glib/gi18n-lib.h>
#include <gsl/gsl_errno.h>
#include <gsl/gsl_roots.h>
#include <math.h>

void
sw_fairing_carry_default (const SwDesign *design, guint n_stages, SwFairingCarry *out)
{
  g_return_if_fail (design != NULL && out != NULL);

  out->mass_kg = design->ascent.has_fairing_mass && design->ascent.fairing_mass_kg > 0.0
                   ? design->ascent.fairing_mass_kg : 0.0;
  out->stage = n_stages >= 2 ? 1 : 0;
  out->fraction = n_stages >= 2 ? 0.0 : 1.0;
  if (design->ascent.has_flown_fairing && n_stages > 0)
    {
      out->stage = MIN (design->ascent.flown_fairing_stage, n_stages - 1);
      out->fraction = CLAMP (design->ascent.flown_fairing_fraction, 0.0, 1.0);
    }
}

void
sw_stage_set_from_design (SwStageSet *set, const SwDesign *design)
{
  g_return_if_fail (set != NULL && design != NULL);

  set->n_stages = MIN (design->n_stages, SW_MAX_STAGES);
  sw_fairing_carry_default (design, set->n_stages, &set->fairing);
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
  sw_fairing_carry_default (design, n_stages, &set->fairing);
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

/* GSL's Brent root of @fn bracketed by [lo, hi], to the given tolerances
 * (at most 200 iterations). */
static double
brent_root (gsl_function *fn, double lo, double hi, double epsabs, double epsrel)
{
  gsl_root_fsolver *solver = gsl_root_fsolver_alloc (gsl_root_fsolver_brent);
  int status = GSL_CONTINUE;
  double x;

  gsl_root_fsolver_set (solver, fn, lo, hi);
  for (int iter = 0; iter < 200 && status == GSL_CONTINUE; iter++)
    {
      gsl_root_fsolver_iterate (solver);
      lo = gsl_root_fsolver_x_lower (solver);
      hi = gsl_root_fsolver_x_upper (solver);
      status = gsl_root_test_interval (lo, hi, epsabs, epsrel);
    }
  x = gsl_root_fsolver_root (solver);
  gsl_root_fsolver_free (solver);
  return x;
}

/* ---- the fairing ------------------------------------------------------- */

/* Is stage @i of @set the one that drops the fairing?  (The stages below it
 * carry the fairing as part of their payload.) */
static gboolean
drops_fairing (const SwStageSet *set, guint i)
{
  return set->fairing.mass_kg > 0.0 && i == set->fairing.stage;
}

/* The rocket-equation delta-v of a stage of propellant @mp and structure
 * @ms over @P (everything above, no fairing) that carries the fairing @F for
 * the first @phi of its propellant:
 *   c ln((P + ms + mp + F) / (P + ms + (1 - phi) mp + F))
 *   + c ln((P + ms + (1 - phi) mp) / (P + ms)). */
static double
fairing_stage_delta_v (double c, double P, double ms, double mp, double F, double phi)
{
  double left = (1.0 - phi) * mp;

  return c * log ((P + ms + mp + F) / (P + ms + left + F)) + c * log ((P + ms + left) / (P + ms));
}

/* The standard stage: ignition mass over @P for mass ratio @n. */
static double
stage_ignition_mass (double P, double n, double eps)
{
  return P * n * (1.0 - eps) / (1.0 - n * eps);
}

typedef struct {
  double c, eps, P, F, phi, dv;
} FairingStageParams;

static double
fairing_stage_residual (double mp, void *data)
{
  const FairingStageParams *q = data;
  double ms = mp * q->eps / (1.0 - q->eps);
  return fairing_stage_delta_v (q->c, q->P, ms, mp, q->F, q->phi) - q->dv;
}

/* The stage that drops the fairing, sized to give @dv over @P: its
 * propellant solves fairing_stage_delta_v = dv, bracketed by the stage
 * over P alone (phi = 0) and over P + F (phi = 1), Brent's method (GSL).
 * Returns the propellant; the stage's structure is mp eps / (1 - eps). */
static double
fairing_stage_propellant (double c, double eps, double P, double F, double phi, double dv)
{
  double n = exp (dv / c), lo, hi;
  FairingStageParams q = { c, eps, P, F, CLAMP (phi, 0.0, 1.0), dv };
  gsl_function fn = { fairing_stage_residual, &q };

  if (!(dv > 0.0))
    return 0.0;
  lo = stage_ignition_mass (P, n, eps) * (1.0 - 1.0 / n);
  hi = stage_ignition_mass (P + F, n, eps) * (1.0 - 1.0 / n);
  if (q.phi <= 0.0)
    return lo;
  if (q.phi >= 1.0 || !(hi > lo))
    return hi;
  return brent_root (&fn, lo, hi, 1e-9, 1e-13);
}

gboolean
sw_optimal_split (const SwStageSet *set, double delta_v_m_s,
                  double *stage_delta_v, double *multiplier_s_m)
{
  OptimalParams params = { set, delta_v_m_s };
  gsl_function fn = { optimal_residual, &params };
  double lo = 0.0, hi = 0.0, x = 0.0, sum;

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

  x = brent_root (&fn, lo, hi, 1e-9, 1e-10);

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
      double eps = set->structural_coefficient[i], c = set->exhaust_velocity_m_s[i];
      double n = exp (stage_delta_v[i] / c);
      if (!(stage_delta_v[i] >= 0.0) || !(n * eps < 1.0))
        return NAN;
      if (drops_fairing (set, (guint) i))
        {
          double F = set->fairing.mass_kg;
          double mp = fairing_stage_propellant (c, eps, m, F, set->fairing.fraction,
                                                stage_delta_v[i]);
          m += mp / (1.0 - eps) + F;
        }
      else
        m = stage_ignition_mass (m, n, eps);
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

/* The reason of an optimum that leaves a stage out. */
static void
explain_unused (SwSizing *out, const SwDesign *names, guint n)
{
  char label[SW_NAME_MAX + 32];

  if (out->n_unused == 0)
    return;
  for (guint i = 0; i < n; i++)
    if (out->stages[i].unused)
      {
        stage_label (names, i, label, sizeof label);
        g_snprintf (out->reason, sizeof out->reason,
                    _("At the optimum %s gets no delta-v and carries no propellant: "
                      "the vehicle is lighter without it."),
                    label);
        return;
      }
}

/* The figures of the stage that drops the fairing, of propellant @mp over
 * @P (no fairing): its ignition mass carries the fairing, its burnout mass
 * does not. */
static void
set_fairing_stage (SwStageResult *r, const SwStageSet *set, double P, double mp)
{
  double eps = set->structural_coefficient[set->fairing.stage];

  r->propellant_mass_kg = mp;
  r->structural_mass_kg = mp > 0.0 ? mp * eps / (1.0 - eps) : 0.0;
  r->stage_mass_kg = r->propellant_mass_kg + r->structural_mass_kg;
  r->initial_mass_kg = P + r->stage_mass_kg + set->fairing.mass_kg;
  r->burnout_mass_kg = P + r->structural_mass_kg;
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
  out->delta_v_given_m_s = delta_v_m_s;
  out->fairing = set->fairing;

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
          out->delta_v_given_m_s = NAN;
          g_snprintf (out->reason, sizeof out->reason,
                      _("The required delta-v of %s is at or beyond the limit of "
                        "%s that these %u stages reach even when empty of payload "
                        "(the sum of c ln(1/eps) over the stages)."),
                      SW_SPEED (delta_v_m_s), SW_SPEED (out->delta_v_limit_m_s), n);
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
                          _("%s must give %s but cannot give more than %s: its "
                            "mass ratio would reach 1/eps = %.2f even with no payload."),
                          label, SW_SPEED (dv[i]), SW_SPEED (r->delta_v_limit_m_s),
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
                      _(" The whole vehicle reaches at most %s."),
                      SW_SPEED (out->delta_v_limit_m_s));
        }
      for (guint i = 0; i < n; i++)
        {
          SwStageResult *r = &out->stages[i];
          r->propellant_mass_kg = r->structural_mass_kg = r->stage_mass_kg = NAN;
          r->payload_mass_kg = r->initial_mass_kg = r->burnout_mass_kg = NAN;
        }
      out->delta_v_given_m_s = NAN;
      return;
    }

  m_above = payload_kg;
  for (int i = (int) n - 1; i >= 0; i--)
    {
      SwStageResult *r = &out->stages[i];
      double eps = set->structural_coefficient[i];
      double nr = r->mass_ratio;

      r->payload_mass_kg = m_above;
      if (drops_fairing (set, (guint) i))
        {
          set_fairing_stage (r, set, m_above,
                             fairing_stage_propellant (r->exhaust_velocity_m_s, eps, m_above,
                                                       set->fairing.mass_kg,
                                                       set->fairing.fraction, dv[i]));
          m_above = r->initial_mass_kg;
          continue;
        }
      r->initial_mass_kg = stage_ignition_mass (m_above, nr, eps);
      r->burnout_mass_kg = r->initial_mass_kg / nr;
      r->propellant_mass_kg = r->initial_mass_kg - r->burnout_mass_kg;
      r->structural_mass_kg = r->unused ? 0.0 : r->burnout_mass_kg - m_above;
      r->stage_mass_kg = r->propellant_mass_kg + r->structural_mass_kg;
      m_above = r->initial_mass_kg;
    }
  out->liftoff_mass_kg = m_above;
  out->payload_fraction = payload_kg / m_above;

  explain_unused (out, names, n);
}

/* ---- fixed stages ------------------------------------------------------ */

typedef struct {
  const SwStageSet *set;
  const double *fixed_kg;          /* > 0: fixed */
  SwSplitMode split;
  double delta_v;                  /* required */
  SwStageSet sized;                /* the sized stages, in firing order */
  guint sized_index[SW_MAX_STAGES];
} FixedProblem;

static gboolean
is_fixed (const double *fixed_kg, guint i)
{
  return fixed_kg != NULL && isfinite (fixed_kg[i]) && fixed_kg[i] > 0.0;
}

/* The sized stages' delta-v when they give @d together, per the split;
 * FALSE when no such split exists. */
static gboolean
fixed_split (const FixedProblem *p, double d, double *sized_dv)
{
  guint ns = p->sized.n_stages;

  switch (p->split)
    {
    case SW_SPLIT_EQUAL:
      for (guint k = 0; k < ns; k++)
        sized_dv[k] = d / ns;
      return TRUE;
    case SW_SPLIT_MANUAL:
      for (guint k = 0; k < ns; k++)
        sized_dv[k] = p->sized.share[k] * d;
      return TRUE;
    case SW_SPLIT_OPTIMAL:
    default:
      return sw_optimal_split (&p->sized, d, sized_dv, NULL);
    }
}

/* The largest @d the split can give (exclusive): beyond it a sized stage's
 * mass ratio reaches 1/eps. */
static double
fixed_split_limit (const FixedProblem *p)
{
  double lim = INFINITY;

  for (guint k = 0; k < p->sized.n_stages; k++)
    {
      double l = stage_limit (p->sized.exhaust_velocity_m_s[k], p->sized.structural_coefficient[k]);
      if (p->split == SW_SPLIT_EQUAL)
        lim = MIN (lim, l * p->sized.n_stages);
      else if (p->split == SW_SPLIT_MANUAL)
        {
          if (p->sized.share[k] > 0.0)
            lim = MIN (lim, l / p->sized.share[k]);
        }
    }
  return p->split == SW_SPLIT_OPTIMAL || !isfinite (lim) ? vehicle_limit (&p->sized) : lim;
}

/* Every stage's delta-v for the sized stages' @d, top-down from @payload_kg;
 * returns the vehicle's total delta-v (NAN when the split does not exist). */
static double
fixed_total (const FixedProblem *p, double payload_kg, double d, double *dv)
{
  double sized_dv[SW_MAX_STAGES] = { 0 };
  double m_above = payload_kg, total = 0.0;

  if (p->sized.n_stages > 0 && !fixed_split (p, d, sized_dv))
    return NAN;
  for (int i = (int) p->set->n_stages - 1; i >= 0; i--)
    {
      double c = p->set->exhaust_velocity_m_s[i], eps = p->set->structural_coefficient[i];
      double m0;

      if (is_fixed (p->fixed_kg, (guint) i))
        {
          double mp = p->fixed_kg[i], ms = mp * eps / (1.0 - eps);
          if (drops_fairing (p->set, (guint) i))
            {
              m0 = m_above + mp + ms + p->set->fairing.mass_kg;
              dv[i] = fairing_stage_delta_v (c, m_above, ms, mp, p->set->fairing.mass_kg,
                                             p->set->fairing.fraction);
            }
          else
            {
              m0 = m_above + mp + ms;
              dv[i] = c * log (m0 / (m0 - mp));
            }
        }
      else
        {
          double n;
          dv[i] = sized_dv[p->sized_index[i]];
          n = exp (dv[i] / c);
          if (!(n * eps < 1.0))
            return NAN;
          if (drops_fairing (p->set, (guint) i))
            m0 = m_above + fairing_stage_propellant (c, eps, m_above, p->set->fairing.mass_kg,
                                                     p->set->fairing.fraction, dv[i])
                           / (1.0 - eps)
                 + p->set->fairing.mass_kg;
          else
            m0 = stage_ignition_mass (m_above, n, eps);
        }
      total += dv[i];
      m_above = m0;
    }
  return total;
}

typedef struct {
  const FixedProblem *p;
  double payload_kg;
} FixedParams;

static double
fixed_residual (double d, void *data)
{
  const FixedParams *fp = data;
  double dv[SW_MAX_STAGES];
  return fixed_total (fp->p, fp->payload_kg, d, dv) - fp->p->delta_v;
}

static void
fixed_infeasible (SwSizing *out, guint n)
{
  out->feasible = FALSE;
  out->liftoff_mass_kg = out->payload_fraction = NAN;
  out->delta_v_given_m_s = NAN;
  for (guint i = 0; i < n; i++)
    {
      SwStageResult *r = &out->stages[i];
      r->feasible = FALSE;
      r->delta_v_m_s = r->delta_v_share = r->mass_ratio = NAN;
      r->propellant_mass_kg = r->structural_mass_kg = r->stage_mass_kg = NAN;
      r->payload_mass_kg = r->initial_mass_kg = r->burnout_mass_kg = NAN;
    }
}

/* Every fixed stage above (firing after) every sized one. */
static gboolean
fixed_on_top (const SwStageSet *set, const double *fixed_kg)
{
  gboolean seen_fixed = FALSE;

  for (guint i = 0; i < set->n_stages; i++)
    {
      if (is_fixed (fixed_kg, i))
        seen_fixed = TRUE;
      else if (seen_fixed)
        return FALSE;
    }
  return seen_fixed;
}

static void
size_fixed (const SwStageSet *set, const double *fixed_kg, const SwDesign *names,
            double payload_kg, double delta_v_m_s, SwSplitMode split, SwSizing *out)
{
  FixedProblem p = { set, fixed_kg, split, delta_v_m_s, { 0 }, { 0 } };
  FixedParams fp = { &p, payload_kg };
  double dv[SW_MAX_STAGES] = { 0 };
  double d = 0.0, d_max = 0.0, total0, m_above, best = -INFINITY;
  guint n = set->n_stages;

  memset (out, 0, sizeof *out);
  out->split = split;
  out->n_stages = n;
  out->payload_kg = payload_kg;
  out->delta_v_m_s = delta_v_m_s;
  out->feasible = TRUE;
  out->infeasible_stage = -1;
  out->multiplier_s_m = NAN;
  out->fairing = set->fairing;

  for (guint i = 0; i < n; i++)
    {
      SwStageResult *r = &out->stages[i];
      r->exhaust_velocity_m_s = set->exhaust_velocity_m_s[i];
      r->delta_v_limit_m_s = stage_limit (r->exhaust_velocity_m_s, set->structural_coefficient[i]);
      r->feasible = TRUE;
      r->fixed = is_fixed (fixed_kg, i);
      if (r->fixed)
        {
          out->n_fixed++;
          continue;
        }
      p.sized_index[i] = p.sized.n_stages;
      p.sized.exhaust_velocity_m_s[p.sized.n_stages] = set->exhaust_velocity_m_s[i];
      p.sized.structural_coefficient[p.sized.n_stages] = set->structural_coefficient[i];
      p.sized.share[p.sized.n_stages] = set->share[i];
      p.sized.n_stages++;
    }

  /* The fixed stages with the sized ones empty: the most they give. */
  total0 = fixed_total (&p, payload_kg, 0.0, dv);
  if (p.sized.n_stages > 0)
    d_max = fixed_split_limit (&p);
  /* The limit with no payload: each fixed stage gives the rocket equation
   * on its own load with only the fixed stages (and the fairing) above it
   * (the sized ones are empty, so massless), each sized one its
   * c ln(1/eps); the vehicle's is the sum of the stages', as without a
   * fixed stage. */
  {
    double dv0[SW_MAX_STAGES] = { 0 };
    double limit0 = fixed_total (&p, 0.0, 0.0, dv0);

    out->delta_v_limit_m_s = limit0 + vehicle_limit (&p.sized);
    for (guint i = 0; i < n; i++)
      if (out->stages[i].fixed)
        out->stages[i].delta_v_limit_m_s = dv0[i];
    out->margin_m_s = out->delta_v_limit_m_s - delta_v_m_s;
  }
  out->delta_v_given_m_s = total0;

  if (p.sized.n_stages == 0)
    {
      d = 0.0;
      if (!(total0 >= delta_v_m_s))
        {
          g_snprintf (out->reason, sizeof out->reason,
                      _("The fixed stages give %s with this payload; the mission needs "
                        "%s."),
                      SW_SPEED (total0), SW_SPEED (delta_v_m_s));
          fixed_infeasible (out, n);
          return;
        }
    }
  else if (total0 > delta_v_m_s)
    {
      g_snprintf (out->reason, sizeof out->reason,
                  _("The fixed stages alone give %s, more than the %s required: "
                    "nothing is left for the sized stages.  Remove a sized stage or size a "
                    "fixed one."),
                  SW_SPEED (total0), SW_SPEED (delta_v_m_s));
      fixed_infeasible (out, n);
      return;
    }
  else if (total0 < delta_v_m_s && fixed_on_top (set, fixed_kg)
           && delta_v_m_s - total0 < d_max
           && fabs (fixed_residual (delta_v_m_s - total0, &fp)) <= 1e-12 * delta_v_m_s)
    /* Every fixed stage fires after every sized one: the fixed stages'
     * delta-v does not depend on the sized stages below them, so the sized
     * stages give exactly the rest (no search; the Monte Carlo sizes
     * thousands of such vehicles). */
    d = delta_v_m_s - total0;
  else if (total0 < delta_v_m_s)
    {
      /* Scan up from D = 0 to the first point that reaches the requirement
       * (the lightest vehicle), then close in with Brent's method. */
      const guint steps = 256;
      double lo = 0.0, hi = NAN;

      for (guint k = 1; k <= steps; k++)
        {
          double dk = d_max * k / steps * (1.0 - 1e-9);
          double g = fixed_residual (dk, &fp);
          if (!isfinite (g))
            break;
          best = MAX (best, g + delta_v_m_s);
          if (g >= 0.0)
            {
              hi = dk;
              break;
            }
          lo = dk;
        }
      if (isnan (hi))
        {
          g_snprintf (out->reason, sizeof out->reason,
                      _("The vehicle cannot reach the %s required: with its fixed "
                        "stages it gives at most about %s."),
                      SW_SPEED (delta_v_m_s), SW_SPEED (MAX (best, total0)));
          fixed_infeasible (out, n);
          return;
        }
      else
        {
          gsl_function fn = { fixed_residual, &fp };

          d = brent_root (&fn, lo, hi, 1e-10, 1e-12);
        }
    }

  if (!isfinite (fixed_total (&p, payload_kg, d, dv)))
    {
      g_snprintf (out->reason, sizeof out->reason,
                  _("No split of the sized stages gives the %s required."), SW_SPEED (delta_v_m_s));
      fixed_infeasible (out, n);
      return;
    }
  if (split == SW_SPLIT_OPTIMAL && p.sized.n_stages > 0)
    {
      double sized_dv[SW_MAX_STAGES];
      sw_optimal_split (&p.sized, d, sized_dv, &out->multiplier_s_m);
    }

  m_above = payload_kg;
  for (int i = (int) n - 1; i >= 0; i--)
    {
      SwStageResult *r = &out->stages[i];
      double eps = set->structural_coefficient[i];

      r->delta_v_m_s = dv[i];
      r->delta_v_share = delta_v_m_s > 0.0 ? dv[i] / delta_v_m_s : 0.0;
      r->payload_mass_kg = m_above;
      if (drops_fairing (set, (guint) i))
        {
          double c = r->exhaust_velocity_m_s;
          r->mass_ratio = exp (dv[i] / c);
          r->unused = !r->fixed && split == SW_SPLIT_OPTIMAL && dv[i] <= 0.0;
          if (r->unused)
            out->n_unused++;
          set_fairing_stage (r, set, m_above,
                             r->fixed ? fixed_kg[i]
                                      : fairing_stage_propellant (c, eps, m_above,
                                                                  set->fairing.mass_kg,
                                                                  set->fairing.fraction, dv[i]));
        }
      else if (r->fixed)
        {
          r->propellant_mass_kg = fixed_kg[i];
          r->structural_mass_kg = fixed_kg[i] * eps / (1.0 - eps);
          r->initial_mass_kg = m_above + r->propellant_mass_kg + r->structural_mass_kg;
          r->burnout_mass_kg = r->initial_mass_kg - r->propellant_mass_kg;
          r->mass_ratio = r->initial_mass_kg / r->burnout_mass_kg;
        }
      else
        {
          double nr = exp (dv[i] / r->exhaust_velocity_m_s);
          r->mass_ratio = nr;
          r->unused = split == SW_SPLIT_OPTIMAL && dv[i] <= 0.0;
          if (r->unused)
            out->n_unused++;
          r->initial_mass_kg = m_above * nr * (1.0 - eps) / (1.0 - nr * eps);
          r->burnout_mass_kg = r->initial_mass_kg / nr;
          r->propellant_mass_kg = r->initial_mass_kg - r->burnout_mass_kg;
          r->structural_mass_kg = r->unused ? 0.0 : r->burnout_mass_kg - m_above;
        }
      r->stage_mass_kg = r->propellant_mass_kg + r->structural_mass_kg;
      m_above = r->initial_mass_kg;
    }
  out->liftoff_mass_kg = m_above;
  out->payload_fraction = payload_kg / m_above;
  out->delta_v_given_m_s = 0.0;
  for (guint i = 0; i < n; i++)
    out->delta_v_given_m_s += dv[i];

  explain_unused (out, names, n);
}

void
sw_size_with_fixed (const SwStageSet *set, const double *fixed_propellant_kg,
                    double payload_kg, double delta_v_m_s, SwSplitMode split, SwSizing *out)
{
  gboolean any = FALSE;

  g_return_if_fail (set != NULL && out != NULL && set->n_stages > 0);
  for (guint i = 0; i < set->n_stages; i++)
    any = any || is_fixed (fixed_propellant_kg, i);
  if (any)
    size_fixed (set, fixed_propellant_kg, NULL, payload_kg, delta_v_m_s, split, out);
  else
    size_with_names (set, NULL, payload_kg, delta_v_m_s, split, out);
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
      /* A fixed stage takes no share: the manual split divides the sized
       * stages' delta-v (sw_design_take_manual_shares normalises the rest). */
      shares[i] = sizing->stages[i].fixed ? 0.0 : sizing->stages[i].delta_v_share;
      if (!isfinite (shares[i]) || shares[i] < 0.0)
        return 0;
    }
  return sizing->n_stages;
}

gboolean
sw_size_design_serial (const SwDesign *design, SwSizing *out, GError **error)
{
  SwFairingCarry def;

  g_return_val_if_fail (design != NULL && out != NULL, FALSE);
  sw_fairing_carry_default (design, design->n_stages, &def);
  return sw_size_design_fairing (design, def.stage, def.fraction, out, error);
}

gboolean
sw_size_design_fairing (const SwDesign *design, guint fairing_stage, double fairing_fraction,
                        SwSizing *out, GError **error)
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
  set.fairing.stage = MIN (fairing_stage, set.n_stages - 1);
  set.fairing.fraction = isfinite (fairing_fraction) ? CLAMP (fairing_fraction, 0.0, 1.0) : 0.0;
  for (guint i = 0; i < design->n_stages && i < SW_MAX_STAGES; i++)
    if (design->stages[i].propellant.has_propellant_kg)
      {
        double fixed_kg[SW_MAX_STAGES] = { 0 };
        for (guint k = 0; k < design->n_stages && k < SW_MAX_STAGES; k++)
          fixed_kg[k] = design->stages[k].propellant.has_propellant_kg
                          ? design->stages[k].propellant.propellant_kg : 0.0;
        size_fixed (&set, fixed_kg, design, design->payload_kg, dv, design->split, out);
        return TRUE;
      }
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
