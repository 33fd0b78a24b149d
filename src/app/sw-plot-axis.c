/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-plot"

#include "config.h"

#include "sw-plot-axis.h"

#include "sw-format.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

/* Number formats */

/* Splits a printf format with one double conversion into prefix, the
 * conversion and suffix; anything else falls back to "%g". */
void
sw_plot_axis_set_format (SwPlotAxis *axis, const char *format, double scale)
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

/* Decimals of the format's own conversion for @v: "%.2f" gives 2, "%.3g"
 * three significant digits; -1 for anything else. */
static int
spec_decimals (const char *spec, double v)
{
  const char *dot = strchr (spec, '.');
  char conv = spec[strlen (spec) - 1];
  int prec = dot != NULL ? atoi (dot + 1) : 6;

  if (conv == 'f' || conv == 'F')
    return prec;
  if (conv == 'g' || conv == 'G')
    {
      int digits = MAX (prec, 1);
      int mag = v != 0.0 ? (int) floor (log10 (fabs (v)) + 1e-9) : 0;
      return CLAMP (digits - 1 - mag, 0, 9);
    }
  return -1;
}

/* Numbers through the one formatter (locale separators, no signed zero);
 * very large or small values as a power of ten. */
char *
sw_plot_axis_format (const SwPlotAxis *axis, double value, int precision, gboolean bare)
{
  const char *prefix = bare ? "" : axis->prefix;
  const char *suffix = bare ? "" : axis->suffix;
  double v = value / axis->scale;
  g_autofree char *number = NULL;
  int decimals;

  if (!isfinite (value))
    return g_strdup (SW_NO_VALUE);
  if (v != 0.0 && (fabs (v) >= 1e7 || fabs (v) < 1e-3))
    {
      int e = (int) floor (log10 (fabs (v)) + 1e-9);
      double m = fabs (v) / pow (10.0, e);
      g_autofree char *p10 = power_of_ten (e);
      g_autofree char *mant = NULL;
      if (fabs (m - 1.0) < 1e-6)
        return g_strconcat (prefix, v < 0 ? "−" : "", p10, suffix, NULL);
      mant = sw_format_number (m, precision < 0 ? 2 : 1);
      return g_strconcat (prefix, v < 0 ? "−" : "", mant, "×", p10, suffix, NULL);
    }
  decimals = precision >= 0 ? precision : spec_decimals (axis->spec, v);
  if (decimals < 0)
    {
      char buf[64];
#pragma GCC diagnostic push
#pragma GCC diagnostic ignored "-Wformat-nonliteral"
      g_snprintf (buf, sizeof buf, axis->spec, v);
#pragma GCC diagnostic pop
      number = g_strdup (buf);
    }
  else
    number = sw_format_number (v, decimals);
  return g_strconcat (prefix, number, suffix, NULL);
}

/* Axis helpers */

static double
axis_t (const SwPlotAxis *axis, double v)
{
  return axis->log ? log10 (v) : v;
}

gboolean
sw_plot_axis_valid (const SwPlotAxis *axis, double v)
{
  return isfinite (v) && (!axis->log || v > 0.0);
}

double
sw_plot_axis_map (const SwPlotAxis *axis, double v)
{
  double t0 = axis_t (axis, axis->v0), t1 = axis_t (axis, axis->v1);

  return axis->p0 + (axis_t (axis, v) - t0) / (t1 - t0) * (axis->p1 - axis->p0);
}

static void
tick_clear (gpointer data)
{
  g_free (((SwPlotTick *) data)->text);
}

void
sw_plot_axis_init (SwPlotAxis *axis)
{
  memset (axis, 0, sizeof *axis);
  axis->fixed_min = NAN;
  axis->fixed_max = NAN;
  axis->region_min = NAN;
  axis->region_max = NAN;
  axis->ticks = g_array_new (FALSE, TRUE, sizeof (SwPlotTick));
  g_array_set_clear_func (axis->ticks, tick_clear);
  sw_plot_axis_set_format (axis, NULL, 1.0);
}

void
sw_plot_axis_clear (SwPlotAxis *axis)
{
  g_clear_pointer (&axis->label, g_free);
  g_clear_pointer (&axis->prefix, g_free);
  g_clear_pointer (&axis->spec, g_free);
  g_clear_pointer (&axis->suffix, g_free);
  g_clear_pointer (&axis->ticks, g_array_unref);
}

double
sw_plot_nice_step (double span, double count)
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

void
sw_plot_axis_hold (SwPlotAxis *axis)
{
  axis->held = TRUE;
  axis->held_v0 = axis->v0;
  axis->held_v1 = axis->v1;
  axis->held_step = axis->step;
  axis->held_length = fabs (axis->p1 - axis->p0);
}

void
sw_plot_axis_release (SwPlotAxis *axis)
{
  axis->held = FALSE;
}

/* Whether the held range still suits data from @a to @b: it holds them and
 * they fill enough of it. */
