/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The ascent subcommands: ascent, atmosphere. */
#include "config.h"

#include "sw-cli.h"

#include "sw-ascent.h"
#include "sw-atmosphere.h"
#include "sw-budget.h"
#include "sw-format.h"
#include "sw-sizing.h"

#include <glib/gi18n.h>

#include <math.h>
#include <stdlib.h>

static gboolean opt_json;
static char *opt_csv;
static gboolean opt_optimise;
/* The optimised steering of this run (--optimise-steering), or NULL. */
static const SwAscentOptimised *optimised;
static SwAscentResult optimised_copy;

static GOptionEntry ascent_entries[] = {
  { "json", 0, 0, G_OPTION_ARG_NONE, &opt_json, N_("Print JSON for machines"), NULL },
  { "csv", 0, 0, G_OPTION_ARG_FILENAME, &opt_csv, N_("Write the time series to FILE (CSV)"),
    "FILE" },
  { "optimise-steering", 0, 0, G_OPTION_ARG_NONE, &opt_optimise,
    N_("Also optimise the steering (slow) and give its delta-v saving over the guided law"),
    NULL },
  { NULL }
};

static GOptionEntry json_entries[] = {
  { "json", 0, 0, G_OPTION_ARG_NONE, &opt_json, N_("Print JSON for machines"), NULL },
  { NULL }
};

/* ---- ascent ------------------------------------------------------------ */

static void
add_point (JsonBuilder *b, const char *prefix, const SwAscentPoint *p, gboolean with_mass)
{
  g_autofree char *k1 = g_strdup_printf ("%s_time_s", prefix);
  g_autofree char *k2 = g_strdup_printf ("%s_altitude_km", prefix);
  g_autofree char *k3 = g_strdup_printf ("%s_speed_m_s", prefix);
  g_autofree char *k4 = g_strdup_printf ("%s_flight_path_deg", prefix);
  g_autofree char *k5 = g_strdup_printf ("%s_dynamic_pressure_pa", prefix);
  g_autofree char *k6 = g_strdup_printf ("%s_mass_kg", prefix);
  gboolean ok = isfinite (p->time_s);

  sw_cli_add_number (b, k1, p->time_s);
  sw_cli_add_number (b, k2, ok ? p->altitude_m / 1000.0 : NAN);
  sw_cli_add_number (b, k3, ok ? p->speed_m_s : NAN);
  sw_cli_add_number (b, k4, ok ? p->flight_path_deg : NAN);
  sw_cli_add_number (b, k5, ok ? p->dynamic_pressure_pa : NAN);
  if (with_mass)
    sw_cli_add_number (b, k6, ok ? p->mass_kg : NAN);
}

static void
add_string (JsonBuilder *b, const char *key, const char *value)
{
  json_builder_set_member_name (b, key);
  json_builder_add_string_value (b, value);
}

static void
add_bool (JsonBuilder *b, const char *key, gboolean value)
{
  json_builder_set_member_name (b, key);
  json_builder_add_boolean_value (b, value);
}

static void
add_stages_json (JsonBuilder *b, const SwDesign *d, const SwAscentStage *st, guint n,
                 gboolean simulated)
{
  json_builder_set_member_name (b, "stages");
  json_builder_begin_array (b);
  for (guint i = 0; i < n; i++)
    {
      const SwAscentStage *s = &st[i];
      json_builder_begin_object (b);
      add_string (b, "name", d->stages[i].name);
      add_bool (b, "fires", s->fires);
      sw_cli_add_number (b, "thrust_vac_kn", s->thrust_vac_n / 1000.0);
      sw_cli_add_number (b, "thrust_sl_kn", s->thrust_sl_n / 1000.0);
      sw_cli_add_number (b, "mass_flow_kg_s", s->mass_flow_kg_s);
      sw_cli_add_number (b, "burn_time_s", s->burn_time_s);
      sw_cli_add_number (b, "coast_before_ignition_s", s->coast_s);
      sw_cli_add_number (b, "ignition_mass_kg", s->ignition_mass_kg);
      sw_cli_add_number (b, "ignition_thrust_to_weight", s->ignition_thrust_to_weight);
      sw_cli_add_number (b, "burnout_thrust_to_weight", s->burnout_thrust_to_weight);
      if (simulated)
        {
          add_bool (b, "flown", s->flown);
          sw_cli_add_number (b, "burn_time_flown_s", s->burn_time_flown_s);
          sw_cli_add_number (b, "propellant_left_kg", s->propellant_left_kg);
          add_point (b, "ignition", &s->ignition, FALSE);
          add_point (b, "burnout", &s->burnout, TRUE);
        }
      json_builder_end_object (b);
    }
  json_builder_end_array (b);
}

