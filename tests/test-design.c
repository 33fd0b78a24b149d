/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Tests of sw-design: the demo designs, load/save round trips, atomic saves,
 * unknown keys, share editing and the corpus of malformed files. */
#include "config.h"

#include "sw-design.h"
#include "sw-design-edit.h"

#include <glib/gstdio.h>
#include <gsl/gsl_rng.h>
#include <math.h>
#include <string.h>

/* "nan" or "inf" shown as a number, as printf writes a non-finite double.  A
 * token quoted from the input (json-glib's `NaN') is the user's text, not a
 * number we printed. */
static GRegex *nan_re;

static void
assert_no_nan (const char *message, const char *file)
{
  /* The file's own name (say nan-token.stagewright) is not a number. */
  g_auto (GStrv) parts = g_strsplit (message, file != NULL ? file : "\x01", -1);
  g_autofree char *rest = g_strjoinv (" ", parts);

  if (g_regex_match (nan_re, rest, 0, NULL))
    g_error ("a message shows a non-finite number: %s", message);
}

static const char *
source_root (void)
{
  const char *root = g_getenv ("SW_SOURCE_ROOT");
  g_assert_nonnull (root);
  return root;
}

static char *
make_tmp_dir (void)
{
  g_autoptr (GError) error = NULL;
  char *dir = g_dir_make_tmp ("sw-test-design-XXXXXX", &error);
  g_assert_no_error (error);
  return dir;
}

static void
remove_tree (const char *dir)
{
  GDir *d = g_dir_open (dir, 0, NULL);
  const char *name;

  if (d == NULL)
    return;
  while ((name = g_dir_read_name (d)) != NULL)
    {
      g_autofree char *path = g_build_filename (dir, name, NULL);
      g_remove (path);
    }
  g_dir_close (d);
  g_rmdir (dir);
}

static GPtrArray *
list_dir (const char *dir)
{
  GPtrArray *names = g_ptr_array_new_with_free_func (g_free);
  GDir *d = g_dir_open (dir, 0, NULL);
  const char *name;

  g_assert_nonnull (d);
  while ((name = g_dir_read_name (d)) != NULL)
    g_ptr_array_add (names, g_strdup (name));
  g_dir_close (d);
  return names;
}

static GPtrArray *
demo_paths (void)
{
  g_autofree char *dir = g_build_filename (source_root (), "data", "designs", NULL);
  g_autoptr (GPtrArray) names = list_dir (dir);
  GPtrArray *paths = g_ptr_array_new_with_free_func (g_free);

  for (guint i = 0; i < names->len; i++)
    if (g_str_has_suffix (names->pdata[i], ".stagewright"))
      g_ptr_array_add (paths, g_build_filename (dir, names->pdata[i], NULL));
  return paths;
}

/* Loading must fail; the message names @file and contains @expect. */
static void
expect_load_error (const char *path, const char *file_in_message, const char *expect)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (GPtrArray) warnings = g_ptr_array_new_with_free_func (g_free);
  g_autoptr (SwDesign) d = sw_design_load (path, warnings, &error);

  if (d != NULL)
    g_error ("%s: loaded, but should fail with \"%s\"", path, expect);
  g_assert_nonnull (error);
  g_assert_true (error->domain == SW_ERROR);
  if (strstr (error->message, file_in_message) == NULL)
    g_error ("%s: the message does not name the file: %s", path, error->message);
  if (strstr (error->message, expect) == NULL)
    g_error ("%s: expected \"%s\" in the message: %s", path, expect, error->message);
  assert_no_nan (error->message, path);
}

/* ---- demo designs and round trips -------------------------------------- */

static void
test_load_demos (void)
{
  g_autoptr (GPtrArray) paths = demo_paths ();

  g_assert_cmpuint (paths->len, >=, 3);
  for (guint i = 0; i < paths->len; i++)
    {
      g_autoptr (GError) error = NULL;
      g_autoptr (GPtrArray) warnings = g_ptr_array_new_with_free_func (g_free);
      g_autoptr (SwDesign) d = sw_design_load (paths->pdata[i], warnings, &error);

      g_assert_no_error (error);
      g_assert_nonnull (d);
      /* The demos are clean: no unknown keys. */
      for (guint w = 0; w < warnings->len; w++)
        g_test_message ("%s", (const char *) warnings->pdata[w]);
      g_assert_cmpuint (warnings->len, ==, 0);
      g_assert_true (sw_design_validate (d, paths->pdata[i], NULL));
      g_assert_cmpuint (strlen (d->name), >, 0);
      /* Invented scenarios that say so (RULES). */
      g_assert_nonnull (d->notes);
      g_assert_nonnull (strstr (d->notes, "nvented"));
      g_assert_cmpuint (d->n_stages, >=, 1);
    }
}

