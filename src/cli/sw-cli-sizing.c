/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The sizing subcommands: size, curve, budget, limits.  Each reads one
 * SwAnalysis of the design. */
#include "config.h"

#include "sw-cli.h"

#include "sw-format.h"
#include "sw-limits.h"
#include "sw-phases.h"

#include <glib/gi18n.h>
#include <math.h>

static gboolean opt_json;
static gboolean opt_no_ascent;
static double opt_min_tw, opt_max_q_kpa, opt_max_g;
static int opt_max_stages = SW_MAX_STAGES;

static GOptionEntry json_entries[] = {
  { "json", 0, 0, G_OPTION_ARG_NONE, &opt_json, N_("Print JSON for machines"), NULL },
  { NULL }
};

static GOptionEntry size_entries[] = {
  { "json", 0, 0, G_OPTION_ARG_NONE, &opt_json, N_("Print JSON for machines"), NULL },
  { "no-ascent", 0, 0, G_OPTION_ARG_NONE, &opt_no_ascent,
    N_("Do not simulate the ascent (nor close the loss loop): the verdict is paper-only"),
    NULL },
  { "min-thrust-to-weight", 0, 0, G_OPTION_ARG_DOUBLE, &opt_min_tw,
    N_("Lowest liftoff thrust-to-weight for the verdict (0.5 to 5, default 1.2)"), "R" },
  { "max-q-kpa", 0, 0, G_OPTION_ARG_DOUBLE, &opt_max_q_kpa,
    N_("Highest dynamic pressure for the verdict (5 to 200 kPa, default 45)"), "KPA" },
  { "max-g", 0, 0, G_OPTION_ARG_DOUBLE, &opt_max_g,
    N_("Highest axial acceleration for the verdict (1 to 20 g, default 6)"), "G" },
  { NULL }
};

static GOptionEntry curve_entries[] = {
  { "json", 0, 0, G_OPTION_ARG_NONE, &opt_json, N_("Print JSON for machines"), NULL },
  { "max-stages", 0, 0, G_OPTION_ARG_INT, &opt_max_stages, N_("Largest stage count (1 to 8)"),
    "N" },
  { NULL }
};

/* The options of a command that needs neither the Monte Carlo nor the ascent. */
static void
fast_options (SwAnalysisOptions *o)
{
  sw_analysis_options_init (o);
  o->montecarlo = FALSE;
  o->ascent = FALSE;
}

/* The design's recovery keys in force ("recovery"): the first stage's and
 * the boosters' mode and recovery delta-v (the mode's default when the
 * file gives none; 0 when expended).  The figures are `stages`'. */
static void
add_recovery (JsonBuilder *b, const SwDesign *d)
{
  const SwEconomics *e = &d->economics;

  json_builder_set_member_name (b, "recovery");
  json_builder_begin_object (b);
  json_builder_set_member_name (b, "mode");
  json_builder_add_string_value (b, sw_recovery_mode_to_string (e->recovery_mode));
  sw_cli_add_number (b, "recovery_delta_v_m_s", sw_economics_recovery_delta_v (e));
  json_builder_set_member_name (b, "booster_mode");
  json_builder_add_string_value (b, sw_recovery_mode_to_string (e->booster_recovery_mode));
  sw_cli_add_number (b, "booster_recovery_delta_v_m_s", sw_economics_booster_recovery_delta_v (e));
  sw_cli_add_number (b, "landing_hardware_fraction", e->landing_hardware_fraction);
  sw_cli_add_number (b, "refurbishment_fraction", e->refurbishment_fraction);
  json_builder_set_member_name (b, "flights_per_stage");
  json_builder_add_int_value (b, e->flights_per_stage);
  json_builder_end_object (b);
}

/* The "phases" array of @s. */
static void
add_phases (JsonBuilder *b, const SwDesign *d, const SwSizing *s)
{
  SwPhase phases[SW_MAX_PHASES];
  guint n_phases = sw_sizing_phases (d, s, phases);

  json_builder_set_member_name (b, "phases");
  json_builder_begin_array (b);
  for (guint k = 0; k < n_phases; k++)
    {
      g_autofree char *name = sw_phase_dup_name (d, &phases[k]);
      json_builder_begin_object (b);
      json_builder_set_member_name (b, "name");
      json_builder_add_string_value (b, name);
      json_builder_set_member_name (b, "boosters");
      json_builder_add_boolean_value (b, phases[k].boosters);
      sw_cli_add_number (b, "delta_v_m_s", phases[k].delta_v_m_s);
      sw_cli_add_number (b, "exhaust_velocity_m_s", phases[k].exhaust_velocity_m_s);
      sw_cli_add_number (b, "initial_mass_kg", phases[k].initial_mass_kg);
      sw_cli_add_number (b, "final_mass_kg", phases[k].final_mass_kg);
      sw_cli_add_number (b, "fairing_drop_mass_kg", phases[k].fairing_drop_mass_kg);
      sw_cli_add_number (b, "duration_s", phases[k].duration_s);
      json_builder_end_object (b);
    }
  json_builder_end_array (b);
}

static void
add_string_or_null (JsonBuilder *b, const char *key, const char *value)
{
  json_builder_set_member_name (b, key);
  if (value != NULL && value[0] != '\0')
    json_builder_add_string_value (b, value);
  else
    json_builder_add_null_value (b);
}

/* "vehicle_shape": the height of the whole vehicle, or why there is none. */
static void
add_vehicle_shape (JsonBuilder *b, const SwVehicleShape *v)
{
  json_builder_set_member_name (b, "vehicle_shape");
  json_builder_begin_object (b);
  json_builder_set_member_name (b, "complete");
  json_builder_add_boolean_value (b, v->complete);
  add_string_or_null (b, "reason", v->complete ? NULL : v->reason);
  sw_cli_add_number (b, "height_m", v->height_m);
  sw_cli_add_number (b, "max_diameter_m", v->max_diameter_m);
  sw_cli_add_number (b, "width_m", v->width_m);
  sw_cli_add_number (b, "fairing_diameter_m", v->fairing_diameter_m);
  sw_cli_add_number (b, "fairing_length_m", v->fairing_length_m);
  json_builder_end_object (b);
}

