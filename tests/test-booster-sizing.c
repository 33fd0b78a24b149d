/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Tests of sw-booster-sizing: the phases of a vehicle with strap-on boosters
 * against a hand calculation from the formulas of the reference notes
 * (shared/reference-values.md, "Parallel staging": NPTEL "Space
 * Technology", module 3, lecture 4, and Sutton and Biblarz, multiple
 * parallel propulsion; the crossfeed rule is the notes' own derivation); the
 * sized optimum against a brute-force grid; the machinery without boosters
 * against the exact Lagrange optimum (Curtis, Orbital Mechanics for
 * Engineering Students, sec. 11.6, as sw_size computes it); zero boosters
 * against no key. */
#include "config.h"

#include "sw-booster-sizing.h"
#include "sw-design.h"
#include "sw-design-fields.h"
#include "sw-phases.h"
#include "sw-sizing.h"
#include "sw-stage-thrust.h"

#include <math.h>
#include <string.h>

static void
assert_rel (double got, double want, double rel)
{
  if (!(fabs (got - want) <= rel * fabs (want)))
    g_error ("got %.12g, want %.12g within %g relative", got, want, rel);
}

/* Three stages (core + two upper), orbit-class delta-v, two boosters. */
static SwDesign *
booster_design (guint count, gboolean crossfeed)
{
  SwDesign *d = sw_design_new ();
  static const double isp[] = { 300.0, 340.0, 350.0 };
  static const double eps[] = { 0.08, 0.10, 0.12 };

  g_strlcpy (d->name, "test", sizeof d->name);
  d->payload_kg = 5000.0;
  d->mission.kind = SW_MISSION_DELTA_V;
  d->mission.delta_v_m_s = 9500.0;
  d->split = SW_SPLIT_OPTIMAL;
  d->n_stages = 3;
  for (guint i = 0; i < 3; i++)
    {
      sw_stage_init_default (&d->stages[i], i);
      d->stages[i].isp_vac_s = isp[i];
      d->stages[i].has_isp_sl = FALSE;
      d->stages[i].isp_sl_s = 0.0;
      d->stages[i].structural_coefficient = eps[i];
    }
  d->stages[0].propulsion.present = TRUE;
  d->stages[0].propulsion.has_thrust = TRUE;
  d->stages[0].propulsion.thrust_vac_kn = 3000.0;
  d->boosters.count = count;
  if (count > 0)
    {
      sw_boosters_init_default (&d->boosters);
      d->boosters.isp_vac_s = 275.0;
      d->boosters.structural_coefficient = 0.11;
      d->boosters.thrust_vac_kn = 2000.0;
      d->boosters.crossfeed = crossfeed;
    }
  g_assert_true (sw_design_validate (d, NULL, NULL));
  return d;
}

/* Every load fixed: @pb per booster, the three stages' loads. */
static void
fix_loads (SwDesign *d, double pb, double p1, double p2, double p3)
{
  const double p[] = { p1, p2, p3 };

  d->boosters.propellant.has_propellant_kg = TRUE;
  d->boosters.propellant.propellant_kg = pb;
  for (guint i = 0; i < G_N_ELEMENTS (p); i++)
    {
      d->stages[i].propellant.has_propellant_kg = TRUE;
      d->stages[i].propellant.propellant_kg = p[i];
    }
}

/* Every load fixed: the phases against the reference formulas written out
 * here once more. */
static void
check_fixed_hand (gboolean crossfeed)
{
  g_autoptr (SwDesign) d = booster_design (2, crossfeed);
  const double g0 = 9.80665;
  const double pb = 40000.0, p1 = 150000.0, p2 = 30000.0, p3 = 6000.0;
  double sb = pb * 0.11 / 0.89, s1 = p1 * 0.08 / 0.92, s2 = p2 * 0.10 / 0.90;
  double s3 = p3 * 0.12 / 0.88;
  double cb = 275.0 * g0, c1 = 300.0 * g0, c2 = 340.0 * g0, c3 = 350.0 * g0;
  double fb = 2.0e6, f1 = 3.0e6;
  double mdotb = fb / cb, mdot1 = f1 / c1;
  double c_mix = (f1 + 2 * fb) / (mdot1 + 2 * mdotb);
  double m_up2 = 5000.0 + p3 + s3;             /* above stage 2 */
  double m_up = m_up2 + p2 + s2;               /* above the core */
  double m0 = m_up + p1 + s1 + 2 * (pb + sb);
  double tb, q, dv0, dv1, dv2, dv3, m1, total;
  SwSizing sz;
  SwPhase phases[SW_MAX_PHASES];
  guint n;

  if (crossfeed)
    {
      tb = 2 * pb / (2 * mdotb + mdot1);        /* phase 0 lasts M_b,prop / (mdot_b + mdot_core) */
      q = 0.0;                                  /* the core starts its own phase full */
    }
  else
    {
      tb = pb / mdotb;                          /* booster burn time */
      q = mdot1 * tb;                           /* core propellant burnt in phase 0 */
    }
  dv0 = c_mix * log (m0 / (m0 - 2 * pb - q));
  m1 = m0 - 2 * pb - q - 2 * sb;
  dv1 = c1 * log (m1 / (m1 - (p1 - q)));
  dv2 = c2 * log ((m_up) / (m_up - p2));
  dv3 = c3 * log ((m_up2) / (m_up2 - p3));
  total = dv0 + dv1 + dv2 + dv3;

  fix_loads (d, pb, p1, p2, p3);
  /* Just within reach: the required delta-v 10 m/s below what it gives. */
  d->mission.delta_v_m_s = floor (total) - 10.0;
  g_assert_true (sw_size_design (d, &sz, NULL));
  g_assert_true (sz.feasible);
  assert_rel (sz.liftoff_mass_kg, m0, 1e-12);
  assert_rel (sz.boosters.mixed_exhaust_velocity_m_s, c_mix, 1e-12);
  /* The mass flows the working shows: F / c of each. */
  assert_rel (sz.boosters.mass_flow_kg_s, mdotb, 1e-12);
  assert_rel (sz.boosters.core_mass_flow_kg_s, mdot1, 1e-12);
  assert_rel (sz.boosters.core_thrust_vac_n, f1, 1e-12);
  assert_rel (sz.boosters.phase_delta_v_m_s, dv0, 1e-12);
  assert_rel (sz.boosters.phase_duration_s, tb, 1e-12);
  assert_rel (sz.boosters.core_phase_delta_v_m_s, dv1, 1e-12);
  assert_rel (sz.stages[1].delta_v_m_s, dv2, 1e-9);
  assert_rel (sz.stages[2].delta_v_m_s, dv3, 1e-9);
  assert_rel (sz.boosters.total_mass_kg, 2 * (pb + sb), 1e-12);
  n = sw_sizing_phases (d, &sz, phases);
  g_assert_cmpuint (n, ==, 4);
  g_assert_true (phases[0].boosters);
  g_assert_false (phases[1].boosters);
  assert_rel (phases[0].delta_v_m_s, dv0, 1e-12);
  assert_rel (phases[0].initial_mass_kg, m0, 1e-12);
  assert_rel (phases[0].final_mass_kg, m0 - 2 * pb - q, 1e-12);
  assert_rel (phases[1].initial_mass_kg, m1, 1e-12);
  assert_rel (phases[1].delta_v_m_s, dv1, 1e-12);
  assert_rel (phases[1].duration_s, (p1 - q) / mdot1, 1e-12);
  assert_rel (phases[2].delta_v_m_s, dv2, 1e-9);
  assert_rel (phases[3].delta_v_m_s, dv3, 1e-9);
  /* The stages' limit with no payload: the same formulas with the payload
   * taken off (every load fixed, so each stage gives its own loads' delta-v,
   * not c ln(1/eps)); the headroom is that less the requirement, and what
   * the vehicle gives with its payload is the total above. */
  {
    double e_up2 = p3 + s3, e_up = e_up2 + p2 + s2;
    double e0 = e_up + p1 + s1 + 2 * (pb + sb);
    double e1 = e0 - 2 * pb - q - 2 * sb;
    double l3 = c3 * log (e_up2 / s3);          /* = c3 ln(1/eps3): nothing above it */
    double l2 = c2 * log (e_up / (e_up - p2));
    double l1 = c_mix * log (e0 / (e0 - 2 * pb - q)) + c1 * log (e1 / (e1 - (p1 - q)));

    assert_rel (l3, c3 * log (1.0 / 0.12), 1e-12);
    assert_rel (sz.stages[2].delta_v_limit_m_s, l3, 1e-9);
    assert_rel (sz.stages[1].delta_v_limit_m_s, l2, 1e-9);
    assert_rel (sz.stages[0].delta_v_limit_m_s, l1, 1e-12);
    assert_rel (sz.delta_v_limit_m_s, l1 + l2 + l3, 1e-9);
    assert_rel (sz.margin_m_s, l1 + l2 + l3 - d->mission.delta_v_m_s, 1e-9);
    assert_rel (sz.delta_v_given_m_s, total, 1e-9);
  }
  /* The vehicle does not reach 20 m/s more than it gives: an answer with a reason. */
  d->mission.delta_v_m_s = ceil (total) + 20.0;
  g_assert_true (sw_size_design (d, &sz, NULL));
  g_assert_false (sz.feasible);
  g_assert_nonnull (strstr (sz.reason, "short of"));
}

/* A fairing on the vehicle with boosters, by hand: dropped above the core
 * (the default, at the second stage's ignition) it is mass on the core and
 * the boosters; dropped during the core's flight (where a flown ascent says)
 * it is carried until that fraction of the core's whole mass loss (boosters
 * included) is gone, the burn in two parts around the drop.  Rocket
 * equation per part (any rocket propulsion text, e.g. Sutton, Rocket
 * Propulsion Elements, ch. 4; from memory). */
static void
test_fairing_hand (void)
{
  g_autoptr (SwDesign) d = booster_design (2, FALSE);
  const double g0 = 9.80665, F = 1200.0;
  const double pb = 40000.0, p1 = 150000.0, p2 = 30000.0, p3 = 6000.0;
  double sb = pb * 0.11 / 0.89, s1 = p1 * 0.08 / 0.92, s2 = p2 * 0.10 / 0.90;
  double s3 = p3 * 0.12 / 0.88;
  double cb = 275.0 * g0, c1 = 300.0 * g0, c2 = 340.0 * g0;
  double fb = 2.0e6, f1 = 3.0e6;
  double mdotb = fb / cb, mdot1 = f1 / c1;
  double c_mix = (f1 + 2 * fb) / (mdot1 + 2 * mdotb);
  double m_up2 = 5000.0 + p3 + s3, m_up = m_up2 + p2 + s2;
  double tb = pb / mdotb, q = mdot1 * tb;
  SwSizing sz;

  fix_loads (d, pb, p1, p2, p3);
  d->ascent.present = TRUE;
  d->ascent.has_fairing_mass = TRUE;
  d->ascent.fairing_mass_kg = F;
  d->ascent.has_fairing_altitude = TRUE;
  d->ascent.fairing_jettison_altitude_km = 110.0;
  d->mission.delta_v_m_s = 1000.0;
  {
    g_autoptr (GError) error = NULL;
    if (!sw_design_validate (d, NULL, &error))
      g_error ("%s", error->message);
  }

  /* Default: dropped at the second stage's ignition. */
  {
    double m0 = m_up + F + p1 + s1 + 2 * (pb + sb);
    double dv0 = c_mix * log (m0 / (m0 - 2 * pb - q));
    double m1 = m0 - 2 * pb - q - 2 * sb;
    double dv1 = c1 * log (m1 / (m1 - (p1 - q)));
    /* Stage 2 drops it at ignition: its delta-v is over the mass without it. */
    double dv2 = c2 * log (m_up / (m_up - p2));

    g_assert_true (sw_size_design (d, &sz, NULL));
    g_assert_true (sz.feasible);
    assert_rel (sz.liftoff_mass_kg, m0, 1e-12);
    assert_rel (sz.boosters.phase_delta_v_m_s, dv0, 1e-12);
    assert_rel (sz.boosters.core_phase_delta_v_m_s, dv1, 1e-12);
    assert_rel (sz.stages[1].delta_v_m_s, dv2, 1e-9);
  }
  /* Dropped during the core's own phase, after 80 % of the core's whole
   * mass loss. */
  {
    double loss = p1 + 2 * (pb + sb), lj = 0.8 * loss;
    double m0 = m_up + F + p1 + s1 + 2 * (pb + sb);      /* with the fairing */
    double burnt0 = 2 * pb + q, b = lj - burnt0 - 2 * sb; /* core propellant burnt with it */
    double dv0 = c_mix * log (m0 / (m0 - burnt0));
    double m1 = m0 - F - burnt0 - 2 * sb;                 /* without it */
    double dv1 = c1 * (log ((m1 + F) / (m1 + F - b)) + log ((m1 - b) / (m1 - (p1 - q))));

    g_assert_cmpfloat (b, >, 0.0);
    d->ascent.has_flown_fairing = TRUE;
    d->ascent.flown_fairing_stage = 0;
    d->ascent.flown_fairing_fraction = 0.8;
    g_assert_true (sw_size_design (d, &sz, NULL));
    g_assert_true (sz.feasible);
    assert_rel (sz.liftoff_mass_kg, m0, 1e-12);
    assert_rel (sz.boosters.phase_delta_v_m_s, dv0, 1e-12);
    assert_rel (sz.boosters.core_phase_delta_v_m_s, dv1, 1e-12);
    /* The phases as the tables print them: the vehicle's masses with the
     * fairing while it is on, the drop inside the core's phase. */
    {
      SwPhase ph[SW_MAX_PHASES];
      guint np = sw_sizing_phases (d, &sz, ph);
      g_assert_cmpuint (np, ==, 4);
      assert_rel (ph[0].final_mass_kg, m0 - burnt0, 1e-12);
      g_assert_true (isnan (ph[0].fairing_drop_mass_kg));
      assert_rel (ph[1].initial_mass_kg, m1 + F, 1e-12);
      assert_rel (ph[1].fairing_drop_mass_kg, m1 + F - b, 1e-12);
      assert_rel (ph[1].delta_v_m_s,
                  c1 * (log (ph[1].initial_mass_kg / ph[1].fairing_drop_mass_kg)
                        + log ((ph[1].fairing_drop_mass_kg - F) / ph[1].final_mass_kg)), 1e-12);
    }
    assert_rel (sz.stages[1].delta_v_m_s, c2 * log (m_up / (m_up - p2)), 1e-9);
  }
  /* Dropped in phase 0, after 10 % of that loss. */
  {
    double loss = p1 + 2 * (pb + sb), lj = 0.1 * loss;
    double m0 = m_up + F + p1 + s1 + 2 * (pb + sb);
    double burnt0 = 2 * pb + q;
    double dv0 = c_mix * (log (m0 / (m0 - lj)) + log ((m0 - F - lj) / (m0 - F - burnt0)));
    double m1 = m0 - F - burnt0 - 2 * sb;
    double dv1 = c1 * log (m1 / (m1 - (p1 - q)));

    g_assert_cmpfloat (lj, <, burnt0);
    d->ascent.flown_fairing_fraction = 0.1;
    g_assert_true (sw_size_design (d, &sz, NULL));
    g_assert_true (sz.feasible);
    assert_rel (sz.liftoff_mass_kg, m0, 1e-12);
    assert_rel (sz.boosters.phase_delta_v_m_s, dv0, 1e-12);
    assert_rel (sz.boosters.core_phase_delta_v_m_s, dv1, 1e-12);
  }
}

static void
test_fixed_hand (void)
{
  check_fixed_hand (FALSE);
}

static void
test_fixed_hand_crossfeed (void)
{
  check_fixed_hand (TRUE);
}

/* The core's load that gives @dv with the other loads: bisection on the
 * rocket equation of sw_parallel_liftoff_mass (monotone in the core's load
 * for these vehicles).  NAN when none does. */
static double
core_for (const SwParallelVehicle *v, double payload, double pb, double d_up, double dv)
{
  double lo = 0.0, hi = 1e8, got;

  /* The smallest core load the boosters allow (it must outlast them). */
  if (v->count > 0 && !v->crossfeed)
    lo = v->core_thrust_n / v->set.exhaust_velocity_m_s[0]
         * (pb * v->booster_exhaust_velocity_m_s / v->booster_thrust_n);
  if (!isfinite (sw_parallel_liftoff_mass (v, payload, pb, lo, d_up, &got)) || got >= dv)
    return NAN;
  if (!isfinite (sw_parallel_liftoff_mass (v, payload, pb, hi, d_up, &got)) || got < dv)
    return NAN;
  for (int i = 0; i < 200; i++)
    {
      double mid = 0.5 * (lo + hi);
      sw_parallel_liftoff_mass (v, payload, pb, mid, d_up, &got);
      if (got < dv)
        lo = mid;
      else
        hi = mid;
    }
  return 0.5 * (lo + hi);
}

/* Sized boosters: the minimiser's liftoff mass against a brute-force grid
 * over the boosters' load and the upper stages' delta-v (the core from a
 * bisection): never above the grid's best, and close to it. */
static void
check_grid (gboolean crossfeed)
{
  g_autoptr (SwDesign) d = booster_design (2, crossfeed);
  SwParallelVehicle v;
  SwSizing sz;
  double best = HUGE_VAL, best_pb = NAN, best_dup = NAN;
  const guint n = 80;

  g_assert_true (sw_size_design (d, &sz, NULL));
  g_assert_true (sz.feasible);
  g_assert_true (sz.boosters.present);
  g_assert_false (sz.boosters.fixed);
  g_assert_true (sw_parallel_vehicle_from_design (&v, d, NULL));
  for (guint i = 1; i <= n; i++)
    for (guint j = 1; j <= n; j++)
      {
        double pb = 40000.0 * i / n;   /* a fixed range, not centred on the answer */
        double dup = 9500.0 * j / (n + 1);
        double p1 = core_for (&v, 5000.0, pb, dup, 9500.0);
        double m = isfinite (p1) ? sw_parallel_liftoff_mass (&v, 5000.0, pb, p1, dup, NULL) : NAN;
        if (isfinite (m) && m < best)
          {
            best = m;
            best_pb = pb;
            best_dup = dup;
          }
      }
  g_test_message ("optimum %.3f kg (boosters %.1f kg each), grid %.3f kg at %.1f kg, %.1f m/s",
                  sz.liftoff_mass_kg, sz.boosters.propellant_mass_kg, best, best_pb, best_dup);
  g_assert_true (isfinite (best));
  g_assert_cmpfloat (sz.liftoff_mass_kg, <=, best * (1.0 + 1e-9));
  g_assert_cmpfloat (sz.liftoff_mass_kg, >=, best * (1.0 - 2e-3));
  /* The answer's phases add up to the mission's delta-v. */
  {
    SwPhase phases[SW_MAX_PHASES];
    guint np = sw_sizing_phases (d, &sz, phases);
    double sum = 0.0;
    g_assert_cmpuint (np, ==, 4);
    for (guint k = 0; k < np; k++)
      sum += phases[k].delta_v_m_s;
    assert_rel (sum, 9500.0, 1e-9);
  }
}

/* The upper stages' delta-v that makes up @dv with the core's load @p1 and
 * the boosters' @pb: bisection on sw_parallel_liftoff_mass (the vehicle's
 * delta-v rises with the upper stages' share).  NAN when none does. */
static double
upper_for (const SwParallelVehicle *v, double payload, double pb, double p1, double dv)
{
  double lo = 1e-6, hi = dv, got;

  if (!isfinite (sw_parallel_liftoff_mass (v, payload, pb, p1, hi, &got)) || got < dv)
    return NAN;
  if (isfinite (sw_parallel_liftoff_mass (v, payload, pb, p1, lo, &got)) && got >= dv)
    return lo;
  for (int i = 0; i < 200; i++)
    {
      double mid = 0.5 * (lo + hi);
      if (!isfinite (sw_parallel_liftoff_mass (v, payload, pb, p1, mid, &got)) || got < dv)
        lo = mid;
      else
        hi = mid;
    }
  return hi;
}

/* Sized boosters on a fixed core: the booster load of least liftoff mass
 * against a brute-force scan of the load (the upper stages' delta-v from a
 * bisection for each); with the upper stages fixed too, the least load that
 * gives the delta-v, against a bisection. */
static void
test_fixed_core_sized_boosters (void)
{
  g_autoptr (SwDesign) d = booster_design (2, FALSE);
  SwParallelVehicle v;
  SwSizing sz;
  double best = HUGE_VAL, best_pb = NAN;
  const guint n = 400;

  d->stages[0].propellant.has_propellant_kg = TRUE;
  d->stages[0].propellant.propellant_kg = 90000.0;
  g_assert_true (sw_design_validate (d, NULL, NULL));
  g_assert_true (sw_size_design (d, &sz, NULL));
  g_assert_true (sz.feasible);
  g_assert_false (sz.boosters.fixed);
  assert_rel (sz.stages[0].propellant_mass_kg, 90000.0, 1e-12);
  g_assert_true (sw_parallel_vehicle_from_design (&v, d, NULL));
  for (guint i = 1; i <= n; i++)
    {
      double pb = 60000.0 * i / n;   /* a fixed range, not centred on the answer */
      double dup = upper_for (&v, 5000.0, pb, 90000.0, 9500.0);
      double m = isfinite (dup) ? sw_parallel_liftoff_mass (&v, 5000.0, pb, 90000.0, dup, NULL)
                                : NAN;
      if (isfinite (m) && m < best)
        {
          best = m;
          best_pb = pb;
        }
    }
  g_test_message ("fixed core: optimum %.3f kg (boosters %.1f kg each), scan %.3f kg at %.1f kg",
                  sz.liftoff_mass_kg, sz.boosters.propellant_mass_kg, best, best_pb);
  /* The core's delta-v limit with no payload is the most the fixed core and
   * sized boosters give with nothing above (the sized upper stages empty):
   * against a brute-force scan of the booster load (the core must outlast
   * the boosters, so the scan stops where no vehicle exists); the upper
   * stages add their c ln(1/eps). */
  {
    double most = -HUGE_VAL;
    for (guint i = 1; i <= 4000; i++)
      {
        double dv, pb = 200000.0 * i / 4000;
        double m = sw_parallel_liftoff_mass (&v, 1e-9, pb, 90000.0, 1e-9, &dv);
        if (isfinite (m))
          most = MAX (most, dv - 1e-9);
      }
    g_test_message ("core limit %.3f m/s, scan %.3f m/s", sz.stages[0].delta_v_limit_m_s, most);
    g_assert_cmpfloat (sz.stages[0].delta_v_limit_m_s, >=, most - 1e-6);
    g_assert_cmpfloat (sz.stages[0].delta_v_limit_m_s, <=, most + 0.5);
    assert_rel (sz.delta_v_limit_m_s, sz.stages[0].delta_v_limit_m_s
                                      + 340.0 * SW_G0 * log (1.0 / 0.10)
                                      + 350.0 * SW_G0 * log (1.0 / 0.12), 1e-12);
    assert_rel (sz.margin_m_s, sz.delta_v_limit_m_s - 9500.0, 1e-12);
  }
  g_assert_true (isfinite (best));
  g_assert_cmpfloat (sz.liftoff_mass_kg, <=, best * (1.0 + 1e-9));
  g_assert_cmpfloat (sz.liftoff_mass_kg, >=, best * (1.0 - 1e-3));
  {
    SwPhase phases[SW_MAX_PHASES];
    guint np = sw_sizing_phases (d, &sz, phases);
    double sum = 0.0;
    for (guint k = 0; k < np; k++)
      sum += phases[k].delta_v_m_s;
    assert_rel (sum, 9500.0, 1e-9);
  }

  /* Every stage fixed, the boosters sized: the least booster load that
   * gives the delta-v (the mission asks 300 m/s more than the vehicle
   * gives with 10 kg boosters). */
  {
    double lo = NAN, hi = NAN, got, need, pb;
    d->stages[1].propellant.has_propellant_kg = TRUE;
    d->stages[1].propellant.propellant_kg = 30000.0;
    d->stages[2].propellant.has_propellant_kg = TRUE;
    d->stages[2].propellant.propellant_kg = 8000.0;
    g_assert_true (sw_parallel_vehicle_from_design (&v, d, NULL));
    g_assert_true (isfinite (sw_parallel_liftoff_mass (&v, 5000.0, 10.0, 90000.0, 0.0, &got)));
    need = got + 300.0;
    d->mission.delta_v_m_s = need;
    g_assert_true (sw_design_validate (d, NULL, NULL));
    g_assert_true (sw_size_design (d, &sz, NULL));
    g_assert_true (sz.feasible);
    /* An upward scan in 10 kg steps for the first load that is enough,
     * then bisection. */
    for (pb = 10.0; pb < 1e6; pb += 10.0)
      {
        if (isfinite (sw_parallel_liftoff_mass (&v, 5000.0, pb, 90000.0, 0.0, &got))
            && got >= need)
          {
            hi = pb;
            lo = pb - 10.0;
            break;
          }
      }
    g_assert_true (isfinite (hi));
    for (int i = 0; i < 200; i++)
      {
        double mid = 0.5 * (lo + hi);
        if (!isfinite (sw_parallel_liftoff_mass (&v, 5000.0, mid, 90000.0, 0.0, &got))
            || got < need)
          lo = mid;
        else
          hi = mid;
      }
    g_test_message ("all stages fixed: boosters %.3f kg each, bisection %.3f kg",
                    sz.boosters.propellant_mass_kg, hi);
    assert_rel (sz.boosters.propellant_mass_kg, hi, 1e-8);
    /* Asked for more than the core can carry the boosters to: a reason. */
    d->mission.delta_v_m_s = 20000.0;
    g_assert_true (sw_size_design (d, &sz, NULL));
    g_assert_false (sz.feasible);
    g_assert_nonnull (strstr (sz.reason, "no load of the boosters"));
  }
}

/* The equal and manual splits with boosters, with and without a fixed
 * stage among the sized ones: the sized stages' delta-v (the core's counting
 * phase 0) in the split's proportions, the phases adding up to the mission
 * (the definitions of the splits, sw-sizing.h). */
static void
test_splits_with_fixed (void)
{
  for (guint k = 0; k < 4; k++)
    {
      g_autoptr (SwDesign) d = booster_design (2, FALSE);
      gboolean manual = k % 2 == 1, fixed = k >= 2;
      SwSizing sz;
      SwPhase phases[SW_MAX_PHASES];
      double sum = 0.0, w[3] = { 1.0, 1.0, 1.0 };
      guint np;

      d->boosters.propellant.has_propellant_kg = TRUE;
      d->boosters.propellant.propellant_kg = 20000.0;
      d->split = manual ? SW_SPLIT_MANUAL : SW_SPLIT_EQUAL;
      if (manual)
        {
          d->stages[0].delta_v_share = w[0] = 0.5;
          d->stages[1].delta_v_share = w[1] = 0.3;
          d->stages[2].delta_v_share = w[2] = 0.2;
          for (guint i = 0; i < 3; i++)
            d->stages[i].has_share = TRUE;
        }
      if (fixed)
        {
          d->stages[1].propellant.has_propellant_kg = TRUE;
          d->stages[1].propellant.propellant_kg = 25000.0;
          /* The manual shares add up to 1 over the sized stages. */
          if (manual)
            {
              d->stages[0].delta_v_share = w[0] = 0.7;
              d->stages[1].delta_v_share = w[1] = 0.0;
              d->stages[2].delta_v_share = w[2] = 0.3;
            }
        }
      {
        g_autoptr (GError) error = NULL;
        if (!sw_design_validate (d, NULL, &error))
          g_error ("%s", error->message);
      }
      g_assert_true (sw_size_design (d, &sz, NULL));
      g_assert_true (sz.feasible);
      np = sw_sizing_phases (d, &sz, phases);
      for (guint i = 0; i < np; i++)
        sum += phases[i].delta_v_m_s;
      assert_rel (sum, 9500.0, 1e-9);
      /* The sized stages in proportion: core against the top stage (and
       * the middle one when it is sized too). */
      assert_rel (sz.stages[0].delta_v_m_s / sz.stages[2].delta_v_m_s, w[0] / w[2], 1e-7);
      if (!fixed)
        assert_rel (sz.stages[1].delta_v_m_s / sz.stages[2].delta_v_m_s, w[1] / w[2], 1e-7);
      else
        assert_rel (sz.stages[1].propellant_mass_kg, 25000.0, 1e-12);
      g_test_message ("%s%s: stage delta-v %.1f %.1f %.1f m/s", manual ? "manual" : "equal",
                      fixed ? ", middle stage fixed" : "", sz.stages[0].delta_v_m_s,
                      sz.stages[1].delta_v_m_s, sz.stages[2].delta_v_m_s);
    }
}

static void
test_grid (void)
{
  check_grid (FALSE);
}

static void
test_grid_crossfeed (void)
{
  check_grid (TRUE);
}

/* Without boosters the minimiser finds the exact Lagrange optimum. */
static void
test_no_boosters_is_lagrange (void)
{
  for (guint n_st = 1; n_st <= 4; n_st++)
    {
      g_autoptr (SwDesign) d = booster_design (0, FALSE);
      SwParallelVehicle v;
      SwSizing exact, mine;
      SwStageSet set = { 0 };

      d->n_stages = MIN (n_st, 3);
      if (n_st == 4)
        {
          d->n_stages = 3;
          d->stages[2].structural_coefficient = 0.2;   /* a stage the optimum gives little */
        }
      g_assert_true (sw_parallel_vehicle_from_design (&v, d, NULL));
      sw_stage_set_from_design (&set, d);
      sw_size (&set, d->payload_kg, d->n_stages == 1 ? 5000.0 : 9500.0, SW_SPLIT_OPTIMAL,
               &exact);
      sw_size_parallel (&v, d->payload_kg, d->n_stages == 1 ? 5000.0 : 9500.0,
                        SW_SPLIT_OPTIMAL, &mine);
      g_assert_true (exact.feasible && mine.feasible);
      g_test_message ("%u stages: Lagrange %.9f kg, minimiser %.9f kg", d->n_stages,
                      exact.liftoff_mass_kg, mine.liftoff_mass_kg);
      assert_rel (mine.liftoff_mass_kg, exact.liftoff_mass_kg, 1e-10);
      for (guint i = 0; i < d->n_stages; i++)
        {
          g_assert_cmpfloat (fabs (mine.stages[i].delta_v_m_s - exact.stages[i].delta_v_m_s),
                             <, 0.05);
          assert_rel (mine.stages[i].initial_mass_kg, exact.stages[i].initial_mass_kg, 1e-6);
        }
      g_assert_false (mine.boosters.present);
    }
}

/* Zero boosters is the same design as no key: equal designs, the same
 * sizing bit for bit, the same saved file. */
static void
test_zero_is_no_key (void)
{
  g_autoptr (SwDesign) with = booster_design (2, FALSE);
  g_autoptr (SwDesign) none = booster_design (0, FALSE);
  g_autoptr (SwDesign) loaded = NULL;
  g_autofree char *a = NULL, *b = NULL;
  g_autoptr (GError) error = NULL;
  SwSizing s1, s2;
  const char *text =
    "{\"format\":\"stagewright-design\",\"version\":2,\"name\":\"test\",\"payload_kg\":5000,"
    "\"mission\":{\"delta_v_m_s\":9500},\"split\":\"optimal\",\"stages\":["
    "{\"name\":\"Stage 1\",\"isp_vac_s\":300,\"structural_coefficient\":0.08,"
    "\"thrust_vac_kn\":3000},"
    "{\"name\":\"Stage 2\",\"isp_vac_s\":340,\"structural_coefficient\":0.1},"
    "{\"name\":\"Stage 3\",\"isp_vac_s\":350,\"structural_coefficient\":0.12}],"
    "\"boosters\":{\"count\":0,\"isp_vac_s\":275,\"structural_coefficient\":0.11,"
    "\"thrust_vac_kn\":2000}}";

  with->boosters.count = 0;
  g_assert_true (sw_design_equal (with, none));
  g_assert_true (sw_size_design (with, &s1, NULL));
  g_assert_true (sw_size_design (none, &s2, NULL));
  g_assert_true (memcmp (&s1, &s2, sizeof s1) == 0);
  a = sw_design_to_data (with, NULL);
  b = sw_design_to_data (none, NULL);
  g_assert_cmpstr (a, ==, b);
  g_assert_null (strstr (a, "boosters"));

  loaded = sw_design_load_data (text, -1, "zero.stagewright", NULL, &error);
  g_assert_no_error (error);
  g_assert_true (sw_design_equal (loaded, none));
  g_assert_true (sw_size_design (loaded, &s1, NULL));
  g_assert_true (memcmp (&s1, &s2, sizeof s1) == 0);
}

/* Boosters lighten the vehicle here (they give phase 0 for the price of
 * their structure), and a load saved comes back. */
static void
test_round_trip_and_effect (void)
{
  g_autoptr (SwDesign) d = booster_design (4, FALSE);
  g_autoptr (SwDesign) none = booster_design (0, FALSE);
  g_autoptr (SwDesign) back = NULL;
  g_autofree char *data = sw_design_to_data (d, NULL);
  g_autoptr (GError) error = NULL;
  SwSizing with, without;

  back = sw_design_load_data (data, -1, "mem", NULL, &error);
  g_assert_no_error (error);
  g_assert_true (sw_design_equal (back, d));
  g_assert_nonnull (strstr (data, "\"version\" : 2"));
  g_assert_true (sw_size_design (d, &with, NULL));
  g_assert_true (sw_size_design (none, &without, NULL));
  g_assert_true (with.feasible && without.feasible);
  g_test_message ("4 boosters: %.0f kg; none: %.0f kg", with.liftoff_mass_kg,
                  without.liftoff_mass_kg);
  g_assert_cmpuint (with.boosters.count, ==, 4);
  assert_rel (with.boosters.total_mass_kg, 4 * with.boosters.booster_mass_kg, 1e-12);
  /* The liftoff mass is the stack plus the boosters. */
  assert_rel (with.liftoff_mass_kg,
              with.stages[0].payload_mass_kg + with.stages[0].stage_mass_kg
              + with.boosters.total_mass_kg, 1e-12);
}

/* Fixed boosters that alone give more than the mission needs: an answer
 * with a reason, not a crash or a NaN without one. */
static void
test_too_much (void)
{
  g_autoptr (SwDesign) d = booster_design (2, FALSE);
  SwSizing sz;

  d->boosters.propellant.has_propellant_kg = TRUE;
  d->boosters.propellant.propellant_kg = 5.0e6;
  d->mission.delta_v_m_s = 1500.0;
  g_assert_true (sw_size_design (d, &sz, NULL));
  g_assert_false (sz.feasible);
  g_assert_cmpuint (strlen (sz.reason), >, 0);
}

/* Payload capability of a vehicle with every load fixed, boosters
 * included: against a bisection on the sizing's feasibility. */
static void
test_performance (void)
{
  g_autoptr (SwDesign) d = booster_design (2, FALSE);
  SwPerformance perf;
  double lo = 0.0, hi = 50000.0;

  d->boosters.propellant.has_propellant_kg = TRUE;
  d->boosters.propellant.propellant_kg = 40000.0;
  d->stages[0].propellant.has_propellant_kg = TRUE;
  d->stages[0].propellant.propellant_kg = 150000.0;
  d->stages[1].propellant.has_propellant_kg = TRUE;
  d->stages[1].propellant.propellant_kg = 30000.0;
  d->stages[2].propellant.has_propellant_kg = TRUE;
  d->stages[2].propellant.propellant_kg = 6000.0;
  d->mission.delta_v_m_s = 9000.0;
  g_assert_true (sw_design_performance (d, &perf, NULL));
  g_assert_true (perf.reachable);
  for (int i = 0; i < 100; i++)
    {
      SwSizing sz;
      double mid = 0.5 * (lo + hi);
      d->payload_kg = mid;
      g_assert_true (sw_size_design (d, &sz, NULL));
      if (sz.feasible)
        lo = mid;
      else
        hi = mid;
    }
  g_test_message ("payload %.6f kg, bisection %.6f kg", perf.payload_kg, lo);
  g_assert_cmpfloat (fabs (perf.payload_kg - lo), <, 1e-6 * lo);
  g_assert_true (perf.sizing.feasible);
  g_assert_true (perf.sizing.boosters.present);
  /* Sized boosters: not a vehicle that exists. */
  d->boosters.propellant.has_propellant_kg = FALSE;
  g_assert_false (sw_design_performance (d, &perf, NULL));
}


/* The fixed-loads vehicle of the trade studies (sw_fixed_loads_payload and
 * _delta_v): without boosters the delta-v is the rocket equation written out
 * here once more (no fairing), and the payload the one at which it equals
 * the requirement; with fixed boosters the payload is the performance's and
 * the delta-v at it the requirement.  sw_design_all_fixed says whether every
 * load (the boosters' too) is fixed. */
static void
test_fixed_loads (void)
{
  g_autoptr (SwDesign) d = booster_design (0, FALSE);
  g_autoptr (SwDesign) b = booster_design (2, FALSE);
  static const double prop[] = { 150000.0, 30000.0, 6000.0 };
  SwParallelVehicle v;
  SwPerformance perf;
  double hand = 0.0, above = 1000.0, p;

  g_assert_false (sw_design_all_fixed (d));
  for (guint i = 0; i < 3; i++)
    {
      d->stages[i].propellant.has_propellant_kg = TRUE;
      d->stages[i].propellant.propellant_kg = prop[i];
      b->stages[i].propellant = d->stages[i].propellant;
    }
  g_assert_true (sw_design_all_fixed (d));
  /* Boosters sized: not a vehicle that exists. */
  g_assert_false (sw_design_all_fixed (b));
  b->boosters.propellant.has_propellant_kg = TRUE;
  b->boosters.propellant.propellant_kg = 40000.0;
  g_assert_true (sw_design_all_fixed (b));

  g_assert_true (sw_parallel_vehicle_from_design (&v, d, NULL));
  for (int i = 2; i >= 0; i--)
    {
      double eps = d->stages[i].structural_coefficient;
      double mf = above + prop[i] * eps / (1.0 - eps);

      hand += d->stages[i].isp_vac_s * SW_G0 * log ((mf + prop[i]) / mf);
      above = mf + prop[i];
    }
  assert_rel (sw_fixed_loads_delta_v (&v, 1000.0), hand, 1e-12);
  p = sw_fixed_loads_payload (&v, 9000.0);
  assert_rel (sw_fixed_loads_delta_v (&v, p), 9000.0, 1e-9);
  d->mission.delta_v_m_s = 9000.0;
  g_assert_true (sw_design_performance (d, &perf, NULL));
  assert_rel (p, perf.payload_kg, 1e-9);
  /* A sized stage: no such vehicle. */
  v.fixed_kg[1] = 0.0;
  g_assert_true (isnan (sw_fixed_loads_payload (&v, 9000.0)));
  g_assert_true (isnan (sw_fixed_loads_delta_v (&v, 1000.0)));

  b->mission.delta_v_m_s = 9000.0;
  g_assert_true (sw_parallel_vehicle_from_design (&v, b, NULL));
  g_assert_true (sw_design_performance (b, &perf, NULL));
  g_assert_true (perf.reachable);
  p = sw_fixed_loads_payload (&v, 9000.0);
  assert_rel (p, perf.payload_kg, 1e-9);
  assert_rel (sw_fixed_loads_delta_v (&v, p), 9000.0, 1e-9);
  /* More payload, less delta-v. */
  g_assert_cmpfloat (sw_fixed_loads_delta_v (&v, p + 100.0), <, 9000.0);
  /* The liftoff mass is the sizing's, at a payload that fits. */
  {
    SwSizing s;

    b->payload_kg = 0.5 * p;
    g_assert_true (sw_size_design (b, &s, NULL));
    g_assert_true (s.feasible);
    assert_rel (sw_fixed_loads_liftoff_mass (&v, b->payload_kg), s.liftoff_mass_kg, 1e-12);
    g_assert_true (sw_parallel_vehicle_from_design (&v, d, NULL));
    d->payload_kg = 1000.0;
    g_assert_true (sw_size_design (d, &s, NULL));
    g_assert_true (s.feasible);
    assert_rel (sw_fixed_loads_liftoff_mass (&v, 1000.0), s.liftoff_mass_kg, 1e-12);
  }
}

/* Sized boosters that do not pay (low Isp, heavy structure): the optimum
 * gives them no propellant.  A vehicle whose boosters carry nothing is not a
 * vehicle with boosters, so the sizing says so (infeasible, with the mass of
 * the vehicle without them) and never counts their thrust.  The evidence is
 * a brute-force grid over positive booster loads and the upper stages'
 * delta-v: no vehicle with boosters is lighter than the exact Lagrange
 * optimum without them (Curtis, sec. 11.6, as sw_size computes it). */
static void
test_boosters_optimised_away (void)
{
  g_autoptr (SwDesign) d = booster_design (2, FALSE);
  g_autoptr (SwDesign) bare = NULL;
  SwParallelVehicle v;
  SwSizing sz, without;
  double best = HUGE_VAL;
  const guint n = 40;

  d->boosters.isp_vac_s = 220.0;
  d->boosters.has_isp_sl = FALSE;
  d->boosters.structural_coefficient = 0.25;
  g_assert_true (sw_design_validate (d, NULL, NULL));
  bare = sw_design_copy (d);
  bare->boosters.count = 0;
  g_assert_true (sw_size_design (bare, &without, NULL));
  g_assert_true (without.feasible);
  g_assert_true (sw_parallel_vehicle_from_design (&v, d, NULL));
  for (guint i = 1; i <= n; i++)
    for (guint j = 1; j <= n; j++)
      {
        double pb = 40000.0 * i / n;
        double dup = 9500.0 * j / (n + 1);
        double p1 = core_for (&v, 5000.0, pb, dup, 9500.0);
        double m = isfinite (p1) ? sw_parallel_liftoff_mass (&v, 5000.0, pb, p1, dup, NULL) : NAN;
        if (isfinite (m))
          best = MIN (best, m);
      }
  g_test_message ("without boosters %.3f kg, best grid point with boosters %.3f kg",
                  without.liftoff_mass_kg, best);
  g_assert_cmpfloat (best, >, without.liftoff_mass_kg);

  g_assert_true (sw_size_design (d, &sz, NULL));
  g_assert_false (sz.feasible);
  g_assert_true (sz.boosters.present);
  g_assert_true (sz.boosters.optimised_away);
  g_assert_nonnull (strstr (sz.reason, "optimised away"));
  g_assert_nonnull (strstr (sz.reason, "boosters.propellant_kg"));
  assert_rel (sz.boosters.without_liftoff_mass_kg, without.liftoff_mass_kg, 1e-12);
  g_assert_true (isnan (sz.liftoff_mass_kg));
  g_assert_true (isnan (sz.boosters.propellant_mass_kg));
  /* The phased machinery on its own says the same (no design-level mass). */
  sw_size_parallel (&v, 5000.0, 9500.0, SW_SPLIT_OPTIMAL, &sz);
  g_assert_false (sz.feasible);
  g_assert_true (sz.boosters.optimised_away);
  /* The same boosters with a load of their own: a vehicle with boosters,
   * heavier than the one without (they do not pay, but they fly). */
  d->boosters.propellant.has_propellant_kg = TRUE;
  d->boosters.propellant.propellant_kg = 5000.0;
  g_assert_true (sw_size_design (d, &sz, NULL));
  g_assert_true (sz.feasible);
  g_assert_false (sz.boosters.optimised_away);
  g_assert_cmpfloat (sz.liftoff_mass_kg, >, without.liftoff_mass_kg);
  /* Good boosters (the grid test's) are not optimised away. */
  {
    g_autoptr (SwDesign) good = booster_design (2, FALSE);
    g_assert_true (sw_size_design (good, &sz, NULL));
    g_assert_true (sz.feasible);
    g_assert_false (sz.boosters.optimised_away);
    g_assert_cmpfloat (sz.boosters.propellant_mass_kg, >, 1000.0);
  }
}

/* The cluster's liftoff thrust-to-weight (the inspector shows it beside the
 * core's own): core and boosters' vacuum thrust over the sizing's liftoff
 * weight, by hand; none without boosters or with boosters optimised away. */
static void
test_liftoff_tw_with_boosters (void)
{
  g_autoptr (SwDesign) d = booster_design (2, FALSE);
  SwSizing sz;

  g_assert_true (sw_size_design (d, &sz, NULL));
  g_assert_true (sz.feasible);
  assert_rel (sw_design_liftoff_tw_with_boosters (d),
              (3000e3 + 2 * 2000e3) / (9.80665 * sz.liftoff_mass_kg), 1e-12);
  assert_rel (sw_design_ignition_tw (d, 0), 3000e3 / (9.80665 * sz.liftoff_mass_kg), 1e-12);
  d->boosters.isp_vac_s = 220.0;
  d->boosters.has_isp_sl = FALSE;
  d->boosters.structural_coefficient = 0.25;
  g_assert_true (isnan (sw_design_liftoff_tw_with_boosters (d)));
  d->boosters.count = 0;
  g_assert_true (isnan (sw_design_liftoff_tw_with_boosters (d)));
}

/* Every stage fixed and the vehicle enough without its boosters: the least
 * booster load that is enough is none, so the sized boosters are optimised
 * away (before, a first scan load of some tens of kilograms was taken). */
static void
test_boosters_away_fixed_core (void)
{
  g_autoptr (SwDesign) d = booster_design (2, FALSE);
  SwParallelVehicle v;
  SwSizing sz;
  double got;

  fix_loads (d, 1.0, 90000.0, 30000.0, 8000.0);
  d->boosters.propellant.has_propellant_kg = FALSE;
  g_assert_true (sw_parallel_vehicle_from_design (&v, d, NULL));
  v.count = 0;
  g_assert_true (isfinite (sw_parallel_liftoff_mass (&v, 5000.0, 0.0, 90000.0, 0.0, &got)));
  d->mission.delta_v_m_s = got - 100.0;
  g_assert_true (sw_design_validate (d, NULL, NULL));
  g_assert_true (sw_size_design (d, &sz, NULL));
  g_assert_false (sz.feasible);
  g_assert_true (sz.boosters.optimised_away);
  g_assert_nonnull (strstr (sz.reason, "optimised away"));
  /* 300 m/s more than the vehicle gives alone: the boosters carry a load. */
  d->mission.delta_v_m_s = got + 300.0;
  g_assert_true (sw_size_design (d, &sz, NULL));
  g_assert_true (sz.feasible);
  g_assert_false (sz.boosters.optimised_away);
  g_assert_cmpfloat (sz.boosters.propellant_mass_kg, >, 100.0);
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/core/booster-sizing/fixed-hand", test_fixed_hand);
  g_test_add_func ("/core/booster-sizing/fixed-hand-crossfeed", test_fixed_hand_crossfeed);
  g_test_add_func ("/core/booster-sizing/fairing-hand", test_fairing_hand);
  g_test_add_func ("/core/booster-sizing/grid", test_grid);
  g_test_add_func ("/core/booster-sizing/splits-with-fixed", test_splits_with_fixed);
  g_test_add_func ("/core/booster-sizing/fixed-core-sized-boosters",
                   test_fixed_core_sized_boosters);
  g_test_add_func ("/core/booster-sizing/grid-crossfeed", test_grid_crossfeed);
  g_test_add_func ("/core/booster-sizing/no-boosters-is-lagrange", test_no_boosters_is_lagrange);
  g_test_add_func ("/core/booster-sizing/zero-is-no-key", test_zero_is_no_key);
  g_test_add_func ("/core/booster-sizing/round-trip", test_round_trip_and_effect);
  g_test_add_func ("/core/booster-sizing/too-much", test_too_much);
  g_test_add_func ("/core/booster-sizing/performance", test_performance);
  g_test_add_func ("/core/booster-sizing/fixed-loads", test_fixed_loads);
  g_test_add_func ("/core/booster-sizing/optimised-away", test_boosters_optimised_away);
  g_test_add_func ("/core/booster-sizing/liftoff-tw-with-boosters",
                   test_liftoff_tw_with_boosters);
  g_test_add_func ("/core/booster-sizing/optimised-away-fixed-core",
                   test_boosters_away_fixed_core);
  return g_test_run ();
}
