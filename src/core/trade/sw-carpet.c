/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-carpet"

#include "config.h"

#include "sw-carpet.h"

#include "sw-booster-sizing.h"
#include "sw-budget.h"
#include "sw-cost.h"
#include "sw-format.h"
#include "sw-payload-curves.h"
#include "sw-limits.h"
#include "sw-sizing.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <stdio.h>
#include <string.h>

#define PARAM_LIST "payload_kg, mission.delta_v_m_s, mission.losses_m_s, " \
                   "mission.orbit.altitude_km, mission.orbit.inclination_deg, " \
                   "mission.orbit.site_latitude_deg, stages[N].isp_vac_s, " \
                   "stages[N].structural_coefficient, stages[N].propellant_kg (a fixed " \
                   "load), boosters.count, boosters.isp_vac_s, " \
                   "boosters.structural_coefficient, boosters.thrust_vac_kn, " \
                   "boosters.propellant_kg (a fixed load), economics.production_run, " \
                   "economics.learning_rate, economics.engine_mass_fraction, " \
                   "economics.cost_coefficients.KEY"

/* The economics keys a carpet can vary: those of the cost model (the
 * recovery and weighting keys change no carpet output). */
static const struct {
  SwEconNumber key;
  const char  *label;
} econ_params[] = {
  { SW_ECON_PRODUCTION_RUN, N_("Vehicles built") },
  { SW_ECON_LEARNING_RATE, N_("Learning rate") },
  { SW_ECON_CER_FIRST + SW_CER_STAGE_DEV_FACTOR, N_("Stage development factor a") },
  { SW_ECON_CER_FIRST + SW_CER_STAGE_DEV_EXPONENT, N_("Stage development exponent x") },
  { SW_ECON_CER_FIRST + SW_CER_STAGE_UNIT_FACTOR, N_("Stage first-unit factor b") },
  { SW_ECON_CER_FIRST + SW_CER_STAGE_UNIT_EXPONENT, N_("Stage first-unit exponent y") },
  { SW_ECON_CER_FIRST + SW_CER_ENGINE_DEV_FACTOR, N_("Engine development factor a") },
  { SW_ECON_CER_FIRST + SW_CER_ENGINE_DEV_EXPONENT, N_("Engine development exponent x") },
  { SW_ECON_CER_FIRST + SW_CER_ENGINE_UNIT_FACTOR, N_("Engine first-unit factor b") },
  { SW_ECON_CER_FIRST + SW_CER_ENGINE_UNIT_EXPONENT, N_("Engine first-unit exponent y") },
  { SW_ECON_CER_FIRST + SW_CER_SYSTEMS_BASE, N_("Systems factor per stage") },
  { SW_ECON_ENGINE_MASS_FRACTION, N_("Engines in a stage's dry mass") },
};

static int
econ_param_index (SwEconNumber key)
{
  for (guint i = 0; i < G_N_ELEMENTS (econ_params); i++)
    if (econ_params[i].key == key)
      return (int) i;
  return -1;
}

static gboolean
is_orbit_param (SwCarpetParamKind kind)
{
  return kind == SW_CARPET_PARAM_LOSSES || kind == SW_CARPET_PARAM_INCLINATION
         || kind == SW_CARPET_PARAM_SITE_LATITUDE || kind == SW_CARPET_PARAM_ALTITUDE;
}

static gboolean
is_booster_param (SwCarpetParamKind kind)
{
  return kind == SW_CARPET_PARAM_BOOSTER_COUNT || kind == SW_CARPET_PARAM_BOOSTER_ISP_VAC
         || kind == SW_CARPET_PARAM_BOOSTER_STRUCTURAL_COEFFICIENT
         || kind == SW_CARPET_PARAM_BOOSTER_THRUST
         || kind == SW_CARPET_PARAM_BOOSTER_PROPELLANT_LOAD;
}

static const struct {
  SwCarpetParamKind kind;
  const char       *name;
} booster_names[] = {
  { SW_CARPET_PARAM_BOOSTER_COUNT, "boosters.count" },
  { SW_CARPET_PARAM_BOOSTER_ISP_VAC, "boosters.isp_vac_s" },
  { SW_CARPET_PARAM_BOOSTER_STRUCTURAL_COEFFICIENT, "boosters.structural_coefficient" },
  { SW_CARPET_PARAM_BOOSTER_THRUST, "boosters.thrust_vac_kn" },
  { SW_CARPET_PARAM_BOOSTER_PROPELLANT_LOAD, "boosters.propellant_kg" },
};

