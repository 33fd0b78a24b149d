/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-analysis"

#include "config.h"

#include "sw-analysis.h"

#include "sw-format.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

G_DEFINE_BOXED_TYPE (SwAnalysis, sw_analysis, sw_analysis_ref, sw_analysis_unref)

/* ---- the shared heap parts ---------------------------------------------- */

/* An immutable heap object shared by the phases of one analysis. */
struct _SwAnalysisHeld {
  gpointer       data;
  GDestroyNotify free_func;
};

static void
held_clear (gpointer p)
{
  SwAnalysisHeld *h = p;

  h->free_func (h->data);
}

static SwAnalysisHeld *
held_new (gpointer data, GDestroyNotify free_func)
{
  SwAnalysisHeld *h = g_atomic_rc_box_new0 (SwAnalysisHeld);

  h->data = data;
  h->free_func = free_func;
  return h;
}

static SwAnalysisHeld *
held_ref (SwAnalysisHeld *h)
{
  return h != NULL ? g_atomic_rc_box_acquire (h) : NULL;
}

static void
held_unref (SwAnalysisHeld *h)
{
  if (h != NULL)
    g_atomic_rc_box_release_full (h, held_clear);
}

static void
analysis_clear (gpointer data)
{
  SwAnalysis *r = data;

  held_unref (r->held_design);
  held_unref (r->held_ascent);
}

SwAnalysis *
sw_analysis_copy (const SwAnalysis *analysis)
{
  SwAnalysis *r;

  g_return_val_if_fail (analysis != NULL, NULL);

  /* Everything but the two heap parts is plain data held by value; the heap
   * parts are immutable, so the copy shares them. */
  r = (SwAnalysis *) g_atomic_rc_box_dup (sizeof *analysis, (gconstpointer) analysis);
  held_ref (r->held_design);
  held_ref (r->held_ascent);
  return r;
}

SwAnalysis *
sw_analysis_ref (SwAnalysis *analysis)
{
  return g_atomic_rc_box_acquire (analysis);
}

void
sw_analysis_unref (SwAnalysis *analysis)
{
  g_atomic_rc_box_release_full (analysis, analysis_clear);
}

/* ---- options and the verdict's words ------------------------------------ */

void
sw_analysis_options_init (SwAnalysisOptions *options)
{
  memset (options, 0, sizeof *options);
  options->sensitivity_step = SW_SENSITIVITY_DEFAULT_STEP;
  options->band_samples = 2000;
  options->threads = 0;
  options->montecarlo = TRUE;
  options->band = TRUE;
  options->ascent = TRUE;
  /* The defaults of the window's settings (the GSettings schema in data/). */
  options->min_thrust_to_weight = 1.2;
  options->max_q_pa = 45000.0;
  options->max_axial_g = 6.0;
}

const char *
sw_verdict_state_to_string (SwVerdictState state)
{
  switch (state)
    {
    case SW_VERDICT_INFEASIBLE: return "infeasible";
    case SW_VERDICT_SHORT_OF_ORBIT: return "short-of-orbit";
    case SW_VERDICT_OVER_LIMIT: return "over-limit";
    case SW_VERDICT_PAPER_ONLY: return "paper-only";
    case SW_VERDICT_REACHES_ORBIT: return "reaches-orbit";
    case SW_VERDICT_PENDING:
    default: return "pending";
    }
}

const char *
sw_verdict_state_title (SwVerdictState state)
{
  switch (state)
    {
    case SW_VERDICT_INFEASIBLE: return _("Not feasible");
    case SW_VERDICT_SHORT_OF_ORBIT: return _("Does not reach the orbit");
    case SW_VERDICT_OVER_LIMIT: return _("Reaches the orbit, but breaks a limit");
    case SW_VERDICT_PAPER_ONLY: return _("Feasible on paper only");
    case SW_VERDICT_REACHES_ORBIT: return _("Reaches the orbit");
    case SW_VERDICT_PENDING:
    default: return _("Checking the ascent");
    }
}

