/* SPDX-License-Identifier: GPL-3.0-or-later */
/* GUI tests of the ascent in the main window: the simulation runs on the
 * solver thread after the sizing and never blocks the window, a newer edit
 * cancels it, the page shows the core's numbers, a design without the
 * propulsion keys gets the core's explanation, the warnings follow the
 * user's limits, and the stack view's thrust-to-weight comes from the
 * result.  Run under Xvfb with the cairo renderer (suite 'gui'). */
#include "config.h"

#include "sw-application.h"
#include "sw-ascent.h"
#include "sw-format.h"
#include "sw-plot-private.h"
#include "sw-spinner.h"
#include "sw-window-private.h"

#include "gui-test-env.h"

#include <glib/gstdio.h>
#include <math.h>
#include <string.h>

/* Generous for sanitizer builds: the closed loop takes about 0.1 to 0.6 s. */
#define ASCENT_WAIT_MS 60000

static char *tmp_dir;

/* ---- helpers ----------------------------------------------------------- */

/* The newest edit's sizing has been shown and painted, and its ascent too
 * (or it has none). */
static gboolean
ascent_shown (gpointer data)
{
  SwWindow *w = data;

  return sw_test_result_drawn (w) && !sw_window_get_shown_result (w)->ascent_pending;
}

static void
wait_ascent (SwWindow *w)
{
  sw_test_wait_until (ascent_shown, w, ASCENT_WAIT_MS, "the newest ascent to be shown");
}

static SwWindow *
window_new (void)
{
  SwWindow *w = sw_window_new (NULL);

  gtk_window_set_default_size (GTK_WINDOW (w), 1280, 800);
  gtk_window_present (GTK_WINDOW (w));
  wait_ascent (w);
  return w;
}

static void
load_demo (SwWindow *w, const char *name)
{
  g_autofree char *path = g_build_filename (SOURCE_DESIGNS_DIR, name, NULL);
  g_autoptr (GFile) file = g_file_new_for_path (path);

  g_assert_true (sw_window_load (w, file));
  wait_ascent (w);
}

static SwAscentPage *
page (SwWindow *w)
{
  return sw_window_get_ascent_page (w);
}

static const char *
page_text (SwWindow *w, SwAscentPageField f)
{
  return sw_ascent_page_get_text (page (w), f);
}

/* An edit of the payload as a user makes it. */
static void
set_payload (SwWindow *w, double kg)
{
  SwNumberField *spin = SW_NUMBER_FIELD (sw_inspector_get_field (sw_window_get_inspector (w),
                                                                 SW_INSPECTOR_PAYLOAD));
  sw_number_field_commit_value (spin, kg);
}

static void
assert_no_nan (const char *text)
{
  g_autofree char *lower = text != NULL ? g_ascii_strdown (text, -1) : NULL;

  if (lower == NULL)
    return;
  g_assert_null (strstr (lower, "nan"));
  g_assert_null (strstr (lower, "inf"));
}

/* ---- the ascent never blocks the window -------------------------------- */

/* The machine is shared (two cores, other jobs, the X server): a tick can
 * come late because the main thread was waiting for a processor or was busy
 * drawing.  Neither is blocking.  What the window must never do is sleep on
 * the worker; so each gap between ticks is split, with the kernel's
 * per-thread accounting (/proc/thread-self/schedstat: time on a processor,
 * time waiting in the run queue), into running, waiting to run, and the rest
 * (asleep), and the rest is what must stay short. */
typedef struct {
  gint64 wall_us;
  gint64 cpu_us;
  gint64 queued_us;
} Clock;

static void
read_clock (Clock *c)
{
  g_autofree char *text = NULL;
  guint64 cpu_ns = 0, queued_ns = 0;

  c->wall_us = g_get_monotonic_time ();
  if (g_file_get_contents ("/proc/thread-self/schedstat", &text, NULL, NULL)
      && sscanf (text, "%" G_GUINT64_FORMAT " %" G_GUINT64_FORMAT, &cpu_ns, &queued_ns) == 2)
    {
      c->cpu_us = (gint64) (cpu_ns / 1000);
      c->queued_us = (gint64) (queued_ns / 1000);
    }
  else
    c->cpu_us = c->queued_us = 0;   /* no accounting: the whole gap counts */
}

