/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The sizing subcommands: size, curve, budget, limits. */
#include "config.h"

#include "sw-cli.h"

#include "sw-budget.h"
#include "sw-curves.h"
#include "sw-limits.h"
#include "sw-sizing.h"

#include <math.h>

static gboolean opt_json;
static int opt_max_stages = SW_MAX_STAGES;

static GOptionEntry json_entries[] = {
  { "json", 0, 0, G_OPTION_ARG_NONE, &opt_json, "Print JSON for machines", NULL },
  { NULL }
};

static GOptionEntry curve_entries[] = {
  { "json", 0, 0, G_OPTION_ARG_NONE, &opt_json, "Print JSON for machines", NULL },
  { "max-stages", 0, 0, G_OPTION_ARG_INT, &opt_max_stages, "Largest stage count (1 to 8)", "N" },
  { NULL }
};

static JsonNode *
sizing_to_json (const SwDesign *d, const SwSizing *s)
{
  g_autoptr (JsonBuilder) b = json_builder_new_immutable ();

  json_builder_begin_object (b);
  json_builder_set_member_name (b, "name");
  json_builder_add_string_value (b, d->name);
  json_builder_set_member_name (b, "feasible");
  json_builder_add_boolean_value (b, s->feasible);
  json_builder_set_member_name (b, "reason");
  json_builder_add_string_value (b, s->reason);
  json_builder_set_member_name (b, "split");
  json_builder_add_string_value (b, sw_split_mode_to_string (s->split));
  sw_cli_add_number (b, "liftoff_mass_kg", s->liftoff_mass_kg);
  sw_cli_add_number (b, "payload_kg", s->payload_kg);
  sw_cli_add_number (b, "payload_fraction", s->payload_fraction);
  sw_cli_add_number (b, "delta_v_m_s", s->delta_v_m_s);
  sw_cli_add_number (b, "delta_v_limit_m_s", s->delta_v_limit_m_s);
  sw_cli_add_number (b, "margin_m_s", s->margin_m_s);
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
      json_builder_end_object (b);
    }
  json_builder_end_array (b);
  json_builder_set_member_name (b, "caution");
  json_builder_add_string_value (b, sw_cli_caution);
  json_builder_end_object (b);
  return json_builder_get_root (b);
}

static void
print_sizing_table (const SwDesign *d, const SwSizing *s)
{
  g_print ("Design: %s\n", d->name);
  g_print ("Split: %s    Payload: %.1f kg    Required delta-v: %.1f m/s\n",
           sw_split_mode_to_string (s->split), s->payload_kg, s->delta_v_m_s);
  g_print ("Vehicle delta-v limit: %.1f m/s    Margin to the limit: %.1f m/s\n",
           s->delta_v_limit_m_s, s->margin_m_s);
  if (isfinite (s->multiplier_s_m))
    g_print ("Lagrange multiplier eta: %.6f s/km\n", s->multiplier_s_m * 1000.0);
  g_print ("\n%-3s %-20s %6s %6s %9s %6s %8s %12s %11s %13s %12s\n", "#", "stage", "Isp_v",
           "eps", "dv m/s", "share", "n", "propellant", "structure", "initial kg",
           "burnout kg");
  /* Top of the stack first reads like the vehicle; firing order is kept in
   * the numbering. */
  for (guint i = 0; i < s->n_stages; i++)
    {
      const SwStageResult *r = &s->stages[i];
      g_autofree char *mp = sw_cli_format (r->propellant_mass_kg, 1);
      g_autofree char *ms = sw_cli_format (r->structural_mass_kg, 1);
      g_autofree char *m0 = sw_cli_format (r->initial_mass_kg, 1);
      g_autofree char *mf = sw_cli_format (r->burnout_mass_kg, 1);
      /* Beyond the vehicle's limit no split exists: these are "-" too. */
      g_autofree char *dv = sw_cli_format (r->delta_v_m_s, 1);
      g_autofree char *share = sw_cli_format (r->delta_v_share, 3);
      g_autofree char *n = sw_cli_format (r->mass_ratio, 4);
      g_autofree char *name = sw_cli_cell (d->stages[i].name, 20);
      g_print ("%-3u %s %6.1f %6.4f %9s %6s %8s %12s %11s %13s %12s%s\n", i + 1,
               name, d->stages[i].isp_vac_s, d->stages[i].structural_coefficient,
               dv, share, n, mp, ms, m0, mf,
               !r->feasible ? "  INFEASIBLE" : r->unused ? "  (unused)" : "");
    }
  g_print ("\n");
  if (s->feasible)
    g_print ("Liftoff mass: %.1f kg (%.3f t)    Payload fraction: %.5f\n", s->liftoff_mass_kg,
             s->liftoff_mass_kg / 1000.0, s->payload_fraction);
  else
    g_print ("INFEASIBLE: %s\n", s->reason);
  if (s->feasible && s->reason[0] != '\0')
    g_print ("Note: %s\n", s->reason);
  if (d->mission.kind == SW_MISSION_ORBIT && d->mission.loss_model == SW_LOSS_SIMULATE)
    g_print ("Note: the design asks for simulated losses; this sizing uses the first guess of "
             "%.0f m/s. 'stagewright-cli ascent' closes the loop and sizes with the simulated "
             "losses.\n",
             d->mission.has_losses ? d->mission.losses_m_s : 0.0);
  g_print ("\n%s\n", sw_cli_caution);
}

