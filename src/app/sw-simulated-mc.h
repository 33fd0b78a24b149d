/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-simulated-mc.h: the trade-study page's switch for the Monte Carlo with
 * a simulated ascent per sample (sw-ascent-montecarlo.h): off by default;
 * on, it flies the design's samples on a worker thread (every core) with a
 * progress bar, shows the distribution of the delta-v margin and the payload
 * reserve for 95 %, and starts again for a new design.  Switching it off, a
 * new design and closing the window cancel the flights. */
#pragma once

#include <gtk/gtk.h>

#include "sw-design.h"

G_BEGIN_DECLS

/* At most this many flights, whatever the design's sample count. */
#define SW_SIMULATED_MC_MAX_SAMPLES 1000

#define SW_TYPE_SIMULATED_MC (sw_simulated_mc_get_type ())
G_DECLARE_FINAL_TYPE (SwSimulatedMc, sw_simulated_mc, SW, SIMULATED_MC, GtkBox)

typedef enum {
  SW_SIMULATED_MC_OFF,
  SW_SIMULATED_MC_RUNNING,
  SW_SIMULATED_MC_DONE,
  SW_SIMULATED_MC_FAILED,        /* the design cannot be flown: the text says why */
  SW_SIMULATED_MC_UNAVAILABLE,   /* no ascent inputs or no orbit: the switch is off */
} SwSimulatedMcState;

GtkWidget *sw_simulated_mc_new (void);
/* The design to fly (copied); NULL or the same design again changes nothing. */
void       sw_simulated_mc_set_design (SwSimulatedMc *self, const SwDesign *design);

/* For tests: the switch, the state, the result's text and the progress. */
GtkWidget *sw_simulated_mc_get_switch (SwSimulatedMc *self);
SwSimulatedMcState sw_simulated_mc_get_state (SwSimulatedMc *self);
const char *sw_simulated_mc_get_text (SwSimulatedMc *self);
double     sw_simulated_mc_get_fraction (SwSimulatedMc *self);
guint      sw_simulated_mc_get_runs_cancelled (SwSimulatedMc *self);

G_END_DECLS
