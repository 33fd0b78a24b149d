/* SPDX-License-Identifier: GPL-3.0-or-later */
/* stagewright-cli stages and carpet: the staging decision against stage
 * count, and a carpet grid over two inputs. */
#define G_LOG_DOMAIN "stagewright-cli"

#include "config.h"

#include "sw-cli.h"

#include "sw-analysis.h"
#include "sw-carpet.h"
#include "sw-csv-staging.h"
#include "sw-economics.h"
#include "sw-format.h"
#include "sw-staging.h"

#include <glib/gi18n.h>
#include <math.h>
#include <stdio.h>
#include <string.h>

/* The honest label of every effort figure. */
#define EFFORT_NOTE N_("Effort in work-years from the published statistical cost-model form " \
                       "(coefficients from memory unless the design sets them): an estimate " \
                       "for comparing concepts, never a quote.")

/* ---- stages -------------------------------------------------------------- */

static gboolean opt_json;
static int opt_max_stages = SW_STAGING_MAX_STAGES;

static GOptionEntry stages_entries[] = {
  { "max-stages", 0, 0, G_OPTION_ARG_INT, &opt_max_stages,
    N_("Largest stage count in the table (1 to 6, default 6)"), "N" },
  { "json", 0, 0, G_OPTION_ARG_NONE, &opt_json, N_("Print JSON instead of a table"), NULL },
  { NULL }
};

static void
add_money (JsonBuilder *b, const SwStaging *s, const char *key, double work_years)
{
  sw_cli_add_number (b, key, s->has_money ? work_years * s->work_year_cost : NAN);
}

/* The design's economics keys in force (defaults filled in), nested as in
 * the file: every key of the object is shown. */
static JsonNode *
economics_node (const SwEconomics *e)
{
  g_autoptr (JsonObject) root = json_object_new ();
  JsonArray *types = json_array_new (), *developed = json_array_new ();

  for (guint k = 0; k < SW_N_ECON_NUMBERS; k++)
    {
      g_auto (GStrv) parts = g_strsplit (sw_economics_number_path (k), ".", 2);
      JsonObject *o = root;
      const char *key = parts[0];
      double v = sw_economics_get_number (e, k);

      if (parts[1] != NULL)
        {
          if (!json_object_has_member (root, parts[0]))
            json_object_set_object_member (root, parts[0], json_object_new ());
          o = json_object_get_object_member (root, parts[0]);
          key = parts[1];
        }
      if (isfinite (v) && sw_economics_number_is_whole (k))
        json_object_set_int_member (o, key, (gint64) v);
      else if (isfinite (v))
        json_object_set_double_member (o, key, v);
      else
        json_object_set_null_member (o, key);
    }
  if (e->currency[0] != '\0')
    json_object_set_string_member (root, "currency", e->currency);
  else
    json_object_set_null_member (root, "currency");
  json_object_set_string_member (json_object_get_object_member (root, "recovery"), "mode",
                                 sw_recovery_mode_to_string (e->recovery_mode));
  json_object_set_string_member (json_object_get_object_member (root, "recovery"),
                                 "booster_mode",
                                 sw_recovery_mode_to_string (e->booster_recovery_mode));
  for (guint i = 0; i < e->n_engine_types; i++)
    {
      JsonObject *t = json_object_new ();
      JsonArray *on = json_array_new ();
      json_object_set_string_member (t, "name", e->engine_types[i].name);
      json_object_set_double_member (t, "dry_mass_kg", e->engine_types[i].dry_mass_kg);
      for (guint k = 0; k < SW_MAX_STAGES; k++)
        if (e->engine_types[i].stage_mask & (1u << k))
          json_array_add_int_element (on, k);
      json_object_set_array_member (t, "on_stages", on);
      json_object_set_boolean_member (t, "developed", e->engine_types[i].developed);
      json_array_add_object_element (types, t);
    }
  json_object_set_array_member (root, "engine_types", types);
  for (guint k = 0; k < SW_MAX_STAGES; k++)
    if (e->developed_stages & (1u << k))
      json_array_add_int_element (developed, k);
  json_object_set_array_member (root, "developed_stages", developed);
  json_object_set_boolean_member (root, "developed_boosters", e->developed_boosters);
  {
    JsonNode *node = json_node_new (JSON_NODE_OBJECT);
    json_node_set_object (node, root);
    return node;
  }
}

