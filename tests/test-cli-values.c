/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The numbers in stagewright-cli's JSON are the core's numbers: every value
 * of the montecarlo, sensitivity and reliability reports is compared with
 * the core's own result for the same design and options (not only checked
 * for presence), so a dropped key, a swapped percentile or a unit off by
 * 1000 fails.  The Monte Carlo percentiles are also checked against GSL's
 * quantile of the samples the core returns, and the German translation of
 * a core message reaches the CLI (the po/ pipeline without the GUI).
 * Runs the built program (env SW_CLI); demo designs from SW_DESIGNS_DIR. */
#include "config.h"

#include "sw-design.h"
#include "sw-montecarlo.h"
#include "sw-reliability.h"
#include "sw-sensitivity.h"

#include <gsl/gsl_sort.h>
#include <gsl/gsl_statistics_double.h>
#include <glib/gstdio.h>
#include <json-glib/json-glib.h>
#include <locale.h>
#include <math.h>
#include <string.h>
#include <sys/wait.h>
#include <unistd.h>

/* A run of the program that does not end within this fails the test. */
#define CLI_TIMEOUT_S 60

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

/* Runs the CLI (with `timeout` so a hang fails fast) with the NULL-terminated
 * arguments; @envp NULL for this process's environment. */
static void
run_cli_env (Run *r, char **envp, const char *first, ...)
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
  g_assert_true (g_spawn_sync (NULL, (char **) argv->pdata, envp, G_SPAWN_SEARCH_PATH, NULL,
                               NULL, &r->out, &r->err, &status, &error));
  g_assert_no_error (error);
  g_assert_true (WIFEXITED (status));
  r->code = WEXITSTATUS (status);
  if (r->code == 124)
    g_error ("stagewright-cli %s did not finish within %d s", first, CLI_TIMEOUT_S);
}
#define run_cli(r, ...) run_cli_env (r, NULL, __VA_ARGS__)

static char *
demo (const char *basename)
{
  const char *dir = g_getenv ("SW_DESIGNS_DIR");
  g_assert_nonnull (dir);
  return g_build_filename (dir, basename, NULL);
}

static JsonObject *
parse (const char *text, JsonNode **keep)
{
  g_autoptr (JsonParser) parser = json_parser_new ();
  g_autoptr (GError) error = NULL;

  if (!json_parser_load_from_data (parser, text, -1, &error))
    {
      g_printerr ("%s", text);
      g_error ("not JSON (%s); the text is above on stderr", error->message);
    }
  *keep = json_node_copy (json_parser_get_root (parser));
  g_assert_true (JSON_NODE_HOLDS_OBJECT (*keep));
  return json_node_get_object (*keep);
}

static JsonObject *
object (JsonObject *o, const char *key)
{
  JsonNode *n = json_object_get_member (o, key);
  if (n == NULL || !JSON_NODE_HOLDS_OBJECT (n))
    g_error ("%s: missing or not an object", key);
  return json_node_get_object (n);
}

static JsonArray *
array (JsonObject *o, const char *key)
{
  JsonNode *n = json_object_get_member (o, key);
  if (n == NULL || !JSON_NODE_HOLDS_ARRAY (n))
    g_error ("%s: missing or not an array", key);
  return json_node_get_array (n);
}

/* The number under @key equals @core: same bits but for the last digits the
 * JSON writer may round (%.17g round-trips, so 1e-15 relative is ample).
 * A NAN core value must be null. */
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
        g_error ("%s: the core has no value, the CLI prints %g", key,
                 json_node_get_double (n));
      return;
    }
  if (!JSON_NODE_HOLDS_VALUE (n))
    g_error ("%s: not a number", key);
  v = json_node_get_double (n);
  if (!(fabs (v - core) <= 1e-15 * fabs (core) + 1e-300))
    g_error ("%s: CLI %.17g, core %.17g", key, v, core);
}

static void
check_int (JsonObject *o, const char *key, gint64 core)
{
  JsonNode *n = json_object_get_member (o, key);
  if (n == NULL || !JSON_NODE_HOLDS_VALUE (n))
    g_error ("missing key %s", key);
  g_assert_cmpint (json_node_get_int (n), ==, core);
}

