/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Tests of sw-mass-estimate: the mass-estimating relationships against the
 * check values of the shared reference notes ("Mass-estimating
 * relationships", after Akin, Mass Estimating Relations, University of
 * Maryland, 2016), the fixed point of one stage with a fixed load against a
 * hand set-up solved by GSL's Brent root finder, a sized three-stage vehicle
 * at its fixed point, and stages that cannot be estimated. */
#include "config.h"

#include "sw-design.h"
#include "sw-design-edit.h"
#include "sw-mass-estimate.h"
#include "sw-vehicle-shape.h"

#include <gsl/gsl_roots.h>
#include <math.h>
#include <string.h>

static void
assert_near (double got, double want, double tol)
{
  if (!(fabs (got - want) <= tol))
    g_error ("got %.12g, want %.12g within %g", got, want, tol);
}

/* The reference notes' computed check values, printed to 1 kg. */
static void
test_reference_checks (void)
{
  assert_near (sw_mer_engine_mass (1.0e6, 40.0), 1053.0, 0.5);   /* 1 MN, area ratio 40 */
  assert_near (sw_mer_shroud_mass (100.0), 988.0, 0.5);          /* 100 m^2 of fairing */
  assert_near (sw_mer_avionics_mass (153000.0), 744.0, 0.5);     /* M0 = 153 t */
  /* Tank values read from the notes: 12.158 and 9.0911 kg per m^3. */
  assert_near (sw_mer_tank_mass (100.0, FALSE), 1215.8, 1e-9);
  assert_near (sw_mer_tank_mass (100.0, TRUE), 909.11, 1e-9);
  /* Thrust structure 2.55e-4 T (the notes flag a second transcription,
   * 2.25e-4; we use the first). */
  assert_near (sw_mer_thrust_structure_mass (1.0e6), 255.0, 1e-9);
  /* Wiring 1.058 sqrt (M0) L^0.25 by hand: M0 = 10^4, L = 16: 1.058 x 100 x 2. */
  assert_near (sw_mer_wiring_mass (1.0e4, 16.0), 211.6, 1e-9);
}

typedef struct { double fixed_kg, mp, length; } OneStage;

static double
structure_residual (double ms, void *data)
{
  const OneStage *o = data;
  double m0 = o->mp + ms;
  return o->fixed_kg + 10.0 * pow (m0, 0.361) + 1.058 * sqrt (m0) * pow (o->length, 0.25) - ms;
}

static const char *one_stage =
  "{ \"format\": \"stagewright-design\", \"version\": 2, \"name\": \"O\", \"payload_kg\": 1000,"
  "  \"mission\": { \"delta_v_m_s\": 1000 }, \"split\": \"optimal\","
  "  \"stages\": [ { \"name\": \"A\", \"isp_vac_s\": 300, \"structural_coefficient\": 0.2,"
  "                  \"propellant_kg\": 100000, \"propellant\": \"lox-kerosene\","
  "                  \"mixture_ratio\": 2.56, \"diameter_m\": 3.7,"
  "                  \"thrust_vac_kn\": 1500 } ] }";

/* One stage with 100 t of LOX/RP-1 (the reference tank example) and 1.5 MN:
 * tanks, LOX insulation, engine (area ratio 20) and thrust structure do not
 * depend on the structure; avionics and wiring do, through M0 = Mp + Ms.  By
 * hand the structure solves Ms = F + 10 M0^0.361 + 1.058 sqrt (M0) L^0.25,
 * found here by GSL's Brent method. */
