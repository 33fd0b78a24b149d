/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-staging-page"

#include "config.h"

#include "sw-staging-page.h"

#include "sw-analysis.h"
#include "sw-carpet.h"
#include "sw-csv-staging.h"
#include "sw-document.h"
#include "sw-economics.h"
#include "sw-engine-types-editor.h"
#include "sw-format.h"
#include "sw-number-field.h"
#include "sw-plot-axis.h"
#include "sw-plot-palette.h"
#include "sw-staging.h"

#include <glib/gi18n.h>
#include <math.h>

/* The worker's input and output: a copy of the design in, figures out. */
typedef struct {
  gint      ref;
  SwDesign *design;
  /* The design the staging table and the carpet size: the closed loop's vehicle
   * (sw_analysis_dup_trade_design) once the analysis has its losses, or
   * NULL for the design itself.  Views never compute: the analysis says. */
  SwDesign *looped;
  GCancellable *cancellable;   /* a newer design: the whole job is dropped */
  GCancellable *carpet_cancel; /* the Cancel button: the carpet only */
  GMutex    lock;
  double    progress;          /* 0..1, under lock */
  gboolean  do_staging;        /* FALSE: the staging figures are copied in */
  SwStaging staging;
  gboolean  staging_ok;
  SwCarpetOptions carpet_options;
  SwCarpet *carpet;
  gboolean  carpet_cancelled;
  char     *carpet_error;      /* why the grid was refused, or NULL */
} Job;

static Job *
job_ref (Job *job)
{
  g_atomic_int_inc (&job->ref);
  return job;
}

static void
job_unref (Job *job)
{
  if (!g_atomic_int_dec_and_test (&job->ref))
    return;
  sw_design_free (job->design);
  g_clear_pointer (&job->looped, sw_design_free);
  g_clear_object (&job->cancellable);
  g_clear_object (&job->carpet_cancel);
  sw_carpet_free (job->carpet);
  g_free (job->carpet_error);
  g_mutex_clear (&job->lock);
  g_free (job);
}

struct _SwStagingPage {
  GtkWidget       parent_instance;
  GtkWidget      *box;
  GtkWidget      *statement;
  GtkWidget      *decision;
  GtkWidget      *money;
  GtkWidget      *carpet_title;
  GtkWidget      *progress_row;
  GtkWidget      *progress;
  GtkWidget      *carpet_button;
  GtkWidget      *carpet_status;
  GtkWidget      *carpet_output;
  GtkWidget      *carpet_money;  /* cost contours in money (the carpet's money grid) */
  GtkWidget      *axis_param[2];
  GtkWidget      *axis_min[2];
  GtkWidget      *axis_max[2];
  GtkWidget      *axis_n[2];
  GtkWidget      *currency;
  GtkWidget      *currency_error;
  GtkWidget      *carpet;
  SwDesign       *design;       /* the design of the last result */
  SwDesign       *looped;       /* its closed loop's vehicle, or NULL (Job) */
  SwCarpetOutput  output;
  SwCarpetAxis    axes[2];      /* the carpet's axes as the fields show them */
  gboolean        axes_chosen;  /* the user picked: chosen[] holds the choice */
  SwCarpetAxis    chosen[2];    /* kept while a design lacks the parameter */
  SwCarpetAxis    params[64];   /* the parameters the menus offer */
  guint           n_params;
  GtkWidget      *rule_field;   /* the field marked by a rule between fields */
  char           *rule_message;
  GtkWidget      *scroller;
  SwDocument     *document;     /* the edits of the economics keys go here */
  guint           updating;     /* fields being filled from a result */
  GtkWidget      *fields[SW_N_ECON_NUMBERS];
  GtkWidget      *mode;
  GtkWidget      *booster_mode;  /* economics.recovery.booster_mode */
  GtkWidget      *engine_types;  /* SwEngineTypesEditor: the economics lists */
  Job            *running;      /* the newest job, until it is shown */
  Job            *shown;        /* the job whose figures are drawn */
  guint           progress_id;
  SwAnalysis     *pending;      /* arrived while the page was hidden */
};

G_DEFINE_FINAL_TYPE (SwStagingPage, sw_staging_page, GTK_TYPE_WIDGET)

static void
job_progress_cb (double fraction, gpointer data)
{
  Job *job = data;

  g_mutex_lock (&job->lock);
  job->progress = fraction;
  g_mutex_unlock (&job->lock);
}

static void
job_thread (GTask *task, gpointer source, gpointer data, GCancellable *cancellable)
{
  Job *job = data;
  SwCarpetOptions o = job->carpet_options;
  g_autoptr (GError) error = NULL;

  if (job->do_staging)
    job->staging_ok = job->looped != NULL
                        ? sw_staging_compute_looped (job->looped, SW_STAGING_MAX_STAGES,
                                                     &job->staging, NULL)
                        : sw_staging_compute (job->design, SW_STAGING_MAX_STAGES, &job->staging,
                                              NULL);
  o.cancellable = job->carpet_cancel;
  o.progress = job_progress_cb;
  o.progress_data = job;
  /* The same design as the table: the closed loop's vehicle once known. */
  job->carpet = job->looped != NULL ? sw_carpet_compute_looped (job->looped, &o, &error)
                                    : sw_carpet_compute (job->design, &o, &error);
  if (job->carpet == NULL && g_error_matches (error, G_IO_ERROR, G_IO_ERROR_CANCELLED))
    job->carpet_cancelled = TRUE;
  else if (job->carpet == NULL)
    job->carpet_error = g_strdup (error->message);
  g_task_return_boolean (task, !g_cancellable_is_cancelled (cancellable));
}

static gboolean
progress_tick_cb (gpointer data)
{
  SwStagingPage *self = data;
  double f = 0.0;

  if (self->running == NULL)
    {
      self->progress_id = 0;
      return G_SOURCE_REMOVE;
    }
  g_mutex_lock (&self->running->lock);
  f = self->running->progress;
  g_mutex_unlock (&self->running->lock);
  gtk_progress_bar_set_fraction (GTK_PROGRESS_BAR (self->progress), f);
  return G_SOURCE_CONTINUE;
}

enum { READY, N_SIGNALS };
static guint signals[N_SIGNALS];

static void update_money (SwStagingPage *self);
static void sync_money_option (SwStagingPage *self);

static void
set_carpet_status (SwStagingPage *self, const char *text, gboolean error)
{
  gtk_label_set_text (GTK_LABEL (self->carpet_status), text != NULL ? text : "");
  gtk_widget_set_visible (self->carpet_status, text != NULL && text[0] != '\0');
  if (error)
    gtk_widget_add_css_class (self->carpet_status, "error");
  else
    gtk_widget_remove_css_class (self->carpet_status, "error");
}

static void
job_done_cb (GObject *source, GAsyncResult *res, gpointer data)
{
  SwStagingPage *self = SW_STAGING_PAGE (source);
  Job *job = data;

  /* Only the newest job is shown; one a newer design replaced is dropped. */
  if (g_task_propagate_boolean (G_TASK (res), NULL) && job == self->running)
    {
      g_clear_pointer (&self->shown, job_unref);
      self->shown = g_steal_pointer (&self->running);
      gtk_widget_set_visible (self->progress_row, FALSE);
      gtk_button_set_label (GTK_BUTTON (self->carpet_button), _("Compute"));
      gtk_widget_set_visible (self->carpet_button, self->shown->carpet == NULL);
      if (self->shown->staging_ok)
        {
          const SwStaging *st = &self->shown->staging;
          g_autoptr (GString) notes = g_string_new (NULL);
          g_autofree char *unrecovered = sw_staging_dup_unrecovered_note (st);
          g_autofree char *penalty = sw_staging_dup_penalty_note (st);
          const char *parts[] = { penalty, st->boosters_note, st->fixed_note, st->reuse_note,
                                  st->losses_note, unrecovered };

          for (guint k = 0; k < G_N_ELEMENTS (parts); k++)
            if (parts[k] != NULL && parts[k][0] != '\0')
              g_string_append_printf (notes, " %s", parts[k]);
          if (notes->len > 0)
            {
              g_autofree char *text = g_strdup_printf ("%s.%s", st->weighting, notes->str);
              gtk_label_set_text (GTK_LABEL (self->statement), text);
            }
          else
            gtk_label_set_text (GTK_LABEL (self->statement), st->weighting);
        }
      else
        gtk_label_set_text (GTK_LABEL (self->statement), "");
      if (self->shown->carpet_cancelled)
        set_carpet_status (self, _("Cancelled: the carpet is not drawn. Press Compute to "
                                   "compute it."), FALSE);
      else if (self->shown->carpet_error != NULL)
        set_carpet_status (self, self->shown->carpet_error, TRUE);
      else
        /* What the grid leaves out (a simulate design's allowance), or nothing. */
        set_carpet_status (self, self->shown->carpet != NULL ? self->shown->carpet->note : NULL,
                           FALSE);
      update_money (self);
      sync_money_option (self);
      /* The key of a design with boosters has two more entries, and two
       * sets of lines share the panels: a taller drawing. */
      gtk_widget_set_size_request (self->decision, 300,
                                   self->shown->staging_ok
                                       && self->shown->staging.booster_count > 0
                                     ? 520 : 330);
      gtk_widget_queue_draw (self->decision);
      gtk_widget_queue_draw (self->carpet);
      g_signal_emit (self, signals[READY], 0);
    }
  job_unref (job);
}

/* Starts the worker on the page's design with the carpet's current axes;
 * the staging figures are computed again only for a new design. */
static void
start_job (SwStagingPage *self)
{
  g_autoptr (GTask) task = NULL;
  Job *job;

  if (self->design == NULL)
    return;
  if (self->running != NULL)
    {
      g_cancellable_cancel (self->running->cancellable);
      g_cancellable_cancel (self->running->carpet_cancel);
      g_clear_pointer (&self->running, job_unref);
    }
  job = g_new0 (Job, 1);
  job->ref = 1;
  g_mutex_init (&job->lock);
  job->design = sw_design_copy (self->design);
  job->looped = self->looped != NULL ? sw_design_copy (self->looped) : NULL;
  job->cancellable = g_cancellable_new ();
  job->carpet_cancel = g_cancellable_new ();
  job->carpet_options.x = self->axes[0];
  job->carpet_options.y = self->axes[1];
  job->carpet_options.output = self->output;
  job->do_staging = !(self->shown != NULL && self->shown->staging_ok
                      && sw_design_equal (self->shown->design, self->design)
                      && (self->shown->looped == NULL) == (self->looped == NULL)
                      && (self->looped == NULL
                          || sw_design_equal (self->shown->looped, self->looped)));
  if (!job->do_staging)
    {
      job->staging = self->shown->staging;
      job->staging_ok = TRUE;
    }
  self->running = job;
  task = g_task_new (self, job->cancellable, job_done_cb, job_ref (job));
  g_task_set_source_tag (task, start_job);
  g_task_set_name (task, "staging decision and carpet");
  g_task_set_task_data (task, job_ref (job), (GDestroyNotify) job_unref);
  g_task_run_in_thread (task, job_thread);
  gtk_progress_bar_set_fraction (GTK_PROGRESS_BAR (self->progress), 0.0);
  gtk_widget_set_visible (self->progress_row, TRUE);
  gtk_button_set_label (GTK_BUTTON (self->carpet_button), _("Cancel"));
  gtk_widget_set_visible (self->carpet_button, TRUE);
  set_carpet_status (self, NULL, FALSE);
  if (self->progress_id == 0)
    self->progress_id = g_timeout_add (50, progress_tick_cb, self);
}

