/* SPDX-License-Identifier: GPL-3.0-or-later */
/* End-to-end tests of stagewright-cli: runs the built program (env SW_CLI)
 * on the demo designs and parses its JSON with json-glib. */
#include "config.h"

#include "sw-analysis.h"
#include "sw-budget.h"
#include "sw-curves.h"
#include "sw-design.h"
#include "sw-sizing.h"

#include <glib/gstdio.h>
#include <json-glib/json-glib.h>
#include <math.h>
#include <string.h>
#include <sys/wait.h>

typedef struct {
  char *out;
  char *err;
  int   code;
} Run;

static GRegex *nan_re;

static void
run_clear (Run *r)
{
  g_clear_pointer (&r->out, g_free);
  g_clear_pointer (&r->err, g_free);
}

/* Runs the CLI with the NULL-terminated arguments. */
static void
run_cli (Run *r, const char *first, ...)
{
  g_autoptr (GPtrArray) argv = g_ptr_array_new ();
  g_autoptr (GError) error = NULL;
  const char *cli = g_getenv ("SW_CLI");
  int status = 0;
  va_list ap;

  g_assert_nonnull (cli);
  g_ptr_array_add (argv, (gpointer) cli);
  va_start (ap, first);
  for (const char *a = first; a != NULL; a = va_arg (ap, const char *))
    g_ptr_array_add (argv, (gpointer) a);
  va_end (ap);
  g_ptr_array_add (argv, NULL);

  memset (r, 0, sizeof *r);
  g_assert_true (g_spawn_sync (NULL, (char **) argv->pdata, NULL, G_SPAWN_DEFAULT, NULL, NULL,
                               &r->out, &r->err, &status, &error));
  g_assert_no_error (error);
  g_assert_true (WIFEXITED (status));
  r->code = WEXITSTATUS (status);
  /* Nothing the program prints shows a non-finite number. */
  if (g_regex_match (nan_re, r->out, 0, NULL))
    {
      g_printerr ("%s", r->out);
      g_error ("stdout shows a non-finite number (printed above on stderr)");
    }
}

static char *
demo (const char *basename)
{
  const char *root = g_getenv ("SW_SOURCE_ROOT");
  g_assert_nonnull (root);
  return g_build_filename (root, "data", "designs", basename, NULL);
}

static const char *const demos[] = {
  "small-sat-launcher.stagewright", "medium-cargo.stagewright", "all-solid-concept.stagewright",
  "sallowmere-kestrune-upper-stage.stagewright", "sallowmere-as-built.stagewright",
  "four-booster-cargo.stagewright",
};

static JsonNode *
parse (const char *text)
{
  g_autoptr (JsonParser) parser = json_parser_new ();
  g_autoptr (GError) error = NULL;

  if (!json_parser_load_from_data (parser, text, -1, &error))
    {
      g_printerr ("%s", text);
      g_error ("not JSON (%s); the text is above on stderr", error->message);
    }
  g_assert_true (JSON_NODE_HOLDS_OBJECT (json_parser_get_root (parser)));
  return json_node_copy (json_parser_get_root (parser));
}

static gboolean
is_number (JsonNode *n)
{
  GType t;
  if (n == NULL || !JSON_NODE_HOLDS_VALUE (n))
    return FALSE;
  t = json_node_get_value_type (n);
  return t == G_TYPE_DOUBLE || t == G_TYPE_INT64;
}

/* A number, or null when @nullable. */
static void
assert_number_member (JsonObject *obj, const char *key, gboolean nullable)
{
  JsonNode *n = json_object_get_member (obj, key);

  if (n == NULL)
    g_error ("missing key %s", key);
  if (nullable && JSON_NODE_HOLDS_NULL (n))
    return;
  if (!is_number (n))
    g_error ("%s is not a number", key);
}

static void
assert_member_type (JsonObject *obj, const char *key, GType type)
{
  JsonNode *n = json_object_get_member (obj, key);

  if (n == NULL)
    g_error ("missing key %s", key);
  g_assert_true (JSON_NODE_HOLDS_VALUE (n));
  g_assert_true (json_node_get_value_type (n) == type);
}

static double
number_or_nan (JsonObject *obj, const char *key)
{
  JsonNode *n = json_object_get_member (obj, key);
  return JSON_NODE_HOLDS_NULL (n) ? NAN : json_node_get_double (n);
}

static void
assert_same (double cli, double core)
{
  if (isnan (core))
    g_assert_true (isnan (cli));
  else if (!(fabs (cli - core) <= 1e-12 * fabs (core)))
    g_error ("CLI %.17g, core %.17g", cli, core);
}

static char *
write_tmp (const char *dir, const char *name, const char *text)
{
  char *path = g_build_filename (dir, name, NULL);
  g_assert_true (g_file_set_contents (path, text, -1, NULL));
  return path;
}

/* ---- size ----------------------------------------------------------------- */

