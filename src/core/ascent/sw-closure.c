/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The closed loop between sizing and the simulated losses. */
#define G_LOG_DOMAIN "sw-ascent"

#include "config.h"

#include "sw-ascent.h"

#include "sw-ascent-private.h"
#include "sw-format.h"
#include "sw-limits.h"

#include <glib/gi18n-lib.h>
#include <gsl/gsl_errno.h>
#include <gsl/gsl_roots.h>
#include <math.h>
#include <string.h>

/* The loop looks for the losses L at which the vehicle sized for L needs
 * exactly L (sw-ascent.h defines the losses so that they plug straight into
 * the budget):  F(L) = L_simulated(size(L)) - L = 0.
 * Because the thrust is fixed, a heavier vehicle has a lower thrust-to-
 * weight and loses more, so L_simulated grows with L, but more slowly than
 * L where the vehicle can close: F falls as L grows.  The loop does not
 * depend on its first guess L0 (losses_m_s, or 1500 m/s):
 *  1. a first pass at L0; if the vehicle sized for L0 cannot fly (too heavy
 *     to lift off, infeasible sizing), lower allowances until one flies;
 *  2. a bracket: from a flyable L, steps in the direction of F, each longer
 *     than the last (the step overshoots the secant estimate by half), until
 *     F changes sign; a step into an allowance that cannot be flown is
 *     bisected back towards the last flyable one;
 *  3. GSL's Brent method on the bracket until |F| < 0.2 m/s.
 * If F stays positive up to the largest allowance that can still be sized
 * and flown, no allowance reaches the orbit: the answer gives that
 * allowance, what the vehicle then lacks, and why a larger one fails. */

#define INNER_TOLERANCE 0.2        /* m/s: Brent stops here (the public tolerance is 1) */

typedef struct {
  const SwDesign *design;
  SwDesign       *work;
  const SwAscentOptions *options;
  SwAscentOptions pass_options; /* the passes fly unrecorded */
  gboolean        record;       /* the caller wants the time series */
  SwAscentHints   hints;
  GCancellable   *cancellable;
  GError        **error;
  SwAscentResult *res;          /* the result of the pass nearest to F = 0 */
  double          res_L;        /* the losses it was sized with */
  double          res_F;
  guint           res_i;        /* its pass */
  double          history[SW_ASCENT_LOOP_MAX];
  double          F[SW_ASCENT_LOOP_MAX];         /* F at history[i], NAN if failed */
  double          mass[SW_ASCENT_LOOP_MAX];
  guint           fairing_stage[SW_ASCENT_LOOP_MAX];     /* the sizing's jettison point */
  double          fairing_fraction[SW_ASCENT_LOOP_MAX];  /* per pass */
  guint           n;
  /* The fairing: where the sizing drops it (from the first pass that
   * flies, the flown jettison), and where the last pass dropped it. */
  guint           f_stage;
  double          f_fraction;
  gboolean        flown_dropped;
  guint           flown_stage;
  double          flown_fraction;
  gboolean        failed;       /* the last pass gave no answer: why[] says why */
  gboolean        full;         /* out of passes */
  gboolean        aborted;      /* error or cancelled: *error is set */
  char            why[SW_ASCENT_REASON_MAX];
} Loop;

/* One pass: size for @L, simulate; returns F(L), or NAN when the vehicle
 * sized for L cannot be flown (lp->failed, lp->why) or on error. */
