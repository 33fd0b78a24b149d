/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Tests of the recovered first stage against the project's reference notes
 * (/work/shared/reference-values.md, "Reusable first stage"). */
#include "config.h"

#include "sw-booster-sizing.h"
#include "sw-cost.h"
#include "sw-design.h"
#include "sw-economics.h"
#include "sw-fixed-vehicle.h"
#include "sw-reuse.h"
#include "sw-sizing.h"
#include "sw-staging.h"

#include <math.h>
#include <string.h>

/* m_rec / m_dry = exp(dv_rec / c) - 1: reference values, "Reusable first
 * stage" (computed there): c = 2943 m/s, 950 m/s gives 0.381, 2750 m/s gives
 * 1.546 (three decimals: tolerance 5e-4). */
static void
test_propellant_ratio (void)
{
  g_assert_cmpfloat_with_epsilon (sw_reuse_propellant_ratio (950.0, 2943.0), 0.381, 5e-4);
  g_assert_cmpfloat_with_epsilon (sw_reuse_propellant_ratio (2750.0, 2943.0), 1.546, 5e-4);
  g_assert_cmpfloat (sw_reuse_propellant_ratio (0.0, 2943.0), ==, 0.0);
}

static void
three_stage_set (SwStageSet *set)
{
  memset (set, 0, sizeof *set);
  set->n_stages = 3;
  /* c = 2943 m/s on the first stage, as in the reference notes. */
  set->exhaust_velocity_m_s[0] = 2943.0;
  set->exhaust_velocity_m_s[1] = 3300.0;
  set->exhaust_velocity_m_s[2] = 3400.0;
  set->structural_coefficient[0] = 0.06;
  set->structural_coefficient[1] = 0.08;
  set->structural_coefficient[2] = 0.10;
}

/* The recovered stage carries m_rec = 0.381 m_dry (downrange default) and
 * landing hardware of 0.1 of its structure as inert mass; the vehicle is
 * sized again and costs payload. */
static void
test_downrange (void)
{
  SwStageSet set = { 0 };
  SwEconomics e;
  SwReuse r;
  double ms, mp, eps_check;

  three_stage_set (&set);
  sw_economics_init (&e);
  g_assert_true (sw_reuse_compute (&set, 5000.0, 9300.0, SW_SPLIT_OPTIMAL, &e,
                                   SW_RECOVERY_DOWNRANGE, &r));
  g_assert_cmpfloat (r.delta_v_m_s, ==, 950.0);
  g_assert_cmpfloat_with_epsilon (r.recovery_propellant_kg / r.first_stage_dry_kg, 0.381, 5e-4);
  /* The landed dry mass is 1.1 structures: the hardware is 0.1 of 1.1. */
  g_assert_cmpfloat_with_epsilon (r.landing_hardware_kg / r.first_stage_dry_kg, 0.1 / 1.1, 1e-12);
  /* eps' from the sized masses: inert / (inert + propellant). */
  ms = r.reusable.stages[0].structural_mass_kg;
  mp = r.reusable.stages[0].propellant_mass_kg;
  eps_check = ms / (ms + mp);
  g_assert_cmpfloat_with_epsilon (eps_check, r.eps_effective, 1e-12);
  /* eps'/(1-eps') = eps/(1-eps) x 1.1 x (1 + 0.381...). */
  g_assert_cmpfloat_with_epsilon (r.eps_effective / (1.0 - r.eps_effective),
                                  0.06 / 0.94 * 1.1 * exp (950.0 / 2943.0), 1e-12);
  /* Heavier for the same payload; the split re-optimised moves delta-v off
   * the first stage (reference notes: staging at a lower speed). */
  g_assert_cmpfloat (r.reusable.liftoff_mass_kg, >, r.expendable.liftoff_mass_kg);
  g_assert_cmpfloat (r.reusable.stages[0].delta_v_m_s, <, r.expendable.stages[0].delta_v_m_s);
  g_assert_cmpfloat (r.payload_penalty_fraction, >, 0.0);
  g_assert_cmpfloat (r.payload_penalty_fraction, <, 1.0);
  /* Sizing is linear in the payload: the reusable vehicle sized for the
   * payload at the expendable liftoff mass has that liftoff mass. */
  {
    SwSizing check;
    SwStageSet reused = set;
    reused.structural_coefficient[0] = r.eps_effective;
    sw_size (&reused, r.payload_same_liftoff_kg, 9300.0, SW_SPLIT_OPTIMAL, &check);
    g_assert_cmpfloat_with_epsilon (check.liftoff_mass_kg / r.expendable.liftoff_mass_kg, 1.0,
                                    1e-9);
  }
  /* The expendable tanks flown with recovery lose more payload than a
   * vehicle re-sized for it. */
  g_assert_true (isfinite (r.payload_same_tanks_kg));
  g_assert_cmpfloat (r.payload_same_tanks_kg, <, r.payload_same_liftoff_kg);
}

