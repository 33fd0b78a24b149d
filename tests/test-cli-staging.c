/* SPDX-License-Identifier: GPL-3.0-or-later */
/* stagewright-cli stages and carpet: every number of the JSON equals the
 * core's own result for the same design (sw_staging_compute,
 * sw_carpet_compute), the CSV holds the same grid, the table carries the
 * literal markers and statements, and bad input exits 2 with a message
 * that names the option.  Runs the built program (env SW_CLI). */
#include "config.h"

#include "sw-analysis.h"

#include "sw-carpet.h"
#include "sw-design.h"
#include "sw-staging.h"

#include <glib/gstdio.h>
#include <json-glib/json-glib.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>
#include <sys/wait.h>

#define CLI_TIMEOUT_S 60

static const char *design_json =
  "{ \"format\": \"stagewright-design\", \"version\": 1, \"name\": \"CLI staging test\",\n"
  "  \"payload_kg\": 2000, \"mission\": { \"delta_v_m_s\": 9300 }, \"split\": \"optimal\",\n"
  "  \"stages\": [\n"
  "    { \"name\": \"A\", \"isp_vac_s\": 310, \"isp_sl_s\": 280, \"structural_coefficient\": 0.06,\n"
  "      \"engine_count\": 9, \"engine_reliability\": 0.995, \"engine_failures_tolerated\": 1 },\n"
  "    { \"name\": \"B\", \"isp_vac_s\": 345, \"structural_coefficient\": 0.09,\n"
  "      \"engine_reliability\": 0.993 } ],\n"
  "  \"economics\": { \"production_run\": 30, \"work_year_cost\": 200000, \"currency\": \"EUR\",\n"
  "    \"engine_types\": [ { \"name\": \"E1\", \"dry_mass_kg\": 900, \"on_stages\": [0, 1] } ],\n"
  "    \"recovery\": { \"mode\": \"launch_site\" } } }\n";

typedef struct {
  char *out;
  char *err;
  int   code;
} Run;

static void
run_clear (Run *r)
{
  g_clear_pointer (&r->out, g_free);
  g_clear_pointer (&r->err, g_free);
}

static void
run_cli (Run *r, const char *first, ...)
{
  g_autoptr (GPtrArray) argv = g_ptr_array_new ();
  g_autoptr (GError) error = NULL;
  g_autofree char *secs = g_strdup_printf ("%d", CLI_TIMEOUT_S);
  const char *cli = g_getenv ("SW_CLI");
  int status = 0;
  va_list ap;

  g_assert_nonnull (cli);
  g_ptr_array_add (argv, (gpointer) "timeout");
  g_ptr_array_add (argv, secs);
  g_ptr_array_add (argv, (gpointer) cli);
  va_start (ap, first);
  for (const char *a = first; a != NULL; a = va_arg (ap, const char *))
    g_ptr_array_add (argv, (gpointer) a);
  va_end (ap);
  g_ptr_array_add (argv, NULL);
  memset (r, 0, sizeof *r);
  g_assert_true (g_spawn_sync (NULL, (char **) argv->pdata, NULL, G_SPAWN_SEARCH_PATH, NULL,
                               NULL, &r->out, &r->err, &status, &error));
  g_assert_no_error (error);
  g_assert_true (WIFEXITED (status));
  r->code = WEXITSTATUS (status);
  if (r->code == 124)
    g_error ("stagewright-cli %s did not finish within %d s", first, CLI_TIMEOUT_S);
}

static char *
write_design (void)
{
  g_autoptr (GError) error = NULL;
  char *path = NULL;
  int fd = g_file_open_tmp ("sw-cli-staging-XXXXXX.stagewright", &path, &error);

  g_assert_no_error (error);
  close (fd);
  g_assert_true (g_file_set_contents (path, design_json, -1, &error));
  return path;
}

static JsonObject *
parse (const char *text, JsonNode **keep)
{
  g_autoptr (JsonParser) parser = json_parser_new ();
  g_autoptr (GError) error = NULL;

  if (!json_parser_load_from_data (parser, text, -1, &error))
    g_error ("not JSON (%s): %s", error->message, text);
  *keep = json_node_copy (json_parser_get_root (parser));
  g_assert_true (JSON_NODE_HOLDS_OBJECT (*keep));
  return json_node_get_object (*keep);
}

/* The JSON number equals the core's (1e-15 relative: %.17g round-trips);
 * a NAN core value must be null. */
static void
check_value (JsonNode *n, const char *what, double core)
{
  if (n == NULL)
    g_error ("missing %s", what);
  if (isnan (core))
    {
      if (!JSON_NODE_HOLDS_NULL (n))
        g_error ("%s: the core has no value, the CLI prints %g", what, json_node_get_double (n));
      return;
    }
  g_assert_true (JSON_NODE_HOLDS_VALUE (n));
  if (!(fabs (json_node_get_double (n) - core) <= 1e-15 * fabs (core) + 1e-300))
    g_error ("%s: CLI %.17g, core %.17g", what, json_node_get_double (n), core);
}

static void
check (JsonObject *o, const char *key, double core)
{
  check_value (json_object_get_member (o, key), key, core);
}