static double
pass (Loop *lp, double L)
{
  SwSizing sizing;
  SwAscentResult *r;
  double F;

  lp->failed = FALSE;
  for (guint i = 0; i < lp->n; i++)
    if (lp->history[i] == L && lp->fairing_stage[i] == lp->f_stage
        && lp->fairing_fraction[i] == lp->f_fraction)
      {
        lp->failed = !isfinite (lp->F[i]);
        return lp->F[i];
      }
  if (lp->n >= SW_ASCENT_LOOP_MAX)
    {
      lp->full = TRUE;
      return NAN;
    }
  lp->work->mission.losses_m_s = L;
  lp->work->mission.has_losses = TRUE;
  lp->work->ascent.has_flown_fairing = TRUE;
  lp->work->ascent.flown_fairing_stage = lp->f_stage;
  lp->work->ascent.flown_fairing_fraction = lp->f_fraction;
  if (!sw_size_design (lp->work, &sizing, lp->error))
    {
      lp->aborted = TRUE;
      return NAN;
    }
  lp->fairing_stage[lp->n] = lp->f_stage;
  lp->fairing_fraction[lp->n] = lp->f_fraction;
  lp->history[lp->n] = L;
  lp->F[lp->n] = NAN;
  lp->mass[lp->n] = sizing.liftoff_mass_kg;
  lp->n++;

  r = sw_ascent_solve_sized (lp->work, &sizing, &lp->pass_options, &lp->hints, lp->cancellable,
                             lp->error);
  if (r == NULL)
    {
      lp->aborted = TRUE;
      return NAN;
    }
  if (!sizing.feasible)
    {
      g_autofree char *losses = sw_format_speed (L);
      /* Translators: %s are a speed ("1,500 m/s") and the sizing's reason */
      g_snprintf (lp->why, sizeof lp->why, _("sized for %s of losses the vehicle is "
                                            "infeasible: %s"), losses, sizing.reason);
    }
  else if (r->status != SW_ASCENT_REACHED && r->status != SW_ASCENT_SHORT)
    {
      g_autofree char *losses = sw_format_speed (L);
      g_autofree char *why = sw_format_clause (r->reason);

      if (sizing.liftoff_mass_kg > 0.0 && isfinite (sizing.liftoff_mass_kg))
        {
          g_autofree char *mass = sw_format_mass (sizing.liftoff_mass_kg);
          /* Translators: a speed ("1,500 m/s"), a mass ("155.1 t") and the
           * ascent's reason, which starts with a small letter */
          g_snprintf (lp->why, sizeof lp->why, _("sized for %s of losses (liftoff mass %s): %s"),
                      losses, mass, why);
        }
      else
        /* Translators: a speed ("1,500 m/s") and the ascent's reason */
        g_snprintf (lp->why, sizeof lp->why, _("sized for %s of losses: %s"), losses, why);
    }
  if (!sizing.feasible || (r->status != SW_ASCENT_REACHED && r->status != SW_ASCENT_SHORT))
    {
      lp->failed = TRUE;
      if (lp->res == NULL)
        {
          lp->res = r;
          lp->res_L = L;
          lp->res_F = NAN;
          lp->res_i = lp->n - 1;
        }
      else
        sw_ascent_result_free (r);
      return NAN;
    }
  lp->flown_dropped = r->fairing_dropped;
  lp->flown_stage = r->fairing_stage;
  lp->flown_fraction = r->fairing_propellant_fraction;
  F = r->losses_m_s - L;
  lp->F[lp->n - 1] = F;
  if (lp->res == NULL || !isfinite (lp->res_F) || fabs (F) <= fabs (lp->res_F))
    {
      g_clear_pointer (&lp->res, sw_ascent_result_free);
      lp->res = r;
      lp->res_L = L;
      lp->res_F = F;
      lp->res_i = lp->n - 1;
    }
  else
    sw_ascent_result_free (r);
  return F;
}

/* The passes fly without the time series (whose 1 s samples hold the
 * integrator to 1 s steps); the pass the loop answers with is flown again,
 * recorded: the same sizing, pitch kick and steering, so the same flight.
 * FALSE on error or cancellation. */
static gboolean
record_answer (Loop *lp)
{
  SwAscentResult *r = lp->res, *again;
  SwAscentHints hints = { 0 };
  SwAscentOptions opt;

  if (!lp->record || r == NULL
      || (r->status != SW_ASCENT_REACHED && r->status != SW_ASCENT_SHORT))
    return TRUE;
  if (lp->options != NULL)
    opt = *lp->options;
  else
    sw_ascent_options_init (&opt);
  lp->work->mission.losses_m_s = lp->history[lp->res_i];
  lp->work->mission.has_losses = TRUE;
  lp->work->ascent.has_flown_fairing = TRUE;
  lp->work->ascent.flown_fairing_stage = lp->fairing_stage[lp->res_i];
  lp->work->ascent.flown_fairing_fraction = lp->fairing_fraction[lp->res_i];
  hints.have_kick = hints.hold_kick = !lp->work->ascent.has_pitch_kick;
  hints.kick_rad = r->pitch_kick_deg * G_PI / 180.0;
  hints.have_psi = TRUE;
  hints.psi[0] = r->steering_start_deg * G_PI / 180.0;
  hints.psi[1] = r->steering_end_deg * G_PI / 180.0;
  again = sw_ascent_solve_sized (lp->work, &r->sizing, &opt, &hints, lp->cancellable, lp->error);
  if (again == NULL)
    return FALSE;
  if (again->status != SW_ASCENT_REACHED && again->status != SW_ASCENT_SHORT)
    {
      /* Should not happen: keep the unrecorded answer. */
      sw_ascent_result_free (again);
      return TRUE;
    }
  again->pitch_kick_solved = r->pitch_kick_solved;
  again->guidance_iterations = r->guidance_iterations + again->guidance_iterations;
  g_strlcpy (again->notes, r->notes, sizeof again->notes);
  sw_ascent_result_free (r);
  lp->res = again;
  return TRUE;
}

