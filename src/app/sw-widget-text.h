/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-widget-text.h: texts the views set on every result, set only when they
 * change.  Setting a tooltip is not free even when it is the same text (GTK
 * queries the tooltip under the pointer again), and the views show every
 * result of every edit: an unchanged tooltip set on each cost the edit a
 * millisecond or more before its frame. */
#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

/* gtk_widget_set_tooltip_text(), skipped when @widget already has @text. */
void sw_widget_set_tooltip (GtkWidget *widget, const char *text);

G_END_DECLS
