/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Tests of sw-curves: liftoff mass against stage count and against delta-v. */
#include "config.h"

#include "sw-curves.h"
#include "sw-design.h"
#include "sw-sizing.h"

#include <math.h>
#include <string.h>

static void
assert_rel (double got, double want, double rel)
{
  if (!(fabs (got - want) <= rel * fabs (want)))
    g_error ("relative check failed: got %.12g, want %.12g (tolerance %g)", got, want, rel);
}

/* A two-stage design: kerosene-like first stage, hydrogen-like upper stage
 * (invented numbers). */
static SwDesign *
two_stage_design (double delta_v)
{
  SwDesign *d = sw_design_new ();

  g_strlcpy (d->name, "Curve test", sizeof d->name);
  d->payload_kg = 2000.0;
  d->mission.delta_v_m_s = delta_v;
  d->split = SW_SPLIT_OPTIMAL;
  d->n_stages = 2;
  d->stages[0].isp_vac_s = 300.0;
  d->stages[0].structural_coefficient = 0.08;
  d->stages[1].isp_vac_s = 440.0;
  d->stages[1].structural_coefficient = 0.13;
  return d;
}

/* The hypothetical N-stage vehicle built by hand from the rule of issue 2:
 * stage k takes the design's stage min(k, n_design). */
static void
hand_extend (const SwDesign *d, guint n, SwStageSet *set)
{
  memset (set, 0, sizeof *set);
  set->n_stages = n;
  for (guint k = 0; k < n; k++)
    {
      guint src = k < d->n_stages ? k : d->n_stages - 1;
      set->exhaust_velocity_m_s[k] = d->stages[src].isp_vac_s * SW_G0;
      set->structural_coefficient[k] = d->stages[src].structural_coefficient;
    }
}

static void
test_stage_curve_matches_sizing (void)
{
  /* 12 km/s: beyond one stage (300 s: 7428 m/s limit), within two. */
  g_autoptr (SwDesign) d = two_stage_design (12000.0);
  SwStageCurve curve;
  guint n_infeasible = 0;

  sw_stage_curve_compute (d, 12000.0, SW_MAX_STAGES, &curve);
  g_assert_cmpuint (curve.n_points, ==, SW_MAX_STAGES);
  g_assert_cmpfloat (curve.delta_v_m_s, ==, 12000.0);
  g_assert_cmpfloat (curve.payload_kg, ==, 2000.0);
  for (guint n = 1; n <= SW_MAX_STAGES; n++)
    {
      const SwStageCountPoint *p = &curve.points[n - 1];
      SwStageSet set = { 0 };
      SwSizing s;

      hand_extend (d, n, &set);
      sw_size (&set, d->payload_kg, 12000.0, SW_SPLIT_OPTIMAL, &s);
      g_assert_cmpuint (p->stages, ==, n);
      g_assert_cmpint (p->feasible, ==, s.feasible);
      assert_rel (p->delta_v_limit_m_s, s.delta_v_limit_m_s, 1e-15);
      if (s.feasible)
        g_assert_cmpfloat (p->liftoff_mass_kg, ==, s.liftoff_mass_kg);
      else
        {
          /* Marked, not dropped. */
          g_assert_true (isnan (p->liftoff_mass_kg));
          n_infeasible++;
        }
    }
  /* One stage cannot reach 12 km/s; two or more can. */
  g_assert_cmpuint (n_infeasible, ==, 1);
  g_assert_false (curve.points[0].feasible);
  g_assert_true (curve.points[1].feasible);
  /* More stages of the same kind: lighter, but with shrinking returns. */
  for (guint n = 2; n < SW_MAX_STAGES; n++)
    g_assert_cmpfloat (curve.points[n].liftoff_mass_kg, <, curve.points[n - 1].liftoff_mass_kg);
}

