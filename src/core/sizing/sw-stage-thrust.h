/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-stage-thrust.h: a stage's thrust from the thrust-to-weight the user
 * states at its ignition, and the propulsion a stage added in the window
 * starts with, so that the ascent can be simulated without editing the file.
 *
 * Defaults (common practice; from memory, see reference-values.md's rules of
 * thumb): liftoff thrust-to-weight 1.2 to 1.5, upper-stage ignition 0.6 to
 * 1.2; we take 1.3 and 0.8. */
#pragma once

#include "sw-design.h"

G_BEGIN_DECLS

#define SW_DEFAULT_LIFTOFF_TW 1.3
#define SW_DEFAULT_UPPER_TW 0.8
/* The thrust-to-weight a user may ask for: above 0, at most 10. */
#define SW_TW_MAX 10.0

double   sw_default_ignition_tw (guint stage);

/* Sets stage @stage's vacuum thrust so that its thrust-to-weight at ignition
 * (vacuum thrust over the weight of the stage and everything above it, g0)
 * is @tw, from the design's own sizing.  With the thrust given per engine,
 * the per-engine thrust is set (total over engine count).  FALSE with @error
 * when the design cannot be sized, @tw is out of range or the thrust would
 * be out of its range; the design is then unchanged. */
gboolean sw_design_set_thrust_for_tw (SwDesign *design, guint stage, double tw, GError **error);

/* The stage's thrust-to-weight at ignition from the design's sizing; NAN
 * without a thrust or a feasible sizing. */
double   sw_design_ignition_tw (const SwDesign *design, guint stage);

/* With strap-on boosters, the liftoff thrust-to-weight of the whole cluster:
 * the core's and the boosters' vacuum thrust over the liftoff weight (g0)
 * of the design's sizing, the same mass sw_design_ignition_tw() takes for
 * stage 0 (which is the core's thrust alone).  NAN without boosters, without
 * the core's thrust or a feasible sizing. */
double   sw_design_liftoff_tw_with_boosters (const SwDesign *design);
/* Both from one sizing: the stage's thrust-to-weight at ignition, and in
 * @with_boosters (may be NULL; NAN unless stage 0 of a design with
 * boosters) the cluster's at liftoff. */
double   sw_design_stage_tw (const SwDesign *design, guint stage, double *with_boosters);

G_END_DECLS
