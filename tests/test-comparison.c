/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The current design against its pinned baseline (sw-comparison).  Check
 * values: Curtis, Orbital Mechanics for Engineering Students, sec. 11.6, as
 * recorded in /work/shared/reference-values.md, and hand arithmetic written
 * out beside each check. */
#include "config.h"

#include "sw-comparison.h"
#include "sw-design.h"
#include "sw-design-edit.h"

#include <math.h>
#include <string.h>

/* Curtis's worked example as a design: payload 5000 kg, delta-v 10 km/s,
 * Isp 400 / 350 / 300 s, eps 0.10 / 0.15 / 0.20, optimal split. */
static SwDesign *
example_design (void)
{
  static const double isp[] = { 400, 350, 300 }, eps[] = { 0.10, 0.15, 0.20 };
  SwDesign *d = sw_design_new_default ();

  d->payload_kg = 5000.0;
  d->mission.delta_v_m_s = 10000.0;
  d->split = SW_SPLIT_OPTIMAL;
  d->n_stages = 3;
  for (guint i = 0; i < 3; i++)
    {
      sw_stage_init_default (&d->stages[i], i);
      d->stages[i].isp_vac_s = isp[i];
      d->stages[i].has_isp_sl = FALSE;
      d->stages[i].structural_coefficient = eps[i];
    }
  return d;
}

static void
test_delta (void)
{
  SwDelta d;

  /* 110 against 100: +10, +10 %. */
  sw_delta_set (&d, 110.0, 100.0);
  g_assert_cmpfloat (d.current, ==, 110.0);
  g_assert_cmpfloat (d.baseline, ==, 100.0);
  g_assert_cmpfloat_with_epsilon (d.delta, 10.0, 1e-12);
  g_assert_cmpfloat_with_epsilon (d.percent, 10.0, 1e-12);
  /* 75 against 100: -25, -25 %. */
  sw_delta_set (&d, 75.0, 100.0);
  g_assert_cmpfloat_with_epsilon (d.delta, -25.0, 1e-12);
  g_assert_cmpfloat_with_epsilon (d.percent, -25.0, 1e-12);
  /* Percent of the baseline's size: 90 against -100 is +190, +190 %. */
  sw_delta_set (&d, 90.0, -100.0);
  g_assert_cmpfloat_with_epsilon (d.delta, 190.0, 1e-12);
  g_assert_cmpfloat_with_epsilon (d.percent, 190.0, 1e-12);
  /* A zero baseline has no percentage; a missing value no change at all. */
  sw_delta_set (&d, 5.0, 0.0);
  g_assert_cmpfloat (d.delta, ==, 5.0);
  g_assert_true (isnan (d.percent));
  sw_delta_set (&d, NAN, 100.0);
  g_assert_true (isnan (d.delta));
  g_assert_true (isnan (d.percent));
  sw_delta_set (&d, 100.0, INFINITY);
  g_assert_true (isnan (d.delta));
  g_assert_true (isnan (d.percent));
}

/* The totals of a sizing filled in by hand. */
static void
test_sizing_totals (void)
{
  SwSizing s;

  memset (&s, 0, sizeof s);
  s.feasible = TRUE;
  s.n_stages = 2;
  s.liftoff_mass_kg = 1165.0;
  s.payload_kg = 1000.0;
  s.payload_fraction = 1000.0 / 1165.0;
  s.delta_v_m_s = 4000.0;
  s.delta_v_limit_m_s = 9000.0;
  s.stages[0].propellant_mass_kg = 100.0;
  s.stages[0].structural_mass_kg = 10.0;
  s.stages[1].propellant_mass_kg = 50.0;
  s.stages[1].structural_mass_kg = 5.0;

  g_assert_cmpfloat (sw_sizing_total (&s, SW_TOTAL_LIFTOFF_MASS), ==, 1165.0);
  g_assert_cmpfloat (sw_sizing_total (&s, SW_TOTAL_PAYLOAD), ==, 1000.0);
  g_assert_cmpfloat (sw_sizing_total (&s, SW_TOTAL_PAYLOAD_FRACTION), ==, 1000.0 / 1165.0);
  g_assert_cmpfloat (sw_sizing_total (&s, SW_TOTAL_DELTA_V), ==, 4000.0);
  g_assert_cmpfloat (sw_sizing_total (&s, SW_TOTAL_DELTA_V_LIMIT), ==, 9000.0);
  g_assert_cmpfloat (sw_sizing_total (&s, SW_TOTAL_PROPELLANT), ==, 150.0);  /* 100 + 50 */
  g_assert_cmpfloat (sw_sizing_total (&s, SW_TOTAL_STRUCTURE), ==, 15.0);    /* 10 + 5 */
  g_assert_cmpfloat (sw_sizing_total (&s, SW_TOTAL_STAGE_COUNT), ==, 2.0);
  g_assert_true (isnan (sw_sizing_total (&s, SW_N_TOTALS)));

  /* Infeasible: no masses, but the inputs (payload, delta-v, limit, stage
   * count) still stand. */
  s.feasible = FALSE;
  g_assert_true (isnan (sw_sizing_total (&s, SW_TOTAL_LIFTOFF_MASS)));
  g_assert_true (isnan (sw_sizing_total (&s, SW_TOTAL_PAYLOAD_FRACTION)));
  g_assert_true (isnan (sw_sizing_total (&s, SW_TOTAL_PROPELLANT)));
  g_assert_true (isnan (sw_sizing_total (&s, SW_TOTAL_STRUCTURE)));
  g_assert_cmpfloat (sw_sizing_total (&s, SW_TOTAL_PAYLOAD), ==, 1000.0);
  g_assert_cmpfloat (sw_sizing_total (&s, SW_TOTAL_DELTA_V), ==, 4000.0);
  g_assert_cmpfloat (sw_sizing_total (&s, SW_TOTAL_DELTA_V_LIMIT), ==, 9000.0);
  g_assert_cmpfloat (sw_sizing_total (&s, SW_TOTAL_STAGE_COUNT), ==, 2.0);
}

