/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-widget-text.c: texts set only when they change. */
#include "config.h"

#include "sw-widget-text.h"

void
sw_widget_set_tooltip (GtkWidget *widget, const char *text)
{
  const char *now;

  g_return_if_fail (GTK_IS_WIDGET (widget));
  now = gtk_widget_get_tooltip_text (widget);
  /* GTK keeps no tooltip for an empty text. */
  if (g_strcmp0 (now, text != NULL && text[0] != '\0' ? text : NULL) == 0)
    return;
  gtk_widget_set_tooltip_text (widget, text);
}
