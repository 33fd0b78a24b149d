/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-curves.h: the trade curves: liftoff mass against stage count and against
 * the required delta-v. */
#pragma once

#include "sw-design.h"
#include "sw-sizing.h"
#include "sw-types.h"

G_BEGIN_DECLS

typedef struct {
  guint    stages;
  gboolean feasible;
  double   liftoff_mass_kg;      /* NAN when infeasible */
  double   delta_v_limit_m_s;
} SwStageCountPoint;

/* A note naming every fixed stage: room for the text and each stage's
 * number and name. */
#define SW_FIXED_NOTE_MAX (SW_REASON_MAX + SW_MAX_STAGES * (SW_NAME_MAX + 8))

struct _SwStageCurve {
  /* Why a design's fixed propellant loads do not apply to the curve (the
   * curve sizes every stage); "" when the design has none. */
  char   note[SW_FIXED_NOTE_MAX];
  double delta_v_m_s;
  double payload_kg;
  guint  n_points;
  SwStageCountPoint points[SW_MAX_STAGES];
  /* A design with strap-on boosters: the same boosters (sized, or with
   * their fixed load) beside a core of N = 1..n_points stages, each stage
   * sized (sw_size_parallel, optimal split).  points[] stay the serial
   * vehicles without boosters.  booster_count 0: no such curve. */
  guint  booster_count;
  SwStageCountPoint booster_points[SW_MAX_STAGES];
  /* With boosters: which curves have them ("" without). */
  char   booster_note[2 * SW_REASON_MAX];
};

typedef struct {
  guint  stages;
  double delta_v_limit_m_s;
  guint  n_points;
  double delta_v_m_s[SW_SWEEP_POINTS];
  double liftoff_mass_kg[SW_SWEEP_POINTS];
} SwSweepCurve;

struct _SwSweep {
  char   note[SW_FIXED_NOTE_MAX];  /* as SwStageCurve's */
  double payload_kg;
  guint  n_curves;
  SwSweepCurve curves[SW_SWEEP_CURVES];
};

/* The curves size every stage of hypothetical 1..N-stage vehicles from the
 * payload up: a fixed propellant load (propellant_kg) is not applied, since
 * a vehicle with another stage count or delta-v has no such stage; @note
 * (SW_FIXED_NOTE_MAX) says so, naming every fixed stage, or is "". */
void     sw_curves_fixed_note (const SwDesign *design, char *note);

/* The design's stages with a fixed propellant load as words for a note:
 * "1 (Name)", "1 (Name) and 2 (Name)", "1, 2 and 3 (...)", the names left
 * out when @names is FALSE ("1 and 2").  Returns how many there are (0:
 * @buf is ""). */
guint    sw_fixed_stages_text (const SwDesign *design, gboolean names, char *buf, gsize size);

/* Optimal split for N = 1..@max_stages (at most SW_MAX_STAGES). */
void     sw_stage_curve_compute (const SwDesign *design, double delta_v_m_s,
                                 guint max_stages, SwStageCurve *out);
/* Optimal liftoff mass against delta-v for N = 1..@max_curves, from zero to
 * just short of each curve's limit. */
void     sw_sweep_compute (const SwDesign *design, guint max_curves, guint n_points,
                           SwSweep *out);

G_END_DECLS
