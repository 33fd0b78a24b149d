/* SPDX-License-Identifier: GPL-3.0-or-later */
/* GUI tests of the plot widget: rendered offscreen (cairo renderer, Xvfb).
 * The check values are geometry: a linear axis maps equal steps to equal
 * distances, a log axis maps each factor of ten to the same distance, and a
 * point is drawn where the mapping says.  The trade-curve test takes the
 * current design's point from the core's result. */
#include "config.h"

#include "sw-plot.h"
#include "sw-plot-private.h"
#include "sw-raster.h"
#include "widget-render.h"

#include <math.h>

#define WIDTH 600
#define HEIGHT 400

static GtkWidget *
show_plot (GtkWidget *plot)
{
  return widget_render_show (plot, WIDTH, HEIGHT);
}

static gboolean
inside (const graphene_rect_t *a, double x, double y)
{
  return x >= a->origin.x - 1e-6 && x <= a->origin.x + a->size.width + 1e-6
         && y >= a->origin.y - 1e-6 && y <= a->origin.y + a->size.height + 1e-6;
}

static void
test_linear_mapping (void)
{
  static const double x[] = { 0.0, 2.5, 5.0, 7.5, 10.0 };
  static const double y[] = { 0.0, 40.0, 20.0, 80.0, 100.0 };
  GtkWidget *plot = sw_plot_new ();
  GtkWidget *window;
  graphene_rect_t area;
  double wx[5], wy[5];

  sw_plot_set_title (SW_PLOT (plot), "Linear");
  sw_plot_set_x_axis (SW_PLOT (plot), "Time (s)", FALSE);
  sw_plot_set_y_axis (SW_PLOT (plot), "Speed (m/s)", FALSE);
  sw_plot_add_series (SW_PLOT (plot), "speed", x, y, 5, SW_PLOT_LINE, -1);
  window = show_plot (plot);

  g_assert_true (sw_plot_get_plot_area (SW_PLOT (plot), &area));
  g_assert_cmpfloat (area.size.width, >, WIDTH / 2.0);
  g_assert_cmpfloat (area.size.height, >, HEIGHT / 3.0);
  for (int i = 0; i < 5; i++)
    {
      g_assert_true (sw_plot_data_to_widget (SW_PLOT (plot), x[i], y[i], &wx[i], &wy[i]));
      g_assert_true (inside (&area, wx[i], wy[i]));
    }
  /* x grows to the right, y grows upwards (smaller widget y). */
  for (int i = 0; i + 1 < 5; i++)
    g_assert_cmpfloat (wx[i + 1], >, wx[i]);
  g_assert_cmpfloat (wy[1], <, wy[0]);
  g_assert_cmpfloat (wy[2], >, wy[1]);
  g_assert_cmpfloat (wy[4], <, wy[3]);
  /* Linear: equal data steps, equal pixel steps; midpoints map to midpoints. */
  g_assert_cmpfloat_with_epsilon (wx[1] - wx[0], wx[4] - wx[3], 1e-9);
  {
    double mid;
    g_assert_true (sw_plot_data_to_widget (SW_PLOT (plot), 5.0, 50.0, NULL, &mid));
    g_assert_cmpfloat_with_epsilon ((wy[0] + wy[4]) / 2.0, mid, 1e-9);
  }
  /* Non-finite input has no position. */
  g_assert_false (sw_plot_data_to_widget (SW_PLOT (plot), NAN, 1.0, NULL, NULL));
  g_assert_false (sw_plot_data_to_widget (SW_PLOT (plot), 1.0, INFINITY, NULL, NULL));
  gtk_window_destroy (GTK_WINDOW (window));
}

/* A series whose values differ only in the last bits (a flat curve after
 * rounding) gets a readable axis around it; it once made the tick loop run
 * for ever. */
static void
test_flat_series (void)
{
  static const double x[] = { 1.0, 2.0, 3.0 };
  double y[3] = { 0.24, 0.24, 0.24 };
  GtkWidget *plot, *window;
  double w0, w1;

  y[1] = nextafter (y[0], 1.0);
  y[2] = nextafter (y[1], 1.0);
  for (int log_scale = 0; log_scale < 2; log_scale++)
    {
      plot = sw_plot_new ();
      sw_plot_set_y_axis (SW_PLOT (plot), "y", log_scale);
      sw_plot_add_series (SW_PLOT (plot), "flat", x, y, 3, SW_PLOT_LINE, -1);
      window = show_plot (plot);
      g_assert_true (sw_plot_data_to_widget (SW_PLOT (plot), 1.0, y[0], NULL, &w0));
      g_assert_true (sw_plot_data_to_widget (SW_PLOT (plot), 1.0, 0.25, NULL, &w1));
      /* The range is widened to a tenth (linear) or a factor of two (log)
       * around the value: 0.25 lies above it within the plot. */
      g_assert_cmpfloat (w1, <, w0);
      gtk_window_destroy (GTK_WINDOW (window));
    }
}

