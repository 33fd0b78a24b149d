/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-document"

#include "config.h"

#include "sw-document.h"

#include <glib/gi18n.h>

/* Enough history for a long session; a design copy is a few kilobytes. */
#define MAX_HISTORY 500
/* Edits of one key closer together than this merge into one undo step. */
#define MERGE_WINDOW_US (1500 * G_TIME_SPAN_MILLISECOND)

struct _SwDocument {
  GObject    parent_instance;
  SwDesign  *design;
  SwDesign  *saved;          /* the state on disk (or the fresh one); NULL: none */
  GFile     *file;
  GPtrArray *undo;           /* SwDesign*, newest last */
  GPtrArray *redo;
  char      *merge_key;
  gint64     merge_time;
  gboolean   modified;
};

G_DEFINE_FINAL_TYPE (SwDocument, sw_document, G_TYPE_OBJECT)

enum { PROP_0, PROP_FILE, PROP_MODIFIED, PROP_CAN_UNDO, PROP_CAN_REDO, N_PROPS };
static GParamSpec *properties[N_PROPS];

enum { CHANGED, N_SIGNALS };
static guint signals[N_SIGNALS];

static void
update_state (SwDocument *self, gboolean could_undo, gboolean could_redo)
{
  gboolean modified = self->saved == NULL || !sw_design_equal (self->design, self->saved);

  if (modified != self->modified)
    {
      self->modified = modified;
      g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_MODIFIED]);
    }
  if (could_undo != sw_document_can_undo (self))
    g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_CAN_UNDO]);
  if (could_redo != sw_document_can_redo (self))
    g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_CAN_REDO]);
  g_signal_emit (self, signals[CHANGED], 0);
}

const SwDesign *
sw_document_get_design (SwDocument *self)
{
  g_return_val_if_fail (SW_IS_DOCUMENT (self), NULL);
  return self->design;
}

SwDesign *
sw_document_dup_design (SwDocument *self)
{
  g_return_val_if_fail (SW_IS_DOCUMENT (self), NULL);
  return sw_design_copy (self->design);
}

void
sw_document_end_merge (SwDocument *self)
{
  g_return_if_fail (SW_IS_DOCUMENT (self));
  g_clear_pointer (&self->merge_key, g_free);
}

void
sw_document_commit (SwDocument *self, SwDesign *design, const char *merge_key)
{
  gboolean could_undo, could_redo;
  gint64 now = g_get_monotonic_time ();
  gboolean merge;

  g_return_if_fail (SW_IS_DOCUMENT (self));
  g_return_if_fail (design != NULL);

  if (sw_design_equal (design, self->design))
    {
      sw_design_free (design);
      return;
    }
  could_undo = sw_document_can_undo (self);
  could_redo = sw_document_can_redo (self);
  merge = merge_key != NULL && g_strcmp0 (merge_key, self->merge_key) == 0
          && (now - self->merge_time < MERGE_WINDOW_US || g_str_has_prefix (merge_key, "drag:"))
          && self->undo->len > 0;
  if (merge)
    sw_design_free (self->design);
  else
    {
      g_ptr_array_add (self->undo, self->design);
      if (self->undo->len > MAX_HISTORY)
        g_ptr_array_remove_index (self->undo, 0);
    }
  self->design = design;
  g_ptr_array_set_size (self->redo, 0);
  g_free (self->merge_key);
  self->merge_key = g_strdup (merge_key);
  self->merge_time = now;
  update_state (self, could_undo, could_redo);
}

static gboolean
step (SwDocument *self, GPtrArray *from, GPtrArray *to)
{
  gboolean could_undo = sw_document_can_undo (self);
  gboolean could_redo = sw_document_can_redo (self);

  if (from->len == 0)
    return FALSE;
  sw_document_end_merge (self);
  g_ptr_array_add (to, self->design);
  self->design = g_ptr_array_steal_index (from, from->len - 1);
  update_state (self, could_undo, could_redo);
  return TRUE;
}

gboolean
sw_document_undo (SwDocument *self)
{
  g_return_val_if_fail (SW_IS_DOCUMENT (self), FALSE);
  return step (self, self->undo, self->redo);
}

gboolean
sw_document_redo (SwDocument *self)
{
  g_return_val_if_fail (SW_IS_DOCUMENT (self), FALSE);
  return step (self, self->redo, self->undo);
}

gboolean
sw_document_can_undo (SwDocument *self)
{
  g_return_val_if_fail (SW_IS_DOCUMENT (self), FALSE);
  return self->undo->len > 0;
}

gboolean
sw_document_can_redo (SwDocument *self)
{
  g_return_val_if_fail (SW_IS_DOCUMENT (self), FALSE);
  return self->redo->len > 0;
}

static void
set_file (SwDocument *self, GFile *file)
{
  if (self->file == file || (self->file != NULL && file != NULL && g_file_equal (self->file, file)))
    return;
  g_set_object (&self->file, file);
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_FILE]);
}

void
sw_document_reset (SwDocument *self, SwDesign *design, GFile *file, gboolean modified)
{
  gboolean could_undo, could_redo;

  g_return_if_fail (SW_IS_DOCUMENT (self));
  g_return_if_fail (design != NULL);

  could_undo = sw_document_can_undo (self);
  could_redo = sw_document_can_redo (self);
  sw_document_end_merge (self);
  g_ptr_array_set_size (self->undo, 0);
  g_ptr_array_set_size (self->redo, 0);
  sw_design_free (self->design);
  self->design = design;
  g_clear_pointer (&self->saved, sw_design_free);
  if (!modified)
    self->saved = sw_design_copy (design);
  set_file (self, file);
  update_state (self, could_undo, could_redo);
}

