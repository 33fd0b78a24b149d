/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-montecarlo"

#include "config.h"

#include "sw-montecarlo.h"

#include "sw-booster-sizing.h"
#include "sw-fixed-vehicle.h"
#include "sw-phases.h"
#include "sw-sizing.h"

#include <glib/gi18n-lib.h>
#include <gsl/gsl_histogram.h>
#include <gsl/gsl_randist.h>
#include <gsl/gsl_rng.h>
#include <gsl/gsl_sort.h>
#include <gsl/gsl_statistics_double.h>
#include <math.h>
#include <string.h>

typedef struct {
  SwStageSet     set;          /* nominal stages of the vehicle sampled */
  SwSplitMode    split;
  double         payload_kg;
  double         delta_v_m_s;
  SwUncertainty  unc;
  gboolean       have_vehicle;
  SwFixedVehicle vehicle;      /* nominal propellant loads (question 2) */
  /* A design with strap-on boosters: each sample re-sizes the phased
   * vehicle (sized boosters re-optimised, fixed ones kept). */
  gboolean       parallel;
  SwParallelVehicle pv;
  SwParallelVehicle pv_fixed;  /* every load at its nominal value (question 2) */
  /* A serial design with a fixed load: question 1 through sw_size_with_fixed. */
  gboolean       has_fixed;
  double         fixed_kg[SW_MAX_STAGES];
  /* Every load fixed: question 2 and the margin from the design's loads. */
  gboolean       all_fixed;
  SwParallelVehicle pv_all;
  double        *margin;       /* per sample when all_fixed, else NULL */
  guint          samples;
  guint32        seed;
  double        *liftoff;      /* per sample, NAN when infeasible */
  double        *payload;      /* per sample, or NULL to skip question 2 */
  gint           next_block;   /* atomic */
  GCancellable  *cancellable;  /* may be NULL */
} McJob;

