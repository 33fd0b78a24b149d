/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-file-flow.h: the window's file flow, on its own: new, open, open a
 * recent design, save, save as, and the question before unsaved changes are
 * lost (close, new, open).  It works on the window's document and recovery
 * copy and tells the window what to show through signals:
 *   "message" (GtkMessageType type, const char *text): show a message in the
 *       window; text NULL hides it;
 *   "reset" (gboolean intro): a design was opened or started; intro TRUE
 *       when it is an unsaved copy of a template (the inspector says so);
 *   "close": the user saved or discarded the changes; close the window. */
#pragma once

#include <gtk/gtk.h>

#include "sw-document.h"
#include "sw-recovery.h"

G_BEGIN_DECLS

#define SW_TYPE_FILE_FLOW (sw_file_flow_get_type ())
G_DECLARE_FINAL_TYPE (SwFileFlow, sw_file_flow, SW, FILE_FLOW, GObject)

/* What to do once the changes are saved or discarded. */
typedef enum {
  SW_FILE_FLOW_NOTHING,
  SW_FILE_FLOW_CLOSE,
  SW_FILE_FLOW_NEW,
  SW_FILE_FLOW_OPEN,        /* the open dialog */
  SW_FILE_FLOW_OPEN_FILE,   /* a given file (a recent design) */
} SwFileFlowStep;

/* @parent: the dialogs' parent (not referenced: the window owns the flow);
 * @recent_menu: filled with the recent designs and kept up to date. */
SwFileFlow *sw_file_flow_new (GtkWindow *parent, SwDocument *document, SwRecovery *recovery,
                              GSettings *settings, GMenu *recent_menu);

/* Opens @file (@as_copy: an unsaved copy, as for a template); a failure is
 * reported with "message" and nothing changes. */
gboolean    sw_file_flow_load (SwFileFlow *self, GFile *file, gboolean as_copy);
gboolean    sw_file_flow_save_to (SwFileFlow *self, GFile *file, GError **error);
/* Runs @step now, or once the user has saved or discarded the changes. */
void        sw_file_flow_ask_then (SwFileFlow *self, SwFileFlowStep step, GFile *file);
void        sw_file_flow_save (SwFileFlow *self);
void        sw_file_flow_save_as (SwFileFlow *self);
/* Neither recent files nor the last design are remembered (tests, benchmarks). */
void        sw_file_flow_set_ephemeral (SwFileFlow *self, gboolean ephemeral);
/* Closes an open file chooser (the window is going). */
void        sw_file_flow_abandon (SwFileFlow *self);

G_END_DECLS
