/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-plot"

#include "config.h"

#include "sw-plot-private.h"
#include "sw-raster.h"
#include "sw-text-fit.h"

#include <glib/gi18n.h>
#include <math.h>
#include <string.h>

/* Line dashes and marker shapes per palette index, so series differ without colour. */
static const double dash_1[] = { 9.0, 4.0 };
static const double dash_2[] = { 2.0, 3.5 };
static const double dash_3[] = { 9.0, 3.5, 2.0, 3.5 };
static const double dash_4[] = { 16.0, 5.0 };
static const double dash_5[] = { 5.0, 5.0 };
static const double dash_6[] = { 12.0, 3.0, 2.0, 3.0, 2.0, 3.0 };
static const struct { const double *dash; int n; } dashes[N_PALETTE] = {
  { NULL, 0 }, { dash_1, 2 }, { dash_2, 2 }, { dash_3, 4 },
  { dash_4, 2 }, { dash_5, 2 }, { dash_6, 6 }, { NULL, 0 },
};

typedef enum { SHAPE_CIRCLE, SHAPE_SQUARE, SHAPE_TRIANGLE, SHAPE_DIAMOND, SHAPE_TRIANGLE_DOWN } Shape;

void
sw_plot_set_source (cairo_t *cr, const GdkRGBA *c, double alpha)
{
  cairo_set_source_rgba (cr, c->red, c->green, c->blue, c->alpha * alpha);
}


/* ---- Layers ---------------------------------------------------------------
 * The drawing is made of three layers: the frame (title, legend, grid, axes,
 * ticks and their labels), the data (bands, bars, series) and the notes on
 * top (limit lines, markers and their labels).  Each layer is recorded with
 * a hash of every operation it draws (the path in cairo's own fixed-point
 * units of 1/256 px, the paint, the text and where it goes); a layer that
 * comes out the same as last time keeps its old render node, so the
 * renderer, which compares nodes, repaints nothing there.  A changed data or
 * notes layer is clipped to the box its ink covers, so the repaint is
 * limited to that box: a marker that moves repaints around the marker, not
 * the whole plot. */

typedef struct {
  guint64         hash;
  gboolean        want_ink;  /* whether to track the ink's box */
  gboolean        have_ink;
  graphene_rect_t ink;       /* in the layer's coordinates */
} LayerState;

static cairo_user_data_key_t layer_state_key;

static LayerState *
layer_state (cairo_t *cr)
{
  return cairo_get_user_data (cr, &layer_state_key);
}

static gint64
fixed_coord (double v)
{
  /* cairo's conversion to 24.8 fixed point rounds to nearest-even, as
   * nearbyint does in the default rounding mode. */
  return isfinite (v) ? (gint64) nearbyint (CLAMP (v, -1e9, 1e9) * 256.0) : G_MININT64;
}

static void
layer_hash_double (LayerState *st, double v)
{
  st->hash = sw_plot_key_bytes (st->hash, &v, sizeof v);
}

static void
layer_add_ink (LayerState *st, cairo_t *cr, double x0, double y0, double x1, double y1)
{
  double xs[4] = { x0, x1, x1, x0 }, ys[4] = { y0, y0, y1, y1 };
  double lo_x = INFINITY, lo_y = INFINITY, hi_x = -INFINITY, hi_y = -INFINITY;
  graphene_rect_t r;

  if (!(x1 > x0) || !(y1 > y0))
    return;
  for (int i = 0; i < 4; i++)
    {
      cairo_user_to_device (cr, &xs[i], &ys[i]);
      lo_x = MIN (lo_x, xs[i]);
      lo_y = MIN (lo_y, ys[i]);
      hi_x = MAX (hi_x, xs[i]);
      hi_y = MAX (hi_y, ys[i]);
    }
  r = GRAPHENE_RECT_INIT (lo_x, lo_y, hi_x - lo_x, hi_y - lo_y);
  if (st->have_ink)
    graphene_rect_union (&st->ink, &r, &st->ink);
  else
    st->ink = r;
  st->have_ink = TRUE;
}

/* The paint of the next operation: source colour, operator, line style. */
static void
layer_hash_paint (LayerState *st, cairo_t *cr, int op)
{
  double r, g, b, a, dash[16], offset;
  int n_dash = cairo_get_dash_count (cr);
  cairo_matrix_t m;

  st->hash = sw_plot_key_int (st->hash, op);
  if (cairo_pattern_get_rgba (cairo_get_source (cr), &r, &g, &b, &a) == CAIRO_STATUS_SUCCESS)
    {
      layer_hash_double (st, r);
      layer_hash_double (st, g);
      layer_hash_double (st, b);
      layer_hash_double (st, a);
    }
  else
    st->hash = sw_plot_key_int (st->hash, -1);
  st->hash = sw_plot_key_int (st->hash, cairo_get_operator (cr));
  layer_hash_double (st, cairo_get_line_width (cr));
  st->hash = sw_plot_key_int (st->hash, cairo_get_line_join (cr));
  st->hash = sw_plot_key_int (st->hash, cairo_get_line_cap (cr));
  st->hash = sw_plot_key_int (st->hash, cairo_get_fill_rule (cr));
  st->hash = sw_plot_key_int (st->hash, cairo_get_antialias (cr));
  st->hash = sw_plot_key_int (st->hash, n_dash);
  if (n_dash > 0 && n_dash <= (int) G_N_ELEMENTS (dash))
    {
      cairo_get_dash (cr, dash, &offset);
      st->hash = sw_plot_key_bytes (st->hash, dash, sizeof (double) * n_dash);
      layer_hash_double (st, offset);
    }
  cairo_get_matrix (cr, &m);
  st->hash = sw_plot_key_bytes (st->hash, &m, sizeof m);
}

static void
layer_hash_path (LayerState *st, cairo_t *cr)
{
  cairo_path_t *path = cairo_copy_path (cr);

  for (int i = 0; i < path->num_data; i += path->data[i].header.length)
    {
      st->hash = sw_plot_key_int (st->hash, path->data[i].header.type);
      for (int j = 1; j < path->data[i].header.length; j++)
        {
          st->hash = sw_plot_key_int (st->hash, fixed_coord (path->data[i + j].point.x));
          st->hash = sw_plot_key_int (st->hash, fixed_coord (path->data[i + j].point.y));
        }
    }
  cairo_path_destroy (path);
}

