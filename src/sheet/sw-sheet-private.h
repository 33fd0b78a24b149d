/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-sheet-private.h: what the parts of the briefing sheet share: colours,
 * text and panel helpers (sw-sheet-text.c) and the charts (sw-sheet-charts.c). */
#pragma once

#include <cairo.h>
#include <pango/pangocairo.h>

#include "sw-analysis.h"

G_BEGIN_DECLS

/* Colours of the sheet (0xRRGGBB): the legends use the same values. */
enum {
  INK = 0x1b2530,
  MUTED = 0x5a6672,
  RULE = 0xc5cdd5,
  GRID = 0xe3e8ed,
  ACCENT = 0x1d5a87,
  ACCENT_LIGHT = 0xd6e4f0,
  STRUCTURE = 0x5d7f99,
  PROPELLANT = 0xb9d0e3,
  PAYLOAD = 0xd79b2b,
  SECOND = 0xc0701a,
  BAD = 0xa8322a,
  GOOD = 0x2e7d4f,
  BASELINE = 0x8a96a3,
  PANEL = 0xf4f6f8,
};

#define FONT_FAMILY "DejaVu Sans, Sans"


typedef struct {
  double   size;          /* font size in user units (points) */
  gboolean bold;
  guint32  color;
  PangoAlignment align;
  double   width;         /* wrap or align within; <= 0: no width */
  gboolean ellipsize;     /* fitted to width: whole, a little smaller if need be,
                             else cut between words */
  int      max_lines;     /* with ellipsize: lines it may wrap to (0: one) */
  double   min_size;      /* with ellipsize: smallest size tried (0: 80 % of size,
                             not below 6 pt) */
} TextStyle;

void         sw_sheet_set_color (cairo_t *cr, guint32 hex, double alpha);
PangoLayout *sw_sheet_layout (cairo_t *cr, const char *text, const TextStyle *st);
/* Draws @layout with its top left at @x, @y in the source colour: every text
 * of the sheet (and of the shared stack drawing) goes through here. */
void         sw_sheet_show_layout (cairo_t *cr, PangoLayout *layout, double x, double y);
/* Whether @text would be drawn whole in @st (not cut between words). */
gboolean     sw_sheet_fits (cairo_t *cr, const char *text, const TextStyle *st);
/* Draws @text with its top at @y; returns its height. */
double       sw_sheet_text_at (cairo_t *cr, const char *text, double x, double y,
                               const TextStyle *st);
/* Text whose vertical centre is at @cy. */
void         sw_sheet_text_centered_v (cairo_t *cr, const char *text, double x, double cy,
                                       const TextStyle *st);
TextStyle    sw_sheet_style (double size, gboolean bold, guint32 color);
TextStyle    sw_sheet_style_w (double size, gboolean bold, guint32 color, PangoAlignment align,
                               double width);
void         sw_sheet_rule (cairo_t *cr, double x0, double x1, double y, guint32 color,
                            double width);
/* A panel heading with a rule under it; returns the height used. */
double       sw_sheet_heading (cairo_t *cr, const char *title, double x, double y, double w);
void         sw_sheet_note_in_box (cairo_t *cr, const char *text, double x, double y, double w,
                                   double h);

/* For tests: every text drawn on @cr is appended to @boxes (SwSheetTextBox,
 * device space, ink extents); NULL stops recording. */
typedef struct {
  double x, y, w, h;
  char  *text;             /* owned by the array's clear function */
} SwSheetTextBox;
void         sw_sheet_private_record_text (cairo_t *cr, GArray *boxes);
/* From now on the texts drawn on @cr are not drawn as glyphs but appended
 * to @elements as SVG <text> elements (the SVG export adds them). */
void         sw_sheet_svg_text_begin (cairo_t *cr, GString *elements);

/* The area-proportional stack (sw-sheet.c). */
void     sw_sheet_draw_stack (cairo_t *cr, const SwDesign *design, const SwSizing *sizing,
                              const SwDesign *baseline_design, const SwSizing *baseline,
                              double x, double y, double w, double h);

/* The charts (sw-sheet-charts.c).  @design_point: the liftoff mass of the
 * design itself at @design_stages (NAN: none), drawn where it is even when
 * the split is not the optimal one of the curve. */
void     sw_sheet_draw_stage_curve (cairo_t *cr, const SwStageCurve *curve, const SwMcBand *band,
                                    const SwStageCurve *baseline, guint design_stages,
                                    double design_point, double x, double y, double w, double h);
void     sw_sheet_draw_reliability_curve (cairo_t *cr, const SwReliabilityCurve *curve,
                                          guint design_stages, double x, double y, double w,
                                          double h);
void     sw_sheet_draw_histogram (cairo_t *cr, const SwMcSummary *s, double reference,
                                  const char *axis_label, double x, double y, double w,
                                  double h);
void     sw_sheet_draw_tornado (cairo_t *cr, const SwDesign *design, const SwSensitivityTable *t,
                                guint max_rows, double x, double y, double w, double h);

G_END_DECLS
