/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-solver"

#include "config.h"

#include "sw-solver.h"

#ifdef __linux__
#include <errno.h>
#include <sys/resource.h>
#include <sys/syscall.h>
#include <unistd.h>
#endif

/* The Monte Carlo starts only after this long without a newer request: it
 * cannot be interrupted, and a drag must not wait for it. */
#define MONTECARLO_DELAY_MS 150
/* The same for the ascent, which a newer request does cancel (see
 * solve_ascent). */
#define ASCENT_DELAY_MS 60
/* How much lower than the window's the solver's priority is (a nice value). */
#define SOLVER_NICE 5

/* State shared by the object and its thread.  The thread never touches the
 * GObject: it reaches the owner only through a weak reference, and only on
 * the owner's main context. */
typedef struct {
  GMutex        mutex;
  GCond         cond;
  gboolean      quit;
  SwDesign     *pending;            /* newest request not yet started, or NULL */
  guint64       pending_serial;
  GCancellable *pending_cancellable;
  GCancellable *running;            /* cancellable of the request being solved */
  SwAnalysisOptions options;           /* settings for the next request */
  guint64       dropped;
  guint64       ascents_started;
  guint64       ascents_cancelled;  /* started, then abandoned for a newer request */
  GWeakRef      owner;
  GMainContext *context;
} Shared;

struct _SwSolver {
  GObject   parent_instance;
  Shared   *shared;
  GThread  *thread;
  guint64   serial;                 /* last posted */
  guint64   shown;                  /* rank of the last result emitted (result_rank) */
  SwAnalysis *result;
};

G_DEFINE_FINAL_TYPE (SwSolver, sw_solver, G_TYPE_OBJECT)

enum { SOLVED, N_SIGNALS };
static guint signals[N_SIGNALS];

static void
shared_free (gpointer data)
{
  Shared *sh = data;

  g_mutex_clear (&sh->mutex);
  g_cond_clear (&sh->cond);
  sw_design_free (sh->pending);
  g_clear_object (&sh->pending_cancellable);
  g_clear_object (&sh->running);
  g_weak_ref_clear (&sh->owner);
  g_main_context_unref (sh->context);
}

static Shared *
shared_ref (Shared *sh)
{
  return g_atomic_rc_box_acquire (sh);
}

static void
shared_unref (Shared *sh)
{
  g_atomic_rc_box_release_full (sh, shared_free);
}

typedef struct {
  Shared   *shared;
  SwAnalysis *result;
} Delivery;

static void
delivery_free (gpointer data)
{
  Delivery *d = data;

  shared_unref (d->shared);
  g_clear_pointer (&d->result, sw_analysis_unref);
  g_free (d);
}

/* Results in the order they may be shown: by serial, and within one serial
 * by phase: the fast one, the Monte Carlo, the ascent. */
static guint64
result_rank (const SwAnalysis *r)
{
  return 4 * r->serial + r->phase;
}

/* Main loop: hand the result to the owner if it still exists and the
 * result is newer than what it shows. */
static gboolean
deliver_cb (gpointer data)
{
  Delivery *d = data;
  g_autoptr (SwSolver) self = g_weak_ref_get (&d->shared->owner);

  if (self == NULL || result_rank (d->result) <= self->shown)
    return G_SOURCE_REMOVE;
  /* A slow phase (Monte Carlo, ascent) of an edit that a newer one has
   * already replaced would show stale figures until the newer edit's own
   * arrives: drop it.  Fast results are always shown. */
  if (d->result->phase > 0 && d->result->serial < self->serial)
    {
      if (d->result->phase == 2)
        {
          g_mutex_lock (&d->shared->mutex);
          d->shared->ascents_cancelled++;
          g_mutex_unlock (&d->shared->mutex);
        }
      return G_SOURCE_REMOVE;
    }
  self->shown = result_rank (d->result);
  g_clear_pointer (&self->result, sw_analysis_unref);
  self->result = sw_analysis_ref (d->result);
  g_signal_emit (self, signals[SOLVED], 0, d->result);
  return G_SOURCE_REMOVE;
}

/* An idle source on the owner's context, never g_main_context_invoke():
 * that would run the callback right here in the worker whenever the worker
 * can acquire the default context.  Takes @result. */
static void
deliver (Shared *sh, SwAnalysis *result)
{
  Delivery *d = g_new0 (Delivery, 1);
  GSource *source;

  d->shared = shared_ref (sh);
  d->result = result;
  source = g_idle_source_new ();
  g_source_set_priority (source, G_PRIORITY_DEFAULT);
  g_source_set_callback (source, deliver_cb, d, delivery_free);
  g_source_set_static_name (source, "[stagewright] solver result");
  g_source_attach (source, sh->context);
  g_source_unref (source);
}

