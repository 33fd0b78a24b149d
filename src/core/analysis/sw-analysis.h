/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-analysis.h: the one analysis of a design.  The window (through its
 * solver thread), the briefing sheet, the CSV tables and every command of
 * the command line read this and nothing else.
 *
 * An analysis is immutable and reference counted (g_atomic_rc_box).  It is
 * built in phases, each a new analysis that starts as a copy of the previous
 * one (sw_analysis_copy) and adds to it:
 *   1. fast (sw_analysis_new): sizing, curves, budget, sensitivities,
 *      reliability, the baseline comparison, the thrust-to-weight figures;
 *   2. Monte Carlo (sw_analysis_add_montecarlo), when montecarlo_pending;
 *   3. ascent (sw_analysis_add_ascent), when ascent_pending: the simulated
 *      ascent, and for "loss_model": "simulate" the closed loop's sizing in
 *      place of the fast one.
 * Every phase takes a GCancellable and returns NULL once it is cancelled.
 * sw_analysis_run does all the phases the options ask for in one call.
 *
 * Plain data is held by value.  The two heap parts (the solved design and
 * the simulated ascent) are immutable and shared between the phases of one
 * design through their own reference counts, so a copy is one function. */
#pragma once

#include <gio/gio.h>

#include "sw-ascent.h"
#include "sw-budget.h"
#include "sw-carpet.h"
#include "sw-comparison.h"
#include "sw-curves.h"
#include "sw-design.h"
#include "sw-mass-estimate.h"
#include "sw-montecarlo.h"
#include "sw-payload-curves.h"
#include "sw-phases.h"
#include "sw-reliability.h"
#include "sw-sensitivity.h"
#include "sw-sizing.h"
#include "sw-staging.h"
#include "sw-vehicle-shape.h"

G_BEGIN_DECLS

#define SW_ANALYSIS_TEXT_MAX 768

/* What the analysis says about the design, in this order of precedence. */
typedef enum {
  SW_VERDICT_INFEASIBLE,       /* a stage cannot give its share, or no sizing */
  SW_VERDICT_SHORT_OF_ORBIT,   /* the simulated ascent does not reach the orbit */
  SW_VERDICT_OVER_LIMIT,       /* it flies, but breaks one of the user's limits */
  SW_VERDICT_PAPER_ONLY,       /* no simulation: the rocket equation only */
  SW_VERDICT_REACHES_ORBIT,    /* the simulated ascent reaches the orbit */
  SW_VERDICT_PENDING,          /* the ascent is still being simulated (window only) */
} SwVerdictState;

typedef struct {
  SwVerdictState state;
  char reason[SW_ANALYSIS_TEXT_MAX];   /* plain words, translated */
} SwVerdict;

/* "infeasible", "short-of-orbit", "over-limit", "paper-only",
 * "reaches-orbit", "pending" (scripts depend on these strings). */
const char *sw_verdict_state_to_string (SwVerdictState state);
/* A short title for people: "Reaches the orbit", "Not feasible", ... */
const char *sw_verdict_state_title (SwVerdictState state);

/* Settings that are not part of the design. */
typedef struct {
  double   sensitivity_step;      /* relative, 0.001 to 0.5; default 0.05 */
  guint    band_samples;          /* per stage count of the band; default 2000 */
  guint    threads;               /* Monte Carlo threads, 0 = all cores */
  gboolean montecarlo;            /* run the Monte Carlo phase when the design has
                                   * spreads (default TRUE) */
  gboolean montecarlo_always;     /* ... even without spreads (default FALSE) */
  guint    montecarlo_samples;    /* 0: the design's */
  gboolean montecarlo_use_seed;   /* TRUE: montecarlo_seed instead of the design's */
  guint32  montecarlo_seed;
  gboolean band;                  /* the band on the stage-count curve (default TRUE) */
  gboolean ascent;                /* run the ascent phase when the design can be
                                   * flown (default TRUE) */
  /* The user's limits, for the verdict (defaults: the settings' defaults). */
  double   min_thrust_to_weight;  /* at liftoff; 1.2, common practice */
  double   max_q_pa;              /* 45 kPa, from memory */
  double   max_axial_g;           /* 6 g, from memory */
  /* The payload curves of a vehicle that exists (every stage fixed): the
   * grids (n 0: the defaults of sw-payload-curves.h) and whether each point
   * is flown (seconds; the command line's --simulate, never the window). */
  guint    n_payload_altitudes;
  double   payload_altitudes_km[SW_PAYLOAD_CURVE_MAX];
  guint    n_payload_inclinations;
  double   payload_inclinations_deg[SW_PAYLOAD_CURVE_MAX];
  gboolean payload_simulate;
} SwAnalysisOptions;

