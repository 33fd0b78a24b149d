/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The window stays responsive while the solver thread is busy with a slow
 * solve (the closed-loop ascent of a design with "loss_model": "simulate"),
 * and each newer edit cancels the solve in progress.  Suite 'gui' (Xvfb).
 *
 * The main loop is timed by a 10 ms timeout source.  Of each gap between
 * two firings, the time the kernel kept the main thread waiting for a CPU
 * (/proc/thread-self/schedstat) is left out: on a loaded machine that is
 * the other processes' doing, while a main thread that computes or waits
 * for the worker is ours.
 *
 * 1. While the worker simulates an ascent and the window has nothing to
 *    draw, the timeout fires within 100 ms (the figure).
 * 2. A run of edits, each made just after the worker began the ascent of
 *    the one before (sw_solver_get_ascent_counts): the main loop never
 *    waits as long as an ascent takes (drawing costs what it costs:
 *    bench-gui measures that), every superseded ascent is cancelled part
 *    way, and none is delivered (one that ran to its end would be: it is
 *    newer than the fast result before it).
 * 3. What is shown at the end belongs to the newest edit. */
#include "config.h"

#include "sw-window-private.h"

#include "gui-test-env.h"

#include <glib/gstdio.h>
#include <math.h>
#include <stdio.h>
#include <string.h>
#include <stdlib.h>
#include <unistd.h>

#define MAX_GAP_MS 100.0
#define TICK_MS 10
#define IDLE_EDITS 5
#define CHAINED_EDITS 20
/* From the worker beginning an ascent to the next edit. */
#define INTO_ASCENT_MS 5

static char *tmp_dir;

/* ---- helpers ----------------------------------------------------------- */

static void
wait_ascent (SwWindow *w)
{
  /* The newest edit's last phase (its ascent) is shown and painted. */
  sw_test_wait_until (sw_test_result_complete, w, 120000, "the ascent of the newest edit");
}

static SwNumberField *
payload_spin (SwWindow *w)
{
  return SW_NUMBER_FIELD (sw_inspector_get_field (sw_window_get_inspector (w),
                                                  SW_INSPECTOR_PAYLOAD));
}

/* Nanoseconds this thread has waited on a run queue so far; -1 when the
 * kernel does not say. */
static gint64
runqueue_wait_ns (void)
{
  g_autofree char *text = NULL;
  guint64 cpu, wait;

  if (!g_file_get_contents ("/proc/thread-self/schedstat", &text, NULL, NULL)
      || sscanf (text, "%" G_GUINT64_FORMAT " %" G_GUINT64_FORMAT, &cpu, &wait) != 2)
    return -1;
  return (gint64) wait;
}

/* ---- the main loop's clock --------------------------------------------- */

typedef struct {
  gboolean on;
  gint64   last_tick;           /* 0: the next tick starts a new series */
  gint64   last_wait_ns;
  double   max_gap_ms;          /* wall clock */
  double   max_own_gap_ms;      /* less the time spent waiting for a CPU */
  guint    ticks;
} Clock;

static gboolean
tick_cb (gpointer data)
{
  Clock *c = data;
  gint64 now = g_get_monotonic_time ();
  gint64 wait = runqueue_wait_ns ();

  if (!c->on)
    {
      c->last_tick = 0;
      return G_SOURCE_CONTINUE;
    }
  if (c->last_tick != 0)
    {
      double gap = (now - c->last_tick) / 1000.0;
      double waited = wait >= 0 && c->last_wait_ns >= 0 ? (wait - c->last_wait_ns) / 1e6 : 0.0;
      c->max_gap_ms = MAX (c->max_gap_ms, gap);
      c->max_own_gap_ms = MAX (c->max_own_gap_ms, gap - waited);
      c->ticks++;
    }
  c->last_tick = now;
  c->last_wait_ns = wait;
  return G_SOURCE_CONTINUE;
}

/* ---- 1. a busy worker, an idle window ---------------------------------- */

typedef struct {
  Clock   *clock;
  guint64  serial;
  gboolean arrived;
} Idle;