/* One stage's or booster's estimate: its figures and the items. */
static void
add_one_estimate (JsonBuilder *b, const char *name, const SwMassEstimate *m,
                  const SwStageEstimate *e)
{
  gboolean shown = m->ok && e->estimated;

  json_builder_begin_object (b);
  json_builder_set_member_name (b, "name");
  json_builder_add_string_value (b, name);
  json_builder_set_member_name (b, "estimated");
  json_builder_add_boolean_value (b, shown);
  add_string_or_null (b, "reason", e->estimated ? NULL : e->reason);
  sw_cli_add_number (b, "structural_coefficient", shown ? e->structural_coefficient : NAN);
  sw_cli_add_number (b, "design_structural_coefficient", e->design_coefficient);
  sw_cli_add_number (b, "structural_mass_kg", shown ? e->structural_mass_kg : NAN);
  sw_cli_add_number (b, "propellant_mass_kg", shown ? e->propellant_mass_kg : NAN);
  sw_cli_add_number (b, "thrust_n", shown ? e->thrust_n : NAN);
  json_builder_set_member_name (b, "thrust_assumed");
  json_builder_add_boolean_value (b, e->thrust_assumed);
  sw_cli_add_number (b, "area_ratio", shown ? e->area_ratio : NAN);
  json_builder_set_member_name (b, "items_kg");
  json_builder_begin_object (b);
  for (guint k = 0; k < SW_N_MER; k++)
    sw_cli_add_number (b, sw_mer_item_key (k), shown ? e->item_kg[k] : NAN);
  json_builder_end_object (b);
}

/* "eps_estimate": the structural coefficients of the mass-estimating
 * relationships at their fixed point with the sizing; with boosters a
 * "boosters" object (per booster, its count beside), else null. */
static void
add_eps_estimate (JsonBuilder *b, const SwDesign *d, const SwMassEstimate *m)
{
  json_builder_set_member_name (b, "eps_estimate");
  json_builder_begin_object (b);
  json_builder_set_member_name (b, "converged");
  json_builder_add_boolean_value (b, m->ok);
  add_string_or_null (b, "reason", m->ok ? NULL : m->reason);
  json_builder_set_member_name (b, "iterations");
  json_builder_add_int_value (b, m->iterations);
  sw_cli_add_number (b, "liftoff_mass_kg", m->ok ? m->liftoff_mass_kg : NAN);
  json_builder_set_member_name (b, "stages");
  json_builder_begin_array (b);
  for (guint i = 0; i < m->n_stages && i < d->n_stages; i++)
    {
      add_one_estimate (b, d->stages[i].name, m, &m->stages[i]);
      json_builder_end_object (b);
    }
  json_builder_end_array (b);
  json_builder_set_member_name (b, "boosters");
  if (m->has_boosters)
    {
      add_one_estimate (b, d->boosters.name, m, &m->boosters);
      json_builder_set_member_name (b, "count");
      json_builder_add_int_value (b, d->boosters.count);
      sw_cli_add_number (b, "nose_cone_side_area_m2",
                         m->ok && m->boosters.estimated ? m->boosters.nose_area_m2 : NAN);
      sw_cli_add_number (b, "diameter_m",
                         m->ok && m->boosters.estimated ? m->boosters.diameter_m : NAN);
      json_builder_end_object (b);
    }
  else
    json_builder_add_null_value (b);
  json_builder_set_member_name (b, "sources");
  json_builder_begin_object (b);
  for (guint k = 0; k < SW_N_MER; k++)
    {
      json_builder_set_member_name (b, sw_mer_item_key (k));
      json_builder_add_string_value (b, sw_mer_item_source (k));
    }
  json_builder_end_object (b);
  json_builder_end_object (b);
}

/* The "boosters" object of @s (nothing without boosters). */

/* A stage's or the boosters' propellant keys as in force: the propellant's
 * name (null without one), the mixture ratio (null for a solid), the ullage
 * fraction and the bulk densities (a liquid's two, a solid's one), the
 * catalogue's or the user's own (propellant_custom). */
static void
add_propellant_keys (JsonBuilder *b, const SwStagePropellant *p)
{
  const SwPropellantInfo *info = sw_propellant_info (p->kind);
  double ox, fu, mr;
  gboolean solid;

  json_builder_set_member_name (b, "propellant");
  if (p->kind == SW_PROPELLANT_CUSTOM)
    json_builder_add_string_value (b, p->custom_name);
  else if (info != NULL)
    json_builder_add_string_value (b, info->key);
  else
    json_builder_add_null_value (b);
  if (p->kind == SW_PROPELLANT_NONE)
    return;
  sw_propellant_effective (p, &ox, &fu, &mr, &solid);
  sw_cli_add_number (b, "mixture_ratio", solid ? NAN : mr);
  sw_cli_add_number (b, "ullage_fraction", sw_propellant_ullage (p));
  sw_cli_add_number (b, "oxidizer_density_kg_m3", solid ? NAN : ox);
  sw_cli_add_number (b, "fuel_density_kg_m3", solid ? NAN : fu);
  sw_cli_add_number (b, "solid_density_kg_m3", solid ? ox : NAN);
  json_builder_set_member_name (b, "propellant_custom");
  json_builder_add_boolean_value (b, p->kind == SW_PROPELLANT_CUSTOM);
}