static void
test_stages_json (void)
{
  g_autofree char *path = write_design ();
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, NULL);
  g_autoptr (JsonNode) keep = NULL;
  JsonObject *o, *w;
  JsonArray *rows;
  SwStaging s;
  Run r;

  g_assert_nonnull (d);
  g_assert_true (sw_staging_compute (d, 5, &s, NULL));
  run_cli (&r, "stages", path, "--max-stages", "5", "--json", NULL);
  g_assert_cmpint (r.code, ==, 0);
  o = parse (r.out, &keep);
  g_assert_cmpint (json_object_get_int_member (o, "design_stage_count"), ==, 2);
  g_assert_true (json_object_get_boolean_member (o, "design_recovers_first_stage"));
  g_assert_cmpstr (json_object_get_string_member (o, "recovery_mode"), ==, "launch_site");
  /* The launch-site default, from memory (the reference notes' example). */
  check (o, "recovery_delta_v_m_s", 2750.0);
  check (o, "work_year_cost", 200000.0);
  g_assert_cmpstr (json_object_get_string_member (o, "currency"), ==, "EUR");
  g_assert_nonnull (strstr (json_object_get_string_member (o, "money_note"), "never a quote"));
  /* Every economics key, in force, nested as in the file. */
  {
    JsonObject *e = json_object_get_object_member (o, "economics");
    JsonArray *types = json_object_get_array_member (e, "engine_types");
    JsonArray *on = json_object_get_array_member (json_array_get_object_element (types, 0),
                                                  "on_stages");

    g_assert_cmpstr (json_object_get_string_member (e, "currency"), ==, "EUR");
    g_assert_cmpint (json_object_get_int_member (e, "production_run"), ==, 30);
    check (e, "work_year_cost", 200000.0);
    check (e, "learning_rate", d->economics.learning_rate);
    check (json_object_get_object_member (e, "cost_coefficients"), "systems_factor_per_stage",
           1.04);
    g_assert_cmpstr (json_object_get_string_member (json_object_get_object_member (e, "recovery"),
                                                    "mode"), ==, "launch_site");
    check (json_object_get_object_member (e, "recovery"), "recovery_delta_v_m_s", 2750.0);
    check (json_object_get_object_member (e, "decision_weights"), "failure", 1.0);
    g_assert_cmpuint (json_array_get_length (types), ==, 1);
    g_assert_cmpuint (json_array_get_length (on), ==, 2);
    g_assert_cmpint (json_array_get_int_element (on, 1), ==, 1);
    g_assert_cmpuint (json_array_get_length (json_object_get_array_member (e, "developed_stages")),
                      ==, 0);
  }
  check (o, "design_liftoff_mass_kg", s.design_liftoff_mass_kg);
  g_assert_cmpint (json_object_get_int_member (o, "best_stage_count"), ==,
                   s.rows[s.best].n_stages);
  w = json_object_get_object_member (o, "weighting");
  check (w, "liftoff_mass", 1.0);
  check (w, "failure", 1.0);
  g_assert_cmpstr (json_object_get_string_member (w, "statement"), ==, s.weighting);
  g_assert_nonnull (strstr (json_object_get_string_member (o, "effort_note"), "never a quote"));
  g_assert_nonnull (strstr (json_object_get_string_member (o, "caution"),
                            "Conceptual sizing only"));
  rows = json_object_get_array_member (o, "by_stage_count");
  g_assert_cmpuint (json_array_get_length (rows), ==, 5);
  for (guint i = 0; i < 5; i++)
    {
      JsonObject *row = json_array_get_object_element (rows, i);
      const SwStagingRow *c = &s.rows[i];

      g_assert_cmpint (json_object_get_int_member (row, "stage_count"), ==, i + 1);
      g_assert_cmpstr (json_object_get_string_member (row, "arrangement"), ==, "serial");
      g_assert_cmpint (json_object_get_boolean_member (row, "closes"), ==, c->feasible);
      g_assert_cmpint (json_object_get_boolean_member (row, "closes_recovered"), ==,
                       c->reused_feasible);
      check (row, "liftoff_mass_kg", c->liftoff_mass_kg);
      check (row, "liftoff_mass_recovered_kg", c->liftoff_mass_reused_kg);
      check (row, "recovery_payload_penalty", c->payload_penalty_fraction);
      check (row, "development_work_years", c->development_work_years);
      check (row, "development_recovered_work_years", c->development_reused_work_years);
      check (row, "per_flight_work_years", c->cost_per_flight_work_years);
      check (row, "per_flight_recovered_work_years", c->cost_per_flight_reused_work_years);
      check (row, "development_money", c->development_work_years * 200000.0);
      check (row, "per_flight_money", c->cost_per_flight_work_years * 200000.0);
      check (row, "mission_success", c->success_probability);
      check (row, "payload_at_design_liftoff_mass_kg", c->payload_fixed_size_kg);
      check (row, "weighted_score", c->score);
    }
  /* One stage does not close: its figures are null, the reason given. */
  g_assert_false (s.rows[0].feasible);
  g_assert_nonnull (json_object_get_string_member (json_array_get_object_element (rows, 0),
                                                   "why_not"));
  run_clear (&r);
  g_unlink (path);
}

