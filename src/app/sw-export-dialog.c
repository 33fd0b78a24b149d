/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-export-dialog"

#include "config.h"

#include "sw-export-dialog.h"

#include "sw-csv.h"
#include "sw-format.h"
#include "sw-spinner.h"

#include <glib/gi18n.h>
#include <string.h>

struct _SwExportDialog {
  GtkWindow     parent_instance;

  SwAnalysis     *result;
  char         *sheet_path;
  char         *csv_dir;
  GCancellable *cancellable;      /* of the export running, or NULL */
  gboolean      queued;           /* asked for while the ascent was being simulated */
  GtkNativeDialog *chooser;
  char         *status;
  gboolean      failed;

  GtkDropDown  *format_dropdown;
  GtkDropDown  *paper_dropdown;
  GtkLabel     *sheet_label;
  GtkCheckButton *csv_check;
  GtkLabel     *csv_label;
  GtkButton    *csv_button;
  GtkButton    *export_button;
  GtkLabel     *caution_label;
  GtkSpinner   *spinner;
  GtkLabel     *status_label;
};

G_DEFINE_FINAL_TYPE (SwExportDialog, sw_export_dialog, GTK_TYPE_WINDOW)

enum { FINISHED, N_SIGNALS };
static guint signals[N_SIGNALS];

static const char *const extensions[] = { ".pdf", ".svg", ".png" };

/* ---- the work (any thread) --------------------------------------------- */

typedef struct {
  SwAnalysis      *result;
  SwSheetFormat  format;
  SwPaper        paper;
  char          *sheet_path;
  char          *csv_dir;
} ExportJob;

static void
export_job_free (gpointer data)
{
  ExportJob *job = data;

  g_clear_pointer (&job->result, sw_analysis_unref);
  g_free (job->sheet_path);
  g_free (job->csv_dir);
  g_free (job);
}

static void
export_thread (GTask *task, gpointer source, gpointer data, GCancellable *cancellable)
{
  ExportJob *job = data;
  g_autoptr (GPtrArray) written = g_ptr_array_new_with_free_func (g_free);
  g_autoptr (SwAnalysis) b = sw_analysis_ref (job->result);
  GError *error = NULL;

  if (!b->ok)
    {
      g_task_return_new_error (task, SW_ERROR, SW_ERROR_VALUE,
                               _("The design cannot be sized, so there is no sheet to export: "
                                 "%s"), b->error_message);
      return;
    }
  /* Exported before the solver's Monte Carlo arrived: the core's Monte Carlo
   * phase here, on the analysis the window has.  The ascent is never flown
   * again: the sheet shows what the window shows. */
  if (b->montecarlo_pending)
    {
      SwAnalysis *mc = sw_analysis_add_montecarlo (b, cancellable);
      if (mc == NULL)
        {
          g_task_return_error_if_cancelled (task);
          return;
        }
      g_clear_pointer (&b, sw_analysis_unref);
      b = mc;
    }
  if (g_task_return_error_if_cancelled (task))
    return;
  if (job->sheet_path != NULL)
    {
      if (!sw_sheet_export (b, job->format, job->paper, job->sheet_path, &error))
        {
          g_task_return_error (task, error);
          return;
        }
      g_ptr_array_add (written, g_strdup (job->sheet_path));
    }
  if (g_task_return_error_if_cancelled (task))
    return;
  if (job->csv_dir != NULL && !sw_csv_export (b, job->csv_dir, written, &error))
    {
      g_task_return_error (task, error);
      return;
    }
  g_task_return_pointer (task, g_steal_pointer (&written), (GDestroyNotify) g_ptr_array_unref);
}

void
sw_export_run_async (SwAnalysis *result, SwSheetFormat format, SwPaper paper,
                     const char *sheet_path, const char *csv_dir, GCancellable *cancellable,
                     GAsyncReadyCallback callback, gpointer user_data)
{
  g_autoptr (GTask) task = NULL;
  ExportJob *job;

  g_return_if_fail (result != NULL);

  task = g_task_new (NULL, cancellable, callback, user_data);
  g_task_set_source_tag (task, sw_export_run_async);
  g_task_set_name (task, "[stagewright] export");
  job = g_new0 (ExportJob, 1);
  job->result = sw_analysis_ref (result);
  job->format = format;
  job->paper = paper;
  job->sheet_path = g_strdup (sheet_path);
  job->csv_dir = g_strdup (csv_dir);
  g_task_set_task_data (task, job, export_job_free);
  g_task_run_in_thread (task, export_thread);
}

