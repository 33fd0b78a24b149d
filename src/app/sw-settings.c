/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-settings"

#include "config.h"

#include "sw-settings.h"

GSettings *
sw_settings_new (void)
{
  GSettingsSchemaSource *source = g_settings_schema_source_get_default ();
  g_autoptr (GSettingsSchema) schema = NULL;

  if (source != NULL)
    schema = g_settings_schema_source_lookup (source, APP_ID, TRUE);
  if (schema == NULL)
    {
      g_autoptr (GSettingsSchemaSource) build = NULL;
      g_autoptr (GError) error = NULL;

      build = g_settings_schema_source_new_from_directory (SW_BUILD_SCHEMAS_DIR, source, FALSE,
                                                           &error);
      if (build != NULL)
        schema = g_settings_schema_source_lookup (build, APP_ID, FALSE);
      if (schema == NULL)
        g_error ("The settings schema %s is neither installed nor compiled in %s%s%s", APP_ID,
                 SW_BUILD_SCHEMAS_DIR, error != NULL ? ": " : "",
                 error != NULL ? error->message : "");
    }
  return g_settings_new_full (schema, NULL, NULL);
}