static void
check_summary (JsonObject *o, const char *key, const SwMcSummary *s)
{
  JsonObject *j = object (o, key);
  JsonObject *h = object (j, "histogram");
  JsonArray *counts = array (h, "counts");

  check_int (j, "count", s->n);
  check (j, "mean", s->mean);
  check (j, "sd", s->sd);
  check (j, "p05", s->p05);
  check (j, "p50", s->p50);
  check (j, "p95", s->p95);
  check (j, "min", s->min);
  check (j, "max", s->max);
  check (h, "lower", s->bin_lo);
  check (h, "upper", s->bin_hi);
  g_assert_cmpuint (json_array_get_length (counts), ==, SW_MC_BINS);
  for (guint i = 0; i < SW_MC_BINS; i++)
    g_assert_cmpint (json_array_get_int_element (counts, i), ==, s->bins[i]);
}

static int
cmp_double (const void *a, const void *b)
{
  double x = *(const double *) a, y = *(const double *) b;
  return (x > y) - (x < y);
}

/* ---- montecarlo ----------------------------------------------------------- */

static void
test_montecarlo_values (void)
{
  const guint samples = 3000, seed = 4242, threads = 2;
  g_autofree char *path = demo ("kestrel-upgrade-study.stagewright");
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, NULL);
  g_autofree double *lift = g_new (double, samples);
  g_autofree double *pay = g_new (double, samples);
  g_autoptr (JsonNode) keep = NULL;
  g_autoptr (GError) error = NULL;
  JsonObject *o;
  SwMonteCarlo mc;
  guint n = 0, short_of = 0;
  Run r;

  g_assert_nonnull (d);
  g_assert_true (d->uncertainty.present);
  g_assert_true (sw_montecarlo_run (d, NULL, samples, TRUE, seed, threads, &mc, lift, pay,
                                    &error));
  g_assert_no_error (error);
  g_assert_true (mc.nominal_feasible);

  run_cli (&r, "montecarlo", "--json", "--samples", "3000", "--seed", "4242", "--threads", "2",
           path, NULL);
  g_assert_cmpint (r.code, ==, 0);
  o = parse (r.out, &keep);
  check_int (o, "samples", samples);
  check_int (o, "seed", seed);
  check (o, "nominal_liftoff_mass_kg", mc.nominal_liftoff_kg);
  check (o, "required_payload_kg", mc.required_payload_kg);
  check (o, "nominal_delta_v_m_s", mc.nominal_delta_v_m_s);
  check (o, "infeasible_fraction", mc.infeasible_fraction);
  check (o, "probability_negative_margin", mc.p_negative_margin);
  check (o, "payload_reserve_95_kg", mc.reserve_95_kg);
  check_summary (o, "liftoff_mass_kg", &mc.liftoff);
  check_summary (o, "fixed_vehicle_payload_kg", &mc.payload);
  run_clear (&r);

  /* The percentiles against GSL's quantile of the returned samples (the
   * finite ones; a sample beyond the vehicle's limit is NAN), not against
   * the core's own arithmetic. */
  for (guint i = 0; i < samples; i++)
    if (isfinite (lift[i]))
      lift[n++] = lift[i];
  g_assert_cmpuint (n, ==, mc.liftoff.n);
  qsort (lift, n, sizeof *lift, cmp_double);
  g_assert_cmpfloat_with_epsilon (mc.liftoff.p05, gsl_stats_quantile_from_sorted_data (lift, 1, n, 0.05),
                                  1e-9 * mc.liftoff.p05);
  g_assert_cmpfloat_with_epsilon (mc.liftoff.p50, gsl_stats_median_from_sorted_data (lift, 1, n),
                                  1e-9 * mc.liftoff.p50);
  g_assert_cmpfloat_with_epsilon (mc.liftoff.p95, gsl_stats_quantile_from_sorted_data (lift, 1, n, 0.95),
                                  1e-9 * mc.liftoff.p95);
  g_assert_cmpfloat_with_epsilon (mc.liftoff.mean, gsl_stats_mean (lift, 1, n), 1e-9 * mc.liftoff.mean);
  g_assert_cmpfloat_with_epsilon (mc.liftoff.sd, gsl_stats_sd (lift, 1, n), 1e-9 * mc.liftoff.sd);

  /* The margin: the share of samples whose payload falls short, and the
   * reserve = required payload - 5th percentile of the payload. */
  n = 0;
  for (guint i = 0; i < samples; i++)
    if (isfinite (pay[i]))
      {
        short_of += pay[i] < mc.required_payload_kg;
        pay[n++] = pay[i];
      }
  qsort (pay, n, sizeof *pay, cmp_double);
  g_assert_cmpfloat_with_epsilon (mc.p_negative_margin, (double) short_of / samples, 1e-12);
  g_assert_cmpfloat_with_epsilon (mc.reserve_95_kg,
                                  mc.required_payload_kg
                                    - gsl_stats_quantile_from_sorted_data (pay, 1, n, 0.05),
                                  1e-9 * mc.required_payload_kg);
}

