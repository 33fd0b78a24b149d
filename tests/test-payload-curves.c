/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The payload curves of a vehicle that exists (sw-payload-curves.h), checked
 * against calculations written out here from the formulas: the budget from
 * WGS 84 (NIMA TR8350.2: a = 6,378,137 m, GM = 3.986004418e14 m^3/s^2,
 * omega = 7.292115e-5 rad/s) and spherical trigonometry (cos i = cos(lat)
 * sin(azimuth)), and the payload by bisection on the rocket equation summed
 * over the phases (Tsiolkovsky). */
#include "config.h"

#include "sw-analysis.h"
#include "sw-ascent.h"
#include "sw-payload-curves.h"
#include "sw-phases.h"

#include <math.h>
#include <string.h>

#define WGS84_A 6378137.0
#define WGS84_GM 3.986004418e14
#define WGS84_OMEGA 7.292115e-5
#define DEG (G_PI / 180.0)

static SwDesign *
demo (const char *basename)
{
  g_autoptr (GError) error = NULL;
  g_autofree char *path = g_build_filename (SOURCE_DESIGNS_DIR, basename, NULL);
  SwDesign *d = sw_design_load (path, NULL, &error);

  g_assert_no_error (error);
  return d;
}

/* Ideal delta-v of a circular orbit from the site, by hand. */
static double
hand_ideal (double altitude_km, double inclination_deg, double latitude_deg)
{
  double vc = sqrt (WGS84_GM / (WGS84_A + 1000.0 * altitude_km));
  double vs = WGS84_OMEGA * WGS84_A * cos (latitude_deg * DEG);
  /* At i = 180 - lat the quotient is -1 to rounding. */
  double az = asin (CLAMP (cos (inclination_deg * DEG) / cos (latitude_deg * DEG), -1.0, 1.0));

  return hypot (vc * sin (az) - vs, vc * cos (az));
}

/* The climb's share of a circular orbit's energy as a speed, by hand: the
 * specific orbital energy -GM/2r against -GM/a at rest on the surface
 * (energy equation, Curtis, Orbital Mechanics for Engineering Students,
 * ch. 2), less the orbital speed the budget already counts. */
static double
hand_climb (double altitude_km)
{
  double r = WGS84_A + 1000.0 * altitude_km;
  double energy = -WGS84_GM / (2.0 * r) + WGS84_GM / WGS84_A;

  return sqrt (2.0 * energy) - sqrt (WGS84_GM / r);
}

/* The vehicle's delta-v with @payload: c ln(m0 / mf) per stage, top down. */
static double
hand_delta_v (const SwDesign *d, double payload)
{
  double above = payload, dv = 0.0;

  for (int i = (int) d->n_stages - 1; i >= 0; i--)
    {
      const SwStage *st = &d->stages[i];
      double mp = st->propellant.propellant_kg;
      double ms = mp * st->structural_coefficient / (1.0 - st->structural_coefficient);
      double m0 = above + mp + ms, mf = above + ms;

      dv += st->isp_vac_s * 9.80665 * log (m0 / mf);
      above = m0;
      /* The fairing rides on the first stage and goes at the second
       * stage's ignition (the sizing's default jettison point). */
      if (i == 1 && d->ascent.has_fairing_mass)
        above += d->ascent.fairing_mass_kg;
    }
  return dv;
}

/* The payload at which hand_delta_v equals @dv: 200 halvings. */
static double
hand_payload (const SwDesign *d, double dv)
{
  double lo = 0.0, hi = 1.0e6;

  if (hand_delta_v (d, lo) < dv)
    return NAN;
  for (int k = 0; k < 200; k++)
    {
      double mid = 0.5 * (lo + hi);
      if (hand_delta_v (d, mid) >= dv)
        lo = mid;
      else
        hi = mid;
    }
  return lo;
}

