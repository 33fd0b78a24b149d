/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-optimal-ascent"

#include "config.h"

#include "sw-optimal-ascent.h"

#include "sw-types.h"

#include <glib/gi18n-lib.h>
#include <gsl/gsl_errno.h>
#include <gsl/gsl_multiroots.h>
#include <gsl/gsl_odeiv2.h>
#include <math.h>
#include <string.h>

#define G0 9.80665   /* standard gravity for the Isp, m/s^2 */

void
sw_optimal_ascent_problem_init (SwOptimalAscentProblem *p)
{
  memset (p, 0, sizeof *p);
  p->scale_height_m = 1.0;
}

typedef struct {
  const SwOptimalAscentProblem *p;
  double tan0, c, tf;
} Flight;

static int
rhs (double t, const double s[], double ds[], void *data)
{
  const Flight *f = data;
  const SwOptimalAscentProblem *p = f->p;
  double tan_theta = f->tan0 - f->c * t + p->bend_per_s2 * t * (t - f->tf);
  double sec = sqrt (1.0 + tan_theta * tan_theta);
  double cos_t = 1.0 / sec, sin_t = tan_theta / sec;
  double m = s[4], a, ax_drag = 0.0, ay_drag = 0.0;

  if (p->thrust_n > 0.0)
    {
      if (!(m > 0.0))
        return GSL_EBADFUNC;
      a = p->thrust_n / m;
      ds[4] = -p->thrust_n / (p->isp_s * G0);
    }
  else
    {
      a = p->thrust_accel_m_s2;
      ds[4] = 0.0;
    }
  if (p->cd_area_m2 > 0.0)
    {
      double q = 0.5 * p->cd_area_m2 * p->rho0_kg_m3 * exp (-s[1] / p->scale_height_m);
      ax_drag = -q * s[2] * fabs (s[2]) / m;
      ay_drag = -q * s[3] * fabs (s[3]) / m;
    }
  ds[0] = s[2];
  ds[1] = s[3];
  ds[2] = a * cos_t + ax_drag;
  ds[3] = a * sin_t - p->gravity_m_s2 + ay_drag;
  return GSL_SUCCESS;
}

gboolean
sw_optimal_ascent_fly (const SwOptimalAscentProblem *p, double theta0_rad, double c_per_s,
                       double tf_s, double state[5])
{
  Flight f = { p, tan (theta0_rad), c_per_s, tf_s };
  gsl_odeiv2_system sys = { rhs, NULL, 5, &f };
  gsl_odeiv2_driver *drv;
  double t = 0.0;
  int status;

  if (!(tf_s > 0.0) || !isfinite (f.tan0) || !isfinite (c_per_s))
    return FALSE;
  state[0] = state[1] = state[2] = state[3] = 0.0;
  state[4] = p->thrust_n > 0.0 ? p->mass0_kg : 1.0;
  drv = gsl_odeiv2_driver_alloc_y_new (&sys, gsl_odeiv2_step_rk8pd, 1e-3, 1e-11, 1e-11);
  status = gsl_odeiv2_driver_apply (drv, &t, tf_s, state);
  gsl_odeiv2_driver_free (drv);
  return status == GSL_SUCCESS;
}

/* Unknowns, scaled for the solver: theta_0 and the last pitch angle
 * theta_f (both in radians, so c = (tan theta_0 - tan theta_f) / t_f), and
 * t_f / t_ref. */
typedef struct {
  const SwOptimalAscentProblem *p;
  double t_ref;
} Shoot;

static gboolean
unpack (const gsl_vector *x, const Shoot *sh, double *theta0, double *c, double *tf)
{
  double th0 = gsl_vector_get (x, 0), thf = gsl_vector_get (x, 1);

  *tf = gsl_vector_get (x, 2) * sh->t_ref;
  if (!(fabs (th0) < G_PI_2 - 1e-6) || !(fabs (thf) < G_PI_2 - 1e-6) || !(*tf > 0.0))
    return FALSE;
  *theta0 = th0;
  *c = (tan (th0) - tan (thf)) / *tf;
  return TRUE;
}

static int
residuals (const gsl_vector *x, void *data, gsl_vector *f)
{
  const Shoot *sh = data;
  const SwOptimalAscentProblem *p = sh->p;
  double theta0, c, tf, s[5];
  double v_scale = MAX (fabs (p->horizontal_speed_m_s), 1.0);

  if (!unpack (x, sh, &theta0, &c, &tf) || !sw_optimal_ascent_fly (p, theta0, c, tf, s)
      || !isfinite (s[1]))
    return GSL_EDOM;
  gsl_vector_set (f, 0, (s[1] - p->altitude_m) / MAX (p->altitude_m, 1.0));
  gsl_vector_set (f, 1, (s[2] - p->horizontal_speed_m_s) / v_scale);
  gsl_vector_set (f, 2, (s[3] - p->vertical_speed_m_s) / v_scale);
  return GSL_SUCCESS;
}

