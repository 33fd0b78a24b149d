/* SPDX-License-Identifier: GPL-3.0-or-later */
#include "config.h"

#include "sw-raster.h"

#include <math.h>
#include <string.h>
#include <sys/mman.h>

static cairo_user_data_key_t image_key;
static cairo_user_data_key_t mapping_key;

/* Images from this size on get pages of their own from the system (kept
 * for the next images when they go, see below).  From the heap, images of
 * the changing sizes of the plots' ink boxes left it fragmented: the
 * resident memory grew by about 0.2 MB per 1,000 edits, for good. */
#define OWN_PAGES_FROM (64 * 1024)

typedef struct {
  void  *addr;
  gsize  length;
} Mapping;

/* Pages given back by images that went, kept for the next images: taking
 * fresh pages from the system for every image cost a page fault per 4 KB
 * page, and giving them back stopped the other processor to flush its
 * address cache (about 0.5 ms of each edit).  A few are kept, the
 * smallest first to go, so the memory stays flat. */
#define KEPT_MAPPINGS 12
static Mapping *kept[KEPT_MAPPINGS];
static guint n_kept;
static gint64 last_take_us;
static guint trim_id;
G_LOCK_DEFINE_STATIC (kept);

/* Gives every kept mapping back once no image has been made for a while:
 * the window at rest holds only the pages its images use. */
#define TRIM_AFTER_MS 2000

static gboolean
trim_cb (gpointer data)
{
  Mapping *out[KEPT_MAPPINGS];
  guint n = 0;

  G_LOCK (kept);
  if (g_get_monotonic_time () - last_take_us < TRIM_AFTER_MS * G_TIME_SPAN_MILLISECOND)
    {
      G_UNLOCK (kept);
      return G_SOURCE_CONTINUE;
    }
  while (n_kept > 0)
    out[n++] = kept[--n_kept];
  trim_id = 0;
  G_UNLOCK (kept);
  for (guint i = 0; i < n; i++)
    {
      munmap (out[i]->addr, out[i]->length);
      g_free (out[i]);
    }
  return G_SOURCE_REMOVE;
}

static void
mapping_free (void *data)
{
  Mapping *m = data;
  guint smallest = 0;

  G_LOCK (kept);
  if (n_kept < KEPT_MAPPINGS)
    {
      kept[n_kept++] = m;
      m = NULL;
    }
  else
    {
      for (guint i = 1; i < n_kept; i++)
        if (kept[i]->length < kept[smallest]->length)
          smallest = i;
      if (kept[smallest]->length < m->length)
        {
          Mapping *out = kept[smallest];
          kept[smallest] = m;
          m = out;
        }
    }
  G_UNLOCK (kept);
  if (m != NULL)
    {
      munmap (m->addr, m->length);
      g_free (m);
    }
}

/* Pages for @length bytes: the smallest kept mapping that holds them and is
 * not more than twice as large (cleared), or fresh ones (cleared by the
 * system).  NULL when the system has none. */
static Mapping *
take_mapping (gsize length)
{
  Mapping *m = NULL;
  guint best = G_MAXUINT;
  void *addr;

  G_LOCK (kept);
  last_take_us = g_get_monotonic_time ();
  if (trim_id == 0)
    trim_id = g_timeout_add (TRIM_AFTER_MS / 4, trim_cb, NULL);
  for (guint i = 0; i < n_kept; i++)
    if (kept[i]->length >= length && kept[i]->length / 2 <= length
        && (best == G_MAXUINT || kept[i]->length < kept[best]->length))
      best = i;
  if (best != G_MAXUINT)
    {
      m = kept[best];
      kept[best] = kept[--n_kept];
    }
  G_UNLOCK (kept);
  if (m != NULL)
    {
      memset (m->addr, 0, length);
      return m;
    }
  length = (length + 4095) & ~(gsize) 4095;
  addr = mmap (NULL, length, PROT_READ | PROT_WRITE, MAP_PRIVATE | MAP_ANONYMOUS, -1, 0);
  if (addr == MAP_FAILED)
    return NULL;
  m = g_new (Mapping, 1);
  m->addr = addr;
  m->length = length;
  return m;
}

/* A cleared ARGB image of @width x @height device pixels. */
static cairo_surface_t *
new_image (int width, int height)
{
  int stride = cairo_format_stride_for_width (CAIRO_FORMAT_ARGB32, width);
  gsize length = (gsize) stride * (gsize) height;
  cairo_surface_t *image;
  Mapping *m;

  if (stride <= 0 || length < OWN_PAGES_FROM || (m = take_mapping (length)) == NULL)
    return cairo_image_surface_create (CAIRO_FORMAT_ARGB32, width, height);
  image = cairo_image_surface_create_for_data (m->addr, CAIRO_FORMAT_ARGB32, width, height, stride);
  if (cairo_surface_status (image) != CAIRO_STATUS_SUCCESS
      || cairo_surface_set_user_data (image, &mapping_key, m, mapping_free) != CAIRO_STATUS_SUCCESS)
    {
      cairo_surface_destroy (image);
      mapping_free (m);
      return cairo_image_surface_create (CAIRO_FORMAT_ARGB32, width, height);
    }
  return image;
}

/* The box @box rounded out to whole pixels: its origin and size.  FALSE
 * when it holds no pixel. */
