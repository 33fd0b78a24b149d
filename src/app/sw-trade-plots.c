/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-trade-plots"

#include "config.h"

#include "sw-trade-plots.h"

#include "sw-format.h"

#include <glib/gi18n.h>
#include <math.h>

gboolean
sw_trade_plots_current_point (SwAnalysis *r, guint which, double *x, double *y)
{
  if (r == NULL || !r->ok || !r->sizing.feasible || !isfinite (r->sizing.liftoff_mass_kg))
    return FALSE;
  *x = which == 0 ? (double) r->sizing.n_stages : r->delta_v_m_s;
  *y = r->sizing.liftoff_mass_kg;
  return TRUE;
}

/* Tick labels of a mass axis whose largest value is @top_kg, in the unit
 * the formatter's rule gives that mass (sw_format_mass: kilograms below
 * 10 t, tonnes from there), so a small design reads "6 kg", not
 * "0.006 t". */
static void
set_mass_format (SwPlot *plot, double top_kg)
{
  if (isfinite (top_kg) && top_kg > 0.0 && top_kg < 9999.5)
    /* Translators: tick labels of a mass axis in kilograms */
    sw_plot_set_y_format (plot, _("%.3g kg"), 1.0);
  else
    /* Translators: tick labels of a mass axis in tonnes */
    sw_plot_set_y_format (plot, _("%.3g t"), 1000.0);
}

static void
setup_mass_axis (SwPlot *plot)
{
  sw_plot_set_y_axis (plot, _("Liftoff mass"), TRUE);
  set_mass_format (plot, NAN);
}

void
sw_trade_plots_show_stage_count (SwPlot *plot, SwAnalysis *r)
{
  const SwStageCurve *curve;
  double x[SW_MAX_STAGES], y[SW_MAX_STAGES], yb[SW_MAX_STAGES];
  double y_top = 0.0, cx, cy;
  gboolean boosters;

  g_return_if_fail (SW_IS_PLOT (plot));

  sw_plot_clear (plot);
  sw_plot_set_title (plot, _("Liftoff mass against stage count, optimal split"));
  sw_plot_set_x_axis (plot, _("Number of stages"), FALSE);
  sw_plot_set_x_format (plot, "%.0f", 1.0);
  sw_plot_set_x_integer (plot, TRUE);
  sw_plot_set_x_range (plot, 0.5, SW_MAX_STAGES + 0.5);
  setup_mass_axis (plot);
  sw_plot_set_y_range (plot, NAN, NAN);
  sw_plot_set_empty_text (plot, _("No curve: the design cannot be solved."));
  if (r == NULL || !r->ok)
    return;

  curve = &r->stage_curve;
  boosters = curve->booster_count > 0;
  for (guint k = 0; k < curve->n_points; k++)
    {
      x[k] = curve->points[k].stages;
      y[k] = curve->points[k].feasible ? curve->points[k].liftoff_mass_kg : NAN;
      yb[k] = boosters && curve->booster_points[k].feasible
                ? curve->booster_points[k].liftoff_mass_kg : NAN;
      if (isfinite (y[k]))
        y_top = MAX (y_top, y[k]);
      if (isfinite (yb[k]))
        y_top = MAX (y_top, yb[k]);
    }
  if (r->sizing.feasible && isfinite (r->sizing.liftoff_mass_kg))
    y_top = MAX (y_top, r->sizing.liftoff_mass_kg);
  /* Counts without a solution have no mass: their crosses sit above the
   * highest mass shown. */
  y_top = y_top > 0.0 ? y_top * 2.0 : r->sizing.payload_kg * 100.0;
  set_mass_format (plot, y_top);
  /* Masses all alike (no delta-v to give): a range of its own, since an
   * automatic log axis over one value has no span to divide. */
  {
    double y_min = INFINITY, y_max = 0.0;
    for (guint k = 0; k < curve->n_points; k++)
      for (guint j = 0; j < 2; j++)
        {
          double v = j == 0 ? y[k] : yb[k];
          if (isfinite (v) && v > 0.0)
            {
              y_min = MIN (y_min, v);
              y_max = MAX (y_max, v);
            }
        }
    if (isfinite (y_min) && y_max < 1.05 * y_min)
      sw_plot_set_y_range (plot, y_min / 2.0, y_max * 2.0);
  }
  sw_trade_plots_add_band (plot, r);
  if (boosters)
    {
      /* Translators: the stage-count curve of a design with strap-ons: the
       * same stages without them */
      g_autofree char *with = g_strdup_printf (g_dngettext (GETTEXT_PACKAGE,
                                                            "With %u booster (this design's)",
                                                            "With %u boosters (this design's)",
                                                            curve->booster_count),
                                               curve->booster_count);
      sw_plot_add_series (plot, _("Serial, no boosters"), x, y, curve->n_points,
                          SW_PLOT_LINE_POINTS, 0);
      sw_plot_add_series (plot, with, x, yb, curve->n_points, SW_PLOT_LINE_POINTS, 1);
    }
  else
    sw_plot_add_series (plot, _("Optimal split"), x, y, curve->n_points, SW_PLOT_LINE_POINTS,
                        0);
  sw_trade_plots_add_baseline (plot, r, 0);
  /* One label for the crosses, never one per cross: side by side, the
   * labels of neighbouring counts were printed over each other. */
  {
    gboolean design_closes = sw_trade_plots_current_point (r, 0, &cx, &cy);
    gboolean labelled = !design_closes;

    for (guint k = 0; k < curve->n_points; k++)
      if (!curve->points[k].feasible
          && (design_closes || fabs (x[k] - (double) r->sizing.n_stages) > 0.5))
        {
          sw_plot_add_marker (plot, x[k], y_top, labelled ? NULL : _("no solution"),
                              SW_MARKER_INFEASIBLE);
          labelled = TRUE;
        }
    if (design_closes)
      sw_plot_add_marker (plot, cx, cy, _("this design"), SW_MARKER_CURRENT);
    else
      sw_plot_add_marker (plot, r->sizing.n_stages, y_top, _("this design does not close"),
                          SW_MARKER_INFEASIBLE);
  }
}

