/* SPDX-License-Identifier: GPL-3.0-or-later */
/* GUI tests of the main window: edits through the inspector reach the solver
 * thread and come back as totals; border drags, undo, save and reopen, the
 * recovery copy, a burst of 1,000 edits and the plots' current-design
 * markers.  Run under Xvfb with the cairo renderer (suite 'gui'). */
#include "config.h"

#include "sw-application.h"
#include "sw-format.h"
#include "sw-limits.h"
#include "sw-plot-private.h"
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
wait_shown (SwWindow *w)
{
  /* The newest edit has been solved, shown and painted. */
  sw_test_wait_until (sw_test_result_drawn, w, 10000, "the newest result to be drawn");
}

static SwWindow *
window_new (void)
{
  SwWindow *w = sw_window_new (NULL);

  gtk_window_present (GTK_WINDOW (w));
  wait_shown (w);
  return w;
}

static char *
demo_path (const char *name)
{
  return g_build_filename (SOURCE_DESIGNS_DIR, name, NULL);
}

static void
load_demo (SwWindow *w, const char *name)
{
  g_autofree char *path = demo_path (name);
  g_autoptr (GFile) file = g_file_new_for_path (path);

  g_assert_true (sw_window_load (w, file));
  wait_shown (w);
}

/* A one-stage design whose numbers a reader can check by hand. */
static SwDesign *
single_stage_design (void)
{
  SwDesign *d = sw_design_new_default ();

  g_strlcpy (d->name, "Hand check", sizeof d->name);
  d->payload_kg = 1000.0;
  d->mission.kind = SW_MISSION_DELTA_V;
  d->mission.delta_v_m_s = 3000.0;
  d->split = SW_SPLIT_OPTIMAL;
  d->n_stages = 1;
  d->stages[0].isp_vac_s = 300.0;
  d->stages[0].structural_coefficient = 0.1;
  d->stages[0].has_share = FALSE;
  return d;
}

/* Tsiolkovsky with the structural coefficient, top-down for one stage
 * (H. D. Curtis, Orbital Mechanics for Engineering Students, sec. 11.6, the
 * stage-mass equation m_k = (n_k - 1)/(1 - n_k eps_k) m_above, confirmed in
 * reference-values.md): n = exp(dv / (Isp g0)), so
 * m0 = m_pl + m_1 = m_pl n (1 - eps) / (1 - n eps). */
static double
hand_liftoff (double payload, double dv, double isp, double eps)
{
  double n = exp (dv / (isp * 9.80665));
  return payload * n * (1.0 - eps) / (1.0 - n * eps);
}

static SwNumberField *
field (SwWindow *w, SwInspectorField f)
{
  return SW_NUMBER_FIELD (sw_inspector_get_field (sw_window_get_inspector (w), f));
}

static const char *
totals_text (SwWindow *w, SwTotalsField f)
{
  return sw_totals_get_text (sw_window_get_totals (w), f);
}

/* @text: the literal the totals must show (the test runs in the C.UTF-8
 * locale). */
static void
assert_liftoff_shown (SwWindow *w, double expected_kg, const char *text)
{
  SwAnalysis *r = sw_window_get_shown_result (w);

  g_assert_nonnull (r);
  g_assert_true (r->ok);
  g_assert_true (r->sizing.feasible);
  g_assert_cmpfloat_with_epsilon (r->sizing.liftoff_mass_kg / expected_kg, 1.0, 1e-9);
  g_assert_cmpstr (totals_text (w, SW_TOTALS_LIFTOFF), ==, text);
}

/* ---- tests ------------------------------------------------------------- */

static void
test_builds (void)
{
  SwWindow *w = window_new ();
  SwAnalysis *r;

  load_demo (w, "medium-cargo.stagewright");
  r = sw_window_get_shown_result (w);
  g_assert_true (r->ok);
  g_assert_cmpuint (r->design->n_stages, ==, 2);
  g_assert_true (g_str_has_prefix (gtk_window_get_title (GTK_WINDOW (w)),
                                   "Dunmarrow Medium cargo vehicle"));
  g_assert_false (sw_document_get_modified (sw_window_get_document (w)));
  /* The demo's liftoff mass (about 129,001 kg by the core, its 1,500 kg
   * fairing included) in tonnes with one decimal, the mass rule of
   * sw-format.h. */
  g_assert_cmpfloat (r->sizing.liftoff_mass_kg, >=, 128950.0);
  g_assert_cmpfloat (r->sizing.liftoff_mass_kg, <, 129050.0);
  g_assert_cmpstr (totals_text (w, SW_TOTALS_LIFTOFF), ==, "129.0 t");
  /* The inspector shows the first stage of the file. */
  g_assert_cmpfloat (sw_number_field_get_value (field (w, SW_INSPECTOR_ISP_VAC)), ==, 338.0);
  /* An orbit the site cannot reach: the field says which key and why,
   * the design keeps its last valid state and the selected stage stays. */
  sw_inspector_set_selected (sw_window_get_inspector (w), 1);
  g_assert_false (sw_number_field_commit_value (field (w, SW_INSPECTOR_INCLINATION), 10.0));
  g_assert_nonnull (strstr (sw_number_field_get_error (field (w, SW_INSPECTOR_INCLINATION)),
                            "an orbit inclined 10 deg cannot be reached"));
  g_assert_cmpfloat (sw_document_get_design (sw_window_get_document (w))->mission.inclination_deg,
                     ==, 51.6);
  g_assert_false (sw_document_get_modified (sw_window_get_document (w)));
  g_assert_cmpint (sw_inspector_get_selected (sw_window_get_inspector (w)), ==, 1);
  wait_shown (w);
  g_assert_true (sw_window_get_shown_result (w)->ok);
  g_assert_cmpint (sw_stack_view_get_selected (sw_window_get_stack_view (w)), ==, 1);
  sw_inspector_set_selected (sw_window_get_inspector (w), 0);

  /* The spin ranges come from the limits table. */
  {
    double lo, hi;
    sw_number_field_get_range (field (w, SW_INSPECTOR_ISP_VAC), &lo, &hi);
    g_assert_cmpfloat (lo, ==, sw_limit_get (SW_LIMIT_ISP_VAC)->min);
    g_assert_cmpfloat (hi, ==, sw_limit_get (SW_LIMIT_ISP_VAC)->max);
  }
  sw_test_window_close (w);
}

