/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-carpet"

#include "config.h"

#include "sw-carpet.h"

#include "sw-budget.h"
#include "sw-cost.h"
#include "sw-limits.h"
#include "sw-sizing.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <stdio.h>
#include <string.h>

#define PARAM_LIST "payload_kg, mission.delta_v_m_s, mission.losses_m_s, " \
                   "stages[N].isp_vac_s, stages[N].structural_coefficient"

gboolean
sw_carpet_param_parse (const char *text, const SwDesign *design, SwCarpetAxis *axis,
                       GError **error)
{
  unsigned stage = 0;
  char key[64] = "";
  int consumed = 0;

  g_return_val_if_fail (text != NULL && design != NULL && axis != NULL, FALSE);

  axis->stage = 0;
  if (strcmp (text, "payload_kg") == 0)
    axis->kind = SW_CARPET_PARAM_PAYLOAD;
  else if (strcmp (text, "mission.delta_v_m_s") == 0)
    axis->kind = SW_CARPET_PARAM_DELTA_V;
  else if (strcmp (text, "mission.losses_m_s") == 0)
    axis->kind = SW_CARPET_PARAM_LOSSES;
  else if (sscanf (text, "stages[%u].%63[a-z_]%n", &stage, key, &consumed) == 2
           && text[consumed] == '\0'
           && (strcmp (key, "isp_vac_s") == 0 || strcmp (key, "structural_coefficient") == 0))
    {
      if (stage >= design->n_stages)
        {
          g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
                       _("%s: the design has %u stages, numbered from 0"), text,
                       design->n_stages);
          return FALSE;
        }
      axis->stage = stage;
      axis->kind = strcmp (key, "isp_vac_s") == 0 ? SW_CARPET_PARAM_ISP_VAC
                                                  : SW_CARPET_PARAM_STRUCTURAL_COEFFICIENT;
    }
  else
    {
      g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
                   _("%s: not a parameter of the carpet plot; use one of %s"), text, PARAM_LIST);
      return FALSE;
    }
  if (axis->kind == SW_CARPET_PARAM_DELTA_V && design->mission.kind != SW_MISSION_DELTA_V)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
                   _("%s: the design's mission is an orbit; vary mission.losses_m_s instead"),
                   text);
      return FALSE;
    }
  if (axis->kind == SW_CARPET_PARAM_LOSSES && design->mission.kind != SW_MISSION_ORBIT)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
                   _("%s: the design's mission is a delta-v; vary mission.delta_v_m_s instead"),
                   text);
      return FALSE;
    }
  return TRUE;
}

char *
sw_carpet_param_dup_name (const SwCarpetAxis *axis)
{
  switch (axis->kind)
    {
    case SW_CARPET_PARAM_PAYLOAD:
      return g_strdup ("payload_kg");
    case SW_CARPET_PARAM_DELTA_V:
      return g_strdup ("mission.delta_v_m_s");
    case SW_CARPET_PARAM_LOSSES:
      return g_strdup ("mission.losses_m_s");
    case SW_CARPET_PARAM_ISP_VAC:
      return g_strdup_printf ("stages[%u].isp_vac_s", axis->stage);
    case SW_CARPET_PARAM_STRUCTURAL_COEFFICIENT:
    default:
      return g_strdup_printf ("stages[%u].structural_coefficient", axis->stage);
    }
}

char *
sw_carpet_param_dup_label (const SwCarpetAxis *axis)
{
  switch (axis->kind)
    {
    case SW_CARPET_PARAM_PAYLOAD:
      return g_strdup (_("Payload"));
    case SW_CARPET_PARAM_DELTA_V:
      return g_strdup (_("Mission delta-v"));
    case SW_CARPET_PARAM_LOSSES:
      return g_strdup (_("Loss allowance"));
    case SW_CARPET_PARAM_ISP_VAC:
      return g_strdup_printf (_("Vacuum Isp, stage %u"), axis->stage + 1);
    case SW_CARPET_PARAM_STRUCTURAL_COEFFICIENT:
    default:
      return g_strdup_printf (_("Structural coefficient, stage %u"), axis->stage + 1);
    }
}