static void
add_boosters (JsonBuilder *b, const SwDesign *d, const SwSizing *s)
{
  const SwBoosterResult *r = &s->boosters;

  if (!r->present)
    return;
  json_builder_set_member_name (b, "boosters");
  json_builder_begin_object (b);
  json_builder_set_member_name (b, "name");
  json_builder_add_string_value (b, d->boosters.name);
  json_builder_set_member_name (b, "count");
  json_builder_add_int_value (b, r->count);
  json_builder_set_member_name (b, "fixed");
  json_builder_add_boolean_value (b, r->fixed);
  json_builder_set_member_name (b, "crossfeed");
  json_builder_add_boolean_value (b, r->crossfeed);
  sw_cli_add_number (b, "isp_vac_s", d->boosters.isp_vac_s);
  sw_cli_add_number (b, "isp_sl_s", d->boosters.has_isp_sl ? d->boosters.isp_sl_s : NAN);
  sw_cli_add_number (b, "structural_coefficient", d->boosters.structural_coefficient);
  sw_cli_add_number (b, "thrust_vac_kn", r->thrust_vac_n / 1000.0);
  sw_cli_add_number (b, "propellant_mass_kg", r->propellant_mass_kg);
  sw_cli_add_number (b, "structural_mass_kg", r->structural_mass_kg);
  sw_cli_add_number (b, "booster_mass_kg", r->booster_mass_kg);
  sw_cli_add_number (b, "total_mass_kg", r->total_mass_kg);
  sw_cli_add_number (b, "burn_time_s", r->phase_duration_s);
  sw_cli_add_number (b, "mixed_exhaust_velocity_m_s", r->mixed_exhaust_velocity_m_s);
  sw_cli_add_number (b, "core_propellant_in_phase_0_kg", r->core_propellant_in_phase_kg);
  sw_cli_add_number (b, "diameter_m", d->boosters.has_diameter ? d->boosters.diameter_m : NAN);
  add_propellant_keys (b, &d->boosters.propellant);
  if (d->boosters.propellant.kind != SW_PROPELLANT_NONE)
    {
      SwStageShape shape;

      sw_sizing_booster_shape (d, s, &shape);
      sw_cli_add_number (b, "propellant_volume_m3", shape.propellant_volume_m3);
      sw_cli_add_number (b, "tank_volume_m3", shape.tank_volume_m3);
      sw_cli_add_number (b, "length_m", shape.has_length ? shape.length_m : NAN);
    }
  json_builder_end_object (b);
}

static JsonNode *
sizing_to_json (const SwAnalysis *a)
{
  const SwDesign *d = a->design;
  const SwSizing *s = &a->sizing;
  g_autoptr (JsonBuilder) b = json_builder_new_immutable ();

  json_builder_begin_object (b);
  json_builder_set_member_name (b, "name");
  json_builder_add_string_value (b, d->name);
  sw_cli_add_verdict (b, a);
  json_builder_set_member_name (b, "feasible");
  json_builder_add_boolean_value (b, s->feasible);
  json_builder_set_member_name (b, "reason");
  json_builder_add_string_value (b, s->reason);
  json_builder_set_member_name (b, "split");
  json_builder_add_string_value (b, sw_split_mode_to_string (s->split));
  json_builder_set_member_name (b, "sized_with_simulated_losses");
  json_builder_add_boolean_value (b, a->sized_by_ascent);
  sw_cli_add_number (b, "liftoff_mass_kg", s->liftoff_mass_kg);
  sw_cli_add_number (b, "payload_kg", s->payload_kg);
  sw_cli_add_number (b, "payload_fraction", s->payload_fraction);
  sw_cli_add_number (b, "delta_v_m_s", s->delta_v_m_s);
  sw_cli_add_number (b, "delta_v_limit_m_s", s->delta_v_limit_m_s);
  /* The headroom to the asymptote, kept under its old key for scripts;
   * the simulated margin is the one that says whether the vehicle flies. */
  sw_cli_add_number (b, "margin_m_s", s->margin_m_s);
  sw_cli_add_number (b, "headroom_to_limit_m_s", a->headroom_m_s);
  /* What the stages give with the payload: the requirement, or more when
   * every load is fixed (null when infeasible). */
  sw_cli_add_number (b, "delta_v_given_m_s", s->delta_v_given_m_s);
  sw_cli_add_number (b, "simulated_margin_m_s", a->simulated_margin_m_s);
  sw_cli_add_number (b, "liftoff_thrust_to_weight", sw_analysis_liftoff_tw (a));
  sw_cli_add_number (b, "lagrange_multiplier_s_m", s->multiplier_s_m);
  json_builder_set_member_name (b, "stages");
  json_builder_begin_array (b);
  for (guint i = 0; i < s->n_stages; i++)
    {
      const SwStageResult *r = &s->stages[i];
      json_builder_begin_object (b);
      json_builder_set_member_name (b, "name");
      json_builder_add_string_value (b, d->stages[i].name);
      json_builder_set_member_name (b, "feasible");
      json_builder_add_boolean_value (b, r->feasible);
      json_builder_set_member_name (b, "unused");
      json_builder_add_boolean_value (b, r->unused);
      sw_cli_add_number (b, "isp_vac_s", d->stages[i].isp_vac_s);
      sw_cli_add_number (b, "structural_coefficient", d->stages[i].structural_coefficient);
      sw_cli_add_number (b, "delta_v_m_s", r->delta_v_m_s);
      sw_cli_add_number (b, "delta_v_share", r->delta_v_share);
      sw_cli_add_number (b, "delta_v_limit_m_s", r->delta_v_limit_m_s);
      sw_cli_add_number (b, "mass_ratio", r->mass_ratio);
      sw_cli_add_number (b, "propellant_mass_kg", r->propellant_mass_kg);
      sw_cli_add_number (b, "structural_mass_kg", r->structural_mass_kg);
      sw_cli_add_number (b, "initial_mass_kg", r->initial_mass_kg);
      sw_cli_add_number (b, "burnout_mass_kg", r->burnout_mass_kg);
      json_builder_set_member_name (b, "fixed");
      json_builder_add_boolean_value (b, r->fixed);
      add_propellant_keys (b, &d->stages[i].propellant);
      if (d->stages[i].propellant.kind != SW_PROPELLANT_NONE && i < a->shape.n_stages)
        {
          const SwStageGeometry *g = &a->shape.stages[i];
          const SwStageShape *shape = &g->shape;
          sw_cli_add_number (b, "propellant_volume_m3", shape->propellant_volume_m3);
          sw_cli_add_number (b, "tank_volume_m3", shape->tank_volume_m3);
          sw_cli_add_number (b, "oxidizer_tank_volume_m3", shape->oxidizer_tank_m3);
          sw_cli_add_number (b, "fuel_tank_volume_m3",
                             shape->solid ? NAN : shape->fuel_tank_m3);
          sw_cli_add_number (b, "oxidizer_tank_length_m", shape->oxidizer_tank_length_m);
          sw_cli_add_number (b, "fuel_tank_length_m",
                             shape->solid ? NAN : shape->fuel_tank_length_m);
          sw_cli_add_number (b, "intertank_length_m", shape->intertank_length_m);
          sw_cli_add_number (b, "engine_section_length_m", shape->engine_section_length_m);
          sw_cli_add_number (b, "length_m", shape->length_m);
          sw_cli_add_number (b, "diameter_m", g->diameter_m);
          sw_cli_add_number (b, "interstage_length_m",
                             a->shape.complete && i + 1 < a->shape.n_stages
                             ? g->interstage_length_m : NAN);
        }
      json_builder_end_object (b);
    }
  json_builder_end_array (b);
  add_boosters (b, d, s);
  add_phases (b, d, s);
  add_vehicle_shape (b, &a->shape);
  add_eps_estimate (b, d, &a->mass_estimate);
  add_recovery (b, d);
  json_builder_set_member_name (b, "caution");
  json_builder_add_string_value (b, sw_format_cautions ());
  json_builder_end_object (b);
  return json_builder_get_root (b);
}

