/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-propulsion"

#include "config.h"

#include "sw-propulsion.h"

#include "sw-limits.h"
#include "sw-optional-keys.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

const char *const sw_propulsion_stage_keys[] = {
  "thrust_vac_kn", "engine_thrust_vac_kn", "diameter_m", "drag_coefficients",
  "coast_before_ignition_s", NULL
};
const char *const sw_propulsion_design_keys[] = { "ascent", NULL };
const char *const sw_propulsion_ascent_keys[] = {
  "fairing_mass_kg", "fairing_jettison_altitude_km", "fairing_jettison_dynamic_pressure_pa",
  "pitch_over_speed_m_s", "pitch_kick_deg", "insertion_altitude_km", "max_q_alpha_kpa_deg",
  NULL
};

/* Generic slender-vehicle drag coefficient against Mach number: ours, with
 * the shape of common practice (about 0.3 subsonic, a transonic peak near
 * 0.5 at Mach 1.1, falling towards 0.2 at high Mach). */
const double sw_drag_default_mach[] = { 0.0, 0.6, 0.8, 0.9, 1.0, 1.1, 1.2, 1.5, 2.0, 3.0, 4.0,
                                        6.0, 10.0 };
const double sw_drag_default_cd[] = { 0.30, 0.29, 0.31, 0.38, 0.48, 0.52, 0.51, 0.45, 0.37,
                                      0.29, 0.25, 0.22, 0.20 };
const guint sw_drag_default_points = G_N_ELEMENTS (sw_drag_default_mach);

static const char *
display_file (const char *file)
{
  return file != NULL ? file : _("(design)");
}

/* [[mach, cd], ...] with Mach strictly increasing. */
static gboolean
load_drag_table (JsonObject *obj, const char *file, const char *path, SwStagePropulsion *prop,
                 GError **error)
{
  JsonNode *node = json_object_get_member (obj, "drag_coefficients");
  g_autofree char *tpath = sw_optional_path (path, "drag_coefficients");
  const SwLimit *lim = sw_limit_get (SW_LIMIT_DRAG_POINTS);
  JsonArray *arr;
  guint n;

  prop->n_drag = 0;
  if (node == NULL)
    return TRUE;
  if (json_node_get_node_type (node) != JSON_NODE_ARRAY)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_TYPE,
                   _("%s: %s: expected a list of [mach, cd] pairs"), display_file (file), tpath);
      return FALSE;
    }
  arr = json_node_get_array (node);
  n = json_array_get_length (arr);
  if (n < lim->min || n > lim->max)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_RANGE,
                   _("%s: %s: %u points; the table takes %g to %g [mach, cd] pairs"),
                   display_file (file), tpath, n, lim->min, lim->max);
      return FALSE;
    }
  for (guint i = 0; i < n; i++)
    {
      JsonNode *pair = json_array_get_element (arr, i);
      g_autofree char *ppath = g_strdup_printf ("%s[%u]", tpath, i);
      JsonArray *pa;
      double v[2];

      if (json_node_get_node_type (pair) != JSON_NODE_ARRAY
          || json_array_get_length (pa = json_node_get_array (pair)) != 2)
        {
          g_set_error (error, SW_ERROR, SW_ERROR_TYPE,
                       _("%s: %s: expected a pair [mach, cd] of two numbers"),
                       display_file (file), ppath);
          return FALSE;
        }
      for (guint k = 0; k < 2; k++)
        {
          JsonNode *e = json_array_get_element (pa, k);
          GType t = json_node_get_node_type (e) == JSON_NODE_VALUE ? json_node_get_value_type (e)
                                                                   : G_TYPE_INVALID;
          if (t != G_TYPE_DOUBLE && t != G_TYPE_INT64)
            {
              g_set_error (error, SW_ERROR, SW_ERROR_TYPE,
                           _("%s: %s[%u]: expected a number (%s)"), display_file (file), ppath,
                           k, k == 0 ? "mach" : "cd");
              return FALSE;
            }
          v[k] = json_node_get_double (e);
          if (v[k] == 0.0)
            v[k] = 0.0; /* no minus zero: saving and loading again must match */
        }
      prop->drag_mach[i] = v[0];
      prop->drag_cd[i] = v[1];
    }
  prop->n_drag = n;
  return TRUE;
}

