/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-analysis"

#include "config.h"

#include "sw-analysis.h"

#include <math.h>

G_DEFINE_BOXED_TYPE (SwAnalysis, sw_analysis, sw_analysis_ref, sw_analysis_unref)

static void
result_clear (gpointer data)
{
  SwAnalysis *r = data;

  sw_design_free (r->design);
  g_free (r->error_message);
  g_clear_pointer (&r->ascent, sw_ascent_result_free);
  g_free (r->ascent_message);
}

/* Fast phase: thrust-to-weight per stage from the sized masses, and whether
 * the design has what an ascent needs (if not, the core says which keys). */
static void
prepare_ascent (SwAnalysis *r, const SwDesign *design)
{
  g_autoptr (GError) error = NULL;

  r->has_stage_figures = sw_ascent_stage_figures (design, &r->sizing, r->stage_figures, NULL);
  r->ascent_pending = sw_ascent_check_inputs (design, &error);
  if (!r->ascent_pending)
    r->ascent_message = g_strdup (error->message);
}

void
sw_solve_options_init (SwSolveOptions *options)
{
  options->sensitivity_step = SW_SENSITIVITY_DEFAULT_STEP;
  options->band_samples = 2000;
  options->threads = 0;
}

/* The comparison with the baseline, from the sizing in force. */
static void
compare_with_baseline (SwAnalysis *r)
{
  sw_comparison_from_sizings (&r->sizing, r->baseline_ok ? &r->baseline_sizing : NULL,
                              &r->comparison);
  sw_delta_set (&r->margin_delta, r->sizing.feasible ? r->sizing.margin_m_s : NAN,
                r->baseline_ok && r->baseline_sizing.feasible ? r->baseline_sizing.margin_m_s
                                                              : NAN);
}

/* Fast phase of the trade studies: microseconds each (see the CLI's bench). */
static void
prepare_trade (SwAnalysis *r, const SwDesign *design, const SwSolveOptions *options)
{
  g_autoptr (GError) error = NULL;

  r->sensitivity_step = options->sensitivity_step;
  if (r->sizing.feasible)
    r->has_sensitivity = sw_sensitivity_compute (design, options->sensitivity_step,
                                                 &r->sensitivity, NULL)
                         && r->sensitivity.feasible;
  sw_reliability_from_design (design, &r->reliability);
  sw_reliability_curve_compute (design, SW_MAX_STAGES, &r->reliability_curve);

  r->has_baseline = design->baseline != NULL;
  if (r->has_baseline)
    {
      double dv;

      r->baseline_ok = sw_design_required_delta_v (design->baseline, &dv, &error)
                       && sw_size_design (design->baseline, &r->baseline_sizing, &error);
      sw_reliability_curve_compute (design->baseline, SW_MAX_STAGES,
                                    &r->baseline_reliability_curve);
      if (r->baseline_ok)
        sw_stage_curve_compute (design->baseline, dv, SW_MAX_STAGES, &r->baseline_curve);
      else
        g_strlcpy (r->baseline_error, error->message, sizeof r->baseline_error);
    }
  compare_with_baseline (r);
  r->montecarlo_pending = sw_uncertainty_has_spread (&design->uncertainty);
}

SwAnalysis *
sw_analysis_compute (const SwDesign *design, guint64 serial, GCancellable *cancellable)
{
  return sw_analysis_compute_with (design, serial, NULL, cancellable);
}

SwAnalysis *
sw_analysis_compute_with (const SwDesign *design, guint64 serial, const SwSolveOptions *options,
                        GCancellable *cancellable)
{
  SwAnalysis *r;
  SwSolveOptions defaults;
  g_autoptr (GError) error = NULL;

  g_return_val_if_fail (design != NULL, NULL);

  if (options == NULL)
    {
      sw_solve_options_init (&defaults);
      options = &defaults;
    }

  r = g_atomic_rc_box_new0 (SwAnalysis);
  r->serial = serial;
  r->design = sw_design_copy (design);

  if (!sw_design_validate (design, NULL, &error)
      || !sw_design_required_delta_v (design, &r->delta_v_m_s, &error)
      || !sw_size_design (design, &r->sizing, &error))
    {
      r->ok = FALSE;
      r->error_message = g_strdup (error->message);
      return r;
    }
  r->ok = TRUE;
  r->has_budget = design->mission.kind == SW_MISSION_ORBIT
                  && sw_design_budget (design, &r->budget, NULL);
  sw_stage_curve_compute (design, r->delta_v_m_s, SW_MAX_STAGES, &r->stage_curve);
  sw_sweep_compute (design, SW_SWEEP_CURVES, SW_SWEEP_POINTS, &r->sweep);
  prepare_ascent (r, design);
  prepare_trade (r, design, options);

  if (g_cancellable_is_cancelled (cancellable))
    {
      sw_analysis_unref (r);
      return NULL;
    }
  return r;
}

