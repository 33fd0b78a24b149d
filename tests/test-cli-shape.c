/* SPDX-License-Identifier: GPL-3.0-or-later */
/* `stagewright-cli size --json` with the keys of format version 2: per stage
 * "fixed" and, with a propellant, the propellant and tank volumes, the length
 * and the diameter; the "phases" array.  Every value is compared with the
 * core's own result for the same design, and the phase durations and the
 * volumes with a hand calculation from the inputs.  Runs the built program
 * (env SW_CLI); demo designs from SW_DESIGNS_DIR. */
#include "config.h"

#include "sw-design.h"
#include "sw-mass-estimate.h"
#include "sw-payload-curves.h"
#include "sw-phases.h"
#include "sw-sizing.h"
#include "sw-vehicle-shape.h"

#include <glib/gstdio.h>
#include <json-glib/json-glib.h>
#include <math.h>
#include <string.h>
#include <sys/wait.h>

#define CLI_TIMEOUT_S 60

static char *
run_cli_json (const char *command, const char *path, int *code)
{
  g_autoptr (GError) error = NULL;
  g_autofree char *secs = g_strdup_printf ("%d", CLI_TIMEOUT_S);
  g_autofree char *err = NULL;
  const char *cli = g_getenv ("SW_CLI");
  const char *argv[] = { "timeout", secs, cli, command, "--json", path, NULL };
  char *out = NULL;
  int status = 0;

  g_assert_nonnull (cli);
  g_assert_true (g_spawn_sync (NULL, (char **) argv, NULL, G_SPAWN_SEARCH_PATH, NULL, NULL,
                               &out, &err, &status, &error));
  g_assert_no_error (error);
  g_assert_true (WIFEXITED (status));
  *code = WEXITSTATUS (status);
  if (*code == 124)
    g_error ("stagewright-cli %s did not finish within %d s", command, CLI_TIMEOUT_S);
  if (*code != 0)
    {
      g_free (out);
      return g_steal_pointer (&err);
    }
  return out;
}

static char *
run_size_json (const char *path)
{
  g_autoptr (GError) error = NULL;
  g_autofree char *secs = g_strdup_printf ("%d", CLI_TIMEOUT_S);
  g_autofree char *err = NULL;
  const char *cli = g_getenv ("SW_CLI");
  const char *argv[] = { "timeout", secs, cli, "size", "--json", "--no-ascent", path, NULL };
  char *out = NULL;
  int status = 0;

  g_assert_nonnull (cli);
  g_assert_true (g_spawn_sync (NULL, (char **) argv, NULL, G_SPAWN_SEARCH_PATH, NULL, NULL,
                               &out, &err, &status, &error));
  g_assert_no_error (error);
  g_assert_true (WIFEXITED (status));
  if (WEXITSTATUS (status) == 124)
    g_error ("stagewright-cli size did not finish within %d s", CLI_TIMEOUT_S);
  if (WEXITSTATUS (status) != 0)
    g_error ("stagewright-cli size failed (%d): %s", WEXITSTATUS (status), err);
  return out;
}

static JsonNode *
parse (const char *text)
{
  g_autoptr (JsonParser) parser = json_parser_new ();
  g_autoptr (GError) error = NULL;

  if (!json_parser_load_from_data (parser, text, -1, &error))
    g_error ("not JSON (%s): %s", error->message, text);
  return json_node_copy (json_parser_get_root (parser));
}

/* The number under @key equals @core (%.17g round-trips); NAN is null. */
static void
check (JsonObject *o, const char *key, double core)
{
  JsonNode *n = json_object_get_member (o, key);
  double v;

  if (n == NULL)
    g_error ("missing key %s", key);
  if (isnan (core))
    {
      if (!JSON_NODE_HOLDS_NULL (n))
        g_error ("%s: the core has no value, the CLI prints %g", key, json_node_get_double (n));
      return;
    }
  if (!JSON_NODE_HOLDS_VALUE (n))
    g_error ("%s: not a number", key);
  v = json_node_get_double (n);
  if (!(fabs (v - core) <= 1e-15 * fabs (core) + 1e-300))
    g_error ("%s: CLI %.17g, core %.17g", key, v, core);
}

