/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Tests of sw-sizing: Tsiolkovsky sizing, the three splits, the optimal split
 * against a textbook example and against GSL's minimiser, the boundary and
 * infeasible cases, and the structural-coefficient conversions. */
#include "config.h"

#include "sw-design.h"
#include "sw-sizing.h"

#include <gsl/gsl_multimin.h>
#include <gsl/gsl_rng.h>
#include <math.h>
#include <string.h>

/* Textbook g0 of the worked examples (Curtis uses 9.81 m/s^2). */
#define BOOK_G0 9.81

static void
assert_rel (double got, double want, double rel)
{
  if (!(fabs (got - want) <= rel * fabs (want)))
    g_error ("relative check failed: got %.12g, want %.12g (tolerance %g, off by %g)", got, want,
             rel, fabs (got - want) / fabs (want));
}

/* A stage set from Isp (s), eps and a g0. */
static void
set_init (SwStageSet *set, guint n, const double *isp, const double *eps, double g0)
{
  memset (set, 0, sizeof *set);
  set->n_stages = n;
  for (guint i = 0; i < n; i++)
    {
      set->exhaust_velocity_m_s[i] = isp[i] * g0;
      set->structural_coefficient[i] = eps[i];
      set->share[i] = 1.0 / n;
    }
}

static double
set_limit (const SwStageSet *set)
{
  double l = 0.0;
  for (guint i = 0; i < set->n_stages; i++)
    l += set->exhaust_velocity_m_s[i] * log (1.0 / set->structural_coefficient[i]);
  return l;
}

/* Mass bookkeeping of one feasible sizing, from the definitions. */
static void
check_bookkeeping (const SwStageSet *set, const SwSizing *s)
{
  double dv_sum = 0.0, share_sum = 0.0;

  g_assert_true (s->feasible);
  g_assert_cmpuint (s->n_stages, ==, set->n_stages);
  for (guint i = 0; i < s->n_stages; i++)
    {
      const SwStageResult *r = &s->stages[i];
      double eps = set->structural_coefficient[i];
      double above = i + 1 < s->n_stages ? s->stages[i + 1].initial_mass_kg : s->payload_kg;

      g_assert_true (r->feasible);
      /* Each stage carries everything above it as its payload. */
      assert_rel (r->payload_mass_kg, above, 1e-12);
      /* initial = payload above + propellant + structure */
      assert_rel (r->initial_mass_kg, above + r->propellant_mass_kg + r->structural_mass_kg,
                  1e-12);
      assert_rel (r->stage_mass_kg, r->propellant_mass_kg + r->structural_mass_kg, 1e-12);
      /* burnout = initial / n, and burnout = everything above + structure */
      assert_rel (r->burnout_mass_kg, r->initial_mass_kg / r->mass_ratio, 1e-12);
      assert_rel (r->burnout_mass_kg, above + r->structural_mass_kg, 1e-12);
      /* Tsiolkovsky: n = exp(dv / c) */
      assert_rel (r->mass_ratio, exp (r->delta_v_m_s / set->exhaust_velocity_m_s[i]), 1e-12);
      assert_rel (r->exhaust_velocity_m_s, set->exhaust_velocity_m_s[i], 1e-15);
      assert_rel (r->delta_v_limit_m_s, set->exhaust_velocity_m_s[i] * log (1.0 / eps), 1e-12);
      if (r->unused)
        {
          g_assert_cmpfloat (r->propellant_mass_kg, ==, 0.0);
          g_assert_cmpfloat (r->structural_mass_kg, ==, 0.0);
          g_assert_cmpfloat (r->delta_v_m_s, ==, 0.0);
        }
      else
        {
          g_assert_cmpfloat (r->propellant_mass_kg, >, 0.0);
          /* structure / propellant = eps / (1 - eps), from eps = ms / (ms + mp) */
          assert_rel (r->structural_mass_kg / r->propellant_mass_kg, eps / (1.0 - eps), 1e-9);
        }
      dv_sum += r->delta_v_m_s;
      share_sum += r->delta_v_share;
    }
  assert_rel (dv_sum, s->delta_v_m_s, 1e-12);
  if (s->delta_v_m_s > 0.0)
    assert_rel (share_sum, 1.0, 1e-12);
  assert_rel (s->liftoff_mass_kg, s->stages[0].initial_mass_kg, 1e-15);
  assert_rel (s->payload_fraction, s->payload_kg / s->liftoff_mass_kg, 1e-12);
  assert_rel (s->delta_v_limit_m_s, set_limit (set), 1e-12);
  assert_rel (s->margin_m_s, s->delta_v_limit_m_s - s->delta_v_m_s, 1e-9);
}

static void
check_all_masses_nan (const SwSizing *s)
{
  g_assert_true (isnan (s->liftoff_mass_kg));
  g_assert_true (isnan (s->payload_fraction));
  for (guint i = 0; i < s->n_stages; i++)
    {
      const SwStageResult *r = &s->stages[i];
      g_assert_true (isnan (r->propellant_mass_kg));
      g_assert_true (isnan (r->structural_mass_kg));
      g_assert_true (isnan (r->stage_mass_kg));
      g_assert_true (isnan (r->payload_mass_kg));
      g_assert_true (isnan (r->initial_mass_kg));
      g_assert_true (isnan (r->burnout_mass_kg));
      /* A mass ratio is either a real one (at least 1) or undefined. */
      g_assert_true (isnan (r->mass_ratio) || r->mass_ratio >= 1.0);
      g_assert_false (r->feasible && r->unused);
    }
  /* The limits stay meaningful numbers. */
  g_assert_true (isfinite (s->delta_v_limit_m_s));
  g_assert_true (isfinite (s->margin_m_s));
}

/* ---- g0 and stage sets -------------------------------------------------- */

static void
test_g0 (void)
{
  SwDesign *d = sw_design_new_default ();
  SwStageSet set = { 0 };

  /* Standard acceleration of gravity, 9.80665 m/s^2 exactly (3rd CGPM, 1901). */
  g_assert_cmpfloat (SW_G0, ==, 9.80665);
  sw_stage_set_from_design (&set, d);
  for (guint i = 0; i < d->n_stages; i++)
    g_assert_cmpfloat (set.exhaust_velocity_m_s[i], ==, d->stages[i].isp_vac_s * 9.80665);
  sw_design_free (d);
}

static void
test_stage_set_from_design (void)
{
  g_autoptr (SwDesign) d = sw_design_new ();
  SwStageSet set = { 0 };

  d->n_stages = 3;
  for (guint i = 0; i < 3; i++)
    {
      d->stages[i].isp_vac_s = 300.0 + 10.0 * i;
      d->stages[i].isp_sl_s = 100.0;   /* never used by sizing */
      d->stages[i].has_isp_sl = TRUE;
      d->stages[i].structural_coefficient = 0.05 + 0.01 * i;
      d->stages[i].delta_v_share = 0.2 + 0.1 * i;
    }
  sw_stage_set_from_design (&set, d);
  g_assert_cmpuint (set.n_stages, ==, 3);
  for (guint i = 0; i < 3; i++)
    {
      /* Sizing uses the vacuum Isp (issue 2). */
      g_assert_cmpfloat (set.exhaust_velocity_m_s[i], ==, d->stages[i].isp_vac_s * SW_G0);
      g_assert_cmpfloat (set.structural_coefficient[i], ==, d->stages[i].structural_coefficient);
      g_assert_cmpfloat (set.share[i], ==, d->stages[i].delta_v_share);
    }
}

