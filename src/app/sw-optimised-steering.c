/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-optimised-steering"

#include "config.h"

#include "sw-optimised-steering.h"

#include "sw-format.h"
#include "sw-spinner.h"

#include <glib/gi18n.h>
#include <math.h>
#include <string.h>

/* What the worker flies: copies, owned by the task. */
typedef struct {
  SwDesign       *design;
  SwAscentResult  ascent;     /* samples NULL */
} Job;

static void
job_free (Job *job)
{
  sw_design_free (job->design);
  g_free (job);
}

struct _SwOptimisedSteering {
  GtkBox              parent_instance;

  GtkButton          *button;
  GtkSpinner         *spinner;
  GtkLabel           *text;
  const SwAscentResult *shown;    /* identity of the ascent shown (not dereferenced) */
  SwDesign           *design;
  SwAscentResult     *ascent;     /* copy, samples NULL */
  GCancellable       *cancellable;
  SwAscentOptimised   answer;
};

G_DEFINE_FINAL_TYPE (SwOptimisedSteering, sw_optimised_steering, GTK_TYPE_BOX)

static void
set_text (SwOptimisedSteering *self, const char *text)
{
  if (g_strcmp0 (gtk_label_get_text (self->text), text) != 0)
    gtk_label_set_text (self->text, text);
}

static void
cancel (SwOptimisedSteering *self)
{
  if (self->cancellable != NULL)
    g_cancellable_cancel (self->cancellable);
  g_clear_object (&self->cancellable);
  sw_spinner_set_busy (self->spinner, FALSE);
  gtk_widget_set_visible (GTK_WIDGET (self->spinner), FALSE);
}

static void
worker (GTask *task, gpointer source, gpointer task_data, GCancellable *cancellable)
{
  Job *job = task_data;
  GError *error = NULL;

  (void) source;
  if (!sw_ascent_optimise_steering (job->design, &job->ascent, cancellable, &error))
    g_task_return_error (task, error);
  else
    g_task_return_pointer (task, g_memdup2 (&job->ascent.optimised, sizeof (SwAscentOptimised)),
                           g_free);
}

static void
show_answer (SwOptimisedSteering *self)
{
  const SwAscentOptimised *o = &self->answer;
  g_autofree char *saving = sw_format_speed (MAX (o->saving_m_s, 0.0));
  g_autofree char *opt = sw_format_speed (o->needed_m_s);
  g_autofree char *guided = sw_format_speed (o->guided_needed_m_s);
  g_autofree char *text = NULL;

  if (!o->done)
    text = g_strdup (_("Nothing to optimise: no guided flight reached the cutoff."));
  else if (!isfinite (o->needed_m_s))
    text = g_strdup (_("The optimised steering found no flight to the orbit better than the "
                       "guided law."));
  else if (o->improved)
    /* Translators: a saving, then the delta-v needed optimised and guided */
    text = g_strdup_printf (_("Optimised steering saves %s over the guided law (delta-v "
                              "needed %s against %s)."), saving, opt, guided);
  else
    /* Translators: the delta-v needed optimised and guided */
    text = g_strdup_printf (_("Optimised steering found no saving over the guided law (delta-v "
                              "needed %s against %s)."), opt, guided);
  set_text (self, text);
}

static void
done_cb (GObject *source, GAsyncResult *result, gpointer user_data)
{
  SwOptimisedSteering *self = user_data;   /* a reference, held by the task */
  g_autoptr (GError) error = NULL;
  SwAscentOptimised *o = g_task_propagate_pointer (G_TASK (result), &error);
  GCancellable *c = g_task_get_cancellable (G_TASK (result));

  (void) source;
  if (c != NULL && c == self->cancellable)
    {
      g_clear_object (&self->cancellable);
      sw_spinner_set_busy (self->spinner, FALSE);
      gtk_widget_set_visible (GTK_WIDGET (self->spinner), FALSE);
      gtk_widget_set_sensitive (GTK_WIDGET (self->button), TRUE);
      if (o != NULL)
        {
          self->answer = *o;
          show_answer (self);
        }
      else
        set_text (self, error->message);
    }
  g_free (o);
  g_object_unref (self);
}

static void
clicked_cb (SwOptimisedSteering *self)
{
  g_autoptr (GTask) task = NULL;
  Job *job;

  if (self->ascent == NULL || self->design == NULL || self->cancellable != NULL)
    return;
  job = g_new0 (Job, 1);
  job->design = sw_design_copy (self->design);
  memcpy (&job->ascent, self->ascent, sizeof job->ascent);
  self->cancellable = g_cancellable_new ();
  gtk_widget_set_sensitive (GTK_WIDGET (self->button), FALSE);
  gtk_widget_set_visible (GTK_WIDGET (self->spinner), TRUE);
  sw_spinner_set_busy (self->spinner, TRUE);
  set_text (self, _("Optimising the steering: a few hundred trial flights…"));
  task = g_task_new (NULL, self->cancellable, done_cb, g_object_ref (self));
  g_task_set_task_data (task, job, (GDestroyNotify) job_free);
  g_task_run_in_thread (task, worker);
}