/* The stage-count curve compares vehicles at their best split whatever the
 * design's own split: a design with the equal or a manual split gets the
 * same curve as with the optimal split, and its own point of the curve is
 * no heavier than the design as split (the optimum is the lightest,
 * Curtis sec. 11.6). */
static void
test_stage_curve_other_splits (void)
{
  static const SwSplitMode modes[] = { SW_SPLIT_EQUAL, SW_SPLIT_MANUAL };
  g_autoptr (SwDesign) d = two_stage_design (9000.0);
  SwStageCurve optimal;

  d->n_stages = 3;
  d->stages[2].isp_vac_s = 320.0;
  d->stages[2].structural_coefficient = 0.2;
  d->stages[0].delta_v_share = 0.5;
  d->stages[1].delta_v_share = 0.3;
  d->stages[2].delta_v_share = 0.2;
  for (guint i = 0; i < 3; i++)
    d->stages[i].has_share = TRUE;
  sw_stage_curve_compute (d, 9000.0, SW_MAX_STAGES, &optimal);
  for (guint k = 0; k < G_N_ELEMENTS (modes); k++)
    {
      SwStageCurve curve;
      SwSizing own;

      d->split = modes[k];
      sw_stage_curve_compute (d, 9000.0, SW_MAX_STAGES, &curve);
      g_assert_cmpuint (curve.n_points, ==, SW_MAX_STAGES);
      for (guint n = 1; n <= SW_MAX_STAGES; n++)
        {
          SwStageSet set = { 0 };
          SwSizing s;

          hand_extend (d, n, &set);
          sw_size (&set, d->payload_kg, 9000.0, SW_SPLIT_OPTIMAL, &s);
          g_assert_cmpint (curve.points[n - 1].feasible, ==, s.feasible);
          if (s.feasible)
            g_assert_cmpfloat (curve.points[n - 1].liftoff_mass_kg, ==, s.liftoff_mass_kg);
          g_assert_cmpmem (&curve.points[n - 1], sizeof curve.points[0], &optimal.points[n - 1],
                           sizeof optimal.points[0]);
        }
      g_assert_true (sw_size_design (d, &own, NULL));
      g_assert_true (own.feasible);
      /* Strictly lighter: these stages differ, so neither split is optimal. */
      g_assert_cmpfloat (curve.points[2].liftoff_mass_kg, <, own.liftoff_mass_kg);
    }
}

static void
test_stage_curve_all_infeasible (void)
{
  /* 60 km/s is beyond five of these stages (7.4 + 4 x 8.8 km/s). */
  g_autoptr (SwDesign) d = two_stage_design (60000.0);
  SwStageCurve curve;

  sw_stage_curve_compute (d, 60000.0, 5, &curve);
  g_assert_cmpuint (curve.n_points, ==, 5);
  for (guint i = 0; i < 5; i++)
    {
      g_assert_cmpuint (curve.points[i].stages, ==, i + 1);
      g_assert_false (curve.points[i].feasible);
      g_assert_true (isnan (curve.points[i].liftoff_mass_kg));
      g_assert_true (isfinite (curve.points[i].delta_v_limit_m_s));
    }
}

static void
test_stage_curve_clamps (void)
{
  g_autoptr (SwDesign) d = two_stage_design (9000.0);
  SwStageCurve curve;

  sw_stage_curve_compute (d, 9000.0, 0, &curve);
  g_assert_cmpuint (curve.n_points, ==, 1);
  sw_stage_curve_compute (d, 9000.0, 100, &curve);
  g_assert_cmpuint (curve.n_points, ==, SW_MAX_STAGES);
}

