/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-plot"

#include "config.h"

#include "sw-plot-palette.h"

#include <math.h>

#define N_PALETTE SW_PLOT_N_PALETTE

/* Okabe & Ito, "Color Universal Design" (2002/2008): eight colours chosen to
 * stay distinct for the common forms of colour-vision deficiency.  Order:
 * blue, vermillion, bluish green, reddish purple, orange, sky blue, yellow,
 * black (black is replaced by the style's foreground). */
static const guint8 okabe_ito[N_PALETTE][3] = {
  { 0x00, 0x72, 0xB2 },
  { 0xD5, 0x5E, 0x00 },
  { 0x00, 0x9E, 0x73 },
  { 0xCC, 0x79, 0xA7 },
  { 0xE6, 0x9F, 0x00 },
  { 0x56, 0xB4, 0xE9 },
  { 0xF0, 0xE4, 0x42 },
  { 0x00, 0x00, 0x00 },
};

void
sw_plot_style_fg (GtkWidget *widget, GdkRGBA *fg)
{
  G_GNUC_BEGIN_IGNORE_DEPRECATIONS
  gtk_style_context_get_color (gtk_widget_get_style_context (widget), fg);
  G_GNUC_END_IGNORE_DEPRECATIONS
}

static double
channel_linear (double c)
{
  return c <= 0.04045 ? c / 12.92 : pow ((c + 0.055) / 1.055, 2.4);
}

/* Relative luminance and contrast ratio as defined in WCAG 2.x. */
static double
luminance (const GdkRGBA *c)
{
  return 0.2126 * channel_linear (c->red) + 0.7152 * channel_linear (c->green)
         + 0.0722 * channel_linear (c->blue);
}

static double
contrast (const GdkRGBA *a, const GdkRGBA *b)
{
  double la = luminance (a), lb = luminance (b);

  return (MAX (la, lb) + 0.05) / (MIN (la, lb) + 0.05);
}

gboolean
sw_plot_style_is_dark (GtkWidget *widget)
{
  GdkRGBA fg;

  g_return_val_if_fail (GTK_IS_WIDGET (widget), FALSE);
  sw_plot_style_fg (widget, &fg);
  return luminance (&fg) > 0.4;
}

/* The background the widget sits on: the theme's named colour when there is
 * one, else the usual window background for the light or dark variant. */
void
sw_plot_style_bg (GtkWidget *widget, GdkRGBA *bg)
{
  static const char *const names[] = { "window_bg_color", "theme_bg_color", "theme_base_color" };
  gboolean dark = sw_plot_style_is_dark (widget);

  G_GNUC_BEGIN_IGNORE_DEPRECATIONS
  for (guint i = 0; i < G_N_ELEMENTS (names); i++)
    if (gtk_style_context_lookup_color (gtk_widget_get_style_context (widget), names[i], bg)
        && bg->alpha > 0.5)
      {
        GdkRGBA fg;
        sw_plot_style_fg (widget, &fg);
        /* A named colour that does not contrast with the text is not the background. */
        if (contrast (bg, &fg) > 3.0)
          return;
      }
  G_GNUC_END_IGNORE_DEPRECATIONS
  if (dark)
    *bg = (GdkRGBA) { 0.14, 0.14, 0.14, 1.0 };
  else
    *bg = (GdkRGBA) { 0.98, 0.98, 0.98, 1.0 };
}

void
sw_plot_palette_color (GtkWidget *widget, int index, GdkRGBA *rgba)
{
  GdkRGBA fg, bg, c;

  g_return_if_fail (GTK_IS_WIDGET (widget) && rgba != NULL);

  index = ((index % N_PALETTE) + N_PALETTE) % N_PALETTE;
  sw_plot_style_fg (widget, &fg);
  if (index == N_PALETTE - 1)
    {
      *rgba = fg;
      rgba->alpha = 1.0;
      return;
    }
  sw_plot_style_bg (widget, &bg);
  c = (GdkRGBA) { okabe_ito[index][0] / 255.0, okabe_ito[index][1] / 255.0,
                  okabe_ito[index][2] / 255.0, 1.0 };
  /* Lines and markers need 3:1 against the background (WCAG 2.1, non-text
   * contrast); move towards the foreground until they have it. */
  for (int step = 0; step < 20 && contrast (&c, &bg) < 3.0; step++)
    {
      c.red += 0.08 * (fg.red - c.red);
      c.green += 0.08 * (fg.green - c.green);
      c.blue += 0.08 * (fg.blue - c.blue);
    }
  *rgba = c;
}