static void
test_stage_set_extend (void)
{
  g_autoptr (SwDesign) d = sw_design_new ();
  SwStageSet set = { 0 };

  d->n_stages = 2;
  d->stages[0].isp_vac_s = 300.0;
  d->stages[0].structural_coefficient = 0.06;
  d->stages[1].isp_vac_s = 440.0;
  d->stages[1].structural_coefficient = 0.12;

  for (guint n = 1; n <= SW_MAX_STAGES; n++)
    {
      sw_stage_set_extend (&set, d, n);
      g_assert_cmpuint (set.n_stages, ==, n);
      for (guint k = 0; k < n; k++)
        {
          /* Stage k takes the design's stage min(k, n_design) (issue 2). */
          const SwStage *src = &d->stages[MIN (k, 1u)];
          g_assert_cmpfloat (set.exhaust_velocity_m_s[k], ==, src->isp_vac_s * SW_G0);
          g_assert_cmpfloat (set.structural_coefficient[k], ==, src->structural_coefficient);
        }
    }
  sw_stage_set_extend (&set, d, 0);
  g_assert_cmpuint (set.n_stages, ==, 1);
  sw_stage_set_extend (&set, d, 99);
  g_assert_cmpuint (set.n_stages, ==, SW_MAX_STAGES);
}

/* ---- textbook examples -------------------------------------------------- */

/* Curtis, Orbital Mechanics for Engineering Students, sec. 11.6, worked
 * example of optimal staging (confirmed, reference-values.md): payload
 * 5000 kg, delta-v 10 km/s, g0 = 9.81, Isp 400/350/300 s, eps .10/.15/.20.
 * Our core always uses g0 = 9.80665; what sizing depends on is the exhaust
 * velocity c = Isp g0, so the design's Isp are scaled by 9.81/9.80665 to
 * give the book's c. */
static void
test_textbook_optimal (void)
{
  static const double isp[] = { 400.0, 350.0, 300.0 };
  static const double eps[] = { 0.10, 0.15, 0.20 };
  /* Published (Curtis sec. 11.6, confirmed): n_i and stage masses. */
  static const double book_n[] = { 4.541, 2.507, 1.361 };
  static const double book_stage_mass[] = { 165700.0, 18070.0, 2477.0 };
  /* Exact solve (reference-values.md, computed twice, independently). */
  static const double exact_stage_mass[] = { 165679.0, 18066.0, 2477.0 };
  /* Delta-v split in km/s (reference-values.md, computed). */
  static const double ref_dv_km_s[] = { 5.937, 3.157, 0.906 };
  g_autoptr (SwDesign) d = sw_design_new ();
  g_autoptr (GError) error = NULL;
  SwStageSet set = { 0 };
  SwSizing s;

  d->payload_kg = 5000.0;
  d->mission.kind = SW_MISSION_DELTA_V;
  d->mission.delta_v_m_s = 10000.0;
  d->split = SW_SPLIT_OPTIMAL;
  d->n_stages = 3;
  for (guint i = 0; i < 3; i++)
    {
      g_snprintf (d->stages[i].name, sizeof d->stages[i].name, "Book %u", i + 1);
      d->stages[i].isp_vac_s = isp[i] * BOOK_G0 / SW_G0;
      d->stages[i].structural_coefficient = eps[i];
    }
  sw_stage_set_from_design (&set, d);
  for (guint i = 0; i < 3; i++)
    assert_rel (set.exhaust_velocity_m_s[i], isp[i] * BOOK_G0, 1e-14);

  g_assert_true (sw_size_design (d, &s, &error));
  g_assert_no_error (error);
  g_assert_true (s.feasible);
  g_assert_cmpuint (s.n_unused, ==, 0);
  g_assert_cmpstr (s.reason, ==, "");

  /* Total 191,200 kg (Curtis sec. 11.6, confirmed).  The book prints four
   * significant figures, computed from its rounded n_i: half a unit of the
   * fourth figure is 50 kg = 0.026 %, and the book's own n_i give 191,254 kg
   * (computed), 0.028 % off.  So 0.03 %; the exact solve is 0.011 % off. */
  assert_rel (s.liftoff_mass_kg, 191200.0, 3e-4);
  /* The exact solve (reference-values.md, computed twice, independently):
   * 191,221 kg, to the kilogram. */
  g_assert_cmpfloat_with_epsilon (s.liftoff_mass_kg, 191221.0, 0.5);
  /* Multiplier eta = 0.4668 s/km (Curtis sec. 11.6, confirmed). */
  g_assert_cmpfloat_with_epsilon (s.multiplier_s_m * 1000.0, 0.4668, 5e-5);
  for (guint i = 0; i < 3; i++)
    {
      /* n_i to the book's three decimals (Curtis sec. 11.6, confirmed). */
      g_assert_cmpfloat_with_epsilon (s.stages[i].mass_ratio, book_n[i], 6e-4);
      /* Stage masses, four significant figures in the book: half a unit of
       * the fourth figure is at most 0.03 % (18,070: 5 kg = 0.028 %). */
      assert_rel (s.stages[i].stage_mass_kg, book_stage_mass[i], 3e-4);
      /* The exact solve's stage masses (reference-values.md, computed). */
      g_assert_cmpfloat_with_epsilon (s.stages[i].stage_mass_kg, exact_stage_mass[i], 0.5);
      /* Split (reference-values.md, computed).  An independent solve gives
       * 5.9375 / 3.1562 / 0.9063 km/s; the listed 3.157 is a digit high, so
       * allow 2 m/s for the rounding of the listed values. */
      g_assert_cmpfloat_with_epsilon (s.stages[i].delta_v_m_s / 1000.0, ref_dv_km_s[i], 0.002);
    }
  check_bookkeeping (&set, &s);
}

/* The same example with g0 = 9.80665 as given (no scaling): total 191,527 kg
 * (reference-values.md, computed; an independent solve gives 191,526.6). */
static void
test_textbook_optimal_standard_g0 (void)
{
  static const double isp[] = { 400.0, 350.0, 300.0 };
  static const double eps[] = { 0.10, 0.15, 0.20 };
  SwStageSet set = { 0 };
  SwSizing s;

  set_init (&set, 3, isp, eps, SW_G0);
  sw_size (&set, 5000.0, 10000.0, SW_SPLIT_OPTIMAL, &s);
  g_assert_true (s.feasible);
  g_assert_cmpfloat_with_epsilon (s.liftoff_mass_kg, 191527.0, 1.0);
  check_bookkeeping (&set, &s);
}

/* Second example (reference-values.md: inputs confirmed, results from
 * memory): payload 10,000 kg, eps 0.15, Isp 350 s, g0 = 9.81, one stage with
 * payload fraction 0.05: burnout speed 5.657 km/s, liftoff 200,000 kg. */
static void
test_textbook_single_stage (void)
{
  static const double isp[] = { 350.0 };
  static const double eps[] = { 0.15 };
  SwStageSet set = { 0 };
  SwSizing s;

  /* c = 350 * 9.81, the book's exhaust velocity. */
  set_init (&set, 1, isp, eps, BOOK_G0);
  sw_size (&set, 10000.0, 5657.0, SW_SPLIT_OPTIMAL, &s);
  g_assert_true (s.feasible);
  /* Liftoff 200,000 kg and payload fraction 0.05 (from memory); the book's
   * 5.657 km/s is rounded to 1 m/s, worth about 0.07 percent in mass. */
  assert_rel (s.liftoff_mass_kg, 200000.0, 0.001);
  assert_rel (s.payload_fraction, 0.05, 0.001);
  /* 190,000 kg of stage split by eps 0.15: 28,500 kg structure, 161,500 kg
   * propellant (from the example's inputs and the definition of eps). */
  assert_rel (s.stages[0].structural_mass_kg, 28500.0, 0.001);
  assert_rel (s.stages[0].propellant_mass_kg, 161500.0, 0.001);
  check_bookkeeping (&set, &s);

  /* Every split of one stage is the same vehicle. */
  {
    SwSizing e, m;
    sw_size (&set, 10000.0, 5657.0, SW_SPLIT_EQUAL, &e);
    set.share[0] = 1.0;
    sw_size (&set, 10000.0, 5657.0, SW_SPLIT_MANUAL, &m);
    assert_rel (e.liftoff_mass_kg, s.liftoff_mass_kg, 1e-12);
    assert_rel (m.liftoff_mass_kg, s.liftoff_mass_kg, 1e-12);
  }
}

/* ---- the optimum against independent checks ---------------------------- */

typedef struct {
  SwStageSet set;
  double payload;
  double delta_v;
} RandomDesign;

