/* SPDX-License-Identifier: GPL-3.0-or-later */
/* No silent edits, driven by real input: xdotool sends key, wheel and
 * pointer events through the X server (XTEST) to the running window, and
 * the design is read back through the window's test API.  Each case: text
 * that does not parse or is out of range, a decimal comma, a window
 * shortcut while a field has focus, the wheel over a field without focus,
 * a value that conflicts with a dependent field, and undo from a focused
 * field.  Suite 'gui' (Xvfb, X11 backend). */
#include "config.h"

#include "sw-application.h"
#include "sw-ascent-montecarlo.h"
#include "sw-format.h"
#include "sw-number-field.h"
#include "sw-sizing.h"
#include "sw-stage-thrust.h"
#include "sw-window-private.h"

#include "gui-test-env.h"

#include <gdk/x11/gdkx.h>
#include <locale.h>
#include <math.h>
#include <string.h>

static char *tmp_dir;

/* ---- real input -------------------------------------------------------- */

/* Lets GTK read and handle every event the X server has for it now. */
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

/* Runs xdotool with @args (NULL-terminated) under a 10 s limit, then lets
 * the window handle what it sent.  XTEST input needs nothing from this
 * process, so a blocking spawn cannot deadlock. */
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

static char *
xid_of (SwWindow *w)
{
  GdkSurface *surface = gtk_native_get_surface (GTK_NATIVE (w));
  return g_strdup_printf ("%lu", (unsigned long) gdk_x11_surface_get_xid (surface));
}

/* Moves the pointer to (@x, @y) of the window @xid and waits until it is
 * there.  xdotool's --sync waits for the pointer to move, forever when it
 * is at the spot already (a field that a change of layout put under the
 * pointer): it is first put a pixel beside it, without waiting. */
static void
pointer_to (const char *xid, int x, int y)
{
  g_autofree char *x1 = g_strdup_printf ("%d", x + 1);
  g_autofree char *px = g_strdup_printf ("%d", x);
  g_autofree char *py = g_strdup_printf ("%d", y);

  xdo ("mousemove", "--window", xid, x1, py, NULL);
  xdo ("mousemove", "--window", xid, "--sync", px, py, NULL);
}

static gboolean
is_active (gpointer data)
{
  return gtk_window_is_active (GTK_WINDOW (data));
}

/* Gives the X input focus to the window and GTK's focus to @field. */
static void
focus_field (SwWindow *w, GtkWidget *field)
{
  g_autofree char *xid = xid_of (w);
  GtkWidget *focus;

  xdo ("windowfocus", "--sync", xid, NULL);
  sw_test_wait_until (is_active, w, 10000, "the window to be active");
  g_assert_true (gtk_widget_grab_focus (field));
  drain ();
  focus = gtk_root_get_focus (GTK_ROOT (w));
  g_assert_true (focus == field || gtk_widget_is_ancestor (focus, field));
}

/* Points at (@x, @y) of @widget's own coordinates, in the surface that
 * shows it (the window's, or a popover's own). */
static void
point_at_xy (GtkWidget *widget, double x, double y)
{
  GtkNative *native = gtk_widget_get_native (widget);
  GdkSurface *surface = gtk_native_get_surface (native);
  g_autofree char *xid = g_strdup_printf ("%lu", (unsigned long) gdk_x11_surface_get_xid (surface));
  graphene_point_t in = GRAPHENE_POINT_INIT (x, y), out;
  double sx, sy;

  g_assert_true (gtk_widget_compute_point (widget, GTK_WIDGET (native), &in, &out));
  gtk_native_get_surface_transform (native, &sx, &sy);
  pointer_to (xid, (int) (out.x + sx), (int) (out.y + sy));
}

/* Moves the pointer to the middle of @widget. */
static void
point_at (GtkWidget *widget)
{
  point_at_xy (widget, gtk_widget_get_width (widget) / 2.0, gtk_widget_get_height (widget) / 2.0);
}

/* Replaces the text of the focused field by typing, as a user does. */
static void
retype (const char *text)
{
  xdo ("key", "--clearmodifiers", "ctrl+a", "BackSpace", NULL);
  if (text[0] != '\0')
    xdo ("type", "--delay", "2", "--", text, NULL);
}

/* ---- the window -------------------------------------------------------- */

static gboolean
mapped (gpointer data)
{
  return gtk_widget_get_mapped (GTK_WIDGET (data));
}

static SwWindow *
window_with_demo (const char *name)
{
  SwWindow *w = sw_window_new (NULL);
  g_autofree char *path = g_build_filename (SOURCE_DESIGNS_DIR, name, NULL);
  g_autoptr (GFile) file = g_file_new_for_path (path);

  gtk_window_set_default_size (GTK_WINDOW (w), 1280, 900);
  gtk_window_present (GTK_WINDOW (w));
  g_assert_true (sw_window_load (w, file));
  sw_test_wait_until (mapped, w, 10000, "the window to map");
  sw_test_wait_until (sw_test_result_drawn, w, 60000, "the first result to be drawn");
  return w;
}

static SwNumberField *
field (SwWindow *w, SwInspectorField f)
{
  return SW_NUMBER_FIELD (sw_inspector_get_field (sw_window_get_inspector (w), f));
}

static const SwDesign *
doc_design (SwWindow *w)
{
  return sw_document_get_design (sw_window_get_document (w));
}

static void
assert_unchanged (SwWindow *w, const SwDesign *before)
{
  g_assert_true (sw_design_equal (doc_design (w), before));
}

/* With SW_TEST_SHOT_DIR set, a picture of the window for a person to look
 * at (not checked). */
static void
maybe_shot (SwWindow *w, const char *name)
{
  const char *dir = g_getenv ("SW_TEST_SHOT_DIR");
  g_autofree char *path = NULL;
  g_autoptr (GError) error = NULL;

  if (dir == NULL)
    return;
  path = g_build_filename (dir, name, NULL);
  if (!sw_application_write_png (GTK_WIDGET (w), path, &error))
    g_test_message ("%s: %s", path, error->message);
}

/* ---- cases ------------------------------------------------------------- */

/* Letters in Payload, then Enter: an error on the field with the accepted
 * range, the payload as it was; Escape gives the value back. */
static void
test_letters (void)
{
  SwWindow *w = window_with_demo ("medium-cargo.stagewright");
  SwNumberField *payload = field (w, SW_INSPECTOR_PAYLOAD);
  g_autoptr (SwDesign) before = sw_design_copy (doc_design (w));

  focus_field (w, GTK_WIDGET (payload));
  retype ("abc");
  xdo ("key", "Return", NULL);
  assert_unchanged (w, before);
  g_assert_cmpfloat (doc_design (w)->payload_kg, ==, 8000.0);
  g_assert_false (sw_document_get_modified (sw_window_get_document (w)));
  g_assert_cmpstr (sw_number_field_get_text (payload), ==, "abc");
  g_assert_cmpstr (sw_number_field_get_error (payload), ==,
                   "“abc” is not a number; write it like 0.95. Accepted: 0.1 to 10,000,000 kg");
  g_assert_true (gtk_widget_has_css_class (sw_number_field_get_entry (payload), "error"));
  maybe_shot (w, "input-letters.png");
  /* Leaving the field does not take the text either. */
  focus_field (w, GTK_WIDGET (field (w, SW_INSPECTOR_ISP_VAC)));
  assert_unchanged (w, before);
  focus_field (w, GTK_WIDGET (payload));
  xdo ("key", "Escape", NULL);
  g_assert_cmpstr (sw_number_field_get_text (payload), ==, "8000");
  g_assert_null (sw_number_field_get_error (payload));
  g_assert_false (gtk_widget_has_css_class (sw_number_field_get_entry (payload), "error"));
  sw_test_window_close (w);
}

