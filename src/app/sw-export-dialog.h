/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-export-dialog.h: the briefing sheet (PDF, SVG or PNG on A4 or US
 * Letter) and the CSV tables of the shown result, written by the sheet
 * library on a worker thread (GTask) so the window never waits. */
#pragma once

#include <gtk/gtk.h>

#include "sw-analysis.h"
#include "sw-sheet.h"

G_BEGIN_DECLS

#define SW_TYPE_EXPORT_DIALOG (sw_export_dialog_get_type ())
G_DECLARE_FINAL_TYPE (SwExportDialog, sw_export_dialog, SW, EXPORT_DIALOG, GtkWindow)

/* @design_file (may be NULL) suggests where to write. */
SwExportDialog *sw_export_dialog_new (GtkWindow *parent, SwAnalysis *result, GFile *design_file);
/* The window hands on every newer result while the dialog is open. */
void            sw_export_dialog_set_result (SwExportDialog *self, SwAnalysis *result);
/* For tests: where the dialog would write (NULL: no CSV). */
void            sw_export_dialog_set_targets (SwExportDialog *self, SwSheetFormat format,
                                              SwPaper paper, const char *sheet_path,
                                              const char *csv_dir);
/* Starts the export as the Export button does; "finished" is emitted when it
 * is done (check sw_export_dialog_get_status()). */
void            sw_export_dialog_export (SwExportDialog *self);
gboolean        sw_export_dialog_is_busy (SwExportDialog *self);
const char     *sw_export_dialog_get_status (SwExportDialog *self, gboolean *failed);

/* The work itself, on a worker thread: the sheet to @sheet_path (may be
 * NULL) and the CSV tables into @csv_dir (may be NULL).  Finishes with the
 * paths written (owned strings). */
void            sw_export_run_async (SwAnalysis *result, SwSheetFormat format, SwPaper paper,
                                     const char *sheet_path, const char *csv_dir,
                                     GCancellable *cancellable, GAsyncReadyCallback callback,
                                     gpointer user_data);
GPtrArray      *sw_export_run_finish (GAsyncResult *result, GError **error);

G_END_DECLS