/* Random designs from a fixed-seed GSL generator: 2..5 stages, Isp 250..460 s,
 * eps 0.04..0.2, delta-v 20..85 percent of the vehicle's limit. */
static void
random_design (gsl_rng *rng, RandomDesign *rd)
{
  double isp[SW_MAX_STAGES], eps[SW_MAX_STAGES];
  guint n = 2 + gsl_rng_uniform_int (rng, 4);

  for (guint i = 0; i < n; i++)
    {
      isp[i] = 250.0 + 210.0 * gsl_rng_uniform (rng);
      eps[i] = 0.04 + 0.16 * gsl_rng_uniform (rng);
    }
  set_init (&rd->set, n, isp, eps, SW_G0);
  rd->payload = 100.0 + 20000.0 * gsl_rng_uniform (rng);
  rd->delta_v = (0.2 + 0.65 * gsl_rng_uniform (rng)) * set_limit (&rd->set);
}

/* Minimiser variables y (one per stage) map onto the closed simplex by
 * share_i = y_i^2 / sum y^2, so a share of exactly zero is an interior point
 * of y-space.  The penalty (sum y^2 - 1)^2 removes the scale freedom and is 0
 * at any minimum, so the minimum value is ln of the liftoff mass. */
static double
minimiser_objective (const gsl_vector *y, void *data)
{
  const RandomDesign *rd = data;
  double dv[SW_MAX_STAGES], sum2 = 0.0, m;

  for (guint i = 0; i < rd->set.n_stages; i++)
    sum2 += gsl_vector_get (y, i) * gsl_vector_get (y, i);
  if (!(sum2 > 1e-300))
    return 1e6;
  for (guint i = 0; i < rd->set.n_stages; i++)
    dv[i] = rd->delta_v * gsl_vector_get (y, i) * gsl_vector_get (y, i) / sum2;
  /* The core's mass of a given split, checked on its own against
   * hand-worked values (test_liftoff_mass_for_split); what is tested here is
   * the optimum, found by GSL without the Lagrange conditions. */
  m = sw_liftoff_mass_for_split (&rd->set, rd->payload, dv);
  if (!isfinite (m))
    return 1e6;
  return log (m) + (sum2 - 1.0) * (sum2 - 1.0);
}

/* Liftoff mass of the best split GSL's Nelder-Mead simplex (nmsimplex2)
 * finds, restarted from its own best point until it stops improving. */
static double
gsl_minimum_mass (RandomDesign *rd)
{
  guint n = rd->set.n_stages;
  gsl_multimin_function fn = { minimiser_objective, n, rd };
  gsl_multimin_fminimizer *mz =
    gsl_multimin_fminimizer_alloc (gsl_multimin_fminimizer_nmsimplex2, n);
  gsl_vector *y = gsl_vector_alloc (n);
  gsl_vector *step = gsl_vector_alloc (n);
  double best = G_MAXDOUBLE, limit = set_limit (&rd->set);

  /* Start with shares proportional to each stage's own limit: feasible,
   * since delta-v is below the vehicle's limit. */
  for (guint i = 0; i < n; i++)
    gsl_vector_set (y, i, sqrt (rd->set.exhaust_velocity_m_s[i]
                                * log (1.0 / rd->set.structural_coefficient[i]) / limit));
  /* Nelder-Mead can stall; restart from its best point with fresh simplices
   * of shrinking size until three restarts in a row bring nothing. */
  for (guint restart = 0, idle = 0; restart < 60 && idle < 3; restart++)
    {
      static const double steps[] = { 0.1, 0.02, 0.004 };
      int status = GSL_CONTINUE;

      gsl_vector_set_all (step, steps[restart % G_N_ELEMENTS (steps)]);
      gsl_multimin_fminimizer_set (mz, &fn, y, step);
      for (guint iter = 0; iter < 20000 && status == GSL_CONTINUE; iter++)
        {
          if (gsl_multimin_fminimizer_iterate (mz) != GSL_SUCCESS)
            break;
          status = gsl_multimin_test_size (gsl_multimin_fminimizer_size (mz), 1e-10);
        }
      if (mz->fval < best - 1e-13)
        idle = 0;
      else
        idle++;
      if (mz->fval < best)
        {
          best = mz->fval;
          gsl_vector_memcpy (y, gsl_multimin_fminimizer_x (mz));
        }
    }
  gsl_vector_free (step);
  gsl_vector_free (y);
  gsl_multimin_fminimizer_free (mz);
  return exp (best);
}

static void
test_optimal_vs_minimiser (void)
{
  gsl_rng *rng = gsl_rng_alloc (gsl_rng_mt19937);
  guint n_designs = 250, n_with_unused = 0;
  double worst = 0.0;

  gsl_rng_set (rng, 20240611);
  for (guint k = 0; k < n_designs; k++)
    {
      RandomDesign rd;
      SwSizing s;
      double m_gsl, rel;

      random_design (rng, &rd);
      sw_size (&rd.set, rd.payload, rd.delta_v, SW_SPLIT_OPTIMAL, &s);
      g_assert_true (s.feasible);
      check_bookkeeping (&rd.set, &s);
      if (s.n_unused > 0)
        n_with_unused++;

      /* An independent numerical optimum: GSL's minimiser over the shares must
       * agree with the Lagrange solution to 1e-6 relative (issue 2). */
      m_gsl = gsl_minimum_mass (&rd);
      rel = (m_gsl - s.liftoff_mass_kg) / s.liftoff_mass_kg;
      worst = MAX (worst, fabs (rel));
      if (!(fabs (rel) <= 1e-6))
        g_error ("design %u (%u stages, dv %.1f of limit %.1f): Lagrange %.10g kg, "
                 "minimiser %.10g kg, relative %.3g",
                 k, rd.set.n_stages, rd.delta_v, set_limit (&rd.set), s.liftoff_mass_kg, m_gsl,
                 rel);
    }
  g_test_message ("%u random designs, %u with a stage left unused at the optimum, worst "
                  "relative difference %.2g",
                  n_designs, n_with_unused, worst);
  gsl_rng_free (rng);
}

/* Curtis sec. 11.6 (confirmed): every stage that fires has
 * n_i = (c_i eta - 1) / (c_i eps_i eta), and n_i eps_i < 1. */
static void
test_lagrange_conditions (void)
{
  gsl_rng *rng = gsl_rng_alloc (gsl_rng_mt19937);

  gsl_rng_set (rng, 77);
  for (guint k = 0; k < 300; k++)
    {
      RandomDesign rd;
      SwSizing s;
      double dv[SW_MAX_STAGES], eta;

      random_design (rng, &rd);
      sw_size (&rd.set, rd.payload, rd.delta_v, SW_SPLIT_OPTIMAL, &s);
      g_assert_true (s.feasible);
      g_assert_true (isfinite (s.multiplier_s_m) && s.multiplier_s_m > 0.0);
      eta = s.multiplier_s_m;
      for (guint i = 0; i < rd.set.n_stages; i++)
        {
          double c = rd.set.exhaust_velocity_m_s[i], eps = rd.set.structural_coefficient[i];
          double n_book = (c * eta - 1.0) / (c * eps * eta);
          if (s.stages[i].unused)
            /* Boundary: the unconstrained n_i would be at most 1. */
            g_assert_cmpfloat (n_book, <=, 1.0 + 1e-9);
          else
            {
              assert_rel (s.stages[i].mass_ratio, n_book, 1e-7);
              g_assert_cmpfloat (s.stages[i].mass_ratio * eps, <, 1.0);
            }
        }

      /* sw_optimal_split gives the same split and multiplier. */
      {
        double mult;
        g_assert_true (sw_optimal_split (&rd.set, rd.delta_v, dv, &mult));
        g_assert_cmpfloat (mult, ==, s.multiplier_s_m);
        for (guint i = 0; i < rd.set.n_stages; i++)
          g_assert_cmpfloat (dv[i], ==, s.stages[i].delta_v_m_s);
      }
    }
  gsl_rng_free (rng);
}

