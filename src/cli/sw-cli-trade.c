/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The trade-study subcommands: sensitivity, montecarlo, reliability, export. */
#include "config.h"

#include "sw-cli.h"

#include "sw-comparison.h"
#include "sw-limits.h"
#include "sw-ascent-montecarlo.h"
#include "sw-montecarlo.h"
#include "sw-reliability.h"
#include "sw-sensitivity.h"
#include "sw-csv.h"
#include "sw-format.h"
#include "sw-sheet.h"
#include "sw-sizing.h"

#include <glib/gi18n.h>
#include <math.h>
#include <string.h>

static gboolean opt_json;

/* ---- sensitivity ------------------------------------------------------- */

static double opt_step = SW_SENSITIVITY_DEFAULT_STEP * 100.0;

static GOptionEntry sensitivity_entries[] = {
  { "step", 0, 0, G_OPTION_ARG_DOUBLE, &opt_step,
    N_("Plus-or-minus step of the tornado, percent of each value (default 5)"), "PCT" },
  { "json", 0, 0, G_OPTION_ARG_NONE, &opt_json, N_("Print JSON for machines"), NULL },
  { NULL }
};

static const char *
unit_of (SwSensParam p)
{
  /* The same units for the payload capability's table (kg of payload). */
  switch (p)
    {
    case SW_SENS_PAYLOAD:
      return "kg/kg";
    case SW_SENS_DELTA_V:
      return "kg/(m/s)";
    case SW_SENS_ISP:
    case SW_SENS_BOOSTER_ISP:
      return "kg/s";
    case SW_SENS_STRUCTURAL_COEFFICIENT:
    default:
      return "kg/unit";
    }
}