gboolean
sw_carpet_param_parse (const char *text, const SwDesign *design, SwCarpetAxis *axis,
                       GError **error)
{
  unsigned stage = 0;
  char key[64] = "";
  int consumed = 0;

  g_return_val_if_fail (text != NULL && design != NULL && axis != NULL, FALSE);

  axis->stage = 0;
  axis->econ = 0;
  if (strcmp (text, "payload_kg") == 0)
    axis->kind = SW_CARPET_PARAM_PAYLOAD;
  else if (strcmp (text, "mission.delta_v_m_s") == 0)
    axis->kind = SW_CARPET_PARAM_DELTA_V;
  else if (strcmp (text, "mission.losses_m_s") == 0)
    axis->kind = SW_CARPET_PARAM_LOSSES;
  else if (strcmp (text, "mission.orbit.inclination_deg") == 0)
    axis->kind = SW_CARPET_PARAM_INCLINATION;
  else if (strcmp (text, "mission.orbit.altitude_km") == 0)
    axis->kind = SW_CARPET_PARAM_ALTITUDE;
  else if (g_str_has_prefix (text, "boosters."))
    {
      int found = -1;
      for (guint i = 0; i < G_N_ELEMENTS (booster_names) && found < 0; i++)
        if (strcmp (text, booster_names[i].name) == 0)
          found = (int) i;
      if (found < 0)
        {
          g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
                       _("%s: not a parameter of the carpet plot; use one of %s"), text,
                       PARAM_LIST);
          return FALSE;
        }
      if (design->boosters.count == 0)
        {
          g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
                       _("%s: the design has no strap-on boosters"), text);
          return FALSE;
        }
      axis->kind = booster_names[found].kind;
      if (axis->kind == SW_CARPET_PARAM_BOOSTER_PROPELLANT_LOAD
          && !design->boosters.propellant.has_propellant_kg)
        {
          g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
                       _("%s: the boosters are sized, they have no fixed propellant load to "
                         "vary"), text);
          return FALSE;
        }
    }
  else if (strcmp (text, "mission.orbit.site_latitude_deg") == 0)
    axis->kind = SW_CARPET_PARAM_SITE_LATITUDE;
  else if (g_str_has_prefix (text, "economics."))
    {
      int found = -1;
      for (guint i = 0; i < G_N_ELEMENTS (econ_params) && found < 0; i++)
        if (strcmp (text + strlen ("economics."),
                    sw_economics_number_path (econ_params[i].key)) == 0)
          found = (int) i;
      if (found < 0)
        {
          g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
                       _("%s: not a parameter of the carpet plot; use one of %s"), text,
                       PARAM_LIST);
          return FALSE;
        }
      axis->kind = SW_CARPET_PARAM_ECONOMICS;
      axis->econ = econ_params[found].key;
    }
  else if (sscanf (text, "stages[%u].%63[a-z_]%n", &stage, key, &consumed) == 2
           && text[consumed] == '\0'
           && (strcmp (key, "isp_vac_s") == 0 || strcmp (key, "structural_coefficient") == 0
               || strcmp (key, "propellant_kg") == 0))
    {
      if (stage >= design->n_stages)
        {
          g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
                       _("%s: the design has %u stages, numbered from 0"), text,
                       design->n_stages);
          return FALSE;
        }
      axis->stage = stage;
      axis->kind = strcmp (key, "isp_vac_s") == 0 ? SW_CARPET_PARAM_ISP_VAC
                   : strcmp (key, "propellant_kg") == 0 ? SW_CARPET_PARAM_PROPELLANT_LOAD
                                                        : SW_CARPET_PARAM_STRUCTURAL_COEFFICIENT;
      if (axis->kind == SW_CARPET_PARAM_PROPELLANT_LOAD
          && !design->stages[stage].propellant.has_propellant_kg)
        {
          g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
                       _("%s: the stage is sized, it has no fixed propellant load to vary"),
                       text);
          return FALSE;
        }
    }
  else
    {
      g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
                   _("%s: not a parameter of the carpet plot; use one of %s"), text, PARAM_LIST);
      return FALSE;
    }
  if (axis->kind == SW_CARPET_PARAM_DELTA_V && design->mission.kind != SW_MISSION_DELTA_V)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
                   _("%s: the design's mission is an orbit; vary mission.losses_m_s instead"),
                   text);
      return FALSE;
    }
  if (is_orbit_param (axis->kind) && design->mission.kind != SW_MISSION_ORBIT)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
                   _("%s: the design's mission is a delta-v; vary mission.delta_v_m_s instead"),
                   text);
      return FALSE;
    }
  return TRUE;
}

gboolean
sw_carpet_axis_parse (const char *option, const char *text, const SwDesign *design,
                      SwCarpetAxis *axis, GError **error)
{
  g_auto (GStrv) parts = NULL;
  char *end = NULL;
  guint64 n = 0;

  g_return_val_if_fail (option != NULL && design != NULL && axis != NULL, FALSE);
  if (text == NULL)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_USAGE, _("%s is required (PARAM:MIN:MAX:N)"),
                   option);
      return FALSE;
    }
  parts = g_strsplit (text, ":", -1);
  if (g_strv_length (parts) != 4)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
                   _("%s %s: expected PARAM:MIN:MAX:N, e.g. stages[0].isp_vac_s:280:340:50"),
                   option, text);
      return FALSE;
    }
  if (!sw_carpet_param_parse (parts[0], design, axis, error))
    return FALSE;
  axis->min = g_ascii_strtod (parts[1], &end);
  if (end == parts[1] || *end != '\0' || !isfinite (axis->min))
    goto bad_number;
  axis->max = g_ascii_strtod (parts[2], &end);
  if (end == parts[2] || *end != '\0' || !isfinite (axis->max))
    goto bad_number;
  if (!g_ascii_string_to_unsigned (parts[3], 10, 0, 100000, &n, NULL))
    goto bad_number;
  axis->n = (guint) n;
  return TRUE;

bad_number:
  g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
               _("%s %s: MIN and MAX must be numbers and N a whole number"), option, text);
  return FALSE;
}

char *
sw_carpet_param_dup_name (const SwCarpetAxis *axis)
{
  switch (axis->kind)
    {
    case SW_CARPET_PARAM_PAYLOAD:
      return g_strdup ("payload_kg");
    case SW_CARPET_PARAM_DELTA_V:
      return g_strdup ("mission.delta_v_m_s");
    case SW_CARPET_PARAM_LOSSES:
      return g_strdup ("mission.losses_m_s");
    case SW_CARPET_PARAM_INCLINATION:
      return g_strdup ("mission.orbit.inclination_deg");
    case SW_CARPET_PARAM_ALTITUDE:
      return g_strdup ("mission.orbit.altitude_km");
    case SW_CARPET_PARAM_BOOSTER_COUNT:
    case SW_CARPET_PARAM_BOOSTER_ISP_VAC:
    case SW_CARPET_PARAM_BOOSTER_STRUCTURAL_COEFFICIENT:
    case SW_CARPET_PARAM_BOOSTER_THRUST:
    case SW_CARPET_PARAM_BOOSTER_PROPELLANT_LOAD:
      for (guint i = 0; i < G_N_ELEMENTS (booster_names); i++)
        if (booster_names[i].kind == axis->kind)
          return g_strdup (booster_names[i].name);
      return g_strdup ("boosters");
    case SW_CARPET_PARAM_SITE_LATITUDE:
      return g_strdup ("mission.orbit.site_latitude_deg");
    case SW_CARPET_PARAM_ECONOMICS:
      return g_strdup_printf ("economics.%s", sw_economics_number_path (axis->econ));
    case SW_CARPET_PARAM_ISP_VAC:
      return g_strdup_printf ("stages[%u].isp_vac_s", axis->stage);
    case SW_CARPET_PARAM_PROPELLANT_LOAD:
      return g_strdup_printf ("stages[%u].propellant_kg", axis->stage);
    case SW_CARPET_PARAM_STRUCTURAL_COEFFICIENT:
    default:
      return g_strdup_printf ("stages[%u].structural_coefficient", axis->stage);
    }
}