static void
print_sizing_table (const SwAnalysis *a)
{
  const SwDesign *d = a->design;
  const SwSizing *s = &a->sizing;
  g_autofree char *payload = sw_format_mass (s->payload_kg);
  g_autofree char *dv = sw_format_speed (s->delta_v_m_s);

  /* The verdict is the first line: what a reader needs before any figure. */
  sw_cli_print_verdict (a);
  g_print ("\n");
  g_print (_("Design: %s\n"), d->name);
  g_print (_("Split: %s    Payload: %s    Required delta-v: %s%s\n"),
           sw_split_mode_to_string (s->split), payload, dv,
           a->sized_by_ascent ? _(" (with the simulated losses)") : "");
  if (isfinite (a->simulated_margin_m_s))
    {
      g_autofree char *m = sw_format_speed_delta (a->simulated_margin_m_s);
      g_print (_("Simulated delta-v margin: %s\n"), m);
    }
  if (isfinite (s->multiplier_s_m))
    {
      g_autofree char *eta = sw_format_number (s->multiplier_s_m * 1000.0, 6);
      g_print (_("Lagrange multiplier eta: %s s/km\n"), eta);
    }
  guint name_w = 20;

  /* Each column as wide as its widest cell, counted in characters (a
   * minus sign or a German digit group is one), so a huge vehicle keeps
   * the columns aligned. */
  {
    enum { N_COLS = 11 };
    static const int min_width[N_COLS] = { 3, 20, 6, 6, 9, 6, 8, 12, 11, 13, 12 };
    g_autoptr (GPtrArray) rows = g_ptr_array_new_with_free_func ((GDestroyNotify) g_strfreev);
    int width[N_COLS];

    g_ptr_array_add (rows, g_strdupv ((char *[]) { "#", _("stage"), "Isp_v", "eps", "dv m/s",
                                                   _("share"), "n", _("propellant"),
                                                   _("structure"), _("initial kg"),
                                                   _("burnout kg"), "", NULL }));
    /* Firing order, the first stage first. */
    for (guint i = 0; i < s->n_stages; i++)
      {
        const SwStageResult *r = &s->stages[i];
        char **row = g_new0 (char *, N_COLS + 2);

        row[0] = g_strdup_printf ("%u", i + 1);
        row[1] = g_strdup (d->stages[i].name);
        row[2] = sw_format_number (d->stages[i].isp_vac_s, 1);
        row[3] = sw_format_number (d->stages[i].structural_coefficient, 4);
        row[4] = sw_format_number (r->delta_v_m_s, 1);
        row[5] = sw_format_number (r->delta_v_share, 3);
        row[6] = sw_format_number (r->mass_ratio, 4);
        row[7] = sw_format_number (r->propellant_mass_kg, 1);
        row[8] = sw_format_number (r->structural_mass_kg, 1);
        row[9] = sw_format_number (r->initial_mass_kg, 1);
        row[10] = sw_format_number (r->burnout_mass_kg, 1);
        row[11] = g_strdup (!r->feasible ? _("  INFEASIBLE") : r->unused ? _("  (unused)")
                            : r->fixed ? _("  (fixed load)") : "");
        g_ptr_array_add (rows, row);
      }
    for (int c = 0; c < N_COLS; c++)
      {
        width[c] = min_width[c];
        for (guint k = 0; k < rows->len; k++)
          width[c] = MAX (width[c], (int) g_utf8_strlen (((char **) rows->pdata[k])[c], -1));
      }
    /* The boosters' line below lines up with the names. */
    name_w = (guint) MAX (width[1], (int) sw_cli_names_width (d, 20));
    width[1] = (int) name_w;
    g_print ("\n");
    for (guint k = 0; k < rows->len; k++)
      {
        char **row = rows->pdata[k];
        GString *line = g_string_new (NULL);

        for (int c = 0; c < N_COLS; c++)
          {
            int pad = width[c] - (int) g_utf8_strlen (row[c], -1);
            gboolean left = c < 2;

            if (c > 0)
              g_string_append_c (line, ' ');
            if (!left)
              for (int j = 0; j < pad; j++)
                g_string_append_c (line, ' ');
            g_string_append (line, row[c]);
            if (left && c < N_COLS - 1)
              for (int j = 0; j < pad; j++)
                g_string_append_c (line, ' ');
          }
        g_string_append (line, row[N_COLS]);
        g_print ("%s\n", line->str);
        g_string_free (line, TRUE);
      }
  }
  if (s->boosters.present && s->feasible)
    {
      const SwBoosterResult *r = &s->boosters;
      g_autofree char *name = sw_cli_cell (d->boosters.name, name_w);
      g_autofree char *mp = sw_format_number (r->propellant_mass_kg, 1);
      g_autofree char *ms = sw_format_number (r->structural_mass_kg, 1);
      g_autofree char *mt = sw_format_number (r->total_mass_kg, 1);
      g_autofree char *isp = sw_format_number (d->boosters.isp_vac_s, 1);
      g_autofree char *eps = sw_format_number (d->boosters.structural_coefficient, 4);
      g_autofree char *tb = sw_format_number (r->phase_duration_s, 1);
      g_autofree char *q = sw_format_number (r->core_propellant_in_phase_kg, 1);
      g_autofree char *cm = sw_format_number (r->mixed_exhaust_velocity_m_s, 1);
      g_print (_("%-3s %s %6s %6s  %u x (%s kg propellant + %s kg structure) = %s kg%s%s\n"),
               "B", name, isp, eps, r->count, mp, ms, mt,
               r->fixed ? _("  (fixed load)") : "", r->crossfeed ? _("  crossfeed") : "");
      g_print (_("    burn time %s s beside the core; the core burns %s kg of its own "
                 "propellant meanwhile; mixed exhaust velocity %s m/s\n"), tb, q, cm);
    }
  /* The phases, when there is more to them than the stage table. */
  if (s->feasible && s->boosters.present)
    {
      SwPhase phases[SW_MAX_PHASES];
      guint n_phases = sw_sizing_phases (d, s, phases);

      g_autofree char *phase_head = NULL;
      guint phase_w = 28;

      /* The column as wide as the longest phase's name. */
      for (guint k = 0; k < n_phases; k++)
        {
          g_autofree char *pname = sw_phase_dup_name (d, &phases[k]);
          phase_w = MAX (phase_w, (guint) g_utf8_strlen (pname, -1));
        }
      phase_head = sw_cli_cell (_("phase"), phase_w);
      g_print ("\n%s %9s %9s %14s %14s %9s\n", phase_head, "dv m/s", "c m/s",
               _("initial kg"), _("final kg"), _("time s"));
      for (guint k = 0; k < n_phases; k++)
        {
          g_autofree char *pname = sw_phase_dup_name (d, &phases[k]);
          g_autofree char *cell = sw_cli_cell (pname, phase_w);
          g_autofree char *pdv = sw_format_number (phases[k].delta_v_m_s, 1);
          g_autofree char *pc = sw_format_number (phases[k].exhaust_velocity_m_s, 1);
          g_autofree char *p0 = sw_format_number (phases[k].initial_mass_kg, 1);
          g_autofree char *pf = sw_format_number (phases[k].final_mass_kg, 1);
          g_autofree char *pt = isfinite (phases[k].duration_s)
                                  ? sw_format_number (phases[k].duration_s, 1) : g_strdup ("-");
          g_print ("%s %9s %9s %14s %14s %9s\n", cell, pdv, pc, p0, pf, pt);
          if (isfinite (phases[k].fairing_drop_mass_kg))
            {
              g_autofree char *fm = sw_format_number (phases[k].fairing_mass_kg, 1);
              g_autofree char *fd = sw_format_number (phases[k].fairing_drop_mass_kg, 1);
              g_print (_("    the fairing (%s kg) drops during this phase, at %s kg: its "
                         "delta-v is the burn before the drop plus the burn after\n"), fm, fd);
            }
        }
    }
  g_print ("\n");
  if (s->feasible)
    {
      g_autofree char *lm = sw_format_number (s->liftoff_mass_kg, 1);
      g_autofree char *lt = sw_format_mass (s->liftoff_mass_kg);
      g_autofree char *pf = sw_format_percent (s->payload_fraction, 3);
      g_autofree char *hr = sw_format_speed (a->headroom_m_s);
      g_print (_("Liftoff mass: %s kg (%s)    Payload fraction: %s\n"), lm, lt, pf);
      g_print (_("Headroom to the stages' delta-v limit (no payload): %s\n"), hr);
      if (a->shape.complete)
        {
          g_autofree char *h = sw_format_length_m (a->shape.height_m);
          g_autofree char *w = sw_format_length_m (a->shape.width_m);
          g_autofree char *core = sw_format_length_m (a->shape.max_diameter_m);
          if (a->shape.n_boosters > 0)
            /* Translators: a length, a length, the core's diameter */
            g_print (_("Shape: %s tall with its fairing, %s wide across the boosters "
                       "(stages %s; tanks and lengths: --json)\n"), h, w, core);
          else
            g_print (_("Shape: %s tall with its fairing, %s wide (tanks and lengths: --json)\n"),
                     h, w);
        }
      if (a->mass_estimate.ok)
        {
          g_print ("%s", _("Structural coefficients from mass-estimating relationships "
                           "(details and sources: --json, \"eps_estimate\"):\n"));
          for (guint i = 0; i < a->mass_estimate.n_stages && i < d->n_stages; i++)
            {
              const SwStageEstimate *e = &a->mass_estimate.stages[i];
              g_autofree char *was = sw_format_number (e->design_coefficient, 4);
              g_autofree char *est = sw_format_number (e->structural_coefficient, 4);
              if (e->estimated)
                g_print (_("  %u: %s (file %s)"), i + 1, est, was);
              else
                g_print (_("  %u: not estimated"), i + 1);
            }
          if (a->mass_estimate.has_boosters)
            {
              const SwStageEstimate *e = &a->mass_estimate.boosters;
              g_autofree char *was = sw_format_number (e->design_coefficient, 4);
              g_autofree char *est = sw_format_number (e->structural_coefficient, 4);
              if (e->estimated)
                /* Translators: the boosters' estimated structural coefficient, then the file's */
                g_print (_("  boosters: %s (file %s)"), est, was);
              else
                g_print ("%s", _("  boosters: not estimated"));
            }
          g_print ("\n");
        }
    }
  else
    g_print (_("INFEASIBLE: %s\n"), s->reason);
  if (s->feasible && s->reason[0] != '\0')
    g_print (_("Note: %s\n"), s->reason);
  g_print ("\n%s\n", sw_format_cautions ());
}