void sw_analysis_options_init (SwAnalysisOptions *options);

typedef struct _SwAnalysisHeld SwAnalysisHeld;
typedef struct _SwAnalysis SwAnalysis;

struct _SwAnalysis {
  guint64   serial;            /* the edit this answers; strictly increasing */
  guint     phase;             /* 0 fast, 1 Monte Carlo, 2 ascent: the order of results */
  SwAnalysisOptions options;   /* what it was built with */
  const SwDesign *design;      /* the solved copy (shared, immutable) */
  gboolean  ok;                /* FALSE: the design could not be solved */
  char      error_message[SW_ANALYSIS_TEXT_MAX];  /* when !ok: which field and why */

  SwVerdict verdict;           /* the one answer; see SwVerdictState */

  double    delta_v_m_s;       /* required delta-v (the closed loop's when sized_by_ascent) */
  gboolean  has_budget;        /* orbit mission */
  SwBudget  budget;
  SwSizing  sizing;
  SwStageCurve stage_curve;    /* N = 1..8, optimal split */
  SwSweep   sweep;             /* N = 1..5 */
  /* The vehicle's delta-v limit with no payload less the required delta-v:
   * headroom to the asymptote, not a performance margin. */
  double    headroom_m_s;
  /* The true shape of the sized vehicle (tank volumes, lengths, interstages,
   * fairing, height), from the sizing in force. */
  SwVehicleShape shape;
  /* The structural coefficients estimated from mass-estimating relationships
   * at a fixed point with the sizing (phase 1, the design's delta-v). */
  SwMassEstimate mass_estimate;

  /* A vehicle that exists (every stage with a fixed propellant load): the
   * payload it carries to the mission (performance.reachable) and its
   * payload curves.  has_performance FALSE: performance_error says why
   * (a sized stage, named by its key). */
  gboolean  has_performance;
  SwPerformance performance;
  char      performance_error[SW_ANALYSIS_TEXT_MAX];
  SwPayloadCurves payload_curves;  /* .applies FALSE: .note says why */

  /* The ascent. */
  gboolean  has_stage_figures;
  SwAscentStage stage_figures[SW_MAX_STAGES];  /* thrust-to-weight at ignition, burn time */
  gboolean  ascent_pending;    /* a later phase simulates the ascent */
  gboolean  ascent_skipped;    /* the options said not to simulate */
  const SwAscentResult *ascent;  /* shared; NULL before the ascent phase or without one */
  char      ascent_message[SW_ANALYSIS_TEXT_MAX];  /* why there is no ascent (core's words) */
  gboolean  sized_by_ascent;   /* sizing is the closed loop's (loss_model "simulate") */
  /* Simulated delta-v margin: carried less needed, signed (NAN without a
   * simulation that found a steering). */
  double    simulated_margin_m_s;

  /* Trade studies.  all_fixed: every load is fixed (sw_design_all_fixed),
   * so the liftoff mass is constant: the sensitivities are of the payload
   * capability (sensitivity.capability) and the Monte Carlo gives the
   * capability and the delta-v margin at the nominal payload
   * (montecarlo.all_fixed), computed whether or not the payload fits. */
  gboolean  all_fixed;
  double    sensitivity_step;  /* the tornado's relative step */
  gboolean  has_sensitivity;   /* the sizing closes (all_fixed: the capability is positive) */
  SwSensitivityTable sensitivity;
  SwReliability reliability;   /* .given: some stage has reliability keys */
  SwReliabilityCurve reliability_curve;
  gboolean  has_baseline;      /* design->baseline is set */
  gboolean  baseline_ok;       /* ... and was sized; else baseline_error says why */
  char      baseline_error[SW_ANALYSIS_TEXT_MAX];
  SwSizing  baseline_sizing;
  SwStageCurve baseline_curve;
  SwReliabilityCurve baseline_reliability_curve;
  SwComparison comparison;     /* the totals against the baseline's */
  SwDelta   margin_delta;      /* the headroom against the baseline's */
  gboolean  montecarlo_pending;  /* a later phase runs the Monte Carlo */
  gboolean  has_montecarlo;    /* the Monte Carlo ran */
  SwMonteCarlo montecarlo;
  /* Chance that the vehicle as sized carries the whole payload (no reserve):
   * 1 - montecarlo.p_negative_margin; NAN without a fixed vehicle. */
  double    montecarlo_success;
  gboolean  has_band;          /* percentiles on the stage-count curve */
  SwMcBand  band;
  char      montecarlo_error[SW_ANALYSIS_TEXT_MAX];