static void
run_sample (const McJob *job, gsl_rng *r, guint index)
{
  SwStageSet s = job->set;
  double dvs[SW_MAX_STAGES], dv = job->delta_v_m_s, m = NAN;
  double booster_c = NAN, booster_eps = NAN;
  gboolean ok = TRUE;

  for (guint i = 0; i < s.n_stages; i++)
    {
      double c = job->set.exhaust_velocity_m_s[i];
      s.exhaust_velocity_m_s[i] = sw_spread_draw_scaled (r, &job->unc.isp, c, 0.05 * c, INFINITY);
      s.structural_coefficient[i] = sw_spread_draw_scaled (r, &job->unc.structural_coefficient,
                                                 job->set.structural_coefficient[i], 1e-4,
                                                 0.95);
    }
  /* The boosters' draws come after the stages' so that a serial design
   * draws the same numbers as before. */
  if (job->parallel)
    {
      double c = job->pv.booster_exhaust_velocity_m_s;
      booster_c = sw_spread_draw_scaled (r, &job->unc.isp, c, 0.05 * c, INFINITY);
      booster_eps = sw_spread_draw_scaled (r, &job->unc.structural_coefficient,
                                           job->pv.booster_structural_coefficient, 1e-4, 0.95);
    }
  for (int tries = 0; tries < 64; tries++)
    {
      double d = dv + sw_spread_draw (r, &job->unc.losses);
      if (d > 0.0)
        {
          dv = d;
          break;
        }
    }

  if (job->all_fixed && job->payload != NULL)
    {
      SwParallelVehicle w = job->pv_all;

      w.set.n_stages = s.n_stages;
      for (guint i = 0; i < s.n_stages; i++)
        {
          w.set.exhaust_velocity_m_s[i] = s.exhaust_velocity_m_s[i];
          w.set.structural_coefficient[i] = s.structural_coefficient[i];
        }
      if (job->parallel)
        {
          w.booster_exhaust_velocity_m_s = booster_c;
          w.booster_structural_coefficient = booster_eps;
        }
      job->payload[index] = sw_fixed_loads_payload (&w, dv);
      if (job->margin != NULL)
        job->margin[index] = sw_fixed_loads_delta_v (&w, job->payload_kg) - dv;
    }

  if (job->parallel)
    {
      SwParallelVehicle w = job->pv;
      SwSizing sizing;

      w.set = s;
      w.booster_exhaust_velocity_m_s = booster_c;
      w.booster_structural_coefficient = booster_eps;
      sw_size_parallel (&w, job->payload_kg, dv, job->split, &sizing);
      job->liftoff[index] = sizing.feasible ? sizing.liftoff_mass_kg : NAN;
      if (job->payload != NULL && !job->all_fixed)
        {
          double p = NAN;

          w = job->pv_fixed;
          for (guint i = 0; i < s.n_stages; i++)
            {
              w.set.exhaust_velocity_m_s[i] = s.exhaust_velocity_m_s[i];
              w.set.structural_coefficient[i] = s.structural_coefficient[i];
            }
          w.booster_exhaust_velocity_m_s = booster_c;
          w.booster_structural_coefficient = booster_eps;
          if (!sw_parallel_payload (&w, dv, &p, NULL))
            p = NAN;
          job->payload[index] = p;
        }
      return;
    }

  if (job->has_fixed)
    {
      SwSizing sizing;

      sw_size_with_fixed (&s, job->fixed_kg, job->payload_kg, dv, job->split, &sizing);
      m = sizing.feasible ? sizing.liftoff_mass_kg : NAN;
    }
  else
    switch (job->split)
      {
      case SW_SPLIT_EQUAL:
        for (guint i = 0; i < s.n_stages; i++)
          dvs[i] = dv / s.n_stages;
        break;
      case SW_SPLIT_MANUAL:
        for (guint i = 0; i < s.n_stages; i++)
          dvs[i] = s.share[i] * dv;
        break;
      case SW_SPLIT_OPTIMAL:
      default:
        ok = sw_optimal_split (&s, dv, dvs, NULL);
        break;
      }
  if (ok && !job->has_fixed)
    m = sw_liftoff_mass_for_split (&s, job->payload_kg, dvs);
  job->liftoff[index] = isfinite (m) ? m : NAN;

  if (job->payload != NULL && !job->all_fixed)
    {
      SwFixedVehicle v = job->vehicle;
      double p = NAN;

      for (guint i = 0; i < v.n_stages; i++)
        {
          double eps = s.structural_coefficient[i];
          v.exhaust_velocity_m_s[i] = s.exhaust_velocity_m_s[i];
          if (v.propellant_mass_kg[i] > 0.0)
            v.structural_mass_kg[i] = v.propellant_mass_kg[i] * eps / (1.0 - eps);
        }
      if (!sw_fixed_vehicle_payload (&v, dv, &p))
        p = NAN;
      job->payload[index] = p;
    }
}

static gpointer
worker (gpointer data)
{
  McJob *job = data;
  gsl_rng *r = gsl_rng_alloc (gsl_rng_mt19937);
  guint n_blocks = (job->samples + SW_MC_BLOCK - 1) / SW_MC_BLOCK;

  for (;;)
    {
      guint block = (guint) g_atomic_int_add (&job->next_block, 1);
      guint first, last;

      if (block >= n_blocks || g_cancellable_is_cancelled (job->cancellable))
        break;
      gsl_rng_set (r, sw_uncertainty_stream_seed (job->seed, (guint64) block));
      first = block * SW_MC_BLOCK;
      last = MIN (first + SW_MC_BLOCK, job->samples);
      for (guint i = first; i < last; i++)
        {
          /* A phased sample takes milliseconds: a newer edit should not
           * wait for the rest of the block. */
          if (job->parallel && g_cancellable_is_cancelled (job->cancellable))
            break;
          run_sample (job, r, i);
        }
    }
  gsl_rng_free (r);
  return NULL;
}

static guint
run_job (McJob *job, guint threads)
{
  guint n_blocks = (job->samples + SW_MC_BLOCK - 1) / SW_MC_BLOCK;
  GThread *pool[64];

  if (threads == 0)
    threads = g_get_num_processors ();
  threads = CLAMP (threads, 1, MIN (64, n_blocks));
  job->next_block = 0;
  if (threads == 1)
    {
      worker (job);
      return 1;
    }
  for (guint t = 0; t < threads; t++)
    pool[t] = g_thread_new ("sw-montecarlo", worker, job);
  for (guint t = 0; t < threads; t++)
    g_thread_join (pool[t]);
  return threads;
}