static void
add_notes_json (JsonBuilder *b, const char *notes)
{
  g_auto (GStrv) lines = g_strsplit (notes, "\n", -1);

  json_builder_set_member_name (b, "notes");
  json_builder_begin_array (b);
  for (guint i = 0; lines[i] != NULL; i++)
    if (lines[i][0] != '\0')
      json_builder_add_string_value (b, lines[i]);
  json_builder_end_array (b);
}

static JsonNode *
ascent_to_json (const SwAnalysis *a)
{
  const SwDesign *d = a->design;
  const SwAscentResult *r = a->ascent;
  g_autoptr (JsonBuilder) b = json_builder_new_immutable ();

  json_builder_begin_object (b);
  add_string (b, "name", d->name);
  sw_cli_add_verdict (b, a);
  add_bool (b, "simulated", TRUE);
  add_string (b, "status", sw_ascent_status_to_string (r->status));
  add_bool (b, "reached_orbit", r->reached_orbit);
  add_string (b, "reason", r->reason);
  add_notes_json (b, r->notes);
  add_string (b, "loss_model", r->closed_loop ? "simulate" : "allowance");
  sw_cli_add_number (b, "target_altitude_km", r->target_altitude_km);
  sw_cli_add_number (b, "perigee_km", r->perigee_km);
  sw_cli_add_number (b, "apogee_km", r->apogee_km);
  sw_cli_add_number (b, "launch_azimuth_deg", r->launch_azimuth_deg);
  sw_cli_add_number (b, "circular_velocity_m_s", r->circular_velocity_m_s);
  sw_cli_add_number (b, "ideal_delta_v_m_s", r->ideal_delta_v_m_s);
  sw_cli_add_number (b, "rotation_gain_m_s", r->rotation_gain_m_s);
  sw_cli_add_number (b, "gravity_loss_m_s", r->gravity_loss_m_s);
  sw_cli_add_number (b, "drag_loss_m_s", r->drag_loss_m_s);
  sw_cli_add_number (b, "steering_loss_m_s", r->steering_loss_m_s);
  sw_cli_add_number (b, "pressure_loss_m_s", r->pressure_loss_m_s);
  sw_cli_add_number (b, "fairing_loss_m_s", r->fairing_loss_m_s);
  sw_cli_add_number (b, "raising_loss_m_s", r->raising_loss_m_s);
  sw_cli_add_number (b, "other_loss_m_s", r->other_loss_m_s);
  sw_cli_add_number (b, "rotation_term_m_s", r->rotation_term_m_s);
  sw_cli_add_number (b, "gravity_loss_air_m_s", r->gravity_loss_air_m_s);
  sw_cli_add_number (b, "max_q_alpha_kpa_deg", r->max_q_alpha_kpa_deg);
  sw_cli_add_number (b, "losses_m_s", r->losses_m_s);
  sw_cli_add_number (b, "engines_delta_v_m_s", r->engines_delta_v_m_s);
  sw_cli_add_number (b, "delta_v_needed_m_s", r->delta_v_needed_m_s);
  sw_cli_add_number (b, "sized_delta_v_m_s", r->sized_delta_v_m_s);
  sw_cli_add_number (b, "delta_v_margin_m_s", r->delta_v_margin_m_s);
  sw_cli_add_number (b, "delta_v_missing_m_s", r->delta_v_missing_m_s);
  sw_cli_add_number (b, "propellant_beyond_load_kg", r->propellant_beyond_load_kg);
  sw_cli_add_number (b, "liftoff_mass_kg", sw_ascent_liftoff_mass (r));
  sw_cli_add_number (b, "liftoff_thrust_to_weight", r->liftoff_thrust_to_weight);
  sw_cli_add_number (b, "max_q_pa", r->max_q_pa);
  sw_cli_add_number (b, "max_q_time_s", r->max_q_time_s);
  sw_cli_add_number (b, "max_q_altitude_km", r->max_q_altitude_m / 1000.0);
  sw_cli_add_number (b, "max_axial_g", r->max_axial_g);
  sw_cli_add_number (b, "max_axial_g_time_s", r->max_axial_g_time_s);
  add_point (b, "cutoff", &r->cutoff, TRUE);
  sw_cli_add_number (b, "insertion_altitude_km", r->insertion_altitude_km);
  sw_cli_add_number (b, "transfer_perigee_km", r->transfer_perigee_km);
  sw_cli_add_number (b, "transfer_apogee_km", r->transfer_apogee_km);
  sw_cli_add_number (b, "circularization_m_s", r->circularization_m_s);
  sw_cli_add_number (b, "circularization_time_s", r->circularization_time_s);

  json_builder_set_member_name (b, "fairing");
  json_builder_begin_object (b);
  sw_cli_add_number (b, "mass_kg", r->fairing_mass_kg);
  add_bool (b, "dropped", r->fairing_dropped);
  sw_cli_add_number (b, "time_s", r->fairing_dropped ? r->fairing.time_s : NAN);
  sw_cli_add_number (b, "altitude_km", r->fairing_dropped ? r->fairing.altitude_m / 1000.0 : NAN);
  sw_cli_add_number (b, "dynamic_pressure_pa",
                     r->fairing_dropped ? r->fairing.dynamic_pressure_pa : NAN);
  /* Where the flight dropped it (stage index, share of that stage's
   * propellant burnt), and where the sizing assumed it (sw-sizing.h). */
  sw_cli_add_number (b, "stage", r->fairing_dropped ? (double) r->fairing_stage : NAN);
  sw_cli_add_number (b, "propellant_fraction", r->fairing_propellant_fraction);
  sw_cli_add_number (b, "sized_stage", r->sizing.fairing.mass_kg > 0.0
                                         ? (double) r->sizing.fairing.stage : NAN);
  sw_cli_add_number (b, "sized_propellant_fraction", r->sizing.fairing.mass_kg > 0.0
                                                       ? r->sizing.fairing.fraction : NAN);
  json_builder_end_object (b);

  if (r->sizing.boosters.present)
    {
      json_builder_set_member_name (b, "boosters");
      json_builder_begin_object (b);
      add_bool (b, "dropped", r->boosters_dropped);
      sw_cli_add_number (b, "time_s", r->boosters_dropped ? r->boosters.time_s : NAN);
      sw_cli_add_number (b, "altitude_km",
                         r->boosters_dropped ? r->boosters.altitude_m / 1000.0 : NAN);
      sw_cli_add_number (b, "speed_m_s", r->boosters_dropped ? r->boosters.speed_m_s : NAN);
      sw_cli_add_number (b, "dynamic_pressure_pa",
                         r->boosters_dropped ? r->boosters.dynamic_pressure_pa : NAN);
      json_builder_end_object (b);
    }

  json_builder_set_member_name (b, "guidance");
  json_builder_begin_object (b);
  sw_cli_add_number (b, "pitch_over_time_s", r->pitch_over_time_s);
  sw_cli_add_number (b, "pitch_kick_deg", r->pitch_kick_deg);
  add_bool (b, "pitch_kick_solved", r->pitch_kick_solved);
  sw_cli_add_number (b, "guidance_start_s", r->guidance_start_s);
  sw_cli_add_number (b, "steering_start_deg", r->steering_start_deg);
  sw_cli_add_number (b, "steering_end_deg", r->steering_end_deg);
  json_builder_set_member_name (b, "simulations");
  json_builder_add_int_value (b, r->guidance_iterations);
  json_builder_end_object (b);

  json_builder_set_member_name (b, "optimised_steering");
  if (optimised != NULL && optimised->done)
    {
      json_builder_begin_object (b);
      sw_cli_add_number (b, "guided_delta_v_needed_m_s", optimised->guided_needed_m_s);
      sw_cli_add_number (b, "delta_v_needed_m_s", optimised->needed_m_s);
      sw_cli_add_number (b, "saving_m_s", optimised->saving_m_s);
      add_bool (b, "improved", optimised->improved);
      sw_cli_add_number (b, "pitch_kick_deg", optimised->kick_deg);
      json_builder_set_member_name (b, "knots");
      json_builder_begin_array (b);
      for (guint k = 0; k < optimised->n_knots; k++)
        {
          json_builder_begin_object (b);
          sw_cli_add_number (b, "time_fraction", optimised->knot_time_fraction[k]);
          sw_cli_add_number (b, "tan_pitch_offset", optimised->knot_tan_offset[k]);
          json_builder_end_object (b);
        }
      json_builder_end_array (b);
      sw_cli_add_number (b, "perigee_km", optimised->perigee_km);
      sw_cli_add_number (b, "apogee_km", optimised->apogee_km);
      sw_cli_add_number (b, "cutoff_flight_path_deg", optimised->cutoff_flight_path_deg);
      sw_cli_add_number (b, "max_q_alpha_kpa_deg", optimised->max_q_alpha_kpa_deg);
      sw_cli_add_number (b, "max_q_alpha_guided_kpa_deg", optimised->max_q_alpha_guided_kpa_deg);
      json_builder_set_member_name (b, "steering_solves");
      json_builder_add_int_value (b, optimised->evaluations);
      json_builder_set_member_name (b, "simulations");
      json_builder_add_int_value (b, optimised->flights);
      json_builder_end_object (b);
    }
  else
    json_builder_add_null_value (b);

  json_builder_set_member_name (b, "closed_loop");
  if (r->closed_loop)
    {
      json_builder_begin_object (b);
      add_bool (b, "converged", r->loop_converged);
      json_builder_set_member_name (b, "passes");
      json_builder_add_int_value (b, r->loop_iterations);
      sw_cli_add_number (b, "sized_losses_m_s", r->loop_sized_losses_m_s);
      json_builder_set_member_name (b, "losses_m_s");
      json_builder_begin_array (b);
      for (guint i = 0; i < r->loop_iterations; i++)
        json_builder_add_double_value (b, r->loop_losses_m_s[i]);
      json_builder_end_array (b);
      json_builder_set_member_name (b, "liftoff_mass_kg");
      json_builder_begin_array (b);
      for (guint i = 0; i < r->loop_iterations; i++)
        if (isfinite (r->loop_liftoff_mass_kg[i]))
          json_builder_add_double_value (b, r->loop_liftoff_mass_kg[i]);
        else
          json_builder_add_null_value (b);
      json_builder_end_array (b);
      json_builder_end_object (b);
    }
  else
    json_builder_add_null_value (b);

  add_stages_json (b, d, r->stages, r->n_stages, TRUE);
  add_string (b, "caution", sw_format_cautions ());
  json_builder_end_object (b);
  return json_builder_get_root (b);
}

