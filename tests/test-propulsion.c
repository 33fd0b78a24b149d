/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The propulsion and aerodynamics keys: loading, saving, checks, and what
 * follows from them (thrust against pressure, mass flow, burn time). */
#include "config.h"

#include "sw-ascent.h"
#include "sw-design.h"
#include "sw-propulsion.h"
#include "sw-sizing.h"

#include <math.h>
#include <string.h>

#define HEAD \
  "{ \"format\": \"stagewright-design\", \"version\": 1, \"name\": \"t\", \"payload_kg\": 1000," \
  " \"mission\": { \"orbit\": { \"altitude_km\": 200, \"inclination_deg\": 28.5," \
  " \"site_latitude_deg\": 28.5 }, \"losses_m_s\": 1600 }, \"split\": \"optimal\","

static const char *full =
  HEAD
  " \"stages\": ["
  "  { \"name\": \"a\", \"isp_vac_s\": 320, \"isp_sl_s\": 285, \"structural_coefficient\": 0.07,"
  "    \"engine_thrust_vac_kn\": 100, \"engine_count\": 9, \"diameter_m\": 3.0,"
  "    \"drag_coefficients\": [[0, 0.3], [1.1, 0.55], [3, 0.3]] },"
  "  { \"name\": \"b\", \"isp_vac_s\": 345, \"structural_coefficient\": 0.09,"
  "    \"thrust_vac_kn\": 150, \"coast_before_ignition_s\": 4.5 } ],"
  " \"ascent\": { \"fairing_mass_kg\": 400, \"fairing_jettison_dynamic_pressure_pa\": 3,"
  "   \"pitch_over_speed_m_s\": 60, \"pitch_kick_deg\": 2.5 } }";

static SwDesign *
load (const char *text, GPtrArray *warnings, GError **error)
{
  return sw_design_load_data (text, -1, "test.stagewright", warnings, error);
}

static void
test_load_save (void)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) d = load (full, NULL, &error);
  g_autoptr (SwDesign) again = NULL;
  g_autofree char *text = NULL;
  const SwStagePropulsion *p0, *p1;

  g_assert_no_error (error);
  p0 = &d->stages[0].propulsion;
  p1 = &d->stages[1].propulsion;
  g_assert_true (p0->present && p0->has_engine_thrust && !p0->has_thrust);
  g_assert_cmpfloat (p0->engine_thrust_vac_kn, ==, 100.0);
  g_assert_cmpuint (d->stages[0].reliability.engine_count, ==, 9);
  g_assert_cmpfloat (p0->diameter_m, ==, 3.0);
  g_assert_cmpuint (p0->n_drag, ==, 3);
  g_assert_cmpfloat (p0->drag_mach[1], ==, 1.1);
  g_assert_cmpfloat (p0->drag_cd[1], ==, 0.55);
  g_assert_true (p1->has_thrust && p1->has_coast && !p1->has_diameter);
  g_assert_cmpfloat (p1->coast_before_ignition_s, ==, 4.5);
  g_assert_true (d->ascent.present && d->ascent.has_fairing_pressure);
  g_assert_cmpfloat (d->ascent.fairing_mass_kg, ==, 400.0);
  g_assert_cmpfloat (d->ascent.pitch_kick_deg, ==, 2.5);

  /* load -> save -> load gives the same design */
  text = sw_design_to_data (d, NULL);
  again = load (text, NULL, &error);
  g_assert_no_error (error);
  g_assert_true (sw_design_equal (d, again));
  g_assert_nonnull (strstr (text, "\"drag_coefficients\""));
  g_assert_nonnull (strstr (text, "\"ascent\""));
}

static void
test_no_keys_saved_without_them (void)
{
  static const char *plain =
    HEAD " \"stages\": [ { \"isp_vac_s\": 320, \"structural_coefficient\": 0.07 } ] }";
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) d = load (plain, NULL, &error);
  g_autofree char *text = NULL;

  g_assert_no_error (error);
  g_assert_false (d->stages[0].propulsion.present);
  g_assert_false (d->ascent.present);
  text = sw_design_to_data (d, NULL);
  g_assert_null (strstr (text, "thrust"));
  g_assert_null (strstr (text, "\"ascent\""));
}

