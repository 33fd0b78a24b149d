/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-plot"

#include "config.h"

#include "sw-plot.h"

#include <math.h>
#include <string.h>

#define MARGIN 10.0
#define TICK_LEN 5.0
#define LEGEND_SAMPLE 30.0
#define HOVER_RADIUS 48.0
#define N_PALETTE 8

typedef struct {
  char       *name;
  double     *x;
  double     *y;
  guint       n;
  SwPlotStyle style;
  int         color;
  gboolean    highlighted;
} Series;

typedef struct {
  char   *name;
  double *x;
  double *lo;
  double *hi;
  guint   n;
  int     color;
} Band;

typedef struct {
  double       x;
  double       y;
  char        *label;
  SwMarkerKind kind;
} Marker;

typedef struct {
  double x;
  char  *label;
  int    color;
} VLine;

typedef struct {
  double   value;
  gboolean major;
  gboolean labelled;
  char    *text;
} Tick;

typedef struct {
  char    *label;
  gboolean log;
  double   fixed_min;
  double   fixed_max;
  char    *prefix;      /* around the number of the format */
  char    *spec;        /* a single printf conversion of a double */
  char    *suffix;
  double   scale;
  gboolean ticks_bare;  /* the label names the unit: ticks show numbers only */

  /* Layout: value v0 at pixel p0, v1 at p1 (v0 > v1 allowed). */
  double   v0, v1;
  double   p0, p1;
  GArray  *ticks;       /* Tick */
} Axis;

struct _SwPlot {
  GtkWidget  parent_instance;

  char      *title;
  Axis       x;
  Axis       y;
  GPtrArray *series;    /* Series */
  GPtrArray *bands;     /* Band */
  GPtrArray *markers;   /* Marker */
  GPtrArray *vlines;    /* VLine */
  GStrv      categories;
  int        next_color;
  gboolean   readout_tooltip;

  /* Layout */
  gboolean        layout_valid;
  int             layout_width;
  int             layout_height;
  graphene_rect_t area;
  double          legend_top;

  /* Hover */
  gboolean  hovering;
  double    hover_x;
  double    hover_y;
};

enum {
  PROP_0,
  PROP_TITLE,
  PROP_READOUT_TOOLTIP,
  N_PROPS
};

static GParamSpec *properties[N_PROPS];

G_DEFINE_FINAL_TYPE (SwPlot, sw_plot, GTK_TYPE_WIDGET)

/* The palette */

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

static void
get_fg (GtkWidget *widget, GdkRGBA *fg)
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
  get_fg (widget, &fg);
  return luminance (&fg) > 0.4;
}

/* The background the widget sits on: the theme's named colour when there is
 * one, else the usual window background for the light or dark variant. */