char *
sw_carpet_param_dup_label (const SwCarpetAxis *axis)
{
  switch (axis->kind)
    {
    case SW_CARPET_PARAM_PAYLOAD:
      return g_strdup (_("Payload"));
    case SW_CARPET_PARAM_DELTA_V:
      return g_strdup (_("Mission delta-v"));
    case SW_CARPET_PARAM_LOSSES:
      return g_strdup (_("Loss allowance"));
    case SW_CARPET_PARAM_INCLINATION:
      return g_strdup (_("Orbit inclination"));
    case SW_CARPET_PARAM_ALTITUDE:
      return g_strdup (_("Orbit altitude"));
    case SW_CARPET_PARAM_BOOSTER_COUNT:
      return g_strdup (_("Number of boosters"));
    case SW_CARPET_PARAM_BOOSTER_ISP_VAC:
      return g_strdup (_("Vacuum Isp, boosters"));
    case SW_CARPET_PARAM_BOOSTER_STRUCTURAL_COEFFICIENT:
      return g_strdup (_("Structural coefficient, boosters"));
    case SW_CARPET_PARAM_BOOSTER_THRUST:
      return g_strdup (_("Thrust per booster"));
    case SW_CARPET_PARAM_BOOSTER_PROPELLANT_LOAD:
      return g_strdup (_("Fixed propellant load per booster"));
    case SW_CARPET_PARAM_SITE_LATITUDE:
      return g_strdup (_("Launch site latitude"));
    case SW_CARPET_PARAM_ECONOMICS:
      {
        int k = econ_param_index (axis->econ);
        return g_strdup (k >= 0 ? _(econ_params[k].label) : "?");
      }
    case SW_CARPET_PARAM_ISP_VAC:
      return g_strdup_printf (_("Vacuum Isp, stage %u"), axis->stage + 1);
    case SW_CARPET_PARAM_PROPELLANT_LOAD:
      return g_strdup_printf (_("Fixed propellant load, stage %u"), axis->stage + 1);
    case SW_CARPET_PARAM_STRUCTURAL_COEFFICIENT:
    default:
      return g_strdup_printf (_("Structural coefficient, stage %u"), axis->stage + 1);
    }
}

static const char *const output_names[] = {
  [SW_CARPET_LIFTOFF_MASS] = "liftoff_mass",
  [SW_CARPET_PAYLOAD] = "payload",
  [SW_CARPET_DEVELOPMENT] = "development",
  [SW_CARPET_COST_PER_FLIGHT] = "cost_per_flight",
};

const char *
sw_carpet_output_to_string (SwCarpetOutput output)
{
  return output <= SW_CARPET_COST_PER_FLIGHT ? output_names[output] : "liftoff_mass";
}

gboolean
sw_carpet_output_from_string (const char *text, SwCarpetOutput *output)
{
  for (guint i = 0; i < G_N_ELEMENTS (output_names); i++)
    if (g_strcmp0 (text, output_names[i]) == 0)
      {
        *output = (SwCarpetOutput) i;
        return TRUE;
      }
  return FALSE;
}

SwLimitId
sw_carpet_param_limit (const SwCarpetAxis *axis)
{
  switch (axis->kind)
    {
    case SW_CARPET_PARAM_INCLINATION:
      return SW_LIMIT_INCLINATION;
    case SW_CARPET_PARAM_ALTITUDE:
      return SW_LIMIT_ALTITUDE;
    case SW_CARPET_PARAM_BOOSTER_COUNT:
      return SW_LIMIT_BOOSTER_COUNT;
    case SW_CARPET_PARAM_BOOSTER_ISP_VAC:
      return SW_LIMIT_ISP_VAC;
    case SW_CARPET_PARAM_BOOSTER_STRUCTURAL_COEFFICIENT:
      return SW_LIMIT_STRUCTURAL_COEFFICIENT;
    case SW_CARPET_PARAM_BOOSTER_THRUST:
      return SW_LIMIT_THRUST_VAC;
    case SW_CARPET_PARAM_BOOSTER_PROPELLANT_LOAD:
      return SW_LIMIT_PROPELLANT_LOAD;
    case SW_CARPET_PARAM_SITE_LATITUDE:
      return SW_LIMIT_SITE_LATITUDE;
    case SW_CARPET_PARAM_ECONOMICS:
      return sw_economics_number_limit (axis->econ);
    case SW_CARPET_PARAM_PROPELLANT_LOAD:
      return SW_LIMIT_PROPELLANT_LOAD;
    case SW_CARPET_PARAM_PAYLOAD:
      return SW_LIMIT_PAYLOAD;
    case SW_CARPET_PARAM_DELTA_V:
      return SW_LIMIT_DELTA_V;
    case SW_CARPET_PARAM_LOSSES:
      return SW_LIMIT_LOSSES;
    case SW_CARPET_PARAM_ISP_VAC:
      return SW_LIMIT_ISP_VAC;
    case SW_CARPET_PARAM_STRUCTURAL_COEFFICIENT:
    default:
      return SW_LIMIT_STRUCTURAL_COEFFICIENT;
    }
}