/* Doubles compared bit for bit: "identical", not "close". */
static void
assert_same_double (double a, double b)
{
  if (memcmp (&a, &b, sizeof a) != 0)
    g_error ("doubles differ: %.17g and %.17g", a, b);
}

static void
assert_same_values (const SwDesign *a, const SwDesign *b)
{
  assert_same_double (a->payload_kg, b->payload_kg);
  g_assert_cmpint (a->mission.kind, ==, b->mission.kind);
  if (a->mission.kind == SW_MISSION_DELTA_V)
    assert_same_double (a->mission.delta_v_m_s, b->mission.delta_v_m_s);
  else
    {
      assert_same_double (a->mission.altitude_km, b->mission.altitude_km);
      assert_same_double (a->mission.inclination_deg, b->mission.inclination_deg);
      assert_same_double (a->mission.site_latitude_deg, b->mission.site_latitude_deg);
      g_assert_cmpint (a->mission.has_losses, ==, b->mission.has_losses);
      if (a->mission.has_losses)
        assert_same_double (a->mission.losses_m_s, b->mission.losses_m_s);
    }
  g_assert_cmpint (a->split, ==, b->split);
  g_assert_cmpstr (a->name, ==, b->name);
  g_assert_cmpstr (a->notes, ==, b->notes);
  g_assert_cmpuint (a->n_stages, ==, b->n_stages);
  for (guint i = 0; i < a->n_stages; i++)
    {
      const SwStage *sa = &a->stages[i], *sb = &b->stages[i];
      g_assert_cmpstr (sa->name, ==, sb->name);
      assert_same_double (sa->isp_vac_s, sb->isp_vac_s);
      assert_same_double (sa->structural_coefficient, sb->structural_coefficient);
      g_assert_cmpint (sa->has_isp_sl, ==, sb->has_isp_sl);
      if (sa->has_isp_sl)
        assert_same_double (sa->isp_sl_s, sb->isp_sl_s);
      g_assert_cmpint (sa->has_share, ==, sb->has_share);
      if (sa->has_share)
        assert_same_double (sa->delta_v_share, sb->delta_v_share);
    }
  g_assert_true ((a->baseline == NULL) == (b->baseline == NULL));
  if (a->baseline != NULL)
    assert_same_values (a->baseline, b->baseline);
}

/* load -> save -> load, through a real file in a temporary folder. */
static void
round_trip_file (const SwDesign *d, const char *dir)
{
  g_autofree char *path = g_build_filename (dir, "round-trip.stagewright", NULL);
  g_autofree char *text1 = NULL, *text2 = NULL;
  g_autoptr (GError) error = NULL;
  g_autoptr (GPtrArray) warnings = g_ptr_array_new_with_free_func (g_free);
  g_autoptr (SwDesign) back = NULL;

  g_assert_true (sw_design_save (d, path, &error));
  g_assert_no_error (error);
  back = sw_design_load (path, warnings, &error);
  g_assert_no_error (error);
  g_assert_nonnull (back);
  g_assert_true (sw_design_equal (d, back));
  assert_same_values (d, back);
  /* Saving what was loaded writes the same text again. */
  g_assert_true (g_file_get_contents (path, &text1, NULL, NULL));
  g_assert_true (sw_design_save (back, path, &error));
  g_assert_true (g_file_get_contents (path, &text2, NULL, NULL));
  g_assert_cmpstr (text1, ==, text2);
  g_assert_true (g_utf8_validate (text1, -1, NULL));
  g_remove (path);
}

static void
test_round_trip_demos (void)
{
  g_autoptr (GPtrArray) paths = demo_paths ();
  g_autofree char *dir = make_tmp_dir ();

  for (guint i = 0; i < paths->len; i++)
    {
      g_autoptr (SwDesign) d = sw_design_load (paths->pdata[i], NULL, NULL);
      g_assert_nonnull (d);
      round_trip_file (d, dir);
    }
  remove_tree (dir);
}

/* Doubles that print badly, text that needs escaping, both mission kinds,
 * a baseline: all survive the round trip unchanged. */
