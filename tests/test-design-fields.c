/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The named edits of every key (sw-design-fields.c), the thrust from a
 * thrust-to-weight (sw-stage-thrust.c) and the shortest exact decimals of
 * a saved file.  Suite 'core'. */
#include "config.h"

#include "sw-design-fields.h"
#include "sw-limits.h"
#include "sw-sizing.h"
#include "sw-stage-thrust.h"

#include <math.h>
#include <string.h>

/* A one-stage design whose ignition mass has a closed form. */
static SwDesign *
one_stage (void)
{
  SwDesign *d = sw_design_new_default ();

  d->n_stages = 1;
  memset (&d->stages[1], 0, sizeof d->stages[1]);
  d->split = SW_SPLIT_EQUAL;
  d->payload_kg = 1000.0;
  d->mission.delta_v_m_s = 3000.0;
  d->stages[0].isp_vac_s = 300.0;
  d->stages[0].has_isp_sl = TRUE;
  d->stages[0].isp_sl_s = 270.0;
  d->stages[0].structural_coefficient = 0.1;
  d->stages[0].has_share = FALSE;
  d->stages[0].delta_v_share = 0.0;
  g_assert_true (sw_design_validate (d, NULL, NULL));
  return d;
}

static SwDesign *
orbit_design (void)
{
  SwDesign *d = sw_design_new_default ();

  d->mission.kind = SW_MISSION_ORBIT;
  d->mission.altitude_km = 400.0;
  d->mission.inclination_deg = 51.6;
  d->mission.site_latitude_deg = 28.5;
  d->mission.losses_m_s = 1500.0;
  d->mission.has_losses = TRUE;
  g_assert_true (sw_design_validate (d, NULL, NULL));
  return d;
}

/* The design saved and loaded back equals the design in memory. */
static void
assert_round_trip (const SwDesign *d)
{
  g_autoptr (GError) error = NULL;
  g_autofree char *data = sw_design_to_data (d, NULL);
  g_autoptr (SwDesign) back = sw_design_load_data (data, -1, "mem", NULL, &error);

  g_assert_no_error (error);
  g_assert_true (sw_design_equal (back, d));
}

/* A value in the middle of each key's range is set, read back and saved. */
static void
test_every_field_sets (void)
{
  for (SwDesignField f = 0; f < SW_N_FIELDS; f++)
    {
      const SwDesignFieldInfo *info = sw_design_field_info (f);
      const SwLimit *l = sw_limit_get (info->limit);
      g_autoptr (SwDesign) d = f <= SW_FIELD_LOSSES && f != SW_FIELD_PAYLOAD
                               && f != SW_FIELD_DELTA_V ? orbit_design () : sw_design_new_default ();
      g_autoptr (GError) error = NULL;
      g_autofree char *path = sw_design_field_dup_path (f, 1);
      double value = (l->min + l->max) / 2.0, back;
      guint stage = info->per_stage ? 1 : 0;

      if (info->whole)
        value = floor (value);
      /* Values that the rules between keys accept. */
      if (f == SW_FIELD_ISP_SL)
        value = 300.0;
      if (f == SW_FIELD_FAILURES_TOLERATED)
        {
          g_assert_true (sw_design_field_set (d, SW_FIELD_ENGINE_COUNT, 1, 9.0, NULL));
          value = 2.0;
        }
      if (f == SW_FIELD_ENGINE_THRUST_VAC)
        g_assert_true (sw_design_field_set (d, SW_FIELD_ENGINE_COUNT, 1, 3.0, NULL));
      if (f == SW_FIELD_FAIRING_MASS)
        g_assert_true (sw_design_field_set (d, SW_FIELD_FAIRING_ALTITUDE, 0, 110.0, NULL));
      if (f == SW_FIELD_INCLINATION)
        value = 60.0;
      if (f == SW_FIELD_SITE_LATITUDE)
        value = 10.0;
      if (f == SW_FIELD_PITCH_KICK)
        value = 2.5;
      /* The mixture ratio needs a liquid propellant, the component
       * densities one of the user's own. */
      if (f == SW_FIELD_MIXTURE_RATIO || f == SW_FIELD_OXIDIZER_DENSITY
          || f == SW_FIELD_FUEL_DENSITY)
        g_assert_true (sw_design_set_propellant (d, 1, SW_PROPELLANT_CUSTOM, NULL));
      /* The boosters' keys need boosters, and boosters a core thrust. */
      if (f >= SW_FIELD_BOOSTER_COUNT && f <= SW_FIELD_BOOSTER_FUEL_DENSITY)
        {
          g_assert_true (sw_design_field_set (d, SW_FIELD_THRUST_VAC, 0, 2000.0, NULL));
          if (f != SW_FIELD_BOOSTER_COUNT)
            g_assert_true (sw_design_field_set (d, SW_FIELD_BOOSTER_COUNT, 0, 2.0, NULL));
        }
      if (f == SW_FIELD_BOOSTER_ISP_SL)
        value = 200.0;
      if (f == SW_FIELD_BOOSTER_MIXTURE_RATIO || f == SW_FIELD_BOOSTER_OXIDIZER_DENSITY
          || f == SW_FIELD_BOOSTER_FUEL_DENSITY)
        g_assert_true (sw_design_set_booster_propellant (d, SW_PROPELLANT_CUSTOM, NULL));
      if (!sw_design_field_set (d, f, stage, value, &error))
        g_error ("%s = %g: %s", path, value, error->message);
      g_assert_true (sw_design_field_get (d, f, stage, &back));
      g_assert_cmpfloat (back, ==, value);
      assert_round_trip (d);
      {
        g_autofree char *data = sw_design_to_data (d, NULL);
        const char *key = strrchr (info->path, '.') ? strrchr (info->path, '.') + 1 : info->path;
        g_autofree char *quoted = g_strdup_printf ("\"%s\"", key);
        if (strstr (data, quoted) == NULL)
          g_error ("%s: the saved file has no %s", path, quoted);
      }
    }
}

