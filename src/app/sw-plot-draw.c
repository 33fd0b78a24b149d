/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-plot"

#include "config.h"

#include "sw-plot-private.h"
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

static void
draw_polyline (SwPlot *self, cairo_t *cr, const double *x, const double *y, guint n)
{
  graphene_rect_t clip = self->area;
  gboolean have_prev = FALSE, pen_at_prev = FALSE;
  double px = 0, py = 0;

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
                cairo_move_to (cr, ax, ay);
              cairo_line_to (cr, bx, by);
              pen_at_prev = bx == qx && by == qy;
            }
          else
            pen_at_prev = FALSE;
        }
      px = qx;
      py = qy;
      have_prev = TRUE;
    }
}

void
sw_plot_get_colors (SwPlot *self, Colors *c)
{
  sw_plot_style_fg (GTK_WIDGET (self), &c->fg);
  sw_plot_style_bg (GTK_WIDGET (self), &c->bg);
  for (int i = 0; i < N_PALETTE; i++)
    sw_plot_palette_color (GTK_WIDGET (self), i, &c->palette[i]);
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
      cairo_fill (cr);
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
      cairo_stroke (cr);
      cairo_restore (cr);
    }
  if (e->style != SW_PLOT_LINE)
    {
      draw_shape (cr, shape_for (e->color), x + LEGEND_SAMPLE / 2.0, cy, 4.0);
      cairo_fill (cr);
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
          pango_cairo_show_layout (cr, layout);
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
  cairo_fill (cr);
  if (frame != NULL)
    {
      sw_plot_set_source (cr, frame, 1.0);
      cairo_set_line_width (cr, 1.0);
      cairo_rectangle (cr, x - 3.5, y - 1.5, w + 7.0, h + 3.0);
      cairo_stroke (cr);
    }
  sw_plot_set_source (cr, text, 1.0);
  cairo_move_to (cr, x, y);
  pango_cairo_show_layout (cr, layout);
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

  /* Grid */
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
      cairo_stroke (cr);
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
      cairo_stroke (cr);
    }

  /* Frame: the two axes stronger */
  sw_plot_set_source (cr, &c->fg, 0.25);
  cairo_rectangle (cr, round (a->origin.x) + 0.5, round (a->origin.y) + 0.5,
                   round (a->size.width), round (a->size.height));
  cairo_stroke (cr);
  sw_plot_set_source (cr, &c->fg, 0.8);
  cairo_move_to (cr, round (a->origin.x) + 0.5, round (a->origin.y) + 0.5);
  cairo_line_to (cr, round (a->origin.x) + 0.5, round (a->origin.y + a->size.height) + 0.5);
  cairo_line_to (cr, round (a->origin.x + a->size.width) + 0.5,
                 round (a->origin.y + a->size.height) + 0.5);
  cairo_stroke (cr);

  /* Ticks and labels */
  for (guint i = 0; i < self->x.ticks->len; i++)
    {
      SwPlotTick *t = &g_array_index (self->x.ticks, SwPlotTick, i);
      double px = round (sw_plot_axis_map (&self->x, t->value)) + 0.5;
      double y0 = round (a->origin.y + a->size.height) + 0.5;
      sw_plot_set_source (cr, &c->fg, 0.8);
      cairo_move_to (cr, px, y0);
      cairo_line_to (cr, px, y0 + (t->labelled ? TICK_LEN : TICK_LEN / 2.0));
      cairo_stroke (cr);
      if (t->labelled)
        {
          PangoLayout *layout = sw_plot_make_text (self, t->text);
          int w;
          pango_layout_get_pixel_size (layout, &w, NULL);
          sw_plot_set_source (cr, &c->fg, 1.0);
          cairo_move_to (cr, CLAMP (px - w / 2.0, 0.0, self->layout_width - w),
                         y0 + TICK_LEN + 2.0);
          pango_cairo_show_layout (cr, layout);
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
      cairo_stroke (cr);
      if (t->labelled)
        {
          PangoLayout *layout = sw_plot_make_text (self, t->text);
          int w, h;
          pango_layout_get_pixel_size (layout, &w, &h);
          sw_plot_set_source (cr, &c->fg, 1.0);
          cairo_move_to (cr, x0 - TICK_LEN - 4.0 - w, py - h / 2.0);
          pango_cairo_show_layout (cr, layout);
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
          pango_cairo_show_layout (cr, layout);
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
      pango_cairo_show_layout (cr, layout);
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
      pango_cairo_show_layout (cr, layout);
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
          cairo_fill (cr);
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
          cairo_fill_preserve (cr);
          sw_plot_set_source (cr, col, 1.0);
          cairo_set_line_width (cr, 1.0);
          cairo_stroke (cr);
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
          cairo_fill_preserve (cr);
          sw_plot_set_source (cr, col, 1.0);
          cairo_set_line_width (cr, 1.0);
          cairo_stroke (cr);
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
      cairo_stroke (cr);
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
            cairo_stroke (cr);
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
                cairo_fill_preserve (cr);
                sw_plot_set_source (cr, &c->bg, 0.9);
                cairo_set_line_width (cr, 1.0);
                cairo_stroke (cr);
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
      cairo_stroke (cr);
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
          cairo_fill (cr);
          cairo_arc (cr, px, py, 6.0, 0, 2 * G_PI);
          sw_plot_set_source (cr, &c->fg, 1.0);
          cairo_fill (cr);
          break;
        case SW_MARKER_INFEASIBLE:
          cairo_set_line_width (cr, 5.0);
          sw_plot_set_source (cr, &c->bg, 0.9);
          cairo_move_to (cr, px - 6, py - 6);
          cairo_line_to (cr, px + 6, py + 6);
          cairo_move_to (cr, px + 6, py - 6);
          cairo_line_to (cr, px - 6, py + 6);
          cairo_stroke (cr);
          cairo_set_line_width (cr, 2.5);
          sw_plot_set_source (cr, &c->palette[1], 1.0);
          cairo_move_to (cr, px - 6, py - 6);
          cairo_line_to (cr, px + 6, py + 6);
          cairo_move_to (cr, px + 6, py - 6);
          cairo_line_to (cr, px - 6, py + 6);
          cairo_stroke (cr);
          break;
        case SW_MARKER_BASELINE:
        default:
          cairo_new_path (cr);
          cairo_arc (cr, px, py, 6.0, 0, 2 * G_PI);
          sw_plot_set_source (cr, &c->fg, 1.0);
          cairo_set_line_width (cr, 2.0);
          cairo_stroke (cr);
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
          layout = sw_plot_make_layout (self, markup);
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

/* Everything but the hover readout, recorded into @snapshot. */
static void
draw_plot (SwPlot *self, GtkSnapshot *snapshot, int width, int height, const Colors *cc)
{
  Colors c = *cc;
  PangoLayout *title;
  Placer pl;
  cairo_t *cr;

  cr = gtk_snapshot_append_cairo (snapshot, &GRAPHENE_RECT_INIT (0, 0, width, height));

  title = sw_plot_title_layout (self);
  if (title != NULL)
    {
      int w;
      pango_layout_get_pixel_size (title, &w, NULL);
      sw_plot_set_source (cr, &c.fg, 1.0);
      /* Centred over the plot area when it fits, else from the left margin
       * (the layout wraps at the widget's width). */
      cairo_move_to (cr, CLAMP (self->area.origin.x + (self->area.size.width - w) / 2.0, MARGIN,
                                MAX (MARGIN, width - MARGIN - w)), MARGIN);
      pango_cairo_show_layout (cr, title);
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
      sw_plot_set_source (cr, &c.fg, 0.6);
      cairo_move_to (cr, MARGIN, (height - h) / 2.0);
      pango_cairo_show_layout (cr, layout);
      g_object_unref (layout);
      cairo_destroy (cr);
      return;
    }
  sw_plot_draw_legend (self, cr, MARGIN, self->legend_top, width - 2 * MARGIN);
  draw_axes (self, cr, &c);

  cairo_save (cr);
  cairo_rectangle (cr, self->area.origin.x, self->area.origin.y,
                   self->area.size.width, self->area.size.height);
  cairo_clip (cr);
  draw_bands (self, cr, &c);
  draw_series (self, cr, &c);
  cairo_restore (cr);

  pl.rects = g_array_new (FALSE, FALSE, sizeof (graphene_rect_t));
  draw_vlines (self, cr, &c, &pl);
  draw_markers (self, cr, &c, &pl);
  g_array_unref (pl.rects);

  cairo_destroy (cr);
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
  sw_plot_ensure_layout (self);
  sw_plot_get_colors (self, &c);
  if (self->drawing == NULL || self->drawing_width != width || self->drawing_height != height)
    {
      GtkSnapshot *own = gtk_snapshot_new ();

      g_clear_pointer (&self->drawing, gsk_render_node_unref);
      draw_plot (self, own, width, height, &c);
      self->drawing = gtk_snapshot_free_to_node (own);
      self->drawing_width = width;
      self->drawing_height = height;
    }
  if (self->drawing != NULL)
    gtk_snapshot_append_node (snapshot, self->drawing);

  if (self->hovering && !self->readout_tooltip && sw_plot_has_data (self))
    {
      cairo_t *cr = gtk_snapshot_append_cairo (snapshot, &GRAPHENE_RECT_INIT (0, 0, width, height));
      sw_plot_draw_readout (self, cr, &c);
      cairo_destroy (cr);
    }
}