/* An invented three-stage concept: a sized LOX/kerosene first stage with a
 * thrust, a fixed (existing) LOX/methane second stage, a sized upper stage
 * burning a propellant of the user's own. */
static const char *design_text =
  "{ \"format\": \"stagewright-design\", \"version\": 2, \"name\": \"Shape test\","
  "  \"payload_kg\": 5000, \"mission\": { \"delta_v_m_s\": 9400 }, \"split\": \"optimal\","
  "  \"stages\": ["
  "   { \"name\": \"A\", \"isp_vac_s\": 320, \"isp_sl_s\": 285, \"structural_coefficient\": 0.07,"
  "     \"propellant\": \"lox-kerosene\", \"diameter_m\": 3.7, \"thrust_vac_kn\": 4000 },"
  "   { \"name\": \"B\", \"isp_vac_s\": 345, \"structural_coefficient\": 0.09,"
  "     \"propellant_kg\": 20000, \"propellant\": \"lox-methane\", \"ullage_fraction\": 0.04,"
  "     \"engine_count\": 2, \"engine_thrust_vac_kn\": 400 },"
  "   { \"name\": \"C\", \"isp_vac_s\": 450, \"structural_coefficient\": 0.12,"
  "     \"propellant\": { \"name\": \"mine\", \"oxidizer_density_kg_m3\": 1141.17,"
  "       \"fuel_density_kg_m3\": 70.83, \"mixture_ratio\": 5.5 } } ] }";

