/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-result.h: the immutable answer of one solve.  The worker thread builds
 * it from a copy of the design; the views only read it.  Reference counted
 * (g_atomic_rc_box) so every view may hold it as long as it draws from it. */
#pragma once

#include <gio/gio.h>

#include "sw-budget.h"
#include "sw-curves.h"
#include "sw-design.h"
#include "sw-sizing.h"

G_BEGIN_DECLS

typedef struct _SwResult SwResult;

struct _SwResult {
  guint64   serial;            /* the edit this answers; strictly increasing */
  SwDesign *design;            /* the solved copy (owned) */
  gboolean  ok;                /* FALSE: the design could not be solved */
  char     *error_message;     /* when !ok: which field and why */
  double    delta_v_m_s;       /* required delta-v */
  gboolean  has_budget;        /* orbit mission */
  SwBudget  budget;
  SwSizing  sizing;
  SwStageCurve stage_curve;    /* N = 1..8, optimal split */
  SwSweep   sweep;             /* N = 1..5 */
};

#define SW_TYPE_RESULT (sw_result_get_type ())
GType     sw_result_get_type (void) G_GNUC_CONST;

/* Runs on the worker thread: everything the views need for @design.
 * Returns NULL when @cancellable was cancelled part way. */
SwResult *sw_result_compute (const SwDesign *design, guint64 serial, GCancellable *cancellable);
SwResult *sw_result_ref (SwResult *result);
void      sw_result_unref (SwResult *result);

/* Switches @design to the manual split, with the shares @result gave its
 * stages (equal shares when @result does not fit @design).  Used when the
 * user takes hold of a share in the equal or optimal split. */
void      sw_result_apply_shares (const SwResult *result, SwDesign *design);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (SwResult, sw_result_unref)

G_END_DECLS
