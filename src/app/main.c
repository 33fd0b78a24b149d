/* SPDX-License-Identifier: GPL-3.0-or-later */
/* stagewright: the GTK 4 application. */
#include "config.h"

#include "sw-application.h"

#include <glib/gi18n.h>
#include <locale.h>

int
main (int argc, char **argv)
{
  g_autoptr (SwApplication) app = NULL;
  int status;

  setlocale (LC_ALL, "");
  bindtextdomain (GETTEXT_PACKAGE, LOCALEDIR);
  bind_textdomain_codeset (GETTEXT_PACKAGE, "UTF-8");
  textdomain (GETTEXT_PACKAGE);

  app = sw_application_new ();
  status = g_application_run (G_APPLICATION (app), argc, argv);
  return status != 0 ? status : sw_application_get_exit_status (app);
}