static void
test_shape_and_phases (void)
{
  g_autoptr (GError) error = NULL;
  g_autofree char *dir = g_dir_make_tmp ("sw-cli-shape-XXXXXX", &error);
  g_autofree char *path = g_build_filename (dir, "shape.stagewright", NULL);
  g_autoptr (SwDesign) d = NULL;
  g_autoptr (JsonNode) root = NULL;
  g_autofree char *out = NULL;
  SwSizing sizing;
  SwPhase phases[SW_MAX_PHASES];
  JsonArray *stages, *jphases;
  guint n_phases;

  g_assert_no_error (error);
  g_assert_true (g_file_set_contents (path, design_text, -1, &error));
  d = sw_design_load (path, NULL, &error);
  g_assert_no_error (error);
  g_assert_true (sw_size_design (d, &sizing, &error));
  g_assert_true (sizing.feasible);
  n_phases = sw_sizing_phases (d, &sizing, phases);
  g_assert_cmpuint (n_phases, ==, 3);

  out = run_size_json (path);
  root = parse (out);
  stages = json_object_get_array_member (json_node_get_object (root), "stages");
  jphases = json_object_get_array_member (json_node_get_object (root), "phases");
  g_assert_cmpuint (json_array_get_length (stages), ==, 3);
  g_assert_cmpuint (json_array_get_length (jphases), ==, 3);

  for (guint i = 0; i < 3; i++)
    {
      JsonObject *st = json_array_get_object_element (stages, i);
      JsonObject *ph = json_array_get_object_element (jphases, i);
      SwStageShape shape;

      sw_sizing_stage_shape (d, &sizing, i, &shape);
      g_assert_true (json_object_get_boolean_member (st, "fixed") == (i == 1));
      check (st, "propellant_mass_kg", sizing.stages[i].propellant_mass_kg);
      check (st, "propellant_volume_m3", shape.propellant_volume_m3);
      check (st, "tank_volume_m3", shape.tank_volume_m3);
      check (st, "length_m", shape.length_m);
      check (st, "diameter_m", 3.7);   /* B and C take the diameter below */

      g_assert_cmpstr (json_object_get_string_member (ph, "name"), ==, d->stages[i].name);
      check (ph, "delta_v_m_s", phases[i].delta_v_m_s);
      check (ph, "exhaust_velocity_m_s", phases[i].exhaust_velocity_m_s);
      check (ph, "initial_mass_kg", phases[i].initial_mass_kg);
      check (ph, "final_mass_kg", phases[i].final_mass_kg);
      check (ph, "duration_s", phases[i].duration_s);
    }

  /* By hand from the inputs.  The fixed stage: 20 t of LOX/methane at its
   * catalogue ratio 3.5 with 4 % ullage; its burn: 20 t over 2 x 400 kN /
   * (345 s g0). */
  {
    JsonObject *b = json_array_get_object_element (stages, 1);
    JsonObject *pb = json_array_get_object_element (jphases, 1);
    JsonObject *pc = json_array_get_object_element (jphases, 2);
    double vol = 20000.0 * 3.5 / 4.5 / 1141.17 + 20000.0 / 4.5 / 422.36;
    double t = 20000.0 * 345.0 * SW_G0 / 800000.0;

    g_assert_cmpfloat (fabs (json_object_get_double_member (b, "propellant_mass_kg") - 20000.0),
                       <, 1e-9);
    g_assert_cmpfloat (fabs (json_object_get_double_member (b, "propellant_volume_m3") - vol),
                       <, 1e-9);
    g_assert_cmpfloat (fabs (json_object_get_double_member (b, "tank_volume_m3") - vol * 1.04),
                       <, 1e-9);
    g_assert_cmpfloat (fabs (json_object_get_double_member (pb, "duration_s") - t), <, 1e-9);
    /* The upper stage has no thrust: no duration. */
    g_assert_true (JSON_NODE_HOLDS_NULL (json_object_get_member (pc, "duration_s")));
  }
  /* The propellant keys as in force, from the file: the catalogue's
   * LOX/methane with its ratio and the 4 % ullage given; the user's own
   * "mine" with the densities and ratio given. */
  {
    JsonObject *b = json_array_get_object_element (stages, 1);
    JsonObject *c = json_array_get_object_element (stages, 2);
    const SwPropellantInfo *lm = sw_propellant_info (SW_PROPELLANT_LOX_METHANE);

    g_assert_cmpstr (json_object_get_string_member (b, "propellant"), ==, "lox-methane");
    g_assert_false (json_object_get_boolean_member (b, "propellant_custom"));
    check (b, "mixture_ratio", lm->mixture_ratio);
    check (b, "ullage_fraction", 0.04);
    check (b, "oxidizer_density_kg_m3", lm->oxidizer_density_kg_m3);
    check (b, "fuel_density_kg_m3", lm->fuel_density_kg_m3);
    g_assert_cmpstr (json_object_get_string_member (c, "propellant"), ==, "mine");
    g_assert_true (json_object_get_boolean_member (c, "propellant_custom"));
    check (c, "mixture_ratio", 5.5);
    check (c, "oxidizer_density_kg_m3", 1141.17);
    check (c, "fuel_density_kg_m3", 70.83);
    check (c, "ullage_fraction", 0.03);
  }
  /* The vehicle's shape and the estimated structural coefficients: the
   * core's values, key by key. */
  {
    JsonObject *o = json_node_get_object (root);
    JsonObject *vs = json_object_get_object_member (o, "vehicle_shape");
    JsonObject *ee = json_object_get_object_member (o, "eps_estimate");
    JsonArray *es = json_object_get_array_member (ee, "stages");
    SwVehicleShape v;
    SwMassEstimate m;

    sw_vehicle_shape_compute (d, &sizing, &v);
    sw_mass_estimate_design (d, &m);
    g_assert_true (v.complete && m.ok);
    g_assert_true (json_object_get_boolean_member (vs, "complete"));
    g_assert_true (JSON_NODE_HOLDS_NULL (json_object_get_member (vs, "reason")));
    check (vs, "height_m", v.height_m);
    check (vs, "max_diameter_m", v.max_diameter_m);
    check (vs, "width_m", v.width_m);
    check (vs, "fairing_length_m", v.fairing_length_m);
    check (vs, "fairing_diameter_m", v.fairing_diameter_m);
    g_assert_true (json_object_get_boolean_member (ee, "converged"));
    check (ee, "liftoff_mass_kg", m.liftoff_mass_kg);
    g_assert_cmpuint (json_array_get_length (es), ==, 3);
    for (guint i = 0; i < 3; i++)
      {
        JsonObject *st = json_array_get_object_element (stages, i);
        JsonObject *e = json_array_get_object_element (es, i);
        JsonObject *items = json_object_get_object_member (e, "items_kg");

        check (st, "oxidizer_tank_length_m", v.stages[i].shape.oxidizer_tank_length_m);
        check (st, "fuel_tank_length_m", v.stages[i].shape.fuel_tank_length_m);
        check (st, "interstage_length_m", i < 2 ? v.stages[i].interstage_length_m : NAN);
        g_assert_true (json_object_get_boolean_member (e, "estimated"));
        check (e, "structural_coefficient", m.stages[i].structural_coefficient);
        check (e, "design_structural_coefficient", d->stages[i].structural_coefficient);
        for (guint k = 0; k < SW_N_MER; k++)
          check (items, sw_mer_item_key (k), m.stages[i].item_kg[k]);
      }
    /* C has no thrust key: its thrust is assumed, and said so. */
    g_assert_true (json_object_get_boolean_member (json_array_get_object_element (es, 2),
                                                   "thrust_assumed"));
    g_assert_nonnull (strstr (json_object_get_string_member (
                                json_object_get_object_member (ee, "sources"), "tanks"),
                              "Akin"));
  }
  /* The phases add up to the mission's delta-v. */
  {
    double sum = 0.0;
    for (guint i = 0; i < 3; i++)
      sum += json_object_get_double_member (json_array_get_object_element (jphases, i),
                                            "delta_v_m_s");
    g_assert_cmpfloat (fabs (sum - 9400.0), <, 1e-6);
  }
  g_remove (path);
  g_rmdir (dir);
}

