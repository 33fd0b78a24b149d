/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-file-flow.c: new, open, recent, save, save as and the question before
 * unsaved changes are lost, apart from the window's shell. */
#include "config.h"

#include "sw-file-flow.h"

#include <glib/gi18n.h>
#include <string.h>

#define MIME_TYPE "application/x-stagewright+json"
#define MAX_RECENT 8

struct _SwFileFlow {
  GObject          parent_instance;

  GtkWindow       *parent;       /* not referenced: it owns this object */
  SwDocument      *document;
  SwRecovery      *recovery;
  GSettings       *settings;
  GMenu           *recent_menu;
  gboolean         ephemeral;

  SwFileFlowStep   after;        /* what to do once the design is saved */
  GFile           *after_file;
  GtkNativeDialog *chooser;
};

G_DEFINE_FINAL_TYPE (SwFileFlow, sw_file_flow, G_TYPE_OBJECT)

enum { MESSAGE, RESET, CLOSE, N_SIGNALS };
static guint signals[N_SIGNALS];

static void show_save_as (SwFileFlow *self);

static void
show_message (SwFileFlow *self, GtkMessageType type, const char *text)
{
  g_signal_emit (self, signals[MESSAGE], 0, (int) type, text);
}

static void
hide_message (SwFileFlow *self)
{
  g_signal_emit (self, signals[MESSAGE], 0, (int) GTK_MESSAGE_INFO, NULL);
}

/* ---- recent designs ---------------------------------------------------- */

static void
remember_file (SwFileFlow *self, GFile *file)
{
  g_autofree char *uri = g_file_get_uri (file);
  g_autofree char *path = g_file_get_path (file);
  GtkRecentData data = { 0 };

  if (self->ephemeral)
    return;
  data.mime_type = (char *) MIME_TYPE;
  data.app_name = (char *) "Stagewright";
  data.app_exec = (char *) "stagewright %u";
  gtk_recent_manager_add_full (gtk_recent_manager_get_default (), uri, &data);
  if (path != NULL)
    g_settings_set_string (self->settings, "last-design", path);
}

static void
rebuild_recent_menu (SwFileFlow *self)
{
  GList *items = gtk_recent_manager_get_items (gtk_recent_manager_get_default ());
  guint n = 0;

  g_menu_remove_all (self->recent_menu);
  for (GList *l = items; l != NULL && n < MAX_RECENT; l = l->next)
    {
      GtkRecentInfo *info = l->data;
      const char *uri = gtk_recent_info_get_uri (info);
      g_autoptr (GMenuItem) item = NULL;

      if (!g_str_has_suffix (uri, ".stagewright") || !gtk_recent_info_exists (info))
        continue;
      item = g_menu_item_new (gtk_recent_info_get_display_name (info), NULL);
      g_menu_item_set_action_and_target_value (item, "design.open-recent",
                                               g_variant_new_string (uri));
      g_menu_append_item (self->recent_menu, item);
      n++;
    }
  g_list_free_full (items, (GDestroyNotify) gtk_recent_info_unref);
  if (n == 0)
    {
      g_autoptr (GMenuItem) none = g_menu_item_new (_("No recent designs"), "design.none");
      g_menu_append_item (self->recent_menu, none);
    }
}

/* ---- open and save ----------------------------------------------------- */

gboolean
sw_file_flow_load (SwFileFlow *self, GFile *file, gboolean as_copy)
{
  g_autoptr (GPtrArray) warnings = g_ptr_array_new_with_free_func (g_free);
  g_autoptr (GError) error = NULL;

  g_return_val_if_fail (SW_IS_FILE_FLOW (self), FALSE);
  g_return_val_if_fail (G_IS_FILE (file), FALSE);

  if (!sw_document_load (self->document, file, warnings, &error))
    {
      g_autofree char *text = g_strdup_printf (_("Could not open the design; nothing was "
                                                 "changed.\n%s"), error->message);
      show_message (self, GTK_MESSAGE_ERROR, text);
      return FALSE;
    }
  if (warnings->len > 0)
    {
      GString *text = g_string_new (_("The design was opened, with warnings:"));
      for (guint i = 0; i < warnings->len; i++)
        g_string_append_printf (text, "\n%s", (const char *) warnings->pdata[i]);
      show_message (self, GTK_MESSAGE_WARNING, text->str);
      g_string_free (text, TRUE);
    }
  else
    hide_message (self);
  if (as_copy)
    sw_document_reset (self->document, sw_document_dup_design (self->document), NULL, FALSE);
  else
    remember_file (self, file);
  g_signal_emit (self, signals[RESET], 0, as_copy);
  return TRUE;
}

