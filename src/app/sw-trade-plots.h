/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-trade-plots.h: the two trade curves of the main window, filled from an
 * SwAnalysis (no physics here: the curves are in the result). */
#pragma once

#include "sw-plot.h"
#include "sw-analysis.h"

G_BEGIN_DECLS

/* Liftoff mass against stage count 1..8, log y, the current count marked,
 * counts that do not close marked as infeasible. */
void sw_trade_plots_show_stage_count (SwPlot *plot, SwAnalysis *result);
/* Liftoff mass against delta-v for 1..5 stages, log y, each curve with its
 * asymptote, the current design marked. */
void sw_trade_plots_show_sweep (SwPlot *plot, SwAnalysis *result);

/* A vehicle that exists (result->payload_curves.applies): its payload
 * against circular-orbit altitude and against inclination, this design's
 * orbit marked at its capability. */
void sw_trade_plots_show_payload_altitude (SwPlot *plot, SwAnalysis *result);
void sw_trade_plots_show_payload_inclination (SwPlot *plot, SwAnalysis *result);
/* The note shown above the curves: why a fixed load is left out of them,
 * or what losses the payload curves use; "" when none. */
const char *sw_trade_plots_note (SwAnalysis *result);
/* Where this design's marker goes on a payload curve (@altitude: the
 * altitude curve), in data coordinates; FALSE when it has none. */
gboolean sw_trade_plots_payload_point (SwAnalysis *result, gboolean altitude, double *x,
                                       double *y);

/* Overlays, also used by the trade-study page: the Monte Carlo band on the
 * stage-count curve; the baseline's stage-count curve (@which 0) and its
 * marker (on either plot). */
void sw_trade_plots_add_band (SwPlot *plot, SwAnalysis *result);
void sw_trade_plots_add_baseline (SwPlot *plot, SwAnalysis *result, guint which);
gboolean sw_trade_plots_baseline_point (SwAnalysis *result, guint which, double *x, double *y);

/* Where the current design's marker was put, in data coordinates; FALSE when
 * there is none (for tests). */
gboolean sw_trade_plots_current_point (SwAnalysis *result, guint which, double *x, double *y);

G_END_DECLS