static void
stages_json (const SwDesign *d, const SwStaging *s)
{
  g_autoptr (JsonBuilder) b = json_builder_new_immutable ();

  json_builder_begin_object (b);
  json_builder_set_member_name (b, "design");
  json_builder_add_string_value (b, d->name);
  json_builder_set_member_name (b, "design_stage_count");
  json_builder_add_int_value (b, s->design_stages);
  json_builder_set_member_name (b, "design_row");
  if (s->design_index >= 0)
    json_builder_add_int_value (b, s->design_row);
  else
    json_builder_add_null_value (b);
  json_builder_set_member_name (b, "design_row_arrangement");
  json_builder_add_string_value (b, sw_arrangement_to_string (s->design_arrangement));
  json_builder_set_member_name (b, "booster_count");
  json_builder_add_int_value (b, s->booster_count);
  json_builder_set_member_name (b, "boosters_note");
  json_builder_add_string_value (b, s->boosters_note);
  json_builder_set_member_name (b, "losses_note");
  json_builder_add_string_value (b, s->losses_note);
  sw_cli_add_number (b, "design_liftoff_mass_kg", s->design_liftoff_mass_kg);
  json_builder_set_member_name (b, "design_recovers_first_stage");
  json_builder_add_boolean_value (b, s->design_reuses);
  json_builder_set_member_name (b, "recovery_mode");
  json_builder_add_string_value (b, sw_recovery_mode_to_string (s->reuse_mode));
  {
    SwEconomics e = d->economics;
    e.recovery_mode = s->reuse_mode;
    sw_cli_add_number (b, "recovery_delta_v_m_s", sw_economics_recovery_delta_v (&e));
  }
  json_builder_set_member_name (b, "design_recovers_boosters");
  json_builder_add_boolean_value (b, s->booster_reuse_mode != SW_RECOVERY_NONE);
  json_builder_set_member_name (b, "booster_recovery_mode");
  json_builder_add_string_value (b, sw_recovery_mode_to_string (s->booster_reuse_mode));
  sw_cli_add_number (b, "booster_recovery_delta_v_m_s",
                     s->booster_reuse_mode != SW_RECOVERY_NONE
                       ? sw_economics_booster_recovery_delta_v (&d->economics) : 0.0);
  sw_cli_add_number (b, "work_year_cost", s->work_year_cost);
  json_builder_set_member_name (b, "currency");
  if (d->economics.currency[0] != '\0')
    json_builder_add_string_value (b, d->economics.currency);
  else
    json_builder_add_null_value (b);
  json_builder_set_member_name (b, "money_note");
  json_builder_add_string_value (b, sw_economics_money_note ());
  json_builder_set_member_name (b, "economics");
  json_builder_add_value (b, economics_node (&d->economics));
  json_builder_set_member_name (b, "effort_note");
  json_builder_add_string_value (b, _(EFFORT_NOTE));
  json_builder_set_member_name (b, "fixed_loads_note");
  json_builder_add_string_value (b, s->fixed_note);
  json_builder_set_member_name (b, "recovery_fixed_loads_note");
  json_builder_add_string_value (b, s->reuse_note);
  json_builder_set_member_name (b, "weighting");
  json_builder_begin_object (b);
  sw_cli_add_number (b, "liftoff_mass", s->weight_liftoff_mass);
  sw_cli_add_number (b, "development", s->weight_development);
  sw_cli_add_number (b, "cost_per_flight", s->weight_cost_per_flight);
  sw_cli_add_number (b, "failure", s->reliability_given ? s->weight_failure : NAN);
  json_builder_set_member_name (b, "statement");
  json_builder_add_string_value (b, s->weighting);
  json_builder_end_object (b);
  json_builder_set_member_name (b, "best_stage_count");
  if (s->best >= 0)
    json_builder_add_int_value (b, s->rows[s->best].n_stages);
  else
    json_builder_add_null_value (b);
  json_builder_set_member_name (b, "best_arrangement");
  if (s->best >= 0)
    json_builder_add_string_value (b, sw_arrangement_to_string (s->rows[s->best].arrangement));
  else
    json_builder_add_null_value (b);
  json_builder_set_member_name (b, "by_stage_count");
  json_builder_begin_array (b);
  for (guint i = 0; i < s->n_rows; i++)
    {
      const SwStagingRow *r = &s->rows[i];

      json_builder_begin_object (b);
      json_builder_set_member_name (b, "stage_count");
      json_builder_add_int_value (b, r->n_stages);
      json_builder_set_member_name (b, "arrangement");
      json_builder_add_string_value (b, sw_arrangement_to_string (r->arrangement));
      json_builder_set_member_name (b, "this_design");
      json_builder_add_boolean_value (b, (int) i == s->design_index);
      json_builder_set_member_name (b, "closes");
      json_builder_add_boolean_value (b, r->feasible);
      json_builder_set_member_name (b, "closes_recovered");
      json_builder_add_boolean_value (b, r->reused_feasible);
      json_builder_set_member_name (b, "boosters_optimised_away");
      json_builder_add_boolean_value (b, r->boosters_optimised_away);
      json_builder_set_member_name (b, "why_not");
      if (r->feasible)
        json_builder_add_null_value (b);
      else
        json_builder_add_string_value (b, r->reason);
      json_builder_set_member_name (b, "why_not_recovered");
      if (r->reused_feasible || !r->feasible)
        json_builder_add_null_value (b);
      else
        json_builder_add_string_value (b, r->reused_reason);
      sw_cli_add_number (b, "liftoff_mass_kg", r->liftoff_mass_kg);
      sw_cli_add_number (b, "liftoff_mass_recovered_kg", r->liftoff_mass_reused_kg);
      sw_cli_add_number (b, "recovery_payload_penalty", r->payload_penalty_fraction);
      sw_cli_add_number (b, "recovery_propellant_kg", r->recovery_propellant_kg);
      sw_cli_add_number (b, "booster_recovery_propellant_kg", r->booster_recovery_propellant_kg);
      sw_cli_add_number (b, "development_work_years", r->development_work_years);
      sw_cli_add_number (b, "development_recovered_work_years", r->development_reused_work_years);
      sw_cli_add_number (b, "per_flight_work_years", r->cost_per_flight_work_years);
      sw_cli_add_number (b, "per_flight_recovered_work_years",
                         r->cost_per_flight_reused_work_years);
      add_money (b, s, "development_money", r->development_work_years);
      add_money (b, s, "per_flight_money", r->cost_per_flight_work_years);
      add_money (b, s, "per_flight_recovered_money", r->cost_per_flight_reused_work_years);
      sw_cli_add_number (b, "mission_success", r->success_probability);
      sw_cli_add_number (b, "payload_at_design_liftoff_mass_kg", r->payload_fixed_size_kg);
      sw_cli_add_number (b, "weighted_score", r->score);
      sw_cli_add_number (b, "liftoff_thrust_to_weight", r->liftoff_thrust_to_weight);
      json_builder_end_object (b);
    }
  json_builder_end_array (b);
  sw_cli_finish_json (b);
}