/* ---- sensitivity ------------------------------------------------------------ */

static void
test_sensitivity_values (void)
{
  const char *const designs[] = { "medium-cargo.stagewright", "small-sat-launcher.stagewright" };

  for (guint k = 0; k < G_N_ELEMENTS (designs); k++)
    {
      g_autofree char *path = demo (designs[k]);
      g_autoptr (SwDesign) d = sw_design_load (path, NULL, NULL);
      g_autoptr (JsonNode) keep = NULL;
      g_autoptr (GError) error = NULL;
      SwSensitivityTable t;
      JsonObject *o;
      JsonArray *params, *ex;
      Run r;

      g_assert_nonnull (d);
      /* A step other than the default, so that the option reaches the core. */
      g_assert_true (sw_sensitivity_compute (d, 0.03, &t, &error));
      g_assert_true (t.feasible);
      run_cli (&r, "sensitivity", "--json", "--step", "3", path, NULL);
      g_assert_cmpint (r.code, ==, 0);
      o = parse (r.out, &keep);
      check (o, "liftoff_mass_kg", t.liftoff_mass_kg);
      check (o, "step_percent", 3.0);
      params = array (o, "parameters");
      g_assert_cmpuint (json_array_get_length (params), ==, t.n_items);
      for (guint i = 0; i < t.n_items; i++)
        {
          const SwSensitivity *it = &t.items[t.ranked[i]];
          JsonObject *p = json_array_get_object_element (params, i);

          check_int (p, "rank", i + 1);
          g_assert_cmpstr (json_object_get_string_member (p, "parameter"), ==,
                           sw_sens_param_to_string (it->param));
          if (it->stage < 0)
            g_assert_true (JSON_NODE_HOLDS_NULL (json_object_get_member (p, "stage")));
          else
            check_int (p, "stage", it->stage + 1);
          check (p, "value", it->value);
          check (p, "derivative_kg_per_unit", it->derivative);
          check (p, "elasticity", it->elasticity);
          check (p, "minus_step_kg", it->minus_kg);
          check (p, "plus_step_kg", it->plus_kg);
        }
      ex = array (o, "exchange_ratios");
      g_assert_cmpuint (json_array_get_length (ex), ==, t.n_stages);
      for (guint i = 0; i < t.n_stages; i++)
        {
          JsonObject *e = json_array_get_object_element (ex, i);
          check_int (e, "stage", i + 1);
          g_assert_cmpstr (json_object_get_string_member (e, "name"), ==, d->stages[i].name);
          check (e, "payload_lost_per_kg_dry", t.exchange_ratio[i]);
        }
      run_clear (&r);
    }
}

/* ---- reliability -------------------------------------------------------------- */