int
sw_cli_size (int argc, char **argv)
{
  g_autoptr (SwAnalysis) a = NULL;
  SwAnalysisOptions o;
  int code;

  sw_analysis_options_init (&o);
  opt_json = FALSE;
  opt_no_ascent = FALSE;
  opt_min_tw = o.min_thrust_to_weight;
  opt_max_q_kpa = o.max_q_pa / 1000.0;
  opt_max_g = o.max_axial_g;
  if (!sw_cli_parse ("size", size_entries, &argc, &argv, 1, &code))
    return code;
  /* The window's settings keep the same ranges (data/ schema). */
  if (!(opt_min_tw >= 0.5 && opt_min_tw <= 5.0) || !(opt_max_q_kpa >= 5.0 && opt_max_q_kpa <= 200.0)
      || !(opt_max_g >= 1.0 && opt_max_g <= 20.0))
    {
      g_printerr (_("stagewright-cli size: the limits must be --min-thrust-to-weight 0.5 to 5, "
                    "--max-q-kpa 5 to 200 and --max-g 1 to 20\n"));
      return SW_EXIT_USAGE;
    }
  /* The ascent decides the verdict, and for "loss_model": "simulate" the
   * closed loop sizes the vehicle, exactly as in the window. */
  o.montecarlo = FALSE;
  o.ascent = !opt_no_ascent;
  o.min_thrust_to_weight = opt_min_tw;
  o.max_q_pa = 1000.0 * opt_max_q_kpa;
  o.max_axial_g = opt_max_g;
  if ((a = sw_cli_analyse (argv[1], &o, &code)) == NULL)
    return code;
  if (opt_json)
    {
      g_autoptr (JsonNode) node = sizing_to_json (a);
      sw_cli_print_json (node);
    }
  else
    print_sizing_table (a);
  return SW_EXIT_OK;
}