GPtrArray *
sw_export_run_finish (GAsyncResult *result, GError **error)
{
  g_return_val_if_fail (g_task_is_valid (result, NULL), NULL);
  g_return_val_if_fail (g_task_get_source_tag (G_TASK (result)) == sw_export_run_async, NULL);

  return g_task_propagate_pointer (G_TASK (result), error);
}

/* ---- the dialog -------------------------------------------------------- */

static SwSheetFormat
selected_format (SwExportDialog *self)
{
  guint i = gtk_drop_down_get_selected (self->format_dropdown);

  return i == 1 ? SW_SHEET_SVG : i == 2 ? SW_SHEET_PNG : SW_SHEET_PDF;
}

static SwPaper
selected_paper (SwExportDialog *self)
{
  return gtk_drop_down_get_selected (self->paper_dropdown) == 1 ? SW_PAPER_LETTER : SW_PAPER_A4;
}

static void
set_status (SwExportDialog *self, const char *text, gboolean failed)
{
  g_free (self->status);
  self->status = g_strdup (text);
  self->failed = failed;
  gtk_label_set_text (self->status_label, text != NULL ? text : "");
  if (failed)
    gtk_widget_add_css_class (GTK_WIDGET (self->status_label), "error");
  else
    gtk_widget_remove_css_class (GTK_WIDGET (self->status_label), "error");
}

static void
update_sensitivity (SwExportDialog *self)
{
  gboolean busy = self->cancellable != NULL || self->queued;
  gboolean csv = gtk_check_button_get_active (self->csv_check);
  gboolean ok = self->result != NULL && self->result->ok;

  gtk_widget_set_sensitive (GTK_WIDGET (self->export_button),
                            !busy && ok && (self->sheet_path != NULL || csv));
  gtk_widget_set_sensitive (GTK_WIDGET (self->csv_label), csv);
  gtk_widget_set_sensitive (GTK_WIDGET (self->csv_button), csv && !busy);
  sw_spinner_set_busy (self->spinner, busy);
}

static void
show_paths (SwExportDialog *self)
{
  gtk_label_set_text (self->sheet_label, self->sheet_path != NULL ? self->sheet_path : "");
  gtk_label_set_text (self->csv_label, self->csv_dir != NULL ? self->csv_dir : "");
  update_sensitivity (self);
}

/* The sheet's name follows the format: "x.pdf" becomes "x.svg". */
static void
format_changed_cb (SwExportDialog *self)
{
  const char *ext = extensions[selected_format (self)];
  char *dot;

  if (self->sheet_path == NULL)
    return;
  dot = strrchr (self->sheet_path, '.');
  if (dot != NULL && strchr (dot, G_DIR_SEPARATOR) == NULL)
    *dot = '\0';
  {
    char *path = g_strconcat (self->sheet_path, ext, NULL);
    g_free (self->sheet_path);
    self->sheet_path = path;
  }
  show_paths (self);
}

static void
csv_toggled_cb (SwExportDialog *self)
{
  update_sensitivity (self);
}

static void
chooser_response_cb (SwExportDialog *self, int response, GtkNativeDialog *dialog)
{
  gboolean folder = gtk_file_chooser_get_action (GTK_FILE_CHOOSER (dialog))
                    == GTK_FILE_CHOOSER_ACTION_SELECT_FOLDER;

  if (response == GTK_RESPONSE_ACCEPT)
    {
      g_autoptr (GFile) file = gtk_file_chooser_get_file (GTK_FILE_CHOOSER (dialog));
      char *path = file != NULL ? g_file_get_path (file) : NULL;
      if (path != NULL && folder)
        {
          g_free (self->csv_dir);
          self->csv_dir = path;
        }
      else if (path != NULL)
        {
          g_free (self->sheet_path);
          self->sheet_path = path;
          /* The format follows a typed extension. */
          for (guint i = 0; i < G_N_ELEMENTS (extensions); i++)
            if (g_str_has_suffix (path, extensions[i]))
              gtk_drop_down_set_selected (self->format_dropdown, i);
          format_changed_cb (self);
        }
    }
  gtk_native_dialog_destroy (dialog);
  g_clear_object (&self->chooser);
  show_paths (self);
}

