/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-design"

#include "config.h"

#include "sw-optional-keys.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

const char *
sw_optional_display_file (const char *file)
{
  return file != NULL ? file : _("(design)");
}

void
sw_optional_set_error (GError **error, SwError code, const char *file, const char *format, ...)
{
  va_list args;
  g_autofree char *msg = NULL;

  va_start (args, format);
  msg = g_strdup_vprintf (format, args);
  va_end (args);
  g_set_error (error, SW_ERROR, code, "%s: %s", sw_optional_display_file (file), msg);
}

char *
sw_optional_path (const char *prefix, const char *key)
{
  return prefix != NULL && prefix[0] != '\0' ? g_strdup_printf ("%s.%s", prefix, key)
                                              : g_strdup (key);
}

const char *
sw_optional_node_type_name (JsonNode *node)
{
  switch (json_node_get_node_type (node))
    {
    case JSON_NODE_OBJECT:
      return _("an object");
    case JSON_NODE_ARRAY:
      return _("an array");
    case JSON_NODE_NULL:
      return _("null");
    case JSON_NODE_VALUE:
    default:
      switch (json_node_get_value_type (node))
        {
        case G_TYPE_BOOLEAN:
          return _("a boolean");
        case G_TYPE_STRING:
          return _("a string");
        default:
          return _("a number");
        }
    }
}

gboolean
sw_optional_node_is_number (JsonNode *node)
{
  GType t;

  if (json_node_get_node_type (node) != JSON_NODE_VALUE)
    return FALSE;
  t = json_node_get_value_type (node);
  return t == G_TYPE_DOUBLE || t == G_TYPE_INT64;
}

gboolean
sw_optional_check (SwLimitId limit, double value, const char *file, const char *prefix,
                   GError **error)
{
  const SwLimit *l = sw_limit_get (limit);
  g_autofree char *path = NULL;

  if (sw_limit_contains (limit, value))
    return TRUE;
  path = sw_optional_path (prefix, l->key);
  if (!isfinite (value))
    sw_optional_set_error (error, SW_ERROR_NOT_FINITE, file,
                           _("%s: the value is not a finite number"), path);
  else
    sw_optional_set_error (error, SW_ERROR_RANGE, file,
                           _("%s: %.10g is outside the accepted range %s%.10g to %.10g%s%s (%s)"),
                           path, value, l->min_exclusive ? _("above ") : "", l->min, l->max,
                           l->unit[0] ? " " : "", l->unit, l->why);
  return FALSE;
}

gboolean
sw_optional_read_number_full (JsonObject *obj, const char *key, const char *file,
                              const char *prefix, gboolean required, SwLimitId limit,
                              gboolean whole, double *value, gboolean *present, GError **error)
{
  JsonNode *node = json_object_get_member (obj, key);
  g_autofree char *path = sw_optional_path (prefix, key);
  double v;

  if (present != NULL)
    *present = FALSE;
  if (node == NULL)
    {
      if (required)
        sw_optional_set_error (error, SW_ERROR_MISSING, file,
                               _("%s: required number is missing"), path);
      return !required;
    }
  if (!sw_optional_node_is_number (node))
    {
      sw_optional_set_error (error, SW_ERROR_TYPE, file, _("%s: expected a number, found %s"),
                             path, sw_optional_node_type_name (node));
      return FALSE;
    }
  v = json_node_get_double (node);
  if (!isfinite (v))
    {
      sw_optional_set_error (error, SW_ERROR_NOT_FINITE, file,
                             _("%s: the number is not finite (too large to represent)"), path);
      return FALSE;
    }
  if (whole && v != floor (v))
    {
      sw_optional_set_error (error, SW_ERROR_VALUE, file, _("%s: %g is not a whole number"),
                             path, v);
      return FALSE;
    }
  if (limit != SW_OPTIONAL_NO_LIMIT && !sw_optional_check (limit, v, file, prefix, error))
    return FALSE;
  /* A written "-0" reads as minus zero; store plain zero, so that saving and
   * loading again gives the same design bit for bit. */
  *value = v == 0.0 ? 0.0 : v;
  if (present != NULL)
    *present = TRUE;
  return TRUE;
}