static void
test_stages_table (void)
{
  g_autofree char *path = write_design ();
  Run r;

  run_cli (&r, "stages", path, NULL);
  g_assert_cmpint (r.code, ==, 0);
  g_assert_nonnull (strstr (r.out, "Design: CLI staging test (2 stages)\n"));
  g_assert_nonnull (strstr (r.out, "Recovered column: first stage returns to the launch site, "
                                   "recovery delta-v 2,750 m/s\n"));
  g_assert_nonnull (strstr (r.out, "* best stage count   > this design's stage count   "
                                   "wy: work-years\n"));
  g_assert_nonnull (strstr (r.out, "Weights: liftoff mass 1, development effort 1, cost per "
                                   "flight (first stage reused) 1, failure probability 1; each "
                                   "criterion divided by its best stage count, the lowest sum "
                                   "wins\n"));
  /* The design's own row is marked; the one-stage row does not close. */
  g_assert_nonnull (strstr (r.out, ">  2 "));
  {
    /* The one-stage row: its liftoff mass cell holds the no-value mark
     * (an em dash or "-", by the locale's charset), never a number. */
    const char *row = strstr (r.out, "\n    1  ");
    g_autofree char *first = NULL;

    g_assert_nonnull (row);
    first = g_strndup (row + 8, 14);
    g_strstrip (first);
    g_assert_false (g_ascii_isdigit (first[0]));
    g_assert_cmpuint (strlen (first), >, 0);
  }
  g_assert_nonnull (strstr (r.out, "never a quote"));
  g_assert_nonnull (strstr (r.out, "Conceptual sizing only"));
  /* Money in the design's currency, with the note that it is no quote. */
  {
    g_autoptr (SwDesign) d = sw_design_load (path, NULL, NULL);
    SwStaging s;
    g_autofree char *dev = NULL;
    g_autofree char *line = NULL;

    g_assert_true (sw_staging_compute (d, 6, &s, NULL));
    /* Three significant figures: an estimate, not to the unit. */
    {
      double v = s.rows[s.best].development_work_years * 200000.0;
      double scale = pow (10.0, floor (log10 (v)) - 2.0);
      dev = g_strdup_printf ("%.0f", round (v / scale) * scale);
    }
    /* The formatter groups thousands with commas in the C locale. */
    for (int k = (int) strlen (dev) - 3; k > 0; k -= 3)
      {
        g_autofree char *head = g_strndup (dev, k);
        g_autofree char *tail = g_strdup (dev + k);
        g_free (dev);
        dev = g_strconcat (head, ",", tail, NULL);
      }
    line = g_strdup_printf ("At 200,000 EUR per work-year, the best count: development %s EUR, "
                            "per flight ", dev);
    if (strstr (r.out, line) == NULL)
      g_error ("no \"%s\" in:\n%s", line, r.out);
    g_assert_nonnull (strstr (r.out, "Money is the effort in work-years times the design's cost "
                                     "of a work-year: an estimate for comparing concepts, never "
                                     "a quote.\n"));
  }
  run_clear (&r);

  run_cli (&r, "stages", path, "--max-stages", "7", NULL);
  g_assert_cmpint (r.code, ==, 2);
  g_assert_nonnull (strstr (r.err, "--max-stages 7: give 1 to 6"));
  run_clear (&r);
  g_unlink (path);
}

static void
test_carpet_json_csv (void)
{
  g_autofree char *path = write_design ();
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, NULL);
  g_autoptr (SwCarpet) c = NULL;
  g_autoptr (JsonNode) keep = NULL;
  g_auto (GStrv) lines = NULL;
  SwCarpetOptions opt = { 0 };
  JsonObject *o;
  JsonArray *rows;
  Run r;

  g_assert_true (sw_carpet_param_parse ("stages[0].structural_coefficient", d, &opt.x, NULL));
  g_assert_true (sw_carpet_param_parse ("stages[1].isp_vac_s", d, &opt.y, NULL));
  opt.x.min = 0.03;
  opt.x.max = 0.2;
  opt.x.n = 7;
  opt.y.min = 300;
  opt.y.max = 460;
  opt.y.n = 5;
  opt.output = SW_CARPET_PAYLOAD;
  c = sw_carpet_compute (d, &opt, NULL);
  g_assert_nonnull (c);

  run_cli (&r, "carpet", path, "--x", "stages[0].structural_coefficient:0.03:0.2:7", "--y",
           "stages[1].isp_vac_s:300:460:5", "--output", "payload", "--json", NULL);
  g_assert_cmpint (r.code, ==, 0);
  o = parse (r.out, &keep);
  g_assert_cmpstr (json_object_get_string_member (o, "quantity"), ==, "payload");
  g_assert_cmpstr (json_object_get_string_member (o, "unit"), ==, "kg");
  g_assert_cmpstr (json_object_get_string_member (json_object_get_object_member (o, "x"),
                                                  "parameter"),
                   ==, "stages[0].structural_coefficient");
  check (json_object_get_object_member (o, "this_design"), "value", c->design_value);
  check (json_object_get_object_member (o, "this_design"), "x", 0.06);
  g_assert_cmpint (json_object_get_int_member (o, "points_not_closing"), ==, c->n_infeasible);
  rows = json_object_get_array_member (o, "rows");
  g_assert_cmpuint (json_array_get_length (rows), ==, 5);
  for (guint j = 0; j < 5; j++)
    {
      JsonArray *row = json_array_get_array_element (rows, j);
      g_assert_cmpuint (json_array_get_length (row), ==, 7);
      for (guint i = 0; i < 7; i++)
        check_value (json_array_get_element (row, i), "grid value", c->values[j * 7 + i]);
    }
  run_clear (&r);

  run_cli (&r, "carpet", path, "--x", "stages[0].structural_coefficient:0.03:0.2:7", "--y",
           "stages[1].isp_vac_s:300:460:5", "--output", "payload", "--csv", NULL);
  g_assert_cmpint (r.code, ==, 0);
  lines = g_strsplit (r.out, "\n", -1);
  g_assert_true (g_str_has_prefix (lines[0], "# Conceptual sizing only"));
  g_assert_cmpstr (lines[1], ==, "stages[0].structural_coefficient,stages[1].isp_vac_s,"
                                 "payload_kg,closes");
  g_assert_cmpuint (g_strv_length (lines), ==, 2 + 35 + 1);
  for (guint k = 0; k < 35; k++)
    {
      g_auto (GStrv) f = g_strsplit (lines[2 + k], ",", -1);
      double v = c->values[k];

      g_assert_cmpuint (g_strv_length (f), ==, 4);
      g_assert_cmpfloat_with_epsilon (g_ascii_strtod (f[0], NULL),
                                      sw_carpet_axis_value (&c->x, k % 7), 1e-12);
      if (isfinite (v))
        {
          g_assert_cmpfloat_with_epsilon (g_ascii_strtod (f[2], NULL) / v, 1.0, 1e-11);
          g_assert_cmpstr (f[3], ==, "true");
        }
      else
        {
          g_assert_cmpstr (f[2], ==, "");
          g_assert_cmpstr (f[3], ==, "false");
        }
    }
  run_clear (&r);
  g_unlink (path);
}

