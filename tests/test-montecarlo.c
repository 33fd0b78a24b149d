/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Tests of the Monte Carlo: repeatability across thread counts, the mean
 * against the deterministic run where the model is near linear, the spread
 * against first-order propagation, and the "uncertainty" design keys. */
#include "config.h"

#include "sw-design.h"
#include "sw-montecarlo.h"
#include "sw-phases.h"
#include "sw-sensitivity.h"
#include "sw-sizing.h"

#include <gsl/gsl_rng.h>
#include <gsl/gsl_sort.h>
#include <gsl/gsl_statistics_double.h>
#include <math.h>
#include <string.h>
#include <unistd.h>

static const char *design_json =
  "{ \"format\": \"stagewright-design\", \"version\": 1, \"name\": \"mc\",\n"
  "  \"payload_kg\": 1200, \"mission\": { \"delta_v_m_s\": 9300 }, \"split\": \"optimal\",\n"
  "  \"stages\": [\n"
  "    { \"isp_vac_s\": 320, \"structural_coefficient\": 0.07 },\n"
  "    { \"isp_vac_s\": 345, \"structural_coefficient\": 0.09 },\n"
  "    { \"isp_vac_s\": 325, \"structural_coefficient\": 0.14 } ],\n"
  "  \"uncertainty\": { \"samples\": 4000, \"seed\": 99,\n"
  "    \"isp_vac\": { \"distribution\": \"normal\", \"sigma_percent\": 1.0 },\n"
  "    \"structural_coefficient\": { \"distribution\": \"uniform\", \"half_range_percent\": 8 },\n"
  "    \"losses\": { \"distribution\": \"normal\", \"sigma_m_s\": 120 } } }";

static SwDesign *
load (const char *json, GError **error)
{
  return sw_design_load_data (json, -1, "mc.stagewright", NULL, error);
}

/* One seed, 1 and 2 threads (and 3, which splits the blocks unevenly):
 * every sample and every statistic bit for bit the same. */
static void
test_same_seed_any_threads (void)
{
  g_autoptr (SwDesign) d = load (design_json, NULL);
  const guint n = 3000;   /* not a multiple of the block size */
  g_autofree double *l1 = g_new (double, n), *l2 = g_new (double, n), *l3 = g_new (double, n);
  g_autofree double *p1 = g_new (double, n), *p2 = g_new (double, n), *p3 = g_new (double, n);
  SwMonteCarlo a, b, c, other;

  g_assert_true (sw_montecarlo_run (d, NULL, n, TRUE, 12345, 1, &a, l1, p1, NULL));
  g_assert_true (sw_montecarlo_run (d, NULL, n, TRUE, 12345, 2, &b, l2, p2, NULL));
  g_assert_true (sw_montecarlo_run (d, NULL, n, TRUE, 12345, 3, &c, l3, p3, NULL));
  g_assert_cmpuint (a.threads, ==, 1);
  g_assert_cmpuint (b.threads, ==, 2);
  g_assert_cmpmem (l1, n * sizeof (double), l2, n * sizeof (double));
  g_assert_cmpmem (p1, n * sizeof (double), p2, n * sizeof (double));
  g_assert_cmpmem (l1, n * sizeof (double), l3, n * sizeof (double));
  g_assert_cmpmem (&a.liftoff, sizeof a.liftoff, &b.liftoff, sizeof b.liftoff);
  g_assert_cmpmem (&a.payload, sizeof a.payload, &b.payload, sizeof b.payload);
  g_assert_cmpfloat (a.p_negative_margin, ==, b.p_negative_margin);

  /* Another seed gives another stream. */
  g_assert_true (sw_montecarlo_run (d, NULL, n, TRUE, 12346, 2, &other, NULL, NULL, NULL));
  g_assert_cmpfloat (other.liftoff.mean, !=, a.liftoff.mean);
}

/* Where the model is near linear (small spreads) the Monte Carlo mean lies
 * within 3 standard errors of the deterministic run at the mean inputs
 * (common practice: the central limit theorem, standard error sd/sqrt(N)).
 * The spreads are symmetric about the nominal values, so the mean inputs are
 * the design's. */
static void
test_mean_near_linear (void)
{
  g_autoptr (SwDesign) d = load (design_json, NULL);
  SwUncertainty small = d->uncertainty;
  SwMonteCarlo mc;
  SwSizing s;
  double se;

  small.isp.width = 0.05;
  small.structural_coefficient.width = 0.5;
  small.losses.width = 5.0;
  g_assert_true (sw_size_design (d, &s, NULL));
  g_assert_true (sw_montecarlo_run (d, &small, 10000, TRUE, 4, 0, &mc, NULL, NULL, NULL));
  g_assert_cmpfloat (mc.infeasible_fraction, ==, 0.0);

  se = mc.liftoff.sd / sqrt (mc.liftoff.n);
  g_assert_cmpfloat (mc.liftoff.sd, >, 0.0);
  g_assert_cmpfloat (fabs (mc.liftoff.mean - s.liftoff_mass_kg), <, 3.0 * se);

  /* Question 2: the vehicle as sized carries the payload on average. */
  se = mc.payload.sd / sqrt (mc.payload.n);
  g_assert_cmpfloat (fabs (mc.payload.mean - d->payload_kg), <, 3.0 * se);
  /* Symmetric, near-linear: about half the samples fall short.  A share
   * of N = 10,000 samples has a standard error of sqrt(0.25 / N) = 0.005
   * (common practice): three of them, 0.015. */
  g_test_message ("share short of the payload %.4f", mc.p_negative_margin);
  g_assert_cmpfloat (fabs (mc.p_negative_margin - 0.5), <, 3.0 * sqrt (0.25 / 10000.0));
}