static void
carpet_button_cb (GtkButton *button, SwStagingPage *self)
{
  if (self->running != NULL)
    g_cancellable_cancel (self->running->carpet_cancel);
  else
    start_job (self);
}

/* ---- the carpet's controls ---------------------------------------------- */

static char *
axis_label_with_unit (const SwCarpetAxis *axis)
{
  g_autofree char *label = sw_carpet_param_dup_label (axis);
  const char *unit = sw_carpet_param_unit (axis);

  return unit[0] != '\0' ? g_strdup_printf ("%s (%s)", label, unit) : g_steal_pointer (&label);
}

static int
param_index (SwStagingPage *self, const SwCarpetAxis *axis)
{
  for (guint i = 0; i < self->n_params; i++)
    if (sw_carpet_param_equal (&self->params[i], axis))
      return (int) i;
  return -1;
}

/* The menus hold the parameters of the design and output; rebuilt only
 * when that list changes (a stage added, a cost output chosen). */
static void
sync_param_menus (SwStagingPage *self)
{
  SwCarpetAxis list[G_N_ELEMENTS (self->params)];
  guint n = sw_carpet_list_params (self->design, self->output, list, G_N_ELEMENTS (list));
  gboolean same = n == self->n_params;

  for (guint i = 0; same && i < n; i++)
    same = sw_carpet_param_equal (&list[i], &self->params[i]);
  if (same)
    return;
  memcpy (self->params, list, n * sizeof list[0]);
  self->n_params = n;
  /* A new model selects its first item: not the user's choice. */
  self->updating++;
  for (guint a = 0; a < 2; a++)
    {
      g_autoptr (GtkStringList) strings = gtk_string_list_new (NULL);
      for (guint i = 0; i < n; i++)
        {
          g_autofree char *label = axis_label_with_unit (&list[i]);
          gtk_string_list_append (strings, label);
        }
      gtk_drop_down_set_model (GTK_DROP_DOWN (self->axis_param[a]), G_LIST_MODEL (strings));
    }
  self->updating--;
}

/* The fields of axis @a from self->axes[a], without emitting. */
static void
fill_axis (SwStagingPage *self, guint a)
{
  const SwCarpetAxis *axis = &self->axes[a];
  const SwLimit *l = sw_limit_get (sw_carpet_param_limit (axis));
  gboolean whole = sw_carpet_param_is_whole (axis);
  int k = param_index (self, axis);

  self->updating++;
  if (k >= 0)
    gtk_drop_down_set_selected (GTK_DROP_DOWN (self->axis_param[a]), (guint) k);
  for (guint f = 0; f < 2; f++)
    {
      SwNumberField *field = SW_NUMBER_FIELD (f == 0 ? self->axis_min[a] : self->axis_max[a]);
      double span = l->max - l->min;
      sw_number_field_set_range (field, l->min, l->max, l->min_exclusive, l->unit,
                                 whole ? 0 : 4, whole ? 1.0 : span / 100.0);
      sw_number_field_set_whole (field, whole);
      sw_number_field_reset (field, f == 0 ? axis->min : axis->max);
    }
  sw_number_field_reset (SW_NUMBER_FIELD (self->axis_n[a]), axis->n);
  self->updating--;
}

/* A parameter for axis @a other than the other axis's: the first in the list. */
static void
choose_other_param (SwStagingPage *self, guint a)
{
  for (guint i = 0; i < self->n_params; i++)
    if (!sw_carpet_param_equal (&self->params[i], &self->axes[1 - a]))
      {
        guint n = self->axes[a].n;
        self->axes[a] = self->params[i];
        self->axes[a].n = n;
        sw_carpet_axis_default_range (&self->axes[a], self->design);
        return;
      }
}

/* The axes for a new design: the first stage's structural coefficient
 * across and the top stage's vacuum Isp up at first; afterwards the
 * user's choice, each axis kept while the design still has it and its
 * range is still accepted. */
static void
sync_axes (SwStagingPage *self)
{
  gtk_label_set_text (GTK_LABEL (self->carpet_title),
                      self->output == SW_CARPET_LIFTOFF_MASS
                        ? _("Carpet plot: liftoff mass, contour lines")
                        : self->output == SW_CARPET_PAYLOAD
                            ? _("Carpet plot: payload of a vehicle of this design's liftoff "
                                "mass, contour lines")
                            : self->output == SW_CARPET_DEVELOPMENT
                                ? _("Carpet plot: development effort, contour lines")
                                : _("Carpet plot: cost per flight (expendable), contour lines"));
  sync_param_menus (self);
  /* Until the user picks, the axes follow the design. */
  if (!self->axes_chosen)
    {
      SwCarpetOptions o;
      sw_csv_carpet_default_axes (self->design, &o);
      self->axes[0] = o.x;
      self->axes[1] = o.y;
      self->axes[0].n = self->axes[1].n = 50;
    }
  else
    {
      self->axes[0] = self->chosen[0];
      self->axes[1] = self->chosen[1];
    }
  for (guint a = 0; a < 2; a++)
    {
      if (param_index (self, &self->axes[a]) < 0)
        choose_other_param (self, a);
      else if (!sw_carpet_axis_check (&self->axes[a], self->design, NULL))
        sw_carpet_axis_default_range (&self->axes[a], self->design);
      fill_axis (self, a);
    }
}

/* Reads the fields of both axes; marks the field at fault and returns
 * FALSE when the grid cannot be computed (the carpet stays as it is). */
static void
rule_error (SwStagingPage *self, GtkWidget *field, const char *message)
{
  g_free (self->rule_message);
  self->rule_message = g_strdup (message);
  self->rule_field = field;
  sw_number_field_set_error (SW_NUMBER_FIELD (field), message);
}

static gboolean
read_axes (SwStagingPage *self)
{
  SwCarpetAxis axes[2] = { self->axes[0], self->axes[1] };

  /* A rule between the fields is checked again from scratch: its mark
   * goes (unless the field has since got an error of its own). */
  if (self->rule_field != NULL
      && g_strcmp0 (sw_number_field_get_error (SW_NUMBER_FIELD (self->rule_field)),
                    self->rule_message) == 0)
    sw_number_field_set_error (SW_NUMBER_FIELD (self->rule_field), NULL);
  self->rule_field = NULL;
  set_carpet_status (self, NULL, FALSE);

  for (guint a = 0; a < 2; a++)
    {
      double lo = sw_number_field_get_value (SW_NUMBER_FIELD (self->axis_min[a]));
      double hi = sw_number_field_get_value (SW_NUMBER_FIELD (self->axis_max[a]));
      double n = sw_number_field_get_value (SW_NUMBER_FIELD (self->axis_n[a]));
      g_autoptr (GError) error = NULL;

      if (sw_number_field_get_error (SW_NUMBER_FIELD (self->axis_min[a])) != NULL
          || sw_number_field_get_error (SW_NUMBER_FIELD (self->axis_max[a])) != NULL
          || sw_number_field_get_error (SW_NUMBER_FIELD (self->axis_n[a])) != NULL)
        return FALSE;
      if (!(lo < hi))
        {
          rule_error (self, self->axis_max[a], _("The upper end must be above the lower end."));
          return FALSE;
        }
      axes[a].min = lo;
      axes[a].max = hi;
      axes[a].n = (guint) n;
      if (!sw_carpet_axis_check (&axes[a], self->design, &error))
        {
          rule_error (self, self->axis_min[a], error->message);
          return FALSE;
        }
    }
  if (sw_carpet_param_equal (&axes[0], &axes[1]))
    {
      set_carpet_status (self, _("The two axes of a carpet plot must be different parameters."),
                         TRUE);
      return FALSE;
    }
  self->axes[0] = axes[0];
  self->axes[1] = axes[1];
  if (self->axes_chosen)
    {
      self->chosen[0] = axes[0];
      self->chosen[1] = axes[1];
    }
  return TRUE;
}

/* From the first pick on, the axes are the user's. */
static void
mark_chosen (SwStagingPage *self)
{
  if (self->axes_chosen)
    return;
  self->chosen[0] = self->axes[0];
  self->chosen[1] = self->axes[1];
  self->axes_chosen = TRUE;
}

static void
axis_field_cb (SwNumberField *field, SwStagingPage *self)
{
  if (self->updating > 0 || self->design == NULL)
    return;
  mark_chosen (self);
  if (read_axes (self))
    start_job (self);
}

static void
axis_param_cb (GtkDropDown *dd, GParamSpec *pspec, SwStagingPage *self)
{
  guint a = dd == GTK_DROP_DOWN (self->axis_param[0]) ? 0 : 1;
  guint k = gtk_drop_down_get_selected (dd);
  guint n = self->axes[a].n;

  if (self->updating > 0 || self->design == NULL || k >= self->n_params)
    return;
  mark_chosen (self);
  self->axes[a] = self->params[k];
  self->axes[a].n = n;
  sw_carpet_axis_default_range (&self->axes[a], self->design);
  self->chosen[a] = self->axes[a];
  fill_axis (self, a);
  if (sw_carpet_param_equal (&self->axes[0], &self->axes[1]))
    {
      set_carpet_status (self, _("The two axes of a carpet plot must be different parameters."),
                         TRUE);
      return;
    }
  if (read_axes (self))
    start_job (self);
}

static void
money_toggled_cb (GtkCheckButton *button, SwStagingPage *self)
{
  gtk_widget_queue_draw (self->carpet);
}

/* The money option: offered when the carpet shown has a money grid, its
 * label naming the currency. */
static void
sync_money_option (SwStagingPage *self)
{
  const SwCarpet *c = self->shown != NULL ? self->shown->carpet : NULL;
  gboolean has = c != NULL && c->has_money;

  if (has)
    {
      g_autofree char *label
        = g_strdup_printf (_("Cost in money (%s), not work-years"),
                           c->currency[0] != '\0' ? c->currency : _("money units"));
      gtk_check_button_set_label (GTK_CHECK_BUTTON (self->carpet_money), label);
    }
  gtk_widget_set_visible (self->carpet_money, has);
}

static void
output_cb (GtkDropDown *dd, GParamSpec *pspec, SwStagingPage *self)
{
  if (self->updating > 0 || self->design == NULL)
    return;
  self->output = (SwCarpetOutput) gtk_drop_down_get_selected (dd);
  mark_chosen (self);

  sync_axes (self);
  if (read_axes (self))
    start_job (self);
}

