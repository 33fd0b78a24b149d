/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-economics"

#include "config.h"

#include "sw-economics.h"

#include "sw-optional-keys.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

const char *const sw_economics_design_keys[] = { "economics", NULL };

static const char *const economics_keys[] = {
  "work_year_cost", "currency", "production_run", "learning_rate", "cost_coefficients", "engine_types",
  "developed_stages", "developed_boosters", "engine_mass_fraction", "recovery", "decision_weights", NULL
};
static const char *const engine_keys[] = { "name", "dry_mass_kg", "on_stages", "developed", NULL };
static const char *const recovery_keys[] = {
  "mode", "recovery_delta_v_m_s", "landing_hardware_fraction", "refurbishment_fraction",
  "flights_per_stage", "booster_mode", "booster_recovery_delta_v_m_s", NULL
};
static const char *const weight_keys[] = {
  "liftoff_mass", "development", "cost_per_flight", "failure", NULL
};

/* The one table of cost coefficients.  The form a M^x, b M^y and f0 = 1.04^N
 * is the published statistical model (Koelle, TRANSCOST 7.x/8.x, read in a
 * secondary description); the numbers are from memory: check before relying. */
static const SwCerInfo cer_table[SW_N_CER] = {
  [SW_CER_STAGE_DEV_FACTOR] = { "stage_development_factor", 100.0,
    N_("published form, value from memory"), SW_LIMIT_CER_STAGE_DEV_FACTOR },
  [SW_CER_STAGE_DEV_EXPONENT] = { "stage_development_exponent", 0.555,
    N_("published form, value from memory"), SW_LIMIT_CER_STAGE_DEV_EXPONENT },
  [SW_CER_STAGE_UNIT_FACTOR] = { "stage_unit_factor", 1.265,
    N_("published form, value from memory"), SW_LIMIT_CER_STAGE_UNIT_FACTOR },
  [SW_CER_STAGE_UNIT_EXPONENT] = { "stage_unit_exponent", 0.59,
    N_("published form, value from memory"), SW_LIMIT_CER_STAGE_UNIT_EXPONENT },
  [SW_CER_ENGINE_DEV_FACTOR] = { "engine_development_factor", 277.0,
    N_("published form, value from memory"), SW_LIMIT_CER_ENGINE_DEV_FACTOR },
  [SW_CER_ENGINE_DEV_EXPONENT] = { "engine_development_exponent", 0.48,
    N_("published form, value from memory"), SW_LIMIT_CER_ENGINE_DEV_EXPONENT },
  [SW_CER_ENGINE_UNIT_FACTOR] = { "engine_unit_factor", 1.9,
    N_("published form, value from memory"), SW_LIMIT_CER_ENGINE_UNIT_FACTOR },
  [SW_CER_ENGINE_UNIT_EXPONENT] = { "engine_unit_exponent", 0.535,
    N_("published form, value from memory"), SW_LIMIT_CER_ENGINE_UNIT_EXPONENT },
  [SW_CER_SYSTEMS_BASE] = { "systems_factor_per_stage", 1.04,
    N_("published form and value"), SW_LIMIT_CER_SYSTEMS_BASE },
};

const SwCerInfo *
sw_cer_info (SwCerId id)
{
  g_return_val_if_fail (id < SW_N_CER, NULL);
  return &cer_table[id];
}

void
sw_economics_init (SwEconomics *econ)
{
  g_return_if_fail (econ != NULL);
  memset (econ, 0, sizeof *econ);
  econ->production_run = SW_ECONOMICS_DEFAULT_PRODUCTION_RUN;
  /* Common practice for aerospace production: 0.85 to 0.95. */
  econ->learning_rate = SW_ECONOMICS_DEFAULT_LEARNING_RATE;
  for (guint i = 0; i < SW_N_CER; i++)
    econ->coefficients[i] = cer_table[i].value;
  econ->engine_mass_fraction = SW_ECONOMICS_DEFAULT_ENGINE_MASS_FRACTION;
  econ->recovery_mode = SW_RECOVERY_NONE;
  econ->landing_hardware_fraction = SW_ECONOMICS_DEFAULT_LANDING_HARDWARE;
  econ->refurbishment_fraction = SW_ECONOMICS_DEFAULT_REFURBISHMENT;
  econ->flights_per_stage = SW_ECONOMICS_DEFAULT_FLIGHTS;
  econ->weight_liftoff_mass = econ->weight_development = 1.0;
  econ->weight_cost_per_flight = econ->weight_failure = 1.0;
}

double
sw_economics_recovery_delta_v (const SwEconomics *econ)
{
  g_return_val_if_fail (econ != NULL, NAN);
  if (econ->has_recovery_delta_v)
    return econ->recovery_delta_v_m_s;
  switch (econ->recovery_mode)
    {
    case SW_RECOVERY_DOWNRANGE:
      return SW_ECONOMICS_DEFAULT_DOWNRANGE_DELTA_V;
    case SW_RECOVERY_LAUNCH_SITE:
      return SW_ECONOMICS_DEFAULT_LAUNCH_SITE_DELTA_V;
    case SW_RECOVERY_NONE:
    default:
      return 0.0;
    }
}

