/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-sheet"

#include "config.h"

#include "sw-briefing.h"

#include <glib/gi18n-lib.h>
#include <math.h>
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
  if (!sw_design_size (design, &b->sizing, error))
    return NULL;
  b->delta_v_m_s = b->sizing.delta_v_m_s;
  sw_stage_curve_compute (design, b->delta_v_m_s, SW_MAX_STAGES, &b->stage_curve);
  sw_sweep_compute (design, SW_SWEEP_CURVES, SW_SWEEP_POINTS, &b->sweep);

  if (design->baseline != NULL)
    {
      double dv;

      if (!sw_design_size (design->baseline, &b->baseline_sizing, error)
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

  sw_design_reliability (design, &b->reliability);
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

void
sw_briefing_fill_ascent (SwBriefing *b)
{
  g_return_if_fail (b != NULL);

  /* ASCENT HOOK: the ascent model (sw-ascent.h) is not part of the build
   * yet.  When it is, run it here for designs whose mission has
   * loss_model "simulate" and fill b->ascent[] with label/value pairs
   * (losses by kind, max-Q, burnout conditions); the sheet draws whatever
   * lines are present. */
  b->n_ascent = 0;
  if (b->design->mission.kind == SW_MISSION_ORBIT
      && b->design->mission.loss_model == SW_LOSS_SIMULATE)
    g_strlcpy (b->ascent_note, _("Ascent simulation requested but not available in this build."),
               sizeof b->ascent_note);
  else
    b->ascent_note[0] = '\0';
}
