/* SPDX-License-Identifier: GPL-3.0-or-later */
#include "config.h"

#include "sw-reliability.h"

const char *const sw_reliability_stage_keys[] = { NULL };

gboolean
sw_reliability_load_stage (JsonObject *obj, const char *file, const char *path,
                           SwStageReliability *rel, GPtrArray *warnings, GError **error)
{
  rel->present = FALSE;
  return TRUE;
}

void
sw_reliability_save_stage (JsonBuilder *builder, const SwStageReliability *rel)
{
}
