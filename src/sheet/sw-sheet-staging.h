/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-sheet-staging.h: the briefing sheet's staging-decision panel. */
#pragma once

#include <cairo.h>

#include "sw-analysis.h"
#include "sw-design.h"
#include "sw-staging.h"

G_BEGIN_DECLS

/* The panel's height in points, at width @w (@staging: the staging
 * decision of the analysed design, sw_analysis_staging(); NULL when it could
 * not be computed; @cr measures the text). */
double sw_sheet_staging_height (cairo_t *cr, const SwAnalysis *analysis,
                                const SwStaging *staging, double w);
/* Draws the staging decision @staging (NULL: not computed) in the box. */
void   sw_sheet_draw_staging (cairo_t *cr, const SwAnalysis *analysis, const SwStaging *staging,
                              double x, double y, double w, double h);

G_END_DECLS