/* Returning to the launch site costs more than landing downrange (2750 m/s
 * against 950 m/s, defaults from memory), and the user's delta-v wins. */
static void
test_launch_site_and_user_delta_v (void)
{
  SwStageSet set = { 0 };
  SwEconomics e;
  SwReuse down, home, none;

  three_stage_set (&set);
  sw_economics_init (&e);
  g_assert_true (sw_reuse_compute (&set, 5000.0, 9300.0, SW_SPLIT_OPTIMAL, &e,
                                   SW_RECOVERY_DOWNRANGE, &down));
  g_assert_true (sw_reuse_compute (&set, 5000.0, 9300.0, SW_SPLIT_OPTIMAL, &e,
                                   SW_RECOVERY_LAUNCH_SITE, &home));
  g_assert_cmpfloat (home.delta_v_m_s, ==, 2750.0);
  g_assert_cmpfloat_with_epsilon (home.recovery_propellant_kg / home.first_stage_dry_kg, 1.546,
                                  5e-4);
  g_assert_cmpfloat (home.payload_penalty_fraction, >, down.payload_penalty_fraction);

  e.has_recovery_delta_v = TRUE;
  e.recovery_delta_v_m_s = 1200.0;
  g_assert_true (sw_reuse_compute (&set, 5000.0, 9300.0, SW_SPLIT_OPTIMAL, &e,
                                   SW_RECOVERY_LAUNCH_SITE, &home));
  g_assert_cmpfloat (home.delta_v_m_s, ==, 1200.0);

  /* Expendable: no penalty at all. */
  g_assert_true (sw_reuse_compute (&set, 5000.0, 9300.0, SW_SPLIT_OPTIMAL, &e, SW_RECOVERY_NONE,
                                   &none));
  g_assert_cmpfloat (none.reusable.liftoff_mass_kg, ==, none.expendable.liftoff_mass_kg);
  g_assert_cmpfloat (none.payload_penalty_fraction, ==, 0.0);
}

/* A vehicle that only just closes expendable does not close recovered: an
 * answer, not a crash, and no figure made up. */
static void
test_infeasible (void)
{
  SwStageSet set = { 0 };
  SwEconomics e;
  SwReuse r;

  three_stage_set (&set);
  set.n_stages = 1;
  sw_economics_init (&e);
  /* One stage: c ln(1/0.06) = 8280 m/s; 8000 closes, not with recovery. */
  g_assert_false (sw_reuse_compute (&set, 100.0, 8000.0, SW_SPLIT_OPTIMAL, &e,
                                    SW_RECOVERY_LAUNCH_SITE, &r));
  g_assert_true (r.expendable.feasible);
  g_assert_false (r.reusable.feasible);
  g_assert_true (isnan (r.payload_penalty_fraction));
}

/* A fixed propellant load is not applied (every row is sized): the
 * staging table says so; a design without one says nothing. */
