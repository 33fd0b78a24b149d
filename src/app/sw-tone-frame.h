/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-tone-frame.h: a framed row whose frame changes without a change of
 * style.
 *
 * The totals' warnings row turns from quiet to warning and back as edits
 * cross a limit.  Swapping its CSS classes restyled the window inside the
 * next frame, and GTK then asked the X server twice for the window's size
 * in that frame (about 1 ms under Xvfb; bench-gui).  This frame keeps one
 * styled "face" per tone (an empty box with the tone's classes, each
 * styled once) and draws the current one under its content: a change of
 * tone is a repaint.  The faces share their padding and border widths,
 * which set the content's inset. */
#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

#define SW_TYPE_TONE_FRAME (sw_tone_frame_get_type ())
G_DECLARE_FINAL_TYPE (SwToneFrame, sw_tone_frame, SW, TONE_FRAME, GtkWidget)

GtkWidget *sw_tone_frame_new (void);
/* The faces, as CSS classes separated by spaces ("sw-status-none
 * sw-status-warn"): one face per class, each also of class "sw-status". */
void       sw_tone_frame_set_faces (SwToneFrame *self, const char *faces);
/* Draws face @index (0 is the first); out of range is ignored. */
void       sw_tone_frame_set_face (SwToneFrame *self, guint index);
guint      sw_tone_frame_get_face (SwToneFrame *self);
void       sw_tone_frame_set_child (SwToneFrame *self, GtkWidget *child);
GtkWidget *sw_tone_frame_get_child (SwToneFrame *self);
/* For tests: face @index's widget, NULL when out of range. */
GtkWidget *sw_tone_frame_get_face_widget (SwToneFrame *self, guint index);

G_END_DECLS