static gboolean
pixel_box (const graphene_rect_t *box, double *x0, double *y0, int *w, int *h)
{
  *x0 = floor (box->origin.x);
  *y0 = floor (box->origin.y);
  *w = (int) ceil (box->origin.x + box->size.width - *x0);
  *h = (int) ceil (box->origin.y + box->size.height - *y0);
  return *w > 0 && *h > 0;
}

static cairo_surface_t *
acquire_image (cairo_pattern_t *pattern, void *image, cairo_surface_t *target,
               const cairo_rectangle_int_t *extents)
{
  return cairo_surface_reference (image);
}

static void
release_image (cairo_pattern_t *pattern, void *image, cairo_surface_t *surface)
{
  cairo_surface_destroy (surface);
}

/* A node that paints @image (@w x @h units from @x0, @y0, @scale device
 * pixels per unit).  Takes @image.
 *
 * The node's recording paints @image through a raster-source pattern,
 * which hands cairo the image itself whenever the recording is replayed.
 * Painted as a surface pattern, the recording would keep a snapshot of
 * @image, and cairo copies the pixels into a snapshot still attached when
 * its image goes, even one about to be freed: an image's worth of copying
 * and clearing for every image of every frame's edit (a plot's layers,
 * the stack's body; 0.1 ms each here). */
static GskRenderNode *
image_node (cairo_surface_t *image, double x0, double y0, int w, int h, int scale)
{
  GskRenderNode *node = gsk_cairo_node_new (&GRAPHENE_RECT_INIT (x0, y0, w, h));
  cairo_t *cr = gsk_cairo_node_get_draw_context (node);
  cairo_pattern_t *source = cairo_pattern_create_raster_source (image, CAIRO_CONTENT_COLOR_ALPHA,
                                                                w * scale, h * scale);
  cairo_matrix_t m;

  cairo_raster_source_pattern_set_acquire (source, acquire_image, release_image);
  /* From the node's units to the image's pixels. */
  cairo_matrix_init_scale (&m, scale, scale);
  cairo_matrix_translate (&m, -x0, -y0);
  cairo_pattern_set_matrix (source, &m);
  cairo_set_source (cr, source);
  cairo_paint (cr);
  cairo_pattern_destroy (source);
  cairo_destroy (cr);
  /* The image lives as long as the recording that paints it. */
  cairo_surface_set_user_data (gsk_cairo_node_get_surface (node), &image_key, image,
                               (cairo_destroy_func_t) cairo_surface_destroy);
  return node;
}

GskRenderNode *
sw_raster_node (GskRenderNode *recorded, const graphene_rect_t *box, int scale)
{
  graphene_rect_t bounds;
  double x0, y0;
  int w, h;
  cairo_surface_t *image;
  cairo_t *cr;

  if (box == NULL)
    {
      gsk_render_node_get_bounds (recorded, &bounds);
      box = &bounds;
    }
  scale = MAX (scale, 1);
  if (!pixel_box (box, &x0, &y0, &w, &h))
    {
      gsk_render_node_unref (recorded);
      return gsk_container_node_new (NULL, 0);
    }
  image = new_image (w * scale, h * scale);
  cairo_surface_set_device_scale (image, scale, scale);
  cr = cairo_create (image);
  cairo_translate (cr, -x0, -y0);
  gsk_render_node_draw (recorded, cr);
  cairo_destroy (cr);
  gsk_render_node_unref (recorded);
  cairo_surface_set_device_scale (image, 1, 1);
  return image_node (image, x0, y0, w, h, scale);
}

GskRenderNode *
sw_raster_compose (GskRenderNode *const *nodes, guint n, const graphene_rect_t *box, int scale)
{
  double x0, y0;
  int w, h;
  cairo_surface_t *image;
  cairo_t *cr;

  scale = MAX (scale, 1);
  if (!pixel_box (box, &x0, &y0, &w, &h))
    return gsk_container_node_new (NULL, 0);
  image = new_image (w * scale, h * scale);
  cairo_surface_set_device_scale (image, scale, scale);
  cr = cairo_create (image);
  cairo_translate (cr, -x0, -y0);
  for (guint i = 0; i < n; i++)
    {
      cairo_surface_t *pixels = NULL;

      if (nodes[i] == NULL)
        continue;
      if (gsk_render_node_get_node_type (nodes[i]) == GSK_CAIRO_NODE
          && gsk_cairo_node_get_surface (nodes[i]) != NULL)
        pixels = cairo_surface_get_user_data (gsk_cairo_node_get_surface (nodes[i]), &image_key);
      if (pixels != NULL)
        {
          /* A node of sw_raster_node(): its pixels, copied as they are
           * rather than by replaying its recording. */
          graphene_rect_t b;

          gsk_render_node_get_bounds (nodes[i], &b);
          cairo_save (cr);
          cairo_translate (cr, b.origin.x, b.origin.y);
          cairo_scale (cr, 1.0 / scale, 1.0 / scale);
          cairo_set_source_surface (cr, pixels, 0, 0);
          cairo_paint (cr);
          cairo_restore (cr);
        }
      else
        gsk_render_node_draw (nodes[i], cr);
    }
  cairo_destroy (cr);
  cairo_surface_set_device_scale (image, 1, 1);
  return image_node (image, x0, y0, w, h, scale);
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
