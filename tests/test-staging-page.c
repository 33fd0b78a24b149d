/* SPDX-License-Identifier: GPL-3.0-or-later */
/* GUI tests of the staging-decision page: its figures come from the worker
 * (the weighting shown is the core's statement for the design), a newer
 * result replaces an older one still running, a page destroyed while its
 * worker runs does not crash, and the window shows the page by name.  Run
 * under Xvfb with the cairo renderer (suite 'gui'). */
#include "config.h"

#include "sw-design-edit.h"
#include "sw-design-fields.h"
#include "sw-limits.h"
#include "sw-engine-types-editor.h"
#include "sw-number-field.h"
#include "sw-staging-page.h"
#include "sw-window-private.h"

#include "gui-test-env.h"

#include <string.h>

static char *tmp_dir;

static gboolean
ready_cb (gpointer data)
{
  return sw_staging_page_is_ready (SW_STAGING_PAGE (data));
}

static SwAnalysis *
analyse (SwDesign *d)
{
  SwAnalysisOptions o;

  sw_analysis_options_init (&o);
  o.montecarlo = FALSE;
  o.ascent = FALSE;
  return sw_analysis_run (d, &o, NULL);
}

static void
test_page_shows_worker_result (void)
{
  g_autoptr (SwDesign) d = sw_design_new_default ();
  g_autoptr (SwDesign) d2 = sw_design_new_default ();
  GtkWidget *win = gtk_window_new ();
  GtkWidget *page = sw_staging_page_new ();
  SwAnalysis *a, *b;

  gtk_window_set_child (GTK_WINDOW (win), page);
  gtk_window_set_default_size (GTK_WINDOW (win), 1000, 900);
  gtk_window_present (GTK_WINDOW (win));
  g_assert_false (sw_staging_page_is_ready (SW_STAGING_PAGE (page)));

  /* Two results in a row: the first is cancelled or dropped, the second
   * shown.  The second design recovers its first stage, so the statement
   * names the recovered cost per flight. */
  d2->economics.present = TRUE;
  d2->economics.recovery_mode = SW_RECOVERY_DOWNRANGE;
  d2->economics.weight_development = 0.0;
  a = analyse (d);
  b = analyse (d2);
  sw_staging_page_set_result (SW_STAGING_PAGE (page), a);
  sw_staging_page_set_result (SW_STAGING_PAGE (page), b);
  sw_test_wait_until (ready_cb, page, 20000, "the staging page's worker");
  g_assert_cmpstr (sw_staging_page_get_weighting (SW_STAGING_PAGE (page)), ==,
                   "Weights: liftoff mass 1, cost per flight (first stage reused) 1; each "
                   "criterion divided by its best stage count, the lowest sum wins");

  /* A result, then the page goes away while its worker may still run. */
  sw_staging_page_set_result (SW_STAGING_PAGE (page), a);
  gtk_window_destroy (GTK_WINDOW (win));
  sw_analysis_unref (a);
  sw_analysis_unref (b);
  /* Let the worker finish and its callback run against the disposed page. */
  for (guint i = 0; i < 50; i++)
    {
      g_usleep (2000);
      while (g_main_context_iteration (NULL, FALSE))
        ;
    }
}

static void
test_window_has_page (void)
{
  SwWindow *w = sw_window_new (NULL);

  gtk_window_present (GTK_WINDOW (w));
  g_assert_true (sw_window_show_page (w, "staging"));
  {
    SwStagingPage *page = sw_window_get_staging_page (w);
    SwDocument *doc = sw_window_get_document (w);
    GtkWidget *run = sw_staging_page_get_field (page, SW_ECON_PRODUCTION_RUN);
    GtkWidget *hw = sw_staging_page_get_field (page, SW_ECON_LANDING_HARDWARE);

    /* A typed value is one named edit of the design, undone in one step. */
    g_assert_true (sw_number_field_enter (SW_NUMBER_FIELD (run), "25"));
    g_assert_true (sw_document_get_design (doc)->economics.present);
    g_assert_cmpuint (sw_document_get_design (doc)->economics.production_run, ==, 25);
    /* Fractions are shown in percent. */
    g_assert_true (sw_number_field_enter (SW_NUMBER_FIELD (hw), "12"));
    g_assert_cmpfloat_with_epsilon (sw_document_get_design (doc)->economics
                                      .landing_hardware_fraction, 0.12, 1e-12);
    /* Outside the range: refused, the design unchanged. */
    g_assert_false (sw_number_field_enter (SW_NUMBER_FIELD (run), "0"));
    g_assert_cmpuint (sw_document_get_design (doc)->economics.production_run, ==, 25);
    gtk_drop_down_set_selected (GTK_DROP_DOWN (sw_staging_page_get_mode (page)), 2);
    g_assert_cmpint (sw_document_get_design (doc)->economics.recovery_mode, ==,
                     SW_RECOVERY_LAUNCH_SITE);
    g_assert_true (sw_document_undo (doc));
    g_assert_cmpint (sw_document_get_design (doc)->economics.recovery_mode, ==,
                     SW_RECOVERY_NONE);
  }
  sw_test_window_close (w);
}