void
sw_mc_summarise (const double *values, guint n, SwMcSummary *out)
{
  g_autofree double *v = g_new (double, MAX (n, 1));
  gsl_histogram *h;
  guint k = 0;
  double lo, hi;

  memset (out, 0, sizeof *out);
  out->mean = out->sd = out->p05 = out->p50 = out->p95 = NAN;
  out->min = out->max = out->bin_lo = out->bin_hi = NAN;
  for (guint i = 0; i < n; i++)
    if (isfinite (values[i]))
      v[k++] = values[i];
  out->n = k;
  if (k == 0)
    return;

  gsl_sort (v, 1, k);
  out->mean = gsl_stats_mean (v, 1, k);
  out->sd = k > 1 ? gsl_stats_sd_m (v, 1, k, out->mean) : 0.0;
  out->p05 = gsl_stats_quantile_from_sorted_data (v, 1, k, 0.05);
  out->p50 = gsl_stats_quantile_from_sorted_data (v, 1, k, 0.50);
  out->p95 = gsl_stats_quantile_from_sorted_data (v, 1, k, 0.95);
  out->min = v[0];
  out->max = v[k - 1];

  /* Equal bins from the smallest to the largest sample; the top edge is
   * nudged up so the largest sample falls into the last bin. */
  lo = v[0];
  hi = v[k - 1];
  if (!(hi > lo))
    {
      double w = MAX (fabs (lo) * 1e-6, 1e-9);
      lo -= w;
      hi += w;
    }
  hi += (hi - lo) * 1e-9;
  h = gsl_histogram_alloc (SW_MC_BINS);
  gsl_histogram_set_ranges_uniform (h, lo, hi);
  for (guint i = 0; i < k; i++)
    gsl_histogram_increment (h, v[i]);
  for (guint b = 0; b < SW_MC_BINS; b++)
    out->bins[b] = (guint) gsl_histogram_get (h, b);
  out->bin_lo = lo;
  out->bin_hi = hi;
  gsl_histogram_free (h);
}

static gboolean
prepare (const SwDesign *design, const SwUncertainty *spreads, gboolean band, McJob *job,
         SwSizing *sizing, GError **error)
{
  memset (job, 0, sizeof *job);
  if (!sw_size_design (design, sizing, error))
    return FALSE;
  if (design->boosters.count > 0 && !band)
    {
      if (!sw_parallel_vehicle_from_design (&job->pv, design, error))
        return FALSE;
      job->parallel = TRUE;
    }
  sw_stage_set_from_design (&job->set, design);
  /* The band is the stage-count curve's, which sizes every stage. */
  for (guint i = 0; !band && !job->parallel && i < design->n_stages; i++)
    if (design->stages[i].propellant.has_propellant_kg)
      {
        job->has_fixed = TRUE;
        job->fixed_kg[i] = design->stages[i].propellant.propellant_kg;
      }
  if (!band && sw_design_all_fixed (design))
    {
      if (!sw_parallel_vehicle_from_design (&job->pv_all, design, error))
        return FALSE;
      job->all_fixed = TRUE;
    }
  job->split = design->split;
  job->payload_kg = design->payload_kg;
  job->delta_v_m_s = sizing->delta_v_m_s;
  job->unc = spreads != NULL ? *spreads : design->uncertainty;
  return TRUE;
}

gboolean
sw_montecarlo_run (const SwDesign *design, const SwUncertainty *spreads, guint samples,
                   gboolean use_seed, guint32 seed, guint threads, SwMonteCarlo *out,
                   double *liftoff_samples, double *payload_samples, GError **error)
{
  return sw_montecarlo_run_cancellable (design, spreads, samples, use_seed, seed, threads, out,
                                        liftoff_samples, payload_samples, NULL, error);
}

static gboolean run_full (const SwDesign *design, const SwUncertainty *spreads, guint samples,
                          gboolean use_seed, guint32 seed, guint threads, SwMonteCarlo *out,
                          double *liftoff_samples, double *payload_samples,
                          double *margin_samples, GCancellable *cancellable, GError **error);

