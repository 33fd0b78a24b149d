/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Where the installed data is looked for (sw-install-paths).  A test program
 * runs from the build tree, not from PREFIX/bin, so the configured paths
 * (config.h) apply unless the SW_* variables say otherwise; the installed
 * case (a relocated prefix) is checked by scripts/check-install.sh. */
#include "config.h"

#include "sw-install-paths.h"

#include <string.h>

static void
test_variables_win (void)
{
  g_setenv ("SW_DESIGNS_DIR", "/nowhere/designs", TRUE);
  g_setenv ("SW_LOCALE_DIR", "/nowhere/locale", TRUE);
  {
    g_autofree char *designs = sw_install_designs_dir ();
    g_autofree char *one = sw_install_find_design ("medium-cargo.stagewright");
    g_autofree char *locale = sw_install_locale_dir ();

    g_assert_cmpstr (designs, ==, "/nowhere/designs");
    g_assert_cmpstr (one, ==, "/nowhere/designs/medium-cargo.stagewright");
    g_assert_cmpstr (locale, ==, "/nowhere/locale");
  }
}

static void
test_configured_paths (void)
{
  /* Unset or empty: the configured install paths. */
  g_unsetenv ("SW_DESIGNS_DIR");
  g_setenv ("SW_LOCALE_DIR", "", TRUE);
  {
    g_autofree char *data = sw_install_data_dir ();
    g_autofree char *designs = sw_install_designs_dir ();
    g_autofree char *schemas = sw_install_schemas_dir ();
    g_autofree char *locale = sw_install_locale_dir ();

    g_assert_cmpstr (data, ==, SW_DATADIR);
    g_assert_cmpstr (designs, ==, SW_DATADIR "/stagewright/designs");
    g_assert_cmpstr (schemas, ==, SW_DATADIR "/glib-2.0/schemas");
    g_assert_cmpstr (locale, ==, LOCALEDIR);
  }
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/core/install-paths/variables-win", test_variables_win);
  g_test_add_func ("/core/install-paths/configured-paths", test_configured_paths);
  return g_test_run ();
}
