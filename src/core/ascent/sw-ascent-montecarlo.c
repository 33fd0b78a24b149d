/* SPDX-License-Identifier: GPL-3.0-or-later */
/* A Monte Carlo of the built vehicle with a simulated ascent per sample
 * (see sw-ascent-montecarlo.h). */
#define G_LOG_DOMAIN "sw-ascent"

#include "config.h"

#include "sw-ascent-montecarlo.h"

#include "sw-ascent-private.h"
#include "sw-booster-sizing.h"
#include "sw-format.h"
#include "sw-sizing.h"

#include <glib/gi18n-lib.h>
#include <gsl/gsl_randist.h>
#include <gsl/gsl_rng.h>
#include <math.h>
#include <string.h>

typedef struct {
  const SwDesign     *design;      /* the nominal design, sized with the allowance below */
  SwSizing            sizing;      /* the nominal vehicle */
  SwAscentHints       hints;       /* the nominal solution: every sample starts here */
  SwAscentOptions     opt;
  guint               samples;
  guint32             seed;
  double             *margins;
  double             *losses;
  gint                next;        /* atomic */
  gint                done;        /* atomic */
  SwAscentMcProgress  progress;
  gpointer            user_data;
  GCancellable       *cancellable;
  GMutex              lock;
  GError             *error;       /* the first error of a worker */
} Job;

/* A vehicle with strap-on boosters, built: every load (stages and boosters)
 * fixed at the nominal vehicle's, the fairing carried where the nominal
 * sizing carries it, the structure from @work's structural coefficients;
 * the phases and masses as the parallel sizing gives them for a vehicle
 * whose loads are all fixed (sw-booster-sizing.h), with @payload_kg.
 * out->delta_v_m_s is what the vehicle gives.  FALSE when it makes no
 * vehicle. */
static gboolean
rebuild_parallel (const SwSizing *nominal, SwDesign *work, double payload_kg, SwSizing *out)
{
  SwParallelVehicle v;
  double total = 0.0;

  for (guint i = 0; i < work->n_stages; i++)
    {
      if (!(nominal->stages[i].propellant_mass_kg > 0.0))
        return FALSE;
      work->stages[i].propellant.has_propellant_kg = TRUE;
      work->stages[i].propellant.propellant_kg = nominal->stages[i].propellant_mass_kg;
    }
  if (!(nominal->boosters.propellant_mass_kg > 0.0))
    return FALSE;
  work->boosters.propellant.has_propellant_kg = TRUE;
  work->boosters.propellant.propellant_kg = nominal->boosters.propellant_mass_kg;
  work->ascent.has_flown_fairing = nominal->fairing.mass_kg > 0.0;
  work->ascent.flown_fairing_stage = nominal->fairing.stage;
  work->ascent.flown_fairing_fraction = nominal->fairing.fraction;
  if (!sw_parallel_vehicle_from_design (&v, work, NULL))
    return FALSE;
  /* Every load fixed: feasible when it gives the 1 m/s asked. */
  sw_size_parallel (&v, payload_kg, 1.0, work->split, out);
  if (!out->feasible)
    return FALSE;
  for (guint i = 0; i < out->n_stages; i++)
    total += out->stages[i].delta_v_m_s;
  /* What the vehicle gives (the flight takes the requirement plus the
   * margin of an all-fixed sizing as the vehicle's delta-v). */
  out->delta_v_m_s = total;
  out->margin_m_s = 0.0;
  return TRUE;
}