static void
test_sweep (void)
{
  g_autoptr (SwDesign) d = two_stage_design (9000.0);
  g_autofree SwSweep *sweep = g_new0 (SwSweep, 1);

  sw_sweep_compute (d, SW_SWEEP_CURVES, SW_SWEEP_POINTS, sweep);
  g_assert_cmpuint (sweep->n_curves, ==, SW_SWEEP_CURVES);
  g_assert_cmpfloat (sweep->payload_kg, ==, 2000.0);
  for (guint c = 0; c < sweep->n_curves; c++)
    {
      const SwSweepCurve *cv = &sweep->curves[c];
      guint n = c + 1, last = cv->n_points - 1;
      SwStageSet set = { 0 };
      double limit = 0.0;
      static const guint probes[] = { 1, 20, 77, 140, 180, 199 };

      hand_extend (d, n, &set);
      for (guint i = 0; i < n; i++)
        limit += set.exhaust_velocity_m_s[i] * log (1.0 / set.structural_coefficient[i]);
      g_assert_cmpuint (cv->stages, ==, n);
      g_assert_cmpuint (cv->n_points, ==, SW_SWEEP_POINTS);
      assert_rel (cv->delta_v_limit_m_s, limit, 1e-12);

      /* Starts at zero delta-v with the bare payload. */
      g_assert_cmpfloat (cv->delta_v_m_s[0], ==, 0.0);
      assert_rel (cv->liftoff_mass_kg[0], d->payload_kg, 1e-12);
      /* Monotone increasing, every value finite. */
      for (guint j = 1; j < cv->n_points; j++)
        {
          g_assert_true (isfinite (cv->delta_v_m_s[j]) && isfinite (cv->liftoff_mass_kg[j]));
          g_assert_cmpfloat (cv->delta_v_m_s[j], >, cv->delta_v_m_s[j - 1]);
          g_assert_cmpfloat (cv->liftoff_mass_kg[j], >, cv->liftoff_mass_kg[j - 1]);
          g_assert_cmpfloat (cv->delta_v_m_s[j], <, limit);
        }
      /* Approaches the limit: the sweep's multiplier x = 1/eta runs down to
       * 1e-4 of its largest value x_max = max c_i (1 - eps_i) (sw-curves.h),
       * and each stage then gives c ln((1 - x/c)/eps) = c ln(1/eps) - x
       * - O(x^2/c): the last point lies n x short of the limit, to 1e-3 m/s
       * (x is below 0.5 m/s here, so the x^2/c term is under 1e-4 m/s). */
      {
        double x_max = 0.0, gap;
        for (guint i = 0; i < n; i++)
          x_max = MAX (x_max, set.exhaust_velocity_m_s[i] * (1.0 - set.structural_coefficient[i]));
        gap = limit - cv->delta_v_m_s[last];
        if (!(fabs (gap - n * 1e-4 * x_max) < 1e-3))
          g_error ("%u stages: the last point is %.6g m/s short of the limit, want %.6g", n, gap,
                   n * 1e-4 * x_max);
      }
      g_assert_cmpfloat (cv->liftoff_mass_kg[last], >, 1000.0 * d->payload_kg);

      /* Sweep points are exact optima: sw_size at that delta-v agrees. */
      for (guint k = 0; k < G_N_ELEMENTS (probes); k++)
        {
          guint j = probes[k];
          SwSizing s;

          sw_size (&set, d->payload_kg, cv->delta_v_m_s[j], SW_SPLIT_OPTIMAL, &s);
          g_assert_true (s.feasible);
          assert_rel (cv->liftoff_mass_kg[j], s.liftoff_mass_kg, 1e-9);
        }
    }
}

/* A three-stage design in the sweep: curves 4 and 5 repeat the top stage. */
static void
test_sweep_extends_top_stage (void)
{
  g_autoptr (SwDesign) d = two_stage_design (9000.0);
  g_autofree SwSweep *sweep = g_new0 (SwSweep, 1);

  d->n_stages = 3;
  d->stages[2].isp_vac_s = 320.0;
  d->stages[2].structural_coefficient = 0.2;
  sw_sweep_compute (d, 5, 50, sweep);
  g_assert_cmpuint (sweep->n_curves, ==, 5);
  for (guint c = 0; c < 5; c++)
    {
      SwStageSet set = { 0 };
      double limit = 0.0;
      SwSizing s;

      hand_extend (d, c + 1, &set);
      for (guint i = 0; i <= c; i++)
        limit += set.exhaust_velocity_m_s[i] * log (1.0 / set.structural_coefficient[i]);
      g_assert_cmpuint (sweep->curves[c].n_points, ==, 50);
      assert_rel (sweep->curves[c].delta_v_limit_m_s, limit, 1e-12);
      sw_size (&set, d->payload_kg, sweep->curves[c].delta_v_m_s[30], SW_SPLIT_OPTIMAL, &s);
      assert_rel (sweep->curves[c].liftoff_mass_kg[30], s.liftoff_mass_kg, 1e-9);
    }
}

