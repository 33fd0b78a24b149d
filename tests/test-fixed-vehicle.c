/* SPDX-License-Identifier: GPL-3.0-or-later */
/* A built vehicle (fixed propellant loads): its delta-v for a payload, the
 * payload for a delta-v, and the payload exchange ratios.  Check values from
 * /work/shared/reference-values.md (Curtis, Orbital Mechanics for Engineering
 * Students, sec. 11.6), hand calculations written out beside the checks, and
 * GSL's numerical derivative as a second route to the exchange ratios. */
#include "config.h"

#include "sw-design.h"
#include "sw-fixed-vehicle.h"
#include "sw-sizing.h"

#include <gsl/gsl_deriv.h>
#include <math.h>
#include <string.h>

/* A stage of total mass @stage_kg with structural coefficient @eps. */
static void
set_stage (SwFixedVehicle *v, guint i, double isp_s, double g0, double eps, double stage_kg)
{
  v->exhaust_velocity_m_s[i] = isp_s * g0;
  v->structural_mass_kg[i] = eps * stage_kg;
  v->propellant_mass_kg[i] = (1.0 - eps) * stage_kg;
}

/* Curtis's second example (reference-values.md: inputs confirmed, results
 * "from memory"): payload 10,000 kg, eps 0.15, Isp 350 s, g0 = 9.81, liftoff
 * 200,000 kg (payload fraction 0.05): burnout speed 5.657 km/s.  By hand:
 * stage 190,000 kg = 28,500 kg structure + 161,500 kg propellant; burnout
 * mass 38,500 kg; 3433.5 m/s x ln(200,000 / 38,500) = 5657.24 m/s. */
static void
test_single_stage (void)
{
  SwFixedVehicle v = { .n_stages = 1 };
  double payload;

  set_stage (&v, 0, 350.0, 9.81, 0.15, 190000.0);
  /* The book gives 4 figures: 5.657 km/s, so +-0.5 m/s. */
  g_assert_cmpfloat_with_epsilon (sw_fixed_vehicle_delta_v (&v, 10000.0), 5657.0, 0.5);

  /* The inverse in closed form for one stage (not the Brent solve the code
   * uses): P = mp / (exp(dv / c) - 1) - ms.  For 5000 m/s:
   * exp(5000 / 3433.5) = 4.289799, P = 161,500 / 3.289799 - 28,500
   * = 49,091.14 - 28,500 = 20,591.14 kg. */
  for (double dv = 1000.0; dv <= 9000.0; dv += 500.0)
    {
      double expected = 161500.0 / expm1 (dv / 3433.5) - 28500.0;
      g_assert_true (sw_fixed_vehicle_payload (&v, dv, &payload));
      /* The solver stops at an interval of 1e-12 of the vehicle mass
       * (0.0002 kg here); 1e-3 kg leaves room for it. */
      g_assert_cmpfloat_with_epsilon (payload, expected, 1e-3);
    }
  g_assert_true (sw_fixed_vehicle_payload (&v, 5000.0, &payload));
  g_assert_cmpfloat_with_epsilon (payload, 20591.14, 0.01);   /* by hand, above */

  /* Falling short even empty: 1,000 kg structure, 9,000 kg propellant,
   * c = 3000 m/s reaches 3000 ln 10 = 6907.76 m/s with nothing on top.  For
   * 7000 m/s the payload is 9000 / (e^(7/3) - 1) - 1000 = -33.53 kg. */
  {
    SwFixedVehicle w = { .n_stages = 1 };
    w.exhaust_velocity_m_s[0] = 3000.0;
    w.structural_mass_kg[0] = 1000.0;
    w.propellant_mass_kg[0] = 9000.0;
    g_assert_cmpfloat_with_epsilon (sw_fixed_vehicle_delta_v (&w, 0.0), 6907.755, 1e-3);
    g_assert_true (sw_fixed_vehicle_payload (&w, 7000.0, &payload));
    g_assert_cmpfloat_with_epsilon (payload, -33.532, 1e-3);
    /* A burnout mass not above zero has no delta-v. */
    g_assert_true (isnan (sw_fixed_vehicle_delta_v (&w, -1000.0)));
    g_assert_true (isnan (sw_fixed_vehicle_delta_v (&w, -1500.0)));
  }
  /* No propellant: no answer; no delta-v asked: no answer. */
  {
    SwFixedVehicle empty = { .n_stages = 1 };
    empty.exhaust_velocity_m_s[0] = 3000.0;
    empty.structural_mass_kg[0] = 1000.0;
    g_assert_false (sw_fixed_vehicle_payload (&empty, 1000.0, &payload));
    g_assert_true (isnan (payload));
    g_assert_false (sw_fixed_vehicle_payload (&v, 0.0, &payload));
  }
}

