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

#include "sw-ascent.h"
#include "sw-atmosphere.h"
#include "sw-curves.h"
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
  g_autofree char *path = demo ("skelloway-upgrade-study.stagewright");
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

/* Every load fixed: the JSON says so and gives the payload capability and
 * the delta-v margin at the nominal payload, as the core computes them. */
static void
test_montecarlo_all_fixed (void)
{
  const guint samples = 300;
  g_autofree char *path = demo ("sallowmere-as-built.stagewright");
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, NULL);
  g_autoptr (JsonNode) keep = NULL;
  JsonObject *o;
  JsonArray *outputs;
  SwMonteCarlo mc;
  Run r;

  g_assert_nonnull (d);
  g_assert_true (sw_montecarlo_run (d, NULL, samples, TRUE, 9, 2, &mc, NULL, NULL, NULL));
  g_assert_true (mc.all_fixed);
  run_cli (&r, "montecarlo", "--json", "--samples", "300", "--seed", "9", "--threads", "2", path,
           NULL);
  g_assert_cmpint (r.code, ==, 0);
  o = parse (r.out, &keep);
  g_assert_true (json_object_get_boolean_member (o, "all_fixed"));
  outputs = array (o, "outputs");
  g_assert_cmpuint (json_array_get_length (outputs), ==, 2);
  g_assert_cmpstr (json_array_get_string_element (outputs, 0), ==, "payload_capability_kg");
  g_assert_cmpstr (json_array_get_string_element (outputs, 1), ==, "delta_v_margin_m_s");
  check (o, "nominal_payload_capability_kg", mc.nominal_capability_kg);
  check (o, "nominal_delta_v_margin_m_s", mc.nominal_margin_m_s);
  check_summary (o, "payload_capability_kg", &mc.payload);
  check_summary (o, "delta_v_margin_m_s", &mc.margin);
  run_clear (&r);
}

/* ---- sensitivity ------------------------------------------------------------ */

