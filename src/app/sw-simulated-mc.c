/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-simulated-mc"

#include "config.h"

#include "sw-simulated-mc.h"

#include "sw-ascent-montecarlo.h"
#include "sw-format.h"

#include <glib/gi18n.h>
#include <math.h>

/* One run: what the worker shares with the window (reference counted, so a
 * cancelled run may finish after the widget is gone). */
typedef struct {
  gint          ref;
  SwDesign     *design;
  guint         samples;
  guint32       seed;
  gint          done;          /* atomic: samples flown */
  GCancellable *cancellable;
} Run;

static Run *
run_ref (Run *run)
{
  g_atomic_int_inc (&run->ref);
  return run;
}

static void
run_unref (Run *run)
{
  if (!g_atomic_int_dec_and_test (&run->ref))
    return;
  sw_design_free (run->design);
  g_object_unref (run->cancellable);
  g_free (run);
}

struct _SwSimulatedMc {
  GtkBox              parent_instance;

  GtkSwitch          *toggle;
  GtkLabel           *title;
  GtkProgressBar     *progress;
  GtkLabel           *text;
  SwDesign           *design;
  Run                *run;        /* the run in flight, or NULL */
  guint               tick;       /* progress timer */
  SwSimulatedMcState  state;
  guint               cancelled;  /* runs cancelled (for tests) */
};

G_DEFINE_FINAL_TYPE (SwSimulatedMc, sw_simulated_mc, GTK_TYPE_BOX)

static void
progress_cb (guint done, guint total, gpointer user_data)
{
  Run *run = user_data;

  (void) total;
  g_atomic_int_set (&run->done, (gint) done);
}

static void
worker (GTask *task, gpointer source, gpointer task_data, GCancellable *cancellable)
{
  Run *run = task_data;
  GError *error = NULL;
  SwAscentMonteCarlo *mc;

  (void) source;
  mc = sw_ascent_montecarlo_run (run->design, run->samples, run->seed, 0, progress_cb, run,
                                 cancellable, &error);
  if (mc == NULL)
    g_task_return_error (task, error);
  else
    g_task_return_pointer (task, mc, (GDestroyNotify) sw_ascent_montecarlo_free);
}

static void
set_text (SwSimulatedMc *self, const char *text)
{
  if (g_strcmp0 (gtk_label_get_text (self->text), text) != 0)
    gtk_label_set_text (self->text, text);
}

static void
stop_tick (SwSimulatedMc *self)
{
  if (self->tick != 0)
    g_source_remove (self->tick);
  self->tick = 0;
}

static void
cancel_run (SwSimulatedMc *self)
{
  stop_tick (self);
  if (self->run != NULL)
    {
      g_cancellable_cancel (self->run->cancellable);
      g_clear_pointer (&self->run, run_unref);
      self->cancelled++;
    }
  gtk_widget_set_visible (GTK_WIDGET (self->progress), FALSE);
}

static gboolean
tick_cb (gpointer data)
{
  SwSimulatedMc *self = data;

  if (self->run != NULL && self->run->samples > 0)
    gtk_progress_bar_set_fraction (self->progress, (double) g_atomic_int_get (&self->run->done)
                                                   / self->run->samples);
  return G_SOURCE_CONTINUE;
}

static void
show_answer (SwSimulatedMc *self, const SwAscentMonteCarlo *mc)
{
  g_autofree char *p05 = sw_format_speed (mc->p05_margin_m_s);
  g_autofree char *p50 = sw_format_speed (mc->p50_margin_m_s);
  g_autofree char *p95 = sw_format_speed (mc->p95_margin_m_s);
  g_autofree char *chance = sw_format_probability (mc->probability_reached);
  g_autofree char *n = sw_format_number (mc->flown, 0);
  g_autofree char *reserve = sw_format_mass (fabs (mc->payload_reserve_95_kg));
  g_autofree char *text = NULL;

  if (!isfinite (mc->p05_margin_m_s) || mc->flown == 0)
    {
      set_text (self, _("No sample flew: no margin to show."));
      return;
    }
  text = g_strdup_printf (mc->payload_reserve_95_kg > 0.0
                            /* Translators: flights; three speeds; a probability; a mass */
                            ? _("Delta-v margin over %s simulated ascents: 5th percentile %s, "
                                "median %s, 95th percentile %s.  Reaches the orbit in %s of "
                                "them; holding back %s of payload makes it 95 %%.")
                            /* Translators: flights; three speeds; a probability; a mass */
                            : _("Delta-v margin over %s simulated ascents: 5th percentile %s, "
                                "median %s, 95th percentile %s.  Reaches the orbit in %s of "
                                "them; 95 %% would still reach it with %s more payload."),
                          n, p05, p50, p95, chance, reserve);
  set_text (self, text);
}

