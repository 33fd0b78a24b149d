/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-sheet.h: the one-page briefing sheet, drawn with cairo and pango (never
 * GTK), as PDF, SVG or PNG on A4 or US Letter.  The panel drawers are public
 * so the GUI can reuse them in its export preview. */
#pragma once

#include <cairo.h>

#include "sw-briefing.h"

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

extern const char *const sw_sheet_caution;

/* Page size in points (1/72 inch), portrait. */
void     sw_sheet_paper_size (SwPaper paper, double *width_pt, double *height_pt);
/* Pixel size of the PNG of @paper at SW_SHEET_PNG_DPI. */
void     sw_sheet_png_size (SwPaper paper, int *width_px, int *height_px);
gboolean sw_paper_from_string (const char *text, SwPaper *paper);

/* The whole page, in a user space of @width x @height points. */
void     sw_sheet_draw_page (cairo_t *cr, const SwBriefing *b, double width, double height);

/* Panels (x, y, w, h in user units). */
/* The area-proportional stack: each stage's drawn area is proportional to
 * its mass (propellant + structure, the structure shaded), the payload on
 * top; with @baseline a dashed outline of the baseline beside it at the
 * same scale. */
void     sw_sheet_draw_stack (cairo_t *cr, const SwDesign *design, const SwSizing *sizing,
                              const SwDesign *baseline_design, const SwSizing *baseline,
                              double x, double y, double w, double h);
/* Liftoff mass against stage count on a log axis, infeasible counts marked,
 * the Monte Carlo band and the baseline's curve when given (may be NULL). */
void     sw_sheet_draw_stage_curve (cairo_t *cr, const SwStageCurve *curve, const SwMcBand *band,
                                    const SwStageCurve *baseline, guint design_stages,
                                    double x, double y, double w, double h);
void     sw_sheet_draw_reliability_curve (cairo_t *cr, const SwReliabilityCurve *curve,
                                          guint design_stages, double x, double y, double w,
                                          double h);
/* Histogram of a Monte Carlo summary (values in kg, drawn in t) with the
 * 5th, 50th and 95th percentiles marked; @reference (NAN = none) is marked
 * too, e.g. the nominal value. */
void     sw_sheet_draw_histogram (cairo_t *cr, const SwMcSummary *s, double reference,
                                  const char *axis_label, double x, double y, double w,
                                  double h);
/* The tornado: the @max_rows largest effects, minus and plus step. */
void     sw_sheet_draw_tornado (cairo_t *cr, const SwDesign *design, const SwSensitivityTable *t,
                                guint max_rows, double x, double y, double w, double h);

/* Writes the sheet of @b to @filename (through a temporary file, renamed
 * when complete). */
gboolean sw_sheet_export (const SwBriefing *b, SwSheetFormat format, SwPaper paper,
                          const char *filename, GError **error);

G_END_DECLS