/* The spread against first-order propagation of uncertainty (JCGM 100:2008,
 * "Guide to the expression of uncertainty in measurement", the law of
 * propagation for independent inputs, u^2 = sum (df/dx_i)^2 u_i^2; a uniform
 * half range h counts as u = h/sqrt(3); from memory), the sensitivities from
 * the analytic module.  Small spreads, so the linear model holds to a few
 * percent. */
static void
test_sd_against_propagation (void)
{
  g_autoptr (SwDesign) d = load (design_json, NULL);
  SwUncertainty small = d->uncertainty;
  SwMonteCarlo mc;
  SwStageSet set = { 0 };
  SwSizing s;
  double d_dv, d_isp[SW_MAX_STAGES], d_eps[SW_MAX_STAGES], var = 0.0;

  small.isp.width = 0.2;                       /* percent, normal sigma */
  small.structural_coefficient.width = 2.0;    /* percent, uniform half range */
  small.losses.width = 20.0;                   /* m/s, normal sigma */
  g_assert_true (sw_size_design (d, &s, NULL));
  sw_stage_set_from_design (&set, d);
  sw_sensitivity_analytic (&set, &s, NULL, &d_dv, d_isp, d_eps);
  for (guint i = 0; i < d->n_stages; i++)
    {
      double u_isp = d->stages[i].isp_vac_s * 0.002;
      double u_eps = d->stages[i].structural_coefficient * 0.02 / sqrt (3.0);
      var += pow (d_isp[i] * u_isp, 2) + pow (d_eps[i] * u_eps, 2);
    }
  var += pow (d_dv * 20.0, 2);

  g_assert_true (sw_montecarlo_run (d, &small, 20000, TRUE, 5, 0, &mc, NULL, NULL, NULL));
  /* The sample sd of N normal-like values has a relative standard error of
   * 1/sqrt(2 (N - 1)) = 0.5 % at N = 20,000 (common practice); the
   * linearisation error is second order in these small spreads.  Three
   * standard errors: 1.5 %.  Measured: 0.17 %. */
  g_test_message ("Monte Carlo sd / propagated sd - 1 = %.3g", mc.liftoff.sd / sqrt (var) - 1.0);
  g_assert_cmpfloat (fabs (mc.liftoff.sd / sqrt (var) - 1.0), <, 3.0 / sqrt (2.0 * 19999.0));
}

static int
cmp_double (const void *a, const void *b)
{
  double x = *(const double *) a, y = *(const double *) b;
  return (x > y) - (x < y);
}

/* Sorts the finite values of @v to the front; returns how many. */
static guint
finite_sorted (double *v, guint n)
{
  guint k = 0;
  for (guint i = 0; i < n; i++)
    if (isfinite (v[i]))
      v[k++] = v[i];
  qsort (v, k, sizeof *v, cmp_double);
  return k;
}

/* The summary against GSL's statistics of the samples the run returns:
 * mean, sd, percentiles (gsl_stats_quantile_from_sorted_data), extremes,
 * histogram, the share of samples short of the payload and the reserve. */
static void
test_summary (void)
{
  g_autoptr (SwDesign) d = load (design_json, NULL);
  g_autofree double *lift = g_new (double, 4000);
  g_autofree double *pay = g_new (double, 4000);
  SwMonteCarlo mc;
  guint total = 0, n, short_of = 0, bins[SW_MC_BINS] = { 0 };

  g_assert_true (sw_montecarlo_run (d, NULL, 0, FALSE, 0, 0, &mc, lift, pay, NULL));
  g_assert_cmpuint (mc.samples, ==, 4000);
  g_assert_cmpuint (mc.seed, ==, 99);

  n = finite_sorted (lift, 4000);
  g_assert_cmpuint (n, ==, mc.liftoff.n);
  g_assert_cmpfloat_with_epsilon (mc.infeasible_fraction, (4000.0 - n) / 4000.0, 1e-15);
  /* GSL sums in another order: 1e-12 relative. */
  g_assert_cmpfloat_with_epsilon (mc.liftoff.mean, gsl_stats_mean (lift, 1, n),
                                  1e-12 * mc.liftoff.mean);
  g_assert_cmpfloat_with_epsilon (mc.liftoff.sd, gsl_stats_sd (lift, 1, n), 1e-9 * mc.liftoff.sd);
  g_assert_cmpfloat_with_epsilon (mc.liftoff.p05,
                                  gsl_stats_quantile_from_sorted_data (lift, 1, n, 0.05),
                                  1e-12 * mc.liftoff.p05);
  g_assert_cmpfloat_with_epsilon (mc.liftoff.p50, gsl_stats_median_from_sorted_data (lift, 1, n),
                                  1e-12 * mc.liftoff.p50);
  g_assert_cmpfloat_with_epsilon (mc.liftoff.p95,
                                  gsl_stats_quantile_from_sorted_data (lift, 1, n, 0.95),
                                  1e-12 * mc.liftoff.p95);
  g_assert_cmpfloat (mc.liftoff.min, ==, lift[0]);
  g_assert_cmpfloat (mc.liftoff.max, ==, lift[n - 1]);
  /* The histogram: SW_MC_BINS equal bins from bin_lo to bin_hi, counted here. */
  g_assert_cmpfloat (mc.liftoff.bin_lo, <=, lift[0]);
  g_assert_cmpfloat (mc.liftoff.bin_hi, >=, lift[n - 1]);
  for (guint i = 0; i < n; i++)
    {
      double w = (mc.liftoff.bin_hi - mc.liftoff.bin_lo) / SW_MC_BINS;
      int b = (int) floor ((lift[i] - mc.liftoff.bin_lo) / w);
      bins[CLAMP (b, 0, SW_MC_BINS - 1)]++;
    }
  for (guint b = 0; b < SW_MC_BINS; b++)
    {
      /* A sample on a bin edge may fall either side by rounding. */
      g_assert_cmpint (abs ((int) bins[b] - (int) mc.liftoff.bins[b]), <=, 1);
      total += mc.liftoff.bins[b];
    }
  g_assert_cmpuint (total, ==, mc.liftoff.n);

  /* Question 2: payload short of the required one in what share of all
   * samples, and the reserve for 95 % = required - 5th percentile. */
  for (guint i = 0; i < 4000; i++)
    short_of += isfinite (pay[i]) && pay[i] < d->payload_kg;
  n = finite_sorted (pay, 4000);
  g_assert_cmpuint (n, ==, mc.payload.n);
  g_assert_cmpfloat_with_epsilon (mc.p_negative_margin, short_of / 4000.0, 1e-15);
  g_assert_cmpfloat_with_epsilon (mc.payload.p05,
                                  gsl_stats_quantile_from_sorted_data (pay, 1, n, 0.05), 1e-9);
  g_assert_cmpfloat_with_epsilon (mc.reserve_95_kg,
                                  d->payload_kg
                                    - gsl_stats_quantile_from_sorted_data (pay, 1, n, 0.05),
                                  1e-9);
  /* A reserve is needed for 95 %: the 5th percentile payload is short. */
  g_assert_cmpfloat (mc.reserve_95_kg, >, 0.0);
}

