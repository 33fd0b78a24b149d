/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-application.h: the GtkApplication: single instance, opens
 * .stagewright files, app-wide actions, --screenshot. */
#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

#define SW_TYPE_APPLICATION (sw_application_get_type ())
G_DECLARE_FINAL_TYPE (SwApplication, sw_application, SW, APPLICATION, GtkApplication)

SwApplication *sw_application_new (void);
/* The process exit status (non-zero when --screenshot failed). */
int            sw_application_get_exit_status (SwApplication *self);

/* The application's settings; falls back to the schema compiled in the
 * build folder when the application runs uninstalled. */
gboolean       sw_application_check_settings (GError **error);
GSettings     *sw_application_settings_new (void);
/* Path of a bundled demonstration design (the source tree when it exists,
 * else the installed copy). */
char          *sw_application_find_design (const char *basename);

/* Adds the application's style rules (style.css) to @display, as the
 * application does at start-up; returns them, for a caller (a test) that
 * takes them away again with gtk_style_context_remove_provider_for_display. */
GtkCssProvider *sw_application_add_style (GdkDisplay *display);

/* Renders @widget offscreen with the cairo renderer and writes a PNG. */
gboolean       sw_application_write_png (GtkWidget *widget, const char *filename,
                                         GError **error);

G_END_DECLS
