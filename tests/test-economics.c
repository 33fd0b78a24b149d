/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Tests of the optional "economics" keys: reading, defaults, saving and
 * reading back, and errors that name the file, the path and the range. */
#include "config.h"

#include "sw-design.h"
#include "sw-design-fields.h"
#include "sw-economics.h"

#include <math.h>
#include <string.h>

#define HEAD "{ \"format\": \"stagewright-design\", \"version\": 1, \"name\": \"econ\",\n" \
             "  \"payload_kg\": 1000, \"mission\": { \"delta_v_m_s\": 9000 },\n" \
             "  \"split\": \"optimal\", \"stages\": [\n" \
             "    { \"isp_vac_s\": 300, \"structural_coefficient\": 0.07 },\n" \
             "    { \"isp_vac_s\": 340, \"structural_coefficient\": 0.09 },\n" \
             "    { \"isp_vac_s\": 340, \"structural_coefficient\": 0.1 } ]"

static const char *full_json = HEAD ",\n"
  "  \"economics\": { \"work_year_cost\": 250000, \"currency\": \"k€\", \"production_run\": 40,\n"
  "    \"learning_rate\": 0.85,\n"
  "    \"cost_coefficients\": { \"stage_development_factor\": 90, \"engine_unit_exponent\": 0.5 },\n"
  "    \"engine_types\": [ { \"name\": \"Lower\", \"dry_mass_kg\": 1100, \"on_stages\": [0] },\n"
  "                        { \"name\": \"Upper\", \"dry_mass_kg\": 400, \"on_stages\": [1, 2],\n"
  "                          \"developed\": true } ],\n"
  "    \"developed_stages\": [2], \"developed_boosters\": true, \"engine_mass_fraction\": 0.3,\n"
  "    \"recovery\": { \"mode\": \"launch_site\", \"recovery_delta_v_m_s\": 2500,\n"
  "                  \"landing_hardware_fraction\": 0.12, \"refurbishment_fraction\": 0.05,\n"
  "                  \"flights_per_stage\": 15 },\n"
  "    \"decision_weights\": { \"liftoff_mass\": 0.5, \"failure\": 3 } } }";

static SwDesign *
load (const char *json, GPtrArray *warnings, GError **error)
{
  return sw_design_load_data (json, -1, "econ.stagewright", warnings, error);
}

static void
test_defaults (void)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) d = load (HEAD " }", NULL, &error);
  const SwEconomics *e;

  g_assert_no_error (error);
  e = &d->economics;
  g_assert_false (e->present);
  g_assert_cmpuint (e->production_run, ==, 10);
  g_assert_cmpfloat (e->learning_rate, ==, 0.9);
  /* The published-form table, coefficients from memory (reference notes,
   * "Cost-estimating relationships"). */
  g_assert_cmpfloat (e->coefficients[SW_CER_STAGE_DEV_FACTOR], ==, 100.0);
  g_assert_cmpfloat (e->coefficients[SW_CER_STAGE_DEV_EXPONENT], ==, 0.555);
  g_assert_cmpfloat (e->coefficients[SW_CER_ENGINE_DEV_FACTOR], ==, 277.0);
  g_assert_cmpfloat (e->coefficients[SW_CER_SYSTEMS_BASE], ==, 1.04);
  for (guint i = 0; i < SW_N_CER; i++)
    g_assert_nonnull (strstr (sw_cer_info (i)->provenance, "published form"));
  g_assert_nonnull (strstr (sw_cer_info (SW_CER_STAGE_UNIT_FACTOR)->provenance, "from memory"));
  g_assert_cmpint (e->recovery_mode, ==, SW_RECOVERY_NONE);
  g_assert_cmpfloat (sw_economics_recovery_delta_v (e), ==, 0.0);
  g_assert_cmpint (sw_economics_engine_type_of_stage (e, 0), ==, -1);
}

