/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-reliability"

#include "config.h"

#include "sw-reliability.h"

#include "sw-design.h"

#include <glib/gi18n-lib.h>
#include <gsl/gsl_cdf.h>
#include <math.h>
#include <string.h>

double
sw_reliability_engines (guint n, double r, guint tolerated)
{
  g_return_val_if_fail (n > 0, NAN);

  if (tolerated >= n)
    return 1.0;
  if (r >= 1.0)
    return 1.0;
  /* The number of failed engines is binomial (n, 1 - r). */
  return gsl_cdf_binomial_P (tolerated, 1.0 - r, n);
}

double
sw_reliability_stage (const SwReliabilityInputs *in)
{
  return in->ignition_reliability
         * sw_reliability_engines (in->engine_count, in->engine_reliability,
                                   in->failures_tolerated);
}

static void
vehicle_reliability (const SwDesign *design, guint n_stages, SwReliability *out)
{
  memset (out, 0, sizeof *out);
  out->n_stages = n_stages;
  out->mission = 1.0;
  for (guint k = 0; k < n_stages; k++)
    {
      const SwStage *src = &design->stages[MIN (k, design->n_stages - 1)];
      SwReliabilityInputs in;

      sw_reliability_inputs (&src->reliability, &in);
      out->given = out->given || src->reliability.present;
      out->engines[k] = sw_reliability_engines (in.engine_count, in.engine_reliability,
                                                in.failures_tolerated);
      out->stage[k] = in.ignition_reliability * out->engines[k];
      out->separation[k] = k + 1 < n_stages ? in.separation_reliability : 1.0;
      out->mission *= out->stage[k] * out->separation[k];
    }
}

void
sw_reliability_from_design (const SwDesign *design, SwReliability *out)
{
  g_return_if_fail (design != NULL && out != NULL && design->n_stages > 0);
  vehicle_reliability (design, MIN (design->n_stages, SW_MAX_STAGES), out);
}

void
sw_reliability_curve_compute (const SwDesign *design, guint max_stages, SwReliabilityCurve *out)
{
  g_return_if_fail (design != NULL && out != NULL && design->n_stages > 0);

  max_stages = CLAMP (max_stages, 1, SW_MAX_STAGES);
  out->n_points = max_stages;
  out->given = FALSE;
  for (guint i = 0; i < design->n_stages; i++)
    out->given = out->given || design->stages[i].reliability.present;
  for (guint n = 1; n <= max_stages; n++)
    {
      SwReliability r;
      vehicle_reliability (design, n, &r);
      out->mission[n - 1] = r.mission;
    }
}