static void
check_size_json (const char *path)
{
  static const char *const stage_keys[] = {
    "delta_v_m_s", "delta_v_share", "mass_ratio", "propellant_mass_kg", "structural_mass_kg",
    "initial_mass_kg", "burnout_mass_kg",
  };
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, NULL);
  g_autoptr (JsonNode) root = NULL;
  JsonObject *obj;
  JsonArray *stages;
  SwSizing s;
  Run r;

  g_autoptr (SwAnalysis) a = NULL;

  g_assert_nonnull (d);
  /* The CLI reads the one analysis: with the ascent, and for "simulate"
   * designs the closed loop's sizing, as the window shows. */
  a = sw_analysis_run (d, NULL, NULL);
  s = a->sizing;
  run_cli (&r, "size", "--json", path, NULL);
  g_assert_cmpint (r.code, ==, 0);
  root = parse (r.out);
  obj = json_node_get_object (root);

  /* The keys of issue 2, with their types. */
  assert_member_type (obj, "feasible", G_TYPE_BOOLEAN);
  assert_member_type (obj, "reason", G_TYPE_STRING);
  assert_number_member (obj, "liftoff_mass_kg", TRUE);
  assert_number_member (obj, "payload_kg", FALSE);
  assert_number_member (obj, "payload_fraction", TRUE);
  assert_number_member (obj, "delta_v_m_s", FALSE);
  assert_number_member (obj, "delta_v_limit_m_s", FALSE);
  g_assert_true (JSON_NODE_HOLDS_ARRAY (json_object_get_member (obj, "stages")));

  /* The numbers are the core's. */
  g_assert_cmpint (json_object_get_boolean_member (obj, "feasible"), ==, s.feasible);
  g_assert_cmpstr (json_object_get_string_member (json_object_get_object_member (obj, "verdict"),
                                                  "state"),
                   ==, sw_verdict_state_to_string (a->verdict.state));
  assert_same (number_or_nan (obj, "simulated_margin_m_s"), a->simulated_margin_m_s);
  g_assert_cmpstr (json_object_get_string_member (obj, "reason"), ==, s.reason);
  assert_same (number_or_nan (obj, "liftoff_mass_kg"), s.liftoff_mass_kg);
  assert_same (number_or_nan (obj, "payload_kg"), d->payload_kg);
  assert_same (number_or_nan (obj, "payload_fraction"), s.payload_fraction);
  assert_same (number_or_nan (obj, "delta_v_m_s"), s.delta_v_m_s);
  assert_same (number_or_nan (obj, "delta_v_limit_m_s"), s.delta_v_limit_m_s);
  assert_same (number_or_nan (obj, "delta_v_given_m_s"), s.delta_v_given_m_s);
  /* One headroom: the stages' limit with no payload less the requirement,
   * the limit the stages' own added up (fixed loads or not). */
  assert_same (number_or_nan (obj, "headroom_to_limit_m_s"), s.margin_m_s);
  assert_same (number_or_nan (obj, "margin_m_s"), s.margin_m_s);
  g_assert_cmpfloat (fabs (s.margin_m_s - (s.delta_v_limit_m_s - s.delta_v_m_s)), <=,
                     1e-9 * s.delta_v_limit_m_s);
  {
    JsonArray *st = json_object_get_array_member (obj, "stages");
    double sum = 0.0;
    for (guint i = 0; i < json_array_get_length (st); i++)
      sum += number_or_nan (json_array_get_object_element (st, i), "delta_v_limit_m_s");
    g_assert_cmpfloat (fabs (sum - s.delta_v_limit_m_s), <=, 1e-9 * s.delta_v_limit_m_s);
  }

  stages = json_object_get_array_member (obj, "stages");
  g_assert_cmpuint (json_array_get_length (stages), ==, d->n_stages);
  for (guint i = 0; i < d->n_stages; i++)
    {
      JsonObject *st = json_array_get_object_element (stages, i);
      const SwStageResult *sr = &s.stages[i];
      const double core[] = {
        sr->delta_v_m_s, sr->delta_v_share, sr->mass_ratio, sr->propellant_mass_kg,
        sr->structural_mass_kg, sr->initial_mass_kg, sr->burnout_mass_kg,
      };

      /* Firing order: the first element is the stage that lifts off. */
      assert_member_type (st, "name", G_TYPE_STRING);
      g_assert_cmpstr (json_object_get_string_member (st, "name"), ==, d->stages[i].name);
      for (guint k = 0; k < G_N_ELEMENTS (stage_keys); k++)
        {
          assert_number_member (st, stage_keys[k], TRUE);
          assert_same (number_or_nan (st, stage_keys[k]), core[k]);
        }
    }
  if (s.feasible)
    assert_same (json_object_get_double_member (json_array_get_object_element (stages, 0),
                                                "initial_mass_kg"),
                 s.liftoff_mass_kg);
  /* Boosters: the object with the masses per booster, and phase 0 first
   * in the phases; no key without boosters. */
  g_assert_cmpint (json_object_has_member (obj, "boosters"), ==, s.boosters.present);
  if (s.boosters.present)
    {
      JsonObject *b = json_object_get_object_member (obj, "boosters");
      JsonArray *phases = json_object_get_array_member (obj, "phases");
      JsonObject *p0 = json_array_get_object_element (phases, 0);

      g_assert_cmpint (json_object_get_int_member (b, "count"), ==, s.boosters.count);
      assert_same (number_or_nan (b, "propellant_mass_kg"), s.boosters.propellant_mass_kg);
      assert_same (number_or_nan (b, "structural_mass_kg"), s.boosters.structural_mass_kg);
      assert_same (number_or_nan (b, "total_mass_kg"), s.boosters.total_mass_kg);
      /* A composite solid: one volume, the load over the grain's 1790 kg/m^3
       * (from memory, the catalogue's), and 3 % ullage by default. */
      if (g_strcmp0 (json_object_get_string_member (b, "propellant"), "solid-composite") == 0)
        {
          double vol = number_or_nan (b, "propellant_volume_m3");
          g_assert_cmpfloat (fabs (vol - s.boosters.propellant_mass_kg / 1790.0), <, 1e-9 * vol);
          g_assert_cmpfloat (fabs (number_or_nan (b, "tank_volume_m3") - vol * 1.03), <,
                             1e-9 * vol);
        }
      g_assert_cmpuint (json_array_get_length (phases), ==, d->n_stages + 1);
      g_assert_true (json_object_get_boolean_member (p0, "boosters"));
      assert_same (number_or_nan (p0, "delta_v_m_s"), s.boosters.phase_delta_v_m_s);
      assert_same (number_or_nan (p0, "initial_mass_kg"), s.liftoff_mass_kg);
    }
  run_clear (&r);
}