/* Out of range, not finite, not whole: an error naming the path and the
 * range, and the design as it was. */
static void
test_out_of_range_unchanged (void)
{
  for (SwDesignField f = 0; f < SW_N_FIELDS; f++)
    {
      const SwDesignFieldInfo *info = sw_design_field_info (f);
      const SwLimit *l = sw_limit_get (info->limit);
      const double bad[] = { l->min - fabs (l->min) - 1.0, l->max * 2.0 + 1.0, NAN, INFINITY };
      g_autoptr (SwDesign) d = orbit_design ();
      g_autoptr (SwDesign) before = sw_design_copy (d);
      g_autofree char *path = sw_design_field_dup_path (f, 0);

      for (guint k = 0; k < G_N_ELEMENTS (bad); k++)
        {
          g_autoptr (GError) error = NULL;

          g_assert_false (sw_design_field_set (d, f, 0, bad[k], &error));
          g_assert_nonnull (error);
          g_assert_nonnull (strstr (error->message, path));
          if (isfinite (bad[k]))
            g_assert_nonnull (strstr (error->message, "accepted range"));
          g_assert_true (sw_design_equal (d, before));
        }
      if (info->whole)
        {
          g_autoptr (GError) error = NULL;
          g_assert_false (sw_design_field_set (d, f, 0, l->min + 0.5, &error));
          g_assert_nonnull (strstr (error->message, "whole number"));
          g_assert_true (sw_design_equal (d, before));
        }
    }
}

/* A required key cannot be left out; an optional one is, and then the file
 * does not carry it. */
static void
test_unset (void)
{
  g_autoptr (SwDesign) d = orbit_design ();
  g_autoptr (GError) error = NULL;
  g_autofree char *data = NULL;

  g_assert_false (sw_design_field_unset (d, SW_FIELD_PAYLOAD, 0, &error));
  g_assert_nonnull (strstr (error->message, "payload_kg: required"));
  g_assert_true (sw_design_field_set (d, SW_FIELD_DIAMETER, 0, 3.7, NULL));
  g_assert_true (d->stages[0].propulsion.present);
  g_assert_true (sw_design_field_unset (d, SW_FIELD_DIAMETER, 0, NULL));
  g_assert_false (d->stages[0].propulsion.present);
  g_assert_false (sw_design_field_get (d, SW_FIELD_DIAMETER, 0, NULL));
  g_assert_true (sw_design_field_set (d, SW_FIELD_MC_SEED, 0, 4294967295.0, NULL));
  g_assert_cmpuint (d->uncertainty.seed, ==, 4294967295u);
  g_assert_true (sw_design_field_unset (d, SW_FIELD_MC_SEED, 0, NULL));
  g_assert_cmpuint (sw_uncertainty_seed (&d->uncertainty), ==, SW_UNCERTAINTY_DEFAULT_SEED);
  g_assert_true (sw_design_field_unset (d, SW_FIELD_ISP_SL, 0, NULL));
  g_assert_false (d->stages[0].has_isp_sl);
  data = sw_design_to_data (d, NULL);
  g_assert_null (strstr (data, "diameter_m"));
  g_assert_null (strstr (data, "isp_sl_s\" : 2"));
  assert_round_trip (d);
}

/* A conflict between keys is an error on the edited key; the other key is
 * never changed to make room. */