void
sw_staging_page_set_result (SwStagingPage *self, SwAnalysis *result)
{
  g_return_if_fail (SW_IS_STAGING_PAGE (self));

  /* Hidden, the page only keeps the newest analysis and works when it is
   * shown: the worker and the main thread stay free for the visible views. */
  if (!gtk_widget_get_mapped (GTK_WIDGET (self)))
    {
      g_clear_pointer (&self->pending, sw_analysis_unref);
      self->pending = result != NULL ? sw_analysis_ref (result) : NULL;
      return;
    }
  /* The figures depend on the design only, and for a "simulate" design on
   * the closed loop's losses: a later phase of the same design changes
   * nothing here unless it is the one that closed the loop. */
  if (result != NULL && result->design != NULL && self->design != NULL
      && sw_design_equal (self->design, result->design)
      && (self->looped != NULL) == result->trade_losses_simulated)
    return;
  if (result != NULL && result->design != NULL && self->design != NULL
      && sw_design_equal (self->design, result->design))
    {
      /* The same design, its loop now closed: the table and the carpet
       * again, the fields and the carpet's axes as they are. */
      g_clear_pointer (&self->looped, sw_design_free);
      if (result->trade_losses_simulated)
        self->looped = sw_analysis_dup_trade_design (result);
      start_job (self);
      return;
    }
  if (self->running != NULL)
    {
      g_cancellable_cancel (self->running->cancellable);
      g_cancellable_cancel (self->running->carpet_cancel);
      g_clear_pointer (&self->running, job_unref);
    }
  if (result == NULL || result->design == NULL || result->design->n_stages == 0)
    return;
  g_clear_pointer (&self->design, sw_design_free);
  self->design = sw_design_copy (result->design);
  g_clear_pointer (&self->looped, sw_design_free);
  if (result->trade_losses_simulated)
    self->looped = sw_analysis_dup_trade_design (result);
  /* The fields show the design the figures come from. */
  self->updating++;
  for (guint k = 0; k < SW_N_ECON_NUMBERS; k++)
    {
      double v = sw_economics_get_number (&result->design->economics, k);
      double scale = sw_limit_get (sw_economics_number_limit (k))->max <= 1.0 ? 100.0 : 1.0;
      sw_number_field_reset (SW_NUMBER_FIELD (self->fields[k]), v * scale);
    }
  gtk_drop_down_set_selected (GTK_DROP_DOWN (self->mode), result->design->economics.recovery_mode);
  gtk_drop_down_set_selected (GTK_DROP_DOWN (self->booster_mode),
                              result->design->economics.booster_recovery_mode);
  gtk_editable_set_text (GTK_EDITABLE (self->currency), result->design->economics.currency);
  gtk_widget_remove_css_class (self->currency, "error");
  gtk_widget_set_visible (self->currency_error, FALSE);
  self->updating--;
  sync_axes (self);
  start_job (self);
}

void
sw_staging_page_set_document (SwStagingPage *self, SwDocument *document)
{
  g_return_if_fail (SW_IS_STAGING_PAGE (self));
  g_set_object (&self->document, document);
  sw_engine_types_editor_set_document (SW_ENGINE_TYPES_EDITOR (self->engine_types), document);
}

GtkWidget *
sw_staging_page_get_field (SwStagingPage *self, SwEconNumber key)
{
  g_return_val_if_fail (SW_IS_STAGING_PAGE (self) && key < SW_N_ECON_NUMBERS, NULL);
  return self->fields[key];
}

GtkWidget *
sw_staging_page_get_engine_types (SwStagingPage *self)
{
  g_return_val_if_fail (SW_IS_STAGING_PAGE (self), NULL);
  return self->engine_types;
}

GtkWidget *
sw_staging_page_get_mode (SwStagingPage *self)
{
  g_return_val_if_fail (SW_IS_STAGING_PAGE (self), NULL);
  return self->mode;
}

GtkWidget *
sw_staging_page_get_booster_mode (SwStagingPage *self)
{
  g_return_val_if_fail (SW_IS_STAGING_PAGE (self), NULL);
  return self->booster_mode;
}

/* A field's value into the design through the named edit, one undo step
 * per field (merged while the same field is edited). */
static void
field_committed_cb (SwNumberField *field, SwStagingPage *self)
{
  SwEconNumber key = GPOINTER_TO_UINT (g_object_get_data (G_OBJECT (field), "sw-econ-key"));
  double scale = sw_limit_get (sw_economics_number_limit (key))->max <= 1.0 ? 100.0 : 1.0;
  g_autofree char *merge = g_strdup_printf ("staging:%u", key);
  SwDesign *d;

  if (self->updating > 0 || self->document == NULL)
    return;
  d = sw_document_dup_design (self->document);
  if (!sw_economics_set_number (&d->economics, key, sw_number_field_get_value (field) / scale)
      || sw_design_equal (d, sw_document_get_design (self->document)))
    {
      sw_design_free (d);
      return;
    }
  sw_document_commit (self->document, d, merge);
}

static void
mode_cb (GtkDropDown *dd, GParamSpec *pspec, SwStagingPage *self)
{
  SwDesign *d;

  if (self->updating > 0 || self->document == NULL)
    return;
  d = sw_document_dup_design (self->document);
  sw_economics_set_recovery_mode (&d->economics, gtk_drop_down_get_selected (dd));
  if (sw_design_equal (d, sw_document_get_design (self->document)))
    {
      sw_design_free (d);
      return;
    }
  sw_document_commit (self->document, d, "staging:mode");
}

static void
booster_mode_cb (GtkDropDown *dd, GParamSpec *pspec, SwStagingPage *self)
{
  SwDesign *d;

  if (self->updating > 0 || self->document == NULL)
    return;
  d = sw_document_dup_design (self->document);
  sw_economics_set_booster_recovery_mode (&d->economics, gtk_drop_down_get_selected (dd));
  if (sw_design_equal (d, sw_document_get_design (self->document)))
    {
      sw_design_free (d);
      return;
    }
  sw_document_commit (self->document, d, "staging:booster-mode");
}

/* The currency label: a named edit on Enter or when the field loses focus;
 * too long or with a control character, marked and nothing changed. */
static void
currency_commit (SwStagingPage *self)
{
  g_autoptr (GError) error = NULL;
  const char *text = gtk_editable_get_text (GTK_EDITABLE (self->currency));
  SwDesign *d;

  if (self->updating > 0 || self->document == NULL)
    return;
  d = sw_document_dup_design (self->document);
  if (!sw_economics_set_currency (&d->economics, text, &error))
    {
      gtk_widget_add_css_class (self->currency, "error");
      gtk_label_set_text (GTK_LABEL (self->currency_error), error->message);
      gtk_widget_set_visible (self->currency_error, TRUE);
      sw_design_free (d);
      return;
    }
  gtk_widget_remove_css_class (self->currency, "error");
  gtk_widget_set_visible (self->currency_error, FALSE);
  if (sw_design_equal (d, sw_document_get_design (self->document)))
    {
      sw_design_free (d);
      return;
    }
  sw_document_commit (self->document, d, "staging:currency");
}

static void
currency_activate_cb (GtkEntry *entry, SwStagingPage *self)
{
  currency_commit (self);
}

static void
currency_focus_leave_cb (GtkEventControllerFocus *focus, SwStagingPage *self)
{
  currency_commit (self);
}

/* Money beside the effort: the best count's at the design's cost of a
 * work-year, in its currency, never as a quote. */
static void
update_money (SwStagingPage *self)
{
  const SwStaging *s;
  g_autofree char *text = NULL;

  if (self->shown == NULL || !self->shown->staging_ok)
    {
      gtk_label_set_text (GTK_LABEL (self->money), "");
      return;
    }
  s = &self->shown->staging;
  if (s->has_money && s->best >= 0)
    {
      const SwStagingRow *r = &s->rows[s->best];
      const char *cur = sw_economics_currency_label (&self->shown->design->economics);
      g_autofree char *wy = sw_format_number (s->work_year_cost, 0);
      g_autofree char *dev = sw_format_money (r->development_work_years * s->work_year_cost);
      g_autofree char *cpf = sw_format_money ((s->design_reuses
                                                  ? r->cost_per_flight_reused_work_years
                                                  : r->cost_per_flight_work_years)
                                                 * s->work_year_cost);
      if (r->arrangement == SW_ARRANGEMENT_BOOSTERS)
        text = g_strdup_printf (_("At %s %s per work-year, the best row (%u stages with the "
                                  "boosters): development %s %s, per flight %s %s. %s"),
                                wy, cur, r->n_stages, dev, cur, cpf, cur,
                                sw_economics_money_note ());
      else
        text = g_strdup_printf (_("At %s %s per work-year, the best count (%u stages): "
                                  "development %s %s, per flight %s %s. %s"),
                                wy, cur, r->n_stages, dev, cur, cpf, cur,
                                sw_economics_money_note ());
    }
  else
    text = g_strdup (_("No cost of a work-year given: effort in work-years only (set it below "
                       "to see money)."));
  gtk_label_set_text (GTK_LABEL (self->money), text);
}

void
sw_staging_page_choose_carpet (SwStagingPage *self, const SwCarpetAxis *x, const SwCarpetAxis *y,
                               SwCarpetOutput output)
{
  g_return_if_fail (SW_IS_STAGING_PAGE (self) && x != NULL && y != NULL);
  self->axes[0] = self->chosen[0] = *x;
  self->axes[1] = self->chosen[1] = *y;
  self->output = output;
  self->axes_chosen = TRUE;
  self->updating++;
  gtk_drop_down_set_selected (GTK_DROP_DOWN (self->carpet_output), output);
  self->updating--;
  if (self->design != NULL)
    {
      sync_axes (self);
      if (read_axes (self))
        start_job (self);
    }
}

const SwCarpet *
sw_staging_page_get_carpet (SwStagingPage *self)
{
  g_return_val_if_fail (SW_IS_STAGING_PAGE (self), NULL);
  return self->shown != NULL ? self->shown->carpet : NULL;
}

GtkWidget *
sw_staging_page_get_carpet_control (SwStagingPage *self, SwCarpetControl control, guint axis)
{
  g_return_val_if_fail (SW_IS_STAGING_PAGE (self) && axis < 2, NULL);
  switch (control)
    {
    case SW_CARPET_CONTROL_PARAM:
      return self->axis_param[axis];
    case SW_CARPET_CONTROL_MIN:
      return self->axis_min[axis];
    case SW_CARPET_CONTROL_MAX:
      return self->axis_max[axis];
    case SW_CARPET_CONTROL_POINTS:
      return self->axis_n[axis];
    case SW_CARPET_CONTROL_OUTPUT:
      return self->carpet_output;
    case SW_CARPET_CONTROL_BUTTON:
      return self->carpet_button;
    case SW_CARPET_CONTROL_STATUS:
      return self->carpet_status;
    case SW_CARPET_CONTROL_MONEY:
      return self->carpet_money;
    case SW_CARPET_CONTROL_CURRENCY:
    default:
      return self->currency;
    }
}

/* The parameter at @index of the axes' menus. */
gboolean
sw_staging_page_get_param (SwStagingPage *self, guint index, SwCarpetAxis *out)
{
  g_return_val_if_fail (SW_IS_STAGING_PAGE (self) && out != NULL, FALSE);
  if (index >= self->n_params)
    return FALSE;
  *out = self->params[index];
  return TRUE;
}

gboolean
sw_staging_page_is_busy (SwStagingPage *self)
{
  g_return_val_if_fail (SW_IS_STAGING_PAGE (self), FALSE);
  return self->running != NULL;
}

void
sw_staging_page_scroll_to_carpet (SwStagingPage *self)
{
  GtkAdjustment *adj;
  graphene_point_t p;

  g_return_if_fail (SW_IS_STAGING_PAGE (self));
  adj = gtk_scrolled_window_get_vadjustment (GTK_SCROLLED_WINDOW (self->scroller));
  /* The plot's foot at the foot of the view, the controls above it. */
  if (gtk_widget_compute_point (self->carpet, self->box,
                                &GRAPHENE_POINT_INIT (0, gtk_widget_get_height (self->carpet)),
                                &p))
    gtk_adjustment_set_value (adj, p.y + 8.0 - gtk_adjustment_get_page_size (adj));
}

