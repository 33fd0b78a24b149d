/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Tests of sw-limits: the one table of accepted input ranges. */
#include "config.h"

#include "sw-design.h"
#include "sw-limits.h"
#include "sw-propellant.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

/* The numeric keys of the design format (issue 2) and the text and list
 * limits: each must have its row. */
static const char *const format_keys[] = {
  "payload_kg", "delta_v_m_s", "altitude_km", "inclination_deg", "site_latitude_deg",
  "losses_m_s", "isp_vac_s", "isp_sl_s", "structural_coefficient", "delta_v_share",
  "stages", "name", "notes",
};

static const SwLimit *
limit_by_key (const char *key)
{
  for (guint i = 0; i < SW_N_LIMITS; i++)
    if (strcmp (sw_limit_get (i)->key, key) == 0)
      return sw_limit_get (i);
  return NULL;
}

static void
test_table_complete (void)
{
  g_autoptr (GHashTable) seen = g_hash_table_new (g_str_hash, g_str_equal);

  for (guint i = 0; i < SW_N_LIMITS; i++)
    {
      const SwLimit *l = sw_limit_get (i);

      g_assert_nonnull (l);
      g_assert_nonnull (l->key);
      g_assert_cmpuint (strlen (l->key), >, 0);
      g_assert_nonnull (l->unit);
      /* Every key is documented: a reason for its range. */
      g_assert_nonnull (l->why);
      g_assert_cmpuint (strlen (l->why), >, 10);
      g_assert_true (isfinite (l->min) && isfinite (l->max));
      g_assert_cmpfloat (l->min, <, l->max);
      g_assert_false (g_hash_table_contains (seen, l->key));
      g_hash_table_add (seen, (gpointer) l->key);
    }
  for (guint k = 0; k < G_N_ELEMENTS (format_keys); k++)
    if (limit_by_key (format_keys[k]) == NULL)
      g_error ("no limit for the format's key %s", format_keys[k]);
  /* The propellant name's limit fits the buffer the design keeps it in. */
  g_assert_cmpfloat (sw_limit_get (SW_LIMIT_PROPELLANT_NAME_LENGTH)->max, ==,
                     SW_PROPELLANT_NAME_MAX - 1);
}

/* The ranges hold what the trade uses and exclude what physics forbids. */
static void
test_table_sane (void)
{
  const SwLimit *eps = sw_limit_get (SW_LIMIT_STRUCTURAL_COEFFICIENT);
  const SwLimit *isp = sw_limit_get (SW_LIMIT_ISP_VAC);
  const SwLimit *isp_sl = sw_limit_get (SW_LIMIT_ISP_SL);
  const SwLimit *dv = sw_limit_get (SW_LIMIT_DELTA_V);
  const SwLimit *lat = sw_limit_get (SW_LIMIT_SITE_LATITUDE);
  const SwLimit *inc = sw_limit_get (SW_LIMIT_INCLINATION);
  const SwLimit *share = sw_limit_get (SW_LIMIT_DELTA_V_SHARE);
  const SwLimit *count = sw_limit_get (SW_LIMIT_STAGE_COUNT);
  const SwLimit *losses = sw_limit_get (SW_LIMIT_LOSSES);
  const SwLimit *alt = sw_limit_get (SW_LIMIT_ALTITUDE);
  const SwLimit *payload = sw_limit_get (SW_LIMIT_PAYLOAD);

  /* eps = ms/(ms + mp) lies strictly between 0 and 1 (definition). */
  g_assert_cmpfloat (eps->min, >, 0.0);
  g_assert_cmpfloat (eps->max, <, 1.0);
  /* Structural coefficients 0.05 to 0.15 (common practice: liquid first
   * stages 0.05-0.08, upper stages 0.08-0.12, solids 0.08-0.15) and the
   * kerosene first stage's 0.051 (common practice) are accepted. */
  g_assert_true (sw_limit_contains (SW_LIMIT_STRUCTURAL_COEFFICIENT, 0.05));
  g_assert_true (sw_limit_contains (SW_LIMIT_STRUCTURAL_COEFFICIENT, 0.15));
  /* Chemical engines, solids at about 265 s to hydrogen near 465 s vacuum
   * (Sutton, propellant table, from memory). */
  g_assert_true (sw_limit_contains (SW_LIMIT_ISP_VAC, 242.0));
  g_assert_true (sw_limit_contains (SW_LIMIT_ISP_VAC, 465.0));
  g_assert_cmpfloat (isp->min, >, 0.0);
  g_assert_cmpfloat (isp_sl->min, ==, 0.0);
  g_assert_cmpfloat (isp_sl->max, <=, isp->max);
  /* 9.3 to 10 km/s to low orbit (common practice) fits. */
  g_assert_true (sw_limit_contains (SW_LIMIT_DELTA_V, 9300.0));
  g_assert_true (sw_limit_contains (SW_LIMIT_DELTA_V, 10000.0));
  g_assert_true (dv->min_exclusive && dv->min == 0.0);
  /* Losses to low orbit 1.0 to 1.8 km/s gravity plus drag and steering
   * (common practice). */
  g_assert_true (sw_limit_contains (SW_LIMIT_LOSSES, 1000.0));
  g_assert_true (sw_limit_contains (SW_LIMIT_LOSSES, 2150.0));
  g_assert_cmpfloat (losses->min, ==, 0.0);
  /* Geometry of the sphere. */
  /* Every site but the poles, where sin(az) = cos(i) / cos(latitude) has no
   * answer (the launch azimuth is undefined). */
  g_assert_cmpfloat (lat->min, >, -90.0);
  g_assert_cmpfloat (lat->max, <, 90.0);
  g_assert_cmpfloat (lat->min, ==, -lat->max);
  g_assert_cmpfloat (inc->min, ==, 0.0);
  g_assert_cmpfloat (inc->max, ==, 180.0);
  g_assert_cmpfloat (share->min, ==, 0.0);
  g_assert_cmpfloat (share->max, ==, 1.0);
  g_assert_cmpfloat (alt->min, >=, 100.0);
  g_assert_cmpfloat (payload->min, >, 0.0);
  /* The model's own sizes. */
  g_assert_cmpfloat (count->min, ==, 1.0);
  g_assert_cmpfloat (count->max, ==, SW_MAX_STAGES);
  g_assert_cmpfloat (sw_limit_get (SW_LIMIT_NAME_LENGTH)->max, ==, SW_NAME_MAX - 1);
}

