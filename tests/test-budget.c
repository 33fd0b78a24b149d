/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Tests of sw-budget: the delta-v budget of a circular orbit from a site. */
#include "config.h"

#include "sw-budget.h"
#include "sw-design.h"

#include <math.h>
#include <string.h>

#define DEG (G_PI / 180.0)

/* WGS 84 defining constants (confirmed, reference-values.md). */
static void
test_wgs84_constants (void)
{
  g_assert_cmpfloat (SW_WGS84_MU, ==, 3.986004418e14);   /* GM, atmosphere included */
  g_assert_cmpfloat (SW_WGS84_A, ==, 6378137.0);         /* equatorial radius */
  g_assert_cmpfloat (SW_WGS84_OMEGA, ==, 7.292115e-5);   /* rotation rate */
}

static void
test_circular_velocity (void)
{
  /* 7784.3 m/s at 200 km and 7793.2 m/s at 185 km (computed from WGS 84 GM
   * and a, reference-values.md). */
  g_assert_cmpfloat_with_epsilon (sw_circular_velocity (200e3), 7784.3, 0.05);
  g_assert_cmpfloat_with_epsilon (sw_circular_velocity (185e3), 7793.2, 0.05);
  /* v = sqrt(mu / r): four times the radius, half the speed. */
  g_assert_cmpfloat_with_epsilon (sw_circular_velocity (3.0 * SW_WGS84_A) * 2.0,
                                  sw_circular_velocity (0.0), 1e-9);
  /* Higher is slower. */
  g_assert_cmpfloat (sw_circular_velocity (400e3), <, sw_circular_velocity (200e3));
}

static void
test_site_speed (void)
{
  /* omega a = 465.10 m/s at the equator; 408.7 m/s at 28.5 deg (computed,
   * reference-values.md). */
  g_assert_cmpfloat_with_epsilon (sw_site_speed (0.0), 465.10, 0.005);
  g_assert_cmpfloat_with_epsilon (sw_site_speed (28.5), 408.7, 0.05);
  g_assert_cmpfloat_with_epsilon (sw_site_speed (-28.5), 408.7, 0.05);
  g_assert_cmpfloat_with_epsilon (sw_site_speed (90.0), 0.0, 1e-9);
}

/* cos i = cos(latitude) sin(azimuth) (spherical trigonometry, confirmed). */
static void
test_azimuth_relation (void)
{
  static const double lats[] = { 0.0, 5.2, 28.5, -28.5, 45.0, 57.4, -62.0 };

  for (guint k = 0; k < G_N_ELEMENTS (lats); k++)
    {
      double lat = lats[k];
      for (double inc = fabs (lat); inc <= 180.0 - fabs (lat); inc += 0.5)
        {
          double az;
          g_assert_true (sw_launch_azimuth (inc, lat, &az));
          g_assert_cmpfloat (az, >=, 0.0);
          g_assert_cmpfloat (az, <, 360.0);
          g_assert_cmpfloat_with_epsilon (cos (inc * DEG), cos (lat * DEG) * sin (az * DEG),
                                          1e-12);
        }
    }
}

/* Launching due east (i = latitude) gains the whole site speed. */
static void
test_due_east (void)
{
  static const double lats[] = { 0.0, 28.5, 45.0, -34.0 };

  for (guint k = 0; k < G_N_ELEMENTS (lats); k++)
    {
      SwBudget b;
      g_autoptr (GError) error = NULL;

      g_assert_true (sw_budget_compute (200.0, fabs (lats[k]), lats[k], 0.0, &b, &error));
      g_assert_no_error (error);
      g_assert_cmpfloat_with_epsilon (b.launch_azimuth_deg, 90.0, 1e-5);
      g_assert_cmpfloat_with_epsilon (b.rotation_gain_m_s, b.site_speed_m_s, 1e-6);
      g_assert_cmpfloat_with_epsilon (b.ideal_delta_v_m_s, b.circular_velocity_m_s - b.site_speed_m_s,
                                      1e-6);
      g_assert_cmpfloat_with_epsilon (b.site_speed_m_s, sw_site_speed (lats[k]), 1e-12);
    }
  /* From the equator to 200 km: 7784.3 - 465.1 = 7319.2 m/s (computed). */
  {
    SwBudget b;
    g_assert_true (sw_budget_compute (200.0, 0.0, 0.0, 0.0, &b, NULL));
    g_assert_cmpfloat_with_epsilon (b.ideal_delta_v_m_s, 7319.2, 0.1);
  }
}

