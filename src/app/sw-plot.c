/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-plot"

#include "config.h"

#include "sw-plot-private.h"
#include "sw-raster.h"

#include <glib/gi18n.h>
#include <math.h>
#include <string.h>

enum {
  PROP_0,
  PROP_TITLE,
  PROP_READOUT_TOOLTIP,
  N_PROPS
};

static GParamSpec *properties[N_PROPS];

G_DEFINE_FINAL_TYPE (SwPlot, sw_plot, GTK_TYPE_WIDGET)

/* Data extent */

typedef struct {
  double min, max;
} Extent;

static void
extent_add (Extent *e, const SwPlotAxis *axis, double v)
{
  if (!sw_plot_axis_valid (axis, v))
    return;
  e->min = MIN (e->min, v);
  e->max = MAX (e->max, v);
}

static gboolean
has_style (SwPlot *self, SwPlotStyle style)
{
  for (guint i = 0; i < self->series->len; i++)
    if (((Series *) g_ptr_array_index (self->series, i))->style == style)
      return TRUE;
  return FALSE;
}

guint
sw_plot_n_categories (SwPlot *self)
{
  guint n = self->categories != NULL ? g_strv_length (self->categories) : 0;

  for (guint i = 0; i < self->series->len; i++)
    {
      Series *s = g_ptr_array_index (self->series, i);
      if (s->style == SW_PLOT_HBARS)
        n = MAX (n, s->n);
    }
  return n;
}

gboolean
sw_plot_categorical_y (SwPlot *self)
{
  return has_style (self, SW_PLOT_HBARS);
}

static void
data_extent (SwPlot *self, Extent *ex, Extent *ey)
{
  ex->min = ey->min = INFINITY;
  ex->max = ey->max = -INFINITY;

  for (guint i = 0; i < self->series->len; i++)
    {
      Series *s = g_ptr_array_index (self->series, i);
      for (guint k = 0; k < s->n; k++)
        {
          if (s->style == SW_PLOT_HBARS)
            {
              extent_add (ex, &self->x, s->x[k]);
              continue;
            }
          /* A point counts only if both coordinates can be drawn. */
          if (!sw_plot_axis_valid (&self->x, s->x[k]) || !sw_plot_axis_valid (&self->y, s->y[k]))
            continue;
          extent_add (ex, &self->x, s->x[k]);
          extent_add (ey, &self->y, s->y[k]);
        }
      if (s->style == SW_PLOT_BARS && !self->y.log)
        extent_add (ey, &self->y, 0.0);
      if (s->style == SW_PLOT_BARS && !self->x.log && s->n > 0)
        {
          /* Whole bars: half a bar spacing beyond the first and last centres. */
          double spacing = INFINITY;
          for (guint k = 0; k + 1 < s->n; k++)
            if (isfinite (s->x[k]) && isfinite (s->x[k + 1]) && s->x[k + 1] != s->x[k])
              spacing = MIN (spacing, fabs (s->x[k + 1] - s->x[k]));
          if (isfinite (spacing) && isfinite (ex->min) && isfinite (ex->max))
            {
              extent_add (ex, &self->x, ex->min - spacing / 2.0);
              extent_add (ex, &self->x, ex->max + spacing / 2.0);
            }
        }
      if (s->style == SW_PLOT_HBARS && !self->x.log)
        extent_add (ex, &self->x, 0.0);
    }
  for (guint i = 0; i < self->bands->len; i++)
    {
      Band *b = g_ptr_array_index (self->bands, i);
      for (guint k = 0; k < b->n; k++)
        if (sw_plot_axis_valid (&self->x, b->x[k]))
          {
            extent_add (ex, &self->x, b->x[k]);
            extent_add (ey, &self->y, b->lo[k]);
            extent_add (ey, &self->y, b->hi[k]);
          }
    }
  for (guint i = 0; i < self->markers->len; i++)
    {
      Marker *m = g_ptr_array_index (self->markers, i);
      extent_add (ex, &self->x, m->x);
      if (sw_plot_axis_valid (&self->x, m->x))
        extent_add (ey, &self->y, m->y);
    }
  for (guint i = 0; i < self->vlines->len; i++)
    extent_add (ex, &self->x, ((VLine *) g_ptr_array_index (self->vlines, i))->x);
}