/* @text right-aligned in @width characters (not bytes: the formatter's
 * em dash and minus are several bytes); takes ownership of @text. */
static char *
cell (char *text, guint width)
{
  glong n = g_utf8_strlen (text, -1);
  char *out;

  if (n >= (glong) width)
    return text;
  out = g_strdup_printf ("%*s%s", (int) (width - n), "", text);
  g_free (text);
  return out;
}

static void
stages_table (const SwDesign *d, const SwStaging *s)
{
  SwEconomics e = d->economics;
  g_autofree char *dvrec = NULL;

  e.recovery_mode = s->reuse_mode;
  dvrec = sw_format_speed (sw_economics_recovery_delta_v (&e));
  g_print (_("Design: %s (%u stages)\n"), d->name, s->design_stages);
  if (s->reuse_mode == SW_RECOVERY_NONE)
    g_print (_("Recovered column: first stage expended\n"));
  else
    g_print (_("Recovered column: first stage %s, recovery delta-v %s%s\n"),
             s->reuse_mode == SW_RECOVERY_LAUNCH_SITE ? _("returns to the launch site")
                                                      : _("lands downrange"),
             dvrec, s->design_reuses ? "" : _(" (the design itself is expendable)"));
  if (s->booster_reuse_mode != SW_RECOVERY_NONE)
    {
      g_autofree char *bdv = sw_format_speed (sw_economics_booster_recovery_delta_v (
                                                &d->economics));
      /* Translators: %s how the boosters land, %s a speed */
      g_print (_("Recovered column, rows with boosters: the boosters %s, recovery delta-v %s "
                 "each\n"),
               s->booster_reuse_mode == SW_RECOVERY_LAUNCH_SITE
                 ? _("return to the launch site") : _("land downrange"),
               bdv);
    }
  g_print ("%s\n\n", _(EFFORT_NOTE));
  g_print ("%-3s %-2s %12s %12s %8s %11s %11s %10s %10s %9s %12s %7s\n", "", _("N"),
           _("liftoff"), _("recovered"), _("penalty"), _("develop wy"), _("dev rec wy"),
           _("flight wy"), _("fl rec wy"), _("success"), _("payload@m0"), _("score"));
  for (guint i = 0; i < s->n_rows; i++)
    {
      const SwStagingRow *r = &s->rows[i];
      g_autofree char *m = cell (sw_format_mass (r->liftoff_mass_kg), 12);
      g_autofree char *mr = cell (sw_format_mass (r->liftoff_mass_reused_kg), 12);
      g_autofree char *pen = cell (sw_format_percent (r->payload_penalty_fraction, 1), 8);
      g_autofree char *dev = cell (sw_format_number (r->development_work_years, 0), 11);
      g_autofree char *devr = cell (sw_format_number (r->development_reused_work_years, 0), 11);
      g_autofree char *cpf = cell (sw_format_number (r->cost_per_flight_work_years, 0), 10);
      g_autofree char *cpfr = cell (sw_format_number (r->cost_per_flight_reused_work_years, 0),
                                    10);
      g_autofree char *rel = cell (sw_format_probability (r->success_probability), 9);
      g_autofree char *pay = cell (sw_format_mass (r->payload_fixed_size_kg), 12);
      g_autofree char *score = cell (sw_format_number (r->score, 2), 7);
      char mark[4] = "   ";

      if ((int) i == s->best)
        mark[0] = '*';
      if ((int) i == s->design_index)
        mark[1] = '>';
      if (s->booster_count > 0 && (i == 0 || i == s->n_counts))
        {
          /* Translators: %u is the number of strap-on boosters */
          g_autofree char *with = g_strdup_printf (g_dngettext (GETTEXT_PACKAGE,
                                                                "With this design's %u "
                                                                "strap-on booster:",
                                                                "With this design's %u "
                                                                "strap-on boosters:",
                                                                s->booster_count),
                                                   s->booster_count);
          g_print ("%s\n", i == 0 ? _("Serial stages, no boosters:") : with);
        }
      g_print ("%-3s %-2u %s %s %s %s %s %s %s %s %s %s\n", mark, r->n_stages,
               m, mr, pen, dev, devr, cpf, cpfr, rel, pay, score);
    }
  g_print ("\n");
  if (s->booster_count > 0)
    g_print (_("* best row   > this design (with its boosters)   wy: work-years\n"));
  else
    g_print (_("* best stage count   > this design's stage count   wy: work-years\n"));
  if (s->boosters_note[0] != '\0')
    g_print ("%s\n", s->boosters_note);
  g_print ("%s\n", s->weighting);
  if (s->has_money && s->best >= 0)
    {
      const SwStagingRow *r = &s->rows[s->best];
      g_autofree char *dev = sw_format_money (r->development_work_years * s->work_year_cost);
      g_autofree char *cpf = sw_format_money ((s->design_reuses
                                                  ? r->cost_per_flight_reused_work_years
                                                  : r->cost_per_flight_work_years)
                                                 * s->work_year_cost);
      g_autofree char *wy = sw_format_number (s->work_year_cost, 0);
      const char *cur = sw_economics_currency_label (&d->economics);

      g_print (_("At %s %s per work-year, the best count: development %s %s, per flight %s "
                 "%s\n"),
               wy, cur, dev, cur, cpf, cur);
      g_print ("%s\n", sw_economics_money_note ());
    }
  {
    g_autofree char *unrecovered = sw_staging_dup_unrecovered_note (s);
    if (unrecovered != NULL)
      g_print ("%s\n", unrecovered);
  }
  if (!s->reliability_given)
    g_print (_("No stage has reliability keys: the failure criterion is left out.\n"));
  g_print (_("Stage counts above the design's repeat its top stage.\n"));
  if (s->fixed_note[0] != '\0')
    g_print ("%s%s%s\n", s->fixed_note, s->reuse_note[0] != '\0' ? " " : "", s->reuse_note);
  if (s->losses_note[0] != '\0')
    g_print ("%s\n", s->losses_note);
  g_print ("\n%s\n", sw_format_cautions ());
}