static void
done_cb (GObject *source, GAsyncResult *result, gpointer user_data)
{
  SwSimulatedMc *self = user_data;   /* a reference, held by the task */
  Run *run = g_task_get_task_data (G_TASK (result));
  g_autoptr (GError) error = NULL;
  SwAscentMonteCarlo *mc = g_task_propagate_pointer (G_TASK (result), &error);

  (void) source;
  if (run == self->run)
    {
      stop_tick (self);
      g_clear_pointer (&self->run, run_unref);
      gtk_widget_set_visible (GTK_WIDGET (self->progress), FALSE);
      if (mc != NULL)
        {
          self->state = SW_SIMULATED_MC_DONE;
          show_answer (self, mc);
        }
      else
        {
          self->state = SW_SIMULATED_MC_FAILED;
          set_text (self, error->message);
        }
    }
  if (mc != NULL)
    sw_ascent_montecarlo_free (mc);
  g_object_unref (self);
}

static void
start_run (SwSimulatedMc *self)
{
  g_autoptr (GTask) task = NULL;
  Run *run;
  g_autofree char *n = NULL, *text = NULL;

  cancel_run (self);
  if (self->design == NULL || !gtk_switch_get_active (self->toggle))
    return;
  run = g_new0 (Run, 1);
  run->ref = 1;
  run->design = sw_design_copy (self->design);
  run->samples = CLAMP (self->design->uncertainty.samples, 1, SW_SIMULATED_MC_MAX_SAMPLES);
  run->seed = self->design->uncertainty.seed;
  run->cancellable = g_cancellable_new ();
  self->run = run;
  self->state = SW_SIMULATED_MC_RUNNING;
  n = sw_format_number (run->samples, 0);
  /* Translators: %s is a number of flights */
  text = g_strdup_printf (_("Flying %s ascents…"), n);
  set_text (self, text);
  gtk_progress_bar_set_fraction (self->progress, 0.0);
  gtk_widget_set_visible (GTK_WIDGET (self->progress), TRUE);
  self->tick = g_timeout_add (100, tick_cb, self);

  task = g_task_new (NULL, run->cancellable, done_cb, g_object_ref (self));
  g_task_set_task_data (task, run_ref (run), (GDestroyNotify) run_unref);
  g_task_set_return_on_cancel (task, FALSE);
  g_task_run_in_thread (task, worker);
}

static void
toggled_cb (SwSimulatedMc *self)
{
  if (gtk_switch_get_active (self->toggle))
    start_run (self);
  else
    {
      cancel_run (self);
      if (self->state != SW_SIMULATED_MC_UNAVAILABLE)
        self->state = SW_SIMULATED_MC_OFF;
      set_text (self, _("Off: the Monte Carlo above draws the losses from their spread; "
                        "switched on, every sample flies its own ascent."));
    }
}

void
sw_simulated_mc_set_design (SwSimulatedMc *self, const SwDesign *design)
{
  g_autoptr (GError) error = NULL;
  gboolean flyable;

  g_return_if_fail (SW_IS_SIMULATED_MC (self));

  if (design == NULL || (self->design != NULL && sw_design_equal (self->design, design)))
    return;
  g_clear_pointer (&self->design, sw_design_free);
  self->design = sw_design_copy (design);
  flyable = design->mission.kind == SW_MISSION_ORBIT && sw_ascent_check_inputs (design, &error);
  gtk_widget_set_sensitive (GTK_WIDGET (self->toggle), flyable);
  if (!flyable)
    {
      cancel_run (self);
      self->state = SW_SIMULATED_MC_UNAVAILABLE;
      set_text (self, error != NULL ? error->message
                                    : _("Needs an orbit mission and the ascent keys."));
      return;
    }
  if (self->state == SW_SIMULATED_MC_UNAVAILABLE)
    self->state = SW_SIMULATED_MC_OFF;
  if (gtk_switch_get_active (self->toggle))
    start_run (self);
  else
    toggled_cb (self);
}