static void
verdict_set (SwAnalysis *r, SwVerdictState state, const char *reason)
{
  r->verdict.state = state;
  g_strlcpy (r->verdict.reason, reason, sizeof r->verdict.reason);
}

/* Which propulsion input is missing, in plain words. */
static char *
missing_words (const SwAnalysis *r)
{
  const SwDesign *d = r->design;
  gboolean any = FALSE;

  if (d->mission.kind != SW_MISSION_ORBIT)
    return g_strdup (_("the mission gives its delta-v directly, not a target orbit, so there "
                       "is no ascent to fly"));
  for (guint i = 0; i < d->n_stages; i++)
    any = any || d->stages[i].propulsion.present;
  if (!any)
    return g_strdup (_("the design has no propulsion data (thrust of every stage, sea-level "
                       "Isp and diameter of the first stage), so the ascent was not simulated"));
  for (guint i = 0; i < d->n_stages; i++)
    {
      const SwStage *st = &d->stages[i];
      guint count = st->reliability.has_engine_count ? st->reliability.engine_count : 0;
      if (!isfinite (sw_stage_thrust_vac_n (&st->propulsion, count)))
        /* Translators: %u is a stage number, %s its name */
        return g_strdup_printf (_("stage %u (%s) has no thrust, so the ascent was not "
                                  "simulated"), i + 1, st->name);
    }
  if (!d->stages[0].has_isp_sl)
    return g_strdup (_("the first stage has no sea-level Isp, so the ascent was not "
                       "simulated"));
  if (!d->stages[0].propulsion.has_diameter)
    return g_strdup (_("the first stage has no diameter, so the ascent was not simulated"));
  return g_strdup (_("the propulsion data is incomplete or out of range, so the ascent was "
                     "not simulated (the Ascent page says which)"));
}

/* The largest single loss of a simulated ascent, in words. */
static char *
largest_loss (const SwAscentResult *a)
{
  struct { const char *name; double v; } losses[] = {
    { N_("gravity"), a->gravity_loss_m_s },
    { N_("drag"), a->drag_loss_m_s },
    { N_("steering"), a->steering_loss_m_s },
    { N_("nozzle back-pressure"), a->pressure_loss_m_s },
  };
  guint best = 0;
  g_autofree char *v = NULL;

  for (guint i = 1; i < G_N_ELEMENTS (losses); i++)
    if (isfinite (losses[i].v) && !(losses[i].v <= losses[best].v))
      best = i;
  if (!isfinite (losses[best].v))
    return NULL;
  v = sw_format_speed (losses[best].v);
  /* Translators: a kind of loss ("gravity") and a speed */
  return g_strdup_printf (_("the largest loss is %s, %s"), _(losses[best].name), v);
}

double
sw_analysis_liftoff_tw (const SwAnalysis *r)
{
  guint first = 0;

  g_return_val_if_fail (r != NULL, NAN);
  if (r->ascent != NULL)
    return r->ascent->liftoff_thrust_to_weight;
  if (!r->has_stage_figures)
    return NAN;
  while (first + 1 < r->sizing.n_stages && !(r->sizing.stages[first].propellant_mass_kg > 0.0))
    first++;
  return r->stage_figures[first].ignition_thrust_to_weight;
}