gboolean
sw_staging_page_is_ready (SwStagingPage *self)
{
  g_return_val_if_fail (SW_IS_STAGING_PAGE (self), FALSE);
  return self->running == NULL && self->shown != NULL;
}

const SwStaging *
sw_staging_page_get_staging (SwStagingPage *self)
{
  g_return_val_if_fail (SW_IS_STAGING_PAGE (self), NULL);
  return self->shown != NULL && self->shown->staging_ok ? &self->shown->staging : NULL;
}

const char *
sw_staging_page_get_weighting (SwStagingPage *self)
{
  g_return_val_if_fail (SW_IS_STAGING_PAGE (self), NULL);
  return gtk_label_get_text (GTK_LABEL (self->statement));
}

/* ---- drawing ------------------------------------------------------------- */

static double
measure_cb (const char *text, gboolean horizontal, gpointer data)
{
  PangoLayout *layout = data;
  int w, h;

  pango_layout_set_text (layout, text, -1);
  pango_layout_get_pixel_size (layout, &w, &h);
  return horizontal ? w : h;
}

static void
show_text (cairo_t *cr, PangoLayout *layout, const char *text, double x, double y,
           double align_x, double align_y)
{
  int w, h;

  pango_layout_set_text (layout, text, -1);
  pango_layout_get_pixel_size (layout, &w, &h);
  cairo_move_to (cr, x - align_x * w, y - align_y * h);
  pango_cairo_show_layout (cr, layout);
}

static void
set_rgba (cairo_t *cr, const GdkRGBA *c, double alpha)
{
  cairo_set_source_rgba (cr, c->red, c->green, c->blue, c->alpha * alpha);
}

typedef struct {
  const char *title;
  const char *format;
  double      scale;
  gsize       offset;       /* the row's value */
  gsize       offset2;      /* a second series (recovered), or 0 */
} Panel;

static double
row_value (const SwStagingRow *row, gsize offset)
{
  return *(const double *) ((const char *) row + offset);
}

static void
draw_decision (GtkDrawingArea *area, cairo_t *cr, int width, int height, gpointer data)
{
  SwStagingPage *self = data;
  GtkWidget *w = GTK_WIDGET (area);
  const Panel panels[] = {
    { N_("Liftoff mass"), N_("%.4g t"), 1000.0, G_STRUCT_OFFSET (SwStagingRow, liftoff_mass_kg),
      G_STRUCT_OFFSET (SwStagingRow, liftoff_mass_reused_kg) },
    { N_("Development, work-years"), "%.3g", 1.0,
      G_STRUCT_OFFSET (SwStagingRow, development_work_years),
      G_STRUCT_OFFSET (SwStagingRow, development_reused_work_years) },
    { N_("Per flight, work-years"), "%.3g", 1.0,
      G_STRUCT_OFFSET (SwStagingRow, cost_per_flight_work_years),
      G_STRUCT_OFFSET (SwStagingRow, cost_per_flight_reused_work_years) },
    { N_("Mission success, %"), "%.4g", 0.01, G_STRUCT_OFFSET (SwStagingRow, success_probability),
      0 },
    { N_("Payload, this liftoff mass"), N_("%.3g t"), 1000.0,
      G_STRUCT_OFFSET (SwStagingRow, payload_fixed_size_kg), 0 },
  };
  const guint n_panels = G_N_ELEMENTS (panels);
  g_autoptr (PangoLayout) layout = gtk_widget_create_pango_layout (w, NULL);
  GdkRGBA fg, c_exp, c_rec, c_best, c_mark, c_boost;
  const SwStaging *s;
  const SwStagingRow *own_row;
  double panel_w, panel_h, left = 8.0;
  const guint cols = 3;

  sw_plot_style_fg (w, &fg);
  sw_plot_palette_color (w, 0, &c_exp);
  sw_plot_palette_color (w, 1, &c_rec);
  sw_plot_palette_color (w, 2, &c_best);
  sw_plot_palette_color (w, 4, &c_mark);
  sw_plot_palette_color (w, 3, &c_boost);
  if (self->shown == NULL || !self->shown->staging_ok)
    {
      set_rgba (cr, &fg, 0.7);
      show_text (cr, layout, _("Computing the staging decision…"), width / 2.0, height / 2.0,
                 0.5, 0.5);
      return;
    }
  s = &self->shown->staging;
  own_row = s->design_index >= 0 ? &s->rows[s->design_index] : NULL;
  /* Three panels a row, two rows: every panel the same x scale. */
  panel_w = (width - left) / cols;
  panel_h = height / 2.0;
  cairo_set_line_width (cr, 1.0);
  for (guint p = 0; p < n_panels; p++)
    {
      SwPlotAxis xa, ya;
      double x0 = left + (p % cols) * panel_w, y0 = (p / cols) * panel_h;
      double lo = INFINITY, hi = -INFINITY;
      double plot_l = x0 + 52.0, plot_r = x0 + panel_w - 12.0, plot_t = y0 + 24.0;
      double plot_b = y0 + panel_h - 36.0;
      gboolean any = FALSE;

      for (guint i = 0; i < s->n_rows; i++)
        for (guint k = 0; k < 2; k++)
          {
            gsize off = k == 0 ? panels[p].offset : panels[p].offset2;
            double v;
            if (k == 1 && off == 0)
              continue;
            v = row_value (&s->rows[i], off);
            if (isfinite (v))
              {
                lo = MIN (lo, v);
                hi = MAX (hi, v);
                any = TRUE;
              }
          }
      set_rgba (cr, &fg, 1.0);
      show_text (cr, layout, _(panels[p].title), (plot_l + plot_r) / 2.0, y0 + 2.0, 0.5, 0.0);
      if (!any)
        {
          set_rgba (cr, &fg, 0.6);
          show_text (cr, layout, _("no reliability keys"), (plot_l + plot_r) / 2.0,
                     (plot_t + plot_b) / 2.0, 0.5, 0.5);
          continue;
        }
      if (lo == hi)
        {
          lo -= fabs (lo) * 0.05 + 1e-9;
          hi += fabs (hi) * 0.05 + 1e-9;
        }
      /* One x scale for every panel: stage counts 1 to 6. */
      sw_plot_axis_init (&xa);
      xa.integer = TRUE;
      xa.fixed_min = 0.5;
      xa.fixed_max = SW_STAGING_MAX_STAGES + 0.5;
      sw_plot_axis_set_format (&xa, "%.0f", 1.0);
      sw_plot_axis_compute (&xa, 1, SW_STAGING_MAX_STAGES, plot_l, plot_r, TRUE, measure_cb,
                            layout);
      sw_plot_axis_init (&ya);
      sw_plot_axis_set_format (&ya, _(panels[p].format), panels[p].scale);
      sw_plot_axis_compute (&ya, lo, hi, plot_b, plot_t, FALSE, measure_cb, layout);

      /* The best count, highlighted; this design's count, marked. */
      if (s->best >= 0)
        {
          double bx = sw_plot_axis_map (&xa, s->rows[s->best].n_stages);
          set_rgba (cr, &c_best, 0.25);
          double half = 0.4 * (plot_r - plot_l) / SW_STAGING_MAX_STAGES;
          cairo_rectangle (cr, bx - half, plot_t, 2.0 * half, plot_b - plot_t);
          cairo_fill (cr);
        }
      if (own_row != NULL)
        {
          double dx = sw_plot_axis_map (&xa, own_row->n_stages);
          const double dash[] = { 4.0, 3.0 };
          set_rgba (cr, &c_mark, 1.0);
          cairo_set_dash (cr, dash, 2, 0.0);
          cairo_move_to (cr, dx, plot_t);
          cairo_line_to (cr, dx, plot_b);
          cairo_stroke (cr);
          cairo_set_dash (cr, NULL, 0, 0.0);
        }
      /* Frame and ticks. */
      set_rgba (cr, &fg, 0.8);
      cairo_rectangle (cr, plot_l, plot_t, plot_r - plot_l, plot_b - plot_t);
      cairo_stroke (cr);
      /* Every stage count labelled: the shared x scale. */
      for (guint n = 1; n <= SW_STAGING_MAX_STAGES; n++)
        {
          g_autofree char *text = g_strdup_printf ("%u", n);
          show_text (cr, layout, text, sw_plot_axis_map (&xa, n), plot_b + 2.0, 0.5, 0.0);
        }
      for (guint t = 0; t < ya.ticks->len; t++)
        {
          const SwPlotTick *tk = &g_array_index (ya.ticks, SwPlotTick, t);
          double ty = sw_plot_axis_map (&ya, tk->value);
          if (!tk->major || ty < plot_t - 0.5 || ty > plot_b + 0.5)
            continue;
          cairo_move_to (cr, plot_l - 3.0, ty);
          cairo_line_to (cr, plot_l, ty);
          cairo_stroke (cr);
          if (tk->labelled && tk->text != NULL)
            show_text (cr, layout, tk->text, plot_l - 4.0, ty, 1.0, 0.5);
        }
      /* The series: expendable solid, recovered dashed; the rows with the
       * design's boosters in their own colour with square markers (dotted
       * when the core is recovered), drawn first so that the serial ones
       * stay on top where they coincide (mission success). */
      for (int a = s->booster_count > 0 ? 1 : 0; a >= 0; a--)
        for (guint k = 0; k < 2; k++)
          {
            SwArrangement arr = a == 1 ? SW_ARRANGEMENT_BOOSTERS : SW_ARRANGEMENT_SERIAL;
            gsize off = k == 0 ? panels[p].offset : panels[p].offset2;
            gboolean pen = FALSE;
            const double dash[] = { 5.0, 3.0 }, dot[] = { 2.0, 2.5 };

            if (k == 1 && off == 0)
              continue;
            set_rgba (cr, a == 1 ? &c_boost : k == 0 ? &c_exp : &c_rec, 1.0);
            cairo_set_line_width (cr, 2.0);
            if (k == 1)
              cairo_set_dash (cr, a == 1 ? dot : dash, 2, 0.0);
            for (guint i = 0; i < s->n_rows; i++)
              {
                double v = row_value (&s->rows[i], off);
                double px = sw_plot_axis_map (&xa, s->rows[i].n_stages);
                if (s->rows[i].arrangement != arr)
                  continue;
                if (!isfinite (v))
                  {
                    pen = FALSE;
                    continue;
                  }
                if (pen)
                  cairo_line_to (cr, px, sw_plot_axis_map (&ya, v));
                else
                  cairo_move_to (cr, px, sw_plot_axis_map (&ya, v));
                pen = TRUE;
              }
            cairo_stroke (cr);
            cairo_set_dash (cr, NULL, 0, 0.0);
            for (guint i = 0; i < s->n_rows; i++)
              {
                double v = row_value (&s->rows[i], off);
                double px = sw_plot_axis_map (&xa, s->rows[i].n_stages);
                if (s->rows[i].arrangement != arr || !isfinite (v))
                  continue;
                if (a == 1)
                  cairo_rectangle (cr, px - 3.5, sw_plot_axis_map (&ya, v) - 3.5, 7.0, 7.0);
                else
                  cairo_arc (cr, px, sw_plot_axis_map (&ya, v), 3.0, 0, 2 * G_PI);
                cairo_fill (cr);
              }
          }
      /* This design's own point, ringed. */
      if (own_row != NULL && isfinite (row_value (own_row, panels[p].offset)))
        {
          set_rgba (cr, &c_mark, 1.0);
          cairo_set_line_width (cr, 1.5);
          cairo_new_sub_path (cr);
          cairo_arc (cr, sw_plot_axis_map (&xa, own_row->n_stages),
                     sw_plot_axis_map (&ya, row_value (own_row, panels[p].offset)), 6.5, 0,
                     2 * G_PI);
          cairo_stroke (cr);
        }
      /* A stage count whose vehicle does not close: a cross on the axis,
       * grey for a serial vehicle, in the boosters' colour a little higher
       * for one with them, so that a missing point is not read as a gap in
       * the data. */
      cairo_set_line_width (cr, 1.5);
      for (guint i = 0; i < s->n_rows; i++)
        if (!s->rows[i].feasible && !isfinite (row_value (&s->rows[i], panels[p].offset)))
          {
            gboolean boost = s->rows[i].arrangement == SW_ARRANGEMENT_BOOSTERS;
            double cx = sw_plot_axis_map (&xa, s->rows[i].n_stages);
            double cy = plot_b - (boost ? 18.0 : 7.0);
            if (boost)
              set_rgba (cr, &c_boost, 1.0);
            else
              set_rgba (cr, &fg, 0.55);
            cairo_move_to (cr, cx - 4, cy - 4);
            cairo_line_to (cr, cx + 4, cy + 4);
            cairo_move_to (cr, cx - 4, cy + 4);
            cairo_line_to (cr, cx + 4, cy - 4);
            cairo_stroke (cr);
          }
      cairo_set_line_width (cr, 1.0);
      set_rgba (cr, &fg, 0.8);
      show_text (cr, layout, _("stages"), (plot_l + plot_r) / 2.0, y0 + panel_h - 2.0, 0.5, 1.0);
      sw_plot_axis_clear (&xa);
      sw_plot_axis_clear (&ya);
    }

  /* The key, in the sixth place of the grid; its lines wrap to the place. */
  {
    double kx = left + (n_panels % cols) * panel_w + 16.0, ky = (n_panels / cols) * panel_h + 14.0;
    const double dash[] = { 5.0, 3.0 }, mdash[] = { 4.0, 3.0 };
    g_autofree char *words = sw_staging_dup_recovery_words (s);
    g_autofree char *rec = s->booster_reuse_mode == SW_RECOVERY_NONE
                             ? g_strdup_printf (_("first stage recovered, %s"),
                                                s->reuse_mode == SW_RECOVERY_LAUNCH_SITE
                                                  ? _("returns to the launch site")
                                                  : _("lands downrange"))
                             /* Translators: %s says how the first stage and the boosters are
                              * recovered */
                             : g_strdup_printf (_("recovered: %s"), words);
    g_autofree char *best = s->best < 0
                              ? g_strdup (_("no stage count closes"))
                              : s->rows[s->best].arrangement == SW_ARRANGEMENT_BOOSTERS
                              ? g_strdup_printf (_("best under the weights: %u stages with the "
                                                   "boosters"),
                                                 s->rows[s->best].n_stages)
                              : s->booster_count > 0
                              ? g_strdup_printf (_("best under the weights: %u serial stages"),
                                                 s->rows[s->best].n_stages)
                              : g_strdup_printf (_("best under the weights: %u stages"),
                                                 s->rows[s->best].n_stages);
    g_autofree char *own = own_row == NULL
                             ? g_strdup_printf (_("this design: %u stages"), s->design_row)
                             : own_row->arrangement == SW_ARRANGEMENT_BOOSTERS
                             ? g_strdup_printf (_("this design (ringed): %u stages + "
                                                  "boosters"),
                                                own_row->n_stages)
                             : g_strdup_printf (_("this design (ringed): %u stages"),
                                                own_row->n_stages);
    /* Translators: %u is the number of strap-on boosters */
    g_autofree char *boost = s->booster_reuse_mode == SW_RECOVERY_NONE
      ? g_strdup_printf (g_dngettext (GETTEXT_PACKAGE,
                                      "with the %u booster; dotted: core recovered",
                                      "with the %u boosters; dotted: core recovered",
                                      s->booster_count),
                         s->booster_count)
      /* Translators: %u is the number of strap-on boosters */
      : g_strdup_printf (g_dngettext (GETTEXT_PACKAGE,
                                      "with the %u booster; dotted: recovered as this design "
                                      "recovers",
                                      "with the %u boosters; dotted: recovered as this design "
                                      "recovers",
                                      s->booster_count),
                         s->booster_count);
    const char *texts[6] = { s->booster_count > 0 ? _("serial, expendable") : _("expendable"),
                             rec, boost, best, own,
                             s->booster_count > 0 ? _("does not close (grey: serial)")
                                                  : _("does not close") };
    int tw = (int) MAX (40.0, panel_w - 16.0 - 36.0 - 4.0);

    pango_layout_set_width (layout, tw * PANGO_SCALE);
    pango_layout_set_wrap (layout, PANGO_WRAP_WORD_CHAR);
    for (guint k = 0; k < G_N_ELEMENTS (texts); k++)
      {
        int th;
        double cy;

        if (k == 2 && s->booster_count == 0)
          continue;

        pango_layout_set_text (layout, texts[k], -1);
        pango_layout_get_pixel_size (layout, NULL, &th);
        cy = ky + MIN (th, 18) / 2.0;
        switch (k)
          {
          case 0:
          case 1:
            set_rgba (cr, k == 0 ? &c_exp : &c_rec, 1.0);
            cairo_set_line_width (cr, 2.0);
            cairo_set_dash (cr, dash, k == 1 ? 2 : 0, 0.0);
            cairo_move_to (cr, kx, cy);
            cairo_line_to (cr, kx + 28, cy);
            cairo_stroke (cr);
            cairo_set_dash (cr, NULL, 0, 0.0);
            cairo_arc (cr, kx + 14, cy, 3.0, 0, 2 * G_PI);
            cairo_fill (cr);
            break;
          case 2:
            {
              const double dot[] = { 2.0, 2.5 };
              set_rgba (cr, &c_boost, 1.0);
              cairo_set_line_width (cr, 2.0);
              cairo_move_to (cr, kx, cy - 3);
              cairo_line_to (cr, kx + 28, cy - 3);
              cairo_stroke (cr);
              cairo_set_dash (cr, dot, 2, 0.0);
              cairo_move_to (cr, kx, cy + 4);
              cairo_line_to (cr, kx + 28, cy + 4);
              cairo_stroke (cr);
              cairo_set_dash (cr, NULL, 0, 0.0);
              cairo_rectangle (cr, kx + 10.5, cy - 6.5, 7.0, 7.0);
              cairo_fill (cr);
            }
            break;
          case 3:
            set_rgba (cr, &c_best, 0.25);
            cairo_rectangle (cr, kx + 6, cy - 9, 16, 18);
            cairo_fill (cr);
            break;
          case 4:
            set_rgba (cr, &c_mark, 1.0);
            cairo_set_line_width (cr, 1.0);
            cairo_set_dash (cr, mdash, 2, 0.0);
            cairo_move_to (cr, kx + 14, cy - 9);
            cairo_line_to (cr, kx + 14, cy + 9);
            cairo_stroke (cr);
            cairo_set_dash (cr, NULL, 0, 0.0);
            if (own_row != NULL)
              {
                cairo_set_line_width (cr, 1.5);
                cairo_new_sub_path (cr);
                cairo_arc (cr, kx + 14, cy, 6.5, 0, 2 * G_PI);
                cairo_stroke (cr);
              }
            break;
          default:
            set_rgba (cr, &fg, 0.55);
            cairo_set_line_width (cr, 1.5);
            cairo_move_to (cr, kx + 10, cy - 4);
            cairo_line_to (cr, kx + 18, cy + 4);
            cairo_move_to (cr, kx + 10, cy + 4);
            cairo_line_to (cr, kx + 18, cy - 4);
            cairo_stroke (cr);
            break;
          }
        set_rgba (cr, &fg, 1.0);
        cairo_move_to (cr, kx + 36, ky);
        pango_cairo_show_layout (cr, layout);
        ky += MAX (th, 18) + 5.0;
      }
  }
}