/* Curtis's worked example (reference-values.md, sec. 11.6): payload
 * 5000 kg, g0 = 9.81, Isp 400 / 350 / 300 s, eps 0.10 / 0.15 / 0.20, sized
 * for 10 km/s.  Built with the stage masses, the vehicle must give back
 * 10 km/s with 5000 kg on top, and 5000 kg for 10 km/s. */
static void
test_three_stage_example (void)
{
  static const double isp[] = { 400, 350, 300 }, eps[] = { 0.10, 0.15, 0.20 };
  /* The exact solve, rounded to 1 kg ("computed twice, independently"). */
  static const double exact[] = { 165679, 18066, 2477 };
  /* The book's figures, rounded to 4 significant digits ("confirmed"). */
  static const double book[] = { 165700, 18070, 2477 };
  SwFixedVehicle v = { .n_stages = 3 }, b = { .n_stages = 3 };
  double payload;

  for (guint i = 0; i < 3; i++)
    {
      set_stage (&v, i, isp[i], 9.81, eps[i], exact[i]);
      set_stage (&b, i, isp[i], 9.81, eps[i], book[i]);
    }
  /* Rounding a stage mass by 0.5 kg moves the delta-v by 0.0056 m/s (each
   * stage, computed), so three roundings: +-0.017 m/s. */
  g_assert_cmpfloat_with_epsilon (sw_fixed_vehicle_delta_v (&v, 5000.0), 10000.0, 0.02);
  /* The book's rounding: +-50 kg on the first stage alone is +-0.56 m/s,
   * +-5 kg on the second 0.056 m/s: +-0.65 m/s in all. */
  g_assert_cmpfloat_with_epsilon (sw_fixed_vehicle_delta_v (&b, 5000.0), 10000.0, 0.65);
  /* 2.4 kg of payload per m/s near this point (computed), so the 0.017 m/s
   * of rounding are 0.04 kg. */
  g_assert_true (sw_fixed_vehicle_payload (&v, 10000.0, &payload));
  g_assert_cmpfloat_with_epsilon (payload, 5000.0, 0.05);
}

/* The vehicle of a sizing carries the sizing's payload to the sizing's
 * delta-v: the built vehicle and the sizing agree. */
static void
test_from_sizing (void)
{
  SwStageSet set = { .n_stages = 3 };
  static const double isp[] = { 400, 350, 300 }, eps[] = { 0.10, 0.15, 0.20 };
  SwSizing s;
  SwFixedVehicle v;
  double payload;

  for (guint i = 0; i < 3; i++)
    {
      set.exhaust_velocity_m_s[i] = isp[i] * SW_G0;
      set.structural_coefficient[i] = eps[i];
    }
  sw_size (&set, 5000.0, 10000.0, SW_SPLIT_OPTIMAL, &s);
  g_assert_true (s.feasible);
  /* reference-values.md: with g0 = 9.80665 the total is 191,527 kg
   * (computed), rounded to 1 kg. */
  g_assert_cmpfloat_with_epsilon (s.liftoff_mass_kg, 191527.0, 0.5);
  g_assert_true (sw_fixed_vehicle_from_sizing (&v, &s));
  g_assert_cmpuint (v.n_stages, ==, 3);
  /* Round trip at the sizing's own numbers: the root finder's tolerance
   * (1e-12 of the vehicle's mass, 0.0002 kg) decides the bound. */
  g_assert_cmpfloat_with_epsilon (sw_fixed_vehicle_delta_v (&v, 5000.0), 10000.0, 1e-6);
  g_assert_true (sw_fixed_vehicle_payload (&v, 10000.0, &payload));
  g_assert_cmpfloat_with_epsilon (payload, 5000.0, 1e-3);

  /* An infeasible sizing gives no vehicle. */
  sw_size (&set, 5000.0, 25000.0, SW_SPLIT_OPTIMAL, &s);
  g_assert_false (s.feasible);
  g_assert_false (sw_fixed_vehicle_from_sizing (&v, &s));
  g_assert_cmpuint (v.n_stages, ==, 0);
}

typedef struct {
  SwFixedVehicle v;
  guint stage;
  double delta_v;
} DerivParams;

static double
payload_of_dry_mass (double dry_kg, void *data)
{
  DerivParams *p = data;
  SwFixedVehicle w = p->v;
  double payload = NAN;

  w.structural_mass_kg[p->stage] = dry_kg;
  g_assert_true (sw_fixed_vehicle_payload (&w, p->delta_v, &payload));
  return payload;
}