SwAnalysis *
sw_analysis_compute_ascent (const SwAnalysis *fast, GCancellable *cancellable)
{
  g_autoptr (GError) error = NULL;
  SwAscentResult *ascent;
  SwAnalysis *r;

  g_return_val_if_fail (fast != NULL && fast->ok && fast->ascent_pending, NULL);

  ascent = sw_ascent_fly_design (fast->design, cancellable, &error);
  if (g_cancellable_is_cancelled (cancellable))
    {
      g_clear_pointer (&ascent, sw_ascent_result_free);
      return NULL;
    }

  /* The fast part, copied: the emitted fast result stays as it was. */
  r = g_atomic_rc_box_new0 (SwAnalysis);
  *r = *fast;
  r->design = sw_design_copy (fast->design);
  r->error_message = g_strdup (fast->error_message);
  r->ascent_pending = FALSE;
  r->phase = 2;
  r->ascent = ascent;
  r->ascent_message = ascent == NULL ? g_strdup (error->message) : NULL;

  /* The closed loop sized the vehicle with the simulated losses: that
   * vehicle replaces the first guess in every view. */
  if (ascent != NULL && ascent->closed_loop && ascent->loop_converged
      && ascent->sizing.feasible && ascent->sizing.n_stages == fast->sizing.n_stages)
    {
      r->sizing = ascent->sizing;
      r->delta_v_m_s = ascent->sizing.delta_v_m_s;
      r->sized_by_ascent = TRUE;
      if (r->has_budget)
        {
          r->budget.losses_m_s = ascent->loop_sized_losses_m_s;
          r->budget.delta_v_m_s = r->budget.ideal_delta_v_m_s + r->budget.losses_m_s;
        }
      sw_stage_curve_compute (r->design, r->delta_v_m_s, SW_MAX_STAGES, &r->stage_curve);
      compare_with_baseline (r);
      r->has_stage_figures = sw_ascent_stage_figures (r->design, &r->sizing, r->stage_figures,
                                                      NULL);
    }
  return r;
}

SwAnalysis *
sw_analysis_compute_montecarlo (const SwAnalysis *fast, const SwSolveOptions *options,
                              GCancellable *cancellable)
{
  g_autoptr (GError) error = NULL;
  const SwUncertainty *unc;
  SwSolveOptions defaults;
  SwAnalysis *r;

  g_return_val_if_fail (fast != NULL && fast->ok && fast->montecarlo_pending, NULL);

  if (options == NULL)
    {
      sw_solve_options_init (&defaults);
      options = &defaults;
    }
  /* The fast part, copied as in sw_analysis_compute_ascent(); the trade
   * fields hold no pointers.  The ascent has not run yet in this phase. */
  r = g_atomic_rc_box_new0 (SwAnalysis);
  *r = *fast;
  r->design = sw_design_copy (fast->design);
  r->error_message = g_strdup (fast->error_message);
  r->ascent = NULL;
  r->ascent_message = g_strdup (fast->ascent_message);
  r->montecarlo_pending = FALSE;
  r->phase = 1;

  /* The core looks at the cancellable before every block of samples, so a
   * newer edit abandons even a million-sample run within a block. */
  unc = &r->design->uncertainty;
  r->has_montecarlo = sw_montecarlo_run_cancellable (r->design, NULL, 0, FALSE, 0,
                                                     options->threads, &r->montecarlo, NULL,
                                                     NULL, cancellable, &error);
  if (r->has_montecarlo)
    r->has_band = sw_montecarlo_band_cancellable (r->design, NULL, SW_MAX_STAGES,
                                                  MIN (sw_uncertainty_samples (unc),
                                                       options->band_samples),
                                                  sw_uncertainty_seed (unc), options->threads,
                                                  &r->band, cancellable, &error);
  if (error != NULL)
    g_strlcpy (r->montecarlo_error, error->message, sizeof r->montecarlo_error);
  if (g_cancellable_is_cancelled (cancellable))
    {
      sw_analysis_unref (r);
      return NULL;
    }
  return r;
}

SwAnalysis *
sw_analysis_ref (SwAnalysis *result)
{
  return g_atomic_rc_box_acquire (result);
}

void
sw_analysis_unref (SwAnalysis *result)
{
  g_atomic_rc_box_release_full (result, result_clear);
}
