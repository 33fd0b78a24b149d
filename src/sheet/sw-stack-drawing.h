/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-stack-drawing.h: the one picture of the vehicle, "area proportional to
 * mass", drawn with cairo (never GTK) so the stack view on screen and the
 * briefing sheet on paper draw the same shapes.
 *
 * The shape rule: a part of mass m is a block a m^(1/3) wide and
 * b m^(2/3) tall, so its area is (a b) m and heavier stages are wider as well
 * as taller, tapering like a vehicle.  The payload is a cone of the same
 * width rule and twice the height, so its area is (a b) m too.  One scale
 * (a, b) is shared by everything drawn side by side (a baseline beside the
 * design); the ratio b/a only decides how the stack fills its box. */
#pragma once

#include <cairo.h>

#include "sw-analysis.h"

G_BEGIN_DECLS

#define SW_STACK_MAX_PARTS (SW_MAX_STAGES + 1)

typedef struct {
  double x, y, width, height;
} SwStackBox;

/* Bottom (first stage) to top; a stage of mass <= 0 or not finite is unused. */
typedef struct {
  guint  n_stages;
  double stage_kg[SW_MAX_STAGES];
  double structure_kg[SW_MAX_STAGES];
  double payload_kg;
} SwStackMasses;

typedef struct {
  double a;   /* width per kg^(1/3) */
  double b;   /* height per kg^(2/3) */
} SwStackScale;

typedef enum {
  SW_STACK_PART_STAGE,
  SW_STACK_PART_UNUSED,    /* a thin placeholder, not to scale (it has no mass) */
  SW_STACK_PART_PAYLOAD,   /* a cone inside its box */
} SwStackPartKind;

typedef struct {
  guint           n;                                 /* parts, bottom to top */
  SwStackPartKind kind[SW_STACK_MAX_PARTS];
  int             stage[SW_STACK_MAX_PARTS];         /* firing order; -1: payload */
  double          mass_kg[SW_STACK_MAX_PARTS];
  SwStackBox      box[SW_STACK_MAX_PARTS];
  SwStackBox      structure[SW_STACK_MAX_PARTS];     /* band at the bottom of a stage */
  double          top;                               /* y of the cone's tip */
  double          width;                             /* widest part */
} SwStackGeometry;

typedef struct {
  double propellant[4];    /* RGBA */
  double structure[4];
  double payload[4];
  double outline[4];       /* alpha 0: no outline */
  double line_width;
} SwStackStyle;

/* FALSE (and @m cleared) when @s is NULL or not feasible. */
gboolean sw_stack_masses_from_sizing (const SwSizing *s, SwStackMasses *m);

/* Width of the widest part and the total height of @m at scale @s with
 * @gap between parts and @unused_height for each unused stage (0: skipped). */
double   sw_stack_width (const SwStackMasses *m, const SwStackScale *s);
double   sw_stack_height (const SwStackMasses *m, const SwStackScale *s, double gap,
                          double unused_height);

/* The largest scale at which the @n_stacks stacks stand side by side
 * (@side_gap apart) inside @width x @height, with the heaviest part's
 * height/width between @min_aspect and @max_aspect.  FALSE when nothing
 * fits or there is no mass. */
gboolean sw_stack_fit (const SwStackMasses *const *stacks, guint n_stacks, double width,
                       double height, double gap, double unused_height, double side_gap,
                       double min_aspect, double max_aspect, SwStackScale *scale);

/* The parts of @m centred on @cx, standing on @bottom. */
void     sw_stack_place (const SwStackMasses *m, const SwStackScale *s, double cx,
                         double bottom, double gap, double unused_height, SwStackGeometry *g);

/* Drawn area per kilogram of @s (a b). */
double   sw_stack_area_per_kg (const SwStackScale *s);

/* Fills one part (@outline_only: a dashed outline, for a baseline). */
void     sw_stack_draw_part (cairo_t *cr, const SwStackGeometry *g, guint i,
                             const SwStackStyle *st, gboolean outline_only);
void     sw_stack_draw (cairo_t *cr, const SwStackGeometry *g, const SwStackStyle *st,
                        gboolean outline_only);

/* A copy of @text (plain or Pango markup) where a number keeps to its unit
 * and to the word before it: the space after a digit ("2,007 m/s"), the
 * space between a word and a number ("Δv 2,007", "T/W 1.35") become no-break
 * spaces, and a slash between letters ("m/s") gets a word joiner, so a
 * wrapped label never breaks as "Δv 2,007 m/" + "s".  The formatter's own
 * text (a plain space, compared literally by many tests) is left alone;
 * drawings convert here. */
char    *sw_stack_glue_units (const char *text);

/* The sheet's panel inside (x, y, w, h): the design's stack, the baseline's
 * dashed outline beside it at the same scale (@baseline may be NULL), the
 * stage names and masses to the right. */
void     sw_stack_draw_panel (cairo_t *cr, const SwDesign *design, const SwSizing *sizing,
                              const SwSizing *baseline, double x, double y, double w, double h);

G_END_DECLS
