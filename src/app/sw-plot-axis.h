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
  /* NAN: none.  A region to show at least, in place of the data's extent:
   * its ends are automatic (rounded outwards, and held, see below). */
  double   region_min;
  double   region_max;
  char    *prefix;      /* around the number of the format */
  char    *spec;        /* a single printf conversion of a double */
  char    *suffix;
  double   scale;
  gboolean ticks_bare;  /* the label names the unit: ticks show numbers only */

  /* Layout: value v0 at pixel p0, v1 at p1 (v0 > v1 allowed). */
  double   v0, v1;
  double   p0, p1;
  GArray  *ticks;       /* SwPlotTick */
  double   step;        /* the major tick step of a linear axis, else 0 */

  /* Hysteresis of automatic ranges: the range last shown (committed by
   * sw_plot_axis_hold), kept while new data stay inside it and fill at
   * least SW_PLOT_AXIS_HOLD_FILL of it, so small edits move the data, not
   * the axis. */
  gboolean held;
  double   held_v0, held_v1, held_step, held_length;
} SwPlotAxis;

#define SW_PLOT_AXIS_HOLD_FILL 0.6

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
 * rounded outwards to a tick; the step grows until the labels fit.  When
 * both ends are automatic and a range is held that holds [@min, @max] and
 * is filled to SW_PLOT_AXIS_HOLD_FILL (in log10 on a log axis), that range
 * and its step are used again instead. */
void     sw_plot_axis_compute (SwPlotAxis *axis, double min, double max, double p0, double p1,
                               gboolean horizontal, SwPlotMeasureFunc measure,
                               gpointer user_data);
/* Makes the range last computed the one to hold (see SwPlotAxis.held). */
void     sw_plot_axis_hold (SwPlotAxis *axis);
/* Forgets the held range: the next range follows the data alone. */
void     sw_plot_axis_release (SwPlotAxis *axis);
/* 1, 2 or 5 times a power of ten, about @span / @count. */
double   sw_plot_nice_step (double span, double count);

G_END_DECLS