double
sw_economics_booster_recovery_delta_v (const SwEconomics *econ)
{
  SwEconomics as_core;

  g_return_val_if_fail (econ != NULL, NAN);
  /* The first stage's defaults per mode (from memory): the same rule. */
  memset (&as_core, 0, sizeof as_core);
  as_core.recovery_mode = econ->booster_recovery_mode;
  as_core.has_recovery_delta_v = econ->has_booster_recovery_delta_v;
  as_core.recovery_delta_v_m_s = econ->booster_recovery_delta_v_m_s;
  return sw_economics_recovery_delta_v (&as_core);
}

int
sw_economics_engine_type_of_stage (const SwEconomics *econ, guint stage)
{
  g_return_val_if_fail (econ != NULL, -1);
  for (guint i = 0; i < econ->n_engine_types && i < SW_ECONOMICS_MAX_ENGINE_TYPES; i++)
    if (stage < 32 && (econ->engine_types[i].stage_mask & (1u << stage)) != 0)
      return (int) i;
  return -1;
}

const char *
sw_recovery_mode_to_string (SwRecoveryMode mode)
{
  switch (mode)
    {
    case SW_RECOVERY_DOWNRANGE:
      return "downrange";
    case SW_RECOVERY_LAUNCH_SITE:
      return "launch_site";
    case SW_RECOVERY_NONE:
    default:
      return "expendable";
    }
}

gboolean
sw_recovery_mode_from_string (const char *text, SwRecoveryMode *mode)
{
  if (g_strcmp0 (text, "expendable") == 0)
    *mode = SW_RECOVERY_NONE;
  else if (g_strcmp0 (text, "downrange") == 0)
    *mode = SW_RECOVERY_DOWNRANGE;
  else if (g_strcmp0 (text, "launch_site") == 0)
    *mode = SW_RECOVERY_LAUNCH_SITE;
  else
    return FALSE;
  return TRUE;
}

/* As sw_optional_check(), for a value whose JSON path is not prefix.key of
 * the limit (an array element, a key sharing a limit). */
static gboolean
check_at (SwLimitId limit, double value, const char *file, const char *path, GError **error)
{
  const SwLimit *l = sw_limit_get (limit);

  if (sw_limit_contains (limit, value))
    return TRUE;
  if (!isfinite (value))
    sw_optional_set_error (error, SW_ERROR_NOT_FINITE, file,
                           _("%s: the value is not a finite number"), path);
  else
    sw_optional_set_error (error, SW_ERROR_RANGE, file,
                           _("%s: %g is outside the accepted range %s%.10g to %.10g%s%s (%s)"),
                           path, value, l->min_exclusive ? _("above ") : "", l->min, l->max,
                           l->unit[0] ? " " : "", l->unit, l->why);
  return FALSE;
}

/* A list of 0-based stage indices into a bit mask. */
static gboolean
load_stage_list (JsonObject *obj, const char *key, const char *file, const char *prefix,
                 guint32 *mask, GError **error)
{
  g_autofree char *path = sw_optional_path (prefix, key);
  JsonNode *node = json_object_get_member (obj, key);
  JsonArray *arr;

  *mask = 0;
  if (node == NULL)
    return TRUE;
  if (json_node_get_node_type (node) != JSON_NODE_ARRAY)
    {
      sw_optional_set_error (error, SW_ERROR_TYPE, file,
                             _("%s: expected a list of stage indices, found %s"), path,
                             sw_optional_node_type_name (node));
      return FALSE;
    }
  arr = json_node_get_array (node);
  for (guint i = 0; i < json_array_get_length (arr); i++)
    {
      JsonNode *e = json_array_get_element (arr, i);
      g_autofree char *ep = g_strdup_printf ("%s[%u]", path, i);
      double v;

      if (!sw_optional_node_is_number (e))
        {
          sw_optional_set_error (error, SW_ERROR_TYPE, file,
                                 _("%s: expected a stage index, found %s"), ep,
                                 sw_optional_node_type_name (e));
          return FALSE;
        }
      v = json_node_get_double (e);
      if (isfinite (v) && v != floor (v))
        {
          sw_optional_set_error (error, SW_ERROR_VALUE, file, _("%s: %g is not a whole number"),
                                 ep, v);
          return FALSE;
        }
      if (!check_at (SW_LIMIT_ECON_STAGE_INDEX, v, file, ep, error))
        return FALSE;
      *mask |= 1u << (guint) v;
    }
  return TRUE;
}

/* The optional true-or-false @key of @obj at @path into @out (left as it
 * is when the key is absent). */
static gboolean
load_bool (JsonObject *obj, const char *key, const char *file, const char *path,
           gboolean *out, GError **error)
{
  JsonNode *node = json_object_get_member (obj, key);

  if (node == NULL)
    return TRUE;
  if (json_node_get_node_type (node) != JSON_NODE_VALUE
      || json_node_get_value_type (node) != G_TYPE_BOOLEAN)
    {
      g_autofree char *p = sw_optional_path (path, key);
      sw_optional_set_error (error, SW_ERROR_TYPE, file, _("%s: expected true or false, found %s"),
                             p, sw_optional_node_type_name (node));
      return FALSE;
    }
  *out = json_node_get_boolean (node);
  return TRUE;
}

