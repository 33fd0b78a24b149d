/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-sheet-staging.h: the briefing sheet's staging-decision panel. */
#pragma once

#include <cairo.h>

#include "sw-analysis.h"
#include "sw-design.h"

G_BEGIN_DECLS

/* The panel's height in points. */
double sw_sheet_staging_height (const SwDesign *design);
/* Computes the staging decision of the analysed design (sw_analysis_staging:
 * with the closed loop's losses once the analysis has them) and draws it in
 * the box. */
void   sw_sheet_draw_staging (cairo_t *cr, const SwAnalysis *analysis, double x, double y,
                              double w, double h);

G_END_DECLS