/* The limits the vehicle breaks, one sentence each; NULL when none. */
static char *
limits_broken (const SwAnalysis *r)
{
  const SwAnalysisOptions *o = &r->options;
  const SwAscentResult *a = r->ascent;
  GString *s = g_string_new (NULL);
  double tw = sw_analysis_liftoff_tw (r);

  if (isfinite (tw) && tw < o->min_thrust_to_weight)
    {
      g_autofree char *v = sw_format_ratio (tw, 2);
      g_autofree char *l = sw_format_ratio (o->min_thrust_to_weight, 2);
      g_string_append_printf (s, _("Thrust-to-weight at liftoff is %s, below your limit of %s."),
                              v, l);
    }
  if (a != NULL && isfinite (a->max_q_pa) && a->max_q_pa > o->max_q_pa)
    {
      g_autofree char *v = sw_format_pressure_kpa (a->max_q_pa);
      g_autofree char *l = sw_format_pressure_kpa (o->max_q_pa);
      if (s->len > 0)
        g_string_append_c (s, ' ');
      g_string_append_printf (s, _("Max-Q is %s, above your limit of %s."), v, l);
    }
  if (a != NULL && isfinite (a->max_axial_g) && a->max_axial_g > o->max_axial_g)
    {
      g_autofree char *v = sw_format_accel_g (a->max_axial_g);
      g_autofree char *l = sw_format_accel_g (o->max_axial_g);
      if (s->len > 0)
        g_string_append_c (s, ' ');
      g_string_append_printf (s, _("Peak acceleration is %s, above your limit of %s."), v, l);
    }
  if (s->len == 0)
    {
      g_string_free (s, TRUE);
      return NULL;
    }
  return g_string_free (s, FALSE);
}

/* The one verdict, from what the analysis holds so far (precedence as in
 * SwVerdictState). */
static void
update_verdict (SwAnalysis *r)
{
  const SwAscentResult *a = r->ascent;
  g_autofree char *text = NULL, *broken = NULL;

  if (!r->ok)
    {
      text = g_strdup_printf (_("The design cannot be sized: %s"), r->error_message);
      verdict_set (r, SW_VERDICT_INFEASIBLE, text);
      return;
    }
  if (!r->sizing.feasible)
    {
      verdict_set (r, SW_VERDICT_INFEASIBLE, r->sizing.reason);
      return;
    }
  if (r->ascent_pending)
    {
      verdict_set (r, SW_VERDICT_PENDING, _("Simulating the ascent to check the design "
                                            "reaches its orbit…"));
      return;
    }
  if (a != NULL && a->status != SW_ASCENT_REACHED)
    {
      g_autofree char *loss = largest_loss (a);
      if (a->status == SW_ASCENT_SHORT && isfinite (a->delta_v_missing_m_s))
        {
          g_autofree char *miss = sw_format_speed (a->delta_v_missing_m_s);
          if (loss != NULL)
            /* Translators: a speed, then "the largest loss is gravity, 1,234 m/s" */
            text = g_strdup_printf (_("In the simulated ascent the vehicle falls %s short of "
                                      "the orbit; %s."), miss, loss);
          else
            text = g_strdup_printf (_("In the simulated ascent the vehicle falls %s short of "
                                      "the orbit."), miss);
        }
      else if (g_unichar_isupper (g_utf8_get_char_validated (a->reason, -1)))
        /* The core's reason is a sentence of its own ("The vehicle cannot
         * lift off: ..."): not run on after a colon. */
        text = g_strdup_printf (_("The simulated ascent does not reach the orbit. %s"),
                                a->reason);
      else
        text = g_strdup_printf (_("The simulated ascent does not reach the orbit: %s"),
                                a->reason);
      verdict_set (r, SW_VERDICT_SHORT_OF_ORBIT, text);
      return;
    }
  broken = limits_broken (r);
  if (a == NULL)
    {
      g_autofree char *why = NULL;
      if (r->ascent_skipped)
        why = g_strdup (_("the ascent was not simulated on request"));
      else if (r->phase == 2)
        /* The inputs were there, but the simulation failed. */
        why = g_strdup_printf (_("the ascent could not be simulated (%s)"), r->ascent_message);
      else
        why = missing_words (r);
      /* Translators: %s says why there is no simulation */
      text = g_strdup_printf (_("The stages give the required delta-v by the rocket equation, "
                                "but %s. Whether it reaches orbit is not checked."), why);
      /* Without a flight there is no "reaches the orbit, but": a limit the
       * figures already break is said here. */
      if (broken != NULL)
        {
          char *more = g_strconcat (text, " ", broken, NULL);
          g_free (text);
          text = more;
        }
      verdict_set (r, SW_VERDICT_PAPER_ONLY, text);
      return;
    }
  if (broken != NULL)
    {
      /* Translators: %s lists the limits broken */
      text = g_strdup_printf (_("The simulated ascent reaches the orbit, but: %s"), broken);
      verdict_set (r, SW_VERDICT_OVER_LIMIT, text);
      return;
    }
  {
    g_autofree char *margin = sw_format_speed (r->simulated_margin_m_s);
    g_autofree char *orbit = sw_format_distance_km (a->target_altitude_km * 1000.0);
    /* Translators: an altitude such as "400.0 km", then a speed */
    text = g_strdup_printf (_("The simulated ascent reaches the %s orbit with %s of delta-v to "
                              "spare."), orbit, margin);
    verdict_set (r, SW_VERDICT_REACHES_ORBIT, text);
  }
}

