/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-engine-types-editor.h: the economics object's lists in the window: the
 * engine types (name, dry mass of one engine, the stages that use it,
 * developed or not) and the stages already developed.  Each change is one
 * named edit of the core (sw-design-fields.h) committed to the document as
 * one undo step; a refused change (a stage already on another type, a name
 * taken) is shown and changes nothing. */
#pragma once

#include <gtk/gtk.h>

#include "sw-document.h"

G_BEGIN_DECLS

#define SW_TYPE_ENGINE_TYPES_EDITOR (sw_engine_types_editor_get_type ())
G_DECLARE_FINAL_TYPE (SwEngineTypesEditor, sw_engine_types_editor, SW, ENGINE_TYPES_EDITOR,
                      GtkWidget)

GtkWidget *sw_engine_types_editor_new (void);
/* Follows the document's design ("changed") and commits edits to it. */
void       sw_engine_types_editor_set_document (SwEngineTypesEditor *self, SwDocument *document);

/* For tests: the widgets of engine type @index (NULL out of range). */
typedef enum {
  SW_ENGINE_TYPE_NAME,        /* GtkEntry */
  SW_ENGINE_TYPE_DRY_MASS,    /* SwNumberField, kg */
  SW_ENGINE_TYPE_DEVELOPED,   /* GtkCheckButton */
  SW_ENGINE_TYPE_REMOVE,      /* GtkButton */
} SwEngineTypeWidget;
GtkWidget *sw_engine_types_editor_get_widget (SwEngineTypesEditor *self, guint index,
                                              SwEngineTypeWidget which);
/* GtkCheckButton: engine type @index on stage @stage. */
GtkWidget *sw_engine_types_editor_get_stage_check (SwEngineTypesEditor *self, guint index,
                                                   guint stage);
/* GtkCheckButton: stage @stage already developed. */
GtkWidget *sw_engine_types_editor_get_developed_stage (SwEngineTypesEditor *self, guint stage);
/* The check box of "developed_boosters" (hidden without boosters). */
GtkWidget *sw_engine_types_editor_get_boosters_developed (SwEngineTypesEditor *self);
GtkWidget *sw_engine_types_editor_get_add_button (SwEngineTypesEditor *self);
/* GtkLabel: the last refusal, hidden when there is none. */
GtkWidget *sw_engine_types_editor_get_message (SwEngineTypesEditor *self);

G_END_DECLS