static void
test_edit_fields (void)
{
  SwWindow *w = window_new ();
  SwDocument *doc = sw_window_get_document (w);
  GtkDropDown *form;
  const SwDesign *d;

  sw_document_reset (doc, single_stage_design (), NULL, FALSE);
  wait_shown (w);
  assert_liftoff_shown (w, hand_liftoff (1000.0, 3000.0, 300.0, 0.1), "3,452 kg");

  /* Isp */
  sw_number_field_commit_value (field (w, SW_INSPECTOR_ISP_VAC), 350.0);
  wait_shown (w);
  g_assert_cmpfloat (sw_document_get_design (doc)->stages[0].isp_vac_s, ==, 350.0);
  assert_liftoff_shown (w, hand_liftoff (1000.0, 3000.0, 350.0, 0.1), "2,837 kg");

  /* eps, entered as eps */
  sw_number_field_commit_value (field (w, SW_INSPECTOR_EPS), 0.12);
  wait_shown (w);
  g_assert_cmpfloat_with_epsilon (sw_document_get_design (doc)->stages[0].structural_coefficient,
                                  0.12, 1e-12);
  assert_liftoff_shown (w, hand_liftoff (1000.0, 3000.0, 350.0, 0.12), "2,960 kg");

  /* eps, entered as the wet-to-dry mass ratio 1/eps: 10 means eps = 0.1 */
  form = GTK_DROP_DOWN (sw_inspector_get_field (sw_window_get_inspector (w),
                                                SW_INSPECTOR_EPS_FORM));
  gtk_drop_down_set_selected (form, SW_EPS_WET_DRY_RATIO);
  g_assert_cmpfloat_with_epsilon (sw_number_field_get_value (field (w, SW_INSPECTOR_EPS)),
                                  1.0 / 0.12, 1e-9);
  sw_number_field_commit_value (field (w, SW_INSPECTOR_EPS), 10.0);
  wait_shown (w);
  g_assert_cmpfloat_with_epsilon (sw_document_get_design (doc)->stages[0].structural_coefficient,
                                  0.1, 1e-12);
  assert_liftoff_shown (w, hand_liftoff (1000.0, 3000.0, 350.0, 0.1), "2,837 kg");
  gtk_drop_down_set_selected (form, SW_EPS_COEFFICIENT);

  /* A second stage, then the share of the first: the split becomes manual
   * and the other share takes the rest. */
  gtk_widget_activate_action (GTK_WIDGET (sw_window_get_inspector (w)), "stage.add", NULL);
  wait_shown (w);
  g_assert_cmpuint (sw_document_get_design (doc)->n_stages, ==, 2);
  /* The new stage is selected, here and in the drawing. */
  g_assert_cmpint (sw_inspector_get_selected (sw_window_get_inspector (w)), ==, 1);
  g_assert_cmpint (sw_stack_view_get_selected (sw_window_get_stack_view (w)), ==, 1);
  sw_inspector_set_selected (sw_window_get_inspector (w), 0);
  sw_number_field_commit_value (field (w, SW_INSPECTOR_SHARE), 30.0);
  wait_shown (w);
  d = sw_document_get_design (doc);
  g_assert_cmpint (d->split, ==, SW_SPLIT_MANUAL);
  g_assert_cmpfloat_with_epsilon (d->stages[0].delta_v_share, 0.30, 1e-12);
  g_assert_cmpfloat_with_epsilon (d->stages[1].delta_v_share, 0.70, 1e-12);
  {
    /* Two stages top-down by hand: the upper stage's initial mass is the
     * lower stage's payload. */
    double upper = hand_liftoff (1000.0, 0.7 * 3000.0, d->stages[1].isp_vac_s,
                                 d->stages[1].structural_coefficient);
    double lower = hand_liftoff (upper, 0.3 * 3000.0, 350.0, 0.1);
    /* 2,764.0 kg by hand with the new stage's defaults. */
    assert_liftoff_shown (w, lower, "2,764 kg");
  }
  sw_test_window_close (w);
}

static void
test_drag_border (void)
{
  SwWindow *w = window_new ();
  SwDocument *doc = sw_window_get_document (w);
  g_autoptr (SwDesign) before = NULL;
  SwAnalysis *r;
  double s0, s1;
  const SwDesign *d;

  load_demo (w, "medium-cargo.stagewright");
  before = sw_document_dup_design (doc);
  r = sw_window_get_shown_result (w);
  s0 = r->sizing.stages[0].delta_v_share;
  s1 = r->sizing.stages[1].delta_v_share;

  /* As the stack view reports a drag: 0.05 then 0.10 of the share moves
   * from stage 2 (upper) to stage 1 (lower), counted from the drag's start. */
  g_signal_emit_by_name (sw_window_get_stack_view (w), "share-dragged", 0, 1, 0.05, FALSE);
  g_signal_emit_by_name (sw_window_get_stack_view (w), "share-dragged", 0, 1, 0.10, TRUE);
  wait_shown (w);
  d = sw_document_get_design (doc);
  g_assert_cmpint (d->split, ==, SW_SPLIT_MANUAL);
  g_assert_cmpfloat_with_epsilon (d->stages[0].delta_v_share, s0 + 0.10, 1e-9);
  g_assert_cmpfloat_with_epsilon (d->stages[1].delta_v_share, s1 - 0.10, 1e-9);
  r = sw_window_get_shown_result (w);
  g_assert_cmpfloat_with_epsilon (r->sizing.stages[0].delta_v_m_s,
                                  (s0 + 0.10) * r->delta_v_m_s, 1e-6);
  g_assert_true (sw_document_get_modified (doc));

  /* One drag is one undo step. */
  g_assert_true (sw_document_undo (doc));
  g_assert_true (sw_design_equal (sw_document_get_design (doc), before));
  g_assert_false (sw_document_can_undo (doc));
  sw_test_window_close (w);
}

/* A vehicle that exists (every stage fixed): the trade-curves page shows
 * its payload against altitude and inclination with this design marked at
 * the analysis's capability inside the plot, and the note says which losses
 * the curves use; a design with one fixed stage keeps the stage-count
 * curves and the note says the fixed load is left out of them. */
static void
test_payload_curves (void)
{
  SwWindow *w = window_new ();
  SwAnalysis *r;
  double x, y, wx, wy;

  load_demo (w, "sallowmere-as-built.stagewright");
  r = sw_window_get_shown_result (w);
  g_assert_true (r->payload_curves.applies && r->performance.reachable);
  for (guint which = 0; which < 2; which++)
    {
      g_assert_true (sw_trade_plots_payload_point (r, which == 0, &x, &y));
      g_assert_cmpfloat (x, ==, which == 0 ? 400.0 : 45.0);
      g_assert_cmpfloat (y, ==, r->performance.payload_kg);
      g_assert_true (sw_plot_data_to_widget (sw_window_get_plot (w, which), x, y, &wx, &wy));
    }
  g_assert_nonnull (sw_window_get_curves_note (w));
  g_assert_nonnull (strstr (sw_window_get_curves_note (w), "loss allowance of 2,380 m/s"));

  load_demo (w, "sallowmere-kestrune-upper-stage.stagewright");
  r = sw_window_get_shown_result (w);
  g_assert_false (r->payload_curves.applies);
  g_assert_false (sw_trade_plots_payload_point (r, TRUE, &x, &y));
  g_assert_true (sw_trade_plots_current_point (r, 0, &x, &y));
  g_assert_nonnull (strstr (sw_window_get_curves_note (w), "stage 2 (Kestrune upper stage)"));

  load_demo (w, "small-sat-launcher.stagewright");
  g_assert_null (sw_window_get_curves_note (w));
  sw_test_window_close (w);
}