static void
test_log_decades (void)
{
  static const double x[] = { 1.0, 2.0, 3.0, 4.0, 5.0, 6.0 };
  static const double y[] = { 150.0, 2e3, NAN, 4e4, -1.0, 7e5 };
  GtkWidget *plot = sw_plot_new ();
  GtkWidget *window;
  graphene_rect_t area;
  double w3, w4, w5, w6, lo, hi;

  sw_plot_set_y_axis (SW_PLOT (plot), "Mass (kg)", TRUE);
  sw_plot_add_series (SW_PLOT (plot), "mass", x, y, 6, SW_PLOT_LINE_POINTS, -1);
  window = show_plot (plot);
  g_assert_true (sw_plot_get_plot_area (SW_PLOT (plot), &area));

  g_assert_true (sw_plot_data_to_widget (SW_PLOT (plot), 1.0, 1e3, NULL, &w3));
  g_assert_true (sw_plot_data_to_widget (SW_PLOT (plot), 1.0, 1e4, NULL, &w4));
  g_assert_true (sw_plot_data_to_widget (SW_PLOT (plot), 1.0, 1e5, NULL, &w5));
  g_assert_true (sw_plot_data_to_widget (SW_PLOT (plot), 1.0, 1e6, NULL, &w6));
  /* Each decade takes the same height. */
  g_assert_cmpfloat (w3 - w4, >, 10.0);
  g_assert_cmpfloat_with_epsilon (w3 - w4, w4 - w5, 1e-6);
  g_assert_cmpfloat_with_epsilon (w4 - w5, w5 - w6, 1e-6);
  /* A factor of two is log10(2) of a decade. */
  {
    double w2e3;
    g_assert_true (sw_plot_data_to_widget (SW_PLOT (plot), 1.0, 2e3, NULL, &w2e3));
    g_assert_cmpfloat_with_epsilon ((w3 - w2e3) / (w3 - w4), log10 (2.0), 1e-9);
  }
  /* The automatic range holds every valid point (NaN and -1 ignored) and
   * does not run far past them: from 150 to 7e5 the nice ends are 100 and 1e6. */
  g_assert_true (sw_plot_data_to_widget (SW_PLOT (plot), 1.0, 150.0, NULL, &lo));
  g_assert_true (sw_plot_data_to_widget (SW_PLOT (plot), 6.0, 7e5, NULL, &hi));
  g_assert_true (inside (&area, area.origin.x, lo));
  g_assert_true (inside (&area, area.origin.x, hi));
  g_assert_cmpfloat (hi - area.origin.y, <, 0.1 * area.size.height);
  g_assert_cmpfloat (area.origin.y + area.size.height - lo, <, 0.1 * area.size.height);
  /* No position for values a log axis cannot show. */
  g_assert_false (sw_plot_data_to_widget (SW_PLOT (plot), 1.0, 0.0, NULL, NULL));
  g_assert_false (sw_plot_data_to_widget (SW_PLOT (plot), 1.0, -5.0, NULL, NULL));
  gtk_window_destroy (GTK_WINDOW (window));
}

static double
distance_to (const double px[4], const GdkRGBA *c)
{
  return fabs (px[0] - c->red) + fabs (px[1] - c->green) + fabs (px[2] - c->blue);
}

/* The smallest colour distance to @c within @r pixels of (x, y). */
static double
nearest_color (cairo_surface_t *surface, double x, double y, int r, const GdkRGBA *c)
{
  double best = INFINITY;

  for (int dy = -r; dy <= r; dy++)
    for (int dx = -r; dx <= r; dx++)
      {
        double px[4];
        widget_render_pixel (surface, (int) floor (x) + dx, (int) floor (y) + dy, px);
        best = MIN (best, distance_to (px, c));
      }
  return best;
}

