/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-boosters"

#include "config.h"

#include "sw-boosters.h"

#include "sw-limits.h"
#include "sw-optional-keys.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

const char *const sw_boosters_design_keys[] = { "boosters", NULL };

static const char *const booster_keys[] = {
  "name", "count", "isp_vac_s", "isp_sl_s", "structural_coefficient", "thrust_vac_kn",
  "crossfeed", "diameter_m", NULL
};
static const char *const *const booster_key_lists[] = {
  booster_keys, sw_propellant_stage_keys, NULL
};

void
sw_boosters_init_default (SwBoosters *b)
{
  guint count = b->count;

  memset (b, 0, sizeof *b);
  b->count = count;
  g_strlcpy (b->name, _("Boosters"), sizeof b->name);
  /* A composite-solid strap-on (common practice for a first look, from
   * memory): Isp 270 s in vacuum, 240 s at sea level, eps 0.12. */
  b->isp_vac_s = 270.0;
  b->isp_sl_s = 240.0;
  b->has_isp_sl = TRUE;
  b->structural_coefficient = 0.12;
  b->thrust_vac_kn = 1000.0;
}

gboolean
sw_boosters_load (JsonObject *root, const char *file, const char *prefix, SwBoosters *b,
                  GPtrArray *warnings, GError **error)
{
  g_autofree char *path = sw_optional_path (prefix, "boosters");
  JsonObject *obj;
  JsonNode *node;
  const char *name = NULL;
  double count = 0.0;
  gboolean ok = TRUE;

  memset (b, 0, sizeof *b);
  obj = sw_optional_read_object_full (root, "boosters", file, prefix, FALSE, &ok, error);
  if (!ok)
    return FALSE;
  if (obj == NULL)
    return TRUE;

  sw_optional_warn_unknown_full (obj, file, path, booster_key_lists, warnings);
  if (!sw_optional_read_string_full (obj, "name", file, path, FALSE, &name, error))
    return FALSE;
  if (name != NULL)
    {
      g_autofree char *np = sw_optional_path (path, "name");
      if (strlen (name) >= sizeof b->name)
        {
          sw_optional_set_error (error, SW_ERROR_RANGE, file,
                                 _("%s: the text is %zu bytes long; at most %zu are accepted"),
                                 np, strlen (name), sizeof b->name - 1);
          return FALSE;
        }
      g_strlcpy (b->name, name, sizeof b->name);
    }
  else
    g_strlcpy (b->name, _("Boosters"), sizeof b->name);

  if (!sw_optional_read_number_full (obj, "count", file, path, TRUE, SW_LIMIT_BOOSTER_COUNT, TRUE,
                                     &count, NULL, error)
      || !sw_optional_read_number_full (obj, "isp_vac_s", file, path, TRUE, SW_LIMIT_ISP_VAC,
                                        FALSE, &b->isp_vac_s, NULL, error)
      || !sw_optional_read_number_full (obj, "isp_sl_s", file, path, FALSE, SW_LIMIT_ISP_SL,
                                        FALSE, &b->isp_sl_s, &b->has_isp_sl, error)
      || !sw_optional_read_number_full (obj, "structural_coefficient", file, path, TRUE,
                                        SW_LIMIT_STRUCTURAL_COEFFICIENT, FALSE,
                                        &b->structural_coefficient, NULL, error)
      || !sw_optional_read_number_full (obj, "thrust_vac_kn", file, path, TRUE,
                                        SW_LIMIT_THRUST_VAC, FALSE, &b->thrust_vac_kn, NULL,
                                        error)
      || !sw_optional_read_number_full (obj, "diameter_m", file, path, FALSE, SW_LIMIT_DIAMETER,
                                        FALSE, &b->diameter_m, &b->has_diameter, error))
    return FALSE;
  b->count = (guint) count;

  node = json_object_get_member (obj, "crossfeed");
  if (node != NULL)
    {
      if (json_node_get_node_type (node) != JSON_NODE_VALUE
          || json_node_get_value_type (node) != G_TYPE_BOOLEAN)
        {
          g_autofree char *cp = sw_optional_path (path, "crossfeed");
          sw_optional_set_error (error, SW_ERROR_TYPE, file,
                                 _("%s: expected true or false, found %s"), cp,
                                 sw_optional_node_type_name (node));
          return FALSE;
        }
      b->crossfeed = json_node_get_boolean (node);
    }
  if (!sw_propellant_load_stage (obj, file, path, &b->propellant, error))
    return FALSE;
  /* Read with count 0 too (the file must be well formed), then forgotten:
   * no boosters is no key. */
  if (b->count == 0)
    sw_boosters_clear_unsaved (b);
  return sw_boosters_validate (b, file, prefix, error);
}