static void
test_reuse_fixed_note (void)
{
  g_autoptr (GError) error = NULL;
  g_autofree char *path = g_build_filename (g_getenv ("SW_SOURCE_ROOT"), "data", "designs",
                                            "sallowmere-kestrune-upper-stage.stagewright", NULL);
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, &error);
  SwStaging st;

  g_assert_no_error (error);
  g_assert_true (sw_staging_compute (d, 6, &st, NULL));
  g_assert_nonnull (strstr (st.reuse_note, "recovered columns resize every stage too"));
  d->stages[1].propellant.has_propellant_kg = FALSE;
  g_assert_true (sw_staging_compute (d, 6, &st, NULL));
  g_assert_cmpstr (st.reuse_note, ==, "");
}

/* A two-stage vehicle with two liquid strap-on boosters of c = 300.1 s x
 * g0 = 2943 m/s (the reference notes' exhaust velocity). */
static const char *booster_json =
  "{ \"format\": \"stagewright-design\", \"version\": 2, \"name\": \"booster recovery test\",\n"
  "  \"payload_kg\": 4000, \"mission\": { \"delta_v_m_s\": 9300 }, \"split\": \"optimal\",\n"
  "  \"stages\": [\n"
  "    { \"name\": \"core\", \"isp_vac_s\": 310, \"isp_sl_s\": 280, \"structural_coefficient\": 0.07,\n"
  "      \"thrust_vac_kn\": 1200 },\n"
  "    { \"name\": \"upper\", \"isp_vac_s\": 345, \"structural_coefficient\": 0.09,\n"
  "      \"thrust_vac_kn\": 200 } ],\n"
  "  \"boosters\": { \"count\": 2, \"isp_vac_s\": 300.1, \"isp_sl_s\": 270,\n"
  "                  \"structural_coefficient\": 0.08, \"thrust_vac_kn\": 1500 } }";

static SwDesign *
booster_design (void)
{
  g_autoptr (GError) error = NULL;
  SwDesign *d = sw_design_load_data (booster_json, -1, "boosters.stagewright", NULL, &error);

  g_assert_no_error (error);
  return d;
}

/* Recovered boosters: each carries m_rec = m_dry (exp(dv / c) - 1) on its
 * own landed dry mass (reference notes, "Reusable first stage": c = 2943
 * m/s and 950 m/s give 0.381), and its structural coefficient rises by the
 * hand formula: with eps = 0.08, h = 0.1 and the ratio 0.381,
 *   k = 0.08 / 0.92 x 1.1 x 1.381 = 0.13210, eps' = k / (1 + k) = 0.11669
 * (hand calculation, four figures).  The sized booster's inert mass is
 * eps' / (1 - eps') of its propellant; the vehicle grows and carries less
 * payload at the expendable liftoff mass: the penalty is positive and
 * larger than with the core recovered alone. */