static void
test_sensitivity_values (void)
{
  /* Sized; a fixed upper stage; every load fixed (the payload capability's). */
  const char *const designs[] = { "medium-cargo.stagewright", "small-sat-launcher.stagewright",
                                  "sallowmere-kestrune-upper-stage.stagewright",
                                  "sallowmere-as-built.stagewright" };

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
      g_assert_cmpstr (json_object_get_string_member (o, "output"), ==,
                       t.capability ? "payload_capability_kg" : "liftoff_mass_kg");
      g_assert_cmpint (t.capability, ==, k == 3);
      if (t.capability)
        check (o, "payload_capability_kg", t.payload_capability_kg);
      else
        g_assert_true (JSON_NODE_HOLDS_NULL (json_object_get_member (o,
                                                                     "payload_capability_kg")));
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
  g_autofree char *path = demo ("skelloway-upgrade-study.stagewright");
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

/* ---- ascent ------------------------------------------------------------------ */

/* An event: the key names carry the units (km for altitudes, the rest SI). */
static void
check_point (JsonObject *o, const char *prefix, const SwAscentPoint *p, gboolean with_mass)
{
  g_autofree char *k1 = g_strdup_printf ("%s_time_s", prefix);
  g_autofree char *k2 = g_strdup_printf ("%s_altitude_km", prefix);
  g_autofree char *k3 = g_strdup_printf ("%s_speed_m_s", prefix);
  g_autofree char *k4 = g_strdup_printf ("%s_flight_path_deg", prefix);
  g_autofree char *k5 = g_strdup_printf ("%s_dynamic_pressure_pa", prefix);
  g_autofree char *k6 = g_strdup_printf ("%s_mass_kg", prefix);

  check (o, k1, p->time_s);
  check (o, k2, p->altitude_m / 1000.0);
  check (o, k3, p->speed_m_s);
  check (o, k4, p->flight_path_deg);
  check (o, k5, p->dynamic_pressure_pa);
  if (with_mass)
    check (o, k6, p->mass_kg);
}

static void
test_ascent_values (void)
{
  g_autofree char *path = demo ("three-stage-simulated.stagewright");
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, NULL);
  g_autoptr (SwAscentResult) r = NULL;
  g_autoptr (GError) error = NULL;
  g_autoptr (JsonNode) keep = NULL;
  JsonObject *o, *fairing;
  JsonArray *stages;
  Run run;

  g_assert_nonnull (d);
  r = sw_ascent_fly_design (d, NULL, &error);
  g_assert_no_error (error);
  run_cli (&run, "ascent", "--json", path, NULL);
  g_assert_cmpint (run.code, ==, 0);
  o = parse (run.out, &keep);
  g_assert_cmpstr (json_object_get_string_member (o, "status"), ==,
                   sw_ascent_status_to_string (r->status));
  check (o, "target_altitude_km", r->target_altitude_km);
  check (o, "perigee_km", r->perigee_km);
  check (o, "apogee_km", r->apogee_km);
  check (o, "launch_azimuth_deg", r->launch_azimuth_deg);
  check (o, "circular_velocity_m_s", r->circular_velocity_m_s);
  check (o, "ideal_delta_v_m_s", r->ideal_delta_v_m_s);
  check (o, "rotation_gain_m_s", r->rotation_gain_m_s);
  check (o, "gravity_loss_m_s", r->gravity_loss_m_s);
  check (o, "drag_loss_m_s", r->drag_loss_m_s);
  check (o, "steering_loss_m_s", r->steering_loss_m_s);
  check (o, "pressure_loss_m_s", r->pressure_loss_m_s);
  check (o, "fairing_loss_m_s", r->fairing_loss_m_s);
  check (o, "raising_loss_m_s", r->raising_loss_m_s);
  check (o, "other_loss_m_s", r->other_loss_m_s);
  check (o, "losses_m_s", r->losses_m_s);
  check (o, "engines_delta_v_m_s", r->engines_delta_v_m_s);
  check (o, "delta_v_needed_m_s", r->delta_v_needed_m_s);
  check (o, "sized_delta_v_m_s", r->sized_delta_v_m_s);
  check (o, "delta_v_margin_m_s", r->delta_v_margin_m_s);
  check (o, "delta_v_missing_m_s", r->delta_v_missing_m_s);
  /* Liftoff with the fairing, which the sizing leaves out. */
  check (o, "liftoff_mass_kg", sw_ascent_liftoff_mass (r));
  check (o, "liftoff_thrust_to_weight", r->liftoff_thrust_to_weight);
  check (o, "max_q_pa", r->max_q_pa);
  check (o, "max_q_time_s", r->max_q_time_s);
  check (o, "max_q_altitude_km", r->max_q_altitude_m / 1000.0);
  check (o, "max_axial_g", r->max_axial_g);
  check (o, "max_axial_g_time_s", r->max_axial_g_time_s);
  check_point (o, "cutoff", &r->cutoff, TRUE);
  fairing = object (o, "fairing");
  check (fairing, "mass_kg", r->fairing_mass_kg);
  check (fairing, "time_s", r->fairing_dropped ? r->fairing.time_s : NAN);
  check (fairing, "altitude_km", r->fairing_dropped ? r->fairing.altitude_m / 1000.0 : NAN);

  stages = array (o, "stages");
  g_assert_cmpuint (json_array_get_length (stages), ==, d->n_stages);
  for (guint i = 0; i < d->n_stages; i++)
    {
      JsonObject *st = json_array_get_object_element (stages, i);
      const SwAscentStage *s = &r->stages[i];

      g_assert_cmpstr (json_object_get_string_member (st, "name"), ==, d->stages[i].name);
      check (st, "thrust_vac_kn", s->thrust_vac_n / 1000.0);
      check (st, "thrust_sl_kn", s->thrust_sl_n / 1000.0);
      check (st, "mass_flow_kg_s", s->mass_flow_kg_s);
      check (st, "burn_time_s", s->burn_time_s);
      check (st, "coast_before_ignition_s", s->coast_s);
      check (st, "ignition_mass_kg", s->ignition_mass_kg);
      check (st, "ignition_thrust_to_weight", s->ignition_thrust_to_weight);
      check (st, "burnout_thrust_to_weight", s->burnout_thrust_to_weight);
      check (st, "burn_time_flown_s", s->burn_time_flown_s);
      check (st, "propellant_left_kg", s->propellant_left_kg);
      check_point (st, "ignition", &s->ignition, FALSE);
      check_point (st, "burnout", &s->burnout, TRUE);
    }
  run_clear (&run);
}