int
sw_cli_sensitivity (int argc, char **argv)
{
  g_autoptr (SwAnalysis) a = NULL;
  SwAnalysisOptions o;
  const SwSensitivityTable *tp;
  const SwDesign *d;
  SwSensitivityTable t;
  int code;

  opt_json = FALSE;
  opt_step = SW_SENSITIVITY_DEFAULT_STEP * 100.0;
  if (!sw_cli_parse ("sensitivity", sensitivity_entries, &argc, &argv, 1, &code))
    return code;
  if (!sw_limit_contains (SW_LIMIT_SENSITIVITY_STEP, opt_step))
    {
      const SwLimit *l = sw_limit_get (SW_LIMIT_SENSITIVITY_STEP);
      g_printerr (_("stagewright-cli sensitivity: --step must be %g to %g percent, not %g\n"),
                  l->min, l->max, opt_step);
      return SW_EXIT_USAGE;
    }
  sw_analysis_options_init (&o);
  o.montecarlo = FALSE;
  /* The ascent phase closes the loop of a simulate design, whose
   * sensitivities are then the closed loop's (the analysis says which). */
  o.ascent = TRUE;
  o.sensitivity_step = opt_step / 100.0;
  if ((a = sw_cli_analyse (argv[1], &o, &code)) == NULL)
    return code;
  d = a->design;
  tp = &a->sensitivity;
  /* An infeasible design has no table: say so with the step asked for. */
  t = *tp;
  if (!a->has_sensitivity)
    {
      t.feasible = FALSE;
      t.n_items = 0;
      t.n_stages = 0;
      t.step = o.sensitivity_step;
      t.liftoff_mass_kg = NAN;
    }
  if (!a->has_sensitivity && !t.capability)
    t.payload_capability_kg = NAN;

  if (opt_json)
    {
      g_autoptr (JsonBuilder) b = json_builder_new_immutable ();

      json_builder_begin_object (b);
      json_builder_set_member_name (b, "feasible");
      json_builder_add_boolean_value (b, t.feasible);
      /* What the derivatives and the steps are of. */
      json_builder_set_member_name (b, "output");
      json_builder_add_string_value (b, t.capability ? "payload_capability_kg"
                                                     : "liftoff_mass_kg");
      sw_cli_add_number (b, "liftoff_mass_kg", t.liftoff_mass_kg);
      sw_cli_add_number (b, "payload_capability_kg", t.capability ? t.payload_capability_kg
                                                                  : NAN);
      sw_cli_add_number (b, "step_percent", t.step * 100.0);
      sw_cli_add_number (b, "losses_used_m_s", a->trade_losses_m_s);
      json_builder_set_member_name (b, "losses_from_closed_loop");
      json_builder_add_boolean_value (b, a->trade_losses_simulated);
      json_builder_set_member_name (b, "parameters");
      json_builder_begin_array (b);
      for (guint r = 0; r < t.n_items; r++)
        {
          const SwSensitivity *it = &t.items[t.ranked[r]];
          g_autofree char *label = sw_sensitivity_dup_label (d, it);

          json_builder_begin_object (b);
          json_builder_set_member_name (b, "rank");
          json_builder_add_int_value (b, r + 1);
          json_builder_set_member_name (b, "parameter");
          json_builder_add_string_value (b, sw_sens_param_to_string (it->param));
          json_builder_set_member_name (b, "stage");
          if (it->stage >= 0)
            json_builder_add_int_value (b, it->stage + 1);
          else
            json_builder_add_null_value (b);
          json_builder_set_member_name (b, "label");
          json_builder_add_string_value (b, label);
          sw_cli_add_number (b, "value", it->value);
          sw_cli_add_number (b, "derivative_kg_per_unit", it->derivative);
          sw_cli_add_number (b, "elasticity", it->elasticity);
          sw_cli_add_number (b, "minus_step_kg", it->minus_kg);
          sw_cli_add_number (b, "plus_step_kg", it->plus_kg);
          json_builder_end_object (b);
        }
      json_builder_end_array (b);
      json_builder_set_member_name (b, "exchange_ratios");
      json_builder_begin_array (b);
      for (guint i = 0; t.feasible && i < t.n_stages; i++)
        {
          json_builder_begin_object (b);
          json_builder_set_member_name (b, "stage");
          json_builder_add_int_value (b, i + 1);
          json_builder_set_member_name (b, "name");
          json_builder_add_string_value (b, d->stages[i].name);
          sw_cli_add_number (b, "payload_lost_per_kg_dry", t.exchange_ratio[i]);
          json_builder_end_object (b);
        }
      json_builder_end_array (b);
      sw_cli_finish_json (b);
      return SW_EXIT_OK;
    }

  g_print (_("Design: %s\n"), d->name);
  if (!t.feasible && t.capability)
    {
      g_print (_("The vehicle carries no payload to the mission (every propellant load is "
                 "fixed): no sensitivities.\n\n%s\n"),
               sw_format_cautions ());
      return SW_EXIT_OK;
    }
  if (!t.feasible)
    {
      g_print (_("The design is infeasible: no sensitivities.\n\n%s\n"), sw_format_cautions ());
      return SW_EXIT_OK;
    }
  if (t.capability)
    g_print (_("Every propellant load is fixed, so the liftoff mass (%s kg) does not change: "
               "the table is of the payload capability, %s kg (nominal payload %s kg).\n"
               "Tornado step +-%g %%, largest effect first; dP/dx in kg of payload per unit\n"),
             sw_cli_num (t.liftoff_mass_kg, 1), sw_cli_num (t.payload_capability_kg, 1),
             sw_cli_num (d->payload_kg, 1), t.step * 100.0);
  else
    g_print (_("Liftoff mass %s kg; tornado step +-%g %%, largest effect first\n"),
             sw_cli_num (t.liftoff_mass_kg, 1), t.step * 100.0);
  if (a->trade_losses_note[0] != '\0')
    g_print ("%s\n", a->trade_losses_note);
  g_print ("\n");
  guint label_w = 40, name_w = sw_cli_names_width (d, 28);
  g_autofree char *label_head = NULL;

  /* The parameter column as wide as its longest label. */
  for (guint r = 0; r < t.n_items; r++)
    {
      g_autofree char *label = sw_sensitivity_dup_label (d, &t.items[r]);
      label_w = MAX (label_w, (guint) g_utf8_strlen (label, -1));
    }
  label_head = sw_cli_cell ("parameter", label_w);
  g_print ("%-3s %s %12s %14s %-9s %10s %12s %12s\n", "#", label_head, "value",
           t.capability ? "dP/dx" : "dm0/dx", "unit", "elasticity", "-step kg", "+step kg");
  for (guint r = 0; r < t.n_items; r++)
    {
      const SwSensitivity *it = &t.items[t.ranked[r]];
      g_autofree char *label = sw_sensitivity_dup_label (d, it);
      g_autofree char *mi = it->minus_feasible ? sw_cli_format (it->minus_kg, 1)
                                               : g_strdup ("infeasible");
      g_autofree char *pl = it->plus_feasible ? sw_cli_format (it->plus_kg, 1)
                                              : g_strdup ("infeasible");
      g_autofree char *cell = sw_cli_cell (label, label_w);
      g_print ("%-3u %s %12.5g %14.5g %-9s %10s %12s %12s\n", r + 1, cell, it->value,
               it->derivative, unit_of (it->param), sw_cli_num (it->elasticity, 3), mi, pl);
    }
  g_print (_("\nPayload exchange ratios (propellant loads fixed): payload lost per kg of dry "
           "mass added\n"));
  for (guint i = 0; i < t.n_stages; i++)
    {
      g_autofree char *x = sw_cli_format (t.exchange_ratio[i], 4);
      g_autofree char *name = sw_cli_cell (d->stages[i].name, name_w);
      g_print (_("  stage %u %s %10s kg/kg\n"), i + 1, name, x);
    }
  g_print ("\n%s\n", sw_format_cautions ());
  return SW_EXIT_OK;
}