/* The axis module's measure function. */
static double
text_extent (const char *text, gboolean horizontal, gpointer user_data)
{
  PangoLayout *layout = sw_plot_make_text (user_data, text);
  int w, h;

  pango_layout_get_pixel_size (layout, &w, &h);
  g_object_unref (layout);
  return horizontal ? w : h;
}

/* Layout */

PangoLayout *
sw_plot_make_layout (SwPlot *self, const char *markup)
{
  PangoLayout *layout = gtk_widget_create_pango_layout (GTK_WIDGET (self), NULL);

  pango_layout_set_markup (layout, markup, -1);
  return layout;
}

/* Plain texts (ticks, axis titles, legend names) recur from one result to
 * the next: their shaped layouts are kept, so a new result does not shape
 * them again.  Callers must not change the layout they get. */
#define TEXT_CACHE_MAX 512

PangoLayout *
sw_plot_make_text (SwPlot *self, const char *text)
{
  PangoLayout *layout;

  if (text == NULL)
    text = "";
  layout = g_hash_table_lookup (self->text_cache, text);
  if (layout == NULL)
    {
      if (g_hash_table_size (self->text_cache) >= TEXT_CACHE_MAX)
        g_hash_table_remove_all (self->text_cache);
      layout = gtk_widget_create_pango_layout (GTK_WIDGET (self), text);
      g_hash_table_insert (self->text_cache, g_strdup (text), layout);
    }
  return g_object_ref (layout);
}

PangoLayout *
sw_plot_make_markup (SwPlot *self, const char *markup)
{
  g_autofree char *key = g_strconcat ("\x03", markup, NULL);
  PangoLayout *layout = g_hash_table_lookup (self->text_cache, key);

  if (layout == NULL)
    {
      if (g_hash_table_size (self->text_cache) >= TEXT_CACHE_MAX)
        g_hash_table_remove_all (self->text_cache);
      layout = sw_plot_make_layout (self, markup);
      g_hash_table_insert (self->text_cache, g_steal_pointer (&key), layout);
    }
  return g_object_ref (layout);
}

PangoLayout *
sw_plot_make_text_fresh (SwPlot *self, const char *text)
{
  return gtk_widget_create_pango_layout (GTK_WIDGET (self), text);
}

PangoLayout *
sw_plot_title_layout (SwPlot *self)
{
  g_autofree char *markup = NULL;
  g_autofree char *key = NULL;
  PangoLayout *layout;
  int width;

  if (self->title == NULL || self->title[0] == '\0')
    return NULL;
  width = gtk_widget_get_width (GTK_WIDGET (self));
  /* Kept in the text cache by title and width (a title rarely changes). */
  key = g_strdup_printf ("\x02%d\x02%s", width, self->title);
  layout = g_hash_table_lookup (self->text_cache, key);
  if (layout != NULL)
    return g_object_ref (layout);
  markup = g_markup_printf_escaped ("<span weight='bold' size='large'>%s</span>", self->title);
  layout = sw_plot_make_layout (self, markup);
  /* A long title wraps at the widget's width instead of being cut. */
  if (width > 2 * MARGIN)
    {
      pango_layout_set_width (layout, (int) ((width - 2 * MARGIN) * PANGO_SCALE));
      pango_layout_set_wrap (layout, PANGO_WRAP_WORD_CHAR);
    }
  if (g_hash_table_size (self->text_cache) >= TEXT_CACHE_MAX)
    g_hash_table_remove_all (self->text_cache);
  g_hash_table_insert (self->text_cache, g_steal_pointer (&key), g_object_ref (layout));
  return layout;
}

GArray *
sw_plot_legend_entries (SwPlot *self)
{
  GArray *entries = g_array_new (FALSE, FALSE, sizeof (LegendEntry));

  for (guint i = 0; i < self->series->len; i++)
    {
      Series *s = g_ptr_array_index (self->series, i);
      LegendEntry e = { s->name, s->color, s->style, FALSE };
      if (s->name != NULL && s->name[0] != '\0')
        g_array_append_val (entries, e);
    }
  for (guint i = 0; i < self->bands->len; i++)
    {
      Band *b = g_ptr_array_index (self->bands, i);
      LegendEntry e = { b->name, b->color, SW_PLOT_LINE, TRUE };
      if (b->name != NULL && b->name[0] != '\0')
        g_array_append_val (entries, e);
    }
  return entries;
}