static void
test_points_by_hand (void)
{
  g_autoptr (SwDesign) d = demo ("sallowmere-as-built.stagewright");
  const double alts[] = { 200.0, 400.0, 1000.0, 2000.0 };
  const double incs[] = { 35.0, 45.0, 98.0, 145.0 };
  double lat = d->mission.site_latitude_deg, losses = d->mission.losses_m_s;
  SwPayloadCurves c;

  g_assert_true (sw_payload_curves_compute (d, alts, 4, incs, 4, FALSE, NULL, &c));
  g_assert_true (c.applies);
  g_assert_cmpuint (c.altitude.n_points, ==, 4);
  g_assert_cmpuint (c.inclination.n_points, ==, 4);
  for (guint i = 0; i < 4; i++)
    {
      const SwPayloadPoint *p = &c.altitude.points[i];
      /* The design's allowance at its own 400 km, moved by the climb. */
      double moved = losses + hand_climb (alts[i]) - hand_climb (d->mission.altitude_km);
      double dv = hand_ideal (alts[i], d->mission.inclination_deg, lat) + moved;
      double want = hand_payload (d, dv);

      g_assert_cmpfloat (p->x, ==, alts[i]);
      g_assert_true (p->reachable);
      g_assert_cmpfloat (fabs (p->delta_v_m_s - dv), <, 1e-6);
      g_assert_cmpfloat (fabs (p->payload_kg - want), <, 1e-6 * want);
      g_assert_cmpfloat (fabs (p->losses_m_s - moved), <, 1e-9);
      g_assert_false (p->simulated);
      /* Higher costs payload, as it does for every vehicle. */
      if (i > 0)
        g_assert_cmpfloat (p->payload_kg, <, c.altitude.points[i - 1].payload_kg);
    }
  /* The energy of the climb to 400 km is about 467 m/s more than the
   * orbital speed alone (sqrt(2 mu/a - mu/r) - sqrt(mu/r) at r = a + 400 km;
   * a hand figure). */
  g_assert_cmpfloat (fabs (sw_payload_climb_m_s (400.0) - hand_climb (400.0)), <, 1e-9);
  g_assert_cmpfloat (sw_payload_climb_m_s (400.0), >, 460.0);
  g_assert_cmpfloat (sw_payload_climb_m_s (400.0), <, 470.0);
  for (guint i = 0; i < 4; i++)
    {
      const SwPayloadPoint *p = &c.inclination.points[i];
      double dv = hand_ideal (d->mission.altitude_km, incs[i], lat) + losses;
      double want = hand_payload (d, dv);

      g_assert_true (p->reachable);
      g_assert_cmpfloat (fabs (p->payload_kg - want), <, 1e-6 * want);
    }
  /* Retrograde costs payload: the site's speed is lost, not gained. */
  g_assert_cmpfloat (c.inclination.points[3].payload_kg, <, c.inclination.points[0].payload_kg);
  /* The design's own orbit is on the curves: 400 km and 45 deg. */
  {
    g_autoptr (SwAnalysis) a = sw_analysis_compute (d, 1, NULL);
    g_assert_true (a->has_performance && a->performance.reachable);
    g_assert_cmpfloat (fabs (a->performance.payload_kg - c.altitude.points[1].payload_kg), <,
                       1e-6 * a->performance.payload_kg);
    g_assert_cmpfloat (fabs (a->performance.payload_kg - c.inclination.points[1].payload_kg), <,
                       1e-6 * a->performance.payload_kg);
    g_assert_true (a->payload_curves.applies);
    g_assert_cmpuint (a->payload_curves.altitude.n_points, ==, 19);
  }
}

/* An inclination below the site's latitude cannot be reached directly: a
 * point with a reason, not an error; and a vehicle far short is a point
 * with the reason "even with no payload". */