static void
test_undo_exact (void)
{
  SwWindow *w = window_new ();
  SwDocument *doc = sw_window_get_document (w);
  SwInspector *insp = sw_window_get_inspector (w);
  GPtrArray *states = g_ptr_array_new_with_free_func ((GDestroyNotify) sw_design_free);

  load_demo (w, "small-sat-launcher.stagewright");
  g_ptr_array_add (states, sw_document_dup_design (doc));

  sw_number_field_commit_value (field (w, SW_INSPECTOR_PAYLOAD), 321.5);
  g_ptr_array_add (states, sw_document_dup_design (doc));
  sw_inspector_set_selected (insp, 1);
  sw_number_field_commit_value (field (w, SW_INSPECTOR_ISP_VAC), 341.7);
  g_ptr_array_add (states, sw_document_dup_design (doc));
  sw_number_field_commit_value (field (w, SW_INSPECTOR_EPS), 0.0937);
  g_ptr_array_add (states, sw_document_dup_design (doc));
  gtk_widget_activate_action (GTK_WIDGET (insp), "stage.duplicate", NULL);
  g_ptr_array_add (states, sw_document_dup_design (doc));
  gtk_widget_activate_action (GTK_WIDGET (insp), "stage.move-up", NULL);
  g_ptr_array_add (states, sw_document_dup_design (doc));
  sw_number_field_commit_value (field (w, SW_INSPECTOR_SHARE), 12.5);
  g_ptr_array_add (states, sw_document_dup_design (doc));
  gtk_widget_activate_action (GTK_WIDGET (insp), "stage.remove", NULL);
  g_ptr_array_add (states, sw_document_dup_design (doc));

  /* Every step differs from the one before, and undo walks back exactly. */
  for (guint i = 1; i < states->len; i++)
    g_assert_false (sw_design_equal (states->pdata[i], states->pdata[i - 1]));
  for (guint i = states->len - 1; i > 0; i--)
    {
      g_assert_true (sw_document_undo (doc));
      g_assert_true (sw_design_equal (sw_document_get_design (doc), states->pdata[i - 1]));
    }
  g_assert_false (sw_document_can_undo (doc));
  g_assert_false (sw_document_get_modified (doc));
  for (guint i = 1; i < states->len; i++)
    {
      g_assert_true (sw_document_redo (doc));
      g_assert_true (sw_design_equal (sw_document_get_design (doc), states->pdata[i]));
    }
  wait_shown (w);
  g_assert_true (sw_design_equal (sw_window_get_shown_result (w)->design,
                                  sw_document_get_design (doc)));
  g_ptr_array_unref (states);
  sw_test_window_close (w);
}

static void
test_save_reopen (void)
{
  SwWindow *w = window_new ();
  SwWindow *w2;
  g_autofree char *path = g_build_filename (tmp_dir, "round-trip.stagewright", NULL);
  g_autofree char *bad_path = g_build_filename (tmp_dir, "bad.stagewright", NULL);
  g_autoptr (GFile) file = g_file_new_for_path (path);
  g_autoptr (GFile) bad = g_file_new_for_path (bad_path);
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) saved = NULL;
  GtkMessageType type;
  const char *message;

  load_demo (w, "all-solid-concept.stagewright");
  sw_number_field_commit_value (field (w, SW_INSPECTOR_ISP_VAC), 281.5);
  g_assert_true (sw_document_get_modified (sw_window_get_document (w)));
  g_assert_true (g_str_has_prefix (gtk_window_get_title (GTK_WINDOW (w)), "• "));
  g_assert_true (sw_window_save_to (w, file, &error));
  g_assert_no_error (error);
  g_assert_false (sw_document_get_modified (sw_window_get_document (w)));
  g_assert_false (g_str_has_prefix (gtk_window_get_title (GTK_WINDOW (w)), "• "));
  saved = sw_document_dup_design (sw_window_get_document (w));

  w2 = window_new ();
  g_assert_true (sw_window_load (w2, file));
  g_assert_true (sw_design_equal (sw_document_get_design (sw_window_get_document (w2)), saved));
  g_assert_false (sw_document_get_modified (sw_window_get_document (w2)));

  /* A file that does not load changes nothing and says which file, which
   * field and why. */
  g_assert_true (g_file_set_contents (bad_path,
                                      "{ \"format\": \"stagewright-design\", \"version\": 1,"
                                      "  \"name\": \"x\", \"payload_kg\": -5,"
                                      "  \"mission\": { \"delta_v_m_s\": 9000 },"
                                      "  \"split\": \"equal\","
                                      "  \"stages\": [ { \"name\": \"a\", \"isp_vac_s\": 300,"
                                      "                  \"structural_coefficient\": 0.1 } ] }",
                                      -1, NULL));
  g_assert_false (sw_window_load (w2, bad));
  g_assert_true (sw_design_equal (sw_document_get_design (sw_window_get_document (w2)), saved));
  message = sw_window_get_message (w2, &type);
  g_assert_nonnull (message);
  g_assert_cmpint (type, ==, GTK_MESSAGE_ERROR);
  g_assert_nonnull (strstr (message, "bad.stagewright"));
  g_assert_nonnull (strstr (message, "payload_kg"));

  /* Unknown keys: the design opens and the window names them. */
  g_assert_true (g_file_set_contents (bad_path,
                                      "{ \"format\": \"stagewright-design\", \"version\": 1,"
                                      "  \"name\": \"x\", \"payload_kg\": 500, \"colour\": 3,"
                                      "  \"mission\": { \"delta_v_m_s\": 9000 },"
                                      "  \"split\": \"equal\","
                                      "  \"stages\": [ { \"name\": \"a\", \"isp_vac_s\": 300,"
                                      "                  \"structural_coefficient\": 0.1 } ] }",
                                      -1, NULL));
  g_assert_true (sw_window_load (w2, bad));
  g_assert_cmpfloat (sw_document_get_design (sw_window_get_document (w2))->payload_kg, ==, 500.0);
  message = sw_window_get_message (w2, &type);
  g_assert_nonnull (message);
  g_assert_cmpint (type, ==, GTK_MESSAGE_WARNING);
  g_assert_nonnull (strstr (message, "colour"));

  sw_test_window_close (w2);
  sw_test_window_close (w);
}

static gboolean
file_exists (gpointer path)
{
  return g_file_test (path, G_FILE_TEST_EXISTS);
}