/* The atmosphere command prints the core's model at the asked altitude, in
 * SI units; at 10 km that is the 1976 table's 26,500 Pa and 0.41351 kg/m^3
 * (reference-values.md, confirmed; one unit of the last figure). */
/* The fairing is in the sizing: on every demo with a fairing, `size --json`
 * and `ascent --json` give the same liftoff mass (the ascent flies the vehicle
 * the sizing gives, fairing included), and the flight's fairing loss is only
 * what the sizing's jettison point differs from the flown one: under 30 m/s
 * (it used to be the whole fairing, 40 to 90 m/s).  The booster demo is not
 * in the list: the booster sizing leaves the fairing out (README, "The
 * fairing in the sizing"). */
static void
test_fairing_liftoff_agrees (void)
{
  const char *demos[] = { "medium-cargo.stagewright", "small-sat-launcher.stagewright",
                          "three-stage-simulated.stagewright",
                          "skelloway-upgrade-study.stagewright" };

  for (guint i = 0; i < G_N_ELEMENTS (demos); i++)
    {
      g_autofree char *path = demo (demos[i]);
      g_autoptr (JsonNode) ks = NULL, ka = NULL;
      Run rs, ra;
      JsonObject *s, *a, *f;
      double ls, la;

      run_cli (&rs, "size", "--json", path, NULL);
      run_cli (&ra, "ascent", "--json", path, NULL);
      s = parse (rs.out, &ks);
      a = parse (ra.out, &ka);
      f = object (a, "fairing");
      g_assert_cmpfloat (json_object_get_double_member (f, "mass_kg"), >, 0.0);
      ls = json_object_get_double_member (s, "liftoff_mass_kg");
      la = json_object_get_double_member (a, "liftoff_mass_kg");
      if (fabs (ls - la) > 1e-6 * ls)
        g_error ("%s: size --json %.3f kg, ascent --json %.3f kg", demos[i], ls, la);
      g_assert_true (json_object_get_boolean_member (f, "dropped"));
      g_assert_cmpfloat (fabs (json_object_get_double_member (a, "fairing_loss_m_s")), <, 30.0);
      run_clear (&rs);
      run_clear (&ra);
    }
}

static void
test_atmosphere_values (void)
{
  g_autoptr (JsonNode) keep = NULL;
  JsonObject *o;
  SwAtmosphere a;
  Run run;

  g_assert_true (sw_atmosphere_at (10000.0, &a));
  run_cli (&run, "atmosphere", "--json", "10000", NULL);
  g_assert_cmpint (run.code, ==, 0);
  o = parse (run.out, &keep);
  check (o, "altitude_m", 10000.0);
  check (o, "geopotential_altitude_m", sw_atmosphere_geopotential (10000.0));
  check (o, "temperature_k", a.temperature_k);
  check (o, "pressure_pa", a.pressure_pa);
  check (o, "density_kg_m3", a.density_kg_m3);
  check (o, "speed_of_sound_m_s", a.speed_of_sound_m_s);
  g_assert_cmpfloat_with_epsilon (json_object_get_double_member (o, "pressure_pa"), 26500.0, 1.0);
  g_assert_cmpfloat_with_epsilon (json_object_get_double_member (o, "density_kg_m3"), 0.41351,
                                  1e-5);
  run_clear (&run);
}

/* ---- CSV export -------------------------------------------------------------- */

/* A CSV file written by `export --csv`: the caution line, a header, rows.
 * Cells are looked up by the header's column names. */
typedef struct {
  char     **header;
  GPtrArray *rows;        /* of GStrv */
} Csv;

static void
csv_clear (Csv *c)
{
  g_strfreev (c->header);
  g_ptr_array_unref (c->rows);
}

/* Splits one line at commas outside double quotes (RFC 4180). */
static char **
csv_split (const char *line)
{
  GPtrArray *cells = g_ptr_array_new ();
  GString *cell = g_string_new (NULL);
  gboolean quoted = FALSE;

  for (const char *p = line;; p++)
    {
      if (*p == '"' && quoted && p[1] == '"')
        g_string_append_c (cell, *p++);
      else if (*p == '"')
        quoted = !quoted;
      else if ((*p == ',' && !quoted) || *p == '\0')
        {
          g_ptr_array_add (cells, g_strdup (cell->str));
          g_string_truncate (cell, 0);
          if (*p == '\0')
            break;
        }
      else
        g_string_append_c (cell, *p);
    }
  g_string_free (cell, TRUE);
  g_ptr_array_add (cells, NULL);
  return (char **) g_ptr_array_free (cells, FALSE);
}