static gboolean
solve_from (const SwOptimalAscentProblem *p, double t_ref, double th0, double thf,
            SwOptimalAscentSolution *out)
{
  Shoot sh = { p, t_ref };
  gsl_multiroot_function fn = { residuals, 3, &sh };
  gsl_multiroot_fsolver *s = gsl_multiroot_fsolver_alloc (gsl_multiroot_fsolver_hybrids, 3);
  gsl_vector *x = gsl_vector_alloc (3);
  gboolean ok = FALSE;
  int status = GSL_CONTINUE;
  guint iter = 0;

  gsl_vector_set (x, 0, th0);
  gsl_vector_set (x, 1, thf);
  gsl_vector_set (x, 2, 1.0);
  if (gsl_multiroot_fsolver_set (s, &fn, x) == GSL_SUCCESS)
    {
      while (status == GSL_CONTINUE && iter < 200)
        {
          iter++;
          if (gsl_multiroot_fsolver_iterate (s) != GSL_SUCCESS)
            break;
          status = gsl_multiroot_test_residual (s->f, 1e-11);
        }
      if (status == GSL_SUCCESS)
        {
          double theta0, c, tf, st[5];

          if (unpack (s->x, &sh, &theta0, &c, &tf) && sw_optimal_ascent_fly (p, theta0, c, tf, st))
            {
              out->converged = TRUE;
              out->final_time_s = tf;
              out->theta0_rad = theta0;
              out->c_per_s = c;
              out->downrange_m = st[0];
              out->final_mass_kg = p->thrust_n > 0.0 ? st[4] : NAN;
              out->residual = MAX (fabs (gsl_vector_get (s->f, 0)),
                                   MAX (fabs (gsl_vector_get (s->f, 1)),
                                        fabs (gsl_vector_get (s->f, 2))));
              out->iterations = iter;
              ok = TRUE;
            }
        }
    }
  gsl_vector_free (x);
  gsl_multiroot_fsolver_free (s);
  return ok;
}

gboolean
sw_optimal_ascent_solve (const SwOptimalAscentProblem *p, double guess_tf_s,
                         double guess_theta0_rad, SwOptimalAscentSolution *out,
                         GError **error)
{
  static const double starts_theta0[] = { 1.2, 0.6, 1.45, 0.3, 1.52 };
  static const double starts_thetaf[] = { -0.3, -0.9 };
  static const double starts_tf[] = { 1.0, 0.7, 1.1, 0.5 };
  gsl_error_handler_t *old;
  double a0, t_ref;
  gboolean ok = FALSE;

  g_return_val_if_fail (p != NULL && out != NULL, FALSE);
  memset (out, 0, sizeof *out);
  out->final_time_s = out->theta0_rad = out->c_per_s = out->downrange_m = NAN;
  out->final_mass_kg = out->residual = NAN;

  a0 = p->thrust_n > 0.0 ? p->thrust_n / p->mass0_kg : p->thrust_accel_m_s2;
  if (!(p->gravity_m_s2 > 0.0) || !(a0 > p->gravity_m_s2) || !(p->altitude_m > 0.0)
      || !(p->horizontal_speed_m_s > 0.0) || !isfinite (p->vertical_speed_m_s)
      || (p->thrust_n > 0.0 && !(p->isp_s > 0.0))
      || (p->cd_area_m2 > 0.0 && !(p->rho0_kg_m3 >= 0.0 && p->scale_height_m > 0.0)))
    {
      g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                   _("The optimal-ascent problem needs positive gravity, altitude and speed, "
                     "and a thrust acceleration above gravity."));
      return FALSE;
    }
  /* Time to the speed at the first acceleration, a scale for t_f. */
  t_ref = guess_tf_s > 0.0 ? guess_tf_s
          : hypot (p->horizontal_speed_m_s, sqrt (2.0 * p->gravity_m_s2 * p->altitude_m)) / a0
              * 1.3;
  /* A burning mass: every start inside the burn time (a start beyond it
   * runs out of mass, and the solver cannot step back from there). */
  if (p->thrust_n > 0.0)
    {
      double t_burn = p->mass0_kg * p->isp_s * G0 / p->thrust_n;
      t_ref = MIN (t_ref, 0.9 * t_burn);
    }
  old = gsl_set_error_handler_off ();
  if (guess_theta0_rad > 0.0)
    ok = solve_from (p, t_ref, guess_theta0_rad, -0.2, out);
  for (guint k = 0; !ok && k < G_N_ELEMENTS (starts_thetaf); k++)
    for (guint i = 0; !ok && i < G_N_ELEMENTS (starts_tf); i++)
      for (guint j = 0; !ok && j < G_N_ELEMENTS (starts_theta0); j++)
        ok = solve_from (p, t_ref * starts_tf[i], starts_theta0[j], starts_thetaf[k], out);
  gsl_set_error_handler (old);
  if (!ok)
    g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                 _("No linear-tangent steering reaches the end state from any start tried."));
  return ok;
}
