/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-steady-text.h: a wrapped text that keeps its height.
 *
 * The totals' verdict, ascent note and warnings change at every phase of
 * every edit.  A GtkLabel that changes its text has the whole window laid
 * out again, and measuring wrapped labels at every width the containers
 * try cost the frame up to 10 ms.  This text is only drawn again when its
 * new text fits the height it already has; it asks for more room only
 * when the text needs it, and it never gives room back until it is told
 * to forget (a new design) or is given another width. */
#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

#define SW_TYPE_STEADY_TEXT (sw_steady_text_get_type ())
G_DECLARE_FINAL_TYPE (SwSteadyText, sw_steady_text, SW, STEADY_TEXT, GtkWidget)

GtkWidget  *sw_steady_text_new (void);
void        sw_steady_text_set_text (SwSteadyText *self, const char *text);
const char *sw_steady_text_get_text (SwSteadyText *self);
/* At least this many lines high (1 by default). */
void        sw_steady_text_set_min_lines (SwSteadyText *self, int lines);
/* In bold type (the verdict of a vehicle that falls short), set without a
 * change of style. */
void        sw_steady_text_set_bold (SwSteadyText *self, gboolean bold);
gboolean    sw_steady_text_get_bold (SwSteadyText *self);
/* Gives back the height kept for longer texts shown before. */
void        sw_steady_text_forget_height (SwSteadyText *self);
/* For tests: the lines the text takes at its width. */
int         sw_steady_text_get_line_count (SwSteadyText *self);

G_END_DECLS