static void
csv_read (Csv *c, const char *dir, const char *name)
{
  g_autofree char *path = g_build_filename (dir, name, NULL);
  g_autofree char *text = NULL;
  g_auto (GStrv) lines = NULL;

  if (!g_file_get_contents (path, &text, NULL, NULL))
    g_error ("%s was not written", name);
  lines = g_strsplit (text, "\n", -1);
  /* The cautions first (every export carries them). */
  g_assert_true (g_str_has_prefix (lines[0], "# "));
  g_assert_nonnull (strstr (lines[0], "not for flight hardware"));
  c->header = csv_split (lines[1]);
  c->rows = g_ptr_array_new_with_free_func ((GDestroyNotify) g_strfreev);
  for (guint i = 2; lines[i] != NULL; i++)
    if (lines[i][0] != '\0')
      {
        char **row = csv_split (lines[i]);
        g_assert_cmpuint (g_strv_length (row), ==, g_strv_length (c->header));
        g_ptr_array_add (c->rows, row);
      }
}

static const char *
cell (const Csv *c, guint row, const char *column)
{
  g_assert_cmpuint (row, <, c->rows->len);
  for (guint k = 0; c->header[k] != NULL; k++)
    if (strcmp (c->header[k], column) == 0)
      return ((char **) c->rows->pdata[row])[k];
  g_error ("no column %s", column);
}

/* The CSV prints 10 significant figures: half a unit of the tenth is at most
 * 5e-10 relative.  An empty cell stands for "no value" (NAN). */
static void
check_cell (const Csv *c, guint row, const char *column, double core)
{
  const char *text = cell (c, row, column);
  double v;

  if (isnan (core))
    {
      if (text[0] != '\0')
        g_error ("row %u, %s: the core has no value, the CSV shows %s", row, column, text);
      return;
    }
  if (text[0] == '\0')
    g_error ("row %u, %s: empty, the core has %.10g", row, column, core);
  v = g_ascii_strtod (text, NULL);
  if (!(fabs (v - core) <= 5e-10 * fabs (core) + 1e-300))
    g_error ("row %u, %s: CSV %s, core %.17g", row, column, text, core);
}