static void
test_booster_recovery (void)
{
  g_autoptr (SwDesign) d = booster_design ();
  SwParallelVehicle v;
  SwReuse core_only, both, boosters_only;
  double dv;

  g_assert_true (sw_design_required_delta_v (d, &dv, NULL));
  g_assert_true (sw_parallel_vehicle_from_design (&v, d, NULL));
  g_assert_cmpfloat_with_epsilon (v.booster_exhaust_velocity_m_s, 2943.0, 0.5);

  g_assert_true (sw_reuse_compute_parallel (&v, d->payload_kg, dv, SW_SPLIT_OPTIMAL,
                                            &d->economics, SW_RECOVERY_DOWNRANGE, &core_only));
  g_assert_cmpint (core_only.booster_mode, ==, SW_RECOVERY_NONE);
  g_assert_cmpfloat (core_only.booster_recovery_propellant_kg, ==, 0.0);
  g_assert_cmpfloat (core_only.booster_eps_effective, ==, core_only.booster_eps_expendable);

  sw_economics_set_booster_recovery_mode (&d->economics, SW_RECOVERY_DOWNRANGE);
  g_assert_true (sw_reuse_compute_parallel (&v, d->payload_kg, dv, SW_SPLIT_OPTIMAL,
                                            &d->economics, SW_RECOVERY_DOWNRANGE, &both));
  g_assert_cmpint (both.booster_mode, ==, SW_RECOVERY_DOWNRANGE);
  /* The default delta-v, labelled from memory, as the first stage's. */
  g_assert_cmpfloat (both.booster_delta_v_m_s, ==, 950.0);
  g_assert_cmpfloat_with_epsilon (both.booster_propellant_ratio, 0.381, 5e-4);
  g_assert_cmpfloat_with_epsilon (both.booster_eps_effective, 0.11669, 5e-5);
  g_assert_cmpfloat_with_epsilon (both.booster_recovery_propellant_kg / both.booster_dry_kg,
                                  0.381, 5e-4);
  g_assert_cmpfloat_with_epsilon (both.booster_landing_hardware_kg / both.booster_dry_kg,
                                  0.1 / 1.1, 1e-12);
  /* The sized booster: inert = dry + recovery propellant = eps'/(1-eps') load. */
  g_assert_true (both.reusable.boosters.present);
  g_assert_cmpfloat_with_epsilon (both.reusable.boosters.structural_mass_kg
                                    / (both.booster_dry_kg + both.booster_recovery_propellant_kg),
                                  1.0, 1e-12);
  g_assert_cmpfloat_with_epsilon (both.reusable.boosters.structural_mass_kg
                                    / both.reusable.boosters.propellant_mass_kg,
                                  both.booster_eps_effective / (1.0 - both.booster_eps_effective),
                                  1e-9);
  /* Heavier, and the payload penalty positive, larger than the core's alone. */
  g_assert_cmpfloat (both.reusable.liftoff_mass_kg, >, core_only.reusable.liftoff_mass_kg);
  g_assert_cmpfloat (both.payload_penalty_fraction, >, 0.0);
  g_assert_cmpfloat (both.payload_penalty_fraction, >, core_only.payload_penalty_fraction);
  g_assert_cmpfloat (both.payload_same_liftoff_kg, <, d->payload_kg);

  /* The boosters alone (the core expended): a penalty of its own. */
  g_assert_true (sw_reuse_compute_parallel (&v, d->payload_kg, dv, SW_SPLIT_OPTIMAL,
                                            &d->economics, SW_RECOVERY_NONE, &boosters_only));
  g_assert_cmpfloat (boosters_only.eps_effective, ==, boosters_only.eps_expendable);
  g_assert_cmpfloat (boosters_only.payload_penalty_fraction, >, 0.0);
  g_assert_cmpfloat (boosters_only.payload_penalty_fraction, <, both.payload_penalty_fraction);

  /* A delta-v the user sets: the launch site's default, and one typed. */
  sw_economics_set_booster_recovery_mode (&d->economics, SW_RECOVERY_LAUNCH_SITE);
  g_assert_cmpfloat (sw_economics_booster_recovery_delta_v (&d->economics), ==, 2750.0);
  g_assert_true (sw_economics_set_number (&d->economics, SW_ECON_BOOSTER_RECOVERY_DELTA_V,
                                          1200.0));
  g_assert_false (sw_economics_set_number (&d->economics, SW_ECON_BOOSTER_RECOVERY_DELTA_V,
                                           6000.0));
  g_assert_true (sw_reuse_compute_parallel (&v, d->payload_kg, dv, SW_SPLIT_OPTIMAL,
                                            &d->economics, SW_RECOVERY_DOWNRANGE, &both));
  g_assert_cmpfloat (both.booster_delta_v_m_s, ==, 1200.0);
  g_assert_cmpfloat_with_epsilon (both.booster_propellant_ratio, expm1 (1200.0 / 2943.0), 1e-3);
}

/* Booster recovery "expendable" (the key given or left out) is the vehicle
 * as before: the same sizing as recovering the core alone by hand (only the
 * core's structural coefficient raised), the same staging table. */