/* No other split is lighter than the optimum: equal and random manual splits. */
static void
test_optimal_beats_other_splits (void)
{
  gsl_rng *rng = gsl_rng_alloc (gsl_rng_mt19937);

  gsl_rng_set (rng, 4242);
  for (guint k = 0; k < 200; k++)
    {
      RandomDesign rd;
      SwSizing opt, other;
      double sum = 0.0;

      random_design (rng, &rd);
      sw_size (&rd.set, rd.payload, rd.delta_v, SW_SPLIT_OPTIMAL, &opt);
      sw_size (&rd.set, rd.payload, rd.delta_v, SW_SPLIT_EQUAL, &other);
      if (other.feasible)
        {
          check_bookkeeping (&rd.set, &other);
          g_assert_cmpfloat (other.liftoff_mass_kg, >=, opt.liftoff_mass_kg * (1.0 - 1e-12));
        }
      for (guint i = 0; i < rd.set.n_stages; i++)
        sum += rd.set.share[i] = gsl_rng_uniform_pos (rng);
      for (guint i = 0; i < rd.set.n_stages; i++)
        rd.set.share[i] /= sum;
      sw_size (&rd.set, rd.payload, rd.delta_v, SW_SPLIT_MANUAL, &other);
      if (other.feasible)
        {
          check_bookkeeping (&rd.set, &other);
          g_assert_cmpfloat (other.liftoff_mass_kg, >=, opt.liftoff_mass_kg * (1.0 - 1e-12));
          for (guint i = 0; i < rd.set.n_stages; i++)
            assert_rel (other.stages[i].delta_v_share, rd.set.share[i], 1e-12);
        }
      else
        check_all_masses_nan (&other);
    }
  gsl_rng_free (rng);
}

/* ---- facts of the trade (common practice) ------------------------------ */

/* Same Isp and eps in every stage: the equal split is optimal (common
 * practice; Curtis sec. 11.6 shows the n_i are then equal). */
static void
test_equal_stages_equal_split (void)
{
  for (guint n = 1; n <= SW_MAX_STAGES; n++)
    {
      double isp[SW_MAX_STAGES], eps[SW_MAX_STAGES];
      SwStageSet set = { 0 };
      SwSizing opt, eq;

      for (guint i = 0; i < n; i++)
        {
          isp[i] = 330.0;
          eps[i] = 0.08;
        }
      set_init (&set, n, isp, eps, SW_G0);
      sw_size (&set, 2500.0, 0.6 * set_limit (&set), SW_SPLIT_OPTIMAL, &opt);
      sw_size (&set, 2500.0, 0.6 * set_limit (&set), SW_SPLIT_EQUAL, &eq);
      g_assert_true (opt.feasible && eq.feasible);
      check_bookkeeping (&set, &opt);
      check_bookkeeping (&set, &eq);
      assert_rel (opt.liftoff_mass_kg, eq.liftoff_mass_kg, 1e-9);
      for (guint i = 0; i < n; i++)
        {
          assert_rel (opt.stages[i].delta_v_m_s, opt.delta_v_m_s / n, 1e-9);
          assert_rel (eq.stages[i].delta_v_share, 1.0 / n, 1e-12);
        }
    }
}

/* Equal c, different eps: dv_i - dv_j = c ln(eps_j / eps_i)
 * (reference-values.md, computed from Curtis sec. 11.6). */
static void
test_equal_c_different_eps (void)
{
  static const double isp[] = { 340.0, 340.0, 340.0, 340.0 };
  static const double eps[] = { 0.05, 0.09, 0.12, 0.07 };
  SwStageSet set = { 0 };
  SwSizing s;
  double c = 340.0 * SW_G0;

  set_init (&set, 4, isp, eps, SW_G0);
  sw_size (&set, 1200.0, 11000.0, SW_SPLIT_OPTIMAL, &s);
  g_assert_true (s.feasible);
  g_assert_cmpuint (s.n_unused, ==, 0);
  for (guint i = 0; i < 4; i++)
    for (guint j = 0; j < 4; j++)
      g_assert_cmpfloat_with_epsilon (s.stages[i].delta_v_m_s - s.stages[j].delta_v_m_s,
                                      c * log (eps[j] / eps[i]), 1e-6);
  /* The lighter structure takes the larger share. */
  g_assert_cmpfloat (s.stages[0].delta_v_m_s, >, s.stages[3].delta_v_m_s);
  g_assert_cmpfloat (s.stages[3].delta_v_m_s, >, s.stages[1].delta_v_m_s);
  g_assert_cmpfloat (s.stages[1].delta_v_m_s, >, s.stages[2].delta_v_m_s);
}

/* N identical stages reach N times the single-stage limit c ln(1/eps)
 * (common practice). */
static void
test_identical_stages_limit (void)
{
  double isp[SW_MAX_STAGES], eps[SW_MAX_STAGES];
  double single = 300.0 * SW_G0 * log (1.0 / 0.1);

  for (guint i = 0; i < SW_MAX_STAGES; i++)
    {
      isp[i] = 300.0;
      eps[i] = 0.1;
    }
  for (guint n = 1; n <= SW_MAX_STAGES; n++)
    {
      SwStageSet set = { 0 };
      SwSizing below, beyond;

      set_init (&set, n, isp, eps, SW_G0);
      sw_size (&set, 1000.0, 0.999 * n * single, SW_SPLIT_OPTIMAL, &below);
      sw_size (&set, 1000.0, 1.0001 * n * single, SW_SPLIT_OPTIMAL, &beyond);
      assert_rel (below.delta_v_limit_m_s, n * single, 1e-12);
      g_assert_true (below.feasible);
      g_assert_false (beyond.feasible);
      check_all_masses_nan (&beyond);
      /* Near the limit the vehicle grows without bound. */
      g_assert_cmpfloat (below.liftoff_mass_kg, >, 1e3 * 1000.0);
    }
}

/* Liftoff mass grows linearly with payload (common practice: every stage
 * mass is proportional to the mass above it). */
static void
test_linear_in_payload (void)
{
  static const double isp[] = { 300.0, 350.0, 450.0 };
  static const double eps[] = { 0.07, 0.09, 0.12 };
  static const SwSplitMode modes[] = { SW_SPLIT_EQUAL, SW_SPLIT_OPTIMAL, SW_SPLIT_MANUAL };
  SwStageSet set = { 0 };

  set_init (&set, 3, isp, eps, SW_G0);
  set.share[0] = 0.4;
  set.share[1] = 0.35;
  set.share[2] = 0.25;
  for (guint k = 0; k < G_N_ELEMENTS (modes); k++)
    {
      SwSizing ref;
      sw_size (&set, 1000.0, 9000.0, modes[k], &ref);
      g_assert_true (ref.feasible);
      for (double p = 0.1; p < 1e7; p *= 7.3)
        {
          SwSizing s;
          sw_size (&set, p, 9000.0, modes[k], &s);
          assert_rel (s.liftoff_mass_kg, ref.liftoff_mass_kg * p / 1000.0, 1e-12);
          assert_rel (s.payload_fraction, ref.payload_fraction, 1e-12);
          for (guint i = 0; i < 3; i++)
            {
              assert_rel (s.stages[i].propellant_mass_kg,
                          ref.stages[i].propellant_mass_kg * p / 1000.0, 1e-12);
              g_assert_cmpfloat (s.stages[i].delta_v_m_s, ==, ref.stages[i].delta_v_m_s);
            }
        }
    }
}

/* ---- the boundary: a stage the optimum leaves unused -------------------- */

