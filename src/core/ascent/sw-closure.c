/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The closed loop between sizing and the simulated losses. */
#define G_LOG_DOMAIN "sw-ascent"

#include "config.h"

#include "sw-ascent.h"

#include "sw-ascent-private.h"
#include "sw-limits.h"

#include <glib/gi18n-lib.h>
#include <gsl/gsl_errno.h>
#include <gsl/gsl_roots.h>
#include <math.h>
#include <string.h>

/* The loop looks for the losses L at which the vehicle sized for L needs
 * exactly L (sw-ascent.h defines the losses so that they plug straight into
 * the budget):  F(L) = L_simulated(size(L)) - L = 0.
 * Pass 1 sizes with the first guess L0 (losses_m_s, or 1500 m/s), pass 2
 * with what pass 1 simulated (the plain "size, simulate, resize" step).
 * Because the thrust is fixed, a heavier vehicle has a lower thrust-to-weight
 * and loses more, so L_simulated grows with L; near a liftoff thrust-to-
 * weight of 1.3 it grows almost as fast as L, and plain repetition creeps.
 * From pass 3 the next L comes from the secant through the last two passes,
 * and once F changes sign GSL's Brent method closes the bracket.  Converged
 * when |F| < 1 m/s: the required delta-v has settled within 1 m/s.  If F
 * does not fall as L grows, there is no L at which the vehicle closes: the
 * vehicle grows faster than its thrust can carry. */

typedef struct {
  const SwDesign *design;
  SwDesign       *work;
  const SwAscentOptions *options;
  SwAscentHints   hints;
  GCancellable   *cancellable;
  GError        **error;
  SwAscentResult *res;          /* the result of the last pass */
  double          res_L;        /* the losses it was sized with */
  double          history[SW_ASCENT_LOOP_MAX];
  double          F[SW_ASCENT_LOOP_MAX];         /* F at history[i], NAN if failed */
  double          mass[SW_ASCENT_LOOP_MAX];
  guint           n;
  gboolean        failed;       /* a pass gave no answer: why[] says why */
  gboolean        aborted;      /* error or cancelled: *error is set */
  char            why[SW_ASCENT_REASON_MAX];
} Loop;

/* One pass: size for @L, simulate; returns F(L), or NAN on failure. */
static double
pass (Loop *lp, double L)
{
  SwSizing sizing;

  if (lp->n >= SW_ASCENT_LOOP_MAX)
    {
      lp->failed = TRUE;
      g_snprintf (lp->why, sizeof lp->why,
                  _("the losses did not settle within 1 m/s in %d passes"), SW_ASCENT_LOOP_MAX);
      return NAN;
    }
  lp->work->mission.losses_m_s = L;
  lp->work->mission.has_losses = TRUE;
  if (!sw_size_design (lp->work, &sizing, lp->error))
    {
      lp->aborted = TRUE;
      return NAN;
    }
  lp->history[lp->n] = L;
  lp->F[lp->n] = NAN;
  lp->mass[lp->n] = sizing.liftoff_mass_kg;
  lp->n++;

  g_clear_pointer (&lp->res, sw_ascent_result_free);
  lp->res = sw_ascent_solve_sized (lp->work, &sizing, lp->options, &lp->hints,
                                   lp->cancellable, lp->error);
  lp->res_L = L;
  if (lp->res == NULL)
    {
      lp->aborted = TRUE;
      return NAN;
    }
  if (!sizing.feasible)
    {
      lp->failed = TRUE;
      g_snprintf (lp->why, sizeof lp->why,
                  _("at pass %u the losses reached %.0f m/s and the vehicle can no longer be "
                    "sized: %s"),
                  lp->n, L, sizing.reason);
      return NAN;
    }
  if (lp->res->status != SW_ASCENT_REACHED && lp->res->status != SW_ASCENT_SHORT)
    {
      lp->failed = TRUE;
      g_snprintf (lp->why, sizeof lp->why,
                  _("at pass %u (losses %.0f m/s, liftoff mass %.1f t): %s"), lp->n, L,
                  sizing.liftoff_mass_kg / 1000.0, lp->res->reason);
      return NAN;
    }
  lp->F[lp->n - 1] = lp->res->losses_m_s - L;
  return lp->F[lp->n - 1];
}

