/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bench-gui: the latency from a changed field to the frame that shows the
 * new sizing, over 200 scripted edits of the main window (after 8 warm-up
 * edits, reported apart), the layout and paint of that frame on the main
 * thread (wall and CPU time, the CPU time split into layout, recording the
 * drawings and rasterising), and the resident memory of the running
 * application over 10,000 further edits (set SW_BENCH_MEMORY_EDITS for
 * another count; SW_BENCH_TRACE=1 prints every timed edit).  A benchmark,
 * not a test:
 *     ninja -C BUILD bench-gui
 * (runs it under xvfb-run with the cairo renderer). */
#include "config.h"

#include "sw-application.h"
#include "sw-window-private.h"

#include <glib/gstdio.h>
#include <gsl/gsl_sort.h>
#include <gsl/gsl_statistics_double.h>
#include <math.h>
#include <stdio.h>
#include <string.h>
#include <time.h>

#define N_EDITS 200
/* Edits before the timed ones, two of each kind: the first edit of a kind
 * pays once for what the window builds or measures the first time (the
 * title's unsaved mark, the other stage's fields, the manual split's
 * controls, glyphs not yet cached).  Counted among the 200 they are the
 * 99th percentile; they are timed and reported apart. */
#define N_WARMUP 8

static gboolean
flag_cb (gpointer data)
{
  *(gboolean *) data = TRUE;
  return G_SOURCE_REMOVE;
}

static void
spin_for (guint ms)
{
  gboolean done = FALSE;

  g_timeout_add (ms, flag_cb, &done);
  while (!done)
    g_main_context_iteration (NULL, TRUE);
}

/* Runs the main loop until the newest edit has been painted; FALSE after 5 s. */
static gboolean
wait_drawn (SwWindow *w)
{
  gboolean timed_out = FALSE;
  guint id = g_timeout_add (5000, flag_cb, &timed_out);
  guint64 posted = sw_solver_get_posted_serial (sw_window_get_solver (w));

  while (sw_window_get_drawn_serial (w) < posted && !timed_out)
    g_main_context_iteration (NULL, TRUE);
  if (!timed_out)
    g_source_remove (id);
  return !timed_out;
}

typedef struct {
  guint64 serial;
  gint64  drawn_us;
  gint64  solved_us;     /* after the window's views took the result */
  gint64  frame_us;      /* the start of the first frame after that */
  gint64  frame_cpu_us;  /* the main thread's CPU time then ... */
  gint64  drawn_cpu_us;  /* ... and once drawn: the frame's own work */
  /* The same frame's main-thread CPU time by phase (sums over the frame,
   * since GTK may lay out more than once per frame): before painting
   * (update, styles, measuring and allocating), recording the widgets'
   * drawings (snapshot), and rasterising and showing them (render). */
  gboolean in_frame;
  gint64  mark_cpu_us;
  gint64  layout_cpu_us;
  gint64  snapshot_cpu_us;
  gint64  render_cpu_us;
  guint   n_frames;      /* frames painted so far */
  guint   drawn_frames;  /* n_frames when the newest result was drawn */
} Drawn;

static Drawn *the_drawn;   /* for the hooks below, which take no data */

/* CPU time of the calling thread: what the frame costs, whatever else the
 * machine is doing (wall times on a busy machine include waiting). */
static gint64
thread_cpu_us (void)
{
  struct timespec ts;

  clock_gettime (CLOCK_THREAD_CPUTIME_ID, &ts);
  return (gint64) ts.tv_sec * G_USEC_PER_SEC + ts.tv_nsec / 1000;
}

static void
before_paint_cb (GdkFrameClock *clock, Drawn *drawn)
{
  drawn->n_frames++;
  if (drawn->frame_us < drawn->solved_us)
    {
      drawn->frame_us = g_get_monotonic_time ();
      drawn->frame_cpu_us = thread_cpu_us ();
      drawn->in_frame = TRUE;
      drawn->mark_cpu_us = drawn->frame_cpu_us;
      drawn->layout_cpu_us = drawn->snapshot_cpu_us = drawn->render_cpu_us = 0;
    }
}