static void
test_unreachable_points (void)
{
  g_autoptr (SwDesign) d = demo ("sallowmere-as-built.stagewright");
  const double incs[] = { 20.0 };
  const double alts[] = { 400.0 };
  SwPayloadCurves c;

  g_assert_true (sw_payload_curves_compute (d, alts, 1, incs, 1, FALSE, NULL, &c));
  g_assert_false (c.inclination.points[0].reachable);
  g_assert_true (isnan (c.inclination.points[0].payload_kg));
  g_assert_nonnull (strstr (c.inclination.points[0].reason, "latitude"));

  d->mission.losses_m_s = 4900.0;
  g_assert_true (sw_payload_curves_compute (d, alts, 1, incs, 1, FALSE, NULL, &c));
  g_assert_false (c.altitude.points[0].reachable);
  g_assert_nonnull (strstr (c.altitude.points[0].reason, "even with no payload"));
  {
    g_autoptr (SwAnalysis) a = sw_analysis_compute (d, 1, NULL);
    g_assert_true (a->ok && a->has_performance);
    g_assert_false (a->performance.reachable);
    g_assert_nonnull (strstr (a->performance.reason, "even with no payload"));
  }
}

/* The analysis's capability against a bisection on the sizing: the largest
 * payload the fixed vehicle is feasible with. */
static void
test_capability_bisection (void)
{
  g_autoptr (SwDesign) d = demo ("sallowmere-as-built.stagewright");
  g_autoptr (SwAnalysis) a = sw_analysis_compute (d, 1, NULL);
  g_autoptr (SwDesign) probe = sw_design_copy (d);
  double lo = 0.0, hi = 1.0e5;

  for (int k = 0; k < 80; k++)
    {
      SwSizing s;
      probe->payload_kg = 0.5 * (lo + hi);
      g_assert_true (sw_size_design (probe, &s, NULL));
      if (s.feasible)
        lo = probe->payload_kg;
      else
        hi = probe->payload_kg;
    }
  g_assert_true (a->has_performance);
  g_assert_cmpfloat (fabs (a->performance.payload_kg - lo), <, 1e-6 * lo);
  /* The demo asks for less than it carries (its notes say so). */
  g_assert_cmpfloat (a->performance.payload_kg, >, d->payload_kg);
}

/* Curves only for a vehicle that exists, on an orbit mission; otherwise the
 * note says why. */
static void
test_not_applicable (void)
{
  g_autoptr (SwDesign) mixed = demo ("sallowmere-kestrune-upper-stage.stagewright");
  g_autoptr (SwDesign) dv = demo ("sallowmere-as-built.stagewright");
  g_autoptr (SwAnalysis) a = NULL;
  SwPayloadCurves c;

  g_assert_true (sw_payload_curves_compute (mixed, NULL, 0, NULL, 0, FALSE, NULL, &c));
  g_assert_false (c.applies);
  g_assert_nonnull (strstr (c.note, "stage 1 (Sallowmere first stage)"));
  a = sw_analysis_compute (mixed, 1, NULL);
  g_assert_false (a->has_performance);
  g_assert_nonnull (strstr (a->performance_error, "stages[0].propellant_kg"));

  dv->mission.kind = SW_MISSION_DELTA_V;
  dv->mission.delta_v_m_s = 9000.0;
  g_assert_true (sw_payload_curves_compute (dv, NULL, 0, NULL, 0, FALSE, NULL, &c));
  g_assert_false (c.applies);
  g_assert_nonnull (strstr (c.note, "delta-v directly"));
}

/* Grid values outside the limits table are refused naming the option. */
static void
test_grid_check (void)
{
  const double low[] = { 200.0, 50.0 };
  const double wide[] = { 181.0 };
  g_autoptr (GError) e1 = NULL;
  g_autoptr (GError) e2 = NULL;

  g_assert_true (sw_payload_check_grid (TRUE, low, 1, "--altitudes", NULL));
  g_assert_false (sw_payload_check_grid (TRUE, low, 2, "--altitudes", &e1));
  g_assert_nonnull (strstr (e1->message, "--altitudes"));
  g_assert_nonnull (strstr (e1->message, "50"));
  g_assert_false (sw_payload_check_grid (FALSE, wide, 1, "--inclinations", &e2));
  g_assert_nonnull (strstr (e2->message, "--inclinations"));
}