static void
test_load_and_round_trip (void)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (GPtrArray) warnings = g_ptr_array_new_with_free_func (g_free);
  g_autoptr (SwDesign) d = load (full_json, warnings, &error);
  g_autoptr (SwDesign) back = NULL;
  g_autofree char *data = NULL;
  const SwEconomics *e;
  gsize len;

  g_assert_no_error (error);
  g_assert_cmpuint (warnings->len, ==, 0);
  e = &d->economics;
  g_assert_true (e->present);
  g_assert_cmpfloat (e->work_year_cost, ==, 250000.0);
  g_assert_cmpstr (e->currency, ==, "k€");
  g_assert_cmpstr (sw_economics_currency_label (e), ==, "k€");
  g_assert_cmpuint (e->production_run, ==, 40);
  g_assert_cmpfloat (e->coefficients[SW_CER_STAGE_DEV_FACTOR], ==, 90.0);
  g_assert_cmpfloat (e->coefficients[SW_CER_STAGE_DEV_EXPONENT], ==, 0.555);
  g_assert_cmpfloat (e->coefficients[SW_CER_ENGINE_UNIT_EXPONENT], ==, 0.5);
  g_assert_cmpuint (e->n_engine_types, ==, 2);
  g_assert_cmpstr (e->engine_types[1].name, ==, "Upper");
  g_assert_true (e->engine_types[1].developed);
  g_assert_cmpint (sw_economics_engine_type_of_stage (e, 0), ==, 0);
  g_assert_cmpint (sw_economics_engine_type_of_stage (e, 2), ==, 1);
  g_assert_cmpuint (e->developed_stages, ==, 0x4);
  g_assert_true (e->developed_boosters);
  g_assert_cmpint (e->recovery_mode, ==, SW_RECOVERY_LAUNCH_SITE);
  g_assert_cmpfloat (sw_economics_recovery_delta_v (e), ==, 2500.0);
  g_assert_cmpuint (e->flights_per_stage, ==, 15);
  g_assert_cmpfloat (e->weight_liftoff_mass, ==, 0.5);
  g_assert_cmpfloat (e->weight_development, ==, 1.0);
  g_assert_cmpfloat (e->weight_failure, ==, 3.0);

  data = sw_design_to_data (d, &len);
  back = load (data, NULL, &error);
  g_assert_no_error (error);
  g_assert_true (sw_design_equal (d, back));
  /* A design without the object saves without it. */
  {
    g_autoptr (SwDesign) plain = load (HEAD " }", NULL, NULL);
    g_autofree char *text = sw_design_to_data (plain, &len);
    g_assert_null (strstr (text, "economics"));
  }
}

static void
expect_error (const char *economics, const char *message)
{
  g_autofree char *json = g_strdup_printf (HEAD ", \"economics\": %s }", economics);
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) d = load (json, NULL, &error);

  g_assert_null (d);
  g_assert_nonnull (error);
  if (strstr (error->message, message) == NULL || !g_str_has_prefix (error->message, "econ.stagewright: "))
    g_error ("expected \"%s\" in \"%s\"", message, error->message);
}

static void
test_errors (void)
{
  expect_error ("[]", "economics: expected an object");
  expect_error ("{ \"production_run\": 2.5 }", "economics.production_run: 2.5 is not a whole number");
  expect_error ("{ \"learning_rate\": 1.2 }",
                "economics.learning_rate: 1.2 is outside the accepted range 0.5 to 1");
  expect_error ("{ \"engine_types\": [ { \"on_stages\": [0] } ] }",
                "economics.engine_types[0].dry_mass_kg: required number is missing");
  expect_error ("{ \"engine_types\": [ { \"dry_mass_kg\": 100, \"on_stages\": [3] } ] }",
                "economics.engine_types[0].on_stages: names a stage the design does not have "
                "(it has 3, numbered from 0)");
  expect_error ("{ \"engine_types\": [ { \"dry_mass_kg\": 100, \"on_stages\": [0] },"
                " { \"dry_mass_kg\": 50, \"on_stages\": [1, 0] } ] }",
                "economics.engine_types[1].on_stages: a stage already uses another engine type");
  expect_error ("{ \"developed_boosters\": 1 }",
                "economics.developed_boosters: expected true or false, found a number");
  expect_error ("{ \"developed_stages\": [\"first\"] }",
                "economics.developed_stages[0]: expected a stage index, found a string");
  expect_error ("{ \"recovery\": { \"mode\": \"parachute\" } }",
                "economics.recovery.mode: \"parachute\" is not a recovery mode");
  expect_error ("{ \"decision_weights\": { \"failure\": -1 } }",
                "economics.decision_weights.failure: -1 is outside the accepted range 0 to 100");
  expect_error ("{ \"currency\": [\"EUR\"] }", "economics.currency: expected text, found an array");
  /* Sixteen characters pass (the limit counts characters, not bytes). */
  expect_error ("{ \"currency\": \"€€€€€€€€€€€€€€€€€\" }",
                "economics.currency: the label is 17 characters long; at most 16 are accepted");
  expect_error ("{ \"currency\": \"EUR\\t\" }",
                "economics.currency: the label holds a control character");
  expect_error ("{ \"engine_types\": [ { \"dry_mass_kg\": 100, \"developed\": 1 } ] }",
                "economics.engine_types[0].developed: expected true or false, found a number");
}