/* The boosters' estimated structural coefficient in `size --json`: the
 * four-booster demo's "eps_estimate.boosters", key by key, is the core's
 * estimate (one booster); the stages carry the booster-only items as 0; a
 * design without boosters has null there. */
static void
test_booster_estimate (void)
{
  g_autofree char *path = g_build_filename (g_getenv ("SW_DESIGNS_DIR"),
                                            "four-booster-cargo.stagewright", NULL);
  g_autofree char *plain_path = g_build_filename (g_getenv ("SW_DESIGNS_DIR"),
                                                  "small-sat-launcher.stagewright", NULL);
  g_autofree char *out = run_size_json (path);
  g_autofree char *plain_out = run_size_json (plain_path);
  g_autoptr (JsonNode) root = parse (out);
  g_autoptr (JsonNode) plain = parse (plain_out);
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, NULL);
  JsonObject *ee = json_object_get_object_member (json_node_get_object (root), "eps_estimate");
  JsonObject *b, *items, *st;
  SwMassEstimate m;

  g_assert_nonnull (d);
  sw_mass_estimate_design (d, &m);
  g_assert_true (m.ok && m.has_boosters && m.boosters.estimated);
  b = json_object_get_object_member (ee, "boosters");
  g_assert_nonnull (b);
  g_assert_cmpstr (json_object_get_string_member (b, "name"), ==, d->boosters.name);
  g_assert_true (json_object_get_boolean_member (b, "estimated"));
  g_assert_cmpint (json_object_get_int_member (b, "count"), ==, 4);
  check (b, "structural_coefficient", m.boosters.structural_coefficient);
  check (b, "design_structural_coefficient", 0.11);
  check (b, "structural_mass_kg", m.boosters.structural_mass_kg);
  check (b, "propellant_mass_kg", 30000.0);
  check (b, "thrust_n", 800000.0);
  check (b, "diameter_m", 1.6);
  check (b, "nose_cone_side_area_m2", m.boosters.nose_area_m2);
  items = json_object_get_object_member (b, "items_kg");
  for (guint k = 0; k < SW_N_MER; k++)
    check (items, sw_mer_item_key (k), m.boosters.item_kg[k]);
  /* A solid booster: its motor case is 0.135 of its 30 t (Akin 2016). */
  check (items, "motor_case", m.boosters.item_kg[SW_MER_MOTOR_CASE]);
  g_assert_cmpfloat (fabs (m.boosters.item_kg[SW_MER_MOTOR_CASE] - 4050.0), <, 1e-9);
  st = json_object_get_object_member (json_array_get_object_element (
                                        json_object_get_array_member (ee, "stages"), 0),
                                      "items_kg");
  check (st, "nose_cone", 0.0);
  check (st, "attachment", 0.0);
  g_assert_nonnull (strstr (json_object_get_string_member (
                              json_object_get_object_member (ee, "sources"), "nose_cone"),
                            "our assumption"));

  ee = json_object_get_object_member (json_node_get_object (plain), "eps_estimate");
  g_assert_true (JSON_NODE_HOLDS_NULL (json_object_get_member (ee, "boosters")));
}

