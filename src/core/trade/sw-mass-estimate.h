/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-mass-estimate.h: the structural coefficient of each stage estimated
 * from published mass-estimating relationships (MERs), at a fixed point with
 * the sizing.
 *
 * Relationships (Akin, "Mass Estimating Relations", University of Maryland
 * lecture notes, 2016; see shared reference values, "Mass-estimating
 * relationships"), masses in kg:
 *   tanks             12.158 kg per m^3 of tank volume (LOX, kerosene and,
 *                     our assumption, every other storable or methane tank);
 *                     9.0911 kg/m^3 for a hydrogen tank
 *   insulation        per m^2 of tank surface: LH2 2.88, LOX 1.123 (liquid
 *                     methane: the LOX figure, our assumption); none for
 *                     storable propellants
 *   engines           per engine 7.81e-4 T + 3.37e-5 T sqrt (Ae/At) + 59
 *                     (T per engine in N, vacuum); area ratio Ae/At assumed
 *                     SW_MER_AREA_RATIO_FIRST for stage 1 and
 *                     SW_MER_AREA_RATIO_UPPER above (from memory, stated)
 *   thrust structure  2.55e-4 T (T the stage's thrust in N)
 *   interstage        4.95 A^1.15 (A its side area in m^2, from
 *                     sw-vehicle-shape.h); counted with the stage below it
 *   avionics          10 M0^0.361 (M0 the stage's gross mass: propellant
 *                     and structure; our reading for one stage of many)
 *   wiring            1.058 sqrt (M0) L^0.25 (L the stage's length in m)
 *   motor case        0.135 Mp for a solid stage (in place of tanks,
 *                     insulation, engines and thrust structure)
 * A stage without thrust_vac_kn takes the thrust its default ignition
 * thrust-to-weight gives (sw-stage-thrust.h), marked as assumed.
 *
 * Strap-on boosters ("boosters"), per booster, with its own propellant,
 * thrust and diameter (its own, or half the core's, as the vehicle shape
 * and the drag area take it):
 *   tanks, insulation, engines, thrust structure as a stage (one engine of
 *                     the booster's thrust, area ratio SW_MER_AREA_RATIO_
 *                     FIRST: it fires from the ground); a solid booster the
 *                     motor case in their place
 *   nose cone         4.95 A^1.15, the fairing relationship (Akin 2016) on
 *                     the side area A of a cone of the booster's diameter
 *                     and SW_MER_BOOSTER_NOSE_PER_DIAMETER diameters long
 *                     (our assumption: a booster's nose is a small fairing;
 *                     the length is our choice, the proportion the drawings
 *                     use)
 *   attachment        2.55e-4 F_b, the thrust-structure relationship (Akin
 *                     2016) again on the booster's thrust (our assumption:
 *                     the fittings carry the booster's thrust into the core;
 *                     no published relationship for them is at hand)
 *   avionics, wiring  as a stage, on one booster's gross mass and length
 * No interstage: nothing stands on a booster.  The boosters' coefficient
 * joins the fixed point with the stages'.  Fixed boosters keep their load;
 * sized ones keep the load of the design's own sizing (the load of least
 * liftoff mass with the design's coefficients), held like the split below
 * and for the same reason: re-choosing it each round with a coefficient that
 * rises as the booster shrinks (its engine and fittings do not) runs away to
 * no booster at all (a coefficient near 1 in a trial).  Accepting the
 * estimate lets the sizing choose their load again.
 *
 * The fixed point: size with the coefficients, estimate the structure from
 * the sized masses, eps = Ms / (Ms + Mp), size again, until no coefficient
 * moves by more than 1e-10.  The delta-v split is held at the design's own
 * sizing (its shares, as a manual split): re-optimising the split with
 * coefficients that fall as a stage grows runs away, the optimum piling
 * delta-v onto the stage that gets lighter.  So the estimate is the one of
 * the vehicle as split now; accepting it into an optimal-split design
 * re-optimises the split, and a new estimate of that vehicle may differ a
 * little.  A stage without a propellant or a diameter keeps
 * the design's coefficient and says why (it still takes part in the sizing).
 * The sizing uses the design's required delta-v; for a "simulate" design the
 * analysis estimates again with the closed loop's losses once it has them. */
#pragma once

#include "sw-design.h"
#include "sw-sizing.h"

G_BEGIN_DECLS

#define SW_MER_AREA_RATIO_FIRST 20.0
#define SW_MER_AREA_RATIO_UPPER 60.0
#define SW_MER_TOLERANCE 1e-10
#define SW_MER_MAX_ITERATIONS 200
/* A booster's nose cone, in booster diameters (our choice, see above). */
#define SW_MER_BOOSTER_NOSE_PER_DIAMETER 1.2

typedef enum {
  SW_MER_TANKS,
  SW_MER_INSULATION,
  SW_MER_ENGINES,
  SW_MER_THRUST_STRUCTURE,
  SW_MER_INTERSTAGE,
  SW_MER_AVIONICS,
  SW_MER_WIRING,
  SW_MER_MOTOR_CASE,
  SW_MER_NOSE_CONE,                /* boosters only */
  SW_MER_ATTACHMENT,               /* boosters only */
  SW_N_MER
} SwMerItem;

typedef struct {
  gboolean estimated;              /* FALSE: kept the design's, reason says why */
  char     reason[SW_REASON_MAX];
  double   item_kg[SW_N_MER];
  double   structural_mass_kg;     /* the sum */
  double   propellant_mass_kg;     /* at the fixed point */
  double   gross_mass_kg;          /* the stage's own, propellant and structure */
  double   structural_coefficient; /* estimated (or the design's when !estimated) */
  double   design_coefficient;     /* what the file says */
  double   thrust_n;               /* the thrust the MERs used */
  gboolean thrust_assumed;         /* from the default ignition thrust-to-weight */
  guint    engine_count;
  double   area_ratio;             /* assumed */
  double   tank_volume_m3;
  double   tank_area_m2;
  double   interstage_area_m2;
  double   nose_area_m2;            /* boosters: the nose cone's side area; else 0 */
  double   diameter_m;              /* the diameter the areas used; NAN without */
  double   length_m;
} SwStageEstimate;

typedef struct {
  gboolean ok;                     /* converged to a feasible sizing */
  gboolean any_estimated;          /* at least one stage was estimated */
  char     reason[SW_REASON_MAX];  /* when !ok */
  guint    iterations;
  double   residual;               /* largest coefficient change of the last step */
  guint    n_stages;
  SwStageEstimate stages[SW_MAX_STAGES];
  /* One booster (masses per booster), when the design has boosters; its
   * engine_count is 1 and its interstage_area_m2 0. */
  gboolean has_boosters;
  gboolean boosters_load_held;     /* sized boosters, their load held (see above) */
  SwStageEstimate boosters;
  double   liftoff_mass_kg;        /* sized with the estimated coefficients */
} SwMassEstimate;

/* The fixed point for @design (see above).  "any_estimated" counts the
 * boosters too. */
void        sw_mass_estimate_design (const SwDesign *design, SwMassEstimate *out);

/* One relationship each (the published forms, for tests and the working). */
double      sw_mer_tank_mass (double tank_volume_m3, gboolean hydrogen);
double      sw_mer_engine_mass (double thrust_n, double area_ratio);
double      sw_mer_thrust_structure_mass (double thrust_n);
double      sw_mer_shroud_mass (double wetted_area_m2);   /* fairing and interstage */
double      sw_mer_avionics_mass (double gross_mass_kg);
double      sw_mer_wiring_mass (double gross_mass_kg, double length_m);

/* For people: the item's name and the source of its relationship
 * (translated). */
const char *sw_mer_item_label (SwMerItem item);
const char *sw_mer_item_source (SwMerItem item);
/* For scripts: "tanks", "insulation", ... */
const char *sw_mer_item_key (SwMerItem item);

G_END_DECLS
