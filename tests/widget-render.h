/* SPDX-License-Identifier: GPL-3.0-or-later */
/* widget-render.h: offscreen rendering of one widget for the GUI tests and
 * the preview renderer.  The widget is put alone into an undecorated window
 * of a fixed size, the window is shown (Xvfb in the tests), and its render
 * node is drawn with cairo onto an image surface: no GPU involved. */
#pragma once

#include <gtk/gtk.h>

#include "sw-design.h"
#include "sw-analysis.h"

G_GNUC_UNUSED static gboolean
widget_render_timeout_cb (gpointer data)
{
  *(gboolean *) data = TRUE;
  return G_SOURCE_REMOVE;
}

/* Shows @widget in a new window of @width x @height and waits until it has
 * that size.  Returns the window (owned by GTK; destroy it when done). */
static inline GtkWidget *
widget_render_show (GtkWidget *widget, int width, int height)
{
  GtkWidget *window = gtk_window_new ();
  gboolean timed_out = FALSE;
  guint id;

  gtk_window_set_decorated (GTK_WINDOW (window), FALSE);
  gtk_window_set_default_size (GTK_WINDOW (window), width, height);
  gtk_window_set_child (GTK_WINDOW (window), widget);
  gtk_window_present (GTK_WINDOW (window));

  id = g_timeout_add (5000, widget_render_timeout_cb, &timed_out);
  while (!timed_out && (!gtk_widget_get_mapped (widget)
                        || gtk_widget_get_width (widget) != width
                        || gtk_widget_get_height (widget) != height))
    g_main_context_iteration (NULL, TRUE);
  if (!timed_out)
    g_source_remove (id);
  /* One more frame so the first allocation has been drawn. */
  for (int i = 0; i < 20 && g_main_context_pending (NULL); i++)
    g_main_context_iteration (NULL, FALSE);
  return window;
}

/* Lets pending redraws and relayouts run (after a change to a shown widget). */
static inline void
widget_render_settle (void)
{
  gboolean timed_out = FALSE;
  g_timeout_add (100, widget_render_timeout_cb, &timed_out);

  while (!timed_out)
    g_main_context_iteration (NULL, TRUE);
}

/* Renders the whole window (its background included) to an ARGB image. */
static inline cairo_surface_t *
widget_render_window (GtkWidget *window)
{
  int w = gtk_widget_get_width (window), h = gtk_widget_get_height (window);
  GdkPaintable *paintable = gtk_widget_paintable_new (window);
  GtkSnapshot *snapshot = gtk_snapshot_new ();
  GskRenderNode *node;
  cairo_surface_t *surface = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, w, h);
  cairo_t *cr = cairo_create (surface);

  gdk_paintable_snapshot (paintable, snapshot, w, h);
  node = gtk_snapshot_free_to_node (snapshot);
  if (node != NULL)
    {
      gsk_render_node_draw (node, cr);
      gsk_render_node_unref (node);
    }
  cairo_destroy (cr);
  g_object_unref (paintable);
  cairo_surface_flush (surface);
  return surface;
}

/* The result of a demo design from the source tree (env SW_SOURCE_ROOT). */
static inline SwAnalysis *
widget_render_demo_result (const char *basename)
{
  const char *root = g_getenv ("SW_SOURCE_ROOT");
  g_autofree char *path = NULL;
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) design = NULL;

  path = g_build_filename (root != NULL ? root : ".", "data", "designs", basename, NULL);
  design = sw_design_load (path, NULL, &error);
  g_assert_no_error (error);
  g_assert_nonnull (design);
  return sw_analysis_compute (design, 1, NULL);
}

/* A pixel as four doubles in 0..1, alpha-premultiplied as cairo stores it. */
static inline void
widget_render_pixel (cairo_surface_t *surface, int x, int y, double px[4])
{
  const guint8 *data = cairo_image_surface_get_data (surface);
  int stride = cairo_image_surface_get_stride (surface);
  guint32 v = *(const guint32 *) (data + y * stride + 4 * x);

  px[0] = ((v >> 16) & 0xff) / 255.0;
  px[1] = ((v >> 8) & 0xff) / 255.0;
  px[2] = (v & 0xff) / 255.0;
  px[3] = ((v >> 24) & 0xff) / 255.0;
}