static void
layer_stroke_op (cairo_t *cr, gboolean preserve)
{
  LayerState *st = layer_state (cr);

  if (st != NULL)
    {
      layer_hash_paint (st, cr, 1);
      layer_hash_path (st, cr);
      if (st->want_ink)
        {
          /* The path's box and a line width all round: more than joins
           * and caps of these marks reach (cheaper than the exact
           * cairo_stroke_extents). */
          double x0, y0, x1, y1, lw = cairo_get_line_width (cr) + 1.0;
          cairo_path_extents (cr, &x0, &y0, &x1, &y1);
          layer_add_ink (st, cr, x0 - lw, y0 - lw, x1 + lw, y1 + lw);
        }
    }
  if (preserve)
    cairo_stroke_preserve (cr);
  else
    cairo_stroke (cr);
}

static void
layer_fill_op (cairo_t *cr, gboolean preserve)
{
  LayerState *st = layer_state (cr);

  if (st != NULL)
    {
      layer_hash_paint (st, cr, 2);
      layer_hash_path (st, cr);
      if (st->want_ink)
        {
          double x0, y0, x1, y1;
          cairo_path_extents (cr, &x0, &y0, &x1, &y1);
          layer_add_ink (st, cr, x0 - 1.0, y0 - 1.0, x1 + 1.0, y1 + 1.0);
        }
    }
  if (preserve)
    cairo_fill_preserve (cr);
  else
    cairo_fill (cr);
}

#define layer_stroke(cr) layer_stroke_op ((cr), FALSE)
#define layer_fill(cr) layer_fill_op ((cr), FALSE)
#define layer_fill_preserve(cr) layer_fill_op ((cr), TRUE)

/* pango_cairo_show_layout at the current point, hashed: the text, its
 * attributes and wrapping, where it goes and in which colour. */
static void
layer_show_layout (cairo_t *cr, PangoLayout *layout)
{
  LayerState *st = layer_state (cr);

  if (st != NULL)
    {
      PangoAttrList *attrs = pango_layout_get_attributes (layout);
      g_autofree char *attr_text = attrs != NULL ? pango_attr_list_to_string (attrs) : NULL;
      double x = 0.0, y = 0.0;

      layer_hash_paint (st, cr, 3);
      if (cairo_has_current_point (cr))
        cairo_get_current_point (cr, &x, &y);
      st->hash = sw_plot_key_int (st->hash, fixed_coord (x));
      st->hash = sw_plot_key_int (st->hash, fixed_coord (y));
      st->hash = sw_plot_key_str (st->hash, pango_layout_get_text (layout));
      st->hash = sw_plot_key_str (st->hash, attr_text);
      st->hash = sw_plot_key_int (st->hash, pango_layout_get_width (layout));
      st->hash = sw_plot_key_int (st->hash, pango_layout_get_height (layout));
      st->hash = sw_plot_key_int (st->hash, pango_layout_get_wrap (layout));
      st->hash = sw_plot_key_int (st->hash, pango_layout_get_ellipsize (layout));
      st->hash = sw_plot_key_int (st->hash, pango_layout_get_alignment (layout));
      if (st->want_ink)
        {
          PangoRectangle ink, logical;
          pango_layout_get_pixel_extents (layout, &ink, &logical);
          layer_add_ink (st, cr, x + MIN (ink.x, logical.x), y + MIN (ink.y, logical.y),
                         x + MAX (ink.x + ink.width, logical.x + logical.width),
                         y + MAX (ink.y + ink.height, logical.y + logical.height));
        }
    }
  pango_cairo_show_layout (cr, layout);
}

typedef void (*LayerDrawFunc) (SwPlot *self, cairo_t *cr, const Colors *c, int width, int height);

/* Records layer @which with @draw; keeps the old node if the new one hashes
 * the same.  With @clip_to_ink the node is clipped to the box its ink
 * covers (rounded out, one pixel more for antialiasing), which the
 * renderer then repaints alone when the layer changes. */
static void
update_layer (SwPlot *self, guint which, LayerDrawFunc draw, const Colors *c, int width,
              int height, gboolean clip_to_ink)
{
  graphene_rect_t all = GRAPHENE_RECT_INIT (0, 0, width, height);
  LayerState st = { G_GUINT64_CONSTANT (14695981039346656037), clip_to_ink, FALSE,
                    { { 0, 0 }, { 0, 0 } } };
  GskRenderNode *node = gsk_cairo_node_new (&all);
  cairo_t *cr = gsk_cairo_node_get_draw_context (node);

  st.hash = sw_plot_key_int (st.hash, width);
  st.hash = sw_plot_key_int (st.hash, height);
  st.hash = sw_plot_key_int (st.hash, gtk_widget_get_scale_factor (GTK_WIDGET (self)));
  cairo_set_user_data (cr, &layer_state_key, &st, NULL);
  /* Shapes with cairo's 4 x 4 supersampling rather than its finest: on
   * screen the edges of 2 px curves and markers look the same, and the
   * dashed curves of a plot rasterise in a third of the time (0.5 against
   * 1.6 ms for the five of the delta-v plot).  Text keeps its own
   * antialiasing (the font options). */
  cairo_set_antialias (cr, CAIRO_ANTIALIAS_FAST);
  draw (self, cr, c, width, height);
  cairo_set_user_data (cr, &layer_state_key, NULL, NULL);
  cairo_destroy (cr);

  if (self->layers[which] != NULL && self->layer_keys[which] == st.hash)
    {
      gsk_render_node_unref (node);
      return;
    }
  g_clear_pointer (&self->layers[which], gsk_render_node_unref);
  self->layer_keys[which] = st.hash;
  if (clip_to_ink && !st.have_ink)
    {
      /* Nothing drawn. */
      gsk_render_node_unref (node);
      return;
    }
  if (clip_to_ink)
    {
      graphene_rect_t box;
      double x0 = floor (st.ink.origin.x) - 1.0, y0 = floor (st.ink.origin.y) - 1.0;
      double x1 = ceil (st.ink.origin.x + st.ink.size.width) + 1.0;
      double y1 = ceil (st.ink.origin.y + st.ink.size.height) + 1.0;

      box = GRAPHENE_RECT_INIT (x0, y0, x1 - x0, y1 - y0);
      if (!graphene_rect_intersection (&box, &all, &box))
        {
          gsk_render_node_unref (node);
          return;
        }
      self->layers[which] = sw_raster_node (node, &box, gtk_widget_get_scale_factor (GTK_WIDGET (self)));
    }
  else
    self->layers[which] = sw_raster_node (node, &all, gtk_widget_get_scale_factor (GTK_WIDGET (self)));
}

void
sw_plot_clear_layers (SwPlot *self)
{
  for (guint i = 0; i < G_N_ELEMENTS (self->layers); i++)
    g_clear_pointer (&self->layers[i], gsk_render_node_unref);
}

/* Drawing helpers */

