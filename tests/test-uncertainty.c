/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The optional "uncertainty" object of a design (sw-uncertainty): defaults,
 * reading, writing and checking, with every message and every saved text
 * written out literally.  The accepted ranges are the limits table's
 * (sw-limits.c: samples 100 to 1,000,000, seed 0 to 2^32 - 1 = 4294967295,
 * relative spreads 0 to 30 %, losses spreads 0 to 2000 m/s), given here as
 * literal numbers; the statistics of the draws are tested in
 * test-montecarlo.c. */
#include "config.h"

#include "sw-uncertainty.h"

#include <json-glib/json-glib.h>
#include <math.h>
#include <string.h>

static gboolean
load (const char *object_text, SwUncertainty *unc, GPtrArray *warnings, GError **error)
{
  g_autoptr (JsonParser) parser = json_parser_new ();
  g_autofree char *text = g_strdup_printf ("{ %s }", object_text);

  g_assert_true (json_parser_load_from_data (parser, text, -1, NULL));
  return sw_uncertainty_load_design (json_node_get_object (json_parser_get_root (parser)),
                                     "u.stagewright", "", unc, warnings, error);
}

static char *
save (const SwUncertainty *unc)
{
  g_autoptr (JsonBuilder) b = json_builder_new ();
  g_autoptr (JsonGenerator) gen = json_generator_new ();
  g_autoptr (JsonNode) root = NULL;

  json_builder_begin_object (b);
  sw_uncertainty_save_design (b, unc);
  json_builder_end_object (b);
  root = json_builder_get_root (b);
  json_generator_set_root (gen, root);
  return json_generator_to_data (gen, NULL);
}

static void
test_defaults (void)
{
  SwUncertainty u;

  memset (&u, 0xab, sizeof u);
  sw_uncertainty_init (&u);
  g_assert_false (u.present);
  g_assert_false (u.has_samples);
  g_assert_false (u.has_seed);
  g_assert_cmpuint (sw_uncertainty_samples (&u), ==, 10000);
  g_assert_cmpuint (sw_uncertainty_seed (&u), ==, 1);
  g_assert_cmpuint (sw_uncertainty_samples (NULL), ==, 10000);
  g_assert_cmpuint (sw_uncertainty_seed (NULL), ==, 1);
  g_assert_cmpint (u.isp.kind, ==, SW_SPREAD_NONE);
  g_assert_cmpint (u.structural_coefficient.kind, ==, SW_SPREAD_NONE);
  g_assert_cmpint (u.losses.kind, ==, SW_SPREAD_NONE);
  g_assert_false (sw_uncertainty_has_spread (&u));
  g_assert_false (sw_uncertainty_has_spread (NULL));

  /* A value stored without its flag is not in force. */
  u.samples = 500;
  u.seed = 7;
  g_assert_cmpuint (sw_uncertainty_samples (&u), ==, 10000);
  g_assert_cmpuint (sw_uncertainty_seed (&u), ==, 1);
  u.has_samples = u.has_seed = TRUE;
  g_assert_cmpuint (sw_uncertainty_samples (&u), ==, 500);
  g_assert_cmpuint (sw_uncertainty_seed (&u), ==, 7);

  /* A spread counts only with a kind and a width above zero, for each of
   * the three inputs. */
  u.isp = (SwSpread) { SW_SPREAD_NORMAL, 0.0 };
  g_assert_false (sw_uncertainty_has_spread (&u));
  u.structural_coefficient = (SwSpread) { SW_SPREAD_UNIFORM, 0.0 };
  g_assert_false (sw_uncertainty_has_spread (&u));
  u.losses = (SwSpread) { SW_SPREAD_NORMAL, 0.0 };
  g_assert_false (sw_uncertainty_has_spread (&u));
  u.structural_coefficient = u.losses = (SwSpread) { SW_SPREAD_NONE, 0.0 };
  u.isp = (SwSpread) { SW_SPREAD_NONE, 3.0 };
  g_assert_false (sw_uncertainty_has_spread (&u));
  u.isp = (SwSpread) { SW_SPREAD_UNIFORM, 0.5 };
  g_assert_true (sw_uncertainty_has_spread (&u));
  u.isp = (SwSpread) { SW_SPREAD_NONE, 0.0 };
  u.structural_coefficient = (SwSpread) { SW_SPREAD_NORMAL, 2.0 };
  g_assert_true (sw_uncertainty_has_spread (&u));
  u.structural_coefficient = (SwSpread) { SW_SPREAD_NONE, 0.0 };
  u.losses = (SwSpread) { SW_SPREAD_NORMAL, 100.0 };
  g_assert_true (sw_uncertainty_has_spread (&u));

  g_assert_cmpstr (sw_spread_kind_to_string (SW_SPREAD_NONE), ==, "none");
  g_assert_cmpstr (sw_spread_kind_to_string (SW_SPREAD_NORMAL), ==, "normal");
  g_assert_cmpstr (sw_spread_kind_to_string (SW_SPREAD_UNIFORM), ==, "uniform");
}