void
sw_optimised_steering_set_flight (SwOptimisedSteering *self, const SwDesign *design,
                                  const SwAscentResult *ascent)
{
  gboolean flyable;

  g_return_if_fail (SW_IS_OPTIMISED_STEERING (self));

  if (ascent == self->shown)
    return;
  cancel (self);
  self->shown = ascent;
  g_clear_pointer (&self->design, sw_design_free);
  g_clear_pointer (&self->ascent, g_free);
  memset (&self->answer, 0, sizeof self->answer);
  flyable = design != NULL && ascent != NULL
            && (ascent->status == SW_ASCENT_REACHED || ascent->status == SW_ASCENT_SHORT);
  if (flyable)
    {
      self->design = sw_design_copy (design);
      self->ascent = g_memdup2 (ascent, sizeof *ascent);
      self->ascent->samples = NULL;
    }
  gtk_widget_set_sensitive (GTK_WIDGET (self->button), flyable);
  set_text (self, flyable ? _("The guided law's steering, optimised on demand: direct shooting "
                              "over the pitch kick and the pitch at each upper stage's "
                              "ignition (slow).")
                          : _("No guided flight to optimise."));
}

GtkWidget *
sw_optimised_steering_get_button (SwOptimisedSteering *self)
{
  g_return_val_if_fail (SW_IS_OPTIMISED_STEERING (self), NULL);
  return GTK_WIDGET (self->button);
}

gboolean
sw_optimised_steering_is_running (SwOptimisedSteering *self)
{
  g_return_val_if_fail (SW_IS_OPTIMISED_STEERING (self), FALSE);
  return self->cancellable != NULL;
}

const SwAscentOptimised *
sw_optimised_steering_get_answer (SwOptimisedSteering *self)
{
  g_return_val_if_fail (SW_IS_OPTIMISED_STEERING (self), NULL);
  return &self->answer;
}

const char *
sw_optimised_steering_get_text (SwOptimisedSteering *self)
{
  g_return_val_if_fail (SW_IS_OPTIMISED_STEERING (self), NULL);
  return gtk_label_get_text (self->text);
}

static void
sw_optimised_steering_dispose (GObject *object)
{
  SwOptimisedSteering *self = SW_OPTIMISED_STEERING (object);

  cancel (self);
  g_clear_pointer (&self->design, sw_design_free);
  g_clear_pointer (&self->ascent, g_free);
  G_OBJECT_CLASS (sw_optimised_steering_parent_class)->dispose (object);
}

static void
sw_optimised_steering_class_init (SwOptimisedSteeringClass *klass)
{
  G_OBJECT_CLASS (klass)->dispose = sw_optimised_steering_dispose;
}

static void
sw_optimised_steering_init (SwOptimisedSteering *self)
{
  gtk_orientable_set_orientation (GTK_ORIENTABLE (self), GTK_ORIENTATION_HORIZONTAL);
  gtk_box_set_spacing (GTK_BOX (self), 10);
  self->button = GTK_BUTTON (gtk_button_new_with_label (_("Optimise the steering")));
  gtk_widget_set_valign (GTK_WIDGET (self->button), GTK_ALIGN_CENTER);
  self->spinner = GTK_SPINNER (gtk_spinner_new ());
  gtk_widget_set_visible (GTK_WIDGET (self->spinner), FALSE);
  self->text = GTK_LABEL (gtk_label_new (NULL));
  gtk_label_set_xalign (self->text, 0.0);
  gtk_label_set_wrap (self->text, TRUE);
  gtk_widget_set_hexpand (GTK_WIDGET (self->text), TRUE);
  gtk_box_append (GTK_BOX (self), GTK_WIDGET (self->button));
  gtk_box_append (GTK_BOX (self), GTK_WIDGET (self->spinner));
  gtk_box_append (GTK_BOX (self), GTK_WIDGET (self->text));
  gtk_widget_set_sensitive (GTK_WIDGET (self->button), FALSE);
  g_signal_connect_swapped (self->button, "clicked", G_CALLBACK (clicked_cb), self);
}

GtkWidget *
sw_optimised_steering_new (void)
{
  return g_object_new (SW_TYPE_OPTIMISED_STEERING, NULL);
}