void
sw_trade_plots_show_sweep (SwPlot *plot, SwAnalysis *r)
{
  const SwSweep *sw;
  double dv, x_hi, x_max = 0.0, y_lo, y_hi, cx, cy;

  g_return_if_fail (SW_IS_PLOT (plot));

  sw_plot_clear (plot);
  sw_plot_set_title (plot, _("Liftoff mass against delta-v, optimal split"));
  sw_plot_set_x_axis (plot, _("Required delta-v"), FALSE);
  /* Translators: tick labels of a speed axis in km/s */
  sw_plot_set_x_format (plot, _("%.0f km/s"), 1000.0);
  setup_mass_axis (plot);
  sw_plot_set_empty_text (plot, _("No curves: the design cannot be solved."));
  if (r == NULL || !r->ok)
    {
      sw_plot_set_x_range (plot, NAN, NAN);
      sw_plot_set_y_range (plot, NAN, NAN);
      return;
    }

  sw = &r->sweep;
  for (guint c = 0; c < sw->n_curves; c++)
    {
      const SwSweepCurve *curve = &sw->curves[c];
      g_autofree char *name = g_strdup_printf (g_dngettext (GETTEXT_PACKAGE, "%u stage",
                                                            "%u stages", curve->stages),
                                               curve->stages);
      g_autofree char *limit = g_strdup_printf (_("limit %u"), curve->stages);
      guint s = sw_plot_add_series (plot, name, curve->delta_v_m_s, curve->liftoff_mass_kg,
                                    curve->n_points, SW_PLOT_LINE, (int) c);

      sw_plot_set_series_highlighted (plot, s, curve->stages == r->sizing.n_stages);
      sw_plot_add_vline (plot, curve->delta_v_limit_m_s, limit, (int) c);
      x_max = MAX (x_max, curve->delta_v_limit_m_s);
    }

  /* Show the region around the design: up to twice its delta-v, at least
   * past the one-stage asymptote; masses from the payload up to three
   * decades above it (a payload fraction of 0.1 %). */
  dv = r->delta_v_m_s;
  x_hi = 2.0 * dv;
  if (sw->n_curves > 0)
    x_hi = MAX (x_hi, 1.1 * sw->curves[0].delta_v_limit_m_s);
  x_hi = MIN (x_hi, 1.02 * x_max);
  /* Regions rather than exact ranges: rounded out to ticks and held while
   * an edit keeps them inside (sw-plot.h), so the axes stay put and an edit
   * redraws the curves alone. */
  if (x_hi > 0.0)
    sw_plot_set_x_region (plot, 0.0, x_hi);
  else
    sw_plot_set_x_range (plot, NAN, NAN);
  y_lo = r->sizing.payload_kg;
  y_hi = 1000.0 * y_lo;
  if (r->sizing.feasible && isfinite (r->sizing.liftoff_mass_kg))
    y_hi = MAX (y_hi, 10.0 * r->sizing.liftoff_mass_kg);
  if (y_lo > 0.0 && isfinite (y_hi))
    sw_plot_set_y_region (plot, y_lo, y_hi);
  else
    sw_plot_set_y_range (plot, NAN, NAN);
  set_mass_format (plot, y_hi);

  sw_trade_plots_add_baseline (plot, r, 1);
  if (sw_trade_plots_current_point (r, 1, &cx, &cy))
    sw_plot_add_marker (plot, cx, cy, _("this design"), SW_MARKER_CURRENT);
}

