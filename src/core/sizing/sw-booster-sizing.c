/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-booster-sizing"

#include "config.h"

#include "sw-booster-sizing.h"

#include "sw-format.h"

#include <glib/gi18n-lib.h>
#include <gsl/gsl_errno.h>
#include <gsl/gsl_min.h>
#include <gsl/gsl_roots.h>
#include <math.h>
#include <string.h>

/* Grid sizes that bracket the minima before Brent's method (the liftoff
 * mass is smooth and has one minimum in each variable). */
#define BOOSTER_GRID 12
#define UPPER_GRID 10

gboolean
sw_size_design (const SwDesign *design, SwSizing *out, GError **error)
{
  SwParallelVehicle v;
  double dv;

  g_return_val_if_fail (design != NULL && out != NULL, FALSE);

  if (design->boosters.count == 0)
    return sw_size_design_serial (design, out, error);
  if (!sw_parallel_vehicle_from_design (&v, design, error)
      || !sw_design_required_delta_v (design, &dv, error))
    return FALSE;
  sw_size_parallel (&v, design->payload_kg, dv, design->split, out);
  if (out->boosters.optimised_away)
    {
      /* Say what the design weighs without its boosters, sized as it
       * would be with the key removed. */
      g_autoptr (SwDesign) bare = sw_design_copy (design);
      SwSizing without;

      bare->boosters.count = 0;
      if (sw_size_design_serial (bare, &without, NULL) && without.feasible)
        {
          g_autofree char *mass = sw_format_mass (without.liftoff_mass_kg);
          out->boosters.without_liftoff_mass_kg = without.liftoff_mass_kg;
          /* Translators: %s is a mass ("198.7 t") */
          g_snprintf (out->reason, sizeof out->reason,
                      _("The sized boosters are optimised away: the lightest vehicle gives them "
                        "no propellant (%s at liftoff without them). Fix their load "
                        "(boosters.propellant_kg) or remove them."), mass);
        }
    }
  return TRUE;
}

gboolean
sw_parallel_vehicle_from_design (SwParallelVehicle *v, const SwDesign *design, GError **error)
{
  const SwStage *core;
  guint engines;

  g_return_val_if_fail (v != NULL && design != NULL, FALSE);

  memset (v, 0, sizeof *v);
  if (design->n_stages == 0 || design->n_stages > SW_MAX_STAGES)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_RANGE, _("The design has no stages."));
      return FALSE;
    }
  sw_stage_set_from_design (&v->set, design);
  for (guint i = 0; i < design->n_stages; i++)
    v->fixed_kg[i] = design->stages[i].propellant.has_propellant_kg
                       ? design->stages[i].propellant.propellant_kg : 0.0;
  core = &design->stages[0];
  engines = core->reliability.has_engine_count ? core->reliability.engine_count : 0;
  v->core_thrust_n = sw_stage_thrust_vac_n (&core->propulsion, engines);
  v->count = design->boosters.count;
  if (v->count == 0)
    return TRUE;
  if (!(isfinite (v->core_thrust_n) && v->core_thrust_n > 0.0))
    {
      g_set_error (error, SW_ERROR, SW_ERROR_MISSING,
                   _("stages[0].thrust_vac_kn: with boosters the first stage (the core) needs "
                     "its thrust"));
      return FALSE;
    }
  v->booster_exhaust_velocity_m_s = design->boosters.isp_vac_s * SW_G0;
  v->booster_structural_coefficient = design->boosters.structural_coefficient;
  v->booster_thrust_n = design->boosters.thrust_vac_kn * 1000.0;
  v->booster_fixed_kg = design->boosters.propellant.has_propellant_kg
                          ? design->boosters.propellant.propellant_kg : 0.0;
  v->crossfeed = design->boosters.crossfeed;
  return TRUE;
}

/* ---- the first group: boosters and core -------------------------------- */

typedef struct {
  double m0;          /* liftoff */
  double burnt0;      /* propellant burnt in phase 0 (boosters and core) */
  double q;           /* core propellant burnt in phase 0 */
  double m0_end;      /* end of phase 0, boosters still on */
  double m1;          /* start of the core's own phase */
  double c_mix, dv0, t0;
  double dv1, t1;
  double s1, sb;
} Group;

static double
structure_of (double propellant, double eps)
{
  return propellant * eps / (1.0 - eps);
}

/* Core propellant burnt while the boosters burn (crossfeed: none). */
static double
core_in_phase0 (const SwParallelVehicle *v, double pb)
{
  double c1 = v->set.exhaust_velocity_m_s[0];

  if (v->count == 0 || !(pb > 0.0) || v->crossfeed)
    return 0.0;
  /* t_b = P_b c_b / F_b; the core burns F_core / c_core for that long. */
  return v->core_thrust_n / c1 * (pb * v->booster_exhaust_velocity_m_s / v->booster_thrust_n);
}

/* The fairing dropped during the core's flight (its jettison stage is the
 * core, stage 0; a jettison above it is the upper stages' to carry, and
 * then it is in @m_up).  The fraction is of the core's whole mass loss from
 * liftoff to its burnout, the boosters' propellant and dropped structure
 * included, as the flown ascent measures it; the fairing is on until that
 * much mass is gone.  *@F its mass (0: not the core's), *@lj the loss at
 * the jettison. */
static void
core_fairing (const SwParallelVehicle *v, double loss_to_burnout, double *F, double *lj)
{
  const SwFairingCarry *fc = &v->set.fairing;

  *F = 0.0;
  *lj = 0.0;
  if (fc->mass_kg > 0.0 && fc->stage == 0)
    {
      *F = fc->mass_kg;
      *lj = CLAMP (fc->fraction, 0.0, 1.0) * loss_to_burnout;
    }
}

/* c ln (m_a / m_b) over a burn from @ma to @mb (without the fairing) that
 * carries the fairing @F until @lj of the burn's own mass loss @from
 * onwards is gone: the burn in two parts around the jettison. */
static double
burn_with_fairing (double c, double ma, double mb, double F, double from, double lj)
{
  double burnt = ma - mb, with = CLAMP (lj - from, 0.0, burnt);

  if (!(F > 0.0) || !(lj > from))
    return c * log (ma / mb);
  return c * (log ((ma + F) / (ma + F - with)) + log ((ma - with) / mb));
}

/* FALSE when the loads make no vehicle (the core burns out before the
 * boosters, a mass not positive).  The masses in @g leave out a fairing
 * that the core drops (core_fairing ()), except m0, the liftoff mass. */