static void
idle_solved_cb (SwSolver *solver, SwAnalysis *r, Idle *idle)
{
  /* The ascent's own repaint is drawing, not waiting: the clock stops. */
  if (r->serial == idle->serial && r->phase == 2)
    {
      idle->clock->on = FALSE;
      idle->arrived = TRUE;
    }
}

static gboolean
idle_arrived (gpointer data)
{
  return ((Idle *) data)->arrived;
}

/* ---- 2. a run of edits --------------------------------------------------- */

typedef struct {
  SwWindow *w;
  SwSolver *solver;
  Clock     clock;
  guint     edits;
  guint     timer;
  guint64   started_before;     /* ascents begun before the newest edit's */
  gboolean  done;
  guint     fast_results;       /* results delivered during the run, by kind */
  guint     superseded_ascents;
  guint     finished_ascents;   /* ascents that ended before the next edit came */
  guint64   ascent_serial;
} Chain;

static void
chain_edit (Chain *c)
{
  sw_solver_get_ascent_counts (c->solver, &c->started_before, NULL);
  c->edits++;
  sw_number_field_commit_value (payload_spin (c->w), 1500.0 + 0.1 * c->edits);
}

static gboolean
chain_edit_cb (gpointer data)
{
  Chain *c = data;

  c->timer = 0;
  chain_edit (c);
  return G_SOURCE_REMOVE;
}

/* Polls until the worker has begun the newest edit's ascent, then edits
 * again a moment later, while that ascent runs. */
static gboolean
chain_poll_cb (gpointer data)
{
  Chain *c = data;
  guint64 started;

  sw_solver_get_ascent_counts (c->solver, &started, NULL);
  if (started <= c->started_before)
    return G_SOURCE_CONTINUE;
  c->timer = g_timeout_add (INTO_ASCENT_MS, chain_edit_cb, c);
  return G_SOURCE_REMOVE;
}

static void
chain_solved_cb (SwSolver *solver, SwAnalysis *r, Chain *c)
{
  guint64 posted = sw_solver_get_posted_serial (solver);

  if (c->done)
    return;
  if (r->phase == 2)
    {
      if (r->serial < posted)
        {
          c->superseded_ascents++;
          c->ascent_serial = r->serial;
        }
      else
        c->finished_ascents++;
    }
  else if (r->phase == 0 && r->serial == posted && c->timer == 0)
    {
      c->fast_results++;
      if (c->edits >= CHAINED_EDITS)
        {
          c->done = TRUE;
          c->clock.on = FALSE;
          return;
        }
      c->timer = g_timeout_add (1, chain_poll_cb, c);
    }
}

static gboolean
chain_done (gpointer data)
{
  return ((Chain *) data)->done;
}

/* ---- the test ---------------------------------------------------------- */

