/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-staging-page.h: the staging decision (small multiples of liftoff mass,
 * development effort, cost per flight, mission success and payload against
 * stage count, on one shared x scale, this design marked, the best count
 * highlighted, the weighting stated, money in the design's currency when
 * it gives the cost of a work-year) and a carpet plot: two inputs the user
 * picks (any parameter sw_carpet_list_params() offers), their ranges and
 * point counts in validated fields, and the output (liftoff mass, payload
 * of a vehicle of this liftoff mass, development effort, cost per flight),
 * drawn as contour lines, infeasible points hatched, this design marked.
 * Both are computed on a worker thread from a copy of the design; a newer
 * result cancels the older work; the carpet reports its progress and can
 * be cancelled.  "ready" is emitted each time new figures are shown. */
#pragma once

#include <gtk/gtk.h>

#include "sw-analysis.h"
#include "sw-carpet.h"
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
/* The boosters' recovery mode (economics.recovery.booster_mode). */
GtkWidget *sw_staging_page_get_booster_mode (SwStagingPage *self);
/* The SwEngineTypesEditor: engine types and developed stages. */
GtkWidget *sw_staging_page_get_engine_types (SwStagingPage *self);
/* Test API: the staging figures shown, or NULL before the first. */
const SwStaging *sw_staging_page_get_staging (SwStagingPage *self);
/* Test API: TRUE once the worker's figures for the last result are shown. */
gboolean   sw_staging_page_is_ready (SwStagingPage *self);
/* The weighting statement shown (for tests). */
const char *sw_staging_page_get_weighting (SwStagingPage *self);

typedef enum {
  SW_CARPET_CONTROL_PARAM,     /* GtkDropDown of an axis */
  SW_CARPET_CONTROL_MIN,       /* SwNumberField of an axis */
  SW_CARPET_CONTROL_MAX,
  SW_CARPET_CONTROL_POINTS,
  SW_CARPET_CONTROL_OUTPUT,    /* GtkDropDown, SwCarpetOutput order */
  SW_CARPET_CONTROL_BUTTON,    /* Cancel while computing, Compute after a cancel */
  SW_CARPET_CONTROL_STATUS,    /* GtkLabel: why the carpet is not drawn */
  SW_CARPET_CONTROL_CURRENCY,  /* GtkEntry of economics.currency */
  SW_CARPET_CONTROL_MONEY,     /* GtkCheckButton: cost contours in money (a cost output of a
                                * design with a cost per work-year; hidden otherwise) */
} SwCarpetControl;

/* Test API: the carpet's controls (@axis 0 across, 1 up), the grid shown
 * (NULL before the first or after a cancel), a parameter of the menus,
 * whether the worker runs. */
GtkWidget      *sw_staging_page_get_carpet_control (SwStagingPage *self, SwCarpetControl control,
                                                    guint axis);
const SwCarpet *sw_staging_page_get_carpet (SwStagingPage *self);
gboolean        sw_staging_page_get_param (SwStagingPage *self, guint index, SwCarpetAxis *out);
gboolean        sw_staging_page_is_busy (SwStagingPage *self);
/* The carpet's axes and output as if the user had picked them (for
 * --carpet with --screenshot); taken into the fields when a design comes. */
void            sw_staging_page_choose_carpet (SwStagingPage *self, const SwCarpetAxis *x,
                                               const SwCarpetAxis *y, SwCarpetOutput output);
/* Scrolls the page so that the whole carpet plot shows, its controls above
 * it as far as they fit (for --page=carpet). */
void            sw_staging_page_scroll_to_carpet (SwStagingPage *self);

G_END_DECLS
