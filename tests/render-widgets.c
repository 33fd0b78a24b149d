/* SPDX-License-Identifier: GPL-3.0-or-later */
/* render-widgets: writes PNG previews of the stack view and the plot for a
 * design, to look at while working on the widgets (not a test).
 *
 *   GSK_RENDERER=cairo xvfb-run -a render-widgets DESIGN OUTDIR [OPTION...]
 *
 * Options: --dark, --name=SUFFIX (added to the file names), --delta-v=M_S
 * (a delta-v mission), --isp=STAGE:S, --eps=STAGE:EPS (1-based stage),
 * --hover=X,Y (pointer position for the hover readout), --size=WxH (of the
 * stack view).
 */
#include "config.h"

#include "sw-plot.h"
#include "sw-stack-view.h"
#include "widget-render.h"

#include <math.h>
#include <stdio.h>
#include <string.h>

static double hover_x = -1.0, hover_y = -1.0;
static int stack_w = 600, stack_h = 700;

/* Pretends the pointer moved to (hover_x, hover_y): emits "motion" on the
 * widget's motion controller, to see the hover readout. */
static void
fake_hover (GtkWidget *widget)
{
  GListModel *controllers = gtk_widget_observe_controllers (widget);

  for (guint i = 0; i < g_list_model_get_n_items (controllers); i++)
    {
      g_autoptr (GObject) c = g_list_model_get_item (controllers, i);
      if (GTK_IS_EVENT_CONTROLLER_MOTION (c))
        g_signal_emit_by_name (c, "motion", hover_x, hover_y);
    }
  g_object_unref (controllers);
}

static void
save (GtkWidget *widget, int w, int h, const char *dir, const char *name)
{
  GtkWidget *window = widget_render_show (widget, w, h);
  cairo_surface_t *surface;

  if (hover_x >= 0.0)
    {
      fake_hover (widget);
      widget_render_settle ();
    }
  surface = widget_render_window (window);
  g_autofree char *path = g_build_filename (dir, name, NULL);

  cairo_surface_write_to_png (surface, path);
  g_print ("%s\n", path);
  cairo_surface_destroy (surface);
  gtk_window_destroy (GTK_WINDOW (window));
}

/* The two trade plots of the application, as the window will draw them. */
static void
fill_stage_count_plot (SwPlot *plot, SwAnalysis *r)
{
  double x[SW_MAX_STAGES], y[SW_MAX_STAGES];
  guint n = r->stage_curve.n_points;

  sw_plot_set_title (plot, "Liftoff mass against stage count");
  sw_plot_set_x_axis (plot, "Number of stages", FALSE);
  sw_plot_set_y_axis (plot, "Liftoff mass (t)", TRUE);
  sw_plot_set_x_format (plot, "%.0f", 1.0);
  sw_plot_set_x_range (plot, 0.5, n + 0.5);
  sw_plot_set_y_format (plot, "%.1f t", 1000.0);
  for (guint i = 0; i < n; i++)
    {
      x[i] = r->stage_curve.points[i].stages;
      y[i] = r->stage_curve.points[i].liftoff_mass_kg;
    }
  sw_plot_add_series (plot, "Optimal split", x, y, n, SW_PLOT_LINE_POINTS, 0);
  for (guint i = 0; i < n; i++)
    if (!r->stage_curve.points[i].feasible)
      sw_plot_add_marker (plot, x[i], NAN, "infeasible", SW_MARKER_INFEASIBLE);
  if (r->sizing.feasible)
    sw_plot_add_marker (plot, r->sizing.n_stages, r->sizing.liftoff_mass_kg, "This design",
                        SW_MARKER_CURRENT);
}