static void
test_dependencies (void)
{
  g_autoptr (SwDesign) d = sw_design_new_default ();
  g_autoptr (SwDesign) before = NULL;
  g_autoptr (GError) error = NULL;

  /* Stage 1 of the default design: vacuum 320 s, sea level 285 s. */
  before = sw_design_copy (d);
  g_assert_false (sw_design_field_set (d, SW_FIELD_ISP_VAC, 0, 200.0, &error));
  g_assert_cmpstr (error->message, ==, "stages[0].isp_vac_s: 200 s is below the stage's "
                   "sea-level Isp of 285 s; lower the sea-level Isp first");
  g_assert_cmpfloat (d->stages[0].isp_sl_s, ==, 285.0);
  g_assert_true (sw_design_equal (d, before));
  g_clear_error (&error);
  g_assert_false (sw_design_field_set (d, SW_FIELD_ISP_SL, 0, 321.0, &error));
  g_assert_nonnull (strstr (error->message, "above the stage's vacuum Isp of 320 s"));
  g_clear_error (&error);
  g_assert_true (sw_design_field_set (d, SW_FIELD_ISP_VAC, 0, 285.0, NULL));

  g_assert_false (sw_design_field_set (d, SW_FIELD_FAILURES_TOLERATED, 0, 1.0, &error));
  g_assert_nonnull (strstr (error->message, "engine_failures_tolerated"));
  g_clear_error (&error);
  g_assert_true (sw_design_field_set (d, SW_FIELD_ENGINE_COUNT, 0, 9.0, NULL));
  g_assert_true (sw_design_field_set (d, SW_FIELD_FAILURES_TOLERATED, 0, 1.0, NULL));
  g_assert_false (sw_design_field_set (d, SW_FIELD_ENGINE_COUNT, 0, 1.0, &error));
  g_assert_nonnull (strstr (error->message, "lower the failures tolerated first"));
  g_clear_error (&error);
  g_assert_false (sw_design_field_unset (d, SW_FIELD_ENGINE_COUNT, 0, &error));
  g_clear_error (&error);

  g_assert_true (sw_design_field_set (d, SW_FIELD_THRUST_VAC, 1, 100.0, NULL));
  g_assert_false (sw_design_field_set (d, SW_FIELD_ENGINE_THRUST_VAC, 1, 50.0, &error));
  g_clear_error (&error);
  g_assert_false (sw_design_field_set (d, SW_FIELD_COAST, 0, 10.0, &error));
  g_assert_nonnull (strstr (error->message, "first stage lifts off"));
  g_clear_error (&error);
  g_assert_true (sw_design_field_set (d, SW_FIELD_COAST, 1, 10.0, NULL));

  g_assert_false (sw_design_field_set (d, SW_FIELD_FAIRING_MASS, 0, 1500.0, &error));
  g_clear_error (&error);
  g_assert_true (sw_design_field_set (d, SW_FIELD_FAIRING_PRESSURE, 0, 500.0, NULL));
  g_assert_false (sw_design_field_set (d, SW_FIELD_FAIRING_ALTITUDE, 0, 110.0, &error));
  g_clear_error (&error);
  g_assert_true (sw_design_field_set (d, SW_FIELD_FAIRING_MASS, 0, 1500.0, NULL));
  g_assert_false (sw_design_field_unset (d, SW_FIELD_FAIRING_PRESSURE, 0, &error));
  g_clear_error (&error);
  assert_round_trip (d);

  /* A rule the loader knows: inclination against the site latitude. */
  {
    g_autoptr (SwDesign) o = orbit_design ();
    g_assert_false (sw_design_field_set (o, SW_FIELD_INCLINATION, 0, 10.0, &error));
    g_assert_true (g_str_has_prefix (error->message, "mission.orbit.inclination_deg"));
    g_assert_cmpfloat (o->mission.inclination_deg, ==, 51.6);
  }
}

/* The two forms of one quantity replace each other in one edit. */
static void
test_replacing_forms (void)
{
  g_autoptr (SwDesign) d = sw_design_new_default ();
  g_autoptr (GError) error = NULL;

  g_assert_true (sw_design_set_thrust (d, 0, FALSE, 1200.0, NULL));
  g_assert_false (sw_design_set_thrust (d, 0, TRUE, 150.0, &error));
  g_assert_nonnull (strstr (error->message, "engine count"));
  g_clear_error (&error);
  g_assert_true (d->stages[0].propulsion.has_thrust);
  g_assert_true (sw_design_field_set (d, SW_FIELD_ENGINE_COUNT, 0, 8.0, NULL));
  g_assert_true (sw_design_set_thrust (d, 0, TRUE, 150.0, NULL));
  g_assert_false (d->stages[0].propulsion.has_thrust);
  g_assert_cmpfloat (d->stages[0].propulsion.engine_thrust_vac_kn, ==, 150.0);
  g_assert_cmpfloat (sw_stage_thrust_vac_n (&d->stages[0].propulsion, 8), ==, 1.2e6);
  assert_round_trip (d);
  g_assert_true (sw_design_set_thrust (d, 0, FALSE, NAN, NULL));
  g_assert_false (d->stages[0].propulsion.present);

  g_assert_true (sw_design_set_fairing_rule (d, FALSE, 110.0, NULL));
  g_assert_true (sw_design_field_set (d, SW_FIELD_FAIRING_MASS, 0, 1500.0, NULL));
  g_assert_true (sw_design_set_fairing_rule (d, TRUE, 500.0, NULL));
  g_assert_false (d->ascent.has_fairing_altitude);
  g_assert_cmpfloat (d->ascent.fairing_jettison_dynamic_pressure_pa, ==, 500.0);
  g_assert_false (sw_design_set_fairing_rule (d, TRUE, NAN, &error));
  g_assert_true (d->ascent.has_fairing_pressure);
  assert_round_trip (d);
}

