/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Tests of the recovered first stage against the project's reference notes
 * (/work/shared/reference-values.md, "Reusable first stage"). */
#include "config.h"

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
  SwStageSet set;
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
  SwStageSet set;
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
  SwStageSet set;
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

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/core/reuse/propellant-ratio", test_propellant_ratio);
  g_test_add_func ("/core/reuse/downrange", test_downrange);
  g_test_add_func ("/core/reuse/launch-site-and-user-delta-v", test_launch_site_and_user_delta_v);
  g_test_add_func ("/core/reuse/infeasible", test_infeasible);
  g_test_add_func ("/core/reuse/fixed-load-note", test_reuse_fixed_note);
  return g_test_run ();
}
