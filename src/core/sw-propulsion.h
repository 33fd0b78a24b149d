/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-propulsion.h: optional per-stage propulsion and aerodynamics keys and the
 * design-level ascent settings (filled in by the ascent model). */
#pragma once

#include <json-glib/json-glib.h>

#include "sw-types.h"

G_BEGIN_DECLS

typedef struct {
  gboolean present;                /* any propulsion key was given */
} SwStagePropulsion;

typedef struct {
  gboolean present;
} SwDesignAscent;

extern const char *const sw_propulsion_stage_keys[];
extern const char *const sw_propulsion_design_keys[];

gboolean sw_propulsion_load_stage (JsonObject *obj, const char *file, const char *path,
                                   SwStagePropulsion *prop, GPtrArray *warnings, GError **error);
gboolean sw_propulsion_load_design (JsonObject *root, const char *file,
                                    SwDesignAscent *ascent, GPtrArray *warnings, GError **error);
void     sw_propulsion_save_stage (JsonBuilder *builder, const SwStagePropulsion *prop);
void     sw_propulsion_save_design (JsonBuilder *builder, const SwDesignAscent *ascent);

G_END_DECLS
