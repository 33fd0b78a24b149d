/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-result"

#include "config.h"

#include "sw-result.h"

#include <math.h>

G_DEFINE_BOXED_TYPE (SwResult, sw_result, sw_result_ref, sw_result_unref)

static void
result_clear (gpointer data)
{
  SwResult *r = data;

  sw_design_free (r->design);
  g_free (r->error_message);
}

SwResult *
sw_result_compute (const SwDesign *design, guint64 serial, GCancellable *cancellable)
{
  SwResult *r;
  g_autoptr (GError) error = NULL;

  g_return_val_if_fail (design != NULL, NULL);

  r = g_atomic_rc_box_new0 (SwResult);
  r->serial = serial;
  r->design = sw_design_copy (design);

  if (!sw_design_validate (design, NULL, &error)
      || !sw_design_required_delta_v (design, &r->delta_v_m_s, &error)
      || !sw_design_size (design, &r->sizing, &error))
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

  if (g_cancellable_is_cancelled (cancellable))
    {
      sw_result_unref (r);
      return NULL;
    }
  return r;
}

SwResult *
sw_result_ref (SwResult *result)
{
  return g_atomic_rc_box_acquire (result);
}

void
sw_result_unref (SwResult *result)
{
  g_atomic_rc_box_release_full (result, result_clear);
}

void
sw_result_apply_shares (const SwResult *result, SwDesign *design)
{
  guint n;
  double sum = 0.0;
  gboolean usable;

  g_return_if_fail (design != NULL && design->n_stages > 0);

  n = design->n_stages;
  usable = result != NULL && result->ok && result->sizing.n_stages == n
           && result->sizing.delta_v_m_s > 0.0;
  for (guint i = 0; usable && i < n; i++)
    {
      double share = result->sizing.stages[i].delta_v_share;
      usable = isfinite (share) && share >= 0.0;
      sum += usable ? share : 0.0;
    }
  usable = usable && sum > 0.5;
  for (guint i = 0; i < n; i++)
    {
      design->stages[i].delta_v_share = usable ? result->sizing.stages[i].delta_v_share / sum
                                               : 1.0 / n;
      design->stages[i].has_share = TRUE;
    }
  design->split = SW_SPLIT_MANUAL;
}