static gboolean
group_eval (const SwParallelVehicle *v, double m_up, double pb, double p1, Group *g)
{
  double c1 = v->set.exhaust_velocity_m_s[0];
  double k = (double) v->count;
  gboolean boosters = v->count > 0 && pb > 0.0;
  double F, lj, m0;

  memset (g, 0, sizeof *g);
  g->s1 = structure_of (p1, v->set.structural_coefficient[0]);
  g->sb = boosters ? structure_of (pb, v->booster_structural_coefficient) : 0.0;
  m0 = m_up + p1 + g->s1 + (boosters ? k * (pb + g->sb) : 0.0);
  core_fairing (v, p1 + (boosters ? k * (pb + g->sb) : 0.0), &F, &lj);
  g->m0 = m0;
  g->c_mix = c1;
  if (boosters)
    {
      double mdot1 = v->core_thrust_n / c1;
      double mdotb = v->booster_thrust_n / v->booster_exhaust_velocity_m_s;

      g->c_mix = (v->core_thrust_n + k * v->booster_thrust_n) / (mdot1 + k * mdotb);
      if (v->crossfeed)
        {
          g->t0 = k * pb / (k * mdotb + mdot1);
          g->q = 0.0;
        }
      else
        {
          g->t0 = pb / mdotb;
          g->q = core_in_phase0 (v, pb);
          if (g->q > p1)
            return FALSE;
        }
      g->burnt0 = k * pb + g->q;
      g->m0_end = m0 - g->burnt0;
      if (!(g->m0_end > 0.0))
        return FALSE;
      g->dv0 = burn_with_fairing (g->c_mix, m0, g->m0_end, F, 0.0, lj);
      g->m1 = g->m0_end - k * g->sb;
    }
  else
    {
      g->m0_end = m0;
      g->m1 = m0;
    }
  if (!(g->m1 - (p1 - g->q) > 0.0))
    return FALSE;
  g->dv1 = burn_with_fairing (c1, g->m1, g->m1 - (p1 - g->q), F, g->burnt0 + k * g->sb, lj);
  /* The liftoff mass carries the fairing. */
  g->m0 = m0 + F;
  g->t1 = isfinite (v->core_thrust_n) && v->core_thrust_n > 0.0
            ? (p1 - g->q) / (v->core_thrust_n / c1) : NAN;
  return TRUE;
}

/* ---- the upper stages -------------------------------------------------- */

typedef enum { UPPER_NONE, UPPER_FIXED, UPPER_SIZED } UpperKind;

static UpperKind
upper_kind (const SwParallelVehicle *v)
{
  if (v->set.n_stages < 2)
    return UPPER_NONE;
  for (guint i = 1; i < v->set.n_stages; i++)
    if (!(v->fixed_kg[i] > 0.0))
      return UPPER_SIZED;
  return UPPER_FIXED;
}

/* The upper stages as a serial set.  Their manual shares are scaled to add
 * up to 1 over the sized upper stages, as sw_size_with_fixed() takes them
 * (the design's shares add up to 1 with the core's). */
static void
upper_set (const SwParallelVehicle *v, SwStageSet *up, double *fixed)
{
  double sum = 0.0;

  memset (up, 0, sizeof *up);
  up->n_stages = v->set.n_stages - 1;
  for (guint i = 1; i < v->set.n_stages; i++)
    {
      up->exhaust_velocity_m_s[i - 1] = v->set.exhaust_velocity_m_s[i];
      up->structural_coefficient[i - 1] = v->set.structural_coefficient[i];
      up->share[i - 1] = v->set.share[i];
      fixed[i - 1] = v->fixed_kg[i];
      if (!(v->fixed_kg[i] > 0.0))
        sum += v->set.share[i];
    }
  if (sum > 0.0)
    for (guint i = 0; i < up->n_stages; i++)
      up->share[i] /= sum;
  /* A fairing dropped above the core is the upper stages' to carry (and
   * then part of the mass on the core). */
  if (v->set.fairing.mass_kg > 0.0 && v->set.fairing.stage >= 1)
    {
      up->fairing = v->set.fairing;
      up->fairing.stage = v->set.fairing.stage - 1;
    }
}

/* The mass of everything above the core with the upper stages giving
 * @d_up; NAN when they cannot.  @sizing (may be NULL) receives their
 * sizing.  All fixed: @d_up is ignored and *d_up_out is what they give. */
static double
upper_mass (const SwParallelVehicle *v, double payload, double d_up, SwSplitMode split,
            SwSizing *sizing, double *d_up_out)
{
  SwStageSet up;
  double fixed[SW_MAX_STAGES] = { 0 };
  SwSizing local;
  UpperKind kind = upper_kind (v);

  if (d_up_out != NULL)
    *d_up_out = kind == UPPER_SIZED ? d_up : 0.0;
  if (kind == UPPER_NONE)
    return payload;
  upper_set (v, &up, fixed);
  if (kind == UPPER_FIXED && up.fairing.mass_kg > 0.0)
    {
      /* Every upper stage fixed, the fairing on them: the serial sizing
       * with fixed loads gives what they give (asked for nothing). */
      if (sizing == NULL)
        sizing = &local;
      sw_size_with_fixed (&up, fixed, payload, 0.0, split, sizing);
      if (!sizing->feasible)
        return NAN;
      if (d_up_out != NULL)
        {
          *d_up_out = 0.0;
          for (guint i = 0; i < sizing->n_stages; i++)
            *d_up_out += sizing->stages[i].delta_v_m_s;
        }
      return sizing->liftoff_mass_kg;
    }
  if (kind == UPPER_FIXED)
    {
      double m = payload, dv = 0.0;
      for (int i = (int) up.n_stages - 1; i >= 0; i--)
        {
          double s = structure_of (fixed[i], up.structural_coefficient[i]);
          dv += up.exhaust_velocity_m_s[i] * log ((m + fixed[i] + s) / (m + s));
          m += fixed[i] + s;
        }
      if (d_up_out != NULL)
        *d_up_out = dv;
      /* Asked for nothing, the serial sizing of fixed stages gives each
       * its delta-v (asked for dv itself, a rounding short would make it
       * infeasible). */
      if (sizing != NULL)
        sw_size_with_fixed (&up, fixed, payload, 0.0, split, sizing);
      return m;
    }
  if (sizing == NULL)
    sizing = &local;
  if (!(d_up > 0.0))
    return NAN;
  sw_size_with_fixed (&up, fixed, payload, d_up, split, sizing);
  return sizing->feasible ? sizing->liftoff_mass_kg : NAN;
}

/* ---- the core's load from the delta-v ---------------------------------- */