gboolean
sw_file_flow_save_to (SwFileFlow *self, GFile *file, GError **error)
{
  g_return_val_if_fail (SW_IS_FILE_FLOW (self), FALSE);

  if (!sw_document_save (self->document, file, error))
    return FALSE;
  remember_file (self, sw_document_get_file (self->document));
  sw_recovery_remove (self->recovery);
  return TRUE;
}

/* Saves and reports a failure in the window. */
static gboolean
save_to (SwFileFlow *self, GFile *file)
{
  g_autoptr (GError) error = NULL;

  if (!sw_file_flow_save_to (self, file, &error))
    {
      g_autofree char *text = g_strdup_printf (_("The design was not saved.\n%s"),
                                               error->message);
      show_message (self, GTK_MESSAGE_ERROR, text);
      return FALSE;
    }
  hide_message (self);
  return TRUE;
}

static void
new_design (SwFileFlow *self)
{
  sw_document_reset (self->document, sw_design_new_default (), NULL, FALSE);
  hide_message (self);
  g_signal_emit (self, signals[RESET], 0, FALSE);
}

static void
add_filters (GtkFileChooser *chooser)
{
  g_autoptr (GtkFileFilter) designs = gtk_file_filter_new ();
  g_autoptr (GtkFileFilter) all = gtk_file_filter_new ();

  gtk_file_filter_set_name (designs, _("Stagewright designs"));
  gtk_file_filter_add_pattern (designs, "*.stagewright");
  gtk_file_filter_add_mime_type (designs, MIME_TYPE);
  gtk_file_filter_set_name (all, _("All files"));
  gtk_file_filter_add_pattern (all, "*");
  gtk_file_chooser_add_filter (chooser, designs);
  gtk_file_chooser_add_filter (chooser, all);
}

static void
open_response_cb (SwFileFlow *self, int response, GtkNativeDialog *dialog)
{
  if (response == GTK_RESPONSE_ACCEPT)
    {
      g_autoptr (GFile) file = gtk_file_chooser_get_file (GTK_FILE_CHOOSER (dialog));
      if (file != NULL)
        sw_file_flow_load (self, file, FALSE);
    }
  g_clear_object (&self->chooser);
}

static void
show_open (SwFileFlow *self)
{
  GtkFileChooserNative *chooser;

  if (self->chooser != NULL)
    return;
  chooser = gtk_file_chooser_native_new (_("Open a Design"), self->parent,
                                         GTK_FILE_CHOOSER_ACTION_OPEN, _("_Open"),
                                         _("_Cancel"));
  add_filters (GTK_FILE_CHOOSER (chooser));
  gtk_native_dialog_set_modal (GTK_NATIVE_DIALOG (chooser), TRUE);
  g_signal_connect_swapped (chooser, "response", G_CALLBACK (open_response_cb), self);
  self->chooser = GTK_NATIVE_DIALOG (chooser);
  gtk_native_dialog_show (self->chooser);
}

static void
run_after (SwFileFlow *self)
{
  SwFileFlowStep after = self->after;
  g_autoptr (GFile) file = g_steal_pointer (&self->after_file);

  self->after = SW_FILE_FLOW_NOTHING;
  switch (after)
    {
    case SW_FILE_FLOW_CLOSE:
      g_signal_emit (self, signals[CLOSE], 0);
      break;
    case SW_FILE_FLOW_NEW:
      new_design (self);
      break;
    case SW_FILE_FLOW_OPEN:
      show_open (self);
      break;
    case SW_FILE_FLOW_OPEN_FILE:
      sw_file_flow_load (self, file, FALSE);
      break;
    case SW_FILE_FLOW_NOTHING:
    default:
      break;
    }
}

