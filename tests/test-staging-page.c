/* SPDX-License-Identifier: GPL-3.0-or-later */
/* GUI tests of the staging-decision page: its figures come from the worker
 * (the weighting shown is the core's statement for the design), a newer
 * result replaces an older one still running, a page destroyed while its
 * worker runs does not crash, and the window shows the page by name.  The
 * carpet's picker driven by real input (xdotool through XTEST): two other
 * parameters, their ranges typed, the grid equal to individual sizings at
 * sampled points; a range the wrong way round or outside the key's limit
 * marked and nothing computed; Cancel; the currency label typed.  Run
 * under Xvfb with the cairo renderer, X11 backend (suite 'gui'). */
#include "config.h"

#include "sw-design-edit.h"
#include "sw-design-fields.h"
#include "sw-limits.h"
#include "sw-engine-types-editor.h"
#include "sw-carpet.h"
#include "sw-application.h"
#include "sw-number-field.h"
#include "sw-sizing.h"
#include "sw-staging-page.h"
#include "sw-window-private.h"

#include "gui-test-env.h"

#include <gdk/x11/gdkx.h>
#include <glib/gstdio.h>
#include <math.h>
#include <string.h>
#include <sys/wait.h>

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
  /* The weighting, then this design's payload penalty of recovery. */
  {
    g_autofree char *penalty
      = sw_staging_dup_penalty_note (sw_staging_page_get_staging (SW_STAGING_PAGE (page)));
    g_autofree char *want = NULL;

    g_assert_nonnull (penalty);
    g_assert_nonnull (strstr (penalty, "less payload at the same liftoff mass"));
    want = g_strdup_printf ("Weights: liftoff mass 1, cost per flight (first stage reused) 1; "
                            "each criterion divided by its best stage count, the lowest sum "
                            "wins. %s", penalty);
    g_assert_cmpstr (sw_staging_page_get_weighting (SW_STAGING_PAGE (page)), ==, want);
  }

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

/* A "simulate" design: the fast phase's table and carpet use the first
 * guess; once the ascent phase has closed the loop, the page sizes the
 * table and the carpet again with the loop's losses, and this design's row
 * and the carpet's mark are the totals' liftoff mass. */
static gboolean
looped_cb (gpointer data)
{
  const SwStaging *s = sw_staging_page_get_staging (SW_STAGING_PAGE (data));

  return sw_staging_page_is_ready (SW_STAGING_PAGE (data)) && s != NULL
         && strstr (s->losses_note, "closed loop's losses") != NULL;
}