/* Curtis's example against itself with half the payload.  Every stage mass
 * is proportional to the payload (Curtis: m_k = (n_k - 1)/(1 - n_k eps_k)
 * times everything above it, the n_k fixed by delta-v, c and eps alone), so
 * halving the payload halves every mass: liftoff 191,527 kg (g0 = 9.80665,
 * "computed" in reference-values.md) against 95,763.5 kg, +95,763.5 kg and
 * +100 %; the payload fraction and the delta-v are unchanged. */
static void
test_against_baseline (void)
{
  g_autoptr (SwDesign) d = example_design ();
  g_autoptr (GError) error = NULL;
  SwComparison c;
  const SwDelta *liftoff = &c.totals[SW_TOTAL_LIFTOFF_MASS];

  d->payload_kg = 2500.0;
  sw_design_pin_baseline (d);
  d->payload_kg = 5000.0;
  g_assert_true (sw_comparison_from_design (d, &c, &error));
  g_assert_no_error (error);
  g_assert_true (c.has_baseline);
  g_assert_true (c.current_feasible);
  g_assert_true (c.baseline_feasible);

  /* 191,527 is rounded to 1 kg: +-0.5 kg. */
  g_assert_cmpfloat_with_epsilon (liftoff->current, 191527.0, 0.5);
  g_assert_cmpfloat_with_epsilon (liftoff->baseline, 191527.0 / 2, 0.25);
  g_assert_cmpfloat_with_epsilon (liftoff->delta, 191527.0 / 2, 0.25);
  /* Proportionality is exact up to the optimiser's rounding (1e-9). */
  g_assert_cmpfloat_with_epsilon (liftoff->percent, 100.0, 1e-9);
  g_assert_cmpfloat_with_epsilon (c.totals[SW_TOTAL_PROPELLANT].percent, 100.0, 1e-9);
  g_assert_cmpfloat_with_epsilon (c.totals[SW_TOTAL_STRUCTURE].percent, 100.0, 1e-9);
  g_assert_cmpfloat (c.totals[SW_TOTAL_PAYLOAD].delta, ==, 2500.0);
  g_assert_cmpfloat_with_epsilon (c.totals[SW_TOTAL_PAYLOAD].percent, 100.0, 1e-12);
  g_assert_cmpfloat_with_epsilon (c.totals[SW_TOTAL_PAYLOAD_FRACTION].delta, 0.0, 1e-12);
  /* 5000 / 191,527 = 0.026106 (by hand). */
  g_assert_cmpfloat_with_epsilon (c.totals[SW_TOTAL_PAYLOAD_FRACTION].current, 0.026106, 1e-6);
  g_assert_cmpfloat (c.totals[SW_TOTAL_DELTA_V].delta, ==, 0.0);
  g_assert_cmpfloat (c.totals[SW_TOTAL_DELTA_V].percent, ==, 0.0);
  g_assert_cmpfloat (c.totals[SW_TOTAL_STAGE_COUNT].delta, ==, 0.0);
}

/* One stage fewer than the baseline: the stage count falls by 1 (-33.3 %),
 * the delta-v limit by the removed stage's c ln(1/eps) = 300 x 9.80665 x
 * ln 5 = 4734.96 m/s (by hand). */