int
sw_cli_stages (int argc, char **argv)
{
  g_autoptr (SwDesign) d = NULL;
  g_autoptr (GError) error = NULL;
  SwStaging s;
  int code;

  opt_json = FALSE;
  opt_max_stages = SW_STAGING_MAX_STAGES;
  if (!sw_cli_parse ("stages", stages_entries, &argc, &argv, 1, &code))
    return code;
  if (opt_max_stages < 1 || opt_max_stages > SW_STAGING_MAX_STAGES)
    {
      g_printerr (_("stagewright-cli stages: --max-stages %d: give 1 to %d\n"), opt_max_stages,
                  SW_STAGING_MAX_STAGES);
      return SW_EXIT_USAGE;
    }
  if ((d = sw_cli_load (argv[1])) == NULL)
    return SW_EXIT_USAGE;
  if (d->mission.kind == SW_MISSION_ORBIT && d->mission.loss_model == SW_LOSS_SIMULATE)
    {
      /* The closed loop sizes such a design, as in size and the window:
       * the table takes its losses (its own row is then size's vehicle). */
      SwAnalysisOptions o;
      g_autoptr (SwAnalysis) a = NULL;

      sw_analysis_options_init (&o);
      o.montecarlo = FALSE;
      o.ascent = TRUE;
      a = sw_analysis_run (d, &o, NULL);
      if (a->ok ? !sw_analysis_staging (a, (guint) opt_max_stages, &s, &error)
                : !sw_staging_compute (d, (guint) opt_max_stages, &s, &error))
        return sw_cli_input_error (argv[1], error);
    }
  else if (!sw_staging_compute (d, (guint) opt_max_stages, &s, &error))
    return sw_cli_input_error (argv[1], error);
  if (opt_json)
    stages_json (d, &s);
  else
    stages_table (d, &s);
  return SW_EXIT_OK;
}