/* ---- which losses the trade studies used -------------------------------- */

/* The note of a design whose trade studies use its allowance as given; for a
 * simulate design, says it is the first guess and why. */
static void
note_trade_losses (SwAnalysis *r)
{
  const SwMission *m = &r->design->mission;
  g_autofree char *v = NULL;

  r->trade_losses_note[0] = '\0';
  r->trade_losses_simulated = FALSE;
  r->trade_losses_m_s = m->kind == SW_MISSION_ORBIT ? (m->has_losses ? m->losses_m_s : 0.0)
                                                    : NAN;
  if (m->kind != SW_MISSION_ORBIT || m->loss_model != SW_LOSS_SIMULATE)
    return;
  v = sw_format_speed (r->trade_losses_m_s);
  if (r->ascent_pending)
    /* Translators: %s is a speed such as "1,600 m/s" */
    g_snprintf (r->trade_losses_note, sizeof r->trade_losses_note,
                _("Sensitivities and Monte Carlo use the first-guess allowance of %s of losses "
                  "until the simulated ascent closes the loop."), v);
  else if (r->phase == 2)
    g_snprintf (r->trade_losses_note, sizeof r->trade_losses_note,
                _("Sensitivities and Monte Carlo use the first-guess allowance of %s of losses: "
                  "the closed loop gave no sizing."), v);
  else
    g_snprintf (r->trade_losses_note, sizeof r->trade_losses_note,
                _("Sensitivities and Monte Carlo use the first-guess allowance of %s of losses: "
                  "the ascent was not simulated."), v);
}

/* ---- phase 1: fast ------------------------------------------------------- */

/* Thrust-to-weight per stage from the sized masses, and whether the design
 * has what an ascent needs (if not, the core says which keys). */
static void
prepare_ascent (SwAnalysis *r)
{
  g_autoptr (GError) error = NULL;

  r->has_stage_figures = sw_ascent_stage_figures (r->design, &r->sizing, r->stage_figures,
                                                  NULL);
  if (!sw_ascent_check_inputs (r->design, &error))
    g_strlcpy (r->ascent_message, error->message, sizeof r->ascent_message);
  else if (!r->options.ascent)
    r->ascent_skipped = TRUE;
  else
    r->ascent_pending = TRUE;
}

/* The payload of a vehicle that exists, and its curves (through the phases
 * API, so whatever it flies the curves fly too). */
static void
prepare_performance (SwAnalysis *r, GCancellable *cancellable)
{
  const SwAnalysisOptions *o = &r->options;
  g_autoptr (GError) error = NULL;

  r->has_performance = sw_design_performance (r->design, &r->performance, &error);
  if (!r->has_performance)
    g_strlcpy (r->performance_error, error->message, sizeof r->performance_error);
  sw_payload_curves_compute (r->design, o->payload_altitudes_km, o->n_payload_altitudes,
                             o->payload_inclinations_deg, o->n_payload_inclinations,
                             o->payload_simulate, cancellable, &r->payload_curves);
  /* The core's note says which losses every point uses. */
}