static void
check_unused (guint unused_index)
{
  /* A good stage (Isp 450 s, eps 0.05) and a poor one (Isp 250 s, eps 0.3).
   * The poor stage is worth firing only when x = 1/eta < c (1 - eps) =
   * 1716 m/s, i.e. above about 11 km/s; at 6 km/s the optimum leaves it out. */
  static const double good_isp = 450.0, good_eps = 0.05, poor_isp = 250.0, poor_eps = 0.3;
  g_autoptr (SwDesign) d = sw_design_new ();
  guint good_index = 1 - unused_index;
  SwStageSet set, alone;
  SwSizing s, ref;
  g_autofree char *label = NULL;

  d->payload_kg = 700.0;
  d->mission.delta_v_m_s = 6000.0;
  d->split = SW_SPLIT_OPTIMAL;
  d->n_stages = 2;
  g_strlcpy (d->stages[good_index].name, "Good stage", SW_NAME_MAX);
  d->stages[good_index].isp_vac_s = good_isp;
  d->stages[good_index].structural_coefficient = good_eps;
  g_strlcpy (d->stages[unused_index].name, "Poor stage", SW_NAME_MAX);
  d->stages[unused_index].isp_vac_s = poor_isp;
  d->stages[unused_index].structural_coefficient = poor_eps;

  g_assert_true (sw_size_design (d, &s, NULL));
  g_assert_true (s.feasible);
  g_assert_cmpuint (s.n_unused, ==, 1);
  g_assert_true (s.stages[unused_index].unused);
  g_assert_false (s.stages[good_index].unused);
  g_assert_cmpfloat (s.stages[unused_index].delta_v_m_s, ==, 0.0);
  g_assert_cmpfloat (s.stages[unused_index].propellant_mass_kg, ==, 0.0);
  g_assert_cmpfloat (s.stages[unused_index].mass_ratio, ==, 1.0);
  /* The reason names the stage, by number and by name. */
  label = g_strdup_printf ("stage %u", unused_index + 1);
  g_assert_nonnull (strstr (s.reason, label));
  g_assert_nonnull (strstr (s.reason, "Poor stage"));

  sw_stage_set_from_design (&set, d);
  check_bookkeeping (&set, &s);

  /* The liftoff mass equals the vehicle without that stage. */
  set_init (&alone, 1, &good_isp, &good_eps, SW_G0);
  sw_size (&alone, 700.0, 6000.0, SW_SPLIT_OPTIMAL, &ref);
  g_assert_true (ref.feasible);
  assert_rel (s.liftoff_mass_kg, ref.liftoff_mass_kg, 1e-9);
  assert_rel (s.stages[good_index].propellant_mass_kg, ref.stages[0].propellant_mass_kg, 1e-9);

  /* Without names, the reason still names the stage by number. */
  sw_size (&set, 700.0, 6000.0, SW_SPLIT_OPTIMAL, &s);
  g_assert_nonnull (strstr (s.reason, label));

  /* Well above 11 km/s both stages fire. */
  sw_size (&set, 700.0, 12500.0, SW_SPLIT_OPTIMAL, &s);
  g_assert_true (s.feasible);
  g_assert_cmpuint (s.n_unused, ==, 0);
  g_assert_cmpstr (s.reason, ==, "");
  check_bookkeeping (&set, &s);
}

static void
test_unused_upper_stage (void)
{
  check_unused (1);
}

static void
test_unused_first_stage (void)
{
  check_unused (0);
}

/* A tiny delta-v: the best stage does it all, the others stay empty. */
static void
test_tiny_delta_v (void)
{
  static const double isp[] = { 300.0, 330.0, 450.0 };
  static const double eps[] = { 0.06, 0.08, 0.10 };
  SwStageSet set = { 0 };
  SwSizing s;

  set_init (&set, 3, isp, eps, SW_G0);
  sw_size (&set, 1000.0, 50.0, SW_SPLIT_OPTIMAL, &s);
  g_assert_true (s.feasible);
  /* Lowest d(ln m0)/d(dv) at n = 1 is 1/(c (1 - eps)): the largest c(1-eps)
   * is stage 3 (3972 m/s) over stage 2 (2977) and stage 1 (2765). */
  g_assert_cmpuint (s.n_unused, ==, 2);
  g_assert_true (s.stages[0].unused && s.stages[1].unused);
  g_assert_false (s.stages[2].unused);
  g_assert_nonnull (strstr (s.reason, "stage 1"));
  check_bookkeeping (&set, &s);

  /* Zero delta-v: nothing fires, the vehicle is the payload. */
  sw_size (&set, 1000.0, 0.0, SW_SPLIT_OPTIMAL, &s);
  g_assert_true (s.feasible);
  assert_rel (s.liftoff_mass_kg, 1000.0, 1e-15);
  for (guint i = 0; i < 3; i++)
    g_assert_cmpfloat (s.stages[i].propellant_mass_kg, ==, 0.0);
}

/* ---- infeasible designs ------------------------------------------------- */

static void
test_infeasible_beyond_limit (void)
{
  static const double isp[] = { 300.0, 320.0 };
  static const double eps[] = { 0.1, 0.12 };
  static const SwSplitMode modes[] = { SW_SPLIT_EQUAL, SW_SPLIT_OPTIMAL, SW_SPLIT_MANUAL };
  SwStageSet set = { 0 };
  SwSizing s;
  double limit;

  set_init (&set, 2, isp, eps, SW_G0);
  set.share[0] = 0.5;
  set.share[1] = 0.5;
  limit = set_limit (&set);
  for (guint k = 0; k < G_N_ELEMENTS (modes); k++)
    {
      /* Beyond the limit, and exactly at it. */
      for (int at = 0; at < 2; at++)
        {
          SwSizing probe;
          double dv;

          sw_size (&set, 1000.0, 1000.0, modes[k], &probe);
          dv = at ? probe.delta_v_limit_m_s : 1.2 * limit;
          sw_size (&set, 1000.0, dv, modes[k], &s);
          g_assert_false (s.feasible);
          g_assert_cmpuint (strlen (s.reason), >, 0);
          check_all_masses_nan (&s);
          g_assert_cmpfloat (s.margin_m_s, <=, 0.0);
          for (guint i = 0; i < 2; i++)
            g_assert_false (s.stages[i].feasible && s.stages[(i + 1) % 2].feasible);
        }
    }
  /* The optimal split has no split to offer beyond the limit. */
  {
    double dv[2], mult;
    g_assert_false (sw_optimal_split (&set, limit * 1.01, dv, &mult));
  }
}

/* A manual share beyond a stage's own limit: the stage is named. */
static void
test_infeasible_manual_share (void)
{
  g_autoptr (SwDesign) d = sw_design_new ();
  SwSizing s;

  d->payload_kg = 500.0;
  d->mission.delta_v_m_s = 9000.0;
  d->split = SW_SPLIT_MANUAL;
  d->n_stages = 3;
  for (guint i = 0; i < 3; i++)
    {
      d->stages[i].isp_vac_s = 320.0;
      d->stages[i].structural_coefficient = 0.1;
      d->stages[i].has_share = TRUE;
    }
  g_strlcpy (d->stages[1].name, "Middle stage", SW_NAME_MAX);
  /* Stage 2 asked for 0.9 x 9000 = 8100 m/s; it reaches c ln 10 = 7226 m/s. */
  d->stages[0].delta_v_share = 0.05;
  d->stages[1].delta_v_share = 0.9;
  d->stages[2].delta_v_share = 0.05;
  g_assert_true (sw_size_design (d, &s, NULL));
  g_assert_false (s.feasible);
  g_assert_cmpint (s.infeasible_stage, ==, 1);
  g_assert_false (s.stages[1].feasible);
  g_assert_true (s.stages[0].feasible && s.stages[2].feasible);
  g_assert_nonnull (strstr (s.reason, "stage 2"));
  g_assert_nonnull (strstr (s.reason, "Middle stage"));
  check_all_masses_nan (&s);
  /* The vehicle as a whole could do it: the margin is positive. */
  g_assert_cmpfloat (s.margin_m_s, >, 0.0);

  /* The same vehicle with the optimal split is feasible. */
  d->split = SW_SPLIT_OPTIMAL;
  g_assert_true (sw_size_design (d, &s, NULL));
  g_assert_true (s.feasible);
  g_assert_cmpint (s.infeasible_stage, ==, -1);
}

/* The equal split can ask a weak stage for more than it can give while the
 * optimal split still closes. */
