/* SPDX-License-Identifier: GPL-3.0-or-later */
/* GUI tests of the trade-study page and the baseline comparison: the
 * tornado's rows are ranked and hold the core's values, the histogram's
 * percentile lines sit at the core's percentiles, a pinned baseline shows
 * the core's comparison in the totals, the stack view and the curves, is
 * saved with the design and undone exactly, and the export dialog's worker
 * writes a PDF whose text holds the liftoff mass.  Run under Xvfb with the
 * cairo renderer (suite 'gui'). */
#include "config.h"

#include "sw-comparison.h"
#include "sw-format.h"
#include "sw-montecarlo.h"
#include "sw-reliability.h"
#include "sw-sensitivity.h"
#include "sw-sizing.h"
#include "sw-trade-plots.h"
#include "sw-window-private.h"

#include "gui-test-env.h"

#include <glib/gstdio.h>
#include <math.h>
#include <string.h>

static char *tmp_dir;

/* ---- helpers ----------------------------------------------------------- */

static void
wait_complete (SwWindow *w)
{
  /* The newest edit has been solved in every phase (the Monte Carlo and
   * the ascent included), shown and painted.  A limit, not a timing: a
   * Monte Carlo of sized boosters re-optimises each sample's loads, which
   * the sanitizers' build on a busy machine takes tens of seconds for. */
  sw_test_wait_until (sw_test_result_complete, w, 120000, "the newest result in all its phases");
}

static SwWindow *
window_new (void)
{
  SwWindow *w = sw_window_new (NULL);

  gtk_window_set_default_size (GTK_WINDOW (w), 1600, 1000);
  gtk_window_present (GTK_WINDOW (w));
  wait_complete (w);
  return w;
}

static void
load_file (SwWindow *w, const char *path)
{
  g_autoptr (GFile) file = g_file_new_for_path (path);

  g_assert_true (sw_window_load (w, file));
  wait_complete (w);
}

static char *
trade_study_path (void)
{
  /* The source tree's tests/trade, beside data/designs. */
  return g_build_filename (SOURCE_DESIGNS_DIR, "..", "..", "tests", "trade",
                           "trade-study.stagewright", NULL);
}

static char *
demo_path (const char *name)
{
  return g_build_filename (SOURCE_DESIGNS_DIR, name, NULL);
}

static SwTradePage *
page (SwWindow *w)
{
  return sw_window_get_trade_page (w);
}

static gboolean
plots_allocated (gpointer data)
{
  SwTradePage *p = data;

  return gtk_widget_get_width (GTK_WIDGET (sw_trade_page_get_plot (p, SW_TRADE_PLOT_TORNADO))) > 0
         && gtk_widget_get_width (GTK_WIDGET (sw_trade_page_get_plot (p,
                                                                       SW_TRADE_PLOT_HISTOGRAM)))
            > 0;
}

/* The trade page in front and laid out, so its plots map data to pixels. */
static void
show_trade (SwWindow *w)
{
  g_assert_true (sw_window_show_page (w, "trade"));
  sw_test_wait_until (plots_allocated, page (w), 10000, "the trade page's plots to be laid out");
}

static const SwDesign *
doc_design (SwWindow *w)
{
  return sw_document_get_design (sw_window_get_document (w));
}

/* The test's own thousands grouping, independent of the sheet's. */
static char *
grouped (double v)
{
  g_autofree char *digits = g_strdup_printf ("%.0f", v);
  GString *s = g_string_new (NULL);
  gsize n = strlen (digits);

  for (gsize i = 0; i < n; i++)
    {
      if (i > 0 && (n - i) % 3 == 0)
        g_string_append_c (s, ',');
      g_string_append_c (s, digits[i]);
    }
  return g_string_free (s, FALSE);
}

/* ---- tests ------------------------------------------------------------- */

