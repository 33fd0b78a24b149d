/* SPDX-License-Identifier: GPL-3.0-or-later */
#include "config.h"

#include "sw-spinner.h"

#define BUSY_KEY "sw-spinner-busy"

static void
mapped_cb (GtkWidget *spinner)
{
  gtk_spinner_set_spinning (GTK_SPINNER (spinner),
                            GPOINTER_TO_INT (g_object_get_data (G_OBJECT (spinner), BUSY_KEY)) == 2);
}

static void
unmapped_cb (GtkWidget *spinner)
{
  gtk_spinner_set_spinning (GTK_SPINNER (spinner), FALSE);
}

void
sw_spinner_set_busy (GtkSpinner *spinner, gboolean busy)
{
  g_return_if_fail (GTK_IS_SPINNER (spinner));

  /* The key's value: NULL before the first call, then 1 idle or 2 busy. */
  if (g_object_get_data (G_OBJECT (spinner), BUSY_KEY) == NULL)
    {
      g_signal_connect (spinner, "map", G_CALLBACK (mapped_cb), NULL);
      g_signal_connect (spinner, "unmap", G_CALLBACK (unmapped_cb), NULL);
    }
  g_object_set_data (G_OBJECT (spinner), BUSY_KEY, GINT_TO_POINTER (busy ? 2 : 1));
  gtk_spinner_set_spinning (spinner, busy && gtk_widget_get_mapped (GTK_WIDGET (spinner)));
}