/* A polar orbit: the site's eastward speed is all lost, at right angles to the
 * northward orbital velocity: ideal dv = sqrt(vc^2 + vs^2). */
static void
test_polar (void)
{
  static const double lats[] = { 0.0, 28.5, 57.4, -70.0 };

  for (guint k = 0; k < G_N_ELEMENTS (lats); k++)
    {
      SwBudget b;
      double vc = sw_circular_velocity (500e3), vs = sw_site_speed (lats[k]);

      g_assert_true (sw_budget_compute (500.0, 90.0, lats[k], 0.0, &b, NULL));
      g_assert_cmpfloat_with_epsilon (b.ideal_delta_v_m_s, sqrt (vc * vc + vs * vs), 1e-6);
      g_assert_cmpfloat (b.rotation_gain_m_s, <, 0.0);
      g_assert_true (b.launch_azimuth_deg < 1e-6 || b.launch_azimuth_deg > 360.0 - 1e-6
                     || fabs (b.launch_azimuth_deg - 180.0) < 1e-6);
    }
}

/* Retrograde orbits (i > 90 deg) go against the rotation: the ideal delta-v
 * exceeds the circular velocity; i = 180 from the equator loses exactly the
 * site speed. */
static void
test_retrograde (void)
{
  SwBudget b;
  double vc = sw_circular_velocity (500e3);

  g_assert_true (sw_budget_compute (500.0, 180.0, 0.0, 0.0, &b, NULL));
  g_assert_cmpfloat_with_epsilon (b.launch_azimuth_deg, 270.0, 1e-5);
  g_assert_cmpfloat_with_epsilon (b.ideal_delta_v_m_s, vc + sw_site_speed (0.0), 1e-6);
  g_assert_cmpfloat_with_epsilon (b.rotation_gain_m_s, -sw_site_speed (0.0), 1e-6);

  /* A sun-synchronous-like 97.4 deg orbit from 57.4 deg: heading west of north. */
  g_assert_true (sw_budget_compute (500.0, 97.4, 57.4, 0.0, &b, NULL));
  g_assert_cmpfloat (b.launch_azimuth_deg, >, 270.0);
  g_assert_cmpfloat (b.launch_azimuth_deg, <, 360.0);
  g_assert_cmpfloat (b.ideal_delta_v_m_s, >, b.circular_velocity_m_s);
  g_assert_cmpfloat (b.rotation_gain_m_s, <, 0.0);
}

/* The ideal delta-v checked a second way, without the azimuth: conservation
 * of the polar component of angular momentum puts an eastward speed of
 * vc cos i / cos lat in the orbit where it crosses the site's latitude; the
 * site moves east at vs, so by the law of cosines for the difference of the
 * two velocity vectors |v - s|^2 = vc^2 + vs^2 - 2 vs v_east. */
static void
test_ideal_by_angular_momentum (void)
{
  static const double lats[] = { 0.0, 13.0, 28.5, 45.6, -51.0 };

  for (guint k = 0; k < G_N_ELEMENTS (lats); k++)
    for (double inc = fabs (lats[k]); inc <= 180.0 - fabs (lats[k]); inc += 1.7)
      {
        SwBudget b;
        double vc = sw_circular_velocity (400e3), vs = sw_site_speed (lats[k]);
        double v_east = vc * cos (inc * DEG) / cos (lats[k] * DEG);
        double ideal = sqrt (vc * vc + vs * vs - 2.0 * vs * v_east);

        g_assert_true (sw_budget_compute (400.0, inc, lats[k], 1234.5, &b, NULL));
        g_assert_cmpfloat_with_epsilon (b.ideal_delta_v_m_s, ideal, 1e-6);
        g_assert_cmpfloat_with_epsilon (b.rotation_gain_m_s, vc - ideal, 1e-6);
        g_assert_cmpfloat (b.losses_m_s, ==, 1234.5);
        g_assert_cmpfloat_with_epsilon (b.delta_v_m_s, ideal + 1234.5, 1e-6);
        g_assert_cmpfloat_with_epsilon (b.circular_velocity_m_s, vc, 1e-9);
      }
}

/* Hand-worked values: the orbit's velocity vector at the site, built in
 * three dimensions from the orbit normal (inclination i, node placed so the
 * orbit passes over the site), less the site's velocity omega a cos(lat)
 * eastward; WGS 84 GM, a and omega (reference-values.md, confirmed), the
 * values computed once by us to the millimetre per second. */