static void
test_points_drawn (void)
{
  static const double x[] = { 10.0, 20.0, 30.0 };
  static const double y[] = { 5.0, 9.0, 2.0 };
  GtkWidget *plot = sw_plot_new ();
  GtkWidget *window;
  cairo_surface_t *surface;
  GdkRGBA color;
  double wx, wy, bg[4];

  sw_plot_set_x_axis (SW_PLOT (plot), "x", FALSE);
  sw_plot_set_y_axis (SW_PLOT (plot), "y", FALSE);
  sw_plot_add_series (SW_PLOT (plot), "points", x, y, 3, SW_PLOT_POINTS, 2);
  window = show_plot (plot);
  surface = widget_render_window (window);
  sw_plot_palette_color (plot, 2, &color);
  widget_render_pixel (surface, 1, 1, bg);

  for (int i = 0; i < 3; i++)
    {
      g_assert_true (sw_plot_data_to_widget (SW_PLOT (plot), x[i], y[i], &wx, &wy));
      /* The marker's colour right at the mapped point. */
      g_assert_cmpfloat (nearest_color (surface, wx, wy, 1, &color), <, 0.05);
    }
  /* ... and not where there is no point (half-way between two points,
   * well off the straight line between them: POINTS draws no line). */
  g_assert_true (sw_plot_data_to_widget (SW_PLOT (plot), 15.0, 2.0, &wx, &wy));
  g_assert_cmpfloat (nearest_color (surface, wx, wy, 3, &color), >, 0.3);
  cairo_surface_destroy (surface);
  gtk_window_destroy (GTK_WINDOW (window));
}

static void
test_line_breaks (void)
{
  /* A NaN in the middle breaks the line: no pixels of the series colour
   * half-way across the gap. */
  static const double x[] = { 0.0, 1.0, 2.0, 3.0, 4.0 };
  static const double y[] = { 1.0, 1.0, NAN, 1.0, 1.0 };
  GtkWidget *plot = sw_plot_new ();
  GtkWidget *window;
  cairo_surface_t *surface;
  GdkRGBA color;
  double wx, wy;

  sw_plot_set_y_range (SW_PLOT (plot), 0.0, 2.0);
  sw_plot_add_series (SW_PLOT (plot), "broken", x, y, 5, SW_PLOT_LINE, 0);
  window = show_plot (plot);
  surface = widget_render_window (window);
  sw_plot_palette_color (plot, 0, &color);

  g_assert_true (sw_plot_data_to_widget (SW_PLOT (plot), 0.5, 1.0, &wx, &wy));
  g_assert_cmpfloat (nearest_color (surface, wx, wy, 2, &color), <, 0.05);
  g_assert_true (sw_plot_data_to_widget (SW_PLOT (plot), 2.0, 1.0, &wx, &wy));
  g_assert_cmpfloat (nearest_color (surface, wx, wy, 2, &color), >, 0.3);
  cairo_surface_destroy (surface);
  gtk_window_destroy (GTK_WINDOW (window));
}

static void
test_current_design_marker (void)
{
  /* The stage-count curve of a demo design, with the current design marked
   * at the liftoff mass the core computed for its stage count. */
  g_autoptr (SwAnalysis) r = widget_render_demo_result ("small-sat-launcher.stagewright");
  GtkWidget *plot = sw_plot_new ();
  GtkWidget *window;
  cairo_surface_t *surface;
  double x[SW_MAX_STAGES], y[SW_MAX_STAGES], wx, wy;
  GdkRGBA fg;
  guint n = r->stage_curve.n_points;

  g_assert_true (r->ok && r->sizing.feasible);
  for (guint i = 0; i < n; i++)
    {
      x[i] = r->stage_curve.points[i].stages;
      y[i] = r->stage_curve.points[i].liftoff_mass_kg;
    }
  sw_plot_set_x_axis (SW_PLOT (plot), "Number of stages", FALSE);
  sw_plot_set_y_axis (SW_PLOT (plot), "Liftoff mass (t)", TRUE);
  sw_plot_set_y_format (SW_PLOT (plot), "%.1f t", 1000.0);
  sw_plot_set_x_range (SW_PLOT (plot), 0.5, n + 0.5);
  sw_plot_add_series (SW_PLOT (plot), "optimal split", x, y, n, SW_PLOT_LINE_POINTS, 0);
  sw_plot_add_marker (SW_PLOT (plot), r->sizing.n_stages, r->sizing.liftoff_mass_kg,
                      "this design", SW_MARKER_CURRENT);
  window = show_plot (plot);
  surface = widget_render_window (window);

  /* The design's own optimal sizing and the curve's point for its stage
   * count are the same vehicle. */
  g_assert_cmpfloat (fabs (y[r->sizing.n_stages - 1] / r->sizing.liftoff_mass_kg - 1.0), <, 1e-6);
  g_assert_true (sw_plot_data_to_widget (SW_PLOT (plot), r->sizing.n_stages,
                                         r->sizing.liftoff_mass_kg, &wx, &wy));
  /* The filled current-design marker (foreground colour) is drawn there. */
  G_GNUC_BEGIN_IGNORE_DEPRECATIONS
  gtk_style_context_get_color (gtk_widget_get_style_context (plot), &fg);
  G_GNUC_END_IGNORE_DEPRECATIONS
  g_assert_cmpfloat (nearest_color (surface, wx, wy, 1, &fg), <, 0.1);
  cairo_surface_destroy (surface);
  gtk_window_destroy (GTK_WINDOW (window));
}