static void
draw_shape (cairo_t *cr, Shape shape, double x, double y, double r)
{
  switch (shape)
    {
    case SHAPE_SQUARE:
      cairo_rectangle (cr, x - r * 0.85, y - r * 0.85, 1.7 * r, 1.7 * r);
      break;
    case SHAPE_TRIANGLE:
      cairo_move_to (cr, x, y - r * 1.1);
      cairo_line_to (cr, x + r, y + r * 0.8);
      cairo_line_to (cr, x - r, y + r * 0.8);
      cairo_close_path (cr);
      break;
    case SHAPE_TRIANGLE_DOWN:
      cairo_move_to (cr, x, y + r * 1.1);
      cairo_line_to (cr, x + r, y - r * 0.8);
      cairo_line_to (cr, x - r, y - r * 0.8);
      cairo_close_path (cr);
      break;
    case SHAPE_DIAMOND:
      cairo_move_to (cr, x, y - r * 1.2);
      cairo_line_to (cr, x + r * 1.2, y);
      cairo_line_to (cr, x, y + r * 1.2);
      cairo_line_to (cr, x - r * 1.2, y);
      cairo_close_path (cr);
      break;
    case SHAPE_CIRCLE:
    default:
      cairo_new_sub_path (cr);
      cairo_arc (cr, x, y, r, 0, 2 * G_PI);
      break;
    }
}

static Shape
shape_for (int color)
{
  return (Shape) (((color % 5) + 5) % 5);
}

static void
set_dash_for (cairo_t *cr, int color, double scale)
{
  int i = ((color % N_PALETTE) + N_PALETTE) % N_PALETTE;
  double d[6];

  for (int k = 0; k < dashes[i].n; k++)
    d[k] = dashes[i].dash[k] * scale;
  cairo_set_dash (cr, d, dashes[i].n, 0.0);
}

/* Liang-Barsky: clips the segment to @r; FALSE when nothing is left. */
static gboolean
clip_segment (const graphene_rect_t *r, double *x0, double *y0, double *x1, double *y1)
{
  double dx = *x1 - *x0, dy = *y1 - *y0;
  double p[4] = { -dx, dx, -dy, dy };
  double q[4] = { *x0 - r->origin.x, r->origin.x + r->size.width - *x0,
                  *y0 - r->origin.y, r->origin.y + r->size.height - *y0 };
  double u0 = 0.0, u1 = 1.0;

  for (int i = 0; i < 4; i++)
    {
      if (p[i] == 0.0)
        {
          if (q[i] < 0.0)
            return FALSE;
          continue;
        }
      double t = q[i] / p[i];
      if (p[i] < 0.0)
        u0 = MAX (u0, t);
      else
        u1 = MIN (u1, t);
      if (u0 > u1)
        return FALSE;
    }
  *x1 = *x0 + u1 * dx;
  *y1 = *y0 + u1 * dy;
  *x0 = *x0 + u0 * dx;
  *y0 = *y0 + u0 * dy;
  return TRUE;
}

gboolean
sw_plot_map_point (SwPlot *self, double x, double y, double *px, double *py)
{
  if (!sw_plot_axis_valid (&self->x, x) || !sw_plot_axis_valid (&self->y, y))
    return FALSE;
  *px = sw_plot_axis_map (&self->x, x);
  *py = sw_plot_axis_map (&self->y, y);
  return isfinite (*px) && isfinite (*py);
}

/* A polyline's points closer than this to the straight line through their
 * neighbours are left out: a fraction of a pixel, invisible, but a curve of
 * hundreds of points then strokes as a few dozen segments. */
#define SIMPLIFY_TOLERANCE_PX 0.05

typedef struct {
  GArray *pts;    /* graphene_point_t of the current sub-path */
} SubPath;

/* Ramer-Douglas-Peucker: marks in @keep the points of @p[a..b] to keep. */
static void
simplify (const graphene_point_t *p, guint a, guint b, double tol, gboolean *keep)
{
  double dx, dy, len, worst = -1.0;
  guint at = a;

  if (b <= a + 1)
    return;
  dx = p[b].x - p[a].x;
  dy = p[b].y - p[a].y;
  len = hypot (dx, dy);
  for (guint i = a + 1; i < b; i++)
    {
      double d = len > 0.0 ? fabs (dy * (p[i].x - p[a].x) - dx * (p[i].y - p[a].y)) / len
                           : hypot (p[i].x - p[a].x, p[i].y - p[a].y);
      if (d > worst)
        {
          worst = d;
          at = i;
        }
    }
  if (worst <= tol)
    return;
  keep[at] = TRUE;
  simplify (p, a, at, tol, keep);
  simplify (p, at, b, tol, keep);
}

static void
subpath_flush (cairo_t *cr, SubPath *sp)
{
  graphene_point_t *p = (graphene_point_t *) (void *) sp->pts->data;
  guint n = sp->pts->len;
  g_autofree gboolean *keep = NULL;

  if (n == 0)
    return;
  keep = g_new0 (gboolean, n);
  keep[0] = keep[n - 1] = TRUE;
  simplify (p, 0, n - 1, SIMPLIFY_TOLERANCE_PX, keep);
  cairo_move_to (cr, p[0].x, p[0].y);
  for (guint i = 1; i < n; i++)
    if (keep[i])
      cairo_line_to (cr, p[i].x, p[i].y);
  g_array_set_size (sp->pts, 0);
}

static void
subpath_move_to (cairo_t *cr, SubPath *sp, double x, double y)
{
  graphene_point_t q = GRAPHENE_POINT_INIT (x, y);

  subpath_flush (cr, sp);
  g_array_append_val (sp->pts, q);
}

static void
subpath_line_to (SubPath *sp, double x, double y)
{
  graphene_point_t q = GRAPHENE_POINT_INIT (x, y);

  g_array_append_val (sp->pts, q);
}

static void
draw_polyline (SwPlot *self, cairo_t *cr, const double *x, const double *y, guint n)
{
  graphene_rect_t clip = self->area;
  gboolean have_prev = FALSE, pen_at_prev = FALSE;
  double px = 0, py = 0;
  SubPath sp = { g_array_sized_new (FALSE, FALSE, sizeof (graphene_point_t), n) };

  graphene_rect_inset (&clip, -3.0, -3.0);
  for (guint k = 0; k < n; k++)
    {
      double qx, qy;
      if (!sw_plot_map_point (self, x[k], y[k], &qx, &qy))
        {
          have_prev = pen_at_prev = FALSE;   /* a break in the line */
          continue;
        }
      if (have_prev)
        {
          double ax = px, ay = py, bx = qx, by = qy;
          if (clip_segment (&clip, &ax, &ay, &bx, &by))
            {
              if (!pen_at_prev || ax != px || ay != py)
                subpath_move_to (cr, &sp, ax, ay);
              subpath_line_to (&sp, bx, by);
              pen_at_prev = bx == qx && by == qy;
            }
          else
            pen_at_prev = FALSE;
        }
      px = qx;
      py = qy;
      have_prev = TRUE;
    }
  subpath_flush (cr, &sp);
  g_array_unref (sp.pts);
}