/* No spread: every sample is the nominal design. */
static void
test_no_spread (void)
{
  g_autoptr (SwDesign) d = load (design_json, NULL);
  SwUncertainty none;
  SwMonteCarlo mc;
  SwSizing s;

  sw_uncertainty_init (&none);
  g_assert_true (sw_size_design (d, &s, NULL));
  g_assert_true (sw_montecarlo_run (d, &none, 500, TRUE, 1, 2, &mc, NULL, NULL, NULL));
  g_assert_cmpfloat (fabs (mc.liftoff.mean / s.liftoff_mass_kg - 1.0), <, 1e-9);
  g_assert_cmpfloat (mc.liftoff.sd, <, 1e-6 * s.liftoff_mass_kg);
  g_assert_cmpfloat (fabs (mc.payload.mean - d->payload_kg), <, 1e-3);
  /* Nothing varies, so nothing can fall short: exactly zero, not a
   * rounding-noise share of the samples; no reserve is needed. */
  g_assert_cmpfloat (mc.infeasible_fraction, ==, 0.0);
  g_assert_cmpfloat (mc.p_negative_margin, ==, 0.0);
  g_assert_cmpfloat (fabs (mc.reserve_95_kg), <, 1e-3);
  g_assert_cmpfloat (mc.liftoff.p05, ==, mc.liftoff.p95);

  /* A spread of width zero is no spread, whatever its distribution. */
  none.isp.kind = SW_SPREAD_NORMAL;
  none.structural_coefficient.kind = SW_SPREAD_UNIFORM;
  none.losses.kind = SW_SPREAD_NORMAL;
  g_assert_false (sw_uncertainty_has_spread (&none));
  g_assert_true (sw_montecarlo_run (d, &none, 500, TRUE, 1, 2, &mc, NULL, NULL, NULL));
  g_assert_cmpfloat (mc.p_negative_margin, ==, 0.0);
  g_assert_cmpfloat (mc.liftoff.sd, <, 1e-6 * s.liftoff_mass_kg);
  none.structural_coefficient.width = 1e-3;
  g_assert_true (sw_uncertainty_has_spread (&none));
}

/* The band on the stage-count curve brackets the deterministic curve. */
static void
test_band (void)
{
  g_autoptr (SwDesign) d = load (design_json, NULL);
  SwMcBand band;

  g_assert_true (sw_montecarlo_band (d, NULL, 6, 1000, 3, 0, &band, NULL));
  g_assert_cmpuint (band.n_points, ==, 6);
  for (guint i = 0; i < band.n_points; i++)
    {
      SwStageSet set = { 0 };
      SwSizing s;
      double dv = 9300.0;

      sw_stage_set_extend (&set, d, i + 1);
      sw_size (&set, d->payload_kg, dv, SW_SPLIT_OPTIMAL, &s);
      if (!s.feasible || !isfinite (band.p95[i]))
        continue;
      g_assert_cmpfloat (band.p05[i], <, s.liftoff_mass_kg);
      g_assert_cmpfloat (band.p95[i], >, s.liftoff_mass_kg);
    }
  /* One stage cannot reach 9.3 km/s with these numbers: no band there. */
  g_assert_cmpfloat (band.feasible_fraction[0], ==, 0.0);
  g_assert_true (isnan (band.p50[0]));
}