static void
test_size_json (void)
{
  g_autofree char *simulated = demo ("three-stage-simulated.stagewright");

  for (guint i = 0; i < G_N_ELEMENTS (demos); i++)
    {
      g_autofree char *path = demo (demos[i]);
      check_size_json (path);
    }
  check_size_json (simulated);
}

/* A design written to a file of the test's folder. */
static char *
write_design (const char *name, const char *json)
{
  g_autofree char *dir = g_dir_make_tmp ("sw-cli-XXXXXX", NULL);
  char *path = g_build_filename (dir, name, NULL);

  g_assert_true (g_file_set_contents (path, json, -1, NULL));
  return path;
}

static void
remove_design (const char *path)
{
  g_autofree char *dir = g_path_get_dirname (path);
  g_remove (path);
  g_rmdir (dir);
}

/* `size --json` gives {"verdict": {"state", "reason"}} and the text report
 * starts with the same verdict. */
static void
check_verdict (const char *path, const char *option, const char *state, const char *const *words,
               const char *text_title)
{
  g_autoptr (JsonNode) root = NULL;
  JsonObject *v;
  const char *reason;
  Run r;

  if (option != NULL)
    run_cli (&r, "size", "--json", option, path, NULL);
  else
    run_cli (&r, "size", "--json", path, NULL);
  g_assert_cmpint (r.code, ==, 0);
  root = parse (r.out);
  v = json_object_get_object_member (json_node_get_object (root), "verdict");
  g_assert_nonnull (v);
  g_assert_cmpstr (json_object_get_string_member (v, "state"), ==, state);
  reason = json_object_get_string_member (v, "reason");
  for (guint i = 0; words[i] != NULL; i++)
    if (strstr (reason, words[i]) == NULL)
      g_error ("verdict %s: \"%s\" not in \"%s\"", state, words[i], reason);
  run_clear (&r);

  if (option != NULL)
    run_cli (&r, "size", option, path, NULL);
  else
    run_cli (&r, "size", path, NULL);
  g_assert_cmpint (r.code, ==, 0);
  g_assert_true (g_str_has_prefix (r.out, text_title));
  run_clear (&r);
}

static const char infeasible_design[] =
  "{ \"format\": \"stagewright-design\", \"version\": 1, \"name\": \"Too far\","
  "  \"payload_kg\": 150, \"mission\": { \"delta_v_m_s\": 14000 }, \"split\": \"optimal\","
  "  \"stages\": [ { \"name\": \"Only\", \"isp_vac_s\": 300, \"structural_coefficient\": 0.1 },"
  "                { \"name\": \"Top\", \"isp_vac_s\": 300, \"structural_coefficient\": 0.1 } ] }";

/* The all-solid demo with a first stage far too weak to lift off. */
static const char weak_design[] =
  "{ \"format\": \"stagewright-design\", \"version\": 1, \"name\": \"Weak\","
  "  \"payload_kg\": 150, \"mission\": { \"delta_v_m_s\": 9600 }, \"split\": \"optimal\","
  "  \"stages\": [ { \"name\": \"One\", \"isp_vac_s\": 275, \"isp_sl_s\": 245,"
  "                  \"structural_coefficient\": 0.10, \"thrust_vac_kn\": 20, \"diameter_m\": 1.2 },"
  "                { \"name\": \"Two\", \"isp_vac_s\": 290, \"structural_coefficient\": 0.12,"
  "                  \"thrust_vac_kn\": 12 } ] }";

