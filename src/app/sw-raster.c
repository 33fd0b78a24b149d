/* SPDX-License-Identifier: GPL-3.0-or-later */
#include "config.h"

#include "sw-raster.h"

#include <math.h>

static cairo_user_data_key_t image_key;

GskRenderNode *
sw_raster_node (GskRenderNode *recorded, const graphene_rect_t *box, int scale)
{
  double x0 = floor (box->origin.x), y0 = floor (box->origin.y);
  int w = (int) ceil (box->origin.x + box->size.width - x0);
  int h = (int) ceil (box->origin.y + box->size.height - y0);
  cairo_surface_t *image;
  GskRenderNode *node;
  cairo_t *cr;

  scale = MAX (scale, 1);
  if (w <= 0 || h <= 0)
    return gsk_container_node_new (NULL, 0);
  image = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, w * scale, h * scale);
  cairo_surface_set_device_scale (image, scale, scale);
  cr = cairo_create (image);
  cairo_translate (cr, -x0, -y0);
  gsk_render_node_draw (recorded, cr);
  cairo_destroy (cr);

  node = gsk_cairo_node_new (&GRAPHENE_RECT_INIT (x0, y0, w, h));
  cr = gsk_cairo_node_get_draw_context (node);
  cairo_set_source_surface (cr, image, x0, y0);
  cairo_paint (cr);
  cairo_destroy (cr);
  /* The recording keeps a snapshot of @image, which cairo would copy if
   * @image went away first: the node's recording owns it instead. */
  cairo_surface_set_user_data (gsk_cairo_node_get_surface (node), &image_key, image,
                               (cairo_destroy_func_t) cairo_surface_destroy);
  return node;
}

typedef struct {
  GWeakRef   widget;
  guint     *id;
  void     (*prepare) (GtkWidget *widget);
} Pending;

static gboolean
prepare_cb (gpointer data)
{
  Pending *p = data;
  g_autoptr (GtkWidget) widget = g_weak_ref_get (&p->widget);

  if (widget == NULL)
    return G_SOURCE_REMOVE;
  *p->id = 0;
  if (gtk_widget_is_drawable (widget))
    p->prepare (widget);
  return G_SOURCE_REMOVE;
}

static void
pending_free (gpointer data)
{
  Pending *p = data;

  g_weak_ref_clear (&p->widget);
  g_free (p);
}

void
sw_raster_schedule (GtkWidget *widget, guint *id, void (*prepare) (GtkWidget *widget))
{
  Pending *p;

  if (*id != 0)
    return;
  p = g_new0 (Pending, 1);
  g_weak_ref_init (&p->widget, widget);
  p->id = id;
  p->prepare = prepare;
  *id = g_idle_add_full (G_PRIORITY_DEFAULT, prepare_cb, p, pending_free);
}