double
sw_plot_text_height (SwPlot *self)
{
  PangoLayout *probe = sw_plot_make_text (self, "Mg");
  int h;

  pango_layout_get_pixel_size (probe, NULL, &h);
  g_object_unref (probe);
  return h;
}

static double
max_tick_extent (SwPlot *self, SwPlotAxis *axis, gboolean width)
{
  double m = 0.0;

  for (guint i = 0; i < axis->ticks->len; i++)
    {
      SwPlotTick *t = &g_array_index (axis->ticks, SwPlotTick, i);
      PangoLayout *layout;
      int w, h;
      if (!t->labelled)
        continue;
      layout = sw_plot_make_text (self, t->text);
      pango_layout_get_pixel_size (layout, &w, &h);
      g_object_unref (layout);
      m = MAX (m, width ? w : h);
    }
  return m;
}

double
sw_plot_category_width (SwPlot *self)
{
  double m = 0.0;
  guint n = self->categories != NULL ? g_strv_length (self->categories) : 0;

  for (guint i = 0; i < n; i++)
    {
      PangoLayout *layout = sw_plot_make_text (self, self->categories[i]);
      int w;
      pango_layout_get_pixel_size (layout, &w, NULL);
      g_object_unref (layout);
      m = MAX (m, w);
    }
  return MIN (m, 220.0);
}

static void
plot_layout (SwPlot *self, int width, int height)
{
  PangoLayout *title = sw_plot_title_layout (self);
  double th = sw_plot_text_height (self);
  double top = MARGIN, bottom, left, right;
  double y_tick_w = 40.0;
  Extent ex, ey;
  gboolean cat = sw_plot_categorical_y (self);

  self->layout_width = width;
  self->layout_height = height;
  self->layout_valid = TRUE;

  if (title != NULL)
    {
      int h;
      pango_layout_get_pixel_size (title, NULL, &h);
      top += h + 4.0;
      g_object_unref (title);
    }
  self->legend_top = top;
  top += sw_plot_draw_legend (self, NULL, MARGIN, top, width - 2 * MARGIN);
  top += th / 2.0 + 2.0;   /* room for the top tick label */

  bottom = height - MARGIN - (self->x.label != NULL ? th + 4.0 : 0.0) - th - TICK_LEN - 4.0;
  right = width - MARGIN - 12.0;
  data_extent (self, &ex, &ey);
  /* A region to show replaces the data's extent on its axis. */
  if (isfinite (self->x.region_min) && isfinite (self->x.region_max))
    {
      ex.min = MIN (self->x.region_min, self->x.region_max);
      ex.max = MAX (self->x.region_min, self->x.region_max);
    }
  if (isfinite (self->y.region_min) && isfinite (self->y.region_max))
    {
      ey.min = MIN (self->y.region_min, self->y.region_max);
      ey.max = MAX (self->y.region_min, self->y.region_max);
    }

  /* Two passes: the width of the y labels depends on the ticks, which
   * depend on the height, which does not depend on the width. */
  for (int pass = 0; pass < 2; pass++)
    {
      left = MARGIN + (self->y.label != NULL ? th + 6.0 : 0.0) + y_tick_w + TICK_LEN + 4.0;
      self->area = GRAPHENE_RECT_INIT (left, top, MAX (right - left, 10.0),
                                       MAX (bottom - top, 10.0));

      sw_plot_axis_compute (&self->x, ex.min, ex.max, self->area.origin.x,
                    self->area.origin.x + self->area.size.width, TRUE,
                            text_extent, self);
      if (cat)
        {
          guint n = MAX (sw_plot_n_categories (self), 1);
          self->y.v0 = n - 0.5;
          self->y.v1 = -0.5;
          self->y.p0 = self->area.origin.y + self->area.size.height;
          self->y.p1 = self->area.origin.y;
          g_array_set_size (self->y.ticks, 0);
        }
      else
        {
          sw_plot_axis_compute (&self->y, ey.min, ey.max, self->area.origin.y + self->area.size.height,
                        self->area.origin.y, FALSE,
                            text_extent, self);
          y_tick_w = max_tick_extent (self, &self->y, TRUE);
        }
      if (cat)
        y_tick_w = sw_plot_category_width (self);
    }
  /* The ranges now shown are held for the next layout (sw-plot-axis.h):
   * an edit that moves the data a little redraws the data, not the axes. */
  if (sw_plot_has_data (self))
    {
      sw_plot_axis_hold (&self->x);
      if (!cat)
        sw_plot_axis_hold (&self->y);
    }
}

