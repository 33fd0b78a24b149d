/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Tests of sizing with fixed stages (sw_size_with_fixed, a stage's
 * propellant_kg): a fixed stage's delta-v against a hand calculation of the
 * rocket equation (Tsiolkovsky; stage masses as in Curtis, Orbital Mechanics
 * for Engineering Students, sec. 11.6), the optimal split of the sized stages
 * against a brute-force grid, the infeasible answers, and the unchanged
 * results without a fixed stage. */
#include "config.h"

#include "sw-design.h"
#include "sw-design-edit.h"
#include "sw-sizing.h"

#include <math.h>
#include <string.h>

static void
set_init (SwStageSet *set, guint n, const double *isp, const double *eps)
{
  memset (set, 0, sizeof *set);
  set->n_stages = n;
  for (guint i = 0; i < n; i++)
    {
      set->exhaust_velocity_m_s[i] = isp[i] * SW_G0;
      set->structural_coefficient[i] = eps[i];
      set->share[i] = 1.0 / n;
    }
}

static void
assert_rel (double got, double want, double rel)
{
  if (!(fabs (got - want) <= rel * fabs (want)))
    g_error ("got %.12g, want %.12g (relative tolerance %g)", got, want, rel);
}

/* A fixed top stage on a sized first stage, by hand: the top stage's masses
 * follow from its load, its delta-v from the rocket equation with the
 * payload above it; the first stage gives the rest with the top stage and
 * payload as its payload, m0 = P n (1 - eps) / (1 - n eps). */
static void
test_fixed_top_by_hand (void)
{
  const double isp[] = { 300.0, 340.0 }, eps[] = { 0.08, 0.10 };
  const double fixed[] = { 0.0, 20000.0 };
  const double payload = 2000.0, dv = 9400.0;
  SwStageSet set = { 0 };
  SwSizing s;
  /* Hand calculation, from the inputs above. */
  double ms2 = 20000.0 * 0.10 / 0.90;                      /* 2222.22 kg */
  double m02 = payload + 20000.0 + ms2;                    /* 24222.22 kg */
  double dv2 = 340.0 * SW_G0 * log (m02 / (m02 - 20000.0));
  double n1 = exp ((dv - dv2) / (300.0 * SW_G0));
  double m01 = m02 * n1 * 0.92 / (1.0 - n1 * 0.08);

  set_init (&set, 2, isp, eps);
  for (SwSplitMode split = SW_SPLIT_EQUAL; split <= SW_SPLIT_MANUAL; split++)
    {
      set.share[0] = 1.0;   /* manual: the one sized stage takes it all */
      sw_size_with_fixed (&set, fixed, payload, dv, split, &s);
      g_assert_true (s.feasible);
      g_assert_cmpuint (s.n_fixed, ==, 1);
      g_assert_true (s.stages[1].fixed && !s.stages[0].fixed);
      assert_rel (s.stages[1].delta_v_m_s, dv2, 1e-12);
      assert_rel (s.stages[1].structural_mass_kg, ms2, 1e-12);
      assert_rel (s.stages[1].propellant_mass_kg, 20000.0, 1e-15);
      assert_rel (s.stages[0].delta_v_m_s, dv - dv2, 1e-9);
      assert_rel (s.liftoff_mass_kg, m01, 1e-9);
      assert_rel (s.stages[0].delta_v_m_s + s.stages[1].delta_v_m_s, dv, 1e-12);
    }
  /* The delta-v of the fixed stage is about 5.82 km/s (hand arithmetic:
   * 3334.26 m/s times ln 5.7368). */
  g_assert_cmpfloat (fabs (dv2 - 5824.6), <, 0.1);
}

/* Fixed on top, two sized stages below: the optimal split is the true
 * minimum of the liftoff mass (the sized stages carry a fixed payload).
 * A brute-force grid over the split of the sized stages' delta-v finds
 * nothing lighter, and its best point is within the grid's step. */