static void
test_recovery (void)
{
  SwWindow *w = window_new ();
  g_autofree char *path = sw_window_dup_recovery_path (w);
  g_autoptr (SwDesign) crashed = NULL;
  g_autoptr (GError) error = NULL;

  /* The copy appears about a second after an edit, not at once. */
  g_assert_false (g_file_test (path, G_FILE_TEST_EXISTS));
  load_demo (w, "medium-cargo.stagewright");
  sw_number_field_commit_value (field (w, SW_INSPECTOR_PAYLOAD), 7500.0);
  g_assert_false (g_file_test (path, G_FILE_TEST_EXISTS));
  sw_test_wait_until (file_exists, path, 5000, "the recovery copy");
  {
    g_autoptr (SwDesign) copy = sw_design_load (path, NULL, &error);
    g_assert_no_error (error);
    g_assert_true (sw_design_equal (copy, sw_document_get_design (sw_window_get_document (w))));
  }
  /* A clean close (here: discarding on purpose) removes it. */
  sw_test_window_close (w);
  g_assert_false (g_file_test (path, G_FILE_TEST_EXISTS));

  /* A crash: the copy is left behind. */
  crashed = sw_design_new_default ();
  g_strlcpy (crashed->name, "Left behind by a crash", sizeof crashed->name);
  crashed->payload_kg = 1234.5;
  {
    g_autofree char *dir = g_path_get_dirname (path);
    g_assert_cmpint (g_mkdir_with_parents (dir, 0700), ==, 0);
  }
  g_assert_true (sw_design_save (crashed, path, &error));
  g_assert_no_error (error);

  w = window_new ();
  g_assert_true (sw_window_get_recovery_offered (w));
  /* Edits before the answer do not overwrite the copy. */
  sw_number_field_commit_value (field (w, SW_INSPECTOR_PAYLOAD), 999.0);
  sw_window_flush_recovery (w);
  {
    g_autoptr (SwDesign) still = sw_design_load (path, NULL, &error);
    g_assert_no_error (error);
    g_assert_true (sw_design_equal (still, crashed));
  }
  sw_window_answer_recovery (w, TRUE);
  g_assert_false (sw_window_get_recovery_offered (w));
  g_assert_true (sw_design_equal (sw_document_get_design (sw_window_get_document (w)), crashed));
  g_assert_true (sw_document_get_modified (sw_window_get_document (w)));
  wait_shown (w);
  g_assert_cmpfloat (sw_window_get_shown_result (w)->design->payload_kg, ==, 1234.5);
  sw_test_window_close (w);
  g_assert_false (g_file_test (path, G_FILE_TEST_EXISTS));
}

static void
test_thousand_edits (void)
{
  SwWindow *w = window_new ();
  SwNumberField *isp;
  SwAnalysis *shown;
  g_autoptr (SwAnalysis) fresh = NULL;
  g_autofree char *liftoff = NULL;
  guint64 posted;

  load_demo (w, "medium-cargo.stagewright");
  isp = field (w, SW_INSPECTOR_ISP_VAC);
  /* 1,000 edits as fast as the main thread can make them; now and then the
   * main loop runs so that some results arrive while edits continue. */
  for (int i = 0; i < 1000; i++)
    {
      sw_number_field_commit_value (isp, 300.0 + (i % 2 == 0 ? i * 0.1 : 50.0 - i * 0.01));
      if (i % 97 == 0)
        g_main_context_iteration (NULL, FALSE);
    }
  sw_number_field_commit_value (isp, 333.3);
  posted = sw_solver_get_posted_serial (sw_window_get_solver (w));
  wait_shown (w);

  shown = sw_window_get_shown_result (w);
  g_assert_cmpuint (shown->serial, ==, posted);
  g_assert_cmpfloat (shown->design->stages[0].isp_vac_s, ==, 333.3);
  g_assert_true (sw_design_equal (shown->design,
                                  sw_document_get_design (sw_window_get_document (w))));
  /* What is shown equals a fresh solve of the last design. */
  fresh = sw_analysis_compute (sw_document_get_design (sw_window_get_document (w)), 0, NULL);
  g_assert_cmpfloat (shown->sizing.liftoff_mass_kg, ==, fresh->sizing.liftoff_mass_kg);
  liftoff = sw_format_mass (fresh->sizing.liftoff_mass_kg);
  g_assert_cmpstr (totals_text (w, SW_TOTALS_LIFTOFF), ==, liftoff);
  g_test_message ("1,001 edits: %" G_GUINT64_FORMAT " requests dropped unsolved",
                  sw_solver_get_dropped (sw_window_get_solver (w)));
  sw_test_window_close (w);
}

/* The colour of the pixel at @x, @y of an ARGB32 surface. */
static void
pixel (cairo_surface_t *s, int x, int y, double *r, double *g, double *b)
{
  unsigned char *data = cairo_image_surface_get_data (s);
  int stride = cairo_image_surface_get_stride (s);
  guint32 p;

  /* Outside the picture is a failure, not a read past its end. */
  g_assert_cmpint (x, >=, 0);
  g_assert_cmpint (y, >=, 0);
  g_assert_cmpint (x, <, cairo_image_surface_get_width (s));
  g_assert_cmpint (y, <, cairo_image_surface_get_height (s));
  p = *(guint32 *) (data + y * stride + 4 * x);

  *r = ((p >> 16) & 0xff) / 255.0;
  *g = ((p >> 8) & 0xff) / 255.0;
  *b = (p & 0xff) / 255.0;
}

/* Renders @widget at its own size (no scaling); pixel (0, 0) is @origin in
 * the widget's coordinates. */
static cairo_surface_t *
render (GtkWidget *widget, graphene_point_t *origin)
{
  g_autoptr (GdkPaintable) paintable = gtk_widget_paintable_new (widget);
  int w = gdk_paintable_get_intrinsic_width (paintable);
  int h = gdk_paintable_get_intrinsic_height (paintable);
  GtkSnapshot *snapshot = gtk_snapshot_new ();
  g_autoptr (GskRenderNode) node = NULL;
  cairo_surface_t *surface = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, w, h);
  cairo_t *cr = cairo_create (surface);
  graphene_rect_t bounds;

  g_assert_true (gtk_widget_compute_bounds (widget, widget, &bounds));
  g_assert_cmpint (w, ==, (int) ceilf (bounds.size.width));
  *origin = bounds.origin;
  gdk_paintable_snapshot (paintable, snapshot, w, h);
  node = gtk_snapshot_free_to_node (snapshot);
  g_assert_nonnull (node);
  gsk_render_node_draw (node, cr);
  cairo_destroy (cr);
  cairo_surface_flush (surface);
  return surface;
}

/* The current-design marker is a filled disc in the foreground colour: every
 * pixel within 3 px of the point the core's numbers give must have it.  The
 * plot is rendered on its own: the lower plot may sit below the window's
 * fold, in the scrolled part of its page. */