static void
test_keys (void)
{
  g_autoptr (SwDesign) d = load (design_json, NULL);
  g_autoptr (SwDesign) again = NULL;
  g_autoptr (GError) error = NULL;
  g_autofree char *data = sw_design_to_data (d, NULL);
  const struct { const char *from, *to, *needle; } bad[] = {
    { "\"distribution\": \"normal\", \"sigma_percent\": 1.0",
      "\"distribution\": \"gaussian\", \"sigma_percent\": 1.0",
      "uncertainty.isp_vac.distribution: \"gaussian\" is not a distribution" },
    { "\"half_range_percent\": 8", "\"sigma_percent\": 8",
      "uncertainty.structural_coefficient.sigma_percent: does not belong to a uniform" },
    { "\"samples\": 4000", "\"samples\": 4000.5", "uncertainty.samples: 4000.5 is not a whole" },
    { "\"samples\": 4000", "\"samples\": 10", "uncertainty.samples: 10 is outside" },
    { "\"sigma_m_s\": 120", "\"sigma_m_s\": -1", "uncertainty.losses.sigma_m_s: -1 is outside" },
    { "\"sigma_percent\": 1.0 }", "\"sigma_percent\": 1.0, \"extra\": 2 }", NULL },
  };

  g_assert_true (d->uncertainty.present);
  g_assert_cmpint (d->uncertainty.isp.kind, ==, SW_SPREAD_NORMAL);
  g_assert_cmpint (d->uncertainty.structural_coefficient.kind, ==, SW_SPREAD_UNIFORM);
  g_assert_cmpfloat (d->uncertainty.losses.width, ==, 120.0);
  again = load (data, &error);
  g_assert_no_error (error);
  g_assert_true (sw_design_equal (d, again));

  for (guint i = 0; i < G_N_ELEMENTS (bad); i++)
    {
      g_autoptr (GString) json = g_string_new (design_json);
      g_autoptr (GError) e = NULL;
      g_autoptr (GPtrArray) warnings = g_ptr_array_new_with_free_func (g_free);
      g_autoptr (SwDesign) x = NULL;

      g_assert_cmpint (g_string_replace (json, bad[i].from, bad[i].to, 1), ==, 1);
      x = sw_design_load_data (json->str, -1, "mc.stagewright", warnings, &e);
      if (bad[i].needle == NULL)
        {
          /* An unknown key is a warning, not an error. */
          g_assert_no_error (e);
          g_assert_cmpuint (warnings->len, ==, 1);
          g_assert_nonnull (strstr (warnings->pdata[0], "uncertainty.isp_vac.extra"));
          continue;
        }
      g_assert_null (x);
      g_assert_nonnull (e);
      if (strstr (e->message, bad[i].needle) == NULL)
        g_error ("expected \"%s\" in: %s", bad[i].needle, e->message);
    }
}

/* A live cancellable changes nothing; a cancelled one stops the run with
 * G_IO_ERROR_CANCELLED instead of an answer (the solver thread relies on it
 * to drop a run that a newer edit has made stale). */
static gboolean
cancel_soon_cb (gpointer data)
{
  g_cancellable_cancel (data);
  return G_SOURCE_REMOVE;
}

static gpointer
cancel_thread (gpointer data)
{
  g_usleep (20000);
  cancel_soon_cb (data);
  return NULL;
}

static void
test_cancellable (void)
{
  g_autoptr (SwDesign) d = load (design_json, NULL);
  g_autoptr (GCancellable) live = g_cancellable_new ();
  g_autoptr (GCancellable) dead = g_cancellable_new ();
  g_autoptr (GCancellable) later = g_cancellable_new ();
  g_autoptr (GError) error = NULL;
  SwMonteCarlo a, b, c;
  SwMcBand band;
  GThread *canceller;

  g_assert_true (sw_montecarlo_run (d, NULL, 3000, TRUE, 7, 2, &a, NULL, NULL, NULL));
  g_assert_true (sw_montecarlo_run_cancellable (d, NULL, 3000, TRUE, 7, 2, &b, NULL, NULL,
                                                live, NULL));
  g_assert_cmpmem (&a.liftoff, sizeof a.liftoff, &b.liftoff, sizeof b.liftoff);

  g_cancellable_cancel (dead);
  g_assert_false (sw_montecarlo_run_cancellable (d, NULL, 3000, TRUE, 7, 2, &c, NULL, NULL,
                                                 dead, &error));
  g_assert_error (error, G_IO_ERROR, G_IO_ERROR_CANCELLED);
  g_clear_error (&error);
  g_assert_false (sw_montecarlo_band_cancellable (d, NULL, 8, 2000, 7, 2, &band, dead, &error));
  g_assert_error (error, G_IO_ERROR, G_IO_ERROR_CANCELLED);
  g_clear_error (&error);

  /* Cancelled from another thread part way through a run of ten million
   * samples (tens of seconds if it ran to the end). */
  canceller = g_thread_new ("canceller", cancel_thread, later);
  g_assert_false (sw_montecarlo_run_cancellable (d, NULL, 10000000, TRUE, 7, 2, &c, NULL, NULL,
                                                 later, &error));
  g_assert_error (error, G_IO_ERROR, G_IO_ERROR_CANCELLED);
  g_thread_join (canceller);
}

/* Two stages and four strap-ons (invented; the shape of the demo
 * four-booster-cargo); %s is the boosters' fixed load or nothing. */
static const char *booster_json =
  "{ \"format\": \"stagewright-design\", \"version\": 2, \"name\": \"mc boosters\",\n"
  "  \"payload_kg\": 6000, \"mission\": { \"delta_v_m_s\": 9300 }, \"split\": \"optimal\",\n"
  "  \"stages\": [\n"
  "    { \"isp_vac_s\": 320, \"structural_coefficient\": 0.07, \"thrust_vac_kn\": 1300 },\n"
  "    { \"isp_vac_s\": 345, \"structural_coefficient\": 0.09 } ],\n"
  "  \"boosters\": { \"count\": 4, \"isp_vac_s\": 275, \"structural_coefficient\": 0.11,\n"
  "                  \"thrust_vac_kn\": 800%s },\n"
  "  \"uncertainty\": { \"seed\": 7,\n"
  "    \"isp_vac\": { \"distribution\": \"normal\", \"sigma_percent\": 0.2 },\n"
  "    \"structural_coefficient\": { \"distribution\": \"uniform\", \"half_range_percent\": 2 },\n"
  "    \"losses\": { \"distribution\": \"normal\", \"sigma_m_s\": 20 } } }";

static SwDesign *
booster_design (gboolean fixed_boosters)
{
  g_autofree char *json = g_strdup_printf (booster_json,
                                           fixed_boosters ? ", \"propellant_kg\": 30000" : "");
  g_autoptr (GError) error = NULL;
  SwDesign *d = load (json, &error);

  g_assert_no_error (error);
  return d;
}