static const char *const output_names[] = {
  [SW_CARPET_LIFTOFF_MASS] = "liftoff_mass",
  [SW_CARPET_PAYLOAD] = "payload",
  [SW_CARPET_DEVELOPMENT] = "development",
  [SW_CARPET_COST_PER_FLIGHT] = "cost_per_flight",
};

const char *
sw_carpet_output_to_string (SwCarpetOutput output)
{
  return output <= SW_CARPET_COST_PER_FLIGHT ? output_names[output] : "liftoff_mass";
}

gboolean
sw_carpet_output_from_string (const char *text, SwCarpetOutput *output)
{
  for (guint i = 0; i < G_N_ELEMENTS (output_names); i++)
    if (g_strcmp0 (text, output_names[i]) == 0)
      {
        *output = (SwCarpetOutput) i;
        return TRUE;
      }
  return FALSE;
}

static SwLimitId
axis_limit (const SwCarpetAxis *axis)
{
  switch (axis->kind)
    {
    case SW_CARPET_PARAM_PAYLOAD:
      return SW_LIMIT_PAYLOAD;
    case SW_CARPET_PARAM_DELTA_V:
      return SW_LIMIT_DELTA_V;
    case SW_CARPET_PARAM_LOSSES:
      return SW_LIMIT_LOSSES;
    case SW_CARPET_PARAM_ISP_VAC:
      return SW_LIMIT_ISP_VAC;
    case SW_CARPET_PARAM_STRUCTURAL_COEFFICIENT:
    default:
      return SW_LIMIT_STRUCTURAL_COEFFICIENT;
    }
}

gboolean
sw_carpet_axis_check (const SwCarpetAxis *axis, const SwDesign *design, GError **error)
{
  g_autofree char *name = sw_carpet_param_dup_name (axis);
  SwLimitId id = axis_limit (axis);
  const SwLimit *l = sw_limit_get (id);

  if (axis->n < 2 || axis->n > SW_CARPET_MAX_POINTS)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
                   _("%s: %u points; a carpet axis has 2 to %u"), name, axis->n,
                   SW_CARPET_MAX_POINTS);
      return FALSE;
    }
  if (!(axis->min < axis->max))
    {
      g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
                   _("%s: the range %g to %g is empty; give the smaller value first"), name,
                   axis->min, axis->max);
      return FALSE;
    }
  if (!sw_limit_contains (id, axis->min) || !sw_limit_contains (id, axis->max))
    {
      g_set_error (error, SW_ERROR, SW_ERROR_RANGE,
                   _("%s: the range %g to %g leaves the accepted range %s%.10g to %.10g%s%s"),
                   name, axis->min, axis->max, l->min_exclusive ? _("above ") : "", l->min,
                   l->max, l->unit[0] ? " " : "", l->unit);
      return FALSE;
    }
  if (axis->kind == SW_CARPET_PARAM_ISP_VAC && design->stages[axis->stage].has_isp_sl
      && axis->min < design->stages[axis->stage].isp_sl_s)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_RANGE,
                   _("%s: the range starts below the stage's sea-level Isp of %g s"), name,
                   design->stages[axis->stage].isp_sl_s);
      return FALSE;
    }
  return TRUE;
}

double
sw_carpet_axis_value (const SwCarpetAxis *axis, guint i)
{
  if (axis->n < 2)
    return axis->min;
  if (i + 1 >= axis->n)
    return axis->max;
  return axis->min + (axis->max - axis->min) * i / (axis->n - 1);
}

double
sw_carpet_design_value (const SwCarpetAxis *axis, const SwDesign *design)
{
  switch (axis->kind)
    {
    case SW_CARPET_PARAM_PAYLOAD:
      return design->payload_kg;
    case SW_CARPET_PARAM_DELTA_V:
      return design->mission.delta_v_m_s;
    case SW_CARPET_PARAM_LOSSES:
      {
        SwBudget budget;
        return sw_design_budget (design, &budget, NULL) ? budget.losses_m_s : NAN;
      }
    case SW_CARPET_PARAM_ISP_VAC:
      return design->stages[axis->stage].isp_vac_s;
    case SW_CARPET_PARAM_STRUCTURAL_COEFFICIENT:
    default:
      return design->stages[axis->stage].structural_coefficient;
    }
}