static void
fill_sweep_plot (SwPlot *plot, SwAnalysis *r)
{
  sw_plot_set_title (plot, "Liftoff mass against delta-v");
  sw_plot_set_x_axis (plot, "Delta-v (m/s)", FALSE);
  sw_plot_set_y_axis (plot, "Liftoff mass (t)", TRUE);
  sw_plot_set_x_format (plot, "%.0f m/s", 1.0);
  sw_plot_set_y_format (plot, "%.1f t", 1000.0);
  sw_plot_set_y_range (plot, NAN, 1000.0 * r->design->payload_kg);
  for (guint c = 0; c < r->sweep.n_curves; c++)
    {
      const SwSweepCurve *sc = &r->sweep.curves[c];
      g_autofree char *name = g_strdup_printf ("%u stage%s", sc->stages, sc->stages > 1 ? "s" : "");
      g_autofree char *lim = g_strdup_printf ("%.0f", sc->delta_v_limit_m_s);
      guint s = sw_plot_add_series (plot, name, sc->delta_v_m_s, sc->liftoff_mass_kg,
                                    sc->n_points, SW_PLOT_LINE, (int) c);
      if (sc->stages == r->sizing.n_stages)
        sw_plot_set_series_highlighted (plot, s, TRUE);
      sw_plot_add_vline (plot, sc->delta_v_limit_m_s, lim, (int) c);
    }
  if (r->sizing.feasible)
    sw_plot_add_marker (plot, r->delta_v_m_s, r->sizing.liftoff_mass_kg, "This design",
                        SW_MARKER_CURRENT);
}

/* The later plot kinds on invented numbers: a band, a histogram, a ranked chart. */
static void
fill_band_plot (SwPlot *plot)
{
  double x[40], lo[40], mid[40], hi[40];

  for (int i = 0; i < 40; i++)
    {
      x[i] = 4000.0 + 200.0 * i;
      mid[i] = 2e4 * exp (x[i] / 3000.0);
      lo[i] = mid[i] * 0.8;
      hi[i] = mid[i] * 1.3;
    }
  sw_plot_set_title (plot, "Band and line (invented numbers)");
  sw_plot_set_x_axis (plot, "Delta-v (km/s)", FALSE);
  sw_plot_set_y_axis (plot, "Liftoff mass (t)", TRUE);
  sw_plot_set_x_format (plot, "%.1f km/s", 1000.0);
  sw_plot_set_y_format (plot, "%.0f t", 1000.0);
  sw_plot_add_band (plot, "10-90 % band", x, lo, hi, 40, 0);
  sw_plot_add_series (plot, "median", x, mid, 40, SW_PLOT_LINE, 0);
  sw_plot_add_vline (plot, 9000.0, "90th percentile", 1);
  sw_plot_add_marker (plot, 8000.0, 2e4 * exp (8000.0 / 3000.0) * 1.1, "baseline",
                      SW_MARKER_BASELINE);
}

static void
fill_histogram (SwPlot *plot)
{
  double x[15], y[15];

  for (int i = 0; i < 15; i++)
    {
      x[i] = 100.0 + 5.0 * i;
      y[i] = 400.0 * exp (-0.5 * pow ((i - 7) / 2.5, 2.0));
    }
  sw_plot_set_title (plot, "Histogram (invented numbers)");
  sw_plot_set_x_axis (plot, "Liftoff mass (t)", FALSE);
  sw_plot_set_y_axis (plot, "Runs", FALSE);
  sw_plot_set_x_format (plot, "%.0f t", 1.0);
  sw_plot_set_y_format (plot, "%.0f", 1.0);
  sw_plot_add_series (plot, "runs", x, y, 15, SW_PLOT_BARS, 5);
}

static void
fill_ranked (SwPlot *plot)
{
  static const char *const labels[] = { "Isp of stage 2", "eps of stage 1", "Payload",
                                        "eps of stage 2", "Isp of stage 1" };
  static const double v[] = { 38.0, 22.5, 12.0, -8.0, -3.5 };

  sw_plot_set_title (plot, "Ranked sensitivities (invented numbers)");
  sw_plot_set_x_axis (plot, "Change of liftoff mass (%)", FALSE);
  sw_plot_set_x_format (plot, "%.1f %%", 1.0);
  sw_plot_set_categories (plot, labels, 5);
  sw_plot_add_series (plot, "sensitivity", v, NULL, 5, SW_PLOT_HBARS, 2);
}