static void
cancel_after (SwFileFlow *self)
{
  self->after = SW_FILE_FLOW_NOTHING;
  g_clear_object (&self->after_file);
}

static void
save_as_response_cb (SwFileFlow *self, int response, GtkNativeDialog *dialog)
{
  g_autoptr (GFile) file = NULL;

  if (response == GTK_RESPONSE_ACCEPT)
    file = gtk_file_chooser_get_file (GTK_FILE_CHOOSER (dialog));
  g_clear_object (&self->chooser);
  if (file == NULL)
    {
      cancel_after (self);
      return;
    }
  {
    g_autofree char *base = g_file_get_basename (file);
    if (base != NULL && strchr (base, '.') == NULL)
      {
        g_autofree char *name = g_strconcat (base, ".stagewright", NULL);
        g_autoptr (GFile) parent = g_file_get_parent (file);
        g_set_object (&file, g_file_get_child (parent, name));
      }
  }
  if (save_to (self, file))
    run_after (self);
  else
    cancel_after (self);
}

static void
show_save_as (SwFileFlow *self)
{
  GtkFileChooserNative *chooser;
  GFile *current = sw_document_get_file (self->document);

  if (self->chooser != NULL)
    return;
  chooser = gtk_file_chooser_native_new (_("Save the Design"), self->parent,
                                         GTK_FILE_CHOOSER_ACTION_SAVE, _("_Save"),
                                         _("_Cancel"));
  add_filters (GTK_FILE_CHOOSER (chooser));
  if (current != NULL)
    gtk_file_chooser_set_file (GTK_FILE_CHOOSER (chooser), current, NULL);
  else
    {
      g_autofree char *title = sw_document_dup_title (self->document);
      g_autofree char *name = g_strconcat (title, ".stagewright", NULL);
      g_strdelimit (name, "/\\", '-');
      gtk_file_chooser_set_current_name (GTK_FILE_CHOOSER (chooser), name);
    }
  gtk_native_dialog_set_modal (GTK_NATIVE_DIALOG (chooser), TRUE);
  g_signal_connect_swapped (chooser, "response", G_CALLBACK (save_as_response_cb), self);
  self->chooser = GTK_NATIVE_DIALOG (chooser);
  gtk_native_dialog_show (self->chooser);
}

static void
save (SwFileFlow *self)
{
  GFile *file = sw_document_get_file (self->document);

  if (file == NULL)
    show_save_as (self);
  else if (save_to (self, file))
    run_after (self);
  else
    cancel_after (self);
}

static void
question_response_cb (SwFileFlow *self, int response, GtkDialog *dialog)
{
  /* The answer may close the window at once: the dialog, finalized only
   * after its response signal, must not point at it by then. */
  g_signal_handlers_disconnect_by_func (dialog, question_response_cb, self);
  gtk_window_set_transient_for (GTK_WINDOW (dialog), NULL);
  gtk_window_destroy (GTK_WINDOW (dialog));
  switch (response)
    {
    case GTK_RESPONSE_ACCEPT:
      save (self);
      break;
    case GTK_RESPONSE_REJECT:
      run_after (self);
      break;
    default:
      cancel_after (self);
      break;
    }
}

void
sw_file_flow_ask_then (SwFileFlow *self, SwFileFlowStep step, GFile *file)
{
  g_autofree char *title = NULL;
  GtkWidget *dialog, *discard;

  g_return_if_fail (SW_IS_FILE_FLOW (self));

  self->after = step;
  g_set_object (&self->after_file, file);
  if (!sw_document_get_modified (self->document))
    {
      run_after (self);
      return;
    }
  title = sw_document_dup_title (self->document);
  dialog = gtk_message_dialog_new (self->parent,
                                   GTK_DIALOG_MODAL | GTK_DIALOG_DESTROY_WITH_PARENT,
                                   GTK_MESSAGE_QUESTION, GTK_BUTTONS_NONE,
                                   _("Save the changes to “%s”?"), title);
  gtk_message_dialog_format_secondary_text (GTK_MESSAGE_DIALOG (dialog), "%s",
                                            _("Changes that are not saved will be lost."));
  gtk_dialog_add_button (GTK_DIALOG (dialog), _("_Cancel"), GTK_RESPONSE_CANCEL);
  discard = gtk_dialog_add_button (GTK_DIALOG (dialog), _("_Discard"), GTK_RESPONSE_REJECT);
  gtk_widget_add_css_class (discard, "destructive-action");
  gtk_dialog_add_button (GTK_DIALOG (dialog), _("_Save"), GTK_RESPONSE_ACCEPT);
  gtk_dialog_set_default_response (GTK_DIALOG (dialog), GTK_RESPONSE_ACCEPT);
  /* Disconnected by itself if this object goes first. */
  g_signal_connect_object (dialog, "response", G_CALLBACK (question_response_cb), self,
                           G_CONNECT_SWAPPED);
  gtk_window_present (GTK_WINDOW (dialog));
}

