/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-settings"

#include "config.h"

#include "sw-settings.h"

#include "sw-install-paths.h"

#include <glib/gi18n.h>
#include <stdlib.h>

/* The schema from the default places (GSETTINGS_SCHEMA_DIR, XDG_DATA_DIRS),
 * else from the install prefix (sw-install-paths.h).  No path of the source
 * or build tree is compiled in: the tests point GSETTINGS_SCHEMA_DIR at the
 * build folder. */
static GSettingsSchema *
lookup_schema (GError **error)
{
  GSettingsSchemaSource *source = g_settings_schema_source_get_default ();
  g_autoptr (GSettingsSchemaSource) installed = NULL;
  g_autofree char *dir = sw_install_schemas_dir ();
  GSettingsSchema *schema = NULL;

  if (source != NULL)
    schema = g_settings_schema_source_lookup (source, APP_ID, TRUE);
  if (schema != NULL)
    return schema;
  if (g_file_test (dir, G_FILE_TEST_IS_DIR))
    installed = g_settings_schema_source_new_from_directory (dir, source, FALSE, NULL);
  if (installed != NULL)
    schema = g_settings_schema_source_lookup (installed, APP_ID, FALSE);
  if (schema == NULL)
    g_set_error (error, G_IO_ERROR, G_IO_ERROR_NOT_FOUND,
                 _("The settings schema %s is not installed: it was looked for in the "
                   "system folders and in %s. Reinstall the application, or point "
                   "GSETTINGS_SCHEMA_DIR at the folder with the compiled schema "
                   "(BUILD/data in a build folder)."),
                 APP_ID, dir);
  return schema;
}

gboolean
sw_settings_check (GError **error)
{
  g_autoptr (GSettingsSchema) schema = lookup_schema (error);

  return schema != NULL;
}

GSettings *
sw_settings_new (void)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (GSettingsSchema) schema = lookup_schema (&error);

  if (schema == NULL)
    {
      /* main() checks first; this is for code that runs without main(). */
      g_printerr ("stagewright: %s\n", error->message);
      exit (EXIT_FAILURE);
    }
  return g_settings_new_full (schema, NULL, NULL);
}