static void
test_optimal_against_grid (void)
{
  const double isp[] = { 290.0, 330.0, 450.0 }, eps[] = { 0.07, 0.09, 0.12 };
  const double fixed[] = { 0.0, 0.0, 15000.0 };
  const double payload = 3000.0, dv = 9500.0;
  SwStageSet set = { 0 };
  SwSizing s;
  double d, best = INFINITY;

  set_init (&set, 3, isp, eps);
  sw_size_with_fixed (&set, fixed, payload, dv, SW_SPLIT_OPTIMAL, &s);
  g_assert_true (s.feasible);
  g_assert_true (isfinite (s.multiplier_s_m));
  d = s.stages[0].delta_v_m_s + s.stages[1].delta_v_m_s;
  for (guint k = 0; k <= 4000; k++)
    {
      double split[3] = { d * k / 4000.0, d * (4000 - k) / 4000.0, s.stages[2].delta_v_m_s };
      double m = sw_liftoff_mass_for_split (&set, payload, split);
      /* The fixed top stage is a sized stage of the same mass ratio here:
       * sw_liftoff_mass_for_split sizes it from its delta-v, which gives
       * back its fixed load (checked below). */
      if (isfinite (m))
        best = MIN (best, m);
    }
  {
    double split[3] = { s.stages[0].delta_v_m_s, s.stages[1].delta_v_m_s,
                        s.stages[2].delta_v_m_s };
    assert_rel (sw_liftoff_mass_for_split (&set, payload, split), s.liftoff_mass_kg, 1e-9);
  }
  g_assert_cmpfloat (s.liftoff_mass_kg, <=, best * (1.0 + 1e-9));
  g_assert_cmpfloat (s.liftoff_mass_kg, >=, best * (1.0 - 1e-4));
}

/* A fixed first stage under two sized stages, equal split: the sized
 * stages share the rest equally and the total is the requirement. */
static void
test_fixed_bottom_equal (void)
{
  const double isp[] = { 280.0, 320.0, 350.0 }, eps[] = { 0.08, 0.09, 0.11 };
  const double fixed[] = { 150000.0, 0.0, 0.0 };
  SwStageSet set = { 0 };
  SwSizing s;
  double m0;

  set_init (&set, 3, isp, eps);
  sw_size_with_fixed (&set, fixed, 1500.0, 9300.0, SW_SPLIT_EQUAL, &s);
  g_assert_true (s.feasible);
  assert_rel (s.stages[1].delta_v_m_s, s.stages[2].delta_v_m_s, 1e-12);
  assert_rel (s.stages[0].delta_v_m_s + s.stages[1].delta_v_m_s + s.stages[2].delta_v_m_s,
              9300.0, 1e-9);
  /* The fixed stage's delta-v from its masses, by the rocket equation. */
  m0 = s.stages[1].initial_mass_kg + 150000.0 + 150000.0 * 0.08 / 0.92;
  assert_rel (s.liftoff_mass_kg, m0, 1e-12);
  assert_rel (s.stages[0].delta_v_m_s, 280.0 * SW_G0 * log (m0 / (m0 - 150000.0)), 1e-12);
}

/* Infeasible answers carry a reason and no masses; they are never errors. */
static void
test_infeasible (void)
{
  const double isp[] = { 300.0, 340.0 }, eps[] = { 0.08, 0.10 };
  const double big[] = { 0.0, 200000.0 };     /* alone: more than 6 km/s with 100 kg on top */
  const double small[] = { 1000.0, 0.0 };
  const double all[] = { 100000.0, 20000.0 };
  SwStageSet set = { 0 };
  SwSizing s;

  set_init (&set, 2, isp, eps);
  sw_size_with_fixed (&set, big, 100.0, 3000.0, SW_SPLIT_OPTIMAL, &s);
  g_assert_false (s.feasible);
  g_assert_nonnull (strstr (s.reason, "fixed stages alone"));
  g_assert_true (isnan (s.liftoff_mass_kg));
  g_assert_true (isnan (s.stages[0].propellant_mass_kg));

  /* A small fixed first stage and a sized upper stage whose own limit
   * (c ln(1/eps) = 340 g0 ln 10 = 7677 m/s) is far short. */
  sw_size_with_fixed (&set, small, 100.0, 12000.0, SW_SPLIT_EQUAL, &s);
  g_assert_false (s.feasible);
  g_assert_nonnull (strstr (s.reason, "cannot reach"));
  g_assert_true (isnan (s.liftoff_mass_kg));

  /* Every stage fixed: feasible when the vehicle reaches the requirement,
   * each stage giving what it gives; infeasible when it falls short. */
  sw_size_with_fixed (&set, all, 1000.0, 5000.0, SW_SPLIT_OPTIMAL, &s);
  g_assert_true (s.feasible);
  g_assert_cmpfloat (s.delta_v_given_m_s, >, 5000.0);
  assert_rel (s.stages[0].delta_v_m_s + s.stages[1].delta_v_m_s, s.delta_v_given_m_s, 1e-12);
  sw_size_with_fixed (&set, all, 1000.0, 20000.0, SW_SPLIT_OPTIMAL, &s);
  g_assert_false (s.feasible);
  g_assert_nonnull (strstr (s.reason, "fixed stages give"));
}

