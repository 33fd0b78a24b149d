/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-montecarlo.h: how much margin is there?  Samples the Isp and structural
 * coefficient of every stage and the losses from the design's "uncertainty"
 * spreads and answers two questions per sample:
 *   1. the liftoff mass needed for the fixed payload (re-sized with the
 *      design's split rule; the optimal split is re-optimised);
 *   2. the payload that the nominal vehicle (the design's propellant loads,
 *      structure = propellant x eps/(1 - eps) at the sampled eps) carries to
 *      the sampled required delta-v.
 * The payload margin is question 2's payload minus the required payload; it
 * is negative when the built vehicle falls short.  The nominal vehicle has a
 * margin of zero by construction, so symmetric spreads put about half of the
 * samples below zero: the 5th percentile tells the reserve to carry.
 * With strap-on boosters their Isp and structural coefficient are sampled too
 * (same spreads) and both questions go through the phased vehicle
 * (sw_size_parallel: sized boosters re-optimised per sample, fixed ones kept;
 * sw_parallel_payload for question 2).
 * A stage with a fixed propellant load (propellant_kg) keeps it in question
 * 1: each sample is sized as sw_size_design sizes it (sw_size_with_fixed),
 * the sized stages taking the rest of the delta-v.
 * A vehicle that exists (every load fixed, sw_design_all_fixed) has one
 * liftoff mass whatever the sample: its outputs are question 2's payload,
 * which is then its payload capability, taken from the design's loads
 * whether or not the nominal payload fits, and the delta-v margin at the
 * required payload (the vehicle's delta-v with that payload less the
 * sampled required delta-v; SwMonteCarlo.margin).
 *
 * Samples run in blocks of SW_MC_BLOCK on all cores; each block draws from its
 * own GSL generator seeded from (seed, block index), every sample is stored
 * at its index and the statistics are taken in index order, so one seed gives
 * bit-identical results whatever the thread count. */
#pragma once

#include <gio/gio.h>

#include "sw-design.h"
#include "sw-uncertainty.h"
#include "sw-types.h"

G_BEGIN_DECLS

#define SW_MC_BLOCK 256
#define SW_MC_BINS 40

typedef struct {
  guint  n;               /* samples counted (finite values) */
  double mean;
  double sd;
  double p05, p50, p95;
  double min, max;
  double bin_lo;          /* histogram: SW_MC_BINS equal bins over [bin_lo, bin_hi] */
  double bin_hi;
  guint  bins[SW_MC_BINS];
} SwMcSummary;

typedef struct {
  guint    samples;
  guint32  seed;
  guint    threads;                 /* threads used */
  SwUncertainty spreads;            /* the spreads used */
  gboolean nominal_feasible;
  double   nominal_liftoff_kg;      /* NAN when infeasible (every load fixed: always given) */
  double   required_payload_kg;
  double   nominal_delta_v_m_s;
  /* Question 1 over the feasible samples. */
  SwMcSummary liftoff;
  double   infeasible_fraction;     /* samples beyond the vehicle's delta-v limit */
  /* Question 2, when the nominal design is feasible (else n = 0). */
  SwMcSummary payload;
  double   p_negative_margin;       /* fraction of samples with payload < required */
  double   reserve_95_kg;           /* required - p05 of payload: the reserve for 95 % */
  /* Every load fixed (sw_design_all_fixed): payload is the capability, and
   * margin the delta-v margin at the required payload (m/s; n = 0 otherwise). */
  gboolean all_fixed;
  SwMcSummary margin;
  double   nominal_capability_kg;   /* the nominal vehicle's; NAN unless all_fixed */
  double   nominal_margin_m_s;      /* ... its delta-v margin at the required payload */
} SwMonteCarlo;

/* The stage-count band: liftoff-mass percentiles of the N-stage vehicle of
 * the stage-count curve (stage k takes design stage min(k, n); serial, as
 * the curve: boosters are left out). */
typedef struct {
  guint  n_points;
  guint  samples;
  /* Percentiles over all samples, an infeasible sample counting as
   * infinitely heavy: NAN where the percentile falls among those. */
  double p05[SW_MAX_STAGES];
  double p50[SW_MAX_STAGES];
  double p95[SW_MAX_STAGES];
  double feasible_fraction[SW_MAX_STAGES];
} SwMcBand;

/* Runs the design's spreads (@spreads overrides them when not NULL).
 * sw_montecarlo_run_margins: the same, with @margin_samples (may be NULL)
 * receiving every sample's delta-v margin of a vehicle that exists (NAN
 * otherwise). 
 * @samples and @seed override the design's when @samples > 0 / @use_seed;
 * @threads 0 = all cores.  @liftoff_samples and @payload_samples, when not
 * NULL, receive every sample in index order (NAN for an infeasible one);
 * they must hold the sample count. */
gboolean sw_montecarlo_run (const SwDesign *design, const SwUncertainty *spreads,
                            guint samples, gboolean use_seed, guint32 seed, guint threads,
                            SwMonteCarlo *out, double *liftoff_samples,
                            double *payload_samples, GError **error);

gboolean sw_montecarlo_run_margins (const SwDesign *design, const SwUncertainty *spreads,
                                    guint samples, gboolean use_seed, guint32 seed,
                                    guint threads, SwMonteCarlo *out, double *liftoff_samples,
                                    double *payload_samples, double *margin_samples,
                                    GError **error);

gboolean sw_montecarlo_band (const SwDesign *design, const SwUncertainty *spreads,
                             guint max_stages, guint samples, guint32 seed, guint threads,
                             SwMcBand *out, GError **error);

/* The same with a cancellable, looked at before every block of samples:
 * FALSE with G_IO_ERROR_CANCELLED once it is cancelled (the solver thread
 * abandons a run when a newer edit arrives). */
gboolean sw_montecarlo_run_cancellable (const SwDesign *design, const SwUncertainty *spreads,
                                        guint samples, gboolean use_seed, guint32 seed,
                                        guint threads, SwMonteCarlo *out,
                                        double *liftoff_samples, double *payload_samples,
                                        GCancellable *cancellable, GError **error);
gboolean sw_montecarlo_band_cancellable (const SwDesign *design, const SwUncertainty *spreads,
                                         guint max_stages, guint samples, guint32 seed,
                                         guint threads, SwMcBand *out,
                                         GCancellable *cancellable, GError **error);

/* Statistics of @n values (NAN ones skipped): GSL's mean, sd and quantiles. */
void     sw_mc_summarise (const double *values, guint n, SwMcSummary *out);

G_END_DECLS