/* ---- montecarlo -------------------------------------------------------- */

static int opt_samples;
static gint64 opt_seed = -1;
static int opt_threads;
static gboolean opt_simulate;

static GOptionEntry montecarlo_entries[] = {
  { "samples", 0, 0, G_OPTION_ARG_INT, &opt_samples,
    N_("Number of samples (default: the design's, else 10000)"), "N" },
  { "seed", 0, 0, G_OPTION_ARG_INT64, &opt_seed,
    N_("Seed of the random stream (default: the design's, else 1)"), "S" },
  { "threads", 0, 0, G_OPTION_ARG_INT, &opt_threads, N_("Threads (default: all cores)"), "T" },
  { "json", 0, 0, G_OPTION_ARG_NONE, &opt_json, N_("Print JSON for machines"), NULL },
  { "simulate", 0, 0, G_OPTION_ARG_NONE, &opt_simulate,
    N_("Fly the ascent of every sample (default 1000 samples)"), NULL },
  { NULL }
};

static void
add_summary (JsonBuilder *b, const char *key, const SwMcSummary *s)
{
  json_builder_set_member_name (b, key);
  json_builder_begin_object (b);
  json_builder_set_member_name (b, "count");
  json_builder_add_int_value (b, s->n);
  sw_cli_add_number (b, "mean", s->mean);
  sw_cli_add_number (b, "sd", s->sd);
  sw_cli_add_number (b, "p05", s->p05);
  sw_cli_add_number (b, "p50", s->p50);
  sw_cli_add_number (b, "p95", s->p95);
  sw_cli_add_number (b, "min", s->min);
  sw_cli_add_number (b, "max", s->max);
  json_builder_set_member_name (b, "histogram");
  json_builder_begin_object (b);
  sw_cli_add_number (b, "lower", s->bin_lo);
  sw_cli_add_number (b, "upper", s->bin_hi);
  json_builder_set_member_name (b, "counts");
  json_builder_begin_array (b);
  for (guint i = 0; s->n > 0 && i < SW_MC_BINS; i++)
    json_builder_add_int_value (b, s->bins[i]);
  json_builder_end_array (b);
  json_builder_end_object (b);
  json_builder_end_object (b);
}

static void
add_spread (JsonBuilder *b, const char *key, const SwSpread *s, const char *unit)
{
  json_builder_set_member_name (b, key);
  json_builder_begin_object (b);
  json_builder_set_member_name (b, "distribution");
  json_builder_add_string_value (b, sw_spread_kind_to_string (s->kind));
  sw_cli_add_number (b, unit, s->kind == SW_SPREAD_NONE ? 0.0 : s->width);
  json_builder_end_object (b);
}

static void
print_summary (const char *title, const SwMcSummary *s, const char *unit)
{
  g_autofree char *mean = sw_cli_format (s->mean, 1), *sd = sw_cli_format (s->sd, 1);
  g_autofree char *p05 = sw_cli_format (s->p05, 1), *p50 = sw_cli_format (s->p50, 1);
  g_autofree char *p95 = sw_cli_format (s->p95, 1);

  g_print (_("%s (%u samples)\n"), title, s->n);
  g_print (_("  mean %s %s   sd %s %s\n"), mean, unit, sd, unit);
  g_print (_("  5th %s   50th %s   95th percentile %s %s\n"), p05, p50, p95, unit);
}

static const char *
spread_text (const SwSpread *s, const char *unit, char *buf, gsize size)
{
  if (s->kind == SW_SPREAD_NONE || s->width <= 0.0)
    return "none";
  g_snprintf (buf, size, "%s, %s %g %s", sw_spread_kind_to_string (s->kind),
              s->kind == SW_SPREAD_NORMAL ? "sigma" : "+-", s->width, unit);
  return buf;
}

/* montecarlo --simulate: the built vehicle flown per sample
 * (sw-ascent-montecarlo.h). */