static void
test_palette (void)
{
  GtkWidget *label = g_object_ref_sink (gtk_label_new (NULL));
  GdkRGBA a, b;

  /* Eight distinct colours, repeating after eight. */
  for (int i = 0; i < 8; i++)
    for (int j = i + 1; j < 8; j++)
      {
        sw_plot_palette_color (label, i, &a);
        sw_plot_palette_color (label, j, &b);
        g_assert_false (gdk_rgba_equal (&a, &b));
      }
  sw_plot_palette_color (label, 1, &a);
  sw_plot_palette_color (label, 9, &b);
  g_assert_true (gdk_rgba_equal (&a, &b));
  g_object_unref (label);
}

static void
test_clear_and_formats (void)
{
  static const double x[] = { 1.0, 2.0 };
  static const double y[] = { 1.0, 2.0 };
  GtkWidget *plot = sw_plot_new ();
  GtkWidget *window;
  graphene_rect_t area;
  double before, after;

  /* A format with two conversions is refused with a warning, not used. */
  g_test_expect_message ("sw-plot", G_LOG_LEVEL_WARNING, "*exactly one double conversion*");
  sw_plot_set_x_format (SW_PLOT (plot), "%f %f", 1.0);
  g_test_assert_expected_messages ();
  sw_plot_set_x_format (SW_PLOT (plot), "%.0f %%", 0.01);
  sw_plot_add_series (SW_PLOT (plot), "a", x, y, 2, SW_PLOT_LINE, -1);
  sw_plot_add_vline (SW_PLOT (plot), 1.5, "limit", 1);
  window = show_plot (plot);
  g_assert_true (sw_plot_get_plot_area (SW_PLOT (plot), &area));
  /* Automatic range: the data run from 1 to 2, round numbers already. */
  g_assert_true (sw_plot_data_to_widget (SW_PLOT (plot), 1.0, 1.5, &before, NULL));
  g_assert_cmpfloat_with_epsilon (before, area.origin.x, 1e-9);
  sw_plot_clear (SW_PLOT (plot));
  sw_plot_set_x_range (SW_PLOT (plot), 0.0, 3.0);
  /* Empty plot: still an area and a mapping from the fixed range. */
  g_assert_true (sw_plot_data_to_widget (SW_PLOT (plot), 1.0, 1.5, &after, NULL));
  g_assert_true (sw_plot_get_plot_area (SW_PLOT (plot), &area));
  g_assert_cmpfloat_with_epsilon (after, area.origin.x + area.size.width / 3.0, 1e-9);
  gtk_window_destroy (GTK_WINDOW (window));
}

/* Dark pixels down the column of the y axis inside the plot area. */
static int
axis_column_ink (cairo_surface_t *surface, const graphene_rect_t *area)
{
  int n = 0;
  double bg[4];

  widget_render_pixel (surface, 1, 1, bg);
  for (int y = (int) area->origin.y + 2; y < (int) (area->origin.y + area->size.height) - 2; y++)
    {
      double px[4];
      widget_render_pixel (surface, (int) round (area->origin.x), y, px);
      if (fabs (px[0] - bg[0]) + fabs (px[1] - bg[1]) + fabs (px[2] - bg[2]) > 0.3)
        n++;
    }
  return n;
}

/* A plot with nothing to draw says so instead of drawing empty 0..1 axes;
 * the same plot with a series draws its axis. */