/* A version-1 demo: every stage "fixed": false, no shape keys, phases as
 * the stages. */
static void
test_version_one_demo (void)
{
  g_autofree char *path = g_build_filename (g_getenv ("SW_DESIGNS_DIR"),
                                            "small-sat-launcher.stagewright", NULL);
  g_autofree char *out = run_size_json (path);
  g_autoptr (JsonNode) root = parse (out);
  JsonObject *o = json_node_get_object (root);
  JsonArray *stages = json_object_get_array_member (o, "stages");
  JsonArray *phases = json_object_get_array_member (o, "phases");

  g_assert_true (json_object_get_boolean_member (o, "feasible"));
  g_assert_cmpuint (json_array_get_length (phases), ==, json_array_get_length (stages));
  for (guint i = 0; i < json_array_get_length (stages); i++)
    {
      JsonObject *st = json_array_get_object_element (stages, i);
      JsonObject *ph = json_array_get_object_element (phases, i);
      g_assert_false (json_object_get_boolean_member (st, "fixed"));
      g_assert_false (json_object_has_member (st, "tank_volume_m3"));
      g_assert_false (json_object_has_member (st, "length_m"));
      g_assert_cmpfloat (json_object_get_double_member (ph, "initial_mass_kg"), ==,
                         json_object_get_double_member (st, "initial_mass_kg"));
      g_assert_cmpfloat (json_object_get_double_member (ph, "final_mass_kg"), ==,
                         json_object_get_double_member (st, "burnout_mass_kg"));
    }
}

/* An invented vehicle that exists: both stages with fixed loads. */
static const char *built_text =
  "{ \"format\": \"stagewright-design\", \"version\": 2, \"name\": \"Built\","
  "  \"payload_kg\": 1000, \"mission\": { \"delta_v_m_s\": %g }, \"split\": \"optimal\","
  "  \"stages\": ["
  "   { \"name\": \"A\", \"isp_vac_s\": 310, \"structural_coefficient\": 0.07,"
  "     \"propellant_kg\": 200000, \"thrust_vac_kn\": 3500 },"
  "   { \"name\": \"B\", \"isp_vac_s\": 345, \"structural_coefficient\": 0.1,"
  "     \"propellant_kg\": 30000 } ] }";

static char *
write_design (const char *dir, const char *name, const char *text)
{
  char *path = g_build_filename (dir, name, NULL);
  g_assert_true (g_file_set_contents (path, text, -1, NULL));
  return path;
}

/* `performance`: the payload at which the vehicle's delta-v equals the
 * requirement, against a bisection on the core's `size` of the same design
 * (feasible exactly when the vehicle reaches the requirement); the phases
 * add up to the requirement; an unreachable mission is an answer (exit 0,
 * payload null); a vehicle with a sized stage is refused naming the key. */