static void
assert_marker_at (SwWindow *w, guint which)
{
  SwPlot *plot = sw_window_get_plot (w, which);
  cairo_surface_t *shot;
  graphene_point_t origin_point, *origin = &origin_point;
  SwAnalysis *r = sw_window_get_shown_result (w);
  GdkRGBA fg;
  double x, y, wx, wy;
  graphene_point_t p;

  G_GNUC_BEGIN_IGNORE_DEPRECATIONS
  gtk_style_context_get_color (gtk_widget_get_style_context (GTK_WIDGET (plot)), &fg);
  G_GNUC_END_IGNORE_DEPRECATIONS

  /* Where the core puts the design: its stage count or required delta-v,
   * and its liftoff mass. */
  x = which == 0 ? (double) r->sizing.n_stages : r->delta_v_m_s;
  y = r->sizing.liftoff_mass_kg;
  g_assert_true (sw_trade_plots_current_point (r, which, &wx, &wy));
  g_assert_cmpfloat (wx, ==, x);
  g_assert_cmpfloat (wy, ==, y);
  g_assert_true (sw_plot_data_to_widget (plot, x, y, &wx, &wy));
  shot = render (GTK_WIDGET (plot), origin);
  p = GRAPHENE_POINT_INIT (wx, wy);
  p.x -= origin->x;
  p.y -= origin->y;
  g_test_message ("plot %u: marker at %.1f, %.1f of a %d x %d shot", which, p.x, p.y,
                  cairo_image_surface_get_width (shot), cairo_image_surface_get_height (shot));
  for (int dy = -3; dy <= 3; dy++)
    for (int dx = -3; dx <= 3; dx++)
      {
        double pr, pg, pb;
        if (dx * dx + dy * dy > 9)
          continue;
        pixel (shot, (int) floor (p.x) + dx, (int) floor (p.y) + dy, &pr, &pg, &pb);
        g_assert_cmpfloat (fabs (pr - fg.red) + fabs (pg - fg.green) + fabs (pb - fg.blue), <,
                           0.25);
      }
  cairo_surface_destroy (shot);
}

static void
test_plots_current (void)
{
  SwWindow *w = window_new ();
  SwDocument *doc = sw_window_get_document (w);
  g_autoptr (SwDesign) d = NULL;

  load_demo (w, "small-sat-launcher.stagewright");
  /* The equal split puts the design off the optimal curves, so the marker
   * stands alone. */
  d = sw_document_dup_design (doc);
  d->split = SW_SPLIT_EQUAL;
  sw_document_commit (doc, g_steal_pointer (&d), NULL);
  wait_shown (w);
  assert_marker_at (w, 0);
  assert_marker_at (w, 1);
  sw_test_window_close (w);
}

/* ---- main -------------------------------------------------------------- */

/* The window's minimum width never depends on the numbers shown: an
 * extreme payload (999,999,999,999 kg, accepted by the core) and an
 * infeasible design on every page leave it under 1,280 px, and undo does
 * not keep a wider one. */
static int
min_width (SwWindow *w)
{
  int min = 0;

  gtk_widget_measure (GTK_WIDGET (w), GTK_ORIENTATION_HORIZONTAL, -1, &min, NULL, NULL, NULL);
  return min;
}

/* No selectable label comes up with its text selected (focus moving into
 * a page used to select the whole Ascent banner). */
static void
assert_nothing_selected (GtkWidget *widget)
{
  int start, end;

  if (GTK_IS_LABEL (widget) && gtk_label_get_selectable (GTK_LABEL (widget)))
    {
      if (gtk_label_get_selection_bounds (GTK_LABEL (widget), &start, &end))
        g_error ("Label \"%s\" opened with characters %d..%d selected",
                 gtk_label_get_text (GTK_LABEL (widget)), start, end);
    }
  for (GtkWidget *c = gtk_widget_get_first_child (widget); c != NULL;
       c = gtk_widget_get_next_sibling (c))
    assert_nothing_selected (c);
}

static void
check_min_width_all_pages (SwWindow *w, const char *what)
{
  static const char *const pages[] = { "curves", "ascent", "working", "trade" };

  for (guint i = 0; i < G_N_ELEMENTS (pages); i++)
    {
      int min;
      g_assert_true (sw_window_show_page (w, pages[i]));
      sw_test_wait_until (sw_test_result_drawn, w, 10000, "the page to be drawn");
      min = min_width (w);
      /* Tab into the page, as a keyboard user would. */
      if (g_str_equal (pages[i], "ascent"))
        gtk_widget_child_focus (GTK_WIDGET (sw_window_get_ascent_page (w)), GTK_DIR_TAB_FORWARD);
      assert_nothing_selected (GTK_WIDGET (w));
      g_test_message ("%s, page %s: minimum width %d px", what, pages[i], min);
      g_assert_cmpint (min, <, 1280);
    }
}

/* Popovers of @widget's menu buttons: their natural width stays well
 * inside a 1,280 px window, wherever their button sits. */
static void
assert_popovers_fit (GtkWidget *widget)
{
  if (GTK_IS_MENU_BUTTON (widget) && gtk_menu_button_get_popover (GTK_MENU_BUTTON (widget)))
    {
      GtkPopover *pop = gtk_menu_button_get_popover (GTK_MENU_BUTTON (widget));
      int nat = 0;
      /* The content: an unmapped popover measures nothing. */
      gtk_widget_measure (gtk_popover_get_child (pop), GTK_ORIENTATION_HORIZONTAL, -1, NULL,
                          &nat, NULL, NULL);
      g_test_message ("popover of %s: natural width %d px",
                      gtk_widget_get_name (widget), nat);
      g_assert_cmpint (nat, <, 480);
    }
  for (GtkWidget *c = gtk_widget_get_first_child (widget); c != NULL;
       c = gtk_widget_get_next_sibling (c))
    assert_popovers_fit (c);
}

static void
test_min_width_extremes (void)
{
  SwWindow *w = window_new ();
  SwDocument *doc = sw_window_get_document (w);
  SwDesign *d;

  load_demo (w, "medium-cargo.stagewright");
  check_min_width_all_pages (w, "demo");
  assert_popovers_fit (GTK_WIDGET (sw_window_get_ascent_page (w)));

  d = sw_design_copy (sw_document_get_design (doc));
  d->payload_kg = 999999999999.0;
  sw_document_commit (doc, d, NULL);
  wait_shown (w);
  check_min_width_all_pages (w, "payload 999,999,999,999 kg");

  /* Infeasible: no stage can give its share with this structure. */
  d = sw_design_copy (sw_document_get_design (doc));
  d->payload_kg = 8000.0;
  for (guint i = 0; i < d->n_stages; i++)
    d->stages[i].structural_coefficient = 0.6;
  sw_document_commit (doc, d, NULL);
  wait_shown (w);
  g_assert_false (sw_window_get_shown_result (w)->sizing.feasible);
  check_min_width_all_pages (w, "infeasible");

  g_assert_true (sw_document_undo (doc));
  wait_shown (w);
  check_min_width_all_pages (w, "after undo");

  /* A large interface font (15 pt) does not force a wider window either. */
  {
    GtkSettings *settings = gtk_settings_get_default ();
    g_autofree char *font = NULL;

    g_object_get (settings, "gtk-font-name", &font, NULL);
    g_object_set (settings, "gtk-font-name", "Sans 15", NULL);
    wait_shown (w);
    check_min_width_all_pages (w, "15 pt font");
    g_object_set (settings, "gtk-font-name", font, NULL);
  }
  sw_test_window_close (w);
}

/* The question a modified window asks when it is closed. */
static GtkDialog *
find_question (SwWindow *w)
{
  GListModel *tops = gtk_window_get_toplevels ();

  for (guint i = 0; i < g_list_model_get_n_items (tops); i++)
    {
      g_autoptr (GObject) o = g_list_model_get_item (tops, i);
      if (GTK_IS_MESSAGE_DIALOG (o) && gtk_window_get_transient_for (GTK_WINDOW (o)) == GTK_WINDOW (w))
        return GTK_DIALOG (o);
    }
  return NULL;
}