static void
test_carpet_errors (void)
{
  g_autofree char *path = write_design ();
  Run r;

  run_cli (&r, "carpet", path, "--x", "stages[0].isp_vac_s:300:340", "--y",
           "payload_kg:100:200:3", NULL);
  g_assert_cmpint (r.code, ==, 2);
  g_assert_nonnull (strstr (r.err, "--x stages[0].isp_vac_s:300:340: expected PARAM:MIN:MAX:N"));
  run_clear (&r);
  run_cli (&r, "carpet", path, "--x", "stages[5].isp_vac_s:300:340:4", "--y",
           "payload_kg:100:200:3", NULL);
  g_assert_cmpint (r.code, ==, 2);
  g_assert_nonnull (strstr (r.err, "stages[5].isp_vac_s: the design has 2 stages"));
  run_clear (&r);
  run_cli (&r, "carpet", path, "--x", "stages[0].isp_vac_s:270:340:4", "--y",
           "payload_kg:100:200:3", NULL);
  g_assert_cmpint (r.code, ==, 2);
  g_assert_nonnull (strstr (r.err, "below the stage's sea-level Isp of 280 s"));
  run_clear (&r);
  run_cli (&r, "carpet", path, "--y", "payload_kg:100:200:3", NULL);
  g_assert_cmpint (r.code, ==, 2);
  g_assert_nonnull (strstr (r.err, "--x is required (PARAM:MIN:MAX:N)"));
  run_clear (&r);
  run_cli (&r, "carpet", path, "--x", "payload_kg:100:200:3", "--y",
           "stages[1].isp_vac_s:300:340:4", "--output", "mass", NULL);
  g_assert_cmpint (r.code, ==, 2);
  g_assert_nonnull (strstr (r.err, "--output mass: use liftoff_mass, payload"));
  run_clear (&r);
  g_unlink (path);
}

/* `export --csv` writes the staging decision and the default carpet: the
 * same numbers as the core's. */
static void
test_export_csv (void)
{
  g_autofree char *path = write_design ();
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, NULL);
  g_autoptr (GError) error = NULL;
  g_autofree char *dir = g_dir_make_tmp ("sw-cli-staging-XXXXXX", &error);
  g_autofree char *decision = g_build_filename (dir, "stage-decision.csv", NULL);
  g_autofree char *carpet = g_build_filename (dir, "carpet.csv", NULL);
  g_autofree char *text = NULL;
  g_auto (GStrv) lines = NULL;
  g_autoptr (SwCarpet) c = NULL;
  SwCarpetOptions o;
  SwStaging s;
  Run r;

  g_assert_no_error (error);
  run_cli (&r, "export", path, "--csv", dir, "--no-montecarlo", "--no-ascent", NULL);
  g_assert_cmpint (r.code, ==, 0);
  run_clear (&r);
  g_assert_true (sw_staging_compute (d, 6, &s, NULL));
  g_assert_true (g_file_get_contents (decision, &text, NULL, &error));
  lines = g_strsplit (text, "\n", -1);
  g_assert_true (g_str_has_prefix (lines[0], "# Conceptual sizing only"));
  g_assert_cmpstr (lines[1] + 2, ==, s.weighting);
  /* The rows whose recovered first stage the split gives no delta-v have
   * no recovered figures, and a comment line says which and why. */
  {
    g_autofree char *unrecovered = sw_staging_dup_unrecovered_note (&s);
    g_assert_nonnull (unrecovered);
    g_assert_cmpstr (lines[2] + 2, ==, unrecovered);
  }
  g_assert_cmpstr (lines[3], ==, "# money in EUR at 200000 EUR per work-year. Money is the effort "
                                 "in work-years times the design's cost of a work-year: an "
                                 "estimate for comparing concepts, never a quote.");
  g_assert_true (g_str_has_prefix (lines[4], "stage_count,closes,closes_recovered,liftoff_mass_kg,"));
  g_assert_true (g_str_has_suffix (lines[4], ",this_design,development_money,per_flight_money,"
                                             "per_flight_recovered_money,arrangement"));
  for (guint i = 0; i < 6; i++)
    {
      g_auto (GStrv) f = g_strsplit (lines[5 + i], ",", -1);
      const double money[] = { s.rows[i].development_work_years * 200000.0,
                               s.rows[i].cost_per_flight_work_years * 200000.0,
                               s.rows[i].cost_per_flight_reused_work_years * 200000.0 };
      const double core[] = { s.rows[i].liftoff_mass_kg, s.rows[i].liftoff_mass_reused_kg,
                              s.rows[i].payload_penalty_fraction,
                              s.rows[i].development_work_years,
                              s.rows[i].development_reused_work_years,
                              s.rows[i].cost_per_flight_work_years,
                              s.rows[i].cost_per_flight_reused_work_years,
                              s.rows[i].success_probability, s.rows[i].payload_fixed_size_kg,
                              s.rows[i].score };

      g_assert_cmpuint (g_strv_length (f), ==, 19);
      g_assert_cmpstr (f[18], ==, "serial");
      for (guint k = 0; k < G_N_ELEMENTS (money); k++)
        if (isfinite (money[k]))
          g_assert_cmpfloat_with_epsilon (g_ascii_strtod (f[15 + k], NULL) / money[k], 1.0,
                                          1e-13);
        else
          g_assert_cmpstr (f[15 + k], ==, "");
      g_assert_cmpint (atoi (f[0]), ==, i + 1);
      g_assert_cmpstr (f[13], ==, (int) i == s.best ? "true" : "false");
      g_assert_cmpstr (f[14], ==, i + 1 == 2 ? "true" : "false");
      for (guint k = 0; k < G_N_ELEMENTS (core); k++)
        if (isfinite (core[k]))
          g_assert_cmpfloat_with_epsilon (g_ascii_strtod (f[3 + k], NULL) / core[k], 1.0, 1e-13);
        else
          g_assert_cmpstr (f[3 + k], ==, "");
    }
  g_clear_pointer (&text, g_free);
  g_clear_pointer (&lines, g_strfreev);

  /* The export's carpet: eps of stage 1 from 0.5 to 1.5 times 0.06, the top
   * stage's Isp from 0.85 to 1.15 times 345 s, 21 x 21, liftoff mass. */
  memset (&o, 0, sizeof o);
  g_assert_true (sw_carpet_param_parse ("stages[0].structural_coefficient", d, &o.x, NULL));
  g_assert_true (sw_carpet_param_parse ("stages[1].isp_vac_s", d, &o.y, NULL));
  o.x.min = 0.03;
  o.x.max = 0.09;
  o.y.min = 293.25;
  o.y.max = 396.75;
  o.x.n = o.y.n = 21;
  o.output = SW_CARPET_LIFTOFF_MASS;
  c = sw_carpet_compute (d, &o, NULL);
  g_assert_nonnull (c);
  g_assert_true (g_file_get_contents (carpet, &text, NULL, &error));
  lines = g_strsplit (text, "\n", -1);
  g_assert_cmpstr (lines[1], ==, "stages[0].structural_coefficient,stages[1].isp_vac_s,"
                                 "liftoff_mass_kg,closes");
  g_assert_cmpuint (g_strv_length (lines), ==, 2 + 21 * 21 + 1);
  for (guint k = 0; k < 21 * 21; k += 37)
    {
      g_auto (GStrv) f = g_strsplit (lines[2 + k], ",", -1);
      g_assert_cmpfloat_with_epsilon (g_ascii_strtod (f[2], NULL) / c->values[k], 1.0, 1e-13);
    }
  g_unlink (decision);
  g_unlink (carpet);
  {
    g_autoptr (GDir) gd = g_dir_open (dir, 0, NULL);
    const char *name;
    while ((name = g_dir_read_name (gd)) != NULL)
      {
        g_autofree char *p = g_build_filename (dir, name, NULL);
        g_unlink (p);
      }
  }
  g_rmdir (dir);
  g_unlink (path);
}