/* One sample: the vehicle with drawn Isp and structural coefficients, flown. */
static void
run_sample (Job *job, SwDesign *work, gsl_rng *r, guint index)
{
  const SwDesign *d = job->design;
  const SwUncertainty *u = &d->uncertainty;
  SwSizing sz = job->sizing;
  SwAscentHints hints = job->hints;
  g_autoptr (SwAscentResult) res = NULL;
  GError *error = NULL;
  double above = d->payload_kg, total = 0.0;

  gsl_rng_set (r, sw_uncertainty_stream_seed (job->seed, index));
  for (guint i = 0; i < d->n_stages; i++)
    {
      double f = sw_spread_draw_scaled (r, &u->isp, 1.0, 0.05, INFINITY);
      double eps = sw_spread_draw_scaled (r, &u->structural_coefficient, d->stages[i].structural_coefficient,
                                1e-4, 0.95);

      work->stages[i].isp_vac_s = d->stages[i].isp_vac_s * f;
      work->stages[i].isp_sl_s = d->stages[i].isp_sl_s * f;
      work->stages[i].structural_coefficient = eps;
    }
  if (d->boosters.count > 0)
    {
      /* The boosters draw from the same spreads, after the stages. */
      double f = sw_spread_draw_scaled (r, &u->isp, 1.0, 0.05, INFINITY);
      double eps = sw_spread_draw_scaled (r, &u->structural_coefficient,
                                          d->boosters.structural_coefficient, 1e-4, 0.95);

      work->boosters.isp_vac_s = d->boosters.isp_vac_s * f;
      work->boosters.isp_sl_s = d->boosters.isp_sl_s * f;
      work->boosters.structural_coefficient = eps;
      if (!rebuild_parallel (&job->sizing, work, d->payload_kg, &sz))
        return;
      goto fly;
    }
  /* The masses from the top down: the propellant loads are the nominal
   * vehicle's, the structure follows the drawn eps. */
  for (int i = (int) d->n_stages - 1; i >= 0; i--)
    {
      SwStageResult *st = &sz.stages[i];
      double prop = st->propellant_mass_kg, eps = work->stages[i].structural_coefficient;
      double c = work->stages[i].isp_vac_s * SW_G0;
      /* The stage that drops the fairing carries it for the sizing's share
       * of its propellant (sw-sizing.h, SwFairingCarry). */
      gboolean drops = sz.fairing.mass_kg > 0.0 && (guint) i == sz.fairing.stage;
      double F = drops ? sz.fairing.mass_kg : 0.0, left = (1.0 - sz.fairing.fraction) * prop;

      st->payload_mass_kg = above;
      st->structural_mass_kg = prop > 0.0 ? prop * eps / (1.0 - eps) : st->structural_mass_kg;
      st->initial_mass_kg = above + prop + st->structural_mass_kg + F;
      st->burnout_mass_kg = st->initial_mass_kg - prop - F;
      if (!(prop > 0.0))
        st->delta_v_m_s = 0.0;
      else if (drops)
        st->delta_v_m_s = c * log (st->initial_mass_kg / (st->burnout_mass_kg + left + F))
                          + c * log ((st->burnout_mass_kg + left) / st->burnout_mass_kg);
      else
        st->delta_v_m_s = c * log (st->initial_mass_kg / st->burnout_mass_kg);
      total += st->delta_v_m_s;
      above = st->initial_mass_kg;
    }
  sz.delta_v_m_s = total;
  sz.liftoff_mass_kg = above;

fly:
  res = sw_ascent_solve_sized (work, &sz, &job->opt, &hints, job->cancellable, &error);
  if (res == NULL)
    {
      g_mutex_lock (&job->lock);
      if (job->error == NULL)
        job->error = error;
      else
        g_clear_error (&error);
      g_mutex_unlock (&job->lock);
      return;
    }
  if (res->status == SW_ASCENT_REACHED || res->status == SW_ASCENT_SHORT)
    {
      job->margins[index] = res->delta_v_margin_m_s;
      job->losses[index] = res->losses_m_s;
    }
}