const char *
sw_trade_plots_note (SwAnalysis *r)
{
  if (r == NULL || !r->ok)
    return "";
  if (r->payload_curves.applies)
    return r->payload_curves.note;
  return r->stage_curve.note;
}

gboolean
sw_trade_plots_payload_point (SwAnalysis *r, gboolean altitude, double *x, double *y)
{
  if (r == NULL || !r->ok || !r->payload_curves.applies || !r->has_performance
      || !r->performance.reachable)
    return FALSE;
  *x = altitude ? r->payload_curves.altitude_km : r->payload_curves.inclination_deg;
  *y = r->performance.payload_kg;
  return TRUE;
}

static void
show_payload_curve (SwPlot *plot, SwAnalysis *r, gboolean altitude)
{
  const SwPayloadCurve *c = altitude ? &r->payload_curves.altitude
                                     : &r->payload_curves.inclination;
  double x[SW_PAYLOAD_CURVE_MAX], y[SW_PAYLOAD_CURVE_MAX];
  double y_max = 0.0, mx, my;

  sw_plot_clear (plot);
  sw_plot_set_x_integer (plot, FALSE);
  if (altitude)
    {
      g_autofree char *title = g_strdup_printf (_("Payload against circular-orbit altitude, "
                                                  "at %.1f° inclination"),
                                                r->payload_curves.inclination_deg);
      sw_plot_set_title (plot, title);
      sw_plot_set_x_axis (plot, _("Orbit altitude"), FALSE);
      /* Translators: tick labels of an altitude axis in km */
      sw_plot_set_x_format (plot, _("%.0f km"), 1.0);
    }
  else
    {
      g_autofree char *alt = sw_format_number (r->payload_curves.altitude_km, 0);
      /* Translators: %s is an altitude such as "1,200" */
      g_autofree char *title = g_strdup_printf (_("Payload against inclination, at %s km"), alt);
      sw_plot_set_title (plot, title);
      sw_plot_set_x_axis (plot, _("Inclination"), FALSE);
      /* Translators: tick labels of an angle axis in degrees */
      sw_plot_set_x_format (plot, _("%.0f°"), 1.0);
    }
  sw_plot_set_y_axis (plot, _("Payload"), FALSE);
  sw_plot_set_empty_text (plot, _("No payload: the vehicle reaches none of these orbits."));
  for (guint i = 0; i < c->n_points; i++)
    {
      x[i] = c->points[i].x;
      y[i] = c->points[i].reachable ? c->points[i].payload_kg : NAN;
      if (isfinite (y[i]))
        y_max = MAX (y_max, y[i]);
    }
  if (r->performance.reachable)
    y_max = MAX (y_max, r->performance.payload_kg);
  set_mass_format (plot, 1.1 * y_max);
  /* The grid, widened to this design's orbit when it lies outside. */
  if (c->n_points > 0)
    {
      double lo = x[0], hi = x[c->n_points - 1];
      if (sw_trade_plots_payload_point (r, altitude, &mx, &my))
        {
          lo = MIN (lo, mx);
          hi = MAX (hi, mx);
        }
      sw_plot_set_x_range (plot, lo, hi);
    }
  sw_plot_set_y_range (plot, 0.0, y_max > 0.0 ? 1.1 * y_max : NAN);
  if (y_max <= 0.0)
    return;
  sw_plot_add_series (plot, _("Payload capability"), x, y, c->n_points, SW_PLOT_LINE_POINTS,
                      0);
  if (sw_trade_plots_payload_point (r, altitude, &mx, &my))
    sw_plot_add_marker (plot, mx, my, _("this design"), SW_MARKER_CURRENT);
}