gboolean
sw_carpet_axis_check (const SwCarpetAxis *axis, const SwDesign *design, GError **error)
{
  g_autofree char *name = sw_carpet_param_dup_name (axis);
  SwLimitId id = sw_carpet_param_limit (axis);
  const SwLimit *l = sw_limit_get (id);

  if (axis->n < 2 || axis->n > SW_CARPET_MAX_POINTS)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
                   _("%s: %u points; a carpet axis has 2 to %u"), name, axis->n,
                   SW_CARPET_MAX_POINTS);
      return FALSE;
    }
  if (!(axis->min < axis->max))
    {
      g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
                   _("%s: the range %g to %g is empty; give the smaller value first"), name,
                   axis->min, axis->max);
      return FALSE;
    }
  if (!sw_limit_contains (id, axis->min) || !sw_limit_contains (id, axis->max))
    {
      g_set_error (error, SW_ERROR, SW_ERROR_RANGE,
                   _("%s: the range %g to %g leaves the accepted range %s%.10g to %.10g%s%s"),
                   name, axis->min, axis->max, l->min_exclusive ? _("above ") : "", l->min,
                   l->max, l->unit[0] ? " " : "", l->unit);
      return FALSE;
    }
  if (axis->kind == SW_CARPET_PARAM_ISP_VAC && design->stages[axis->stage].has_isp_sl
      && axis->min < design->stages[axis->stage].isp_sl_s)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_RANGE,
                   _("%s: the range starts below the stage's sea-level Isp of %g s"), name,
                   design->stages[axis->stage].isp_sl_s);
      return FALSE;
    }
  if (axis->kind == SW_CARPET_PARAM_BOOSTER_ISP_VAC && design->boosters.has_isp_sl
      && axis->min < design->boosters.isp_sl_s)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_RANGE,
                   _("%s: the range starts below the boosters' sea-level Isp of %g s"), name,
                   design->boosters.isp_sl_s);
      return FALSE;
    }
  if (is_booster_param (axis->kind) && design->boosters.count == 0)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_USAGE, _("%s: the design has no strap-on boosters"),
                   name);
      return FALSE;
    }
  /* A whole-number axis takes whole values: no value twice. */
  for (guint i = 1; sw_carpet_param_is_whole (axis) && i < axis->n; i++)
    if (!(sw_carpet_axis_value (axis, i) > sw_carpet_axis_value (axis, i - 1)))
      {
        double lo = round (axis->min), hi = round (axis->max);
        guint distinct = hi >= lo ? (guint) (hi - lo) + 1 : 1;

        g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
                     _("%s takes whole numbers: %u points from %g to %g would repeat values; "
                       "give at most %u points"),
                     name, axis->n, axis->min, axis->max, distinct);
        return FALSE;
      }
  return TRUE;
}

double
sw_carpet_axis_value (const SwCarpetAxis *axis, guint i)
{
  double v;

  if (axis->n < 2)
    v = axis->min;
  else if (i + 1 >= axis->n)
    v = axis->max;
  else
    v = axis->min + (axis->max - axis->min) * i / (axis->n - 1);
  return sw_carpet_param_is_whole (axis) ? round (v) : v;
}

gboolean
sw_carpet_param_is_whole (const SwCarpetAxis *axis)
{
  return axis->kind == SW_CARPET_PARAM_BOOSTER_COUNT
         || (axis->kind == SW_CARPET_PARAM_ECONOMICS && sw_economics_number_is_whole (axis->econ));
}

gboolean
sw_carpet_param_equal (const SwCarpetAxis *a, const SwCarpetAxis *b)
{
  if (a->kind != b->kind)
    return FALSE;
  if (a->kind == SW_CARPET_PARAM_ISP_VAC || a->kind == SW_CARPET_PARAM_STRUCTURAL_COEFFICIENT
      || a->kind == SW_CARPET_PARAM_PROPELLANT_LOAD)
    return a->stage == b->stage;
  if (a->kind == SW_CARPET_PARAM_ECONOMICS)
    return a->econ == b->econ;
  return TRUE;
}

const char *
sw_carpet_param_unit (const SwCarpetAxis *axis)
{
  const SwLimit *l = sw_limit_get (sw_carpet_param_limit (axis));

  /* "flights" and "characters" are counts, not units to print by values. */
  return l != NULL ? l->unit : "";
}

guint
sw_carpet_list_params (const SwDesign *design, SwCarpetOutput output, SwCarpetAxis *out,
                       guint max)
{
  guint n = 0;

#define ADD(k, s, e)                                                                     \
  G_STMT_START                                                                           \
  {                                                                                      \
    if (n < max)                                                                         \
      {                                                                                  \
        memset (&out[n], 0, sizeof out[n]);                                              \
        out[n].kind = (k);                                                               \
        out[n].stage = (s);                                                              \
        out[n].econ = (e);                                                               \
      }                                                                                  \
    n++;                                                                                 \
  }                                                                                      \
  G_STMT_END

  g_return_val_if_fail (design != NULL, 0);
  for (guint i = 0; i < design->n_stages; i++)
    {
      ADD (SW_CARPET_PARAM_STRUCTURAL_COEFFICIENT, i, 0);
      ADD (SW_CARPET_PARAM_ISP_VAC, i, 0);
      if (design->stages[i].propellant.has_propellant_kg)
        ADD (SW_CARPET_PARAM_PROPELLANT_LOAD, i, 0);
    }
  if (design->boosters.count > 0)
    {
      ADD (SW_CARPET_PARAM_BOOSTER_COUNT, 0, 0);
      ADD (SW_CARPET_PARAM_BOOSTER_STRUCTURAL_COEFFICIENT, 0, 0);
      ADD (SW_CARPET_PARAM_BOOSTER_ISP_VAC, 0, 0);
      ADD (SW_CARPET_PARAM_BOOSTER_THRUST, 0, 0);
      if (design->boosters.propellant.has_propellant_kg)
        ADD (SW_CARPET_PARAM_BOOSTER_PROPELLANT_LOAD, 0, 0);
    }
  ADD (SW_CARPET_PARAM_PAYLOAD, 0, 0);
  if (design->mission.kind == SW_MISSION_DELTA_V)
    ADD (SW_CARPET_PARAM_DELTA_V, 0, 0);
  else
    {
      ADD (SW_CARPET_PARAM_LOSSES, 0, 0);
      ADD (SW_CARPET_PARAM_ALTITUDE, 0, 0);
      ADD (SW_CARPET_PARAM_INCLINATION, 0, 0);
      ADD (SW_CARPET_PARAM_SITE_LATITUDE, 0, 0);
    }
  if (output == SW_CARPET_DEVELOPMENT || output == SW_CARPET_COST_PER_FLIGHT)
    for (guint i = 0; i < G_N_ELEMENTS (econ_params); i++)
      ADD (SW_CARPET_PARAM_ECONOMICS, 0, econ_params[i].key);
#undef ADD
  return MIN (n, max);
}