/* A design with strap-on boosters: `stages --json` has the serial rows and
 * then the rows with the boosters, every number the core's; the design's
 * row is the booster row of its stage count; the table heads each set and
 * the CSV names each row's arrangement. */
static void
test_stages_boosters (void)
{
  g_autofree char *path = g_build_filename (g_getenv ("SW_SOURCE_ROOT"), "data", "designs",
                                            "four-booster-cargo.stagewright", NULL);
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, NULL);
  g_autoptr (JsonNode) keep = NULL;
  g_autoptr (GError) error = NULL;
  JsonObject *o;
  JsonArray *rows;
  SwStaging s, first;
  Run r;

  g_assert_nonnull (d);
  /* A simulate design: `stages` flies the closed loop first, as the
   * analysis does, and sizes the rows with its losses. */
  {
    SwAnalysisOptions ao;
    g_autoptr (SwAnalysis) a = NULL;

    sw_analysis_options_init (&ao);
    ao.montecarlo = FALSE;
    a = sw_analysis_run (d, &ao, NULL);
    g_assert_true (a->ok && a->trade_losses_simulated);
    g_assert_true (sw_analysis_staging (a, 6, &s, NULL));
  }
  g_assert_nonnull (strstr (s.losses_note, "closed loop's losses"));
  /* `export --no-ascent` flies no loop: its CSV is the first guess's. */
  g_assert_true (sw_staging_compute (d, 6, &first, NULL));
  run_cli (&r, "stages", path, "--json", NULL);
  g_assert_cmpint (r.code, ==, 0);
  o = parse (r.out, &keep);
  g_assert_cmpint (json_object_get_int_member (o, "design_row"), ==, 2);
  g_assert_cmpstr (json_object_get_string_member (o, "design_row_arrangement"), ==, "boosters");
  g_assert_cmpint (json_object_get_int_member (o, "booster_count"), ==, 4);
  g_assert_cmpstr (json_object_get_string_member (o, "boosters_note"), ==, s.boosters_note);
  g_assert_cmpstr (json_object_get_string_member (o, "losses_note"), ==, s.losses_note);
  g_assert_cmpstr (s.losses_note, !=, "");
  g_assert_cmpstr (json_object_get_string_member (o, "best_arrangement"), ==,
                   sw_arrangement_to_string (s.rows[s.best].arrangement));
  rows = json_object_get_array_member (o, "by_stage_count");
  g_assert_cmpuint (json_array_get_length (rows), ==, 12);
  for (guint i = 0; i < 12; i++)
    {
      JsonObject *row = json_array_get_object_element (rows, i);
      const SwStagingRow *c = &s.rows[i];

      g_assert_cmpint (json_object_get_int_member (row, "stage_count"), ==, i % 6 + 1);
      g_assert_cmpstr (json_object_get_string_member (row, "arrangement"), ==,
                       i < 6 ? "serial" : "boosters");
      g_assert_cmpint (json_object_get_boolean_member (row, "this_design"), ==, i == 7);
      check (row, "liftoff_mass_kg", c->liftoff_mass_kg);
      check (row, "liftoff_mass_recovered_kg", c->liftoff_mass_reused_kg);
      check (row, "development_work_years", c->development_work_years);
      check (row, "per_flight_work_years", c->cost_per_flight_work_years);
      check (row, "payload_at_design_liftoff_mass_kg", c->payload_fixed_size_kg);
      check (row, "weighted_score", c->score);
    }
  /* The design's row carries the design's payload at its liftoff mass. */
  check (json_array_get_object_element (rows, 7), "payload_at_design_liftoff_mass_kg",
         d->payload_kg);
  run_clear (&r);

  run_cli (&r, "stages", path, NULL);
  g_assert_cmpint (r.code, ==, 0);
  g_assert_nonnull (strstr (r.out, "Serial stages, no boosters:\n"));
  g_assert_nonnull (strstr (r.out, "With this design's 4 strap-on boosters:\n"));
  g_assert_nonnull (strstr (r.out, "* best row   > this design (with its boosters)"));
  g_assert_nonnull (strstr (r.out, s.boosters_note));
  g_assert_null (strstr (r.out, "not modelled yet"));
  /* One mark of this design, after the booster heading. */
  {
    const char *with = strstr (r.out, "With this design's");
    const char *mark = strstr (r.out, ">  2 ");
    g_assert_nonnull (mark);
    g_assert_true (mark > with);
    g_assert_null (strstr (mark + 1, ">  "));
  }
  run_clear (&r);

  {
    g_autofree char *dir = g_dir_make_tmp ("sw-cli-staging-XXXXXX", &error);
    g_autofree char *decision = g_build_filename (dir, "stage-decision.csv", NULL);
    g_autofree char *text = NULL;
    g_auto (GStrv) lines = NULL;
    guint row = 0;

    g_assert_no_error (error);
    run_cli (&r, "export", path, "--csv", dir, "--no-montecarlo", "--no-ascent", NULL);
    g_assert_cmpint (r.code, ==, 0);
    run_clear (&r);
    g_assert_true (g_file_get_contents (decision, &text, NULL, &error));
    lines = g_strsplit (text, "\n", -1);
    for (guint k = 0; lines[k] != NULL && lines[k][0] != '\0'; k++)
      {
        g_auto (GStrv) f = NULL;
        if (lines[k][0] == '#' || g_str_has_prefix (lines[k], "stage_count,"))
          continue;
        f = g_strsplit (lines[k], ",", -1);
        g_assert_cmpuint (g_strv_length (f), ==, 19);
        g_assert_cmpstr (f[18], ==, row < 6 ? "serial" : "boosters");
        g_assert_cmpstr (f[14], ==, row == 7 ? "true" : "false");
        if (isfinite (first.rows[row].liftoff_mass_kg))
          g_assert_cmpfloat_with_epsilon (g_ascii_strtod (f[3], NULL)
                                            / first.rows[row].liftoff_mass_kg, 1.0, 1e-13);
        row++;
      }
    g_assert_cmpuint (row, ==, 12);
    g_assert_nonnull (strstr (text, first.boosters_note));
    g_assert_nonnull (strstr (text, first.losses_note));
    {
      g_autoptr (GDir) gd = g_dir_open (dir, 0, NULL);
      const char *name;
      while ((name = g_dir_read_name (gd)) != NULL)
        {
          g_autofree char *p = g_build_filename (dir, name, NULL);
          g_unlink (p);
        }
    }
    g_rmdir (dir);
  }
}