static void
test_page_follows_loop (void)
{
  g_autofree char *path = g_build_filename (SOURCE_DESIGNS_DIR,
                                            "three-stage-simulated.stagewright", NULL);
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, NULL);
  g_autoptr (SwAnalysis) fast = NULL, flown = NULL;
  GtkWidget *win = gtk_window_new ();
  GtkWidget *page = sw_staging_page_new ();
  const SwStaging *s;
  const SwCarpet *c;
  SwAnalysisOptions o;

  g_assert_nonnull (d);
  gtk_window_set_child (GTK_WINDOW (win), page);
  gtk_window_set_default_size (GTK_WINDOW (win), 1000, 900);
  gtk_window_present (GTK_WINDOW (win));
  sw_analysis_options_init (&o);
  o.montecarlo = FALSE;
  fast = sw_analysis_new (d, 1, &o, NULL);
  g_assert_true (fast->ascent_pending);
  flown = sw_analysis_add_ascent (fast, NULL);
  g_assert_true (flown->sized_by_ascent && flown->trade_losses_simulated);

  sw_staging_page_set_result (SW_STAGING_PAGE (page), fast);
  sw_test_wait_until (ready_cb, page, 20000, "the first-guess table");
  s = sw_staging_page_get_staging (SW_STAGING_PAGE (page));
  g_assert_nonnull (strstr (s->losses_note, "first guess"));
  g_assert_cmpfloat_with_epsilon (s->rows[2].liftoff_mass_kg / fast->sizing.liftoff_mass_kg, 1.0,
                                  1e-9);
  /* The carpet's mark is the table's row: the first guess, and it says so. */
  c = sw_staging_page_get_carpet (SW_STAGING_PAGE (page));
  g_assert_nonnull (c);
  g_assert_cmpfloat_with_epsilon (c->design_value / fast->sizing.liftoff_mass_kg, 1.0, 1e-9);
  g_assert_nonnull (strstr (c->note, "first guess"));
  g_assert_cmpstr (gtk_label_get_text (GTK_LABEL (sw_staging_page_get_carpet_control (
                     SW_STAGING_PAGE (page), SW_CARPET_CONTROL_STATUS, 0))), ==, c->note);

  sw_staging_page_set_result (SW_STAGING_PAGE (page), flown);
  sw_test_wait_until (looped_cb, page, 20000, "the closed loop's table");
  s = sw_staging_page_get_staging (SW_STAGING_PAGE (page));
  g_assert_cmpfloat_with_epsilon (s->rows[2].liftoff_mass_kg / flown->sizing.liftoff_mass_kg,
                                  1.0, 1e-9);
  /* The carpet computed again with the loop's losses: its mark is the
   * table's row and the totals' liftoff mass, and its note says so. */
  c = sw_staging_page_get_carpet (SW_STAGING_PAGE (page));
  g_assert_nonnull (c);
  g_assert_cmpfloat_with_epsilon (c->design_value / flown->sizing.liftoff_mass_kg, 1.0, 1e-9);
  g_assert_cmpfloat_with_epsilon (c->design_value / s->rows[2].liftoff_mass_kg, 1.0, 1e-9);
  g_assert_nonnull (strstr (c->note, "closed loop's losses"));
  g_assert_cmpstr (gtk_label_get_text (GTK_LABEL (sw_staging_page_get_carpet_control (
                     SW_STAGING_PAGE (page), SW_CARPET_CONTROL_STATUS, 0))), ==, c->note);
  g_assert_cmpfloat (fabs (flown->sizing.liftoff_mass_kg / fast->sizing.liftoff_mass_kg - 1.0),
                     >, 0.03);
  gtk_window_destroy (GTK_WINDOW (win));
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
    /* The boosters' mode: a named edit of its own, the first stage's
     * untouched; undone in one step. */
    gtk_drop_down_set_selected (GTK_DROP_DOWN (sw_staging_page_get_booster_mode (page)), 1);
    g_assert_cmpint (sw_document_get_design (doc)->economics.booster_recovery_mode, ==,
                     SW_RECOVERY_DOWNRANGE);
    g_assert_cmpint (sw_document_get_design (doc)->economics.recovery_mode, ==,
                     SW_RECOVERY_NONE);
    g_assert_true (sw_document_undo (doc));
    g_assert_cmpint (sw_document_get_design (doc)->economics.booster_recovery_mode, ==,
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

/* ---- real input (as tests/test-gui-input.c) ------------------------------ */

static void
drain (void)
{
  for (int round = 0; round < 3; round++)
    {
      gdk_display_sync (gdk_display_get_default ());
      while (g_main_context_pending (NULL))
        g_main_context_iteration (NULL, FALSE);
    }
}

static void
xdo (const char *first, ...)
{
  g_autoptr (GPtrArray) argv = g_ptr_array_new ();
  g_autoptr (GError) error = NULL;
  g_autofree char *err = NULL;
  int status = 0;
  va_list ap;

  g_ptr_array_add (argv, (char *) "timeout");
  g_ptr_array_add (argv, (char *) "10");
  g_ptr_array_add (argv, (char *) "xdotool");
  va_start (ap, first);
  for (const char *a = first; a != NULL; a = va_arg (ap, const char *))
    g_ptr_array_add (argv, (char *) a);
  va_end (ap);
  g_ptr_array_add (argv, NULL);
  if (!g_spawn_sync (NULL, (char **) argv->pdata, NULL, G_SPAWN_SEARCH_PATH
                     | G_SPAWN_STDOUT_TO_DEV_NULL, NULL, NULL, NULL, &err, &status, &error))
    g_error ("xdotool: %s", error->message);
  if (!g_spawn_check_wait_status (status, &error))
    g_error ("xdotool %s: %s (%s)", first, error->message, err);
  drain ();
}

static gboolean
is_active (gpointer data)
{
  return gtk_window_is_active (GTK_WINDOW (data));
}

static gboolean
mapped (gpointer data)
{
  return gtk_widget_get_mapped (GTK_WIDGET (data));
}

static void
focus_widget (SwWindow *w, GtkWidget *widget)
{
  GdkSurface *surface = gtk_native_get_surface (GTK_NATIVE (w));
  g_autofree char *xid = g_strdup_printf ("%lu",
                                          (unsigned long) gdk_x11_surface_get_xid (surface));
  GtkWidget *focus;

  xdo ("windowfocus", "--sync", xid, NULL);
  sw_test_wait_until (is_active, w, 10000, "the window to be active");
  g_assert_true (gtk_widget_grab_focus (widget));
  drain ();
  focus = gtk_root_get_focus (GTK_ROOT (w));
  g_assert_true (focus == widget || gtk_widget_is_ancestor (focus, widget));
}

/* Types @text into @field as a user does (select all, delete, type, Enter). */
static void
type_into (SwWindow *w, GtkWidget *field, const char *text)
{
  focus_widget (w, field);
  xdo ("key", "--clearmodifiers", "ctrl+a", "BackSpace", NULL);
  if (text[0] != '\0')
    xdo ("type", "--delay", "2", "--", text, NULL);
  xdo ("key", "Return", NULL);
}

/* The drop-down's own list: its popover child. */
static GtkWidget *
popover_of (GtkWidget *dd)
{
  for (GtkWidget *c = gtk_widget_get_first_child (dd); c != NULL;
       c = gtk_widget_get_next_sibling (c))
    if (GTK_IS_POPOVER (c))
      return c;
  return NULL;
}

/* The list is open and holds the keyboard focus. */
static gboolean
list_open_cb (gpointer data)
{
  GtkWidget *pop = popover_of (data);
  GtkWidget *focus;

  if (pop == NULL || !gtk_widget_get_mapped (pop))
    return FALSE;
  focus = gtk_root_get_focus (gtk_widget_get_root (data));
  return focus != NULL && (focus == pop || gtk_widget_is_ancestor (focus, pop));
}

typedef struct {
  GtkWidget *dd;
  guint index;
} PickWait;

static gboolean
picked_cb (gpointer data)
{
  const PickWait *pw = data;
  GtkWidget *pop = popover_of (pw->dd);

  return (pop == NULL || !gtk_widget_get_mapped (pop))
         && gtk_drop_down_get_selected (GTK_DROP_DOWN (pw->dd)) == pw->index;
}

static gboolean
count_tick_cb (GtkWidget *widget, GdkFrameClock *clock, gpointer data)
{
  guint *ticks = data;

  (*ticks)++;
  return G_SOURCE_CONTINUE;
}

static gboolean
ticks_cb (gpointer data)
{
  return *(guint *) data >= 3;
}

/* The focused row shows @text: a label with it inside the focus widget. */
static gboolean
has_label (GtkWidget *widget, const char *text)
{
  if (GTK_IS_LABEL (widget) && g_strcmp0 (gtk_label_get_text (GTK_LABEL (widget)), text) == 0)
    return TRUE;
  for (GtkWidget *c = gtk_widget_get_first_child (widget); c != NULL;
       c = gtk_widget_get_next_sibling (c))
    if (has_label (c, text))
      return TRUE;
  return FALSE;
}

typedef struct {
  GtkWidget *root;
  const char *text;
} RowWait;

static guint
count_labels (GtkWidget *widget)
{
  guint n = GTK_IS_LABEL (widget) ? 1 : 0;

  for (GtkWidget *c = gtk_widget_get_first_child (widget); c != NULL;
       c = gtk_widget_get_next_sibling (c))
    n += count_labels (c);
  return n;
}

/* The keyboard focus is on one row (not on the list around the rows, which
 * holds every label) and that row shows the text. */
static gboolean
row_focused_cb (gpointer data)
{
  const RowWait *rw = data;
  GtkWidget *focus = gtk_root_get_focus (GTK_ROOT (rw->root));

  return focus != NULL && !GTK_IS_LIST_VIEW (focus) && count_labels (focus) == 1
         && has_label (focus, rw->text);
}

/* Picks item @index of a drop-down with the keyboard: open, Home, Down
 * @index times, Enter.  Each step waits for the window to have taken the
 * last: the list laid out and drawn, then the row the key leads to focused
 * (its label read from the drop-down's own list), so that a slow build on
 * a busy machine sees the same keys. */
static void
pick (SwWindow *w, GtkWidget *dd, guint index)
{
  PickWait pw = { dd, index };
  GListModel *model = gtk_drop_down_get_model (GTK_DROP_DOWN (dd));
  guint ticks = 0;
  guint tick_id;
  GtkWidget *pop;

  g_assert_true (GTK_IS_STRING_LIST (model));
  g_assert_cmpuint (index, <, g_list_model_get_n_items (model));
  /* The pointer away from where the list opens: the list selects the row
   * under the pointer as it hovers, and Enter takes that one. */
  xdo ("mousemove", "1", "1", NULL);
  focus_widget (w, dd);
  xdo ("key", "space", NULL);
  sw_test_wait_until (list_open_cb, dd, 20000, "the drop-down's list to open");
  pop = popover_of (dd);
  tick_id = gtk_widget_add_tick_callback (pop, count_tick_cb, &ticks, NULL);
  sw_test_wait_until (ticks_cb, &ticks, 20000, "the list to be drawn");
  gtk_widget_remove_tick_callback (pop, tick_id);
  drain ();
  for (guint i = 0; i <= index; i++)
    {
      RowWait rw = { GTK_WIDGET (w),
                     gtk_string_list_get_string (GTK_STRING_LIST (model), i) };
      xdo ("key", i == 0 ? "Home" : "Down", NULL);
      sw_test_wait_until (row_focused_cb, &rw, 20000, "the list's focus on the row the key leads to");
    }
  xdo ("key", "Return", NULL);
  {
    gint64 end = g_get_monotonic_time () + 20 * G_USEC_PER_SEC;
    while (!picked_cb (&pw) && g_get_monotonic_time () < end)
      g_main_context_iteration (NULL, FALSE);
    if (!picked_cb (&pw))
      {
        GtkWidget *focus = gtk_root_get_focus (gtk_widget_get_root (dd));
        g_error ("picking item %u: after 20 s the list is %s, item %u selected, focus on a %s",
                 index, gtk_widget_get_mapped (pop) ? "open" : "closed",
                 gtk_drop_down_get_selected (GTK_DROP_DOWN (dd)),
                 focus != NULL ? G_OBJECT_TYPE_NAME (focus) : "nothing");
      }
  }
  drain ();
}

static gboolean
carpet_shown_cb (gpointer data)
{
  SwStagingPage *page = data;
  return !sw_staging_page_is_busy (page) && sw_staging_page_is_ready (page);
}

/* The carpet shown has its grid in money. */
static gboolean
carpet_money_cb (gpointer data)
{
  SwStagingPage *page = data;
  const SwCarpet *c = sw_staging_page_get_carpet (page);

  return carpet_shown_cb (data) && c != NULL && c->has_money;
}

static gboolean
carpet_no_money_cb (gpointer data)
{
  SwStagingPage *page = data;
  const SwCarpet *c = sw_staging_page_get_carpet (page);

  return carpet_shown_cb (data) && c != NULL && !c->has_money;
}

/* The carpet shown, computed, over the axis picked: @axis 0 across, 1 up. */
typedef struct {
  SwStagingPage *page;
  guint axis;
  SwCarpetParamKind kind;
  guint stage;
} AxisWait;

static gboolean
carpet_over_cb (gpointer data)
{
  const AxisWait *aw = data;
  const SwCarpet *c;
  const SwCarpetAxis *a;

  if (!carpet_shown_cb (aw->page))
    return FALSE;
  c = sw_staging_page_get_carpet (aw->page);
  if (c == NULL)
    return FALSE;
  a = aw->axis == 0 ? &c->x : &c->y;
  return a->kind == aw->kind && a->stage == aw->stage;
}

static guint
param_index_of (SwStagingPage *page, SwCarpetParamKind kind, guint stage)
{
  SwCarpetAxis a;

  for (guint i = 0; sw_staging_page_get_param (page, i, &a); i++)
    if (a.kind == kind && a.stage == stage)
      return i;
  g_assert_not_reached ();
}

/* The value at grid point (i, j) as `size` gives it: a copy of the design
 * with both inputs set, sized alone. */
static double
individual_mass (const SwDesign *d, const SwCarpet *c, guint i, guint j)
{
  g_autoptr (SwDesign) copy = sw_design_copy (d);
  SwSizing s;

  sw_carpet_apply (&c->x, copy, sw_carpet_axis_value (&c->x, i));
  sw_carpet_apply (&c->y, copy, sw_carpet_axis_value (&c->y, j));
  /* A design `size` refuses (an orbit the site cannot reach) does not close. */
  if (!sw_design_validate (copy, NULL, NULL))
    return NAN;
  g_assert_true (sw_size_design (copy, &s, NULL));
  return s.feasible ? s.liftoff_mass_kg : NAN;
}

/* Every grid point against its own sizing; the counts of points that do
 * and do not close. */
static void
check_grid (const SwDesign *d, const SwCarpet *c, guint *n_good, guint *n_bad)
{
  *n_good = *n_bad = 0;
  for (guint j = 0; j < c->y.n; j++)
    for (guint i = 0; i < c->x.n; i++)
      {
        double want = individual_mass (d, c, i, j);
        double v = c->values[j * c->x.n + i];
        if (isnan (want))
          {
            g_assert_false (c->feasible[j * c->x.n + i]);
            (*n_bad)++;
          }
        else
          {
            g_assert_true (c->feasible[j * c->x.n + i]);
            g_assert_cmpfloat_with_epsilon (v / want, 1.0, 1e-12);
            (*n_good)++;
          }
      }
}

static SwNumberField *
ctl (SwStagingPage *page, SwCarpetControl c, guint axis)
{
  return SW_NUMBER_FIELD (sw_staging_page_get_carpet_control (page, c, axis));
}

static void
test_carpet_picker (void)
{
  SwWindow *w = sw_window_new (NULL);
  g_autofree char *path = g_build_filename (SOURCE_DESIGNS_DIR,
                                            "skelloway-upgrade-study.stagewright", NULL);
  g_autoptr (GFile) file = g_file_new_for_path (path);
  SwStagingPage *page = sw_window_get_staging_page (w);
  SwDocument *doc = sw_window_get_document (w);
  const SwCarpet *c, *before;
  guint n_bad = 0, n_good = 0;

  gtk_window_set_default_size (GTK_WINDOW (w), 1280, 900);
  gtk_window_present (GTK_WINDOW (w));
  g_assert_true (sw_window_load (w, file));
  sw_test_wait_until (mapped, w, 10000, "the window to map");
  sw_test_wait_until (sw_test_result_drawn, w, 60000, "the first result to be drawn");
  g_assert_true (sw_window_show_page (w, "staging"));
  sw_test_wait_until (carpet_shown_cb, page, 30000, "the first carpet");
  c = sw_staging_page_get_carpet (page);
  g_assert_nonnull (c);
  /* At first: the first stage's structural coefficient across, the top
   * stage's vacuum Isp up. */
  g_assert_cmpint (c->x.kind, ==, SW_CARPET_PARAM_STRUCTURAL_COEFFICIENT);
  g_assert_cmpint (c->y.kind, ==, SW_CARPET_PARAM_ISP_VAC);
  g_assert_cmpuint (c->y.stage, ==, 2);

  /* Across: the second stage's structural coefficient; up: the first
   * stage's vacuum Isp; both picked from their menus with the keyboard. */
  {
    AxisWait new_x = { page, 0, SW_CARPET_PARAM_STRUCTURAL_COEFFICIENT, 1 };
    AxisWait new_y = { page, 1, SW_CARPET_PARAM_ISP_VAC, 0 };

    pick (w, sw_staging_page_get_carpet_control (page, SW_CARPET_CONTROL_PARAM, 0),
          param_index_of (page, SW_CARPET_PARAM_STRUCTURAL_COEFFICIENT, 1));
    sw_test_wait_until (carpet_over_cb, &new_x, 30000, "the carpet over the new x");
    pick (w, sw_staging_page_get_carpet_control (page, SW_CARPET_CONTROL_PARAM, 1),
          param_index_of (page, SW_CARPET_PARAM_ISP_VAC, 0));
    sw_test_wait_until (carpet_over_cb, &new_y, 30000, "the carpet over the new y");
  }
  c = sw_staging_page_get_carpet (page);
  g_assert_cmpint (c->x.kind, ==, SW_CARPET_PARAM_STRUCTURAL_COEFFICIENT);
  g_assert_cmpuint (c->x.stage, ==, 1);
  g_assert_cmpint (c->y.kind, ==, SW_CARPET_PARAM_ISP_VAC);
  g_assert_cmpuint (c->y.stage, ==, 0);

  /* Ranges and counts typed; a wide structural coefficient so that part of
   * the grid does not close. */
  type_into (w, GTK_WIDGET (ctl (page, SW_CARPET_CONTROL_MAX, 0)), "0.5");
  type_into (w, GTK_WIDGET (ctl (page, SW_CARPET_CONTROL_MIN, 0)), "0.05");
  type_into (w, GTK_WIDGET (ctl (page, SW_CARPET_CONTROL_POINTS, 0)), "31");
  type_into (w, GTK_WIDGET (ctl (page, SW_CARPET_CONTROL_MIN, 1)), "285");
  type_into (w, GTK_WIDGET (ctl (page, SW_CARPET_CONTROL_MAX, 1)), "340");
  type_into (w, GTK_WIDGET (ctl (page, SW_CARPET_CONTROL_POINTS, 1)), "23");
  sw_test_wait_until (carpet_shown_cb, page, 30000, "the carpet over the typed ranges");
  c = sw_staging_page_get_carpet (page);
  g_assert_cmpfloat (c->x.min, ==, 0.05);
  g_assert_cmpfloat (c->x.max, ==, 0.5);
  g_assert_cmpuint (c->x.n, ==, 31);
  g_assert_cmpfloat (c->y.min, ==, 285.0);
  g_assert_cmpfloat (c->y.max, ==, 340.0);
  g_assert_cmpuint (c->y.n, ==, 23);
  g_assert_cmpint (c->output, ==, SW_CARPET_LIFTOFF_MASS);
  /* Every point equals the sizing of the design with the two inputs set. */
  check_grid (sw_document_get_design (doc), c, &n_good, &n_bad);
  g_assert_cmpuint (n_good, ==, 31 * 23);
  g_assert_cmpfloat (c->design_x, ==, sw_document_get_design (doc)->stages[1].structural_coefficient);

  /* The site's latitude across, the orbit's inclination up: an orbit less
   * inclined than the site's latitude cannot be reached directly, so that
   * part of the grid does not close (and is hatched). */
  {
    AxisWait lat = { page, 0, SW_CARPET_PARAM_SITE_LATITUDE, 0 };
    AxisWait inc = { page, 1, SW_CARPET_PARAM_INCLINATION, 0 };

    pick (w, sw_staging_page_get_carpet_control (page, SW_CARPET_CONTROL_PARAM, 0),
          param_index_of (page, SW_CARPET_PARAM_SITE_LATITUDE, 0));
    sw_test_wait_until (carpet_over_cb, &lat, 30000, "the carpet over the latitude");
    pick (w, sw_staging_page_get_carpet_control (page, SW_CARPET_CONTROL_PARAM, 1),
          param_index_of (page, SW_CARPET_PARAM_INCLINATION, 0));
    sw_test_wait_until (carpet_over_cb, &inc, 30000, "the carpet over the inclination");
  }
  type_into (w, GTK_WIDGET (ctl (page, SW_CARPET_CONTROL_MIN, 0)), "0");
  type_into (w, GTK_WIDGET (ctl (page, SW_CARPET_CONTROL_MAX, 0)), "70");
  type_into (w, GTK_WIDGET (ctl (page, SW_CARPET_CONTROL_MIN, 1)), "30");
  type_into (w, GTK_WIDGET (ctl (page, SW_CARPET_CONTROL_MAX, 1)), "110");
  sw_test_wait_until (carpet_shown_cb, page, 30000, "the carpet over the typed orbit ranges");
  c = sw_staging_page_get_carpet (page);
  g_assert_cmpint (c->x.kind, ==, SW_CARPET_PARAM_SITE_LATITUDE);
  g_assert_cmpint (c->y.kind, ==, SW_CARPET_PARAM_INCLINATION);
  g_assert_cmpfloat (c->x.max, ==, 70.0);
  g_assert_cmpfloat (c->y.min, ==, 30.0);
  check_grid (sw_document_get_design (doc), c, &n_good, &n_bad);
  g_assert_cmpuint (n_bad, >, 0);
  g_assert_cmpuint (n_good, >, 0);
  g_assert_cmpuint (n_bad, ==, c->n_infeasible);
  {
    const char *dir = g_getenv ("SW_TEST_SHOT_DIR");
    if (dir != NULL)
      {
        g_autofree char *shot = g_build_filename (dir, "carpet-picked.png", NULL);
        g_autoptr (GError) error = NULL;
        sw_staging_page_scroll_to_carpet (page);
        for (guint i = 0; i < 20; i++)
          {
            g_usleep (20000);
            drain ();
          }
        if (!sw_application_write_png (GTK_WIDGET (w), shot, &error))
          g_test_message ("%s: %s", shot, error->message);
      }
  }

  /* The upper end below the lower: marked on the field, nothing computed,
   * the grid as it was. */
  before = c;
  type_into (w, GTK_WIDGET (ctl (page, SW_CARPET_CONTROL_MAX, 0)), "-10");
  g_assert_false (sw_staging_page_is_busy (page));
  g_assert_true (sw_staging_page_get_carpet (page) == before);
  g_assert_cmpstr (sw_number_field_get_error (ctl (page, SW_CARPET_CONTROL_MAX, 0)), ==,
                   "The upper end must be above the lower end.");
  /* Outside the key's limit (a latitude of 95 deg): refused by the field
   * with the accepted range. */
  type_into (w, GTK_WIDGET (ctl (page, SW_CARPET_CONTROL_MIN, 0)), "95");
  g_assert_false (sw_staging_page_is_busy (page));
  g_assert_true (sw_staging_page_get_carpet (page) == before);
  g_assert_nonnull (strstr (sw_number_field_get_error (ctl (page, SW_CARPET_CONTROL_MIN, 0)),
                            "95 is out of range. Accepted: \342\210\22289.9 to 89.9 deg"));
  /* Letters in a count: refused too. */
  type_into (w, GTK_WIDGET (ctl (page, SW_CARPET_CONTROL_POINTS, 1)), "many");
  g_assert_false (sw_staging_page_is_busy (page));
  g_assert_true (sw_staging_page_get_carpet (page) == before);
  /* A valid upper end clears the rule's mark and computes again. */
  type_into (w, GTK_WIDGET (ctl (page, SW_CARPET_CONTROL_MIN, 0)), "10");
  type_into (w, GTK_WIDGET (ctl (page, SW_CARPET_CONTROL_POINTS, 1)), "23");
  type_into (w, GTK_WIDGET (ctl (page, SW_CARPET_CONTROL_MAX, 0)), "60");
  g_assert_null (sw_number_field_get_error (ctl (page, SW_CARPET_CONTROL_MAX, 0)));
  sw_test_wait_until (carpet_shown_cb, page, 30000, "the carpet after the fix");
  g_assert_cmpfloat (sw_staging_page_get_carpet (page)->x.max, ==, 60.0);
  /* No edit of the carpet ever changes the design. */
  g_assert_false (sw_document_get_modified (doc));

  /* Cost per flight: the cost model's keys join the menus. */
  pick (w, sw_staging_page_get_carpet_control (page, SW_CARPET_CONTROL_OUTPUT, 0),
        SW_CARPET_COST_PER_FLIGHT);
  sw_test_wait_until (carpet_shown_cb, page, 30000, "the cost carpet");
  g_assert_cmpint (sw_staging_page_get_carpet (page)->output, ==, SW_CARPET_COST_PER_FLIGHT);
  {
    SwCarpetAxis a;
    gboolean econ = FALSE;
    for (guint i = 0; sw_staging_page_get_param (page, i, &a); i++)
      econ |= a.kind == SW_CARPET_PARAM_ECONOMICS;
    g_assert_true (econ);
  }

  /* Without a cost per work-year no money is offered; with one, the
   * option names the currency and draws the money grid (no warning). */
  {
    GtkWidget *money = sw_staging_page_get_carpet_control (page, SW_CARPET_CONTROL_MONEY, 0);
    SwDesign *d = sw_document_dup_design (doc);

    g_assert_false (sw_staging_page_get_carpet (page)->has_money);
    g_assert_false (gtk_widget_get_visible (money));
    g_assert_true (sw_economics_set_number (&d->economics, SW_ECON_WORK_YEAR_COST, 150000.0));
    sw_document_commit (doc, d, NULL);
    sw_test_wait_until (carpet_money_cb, page, 60000, "the carpet in money");
    c = sw_staging_page_get_carpet (page);
    g_assert_cmpfloat (c->money[0], ==, c->values[0] * 150000.0);
    g_assert_true (gtk_widget_get_visible (money));
    g_assert_nonnull (strstr (gtk_check_button_get_label (GTK_CHECK_BUTTON (money)),
                              "money units"));
    g_assert_false (gtk_check_button_get_active (GTK_CHECK_BUTTON (money)));
    g_assert_true (gtk_widget_activate (money));
    g_assert_true (gtk_check_button_get_active (GTK_CHECK_BUTTON (money)));
    drain ();
    /* A view option: the design is as it was. */
    g_assert_cmpfloat (sw_document_get_design (doc)->economics.work_year_cost, ==, 150000.0);
    g_assert_true (sw_document_undo (doc));
    sw_test_wait_until (carpet_no_money_cb, page, 60000, "the carpet in work-years again");
    g_assert_false (gtk_widget_get_visible (money));
  }

  /* Cancel: a 500 x 500 grid, cancelled at once; no carpet, said so. */
  g_assert_true (sw_number_field_enter (ctl (page, SW_CARPET_CONTROL_POINTS, 0), "500"));
  g_assert_true (sw_number_field_enter (ctl (page, SW_CARPET_CONTROL_POINTS, 1), "500"));
  g_assert_true (sw_staging_page_is_busy (page));
  g_signal_emit_by_name (sw_staging_page_get_carpet_control (page, SW_CARPET_CONTROL_BUTTON, 0),
                         "clicked");
  sw_test_wait_until (carpet_shown_cb, page, 30000, "the cancelled carpet");
  g_assert_null (sw_staging_page_get_carpet (page));
  g_assert_true (g_str_has_prefix (gtk_label_get_text (GTK_LABEL (
                   sw_staging_page_get_carpet_control (page, SW_CARPET_CONTROL_STATUS, 0))),
                   "Cancelled"));

  /* The currency label typed: one named edit; too long, marked, unchanged. */
  type_into (w, sw_staging_page_get_carpet_control (page, SW_CARPET_CONTROL_CURRENCY, 0),
             "kEUR");
  g_assert_cmpstr (sw_document_get_design (doc)->economics.currency, ==, "kEUR");
  type_into (w, sw_staging_page_get_carpet_control (page, SW_CARPET_CONTROL_CURRENCY, 0),
             "seventeen letters");
  g_assert_cmpstr (sw_document_get_design (doc)->economics.currency, ==, "kEUR");
  g_assert_true (gtk_widget_has_css_class (
    sw_staging_page_get_carpet_control (page, SW_CARPET_CONTROL_CURRENCY, 0), "error"));
  g_assert_true (sw_document_undo (doc));
  g_assert_cmpstr (sw_document_get_design (doc)->economics.currency, ==, "");
  sw_test_window_close (w);
}

/* Runs the window binary (env SW_APP) with @args under Xvfb's display. */
static int
run_app (char **err, const char *first, ...)
{
  g_autoptr (GPtrArray) argv = g_ptr_array_new ();
  g_autoptr (GError) error = NULL;
  int status = 0;
  va_list ap;

  g_ptr_array_add (argv, (char *) "timeout");
  g_ptr_array_add (argv, (char *) "120");
  g_ptr_array_add (argv, (char *) g_getenv ("SW_APP"));
  va_start (ap, first);
  for (const char *a = first; a != NULL; a = va_arg (ap, const char *))
    g_ptr_array_add (argv, (char *) a);
  va_end (ap);
  g_ptr_array_add (argv, NULL);
  g_assert_nonnull (g_getenv ("SW_APP"));
  g_assert_true (g_spawn_sync (NULL, (char **) argv->pdata, NULL, G_SPAWN_SEARCH_PATH
                               | G_SPAWN_STDOUT_TO_DEV_NULL, NULL, NULL, NULL, err, &status,
                               &error));
  g_assert_no_error (error);
  return WIFEXITED (status) ? WEXITSTATUS (status) : -1;
}

/* --screenshot with --page=staging and --page=carpet (and --carpet) writes
 * the picture once the page's worker is done; a bad page or carpet is an
 * error naming what is accepted. */
static void
test_screenshot_pages (void)
{
  g_autofree char *design = g_build_filename (SOURCE_DESIGNS_DIR,
                                              "skelloway-upgrade-study.stagewright", NULL);
  /* The second carpet, 500 x 500 points of cost per flight, takes about a
   * second on the worker: longer than the window's own first result. */
  const char *pages[] = { "--page=staging", "--page=carpet" };
  const char *carpets[] = { "--carpet=mission.orbit.site_latitude_deg:0:70:20,"
                            "mission.orbit.inclination_deg:30:110:20",
                            "--carpet=mission.orbit.site_latitude_deg:0:70:500,"
                            "mission.orbit.inclination_deg:30:110:500,cost_per_flight" };

  for (guint i = 0; i < G_N_ELEMENTS (pages); i++)
    {
      g_autofree char *png = g_build_filename (tmp_dir, "shot.png", NULL);
      g_autofree char *shot = g_strdup_printf ("--screenshot=%s", png);
      g_autofree char *err = NULL;
      g_autoptr (GdkTexture) texture = NULL;
      g_autoptr (GError) error = NULL;
      g_autofree guchar *data = g_malloc (1280 * 800 * 4);
      guint dark = 0, total = 0;

      g_assert_cmpint (run_app (&err, shot, pages[i], carpets[i], design, NULL), ==, 0);
      texture = gdk_texture_new_from_filename (png, &error);
      g_assert_no_error (error);
      g_assert_cmpint (gdk_texture_get_width (texture), ==, 1280);
      g_assert_cmpint (gdk_texture_get_height (texture), ==, 800);
      gdk_texture_download (texture, data, 1280 * 4);
      g_unlink (png);
      if (i == 0)
        continue;
      /* The corner of the plot where the site's latitude exceeds the
       * orbit's inclination is hatched once the grid is shown; before, the
       * plot holds only "Computing".  A strip 50 px wide inside the plot's
       * right edge (16 px from the page's, 30 from the window's), in the
       * densest 40 rows of the lower part of the view. */
      for (int y0 = 560; y0 + 40 <= 790; y0 += 5)
        {
          guint d = 0;
          for (int y = y0; y < y0 + 40; y++)
            for (int x = 1190; x < 1240; x++)
              {
                const guchar *px = data + (gsize) y * 1280 * 4 + x * 4;
                d += px[0] + px[1] + px[2] < 3 * 235;
              }
          dark = MAX (dark, d);
        }
      total = 40 * 50;
      g_test_message ("%u of %u pixels in the hatched corner are dark", dark, total);
      g_assert_cmpuint (dark * 6, >, total);
    }
  {
    g_autofree char *png = g_build_filename (tmp_dir, "none.png", NULL);
    g_autofree char *shot = g_strdup_printf ("--screenshot=%s", png);
    g_autofree char *err = NULL;

    g_assert_cmpint (run_app (&err, shot, "--page=stagin", design, NULL), ==, 1);
    g_assert_nonnull (strstr (err, "--page=stagin: no such page (curves, working, ascent, "
                                   "trade, staging, carpet)"));
    g_clear_pointer (&err, g_free);
    g_assert_cmpint (run_app (&err, shot, "--page=carpet", "--carpet=payload_kg:1:2:3", design,
                              NULL), ==, 1);
    g_assert_nonnull (strstr (err, "expected X,Y or X,Y,OUTPUT"));
    g_clear_pointer (&err, g_free);
    g_assert_cmpint (run_app (&err, shot, "--page=carpet",
                              "--carpet=payload_kg:100:200:5,stages[9].isp_vac_s:300:320:5", design,
                              NULL), ==, 1);
    g_assert_nonnull (strstr (err, "stages[9].isp_vac_s: the design has 3 stages"));
    g_assert_false (g_file_test (png, G_FILE_TEST_EXISTS));
  }
}

/* A design with strap-on boosters: the page shows the core's statement
 * with the boosters' note (which rows are which, what they leave out) and
 * draws the two sets of rows without a GTK warning. */
static void
test_page_boosters (void)
{
  g_autofree char *path = g_build_filename (SOURCE_DESIGNS_DIR, "four-booster-cargo.stagewright",
                                            NULL);
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, &error);
  GtkWidget *win = gtk_window_new ();
  GtkWidget *page = sw_staging_page_new ();
  const char *text;
  SwAnalysis *a;

  g_assert_no_error (error);
  gtk_window_set_child (GTK_WINDOW (win), page);
  gtk_window_set_default_size (GTK_WINDOW (win), 1000, 900);
  gtk_window_present (GTK_WINDOW (win));
  a = analyse (d);
  sw_staging_page_set_result (SW_STAGING_PAGE (page), a);
  sw_test_wait_until (ready_cb, page, 30000, "the staging page's worker");
  text = sw_staging_page_get_weighting (SW_STAGING_PAGE (page));
  g_assert_nonnull (strstr (text, "each criterion divided by its best row, serial and with "
                                  "boosters alike"));
  g_assert_nonnull (strstr (text, "the one of 2 stages is this design"));
  g_assert_nonnull (strstr (text, "counts the boosters as perfect"));
  /* Let the drawing run. */
  for (guint i = 0; i < 20; i++)
    {
      g_usleep (5000);
      while (g_main_context_iteration (NULL, FALSE))
        ;
    }
  gtk_window_destroy (GTK_WINDOW (win));
  sw_analysis_unref (a);
}

int
main (int argc, char **argv)
{
  int status;

  tmp_dir = sw_gui_test_env_init (&argc, &argv, "sw-staging-page-XXXXXX");
  g_test_add_func ("/gui/staging-page/shows-worker-result", test_page_shows_worker_result);
  g_test_add_func ("/gui/staging-page/window-has-page", test_window_has_page);
  g_test_add_func ("/gui/staging-page/follows-loop", test_page_follows_loop);
  g_test_add_func ("/gui/staging-page/boosters", test_page_boosters);
  g_test_add_func ("/gui/staging-page/engine-types-editor", test_engine_types_editor);
  g_test_add_func ("/gui/staging-page/carpet-picker", test_carpet_picker);
  g_test_add_func ("/gui/staging-page/screenshot-pages", test_screenshot_pages);
  status = g_test_run ();
  sw_gui_test_env_finish (tmp_dir);
  return status;
}