/* "-5" in the vacuum Isp: out of range, refused, not 50 s. */
static void
test_out_of_range (void)
{
  SwWindow *w = window_with_demo ("medium-cargo.stagewright");
  SwNumberField *isp = field (w, SW_INSPECTOR_ISP_VAC);
  g_autoptr (SwDesign) before = sw_design_copy (doc_design (w));

  sw_inspector_set_selected (sw_window_get_inspector (w), 0);
  focus_field (w, GTK_WIDGET (isp));
  retype ("-5");
  xdo ("key", "Return", NULL);
  assert_unchanged (w, before);
  g_assert_cmpfloat (doc_design (w)->stages[0].isp_vac_s, ==, 338.0);
  g_assert_cmpstr (sw_number_field_get_error (isp), ==,
                   "-5 is out of range. Accepted: 50 to 1,000 s");
  /* A huge value is quoted with a power of ten, not in the thirty-one
   * digits of its binary value. */
  retype ("1e30");
  xdo ("key", "Return", NULL);
  assert_unchanged (w, before);
  g_assert_cmpstr (sw_number_field_get_error (isp), ==,
                   "1e+30 is out of range. Accepted: 50 to 1,000 s");
  /* A valid value then goes in as one edit. */
  retype ("340");
  xdo ("key", "Return", NULL);
  g_assert_cmpfloat (doc_design (w)->stages[0].isp_vac_s, ==, 340.0);
  g_assert_null (sw_number_field_get_error (isp));
  sw_test_window_close (w);
}

/* The locale's decimal mark: "0,95" as a propellant fraction under a
 * German locale is 0.95 (eps 0.05), not 0.40; under the C locale the comma
 * is refused with an error. */
static void
test_decimal_comma (void)
{
  g_autofree char *old = g_strdup (setlocale (LC_NUMERIC, NULL));
  SwWindow *w = window_with_demo ("medium-cargo.stagewright");
  SwNumberField *eps = field (w, SW_INSPECTOR_EPS);
  GtkDropDown *forms = GTK_DROP_DOWN (sw_inspector_get_field (sw_window_get_inspector (w),
                                                              SW_INSPECTOR_EPS_FORM));
  g_autoptr (SwDesign) before = sw_design_copy (doc_design (w));

  sw_inspector_set_selected (sw_window_get_inspector (w), 0);
  gtk_drop_down_set_selected (forms, SW_EPS_PROPELLANT_FRACTION);
  focus_field (w, GTK_WIDGET (eps));
  retype ("0,95");
  xdo ("key", "Return", NULL);
  assert_unchanged (w, before);
  g_assert_nonnull (strstr (sw_number_field_get_error (eps), "is not a number"));
  xdo ("key", "Escape", NULL);

  if (setlocale (LC_NUMERIC, "de_DE.UTF-8") == NULL)
    {
      gtk_drop_down_set_selected (forms, SW_EPS_COEFFICIENT);
      sw_test_window_close (w);
      g_test_skip ("no de_DE.UTF-8 locale on this machine");
      return;
    }
  retype ("0,95");
  xdo ("key", "Return", NULL);
  setlocale (LC_NUMERIC, old);
  g_assert_null (sw_number_field_get_error (eps));
  g_assert_cmpfloat_with_epsilon (doc_design (w)->stages[0].structural_coefficient, 0.05, 1e-12);
  gtk_drop_down_set_selected (forms, SW_EPS_COEFFICIENT);
  sw_test_window_close (w);
}

/* The previous-stage and next-stage shortcuts (Ctrl+Page Up/Down) with the
 * cursor in a field change neither the field nor the design; with the
 * focus on the stage list they do move the selection. */
static void
test_shortcut_in_field (void)
{
  SwWindow *w = window_with_demo ("medium-cargo.stagewright");
  SwInspector *inspector = sw_window_get_inspector (w);
  SwNumberField *isp = field (w, SW_INSPECTOR_ISP_VAC);
  g_autoptr (SwDesign) before = sw_design_copy (doc_design (w));
  g_autofree char *text = NULL;

  sw_inspector_set_selected (inspector, 1);
  focus_field (w, GTK_WIDGET (isp));
  text = g_strdup (sw_number_field_get_text (isp));
  xdo ("key", "ctrl+Prior", NULL);
  xdo ("key", "ctrl+Next", NULL);
  assert_unchanged (w, before);
  g_assert_cmpstr (sw_number_field_get_text (isp), ==, text);
  g_assert_cmpint (sw_inspector_get_selected (inspector), ==, 1);
  /* The shortcut itself works where it belongs (focus on a drop-down). */
  focus_field (w, sw_inspector_get_field (inspector, SW_INSPECTOR_EPS_FORM));
  xdo ("key", "ctrl+Prior", NULL);
  g_assert_cmpint (sw_inspector_get_selected (inspector), ==, 0);
  assert_unchanged (w, before);
  sw_test_window_close (w);
}

/* The wheel over a field without focus never edits it; with focus each
 * wheel step is one edit and one undo step. */
static void
test_wheel (void)
{
  SwWindow *w = window_with_demo ("medium-cargo.stagewright");
  SwDocument *doc = sw_window_get_document (w);
  SwNumberField *isp = field (w, SW_INSPECTOR_ISP_VAC);
  g_autoptr (SwDesign) before = sw_design_copy (doc_design (w));

  sw_inspector_set_selected (sw_window_get_inspector (w), 0);
  focus_field (w, GTK_WIDGET (field (w, SW_INSPECTOR_PAYLOAD)));
  point_at (GTK_WIDGET (isp));
  xdo ("click", "--repeat", "3", "--delay", "30", "5", NULL);
  xdo ("click", "--repeat", "3", "--delay", "30", "4", NULL);
  assert_unchanged (w, before);
  g_assert_false (sw_document_can_undo (doc));

  focus_field (w, GTK_WIDGET (isp));
  point_at (GTK_WIDGET (isp));
  xdo ("click", "--repeat", "3", "--delay", "30", "5", NULL);
  g_assert_cmpfloat (doc_design (w)->stages[0].isp_vac_s, ==, 335.0);
  /* Ctrl+Z with the focus in the field: one wheel step at a time. */
  xdo ("key", "ctrl+z", NULL);
  g_assert_cmpfloat (doc_design (w)->stages[0].isp_vac_s, ==, 336.0);
  xdo ("key", "ctrl+z", NULL);
  g_assert_cmpfloat (doc_design (w)->stages[0].isp_vac_s, ==, 337.0);
  xdo ("key", "ctrl+z", NULL);
  assert_unchanged (w, before);
  g_assert_false (sw_document_can_undo (doc));
  g_assert_cmpstr (sw_number_field_get_text (isp), ==, "338");
  sw_test_window_close (w);
}

/* The Trade study page's spin buttons (in the uncertainty popover): the
 * wheel over one without focus changes nothing; with the focus in it, the
 * wheel does edit (so the first check can fail). */
static gboolean
popover_mapped (gpointer data)
{
  return gtk_widget_get_mapped (GTK_WIDGET (data));
}