gboolean
sw_montecarlo_run_margins (const SwDesign *design, const SwUncertainty *spreads, guint samples,
                           gboolean use_seed, guint32 seed, guint threads, SwMonteCarlo *out,
                           double *liftoff_samples, double *payload_samples,
                           double *margin_samples, GError **error)
{
  return run_full (design, spreads, samples, use_seed, seed, threads, out, liftoff_samples,
                   payload_samples, margin_samples, NULL, error);
}

gboolean
sw_montecarlo_run_cancellable (const SwDesign *design, const SwUncertainty *spreads,
                               guint samples, gboolean use_seed, guint32 seed, guint threads,
                               SwMonteCarlo *out, double *liftoff_samples,
                               double *payload_samples, GCancellable *cancellable,
                               GError **error)
{
  return run_full (design, spreads, samples, use_seed, seed, threads, out, liftoff_samples,
                   payload_samples, NULL, cancellable, error);
}

static gboolean
run_full (const SwDesign *design, const SwUncertainty *spreads, guint samples,
          gboolean use_seed, guint32 seed, guint threads, SwMonteCarlo *out,
          double *liftoff_samples, double *payload_samples, double *margin_samples,
          GCancellable *cancellable, GError **error)
{
  McJob job;
  SwSizing sizing;
  g_autofree double *liftoff = NULL, *payload = NULL, *margin = NULL;
  guint infeasible = 0, short_of = 0;

  g_return_val_if_fail (design != NULL && out != NULL, FALSE);

  memset (out, 0, sizeof *out);
  if (!prepare (design, spreads, FALSE, &job, &sizing, error))
    return FALSE;
  job.samples = samples > 0 ? samples : sw_uncertainty_samples (&job.unc);
  job.seed = use_seed ? seed : sw_uncertainty_seed (&job.unc);
  if (job.samples < 2 || job.samples > 10000000)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
                   _("%u samples: a Monte Carlo run takes 2 to 10,000,000 samples."),
                   job.samples);
      return FALSE;
    }
  liftoff = g_new (double, job.samples);
  job.liftoff = liftoff;
  if (job.parallel)
    {
      job.have_vehicle = sizing.feasible;
      job.pv_fixed = job.pv;
      for (guint i = 0; i < sizing.n_stages; i++)
        job.pv_fixed.fixed_kg[i] = sizing.stages[i].propellant_mass_kg;
      if (job.pv.count > 0)
        job.pv_fixed.booster_fixed_kg = sizing.boosters.propellant_mass_kg;
    }
  else
    job.have_vehicle = sw_fixed_vehicle_from_sizing (&job.vehicle, &sizing);
  /* A vehicle that exists is tested whether or not the payload fits. */
  if (job.all_fixed)
    {
      job.have_vehicle = TRUE;
      margin = job.margin = g_new (double, job.samples);
    }
  if (job.have_vehicle)
    payload = job.payload = g_new (double, job.samples);

  job.cancellable = cancellable;
  out->threads = run_job (&job, threads);
  if (g_cancellable_set_error_if_cancelled (cancellable, error))
    return FALSE;
  out->samples = job.samples;
  out->seed = job.seed;
  out->spreads = job.unc;
  out->nominal_feasible = sizing.feasible;
  out->nominal_liftoff_kg = sizing.liftoff_mass_kg;
  out->required_payload_kg = design->payload_kg;
  out->nominal_delta_v_m_s = sizing.delta_v_m_s;

  sw_mc_summarise (liftoff, job.samples, &out->liftoff);
  for (guint i = 0; i < job.samples; i++)
    infeasible += !isfinite (liftoff[i]);
  out->infeasible_fraction = (double) infeasible / job.samples;

  out->p_negative_margin = NAN;
  out->reserve_95_kg = NAN;
  if (payload != NULL)
    {
      sw_mc_summarise (payload, job.samples, &out->payload);
      for (guint i = 0; i < job.samples; i++)
        /* A relative hair below the requirement is the root finder's
         * tolerance, not a shortfall. */
        short_of += !(payload[i] >= design->payload_kg * (1.0 - 1e-9));
      out->p_negative_margin = (double) short_of / job.samples;
      out->reserve_95_kg = design->payload_kg - out->payload.p05;
    }
  else
    sw_mc_summarise (NULL, 0, &out->payload);
  out->all_fixed = job.all_fixed;
  out->nominal_capability_kg = NAN;
  out->nominal_margin_m_s = NAN;
  sw_mc_summarise (margin, margin != NULL ? job.samples : 0, &out->margin);
  if (job.all_fixed)
    {
      out->nominal_capability_kg = sw_fixed_loads_payload (&job.pv_all, sizing.delta_v_m_s);
      out->nominal_margin_m_s = sw_fixed_loads_delta_v (&job.pv_all, design->payload_kg)
                                - sizing.delta_v_m_s;
      /* The one liftoff mass, whether or not the nominal payload fits. */
      out->nominal_liftoff_kg = sw_fixed_loads_liftoff_mass (&job.pv_all, design->payload_kg);
    }

  if (liftoff_samples != NULL)
    memcpy (liftoff_samples, liftoff, job.samples * sizeof *liftoff);
  if (payload_samples != NULL)
    for (guint i = 0; i < job.samples; i++)
      payload_samples[i] = payload != NULL ? payload[i] : NAN;
  if (margin_samples != NULL)
    for (guint i = 0; i < job.samples; i++)
      margin_samples[i] = margin != NULL ? margin[i] : NAN;
  return TRUE;
}