GtkWidget *
sw_simulated_mc_get_switch (SwSimulatedMc *self)
{
  g_return_val_if_fail (SW_IS_SIMULATED_MC (self), NULL);
  return GTK_WIDGET (self->toggle);
}

SwSimulatedMcState
sw_simulated_mc_get_state (SwSimulatedMc *self)
{
  g_return_val_if_fail (SW_IS_SIMULATED_MC (self), SW_SIMULATED_MC_OFF);
  return self->state;
}

const char *
sw_simulated_mc_get_text (SwSimulatedMc *self)
{
  g_return_val_if_fail (SW_IS_SIMULATED_MC (self), NULL);
  return gtk_label_get_text (self->text);
}

double
sw_simulated_mc_get_fraction (SwSimulatedMc *self)
{
  g_return_val_if_fail (SW_IS_SIMULATED_MC (self), 0.0);
  if (self->run != NULL && self->run->samples > 0)
    return (double) g_atomic_int_get (&self->run->done) / self->run->samples;
  return self->state == SW_SIMULATED_MC_DONE ? 1.0 : 0.0;
}

guint
sw_simulated_mc_get_runs_cancelled (SwSimulatedMc *self)
{
  g_return_val_if_fail (SW_IS_SIMULATED_MC (self), 0);
  return self->cancelled;
}

static void
sw_simulated_mc_dispose (GObject *object)
{
  SwSimulatedMc *self = SW_SIMULATED_MC (object);

  cancel_run (self);
  g_clear_pointer (&self->design, sw_design_free);
  G_OBJECT_CLASS (sw_simulated_mc_parent_class)->dispose (object);
}

static void
sw_simulated_mc_class_init (SwSimulatedMcClass *klass)
{
  G_OBJECT_CLASS (klass)->dispose = sw_simulated_mc_dispose;
}

static void
sw_simulated_mc_init (SwSimulatedMc *self)
{
  GtkWidget *row = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 12);

  gtk_orientable_set_orientation (GTK_ORIENTABLE (self), GTK_ORIENTATION_VERTICAL);
  gtk_box_set_spacing (GTK_BOX (self), 6);
  gtk_widget_add_css_class (GTK_WIDGET (self), "sw-card");

  self->title = GTK_LABEL (gtk_label_new (_("Monte Carlo with a simulated ascent per sample")));
  gtk_label_set_xalign (self->title, 0.0);
  gtk_label_set_wrap (self->title, TRUE);
  gtk_widget_set_hexpand (GTK_WIDGET (self->title), TRUE);
  gtk_widget_add_css_class (GTK_WIDGET (self->title), "sw-figure-caption");
  self->toggle = GTK_SWITCH (gtk_switch_new ());
  gtk_widget_set_valign (GTK_WIDGET (self->toggle), GTK_ALIGN_CENTER);
  gtk_accessible_update_property (GTK_ACCESSIBLE (self->toggle), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                  _("Fly every sample"), -1);
  gtk_box_append (GTK_BOX (row), GTK_WIDGET (self->title));
  gtk_box_append (GTK_BOX (row), GTK_WIDGET (self->toggle));
  gtk_box_append (GTK_BOX (self), row);

  self->progress = GTK_PROGRESS_BAR (gtk_progress_bar_new ());
  gtk_widget_set_visible (GTK_WIDGET (self->progress), FALSE);
  gtk_box_append (GTK_BOX (self), GTK_WIDGET (self->progress));

  self->text = GTK_LABEL (gtk_label_new (NULL));
  gtk_label_set_xalign (self->text, 0.0);
  gtk_label_set_wrap (self->text, TRUE);
  gtk_label_set_selectable (self->text, FALSE);
  gtk_widget_add_css_class (GTK_WIDGET (self->text), "sw-card-detail");
  gtk_box_append (GTK_BOX (self), GTK_WIDGET (self->text));

  self->state = SW_SIMULATED_MC_UNAVAILABLE;
  gtk_widget_set_sensitive (GTK_WIDGET (self->toggle), FALSE);
  g_signal_connect_swapped (self->toggle, "notify::active", G_CALLBACK (toggled_cb), self);
}

GtkWidget *
sw_simulated_mc_new (void)
{
  return g_object_new (SW_TYPE_SIMULATED_MC, NULL);
}