static void
test_contains_edges (void)
{
  for (guint i = 0; i < SW_N_LIMITS; i++)
    {
      const SwLimit *l = sw_limit_get (i);

      g_assert_true (sw_limit_contains (i, 0.5 * (l->min + l->max)));
      g_assert_true (sw_limit_contains (i, l->max));
      g_assert_false (sw_limit_contains (i, nextafter (l->max, INFINITY)));
      g_assert_cmpint (sw_limit_contains (i, l->min), ==, !l->min_exclusive);
      g_assert_true (sw_limit_contains (i, nextafter (l->min, INFINITY)));
      g_assert_false (sw_limit_contains (i, nextafter (l->min, -INFINITY)));
      g_assert_false (sw_limit_contains (i, NAN));
      g_assert_false (sw_limit_contains (i, INFINITY));
      g_assert_false (sw_limit_contains (i, -INFINITY));
    }
}

static void
test_invalid_id (void)
{
  if (g_test_subprocess ())
    {
      /* A guard, not an out-of-bounds read. */
      g_assert_null (sw_limit_get (SW_N_LIMITS));
      return;
    }
  g_test_trap_subprocess (NULL, 0, G_TEST_SUBPROCESS_DEFAULT);
  g_test_trap_assert_failed ();
  g_test_trap_assert_stderr ("*CRITICAL*SW_N_LIMITS*");
}

/* A bound of the README table back to a number: "10,000,000" -> 1e7. */
static double
parse_bound (const char *text)
{
  g_autoptr (GString) plain = g_string_new (NULL);
  char *end = NULL;
  double value;

  for (const char *p = text; *p; p++)
    if (*p != ',')
      g_string_append_c (plain, *p);
  value = g_ascii_strtod (plain->str, &end);
  g_assert_true (end != plain->str && *end == '\0');
  return value;
}

/* The table `stagewright-cli limits` prints for the README: one row per
 * limit, in table order, whose cells read back to the table's own values. */
