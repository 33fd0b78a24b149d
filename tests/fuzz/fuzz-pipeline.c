/* SPDX-License-Identifier: GPL-3.0-or-later */
/* libFuzzer harness: the whole pipeline on any design that loads: sizing,
 * stage-count curve, delta-v sweep, budget and, for designs with thrust on an
 * orbit mission, the guided ascent (libFuzzer's -timeout bounds each input).  No output may be NaN where a
 * number is promised. */
#include "config.h"

#include "sw-ascent.h"
#include "sw-budget.h"
#include "sw-curves.h"
#include "sw-design.h"
#include "sw-sizing.h"

#include <math.h>
#include <stdint.h>

int LLVMFuzzerTestOneInput (const uint8_t *data, size_t size);

#define CHECK(cond) do { if (!(cond)) __builtin_trap (); } while (0)

int
LLVMFuzzerTestOneInput (const uint8_t *data, size_t size)
{
  g_autoptr (SwDesign) d = sw_design_load_data ((const char *) data, (gssize) size, "fuzz",
                                                NULL, NULL);
  SwSizing s;
  SwStageCurve curve;
  SwBudget budget;
  SwSweep *sweep;
  double dv;

  if (d == NULL)
    return 0;
  CHECK (sw_design_required_delta_v (d, &dv, NULL));
  CHECK (isfinite (dv));
  CHECK (sw_size_design (d, &s, NULL));
  CHECK (isfinite (s.delta_v_limit_m_s));
  if (s.feasible)
    {
      CHECK (isfinite (s.liftoff_mass_kg) && s.liftoff_mass_kg >= d->payload_kg);
      for (guint i = 0; i < s.n_stages; i++)
        CHECK (isfinite (s.stages[i].propellant_mass_kg) && s.stages[i].propellant_mass_kg >= 0
               && isfinite (s.stages[i].structural_mass_kg));
    }
  else
    CHECK (s.reason[0] != '\0');

  sw_stage_curve_compute (d, dv, SW_MAX_STAGES, &curve);
  for (guint i = 0; i < curve.n_points; i++)
    CHECK (curve.points[i].feasible ? isfinite (curve.points[i].liftoff_mass_kg)
                                    : isnan (curve.points[i].liftoff_mass_kg));

  sweep = g_new (SwSweep, 1);
  sw_sweep_compute (d, SW_SWEEP_CURVES, SW_SWEEP_POINTS, sweep);
  for (guint c = 0; c < sweep->n_curves; c++)
    for (guint j = 0; j < sweep->curves[c].n_points; j++)
      CHECK (isfinite (sweep->curves[c].delta_v_m_s[j])
             && !isnan (sweep->curves[c].liftoff_mass_kg[j]));
  g_free (sweep);

  if (d->mission.kind == SW_MISSION_ORBIT)
    {
      CHECK (sw_design_budget (d, &budget, NULL));
      CHECK (isfinite (budget.delta_v_m_s));
    }

  {
    g_autoptr (GError) error = NULL;
    g_autoptr (SwAscentResult) ascent = sw_ascent_fly_design (d, NULL, &error);

    if (ascent == NULL)
      CHECK (error != NULL && error->message[0] != '\0');
    else if (ascent->reached_orbit)
      CHECK (isfinite (ascent->losses_m_s) && isfinite (ascent->gravity_loss_m_s)
             && isfinite (ascent->drag_loss_m_s) && isfinite (ascent->max_q_pa)
             && isfinite (ascent->max_axial_g));
    else
      CHECK (ascent->reason[0] != '\0');
  }
  return 0;
}