/* The tornado: ranked, largest effect on top, values the core's. */
static void
check_tornado (SwWindow *w, double step)
{
  SwSensitivityTable t;
  g_autoptr (GError) error = NULL;
  const double *minus, *plus;
  const char *const *labels;
  SwPlot *plot = sw_trade_page_get_plot (page (w), SW_TRADE_PLOT_TORNADO);
  SwAnalysis *r = sw_window_get_shown_result (w);
  guint n, payload_row = G_MAXUINT;
  double prev = INFINITY;

  g_assert_true (sw_sensitivity_compute (doc_design (w), step, &t, &error));
  g_assert_no_error (error);
  g_assert_true (t.feasible);
  g_assert_cmpfloat (r->sensitivity_step, ==, step);

  n = sw_trade_page_get_tornado (page (w), &minus, &plus, &labels);
  g_assert_cmpuint (n, ==, t.n_items);
  g_assert_cmpuint (n, >=, 4);
  for (guint i = 0; i < n; i++)
    {
      const SwSensitivity *item = &t.items[t.ranked[i]];
      g_autofree char *label = sw_sensitivity_dup_label (doc_design (w), item);
      double effect = MAX (fabs (minus[i]), fabs (plus[i]));

      g_assert_true (item->minus_feasible && item->plus_feasible);
      /* The same numbers as the core, bit for bit: the page draws, it does
       * not compute. */
      g_assert_cmpfloat (minus[i], ==, item->minus_kg);
      g_assert_cmpfloat (plus[i], ==, item->plus_kg);
      g_assert_cmpstr (labels[i], ==, label);
      /* Ranked: the largest change first. */
      g_assert_cmpfloat (effect, <=, prev);
      prev = effect;
      if (item->param == SW_SENS_PAYLOAD)
        payload_row = i;
    }

  /* An outside check of one row: in the top-down sizing every mass is
   * proportional to the payload and the optimal split does not depend on
   * it (Tsiolkovsky; H. D. Curtis, Orbital Mechanics for Engineering
   * Students, sec. 11.6, from memory), so the payload row is exactly
   * -step and +step times the liftoff mass. */
  g_assert_cmpuint (payload_row, <, n);
  /* (Boosters with a fixed load break the proportionality.) */
  if (!(doc_design (w)->boosters.count > 0
        && doc_design (w)->boosters.propellant.has_propellant_kg))
    {
      g_assert_cmpfloat_with_epsilon (plus[payload_row] / r->sizing.liftoff_mass_kg, step,
                                      1e-9);
      g_assert_cmpfloat_with_epsilon (minus[payload_row] / r->sizing.liftoff_mass_kg, -step,
                                      1e-9);
    }

  /* Largest effect on top: row 0 is drawn above row 1. */
  {
    double y0, y1;
    g_assert_true (sw_plot_data_to_widget (plot, 0.0, 0.0, NULL, &y0));
    g_assert_true (sw_plot_data_to_widget (plot, 0.0, 1.0, NULL, &y1));
    g_assert_cmpfloat (y0, <, y1);
  }
}

/* A design with strap-on boosters (fixed, then sized) has its tornado too,
 * with the boosters' two rows, and its Monte Carlo; the page shows the
 * core's numbers. */
static void
test_tornado_boosters (void)
{
  SwWindow *w = window_new ();
  g_autofree char *dir = g_dir_make_tmp ("sw-trade-XXXXXX", NULL);
  g_autofree char *path = g_build_filename (dir, "boosters.stagewright", NULL);

  for (int fixed = 1; fixed >= 0; fixed--)
    {
      g_autofree char *json = g_strdup_printf (
        "{ \"format\": \"stagewright-design\", \"version\": 2, \"name\": \"Strap-ons\",\n"
        "  \"payload_kg\": 6000, \"split\": \"optimal\",\n"
        "  \"mission\": { \"delta_v_m_s\": 9300 },\n"
        "  \"stages\": [ { \"name\": \"Core\", \"isp_vac_s\": 320,\n"
        "    \"structural_coefficient\": 0.07, \"thrust_vac_kn\": 1300 },\n"
        "    { \"name\": \"Upper\", \"isp_vac_s\": 345, \"structural_coefficient\": 0.09 } ],\n"
        "  \"boosters\": { \"name\": \"Sides\", \"count\": 4, \"isp_vac_s\": 275,\n"
        "    \"structural_coefficient\": 0.11, \"thrust_vac_kn\": 800%s },\n"
        "  \"uncertainty\": { \"samples\": 200,\n"
        "    \"isp_vac\": { \"distribution\": \"normal\", \"sigma_percent\": 1 } } }",
        fixed ? ", \"propellant_kg\": 30000" : "");
      const double *minus, *plus;
      const char *const *labels;
      gboolean booster_row = FALSE;
      guint n;

      g_assert_true (g_file_set_contents (path, json, -1, NULL));
      load_file (w, path);
      show_trade (w);
      check_tornado (w, 0.05);
      n = sw_trade_page_get_tornado (page (w), &minus, &plus, &labels);
      g_assert_cmpuint (n, ==, 4 + 2 * 2);
      for (guint i = 0; i < n; i++)
        booster_row = booster_row || strstr (labels[i], "Sides") != NULL;
      g_assert_true (booster_row);
      g_assert_true (sw_window_get_shown_result (w)->has_montecarlo);
      g_assert_cmpuint (sw_window_get_shown_result (w)->montecarlo.liftoff.n, ==, 200);
    }
  g_unlink (path);
  g_rmdir (dir);
  sw_test_window_close (w);
}