static char *
fmt (double v, int decimals)
{
  return sw_cli_format (v, decimals);
}

static void
print_stage_table (const SwDesign *d, const SwAscentStage *st, guint n, gboolean simulated)
{
  guint name_w = sw_cli_names_width (d, 20);
  g_autofree char *head = sw_cli_cell ("stage", name_w);

  g_print ("%-3s %s %10s %9s %8s %7s %6s %7s %7s", "#", head, "thrust kN", "mdot kg/s",
           "burn s", "coast s", "T/W", "T/W end", "ign T+");
  if (simulated)
    g_print (" %7s %8s %9s %7s", "end T+", "end km", "end m/s", "end deg");
  g_print ("\n");
  for (guint i = 0; i < n; i++)
    {
      const SwAscentStage *s = &st[i];
      g_autofree char *thr = fmt (s->thrust_vac_n / 1000.0, 0);
      g_autofree char *md = fmt (s->mass_flow_kg_s, 1);
      g_autofree char *bt = fmt (s->burn_time_s, 1);
      g_autofree char *co = fmt (s->coast_s, 1);
      g_autofree char *tw = fmt (s->ignition_thrust_to_weight, 2);
      g_autofree char *twb = fmt (s->burnout_thrust_to_weight, 2);
      g_autofree char *it = fmt (simulated ? s->ignition.time_s : NAN, 1);
      g_autofree char *name = sw_cli_cell (d->stages[i].name, name_w);

      g_print ("%-3u %s %10s %9s %8s %7s %6s %7s %7s", i + 1, name, thr, md, bt, co, tw, twb, it);
      if (simulated)
        {
          gboolean ok = isfinite (s->burnout.time_s);
          g_autofree char *et = fmt (s->burnout.time_s, 1);
          g_autofree char *ea = fmt (ok ? s->burnout.altitude_m / 1000.0 : NAN, 1);
          g_autofree char *ev = fmt (ok ? s->burnout.speed_m_s : NAN, 0);
          g_autofree char *eg = fmt (ok ? s->burnout.flight_path_deg : NAN, 1);
          g_print (" %7s %8s %9s %7s", et, ea, ev, eg);
        }
      g_print ("%s\n", !s->fires ? "  (no propellant)" : "");
    }
}