static void
test_wheel_trade_page (void)
{
  SwWindow *w = window_with_demo ("small-sat-launcher.stagewright");
  SwTradePage *page;
  GtkWidget *samples, *seed, *popover;
  g_autoptr (SwDesign) before = NULL;

  g_assert_true (sw_window_show_page (w, "trade"));
  sw_test_wait_until (sw_test_result_drawn, w, 60000, "the trade page to be drawn");
  page = sw_window_get_trade_page (w);
  samples = sw_trade_page_get_samples_field (page);
  seed = sw_trade_page_get_seed_field (page);
  popover = gtk_widget_get_ancestor (samples, GTK_TYPE_POPOVER);
  g_assert_nonnull (popover);
  gtk_popover_popup (GTK_POPOVER (popover));
  sw_test_wait_until (popover_mapped, seed, 10000, "the uncertainty popover to open");
  before = sw_design_copy (doc_design (w));
  g_assert_true (gtk_widget_grab_focus (samples));
  drain ();
  point_at (seed);
  xdo ("click", "--repeat", "3", "--delay", "30", "4", NULL);
  assert_unchanged (w, before);
  g_assert_cmpfloat (gtk_spin_button_get_value (GTK_SPIN_BUTTON (seed)), ==,
                     (double) before->uncertainty.seed);

  g_assert_true (gtk_widget_grab_focus (seed));
  drain ();
  point_at (seed);
  xdo ("click", "--delay", "30", "4", NULL);
  g_assert_cmpfloat (gtk_spin_button_get_value (GTK_SPIN_BUTTON (seed)), ==,
                     (double) before->uncertainty.seed + 1.0);
  gtk_popover_popdown (GTK_POPOVER (popover));
  sw_test_window_close (w);
}

/* The trade page's switch for the simulated Monte Carlo, by real key
 * events on the focused switch: on, it flies the samples on a worker thread
 * with a progress bar and shows the margin's percentiles and the reserve;
 * off while flying, it cancels and shows nothing stale. */
typedef struct {
  SwSimulatedMc *mc;
  SwSimulatedMcState state;
} McWait;

typedef struct {
  SwSimulatedMc *mc;
  guint cancelled;
} CancelWait;

/* The worker's cancelled run reported back (it may take a moment under the
 * sanitizers). */
static gboolean
mc_cancelled_cb (gpointer data)
{
  const CancelWait *cw = data;

  return sw_simulated_mc_get_runs_cancelled (cw->mc) >= cw->cancelled;
}

static gboolean
mc_in_state (gpointer data)
{
  McWait *w = data;
  return sw_simulated_mc_get_state (w->mc) == w->state;
}

static gboolean
switch_on (gpointer data)
{
  return gtk_switch_get_active (GTK_SWITCH (data));
}

static gboolean
switch_off (gpointer data)
{
  return !gtk_switch_get_active (GTK_SWITCH (data));
}

/* Space on the focused switch; GTK turns it at the end of its animation. */
static void
press_switch (SwWindow *w, GtkWidget *toggle)
{
  gboolean was = gtk_switch_get_active (GTK_SWITCH (toggle));

  focus_field (w, toggle);
  xdo ("key", "--clearmodifiers", "space", NULL);
  sw_test_wait_until (was ? switch_off : switch_on, toggle, 10000, "the switch to turn");
}

static void
test_simulated_mc (void)
{
  SwWindow *w = window_with_demo ("small-sat-launcher.stagewright");
  SwTradePage *page;
  SwSimulatedMc *mc;
  GtkWidget *toggle;
  g_autoptr (SwDesign) d = sw_design_copy (doc_design (w));
  McWait wait;
  guint cancelled;

  /* Spreads on Isp and structure (the design's keys); first 20,000
   * samples (the window flies at most 1,000 of them), so that the run is
   * still flying when it is switched off (200 can finish before the second
   * key press now that a flight is cheap), then 200 for a run to the end. */
  d->uncertainty.samples = 20000;
  d->uncertainty.isp = (SwSpread) { SW_SPREAD_NORMAL, 1.0 };
  d->uncertainty.structural_coefficient = (SwSpread) { SW_SPREAD_UNIFORM, 5.0 };
  sw_document_commit (sw_window_get_document (w), sw_design_copy (d), NULL);
  g_assert_true (sw_window_show_page (w, "trade"));
  sw_test_wait_until (sw_test_result_drawn, w, 60000, "the trade page to be drawn");
  page = sw_window_get_trade_page (w);
  mc = sw_trade_page_get_simulated_mc (page);
  toggle = sw_simulated_mc_get_switch (mc);
  wait.mc = mc;
  g_assert_cmpint (sw_simulated_mc_get_state (mc), ==, SW_SIMULATED_MC_OFF);
  g_assert_true (gtk_widget_get_sensitive (toggle));
  g_assert_nonnull (strstr (sw_simulated_mc_get_text (mc), "Off:"));

  /* On, then off while it flies: cancelled, nothing shown. */
  press_switch (w, toggle);
  g_assert_true (gtk_switch_get_active (GTK_SWITCH (toggle)));
  g_assert_cmpint (sw_simulated_mc_get_state (mc), ==, SW_SIMULATED_MC_RUNNING);
  g_assert_nonnull (strstr (sw_simulated_mc_get_text (mc), "Flying "));
  cancelled = sw_simulated_mc_get_runs_cancelled (mc);
  press_switch (w, toggle);
  g_assert_false (gtk_switch_get_active (GTK_SWITCH (toggle)));
  g_assert_cmpint (sw_simulated_mc_get_state (mc), ==, SW_SIMULATED_MC_OFF);
  {
    CancelWait cw = { mc, cancelled + 1 };
    sw_test_wait_until (mc_cancelled_cb, &cw, 30000, "the cancelled run to report back");
  }
  g_assert_cmpuint (sw_simulated_mc_get_runs_cancelled (mc), ==, cancelled + 1);
  g_usleep (300000);
  drain ();
  g_assert_cmpint (sw_simulated_mc_get_state (mc), ==, SW_SIMULATED_MC_OFF);
  g_assert_null (strstr (sw_simulated_mc_get_text (mc), "percentile"));

  /* 200 samples, on again, to the end: the percentiles, the chance and the
   * reserve. */
  d->uncertainty.samples = 200;
  sw_document_commit (sw_window_get_document (w), sw_design_copy (d), NULL);
  sw_test_wait_until (sw_test_result_drawn, w, 60000, "the trade page to be drawn");
  press_switch (w, toggle);
  g_assert_cmpint (sw_simulated_mc_get_state (mc), ==, SW_SIMULATED_MC_RUNNING);
  wait.state = SW_SIMULATED_MC_DONE;
  sw_test_wait_until (mc_in_state, &wait, 240000, "the simulated Monte Carlo to finish");
  g_assert_nonnull (strstr (sw_simulated_mc_get_text (mc),
                            "Delta-v margin over 200 simulated ascents: 5th percentile "));
  g_assert_nonnull (strstr (sw_simulated_mc_get_text (mc), "Reaches the orbit in "));
  g_assert_cmpfloat (sw_simulated_mc_get_fraction (mc), ==, 1.0);
  /* The same flights as the core's, seeded: the median margin as text. */
  {
    g_autoptr (SwAscentMonteCarlo) core = NULL;
    g_autoptr (GError) error = NULL;
    g_autofree char *median = NULL, *want = NULL;

    core = sw_ascent_montecarlo_run (doc_design (w), 200, d->uncertainty.seed, 2, NULL, NULL,
                                     NULL, &error);
    g_assert_no_error (error);
    median = sw_format_speed (core->p50_margin_m_s);
    want = g_strdup_printf ("median %s,", median);
    g_assert_nonnull (strstr (sw_simulated_mc_get_text (mc), want));
  }
  /* The design is not changed by any of it. */
  assert_unchanged (w, d);
  maybe_shot (w, "simulated-mc.png");
  sw_test_window_close (w);
}