static void
test_csv_values (void)
{
  g_autofree char *path = demo ("skelloway-upgrade-study.stagewright");
  g_autofree char *dir = g_dir_make_tmp ("sw-cli-csv-XXXXXX", NULL);
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, NULL);
  g_autofree SwSweep *sweep = g_new0 (SwSweep, 1);
  const char *const files[] = { "stages.csv", "stage-count.csv", "delta-v-sweep.csv",
                                "sensitivity.csv", "reliability.csv",
                                "uncertainty-histogram.csv", "stage-decision.csv",
                                "carpet.csv" };
  SwSizing s;
  SwStageCurve curve, base;
  SwReliability rel;
  SwReliabilityCurve relc;
  SwSensitivityTable t;
  double dv;
  Csv c;
  Run run;

  g_assert_nonnull (d);
  g_assert_nonnull (d->baseline);
  g_assert_true (sw_size_design (d, &s, NULL));
  g_assert_true (s.feasible);
  g_assert_true (sw_design_required_delta_v (d, &dv, NULL));
  sw_stage_curve_compute (d, dv, SW_MAX_STAGES, &curve);
  {
    /* The baseline's curve is for the baseline's own mission. */
    double base_dv;
    g_assert_true (sw_design_required_delta_v (d->baseline, &base_dv, NULL));
    sw_stage_curve_compute (d->baseline, base_dv, SW_MAX_STAGES, &base);
  }
  sw_sweep_compute (d, SW_SWEEP_CURVES, SW_SWEEP_POINTS, sweep);
  sw_reliability_from_design (d, &rel);
  sw_reliability_curve_compute (d, SW_MAX_STAGES, &relc);
  g_assert_true (sw_sensitivity_compute (d, SW_SENSITIVITY_DEFAULT_STEP, &t, NULL));

  run_cli (&run, "export", "--csv", dir, "--no-montecarlo", path, NULL);
  g_assert_cmpint (run.code, ==, 0);
  run_clear (&run);

  csv_read (&c, dir, "stages.csv");
  g_assert_cmpuint (c.rows->len, ==, d->n_stages + 1);       /* and the total */
  for (guint i = 0; i < d->n_stages; i++)
    {
      const SwStageResult *r = &s.stages[i];
      g_assert_cmpstr (cell (&c, i, "name"), ==, d->stages[i].name);
      check_cell (&c, i, "isp_vac_s", d->stages[i].isp_vac_s);
      check_cell (&c, i, "structural_coefficient", d->stages[i].structural_coefficient);
      check_cell (&c, i, "delta_v_m_s", r->delta_v_m_s);
      check_cell (&c, i, "delta_v_share", r->delta_v_share);
      check_cell (&c, i, "mass_ratio", r->mass_ratio);
      check_cell (&c, i, "propellant_mass_kg", r->propellant_mass_kg);
      check_cell (&c, i, "structural_mass_kg", r->structural_mass_kg);
      check_cell (&c, i, "initial_mass_kg", r->initial_mass_kg);
      check_cell (&c, i, "burnout_mass_kg", r->burnout_mass_kg);
      check_cell (&c, i, "stage_success", rel.stage[i]);
    }
  g_assert_cmpstr (cell (&c, d->n_stages, "stage"), ==, "total");
  check_cell (&c, d->n_stages, "delta_v_m_s", s.delta_v_m_s);
  check_cell (&c, d->n_stages, "initial_mass_kg", s.liftoff_mass_kg);
  check_cell (&c, d->n_stages, "stage_success", rel.mission);
  csv_clear (&c);

  csv_read (&c, dir, "stage-count.csv");
  g_assert_cmpuint (c.rows->len, ==, curve.n_points);
  for (guint i = 0; i < curve.n_points; i++)
    {
      g_assert_cmpint (atoi (cell (&c, i, "stages")), ==, i + 1);
      g_assert_cmpstr (cell (&c, i, "feasible"), ==, curve.points[i].feasible ? "true" : "false");
      check_cell (&c, i, "liftoff_mass_kg", curve.points[i].liftoff_mass_kg);
      check_cell (&c, i, "delta_v_limit_m_s", curve.points[i].delta_v_limit_m_s);
      check_cell (&c, i, "baseline_liftoff_mass_kg", base.points[i].liftoff_mass_kg);
      check_cell (&c, i, "mission_success", relc.mission[i]);
      /* No Monte Carlo asked for: no band. */
      check_cell (&c, i, "liftoff_mass_p50_kg", NAN);
    }
  csv_clear (&c);

  csv_read (&c, dir, "delta-v-sweep.csv");
  {
    guint row = 0;
    for (guint k = 0; k < sweep->n_curves; k++)
      for (guint j = 0; j < sweep->curves[k].n_points; j++, row++)
        {
          g_assert_cmpint (atoi (cell (&c, row, "stages")), ==, sweep->curves[k].stages);
          check_cell (&c, row, "delta_v_m_s", sweep->curves[k].delta_v_m_s[j]);
          check_cell (&c, row, "liftoff_mass_kg", sweep->curves[k].liftoff_mass_kg[j]);
        }
    g_assert_cmpuint (c.rows->len, ==, row);
  }
  csv_clear (&c);

  csv_read (&c, dir, "sensitivity.csv");
  g_assert_cmpuint (c.rows->len, ==, t.n_items);
  for (guint r = 0; r < t.n_items; r++)
    {
      const SwSensitivity *it = &t.items[t.ranked[r]];
      g_assert_cmpint (atoi (cell (&c, r, "rank")), ==, r + 1);
      g_assert_cmpstr (cell (&c, r, "parameter"), ==, sw_sens_param_to_string (it->param));
      check_cell (&c, r, "value", it->value);
      check_cell (&c, r, "derivative_kg_per_unit", it->derivative);
      check_cell (&c, r, "elasticity", it->elasticity);
      check_cell (&c, r, "minus_step_kg", it->minus_kg);
      check_cell (&c, r, "plus_step_kg", it->plus_kg);
      g_assert_cmpstr (cell (&c, r, "output"), ==, "liftoff_mass_kg");
    }
  csv_clear (&c);

  csv_read (&c, dir, "reliability.csv");
  g_assert_cmpuint (c.rows->len, ==, relc.n_points);
  for (guint i = 0; i < relc.n_points; i++)
    check_cell (&c, i, "mission_success", relc.mission[i]);
  csv_clear (&c);

  /* With the Monte Carlo: the band columns are the core's band for the
   * design's seed and samples (at most 2000 per stage count, sw-analysis.h),
   * and ordered p05 <= p50 <= p95. */
  {
    SwMcBand band;
    guint n_band = 0;

    g_assert_true (sw_montecarlo_band (d, NULL, SW_MAX_STAGES,
                                       MIN (sw_uncertainty_samples (&d->uncertainty), 2000),
                                       sw_uncertainty_seed (&d->uncertainty), 2, &band, NULL));
    run_cli (&run, "export", "--csv", dir, "--threads", "2", path, NULL);
    g_assert_cmpint (run.code, ==, 0);
    run_clear (&run);
    csv_read (&c, dir, "stage-count.csv");
    for (guint i = 0; i < band.n_points; i++)
      {
        check_cell (&c, i, "liftoff_mass_p05_kg", band.p05[i]);
        check_cell (&c, i, "liftoff_mass_p50_kg", band.p50[i]);
        check_cell (&c, i, "liftoff_mass_p95_kg", band.p95[i]);
        if (isfinite (band.p95[i]))
          {
            g_assert_cmpfloat (band.p05[i], <, band.p50[i]);
            g_assert_cmpfloat (band.p50[i], <, band.p95[i]);
            n_band++;
          }
      }
    g_assert_cmpuint (n_band, >=, 2);
    csv_clear (&c);
  }
  /* The histograms: the design's own run (its samples and seed), bins of
   * equal width from the lowest to the highest sample. */
  {
    SwMonteCarlo mc;

    g_assert_true (sw_montecarlo_run (d, NULL, 0, FALSE, 0, 2, &mc, NULL, NULL, NULL));
    csv_read (&c, dir, "uncertainty-histogram.csv");
    g_assert_cmpuint (c.rows->len, ==, 2 * SW_MC_BINS);
    for (guint q = 0; q < 2; q++)
      {
        const SwMcSummary *sum = q == 0 ? &mc.liftoff : &mc.payload;
        guint total = 0;

        for (guint i = 0; i < SW_MC_BINS; i++)
          {
            guint row = q * SW_MC_BINS + i;
            double w = (sum->bin_hi - sum->bin_lo) / SW_MC_BINS;

            g_assert_cmpstr (cell (&c, row, "quantity"), ==,
                             q == 0 ? "liftoff_mass_kg" : "fixed_vehicle_payload_kg");
            g_assert_cmpint (atoi (cell (&c, row, "bin")), ==, i + 1);
            check_cell (&c, row, "lower", sum->bin_lo + i * w);
            check_cell (&c, row, "upper", sum->bin_lo + (i + 1) * w);
            g_assert_cmpint (atoi (cell (&c, row, "count")), ==, sum->bins[i]);
            total += (guint) atoi (cell (&c, row, "count"));
          }
        g_assert_cmpuint (total, ==, sum->n);
      }
    csv_clear (&c);
  }

  for (guint i = 0; i < G_N_ELEMENTS (files); i++)
    {
      g_autofree char *f = g_build_filename (dir, files[i], NULL);
      g_unlink (f);
    }
  g_assert_cmpint (g_rmdir (dir), ==, 0);
}