static void
test_size_verdicts (void)
{
  g_autofree char *infeasible = write_design ("infeasible.stagewright", infeasible_design);
  g_autofree char *weak = write_design ("weak.stagewright", weak_design);
  g_autofree char *paper = demo ("all-solid-concept.stagewright");
  g_autofree char *cargo = demo ("medium-cargo.stagewright");
  g_autofree char *shortfall = g_build_filename (g_get_tmp_dir (), "sw-cli-short.stagewright",
                                                 NULL);
  g_autofree char *reaches = demo ("three-stage-simulated.stagewright");

  /* The cargo demo with too small a loss allowance falls short. */
  {
    g_autoptr (SwDesign) d = sw_design_load (cargo, NULL, NULL);
    g_assert_nonnull (d);
    d->mission.losses_m_s = 1500.0;
    g_assert_true (sw_design_save (d, shortfall, NULL));
  }

  /* Two stages of c ln(1/eps) = 300 g0 ln 10 = 6,774 m/s each give at most
   * 13,548 m/s (hand-worked with g0 = 9.80665): 14 km/s is out of reach. */
  check_verdict (infeasible, NULL, "infeasible",
                 (const char *const[]) { "14,000 m/s", "13,548 m/s", NULL }, "Not feasible: ");
  /* No flight (a delta-v mission), so no "reaches the orbit, but": paper
   * only, with the broken limit said in the reason. */
  check_verdict (weak, NULL, "paper-only",
                 (const char *const[]) { "Thrust-to-weight at liftoff is",
                                         "below your limit of 1.20", NULL },
                 "Feasible on paper only: ");
  /* The flight that reaches its orbit, against a max-Q limit it exceeds. */
  check_verdict (reaches, "--max-q-kpa=5", "over-limit",
                 (const char *const[]) { "reaches the orbit, but", "Max-Q is",
                                         "above your limit of 5.0 kPa", NULL },
                 "Reaches the orbit, but breaks a limit: ");
  check_verdict (paper, NULL, "paper-only",
                 (const char *const[]) { "rocket equation", "not a target orbit", NULL },
                 "Feasible on paper only: ");
  check_verdict (shortfall, NULL, "short-of-orbit",
                 (const char *const[]) { "short of the orbit", "largest loss is gravity", NULL },
                 "Does not reach the orbit: ");
  check_verdict (reaches, NULL, "reaches-orbit",
                 (const char *const[]) { "reaches the 250.0 km orbit", "to spare", NULL },
                 "Reaches the orbit: ");
  check_verdict (reaches, "--no-ascent", "paper-only",
                 (const char *const[]) { "not simulated on request", NULL },
                 "Feasible on paper only: ");
  remove_design (infeasible);
  remove_design (weak);
  g_remove (shortfall);
}

/* The limits take the window's ranges; outside them it is a usage error. */
static void
test_size_limit_options (void)
{
  g_autofree char *path = demo ("small-sat-launcher.stagewright");
  Run r;

  run_cli (&r, "size", "--max-q-kpa=4.9", path, NULL);
  g_assert_cmpint (r.code, ==, 2);
  g_assert_nonnull (strstr (r.err, "--max-q-kpa 5 to 200"));
  g_assert_cmpstr (r.out, ==, "");
  run_clear (&r);
  run_cli (&r, "size", "--min-thrust-to-weight=0.4", path, NULL);
  g_assert_cmpint (r.code, ==, 2);
  run_clear (&r);
  run_cli (&r, "size", "--max-g=21", path, NULL);
  g_assert_cmpint (r.code, ==, 2);
  run_clear (&r);
}

static void
test_size_table (void)
{
  for (guint i = 0; i < G_N_ELEMENTS (demos); i++)
    {
      g_autofree char *path = demo (demos[i]);
      g_autoptr (SwDesign) d = sw_design_load (path, NULL, NULL);
      Run r;

      run_cli (&r, "size", path, NULL);
      g_assert_cmpint (r.code, ==, 0);
      g_assert_nonnull (strstr (r.out, d->name));
      g_assert_nonnull (strstr (r.out, "Liftoff mass"));
      /* The cautions under every report (RULES). */
      g_assert_nonnull (strstr (r.out, "not for flight hardware"));
      g_assert_nonnull (strstr (r.out, "range safety"));
      run_clear (&r);
    }
}

/* An infeasible design is an answer: exit 0, feasible false, null masses. */
/* Fixed stages with sized boosters: the boosters are sized to give exactly
 * the requirement, so what the vehicle gives is the requirement; the
 * headroom is to the stages' limit with no payload (the core on its load
 * with the boosters' best load and the fixed upper stage above), not ~0. */