/* A vacuum Isp below the sea-level Isp: an error on both fields, and
 * neither value of the design moves. */
static void
test_dependent_field (void)
{
  SwWindow *w = window_with_demo ("medium-cargo.stagewright");
  SwNumberField *vac = field (w, SW_INSPECTOR_ISP_VAC);
  SwNumberField *sl = field (w, SW_INSPECTOR_ISP_SL);
  g_autoptr (SwDesign) before = sw_design_copy (doc_design (w));

  sw_inspector_set_selected (sw_window_get_inspector (w), 0);
  g_assert_cmpfloat (doc_design (w)->stages[0].isp_sl_s, ==, 305.0);
  focus_field (w, GTK_WIDGET (vac));
  retype ("200");
  xdo ("key", "Return", NULL);
  assert_unchanged (w, before);
  g_assert_cmpstr (sw_number_field_get_error (vac), ==,
                   "200 s is below the stage's sea-level Isp of 305 s; lower the sea-level "
                   "Isp first");
  g_assert_cmpstr (sw_number_field_get_error (sl), ==,
                   "Above the vacuum Isp typed: lower this first");
  g_assert_true (gtk_widget_has_css_class (sw_number_field_get_entry (sl), "error"));
  g_assert_cmpstr (sw_number_field_get_text (sl), ==, "305");
  maybe_shot (w, "input-conflict.png");
  /* Raising it again: one edit, the sea-level Isp where it was. */
  retype ("345");
  xdo ("key", "Return", NULL);
  g_assert_cmpfloat (doc_design (w)->stages[0].isp_vac_s, ==, 345.0);
  g_assert_cmpfloat (doc_design (w)->stages[0].isp_sl_s, ==, 305.0);
  g_assert_null (sw_number_field_get_error (vac));
  g_assert_null (sw_number_field_get_error (sl));
  sw_test_window_close (w);
}

/* Ctrl+Z in a focused field: text not yet committed is reverted first;
 * with none, the last committed edit is undone; each commit is one step. */
static void
test_undo_in_field (void)
{
  SwWindow *w = window_with_demo ("medium-cargo.stagewright");
  SwDocument *doc = sw_window_get_document (w);
  SwNumberField *payload = field (w, SW_INSPECTOR_PAYLOAD);
  g_autoptr (SwDesign) before = sw_design_copy (doc_design (w));

  focus_field (w, GTK_WIDGET (payload));
  retype ("9000");
  xdo ("key", "ctrl+z", NULL);
  g_assert_cmpstr (sw_number_field_get_text (payload), ==, "8000");
  assert_unchanged (w, before);
  g_assert_false (sw_document_can_undo (doc));

  retype ("9000");
  xdo ("key", "Return", NULL);
  retype ("9500");
  xdo ("key", "Return", NULL);
  g_assert_cmpfloat (doc_design (w)->payload_kg, ==, 9500.0);
  xdo ("key", "ctrl+z", NULL);
  g_assert_cmpfloat (doc_design (w)->payload_kg, ==, 9000.0);
  g_assert_cmpstr (sw_number_field_get_text (payload), ==, "9000");
  xdo ("key", "ctrl+z", NULL);
  assert_unchanged (w, before);
  g_assert_cmpstr (sw_number_field_get_text (payload), ==, "8000");
  xdo ("key", "ctrl+shift+z", NULL);
  g_assert_cmpfloat (doc_design (w)->payload_kg, ==, 9000.0);
  sw_test_window_close (w);
}

static gboolean
question_shown (gpointer data)
{
  GListModel *tops = gtk_window_get_toplevels ();

  for (guint i = 0; i < g_list_model_get_n_items (tops); i++)
    {
      g_autoptr (GObject) o = g_list_model_get_item (tops, i);
      if (GTK_IS_MESSAGE_DIALOG (o) && gtk_window_get_transient_for (GTK_WINDOW (o)) == data)
        return TRUE;
    }
  return FALSE;
}

/* Text typed in a field and not yet entered is not lost: Ctrl+S saves it
 * (the field keeps the focus and its cursor), and closing the window asks
 * about it. */
static void
test_typed_not_entered (void)
{
  g_autofree char *src = g_build_filename (SOURCE_DESIGNS_DIR, "medium-cargo.stagewright", NULL);
  g_autofree char *path = g_build_filename (tmp_dir, "typed.stagewright", NULL);
  g_autofree char *data = NULL;
  g_autoptr (GFile) file = g_file_new_for_path (path);
  g_autoptr (SwDesign) saved = NULL;
  g_autoptr (GError) error = NULL;
  SwWindow *w;
  SwNumberField *payload;
  GtkWidget *entry;
  gsize length;

  g_assert_true (g_file_get_contents (src, &data, &length, NULL));
  g_assert_true (g_file_set_contents (path, data, (gssize) length, NULL));
  w = sw_window_new (NULL);
  gtk_window_set_default_size (GTK_WINDOW (w), 1280, 900);
  gtk_window_present (GTK_WINDOW (w));
  g_assert_true (sw_window_load (w, file));
  sw_test_wait_until (mapped, w, 10000, "the window to map");
  sw_test_wait_until (sw_test_result_drawn, w, 60000, "the first result to be drawn");
  payload = field (w, SW_INSPECTOR_PAYLOAD);
  entry = sw_number_field_get_entry (payload);

  focus_field (w, GTK_WIDGET (payload));
  retype ("9000");
  xdo ("key", "Left", NULL);
  xdo ("key", "ctrl+s", NULL);
  drain ();
  saved = sw_design_load (path, NULL, &error);
  g_assert_no_error (error);
  g_assert_cmpfloat (saved->payload_kg, ==, 9000.0);
  g_assert_false (sw_document_get_modified (sw_window_get_document (w)));
  g_assert_true (gtk_widget_is_focus (gtk_root_get_focus (GTK_ROOT (w)))
                 && gtk_widget_is_ancestor (gtk_root_get_focus (GTK_ROOT (w)), entry));
  g_assert_cmpint (gtk_editable_get_position (GTK_EDITABLE (entry)), ==, 3);

  retype ("9100");
  gtk_window_close (GTK_WINDOW (w));
  sw_test_wait_until (question_shown, w, 5000, "the save question");
  g_assert_cmpfloat (doc_design (w)->payload_kg, ==, 9100.0);
  sw_test_window_close (w);
}

/* A first start shows an unsaved copy of a demo: the window says so, shows
 * its notes (they say it is invented) and offers New. */