/* Fixed propellant loads: a fixed upper stage keeps the liftoff mass as
 * the tornado's and the histogram's output; every load fixed (the as-built
 * demo) makes them the payload capability's, and the cards say which.  The
 * page's numbers are the core's. */
static void
test_fixed_loads (void)
{
  SwWindow *w = window_new ();
  g_autofree char *dir = g_dir_make_tmp ("sw-trade-XXXXXX", NULL);
  g_autofree char *path = g_build_filename (dir, "fixed.stagewright", NULL);
  const char *const demos[] = { "sallowmere-kestrune-upper-stage.stagewright",
                                "sallowmere-as-built.stagewright" };

  for (guint k = 0; k < G_N_ELEMENTS (demos); k++)
    {
      g_autofree char *demo = demo_path (demos[k]);
      g_autoptr (SwDesign) d = sw_design_load (demo, NULL, NULL);
      g_autoptr (GError) error = NULL;
      const double *minus, *plus;
      const char *const *labels;
      double lines[3];
      SwSensitivityTable t;
      SwMonteCarlo mc;
      SwAnalysis *r;
      guint n;

      g_assert_nonnull (d);
      d->uncertainty.present = TRUE;
      d->uncertainty.has_samples = TRUE;
      d->uncertainty.samples = 300;
      d->uncertainty.isp.kind = SW_SPREAD_NORMAL;
      d->uncertainty.isp.width = 1.0;
      d->uncertainty.losses.kind = SW_SPREAD_NORMAL;
      d->uncertainty.losses.width = 80.0;
      g_assert_true (sw_design_save (d, path, &error));
      g_assert_no_error (error);
      load_file (w, path);
      show_trade (w);
      r = sw_window_get_shown_result (w);

      g_assert_true (sw_sensitivity_compute (doc_design (w), r->sensitivity_step, &t, &error));
      g_assert_no_error (error);
      g_assert_cmpint (t.capability, ==, k == 1);
      n = sw_trade_page_get_tornado (page (w), &minus, &plus, &labels);
      g_assert_cmpuint (n, ==, t.n_items);
      g_assert_cmpuint (n, ==, k == 1 ? 5 : 6);
      for (guint i = 0; i < n; i++)
        {
          g_assert_cmpfloat (minus[i], ==, t.items[t.ranked[i]].minus_kg);
          g_assert_cmpfloat (plus[i], ==, t.items[t.ranked[i]].plus_kg);
        }

      g_assert_true (sw_montecarlo_run (doc_design (w), NULL, 0, FALSE, 0, 1, &mc, NULL, NULL,
                                        &error));
      g_assert_no_error (error);
      g_assert_true (r->has_montecarlo);
      g_assert_cmpint (mc.all_fixed, ==, k == 1);
      g_assert_true (sw_trade_page_get_percentile_lines (page (w), lines));
      g_assert_cmpfloat (lines[1], ==, k == 1 ? mc.payload.p50 : mc.liftoff.p50);
      if (k == 1)
        {
          g_autofree char *lo = sw_format_speed (mc.margin.p05);
          g_assert_nonnull (strstr (sw_trade_page_get_card_text (page (w),
                                                                 SW_TRADE_CARD_SPREAD), lo));
        }
      {
        g_autofree char *fits = sw_format_probability (1.0 - mc.p_negative_margin);
        g_assert_cmpstr (sw_trade_page_get_card_text (page (w), SW_TRADE_CARD_SHORTFALL), ==,
                         fits);
      }
    }
  g_unlink (path);
  g_rmdir (dir);
  sw_test_window_close (w);
}


static void
test_tornado (void)
{
  SwWindow *w = window_new ();
  g_autofree char *path = trade_study_path ();
  GtkSpinButton *step = GTK_SPIN_BUTTON (sw_trade_page_get_field (page (w),
                                                                  SW_TRADE_FIELD_STEP));

  load_file (w, path);
  show_trade (w);
  /* The default step: 5 % (the default). */
  g_assert_cmpfloat (gtk_spin_button_get_value (step), ==, 5.0);
  check_tornado (w, 0.05);

  /* The step is a setting: a new step is a new solve, not an edit. */
  gtk_spin_button_set_value (step, 10.0);
  wait_complete (w);
  check_tornado (w, 0.10);
  g_assert_false (sw_document_get_modified (sw_window_get_document (w)));
  gtk_spin_button_set_value (step, 5.0);
  wait_complete (w);
  check_tornado (w, 0.05);

  /* The success curve beside the mass curve: the core's reliability. */
  {
    SwReliabilityCurve curve;
    SwReliability rel;
    SwAnalysis *r = sw_window_get_shown_result (w);
    g_autofree char *p = NULL;

    sw_reliability_curve_compute (doc_design (w), SW_MAX_STAGES, &curve);
    sw_reliability_from_design (doc_design (w), &rel);
    g_assert_true (curve.given && rel.given);
    g_assert_cmpuint (r->reliability_curve.n_points, ==, curve.n_points);
    for (guint k = 0; k < curve.n_points; k++)
      g_assert_cmpfloat (r->reliability_curve.mission[k], ==, curve.mission[k]);
    g_assert_cmpfloat (r->reliability.mission, ==, rel.mission);
    p = g_strdup_printf ("%.1f %%", 100.0 * rel.mission);
    g_assert_cmpstr (sw_trade_page_get_card_text (page (w), SW_TRADE_CARD_SUCCESS), ==, p);
  }
  sw_test_window_close (w);
}