static void
test_load_and_save (void)
{
  SwUncertainty u;
  g_autoptr (GError) error = NULL;
  g_autoptr (GPtrArray) warnings = g_ptr_array_new_with_free_func (g_free);
  g_autofree char *text = NULL;

  /* Absent: the defaults, nothing saved. */
  g_assert_true (load ("\"payload_kg\": 1", &u, warnings, &error));
  g_assert_false (u.present);
  g_assert_cmpuint (sw_uncertainty_samples (&u), ==, 10000);
  text = save (&u);
  g_assert_cmpstr (text, ==, "{}");
  g_clear_pointer (&text, g_free);

  /* Every key. */
  g_assert_true (load ("\"uncertainty\": { \"samples\": 2000, \"seed\": 42,"
                       "  \"isp_vac\": { \"distribution\": \"normal\", \"sigma_percent\": 1.5 },"
                       "  \"structural_coefficient\": { \"distribution\": \"uniform\","
                       "                                \"half_range_percent\": 8 },"
                       "  \"losses\": { \"distribution\": \"normal\", \"sigma_m_s\": 150 } }",
                       &u, warnings, &error));
  g_assert_no_error (error);
  g_assert_cmpuint (warnings->len, ==, 0);
  g_assert_true (u.present);
  g_assert_cmpuint (sw_uncertainty_samples (&u), ==, 2000);
  g_assert_cmpuint (sw_uncertainty_seed (&u), ==, 42);
  g_assert_cmpint (u.isp.kind, ==, SW_SPREAD_NORMAL);
  g_assert_cmpfloat (u.isp.width, ==, 1.5);
  g_assert_cmpint (u.structural_coefficient.kind, ==, SW_SPREAD_UNIFORM);
  g_assert_cmpfloat (u.structural_coefficient.width, ==, 8.0);
  g_assert_cmpint (u.losses.kind, ==, SW_SPREAD_NORMAL);
  g_assert_cmpfloat (u.losses.width, ==, 150.0);
  g_assert_true (sw_uncertainty_validate (&u, "u.stagewright", "", &error));

  text = save (&u);
  g_assert_cmpstr (text, ==,
                   "{\"uncertainty\":{\"samples\":2000,\"seed\":42,"
                   "\"isp_vac\":{\"distribution\":\"normal\",\"sigma_percent\":1.5},"
                   "\"structural_coefficient\":{\"distribution\":\"uniform\","
                   "\"half_range_percent\":8.0},"
                   "\"losses\":{\"distribution\":\"normal\",\"sigma_m_s\":150.0}}}");
  g_clear_pointer (&text, g_free);

  /* An empty object is kept (present) and saved as such; the uniform
   * losses key is the half range in m/s. */
  g_assert_true (load ("\"uncertainty\": { \"losses\": { \"distribution\": \"uniform\","
                       "  \"half_range_m_s\": 2000 } }", &u, warnings, &error));
  g_assert_true (u.present);
  g_assert_false (u.has_samples);
  text = save (&u);
  g_assert_cmpstr (text, ==,
                   "{\"uncertainty\":{\"losses\":{\"distribution\":\"uniform\","
                   "\"half_range_m_s\":2000.0}}}");
  g_clear_pointer (&text, g_free);

  /* Range ends inside: 100 and 1,000,000 samples; seeds 0 and 2^32 - 1;
   * 30 % spreads. */
  g_assert_true (load ("\"uncertainty\": { \"samples\": 100, \"seed\": 0 }", &u, NULL, &error));
  g_assert_cmpuint (sw_uncertainty_samples (&u), ==, 100);
  g_assert_true (u.has_seed);
  g_assert_cmpuint (sw_uncertainty_seed (&u), ==, 0);
  g_assert_true (load ("\"uncertainty\": { \"samples\": 1000000, \"seed\": 4294967295,"
                       "  \"isp_vac\": { \"distribution\": \"uniform\", \"half_range_percent\": 30 },"
                       "  \"structural_coefficient\": { \"distribution\": \"normal\","
                       "                                \"sigma_percent\": 30 } }",
                       &u, NULL, &error));
  g_assert_no_error (error);
  g_assert_cmpuint (sw_uncertainty_samples (&u), ==, 1000000);
  g_assert_cmpuint (sw_uncertainty_seed (&u), ==, 4294967295u);
  g_assert_true (sw_uncertainty_validate (&u, NULL, "", &error));

  /* Unknown keys: a warning each, with the path. */
  g_assert_true (load ("\"uncertainty\": { \"sampels\": 10,"
                       "  \"losses\": { \"distribution\": \"normal\", \"sigma_m_s\": 1,"
                       "               \"mean\": 0 } }", &u, warnings, &error));
  g_assert_cmpuint (warnings->len, ==, 2);
  g_assert_cmpstr (warnings->pdata[0], ==,
                   "u.stagewright: uncertainty.sampels: unknown key, ignored (it will not be "
                   "saved)");
  g_assert_cmpstr (warnings->pdata[1], ==,
                   "u.stagewright: uncertainty.losses.mean: unknown key, ignored (it will not "
                   "be saved)");
}

