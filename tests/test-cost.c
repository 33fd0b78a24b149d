/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Tests of the cost model against the values computed in the project's
 * reference notes (/work/shared/reference-values.md, "Cost-estimating
 * relationships" and "Engine-out reliability").  Each check names its
 * source; the reference values are rounded as printed there, so each
 * tolerance is half a unit of the last printed digit. */
#include "config.h"

#include "sw-cost.h"
#include "sw-design.h"
#include "sw-economics.h"
#include "sw-reliability.h"

#include <math.h>
#include <string.h>

/* Development a M^x and first unit b M^y with the default (published-form,
 * coefficients from memory) table: reference values, "Cost-estimating
 * relationships" (Koelle, TRANSCOST form): 10 t stage 16,596 and 290
 * work-years; 1 t engine 7,629 and 76.5 work-years (computed there). */
static void
test_cer_reference (void)
{
  SwEconomics e;
  const double *c;

  sw_economics_init (&e);
  c = e.coefficients;
  g_assert_cmpfloat_with_epsilon (
    sw_cost_development (c[SW_CER_STAGE_DEV_FACTOR], c[SW_CER_STAGE_DEV_EXPONENT], 10000.0),
    16596.0, 0.5);
  g_assert_cmpfloat_with_epsilon (
    sw_cost_first_unit (c[SW_CER_STAGE_UNIT_FACTOR], c[SW_CER_STAGE_UNIT_EXPONENT], 10000.0),
    290.0, 0.5);
  g_assert_cmpfloat_with_epsilon (
    sw_cost_development (c[SW_CER_ENGINE_DEV_FACTOR], c[SW_CER_ENGINE_DEV_EXPONENT], 1000.0),
    7629.0, 0.5);
  g_assert_cmpfloat_with_epsilon (
    sw_cost_first_unit (c[SW_CER_ENGINE_UNIT_FACTOR], c[SW_CER_ENGINE_UNIT_EXPONENT], 1000.0),
    76.5, 0.05);
  /* No mass, no element. */
  g_assert_cmpfloat (sw_cost_development (100.0, 0.555, 0.0), ==, 0.0);
}

/* f0 = 1.04^N: reference values, "Cost-estimating relationships":
 * 1.0816, 1.1249, 1.1699 for N = 2, 3, 4 (computed there). */
static void
test_systems_factor (void)
{
  SwEconomics e;

  sw_economics_init (&e);
  g_assert_cmpfloat_with_epsilon (sw_cost_systems_factor (e.coefficients[SW_CER_SYSTEMS_BASE], 2),
                                  1.0816, 5e-5);
  g_assert_cmpfloat_with_epsilon (sw_cost_systems_factor (e.coefficients[SW_CER_SYSTEMS_BASE], 3),
                                  1.1249, 5e-5);
  g_assert_cmpfloat_with_epsilon (sw_cost_systems_factor (e.coefficients[SW_CER_SYSTEMS_BASE], 4),
                                  1.1699, 5e-5);
}

/* Learning curve C(Q) = C(1) Q^b, b = ln S / ln 2: reference values,
 * "Cost-estimating relationships" (NASA Systems Engineering Handbook form):
 * S = 0.90, unit 10 costs 0.7047 of the first and the mean of units 1-100
 * is 0.5814; S = 0.85, unit 10 costs 0.5828. */
static void
test_learning_curve (void)
{
  g_assert_cmpfloat_with_epsilon (sw_cost_learning_unit (0.90, 10), 0.7047, 5e-5);
  g_assert_cmpfloat_with_epsilon (sw_cost_learning_total (0.90, 100) / 100.0, 0.5814, 5e-5);
  g_assert_cmpfloat_with_epsilon (sw_cost_learning_unit (0.85, 10), 0.5828, 5e-5);
  /* Each doubling multiplies the unit cost by S (the definition of S). */
  g_assert_cmpfloat_with_epsilon (sw_cost_learning_unit (0.85, 16) / sw_cost_learning_unit (0.85, 8),
                                  0.85, 1e-12);
  /* S = 1: every unit costs the first. */
  g_assert_cmpfloat_with_epsilon (sw_cost_learning_total (1.0, 37), 37.0, 1e-12);
  /* Beyond the units summed one by one the run is integrated: the same sum
   * as a plain loop to 1e-9 relative. */
  for (guint units = 1999; units <= 6000; units += 4001 / 3)
    {
      double direct = 0.0;
      for (guint q = 1; q <= units; q++)
        direct += pow (q, log (0.9) / log (2.0));
      g_assert_cmpfloat_with_epsilon (sw_cost_learning_total (0.9, units) / direct, 1.0, 1e-9);
    }
}

/* k of n engines: reference values, "Engine-out reliability" (computed):
 * 9 engines at p = 0.995: 0.955890 all needed, 0.999121 one out allowed;
 * 5 engines at p = 0.99: 0.950990 and 0.999020. */
static void
test_engine_out_binomials (void)
{
  g_assert_cmpfloat_with_epsilon (sw_reliability_engines (9, 0.995, 0), 0.955890, 5e-7);
  g_assert_cmpfloat_with_epsilon (sw_reliability_engines (9, 0.995, 1), 0.999121, 5e-7);
  g_assert_cmpfloat_with_epsilon (sw_reliability_engines (5, 0.99, 0), 0.950990, 5e-7);
  g_assert_cmpfloat_with_epsilon (sw_reliability_engines (5, 0.99, 1), 0.999020, 5e-7);
}

static SwDesign *
two_stage_design (void)
{
  SwDesign *d = sw_design_new_default ();

  d->economics.present = TRUE;
  return d;
}

/* A vehicle of two 11 t stages with one 1 t engine each: stage elements of
 * 10 t.  With one engine type on both stages, the development is
 * f0 (2 x 16,596 + 7,629) = 1.0816 x 40,821 = 44,152 work-years, from the
 * reference notes' rounded values (tolerance from their rounding: 4); with
 * two engine types, one engine development more. */
static void
test_shared_engine_developed_once (void)
{
  g_autoptr (SwDesign) d = two_stage_design ();
  SwCostVehicle v = { 0 };
  SwCost shared, separate;

  v.n_stages = 2;
  v.dry_mass_kg[0] = v.dry_mass_kg[1] = 11000.0;
  v.engine_count[0] = v.engine_count[1] = 1;

  d->economics.n_engine_types = 1;
  g_strlcpy (d->economics.engine_types[0].name, "E", SW_NAME_MAX);
  d->economics.engine_types[0].dry_mass_kg = 1000.0;
  d->economics.engine_types[0].stage_mask = 0x3;
  sw_cost_compute (d, &v, &shared);
  g_assert_cmpfloat_with_epsilon (shared.development_work_years, 44152.0, 4.0);
  g_assert_cmpfloat_with_epsilon (shared.stage_mass_kg[0], 10000.0, 1e-9);
  g_assert_cmpint (shared.engine_of_stage[0], ==, shared.engine_of_stage[1]);
  /* Two production streams: two engines per vehicle. */
  g_assert_cmpuint (shared.engines[0].per_vehicle, ==, 2);

  d->economics.n_engine_types = 2;
  d->economics.engine_types[0].stage_mask = 0x1;
  d->economics.engine_types[1] = d->economics.engine_types[0];
  d->economics.engine_types[1].stage_mask = 0x2;
  sw_cost_compute (d, &v, &separate);
  g_assert_cmpfloat_with_epsilon (separate.development_work_years
                                    - shared.development_work_years,
                                  1.0816 * 7629.0, 1.0);
  /* Production does not depend on how the engines are grouped, except
   * through learning: the shared stream learns faster. */
  g_assert_cmpfloat (shared.production_work_years, <, separate.production_work_years);

  /* A developed engine costs no development; a developed stage neither. */
  d->economics.engine_types[0].developed = TRUE;
  d->economics.developed_stages = 0x2;
  sw_cost_compute (d, &v, &separate);
  g_assert_cmpfloat_with_epsilon (separate.development_work_years, 1.0816 * (16596.0 + 7629.0),
                                  3.0);
}

/* Production: first units along the learning curve, per flight. */
static void
test_production_run (void)
{
  g_autoptr (SwDesign) d = two_stage_design ();
  SwCostVehicle v = { 0 };
  SwCost cost, reused;
  double stage_unit, engine_unit, refurb;

  v.n_stages = 1;
  v.dry_mass_kg[0] = 11000.0;
  v.engine_count[0] = 1;
  d->economics.n_engine_types = 1;
  d->economics.engine_types[0].dry_mass_kg = 1000.0;
  d->economics.engine_types[0].stage_mask = 0x1;
  d->economics.production_run = 100;
  d->economics.learning_rate = 0.9;
  sw_cost_compute (d, &v, &cost);
  stage_unit = cost.stage_first_unit_work_years[0];
  engine_unit = cost.engines[0].first_unit_work_years;
  /* 290 + 76.5 work-years for the first vehicle (reference notes). */
  g_assert_cmpfloat_with_epsilon (cost.first_vehicle_work_years, 290.0 + 76.5, 0.55);
  /* Mean of units 1-100 at S = 0.9: 0.5814 of the first (reference notes). */
  g_assert_cmpfloat_with_epsilon (cost.cost_per_flight_work_years
                                    / cost.first_vehicle_work_years,
                                  0.5814, 5e-5);
  g_assert_cmpfloat (cost.stage_development_work_years[0], >, 0.0);
  g_assert_true (isnan (sw_cost_to_money (&cost, 1.0)));

  /* Recovered, 10 flights per stage, 10 % refurbishment: 10 stages built,
   * 90 flights readied at 0.1 of the first unit. */
  d->economics.flights_per_stage = 10;
  d->economics.refurbishment_fraction = 0.1;
  d->economics.has_work_year_cost = TRUE;
  d->economics.work_year_cost = 250000.0;
  v.recovered_first_stage = TRUE;
  sw_cost_compute (d, &v, &reused);
  refurb = 90 * 0.1 * (stage_unit + engine_unit);
  g_assert_cmpfloat_with_epsilon (reused.production_work_years,
                                  (stage_unit + engine_unit) * sw_cost_learning_total (0.9, 10)
                                    + refurb,
                                  1e-9 * reused.production_work_years);
  g_assert_cmpfloat (reused.cost_per_flight_work_years, <, cost.cost_per_flight_work_years);
  g_assert_cmpfloat_with_epsilon (sw_cost_to_money (&reused, 2.0), 500000.0, 1e-6);
}

/* Strap-on boosters as elements (sw-cost.h): two 11 t stages sharing one
 * 1 t engine type, and four boosters of 5 t dry each, whose own engine is
 * engine_mass_fraction 0.25 of it (1,250 kg), the booster element the other
 * 3,750 kg.  Closed forms worked by hand (python, from the published form
 * with the default coefficients, which are from memory): with f0 = 1.04^3
 * (the booster set one more element),
 *   development = 1.04^3 (2 x 100 x 10000^0.555 + 277 x 1000^0.48
 *                         + 100 x 3750^0.555 + 277 x 1250^0.48) = 66,301.54
 *   first vehicle = 2 x 1.265 x 10000^0.59 + 2 x 1.9 x 1000^0.535
 *                   + 4 (1.265 x 3750^0.59 + 1.9 x 1250^0.535) = 1,727.370
 *   production over 10 vehicles at S = 0.9: each element's first unit times
 *   the learning sum over its own units (stages 10 each, the shared engine
 *   20, boosters and their engines 40): 12,352.07 work-years.
 * The learning sums are checked against the plain loop of q^B as well. */
static void
test_boosters_as_elements (void)
{
  g_autoptr (SwDesign) d = two_stage_design ();
  SwCostVehicle v = { 0 };
  SwCost four, one, none;
  double b = log (0.9) / log (2.0), l40 = 0.0;

  d->economics.production_run = 10;
  d->economics.learning_rate = 0.9;
  d->economics.n_engine_types = 1;
  g_strlcpy (d->economics.engine_types[0].name, "E", SW_NAME_MAX);
  d->economics.engine_types[0].dry_mass_kg = 1000.0;
  d->economics.engine_types[0].stage_mask = 0x3;
  v.n_stages = 2;
  v.dry_mass_kg[0] = v.dry_mass_kg[1] = 11000.0;
  v.engine_count[0] = v.engine_count[1] = 1;
  v.booster_count = 4;
  v.booster_dry_mass_kg = 5000.0;
  sw_cost_compute (d, &v, &four);

  g_assert_cmpfloat_with_epsilon (four.systems_factor, 1.04 * 1.04 * 1.04, 1e-12);
  g_assert_cmpfloat_with_epsilon (four.booster_mass_kg, 3750.0, 1e-9);
  g_assert_cmpint (four.booster_engine, >=, 0);
  g_assert_cmpfloat_with_epsilon (four.engines[four.booster_engine].dry_mass_kg, 1250.0, 1e-9);
  g_assert_cmpuint (four.engines[four.booster_engine].per_vehicle, ==, 4);
  g_assert_cmpfloat_with_epsilon (four.booster_development_work_years, 9629.137, 1e-3);
  g_assert_cmpfloat_with_epsilon (four.engines[four.booster_engine].development_work_years,
                                  8491.738, 1e-3);
  g_assert_cmpfloat_with_epsilon (four.development_work_years, 66301.54, 0.01);
  g_assert_cmpfloat_with_epsilon (four.first_vehicle_work_years, 1727.370, 1e-3);
  g_assert_cmpfloat_with_epsilon (four.production_work_years, 12352.07, 0.01);
  g_assert_cmpfloat_with_epsilon (four.cost_per_flight_work_years, 1235.207, 1e-3);
  for (guint q = 1; q <= 40; q++)
    l40 += pow (q, b);
  g_assert_cmpfloat_with_epsilon (sw_cost_learning_total (0.9, 40), l40, 1e-9);
  g_assert_cmpfloat_with_epsilon (l40, 26.54271, 1e-5);

  /* Developed once, built four times per vehicle: one booster needs the
   * same development, and a quarter of the booster units. */
  v.booster_count = 1;
  sw_cost_compute (d, &v, &one);
  g_assert_cmpfloat_with_epsilon (one.development_work_years, four.development_work_years,
                                  1e-9 * four.development_work_years);
  g_assert_cmpfloat_with_epsilon (four.first_vehicle_work_years - one.first_vehicle_work_years,
                                  3.0 * (1.265 * pow (3750.0, 0.59) + 1.9 * pow (1250.0, 0.535)),
                                  1e-9);
  g_assert_cmpfloat (four.production_work_years, >, one.production_work_years);
  /* Four boosters cost less than four times one booster's production: they
   * learn over 40 units, not 10. */
  {
    double unit = 1.265 * pow (3750.0, 0.59) + 1.9 * pow (1250.0, 0.535);
    g_assert_cmpfloat_with_epsilon (four.production_work_years - one.production_work_years,
                                    unit * (l40 - sw_cost_learning_total (0.9, 10)), 1e-6);
    g_assert_cmpfloat (four.production_work_years - one.production_work_years, <,
                       3.0 * unit * sw_cost_learning_total (0.9, 10));
  }

  /* Boosters marked developed (economics "developed_boosters"): neither
   * the booster element nor its engine costs development, the systems
   * factor still counts the set, and production is unchanged (the hand
   * figures above less 9,629.137 and 8,491.738 before f0). */
  {
    SwCost dev;

    v.booster_count = 4;
    d->economics.developed_boosters = TRUE;
    sw_cost_compute (d, &v, &dev);
    d->economics.developed_boosters = FALSE;
    g_assert_cmpfloat (dev.booster_development_work_years, ==, 0.0);
    g_assert_cmpfloat (dev.engines[dev.booster_engine].development_work_years, ==, 0.0);
    g_assert_cmpfloat_with_epsilon (dev.systems_factor, 1.04 * 1.04 * 1.04, 1e-12);
    g_assert_cmpfloat_with_epsilon (dev.development_work_years,
                                    66301.54 - 1.04 * 1.04 * 1.04 * (9629.137 + 8491.738), 0.01);
    g_assert_cmpfloat_with_epsilon (dev.production_work_years, four.production_work_years, 1e-9);
  }

  /* Without boosters: two elements fewer and f0 = 1.04^2. */
  v.booster_count = 0;
  sw_cost_compute (d, &v, &none);
  g_assert_cmpint (none.booster_engine, ==, -1);
  g_assert_cmpfloat_with_epsilon (none.development_work_years,
                                  1.04 * 1.04 * (2.0 * 100.0 * pow (10000.0, 0.555)
                                                 + 277.0 * pow (1000.0, 0.48)),
                                  1e-6);
}

/* The vehicle of a sizing with boosters carries them: count and one
 * booster's structure (its dry mass), as the sizing gives them. */
static void
test_vehicle_from_sizing_boosters (void)
{
  g_autoptr (GError) error = NULL;
  g_autofree char *path = g_build_filename (g_getenv ("SW_SOURCE_ROOT") != NULL
                                              ? g_getenv ("SW_SOURCE_ROOT") : ".",
                                            "data", "designs", "four-booster-cargo.stagewright",
                                            NULL);
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, &error);
  SwSizing sizing;
  SwCostVehicle v;

  g_assert_no_error (error);
  g_assert_true (sw_size_design (d, &sizing, NULL));
  g_assert_true (sizing.boosters.present);
  sw_cost_vehicle_from_sizing (&v, &sizing, d);
  g_assert_cmpuint (v.booster_count, ==, 4);
  /* The demo's fixed load: 30,000 kg at eps 0.11, structure 30000 x 0.11 / 0.89. */
  g_assert_cmpfloat_with_epsilon (v.booster_dry_mass_kg, 30000.0 * 0.11 / 0.89, 1e-6);
}

