/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-briefing.h: everything the one-page briefing sheet and the CSV exports
 * show, as plain data.  The CLI fills it with sw_briefing_new(); the GUI can
 * fill the same struct from its solver results (set has_* for what it has)
 * and hand it to sw_sheet_export() or sw_csv_export(). */
#pragma once

#include "sw-comparison.h"
#include "sw-curves.h"
#include "sw-design.h"
#include "sw-montecarlo.h"
#include "sw-reliability.h"
#include "sw-sensitivity.h"
#include "sw-sizing.h"

G_BEGIN_DECLS

#define SW_BRIEFING_MAX_LINES 8
#define SW_BRIEFING_TEXT 96

/* One label/value pair of a free-form summary (the ascent summary). */
typedef struct {
  char label[SW_BRIEFING_TEXT];
  char value[SW_BRIEFING_TEXT];
} SwBriefingLine;

typedef enum {
  SW_BRIEFING_NONE = 0,
  SW_BRIEFING_MONTECARLO = 1 << 0,   /* run the Monte Carlo when the design has spreads */
  SW_BRIEFING_BAND = 1 << 1,         /* and the band on the stage-count curve */
} SwBriefingFlags;

typedef struct {
  SwDesign     *design;              /* owned copy */
  char          date[32];            /* "2026-01-31" */
  double        delta_v_m_s;         /* required */
  SwSizing      sizing;
  SwStageCurve  stage_curve;
  SwSweep       sweep;

  gboolean      has_baseline;
  SwSizing      baseline_sizing;
  SwStageCurve  baseline_curve;
  SwComparison  comparison;

  gboolean      has_sensitivity;
  SwSensitivityTable sensitivity;

  gboolean      has_montecarlo;
  SwMonteCarlo  montecarlo;
  gboolean      has_band;
  SwMcBand      band;

  gboolean      has_reliability;     /* some stage has reliability keys */
  SwReliability reliability;
  SwReliabilityCurve reliability_curve;

  /* Ascent summary: filled by whoever ran the ascent model (see
   * sw_briefing_fill_ascent()); n_ascent = 0 when it did not run. */
  guint         n_ascent;
  SwBriefingLine ascent[SW_BRIEFING_MAX_LINES];
  char          ascent_note[SW_BRIEFING_TEXT * 2];
} SwBriefing;

/* Sizes @design and computes the curves, the baseline comparison, the
 * sensitivities, the reliability and (with @flags) the Monte Carlo on
 * @threads threads (0 = all cores). */
SwBriefing *sw_briefing_new (const SwDesign *design, SwBriefingFlags flags, guint threads,
                             GError **error);
void        sw_briefing_free (SwBriefing *briefing);
/* The ascent summary: flies the design (sw_ascent_fly_design) when it carries
 * the ascent inputs and fills the label/value lines; otherwise leaves
 * n_ascent at 0 (and, when the design asked for simulated losses, says why
 * in ascent_note).  The GUI may fill the lines from its own ascent result. */
void        sw_briefing_fill_ascent (SwBriefing *briefing);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (SwBriefing, sw_briefing_free)

G_END_DECLS