static void
test_infeasible_equal_split (void)
{
  static const double isp[] = { 450.0, 260.0 };
  static const double eps[] = { 0.05, 0.25 };
  SwStageSet set = { 0 };
  SwSizing s;
  double weak = 260.0 * SW_G0 * log (4.0);   /* 3535 m/s */

  set_init (&set, 2, isp, eps, SW_G0);
  sw_size (&set, 100.0, 2.2 * weak, SW_SPLIT_EQUAL, &s);
  g_assert_false (s.feasible);
  g_assert_cmpint (s.infeasible_stage, ==, 1);
  g_assert_nonnull (strstr (s.reason, "stage 2"));
  check_all_masses_nan (&s);
  sw_size (&set, 100.0, 2.2 * weak, SW_SPLIT_OPTIMAL, &s);
  g_assert_true (s.feasible);
  check_bookkeeping (&set, &s);
}

/* ---- direct entry points ------------------------------------------------ */

static void
test_liftoff_mass_for_split (void)
{
  static const double isp[] = { 290.0, 340.0, 420.0 };
  static const double eps[] = { 0.07, 0.1, 0.13 };
  /* Worked by hand from the definitions, top stage first (g0 = 9.80665;
   * each stage: n = exp(dv / c); the propellant mp from m0 / mf = n with
   * m0 = above + mp + ms, mf = above + ms and ms = mp eps / (1 - eps)):
   *   stage 3: c = 4118.793 m/s, n = 1.834871, mp =    763.0929, ms = 114.0254,
   *            m0 =  1677.1182 kg (payload 800 kg above)
   *   stage 2: c = 3334.261 m/s, n = 2.856816, mp =  3923.5876, ms = 435.9542,
   *            m0 =  6036.6600 kg
   *   stage 1: c = 2843.929 m/s, n = 2.871627, mp = 13151.0307, ms = 989.8625,
   *            m0 = 20177.5532 kg
   * The values are printed to 0.1 g: 1e-7 relative covers their rounding. */
  static const double hand_m0[] = { 20177.5532, 6036.6600, 1677.1182 };
  static const double hand_mp[] = { 13151.0307, 3923.5876, 763.0929 };
  SwStageSet set = { 0 };
  double dv[3] = { 3000.0, 3500.0, 2500.0 };
  SwSizing s;

  set_init (&set, 3, isp, eps, SW_G0);
  set.share[0] = 0.3;
  set.share[1] = 0.35;
  set.share[2] = 0.25;
  assert_rel (sw_liftoff_mass_for_split (&set, 800.0, dv), hand_m0[0], 1e-7);
  sw_size (&set, 800.0, 10000.0, SW_SPLIT_MANUAL, &s);
  g_assert_true (s.feasible);
  for (guint i = 0; i < 3; i++)
    {
      assert_rel (s.stages[i].delta_v_m_s, dv[i], 1e-12);
      assert_rel (s.stages[i].initial_mass_kg, hand_m0[i], 1e-7);
      assert_rel (s.stages[i].propellant_mass_kg, hand_mp[i], 1e-7);
    }
  assert_rel (s.liftoff_mass_kg, hand_m0[0], 1e-7);

  dv[1] = -1.0;
  g_assert_true (isnan (sw_liftoff_mass_for_split (&set, 800.0, dv)));
  dv[1] = 340.0 * SW_G0 * log (10.0) + 1.0;
  g_assert_true (isnan (sw_liftoff_mass_for_split (&set, 800.0, dv)));
  dv[1] = NAN;
  g_assert_true (isnan (sw_liftoff_mass_for_split (&set, 800.0, dv)));
}

/* A stage asked for exactly its own limit c ln(1/eps) cannot give it (the
 * mass ratio 1/eps leaves no room for propellant: n eps = 1); one metre per
 * second less, it can.  The stage is named. */
static void
test_stage_at_its_limit (void)
{
  static const double isp[] = { 300.0, 450.0 };
  static const double eps[] = { 0.1, 0.08 };
  SwStageSet set = { 0 };
  SwSizing s;
  double limit1;

  set_init (&set, 2, isp, eps, SW_G0);
  limit1 = 300.0 * SW_G0 * log (1.0 / 0.1);          /* 6771.6 m/s */
  set.share[0] = 0.5;
  set.share[1] = 0.5;
  /* 0.5 x (2 limit1) is limit1 exactly in binary; stage 2 (limit 11,147
   * m/s) has room for its half. */
  sw_size (&set, 1000.0, 2.0 * limit1, SW_SPLIT_MANUAL, &s);
  g_assert_cmpfloat (s.stages[0].delta_v_m_s, ==, limit1);
  g_assert_false (s.feasible);
  g_assert_false (s.stages[0].feasible);
  g_assert_true (s.stages[1].feasible);
  g_assert_cmpint (s.infeasible_stage, ==, 0);
  g_assert_nonnull (strstr (s.reason, "stage 1"));
  check_all_masses_nan (&s);

  set.share[0] = (limit1 - 1.0) / (2.0 * limit1);
  set.share[1] = 1.0 - set.share[0];
  sw_size (&set, 1000.0, 2.0 * limit1, SW_SPLIT_MANUAL, &s);
  g_assert_true (s.feasible);
  /* n eps = exp(-1 / c) close to 1: the stage is enormous but finite. */
  g_assert_true (isfinite (s.liftoff_mass_kg));
  g_assert_cmpfloat (s.liftoff_mass_kg, >, 1e6);
}

/* The optimal split exists below the vehicle's limit and not at it: at
 * exactly the limit every stage would have to give its own limit. */
static void
test_optimal_split_at_vehicle_limit (void)
{
  static const double isp[] = { 300.0, 320.0, 450.0 };
  static const double eps[] = { 0.1, 0.12, 0.09 };
  SwStageSet set = { 0 };
  SwSizing s;
  double dv[3], mult, limit;

  set_init (&set, 3, isp, eps, SW_G0);
  sw_size (&set, 1000.0, 1000.0, SW_SPLIT_OPTIMAL, &s);
  limit = s.delta_v_limit_m_s;
  /* The vehicle's limit is the sum of the stages' (Curtis sec. 11.6 has no
   * optimum beyond it; reference-values.md): 6771.6 + 6673.7 + 10626.9. */
  assert_rel (limit, SW_G0 * (300.0 * log (10.0) + 320.0 * log (1.0 / 0.12)
                              + 450.0 * log (1.0 / 0.09)), 1e-12);
  g_assert_false (sw_optimal_split (&set, limit, dv, &mult));
  sw_size (&set, 1000.0, limit, SW_SPLIT_OPTIMAL, &s);
  g_assert_false (s.feasible);
  check_all_masses_nan (&s);
  g_assert_cmpfloat (s.margin_m_s, ==, 0.0);

  g_assert_true (sw_optimal_split (&set, limit - 10.0, dv, &mult));
  g_assert_cmpfloat_with_epsilon (dv[0] + dv[1] + dv[2], limit - 10.0, 1e-6);
  for (guint i = 0; i < 3; i++)
    g_assert_cmpfloat (dv[i], <, isp[i] * SW_G0 * log (1.0 / eps[i]));
  sw_size (&set, 1000.0, limit - 10.0, SW_SPLIT_OPTIMAL, &s);
  g_assert_true (s.feasible);
  g_assert_cmpfloat_with_epsilon (s.margin_m_s, 10.0, 1e-6);
}