void
sw_plot_get_colors (SwPlot *self, Colors *c)
{
  if (!self->colors_valid)
    {
      sw_plot_style_fg (GTK_WIDGET (self), &self->colors.fg);
      sw_plot_style_bg (GTK_WIDGET (self), &self->colors.bg);
      for (int i = 0; i < N_PALETTE; i++)
        sw_plot_palette_color (GTK_WIDGET (self), i, &self->colors.palette[i]);
      self->colors_valid = TRUE;
    }
  *c = self->colors;
}

const GdkRGBA *
sw_plot_palette_entry (const Colors *c, int index)
{
  return &c->palette[((index % N_PALETTE) + N_PALETTE) % N_PALETTE];
}

static void
draw_legend_sample (cairo_t *cr, const Colors *c, const LegendEntry *e, double x, double y,
                    double h)
{
  const GdkRGBA *col = sw_plot_palette_entry (c, e->color);
  double cy = y + h / 2.0;

  if (e->band || e->style == SW_PLOT_BARS || e->style == SW_PLOT_HBARS)
    {
      sw_plot_set_source (cr, col, e->band ? 0.25 : 0.75);
      cairo_rectangle (cr, x + 4.0, y + 3.0, LEGEND_SAMPLE - 8.0, h - 6.0);
      layer_fill (cr);
      return;
    }
  sw_plot_set_source (cr, col, 1.0);
  if (e->style != SW_PLOT_POINTS)
    {
      cairo_save (cr);
      cairo_set_line_width (cr, 2.5);
      set_dash_for (cr, e->color, 1.0);
      cairo_move_to (cr, x, cy);
      cairo_line_to (cr, x + LEGEND_SAMPLE, cy);
      layer_stroke (cr);
      cairo_restore (cr);
    }
  if (e->style != SW_PLOT_LINE)
    {
      draw_shape (cr, shape_for (e->color), x + LEGEND_SAMPLE / 2.0, cy, 4.0);
      layer_fill (cr);
    }
}

double
sw_plot_draw_legend (SwPlot *self, cairo_t *cr, double left, double top, double width)
{
  g_autoptr (GArray) entries = sw_plot_legend_entries (self);
  double th = sw_plot_text_height (self);
  double x = left, y = top;
  Colors c;

  if (entries->len == 0)
    return 0.0;
  if (cr != NULL)
    sw_plot_get_colors (self, &c);
  for (guint i = 0; i < entries->len; i++)
    {
      LegendEntry *e = &g_array_index (entries, LegendEntry, i);
      PangoLayout *layout = sw_plot_make_text (self, e->name);
      int w;
      double item_w;

      pango_layout_get_pixel_size (layout, &w, NULL);
      item_w = LEGEND_SAMPLE + 6.0 + w;
      if (x > left && x + item_w > left + width)
        {
          x = left;
          y += th + 4.0;
        }
      if (cr != NULL)
        {
          draw_legend_sample (cr, &c, e, x, y, th);
          sw_plot_set_source (cr, &c.fg, 1.0);
          cairo_move_to (cr, x + LEGEND_SAMPLE + 6.0, y);
          layer_show_layout (cr, layout);
        }
      g_object_unref (layout);
      x += item_w + 18.0;
    }
  return y - top + th + 6.0;
}

static gboolean
placer_free (Placer *pl, const graphene_rect_t *r)
{
  for (guint i = 0; i < pl->rects->len; i++)
    if (graphene_rect_intersection (&g_array_index (pl->rects, graphene_rect_t, i), r, NULL))
      return FALSE;
  return TRUE;
}

void
sw_plot_draw_boxed_text (cairo_t *cr, PangoLayout *layout, double x, double y, const Colors *c,
                 const GdkRGBA *text, const GdkRGBA *frame)
{
  int w, h;

  pango_layout_get_pixel_size (layout, &w, &h);
  sw_plot_set_source (cr, &c->bg, 0.88);
  cairo_rectangle (cr, x - 3.0, y - 1.0, w + 6.0, h + 2.0);
  layer_fill (cr);
  if (frame != NULL)
    {
      sw_plot_set_source (cr, frame, 1.0);
      cairo_set_line_width (cr, 1.0);
      cairo_rectangle (cr, x - 3.5, y - 1.5, w + 7.0, h + 3.0);
      layer_stroke (cr);
    }
  sw_plot_set_source (cr, text, 1.0);
  cairo_move_to (cr, x, y);
  layer_show_layout (cr, layout);
}

/* Places a label near (px, py), trying the four quadrants, inside the area. */
void
sw_plot_place_label (SwPlot *self, Placer *pl, PangoLayout *layout, double px, double py, double off,
             double *lx, double *ly)
{
  int w, h;
  const graphene_rect_t *a = &self->area;
  double cand[6][2];

  pango_layout_get_pixel_size (layout, &w, &h);
  cand[0][0] = px + off;      cand[0][1] = py - off - h;
  cand[1][0] = px + off;      cand[1][1] = py + off;
  cand[2][0] = px - off - w;  cand[2][1] = py - off - h;
  cand[3][0] = px - off - w;  cand[3][1] = py + off;
  cand[4][0] = px - w / 2.0;  cand[4][1] = py - off - 2 * h;
  cand[5][0] = px - w / 2.0;  cand[5][1] = py + off + h;
  for (int i = 0; i < 6; i++)
    {
      double x = CLAMP (cand[i][0], a->origin.x + 4.0, a->origin.x + a->size.width - w - 4.0);
      double y = CLAMP (cand[i][1], a->origin.y + 2.0, a->origin.y + a->size.height - h - 2.0);
      graphene_rect_t r = GRAPHENE_RECT_INIT (x - 3.0, y - 1.0, w + 6.0, h + 2.0);
      if (placer_free (pl, &r) || i == 5)
        {
          *lx = x;
          *ly = y;
          g_array_append_val (pl->rects, r);
          return;
        }
    }
}

/* Centred under (px, py), staggered downwards where labels would collide:
 * for marks in a row along the top edge. */
static void
place_label_below (SwPlot *self, Placer *pl, PangoLayout *layout, double px, double py,
                   double off, double *lx, double *ly)
{
  int w, h;
  const graphene_rect_t *a = &self->area;
  double x;

  pango_layout_get_pixel_size (layout, &w, &h);
  x = CLAMP (px - w / 2.0, a->origin.x + 4.0, a->origin.x + a->size.width - w - 4.0);
  for (int row = 0; row < 4; row++)
    {
      double y = py + off + row * (h + 2.0);
      graphene_rect_t r = GRAPHENE_RECT_INIT (x - 3.0, y - 1.0, w + 6.0, h + 2.0);
      if (placer_free (pl, &r) || row == 3)
        {
          *lx = x;
          *ly = y;
          g_array_append_val (pl->rects, r);
          return;
        }
    }
}