typedef enum { CORE_OK, CORE_TOO_MUCH, CORE_UNREACHABLE, CORE_INVALID } CoreStatus;

typedef struct {
  const SwParallelVehicle *v;
  double m_up, pb, q, target;
} CoreProblem;

static double
core_residual (double y, void *data)
{
  const CoreProblem *p = data;
  Group g;

  if (!group_eval (p->v, p->m_up, p->pb, p->q + y, &g))
    return NAN;
  return g.dv0 + g.dv1 - p->target;
}

static double
brent_root (gsl_function *fn, double lo, double hi)
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
      status = gsl_root_test_interval (lo, hi, 0.0, 1e-12);
    }
  x = gsl_root_fsolver_root (solver);
  gsl_root_fsolver_free (solver);
  return x;
}

/* The core's load that gives @target with the boosters' @pb on top of
 * @m_up: P_core = q + y, y from a geometric scan and Brent's root.  A
 * previous answer in *@hint (> 0; updated) brackets the root in a few steps
 * of 25 % (the residual rises with y); without one, or when that fails, the
 * scan runs from 1e-3 m_up up in doublings. */
static CoreStatus
solve_core_hinted (const SwParallelVehicle *v, double m_up, double pb, double target, double *p1,
                   double *hint)
{
  CoreProblem p = { v, m_up, pb, core_in_phase0 (v, pb), target };
  gsl_function fn = { core_residual, &p };
  double lo = 0.0, f_lo = core_residual (0.0, &p);

  if (!isfinite (f_lo))
    return CORE_INVALID;
  if (f_lo >= 0.0)
    return CORE_TOO_MUCH;
  if (hint != NULL && *hint > 0.0)
    {
      double y = *hint, f = core_residual (y, &p);
      for (int j = 0; j < 12 && isfinite (f); j++)
        {
          double y2 = f < 0.0 ? y * 1.25 : y / 1.25, f2 = core_residual (y2, &p);
          if (!isfinite (f2))
            break;
          if ((f < 0.0) != (f2 < 0.0))
            {
              double a = MIN (y, y2), b = MAX (y, y2);
              *p1 = p.q + brent_root (&fn, a, b);
              *hint = *p1 - p.q;
              return CORE_OK;
            }
          y = y2;
          f = f2;
        }
    }
  for (int j = 0; j < 80; j++)
    {
      double y = m_up * 1e-3 * ldexp (1.0, j);
      double f = core_residual (y, &p);
      if (!isfinite (f))
        return CORE_INVALID;
      if (f >= 0.0)
        {
          *p1 = p.q + (f == 0.0 ? y : brent_root (&fn, lo, y));
          if (hint != NULL)
            *hint = *p1 - p.q;
          return CORE_OK;
        }
      lo = y;
    }
  return CORE_UNREACHABLE;
}

static CoreStatus
solve_core (const SwParallelVehicle *v, double m_up, double pb, double target, double *p1)
{
  return solve_core_hinted (v, m_up, pb, target, p1, NULL);
}

/* ---- minimisers -------------------------------------------------------- */

typedef double (*Objective) (double x, void *data);

typedef struct {
  Objective f;
  void *data;
} Wrapped;

static double
wrapped_eval (double x, void *data)
{
  const Wrapped *w = data;
  double y = w->f (x, w->data);
  /* The minimiser needs finite numbers: no vehicle is a huge mass. */
  return isfinite (y) ? y : 1e300;
}

/* The minimum of @f on (lo, hi): a grid of @n points brackets it, then
 * GSL's Brent minimiser.  A minimum on the grid's edge (no bracket) is taken
 * from a finer grid there.  NAN when no point is finite. */
static double
minimise (Objective f, void *data, double lo, double hi, guint n, double *x_min)
{
  Wrapped w = { f, data };
  double best = 1e300, xb = NAN;
  guint jb = 0;

  for (int round = 0; round < 4; round++)
    {
      double step = (hi - lo) / (n + 1);
      double fb;

      best = 1e300;
      for (guint j = 1; j <= n; j++)
        {
          double y = wrapped_eval (lo + step * j, &w);
          if (y < best)
            {
              best = y;
              jb = j;
            }
        }
      if (!(best < 1e300))
        return NAN;
      xb = lo + step * jb;
      fb = best;
      if (jb > 1 && jb < n)
        {
          double a = xb - step, b = xb + step;
          double fa = wrapped_eval (a, &w), fbb = wrapped_eval (b, &w);
          if (fa > fb && fbb > fb)
            {
              gsl_function fn = { wrapped_eval, &w };
              gsl_min_fminimizer *m = gsl_min_fminimizer_alloc (gsl_min_fminimizer_brent);
              int status = GSL_CONTINUE;

              gsl_min_fminimizer_set_with_values (m, &fn, xb, fb, a, fa, b, fbb);
              for (int iter = 0; iter < 100 && status == GSL_CONTINUE; iter++)
                {
                  gsl_min_fminimizer_iterate (m);
                  status = gsl_min_test_interval (gsl_min_fminimizer_x_lower (m),
                                                  gsl_min_fminimizer_x_upper (m), 0.0, 1e-8);
                }
              xb = gsl_min_fminimizer_x_minimum (m);
              best = gsl_min_fminimizer_f_minimum (m);
              gsl_min_fminimizer_free (m);
              *x_min = xb;
              return best < 1e300 ? best : NAN;
            }
        }
      /* On an edge or flat: look closer around the best point. */
      lo = MAX (lo, xb - step);
      hi = MIN (hi, xb + step);
    }
  *x_min = xb;
  return best < 1e300 ? best : NAN;
}

/* ---- the vehicle for given upper delta-v and booster load ---------------- */

typedef struct {
  const SwParallelVehicle *v;
  double payload, delta_v;
  SwSplitMode split;
  double d_up;          /* the upper stages' delta-v (sized upper stages) */
  double m_up;
  double hint;          /* the core's last load above q (a warm start), 0: none */
} Ctx;

/* Liftoff mass with the boosters' @pb, the core sized; NAN when none. */
static double
mass_for_booster (double pb, void *data)
{
  Ctx *c = data;
  double p1;
  Group g;

  if (solve_core_hinted (c->v, c->m_up, pb, c->delta_v - c->d_up, &p1, &c->hint) != CORE_OK
      || !group_eval (c->v, c->m_up, pb, p1, &g))
    return NAN;
  return g.m0;
}

/* The largest booster load worth looking at: where the boosters alone give
 * the delta-v, or past where the liftoff mass starts to climb. */