static void
test_first_start (void)
{
  SwWindow *w = sw_window_new (NULL);
  g_autofree char *path = g_build_filename (SOURCE_DESIGNS_DIR, "medium-cargo.stagewright",
                                            NULL);
  g_autoptr (GFile) file = g_file_new_for_path (path);
  SwInspector *inspector = sw_window_get_inspector (w);
  GtkWidget *intro = sw_inspector_get_field (inspector, SW_INSPECTOR_INTRO);
  GtkTextBuffer *notes;
  GtkTextIter a, b;
  g_autofree char *text = NULL;

  gtk_window_present (GTK_WINDOW (w));
  g_assert_true (sw_window_load_template (w, file));
  sw_test_wait_until (sw_test_result_drawn, w, 60000, "the first result to be drawn");
  g_assert_true (gtk_widget_get_visible (intro));
  g_assert_true (gtk_widget_get_mapped (intro));
  notes = gtk_text_view_get_buffer (GTK_TEXT_VIEW (sw_inspector_get_field (inspector,
                                                                           SW_INSPECTOR_NOTES)));
  gtk_text_buffer_get_bounds (notes, &a, &b);
  text = gtk_text_buffer_get_text (notes, &a, &b, FALSE);
  g_assert_true (g_str_has_prefix (text, "Invented demonstration scenario"));
  /* Saved, the copy is the user's own design: the note goes. */
  {
    g_autofree char *saved = g_build_filename (tmp_dir, "mine.stagewright", NULL);
    g_autoptr (GFile) saved_file = g_file_new_for_path (saved);
    g_autoptr (GError) error = NULL;

    g_assert_true (sw_window_save_to (w, saved_file, &error));
    g_assert_false (gtk_widget_get_visible (intro));
    g_assert_true (sw_window_load_template (w, file));
    g_assert_true (gtk_widget_get_visible (intro));
  }
  g_assert_true (gtk_widget_activate_action (GTK_WIDGET (w), "design.new", NULL));
  drain ();
  g_assert_false (gtk_widget_get_visible (intro));
  sw_test_window_close (w);
}

/* A stage added in the window (Ctrl+Shift+N, as a user does) gets its
 * thrust from the common-practice ignition thrust-to-weight, so the ascent
 * is simulated without opening the file; the T/W field then shows it. */
static void
test_new_stage_flies (void)
{
  SwWindow *w = window_with_demo ("three-stage-simulated.stagewright");
  SwInspector *inspector = sw_window_get_inspector (w);
  SwAnalysis *r;

  focus_field (w, sw_inspector_get_field (inspector, SW_INSPECTOR_EPS_FORM));
  xdo ("key", "ctrl+shift+n", NULL);
  g_assert_cmpuint (doc_design (w)->n_stages, ==, 4);
  g_assert_true (doc_design (w)->stages[3].propulsion.has_thrust);
  g_assert_cmpint (sw_inspector_get_selected (inspector), ==, 3);
  /* 0.8: upper-stage ignition T/W 0.6 to 1.2 (common practice). */
  g_assert_cmpfloat_with_epsilon (sw_number_field_get_value (field (w, SW_INSPECTOR_TW)), 0.8,
                                  1e-9);
  sw_test_wait_until (sw_test_result_complete, w, 120000, "the ascent of four stages");
  r = sw_window_get_shown_result (w);
  if (r->ascent == NULL)
    g_error ("no ascent for the new stage: %s", r->ascent_message);
  g_assert_null (strstr (r->ascent_message, "missing"));
  /* A T/W typed in the field sets the thrust: one edit. */
  focus_field (w, GTK_WIDGET (field (w, SW_INSPECTOR_TW)));
  retype ("1.1");
  xdo ("key", "Return", NULL);
  g_assert_null (sw_number_field_get_error (field (w, SW_INSPECTOR_TW)));
  g_assert_cmpfloat_with_epsilon (sw_design_ignition_tw (doc_design (w), 3), 1.1, 1e-9);
  sw_test_window_close (w);
}

/* The parser behind every field, case by case: the decimal mark of the
 * locale (',' in German, with '.' its grouping mark), '.' where it is not
 * the grouping mark, a sign, an exponent; nothing else. */
/* The boosters in the inspector, typed as a user does: the count out of
 * range is refused on its field; the thrust per booster is one edit; a fixed
 * load left empty sizes them; count 0 hides the rest and saves no key. */
static void
test_boosters (void)
{
  SwWindow *w = window_with_demo ("four-booster-cargo.stagewright");
  SwInspector *insp = sw_window_get_inspector (w);
  SwNumberField *count = field (w, SW_INSPECTOR_BOOSTER_COUNT);
  SwNumberField *thrust = field (w, SW_INSPECTOR_BOOSTER_THRUST);
  SwNumberField *load = field (w, SW_INSPECTOR_BOOSTER_PROPELLANT_LOAD);
  g_autoptr (SwDesign) before = sw_design_copy (doc_design (w));

  g_assert_cmpfloat (sw_number_field_get_value (count), ==, 4.0);
  g_assert_true (gtk_widget_get_visible (GTK_WIDGET (thrust)));
  g_assert_true (gtk_widget_is_visible (sw_inspector_get_field (insp,
                                                                SW_INSPECTOR_BOOSTER_CROSSFEED)));
  focus_field (w, GTK_WIDGET (count));
  retype ("13");
  xdo ("key", "Return", NULL);
  assert_unchanged (w, before);
  g_assert_nonnull (sw_number_field_get_error (count));
  xdo ("key", "Escape", NULL);

  focus_field (w, GTK_WIDGET (thrust));
  retype ("900");
  xdo ("key", "Return", NULL);
  g_assert_cmpfloat (doc_design (w)->boosters.thrust_vac_kn, ==, 900.0);
  g_assert_null (sw_number_field_get_error (thrust));
  maybe_shot (w, "input-boosters-section.png");

  focus_field (w, GTK_WIDGET (load));
  retype ("abc");
  xdo ("key", "Return", NULL);
  g_assert_true (doc_design (w)->boosters.propellant.has_propellant_kg);
  g_assert_nonnull (sw_number_field_get_error (load));
  retype ("");
  xdo ("key", "Return", NULL);
  g_assert_false (doc_design (w)->boosters.propellant.has_propellant_kg);

  /* The crossfeed is a named edit too. */
  gtk_check_button_set_active (GTK_CHECK_BUTTON (sw_inspector_get_field (
                                 insp, SW_INSPECTOR_BOOSTER_CROSSFEED)), TRUE);
  drain ();
  g_assert_true (doc_design (w)->boosters.crossfeed);

  focus_field (w, GTK_WIDGET (count));
  retype ("0");
  xdo ("key", "Return", NULL);
  g_assert_cmpuint (doc_design (w)->boosters.count, ==, 0);
  drain ();
  g_assert_false (gtk_widget_is_visible (GTK_WIDGET (thrust)));
  {
    g_autofree char *data = sw_design_to_data (doc_design (w), NULL);
    g_assert_null (strstr (data, "\"boosters\""));
  }
  maybe_shot (w, "input-boosters.png");
  sw_test_window_close (w);
}

/* With boosters, stage 1's T/W field is the core's thrust alone over the
 * whole vehicle at liftoff: its caption says so and the cluster's figure
 * (the boosters' vacuum thrust too) stands beside it, both against the
 * design's own sizing by hand (the demo's 1,300 kN core and 4 x 800 kN
 * boosters).  A T/W typed there sets the core's thrust only.  An upper
 * stage, or no boosters, keeps "T/W at ignition". */