/* The stages' delta-v limit with no payload, by hand from the rocket
 * equation (Tsiolkovsky, dv = c ln(m0/mf); structure = load eps/(1 - eps)):
 * a fixed stage gives what its own load gives with no payload and the fixed
 * stages above it, not c ln(1/eps); a sized stage its c ln(1/eps).  The
 * headroom is that limit less the requirement; what the vehicle gives with
 * its payload is separate (delta_v_given_m_s). */
static void
test_limit_no_payload (void)
{
  const double isp[] = { 300.0, 340.0 }, eps[] = { 0.08, 0.10 };
  const double all[] = { 100000.0, 20000.0 }, bottom[] = { 100000.0, 0.0 };
  const double top[] = { 0.0, 20000.0 };
  const double c1 = 300.0 * 9.80665, c2 = 340.0 * 9.80665;
  /* Hand figures: stage 2 = 20,000 kg / (1 - 0.10) = 22,222.22 kg full,
   * 2,222.22 kg empty; stage 1's structure 100,000 x 0.08 / 0.92 =
   * 8,695.65 kg. */
  const double m2 = 20000.0 / 0.90, s2 = 20000.0 * 0.10 / 0.90, s1 = 100000.0 * 0.08 / 0.92;
  const double top_empty = c2 * log (m2 / s2);                    /* = c2 ln 10 = 7,677.4 m/s */
  const double first_empty = c1 * log ((m2 + 100000.0 + s1) / (m2 + s1));  /* 4,246.0 m/s */
  const double given = c2 * log ((1000.0 + m2) / (1000.0 + s2))
                       + c1 * log ((1000.0 + m2 + 100000.0 + s1) / (1000.0 + m2 + s1));
  SwStageSet set = { 0 };
  SwSizing s;

  set_init (&set, 2, isp, eps);
  assert_rel (top_empty, 7677.42, 1e-5);
  assert_rel (first_empty, 4246.0, 1e-4);

  sw_size_with_fixed (&set, all, 1000.0, 5000.0, SW_SPLIT_OPTIMAL, &s);
  g_assert_true (s.feasible);
  assert_rel (s.stages[1].delta_v_limit_m_s, top_empty, 1e-12);
  assert_rel (s.stages[0].delta_v_limit_m_s, first_empty, 1e-12);
  assert_rel (s.delta_v_limit_m_s, top_empty + first_empty, 1e-12);
  assert_rel (s.margin_m_s, top_empty + first_empty - 5000.0, 1e-12);
  assert_rel (s.delta_v_given_m_s, given, 1e-12);
  /* Not the sum of c ln(1/eps) (15,108 m/s), nor the delta-v with the payload. */
  g_assert_cmpfloat (fabs (s.delta_v_limit_m_s - (c1 * log (1 / 0.08) + c2 * log (10.0))), >, 3000.0);
  g_assert_cmpfloat (fabs (s.delta_v_limit_m_s - given), >, 100.0);

  /* The same when the vehicle falls short: the headroom is negative. */
  sw_size_with_fixed (&set, all, 1000.0, 13000.0, SW_SPLIT_OPTIMAL, &s);
  g_assert_false (s.feasible);
  assert_rel (s.margin_m_s, top_empty + first_empty - 13000.0, 1e-12);
  g_assert_true (isnan (s.delta_v_given_m_s));

  /* A fixed first stage below a sized top one: empty of payload the sized
   * stage is empty too, so the fixed one gives c ln(1/eps); the sized one
   * its c ln(1/eps). */
  sw_size_with_fixed (&set, bottom, 1000.0, 9000.0, SW_SPLIT_OPTIMAL, &s);
  g_assert_true (s.feasible);
  assert_rel (s.stages[0].delta_v_limit_m_s, c1 * log (1.0 / 0.08), 1e-12);
  assert_rel (s.delta_v_limit_m_s, c1 * log (1.0 / 0.08) + c2 * log (10.0), 1e-12);
  assert_rel (s.margin_m_s, s.delta_v_limit_m_s - 9000.0, 1e-12);
  assert_rel (s.delta_v_given_m_s, 9000.0, 1e-9);

  /* A fixed top stage on a sized first one. */
  sw_size_with_fixed (&set, top, 1000.0, 9300.0, SW_SPLIT_OPTIMAL, &s);
  g_assert_true (s.feasible);
  assert_rel (s.delta_v_limit_m_s, c1 * log (1.0 / 0.08) + top_empty, 1e-12);
  assert_rel (s.margin_m_s, s.delta_v_limit_m_s - 9300.0, 1e-12);
}