static void
test_no_data (void)
{
  static const double x[] = { 1.0, 2.0, 3.0 };
  static const double y[] = { 5.0, 7.0, 6.0 };
  GtkWidget *plot = sw_plot_new ();
  GtkWidget *window;
  cairo_surface_t *surface;
  graphene_rect_t area;
  int empty_ink, full_ink;

  sw_plot_set_title (SW_PLOT (plot), "Nothing yet");
  sw_plot_set_x_axis (SW_PLOT (plot), "x", FALSE);
  sw_plot_set_y_axis (SW_PLOT (plot), "y", FALSE);
  window = show_plot (plot);
  g_assert_true (sw_plot_get_plot_area (SW_PLOT (plot), &area));
  surface = widget_render_window (window);
  empty_ink = axis_column_ink (surface, &area);
  cairo_surface_destroy (surface);

  sw_plot_add_series (SW_PLOT (plot), "s", x, y, 3, SW_PLOT_LINE, -1);
  widget_render_settle ();
  g_assert_true (sw_plot_get_plot_area (SW_PLOT (plot), &area));
  surface = widget_render_window (window);
  full_ink = axis_column_ink (surface, &area);
  cairo_surface_destroy (surface);
  g_test_message ("axis column: %d dark pixels without data, %d with", empty_ink, full_ink);
  g_assert_cmpint (full_ink, >, area.size.height / 2);
  g_assert_cmpint (empty_ink, <, area.size.height / 10);
  gtk_window_destroy (GTK_WINDOW (window));
}

/* The first cairo drawing in @node's tree (borrowed), NULL if none. */
static void
collect_cairo_nodes (GskRenderNode *node, GPtrArray *out)
{
  if (node == NULL)
    return;
  switch (gsk_render_node_get_node_type (node))
    {
    case GSK_CAIRO_NODE:
      g_ptr_array_add (out, gsk_render_node_ref (node));
      break;
    case GSK_CONTAINER_NODE:
      for (guint i = 0; i < gsk_container_node_get_n_children (node); i++)
        collect_cairo_nodes (gsk_container_node_get_child (node, i), out);
      break;
    case GSK_TRANSFORM_NODE:
      collect_cairo_nodes (gsk_transform_node_get_child (node), out);
      break;
    case GSK_CLIP_NODE:
      collect_cairo_nodes (gsk_clip_node_get_child (node), out);
      break;
    case GSK_ROUNDED_CLIP_NODE:
      collect_cairo_nodes (gsk_rounded_clip_node_get_child (node), out);
      break;
    case GSK_OPACITY_NODE:
      collect_cairo_nodes (gsk_opacity_node_get_child (node), out);
      break;
    case GSK_DEBUG_NODE:
      collect_cairo_nodes (gsk_debug_node_get_child (node), out);
      break;
    default:
      break;
    }
}

/* The plot's current drawing as the renderer gets it: its layers' cairo
 * nodes in order (frame, data, notes), new references. */
static GPtrArray *
plot_drawing (GtkWidget *plot)
{
  GdkPaintable *paintable = gtk_widget_paintable_new (plot);
  GtkSnapshot *snapshot = gtk_snapshot_new ();
  GPtrArray *layers = g_ptr_array_new_with_free_func ((GDestroyNotify) gsk_render_node_unref);
  GskRenderNode *node;

  gdk_paintable_snapshot (paintable, snapshot, WIDTH, HEIGHT);
  node = gtk_snapshot_free_to_node (snapshot);
  collect_cairo_nodes (node, layers);
  if (node != NULL)
    gsk_render_node_unref (node);
  g_object_unref (paintable);
  return layers;
}

/* The same data given again (as every phase of an edit does) is not drawn
 * again: the renderer gets the very same drawing, so it rasterises nothing;
 * a change of one value or of the highlight draws the data anew, and only
 * the data when the axes stay: the frame (title, legend, axes) is kept. */