static void
test_unknown_keys_warn (void)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (GPtrArray) warnings = g_ptr_array_new_with_free_func (g_free);
  g_autoptr (SwDesign) d = load (HEAD ", \"economics\": { \"budget\": 1,"
                                 " \"recovery\": { \"legs\": 4 } } }", warnings, &error);

  g_assert_no_error (error);
  g_assert_cmpuint (warnings->len, ==, 2);
}

/* The named edits: every numeric key set to a value inside its range is
 * saved and read back; outside its range nothing changes. */
static void
test_named_edits (void)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) d = load (HEAD " }", NULL, &error);

  g_assert_no_error (error);
  for (guint k = 0; k < SW_N_ECON_NUMBERS; k++)
    {
      const SwLimit *l = sw_limit_get (sw_economics_number_limit (k));
      double v = l->min + 0.37 * (l->max - l->min);
      g_autoptr (SwDesign) back = NULL;
      g_autofree char *data = NULL;
      gsize len;
      SwEconomics before;

      if (sw_economics_number_is_whole (k))
        v = round (v);
      g_assert_true (sw_economics_set_number (&d->economics, k, v));
      g_assert_true (d->economics.present);
      g_assert_cmpfloat (sw_economics_get_number (&d->economics, k), ==, v);
      data = sw_design_to_data (d, &len);
      g_assert_nonnull (strstr (data, strrchr (sw_economics_number_path (k), '.') != NULL
                                        ? strrchr (sw_economics_number_path (k), '.') + 1
                                        : sw_economics_number_path (k)));
      back = load (data, NULL, &error);
      g_assert_no_error (error);
      g_assert_cmpfloat (sw_economics_get_number (&back->economics, k), ==, v);
      before = d->economics;
      g_assert_false (sw_economics_set_number (&d->economics, k, l->max * 2.0 + 1.0));
      g_assert_true (memcmp (&before, &d->economics, sizeof before) == 0);
    }
  sw_economics_set_recovery_mode (&d->economics, SW_RECOVERY_LAUNCH_SITE);
  g_assert_cmpint (d->economics.recovery_mode, ==, SW_RECOVERY_LAUNCH_SITE);

  /* The boosters already developed: refused without boosters, then set,
   * saved and read back; false leaves the key out. */
  {
    g_autoptr (SwDesign) back = NULL;
    g_autofree char *data = NULL, *plain = NULL;
    gsize len;

    g_assert_false (sw_design_set_boosters_developed (d, TRUE, &error));
    g_assert_nonnull (error);
    g_assert_nonnull (strstr (error->message, "economics.developed_boosters"));
    g_clear_error (&error);
    g_assert_false (d->economics.developed_boosters);
    plain = sw_design_to_data (d, &len);
    g_assert_null (strstr (plain, "developed_boosters"));
    g_assert_true (sw_design_field_set (d, SW_FIELD_THRUST_VAC, 0, 2000.0, NULL));
    g_assert_true (sw_design_field_set (d, SW_FIELD_BOOSTER_COUNT, 0, 2.0, NULL));
    g_assert_true (sw_design_set_boosters_developed (d, TRUE, &error));
    g_assert_no_error (error);
    data = sw_design_to_data (d, &len);
    g_assert_nonnull (strstr (data, "\"developed_boosters\" : true"));
    back = load (data, NULL, &error);
    g_assert_no_error (error);
    g_assert_true (back->economics.developed_boosters);
    g_assert_true (sw_design_set_boosters_developed (d, FALSE, NULL));
    g_assert_false (d->economics.developed_boosters);
  }

  /* The boosters' recovery mode: its own named edit, saved and read back;
   * expendable boosters leave the key out of the file. */
  {
    g_autoptr (SwDesign) back = NULL;
    g_autofree char *data = NULL, *plain = NULL;
    gsize len;

    sw_economics_set_booster_recovery_mode (&d->economics, SW_RECOVERY_NONE);
    plain = sw_design_to_data (d, &len);
    g_assert_null (strstr (plain, "\"booster_mode\""));
    sw_economics_set_booster_recovery_mode (&d->economics, SW_RECOVERY_LAUNCH_SITE);
    g_assert_cmpint (d->economics.booster_recovery_mode, ==, SW_RECOVERY_LAUNCH_SITE);
    /* The first stage's mode is its own. */
    g_assert_cmpint (d->economics.recovery_mode, ==, SW_RECOVERY_LAUNCH_SITE);
    sw_economics_set_recovery_mode (&d->economics, SW_RECOVERY_NONE);
    g_assert_cmpint (d->economics.booster_recovery_mode, ==, SW_RECOVERY_LAUNCH_SITE);
    data = sw_design_to_data (d, &len);
    g_assert_nonnull (strstr (data, "\"booster_mode\" : \"launch_site\""));
    back = load (data, NULL, &error);
    g_assert_no_error (error);
    g_assert_cmpint (back->economics.booster_recovery_mode, ==, SW_RECOVERY_LAUNCH_SITE);
    g_assert_cmpint (back->economics.recovery_mode, ==, SW_RECOVERY_NONE);
  }
}

