/* SPDX-License-Identifier: GPL-3.0-or-later */
/* stagewright: the GTK 4 application. */
#include "config.h"

#include "sw-application.h"
#include "sw-install-paths.h"

#include <glib/gi18n.h>
#include <locale.h>

int
main (int argc, char **argv)
{
  g_autoptr (SwApplication) app = NULL;
  g_autoptr (GError) error = NULL;
  g_autofree char *localedir = sw_install_locale_dir ();
  int status;

  setlocale (LC_ALL, "");
  bindtextdomain (GETTEXT_PACKAGE, localedir);
  bind_textdomain_codeset (GETTEXT_PACKAGE, "UTF-8");
  textdomain (GETTEXT_PACKAGE);

  /* A missing settings schema is an installation fault: say so and stop. */
  if (!sw_application_check_settings (&error))
    {
      g_printerr ("stagewright: %s\n", error->message);
      return 1;
    }

  app = sw_application_new ();
  status = g_application_run (G_APPLICATION (app), argc, argv);
  return status != 0 ? status : sw_application_get_exit_status (app);
}