static gpointer
worker (gpointer data)
{
  Job *job = data;
  gsl_rng *r = gsl_rng_alloc (gsl_rng_mt19937);
  SwDesign *work = sw_design_copy (job->design);

  for (;;)
    {
      guint i = (guint) g_atomic_int_add (&job->next, 1);
      guint done;

      if (i >= job->samples || g_cancellable_is_cancelled (job->cancellable))
        break;
      run_sample (job, work, r, i);
      done = (guint) g_atomic_int_add (&job->done, 1) + 1;
      if (job->progress != NULL)
        job->progress (done, job->samples, job->user_data);
    }
  sw_design_free (work);
  gsl_rng_free (r);
  return NULL;
}

static int
cmp_double (const void *a, const void *b)
{
  double x = *(const double *) a, y = *(const double *) b;
  return (x > y) - (x < y);
}

/* Percentile @p (0..1) of sorted @v by linear interpolation. */
static double
percentile (const double *v, guint n, double p)
{
  double x = p * (n - 1);
  guint k = (guint) floor (x);

  if (n == 0)
    return NAN;
  if (k + 1 >= n)
    return v[n - 1];
  return v[k] + (x - k) * (v[k + 1] - v[k]);
}

void
sw_ascent_montecarlo_free (SwAscentMonteCarlo *mc)
{
  if (mc == NULL)
    return;
  g_free (mc->margins_m_s);
  g_free (mc);
}