static void
test_booster_core_tw (void)
{
  SwWindow *w = window_with_demo ("four-booster-cargo.stagewright");
  SwInspector *insp = sw_window_get_inspector (w);
  SwNumberField *tw = field (w, SW_INSPECTOR_TW);
  GtkWidget *caption = gtk_widget_get_prev_sibling (GTK_WIDGET (tw));
  GtkWidget *note = gtk_widget_get_next_sibling (GTK_WIDGET (tw));
  SwSizing sz;
  double m0, with;
  g_autofree char *want = NULL, *ratio = NULL;

  sw_inspector_set_selected (insp, 0);
  drain ();
  g_assert_true (GTK_IS_LABEL (caption) && GTK_IS_LABEL (note));
  g_assert_true (sw_size_design (doc_design (w), &sz, NULL));
  g_assert_true (sz.feasible);
  m0 = sz.liftoff_mass_kg;
  g_assert_cmpfloat_with_epsilon (sw_number_field_get_value (tw), 1300e3 / (9.80665 * m0), 1e-9);
  with = (1300e3 + 4 * 800e3) / (9.80665 * m0);
  g_assert_cmpfloat_with_epsilon (sw_design_liftoff_tw_with_boosters (doc_design (w)), with, 1e-12);
  g_assert_cmpstr (gtk_label_get_text (GTK_LABEL (caption)), ==, "T/W at ignition, core alone");
  ratio = sw_format_ratio (with, 2);
  want = g_strdup_printf ("with boosters %s", ratio);
  g_assert_cmpstr (gtk_label_get_text (GTK_LABEL (note)), ==, want);
  maybe_shot (w, "input-booster-core-tw.png");

  /* Typed, the core's thrust follows; the boosters' stays. */
  focus_field (w, GTK_WIDGET (tw));
  retype ("0.5");
  xdo ("key", "Return", NULL);
  g_assert_null (sw_number_field_get_error (tw));
  g_assert_cmpfloat (doc_design (w)->boosters.thrust_vac_kn, ==, 800.0);
  /* From the sizing as it was when typed: with boosters the core's mass
   * flow moves the sizing, so the new T/W is near 0.5, not exactly. */
  g_assert_cmpfloat_with_epsilon (doc_design (w)->stages[0].propulsion.thrust_vac_kn,
                                  0.5 * 9.80665 * m0 / 1000.0, 1e-6);
  g_assert_cmpfloat_with_epsilon (sw_design_ignition_tw (doc_design (w), 0), 0.5, 0.01);

  /* An upper stage: the plain caption, nothing beside. */
  sw_inspector_set_selected (insp, 1);
  drain ();
  g_assert_cmpstr (gtk_label_get_text (GTK_LABEL (caption)), ==, "T/W at ignition");
  g_assert_cmpstr (gtk_label_get_text (GTK_LABEL (note)), ==, "");
  sw_test_window_close (w);
}

static void
test_parse (void)
{
  static const struct {
    const char *text, *mark, *grouping;
    gboolean ok;
    double value;
  } cases[] = {
    { "0,95", ",", ".", TRUE, 0.95 },
    { "0.95", ",", ".", FALSE, 0 },     /* German grouping mark: ambiguous, refused */
    { "1.500", ",", ".", FALSE, 0 },
    { "0.95", ".", ",", TRUE, 0.95 },
    { "0,95", ".", ",", FALSE, 0 },     /* English grouping mark */
    { "0.95", ",", "", TRUE, 0.95 },    /* a comma locale without grouping takes '.' too */
    { "-5", ".", "", TRUE, -5.0 },
    { "\xe2\x88\x92" "3,5", ",", ".", TRUE, -3.5 },  /* U+2212 minus */
    { "+4", ".", "", TRUE, 4.0 },
    { ".5", ".", "", TRUE, 0.5 },
    { "5.", ".", "", TRUE, 5.0 },
    { " 12 ", ".", "", TRUE, 12.0 },
    { "1e3", ".", "", TRUE, 1000.0 },
    { "2,5E-1", ",", ".", TRUE, 0.25 },
    { "1e", ".", "", FALSE, 0 },
    { "", ".", "", FALSE, 0 },
    { "-", ".", "", FALSE, 0 },
    { "abc", ".", "", FALSE, 0 },
    { "12 kg", ".", "", FALSE, 0 },
    { "nan", ".", "", FALSE, 0 },
    { "inf", ".", "", FALSE, 0 },
    { "0x10", ".", "", FALSE, 0 },
    { "1,2,3", ",", ".", FALSE, 0 },
    { "1e999", ".", "", FALSE, 0 },     /* not finite */
  };

  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      double v = -12345.0;
      gboolean ok = sw_number_parse (cases[i].text, cases[i].mark, cases[i].grouping, &v);

      if (ok != cases[i].ok)
        g_error ("\"%s\" (mark %s, grouping \"%s\"): %s", cases[i].text, cases[i].mark,
                 cases[i].grouping, ok ? "accepted" : "refused");
      if (ok)
        g_assert_cmpfloat (v, ==, cases[i].value);
    }
}



/* A click on "To scale" switches the stack view and the setting; a click
 * on a stage there selects it; a drag there changes nothing (no share is
 * dragged in the to-scale picture). */
static void
test_to_scale_clicks (void)
{
  SwWindow *w = window_with_demo ("three-stage-simulated.stagewright");
  g_autoptr (GSettings) settings = g_settings_new ("org.stagewright.Stagewright");
  g_autoptr (SwDesign) before = sw_design_copy (doc_design (w));
  GtkWidget *view = GTK_WIDGET (sw_window_get_stack_view (w));
  g_autofree char *xid = xid_of (w);
  graphene_rect_t rc, lower;

  g_assert_false (sw_stack_view_get_to_scale (SW_STACK_VIEW (view)));
  xdo ("windowfocus", "--sync", xid, NULL);
  point_at (sw_window_get_scale_toggle (w));
  xdo ("click", "1", NULL);
  g_assert_true (sw_stack_view_get_to_scale (SW_STACK_VIEW (view)));
  g_assert_true (g_settings_get_boolean (settings, "stack-to-scale"));
  g_assert_cmpfloat (sw_stack_view_get_metre_scale (SW_STACK_VIEW (view)), >, 0.0);
  maybe_shot (w, "to-scale.png");

  g_assert_true (sw_stack_view_get_block_rect (SW_STACK_VIEW (view), 1, &rc));
  point_at_xy (view, rc.origin.x + rc.size.width / 2.0, rc.origin.y + rc.size.height / 2.0);
  xdo ("click", "1", NULL);
  g_assert_cmpint (sw_inspector_get_selected (sw_window_get_inspector (w)), ==, 1);

  /* Press on the joint between stages 1 and 2 and drag up: nothing moves. */
  g_assert_true (sw_stack_view_get_block_rect (SW_STACK_VIEW (view), 0, &lower));
  point_at_xy (view, lower.origin.x + lower.size.width / 2.0, lower.origin.y + 1.0);
  xdo ("mousedown", "1", NULL);
  point_at_xy (view, lower.origin.x + lower.size.width / 2.0, lower.origin.y - 40.0);
  xdo ("mouseup", "1", NULL);
  assert_unchanged (w, before);

  point_at (sw_window_get_scale_toggle (w));
  g_settings_set_boolean (settings, "stack-to-scale", FALSE);
  drain ();
  g_assert_false (sw_stack_view_get_to_scale (SW_STACK_VIEW (view)));
  sw_test_window_close (w);
}

/* ---- the wheel over every field of every page --------------------------- */

static void
collect_numbers (GtkWidget *root, GPtrArray *out)
{
  if (GTK_IS_SPIN_BUTTON (root) || SW_IS_NUMBER_FIELD (root))
    {
      g_ptr_array_add (out, root);
      return;
    }
  for (GtkWidget *c = gtk_widget_get_first_child (root); c != NULL;
       c = gtk_widget_get_next_sibling (c))
    collect_numbers (c, out);
}