/* Adds the CPU time since the last mark to @phase and moves the mark. */
static void
phase_mark (gint64 *phase)
{
  gint64 now;

  if (!the_drawn->in_frame)
    return;
  now = thread_cpu_us ();
  if (phase != NULL)
    *phase += now - the_drawn->mark_cpu_us;
  the_drawn->mark_cpu_us = now;
}

/* Runs before every handler of the frame clock's "paint": the end of the
 * frame's layout. */
static gboolean
paint_hook (GSignalInvocationHint *hint, guint n, const GValue *values, gpointer data)
{
  phase_mark (&the_drawn->layout_cpu_us);
  return TRUE;
}

/* The window's own snapshot (the whole widget tree): wrapped to time it. */
static void (*window_snapshot) (GtkWidget *widget, GtkSnapshot *snapshot);

static void
timed_snapshot (GtkWidget *widget, GtkSnapshot *snapshot)
{
  phase_mark (NULL);
  window_snapshot (widget, snapshot);
  phase_mark (&the_drawn->snapshot_cpu_us);
}

/* After every handler of "paint": the rasterising is done. */
static void
paint_done_cb (GdkFrameClock *clock, Drawn *drawn)
{
  phase_mark (&drawn->render_cpu_us);
}

static guint n_solved_trace;   /* results taken since the edit (SW_BENCH_TRACE) */

static void
solved_cb (SwSolver *solver, SwAnalysis *result, Drawn *drawn)
{
  drawn->solved_us = g_get_monotonic_time ();
  n_solved_trace++;
}

static void
result_drawn_cb (SwWindow *w, guint64 serial, Drawn *drawn)
{
  drawn->serial = serial;
  drawn->drawn_us = g_get_monotonic_time ();
  drawn->drawn_cpu_us = thread_cpu_us ();
  drawn->drawn_frames = drawn->n_frames;
  drawn->in_frame = FALSE;
}

/* One scripted edit of the inspector's fields, @i picking which. */
static void
scripted_edit (SwInspector *insp, guint i)
{
  SwNumberField *spin;
  double value;

  switch (i % 4)
    {
    case 0:
      sw_inspector_set_selected (insp, 0);
      spin = SW_NUMBER_FIELD (sw_inspector_get_field (insp, SW_INSPECTOR_ISP_VAC));
      value = 320.0 + (i % 40);
      break;
    case 1:
      sw_inspector_set_selected (insp, 1);
      spin = SW_NUMBER_FIELD (sw_inspector_get_field (insp, SW_INSPECTOR_EPS));
      value = 0.08 + 0.001 * (i % 40);
      break;
    case 2:
      spin = SW_NUMBER_FIELD (sw_inspector_get_field (insp, SW_INSPECTOR_PAYLOAD));
      value = 6000.0 + 50.0 * (i % 40);
      break;
    default:
      sw_inspector_set_selected (insp, 0);
      spin = SW_NUMBER_FIELD (sw_inspector_get_field (insp, SW_INSPECTOR_SHARE));
      value = 35.0 + (i % 20);
      break;
    }
  sw_number_field_commit_value (spin, value);
}

/* The machine's CPU time so far (all CPUs, in clock ticks) and the part of
 * it a virtual machine's host took for other guests ("steal"): on a
 * shared host the figures below move with it.  FALSE where /proc/stat
 * cannot be read. */
static gboolean
machine_ticks (guint64 *total, guint64 *steal)
{
  g_autofree char *stat = NULL;
  g_auto (GStrv) fields = NULL;
  guint n;

  *total = *steal = 0;
  if (!g_file_get_contents ("/proc/stat", &stat, NULL, NULL) || !g_str_has_prefix (stat, "cpu "))
    return FALSE;
  *strchr (stat, '\n') = '\0';
  fields = g_strsplit_set (stat + 4, " ", -1);
  n = 0;
  for (guint i = 0; fields[i] != NULL; i++)
    {
      guint64 v;
      if (fields[i][0] == '\0')
        continue;
      v = g_ascii_strtoull (fields[i], NULL, 10);
      /* user nice system idle iowait irq softirq steal (guest time is
       * already in user) */
      if (n < 8)
        *total += v;
      if (n == 7)
        *steal = v;
      n++;
    }
  return n >= 8;
}