static void
test_load_errors (void)
{
  static const struct { const char *json, *message; gint code; } cases[] = {
    { "\"uncertainty\": []",
      "u.stagewright: uncertainty: expected an object, found an array", SW_ERROR_TYPE },
    { "\"uncertainty\": { \"samples\": 99 }",
      "u.stagewright: uncertainty.samples: 99 is outside the accepted range 100 to 1000000 "
      "(whole number; fewer than 100 give no percentiles worth reading, a million is plenty)",
      SW_ERROR_RANGE },
    { "\"uncertainty\": { \"samples\": 1000001 }",
      "u.stagewright: uncertainty.samples: 1000001 is outside the accepted range 100 to 1000000 "
      "(whole number; fewer than 100 give no percentiles worth reading, a million is plenty)",
      SW_ERROR_RANGE },
    { "\"uncertainty\": { \"samples\": 2000.5 }",
      "u.stagewright: uncertainty.samples: 2000.5 is not a whole number", SW_ERROR_VALUE },
    { "\"uncertainty\": { \"seed\": 4294967296 }",
      "u.stagewright: uncertainty.seed: 4294967296 is outside the accepted range 0 to 4294967295 "
      "(whole number that fixes the random stream, so a run can be repeated)", SW_ERROR_RANGE },
    { "\"uncertainty\": { \"seed\": -1 }",
      "u.stagewright: uncertainty.seed: -1 is outside the accepted range 0 to 4294967295 "
      "(whole number that fixes the random stream, so a run can be repeated)", SW_ERROR_RANGE },
    { "\"uncertainty\": { \"isp_vac\": { \"sigma_percent\": 1 } }",
      "u.stagewright: uncertainty.isp_vac.distribution: required text is missing (\"normal\" "
      "or \"uniform\")", SW_ERROR_MISSING },
    { "\"uncertainty\": { \"isp_vac\": { \"distribution\": \"gaussian\", \"sigma_percent\": 1 } }",
      "u.stagewright: uncertainty.isp_vac.distribution: \"gaussian\" is not a distribution; use "
      "\"normal\" or \"uniform\"", SW_ERROR_VALUE },
    { "\"uncertainty\": { \"isp_vac\": { \"distribution\": \"normal\" } }",
      "u.stagewright: uncertainty.isp_vac.sigma_percent: required number is missing",
      SW_ERROR_MISSING },
    { "\"uncertainty\": { \"structural_coefficient\": { \"distribution\": \"uniform\","
      "  \"sigma_percent\": 1 } }",
      "u.stagewright: uncertainty.structural_coefficient.sigma_percent: does not belong to a "
      "uniform distribution; give half_range_percent instead", SW_ERROR_VALUE },
    { "\"uncertainty\": { \"losses\": { \"distribution\": \"normal\", \"sigma_percent\": 1 } }",
      "u.stagewright: uncertainty.losses.sigma_m_s: required number is missing",
      SW_ERROR_MISSING },
    { "\"uncertainty\": { \"losses\": { \"distribution\": \"normal\", \"sigma_m_s\": 2000.5 } }",
      "u.stagewright: uncertainty.losses.sigma_m_s: 2000.5 is outside the accepted range 0 to "
      "2000 m/s (standard deviation of the losses (a normal spread on the required delta-v))",
      SW_ERROR_RANGE },
    { "\"uncertainty\": { \"isp_vac\": { \"distribution\": \"uniform\","
      "  \"half_range_percent\": 30.01 } }",
      "u.stagewright: uncertainty.isp_vac.half_range_percent: 30.01 is outside the accepted range "
      "0 to 30 % (half width of a uniform spread (nominal plus or minus), in percent of the "
      "nominal value)", SW_ERROR_RANGE },
    { "\"uncertainty\": { \"isp_vac\": { \"distribution\": 1, \"sigma_percent\": 1 } }",
      "u.stagewright: uncertainty.isp_vac.distribution: expected text, found a number",
      SW_ERROR_TYPE },
  };

  for (guint k = 0; k < G_N_ELEMENTS (cases); k++)
    {
      g_autoptr (GError) error = NULL;
      SwUncertainty u;

      g_assert_false (load (cases[k].json, &u, NULL, &error));
      g_assert_error (error, SW_ERROR, cases[k].code);
      g_assert_cmpstr (error->message, ==, cases[k].message);
    }
}