static int
montecarlo_simulated (const SwDesign *d, const char *file)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (SwAscentMonteCarlo) mc = NULL;
  guint samples = opt_samples > 0 ? (guint) opt_samples : 1000;
  guint32 seed = opt_seed >= 0 ? (guint32) opt_seed : sw_uncertainty_seed (&d->uncertainty);

  mc = sw_ascent_montecarlo_run (d, samples, seed, (guint) opt_threads, NULL, NULL, NULL, &error);
  if (mc == NULL)
    return sw_cli_input_error (file, error);
  if (opt_json)
    {
      g_autoptr (JsonBuilder) b = json_builder_new_immutable ();

      json_builder_begin_object (b);
      json_builder_set_member_name (b, "simulated");
      json_builder_add_boolean_value (b, TRUE);
      json_builder_set_member_name (b, "samples");
      json_builder_add_int_value (b, mc->samples);
      json_builder_set_member_name (b, "seed");
      json_builder_add_int_value (b, seed);
      json_builder_set_member_name (b, "threads");
      json_builder_add_int_value (b, mc->threads);
      json_builder_set_member_name (b, "flown");
      json_builder_add_int_value (b, mc->flown);
      sw_cli_add_number (b, "sized_losses_m_s", mc->sized_losses_m_s);
      sw_cli_add_number (b, "nominal_margin_m_s", mc->nominal_margin_m_s);
      sw_cli_add_number (b, "mean_losses_m_s", mc->mean_losses_m_s);
      json_builder_set_member_name (b, "delta_v_margin_m_s");
      json_builder_begin_object (b);
      sw_cli_add_number (b, "mean", mc->mean_margin_m_s);
      sw_cli_add_number (b, "sd", mc->sd_margin_m_s);
      sw_cli_add_number (b, "p05", mc->p05_margin_m_s);
      sw_cli_add_number (b, "p50", mc->p50_margin_m_s);
      sw_cli_add_number (b, "p95", mc->p95_margin_m_s);
      sw_cli_add_number (b, "min", mc->min_margin_m_s);
      sw_cli_add_number (b, "max", mc->max_margin_m_s);
      json_builder_end_object (b);
      sw_cli_add_number (b, "probability_reached", mc->probability_reached);
      sw_cli_add_number (b, "delta_v_per_kg_payload_m_s", mc->dv_per_kg_payload);
      sw_cli_add_number (b, "payload_reserve_95_kg", mc->payload_reserve_95_kg);
      sw_cli_finish_json (b);
      return SW_EXIT_OK;
    }
  {
    g_autofree char *mean = sw_cli_format (mc->mean_margin_m_s, 1);
    g_autofree char *sd = sw_cli_format (mc->sd_margin_m_s, 1);
    g_autofree char *p05 = sw_cli_format (mc->p05_margin_m_s, 1);
    g_autofree char *p50 = sw_cli_format (mc->p50_margin_m_s, 1);
    g_autofree char *p95 = sw_cli_format (mc->p95_margin_m_s, 1);
    g_autofree char *res = sw_cli_format (mc->payload_reserve_95_kg, 1);
    g_autofree char *sized = sw_cli_format (mc->sized_losses_m_s, 1);
    g_autofree char *flown = sw_cli_format (mc->mean_losses_m_s, 1);

    g_print (_("Design: %s\n"), d->name);
    g_print (_("%u samples flown (seed %u, %u thread(s)); %u with an answer\n"), mc->samples,
             seed, mc->threads, mc->flown);
    g_print (_("Vehicle sized for %s m/s of losses; mean losses flown %s m/s\n"), sized, flown);
    g_print (_("Delta-v margin (sized less ideal less losses flown)\n"));
    g_print (_("  mean %s m/s   sd %s m/s\n"), mean, sd);
    g_print (_("  5th %s   50th %s   95th percentile %s m/s\n"), p05, p50, p95);
    g_print (_("  orbit reached in %s %% of the samples\n"),
             sw_cli_num (100.0 * mc->probability_reached, 1));
    g_print (_("  payload reserve for 95 %% confidence: %s kg\n"), res);
    g_print ("\n%s\n", sw_format_cautions ());
  }
  return SW_EXIT_OK;
}

