/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-plot"

#include "config.h"

#include "sw-plot-private.h"

#include <glib/gi18n.h>
#include <math.h>
#include <string.h>

/* Hover readout */

static char *
short_axis_label (const SwPlotAxis *axis, const char *fallback)
{
  const char *l = axis->label != NULL ? axis->label : fallback;
  const char *paren = strstr (l, " (");

  return paren != NULL ? g_strndup (l, paren - l) : g_strdup (l);
}

/* The nearest drawn point to the pointer: of the series, then of the markers. */
gboolean
sw_plot_hover_find (SwPlot *self, double hx, double hy, double *px_out, double *py_out, char **text,
            int *color)
{
  double best = HOVER_RADIUS;
  Series *best_s = NULL;
  Marker *best_m = NULL;
  guint best_k = 0;
  gboolean cat = sw_plot_categorical_y (self);

  if (!graphene_rect_contains_point (&self->area, &GRAPHENE_POINT_INIT (hx, hy)))
    return FALSE;
  for (guint i = 0; i < self->series->len; i++)
    {
      Series *s = g_ptr_array_index (self->series, i);
      for (guint k = 0; k < s->n; k++)
        {
          double px, py, d;
          if (s->style == SW_PLOT_HBARS)
            {
              if (!sw_plot_axis_valid (&self->x, s->x[k]))
                continue;
              px = sw_plot_axis_map (&self->x, s->x[k]);
              py = sw_plot_axis_map (&self->y, k);
              /* Anywhere along the bar counts. */
              d = fabs (hy - py) + (hx > px ? hx - px : 0.0);
            }
          else
            {
              if (!sw_plot_map_point (self, s->x[k], s->y[k], &px, &py))
                continue;
              d = hypot (hx - px, hy - py);
            }
          if (!graphene_rect_contains_point (&self->area, &GRAPHENE_POINT_INIT (px, py)))
            continue;
          if (d < best)
            {
              best = d;
              best_s = s;
              best_k = k;
              *px_out = px;
              *py_out = py;
            }
        }
    }
  for (guint i = 0; i < self->markers->len; i++)
    {
      Marker *m = g_ptr_array_index (self->markers, i);
      double px, py, d;
      if (!sw_plot_map_point (self, m->x, m->y, &px, &py))
        continue;
      d = hypot (hx - px, hy - py);
      if (d < best)
        {
          best = d;
          best_m = m;
          best_s = NULL;
          *px_out = px;
          *py_out = py;
        }
    }
  if (best_m != NULL)
    {
      g_autofree char *xs = sw_plot_axis_format (&self->x, best_m->x, -1, FALSE);
      g_autofree char *ys = sw_plot_axis_format (&self->y, best_m->y, -1, FALSE);
      g_autofree char *xl = short_axis_label (&self->x, "x");
      g_autofree char *yl = short_axis_label (&self->y, "y");
      *text = g_markup_printf_escaped ("<b>%s</b>\n%s: %s\n%s: %s",
                                       best_m->label != NULL ? best_m->label : "",
                                       xl, xs, yl, ys);
      *color = N_PALETTE - 1;
      return TRUE;
    }
  if (best_s != NULL)
    {
      g_autofree char *xs = sw_plot_axis_format (&self->x, best_s->x[best_k], -1, FALSE);
      g_autofree char *xl = short_axis_label (&self->x, "x");
      const char *name = best_s->name != NULL ? best_s->name : "";
      if (cat || best_s->style == SW_PLOT_HBARS)
        {
          const char *category = self->categories != NULL
                                 && best_k < g_strv_length (self->categories)
                                 ? self->categories[best_k] : "";
          *text = g_markup_printf_escaped ("<b>%s</b>\n%s: %s", category, xl, xs);
        }
      else
        {
          g_autofree char *ys = sw_plot_axis_format (&self->y, best_s->y[best_k], -1, FALSE);
          g_autofree char *yl = short_axis_label (&self->y, "y");
          *text = g_markup_printf_escaped ("<b>%s</b>\n%s: %s\n%s: %s", name, xl, xs, yl, ys);
        }
      *color = best_s->color;
      return TRUE;
    }
  return FALSE;
}

void
sw_plot_draw_readout (SwPlot *self, cairo_t *cr, const Colors *c)
{
  g_autofree char *text = NULL;
  double px, py, lx, ly;
  int color;
  PangoLayout *layout;
  Placer pl = { g_array_new (FALSE, FALSE, sizeof (graphene_rect_t)) };

  if (!sw_plot_hover_find (self, self->hover_x, self->hover_y, &px, &py, &text, &color))
    {
      g_array_unref (pl.rects);
      return;
    }
  cairo_new_path (cr);
  cairo_arc (cr, px, py, 8.0, 0, 2 * G_PI);
  sw_plot_set_source (cr, sw_plot_palette_entry (c, color), 1.0);
  cairo_set_line_width (cr, 2.0);
  cairo_stroke (cr);

  layout = sw_plot_make_layout (self, text);
  sw_plot_place_label (self, &pl, layout, px, py, 14.0, &lx, &ly);
  sw_plot_draw_boxed_text (cr, layout, lx, ly, c, &c->fg, sw_plot_palette_entry (c, color));
  g_object_unref (layout);
  g_array_unref (pl.rects);
}

static gboolean
query_tooltip_cb (SwPlot *self, int x, int y, gboolean keyboard, GtkTooltip *tooltip)
{
  g_autofree char *text = NULL;
  double px, py;
  int color;

  if (!self->readout_tooltip || keyboard)
    return FALSE;
  sw_plot_ensure_layout (self);
  if (!sw_plot_hover_find (self, x, y, &px, &py, &text, &color))
    return FALSE;
  gtk_tooltip_set_markup (tooltip, text);
  return TRUE;
}

static void
motion_cb (GtkEventControllerMotion *motion, double x, double y, SwPlot *self)
{
  self->hovering = TRUE;
  self->hover_x = x;
  self->hover_y = y;
  if (!self->readout_tooltip)
    gtk_widget_queue_draw (GTK_WIDGET (self));
}

static void
leave_cb (GtkEventControllerMotion *motion, SwPlot *self)
{
  self->hovering = FALSE;
  gtk_widget_queue_draw (GTK_WIDGET (self));
}

void
sw_plot_hover_setup (SwPlot *self)
{
  GtkEventController *motion = gtk_event_controller_motion_new ();

  g_signal_connect (motion, "motion", G_CALLBACK (motion_cb), self);
  g_signal_connect (motion, "leave", G_CALLBACK (leave_cb), self);
  gtk_widget_add_controller (GTK_WIDGET (self), motion);
  gtk_widget_set_has_tooltip (GTK_WIDGET (self), TRUE);
  g_signal_connect_swapped (self, "query-tooltip", G_CALLBACK (query_tooltip_cb), self);
}