void
sw_carpet_apply (const SwCarpetAxis *axis, SwDesign *design, double value)
{
  switch (axis->kind)
    {
    case SW_CARPET_PARAM_PAYLOAD:
      design->payload_kg = value;
      break;
    case SW_CARPET_PARAM_DELTA_V:
      design->mission.delta_v_m_s = value;
      break;
    case SW_CARPET_PARAM_LOSSES:
      design->mission.losses_m_s = value;
      design->mission.has_losses = TRUE;
      break;
    case SW_CARPET_PARAM_ISP_VAC:
      design->stages[axis->stage].isp_vac_s = value;
      break;
    case SW_CARPET_PARAM_STRUCTURAL_COEFFICIENT:
      design->stages[axis->stage].structural_coefficient = value;
      break;
    }
}

/* The inputs of one sizing, the cheap copy the grid varies. */
typedef struct {
  SwStageSet set;
  double fixed_kg[SW_MAX_STAGES];     /* the design's fixed loads; 0: sized */
  gboolean any_fixed;
  double payload_kg;
  double delta_v_m_s;
} Point;

/* The payload at which the point's vehicle weighs @liftoff_kg.  Without a
 * fixed load the sizing is linear in the payload; with one it is not (a
 * fixed stage weighs the same whatever it carries), so the secant method
 * closes in on the mass, which rises with the payload.  NAN when no
 * vehicle of that mass closes. */
static double
point_payload_at_mass (const Point *p, SwSplitMode split, const SwSizing *at_payload,
                       double liftoff_kg)
{
  double x0 = p->payload_kg, f0 = at_payload->liftoff_mass_kg - liftoff_kg;
  double x1 = p->payload_kg * liftoff_kg / at_payload->liftoff_mass_kg, f1;

  if (!p->any_fixed)
    return x1;
  for (guint k = 0; k < 60; k++)
    {
      SwSizing s;
      double x2;

      sw_size_with_fixed (&p->set, p->fixed_kg, x1, p->delta_v_m_s, split, &s);
      if (!s.feasible)
        return NAN;
      f1 = s.liftoff_mass_kg - liftoff_kg;
      if (fabs (f1) <= 1e-9 * liftoff_kg)
        return x1;
      if (f1 == f0)
        return NAN;
      x2 = x1 - f1 * (x1 - x0) / (f1 - f0);
      x0 = x1;
      f0 = f1;
      x1 = x2 > 0.0 ? x2 : 0.5 * x1;
    }
  return NAN;
}

static void
point_apply (const SwCarpetAxis *axis, Point *p, double value, double dv_without_losses)
{
  switch (axis->kind)
    {
    case SW_CARPET_PARAM_PAYLOAD:
      p->payload_kg = value;
      break;
    case SW_CARPET_PARAM_DELTA_V:
      p->delta_v_m_s = value;
      break;
    case SW_CARPET_PARAM_LOSSES:
      p->delta_v_m_s = dv_without_losses + value;
      break;
    case SW_CARPET_PARAM_ISP_VAC:
      p->set.exhaust_velocity_m_s[axis->stage] = value * SW_G0;
      break;
    case SW_CARPET_PARAM_STRUCTURAL_COEFFICIENT:
      p->set.structural_coefficient[axis->stage] = value;
      break;
    }
}