static void
open_chooser (SwExportDialog *self, gboolean folder)
{
  GtkFileChooserNative *chooser;
  const char *current = folder ? self->csv_dir : self->sheet_path;

  if (self->chooser != NULL)
    return;
  chooser = gtk_file_chooser_native_new (folder ? _("Folder for the CSV Tables")
                                                : _("Save the Briefing Sheet"),
                                         GTK_WINDOW (self),
                                         folder ? GTK_FILE_CHOOSER_ACTION_SELECT_FOLDER
                                                : GTK_FILE_CHOOSER_ACTION_SAVE,
                                         folder ? _("_Select") : _("_Save"), _("_Cancel"));
  if (current != NULL)
    {
      g_autoptr (GFile) file = g_file_new_for_path (current);
      g_autoptr (GFile) parent = g_file_get_parent (file);
      g_autofree char *base = g_file_get_basename (file);
      if (parent != NULL)
        gtk_file_chooser_set_current_folder (GTK_FILE_CHOOSER (chooser), parent, NULL);
      if (!folder && base != NULL)
        gtk_file_chooser_set_current_name (GTK_FILE_CHOOSER (chooser), base);
    }
  gtk_native_dialog_set_modal (GTK_NATIVE_DIALOG (chooser), TRUE);
  g_signal_connect_swapped (chooser, "response", G_CALLBACK (chooser_response_cb), self);
  self->chooser = GTK_NATIVE_DIALOG (chooser);
  gtk_native_dialog_show (self->chooser);
}

static void
choose_sheet_cb (SwExportDialog *self)
{
  open_chooser (self, FALSE);
}

static void
choose_folder_cb (SwExportDialog *self)
{
  open_chooser (self, TRUE);
}

static void
export_done_cb (GObject *source, GAsyncResult *res, gpointer data)
{
  g_autoptr (SwExportDialog) self = data;
  g_autoptr (GError) error = NULL;
  g_autoptr (GPtrArray) written = sw_export_run_finish (res, &error);

  /* Closed while writing: nobody to tell. */
  if (g_error_matches (error, G_IO_ERROR, G_IO_ERROR_CANCELLED))
    return;
  g_clear_object (&self->cancellable);
  if (written == NULL)
    {
      g_autofree char *text = g_strdup_printf (_("Nothing was exported. %s"), error->message);
      set_status (self, text, TRUE);
    }
  else
    {
      GString *text = g_string_new (NULL);
      guint n_csv = written->len;
      if (self->sheet_path != NULL && written->len > 0)
        {
          /* Translators: %s is the path of the file written */
          g_string_append_printf (text, _("Written: %s"), (const char *) written->pdata[0]);
          n_csv--;
        }
      if (n_csv > 0)
        {
          if (text->len > 0)
            g_string_append_c (text, '\n');
          /* Translators: %u is a number of files, %s a folder */
          g_string_append_printf (text, g_dngettext (GETTEXT_PACKAGE, "%u CSV table in %s",
                                                     "%u CSV tables in %s", n_csv),
                                  n_csv, self->csv_dir);
        }
      set_status (self, text->str, FALSE);
      g_string_free (text, TRUE);
    }
  update_sensitivity (self);
  g_signal_emit (self, signals[FINISHED], 0);
}

