/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-staging-page.h: the staging decision (small multiples of liftoff mass,
 * development effort, cost per flight, mission success and payload against
 * stage count, on one shared x scale, this design marked, the best count
 * highlighted, the weighting stated) and a carpet plot of liftoff mass over
 * the first stage's structural coefficient and the top stage's vacuum Isp
 * (contour lines, infeasible points hatched, this design marked).  Both are
 * computed on a worker thread from a copy of the design; a newer result
 * cancels the older work; the carpet reports its progress. */
#pragma once

#include <gtk/gtk.h>

#include "sw-analysis.h"
#include "sw-document.h"
#include "sw-economics.h"

G_BEGIN_DECLS

#define SW_TYPE_STAGING_PAGE (sw_staging_page_get_type ())
G_DECLARE_FINAL_TYPE (SwStagingPage, sw_staging_page, SW, STAGING_PAGE, GtkWidget)

GtkWidget *sw_staging_page_new (void);
void       sw_staging_page_set_result (SwStagingPage *self, SwAnalysis *result);
/* The document the page's fields edit (the design's economics keys). */
void       sw_staging_page_set_document (SwStagingPage *self, SwDocument *document);
/* Test API: the field of a numeric economics key, the recovery-mode menu. */
GtkWidget *sw_staging_page_get_field (SwStagingPage *self, SwEconNumber key);
GtkWidget *sw_staging_page_get_mode (SwStagingPage *self);
/* The SwEngineTypesEditor: engine types and developed stages. */
GtkWidget *sw_staging_page_get_engine_types (SwStagingPage *self);
/* Test API: TRUE once the worker's figures for the last result are shown. */
gboolean   sw_staging_page_is_ready (SwStagingPage *self);
/* The weighting statement shown (for tests). */
const char *sw_staging_page_get_weighting (SwStagingPage *self);

G_END_DECLS