/* Contour lines by marching squares, linear interpolation on each edge. */
static void
contour (cairo_t *cr, const SwCarpet *c, const double *grid, const SwPlotAxis *xa,
         const SwPlotAxis *ya, double level)
{
  for (guint j = 0; j + 1 < c->y.n; j++)
    for (guint i = 0; i + 1 < c->x.n; i++)
      {
        const double v[4] = { grid[j * c->x.n + i], grid[j * c->x.n + i + 1],
                              grid[(j + 1) * c->x.n + i + 1], grid[(j + 1) * c->x.n + i] };
        const double cx[4] = { i, i + 1, i + 1, i }, cy[4] = { j, j, j + 1, j + 1 };
        double px[4], py[4];
        guint n = 0;

        if (!isfinite (v[0]) || !isfinite (v[1]) || !isfinite (v[2]) || !isfinite (v[3]))
          continue;
        for (guint e = 0; e < 4 && n < 4; e++)
          {
            double a = v[e], b = v[(e + 1) % 4];
            if ((a < level) != (b < level))
              {
                double t = (level - a) / (b - a);
                double gi = cx[e] + t * (cx[(e + 1) % 4] - cx[e]);
                double gj = cy[e] + t * (cy[(e + 1) % 4] - cy[e]);
                px[n] = sw_plot_axis_map (xa, c->x.min + gi * (c->x.max - c->x.min) / (c->x.n - 1));
                py[n] = sw_plot_axis_map (ya, c->y.min + gj * (c->y.max - c->y.min) / (c->y.n - 1));
                n++;
              }
          }
        for (guint k = 0; k + 1 < n; k += 2)
          {
            cairo_move_to (cr, px[k], py[k]);
            cairo_line_to (cr, px[k + 1], py[k + 1]);
          }
      }
  cairo_stroke (cr);
}

/* A contour level's text: masses by the one formatter, effort in
 * work-years, money (@money) with the carpet's currency. */
static char *
level_text (const SwCarpet *c, gboolean money, double level)
{
  SwCarpetOutput output = c->output;

  if (money)
    {
      g_autofree char *n = sw_format_money (level);
      return g_strdup_printf ("%s %s", n, c->currency[0] != '\0' ? c->currency
                                                                   : _("money units"));
    }
  if (output == SW_CARPET_DEVELOPMENT || output == SW_CARPET_COST_PER_FLIGHT)
    {
      g_autofree char *n = sw_format_number (level, 0);
      return g_strdup_printf (_("%s wy"), n);
    }
  return sw_format_mass (level);
}

static const char *
output_words (SwCarpetOutput output)
{
  switch (output)
    {
    case SW_CARPET_PAYLOAD:
      return _("lines: payload of a vehicle of this design's liftoff mass (kg or t)");
    case SW_CARPET_DEVELOPMENT:
      return _("lines: development effort (wy: work-years)");
    case SW_CARPET_COST_PER_FLIGHT:
      return _("lines: cost per flight, expendable (wy: work-years)");
    case SW_CARPET_LIFTOFF_MASS:
    default:
      return _("lines: liftoff mass (kg or t)");
    }
}