static void
get_bg (GtkWidget *widget, GdkRGBA *bg)
{
  static const char *const names[] = { "window_bg_color", "theme_bg_color", "theme_base_color" };
  gboolean dark = sw_plot_style_is_dark (widget);

  G_GNUC_BEGIN_IGNORE_DEPRECATIONS
  for (guint i = 0; i < G_N_ELEMENTS (names); i++)
    if (gtk_style_context_lookup_color (gtk_widget_get_style_context (widget), names[i], bg)
        && bg->alpha > 0.5)
      {
        GdkRGBA fg;
        get_fg (widget, &fg);
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
  get_fg (widget, &fg);
  if (index == N_PALETTE - 1)
    {
      *rgba = fg;
      rgba->alpha = 1.0;
      return;
    }
  get_bg (widget, &bg);
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

static void
set_source (cairo_t *cr, const GdkRGBA *c, double alpha)
{
  cairo_set_source_rgba (cr, c->red, c->green, c->blue, c->alpha * alpha);
}

/* Number formats */

/* Splits a printf format with one double conversion into prefix, the
 * conversion and suffix; anything else falls back to "%g". */
static void
axis_set_format (Axis *axis, const char *format, double scale)
{
  const char *p, *start = NULL, *end = NULL;

  g_clear_pointer (&axis->prefix, g_free);
  g_clear_pointer (&axis->spec, g_free);
  g_clear_pointer (&axis->suffix, g_free);
  axis->scale = isfinite (scale) && scale != 0.0 ? scale : 1.0;

  for (p = format != NULL ? format : ""; *p != '\0'; p++)
    {
      if (*p != '%')
        continue;
      if (p[1] == '%')
        {
          p++;
          continue;
        }
      if (start != NULL)
        {
          start = NULL;   /* two conversions: refuse */
          break;
        }
      start = p++;
      while (*p != '\0' && strchr ("-+ #0'", *p) != NULL)
        p++;
      while (g_ascii_isdigit (*p))
        p++;
      if (*p == '.')
        {
          p++;
          while (g_ascii_isdigit (*p))
            p++;
        }
      if (*p == '\0' || strchr ("fFeEgG", *p) == NULL)
        {
          start = NULL;
          break;
        }
      end = p + 1;
    }
  if (start == NULL || end == NULL)
    {
      if (format != NULL)
        g_warning ("Plot number format \"%s\" needs exactly one double conversion", format);
      axis->prefix = g_strdup ("");
      axis->spec = g_strdup ("%g");
      axis->suffix = g_strdup ("");
      return;
    }
  axis->prefix = g_strndup (format, start - format);
  axis->spec = g_strndup (start, end - start);
  axis->suffix = g_strdup (end);
  /* "%%" in the fixed parts prints one percent sign. */
  {
    g_autofree char *a = axis->prefix, *b = axis->suffix;
    g_auto (GStrv) pa = g_strsplit (a, "%%", -1);
    g_auto (GStrv) pb = g_strsplit (b, "%%", -1);
    axis->prefix = g_strjoinv ("%", pa);
    axis->suffix = g_strjoinv ("%", pb);
  }
}

static const char *const superscripts[] = {
  "⁰", "¹", "²", "³", "⁴", "⁵", "⁶", "⁷", "⁸", "⁹"
};

/* Thin spaces between groups of three digits, a real minus sign. */
static char *
tidy_number (const char *text)
{
  GString *out = g_string_new (NULL);
  const char *p = text;
  const char *digits, *q;
  gsize n;

  if (*p == '-')
    {
      g_string_append (out, "−");
      p++;
    }
  digits = p;
  for (q = p; g_ascii_isdigit (*q); q++)
    ;
  n = q - digits;
  for (gsize i = 0; i < n; i++)
    {
      if (i > 0 && (n - i) % 3 == 0 && n >= 5)
        g_string_append (out, " ");
      g_string_append_c (out, digits[i]);
    }
  g_string_append (out, q);
  return g_string_free (out, FALSE);
}

static char *
power_of_ten (int exponent)
{
  GString *out = g_string_new ("10");
  char buf[16];

  g_snprintf (buf, sizeof buf, "%d", exponent);
  for (const char *p = buf; *p != '\0'; p++)
    g_string_append (out, *p == '-' ? "⁻" : superscripts[*p - '0']);
  return g_string_free (out, FALSE);
}

/* @precision < 0: the axis's own conversion (readout); else fixed decimals. */
static char *
axis_format (const Axis *axis, double value, int precision, gboolean bare)
{
  const char *prefix = bare ? "" : axis->prefix;
  const char *suffix = bare ? "" : axis->suffix;
  double v = value / axis->scale;
  char buf[64];

  if (!isfinite (value))
    return g_strdup ("—");
  if (v != 0.0 && (fabs (v) >= 1e7 || fabs (v) < 1e-3))
    {
      int e = (int) floor (log10 (fabs (v)) + 1e-9);
      double m = v / pow (10.0, e);
      g_autofree char *p10 = power_of_ten (e);
      if (fabs (m - 1.0) < 1e-6)
        g_snprintf (buf, sizeof buf, "%s", p10);
      else
        g_snprintf (buf, sizeof buf, "%.*f×%s", precision < 0 ? 2 : 1, m, p10);
      return g_strconcat (prefix, v < 0 ? "−" : "", buf, suffix, NULL);
    }
  if (precision < 0)
    {
#pragma GCC diagnostic push
#pragma GCC diagnostic ignored "-Wformat-nonliteral"
      g_snprintf (buf, sizeof buf, axis->spec, v);
#pragma GCC diagnostic pop
    }
  else
    g_snprintf (buf, sizeof buf, "%.*f", precision, v);
  if (strcmp (buf, "-0") == 0)
    buf[0] = '0', buf[1] = '\0';
  {
    g_autofree char *tidy = tidy_number (buf);
    return g_strconcat (prefix, tidy, suffix, NULL);
  }
}

/* Axis helpers */

static double
axis_t (const Axis *axis, double v)
{
  return axis->log ? log10 (v) : v;
}

static gboolean
axis_valid_value (const Axis *axis, double v)
{
  return isfinite (v) && (!axis->log || v > 0.0);
}

static double
axis_map (const Axis *axis, double v)
{
  double t0 = axis_t (axis, axis->v0), t1 = axis_t (axis, axis->v1);

  return axis->p0 + (axis_t (axis, v) - t0) / (t1 - t0) * (axis->p1 - axis->p0);
}

static void
tick_clear (gpointer data)
{
  g_free (((Tick *) data)->text);
}

static void
axis_init (Axis *axis)
{
  axis->fixed_min = NAN;
  axis->fixed_max = NAN;
  axis->ticks = g_array_new (FALSE, TRUE, sizeof (Tick));
  g_array_set_clear_func (axis->ticks, tick_clear);
  axis_set_format (axis, NULL, 1.0);
}

static void
axis_clear (Axis *axis)
{
  g_clear_pointer (&axis->label, g_free);
  g_clear_pointer (&axis->prefix, g_free);
  g_clear_pointer (&axis->spec, g_free);
  g_clear_pointer (&axis->suffix, g_free);
  g_clear_pointer (&axis->ticks, g_array_unref);
}

static double
nice_step (double span, double count)
{
  double raw = span / MAX (count, 1.0);
  double mag = pow (10.0, floor (log10 (raw)));
  double r = raw / mag;

  if (r < 1.5)
    return mag;
  if (r < 3.0)
    return 2.0 * mag;
  if (r < 7.0)
    return 5.0 * mag;
  return 10.0 * mag;
}

static double
nice_125_floor (double v)
{
  double mag = pow (10.0, floor (log10 (v) + 1e-12));
  double r = v / mag;

  return (r >= 5.0 - 1e-9 ? 5.0 : r >= 2.0 - 1e-9 ? 2.0 : 1.0) * mag;
}

static double
nice_125_ceil (double v)
{
  double mag = pow (10.0, floor (log10 (v) - 1e-12));
  double r = v / mag;

  return (r <= 1.0 + 1e-9 ? 1.0 : r <= 2.0 + 1e-9 ? 2.0 : r <= 5.0 + 1e-9 ? 5.0 : 10.0) * mag;
}

/* Data extent */

typedef struct {
  double min, max;
} Extent;

static void
extent_add (Extent *e, const Axis *axis, double v)
{
  if (!axis_valid_value (axis, v))
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

static guint
n_categories (SwPlot *self)
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

static gboolean
categorical_y (SwPlot *self)
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
          if (!axis_valid_value (&self->x, s->x[k]) || !axis_valid_value (&self->y, s->y[k]))
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
        if (axis_valid_value (&self->x, b->x[k]))
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
      if (axis_valid_value (&self->x, m->x))
        extent_add (ey, &self->y, m->y);
    }
  for (guint i = 0; i < self->vlines->len; i++)
    extent_add (ex, &self->x, ((VLine *) g_ptr_array_index (self->vlines, i))->x);
}

/* Ticks */

static int
decimals_for (double step)
{
  return MAX (0, (int) -floor (log10 (step) + 1e-9));
}

static void
add_tick (Axis *axis, double v, gboolean major, int precision)
{
  Tick t = { v, major, FALSE, NULL };

  t.text = axis_format (axis, v, precision, axis->ticks_bare);
  g_array_append_val (axis->ticks, t);
}

static double
text_extent (SwPlot *self, const char *text, gboolean horizontal)
{
  PangoLayout *layout = gtk_widget_create_pango_layout (GTK_WIDGET (self), text);
  int w, h;

  pango_layout_get_pixel_size (layout, &w, &h);
  g_object_unref (layout);
  return horizontal ? w : h;
}

/* Labels every major tick whose label does not crowd an already labelled
 * one; on a wide log axis the decades come first, then the 2s and 5s where
 * there is room. */
static void
axis_choose_labels (SwPlot *self, Axis *axis, gboolean horizontal, gboolean decades)
{
  GArray *placed = g_array_new (FALSE, FALSE, sizeof (double) * 2);
  double gap = horizontal ? 16.0 : 6.0;

  for (int pass = 0; pass < (decades ? 2 : 1); pass++)
    {
      for (guint i = 0; i < axis->ticks->len; i++)
        {
          Tick *t = &g_array_index (axis->ticks, Tick, i);
          double c, half, span[2];
          gboolean clash = FALSE;

          if (t->labelled)
            continue;
          if (decades && pass == 1)
            {
              double m = t->value / pow (10.0, floor (log10 (t->value) + 1e-9));
              if (!(fabs (m - 2.0) < 1e-6 || fabs (m - 5.0) < 1e-6))
                continue;
            }
          else if (!t->major)
            continue;
          c = axis_map (axis, t->value);
          half = (text_extent (self, t->text, horizontal) + gap) / 2.0;
          span[0] = c - half;
          span[1] = c + half;
          for (guint k = 0; k < placed->len && !clash; k++)
            {
              double *o = &g_array_index (placed, double, 2 * k);
              clash = span[0] < o[1] && span[1] > o[0];
            }
          /* Along x, 2 and 5 need room around them too, not just no overlap. */
          if (pass == 1 && horizontal)
            for (guint k = 0; k < placed->len && !clash; k++)
              {
                double *o = &g_array_index (placed, double, 2 * k);
                clash = span[0] < o[1] + gap && span[1] > o[0] - gap;
              }
          if (clash)
            continue;
          t->labelled = TRUE;
          g_array_append_vals (placed, span, 1);
        }
    }
  g_array_unref (placed);
}

/* The view range and the ticks of a numeric axis between pixels @p0 (the
 * low end) and @p1.  Automatic ends are rounded outwards to a tick; the
 * step grows until the labels fit. */
static void
axis_compute (SwPlot *self, Axis *axis, const Extent *e, double p0, double p1,
              gboolean horizontal)
{
  double length = fabs (p1 - p0);
  double spacing = horizontal ? 90.0 : 45.0;
  gboolean auto_min = !(isfinite (axis->fixed_min) && axis_valid_value (axis, axis->fixed_min));
  gboolean auto_max = !(isfinite (axis->fixed_max) && axis_valid_value (axis, axis->fixed_max));
  double a = e->min, b = e->max;

  axis->p0 = p0;
  axis->p1 = p1;
  g_array_set_size (axis->ticks, 0);

  if (!(a <= b))
    {
      a = axis->log ? 1.0 : 0.0;
      b = axis->log ? 10.0 : 1.0;
    }
  if (!auto_min)
    a = axis->fixed_min;
  if (!auto_max)
    b = axis->fixed_max;
  if (b < a)
    {
      double t = a;
      a = b;
      b = t;
    }
  /* Ends that differ only by rounding (a flat curve) are one value: a tick
   * step that small would leave k * minor below unchanged by k++ and the
   * tick loop would never end. */
  if (b - a <= 1e-9 * MAX (fabs (a), fabs (b)))
    {
      if (axis->log)
        {
          a /= 2.0;
          b *= 2.0;
        }
      else
        {
          double d = a != 0.0 ? fabs (a) * 0.1 : 1.0;
          a -= d;
          b += d;
        }
    }

  if (axis->log && b / a >= 4.0)
    {
      /* Wide log axis: decades, minor ticks at 2..9. */
      int d0, d1;
      if (auto_min)
        a = nice_125_floor (a);
      if (auto_max)
        b = nice_125_ceil (b);
      axis->v0 = a;
      axis->v1 = b;
      d0 = (int) floor (log10 (a) + 1e-9);
      d1 = (int) ceil (log10 (b) - 1e-9);
      for (int d = d0; d <= d1; d++)
        for (int m = 1; m <= 9; m++)
          {
            double v = m * pow (10.0, d);
            if (v < a * (1 - 1e-9) || v > b * (1 + 1e-9))
              continue;
            add_tick (axis, v, m == 1, decimals_for (v / axis->scale));
          }
      axis_choose_labels (self, axis, horizontal, TRUE);
      return;
    }

  /* Linear steps (also on a log axis that spans less than a factor of four). */
  for (double count = MAX (length / spacing, 1.0); ; count *= 0.6)
    {
      double step = nice_step (b - a, count);
      double lo = auto_min ? floor (a / step + 1e-9) * step : a;
      double hi = auto_max ? ceil (b / step - 1e-9) * step : b;
      double mant = step / pow (10.0, floor (log10 (step) + 1e-9));
      double minor = step / (fabs (mant - 2.0) < 1e-6 ? 4.0 : 5.0);
      int prec = decimals_for (step / axis->scale);
      double widest = 0.0, closest = INFINITY, prev = NAN;

      if (axis->log && !(lo > 0.0))
        lo = a;
      if (hi <= lo)
        hi = lo + step;
      axis->v0 = lo;
      axis->v1 = hi;
      g_array_set_size (axis->ticks, 0);
      for (double k = ceil (lo / minor - 1e-9); k * minor <= hi + minor * 1e-9; k++)
        {
          double v = fabs (k * minor) < minor * 1e-9 ? 0.0 : k * minor;
          gboolean major = fabs (v / step - round (v / step)) < 1e-6;
          if (axis->log && v <= 0.0)
            continue;
          add_tick (axis, v, major, prec);
          if (major)
            {
              Tick *t = &g_array_index (axis->ticks, Tick, axis->ticks->len - 1);
              double p = axis_map (axis, v);
              widest = MAX (widest, text_extent (self, t->text, horizontal));
              if (isfinite (prev))
                closest = MIN (closest, fabs (p - prev));
              prev = p;
            }
        }
      if (closest >= widest + (horizontal ? 16.0 : 6.0) || count < 1.5)
        break;
    }
  axis_choose_labels (self, axis, horizontal, FALSE);
}

/* Layout */

static PangoLayout *
make_layout (SwPlot *self, const char *markup)
{
  PangoLayout *layout = gtk_widget_create_pango_layout (GTK_WIDGET (self), NULL);

  pango_layout_set_markup (layout, markup, -1);
  return layout;
}

static PangoLayout *
make_text (SwPlot *self, const char *text)
{
  return gtk_widget_create_pango_layout (GTK_WIDGET (self), text);
}

static PangoLayout *
title_layout (SwPlot *self)
{
  g_autofree char *markup = NULL;

  if (self->title == NULL || self->title[0] == '\0')
    return NULL;
  markup = g_markup_printf_escaped ("<span weight='bold' size='large'>%s</span>", self->title);
  return make_layout (self, markup);
}

typedef struct {
  const char *name;
  int         color;
  SwPlotStyle style;
  gboolean    band;
} LegendEntry;

static GArray *
legend_entries (SwPlot *self)
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

/* Lays out (or with @cr, draws) the legend rows; returns their height. */
static double draw_legend (SwPlot *self, cairo_t *cr, double left, double top, double width);

static double
text_height (SwPlot *self)
{
  PangoLayout *probe = make_text (self, "Mg");
  int h;

  pango_layout_get_pixel_size (probe, NULL, &h);
  g_object_unref (probe);
  return h;
}

static double
max_tick_extent (SwPlot *self, Axis *axis, gboolean width)
{
  double m = 0.0;

  for (guint i = 0; i < axis->ticks->len; i++)
    {
      Tick *t = &g_array_index (axis->ticks, Tick, i);
      PangoLayout *layout;
      int w, h;
      if (!t->labelled)
        continue;
      layout = make_text (self, t->text);
      pango_layout_get_pixel_size (layout, &w, &h);
      g_object_unref (layout);
      m = MAX (m, width ? w : h);
    }
  return m;
}

static double
category_width (SwPlot *self)
{
  double m = 0.0;
  guint n = self->categories != NULL ? g_strv_length (self->categories) : 0;

  for (guint i = 0; i < n; i++)
    {
      PangoLayout *layout = make_text (self, self->categories[i]);
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
  PangoLayout *title = title_layout (self);
  double th = text_height (self);
  double top = MARGIN, bottom, left, right;
  double y_tick_w = 40.0;
  Extent ex, ey;
  gboolean cat = categorical_y (self);

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
  top += draw_legend (self, NULL, MARGIN, top, width - 2 * MARGIN);
  top += th / 2.0 + 2.0;   /* room for the top tick label */

  bottom = height - MARGIN - (self->x.label != NULL ? th + 4.0 : 0.0) - th - TICK_LEN - 4.0;
  right = width - MARGIN - 12.0;
  data_extent (self, &ex, &ey);

  /* Two passes: the width of the y labels depends on the ticks, which
   * depend on the height, which does not depend on the width. */
  for (int pass = 0; pass < 2; pass++)
    {
      left = MARGIN + (self->y.label != NULL ? th + 6.0 : 0.0) + y_tick_w + TICK_LEN + 4.0;
      self->area = GRAPHENE_RECT_INIT (left, top, MAX (right - left, 10.0),
                                       MAX (bottom - top, 10.0));

      axis_compute (self, &self->x, &ex, self->area.origin.x,
                    self->area.origin.x + self->area.size.width, TRUE);
      if (cat)
        {
          guint n = MAX (n_categories (self), 1);
          self->y.v0 = n - 0.5;
          self->y.v1 = -0.5;
          self->y.p0 = self->area.origin.y + self->area.size.height;
          self->y.p1 = self->area.origin.y;
          g_array_set_size (self->y.ticks, 0);
        }
      else
        {
          axis_compute (self, &self->y, &ey, self->area.origin.y + self->area.size.height,
                        self->area.origin.y, FALSE);
          y_tick_w = max_tick_extent (self, &self->y, TRUE);
        }
      if (cat)
        y_tick_w = category_width (self);
    }
}

static void
ensure_layout (SwPlot *self)
{
  int w = gtk_widget_get_width (GTK_WIDGET (self));
  int h = gtk_widget_get_height (GTK_WIDGET (self));

  if (!self->layout_valid || w != self->layout_width || h != self->layout_height)
    plot_layout (self, w, h);
}

static void
invalidate (SwPlot *self)
{
  self->layout_valid = FALSE;
  gtk_widget_queue_draw (GTK_WIDGET (self));
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

static gboolean
map_point (SwPlot *self, double x, double y, double *px, double *py)
{
  if (!axis_valid_value (&self->x, x) || !axis_valid_value (&self->y, y))
    return FALSE;
  *px = axis_map (&self->x, x);
  *py = axis_map (&self->y, y);
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
      if (!map_point (self, x[k], y[k], &qx, &qy))
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

typedef struct {
  GdkRGBA fg;
  GdkRGBA bg;
  GdkRGBA palette[N_PALETTE];
} Colors;

static void
get_colors (SwPlot *self, Colors *c)
{
  get_fg (GTK_WIDGET (self), &c->fg);
  get_bg (GTK_WIDGET (self), &c->bg);
  for (int i = 0; i < N_PALETTE; i++)
    sw_plot_palette_color (GTK_WIDGET (self), i, &c->palette[i]);
}

static const GdkRGBA *
palette (const Colors *c, int index)
{
  return &c->palette[((index % N_PALETTE) + N_PALETTE) % N_PALETTE];
}

static void
draw_legend_sample (cairo_t *cr, const Colors *c, const LegendEntry *e, double x, double y,
                    double h)
{
  const GdkRGBA *col = palette (c, e->color);
  double cy = y + h / 2.0;

  if (e->band || e->style == SW_PLOT_BARS || e->style == SW_PLOT_HBARS)
    {
      set_source (cr, col, e->band ? 0.25 : 0.75);
      cairo_rectangle (cr, x + 4.0, y + 3.0, LEGEND_SAMPLE - 8.0, h - 6.0);
      cairo_fill (cr);
      return;
    }
  set_source (cr, col, 1.0);
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

static double
draw_legend (SwPlot *self, cairo_t *cr, double left, double top, double width)
{
  g_autoptr (GArray) entries = legend_entries (self);
  double th = text_height (self);
  double x = left, y = top;
  Colors c;

  if (entries->len == 0)
    return 0.0;
  if (cr != NULL)
    get_colors (self, &c);
  for (guint i = 0; i < entries->len; i++)
    {
      LegendEntry *e = &g_array_index (entries, LegendEntry, i);
      PangoLayout *layout = make_text (self, e->name);
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
          set_source (cr, &c.fg, 1.0);
          cairo_move_to (cr, x + LEGEND_SAMPLE + 6.0, y);
          pango_cairo_show_layout (cr, layout);
        }
      g_object_unref (layout);
      x += item_w + 18.0;
    }
  return y - top + th + 6.0;
}

/* Label boxes that must not overlap one another. */
typedef struct {
  GArray *rects;   /* graphene_rect_t */
} Placer;

static gboolean
placer_free (Placer *pl, const graphene_rect_t *r)
{
  for (guint i = 0; i < pl->rects->len; i++)
    if (graphene_rect_intersection (&g_array_index (pl->rects, graphene_rect_t, i), r, NULL))
      return FALSE;
  return TRUE;
}

static void
draw_boxed_text (cairo_t *cr, PangoLayout *layout, double x, double y, const Colors *c,
                 const GdkRGBA *text, const GdkRGBA *frame)
{
  int w, h;

  pango_layout_get_pixel_size (layout, &w, &h);
  set_source (cr, &c->bg, 0.88);
  cairo_rectangle (cr, x - 3.0, y - 1.0, w + 6.0, h + 2.0);
  cairo_fill (cr);
  if (frame != NULL)
    {
      set_source (cr, frame, 1.0);
      cairo_set_line_width (cr, 1.0);
      cairo_rectangle (cr, x - 3.5, y - 1.5, w + 7.0, h + 3.0);
      cairo_stroke (cr);
    }
  set_source (cr, text, 1.0);
  cairo_move_to (cr, x, y);
  pango_cairo_show_layout (cr, layout);
}

/* Places a label near (px, py), trying the four quadrants, inside the area. */
static void
place_label (SwPlot *self, Placer *pl, PangoLayout *layout, double px, double py, double off,
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
  double th = text_height (self);
  gboolean cat = categorical_y (self);

  /* Grid */
  cairo_set_line_width (cr, 1.0);
  for (guint i = 0; i < self->x.ticks->len; i++)
    {
      Tick *t = &g_array_index (self->x.ticks, Tick, i);
      double px = round (axis_map (&self->x, t->value)) + 0.5;
      if (!t->major && !self->x.log)
        continue;   /* minor grid lines only on log axes */
      set_source (cr, &c->fg, t->major ? 0.13 : 0.06);
      cairo_move_to (cr, px, a->origin.y);
      cairo_line_to (cr, px, a->origin.y + a->size.height);
      cairo_stroke (cr);
    }
  for (guint i = 0; i < self->y.ticks->len; i++)
    {
      Tick *t = &g_array_index (self->y.ticks, Tick, i);
      double py = round (axis_map (&self->y, t->value)) + 0.5;
      if (!t->major && !self->y.log)
        continue;   /* minor grid lines only on log axes */
      set_source (cr, &c->fg, t->major ? 0.13 : 0.06);
      cairo_move_to (cr, a->origin.x, py);
      cairo_line_to (cr, a->origin.x + a->size.width, py);
      cairo_stroke (cr);
    }

  /* Frame: the two axes stronger */
  set_source (cr, &c->fg, 0.25);
  cairo_rectangle (cr, round (a->origin.x) + 0.5, round (a->origin.y) + 0.5,
                   round (a->size.width), round (a->size.height));
  cairo_stroke (cr);
  set_source (cr, &c->fg, 0.8);
  cairo_move_to (cr, round (a->origin.x) + 0.5, round (a->origin.y) + 0.5);
  cairo_line_to (cr, round (a->origin.x) + 0.5, round (a->origin.y + a->size.height) + 0.5);
  cairo_line_to (cr, round (a->origin.x + a->size.width) + 0.5,
                 round (a->origin.y + a->size.height) + 0.5);
  cairo_stroke (cr);

  /* Ticks and labels */
  for (guint i = 0; i < self->x.ticks->len; i++)
    {
      Tick *t = &g_array_index (self->x.ticks, Tick, i);
      double px = round (axis_map (&self->x, t->value)) + 0.5;
      double y0 = round (a->origin.y + a->size.height) + 0.5;
      set_source (cr, &c->fg, 0.8);
      cairo_move_to (cr, px, y0);
      cairo_line_to (cr, px, y0 + (t->labelled ? TICK_LEN : TICK_LEN / 2.0));
      cairo_stroke (cr);
      if (t->labelled)
        {
          PangoLayout *layout = make_text (self, t->text);
          int w;
          pango_layout_get_pixel_size (layout, &w, NULL);
          set_source (cr, &c->fg, 1.0);
          cairo_move_to (cr, CLAMP (px - w / 2.0, 0.0, self->layout_width - w),
                         y0 + TICK_LEN + 2.0);
          pango_cairo_show_layout (cr, layout);
          g_object_unref (layout);
        }
    }
  for (guint i = 0; i < self->y.ticks->len; i++)
    {
      Tick *t = &g_array_index (self->y.ticks, Tick, i);
      double py = round (axis_map (&self->y, t->value)) + 0.5;
      double x0 = round (a->origin.x) + 0.5;
      set_source (cr, &c->fg, 0.8);
      cairo_move_to (cr, x0, py);
      cairo_line_to (cr, x0 - (t->labelled ? TICK_LEN : TICK_LEN / 2.0), py);
      cairo_stroke (cr);
      if (t->labelled)
        {
          PangoLayout *layout = make_text (self, t->text);
          int w, h;
          pango_layout_get_pixel_size (layout, &w, &h);
          set_source (cr, &c->fg, 1.0);
          cairo_move_to (cr, x0 - TICK_LEN - 4.0 - w, py - h / 2.0);
          pango_cairo_show_layout (cr, layout);
          g_object_unref (layout);
        }
    }
  if (cat && self->categories != NULL)
    {
      double cw = category_width (self);
      for (guint i = 0; self->categories[i] != NULL; i++)
        {
          PangoLayout *layout = make_text (self, self->categories[i]);
          double py = axis_map (&self->y, i);
          int w, h;
          pango_layout_set_ellipsize (layout, PANGO_ELLIPSIZE_END);
          pango_layout_set_width (layout, (int) (cw * PANGO_SCALE));
          pango_layout_get_pixel_size (layout, &w, &h);
          set_source (cr, &c->fg, 1.0);
          cairo_move_to (cr, a->origin.x - TICK_LEN - 4.0 - w, py - h / 2.0);
          pango_cairo_show_layout (cr, layout);
          g_object_unref (layout);
        }
    }

  /* Axis titles */
  set_source (cr, &c->fg, 1.0);
  if (self->x.label != NULL)
    {
      PangoLayout *layout = make_text (self, self->x.label);
      int w;
      pango_layout_get_pixel_size (layout, &w, NULL);
      cairo_move_to (cr, a->origin.x + (a->size.width - w) / 2.0,
                     self->layout_height - MARGIN - th);
      pango_cairo_show_layout (cr, layout);
      g_object_unref (layout);
    }
  if (self->y.label != NULL)
    {
      PangoLayout *layout = make_text (self, self->y.label);
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

      set_source (cr, palette (c, b->color), 0.22);
      while (k < b->n)
        {
          guint start, end;
          double px, py;
          /* One polygon per run of drawable points. */
          while (k < b->n && !(map_point (self, b->x[k], b->lo[k], &px, &py)
                               && map_point (self, b->x[k], b->hi[k], &px, &py)))
            k++;
          start = k;
          while (k < b->n && map_point (self, b->x[k], b->lo[k], &px, &py)
                 && map_point (self, b->x[k], b->hi[k], &px, &py))
            k++;
          end = k;
          if (end - start < 2)
            continue;
          for (guint j = start; j < end; j++)
            {
              map_point (self, b->x[j], b->hi[j], &px, &py);
              cairo_line_to (cr, px, CLAMP (py, -1e5, 1e5));
            }
          for (guint j = end; j-- > start;)
            {
              map_point (self, b->x[j], b->lo[j], &px, &py);
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
  const GdkRGBA *col = palette (c, s->color);

  if (s->style == SW_PLOT_BARS)
    {
      double spacing = INFINITY, base;
      for (guint k = 0; k + 1 < s->n; k++)
        if (axis_valid_value (&self->x, s->x[k]) && axis_valid_value (&self->x, s->x[k + 1]))
          spacing = MIN (spacing, fabs (axis_map (&self->x, s->x[k + 1])
                                        - axis_map (&self->x, s->x[k])));
      if (!isfinite (spacing) || spacing <= 0.0)
        spacing = 24.0;
      base = !self->y.log && 0.0 >= MIN (self->y.v0, self->y.v1)
             && 0.0 <= MAX (self->y.v0, self->y.v1)
             ? axis_map (&self->y, 0.0) : self->area.origin.y + self->area.size.height;
      for (guint k = 0; k < s->n; k++)
        {
          double px, py, w = spacing * 0.9 / n_slots;
          if (!map_point (self, s->x[k], s->y[k], &px, &py))
            continue;
          px = px - spacing * 0.45 + slot * w;
          set_source (cr, col, 0.7);
          cairo_rectangle (cr, px, MIN (py, base), w, fabs (base - py));
          cairo_fill_preserve (cr);
          set_source (cr, col, 1.0);
          cairo_set_line_width (cr, 1.0);
          cairo_stroke (cr);
        }
    }
  else
    {
      double slot_h = fabs (axis_map (&self->y, 1.0) - axis_map (&self->y, 0.0));
      double h = slot_h * 0.7 / n_slots;
      double base = !self->x.log && 0.0 >= self->x.v0 && 0.0 <= self->x.v1
                    ? axis_map (&self->x, 0.0) : self->area.origin.x;
      for (guint k = 0; k < s->n; k++)
        {
          double px, py;
          if (!axis_valid_value (&self->x, s->x[k]))
            continue;
          px = axis_map (&self->x, s->x[k]);
          py = axis_map (&self->y, k) - slot_h * 0.35 + slot * h;
          set_source (cr, col, 0.7);
          cairo_rectangle (cr, MIN (px, base), py, fabs (px - base), h);
          cairo_fill_preserve (cr);
          set_source (cr, col, 1.0);
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
      double px = round (axis_map (&self->x, 0.0)) + 0.5;
      set_source (cr, &c->fg, 0.6);
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
        const GdkRGBA *col = palette (c, s->color);
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
            set_source (cr, col, alpha);
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
                if (!map_point (self, s->x[k], s->y[k], &px, &py)
                    || !graphene_rect_contains_point (&self->area,
                                                      &GRAPHENE_POINT_INIT (px, py)))
                  continue;
                draw_shape (cr, shape_for (s->color), px, py, s->highlighted ? 5.5 : 4.5);
                set_source (cr, col, alpha);
                cairo_fill_preserve (cr);
                set_source (cr, &c->bg, 0.9);
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
      const GdkRGBA *col = palette (c, v->color);
      double px;

      if (!axis_valid_value (&self->x, v->x))
        continue;
      px = axis_map (&self->x, v->x);
      if (px < a->origin.x - 0.5 || px > a->origin.x + a->size.width + 0.5)
        continue;
      cairo_save (cr);
      cairo_set_dash (cr, dash, 2, 0.0);
      cairo_set_line_width (cr, 1.5);
      set_source (cr, col, 1.0);
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

      if (v->label == NULL || !axis_valid_value (&self->x, v->x))
        continue;
      px = axis_map (&self->x, v->x);
      if (px < a->origin.x - 0.5 || px > a->origin.x + a->size.width + 0.5)
        continue;
      layout = make_text (self, v->label);
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
      draw_boxed_text (cr, layout, x, y, c, palette (c, v->color), NULL);
      g_object_unref (layout);
    }
}

static gboolean
marker_position (SwPlot *self, Marker *m, double *px, double *py, gboolean *off_scale)
{
  const graphene_rect_t *a = &self->area;

  if (!axis_valid_value (&self->x, m->x))
    return FALSE;
  *px = axis_map (&self->x, m->x);
  *off_scale = !axis_valid_value (&self->y, m->y);
  /* No value (an infeasible point): drawn along the top edge. */
  *py = *off_scale ? a->origin.y + 10.0 : axis_map (&self->y, m->y);
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
          set_source (cr, &c->bg, 1.0);
          cairo_fill (cr);
          cairo_arc (cr, px, py, 6.0, 0, 2 * G_PI);
          set_source (cr, &c->fg, 1.0);
          cairo_fill (cr);
          break;
        case SW_MARKER_INFEASIBLE:
          cairo_set_line_width (cr, 5.0);
          set_source (cr, &c->bg, 0.9);
          cairo_move_to (cr, px - 6, py - 6);
          cairo_line_to (cr, px + 6, py + 6);
          cairo_move_to (cr, px + 6, py - 6);
          cairo_line_to (cr, px - 6, py + 6);
          cairo_stroke (cr);
          cairo_set_line_width (cr, 2.5);
          set_source (cr, &c->palette[1], 1.0);
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
          set_source (cr, &c->fg, 1.0);
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
          layout = make_layout (self, markup);
          if (off_scale)
            place_label_below (self, pl, layout, px, py, 9.0, &lx, &ly);
          else
            place_label (self, pl, layout, px, py, 9.0, &lx, &ly);
          draw_boxed_text (cr, layout, lx, ly, c,
                           m->kind == SW_MARKER_INFEASIBLE ? &c->palette[1] : &c->fg, NULL);
          g_object_unref (layout);
        }
    }
}

/* Hover readout */

static char *
short_axis_label (const Axis *axis, const char *fallback)
{
  const char *l = axis->label != NULL ? axis->label : fallback;
  const char *paren = strstr (l, " (");

  return paren != NULL ? g_strndup (l, paren - l) : g_strdup (l);
}

/* The nearest drawn point to the pointer: of the series, then of the markers. */
static gboolean
hover_find (SwPlot *self, double hx, double hy, double *px_out, double *py_out, char **text,
            int *color)
{
  double best = HOVER_RADIUS;
  Series *best_s = NULL;
  Marker *best_m = NULL;
  guint best_k = 0;
  gboolean cat = categorical_y (self);

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
              if (!axis_valid_value (&self->x, s->x[k]))
                continue;
              px = axis_map (&self->x, s->x[k]);
              py = axis_map (&self->y, k);
              /* Anywhere along the bar counts. */
              d = fabs (hy - py) + (hx > px ? hx - px : 0.0);
            }
          else
            {
              if (!map_point (self, s->x[k], s->y[k], &px, &py))
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
      if (!map_point (self, m->x, m->y, &px, &py))
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
      g_autofree char *xs = axis_format (&self->x, best_m->x, -1, FALSE);
      g_autofree char *ys = axis_format (&self->y, best_m->y, -1, FALSE);
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
      g_autofree char *xs = axis_format (&self->x, best_s->x[best_k], -1, FALSE);
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
          g_autofree char *ys = axis_format (&self->y, best_s->y[best_k], -1, FALSE);
          g_autofree char *yl = short_axis_label (&self->y, "y");
          *text = g_markup_printf_escaped ("<b>%s</b>\n%s: %s\n%s: %s", name, xl, xs, yl, ys);
        }
      *color = best_s->color;
      return TRUE;
    }
  return FALSE;
}

static void
draw_readout (SwPlot *self, cairo_t *cr, const Colors *c)
{
  g_autofree char *text = NULL;
  double px, py, lx, ly;
  int color;
  PangoLayout *layout;
  Placer pl = { g_array_new (FALSE, FALSE, sizeof (graphene_rect_t)) };

  if (!hover_find (self, self->hover_x, self->hover_y, &px, &py, &text, &color))
    {
      g_array_unref (pl.rects);
      return;
    }
  cairo_new_path (cr);
  cairo_arc (cr, px, py, 8.0, 0, 2 * G_PI);
  set_source (cr, palette (c, color), 1.0);
  cairo_set_line_width (cr, 2.0);
  cairo_stroke (cr);

  layout = make_layout (self, text);
  place_label (self, &pl, layout, px, py, 14.0, &lx, &ly);
  draw_boxed_text (cr, layout, lx, ly, c, &c->fg, palette (c, color));
  g_object_unref (layout);
  g_array_unref (pl.rects);
}

static void
sw_plot_snapshot (GtkWidget *widget, GtkSnapshot *snapshot)
{
  SwPlot *self = SW_PLOT (widget);
  int width = gtk_widget_get_width (widget);
  int height = gtk_widget_get_height (widget);
  PangoLayout *title;
  Placer pl;
  cairo_t *cr;
  Colors c;

  if (width <= 0 || height <= 0)
    return;
  ensure_layout (self);
  get_colors (self, &c);
  cr = gtk_snapshot_append_cairo (snapshot, &GRAPHENE_RECT_INIT (0, 0, width, height));

  title = title_layout (self);
  if (title != NULL)
    {
      int w;
      pango_layout_get_pixel_size (title, &w, NULL);
      set_source (cr, &c.fg, 1.0);
      cairo_move_to (cr, MAX (MARGIN, self->area.origin.x + (self->area.size.width - w) / 2.0),
                     MARGIN);
      pango_cairo_show_layout (cr, title);
      g_object_unref (title);
    }
  draw_legend (self, cr, MARGIN, self->legend_top, width - 2 * MARGIN);
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

  if (self->hovering && !self->readout_tooltip)
    draw_readout (self, cr, &c);

  cairo_destroy (cr);
}

static gboolean
query_tooltip_cb (SwPlot *self, int x, int y, gboolean keyboard, GtkTooltip *tooltip)
{
  g_autofree char *text = NULL;
  double px, py;
  int color;

  if (!self->readout_tooltip || keyboard)
    return FALSE;
  ensure_layout (self);
  if (!hover_find (self, x, y, &px, &py, &text, &color))
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
  SW_PLOT (widget)->layout_valid = FALSE;
}

static void
sw_plot_css_changed (GtkWidget *widget, GtkCssStyleChange *change)
{
  GTK_WIDGET_CLASS (sw_plot_parent_class)->css_changed (widget, change);
  invalidate (SW_PLOT (widget));
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
  axis_clear (&self->x);
  axis_clear (&self->y);
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
  GtkEventController *motion = gtk_event_controller_motion_new ();

  axis_init (&self->x);
  axis_init (&self->y);
  self->series = g_ptr_array_new_with_free_func (series_free);
  self->bands = g_ptr_array_new_with_free_func (band_free);
  self->markers = g_ptr_array_new_with_free_func (marker_free);
  self->vlines = g_ptr_array_new_with_free_func (vline_free);

  g_signal_connect (motion, "motion", G_CALLBACK (motion_cb), self);
  g_signal_connect (motion, "leave", G_CALLBACK (leave_cb), self);
  gtk_widget_add_controller (GTK_WIDGET (self), motion);
  gtk_widget_set_has_tooltip (GTK_WIDGET (self), TRUE);
  g_signal_connect_swapped (self, "query-tooltip", G_CALLBACK (query_tooltip_cb), self);
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
set_axis (SwPlot *self, Axis *axis, const char *label, gboolean log_scale)
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
  invalidate (self);
}

void
sw_plot_set_y_range (SwPlot *self, double min, double max)
{
  g_return_if_fail (SW_IS_PLOT (self));
  self->y.fixed_min = min;
  self->y.fixed_max = max;
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
  gtk_widget_queue_draw (GTK_WIDGET (self));
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
  axis_set_format (&self->x, format, scale);
  invalidate (self);
}

void
sw_plot_set_y_format (SwPlot *self, const char *format, double scale)
{
  g_return_if_fail (SW_IS_PLOT (self));
  axis_set_format (&self->y, format, scale);
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
  ensure_layout (self);
  if (!map_point (self, x, y, &px, &py))
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
  ensure_layout (self);
  if (area != NULL)
    *area = self->area;
  return TRUE;
}