/* Every load fixed: sensitivity.csv says its figures are of the payload
 * capability, and uncertainty-histogram.csv gives the capability and the
 * delta-v margin (bins the core's), no liftoff mass. */
static void
test_csv_all_fixed (void)
{
  g_autofree char *demo_file = demo ("sallowmere-as-built.stagewright");
  g_autofree char *dir = g_dir_make_tmp ("sw-cli-csv-XXXXXX", NULL);
  g_autofree char *path = g_build_filename (dir, "built.stagewright", NULL);
  g_autoptr (SwDesign) d = sw_design_load (demo_file, NULL, NULL);
  g_autoptr (GError) error = NULL;
  g_autoptr (GDir) listing = NULL;
  SwMonteCarlo mc;
  const char *name;
  guint margin_rows = 0;
  Csv c;
  Run run;

  g_assert_nonnull (d);
  d->uncertainty.present = TRUE;
  d->uncertainty.has_samples = TRUE;
  d->uncertainty.samples = 400;
  d->uncertainty.isp.kind = SW_SPREAD_NORMAL;
  d->uncertainty.isp.width = 1.0;
  g_assert_true (sw_design_save (d, path, &error));
  g_assert_no_error (error);
  g_assert_true (sw_montecarlo_run (d, NULL, 0, FALSE, 0, 2, &mc, NULL, NULL, NULL));
  g_assert_true (mc.all_fixed);

  run_cli (&run, "export", "--csv", dir, "--no-ascent", path, NULL);
  g_assert_cmpint (run.code, ==, 0);
  run_clear (&run);
  csv_read (&c, dir, "sensitivity.csv");
  g_assert_cmpuint (c.rows->len, >, 0);
  for (guint r = 0; r < c.rows->len; r++)
    g_assert_cmpstr (cell (&c, r, "output"), ==, "payload_capability_kg");
  csv_clear (&c);
  csv_read (&c, dir, "uncertainty-histogram.csv");
  for (guint r = 0; r < c.rows->len; r++)
    {
      const char *q = cell (&c, r, "quantity");
      guint bin = (guint) atoi (cell (&c, r, "bin"));

      g_assert_cmpstr (q, !=, "liftoff_mass_kg");
      g_assert_cmpuint (bin, >=, 1);
      g_assert_cmpuint (bin, <=, SW_MC_BINS);
      if (g_strcmp0 (q, "delta_v_margin_m_s") == 0)
        {
          g_assert_cmpuint ((guint) atoi (cell (&c, r, "count")), ==, mc.margin.bins[bin - 1]);
          margin_rows++;
        }
      else
        g_assert_cmpuint ((guint) atoi (cell (&c, r, "count")), ==, mc.payload.bins[bin - 1]);
    }
  g_assert_cmpuint (margin_rows, ==, SW_MC_BINS);
  csv_clear (&c);

  listing = g_dir_open (dir, 0, NULL);
  while ((name = g_dir_read_name (listing)) != NULL)
    {
      g_autofree char *f = g_build_filename (dir, name, NULL);
      g_unlink (f);
    }
  g_assert_cmpint (g_rmdir (dir), ==, 0);
}