int
sw_cli_size (int argc, char **argv)
{
  g_autoptr (SwDesign) d = NULL;
  g_autoptr (GError) error = NULL;
  SwSizing s;
  int code;

  opt_json = FALSE;
  if (!sw_cli_parse ("size", json_entries, &argc, &argv, 1, &code))
    return code;
  if ((d = sw_cli_load (argv[1])) == NULL)
    return SW_EXIT_USAGE;
  if (!sw_size_design (d, &s, &error))
    return sw_cli_input_error (argv[1], error);
  if (opt_json)
    {
      g_autoptr (JsonNode) node = sizing_to_json (d, &s);
      sw_cli_print_json (node);
    }
  else
    print_sizing_table (d, &s);
  return SW_EXIT_OK;
}

int
sw_cli_curve (int argc, char **argv)
{
  g_autoptr (SwDesign) d = NULL;
  g_autoptr (GError) error = NULL;
  SwStageCurve curve;
  double dv;
  int code;

  opt_json = FALSE;
  opt_max_stages = SW_MAX_STAGES;
  if (!sw_cli_parse ("curve", curve_entries, &argc, &argv, 1, &code))
    return code;
  if (opt_max_stages < 1 || opt_max_stages > SW_MAX_STAGES)
    {
      g_printerr ("stagewright-cli curve: --max-stages must be 1 to %d, not %d\n", SW_MAX_STAGES,
                  opt_max_stages);
      return SW_EXIT_USAGE;
    }
  if ((d = sw_cli_load (argv[1])) == NULL)
    return SW_EXIT_USAGE;
  if (!sw_design_required_delta_v (d, &dv, &error))
    return sw_cli_input_error (argv[1], error);
  sw_stage_curve_compute (d, dv, (guint) opt_max_stages, &curve);

  if (opt_json)
    {
      g_autoptr (JsonBuilder) b = json_builder_new_immutable ();

      json_builder_begin_object (b);
      sw_cli_add_number (b, "delta_v_m_s", dv);
      sw_cli_add_number (b, "payload_kg", d->payload_kg);
      json_builder_set_member_name (b, "points");
      json_builder_begin_array (b);
      for (guint i = 0; i < curve.n_points; i++)
        {
          json_builder_begin_object (b);
          json_builder_set_member_name (b, "stages");
          json_builder_add_int_value (b, curve.points[i].stages);
          json_builder_set_member_name (b, "feasible");
          json_builder_add_boolean_value (b, curve.points[i].feasible);
          sw_cli_add_number (b, "liftoff_mass_kg", curve.points[i].liftoff_mass_kg);
          sw_cli_add_number (b, "delta_v_limit_m_s", curve.points[i].delta_v_limit_m_s);
          json_builder_end_object (b);
        }
      json_builder_end_array (b);
      sw_cli_finish_json (b);
      return SW_EXIT_OK;
    }

  g_print ("Design: %s    Payload: %.1f kg    Delta-v: %.1f m/s (optimal split)\n\n", d->name,
           d->payload_kg, dv);
  g_print ("%-7s %16s %16s  %s\n", "stages", "liftoff kg", "dv limit m/s", "");
  for (guint i = 0; i < curve.n_points; i++)
    {
      g_autofree char *m = sw_cli_format (curve.points[i].liftoff_mass_kg, 1);
      g_print ("%-7u %16s %16.1f  %s\n", curve.points[i].stages, m,
               curve.points[i].delta_v_limit_m_s,
               curve.points[i].feasible ? "" : "infeasible: beyond the delta-v limit");
    }
  g_print ("\n%s\n", sw_cli_caution);
  return SW_EXIT_OK;
}