static char *opt_altitudes, *opt_inclinations;
static gboolean opt_simulate;

static GOptionEntry performance_entries[] = {
  { "json", 0, 0, G_OPTION_ARG_NONE, &opt_json, N_("Print JSON for machines"), NULL },
  { "altitudes", 0, 0, G_OPTION_ARG_STRING, &opt_altitudes,
    N_("Altitudes of the payload curve, km, separated by commas (default 200 to 2,000)"),
    "A1,A2,..." },
  { "inclinations", 0, 0, G_OPTION_ARG_STRING, &opt_inclinations,
    N_("Inclinations of the payload curve, degrees, separated by commas (default: every "
       "inclination the site reaches directly)"),
    "I1,I2,..." },
  { "simulate", 0, 0, G_OPTION_ARG_NONE, &opt_simulate,
    N_("Fly an ascent at each point of the curves and use its losses (seconds)"), NULL },
  { NULL }
};

/* "A1,A2,..." into @values; an error names @option and the bad item. */
static gboolean
parse_list (const char *text, const char *option, double *values, guint *n, GError **error)
{
  g_auto (GStrv) items = g_strsplit (text, ",", -1);
  guint count = g_strv_length (items);

  *n = 0;
  if (count == 0 || count > SW_PAYLOAD_CURVE_MAX)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
                   _("%s: give 1 to %d values separated by commas"), option,
                   SW_PAYLOAD_CURVE_MAX);
      return FALSE;
    }
  for (guint i = 0; i < count; i++)
    {
      char *item = g_strstrip (items[i]), *end = NULL;
      double v = g_ascii_strtod (item, &end);

      if (*item == '\0' || end == item || *end != '\0' || !isfinite (v))
        {
          g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
                       _("%s: “%s” is not a number (give numbers separated by commas)"), option,
                       item);
          return FALSE;
        }
      values[(*n)++] = v;
    }
  return TRUE;
}

static void
add_payload_curve (JsonBuilder *b, const char *member, const char *x_key,
                   const SwPayloadCurve *c)
{
  json_builder_set_member_name (b, member);
  json_builder_begin_array (b);
  for (guint i = 0; i < c->n_points; i++)
    {
      const SwPayloadPoint *p = &c->points[i];
      json_builder_begin_object (b);
      sw_cli_add_number (b, x_key, p->x);
      sw_cli_add_number (b, "payload_kg", p->reachable ? p->payload_kg : NAN);
      sw_cli_add_number (b, "delta_v_m_s", p->delta_v_m_s);
      sw_cli_add_number (b, "losses_m_s", p->losses_m_s);
      json_builder_set_member_name (b, "losses_simulated");
      json_builder_add_boolean_value (b, p->simulated);
      json_builder_set_member_name (b, "reason");
      json_builder_add_string_value (b, p->reason);
      json_builder_end_object (b);
    }
  json_builder_end_array (b);
}

static void
print_payload_curve (const char *title, const char *x_head, const SwPayloadCurve *c)
{
  g_print ("\n%s\n", title);
  /* Translators: column heads of the payload curve table */
  g_print ("%12s  %14s  %12s  %s\n", x_head, _("payload"), _("losses"), _("note"));
  for (guint i = 0; i < c->n_points; i++)
    {
      const SwPayloadPoint *p = &c->points[i];
      g_autofree char *pl = p->reachable ? sw_format_mass (p->payload_kg) : g_strdup ("—");
      g_autofree char *l = sw_format_speed (p->losses_m_s);
      g_autofree char *x = sw_format_number (p->x, 1);
      g_print ("%12s  %14s  %12s  %s\n", x, pl, l, p->reason);
    }
}

/* The payload a vehicle that exists (every stage with a fixed propellant
 * load) carries to the design's mission, and its payload curves. */
