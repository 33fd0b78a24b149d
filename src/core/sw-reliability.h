/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-reliability.h: optional per-stage reliability keys (filled in by the
 * trade-study model). */
#pragma once

#include <json-glib/json-glib.h>

#include "sw-types.h"

G_BEGIN_DECLS

typedef struct {
  gboolean present;
} SwStageReliability;

extern const char *const sw_reliability_stage_keys[];

gboolean sw_reliability_load_stage (JsonObject *obj, const char *file, const char *path,
                                    SwStageReliability *rel, GPtrArray *warnings, GError **error);
void     sw_reliability_save_stage (JsonBuilder *builder, const SwStageReliability *rel);

G_END_DECLS
