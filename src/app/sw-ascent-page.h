/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-ascent-page.h: the "Ascent" page: the simulated flight of the sized
 * vehicle as plots (altitude against downrange, speed, dynamic pressure,
 * acceleration and flight-path angle against time, the losses ranked), a
 * summary of the figures, and warnings against the user's limits (GSettings
 * keys min-thrust-to-weight, max-dynamic-pressure-kpa, max-acceleration-g,
 * edited in the page's "Limits" popover).  Draws an SwAnalysis; never computes
 * physics. */
#pragma once

#include <gtk/gtk.h>

#include "sw-optimised-steering.h"
#include "sw-plot.h"
#include "sw-analysis.h"

G_BEGIN_DECLS

#define SW_TYPE_ASCENT_PAGE (sw_ascent_page_get_type ())
G_DECLARE_FINAL_TYPE (SwAscentPage, sw_ascent_page, SW, ASCENT_PAGE, GtkWidget)

typedef enum {
  SW_ASCENT_PLOT_TRAJECTORY,      /* altitude against downrange */
  SW_ASCENT_PLOT_LOSSES,          /* ranked horizontal bars */
  SW_ASCENT_PLOT_SPEED,
  SW_ASCENT_PLOT_DYNAMIC_PRESSURE,
  SW_ASCENT_PLOT_ACCELERATION,
  SW_ASCENT_PLOT_FLIGHT_PATH,
  SW_ASCENT_N_PLOTS,
} SwAscentPlot;

/* The texts shown, for tests. */
typedef enum {
  SW_ASCENT_PAGE_STATUS,
  SW_ASCENT_PAGE_ORBIT,
  SW_ASCENT_PAGE_LOSSES,
  SW_ASCENT_PAGE_ALLOWANCE,
  SW_ASCENT_PAGE_ROTATION,
  SW_ASCENT_PAGE_MAX_Q,
  SW_ASCENT_PAGE_MAX_Q_WHEN,
  SW_ASCENT_PAGE_MAX_ACCEL,
  SW_ASCENT_PAGE_MAX_ACCEL_WHEN,
  SW_ASCENT_PAGE_LIFTOFF_TW,
} SwAscentPageField;

GtkWidget  *sw_ascent_page_new (void);
void        sw_ascent_page_set_result (SwAscentPage *self, SwAnalysis *result);
/* The limits (minimum T/W, max-Q, acceleration) come from @settings;
 * without, the schema's defaults. */
void        sw_ascent_page_set_settings (SwAscentPage *self, GSettings *settings);

/* For the totals area: a note on the sizing (the closed loop's losses, or
 * how far the ascent falls short of the allowance) and the warnings against
 * the limits, one per line; NULL when there is none.  Signal
 * "summary-changed" when either changes. */
const char *sw_ascent_page_get_note (SwAscentPage *self);
/* The optimised steering, on demand (for tests). */
SwOptimisedSteering *sw_ascent_page_get_optimised (SwAscentPage *self);
const char *sw_ascent_page_get_warnings (SwAscentPage *self);

/* The warnings of @result against the limits (@max_q_pa in Pa, @max_g in g0),
 * one per line, or NULL.  Thrust-to-weight comes from the ascent when it is
 * there, else from the fast phase's stage figures; @ascent may be an older
 * result's while the newest is simulated. */
char       *sw_ascent_warnings_text (const SwAnalysis *result, const SwAscentResult *ascent,
                                     double min_thrust_to_weight, double max_q_pa,
                                     double max_g);

/* For tests: the texts, the plots, the state. */
const char *sw_ascent_page_get_text (SwAscentPage *self, SwAscentPageField field);
SwPlot     *sw_ascent_page_get_plot (SwAscentPage *self, SwAscentPlot which);
gboolean    sw_ascent_page_get_pending (SwAscentPage *self);
/* Serial of the result whose ascent is shown (0: none). */
guint64     sw_ascent_page_get_shown_serial (SwAscentPage *self);
/* The text of the explanation or status line. */
const char *sw_ascent_page_get_message (SwAscentPage *self);

G_END_DECLS