/* Each bad input must give an error that names the field. */
static void
test_bad_input (void)
{
  static const struct { const char *stage0; const char *ascent; const char *field; } cases[] = {
    { "\"thrust_vac_kn\": 0", NULL, "thrust_vac_kn" },
    { "\"thrust_vac_kn\": -5", NULL, "thrust_vac_kn" },
    { "\"thrust_vac_kn\": \"big\"", NULL, "thrust_vac_kn" },
    { "\"diameter_m\": -2", NULL, "diameter_m" },
    { "\"diameter_m\": 0", NULL, "diameter_m" },
    { "\"thrust_vac_kn\": 100, \"engine_thrust_vac_kn\": 50, \"engine_count\": 2", NULL,
      "engine_thrust_vac_kn" },
    { "\"engine_thrust_vac_kn\": 50", NULL, "engine_thrust_vac_kn" },
    { "\"coast_before_ignition_s\": 5", NULL, "coast_before_ignition_s" },
    { "\"drag_coefficients\": [[0, 0.3], [0, 0.4]]", NULL, "drag_coefficients[1]" },
    { "\"drag_coefficients\": [[0, 0]]", NULL, "drag_coefficients[0]" },
    { "\"drag_coefficients\": [[0, 0.3, 1]]", NULL, "drag_coefficients[0]" },
    { "\"drag_coefficients\": 0.3", NULL, "drag_coefficients" },
    { "\"drag_coefficients\": []", NULL, "drag_coefficients" },
    { NULL, "\"fairing_mass_kg\": 300", "fairing_mass_kg" },
    { NULL, "\"fairing_mass_kg\": 300, \"fairing_jettison_altitude_km\": 110, "
            "\"fairing_jettison_dynamic_pressure_pa\": 5", "fairing_jettison" },
    { NULL, "\"fairing_jettison_altitude_km\": 5", "fairing_jettison_altitude_km" },
    { NULL, "\"pitch_kick_deg\": 0", "pitch_kick_deg" },
    { NULL, "\"pitch_over_speed_m_s\": 1e400", "pitch_over_speed_m_s" },
  };

  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      g_autoptr (GError) error = NULL;
      g_autoptr (SwDesign) d = NULL;
      g_autofree char *text = g_strdup_printf (
        HEAD " \"stages\": [ { \"isp_vac_s\": 320, \"isp_sl_s\": 285,"
             " \"structural_coefficient\": 0.07%s%s } ]%s%s%s }",
        cases[i].stage0 ? ", " : "", cases[i].stage0 ? cases[i].stage0 : "",
        cases[i].ascent ? ", \"ascent\": { " : "", cases[i].ascent ? cases[i].ascent : "",
        cases[i].ascent ? " }" : "");

      d = load (text, NULL, &error);
      if (d != NULL)
        g_error ("case %u loaded but should fail: %s", i, text);
      g_assert_nonnull (error);
      if (strstr (error->message, cases[i].field) == NULL
          || strstr (error->message, "test.stagewright") == NULL)
        g_error ("case %u: the error does not name the file and %s: %s", i, cases[i].field,
                 error->message);
    }
}

static void
test_unknown_ascent_key_warns (void)
{
  g_autoptr (GPtrArray) warnings = g_ptr_array_new_with_free_func (g_free);
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) d = load (HEAD " \"stages\": [ { \"isp_vac_s\": 320,"
                                      " \"structural_coefficient\": 0.07 } ],"
                                      " \"ascent\": { \"fairing_colour\": \"red\" } }",
                                 warnings, &error);

  g_assert_no_error (error);
  g_assert_cmpuint (warnings->len, ==, 1);
  g_assert_nonnull (strstr (warnings->pdata[0], "ascent.fairing_colour"));
}

static void
test_thrust_against_pressure (void)
{
  /* The thrust equation F = mdot v_e + (p_e - p_a) A_e (Sutton, Rocket
   * Propulsion Elements, ch. 2; from memory) is linear in the ambient
   * pressure at fixed mass flow, so F and Isp fall linearly from vacuum to
   * sea level, with F_sl / F_vac = Isp_sl / Isp_vac. */
  double fv = 1.0e6;

  g_assert_cmpfloat_with_epsilon (sw_propulsion_thrust_at (fv, 320, 285, 0.0), fv, 1e-6);
  g_assert_cmpfloat_with_epsilon (sw_propulsion_thrust_at (fv, 320, 285, 101325.0),
                                  fv * 285.0 / 320.0, 1e-6);
  g_assert_cmpfloat_with_epsilon (sw_propulsion_thrust_at (fv, 320, 285, 101325.0 / 2),
                                  fv * (1.0 + 285.0 / 320.0) / 2.0, 1e-6);
  g_assert_cmpfloat_with_epsilon (sw_propulsion_isp_at (320, 285, 101325.0 / 4),
                                  320.0 - 35.0 / 4.0, 1e-9);
  /* A vacuum-only nozzle (Isp_sl 0) gives nothing at sea level, never less. */
  g_assert_cmpfloat (sw_propulsion_thrust_at (fv, 320, 0, 2 * 101325.0), ==, 0.0);
}