/* Without a fixed stage the answer is sw_size()'s, bit for bit. */
static void
test_no_fixed_is_unchanged (void)
{
  const double isp[] = { 400.0, 350.0, 300.0 }, eps[] = { 0.10, 0.15, 0.20 };
  const double none[] = { 0.0, 0.0, 0.0 };
  SwStageSet set = { 0 };
  SwSizing a, b;

  set_init (&set, 3, isp, eps);
  for (SwSplitMode split = SW_SPLIT_EQUAL; split <= SW_SPLIT_MANUAL; split++)
    {
      sw_size (&set, 5000.0, 10000.0, split, &a);
      sw_size_with_fixed (&set, none, 5000.0, 10000.0, split, &b);
      g_assert_cmpmem (&a, sizeof a, &b, sizeof b);
      sw_size_with_fixed (&set, NULL, 5000.0, 10000.0, split, &b);
      g_assert_cmpmem (&a, sizeof a, &b, sizeof b);
    }
}

/* A design's propellant_kg reaches its sizing. */
static void
test_design_fixed (void)
{
  g_autoptr (SwDesign) d = sw_design_new_default ();
  const double fixed[] = { 0.0, 12000.0 };
  SwStageSet set = { 0 };
  SwSizing a, b;

  d->stages[1].propellant.has_propellant_kg = TRUE;
  d->stages[1].propellant.propellant_kg = 12000.0;
  g_assert_true (sw_design_validate (d, NULL, NULL));
  g_assert_true (sw_size_design (d, &a, NULL));
  sw_stage_set_from_design (&set, d);
  sw_size_with_fixed (&set, fixed, d->payload_kg, d->mission.delta_v_m_s, d->split, &b);
  g_assert_true (a.feasible);
  g_assert_cmpfloat (a.liftoff_mass_kg, ==, b.liftoff_mass_kg);
  g_assert_cmpfloat (a.stages[1].propellant_mass_kg, ==, 12000.0);
}

/* Taking the optimum's split as manual shares with a fixed stage: the
 * fixed stage gets no share, the sized ones add up to 1, and the manual
 * sizing gives the optimum's vehicle back. */
static void
test_take_shares_with_fixed (void)
{
  g_autoptr (SwDesign) d = sw_design_new_default ();
  double shares[SW_MAX_STAGES];
  SwSizing opt, man;
  guint n;

  d->n_stages = 3;
  sw_stage_init_default (&d->stages[2], 2);
  d->stages[2].propellant.has_propellant_kg = TRUE;
  d->stages[2].propellant.propellant_kg = 3000.0;
  d->split = SW_SPLIT_OPTIMAL;
  g_assert_true (sw_size_design (d, &opt, NULL));
  g_assert_true (opt.feasible);
  n = sw_sizing_get_shares (&opt, shares);
  g_assert_cmpuint (n, ==, 3);
  g_assert_cmpfloat (shares[2], ==, 0.0);
  g_assert_true (sw_design_take_manual_shares (d, shares, n));
  g_assert_cmpfloat (fabs (d->stages[0].delta_v_share + d->stages[1].delta_v_share - 1.0), <,
                     1e-12);
  g_assert_true (sw_design_validate (d, NULL, NULL));
  g_assert_true (sw_size_design (d, &man, NULL));
  g_assert_true (man.feasible);
  assert_rel (man.liftoff_mass_kg, opt.liftoff_mass_kg, 1e-9);
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/fixed-stages/top-by-hand", test_fixed_top_by_hand);
  g_test_add_func ("/fixed-stages/optimal-against-grid", test_optimal_against_grid);
  g_test_add_func ("/fixed-stages/bottom-equal", test_fixed_bottom_equal);
  g_test_add_func ("/fixed-stages/infeasible", test_infeasible);
  g_test_add_func ("/fixed-stages/limit-no-payload", test_limit_no_payload);
  g_test_add_func ("/fixed-stages/no-fixed-unchanged", test_no_fixed_is_unchanged);
  g_test_add_func ("/fixed-stages/design", test_design_fixed);
  g_test_add_func ("/fixed-stages/take-shares", test_take_shares_with_fixed);
  return g_test_run ();
}
