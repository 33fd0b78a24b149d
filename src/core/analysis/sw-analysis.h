/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-analysis.h: the immutable answer of one solve.  The worker thread builds
 * it from a copy of the design; the views only read it.  Reference counted
 * (g_atomic_rc_box) so every view may hold it as long as it draws from it. */
#pragma once

#include <gio/gio.h>

#include "sw-ascent.h"
#include "sw-budget.h"
#include "sw-comparison.h"
#include "sw-curves.h"
#include "sw-design.h"
#include "sw-montecarlo.h"
#include "sw-reliability.h"
#include "sw-sensitivity.h"
#include "sw-sizing.h"

G_BEGIN_DECLS

typedef struct _SwResult SwAnalysis;

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

  /* The ascent.  The fast phase fills stage_figures and says whether an
   * ascent follows; the worker then simulates and emits a second result of
   * the same serial (sw_analysis_compute_ascent), with ascent_pending FALSE.
   * Heap fields are deep-copied in sw_analysis_compute_ascent and
   * sw_analysis_compute_montecarlo: add new ones there. */
  gboolean  has_stage_figures;
  SwAscentStage stage_figures[SW_MAX_STAGES];  /* thrust-to-weight at ignition, burn time */
  gboolean  ascent_pending;    /* a result with the simulated ascent follows */
  SwAscentResult *ascent;      /* owned; NULL in the fast phase or without an ascent */
  char     *ascent_message;    /* why there is no ascent (the core's words), or NULL */
  gboolean  sized_by_ascent;   /* sizing is the closed loop's (loss_model "simulate") */

  /* Trade studies (no heap fields: the later phases copy the struct).  The
   * fast phase fills the sensitivities, the reliability and the baseline
   * comparison; the Monte Carlo follows in a later result of the same
   * serial (sw_analysis_compute_montecarlo), before the ascent. */
  double    sensitivity_step;  /* the tornado's relative step */
  gboolean  has_sensitivity;   /* the sizing closes */
  SwSensitivityTable sensitivity;
  SwReliability reliability;   /* .given: some stage has reliability keys */
  SwReliabilityCurve reliability_curve;
  gboolean  has_baseline;      /* design->baseline is set */
  gboolean  baseline_ok;       /* ... and was sized; else baseline_error says why */
  char      baseline_error[SW_REASON_MAX];
  SwSizing  baseline_sizing;
  SwStageCurve baseline_curve;
  SwReliabilityCurve baseline_reliability_curve;
  SwComparison comparison;     /* the totals against the baseline's */
  SwDelta   margin_delta;      /* the delta-v margin against the baseline's */
  gboolean  montecarlo_pending;  /* a result with the Monte Carlo follows */
  gboolean  has_montecarlo;    /* the design has spreads and the Monte Carlo ran */
  SwMonteCarlo montecarlo;
  gboolean  has_band;          /* percentiles on the stage-count curve */
  SwMcBand  band;
  char      montecarlo_error[SW_REASON_MAX];
  guint     phase;             /* 0 fast, 1 Monte Carlo, 2 ascent: the order of results */
};

/* Solve settings that are not part of the design. */
typedef struct {
  double sensitivity_step;     /* relative, 0.001 to 0.5; default 0.05 */
  guint  band_samples;         /* per stage count of the band; default 2000 */
  guint  threads;              /* Monte Carlo threads, 0 = all cores */
} SwSolveOptions;

void      sw_solve_options_init (SwSolveOptions *options);

#define SW_TYPE_ANALYSIS (sw_analysis_get_type ())
GType     sw_analysis_get_type (void) G_GNUC_CONST;

/* Runs on the worker thread: everything the views need for @design.
 * Returns NULL when @cancellable was cancelled part way. */
SwAnalysis *sw_analysis_compute (const SwDesign *design, guint64 serial, GCancellable *cancellable);
/* The same with @options (NULL: the defaults). */
SwAnalysis *sw_analysis_compute_with (const SwDesign *design, guint64 serial,
                                  const SwSolveOptions *options, GCancellable *cancellable);
/* Runs on the worker thread after the fast phase when @fast->montecarlo_pending:
 * a new result of the same serial that copies @fast and adds the Monte Carlo
 * and its band.  NULL when cancelled. */
SwAnalysis *sw_analysis_compute_montecarlo (const SwAnalysis *fast, const SwSolveOptions *options,
                                        GCancellable *cancellable);
/* Runs on the worker thread after the fast phase when @fast->ascent_pending:
 * simulates the ascent and returns a new result of the same serial that
 * copies @fast and adds it (for "loss_model": "simulate" with the closed
 * loop's sizing in place of the fast one).  NULL when cancelled. */
SwAnalysis *sw_analysis_compute_ascent (const SwAnalysis *fast, GCancellable *cancellable);
SwAnalysis *sw_analysis_ref (SwAnalysis *result);
void      sw_analysis_unref (SwAnalysis *result);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (SwAnalysis, sw_analysis_unref)

G_END_DECLS