static void
test_drawing_kept (void)
{
  static const double x[] = { 1.0, 2.0, 3.0 };
  static const double y[] = { 5.0, 7.0, 6.0 };
  static const double y2[] = { 5.0, 7.5, 6.0 };
  GtkWidget *plot = sw_plot_new ();
  GtkWidget *window;
  g_autoptr (GPtrArray) first = NULL, again = NULL, changed = NULL, highlighted = NULL;

  sw_plot_set_x_axis (SW_PLOT (plot), "x", FALSE);
  sw_plot_set_y_axis (SW_PLOT (plot), "y", FALSE);
  sw_plot_set_y_range (SW_PLOT (plot), 4.0, 8.0);
  sw_plot_add_series (SW_PLOT (plot), "s", x, y, 3, SW_PLOT_LINE, 0);
  window = show_plot (plot);
  first = plot_drawing (plot);
  /* Frame and data; no notes without markers or limit lines. */
  g_assert_cmpuint (first->len, ==, 2);

  sw_plot_clear (SW_PLOT (plot));
  sw_plot_set_y_range (SW_PLOT (plot), 4.0, 8.0);
  sw_plot_add_series (SW_PLOT (plot), "s", x, y, 3, SW_PLOT_LINE, 0);
  widget_render_settle ();
  again = plot_drawing (plot);
  g_assert_cmpuint (again->len, ==, first->len);
  for (guint i = 0; i < first->len; i++)
    g_assert_true (again->pdata[i] == first->pdata[i]);

  sw_plot_clear (SW_PLOT (plot));
  sw_plot_set_y_range (SW_PLOT (plot), 4.0, 8.0);
  sw_plot_add_series (SW_PLOT (plot), "s", x, y2, 3, SW_PLOT_LINE, 0);
  widget_render_settle ();
  changed = plot_drawing (plot);
  g_assert_cmpuint (changed->len, ==, 2);
  g_assert_true (changed->pdata[0] == first->pdata[0]);
  g_assert_true (changed->pdata[1] != first->pdata[1]);

  sw_plot_set_series_highlighted (SW_PLOT (plot), 0, TRUE);
  widget_render_settle ();
  highlighted = plot_drawing (plot);
  g_assert_cmpuint (highlighted->len, ==, 2);
  g_assert_true (highlighted->pdata[0] == changed->pdata[0]);
  g_assert_true (highlighted->pdata[1] != changed->pdata[1]);

  /* A new axis range draws the frame anew. */
  sw_plot_set_y_range (SW_PLOT (plot), 0.0, 10.0);
  widget_render_settle ();
  g_clear_pointer (&again, g_ptr_array_unref);
  again = plot_drawing (plot);
  g_assert_cmpuint (again->len, ==, 2);
  g_assert_true (again->pdata[0] != highlighted->pdata[0]);

  gtk_window_destroy (GTK_WINDOW (window));
}

static void
count_paint_cb (GdkFrameClock *clock, guint *n)
{
  (*n)++;
}

/* New data is drawn as soon as it is set, from an idle that runs before the
 * frame clock's (which has a lower priority), and the frames then take that
 * very drawing: they copy pixels, they draw nothing. */
static void
test_drawn_ahead (void)
{
  static const double x[] = { 1.0, 2.0, 3.0 };
  static const double y[] = { 5.0, 7.0, 6.0 };
  static const double y2[] = { 5.0, 6.5, 7.5 };
  GtkWidget *plot = sw_plot_new ();
  SwPlot *p = SW_PLOT (plot);
  GtkWidget *window;
  g_autoptr (GPtrArray) snapped = NULL;
  GskRenderNode *ahead[G_N_ELEMENTS (p->layers)];
  GdkFrameClock *clock;
  guint paints = 0;
  gulong id;

  sw_plot_set_x_axis (p, "x", FALSE);
  sw_plot_set_y_axis (p, "y", FALSE);
  sw_plot_add_series (p, "s", x, y, 3, SW_PLOT_LINE, 0);
  window = show_plot (plot);
  widget_render_settle ();

  clock = gtk_widget_get_frame_clock (plot);
  id = g_signal_connect (clock, "paint", G_CALLBACK (count_paint_cb), &paints);
  sw_plot_clear (p);
  sw_plot_add_series (p, "s", x, y2, 3, SW_PLOT_LINE, 0);
  g_assert_cmpuint (p->prepare_id, !=, 0);
  /* Each iteration dispatches the ready sources of the highest priority
   * only, so no frame can come before the idle has run. */
  while (p->prepare_id != 0)
    g_main_context_iteration (NULL, FALSE);
  g_assert_cmpuint (paints, ==, 0);
  g_signal_handler_disconnect (clock, id);
  g_assert_false (p->drawing_dirty);
  g_assert_nonnull (p->drawing);
  for (guint i = 0; i < G_N_ELEMENTS (p->layers); i++)
    ahead[i] = p->layers[i];
  g_assert_nonnull (ahead[1]);

  /* The frames that follow show it as drawn. */
  widget_render_settle ();
  snapped = plot_drawing (plot);
  g_assert_cmpuint (snapped->len, ==, 2);
  g_assert_true (snapped->pdata[0] == ahead[0]);
  g_assert_true (snapped->pdata[1] == ahead[1]);

  gtk_window_destroy (GTK_WINDOW (window));
}