static void
test_mass_flow_and_burn_time (void)
{
  /* Isp = F / (mdot g0), the definition with g0 = 9.80665 m/s^2 (3rd CGPM):
   * 1 MN at 300 s is 339.9 kg/s (computed). */
  double mdot = sw_propulsion_mass_flow (1.0e6, 300.0);
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) d = load (full, NULL, &error);
  SwAscentStage st[SW_MAX_STAGES];
  SwSizing s;
  double fv0 = 900.0e3, w0;

  g_assert_cmpfloat_with_epsilon (mdot, 1.0e6 / (300.0 * 9.80665), 1e-9);
  g_assert_cmpfloat_with_epsilon (mdot, 339.9, 0.05);

  g_assert_no_error (error);
  g_assert_true (sw_size_design (d, &s, &error));
  g_assert_true (sw_ascent_stage_figures (d, &s, st, &error));
  g_assert_no_error (error);
  /* 9 engines of 100 kN */
  g_assert_cmpfloat_with_epsilon (st[0].thrust_vac_n, fv0, 1e-6);
  g_assert_cmpfloat_with_epsilon (st[0].thrust_sl_n, fv0 * 285.0 / 320.0, 1e-6);
  g_assert_cmpfloat_with_epsilon (st[0].mass_flow_kg_s, fv0 / (320.0 * 9.80665), 1e-9);
  g_assert_cmpfloat_with_epsilon (st[0].burn_time_s,
                                  s.stages[0].propellant_mass_kg / st[0].mass_flow_kg_s, 1e-9);
  /* Liftoff: sea-level thrust against the sized mass, which carries the
   * 400 kg fairing (dropped by default at the second stage's ignition). */
  g_assert_cmpfloat (s.fairing.mass_kg, ==, 400.0);
  g_assert_cmpuint (s.fairing.stage, ==, 1);
  g_assert_cmpfloat (s.stages[1].initial_mass_kg - s.stages[1].payload_mass_kg
                     - s.stages[1].stage_mass_kg, ==, 400.0);
  w0 = s.stages[0].initial_mass_kg * 9.80665;
  g_assert_cmpfloat_with_epsilon (st[0].ignition_thrust_to_weight, fv0 * 285.0 / 320.0 / w0,
                                  1e-12);
  g_assert_cmpfloat_with_epsilon (st[1].ignition_thrust_to_weight,
                                  150.0e3 / (s.stages[1].initial_mass_kg * 9.80665), 1e-12);
  g_assert_cmpfloat (st[1].coast_s, ==, 4.5);
}

static void
test_drag_table (void)
{
  SwStagePropulsion p = { 0 };

  /* The generic table: about 0.3 subsonic with its transonic peak near Mach
   * 1.1 (common practice for slender vehicles). */
  g_assert_cmpfloat_with_epsilon (sw_propulsion_drag_coefficient (NULL, 0.0), 0.30, 1e-12);
  for (double m = 0.0; m < 10.0; m += 0.05)
    g_assert_cmpfloat (sw_propulsion_drag_coefficient (NULL, m), <=,
                       sw_propulsion_drag_coefficient (NULL, 1.1) + 1e-12);
  g_assert_cmpfloat (sw_propulsion_drag_coefficient (NULL, 1.1), >,
                     1.5 * sw_propulsion_drag_coefficient (NULL, 0.5));
  /* A table of one's own: linear between the points, constant beyond. */
  p.n_drag = 2;
  p.drag_mach[0] = 1.0;
  p.drag_cd[0] = 0.4;
  p.drag_mach[1] = 3.0;
  p.drag_cd[1] = 0.2;
  g_assert_cmpfloat_with_epsilon (sw_propulsion_drag_coefficient (&p, 2.0), 0.3, 1e-12);
  g_assert_cmpfloat_with_epsilon (sw_propulsion_drag_coefficient (&p, 0.2), 0.4, 1e-12);
  g_assert_cmpfloat_with_epsilon (sw_propulsion_drag_coefficient (&p, 9.0), 0.2, 1e-12);
}

static void
test_validate_in_memory (void)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) d = load (full, NULL, &error);

  g_assert_no_error (error);
  d->stages[1].propulsion.thrust_vac_kn = 0.0;
  g_assert_false (sw_propulsion_validate_stage (&d->stages[1].propulsion, 1, NULL, "stages[1]",
                                                &error));
  g_assert_nonnull (strstr (error->message, "stages[1].thrust_vac_kn"));
  g_clear_error (&error);
  g_assert_false (sw_ascent_check_inputs (d, &error));
  g_assert_nonnull (strstr (error->message, "thrust_vac_kn"));
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/core/propulsion/load-save", test_load_save);
  g_test_add_func ("/core/propulsion/no-keys-saved-without-them", test_no_keys_saved_without_them);
  g_test_add_func ("/core/propulsion/bad-input", test_bad_input);
  g_test_add_func ("/core/propulsion/unknown-ascent-key-warns", test_unknown_ascent_key_warns);
  g_test_add_func ("/core/propulsion/thrust-against-pressure", test_thrust_against_pressure);
  g_test_add_func ("/core/propulsion/mass-flow-and-burn-time", test_mass_flow_and_burn_time);
  g_test_add_func ("/core/propulsion/drag-table", test_drag_table);
  g_test_add_func ("/core/propulsion/validate-in-memory", test_validate_in_memory);
  return g_test_run ();
}