static void
test_size_fixed_sized_boosters (void)
{
  static const char text[] =
    "{ \"format\": \"stagewright-design\", \"version\": 2, \"name\": \"Fixed core\",\n"
    "  \"payload_kg\": 6000, \"mission\": { \"delta_v_m_s\": 9800 }, \"split\": \"optimal\",\n"
    "  \"stages\": [ { \"name\": \"Core\", \"isp_vac_s\": 320, \"structural_coefficient\": 0.07,\n"
    "                  \"thrust_vac_kn\": 1300, \"propellant_kg\": 150000 },\n"
    "                { \"name\": \"Upper\", \"isp_vac_s\": 345, \"structural_coefficient\": 0.09,\n"
    "                  \"thrust_vac_kn\": 420, \"propellant_kg\": 25000 } ],\n"
    "  \"boosters\": { \"name\": \"Strap-ons\", \"count\": 4, \"isp_vac_s\": 275,\n"
    "                 \"structural_coefficient\": 0.11, \"thrust_vac_kn\": 800 } }\n";
  g_autofree char *dir = g_dir_make_tmp ("sw-test-cli-XXXXXX", NULL);
  g_autofree char *path = write_tmp (dir, "fixed-core.stagewright", text);
  g_autoptr (JsonNode) root = NULL;
  JsonObject *obj;
  double limit, headroom, given, up;
  Run r;

  check_size_json (path);
  run_cli (&r, "size", "--json", "--no-ascent", path, NULL);
  g_assert_cmpint (r.code, ==, 0);
  root = parse (r.out);
  obj = json_node_get_object (root);
  g_assert_true (json_object_get_boolean_member (obj, "feasible"));
  limit = json_object_get_double_member (obj, "delta_v_limit_m_s");
  headroom = json_object_get_double_member (obj, "headroom_to_limit_m_s");
  given = json_object_get_double_member (obj, "delta_v_given_m_s");
  g_assert_cmpfloat (fabs (headroom - (limit - 9800.0)), <, 1e-6);
  g_assert_cmpfloat (headroom, >, 1000.0);
  g_assert_cmpfloat (fabs (given - 9800.0), <, 1e-3);
  /* The upper stage, nothing above it: 345 g0 ln(1/0.09) by hand. */
  up = number_or_nan (json_array_get_object_element (json_object_get_array_member (obj, "stages"),
                                                     1), "delta_v_limit_m_s");
  g_assert_cmpfloat (fabs (up - 345.0 * 9.80665 * log (1.0 / 0.09)), <, 1e-6);
  run_clear (&r);
  g_remove (path);
  g_rmdir (dir);
}

static void
test_size_infeasible (void)
{
  static const char text[] =
    "{ \"format\": \"stagewright-design\", \"version\": 1, \"name\": \"Too far\",\n"
    "  \"payload_kg\": 100, \"mission\": { \"delta_v_m_s\": 15000 }, \"split\": \"optimal\",\n"
    "  \"stages\": [ { \"name\": \"Only\", \"isp_vac_s\": 300, \"structural_coefficient\": 0.1 } ] }\n";
  g_autofree char *dir = g_dir_make_tmp ("sw-test-cli-XXXXXX", NULL);
  g_autofree char *path = write_tmp (dir, "too-far.stagewright", text);
  g_autoptr (JsonNode) root = NULL;
  JsonObject *obj, *st;
  Run r;

  check_size_json (path);
  run_cli (&r, "size", "--json", path, NULL);
  g_assert_cmpint (r.code, ==, 0);
  root = parse (r.out);
  obj = json_node_get_object (root);
  g_assert_false (json_object_get_boolean_member (obj, "feasible"));
  g_assert_cmpuint (strlen (json_object_get_string_member (obj, "reason")), >, 0);
  g_assert_true (JSON_NODE_HOLDS_NULL (json_object_get_member (obj, "liftoff_mass_kg")));
  g_assert_true (JSON_NODE_HOLDS_NULL (json_object_get_member (obj, "payload_fraction")));
  st = json_array_get_object_element (json_object_get_array_member (obj, "stages"), 0);
  g_assert_true (JSON_NODE_HOLDS_NULL (json_object_get_member (st, "propellant_mass_kg")));
  g_assert_true (JSON_NODE_HOLDS_NULL (json_object_get_member (st, "initial_mass_kg")));
  run_clear (&r);

  /* The table shows "-" and says why. */
  run_cli (&r, "size", path, NULL);
  g_assert_cmpint (r.code, ==, 0);
  g_assert_nonnull (strstr (r.out, "INFEASIBLE"));
  run_clear (&r);

  /* And so does the curve: one such stage never reaches 15 km/s, three do. */
  run_cli (&r, "curve", "--json", "--max-stages", "3", path, NULL);
  g_assert_cmpint (r.code, ==, 0);
  run_clear (&r);

  g_remove (path);
  g_rmdir (dir);
}