static gboolean
load_engine_types (JsonObject *obj, const char *file, const char *prefix, SwEconomics *econ,
                   GPtrArray *warnings, GError **error)
{
  g_autofree char *path = sw_optional_path (prefix, "engine_types");
  JsonNode *node = json_object_get_member (obj, "engine_types");
  JsonArray *arr;
  guint n;

  if (node == NULL)
    return TRUE;
  if (json_node_get_node_type (node) != JSON_NODE_ARRAY)
    {
      sw_optional_set_error (error, SW_ERROR_TYPE, file, _("%s: expected a list, found %s"),
                             path, sw_optional_node_type_name (node));
      return FALSE;
    }
  arr = json_node_get_array (node);
  n = json_array_get_length (arr);
  if (!check_at (SW_LIMIT_ENGINE_TYPES, n, file, path, error))
    return FALSE;
  for (guint i = 0; i < n; i++)
    {
      JsonNode *e = json_array_get_element (arr, i);
      g_autofree char *ep = g_strdup_printf ("%s[%u]", path, i);
      SwEngineType *t = &econ->engine_types[i];
      JsonObject *eo;
      const char *name = NULL;
      gboolean has_mass = FALSE;

      if (json_node_get_node_type (e) != JSON_NODE_OBJECT)
        {
          sw_optional_set_error (error, SW_ERROR_TYPE, file,
                                 _("%s: expected an engine type object, found %s"), ep,
                                 sw_optional_node_type_name (e));
          return FALSE;
        }
      eo = json_node_get_object (e);
      sw_optional_warn_unknown (eo, file, ep, engine_keys, warnings);
      if (!sw_optional_read_string (eo, "name", file, ep, &name, error))
        return FALSE;
      if (name != NULL && strlen (name) >= sizeof t->name)
        {
          g_autofree char *np = sw_optional_path (ep, "name");
          sw_optional_set_error (error, SW_ERROR_RANGE, file,
                                 _("%s: the text is %zu bytes long; at most %zu are accepted"),
                                 np, strlen (name), sizeof t->name - 1);
          return FALSE;
        }
      if (name != NULL)
        g_strlcpy (t->name, name, sizeof t->name);
      else
        g_snprintf (t->name, sizeof t->name, _("Engine %u"), i + 1);
      if (!sw_optional_read_number_full (eo, "dry_mass_kg", file, ep, TRUE,
                                         SW_LIMIT_ENGINE_DRY_MASS, FALSE, &t->dry_mass_kg,
                                         &has_mass, error)
          || !load_stage_list (eo, "on_stages", file, ep, &t->stage_mask, error))
        return FALSE;
      if (!load_bool (eo, "developed", file, ep, &t->developed, error))
        return FALSE;
    }
  econ->n_engine_types = n;
  return TRUE;
}

/* Why @text cannot be a currency label, or NULL. */
static char *
currency_problem (const char *text)
{
  const SwLimit *l = sw_limit_get (SW_LIMIT_CURRENCY_LENGTH);
  glong n;

  if (!g_utf8_validate (text, -1, NULL))
    return g_strdup (_("the text is not valid UTF-8"));
  n = g_utf8_strlen (text, -1);
  if (n > (glong) l->max || strlen (text) >= SW_ECONOMICS_CURRENCY_BYTES)
    return g_strdup_printf (_("the label is %ld characters long; at most %.0f are accepted"), n,
                            l->max);
  for (const char *p = text; *p != '\0'; p = g_utf8_next_char (p))
    if (g_unichar_iscntrl (g_utf8_get_char (p)))
      return g_strdup (_("the label holds a control character (a line break or tab)"));
  return NULL;
}

gboolean
sw_economics_set_currency (SwEconomics *econ, const char *text, GError **error)
{
  g_autofree char *problem = NULL;

  g_return_val_if_fail (econ != NULL && text != NULL, FALSE);
  if ((problem = currency_problem (text)) != NULL)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_RANGE, "economics.currency: %s", problem);
      return FALSE;
    }
  /* The whole buffer, so that equal labels compare equal byte for byte. */
  memset (econ->currency, 0, sizeof econ->currency);
  g_strlcpy (econ->currency, text, sizeof econ->currency);
  econ->present = TRUE;
  return TRUE;
}

const char *
sw_economics_currency_label (const SwEconomics *econ)
{
  g_return_val_if_fail (econ != NULL, "");
  return econ->currency[0] != '\0' ? econ->currency : _("money units");
}

const char *
sw_economics_money_note (void)
{
  return _("Money is the effort in work-years times the design's cost of a work-year: an "
           "estimate for comparing concepts, never a quote.");
}