gboolean
sw_propulsion_load_stage (JsonObject *obj, const char *file, const char *path,
                          SwStagePropulsion *prop, GPtrArray *warnings, GError **error)
{
  guint index = 0;
  const char *bracket;

  memset (prop, 0, sizeof *prop);
  if (!sw_optional_read_number (obj, "thrust_vac_kn", file, path, SW_LIMIT_THRUST_VAC, FALSE,
                                &prop->thrust_vac_kn, &prop->has_thrust, error)
      || !sw_optional_read_number (obj, "engine_thrust_vac_kn", file, path,
                                   SW_LIMIT_ENGINE_THRUST_VAC, FALSE,
                                   &prop->engine_thrust_vac_kn, &prop->has_engine_thrust, error)
      || !sw_optional_read_number (obj, "diameter_m", file, path, SW_LIMIT_DIAMETER, FALSE,
                                   &prop->diameter_m, &prop->has_diameter, error)
      || !sw_optional_read_number (obj, "coast_before_ignition_s", file, path, SW_LIMIT_COAST,
                                   FALSE, &prop->coast_before_ignition_s, &prop->has_coast,
                                   error)
      || !load_drag_table (obj, file, path, prop, error))
    return FALSE;
  prop->present = prop->has_thrust || prop->has_engine_thrust || prop->has_diameter
                  || prop->has_coast || prop->n_drag > 0;

  /* The loader builds stage paths as "...stages[i]". */
  bracket = path != NULL ? strrchr (path, '[') : NULL;
  if (bracket != NULL)
    index = (guint) g_ascii_strtoull (bracket + 1, NULL, 10);

  if (prop->has_engine_thrust && json_object_get_member (obj, "engine_count") == NULL)
    {
      g_autofree char *p = sw_optional_path (path, "engine_thrust_vac_kn");
      g_set_error (error, SW_ERROR, SW_ERROR_MISSING,
                   _("%s: %s: a thrust per engine needs engine_count beside it (the stage's "
                     "thrust is engine_count times engine_thrust_vac_kn)"),
                   display_file (file), p);
      return FALSE;
    }
  return sw_propulsion_validate_stage (prop, index, file, path, error);
}