typedef struct {
  SwWindow *w;
  gint64    edit_us;
  Clock     last;
  gint64    max_gap_us;      /* wall clock */
  gint64    max_asleep_us;   /* neither running nor waiting to run */
  guint     ticks_while_simulating;
  gint64    sizing_us;       /* the sizing of the edit reached the views */
  gint64    ascent_us;       /* its ascent reached the views */
  guint64   serial;
} Watch;

static void
close_gap (Watch *wt)
{
  Clock now;
  gint64 gap, asleep;

  read_clock (&now);
  gap = now.wall_us - wt->last.wall_us;
  asleep = gap - (now.cpu_us - wt->last.cpu_us) - (now.queued_us - wt->last.queued_us);
  wt->max_gap_us = MAX (wt->max_gap_us, gap);
  wt->max_asleep_us = MAX (wt->max_asleep_us, asleep);
  wt->last = now;
}

static gboolean
tick_cb (gpointer data)
{
  Watch *wt = data;

  /* Only while the worker simulates: between the sizing and the ascent. */
  if (wt->sizing_us != 0 && wt->ascent_us == 0)
    {
      close_gap (wt);
      wt->ticks_while_simulating++;
    }
  return G_SOURCE_CONTINUE;
}

static void
watch_solved_cb (SwSolver *solver, SwAnalysis *r, Watch *wt)
{
  gint64 now = g_get_monotonic_time ();

  if (r->serial != wt->serial)
    return;
  if (r->ascent_pending && wt->sizing_us == 0)
    {
      wt->sizing_us = now;
      read_clock (&wt->last);
    }
  else if (!r->ascent_pending && r->ascent != NULL && wt->ascent_us == 0 && wt->sizing_us != 0)
    {
      close_gap (wt);   /* the last stretch, up to the ascent's arrival */
      wt->ascent_us = now;
    }
}

static void
test_not_blocking (void)
{
  SwWindow *w = window_new ();
  Watch wt = { w, 0 };
  guint tick;
  gulong handler;

  load_demo (w, "three-stage-simulated.stagewright");
  g_assert_true (sw_window_show_page (w, "ascent"));
  wait_ascent (w);

  handler = g_signal_connect (sw_window_get_solver (w), "solved", G_CALLBACK (watch_solved_cb),
                              &wt);

  tick = g_timeout_add (10, tick_cb, &wt);

  wt.edit_us = g_get_monotonic_time ();
  set_payload (w, 1600.0);
  wt.serial = sw_solver_get_posted_serial (sw_window_get_solver (w));
  wait_ascent (w);
  g_source_remove (tick);
  g_signal_handler_disconnect (sw_window_get_solver (w), handler);

  /* The sizing came first, on its own; the ascent followed for the same
   * edit, and the main loop kept running in between. */
  g_test_message ("payload edit: sizing in the views after %.1f ms, ascent after %.1f ms; "
                  "%u ticks of a 10 ms timeout while the worker simulated, longest gap %.1f ms "
                  "(asleep at most %.1f ms of a gap)",
                  (wt.sizing_us - wt.edit_us) / 1000.0, (wt.ascent_us - wt.edit_us) / 1000.0,
                  wt.ticks_while_simulating, wt.max_gap_us / 1000.0, wt.max_asleep_us / 1000.0);
  g_assert_cmpint (wt.sizing_us, >, 0);
  g_assert_cmpint (wt.ascent_us, >, wt.sizing_us);
  /* The main loop is never held: at most 100 ms between ticks that the
   * main thread spent neither running nor waiting for a processor. */
  g_assert_cmpint (wt.max_asleep_us, <, 100000);
  sw_test_window_close (w);
}

/* ---- a newer edit cancels the older simulation ------------------------- */

typedef struct {
  GArray *ascents;     /* serials of the results emitted with an ascent */
} Emitted;

static void
record_cb (SwSolver *solver, SwAnalysis *r, Emitted *e)
{
  if (r->ascent != NULL)
    g_array_append_val (e->ascents, r->serial);
}

