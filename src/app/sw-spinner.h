/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-spinner.h: spinners that turn only while they are shown.  In GTK 4.8 a
 * turning GtkSpinner animates its style even behind another page, and the
 * animation has the whole window laid out again at every frame (60 times a
 * second, on X11 each with round trips to the server).  Every spinner of
 * the window is set through this. */
#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

/* Whether @spinner shows work going on: it turns while it is mapped, and
 * stops while it is not (and turns again when mapped, if still busy). */
void sw_spinner_set_busy (GtkSpinner *spinner, gboolean busy);

G_END_DECLS