/* Boosters with a fixed load: the samples re-size the phased vehicle (the
 * boosters kept).  Small spreads: the mean liftoff mass lies near the
 * nominal, the payload of the built vehicle near the required one, and the
 * spread agrees with first-order propagation through the sensitivity
 * table's derivatives (the boosters' Isp and structure included). */
static void
test_boosters_fixed (void)
{
  g_autoptr (SwDesign) d = booster_design (TRUE);
  const guint n = 4000;
  SwSensitivityTable t;
  SwMonteCarlo mc, two;
  double var = 0.0, se;

  g_assert_true (sw_sensitivity_compute (d, 0.05, &t, NULL));
  g_assert_true (t.feasible);
  for (guint i = 0; i < t.n_items; i++)
    {
      const SwSensitivity *it = &t.items[i];
      double u = 0.0;

      if (it->param == SW_SENS_ISP || it->param == SW_SENS_BOOSTER_ISP)
        u = it->value * 0.002;
      else if (it->param == SW_SENS_STRUCTURAL_COEFFICIENT
               || it->param == SW_SENS_BOOSTER_STRUCTURAL_COEFFICIENT)
        u = it->value * 0.02 / sqrt (3.0);
      else if (it->param == SW_SENS_DELTA_V)
        u = 20.0;
      var += pow (it->derivative * u, 2);
    }
  g_assert_true (sw_montecarlo_run (d, NULL, n, TRUE, 7, 0, &mc, NULL, NULL, NULL));
  g_assert_true (mc.nominal_feasible);
  g_assert_cmpfloat (mc.infeasible_fraction, ==, 0.0);
  g_assert_cmpfloat (mc.nominal_liftoff_kg, ==, t.liftoff_mass_kg);
  se = mc.liftoff.sd / sqrt (n);
  g_test_message ("boosters fixed: mean - nominal = %.4g kg (standard error %.3g kg); "
                  "sd / propagated - 1 = %.3g", mc.liftoff.mean - mc.nominal_liftoff_kg, se,
                  mc.liftoff.sd / sqrt (var) - 1.0);
  /* Four standard errors, plus the second-order bias: below 1e-4 of the
   * mass at these spreads (the curvature measured by the tornado). */
  g_assert_cmpfloat (fabs (mc.liftoff.mean - mc.nominal_liftoff_kg), <,
                     4.0 * se + 1e-4 * mc.nominal_liftoff_kg);
  /* The sample sd's relative standard error is 1/sqrt(2 (N - 1)), 1.1 % at
   * N = 4000 (common practice): three of them. */
  g_assert_cmpfloat (fabs (mc.liftoff.sd / sqrt (var) - 1.0), <, 3.0 / sqrt (2.0 * (n - 1)));
  /* Question 2: the vehicle as built carries about the required payload on
   * average and falls short about half of the time. */
  g_assert_cmpuint (mc.payload.n, ==, n);
  g_assert_cmpfloat (fabs (mc.payload.mean - d->payload_kg), <,
                     4.0 * mc.payload.sd / sqrt (n) + 1e-3 * d->payload_kg);
  g_assert_cmpfloat (mc.p_negative_margin, >, 0.4);
  g_assert_cmpfloat (mc.p_negative_margin, <, 0.6);
  /* The thread count changes nothing. */
  g_assert_true (sw_montecarlo_run (d, NULL, 600, TRUE, 7, 1, &mc, NULL, NULL, NULL));
  g_assert_true (sw_montecarlo_run (d, NULL, 600, TRUE, 7, 2, &two, NULL, NULL, NULL));
  g_assert_cmpmem (&mc.liftoff, sizeof mc.liftoff, &two.liftoff, sizeof two.liftoff);
  g_assert_cmpmem (&mc.payload, sizeof mc.payload, &two.payload, sizeof two.payload);
}

/* Sized boosters: their load is re-optimised per sample (a few hundred
 * samples: each is an optimisation).  The mean lies near the nominal. */
static void
test_boosters_sized (void)
{
  g_autoptr (SwDesign) d = booster_design (FALSE);
  const guint n = 200;
  SwMonteCarlo mc;
  SwSizing s;

  g_assert_true (sw_size_design (d, &s, NULL));
  g_assert_true (s.feasible && s.boosters.present && !s.boosters.fixed);
  g_assert_true (sw_montecarlo_run (d, NULL, n, TRUE, 7, 0, &mc, NULL, NULL, NULL));
  g_assert_cmpfloat (mc.nominal_liftoff_kg, ==, s.liftoff_mass_kg);
  g_assert_cmpuint (mc.liftoff.n, ==, n);
  g_test_message ("boosters sized: mean - nominal = %.4g kg, sd %.4g kg",
                  mc.liftoff.mean - mc.nominal_liftoff_kg, mc.liftoff.sd);
  g_assert_cmpfloat (mc.liftoff.sd, >, 0.0);
  g_assert_cmpfloat (fabs (mc.liftoff.mean - mc.nominal_liftoff_kg), <,
                     4.0 * mc.liftoff.sd / sqrt (n) + 1e-4 * mc.nominal_liftoff_kg);
  g_assert_cmpfloat (fabs (mc.payload.mean - d->payload_kg), <,
                     4.0 * mc.payload.sd / sqrt (n) + 1e-3 * d->payload_kg);
}


/* ---- fixed propellant loads: every sample recomputed by hand ------------ */

/* Three stages on a delta-v mission (no fairing); the fixed load keys of
 * the three stages follow. */