void
sw_export_dialog_export (SwExportDialog *self)
{
  const char *csv;

  g_return_if_fail (SW_IS_EXPORT_DIALOG (self));

  if (self->cancellable != NULL || self->result == NULL)
    return;
  /* The sheet leads with the verdict, which needs the ascent: wait for the
   * window's next analysis rather than fly it a second time here. */
  if (self->result->ok && self->result->ascent_pending)
    {
      self->queued = TRUE;
      set_status (self, _("Waiting for the simulated ascent…"), FALSE);
      update_sensitivity (self);
      return;
    }
  self->queued = FALSE;
  csv = gtk_check_button_get_active (self->csv_check) ? self->csv_dir : NULL;
  self->cancellable = g_cancellable_new ();
  set_status (self, _("Writing…"), FALSE);
  update_sensitivity (self);
  sw_export_run_async (self->result, selected_format (self), selected_paper (self),
                       self->sheet_path, csv, self->cancellable, export_done_cb,
                       g_object_ref (self));
}

static void
export_clicked_cb (SwExportDialog *self)
{
  sw_export_dialog_export (self);
}

static void
close_clicked_cb (SwExportDialog *self)
{
  gtk_window_close (GTK_WINDOW (self));
}

gboolean
sw_export_dialog_is_busy (SwExportDialog *self)
{
  g_return_val_if_fail (SW_IS_EXPORT_DIALOG (self), FALSE);
  return self->cancellable != NULL || self->queued;
}

const char *
sw_export_dialog_get_status (SwExportDialog *self, gboolean *failed)
{
  g_return_val_if_fail (SW_IS_EXPORT_DIALOG (self), NULL);
  if (failed != NULL)
    *failed = self->failed;
  return self->status;
}

void
sw_export_dialog_set_result (SwExportDialog *self, SwAnalysis *result)
{
  g_return_if_fail (SW_IS_EXPORT_DIALOG (self));

  if (self->result == result)
    return;
  g_clear_pointer (&self->result, sw_analysis_unref);
  self->result = result != NULL ? sw_analysis_ref (result) : NULL;
  if (result != NULL && !result->ok)
    {
      self->queued = FALSE;
      set_status (self, _("The design cannot be sized: fix it before exporting."), TRUE);
    }
  else if (self->failed && self->cancellable == NULL)
    set_status (self, NULL, FALSE);
  update_sensitivity (self);
  if (self->queued && result != NULL && result->ok && !result->ascent_pending)
    sw_export_dialog_export (self);
}

void
sw_export_dialog_set_targets (SwExportDialog *self, SwSheetFormat format, SwPaper paper,
                              const char *sheet_path, const char *csv_dir)
{
  g_return_if_fail (SW_IS_EXPORT_DIALOG (self));

  gtk_drop_down_set_selected (self->format_dropdown, format);
  gtk_drop_down_set_selected (self->paper_dropdown, paper == SW_PAPER_LETTER ? 1 : 0);
  g_free (self->sheet_path);
  self->sheet_path = g_strdup (sheet_path);
  g_free (self->csv_dir);
  self->csv_dir = g_strdup (csv_dir);
  gtk_check_button_set_active (self->csv_check, csv_dir != NULL);
  show_paths (self);
}

/* Beside the design, or in the documents folder for an untitled one. */
static void
suggest_paths (SwExportDialog *self, GFile *design_file)
{
  g_autofree char *dir = NULL, *stem = NULL, *sheet = NULL, *tables = NULL;
  const char *name = self->result != NULL && self->result->design->name[0] != '\0'
                     ? self->result->design->name : _("design");

  if (design_file != NULL)
    {
      g_autoptr (GFile) parent = g_file_get_parent (design_file);
      g_autofree char *base = g_file_get_basename (design_file);
      dir = parent != NULL ? g_file_get_path (parent) : NULL;
      if (base != NULL && g_str_has_suffix (base, ".stagewright"))
        base[strlen (base) - strlen (".stagewright")] = '\0';
      stem = g_steal_pointer (&base);
    }
  if (dir == NULL)
    {
      const char *docs = g_get_user_special_dir (G_USER_DIRECTORY_DOCUMENTS);
      dir = g_strdup (docs != NULL ? docs : g_get_home_dir ());
    }
  if (stem == NULL || stem[0] == '\0')
    {
      g_free (stem);
      stem = g_strdup (name);
      g_strdelimit (stem, "/\\:", '-');
    }
  /* Translators: file name suffixes of the exports, e.g. "rocket-briefing.pdf" */
  sheet = g_strconcat (stem, _("-briefing"), ".pdf", NULL);
  tables = g_strconcat (stem, _("-tables"), NULL);
  g_free (self->sheet_path);
  self->sheet_path = g_build_filename (dir, sheet, NULL);
  g_free (self->csv_dir);
  self->csv_dir = g_build_filename (dir, tables, NULL);
  show_paths (self);
}