void
sw_carpet_axis_default_range (SwCarpetAxis *axis, const SwDesign *design)
{
  const SwLimit *l = sw_limit_get (sw_carpet_param_limit (axis));
  double v = sw_carpet_design_value (axis, design), lo, hi;
  /* The smallest step above an exclusive lower limit that prints cleanly. */
  double floor_ = l->min_exclusive ? l->min + MAX (1e-3, fabs (l->max - l->min) * 1e-4) : l->min;

  switch (axis->kind)
    {
    case SW_CARPET_PARAM_ISP_VAC:
      lo = 0.85 * v;
      hi = 1.15 * v;
      if (design->stages[axis->stage].has_isp_sl)
        lo = MAX (lo, design->stages[axis->stage].isp_sl_s);
      break;
    case SW_CARPET_PARAM_BOOSTER_ISP_VAC:
      lo = 0.85 * v;
      hi = 1.15 * v;
      if (design->boosters.has_isp_sl)
        lo = MAX (lo, design->boosters.isp_sl_s);
      break;
    case SW_CARPET_PARAM_BOOSTER_COUNT:
      lo = 1.0;
      hi = MAX (2.0 * v, 4.0);
      break;
    case SW_CARPET_PARAM_ALTITUDE:
      lo = MAX (150.0, 0.5 * v);
      hi = MAX (lo + 100.0, 2.0 * v);
      break;
    case SW_CARPET_PARAM_INCLINATION:
      lo = MAX (fabs (design->mission.site_latitude_deg), v - 30.0);
      hi = MIN (180.0 - fabs (design->mission.site_latitude_deg), v + 30.0);
      break;
    case SW_CARPET_PARAM_SITE_LATITUDE:
      lo = v - 20.0;
      hi = v + 20.0;
      break;
    case SW_CARPET_PARAM_LOSSES:
      lo = 0.5 * v;
      hi = 1.5 * v;
      if (!(hi > lo))
        {
          lo = 0.0;
          hi = 2000.0;
        }
      break;
    default:
      lo = 0.5 * v;
      hi = 1.5 * v;
      break;
    }
  if (!isfinite (lo) || !isfinite (hi) || !(hi > lo))
    {
      lo = floor_;
      hi = l->max;
    }
  axis->min = CLAMP (lo, floor_, l->max);
  axis->max = CLAMP (hi, floor_, l->max);
  if (sw_carpet_param_is_whole (axis))
    {
      axis->min = ceil (axis->min);
      axis->max = floor (axis->max);
    }
  if (!(axis->max > axis->min))
    {
      axis->min = floor_;
      axis->max = l->max;
    }
  /* Whole numbers: at most one point per value. */
  if (sw_carpet_param_is_whole (axis) && axis->max - axis->min + 1.0 < axis->n)
    axis->n = (guint) MAX (2.0, axis->max - axis->min + 1.0);
}

/* The orbit moved to @altitude_km: the allowance (the budget's, 0 without
 * one) moves by the change in the climb's energy, as in the payload curves. */
static void
altitude_apply (SwMission *m, double altitude_km)
{
  double losses = m->has_losses ? m->losses_m_s : 0.0;

  losses += sw_payload_climb_m_s (altitude_km) - sw_payload_climb_m_s (m->altitude_km);
  m->losses_m_s = MAX (losses, 0.0);
  m->has_losses = TRUE;
  m->altitude_km = altitude_km;
}

double
sw_carpet_design_value (const SwCarpetAxis *axis, const SwDesign *design)
{
  switch (axis->kind)
    {
    case SW_CARPET_PARAM_PAYLOAD:
      return design->payload_kg;
    case SW_CARPET_PARAM_DELTA_V:
      return design->mission.delta_v_m_s;
    case SW_CARPET_PARAM_LOSSES:
      {
        SwBudget budget;
        return sw_design_budget (design, &budget, NULL) ? budget.losses_m_s : NAN;
      }
    case SW_CARPET_PARAM_INCLINATION:
      return design->mission.inclination_deg;
    case SW_CARPET_PARAM_ALTITUDE:
      return design->mission.altitude_km;
    case SW_CARPET_PARAM_BOOSTER_COUNT:
      return design->boosters.count;
    case SW_CARPET_PARAM_BOOSTER_ISP_VAC:
      return design->boosters.isp_vac_s;
    case SW_CARPET_PARAM_BOOSTER_STRUCTURAL_COEFFICIENT:
      return design->boosters.structural_coefficient;
    case SW_CARPET_PARAM_BOOSTER_THRUST:
      return design->boosters.thrust_vac_kn;
    case SW_CARPET_PARAM_BOOSTER_PROPELLANT_LOAD:
      return design->boosters.propellant.propellant_kg;
    case SW_CARPET_PARAM_SITE_LATITUDE:
      return design->mission.site_latitude_deg;
    case SW_CARPET_PARAM_ECONOMICS:
      return sw_economics_get_number (&design->economics, axis->econ);
    case SW_CARPET_PARAM_PROPELLANT_LOAD:
      return design->stages[axis->stage].propellant.propellant_kg;
    case SW_CARPET_PARAM_ISP_VAC:
      return design->stages[axis->stage].isp_vac_s;
    case SW_CARPET_PARAM_STRUCTURAL_COEFFICIENT:
    default:
      return design->stages[axis->stage].structural_coefficient;
    }
}