static void
draw_axes (SwPlot *self, cairo_t *cr, const Colors *c)
{
  const graphene_rect_t *a = &self->area;
  double th = sw_plot_text_height (self);
  gboolean cat = sw_plot_categorical_y (self);

  /* Grid and frame: axis-aligned lines of one pixel on pixel centres, drawn
   * without antialiasing (the same pixels, cheaper to rasterise). */
  cairo_save (cr);
  cairo_set_antialias (cr, CAIRO_ANTIALIAS_NONE);
  cairo_set_line_width (cr, 1.0);
  for (guint i = 0; i < self->x.ticks->len; i++)
    {
      SwPlotTick *t = &g_array_index (self->x.ticks, SwPlotTick, i);
      double px = round (sw_plot_axis_map (&self->x, t->value)) + 0.5;
      if (!t->major && !self->x.log)
        continue;   /* minor grid lines only on log axes */
      sw_plot_set_source (cr, &c->fg, t->major ? 0.13 : 0.06);
      cairo_move_to (cr, px, a->origin.y);
      cairo_line_to (cr, px, a->origin.y + a->size.height);
      layer_stroke (cr);
    }
  for (guint i = 0; i < self->y.ticks->len; i++)
    {
      SwPlotTick *t = &g_array_index (self->y.ticks, SwPlotTick, i);
      double py = round (sw_plot_axis_map (&self->y, t->value)) + 0.5;
      if (!t->major && !self->y.log)
        continue;   /* minor grid lines only on log axes */
      sw_plot_set_source (cr, &c->fg, t->major ? 0.13 : 0.06);
      cairo_move_to (cr, a->origin.x, py);
      cairo_line_to (cr, a->origin.x + a->size.width, py);
      layer_stroke (cr);
    }

  /* Frame: the two axes stronger */
  sw_plot_set_source (cr, &c->fg, 0.25);
  cairo_rectangle (cr, round (a->origin.x) + 0.5, round (a->origin.y) + 0.5,
                   round (a->size.width), round (a->size.height));
  layer_stroke (cr);
  sw_plot_set_source (cr, &c->fg, 0.8);
  cairo_move_to (cr, round (a->origin.x) + 0.5, round (a->origin.y) + 0.5);
  cairo_line_to (cr, round (a->origin.x) + 0.5, round (a->origin.y + a->size.height) + 0.5);
  cairo_line_to (cr, round (a->origin.x + a->size.width) + 0.5,
                 round (a->origin.y + a->size.height) + 0.5);
  layer_stroke (cr);
  cairo_restore (cr);
  cairo_set_line_width (cr, 1.0);

  /* Ticks and labels */
  for (guint i = 0; i < self->x.ticks->len; i++)
    {
      SwPlotTick *t = &g_array_index (self->x.ticks, SwPlotTick, i);
      double px = round (sw_plot_axis_map (&self->x, t->value)) + 0.5;
      double y0 = round (a->origin.y + a->size.height) + 0.5;
      sw_plot_set_source (cr, &c->fg, 0.8);
      cairo_move_to (cr, px, y0);
      cairo_line_to (cr, px, y0 + (t->labelled ? TICK_LEN : TICK_LEN / 2.0));
      layer_stroke (cr);
      if (t->labelled)
        {
          PangoLayout *layout = sw_plot_make_text (self, t->text);
          int w;
          pango_layout_get_pixel_size (layout, &w, NULL);
          sw_plot_set_source (cr, &c->fg, 1.0);
          cairo_move_to (cr, CLAMP (px - w / 2.0, 0.0, self->layout_width - w),
                         y0 + TICK_LEN + 2.0);
          layer_show_layout (cr, layout);
          g_object_unref (layout);
        }
    }
  for (guint i = 0; i < self->y.ticks->len; i++)
    {
      SwPlotTick *t = &g_array_index (self->y.ticks, SwPlotTick, i);
      double py = round (sw_plot_axis_map (&self->y, t->value)) + 0.5;
      double x0 = round (a->origin.x) + 0.5;
      sw_plot_set_source (cr, &c->fg, 0.8);
      cairo_move_to (cr, x0, py);
      cairo_line_to (cr, x0 - (t->labelled ? TICK_LEN : TICK_LEN / 2.0), py);
      layer_stroke (cr);
      if (t->labelled)
        {
          PangoLayout *layout = sw_plot_make_text (self, t->text);
          int w, h;
          pango_layout_get_pixel_size (layout, &w, &h);
          sw_plot_set_source (cr, &c->fg, 1.0);
          cairo_move_to (cr, x0 - TICK_LEN - 4.0 - w, py - h / 2.0);
          layer_show_layout (cr, layout);
          g_object_unref (layout);
        }
    }
  if (cat && self->categories != NULL)
    {
      double cw = sw_plot_category_width (self);
      double row = fabs (sw_plot_axis_map (&self->y, 1.0) - sw_plot_axis_map (&self->y, 0.0));
      /* A long label ("Structural coeff., stage 2 (Upper stage)") wraps
       * between words onto as many lines as its row holds, right-aligned
       * against the axis; what still does not fit loses whole words. */
      int lines = CLAMP ((int) floor (row / MAX (th, 1.0)), 1, 3);
      for (guint i = 0; self->categories[i] != NULL; i++)
        {
          PangoLayout *layout = sw_plot_make_text_fresh (self, self->categories[i]);
          double py = sw_plot_axis_map (&self->y, i);
          int w, h;
          /* Whole words only: a label that does not fit loses words from
           * its end, never half a word or a number. */
          sw_text_fit_words (layout, self->categories[i], (int) (cw * PANGO_SCALE), lines);
          pango_layout_set_alignment (layout, PANGO_ALIGN_RIGHT);
          pango_layout_get_pixel_size (layout, &w, &h);
          sw_plot_set_source (cr, &c->fg, 1.0);
          cairo_move_to (cr, a->origin.x - TICK_LEN - 4.0 - cw, py - h / 2.0);
          layer_show_layout (cr, layout);
          g_object_unref (layout);
        }
    }

  /* Axis titles */
  sw_plot_set_source (cr, &c->fg, 1.0);
  if (self->x.label != NULL)
    {
      PangoLayout *layout = sw_plot_make_text (self, self->x.label);
      int w;
      pango_layout_get_pixel_size (layout, &w, NULL);
      cairo_move_to (cr, a->origin.x + (a->size.width - w) / 2.0,
                     self->layout_height - MARGIN - th);
      layer_show_layout (cr, layout);
      g_object_unref (layout);
    }
  if (self->y.label != NULL)
    {
      PangoLayout *layout = sw_plot_make_text (self, self->y.label);
      int w;
      pango_layout_get_pixel_size (layout, &w, NULL);
      cairo_save (cr);
      cairo_move_to (cr, MARGIN, a->origin.y + (a->size.height + w) / 2.0);
      cairo_rotate (cr, -G_PI / 2.0);
      layer_show_layout (cr, layout);
      cairo_restore (cr);
      g_object_unref (layout);
    }
}