/* With the ascent flown: the losses of a point are those of an ascent flown
 * (separately, here) with the point's payload, within the loop's 1 m/s,
 * and the payload is the one the rocket equation gives at those losses. */
static void
test_simulated_point (void)
{
  g_autoptr (SwDesign) d = demo ("sallowmere-as-built.stagewright");
  g_autoptr (SwAscentResult) res = NULL;
  g_autoptr (SwDesign) flown = NULL;
  SwAscentOptions o;
  SwPayloadPoint p;
  double want;

  sw_payload_point_compute (d, 600.0, d->mission.inclination_deg, TRUE, NULL, &p);
  g_assert_true (p.simulated);
  g_assert_true (p.reachable);
  want = hand_payload (d, hand_ideal (600.0, d->mission.inclination_deg,
                                      d->mission.site_latitude_deg) + p.losses_m_s);
  g_assert_cmpfloat (fabs (p.payload_kg - want), <, 1e-6 * want);

  flown = sw_design_copy (d);
  flown->mission.altitude_km = 600.0;
  flown->payload_kg = p.payload_kg * (1.0 - 1e-9);
  sw_ascent_options_init (&o);
  o.record = FALSE;
  res = sw_ascent_solve (flown, &o, NULL, NULL);
  g_assert_nonnull (res);
  g_assert_cmpfloat (fabs (res->losses_m_s - p.losses_m_s), <, 5.0);
  /* Climbing 200 km more costs more than the allowance says (a rule of
   * the model: the budget has no climb, the flight does). */
  g_assert_cmpfloat (p.losses_m_s, >, d->mission.losses_m_s);
}

/* A "loss_model": "simulate" vehicle that exists: after the closed loop,
 * the capability is the one at the loop's losses (by hand), not at the
 * first guess, and the curves say so. */
static void
test_closed_loop_losses (void)
{
  g_autoptr (SwDesign) d = demo ("sallowmere-as-built.stagewright");
  g_autoptr (SwAnalysis) a = NULL;
  SwAnalysisOptions o;
  double want;

  d->mission.loss_model = SW_LOSS_SIMULATE;
  d->mission.losses_m_s = 1800.0;
  sw_analysis_options_init (&o);
  o.montecarlo = FALSE;
  a = sw_analysis_run (d, &o, NULL);
  g_assert_nonnull (a->ascent);
  g_assert_true (a->sized_by_ascent);
  want = hand_payload (d, hand_ideal (400.0, 45.0, 35.0) + a->ascent->loop_sized_losses_m_s);
  g_assert_true (a->performance.reachable);
  g_assert_cmpfloat (fabs (a->performance.payload_kg - want), <, 1e-6 * want);
  /* Well below what the first guess of 1,800 m/s would promise. */
  g_assert_cmpfloat (a->performance.payload_kg, <,
                     hand_payload (d, hand_ideal (400.0, 45.0, 35.0) + 1800.0) - 300.0);
  g_assert_nonnull (strstr (a->payload_curves.note, "closed loop"));
  g_assert_cmpfloat (fabs (a->payload_curves.altitude.points[2].payload_kg - want), <,
                     1e-6 * want);
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/payload-curves/points-by-hand", test_points_by_hand);
  g_test_add_func ("/payload-curves/unreachable-points", test_unreachable_points);
  g_test_add_func ("/payload-curves/capability-bisection", test_capability_bisection);
  g_test_add_func ("/payload-curves/not-applicable", test_not_applicable);
  g_test_add_func ("/payload-curves/grid-check", test_grid_check);
  g_test_add_func ("/payload-curves/simulated-point", test_simulated_point);
  g_test_add_func ("/payload-curves/closed-loop-losses", test_closed_loop_losses);
  return g_test_run ();
}