void
sw_boosters_save (JsonBuilder *builder, const SwBoosters *b)
{
  if (b->count == 0)
    return;
  json_builder_set_member_name (builder, "boosters");
  json_builder_begin_object (builder);
  json_builder_set_member_name (builder, "name");
  json_builder_add_string_value (builder, b->name);
  json_builder_set_member_name (builder, "count");
  json_builder_add_int_value (builder, b->count);
  sw_optional_add_number (builder, "isp_vac_s", b->isp_vac_s);
  if (b->has_isp_sl)
    sw_optional_add_number (builder, "isp_sl_s", b->isp_sl_s);
  sw_optional_add_number (builder, "structural_coefficient", b->structural_coefficient);
  sw_optional_add_number (builder, "thrust_vac_kn", b->thrust_vac_kn);
  if (b->crossfeed)
    {
      json_builder_set_member_name (builder, "crossfeed");
      json_builder_add_boolean_value (builder, TRUE);
    }
  if (b->has_diameter)
    sw_optional_add_number (builder, "diameter_m", b->diameter_m);
  sw_propellant_save_stage (builder, &b->propellant);
  json_builder_end_object (builder);
}

gboolean
sw_boosters_validate (const SwBoosters *b, const char *file, const char *prefix, GError **error)
{
  g_autofree char *path = sw_optional_path (prefix, "boosters");

  g_return_val_if_fail (b != NULL, FALSE);

  if (!sw_optional_check (SW_LIMIT_BOOSTER_COUNT, (double) b->count, file, path, error))
    return FALSE;
  if (b->count == 0)
    return TRUE;
  if (memchr (b->name, '\0', sizeof b->name) == NULL)
    {
      g_autofree char *np = sw_optional_path (path, "name");
      sw_optional_set_error (error, SW_ERROR_RANGE, file, _("%s: the name is not terminated"),
                             np);
      return FALSE;
    }
  if (!sw_optional_check (SW_LIMIT_ISP_VAC, b->isp_vac_s, file, path, error)
      || (b->has_isp_sl && !sw_optional_check (SW_LIMIT_ISP_SL, b->isp_sl_s, file, path, error))
      || !sw_optional_check (SW_LIMIT_STRUCTURAL_COEFFICIENT, b->structural_coefficient, file,
                             path, error)
      || !sw_optional_check (SW_LIMIT_THRUST_VAC, b->thrust_vac_kn, file, path, error)
      || (b->has_diameter && !sw_optional_check (SW_LIMIT_DIAMETER, b->diameter_m, file, path,
                                                 error))
      || !sw_propellant_validate_stage (&b->propellant, file, path, error))
    return FALSE;
  if (b->has_isp_sl && b->isp_sl_s > b->isp_vac_s)
    {
      g_autofree char *p = sw_optional_path (path, "isp_sl_s");
      sw_optional_set_error (error, SW_ERROR_RANGE, file,
                             _("%s: %g s is above the boosters' vacuum Isp of %g s; the "
                               "sea-level Isp must lie between 0 and the vacuum Isp"),
                             p, b->isp_sl_s, b->isp_vac_s);
      return FALSE;
    }
  return TRUE;
}

gboolean
sw_boosters_is_used (const SwBoosters *b)
{
  return b->count > 0;
}

void
sw_boosters_clear_unsaved (SwBoosters *b)
{
  if (b->count == 0)
    {
      memset (b, 0, sizeof *b);
      return;
    }
  /* The name buffer past its text. */
  {
    size_t len = strnlen (b->name, sizeof b->name);
    if (len < sizeof b->name)
      memset (b->name + len, 0, sizeof b->name - len);
  }
  if (!b->has_isp_sl)
    b->isp_sl_s = 0.0;
  if (!b->has_diameter)
    b->diameter_m = 0.0;
  if (!b->propellant.has_propellant_kg)
    b->propellant.propellant_kg = 0.0;
  if (!b->propellant.has_mixture_ratio)
    b->propellant.mixture_ratio = 0.0;
  if (!b->propellant.has_ullage)
    b->propellant.ullage_fraction = 0.0;
}