static double
booster_search_top (Ctx *c)
{
  double prev = HUGE_VAL;
  double pb = c->m_up * 1e-3;

  for (int j = 0; j < 60; j++, pb *= 2.0)
    {
      double p1;
      Group g;
      CoreStatus st = solve_core_hinted (c->v, c->m_up, pb, c->delta_v - c->d_up, &p1, &c->hint);
      if (st == CORE_TOO_MUCH || st == CORE_INVALID)
        return pb;
      if (st == CORE_OK && group_eval (c->v, c->m_up, pb, p1, &g))
        {
          if (g.m0 > prev)
            return pb;
          prev = g.m0;
        }
    }
  return pb;
}

/* The best liftoff mass for the upper stages' delta-v @d_up; *pb_out the
 * booster load that gives it. */
static double
best_for_upper (Ctx *base, double d_up, double *pb_out)
{
  Ctx c = *base;
  double d_up_given, m;

  c.d_up = d_up;
  c.m_up = upper_mass (c.v, c.payload, d_up, c.split, NULL, &d_up_given);
  c.d_up = d_up_given;
  if (!isfinite (c.m_up))
    return NAN;
  if (c.v->count == 0)
    {
      *pb_out = 0.0;
      return mass_for_booster (0.0, &c);
    }
  if (c.v->booster_fixed_kg > 0.0)
    {
      *pb_out = c.v->booster_fixed_kg;
      return mass_for_booster (c.v->booster_fixed_kg, &c);
    }
  m = minimise (mass_for_booster, &c, 0.0, booster_search_top (&c), BOOSTER_GRID, pb_out);
  base->hint = c.hint;   /* the next upper-stage delta-v starts from here */
  return m;
}

static double
mass_for_upper (double d_up, void *data)
{
  double pb;
  return best_for_upper (data, d_up, &pb);
}

/* ---- the stages' delta-v limit with no payload ---------------------------- */

typedef struct {
  const SwParallelVehicle *v;
  double m_up;
} LimitCtx;

static gboolean
any_upper_fixed (const SwParallelVehicle *v)
{
  for (guint i = 1; i < v->set.n_stages; i++)
    if (v->fixed_kg[i] > 0.0)
      return TRUE;
  return FALSE;
}

/* Minus the core group's delta-v with booster load @pb (no payload). */
static double
limit_minus_dv (double pb, void *data)
{
  const LimitCtx *lc = data;
  Group g;

  if (!group_eval (lc->v, lc->m_up, pb, lc->v->fixed_kg[0], &g))
    return NAN;
  return -(g.dv0 + g.dv1);
}

/* The stages' delta-v limit with no payload (sw-sizing.h): the upper
 * stages' by the serial rule (sw_size_with_fixed ()); a fixed core's is the
 * rocket equation on its load with its boosters (their fixed load, or the
 * sized load that gives the most: without crossfeed the core must outlast
 * them) and only the fixed upper stages and the fairing above it (sized
 * upper stages are empty with no payload); a sized core's is c ln(1/eps),
 * the boosters not counted (at that limit the core outweighs any booster).
 * *@core_limit the core's part; @stages (may be NULL) gets the upper
 * stages' own limits. */
static double
parallel_limit (const SwParallelVehicle *v, SwSplitMode split, double *core_limit,
                SwStageResult *stages)
{
  double upper = 0.0, m_up0 = 0.0, p1 = v->fixed_kg[0];

  *core_limit = v->set.exhaust_velocity_m_s[0] * log (1.0 / v->set.structural_coefficient[0]);
  if (v->set.n_stages >= 2)
    {
      SwStageSet up;
      double fixed[SW_MAX_STAGES] = { 0 };
      SwSizing s;

      upper_set (v, &up, fixed);
      if (upper_kind (v) == UPPER_SIZED && !any_upper_fixed (v))
        {
          /* Every upper stage sized: each its c ln(1/eps) (the serial
           * sizing's figure, without a solve on every call). */
          for (guint i = 0; i < up.n_stages; i++)
            {
              double l = up.exhaust_velocity_m_s[i] * log (1.0 / up.structural_coefficient[i]);
              upper += l;
              if (stages != NULL)
                stages[i + 1].delta_v_limit_m_s = l;
            }
        }
      else
        {
          sw_size_with_fixed (&up, fixed, 0.0, 0.0, split, &s);
          upper = s.delta_v_limit_m_s;
          if (stages != NULL)
            for (guint i = 0; i < up.n_stages; i++)
              stages[i + 1].delta_v_limit_m_s = s.stages[i].delta_v_limit_m_s;
        }
      for (guint i = 0; i < up.n_stages; i++)
        if (fixed[i] > 0.0)
          m_up0 += fixed[i] + structure_of (fixed[i], up.structural_coefficient[i]);
      m_up0 += up.fairing.mass_kg;
    }
  if (p1 > 0.0)
    {
      LimitCtx lc = { v, m_up0 };
      Group g;

      if (v->count == 0 || v->booster_fixed_kg > 0.0)
        {
          if (group_eval (v, m_up0, v->count > 0 ? v->booster_fixed_kg : 0.0, p1, &g))
            *core_limit = g.dv0 + g.dv1;
        }
      else
        {
          double c1 = v->set.exhaust_velocity_m_s[0], pb_best;
          double top = v->crossfeed
                         ? 100.0 * p1
                         : p1 * v->booster_thrust_n * c1
                             / (v->core_thrust_n * v->booster_exhaust_velocity_m_s);
          double m = minimise (limit_minus_dv, &lc, 0.0, top, BOOSTER_GRID, &pb_best);

          if (isfinite (m))
            *core_limit = -m;
        }
    }
  return upper + *core_limit;
}

/* ---- the answer -------------------------------------------------------- */

static void
set_infeasible (SwSizing *out, const char *reason)
{
  out->feasible = FALSE;
  g_strlcpy (out->reason, reason, sizeof out->reason);
  out->liftoff_mass_kg = out->payload_fraction = NAN;
  out->delta_v_given_m_s = NAN;
  for (guint i = 0; i < out->n_stages; i++)
    {
      SwStageResult *r = &out->stages[i];
      r->feasible = FALSE;
      r->delta_v_m_s = r->delta_v_share = r->mass_ratio = NAN;
      r->propellant_mass_kg = r->structural_mass_kg = r->stage_mass_kg = NAN;
      r->payload_mass_kg = r->initial_mass_kg = r->burnout_mass_kg = NAN;
    }
  if (out->boosters.present)
    {
      SwBoosterResult *b = &out->boosters;
      b->propellant_mass_kg = b->structural_mass_kg = b->booster_mass_kg = NAN;
      b->total_mass_kg = b->phase_delta_v_m_s = b->phase_initial_mass_kg = NAN;
      b->phase_final_mass_kg = b->phase_duration_s = b->core_propellant_in_phase_kg = NAN;
      b->core_phase_delta_v_m_s = b->core_phase_initial_mass_kg = NAN;
      b->core_phase_duration_s = NAN;
    }
}