static gboolean
question_shown (gpointer data)
{
  return find_question (data) != NULL;
}

/* Closing with unsaved changes and answering Discard, and a window that
 * goes while its question is open (the application quits): no warning and
 * no critical on the way (the GUI tests run with fatal warnings). */
static void
test_close_unsaved (void)
{
  for (int variant = 0; variant < 2; variant++)
    {
      SwWindow *w = window_new ();
      SwDocument *doc = sw_window_get_document (w);
      GtkWidget *weak = GTK_WIDGET (w);
      SwDesign *d = sw_design_copy (sw_document_get_design (doc));

      d->payload_kg += 100.0;
      sw_document_commit (doc, d, NULL);
      wait_shown (w);
      g_assert_true (sw_document_get_modified (doc));
      g_object_add_weak_pointer (G_OBJECT (w), (gpointer *) &weak);
      gtk_window_close (GTK_WINDOW (w));
      sw_test_wait_until (question_shown, w, 5000, "the save question");
      if (variant == 0)
        gtk_dialog_response (find_question (w), GTK_RESPONSE_REJECT);
      else
        gtk_window_destroy (GTK_WINDOW (w));
      for (int i = 0; i < 1000 && weak != NULL; i++)
        g_main_context_iteration (NULL, FALSE);
      g_assert_null (weak);
      for (int i = 0; i < 100; i++)
        g_main_context_iteration (NULL, FALSE);
    }
}


/* A design with propellants and diameters: the to-scale picture follows the
 * setting, the working shows the tanks and the estimate with its sources,
 * and accepting the estimate is one named edit, one undo step. */
static const char *shaped_design =
  "{ \"format\": \"stagewright-design\", \"version\": 2, \"name\": \"Shaped\","
  "  \"payload_kg\": 5000, \"mission\": { \"delta_v_m_s\": 9300 }, \"split\": \"optimal\","
  "  \"stages\": [ { \"name\": \"A\", \"isp_vac_s\": 311, \"structural_coefficient\": 0.07,"
  "                  \"propellant\": \"lox-kerosene\", \"diameter_m\": 3.7,"
  "                  \"engine_count\": 9, \"engine_thrust_vac_kn\": 140 },"
  "                { \"name\": \"B\", \"isp_vac_s\": 450, \"structural_coefficient\": 0.1,"
  "                  \"propellant\": \"lox-hydrogen\", \"thrust_vac_kn\": 300 } ] }";

static void
test_shape_and_estimate (void)
{
  SwWindow *w = window_new ();
  SwDocument *doc = sw_window_get_document (w);
  g_autofree char *path = g_build_filename (tmp_dir, "shaped.stagewright", NULL);
  g_autoptr (GFile) file = g_file_new_for_path (path);
  g_autoptr (GSettings) settings = g_settings_new ("org.stagewright.Stagewright");
  g_autoptr (SwDesign) before = NULL;
  g_autofree char *text = NULL;
  SwAnalysis *r;
  double eps[2];

  g_assert_true (g_file_set_contents (path, shaped_design, -1, NULL));
  g_assert_true (sw_window_load (w, file));
  wait_shown (w);
  r = sw_window_get_shown_result (w);
  g_assert_true (r->ok && r->shape.complete && r->mass_estimate.ok);

  /* The setting chooses the picture. */
  g_assert_false (sw_stack_view_get_to_scale (sw_window_get_stack_view (w)));
  g_settings_set_boolean (settings, "stack-to-scale", TRUE);
  g_assert_true (sw_stack_view_get_to_scale (sw_window_get_stack_view (w)));
  g_settings_set_boolean (settings, "stack-to-scale", FALSE);
  g_assert_false (sw_stack_view_get_to_scale (sw_window_get_stack_view (w)));

  /* The inspector's read-out of the selected stage's tanks. */
  sw_inspector_set_selected (sw_window_get_inspector (w), 0);
  {
    const char *t = gtk_label_get_text (GTK_LABEL (sw_inspector_get_field (
                                          sw_window_get_inspector (w), SW_INSPECTOR_TANKS_LABEL)));
    g_autofree char *len = sw_format_length_m (r->shape.stages[0].shape.length_m);
    g_autofree char *vol = sw_format_volume_m3 (r->shape.stages[0].shape.tank_volume_m3);
    g_test_message ("tanks: %s", t);
    g_assert_nonnull (strstr (t, len));
    g_assert_nonnull (strstr (t, vol));
  }

  sw_working_view_set_selected (sw_window_get_working_view (w), 1);
  text = sw_working_view_dup_text (sw_window_get_working_view (w));
  g_test_message ("%s", text);
  g_assert_nonnull (strstr (text, "Tanks and length"));
  g_assert_nonnull (strstr (text, "Structural coefficient estimated"));
  g_assert_nonnull (strstr (text, "Akin"));

  before = sw_document_dup_design (doc);
  for (guint i = 0; i < 2; i++)
    eps[i] = round (r->mass_estimate.stages[i].structural_coefficient * 1e4) / 1e4;
  g_assert_true (gtk_widget_activate_action (GTK_WIDGET (w), "design.accept-eps-estimate", NULL));
  wait_shown (w);
  for (guint i = 0; i < 2; i++)
    g_assert_cmpfloat (sw_document_get_design (doc)->stages[i].structural_coefficient, ==,
                       eps[i]);
  g_assert_true (sw_document_undo (doc));
  g_assert_true (sw_design_equal (sw_document_get_design (doc), before));
  g_assert_false (sw_document_can_undo (doc));
  sw_test_window_close (w);
}

/* Strap-on boosters: the core's working shows one booster's breakdown with
 * its sources, and "Use estimated ε" takes the boosters' estimate with the
 * stages' in one undo step (the four-booster demo). */
