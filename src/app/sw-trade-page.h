/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-trade-page.h: the trade-study page of the main window: which input
 * moves the liftoff mass most (a ranked bar chart), how far the liftoff mass
 * spreads (the Monte Carlo histogram), and liftoff mass beside mission
 * success against stage count.  Draws an SwAnalysis; edits the design's
 * Monte Carlo inputs (samples, seed, spreads) as undoable edits; the
 * tornado's step is a setting. */
#pragma once

#include <gtk/gtk.h>

#include "sw-document.h"
#include "sw-plot.h"
#include "sw-analysis.h"
#include "sw-simulated-mc.h"

G_BEGIN_DECLS

#define SW_TYPE_TRADE_PAGE (sw_trade_page_get_type ())
G_DECLARE_FINAL_TYPE (SwTradePage, sw_trade_page, SW, TRADE_PAGE, GtkWidget)

typedef enum {
  SW_TRADE_PLOT_TORNADO,
  SW_TRADE_PLOT_HISTOGRAM,
  SW_TRADE_PLOT_MASS,          /* liftoff mass against stage count, band, baseline */
  SW_TRADE_PLOT_RELIABILITY,   /* mission success against stage count */
} SwTradePlot;

typedef enum {
  SW_TRADE_FIELD_STEP,         /* GtkSpinButton, percent */
  SW_TRADE_FIELD_SAMPLES,      /* GtkSpinButton */
  SW_TRADE_FIELD_SEED,         /* GtkSpinButton */
  SW_TRADE_FIELD_ISP_KIND,     /* GtkDropDown: none, normal, uniform */
  SW_TRADE_FIELD_ISP_WIDTH,    /* GtkSpinButton, percent */
  SW_TRADE_FIELD_EPS_KIND,
  SW_TRADE_FIELD_EPS_WIDTH,
  SW_TRADE_FIELD_LOSSES_KIND,
  SW_TRADE_FIELD_LOSSES_WIDTH, /* m/s */
} SwTradeField;

typedef enum {
  SW_TRADE_CARD_DRIVER,        /* the largest effect */
  SW_TRADE_CARD_SPREAD,        /* liftoff mass, 5th to 95th percentile */
  SW_TRADE_CARD_SHORTFALL,     /* chance the payload falls short */
  SW_TRADE_CARD_SUCCESS,       /* mission success probability */
  SW_TRADE_CARD_LOSSES_NOTE,   /* which losses the trades used ("" when none shown) */
} SwTradeCard;

GtkWidget *sw_trade_page_new (void);
void       sw_trade_page_set_document (SwTradePage *self, SwDocument *document);
/* Takes a reference; NULL clears the page.  Behind another page of the
 * notebook the page is brought up to date when it is shown. */
void       sw_trade_page_set_result (SwTradePage *self, SwAnalysis *result);
/* The sensitivity step is kept in @settings ("sensitivity-step-percent"). */
void       sw_trade_page_set_settings (SwTradePage *self, GSettings *settings);
/* The tornado's relative step (0.05 = 5 %).  Property "step"; stored in the
 * setting "sensitivity-step-percent". */
double     sw_trade_page_get_step (SwTradePage *self);
void       sw_trade_page_set_step (SwTradePage *self, double step);

/* For tests and the screenshot: the widgets and what the plots were given
 * (for the result shown: while the page is not mapped, the last one shown). */
SwPlot    *sw_trade_page_get_plot (SwTradePage *self, SwTradePlot which);
/* The Monte Carlo samples and seed fields (for the tests). */
GtkWidget *sw_trade_page_get_samples_field (SwTradePage *self);
/* The switch and answer of the Monte Carlo with a simulated ascent. */
SwSimulatedMc *sw_trade_page_get_simulated_mc (SwTradePage *self);
GtkWidget *sw_trade_page_get_seed_field (SwTradePage *self);
GtkWidget *sw_trade_page_get_field (SwTradePage *self, SwTradeField field);
const char *sw_trade_page_get_card_text (SwTradePage *self, SwTradeCard card);
/* The tornado rows as drawn, top (largest effect) first: liftoff mass
 * change at minus and plus step in kg (NAN: no bar) and the row labels.
 * Returns the number of rows. */
guint      sw_trade_page_get_tornado (SwTradePage *self, const double **minus_kg,
                                      const double **plus_kg, const char *const **labels);
/* The percentile lines of the histogram (5th, 50th, 95th, kg); FALSE when
 * none are drawn. */
gboolean   sw_trade_page_get_percentile_lines (SwTradePage *self, double lines[3]);

G_END_DECLS