static void
fill (const SwParallelVehicle *v, double payload, double d_up, double pb, double p1,
      SwSplitMode split, SwSizing *out)
{
  SwSizing up;
  double d_given, m_up;
  SwStageResult *r = &out->stages[0];
  Group g;
  double c1 = v->set.exhaust_velocity_m_s[0];

  memset (&up, 0, sizeof up);
  m_up = upper_mass (v, payload, d_up, split, &up, &d_given);
  if (!group_eval (v, m_up, pb, p1, &g))
    {
      set_infeasible (out, _("The loads found make no vehicle."));
      return;
    }
  for (guint i = 1; i < v->set.n_stages; i++)
    {
      out->stages[i] = up.stages[i - 1];
      if (out->stages[i].unused)
        out->n_unused++;
    }
  r->exhaust_velocity_m_s = c1;
  /* r->delta_v_limit_m_s: set by sw_size_parallel () (parallel_limit ()). */
  r->delta_v_m_s = g.dv0 + g.dv1;
  r->propellant_mass_kg = p1;
  r->structural_mass_kg = g.s1;
  r->stage_mass_kg = p1 + g.s1;
  r->payload_mass_kg = m_up;
  r->initial_mass_kg = g.m0;
  r->burnout_mass_kg = m_up + g.s1;
  r->mass_ratio = g.m0 / r->burnout_mass_kg;
  r->feasible = TRUE;
  r->fixed = v->fixed_kg[0] > 0.0;
  out->liftoff_mass_kg = g.m0;
  out->payload_fraction = payload / g.m0;
  out->fairing = v->set.fairing;
  {
    double given = 0.0;

    for (guint i = 0; i < v->set.n_stages; i++)
      {
        out->stages[i].delta_v_share = out->delta_v_m_s > 0.0
                                         ? out->stages[i].delta_v_m_s / out->delta_v_m_s : 0.0;
        if (out->stages[i].fixed)
          out->n_fixed++;
        given += out->stages[i].delta_v_m_s;
      }
    /* What the stages give with this payload (more than the requirement
     * only when every stage and the boosters are fixed). */
    out->delta_v_given_m_s = given;
  }
  if (out->boosters.present)
    {
      SwBoosterResult *b = &out->boosters;
      b->propellant_mass_kg = pb;
      b->structural_mass_kg = g.sb;
      b->booster_mass_kg = pb + g.sb;
      b->total_mass_kg = v->count * (pb + g.sb);
      b->mixed_exhaust_velocity_m_s = g.c_mix;
      b->phase_delta_v_m_s = g.dv0;
      b->phase_initial_mass_kg = g.m0;
      b->phase_final_mass_kg = g.m0_end;
      b->phase_duration_s = g.t0;
      b->core_propellant_in_phase_kg = g.q;
      b->core_phase_delta_v_m_s = g.dv1;
      b->core_phase_initial_mass_kg = g.m1;
      b->core_phase_duration_s = g.t1;
      b->fairing_phase = 0;
      b->fairing_mass_kg = 0.0;
      b->fairing_drop_mass_kg = NAN;
      {
        double F, lj;

        core_fairing (v, p1 + v->count * (pb + g.sb), &F, &lj);
        if (F > 0.0 && lj < g.burnt0)
          {
            b->fairing_phase = 1;
            b->fairing_drop_mass_kg = g.m0 - lj;
          }
        else if (F > 0.0)
          {
            b->fairing_phase = 2;
            b->phase_final_mass_kg += F;
            b->core_phase_initial_mass_kg += F;
            b->fairing_drop_mass_kg = g.m1 + F - MAX (0.0, lj - g.burnt0 - v->count * g.sb);
          }
        b->fairing_mass_kg = F;
      }
    }
}

double
sw_parallel_liftoff_mass (const SwParallelVehicle *v, double payload_kg, double booster_kg,
                          double core_kg, double upper_delta_v_m_s, double *delta_v_m_s)
{
  double d_given, m_up;
  Group g;

  g_return_val_if_fail (v != NULL && v->set.n_stages > 0, NAN);
  m_up = upper_mass (v, payload_kg, upper_delta_v_m_s, SW_SPLIT_OPTIMAL, NULL, &d_given);
  if (!isfinite (m_up) || !group_eval (v, m_up, v->count > 0 ? booster_kg : 0.0, core_kg, &g))
    return NAN;
  if (delta_v_m_s != NULL)
    *delta_v_m_s = g.dv0 + g.dv1 + d_given;
  return g.m0;
}

typedef struct {
  const SwParallelVehicle *v;
  double delta_v;
} PayloadRoot;

static double
payload_residual (double payload, void *data)
{
  const PayloadRoot *p = data;
  double dv = NAN;

  if (!isfinite (sw_parallel_liftoff_mass (p->v, payload, p->v->booster_fixed_kg,
                                           p->v->fixed_kg[0], 0.0, &dv)))
    return NAN;
  return dv - p->delta_v;
}

gboolean
sw_parallel_payload (const SwParallelVehicle *v, double delta_v_m_s, double *payload_kg,
                     double *empty_delta_v_m_s)
{
  PayloadRoot p = { v, delta_v_m_s };
  gsl_function fn = { payload_residual, &p };
  double f0, hi, scale = 0.0;

  g_return_val_if_fail (v != NULL && payload_kg != NULL, FALSE);

  *payload_kg = NAN;
  for (guint i = 0; i < v->set.n_stages; i++)
    {
      if (!(v->fixed_kg[i] > 0.0))
        return FALSE;
      scale += v->fixed_kg[i];
    }
  if (v->count > 0 && !(v->booster_fixed_kg > 0.0))
    return FALSE;
  scale += v->count * v->booster_fixed_kg;
  f0 = payload_residual (0.0, &p);
  if (empty_delta_v_m_s != NULL)
    *empty_delta_v_m_s = f0 + delta_v_m_s;
  if (!(f0 > 0.0))
    return FALSE;
  hi = 0.01 * scale;
  for (int k = 0; k < 200 && payload_residual (hi, &p) > 0.0; k++)
    hi = hi * 2.0 + scale;
  if (!(payload_residual (hi, &p) <= 0.0))
    return FALSE;
  *payload_kg = brent_root (&fn, 0.0, hi);
  return TRUE;
}