static const SwEconomics *
econ_of (SwDocument *doc)
{
  return &sw_document_get_design (doc)->economics;
}

static guint
undo_steps (SwDocument *doc)
{
  guint n = 0;

  while (sw_document_undo (doc))
    n++;
  return n;
}

/* The economics lists in the window: engine types (add, rename, dry mass,
 * stages, developed, remove) and developed stages, each a named edit and
 * one undo step; refusals (a blank or taken name, a mass out of range, a
 * stage already on another type) are shown and change nothing. */
static void
test_engine_types_editor (void)
{
  SwWindow *w = sw_window_new (NULL);
  SwDocument *doc = sw_window_get_document (w);
  SwEngineTypesEditor *ed;
  GtkWidget *name, *mass, *message, *check;
  g_autoptr (SwDesign) before = NULL;
  guint steps = 0;

  gtk_window_present (GTK_WINDOW (w));
  g_assert_true (sw_window_show_page (w, "staging"));
  while (sw_document_undo (doc))
    ;
  ed = SW_ENGINE_TYPES_EDITOR (sw_staging_page_get_engine_types (sw_window_get_staging_page (w)));
  message = sw_engine_types_editor_get_message (ed);
  g_assert_cmpuint (sw_document_get_design (doc)->n_stages, >=, 2);
  g_assert_cmpuint (econ_of (doc)->n_engine_types, ==, 0);
  g_assert_null (sw_engine_types_editor_get_widget (ed, 0, SW_ENGINE_TYPE_NAME));

  g_signal_emit_by_name (sw_engine_types_editor_get_add_button (ed), "clicked");
  steps++;
  g_assert_cmpuint (econ_of (doc)->n_engine_types, ==, 1);
  name = sw_engine_types_editor_get_widget (ed, 0, SW_ENGINE_TYPE_NAME);
  mass = sw_engine_types_editor_get_widget (ed, 0, SW_ENGINE_TYPE_DRY_MASS);
  g_assert_true (GTK_IS_ENTRY (name));
  g_assert_cmpstr (gtk_editable_get_text (GTK_EDITABLE (name)), ==, "Engine 1");

  /* Rename; a blank name is refused and marked. */
  gtk_editable_set_text (GTK_EDITABLE (name), "Core engine");
  g_signal_emit_by_name (name, "activate");
  steps++;
  g_assert_cmpstr (econ_of (doc)->engine_types[0].name, ==, "Core engine");
  before = sw_document_dup_design (doc);
  gtk_editable_set_text (GTK_EDITABLE (name), "   ");
  g_signal_emit_by_name (name, "activate");
  g_assert_true (sw_design_equal (sw_document_get_design (doc), before));
  g_assert_true (gtk_widget_has_css_class (name, "error"));
  g_assert_true (gtk_widget_get_visible (message));
  gtk_editable_set_text (GTK_EDITABLE (name), "Core engine");
  g_signal_emit_by_name (name, "activate");
  g_assert_false (gtk_widget_has_css_class (name, "error"));
  g_assert_false (gtk_widget_get_visible (message));

  /* The dry mass: a number field with the limits table's range. */
  g_assert_true (sw_number_field_enter (SW_NUMBER_FIELD (mass), "2500"));
  steps++;
  g_assert_cmpfloat (econ_of (doc)->engine_types[0].dry_mass_kg, ==, 2500.0);
  g_assert_false (sw_number_field_enter (SW_NUMBER_FIELD (mass), "-5"));
  g_assert_false (sw_number_field_enter (SW_NUMBER_FIELD (mass), "abc"));
  g_assert_cmpfloat (econ_of (doc)->engine_types[0].dry_mass_kg, ==, 2500.0);
  sw_number_field_reset (SW_NUMBER_FIELD (mass), 2500.0);

  /* On stages 1 and 2 (indices 0, 1). */
  gtk_check_button_set_active (GTK_CHECK_BUTTON (sw_engine_types_editor_get_stage_check (ed, 0, 0)),
                               TRUE);
  gtk_check_button_set_active (GTK_CHECK_BUTTON (sw_engine_types_editor_get_stage_check (ed, 0, 1)),
                               TRUE);
  steps += 2;
  g_assert_cmpuint (econ_of (doc)->engine_types[0].stage_mask, ==, 0x3);

  /* A second type on stage 2: refused (stage 2 uses the first), the box
   * goes back, the message names the other type. */
  g_signal_emit_by_name (sw_engine_types_editor_get_add_button (ed), "clicked");
  steps++;
  g_clear_pointer (&before, sw_design_free);
  before = sw_document_dup_design (doc);
  check = sw_engine_types_editor_get_stage_check (ed, 1, 1);
  gtk_check_button_set_active (GTK_CHECK_BUTTON (check), TRUE);
  g_assert_false (gtk_check_button_get_active (GTK_CHECK_BUTTON (check)));
  g_assert_true (sw_design_equal (sw_document_get_design (doc), before));
  g_assert_true (gtk_widget_get_visible (message));
  g_assert_nonnull (strstr (gtk_label_get_text (GTK_LABEL (message)), "Core engine"));
  /* A name another type has is refused too. */
  name = sw_engine_types_editor_get_widget (ed, 1, SW_ENGINE_TYPE_NAME);
  gtk_editable_set_text (GTK_EDITABLE (name), "Core engine");
  g_signal_emit_by_name (name, "activate");
  g_assert_true (sw_design_equal (sw_document_get_design (doc), before));
  g_assert_true (gtk_widget_has_css_class (name, "error"));

  /* Developed: the type, and stage 2 (index 1). */
  gtk_check_button_set_active (
    GTK_CHECK_BUTTON (sw_engine_types_editor_get_widget (ed, 0, SW_ENGINE_TYPE_DEVELOPED)), TRUE);
  gtk_check_button_set_active (GTK_CHECK_BUTTON (sw_engine_types_editor_get_developed_stage (ed, 1)),
                               TRUE);
  steps += 2;
  g_assert_true (econ_of (doc)->engine_types[0].developed);
  g_assert_cmpuint (econ_of (doc)->developed_stages, ==, 0x2);
  g_assert_true (sw_design_validate (sw_document_get_design (doc), NULL, NULL));

  /* Remove the second type. */
  g_signal_emit_by_name (sw_engine_types_editor_get_widget (ed, 1, SW_ENGINE_TYPE_REMOVE),
                         "clicked");
  steps++;
  g_assert_cmpuint (econ_of (doc)->n_engine_types, ==, 1);
  g_assert_null (sw_engine_types_editor_get_widget (ed, 1, SW_ENGINE_TYPE_NAME));

  /* Each change was one undo step, and undoing them all shows none. */
  g_assert_cmpuint (undo_steps (doc), ==, steps);
  g_assert_cmpuint (econ_of (doc)->n_engine_types, ==, 0);
  g_assert_null (sw_engine_types_editor_get_widget (ed, 0, SW_ENGINE_TYPE_NAME));
  g_assert_false (gtk_check_button_get_active (
    GTK_CHECK_BUTTON (sw_engine_types_editor_get_developed_stage (ed, 1))));

  /* The most stages and engine types the limits allow do not widen the
   * window (the stage boxes wrap). */
  {
    SwDesign *d = sw_document_dup_design (doc);
    int min = 0;

    while (d->n_stages < sw_limit_get (SW_LIMIT_STAGE_COUNT)->max)
      g_assert_true (sw_design_add_stage (d));
    for (guint i = 0; i < d->n_stages; i++)
      {
        g_assert_true (sw_design_add_engine_type (d, NULL));
        g_assert_true (sw_design_set_engine_type_on_stage (d, i, i, TRUE, NULL));
      }
    sw_document_commit (doc, d, NULL);
    while (g_main_context_iteration (NULL, FALSE))
      ;
    g_assert_nonnull (sw_engine_types_editor_get_stage_check (ed, 7, 7));
    gtk_widget_measure (GTK_WIDGET (w), GTK_ORIENTATION_HORIZONTAL, -1, &min, NULL, NULL, NULL);
    g_assert_cmpint (min, <, 1280);
    /* Nor does the editor need a sideways scroll in the page's column
     * (about 560 px of a 1,280 px window). */
    gtk_widget_measure (GTK_WIDGET (ed), GTK_ORIENTATION_HORIZONTAL, -1, &min, NULL, NULL, NULL);
    g_test_message ("8 stages, 8 engine types: the editor's minimum width %d px", min);
    g_assert_cmpint (min, <=, 480);
  }
  sw_test_window_close (w);
}

int
main (int argc, char **argv)
{
  int status;

  tmp_dir = sw_gui_test_env_init (&argc, &argv, "sw-staging-page-XXXXXX");
  g_test_add_func ("/gui/staging-page/shows-worker-result", test_page_shows_worker_result);
  g_test_add_func ("/gui/staging-page/window-has-page", test_window_has_page);
  g_test_add_func ("/gui/staging-page/engine-types-editor", test_engine_types_editor);
  status = g_test_run ();
  sw_gui_test_env_finish (tmp_dir);
  return status;
}