/* The key of money contours: what they are and that they are no quote. */
static char *
money_words (const SwCarpet *c)
{
  g_autofree char *wy = sw_format_number (c->work_year_cost, 0);
  const char *cur = c->currency[0] != '\0' ? c->currency : _("money units");

  if (c->output == SW_CARPET_DEVELOPMENT)
    /* Translators: %s a currency, %s a cost of a work-year, %s the currency again */
    return g_strdup_printf (_("lines: development cost in %s (work-years at %s %s each: an "
                              "estimate, never a quote)"), cur, wy, cur);
  /* Translators: %s a currency, %s a cost of a work-year, %s the currency again */
  return g_strdup_printf (_("lines: cost per flight, expendable, in %s (work-years at %s %s "
                            "each: an estimate, never a quote)"), cur, wy, cur);
}

/* Text on a patch of the background, so that no line runs through it. */
static void
show_text_boxed (cairo_t *cr, PangoLayout *layout, const char *text, double x, double y,
                 double align_x, double align_y, const GdkRGBA *bg, const GdkRGBA *fg)
{
  int w, h;

  pango_layout_set_text (layout, text, -1);
  pango_layout_get_pixel_size (layout, &w, &h);
  set_rgba (cr, bg, 0.85);
  cairo_rectangle (cr, x - align_x * w - 2, y - align_y * h, w + 4, h);
  cairo_fill (cr);
  set_rgba (cr, fg, 1.0);
  cairo_move_to (cr, x - align_x * w, y - align_y * h);
  pango_cairo_show_layout (cr, layout);
}

/* A contour level's label where its line crosses the middle column (lines
 * that run across) or the middle row (lines that run up), else a quarter
 * in; never on the design's mark or on a label already placed. */
static void
place_level_label (cairo_t *cr, PangoLayout *layout, const SwCarpet *c, const double *grid,
                   const SwPlotAxis *xa, const SwPlotAxis *ya, double level, const char *label,
                   double mx, double my, GArray *placed, const GdkRGBA *bg, const GdkRGBA *fg)
{
  const guint cols[] = { c->x.n / 2, c->x.n / 4, (3 * c->x.n) / 4 };
  const guint rows[] = { c->y.n / 2, c->y.n / 5, (4 * c->y.n) / 5 };
  double l = MIN (xa->p0, xa->p1), r = MAX (xa->p0, xa->p1);
  double t = MIN (ya->p0, ya->p1), b = MAX (ya->p0, ya->p1);
  int lw, lh;

  pango_layout_set_text (layout, label, -1);
  pango_layout_get_pixel_size (layout, &lw, &lh);
  for (guint pass = 0; pass < 6; pass++)
    {
      gboolean along_column = pass % 2 == 0;
      guint fixed = along_column ? cols[pass / 2] : rows[pass / 2];
      guint n = along_column ? c->y.n : c->x.n;

      for (guint k = 0; k + 1 < n; k++)
        {
          gsize i0 = along_column ? (gsize) k * c->x.n + fixed : (gsize) fixed * c->x.n + k;
          gsize i1 = along_column ? i0 + c->x.n : i0 + 1;
          double a = grid[i0], bb = grid[i1], tt, px, py;
          graphene_rect_t box;
          gboolean clear = TRUE;

          if (!isfinite (a) || !isfinite (bb) || (a < level) == (bb < level))
            continue;
          tt = (level - a) / (bb - a);
          if (along_column)
            {
              px = sw_plot_axis_map (xa, sw_carpet_axis_value (&c->x, fixed));
              py = sw_plot_axis_map (ya, sw_carpet_axis_value (&c->y, k)
                                           + tt * (sw_carpet_axis_value (&c->y, k + 1)
                                                   - sw_carpet_axis_value (&c->y, k)));
            }
          else
            {
              px = sw_plot_axis_map (xa, sw_carpet_axis_value (&c->x, k)
                                           + tt * (sw_carpet_axis_value (&c->x, k + 1)
                                                   - sw_carpet_axis_value (&c->x, k)));
              py = sw_plot_axis_map (ya, sw_carpet_axis_value (&c->y, fixed));
            }
          /* Inside the frame, clear of the tick labels. */
          px = CLAMP (px, l + lw / 2.0 + 3.0, r - lw / 2.0 - 3.0);
          py = CLAMP (py, t + lh / 2.0 + 1.0, b - lh / 2.0 - 1.0);
          graphene_rect_init (&box, px - lw / 2.0 - 4.0, py - lh / 2.0 - 2.0, lw + 8.0, lh + 4.0);
          if (isfinite (mx) && fabs (px - mx) < lw / 2.0 + 80.0 && fabs (py - my) < lh + 12.0)
            clear = FALSE;
          for (guint q = 0; q < placed->len && clear; q++)
            clear = !graphene_rect_intersection (&box, &g_array_index (placed, graphene_rect_t, q),
                                                 NULL);
          if (!clear)
            continue;
          g_array_append_val (placed, box);
          show_text_boxed (cr, layout, label, px, py, 0.5, 0.5, bg, fg);
          return;
        }
    }
}

static void
draw_carpet (GtkDrawingArea *area, cairo_t *cr, int width, int height, gpointer data)
{
  SwStagingPage *self = data;
  GtkWidget *w = GTK_WIDGET (area);
  g_autoptr (PangoLayout) layout = gtk_widget_create_pango_layout (w, NULL);
  GdkRGBA fg, bg, line, mark;
  const SwCarpet *c;
  SwPlotAxis xa, ya;
  double l = 84.0, r = width - 16.0, t = 10.0, b, lo = INFINITY, hi = -INFINITY;
  double step, mx = NAN, my = NAN;
  int text_h, legend_h = 0;
  g_autoptr (PangoLayout) legend_layout = NULL;
  g_autofree char *xn = NULL, *yn = NULL;
  gboolean money;
  const double *grid;

  sw_plot_style_fg (w, &fg);
  sw_plot_style_bg (w, &bg);
  sw_plot_palette_color (w, 0, &line);
  sw_plot_palette_color (w, 4, &mark);
  if (self->shown == NULL || self->shown->carpet == NULL)
    {
      set_rgba (cr, &fg, 0.7);
      show_text (cr, layout,
                 self->running != NULL ? _("Computing the carpet…")
                                       : _("No carpet: see the message above."),
                 width / 2.0, height / 2.0, 0.5, 0.5);
      return;
    }
  c = self->shown->carpet;
  money = c->has_money && gtk_widget_get_visible (self->carpet_money)
          && gtk_check_button_get_active (GTK_CHECK_BUTTON (self->carpet_money));
  grid = money ? c->money : c->values;
  pango_layout_set_text (layout, "0", -1);
  pango_layout_get_pixel_size (layout, NULL, &text_h);
  /* The key under the axis names, wrapped to the width: its own layout. */
  legend_layout = gtk_widget_create_pango_layout (w, NULL);
  {
    g_autofree char *words = money ? money_words (c) : g_strdup (output_words (c->output));
    g_autofree char *legend = g_strdup_printf (_("%s; hatched: the vehicle does not close; "
                                                 "✕: this design"),
                                               words);
    pango_layout_set_text (legend_layout, legend, -1);
    pango_layout_set_width (legend_layout, (int) MAX (40.0, width - 8.0) * PANGO_SCALE);
    pango_layout_set_wrap (legend_layout, PANGO_WRAP_WORD);
    pango_layout_set_alignment (legend_layout, PANGO_ALIGN_CENTER);
    pango_layout_get_pixel_size (legend_layout, NULL, &legend_h);
  }
  b = height - legend_h - 2.0 * text_h - 12.0;
  sw_plot_axis_init (&xa);
  sw_plot_axis_set_format (&xa, "%.4g", 1.0);
  xa.fixed_min = c->x.min;
  xa.fixed_max = c->x.max;
  xa.integer = sw_carpet_param_is_whole (&c->x);
  sw_plot_axis_compute (&xa, c->x.min, c->x.max, l, r, TRUE, measure_cb, layout);
  sw_plot_axis_init (&ya);
  sw_plot_axis_set_format (&ya, "%.4g", 1.0);
  ya.fixed_min = c->y.min;
  ya.fixed_max = c->y.max;
  ya.integer = sw_carpet_param_is_whole (&c->y);
  sw_plot_axis_compute (&ya, c->y.min, c->y.max, b, t, FALSE, measure_cb, layout);
  if (isfinite (c->design_x) && isfinite (c->design_y))
    {
      mx = sw_plot_axis_map (&xa, c->design_x);
      my = sw_plot_axis_map (&ya, c->design_y);
    }

  /* Infeasible cells hatched. */
  cairo_save (cr);
  cairo_rectangle (cr, l, t, r - l, b - t);
  cairo_clip (cr);
  if (c->n_infeasible > 0)
    {
      /* One rectangle per run of infeasible points in a row, its edges
       * half-way to the neighbours, not antialiased: a fine grid hatches
       * as solidly as a coarse one, without seams. */
      double dx = (r - l) / (c->x.n - 1), dy = (b - t) / (c->y.n - 1);
      cairo_set_antialias (cr, CAIRO_ANTIALIAS_NONE);
      for (guint j = 0; j < c->y.n; j++)
        for (guint i = 0; i < c->x.n; i++)
          if (!c->feasible[j * c->x.n + i])
            {
              guint i1 = i;
              double x0, x1, cy;
              while (i1 + 1 < c->x.n && !c->feasible[j * c->x.n + i1 + 1])
                i1++;
              x0 = sw_plot_axis_map (&xa, sw_carpet_axis_value (&c->x, i)) - dx / 2;
              x1 = sw_plot_axis_map (&xa, sw_carpet_axis_value (&c->x, i1)) + dx / 2;
              cy = sw_plot_axis_map (&ya, sw_carpet_axis_value (&c->y, j));
              cairo_rectangle (cr, x0, cy - dy / 2, x1 - x0, dy);
              i = i1;
            }
      cairo_clip (cr);
      cairo_set_antialias (cr, CAIRO_ANTIALIAS_DEFAULT);
      set_rgba (cr, &fg, 0.45);
      for (double k = -(b - t); k < (r - l); k += 8.0)
        {
          cairo_move_to (cr, l + k, b);
          cairo_line_to (cr, l + k + (b - t), t);
        }
      cairo_stroke (cr);
    }
  cairo_restore (cr);

  /* Contours at nice levels. */
  for (guint k = 0; k < c->x.n * c->y.n; k++)
    if (isfinite (grid[k]))
      {
        lo = MIN (lo, grid[k]);
        hi = MAX (hi, grid[k]);
      }
  if (isfinite (lo) && hi > lo)
    {
      GArray *placed = g_array_new (FALSE, FALSE, sizeof (graphene_rect_t));
      step = sw_plot_nice_step (hi - lo, 8.0);
      cairo_set_line_width (cr, 1.5);
      for (double level = ceil (lo / step) * step; level <= hi; level += step)
        {
          g_autofree char *label = level_text (c, money, level);
          set_rgba (cr, &line, 1.0);
          contour (cr, c, grid, &xa, &ya, level);
          place_level_label (cr, layout, c, grid, &xa, &ya, level, label, mx, my, placed, &bg,
                             &fg);
        }
      g_array_unref (placed);
    }
  /* Frame, ticks, axis names with units. */
  cairo_set_line_width (cr, 1.0);
  set_rgba (cr, &fg, 0.8);
  cairo_rectangle (cr, l, t, r - l, b - t);
  cairo_stroke (cr);
  for (guint k = 0; k < xa.ticks->len; k++)
    {
      const SwPlotTick *tk = &g_array_index (xa.ticks, SwPlotTick, k);
      double tx = sw_plot_axis_map (&xa, tk->value);
      if (tx < l - 0.5 || tx > r + 0.5)
        continue;
      cairo_move_to (cr, tx, b);
      cairo_line_to (cr, tx, b + 3);
      cairo_stroke (cr);
      if (tk->labelled && tk->text != NULL)
        {
          /* The last label kept inside the drawing. */
          int tw;
          pango_layout_set_text (layout, tk->text, -1);
          pango_layout_get_pixel_size (layout, &tw, NULL);
          show_text (cr, layout, tk->text, MIN (tx, width - 2.0 - tw / 2.0), b + 3, 0.5, 0.0);
        }
    }
  for (guint k = 0; k < ya.ticks->len; k++)
    {
      const SwPlotTick *tk = &g_array_index (ya.ticks, SwPlotTick, k);
      double ty = sw_plot_axis_map (&ya, tk->value);
      if (ty < t - 0.5 || ty > b + 0.5)
        continue;
      cairo_move_to (cr, l - 3, ty);
      cairo_line_to (cr, l, ty);
      cairo_stroke (cr);
      if (tk->labelled && tk->text != NULL)
        show_text (cr, layout, tk->text, l - 5, ty, 1.0, 0.5);
    }
  xn = axis_label_with_unit (&c->x);
  yn = axis_label_with_unit (&c->y);
  set_rgba (cr, &fg, 1.0);
  show_text (cr, layout, xn, (l + r) / 2, b + 4 + text_h, 0.5, 0.0);
  cairo_save (cr);
  cairo_translate (cr, 4, (t + b) / 2);
  cairo_rotate (cr, -G_PI / 2);
  show_text (cr, layout, yn, 0, 0, 0.5, 0.0);
  cairo_restore (cr);
  set_rgba (cr, &fg, 0.8);
  cairo_move_to (cr, 4.0, height - 2.0 - legend_h);
  pango_cairo_show_layout (cr, legend_layout);
  /* This design, its label on the background. */
  if (isfinite (mx) && mx >= l - 0.5 && mx <= r + 0.5 && my >= t - 0.5 && my <= b + 0.5)
    {
      double lx = mx + 10 < r - 90 ? mx + 10 : mx - 10;
      set_rgba (cr, &mark, 1.0);
      cairo_set_line_width (cr, 2.5);
      cairo_move_to (cr, mx - 6, my - 6);
      cairo_line_to (cr, mx + 6, my + 6);
      cairo_move_to (cr, mx - 6, my + 6);
      cairo_line_to (cr, mx + 6, my - 6);
      cairo_stroke (cr);
      show_text_boxed (cr, layout, _("this design"), lx, my - 8, lx > mx ? 0.0 : 1.0, 1.0,
                       &bg, &mark);
    }
  else if (isfinite (c->design_x) && isfinite (c->design_y))
    {
      set_rgba (cr, &mark, 1.0);
      show_text (cr, layout, _("this design lies outside the ranges"), r - 4, t + 2, 1.0, 0.0);
    }
  sw_plot_axis_clear (&xa);
  sw_plot_axis_clear (&ya);
}