/* ---- carpet -------------------------------------------------------------- */

static char *opt_x, *opt_y, *opt_output;
static gboolean opt_csv;

static GOptionEntry carpet_entries[] = {
  { "x", 0, 0, G_OPTION_ARG_STRING, &opt_x,
    N_("The x axis: parameter, range and point count"), "PARAM:MIN:MAX:N" },
  { "y", 0, 0, G_OPTION_ARG_STRING, &opt_y,
    N_("The y axis: parameter, range and point count"), "PARAM:MIN:MAX:N" },
  { "output", 0, 0, G_OPTION_ARG_STRING, &opt_output,
    N_("liftoff_mass (default), payload, development or cost_per_flight"), "WHAT" },
  { "json", 0, 0, G_OPTION_ARG_NONE, &opt_json, N_("Print JSON"), NULL },
  { "csv", 0, 0, G_OPTION_ARG_NONE, &opt_csv, N_("Print CSV, one line per grid point"), NULL },
  { NULL }
};

static const char *
output_unit (SwCarpetOutput o)
{
  return o == SW_CARPET_DEVELOPMENT || o == SW_CARPET_COST_PER_FLIGHT ? "work-years" : "kg";
}

static void
carpet_axis_json (JsonBuilder *b, const char *key, const SwCarpetAxis *a)
{
  g_autofree char *name = sw_carpet_param_dup_name (a);

  json_builder_set_member_name (b, key);
  json_builder_begin_object (b);
  json_builder_set_member_name (b, "parameter");
  json_builder_add_string_value (b, name);
  json_builder_set_member_name (b, "values");
  json_builder_begin_array (b);
  for (guint i = 0; i < a->n; i++)
    json_builder_add_double_value (b, sw_carpet_axis_value (a, i));
  json_builder_end_array (b);
  json_builder_end_object (b);
}

