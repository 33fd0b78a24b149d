/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-sheet"

#include "config.h"

#include "sw-briefing.h"

#include "sw-ascent.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <stdarg.h>
#include <string.h>

SwBriefing *
sw_briefing_new (const SwDesign *design, SwBriefingFlags flags, guint threads, GError **error)
{
  g_autoptr (SwBriefing) b = g_new0 (SwBriefing, 1);
  g_autoptr (GDateTime) now = g_date_time_new_now_local ();
  g_autofree char *date = g_date_time_format (now, "%Y-%m-%d");

  g_return_val_if_fail (design != NULL, NULL);

  b->design = sw_design_copy (design);
  g_strlcpy (b->date, date, sizeof b->date);
  if (!sw_size_design (design, &b->sizing, error))
    return NULL;
  b->delta_v_m_s = b->sizing.delta_v_m_s;
  sw_stage_curve_compute (design, b->delta_v_m_s, SW_MAX_STAGES, &b->stage_curve);
  sw_sweep_compute (design, SW_SWEEP_CURVES, SW_SWEEP_POINTS, &b->sweep);

  if (design->baseline != NULL)
    {
      double dv;

      if (!sw_size_design (design->baseline, &b->baseline_sizing, error)
          || !sw_design_required_delta_v (design->baseline, &dv, error))
        return NULL;
      sw_stage_curve_compute (design->baseline, dv, SW_MAX_STAGES, &b->baseline_curve);
      sw_comparison_from_sizings (&b->sizing, &b->baseline_sizing, &b->comparison);
      b->has_baseline = TRUE;
    }

  if (b->sizing.feasible)
    {
      if (!sw_sensitivity_compute (design, SW_SENSITIVITY_DEFAULT_STEP, &b->sensitivity, error))
        return NULL;
      b->has_sensitivity = TRUE;
    }

  sw_reliability_from_design (design, &b->reliability);
  sw_reliability_curve_compute (design, SW_MAX_STAGES, &b->reliability_curve);
  b->has_reliability = b->reliability.given;

  if ((flags & SW_BRIEFING_MONTECARLO) && sw_uncertainty_has_spread (&design->uncertainty))
    {
      if (!sw_montecarlo_run (design, NULL, 0, FALSE, 0, threads, &b->montecarlo, NULL, NULL,
                              error))
        return NULL;
      b->has_montecarlo = TRUE;
      if (flags & SW_BRIEFING_BAND)
        {
          /* A lighter run per stage count: the band is a picture, not a figure. */
          guint n = MIN (sw_uncertainty_samples (&design->uncertainty), 2000);
          if (!sw_montecarlo_band (design, NULL, SW_MAX_STAGES, n,
                                   sw_uncertainty_seed (&design->uncertainty), threads,
                                   &b->band, error))
            return NULL;
          b->has_band = TRUE;
        }
    }

  sw_briefing_fill_ascent (b);
  return g_steal_pointer (&b);
}

void
sw_briefing_free (SwBriefing *briefing)
{
  if (briefing == NULL)
    return;
  sw_design_free (briefing->design);
  g_free (briefing);
}

static void
add_line (SwBriefing *b, const char *label, const char *fmt, ...) G_GNUC_PRINTF (3, 4);

static void
add_line (SwBriefing *b, const char *label, const char *fmt, ...)
{
  va_list args;

  if (b->n_ascent >= SW_BRIEFING_MAX_LINES)
    return;
  g_strlcpy (b->ascent[b->n_ascent].label, label, SW_BRIEFING_TEXT);
  va_start (args, fmt);
  g_vsnprintf (b->ascent[b->n_ascent].value, SW_BRIEFING_TEXT, fmt, args);
  va_end (args);
  b->n_ascent++;
}

void
sw_briefing_fill_ascent (SwBriefing *b)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (SwAscentResult) r = NULL;

  g_return_if_fail (b != NULL);

  b->n_ascent = 0;
  b->ascent_note[0] = '\0';
  /* Only designs that carry the ascent inputs (thrust, diameter, an orbit)
   * are flown; the others say nothing unless they asked for simulated losses. */
  if (!b->sizing.feasible || !sw_ascent_check_inputs (b->design, &error))
    {
      if (b->design->mission.kind == SW_MISSION_ORBIT
          && b->design->mission.loss_model == SW_LOSS_SIMULATE)
        g_snprintf (b->ascent_note, sizeof b->ascent_note, _("Ascent not simulated: %s"),
                    error != NULL ? error->message : _("the design is infeasible."));
      return;
    }
  r = sw_ascent_fly_design (b->design, NULL, &error);
  if (r == NULL)
    {
      g_snprintf (b->ascent_note, sizeof b->ascent_note, _("Ascent not simulated: %s"),
                  error->message);
      return;
    }
  switch (r->status)
    {
    case SW_ASCENT_REACHED:
      add_line (b, _("Ascent"), _("orbit reached, %.0f m/s spare"), r->delta_v_margin_m_s);
      break;
    case SW_ASCENT_SHORT:
      add_line (b, _("Ascent"), _("short by %.0f m/s"), r->delta_v_missing_m_s);
      break;
    case SW_ASCENT_NO_SOLUTION:
    case SW_ASCENT_NOT_SIMULATED:
    case SW_ASCENT_UNGUIDED:
    default:
      add_line (b, _("Ascent"), "%s", _("no orbit"));
      g_strlcpy (b->ascent_note, r->reason, sizeof b->ascent_note);
      return;
    }
  add_line (b, _("Simulated losses"), _("%.0f m/s (gravity %.0f, drag %.0f)"), r->losses_m_s,
            r->gravity_loss_m_s, r->drag_loss_m_s);
  if (isfinite (r->max_q_pa))
    add_line (b, _("Max-Q"), _("%.1f kPa at %.0f s, %.1f km"), r->max_q_pa / 1000.0,
              r->max_q_time_s, r->max_q_altitude_m / 1000.0);
  if (isfinite (r->liftoff_thrust_to_weight))
    add_line (b, _("Liftoff T/W; max accel."), _("%.2f; %.1f g"), r->liftoff_thrust_to_weight,
              r->max_axial_g);
}