void
sw_carpet_apply (const SwCarpetAxis *axis, SwDesign *design, double value)
{
  switch (axis->kind)
    {
    case SW_CARPET_PARAM_PAYLOAD:
      design->payload_kg = value;
      break;
    case SW_CARPET_PARAM_DELTA_V:
      design->mission.delta_v_m_s = value;
      break;
    case SW_CARPET_PARAM_LOSSES:
      design->mission.losses_m_s = value;
      design->mission.has_losses = TRUE;
      break;
    case SW_CARPET_PARAM_INCLINATION:
      design->mission.inclination_deg = value;
      break;
    case SW_CARPET_PARAM_ALTITUDE:
      altitude_apply (&design->mission, value);
      break;
    case SW_CARPET_PARAM_BOOSTER_COUNT:
      design->boosters.count = (guint) value;
      break;
    case SW_CARPET_PARAM_BOOSTER_ISP_VAC:
      design->boosters.isp_vac_s = value;
      break;
    case SW_CARPET_PARAM_BOOSTER_STRUCTURAL_COEFFICIENT:
      design->boosters.structural_coefficient = value;
      break;
    case SW_CARPET_PARAM_BOOSTER_THRUST:
      design->boosters.thrust_vac_kn = value;
      break;
    case SW_CARPET_PARAM_BOOSTER_PROPELLANT_LOAD:
      design->boosters.propellant.propellant_kg = value;
      design->boosters.propellant.has_propellant_kg = TRUE;
      break;
    case SW_CARPET_PARAM_SITE_LATITUDE:
      design->mission.site_latitude_deg = value;
      break;
    case SW_CARPET_PARAM_ECONOMICS:
      sw_economics_set_number (&design->economics, axis->econ, value);
      break;
    case SW_CARPET_PARAM_PROPELLANT_LOAD:
      design->stages[axis->stage].propellant.propellant_kg = value;
      design->stages[axis->stage].propellant.has_propellant_kg = TRUE;
      break;
    case SW_CARPET_PARAM_ISP_VAC:
      design->stages[axis->stage].isp_vac_s = value;
      break;
    case SW_CARPET_PARAM_STRUCTURAL_COEFFICIENT:
      design->stages[axis->stage].structural_coefficient = value;
      break;
    }
}

/* The inputs of one sizing, the cheap copy the grid varies.  The mission
 * and the economics are varied in @scratch, a shallow copy of the design
 * (no notes, no baseline) read by the budget and the cost model. */
typedef struct {
  SwStageSet set;
  double fixed_kg[SW_MAX_STAGES];     /* the design's fixed loads; 0: sized */
  gboolean any_fixed;
  gboolean parallel;                  /* the design has boosters: sized as a parallel vehicle */
  SwParallelVehicle pv;               /* its boosters and core thrust (set, fixed_kg unused) */
  double payload_kg;
  double delta_v_m_s;
  SwMission mission;
  SwEconomics economics;
} Point;

/* The payload at which the point's vehicle weighs @liftoff_kg.  Without a
 * fixed load the sizing is linear in the payload; with one it is not (a
 * fixed stage weighs the same whatever it carries), so the secant method
 * closes in on the mass, which rises with the payload.  NAN when no
 * vehicle of that mass closes. */
static void
point_size (const Point *p, double payload_kg, SwSplitMode split, SwSizing *out)
{
  if (p->parallel && p->pv.count > 0)
    {
      SwParallelVehicle v = p->pv;

      v.set = p->set;
      memcpy (v.fixed_kg, p->fixed_kg, sizeof v.fixed_kg);
      sw_size_parallel (&v, payload_kg, p->delta_v_m_s, split, out);
    }
  else
    sw_size_with_fixed (&p->set, p->fixed_kg, payload_kg, p->delta_v_m_s, split, out);
}

static double
point_payload_at_mass (const Point *p, SwSplitMode split, const SwSizing *at_payload,
                       double liftoff_kg)
{
  double x0 = p->payload_kg, f0 = at_payload->liftoff_mass_kg - liftoff_kg;
  double x1 = p->payload_kg * liftoff_kg / at_payload->liftoff_mass_kg, f1;

  /* Boosters' burn times follow from their absolute thrust: not linear. */
  if (!p->any_fixed && !(p->parallel && p->pv.count > 0))
    return x1;
  for (guint k = 0; k < 60; k++)
    {
      SwSizing s;
      double x2;

      point_size (p, x1, split, &s);
      if (!s.feasible)
        return NAN;
      f1 = s.liftoff_mass_kg - liftoff_kg;
      if (fabs (f1) <= 1e-9 * liftoff_kg)
        return x1;
      if (f1 == f0)
        return NAN;
      x2 = x1 - f1 * (x1 - x0) / (f1 - f0);
      x0 = x1;
      f0 = f1;
      x1 = x2 > 0.0 ? x2 : 0.5 * x1;
    }
  return NAN;
}