gboolean
sw_optional_read_number (JsonObject *obj, const char *key, const char *file, const char *prefix,
                         SwLimitId limit, gboolean whole, double *value, gboolean *present,
                         GError **error)
{
  return sw_optional_read_number_full (obj, key, file, prefix, FALSE, limit, whole, value,
                                       present, error);
}

gboolean
sw_optional_read_string_full (JsonObject *obj, const char *key, const char *file,
                              const char *prefix, gboolean required, const char **value,
                              GError **error)
{
  JsonNode *node = json_object_get_member (obj, key);
  g_autofree char *path = sw_optional_path (prefix, key);

  *value = NULL;
  if (node == NULL)
    {
      if (required)
        sw_optional_set_error (error, SW_ERROR_MISSING, file, _("%s: required text is missing"),
                               path);
      return !required;
    }
  if (json_node_get_node_type (node) != JSON_NODE_VALUE
      || json_node_get_value_type (node) != G_TYPE_STRING)
    {
      sw_optional_set_error (error, SW_ERROR_TYPE, file, _("%s: expected text, found %s"), path,
                             sw_optional_node_type_name (node));
      return FALSE;
    }
  *value = json_node_get_string (node);
  return TRUE;
}

gboolean
sw_optional_read_string (JsonObject *obj, const char *key, const char *file, const char *prefix,
                         const char **value, GError **error)
{
  return sw_optional_read_string_full (obj, key, file, prefix, FALSE, value, error);
}

JsonObject *
sw_optional_read_object_full (JsonObject *obj, const char *key, const char *file,
                              const char *prefix, gboolean required, gboolean *ok,
                              GError **error)
{
  JsonNode *node = json_object_get_member (obj, key);
  g_autofree char *path = sw_optional_path (prefix, key);

  *ok = TRUE;
  if (node == NULL)
    {
      if (required)
        {
          sw_optional_set_error (error, SW_ERROR_MISSING, file,
                                 _("%s: required object is missing"), path);
          *ok = FALSE;
        }
      return NULL;
    }
  if (json_node_get_node_type (node) != JSON_NODE_OBJECT)
    {
      sw_optional_set_error (error, SW_ERROR_TYPE, file, _("%s: expected an object, found %s"),
                             path, sw_optional_node_type_name (node));
      *ok = FALSE;
      return NULL;
    }
  return json_node_get_object (node);
}

JsonObject *
sw_optional_read_object (JsonObject *obj, const char *key, const char *file, const char *prefix,
                         gboolean *ok, GError **error)
{
  return sw_optional_read_object_full (obj, key, file, prefix, FALSE, ok, error);
}

void
sw_optional_warn_unknown_full (JsonObject *obj, const char *file, const char *prefix,
                               const char *const *const *known_lists, GPtrArray *warnings)
{
  g_autoptr (GList) members = NULL;

  if (warnings == NULL)
    return;
  members = json_object_get_members (obj);
  for (GList *l = members; l != NULL; l = l->next)
    {
      const char *key = l->data;
      gboolean found = FALSE;
      g_autofree char *path = NULL;

      for (guint k = 0; known_lists[k] != NULL && !found; k++)
        for (guint i = 0; known_lists[k][i] != NULL && !found; i++)
          found = strcmp (key, known_lists[k][i]) == 0;
      if (found)
        continue;
      path = sw_optional_path (prefix, key);
      g_ptr_array_add (warnings,
                       g_strdup_printf (_("%s: %s: unknown key, ignored (it will not be saved)"),
                                        sw_optional_display_file (file), path));
    }
}

void
sw_optional_warn_unknown (JsonObject *obj, const char *file, const char *prefix,
                          const char *const *known, GPtrArray *warnings)
{
  const char *const *const lists[] = { known, NULL };

  sw_optional_warn_unknown_full (obj, file, prefix, lists, warnings);
}

void
sw_optional_add_number (JsonBuilder *builder, const char *key, double value)
{
  json_builder_set_member_name (builder, key);
  json_builder_add_double_value (builder, value);
}
