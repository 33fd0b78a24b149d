/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-boosters.h: strap-on boosters, the design-level key "boosters" of file
 * format version 2.
 *
 *   "boosters": {
 *     "name": "Side boosters",         optional (default "Boosters")
 *     "count": 2,                      0 to 12, whole; 0 is the same design
 *                                      as no key at all
 *     "isp_vac_s": 275,
 *     "isp_sl_s": 240,                 optional
 *     "structural_coefficient": 0.12,
 *     "thrust_vac_kn": 1200,           per booster
 *     "propellant_kg": 40000,          per booster, optional: a fixed load;
 *                                      without it the boosters are sized
 *     "crossfeed": false,              optional: the boosters feed the
 *                                      core's engines too
 *     "diameter_m": 1.8,               optional
 *     "propellant", "mixture_ratio", "ullage_fraction"   as a stage has them
 *   }
 *
 * The boosters ignite at liftoff with stage 1 (the core), burn in parallel
 * and are dropped at their burnout.  With boosters, stage 1 needs its thrust
 * (thrust_vac_kn, or engine_thrust_vac_kn with engine_count): its mass flow
 * sets how much core propellant burns while the boosters do. */
#pragma once

#include <json-glib/json-glib.h>

#include "sw-propellant.h"
#include "sw-types.h"

G_BEGIN_DECLS

#define SW_BOOSTERS_MAX 12

typedef struct {
  guint    count;                   /* 0: no boosters (the key is not written) */
  char     name[SW_NAME_MAX];
  double   isp_vac_s;
  double   isp_sl_s;                /* valid when has_isp_sl */
  gboolean has_isp_sl;
  double   structural_coefficient;
  double   thrust_vac_kn;           /* per booster */
  gboolean crossfeed;
  double   diameter_m;              /* valid when has_diameter */
  gboolean has_diameter;
  SwStagePropellant propellant;     /* propellant_kg (per booster, fixed), propellant,
                                     * mixture_ratio, ullage_fraction */
} SwBoosters;

extern const char *const sw_boosters_design_keys[];

/* Plausible starting values (common practice for a first look: a solid-like
 * booster), name included; count unchanged. */
void     sw_boosters_init_default (SwBoosters *boosters);

/* Reads the "boosters" object of @root, if any (count 0 otherwise). */
gboolean sw_boosters_load (JsonObject *root, const char *file, const char *prefix,
                           SwBoosters *boosters, GPtrArray *warnings, GError **error);
/* Writes the "boosters" object; nothing when the count is 0. */
void     sw_boosters_save (JsonBuilder *builder, const SwBoosters *boosters);
/* Range checks of every key (nothing to check at count 0). */
gboolean sw_boosters_validate (const SwBoosters *boosters, const char *file, const char *prefix,
                               GError **error);
/* TRUE when the design has boosters (the file is then version 2). */
gboolean sw_boosters_is_used (const SwBoosters *boosters);
/* Zeroes what a save would not write (everything at count 0; the unset
 * optional values), so that equality means "saves the same". */
void     sw_boosters_clear_unsaved (SwBoosters *boosters);

G_END_DECLS