static double
resident_mb (void)
{
  g_autofree char *status = NULL;
  const char *line;

  if (!g_file_get_contents ("/proc/self/status", &status, NULL, NULL))
    return -1.0;
  line = strstr (status, "VmRSS:");
  return line != NULL ? g_ascii_strtod (line + 6, NULL) / 1024.0 : -1.0;
}

int
main (int argc, char **argv)
{
  g_autofree char *tmp = g_dir_make_tmp ("stagewright-bench-XXXXXX", NULL);
  g_autofree char *demo = NULL;
  g_autoptr (GFile) file = NULL;
  g_autoptr (GtkCssProvider) css = NULL;
  SwWindow *w;
  SwInspector *insp;
  Drawn drawn = { 0 };
  double latency[N_EDITS], to_views[N_EDITS], to_frame[N_EDITS], in_frame[N_EDITS];
  double frame_cpu[N_EDITS], layout_cpu[N_EDITS], snapshot_cpu[N_EDITS], render_cpu[N_EDITS];
  double median, p99, rss;
  guint frames_total = 0, frames_max = 0;
  guint64 ticks0 = 0, steal0 = 0, ticks1 = 0, steal1 = 0;
  gboolean have_ticks;

  g_setenv ("XDG_STATE_HOME", tmp, TRUE);
  g_setenv ("XDG_DATA_HOME", tmp, TRUE);
  g_setenv ("GSETTINGS_BACKEND", "memory", TRUE);
  gtk_init ();
  css = sw_application_add_style (gdk_display_get_default ());

  the_drawn = &drawn;
  {
    GtkWidgetClass *klass = g_type_class_ref (SW_TYPE_WINDOW);
    window_snapshot = klass->snapshot;
    klass->snapshot = timed_snapshot;
  }
  w = sw_window_new (NULL);
  sw_window_set_ephemeral (w);
  gtk_window_set_default_size (GTK_WINDOW (w), 1280, 800);
  demo = sw_application_find_design ("medium-cargo.stagewright");
  file = g_file_new_for_path (demo);
  if (!sw_window_load_template (w, file))
    {
      g_printerr ("bench-gui: cannot open %s\n", demo);
      return 1;
    }
  g_signal_connect (w, "result-drawn", G_CALLBACK (result_drawn_cb), &drawn);
  /* Connected after the window's own handler, so it runs once the views
   * have the result. */
  g_signal_connect (sw_window_get_solver (w), "solved", G_CALLBACK (solved_cb), &drawn);
  gtk_window_present (GTK_WINDOW (w));
  if (!wait_drawn (w))
    {
      g_printerr ("bench-gui: the first sizing was never drawn\n");
      return 1;
    }
  spin_for (200);
  g_signal_connect (gtk_widget_get_frame_clock (GTK_WIDGET (w)), "before-paint",
                    G_CALLBACK (before_paint_cb), &drawn);
  g_signal_add_emission_hook (g_signal_lookup ("paint", GDK_TYPE_FRAME_CLOCK), 0, paint_hook,
                              NULL, NULL);
  g_signal_connect_after (gtk_widget_get_frame_clock (GTK_WIDGET (w)), "paint",
                          G_CALLBACK (paint_done_cb), &drawn);
  insp = sw_window_get_inspector (w);

  {
    double warm_cpu_max = 0.0, warm_latency_max = 0.0;

    for (guint k = 0; k < N_WARMUP; k++)
      {
        gint64 t0;

        spin_for ((k * 7) % 33);
        t0 = g_get_monotonic_time ();
        /* Other values than the timed edits', the same kinds. */
        scripted_edit (insp, 1020 + k);
        if (!wait_drawn (w))
          {
            g_printerr ("bench-gui: warm-up edit %u was never drawn\n", k);
            return 1;
          }
        warm_latency_max = MAX (warm_latency_max, (drawn.drawn_us - t0) / 1000.0);
        warm_cpu_max = MAX (warm_cpu_max, (drawn.drawn_cpu_us - drawn.frame_cpu_us) / 1000.0);
      }
    printf ("Warm-up, %d first edits (not counted below): highest edit to drawn frame %.1f ms, "
            "highest CPU time for layout and paint %.1f ms\n",
            N_WARMUP, warm_latency_max, warm_cpu_max);
  }

  have_ticks = machine_ticks (&ticks0, &steal0);
  for (guint i = 0; i < N_EDITS; i++)
    {
      gint64 t0;
      guint64 serial;
      guint frames0;

      /* Edits arrive at every phase of the frame cycle, as a user's would:
       * a deterministic sweep of 0..32 ms between the last frame and the edit. */
      spin_for ((i * 7) % 33);
      n_solved_trace = 0;
      frames0 = drawn.n_frames;
      t0 = g_get_monotonic_time ();
      scripted_edit (insp, i);
      serial = sw_solver_get_posted_serial (sw_window_get_solver (w));
      if (!wait_drawn (w) || drawn.serial < serial)
        {
          g_printerr ("bench-gui: edit %u was never drawn\n", i);
          return 1;
        }
      latency[i] = (drawn.drawn_us - t0) / 1000.0;
      /* Frames painted from the edit up to the one showing its result. */
      frames_total += drawn.drawn_frames - frames0;
      frames_max = MAX (frames_max, drawn.drawn_frames - frames0);
      to_views[i] = (drawn.solved_us - t0) / 1000.0;
      to_frame[i] = (drawn.frame_us - drawn.solved_us) / 1000.0;
      in_frame[i] = (drawn.drawn_us - drawn.frame_us) / 1000.0;
      frame_cpu[i] = (drawn.drawn_cpu_us - drawn.frame_cpu_us) / 1000.0;
      layout_cpu[i] = drawn.layout_cpu_us / 1000.0;
      snapshot_cpu[i] = drawn.snapshot_cpu_us / 1000.0;
      render_cpu[i] = drawn.render_cpu_us / 1000.0;
      if (g_getenv ("SW_BENCH_TRACE") != NULL)
        printf ("trace %u frames %u solved %u kind %u latency %.1f views %.1f wait %.1f frame %.1f cpu %.1f layout %.1f snapshot %.1f render %.1f\n",
                i, drawn.drawn_frames - frames0, n_solved_trace, i % 4, latency[i], to_views[i], to_frame[i], in_frame[i], frame_cpu[i], layout_cpu[i], snapshot_cpu[i], render_cpu[i]);
    }
  rss = resident_mb ();
  have_ticks = have_ticks && machine_ticks (&ticks1, &steal1) && ticks1 > ticks0;

  gsl_sort (latency, 1, N_EDITS);
  median = gsl_stats_median_from_sorted_data (latency, 1, N_EDITS);
  p99 = gsl_stats_quantile_from_sorted_data (latency, 1, N_EDITS, 0.99);
  printf ("GUI latency, changed field to drawn frame, %d edits: median %.1f ms, "
          "99th percentile %.1f ms, max %.1f ms (target: median <= 16 ms)\n",
          N_EDITS, median, p99, latency[N_EDITS - 1]);
  gsl_sort (to_views, 1, N_EDITS);
  gsl_sort (to_frame, 1, N_EDITS);
  gsl_sort (in_frame, 1, N_EDITS);
  printf ("  medians of the parts: edit, solve on the worker and views updated %.1f ms; "
          "waiting for the frame clock %.1f ms; layout and paint %.1f ms\n",
          gsl_stats_median_from_sorted_data (to_views, 1, N_EDITS),
          gsl_stats_median_from_sorted_data (to_frame, 1, N_EDITS),
          gsl_stats_median_from_sorted_data (in_frame, 1, N_EDITS));
  printf ("  frames painted from the edit to the one with its result: mean %.2f, max %u\n",
          (double) frames_total / N_EDITS, frames_max);
  printf ("  99th percentiles: layout and paint %.1f ms (target <= 8 ms); "
          "edit to drawn frame %.1f ms (target <= 25 ms)\n",
          gsl_stats_quantile_from_sorted_data (in_frame, 1, N_EDITS, 0.99), p99);
  gsl_sort (frame_cpu, 1, N_EDITS);
  printf ("  main thread's CPU time for layout and paint: median %.1f ms, 99th percentile "
          "%.1f ms\n", gsl_stats_median_from_sorted_data (frame_cpu, 1, N_EDITS),
          gsl_stats_quantile_from_sorted_data (frame_cpu, 1, N_EDITS, 0.99));
  gsl_sort (layout_cpu, 1, N_EDITS);
  gsl_sort (snapshot_cpu, 1, N_EDITS);
  gsl_sort (render_cpu, 1, N_EDITS);
  printf ("    of which (median / 99th percentile): styles, measuring and allocating %.1f / %.1f ms; "
          "recording the drawings %.1f / %.1f ms; rasterising and showing %.1f / %.1f ms\n",
          gsl_stats_median_from_sorted_data (layout_cpu, 1, N_EDITS),
          gsl_stats_quantile_from_sorted_data (layout_cpu, 1, N_EDITS, 0.99),
          gsl_stats_median_from_sorted_data (snapshot_cpu, 1, N_EDITS),
          gsl_stats_quantile_from_sorted_data (snapshot_cpu, 1, N_EDITS, 0.99),
          gsl_stats_median_from_sorted_data (render_cpu, 1, N_EDITS),
          gsl_stats_quantile_from_sorted_data (render_cpu, 1, N_EDITS, 0.99));
  if (have_ticks)
    printf ("  the machine's CPU time taken by its host for others (steal) during the timed edits: "
            "%.0f %% (figures on a busy host are not comparable)\n",
            100.0 * (double) (steal1 - steal0) / (double) (ticks1 - ticks0));
  /* The raster images keep freed pages for the next ones while edits come
   * (sw-raster.c) and give them back after 2 s at rest: both figures are
   * given, and memory over many edits compares the window at rest. */
  spin_for (2500);
  printf ("Resident memory of the running application: %.1f MB right after the edits, "
          "%.1f MB at rest 2.5 s later (target <= 120 MB)\n", rss, resident_mb ());

  /* Memory over many edits: each one solved and drawn before the next. */
  {
    const char *env = g_getenv ("SW_BENCH_MEMORY_EDITS");
    guint n = env != NULL ? (guint) g_ascii_strtoull (env, NULL, 10) : 10000;
    double rss0 = resident_mb (), rss_max = rss0, rss_1k = NAN, rss_end;

    for (guint i = 0; i < n; i++)
      {
        scripted_edit (insp, N_EDITS + i);
        if (!wait_drawn (w))
          {
            g_printerr ("bench-gui: memory edit %u was never drawn\n", i);
            return 1;
          }
        if ((i + 1) % 500 == 0)
          {
            double r = resident_mb ();
            rss_max = MAX (rss_max, r);
            if (i + 1 == 1000)
              rss_1k = r;
          }
      }
    rss_end = resident_mb ();
    spin_for (2500);
    rss = resident_mb ();
    /* The figure after 1,000 only when there were as many (no "nan"). */
    {
      g_autofree char *at_1k = isnan (rss_1k) ? g_strdup ("")
                                              : g_strdup_printf ("%.1f MB after 1,000 (editing), ", rss_1k);
      printf ("Resident memory over %u more edits, at rest before and after: %.1f MB before, "
              "%s%.1f MB at the end (editing), %.1f MB at rest "
              "(%+.1f MB; highest while editing %.1f MB; target flat within 5 MB)\n",
              n, rss0, at_1k, rss_end, rss, rss - rss0, MAX (rss_max, rss_end));
    }
  }

  gtk_window_destroy (GTK_WINDOW (w));
  g_remove (tmp);
  return 0;
}