/* One array per y value of @values (the grid of @c), x increasing; null
 * where the vehicle does not close. */
static void
add_grid (JsonBuilder *b, const SwCarpet *c, const double *values)
{
  json_builder_begin_array (b);
  for (guint j = 0; j < c->y.n; j++)
    {
      json_builder_begin_array (b);
      for (guint i = 0; i < c->x.n; i++)
        {
          double v = values[j * c->x.n + i];
          if (isfinite (v))
            json_builder_add_double_value (b, v);
          else
            json_builder_add_null_value (b);
        }
      json_builder_end_array (b);
    }
  json_builder_end_array (b);
}

static void
carpet_json (const SwDesign *d, const SwCarpet *c)
{
  g_autoptr (JsonBuilder) b = json_builder_new_immutable ();

  json_builder_begin_object (b);
  json_builder_set_member_name (b, "design");
  json_builder_add_string_value (b, d->name);
  json_builder_set_member_name (b, "quantity");
  json_builder_add_string_value (b, sw_carpet_output_to_string (c->output));
  json_builder_set_member_name (b, "unit");
  json_builder_add_string_value (b, output_unit (c->output));
  carpet_axis_json (b, "x", &c->x);
  carpet_axis_json (b, "y", &c->y);
  json_builder_set_member_name (b, "this_design");
  json_builder_begin_object (b);
  sw_cli_add_number (b, "x", c->design_x);
  sw_cli_add_number (b, "y", c->design_y);
  sw_cli_add_number (b, "value", c->design_value);
  sw_cli_add_number (b, "money", c->design_money);
  json_builder_end_object (b);
  json_builder_set_member_name (b, "points_not_closing");
  json_builder_add_int_value (b, c->n_infeasible);
  json_builder_set_member_name (b, "note");
  json_builder_add_string_value (b, c->note);
  /* One array per y value, x increasing; null where the vehicle does not close. */
  json_builder_set_member_name (b, "rows");
  add_grid (b, c, c->values);
  /* A cost output with a cost per work-year: the same grid in money (the
   * design's currency, or null without one); null otherwise. */
  sw_cli_add_number (b, "work_year_cost", c->work_year_cost);
  json_builder_set_member_name (b, "currency");
  if (c->currency[0] != '\0')
    json_builder_add_string_value (b, c->currency);
  else
    json_builder_add_null_value (b);
  json_builder_set_member_name (b, "money_rows");
  if (c->has_money)
    {
      add_grid (b, c, c->money);
      json_builder_set_member_name (b, "money_note");
      json_builder_add_string_value (b, sw_economics_money_note ());
    }
  else
    json_builder_add_null_value (b);
  if (c->output == SW_CARPET_DEVELOPMENT || c->output == SW_CARPET_COST_PER_FLIGHT)
    {
      json_builder_set_member_name (b, "effort_note");
      json_builder_add_string_value (b, _(EFFORT_NOTE));
    }
  sw_cli_finish_json (b);
}