/* A "simulate" design: `stages` sizes its rows with the closed loop's
 * losses, as `size` sizes the design, so this design's row is size's
 * liftoff mass (45.0 t for the demo, where the first guess gives 41.5 t). */
static void
test_stages_simulated (void)
{
  g_autofree char *path = g_build_filename (g_getenv ("SW_SOURCE_ROOT"), "data", "designs",
                                            "three-stage-simulated.stagewright", NULL);
  g_autoptr (JsonNode) keep_size = NULL, keep_stages = NULL;
  JsonObject *size, *stages, *row;
  double m0;
  Run r;

  run_cli (&r, "size", path, "--json", NULL);
  g_assert_cmpint (r.code, ==, 0);
  size = parse (r.out, &keep_size);
  g_assert_true (json_object_get_boolean_member (size, "sized_with_simulated_losses"));
  m0 = json_object_get_double_member (size, "liftoff_mass_kg");
  run_clear (&r);

  run_cli (&r, "stages", path, "--json", NULL);
  g_assert_cmpint (r.code, ==, 0);
  stages = parse (r.out, &keep_stages);
  row = json_array_get_object_element (json_object_get_array_member (stages, "by_stage_count"),
                                       2);
  g_assert_true (json_object_get_boolean_member (row, "this_design"));
  g_assert_cmpfloat_with_epsilon (json_object_get_double_member (row, "liftoff_mass_kg") / m0,
                                  1.0, 1e-12);
  g_assert_cmpfloat_with_epsilon (json_object_get_double_member (stages,
                                                                 "design_liftoff_mass_kg") / m0,
                                  1.0, 1e-12);
  g_assert_nonnull (strstr (json_object_get_string_member (stages, "losses_note"),
                            "closed loop's losses"));
  run_clear (&r);
}

