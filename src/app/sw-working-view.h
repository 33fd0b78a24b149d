/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-working-view.h: "Show the working": for the selected stage each formula
 * with the numbers of the current result put in, as selectable text. */
#pragma once

#include <gtk/gtk.h>

#include "sw-analysis.h"

G_BEGIN_DECLS

#define SW_TYPE_WORKING_VIEW (sw_working_view_get_type ())
G_DECLARE_FINAL_TYPE (SwWorkingView, sw_working_view, SW, WORKING_VIEW, GtkWidget)

GtkWidget *sw_working_view_new (void);
void       sw_working_view_set_result (SwWorkingView *self, SwAnalysis *result);
void       sw_working_view_set_selected (SwWorkingView *self, int stage);
/* The text as copied (with the cautions line). */
char      *sw_working_view_dup_text (SwWorkingView *self);

/* Widget action: working.copy */

G_END_DECLS
