/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-window.h: the main window: one design, its inspector, the stack view,
 * the totals, the trade curves and the working. */
#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

#define SW_TYPE_WINDOW (sw_window_get_type ())
G_DECLARE_FINAL_TYPE (SwWindow, sw_window, SW, WINDOW, GtkApplicationWindow)

SwWindow *sw_window_new (GtkApplication *application);
/* Opens @file in this window; a failure is shown in the window and changes
 * nothing.  Returns TRUE when the design was loaded. */
gboolean  sw_window_load (SwWindow *self, GFile *file);
/* Opens @file as an untitled copy, so a bundled demonstration design is
 * never overwritten. */
gboolean  sw_window_load_template (SwWindow *self, GFile *file);
/* TRUE when the window holds no unsaved work, so a file may replace it. */
gboolean  sw_window_is_replaceable (SwWindow *self);

G_END_DECLS
