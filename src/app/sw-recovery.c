/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-recovery"

#include "config.h"

#include "sw-recovery.h"

#include <errno.h>
#include <glib/gstdio.h>

/* The copy is written this long after the last change. */
#define RECOVERY_DELAY_MS 1000

struct _SwRecovery {
  GObject     parent_instance;

  SwDocument *document;
  int         slot;           /* -1: none */
  guint       timeout;
  gboolean    offered;
  SwDesign   *recovered;
  GFile      *recovered_origin;
  gint64      recovered_mtime;  /* seconds since the epoch; 0 unknown */
};

G_DEFINE_FINAL_TYPE (SwRecovery, sw_recovery, G_TYPE_OBJECT)

/* Slots in use in this process: window k writes recovery file k. */
static guint used_slots;

static char *
recovery_dir (void)
{
  const char *env = g_getenv ("STAGEWRIGHT_RECOVERY_DIR");

  if (env != NULL && env[0] != '\0')
    return g_strdup (env);
  return g_build_filename (g_get_user_state_dir (), "stagewright", NULL);
}

char *
sw_recovery_dup_path (SwRecovery *self)
{
  g_autofree char *dir = recovery_dir ();
  g_autofree char *name = NULL;

  g_return_val_if_fail (SW_IS_RECOVERY (self), NULL);

  if (self->slot <= 0)
    name = g_strdup ("recovery.stagewright");
  else
    name = g_strdup_printf ("recovery-%d.stagewright", self->slot + 1);
  return g_build_filename (dir, name, NULL);
}

/* Beside the copy: the URI of the file it belongs to (empty: untitled). */
static char *
origin_path (const char *recovery_path)
{
  return g_strconcat (recovery_path, ".origin", NULL);
}

static void
unlink_copy (SwRecovery *self)
{
  g_autofree char *path = sw_recovery_dup_path (self);
  g_autofree char *origin = origin_path (path);

  g_unlink (path);
  g_unlink (origin);
}

void
sw_recovery_remove (SwRecovery *self)
{
  g_return_if_fail (SW_IS_RECOVERY (self));

  g_clear_handle_id (&self->timeout, g_source_remove);
  /* A copy still waiting for the user's answer is not ours to delete. */
  if (self->slot < 0 || self->offered)
    return;
  unlink_copy (self);
}

static void
write_copy (SwRecovery *self)
{
  g_autofree char *dir = recovery_dir ();
  g_autofree char *path = NULL, *origin = NULL, *uri = NULL;
  g_autoptr (GError) error = NULL;
  GFile *file;

  if (self->offered || self->slot < 0 || self->document == NULL
      || !sw_document_get_modified (self->document))
    return;
  path = sw_recovery_dup_path (self);
  origin = origin_path (path);
  if (g_mkdir_with_parents (dir, 0700) != 0)
    {
      g_warning ("Cannot create %s for the recovery copy: %s", dir, g_strerror (errno));
      return;
    }
  /* The origin first: a copy on disk always has the origin it belongs to,
   * even when the process is killed between the two writes. */
  file = sw_document_get_file (self->document);
  uri = file != NULL ? g_file_get_uri (file) : g_strdup ("");
  if (!g_file_set_contents_full (origin, uri, -1, G_FILE_SET_CONTENTS_CONSISTENT, 0600, &error))
    {
      g_debug ("Recovery origin not written: %s", error->message);
      return;
    }
  /* An invalid design (an orbit the site cannot reach, say) is not written:
   * the copy keeps the last state that can be opened again. */
  if (!sw_design_save (sw_document_get_design (self->document), path, &error))
    g_debug ("Recovery copy not written: %s", error->message);
}

static gboolean
timeout_cb (gpointer data)
{
  SwRecovery *self = data;

  self->timeout = 0;
  write_copy (self);
  return G_SOURCE_REMOVE;
}

static void
schedule (SwRecovery *self)
{
  if (self->offered || self->slot < 0)
    return;
  if (!sw_document_get_modified (self->document))
    {
      sw_recovery_remove (self);
      return;
    }
  /* Debounced: a burst of edits gives one write, a second after the last. */
  g_clear_handle_id (&self->timeout, g_source_remove);
  self->timeout = g_timeout_add (RECOVERY_DELAY_MS, timeout_cb, self);
}

void
sw_recovery_flush (SwRecovery *self)
{
  g_return_if_fail (SW_IS_RECOVERY (self));

  if (self->timeout != 0)
    {
      g_clear_handle_id (&self->timeout, g_source_remove);
      write_copy (self);
    }
}