/* ---- text reports ------------------------------------------------------------- */

static void
expect_line (const char *out, const char *line)
{
  g_autofree char *needle = g_strconcat ("\n", line, "\n", NULL);
  g_autofree char *text = g_strconcat ("\n", out, NULL);

  if (strstr (text, needle) == NULL)
    {
      g_printerr ("%s", out);
      g_error ("no line \"%s\" in the output above", line);
    }
}

/* The table's figures at 10 km, written out from the 1976 standard's table
 * (reference-values.md, confirmed: 223.252 K, 0.41351 kg/m^3, 299.53 m/s),
 * and the model named up to the layered part's top at exactly 86 km. */
static void
test_atmosphere_text (void)
{
  g_autoptr (JsonNode) keep = NULL;
  JsonObject *o;
  Run run;

  run_cli (&run, "atmosphere", "10000", NULL);
  g_assert_cmpint (run.code, ==, 0);
  expect_line (run.out, "  temperature             223.252 K");
  expect_line (run.out, "  density                 0.41351 kg/m^3");
  expect_line (run.out, "  speed of sound           299.53 m/s");
  expect_line (run.out, "Model: 1976 U.S. Standard Atmosphere (NOAA-S/T 76-1562)");
  run_clear (&run);

  run_cli (&run, "atmosphere", "--json", "86000", NULL);
  g_assert_cmpint (run.code, ==, 0);
  o = parse (run.out, &keep);
  g_assert_cmpstr (json_object_get_string_member (o, "model"), ==,
                   "1976 U.S. Standard Atmosphere");
  run_clear (&run);
  g_clear_pointer (&keep, json_node_unref);
  run_cli (&run, "atmosphere", "--json", "86001", NULL);
  g_assert_cmpint (run.code, ==, 0);
  o = parse (run.out, &keep);
  g_assert_nonnull (strstr (json_object_get_string_member (o, "model"), "above 86 km"));
  run_clear (&run);
}

/* The Monte Carlo report: the spreads as the design file gives them (skelloway
 * demo: Isp normal 1 %, structural coefficient uniform 6 %, losses normal
 * 100 m/s), the share that carries the payload in percent, and a spread of
 * width zero reported as none. */