int
sw_cli_budget (int argc, char **argv)
{
  g_autoptr (SwDesign) d = NULL;
  g_autoptr (GError) error = NULL;
  SwBudget b;
  int code;

  opt_json = FALSE;
  if (!sw_cli_parse ("budget", json_entries, &argc, &argv, 1, &code))
    return code;
  if ((d = sw_cli_load (argv[1])) == NULL)
    return SW_EXIT_USAGE;
  if (!sw_design_budget (d, &b, &error))
    return sw_cli_input_error (argv[1], error);
  if (opt_json)
    {
      g_autoptr (JsonBuilder) jb = json_builder_new_immutable ();

      json_builder_begin_object (jb);
      sw_cli_add_number (jb, "circular_velocity_m_s", b.circular_velocity_m_s);
      sw_cli_add_number (jb, "launch_azimuth_deg", b.launch_azimuth_deg);
      sw_cli_add_number (jb, "site_speed_m_s", b.site_speed_m_s);
      sw_cli_add_number (jb, "rotation_gain_m_s", b.rotation_gain_m_s);
      sw_cli_add_number (jb, "ideal_delta_v_m_s", b.ideal_delta_v_m_s);
      sw_cli_add_number (jb, "losses_m_s", b.losses_m_s);
      sw_cli_add_number (jb, "delta_v_m_s", b.delta_v_m_s);
      sw_cli_finish_json (jb);
      return SW_EXIT_OK;
    }
  g_print ("Design: %s\n", d->name);
  g_print ("Orbit: %.1f km circular, inclination %.2f deg, site latitude %.2f deg\n\n",
           d->mission.altitude_km, d->mission.inclination_deg, d->mission.site_latitude_deg);
  g_print ("  circular velocity   %10.1f m/s   sqrt(mu / (a + h)), WGS 84\n",
           b.circular_velocity_m_s);
  g_print ("  launch azimuth      %10.2f deg   sin(az) = cos(i) / cos(latitude)\n",
           b.launch_azimuth_deg);
  g_print ("  site speed          %10.1f m/s   omega a cos(latitude)\n", b.site_speed_m_s);
  g_print ("  rotation gain       %10.1f m/s\n", b.rotation_gain_m_s);
  g_print ("  ideal delta-v       %10.1f m/s   |v_orbit - v_site|\n", b.ideal_delta_v_m_s);
  g_print ("  losses              %10.1f m/s   gravity, drag, steering (allowance)\n",
           b.losses_m_s);
  g_print ("  required delta-v    %10.1f m/s\n\n%s\n", b.delta_v_m_s, sw_cli_caution);
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