static void
carpet_csv (const SwCarpet *c)
{
  /* The export's writer: the cautions as a comment line, then the points. */
  g_autofree char *text = sw_csv_carpet_text (c);

  g_print ("%s", text);
}

static void
carpet_table (const SwDesign *d, const SwCarpet *c)
{
  g_autofree char *xn = sw_carpet_param_dup_name (&c->x);
  g_autofree char *yn = sw_carpet_param_dup_name (&c->y);
  g_autofree char *dv = sw_format_number (c->design_value, 0);

  g_print (_("Design: %s\n"), d->name);
  g_print (_("%s (%s) over %s (columns) and %s (rows); — where the vehicle does not close\n"),
           sw_carpet_output_to_string (c->output), output_unit (c->output), xn, yn);
  g_print (_("This design: %s = %g, %s = %g, value %s\n\n"), xn, c->design_x, yn, c->design_y,
           dv);
  g_print ("%12s", "");
  for (guint i = 0; i < c->x.n; i++)
    g_print (" %12.6g", sw_carpet_axis_value (&c->x, i));
  g_print ("\n");
  for (guint j = 0; j < c->y.n; j++)
    {
      g_print ("%12.6g", sw_carpet_axis_value (&c->y, j));
      for (guint i = 0; i < c->x.n; i++)
        {
          g_autofree char *v = cell (sw_format_number (c->values[j * c->x.n + i], 0), 12);
          g_print (" %s", v);
        }
      g_print ("\n");
    }
  if (c->has_money)
    {
      g_autofree char *wy = sw_format_number (c->work_year_cost, 0);
      g_autofree char *dm = sw_format_money (c->design_money);
      const char *cur = c->currency[0] != '\0' ? c->currency : _("money units");

      /* Translators: %s a cost of a work-year, %s a currency, %s a cost, %s the currency */
      g_print (_("\nIn money at %s %s per work-year (this design: %s %s):\n"), wy, cur, dm, cur);
      g_print ("%12s", "");
      for (guint i = 0; i < c->x.n; i++)
        g_print (" %16.6g", sw_carpet_axis_value (&c->x, i));
      g_print ("\n");
      for (guint j = 0; j < c->y.n; j++)
        {
          g_print ("%12.6g", sw_carpet_axis_value (&c->y, j));
          for (guint i = 0; i < c->x.n; i++)
            {
              g_autofree char *v = cell (sw_format_money (c->money[j * c->x.n + i]), 16);
              g_print (" %s", v);
            }
          g_print ("\n");
        }
      g_print ("%s\n", sw_economics_money_note ());
    }
  if (c->output == SW_CARPET_DEVELOPMENT || c->output == SW_CARPET_COST_PER_FLIGHT)
    g_print ("\n%s\n", _(EFFORT_NOTE));
  if (c->note[0] != '\0')
    g_print ("\n%s\n", c->note);
  g_print ("\n%s\n", sw_format_cautions ());
}