typedef struct {
  const SwParallelVehicle *v;
  double delta_v, liftoff;
  SwSplitMode split;
  guint evaluations;
} MassRoot;

static double
mass_residual (double payload, void *data)
{
  MassRoot *r = data;
  SwSizing s;

  r->evaluations++;
  sw_size_parallel (r->v, payload, r->delta_v, r->split, &s);
  return s.feasible ? s.liftoff_mass_kg - r->liftoff : NAN;
}

gboolean
sw_parallel_payload_at_mass (const SwParallelVehicle *v, double delta_v_m_s, SwSplitMode split,
                             double liftoff_mass_kg, double guess_kg, double *payload_kg)
{
  MassRoot r = { v, delta_v_m_s, liftoff_mass_kg, split, 0 };
  gsl_function fn = { mass_residual, &r };
  gsl_root_fsolver *solver;
  double lo, hi, flo, fhi;
  int status = GSL_CONTINUE;

  g_return_val_if_fail (v != NULL && payload_kg != NULL, FALSE);

  *payload_kg = NAN;
  if (!(liftoff_mass_kg > 0.0) || !(guess_kg > 0.0))
    return FALSE;
  /* The liftoff mass rises with the payload: step out from the guess by a
   * factor 1.25 until the mass is bracketed. */
  lo = hi = guess_kg;
  flo = fhi = mass_residual (guess_kg, &r);
  if (!isfinite (flo))
    {
      /* Too heavy to close: come down until it does. */
      for (int k = 0; k < 60 && !isfinite (fhi); k++)
        fhi = mass_residual (hi *= 0.5, &r);
      if (!isfinite (fhi))
        return FALSE;
      lo = hi;
      flo = fhi;
    }
  for (int k = 0; k < 80 && flo > 0.0; k++)
    {
      hi = lo;
      fhi = flo;
      lo /= 1.25;
      flo = mass_residual (lo, &r);
      if (!isfinite (flo))
        return FALSE;
    }
  for (int k = 0; k < 80 && isfinite (fhi) && fhi < 0.0; k++)
    {
      lo = hi;
      flo = fhi;
      hi *= 1.25;
      fhi = mass_residual (hi, &r);
    }
  if (!(flo <= 0.0))
    return FALSE;               /* even a tiny payload weighs more */
  if (!isfinite (fhi))
    {
      /* Between the last closing payload and one that does not close:
       * halve towards the closing side until a bracket is found. */
      double a = lo;
      for (int k = 0; k < 60 && !isfinite (fhi); k++)
        fhi = mass_residual (hi = 0.5 * (a + hi), &r);
      if (!(fhi >= 0.0))
        return FALSE;           /* the heaviest vehicle that closes is lighter */
    }
  if (flo == 0.0 || fhi == 0.0)
    {
      *payload_kg = flo == 0.0 ? lo : hi;
      return TRUE;
    }
  solver = gsl_root_fsolver_alloc (gsl_root_fsolver_brent);
  gsl_root_fsolver_set (solver, &fn, lo, hi);
  for (int iter = 0; iter < 100 && status == GSL_CONTINUE; iter++)
    {
      if (gsl_root_fsolver_iterate (solver) != GSL_SUCCESS)
        break;
      status = gsl_root_test_interval (gsl_root_fsolver_x_lower (solver),
                                       gsl_root_fsolver_x_upper (solver), 0.0, 1e-8);
    }
  if (status == GSL_SUCCESS)
    *payload_kg = gsl_root_fsolver_root (solver);
  gsl_root_fsolver_free (solver);
  return status == GSL_SUCCESS;
}

/* The upper stages' delta-v such that the whole vehicle gives @delta_v with
 * every load of the first group fixed (the core fixed, boosters fixed). */
typedef struct {
  const SwParallelVehicle *v;
  double payload, delta_v, pb, p1;
  SwSplitMode split;
} UpperRoot;

static double
upper_residual (double d_up, void *data)
{
  const UpperRoot *u = data;
  double d_given, m_up = upper_mass (u->v, u->payload, d_up, u->split, NULL, &d_given);
  Group g;

  if (!isfinite (m_up) || !group_eval (u->v, m_up, u->pb, u->p1, &g))
    return NAN;
  return d_given + g.dv0 + g.dv1 - u->delta_v;
}

/* The equal or manual split with a sized core and fixed upper stages among
 * sized ones: the sized stages (the core, its delta-v counting phase 0, and
 * the sized upper stages) take the delta-v the fixed stages leave in the
 * split's proportions (equal, or their manual shares).  With the upper
 * stages asked for T, they give T, of which the sized ones D(T) (the fixed
 * ones give the rest, by the rocket equation, sw_size_with_fixed()); the
 * core takes delta_v - T.  So T solves
 *   (delta_v - T) W_up - w_core D(T) = 0,
 * w the sized stages' weights (1 each, or the shares); a scan brackets the
 * root and Brent's method ends it. */
typedef struct {
  const SwParallelVehicle *v;
  double payload, delta_v, w_core, w_up;
  SwSplitMode split;
} SplitRoot;

static double
split_residual (double t, void *data)
{
  const SplitRoot *r = data;
  SwSizing sz;
  double d_given, sized = 0.0;

  if (!isfinite (upper_mass (r->v, r->payload, t, r->split, &sz, &d_given)))
    return NAN;
  for (guint i = 0; i < sz.n_stages; i++)
    if (!sz.stages[i].fixed)
      sized += sz.stages[i].delta_v_m_s;
  return (r->delta_v - t) * r->w_up - r->w_core * sized;
}

static gboolean
split_upper (const SwParallelVehicle *v, double payload_kg, double delta_v_m_s,
             SwSplitMode split, double *d_up)
{
  SplitRoot r = { v, payload_kg, delta_v_m_s, 0.0, 0.0, split };
  gsl_function fn = { split_residual, &r };
  double lo = NAN, flo = NAN;

  r.w_core = split == SW_SPLIT_EQUAL ? 1.0 : v->set.share[0];
  for (guint i = 1; i < v->set.n_stages; i++)
    if (!(v->fixed_kg[i] > 0.0))
      r.w_up += split == SW_SPLIT_EQUAL ? 1.0 : v->set.share[i];
  if (!(r.w_core > 0.0) || !(r.w_up > 0.0))
    return FALSE;
  for (int j = 1; j < 256; j++)
    {
      double t = delta_v_m_s * j / 256.0, f = split_residual (t, &r);
      if (!isfinite (f))
        continue;
      if (isfinite (flo) && (flo > 0.0) != (f > 0.0))
        {
          *d_up = brent_root (&fn, lo, t);
          return TRUE;
        }
      if (f == 0.0)
        {
          *d_up = t;
          return TRUE;
        }
      lo = t;
      flo = f;
    }
  return FALSE;
}

