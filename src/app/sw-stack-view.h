/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-stack-view.h: the vehicle drawn as a stack of stage blocks whose areas
 * are proportional to their computed masses.  Draws an SwAnalysis; never
 * computes physics. */
#pragma once

#include <gtk/gtk.h>

#include "sw-analysis.h"

G_BEGIN_DECLS

#define SW_TYPE_STACK_VIEW (sw_stack_view_get_type ())
G_DECLARE_FINAL_TYPE (SwStackView, sw_stack_view, SW, STACK_VIEW, GtkWidget)

GtkWidget *sw_stack_view_new (void);
/* Takes a reference; NULL clears the view. */
void       sw_stack_view_set_result (SwStackView *self, SwAnalysis *result);
SwAnalysis  *sw_stack_view_get_result (SwStackView *self);
/* -1 for none. Property "selected-stage". */
void       sw_stack_view_set_selected (SwStackView *self, int stage);
int        sw_stack_view_get_selected (SwStackView *self);

/* Geometry of the last layout, for tests: the rectangle of stage @index
 * (firing order) in widget coordinates; FALSE when not drawn. */
gboolean   sw_stack_view_get_block_rect (SwStackView *self, guint index, graphene_rect_t *rect);
/* For tests: the thrust-to-weight at ignition a stage's label shows (NAN
 * for none). */
double     sw_stack_view_get_stage_tw (SwStackView *self, guint stage);

/* Added by the implementation, for tests and for placing popovers: the
 * payload's box (the payload is drawn as a cone filling half of it, the
 * shape rule of sw-stack-drawing.h); the structure band inside stage @index's block (FALSE when
 * the stage is not drawn to scale); the block area per kilogram in square
 * pixels (0 when the vehicle is not sized). */
gboolean   sw_stack_view_get_payload_rect (SwStackView *self, graphene_rect_t *rect);
gboolean   sw_stack_view_get_structure_rect (SwStackView *self, guint index, graphene_rect_t *rect);
double     sw_stack_view_get_area_scale (SwStackView *self);
/* The pinned baseline's outline beside the stack, same area scale: block
 * @index counts its drawn stages from the bottom, the payload last; FALSE
 * when not drawn (no baseline, or it or the design does not close). */
gboolean   sw_stack_view_get_baseline_rect (SwStackView *self, guint index,
                                            graphene_rect_t *rect);

/* The second picture (property "to-scale"): the vehicle to scale in metres,
 * with its tanks, interstages, fairing, a scale bar and a person for scale;
 * where the design lacks a propellant or diameter it says so instead.  No
 * border is dragged in it.  FALSE: area proportional to mass. */
void       sw_stack_view_set_to_scale (SwStackView *self, gboolean to_scale);
gboolean   sw_stack_view_get_to_scale (SwStackView *self);
/* Pixels per metre of the last to-scale layout; 0 when not drawn to scale. */
double     sw_stack_view_get_metre_scale (SwStackView *self);
/* The scale bar's rectangle and the metres it stands for (tests). */
gboolean   sw_stack_view_get_scale_bar (SwStackView *self, graphene_rect_t *rect,
                                        double *metres);

/* Strap-on booster @index (0 to count - 1) beside the first stage, and the
 * structure band inside it; FALSE when not drawn (no boosters, or not the
 * mass picture).  Same area scale as the blocks. */
gboolean   sw_stack_view_get_booster_rect (SwStackView *self, guint index,
                                           graphene_rect_t *rect, graphene_rect_t *structure);

/* For tests: the drawing the next frame will show (drawn as soon as the
 * view's inputs change, see sw-raster.h), or NULL. */
GskRenderNode *sw_stack_view_peek_drawing (SwStackView *self);

/* Signals:
 *   "stage-activated" (int stage)             a click selected a stage
 *   "share-dragged"   (int lower, int upper, double amount, gboolean finished)
 *        the border between stage @lower and stage @upper = lower + 1 was
 *        dragged; @amount is the delta-v share to move from @upper to
 *        @lower since the drag began (negative: the other way).  The
 *        owner edits the design (split becomes manual) and posts a solve;
 *        @finished is TRUE on release (one undo step per drag). */

/* @markup of a stage label with each " · " after its bold title made a
 * line break (for a label too wide for its column). */
char *sw_stack_break_at_separators (const char *markup);

G_END_DECLS