int
sw_cli_montecarlo (int argc, char **argv)
{
  g_autoptr (SwAnalysis) a = NULL;
  g_autoptr (SwDesign) d = NULL;
  SwAnalysisOptions o;
  SwMonteCarlo mc;
  char b1[64], b2[64], b3[64];
  int code;

  opt_json = FALSE;
  opt_samples = 0;
  opt_seed = -1;
  opt_threads = 0;
  opt_simulate = FALSE;
  if (!sw_cli_parse ("montecarlo", montecarlo_entries, &argc, &argv, 1, &code))
    return code;
  /* The same ranges as the design's "uncertainty" keys. */
  if (opt_samples != 0 && !sw_limit_contains (SW_LIMIT_MC_SAMPLES, opt_samples))
    {
      const SwLimit *l = sw_limit_get (SW_LIMIT_MC_SAMPLES);
      g_printerr (_("stagewright-cli montecarlo: --samples must be %.10g to %.10g, not %d\n"),
                  l->min, l->max, opt_samples);
      return SW_EXIT_USAGE;
    }
  if (opt_seed != -1 && !sw_limit_contains (SW_LIMIT_MC_SEED, (double) opt_seed))
    {
      const SwLimit *l = sw_limit_get (SW_LIMIT_MC_SEED);
      g_printerr (_("stagewright-cli montecarlo: --seed must be %.10g to %.10g\n"), l->min, l->max);
      return SW_EXIT_USAGE;
    }
  if (opt_threads < 0 || opt_threads > 64)
    {
      g_printerr (_("stagewright-cli montecarlo: --threads must be 1 to 64 (0 = all cores)\n"));
      return SW_EXIT_USAGE;
    }
  if ((d = sw_cli_load (argv[1])) == NULL)
    return SW_EXIT_USAGE;
  if (!d->uncertainty.present || !sw_uncertainty_has_spread (&d->uncertainty))
    g_printerr (_("warning: %s: the design has no \"uncertainty\" spreads; every sample is the "
                "nominal design\n"),
                argv[1]);
  if (opt_simulate)
    return montecarlo_simulated (d, argv[1]);
  sw_analysis_options_init (&o);
  /* A simulate design: the closed loop's losses, not the first guess. */
  o.ascent = d->mission.kind == SW_MISSION_ORBIT && d->mission.loss_model == SW_LOSS_SIMULATE;
  o.band = FALSE;
  o.montecarlo_always = TRUE;
  o.montecarlo_samples = (guint) opt_samples;
  o.montecarlo_use_seed = opt_seed >= 0;
  o.montecarlo_seed = (guint32) MAX (opt_seed, 0);
  o.threads = (guint) opt_threads;
  a = sw_analysis_run (d, &o, NULL);
  if (!a->ok)
    {
      g_printerr (_("error: %s: %s\n"), argv[1], a->error_message);
      return SW_EXIT_USAGE;
    }
  if (!a->has_montecarlo)
    {
      g_printerr (_("error: %s: %s\n"), argv[1], a->montecarlo_error);
      return SW_EXIT_USAGE;
    }
  mc = a->montecarlo;

  if (opt_json)
    {
      g_autoptr (JsonBuilder) b = json_builder_new_immutable ();

      json_builder_begin_object (b);
      json_builder_set_member_name (b, "samples");
      json_builder_add_int_value (b, mc.samples);
      json_builder_set_member_name (b, "seed");
      json_builder_add_int_value (b, mc.seed);
      json_builder_set_member_name (b, "threads");
      json_builder_add_int_value (b, mc.threads);
      json_builder_set_member_name (b, "spreads");
      json_builder_begin_object (b);
      add_spread (b, "isp_vac", &mc.spreads.isp, "percent");
      add_spread (b, "structural_coefficient", &mc.spreads.structural_coefficient, "percent");
      add_spread (b, "losses", &mc.spreads.losses, "m_s");
      json_builder_end_object (b);
      json_builder_set_member_name (b, "nominal_feasible");
      json_builder_add_boolean_value (b, mc.nominal_feasible);
      sw_cli_add_number (b, "nominal_liftoff_mass_kg", mc.nominal_liftoff_kg);
      sw_cli_add_number (b, "required_payload_kg", mc.required_payload_kg);
      sw_cli_add_number (b, "nominal_delta_v_m_s", mc.nominal_delta_v_m_s);
      sw_cli_add_number (b, "losses_used_m_s", a->trade_losses_m_s);
      json_builder_set_member_name (b, "losses_from_closed_loop");
      json_builder_add_boolean_value (b, a->trade_losses_simulated);
      add_summary (b, "liftoff_mass_kg", &mc.liftoff);
      sw_cli_add_number (b, "infeasible_fraction", mc.infeasible_fraction);
      add_summary (b, "fixed_vehicle_payload_kg", &mc.payload);
      sw_cli_add_number (b, "probability_negative_margin", mc.p_negative_margin);
      sw_cli_add_number (b, "probability_payload_fits", a->montecarlo_success);
      sw_cli_add_number (b, "payload_reserve_95_kg", mc.reserve_95_kg);
      json_builder_set_member_name (b, "margin_definition");
      json_builder_add_string_value (b, "payload margin = payload that the nominal vehicle "
                                        "(fixed propellant loads) carries to the sampled "
                                        "delta-v minus the required payload");
      /* A vehicle that exists: its payload capability and its delta-v
       * margin at the nominal payload (the liftoff mass is constant). */
      json_builder_set_member_name (b, "all_fixed");
      json_builder_add_boolean_value (b, mc.all_fixed);
      json_builder_set_member_name (b, "outputs");
      json_builder_begin_array (b);
      if (mc.all_fixed)
        {
          json_builder_add_string_value (b, "payload_capability_kg");
          json_builder_add_string_value (b, "delta_v_margin_m_s");
        }
      else
        {
          json_builder_add_string_value (b, "liftoff_mass_kg");
          json_builder_add_string_value (b, "fixed_vehicle_payload_kg");
        }
      json_builder_end_array (b);
      if (mc.all_fixed)
        {
          sw_cli_add_number (b, "nominal_payload_capability_kg", mc.nominal_capability_kg);
          sw_cli_add_number (b, "nominal_delta_v_margin_m_s", mc.nominal_margin_m_s);
          add_summary (b, "payload_capability_kg", &mc.payload);
          add_summary (b, "delta_v_margin_m_s", &mc.margin);
        }
      else
        {
          json_builder_set_member_name (b, "payload_capability_kg");
          json_builder_add_null_value (b);
          json_builder_set_member_name (b, "delta_v_margin_m_s");
          json_builder_add_null_value (b);
        }
      sw_cli_finish_json (b);
      return SW_EXIT_OK;
    }

  g_print (_("Design: %s\n"), d->name);
  g_print (_("%u samples, seed %u, %u thread(s)\n"), mc.samples, mc.seed, mc.threads);
  if (a->trade_losses_note[0] != '\0')
    g_print ("%s\n", a->trade_losses_note);
  g_print (_("Spreads: Isp %s; structural coefficient %s; losses %s\n\n"),
           spread_text (&mc.spreads.isp, "%", b1, sizeof b1),
           spread_text (&mc.spreads.structural_coefficient, "%", b2, sizeof b2),
           spread_text (&mc.spreads.losses, "m/s", b3, sizeof b3));
  if (mc.all_fixed)
    {
      g_autofree char *res = sw_cli_format (mc.reserve_95_kg, 1);
      g_autofree char *chance = sw_format_probability (a->montecarlo_success);

      g_print (_("Every propellant load is fixed: the liftoff mass (%s kg) is the same in every "
                 "sample, so the outputs are the payload capability and the delta-v margin at "
                 "the nominal payload.\n\n"),
               sw_cli_num (mc.nominal_liftoff_kg, 1));
      print_summary (_("Payload capability (payload at which the vehicle's delta-v equals the "
                       "sampled required delta-v)"),
                     &mc.payload, "kg");
      g_print (_("  nominal %s kg; nominal payload %s kg; reserve for 95 %% confidence: %s kg\n"),
               sw_cli_num (mc.nominal_capability_kg, 1), sw_cli_num (mc.required_payload_kg, 1),
               res);
      g_print (_("  the nominal payload fits in %s of the samples\n"), chance);
      if (mc.payload.n > 0 && mc.payload.min < 0.0)
        g_print (_("  (a negative capability is the mass by which the vehicle falls short of "
                   "the sampled delta-v even with no payload)\n"));
      g_print ("\n");
      print_summary (_("Delta-v margin at the nominal payload (the vehicle's delta-v less the "
                       "sampled required delta-v)"),
                     &mc.margin, "m/s");
      g_print (_("  nominal %s m/s\n"), sw_cli_num (mc.nominal_margin_m_s, 1));
      g_print ("\n%s\n", sw_format_cautions ());
      return SW_EXIT_OK;
    }
  print_summary ("Liftoff mass needed for the payload", &mc.liftoff, "kg");
  {
    g_autofree char *nom = sw_cli_format (mc.nominal_liftoff_kg, 1);
    g_print (_("  nominal %s kg; infeasible samples %s %%\n\n"), nom,
             sw_cli_num (100.0 * mc.infeasible_fraction, 2));
  }
  if (mc.payload.n > 0)
    {
      g_autofree char *res = sw_cli_format (mc.reserve_95_kg, 1);
      print_summary ("Payload of the nominal vehicle (propellant loads fixed)", &mc.payload,
                     "kg");
      g_autofree char *chance = sw_format_probability (a->montecarlo_success);
      g_autofree char *resm = sw_format_mass (mc.reserve_95_kg);
      g_print (_("  required %s kg; reserve for 95 %% confidence: %s kg\n"),
               sw_cli_num (mc.required_payload_kg, 1), res);
      if (a->montecarlo_success >= 0.95)
        g_print (_("Built as sized, with no payload reserve, the vehicle carries the whole "
                   "payload in %s of cases: no reserve is needed for 95 %%.\n"), chance);
      else
        g_print (_("Built as sized, with no payload reserve, the vehicle carries the whole "
                   "payload in %s of cases; holding back %s of payload capacity raises that "
                   "to 95 %%.\n"), chance, resm);
    }
  else
    g_print (_("The nominal design is infeasible: no fixed vehicle to test.\n"));
  g_print ("\n%s\n", sw_format_cautions ());
  return SW_EXIT_OK;
}