void
sw_file_flow_save (SwFileFlow *self)
{
  g_return_if_fail (SW_IS_FILE_FLOW (self));
  cancel_after (self);
  save (self);
}

void
sw_file_flow_save_as (SwFileFlow *self)
{
  g_return_if_fail (SW_IS_FILE_FLOW (self));
  cancel_after (self);
  show_save_as (self);
}

void
sw_file_flow_set_ephemeral (SwFileFlow *self, gboolean ephemeral)
{
  g_return_if_fail (SW_IS_FILE_FLOW (self));
  self->ephemeral = !!ephemeral;
}

void
sw_file_flow_abandon (SwFileFlow *self)
{
  g_return_if_fail (SW_IS_FILE_FLOW (self));

  if (self->chooser != NULL)
    {
      gtk_native_dialog_destroy (self->chooser);
      g_clear_object (&self->chooser);
    }
  cancel_after (self);
}

/* ---- GObject ----------------------------------------------------------- */

static void
sw_file_flow_dispose (GObject *object)
{
  SwFileFlow *self = SW_FILE_FLOW (object);

  sw_file_flow_abandon (self);
  g_clear_object (&self->document);
  g_clear_object (&self->recovery);
  g_clear_object (&self->settings);
  g_clear_object (&self->recent_menu);
  G_OBJECT_CLASS (sw_file_flow_parent_class)->dispose (object);
}

static void
sw_file_flow_class_init (SwFileFlowClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);

  object_class->dispose = sw_file_flow_dispose;

  signals[MESSAGE] = g_signal_new ("message", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST,
                                   0, NULL, NULL, NULL, G_TYPE_NONE, 2, G_TYPE_INT,
                                   G_TYPE_STRING);
  signals[RESET] = g_signal_new ("reset", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST,
                                 0, NULL, NULL, NULL, G_TYPE_NONE, 1, G_TYPE_BOOLEAN);
  signals[CLOSE] = g_signal_new ("close", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST,
                                 0, NULL, NULL, NULL, G_TYPE_NONE, 0);
}

static void
sw_file_flow_init (SwFileFlow *self)
{
}

SwFileFlow *
sw_file_flow_new (GtkWindow *parent, SwDocument *document, SwRecovery *recovery,
                  GSettings *settings, GMenu *recent_menu)
{
  SwFileFlow *self;

  g_return_val_if_fail (GTK_IS_WINDOW (parent), NULL);
  g_return_val_if_fail (SW_IS_DOCUMENT (document), NULL);
  g_return_val_if_fail (SW_IS_RECOVERY (recovery), NULL);
  g_return_val_if_fail (G_IS_SETTINGS (settings), NULL);
  g_return_val_if_fail (G_IS_MENU (recent_menu), NULL);

  self = g_object_new (SW_TYPE_FILE_FLOW, NULL);
  self->parent = parent;
  self->document = g_object_ref (document);
  self->recovery = g_object_ref (recovery);
  self->settings = g_object_ref (settings);
  self->recent_menu = g_object_ref (recent_menu);
  /* Disconnected by itself when this object goes. */
  g_signal_connect_object (gtk_recent_manager_get_default (), "changed",
                           G_CALLBACK (rebuild_recent_menu), self, G_CONNECT_SWAPPED);
  rebuild_recent_menu (self);
  return self;
}