static void
test_performance (void)
{
  g_autoptr (GError) error = NULL;
  g_autofree char *dir = g_dir_make_tmp ("sw-cli-perf-XXXXXX", &error);
  g_autofree char *text = g_strdup_printf (built_text, 9000.0);
  g_autofree char *far_text = g_strdup_printf (built_text, 14000.0);
  g_autofree char *path = write_design (dir, "built.stagewright", text);
  g_autofree char *far = write_design (dir, "far.stagewright", far_text);
  g_autofree char *sized = write_design (dir, "sized.stagewright", design_text);
  g_autofree char *out = NULL, *out_far = NULL, *out_sized = NULL;
  g_autoptr (JsonNode) root = NULL, root_far = NULL;
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, &error);
  JsonObject *o;
  JsonArray *phases;
  double lo = 0.0, hi = 1.0e5, got, sum = 0.0;
  int code;

  g_assert_no_error (error);
  out = run_cli_json ("performance", path, &code);
  g_assert_cmpint (code, ==, 0);
  root = parse (out);
  o = json_node_get_object (root);
  g_assert_true (json_object_get_boolean_member (o, "reachable"));
  got = json_object_get_double_member (o, "payload_kg");
  /* Bisection on the sizing: 60 halvings of 100 t. */
  for (int k = 0; k < 60; k++)
    {
      SwSizing s;
      d->payload_kg = 0.5 * (lo + hi);
      g_assert_true (sw_size_design (d, &s, NULL));
      if (s.feasible)
        lo = d->payload_kg;
      else
        hi = d->payload_kg;
    }
  g_assert_cmpfloat (fabs (got - lo), <, 1e-6 * lo);
  g_assert_cmpfloat (got, >, 1000.0);
  phases = json_object_get_array_member (o, "phases");
  g_assert_cmpuint (json_array_get_length (phases), ==, 2);
  for (guint i = 0; i < 2; i++)
    sum += json_object_get_double_member (json_array_get_object_element (phases, i),
                                          "delta_v_m_s");
  g_assert_cmpfloat (fabs (sum - 9000.0), <, 1e-6);
  /* Stage A burns 200 t at 3500 kN and 310 s: 200000 x 310 g0 / 3.5e6 s. */
  g_assert_cmpfloat (fabs (json_object_get_double_member (json_array_get_object_element (phases,
                                                                                         0),
                                                          "duration_s")
                           - 200000.0 * 310.0 * SW_G0 / 3.5e6),
                     <, 1e-9);

  out_far = run_cli_json ("performance", far, &code);
  g_assert_cmpint (code, ==, 0);
  root_far = parse (out_far);
  o = json_node_get_object (root_far);
  g_assert_false (json_object_get_boolean_member (o, "reachable"));
  g_assert_true (JSON_NODE_HOLDS_NULL (json_object_get_member (o, "payload_kg")));
  g_assert_nonnull (strstr (json_object_get_string_member (o, "reason"), "even with no payload"));

  out_sized = run_cli_json ("performance", sized, &code);
  g_assert_cmpint (code, ==, 2);
  g_assert_nonnull (strstr (out_sized, "sized.stagewright"));
  g_assert_nonnull (strstr (out_sized, "stages[0].propellant_kg"));

  g_remove (path);
  g_remove (far);
  g_remove (sized);
  g_rmdir (dir);
}

/* stagewright-cli with @args (NULL-terminated, at most 8); stdout when it
 * exits 0, else stderr. */