static void
point_apply (const SwCarpetAxis *axis, Point *p, double value, double dv_without_losses)
{
  switch (axis->kind)
    {
    case SW_CARPET_PARAM_PAYLOAD:
      p->payload_kg = value;
      break;
    case SW_CARPET_PARAM_DELTA_V:
      p->delta_v_m_s = value;
      break;
    case SW_CARPET_PARAM_LOSSES:
      p->delta_v_m_s = dv_without_losses + value;
      p->mission.losses_m_s = value;
      p->mission.has_losses = TRUE;
      break;
    case SW_CARPET_PARAM_INCLINATION:
      p->mission.inclination_deg = value;
      break;
    case SW_CARPET_PARAM_ALTITUDE:
      altitude_apply (&p->mission, value);
      break;
    case SW_CARPET_PARAM_BOOSTER_COUNT:
      p->pv.count = (guint) value;
      break;
    case SW_CARPET_PARAM_BOOSTER_ISP_VAC:
      p->pv.booster_exhaust_velocity_m_s = value * SW_G0;
      break;
    case SW_CARPET_PARAM_BOOSTER_STRUCTURAL_COEFFICIENT:
      p->pv.booster_structural_coefficient = value;
      break;
    case SW_CARPET_PARAM_BOOSTER_THRUST:
      p->pv.booster_thrust_n = value * 1000.0;
      break;
    case SW_CARPET_PARAM_BOOSTER_PROPELLANT_LOAD:
      p->pv.booster_fixed_kg = value;
      break;
    case SW_CARPET_PARAM_SITE_LATITUDE:
      p->mission.site_latitude_deg = value;
      break;
    case SW_CARPET_PARAM_ECONOMICS:
      sw_economics_set_number (&p->economics, axis->econ, value);
      break;
    case SW_CARPET_PARAM_PROPELLANT_LOAD:
      p->fixed_kg[axis->stage] = value;
      break;
    case SW_CARPET_PARAM_ISP_VAC:
      p->set.exhaust_velocity_m_s[axis->stage] = value * SW_G0;
      break;
    case SW_CARPET_PARAM_STRUCTURAL_COEFFICIENT:
      p->set.structural_coefficient[axis->stage] = value;
      break;
    }
}

/* The orbit's budget depends on the axis: computed again at every point. */
static gboolean
needs_budget (SwCarpetParamKind kind)
{
  return kind == SW_CARPET_PARAM_INCLINATION || kind == SW_CARPET_PARAM_SITE_LATITUDE
         || kind == SW_CARPET_PARAM_ALTITUDE;
}

static double
point_output (SwDesign *scratch, const SwCarpet *c, Point *p, SwSplitMode split,
              double design_liftoff, gboolean budget)
{
  SwSizing sizing;
  SwCostVehicle vehicle;
  SwCost cost;

  if (budget)
    {
      /* An inclination the site cannot reach does not close. */
      scratch->mission = p->mission;
      if (!sw_design_required_delta_v (scratch, &p->delta_v_m_s, NULL))
        return NAN;
    }
  /* The design's fixed propellant loads are honoured (sw_size_with_fixed
   * is sw_size bit for bit without them). */
  point_size (p, p->payload_kg, split, &sizing);
  if (!sizing.feasible)
    return NAN;
  switch (c->output)
    {
    case SW_CARPET_PAYLOAD:
      return point_payload_at_mass (p, split, &sizing, design_liftoff);
    case SW_CARPET_DEVELOPMENT:
    case SW_CARPET_COST_PER_FLIGHT:
      scratch->economics = p->economics;
      sw_cost_vehicle_from_sizing (&vehicle, &sizing, scratch);
      sw_cost_compute (scratch, &vehicle, &cost);
      return c->output == SW_CARPET_DEVELOPMENT ? cost.development_work_years
                                                : cost.cost_per_flight_work_years;
    case SW_CARPET_LIFTOFF_MASS:
    default:
      return sizing.liftoff_mass_kg;
    }
}

static SwCarpet *carpet_compute (const SwDesign *design, const SwCarpetOptions *options,
                                 gboolean looped, GError **error);

SwCarpet *
sw_carpet_compute (const SwDesign *design, const SwCarpetOptions *options, GError **error)
{
  return carpet_compute (design, options, FALSE, error);
}

SwCarpet *
sw_carpet_compute_looped (const SwDesign *looped, const SwCarpetOptions *options,
                          GError **error)
{
  return carpet_compute (looped, options, TRUE, error);
}

/* Which losses the points of a simulate design are sized with, in plain
 * words: the closed loop's (@looped) or the first guess; the loss axis
 * itself, when it is one, varies them. */
static void
losses_note (SwCarpet *c, const SwDesign *design, gboolean looped)
{
  SwBudget b;
  g_autofree char *losses = sw_design_budget (design, &b, NULL)
                              ? sw_format_speed (b.losses_m_s) : g_strdup ("?");
  gboolean axis = c->x.kind == SW_CARPET_PARAM_LOSSES || c->y.kind == SW_CARPET_PARAM_LOSSES;

  if (looped && axis)
    /* Translators: %s is a speed ("1,868 m/s") */
    g_snprintf (c->note, sizeof c->note,
                _("The losses are an axis here; this design is marked at the closed loop's "
                  "losses of %s, flown by its own vehicle. No ascent is flown at the points."),
                losses);
  else if (looped)
    /* Translators: %s is a speed ("1,868 m/s") */
    g_snprintf (c->note, sizeof c->note,
                _("Every point is sized with the closed loop's losses of %s as a fixed "
                  "allowance, flown by this design's own vehicle; no ascent is flown at the "
                  "points."),
                losses);
  else if (axis)
    /* Translators: %s is a speed ("2,500 m/s") */
    g_snprintf (c->note, sizeof c->note,
                _("The losses are an axis here; this design is marked at the loss allowance of "
                  "%s, the design's first guess for its closed loop. No ascent is flown at the "
                  "points."),
                losses);
  else
    /* Translators: %s is a speed ("2,500 m/s") */
    g_snprintf (c->note, sizeof c->note,
                _("Every point is sized with the loss allowance of %s, the design's first "
                  "guess for its closed loop: no ascent is flown at the points."), losses);
  /* The altitude axis moves the allowance (altitude_apply), unless the
   * losses are the other axis. */
  if (!axis && (c->x.kind == SW_CARPET_PARAM_ALTITUDE || c->y.kind == SW_CARPET_PARAM_ALTITUDE))
    {
      gsize n = strlen (c->note);

      g_snprintf (c->note + n, sizeof c->note - n, " %s",
                  _("At other altitudes the allowance moves with the climb's energy."));
    }
}

