/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-narrow.h: texts that give way instead of widening the window.  A
 * translation (German runs a third longer than English) or a long choice
 * must never set the window's minimum width: button and check-box labels
 * wrap at word boundaries, a drop-down shows its choice ellipsized (the
 * open list shows every choice in full, and the tooltip the chosen one). */
#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

/* Every button, menu button and check box label below @root wraps, and
 * every drop-down of strings below @root ellipsizes its shown choice. */
void sw_narrow_texts (GtkWidget *root);

G_END_DECLS