void
sw_trade_plots_show_payload_altitude (SwPlot *plot, SwAnalysis *r)
{
  g_return_if_fail (SW_IS_PLOT (plot) && r != NULL);
  show_payload_curve (plot, r, TRUE);
}

void
sw_trade_plots_show_payload_inclination (SwPlot *plot, SwAnalysis *r)
{
  g_return_if_fail (SW_IS_PLOT (plot) && r != NULL);
  show_payload_curve (plot, r, FALSE);
}

void
sw_trade_plots_add_band (SwPlot *plot, SwAnalysis *r)
{
  double x[SW_MAX_STAGES];

  g_return_if_fail (SW_IS_PLOT (plot));

  if (r == NULL || !r->ok || !r->has_band)
    return;
  for (guint k = 0; k < r->band.n_points && k < SW_MAX_STAGES; k++)
    x[k] = k + 1;
  /* Same colour as the curve it surrounds. */
  sw_plot_add_band (plot, _("5th to 95th percentile (Monte Carlo)"), x, r->band.p05,
                    r->band.p95, MIN (r->band.n_points, SW_MAX_STAGES), 0);
}

gboolean
sw_trade_plots_baseline_point (SwAnalysis *r, guint which, double *x, double *y)
{
  const SwSizing *b;

  if (r == NULL || !r->ok || !r->has_baseline || !r->baseline_ok)
    return FALSE;
  b = &r->baseline_sizing;
  if (!b->feasible || !isfinite (b->liftoff_mass_kg))
    return FALSE;
  *x = which == 0 ? (double) b->n_stages : b->delta_v_m_s;
  *y = b->liftoff_mass_kg;
  return TRUE;
}

void
sw_trade_plots_add_baseline (SwPlot *plot, SwAnalysis *r, guint which)
{
  double x[SW_MAX_STAGES], y[SW_MAX_STAGES], bx, by;

  g_return_if_fail (SW_IS_PLOT (plot));

  if (!sw_trade_plots_baseline_point (r, which, &bx, &by))
    return;
  if (which == 0)
    {
      const SwStageCurve *curve = &r->baseline_curve;
      for (guint k = 0; k < curve->n_points; k++)
        {
          x[k] = curve->points[k].stages;
          y[k] = curve->points[k].feasible ? curve->points[k].liftoff_mass_kg : NAN;
        }
      sw_plot_add_series (plot, _("Baseline"), x, y, curve->n_points, SW_PLOT_LINE, 3);
    }
  sw_plot_add_marker (plot, bx, by, _("baseline"), SW_MARKER_BASELINE);
}