int
sw_cli_carpet (int argc, char **argv)
{
  g_autoptr (SwDesign) d = NULL;
  g_autoptr (GError) error = NULL;
  g_autoptr (SwCarpet) c = NULL;
  SwCarpetOptions o = { 0 };
  int code;

  opt_json = opt_csv = FALSE;
  g_clear_pointer (&opt_x, g_free);
  g_clear_pointer (&opt_y, g_free);
  g_clear_pointer (&opt_output, g_free);
  if (!sw_cli_parse ("carpet", carpet_entries, &argc, &argv, 1, &code))
    return code;
  if (opt_json && opt_csv)
    {
      g_printerr (_("stagewright-cli carpet: give --json or --csv, not both\n"));
      return SW_EXIT_USAGE;
    }
  o.output = SW_CARPET_LIFTOFF_MASS;
  if (opt_output != NULL && !sw_carpet_output_from_string (opt_output, &o.output))
    {
      g_printerr (_("stagewright-cli carpet: --output %s: use liftoff_mass, payload, "
                    "development or cost_per_flight\n"),
                  opt_output);
      return SW_EXIT_USAGE;
    }
  if ((d = sw_cli_load (argv[1])) == NULL)
    return SW_EXIT_USAGE;
  if (!sw_carpet_axis_parse ("--x", opt_x, d, &o.x, &error)
      || !sw_carpet_axis_parse ("--y", opt_y, d, &o.y, &error))
    {
      g_printerr (_("stagewright-cli carpet: %s: %s\n"), argv[1], error->message);
      return SW_EXIT_USAGE;
    }
  if (d->mission.kind == SW_MISSION_ORBIT && d->mission.loss_model == SW_LOSS_SIMULATE)
    {
      /* The closed loop sizes such a design, as in size, stages and the
       * window: every point takes its losses (this design's point is then
       * size's vehicle). */
      SwAnalysisOptions ao;
      g_autoptr (SwAnalysis) a = NULL;

      sw_analysis_options_init (&ao);
      ao.montecarlo = FALSE;
      ao.ascent = TRUE;
      a = sw_analysis_run (d, &ao, NULL);
      c = a->ok ? sw_analysis_carpet (a, &o, &error) : sw_carpet_compute (d, &o, &error);
    }
  else
    c = sw_carpet_compute (d, &o, &error);
  if (c == NULL)
    {
      g_printerr (_("stagewright-cli carpet: %s: %s\n"), argv[1], error->message);
      return SW_EXIT_USAGE;
    }
  g_clear_pointer (&opt_x, g_free);
  g_clear_pointer (&opt_y, g_free);
  g_clear_pointer (&opt_output, g_free);
  if (opt_json)
    carpet_json (d, c);
  else if (opt_csv)
    carpet_csv (c);
  else
    carpet_table (d, c);
  return SW_EXIT_OK;
}

/* ---- benchmark ----------------------------------------------------------- */

double
sw_cli_bench_carpet_ms (const SwDesign *design)
{
  SwCarpetOptions o = { 0 };
  double times[9];

  /* 50 x 50 optimal sizings over the first stage's structural coefficient
   * and the top stage's vacuum Isp. */
  o.x.kind = SW_CARPET_PARAM_STRUCTURAL_COEFFICIENT;
  o.x.stage = 0;
  o.x.min = 0.04;
  o.x.max = 0.14;
  o.x.n = 50;
  o.y.kind = SW_CARPET_PARAM_ISP_VAC;
  o.y.stage = design->n_stages - 1;
  o.y.min = MAX (300.0, design->stages[design->n_stages - 1].isp_sl_s);
  o.y.max = 460.0;
  o.y.n = 50;
  o.output = SW_CARPET_LIFTOFF_MASS;
  for (guint r = 0; r < G_N_ELEMENTS (times); r++)
    {
      gint64 t0 = g_get_monotonic_time ();
      SwCarpet *c = sw_carpet_compute (design, &o, NULL);
      times[r] = (g_get_monotonic_time () - t0) / 1000.0;
      if (c == NULL)
        return NAN;
      sw_carpet_free (c);
    }
  /* The median of nine. */
  for (guint i = 1; i < G_N_ELEMENTS (times); i++)
    for (guint k = i; k > 0 && times[k - 1] > times[k]; k--)
      {
        double t = times[k];
        times[k] = times[k - 1];
        times[k - 1] = t;
      }
  return times[G_N_ELEMENTS (times) / 2];
}