/* With the core's load fixed and the boosters' @pb: the sized upper
 * stages' delta-v that makes up the mission (a scan, then Brent's root).
 * FALSE when none does. */
static gboolean
fixed_core_upper (const SwParallelVehicle *v, double payload_kg, double delta_v_m_s, double pb,
                  double p1, SwSplitMode split, double *d_up)
{
  UpperRoot u = { v, payload_kg, delta_v_m_s, pb, p1, split };
  gsl_function fn = { upper_residual, &u };
  double lo = delta_v_m_s * 1e-9, hi = NAN;

  for (int j = 1; j <= 64; j++)
    {
      double x = delta_v_m_s * j / 64.0;
      double f = upper_residual (x, &u);
      if (isfinite (f) && f >= 0.0)
        {
          hi = x;
          break;
        }
      if (isfinite (f))
        lo = x;
    }
  if (isnan (hi) || !isfinite (upper_residual (lo, &u)))
    return FALSE;
  *d_up = brent_root (&fn, lo, hi);
  return TRUE;
}

/* Sized boosters on a fixed core: for a booster load, the liftoff mass of
 * the vehicle that makes up the mission (the sized upper stages' delta-v
 * from fixed_core_upper(); with every upper stage fixed, the vehicle as it
 * is when its delta-v is enough).  NAN when it does not. */
typedef struct {
  const SwParallelVehicle *v;
  double payload, delta_v, p1;
  SwSplitMode split;
  gboolean upper_sized;
} FixedCore;

static double
fixed_core_given (const FixedCore *fc, double pb)
{
  double given;
  double m = sw_parallel_liftoff_mass (fc->v, fc->payload, pb, fc->p1, 0.0, &given);
  return isfinite (m) ? given - fc->delta_v : NAN;
}

static double
fixed_core_mass (double pb, void *data)
{
  const FixedCore *fc = data;
  double d_up = 0.0, d_given, m_up;
  Group g;

  if (fc->upper_sized)
    {
      if (!fixed_core_upper (fc->v, fc->payload, fc->delta_v, pb, fc->p1, fc->split, &d_up))
        return NAN;
    }
  else
    {
      double r = fixed_core_given (fc, pb);
      if (!(r >= 0.0))
        return NAN;
    }
  m_up = upper_mass (fc->v, fc->payload, d_up, fc->split, NULL, &d_given);
  if (!isfinite (m_up) || !group_eval (fc->v, m_up, pb, fc->p1, &g))
    return NAN;
  return g.m0;
}

static double
fixed_core_residual (double pb, void *data)
{
  return fixed_core_given (data, pb);
}

/* The boosters' load for a fixed core: with sized upper stages the load of
 * least liftoff mass (a grid up to where the vehicle stops closing or its
 * mass climbs, then Brent's minimiser); with fixed upper stages the least
 * load whose delta-v is enough (liftoff mass rises with the load), from a
 * scan and Brent's root.  NAN when no load makes up the mission. */
static double
fixed_core_boosters (const FixedCore *fc, double *pb_out)
{
  double prev = HUGE_VAL, top = NAN, pb = 1e-3 * (fc->payload + fc->p1);
  gboolean seen = FALSE;

  if (!fc->upper_sized)
    {
      double lo = 0.0, flo = fixed_core_residual (0.0, (gpointer) fc);
      for (int j = 0; j < 60; j++, pb *= 1.5)
        {
          double f = fixed_core_residual (pb, (gpointer) fc);
          if (isfinite (f) && f >= 0.0)
            {
              gsl_function fn = { fixed_core_residual, (gpointer) fc };
              if (!(isfinite (flo) && flo < 0.0))
                {
                  *pb_out = pb;
                  return fixed_core_mass (pb, (gpointer) fc);
                }
              *pb_out = brent_root (&fn, lo, pb);
              /* The root's upper side: enough delta-v, not a hair short. */
              if (!(fixed_core_residual (*pb_out, (gpointer) fc) >= 0.0))
                *pb_out *= 1.0 + 1e-10;
              if (!(fixed_core_residual (*pb_out, (gpointer) fc) >= 0.0))
                *pb_out = pb;
              return fixed_core_mass (*pb_out, (gpointer) fc);
            }
          if (isfinite (f))
            {
              lo = pb;
              flo = f;
            }
        }
      return NAN;
    }
  for (int j = 0; j < 60; j++, pb *= 2.0)
    {
      double m = fixed_core_mass (pb, (gpointer) fc);
      if (isfinite (m))
        {
          seen = TRUE;
          if (m > prev)
            {
              top = pb;
              break;
            }
          prev = m;
        }
      else if (seen)
        {
          top = pb;
          break;
        }
    }
  if (isnan (top))
    return NAN;
  return minimise (fixed_core_mass, (gpointer) fc, 0.0, top, BOOSTER_GRID, pb_out);
}

/* Sized boosters that the optimum @pb leaves (next to) empty: the vehicle
 * with no booster propellant, @m_without, is as light as the one with @pb,
 * @m_with (within rounding), or the boosters carry less than a millionth of
 * it.  Then the boosters are optimised away: the sizing says so and gives
 * no vehicle with boosters (their thrust would be counted at liftoff for
 * boosters that burn nothing). */
static gboolean
boosters_away (const SwParallelVehicle *v, double pb, double m_with, double m_without)
{
  if (v->count == 0 || v->booster_fixed_kg > 0.0 || !isfinite (m_without))
    return FALSE;
  if (!(pb > 0.0) || !isfinite (m_with))
    return TRUE;
  return m_without <= m_with * (1.0 + 1e-10) || v->count * pb < 1e-6 * m_with;
}

static void
set_boosters_away (SwSizing *out)
{
  set_infeasible (out, _("The sized boosters are optimised away: the lightest vehicle gives them "
                         "no propellant. Fix their load (boosters.propellant_kg) or remove "
                         "them."));
  out->boosters.optimised_away = TRUE;
}