/* After the closed loop of a "loss_model": "simulate" design: the payload
 * capability and the curves again, with the closed loop's losses in place
 * of the first guess (the loop flew this orbit, so its losses are this
 * orbit's; the other points keep them as their allowance, and say so). */
static void
performance_with_loop_losses (SwAnalysis *r, double losses_m_s, GCancellable *cancellable)
{
  g_autoptr (SwDesign) looped = NULL;
  g_autofree char *v = NULL;

  if (!r->has_performance)
    return;
  looped = sw_design_copy (r->design);
  looped->mission.loss_model = SW_LOSS_ALLOWANCE;
  looped->mission.losses_m_s = losses_m_s;
  looped->mission.has_losses = TRUE;
  r->has_performance = sw_design_performance (looped, &r->performance, NULL);
  /* Flown curves fly every point whatever losses they start from. */
  if (r->options.payload_simulate)
    return;
  sw_payload_curves_compute (looped, r->options.payload_altitudes_km,
                             r->options.n_payload_altitudes, r->options.payload_inclinations_deg,
                             r->options.n_payload_inclinations, FALSE, cancellable,
                             &r->payload_curves);
  if (r->payload_curves.applies)
    {
      v = sw_format_speed (losses_m_s);
      /* Translators: %s is a speed such as "2,364 m/s" */
      g_snprintf (r->payload_curves.note, sizeof r->payload_curves.note,
                  _("Every point uses the closed loop's losses of %s at the design's "
                    "altitude, moved at other altitudes by the change in the climb's energy "
                    "(the budget's ideal delta-v counts the orbital speed, not the climb); "
                    "the command line's performance --simulate flies each point instead."),
                  v);
    }
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
prepare_trade (SwAnalysis *r)
{
  const SwDesign *design = r->design;
  g_autoptr (GError) error = NULL;

  r->sensitivity_step = r->options.sensitivity_step;
  /* Both size every perturbed design as sw_size_design does: fixed loads
   * kept, the sized stages (and sized boosters) re-sized.  A vehicle that
   * exists (every load fixed) has a constant liftoff mass: its tables are of
   * the payload capability and the delta-v margin, feasible or not at the
   * nominal payload. */
  r->all_fixed = sw_design_all_fixed (design);
  if (r->sizing.feasible || r->all_fixed)
    r->has_sensitivity = sw_sensitivity_compute (design, r->sensitivity_step, &r->sensitivity,
                                                 NULL)
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
  r->montecarlo_pending = r->options.montecarlo
                          && (r->options.montecarlo_always
                              || sw_uncertainty_has_spread (&design->uncertainty));
}

SwAnalysis *
sw_analysis_new (const SwDesign *design, guint64 serial, const SwAnalysisOptions *options,
                 GCancellable *cancellable)
{
  SwAnalysis *r;
  SwDesign *copy;
  g_autoptr (GError) error = NULL;

  g_return_val_if_fail (design != NULL, NULL);

  r = g_atomic_rc_box_new0 (SwAnalysis);
  r->serial = serial;
  if (options != NULL)
    r->options = *options;
  else
    sw_analysis_options_init (&r->options);
  copy = sw_design_copy (design);
  r->held_design = held_new (copy, (GDestroyNotify) sw_design_free);
  r->design = copy;
  r->simulated_margin_m_s = NAN;
  r->montecarlo_success = NAN;
  r->headroom_m_s = NAN;
  r->trade_losses_m_s = NAN;

  if (!sw_design_validate (design, NULL, &error)
      || !sw_design_required_delta_v (design, &r->delta_v_m_s, &error)
      || !sw_size_design (design, &r->sizing, &error))
    {
      r->ok = FALSE;
      g_strlcpy (r->error_message, error->message, sizeof r->error_message);
      update_verdict (r);
      return r;
    }
  r->ok = TRUE;
  r->headroom_m_s = r->sizing.margin_m_s;
  sw_vehicle_shape_compute (design, &r->sizing, &r->shape);
  sw_mass_estimate_design (design, &r->mass_estimate);
  r->has_budget = design->mission.kind == SW_MISSION_ORBIT
                  && sw_design_budget (design, &r->budget, NULL);
  sw_stage_curve_compute (design, r->delta_v_m_s, SW_MAX_STAGES, &r->stage_curve);
  sw_sweep_compute (design, SW_SWEEP_CURVES, SW_SWEEP_POINTS, &r->sweep);
  prepare_performance (r, cancellable);
  prepare_ascent (r);
  prepare_trade (r);
  note_trade_losses (r);
  update_verdict (r);

  if (g_cancellable_is_cancelled (cancellable))
    {
      sw_analysis_unref (r);
      return NULL;
    }
  return r;
}

SwAnalysis *
sw_analysis_compute (const SwDesign *design, guint64 serial, GCancellable *cancellable)
{
  return sw_analysis_new (design, serial, NULL, cancellable);
}

/* ---- phase 2: Monte Carlo ------------------------------------------------ */

/* The Monte Carlo and its band for @design (the analysis's design, or for a
 * closed loop a copy carrying the closed loop's losses). */
static void
run_montecarlo (SwAnalysis *r, const SwDesign *design, GCancellable *cancellable)
{
  g_autoptr (GError) error = NULL;
  const SwAnalysisOptions *o = &r->options;
  const SwUncertainty *unc = &design->uncertainty;

  r->has_band = FALSE;
  r->montecarlo_success = NAN;
  r->montecarlo_error[0] = '\0';
  /* The core looks at the cancellable before every block of samples, so a
   * newer edit abandons even a million-sample run within a block. */
  r->has_montecarlo = sw_montecarlo_run_cancellable (design, NULL, o->montecarlo_samples,
                                                     o->montecarlo_use_seed, o->montecarlo_seed,
                                                     o->threads, &r->montecarlo, NULL, NULL,
                                                     cancellable, &error);
  if (r->has_montecarlo && r->montecarlo.payload.n > 0)
    r->montecarlo_success = 1.0 - r->montecarlo.p_negative_margin;
  /* A lighter run per stage count: the band is a picture, not a figure. */
  if (r->has_montecarlo && o->band)
    r->has_band = sw_montecarlo_band_cancellable (
      design, NULL, SW_MAX_STAGES,
      MIN (o->montecarlo_samples > 0 ? o->montecarlo_samples : sw_uncertainty_samples (unc),
           o->band_samples),
      o->montecarlo_use_seed ? o->montecarlo_seed : sw_uncertainty_seed (unc), o->threads,
      &r->band, cancellable, &error);
  if (error != NULL)
    g_strlcpy (r->montecarlo_error, error->message, sizeof r->montecarlo_error);
}

SwAnalysis *
sw_analysis_add_montecarlo (const SwAnalysis *prev, GCancellable *cancellable)
{
  SwAnalysis *r;

  g_return_val_if_fail (prev != NULL && prev->ok && prev->montecarlo_pending, NULL);

  r = sw_analysis_copy (prev);
  r->montecarlo_pending = FALSE;
  r->phase = MAX (r->phase, 1);
  if (r->trade_losses_simulated)
    {
      /* The ascent phase came first and closed the loop: its losses. */
      g_autoptr (SwDesign) looped = sw_design_copy (r->design);

      looped->mission.losses_m_s = r->trade_losses_m_s;
      looped->mission.has_losses = TRUE;
      /* ... and its fairing jettison point (sw-sizing.h); not for a vehicle
       * that exists (see sw_analysis_add_ascent). */
      if (r->ascent != NULL && r->ascent->closed_loop && !r->all_fixed)
        sw_ascent_apply_loop (looped, r->ascent);
      run_montecarlo (r, looped, cancellable);
    }
  else
    run_montecarlo (r, r->design, cancellable);
  if (g_cancellable_is_cancelled (cancellable))
    {
      sw_analysis_unref (r);
      return NULL;
    }
  return r;
}

/* ---- phase 3: the ascent ------------------------------------------------- */

SwAnalysis *
sw_analysis_add_ascent (const SwAnalysis *prev, GCancellable *cancellable)
{
  g_autoptr (GError) error = NULL;
  SwAscentResult *ascent;
  SwAnalysis *r;

  g_return_val_if_fail (prev != NULL && prev->ok && prev->ascent_pending, NULL);

  ascent = sw_ascent_fly_design (prev->design, cancellable, &error);
  if (g_cancellable_is_cancelled (cancellable))
    {
      g_clear_pointer (&ascent, sw_ascent_result_free);
      return NULL;
    }

  r = sw_analysis_copy (prev);
  r->ascent_pending = FALSE;
  r->phase = 2;
  if (ascent == NULL)
    {
      g_strlcpy (r->ascent_message, error->message, sizeof r->ascent_message);
      note_trade_losses (r);
      update_verdict (r);
      return r;
    }
  held_unref (r->held_ascent);
  r->held_ascent = held_new (ascent, (GDestroyNotify) sw_ascent_result_free);
  r->ascent = ascent;
  if (ascent->status == SW_ASCENT_REACHED || ascent->status == SW_ASCENT_SHORT)
    r->simulated_margin_m_s = ascent->delta_v_margin_m_s;

  /* The closed loop sized the vehicle with the simulated losses: that
   * vehicle replaces the first guess in every view. */
  if (ascent->closed_loop && ascent->loop_converged && ascent->sizing.feasible
      && ascent->sizing.n_stages == prev->sizing.n_stages)
    {
      r->sizing = ascent->sizing;
      r->delta_v_m_s = ascent->sizing.delta_v_m_s;
      r->headroom_m_s = r->sizing.margin_m_s;
      r->sized_by_ascent = TRUE;
      sw_vehicle_shape_compute (r->design, &r->sizing, &r->shape);
      if (r->has_budget)
        {
          r->budget.losses_m_s = ascent->loop_sized_losses_m_s;
          r->budget.delta_v_m_s = r->budget.ideal_delta_v_m_s + r->budget.losses_m_s;
        }
      sw_stage_curve_compute (r->design, r->delta_v_m_s, SW_MAX_STAGES, &r->stage_curve);
      performance_with_loop_losses (r, ascent->loop_sized_losses_m_s, cancellable);
      compare_with_baseline (r);
      r->has_stage_figures = sw_ascent_stage_figures (r->design, &r->sizing, r->stage_figures,
                                                      NULL);
      /* One loss model everywhere: the trade studies again, with the
       * closed loop's losses (the design as sized by the loop), boosters
       * or not. */
        {
          g_autoptr (SwDesign) looped = sw_design_copy (r->design);
          g_autofree char *v = NULL;

          /* The loop's losses and its fairing jettison point (sw-sizing.h).
           * A vehicle that exists: the losses only, as its payload
           * capability in the totals takes them (performance_with_loop_losses),
           * so that the tables start from the figure shown. */
          if (r->all_fixed)
            {
              looped->mission.losses_m_s = ascent->loop_sized_losses_m_s;
              looped->mission.has_losses = TRUE;
            }
          else
            sw_ascent_apply_loop (looped, ascent);
          /* The estimated coefficients of the vehicle as the loop sized it. */
          sw_mass_estimate_design (looped, &r->mass_estimate);
          r->has_sensitivity = sw_sensitivity_compute (looped, r->sensitivity_step,
                                                       &r->sensitivity, NULL)
                               && r->sensitivity.feasible;
          if (r->has_montecarlo)
            {
              run_montecarlo (r, looped, cancellable);
              if (g_cancellable_is_cancelled (cancellable))
                {
                  sw_analysis_unref (r);
                  return NULL;
                }
            }
          r->trade_losses_m_s = ascent->loop_sized_losses_m_s;
          r->trade_losses_simulated = TRUE;
          v = sw_format_speed (r->trade_losses_m_s);
          /* Translators: %s is a speed such as "1,868.7 m/s" */
          g_snprintf (r->trade_losses_note, sizeof r->trade_losses_note,
                      _("Sensitivities and Monte Carlo use the closed-loop losses of %s."), v);
        }
    }
  else
    note_trade_losses (r);
  update_verdict (r);
  return r;
}

/* ---- all phases ---------------------------------------------------------- */

SwAnalysis *
sw_analysis_run (const SwDesign *design, const SwAnalysisOptions *options,
                 GCancellable *cancellable)
{
  g_autoptr (SwAnalysis) r = sw_analysis_new (design, 0, options, cancellable);

  /* A "simulate" design flies first: the Monte Carlo then runs once, with
   * the closed loop's losses, instead of once with the first guess and
   * again with the loop's (the same figures, half the time; with sized
   * boosters a run of 10,000 samples takes tens of seconds). */
  if (r != NULL && r->montecarlo_pending && r->ascent_pending
      && design->mission.kind == SW_MISSION_ORBIT
      && design->mission.loss_model == SW_LOSS_SIMULATE)
    {
      SwAnalysis *next = sw_analysis_add_ascent (r, cancellable);
      g_clear_pointer (&r, sw_analysis_unref);
      r = next;
    }
  if (r != NULL && r->montecarlo_pending)
    {
      SwAnalysis *next = sw_analysis_add_montecarlo (r, cancellable);
      g_clear_pointer (&r, sw_analysis_unref);
      r = next;
    }
  if (r != NULL && r->ascent_pending)
    {
      SwAnalysis *next = sw_analysis_add_ascent (r, cancellable);
      g_clear_pointer (&r, sw_analysis_unref);
      r = next;
    }
  return g_steal_pointer (&r);
}

/* ---- the design of the trade studies ------------------------------------ */

SwDesign *
sw_analysis_dup_trade_design (const SwAnalysis *analysis)
{
  SwDesign *d;

  g_return_val_if_fail (analysis != NULL && analysis->design != NULL, NULL);

  d = sw_design_copy (analysis->design);
  if (!analysis->trade_losses_simulated)
    return d;
  /* As sw_analysis_add_ascent runs the trades again: the loop's losses,
   * and its fairing point unless the vehicle exists (all loads fixed). */
  d->mission.losses_m_s = analysis->trade_losses_m_s;
  d->mission.has_losses = TRUE;
  if (analysis->ascent != NULL && analysis->ascent->closed_loop && !analysis->all_fixed)
    sw_ascent_apply_loop (d, analysis->ascent);
  return d;
}

gboolean
sw_analysis_staging (const SwAnalysis *analysis, guint max_stages, SwStaging *out,
                     GError **error)
{
  g_autoptr (SwDesign) d = NULL;

  g_return_val_if_fail (analysis != NULL && analysis->design != NULL && out != NULL, FALSE);

  d = sw_analysis_dup_trade_design (analysis);
  return analysis->trade_losses_simulated ? sw_staging_compute_looped (d, max_stages, out, error)
                                          : sw_staging_compute (d, max_stages, out, error);
}

SwCarpet *
sw_analysis_carpet (const SwAnalysis *analysis, const SwCarpetOptions *options, GError **error)
{
  g_autoptr (SwDesign) d = NULL;

  g_return_val_if_fail (analysis != NULL && analysis->design != NULL && options != NULL, NULL);

  d = sw_analysis_dup_trade_design (analysis);
  return analysis->trade_losses_simulated ? sw_carpet_compute_looped (d, options, error)
                                          : sw_carpet_compute (d, options, error);
}