static char *
run_cli_args (const char *const *args, int *code)
{
  g_autoptr (GError) error = NULL;
  g_autofree char *secs = g_strdup_printf ("%d", CLI_TIMEOUT_S);
  g_autofree char *err = NULL;
  const char *argv[12] = { "timeout", secs, g_getenv ("SW_CLI"), NULL };
  char *out = NULL;
  int status = 0;
  guint n = 3;

  g_assert_nonnull (argv[2]);
  for (guint i = 0; args[i] != NULL && n < G_N_ELEMENTS (argv) - 1; i++)
    argv[n++] = args[i];
  argv[n] = NULL;
  g_assert_true (g_spawn_sync (NULL, (char **) argv, NULL, G_SPAWN_SEARCH_PATH, NULL, NULL,
                               &out, &err, &status, &error));
  g_assert_no_error (error);
  g_assert_true (WIFEXITED (status));
  *code = WEXITSTATUS (status);
  if (*code != 0)
    {
      g_free (out);
      return g_steal_pointer (&err);
    }
  return out;
}

/* `performance --altitudes --inclinations`: the curves of the JSON are the
 * core's (checked by hand in test-payload-curves), at the grid asked for;
 * bad lists are refused naming the option. */
static void
test_performance_curves (void)
{
  g_autofree char *path = g_build_filename (g_getenv ("SW_SOURCE_ROOT"), "data", "designs",
                                            "sallowmere-as-built.stagewright", NULL);
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, NULL);
  const char *const good[] = { "performance", "--json", "--altitudes", "200, 1000",
                               "--inclinations", "45,98", path, NULL };
  const double alts[] = { 200.0, 1000.0 }, incs[] = { 45.0, 98.0 };
  g_autofree char *out = NULL;
  g_autoptr (JsonNode) root = NULL;
  SwPayloadCurves want;
  JsonArray *curve, *inc;
  int code;

  g_assert_nonnull (d);
  out = run_cli_args (good, &code);
  g_assert_cmpint (code, ==, 0);
  root = parse (out);
  g_assert_true (sw_payload_curves_compute (d, alts, 2, incs, 2, FALSE, NULL, &want));
  curve = json_object_get_array_member (json_node_get_object (root), "payload_curve");
  inc = json_object_get_array_member (json_node_get_object (root), "inclination_curve");
  g_assert_cmpuint (json_array_get_length (curve), ==, 2);
  g_assert_cmpuint (json_array_get_length (inc), ==, 2);
  for (guint i = 0; i < 2; i++)
    {
      JsonObject *a = json_array_get_object_element (curve, i);
      JsonObject *b = json_array_get_object_element (inc, i);
      g_assert_cmpfloat (json_object_get_double_member (a, "altitude_km"), ==, alts[i]);
      g_assert_cmpfloat (fabs (json_object_get_double_member (a, "payload_kg")
                               - want.altitude.points[i].payload_kg),
                         <, 1e-6 * want.altitude.points[i].payload_kg);
      g_assert_cmpfloat (json_object_get_double_member (b, "inclination_deg"), ==, incs[i]);
      g_assert_cmpfloat (fabs (json_object_get_double_member (b, "payload_kg")
                               - want.inclination.points[i].payload_kg),
                         <, 1e-6 * want.inclination.points[i].payload_kg);
    }
  g_assert_nonnull (strstr (json_object_get_string_member (json_node_get_object (root),
                                                          "caution"),
                            "Conceptual"));

  {
    const struct { const char *option, *value, *words; } bad[] = {
      { "--altitudes", "abc", "“abc” is not a number" },
      { "--altitudes", "200,,300", "is not a number" },
      { "--altitudes", "50", "out of range" },
      { "--altitudes", "200,1e9", "out of range" },
      { "--inclinations", "190", "out of range" },
      { "--inclinations", "45x", "“45x” is not a number" },
    };
    for (guint i = 0; i < G_N_ELEMENTS (bad); i++)
      {
        const char *const args[] = { "performance", bad[i].option, bad[i].value, path, NULL };
        g_autofree char *err = run_cli_args (args, &code);
        g_assert_cmpint (code, ==, 2);
        g_assert_nonnull (strstr (err, bad[i].option));
        g_assert_nonnull (strstr (err, bad[i].words));
      }
  }
  {
    const char *const text[] = { "performance", path, NULL };
    g_autofree char *t = run_cli_args (text, &code);
    g_assert_cmpint (code, ==, 0);
    g_assert_nonnull (strstr (t, "Payload capability"));
    g_assert_nonnull (strstr (t, "nominal payload 2,000 kg"));
    g_assert_nonnull (strstr (t, "Payload against inclination"));
  }
}