static void
check_percentiles (SwWindow *w)
{
  SwMonteCarlo mc;
  g_autoptr (GError) error = NULL;
  SwPlot *plot = sw_trade_page_get_plot (page (w), SW_TRADE_PLOT_HISTOGRAM);
  SwAnalysis *r = sw_window_get_shown_result (w);
  double lines[3], x[3];

  /* One seed gives the same samples whatever the thread count (the core's
   * promise, tested in test-montecarlo): here on one thread. */
  g_assert_true (sw_montecarlo_run (doc_design (w), NULL, 0, FALSE, 0, 1, &mc, NULL, NULL,
                                    &error));
  g_assert_no_error (error);
  g_assert_true (r->has_montecarlo);
  g_assert_cmpuint (r->montecarlo.seed, ==, mc.seed);
  g_assert_cmpuint (r->montecarlo.samples, ==, mc.samples);
  g_assert_true (sw_trade_page_get_percentile_lines (page (w), lines));
  g_assert_cmpfloat (lines[0], ==, mc.liftoff.p05);
  g_assert_cmpfloat (lines[1], ==, mc.liftoff.p50);
  g_assert_cmpfloat (lines[2], ==, mc.liftoff.p95);
  /* Drawn in that order, inside the histogram's range. */
  for (guint i = 0; i < 3; i++)
    {
      g_assert_cmpfloat (lines[i], >=, mc.liftoff.bin_lo);
      g_assert_cmpfloat (lines[i], <=, mc.liftoff.bin_hi);
      g_assert_true (sw_plot_data_to_widget (plot, lines[i], 0.0, &x[i], NULL));
    }
  g_assert_cmpfloat (x[0], <, x[1]);
  g_assert_cmpfloat (x[1], <, x[2]);
  /* The band on the stage-count curve holds the design's own count. */
  g_assert_true (r->has_band);
  {
    guint n = r->design->n_stages;
    g_assert_cmpfloat (r->band.p05[n - 1], <=, r->band.p50[n - 1]);
    g_assert_cmpfloat (r->band.p50[n - 1], <=, r->band.p95[n - 1]);
  }
}