/* The Monte Carlo phase, once no newer request has come for a moment.
 * Returns the new result (delivered, and a reference for the caller) or
 * NULL when superseded or cancelled. */
static SwAnalysis *
solve_montecarlo (Shared *sh, SwAnalysis *fast, GCancellable *cancellable)
{
  SwAnalysis *result;
  gboolean superseded;
  gint64 until = g_get_monotonic_time () + MONTECARLO_DELAY_MS * G_TIME_SPAN_MILLISECOND;

  g_mutex_lock (&sh->mutex);
  while (sh->pending == NULL && !sh->quit && g_cond_wait_until (&sh->cond, &sh->mutex, until))
    ;
  superseded = sh->pending != NULL || sh->quit;
  g_mutex_unlock (&sh->mutex);
  if (superseded || g_cancellable_is_cancelled (cancellable))
    return NULL;
  result = sw_analysis_add_montecarlo (fast, cancellable);
  if (result != NULL)
    deliver (sh, sw_analysis_ref (result));
  return result;
}

/* The second phase: the ascent, once no newer request has come for a
 * moment.  The core checks the cancellable only every few trajectories, so
 * an ascent started between the edits of a drag would delay the next
 * sizing by milliseconds; waiting keeps the worker free for it. */
static void
solve_ascent (Shared *sh, SwAnalysis *fast, GCancellable *cancellable)
{
  SwAnalysis *result;
  gboolean superseded;
  gint64 until = g_get_monotonic_time () + ASCENT_DELAY_MS * G_TIME_SPAN_MILLISECOND;

  g_mutex_lock (&sh->mutex);
  while (sh->pending == NULL && !sh->quit && g_cond_wait_until (&sh->cond, &sh->mutex, until))
    ;
  superseded = sh->pending != NULL || sh->quit;
  g_mutex_unlock (&sh->mutex);
  if (superseded || g_cancellable_is_cancelled (cancellable))
    return;
  g_mutex_lock (&sh->mutex);
  sh->ascents_started++;
  g_mutex_unlock (&sh->mutex);
  result = sw_analysis_add_ascent (fast, cancellable);
  /* An ascent that ended just as a newer edit came is stale: drop it, as if
   * the cancellation had caught it. */
  g_mutex_lock (&sh->mutex);
  superseded = sh->pending != NULL || sh->quit;
  g_mutex_unlock (&sh->mutex);
  if (superseded)
    g_clear_pointer (&result, sw_analysis_unref);
  if (result != NULL)
    deliver (sh, result);
  else
    {
      g_mutex_lock (&sh->mutex);
      sh->ascents_cancelled++;
      g_mutex_unlock (&sh->mutex);
    }
}

/* The solver works in the background: a frame being drawn, and the display
 * server showing it, come first.  On Linux a thread has its own nice value,
 * and the threads it starts (the Monte Carlo's) inherit it. */
static void
lower_priority (void)
{
#ifdef __linux__
  if (setpriority (PRIO_PROCESS, (id_t) syscall (SYS_gettid), SOLVER_NICE) != 0)
    g_debug ("the solver keeps its priority: %s", g_strerror (errno));
#endif
}

static gpointer
worker_thread (gpointer data)
{
  Shared *sh = data;

  lower_priority ();

  for (;;)
    {
      g_autoptr (SwDesign) design = NULL;
      g_autoptr (GCancellable) cancellable = NULL;
      g_autoptr (SwAnalysis) result = NULL;
      SwAnalysisOptions options;
      guint64 serial;

      g_mutex_lock (&sh->mutex);
      while (!sh->quit && sh->pending == NULL)
        g_cond_wait (&sh->cond, &sh->mutex);
      if (sh->quit)
        {
          g_mutex_unlock (&sh->mutex);
          break;
        }
      design = g_steal_pointer (&sh->pending);
      serial = sh->pending_serial;
      cancellable = g_steal_pointer (&sh->pending_cancellable);
      options = sh->options;
      g_set_object (&sh->running, cancellable);
      g_mutex_unlock (&sh->mutex);

      result = sw_analysis_new (design, serial, &options, cancellable);
      /* The sizing first, within the frame; then the ascent, which a newer
       * request cancels through the same cancellable. */
      if (result != NULL)
        {
          deliver (sh, sw_analysis_ref (result));
          if (result->montecarlo_pending)
            {
              SwAnalysis *mc = solve_montecarlo (sh, result, cancellable);
              /* The ascent copies the newest result, so it keeps the Monte Carlo. */
              if (mc != NULL)
                {
                  sw_analysis_unref (result);
                  result = mc;
                }
            }
          if (result->ascent_pending)
            solve_ascent (sh, result, cancellable);
        }

      g_mutex_lock (&sh->mutex);
      g_clear_object (&sh->running);
      g_mutex_unlock (&sh->mutex);
    }
  shared_unref (sh);
  return NULL;
}