static gboolean
load_recovery (JsonObject *obj, const char *file, const char *prefix, SwEconomics *econ,
               GPtrArray *warnings, GError **error)
{
  g_autofree char *path = sw_optional_path (prefix, "recovery");
  JsonObject *ro;
  gboolean ok, present;
  const char *mode = NULL;
  double flights = 0.0;

  ro = sw_optional_read_object (obj, "recovery", file, prefix, &ok, error);
  if (!ok)
    return FALSE;
  if (ro == NULL)
    return TRUE;
  sw_optional_warn_unknown (ro, file, path, recovery_keys, warnings);
  if (!sw_optional_read_string (ro, "mode", file, path, &mode, error))
    return FALSE;
  if (mode != NULL && !sw_recovery_mode_from_string (mode, &econ->recovery_mode))
    {
      g_autofree char *mp = sw_optional_path (path, "mode");
      sw_optional_set_error (error, SW_ERROR_VALUE, file,
                             _("%s: \"%s\" is not a recovery mode; use \"expendable\", "
                               "\"downrange\" or \"launch_site\""),
                             mp, mode);
      return FALSE;
    }
  mode = NULL;
  if (!sw_optional_read_string (ro, "booster_mode", file, path, &mode, error))
    return FALSE;
  if (mode != NULL && !sw_recovery_mode_from_string (mode, &econ->booster_recovery_mode))
    {
      g_autofree char *mp = sw_optional_path (path, "booster_mode");
      sw_optional_set_error (error, SW_ERROR_VALUE, file,
                             _("%s: \"%s\" is not a recovery mode; use \"expendable\", "
                               "\"downrange\" or \"launch_site\""),
                             mp, mode);
      return FALSE;
    }
  if (!sw_optional_read_number (ro, "booster_recovery_delta_v_m_s", file, path,
                                SW_LIMIT_BOOSTER_RECOVERY_DELTA_V, FALSE,
                                &econ->booster_recovery_delta_v_m_s,
                                &econ->has_booster_recovery_delta_v, error))
    return FALSE;
  if (!sw_optional_read_number (ro, "recovery_delta_v_m_s", file, path, SW_LIMIT_RECOVERY_DELTA_V,
                                FALSE, &econ->recovery_delta_v_m_s, &econ->has_recovery_delta_v,
                                error)
      || !sw_optional_read_number (ro, "landing_hardware_fraction", file, path,
                                   SW_LIMIT_LANDING_HARDWARE, FALSE,
                                   &econ->landing_hardware_fraction, &present, error)
      || !sw_optional_read_number (ro, "refurbishment_fraction", file, path,
                                   SW_LIMIT_REFURBISHMENT, FALSE, &econ->refurbishment_fraction,
                                   &present, error)
      || !sw_optional_read_number (ro, "flights_per_stage", file, path,
                                   SW_LIMIT_FLIGHTS_PER_STAGE, TRUE, &flights, &present, error))
    return FALSE;
  if (present)
    econ->flights_per_stage = (guint) flights;
  return TRUE;
}

static gboolean
load_weights (JsonObject *obj, const char *file, const char *prefix, SwEconomics *econ,
              GPtrArray *warnings, GError **error)
{
  g_autofree char *path = sw_optional_path (prefix, "decision_weights");
  double *slots[] = { &econ->weight_liftoff_mass, &econ->weight_development,
                      &econ->weight_cost_per_flight, &econ->weight_failure };
  JsonObject *wo;
  gboolean ok;

  wo = sw_optional_read_object (obj, "decision_weights", file, prefix, &ok, error);
  if (!ok)
    return FALSE;
  if (wo == NULL)
    return TRUE;
  sw_optional_warn_unknown (wo, file, path, weight_keys, warnings);
  for (guint i = 0; i < G_N_ELEMENTS (slots); i++)
    {
      g_autofree char *kp = sw_optional_path (path, weight_keys[i]);
      gboolean present = FALSE;
      double v = 0.0;

      if (!sw_optional_read_number (wo, weight_keys[i], file, path, SW_OPTIONAL_NO_LIMIT, FALSE,
                                    &v, &present, error))
        return FALSE;
      if (present && !check_at (SW_LIMIT_DECISION_WEIGHT, v, file, kp, error))
        return FALSE;
      if (present)
        *slots[i] = v;
    }
  return TRUE;
}

