/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-comparison"

#include "config.h"

#include "sw-comparison.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

void
sw_delta_set (SwDelta *d, double current, double baseline)
{
  d->current = current;
  d->baseline = baseline;
  d->delta = isfinite (current) && isfinite (baseline) ? current - baseline : NAN;
  d->percent = isfinite (d->delta) && baseline != 0.0 ? 100.0 * d->delta / fabs (baseline)
                                                      : NAN;
}

double
sw_sizing_total (const SwSizing *s, SwTotal total)
{
  double sum = 0.0;

  switch (total)
    {
    case SW_TOTAL_LIFTOFF_MASS:
      return s->feasible ? s->liftoff_mass_kg : NAN;
    case SW_TOTAL_PAYLOAD:
      return s->payload_kg;
    case SW_TOTAL_PAYLOAD_FRACTION:
      return s->feasible ? s->payload_fraction : NAN;
    case SW_TOTAL_DELTA_V:
      return s->delta_v_m_s;
    case SW_TOTAL_DELTA_V_LIMIT:
      return s->delta_v_limit_m_s;
    case SW_TOTAL_PROPELLANT:
    case SW_TOTAL_STRUCTURE:
      if (!s->feasible)
        return NAN;
      for (guint i = 0; i < s->n_stages; i++)
        sum += total == SW_TOTAL_PROPELLANT ? s->stages[i].propellant_mass_kg
                                            : s->stages[i].structural_mass_kg;
      /* The boosters' too: the totals add up to the liftoff mass. */
      if (s->boosters.present)
        sum += s->boosters.count * (total == SW_TOTAL_PROPELLANT
                                      ? s->boosters.propellant_mass_kg
                                      : s->boosters.structural_mass_kg);
      return sum;
    case SW_TOTAL_STAGE_COUNT:
      return s->n_stages;
    case SW_N_TOTALS:
    default:
      return NAN;
    }
}

void
sw_comparison_from_sizings (const SwSizing *current, const SwSizing *baseline, SwComparison *out)
{
  g_return_if_fail (current != NULL && out != NULL);

  memset (out, 0, sizeof *out);
  out->has_baseline = baseline != NULL;
  out->current_feasible = current->feasible;
  out->baseline_feasible = baseline != NULL && baseline->feasible;
  for (guint t = 0; t < SW_N_TOTALS; t++)
    sw_delta_set (&out->totals[t], sw_sizing_total (current, t),
                  baseline != NULL ? sw_sizing_total (baseline, t) : NAN);
}

gboolean
sw_comparison_from_design (const SwDesign *design, SwComparison *out, GError **error)
{
  SwSizing current, baseline;

  g_return_val_if_fail (design != NULL && out != NULL, FALSE);

  if (!sw_size_design (design, &current, error))
    return FALSE;
  if (design->baseline == NULL)
    {
      sw_comparison_from_sizings (&current, NULL, out);
      return TRUE;
    }
  if (!sw_size_design (design->baseline, &baseline, error))
    return FALSE;
  sw_comparison_from_sizings (&current, &baseline, out);
  return TRUE;
}

const char *
sw_total_label (SwTotal total)
{
  switch (total)
    {
    case SW_TOTAL_LIFTOFF_MASS:
      return _("Liftoff mass");
    case SW_TOTAL_PAYLOAD:
      return _("Payload");
    case SW_TOTAL_PAYLOAD_FRACTION:
      return _("Payload fraction");
    case SW_TOTAL_DELTA_V:
      return _("Required delta-v");
    case SW_TOTAL_DELTA_V_LIMIT:
      return _("Delta-v limit");
    case SW_TOTAL_PROPELLANT:
      return _("Propellant");
    case SW_TOTAL_STRUCTURE:
      return _("Structure");
    case SW_TOTAL_STAGE_COUNT:
      return _("Stages");
    case SW_N_TOTALS:
    default:
      return "";
    }
}

const char *
sw_total_key (SwTotal total)
{
  static const char *const keys[SW_N_TOTALS] = {
    "liftoff_mass_kg", "payload_kg", "payload_fraction", "delta_v_m_s", "delta_v_limit_m_s",
    "propellant_mass_kg", "structural_mass_kg", "stages",
  };
  return total < SW_N_TOTALS ? keys[total] : "";
}