/* Payload lost per kg of dry mass added to a stage.  Top stage: exactly 1,
 * since dry mass on the top stage and payload ride the same burns (a
 * physical identity).  The other stages: the analytic ratio (implicit
 * function theorem), the code's central difference, and GSL's adaptive
 * numerical derivative of the payload must agree. */
static void
test_exchange_ratios (void)
{
  static const double isp[] = { 400, 350, 300 }, eps[] = { 0.10, 0.15, 0.20 };
  static const double mass[] = { 165679, 18066, 2477 };
  DerivParams p = { .v = { .n_stages = 3 }, .delta_v = 10000.0 };
  double numeric[3], analytic[3], payload;

  for (guint i = 0; i < 3; i++)
    set_stage (&p.v, i, isp[i], 9.81, eps[i], mass[i]);
  g_assert_true (sw_fixed_vehicle_payload (&p.v, p.delta_v, &payload));
  g_assert_true (sw_fixed_vehicle_exchange_ratios (&p.v, p.delta_v, 1.0, numeric));
  sw_fixed_vehicle_exchange_ratios_analytic (&p.v, payload, analytic);

  g_assert_cmpfloat_with_epsilon (analytic[2], 1.0, 1e-15);
  g_assert_cmpfloat_with_epsilon (numeric[2], 1.0, 1e-6);
  /* Lower stages cost less payload per kg: the ratios rise up the stack. */
  g_assert_cmpfloat (analytic[0], <, analytic[1]);
  g_assert_cmpfloat (analytic[1], <, analytic[2]);
  for (guint k = 0; k < 3; k++)
    {
      gsl_function fn = { payload_of_dry_mass, &p };
      double d, abserr;

      p.stage = k;
      g_assert_cmpint (gsl_deriv_central (&fn, p.v.structural_mass_kg[k], 1.0, &d, &abserr), ==,
                       0);
      /* The payload solve stops within 1e-12 of the vehicle's mass
       * (1.9e-7 kg); over a 1 kg step that bounds a difference quotient's
       * error near 4e-7, hence 1e-6 (measured: about 1e-9; GSL's own error
       * estimate 1e-10). */
      g_test_message ("stage %u: analytic %.9f, GSL %.9f (+-%.1e), central %.9f", k,
                      analytic[k], -d, abserr, numeric[k]);
      g_assert_cmpfloat_with_epsilon (-d, analytic[k], 1e-6);
      g_assert_cmpfloat_with_epsilon (numeric[k], analytic[k], 1e-6);
    }

  /* Entries past the stage count are not part of the vehicle: filled with
   * a stage's worth of mass, they change nothing. */
  {
    SwFixedVehicle two = p.v, padded;
    double r_two[SW_MAX_STAGES], r_padded[SW_MAX_STAGES], dv_two;

    two.n_stages = 2;
    padded = two;
    for (guint i = 2; i < SW_MAX_STAGES; i++)
      set_stage (&padded, i, 300.0, 9.81, 0.2, 5000.0);
    dv_two = sw_fixed_vehicle_delta_v (&two, 5000.0);
    g_assert_cmpfloat (sw_fixed_vehicle_delta_v (&padded, 5000.0), ==, dv_two);
    sw_fixed_vehicle_exchange_ratios_analytic (&two, 5000.0, r_two);
    sw_fixed_vehicle_exchange_ratios_analytic (&padded, 5000.0, r_padded);
    g_assert_cmpfloat (r_padded[0], ==, r_two[0]);
    g_assert_cmpfloat (r_padded[1], ==, r_two[1]);
    g_assert_cmpfloat_with_epsilon (r_two[1], 1.0, 1e-15);
  }

  /* One stage: the ratio is 1 (the same identity). */
  {
    SwFixedVehicle one = { .n_stages = 1 };
    double r;
    set_stage (&one, 0, 350.0, 9.81, 0.15, 190000.0);
    sw_fixed_vehicle_exchange_ratios_analytic (&one, 10000.0, &r);
    g_assert_cmpfloat_with_epsilon (r, 1.0, 1e-15);
  }
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/core/fixed-vehicle/single-stage", test_single_stage);
  g_test_add_func ("/core/fixed-vehicle/three-stage-example", test_three_stage_example);
  g_test_add_func ("/core/fixed-vehicle/from-sizing", test_from_sizing);
  g_test_add_func ("/core/fixed-vehicle/exchange-ratios", test_exchange_ratios);
  return g_test_run ();
}