/* Recovered boosters: 4 boosters x 10 vehicles flown 10 times each need
 * ceil(40 / 10) = 4 boosters and 4 booster engines; the other 36 booster
 * flights each ready a used booster at 0.1 of its first-unit cost (element
 * and engine).  By hand from the model's own first-unit figures and the
 * learning sums as plain loops of q^B (B = log2 0.9): the production
 * differs from the expended boosters' by exactly
 *   (b1 + e1) (L(4) - L(40)) + 36 x 0.1 x (b1 + e1).
 * Development is unchanged; nothing else moves. */
static void
test_recovered_boosters (void)
{
  g_autoptr (SwDesign) d = two_stage_design ();
  SwCostVehicle v = { 0 };
  SwCost exp_, rec;
  double b = log (0.9) / log (2.0), l4 = 0.0, l40 = 0.0, first, expected;

  d->economics.production_run = 10;
  d->economics.learning_rate = 0.9;
  d->economics.flights_per_stage = 10;
  d->economics.refurbishment_fraction = 0.1;
  v.n_stages = 2;
  v.dry_mass_kg[0] = v.dry_mass_kg[1] = 11000.0;
  v.engine_count[0] = v.engine_count[1] = 1;
  v.booster_count = 4;
  v.booster_dry_mass_kg = 5000.0;
  sw_cost_compute (d, &v, &exp_);
  v.recovered_boosters = TRUE;
  sw_cost_compute (d, &v, &rec);

  g_assert_cmpuint (exp_.booster_units, ==, 40);
  g_assert_cmpuint (rec.booster_units, ==, 4);
  for (guint q = 1; q <= 40; q++)
    {
      l40 += pow (q, b);
      if (q <= 4)
        l4 += pow (q, b);
    }
  first = rec.booster_first_unit_work_years + rec.engines[rec.booster_engine].first_unit_work_years;
  expected = first * (l4 - l40) + 36.0 * 0.1 * first;
  g_assert_cmpfloat_with_epsilon ((rec.production_work_years - exp_.production_work_years)
                                    / expected, 1.0, 1e-9);
  g_assert_cmpfloat (rec.production_work_years, <, exp_.production_work_years);
  g_assert_cmpfloat (rec.development_work_years, ==, exp_.development_work_years);
  g_assert_cmpfloat_with_epsilon (rec.cost_per_flight_work_years,
                                  rec.production_work_years / 10.0, 1e-12);
  /* One flight per booster: as many built as expended, no refurbishment. */
  d->economics.flights_per_stage = 1;
  sw_cost_compute (d, &v, &rec);
  g_assert_cmpuint (rec.booster_units, ==, 40);
  g_assert_cmpfloat (rec.production_work_years, ==, exp_.production_work_years);
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/core/cost/cer-reference", test_cer_reference);
  g_test_add_func ("/core/cost/systems-factor", test_systems_factor);
  g_test_add_func ("/core/cost/learning-curve", test_learning_curve);
  g_test_add_func ("/core/cost/engine-out-binomials", test_engine_out_binomials);
  g_test_add_func ("/core/cost/shared-engine-developed-once", test_shared_engine_developed_once);
  g_test_add_func ("/core/cost/production-run", test_production_run);
  g_test_add_func ("/core/cost/recovered-boosters", test_recovered_boosters);
  g_test_add_func ("/core/cost/boosters-as-elements", test_boosters_as_elements);
  g_test_add_func ("/core/cost/vehicle-from-sizing-boosters", test_vehicle_from_sizing_boosters);
  return g_test_run ();
}