/* ---- curve ------------------------------------------------------------------ */

static void
test_curve_json (void)
{
  guint n_null = 0;

  for (guint i = 0; i < G_N_ELEMENTS (demos); i++)
    {
      g_autofree char *path = demo (demos[i]);
      g_autoptr (SwDesign) d = sw_design_load (path, NULL, NULL);
      g_autoptr (JsonNode) root = NULL;
      JsonArray *points;
      SwStageCurve curve;
      double dv;
      Run r;

      g_assert_true (sw_design_required_delta_v (d, &dv, NULL));
      sw_stage_curve_compute (d, dv, SW_MAX_STAGES, &curve);
      run_cli (&r, "curve", "--json", path, NULL);
      g_assert_cmpint (r.code, ==, 0);
      root = parse (r.out);
      points = json_object_get_array_member (json_node_get_object (root), "points");
      g_assert_nonnull (points);
      /* Points 1..8, infeasible ones kept with a null mass. */
      g_assert_cmpuint (json_array_get_length (points), ==, 8);
      for (guint k = 0; k < 8; k++)
        {
          JsonObject *p = json_array_get_object_element (points, k);
          JsonNode *mass = json_object_get_member (p, "liftoff_mass_kg");
          gboolean feasible;

          assert_member_type (p, "stages", G_TYPE_INT64);
          g_assert_cmpint (json_object_get_int_member (p, "stages"), ==, k + 1);
          assert_member_type (p, "feasible", G_TYPE_BOOLEAN);
          feasible = json_object_get_boolean_member (p, "feasible");
          g_assert_nonnull (mass);
          g_assert_cmpint (feasible, ==, curve.points[k].feasible);
          if (feasible)
            {
              g_assert_true (is_number (mass));
              assert_same (json_node_get_double (mass), curve.points[k].liftoff_mass_kg);
            }
          else
            {
              g_assert_true (JSON_NODE_HOLDS_NULL (mass));
              n_null++;
            }
        }
      run_clear (&r);
    }
  /* The all-solid demo cannot fly on one of its stages. */
  g_assert_cmpuint (n_null, >=, 1);

  /* --max-stages */
  {
    g_autofree char *path = demo ("medium-cargo.stagewright");
    g_autoptr (JsonNode) root = NULL;
    Run r;

    run_cli (&r, "curve", "--max-stages", "3", "--json", path, NULL);
    g_assert_cmpint (r.code, ==, 0);
    root = parse (r.out);
    g_assert_cmpuint (json_array_get_length (json_object_get_array_member (
                        json_node_get_object (root), "points")), ==, 3);
    run_clear (&r);
  }
}

/* ---- budget ----------------------------------------------------------------- */

static void
test_budget_json (void)
{
  static const char *const keys[] = {
    "circular_velocity_m_s", "launch_azimuth_deg", "site_speed_m_s", "rotation_gain_m_s",
    "ideal_delta_v_m_s", "losses_m_s", "delta_v_m_s",
  };
  g_autofree char *path = demo ("medium-cargo.stagewright");
  g_autofree char *dv_path = demo ("all-solid-concept.stagewright");
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, NULL);
  g_autoptr (JsonNode) root = NULL;
  JsonObject *obj;
  SwBudget b;
  Run r;

  g_assert_true (sw_design_budget (d, &b, NULL));
  {
    const double core[] = {
      b.circular_velocity_m_s, b.launch_azimuth_deg, b.site_speed_m_s, b.rotation_gain_m_s,
      b.ideal_delta_v_m_s, b.losses_m_s, b.delta_v_m_s,
    };

    run_cli (&r, "budget", "--json", path, NULL);
    g_assert_cmpint (r.code, ==, 0);
    root = parse (r.out);
    obj = json_node_get_object (root);
    for (guint k = 0; k < G_N_ELEMENTS (keys); k++)
      {
        assert_number_member (obj, keys[k], FALSE);
        assert_same (json_object_get_double_member (obj, keys[k]), core[k]);
      }
    run_clear (&r);
  }

  /* A delta-v mission has no budget: bad input, exit 2, said on stderr. */
  run_cli (&r, "budget", "--json", dv_path, NULL);
  g_assert_cmpint (r.code, ==, 2);
  g_assert_nonnull (strstr (r.err, "all-solid-concept.stagewright"));
  g_assert_cmpstr (r.out, ==, "");
  run_clear (&r);
}

/* ---- exit codes, help, bench --------------------------------------------------- */