static void
test_busy_worker (void)
{
  g_autofree char *path = g_build_filename (SOURCE_DESIGNS_DIR,
                                            "three-stage-simulated.stagewright", NULL);
  g_autoptr (GFile) file = g_file_new_for_path (path);
  guint64 started0, cancelled0, started1, cancelled1;
  SwWindow *w = sw_window_new (NULL);
  SwSolver *solver = sw_window_get_solver (w);
  Clock idle_clock = { 0 };
  Chain c = { 0 };
  double fastest = INFINITY, slowest = 0.0, slowest_fast = 0.0, shortest_ascent = INFINITY;
  double latency_ms;
  gint64 t0;
  guint tick_id;
  gulong handler;
  SwAnalysis *shown;

  gtk_window_present (GTK_WINDOW (w));
  g_assert_true (sw_window_load (w, file));
  wait_ascent (w);
  g_assert_cmpint (sw_document_get_design (sw_window_get_document (w))->mission.loss_model,
                   ==, SW_LOSS_SIMULATE);
  g_assert_nonnull (sw_window_get_shown_result (w)->ascent);
  if (runqueue_wait_ns () < 0)
    g_test_message ("no /proc/thread-self/schedstat: the gaps are wall clock only");

  /* 1. Single edits: from the painted fast part to the ascent, the window
   *    has nothing to do but the worker is busy. */
  tick_id = g_timeout_add (TICK_MS, tick_cb, &idle_clock);
  for (int k = 0; k < IDLE_EDITS; k++)
    {
      Idle idle = { &idle_clock, 0, FALSE };
      double ms, fast_ms;

      handler = g_signal_connect (solver, "solved", G_CALLBACK (idle_solved_cb), &idle);
      t0 = g_get_monotonic_time ();
      sw_number_field_commit_value (payload_spin (w), 1490.0 + k);
      idle.serial = sw_solver_get_posted_serial (solver);
      sw_test_wait_until (sw_test_result_drawn, w, 60000, "the fast part of the edit");
      fast_ms = (g_get_monotonic_time () - t0) / 1000.0;
      if (!sw_window_get_shown_result (w)->ascent_pending)
        g_error ("the edit's ascent came with its first result: no slow solve to test");
      idle_clock.on = TRUE;
      sw_test_wait_until (idle_arrived, &idle, 120000, "the ascent");
      ms = (g_get_monotonic_time () - t0) / 1000.0;
      fastest = MIN (fastest, ms);
      slowest = MAX (slowest, ms);
      slowest_fast = MAX (slowest_fast, fast_ms);
      shortest_ascent = MIN (shortest_ascent, ms - fast_ms);
      g_signal_handler_disconnect (solver, handler);
      wait_ascent (w);
    }
  g_source_remove (tick_id);
  g_test_message ("%d single edits, edit to fast part drawn: up to %.0f ms, edit to ascent: "
                  "%.0f to %.0f ms; while the worker simulated, the main loop: %u ticks, "
                  "largest gap %.1f ms, %.1f ms of it not waiting for a CPU", IDLE_EDITS,
                  slowest_fast, fastest, slowest, idle_clock.ticks, idle_clock.max_gap_ms,
                  idle_clock.max_own_gap_ms);
  /* The fast part is drawn while the ascent is still on its way, and the
   * ascent outlasts the pause before the next edit below. */
  /* That the fast part came first is checked above (ascent_pending); how
   * long after it the ascent came depends on the machine's load, so it is
   * reported, not asserted (timing belongs in bench-gui). */
  if (shortest_ascent <= 4 * INTO_ASCENT_MS)
    g_test_message ("the ascent arrived only %.1f ms after the fast part was drawn: the "
                    "chained edits below may find little to cancel", shortest_ascent);

  /* 2. A run of edits. */
  c.w = w;
  c.solver = solver;
  c.clock.on = TRUE;
  sw_solver_get_ascent_counts (solver, &started0, &cancelled0);
  handler = g_signal_connect (solver, "solved", G_CALLBACK (chain_solved_cb), &c);
  tick_id = g_timeout_add (TICK_MS, tick_cb, &c.clock);
  t0 = g_get_monotonic_time ();
  chain_edit (&c);
  sw_test_wait_until (chain_done, &c, 300000, "the end of the edits");
  g_source_remove (tick_id);
  t0 = g_get_monotonic_time ();
  wait_ascent (w);
  latency_ms = (g_get_monotonic_time () - t0) / 1000.0;
  g_signal_handler_disconnect (solver, handler);
  sw_solver_get_ascent_counts (solver, &started1, &cancelled1);
  g_test_message ("%u edits, each %d ms into the ascent of the one before; main loop: %u "
                  "ticks, largest gap %.1f ms, %.1f ms of it not waiting for a CPU; ascents: "
                  "%" G_GUINT64_FORMAT " begun, %" G_GUINT64_FORMAT " cancelled part way, "
                  "%u superseded delivered, %u ended before the next edit; last edit's fast "
                  "part to its ascent shown: %.0f ms", c.edits, INTO_ASCENT_MS, c.clock.ticks,
                  c.clock.max_gap_ms, c.clock.max_own_gap_ms, started1 - started0,
                  cancelled1 - cancelled0, c.superseded_ascents, c.finished_ascents,
                  latency_ms);

  g_assert_cmpuint (c.edits, ==, CHAINED_EDITS);
  g_assert_cmpuint (c.fast_results, ==, CHAINED_EDITS);
  /* Every edit's ascent was begun; all but the last's were cancelled by the
   * next edit, except any that ended in the few milliseconds before it. */
  g_assert_cmpuint (started1 - started0, ==, CHAINED_EDITS);
  g_assert_cmpuint (cancelled1 - cancelled0 + c.finished_ascents + c.superseded_ascents, ==,
                    CHAINED_EDITS - 1);
  /* The main loop never waited as long as an ascent takes ... */
  if (c.clock.max_own_gap_ms >= fastest)
    g_error ("the main loop stalled for %.1f ms during the edits, as long as an ascent takes",
             c.clock.max_own_gap_ms);
  /* ... and no superseded ascent ran to its end.  (An ascent may end in the
   * milliseconds before the next edit only now and then, or there would be
   * nothing to cancel.) */
  g_assert_cmpuint (c.finished_ascents, <=, CHAINED_EDITS / 4);
  if (c.superseded_ascents > 0)
    g_error ("%u superseded ascent(s) were delivered (last of serial %" G_GUINT64_FORMAT "): "
             "a newer edit did not cancel the solve in progress", c.superseded_ascents,
             c.ascent_serial);

  /* 3. What is shown at the end belongs to the newest edit. */
  shown = sw_window_get_shown_result (w);
  g_assert_cmpuint (shown->serial, ==, sw_solver_get_posted_serial (solver));
  g_assert_true (sw_design_equal (shown->design,
                                  sw_document_get_design (sw_window_get_document (w))));
  g_assert_cmpfloat (shown->design->payload_kg, ==, 1500.0 + 0.1 * c.edits);
  g_assert_nonnull (shown->ascent);

  sw_test_window_close (w);
}