static void
print_notes (const char *notes)
{
  g_auto (GStrv) lines = g_strsplit (notes, "\n", -1);

  for (guint i = 0; lines[i] != NULL; i++)
    if (lines[i][0] != '\0')
      g_print (_("Note: %s\n"), lines[i]);
}

static void
print_ascent (const SwDesign *d, const SwAscentResult *r)
{
  g_autofree char *pe = fmt (r->perigee_km, 1);
  g_autofree char *ap = fmt (r->apogee_km, 1);

  g_print (_("Design: %s\n"), d->name);
  {
    g_autofree char *ta = fmt (r->target_altitude_km, 1);
    g_autofree char *az = fmt (r->launch_azimuth_deg, 2);
    g_autofree char *vc = fmt (r->circular_velocity_m_s, 1);
    g_print (_("Target: %s km circular, launch azimuth %s deg, circular speed %s m/s\n"), ta, az,
             vc);
  }
  if (r->closed_loop)
    {
      g_print (g_dngettext (GETTEXT_PACKAGE,
                            "Loss model: simulate (closed loop, %s after %u pass; losses sized:",
                            "Loss model: simulate (closed loop, %s after %u passes; losses sized:",
                            r->loop_iterations),
               r->loop_converged ? _("converged") : _("NOT converged"), r->loop_iterations);
      for (guint i = 0; i < r->loop_iterations; i++)
        g_print (" %s", sw_cli_num (r->loop_losses_m_s[i], 1));
      g_print (" m/s)\n");
    }
  else
    {
      g_autofree char *al = fmt (r->sized_delta_v_m_s - r->ideal_delta_v_m_s, 1);
      g_print (_("Loss model: allowance of %s m/s (the sizing's)\n"), al);
    }
  {
    g_autofree char *lm = fmt (sw_ascent_liftoff_mass (r) / 1000.0, 3);
    g_autofree char *tw = fmt (r->liftoff_thrust_to_weight, 3);
    if (r->fairing_mass_kg > 0.0)
      g_print (_("Liftoff mass: %s t, the %s kg fairing included    thrust-to-weight at "
                 "liftoff: %s\n"),
               lm, sw_cli_num (r->fairing_mass_kg, 0), tw);
    else
      g_print (_("Liftoff mass: %s t    thrust-to-weight at liftoff: %s\n"), lm, tw);
  }
  g_print ("\n");

  switch (r->status)
    {
    case SW_ASCENT_REACHED:
      g_print (_("ORBIT REACHED: perigee %s km, apogee %s km"), pe, ap);
      if (isfinite (r->delta_v_margin_m_s))
        g_print (_("; delta-v margin %s m/s"), sw_cli_num_signed (r->delta_v_margin_m_s, 1));
      g_print ("\n");
      break;
    case SW_ASCENT_SHORT:
      g_print (_("SHORT BY %s m/s of delta-v. %s\n"), sw_cli_num (r->delta_v_missing_m_s, 0),
               r->reason);
      break;
    case SW_ASCENT_NOT_SIMULATED:
    case SW_ASCENT_NO_SOLUTION:
    case SW_ASCENT_UNGUIDED:
    default:
      g_print (_("NO ORBIT: %s\n"), r->reason);
      break;
    }
  print_notes (r->notes);
  if (r->status == SW_ASCENT_NOT_SIMULATED || r->status == SW_ASCENT_NO_SOLUTION)
    {
      /* No flight worth showing: the stage figures only. */
      g_print ("\n");
      print_stage_table (d, r->stages, r->n_stages, FALSE);
      g_print ("\n%s\n", sw_format_cautions ());
      return;
    }

  g_print ("\n");
  print_stage_table (d, r->stages, r->n_stages, TRUE);

  if (isfinite (r->losses_m_s))
    {
      g_print (_("\nDelta-v budget (m/s)\n"));
      g_print (_("  ideal |v_orbit - v_site|   %9s   (rotation gain %s)\n"),
               sw_cli_num (r->ideal_delta_v_m_s, 1), sw_cli_num (r->rotation_gain_m_s, 1));
      g_print (_("  gravity loss               %9s   (inertial flight path; %s against the "
                 "air)\n"),
               sw_cli_num (r->gravity_loss_m_s, 1), sw_cli_num (r->gravity_loss_air_m_s, 1));
      g_print (_("  drag loss                  %9s\n"), sw_cli_num (r->drag_loss_m_s, 1));
      g_print (_("  steering loss              %9s\n"), sw_cli_num (r->steering_loss_m_s, 1));
      g_print (_("  back-pressure thrust loss  %9s\n"), sw_cli_num (r->pressure_loss_m_s, 1));
      g_print (_("  fairing dropped off plan   %9s\n"), sw_cli_num (r->fairing_loss_m_s, 1));
      if (isfinite (r->circularization_m_s))
        g_print (_("  orbit raising              %9s   (incl. %s m/s circularisation)\n"),
                 sw_cli_num (r->raising_loss_m_s, 1), sw_cli_num (r->circularization_m_s, 1));
      else
        g_print (_("  cutoff above circular speed%9s\n"), sw_cli_num (r->raising_loss_m_s, 1));
      g_print (_("  turning atmosphere         %9s   (thrust and drag against the air)\n"),
               sw_cli_num (r->rotation_term_m_s, 1));
      g_print (_("  residual                   %9s\n"),
               sw_cli_num (r->other_loss_m_s - r->rotation_term_m_s, 1));
      g_print (_("  losses, total              %9s\n"), sw_cli_num (r->losses_m_s, 1));
      g_print (_("  needed (ideal + losses)    %9s\n"), sw_cli_num (r->delta_v_needed_m_s, 1));
      g_print (_("  sized                      %9s   (margin %s)\n"),
               sw_cli_num (r->sized_delta_v_m_s, 1), sw_cli_num (r->delta_v_margin_m_s, 1));
    }
  g_print ("\n");
  {
    g_autofree char *q = fmt (r->max_q_pa / 1000.0, 1);
    g_autofree char *qt = fmt (r->max_q_time_s, 1);
    g_autofree char *qh = fmt (r->max_q_altitude_m / 1000.0, 1);
    g_autofree char *a = fmt (r->max_axial_g, 2);
    g_autofree char *at = fmt (r->max_axial_g_time_s, 1);
    g_print (_("Max-Q: %s kPa at T+%s s (%s km)    Max axial acceleration: %s g at T+%s s\n"), q,
             qt, qh, a, at);
  }
  if (r->boosters_dropped)
    g_print (_("Boosters: dropped at T+%s s, %s km, %s m/s\n"),
             sw_cli_num (r->boosters.time_s, 1), sw_cli_num (r->boosters.altitude_m / 1000.0, 1),
             sw_cli_num (r->boosters.speed_m_s, 0));
  if (r->fairing_mass_kg > 0.0)
    {
      if (r->fairing_dropped)
        g_print (_("Fairing: %s kg dropped at T+%s s, %s km, q = %s Pa\n"),
                 sw_cli_num (r->fairing_mass_kg, 0), sw_cli_num (r->fairing.time_s, 1),
                 sw_cli_num (r->fairing.altitude_m / 1000.0, 1),
                 sw_cli_num (r->fairing.dynamic_pressure_pa, 1));
      else
        g_print (_("Fairing: %s kg, not dropped\n"), sw_cli_num (r->fairing_mass_kg, 0));
    }
  {
    g_autofree char *po = fmt (r->pitch_over_time_s, 1);
    g_autofree char *k = fmt (r->pitch_kick_deg, 2);
    g_autofree char *s0 = fmt (r->steering_start_deg, 1);
    g_autofree char *s1 = fmt (r->steering_end_deg, 1);
    g_autofree char *gs = fmt (r->guidance_start_s, 1);
    g_print (_("Guidance: pitch-over at T+%s s, kick %s deg%s; linear tangent from T+%s s, pitch "
             "%s deg to %s deg (%u trajectories simulated)\n"),
             po, k, r->pitch_kick_solved ? " (least delta-v)" : "", gs, s0, s1,
             r->guidance_iterations);
  }
  if (r->status == SW_ASCENT_REACHED || r->status == SW_ASCENT_SHORT)
    g_print (_("Cutoff: T+%s s at %s km, %s m/s, flight-path %s deg\n"),
             sw_cli_num (r->cutoff.time_s, 1), sw_cli_num (r->cutoff.altitude_m / 1000.0, 1),
             sw_cli_num (r->cutoff.speed_m_s, 1), sw_cli_num (r->cutoff.flight_path_deg, 3));
  if (isfinite (r->circularization_m_s))
    g_print (_("Transfer: cutoff into %s x %s km, coast to apogee, circularisation burn of "
             "%s m/s at T+%s s (impulsive)\n"), sw_cli_num (r->transfer_perigee_km,
             1), sw_cli_num (r->transfer_apogee_km, 1), sw_cli_num (r->circularization_m_s,
             1), sw_cli_num (r->circularization_time_s, 0));
  g_print ("\n%s\n", sw_format_cautions ());
}