static gboolean
hold_fits (const SwPlotAxis *axis, double a, double b)
{
  double h0, h1, t0, t1, tol;

  if (!axis->held || !sw_plot_axis_valid (axis, axis->held_v0)
      || !sw_plot_axis_valid (axis, axis->held_v1) || !(axis->held_v1 > axis->held_v0)
      || !sw_plot_axis_valid (axis, a) || !sw_plot_axis_valid (axis, b))
    return FALSE;
  h0 = axis_t (axis, axis->held_v0);
  h1 = axis_t (axis, axis->held_v1);
  t0 = axis_t (axis, a);
  t1 = axis_t (axis, b);
  tol = 1e-9 * (h1 - h0);
  return t0 >= h0 - tol && t1 <= h1 + tol && t1 - t0 >= SW_PLOT_AXIS_HOLD_FILL * (h1 - h0);
}

/* Ticks */

static int
decimals_for (double step)
{
  return MAX (0, (int) -floor (log10 (step) + 1e-9));
}

static void
add_tick (SwPlotAxis *axis, double v, gboolean major, int precision)
{
  SwPlotTick t = { v, major, FALSE, NULL };

  t.text = sw_plot_axis_format (axis, v, precision, axis->ticks_bare);
  g_array_append_val (axis->ticks, t);
}

/* Labels every major tick whose label does not crowd an already labelled
 * one; on a wide log axis the decades come first, then the 2s and 5s where
 * there is room. */
static void
axis_choose_labels (SwPlotAxis *axis, gboolean horizontal, gboolean decades,
                    SwPlotMeasureFunc measure, gpointer user_data)
{
  GArray *placed = g_array_new (FALSE, FALSE, sizeof (double) * 2);
  double gap = horizontal ? 16.0 : 6.0;

  for (int pass = 0; pass < (decades ? 2 : 1); pass++)
    {
      for (guint i = 0; i < axis->ticks->len; i++)
        {
          SwPlotTick *t = &g_array_index (axis->ticks, SwPlotTick, i);
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
          c = sw_plot_axis_map (axis, t->value);
          half = (measure (t->text, horizontal, user_data) + gap) / 2.0;
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

void
sw_plot_axis_compute (SwPlotAxis *axis, double min, double max, double p0, double p1,
                      gboolean horizontal, SwPlotMeasureFunc measure, gpointer user_data)
{
  double length = fabs (p1 - p0);
  double spacing = horizontal ? 90.0 : 45.0;
  gboolean auto_min = !(isfinite (axis->fixed_min) && sw_plot_axis_valid (axis, axis->fixed_min));
  gboolean auto_max = !(isfinite (axis->fixed_max) && sw_plot_axis_valid (axis, axis->fixed_max));
  double a = min, b = max;

  double forced_step = 0.0;

  axis->p0 = p0;
  axis->p1 = p1;
  axis->step = 0.0;
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
  /* Data that all rounds to zero in the axis's unit (a flight that never
   * left the pad) gets a plain 0..1 axis, not ticks of 10^-4. */
  if (!axis->log && auto_min && auto_max && MAX (fabs (a), fabs (b)) / axis->scale < 1e-3)
    {
      a = b < 0.0 ? -axis->scale : 0.0;
      b = b < 0.0 ? 0.0 : axis->scale;
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

  /* Automatic ends: the held range while it suits the data, with its
   * step when the axis is as long as it was. */
  if (auto_min && auto_max && hold_fits (axis, a, b))
    {
      a = axis->held_v0;
      b = axis->held_v1;
      auto_min = auto_max = FALSE;
      if (axis->held_step > 0.0 && fabs (axis->held_length - length) < 0.5)
        forced_step = axis->held_step;
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
      axis_choose_labels (axis, horizontal, TRUE, measure, user_data);
      return;
    }

  /* Linear steps (also on a log axis that spans less than a factor of four). */
  for (double count = MAX (length / spacing, 1.0); ; count *= 0.6)
    {
      /* Counts: whole numbers only, never 0.5 ... 8.5. */
      double step = forced_step > 0.0 ? forced_step
                    : axis->integer ? MAX (sw_plot_nice_step (b - a, count), 1.0)
                                    : sw_plot_nice_step (b - a, count);
      double lo = auto_min ? floor (a / step + 1e-9) * step : a;
      double hi = auto_max ? ceil (b / step - 1e-9) * step : b;
      double mant = step / pow (10.0, floor (log10 (step) + 1e-9));
      double minor = axis->integer ? (step >= 5.0 ? step / 5.0 : step)
                                   : step / (fabs (mant - 2.0) < 1e-6 ? 4.0 : 5.0);
      int prec = decimals_for (step / axis->scale);
      double widest = 0.0, closest = INFINITY, prev = NAN;

      if (axis->log && !(lo > 0.0))
        lo = a;
      if (hi <= lo)
        hi = lo + step;
      axis->v0 = lo;
      axis->v1 = hi;
      axis->step = step;
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
              SwPlotTick *t = &g_array_index (axis->ticks, SwPlotTick, axis->ticks->len - 1);
              double p = sw_plot_axis_map (axis, v);
              widest = MAX (widest, measure (t->text, horizontal, user_data));
              if (isfinite (prev))
                closest = MIN (closest, fabs (p - prev));
              prev = p;
            }
        }
      if (closest >= widest + (horizontal ? 16.0 : 6.0) || count < 1.5 || forced_step > 0.0)
        break;
    }
  axis_choose_labels (axis, horizontal, FALSE, measure, user_data);
}

