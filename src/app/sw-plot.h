/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-plot.h: the one plot widget of the application (cairo): line and point
 * series on linear or log axes, markers, vertical asymptotes, a legend and a
 * hover readout.  Colours come from the widget's style (works in the dark
 * theme); series colours are a colour-blind-safe palette, and each series
 * also differs in dash pattern or marker shape. */
#pragma once

#include <gtk/gtk.h>

#include "sw-plot-palette.h"

G_BEGIN_DECLS

#define SW_TYPE_PLOT (sw_plot_get_type ())
G_DECLARE_FINAL_TYPE (SwPlot, sw_plot, SW, PLOT, GtkWidget)

typedef enum {
  SW_PLOT_LINE,         /* connected line */
  SW_PLOT_POINTS,       /* markers only */
  SW_PLOT_LINE_POINTS,  /* both */
  SW_PLOT_BARS,         /* vertical bars from the axis (used for histograms) */
  SW_PLOT_HBARS,        /* horizontal bars, y is the category index (ranked charts) */
} SwPlotStyle;

typedef enum {
  SW_MARKER_CURRENT,    /* the current design: large filled marker, labelled */
  SW_MARKER_INFEASIBLE, /* a cross, labelled */
  SW_MARKER_BASELINE,   /* hollow marker */
} SwMarkerKind;

GtkWidget *sw_plot_new (void);
void  sw_plot_clear (SwPlot *self);   /* series, markers and lines; keeps the axes */
void  sw_plot_set_title (SwPlot *self, const char *title);
void  sw_plot_set_x_axis (SwPlot *self, const char *label, gboolean log_scale);
void  sw_plot_set_y_axis (SwPlot *self, const char *label, gboolean log_scale);
/* Fixed ranges; NAN for automatic. */
void  sw_plot_set_x_range (SwPlot *self, double min, double max);
void  sw_plot_set_y_range (SwPlot *self, double min, double max);
/* Regions to show at least, in place of the data's extent (NAN: none): the
 * ends are automatic, rounded outwards to a tick and, like every automatic
 * range, held while what they must show stays inside and fills enough of
 * it (sw-plot-axis.h), so that a small edit does not move the axis. */
void  sw_plot_set_x_region (SwPlot *self, double min, double max);
void  sw_plot_set_y_region (SwPlot *self, double min, double max);
/* Copies the data.  Non-finite points break the line (are skipped). @color_index
 * picks the palette entry (-1: next); returns the series index. */
guint sw_plot_add_series (SwPlot *self, const char *name, const double *x, const double *y,
                          guint n, SwPlotStyle style, int color_index);
void  sw_plot_set_series_highlighted (SwPlot *self, guint series, gboolean highlighted);
void  sw_plot_add_marker (SwPlot *self, double x, double y, const char *label, SwMarkerKind kind);
/* A dashed vertical line (an asymptote or a percentile) with a label. */
void  sw_plot_add_vline (SwPlot *self, double x, const char *label, int color_index);
/* A shaded band between two y arrays over x (uncertainty bands). */
void  sw_plot_add_band (SwPlot *self, const char *name, const double *x, const double *y_lo,
                        const double *y_hi, guint n, int color_index);
/* Category labels for SW_PLOT_HBARS (y = 0, 1, ...). */
void  sw_plot_set_categories (SwPlot *self, const char *const *labels, guint n);
/* How numbers are printed in ticks and the readout, e.g. "%.0f t"; the
 * value is divided by @scale first (1000 to show kg as t). */
void  sw_plot_set_x_format (SwPlot *self, const char *format, double scale);
void  sw_plot_set_y_format (SwPlot *self, const char *format, double scale);

/* For tests: data coordinates to widget coordinates of the last layout. */
gboolean sw_plot_data_to_widget (SwPlot *self, double x, double y, double *wx, double *wy);

/* Added by the widgets' implementation. */
/* The plot area of the last layout in widget coordinates (for tests). */
gboolean sw_plot_get_plot_area (SwPlot *self, graphene_rect_t *area);
/* TRUE: the hover readout is a tooltip instead of a drawn label box.
 * Property "readout-tooltip". */
void  sw_plot_set_readout_tooltip (SwPlot *self, gboolean tooltip);
/* Ticks on whole numbers only (a count such as the number of stages). */
void  sw_plot_set_x_integer (SwPlot *self, gboolean integer);
/* What the plot says instead of drawing empty axes when it has no data
 * (default "No data"). */
void  sw_plot_set_empty_text (SwPlot *self, const char *text);
/* The palette: sw-plot-palette.h. */

G_END_DECLS