static gboolean
write_csv (const char *path, const SwDesign *d, const SwAscentResult *r)
{
  g_autoptr (GString) s = g_string_new (NULL);
  g_autoptr (GError) error = NULL;

  g_string_append_printf (s, "# Stagewright ascent time series: %s\n# %s\n", d->name,
                          sw_format_cautions ());
  g_string_append (s, "time_s,altitude_m,downrange_m,speed_m_s,air_speed_m_s,flight_path_deg,"
                      "dynamic_pressure_pa,mach,axial_accel_g,mass_kg,thrust_n,stage,"
                      "beyond_load,pitch_deg\n");
  for (guint i = 0; i < r->samples->len; i++)
    {
      const SwAscentSample *p = &g_array_index (r->samples, SwAscentSample, i);
      double v[] = { p->time_s, p->altitude_m, p->downrange_m, p->speed_m_s, p->air_speed_m_s,
                     p->flight_path_deg, p->dynamic_pressure_pa, p->mach, p->axial_accel_g,
                     p->mass_kg, p->thrust_n };
      for (guint k = 0; k < G_N_ELEMENTS (v); k++)
        {
          char buf[G_ASCII_DTOSTR_BUF_SIZE];
          /* Plain C numbers whatever the locale (the text output follows it). */
          if (isfinite (v[k]))
            g_string_append (s, g_ascii_formatd (buf, sizeof buf, "%.9g", v[k]));
          g_string_append_c (s, ',');
        }
      g_string_append_printf (s, "%u,%d,", p->stage + 1, p->beyond_load ? 1 : 0);
      if (isfinite (p->pitch_deg))
        {
          char buf[G_ASCII_DTOSTR_BUF_SIZE];
          g_string_append (s, g_ascii_formatd (buf, sizeof buf, "%.9g", p->pitch_deg));
        }
      g_string_append_c (s, '\n');
    }
  if (!g_file_set_contents_full (path, s->str, (gssize) s->len,
                                 G_FILE_SET_CONTENTS_CONSISTENT, 0644, &error))
    {
      g_printerr (_("error: could not write %s: %s\n"), path, error->message);
      return FALSE;
    }
  return TRUE;
}

