/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-sheet.h: the one-page briefing sheet of an SwAnalysis, drawn with cairo
 * and pango (never GTK), as PDF, SVG or PNG on A4 or US Letter. */
#pragma once

#include <cairo.h>

#include "sw-analysis.h"

G_BEGIN_DECLS

#define SW_SHEET_PNG_DPI 150.0

typedef enum {
  SW_PAPER_A4,
  SW_PAPER_LETTER,
} SwPaper;

typedef enum {
  SW_SHEET_PDF,
  SW_SHEET_SVG,
  SW_SHEET_PNG,
} SwSheetFormat;

/* Page size in points (1/72 inch), portrait. */
void     sw_sheet_paper_size (SwPaper paper, double *width_pt, double *height_pt);
/* Pixel size of the PNG of @paper at SW_SHEET_PNG_DPI. */
void     sw_sheet_png_size (SwPaper paper, int *width_px, int *height_px);
gboolean sw_paper_from_string (const char *text, SwPaper *paper);

/* The whole page, in a user space of @width x @height points. */
void     sw_sheet_draw_page (cairo_t *cr, const SwAnalysis *analysis, double width,
                             double height);

/* Writes the sheet of @analysis to @filename (through a temporary file,
 * renamed when complete).  The SVG keeps its text as text. */
gboolean sw_sheet_export (const SwAnalysis *analysis, SwSheetFormat format, SwPaper paper,
                          const char *filename, GError **error);

G_END_DECLS
