/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-ascent-private.h: what the closed loop and the tests share with the
 * ascent solver beyond the public API. */
#pragma once

#include "sw-ascent.h"

G_BEGIN_DECLS

/* Warm start of a solve, and what the solve found (in and out). */
typedef struct {
  gboolean have_kick;
  gboolean fix_kick;       /* fly kick_rad as given, no minimiser */
  double   kick_rad;
  gboolean have_psi;
  double   psi[2];         /* linear-tangent start and end pitch, rad */
} SwAscentHints;

/* One ascent of the vehicle given by @sizing (the design supplies the
 * propulsion, the mission and the ascent keys).  @hints may be NULL. */
SwAscentResult *sw_ascent_solve_sized (const SwDesign *design, const SwSizing *sizing,
                                       const SwAscentOptions *options, SwAscentHints *hints,
                                       GCancellable *cancellable, GError **error);

/* First guess of the losses when the design gives none (common practice:
 * gravity 1.0-1.5 km/s, drag and steering a few hundred m/s). */
#define SW_ASCENT_FIRST_GUESS_LOSSES 1500.0
/* The loop stops when the required delta-v changes by less than this. */
#define SW_ASCENT_LOOP_TOLERANCE 1.0

void sw_ascent_result_add_note (SwAscentResult *result, const char *format, ...)
  G_GNUC_PRINTF (2, 3);

G_END_DECLS
