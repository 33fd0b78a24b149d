/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Ascent checks that need the Earth turning: with rotation on, the air
 * moves with the ground, so the speed relative to the air (which sets the
 * dynamic pressure, the Mach number and the drag) differs from the inertial
 * speed by the ground's speed.  Also the orbit reported after a transfer and
 * the altitude named in a shortfall.  Every ascent here runs under alarm():
 * a fault that makes the integrator crawl fails the test instead of
 * hanging it. */
#include "config.h"

#include "sw-ascent.h"
#include "sw-atmosphere.h"
#include "sw-budget.h"
#include "sw-design.h"

#include <math.h>
#include <string.h>
#include <unistd.h>

#define RE 6378137.0             /* WGS 84 equatorial radius (reference-values.md) */
#define DEG (G_PI / 180.0)

/* A two-stage kerosene-like vehicle to a 200 km orbit launched due east from
 * 28.5 deg (inclination = latitude); invented numbers. */
#define TWO_STAGE(LOSSES, MODEL, EXTRA) \
  "{ \"format\": \"stagewright-design\", \"version\": 1, \"name\": \"two\", \"payload_kg\": 5000," \
  "  \"mission\": { \"orbit\": { \"altitude_km\": 200, \"inclination_deg\": 28.5," \
  "    \"site_latitude_deg\": 28.5 }, \"losses_m_s\": " LOSSES "," \
  "    \"loss_model\": \"" MODEL "\" }," \
  "  \"split\": \"optimal\", \"stages\": [" \
  "  { \"isp_vac_s\": 320, \"isp_sl_s\": 285, \"structural_coefficient\": 0.06," \
  "    \"thrust_vac_kn\": 2100, \"diameter_m\": 3.7 }," \
  "  { \"isp_vac_s\": 345, \"structural_coefficient\": 0.09, \"thrust_vac_kn\": 220," \
  "    \"coast_before_ignition_s\": 3 } ]," \
  "  \"ascent\": { \"fairing_mass_kg\": 1000, \"fairing_jettison_altitude_km\": 110" EXTRA " } }"

static SwDesign *
load (const char *text)
{
  g_autoptr (GError) error = NULL;
  SwDesign *d = sw_design_load_data (text, -1, "test.stagewright", NULL, &error);

  g_assert_no_error (error);
  return d;
}

/* Due east from 28.5 deg the ground moves in the orbit plane at
 * omega a cos(28.5 deg) = 408.74 m/s (WGS 84 omega and a, reference-values.md:
 * 408.7 m/s, computed); at radius r the air, turning with the Earth, moves
 * at 408.74 r / a. */
static void
test_air_speed_with_rotation (void)
{
  g_autoptr (SwDesign) d = load (TWO_STAGE ("1600", "allowance", ""));
  g_autoptr (SwAscentResult) r = NULL;
  g_autoptr (GError) error = NULL;
  const double ground = 7.292115e-5 * RE * cos (28.5 * DEG);
  SwAscentOptions o;
  guint n_air = 0, n_q = 0;
  double widest = 0.0;

  g_assert_cmpfloat_with_epsilon (ground, 408.7, 0.05);
  sw_ascent_options_init (&o);
  g_assert_true (o.rotation && o.atmosphere);
  o.sample_interval_s = 1.0;
  r = sw_ascent_solve (d, &o, NULL, &error);
  g_assert_no_error (error);
  g_assert_nonnull (r);
  g_assert_cmpuint (r->samples->len, >, 100);

  /* On the pad: at rest in the air, moving at the ground's speed. */
  {
    const SwAscentSample *p = &g_array_index (r->samples, SwAscentSample, 0);
    g_assert_cmpfloat (p->time_s, ==, 0.0);
    g_assert_cmpfloat (fabs (p->air_speed_m_s), <, 1e-6);
    g_assert_cmpfloat_with_epsilon (p->speed_m_s, ground, 1e-6);
    g_assert_cmpfloat (p->dynamic_pressure_pa, <, 1e-6);
  }
  for (guint i = 1; i < r->samples->len; i++)
    {
      const SwAscentSample *p = &g_array_index (r->samples, SwAscentSample, i);
      double gamma = p->flight_path_deg * DEG;
      double vr = p->speed_m_s * sin (gamma), vt = p->speed_m_s * cos (gamma);
      double wind = ground * (RE + p->altitude_m) / RE;
      double air = hypot (vr, vt - wind);
      SwAtmosphere a;

      /* The air-relative speed from the inertial one, by vectors. */
      if (!(fabs (p->air_speed_m_s - air) <= 1e-6 * MAX (air, 1.0)))
        g_error ("T+%.1f s: air speed %.9g m/s, from the inertial velocity %.9g m/s",
                 p->time_s, p->air_speed_m_s, air);
      n_air++;
      widest = MAX (widest, fabs (p->speed_m_s - p->air_speed_m_s));
      /* q = rho V_air^2 / 2 and Mach = V_air / a, the 1976 standard atmosphere
       * at the sample's altitude (checked against its table in
       * test-atmosphere); the burning stages' samples only, the air. */
      if (p->altitude_m > 86000.0)
        continue;
      g_assert_true (sw_atmosphere_at (p->altitude_m, &a));
      g_assert_cmpfloat_with_epsilon (p->dynamic_pressure_pa,
                                      0.5 * a.density_kg_m3 * air * air,
                                      1e-6 * MAX (p->dynamic_pressure_pa, 1.0));
      g_assert_cmpfloat_with_epsilon (p->mach, air / a.speed_of_sound_m_s, 1e-6);
      n_q++;
    }
  g_assert_cmpuint (n_air, >, 100);
  g_assert_cmpuint (n_q, >, 30);
  /* The two speeds really differ here: by about the ground's speed early on. */
  g_assert_cmpfloat (widest, >, 0.9 * ground);

  /* The same vehicle on a still Earth flies through still air: the two
   * speeds agree, and the drag loss differs from the turning Earth's. */
  {
    g_autoptr (SwAscentResult) still = NULL;

    o.rotation = FALSE;
    still = sw_ascent_solve (d, &o, NULL, &error);
    g_assert_no_error (error);
    for (guint i = 0; i < still->samples->len; i++)
      {
        const SwAscentSample *p = &g_array_index (still->samples, SwAscentSample, i);
        g_assert_cmpfloat (fabs (p->speed_m_s - p->air_speed_m_s), <=, 1e-9 * p->speed_m_s + 1e-9);
      }
    g_assert_cmpfloat (fabs (still->drag_loss_m_s - r->drag_loss_m_s), >, 1.0);
  }
}