static void
sw_staging_page_dispose (GObject *object)
{
  SwStagingPage *self = SW_STAGING_PAGE (object);

  if (self->running != NULL)
    {
      g_cancellable_cancel (self->running->cancellable);
      g_cancellable_cancel (self->running->carpet_cancel);
    }
  g_clear_pointer (&self->running, job_unref);
  g_clear_pointer (&self->shown, job_unref);
  g_clear_pointer (&self->pending, sw_analysis_unref);
  g_clear_pointer (&self->design, sw_design_free);
  g_clear_pointer (&self->looped, sw_design_free);
  g_clear_pointer (&self->rule_message, g_free);
  g_clear_handle_id (&self->progress_id, g_source_remove);
  g_clear_object (&self->document);
  g_clear_pointer (&self->scroller, gtk_widget_unparent);
  G_OBJECT_CLASS (sw_staging_page_parent_class)->dispose (object);
}

static void
sw_staging_page_map (GtkWidget *widget)
{
  SwStagingPage *self = SW_STAGING_PAGE (widget);

  GTK_WIDGET_CLASS (sw_staging_page_parent_class)->map (widget);
  if (self->pending != NULL)
    {
      g_autoptr (SwAnalysis) pending = g_steal_pointer (&self->pending);
      sw_staging_page_set_result (self, pending);
    }
}

static void
sw_staging_page_class_init (SwStagingPageClass *klass)
{
  G_OBJECT_CLASS (klass)->dispose = sw_staging_page_dispose;
  GTK_WIDGET_CLASS (klass)->map = sw_staging_page_map;
  gtk_widget_class_set_layout_manager_type (GTK_WIDGET_CLASS (klass), GTK_TYPE_BIN_LAYOUT);
  gtk_widget_class_set_css_name (GTK_WIDGET_CLASS (klass), "swstagingpage");
  signals[READY] = g_signal_new ("ready", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST, 0, NULL,
                                 NULL, NULL, G_TYPE_NONE, 0);
}