static void
test_histogram (void)
{
  SwWindow *w = window_new ();
  g_autofree char *path = trade_study_path ();
  GtkSpinButton *seed = GTK_SPIN_BUTTON (sw_trade_page_get_field (page (w),
                                                                  SW_TRADE_FIELD_SEED));
  GtkSpinButton *samples = GTK_SPIN_BUTTON (sw_trade_page_get_field (page (w),
                                                                     SW_TRADE_FIELD_SAMPLES));
  g_autoptr (SwDesign) loaded = NULL;
  double before[3], after[3];

  load_file (w, path);
  show_trade (w);
  loaded = sw_design_copy (doc_design (w));
  g_assert_cmpfloat (gtk_spin_button_get_value (seed), ==, 2024.0);
  g_assert_cmpfloat (gtk_spin_button_get_value (samples), ==, 10000.0);
  check_percentiles (w);
  g_assert_true (sw_trade_page_get_percentile_lines (page (w), before));

  /* The seed and the sample count are design edits: undoable, saved. */
  gtk_spin_button_set_value (seed, 7.0);
  wait_complete (w);
  g_assert_cmpuint (doc_design (w)->uncertainty.seed, ==, 7);
  g_assert_true (sw_document_get_modified (sw_window_get_document (w)));
  check_percentiles (w);
  g_assert_true (sw_trade_page_get_percentile_lines (page (w), after));
  g_assert_cmpfloat (after[1], !=, before[1]);

  gtk_spin_button_set_value (samples, 2000.0);
  wait_complete (w);
  g_assert_cmpuint (sw_window_get_shown_result (w)->montecarlo.samples, ==, 2000);
  check_percentiles (w);

  g_assert_true (sw_document_undo (sw_window_get_document (w)));
  g_assert_true (sw_document_undo (sw_window_get_document (w)));
  wait_complete (w);
  g_assert_true (sw_design_equal (doc_design (w), loaded));
  g_assert_cmpfloat (gtk_spin_button_get_value (seed), ==, 2024.0);
  check_percentiles (w);
  g_assert_true (sw_trade_page_get_percentile_lines (page (w), after));
  g_assert_cmpfloat (after[1], ==, before[1]);

  /* A design without spreads says so instead of drawing an empty chart;
   * switching a spread on in the page is an edit that runs the Monte Carlo. */
  {
    g_autofree char *demo = demo_path ("all-solid-concept.stagewright");
    GtkDropDown *isp_kind = GTK_DROP_DOWN (sw_trade_page_get_field (page (w),
                                                                    SW_TRADE_FIELD_ISP_KIND));
    GtkSpinButton *isp_width = GTK_SPIN_BUTTON (sw_trade_page_get_field (
      page (w), SW_TRADE_FIELD_ISP_WIDTH));

    g_autoptr (SwDesign) solid = NULL;

    load_file (w, demo);
    solid = sw_design_copy (doc_design (w));
    g_assert_false (sw_uncertainty_has_spread (&doc_design (w)->uncertainty));
    g_assert_false (sw_window_get_shown_result (w)->has_montecarlo);
    g_assert_false (sw_trade_page_get_percentile_lines (page (w), after));
    g_assert_cmpstr (sw_trade_page_get_card_text (page (w), SW_TRADE_CARD_SPREAD), ==,
                     "\u2014");

    gtk_drop_down_set_selected (isp_kind, SW_SPREAD_NORMAL);
    wait_complete (w);
    g_assert_cmpint (doc_design (w)->uncertainty.isp.kind, ==, SW_SPREAD_NORMAL);
    g_assert_cmpfloat (doc_design (w)->uncertainty.isp.width, >, 0.0);
    check_percentiles (w);
    gtk_spin_button_set_value (isp_width, 2.5);
    wait_complete (w);
    g_assert_cmpfloat (doc_design (w)->uncertainty.isp.width, ==, 2.5);
    check_percentiles (w);
    /* Quick edits of one field merge into one undo step; either way undo
     * comes back to the design as loaded. */
    for (guint i = 0; i < 2 && !sw_design_equal (doc_design (w), solid); i++)
      g_assert_true (sw_document_undo (sw_window_get_document (w)));
    wait_complete (w);
    g_assert_true (sw_design_equal (doc_design (w), solid));
    g_assert_false (sw_uncertainty_has_spread (&doc_design (w)->uncertainty));
    g_assert_cmpuint (gtk_drop_down_get_selected (isp_kind), ==, SW_SPREAD_NONE);
    g_assert_false (sw_trade_page_get_percentile_lines (page (w), after));
  }
  sw_test_window_close (w);
}

/* Same scale: block area per kilogram is the current stack's (graphene
 * rectangles hold floats: 1e-6 relative). */
static void
check_stack_scale (SwWindow *w)
{
  SwStackView *view = sw_window_get_stack_view (w);
  SwAnalysis *r = sw_window_get_shown_result (w);
  const SwSizing *b = &r->baseline_sizing;
  double scale = sw_stack_view_get_area_scale (view);
  graphene_rect_t rc;
  guint k = 0;

  g_assert_cmpfloat (scale, >, 0.0);
  g_assert_true (sw_stack_view_get_block_rect (view, 0, &rc));
  g_assert_cmpfloat_with_epsilon (rc.size.width * rc.size.height
                                  / (scale * r->sizing.stages[0].stage_mass_kg), 1.0, 1e-6);
  for (guint i = 0; i < b->n_stages; i++)
    {
      if (b->stages[i].unused)
        continue;
      g_assert_true (sw_stack_view_get_baseline_rect (view, k++, &rc));
      g_assert_cmpfloat_with_epsilon (rc.size.width * rc.size.height
                                      / (scale * b->stages[i].stage_mass_kg), 1.0, 1e-6);
    }
  /* The payload last, then nothing; the payload is a cone filling half
   * its box (the shape rule of sw-stack-drawing.h). */
  g_assert_true (sw_stack_view_get_baseline_rect (view, k, &rc));
  g_assert_cmpfloat_with_epsilon (rc.size.width * rc.size.height / 2.0 / (scale * b->payload_kg),
                                  1.0, 1e-6);
  g_assert_false (sw_stack_view_get_baseline_rect (view, k + 1, &rc));
}