static void
draw_bands (SwPlot *self, cairo_t *cr, const Colors *c)
{
  for (guint i = 0; i < self->bands->len; i++)
    {
      Band *b = g_ptr_array_index (self->bands, i);
      guint k = 0;

      sw_plot_set_source (cr, sw_plot_palette_entry (c, b->color), 0.22);
      while (k < b->n)
        {
          guint start, end;
          double px, py;
          /* One polygon per run of drawable points. */
          while (k < b->n && !(sw_plot_map_point (self, b->x[k], b->lo[k], &px, &py)
                               && sw_plot_map_point (self, b->x[k], b->hi[k], &px, &py)))
            k++;
          start = k;
          while (k < b->n && sw_plot_map_point (self, b->x[k], b->lo[k], &px, &py)
                 && sw_plot_map_point (self, b->x[k], b->hi[k], &px, &py))
            k++;
          end = k;
          if (end - start < 2)
            continue;
          for (guint j = start; j < end; j++)
            {
              sw_plot_map_point (self, b->x[j], b->hi[j], &px, &py);
              cairo_line_to (cr, px, CLAMP (py, -1e5, 1e5));
            }
          for (guint j = end; j-- > start;)
            {
              sw_plot_map_point (self, b->x[j], b->lo[j], &px, &py);
              cairo_line_to (cr, px, CLAMP (py, -1e5, 1e5));
            }
          cairo_close_path (cr);
          layer_fill (cr);
        }
    }
}

static void
draw_bars (SwPlot *self, cairo_t *cr, const Colors *c, Series *s, guint slot, guint n_slots)
{
  const GdkRGBA *col = sw_plot_palette_entry (c, s->color);

  if (s->style == SW_PLOT_BARS)
    {
      double spacing = INFINITY, base;
      for (guint k = 0; k + 1 < s->n; k++)
        if (sw_plot_axis_valid (&self->x, s->x[k]) && sw_plot_axis_valid (&self->x, s->x[k + 1]))
          spacing = MIN (spacing, fabs (sw_plot_axis_map (&self->x, s->x[k + 1])
                                        - sw_plot_axis_map (&self->x, s->x[k])));
      if (!isfinite (spacing) || spacing <= 0.0)
        spacing = 24.0;
      base = !self->y.log && 0.0 >= MIN (self->y.v0, self->y.v1)
             && 0.0 <= MAX (self->y.v0, self->y.v1)
             ? sw_plot_axis_map (&self->y, 0.0) : self->area.origin.y + self->area.size.height;
      for (guint k = 0; k < s->n; k++)
        {
          double px, py, w = spacing * 0.9 / n_slots;
          if (!sw_plot_map_point (self, s->x[k], s->y[k], &px, &py))
            continue;
          px = px - spacing * 0.45 + slot * w;
          sw_plot_set_source (cr, col, 0.7);
          cairo_rectangle (cr, px, MIN (py, base), w, fabs (base - py));
          layer_fill_preserve (cr);
          sw_plot_set_source (cr, col, 1.0);
          cairo_set_line_width (cr, 1.0);
          layer_stroke (cr);
        }
    }
  else
    {
      double slot_h = fabs (sw_plot_axis_map (&self->y, 1.0) - sw_plot_axis_map (&self->y, 0.0));
      double h = slot_h * 0.7 / n_slots;
      double base = !self->x.log && 0.0 >= self->x.v0 && 0.0 <= self->x.v1
                    ? sw_plot_axis_map (&self->x, 0.0) : self->area.origin.x;
      for (guint k = 0; k < s->n; k++)
        {
          double px, py;
          if (!sw_plot_axis_valid (&self->x, s->x[k]))
            continue;
          px = sw_plot_axis_map (&self->x, s->x[k]);
          py = sw_plot_axis_map (&self->y, k) - slot_h * 0.35 + slot * h;
          sw_plot_set_source (cr, col, 0.7);
          cairo_rectangle (cr, MIN (px, base), py, fabs (px - base), h);
          layer_fill_preserve (cr);
          sw_plot_set_source (cr, col, 1.0);
          cairo_set_line_width (cr, 1.0);
          layer_stroke (cr);
        }
    }
}

static void
draw_series (SwPlot *self, cairo_t *cr, const Colors *c)
{
  gboolean any_highlight = FALSE;
  guint n_bar = 0, n_hbar = 0, i_bar = 0, i_hbar = 0;

  for (guint i = 0; i < self->series->len; i++)
    {
      Series *s = g_ptr_array_index (self->series, i);
      any_highlight |= s->highlighted;
      n_bar += s->style == SW_PLOT_BARS;
      n_hbar += s->style == SW_PLOT_HBARS;
    }

  /* A zero line where bars grow both ways from it. */
  if (n_hbar > 0 && !self->x.log && self->x.v0 < 0.0 && self->x.v1 > 0.0)
    {
      double px = round (sw_plot_axis_map (&self->x, 0.0)) + 0.5;
      sw_plot_set_source (cr, &c->fg, 0.6);
      cairo_set_line_width (cr, 1.0);
      cairo_move_to (cr, px, self->area.origin.y);
      cairo_line_to (cr, px, self->area.origin.y + self->area.size.height);
      layer_stroke (cr);
    }

  /* Bars under lines; highlighted series last, on top. */
  for (int pass = 0; pass < 3; pass++)
    for (guint i = 0; i < self->series->len; i++)
      {
        Series *s = g_ptr_array_index (self->series, i);
        gboolean bar = s->style == SW_PLOT_BARS || s->style == SW_PLOT_HBARS;
        const GdkRGBA *col = sw_plot_palette_entry (c, s->color);
        double alpha = any_highlight && !s->highlighted ? 0.55 : 1.0;

        if ((pass == 0) != bar || (pass == 2) != (s->highlighted && !bar))
          continue;
        if (bar)
          {
            if (s->style == SW_PLOT_BARS)
              draw_bars (self, cr, c, s, i_bar++, n_bar);
            else
              draw_bars (self, cr, c, s, i_hbar++, n_hbar);
            continue;
          }
        if (s->style != SW_PLOT_POINTS)
          {
            cairo_save (cr);
            cairo_set_line_width (cr, s->highlighted ? 3.5 : 2.0);
            cairo_set_line_join (cr, CAIRO_LINE_JOIN_ROUND);
            set_dash_for (cr, s->color, s->highlighted ? 1.3 : 1.0);
            sw_plot_set_source (cr, col, alpha);
            cairo_new_path (cr);
            draw_polyline (self, cr, s->x, s->y, s->n);
            layer_stroke (cr);
            cairo_restore (cr);
          }
        if (s->style != SW_PLOT_LINE)
          {
            for (guint k = 0; k < s->n; k++)
              {
                double px, py;
                if (!sw_plot_map_point (self, s->x[k], s->y[k], &px, &py)
                    || !graphene_rect_contains_point (&self->area,
                                                      &GRAPHENE_POINT_INIT (px, py)))
                  continue;
                draw_shape (cr, shape_for (s->color), px, py, s->highlighted ? 5.5 : 4.5);
                sw_plot_set_source (cr, col, alpha);
                layer_fill_preserve (cr);
                sw_plot_set_source (cr, &c->bg, 0.9);
                cairo_set_line_width (cr, 1.0);
                layer_stroke (cr);
              }
          }
      }
}

