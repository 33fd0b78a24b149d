/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-phases.h: the flight of a sized vehicle in phases (one per stage that
 * fires, in firing order), and the shape of each stage from its propellant
 * (sw-propellant.h) and diameter. */
#pragma once

#include "sw-propellant.h"
#include "sw-sizing.h"

G_BEGIN_DECLS

typedef struct {
  guint  stage;                    /* index of the stage that burns */
  double delta_v_m_s;
  double exhaust_velocity_m_s;
  double initial_mass_kg;
  double final_mass_kg;
  double duration_s;               /* propellant over vacuum mass flow; NAN without thrust */
} SwPhase;

/* The phases of @sizing (SW_MAX_STAGES entries); returns their count, 0 when
 * the sizing is infeasible. */
guint    sw_sizing_phases (const SwDesign *design, const SwSizing *sizing, SwPhase *phases);

/* The diameter of stage @stage: its own, or the first one given below it
 * (as the ascent model has it); NAN when none is given. */
double   sw_stage_effective_diameter (const SwDesign *design, guint stage);

/* The shape of stage @stage with the propellant of @sizing. */
void     sw_sizing_stage_shape (const SwDesign *design, const SwSizing *sizing, guint stage,
                                SwStageShape *out);

G_END_DECLS