static void
test_booster_estimate (void)
{
  SwWindow *w = window_new ();
  SwDocument *doc = sw_window_get_document (w);
  g_autoptr (SwDesign) before = NULL;
  g_autofree char *text = NULL;
  SwAnalysis *r;
  double eps[2], booster;

  load_demo (w, "four-booster-cargo.stagewright");
  r = sw_window_get_shown_result (w);
  g_assert_true (r->ok && r->mass_estimate.ok && r->mass_estimate.has_boosters);
  g_assert_true (r->mass_estimate.boosters.estimated);
  sw_window_show_page (w, "working");
  sw_working_view_set_selected (sw_window_get_working_view (w), 0);
  text = sw_working_view_dup_text (sw_window_get_working_view (w));
  g_test_message ("%s", text);
  g_assert_nonnull (strstr (text, "structural coefficient estimated, per booster"));
  g_assert_nonnull (strstr (text, "Nose cone"));
  g_assert_nonnull (strstr (text, "Attachment"));
  g_assert_nonnull (strstr (text, "Motor case"));
  g_assert_nonnull (strstr (text, "every stage and the boosters (design → estimate):"));
  g_assert_null (strstr (text, "nan"));

  r = sw_window_get_shown_result (w);
  before = sw_document_dup_design (doc);
  for (guint i = 0; i < 2; i++)
    eps[i] = round (r->mass_estimate.stages[i].structural_coefficient * 1e4) / 1e4;
  booster = round (r->mass_estimate.boosters.structural_coefficient * 1e4) / 1e4;
  g_assert_cmpfloat (booster, !=, before->boosters.structural_coefficient);
  g_assert_true (gtk_widget_activate_action (GTK_WIDGET (w), "design.accept-eps-estimate", NULL));
  wait_shown (w);
  for (guint i = 0; i < 2; i++)
    g_assert_cmpfloat (sw_document_get_design (doc)->stages[i].structural_coefficient, ==,
                       eps[i]);
  g_assert_cmpfloat (sw_document_get_design (doc)->boosters.structural_coefficient, ==, booster);
  g_assert_true (sw_document_undo (doc));
  g_assert_true (sw_design_equal (sw_document_get_design (doc), before));
  sw_test_window_close (w);
}

/* Fixed propellant loads in the working: the two demos with fixed stages
 * say which stages are fixed and how the sized ones were split, show a
 * fixed stage's delta-v from the rocket equation on its load, and give the
 * sizing's limit with no payload and its headroom (not the sum of
 * c ln(1/eps), not the delta-v with the payload). */
static char *
working_text (SwWindow *w, int stage)
{
  char *text;

  sw_working_view_set_selected (sw_window_get_working_view (w), stage);
  text = sw_working_view_dup_text (sw_window_get_working_view (w));
  g_test_message ("%s", text);
  g_assert_null (strstr (text, "nan"));
  return text;
}

static void
test_fixed_working (void)
{
  SwWindow *w = window_new ();
  SwAnalysis *r;

  sw_window_show_page (w, "working");
  load_demo (w, "sallowmere-as-built.stagewright");
  r = sw_window_get_shown_result (w);
  g_assert_true (r->ok && r->sizing.feasible && r->sizing.n_fixed == 2);
  for (int i = 0; i < 2; i++)
    {
      g_autofree char *text = working_text (w, i);
      g_autofree char *lim = sw_format_number (r->sizing.delta_v_limit_m_s, 1);
      g_autofree char *head = sw_format_number (r->sizing.margin_m_s, 1);
      g_autofree char *given = sw_format_number (r->sizing.delta_v_given_m_s, 1);
      g_autofree char *dv = sw_format_number (r->sizing.stages[i].delta_v_m_s, 1);
      g_autofree char *slim = sw_format_number (r->sizing.stages[i].delta_v_limit_m_s, 1);

      g_assert_nonnull (strstr (text, "Split: none; every load is fixed (stages 1, 2)"));
      g_assert_null (strstr (text, "Lagrange"));
      g_assert_nonnull (strstr (text, "Fixed propellant load (this stage is not sized)"));
      g_assert_nonnull (strstr (text, dv));
      g_assert_nonnull (strstr (text, slim));
      g_assert_nonnull (strstr (text, lim));
      g_assert_nonnull (strstr (text, head));
      g_assert_nonnull (strstr (text, given));
      g_assert_null (strstr (text, "Σ c_i·ln(1/ε_i) ="));
    }
  /* The limit is the stages' own no-payload figures added up, above what
   * the vehicle gives with its payload. */
  g_assert_cmpfloat (fabs (r->sizing.delta_v_limit_m_s - r->sizing.stages[0].delta_v_limit_m_s
                           - r->sizing.stages[1].delta_v_limit_m_s), <, 1e-6);
  g_assert_cmpfloat (r->sizing.delta_v_limit_m_s, >, r->sizing.delta_v_given_m_s + 1000.0);

  load_demo (w, "sallowmere-kestrune-upper-stage.stagewright");
  r = sw_window_get_shown_result (w);
  g_assert_true (r->ok && r->sizing.feasible && r->sizing.n_fixed == 1);
  {
    g_autofree char *sized = working_text (w, 0);
    g_autofree char *fixed = working_text (w, 1);
    g_autofree char *lim = sw_format_number (r->sizing.delta_v_limit_m_s, 1);

    g_assert_nonnull (strstr (sized, "among the sized stages: 1\nFixed load (not sized): 2"));
    g_assert_nonnull (strstr (sized, "Lagrange multiplier (the same for every sized stage)"));
    g_assert_null (strstr (sized, "the same for every stage"));
    g_assert_nonnull (strstr (sized, lim));
    g_assert_null (strstr (sized, "delta-v with this payload"));
    g_assert_nonnull (strstr (fixed, "Fixed propellant load (this stage is not sized)"));
    g_assert_null (strstr (fixed, "Lagrange multiplier ("));
  }
  sw_test_window_close (w);
}

/* The stage-count plot labels its crosses once: with a design that does
 * not close and several counts without a solution, the labels of
 * neighbouring crosses were printed over each other. */
static guint
labelled_markers (SwPlot *plot, guint *crosses)
{
  guint n = 0;

  *crosses = 0;
  for (guint i = 0; i < plot->markers->len; i++)
    {
      const Marker *m = plot->markers->pdata[i];
      if (m->kind == SW_MARKER_INFEASIBLE)
        (*crosses)++;
      if (m->label != NULL && m->label[0] != '\0')
        n++;
    }
  return n;
}