static gboolean
serial_shown (gpointer data)
{
  gpointer *args = data;
  SwWindow *w = args[0];
  guint64 serial = *(guint64 *) args[1];
  SwAnalysis *r = sw_window_get_shown_result (w);

  return r != NULL && r->serial == serial;
}

static gboolean
ascent_started (gpointer data)
{
  gpointer *args = data;
  guint64 started;

  sw_solver_get_ascent_counts (args[0], &started, NULL);
  return started > *(guint64 *) args[1];
}

static void
test_newer_edit_cancels (void)
{
  SwWindow *w = window_new ();
  SwSolver *solver = sw_window_get_solver (w);
  Emitted e = { g_array_new (FALSE, FALSE, sizeof (guint64)) };
  guint64 first, second, started, cancelled, started_after, cancelled_after;
  gpointer args[2];
  gulong handler;

  load_demo (w, "three-stage-simulated.stagewright");
  handler = g_signal_connect (solver, "solved", G_CALLBACK (record_cb), &e);
  sw_solver_get_ascent_counts (solver, &started, &cancelled);

  /* The first edit's closed loop (several simulations, a few hundred ms)
   * has begun on the worker when the second edit arrives. */
  set_payload (w, 1400.0);
  first = sw_solver_get_posted_serial (solver);
  args[0] = w;
  args[1] = &first;
  sw_test_wait_until (serial_shown, args, ASCENT_WAIT_MS, "the first edit's sizing");
  g_assert_true (sw_window_get_shown_result (w)->ascent_pending);
  args[0] = solver;
  args[1] = &started;
  sw_test_wait_until (ascent_started, args, ASCENT_WAIT_MS, "the first edit's ascent to start");
  set_payload (w, 1700.0);
  second = sw_solver_get_posted_serial (solver);
  g_assert_cmpuint (second, >, first);
  wait_ascent (w);
  g_signal_handler_disconnect (solver, handler);
  sw_solver_get_ascent_counts (solver, &started_after, &cancelled_after);

  /* The first simulation was abandoned part way; only the newest edit's
   * ascent was ever emitted, and it is the one shown. */
  g_assert_cmpuint (started_after, ==, started + 2);
  g_assert_cmpuint (cancelled_after, ==, cancelled + 1);
  for (guint i = 0; i < e.ascents->len; i++)
    g_assert_cmpuint (g_array_index (e.ascents, guint64, i), ==, second);
  g_assert_cmpuint (e.ascents->len, ==, 1);
  g_assert_cmpuint (sw_ascent_page_get_shown_serial (page (w)), ==, second);
  g_assert_false (sw_ascent_page_get_pending (page (w)));
  g_assert_cmpfloat (sw_window_get_shown_result (w)->design->payload_kg, ==, 1700.0);
  g_array_unref (e.ascents);
  sw_test_window_close (w);
}

/* ---- the page shows the core's numbers --------------------------------- */

static gboolean
plot_laid_out (gpointer data)
{
  gpointer *args = data;
  const SwAscentSample *s = args[1];
  double wx, wy;

  return sw_plot_data_to_widget (args[0], s->downrange_m, s->altitude_m, &wx, &wy);
}