/* `carpet --json` of a cost output carries the grid in money: each point
 * its work-years times the design's work_year_cost ("money_rows"), the
 * design's own point equal to `stages`' per-flight money of this design;
 * the CSV has the money column; a mass output has none (null). */
static void
test_carpet_money (void)
{
  g_autofree char *path = write_design ();
  g_autoptr (JsonNode) keep = NULL, keep_stages = NULL, keep_mass = NULL;
  JsonObject *o, *stages, *own = NULL, *mass;
  JsonArray *rows, *money, *list;
  Run r;

  run_cli (&r, "carpet", path, "--x", "stages[0].structural_coefficient:0.03:0.2:5", "--y",
           "stages[1].isp_vac_s:320:380:4", "--output", "cost_per_flight", "--json", NULL);
  g_assert_cmpint (r.code, ==, 0);
  o = parse (r.out, &keep);
  g_assert_cmpfloat (json_object_get_double_member (o, "work_year_cost"), ==, 200000.0);
  g_assert_cmpstr (json_object_get_string_member (o, "currency"), ==, "EUR");
  g_assert_nonnull (strstr (json_object_get_string_member (o, "money_note"), "never a quote"));
  rows = json_object_get_array_member (o, "rows");
  money = json_object_get_array_member (o, "money_rows");
  g_assert_cmpuint (json_array_get_length (money), ==, 4);
  for (guint j = 0; j < 4; j++)
    for (guint i = 0; i < 5; i++)
      {
        JsonNode *v = json_array_get_element (json_array_get_array_element (rows, j), i);
        JsonNode *m = json_array_get_element (json_array_get_array_element (money, j), i);

        g_assert_cmpint (JSON_NODE_HOLDS_NULL (v), ==, JSON_NODE_HOLDS_NULL (m));
        if (!JSON_NODE_HOLDS_NULL (v))
          g_assert_cmpfloat_with_epsilon (json_node_get_double (m)
                                            / (json_node_get_double (v) * 200000.0),
                                          1.0, 1e-15);
      }
  run_clear (&r);

  run_cli (&r, "stages", path, "--json", NULL);
  g_assert_cmpint (r.code, ==, 0);
  stages = parse (r.out, &keep_stages);
  list = json_object_get_array_member (stages, "by_stage_count");
  for (guint i = 0; i < json_array_get_length (list); i++)
    if (json_object_get_boolean_member (json_array_get_object_element (list, i), "this_design"))
      own = json_array_get_object_element (list, i);
  g_assert_nonnull (own);
  g_assert_cmpfloat_with_epsilon (json_object_get_double_member (
                                    json_object_get_object_member (o, "this_design"), "money")
                                    / json_object_get_double_member (own, "per_flight_money"),
                                  1.0, 1e-9);
  run_clear (&r);

  run_cli (&r, "carpet", path, "--x", "stages[0].structural_coefficient:0.03:0.2:3", "--y",
           "stages[1].isp_vac_s:320:380:2", "--output", "cost_per_flight", "--csv", NULL);
  g_assert_cmpint (r.code, ==, 0);
  g_assert_nonnull (strstr (r.out, ",cost_per_flight_work_years,cost_per_flight_money,closes\n"));
  run_clear (&r);

  run_cli (&r, "carpet", path, "--x", "stages[0].structural_coefficient:0.03:0.2:3", "--y",
           "stages[1].isp_vac_s:320:380:2", "--json", NULL);
  g_assert_cmpint (r.code, ==, 0);
  mass = parse (r.out, &keep_mass);
  g_assert_true (json_object_get_null_member (mass, "money_rows"));
  g_assert_true (json_object_get_null_member (mass, "work_year_cost"));
  run_clear (&r);
  g_unlink (path);
}

/* A "simulate" design: `carpet` flies the closed loop first, as `stages`
 * does, and sizes every point with its losses, so this design's value is
 * size's liftoff mass (45.0 t for the demo, where the first guess gives
 * 41.5 t), and the note says which losses the points use. */
static void
test_carpet_simulated (void)
{
  g_autofree char *path = g_build_filename (g_getenv ("SW_SOURCE_ROOT"), "data", "designs",
                                            "three-stage-simulated.stagewright", NULL);
  g_autoptr (JsonNode) keep_size = NULL, keep_carpet = NULL;
  JsonObject *size, *carpet, *own;
  double m0;
  Run r;

  run_cli (&r, "size", path, "--json", NULL);
  g_assert_cmpint (r.code, ==, 0);
  size = parse (r.out, &keep_size);
  g_assert_true (json_object_get_boolean_member (size, "sized_with_simulated_losses"));
  m0 = json_object_get_double_member (size, "liftoff_mass_kg");
  run_clear (&r);

  run_cli (&r, "carpet", path, "--x", "stages[0].structural_coefficient:0.05:0.12:4", "--y",
           "stages[2].isp_vac_s:320:360:3", "--json", NULL);
  g_assert_cmpint (r.code, ==, 0);
  carpet = parse (r.out, &keep_carpet);
  own = json_object_get_object_member (carpet, "this_design");
  g_assert_cmpfloat_with_epsilon (json_object_get_double_member (own, "value") / m0, 1.0, 1e-12);
  g_assert_nonnull (strstr (json_object_get_string_member (carpet, "note"),
                            "closed loop's losses"));
  run_clear (&r);

  /* The table says the same. */
  run_cli (&r, "carpet", path, "--x", "stages[0].structural_coefficient:0.05:0.12:4", "--y",
           "stages[2].isp_vac_s:320:360:3", NULL);
  g_assert_cmpint (r.code, ==, 0);
  g_assert_nonnull (strstr (r.out, "Every point is sized with the closed loop's losses of"));
  run_clear (&r);
  /* ... and the CSV, as a comment line above the header. */
  run_cli (&r, "carpet", path, "--x", "stages[0].structural_coefficient:0.05:0.12:4", "--y",
           "stages[2].isp_vac_s:320:360:3", "--csv", NULL);
  g_assert_cmpint (r.code, ==, 0);
  g_assert_nonnull (strstr (r.out, "\n# Every point is sized with the closed loop's losses of"));
  run_clear (&r);
}

