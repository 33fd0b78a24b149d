/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-plot-axis.h: the plot's axis maths, GTK-free: the mapping from data to
 * pixels (linear or log10), nice-number ticks that grow their step until the
 * labels fit, integer-only axes (counts such as the number of stages), and
 * the tick texts (numbers through sw-format.h).  Text widths come from the
 * caller through a measure function, so this module needs no toolkit. */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

typedef struct {
  double   value;
  gboolean major;
  gboolean labelled;
  char    *text;
} SwPlotTick;

typedef struct {
  char    *label;
  gboolean log;
  gboolean integer;     /* ticks on whole numbers only (counts) */
  double   fixed_min;   /* NAN: automatic */
  double   fixed_max;
  char    *prefix;      /* around the number of the format */
  char    *spec;        /* a single printf conversion of a double */
  char    *suffix;
  double   scale;
  gboolean ticks_bare;  /* the label names the unit: ticks show numbers only */

  /* Layout: value v0 at pixel p0, v1 at p1 (v0 > v1 allowed). */
  double   v0, v1;
  double   p0, p1;
  GArray  *ticks;       /* SwPlotTick */
} SwPlotAxis;

/* The width (@horizontal) or height of @text in pixels. */
typedef double (*SwPlotMeasureFunc) (const char *text, gboolean horizontal, gpointer user_data);

void     sw_plot_axis_init (SwPlotAxis *axis);
void     sw_plot_axis_clear (SwPlotAxis *axis);
/* A printf format with exactly one double conversion ("%.1f t"); the value
 * is divided by @scale first.  Anything else warns and falls back to "%g". */
void     sw_plot_axis_set_format (SwPlotAxis *axis, const char *format, double scale);
/* The text of @value: @precision < 0 uses the format's own conversion (the
 * readout), else that many decimals; @bare leaves out prefix and suffix. */
char    *sw_plot_axis_format (const SwPlotAxis *axis, double value, int precision,
                              gboolean bare);
gboolean sw_plot_axis_valid (const SwPlotAxis *axis, double value);
double   sw_plot_axis_map (const SwPlotAxis *axis, double value);
/* The view range and the ticks for data from @min to @max (min > max: no
 * data) between pixels @p0 (the low end) and @p1.  Automatic ends are
 * rounded outwards to a tick; the step grows until the labels fit. */
void     sw_plot_axis_compute (SwPlotAxis *axis, double min, double max, double p0, double p1,
                               gboolean horizontal, SwPlotMeasureFunc measure,
                               gpointer user_data);
/* 1, 2 or 5 times a power of ten, about @span / @count. */
double   sw_plot_nice_step (double span, double count);

G_END_DECLS