int
sw_cli_performance (int argc, char **argv)
{
  g_autoptr (SwAnalysis) a = NULL;
  g_autoptr (GError) error = NULL;
  SwAnalysisOptions o;
  const SwPerformance *p;
  const SwPayloadCurves *pc;
  const SwDesign *d;
  int code;

  opt_json = FALSE;
  opt_simulate = FALSE;
  g_clear_pointer (&opt_altitudes, g_free);
  g_clear_pointer (&opt_inclinations, g_free);
  if (!sw_cli_parse ("performance", performance_entries, &argc, &argv, 1, &code))
    return code;
  fast_options (&o);
  /* A "loss_model": "simulate" design carries what it carries at the
   * closed loop's losses, as in the window (an allowance design flies one
   * ascent for its verdict). */
  o.ascent = TRUE;
  o.payload_simulate = opt_simulate;
  if ((opt_altitudes != NULL
       && (!parse_list (opt_altitudes, "--altitudes", o.payload_altitudes_km,
                        &o.n_payload_altitudes, &error)
           || !sw_payload_check_grid (TRUE, o.payload_altitudes_km, o.n_payload_altitudes,
                                      "--altitudes", &error)))
      || (opt_inclinations != NULL
          && (!parse_list (opt_inclinations, "--inclinations", o.payload_inclinations_deg,
                           &o.n_payload_inclinations, &error)
              || !sw_payload_check_grid (FALSE, o.payload_inclinations_deg,
                                         o.n_payload_inclinations, "--inclinations", &error))))
    {
      g_printerr (_("stagewright-cli performance: %s\n"), error->message);
      return SW_EXIT_USAGE;
    }
  /* A sized stage is refused before anything is flown. */
  {
    g_autoptr (SwDesign) loaded = sw_cli_load (argv[1]);
    SwPerformance check;

    if (loaded == NULL)
      return SW_EXIT_USAGE;
    if (!sw_design_performance (loaded, &check, &error))
      return sw_cli_input_error (argv[1], error);
  }
  if ((a = sw_cli_analyse (argv[1], &o, &code)) == NULL)
    return code;
  if (!a->has_performance)
    {
      g_printerr (_("error: %s: %s\n"), argv[1], a->performance_error);
      return SW_EXIT_USAGE;
    }
  d = a->design;
  p = &a->performance;
  pc = &a->payload_curves;
  if (opt_json)
    {
      g_autoptr (JsonBuilder) b = json_builder_new_immutable ();
      json_builder_begin_object (b);
      json_builder_set_member_name (b, "name");
      json_builder_add_string_value (b, d->name);
      sw_cli_add_verdict (b, a);
      json_builder_set_member_name (b, "reachable");
      json_builder_add_boolean_value (b, p->reachable);
      json_builder_set_member_name (b, "reason");
      json_builder_add_string_value (b, p->reason);
      sw_cli_add_number (b, "payload_kg", p->payload_kg);
      sw_cli_add_number (b, "nominal_payload_kg", d->payload_kg);
      sw_cli_add_number (b, "delta_v_m_s", p->delta_v_m_s);
      sw_cli_add_number (b, "empty_delta_v_m_s", p->empty_delta_v_m_s);
      sw_cli_add_number (b, "liftoff_mass_kg", p->reachable ? p->sizing.liftoff_mass_kg : NAN);
      add_phases (b, d, &p->sizing);
      json_builder_set_member_name (b, "payload_curves_note");
      json_builder_add_string_value (b, pc->note);
      if (pc->applies)
        {
          add_payload_curve (b, "payload_curve", "altitude_km", &pc->altitude);
          add_payload_curve (b, "inclination_curve", "inclination_deg", &pc->inclination);
        }
      sw_cli_finish_json (b);
      return SW_EXIT_OK;
    }
  g_print (_("Design: %s\n"), d->name);
  {
    g_autofree char *dv = sw_format_speed (p->delta_v_m_s);
    g_autofree char *empty = sw_format_speed (p->empty_delta_v_m_s);
    g_print (_("Required delta-v: %s    Delta-v with no payload: %s\n"), dv, empty);
  }
  if (p->reachable)
    {
      g_autofree char *pl = sw_format_mass (p->payload_kg);
      g_autofree char *nom = sw_format_mass (d->payload_kg);
      g_autofree char *lm = sw_format_mass (p->sizing.liftoff_mass_kg);
      g_print (_("Payload capability: %s (nominal payload %s)    Liftoff mass: %s\n"), pl, nom,
               lm);
    }
  else
    g_print (_("UNREACHABLE: %s\n"), p->reason);
  if (pc->applies)
    {
      g_autofree char *inc = sw_format_number (pc->inclination_deg, 1);
      g_autofree char *alt = sw_format_number (pc->altitude_km, 0);
      g_autofree char *t1 = g_strdup_printf (_("Payload against circular-orbit altitude, at "
                                               "%s° inclination:"), inc);
      g_autofree char *t2 = g_strdup_printf (_("Payload against inclination, at %s km:"), alt);
      print_payload_curve (t1, _("altitude km"), &pc->altitude);
      print_payload_curve (t2, _("inclination °"), &pc->inclination);
    }
  g_print ("\n%s\n", pc->note);
  g_print ("\n%s\n", sw_format_cautions ());
  return SW_EXIT_OK;
}