static void
test_exit_codes (void)
{
  const char *root = g_getenv ("SW_SOURCE_ROOT");
  g_autofree char *bad = g_build_filename (root, "tests", "malformed",
                                           "range-isp-vac-low.stagewright", NULL);
  g_autofree char *bad2 = g_build_filename (root, "tests", "malformed",
                                            "type-payload-string.stagewright", NULL);
  g_autofree char *good = demo ("medium-cargo.stagewright");
  static const char *const commands[] = { "size", "curve", "budget" };
  Run r;

  for (guint c = 0; c < G_N_ELEMENTS (commands); c++)
    {
      /* A malformed file: exit 2, stderr names the file and the field. */
      run_cli (&r, commands[c], "--json", bad, NULL);
      g_assert_cmpint (r.code, ==, 2);
      g_assert_nonnull (strstr (r.err, "range-isp-vac-low.stagewright"));
      g_assert_nonnull (strstr (r.err, "stages[1].isp_vac_s"));
      g_assert_cmpstr (r.out, ==, "");
      run_clear (&r);
      run_cli (&r, commands[c], bad2, NULL);
      g_assert_cmpint (r.code, ==, 2);
      g_assert_nonnull (strstr (r.err, "type-payload-string.stagewright"));
      g_assert_nonnull (strstr (r.err, "payload_kg"));
      run_clear (&r);
      /* A file that does not exist. */
      run_cli (&r, commands[c], "/nonexistent/nowhere.stagewright", NULL);
      g_assert_cmpint (r.code, ==, 2);
      g_assert_nonnull (strstr (r.err, "nowhere.stagewright"));
      run_clear (&r);
      /* Usage errors: no file, two files, an unknown option. */
      run_cli (&r, commands[c], NULL);
      g_assert_cmpint (r.code, ==, 2);
      g_assert_cmpuint (strlen (r.err), >, 0);
      run_clear (&r);
      run_cli (&r, commands[c], good, good, NULL);
      g_assert_cmpint (r.code, ==, 2);
      run_clear (&r);
      run_cli (&r, commands[c], "--no-such-option", good, NULL);
      g_assert_cmpint (r.code, ==, 2);
      g_assert_cmpuint (strlen (r.err), >, 0);
      run_clear (&r);
    }

  run_cli (&r, NULL);
  g_assert_cmpint (r.code, ==, 2);
  run_clear (&r);
  run_cli (&r, "no-such-command", NULL);
  g_assert_cmpint (r.code, ==, 2);
  g_assert_nonnull (strstr (r.err, "no-such-command"));
  run_clear (&r);
  run_cli (&r, "curve", "--max-stages", "0", good, NULL);
  g_assert_cmpint (r.code, ==, 2);
  run_clear (&r);
  run_cli (&r, "curve", "--max-stages", "9", good, NULL);
  g_assert_cmpint (r.code, ==, 2);
  run_clear (&r);
  run_cli (&r, "curve", "--max-stages", "many", good, NULL);
  g_assert_cmpint (r.code, ==, 2);
  run_clear (&r);

  /* An unknown key is a warning, not an error. */
  {
    g_autofree char *dir = g_dir_make_tmp ("sw-test-cli-XXXXXX", NULL);
    g_autofree char *text = NULL, *path = NULL;
    g_assert_true (g_file_get_contents (good, &text, NULL, NULL));
    {
      char *brace = strchr (text, '{');
      g_autofree char *patched = g_strdup_printf ("{ \"paint_colour\": \"blue\", %s", brace + 1);
      path = write_tmp (dir, "extra-key.stagewright", patched);
    }
    run_cli (&r, "size", "--json", path, NULL);
    g_assert_cmpint (r.code, ==, 0);
    g_assert_nonnull (strstr (r.err, "warning"));
    g_assert_nonnull (strstr (r.err, "paint_colour"));
    run_clear (&r);
    g_remove (path);
    g_rmdir (dir);
  }
}

/* --help works for the program and every subcommand it lists. */
static void
test_help (void)
{
  g_auto (GStrv) lines = NULL;
  gboolean in_commands = FALSE;
  guint n = 0;
  gboolean seen_size = FALSE, seen_curve = FALSE, seen_budget = FALSE, seen_bench = FALSE;
  Run r;

  run_cli (&r, "--help", NULL);
  g_assert_cmpint (r.code, ==, 0);
  g_assert_nonnull (strstr (r.out, "not for flight hardware"));
  lines = g_strsplit (r.out, "\n", -1);
  run_clear (&r);
  for (guint i = 0; lines[i] != NULL; i++)
    {
      g_auto (GStrv) words = NULL;

      if (g_str_has_prefix (lines[i], "Commands:"))
        {
          in_commands = TRUE;
          continue;
        }
      if (!in_commands)
        continue;
      if (lines[i][0] != ' ')
        break;
      words = g_strsplit_set (g_strstrip (lines[i]), " ", 2);
      run_cli (&r, words[0], "--help", NULL);
      if (r.code != 0)
        g_error ("%s --help exits %d", words[0], r.code);
      g_assert_nonnull (strstr (r.out, words[0]));
      run_clear (&r);
      seen_size |= strcmp (words[0], "size") == 0;
      seen_curve |= strcmp (words[0], "curve") == 0;
      seen_budget |= strcmp (words[0], "budget") == 0;
      seen_bench |= strcmp (words[0], "bench") == 0;
      n++;
    }
  g_assert_true (seen_size && seen_curve && seen_budget && seen_bench);
  g_test_message ("%u subcommands answer --help", n);
}