static void
test_texts_and_loss_model (void)
{
  g_autoptr (SwDesign) d = sw_design_new_default ();
  g_autoptr (GError) error = NULL;
  char long_name[200];

  memset (long_name, 'x', sizeof long_name - 1);
  long_name[sizeof long_name - 1] = '\0';
  g_assert_false (sw_design_field_set_name (d, long_name, &error));
  g_assert_nonnull (strstr (error->message, "name: 199 bytes"));
  g_clear_error (&error);
  g_assert_true (sw_design_field_set_stage_name (d, 1, "Kick", NULL));
  g_assert_cmpstr (d->stages[1].name, ==, "Kick");
  g_assert_true (sw_design_set_notes_checked (d, "Invented for a test.", NULL));
  g_assert_cmpstr (d->notes, ==, "Invented for a test.");
  g_assert_true (sw_design_set_notes_checked (d, "", NULL));
  g_assert_null (d->notes);

  g_assert_false (sw_design_set_loss_model (d, SW_LOSS_SIMULATE, &error));
  g_assert_nonnull (strstr (error->message, "mission.loss_model"));
  g_clear_error (&error);
  {
    g_autoptr (SwDesign) o = orbit_design ();
    g_assert_true (sw_design_set_loss_model (o, SW_LOSS_SIMULATE, NULL));
    g_assert_cmpint (o->mission.loss_model, ==, SW_LOSS_SIMULATE);
    assert_round_trip (o);
  }
}

static void
test_drag_text (void)
{
  g_autoptr (SwDesign) d = sw_design_new_default ();
  g_autoptr (GError) error = NULL;
  g_autofree char *dot = NULL, *comma = NULL;

  g_assert_true (sw_design_set_drag_text (d, 0, "0:0,30; 1,1:0,55\n3:0.25", &error));
  g_assert_no_error (error);
  g_assert_cmpuint (d->stages[0].propulsion.n_drag, ==, 3);
  g_assert_cmpfloat (d->stages[0].propulsion.drag_mach[1], ==, 1.1);
  g_assert_cmpfloat (d->stages[0].propulsion.drag_cd[1], ==, 0.55);
  dot = sw_design_dup_drag_text (d, 0, '.');
  g_assert_cmpstr (dot, ==, "0:0.3; 1.1:0.55; 3:0.25");
  comma = sw_design_dup_drag_text (d, 0, ',');
  g_assert_cmpstr (comma, ==, "0:0,3; 1,1:0,55; 3:0,25");
  assert_round_trip (d);

  g_assert_false (sw_design_set_drag_text (d, 0, "0:0.3; 1.1", &error));
  g_assert_nonnull (strstr (error->message, "\"1.1\" is not a mach:cd pair"));
  g_clear_error (&error);
  g_assert_false (sw_design_set_drag_text (d, 0, "2:0.3; 1:0.5", &error));
  g_assert_nonnull (strstr (error->message, "must increase"));
  g_clear_error (&error);
  g_assert_false (sw_design_set_drag_text (d, 0, "0:0", &error));
  g_clear_error (&error);
  g_assert_cmpuint (d->stages[0].propulsion.n_drag, ==, 3);
  g_assert_true (sw_design_set_drag_text (d, 0, "", NULL));
  g_assert_cmpuint (d->stages[0].propulsion.n_drag, ==, 0);
  g_assert_false (d->stages[0].propulsion.present);
}

static void
test_spread (void)
{
  g_autoptr (SwDesign) d = sw_design_new_default ();
  g_autoptr (GError) error = NULL;

  g_assert_true (sw_design_set_spread (d, 0, SW_SPREAD_NORMAL, 1.5, NULL));
  g_assert_false (sw_design_set_spread (d, 2, SW_SPREAD_UNIFORM, 2500.0, &error));
  g_assert_nonnull (strstr (error->message, "half_range_m_s"));
  g_assert_cmpint (d->uncertainty.losses.kind, ==, SW_SPREAD_NONE);
  assert_round_trip (d);
}