gboolean
sw_propulsion_validate_stage (const SwStagePropulsion *prop, guint index, const char *file,
                              const char *path, GError **error)
{
  g_return_val_if_fail (prop != NULL, FALSE);

  if ((prop->has_thrust
       && !sw_optional_check (SW_LIMIT_THRUST_VAC, prop->thrust_vac_kn, file, path, error))
      || (prop->has_engine_thrust
          && !sw_optional_check (SW_LIMIT_ENGINE_THRUST_VAC, prop->engine_thrust_vac_kn, file,
                                 path, error))
      || (prop->has_diameter
          && !sw_optional_check (SW_LIMIT_DIAMETER, prop->diameter_m, file, path, error))
      || (prop->has_coast
          && !sw_optional_check (SW_LIMIT_COAST, prop->coast_before_ignition_s, file, path,
                                 error)))
    return FALSE;

  if (prop->has_thrust && prop->has_engine_thrust)
    {
      g_autofree char *p = sw_optional_path (path, "engine_thrust_vac_kn");
      g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                   _("%s: %s: give the stage's thrust once: thrust_vac_kn (total) or "
                     "engine_thrust_vac_kn with engine_count, not both"),
                   display_file (file), p);
      return FALSE;
    }
  if (index == 0 && prop->has_coast && prop->coast_before_ignition_s > 0.0)
    {
      g_autofree char *p = sw_optional_path (path, "coast_before_ignition_s");
      g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                   _("%s: %s: %g s, but the first stage lifts off; a coast before ignition "
                     "belongs to an upper stage"),
                   display_file (file), p, prop->coast_before_ignition_s);
      return FALSE;
    }
  if (prop->n_drag > SW_DRAG_TABLE_MAX)
    {
      g_autofree char *p = sw_optional_path (path, "drag_coefficients");
      g_set_error (error, SW_ERROR, SW_ERROR_RANGE, _("%s: %s: more than %d points"),
                   display_file (file), p, SW_DRAG_TABLE_MAX);
      return FALSE;
    }
  for (guint i = 0; i < prop->n_drag; i++)
    {
      g_autofree char *tp = sw_optional_path (path, "drag_coefficients");
      g_autofree char *pp = g_strdup_printf ("%s[%u]", tp, i);
      const SwLimit *lm = sw_limit_get (SW_LIMIT_DRAG_MACH);
      const SwLimit *lc = sw_limit_get (SW_LIMIT_DRAG_CD);

      if (!sw_limit_contains (SW_LIMIT_DRAG_MACH, prop->drag_mach[i]))
        {
          g_set_error (error, SW_ERROR, SW_ERROR_RANGE,
                       _("%s: %s[0]: Mach %g is outside the accepted range %g to %g (%s)"),
                       display_file (file), pp, prop->drag_mach[i], lm->min, lm->max, lm->why);
          return FALSE;
        }
      if (!sw_limit_contains (SW_LIMIT_DRAG_CD, prop->drag_cd[i]))
        {
          g_set_error (error, SW_ERROR, SW_ERROR_RANGE,
                       _("%s: %s[1]: drag coefficient %g is outside the accepted range above "
                         "%g to %g (%s)"),
                       display_file (file), pp, prop->drag_cd[i], lc->min, lc->max, lc->why);
          return FALSE;
        }
      if (i > 0 && !(prop->drag_mach[i] > prop->drag_mach[i - 1]))
        {
          g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                       _("%s: %s[0]: Mach %g does not follow %g; the Mach numbers must "
                         "increase from point to point"),
                       display_file (file), pp, prop->drag_mach[i], prop->drag_mach[i - 1]);
          return FALSE;
        }
    }
  return TRUE;
}

gboolean
sw_propulsion_load_design (JsonObject *root, const char *file, SwDesignAscent *ascent,
                           GPtrArray *warnings, GError **error)
{
  JsonObject *obj;
  gboolean ok;

  memset (ascent, 0, sizeof *ascent);
  obj = sw_optional_read_object (root, "ascent", file, "", &ok, error);
  if (!ok)
    return FALSE;
  if (obj == NULL)
    return TRUE;
  ascent->present = TRUE;
  sw_optional_warn_unknown (obj, file, "ascent", sw_propulsion_ascent_keys, warnings);
  if (!sw_optional_read_number (obj, "fairing_mass_kg", file, "ascent", SW_LIMIT_FAIRING_MASS,
                                FALSE, &ascent->fairing_mass_kg, &ascent->has_fairing_mass, error)
      || !sw_optional_read_number (obj, "fairing_jettison_altitude_km", file, "ascent",
                                   SW_LIMIT_FAIRING_ALTITUDE, FALSE,
                                   &ascent->fairing_jettison_altitude_km,
                                   &ascent->has_fairing_altitude, error)
      || !sw_optional_read_number (obj, "fairing_jettison_dynamic_pressure_pa", file, "ascent",
                                   SW_LIMIT_FAIRING_DYNAMIC_PRESSURE, FALSE,
                                   &ascent->fairing_jettison_dynamic_pressure_pa,
                                   &ascent->has_fairing_pressure, error)
      || !sw_optional_read_number (obj, "pitch_over_speed_m_s", file, "ascent",
                                   SW_LIMIT_PITCH_OVER_SPEED, FALSE,
                                   &ascent->pitch_over_speed_m_s, &ascent->has_pitch_over_speed,
                                   error)
      || !sw_optional_read_number (obj, "pitch_kick_deg", file, "ascent", SW_LIMIT_PITCH_KICK,
                                   FALSE, &ascent->pitch_kick_deg, &ascent->has_pitch_kick,
                                   error)
      || !sw_optional_read_number (obj, "insertion_altitude_km", file, "ascent",
                                   SW_LIMIT_INSERTION_ALTITUDE, FALSE,
                                   &ascent->insertion_altitude_km,
                                   &ascent->has_insertion_altitude, error)
      || !sw_optional_read_number (obj, "max_q_alpha_kpa_deg", file, "ascent",
                                   SW_LIMIT_MAX_Q_ALPHA, FALSE, &ascent->max_q_alpha_kpa_deg,
                                   &ascent->has_max_q_alpha, error))
    return FALSE;
  return sw_propulsion_validate_design (ascent, file, error);
}