static void
release_slot (SwRecovery *self)
{
  if (self->slot >= 0)
    used_slots &= ~(1u << self->slot);
  self->slot = -1;
}

static void
forget_offer (SwRecovery *self)
{
  self->offered = FALSE;
  g_clear_pointer (&self->recovered, sw_design_free);
  g_clear_object (&self->recovered_origin);
  self->recovered_mtime = 0;
}

void
sw_recovery_disable (SwRecovery *self)
{
  g_return_if_fail (SW_IS_RECOVERY (self));

  g_clear_handle_id (&self->timeout, g_source_remove);
  forget_offer (self);
  release_slot (self);
}

gboolean
sw_recovery_check (SwRecovery *self, char **kept_path, GError **error)
{
  g_autofree char *path = NULL, *origin = NULL, *uri = NULL;
  GStatBuf st;

  g_return_val_if_fail (SW_IS_RECOVERY (self), FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (self->slot < 0 || self->offered)
    return self->offered;
  path = sw_recovery_dup_path (self);
  if (!g_file_test (path, G_FILE_TEST_IS_REGULAR))
    return FALSE;
  self->recovered = sw_design_load (path, NULL, error);
  if (self->recovered == NULL)
    {
      g_autofree char *kept = g_strconcat (path, ".unreadable", NULL);
      g_rename (path, kept);
      if (kept_path != NULL)
        *kept_path = g_steal_pointer (&kept);
      return FALSE;
    }
  origin = origin_path (path);
  if (g_file_get_contents (origin, &uri, NULL, NULL) && uri[0] != '\0')
    self->recovered_origin = g_file_new_for_uri (g_strstrip (uri));
  if (g_stat (path, &st) == 0)
    self->recovered_mtime = st.st_mtime;
  self->offered = TRUE;
  return TRUE;
}

gboolean
sw_recovery_get_offered (SwRecovery *self)
{
  g_return_val_if_fail (SW_IS_RECOVERY (self), FALSE);
  return self->offered;
}

const SwDesign *
sw_recovery_get_offered_design (SwRecovery *self)
{
  g_return_val_if_fail (SW_IS_RECOVERY (self), NULL);
  return self->recovered;
}

GDateTime *
sw_recovery_dup_offered_time (SwRecovery *self)
{
  g_return_val_if_fail (SW_IS_RECOVERY (self), NULL);
  return self->recovered_mtime != 0 ? g_date_time_new_from_unix_local (self->recovered_mtime)
                                    : NULL;
}

gboolean
sw_recovery_answer (SwRecovery *self, gboolean restore, SwDesign **design, GFile **origin)
{
  g_return_val_if_fail (SW_IS_RECOVERY (self), FALSE);

  if (!self->offered)
    return FALSE;
  if (restore)
    {
      if (design != NULL)
        *design = g_steal_pointer (&self->recovered);
      if (origin != NULL)
        *origin = g_steal_pointer (&self->recovered_origin);
    }
  else
    unlink_copy (self);
  forget_offer (self);
  return TRUE;
}

static void
document_changed_cb (SwRecovery *self)
{
  schedule (self);
}

static void
sw_recovery_dispose (GObject *object)
{
  SwRecovery *self = SW_RECOVERY (object);

  /* Gone without a clean close (the session ends, say): keep the work. */
  sw_recovery_flush (self);
  release_slot (self);
  forget_offer (self);
  if (self->document != NULL)
    g_signal_handlers_disconnect_by_func (self->document, document_changed_cb, self);
  g_clear_object (&self->document);
  G_OBJECT_CLASS (sw_recovery_parent_class)->dispose (object);
}

static void
sw_recovery_class_init (SwRecoveryClass *klass)
{
  G_OBJECT_CLASS (klass)->dispose = sw_recovery_dispose;
}

static void
sw_recovery_init (SwRecovery *self)
{
  self->slot = -1;
  for (int k = 0; k < 32; k++)
    if (!(used_slots & (1u << k)))
      {
        used_slots |= 1u << k;
        self->slot = k;
        break;
      }
}

SwRecovery *
sw_recovery_new (SwDocument *document)
{
  SwRecovery *self;

  g_return_val_if_fail (SW_IS_DOCUMENT (document), NULL);

  self = g_object_new (SW_TYPE_RECOVERY, NULL);
  self->document = g_object_ref (document);
  g_signal_connect_swapped (document, "changed", G_CALLBACK (document_changed_cb), self);
  return self;
}