static void
test_sweep_clamps (void)
{
  g_autoptr (SwDesign) d = two_stage_design (9000.0);
  g_autofree SwSweep *sweep = g_new0 (SwSweep, 1);

  sw_sweep_compute (d, 0, 0, sweep);
  g_assert_cmpuint (sweep->n_curves, ==, 1);
  g_assert_cmpuint (sweep->curves[0].n_points, ==, 2);
  sw_sweep_compute (d, 50, 5000, sweep);
  g_assert_cmpuint (sweep->n_curves, ==, SW_SWEEP_CURVES);
  g_assert_cmpuint (sweep->curves[0].n_points, ==, SW_SWEEP_POINTS);
}

/* A fixed propellant load is not applied to the curves (they size every
 * stage): the note says so, naming the stage; a design without one has no
 * note, and the curve is the same with or without the key. */
static void
test_fixed_load_note (void)
{
  g_autoptr (GError) error = NULL;
  g_autofree char *path = g_build_filename (g_getenv ("SW_SOURCE_ROOT"), "data", "designs",
                                            "sallowmere-kestrune-upper-stage.stagewright", NULL);
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, &error);
  g_autoptr (SwDesign) sized = NULL;
  SwStageCurve fixed, plain;
  SwSweep sweep;

  g_assert_no_error (error);
  sw_stage_curve_compute (d, 9000.0, SW_MAX_STAGES, &fixed);
  sw_sweep_compute (d, SW_SWEEP_CURVES, 20, &sweep);
  g_assert_nonnull (strstr (fixed.note, "stage 2 (Kestrune upper stage) is not applied"));
  g_assert_cmpstr (sweep.note, ==, fixed.note);
  sized = sw_design_copy (d);
  sized->stages[1].propellant.has_propellant_kg = FALSE;
  sw_stage_curve_compute (sized, 9000.0, SW_MAX_STAGES, &plain);
  g_assert_cmpstr (plain.note, ==, "");
  for (guint k = 0; k < SW_MAX_STAGES; k++)
    g_assert_true (plain.points[k].liftoff_mass_kg == fixed.points[k].liftoff_mass_kg
                   || (isnan (plain.points[k].liftoff_mass_kg)
                       && isnan (fixed.points[k].liftoff_mass_kg)));

  /* Every fixed stage is named, not only the first; long names fit. */
  d->stages[0].propellant.has_propellant_kg = TRUE;
  d->stages[0].propellant.propellant_kg = 90000.0;
  for (guint i = 0; i < 2; i++)
    {
      memset (d->stages[i].name, 'x', SW_NAME_MAX - 1);
      d->stages[i].name[SW_NAME_MAX - 1] = '\0';
    }
  d->stages[1].name[0] = 'y';
  sw_stage_curve_compute (d, 9000.0, SW_MAX_STAGES, &fixed);
  g_assert_nonnull (strstr (fixed.note, "the fixed propellant loads of stages 1 (xxx"));
  g_assert_nonnull (strstr (fixed.note, "x) and 2 (yxx"));
  g_assert_true (g_str_has_suffix (fixed.note, "has no such stages."));
}

/* With strap-on boosters: besides the serial curve, the same boosters beside
 * 1..N stages.  Its point at the design's own count is the design's sizing
 * (the window's "this design" sits on it), and its point at another count
 * is the sizing of the design with that many stages (the curve's rule: the
 * top stage repeated), both through sw_size_design. */