static void
test_markdown (void)
{
  g_autofree char *md = sw_limits_dup_markdown ();
  g_auto (GStrv) lines = g_strsplit (md, "\n", -1);
  guint rows = 0;

  g_assert_true (g_str_has_prefix (lines[0], "| field | unit | range | why |"));
  g_assert_true (g_str_has_prefix (lines[1], "|---"));
  for (guint i = 2; lines[i] != NULL && lines[i][0] != '\0'; i++)
    {
      const SwLimit *l = sw_limit_get (rows);
      g_auto (GStrv) why_parts = g_strsplit (l->why, "|", -1);
      g_autofree char *why = g_strjoinv ("\\|", why_parts);
      g_autoptr (GPtrArray) cells = g_ptr_array_new_with_free_func (g_free);
      g_auto (GStrv) bounds = NULL;
      const char *range, *start = lines[i] + 1;

      g_assert_cmpuint (rows, <, SW_N_LIMITS);
      /* Four cells split at the '|' that are not escaped. */
      g_assert_true (lines[i][0] == '|');
      for (const char *p = start; *p; p++)
        if (*p == '|' && p[-1] != '\\')
          {
            g_ptr_array_add (cells, g_strstrip (g_strndup (start, (gsize) (p - start))));
            start = p + 1;
          }
      g_assert_cmpstr (start, ==, "");
      g_assert_cmpuint (cells->len, ==, 4);
      /* The field is the key's JSON path in code style, ending in the key
       * (or naming it in brackets). */
      g_assert_nonnull (strstr (cells->pdata[0], l->key));
      g_assert_true (((char *) cells->pdata[0])[0] == '`');
      g_assert_cmpstr (cells->pdata[1], ==, l->unit[0] ? l->unit : "-");
      range = cells->pdata[2];
      g_assert_cmpint (g_str_has_prefix (range, "above "), ==, l->min_exclusive);
      bounds = g_strsplit (range + (l->min_exclusive ? strlen ("above ") : 0), " to ", -1);
      g_assert_cmpuint (g_strv_length (bounds), ==, 2);
      g_assert_cmpfloat (parse_bound (bounds[0]), ==, l->min);
      g_assert_cmpfloat (parse_bound (bounds[1]), ==, l->max);
      g_assert_cmpstr (cells->pdata[3], ==, why);
      rows++;
    }
  g_assert_cmpuint (rows, ==, SW_N_LIMITS);
  /* Large bounds are grouped for reading, small ones are not. */
  g_assert_nonnull (strstr (md, "| 0.1 to 10,000,000 |"));
  g_assert_nonnull (strstr (md, "| 0 to 4,294,967,295 |"));
  g_assert_nonnull (strstr (md, "| 0 to 5000 |"));
  g_assert_nonnull (strstr (md, "| -89.9 to 89.9 |"));
  /* Nested keys are shown with their path. */
  g_assert_nonnull (strstr (md, "| `mission.orbit.altitude_km` |"));
  g_assert_nonnull (strstr (md, "| `stages[].isp_vac_s`, `boosters.isp_vac_s` |"));
  g_assert_nonnull (strstr (md, "| `ascent.pitch_kick_deg` |"));
}

/* ---- the loader reads this table ---------------------------------------- */

static SwDesign *
base_design (gboolean orbit)
{
  SwDesign *d = sw_design_new_default ();

  d->split = SW_SPLIT_MANUAL;
  if (orbit)
    {
      d->mission.kind = SW_MISSION_ORBIT;
      d->mission.altitude_km = 400.0;
      d->mission.inclination_deg = 90.0;
      d->mission.site_latitude_deg = 0.0;
      d->mission.losses_m_s = 1500.0;
      d->mission.has_losses = TRUE;
    }
  return d;
}

/* Replaces the number at @path (object keys, "stages" followed by an index)
 * of the saved design with @value and loads the text again. */
static SwDesign *
load_with (const SwDesign *d, const char *const *path, double value, GError **error)
{
  g_autoptr (JsonNode) root = sw_design_to_json (d);
  g_autoptr (JsonGenerator) gen = json_generator_new ();
  g_autofree char *text = NULL;
  JsonObject *obj = json_node_get_object (root);
  guint i = 0;

  while (path[i + 1] != NULL)
    if (strcmp (path[i], "stages") == 0)
      {
        JsonArray *stages = json_object_get_array_member (obj, "stages");
        obj = json_array_get_object_element (stages, (guint) atoi (path[i + 1]));
        i += 2;
      }
    else
      obj = json_object_get_object_member (obj, path[i++]);
  json_object_set_double_member (obj, path[i], value);
  json_generator_set_root (gen, root);
  text = json_generator_to_data (gen, NULL);
  return sw_design_load_data (text, -1, "limits.stagewright", NULL, error);
}

typedef struct {
  SwLimitId   id;
  gboolean    orbit;
  const char *path[4];
  const char *message_path;
} LoaderCase;