guint64
sw_solver_post (SwSolver *self, const SwDesign *design)
{
  Shared *sh;

  g_return_val_if_fail (SW_IS_SOLVER (self), 0);
  g_return_val_if_fail (design != NULL, 0);

  sh = self->shared;
  g_mutex_lock (&sh->mutex);
  if (sh->pending != NULL)
    sh->dropped++;
  sw_design_free (sh->pending);
  sh->pending = sw_design_copy (design);
  sh->pending_serial = ++self->serial;
  g_clear_object (&sh->pending_cancellable);
  sh->pending_cancellable = g_cancellable_new ();
  if (sh->running != NULL)
    g_cancellable_cancel (sh->running);
  g_cond_signal (&sh->cond);
  g_mutex_unlock (&sh->mutex);
  return self->serial;
}

guint64
sw_solver_get_posted_serial (SwSolver *self)
{
  g_return_val_if_fail (SW_IS_SOLVER (self), 0);
  return self->serial;
}

SwAnalysis *
sw_solver_get_result (SwSolver *self)
{
  g_return_val_if_fail (SW_IS_SOLVER (self), NULL);
  return self->result;
}

void
sw_solver_set_options (SwSolver *self, const SwAnalysisOptions *options)
{
  g_return_if_fail (SW_IS_SOLVER (self));
  g_return_if_fail (options != NULL);

  g_mutex_lock (&self->shared->mutex);
  self->shared->options = *options;
  g_mutex_unlock (&self->shared->mutex);
}

void
sw_solver_get_options (SwSolver *self, SwAnalysisOptions *options)
{
  g_return_if_fail (SW_IS_SOLVER (self));

  g_mutex_lock (&self->shared->mutex);
  *options = self->shared->options;
  g_mutex_unlock (&self->shared->mutex);
}

void
sw_solver_get_ascent_counts (SwSolver *self, guint64 *started, guint64 *cancelled)
{
  g_return_if_fail (SW_IS_SOLVER (self));
  g_mutex_lock (&self->shared->mutex);
  if (started != NULL)
    *started = self->shared->ascents_started;
  if (cancelled != NULL)
    *cancelled = self->shared->ascents_cancelled;
  g_mutex_unlock (&self->shared->mutex);
}

guint64
sw_solver_get_dropped (SwSolver *self)
{
  guint64 n;

  g_return_val_if_fail (SW_IS_SOLVER (self), 0);
  g_mutex_lock (&self->shared->mutex);
  n = self->shared->dropped;
  g_mutex_unlock (&self->shared->mutex);
  return n;
}

SwSolver *
sw_solver_new (void)
{
  return g_object_new (SW_TYPE_SOLVER, NULL);
}

static void
sw_solver_dispose (GObject *object)
{
  SwSolver *self = SW_SOLVER (object);

  /* Shutdown is the one place where the main thread waits for the worker. */
  if (self->thread != NULL)
    {
      Shared *sh = self->shared;

      g_mutex_lock (&sh->mutex);
      sh->quit = TRUE;
      if (sh->running != NULL)
        g_cancellable_cancel (sh->running);
      g_cond_signal (&sh->cond);
      g_mutex_unlock (&sh->mutex);
      g_thread_join (g_steal_pointer (&self->thread));
    }
  g_clear_pointer (&self->result, sw_analysis_unref);
  G_OBJECT_CLASS (sw_solver_parent_class)->dispose (object);
}

static void
sw_solver_finalize (GObject *object)
{
  SwSolver *self = SW_SOLVER (object);

  g_clear_pointer (&self->shared, shared_unref);
  G_OBJECT_CLASS (sw_solver_parent_class)->finalize (object);
}

static void
sw_solver_class_init (SwSolverClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);

  object_class->dispose = sw_solver_dispose;
  object_class->finalize = sw_solver_finalize;

  signals[SOLVED] = g_signal_new ("solved", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST, 0,
                                  NULL, NULL, NULL, G_TYPE_NONE, 1,
                                  SW_TYPE_ANALYSIS | G_SIGNAL_TYPE_STATIC_SCOPE);
}

static void
sw_solver_init (SwSolver *self)
{
  Shared *sh = g_atomic_rc_box_new0 (Shared);

  g_mutex_init (&sh->mutex);
  sw_analysis_options_init (&sh->options);
  g_cond_init (&sh->cond);
  g_weak_ref_init (&sh->owner, self);
  sh->context = g_main_context_ref_thread_default ();
  self->shared = sh;
  self->thread = g_thread_new ("sw-solver", worker_thread, shared_ref (sh));
}