static void
test_montecarlo_text (void)
{
  g_autofree char *path = demo ("skelloway-upgrade-study.stagewright");
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, NULL);
  g_autofree char *margin = NULL;
  SwMonteCarlo mc;
  Run run;

  g_assert_true (sw_montecarlo_run (d, NULL, 500, TRUE, 3, 2, &mc, NULL, NULL, NULL));
  run_cli (&run, "montecarlo", "--samples", "500", "--seed", "3", "--threads", "2", path, NULL);
  g_assert_cmpint (run.code, ==, 0);
  expect_line (run.out, "Spreads: Isp normal, sigma 1 %; structural coefficient uniform, +- 6 %; "
                        "losses normal, sigma 100 m/s");
  /* The share of samples that carry the whole payload: 1 - the share short. */
  margin = g_strdup_printf (" carries the whole payload in %.1f %% of cases;",
                            100.0 * (1.0 - mc.p_negative_margin));
  if (strstr (run.out, margin) == NULL)
    g_error ("no \"%s\" in:\n%s", margin, run.out);
  run_clear (&run);

  {
    g_autofree char *dir = g_dir_make_tmp ("sw-cli-mc-XXXXXX", NULL);
    g_autofree char *flat = g_build_filename (dir, "flat.stagewright", NULL);
    static const char text[] =
      "{ \"format\": \"stagewright-design\", \"version\": 1, \"name\": \"flat\",\n"
      "  \"payload_kg\": 1000, \"mission\": { \"delta_v_m_s\": 9000 }, \"split\": \"optimal\",\n"
      "  \"stages\": [ { \"isp_vac_s\": 320, \"structural_coefficient\": 0.07 },\n"
      "    { \"isp_vac_s\": 345, \"structural_coefficient\": 0.09 } ],\n"
      "  \"uncertainty\": { \"samples\": 200,\n"
      "    \"isp_vac\": { \"distribution\": \"normal\", \"sigma_percent\": 0 } } }\n";
    g_autoptr (GError) error = NULL;
    g_autoptr (SwDesign) f = NULL;

    g_assert_true (g_file_set_contents (flat, text, -1, NULL));
    f = sw_design_load (flat, NULL, &error);
    if (f != NULL)
      {
        run_cli (&run, "montecarlo", flat, NULL);
        g_assert_cmpint (run.code, ==, 0);
        expect_line (run.out, "Spreads: Isp none; structural coefficient none; losses none");
        /* Nothing varies: nothing falls short, no reserve is needed. */
        expect_line (run.out, "  required 1,000.0 kg; reserve for 95 % confidence: 0.0 kg");
        g_assert_nonnull (strstr (run.out, " carries the whole payload in 100.0 % of cases: no reserve is needed for 95 %."));
        run_clear (&run);
      }
    else
      g_test_message ("a zero sigma is refused: %s", error->message);
    g_unlink (flat);
    g_rmdir (dir);
  }
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
  /* The CLI's own messages too (po/de.po). */
  run_cli_env (&r, env, NULL);
  g_assert_cmpint (r.code, ==, 2);
  g_assert_nonnull (strstr (r.err, "Aufruf: stagewright-cli BEFEHL [OPTIONEN] ARGUMENTE"));
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
  g_test_add_func ("/cli-values/montecarlo-all-fixed", test_montecarlo_all_fixed);
  g_test_add_func ("/cli-values/sensitivity", test_sensitivity_values);
  g_test_add_func ("/cli-values/reliability", test_reliability_values);
  g_test_add_func ("/cli-values/ascent", test_ascent_values);
  g_test_add_func ("/cli-values/atmosphere", test_atmosphere_values);
  g_test_add_func ("/cli-values/fairing-liftoff", test_fairing_liftoff_agrees);
  g_test_add_func ("/cli-values/csv", test_csv_values);
  g_test_add_func ("/cli-values/csv-all-fixed", test_csv_all_fixed);
  g_test_add_func ("/cli-values/atmosphere-text", test_atmosphere_text);
  g_test_add_func ("/cli-values/montecarlo-text", test_montecarlo_text);
  g_test_add_func ("/cli-values/german-message", test_german_message);
  return g_test_run ();
}