static const char *fixed_json =
  "{ \"format\": \"stagewright-design\", \"version\": 2, \"name\": \"mc fixed\",\n"
  "  \"payload_kg\": %s, \"mission\": { \"delta_v_m_s\": 9000 }, \"split\": \"optimal\",\n"
  "  \"stages\": [\n"
  "    { \"isp_vac_s\": 300, \"structural_coefficient\": 0.08%s },\n"
  "    { \"isp_vac_s\": 330, \"structural_coefficient\": 0.10%s },\n"
  "    { \"isp_vac_s\": 345, \"structural_coefficient\": 0.12%s } ],\n"
  "  \"uncertainty\": { \"seed\": 31,\n"
  "    \"isp_vac\": { \"distribution\": \"normal\", \"sigma_percent\": 1.0 },\n"
  "    \"structural_coefficient\": { \"distribution\": \"uniform\", \"half_range_percent\": 6 },\n"
  "    \"losses\": { \"distribution\": \"normal\", \"sigma_m_s\": 100 } } }";

static SwDesign *
fixed_design (const char *payload, const char *one, const char *two, const char *three)
{
  g_autofree char *json = g_strdup_printf (fixed_json, payload, one, two, three);
  g_autoptr (GError) error = NULL;
  SwDesign *d = load (json, &error);

  g_assert_no_error (error);
  return d;
}

/* The inputs of sample @index: the same generator and stream seed as the
 * core (blocks of SW_MC_BLOCK samples, each from sw_uncertainty_stream_seed
 * of its block), drawn in the documented order (each stage's Isp, then its
 * structural coefficient; then the losses, drawn again while the delta-v is
 * not positive). */
static void
draw_sample (const SwDesign *d, guint32 seed, guint index, double *c, double *eps, double *dv,
             double *booster_c, double *booster_eps)
{
  gsl_rng *r = gsl_rng_alloc (gsl_rng_mt19937);
  const SwUncertainty *u = &d->uncertainty;
  double nominal_dv;

  g_assert_true (sw_design_required_delta_v (d, &nominal_dv, NULL));
  gsl_rng_set (r, sw_uncertainty_stream_seed (seed, index / SW_MC_BLOCK));
  for (guint k = 0; k <= index % SW_MC_BLOCK; k++)
    {
      for (guint i = 0; i < d->n_stages; i++)
        {
          double c0 = d->stages[i].isp_vac_s * SW_G0;

          c[i] = sw_spread_draw_scaled (r, &u->isp, c0, 0.05 * c0, INFINITY);
          eps[i] = sw_spread_draw_scaled (r, &u->structural_coefficient,
                                          d->stages[i].structural_coefficient, 1e-4, 0.95);
        }
      /* The boosters' two after the stages' (sw-montecarlo.h). */
      if (d->boosters.count > 0)
        {
          double c0 = d->boosters.isp_vac_s * SW_G0;

          *booster_c = sw_spread_draw_scaled (r, &u->isp, c0, 0.05 * c0, INFINITY);
          *booster_eps = sw_spread_draw_scaled (r, &u->structural_coefficient,
                                                d->boosters.structural_coefficient, 1e-4, 0.95);
        }
      *dv = nominal_dv;
      for (int tries = 0; tries < 64; tries++)
        {
          double x = nominal_dv + sw_spread_draw (r, &u->losses);
          if (x > 0.0)
            {
              *dv = x;
              break;
            }
        }
    }
  gsl_rng_free (r);
}

/* The rocket equation summed by hand over stages of loads @prop (structure
 * prop eps / (1 - eps)) with @payload on top. */
static double
hand_delta_v (guint n, const double *c, const double *eps, const double *prop, double payload)
{
  double above = payload, dv = 0.0;

  for (int i = (int) n - 1; i >= 0; i--)
    {
      double mf = above + prop[i] * eps[i] / (1.0 - eps[i]);

      dv += c[i] * log ((mf + prop[i]) / mf);
      above = mf + prop[i];
    }
  return dv;
}

/* The payload at which that vehicle gives @dv, by bisection (NAN when even
 * a payload of zero falls short). */
static double
hand_capability (guint n, const double *c, const double *eps, const double *prop, double dv)
{
  double lo = 0.0, hi = 1e3;

  if (hand_delta_v (n, c, eps, prop, 0.0) < dv)
    return NAN;
  while (hand_delta_v (n, c, eps, prop, hi) > dv)
    hi *= 2.0;
  for (int k = 0; k < 200 && hi - lo > 1e-11 * hi; k++)
    {
      double mid = 0.5 * (lo + hi);
      if (hand_delta_v (n, c, eps, prop, mid) > dv)
        lo = mid;
      else
        hi = mid;
    }
  return 0.5 * (lo + hi);
}

/* Mean and percentiles of the finite values of @v against a summary. */
static void
assert_summary_matches (const double *v, guint n, const SwMcSummary *s, double tol)
{
  g_autofree double *w = g_new (double, n);
  guint k = 0;

  for (guint i = 0; i < n; i++)
    if (isfinite (v[i]))
      w[k++] = v[i];
  g_assert_cmpuint (s->n, ==, k);
  g_assert_cmpuint (k, >, 1);
  gsl_sort (w, 1, k);
  g_assert_cmpfloat (fabs (s->mean - gsl_stats_mean (w, 1, k)), <, tol);
  g_assert_cmpfloat (fabs (s->p05 - gsl_stats_quantile_from_sorted_data (w, 1, k, 0.05)), <, tol);
  g_assert_cmpfloat (fabs (s->p50 - gsl_stats_quantile_from_sorted_data (w, 1, k, 0.50)), <, tol);
  g_assert_cmpfloat (fabs (s->p95 - gsl_stats_quantile_from_sorted_data (w, 1, k, 0.95)), <, tol);
}

/* A fixed top stage: each sample's liftoff mass is the sizing of the design
 * edited to the sample's inputs (sw_size_design, the fixed stage keeping its
 * load), each sample's payload of the built vehicle the hand bisection on
 * the rocket equation; the run's mean and percentiles are those of the
 * recomputed samples.  600 samples over three blocks, two threads. */