/* FNV-1a over the bytes of everything the drawing is made of. */
guint64
sw_plot_key_bytes (guint64 h, const void *data, gsize n)
{
  const guchar *p = data;

  for (gsize i = 0; i < n; i++)
    h = (h ^ p[i]) * G_GUINT64_CONSTANT (1099511628211);
  return h;
}

guint64
sw_plot_key_str (guint64 h, const char *s)
{
  /* NULL and "" differ; the terminator separates neighbours. */
  return s == NULL ? sw_plot_key_bytes (h, "\1", 1) : sw_plot_key_bytes (h, s, strlen (s) + 1);
}

guint64
sw_plot_key_int (guint64 h, gint64 v)
{
  return sw_plot_key_bytes (h, &v, sizeof v);
}

static guint64
key_axis (guint64 h, const SwPlotAxis *a)
{
  h = sw_plot_key_str (h, a->label);
  h = sw_plot_key_int (h, a->log);
  h = sw_plot_key_int (h, a->integer);
  h = sw_plot_key_bytes (h, &a->fixed_min, sizeof (double));
  h = sw_plot_key_bytes (h, &a->fixed_max, sizeof (double));
  h = sw_plot_key_bytes (h, &a->region_min, sizeof (double));
  h = sw_plot_key_bytes (h, &a->region_max, sizeof (double));
  h = sw_plot_key_str (h, a->prefix);
  h = sw_plot_key_str (h, a->spec);
  h = sw_plot_key_str (h, a->suffix);
  h = sw_plot_key_bytes (h, &a->scale, sizeof (double));
  return sw_plot_key_int (h, a->ticks_bare);
}

static guint64
drawing_key (SwPlot *self)
{
  guint64 h = G_GUINT64_CONSTANT (14695981039346656037);
  Colors c;

  sw_plot_get_colors (self, &c);
  h = sw_plot_key_bytes (h, &c, sizeof c);
  h = sw_plot_key_int (h, gtk_widget_get_scale_factor (GTK_WIDGET (self)));
  h = sw_plot_key_str (h, self->title);
  h = sw_plot_key_str (h, self->empty_text);
  h = key_axis (h, &self->x);
  h = key_axis (h, &self->y);
  h = sw_plot_key_int (h, self->series->len);
  for (guint i = 0; i < self->series->len; i++)
    {
      const Series *s = g_ptr_array_index (self->series, i);
      h = sw_plot_key_str (h, s->name);
      h = sw_plot_key_int (h, s->n);
      h = sw_plot_key_bytes (h, s->x, sizeof (double) * s->n);
      h = sw_plot_key_bytes (h, s->y, sizeof (double) * s->n);
      h = sw_plot_key_int (h, s->style);
      h = sw_plot_key_int (h, s->color);
      h = sw_plot_key_int (h, s->highlighted);
    }
  h = sw_plot_key_int (h, self->bands->len);
  for (guint i = 0; i < self->bands->len; i++)
    {
      const Band *b = g_ptr_array_index (self->bands, i);
      h = sw_plot_key_str (h, b->name);
      h = sw_plot_key_int (h, b->n);
      h = sw_plot_key_bytes (h, b->x, sizeof (double) * b->n);
      h = sw_plot_key_bytes (h, b->lo, sizeof (double) * b->n);
      h = sw_plot_key_bytes (h, b->hi, sizeof (double) * b->n);
      h = sw_plot_key_int (h, b->color);
    }
  h = sw_plot_key_int (h, self->markers->len);
  for (guint i = 0; i < self->markers->len; i++)
    {
      const Marker *m = g_ptr_array_index (self->markers, i);
      h = sw_plot_key_bytes (h, &m->x, sizeof (double));
      h = sw_plot_key_bytes (h, &m->y, sizeof (double));
      h = sw_plot_key_str (h, m->label);
      h = sw_plot_key_int (h, m->kind);
    }
  h = sw_plot_key_int (h, self->vlines->len);
  for (guint i = 0; i < self->vlines->len; i++)
    {
      const VLine *v = g_ptr_array_index (self->vlines, i);
      h = sw_plot_key_bytes (h, &v->x, sizeof (double));
      h = sw_plot_key_str (h, v->label);
      h = sw_plot_key_int (h, v->color);
    }
  h = sw_plot_key_int (h, self->categories != NULL ? (gint64) g_strv_length (self->categories) : -1);
  for (guint i = 0; self->categories != NULL && self->categories[i] != NULL; i++)
    h = sw_plot_key_str (h, self->categories[i]);
  return h;
}

