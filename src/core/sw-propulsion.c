/* SPDX-License-Identifier: GPL-3.0-or-later */
#include "config.h"

#include "sw-propulsion.h"

const char *const sw_propulsion_stage_keys[] = { NULL };
const char *const sw_propulsion_design_keys[] = { NULL };

gboolean
sw_propulsion_load_stage (JsonObject *obj, const char *file, const char *path,
                          SwStagePropulsion *prop, GPtrArray *warnings, GError **error)
{
  prop->present = FALSE;
  return TRUE;
}

gboolean
sw_propulsion_load_design (JsonObject *root, const char *file, SwDesignAscent *ascent,
                           GPtrArray *warnings, GError **error)
{
  ascent->present = FALSE;
  return TRUE;
}

void
sw_propulsion_save_stage (JsonBuilder *builder, const SwStagePropulsion *prop)
{
}

void
sw_propulsion_save_design (JsonBuilder *builder, const SwDesignAscent *ascent)
{
}
