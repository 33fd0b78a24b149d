/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The shared readers of the design file's keys (sw-optional-keys).  Every
 * error message is written out literally.  Outside references: RFC 8259
 * (JSON), sec. 6: a number has no integer or real kind ("1e3" and "1000.0"
 * are the whole number 1000), and a value beyond the range of IEEE 754
 * doubles (1e400) cannot be represented; the accepted ranges are the limits
 * table's (sw-limits.c), given here as literal numbers. */
#include "config.h"

#include "sw-limits.h"
#include "sw-optional-keys.h"

#include <json-glib/json-glib.h>
#include <math.h>
#include <string.h>

static JsonParser *
parse (const char *text)
{
  JsonParser *parser = json_parser_new ();
  g_autoptr (GError) error = NULL;

  if (!json_parser_load_from_data (parser, text, -1, &error))
    g_error ("test JSON does not parse: %s", error->message);
  return parser;
}

#define OBJ(parser) json_node_get_object (json_parser_get_root (parser))

static void
test_paths_and_files (void)
{
  g_autofree char *a = sw_optional_path ("", "payload_kg");
  g_autofree char *b = sw_optional_path (NULL, "payload_kg");
  g_autofree char *c = sw_optional_path ("stages[1]", "isp_vac_s");
  g_autofree char *d = sw_optional_path ("baseline.mission", "orbit");
  g_autoptr (GError) error = NULL;

  g_assert_cmpstr (a, ==, "payload_kg");
  g_assert_cmpstr (b, ==, "payload_kg");
  g_assert_cmpstr (c, ==, "stages[1].isp_vac_s");
  g_assert_cmpstr (d, ==, "baseline.mission.orbit");
  g_assert_cmpstr (sw_optional_display_file ("x.stagewright"), ==, "x.stagewright");
  g_assert_cmpstr (sw_optional_display_file (NULL), ==, "(design)");

  sw_optional_set_error (&error, SW_ERROR_RANGE, "x.stagewright", "%s: %d of %d", "k", 3, 4);
  g_assert_error (error, SW_ERROR, SW_ERROR_RANGE);
  g_assert_cmpstr (error->message, ==, "x.stagewright: k: 3 of 4");
  g_clear_error (&error);
  sw_optional_set_error (&error, SW_ERROR_VALUE, NULL, "plain");
  g_assert_cmpstr (error->message, ==, "(design): plain");
}

static void
test_node_types (void)
{
  g_autoptr (JsonParser) p = parse ("{ \"o\": {}, \"a\": [], \"n\": null, \"t\": true,"
                                    "  \"s\": \"1\", \"i\": 7, \"d\": 7.5, \"e\": 1e3 }");
  JsonObject *o = OBJ (p);
  static const struct { const char *key, *name; gboolean number; } cases[] = {
    { "o", "an object", FALSE }, { "a", "an array", FALSE }, { "n", "null", FALSE },
    { "t", "a boolean", FALSE }, { "s", "a string", FALSE }, { "i", "a number", TRUE },
    { "d", "a number", TRUE }, { "e", "a number", TRUE },
  };

  for (guint k = 0; k < G_N_ELEMENTS (cases); k++)
    {
      JsonNode *node = json_object_get_member (o, cases[k].key);
      g_assert_cmpstr (sw_optional_node_type_name (node), ==, cases[k].name);
      g_assert_cmpint (sw_optional_node_is_number (node), ==, cases[k].number);
    }
}