static void
test_stage_count_labels (void)
{
  g_autofree char *path = demo_path ("all-solid-concept.stagewright");
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, NULL);
  GtkWidget *plot = sw_plot_new ();
  SwAnalysis *r;
  guint infeasible = 0, crosses = 0;

  g_object_ref_sink (plot);
  g_assert_nonnull (d);
  /* Beyond the four solid stages (test-analysis: infeasible). */
  d->mission.delta_v_m_s = 25000.0;
  r = sw_analysis_run (d, NULL, NULL);
  g_assert_false (r->sizing.feasible);
  for (guint k = 0; k < r->stage_curve.n_points; k++)
    infeasible += !r->stage_curve.points[k].feasible;
  g_assert_cmpuint (infeasible, >=, 2);
  sw_trade_plots_show_stage_count (SW_PLOT (plot), r);
  /* One cross per count without a solution (the design's own count is one
   * of them), one label: the design's. */
  g_assert_cmpuint (labelled_markers (SW_PLOT (plot), &crosses), ==, 1);
  g_assert_cmpuint (crosses, ==, infeasible);
  sw_analysis_unref (r);

  /* A design that closes: "this design" and one "no solution". */
  d->mission.delta_v_m_s = 9000.0;
  r = sw_analysis_run (d, NULL, NULL);
  g_assert_true (r->sizing.feasible);
  infeasible = 0;
  for (guint k = 0; k < r->stage_curve.n_points; k++)
    infeasible += !r->stage_curve.points[k].feasible;
  sw_trade_plots_show_stage_count (SW_PLOT (plot), r);
  g_assert_cmpuint (labelled_markers (SW_PLOT (plot), &crosses), ==, infeasible > 0 ? 2 : 1);
  g_assert_cmpuint (crosses, ==, infeasible);
  /* Tonnes for a vehicle of tonnes. */
  {
    g_autofree char *t = sw_plot_axis_format (&SW_PLOT (plot)->y, 20000.0, 0, FALSE);
    g_assert_cmpstr (t, ==, "20 t");
  }
  sw_analysis_unref (r);

  /* A 100 g payload on a small vehicle: the mass axis in kilograms by the
   * formatter's rule (below 10 t), never "0.006 t". */
  d->payload_kg = 0.1;
  d->mission.delta_v_m_s = 7000.0;
  r = sw_analysis_run (d, NULL, NULL);
  g_assert_true (r->sizing.feasible);
  g_assert_cmpfloat (r->sizing.liftoff_mass_kg, <, 1000.0);
  sw_trade_plots_show_stage_count (SW_PLOT (plot), r);
  {
    g_autofree char *six = sw_plot_axis_format (&SW_PLOT (plot)->y, 6.0, 0, FALSE);
    g_autofree char *fifty = sw_plot_axis_format (&SW_PLOT (plot)->y, 50.0, 0, FALSE);
    g_assert_cmpstr (six, ==, "6 kg");
    g_assert_cmpstr (fifty, ==, "50 kg");
  }
  sw_trade_plots_show_sweep (SW_PLOT (plot), r);
  {
    g_autofree char *six = sw_plot_axis_format (&SW_PLOT (plot)->y, 6.0, 0, FALSE);
    g_assert_cmpstr (six, ==, "6 kg");
  }
  sw_analysis_unref (r);
  g_object_unref (plot);
}

/* Choosing another stage in the stage list settles in a frame or two: no
 * style fades on (a row's outline fades for 200 ms in the default theme),
 * which would restyle the window and ask for its size at every frame, and
 * each edit made meanwhile would pay for them (bench-gui). */
static void
test_selection_settles (void)
{
  GtkCssProvider *css;
  SwWindow *w;
  GdkFrameClock *clock;
  SwInspector *insp;

  /* The application's own style rules, as it runs. */
  css = sw_test_add_app_style ();
  w = window_new ();
  clock = gtk_widget_get_frame_clock (GTK_WIDGET (w));
  insp = sw_window_get_inspector (w);
  load_demo (w, "medium-cargo.stagewright");
  sw_test_wait_until (sw_test_result_complete, w, 120000, "the first result in full");
  sw_test_spin_ms (300);
  for (int k = 0; k < 4; k++)
    {
      guint layouts = 0;
      gulong id;

      sw_inspector_set_selected (insp, (k + 1) % 2);
      /* The frame that shows the selection. */
      sw_test_spin_ms (40);
      id = g_signal_connect (clock, "layout", G_CALLBACK (sw_test_count_cb), &layouts);
      sw_test_spin_ms (400);
      g_signal_handler_disconnect (clock, id);
      g_test_message ("stage %d selected: %u layouts in the 400 ms after its frame",
                      (k + 1) % 2 + 1, layouts);
      g_assert_cmpuint (layouts, <=, 2);
    }
  sw_test_window_close (w);
  sw_test_remove_app_style (css);
}

/* The notes take their full height once shown, not at the first layout
 * of the inspector after (choosing a stage moved every field under the
 * pointer as the notes grew). */
static void
test_notes_steady (void)
{
  SwWindow *w = sw_window_new (NULL);
  SwInspector *insp = sw_window_get_inspector (w);
  GtkWidget *notes = sw_inspector_get_field (insp, SW_INSPECTOR_NOTES);
  GtkWidget *payload = sw_inspector_get_field (insp, SW_INSPECTOR_PAYLOAD);
  g_autofree char *path = demo_path ("medium-cargo.stagewright");
  g_autoptr (GFile) file = g_file_new_for_path (path);
  graphene_point_t at, moved;
  int h;

  /* As the application opens a file it is given: loaded, then shown. */
  g_assert_true (sw_window_load (w, file));
  gtk_window_present (GTK_WINDOW (w));
  sw_test_wait_until (sw_test_result_complete, w, 120000, "the first result in full");
  sw_test_spin_ms (500);
  h = gtk_widget_get_height (notes);
  g_assert_true (gtk_widget_compute_point (payload, GTK_WIDGET (w), &GRAPHENE_POINT_INIT (0, 0), &at));
  sw_inspector_set_selected (insp, 1);
  sw_test_spin_ms (300);
  sw_inspector_set_selected (insp, 0);
  sw_test_spin_ms (300);
  g_assert_true (gtk_widget_compute_point (payload, GTK_WIDGET (w), &GRAPHENE_POINT_INIT (0, 0), &moved));
  g_test_message ("notes %d px, then %d px; the payload field at y %.0f, then %.0f", h,
                  gtk_widget_get_height (notes), at.y, moved.y);
  g_assert_cmpint (gtk_widget_get_height (notes), ==, h);
  g_assert_cmpfloat (moved.y, ==, at.y);
  /* Its full text: more than the four lines it showed at first. */
  g_assert_cmpint (h, >, 100);
  sw_test_window_close (w);
}

int
main (int argc, char **argv)
{
  int status;

  /* Literal expected texts are written for this locale. */
  g_setenv ("LC_ALL", "C.UTF-8", TRUE);
  /* Private folders for state (the recovery copy), data (recent files) and
   * settings; the schema comes from the build folder. */
  tmp_dir = sw_gui_test_env_init (&argc, &argv, "stagewright-gui-XXXXXX");

  g_test_add_func ("/gui/window/builds", test_builds);
  g_test_add_func ("/gui/window/payload-curves", test_payload_curves);
  g_test_add_func ("/gui/window/edit-fields", test_edit_fields);
  g_test_add_func ("/gui/window/drag-border", test_drag_border);
  g_test_add_func ("/gui/window/undo-exact", test_undo_exact);
  g_test_add_func ("/gui/window/save-reopen", test_save_reopen);
  g_test_add_func ("/gui/window/recovery", test_recovery);
  g_test_add_func ("/gui/window/thousand-edits", test_thousand_edits);
  g_test_add_func ("/gui/window/plots-current", test_plots_current);
  g_test_add_func ("/gui/window/min-width-extremes", test_min_width_extremes);
  g_test_add_func ("/gui/window/close-unsaved", test_close_unsaved);
  g_test_add_func ("/gui/window/shape-and-estimate", test_shape_and_estimate);
  g_test_add_func ("/gui/window/booster-estimate", test_booster_estimate);
  g_test_add_func ("/gui/window/fixed-working", test_fixed_working);
  g_test_add_func ("/gui/window/stage-count-labels", test_stage_count_labels);
  g_test_add_func ("/gui/window/selection-settles", test_selection_settles);
  g_test_add_func ("/gui/window/notes-steady", test_notes_steady);

  status = g_test_run ();
  sw_gui_test_env_finish (tmp_dir);
  return status;
}