static int
no_simulation (const SwAnalysis *a, const char *why)
{
  const SwDesign *d = a->design;

  if (!a->has_stage_figures)
    {
      g_printerr (_("error: %s\n"), why);
      return SW_EXIT_USAGE;
    }
  if (opt_json)
    {
      g_autoptr (JsonBuilder) b = json_builder_new_immutable ();
      g_autoptr (JsonNode) node = NULL;

      json_builder_begin_object (b);
      add_string (b, "name", d->name);
      sw_cli_add_verdict (b, a);
      add_bool (b, "simulated", FALSE);
      add_bool (b, "reached_orbit", FALSE);
      add_string (b, "reason", why);
      sw_cli_add_number (b, "liftoff_mass_kg", a->sizing.liftoff_mass_kg);
      add_stages_json (b, d, a->stage_figures, d->n_stages, FALSE);
      add_string (b, "caution", sw_format_cautions ());
      json_builder_end_object (b);
      node = json_builder_get_root (b);
      sw_cli_print_json (node);
    }
  else
    {
      sw_cli_print_verdict (a);
      g_print (_("\nDesign: %s\n\nNo ascent simulated: %s\n\n"), d->name, why);
      print_stage_table (d, a->stage_figures, d->n_stages, FALSE);
      g_print (_("\nFirst stage: sea-level thrust with the fairing; upper stages: vacuum "
                 "thrust.\n\n%s\n"), sw_format_cautions ());
    }
  return SW_EXIT_OK;
}