/* Text at @x, @y (its top left) with the default font. */
static void
show_text (cairo_t *cr, double x, double y, const char *text)
{
  PangoLayout *layout = pango_cairo_create_layout (cr);

  pango_layout_set_text (layout, text, -1);
  cairo_move_to (cr, x, y);
  pango_cairo_show_layout (cr, layout);
  g_object_unref (layout);
}

/* Draws @expected (@n nodes, in turn) and @node each on a clear image of
 * @width x @height units at @scale, and asserts that they paint the same to
 * within one level per channel, and paint something. */
static void
assert_same_pixels (GskRenderNode *const *expected, guint n, GskRenderNode *node, int width,
                    int height, int scale)
{
  int w = width * scale, h = height * scale;
  cairo_surface_t *direct = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, w, h);
  cairo_surface_t *via = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, w, h);
  const guint8 *a, *b;
  int max_diff = 0, inked = 0;
  cairo_t *cr;

  cairo_surface_set_device_scale (direct, scale, scale);
  cairo_surface_set_device_scale (via, scale, scale);
  cr = cairo_create (direct);
  for (guint i = 0; i < n; i++)
    gsk_render_node_draw (expected[i], cr);
  cairo_destroy (cr);
  cr = cairo_create (via);
  gsk_render_node_draw (node, cr);
  cairo_destroy (cr);
  cairo_surface_flush (direct);
  cairo_surface_flush (via);
  a = cairo_image_surface_get_data (direct);
  b = cairo_image_surface_get_data (via);
  for (int i = 0; i < cairo_image_surface_get_stride (direct) * h; i++)
    {
      max_diff = MAX (max_diff, abs ((int) a[i] - (int) b[i]));
      inked += a[i] != 0;
    }
  g_assert_cmpint (inked, >, 1000 * scale * scale);
  g_assert_cmpint (max_diff, <=, 1);
  cairo_surface_destroy (direct);
  cairo_surface_destroy (via);
}

/* A drawing turned into pixels ahead of the frame (sw_raster_node) paints
 * what the drawing itself paints, to within one level of rounding per
 * channel: checked against cairo drawing the same recording directly, at
 * scale 1 and 2, for a box that starts and ends between pixels. */
static void
test_raster_same_pixels (void)
{
  const graphene_rect_t box = GRAPHENE_RECT_INIT (3.4, 5.7, 120.3, 60.2);
  static const double dash[] = { 5.0, 3.0 };
  GskRenderNode *recorded = gsk_cairo_node_new (&box);
  cairo_t *cr = gsk_cairo_node_get_draw_context (recorded);

  cairo_set_source_rgba (cr, 0.1, 0.4, 0.8, 0.7);
  cairo_arc (cr, 40.0, 30.0, 17.3, 0.0, 2.0 * G_PI);
  cairo_fill (cr);
  cairo_set_source_rgb (cr, 0.9, 0.3, 0.1);
  cairo_set_line_width (cr, 2.0);
  cairo_set_dash (cr, dash, 2, 0.0);
  cairo_move_to (cr, 5.0, 60.0);
  cairo_curve_to (cr, 40.0, 10.0, 80.0, 70.0, 122.0, 8.0);
  cairo_stroke (cr);
  show_text (cr, 50.0, 40.0, "Liftoff 129.0 t");
  cairo_destroy (cr);

  for (int scale = 1; scale <= 2; scale++)
    {
      GskRenderNode *node = sw_raster_node (gsk_render_node_ref (recorded), &box, scale);
      graphene_rect_t bounds;

      gsk_render_node_get_bounds (node, &bounds);
      g_assert_true (graphene_rect_contains_rect (&bounds, &box));
      g_assert_cmpfloat (bounds.origin.x, ==, floor (bounds.origin.x));
      g_assert_cmpfloat (bounds.size.width, ==, floor (bounds.size.width));
      assert_same_pixels (&recorded, 1, node, 130, 70, scale);
      gsk_render_node_unref (node);
    }

  /* An image's pages are kept for the next image when it goes (at scale 2
   * this one is large enough to have pages of its own): the next image,
   * of a drawing that paints nothing, must come out clear. */
  {
    GskRenderNode *first = sw_raster_node (gsk_render_node_ref (recorded), &box, 2);
    GskRenderNode *blank;
    cairo_surface_t *via = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, 260, 140);
    const guint8 *b;
    int inked = 0;

    gsk_render_node_unref (first);
    blank = sw_raster_node (gsk_cairo_node_new (&box), &box, 2);
    cairo_surface_set_device_scale (via, 2, 2);
    cr = cairo_create (via);
    gsk_render_node_draw (blank, cr);
    cairo_destroy (cr);
    cairo_surface_flush (via);
    b = cairo_image_surface_get_data (via);
    for (int i = 0; i < cairo_image_surface_get_stride (via) * 140; i++)
      inked += b[i] != 0;
    g_assert_cmpint (inked, ==, 0);
    gsk_render_node_unref (blank);
    cairo_surface_destroy (via);
  }
  gsk_render_node_unref (recorded);
}