/* A design edited in memory is checked with the same ranges and paths. */
static void
test_validate (void)
{
  SwUncertainty u;
  g_autoptr (GError) error = NULL;

  sw_uncertainty_init (&u);
  /* Not present: nothing is checked. */
  u.samples = 5;
  u.has_samples = TRUE;
  g_assert_true (sw_uncertainty_validate (&u, NULL, "", &error));

  u.present = TRUE;
  g_assert_false (sw_uncertainty_validate (&u, NULL, "", &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_RANGE);
  g_assert_true (g_str_has_prefix (error->message,
                                   "(design): uncertainty.samples: 5 is outside the accepted "
                                   "range 100 to 1000000"));
  g_clear_error (&error);

  u.samples = 100;
  u.structural_coefficient = (SwSpread) { SW_SPREAD_NORMAL, 31.0 };
  g_assert_false (sw_uncertainty_validate (&u, NULL, "baseline", &error));
  g_assert_true (g_str_has_prefix (error->message,
                                   "(design): baseline.uncertainty.structural_coefficient."
                                   "sigma_percent: 31 is outside"));
  g_clear_error (&error);

  u.structural_coefficient = (SwSpread) { SW_SPREAD_NORMAL, 30.0 };
  u.losses = (SwSpread) { SW_SPREAD_UNIFORM, NAN };
  g_assert_false (sw_uncertainty_validate (&u, "f", "", &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_NOT_FINITE);
  g_assert_cmpstr (error->message, ==,
                   "f: uncertainty.losses.half_range_m_s: the value is not a finite number");
  g_clear_error (&error);

  u.losses = (SwSpread) { SW_SPREAD_UNIFORM, 0.0 };
  g_assert_true (sw_uncertainty_validate (&u, "f", "", &error));
}

int
main (int argc, char **argv)
{
  g_setenv ("LANGUAGE", "C", TRUE);
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/core/uncertainty/defaults", test_defaults);
  g_test_add_func ("/core/uncertainty/load-and-save", test_load_and_save);
  g_test_add_func ("/core/uncertainty/load-errors", test_load_errors);
  g_test_add_func ("/core/uncertainty/validate", test_validate);
  return g_test_run ();
}