static void
test_reliability_values (void)
{
  g_autofree char *path = demo ("kestrel-upgrade-study.stagewright");
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, NULL);
  g_autoptr (JsonNode) keep = NULL;
  SwReliability rel;
  SwReliabilityCurve curve;
  JsonObject *o;
  JsonArray *stages, *pts;
  double product = 1.0;
  Run r;

  g_assert_nonnull (d);
  sw_reliability_from_design (d, &rel);
  sw_reliability_curve_compute (d, SW_MAX_STAGES, &curve);
  g_assert_true (rel.given);
  run_cli (&r, "reliability", "--json", path, NULL);
  g_assert_cmpint (r.code, ==, 0);
  o = parse (r.out, &keep);
  g_assert_true (json_object_get_boolean_member (o, "given"));
  check (o, "mission_success", rel.mission);
  stages = array (o, "stages");
  g_assert_cmpuint (json_array_get_length (stages), ==, d->n_stages);
  for (guint i = 0; i < d->n_stages; i++)
    {
      JsonObject *s = json_array_get_object_element (stages, i);
      SwReliabilityInputs in;

      sw_reliability_inputs (&d->stages[i].reliability, &in);
      g_assert_cmpstr (json_object_get_string_member (s, "name"), ==, d->stages[i].name);
      check_int (s, "engine_count", in.engine_count);
      check (s, "engine_reliability", in.engine_reliability);
      check_int (s, "engine_failures_tolerated", in.failures_tolerated);
      check (s, "ignition_reliability", in.ignition_reliability);
      check (s, "engines_success", rel.engines[i]);
      check (s, "stage_success", rel.stage[i]);
      check (s, "separation_success", i + 1 < d->n_stages ? rel.separation[i] : NAN);
      /* The mission is the product of the stages and the events between. */
      product *= rel.stage[i] * (i + 1 < d->n_stages ? rel.separation[i] : 1.0);
    }
  g_assert_cmpfloat_with_epsilon (rel.mission, product, 1e-12);
  pts = array (o, "curve");
  g_assert_cmpuint (json_array_get_length (pts), ==, curve.n_points);
  for (guint n = 0; n < curve.n_points; n++)
    {
      JsonObject *p = json_array_get_object_element (pts, n);
      check_int (p, "stages", n + 1);
      check (p, "mission_success", curve.mission[n]);
    }
  run_clear (&r);
}

/* ---- translations ------------------------------------------------------------- */

/* The CLI binds the translations (SW_LOCALE_DIR: the build tree's po/), so
 * a core message reaches the user in German; built with or without the GUI. */
static void
test_german_message (void)
{
  g_autofree char *dir = g_dir_make_tmp ("sw-cli-values-XXXXXX", NULL);
  g_autofree char *path = g_build_filename (dir, "wrong.stagewright", NULL);
  g_auto (GStrv) env = g_get_environ ();
  Run r;

  if (setlocale (LC_MESSAGES, "de_DE.UTF-8") == NULL)
    {
      g_test_skip ("the de_DE.UTF-8 locale is not installed");
      return;
    }
  setlocale (LC_MESSAGES, "C");
  g_assert_true (g_file_set_contents (path, "{\"format\": \"something-else\", \"version\": 1}\n",
                                      -1, NULL));
  env = g_environ_setenv (env, "LANGUAGE", "de", TRUE);
  env = g_environ_setenv (env, "LC_ALL", "de_DE.UTF-8", TRUE);
  run_cli_env (&r, env, "size", path, NULL);
  g_assert_cmpint (r.code, ==, 2);
  /* po/de.po: "%s: \"%s\" ist kein Stagewright-Entwurf (\"%s\" erwartet)" */
  g_assert_nonnull (strstr (r.err, "\"something-else\" ist kein Stagewright-Entwurf"));
  run_clear (&r);
  /* And in English without LANGUAGE. */
  env = g_environ_unsetenv (env, "LANGUAGE");
  env = g_environ_setenv (env, "LC_ALL", "C.UTF-8", TRUE);
  run_cli_env (&r, env, "size", path, NULL);
  g_assert_cmpint (r.code, ==, 2);
  g_assert_nonnull (strstr (r.err, "\"something-else\" is not a Stagewright design"));
  run_clear (&r);
  g_unlink (path);
  g_rmdir (dir);
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  /* A hang anywhere fails the run instead of waiting for meson's timeout. */
  alarm (4 * CLI_TIMEOUT_S);
  g_test_add_func ("/cli-values/montecarlo", test_montecarlo_values);
  g_test_add_func ("/cli-values/sensitivity", test_sensitivity_values);
  g_test_add_func ("/cli-values/reliability", test_reliability_values);
  g_test_add_func ("/cli-values/german-message", test_german_message);
  return g_test_run ();
}