static void
test_booster_recovery_none (void)
{
  g_autoptr (SwDesign) d = booster_design ();
  g_autoptr (SwDesign) marked = booster_design ();
  SwParallelVehicle v, by_hand;
  SwReuse r;
  SwSizing s;
  SwStaging a, b;
  double dv;

  g_assert_true (sw_design_required_delta_v (d, &dv, NULL));
  g_assert_true (sw_parallel_vehicle_from_design (&v, d, NULL));
  g_assert_true (sw_reuse_compute_parallel (&v, d->payload_kg, dv, SW_SPLIT_OPTIMAL,
                                            &d->economics, SW_RECOVERY_DOWNRANGE, &r));
  by_hand = v;
  by_hand.set.structural_coefficient[0] = r.eps_effective;
  sw_size_parallel (&by_hand, d->payload_kg, dv, SW_SPLIT_OPTIMAL, &s);
  g_assert_cmpfloat (r.reusable.liftoff_mass_kg, ==, s.liftoff_mass_kg);
  g_assert_cmpfloat (r.reusable.boosters.structural_mass_kg, ==, s.boosters.structural_mass_kg);

  sw_economics_set_booster_recovery_mode (&marked->economics, SW_RECOVERY_NONE);
  g_assert_true (sw_staging_compute (d, 6, &a, NULL));
  g_assert_true (sw_staging_compute (marked, 6, &b, NULL));
  g_assert_cmpint (a.booster_reuse_mode, ==, SW_RECOVERY_NONE);
  g_assert_true (memcmp (a.rows, b.rows, sizeof a.rows) == 0);
  g_assert_cmpstr (a.boosters_note, ==, b.boosters_note);
}

/* The staging table of a design that recovers its boosters: the recovered
 * columns of the booster rows carry them, cost them with refurbishment
 * and flights per booster, and say so. */
static void
test_booster_recovery_staging (void)
{
  g_autoptr (SwDesign) d = booster_design ();
  SwStaging plain, rec;
  const SwStagingRow *p, *r;

  g_assert_true (sw_staging_compute (d, 6, &plain, NULL));
  sw_economics_set_recovery_mode (&d->economics, SW_RECOVERY_DOWNRANGE);
  sw_economics_set_booster_recovery_mode (&d->economics, SW_RECOVERY_DOWNRANGE);
  g_assert_true (sw_staging_compute (d, 6, &rec, NULL));
  g_assert_true (rec.design_reuses);
  g_assert_cmpint (rec.booster_reuse_mode, ==, SW_RECOVERY_DOWNRANGE);
  p = sw_staging_row (&plain, SW_ARRANGEMENT_BOOSTERS, 2);
  r = sw_staging_row (&rec, SW_ARRANGEMENT_BOOSTERS, 2);
  g_assert_true (isnan (p->booster_recovery_propellant_kg));
  g_assert_cmpfloat (r->booster_recovery_propellant_kg, >, 0.0);
  g_assert_cmpfloat (r->liftoff_mass_reused_kg, >, p->liftoff_mass_reused_kg);
  g_assert_cmpfloat (r->payload_penalty_fraction, >, p->payload_penalty_fraction);
  /* Boosters flown ten times each: cheaper per flight than expended ones. */
  g_assert_cmpfloat (r->cost_per_flight_reused_work_years, <, p->cost_per_flight_reused_work_years);
  /* The serial rows have no boosters to recover. */
  g_assert_true (isnan (sw_staging_row (&rec, SW_ARRANGEMENT_SERIAL, 2)
                          ->booster_recovery_propellant_kg));
  g_assert_nonnull (strstr (rec.boosters_note, "recover the core and the boosters"));
  g_assert_nonnull (strstr (rec.weighting, "first stage and boosters reused"));
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/core/reuse/propellant-ratio", test_propellant_ratio);
  g_test_add_func ("/core/reuse/downrange", test_downrange);
  g_test_add_func ("/core/reuse/launch-site-and-user-delta-v", test_launch_site_and_user_delta_v);
  g_test_add_func ("/core/reuse/infeasible", test_infeasible);
  g_test_add_func ("/core/reuse/fixed-load-note", test_reuse_fixed_note);
  g_test_add_func ("/core/reuse/booster-recovery", test_booster_recovery);
  g_test_add_func ("/core/reuse/booster-recovery-none", test_booster_recovery_none);
  g_test_add_func ("/core/reuse/booster-recovery-staging", test_booster_recovery_staging);
  return g_test_run ();
}