int
sw_cli_curve (int argc, char **argv)
{
  g_autoptr (SwAnalysis) a = NULL;
  SwAnalysisOptions o;
  const SwStageCurve *curve;
  guint n;
  int code;

  opt_json = FALSE;
  opt_max_stages = SW_MAX_STAGES;
  if (!sw_cli_parse ("curve", curve_entries, &argc, &argv, 1, &code))
    return code;
  if (opt_max_stages < 1 || opt_max_stages > SW_MAX_STAGES)
    {
      g_printerr (_("stagewright-cli curve: --max-stages must be 1 to %d, not %d\n"),
                  SW_MAX_STAGES, opt_max_stages);
      return SW_EXIT_USAGE;
    }
  fast_options (&o);
  if ((a = sw_cli_analyse (argv[1], &o, &code)) == NULL)
    return code;
  curve = &a->stage_curve;
  n = MIN (curve->n_points, (guint) opt_max_stages);

  if (opt_json)
    {
      g_autoptr (JsonBuilder) b = json_builder_new_immutable ();

      json_builder_begin_object (b);
      sw_cli_add_number (b, "delta_v_m_s", a->delta_v_m_s);
      sw_cli_add_number (b, "payload_kg", a->design->payload_kg);
      json_builder_set_member_name (b, "fixed_loads_note");
      json_builder_add_string_value (b, curve->note);
      json_builder_set_member_name (b, "points");
      json_builder_begin_array (b);
      for (guint i = 0; i < n; i++)
        {
          json_builder_begin_object (b);
          json_builder_set_member_name (b, "stages");
          json_builder_add_int_value (b, curve->points[i].stages);
          json_builder_set_member_name (b, "feasible");
          json_builder_add_boolean_value (b, curve->points[i].feasible);
          sw_cli_add_number (b, "liftoff_mass_kg", curve->points[i].liftoff_mass_kg);
          sw_cli_add_number (b, "delta_v_limit_m_s", curve->points[i].delta_v_limit_m_s);
          json_builder_end_object (b);
        }
      json_builder_end_array (b);
      /* With boosters: the same boosters beside 1..N stages (null without). */
      json_builder_set_member_name (b, "boosters_note");
      json_builder_add_string_value (b, curve->booster_note);
      json_builder_set_member_name (b, "points_with_boosters");
      if (curve->booster_count == 0)
        json_builder_add_null_value (b);
      else
        {
          json_builder_begin_array (b);
          for (guint i = 0; i < n; i++)
            {
              json_builder_begin_object (b);
              json_builder_set_member_name (b, "stages");
              json_builder_add_int_value (b, curve->booster_points[i].stages);
              json_builder_set_member_name (b, "feasible");
              json_builder_add_boolean_value (b, curve->booster_points[i].feasible);
              sw_cli_add_number (b, "liftoff_mass_kg", curve->booster_points[i].liftoff_mass_kg);
              json_builder_end_object (b);
            }
          json_builder_end_array (b);
        }
      sw_cli_finish_json (b);
      return SW_EXIT_OK;
    }

  {
    g_autofree char *payload = sw_format_mass (a->design->payload_kg);
    g_autofree char *dv = sw_format_speed (a->delta_v_m_s);
    g_print (_("Design: %s    Payload: %s    Delta-v: %s (optimal split)\n\n"), a->design->name,
             payload, dv);
  }
  g_print ("%-7s %16s %16s  %s\n", _("stages"), _("liftoff kg"), _("dv limit m/s"), "");
  for (guint i = 0; i < n; i++)
    {
      g_autofree char *m = sw_format_number (curve->points[i].liftoff_mass_kg, 1);
      g_autofree char *l = sw_format_number (curve->points[i].delta_v_limit_m_s, 1);
      g_print ("%-7u %16s %16s  %s\n", curve->points[i].stages, m, l,
               curve->points[i].feasible ? "" : _("infeasible: beyond the delta-v limit"));
    }
  if (curve->booster_count > 0)
    {
      g_print (g_dngettext (GETTEXT_PACKAGE, "\nWith this design's %u booster:\n",
                            "\nWith this design's %u boosters:\n", curve->booster_count),
               curve->booster_count);
      for (guint i = 0; i < n; i++)
        {
          g_autofree char *m = sw_format_number (curve->booster_points[i].liftoff_mass_kg, 1);
          g_print ("%-7u %16s  %s\n", curve->booster_points[i].stages, m,
                   curve->booster_points[i].feasible ? "" : _("infeasible"));
        }
      g_print (_("\nNote: %s\n"), curve->booster_note);
    }
  if (curve->note[0] != '\0')
    g_print (_("\nNote: %s\n"), curve->note);
  g_print ("\n%s\n", sw_format_cautions ());
  return SW_EXIT_OK;
}

int
sw_cli_budget (int argc, char **argv)
{
  g_autoptr (SwAnalysis) a = NULL;
  SwAnalysisOptions o;
  const SwBudget *b;
  const SwDesign *d;
  int code;

  opt_json = FALSE;
  if (!sw_cli_parse ("budget", json_entries, &argc, &argv, 1, &code))
    return code;
  fast_options (&o);
  if ((a = sw_cli_analyse (argv[1], &o, &code)) == NULL)
    return code;
  d = a->design;
  if (!a->has_budget)
    {
      g_printerr (_("error: %s: mission: the design states its delta-v directly "
                    "(mission.delta_v_m_s); a delta-v budget needs a target orbit "
                    "(mission.orbit)\n"), argv[1]);
      return SW_EXIT_USAGE;
    }
  b = &a->budget;
  if (opt_json)
    {
      g_autoptr (JsonBuilder) jb = json_builder_new_immutable ();

      json_builder_begin_object (jb);
      sw_cli_add_number (jb, "circular_velocity_m_s", b->circular_velocity_m_s);
      sw_cli_add_number (jb, "launch_azimuth_deg", b->launch_azimuth_deg);
      sw_cli_add_number (jb, "site_speed_m_s", b->site_speed_m_s);
      sw_cli_add_number (jb, "rotation_gain_m_s", b->rotation_gain_m_s);
      sw_cli_add_number (jb, "ideal_delta_v_m_s", b->ideal_delta_v_m_s);
      sw_cli_add_number (jb, "losses_m_s", b->losses_m_s);
      sw_cli_add_number (jb, "delta_v_m_s", b->delta_v_m_s);
      sw_cli_finish_json (jb);
      return SW_EXIT_OK;
    }
  {
    g_autofree char *alt = sw_format_distance_km (d->mission.altitude_km * 1000.0);
    g_autofree char *vc = sw_format_speed (b->circular_velocity_m_s);
    g_autofree char *az = sw_format_value ("%.2f\302\260", b->launch_azimuth_deg);
    g_autofree char *vs = sw_format_speed (b->site_speed_m_s);
    g_autofree char *rg = sw_format_speed (b->rotation_gain_m_s);
    g_autofree char *id = sw_format_speed (b->ideal_delta_v_m_s);
    g_autofree char *lo = sw_format_speed (b->losses_m_s);
    g_autofree char *dv = sw_format_speed (b->delta_v_m_s);

    g_print (_("Design: %s\n"), d->name);
    g_print (_("Orbit: %s circular, inclination %.2f deg, site latitude %.2f deg\n\n"), alt,
             d->mission.inclination_deg, d->mission.site_latitude_deg);
    g_print (_("  circular velocity   %14s   sqrt(mu / (a + h)), WGS 84\n"), vc);
    g_print (_("  launch azimuth      %14s   sin(az) = cos(i) / cos(latitude)\n"), az);
    g_print (_("  site speed          %14s   omega a cos(latitude)\n"), vs);
    g_print (_("  rotation gain       %14s\n"), rg);
    g_print (_("  ideal delta-v       %14s   |v_orbit - v_site|\n"), id);
    g_print (_("  losses              %14s   gravity, drag, steering (allowance)\n"), lo);
    g_print (_("  required delta-v    %14s\n\n%s\n"), dv, sw_format_cautions ());
  }
  return SW_EXIT_OK;
}

int
sw_cli_limits (int argc, char **argv)
{
  g_autofree char *table = NULL;
  int code;

  if (!sw_cli_parse ("limits", NULL, &argc, &argv, 0, &code))
    return code;
  table = sw_limits_dup_markdown ();
  g_print ("%s", table);
  return SW_EXIT_OK;
}