/* Quantile @q of @n samples of which the @k sorted finite ones are in @v and
 * the rest are infeasible (infinitely heavy): NAN when it falls among those. */
static double
quantile_with_infeasible (const double *v, guint k, guint n, double q)
{
  double pos = q * (n - 1);
  guint i = (guint) floor (pos);
  double frac = pos - i;

  if (k == 0 || i >= k || (frac > 0.0 && i + 1 >= k))
    return NAN;
  return frac > 0.0 ? (1.0 - frac) * v[i] + frac * v[i + 1] : v[i];
}

gboolean
sw_montecarlo_band (const SwDesign *design, const SwUncertainty *spreads, guint max_stages,
                    guint samples, guint32 seed, guint threads, SwMcBand *out, GError **error)
{
  return sw_montecarlo_band_cancellable (design, spreads, max_stages, samples, seed, threads,
                                         out, NULL, error);
}

gboolean
sw_montecarlo_band_cancellable (const SwDesign *design, const SwUncertainty *spreads,
                                guint max_stages, guint samples, guint32 seed, guint threads,
                                SwMcBand *out, GCancellable *cancellable, GError **error)
{
  McJob job;
  SwSizing sizing;
  g_autofree double *liftoff = NULL;

  g_return_val_if_fail (design != NULL && out != NULL, FALSE);

  memset (out, 0, sizeof *out);
  /* The band belongs to the stage-count curve, a serial vehicle's: the
   * design's stages without the boosters. */
  if (!prepare (design, spreads, TRUE, &job, &sizing, error))
    return FALSE;
  max_stages = CLAMP (max_stages, 1, SW_MAX_STAGES);
  job.samples = samples > 0 ? samples : sw_uncertainty_samples (&job.unc);
  job.seed = seed;
  job.split = SW_SPLIT_OPTIMAL;
  liftoff = g_new (double, job.samples);
  job.liftoff = liftoff;
  out->n_points = max_stages;
  out->samples = job.samples;

  for (guint n = 1; n <= max_stages; n++)
    {
      guint k = 0;

      sw_stage_set_extend (&job.set, design, n);
      job.cancellable = cancellable;
      run_job (&job, threads);
      if (g_cancellable_set_error_if_cancelled (cancellable, error))
        return FALSE;
      for (guint i = 0; i < job.samples; i++)
        if (isfinite (liftoff[i]))
          liftoff[k++] = liftoff[i];
      gsl_sort (liftoff, 1, k);
      out->feasible_fraction[n - 1] = (double) k / job.samples;
      out->p05[n - 1] = quantile_with_infeasible (liftoff, k, job.samples, 0.05);
      out->p50[n - 1] = quantile_with_infeasible (liftoff, k, job.samples, 0.50);
      out->p95[n - 1] = quantile_with_infeasible (liftoff, k, job.samples, 0.95);
    }
  return TRUE;
}
