/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-stage-reliability.h: the optional reliability keys of a stage (engine
 * count, per-engine reliability, engine failures tolerated, ignition
 * reliability, separation reliability of the staging event above the
 * stage): their data, reading, checking and writing, and the values in
 * force with defaults filled in.  Part of the design model; the success
 * probabilities are computed in trade/sw-reliability. */
#pragma once

#include <json-glib/json-glib.h>

#include "sw-types.h"

G_BEGIN_DECLS

typedef struct {
  gboolean present;                  /* any reliability key was given */
  gboolean has_engine_count;
  gboolean has_engine_reliability;
  gboolean has_failures_tolerated;
  gboolean has_ignition_reliability;
  gboolean has_separation_reliability;
  guint    engine_count;
  double   engine_reliability;       /* probability that one engine runs its burn */
  guint    failures_tolerated;       /* engine failures the stage survives (< engine_count) */
  double   ignition_reliability;     /* probability that the stage's start sequence succeeds */
  double   separation_reliability;   /* the staging event above this stage */
} SwStageReliability;

/* The values in force for one stage, defaults filled in. */
typedef struct {
  guint  engine_count;
  double engine_reliability;
  guint  failures_tolerated;
  double ignition_reliability;
  double separation_reliability;
} SwReliabilityInputs;

extern const char *const sw_reliability_stage_keys[];

gboolean sw_reliability_load_stage (JsonObject *obj, const char *file, const char *path,
                                    SwStageReliability *rel, GPtrArray *warnings, GError **error);
void     sw_reliability_save_stage (JsonBuilder *builder, const SwStageReliability *rel);
/* Range checks of a stage's keys in memory; @path is the stage's JSON path. */
gboolean sw_reliability_validate_stage (const SwStageReliability *rel, const char *file,
                                        const char *path, GError **error);

void     sw_reliability_inputs (const SwStageReliability *rel, SwReliabilityInputs *out);

G_END_DECLS
