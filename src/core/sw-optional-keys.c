/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-design"

#include "config.h"

#include "sw-optional-keys.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

static const char *
display_file (const char *file)
{
  return file != NULL ? file : _("(design)");
}

char *
sw_optional_path (const char *prefix, const char *key)
{
  return prefix != NULL && prefix[0] != '\0' ? g_strdup_printf ("%s.%s", prefix, key)
                                              : g_strdup (key);
}

static const char *
node_type_name (JsonNode *node)
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
sw_optional_check (SwLimitId limit, double value, const char *file, const char *prefix,
                   GError **error)
{
  const SwLimit *l = sw_limit_get (limit);
  g_autofree char *path = NULL;

  if (sw_limit_contains (limit, value))
    return TRUE;
  path = sw_optional_path (prefix, l->key);
  if (!isfinite (value))
    g_set_error (error, SW_ERROR, SW_ERROR_NOT_FINITE, _("%s: %s: the value is not a finite number"),
                 display_file (file), path);
  else
    g_set_error (error, SW_ERROR, SW_ERROR_RANGE,
                 _("%s: %s: %g is outside the accepted range %s%.10g to %.10g%s%s (%s)"),
                 display_file (file), path, value, l->min_exclusive ? _("above ") : "", l->min,
                 l->max, l->unit[0] ? " " : "", l->unit, l->why);
  return FALSE;
}

gboolean
sw_optional_read_number (JsonObject *obj, const char *key, const char *file, const char *prefix,
                         SwLimitId limit, gboolean whole, double *value, gboolean *present,
                         GError **error)
{
  JsonNode *node = json_object_get_member (obj, key);
  g_autofree char *path = sw_optional_path (prefix, key);
  GType t;
  double v;

  *present = FALSE;
  if (node == NULL)
    return TRUE;
  t = json_node_get_node_type (node) == JSON_NODE_VALUE ? json_node_get_value_type (node)
                                                        : G_TYPE_INVALID;
  if (t != G_TYPE_DOUBLE && t != G_TYPE_INT64)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_TYPE, _("%s: %s: expected a number, found %s"),
                   display_file (file), path, node_type_name (node));
      return FALSE;
    }
  v = json_node_get_double (node);
  if (!isfinite (v))
    {
      g_set_error (error, SW_ERROR, SW_ERROR_NOT_FINITE,
                   _("%s: %s: the number is not finite (too large to represent)"),
                   display_file (file), path);
      return FALSE;
    }
  if (whole && v != floor (v))
    {
      g_set_error (error, SW_ERROR, SW_ERROR_VALUE, _("%s: %s: %g is not a whole number"),
                   display_file (file), path, v);
      return FALSE;
    }
  if (!sw_optional_check (limit, v, file, prefix, error))
    return FALSE;
  *value = v;
  *present = TRUE;
  return TRUE;
}

gboolean
sw_optional_read_string (JsonObject *obj, const char *key, const char *file, const char *prefix,
                         const char **value, GError **error)
{
  JsonNode *node = json_object_get_member (obj, key);

  *value = NULL;
  if (node == NULL)
    return TRUE;
  if (json_node_get_node_type (node) != JSON_NODE_VALUE
      || json_node_get_value_type (node) != G_TYPE_STRING)
    {
      g_autofree char *path = sw_optional_path (prefix, key);
      g_set_error (error, SW_ERROR, SW_ERROR_TYPE, _("%s: %s: expected text, found %s"),
                   display_file (file), path, node_type_name (node));
      return FALSE;
    }
  *value = json_node_get_string (node);
  return TRUE;
}

JsonObject *
sw_optional_read_object (JsonObject *obj, const char *key, const char *file, const char *prefix,
                         gboolean *ok, GError **error)
{
  JsonNode *node = json_object_get_member (obj, key);

  *ok = TRUE;
  if (node == NULL)
    return NULL;
  if (json_node_get_node_type (node) != JSON_NODE_OBJECT)
    {
      g_autofree char *path = sw_optional_path (prefix, key);
      g_set_error (error, SW_ERROR, SW_ERROR_TYPE, _("%s: %s: expected an object, found %s"),
                   display_file (file), path, node_type_name (node));
      *ok = FALSE;
      return NULL;
    }
  return json_node_get_object (node);
}

void
sw_optional_warn_unknown (JsonObject *obj, const char *file, const char *prefix,
                          const char *const *known, GPtrArray *warnings)
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

      for (guint i = 0; known[i] != NULL && !found; i++)
        found = strcmp (key, known[i]) == 0;
      if (found)
        continue;
      path = sw_optional_path (prefix, key);
      g_ptr_array_add (warnings,
                       g_strdup_printf (_("%s: %s: unknown key, ignored (it will not be saved)"),
                                        display_file (file), path));
    }
}
