/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-curves"

#include "config.h"

#include "sw-curves.h"

#include "sw-booster-sizing.h"

#include <glib/gi18n-lib.h>
#include <math.h>

guint
sw_fixed_stages_text (const SwDesign *design, gboolean names, char *buf, gsize size)
{
  guint idx[SW_MAX_STAGES], n = 0;
  g_autoptr (GString) s = g_string_new (NULL);

  for (guint i = 0; i < design->n_stages && i < SW_MAX_STAGES; i++)
    if (design->stages[i].propellant.has_propellant_kg)
      idx[n++] = i;
  for (guint k = 0; k < n; k++)
    {
      if (k > 0)
        /* Translators: between the last two items of a list of stages */
        g_string_append (s, k + 1 == n ? _(" and ") : ", ");
      if (names)
        g_string_append_printf (s, "%u (%s)", idx[k] + 1, design->stages[idx[k]].name);
      else
        g_string_append_printf (s, "%u", idx[k] + 1);
    }
  g_strlcpy (buf, s->str, size);
  return n;
}

void
sw_curves_fixed_note (const SwDesign *design, char *note)
{
  char list[SW_FIXED_NOTE_MAX];
  guint n = sw_fixed_stages_text (design, TRUE, list, sizeof list);

  note[0] = '\0';
  if (n == 1)
    /* Translators: %s is a stage number and its name, "2 (Upper stage)" */
    g_snprintf (note, SW_FIXED_NOTE_MAX,
                _("These curves size every stage from the payload up; the fixed "
                  "propellant load of stage %s is not applied, since a vehicle with "
                  "another stage count or delta-v has no such stage."), list);
  else if (n > 1)
    /* Translators: %s is a list of stage numbers with their names,
     * "1 (First stage) and 2 (Upper stage)" */
    g_snprintf (note, SW_FIXED_NOTE_MAX,
                _("These curves size every stage from the payload up; the fixed "
                  "propellant loads of stages %s are not applied, since a vehicle with "
                  "another stage count or delta-v has no such stages."), list);
}

void
sw_stage_curve_compute (const SwDesign *design, double delta_v_m_s, guint max_stages,
                        SwStageCurve *out)
{
  g_return_if_fail (design != NULL && out != NULL && design->n_stages > 0);

  max_stages = CLAMP (max_stages, 1, SW_MAX_STAGES);
  sw_curves_fixed_note (design, out->note);
  out->delta_v_m_s = delta_v_m_s;
  out->payload_kg = design->payload_kg;
  out->n_points = max_stages;
  for (guint n = 1; n <= max_stages; n++)
    {
      SwStageSet set;
      SwSizing sizing;
      SwStageCountPoint *p = &out->points[n - 1];

      sw_stage_set_extend (&set, design, n);
      sw_size (&set, design->payload_kg, delta_v_m_s, SW_SPLIT_OPTIMAL, &sizing);
      p->stages = n;
      p->feasible = sizing.feasible;
      p->liftoff_mass_kg = sizing.feasible ? sizing.liftoff_mass_kg : NAN;
      p->delta_v_limit_m_s = sizing.delta_v_limit_m_s;
    }
  out->booster_count = 0;
  out->booster_note[0] = '\0';
  if (design->boosters.count > 0)
    {
      SwParallelVehicle v;
      g_autoptr (GString) away = g_string_new (NULL);

      /* Without the core's thrust the design does not size: no curve. */
      if (!sw_parallel_vehicle_from_design (&v, design, NULL))
        return;
      out->booster_count = v.count;
      g_snprintf (out->booster_note, sizeof out->booster_note,
                  g_dngettext (GETTEXT_PACKAGE,
                               "The stage-count curve is drawn twice: with this design's %u "
                               "booster beside the core (this design sits on it) and for "
                               "serial stages without it. The delta-v curves are serial "
                               "vehicles only: this design's point lies off them.",
                               "The stage-count curve is drawn twice: with this design's %u "
                               "boosters beside the core (this design sits on it) and for "
                               "serial stages without them. The delta-v curves are serial "
                               "vehicles only: this design's point lies off them.",
                               v.count),
                  v.count);
      for (guint i = 0; i < SW_MAX_STAGES; i++)
        v.fixed_kg[i] = 0.0;
      for (guint n = 1; n <= max_stages; n++)
        {
          SwSizing sizing;
          SwStageCountPoint *p = &out->booster_points[n - 1];

          sw_stage_set_extend (&v.set, design, n);
          sw_size_parallel (&v, design->payload_kg, delta_v_m_s, SW_SPLIT_OPTIMAL, &sizing);
          p->stages = n;
          p->feasible = sizing.feasible;
          p->liftoff_mass_kg = sizing.feasible ? sizing.liftoff_mass_kg : NAN;
          p->delta_v_limit_m_s = sizing.delta_v_limit_m_s;
          if (sizing.boosters.optimised_away)
            g_string_append_printf (away, "%s%u", away->len > 0 ? ", " : "", n);
        }
      if (away->len > 0)
        {
          char text[SW_REASON_MAX];

          /* Translators: %s is a list of stage counts ("3, 4, 5") */
          g_snprintf (text, sizeof text,
                      _("At %s stages the sized boosters are optimised away (the lightest "
                        "vehicle gives them no propellant): the curve with boosters has no "
                        "point there."), away->str);
          g_strlcat (out->booster_note, " ", sizeof out->booster_note);
          g_strlcat (out->booster_note, text, sizeof out->booster_note);
        }
    }
}