static void
test_fixed_stage_by_hand (void)
{
  g_autoptr (SwDesign) d = fixed_design ("1500", "", "", ", \"propellant_kg\": 9000");
  const guint n = 600;
  const guint32 seed = 31;
  g_autofree double *liftoff = g_new (double, n), *payload = g_new (double, n);
  g_autofree double *l_hand = g_new (double, n), *p_hand = g_new (double, n);
  SwMonteCarlo mc;
  SwSizing nominal;
  double prop[SW_MAX_STAGES];
  guint short_of = 0;

  g_assert_true (sw_size_design (d, &nominal, NULL));
  g_assert_true (nominal.feasible);
  for (guint i = 0; i < d->n_stages; i++)
    prop[i] = nominal.stages[i].propellant_mass_kg;
  g_assert_true (sw_montecarlo_run (d, NULL, n, TRUE, seed, 2, &mc, liftoff, payload, NULL));
  g_assert_false (mc.all_fixed);
  g_assert_cmpuint (mc.margin.n, ==, 0);
  for (guint k = 0; k < n; k++)
    {
      g_autoptr (SwDesign) e = sw_design_copy (d);
      double c[SW_MAX_STAGES], eps[SW_MAX_STAGES], dv;
      SwSizing s;

      draw_sample (d, seed, k, c, eps, &dv, NULL, NULL);
      for (guint i = 0; i < d->n_stages; i++)
        {
          e->stages[i].isp_vac_s = c[i] / SW_G0;
          e->stages[i].structural_coefficient = eps[i];
        }
      e->mission.delta_v_m_s = dv;
      g_assert_true (sw_size_design (e, &s, NULL));
      l_hand[k] = s.feasible ? s.liftoff_mass_kg : NAN;
      if (s.feasible)
        g_assert_cmpfloat (s.stages[2].propellant_mass_kg, ==, 9000.0);
      p_hand[k] = hand_capability (d->n_stages, c, eps, prop, dv);
      g_assert_cmpint (isfinite (liftoff[k]), ==, isfinite (l_hand[k]));
      if (isfinite (l_hand[k]))
        g_assert_cmpfloat (fabs (liftoff[k] - l_hand[k]), <, 1e-7 * l_hand[k]);
      g_assert_cmpfloat (fabs (payload[k] - p_hand[k]), <, 1e-6 * d->payload_kg);
      short_of += !(p_hand[k] >= d->payload_kg);
    }
  assert_summary_matches (l_hand, n, &mc.liftoff, 1e-7 * nominal.liftoff_mass_kg);
  assert_summary_matches (p_hand, n, &mc.payload, 1e-6 * d->payload_kg);
  g_assert_cmpfloat (fabs (mc.p_negative_margin - (double) short_of / n), <=, 1.0 / n);
  /* The spreads move the liftoff mass (not a constant test). */
  g_assert_cmpfloat (mc.liftoff.sd, >, 1e-3 * mc.liftoff.mean);
}

/* Every load fixed: the liftoff mass is one number, so the outputs are the
 * payload capability (hand bisection on the rocket equation at the sampled
 * inputs) and the delta-v margin at the nominal payload (the hand rocket
 * equation less the sampled requirement), whether or not the nominal
 * payload fits; the run's means and percentiles are the recomputed ones,
 * and the chance that the payload fits is the share of positive margins. */
static void
test_all_fixed_by_hand (void)
{
  for (int heavy = 0; heavy < 2; heavy++)
    {
      /* 6,931 kg is the nominal capability (test-sensitivity's bisection):
       * 6,500 kg fits mostly, 7,200 kg mostly not. */
      g_autoptr (SwDesign) d = fixed_design (heavy ? "7200" : "6500",
                                             ", \"propellant_kg\": 150000",
                                             ", \"propellant_kg\": 30000",
                                             ", \"propellant_kg\": 9000");
      const guint n = 600;
      const guint32 seed = 5;
      g_autofree double *payload = g_new (double, n), *margin = g_new (double, n);
      g_autofree double *p_hand = g_new (double, n), *m_hand = g_new (double, n);
      double prop[3] = { 150000, 30000, 9000 }, c0[3], eps0[3], dv0;
      SwMonteCarlo mc;
      guint negative = 0;

      g_assert_true (sw_design_required_delta_v (d, &dv0, NULL));
      for (guint i = 0; i < 3; i++)
        {
          c0[i] = d->stages[i].isp_vac_s * SW_G0;
          eps0[i] = d->stages[i].structural_coefficient;
        }
      g_assert_true (sw_montecarlo_run_margins (d, NULL, n, TRUE, seed, 2, &mc, NULL, payload,
                                                margin, NULL));
      g_assert_true (mc.all_fixed);
      g_assert_cmpfloat (fabs (mc.nominal_capability_kg
                               - hand_capability (3, c0, eps0, prop, dv0)), <, 1e-6 * 7000);
      g_assert_cmpfloat (fabs (mc.nominal_margin_m_s
                               - (hand_delta_v (3, c0, eps0, prop, d->payload_kg) - dv0)), <,
                         1e-6);
      for (guint k = 0; k < n; k++)
        {
          double c[SW_MAX_STAGES], eps[SW_MAX_STAGES], dv;

          draw_sample (d, seed, k, c, eps, &dv, NULL, NULL);
          p_hand[k] = hand_capability (3, c, eps, prop, dv);
          m_hand[k] = hand_delta_v (3, c, eps, prop, d->payload_kg) - dv;
          g_assert_cmpfloat (fabs (payload[k] - p_hand[k]), <, 1e-6 * d->payload_kg);
          g_assert_cmpfloat (fabs (margin[k] - m_hand[k]), <, 1e-6);
          negative += m_hand[k] < 0.0;
          /* The payload fits exactly when the margin is not negative. */
          g_assert_cmpint (m_hand[k] >= 0.0, ==, p_hand[k] >= d->payload_kg);
        }
      assert_summary_matches (p_hand, n, &mc.payload, 1e-6 * d->payload_kg);
      assert_summary_matches (m_hand, n, &mc.margin, 1e-6);
      g_test_message ("payload %.0f kg: capability mean %.1f kg, margin mean %.1f m/s, "
                      "P(fits) %.3f", d->payload_kg, mc.payload.mean, mc.margin.mean,
                      1.0 - mc.p_negative_margin);
      g_assert_cmpfloat (fabs (mc.p_negative_margin - (double) negative / n), <=, 0.5 / n);
      /* Not a constant test: the spreads move both outputs, and the two
       * payloads sit on either side of the median capability. */
      g_assert_cmpfloat (mc.margin.sd, >, 10.0);
      if (heavy)
        g_assert_cmpfloat (mc.p_negative_margin, >, 0.5);
      else
        g_assert_cmpfloat (mc.p_negative_margin, <, 0.5);
    }
}