/* ---- reliability ------------------------------------------------------- */

static GOptionEntry json_entries[] = {
  { "json", 0, 0, G_OPTION_ARG_NONE, &opt_json, N_("Print JSON for machines"), NULL },
  { NULL }
};

int
sw_cli_reliability (int argc, char **argv)
{
  g_autoptr (SwAnalysis) a = NULL;
  SwAnalysisOptions o;
  const SwDesign *d;
  SwReliability r;
  SwReliabilityCurve curve;
  int code;

  opt_json = FALSE;
  if (!sw_cli_parse ("reliability", json_entries, &argc, &argv, 1, &code))
    return code;
  sw_analysis_options_init (&o);
  o.montecarlo = FALSE;
  o.ascent = FALSE;
  if ((a = sw_cli_analyse (argv[1], &o, &code)) == NULL)
    return code;
  d = a->design;
  r = a->reliability;
  curve = a->reliability_curve;
  if (!r.given)
    g_printerr (_("warning: %s: no stage has reliability keys; every stage counts as perfect\n"),
                argv[1]);

  if (opt_json)
    {
      g_autoptr (JsonBuilder) b = json_builder_new_immutable ();

      json_builder_begin_object (b);
      json_builder_set_member_name (b, "given");
      json_builder_add_boolean_value (b, r.given);
      sw_cli_add_number (b, "mission_success", r.mission);
      json_builder_set_member_name (b, "stages");
      json_builder_begin_array (b);
      for (guint i = 0; i < r.n_stages; i++)
        {
          SwReliabilityInputs in;

          sw_reliability_inputs (&d->stages[i].reliability, &in);
          json_builder_begin_object (b);
          json_builder_set_member_name (b, "name");
          json_builder_add_string_value (b, d->stages[i].name);
          json_builder_set_member_name (b, "engine_count");
          json_builder_add_int_value (b, in.engine_count);
          sw_cli_add_number (b, "engine_reliability", in.engine_reliability);
          json_builder_set_member_name (b, "engine_failures_tolerated");
          json_builder_add_int_value (b, in.failures_tolerated);
          sw_cli_add_number (b, "ignition_reliability", in.ignition_reliability);
          sw_cli_add_number (b, "engines_success", r.engines[i]);
          sw_cli_add_number (b, "stage_success", r.stage[i]);
          json_builder_set_member_name (b, "separation_success");
          if (i + 1 < r.n_stages)
            json_builder_add_double_value (b, r.separation[i]);
          else
            json_builder_add_null_value (b);
          json_builder_end_object (b);
        }
      json_builder_end_array (b);
      json_builder_set_member_name (b, "curve");
      json_builder_begin_array (b);
      for (guint n = 0; n < curve.n_points; n++)
        {
          json_builder_begin_object (b);
          json_builder_set_member_name (b, "stages");
          json_builder_add_int_value (b, n + 1);
          sw_cli_add_number (b, "mission_success", curve.mission[n]);
          json_builder_end_object (b);
        }
      json_builder_end_array (b);
      sw_cli_finish_json (b);
      return SW_EXIT_OK;
    }

  g_print (_("Design: %s\n\n"), d->name);
  guint name_w = sw_cli_names_width (d, 24);
  g_autofree char *head = sw_cli_cell ("stage", name_w);

  g_print ("%-3s %s %7s %9s %9s %9s %10s %10s %11s\n", "#", head, "engines", "r_engine",
           "tolerated", "ignition", "engines P", "stage P", "separation");
  for (guint i = 0; i < r.n_stages; i++)
    {
      SwReliabilityInputs in;
      g_autofree char *sep = i + 1 < r.n_stages ? sw_cli_format (r.separation[i], 6)
                                                : g_strdup ("-");

      sw_reliability_inputs (&d->stages[i].reliability, &in);
      g_autofree char *name = sw_cli_cell (d->stages[i].name, name_w);
      g_print ("%-3u %s %7u %9s %9u %9s %10s %10s %11s\n", i + 1,
               name, in.engine_count, sw_cli_num (in.engine_reliability, 5), in.failures_tolerated,
               sw_cli_num (in.ignition_reliability, 5), sw_cli_num (r.engines[i], 6),
               sw_cli_num (r.stage[i], 6), sep);
    }
  g_print (_("\nMission success probability: %s (%s %%)\n\n"), sw_cli_num (r.mission, 6),
           sw_cli_num (100.0 * r.mission, 3));
  g_print (_("Against stage count (with more stages than the design's %u, the top stage is "
             "repeated):\n"), d->n_stages);
  for (guint n = 0; n < curve.n_points; n++)
    {
      g_autofree char *count = g_strdup_printf (g_dngettext (GETTEXT_PACKAGE, "%u stage",
                                                             "%u stages", n + 1), n + 1);
      g_print ("  %-10s %s\n", count, sw_cli_num (curve.mission[n], 6));
    }
  g_print ("\n%s\n", sw_format_cautions ());
  return SW_EXIT_OK;
}