static void
test_core_numbers (void)
{
  SwWindow *w = window_new ();
  SwAnalysis *r;
  g_autoptr (SwAscentResult) core = NULL;
  g_autoptr (GError) error = NULL;
  g_autofree char *q = NULL, *g = NULL, *losses = NULL, *tw = NULL, *liftoff = NULL;
  g_autofree char *sized = NULL, *orbit = NULL;

  load_demo (w, "three-stage-simulated.stagewright");
  r = sw_window_get_shown_result (w);
  g_assert_nonnull (r->ascent);

  /* The core, run here on the test's thread for the same design. */
  core = sw_ascent_fly_design (r->design, NULL, &error);
  g_assert_no_error (error);
  g_assert_true (core->reached_orbit);
  g_assert_true (core->closed_loop && core->loop_converged);

  q = g_strdup_printf ("%.1f kPa", core->max_q_pa / 1000.0);
  g = g_strdup_printf ("%.2f g", core->max_axial_g);
  losses = sw_format_speed (core->losses_m_s);
  tw = g_strdup_printf ("%.2f", core->stages[0].ignition_thrust_to_weight);
  orbit = g_strdup_printf ("%.0f × %.0f km", core->perigee_km, core->apogee_km);
  g_assert_cmpstr (page_text (w, SW_ASCENT_PAGE_MAX_Q), ==, q);
  g_assert_cmpstr (page_text (w, SW_ASCENT_PAGE_MAX_ACCEL), ==, g);
  g_assert_cmpstr (page_text (w, SW_ASCENT_PAGE_LOSSES), ==, losses);
  g_assert_cmpstr (page_text (w, SW_ASCENT_PAGE_LIFTOFF_TW), ==, tw);
  g_assert_cmpstr (page_text (w, SW_ASCENT_PAGE_ORBIT), ==, orbit);
  g_assert_true (g_str_has_prefix (page_text (w, SW_ASCENT_PAGE_STATUS), "Orbit reached"));
  /* The losses chart names the turning-atmosphere term as the README does,
   * with the core's figure, and has no catch-all "Other" bar. */
  {
    SwPlot *plot = sw_ascent_page_get_plot (page (w), SW_ASCENT_PLOT_LOSSES);
    g_autofree char *turning = sw_format_speed (core->rotation_term_m_s);
    g_autofree char *expected = g_strdup_printf ("Turning atmosphere %s", turning);
    gboolean seen = FALSE;

    g_assert_cmpfloat (fabs (core->rotation_term_m_s), >=, 0.5);
    g_assert_nonnull (plot->categories);
    for (guint i = 0; plot->categories[i] != NULL; i++)
      {
        g_assert_false (g_str_has_prefix (plot->categories[i], "Other"));
        seen = seen || g_strcmp0 (plot->categories[i], expected) == 0;
      }
    g_assert_true (seen);
  }

  /* "loss_model": "simulate": the closed loop's vehicle replaces the first
   * guess everywhere, and the totals say so. */
  g_assert_true (r->sized_by_ascent);
  g_assert_cmpfloat (r->sizing.liftoff_mass_kg, ==, core->sizing.liftoff_mass_kg);
  liftoff = sw_format_mass (core->sizing.liftoff_mass_kg);
  g_assert_cmpstr (sw_totals_get_text (sw_window_get_totals (w), SW_TOTALS_LIFTOFF), ==, liftoff);
  sized = sw_format_speed (core->loop_sized_losses_m_s);
  g_assert_nonnull (strstr (sw_totals_get_text (sw_window_get_totals (w),
                                                SW_TOTALS_ASCENT_NOTE),
                            "Sized with simulated losses"));
  g_assert_nonnull (strstr (sw_totals_get_text (sw_window_get_totals (w),
                                                SW_TOTALS_ASCENT_NOTE), sized));

  /* The stack view's thrust-to-weight is the worker's: the core's stage
   * figures of the vehicle shown. */
  {
    SwAscentStage fig[SW_MAX_STAGES];
    g_assert_true (sw_ascent_stage_figures (r->design, &r->sizing, fig, NULL));
    g_assert_true (r->has_stage_figures);
    for (guint i = 0; i < r->design->n_stages; i++)
      g_assert_cmpfloat (r->stage_figures[i].ignition_thrust_to_weight, ==,
                         fig[i].ignition_thrust_to_weight);
    /* The ascent starts with the same vehicle: liftoff thrust-to-weight. */
    g_assert_cmpfloat_with_epsilon (fig[0].ignition_thrust_to_weight,
                                    core->liftoff_thrust_to_weight, 1e-9);
  }

  /* The trajectory plot's axes hold the core's cutoff point, and no text
   * is a NaN. */
  {
    const SwAscentSample *last = &g_array_index (core->samples, SwAscentSample,
                                                 core->samples->len - 1);
    SwPlot *plot = sw_ascent_page_get_plot (page (w), SW_ASCENT_PLOT_TRAJECTORY);
    gpointer args[2] = { plot, (gpointer) last };
    graphene_rect_t area;
    double wx, wy;

    g_assert_true (sw_window_show_page (w, "ascent"));
    sw_test_wait_until (plot_laid_out, args, 5000, "the trajectory plot to be laid out");
    g_assert_true (sw_plot_data_to_widget (plot, last->downrange_m, last->altitude_m, &wx, &wy));
    g_assert_true (sw_plot_get_plot_area (plot, &area));
    g_assert_true (graphene_rect_contains_point (&area, &GRAPHENE_POINT_INIT (wx, wy)));
  }
  for (SwAscentPageField f = SW_ASCENT_PAGE_STATUS; f <= SW_ASCENT_PAGE_LIFTOFF_TW; f++)
    assert_no_nan (page_text (w, f));
  sw_test_window_close (w);
}