/* After a transfer from a 200 km perigee the vehicle circularises at the
 * target: the orbit reported is the 400 km circle, in kilometres. */
static void
test_transfer_orbit_reported (void)
{
  g_autoptr (SwDesign) d = load (TWO_STAGE ("2100", "allowance", ", \"insertion_altitude_km\": 200"));
  g_autoptr (SwAscentResult) r = NULL;
  g_autoptr (GError) error = NULL;

  d->mission.altitude_km = 400.0;
  r = sw_ascent_fly_design (d, NULL, &error);
  g_assert_no_error (error);
  if (r->status != SW_ASCENT_REACHED)
    g_error ("transfer not reached: %s", r->reason);
  g_assert_cmpfloat_with_epsilon (r->perigee_km, 400.0, 0.05);
  g_assert_cmpfloat_with_epsilon (r->apogee_km, 400.0, 0.05);
}

/* Each firing stage's mass flow is its vacuum thrust over its exhaust
 * velocity, mdot = T_vac / (Isp_vac g0) (the definition of specific
 * impulse, g0 = 9.80665 m/s^2 exact), and its burn time is its propellant
 * load over that flow: 345 s and 220 kN give 65.03 kg/s for the upper
 * stage (computed). */
static void
test_stage_flow (void)
{
  g_autoptr (SwDesign) d = load (TWO_STAGE ("1600", "allowance", ""));
  g_autoptr (SwAscentResult) r = NULL;
  g_autoptr (GError) error = NULL;
  static const double isp[] = { 320.0, 345.0 }, thrust_kn[] = { 2100.0, 220.0 };

  r = sw_ascent_fly_design (d, NULL, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (r->n_stages, ==, 2);
  g_assert_cmpfloat_with_epsilon (r->stages[1].mass_flow_kg_s, 65.03, 0.005);
  for (guint i = 0; i < 2; i++)
    {
      const SwAscentStage *st = &r->stages[i];
      double mdot = thrust_kn[i] * 1000.0 / (isp[i] * 9.80665);

      g_assert_true (st->fires);
      g_assert_cmpfloat_with_epsilon (st->thrust_vac_n, thrust_kn[i] * 1000.0, 1e-6);
      g_assert_cmpfloat_with_epsilon (st->mass_flow_kg_s, mdot, 1e-9 * mdot);
      g_assert_cmpfloat_with_epsilon (st->burn_time_s,
                                      r->sizing.stages[i].propellant_mass_kg / mdot,
                                      1e-9 * st->burn_time_s);
    }
}

/* Sized with too small an allowance the vehicle falls short; the reason
 * names the target orbit's altitude in km and the missing delta-v. */
static void
test_shortfall_names_orbit (void)
{
  g_autoptr (SwDesign) d = load (TWO_STAGE ("1000", "allowance", ""));
  g_autoptr (SwAscentResult) r = NULL;
  g_autoptr (GError) error = NULL;
  g_autofree char *missing = NULL;

  r = sw_ascent_fly_design (d, NULL, &error);
  g_assert_no_error (error);
  g_assert_cmpint (r->status, ==, SW_ASCENT_SHORT);
  g_assert_nonnull (strstr (r->reason, "the 200 km orbit"));
  missing = g_strdup_printf ("by %.0f m/s", r->delta_v_missing_m_s);
  g_assert_nonnull (strstr (r->reason, missing));
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  /* A few seconds each normally (slower under sanitizers): 3 minutes in all. */
  alarm (180);
  g_test_add_func ("/core/ascent-checks/air-speed-with-rotation", test_air_speed_with_rotation);
  g_test_add_func ("/core/ascent-checks/transfer-orbit-reported", test_transfer_orbit_reported);
  g_test_add_func ("/core/ascent-checks/shortfall-names-orbit", test_shortfall_names_orbit);
  g_test_add_func ("/core/ascent-checks/stage-flow", test_stage_flow);
  return g_test_run ();
}