static void
draw_vlines (SwPlot *self, cairo_t *cr, const Colors *c, Placer *pl)
{
  const graphene_rect_t *a = &self->area;
  static const double dash[] = { 6.0, 4.0 };

  for (guint i = 0; i < self->vlines->len; i++)
    {
      VLine *v = g_ptr_array_index (self->vlines, i);
      const GdkRGBA *col = sw_plot_palette_entry (c, v->color);
      double px;

      if (!sw_plot_axis_valid (&self->x, v->x))
        continue;
      px = sw_plot_axis_map (&self->x, v->x);
      if (px < a->origin.x - 0.5 || px > a->origin.x + a->size.width + 0.5)
        continue;
      cairo_save (cr);
      cairo_set_dash (cr, dash, 2, 0.0);
      cairo_set_line_width (cr, 1.5);
      sw_plot_set_source (cr, col, 1.0);
      cairo_move_to (cr, px, a->origin.y);
      cairo_line_to (cr, px, a->origin.y + a->size.height);
      layer_stroke (cr);
      cairo_restore (cr);
    }

  /* Labels at the top, stacked downwards where they would collide. */
  for (guint i = 0; i < self->vlines->len; i++)
    {
      VLine *v = g_ptr_array_index (self->vlines, i);
      PangoLayout *layout;
      double px, x, y;
      int w, h;

      if (v->label == NULL || !sw_plot_axis_valid (&self->x, v->x))
        continue;
      px = sw_plot_axis_map (&self->x, v->x);
      if (px < a->origin.x - 0.5 || px > a->origin.x + a->size.width + 0.5)
        continue;
      layout = sw_plot_make_text (self, v->label);
      pango_layout_get_pixel_size (layout, &w, &h);
      x = px - w - 5.0;
      if (x < a->origin.x + 4.0)
        x = px + 5.0;
      for (y = a->origin.y + 4.0; y < a->origin.y + a->size.height - h; y += h + 2.0)
        {
          graphene_rect_t r = GRAPHENE_RECT_INIT (x - 3.0, y - 1.0, w + 6.0, h + 2.0);
          if (placer_free (pl, &r))
            {
              g_array_append_val (pl->rects, r);
              break;
            }
        }
      sw_plot_draw_boxed_text (cr, layout, x, y, c, sw_plot_palette_entry (c, v->color), NULL);
      g_object_unref (layout);
    }
}

static gboolean
marker_position (SwPlot *self, Marker *m, double *px, double *py, gboolean *off_scale)
{
  const graphene_rect_t *a = &self->area;

  if (!sw_plot_axis_valid (&self->x, m->x))
    return FALSE;
  *px = sw_plot_axis_map (&self->x, m->x);
  *off_scale = !sw_plot_axis_valid (&self->y, m->y);
  /* No value (an infeasible point): drawn along the top edge. */
  *py = *off_scale ? a->origin.y + 10.0 : sw_plot_axis_map (&self->y, m->y);
  if (*px < a->origin.x - 1.0 || *px > a->origin.x + a->size.width + 1.0)
    return FALSE;
  *py = CLAMP (*py, a->origin.y, a->origin.y + a->size.height);
  return TRUE;
}

static void
draw_markers (SwPlot *self, cairo_t *cr, const Colors *c, Placer *pl)
{
  /* The marks first, so no label covers another mark. */
  for (guint i = 0; i < self->markers->len; i++)
    {
      Marker *m = g_ptr_array_index (self->markers, i);
      double px, py;
      gboolean off;
      if (marker_position (self, m, &px, &py, &off))
        {
          graphene_rect_t r = GRAPHENE_RECT_INIT (px - 8.0, py - 8.0, 16.0, 16.0);
          g_array_append_val (pl->rects, r);
        }
    }

  for (guint i = 0; i < self->markers->len; i++)
    {
      Marker *m = g_ptr_array_index (self->markers, i);
      double px, py;
      gboolean off_scale = FALSE;

      if (!marker_position (self, m, &px, &py, &off_scale))
        continue;

      switch (m->kind)
        {
        case SW_MARKER_CURRENT:
          cairo_new_path (cr);
          cairo_arc (cr, px, py, 7.5, 0, 2 * G_PI);
          sw_plot_set_source (cr, &c->bg, 1.0);
          layer_fill (cr);
          cairo_arc (cr, px, py, 6.0, 0, 2 * G_PI);
          sw_plot_set_source (cr, &c->fg, 1.0);
          layer_fill (cr);
          break;
        case SW_MARKER_INFEASIBLE:
          cairo_set_line_width (cr, 5.0);
          sw_plot_set_source (cr, &c->bg, 0.9);
          cairo_move_to (cr, px - 6, py - 6);
          cairo_line_to (cr, px + 6, py + 6);
          cairo_move_to (cr, px + 6, py - 6);
          cairo_line_to (cr, px - 6, py + 6);
          layer_stroke (cr);
          cairo_set_line_width (cr, 2.5);
          sw_plot_set_source (cr, &c->palette[1], 1.0);
          cairo_move_to (cr, px - 6, py - 6);
          cairo_line_to (cr, px + 6, py + 6);
          cairo_move_to (cr, px + 6, py - 6);
          cairo_line_to (cr, px - 6, py + 6);
          layer_stroke (cr);
          break;
        case SW_MARKER_BASELINE:
        default:
          cairo_new_path (cr);
          cairo_arc (cr, px, py, 6.0, 0, 2 * G_PI);
          sw_plot_set_source (cr, &c->fg, 1.0);
          cairo_set_line_width (cr, 2.0);
          layer_stroke (cr);
          break;
        }
      if (m->label != NULL && m->label[0] != '\0')
        {
          g_autofree char *markup = NULL;
          PangoLayout *layout;
          double lx, ly;

          if (m->kind == SW_MARKER_CURRENT)
            markup = g_markup_printf_escaped ("<b>%s</b>", m->label);
          else
            markup = g_markup_escape_text (m->label, -1);
          layout = sw_plot_make_markup (self, markup);
          if (off_scale)
            place_label_below (self, pl, layout, px, py, 9.0, &lx, &ly);
          else
            sw_plot_place_label (self, pl, layout, px, py, 9.0, &lx, &ly);
          sw_plot_draw_boxed_text (cr, layout, lx, ly, c,
                           m->kind == SW_MARKER_INFEASIBLE ? &c->palette[1] : &c->fg, NULL);
          g_object_unref (layout);
        }
    }
}