static void
test_stage_curve_with_boosters (void)
{
  for (int fixed = 1; fixed >= 0; fixed--)
    {
      g_autoptr (SwDesign) d = two_stage_design (9300.0);
      g_autoptr (SwDesign) three = NULL;
      SwStageCurve curve, serial;
      SwSizing own, s3;

      d->stages[0].propulsion.thrust_vac_kn = 1300.0;
      d->stages[0].propulsion.has_thrust = TRUE;
      d->boosters.count = 4;
      g_strlcpy (d->boosters.name, "Sides", sizeof d->boosters.name);
      d->boosters.isp_vac_s = 275.0;
      d->boosters.structural_coefficient = 0.11;
      d->boosters.thrust_vac_kn = 800.0;
      d->boosters.propellant.has_propellant_kg = fixed;
      d->boosters.propellant.propellant_kg = fixed ? 12000.0 : 0.0;
      g_assert_true (sw_design_validate (d, "curve.stagewright", NULL));

      sw_stage_curve_compute (d, 9300.0, 6, &curve);
      g_assert_cmpuint (curve.booster_count, ==, 4);
      g_assert_cmpstr (curve.booster_note, !=, "");
      g_assert_true (sw_size_design (d, &own, NULL));
      g_assert_true (own.feasible && curve.booster_points[1].feasible);
      assert_rel (curve.booster_points[1].liftoff_mass_kg, own.liftoff_mass_kg, 1e-9);

      three = sw_design_copy (d);
      three->stages[2] = three->stages[1];
      three->n_stages = 3;
      g_assert_true (sw_size_design (three, &s3, NULL));
      g_assert_cmpint (s3.feasible, ==, curve.booster_points[2].feasible);
      if (fixed)
        {
          g_assert_true (s3.feasible);
          assert_rel (curve.booster_points[2].liftoff_mass_kg, s3.liftoff_mass_kg, 1e-9);
        }
      else
        {
          /* Sized, these boosters do not pay beside three stages: the
           * optimum gives them no propellant, which is no vehicle with
           * boosters (sw-booster-sizing.h), on the curve as in the sizing. */
          g_assert_false (s3.feasible);
          g_assert_true (s3.boosters.optimised_away);
          g_assert_nonnull (strstr (curve.booster_note, "At 3, 4, 5, 6 stages the sized boosters "
                                                        "are optimised away"));
        }

      /* The serial points stay those of the stages without boosters. */
      d->boosters.count = 0;
      sw_stage_curve_compute (d, 9300.0, 6, &serial);
      g_assert_cmpuint (serial.booster_count, ==, 0);
      g_assert_cmpstr (serial.booster_note, ==, "");
      for (guint k = 0; k < 6; k++)
        if (serial.points[k].feasible)
          assert_rel (curve.points[k].liftoff_mass_kg, serial.points[k].liftoff_mass_kg, 1e-12);
    }
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/core/curves/stage-curve-matches-sizing", test_stage_curve_matches_sizing);
  g_test_add_func ("/core/curves/stage-curve-all-infeasible", test_stage_curve_all_infeasible);
  g_test_add_func ("/core/curves/stage-curve-other-splits", test_stage_curve_other_splits);
  g_test_add_func ("/core/curves/stage-curve-clamps", test_stage_curve_clamps);
  g_test_add_func ("/core/curves/sweep", test_sweep);
  g_test_add_func ("/core/curves/sweep-extends-top-stage", test_sweep_extends_top_stage);
  g_test_add_func ("/core/curves/sweep-clamps", test_sweep_clamps);
  g_test_add_func ("/core/curves/fixed-load-note", test_fixed_load_note);
  g_test_add_func ("/core/curves/stage-curve-with-boosters", test_stage_curve_with_boosters);

  return g_test_run ();
}