/* ---- without propulsion keys: the core's explanation ------------------- */

static void
test_no_propulsion (void)
{
  SwWindow *w = window_new ();
  SwDocument *doc = sw_window_get_document (w);
  g_autoptr (SwDesign) d = NULL;
  g_autoptr (GError) expected = NULL;
  SwAnalysis *r;

  load_demo (w, "medium-cargo.stagewright");
  g_assert_cmpuint (sw_ascent_page_get_shown_serial (page (w)), >, 0);
  d = sw_document_dup_design (doc);
  for (guint i = 0; i < d->n_stages; i++)
    memset (&d->stages[i].propulsion, 0, sizeof d->stages[i].propulsion);
  g_assert_false (sw_ascent_check_inputs (d, &expected));
  sw_document_commit (doc, g_steal_pointer (&d), NULL);
  wait_ascent (w);

  r = sw_window_get_shown_result (w);
  g_assert_true (r->ok);
  g_assert_false (r->ascent_pending);
  g_assert_null (r->ascent);
  g_assert_false (r->has_stage_figures);
  /* The core's words, naming the keys it needs. */
  g_assert_nonnull (strstr (sw_ascent_page_get_message (page (w)), expected->message));
  g_assert_nonnull (strstr (sw_ascent_page_get_message (page (w)), "thrust_vac_kn"));
  g_assert_cmpuint (sw_ascent_page_get_shown_serial (page (w)), ==, 0);
  g_assert_cmpstr (page_text (w, SW_ASCENT_PAGE_MAX_Q), ==, SW_NO_VALUE);
  g_assert_null (sw_totals_get_text (sw_window_get_totals (w), SW_TOTALS_ASCENT_WARNINGS));

  /* A delta-v mission: the ascent needs an orbit, and says so. */
  load_demo (w, "all-solid-concept.stagewright");
  r = sw_window_get_shown_result (w);
  g_assert_null (r->ascent);
  g_assert_nonnull (strstr (sw_ascent_page_get_message (page (w)), "mission.orbit"));
  /* The stage figures need no orbit: the stack view still gets them. */
  g_assert_true (r->has_stage_figures);
  sw_test_window_close (w);
}

/* ---- warnings against the user's limits -------------------------------- */

typedef struct {
  SwWindow   *w;
  const char *needle;    /* NULL: no warnings */
} WarnWait;

static gboolean
warnings_are (gpointer data)
{
  WarnWait *ww = data;
  const char *page_w = sw_ascent_page_get_warnings (page (ww->w));
  const char *totals_w = sw_totals_get_text (sw_window_get_totals (ww->w),
                                             SW_TOTALS_ASCENT_WARNINGS);

  if (ww->needle == NULL)
    return page_w == NULL && totals_w == NULL;
  return page_w != NULL && totals_w != NULL && strstr (page_w, ww->needle) != NULL
         && strcmp (page_w, totals_w) == 0;
}

static void
expect_warnings (SwWindow *w, const char *needle)
{
  WarnWait ww = { w, needle };
  sw_test_wait_until (warnings_are, &ww, 5000, needle != NULL ? needle : "no warnings");
}