/* Nodes copied into one (sw_raster_compose, the stack view's body) paint
 * what they paint apart, to within one level per channel, at scale 1 and 2:
 * two rasterised nodes (copied as pixels) and one recorded node (drawn),
 * on whole-pixel boxes inside a larger one. */
static void
test_raster_compose (void)
{
  const graphene_rect_t box_a = GRAPHENE_RECT_INIT (4, 6, 50, 30);
  const graphene_rect_t box_b = GRAPHENE_RECT_INIT (60, 20, 70, 40);
  const graphene_rect_t box_c = GRAPHENE_RECT_INIT (10, 45, 40, 20);
  const graphene_rect_t all = GRAPHENE_RECT_INIT (0, 2, 140, 70);
  GskRenderNode *a = gsk_cairo_node_new (&box_a);
  GskRenderNode *b = gsk_cairo_node_new (&box_b);
  GskRenderNode *c = gsk_cairo_node_new (&box_c);
  cairo_t *cr;

  cr = gsk_cairo_node_get_draw_context (a);
  cairo_set_source_rgba (cr, 0.2, 0.5, 0.7, 0.8);
  cairo_arc (cr, 28.0, 21.0, 12.5, 0.0, 2.0 * G_PI);
  cairo_fill (cr);
  cairo_destroy (cr);
  cr = gsk_cairo_node_get_draw_context (b);
  cairo_set_source_rgb (cr, 0.1, 0.1, 0.1);
  show_text (cr, 62.0, 22.0, "2 \u00b7 upper\n29.9 t");
  cairo_destroy (cr);
  cr = gsk_cairo_node_get_draw_context (c);
  cairo_set_source_rgb (cr, 0.8, 0.6, 0.2);
  cairo_rectangle (cr, 12.3, 47.6, 30.0, 14.2);
  cairo_fill (cr);
  cairo_destroy (cr);

  for (int scale = 1; scale <= 2; scale++)
    {
      GskRenderNode *expected[3] = { a, b, c };
      GskRenderNode *parts[3];
      GskRenderNode *node;
      graphene_rect_t bounds;

      parts[0] = sw_raster_node (gsk_render_node_ref (a), NULL, scale);
      parts[1] = sw_raster_node (gsk_render_node_ref (b), NULL, scale);
      parts[2] = gsk_render_node_ref (c);
      node = sw_raster_compose (parts, 3, &all, scale);
      gsk_render_node_get_bounds (node, &bounds);
      g_assert_true (graphene_rect_equal (&bounds, &all));
      assert_same_pixels (expected, 3, node, 140, 80, scale);
      for (guint i = 0; i < G_N_ELEMENTS (parts); i++)
        gsk_render_node_unref (parts[i]);
      gsk_render_node_unref (node);
    }
  gsk_render_node_unref (a);
  gsk_render_node_unref (b);
  gsk_render_node_unref (c);
}

int
main (int argc, char **argv)
{
  gtk_test_init (&argc, &argv, NULL);

  g_test_add_func ("/gui/plot/linear-mapping", test_linear_mapping);
  g_test_add_func ("/gui/plot/drawing-kept", test_drawing_kept);
  g_test_add_func ("/gui/plot/drawn-ahead", test_drawn_ahead);
  g_test_add_func ("/gui/raster/same-pixels", test_raster_same_pixels);
  g_test_add_func ("/gui/raster/compose", test_raster_compose);
  g_test_add_func ("/gui/plot/flat-series", test_flat_series);
  g_test_add_func ("/gui/plot/log-decades", test_log_decades);
  g_test_add_func ("/gui/plot/points-drawn", test_points_drawn);
  g_test_add_func ("/gui/plot/line-breaks", test_line_breaks);
  g_test_add_func ("/gui/plot/current-design-marker", test_current_design_marker);
  g_test_add_func ("/gui/plot/palette", test_palette);
  g_test_add_func ("/gui/plot/clear-and-formats", test_clear_and_formats);
  g_test_add_func ("/gui/plot/no-data", test_no_data);
  return g_test_run ();
}