gboolean
sw_propulsion_validate_design (const SwDesignAscent *a, const char *file, GError **error)
{
  g_return_val_if_fail (a != NULL, FALSE);

  if ((a->has_fairing_mass
       && !sw_optional_check (SW_LIMIT_FAIRING_MASS, a->fairing_mass_kg, file, "ascent", error))
      || (a->has_fairing_altitude
          && !sw_optional_check (SW_LIMIT_FAIRING_ALTITUDE, a->fairing_jettison_altitude_km,
                                 file, "ascent", error))
      || (a->has_fairing_pressure
          && !sw_optional_check (SW_LIMIT_FAIRING_DYNAMIC_PRESSURE,
                                 a->fairing_jettison_dynamic_pressure_pa, file, "ascent", error))
      || (a->has_pitch_over_speed
          && !sw_optional_check (SW_LIMIT_PITCH_OVER_SPEED, a->pitch_over_speed_m_s, file,
                                 "ascent", error))
      || (a->has_pitch_kick
          && !sw_optional_check (SW_LIMIT_PITCH_KICK, a->pitch_kick_deg, file, "ascent", error))
      || (a->has_insertion_altitude
          && !sw_optional_check (SW_LIMIT_INSERTION_ALTITUDE, a->insertion_altitude_km, file,
                                 "ascent", error))
      || (a->has_max_q_alpha
          && !sw_optional_check (SW_LIMIT_MAX_Q_ALPHA, a->max_q_alpha_kpa_deg, file, "ascent",
                                 error)))
    return FALSE;
  if (a->has_fairing_altitude && a->has_fairing_pressure)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                   _("%s: ascent.fairing_jettison_dynamic_pressure_pa: give one rule for "
                     "dropping the fairing, an altitude or a dynamic pressure, not both"),
                   display_file (file));
      return FALSE;
    }
  if (a->has_fairing_mass && a->fairing_mass_kg > 0.0 && !a->has_fairing_altitude
      && !a->has_fairing_pressure)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_MISSING,
                   _("%s: ascent.fairing_mass_kg: %g kg of fairing needs a rule for dropping "
                     "it: fairing_jettison_altitude_km or fairing_jettison_dynamic_pressure_pa"),
                   display_file (file), a->fairing_mass_kg);
      return FALSE;
    }
  return TRUE;
}

void
sw_propulsion_update_present (SwStagePropulsion *prop)
{
  prop->present = prop->has_thrust || prop->has_engine_thrust || prop->has_diameter
                  || prop->has_coast || prop->n_drag > 0;
}

void
sw_propulsion_save_stage (JsonBuilder *builder, const SwStagePropulsion *prop)
{
  if (prop->has_thrust)
    sw_optional_add_number (builder, "thrust_vac_kn", prop->thrust_vac_kn);
  if (prop->has_engine_thrust)
    sw_optional_add_number (builder, "engine_thrust_vac_kn", prop->engine_thrust_vac_kn);
  if (prop->has_diameter)
    sw_optional_add_number (builder, "diameter_m", prop->diameter_m);
  if (prop->n_drag > 0)
    {
      json_builder_set_member_name (builder, "drag_coefficients");
      json_builder_begin_array (builder);
      for (guint i = 0; i < prop->n_drag && i < SW_DRAG_TABLE_MAX; i++)
        {
          json_builder_begin_array (builder);
          json_builder_add_double_value (builder, prop->drag_mach[i]);
          json_builder_add_double_value (builder, prop->drag_cd[i]);
          json_builder_end_array (builder);
        }
      json_builder_end_array (builder);
    }
  if (prop->has_coast)
    sw_optional_add_number (builder, "coast_before_ignition_s", prop->coast_before_ignition_s);
}