/* ---- export ------------------------------------------------------------ */

static char *opt_pdf, *opt_svg, *opt_png, *opt_csv, *opt_paper;
static gboolean opt_no_montecarlo;
static gboolean opt_no_ascent;

static GOptionEntry export_entries[] = {
  { "pdf", 0, 0, G_OPTION_ARG_FILENAME, &opt_pdf, N_("Write the briefing sheet as PDF"), "OUT" },
  { "svg", 0, 0, G_OPTION_ARG_FILENAME, &opt_svg, N_("Write the briefing sheet as SVG"), "OUT" },
  { "png", 0, 0, G_OPTION_ARG_FILENAME, &opt_png, N_("Write the briefing sheet as PNG (150 dpi)"),
    "OUT" },
  { "csv", 0, 0, G_OPTION_ARG_FILENAME, &opt_csv,
    N_("Write the stage table and every curve as CSV files into the folder OUT"), "OUT" },
  { "paper", 0, 0, G_OPTION_ARG_STRING, &opt_paper, N_("Paper size: a4 (default) or letter"),
    "SIZE" },
  { "threads", 0, 0, G_OPTION_ARG_INT, &opt_threads,
    N_("Threads for the Monte Carlo (default: all cores)"), "T" },
  { "no-montecarlo", 0, 0, G_OPTION_ARG_NONE, &opt_no_montecarlo,
    N_("Skip the Monte Carlo even when the design has spreads"), NULL },
  { "no-ascent", 0, 0, G_OPTION_ARG_NONE, &opt_no_ascent,
    N_("Do not simulate the ascent: the verdict is paper-only"), NULL },
  { NULL }
};