/* bench --json reports positive numbers (timing targets are not asserted:
 * performance is a benchmark, not a test). */
/* Stage names of many-byte characters, as long as the format allows: every
 * table cuts them at whole characters, so what the program prints stays
 * UTF-8 (a cut inside a character made the terminal show garbage and a
 * pipe into a UTF-8 reader fail). */
static void
test_names_stay_utf8 (void)
{
  static const char *const commands[][2] = {
    { "size", NULL }, { "size", "--json" }, { "curve", NULL }, { "ascent", NULL },
    { "ascent", "--json" }, { "sensitivity", NULL }, { "reliability", NULL },
  };
  g_autofree char *path = demo ("medium-cargo.stagewright");
  g_autofree char *tmp = g_build_filename (g_get_tmp_dir (), "sw-cli-utf8-XXXXXX", NULL);
  g_autofree char *copy = NULL;
  g_autoptr (SwDesign) d = NULL;
  g_autoptr (GError) error = NULL;
  GString *name = g_string_new (NULL);

  d = sw_design_load (path, NULL, &error);
  g_assert_no_error (error);
  /* "€" is three bytes: 42 of them fill 126 of the 127 bytes a name has. */
  for (int k = 0; k < 42; k++)
    g_string_append (name, "€");
  for (guint i = 0; i < d->n_stages; i++)
    g_strlcpy (d->stages[i].name, name->str, sizeof d->stages[i].name);
  g_strlcpy (d->name, name->str, sizeof d->name);
  g_string_free (name, TRUE);
  g_assert_nonnull (g_mkdtemp (tmp));
  copy = g_build_filename (tmp, "names.stagewright", NULL);
  g_assert_true (sw_design_save (d, copy, &error));
  g_assert_no_error (error);

  for (guint k = 0; k < G_N_ELEMENTS (commands); k++)
    {
      Run r;

      if (commands[k][1] != NULL)
        run_cli (&r, commands[k][0], commands[k][1], copy, NULL);
      else
        run_cli (&r, commands[k][0], copy, NULL);
      g_assert_cmpint (r.code, ==, 0);
      if (!g_utf8_validate (r.out, -1, NULL) || !g_utf8_validate (r.err, -1, NULL))
        g_error ("stagewright-cli %s %s printed invalid UTF-8", commands[k][0],
                 commands[k][1] != NULL ? commands[k][1] : "");
      g_assert_nonnull (strstr (r.out, "€€€€€€€€€€"));
      run_clear (&r);
    }
  g_remove (copy);
  g_rmdir (tmp);
}

static void
test_bench_json (void)
{
  g_autoptr (JsonNode) root = NULL;
  JsonObject *obj;
  Run r;

  run_cli (&r, "bench", "--json", NULL);
  g_assert_cmpint (r.code, ==, 0);
  root = parse (r.out);
  obj = json_node_get_object (root);
  assert_number_member (obj, "optimal_size_ns", FALSE);
  assert_number_member (obj, "live_update_us", FALSE);
  g_assert_cmpfloat (json_object_get_double_member (obj, "optimal_size_ns"), >, 0.0);
  g_assert_cmpfloat (json_object_get_double_member (obj, "live_update_us"), >, 0.0);
  g_test_message ("optimal_size_ns %.0f, live_update_us %.1f",
                  json_object_get_double_member (obj, "optimal_size_ns"),
                  json_object_get_double_member (obj, "live_update_us"));
  run_clear (&r);
}

int
main (int argc, char **argv)
{
  int ret;

  g_test_init (&argc, &argv, NULL);
  /* "nan" or "inf" as printf writes a non-finite double. */
  nan_re = g_regex_new ("(?<![`'\"\\w])[-+]?(nan|inf|infinity)(?!\\w)", G_REGEX_CASELESS, 0,
                        NULL);
  g_assert_nonnull (nan_re);

  g_test_add_func ("/cli/size-json", test_size_json);
  g_test_add_func ("/cli/size-table", test_size_table);
  g_test_add_func ("/cli/size-verdicts", test_size_verdicts);
  g_test_add_func ("/cli/size-limit-options", test_size_limit_options);
  g_test_add_func ("/cli/size-infeasible", test_size_infeasible);
  g_test_add_func ("/cli/size-fixed-sized-boosters", test_size_fixed_sized_boosters);
  g_test_add_func ("/cli/curve-json", test_curve_json);
  g_test_add_func ("/cli/budget-json", test_budget_json);
  g_test_add_func ("/cli/exit-codes", test_exit_codes);
  g_test_add_func ("/cli/help", test_help);
  g_test_add_func ("/cli/bench-json", test_bench_json);
  g_test_add_func ("/cli/names-stay-utf8", test_names_stay_utf8);

  ret = g_test_run ();
  g_regex_unref (nan_re);
  return ret;
}
