/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-plot-private.h: the plot widget's state, shared by its parts:
 * sw-plot.c (the object, its API and the layout), sw-plot-draw.c (drawing),
 * sw-plot-hover.c (the hover readout); the axis maths are sw-plot-axis.c,
 * the palette sw-plot-palette.c. */
#pragma once

#include "sw-plot.h"
#include "sw-plot-axis.h"
#include "sw-plot-palette.h"

G_BEGIN_DECLS

#define MARGIN 10.0
#define TICK_LEN 5.0
#define LEGEND_SAMPLE 30.0
#define HOVER_RADIUS 48.0
#define N_PALETTE SW_PLOT_N_PALETTE

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
  GdkRGBA fg;
  GdkRGBA bg;
  GdkRGBA palette[N_PALETTE];
} Colors;

struct _SwPlot {
  GtkWidget  parent_instance;

  char      *title;
  SwPlotAxis x;
  SwPlotAxis y;
  GPtrArray *series;    /* Series */
  GPtrArray *bands;     /* Band */
  GPtrArray *markers;   /* Marker */
  GPtrArray *vlines;    /* VLine */
  GStrv      categories;
  int        next_color;
  gboolean   readout_tooltip;
  char      *empty_text;  /* shown instead of axes when there is no data */
  GHashTable *text_cache; /* text -> PangoLayout, see sw_plot_make_text() */

  /* Layout */
  gboolean        layout_valid;
  int             layout_width;
  int             layout_height;
  graphene_rect_t area;
  double          legend_top;

  /* The drawing without the hover readout, kept while its inputs (the key
   * hashes them, see sw-plot-draw.c) stay the same, so an edit that gives
   * this plot the same data neither re-lays it out nor re-rasterises it:
   * the renderer sees the same node and leaves its pixels alone. */
  GskRenderNode *drawing;
  guint64        drawing_key;
  int            drawing_width;
  int            drawing_height;
  gboolean       drawing_dirty;
  guint          prepare_id;   /* the idle that draws ahead of the frame */

  /* The drawing's layers (SW_PLOT_N_LAYERS: frame, data, notes), each kept
   * while it comes out the same, so the renderer repaints only the layers
   * that changed, within their bounds (sw-plot-draw.c). */
  GskRenderNode *layers[3];
  guint64        layer_keys[3];

  /* The theme's colours, looked up again only after a style change. */
  Colors         colors;
  gboolean       colors_valid;

  /* Hover */
  gboolean  hovering;
  double    hover_x;
  double    hover_y;
};

/* Label boxes that must not overlap one another. */
typedef struct {
  GArray *rects;   /* graphene_rect_t */
} Placer;

typedef struct {
  const char *name;
  int         color;
  SwPlotStyle style;
  gboolean    band;
} LegendEntry;

/* sw-plot.c: layout */
PangoLayout *sw_plot_make_layout (SwPlot *self, const char *markup);
/* A shared, cached layout (a new reference): do not change it. */
PangoLayout *sw_plot_make_text (SwPlot *self, const char *text);
/* The same for markup. */
PangoLayout *sw_plot_make_markup (SwPlot *self, const char *markup);
/* A layout of one's own, to set a width or ellipsize. */
PangoLayout *sw_plot_make_text_fresh (SwPlot *self, const char *text);
/* Shared and cached too: do not change it. */
PangoLayout *sw_plot_title_layout (SwPlot *self);
GArray      *sw_plot_legend_entries (SwPlot *self);
double       sw_plot_text_height (SwPlot *self);
double       sw_plot_category_width (SwPlot *self);
guint        sw_plot_n_categories (SwPlot *self);
gboolean     sw_plot_categorical_y (SwPlot *self);
void         sw_plot_ensure_layout (SwPlot *self);
void         sw_plot_prepare (SwPlot *self);
/* Drops the layout and the kept drawing if the plot's inputs changed. */
void         sw_plot_check_inputs (SwPlot *self);
/* Whether anything can be drawn on the axes (series, bands, markers). */
gboolean     sw_plot_has_data (SwPlot *self);

/* FNV-1a hashing for the drawing's keys. */
guint64      sw_plot_key_bytes (guint64 h, const void *data, gsize n);
guint64      sw_plot_key_str (guint64 h, const char *s);
guint64      sw_plot_key_int (guint64 h, gint64 v);

/* sw-plot-draw.c */
void           sw_plot_clear_layers (SwPlot *self);
/* Lays out (or with @cr, draws) the legend rows; returns their height. */
double         sw_plot_draw_legend (SwPlot *self, cairo_t *cr, double left, double top,
                                    double width);
gboolean       sw_plot_map_point (SwPlot *self, double x, double y, double *px, double *py);
void           sw_plot_get_colors (SwPlot *self, Colors *c);
const GdkRGBA *sw_plot_palette_entry (const Colors *c, int index);
void           sw_plot_set_source (cairo_t *cr, const GdkRGBA *c, double alpha);
void           sw_plot_place_label (SwPlot *self, Placer *pl, PangoLayout *layout, double px,
                                    double py, double off, double *lx, double *ly);
void           sw_plot_draw_boxed_text (cairo_t *cr, PangoLayout *layout, double x, double y,
                                        const Colors *c, const GdkRGBA *text,
                                        const GdkRGBA *frame);
void           sw_plot_snapshot (GtkWidget *widget, GtkSnapshot *snapshot);

/* sw-plot-hover.c */
gboolean sw_plot_hover_find (SwPlot *self, double hx, double hy, double *px_out,
                             double *py_out, char **text, int *color);
void     sw_plot_draw_readout (SwPlot *self, cairo_t *cr, const Colors *c);
void     sw_plot_hover_setup (SwPlot *self);

G_END_DECLS