/* The frame layer: title, legend, grid, axes, ticks and their labels, or
 * the title and the note that there is nothing to plot. */
static void
draw_frame_layer (SwPlot *self, cairo_t *cr, const Colors *c, int width, int height)
{
  PangoLayout *title = sw_plot_title_layout (self);

  if (title != NULL)
    {
      int w;
      pango_layout_get_pixel_size (title, &w, NULL);
      sw_plot_set_source (cr, &c->fg, 1.0);
      /* Centred over the plot area when it fits, else from the left margin
       * (the layout wraps at the widget's width). */
      cairo_move_to (cr, CLAMP (self->area.origin.x + (self->area.size.width - w) / 2.0, MARGIN,
                                MAX (MARGIN, width - MARGIN - w)), MARGIN);
      layer_show_layout (cr, title);
      g_object_unref (title);
    }
  if (!sw_plot_has_data (self))
    {
      /* No empty 0-1 axes: say so instead. */
      PangoLayout *layout = sw_plot_make_text_fresh (self, self->empty_text != NULL ? self->empty_text
                                                                              : _("No data"));
      int w, h;
      pango_layout_set_width (layout, (int) (MAX (width - 2 * MARGIN, 1) * PANGO_SCALE));
      pango_layout_set_wrap (layout, PANGO_WRAP_WORD_CHAR);
      pango_layout_set_alignment (layout, PANGO_ALIGN_CENTER);
      pango_layout_get_pixel_size (layout, &w, &h);
      sw_plot_set_source (cr, &c->fg, 0.6);
      cairo_move_to (cr, MARGIN, (height - h) / 2.0);
      layer_show_layout (cr, layout);
      g_object_unref (layout);
      return;
    }
  sw_plot_draw_legend (self, cr, MARGIN, self->legend_top, width - 2 * MARGIN);
  draw_axes (self, cr, c);
}

/* The data layer: bands, bars and series, clipped to the plot area. */
static void
draw_data_layer (SwPlot *self, cairo_t *cr, const Colors *c, int width, int height)
{
  LayerState *st = layer_state (cr);

  if (!sw_plot_has_data (self))
    return;
  cairo_save (cr);
  cairo_rectangle (cr, self->area.origin.x, self->area.origin.y,
                   self->area.size.width, self->area.size.height);
  cairo_clip (cr);
  if (st != NULL)
    st->hash = sw_plot_key_bytes (st->hash, &self->area, sizeof self->area);
  draw_bands (self, cr, c);
  draw_series (self, cr, c);
  cairo_restore (cr);
  /* Nothing is drawn outside the area: the layer's box is the ink's within
   * it, so curves that keep to part of the area repaint only that part. */
  if (st != NULL && st->have_ink
      && !graphene_rect_intersection (&st->ink, &self->area, &st->ink))
    st->have_ink = FALSE;
}

/* The notes layer: limit lines, markers and their labels, placed so that no
 * label covers another or a mark. */
static void
draw_notes_layer (SwPlot *self, cairo_t *cr, const Colors *c, int width, int height)
{
  Placer pl;

  if (!sw_plot_has_data (self))
    return;
  pl.rects = g_array_new (FALSE, FALSE, sizeof (graphene_rect_t));
  draw_vlines (self, cr, c, &pl);
  draw_markers (self, cr, c, &pl);
  g_array_unref (pl.rects);
}

/* Everything but the hover readout: the three layers, each kept if it
 * came out the same. */
static GskRenderNode *
draw_plot (SwPlot *self, int width, int height, const Colors *c)
{
  GskRenderNode *nodes[G_N_ELEMENTS (self->layers)];
  guint n = 0;

  update_layer (self, 0, draw_frame_layer, c, width, height, FALSE);
  update_layer (self, 1, draw_data_layer, c, width, height, TRUE);
  update_layer (self, 2, draw_notes_layer, c, width, height, TRUE);
  for (guint i = 0; i < G_N_ELEMENTS (self->layers); i++)
    if (self->layers[i] != NULL)
      nodes[n++] = self->layers[i];
  return gsk_container_node_new (nodes, n);
}

/* Lays out and draws the plot at its current size if its inputs changed:
 * called as soon as they do (sw-plot.c), so that the frame that shows them
 * only copies pixels, and again at the snapshot. */
void
sw_plot_prepare (SwPlot *self)
{
  int width = gtk_widget_get_width (GTK_WIDGET (self));
  int height = gtk_widget_get_height (GTK_WIDGET (self));
  Colors c;

  if (width <= 0 || height <= 0)
    return;
  sw_plot_ensure_layout (self);
  if (self->drawing != NULL && self->drawing_width == width && self->drawing_height == height)
    return;
  sw_plot_get_colors (self, &c);
  g_clear_pointer (&self->drawing, gsk_render_node_unref);
  self->drawing = draw_plot (self, width, height, &c);
  self->drawing_width = width;
  self->drawing_height = height;
}

void
sw_plot_snapshot (GtkWidget *widget, GtkSnapshot *snapshot)
{
  SwPlot *self = SW_PLOT (widget);
  int width = gtk_widget_get_width (widget);
  int height = gtk_widget_get_height (widget);
  Colors c;

  if (width <= 0 || height <= 0)
    return;
  sw_plot_prepare (self);
  sw_plot_get_colors (self, &c);
  if (self->drawing != NULL)
    gtk_snapshot_append_node (snapshot, self->drawing);

  if (self->hovering && !self->readout_tooltip && sw_plot_has_data (self))
    {
      cairo_t *cr = gtk_snapshot_append_cairo (snapshot, &GRAPHENE_RECT_INIT (0, 0, width, height));
      sw_plot_draw_readout (self, cr, &c);
      cairo_destroy (cr);
    }
}