/* The strap-on demo with its boosters sized: from three stages up the
 * optimum leaves the boosters empty.  `stages` marks those rows, prints no
 * figure for them, names them in the note and never picks one as the best;
 * `size` of the three-stage vehicle says plainly that its boosters are
 * optimised away instead of showing "0.0 kg" boosters and a vehicle that
 * counts their thrust. */
static void
test_stages_boosters_optimised_away (void)
{
  g_autofree char *demo = g_build_filename (g_getenv ("SW_SOURCE_ROOT"), "data", "designs",
                                            "four-booster-cargo.stagewright", NULL);
  g_autoptr (SwDesign) d = sw_design_load (demo, NULL, NULL);
  g_autoptr (JsonNode) keep = NULL;
  g_autoptr (GError) error = NULL;
  g_autofree char *path = NULL;
  JsonObject *o;
  JsonArray *rows;
  SwStaging s;
  guint away = 0;
  int fd;
  Run r;

  g_assert_nonnull (d);
  d->boosters.propellant.has_propellant_kg = FALSE;
  d->mission.loss_model = SW_LOSS_ALLOWANCE;
  g_assert_true (sw_design_validate (d, NULL, NULL));
  fd = g_file_open_tmp ("sw-cli-away-XXXXXX.stagewright", &path, &error);
  g_assert_no_error (error);
  close (fd);
  g_assert_true (sw_design_save (d, path, &error));
  g_assert_no_error (error);
  g_assert_true (sw_staging_compute (d, 6, &s, NULL));

  run_cli (&r, "stages", path, "--json", NULL);
  g_assert_cmpint (r.code, ==, 0);
  o = parse (r.out, &keep);
  rows = json_object_get_array_member (o, "by_stage_count");
  g_assert_cmpuint (json_array_get_length (rows), ==, 12);
  for (guint i = 0; i < 12; i++)
    {
      JsonObject *row = json_array_get_object_element (rows, i);
      gboolean is_away = json_object_get_boolean_member (row, "boosters_optimised_away");

      g_assert_cmpint (is_away, ==, s.rows[i].boosters_optimised_away);
      if (is_away)
        {
          away++;
          g_assert_cmpuint (i, >=, 6);
          g_assert_false (json_object_get_boolean_member (row, "closes"));
          g_assert_nonnull (strstr (json_object_get_string_member (row, "why_not"),
                                    "optimised away"));
          g_assert_true (json_node_is_null (json_object_get_member (row, "liftoff_mass_kg")));
          g_assert_true (json_node_is_null (json_object_get_member (row,
                                                                    "liftoff_thrust_to_weight")));
        }
    }
  g_assert_cmpuint (away, >=, 1);
  /* The best row: the design's own, two stages with their boosters. */
  g_assert_cmpstr (json_object_get_string_member (o, "best_arrangement"), ==, "boosters");
  g_assert_cmpint (json_object_get_int_member (o, "best_stage_count"), ==, 2);
  g_assert_nonnull (strstr (json_object_get_string_member (o, "boosters_note"),
                            "optimised away"));
  run_clear (&r);

  run_cli (&r, "stages", path, NULL);
  g_assert_cmpint (r.code, ==, 0);
  g_assert_nonnull (strstr (r.out, "*>  2 "));
  g_assert_null (strstr (r.out, "*   3 "));
  g_assert_nonnull (strstr (r.out, "With boosters at 3, 4, 5, 6 stages the sized boosters are "
                                   "optimised away"));
  run_clear (&r);

  /* Three stages (the top stage repeated): the sizing says why. */
  d->stages[2] = d->stages[1];
  g_strlcpy (d->stages[2].name, "third", sizeof d->stages[2].name);
  d->n_stages = 3;
  d->stages[0].delta_v_share = d->stages[1].delta_v_share = d->stages[2].delta_v_share = 1.0 / 3;
  g_assert_true (sw_design_validate (d, NULL, NULL));
  g_assert_true (sw_design_save (d, path, &error));
  g_assert_no_error (error);
  run_cli (&r, "size", path, NULL);
  g_assert_nonnull (strstr (r.out, "The sized boosters are optimised away"));
  g_assert_null (strstr (r.out, "0.0 kg propellant"));
  g_assert_null (strstr (r.out, "-0.0"));
  run_clear (&r);
  g_unlink (path);
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/cli/staging/stages-json", test_stages_json);
  g_test_add_func ("/cli/staging/stages-table", test_stages_table);
  g_test_add_func ("/cli/staging/carpet-json-csv", test_carpet_json_csv);
  g_test_add_func ("/cli/staging/carpet-errors", test_carpet_errors);
  g_test_add_func ("/cli/staging/export-csv", test_export_csv);
  g_test_add_func ("/cli/staging/stages-boosters", test_stages_boosters);
  g_test_add_func ("/cli/staging/stages-boosters-optimised-away",
                   test_stages_boosters_optimised_away);
  g_test_add_func ("/cli/staging/stages-simulated", test_stages_simulated);
  g_test_add_func ("/cli/staging/carpet-simulated", test_carpet_simulated);
  g_test_add_func ("/cli/staging/carpet-money", test_carpet_money);
  return g_test_run ();
}