void
sw_plot_check_inputs (SwPlot *self)
{
  guint64 key;

  if (!self->drawing_dirty)
    return;
  self->drawing_dirty = FALSE;
  key = drawing_key (self);
  if (key == self->drawing_key && self->drawing != NULL)
    return;
  self->drawing_key = key;
  self->layout_valid = FALSE;
  g_clear_pointer (&self->drawing, gsk_render_node_unref);
  /* The layers stay: each is kept if it comes out the same (sw-plot-draw.c). */
}

void
sw_plot_ensure_layout (SwPlot *self)
{
  int w = gtk_widget_get_width (GTK_WIDGET (self));
  int h = gtk_widget_get_height (GTK_WIDGET (self));

  sw_plot_check_inputs (self);
  if (!self->layout_valid || w != self->layout_width || h != self->layout_height)
    plot_layout (self, w, h);
}

static void
prepare (GtkWidget *widget)
{
  sw_plot_prepare (SW_PLOT (widget));
}

static void
invalidate (SwPlot *self)
{
  /* The layout is redone only if the drawing's key changes.  The drawing
   * is made as soon as the caller is done setting the inputs (an idle at
   * the default priority runs before the frame clock's), not in the frame. */
  self->drawing_dirty = TRUE;
  gtk_widget_queue_draw (GTK_WIDGET (self));
  sw_raster_schedule (GTK_WIDGET (self), &self->prepare_id, prepare);
}

static void
sw_plot_measure (GtkWidget *widget, GtkOrientation orientation, int for_size,
                 int *minimum, int *natural, int *minimum_baseline, int *natural_baseline)
{
  if (orientation == GTK_ORIENTATION_HORIZONTAL)
    {
      *minimum = 240;
      *natural = 480;
    }
  else
    {
      *minimum = 180;
      *natural = 320;
    }
}

static void
sw_plot_size_allocate (GtkWidget *widget, int width, int height, int baseline)
{
  /* Nothing: the layout and the drawing are keyed on the size, so a
   * relayout of the window that leaves this plot's size alone costs
   * nothing here. */
}

/* Everything measured and drawn again: after a change of style (the font
 * may have changed) or of scale (the drawing is pixels, sw-raster.h). */
static void
redraw_all (SwPlot *self)
{
  g_hash_table_remove_all (self->text_cache);
  self->colors_valid = FALSE;
  self->layout_valid = FALSE;
  g_clear_pointer (&self->drawing, gsk_render_node_unref);
  sw_plot_clear_layers (self);
  invalidate (self);
}

static void
scale_factor_cb (SwPlot *self, GParamSpec *pspec, gpointer data)
{
  redraw_all (self);
}

static void
sw_plot_css_changed (GtkWidget *widget, GtkCssStyleChange *change)
{
  GTK_WIDGET_CLASS (sw_plot_parent_class)->css_changed (widget, change);
  redraw_all (SW_PLOT (widget));
}

/* GObject */

static void
series_free (gpointer data)
{
  Series *s = data;

  g_free (s->name);
  g_free (s->x);
  g_free (s->y);
  g_free (s);
}

static void
band_free (gpointer data)
{
  Band *b = data;

  g_free (b->name);
  g_free (b->x);
  g_free (b->lo);
  g_free (b->hi);
  g_free (b);
}

static void
marker_free (gpointer data)
{
  Marker *m = data;

  g_free (m->label);
  g_free (m);
}

static void
vline_free (gpointer data)
{
  VLine *v = data;

  g_free (v->label);
  g_free (v);
}