static double
point_output (const SwDesign *design, const SwCarpet *c, const Point *p, SwSplitMode split,
              double design_liftoff)
{
  SwSizing sizing;
  SwCostVehicle vehicle;
  SwCost cost;

  /* The design's fixed propellant loads are honoured (sw_size_with_fixed
   * is sw_size bit for bit without them). */
  sw_size_with_fixed (&p->set, p->fixed_kg, p->payload_kg, p->delta_v_m_s, split, &sizing);
  if (!sizing.feasible)
    return NAN;
  switch (c->output)
    {
    case SW_CARPET_PAYLOAD:
      return point_payload_at_mass (p, split, &sizing, design_liftoff);
    case SW_CARPET_DEVELOPMENT:
    case SW_CARPET_COST_PER_FLIGHT:
      sw_cost_vehicle_from_sizing (&vehicle, &sizing, design);
      sw_cost_compute (design, &vehicle, &cost);
      return c->output == SW_CARPET_DEVELOPMENT ? cost.development_work_years
                                                : cost.cost_per_flight_work_years;
    case SW_CARPET_LIFTOFF_MASS:
    default:
      return sizing.liftoff_mass_kg;
    }
}

SwCarpet *
sw_carpet_compute (const SwDesign *design, const SwCarpetOptions *options, GError **error)
{
  g_autoptr (SwCarpet) c = NULL;
  Point base, row;
  double dv_without_losses = 0.0, design_liftoff;
  SwSizing own;

  g_return_val_if_fail (design != NULL && options != NULL && design->n_stages > 0, NULL);

  if (!sw_carpet_axis_check (&options->x, design, error)
      || !sw_carpet_axis_check (&options->y, design, error))
    return NULL;
  if (options->x.kind == options->y.kind && options->x.stage == options->y.stage)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
                   _("The two axes of a carpet plot must be different parameters."));
      return NULL;
    }

  sw_stage_set_from_design (&base.set, design);
  base.any_fixed = FALSE;
  for (guint i = 0; i < SW_MAX_STAGES; i++)
    {
      base.fixed_kg[i] = i < design->n_stages && design->stages[i].propellant.has_propellant_kg
                           ? design->stages[i].propellant.propellant_kg : 0.0;
      base.any_fixed = base.any_fixed || base.fixed_kg[i] > 0.0;
    }
  base.payload_kg = design->payload_kg;
  if (!sw_design_required_delta_v (design, &base.delta_v_m_s, error))
    return NULL;
  if (design->mission.kind == SW_MISSION_ORBIT)
    {
      SwBudget budget;
      if (!sw_design_budget (design, &budget, error))
        return NULL;
      dv_without_losses = budget.delta_v_m_s - budget.losses_m_s;
    }
  sw_size_with_fixed (&base.set, base.fixed_kg, base.payload_kg, base.delta_v_m_s, design->split,
                      &own);
  design_liftoff = own.feasible ? own.liftoff_mass_kg : NAN;

  c = g_new0 (SwCarpet, 1);
  c->x = options->x;
  c->y = options->y;
  c->output = options->output;
  c->values = g_new (double, (gsize) c->x.n * c->y.n);
  c->feasible = g_new (gboolean, (gsize) c->x.n * c->y.n);
  c->design_x = sw_carpet_design_value (&c->x, design);
  c->design_y = sw_carpet_design_value (&c->y, design);
  c->design_value = point_output (design, c, &base, design->split, design_liftoff);

  for (guint j = 0; j < c->y.n; j++)
    {
      if (g_cancellable_set_error_if_cancelled (options->cancellable, error))
        return NULL;
      row = base;
      point_apply (&c->y, &row, sw_carpet_axis_value (&c->y, j), dv_without_losses);
      for (guint i = 0; i < c->x.n; i++)
        {
          Point p = row;
          gsize k = (gsize) j * c->x.n + i;

          point_apply (&c->x, &p, sw_carpet_axis_value (&c->x, i), dv_without_losses);
          c->values[k] = point_output (design, c, &p, design->split, design_liftoff);
          c->feasible[k] = isfinite (c->values[k]);
          if (!c->feasible[k])
            {
              c->values[k] = NAN;
              c->n_infeasible++;
            }
        }
      if (options->progress != NULL)
        options->progress ((double) (j + 1) / c->y.n, options->progress_data);
    }
  return g_steal_pointer (&c);
}

void
sw_carpet_free (SwCarpet *carpet)
{
  if (carpet == NULL)
    return;
  g_free (carpet->values);
  g_free (carpet->feasible);
  g_free (carpet);
}
