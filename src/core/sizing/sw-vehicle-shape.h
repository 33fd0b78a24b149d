/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-vehicle-shape.h: the true shape of a sized vehicle, in metres.
 *
 * Every stage is drawn from the base up: its engine section, its lower tank,
 * the intertank, its upper tank (sw_stage_shape in sw-propellant.h).  Between
 * two stages sits an interstage; on top, the payload fairing.  Our rules
 * (common practice in proportion, from memory; ours to document, see README
 * "The shape of the vehicle"):
 *   interstage   SW_INTERSTAGE_PER_DIAMETER x the larger of the two
 *                diameters (the joint beyond the upper stage's engine
 *                section, which the stage length already holds); a frustum
 *                when the diameters differ
 *   fairing      the top stage's diameter, SW_FAIRING_LENGTH_PER_DIAMETER x
 *                that diameter long: a cylinder of SW_FAIRING_CYLINDER_PER_
 *                DIAMETER diameters and a nose of the rest
 * A stage without a propellant has no length: the vehicle then has no shape
 * and *reason says which stage lacks what (no silent guess).  A stage without
 * its own diameter takes the one below it (as the ascent does); the first
 * stage needs one. */
#pragma once

#include "sw-propellant.h"
#include "sw-sizing.h"

G_BEGIN_DECLS

#define SW_INTERSTAGE_PER_DIAMETER 0.3
#define SW_FAIRING_LENGTH_PER_DIAMETER 2.5
#define SW_FAIRING_CYLINDER_PER_DIAMETER 1.2
/* The height of a person for scale in the drawings (1.8 m). */
#define SW_PERSON_HEIGHT_M 1.8

typedef struct {
  gboolean     has_shape;          /* propellant and diameter known */
  SwStageShape shape;              /* volumes always when a propellant is given */
  double       diameter_m;         /* in effect (own or inherited); NAN without */
  gboolean     diameter_inherited; /* from a stage below */
  double       base_m;             /* height of the stage's base above the vehicle's */
  double       interstage_length_m;  /* above this stage; 0 for the top one */
  double       interstage_top_diameter_m;  /* the upper stage's diameter */
} SwStageGeometry;

typedef struct {
  gboolean complete;               /* every stage has a length: heights valid */
  char     reason[SW_REASON_MAX];  /* when !complete, plain words */
  guint    n_stages;
  SwStageGeometry stages[SW_MAX_STAGES];
  double   fairing_diameter_m;
  double   fairing_cylinder_m;
  double   fairing_length_m;
  double   fairing_base_m;
  double   height_m;               /* base of stage 1 to the fairing's tip */
  double   max_diameter_m;           /* of the stages and the fairing */
  /* The vehicle's width seen from the side: the stages', or with boosters
   * the core's diameter plus a booster on each side (one with one booster)
   * when that is wider, as the to-scale drawing shows them. */
  double   width_m;
  /* Strap-on boosters beside the core (sw-stack-drawing.c draws them): one
   * booster's length from its propellant (the tanks of sw_stage_shape) and
   * its diameter (its own, or half the core's, as for its drag area); the
   * shape is not complete when the boosters have no propellant.  0 and NAN
   * without boosters. */
  guint    n_boosters;
  double   booster_diameter_m;
  double   booster_length_m;
} SwVehicleShape;

/* The shape of the vehicle @sizing describes. */
void sw_vehicle_shape_compute (const SwDesign *design, const SwSizing *sizing,
                               SwVehicleShape *out);

/* Wetted (side) area of a frustum of diameters @d1, @d2 and length @length:
 * pi (r1 + r2) sqrt ((r1 - r2)^2 + L^2) (a cylinder when equal). */
double sw_frustum_side_area (double d1, double d2, double length);

/* Surface area of a tank of diameter @diameter and length @length made of a
 * cylinder and two oblate-spheroid domes of aspect ratio @aspect (the
 * spheroid's area 2 pi a^2 (1 + (1 - e^2) atanh (e) / e), e = sqrt (1 - 1/k^2),
 * CRC Standard Mathematical Tables). */
double sw_tank_surface_area (double diameter, double length, double aspect);

G_END_DECLS
