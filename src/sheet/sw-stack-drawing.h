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
 * design); the ratio b/a only decides how the stack fills its box.
 *
 * Strap-on boosters stand beside the first stage (the core), on the same
 * ground, each a block of its own mass by the same rule (so their area is
 * (a b) m too): half of them on the left, the rest on the right. */
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
  guint  n_boosters;                /* beside stage 0; 0: none */
  double booster_kg;                /* per booster */
  double booster_structure_kg;      /* per booster */
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
  double          width;                             /* widest part (boosters included) */
  guint           n_boosters;                        /* beside stage 0 */
  double          booster_mass_kg;                   /* each */
  SwStackBox      booster[SW_BOOSTERS_MAX];
  SwStackBox      booster_structure[SW_BOOSTERS_MAX];
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
/* The boosters alone (sw_stack_draw draws them with the parts). */
void     sw_stack_draw_boosters (cairo_t *cr, const SwStackGeometry *g, const SwStackStyle *st,
                                 gboolean outline_only);

/* ---- the vehicle to scale, in metres ------------------------------------ */

/* The second picture: every stage at its length and diameter (from the
 * analysis's SwVehicleShape), the tanks inside, the interstages, the fairing
 * on top, a vertical scale bar of a round length at the left and a person
 * (SW_PERSON_HEIGHT_M) standing at the base on the right.  The callers write
 * the texts (the bar's length, "1.8 m", names) in their own fonts, at the
 * boxes this layout gives. */
typedef struct {
  double     px_per_m;
  double     cx, bottom;                   /* the vehicle's axis and base */
  guint      n_stages;
  SwStackBox stage[SW_MAX_STAGES];         /* each stage's outline */
  SwStackBox fairing;
  guint      n_boosters_drawn;             /* boosters in profile (0 to 2) */
  SwStackBox booster[2];
  SwStackBox person;
  double     bar_m;                        /* the scale bar's length, round */
  SwStackBox bar;
  double     top;                          /* the fairing's tip */
} SwScaleGeometry;

typedef struct {
  double skin[4];          /* stage walls, engine sections, interstages */
  double oxidizer[4];      /* oxidizer tank; a solid's case */
  double fuel[4];
  double fairing[4];
  double outline[4];
  double mark[4];          /* scale bar and person */
  double line_width;
} SwScaleStyle;

/* Room the scale bar needs at the left, and the person at the right. */
#define SW_SCALE_BAR_ROOM 16.0
#define SW_SCALE_PERSON_ROOM 14.0

/* Lays @v out in the box (@x, @y, @w, @h), standing on its bottom edge, as
 * large as fits with @left_room before it (the bar and its label) and
 * @right_room after it (the person and its label).  FALSE when @v has no
 * shape or nothing fits. */
gboolean sw_scale_layout (const SwVehicleShape *v, double x, double y, double w, double h,
                          double left_room, double right_room, SwScaleGeometry *g);
void     sw_scale_draw (cairo_t *cr, const SwVehicleShape *v, const SwScaleGeometry *g,
                        const SwScaleStyle *st);
/* A round length (1, 2 or 5 times a power of ten metres) near a quarter of
 * @height_m, for the scale bar. */
double   sw_scale_bar_length (double height_m);
/* "1.8 m": the person's label. */
char    *sw_scale_person_label (void);

/* The sheet's to-scale panel inside (x, y, w, h), or the reason there is
 * none. */
void     sw_scale_draw_panel (cairo_t *cr, const SwAnalysis *analysis, double x, double y,
                              double w, double h);

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