static void
test_warnings (void)
{
  SwWindow *w = window_new ();
  g_autoptr (GSettings) settings = sw_application_settings_new ();
  SwAnalysis *r;
  g_autofree char *tw = NULL;

  load_demo (w, "three-stage-simulated.stagewright");
  r = sw_window_get_shown_result (w);
  /* The defaults: liftoff thrust-to-weight 1.2 (common practice), max-Q
   * 45 kPa and 6 g (from memory); this demo stays inside all three. */
  g_assert_cmpfloat (g_settings_get_double (settings, "min-thrust-to-weight"), ==, 1.2);
  g_assert_cmpfloat (r->ascent->liftoff_thrust_to_weight, >, 1.2);
  g_assert_cmpfloat (r->ascent->max_q_pa, <, 45000.0);
  g_assert_cmpfloat (r->ascent->max_axial_g, <, 6.0);
  expect_warnings (w, NULL);

  /* A stricter thrust-to-weight floor than the vehicle has. */
  g_settings_set_double (settings, "min-thrust-to-weight",
                         r->ascent->liftoff_thrust_to_weight + 0.1);
  tw = g_strdup_printf ("thrust-to-weight %.2f", r->stage_figures[0].ignition_thrust_to_weight);
  expect_warnings (w, tw);
  g_settings_reset (settings, "min-thrust-to-weight");
  expect_warnings (w, NULL);

  /* Max-Q above the limit. */
  g_settings_set_double (settings, "max-dynamic-pressure-kpa",
                         floor (r->ascent->max_q_pa / 1000.0) - 5.0);
  expect_warnings (w, "Max-Q");
  g_settings_reset (settings, "max-dynamic-pressure-kpa");
  expect_warnings (w, NULL);

  /* Acceleration above the limit. */
  g_settings_set_double (settings, "max-acceleration-g", floor (r->ascent->max_axial_g) - 1.0);
  expect_warnings (w, "Axial acceleration");
  g_settings_reset (settings, "max-acceleration-g");
  expect_warnings (w, NULL);

  /* A weaker first stage: below the default floor of 1.2, with the
   * default limit. */
  {
    SwDocument *doc = sw_window_get_document (w);
    g_autoptr (SwDesign) d = sw_document_dup_design (doc);
    d->stages[0].propulsion.thrust_vac_kn *= 0.6;
    sw_document_commit (doc, g_steal_pointer (&d), NULL);
    wait_ascent (w);
    r = sw_window_get_shown_result (w);
    g_assert_cmpfloat (r->stage_figures[0].ignition_thrust_to_weight, <, 1.2);
    expect_warnings (w, "below the limit of 1.20");
  }
  sw_test_window_close (w);
}

/* ---- a hidden page waits ----------------------------------------------- */

/* Every label's text below @w, in order; not the optimised steering's
 * line, which a newer flight changes at once (it cancels a run). */
static void
collect_texts (GtkWidget *w, GString *out)
{
  if (SW_IS_OPTIMISED_STEERING (w))
    return;
  if (GTK_IS_LABEL (w))
    g_string_append_printf (out, "%s\n", gtk_label_get_text (GTK_LABEL (w)));
  for (GtkWidget *c = gtk_widget_get_first_child (w); c != NULL; c = gtk_widget_get_next_sibling (c))
    collect_texts (c, out);
}

static char *
page_texts (SwWindow *w)
{
  GString *s = g_string_new (NULL);

  collect_texts (GTK_WIDGET (page (w)), s);
  return g_string_free (s, FALSE);
}

static gboolean
page_mapped (gpointer data)
{
  return gtk_widget_get_mapped (GTK_WIDGET (page (data)));
}

/* Behind another page the ascent page changes nothing on screen when a new
 * flight arrives (a label changed there would have the window laid out
 * again at every result); the totals above get the flight's note at once;
 * shown again, the page shows the newest flight before anything reads it. */