int
sw_cli_ascent (int argc, char **argv)
{
  g_autoptr (SwAnalysis) a = NULL;
  g_autofree char *csv = NULL;
  SwAnalysisOptions o;
  const SwAscentResult *r;
  const SwDesign *d;
  int code;

  opt_json = FALSE;
  opt_csv = NULL;
  opt_optimise = FALSE;
  optimised = NULL;
  if (!sw_cli_parse ("ascent", ascent_entries, &argc, &argv, 1, &code))
    return code;
  csv = g_steal_pointer (&opt_csv);
  sw_analysis_options_init (&o);
  o.montecarlo = FALSE;
  if ((a = sw_cli_analyse (argv[1], &o, &code)) == NULL)
    return code;
  d = a->design;

  if (d->mission.kind != SW_MISSION_ORBIT)
    {
      if (csv != NULL)
        {
          g_printerr (_("error: %s: no time series to write: the design states its delta-v "
                        "directly, so no ascent is simulated\n"), argv[1]);
          return SW_EXIT_USAGE;
        }
      return no_simulation (a, _("the design states its delta-v directly (mission.delta_v_m_s); "
                                 "an ascent needs a target orbit (mission.orbit). Below: "
                                 "thrust, burn time and thrust-to-weight from the sized "
                                 "masses."));
    }
  r = a->ascent;
  if (r == NULL)
    {
      g_printerr (_("error: %s: %s\n"), argv[1], a->ascent_message);
      return SW_EXIT_USAGE;
    }
  if (csv != NULL && !write_csv (csv, d, r))
    return SW_EXIT_FAILURE;
  if (opt_optimise)
    {
      /* Into a copy of the flight's figures: the analysis's ascent stays
       * as it is. */
      g_autoptr (GError) error = NULL;

      memcpy (&optimised_copy, r, sizeof optimised_copy);
      if (!sw_ascent_optimise_steering (d, &optimised_copy, NULL, &error))
        {
          g_printerr (_("error: %s: %s\n"), argv[1], error->message);
          return SW_EXIT_FAILURE;
        }
      optimised = &optimised_copy.optimised;
    }
  if (opt_json)
    {
      g_autoptr (JsonNode) node = ascent_to_json (a);
      sw_cli_print_json (node);
    }
  else
    {
      sw_cli_print_verdict (a);
      g_print ("\n");
      print_ascent (d, r);
      if (optimised != NULL && optimised->done && isfinite (optimised->needed_m_s))
        {
          g_autofree char *sv = sw_format_speed (MAX (optimised->saving_m_s, 0.0));
          g_autofree char *gn = sw_format_speed (optimised->guided_needed_m_s);
          g_autofree char *on = sw_format_speed (optimised->needed_m_s);
          g_print ("\n");
          if (optimised->improved)
            g_print (_("Optimised steering saves %s over the guided law (delta-v needed %s "
                       "against %s).\n"), sv, on, gn);
          else
            g_print (_("Optimised steering found no saving over the guided law (delta-v "
                       "needed %s against %s).\n"), on, gn);
        }
      else if (optimised != NULL && optimised->done)
        g_print (_("\nOptimised steering: no better steering reached the orbit.\n"));
    }
  return SW_EXIT_OK;
}