static void
sw_plot_finalize (GObject *object)
{
  SwPlot *self = SW_PLOT (object);

  g_free (self->title);
  g_free (self->empty_text);
  g_hash_table_unref (self->text_cache);
  g_clear_handle_id (&self->prepare_id, g_source_remove);
  g_clear_pointer (&self->drawing, gsk_render_node_unref);
  sw_plot_clear_layers (self);
  sw_plot_axis_clear (&self->x);
  sw_plot_axis_clear (&self->y);
  g_ptr_array_unref (self->series);
  g_ptr_array_unref (self->bands);
  g_ptr_array_unref (self->markers);
  g_ptr_array_unref (self->vlines);
  g_strfreev (self->categories);
  G_OBJECT_CLASS (sw_plot_parent_class)->finalize (object);
}

static void
sw_plot_get_property (GObject *object, guint prop_id, GValue *value, GParamSpec *pspec)
{
  SwPlot *self = SW_PLOT (object);

  switch (prop_id)
    {
    case PROP_TITLE:
      g_value_set_string (value, self->title);
      break;
    case PROP_READOUT_TOOLTIP:
      g_value_set_boolean (value, self->readout_tooltip);
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
sw_plot_set_property (GObject *object, guint prop_id, const GValue *value, GParamSpec *pspec)
{
  SwPlot *self = SW_PLOT (object);

  switch (prop_id)
    {
    case PROP_TITLE:
      sw_plot_set_title (self, g_value_get_string (value));
      break;
    case PROP_READOUT_TOOLTIP:
      sw_plot_set_readout_tooltip (self, g_value_get_boolean (value));
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
sw_plot_class_init (SwPlotClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->finalize = sw_plot_finalize;
  object_class->get_property = sw_plot_get_property;
  object_class->set_property = sw_plot_set_property;
  widget_class->snapshot = sw_plot_snapshot;
  widget_class->measure = sw_plot_measure;
  widget_class->size_allocate = sw_plot_size_allocate;
  widget_class->css_changed = sw_plot_css_changed;

  properties[PROP_TITLE] =
    g_param_spec_string ("title", NULL, NULL, NULL,
                         G_PARAM_READWRITE | G_PARAM_EXPLICIT_NOTIFY | G_PARAM_STATIC_STRINGS);
  properties[PROP_READOUT_TOOLTIP] =
    g_param_spec_boolean ("readout-tooltip", NULL, NULL, FALSE,
                          G_PARAM_READWRITE | G_PARAM_EXPLICIT_NOTIFY | G_PARAM_STATIC_STRINGS);
  g_object_class_install_properties (object_class, N_PROPS, properties);

  gtk_widget_class_set_css_name (widget_class, "plot");
  gtk_widget_class_set_accessible_role (widget_class, GTK_ACCESSIBLE_ROLE_IMG);
}

static void
sw_plot_init (SwPlot *self)
{
  sw_plot_axis_init (&self->x);
  sw_plot_axis_init (&self->y);
  self->series = g_ptr_array_new_with_free_func (series_free);
  self->bands = g_ptr_array_new_with_free_func (band_free);
  self->markers = g_ptr_array_new_with_free_func (marker_free);
  self->vlines = g_ptr_array_new_with_free_func (vline_free);
  self->text_cache = g_hash_table_new_full (g_str_hash, g_str_equal, g_free, g_object_unref);
  sw_plot_hover_setup (self);
  g_signal_connect (self, "notify::scale-factor", G_CALLBACK (scale_factor_cb), NULL);
}

/* Public API */

GtkWidget *
sw_plot_new (void)
{
  return g_object_new (SW_TYPE_PLOT, NULL);
}

void
sw_plot_clear (SwPlot *self)
{
  g_return_if_fail (SW_IS_PLOT (self));

  g_ptr_array_set_size (self->series, 0);
  g_ptr_array_set_size (self->bands, 0);
  g_ptr_array_set_size (self->markers, 0);
  g_ptr_array_set_size (self->vlines, 0);
  self->next_color = 0;
  invalidate (self);
}

void
sw_plot_set_title (SwPlot *self, const char *title)
{
  g_return_if_fail (SW_IS_PLOT (self));

  if (g_strcmp0 (title, self->title) == 0)
    return;
  g_free (self->title);
  self->title = g_strdup (title);
  gtk_accessible_update_property (GTK_ACCESSIBLE (self), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                  title != NULL ? title : "", -1);
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_TITLE]);
  invalidate (self);
}

static void
set_axis (SwPlot *self, SwPlotAxis *axis, const char *label, gboolean log_scale)
{
  g_free (axis->label);
  axis->label = g_strdup (label);
  axis->log = log_scale;
  /* "Liftoff mass (t)": the unit is on the axis once, not on every tick. */
  axis->ticks_bare = label != NULL && g_str_has_suffix (label, ")") && strchr (label, '(') != NULL;
  invalidate (self);
}

void
sw_plot_set_x_axis (SwPlot *self, const char *label, gboolean log_scale)
{
  g_return_if_fail (SW_IS_PLOT (self));
  set_axis (self, &self->x, label, log_scale);
}

void
sw_plot_set_y_axis (SwPlot *self, const char *label, gboolean log_scale)
{
  g_return_if_fail (SW_IS_PLOT (self));
  set_axis (self, &self->y, label, log_scale);
}

void
sw_plot_set_x_range (SwPlot *self, double min, double max)
{
  g_return_if_fail (SW_IS_PLOT (self));
  self->x.fixed_min = min;
  self->x.fixed_max = max;
  self->x.region_min = self->x.region_max = NAN;
  invalidate (self);
}

void
sw_plot_set_x_region (SwPlot *self, double min, double max)
{
  g_return_if_fail (SW_IS_PLOT (self));
  self->x.fixed_min = self->x.fixed_max = NAN;
  self->x.region_min = min;
  self->x.region_max = max;
  invalidate (self);
}

void
sw_plot_set_y_region (SwPlot *self, double min, double max)
{
  g_return_if_fail (SW_IS_PLOT (self));
  self->y.fixed_min = self->y.fixed_max = NAN;
  self->y.region_min = min;
  self->y.region_max = max;
  invalidate (self);
}

void
sw_plot_set_y_range (SwPlot *self, double min, double max)
{
  g_return_if_fail (SW_IS_PLOT (self));
  self->y.fixed_min = min;
  self->y.fixed_max = max;
  self->y.region_min = self->y.region_max = NAN;
  invalidate (self);
}

static int
take_color (SwPlot *self, int color_index)
{
  if (color_index < 0)
    color_index = self->next_color;
  self->next_color = MAX (self->next_color, color_index + 1);
  return color_index % N_PALETTE;
}

guint
sw_plot_add_series (SwPlot *self, const char *name, const double *x, const double *y,
                    guint n, SwPlotStyle style, int color_index)
{
  Series *s;

  g_return_val_if_fail (SW_IS_PLOT (self), 0);
  g_return_val_if_fail (n == 0 || x != NULL, 0);
  g_return_val_if_fail (n == 0 || y != NULL || style == SW_PLOT_HBARS, 0);

  s = g_new0 (Series, 1);
  s->name = g_strdup (name);
  s->n = n;
  s->x = g_memdup2 (x, sizeof (double) * n);
  s->y = y != NULL ? g_memdup2 (y, sizeof (double) * n) : NULL;
  if (s->y == NULL)
    {
      s->y = g_new (double, MAX (n, 1));
      for (guint k = 0; k < n; k++)
        s->y[k] = k;
    }
  s->style = style;
  s->color = take_color (self, color_index);
  g_ptr_array_add (self->series, s);
  invalidate (self);
  return self->series->len - 1;
}

void
sw_plot_set_series_highlighted (SwPlot *self, guint series, gboolean highlighted)
{
  Series *s;

  g_return_if_fail (SW_IS_PLOT (self));
  g_return_if_fail (series < self->series->len);

  s = g_ptr_array_index (self->series, series);
  if (s->highlighted == !!highlighted)
    return;
  s->highlighted = !!highlighted;
  invalidate (self);
}

void
sw_plot_add_marker (SwPlot *self, double x, double y, const char *label, SwMarkerKind kind)
{
  Marker *m;

  g_return_if_fail (SW_IS_PLOT (self));

  m = g_new0 (Marker, 1);
  m->x = x;
  m->y = y;
  m->label = g_strdup (label);
  m->kind = kind;
  g_ptr_array_add (self->markers, m);
  invalidate (self);
}

void
sw_plot_add_vline (SwPlot *self, double x, const char *label, int color_index)
{
  VLine *v;

  g_return_if_fail (SW_IS_PLOT (self));

  v = g_new0 (VLine, 1);
  v->x = x;
  v->label = g_strdup (label);
  v->color = color_index < 0 ? N_PALETTE - 1 : color_index % N_PALETTE;
  g_ptr_array_add (self->vlines, v);
  invalidate (self);
}

void
sw_plot_add_band (SwPlot *self, const char *name, const double *x, const double *y_lo,
                  const double *y_hi, guint n, int color_index)
{
  Band *b;

  g_return_if_fail (SW_IS_PLOT (self));
  g_return_if_fail (n == 0 || (x != NULL && y_lo != NULL && y_hi != NULL));

  b = g_new0 (Band, 1);
  b->name = g_strdup (name);
  b->n = n;
  b->x = g_memdup2 (x, sizeof (double) * n);
  b->lo = g_memdup2 (y_lo, sizeof (double) * n);
  b->hi = g_memdup2 (y_hi, sizeof (double) * n);
  b->color = take_color (self, color_index);
  g_ptr_array_add (self->bands, b);
  invalidate (self);
}

void
sw_plot_set_categories (SwPlot *self, const char *const *labels, guint n)
{
  g_return_if_fail (SW_IS_PLOT (self));

  g_strfreev (self->categories);
  self->categories = g_new0 (char *, n + 1);
  for (guint i = 0; i < n; i++)
    self->categories[i] = g_strdup (labels != NULL && labels[i] != NULL ? labels[i] : "");
  invalidate (self);
}

void
sw_plot_set_x_format (SwPlot *self, const char *format, double scale)
{
  g_return_if_fail (SW_IS_PLOT (self));
  sw_plot_axis_set_format (&self->x, format, scale);
  invalidate (self);
}

void
sw_plot_set_y_format (SwPlot *self, const char *format, double scale)
{
  g_return_if_fail (SW_IS_PLOT (self));
  sw_plot_axis_set_format (&self->y, format, scale);
  invalidate (self);
}

void
sw_plot_set_readout_tooltip (SwPlot *self, gboolean tooltip)
{
  g_return_if_fail (SW_IS_PLOT (self));

  tooltip = !!tooltip;
  if (tooltip == self->readout_tooltip)
    return;
  self->readout_tooltip = tooltip;
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_READOUT_TOOLTIP]);
  gtk_widget_queue_draw (GTK_WIDGET (self));
}