gboolean
sw_document_load (SwDocument *self, GFile *file, GPtrArray *warnings, GError **error)
{
  g_autofree char *path = NULL;
  SwDesign *design;

  g_return_val_if_fail (SW_IS_DOCUMENT (self), FALSE);
  g_return_val_if_fail (G_IS_FILE (file), FALSE);

  path = g_file_get_path (file);
  if (path == NULL)
    {
      g_autofree char *uri = g_file_get_uri (file);
      g_set_error (error, SW_ERROR, SW_ERROR_IO, _("%s: only local files can be opened"), uri);
      return FALSE;
    }
  design = sw_design_load (path, warnings, error);
  if (design == NULL)
    return FALSE;
  sw_document_reset (self, design, file, FALSE);
  return TRUE;
}

gboolean
sw_document_save (SwDocument *self, GFile *file, GError **error)
{
  g_autofree char *path = NULL;
  gboolean could_undo, could_redo;

  g_return_val_if_fail (SW_IS_DOCUMENT (self), FALSE);

  if (file == NULL)
    file = self->file;
  g_return_val_if_fail (G_IS_FILE (file), FALSE);

  path = g_file_get_path (file);
  if (path == NULL)
    {
      g_autofree char *uri = g_file_get_uri (file);
      g_set_error (error, SW_ERROR, SW_ERROR_IO, _("%s: only local files can be saved"), uri);
      return FALSE;
    }
  if (!sw_design_save (self->design, path, error))
    return FALSE;
  could_undo = sw_document_can_undo (self);
  could_redo = sw_document_can_redo (self);
  g_clear_pointer (&self->saved, sw_design_free);
  self->saved = sw_design_copy (self->design);
  set_file (self, file);
  sw_document_end_merge (self);
  update_state (self, could_undo, could_redo);
  return TRUE;
}

GFile *
sw_document_get_file (SwDocument *self)
{
  g_return_val_if_fail (SW_IS_DOCUMENT (self), NULL);
  return self->file;
}

gboolean
sw_document_get_modified (SwDocument *self)
{
  g_return_val_if_fail (SW_IS_DOCUMENT (self), FALSE);
  return self->modified;
}

char *
sw_document_dup_title (SwDocument *self)
{
  g_return_val_if_fail (SW_IS_DOCUMENT (self), NULL);
  if (self->design->name[0] != '\0')
    return g_strdup (self->design->name);
  if (self->file != NULL)
    return g_file_get_basename (self->file);
  return g_strdup (_("Untitled design"));
}

SwDocument *
sw_document_new (void)
{
  return g_object_new (SW_TYPE_DOCUMENT, NULL);
}

static void
sw_document_finalize (GObject *object)
{
  SwDocument *self = SW_DOCUMENT (object);

  sw_design_free (self->design);
  sw_design_free (self->saved);
  g_clear_object (&self->file);
  g_ptr_array_unref (self->undo);
  g_ptr_array_unref (self->redo);
  g_free (self->merge_key);
  G_OBJECT_CLASS (sw_document_parent_class)->finalize (object);
}

static void
sw_document_get_property (GObject *object, guint prop_id, GValue *value, GParamSpec *pspec)
{
  SwDocument *self = SW_DOCUMENT (object);

  switch (prop_id)
    {
    case PROP_FILE:
      g_value_set_object (value, self->file);
      break;
    case PROP_MODIFIED:
      g_value_set_boolean (value, self->modified);
      break;
    case PROP_CAN_UNDO:
      g_value_set_boolean (value, sw_document_can_undo (self));
      break;
    case PROP_CAN_REDO:
      g_value_set_boolean (value, sw_document_can_redo (self));
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
sw_document_class_init (SwDocumentClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);

  object_class->finalize = sw_document_finalize;
  object_class->get_property = sw_document_get_property;

  properties[PROP_FILE] = g_param_spec_object ("file", NULL, NULL, G_TYPE_FILE,
                                               G_PARAM_READABLE | G_PARAM_STATIC_STRINGS);
  properties[PROP_MODIFIED] = g_param_spec_boolean ("modified", NULL, NULL, FALSE,
                                                    G_PARAM_READABLE | G_PARAM_STATIC_STRINGS);
  properties[PROP_CAN_UNDO] = g_param_spec_boolean ("can-undo", NULL, NULL, FALSE,
                                                    G_PARAM_READABLE | G_PARAM_STATIC_STRINGS);
  properties[PROP_CAN_REDO] = g_param_spec_boolean ("can-redo", NULL, NULL, FALSE,
                                                    G_PARAM_READABLE | G_PARAM_STATIC_STRINGS);
  g_object_class_install_properties (object_class, N_PROPS, properties);

  signals[CHANGED] = g_signal_new ("changed", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST, 0,
                                   NULL, NULL, NULL, G_TYPE_NONE, 0);
}

static void
sw_document_init (SwDocument *self)
{
  self->undo = g_ptr_array_new_with_free_func ((GDestroyNotify) sw_design_free);
  self->redo = g_ptr_array_new_with_free_func ((GDestroyNotify) sw_design_free);
  self->design = sw_design_new_default ();
  self->saved = sw_design_copy (self->design);
}
