/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-totals.h: the vehicle's totals and whether it closes, from an SwAnalysis. */
#pragma once

#include <gtk/gtk.h>

#include "sw-analysis.h"

G_BEGIN_DECLS

#define SW_TYPE_TOTALS (sw_totals_get_type ())
G_DECLARE_FINAL_TYPE (SwTotals, sw_totals, SW, TOTALS, GtkWidget)

GtkWidget  *sw_totals_new (void);
void        sw_totals_set_result (SwTotals *self, SwAnalysis *result);
/* The ascent's note on the sizing and its warnings (one per line), from the
 * ascent page; NULL hides the row, or once the row has shown a warning for
 * this design says there are none now (see sw_totals_forget_design()). */
void        sw_totals_set_ascent (SwTotals *self, const char *note, const char *warnings);
/* A new design: the warnings' row no longer keeps its place, and the
 * totals no longer keep the height they have had. */
void        sw_totals_forget_design (SwTotals *self);

/* For tests: the texts shown. */
typedef enum {
  SW_TOTALS_LIFTOFF,
  SW_TOTALS_FRACTION,
  SW_TOTALS_MARGIN,
  SW_TOTALS_REQUIRED,
  SW_TOTALS_LIMIT,
  SW_TOTALS_STATUS,
  SW_TOTALS_ASCENT_NOTE,       /* NULL when hidden */
  SW_TOTALS_ASCENT_WARNINGS,   /* NULL when hidden */
  SW_TOTALS_LIFTOFF_DELTA,     /* against the baseline; NULL when there is none */
  SW_TOTALS_FRACTION_DELTA,
  SW_TOTALS_MARGIN_DELTA,
  SW_TOTALS_STATUS_PAGE,       /* "ok", "note", "warn" or "bad": the icon and style shown */
} SwTotalsField;

const char *sw_totals_get_text (SwTotals *self, SwTotalsField field);
/* The status page (icon and style) of a verdict state. */
const char *sw_totals_status_page (SwVerdictState state);
/* A change against the baseline as the totals show it: "+3.2 t (+11.6 %)",
 * the em dash when it is not known. */
char       *sw_totals_format_delta (SwTotal total, const SwDelta *delta);

G_END_DECLS