static void
test_ideal_hand_worked (void)
{
  static const struct { double lat, inc, alt_km, vc, ideal; } cases[] = {
    { 28.5, 51.6, 400.0, 7668.558, 7385.324 },
    { 45.6, 51.6, 200.0, 7784.262, 7496.862 },
    { -51.0, 97.4, 500.0, 7612.608, 7677.858 },
    { 13.0, 13.0, 300.0, 7725.760, 7272.580 },
  };

  for (guint k = 0; k < G_N_ELEMENTS (cases); k++)
    {
      SwBudget b;

      g_assert_true (sw_budget_compute (cases[k].alt_km, cases[k].inc, cases[k].lat, 100.0, &b,
                                        NULL));
      /* Printed to 1 mm/s: allow the rounding. */
      g_assert_cmpfloat_with_epsilon (b.circular_velocity_m_s, cases[k].vc, 6e-4);
      g_assert_cmpfloat_with_epsilon (b.ideal_delta_v_m_s, cases[k].ideal, 6e-4);
      g_assert_cmpfloat_with_epsilon (b.delta_v_m_s, cases[k].ideal + 100.0, 6e-4);
    }
}

/* An inclination below the latitude (or above 180 - latitude) cannot be
 * reached directly: a clear error that gives both numbers. */
static void
test_unreachable (void)
{
  SwBudget b;
  double az;
  g_autoptr (GError) error = NULL;

  g_assert_false (sw_launch_azimuth (20.0, 45.0, &az));
  g_assert_false (sw_launch_azimuth (170.0, -45.0, &az));
  g_assert_false (sw_budget_compute (300.0, 20.0, 45.0, 0.0, &b, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_VALUE);
  g_assert_nonnull (strstr (error->message, "20.00"));
  g_assert_nonnull (strstr (error->message, "45.00"));
  g_assert_nonnull (strstr (error->message, "latitude"));
  g_clear_error (&error);
  g_assert_false (sw_budget_compute (300.0, 150.0, 51.0, 0.0, &b, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_VALUE);
}

static void
test_design_budget (void)
{
  g_autoptr (SwDesign) d = sw_design_new_default ();
  g_autoptr (GError) error = NULL;
  SwBudget b, ref;
  double dv;

  /* A delta-v mission has no budget. */
  g_assert_false (sw_design_budget (d, &b, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_USAGE);
  g_clear_error (&error);
  g_assert_true (sw_design_required_delta_v (d, &dv, NULL));
  g_assert_cmpfloat (dv, ==, d->mission.delta_v_m_s);

  d->mission.kind = SW_MISSION_ORBIT;
  d->mission.altitude_km = 185.0;
  d->mission.inclination_deg = 28.5;
  d->mission.site_latitude_deg = 28.5;
  d->mission.losses_m_s = 1500.0;
  d->mission.has_losses = TRUE;
  g_assert_true (sw_design_budget (d, &b, &error));
  g_assert_no_error (error);
  g_assert_true (sw_budget_compute (185.0, 28.5, 28.5, 1500.0, &ref, NULL));
  g_assert_cmpmem (&b, sizeof b, &ref, sizeof ref);
  /* 7793.2 - 408.7 + 1500 (computed from the values above). */
  g_assert_cmpfloat_with_epsilon (b.delta_v_m_s, 7793.2 - 408.7 + 1500.0, 0.1);
  g_assert_true (sw_design_required_delta_v (d, &dv, NULL));
  g_assert_cmpfloat (dv, ==, b.delta_v_m_s);

  /* Losses missing: none assumed. */
  d->mission.has_losses = FALSE;
  g_assert_true (sw_design_budget (d, &b, NULL));
  g_assert_cmpfloat (b.losses_m_s, ==, 0.0);
  g_assert_cmpfloat (b.delta_v_m_s, ==, b.ideal_delta_v_m_s);
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/core/budget/ideal-hand-worked", test_ideal_hand_worked);
  g_test_add_func ("/core/budget/wgs84-constants", test_wgs84_constants);
  g_test_add_func ("/core/budget/circular-velocity", test_circular_velocity);
  g_test_add_func ("/core/budget/site-speed", test_site_speed);
  g_test_add_func ("/core/budget/azimuth-relation", test_azimuth_relation);
  g_test_add_func ("/core/budget/due-east", test_due_east);
  g_test_add_func ("/core/budget/polar", test_polar);
  g_test_add_func ("/core/budget/retrograde", test_retrograde);
  g_test_add_func ("/core/budget/ideal-by-angular-momentum", test_ideal_by_angular_momentum);
  g_test_add_func ("/core/budget/unreachable", test_unreachable);
  g_test_add_func ("/core/budget/design-budget", test_design_budget);

  return g_test_run ();
}