void
sw_size_parallel (const SwParallelVehicle *v, double payload_kg, double delta_v_m_s,
                  SwSplitMode split, SwSizing *out)
{
  Ctx c = { v, payload_kg, delta_v_m_s, split, 0.0, 0.0, 0.0 };
  UpperKind kind;
  gboolean any_fixed = FALSE;
  double d_up = 0.0, pb = 0.0, p1 = 0.0, m;
  guint n;

  g_return_if_fail (v != NULL && out != NULL && v->set.n_stages > 0);

  n = v->set.n_stages;
  memset (out, 0, sizeof *out);
  out->split = split;
  out->n_stages = n;
  out->payload_kg = payload_kg;
  out->delta_v_m_s = delta_v_m_s;
  out->feasible = TRUE;
  out->infeasible_stage = -1;
  out->multiplier_s_m = NAN;
  for (guint i = 0; i < n; i++)
    {
      out->stages[i].exhaust_velocity_m_s = v->set.exhaust_velocity_m_s[i];
      out->stages[i].delta_v_limit_m_s = v->set.exhaust_velocity_m_s[i]
                                         * log (1.0 / v->set.structural_coefficient[i]);
      out->stages[i].fixed = v->fixed_kg[i] > 0.0;
      any_fixed = any_fixed || v->fixed_kg[i] > 0.0;
    }
  out->delta_v_limit_m_s = parallel_limit (v, split, &out->stages[0].delta_v_limit_m_s, out->stages);
  out->margin_m_s = out->delta_v_limit_m_s - delta_v_m_s;
  out->delta_v_given_m_s = NAN;
  if (v->count > 0)
    {
      out->boosters.present = TRUE;
      out->boosters.count = v->count;
      out->boosters.fixed = v->booster_fixed_kg > 0.0;
      out->boosters.crossfeed = v->crossfeed;
      out->boosters.exhaust_velocity_m_s = v->booster_exhaust_velocity_m_s;
      out->boosters.thrust_vac_n = v->booster_thrust_n;
      out->boosters.core_thrust_vac_n = v->core_thrust_n;
      out->boosters.mass_flow_kg_s = v->booster_thrust_n / v->booster_exhaust_velocity_m_s;
      out->boosters.core_mass_flow_kg_s = v->core_thrust_n / v->set.exhaust_velocity_m_s[0];
      out->boosters.without_liftoff_mass_kg = NAN;
    }
  kind = upper_kind (v);

  if (v->fixed_kg[0] > 0.0)
    {
      /* The core is fixed. */
      p1 = v->fixed_kg[0];
      if (v->count > 0 && !(v->booster_fixed_kg > 0.0))
        {
          /* Sized boosters on a fixed core. */
          FixedCore fc = { v, payload_kg, delta_v_m_s, p1, split, kind == UPPER_SIZED };

          if (!isfinite (fixed_core_boosters (&fc, &pb)))
            {
              char reason[SW_REASON_MAX];
              g_autofree char *req = sw_format_speed (delta_v_m_s);
              /* Translators: %s is a speed ("9,500 m/s") */
              g_snprintf (reason, sizeof reason,
                          _("With the core's load fixed, no load of the boosters gives the "
                            "%s required (the core must also outlast the boosters)."), req);
              set_infeasible (out, reason);
              return;
            }
          if (boosters_away (v, pb, fixed_core_mass (pb, &fc), fixed_core_mass (0.0, &fc)))
            {
              set_boosters_away (out);
              return;
            }
          if (kind == UPPER_SIZED
              && !fixed_core_upper (v, payload_kg, delta_v_m_s, pb, p1, split, &d_up))
            {
              set_infeasible (out, _("The upper stages' delta-v could not be found."));
              return;
            }
          fill (v, payload_kg, d_up, pb, p1, split, out);
          return;
        }
      pb = v->count > 0 ? v->booster_fixed_kg : 0.0;
      if (kind == UPPER_SIZED)
        {
          if (!fixed_core_upper (v, payload_kg, delta_v_m_s, pb, p1, split, &d_up))
            {
              set_infeasible (out, _("With the core's and the boosters' loads fixed, the upper "
                                     "stages cannot make up the rest of the delta-v."));
              return;
            }
        }
      else
        {
          double given;
          double mass = sw_parallel_liftoff_mass (v, payload_kg, pb, p1, 0.0, &given);
          if (!isfinite (mass) || given < delta_v_m_s)
            {
              char reason[SW_REASON_MAX];
              g_snprintf (reason, sizeof reason,
                          _("The fixed vehicle gives %s, short of the %s "
                            "required."), SW_SPEED (given), SW_SPEED (delta_v_m_s));
              set_infeasible (out, reason);
              return;
            }
        }
      fill (v, payload_kg, d_up, pb, p1, split, out);
      return;
    }

  /* The core is sized. */
  if (kind == UPPER_SIZED && split == SW_SPLIT_OPTIMAL)
    {
      m = minimise (mass_for_upper, &c, 0.0, delta_v_m_s, UPPER_GRID, &d_up);
      if (isfinite (m))
        best_for_upper (&c, d_up, &pb);
    }
  else
    {
      if (kind == UPPER_SIZED && !any_fixed)
        {
          double share0 = split == SW_SPLIT_EQUAL ? 1.0 / n : v->set.share[0];
          d_up = delta_v_m_s * (1.0 - share0);
        }
      else if (kind == UPPER_SIZED && !split_upper (v, payload_kg, delta_v_m_s, split, &d_up))
        {
          set_infeasible (out, _("No division of the delta-v gives the sized stages their "
                                 "split beside the fixed stages."));
          return;
        }
      m = best_for_upper (&c, d_up, &pb);
    }
  if (!isfinite (m))
    {
      char reason[SW_REASON_MAX];
      g_snprintf (reason, sizeof reason,
                  _("No loads of the core%s give the %s required: the stages and "
                    "boosters reach less even with no payload."),
                  v->count > 0 ? _(" and boosters") : "", SW_SPEED (delta_v_m_s));
      set_infeasible (out, reason);
      return;
    }
  {
    double d_given;
    Ctx cc = c;
    cc.m_up = upper_mass (v, payload_kg, d_up, split, NULL, &d_given);
    cc.d_up = d_given;
    cc.hint = 0.0;
    if (v->count > 0 && !(v->booster_fixed_kg > 0.0)
        && boosters_away (v, pb, mass_for_booster (pb, &cc), mass_for_booster (0.0, &cc)))
      {
        set_boosters_away (out);
        return;
      }
    if (solve_core (v, cc.m_up, pb, delta_v_m_s - d_given, &p1) != CORE_OK)
      {
        set_infeasible (out, _("The core's load could not be found."));
        return;
      }
  }
  fill (v, payload_kg, d_up, pb, p1, split, out);
}
