/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-plot-palette.h: the application's colour-blind-safe palette (Okabe-Ito,
 * eight colours), adjusted to the theme of a widget so every entry keeps 3:1
 * contrast with the background (WCAG 2.1, non-text contrast); index 7 is the
 * foreground.  Used by the plot and the stack view. */
#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

#define SW_PLOT_N_PALETTE 8

void     sw_plot_palette_color (GtkWidget *widget, int index, GdkRGBA *rgba);
/* Whether @widget's theme is dark (light foreground). */
gboolean sw_plot_style_is_dark (GtkWidget *widget);
/* The style's foreground and the background the widget sits on. */
void     sw_plot_style_fg (GtkWidget *widget, GdkRGBA *fg);
void     sw_plot_style_bg (GtkWidget *widget, GdkRGBA *bg);

G_END_DECLS