static void
test_hidden_page_waits (void)
{
  SwWindow *w = window_new ();
  g_autofree char *shown = NULL, *hidden = NULL, *reshown = NULL, *note = NULL;
  const char *read;

  load_demo (w, "three-stage-simulated.stagewright");
  g_assert_true (sw_window_show_page (w, "ascent"));
  sw_test_wait_until (page_mapped, w, 5000, "the ascent page to be shown");
  shown = page_texts (w);
  note = g_strdup (sw_totals_get_text (sw_window_get_totals (w), SW_TOTALS_ASCENT_NOTE));
  g_assert_nonnull (note);

  g_assert_true (sw_window_show_page (w, "curves"));
  set_payload (w, sw_window_get_shown_result (w)->design->payload_kg * 1.2);
  wait_ascent (w);
  g_assert_false (gtk_widget_get_mapped (GTK_WIDGET (page (w))));
  hidden = page_texts (w);
  g_assert_cmpstr (hidden, ==, shown);
  g_assert_cmpstr (sw_totals_get_text (sw_window_get_totals (w), SW_TOTALS_ASCENT_NOTE), !=, note);

  g_assert_true (sw_window_show_page (w, "ascent"));
  sw_test_wait_until (page_mapped, w, 5000, "the ascent page to be shown again");
  reshown = page_texts (w);
  g_assert_cmpstr (reshown, !=, shown);
  /* The accessors read what is on screen (they would catch the page up). */
  read = sw_ascent_page_get_text (page (w), SW_ASCENT_PAGE_ORBIT);
  g_assert_nonnull (strstr (reshown, read));
  {
    g_autofree char *after_read = page_texts (w);
    g_assert_cmpstr (after_read, ==, reshown);
  }
  sw_test_window_close (w);
}

/* ---- a window at rest ---------------------------------------------------- */

/* Once the newest result is shown, a window at rest lays nothing out: each
 * layout costs the frame's CPU and, on X11, a handful of round trips to the
 * server.  (The ascent page's spinner, left spinning behind another page
 * from the page's first "waiting", once had the window laid out at every
 * frame, 60 times a second, for good.)  Both with the ascent page hidden
 * and shown. */
static void
test_at_rest (void)
{
  SwWindow *w = window_new ();
  GdkFrameClock *clock = gtk_widget_get_frame_clock (GTK_WIDGET (w));

  load_demo (w, "three-stage-simulated.stagewright");
  for (int shown = 0; shown <= 1; shown++)
    {
      guint layouts = 0;
      gulong id;

      g_assert_true (sw_window_show_page (w, shown ? "ascent" : "curves"));
      /* The page change and what follows it settle first. */
      sw_test_spin_ms (500);
      id = g_signal_connect (clock, "layout", G_CALLBACK (sw_test_count_cb), &layouts);
      sw_test_spin_ms (1500);
      g_signal_handler_disconnect (clock, id);
      g_test_message ("ascent page %s: %u layouts in 1.5 s at rest",
                      shown ? "shown" : "hidden", layouts);
      g_assert_cmpuint (layouts, <=, 2);
    }
  sw_test_window_close (w);
}

/* Every spinner of the window goes through sw_spinner_set_busy: busy, it
 * turns only while mapped (behind another page its style animation would
 * lay the window out at every frame), and turns again when shown. */
static void
test_spinner_while_shown (void)
{
  GtkWidget *window = gtk_window_new ();
  GtkWidget *stack = gtk_stack_new ();
  GtkWidget *spinner = gtk_spinner_new ();
  GtkWidget *other = gtk_label_new ("another page");
  GtkSpinner *sp = GTK_SPINNER (spinner);

  gtk_stack_add_named (GTK_STACK (stack), spinner, "busy");
  gtk_stack_add_named (GTK_STACK (stack), other, "other");
  gtk_window_set_child (GTK_WINDOW (window), stack);
  gtk_stack_set_visible_child (GTK_STACK (stack), other);
  gtk_window_present (GTK_WINDOW (window));
  sw_test_spin_ms (200);

  sw_spinner_set_busy (sp, TRUE);
  g_assert_false (gtk_widget_get_mapped (spinner));
  g_assert_false (gtk_spinner_get_spinning (sp));
  gtk_stack_set_visible_child (GTK_STACK (stack), spinner);
  sw_test_spin_ms (100);
  g_assert_true (gtk_widget_get_mapped (spinner));
  g_assert_true (gtk_spinner_get_spinning (sp));
  gtk_stack_set_visible_child (GTK_STACK (stack), other);
  sw_test_spin_ms (100);
  g_assert_false (gtk_spinner_get_spinning (sp));
  sw_spinner_set_busy (sp, FALSE);
  gtk_stack_set_visible_child (GTK_STACK (stack), spinner);
  sw_test_spin_ms (100);
  g_assert_false (gtk_spinner_get_spinning (sp));
  gtk_window_destroy (GTK_WINDOW (window));
}