static double
number_value (GtkWidget *f)
{
  return GTK_IS_SPIN_BUTTON (f) ? gtk_spin_button_get_value (GTK_SPIN_BUTTON (f))
                                : sw_number_field_get_value (SW_NUMBER_FIELD (f));
}

static gboolean
same_value (double a, double b)
{
  return (isnan (a) && isnan (b)) || a == b;
}

/* Scrolls the panel that holds @widget so that its middle is on screen;
 * FALSE when it cannot be (then the case is skipped, not failed). */
static gboolean
bring_into_view (GtkWidget *widget)
{
  GtkWidget *scroller = gtk_widget_get_ancestor (widget, GTK_TYPE_SCROLLED_WINDOW);
  GtkWidget *content;
  graphene_rect_t b;

  if (scroller == NULL)
    return TRUE;
  content = gtk_scrolled_window_get_child (GTK_SCROLLED_WINDOW (scroller));
  if (GTK_IS_VIEWPORT (content) && gtk_viewport_get_child (GTK_VIEWPORT (content)) != NULL)
    content = gtk_viewport_get_child (GTK_VIEWPORT (content));
  if (!gtk_widget_compute_bounds (widget, content, &b))
    return FALSE;
  gtk_adjustment_set_value (gtk_scrolled_window_get_vadjustment (GTK_SCROLLED_WINDOW (scroller)),
                            b.origin.y + b.size.height / 2.0
                            - gtk_widget_get_height (scroller) / 2.0);
  /* The new position is laid out on a coming frame. */
  for (int tries = 0; tries < 200; tries++)
    {
      drain ();
      if (gtk_widget_compute_bounds (widget, scroller, &b)
          && b.origin.y + b.size.height / 2.0 > 0.0
          && b.origin.y + b.size.height / 2.0 < gtk_widget_get_height (scroller))
        return TRUE;
      g_usleep (10000);
    }
  return FALSE;
}

/* Scrolls up and down over each number field of @root (spin buttons and
 * the project's fields, popovers included) while the focus is elsewhere:
 * no field's value and nothing in the design may change.  Returns the
 * count of fields tried. */
static guint
wheel_over_fields (SwWindow *w, GtkWidget *root, const char *where)
{
  g_autoptr (GPtrArray) fields = g_ptr_array_new ();
  guint tried = 0;

  collect_numbers (root, fields);
  for (guint k = 0; k < fields->len; k++)
    {
      GtkWidget *f = fields->pdata[k];
      GtkWidget *popover = gtk_widget_get_ancestor (f, GTK_TYPE_POPOVER);
      g_autoptr (SwDesign) before = NULL;
      g_autoptr (GPtrArray) values = g_ptr_array_new_with_free_func (g_free);
      GtkWidget *focus;

      if (popover != NULL)
        {
          gtk_popover_popup (GTK_POPOVER (popover));
          sw_test_wait_until (popover_mapped, f, 10000, "a popover to open");
          /* The focus on another field of the popover, or on none. */
          gtk_widget_grab_focus (fields->pdata[k == 0 || gtk_widget_get_ancestor (
                                                  fields->pdata[k - 1], GTK_TYPE_POPOVER)
                                                  != popover ? k + 1 < fields->len ? k + 1 : k
                                                             : k - 1]);
        }
      else
        gtk_window_set_focus (GTK_WINDOW (w), NULL);
      drain ();
      if (!gtk_widget_is_drawable (f) || !gtk_widget_get_sensitive (f)
          || (popover == NULL && !bring_into_view (f)))
        {
          if (popover != NULL)
            gtk_popover_popdown (GTK_POPOVER (popover));
          continue;
        }
      focus = gtk_root_get_focus (GTK_ROOT (w));
      if (focus != NULL && (focus == f || gtk_widget_is_ancestor (focus, f)))
        {
          gtk_window_set_focus (GTK_WINDOW (w), NULL);
          drain ();
        }
      before = sw_design_copy (doc_design (w));
      for (guint j = 0; j < fields->len; j++)
        {
          double *v = g_new (double, 1);
          *v = number_value (fields->pdata[j]);
          g_ptr_array_add (values, v);
        }
      point_at (f);
      /* Up, checked, then down, checked: up and down together could cancel
       * out. */
      for (guint button = 4; button <= 5; button++)
        {
          g_autofree char *b = g_strdup_printf ("%u", button);
          xdo ("click", "--repeat", "2", "--delay", "30", b, NULL);
          for (guint j = 0; j < fields->len; j++)
            if (!same_value (number_value (fields->pdata[j]), *(double *) values->pdata[j]))
              g_error ("%s: the wheel over field %u (%s) changed field %u (%s) from %g to %g",
                       where, k, G_OBJECT_TYPE_NAME (f), j,
                       gtk_widget_get_tooltip_text (fields->pdata[j]),
                       *(double *) values->pdata[j], number_value (fields->pdata[j]));
        }
      for (guint j = 0; j < fields->len; j++)
        if (!same_value (number_value (fields->pdata[j]), *(double *) values->pdata[j]))
          g_error ("%s: the wheel over field %u (%s) changed field %u (%s) from %g to %g", where,
                   k, G_OBJECT_TYPE_NAME (f), j, gtk_widget_get_tooltip_text (fields->pdata[j]),
                   *(double *) values->pdata[j], number_value (fields->pdata[j]));
      if (!sw_design_equal (doc_design (w), before))
        g_error ("%s: the wheel over field %u (%s, %s) changed the design", where, k,
                 G_OBJECT_TYPE_NAME (f), gtk_widget_get_tooltip_text (f));
      tried++;
      if (popover != NULL)
        {
          gtk_popover_popdown (GTK_POPOVER (popover));
          drain ();
        }
    }
  return tried;
}

static gboolean
laid_out (gpointer data)
{
  GtkWidget *scroller = gtk_widget_get_first_child (GTK_WIDGET (data));

  while (scroller != NULL && !GTK_IS_SCROLLED_WINDOW (scroller))
    scroller = gtk_widget_get_first_child (scroller);
  return gtk_widget_get_mapped (GTK_WIDGET (data)) && gtk_widget_get_height (GTK_WIDGET (data)) > 0
         && (scroller == NULL || gtk_widget_get_height (scroller) > 0);
}

static void
show_page (SwWindow *w, const char *name, gpointer page)
{
  g_assert_true (sw_window_show_page (w, name));
  sw_test_wait_until (laid_out, page, 20000, "a page to be laid out");
  drain ();
}

/* Every number field of the window, on every page, popovers included: the
 * wheel without focus changes no value (the wheel with focus does edit, as
 * test_wheel and test_wheel_trade_page show). */
static void
test_wheel_every_field (void)
{
  SwWindow *w = window_with_demo ("small-sat-launcher.stagewright");
  guint tried;

  g_assert_true (sw_window_show_page (w, "curves"));
  drain ();
  tried = wheel_over_fields (w, GTK_WIDGET (sw_window_get_inspector (w)), "inspector");
  g_assert_cmpuint (tried, >=, 10);
  show_page (w, "ascent", sw_window_get_ascent_page (w));
  g_assert_cmpuint (wheel_over_fields (w, GTK_WIDGET (sw_window_get_ascent_page (w)), "ascent"),
                    ==, 3);
  show_page (w, "trade", sw_window_get_trade_page (w));
  g_assert_cmpuint (wheel_over_fields (w, GTK_WIDGET (sw_window_get_trade_page (w)), "trade"),
                    >=, 5);
  show_page (w, "staging", sw_window_get_staging_page (w));
  g_assert_cmpuint (wheel_over_fields (w, GTK_WIDGET (sw_window_get_staging_page (w)),
                                       "staging"), >=, 10);
  sw_test_window_close (w);
}