/* Thrust from thrust-to-weight against the closed form of a single stage:
 * m0 = P R (1 - eps) / (1 - R eps), R = exp(dv / (Isp g0)) (Tsiolkovsky
 * with eps = ms / (ms + mp)); g0 = 9.80665 m/s^2 (3rd CGPM). */
static void
test_thrust_for_tw (void)
{
  g_autoptr (SwDesign) d = one_stage ();
  g_autoptr (GError) error = NULL;
  double r = exp (3000.0 / (300.0 * 9.80665));
  double m0 = 1000.0 * r * 0.9 / (1.0 - 0.1 * r);

  /* The rules of thumb of reference-values.md (common practice). */
  g_assert_cmpfloat (sw_default_ignition_tw (0), >=, 1.2);
  g_assert_cmpfloat (sw_default_ignition_tw (0), <=, 1.5);
  g_assert_cmpfloat (sw_default_ignition_tw (2), >=, 0.6);
  g_assert_cmpfloat (sw_default_ignition_tw (2), <=, 1.2);

  g_assert_cmpfloat_with_epsilon (m0, 3452.2, 0.1);  /* hand-worked */
  g_assert_true (sw_design_set_thrust_for_tw (d, 0, 1.3, &error));
  g_assert_no_error (error);
  g_assert_cmpfloat_with_epsilon (d->stages[0].propulsion.thrust_vac_kn,
                                  1.3 * 9.80665 * m0 / 1000.0, 1e-9 * m0);
  g_assert_cmpfloat_with_epsilon (sw_design_ignition_tw (d, 0), 1.3, 1e-12);

  /* Given per engine: the per-engine thrust is set. */
  g_assert_true (sw_design_field_unset (d, SW_FIELD_THRUST_VAC, 0, NULL));
  g_assert_true (sw_design_field_set (d, SW_FIELD_ENGINE_COUNT, 0, 4.0, NULL));
  g_assert_true (sw_design_field_set (d, SW_FIELD_ENGINE_THRUST_VAC, 0, 1.0, NULL));
  g_assert_true (sw_design_set_thrust_for_tw (d, 0, 1.2, NULL));
  g_assert_cmpfloat_with_epsilon (d->stages[0].propulsion.engine_thrust_vac_kn,
                                  1.2 * 9.80665 * m0 / 4000.0, 1e-9 * m0);

  g_assert_false (sw_design_set_thrust_for_tw (d, 0, 0.0, &error));
  g_clear_error (&error);
  /* An infeasible vehicle has no ignition mass. */
  d->mission.delta_v_m_s = 20000.0;
  g_assert_false (sw_design_set_thrust_for_tw (d, 0, 1.3, &error));
  g_assert_nonnull (strstr (error->message, "cannot be sized"));
}

/* Saved numbers are the shortest decimals that read back exactly. */
static void
test_shortest_decimals (void)
{
  g_autoptr (SwDesign) d = sw_design_new_default ();
  g_autofree char *data = NULL;

  d->stages[0].structural_coefficient = 0.07;
  d->stages[0].isp_vac_s = 311.3;
  d->payload_kg = 0.1 + 0.2;           /* 0.30000000000000004: needs 17 digits */
  d->stages[0].delta_v_share = 1.0 / 3.0;
  d->stages[1].delta_v_share = 2.0 / 3.0;
  d->split = SW_SPLIT_MANUAL;
  g_strlcpy (d->name, "0.070000000000000007 stays as typed", sizeof d->name);
  data = sw_design_to_data (d, NULL);
  g_assert_nonnull (strstr (data, "\"structural_coefficient\" : 0.07,"));
  g_assert_nonnull (strstr (data, "\"isp_vac_s\" : 311.3,"));
  g_assert_nonnull (strstr (data, "\"payload_kg\" : 0.30000000000000004,"));
  g_assert_nonnull (strstr (data, "\"delta_v_share\" : 0.3333333333333333"));
  g_assert_nonnull (strstr (data, "\"0.070000000000000007 stays as typed\""));
  g_assert_null (strstr (data, "0.070000000000000007,"));
  assert_round_trip (d);
}

/* The custom propellant's name: only for a propellant of the user's own,
 * 1 to 63 bytes, not blank; a refused name leaves the design as it was. */
