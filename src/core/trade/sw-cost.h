/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-cost.h: development and production effort of a vehicle, in the form of
 * the published statistical cost model (Koelle, TRANSCOST 7.x/8.x; form read
 * in a secondary description, coefficients from memory, see sw-economics.c):
 *
 *   development  C_D = f0 * sum over elements a M^x,  f0 = base^N (N stages)
 *   first unit   C_1 = b M^y per element
 *   learning     C(q) = C_1 q^B, B = ln(S) / ln(2)  (NASA SE Handbook form)
 *
 * M is the element's dry mass in kg, results are work-years.  The elements
 * are the stages (their dry mass less their engines) and the engine types.
 * An element marked developed costs no development; an engine type used on
 * several stages is developed once and produced for all of them.  A stage
 * without an engine type has its own engine, of mass engine_mass_fraction of
 * the stage's dry mass.  Operations, launch site, insurance and the like are
 * not in the model.  The figures are estimates of effort, never a quote.
 *
 * Strap-on boosters (our choice of how they enter the published form): the
 * booster set is two elements, developed once however many a vehicle
 * carries.  The booster element is one booster's dry mass less its engine,
 * costed with the stage relationships (a M^x, b M^y); the booster's engine
 * is an engine of its own, of engine_mass_fraction of the booster's dry
 * mass (as for a stage without an engine type: the economics keys give the
 * boosters no engine type), costed with the engine relationships.  The
 * economics key "developed_boosters" marks both already developed (no
 * development effort, still produced).  Each is built count
 * times per vehicle, so its learning curve runs over count x production-run
 * units.  The systems factor counts the booster set as one more element:
 * f0 = base^(N + 1) (the published model's N counts the vehicle's major
 * elements, strap-ons included; from memory).  The published model has
 * relationships of its own for solid motors (from memory); they are not
 * used: a solid booster is costed as a liquid stage with an engine.
 * Recovered boosters (recovered_boosters, the economics' "booster_mode"):
 * each booster flies flights_per_stage times, so the run builds
 * ceil(count x run / flights) boosters and booster engines in place of
 * count x run (the fleet shared among the vehicles), and every booster
 * flight that does not use a new booster readies a used one at
 * refurbishment_fraction of a booster's first-unit cost (element and
 * engine), as for a recovered first stage. */
#pragma once

#include "sw-design.h"
#include "sw-sizing.h"
#include "sw-types.h"

G_BEGIN_DECLS

/* Engine elements: the design's engine types, then one own engine per stage
 * that has no type, then the boosters' engine. */
#define SW_COST_MAX_ENGINES (SW_ECONOMICS_MAX_ENGINE_TYPES + SW_MAX_STAGES + 1)

/* What the cost model needs of a vehicle. */
typedef struct {
  guint  n_stages;
  double dry_mass_kg[SW_MAX_STAGES];    /* structure, engines and landing gear */
  guint  engine_count[SW_MAX_STAGES];
  gboolean recovered_first_stage;       /* stage 0 flies flights_per_stage times */
  guint  booster_count;                 /* strap-on boosters; 0: none */
  double booster_dry_mass_kg;           /* one booster: structure and its engine
                                         * (and landing gear when recovered) */
  gboolean recovered_boosters;          /* each booster flies flights_per_stage times */
} SwCostVehicle;

typedef struct {
  gboolean used;
  char     name[SW_NAME_MAX];
  double   dry_mass_kg;                 /* one engine */
  guint    per_vehicle;                 /* engines of this element on one vehicle */
  gboolean developed;
  double   development_work_years;      /* a M^x, before f0; 0 when developed */
  double   first_unit_work_years;       /* b M^y, one engine */
} SwCostEngine;

typedef struct {
  guint  n_stages;
  double systems_factor;                             /* f0 */
  double stage_mass_kg[SW_MAX_STAGES];               /* stage element: dry less engines */
  double stage_development_work_years[SW_MAX_STAGES];/* before f0; 0 when developed */
  double stage_first_unit_work_years[SW_MAX_STAGES];
  guint  n_engines;
  SwCostEngine engines[SW_COST_MAX_ENGINES];
  int    engine_of_stage[SW_MAX_STAGES];             /* index into engines */
  guint  booster_count;                              /* 0: no booster elements */
  double booster_mass_kg;                            /* one booster less its engine */
  double booster_development_work_years;             /* a M^x, before f0 */
  double booster_first_unit_work_years;              /* b M^y, one booster */
  guint  booster_units;                              /* boosters built over the run */
  int    booster_engine;                             /* index into engines; -1 none */
  double development_work_years;                     /* f0 * sum */
  double first_vehicle_work_years;                   /* every element's first unit */
  double production_work_years;                      /* the whole run, learning included */
  double cost_per_flight_work_years;                 /* production / flights */
  guint  flights;                                    /* the production run, in flights */
  gboolean has_money;
  double work_year_cost;                             /* NAN unless has_money */
} SwCost;

/* a M^x, the published form of one element's development effort. */
double   sw_cost_development (double a, double x, double mass_kg);
/* b M^y, one element's first-unit production effort. */
double   sw_cost_first_unit (double b, double y, double mass_kg);
/* base^N. */
double   sw_cost_systems_factor (double base, guint n_elements);
/* C(q) / C(1) = q^B, B = ln S / ln 2. */
double   sw_cost_learning_unit (double learning_rate, double unit);
/* The sum of q^B over q = 1..@units: the run's cost in first units. */
double   sw_cost_learning_total (double learning_rate, guint units);

/* The vehicle of a sizing, the engine counts from the design's reliability
 * keys (stage k of the sizing taking design stage min(k, n - 1)); the
 * boosters from the sizing's (SwSizing.boosters: count and one booster's
 * structural mass) when it has any. */
void     sw_cost_vehicle_from_sizing (SwCostVehicle *vehicle, const SwSizing *sizing,
                                      const SwDesign *design);

/* Development and production effort of @vehicle under @design's economics.
 * Stage k >= the design's stage count (the stage-count trade) is a new
 * stage with the keys of the design's top stage: that stage's engine type,
 * shared, when it has one, else an engine of its own. */
void     sw_cost_compute (const SwDesign *design, const SwCostVehicle *vehicle, SwCost *out);

/* Work-years to money with the design's cost per work-year; NAN without one. */
double   sw_cost_to_money (const SwCost *cost, double work_years);

G_END_DECLS