/* Every window shortcut pressed while a number field holds typed, not yet
 * entered text: no shortcut puts that text into the design or changes a
 * value nobody typed (a stage added, moved or removed by its shortcut keeps
 * every other stage's values). */
static gboolean
isp_values_kept (const SwDesign *now, const SwDesign *before, double typed)
{
  for (guint i = 0; i < now->n_stages; i++)
    {
      if (now->stages[i].isp_vac_s == typed)
        return FALSE;
      /* A stage that was there keeps its value; a new one (added,
       * duplicated) has its own. */
      for (guint j = 0; j < before->n_stages; j++)
        if (g_strcmp0 (now->stages[i].name, before->stages[j].name) == 0
            && now->stages[i].isp_vac_s != before->stages[j].isp_vac_s)
          return FALSE;
    }
  return TRUE;
}

static void
test_every_shortcut_in_field (void)
{
  static const char *const keys[] = {
    "ctrl+1", "ctrl+2", "ctrl+3", "alt+1", "alt+2", "alt+3", "alt+4", "ctrl+shift+n", "ctrl+d",
    "ctrl+Delete", "alt+Up", "alt+Down", "ctrl+Prior", "ctrl+Next", "ctrl+shift+c", "ctrl+z",
    "ctrl+shift+z", "ctrl+y",
  };
  SwWindow *w = window_with_demo ("small-sat-launcher.stagewright");
  SwInspector *inspector = sw_window_get_inspector (w);
  SwDocument *doc = sw_window_get_document (w);

  for (guint k = 0; k < G_N_ELEMENTS (keys); k++)
    {
      g_autoptr (SwDesign) before = NULL;
      SwNumberField *isp = field (w, SW_INSPECTOR_ISP_VAC);

      g_assert_true (sw_window_show_page (w, "curves"));
      sw_inspector_set_selected (inspector, 1);
      drain ();
      before = sw_design_copy (doc_design (w));
      focus_field (w, GTK_WIDGET (isp));
      retype ("401");
      xdo ("key", "--clearmodifiers", keys[k], NULL);
      if (!isp_values_kept (doc_design (w), before, 401.0))
        {
          for (guint i = 0; i < doc_design (w)->n_stages; i++)
            g_printerr ("  stage %u %s isp %g\n", i, doc_design (w)->stages[i].name, doc_design (w)->stages[i].isp_vac_s);
          g_error ("%s with \"401\" typed in the vacuum Isp field changed a stage's Isp", keys[k]);
        }
      /* Back to the demo as loaded, for the next key. */
      xdo ("key", "Escape", NULL);
      while (sw_document_can_undo (doc))
        sw_document_undo (doc);
      drain ();
    }
  sw_test_window_close (w);
}

/* The window's stage keys (Ctrl+Page Up/Down) with the focus in a spin
 * button of the trade page or the ascent page's limits: GTK's own binding
 * would jump the value to its maximum or minimum (as the vacuum Isp once
 * went to 1000 s); neither the value nor the design may change. */
static void
test_stage_keys_in_spins (void)
{
  SwWindow *w = window_with_demo ("small-sat-launcher.stagewright");
  const char *pages[] = { "trade", "ascent" };
  guint tried = 0;

  for (guint p = 0; p < G_N_ELEMENTS (pages); p++)
    {
      GtkWidget *page = p == 0 ? GTK_WIDGET (sw_window_get_trade_page (w))
                               : GTK_WIDGET (sw_window_get_ascent_page (w));
      g_autoptr (GPtrArray) fields = g_ptr_array_new ();

      show_page (w, pages[p], page);
      collect_numbers (page, fields);
      for (guint k = 0; k < fields->len; k++)
        {
          GtkWidget *f = fields->pdata[k];
          GtkWidget *popover = gtk_widget_get_ancestor (f, GTK_TYPE_POPOVER);
          g_autoptr (SwDesign) before = NULL;
          double value;

          if (!GTK_IS_SPIN_BUTTON (f))
            continue;
          if (popover != NULL)
            {
              gtk_popover_popup (GTK_POPOVER (popover));
              sw_test_wait_until (popover_mapped, f, 10000, "a popover to open");
            }
          if (!gtk_widget_is_drawable (f) || !gtk_widget_get_sensitive (f))
            continue;
          before = sw_design_copy (doc_design (w));
          value = gtk_spin_button_get_value (GTK_SPIN_BUTTON (f));
          g_assert_true (gtk_widget_grab_focus (f));
          drain ();
          xdo ("key", "--clearmodifiers", "ctrl+Prior", NULL);
          g_assert_cmpfloat (gtk_spin_button_get_value (GTK_SPIN_BUTTON (f)), ==, value);
          xdo ("key", "--clearmodifiers", "ctrl+Next", NULL);
          g_assert_cmpfloat (gtk_spin_button_get_value (GTK_SPIN_BUTTON (f)), ==, value);
          assert_unchanged (w, before);
          tried++;
          if (popover != NULL)
            gtk_popover_popdown (GTK_POPOVER (popover));
          drain ();
        }
    }
  g_assert_cmpuint (tried, >=, 9);
  sw_test_window_close (w);
}

int
main (int argc, char **argv)
{
  int status;

  tmp_dir = sw_gui_test_env_init (&argc, &argv, "stagewright-input-XXXXXX");
  if (!GDK_IS_X11_DISPLAY (gdk_display_get_default ()))
    {
      g_printerr ("test-gui-input needs the X11 backend (GDK_BACKEND=x11 under Xvfb)\n");
      return 77;
    }

  g_test_add_func ("/gui/input/parse", test_parse);
  g_test_add_func ("/gui/input/letters", test_letters);
  g_test_add_func ("/gui/input/out-of-range", test_out_of_range);
  g_test_add_func ("/gui/input/decimal-comma", test_decimal_comma);
  g_test_add_func ("/gui/input/shortcut-in-field", test_shortcut_in_field);
  g_test_add_func ("/gui/input/wheel", test_wheel);
  g_test_add_func ("/gui/input/wheel-trade-page", test_wheel_trade_page);
  g_test_add_func ("/gui/input/wheel-every-field", test_wheel_every_field);
  g_test_add_func ("/gui/input/every-shortcut-in-field", test_every_shortcut_in_field);
  g_test_add_func ("/gui/input/stage-keys-in-spins", test_stage_keys_in_spins);
  g_test_add_func ("/gui/input/simulated-mc", test_simulated_mc);
  g_test_add_func ("/gui/input/dependent-field", test_dependent_field);
  g_test_add_func ("/gui/input/undo-in-field", test_undo_in_field);
  g_test_add_func ("/gui/input/typed-not-entered", test_typed_not_entered);
  g_test_add_func ("/gui/input/first-start", test_first_start);
  g_test_add_func ("/gui/input/new-stage-flies", test_new_stage_flies);
  g_test_add_func ("/gui/input/to-scale-clicks", test_to_scale_clicks);
  g_test_add_func ("/gui/input/boosters", test_boosters);
  g_test_add_func ("/gui/input/booster-core-tw", test_booster_core_tw);

  status = g_test_run ();
  sw_gui_test_env_finish (tmp_dir);
  return status;
}
