/* SPDX-License-Identifier: GPL-3.0-or-later */
#include "config.h"

#include "sw-install-paths.h"

#include <string.h>

/* The prefix the running program is installed under, when it runs from
 * PREFIX/BINDIR (BINDIR relative, as configured); NULL elsewhere, for
 * example in the build tree. */
static char *
running_prefix (void)
{
  g_autofree char *exe = g_file_read_link ("/proc/self/exe", NULL);
  g_autofree char *dir = NULL;
  gsize n;

  if (exe == NULL || g_path_is_absolute (SW_BINDIR_REL))
    return NULL;
  dir = g_path_get_dirname (exe);
  n = strlen (SW_BINDIR_REL);
  if (strlen (dir) <= n || !g_str_has_suffix (dir, SW_BINDIR_REL) || dir[strlen (dir) - n - 1] != '/')
    return NULL;
  return g_strndup (dir, strlen (dir) - n - 1);
}

/* PREFIX/REL under the running prefix if that folder exists there, else the
 * configured absolute path. */
static char *
under_prefix (const char *rel, const char *configured)
{
  g_autofree char *prefix = running_prefix ();

  if (prefix != NULL && !g_path_is_absolute (rel))
    {
      char *path = g_build_filename (prefix, rel, NULL);
      if (g_file_test (path, G_FILE_TEST_IS_DIR))
        return path;
      g_free (path);
    }
  return g_strdup (configured);
}

char *
sw_install_data_dir (void)
{
  return under_prefix (SW_DATADIR_REL, SW_DATADIR);
}

char *
sw_install_designs_dir (void)
{
  const char *env = g_getenv ("SW_DESIGNS_DIR");
  g_autofree char *data = NULL;

  if (env != NULL && env[0] != '\0')
    return g_strdup (env);
  data = sw_install_data_dir ();
  return g_build_filename (data, "stagewright", "designs", NULL);
}

char *
sw_install_find_design (const char *basename)
{
  g_autofree char *dir = sw_install_designs_dir ();

  return g_build_filename (dir, basename, NULL);
}

char *
sw_install_schemas_dir (void)
{
  g_autofree char *data = sw_install_data_dir ();

  return g_build_filename (data, "glib-2.0", "schemas", NULL);
}

char *
sw_install_locale_dir (void)
{
  const char *env = g_getenv ("SW_LOCALE_DIR");

  if (env != NULL && env[0] != '\0')
    return g_strdup (env);
  return under_prefix (SW_LOCALEDIR_REL, LOCALEDIR);
}