gboolean
sw_economics_load_design (JsonObject *root, const char *file, const char *prefix,
                          SwEconomics *econ, GPtrArray *warnings, GError **error)
{
  g_autofree char *path = sw_optional_path (prefix, "economics");
  g_autofree char *cpath = NULL;
  JsonObject *obj, *coeffs;
  gboolean ok, present;
  double run = 0.0;

  sw_economics_init (econ);
  obj = sw_optional_read_object (root, "economics", file, prefix, &ok, error);
  if (!ok)
    return FALSE;
  if (obj == NULL)
    return TRUE;
  econ->present = TRUE;
  sw_optional_warn_unknown (obj, file, path, economics_keys, warnings);
  if (!sw_optional_read_number (obj, "work_year_cost", file, path, SW_LIMIT_WORK_YEAR_COST, FALSE,
                                &econ->work_year_cost, &econ->has_work_year_cost, error)
      || !sw_optional_read_number (obj, "production_run", file, path, SW_LIMIT_PRODUCTION_RUN,
                                   TRUE, &run, &present, error))
    return FALSE;
  if (present)
    econ->production_run = (guint) run;
  {
    const char *currency = NULL;
    g_autofree char *problem = NULL;

    if (!sw_optional_read_string (obj, "currency", file, path, &currency, error))
      return FALSE;
    if (currency != NULL && (problem = currency_problem (currency)) != NULL)
      {
        g_autofree char *cp = sw_optional_path (path, "currency");
        sw_optional_set_error (error, SW_ERROR_RANGE, file, "%s: %s", cp, problem);
        return FALSE;
      }
    if (currency != NULL)
      g_strlcpy (econ->currency, currency, sizeof econ->currency);
  }
  if (!sw_optional_read_number (obj, "learning_rate", file, path, SW_LIMIT_LEARNING_RATE, FALSE,
                                &econ->learning_rate, &present, error)
      || !sw_optional_read_number (obj, "engine_mass_fraction", file, path,
                                   SW_LIMIT_ENGINE_MASS_FRACTION, FALSE,
                                   &econ->engine_mass_fraction, &present, error))
    return FALSE;

  coeffs = sw_optional_read_object (obj, "cost_coefficients", file, path, &ok, error);
  if (!ok)
    return FALSE;
  if (coeffs != NULL)
    {
      const char *known[SW_N_CER + 1];

      cpath = sw_optional_path (path, "cost_coefficients");
      for (guint i = 0; i < SW_N_CER; i++)
        known[i] = cer_table[i].key;
      known[SW_N_CER] = NULL;
      sw_optional_warn_unknown (coeffs, file, cpath, known, warnings);
      for (guint i = 0; i < SW_N_CER; i++)
        {
          if (!sw_optional_read_number (coeffs, cer_table[i].key, file, cpath, cer_table[i].limit,
                                        FALSE, &econ->coefficients[i], &present, error))
            return FALSE;
          if (present)
            econ->coefficients_set |= G_GUINT64_CONSTANT (1) << i;
        }
    }

  return load_engine_types (obj, file, path, econ, warnings, error)
         && load_stage_list (obj, "developed_stages", file, path, &econ->developed_stages, error)
         && load_bool (obj, "developed_boosters", file, path, &econ->developed_boosters, error)
         && load_recovery (obj, file, path, econ, warnings, error)
         && load_weights (obj, file, path, econ, warnings, error);
}

static void
add_stage_list (JsonBuilder *b, const char *key, guint32 mask)
{
  json_builder_set_member_name (b, key);
  json_builder_begin_array (b);
  for (guint i = 0; i < SW_MAX_STAGES; i++)
    if ((mask & (1u << i)) != 0)
      json_builder_add_int_value (b, i);
  json_builder_end_array (b);
}

void
sw_economics_save_design (JsonBuilder *b, const SwEconomics *econ)
{
  SwEconomics def;

  if (econ == NULL || !econ->present)
    return;
  sw_economics_init (&def);
  json_builder_set_member_name (b, "economics");
  json_builder_begin_object (b);
  if (econ->has_work_year_cost)
    sw_optional_add_number (b, "work_year_cost", econ->work_year_cost);
  if (econ->currency[0] != '\0')
    {
      json_builder_set_member_name (b, "currency");
      json_builder_add_string_value (b, econ->currency);
    }
  json_builder_set_member_name (b, "production_run");
  json_builder_add_int_value (b, econ->production_run);
  sw_optional_add_number (b, "learning_rate", econ->learning_rate);
  if (econ->coefficients_set != 0)
    {
      json_builder_set_member_name (b, "cost_coefficients");
      json_builder_begin_object (b);
      for (guint i = 0; i < SW_N_CER; i++)
        if ((econ->coefficients_set & (G_GUINT64_CONSTANT (1) << i)) != 0)
          sw_optional_add_number (b, cer_table[i].key, econ->coefficients[i]);
      json_builder_end_object (b);
    }
  if (econ->n_engine_types > 0)
    {
      json_builder_set_member_name (b, "engine_types");
      json_builder_begin_array (b);
      for (guint i = 0; i < econ->n_engine_types; i++)
        {
          const SwEngineType *t = &econ->engine_types[i];
          json_builder_begin_object (b);
          json_builder_set_member_name (b, "name");
          json_builder_add_string_value (b, t->name);
          sw_optional_add_number (b, "dry_mass_kg", t->dry_mass_kg);
          add_stage_list (b, "on_stages", t->stage_mask);
          json_builder_set_member_name (b, "developed");
          json_builder_add_boolean_value (b, t->developed);
          json_builder_end_object (b);
        }
      json_builder_end_array (b);
    }
  if (econ->developed_stages != 0)
    add_stage_list (b, "developed_stages", econ->developed_stages);
  if (econ->developed_boosters)
    {
      json_builder_set_member_name (b, "developed_boosters");
      json_builder_add_boolean_value (b, TRUE);
    }
  sw_optional_add_number (b, "engine_mass_fraction", econ->engine_mass_fraction);
  json_builder_set_member_name (b, "recovery");
  json_builder_begin_object (b);
  json_builder_set_member_name (b, "mode");
  json_builder_add_string_value (b, sw_recovery_mode_to_string (econ->recovery_mode));
  if (econ->has_recovery_delta_v)
    sw_optional_add_number (b, "recovery_delta_v_m_s", econ->recovery_delta_v_m_s);
  sw_optional_add_number (b, "landing_hardware_fraction", econ->landing_hardware_fraction);
  sw_optional_add_number (b, "refurbishment_fraction", econ->refurbishment_fraction);
  json_builder_set_member_name (b, "flights_per_stage");
  json_builder_add_int_value (b, econ->flights_per_stage);
  /* Left out for expendable boosters: such a file is as before. */
  if (econ->booster_recovery_mode != SW_RECOVERY_NONE)
    {
      json_builder_set_member_name (b, "booster_mode");
      json_builder_add_string_value (b, sw_recovery_mode_to_string (econ->booster_recovery_mode));
    }
  if (econ->has_booster_recovery_delta_v)
    sw_optional_add_number (b, "booster_recovery_delta_v_m_s",
                            econ->booster_recovery_delta_v_m_s);
  json_builder_end_object (b);
  json_builder_set_member_name (b, "decision_weights");
  json_builder_begin_object (b);
  sw_optional_add_number (b, "liftoff_mass", econ->weight_liftoff_mass);
  sw_optional_add_number (b, "development", econ->weight_development);
  sw_optional_add_number (b, "cost_per_flight", econ->weight_cost_per_flight);
  sw_optional_add_number (b, "failure", econ->weight_failure);
  json_builder_end_object (b);
  json_builder_end_object (b);
}

