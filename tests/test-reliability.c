/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Tests of the reliability model against hand-worked binomial values. */
#include "config.h"

#include "sw-design.h"
#include "sw-reliability.h"

#include <gsl/gsl_cdf.h>
#include <math.h>
#include <string.h>

/* Hand-worked example (binomial distribution, e.g. any probability textbook:
 * P(X <= f) = sum_{k=0}^{f} C(n,k) q^k r^(n-k), q = 1 - r), worked by hand:
 *   nine engines, r = 0.995, one failure tolerated:
 *     r^8 = exp(8 ln 0.995) = exp(-0.0401003346) = 0.9606930436
 *     r^9 = 0.995 r^8                             = 0.9558895784
 *     9 r^8 q = 9 x 0.9606930436 x 0.005          = 0.0432311870
 *     P = r^9 + 9 r^8 q                           = 0.9991207653
 *   three engines, r = 0.9, one tolerated:  0.9^3 + 3 (0.9^2)(0.1) = 0.729 + 0.243 = 0.972
 *   four engines, r = 0.9, two tolerated:   1 - C(4,3) 0.1^3 0.9 - 0.1^4
 *                                           = 1 - 0.0036 - 0.0001 = 0.9963
 *   one engine, r = 0.98, none tolerated:   0.98 */
static void
test_binomial_hand_worked (void)
{
  g_assert_cmpfloat_with_epsilon (sw_reliability_engines (9, 0.995, 1), 0.9991207653, 1e-10);
  g_assert_cmpfloat_with_epsilon (sw_reliability_engines (3, 0.9, 1), 0.972, 1e-12);
  g_assert_cmpfloat_with_epsilon (sw_reliability_engines (4, 0.9, 2), 0.9963, 1e-12);
  g_assert_cmpfloat_with_epsilon (sw_reliability_engines (1, 0.98, 0), 0.98, 1e-12);
  /* No failure tolerated: all n must run, r^n (the product rule). */
  g_assert_cmpfloat_with_epsilon (sw_reliability_engines (5, 0.99, 0), pow (0.99, 5), 1e-12);
  /* Tolerating one engine out of a cluster beats a single engine of the same
   * reliability (common practice: the engine-out argument for clusters). */
  g_assert_cmpfloat (sw_reliability_engines (9, 0.995, 1), >, 0.995);
  /* Without tolerance more engines are worse (common practice). */
  g_assert_cmpfloat (sw_reliability_engines (9, 0.995, 0), <, 0.995);
}

/* Every cluster against GSL's binomial distribution: at most f of n engines
 * fail, each with probability q = 1 - r, is gsl_cdf_binomial_P (f, q, n). */
static void
test_binomial_against_gsl (void)
{
  static const double rs[] = { 0.9, 0.97, 0.995, 0.9999 };

  for (guint k = 0; k < G_N_ELEMENTS (rs); k++)
    for (guint n = 1; n <= 30; n++)
      for (guint f = 0; f < n; f++)
        {
          double want = gsl_cdf_binomial_P (f, 1.0 - rs[k], n);
          double got = sw_reliability_engines (n, rs[k], f);
          if (!(fabs (got - want) <= 1e-12))
            g_error ("%u engines, r = %g, %u tolerated: %.15g, GSL %.15g", n, rs[k], f, got,
                     want);
        }
}

static const char *design_json =
  "{ \"format\": \"stagewright-design\", \"version\": 1, \"name\": \"rel\",\n"
  "  \"payload_kg\": 1000, \"mission\": { \"delta_v_m_s\": 9000 }, \"split\": \"optimal\",\n"
  "  \"stages\": [\n"
  "    { \"name\": \"A\", \"isp_vac_s\": 320, \"structural_coefficient\": 0.07,\n"
  "      \"engine_count\": 9, \"engine_reliability\": 0.995, \"engine_failures_tolerated\": 1,\n"
  "      \"ignition_reliability\": 0.999, \"separation_reliability\": 0.9995 },\n"
  "    { \"name\": \"B\", \"isp_vac_s\": 345, \"structural_coefficient\": 0.09,\n"
  "      \"engine_count\": 1, \"engine_reliability\": 0.993, \"ignition_reliability\": 0.998,\n"
  "      \"separation_reliability\": 0.9995 },\n"
  "    { \"name\": \"C\", \"isp_vac_s\": 325, \"structural_coefficient\": 0.14,\n"
  "      \"engine_reliability\": 0.996, \"ignition_reliability\": 0.997 } ] }";

static SwDesign *
load (const char *json, GError **error)
{
  return sw_design_load_data (json, -1, "test.stagewright", NULL, error);
}

/* Mission success, worked by hand from the example above:
 *   stage 1: 0.999 x 0.9991207653 = 0.9981216446
 *   stage 2: 0.998 x 0.993        = 0.991014
 *   stage 3: 0.997 x 0.996        = 0.993012
 *   events:  0.9995 x 0.9995 (two separations; the top stage has none)
 *   product:                        0.9812583309 */