static void
test_propellant_name (void)
{
  g_autoptr (SwDesign) d = one_stage ();
  g_autoptr (GError) error = NULL;
  char long_name[SW_PROPELLANT_NAME_MAX + 1];

  g_assert_false (sw_design_set_propellant_name (d, 0, "mine", &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_VALUE);
  g_assert_nonnull (strstr (error->message, "stages[0].propellant.name"));
  g_clear_error (&error);
  g_assert_true (sw_design_set_propellant (d, 0, SW_PROPELLANT_CUSTOM, NULL));
  g_assert_true (sw_design_set_propellant_name (d, 0, "Peroxide / kerosene", &error));
  g_assert_no_error (error);
  g_assert_cmpstr (d->stages[0].propellant.custom_name, ==, "Peroxide / kerosene");
  assert_round_trip (d);
  /* Blank, too long, not UTF-8, no such stage. */
  g_assert_false (sw_design_set_propellant_name (d, 0, "  ", &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_RANGE);
  g_clear_error (&error);
  memset (long_name, 'x', SW_PROPELLANT_NAME_MAX);
  long_name[SW_PROPELLANT_NAME_MAX] = '\0';
  g_assert_false (sw_design_set_propellant_name (d, 0, long_name, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_RANGE);
  g_clear_error (&error);
  long_name[SW_PROPELLANT_NAME_MAX - 1] = '\0';  /* 63 bytes: the most accepted */
  g_assert_true (sw_design_set_propellant_name (d, 0, long_name, NULL));
  assert_round_trip (d);
  g_assert_false (sw_design_set_propellant_name (d, 0, "\xff\xfe", &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_VALUE);
  g_clear_error (&error);
  g_assert_false (sw_design_set_propellant_name (d, 1, "x", &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_USAGE);
  g_clear_error (&error);
  g_assert_cmpstr (d->stages[0].propellant.custom_name, ==, long_name);

  /* The boosters' own propellant: the same rules, and boosters needed. */
  g_assert_false (sw_design_set_booster_propellant_name (d, "mine", &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_MISSING);
  g_assert_nonnull (strstr (error->message, "boosters.propellant.name"));
  g_clear_error (&error);
  g_assert_true (sw_design_field_set (d, SW_FIELD_THRUST_VAC, 0, 2000.0, NULL));
  g_assert_true (sw_design_field_set (d, SW_FIELD_BOOSTER_COUNT, 0, 2.0, NULL));
  g_assert_false (sw_design_set_booster_propellant_name (d, "mine", &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_VALUE);
  g_assert_nonnull (strstr (error->message, "boosters.propellant.name"));
  g_clear_error (&error);
  g_assert_true (sw_design_set_booster_propellant (d, SW_PROPELLANT_CUSTOM, NULL));
  g_assert_false (sw_design_set_booster_propellant_name (d, " ", &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_RANGE);
  g_clear_error (&error);
  g_assert_true (sw_design_set_booster_propellant_name (d, "Booster mix", &error));
  g_assert_no_error (error);
  g_assert_cmpstr (d->boosters.propellant.custom_name, ==, "Booster mix");
  /* The stage's own propellant keeps its name. */
  g_assert_cmpstr (d->stages[0].propellant.custom_name, ==, long_name);
  assert_round_trip (d);
}

/* Engine types and developed stages: every list edit of the economics
 * object, each refusal leaving the design unchanged, the result saved and
 * loaded back. */
static void
test_engine_types (void)
{
  g_autoptr (SwDesign) d = sw_design_new_default ();
  g_autoptr (SwDesign) before = NULL;
  g_autoptr (GError) error = NULL;
  char long_name[SW_NAME_MAX + 1];

  g_assert_cmpuint (d->n_stages, >=, 2);
  g_assert_false (d->economics.present);
  g_assert_true (sw_design_add_engine_type (d, &error));
  g_assert_no_error (error);
  g_assert_true (d->economics.present);
  g_assert_cmpuint (d->economics.n_engine_types, ==, 1);
  g_assert_cmpstr (d->economics.engine_types[0].name, ==, "Engine 1");
  g_assert_cmpfloat (d->economics.engine_types[0].dry_mass_kg, ==,
                     SW_ENGINE_TYPE_DEFAULT_DRY_MASS_KG);
  g_assert_cmpuint (d->economics.engine_types[0].stage_mask, ==, 0);
  g_assert_false (d->economics.engine_types[0].developed);
  assert_round_trip (d);

  /* Rename: blank, too long, taken by another type are refused. */
  g_assert_true (sw_design_add_engine_type (d, NULL));
  g_assert_cmpstr (d->economics.engine_types[1].name, ==, "Engine 2");
  g_assert_true (sw_design_rename_engine_type (d, 0, "Core engine", &error));
  g_assert_no_error (error);
  before = sw_design_copy (d);
  g_assert_false (sw_design_rename_engine_type (d, 1, " ", &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_VALUE);
  g_clear_error (&error);
  g_assert_false (sw_design_rename_engine_type (d, 1, "Core engine", &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_VALUE);
  g_assert_nonnull (strstr (error->message, "economics.engine_types[1].name"));
  g_clear_error (&error);
  memset (long_name, 'e', SW_NAME_MAX);
  long_name[SW_NAME_MAX] = '\0';
  g_assert_false (sw_design_rename_engine_type (d, 1, long_name, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_RANGE);
  g_clear_error (&error);
  g_assert_false (sw_design_rename_engine_type (d, 2, "x", &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_USAGE);
  g_clear_error (&error);
  g_assert_true (sw_design_equal (d, before));
  /* A new type after a rename takes the first free "Engine N". */
  g_assert_true (sw_design_rename_engine_type (d, 1, "Engine 3", NULL));
  g_assert_true (sw_design_add_engine_type (d, NULL));
  g_assert_cmpstr (d->economics.engine_types[2].name, ==, "Engine 4");
  g_assert_true (sw_design_remove_engine_type (d, 2, NULL));

  /* Dry mass within (0, 100000] kg (limits table). */
  g_assert_true (sw_design_set_engine_type_dry_mass (d, 1, 100000.0, NULL));
  g_assert_false (sw_design_set_engine_type_dry_mass (d, 1, 0.0, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_RANGE);
  g_clear_error (&error);
  g_assert_false (sw_design_set_engine_type_dry_mass (d, 1, NAN, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_NOT_FINITE);
  g_clear_error (&error);
  g_assert_cmpfloat (d->economics.engine_types[1].dry_mass_kg, ==, 100000.0);

  /* Stages: type 0 on both stages; type 1 on stage 1 is a conflict,
   * refused, type 0 keeps it. */
  g_assert_true (sw_design_set_engine_type_on_stage (d, 0, 0, TRUE, NULL));
  g_assert_true (sw_design_set_engine_type_on_stage (d, 0, 1, TRUE, NULL));
  g_assert_cmpuint (d->economics.engine_types[0].stage_mask, ==, 0x3);
  g_assert_false (sw_design_set_engine_type_on_stage (d, 1, 1, TRUE, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_VALUE);
  g_assert_nonnull (strstr (error->message, "Core engine"));
  g_clear_error (&error);
  g_assert_cmpuint (d->economics.engine_types[1].stage_mask, ==, 0);
  g_assert_false (sw_design_set_engine_type_on_stage (d, 0, d->n_stages, TRUE, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_RANGE);
  g_clear_error (&error);
  g_assert_true (sw_design_set_engine_type_on_stage (d, 0, 1, FALSE, NULL));
  g_assert_true (sw_design_set_engine_type_on_stage (d, 1, 1, TRUE, NULL));
  g_assert_cmpint (sw_economics_engine_type_of_stage (&d->economics, 1), ==, 1);
  g_assert_true (sw_design_set_engine_type_developed (d, 1, TRUE, NULL));
  g_assert_true (d->economics.engine_types[1].developed);
  g_assert_false (sw_design_set_engine_type_developed (d, 5, TRUE, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_USAGE);
  g_clear_error (&error);

  /* Developed stages. */
  g_assert_true (sw_design_set_stage_developed (d, 1, TRUE, NULL));
  g_assert_cmpuint (d->economics.developed_stages, ==, 0x2);
  g_assert_false (sw_design_set_stage_developed (d, d->n_stages, TRUE, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_RANGE);
  g_clear_error (&error);
  g_assert_true (sw_design_validate (d, NULL, NULL));
  assert_round_trip (d);
  g_assert_true (sw_design_set_stage_developed (d, 1, FALSE, NULL));
  g_assert_cmpuint (d->economics.developed_stages, ==, 0);

  /* Removing type 0 keeps type 1 and its stages. */
  g_assert_true (sw_design_remove_engine_type (d, 0, NULL));
  g_assert_cmpuint (d->economics.n_engine_types, ==, 1);
  g_assert_cmpstr (d->economics.engine_types[0].name, ==, "Engine 3");
  g_assert_cmpuint (d->economics.engine_types[0].stage_mask, ==, 0x2);
  g_assert_false (sw_design_remove_engine_type (d, 1, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_USAGE);
  g_clear_error (&error);
  assert_round_trip (d);

  /* At most the limits table's count of types. */
  while (d->economics.n_engine_types < sw_limit_get (SW_LIMIT_ENGINE_TYPES)->max)
    g_assert_true (sw_design_add_engine_type (d, NULL));
  g_assert_false (sw_design_add_engine_type (d, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_RANGE);
  assert_round_trip (d);
}

/* The boosters' edits: none without boosters, boosters need a core thrust,
 * the count from 0 gives starting values, count 0 saves no key, the
 * texts, the crossfeed and the propellant are named edits too. */
static void
test_boosters (void)
{
  g_autoptr (SwDesign) d = sw_design_new_default ();
  g_autoptr (SwDesign) plain = sw_design_copy (d);
  g_autoptr (GError) error = NULL;
  g_autofree char *data = NULL;
  double v;

  g_assert_false (sw_design_field_set (d, SW_FIELD_BOOSTER_ISP_VAC, 0, 280.0, &error));
  g_assert_nonnull (strstr (error->message, "boosters.isp_vac_s: the design has no boosters"));
  g_clear_error (&error);
  g_assert_false (sw_design_set_booster_crossfeed (d, TRUE, &error));
  g_assert_nonnull (strstr (error->message, "boosters.crossfeed"));
  g_clear_error (&error);
  g_assert_true (sw_design_equal (d, plain));

  /* No core thrust: refused, naming the key to give. */
  g_assert_false (sw_design_field_set (d, SW_FIELD_BOOSTER_COUNT, 0, 2.0, &error));
  g_assert_nonnull (strstr (error->message, "stages[0].thrust_vac_kn"));
  g_clear_error (&error);
  g_assert_true (sw_design_equal (d, plain));

  g_assert_true (sw_design_field_set (d, SW_FIELD_THRUST_VAC, 0, 2500.0, NULL));
  g_assert_true (sw_design_field_set (d, SW_FIELD_BOOSTER_COUNT, 0, 4.0, &error));
  g_assert_no_error (error);
  g_assert_cmpuint (d->boosters.count, ==, 4);
  g_assert_true (sw_design_field_get (d, SW_FIELD_BOOSTER_ISP_VAC, 0, &v));
  g_assert_cmpfloat (v, ==, 270.0);
  g_assert_true (sw_design_field_set (d, SW_FIELD_BOOSTER_PROPELLANT_LOAD, 0, 30000.0, NULL));
  g_assert_true (sw_design_set_booster_name (d, "Side pods", NULL));
  g_assert_true (sw_design_set_booster_crossfeed (d, TRUE, NULL));
  g_assert_true (sw_design_set_booster_propellant (d, SW_PROPELLANT_SOLID_COMPOSITE, NULL));
  /* A solid has no mixture ratio. */
  g_assert_false (sw_design_field_set (d, SW_FIELD_BOOSTER_MIXTURE_RATIO, 0, 2.0, &error));
  g_assert_nonnull (strstr (error->message, "boosters.mixture_ratio"));
  g_clear_error (&error);
  /* Sea level above vacuum is a conflict, not a silent fix. */
  g_assert_false (sw_design_field_set (d, SW_FIELD_BOOSTER_ISP_SL, 0, 300.0, &error));
  g_assert_nonnull (strstr (error->message, "boosters.isp_sl_s"));
  g_clear_error (&error);
  g_assert_cmpfloat (d->boosters.isp_sl_s, ==, 240.0);
  /* The core thrust cannot go while boosters need it. */
  g_assert_false (sw_design_field_unset (d, SW_FIELD_THRUST_VAC, 0, &error));
  g_assert_nonnull (strstr (error->message, "stages[0].thrust_vac_kn"));
  g_clear_error (&error);

  data = sw_design_to_data (d, NULL);
  g_assert_nonnull (strstr (data, "\"version\" : 2"));
  g_assert_nonnull (strstr (data, "\"crossfeed\" : true"));
  g_assert_nonnull (strstr (data, "\"Side pods\""));
  g_assert_nonnull (strstr (data, "\"solid-composite\""));
  assert_round_trip (d);

  /* Count 0: the same design as without boosters, saved without the key
   * and as version 1 again. */
  g_assert_true (sw_design_field_set (d, SW_FIELD_BOOSTER_COUNT, 0, 0.0, NULL));
  g_clear_pointer (&data, g_free);
  data = sw_design_to_data (d, NULL);
  g_assert_null (strstr (data, "boosters"));
  g_assert_nonnull (strstr (data, "\"version\" : 1"));
  g_assert_true (sw_design_field_unset (d, SW_FIELD_THRUST_VAC, 0, NULL));
  g_assert_true (sw_design_equal (d, plain));
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/core/design-fields/every-field-sets", test_every_field_sets);
  g_test_add_func ("/core/design-fields/out-of-range-unchanged", test_out_of_range_unchanged);
  g_test_add_func ("/core/design-fields/unset", test_unset);
  g_test_add_func ("/core/design-fields/dependencies", test_dependencies);
  g_test_add_func ("/core/design-fields/replacing-forms", test_replacing_forms);
  g_test_add_func ("/core/design-fields/texts-and-loss-model", test_texts_and_loss_model);
  g_test_add_func ("/core/design-fields/drag-text", test_drag_text);
  g_test_add_func ("/core/design-fields/boosters", test_boosters);
  g_test_add_func ("/core/design-fields/spread", test_spread);
  g_test_add_func ("/core/design-fields/thrust-for-tw", test_thrust_for_tw);
  g_test_add_func ("/core/design-fields/shortest-decimals", test_shortest_decimals);
  g_test_add_func ("/core/design-fields/propellant-name", test_propellant_name);
  g_test_add_func ("/core/design-fields/engine-types", test_engine_types);
  return g_test_run ();
}