static void
test_stage_removed (void)
{
  g_autoptr (SwDesign) d = example_design ();
  g_autoptr (GError) error = NULL;
  SwComparison c;

  sw_design_pin_baseline (d);
  g_assert_true (sw_design_remove_stage (d, 2));
  g_assert_true (sw_comparison_from_design (d, &c, &error));
  g_assert_cmpfloat (c.totals[SW_TOTAL_STAGE_COUNT].delta, ==, -1.0);
  g_assert_cmpfloat_with_epsilon (c.totals[SW_TOTAL_STAGE_COUNT].percent, -100.0 / 3, 1e-12);
  g_assert_cmpfloat_with_epsilon (c.totals[SW_TOTAL_DELTA_V_LIMIT].delta, -4734.96, 0.005);
}

static void
test_no_baseline_and_infeasible (void)
{
  g_autoptr (SwDesign) d = example_design ();
  g_autoptr (GError) error = NULL;
  SwComparison c;

  g_assert_true (sw_comparison_from_design (d, &c, &error));
  g_assert_false (c.has_baseline);
  g_assert_false (c.baseline_feasible);
  for (guint t = 0; t < SW_N_TOTALS; t++)
    {
      g_assert_true (isnan (c.totals[t].baseline));
      g_assert_true (isnan (c.totals[t].delta));
      g_assert_true (isnan (c.totals[t].percent));
    }

  /* The most the three stages can give is the sum of c ln(1/eps):
   * 400 x 9.80665 ln 10 + 350 x 9.80665 ln(1/0.15) + 300 x 9.80665 ln 5
   * = 9032.26 + 6511.54 + 4734.96 = 20,278.75 m/s (by hand).  Asking
   * 21 km/s makes the current design infeasible; its masses have no
   * change. */
  sw_design_pin_baseline (d);
  d->mission.delta_v_m_s = 21000.0;
  g_assert_true (sw_comparison_from_design (d, &c, &error));
  g_assert_true (c.has_baseline);
  g_assert_false (c.current_feasible);
  g_assert_true (c.baseline_feasible);
  g_assert_cmpfloat_with_epsilon (c.totals[SW_TOTAL_DELTA_V_LIMIT].current, 20278.75, 0.01);
  g_assert_true (isnan (c.totals[SW_TOTAL_LIFTOFF_MASS].current));
  g_assert_true (isnan (c.totals[SW_TOTAL_LIFTOFF_MASS].delta));
  g_assert_false (isnan (c.totals[SW_TOTAL_LIFTOFF_MASS].baseline));
  g_assert_cmpfloat (c.totals[SW_TOTAL_DELTA_V].delta, ==, 11000.0);
  g_assert_cmpfloat_with_epsilon (c.totals[SW_TOTAL_DELTA_V].percent, 110.0, 1e-12);

  /* A design that cannot be sized (an orbit the site cannot reach) is an
   * error naming why, not a comparison. */
  d->mission.kind = SW_MISSION_ORBIT;
  d->mission.altitude_km = 400.0;
  d->mission.inclination_deg = 10.0;
  d->mission.site_latitude_deg = 45.0;
  g_assert_false (sw_comparison_from_design (d, &c, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_VALUE);
  g_assert_nonnull (strstr (error->message, "cannot be reached"));
}

/* Labels and keys, written out literally (LANGUAGE=C). */
static void
test_labels_and_keys (void)
{
  static const char *const keys[] = {
    "liftoff_mass_kg", "payload_kg", "payload_fraction", "delta_v_m_s", "delta_v_limit_m_s",
    "propellant_mass_kg", "structural_mass_kg", "stages",
  };
  static const char *const labels[] = {
    "Liftoff mass", "Payload", "Payload fraction", "Required delta-v", "Delta-v limit",
    "Propellant", "Structure", "Stages",
  };

  G_STATIC_ASSERT (G_N_ELEMENTS (keys) == SW_N_TOTALS);
  for (guint t = 0; t < SW_N_TOTALS; t++)
    {
      g_assert_cmpstr (sw_total_key (t), ==, keys[t]);
      g_assert_cmpstr (sw_total_label (t), ==, labels[t]);
    }
  g_assert_cmpstr (sw_total_key (SW_N_TOTALS), ==, "");
  g_assert_cmpstr (sw_total_label (SW_N_TOTALS), ==, "");
}

int
main (int argc, char **argv)
{
  g_setenv ("LANGUAGE", "C", TRUE);
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/core/comparison/delta", test_delta);
  g_test_add_func ("/core/comparison/sizing-totals", test_sizing_totals);
  g_test_add_func ("/core/comparison/against-baseline", test_against_baseline);
  g_test_add_func ("/core/comparison/stage-removed", test_stage_removed);
  g_test_add_func ("/core/comparison/no-baseline-and-infeasible", test_no_baseline_and_infeasible);
  g_test_add_func ("/core/comparison/labels-and-keys", test_labels_and_keys);
  return g_test_run ();
}