/* `export --csv`: payload-curves.csv for a vehicle that exists, one row
 * per point of both curves with the core's numbers; none for a sized one. */
static void
test_payload_curves_csv (void)
{
  g_autofree char *path = g_build_filename (g_getenv ("SW_SOURCE_ROOT"), "data", "designs",
                                            "sallowmere-as-built.stagewright", NULL);
  g_autofree char *sized = g_build_filename (g_getenv ("SW_SOURCE_ROOT"), "data", "designs",
                                             "small-sat-launcher.stagewright", NULL);
  g_autofree char *dir = g_dir_make_tmp ("sw-cli-pc-XXXXXX", NULL);
  g_autofree char *dir2 = g_dir_make_tmp ("sw-cli-pc-XXXXXX", NULL);
  g_autofree char *file = g_build_filename (dir, "payload-curves.csv", NULL);
  g_autofree char *file2 = g_build_filename (dir2, "payload-curves.csv", NULL);
  g_autofree char *text = NULL, *out = NULL, *out2 = NULL;
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, NULL);
  g_auto (GStrv) lines = NULL;
  SwPayloadCurves want;
  guint rows = 0;
  int code;

  {
    const char *const args[] = { "export", "--csv", dir, "--no-ascent", path, NULL };
    out = run_cli_args (args, &code);
    g_assert_cmpint (code, ==, 0);
  }
  {
    const char *const args[] = { "export", "--csv", dir2, "--no-ascent", sized, NULL };
    out2 = run_cli_args (args, &code);
    g_assert_cmpint (code, ==, 0);
  }
  g_assert_false (g_file_test (file2, G_FILE_TEST_EXISTS));
  g_assert_true (g_file_get_contents (file, &text, NULL, NULL));
  g_assert_true (sw_payload_curves_compute (d, NULL, 0, NULL, 0, FALSE, NULL, &want));
  lines = g_strsplit (text, "\n", -1);
  g_assert_true (g_str_has_prefix (lines[0], "# Conceptual sizing only"));
  g_assert_cmpstr (lines[1], ==, "curve,altitude_km,inclination_deg,payload_kg,delta_v_m_s,"
                                 "losses_m_s,losses_simulated,reason");
  for (guint i = 2; lines[i] != NULL && lines[i][0] != '\0'; i++)
    {
      g_auto (GStrv) f = g_strsplit (lines[i], ",", -1);
      gboolean alt = g_str_equal (f[0], "altitude");
      guint k = alt ? rows : rows - want.altitude.n_points;
      const SwPayloadPoint *p = alt ? &want.altitude.points[k] : &want.inclination.points[k];
      double x = g_ascii_strtod (alt ? f[1] : f[2], NULL);

      g_assert_cmpfloat (fabs (x - p->x), <, 1e-9 * MAX (1.0, p->x));
      g_assert_cmpfloat (fabs (g_ascii_strtod (f[3], NULL) - p->payload_kg), <,
                         1e-6 * p->payload_kg);
      rows++;
    }
  g_assert_cmpuint (rows, ==, want.altitude.n_points + want.inclination.n_points);
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/cli-shape/shape-and-phases", test_shape_and_phases);
  g_test_add_func ("/cli-shape/version-one-demo", test_version_one_demo);
  g_test_add_func ("/cli-shape/booster-estimate", test_booster_estimate);
  g_test_add_func ("/cli-shape/performance", test_performance);
  g_test_add_func ("/cli-shape/performance-curves", test_performance_curves);
  g_test_add_func ("/cli-shape/payload-curves-csv", test_payload_curves_csv);
  return g_test_run ();
}