SwAscentMonteCarlo *
sw_ascent_montecarlo_run (const SwDesign *design, guint samples, guint32 seed, guint threads,
                          SwAscentMcProgress progress, gpointer user_data,
                          GCancellable *cancellable, GError **error)
{
  g_autoptr (SwDesign) nominal = NULL;
  g_autoptr (SwAscentResult) nres = NULL;
  g_autoptr (SwAscentMonteCarlo) mc = NULL;
  g_autofree double *losses = NULL;
  g_autofree double *sorted = NULL;
  Job job = { 0 };
  GThread *pool[64];
  double sum = 0.0, sum2 = 0.0, lsum = 0.0, dvdp = 0.0;
  guint n = 0;

  g_return_val_if_fail (design != NULL, NULL);

  if (!sw_ascent_check_inputs (design, error))
    return NULL;
  if (samples == 0)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_VALUE, _("The Monte Carlo needs at least one sample."));
      return NULL;
    }
  sw_ascent_gsl_errors_as_status ();
  mc = g_new0 (SwAscentMonteCarlo, 1);
  mc->samples = samples;
  sw_ascent_options_init (&job.opt);
  job.opt.record = FALSE;

  /* The nominal vehicle: sized with the closed loop's losses for a simulate
   * design, else with its allowance. */
  nominal = sw_design_copy (design);
  if (design->mission.loss_model == SW_LOSS_SIMULATE)
    {
      g_autoptr (SwAscentResult) loop = sw_ascent_close_loop (design, &job.opt, cancellable,
                                                              error);
      if (loop == NULL)
        return NULL;
      if (!loop->loop_converged)
        {
          g_autofree char *why = sw_format_clause (loop->reason);
          g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                       _("The Monte Carlo needs the nominal vehicle: %s"), why);
          return NULL;
        }
      sw_ascent_apply_loop (nominal, loop);
    }
  if (!sw_size_design (nominal, &job.sizing, error))
    return NULL;
  nres = sw_ascent_solve_sized (nominal, &job.sizing, &job.opt, &job.hints, cancellable, error);
  if (nres == NULL)
    return NULL;
  if (nres->status != SW_ASCENT_REACHED && nres->status != SW_ASCENT_SHORT)
    {
      g_autofree char *why = sw_format_clause (nres->reason);
      g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                   _("The Monte Carlo needs a nominal vehicle that flies: %s"), why);
      return NULL;
    }
  job.hints.hold_kick = TRUE;
  mc->nominal_margin_m_s = nres->delta_v_margin_m_s;
  mc->nominal_losses_m_s = nres->losses_m_s;
  mc->sized_losses_m_s = nominal->mission.losses_m_s;
  /* Delta-v lost per kg of payload: d/dp of sum c ln(m0 / mf); with
   * boosters, by a difference over 1 kg of the built vehicle. */
  if (nominal->boosters.count > 0)
    {
      g_autoptr (SwDesign) built = sw_design_copy (nominal);
      SwSizing a, b;

      if (!rebuild_parallel (&job.sizing, built, nominal->payload_kg, &a)
          || !rebuild_parallel (&job.sizing, built, nominal->payload_kg + 1.0, &b))
        {
          g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                       _("The Monte Carlo needs the nominal vehicle with its boosters built "
                         "(every stage with propellant)."));
          return NULL;
        }
      dvdp = a.delta_v_m_s - b.delta_v_m_s;
    }
  for (guint i = 0; i < nominal->n_stages && nominal->boosters.count == 0; i++)
    {
      const SwStageResult *st = &job.sizing.stages[i];
      if (st->propellant_mass_kg > 0.0 && !st->unused)
        dvdp += nominal->stages[i].isp_vac_s * SW_G0
                * (1.0 / st->burnout_mass_kg - 1.0 / st->initial_mass_kg);
    }
  mc->dv_per_kg_payload = dvdp;

  job.design = nominal;
  job.samples = samples;
  job.seed = seed;
  job.margins = mc->margins_m_s = g_new (double, samples);
  job.losses = losses = g_new (double, samples);
  for (guint i = 0; i < samples; i++)
    job.margins[i] = job.losses[i] = NAN;
  job.progress = progress;
  job.user_data = user_data;
  job.cancellable = cancellable;
  g_mutex_init (&job.lock);

  if (threads == 0)
    threads = g_get_num_processors ();
  threads = CLAMP (threads, 1, MIN (64, samples));
  mc->threads = threads;
  if (threads == 1)
    worker (&job);
  else
    {
      for (guint t = 0; t < threads; t++)
        pool[t] = g_thread_new ("sw-ascent-mc", worker, &job);
      for (guint t = 0; t < threads; t++)
        g_thread_join (pool[t]);
    }
  g_mutex_clear (&job.lock);
  if (job.error != NULL)
    {
      g_propagate_error (error, job.error);
      return NULL;
    }
  if (g_cancellable_set_error_if_cancelled (cancellable, error))
    return NULL;

  sorted = g_new (double, samples);
  for (guint i = 0; i < samples; i++)
    if (isfinite (mc->margins_m_s[i]))
      {
        double v = mc->margins_m_s[i];
        sorted[n++] = v;
        sum += v;
        sum2 += v * v;
        lsum += losses[i];
        if (v >= 0.0)
          mc->reached++;
      }
  mc->flown = n;
  mc->probability_reached = (double) mc->reached / samples;
  qsort (sorted, n, sizeof (double), cmp_double);
  mc->mean_margin_m_s = n > 0 ? sum / n : NAN;
  mc->sd_margin_m_s = n > 1 ? sqrt (MAX (0.0, (sum2 - sum * sum / n) / (n - 1))) : NAN;
  mc->mean_losses_m_s = n > 0 ? lsum / n : NAN;
  mc->min_margin_m_s = n > 0 ? sorted[0] : NAN;
  mc->max_margin_m_s = n > 0 ? sorted[n - 1] : NAN;
  mc->p05_margin_m_s = percentile (sorted, n, 0.05);
  mc->p50_margin_m_s = percentile (sorted, n, 0.50);
  mc->p95_margin_m_s = percentile (sorted, n, 0.95);
  /* Samples with no answer count as failures: the 5th percentile over all
   * samples is then undefined when more than 5 % failed. */
  if (n < samples && (double) (samples - n) > 0.05 * samples)
    mc->payload_reserve_95_kg = NAN;
  else
    {
      double p05 = percentile (sorted, n, MAX (0.0, (0.05 * samples - (samples - n)) / n));
      mc->payload_reserve_95_kg = dvdp > 0.0 ? -p05 / dvdp : NAN;
    }
  return g_steal_pointer (&mc);
}