static void
test_round_trip_awkward (void)
{
  g_autoptr (SwDesign) d = sw_design_new_default ();
  g_autofree char *dir = make_tmp_dir ();
  gsl_rng *rng = gsl_rng_alloc (gsl_rng_mt19937);

  gsl_rng_set (rng, 99);
  g_strlcpy (d->name, "Quote \" backslash \\ tab \t ünïcödé ✓", sizeof d->name);
  sw_design_set_notes (d, "Line one\nLine two with \"quotes\" and a / slash\n\u00e9\u00e8");
  d->payload_kg = 0.1 + 0.2;
  d->mission.delta_v_m_s = 9400.0 / 3.0;
  d->split = SW_SPLIT_MANUAL;
  d->n_stages = 3;
  for (guint i = 0; i < 3; i++)
    {
      sw_stage_init_default (&d->stages[i], i);
      d->stages[i].isp_vac_s = 300.0 + 1.0 / 3.0 + i;
      d->stages[i].structural_coefficient = 0.01 + 0.1 / 7.0 * (i + 1);
      d->stages[i].has_share = TRUE;
    }
  d->stages[0].delta_v_share = 1.0 / 3.0;
  d->stages[1].delta_v_share = 1.0 / 3.0;
  d->stages[2].delta_v_share = 1.0 - 2.0 / 3.0;
  d->stages[0].has_isp_sl = TRUE;
  d->stages[0].isp_sl_s = 0.0;
  round_trip_file (d, dir);

  /* Orbit mission without losses, and a pinned baseline. */
  d->mission.kind = SW_MISSION_ORBIT;
  d->mission.altitude_km = 407.123456789012;
  d->mission.inclination_deg = 51.64;
  d->mission.site_latitude_deg = -45.965;
  d->mission.has_losses = FALSE;
  d->baseline = sw_design_new_default ();
  g_strlcpy (d->baseline->name, "Pinned", sizeof d->baseline->name);
  round_trip_file (d, dir);
  d->mission.has_losses = TRUE;
  d->mission.losses_m_s = 1234.5678901234567;
  round_trip_file (d, dir);

  /* A written minus zero (found by the fuzz smoke run) loads as plain zero, so
   * the saved file loads back to the same design bit for bit. */
  {
    g_autofree char *text = sw_design_to_data (d, NULL);
    g_autoptr (GString) minus = g_string_new (text);
    g_autoptr (SwDesign) m = NULL;
    g_autoptr (SwDesign) again = NULL;
    g_autofree char *saved = NULL;
    g_autoptr (GError) error = NULL;

    g_assert_cmpuint (g_string_replace (minus, "-45.965", "-0.0", 1), ==, 1);
    m = sw_design_load_data (minus->str, -1, "minus-zero.stagewright", NULL, &error);
    g_assert_no_error (error);
    g_assert_cmpfloat (m->mission.site_latitude_deg, ==, 0.0);
    g_assert_false (signbit (m->mission.site_latitude_deg));
    saved = sw_design_to_data (m, NULL);
    again = sw_design_load_data (saved, -1, "again.stagewright", NULL, &error);
    g_assert_no_error (error);
    g_assert_true (sw_design_equal (m, again));
  }

  /* Random values across each range: every double comes back identical. */
  for (guint k = 0; k < 200; k++)
    {
      g_autoptr (SwDesign) r = sw_design_new_default ();
      g_autofree char *data = NULL;
      g_autoptr (SwDesign) back = NULL;
      g_autoptr (GError) error = NULL;
      double sum = 0.0;

      r->payload_kg = 0.1 + gsl_rng_uniform (rng) * 1e6;
      r->mission.delta_v_m_s = 1.0 + gsl_rng_uniform (rng) * 29000.0;
      r->n_stages = 1 + gsl_rng_uniform_int (rng, SW_MAX_STAGES);
      r->split = SW_SPLIT_MANUAL;
      for (guint i = 0; i < r->n_stages; i++)
        {
          sw_stage_init_default (&r->stages[i], i);
          r->stages[i].isp_vac_s = 50.0 + gsl_rng_uniform (rng) * 950.0;
          r->stages[i].isp_sl_s = r->stages[i].isp_vac_s * gsl_rng_uniform (rng);
          r->stages[i].structural_coefficient = 0.01 + gsl_rng_uniform (rng) * 0.59;
          r->stages[i].has_share = TRUE;
          sum += r->stages[i].delta_v_share = gsl_rng_uniform_pos (rng);
        }
      for (guint i = 0; i < r->n_stages; i++)
        r->stages[i].delta_v_share /= sum;
      data = sw_design_to_data (r, NULL);
      back = sw_design_load_data (data, -1, "random.stagewright", NULL, &error);
      g_assert_no_error (error);
      g_assert_true (sw_design_equal (r, back));
      assert_same_values (r, back);
    }
  gsl_rng_free (rng);
  remove_tree (dir);
}