static void
test_mission_hand_worked (void)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) d = load (design_json, &error);
  SwReliability r;

  g_assert_no_error (error);
  sw_reliability_from_design (d, &r);
  g_assert_true (r.given);
  g_assert_cmpuint (r.n_stages, ==, 3);
  g_assert_cmpfloat_with_epsilon (r.stage[0], 0.9981216446, 1e-10);
  g_assert_cmpfloat_with_epsilon (r.stage[1], 0.991014, 1e-12);
  g_assert_cmpfloat_with_epsilon (r.stage[2], 0.993012, 1e-12);
  g_assert_cmpfloat (r.separation[2], ==, 1.0);
  g_assert_cmpfloat_with_epsilon (r.mission, 0.9812583309, 1e-10);
}

/* The stage-count rule: the 5-stage vehicle has stages A, B, C, C, C and the
 * events above A, B, C, C; C gives no separation key, so 1.  By hand:
 * 0.9981216446 x 0.991014 x 0.993012^3 x 0.9995^2 = 0.9675921814. */
static void
test_curve_rule (void)
{
  g_autoptr (SwDesign) d = load (design_json, NULL);
  SwReliabilityCurve c;

  sw_reliability_curve_compute (d, SW_MAX_STAGES, &c);
  g_assert_true (c.given);
  g_assert_cmpuint (c.n_points, ==, SW_MAX_STAGES);
  g_assert_cmpfloat_with_epsilon (c.mission[0], 0.9981216446, 1e-10);
  g_assert_cmpfloat_with_epsilon (c.mission[2], 0.9812583309, 1e-10);
  g_assert_cmpfloat_with_epsilon (c.mission[4], 0.9675921814, 1e-10);
  /* Each added stage with reliability below 1 lowers the success (the cost
   * of staging, common practice). */
  for (guint n = 1; n < c.n_points; n++)
    g_assert_cmpfloat (c.mission[n], <, c.mission[n - 1]);
}

static void
test_no_keys_is_perfect (void)
{
  g_autoptr (SwDesign) d = sw_design_new_default ();
  SwReliability r;

  sw_reliability_from_design (d, &r);
  g_assert_false (r.given);
  g_assert_cmpfloat (r.mission, ==, 1.0);
}

static void
test_round_trip (void)
{
  g_autoptr (SwDesign) d = load (design_json, NULL);
  g_autoptr (SwDesign) again = NULL;
  g_autoptr (GError) error = NULL;
  g_autofree char *data = sw_design_to_data (d, NULL);

  g_assert_nonnull (strstr (data, "\"engine_failures_tolerated\" : 1"));
  again = load (data, &error);
  g_assert_no_error (error);
  g_assert_true (sw_design_equal (d, again));
  g_assert_false (again->stages[2].reliability.has_engine_count);
}

static void
expect_error (const char *from, const char *to, const char *needle)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (GString) json = g_string_new (design_json);
  g_autoptr (SwDesign) d = NULL;

  g_assert_cmpint (g_string_replace (json, from, to, 1), ==, 1);
  d = load (json->str, &error);
  g_assert_null (d);
  g_assert_nonnull (error);
  if (strstr (error->message, needle) == NULL)
    g_error ("expected \"%s\" in: %s", needle, error->message);
  g_assert_nonnull (strstr (error->message, "test.stagewright"));
}

static void
test_bad_input (void)
{
  expect_error ("\"engine_reliability\": 0.995", "\"engine_reliability\": 1.5",
                "stages[0].engine_reliability: 1.5 is outside");
  expect_error ("\"engine_count\": 9", "\"engine_count\": 2.5",
                "stages[0].engine_count: 2.5 is not a whole number");
  expect_error ("\"engine_failures_tolerated\": 1", "\"engine_failures_tolerated\": 9",
                "stages[0].engine_failures_tolerated: 9 failures tolerated with 9 engine");
  expect_error ("\"ignition_reliability\": 0.998", "\"ignition_reliability\": \"high\"",
                "stages[1].ignition_reliability: expected a number");
  expect_error ("\"separation_reliability\": 0.9995 },\n    { \"name\": \"B\"",
                "\"separation_reliability\": 0.2 },\n    { \"name\": \"B\"",
                "stages[0].separation_reliability: 0.2 is outside");
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/core/reliability/binomial-hand-worked", test_binomial_hand_worked);
  g_test_add_func ("/core/reliability/binomial-gsl", test_binomial_against_gsl);
  g_test_add_func ("/core/reliability/mission-hand-worked", test_mission_hand_worked);
  g_test_add_func ("/core/reliability/curve-rule", test_curve_rule);
  g_test_add_func ("/core/reliability/no-keys", test_no_keys_is_perfect);
  g_test_add_func ("/core/reliability/round-trip", test_round_trip);
  g_test_add_func ("/core/reliability/bad-input", test_bad_input);
  return g_test_run ();
}