  /* Which losses the sensitivities and the Monte Carlo used (the
   * reliability model has no loss term).  For a "loss_model": "simulate"
   * design they use the first-guess allowance until the ascent phase closes
   * the loop, which then recomputes them with the closed-loop losses.
   * trade_losses_m_s: the allowance used (NAN for a delta-v mission);
   * trade_losses_simulated: TRUE once it is the closed loop's;
   * trade_losses_note: one plain sentence for the views, the sheet and the
   * command line ("" for an allowance design, where nothing needs saying). */
  double    trade_losses_m_s;
  gboolean  trade_losses_simulated;
  char      trade_losses_note[SW_ANALYSIS_TEXT_MAX];

  /*< private >*/
  SwAnalysisHeld *held_design;
  SwAnalysisHeld *held_ascent;
};

#define SW_TYPE_ANALYSIS (sw_analysis_get_type ())
GType       sw_analysis_get_type (void) G_GNUC_CONST;

/* Phase 1, on any thread.  @options NULL: the defaults.  NULL when
 * @cancellable was cancelled part way. */
SwAnalysis *sw_analysis_new (const SwDesign *design, guint64 serial,
                             const SwAnalysisOptions *options, GCancellable *cancellable);
/* Phase 2: needs @prev->montecarlo_pending. */
SwAnalysis *sw_analysis_add_montecarlo (const SwAnalysis *prev, GCancellable *cancellable);
/* Phase 3: needs @prev->ascent_pending. */
SwAnalysis *sw_analysis_add_ascent (const SwAnalysis *prev, GCancellable *cancellable);
/* Every phase @options asks for, in order (serial 0). */
SwAnalysis *sw_analysis_run (const SwDesign *design, const SwAnalysisOptions *options,
                             GCancellable *cancellable);
/* The fast phase with the default options (for tests and previews). */
SwAnalysis *sw_analysis_compute (const SwDesign *design, guint64 serial,
                                 GCancellable *cancellable);

/* The thrust-to-weight at liftoff that every front end shows: the
 * simulated ascent's once the analysis has it, else the sized figure of
 * the stage that lifts off, the first one that burns (a stage the split
 * leaves empty does not lift the vehicle).  NAN when neither is known. */
double      sw_analysis_liftoff_tw (const SwAnalysis *analysis);

/* A copy of the analysed design as the trade studies use it: with the
 * closed loop's losses (and its fairing jettison point, sw_ascent_apply_loop)
 * once trade_losses_simulated, else the design as it is. */
SwDesign   *sw_analysis_dup_trade_design (const SwAnalysis *analysis);
/* The staging decision (sw-staging.h) of the analysed design, with the
 * closed loop's losses once the analysis has them (trade_losses_simulated),
 * so that this design's row is the sizing in the totals. */
gboolean    sw_analysis_staging (const SwAnalysis *analysis, guint max_stages, SwStaging *out,
                                 GError **error);
/* The carpet grid (sw-carpet.h) of the analysed design, the same way: with
 * the closed loop's losses as a fixed allowance at every point and its
 * fairing point once the analysis has them, so that this design's value is
 * the sizing in the totals. */
SwCarpet   *sw_analysis_carpet (const SwAnalysis *analysis, const SwCarpetOptions *options,
                                GError **error);

/* A new analysis equal to @analysis (the heap parts shared). */
SwAnalysis *sw_analysis_copy (const SwAnalysis *analysis);
SwAnalysis *sw_analysis_ref (SwAnalysis *analysis);
void        sw_analysis_unref (SwAnalysis *analysis);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (SwAnalysis, sw_analysis_unref)

G_END_DECLS