static void
test_loader_uses_table (void)
{
  static const LoaderCase cases[] = {
    { SW_LIMIT_PAYLOAD, FALSE, { "payload_kg" }, "payload_kg" },
    { SW_LIMIT_DELTA_V, FALSE, { "mission", "delta_v_m_s" }, "mission.delta_v_m_s" },
    { SW_LIMIT_ALTITUDE, TRUE, { "mission", "orbit", "altitude_km" },
      "mission.orbit.altitude_km" },
    { SW_LIMIT_LOSSES, TRUE, { "mission", "losses_m_s" }, "mission.losses_m_s" },
    { SW_LIMIT_ISP_VAC, FALSE, { "stages", "1", "isp_vac_s" }, "stages[1].isp_vac_s" },
    { SW_LIMIT_ISP_SL, FALSE, { "stages", "0", "isp_sl_s" }, "stages[0].isp_sl_s" },
    { SW_LIMIT_STRUCTURAL_COEFFICIENT, FALSE, { "stages", "1", "structural_coefficient" },
      "stages[1].structural_coefficient" },
  };

  for (guint k = 0; k < G_N_ELEMENTS (cases); k++)
    {
      const LoaderCase *c = &cases[k];
      const SwLimit *l = sw_limit_get (c->id);
      g_autoptr (SwDesign) d = base_design (c->orbit);
      g_autoptr (GError) error = NULL;
      g_autofree char *range = g_strdup_printf ("%.10g to %.10g", l->min, l->max);
      double inside[2] = { l->min_exclusive ? nextafter (l->min, INFINITY) : l->min, l->max };
      double outside[2] = { l->min - 0.01 * (l->max - l->min), l->max * 1.01 };

      /* The sea-level Isp may not exceed the vacuum Isp: give room. */
      d->stages[0].isp_vac_s = 1000.0;
      for (guint j = 0; j < 2; j++)
        {
          g_autoptr (SwDesign) ok = load_with (d, c->path, inside[j], &error);
          g_autoptr (SwDesign) bad = NULL;

          g_assert_no_error (error);
          g_assert_nonnull (ok);
          bad = load_with (d, c->path, outside[j], &error);
          g_assert_null (bad);
          g_assert_error (error, SW_ERROR, SW_ERROR_RANGE);
          g_assert_nonnull (strstr (error->message, c->message_path));
          g_assert_nonnull (strstr (error->message, range));
          g_clear_error (&error);
        }
      if (l->min_exclusive)
        {
          g_autoptr (SwDesign) bad = load_with (d, c->path, l->min, &error);
          g_assert_null (bad);
          g_assert_error (error, SW_ERROR, SW_ERROR_RANGE);
          g_clear_error (&error);
        }
    }

  /* Inclination and latitude: the full range from the equator, and the
   * range message outside it. */
  {
    static const char *const inc_path[] = { "mission", "orbit", "inclination_deg", NULL };
    static const char *const lat_path[] = { "mission", "orbit", "site_latitude_deg", NULL };
    g_autoptr (SwDesign) d = base_design (TRUE);
    g_autoptr (GError) error = NULL;
    SwDesign *r;

    r = load_with (d, inc_path, 0.0, &error);
    g_assert_no_error (error);
    sw_design_free (r);
    r = load_with (d, inc_path, 180.0, &error);
    g_assert_no_error (error);
    sw_design_free (r);
    g_assert_null (load_with (d, inc_path, -0.5, &error));
    g_assert_nonnull (strstr (error->message, "0 to 180"));
    g_clear_error (&error);
    g_assert_null (load_with (d, inc_path, 180.5, &error));
    g_assert_nonnull (strstr (error->message, "mission.orbit.inclination_deg"));
    g_clear_error (&error);
    r = load_with (d, lat_path, -89.0, &error);
    g_assert_no_error (error);
    sw_design_free (r);
    g_assert_null (load_with (d, lat_path, 90.5, &error));
    g_assert_nonnull (strstr (error->message, "-89.9 to 89.9"));
    g_clear_error (&error);
  }

  /* Manual shares: 0 and 1 at the edges, outside them the range message. */
  {
    static const char *const s0[] = { "stages", "0", "delta_v_share", NULL };
    static const char *const s1[] = { "stages", "1", "delta_v_share", NULL };
    g_autoptr (SwDesign) d = base_design (FALSE);
    g_autoptr (GError) error = NULL;
    g_autoptr (SwDesign) ok = NULL;

    d->stages[0].delta_v_share = 1.0;
    d->stages[1].delta_v_share = 0.0;
    ok = load_with (d, s0, 1.0, &error);
    g_assert_no_error (error);
    g_assert_null (load_with (d, s1, -0.001, &error));
    g_assert_nonnull (strstr (error->message, "stages[1].delta_v_share"));
    g_assert_nonnull (strstr (error->message, "0 to 1"));
    g_clear_error (&error);
  }
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/core/limits/table-complete", test_table_complete);
  g_test_add_func ("/core/limits/table-sane", test_table_sane);
  g_test_add_func ("/core/limits/contains-edges", test_contains_edges);
  g_test_add_func ("/core/limits/invalid-id", test_invalid_id);
  g_test_add_func ("/core/limits/markdown", test_markdown);
  g_test_add_func ("/core/limits/loader-uses-table", test_loader_uses_table);

  return g_test_run ();
}