static void
sw_staging_page_init (SwStagingPage *self)
{
  GtkWidget *heading, *note;

  self->scroller = gtk_scrolled_window_new ();
  gtk_scrolled_window_set_policy (GTK_SCROLLED_WINDOW (self->scroller), GTK_POLICY_NEVER,
                                  GTK_POLICY_AUTOMATIC);
  gtk_widget_set_parent (self->scroller, GTK_WIDGET (self));
  self->box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 6);
  gtk_widget_set_margin_start (self->box, 8);
  gtk_widget_set_margin_end (self->box, 8);
  gtk_widget_set_margin_top (self->box, 8);
  gtk_widget_set_margin_bottom (self->box, 8);
  gtk_scrolled_window_set_child (GTK_SCROLLED_WINDOW (self->scroller), self->box);

  heading = gtk_label_new (_("The staging decision: one to six serial stages and, for a design "
                             "with strap-on boosters, one to six stages with its boosters beside "
                             "the core, each sized for this design's payload and mission."));
  gtk_label_set_wrap (GTK_LABEL (heading), TRUE);
  gtk_label_set_xalign (GTK_LABEL (heading), 0.0);
  gtk_box_append (GTK_BOX (self->box), heading);
  self->statement = gtk_label_new ("");
  gtk_label_set_wrap (GTK_LABEL (self->statement), TRUE);
  gtk_label_set_xalign (GTK_LABEL (self->statement), 0.0);
  gtk_box_append (GTK_BOX (self->box), self->statement);
  self->money = gtk_label_new ("");
  gtk_label_set_wrap (GTK_LABEL (self->money), TRUE);
  gtk_label_set_xalign (GTK_LABEL (self->money), 0.0);
  gtk_box_append (GTK_BOX (self->box), self->money);
  self->decision = gtk_drawing_area_new ();
  gtk_widget_set_size_request (self->decision, 300, 330);
  gtk_widget_set_vexpand (self->decision, TRUE);
  gtk_drawing_area_set_draw_func (GTK_DRAWING_AREA (self->decision), draw_decision, self, NULL);
  gtk_box_append (GTK_BOX (self->box), self->decision);
  note = gtk_label_new (_("Effort in work-years from the published statistical cost-model form "
                          "(coefficients from memory unless the design sets them): an estimate "
                          "for comparing concepts, never a quote."));
  gtk_label_set_wrap (GTK_LABEL (note), TRUE);
  gtk_label_set_xalign (GTK_LABEL (note), 0.0);
  gtk_widget_add_css_class (note, "dim-label");
  gtk_box_append (GTK_BOX (self->box), note);

  self->carpet_title = gtk_label_new (_("Carpet plot: liftoff mass, contour lines"));
  gtk_label_set_xalign (GTK_LABEL (self->carpet_title), 0.0);
  /* Wrapped: the longest title must not widen the window. */
  gtk_label_set_wrap (GTK_LABEL (self->carpet_title), TRUE);
  gtk_widget_add_css_class (self->carpet_title, "heading");
  gtk_box_append (GTK_BOX (self->box), self->carpet_title);
  {
    /* What to draw, and over which two inputs: a row per axis. */
    const char *outputs[] = { N_("Liftoff mass"), N_("Payload of a vehicle of this liftoff mass"),
                              N_("Development effort"), N_("Cost per flight (expendable)"),
                              NULL };
    const char *shown_outputs[5];
    const char *axis_names[2] = { N_("Across"), N_("Up") };
    GtkWidget *grid = gtk_grid_new ();

    gtk_grid_set_column_spacing (GTK_GRID (grid), 6);
    gtk_grid_set_row_spacing (GTK_GRID (grid), 4);
    for (guint i = 0; i < 4; i++)
      shown_outputs[i] = _(outputs[i]);
    shown_outputs[4] = NULL;
    self->carpet_output = gtk_drop_down_new_from_strings (shown_outputs);
    g_signal_connect (self->carpet_output, "notify::selected", G_CALLBACK (output_cb), self);
    gtk_grid_attach (GTK_GRID (grid), gtk_label_new (_("Contours of")), 0, 0, 1, 1);
    gtk_grid_attach (GTK_GRID (grid), self->carpet_output, 1, 0, 6, 1);
    for (guint a = 0; a < 2; a++)
      {
        GtkWidget *name = gtk_label_new (_(axis_names[a]));
        GtkWidget *from = gtk_label_new (_("from")), *to = gtk_label_new (_("to"));
        GtkWidget *points = gtk_label_new (_("points"));

        gtk_label_set_xalign (GTK_LABEL (name), 0.0);
        self->axis_param[a] = gtk_drop_down_new (NULL, NULL);
        gtk_widget_set_hexpand (self->axis_param[a], TRUE);
        g_signal_connect (self->axis_param[a], "notify::selected", G_CALLBACK (axis_param_cb),
                          self);
        self->axis_min[a] = sw_number_field_new ();
        self->axis_max[a] = sw_number_field_new ();
        self->axis_n[a] = sw_number_field_new ();
        sw_number_field_set_range (SW_NUMBER_FIELD (self->axis_n[a]), 2, SW_CARPET_MAX_POINTS,
                                   FALSE, "", 0, 1.0);
        sw_number_field_set_whole (SW_NUMBER_FIELD (self->axis_n[a]), TRUE);
        g_signal_connect (self->axis_min[a], "value-committed", G_CALLBACK (axis_field_cb), self);
        g_signal_connect (self->axis_max[a], "value-committed", G_CALLBACK (axis_field_cb), self);
        g_signal_connect (self->axis_n[a], "value-committed", G_CALLBACK (axis_field_cb), self);
        /* Two rows an axis, so that the controls fit the page's width. */
        gtk_grid_attach (GTK_GRID (grid), name, 0, 1 + 2 * a, 1, 1);
        gtk_grid_attach (GTK_GRID (grid), self->axis_param[a], 1, 1 + 2 * a, 6, 1);
        gtk_grid_attach (GTK_GRID (grid), from, 1, 2 + 2 * a, 1, 1);
        gtk_grid_attach (GTK_GRID (grid), self->axis_min[a], 2, 2 + 2 * a, 1, 1);
        gtk_grid_attach (GTK_GRID (grid), to, 3, 2 + 2 * a, 1, 1);
        gtk_grid_attach (GTK_GRID (grid), self->axis_max[a], 4, 2 + 2 * a, 1, 1);
        gtk_grid_attach (GTK_GRID (grid), self->axis_n[a], 5, 2 + 2 * a, 1, 1);
        gtk_grid_attach (GTK_GRID (grid), points, 6, 2 + 2 * a, 1, 1);
      }
    /* A view option, not a design key: the contours of the same grid in
     * money; shown when the carpet has it. */
    self->carpet_money = gtk_check_button_new_with_label (_("Cost in money"));
    gtk_widget_set_visible (self->carpet_money, FALSE);
    g_signal_connect (self->carpet_money, "toggled", G_CALLBACK (money_toggled_cb), self);
    gtk_grid_attach (GTK_GRID (grid), self->carpet_money, 1, 5, 6, 1);
    gtk_box_append (GTK_BOX (self->box), grid);
  }
  self->progress_row = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 6);
  self->progress = gtk_progress_bar_new ();
  gtk_widget_set_hexpand (self->progress, TRUE);
  gtk_widget_set_valign (self->progress, GTK_ALIGN_CENTER);
  gtk_box_append (GTK_BOX (self->progress_row), self->progress);
  gtk_widget_set_visible (self->progress_row, FALSE);
  gtk_box_append (GTK_BOX (self->box), self->progress_row);
  self->carpet_button = gtk_button_new_with_label (_("Cancel"));
  g_signal_connect (self->carpet_button, "clicked", G_CALLBACK (carpet_button_cb), self);
  gtk_widget_set_visible (self->carpet_button, FALSE);
  gtk_widget_set_halign (self->carpet_button, GTK_ALIGN_START);
  self->carpet_status = gtk_label_new ("");
  gtk_label_set_wrap (GTK_LABEL (self->carpet_status), TRUE);
  gtk_label_set_xalign (GTK_LABEL (self->carpet_status), 0.0);
  gtk_widget_set_visible (self->carpet_status, FALSE);
  gtk_widget_set_hexpand (self->carpet_status, TRUE);
  {
    GtkWidget *row = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 6);
    gtk_box_append (GTK_BOX (row), self->carpet_button);
    gtk_box_append (GTK_BOX (row), self->carpet_status);
    gtk_box_append (GTK_BOX (self->box), row);
  }
  self->carpet = gtk_drawing_area_new ();
  gtk_widget_set_size_request (self->carpet, 300, 420);
  gtk_widget_set_vexpand (self->carpet, TRUE);
  gtk_drawing_area_set_draw_func (GTK_DRAWING_AREA (self->carpet), draw_carpet, self, NULL);
  gtk_box_append (GTK_BOX (self->box), self->carpet);
  {
    static const char *const labels[SW_N_ECON_NUMBERS] = {
      [SW_ECON_WORK_YEAR_COST] = N_("Cost of a work-year"),
      [SW_ECON_PRODUCTION_RUN] = N_("Vehicles built"),
      [SW_ECON_LEARNING_RATE] = N_("Learning rate"),
      [SW_ECON_CER_FIRST + SW_CER_STAGE_DEV_FACTOR] = N_("Stage development a"),
      [SW_ECON_CER_FIRST + SW_CER_STAGE_DEV_EXPONENT] = N_("Stage development x"),
      [SW_ECON_CER_FIRST + SW_CER_STAGE_UNIT_FACTOR] = N_("Stage first unit b"),
      [SW_ECON_CER_FIRST + SW_CER_STAGE_UNIT_EXPONENT] = N_("Stage first unit y"),
      [SW_ECON_CER_FIRST + SW_CER_ENGINE_DEV_FACTOR] = N_("Engine development a"),
      [SW_ECON_CER_FIRST + SW_CER_ENGINE_DEV_EXPONENT] = N_("Engine development x"),
      [SW_ECON_CER_FIRST + SW_CER_ENGINE_UNIT_FACTOR] = N_("Engine first unit b"),
      [SW_ECON_CER_FIRST + SW_CER_ENGINE_UNIT_EXPONENT] = N_("Engine first unit y"),
      [SW_ECON_CER_FIRST + SW_CER_SYSTEMS_BASE] = N_("Systems factor per stage"),
      [SW_ECON_ENGINE_MASS_FRACTION] = N_("Engines in a stage's dry mass"),
      [SW_ECON_RECOVERY_DELTA_V] = N_("Recovery delta-v"),
      [SW_ECON_BOOSTER_RECOVERY_DELTA_V] = N_("Boosters' recovery delta-v"),
      [SW_ECON_LANDING_HARDWARE] = N_("Landing hardware"),
      [SW_ECON_REFURBISHMENT] = N_("Refurbishment"),
      [SW_ECON_FLIGHTS_PER_STAGE] = N_("Flights per stage"),
      [SW_ECON_WEIGHT_LIFTOFF_MASS] = N_("Weight: liftoff mass"),
      [SW_ECON_WEIGHT_DEVELOPMENT] = N_("Weight: development"),
      [SW_ECON_WEIGHT_COST_PER_FLIGHT] = N_("Weight: cost per flight"),
      [SW_ECON_WEIGHT_FAILURE] = N_("Weight: failure"),
    };
    GtkWidget *title = gtk_label_new (_("Cost model, recovery and weights (the design's "
                                        "economics keys)"));
    GtkWidget *grid = gtk_grid_new ();
    const char *modes[] = { N_("Expendable"), N_("Lands downrange"),
                            N_("Returns to the launch site"), NULL };
    const char *shown[4];

    gtk_grid_set_column_spacing (GTK_GRID (grid), 8);
    gtk_grid_set_row_spacing (GTK_GRID (grid), 4);
    for (guint k = 0; k < SW_N_ECON_NUMBERS; k++)
      {
        SwLimitId id = sw_economics_number_limit (k);
        gboolean percent = sw_limit_get (id)->max <= 1.0;
        GtkWidget *label = gtk_label_new (_(labels[k]));
        GtkWidget *field = sw_number_field_new ();
        /* The currency and its message follow the cost of a work-year. */
        /* ... and the boosters' mode comes before their delta-v. */
        int row = (int) k + (k == SW_ECON_WORK_YEAR_COST ? 1 : 3)
                  + (k >= SW_ECON_BOOSTER_RECOVERY_DELTA_V ? 1 : 0), col = 0;

        gtk_label_set_xalign (GTK_LABEL (label), 0.0);
        sw_number_field_set_limit (SW_NUMBER_FIELD (field), id, percent ? 100.0 : 1.0,
                                   sw_economics_number_is_whole (k) ? 0 : 3,
                                   sw_economics_number_is_whole (k) ? 1.0 : 0.01);
        sw_number_field_set_whole (SW_NUMBER_FIELD (field), sw_economics_number_is_whole (k));
        if (k == SW_ECON_WORK_YEAR_COST)
          sw_number_field_set_optional (SW_NUMBER_FIELD (field), TRUE, _("work-years only"));
        g_object_set_data (G_OBJECT (field), "sw-econ-key", GUINT_TO_POINTER (k));
        g_signal_connect (field, "value-committed", G_CALLBACK (field_committed_cb), self);
        gtk_widget_set_hexpand (field, TRUE);
        gtk_grid_attach (GTK_GRID (grid), label, col, row, 1, 1);
        gtk_grid_attach (GTK_GRID (grid), field, col + 1, row, 1, 1);
        self->fields[k] = field;
      }
    for (guint i = 0; i < 3; i++)
      shown[i] = _(modes[i]);
    shown[3] = NULL;
    self->mode = gtk_drop_down_new_from_strings (shown);
    g_signal_connect (self->mode, "notify::selected", G_CALLBACK (mode_cb), self);
    gtk_grid_attach (GTK_GRID (grid), gtk_label_new (_("First stage")), 0, 0, 1, 1);
    gtk_grid_attach (GTK_GRID (grid), self->mode, 1, 0, 1, 1);
    {
      /* The strap-on boosters' recovery (economics.recovery.booster_mode). */
      const char *bmodes[] = { N_("Boosters expended"), N_("Boosters land downrange"),
                               N_("Boosters return to the launch site"), NULL };
      const char *bshown[4];
      GtkWidget *label = gtk_label_new (_("Boosters"));

      for (guint i = 0; i < 3; i++)
        bshown[i] = _(bmodes[i]);
      bshown[3] = NULL;
      gtk_label_set_xalign (GTK_LABEL (label), 0.0);
      self->booster_mode = gtk_drop_down_new_from_strings (bshown);
      g_signal_connect (self->booster_mode, "notify::selected", G_CALLBACK (booster_mode_cb),
                        self);
      gtk_grid_attach (GTK_GRID (grid), label, 0, SW_ECON_BOOSTER_RECOVERY_DELTA_V + 3, 1, 1);
      gtk_grid_attach (GTK_GRID (grid), self->booster_mode, 1,
                       SW_ECON_BOOSTER_RECOVERY_DELTA_V + 3, 1, 1);
    }
    {
      GtkWidget *label = gtk_label_new (_("Currency"));
      GtkEventController *focus = gtk_event_controller_focus_new ();

      gtk_label_set_xalign (GTK_LABEL (label), 0.0);
      self->currency = gtk_entry_new ();
      gtk_entry_set_placeholder_text (GTK_ENTRY (self->currency), _("money units"));
      gtk_entry_set_max_length (GTK_ENTRY (self->currency), 0);
      g_signal_connect (self->currency, "activate", G_CALLBACK (currency_activate_cb), self);
      g_signal_connect (focus, "leave", G_CALLBACK (currency_focus_leave_cb), self);
      gtk_widget_add_controller (self->currency, focus);
      self->currency_error = gtk_label_new ("");
      gtk_label_set_xalign (GTK_LABEL (self->currency_error), 0.0);
      gtk_label_set_wrap (GTK_LABEL (self->currency_error), TRUE);
      gtk_widget_add_css_class (self->currency_error, "error");
      gtk_widget_set_visible (self->currency_error, FALSE);
      gtk_grid_attach (GTK_GRID (grid), label, 0, 2, 1, 1);
      gtk_grid_attach (GTK_GRID (grid), self->currency, 1, 2, 1, 1);
      gtk_grid_attach (GTK_GRID (grid), self->currency_error, 1, 3, 1, 1);
    }
    gtk_label_set_wrap (GTK_LABEL (title), TRUE);
    gtk_label_set_xalign (GTK_LABEL (title), 0.0);
    gtk_box_append (GTK_BOX (self->box), title);
    gtk_box_append (GTK_BOX (self->box), grid);
    self->engine_types = sw_engine_types_editor_new ();
    gtk_box_append (GTK_BOX (self->box), self->engine_types);
  }
}

GtkWidget *
sw_staging_page_new (void)
{
  return g_object_new (SW_TYPE_STAGING_PAGE, NULL);
}
