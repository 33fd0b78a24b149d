/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-phases.h: the flight of a sized vehicle in phases (one per stage that
 * fires, in firing order), and the shape of each stage from its propellant
 * (sw-propellant.h) and diameter. */
#pragma once

#include "sw-booster-sizing.h"
#include "sw-propellant.h"
#include "sw-sizing.h"

G_BEGIN_DECLS

/* The most phases a vehicle has: one per stage, and phase 0 with boosters. */
#define SW_MAX_PHASES (SW_MAX_STAGES + 1)

typedef struct {
  guint  stage;                    /* index of the stage that burns (0: the core) */
  gboolean boosters;               /* phase 0: the boosters burn beside the core */
  double delta_v_m_s;
  double exhaust_velocity_m_s;
  double initial_mass_kg;
  double final_mass_kg;
  double duration_s;               /* propellant over vacuum mass flow; NAN without thrust */
  /* The fairing dropped during this phase: its mass and the vehicle's mass
   * just before it drops (NAN both when it does not drop here).  The
   * phase's delta-v is then the burn before the drop plus the burn after,
   * not c ln(initial / final). */
  double fairing_mass_kg;
  double fairing_drop_mass_kg;
} SwPhase;

/* The phases of @sizing (SW_MAX_PHASES entries); returns their count, 0 when
 * the sizing is infeasible.  With boosters the first is phase 0 (boosters
 * and core, stage 0, boosters TRUE), then the core's own phase (stage 0),
 * then the upper stages. */
guint    sw_sizing_phases (const SwDesign *design, const SwSizing *sizing, SwPhase *phases);

/* The diameter of stage @stage: its own, or the first one given below it
 * (as the ascent model has it); NAN when none is given. */
double   sw_stage_effective_diameter (const SwDesign *design, guint stage);

/* The phase's name for people: the stage's name, and for phase 0
 * "BOOSTERS + CORE" (the boosters' and the core's names). */
char    *sw_phase_dup_name (const SwDesign *design, const SwPhase *phase);

/* The shape of one booster with the propellant of @sizing (its own
 * diameter_m, NAN when none is given). */
void     sw_sizing_booster_shape (const SwDesign *design, const SwSizing *sizing,
                                  SwStageShape *out);

/* The shape of stage @stage with the propellant of @sizing. */
void     sw_sizing_stage_shape (const SwDesign *design, const SwSizing *sizing, guint stage,
                                SwStageShape *out);

/* Payload capability of a vehicle whose every stage has a fixed propellant
 * load (propellant_kg): the payload at which its delta-v equals the
 * design's required delta-v (the mission's target, or the orbit's budget
 * plus the loss allowance), by Brent's method (sw_fixed_vehicle_payload), and
 * the sizing at that payload.  FALSE with @error when a stage is not fixed.
 * A vehicle that falls short even with no payload is an answer: *reachable
 * FALSE, @reason says by how much, @sizing is the sizing with no payload. */
typedef struct {
  gboolean reachable;
  double   payload_kg;              /* NAN when not reachable */
  double   delta_v_m_s;             /* required */
  double   empty_delta_v_m_s;       /* the vehicle's delta-v with no payload */
  char     reason[SW_REASON_MAX];
  SwSizing sizing;                  /* at payload_kg (or with no payload) */
} SwPerformance;

gboolean sw_design_performance (const SwDesign *design, SwPerformance *out, GError **error);

/* TRUE when every stage, and the boosters when there are any, has a fixed
 * propellant load: a vehicle that exists, whose liftoff mass the sizing does
 * not change (its outputs are the payload capability and the delta-v margin). */
gboolean sw_design_all_fixed (const SwDesign *design);

/* A vehicle of fixed loads as the phased vehicle (sw-booster-sizing.h)
 * carries it: every fixed_kg > 0, and booster_fixed_kg > 0 with boosters
 * (each structure load eps / (1 - eps), the set's fairing).  The payload it
 * carries to @delta_v_m_s: without boosters the serial rocket equation
 * (sw_fixed_vehicle_payload; may be negative: short even empty, by that
 * mass), with boosters sw_parallel_payload (NAN when short even empty).
 * NAN when a load is not fixed. */
double   sw_fixed_loads_payload (const SwParallelVehicle *v, double delta_v_m_s);
/* The delta-v of that vehicle with @payload_kg on top (NAN when a burnout
 * mass is not positive or a load is not fixed). */
double   sw_fixed_loads_delta_v (const SwParallelVehicle *v, double payload_kg);
/* Its liftoff mass with @payload_kg: the payload, the fairing, every stage's
 * and booster's load over (1 - eps); whether or not it reaches a mission. */
double   sw_fixed_loads_liftoff_mass (const SwParallelVehicle *v, double payload_kg);

G_END_DECLS