gboolean
sw_economics_validate (const SwEconomics *econ, guint n_stages, const char *file,
                       const char *prefix, GError **error)
{
  g_autofree char *path = sw_optional_path (prefix, "economics");
  g_autofree char *cpath = sw_optional_path (path, "cost_coefficients");
  g_autofree char *rpath = sw_optional_path (path, "recovery");
  g_autofree char *wpath = sw_optional_path (path, "decision_weights");
  double weights[4];
  guint32 seen = 0;

  g_return_val_if_fail (econ != NULL, FALSE);
  if (!econ->present)
    return TRUE;
  weights[0] = econ->weight_liftoff_mass;
  weights[1] = econ->weight_development;
  weights[2] = econ->weight_cost_per_flight;
  weights[3] = econ->weight_failure;
  {
    g_autofree char *problem = currency_problem (econ->currency);
    if (problem != NULL)
      {
        g_autofree char *cp = sw_optional_path (path, "currency");
        sw_optional_set_error (error, SW_ERROR_RANGE, file, "%s: %s", cp, problem);
        return FALSE;
      }
  }
  if ((econ->has_work_year_cost
       && !sw_optional_check (SW_LIMIT_WORK_YEAR_COST, econ->work_year_cost, file, path, error))
      || !sw_optional_check (SW_LIMIT_PRODUCTION_RUN, econ->production_run, file, path, error)
      || !sw_optional_check (SW_LIMIT_LEARNING_RATE, econ->learning_rate, file, path, error)
      || !sw_optional_check (SW_LIMIT_ENGINE_MASS_FRACTION, econ->engine_mass_fraction, file,
                             path, error)
      || !sw_optional_check (SW_LIMIT_ENGINE_TYPES, econ->n_engine_types, file, path, error))
    return FALSE;
  for (guint i = 0; i < SW_N_CER; i++)
    if (!sw_optional_check (cer_table[i].limit, econ->coefficients[i], file, cpath, error))
      return FALSE;
  for (guint i = 0; i < econ->n_engine_types; i++)
    {
      const SwEngineType *t = &econ->engine_types[i];
      g_autofree char *ep = g_strdup_printf ("%s.engine_types[%u]", path, i);

      if (!sw_optional_check (SW_LIMIT_ENGINE_DRY_MASS, t->dry_mass_kg, file, ep, error))
        return FALSE;
      /* The window names an engine type by its name: two with one name
       * could not be told apart (renaming refuses it too). */
      for (guint j = 0; j < i; j++)
        if (g_strcmp0 (econ->engine_types[j].name, t->name) == 0)
          {
            sw_optional_set_error (error, SW_ERROR_VALUE, file,
                                   _("%s.name: engine_types[%u] is already called \"%s\"; "
                                     "each engine type needs a name of its own"),
                                   ep, j, t->name);
            return FALSE;
          }
      if (t->stage_mask >> n_stages != 0)
        {
          sw_optional_set_error (error, SW_ERROR_RANGE, file,
                                 _("%s.on_stages: names a stage the design does not have "
                                   "(it has %u, numbered from 0)"),
                                 ep, n_stages);
          return FALSE;
        }
      if ((t->stage_mask & seen) != 0)
        {
          sw_optional_set_error (error, SW_ERROR_VALUE, file,
                                 _("%s.on_stages: a stage already uses another engine type; "
                                   "each stage has at most one"),
                                 ep);
          return FALSE;
        }
      seen |= t->stage_mask;
    }
  if (econ->developed_stages >> n_stages != 0)
    {
      sw_optional_set_error (error, SW_ERROR_RANGE, file,
                             _("%s.developed_stages: names a stage the design does not have "
                               "(it has %u, numbered from 0)"),
                             path, n_stages);
      return FALSE;
    }
  if ((econ->has_recovery_delta_v
       && !sw_optional_check (SW_LIMIT_RECOVERY_DELTA_V, econ->recovery_delta_v_m_s, file, rpath,
                              error))
      || (econ->has_booster_recovery_delta_v
          && !sw_optional_check (SW_LIMIT_BOOSTER_RECOVERY_DELTA_V,
                                 econ->booster_recovery_delta_v_m_s, file, rpath, error))
      || !sw_optional_check (SW_LIMIT_LANDING_HARDWARE, econ->landing_hardware_fraction, file,
                             rpath, error)
      || !sw_optional_check (SW_LIMIT_REFURBISHMENT, econ->refurbishment_fraction, file, rpath,
                             error)
      || !sw_optional_check (SW_LIMIT_FLIGHTS_PER_STAGE, econ->flights_per_stage, file, rpath,
                             error))
    return FALSE;
  for (guint i = 0; i < G_N_ELEMENTS (weights); i++)
    {
      g_autofree char *kp = sw_optional_path (wpath, weight_keys[i]);
      if (!check_at (SW_LIMIT_DECISION_WEIGHT, weights[i], file, kp, error))
        return FALSE;
    }
  return TRUE;
}