static double
brent_fn (double L, void *data)
{
  Loop *lp = data;
  double F;

  /* gsl_root_fsolver_set evaluates the bracket's ends, passes we have flown. */
  for (guint i = 0; i < lp->n; i++)
    if (lp->history[i] == L && isfinite (lp->F[i]))
      return lp->F[i];
  F = lp->failed || lp->aborted ? NAN : pass (lp, L);

  /* GSL's Brent needs a number; a failed pass stops the loop below. */
  return isfinite (F) ? F : 0.0;
}

static gboolean
settled (double F)
{
  return fabs (F) < SW_ASCENT_LOOP_TOLERANCE;
}

SwAscentResult *
sw_ascent_close_loop (const SwDesign *design, const SwAscentOptions *options,
                      GCancellable *cancellable, GError **error)
{
  g_autoptr (SwDesign) work = NULL;
  Loop lp = { 0 };
  double L0, F0, L1, F1;
  gboolean converged = FALSE;
  const double L_max = sw_limit_get (SW_LIMIT_LOSSES)->max;

  g_return_val_if_fail (design != NULL, NULL);

  if (!sw_ascent_check_inputs (design, error))
    return NULL;

  work = sw_design_copy (design);
  lp.design = design;
  lp.work = work;
  lp.options = options;
  lp.cancellable = cancellable;
  lp.error = error;

  L0 = design->mission.has_losses ? design->mission.losses_m_s : SW_ASCENT_FIRST_GUESS_LOSSES;
  F0 = pass (&lp, L0);
  if (lp.aborted)
    goto aborted;
  if (lp.failed || settled (F0))
    {
      converged = !lp.failed;
      goto done;
    }
  L1 = CLAMP (L0 + F0, 0.0, L_max);
  F1 = pass (&lp, L1);

  while (!lp.aborted && !lp.failed && !settled (F1))
    {
      double slope, L2, F2;

      if ((F0 < 0.0) != (F1 < 0.0))
        {
          /* Bracketed: Brent's method on F. */
          gsl_root_fsolver *brent = gsl_root_fsolver_alloc (gsl_root_fsolver_brent);
          gsl_function fn = { brent_fn, &lp };
          double lo = MIN (L0, L1), hi = MAX (L0, L1);

          gsl_root_fsolver_set (brent, &fn, lo, hi);
          while (!lp.aborted && !lp.failed)
            {
              gsl_root_fsolver_iterate (brent);
              if (lp.aborted || lp.failed)
                break;
              if (settled (lp.res->losses_m_s - lp.res_L))
                {
                  F1 = lp.res->losses_m_s - lp.res_L;
                  break;
                }
              lo = gsl_root_fsolver_x_lower (brent);
              hi = gsl_root_fsolver_x_upper (brent);
              if (hi - lo < 0.05)
                {
                  /* The bracket is closed but F jumps across it (the
                   * optimum pitch kick can switch): take the pass nearer 0. */
                  g_snprintf (lp.why, sizeof lp.why,
                              _("the simulated losses jump by more than 1 m/s across "
                                "%.2f m/s of sizing allowance, near %.0f m/s"),
                              hi - lo, lo);
                  lp.failed = TRUE;
                }
            }
          gsl_root_fsolver_free (brent);
          if (lp.aborted)
            goto aborted;
          converged = !lp.failed;
          goto done;
        }

      /* Not bracketed yet: the secant through the last two passes. */
      slope = (F1 - F0) / (L1 - L0);
      if (!(slope < -0.02))
        {
          g_snprintf (lp.why, sizeof lp.why,
                      _("the simulated losses grow as fast as the allowance (sized with "
                        "%.0f m/s the vehicle needs %.0f; sized with %.0f it needs %.0f): the "
                        "vehicle grows faster than its fixed thrust can carry; give the stages "
                        "more thrust or the vehicle less payload"),
                      L0, L0 + F0, L1, L1 + F1);
          lp.failed = TRUE;
          break;
        }
      L2 = L1 - F1 / slope;
      /* Do not leap: at most 1.5 km/s per pass, inside the accepted range. */
      L2 = CLAMP (L2, L1 - 1500.0, L1 + 1500.0);
      L2 = CLAMP (L2, 0.0, L_max);
      if (fabs (L2 - L1) < 1e-9)
        {
          g_snprintf (lp.why, sizeof lp.why,
                      _("the losses needed lie beyond the accepted %.0f m/s"), L_max);
          lp.failed = TRUE;
          break;
        }
      F2 = pass (&lp, L2);
      /* A leap into a vehicle that cannot fly: back off towards the last pass. */
      for (int k = 0; k < 3 && lp.failed && !lp.aborted && lp.n < SW_ASCENT_LOOP_MAX; k++)
        {
          lp.failed = FALSE;
          L2 = 0.5 * (L1 + L2);
          F2 = pass (&lp, L2);
        }
      L0 = L1;
      F0 = F1;
      L1 = L2;
      F1 = F2;
    }
  if (lp.aborted)
    goto aborted;
  converged = !lp.failed && settled (F1);

done:
  lp.res->closed_loop = TRUE;
  lp.res->loop_converged = converged;
  lp.res->loop_iterations = lp.n;
  memcpy (lp.res->loop_losses_m_s, lp.history, lp.n * sizeof (double));
  memcpy (lp.res->loop_liftoff_mass_kg, lp.mass, lp.n * sizeof (double));
  lp.res->loop_sized_losses_m_s = lp.res_L;

  if (converged)
    {
      /* Sized for L, needs L_simulated, within the tolerance. */
      if (lp.res->status == SW_ASCENT_SHORT)
        {
          lp.res->status = SW_ASCENT_REACHED;
          lp.res->reached_orbit = TRUE;
          lp.res->reason[0] = '\0';
          sw_ascent_result_add_note (lp.res,
                                     _("Reached within the loop's tolerance: %.2f m/s short of "
                                       "the sized delta-v, less than the 1 m/s to which the "
                                       "loop settles."),
                                     lp.res->delta_v_missing_m_s);
        }
    }
  else
    {
      g_autofree char *text = NULL;
      gsize len = strlen (lp.why);

      if (len > 0 && lp.why[len - 1] == '.')
        lp.why[len - 1] = '\0';
      text = g_strdup_printf (_("The sizing-and-losses loop does not converge: %s."), lp.why);
      lp.res->status = SW_ASCENT_NO_SOLUTION;
      lp.res->reached_orbit = FALSE;
      g_strlcpy (lp.res->reason, text, sizeof lp.res->reason);
    }
  return lp.res;

aborted:
  g_clear_pointer (&lp.res, sw_ascent_result_free);
  return NULL;
}

/* Counted so a test can show that an export flies nothing. */
static guint design_ascent_runs;

guint
sw_ascent_private_design_runs (void)
{
  return g_atomic_int_get (&design_ascent_runs);
}

SwAscentResult *
sw_ascent_fly_design (const SwDesign *design, GCancellable *cancellable, GError **error)
{
  g_return_val_if_fail (design != NULL, NULL);

  g_atomic_int_inc (&design_ascent_runs);
  if (design->mission.kind == SW_MISSION_ORBIT && design->mission.loss_model == SW_LOSS_SIMULATE)
    return sw_ascent_close_loop (design, NULL, cancellable, error);
  return sw_ascent_solve (design, NULL, cancellable, error);
}
