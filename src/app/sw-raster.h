/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-raster.h: drawings turned into pixels ahead of the frame.
 *
 * GTK's cairo renderer replays a cairo node's recorded operations into a
 * scratch image on every frame that repaints any of its area, so a plot's
 * curves and text are rasterised again in each frame that shows them.  The
 * views that draw with cairo (plots, stack) rasterise a changed drawing
 * once, as soon as its inputs change (from an idle that runs before the
 * frame clock's, see sw_raster_schedule()), into an image the node then
 * only copies. */
#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

/* A node that paints @recorded's pixels within @box (NULL: @recorded's own
 * bounds), rounded out to whole pixels, at @scale device pixels per unit,
 * drawn now.  Takes @recorded. */
GskRenderNode *sw_raster_node (GskRenderNode *recorded, const graphene_rect_t *box, int scale);

/* One node with the pixels of @nodes (NULL entries skipped; nodes of
 * sw_raster_node() are copied, others drawn) within @box, at @scale.  The
 * renderer repaints a changed node over its whole box: one rectangle
 * however many of @nodes changed, where apart each would be its own (see
 * DEVELOPERS.md, "Damage in few rectangles").  Drawn now. */
GskRenderNode *sw_raster_compose (GskRenderNode *const *nodes, guint n, const graphene_rect_t *box,
                                  int scale);

/* Calls @prepare (@widget) from an idle at the default priority, once
 * however often it is asked before it runs: after the caller has set all
 * of a result's inputs and before the frame that shows them.  @id holds the
 * idle's source id (0 when none); clear it with g_clear_handle_id() in
 * dispose.  @prepare is skipped while @widget is not drawable (the snapshot
 * then prepares it). */
void sw_raster_schedule (GtkWidget *widget, guint *id, void (*prepare) (GtkWidget *widget));

G_END_DECLS