static double
brent_fn (double L, void *data)
{
  Loop *lp = data;
  double F = lp->aborted || lp->full ? NAN : pass (lp, L);

  /* GSL's Brent needs a number; a failed pass stops the loop below. */
  return isfinite (F) ? F : 0.0;
}

SwAscentResult *
sw_ascent_close_loop (const SwDesign *design, const SwAscentOptions *options,
                      GCancellable *cancellable, GError **error)
{
  g_autoptr (SwDesign) work = NULL;
  Loop lp = { 0 };
  const double L_max = sw_limit_get (SW_LIMIT_LOSSES)->max;
  double La, Fa, Lb = NAN, Fb = NAN, L0, lo, hi, slope = -0.5;
  double L_fail = NAN;               /* the least allowance known not to fly */
  char fail_why[SW_ASCENT_REASON_MAX] = "";
  gboolean converged = FALSE, bracketed = FALSE, first_down = TRUE;
  guint rounds = 0;

  g_return_val_if_fail (design != NULL, NULL);

  if (!sw_ascent_check_inputs (design, error))
    return NULL;

  work = sw_design_copy (design);
  lp.design = design;
  lp.work = work;
  lp.options = options;
  lp.cancellable = cancellable;
  lp.error = error;
  if (options != NULL)
    lp.pass_options = *options;
  else
    sw_ascent_options_init (&lp.pass_options);
  lp.record = lp.pass_options.record;
  lp.pass_options.record = FALSE;

  L0 = design->mission.has_losses ? design->mission.losses_m_s : SW_ASCENT_FIRST_GUESS_LOSSES;
  L0 = CLAMP (L0, 0.0, L_max);
  {
    SwFairingCarry def;

    sw_fairing_carry_default (design, design->n_stages, &def);
    lp.f_stage = def.stage;
    lp.f_fraction = def.fraction;
  }

  /* 1. A flyable allowance. */
restart:
  Lb = Fb = NAN;
  slope = -0.5;
  L_fail = NAN;
  fail_why[0] = '\0';
  converged = bracketed = FALSE;
  first_down = TRUE;
  La = L0;
  Fa = pass (&lp, La);
  for (double step = 500.0; lp.failed && !lp.aborted && !lp.full; step *= 2.0)
    {
      L_fail = La;
      g_strlcpy (fail_why, lp.why, sizeof fail_why);
      if (La <= 0.0)
        break;
      La = MAX (0.0, La - step);
      Fa = pass (&lp, La);
    }
  if (lp.aborted)
    goto aborted;
  if (lp.failed || lp.full)
    {
      g_autofree char *upto = sw_format_speed (L0);
      /* Translators: a speed ("1,500 m/s") and why the last try failed */
      g_snprintf (lp.why, sizeof lp.why,
                  _("no allowance from 0 to %s gives a vehicle that flies; %s"), upto, fail_why);
      goto done;
    }
  /* 2. The bracket [lo, hi] with F(lo) > 0 > F(hi). */
  if (Fa > 0.0 && fabs (Fa) >= INNER_TOLERANCE)
    {
      /* The fixed-point step L + F(L) = L_simulated(L) cannot pass the
       * lowest root from below. */
      double Lc = MIN (La + Fa, L_max), Fc;

      Fc = pass (&lp, Lc);
      if (lp.aborted)
        goto aborted;
      if (lp.failed || !(Fc < Fa))
        {
          /* F grows with L here: we are above the vehicle's useful range (or
           * the fixed-point step cannot be flown).  Walk down until F < 0,
           * or until F grows again: then it has a minimum above 0. */
          double Lp = La, Fp = Fa, step = MAX (Fa, 300.0);

          if (lp.failed)
            {
              L_fail = Lc;
              g_strlcpy (fail_why, lp.why, sizeof fail_why);
              lp.failed = FALSE;
            }
          for (;;)
            {
              double Lx = MAX (0.0, Lp - step), Fx;

              if (Lp <= 0.0)
                {
                  g_autofree char *lack = sw_format_speed (Fp);
                  g_snprintf (lp.why, sizeof lp.why,
                              _("no allowance reaches the orbit: sized with no loss allowance "
                                "the vehicle lacks %s"), lack);
                  lp.failed = TRUE;
                  break;
                }
              Fx = pass (&lp, Lx);
              if (lp.aborted)
                goto aborted;
              if (lp.full || lp.failed)
                break;
              if (Fx < 0.0 || fabs (Fx) < INNER_TOLERANCE)
                {
                  La = Lx;
                  Fa = Fx;
                  break;
                }
              if (Fx >= Fp)
                {
                  double m0 = lp.mass[0] > 0.0 ? lp.res->sizing.liftoff_mass_kg : NAN;
                  g_autofree char *lack = sw_format_speed (Fp);
                  g_autofree char *losses = sw_format_speed (Lp);

                  if (m0 > 0.0 && isfinite (m0))
                    {
                      g_autofree char *mass = sw_format_mass (m0);
                      /* Translators: two speeds ("850 m/s") and a mass ("155.1 t") */
                      g_snprintf (lp.why, sizeof lp.why,
                                  _("no allowance reaches the orbit: the least the vehicle lacks "
                                    "is about %s, sized for %s of losses (liftoff mass %s)"),
                                  lack, losses, mass);
                    }
                  else
                    /* Translators: two speeds ("850 m/s", "1,500 m/s") */
                    g_snprintf (lp.why, sizeof lp.why,
                                _("no allowance reaches the orbit: the least the vehicle lacks "
                                  "is about %s, sized for %s of losses"), lack, losses);
                  lp.failed = TRUE;
                  break;
                }
              Lp = Lx;
              Fp = Fx;
              step *= 2.0;
            }
        }
      else
        {
          /* Below the root: secant steps, which stay below it (F is convex
           * in L), then a small step past it for the bracket. */
          for (;;)
            {
              double sl = (Fc - Fa) / (Lc - La), Ln, Fn;

              if (fabs (Fc) < INNER_TOLERANCE)
                {
                  La = Lc;
                  Fa = Fc;
                  break;
                }
              if (!(sl < -1e-3))
                sl = -1e-3;
              Ln = Lc - Fc / sl;
              Ln += MAX (1.0, 0.05 * (Ln - Lc));
              if (isfinite (L_fail) && Ln >= L_fail)
                Ln = 0.5 * (Lc + L_fail);
              Ln = MIN (Ln, L_max);
              if (Ln - Lc < 0.5)
                {
                  g_autofree char *losses = sw_format_speed (Lc);
                  g_autofree char *lack = sw_format_speed (Fc);
                  g_snprintf (lp.why, sizeof lp.why,
                              _("no allowance reaches the orbit: sized for %s of losses "
                                "the vehicle still lacks %s, and %s"),
                              losses, lack, isfinite (L_fail) ? fail_why
                                      : _("larger allowances lie beyond the accepted range"));
                  lp.failed = TRUE;
                  break;
                }
              Fn = pass (&lp, Ln);
              if (lp.aborted)
                goto aborted;
              if (lp.full)
                break;
              if (lp.failed)
                {
                  L_fail = Ln;
                  g_strlcpy (fail_why, lp.why, sizeof fail_why);
                  lp.failed = FALSE;
                  continue;
                }
              if (Fn < 0.0 || fabs (Fn) < INNER_TOLERANCE)
                {
                  La = Lc;
                  Fa = Fc;
                  Lb = Ln;
                  Fb = Fn;
                  bracketed = Fn < 0.0;
                  if (!bracketed)
                    {
                      La = Ln;
                      Fa = Fn;
                    }
                  break;
                }
              if (Fn >= Fc)
                {
                  g_autofree char *lack = sw_format_speed (Fc);
                  g_autofree char *losses = sw_format_speed (Lc);
                  g_snprintf (lp.why, sizeof lp.why,
                              _("no allowance reaches the orbit: the least the vehicle lacks "
                                "is about %s, sized for %s of losses"), lack, losses);
                  lp.failed = TRUE;
                  break;
                }
              La = Lc;
              Fa = Fc;
              Lc = Ln;
              Fc = Fn;
            }
        }
    }
  /* From above (F < 0): the fixed-point step cannot pass the root either;
   * half as far again brackets it. */
  while (!bracketed && !lp.failed && !lp.full && !lp.aborted && Fa < 0.0
         && fabs (Fa) >= INNER_TOLERANCE)
    {
      /* The first step half as far again as the fixed-point step, then the
       * secant's root overshot by 30 %. */
      Lb = first_down ? La + 1.5 * (Fa - 2.0) : La + 1.3 * (Fa - 2.0) / MAX (-slope, 0.02);
      Lb = MAX (0.0, Lb);
      first_down = FALSE;
      if (La - Lb < 0.5)
        {
          g_autofree char *spare = sw_format_speed (-Fa);
          g_snprintf (lp.why, sizeof lp.why,
                      _("the vehicle sized with no loss allowance already has %s to spare"),
                      spare);
          lp.failed = TRUE;
          break;
        }
      Fb = pass (&lp, Lb);
      if (lp.aborted)
        goto aborted;
      if (lp.failed || lp.full)
        break;
      if (Fb >= 0.0 || fabs (Fb) < INNER_TOLERANCE)
        {
          bracketed = Fb > 0.0;
          if (!bracketed)
            {
              La = Lb;
              Fa = Fb;
            }
          break;
        }
      if ((Fb - Fa) / (Lb - La) < -0.02)
        slope = (Fb - Fa) / (Lb - La);
      La = Lb;
      Fa = Fb;
    }
  if (lp.aborted)
    goto aborted;
  if (lp.failed)
    goto done;
  if (lp.full)
    {
      g_snprintf (lp.why, sizeof lp.why,
                  _("the losses did not settle within 1 m/s in %d passes"), SW_ASCENT_LOOP_MAX);
      goto done;
    }
  if (!bracketed || fabs (lp.res_F) < INNER_TOLERANCE)
    {
      converged = fabs (lp.res_F) < SW_ASCENT_LOOP_TOLERANCE;
      goto done;
    }

  /* 3. Brent's method on the bracket. */
  lo = MIN (La, Lb);
  hi = MAX (La, Lb);
  {
    gsl_root_fsolver *brent = gsl_root_fsolver_alloc (gsl_root_fsolver_brent);
    gsl_function fn = { brent_fn, &lp };

    gsl_root_fsolver_set (brent, &fn, lo, hi);
    while (!lp.aborted && !lp.full)
      {
        gsl_root_fsolver_iterate (brent);
        if (lp.aborted || lp.full)
          break;
        if (lp.failed)
          {
            /* Inside a bracket of flyable allowances: should not happen. */
            break;
          }
        if (fabs (lp.res_F) < INNER_TOLERANCE)
          break;
        lo = gsl_root_fsolver_x_lower (brent);
        hi = gsl_root_fsolver_x_upper (brent);
        if (hi - lo < 0.05)
          break;
      }
    gsl_root_fsolver_free (brent);
  }
  if (lp.aborted)
    goto aborted;
  converged = isfinite (lp.res_F) && fabs (lp.res_F) < SW_ASCENT_LOOP_TOLERANCE;
  if (!converged)
    {
      if (lp.full)
        g_snprintf (lp.why, sizeof lp.why,
                    _("the losses did not settle within 1 m/s in %d passes"),
                    SW_ASCENT_LOOP_MAX);
      else if (lp.failed)
        /* lp.why says why */;
      else
        {
          g_autofree char *jump = sw_format_number (fabs (lp.res_F), 1);
          g_autofree char *near = sw_format_speed (lo);
          /* Translators: a speed jump ("12.3"), a small span ("0.50") and a
           * speed ("1,500 m/s") */
          g_snprintf (lp.why, sizeof lp.why,
                      _("the simulated losses jump by %s m/s across %.2f m/s of sizing "
                        "allowance, near %s"), jump, hi - lo, near);
        }
    }

done:
  /* The fairing: the sizing drops it by default at the second stage's
   * ignition (sw-sizing.h).  When the converged flight drops it elsewhere
   * and that costs more than the loop's inner tolerance (its fairing loss),
   * the loop runs again from the converged allowance with the fairing
   * sized where this flight drops it; twice more at most. */
  if (converged && lp.res != NULL && lp.res->fairing_dropped && rounds < 2
      && fabs (lp.res->fairing_loss_m_s) > INNER_TOLERANCE
      && (lp.res->fairing_stage != lp.f_stage
          || lp.res->fairing_propellant_fraction != lp.f_fraction))
    {
      rounds++;
      lp.f_stage = lp.res->fairing_stage;
      lp.f_fraction = lp.res->fairing_propellant_fraction;
      L0 = lp.res_L;
      g_clear_pointer (&lp.res, sw_ascent_result_free);
      lp.res_F = NAN;
      goto restart;
    }
  if (!record_answer (&lp))
    goto aborted;
  if (lp.res == NULL)
    {
      /* No pass at all (should not happen): report the failure plainly. */
      lp.res = sw_ascent_result_new ();
      lp.res_L = L0;
    }
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
