/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-optimised-steering.h: the Ascent page's optimised steering, on demand
 * (hundreds of trial flights: too slow for every edit).  A button starts
 * sw_ascent_optimise_steering () on a worker thread for the ascent shown;
 * the answer reads "Optimised steering saves N m/s over the guided law" (or
 * that it found no saving).  A new ascent cancels a run and clears the
 * answer. */
#pragma once

#include <gtk/gtk.h>

#include "sw-ascent.h"
#include "sw-design.h"

G_BEGIN_DECLS

#define SW_TYPE_OPTIMISED_STEERING (sw_optimised_steering_get_type ())
G_DECLARE_FINAL_TYPE (SwOptimisedSteering, sw_optimised_steering, SW, OPTIMISED_STEERING,
                      GtkBox)

GtkWidget *sw_optimised_steering_new (void);
/* The ascent shown and its design (both copied; the ascent's time series is
 * not); NULL clears.  The same ascent again changes nothing. */
void       sw_optimised_steering_set_flight (SwOptimisedSteering *self, const SwDesign *design,
                                             const SwAscentResult *ascent);

/* For tests. */
GtkWidget *sw_optimised_steering_get_button (SwOptimisedSteering *self);
gboolean   sw_optimised_steering_is_running (SwOptimisedSteering *self);
/* The answer (done FALSE until one arrived for the ascent shown). */
const SwAscentOptimised *sw_optimised_steering_get_answer (SwOptimisedSteering *self);
const char *sw_optimised_steering_get_text (SwOptimisedSteering *self);

G_END_DECLS
