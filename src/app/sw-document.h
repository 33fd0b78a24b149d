/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-document.h: the design being edited in one window, its file, its undo
 * and redo history and whether it has unsaved changes. */
#pragma once

#include <gio/gio.h>

#include "sw-design.h"

G_BEGIN_DECLS

#define SW_TYPE_DOCUMENT (sw_document_get_type ())
G_DECLARE_FINAL_TYPE (SwDocument, sw_document, SW, DOCUMENT, GObject)

SwDocument     *sw_document_new (void);
const SwDesign *sw_document_get_design (SwDocument *self);
SwDesign       *sw_document_dup_design (SwDocument *self);

/* One undoable edit: @design (taken) replaces the current design.  Edits
 * with the same non-NULL @merge_key in quick succession (a slider drag,
 * arrow clicks on a spin button) become one undo step; keys starting with
 * "drag:" merge however slow the drag, until sw_document_end_merge(). */
void      sw_document_commit (SwDocument *self, SwDesign *design, const char *merge_key);
void      sw_document_end_merge (SwDocument *self);
gboolean  sw_document_undo (SwDocument *self);
gboolean  sw_document_redo (SwDocument *self);
gboolean  sw_document_can_undo (SwDocument *self);
gboolean  sw_document_can_redo (SwDocument *self);

/* Replace everything (new, open, restore): clears the history.  With
 * @modified FALSE the design becomes the saved state. */
void      sw_document_reset (SwDocument *self, SwDesign *design, GFile *file, gboolean modified);
/* On failure nothing changes and @error names the file, the field and why. */
gboolean  sw_document_load (SwDocument *self, GFile *file, GPtrArray *warnings, GError **error);
/* @file NULL: the current file. */
gboolean  sw_document_save (SwDocument *self, GFile *file, GError **error);

GFile    *sw_document_get_file (SwDocument *self);
gboolean  sw_document_get_modified (SwDocument *self);
/* "Name" or a placeholder when the design has no name. */
char     *sw_document_dup_title (SwDocument *self);

/* Signals: "changed" after every change of the design (edit, undo, redo,
 * reset, load).  Properties: "file", "modified", "can-undo", "can-redo". */

G_END_DECLS