static void
clear_export_options (void)
{
  g_clear_pointer (&opt_pdf, g_free);
  g_clear_pointer (&opt_svg, g_free);
  g_clear_pointer (&opt_png, g_free);
  g_clear_pointer (&opt_csv, g_free);
  g_clear_pointer (&opt_paper, g_free);
}

int
sw_cli_export (int argc, char **argv)
{
  g_autoptr (SwAnalysis) b = NULL;
  g_autoptr (GError) error = NULL;
  SwAnalysisOptions o;
  SwPaper paper = SW_PAPER_A4;
  int code = SW_EXIT_OK;
  struct { char **path; SwSheetFormat format; } sheets[] = {
    { &opt_pdf, SW_SHEET_PDF }, { &opt_svg, SW_SHEET_SVG }, { &opt_png, SW_SHEET_PNG },
  };

  clear_export_options ();
  opt_threads = 0;
  opt_no_montecarlo = FALSE;
  opt_no_ascent = FALSE;
  if (!sw_cli_parse ("export", export_entries, &argc, &argv, 1, &code))
    goto out;
  if (opt_pdf == NULL && opt_svg == NULL && opt_png == NULL && opt_csv == NULL)
    {
      g_printerr (_("stagewright-cli export: give at least one of --pdf, --svg, --png or --csv "
                  "(see --help)\n"));
      code = SW_EXIT_USAGE;
      goto out;
    }
  if (opt_paper != NULL && !sw_paper_from_string (opt_paper, &paper))
    {
      g_printerr (_("stagewright-cli export: --paper must be a4 or letter, not '%s'\n"), opt_paper);
      code = SW_EXIT_USAGE;
      goto out;
    }
  if (opt_threads < 0 || opt_threads > 64)
    {
      g_printerr (_("stagewright-cli export: --threads must be 1 to 64 (0 = all cores)\n"));
      code = SW_EXIT_USAGE;
      goto out;
    }
  sw_analysis_options_init (&o);
  o.montecarlo = !opt_no_montecarlo;
  o.threads = (guint) opt_threads;
  o.ascent = !opt_no_ascent;
  if ((b = sw_cli_analyse (argv[1], &o, &code)) == NULL)
    goto out;

  for (guint i = 0; i < G_N_ELEMENTS (sheets); i++)
    {
      if (*sheets[i].path == NULL)
        continue;
      if (!sw_sheet_export (b, sheets[i].format, paper, *sheets[i].path, &error))
        {
          g_printerr (_("error: %s\n"), error->message);
          code = SW_EXIT_FAILURE;
          goto out;
        }
      g_print (_("wrote %s\n"), *sheets[i].path);
    }
  if (opt_csv != NULL)
    {
      g_autoptr (GPtrArray) written = g_ptr_array_new_with_free_func (g_free);
      if (!sw_csv_export (b, opt_csv, written, &error))
        {
          g_printerr (_("error: %s\n"), error->message);
          code = SW_EXIT_FAILURE;
          goto out;
        }
      for (guint i = 0; i < written->len; i++)
        g_print (_("wrote %s\n"), (const char *) written->pdata[i]);
    }

out:
  clear_export_options ();
  return code;
}