/* Atomic saving: no temporary file is left behind, and a failed save leaves
 * the old file whole. */
static void
test_atomic_save (void)
{
  g_autofree char *dir = make_tmp_dir ();
  g_autofree char *path = g_build_filename (dir, "vehicle.stagewright", NULL);
  g_autofree char *missing = g_build_filename (dir, "no-such-folder", "v.stagewright", NULL);
  g_autoptr (SwDesign) d = sw_design_new_default ();
  g_autoptr (GError) error = NULL;
  g_autofree char *before = NULL, *after = NULL;
  g_autoptr (GPtrArray) names = NULL;

  g_assert_true (sw_design_save (d, path, &error));
  g_assert_no_error (error);
  d->payload_kg = 2500.0;
  g_assert_true (sw_design_save (d, path, &error));
  g_assert_no_error (error);
  names = list_dir (dir);
  g_assert_cmpuint (names->len, ==, 1);
  g_assert_cmpstr (names->pdata[0], ==, "vehicle.stagewright");
  g_ptr_array_unref (g_steal_pointer (&names));

  /* An invalid design is refused before anything is written. */
  g_assert_true (g_file_get_contents (path, &before, NULL, NULL));
  d->stages[1].structural_coefficient = 0.9;
  g_assert_false (sw_design_save (d, path, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_RANGE);
  g_assert_nonnull (strstr (error->message, "stages[1].structural_coefficient"));
  g_clear_error (&error);
  g_assert_true (g_file_get_contents (path, &after, NULL, NULL));
  g_assert_cmpstr (before, ==, after);

  /* A folder that does not exist: an I/O error naming the file. */
  d->stages[1].structural_coefficient = 0.09;
  g_assert_false (sw_design_save (d, missing, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_IO);
  g_assert_nonnull (strstr (error->message, "v.stagewright"));

  names = list_dir (dir);
  g_assert_cmpuint (names->len, ==, 1);
  remove_tree (dir);
}

static void
test_unknown_keys (void)
{
  static const char text[] =
    "{ \"format\": \"stagewright-design\", \"version\": 1, \"colour\": \"red\",\n"
    "  \"payload_kg\": 100, \"split\": \"optimal\",\n"
    "  \"mission\": { \"orbit\": { \"altitude_km\": 300, \"inclination_deg\": 30,\n"
    "                           \"site_latitude_deg\": 10, \"apogee\": 5 },\n"
    "               \"losses_m_s\": 1200, \"comment\": \"x\" },\n"
    "  \"stages\": [ { \"isp_vac_s\": 300, \"structural_coefficient\": 0.1 },\n"
    "              { \"isp_vac_s\": 320, \"structural_coefficient\": 0.1, \"tank\": {} } ] }";
  static const char *const paths[] = {
    "colour", "mission.orbit.apogee", "mission.comment", "stages[1].tank",
  };
  g_autoptr (GPtrArray) warnings = g_ptr_array_new_with_free_func (g_free);
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) d = sw_design_load_data (text, -1, "keys.stagewright", warnings, &error);

  g_assert_no_error (error);
  g_assert_nonnull (d);
  g_assert_cmpuint (warnings->len, ==, G_N_ELEMENTS (paths));
  for (guint i = 0; i < G_N_ELEMENTS (paths); i++)
    {
      gboolean found = FALSE;
      for (guint w = 0; w < warnings->len; w++)
        {
          const char *msg = warnings->pdata[w];
          g_assert_nonnull (strstr (msg, "keys.stagewright"));
          if (strstr (msg, paths[i]) != NULL)
            found = TRUE;
        }
      g_assert_true (found);
    }
  /* Default stage names are given to stages without one. */
  g_assert_cmpuint (strlen (d->stages[0].name), >, 0);

  /* Without a warnings array the load still succeeds. */
  {
    g_autoptr (SwDesign) d2 = sw_design_load_data (text, -1, "keys.stagewright", NULL, &error);
    g_assert_no_error (error);
    g_assert_true (sw_design_equal (d, d2));
  }
}

static void
test_copy_equal (void)
{
  g_autoptr (SwDesign) a = sw_design_new_default ();
  g_autoptr (SwDesign) b = NULL;

  sw_design_set_notes (a, "notes");
  a->baseline = sw_design_new_default ();
  b = sw_design_copy (a);
  g_assert_true (sw_design_equal (a, b));
  g_assert_true (b->notes != a->notes);
  g_assert_true (b->baseline != a->baseline);

  /* Garbage after the end of a name does not decide equality. */
  memset (b->stages[0].name + strlen (b->stages[0].name) + 1, 'x', 5);
  g_assert_true (sw_design_equal (a, b));

  b->stages[1].structural_coefficient += 1e-12;
  g_assert_false (sw_design_equal (a, b));
  b->stages[1].structural_coefficient = a->stages[1].structural_coefficient;
  sw_design_set_notes (b, "other");
  g_assert_false (sw_design_equal (a, b));
  sw_design_set_notes (b, "notes");
  b->baseline->payload_kg += 1.0;
  g_assert_false (sw_design_equal (a, b));

  g_assert_true (sw_design_equal (NULL, NULL));
  g_assert_false (sw_design_equal (a, NULL));
}

/* Equality means "saves the same": values the file does not carry (the other
 * kind of mission, an absent optional number) do not count; saved ones do. */
static void
test_equal_ignores_unsaved (void)
{
  g_autoptr (SwDesign) a = sw_design_new_default ();
  g_autoptr (SwDesign) b = NULL;
  g_autofree char *ta = NULL, *tb = NULL;

  a->mission.kind = SW_MISSION_ORBIT;
  a->mission.altitude_km = 300.0;
  a->mission.inclination_deg = 30.0;
  a->mission.site_latitude_deg = 20.0;
  b = sw_design_copy (a);
  b->mission.delta_v_m_s = 1234.0;      /* left over from a delta-v mission */
  b->mission.losses_m_s = 999.0;        /* has_losses is FALSE */
  b->stages[1].isp_sl_s = 100.0;        /* has_isp_sl is FALSE */
  b->stages[1].has_share = FALSE;
  a->stages[1].has_share = FALSE;
  b->stages[1].delta_v_share = 0.7;
  ta = sw_design_to_data (a, NULL);
  tb = sw_design_to_data (b, NULL);
  g_assert_cmpstr (ta, ==, tb);
  g_assert_true (sw_design_equal (a, b));

  b->mission.has_losses = TRUE;
  g_assert_false (sw_design_equal (a, b));
  b->mission.has_losses = FALSE;
  b->stages[1].has_isp_sl = TRUE;
  g_assert_false (sw_design_equal (a, b));
  b->stages[1].has_isp_sl = FALSE;
  b->mission.kind = SW_MISSION_DELTA_V;
  g_assert_false (sw_design_equal (a, b));

  /* A delta-v mission ignores the orbit left from before. */
  a->mission.kind = SW_MISSION_DELTA_V;
  a->mission.delta_v_m_s = 1234.0;
  b->mission.altitude_km = 2000.0;
  g_assert_true (sw_design_equal (a, b));
  b->mission.delta_v_m_s = 1235.0;
  g_assert_false (sw_design_equal (a, b));
}

static void
test_defaults_valid (void)
{
  g_autoptr (SwDesign) d = sw_design_new_default ();
  g_autoptr (GError) error = NULL;

  g_assert_true (sw_design_validate (d, "default", &error));
  g_assert_no_error (error);
  for (guint i = 0; i < SW_MAX_STAGES; i++)
    {
      sw_stage_init_default (&d->stages[i], i);
      d->stages[i].has_share = TRUE;
      d->stages[i].delta_v_share = 1.0 / SW_MAX_STAGES;
    }
  d->n_stages = SW_MAX_STAGES;
  d->split = SW_SPLIT_MANUAL;
  g_assert_true (sw_design_validate (d, "default", &error));
  g_assert_no_error (error);
}

/* A NaN in memory (say from a GUI field) is a clear error, never printed. */
static void
test_validate_not_finite (void)
{
  g_autoptr (SwDesign) d = sw_design_new_default ();
  g_autoptr (GError) error = NULL;

  d->stages[1].isp_vac_s = NAN;
  g_assert_false (sw_design_validate (d, "memory.stagewright", &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_NOT_FINITE);
  g_assert_nonnull (strstr (error->message, "stages[1].isp_vac_s"));
  assert_no_nan (error->message, "memory.stagewright");
  g_clear_error (&error);

  d->stages[1].isp_vac_s = 320.0;
  d->payload_kg = INFINITY;
  g_assert_false (sw_design_validate (d, "memory.stagewright", &error));
  g_assert_nonnull (strstr (error->message, "payload_kg"));
  assert_no_nan (error->message, "memory.stagewright");
  g_clear_error (&error);

  /* Saving refuses it too: no NaN reaches a file. */
  {
    g_autofree char *dir = make_tmp_dir ();
    g_autofree char *path = g_build_filename (dir, "nan.stagewright", NULL);
    g_assert_false (sw_design_save (d, path, &error));
    g_assert_false (g_file_test (path, G_FILE_TEST_EXISTS));
    remove_tree (dir);
  }
}

/* ---- share editing ------------------------------------------------------ */

static double
share_sum (const SwDesign *d)
{
  double s = 0.0;
  for (guint i = 0; i < d->n_stages; i++)
    s += d->stages[i].delta_v_share;
  return s;
}

static void
assert_shares_sane (const SwDesign *d)
{
  g_assert_cmpfloat_with_epsilon (share_sum (d), 1.0, 1e-12);
  for (guint i = 0; i < d->n_stages; i++)
    {
      g_assert_true (d->stages[i].has_share);
      g_assert_cmpfloat (d->stages[i].delta_v_share, >=, 0.0);
      g_assert_cmpfloat (d->stages[i].delta_v_share, <=, 1.0);
    }
}

static void
test_share_rebalanced (void)
{
  gsl_rng *rng = gsl_rng_alloc (gsl_rng_mt19937);

  gsl_rng_set (rng, 5);
  for (guint n = 1; n <= SW_MAX_STAGES; n++)
    {
      g_autoptr (SwDesign) d = sw_design_new_default ();

      d->n_stages = n;
      for (guint i = 0; i < n; i++)
        {
          sw_stage_init_default (&d->stages[i], i);
          d->stages[i].has_share = TRUE;
          d->stages[i].delta_v_share = 1.0 / n;
        }
      for (guint k = 0; k < 500; k++)
        {
          guint idx = gsl_rng_uniform_int (rng, n);
          double share = -0.2 + 1.4 * gsl_rng_uniform (rng);
          double old_ratio = NAN;
          guint a = (idx + 1) % n, b = (idx + 2) % n;

          if (n >= 3 && d->stages[b].delta_v_share > 1e-6)
            old_ratio = d->stages[a].delta_v_share / d->stages[b].delta_v_share;
          sw_design_set_share_rebalanced (d, idx, share);
          assert_shares_sane (d);
          if (n == 1)
            g_assert_cmpfloat (d->stages[0].delta_v_share, ==, 1.0);
          else
            g_assert_cmpfloat_with_epsilon (d->stages[idx].delta_v_share,
                                            CLAMP (share, 0.0, 1.0), 1e-15);
          /* The others keep their proportions. */
          if (!isnan (old_ratio) && share < 1.0 && d->stages[b].delta_v_share > 1e-6)
            g_assert_cmpfloat_with_epsilon (d->stages[a].delta_v_share / d->stages[b].delta_v_share,
                                            old_ratio, 1e-9 * MAX (1.0, old_ratio));
        }
      /* When all the others are zero they share what is left equally. */
      if (n >= 3)
        {
          sw_design_set_share_rebalanced (d, 0, 1.0);
          sw_design_set_share_rebalanced (d, 0, 0.4);
          for (guint i = 1; i < n; i++)
            g_assert_cmpfloat_with_epsilon (d->stages[i].delta_v_share, 0.6 / (n - 1), 1e-12);
        }
    }
  /* Shares not given yet (has_share FALSE) are taken as zero. */
  {
    g_autoptr (SwDesign) d = sw_design_new_default ();
    for (guint i = 0; i < d->n_stages; i++)
      d->stages[i].has_share = FALSE;
    sw_design_set_share_rebalanced (d, 1, 0.3);
    assert_shares_sane (d);
    g_assert_cmpfloat_with_epsilon (d->stages[0].delta_v_share, 0.7, 1e-15);
  }
  gsl_rng_free (rng);
}

static void
test_move_share (void)
{
  gsl_rng *rng = gsl_rng_alloc (gsl_rng_mt19937);
  g_autoptr (SwDesign) d = sw_design_new_default ();

  gsl_rng_set (rng, 6);
  d->n_stages = 5;
  for (guint i = 0; i < 5; i++)
    {
      sw_stage_init_default (&d->stages[i], i);
      d->stages[i].has_share = TRUE;
      d->stages[i].delta_v_share = 0.2;
    }
  for (guint k = 0; k < 5000; k++)
    {
      guint from = gsl_rng_uniform_int (rng, 5), to = gsl_rng_uniform_int (rng, 5);
      double amount = -0.5 + gsl_rng_uniform (rng);
      double before_from = d->stages[from].delta_v_share;
      double before_to = d->stages[to].delta_v_share;

      sw_design_move_share (d, from, to, amount);
      assert_shares_sane (d);
      if (from == to)
        g_assert_cmpfloat (d->stages[from].delta_v_share, ==, before_from);
      else
        {
          /* Clamped: never more than the giver has, never below zero. */
          double moved = before_from - d->stages[from].delta_v_share;
          g_assert_cmpfloat_with_epsilon (moved, CLAMP (amount, -before_to, before_from), 1e-12);
          g_assert_cmpfloat_with_epsilon (d->stages[to].delta_v_share, before_to + moved, 1e-12);
        }
    }
  gsl_rng_free (rng);
}

/* ---- malformed files ---------------------------------------------------- */

static void
test_malformed_corpus (void)
{
  g_autofree char *dir = g_build_filename (source_root (), "tests", "malformed", NULL);
  g_autofree char *table_path = g_build_filename (dir, "EXPECTED", NULL);
  g_autofree char *table = NULL;
  g_auto (GStrv) lines = NULL;
  g_autoptr (GHashTable) listed = g_hash_table_new_full (g_str_hash, g_str_equal, g_free, NULL);
  g_autoptr (GPtrArray) files = list_dir (dir);
  guint n_checked = 0;

  g_assert_true (g_file_get_contents (table_path, &table, NULL, NULL));
  lines = g_strsplit (table, "\n", -1);
  for (guint i = 0; lines[i] != NULL; i++)
    {
      g_autofree char *line = g_strstrip (g_strdup (lines[i]));
      g_autofree char *path = NULL;
      char *space;

      if (line[0] == '\0' || line[0] == '#')
        continue;
      space = strpbrk (line, " \t");
      g_assert_nonnull (space);
      *space = '\0';
      g_assert_false (g_hash_table_contains (listed, line));
      g_hash_table_add (listed, g_strdup (line));
      path = g_build_filename (dir, line, NULL);
      if (!g_file_test (path, G_FILE_TEST_IS_REGULAR))
        g_error ("EXPECTED lists %s, which is not in tests/malformed", line);
      expect_load_error (path, line, g_strchug (space + 1));
      n_checked++;
    }
  /* Every file of the corpus has its line. */
  for (guint i = 0; i < files->len; i++)
    if (strcmp (files->pdata[i], "EXPECTED") != 0
        && !g_hash_table_contains (listed, files->pdata[i]))
      g_error ("tests/malformed/%s has no line in EXPECTED", (const char *) files->pdata[i]);
  g_assert_cmpuint (n_checked, >=, 30);
  g_test_message ("%u malformed files checked", n_checked);
}

static const char valid_head[] =
  "{ \"format\": \"stagewright-design\", \"version\": 1, \"payload_kg\": 100,\n"
  "  \"mission\": { \"delta_v_m_s\": 9000 }, \"split\": \"optimal\",\n"
  "  \"stages\": [ { \"isp_vac_s\": 300, \"structural_coefficient\": 0.1 } ]";

/* The cases too big to keep in the tree, generated here. */
static void
test_malformed_generated (void)
{
  g_autofree char *dir = make_tmp_dir ();
  g_autoptr (GError) error = NULL;

  /* Over 1 MiB: a valid design padded with notes past the limit. */
  {
    g_autofree char *path = g_build_filename (dir, "too-large.stagewright", NULL);
    GString *s = g_string_new (valid_head);
    g_string_append (s, ", \"notes\": \"");
    while (s->len <= SW_DESIGN_MAX_BYTES)
      g_string_append (s, "padding padding padding padding ");
    g_string_append (s, "\" }\n");
    g_assert_true (g_file_set_contents (path, s->str, s->len, NULL));
    expect_load_error (path, "too-large.stagewright", "1 MiB");
    /* The in-memory loader applies the same limit. */
    g_assert_null (sw_design_load_data (s->str, s->len, "mem.stagewright", NULL, &error));
    g_assert_error (error, SW_ERROR, SW_ERROR_TOO_LARGE);
    g_clear_error (&error);
    g_string_free (s, TRUE);
  }

  /* Nesting 10,000 deep, inside an unknown key and at the top level. */
  {
    g_autofree char *path = g_build_filename (dir, "deep.stagewright", NULL);
    g_autofree char *path2 = g_build_filename (dir, "deep-top.stagewright", NULL);
    GString *s = g_string_new (valid_head);
    GString *t = g_string_new ("");

    g_string_append (s, ", \"extra\": ");
    for (guint i = 0; i < 10000; i++)
      g_string_append (s, "[");
    for (guint i = 0; i < 10000; i++)
      g_string_append (s, "]");
    g_string_append (s, " }\n");
    for (guint i = 0; i < 10000; i++)
      g_string_append (t, "{\"a\":");
    g_string_append (t, "1");
    for (guint i = 0; i < 10000; i++)
      g_string_append (t, "}");
    g_assert_true (g_file_set_contents (path, s->str, s->len, NULL));
    g_assert_true (g_file_set_contents (path2, t->str, t->len, NULL));
    expect_load_error (path, "deep.stagewright", "nested more than");
    expect_load_error (path2, "deep-top.stagewright", "nested more than");
    g_string_free (s, TRUE);
    g_string_free (t, TRUE);
  }

  /* Notes longer than the limit of the table (65,536). */
  {
    g_autofree char *path = g_build_filename (dir, "long-notes.stagewright", NULL);
    GString *s = g_string_new (valid_head);
    g_string_append (s, ", \"notes\": \"");
    for (guint i = 0; i < 65537; i++)
      g_string_append_c (s, 'n');
    g_string_append (s, "\" }\n");
    g_assert_true (g_file_set_contents (path, s->str, s->len, NULL));
    expect_load_error (path, "long-notes.stagewright", "notes");
    g_string_free (s, TRUE);
  }

  /* A file that is not there. */
  {
    g_autofree char *path = g_build_filename (dir, "absent.stagewright", NULL);
    expect_load_error (path, "absent.stagewright", "absent.stagewright");
  }

  /* The valid head itself loads (the cases above fail for their one reason). */
  {
    g_autofree char *text = g_strconcat (valid_head, " }", NULL);
    g_autoptr (SwDesign) d = sw_design_load_data (text, -1, "ok.stagewright", NULL, &error);
    g_assert_no_error (error);
    g_assert_nonnull (d);
  }
  remove_tree (dir);
}

/* The pattern of assert_no_nan catches what printf makes of NaN and inf. */
static void
test_nan_pattern (void)
{
  g_assert_true (g_regex_match (nan_re, "stages[1].isp_vac_s: nan is outside", 0, NULL));
  g_assert_true (g_regex_match (nan_re, "payload_kg: -inf is outside", 0, NULL));
  g_assert_true (g_regex_match (nan_re, "add up to -nan; they must", 0, NULL));
  g_assert_true (g_regex_match (nan_re, "(inf)", 0, NULL));
  g_assert_false (g_regex_match (nan_re, "the number is not finite", 0, NULL));
  g_assert_false (g_regex_match (nan_re, "for information", 0, NULL));
  g_assert_false (g_regex_match (nan_re, "unexpected identifier `NaN'", 0, NULL));
}

int
main (int argc, char **argv)
{
  int ret;

  g_test_init (&argc, &argv, NULL);
  nan_re = g_regex_new ("(?<![`'\"\\w])[-+]?(nan|inf|infinity)(?!\\w)", G_REGEX_CASELESS, 0,
                        NULL);
  g_assert_nonnull (nan_re);

  g_test_add_func ("/core/design/load-demos", test_load_demos);
  g_test_add_func ("/core/design/round-trip-demos", test_round_trip_demos);
  g_test_add_func ("/core/design/round-trip-awkward", test_round_trip_awkward);
  g_test_add_func ("/core/design/atomic-save", test_atomic_save);
  g_test_add_func ("/core/design/unknown-keys", test_unknown_keys);
  g_test_add_func ("/core/design/copy-equal", test_copy_equal);
  g_test_add_func ("/core/design/equal-ignores-unsaved", test_equal_ignores_unsaved);
  g_test_add_func ("/core/design/defaults-valid", test_defaults_valid);
  g_test_add_func ("/core/design/validate-not-finite", test_validate_not_finite);
  g_test_add_func ("/core/design/share-rebalanced", test_share_rebalanced);
  g_test_add_func ("/core/design/move-share", test_move_share);
  g_test_add_func ("/core/design/malformed-corpus", test_malformed_corpus);
  g_test_add_func ("/core/design/malformed-generated", test_malformed_generated);
  g_test_add_func ("/core/design/nan-pattern", test_nan_pattern);

  ret = g_test_run ();
  g_regex_unref (nan_re);
  return ret;
}