static void
check_deltas (SwWindow *w)
{
  SwComparison core;
  g_autoptr (GError) error = NULL;
  SwAnalysis *r = sw_window_get_shown_result (w);
  SwTotals *totals = sw_window_get_totals (w);
  g_autofree char *liftoff = NULL, *fraction = NULL;

  g_assert_true (sw_comparison_from_design (doc_design (w), &core, &error));
  g_assert_no_error (error);
  g_assert_true (core.has_baseline);
  g_assert_true (r->has_baseline && r->baseline_ok);
  for (guint t = 0; t < SW_N_TOTALS; t++)
    {
      const SwDelta *a = &r->comparison.totals[t], *e = &core.totals[t];
      g_assert_true (a->current == e->current || (isnan (a->current) && isnan (e->current)));
      g_assert_true (a->baseline == e->baseline || (isnan (a->baseline) && isnan (e->baseline)));
      g_assert_true (a->delta == e->delta || (isnan (a->delta) && isnan (e->delta)));
      g_assert_true (a->percent == e->percent || (isnan (a->percent) && isnan (e->percent)));
    }
  liftoff = sw_totals_format_delta (SW_TOTAL_LIFTOFF_MASS, &core.totals[SW_TOTAL_LIFTOFF_MASS]);
  fraction = sw_totals_format_delta (SW_TOTAL_PAYLOAD_FRACTION,
                                     &core.totals[SW_TOTAL_PAYLOAD_FRACTION]);
  g_assert_cmpstr (sw_totals_get_text (totals, SW_TOTALS_LIFTOFF_DELTA), ==, liftoff);
  g_assert_cmpstr (sw_totals_get_text (totals, SW_TOTALS_FRACTION_DELTA), ==, fraction);
  g_assert_null (strstr (liftoff, "nan"));
}