/* ---- named edits ------------------------------------------------------- */

static const struct {
  const char *path;
  SwLimitId   limit;
  gboolean    whole;
} econ_numbers[SW_N_ECON_NUMBERS] = {
  [SW_ECON_WORK_YEAR_COST] = { "work_year_cost", SW_LIMIT_WORK_YEAR_COST, FALSE },
  [SW_ECON_PRODUCTION_RUN] = { "production_run", SW_LIMIT_PRODUCTION_RUN, TRUE },
  [SW_ECON_LEARNING_RATE] = { "learning_rate", SW_LIMIT_LEARNING_RATE, FALSE },
  [SW_ECON_CER_FIRST + SW_CER_STAGE_DEV_FACTOR] = { "cost_coefficients.stage_development_factor",
    SW_LIMIT_CER_STAGE_DEV_FACTOR, FALSE },
  [SW_ECON_CER_FIRST + SW_CER_STAGE_DEV_EXPONENT] = {
    "cost_coefficients.stage_development_exponent", SW_LIMIT_CER_STAGE_DEV_EXPONENT, FALSE },
  [SW_ECON_CER_FIRST + SW_CER_STAGE_UNIT_FACTOR] = { "cost_coefficients.stage_unit_factor",
    SW_LIMIT_CER_STAGE_UNIT_FACTOR, FALSE },
  [SW_ECON_CER_FIRST + SW_CER_STAGE_UNIT_EXPONENT] = { "cost_coefficients.stage_unit_exponent",
    SW_LIMIT_CER_STAGE_UNIT_EXPONENT, FALSE },
  [SW_ECON_CER_FIRST + SW_CER_ENGINE_DEV_FACTOR] = {
    "cost_coefficients.engine_development_factor", SW_LIMIT_CER_ENGINE_DEV_FACTOR, FALSE },
  [SW_ECON_CER_FIRST + SW_CER_ENGINE_DEV_EXPONENT] = {
    "cost_coefficients.engine_development_exponent", SW_LIMIT_CER_ENGINE_DEV_EXPONENT, FALSE },
  [SW_ECON_CER_FIRST + SW_CER_ENGINE_UNIT_FACTOR] = { "cost_coefficients.engine_unit_factor",
    SW_LIMIT_CER_ENGINE_UNIT_FACTOR, FALSE },
  [SW_ECON_CER_FIRST + SW_CER_ENGINE_UNIT_EXPONENT] = { "cost_coefficients.engine_unit_exponent",
    SW_LIMIT_CER_ENGINE_UNIT_EXPONENT, FALSE },
  [SW_ECON_CER_FIRST + SW_CER_SYSTEMS_BASE] = { "cost_coefficients.systems_factor_per_stage",
    SW_LIMIT_CER_SYSTEMS_BASE, FALSE },
  [SW_ECON_ENGINE_MASS_FRACTION] = { "engine_mass_fraction", SW_LIMIT_ENGINE_MASS_FRACTION,
    FALSE },
  [SW_ECON_RECOVERY_DELTA_V] = { "recovery.recovery_delta_v_m_s", SW_LIMIT_RECOVERY_DELTA_V,
    FALSE },
  [SW_ECON_BOOSTER_RECOVERY_DELTA_V] = { "recovery.booster_recovery_delta_v_m_s",
    SW_LIMIT_BOOSTER_RECOVERY_DELTA_V, FALSE },
  [SW_ECON_LANDING_HARDWARE] = { "recovery.landing_hardware_fraction", SW_LIMIT_LANDING_HARDWARE,
    FALSE },
  [SW_ECON_REFURBISHMENT] = { "recovery.refurbishment_fraction", SW_LIMIT_REFURBISHMENT, FALSE },
  [SW_ECON_FLIGHTS_PER_STAGE] = { "recovery.flights_per_stage", SW_LIMIT_FLIGHTS_PER_STAGE,
    TRUE },
  [SW_ECON_WEIGHT_LIFTOFF_MASS] = { "decision_weights.liftoff_mass", SW_LIMIT_DECISION_WEIGHT,
    FALSE },
  [SW_ECON_WEIGHT_DEVELOPMENT] = { "decision_weights.development", SW_LIMIT_DECISION_WEIGHT,
    FALSE },
  [SW_ECON_WEIGHT_COST_PER_FLIGHT] = { "decision_weights.cost_per_flight",
    SW_LIMIT_DECISION_WEIGHT, FALSE },
  [SW_ECON_WEIGHT_FAILURE] = { "decision_weights.failure", SW_LIMIT_DECISION_WEIGHT, FALSE },
};

