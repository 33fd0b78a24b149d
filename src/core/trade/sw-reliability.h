/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-reliability.h: the cost of staging in risk.  Optional per-stage keys
 * (engine count, per-engine reliability, engine failures tolerated, ignition
 * reliability, separation reliability of the staging event above the stage),
 * the mission success probability and its curve against stage count.
 *
 * Model: a stage succeeds when its start sequence succeeds (ignition
 * reliability, one event per stage) and at most f of its n engines fail, each
 * independently with probability 1 - r (binomial).  The mission succeeds when
 * every stage and every staging event between two stages succeeds; an N-stage
 * vehicle has N - 1 staging events.  Keys left out are perfect (1 engine,
 * reliability 1, no failure tolerated), so a design without reliability keys
 * has no reliability figure (SwReliability.given is FALSE). */
#pragma once

#include "sw-design.h"
#include "sw-stage-reliability.h"
#include "sw-types.h"

G_BEGIN_DECLS

typedef struct {
  gboolean given;                    /* some stage has reliability keys */
  guint    n_stages;
  double   engines[SW_MAX_STAGES];   /* P(at most f of n engines fail) */
  double   stage[SW_MAX_STAGES];     /* ignition x engines */
  double   separation[SW_MAX_STAGES];/* event above stage i; 1 for the top stage */
  double   mission;                  /* product of the stages and the events */
} SwReliability;

typedef struct {
  gboolean given;
  guint    n_points;                 /* stage counts 1..n_points */
  double   mission[SW_MAX_STAGES];   /* success probability of the N-stage vehicle */
} SwReliabilityCurve;

/* P(at most @tolerated of @n engines fail), each engine failing independently
 * with probability 1 - @r: the binomial distribution function (GSL). */
double   sw_reliability_engines (guint n, double r, guint tolerated);
/* The stage's success probability: ignition times engines. */
double   sw_reliability_stage (const SwReliabilityInputs *in);

/* The design's own vehicle. */
void     sw_reliability_from_design (const SwDesign *design, SwReliability *out);
/* Success probability against stage count N = 1..@max_stages, stage k of the
 * N-stage vehicle taking the keys of design stage min(k, n) (the rule of the
 * stage-count curve). */
void     sw_reliability_curve_compute (const SwDesign *design, guint max_stages,
                                       SwReliabilityCurve *out);

G_END_DECLS