/* ---- atmosphere -------------------------------------------------------- */

int
sw_cli_atmosphere (int argc, char **argv)
{
  SwAtmosphere a;
  char *end = NULL;
  double z;
  int code;

  opt_json = FALSE;
  if (!sw_cli_parse ("atmosphere", json_entries, &argc, &argv, 1, &code))
    return code;
  z = g_ascii_strtod (argv[1], &end);
  if (end == argv[1] || *end != '\0' || !isfinite (z))
    {
      g_printerr (_("stagewright-cli atmosphere: \"%s\" is not an altitude in metres\n"), argv[1]);
      return SW_EXIT_USAGE;
    }
  if (!sw_atmosphere_at (z, &a))
    {
      g_printerr (_("stagewright-cli atmosphere: %g m is outside the model's range, %g to %g m\n"),
                  z, SW_ATMOSPHERE_MIN_ALTITUDE_M, SW_ATMOSPHERE_MAX_ALTITUDE_M);
      return SW_EXIT_USAGE;
    }
  if (opt_json)
    {
      g_autoptr (JsonBuilder) b = json_builder_new_immutable ();
      g_autoptr (JsonNode) node = NULL;

      json_builder_begin_object (b);
      sw_cli_add_number (b, "altitude_m", z);
      sw_cli_add_number (b, "geopotential_altitude_m", sw_atmosphere_geopotential (z));
      sw_cli_add_number (b, "temperature_k", a.temperature_k);
      sw_cli_add_number (b, "pressure_pa", a.pressure_pa);
      sw_cli_add_number (b, "density_kg_m3", a.density_kg_m3);
      sw_cli_add_number (b, "speed_of_sound_m_s", a.speed_of_sound_m_s);
      add_string (b, "model", z <= SW_ATMOSPHERE_LAYERED_TOP_M
                                ? "1976 U.S. Standard Atmosphere"
                                : "smooth approximation of the 1976 U.S. Standard Atmosphere "
                                  "above 86 km (ours)");
      json_builder_end_object (b);
      node = json_builder_get_root (b);
      sw_cli_print_json (node);
      return SW_EXIT_OK;
    }
  g_print (_("Altitude: %s m geometric (%s m' geopotential)\n"), sw_cli_num (z, 1),
           sw_cli_num (sw_atmosphere_geopotential (z), 1));
  g_print (_("  temperature      %14s K\n"), sw_cli_num (a.temperature_k, 3));
  g_print (_("  pressure         %14.6g Pa\n"), a.pressure_pa);
  g_print (_("  density          %14.6g kg/m^3\n"), a.density_kg_m3);
  g_print (_("  speed of sound   %14s m/s\n"), sw_cli_num (a.speed_of_sound_m_s, 2));
  g_print (_("Model: %s\n"),
           z <= SW_ATMOSPHERE_LAYERED_TOP_M
             ? "1976 U.S. Standard Atmosphere (NOAA-S/T 76-1562)"
             : "above 86 km a smooth approximation of ours through the 1976 standard's "
               "tabulated values; the speed of sound is sqrt(1.4 p / rho)");
  return SW_EXIT_OK;
}
