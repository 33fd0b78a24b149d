/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-optimal-ascent.h: minimum-time ascent over a flat Earth with constant
 * gravity, steered by the linear-tangent law
 *     tan (theta (t)) = tan (theta_0) - c t,
 * theta the thrust's angle above the horizontal.  Without drag this law is
 * the optimal steering of the problem (Bryson and Ho, Applied Optimal
 * Control, 1975, sec. 2.7): with the downrange distance free, the three
 * parameters (theta_0, c, t_f) are fixed by the three end conditions
 * (altitude, horizontal speed, vertical speed), and the direct shooting
 * here solves for them with GSL's multidimensional root finder (hybrids)
 * over a GSL ODE integration (rk8pd).  With drag the same law is a
 * near-optimal steering and the time it gives is an upper bound of the
 * minimum.
 *
 * The check against published optimal-ascent problems of the steering
 * machinery used by the ascent (tests/test-optimal-ascent.c). */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

typedef struct {
  /* A bend added to the law, for the test of its optimality:
   * tan theta = tan theta_0 - c t + bend t (t - t_f); 0 for the law itself. */
  double bend_per_s2;
  double gravity_m_s2;          /* constant, > 0 */
  /* Thrust: either a constant acceleration (thrust_n == 0) ... */
  double thrust_accel_m_s2;
  /* ... or a constant thrust from a burning mass. */
  double thrust_n;
  double mass0_kg;
  double isp_s;
  /* Drag per axis, -1/2 Cd S rho v_i |v_i| (0 for none), with
   * rho = rho0 exp (-y / scale_height). */
  double cd_area_m2;            /* Cd times the reference area */
  double rho0_kg_m3;
  double scale_height_m;
  /* The end state (from rest at the origin). */
  double altitude_m;
  double horizontal_speed_m_s;
  double vertical_speed_m_s;
} SwOptimalAscentProblem;

typedef struct {
  gboolean converged;
  double   final_time_s;
  double   theta0_rad;          /* the first pitch angle above the horizontal */
  double   c_per_s;             /* the law's rate: tan theta = tan theta0 - c t */
  double   downrange_m;
  double   final_mass_kg;       /* NAN for a constant acceleration */
  double   residual;            /* largest scaled end-condition error */
  guint    iterations;
} SwOptimalAscentSolution;

void     sw_optimal_ascent_problem_init (SwOptimalAscentProblem *p);

/* Solves the end conditions for (theta_0, c, t_f).  @guess_tf_s and
 * @guess_theta0_rad: a first guess (<= 0: a built-in one); several starts
 * are tried before it gives up.  FALSE with @error when the problem is bad
 * or no start converges. */
gboolean sw_optimal_ascent_solve (const SwOptimalAscentProblem *p, double guess_tf_s,
                                  double guess_theta0_rad, SwOptimalAscentSolution *out,
                                  GError **error);

/* The end state for given parameters (for tests): x, y, vx, vy, m. */
gboolean sw_optimal_ascent_fly (const SwOptimalAscentProblem *p, double theta0_rad,
                                double c_per_s, double tf_s, double state[5]);

G_END_DECLS