void
sw_propulsion_save_design (JsonBuilder *builder, const SwDesignAscent *a)
{
  if (!a->present)
    return;
  json_builder_set_member_name (builder, "ascent");
  json_builder_begin_object (builder);
  if (a->has_fairing_mass)
    sw_optional_add_number (builder, "fairing_mass_kg", a->fairing_mass_kg);
  if (a->has_fairing_altitude)
    sw_optional_add_number (builder, "fairing_jettison_altitude_km", a->fairing_jettison_altitude_km);
  if (a->has_fairing_pressure)
    sw_optional_add_number (builder, "fairing_jettison_dynamic_pressure_pa",
                a->fairing_jettison_dynamic_pressure_pa);
  if (a->has_pitch_over_speed)
    sw_optional_add_number (builder, "pitch_over_speed_m_s", a->pitch_over_speed_m_s);
  if (a->has_pitch_kick)
    sw_optional_add_number (builder, "pitch_kick_deg", a->pitch_kick_deg);
  if (a->has_insertion_altitude)
    sw_optional_add_number (builder, "insertion_altitude_km", a->insertion_altitude_km);
  if (a->has_max_q_alpha)
    sw_optional_add_number (builder, "max_q_alpha_kpa_deg", a->max_q_alpha_kpa_deg);
  json_builder_end_object (builder);
}

/* ---- derived ----------------------------------------------------------- */

double
sw_stage_thrust_vac_n (const SwStagePropulsion *prop, guint engine_count)
{
  g_return_val_if_fail (prop != NULL, NAN);

  if (prop->has_thrust)
    return prop->thrust_vac_kn * 1000.0;
  if (prop->has_engine_thrust && engine_count > 0)
    return prop->engine_thrust_vac_kn * 1000.0 * engine_count;
  return NAN;
}

double
sw_propulsion_mass_flow (double thrust_vac_n, double isp_vac_s)
{
  return thrust_vac_n / (isp_vac_s * SW_G0);
}

double
sw_propulsion_isp_at (double isp_vac_s, double isp_sl_s, double p_pa)
{
  return MAX (0.0, isp_vac_s - (isp_vac_s - isp_sl_s) * p_pa / SW_SEA_LEVEL_PRESSURE_PA);
}

double
sw_propulsion_thrust_at (double thrust_vac_n, double isp_vac_s, double isp_sl_s, double p_pa)
{
  return thrust_vac_n * sw_propulsion_isp_at (isp_vac_s, isp_sl_s, p_pa) / isp_vac_s;
}

static double
table_lookup (const double *x, const double *y, guint n, double at)
{
  guint lo = 0, hi = n - 1;

  if (at <= x[0])
    return y[0];
  if (at >= x[n - 1])
    return y[n - 1];
  while (hi - lo > 1)
    {
      guint mid = (lo + hi) / 2;
      if (x[mid] <= at)
        lo = mid;
      else
        hi = mid;
    }
  return y[lo] + (y[hi] - y[lo]) * (at - x[lo]) / (x[hi] - x[lo]);
}

double
sw_propulsion_drag_coefficient (const SwStagePropulsion *prop, double mach)
{
  if (prop != NULL && prop->n_drag > 0)
    return table_lookup (prop->drag_mach, prop->drag_cd, MIN (prop->n_drag, SW_DRAG_TABLE_MAX),
                         mach);
  return table_lookup (sw_drag_default_mach, sw_drag_default_cd, sw_drag_default_points, mach);
}