/* The nice values of this process's main thread and of its thread named
 * "sw-solver" (G_MININT when not found), from /proc. */
static void
read_nice (int *own_nice, int *solver_nice)
{
  g_autoptr (GDir) dir = g_dir_open ("/proc/self/task", 0, NULL);
  const char *tid;

  *own_nice = *solver_nice = G_MININT;
  while (dir != NULL && (tid = g_dir_read_name (dir)) != NULL)
    {
      g_autofree char *comm_path = g_build_filename ("/proc/self/task", tid, "comm", NULL);
      g_autofree char *stat_path = g_build_filename ("/proc/self/task", tid, "stat", NULL);
      g_autofree char *comm = NULL, *stat = NULL;
      g_auto (GStrv) fields = NULL;
      const char *after;
      int nice;

      if (!g_file_get_contents (comm_path, &comm, NULL, NULL)
          || !g_file_get_contents (stat_path, &stat, NULL, NULL))
        continue;
      /* After the command in parentheses: state is field 3, nice field 19. */
      after = strrchr (stat, ')');
      g_assert_nonnull (after);
      fields = g_strsplit (after + 2, " ", -1);
      g_assert_cmpuint (g_strv_length (fields), >, 16);
      nice = atoi (fields[16]);
      if (g_str_has_prefix (comm, "sw-solver"))
        *solver_nice = nice;
      else if (g_ascii_strtoll (tid, NULL, 10) == getpid ())
        *own_nice = nice;
    }
}

/* The solver's thread runs below the window's priority (a nice value 5
 * higher, on Linux), so that a frame and the display server showing it
 * come before the background work on a busy machine. */
static void
test_solver_priority (void)
{
#ifdef __linux__
  g_autoptr (SwSolver) solver = sw_solver_new ();
  int own_nice, solver_nice, want;

  /* The thread lowers its own priority as it starts. */
  for (int i = 0; i < 200; i++)
    {
      read_nice (&own_nice, &solver_nice);
      want = MIN (own_nice + 5, 19);
      if (solver_nice == want)
        break;
      g_usleep (10000);
    }
  g_test_message ("main thread nice %d, solver thread nice %d", own_nice, solver_nice);
  g_assert_cmpint (own_nice, !=, G_MININT);
  g_assert_cmpint (solver_nice, ==, want);
#else
  g_test_skip ("per-thread priorities are Linux's");
#endif
}

/* ---- main -------------------------------------------------------------- */

int
main (int argc, char **argv)
{
  int status;

  tmp_dir = sw_gui_test_env_init (&argc, &argv, "stagewright-busy-XXXXXX");

  g_test_add_func ("/gui/solver/busy-worker", test_busy_worker);
  g_test_add_func ("/gui/solver/priority", test_solver_priority);

  status = g_test_run ();
  sw_gui_test_env_finish (tmp_dir);
  return status;
}