/* The optimal vehicle traced along its Lagrange multiplier: with x = 1/eta
 * every stage's mass ratio is n_i = (1 - x/c_i)/eps_i (at least 1), so each x
 * gives an exact optimum (delta-v, liftoff mass) pair without a root search.
 * x runs from max c_i(1 - eps_i) (zero delta-v) down towards 0 (the limit);
 * quadratic spacing puts more points near the asymptote. */
void
sw_sweep_compute (const SwDesign *design, guint max_curves, guint n_points, SwSweep *out)
{
  g_return_if_fail (design != NULL && out != NULL && design->n_stages > 0);

  max_curves = CLAMP (max_curves, 1, SW_SWEEP_CURVES);
  n_points = CLAMP (n_points, 2, SW_SWEEP_POINTS);
  sw_curves_fixed_note (design, out->note);
  out->payload_kg = design->payload_kg;
  out->n_curves = max_curves;

  for (guint n = 1; n <= max_curves; n++)
    {
      SwSweepCurve *curve = &out->curves[n - 1];
      SwStageSet set;
      double x_max = 0.0;

      sw_stage_set_extend (&set, design, n);
      curve->stages = n;
      curve->n_points = n_points;
      curve->delta_v_limit_m_s = 0.0;
      for (guint i = 0; i < n; i++)
        {
          double c = set.exhaust_velocity_m_s[i], eps = set.structural_coefficient[i];
          curve->delta_v_limit_m_s += c * log (1.0 / eps);
          x_max = MAX (x_max, c * (1.0 - eps));
        }

      for (guint j = 0; j < n_points; j++)
        {
          /* t from 0 to 0.99: x from x_max to 1e-4 x_max. */
          double t = 0.99 * j / (n_points - 1);
          double x = x_max * (1.0 - t) * (1.0 - t);
          double dv = 0.0, m = design->payload_kg;

          for (int i = (int) n - 1; i >= 0; i--)
            {
              double c = set.exhaust_velocity_m_s[i], eps = set.structural_coefficient[i];
              double nr = (1.0 - x / c) / eps;
              if (nr <= 1.0)
                continue;
              dv += c * log (nr);
              m *= nr * (1.0 - eps) / (1.0 - nr * eps);
            }
          curve->delta_v_m_s[j] = dv;
          curve->liftoff_mass_kg[j] = m;
        }
    }
}