static void
test_one_stage_fixed_point (void)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) d = sw_design_load_data (one_stage, -1, "o.stagewright", NULL, &error);
  SwMassEstimate m;
  SwStageShape shape;
  OneStage o;
  double ox_tank, fuel_tank, fixed, lo = 0.0, hi = 1.0e5, ms = NAN;
  gsl_root_fsolver *solver = gsl_root_fsolver_alloc (gsl_root_fsolver_brent);
  gsl_function f = { structure_residual, &o };
  const SwStageEstimate *e;

  g_assert_no_error (error);
  sw_stage_shape (&d->stages[0].propellant, 100000.0, 3.7, &shape);
  ox_tank = 100000.0 * 2.56 / 3.56 / 1141.17 * 1.03;
  fuel_tank = 100000.0 / 3.56 / 809.95 * 1.03;
  assert_near (ox_tank, 64.90, 0.006);     /* reference notes, computed */
  assert_near (fuel_tank, 35.72, 0.006);   /* reference notes, computed */
  fixed = 12.158 * (ox_tank + fuel_tank)
          + 1.123 * sw_tank_surface_area (3.7, shape.oxidizer_tank_length_m, G_SQRT2)
          + (7.81e-4 * 1.5e6 + 3.37e-5 * 1.5e6 * sqrt (20.0) + 59.0)
          + 2.55e-4 * 1.5e6;
  o = (OneStage) { fixed, 100000.0, shape.length_m };
  gsl_root_fsolver_set (solver, &f, lo, hi);
  for (int i = 0; i < 200; i++)
    {
      gsl_root_fsolver_iterate (solver);
      ms = gsl_root_fsolver_root (solver);
      lo = gsl_root_fsolver_x_lower (solver);
      hi = gsl_root_fsolver_x_upper (solver);
      if (gsl_root_test_interval (lo, hi, 0.0, 1e-14) == GSL_SUCCESS)
        break;
    }
  gsl_root_fsolver_free (solver);

  sw_mass_estimate_design (d, &m);
  g_assert_true (m.ok);
  e = &m.stages[0];
  g_assert_true (e->estimated);
  g_assert_false (e->thrust_assumed);
  assert_near (e->structural_mass_kg, ms, 1e-6 * ms);
  assert_near (e->structural_coefficient, ms / (ms + 100000.0), 1e-9);
  assert_near (e->item_kg[SW_MER_INTERSTAGE], 0.0, 0.0);      /* the top stage has none */
  assert_near (e->item_kg[SW_MER_MOTOR_CASE], 0.0, 0.0);
  assert_near (e->design_coefficient, 0.2, 0.0);
  /* A kerosene first stage near 0.05 (common practice, from memory: 0.05-0.08). */
  g_assert_cmpfloat (e->structural_coefficient, >, 0.03);
  g_assert_cmpfloat (e->structural_coefficient, <, 0.08);
}

static const char *three_stage =
  "{ \"format\": \"stagewright-design\", \"version\": 2, \"name\": \"T\", \"payload_kg\": 5000,"
  "  \"mission\": { \"delta_v_m_s\": 9300 }, \"split\": \"optimal\","
  "  \"stages\": [ { \"name\": \"A\", \"isp_vac_s\": 311, \"structural_coefficient\": 0.07,"
  "                  \"propellant\": \"lox-kerosene\", \"diameter_m\": 3.7,"
  "                  \"engine_count\": 9, \"engine_thrust_vac_kn\": 140 },"
  "                { \"name\": \"B\", \"isp_vac_s\": 450, \"structural_coefficient\": 0.1,"
  "                  \"propellant\": \"lox-hydrogen\", \"thrust_vac_kn\": 300 },"
  "                { \"name\": \"C\", \"isp_vac_s\": 320, \"structural_coefficient\": 0.12,"
  "                  \"propellant\": \"n2o4-mmh\", \"diameter_m\": 2.0 } ] }";

/* A sized three-stage vehicle: the iteration settles, the estimate is its own
 * fixed point (starting from it moves nothing), the hydrogen stage's tanks
 * use the hydrogen rate and carry insulation, and the storable stage none. */