/* Every load fixed, with boosters: each sample's payload capability is the
 * payload capability (sw_design_performance, the phases' own root) of the
 * design edited to the sample's inputs, and the delta-v margin at the
 * nominal payload is not negative exactly when that capability reaches the
 * nominal payload. */
static void
test_all_fixed_boosters_by_hand (void)
{
  g_autofree char *json = g_strdup_printf (booster_json, ", \"propellant_kg\": 30000");
  g_autoptr (SwDesign) d = load (json, NULL);
  const guint n = 300;
  const guint32 seed = 11;
  g_autofree double *payload = g_new (double, n), *margin = g_new (double, n);
  g_autofree double *p_hand = g_new (double, n);
  SwMonteCarlo mc;

  g_assert_nonnull (d);
  d->stages[0].propellant.has_propellant_kg = TRUE;
  d->stages[0].propellant.propellant_kg = 90000.0;
  d->stages[1].propellant.has_propellant_kg = TRUE;
  d->stages[1].propellant.propellant_kg = 20000.0;
  /* Near the nominal capability (about 7,200 kg), so that both sides of
   * "fits" are sampled. */
  d->payload_kg = 7200.0;
  g_assert_true (sw_montecarlo_run_margins (d, NULL, n, TRUE, seed, 2, &mc, NULL, payload,
                                            margin, NULL));
  g_assert_true (mc.all_fixed);
  for (guint k = 0; k < n; k++)
    {
      g_autoptr (SwDesign) e = sw_design_copy (d);
      double c[SW_MAX_STAGES], eps[SW_MAX_STAGES], dv, bc = NAN, beps = NAN;
      SwPerformance perf;

      draw_sample (d, seed, k, c, eps, &dv, &bc, &beps);
      for (guint i = 0; i < d->n_stages; i++)
        {
          e->stages[i].isp_vac_s = c[i] / SW_G0;
          e->stages[i].structural_coefficient = eps[i];
        }
      e->boosters.isp_vac_s = bc / SW_G0;
      e->boosters.structural_coefficient = beps;
      e->mission.delta_v_m_s = dv;
      g_assert_true (sw_design_performance (e, &perf, NULL));
      p_hand[k] = perf.reachable ? perf.payload_kg : NAN;
      g_assert_cmpint (isfinite (payload[k]), ==, isfinite (p_hand[k]));
      if (isfinite (p_hand[k]))
        g_assert_cmpfloat (fabs (payload[k] - p_hand[k]), <, 1e-6 * d->payload_kg);
      g_assert_cmpint (margin[k] >= 0.0, ==, p_hand[k] >= d->payload_kg);
    }
  assert_summary_matches (p_hand, n, &mc.payload, 1e-6 * d->payload_kg);
  g_test_message ("boosters fixed: capability mean %.1f kg, margin mean %.2f m/s, P(fits) %.3f",
                  mc.payload.mean, mc.margin.mean, 1.0 - mc.p_negative_margin);
  g_assert_cmpfloat (mc.payload.sd, >, 0.0);
  g_assert_cmpfloat (mc.p_negative_margin, >, 0.05);
  g_assert_cmpfloat (mc.p_negative_margin, <, 0.95);
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  /* The cancellable test waits on a thread: a hang fails within a minute. */
  alarm (60);
  g_test_add_func ("/core/montecarlo/same-seed-any-threads", test_same_seed_any_threads);
  g_test_add_func ("/core/montecarlo/mean-near-linear", test_mean_near_linear);
  g_test_add_func ("/core/montecarlo/sd-propagation", test_sd_against_propagation);
  g_test_add_func ("/core/montecarlo/summary", test_summary);
  g_test_add_func ("/core/montecarlo/no-spread", test_no_spread);
  g_test_add_func ("/core/montecarlo/band", test_band);
  g_test_add_func ("/core/montecarlo/keys", test_keys);
  g_test_add_func ("/core/montecarlo/cancellable", test_cancellable);
  g_test_add_func ("/core/montecarlo/boosters-fixed", test_boosters_fixed);
  g_test_add_func ("/core/montecarlo/boosters-sized", test_boosters_sized);
  g_test_add_func ("/core/montecarlo/fixed-stage-by-hand", test_fixed_stage_by_hand);
  g_test_add_func ("/core/montecarlo/all-fixed-by-hand", test_all_fixed_by_hand);
  g_test_add_func ("/core/montecarlo/all-fixed-boosters-by-hand",
                   test_all_fixed_boosters_by_hand);
  return g_test_run ();
}