int
main (int argc, char **argv)
{
  g_autoptr (SwAnalysis) result = NULL;
  g_autoptr (SwDesign) design = NULL;
  g_autoptr (GError) error = NULL;
  const char *dir;
  g_autofree char *base = NULL;
  g_autofree char *stack_name = NULL, *count_name = NULL, *sweep_name = NULL;
  gboolean dark = FALSE;
  const char *suffix = "";
  GtkWidget *w;

  if (argc < 3)
    {
      g_printerr ("usage: render-widgets DESIGN OUTDIR [OPTION...]\n");
      return 2;
    }
  gtk_init ();

  design = sw_design_load (argv[1], NULL, &error);
  if (design == NULL)
    {
      g_printerr ("%s\n", error->message);
      return 1;
    }
  for (int i = 3; i < argc; i++)
    {
      guint stage;
      double value;
      if (g_strcmp0 (argv[i], "--dark") == 0)
        dark = TRUE;
      else if (sscanf (argv[i], "--hover=%lf,%lf", &hover_x, &hover_y) == 2)
        ;
      else if (sscanf (argv[i], "--size=%dx%d", &stack_w, &stack_h) == 2)
        ;
      else if (g_str_has_prefix (argv[i], "--name="))
        suffix = argv[i] + 7;
      else if (sscanf (argv[i], "--delta-v=%lf", &value) == 1)
        {
          design->mission.kind = SW_MISSION_DELTA_V;
          design->mission.delta_v_m_s = value;
        }
      else if (sscanf (argv[i], "--isp=%u:%lf", &stage, &value) == 2 && stage >= 1
               && stage <= design->n_stages)
        design->stages[stage - 1].isp_vac_s = value;
      else if (sscanf (argv[i], "--eps=%u:%lf", &stage, &value) == 2 && stage >= 1
               && stage <= design->n_stages)
        design->stages[stage - 1].structural_coefficient = value;
      else
        {
          g_printerr ("unknown option %s\n", argv[i]);
          return 2;
        }
    }
  if (dark)
    g_object_set (gtk_settings_get_default (), "gtk-application-prefer-dark-theme", TRUE, NULL);
  result = sw_analysis_compute (design, 1, NULL);
  dir = argv[2];
  base = g_path_get_basename (argv[1]);
  if (strrchr (base, '.') != NULL)
    *strrchr (base, '.') = '\0';
  stack_name = g_strdup_printf ("%s-stack%s%s.png", base, suffix, dark ? "-dark" : "");
  count_name = g_strdup_printf ("%s-count%s%s.png", base, suffix, dark ? "-dark" : "");
  sweep_name = g_strdup_printf ("%s-sweep%s%s.png", base, suffix, dark ? "-dark" : "");

  w = sw_stack_view_new ();
  sw_stack_view_set_result (SW_STACK_VIEW (w), result);
  sw_stack_view_set_selected (SW_STACK_VIEW (w), 1);
  save (w, stack_w, stack_h, dir, stack_name);

  w = sw_plot_new ();
  fill_stage_count_plot (SW_PLOT (w), result);
  save (w, 600, 400, dir, count_name);

  w = sw_plot_new ();
  fill_sweep_plot (SW_PLOT (w), result);
  save (w, 600, 400, dir, sweep_name);

  w = sw_plot_new ();
  fill_band_plot (SW_PLOT (w));
  save (w, 600, 400, dir, dark ? "extra-band-dark.png" : "extra-band.png");
  w = sw_plot_new ();
  fill_histogram (SW_PLOT (w));
  save (w, 600, 400, dir, dark ? "extra-histogram-dark.png" : "extra-histogram.png");
  w = sw_plot_new ();
  fill_ranked (SW_PLOT (w));
  save (w, 600, 400, dir, dark ? "extra-ranked-dark.png" : "extra-ranked.png");
  return 0;
}
