/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-window-private.h: what the GUI tests, the screenshot option and the
 * latency benchmark need to reach inside the main window. */
#pragma once

#include "sw-ascent-page.h"
#include "sw-document.h"
#include "sw-export-dialog.h"
#include "sw-inspector.h"
#include "sw-plot.h"
#include "sw-analysis.h"
#include "sw-solver.h"
#include "sw-stack-view.h"
#include "sw-totals.h"
#include "sw-staging-page.h"
#include "sw-trade-page.h"
#include "sw-window.h"
#include "sw-working-view.h"

G_BEGIN_DECLS

SwDocument    *sw_window_get_document (SwWindow *self);
SwSolver      *sw_window_get_solver (SwWindow *self);
SwInspector   *sw_window_get_inspector (SwWindow *self);
SwStackView   *sw_window_get_stack_view (SwWindow *self);
SwTotals      *sw_window_get_totals (SwWindow *self);
SwWorkingView *sw_window_get_working_view (SwWindow *self);
SwAscentPage  *sw_window_get_ascent_page (SwWindow *self);
SwTradePage   *sw_window_get_trade_page (SwWindow *self);
SwStagingPage *sw_window_get_staging_page (SwWindow *self);
/* The stack view's "To scale" toggle (its partner is "Mass"). */
GtkWidget     *sw_window_get_scale_toggle (SwWindow *self);
/* The export dialog while it is open (design.export opens it), or NULL. */
SwExportDialog *sw_window_get_export_dialog (SwWindow *self);
/* Brings a page of the notebook to the front: "curves", "working",
 * "ascent" or "trade"; FALSE for an unknown name. */
gboolean       sw_window_show_page (SwWindow *self, const char *name);
/* 0: liftoff mass against stage count; 1: against delta-v. */
SwPlot        *sw_window_get_plot (SwWindow *self, guint which);
/* The note above the trade curves; NULL when hidden. */
const char    *sw_window_get_curves_note (SwWindow *self);
/* The result the views show now, or NULL before the first one. */
SwAnalysis      *sw_window_get_shown_result (SwWindow *self);
/* Serial of the newest result that has been painted in a frame. */
guint64        sw_window_get_drawn_serial (SwWindow *self);
/* Signal "result-drawn" (guint64 serial): after the frame that first
 * painted that result; once more with the same serial after the frame that
 * first painted its last phase (ascent_pending and montecarlo_pending are
 * then FALSE). */

gboolean       sw_window_save_to (SwWindow *self, GFile *file, GError **error);
/* The text of the message bar and its type, NULL when it is hidden. */
const char    *sw_window_get_message (SwWindow *self, GtkMessageType *type);

/* The recovery copy. */
char          *sw_window_dup_recovery_path (SwWindow *self);
gboolean       sw_window_get_recovery_offered (SwWindow *self);
void           sw_window_answer_recovery (SwWindow *self, gboolean restore);
/* Writes a pending recovery copy now instead of after the delay. */
void           sw_window_flush_recovery (SwWindow *self);
/* Closes without asking and removes the recovery copy (a clean close). */
void           sw_window_close_discarding (SwWindow *self);

/* Screenshot and benchmark mode: no recovery copy, no settings written. */
void           sw_window_set_ephemeral (SwWindow *self);

G_END_DECLS