gboolean
sw_plot_data_to_widget (SwPlot *self, double x, double y, double *wx, double *wy)
{
  double px, py;

  g_return_val_if_fail (SW_IS_PLOT (self), FALSE);

  if (gtk_widget_get_width (GTK_WIDGET (self)) <= 0)
    return FALSE;
  sw_plot_ensure_layout (self);
  if (!sw_plot_map_point (self, x, y, &px, &py))
    return FALSE;
  if (wx != NULL)
    *wx = px;
  if (wy != NULL)
    *wy = py;
  return TRUE;
}

gboolean
sw_plot_get_plot_area (SwPlot *self, graphene_rect_t *area)
{
  g_return_val_if_fail (SW_IS_PLOT (self), FALSE);

  if (gtk_widget_get_width (GTK_WIDGET (self)) <= 0)
    return FALSE;
  sw_plot_ensure_layout (self);
  if (area != NULL)
    *area = self->area;
  return TRUE;
}

void
sw_plot_set_x_integer (SwPlot *self, gboolean integer)
{
  g_return_if_fail (SW_IS_PLOT (self));
  self->x.integer = !!integer;
  invalidate (self);
}

void
sw_plot_set_empty_text (SwPlot *self, const char *text)
{
  g_return_if_fail (SW_IS_PLOT (self));
  if (g_strcmp0 (text, self->empty_text) == 0)
    return;
  g_free (self->empty_text);
  self->empty_text = g_strdup (text);
  invalidate (self);
}

gboolean
sw_plot_has_data (SwPlot *self)
{
  Extent ex, ey;

  data_extent (self, &ex, &ey);
  return ex.min <= ex.max && (sw_plot_categorical_y (self) || ey.min <= ey.max);
}