static SwCarpet *
carpet_compute (const SwDesign *design, const SwCarpetOptions *options, gboolean looped,
                GError **error)
{
  g_autoptr (SwCarpet) c = NULL;
  g_autofree SwDesign *scratch = NULL;
  Point base, row;
  double dv_without_losses = 0.0, design_liftoff;
  gboolean budget;
  SwSizing own;

  g_return_val_if_fail (design != NULL && options != NULL && design->n_stages > 0, NULL);

  if (!sw_carpet_axis_check (&options->x, design, error)
      || !sw_carpet_axis_check (&options->y, design, error))
    return NULL;
  if (sw_carpet_param_equal (&options->x, &options->y))
    {
      g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
                   _("The two axes of a carpet plot must be different parameters."));
      return NULL;
    }
  if ((options->x.kind == SW_CARPET_PARAM_ECONOMICS
       || options->y.kind == SW_CARPET_PARAM_ECONOMICS)
      && options->output != SW_CARPET_DEVELOPMENT && options->output != SW_CARPET_COST_PER_FLIGHT)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
                   _("The cost model's keys change only the cost outputs (development, "
                     "cost_per_flight), not %s."),
                   sw_carpet_output_to_string (options->output));
      return NULL;
    }
  budget = needs_budget (options->x.kind) || needs_budget (options->y.kind);

  /* A shallow copy: the heap members are not the scratch's to free. */
  memset (&base, 0, sizeof base);
  scratch = g_memdup2 (design, sizeof *design);
  scratch->notes = NULL;
  scratch->baseline = NULL;
  sw_stage_set_from_design (&base.set, design);
  base.any_fixed = FALSE;
  for (guint i = 0; i < SW_MAX_STAGES; i++)
    {
      base.fixed_kg[i] = i < design->n_stages && design->stages[i].propellant.has_propellant_kg
                           ? design->stages[i].propellant.propellant_kg : 0.0;
      base.any_fixed = base.any_fixed || base.fixed_kg[i] > 0.0;
    }
  base.parallel = design->boosters.count > 0;
  if (base.parallel && !sw_parallel_vehicle_from_design (&base.pv, design, error))
    return NULL;
  base.payload_kg = design->payload_kg;
  base.mission = design->mission;
  base.economics = design->economics;
  if (!sw_design_required_delta_v (design, &base.delta_v_m_s, error))
    return NULL;
  if (design->mission.kind == SW_MISSION_ORBIT)
    {
      SwBudget b;
      if (!sw_design_budget (design, &b, error))
        return NULL;
      dv_without_losses = b.delta_v_m_s - b.losses_m_s;
    }
  point_size (&base, base.payload_kg, design->split, &own);
  design_liftoff = own.feasible ? own.liftoff_mass_kg : NAN;

  c = g_new0 (SwCarpet, 1);
  c->x = options->x;
  c->y = options->y;
  c->output = options->output;
  c->values = g_new (double, (gsize) c->x.n * c->y.n);
  c->feasible = g_new (gboolean, (gsize) c->x.n * c->y.n);
  c->design_x = sw_carpet_design_value (&c->x, design);
  c->design_y = sw_carpet_design_value (&c->y, design);
  row = base;
  c->design_value = point_output (scratch, c, &row, design->split, design_liftoff, FALSE);
  if (design->mission.kind == SW_MISSION_ORBIT && design->mission.loss_model == SW_LOSS_SIMULATE)
    losses_note (c, design, looped);

  for (guint j = 0; j < c->y.n; j++)
    {
      if (g_cancellable_set_error_if_cancelled (options->cancellable, error))
        return NULL;
      row = base;
      point_apply (&c->y, &row, sw_carpet_axis_value (&c->y, j), dv_without_losses);
      for (guint i = 0; i < c->x.n; i++)
        {
          Point p = row;
          gsize k = (gsize) j * c->x.n + i;

          point_apply (&c->x, &p, sw_carpet_axis_value (&c->x, i), dv_without_losses);
          c->values[k] = point_output (scratch, c, &p, design->split, design_liftoff, budget);
          c->feasible[k] = isfinite (c->values[k]);
          if (!c->feasible[k])
            {
              c->values[k] = NAN;
              c->n_infeasible++;
            }
        }
      if (options->progress != NULL)
        options->progress ((double) (j + 1) / c->y.n, options->progress_data);
    }
  /* The cost outputs in money, at the design's cost of a work-year. */
  c->work_year_cost = c->design_money = NAN;
  if ((c->output == SW_CARPET_DEVELOPMENT || c->output == SW_CARPET_COST_PER_FLIGHT)
      && design->economics.has_work_year_cost)
    {
      c->has_money = TRUE;
      c->work_year_cost = design->economics.work_year_cost;
      g_strlcpy (c->currency, design->economics.currency, sizeof c->currency);
      c->money = g_new (double, (gsize) c->x.n * c->y.n);
      for (gsize k = 0; k < (gsize) c->x.n * c->y.n; k++)
        c->money[k] = c->feasible[k] ? c->values[k] * c->work_year_cost : NAN;
      c->design_money = c->design_value * c->work_year_cost;
    }
  return g_steal_pointer (&c);
}

void
sw_carpet_free (SwCarpet *carpet)
{
  if (carpet == NULL)
    return;
  g_free (carpet->values);
  g_free (carpet->feasible);
  g_free (carpet->money);
  g_free (carpet);
}