SwExportDialog *
sw_export_dialog_new (GtkWindow *parent, SwAnalysis *result, GFile *design_file)
{
  SwExportDialog *self = g_object_new (SW_TYPE_EXPORT_DIALOG, "transient-for", parent, NULL);

  sw_export_dialog_set_result (self, result);
  suggest_paths (self, design_file);
  return self;
}

static gboolean
sw_export_dialog_close_request (GtkWindow *window)
{
  SwExportDialog *self = SW_EXPORT_DIALOG (window);

  /* The worker finishes the file it writes (always through a temporary
   * file, renamed when complete); the answer is dropped. */
  if (self->cancellable != NULL)
    g_cancellable_cancel (self->cancellable);
  return GTK_WINDOW_CLASS (sw_export_dialog_parent_class)->close_request (window);
}

static void
sw_export_dialog_dispose (GObject *object)
{
  SwExportDialog *self = SW_EXPORT_DIALOG (object);

  if (self->chooser != NULL)
    {
      gtk_native_dialog_destroy (self->chooser);
      g_clear_object (&self->chooser);
    }
  if (self->cancellable != NULL)
    g_cancellable_cancel (self->cancellable);
  g_clear_object (&self->cancellable);
  g_clear_pointer (&self->result, sw_analysis_unref);
  gtk_widget_dispose_template (GTK_WIDGET (self), SW_TYPE_EXPORT_DIALOG);
  G_OBJECT_CLASS (sw_export_dialog_parent_class)->dispose (object);
}

static void
sw_export_dialog_finalize (GObject *object)
{
  SwExportDialog *self = SW_EXPORT_DIALOG (object);

  g_free (self->sheet_path);
  g_free (self->csv_dir);
  g_free (self->status);
  G_OBJECT_CLASS (sw_export_dialog_parent_class)->finalize (object);
}

static void
sw_export_dialog_class_init (SwExportDialogClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);
  GtkWindowClass *window_class = GTK_WINDOW_CLASS (klass);

  object_class->dispose = sw_export_dialog_dispose;
  object_class->finalize = sw_export_dialog_finalize;
  window_class->close_request = sw_export_dialog_close_request;

  signals[FINISHED] = g_signal_new ("finished", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST,
                                    0, NULL, NULL, NULL, G_TYPE_NONE, 0);

  gtk_widget_class_set_template_from_resource (widget_class,
                                               "/org/stagewright/Stagewright/sw-export-dialog.ui");
#define CHILD(name) gtk_widget_class_bind_template_child (widget_class, SwExportDialog, name)
  CHILD (format_dropdown);
  CHILD (paper_dropdown);
  CHILD (sheet_label);
  CHILD (csv_check);
  CHILD (csv_label);
  CHILD (csv_button);
  CHILD (export_button);
  CHILD (caution_label);
  CHILD (spinner);
  CHILD (status_label);
#undef CHILD
  gtk_widget_class_bind_template_callback (widget_class, format_changed_cb);
  gtk_widget_class_bind_template_callback (widget_class, csv_toggled_cb);
  gtk_widget_class_bind_template_callback (widget_class, choose_sheet_cb);
  gtk_widget_class_bind_template_callback (widget_class, choose_folder_cb);
  gtk_widget_class_bind_template_callback (widget_class, export_clicked_cb);
  gtk_widget_class_bind_template_callback (widget_class, close_clicked_cb);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_Escape, 0, "window.close", NULL);
}

static void
sw_export_dialog_init (SwExportDialog *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
  gtk_label_set_text (self->caution_label, sw_format_cautions ());
  gtk_window_set_default_widget (GTK_WINDOW (self), GTK_WIDGET (self->export_button));
  update_sensitivity (self);
}