/* The currency label's named edit: up to 16 characters (UTF-8, not bytes),
 * saved and read back, equal designs compare equal; too long or with a
 * line break, refused with the key named and nothing changed; "" leaves
 * it out and the neutral label applies. */
static void
test_currency (void)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) d = load (HEAD " }", NULL, &error);
  g_autoptr (SwDesign) other = NULL;
  g_autoptr (SwDesign) back = NULL;
  g_autofree char *data = NULL;
  SwEconomics before;
  gsize len;

  g_assert_no_error (error);
  g_assert_cmpstr (sw_economics_currency_label (&d->economics), ==, "money units");
  g_assert_true (sw_economics_set_currency (&d->economics, "longer label one", NULL));
  g_assert_true (sw_economics_set_currency (&d->economics, "€€€€€€€€€€€€€€€€", &error));
  g_assert_no_error (error);
  g_assert_true (d->economics.present);
  data = sw_design_to_data (d, &len);
  g_assert_nonnull (strstr (data, "\"currency\" : \"€€€€€€€€€€€€€€€€\""));
  back = load (data, NULL, &error);
  g_assert_no_error (error);
  g_assert_true (sw_design_equal (d, back));
  /* The same label set on another copy by the edit: equal. */
  other = load (HEAD " }", NULL, NULL);
  g_assert_true (sw_economics_set_currency (&other->economics, "€€€€€€€€€€€€€€€€", NULL));
  g_assert_true (sw_design_equal (d, other));

  before = d->economics;
  g_assert_false (sw_economics_set_currency (&d->economics, "€€€€€€€€€€€€€€€€€", &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_RANGE);
  g_assert_cmpstr (error->message, ==,
                   "economics.currency: the label is 17 characters long; at most 16 are accepted");
  g_clear_error (&error);
  g_assert_false (sw_economics_set_currency (&d->economics, "k\nEUR", &error));
  g_assert_nonnull (strstr (error->message, "control character"));
  g_clear_error (&error);
  g_assert_true (memcmp (&before, &d->economics, sizeof before) == 0);

  g_assert_true (sw_economics_set_currency (&d->economics, "", NULL));
  g_assert_cmpstr (sw_economics_currency_label (&d->economics), ==, "money units");
  g_free (data);
  data = sw_design_to_data (d, &len);
  g_assert_null (strstr (data, "currency"));
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/core/economics/defaults", test_defaults);
  g_test_add_func ("/core/economics/load-and-round-trip", test_load_and_round_trip);
  g_test_add_func ("/core/economics/errors", test_errors);
  g_test_add_func ("/core/economics/unknown-keys-warn", test_unknown_keys_warn);
  g_test_add_func ("/core/economics/named-edits", test_named_edits);
  g_test_add_func ("/core/economics/currency", test_currency);
  return g_test_run ();
}