static void
test_baseline (void)
{
  SwWindow *w = window_new ();
  SwWindow *w2;
  SwDocument *doc = sw_window_get_document (w);
  g_autofree char *demo = demo_path ("medium-cargo.stagewright");
  g_autofree char *saved_path = g_build_filename (tmp_dir, "pinned.stagewright", NULL);
  g_autoptr (GFile) saved_file = g_file_new_for_path (saved_path);
  g_autoptr (SwDesign) original = NULL;
  g_autoptr (SwDesign) pinned = NULL;
  g_autoptr (GError) error = NULL;
  SwNumberField *payload = SW_NUMBER_FIELD (sw_inspector_get_field (
    sw_window_get_inspector (w), SW_INSPECTOR_PAYLOAD));
  SwAnalysis *r;
  double x, y;

  load_file (w, demo);
  original = sw_design_copy (doc_design (w));
  g_assert_null (original->baseline);
  g_assert_null (sw_totals_get_text (sw_window_get_totals (w), SW_TOTALS_LIFTOFF_DELTA));
  g_assert_false (sw_stack_view_get_baseline_rect (sw_window_get_stack_view (w), 0, NULL));

  /* Pin: the baseline is the design as it was; nothing has changed yet. */
  g_assert_true (gtk_widget_activate_action (GTK_WIDGET (w), "design.pin-baseline", NULL));
  wait_complete (w);
  g_assert_nonnull (doc_design (w)->baseline);
  {
    g_autoptr (SwDesign) stripped = sw_design_copy (doc_design (w));
    g_clear_pointer (&stripped->baseline, sw_design_free);
    g_assert_true (sw_design_equal (stripped, original));
    g_assert_true (sw_design_equal (doc_design (w)->baseline, original));
  }
  r = sw_window_get_shown_result (w);
  g_assert_cmpfloat (r->comparison.totals[SW_TOTAL_LIFTOFF_MASS].delta, ==, 0.0);
  check_deltas (w);
  check_stack_scale (w);

  /* Ten percent more payload: with the optimal split every mass scales
   * with the payload (top-down Tsiolkovsky sizing, Curtis sec. 11.6, from
   * memory), so the part of the liftoff mass that the payload carries
   * grows by exactly 10 %; the part the fairing carries (the liftoff mass
   * with no payload, the fairing in the sizing) stays. */
  {
    g_autoptr (SwDesign) bare = sw_design_copy (original);
    SwSizing s0, s1;
    double part;

    bare->payload_kg = 0.0;
    g_assert_true (sw_size_design (bare, &s0, NULL));
    g_assert_true (sw_size_design (original, &s1, NULL));
    part = 10.0 * (s1.liftoff_mass_kg - s0.liftoff_mass_kg) / s1.liftoff_mass_kg;
    sw_number_field_commit_value (payload, original->payload_kg * 1.1);
    wait_complete (w);
    g_assert_cmpint (doc_design (w)->split, ==, SW_SPLIT_OPTIMAL);
    r = sw_window_get_shown_result (w);
    g_assert_cmpfloat_with_epsilon (r->comparison.totals[SW_TOTAL_LIFTOFF_MASS].percent, part,
                                    1e-6);
    check_deltas (w);
    check_stack_scale (w);
    {
      g_autofree char *pc = g_strdup_printf ("(+%.1f %%)", part);
      g_assert_nonnull (strstr (sw_totals_get_text (sw_window_get_totals (w),
                                                    SW_TOTALS_LIFTOFF_DELTA), pc));
    }
  }
  /* The curves overlay the baseline: its point on both plots. */
  for (guint which = 0; which < 2; which++)
    {
      g_assert_true (sw_trade_plots_baseline_point (r, which, &x, &y));
      g_assert_cmpfloat (y, ==, r->baseline_sizing.liftoff_mass_kg);
      g_assert_true (sw_plot_data_to_widget (sw_window_get_plot (w, which), x, y, NULL, NULL));
    }

  /* Saved with the design and opened again. */
  g_assert_true (sw_window_save_to (w, saved_file, &error));
  g_assert_no_error (error);
  pinned = sw_design_copy (doc_design (w));
  w2 = window_new ();
  load_file (w2, saved_path);
  g_assert_true (sw_design_equal (doc_design (w2), pinned));
  g_assert_true (sw_design_equal (doc_design (w2)->baseline, original));
  check_deltas (w2);
  g_assert_cmpstr (sw_totals_get_text (sw_window_get_totals (w2), SW_TOTALS_LIFTOFF_DELTA), ==,
                   sw_totals_get_text (sw_window_get_totals (w), SW_TOTALS_LIFTOFF_DELTA));
  sw_test_window_close (w2);

  /* Undo of the edit and of the pin restores the design exactly. */
  g_assert_true (sw_document_undo (doc));
  g_assert_true (sw_document_undo (doc));
  wait_complete (w);
  g_assert_true (sw_design_equal (doc_design (w), original));
  g_assert_null (doc_design (w)->baseline);
  g_assert_false (sw_window_get_shown_result (w)->has_baseline);
  g_assert_null (sw_totals_get_text (sw_window_get_totals (w), SW_TOTALS_LIFTOFF_DELTA));
  g_assert_false (sw_stack_view_get_baseline_rect (sw_window_get_stack_view (w), 0, NULL));
  /* Redo brings it back, and clearing is one more undoable edit. */
  g_assert_true (sw_document_redo (doc));
  wait_complete (w);
  g_assert_true (sw_design_equal (doc_design (w)->baseline, original));
  g_assert_true (gtk_widget_activate_action (GTK_WIDGET (w), "design.clear-baseline", NULL));
  g_assert_null (doc_design (w)->baseline);
  g_assert_true (sw_document_undo (doc));
  g_assert_true (sw_design_equal (doc_design (w)->baseline, original));
  sw_test_window_close (w);
}

static gboolean
export_done (gpointer data)
{
  return !sw_export_dialog_is_busy (data);
}

static char *
run_tool (const char *const *argv)
{
  g_autoptr (GError) error = NULL;
  char *out = NULL;
  int status = 0;

  if (!g_spawn_sync (NULL, (char **) argv, NULL, G_SPAWN_SEARCH_PATH, NULL, NULL, &out, NULL,
                     &status, &error))
    g_error ("%s could not run (Debian package poppler-utils): %s", argv[0], error->message);
  g_assert_true (g_spawn_check_wait_status (status, NULL));
  return out;
}