/* ---- main -------------------------------------------------------------- */

/* The optimised steering on demand: the button flies it on a worker thread
 * (the main loop keeps turning), the answer names the saving over the guided
 * law the page shows; a newer edit cancels a run and clears the answer. */
static gboolean
optimised_done (gpointer data)
{
  SwOptimisedSteering *o = data;
  return !sw_optimised_steering_is_running (o) && sw_optimised_steering_get_answer (o)->done;
}

static void
test_optimised_steering (void)
{
  SwWindow *w = window_new ();
  SwOptimisedSteering *o;
  const SwAscentOptimised *ans;
  const SwAnalysis *r;
  g_autofree char *saving = NULL;

  load_demo (w, "small-sat-launcher.stagewright");
  g_assert_true (sw_window_show_page (w, "ascent"));
  o = sw_ascent_page_get_optimised (page (w));
  r = sw_window_get_shown_result (w);
  g_assert_nonnull (r->ascent);
  g_assert_true (gtk_widget_get_sensitive (sw_optimised_steering_get_button (o)));
  g_assert_false (sw_optimised_steering_get_answer (o)->done);

  /* Started, then a newer edit: cancelled, no answer. */
  g_signal_emit_by_name (sw_optimised_steering_get_button (o), "clicked");
  g_assert_true (sw_optimised_steering_is_running (o));
  set_payload (w, r->design->payload_kg + 1.0);
  wait_ascent (w);
  g_assert_false (sw_optimised_steering_is_running (o));
  g_assert_false (sw_optimised_steering_get_answer (o)->done);
  g_assert_null (strstr (sw_optimised_steering_get_text (o), "saves"));

  /* To the end. */
  r = sw_window_get_shown_result (w);
  g_signal_emit_by_name (sw_optimised_steering_get_button (o), "clicked");
  sw_test_wait_until (optimised_done, o, ASCENT_WAIT_MS, "the optimised steering");
  ans = sw_optimised_steering_get_answer (o);
  g_assert_cmpfloat (ans->guided_needed_m_s, ==, r->ascent->delta_v_needed_m_s);
  g_assert_cmpfloat (ans->saving_m_s, >=, -0.05);
  saving = sw_format_speed (MAX (ans->saving_m_s, 0.0));
  if (ans->improved)
    {
      g_autofree char *want = g_strdup_printf ("Optimised steering saves %s over the guided law",
                                               saving);
      g_assert_nonnull (strstr (sw_optimised_steering_get_text (o), want));
    }
  else
    g_assert_nonnull (strstr (sw_optimised_steering_get_text (o), "found no saving"));
  assert_no_nan (sw_optimised_steering_get_text (o));
  sw_test_window_close (w);
}

int
main (int argc, char **argv)
{
  int status;

  tmp_dir = sw_gui_test_env_init (&argc, &argv, "stagewright-ascent-gui-XXXXXX");
  g_object_unref (sw_test_add_app_style ());

  g_test_add_func ("/gui/ascent/not-blocking", test_not_blocking);
  g_test_add_func ("/gui/ascent/newer-edit-cancels", test_newer_edit_cancels);
  g_test_add_func ("/gui/ascent/core-numbers", test_core_numbers);
  g_test_add_func ("/gui/ascent/no-propulsion", test_no_propulsion);
  g_test_add_func ("/gui/ascent/warnings", test_warnings);
  g_test_add_func ("/gui/ascent/optimised-steering", test_optimised_steering);
  g_test_add_func ("/gui/ascent/hidden-page-waits", test_hidden_page_waits);
  g_test_add_func ("/gui/ascent/at-rest", test_at_rest);
  g_test_add_func ("/gui/spinner/turns-while-shown", test_spinner_while_shown);

  status = g_test_run ();
  sw_gui_test_env_finish (tmp_dir);
  return status;
}