SwLimitId
sw_economics_number_limit (SwEconNumber key)
{
  g_return_val_if_fail (key < SW_N_ECON_NUMBERS, SW_N_LIMITS);
  return econ_numbers[key].limit;
}

const char *
sw_economics_number_path (SwEconNumber key)
{
  g_return_val_if_fail (key < SW_N_ECON_NUMBERS, NULL);
  return econ_numbers[key].path;
}

gboolean
sw_economics_number_is_whole (SwEconNumber key)
{
  g_return_val_if_fail (key < SW_N_ECON_NUMBERS, FALSE);
  return econ_numbers[key].whole;
}

static double *
number_slot (SwEconomics *e, SwEconNumber key)
{
  switch (key)
    {
    case SW_ECON_WORK_YEAR_COST:
      return &e->work_year_cost;
    case SW_ECON_LEARNING_RATE:
      return &e->learning_rate;
    case SW_ECON_ENGINE_MASS_FRACTION:
      return &e->engine_mass_fraction;
    case SW_ECON_RECOVERY_DELTA_V:
      return &e->recovery_delta_v_m_s;
    case SW_ECON_BOOSTER_RECOVERY_DELTA_V:
      return &e->booster_recovery_delta_v_m_s;
    case SW_ECON_LANDING_HARDWARE:
      return &e->landing_hardware_fraction;
    case SW_ECON_REFURBISHMENT:
      return &e->refurbishment_fraction;
    case SW_ECON_WEIGHT_LIFTOFF_MASS:
      return &e->weight_liftoff_mass;
    case SW_ECON_WEIGHT_DEVELOPMENT:
      return &e->weight_development;
    case SW_ECON_WEIGHT_COST_PER_FLIGHT:
      return &e->weight_cost_per_flight;
    case SW_ECON_WEIGHT_FAILURE:
      return &e->weight_failure;
    default:
      if (key >= SW_ECON_CER_FIRST && key < SW_ECON_CER_FIRST + SW_N_CER)
        return &e->coefficients[key - SW_ECON_CER_FIRST];
      return NULL;
    }
}

double
sw_economics_get_number (const SwEconomics *econ, SwEconNumber key)
{
  g_return_val_if_fail (econ != NULL && key < SW_N_ECON_NUMBERS, NAN);
  switch (key)
    {
    case SW_ECON_WORK_YEAR_COST:
      return econ->has_work_year_cost ? econ->work_year_cost : NAN;
    case SW_ECON_PRODUCTION_RUN:
      return econ->production_run;
    case SW_ECON_FLIGHTS_PER_STAGE:
      return econ->flights_per_stage;
    case SW_ECON_RECOVERY_DELTA_V:
      return sw_economics_recovery_delta_v (econ);
    case SW_ECON_BOOSTER_RECOVERY_DELTA_V:
      return sw_economics_booster_recovery_delta_v (econ);
    default:
      return *number_slot ((SwEconomics *) econ, key);
    }
}

gboolean
sw_economics_set_number (SwEconomics *econ, SwEconNumber key, double value)
{
  g_return_val_if_fail (econ != NULL && key < SW_N_ECON_NUMBERS, FALSE);

  if (econ_numbers[key].whole)
    value = round (value);
  if (!sw_limit_contains (econ_numbers[key].limit, value))
    return FALSE;
  econ->present = TRUE;
  switch (key)
    {
    case SW_ECON_PRODUCTION_RUN:
      econ->production_run = (guint) value;
      break;
    case SW_ECON_FLIGHTS_PER_STAGE:
      econ->flights_per_stage = (guint) value;
      break;
    default:
      *number_slot (econ, key) = value;
      if (key == SW_ECON_WORK_YEAR_COST)
        econ->has_work_year_cost = TRUE;
      else if (key == SW_ECON_RECOVERY_DELTA_V)
        econ->has_recovery_delta_v = TRUE;
      else if (key == SW_ECON_BOOSTER_RECOVERY_DELTA_V)
        econ->has_booster_recovery_delta_v = TRUE;
      else if (key >= SW_ECON_CER_FIRST && key < SW_ECON_CER_FIRST + SW_N_CER)
        econ->coefficients_set |= G_GUINT64_CONSTANT (1) << (key - SW_ECON_CER_FIRST);
      break;
    }
  return TRUE;
}

void
sw_economics_set_recovery_mode (SwEconomics *econ, SwRecoveryMode mode)
{
  g_return_if_fail (econ != NULL && mode <= SW_RECOVERY_LAUNCH_SITE);
  econ->present = TRUE;
  econ->recovery_mode = mode;
}

void
sw_economics_set_booster_recovery_mode (SwEconomics *econ, SwRecoveryMode mode)
{
  g_return_if_fail (econ != NULL && mode <= SW_RECOVERY_LAUNCH_SITE);
  econ->present = TRUE;
  econ->booster_recovery_mode = mode;
}