static void
test_export (void)
{
  SwWindow *w = window_new ();
  g_autofree char *path = trade_study_path ();
  g_autofree char *pdf = g_build_filename (tmp_dir, "sheet.pdf", NULL);
  g_autofree char *csv_dir = g_build_filename (tmp_dir, "tables", NULL);
  g_autofree char *stages_csv = g_build_filename (csv_dir, "stages.csv", NULL);
  g_autofree char *text = NULL, *mass = NULL, *expect = NULL;
  SwExportDialog *dialog;
  SwSizing s;
  gboolean failed = TRUE;
  guint64 posted;

  load_file (w, path);
  g_assert_true (gtk_widget_activate_action (GTK_WIDGET (w), "design.export", NULL));
  dialog = sw_window_get_export_dialog (w);
  g_assert_nonnull (dialog);
  sw_export_dialog_set_targets (dialog, SW_SHEET_PDF, SW_PAPER_A4, pdf, csv_dir);
  sw_export_dialog_export (dialog);
  g_assert_true (sw_export_dialog_is_busy (dialog));
  /* The window goes on solving while the sheet is written. */
  posted = sw_solver_post (sw_window_get_solver (w), doc_design (w));
  sw_test_wait_until (export_done, dialog, 60000, "the export");
  g_assert_nonnull (sw_export_dialog_get_status (dialog, &failed));
  g_assert_false (failed);
  wait_complete (w);
  g_assert_cmpuint (sw_window_get_shown_result (w)->serial, >=, posted);

  /* The liftoff mass as the core computes it, straight from the sizing. */
  g_assert_true (sw_size_design (doc_design (w), &s, NULL));
  mass = grouped (s.liftoff_mass_kg);
  expect = g_strdup_printf ("Liftoff mass %s kg", mass);
  text = run_tool ((const char *[]) { "pdftotext", "-layout", pdf, "-", NULL });
  if (strstr (text, expect) == NULL)
    g_error ("\"%s\" not in the PDF's text:\n%s", expect, text);
  g_assert_nonnull (strstr (text, "Conceptual sizing only"));
  g_assert_nonnull (strstr (text, "range safety and local regulations"));
  g_assert_null (strstr (text, "nan"));
  g_assert_true (g_file_test (stages_csv, G_FILE_TEST_IS_REGULAR));

  gtk_window_close (GTK_WINDOW (dialog));
  for (int i = 0; i < 100 && sw_window_get_export_dialog (w) != NULL; i++)
    g_main_context_iteration (NULL, FALSE);
  g_assert_null (sw_window_get_export_dialog (w));
  sw_test_window_close (w);
}

/* Which losses the trades used is said on the trade page and in the
 * working: the closed loop's for a simulate design once the ascent has
 * run (the analysis's note, with its figure), nothing for an allowance
 * design. */
static void
test_losses_note (void)
{
  SwWindow *w = window_new ();
  g_autofree char *simulated = demo_path ("three-stage-simulated.stagewright");
  g_autofree char *allowance = demo_path ("medium-cargo.stagewright");
  g_autofree char *working = NULL;
  g_autofree char *losses = NULL;
  SwAnalysis *r;

  load_file (w, simulated);
  g_assert_true (sw_window_show_page (w, "trade"));
  while (g_main_context_iteration (NULL, FALSE))
    ;
  r = sw_window_get_shown_result (w);
  g_assert_true (r->trade_losses_simulated);
  losses = sw_format_speed (r->trade_losses_m_s);
  g_assert_cmpstr (sw_trade_page_get_card_text (page (w), SW_TRADE_CARD_LOSSES_NOTE), ==,
                   r->trade_losses_note);
  g_assert_true (g_str_has_prefix (r->trade_losses_note,
                                   "Sensitivities and Monte Carlo use the closed-loop losses"));
  g_assert_nonnull (strstr (r->trade_losses_note, losses));
  sw_window_show_page (w, "working");
  working = sw_working_view_dup_text (sw_window_get_working_view (w));
  g_assert_nonnull (strstr (working, r->trade_losses_note));
  g_assert_nonnull (strstr (working, "from the simulated ascent (closed loop)"));

  load_file (w, allowance);
  g_assert_true (sw_window_show_page (w, "trade"));
  while (g_main_context_iteration (NULL, FALSE))
    ;
  r = sw_window_get_shown_result (w);
  g_assert_cmpstr (r->trade_losses_note, ==, "");
  g_assert_cmpstr (sw_trade_page_get_card_text (page (w), SW_TRADE_CARD_LOSSES_NOTE), ==, "");
  g_clear_pointer (&working, g_free);
  working = sw_working_view_dup_text (sw_window_get_working_view (w));
  g_assert_nonnull (strstr (working, "the design's loss allowance"));
  sw_test_window_close (w);
}

int
main (int argc, char **argv)
{
  int status;

  tmp_dir = sw_gui_test_env_init (&argc, &argv, "stagewright-trade-XXXXXX");

  g_test_add_func ("/gui/trade/tornado", test_tornado);
  g_test_add_func ("/gui/trade/tornado-boosters", test_tornado_boosters);
  g_test_add_func ("/gui/trade/fixed-loads", test_fixed_loads);
  g_test_add_func ("/gui/trade/histogram", test_histogram);
  g_test_add_func ("/gui/trade/baseline", test_baseline);
  g_test_add_func ("/gui/trade/export", test_export);
  g_test_add_func ("/gui/trade/losses-note", test_losses_note);

  status = g_test_run ();
  sw_gui_test_env_finish (tmp_dir);
  return status;
}