static void
test_design_size (void)
{
  g_autoptr (SwDesign) d = sw_design_new_default ();
  g_autoptr (GError) error = NULL;
  SwStageSet set = { 0 };
  SwSizing s, ref;
  double dv;

  /* A delta-v mission sizes at its delta-v with its split. */
  d->split = SW_SPLIT_MANUAL;
  g_assert_true (sw_size_design (d, &s, &error));
  g_assert_no_error (error);
  sw_stage_set_from_design (&set, d);
  sw_size (&set, d->payload_kg, d->mission.delta_v_m_s, SW_SPLIT_MANUAL, &ref);
  g_assert_cmpfloat (s.liftoff_mass_kg, ==, ref.liftoff_mass_kg);
  g_assert_cmpint (s.split, ==, SW_SPLIT_MANUAL);

  /* An orbit mission sizes at the budget's delta-v. */
  d->mission.kind = SW_MISSION_ORBIT;
  d->mission.altitude_km = 300.0;
  d->mission.inclination_deg = 40.0;
  d->mission.site_latitude_deg = 30.0;
  d->mission.losses_m_s = 1400.0;
  d->mission.has_losses = TRUE;
  d->split = SW_SPLIT_OPTIMAL;
  g_assert_true (sw_design_required_delta_v (d, &dv, &error));
  g_assert_true (sw_size_design (d, &s, &error));
  g_assert_no_error (error);
  g_assert_cmpfloat (s.delta_v_m_s, ==, dv);
  g_assert_cmpfloat (dv, >, 1400.0 + 7000.0);

  /* An unreachable orbit is an error, not a sizing. */
  d->mission.inclination_deg = 10.0;
  g_assert_false (sw_size_design (d, &s, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_VALUE);
  g_clear_error (&error);

  /* No stages: an error. */
  d->mission.inclination_deg = 40.0;
  d->n_stages = 0;
  g_assert_false (sw_size_design (d, &s, &error));
  g_assert_nonnull (error);
}

/* ---- structural coefficient conversions -------------------------------- */

static void
test_eps_definitions (void)
{
  /* eps = ms/(ms + mp) = 0.1: ms = 1, mp = 9 (definitions, issue 2). */
  g_assert_cmpfloat_with_epsilon (sw_eps_to_form (0.1, SW_EPS_COEFFICIENT), 0.1, 1e-15);
  g_assert_cmpfloat_with_epsilon (sw_eps_to_form (0.1, SW_EPS_STRUCTURE_RATIO), 1.0 / 9.0, 1e-15);
  g_assert_cmpfloat_with_epsilon (sw_eps_to_form (0.1, SW_EPS_WET_DRY_RATIO), 10.0, 1e-13);
  g_assert_cmpfloat_with_epsilon (sw_eps_to_form (0.1, SW_EPS_PROPELLANT_FRACTION), 0.9, 1e-15);
  /* eps 0.2: ms = 1, mp = 4: ratio 1/4, wet-to-dry 5, fraction 0.8. */
  g_assert_cmpfloat_with_epsilon (sw_eps_to_form (0.2, SW_EPS_STRUCTURE_RATIO), 0.25, 1e-15);
  g_assert_cmpfloat_with_epsilon (sw_eps_to_form (0.2, SW_EPS_WET_DRY_RATIO), 5.0, 1e-14);
  g_assert_cmpfloat_with_epsilon (sw_eps_to_form (0.2, SW_EPS_PROPELLANT_FRACTION), 0.8, 1e-15);
  /* And back. */
  g_assert_cmpfloat_with_epsilon (sw_eps_from_form (1.0 / 9.0, SW_EPS_STRUCTURE_RATIO), 0.1, 1e-15);
  g_assert_cmpfloat_with_epsilon (sw_eps_from_form (10.0, SW_EPS_WET_DRY_RATIO), 0.1, 1e-15);
  g_assert_cmpfloat_with_epsilon (sw_eps_from_form (0.9, SW_EPS_PROPELLANT_FRACTION), 0.1, 1e-15);
  g_assert_cmpfloat_with_epsilon (sw_eps_from_form (0.25, SW_EPS_STRUCTURE_RATIO), 0.2, 1e-15);
  g_assert_cmpfloat (sw_eps_from_form (0.1, SW_EPS_COEFFICIENT), ==, 0.1);

  /* A wet-to-dry ratio near 19.5 is typical of a kerosene first stage
   * (common practice): eps about 0.051. */
  g_assert_cmpfloat_with_epsilon (sw_eps_from_form (19.5, SW_EPS_WET_DRY_RATIO), 0.051, 5e-4);
  g_assert_cmpfloat_with_epsilon (sw_eps_to_form (0.051, SW_EPS_WET_DRY_RATIO), 19.5, 0.2);
  /* Such a stage leaves about 0.949 of its wet mass as propellant. */
  g_assert_cmpfloat_with_epsilon (
    sw_eps_to_form (sw_eps_from_form (19.5, SW_EPS_WET_DRY_RATIO), SW_EPS_PROPELLANT_FRACTION),
    0.949, 5e-4);
}

static void
test_eps_round_trips (void)
{
  static const SwEpsForm forms[] = {
    SW_EPS_COEFFICIENT, SW_EPS_STRUCTURE_RATIO, SW_EPS_WET_DRY_RATIO, SW_EPS_PROPELLANT_FRACTION,
  };

  for (guint f = 0; f < G_N_ELEMENTS (forms); f++)
    for (double eps = 0.01; eps <= 0.6 + 1e-12; eps += 0.0049)
      {
        double v = sw_eps_to_form (eps, forms[f]);
        g_assert_true (isfinite (v) && v > 0.0);
        assert_rel (sw_eps_from_form (v, forms[f]), eps, 1e-14);
        /* Each form from its definition with ms = eps, mp = 1 - eps. */
        switch (forms[f])
          {
          case SW_EPS_STRUCTURE_RATIO:
            assert_rel (v, eps / (1.0 - eps), 1e-14);
            break;
          case SW_EPS_WET_DRY_RATIO:
            assert_rel (v, (eps + (1.0 - eps)) / eps, 1e-14);
            break;
          case SW_EPS_PROPELLANT_FRACTION:
            assert_rel (v, (1.0 - eps) / (eps + (1.0 - eps)), 1e-14);
            break;
          case SW_EPS_COEFFICIENT:
          default:
            g_assert_cmpfloat (v, ==, eps);
            break;
          }
      }
}

static void
test_eps_form_range (void)
{
  double lo, hi;

  /* Ratios that grow with eps keep their order; the others swap. */
  sw_eps_form_range (SW_EPS_STRUCTURE_RATIO, 0.01, 0.6, &lo, &hi);
  assert_rel (lo, 0.01 / 0.99, 1e-14);
  assert_rel (hi, 1.5, 1e-14);
  sw_eps_form_range (SW_EPS_WET_DRY_RATIO, 0.01, 0.6, &lo, &hi);
  assert_rel (lo, 1.0 / 0.6, 1e-14);
  assert_rel (hi, 100.0, 1e-14);
  sw_eps_form_range (SW_EPS_PROPELLANT_FRACTION, 0.01, 0.6, &lo, &hi);
  assert_rel (lo, 0.4, 1e-14);
  assert_rel (hi, 0.99, 1e-14);
  sw_eps_form_range (SW_EPS_COEFFICIENT, 0.01, 0.6, &lo, &hi);
  g_assert_cmpfloat (lo, ==, 0.01);
  g_assert_cmpfloat (hi, ==, 0.6);
}

static void
test_eps_form_strings (void)
{
  const char *names[4] = {
    sw_eps_form_to_string (SW_EPS_COEFFICIENT),
    sw_eps_form_to_string (SW_EPS_STRUCTURE_RATIO),
    sw_eps_form_to_string (SW_EPS_WET_DRY_RATIO),
    sw_eps_form_to_string (SW_EPS_PROPELLANT_FRACTION),
  };

  for (guint i = 0; i < 4; i++)
    {
      g_assert_nonnull (names[i]);
      g_assert_cmpuint (strlen (names[i]), >, 0);
      for (guint j = 0; j < i; j++)
        g_assert_cmpstr (names[i], !=, names[j]);
    }
}

/* The fairing in the sizing, checked by hand with the rocket equation
 * (Tsiolkovsky, dv = c ln(m_initial / m_final), applied burn phase by burn
 * phase).  Two stages, manual split 3,500 + 4,000 m/s, 1,000 kg payload, a
 * 200 kg fairing that the second stage drops after half its propellant:
 *   second stage: phase a burns mp/2 with the fairing on, then the fairing
 *   (200 kg) goes, phase b burns the other mp/2; dv_a + dv_b = 4,000 m/s;
 *   first stage: its payload is the second stage at ignition, fairing on.
 * The liftoff mass lies between the vehicle that drops the fairing at the
 * second stage's ignition and the one that carries it to its burnout, and
 * those two are plain sizings: the fairing as part of the first stage's
 * payload, or of the second stage's. */
static void
test_fairing_carried (void)
{
  SwStageSet set = { 0 };
  SwSizing s, s0, s1;
  const double P = 1000.0, F = 200.0, dv[2] = { 3500.0, 4000.0 };
  double c2, mp, m0, m1, bo, dva, dvb, lo, hi;

  memset (&set, 0, sizeof set);
  set.n_stages = 2;
  set.exhaust_velocity_m_s[0] = 2800.0;
  set.exhaust_velocity_m_s[1] = 3200.0;
  set.structural_coefficient[0] = 0.08;
  set.structural_coefficient[1] = 0.10;
  set.share[0] = dv[0] / (dv[0] + dv[1]);
  set.share[1] = dv[1] / (dv[0] + dv[1]);
  set.fairing = (SwFairingCarry) { F, 1, 0.5 };
  sw_size (&set, P, dv[0] + dv[1], SW_SPLIT_MANUAL, &s);
  g_assert_true (s.feasible);
  g_assert_cmpfloat (s.fairing.mass_kg, ==, F);

  /* The second stage, phase by phase. */
  c2 = set.exhaust_velocity_m_s[1];
  mp = s.stages[1].propellant_mass_kg;
  m0 = s.stages[1].initial_mass_kg;
  bo = s.stages[1].burnout_mass_kg;
  g_assert_cmpfloat_with_epsilon (m0, P + F + mp + s.stages[1].structural_mass_kg, 1e-9);
  g_assert_cmpfloat_with_epsilon (bo, P + s.stages[1].structural_mass_kg, 1e-9);
  g_assert_cmpfloat_with_epsilon (s.stages[1].structural_mass_kg / (mp + s.stages[1].structural_mass_kg),
                                  0.10, 1e-12);
  m1 = m0 - 0.5 * mp;                       /* end of phase a, fairing still on */
  dva = c2 * log (m0 / m1);
  dvb = c2 * log ((m1 - F) / bo);           /* phase b starts without the fairing */
  g_assert_cmpfloat_with_epsilon (dva + dvb, dv[1], 1e-6);
  g_assert_cmpfloat_with_epsilon (s.stages[1].delta_v_m_s, dv[1], 1e-9);
  g_assert_cmpfloat_with_epsilon (s.stages[1].mass_ratio, exp (dv[1] / c2), 1e-12);

  /* The first stage carries the second at ignition, fairing included. */
  g_assert_cmpfloat_with_epsilon (s.stages[0].payload_mass_kg, m0, 1e-9);
  g_assert_cmpfloat_with_epsilon (set.exhaust_velocity_m_s[0]
                                    * log (s.stages[0].initial_mass_kg
                                           / s.stages[0].burnout_mass_kg),
                                  dv[0], 1e-6);
  g_assert_cmpfloat_with_epsilon (s.liftoff_mass_kg,
                                  P + F + s.stages[0].stage_mass_kg + s.stages[1].stage_mass_kg,
                                  1e-6);
  /* The same number from the split alone (the Monte Carlo's route). */
  g_assert_cmpfloat_with_epsilon (sw_liftoff_mass_for_split (&set, P, dv), s.liftoff_mass_kg,
                                  1e-6 * s.liftoff_mass_kg);

  /* Bounds: dropped at ignition (fraction 0) and at burnout (1), each a plain
   * sizing without a fairing in the set. */
  set.fairing.fraction = 0.0;
  sw_size (&set, P, dv[0] + dv[1], SW_SPLIT_MANUAL, &s0);
  set.fairing.fraction = 1.0;
  sw_size (&set, P, dv[0] + dv[1], SW_SPLIT_MANUAL, &s1);
  lo = s0.liftoff_mass_kg;
  hi = s1.liftoff_mass_kg;
  g_assert_cmpfloat (lo, <, s.liftoff_mass_kg);
  g_assert_cmpfloat (s.liftoff_mass_kg, <, hi);
  {
    SwStageSet bare = set;
    SwSizing top, whole;
    double n1 = exp (dv[0] / 2800.0), n2 = exp (dv[1] / c2);
    double m2 = P * n2 * 0.9 / (1.0 - n2 * 0.1);             /* second stage over P */
    double m2f = (P + F) * n2 * 0.9 / (1.0 - n2 * 0.1);      /* ... over P + F */

    bare.fairing.mass_kg = 0.0;
    sw_size (&bare, P, dv[0] + dv[1], SW_SPLIT_MANUAL, &top);
    sw_size (&bare, P + F, dv[0] + dv[1], SW_SPLIT_MANUAL, &whole);
    g_assert_cmpfloat_with_epsilon (top.stages[1].initial_mass_kg, m2, 1e-9 * m2);
    g_assert_cmpfloat_with_epsilon (lo, (m2 + F) * n1 * 0.92 / (1.0 - n1 * 0.08), 1e-9 * lo);
    g_assert_cmpfloat_with_epsilon (hi, m2f * n1 * 0.92 / (1.0 - n1 * 0.08), 1e-9 * hi);
    g_assert_cmpfloat_with_epsilon (hi, whole.liftoff_mass_kg, 1e-9 * hi);
  }
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/core/sizing/g0-standard", test_g0);
  g_test_add_func ("/core/sizing/stage-set-from-design", test_stage_set_from_design);
  g_test_add_func ("/core/sizing/stage-set-extend", test_stage_set_extend);
  g_test_add_func ("/core/sizing/textbook-optimal", test_textbook_optimal);
  g_test_add_func ("/core/sizing/textbook-optimal-standard-g0",
                   test_textbook_optimal_standard_g0);
  g_test_add_func ("/core/sizing/textbook-single-stage", test_textbook_single_stage);
  g_test_add_func ("/core/sizing/optimal-vs-gsl-minimiser", test_optimal_vs_minimiser);
  g_test_add_func ("/core/sizing/lagrange-conditions", test_lagrange_conditions);
  g_test_add_func ("/core/sizing/optimal-beats-other-splits", test_optimal_beats_other_splits);
  g_test_add_func ("/core/sizing/equal-stages-equal-split", test_equal_stages_equal_split);
  g_test_add_func ("/core/sizing/equal-c-different-eps", test_equal_c_different_eps);
  g_test_add_func ("/core/sizing/identical-stages-limit", test_identical_stages_limit);
  g_test_add_func ("/core/sizing/linear-in-payload", test_linear_in_payload);
  g_test_add_func ("/core/sizing/unused-upper-stage", test_unused_upper_stage);
  g_test_add_func ("/core/sizing/unused-first-stage", test_unused_first_stage);
  g_test_add_func ("/core/sizing/tiny-delta-v", test_tiny_delta_v);
  g_test_add_func ("/core/sizing/infeasible-beyond-limit", test_infeasible_beyond_limit);
  g_test_add_func ("/core/sizing/infeasible-manual-share", test_infeasible_manual_share);
  g_test_add_func ("/core/sizing/infeasible-equal-split", test_infeasible_equal_split);
  g_test_add_func ("/core/sizing/liftoff-mass-for-split", test_liftoff_mass_for_split);
  g_test_add_func ("/core/sizing/stage-at-its-limit", test_stage_at_its_limit);
  g_test_add_func ("/core/sizing/optimal-split-at-vehicle-limit",
                   test_optimal_split_at_vehicle_limit);
  g_test_add_func ("/core/sizing/design-size", test_design_size);
  g_test_add_func ("/core/sizing/fairing-carried", test_fairing_carried);
  g_test_add_func ("/core/sizing/eps-definitions", test_eps_definitions);
  g_test_add_func ("/core/sizing/eps-round-trips", test_eps_round_trips);
  g_test_add_func ("/core/sizing/eps-form-range", test_eps_form_range);
  g_test_add_func ("/core/sizing/eps-form-strings", test_eps_form_strings);

  return g_test_run ();
}