static void
test_read_number (void)
{
  g_autoptr (JsonParser) p = parse (
    "{ \"payload_kg\": 0.1, \"big\": 10000000, \"over\": 10000000.5, \"under\": 0.0999,"
    "  \"dv\": 0, \"text\": \"12\", \"half\": 2.5, \"exp\": 1e3, \"dot\": 1000.0,"
    "  \"huge\": 1e400, \"seed\": 4294967295, \"seed_over\": 4294967296 }");
  JsonObject *o = OBJ (p);
  g_autoptr (GError) error = NULL;
  double v = -1.0;
  gboolean present = TRUE;

  /* Absent and optional: TRUE, not present, the value untouched. */
  g_assert_true (sw_optional_read_number (o, "missing", "f", "p", SW_LIMIT_PAYLOAD, FALSE, &v,
                                          &present, &error));
  g_assert_false (present);
  g_assert_cmpfloat (v, ==, -1.0);
  /* Absent and required. */
  g_assert_false (sw_optional_read_number_full (o, "missing", "f", "p", TRUE, SW_LIMIT_PAYLOAD,
                                                FALSE, &v, NULL, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_MISSING);
  g_assert_cmpstr (error->message, ==, "f: p.missing: required number is missing");
  g_clear_error (&error);

  /* The limits' ends are inside: payload 0.1 kg to 1e7 kg. */
  g_assert_true (sw_optional_read_number_full (o, "payload_kg", "f", "", FALSE, SW_LIMIT_PAYLOAD,
                                               FALSE, &v, &present, &error));
  g_assert_true (present);
  g_assert_cmpfloat (v, ==, 0.1);
  g_assert_true (sw_optional_read_number_full (o, "big", "f", "", FALSE, SW_LIMIT_PAYLOAD,
                                               FALSE, &v, NULL, &error));
  g_assert_cmpfloat (v, ==, 1e7);
  g_assert_no_error (error);
  /* Just outside, the message names the value (all its digits: 1e+07 would
   * look inside), the range, the unit and why
   * (the key shown is the limit's, at the prefix). */
  g_assert_false (sw_optional_read_number_full (o, "over", "f", "", FALSE, SW_LIMIT_PAYLOAD,
                                                FALSE, &v, NULL, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_RANGE);
  g_assert_cmpstr (error->message, ==,
                   "f: payload_kg: 10000000.5 is outside the accepted range 0.1 to 10000000 kg (from "
                   "a 100 g picosatellite to 10,000 t; beyond that the concept is not a launch "
                   "vehicle)");
  g_clear_error (&error);
  g_assert_false (sw_optional_read_number_full (o, "under", "f", "", FALSE, SW_LIMIT_PAYLOAD,
                                                FALSE, &v, NULL, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_RANGE);
  g_assert_true (g_str_has_prefix (error->message, "f: payload_kg: 0.0999 is outside"));
  g_clear_error (&error);
  /* An exclusive lower end says "above": delta-v must be above 0. */
  g_assert_false (sw_optional_read_number (o, "dv", "f", "mission", SW_LIMIT_DELTA_V, FALSE, &v,
                                           NULL, &error));
  g_assert_cmpstr (error->message, ==,
                   "f: mission.delta_v_m_s: 0 is outside the accepted range above 0 to 30000 m/s "
                   "(positive; 30 km/s exceeds any chemical multistage mission from the ground)");
  g_clear_error (&error);

  /* Types. */
  g_assert_false (sw_optional_read_number (o, "text", "f", "", SW_OPTIONAL_NO_LIMIT, FALSE, &v,
                                           NULL, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_TYPE);
  g_assert_cmpstr (error->message, ==, "f: text: expected a number, found a string");
  g_clear_error (&error);

  /* Whole numbers: RFC 8259 has one number type, so 1e3 and 1000.0 are the
   * whole number 1000, and 2.5 is not whole. */
  g_assert_true (sw_optional_read_number (o, "exp", "f", "", SW_OPTIONAL_NO_LIMIT, TRUE, &v,
                                          NULL, &error));
  g_assert_cmpfloat (v, ==, 1000.0);
  g_assert_true (sw_optional_read_number (o, "dot", "f", "", SW_OPTIONAL_NO_LIMIT, TRUE, &v,
                                          NULL, &error));
  g_assert_cmpfloat (v, ==, 1000.0);
  g_assert_false (sw_optional_read_number (o, "half", "f", "", SW_OPTIONAL_NO_LIMIT, TRUE, &v,
                                           NULL, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_VALUE);
  g_assert_cmpstr (error->message, ==, "f: half: 2.5 is not a whole number");
  g_clear_error (&error);

  /* 1e400 is beyond the doubles' range (largest about 1.8e308). */
  g_assert_false (sw_optional_read_number (o, "huge", "f", "", SW_OPTIONAL_NO_LIMIT, FALSE, &v,
                                           NULL, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_NOT_FINITE);
  g_assert_cmpstr (error->message, ==,
                   "f: huge: the number is not finite (too large to represent)");
  g_clear_error (&error);

  /* The seed is a 32-bit unsigned number: 2^32 - 1 = 4294967295 is the
   * largest. */
  g_assert_true (sw_optional_read_number (o, "seed", "f", "", SW_LIMIT_MC_SEED, TRUE, &v, NULL,
                                          &error));
  g_assert_cmpfloat (v, ==, 4294967295.0);
  g_assert_false (sw_optional_read_number (o, "seed_over", "f", "", SW_LIMIT_MC_SEED, TRUE, &v,
                                           NULL, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_RANGE);
}

static void
test_check (void)
{
  g_autoptr (GError) error = NULL;

  g_assert_true (sw_optional_check (SW_LIMIT_STRUCTURAL_COEFFICIENT, 0.01, NULL, "s", &error));
  g_assert_true (sw_optional_check (SW_LIMIT_STRUCTURAL_COEFFICIENT, 0.6, NULL, "s", &error));
  g_assert_false (sw_optional_check (SW_LIMIT_STRUCTURAL_COEFFICIENT, 0.61, NULL, "stages[0]",
                                     &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_RANGE);
  g_assert_true (g_str_has_prefix (error->message, "(design): stages[0].structural_coefficient: "
                                                   "0.61 is outside the accepted range 0.01 to "
                                                   "0.6 ("));
  g_clear_error (&error);
  g_assert_false (sw_optional_check (SW_LIMIT_STRUCTURAL_COEFFICIENT, NAN, "f", "stages[0]",
                                     &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_NOT_FINITE);
  g_assert_cmpstr (error->message, ==,
                   "f: stages[0].structural_coefficient: the value is not a finite number");
  g_clear_error (&error);
  g_assert_false (sw_optional_check (SW_LIMIT_PAYLOAD, -INFINITY, "f", "", &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_NOT_FINITE);
}

static void
test_read_string_and_object (void)
{
  g_autoptr (JsonParser) p = parse ("{ \"name\": \"Test vehicle\", \"num\": 3, \"orbit\": {},"
                                    "  \"list\": [1, 2], \"nothing\": null }");
  JsonObject *o = OBJ (p), *sub;
  g_autoptr (GError) error = NULL;
  const char *text = "untouched";
  gboolean ok = FALSE;

  g_assert_true (sw_optional_read_string (o, "name", "f", "", &text, &error));
  g_assert_cmpstr (text, ==, "Test vehicle");
  g_assert_true (sw_optional_read_string (o, "absent", "f", "", &text, &error));
  g_assert_null (text);
  g_assert_false (sw_optional_read_string_full (o, "absent", "f", "m", TRUE, &text, &error));
  g_assert_cmpstr (error->message, ==, "f: m.absent: required text is missing");
  g_clear_error (&error);
  g_assert_false (sw_optional_read_string (o, "num", "f", "", &text, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_TYPE);
  g_assert_cmpstr (error->message, ==, "f: num: expected text, found a number");
  g_clear_error (&error);
  g_assert_false (sw_optional_read_string (o, "nothing", "f", "", &text, &error));
  g_assert_cmpstr (error->message, ==, "f: nothing: expected text, found null");
  g_clear_error (&error);

  sub = sw_optional_read_object (o, "orbit", "f", "", &ok, &error);
  g_assert_true (ok);
  g_assert_nonnull (sub);
  sub = sw_optional_read_object (o, "absent", "f", "", &ok, &error);
  g_assert_true (ok);
  g_assert_null (sub);
  sub = sw_optional_read_object_full (o, "absent", "f", "", TRUE, &ok, &error);
  g_assert_false (ok);
  g_assert_null (sub);
  g_assert_error (error, SW_ERROR, SW_ERROR_MISSING);
  g_assert_cmpstr (error->message, ==, "f: absent: required object is missing");
  g_clear_error (&error);
  sub = sw_optional_read_object (o, "list", "f", "mission", &ok, &error);
  g_assert_false (ok);
  g_assert_cmpstr (error->message, ==, "f: mission.list: expected an object, found an array");
}

static void
test_warn_unknown (void)
{
  g_autoptr (JsonParser) p = parse ("{ \"a\": 1, \"b\": 2, \"c\": 3, \"zz\": 4 }");
  JsonObject *o = OBJ (p);
  g_autoptr (GPtrArray) warnings = g_ptr_array_new_with_free_func (g_free);
  static const char *const first[] = { "a", NULL }, *const second[] = { "b", "c", NULL };
  static const char *const *const lists[] = { first, second, NULL };

  sw_optional_warn_unknown (o, "f", "stages[0]", first, warnings);
  g_assert_cmpuint (warnings->len, ==, 3);   /* b, c, zz */
  g_ptr_array_set_size (warnings, 0);
  sw_optional_warn_unknown_full (o, "f", "stages[0]", lists, warnings);
  g_assert_cmpuint (warnings->len, ==, 1);
  g_assert_cmpstr (warnings->pdata[0], ==,
                   "f: stages[0].zz: unknown key, ignored (it will not be saved)");
  /* No array: nothing is collected, nothing breaks. */
  sw_optional_warn_unknown (o, "f", "", first, NULL);
}

int
main (int argc, char **argv)
{
  g_setenv ("LANGUAGE", "C", TRUE);
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/core/optional-keys/paths-and-files", test_paths_and_files);
  g_test_add_func ("/core/optional-keys/node-types", test_node_types);
  g_test_add_func ("/core/optional-keys/read-number", test_read_number);
  g_test_add_func ("/core/optional-keys/check", test_check);
  g_test_add_func ("/core/optional-keys/read-string-and-object", test_read_string_and_object);
  g_test_add_func ("/core/optional-keys/warn-unknown", test_warn_unknown);
  return g_test_run ();
}