static void
test_three_stage_fixed_point (void)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) d = sw_design_load_data (three_stage, -1, "t.stagewright", NULL, &error);
  SwMassEstimate m, again;
  SwSizing s;
  SwStageShape shape;
  double eps[SW_MAX_STAGES], shares[SW_MAX_STAGES];
  gboolean changed;

  g_assert_no_error (error);
  sw_mass_estimate_design (d, &m);
  g_assert_true (m.ok);
  g_assert_cmpfloat (m.residual, <=, SW_MER_TOLERANCE);
  g_assert_cmpuint (m.iterations, <, SW_MER_MAX_ITERATIONS);
  for (guint i = 0; i < 3; i++)
    {
      if (!m.stages[i].estimated)
        g_error ("stage %u: %s", i, m.stages[i].reason);
      g_assert_cmpfloat (m.stages[i].structural_coefficient, >, 0.02);
      g_assert_cmpfloat (m.stages[i].structural_coefficient, <, 0.3);
    }
  g_assert_true (m.stages[2].thrust_assumed);       /* C has no thrust key */
  assert_near (m.stages[0].thrust_n, 9 * 140e3, 1e-6);
  g_assert_cmpfloat (m.stages[0].item_kg[SW_MER_INTERSTAGE], >, 0.0);
  assert_near (m.stages[2].item_kg[SW_MER_INSULATION], 0.0, 0.0);
  g_assert_cmpfloat (m.stages[1].item_kg[SW_MER_INSULATION], >, 0.0);
  /* The engines of stage A: nine of 140 kN at area ratio 20. */
  assert_near (m.stages[0].item_kg[SW_MER_ENGINES],
               9 * (7.81e-4 * 1.4e5 + 3.37e-5 * 1.4e5 * sqrt (20.0) + 59.0), 1e-6);

  /* At the fixed point: the design with the estimates and the split held
   * (the shares of its own optimal sizing), sized, gives the liftoff mass of
   * the estimate and the hydrogen stage's tank mass from its own volumes. */
  g_assert_true (sw_size_design (d, &s, &error));
  g_assert_cmpuint (sw_sizing_get_shares (&s, shares), ==, 3);
  sw_design_take_manual_shares (d, shares, 3);
  for (guint i = 0; i < 3; i++)
    d->stages[i].structural_coefficient = m.stages[i].structural_coefficient;
  g_assert_true (sw_size_design (d, &s, &error));
  assert_near (s.liftoff_mass_kg, m.liftoff_mass_kg, 1e-6 * s.liftoff_mass_kg);
  sw_stage_shape (&d->stages[1].propellant, s.stages[1].propellant_mass_kg, 3.7, &shape);
  assert_near (m.stages[1].item_kg[SW_MER_TANKS],
               12.158 * shape.oxidizer_tank_m3 + 9.0911 * shape.fuel_tank_m3,
               1e-6 * m.stages[1].item_kg[SW_MER_TANKS]);
  sw_mass_estimate_design (d, &again);
  g_assert_true (again.ok);
  g_assert_cmpuint (again.iterations, <=, 2);
  for (guint i = 0; i < 3; i++)
    assert_near (again.stages[i].structural_coefficient, m.stages[i].structural_coefficient,
                 1e-9);

  /* Accepting it (rounded to 4 decimals) is one edit. */
  for (guint i = 0; i < 3; i++)
    eps[i] = m.stages[i].structural_coefficient;
  g_assert_true (sw_design_accept_structural_coefficients (d, eps, 3, &changed, &error));
  g_assert_no_error (error);
  for (guint i = 0; i < 3; i++)
    assert_near (d->stages[i].structural_coefficient, round (eps[i] * 1e4) / 1e4, 0.0);
}

/* A stage without a propellant or diameter keeps the design's coefficient
 * and says why; with no stage to estimate the estimate says so. */
static void
test_not_estimated (void)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) d = sw_design_load_data (three_stage, -1, "t.stagewright", NULL, &error);
  SwMassEstimate m;

  g_assert_no_error (error);
  d->stages[2].propellant.kind = SW_PROPELLANT_NONE;
  sw_mass_estimate_design (d, &m);
  g_assert_true (m.ok);
  g_assert_false (m.stages[2].estimated);
  g_assert_nonnull (strstr (m.stages[2].reason, "propellant"));
  assert_near (m.stages[2].structural_coefficient, 0.12, 0.0);
  g_assert_true (m.stages[0].estimated);

  for (guint i = 0; i < 3; i++)
    d->stages[i].propulsion.has_diameter = FALSE;
  sw_mass_estimate_design (d, &m);
  g_assert_false (m.ok);
  g_assert_false (m.any_estimated);
  g_assert_nonnull (strstr (m.stages[0].reason, "diameter"));
  g_assert_cmpstr (m.reason, !=, "");
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/mass-estimate/reference-checks", test_reference_checks);
  g_test_add_func ("/mass-estimate/one-stage-fixed-point", test_one_stage_fixed_point);
  g_test_add_func ("/mass-estimate/three-stage-fixed-point", test_three_stage_fixed_point);
  g_test_add_func ("/mass-estimate/not-estimated", test_not_estimated);
  return g_test_run ();
}
