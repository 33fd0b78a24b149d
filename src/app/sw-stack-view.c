/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-stack-view"

#include "config.h"

#include "sw-stack-view.h"
#include "sw-raster.h"

#include "sw-format.h"
#include "sw-plot.h"
#include "sw-stack-drawing.h"

#include <glib/gi18n.h>
#include <math.h>
#include <string.h>

/* Layout constants, in pixels. */
#define MARGIN 12.0
#define BLOCK_GAP 6.0          /* the separation between two blocks */
#define UNUSED_HEIGHT 14.0
#define LEADER_GAP 28.0        /* between the widest block and the labels */
#define BORDER_GRAB 5.0        /* how far from a border a drag may start */
#define MIN_HIT 10.0           /* hit area of tiny blocks */
#define LABEL_SPACING 6.0
#define BASELINE_GAP 18.0      /* between the baseline's outline and the stack */

typedef enum {
  ITEM_STAGE,      /* sized: area proportional to mass */
  ITEM_UNUSED,     /* the optimum gives it nothing: a thin dashed placeholder */
  ITEM_NOMINAL,    /* not sized because another stage fails: nominal size */
  ITEM_FAILING,    /* this stage cannot deliver its delta-v: nominal, hatched */
  ITEM_PAYLOAD,
} ItemKind;

enum { PART_LEGEND, PART_COLUMN, PART_SCALE, PART_LABEL0, N_PARTS = PART_LABEL0 + SW_MAX_STAGES + 1 };

typedef struct {
  ItemKind        kind;
  int             stage;        /* firing order; -1 for the payload */
  double          mass_kg;      /* NAN when not sized */
  double          structure_fraction;
  graphene_rect_t rect;
  graphene_rect_t structure;    /* the structure band inside rect (stages) */
  double          label_y;      /* top of the label after de-overlapping */
  double          label_h;
  PangoLayout    *label;
} Item;

struct _SwStackView {
  GtkWidget  parent_instance;

  /* Shaped texts by markup (and wrap width), kept from one result to the
   * next: the legend, and the labels whose figures did not change, are
   * not shaped again (see cached_label). */
  GHashTable *text_cache;

  SwAnalysis  *result;
  int        selected;
  int        hover_border;

  /* Last layout */
  gboolean   layout_valid;
  int        layout_width;
  int        layout_height;
  guint      n_items;
  Item       items[SW_MAX_STAGES + 1];   /* bottom (first stage) to top (payload) */
  double     px2_per_kg;                 /* block area per kilogram; 0 when not to scale */
  SwStackScale scale;
  SwStackGeometry geom;                  /* parts = items when to scale */
  double     stack_height;               /* stages only, for the drag mapping */
  double     label_x;
  double     stack_right;
  PangoLayout *message;                  /* error or infeasibility text */
  graphene_rect_t message_rect;
  double     scale_ref_kg;
  double     top_y;                      /* below the legend (and message) */
  double     bottom_y;                   /* above the scale row */

  /* The pinned baseline: outlines beside the stack at the same scale,
   * bottom (first stage) to top (payload); n_base 0 when not drawn. */
  guint      n_base;
  graphene_rect_t base_rects[SW_MAX_STAGES + 1];
  SwStackGeometry base_geom;
  PangoLayout *base_caption;
  double     base_caption_x;
  double     base_caption_y;

  /* The second picture: to scale in metres (sw-stack-drawing.h); the items
   * then hold the stages' outlines and the fairing. */
  gboolean   to_scale;
  gboolean   scale_drawn;                /* sgeom is laid out */
  SwScaleGeometry sgeom;

  /* Dragging a border */
  int        drag_lower;
  double     drag_stack_height;

  /* The last drawing, kept while what it shows (the key hashes the laid-out
   * parts, texts, colours, selection and hover) stays the same: a later
   * phase of the same edit, or an edit that leaves the stack alone, then
   * neither records nor rasterises it again. */
  GskRenderNode *drawing;
  guint64        drawing_key;
  guint          prepare_id;   /* the idle that draws ahead of the frame */

  /* The plain mass picture in parts, each a node over the box it draws in,
   * kept while its own key is the same: an edit repaints the stack's
   * column and the labels and scale that changed, not the legend or the
   * empty space between them (draw_stack_parts). */
  GskRenderNode *parts[N_PARTS];
  guint64        part_keys[N_PARTS];
  gboolean       part_new[N_PARTS];   /* recorded in this drawing, not yet rasterised */
  /* The parts but the legend, copied into one node over the whole width
   * from the highest of them down: GSK repaints it as one rectangle.  As
   * parts of their own, the column and each label made rectangles whose
   * edges cut those of the plots beside into bands; a frame with more than
   * 30 rectangles GSK repaints whole (see DEVELOPERS.md, "Damage in few
   * rectangles"). */
  GskRenderNode *body;
  GskRenderNode *body_of[N_PARTS];   /* the parts it was made of (not owned) */
};

enum {
  PROP_0,
  PROP_SELECTED_STAGE,
  PROP_TO_SCALE,
  N_PROPS
};

enum {
  STAGE_ACTIVATED,
  SHARE_DRAGGED,
  N_SIGNALS
};

static GParamSpec *properties[N_PROPS];
static guint signals[N_SIGNALS];

G_DEFINE_FINAL_TYPE (SwStackView, sw_stack_view, GTK_TYPE_WIDGET)

/* Numbers through the one formatter (sw-format.h): never a NaN on screen. */

static char *
format_ratio (double ratio)
{
  if (!isfinite (ratio) || ratio <= 0.0)
    return g_strdup (SW_NO_VALUE);
  return sw_format_ratio (ratio, 3);
}

static const char *
stage_name (SwAnalysis *r, int stage)
{
  if (r->design != NULL && stage >= 0 && (guint) stage < r->design->n_stages
      && r->design->stages[stage].name[0] != '\0')
    return r->design->stages[stage].name;
  return NULL;
}

static char *
stage_title_markup (SwAnalysis *r, int stage)
{
  const char *name = stage_name (r, stage);

  if (name != NULL)
    return g_markup_printf_escaped ("<b>%d · %s</b>", stage + 1, name);
  return g_markup_printf_escaped (_("<b>Stage %d</b>"), stage + 1);
}

/* Colours: the foreground of the style, the application palette, and
 * translucent blends so the fills sit on any theme background. */

static void
get_fg (GtkWidget *widget, GdkRGBA *fg)
{
  G_GNUC_BEGIN_IGNORE_DEPRECATIONS
  gtk_style_context_get_color (gtk_widget_get_style_context (widget), fg);
  G_GNUC_END_IGNORE_DEPRECATIONS
}

static void
set_source_alpha (cairo_t *cr, const GdkRGBA *c, double alpha)
{
  cairo_set_source_rgba (cr, c->red, c->green, c->blue, c->alpha * alpha);
}

typedef struct {
  GdkRGBA fg;
  GdkRGBA accent;      /* propellant */
  GdkRGBA payload;
  GdkRGBA warning;
  GdkRGBA select;
  GdkRGBA fuel;
  double  propellant_alpha;
  double  structure_alpha;  /* of the foreground: dark on light, light on dark */
} Colors;

static void
get_colors (GtkWidget *widget, Colors *c)
{
  get_fg (widget, &c->fg);
  sw_plot_palette_color (widget, 0, &c->accent);   /* blue */
  sw_plot_palette_color (widget, 4, &c->payload);  /* orange */
  sw_plot_palette_color (widget, 1, &c->warning);  /* vermillion */
  sw_plot_palette_color (widget, 3, &c->select);   /* reddish purple */
  sw_plot_palette_color (widget, 2, &c->fuel);     /* bluish green */
  c->propellant_alpha = sw_plot_style_is_dark (widget) ? 0.45 : 0.35;
  c->structure_alpha = 0.72;
}

/* Layout */

static void
clear_layout (SwStackView *self)
{
  for (guint i = 0; i < G_N_ELEMENTS (self->items); i++)
    g_clear_object (&self->items[i].label);
  g_clear_object (&self->message);
  g_clear_object (&self->base_caption);
  self->n_base = 0;
  self->n_items = 0;
  self->scale_drawn = FALSE;
  self->layout_valid = FALSE;
}

static PangoLayout *
make_label (SwStackView *self, const char *markup)
{
  PangoLayout *layout = gtk_widget_create_pango_layout (GTK_WIDGET (self), NULL);

  pango_layout_set_markup (layout, markup, -1);
  return layout;
}

#define TEXT_CACHE_MAX 256

/* @markup with each " · " after the stage's bold title made a line break:
 * a label too wide for its column shows its figures one per line instead
 * of wrapping after a separator.  The title ("1 · Core") keeps its own. */
char *
sw_stack_break_at_separators (const char *markup)
{
  const char *after = strstr (markup, "</b>");
  const char *from = after != NULL ? after + strlen ("</b>") : markup;
  g_autofree char *head = g_strndup (markup, from - markup);
  g_auto (GStrv) parts = g_strsplit (from, " · ", -1);
  g_autofree char *tail = g_strjoinv ("\n", parts);

  return g_strconcat (head, tail, NULL);
}

/* A shared layout of @markup (a new reference; callers must not change
 * it), wrapped between words at @wrap_width when it is wider, unless
 * @wrap_width is negative. */
static PangoLayout *
cached_label (SwStackView *self, const char *markup, double wrap_width)
{
  g_autofree char *key = g_strdup_printf ("%.17g\x01%s", wrap_width, markup);
  PangoLayout *layout = g_hash_table_lookup (self->text_cache, key);

  if (layout == NULL)
    {
      int lw;
      if (g_hash_table_size (self->text_cache) >= TEXT_CACHE_MAX)
        g_hash_table_remove_all (self->text_cache);
      layout = make_label (self, markup);
      pango_layout_get_pixel_size (layout, &lw, NULL);
      if (wrap_width >= 0.0 && lw > wrap_width)
        {
          /* Too wide: the parts joined by " · " go on lines of their own
           * first, so no line ends in a lone separator ("32.6 t ·"). */
          g_autofree char *lines = sw_stack_break_at_separators (markup);
          g_object_unref (layout);
          layout = make_label (self, lines);
        }
      pango_layout_get_pixel_size (layout, &lw, NULL);
      if (wrap_width >= 0.0 && lw > wrap_width)
        {
          /* Wrapped between words, never inside a number and its unit
           * (glued by the caller, "2,007 m/s").  Only a word wider than the
           * column by itself (a long stage name without spaces) is broken
           * inside: running over, it left the blocks no room at all. */
          pango_layout_set_wrap (layout, PANGO_WRAP_WORD);
          pango_layout_set_width (layout, (int) (wrap_width * PANGO_SCALE));
          pango_layout_get_pixel_size (layout, &lw, NULL);
          if (lw > wrap_width)
            pango_layout_set_wrap (layout, PANGO_WRAP_WORD_CHAR);
        }
      g_hash_table_insert (self->text_cache, g_steal_pointer (&key), layout);
    }
  return g_object_ref (layout);
}

/* Thrust-to-weight at ignition, computed on the worker: as flown when the
 * result has the ascent (fairing and ambient pressure included), else from
 * the sized masses (SwAnalysis's stage figures).  A line of its own, or
 * " · T/W 1.45" when @compact; "" when the design has no thrust. */
static double
stage_tw (SwAnalysis *r, int stage)
{
  if (r == NULL || stage < 0 || stage >= SW_MAX_STAGES)
    return NAN;
  /* The flight's figures only when it flew the vehicle shown: a closed
   * loop that did not converge flew another sizing (its last try). */
  if (r->ascent != NULL && (!r->ascent->closed_loop || r->sized_by_ascent)
      && (guint) stage < r->ascent->n_stages && r->ascent->stages[stage].flown)
    return r->ascent->stages[stage].ignition_thrust_to_weight;
  if (r->has_stage_figures && r->stage_figures[stage].fires)
    return r->stage_figures[stage].ignition_thrust_to_weight;
  return NAN;
}

static char *
stage_tw_text (SwAnalysis *r, int stage, gboolean compact)
{
  double tw = stage_tw (r, stage);
  g_autofree char *text = NULL;

  if (!isfinite (tw))
    return g_strdup ("");
  text = sw_format_ratio (tw, 2);
  if (compact)
    /* Translators: appended to a stage's label: thrust-to-weight at ignition */
    return g_strdup_printf (_(" · T/W %s"), text);
  /* Translators: the last line of a stage's label: thrust-to-weight at ignition */
  return g_strdup_printf (_("\nT/W %s at ignition"), text);
}

static char *
item_label_markup (SwStackView *self, const Item *item, gboolean compact)
{
  SwAnalysis *r = self->result;
  const SwStageResult *s;
  g_autofree char *title = NULL;
  g_autofree char *mass = NULL;
  g_autofree char *dv = NULL;
  g_autofree char *ratio = NULL;

  if (item->kind == ITEM_PAYLOAD)
    {
      mass = sw_format_mass (r->design->payload_kg);
      if (compact)
        return g_markup_printf_escaped (_("<b>Payload</b> · %s"), mass);
      return g_markup_printf_escaped (_("<b>Payload</b>\n%s"), mass);
    }

  s = &r->sizing.stages[item->stage];
  title = stage_title_markup (r, item->stage);
  mass = sw_format_mass (s->stage_mass_kg);
  dv = sw_format_speed (s->delta_v_m_s);
  ratio = format_ratio (s->mass_ratio);

  switch (item->kind)
    {
    case ITEM_UNUSED:
      if (compact)
        return g_strdup_printf (_("%s · unused"), title);
      /* The optimum may leave a stage nothing; another split was given so. */
      if (r->design->split == SW_SPLIT_OPTIMAL)
        return g_strdup_printf (_("%s\nunused: no Δv at the optimum"), title);
      return g_strdup_printf (_("%s\nunused: no Δv in this split"), title);
    case ITEM_FAILING:
      {
        g_autofree char *limit = sw_format_speed (s->delta_v_limit_m_s);
        g_autofree char *want = s->delta_v_m_s > 0.0 ? g_strdup (dv) : g_strdup ("—");
        if (compact)
          return g_strdup_printf (_("%s · <b>⚠ cannot deliver</b>"), title);
        return g_strdup_printf (_("%s\n<b>⚠ cannot deliver</b> Δv %s\nlimit %s · mass —"),
                                title, want, limit);
      }
    case ITEM_NOMINAL:
      {
        g_autofree char *want = s->delta_v_m_s > 0.0 ? g_strdup (dv) : g_strdup ("—");
        if (compact)
          return g_strdup_printf (_("%s · not sized"), title);
        return g_strdup_printf (_("%s\nnot sized · Δv %s\nmass —"), title, want);
      }
    case ITEM_STAGE:
    case ITEM_PAYLOAD:
    default:
      {
        g_autofree char *tw = stage_tw_text (r, item->stage, compact);
        g_autofree char *base = NULL;
        if (compact)
          base = g_strdup_printf (_("%s · %s · Δv %s"), title, mass, dv);
        else
          base = g_strdup_printf (_("%s\n%s · Δv %s\nmass ratio %s"), title, mass, dv, ratio);
        /* The boosters beside the first stage: their count and mass each. */
        if (item->stage == 0 && r->sizing.boosters.present)
          {
            g_autofree char *bm = sw_format_mass (r->sizing.boosters.booster_mass_kg);
            g_autofree char *bname = g_markup_escape_text (r->design->boosters.name, -1);
            /* Translators: the boosters beside the first stage: "+ 4 × Side boosters, 33.7 t each" */
            g_autofree char *line = g_strdup_printf (_("\n+ %u × %s, %s each"),
                                                     r->sizing.boosters.count, bname, bm);
            return g_strconcat (base, tw, compact ? "" : line, NULL);
          }
        return g_strconcat (base, tw, NULL);
      }
    }
}

/* A round mass (1, 2 or 5 times a power of ten) whose square is about
 * @target_px wide at the current scale. */
static double
scale_reference (double px2_per_kg, double target_px)
{
  double want = target_px * target_px / px2_per_kg;
  double decade = pow (10.0, floor (log10 (want)));
  static const double steps[] = { 1.0, 2.0, 5.0, 10.0 };
  double best = decade, best_err = INFINITY;

  for (guint i = 0; i < G_N_ELEMENTS (steps); i++)
    {
      double side = sqrt (steps[i] * decade * px2_per_kg);
      double err = fabs (log (side / target_px));
      if (err < best_err)
        {
          best_err = err;
          best = steps[i] * decade;
        }
    }
  return best;
}

static void
place_labels (SwStackView *self, double top, double bottom)
{
  /* Labels want to sit level with their blocks; push apart where they
   * overlap, first upwards from the bottom, then back down from the top. */
  double prev_top = bottom + LABEL_SPACING;

  for (guint i = 0; i < self->n_items; i++)
    {
      Item *it = &self->items[i];
      double want = it->rect.origin.y + it->rect.size.height / 2.0 - it->label_h / 2.0;

      it->label_y = MIN (want, prev_top - LABEL_SPACING - it->label_h);
      prev_top = it->label_y;
    }
  if (self->n_items > 0 && self->items[self->n_items - 1].label_y < top)
    {
      double prev_bottom = top - LABEL_SPACING;
      for (int i = (int) self->n_items - 1; i >= 0; i--)
        {
          Item *it = &self->items[i];
          it->label_y = MAX (it->label_y, prev_bottom + LABEL_SPACING);
          prev_bottom = it->label_y + it->label_h;
        }
    }
}

static double
labels_height (SwStackView *self)
{
  double sum = 0.0;

  for (guint i = 0; i < self->n_items; i++)
    sum += self->items[i].label_h + LABEL_SPACING;
  return sum;
}

static void
make_labels (SwStackView *self, gboolean compact, double max_width, double *width)
{
  *width = 0.0;
  for (guint i = 0; i < self->n_items; i++)
    {
      Item *it = &self->items[i];
      g_autofree char *raw = item_label_markup (self, it, compact);
      g_autofree char *markup = sw_stack_glue_units (raw);
      int lw, lh;

      g_clear_object (&it->label);
      it->label = cached_label (self, markup, MAX (max_width, 0.0));
      pango_layout_get_pixel_size (it->label, &lw, &lh);
      it->label_h = lh;
      *width = MAX (*width, lw);
    }
}

static void
layout_message (SwStackView *self, const char *markup, double width)
{
  g_clear_object (&self->message);
  self->message = make_label (self, markup);
  pango_layout_set_wrap (self->message, PANGO_WRAP_WORD_CHAR);
  pango_layout_set_width (self->message, (int) (MAX (width, 40.0) * PANGO_SCALE));
}

static double
legend_height (SwStackView *self)
{
  PangoLayout *probe = cached_label (self, "Mg", -1.0);
  int h;

  pango_layout_get_pixel_size (probe, NULL, &h);
  g_object_unref (probe);
  return h + 8.0;
}

static guint legend_run (SwStackView *self, cairo_t *cr, const Colors *c, int width);

/* The label of a stage in the to-scale picture: its length and diameter. */
static char *
scale_label_markup (SwAnalysis *r, const Item *it)
{
  const SwVehicleShape *v = &r->shape;

  if (it->kind == ITEM_PAYLOAD)
    {
      g_autofree char *len = sw_format_length_m (v->fairing_length_m);
      g_autofree char *d = sw_format_length_m (v->fairing_diameter_m);
      return g_markup_printf_escaped (_("<b>Fairing</b>\n%s long, %s across"), len, d);
    }
  else
    {
      const SwStageGeometry *g = &v->stages[it->stage];
      g_autofree char *title = stage_title_markup (r, it->stage);
      g_autofree char *len = sw_format_length_m (g->shape.length_m);
      g_autofree char *d = sw_format_length_m (g->diameter_m);
      g_autofree char *vol = sw_format_volume_m3 (g->shape.tank_volume_m3);
      g_autofree char *body = g_markup_printf_escaped (_("%s long, %s across%s\ntanks %s"),
                                                       len, d,
                                                       g->diameter_inherited
                                                       ? _(" (from below)") : "", vol);
      return g_strconcat (title, "\n", body, NULL);
    }
}

/* The vehicle to scale: the stages' outlines become the items (click,
 * hover and selection work as in the mass picture; there are no borders to
 * drag), labelled with their lengths at the right. */
static void
scale_layout (SwStackView *self, int width, int height)
{
  SwAnalysis *r = self->result;
  const SwVehicleShape *v = &r->shape;
  double legend_h = legend_height (self), top, bottom, label_w = 0.0, max_label_w;
  double bar_w, person_w, right;
  int tw;

  top = MARGIN + legend_h * legend_run (self, NULL, NULL, width);
  bottom = height - MARGIN - legend_h - 10.0;
  self->top_y = top;
  self->bottom_y = bottom;
  if (!v->complete)
    {
      /* Said, not guessed: which stage lacks what. */
      g_autofree char *markup =
        g_markup_printf_escaped (_("<b>Not drawn to scale.</b> %s"),
                                 v->reason[0] != '\0' ? v->reason
                                 : _("The vehicle has no shape."));
      int mh;
      layout_message (self, markup, width - 2 * MARGIN - 16.0);
      pango_layout_get_pixel_size (self->message, NULL, &mh);
      self->message_rect = GRAPHENE_RECT_INIT (MARGIN, top, width - 2 * MARGIN, mh + 12.0);
      return;
    }

  for (guint i = 0; i < v->n_stages && i < SW_MAX_STAGES; i++)
    {
      Item *it = &self->items[self->n_items++];
      it->kind = ITEM_STAGE;
      it->stage = (int) i;
      it->mass_kg = r->sizing.stages[i].stage_mass_kg;
      it->structure_fraction = 0.0;
    }
  {
    Item *it = &self->items[self->n_items++];
    it->kind = ITEM_PAYLOAD;
    it->stage = -1;
    it->mass_kg = r->design->payload_kg;
  }
  max_label_w = MAX (80.0, 0.45 * (width - 2 * MARGIN));
  for (guint i = 0; i < self->n_items; i++)
    {
      Item *it = &self->items[i];
      g_autofree char *raw = scale_label_markup (r, it);
      g_autofree char *markup = sw_stack_glue_units (raw);
      int lw, lh;

      it->label = make_label (self, markup);
      pango_layout_get_pixel_size (it->label, &lw, &lh);
      if (lw > max_label_w)
        {
          g_autofree char *lines = sw_stack_break_at_separators (markup);
          g_object_unref (it->label);
          it->label = make_label (self, lines);
          pango_layout_get_pixel_size (it->label, &lw, &lh);
        }
      if (lw > max_label_w)
        {
          pango_layout_set_wrap (it->label, PANGO_WRAP_WORD);
          pango_layout_set_width (it->label, (int) (max_label_w * PANGO_SCALE));
          pango_layout_get_pixel_size (it->label, &lw, &lh);
        }
      it->label_h = lh;
      label_w = MAX (label_w, lw);
    }
  {
    g_autofree char *bar = sw_format_length_m (sw_scale_bar_length (v->height_m));
    g_autofree char *person = sw_scale_person_label ();
    PangoLayout *probe = make_label (self, bar);
    pango_layout_get_pixel_size (probe, &tw, NULL);
    g_object_unref (probe);
    bar_w = MAX (SW_SCALE_BAR_ROOM, tw + 4.0);
    probe = make_label (self, person);
    pango_layout_get_pixel_size (probe, &tw, NULL);
    g_object_unref (probe);
    person_w = tw;
  }
  self->label_x = width - MARGIN - label_w;
  /* The bar's and the person's texts stand above them: room for a line. */
  if (!sw_scale_layout (v, MARGIN, top + legend_h, self->label_x - LEADER_GAP - MARGIN,
                        bottom - top - legend_h, bar_w, person_w, &self->sgeom))
    {
      int mh;
      for (guint i = 0; i < self->n_items; i++)
        g_clear_object (&self->items[i].label);
      self->n_items = 0;
      layout_message (self, _("Too little room here to draw the vehicle to scale."),
                      width - 2 * MARGIN - 16.0);
      pango_layout_get_pixel_size (self->message, NULL, &mh);
      self->message_rect = GRAPHENE_RECT_INIT (MARGIN, top, width - 2 * MARGIN, mh + 12.0);
      return;
    }
  self->scale_drawn = TRUE;
  for (guint i = 0; i < self->n_items; i++)
    {
      Item *it = &self->items[i];
      const SwStackBox *b = it->kind == ITEM_PAYLOAD ? &self->sgeom.fairing
                                                     : &self->sgeom.stage[it->stage];
      it->rect = GRAPHENE_RECT_INIT (b->x, b->y, b->width, b->height);
    }
  right = MAX (self->sgeom.person.x + self->sgeom.person.width,
               self->sgeom.person.x + person_w);
  self->stack_right = right;
  place_labels (self, top, bottom);
}

static void
stack_layout (SwStackView *self, int width, int height)
{
  SwAnalysis *r = self->result;
  const SwSizing *sz;
  double legend_h, top, bottom, label_w, max_label_w, avail_w, avail_h;
  double x_axis, y, max_w = 0.0;
  gboolean to_scale;

  clear_layout (self);
  self->layout_width = width;
  self->layout_height = height;
  self->layout_valid = TRUE;
  self->px2_per_kg = 0.0;
  self->stack_height = 0.0;

  if (r == NULL || width < 40 || height < 40)
    return;

  if (!r->ok)
    {
      g_autofree char *markup =
        g_markup_printf_escaped (_("<b>⚠ This design cannot be solved</b>\n%s"),
                                 r->error_message);
      layout_message (self, markup, width - 4 * MARGIN);
      pango_layout_set_alignment (self->message, PANGO_ALIGN_CENTER);
      return;
    }

  if (self->to_scale)
    {
      scale_layout (self, width, height);
      return;
    }
  sz = &r->sizing;
  to_scale = sz->feasible;
  legend_h = legend_height (self);
  /* The legend wraps in a narrow view instead of being cut. */
  top = MARGIN + legend_h * legend_run (self, NULL, NULL, width);
  bottom = height - MARGIN - (to_scale ? legend_h + 30.0 : legend_h);

  if (!sz->feasible)
    {
      g_autofree char *markup =
        g_markup_printf_escaped (_("<b>⚠ Not feasible.</b> %s"),
                                 sz->reason[0] != '\0' ? sz->reason : _("No reason given."));
      int mh;
      layout_message (self, markup, width - 2 * MARGIN - 16.0);
      pango_layout_get_pixel_size (self->message, NULL, &mh);
      self->message_rect = GRAPHENE_RECT_INIT (MARGIN, top, width - 2 * MARGIN, mh + 12.0);
      top += mh + 12.0 + 10.0;
    }
  self->top_y = top;
  self->bottom_y = bottom;

  /* Items, bottom to top. */
  for (guint i = 0; i < sz->n_stages && i < SW_MAX_STAGES; i++)
    {
      const SwStageResult *sr = &sz->stages[i];
      Item *it = &self->items[self->n_items++];

      it->stage = (int) i;
      it->mass_kg = sr->stage_mass_kg;
      it->structure_fraction = sr->stage_mass_kg > 0.0
                               ? sr->structural_mass_kg / sr->stage_mass_kg : 0.0;
      if (!sz->feasible)
        it->kind = sr->feasible ? ITEM_NOMINAL : ITEM_FAILING;
      else if (sr->unused || !(sr->stage_mass_kg > 0.0))
        it->kind = ITEM_UNUSED;
      else
        it->kind = ITEM_STAGE;
    }
  {
    Item *it = &self->items[self->n_items++];
    it->kind = ITEM_PAYLOAD;
    it->stage = -1;
    it->mass_kg = r->design->payload_kg;
    it->structure_fraction = 0.0;
  }

  /* Labels first: their width decides the room left for the blocks. */
  max_label_w = MAX (80.0, 0.5 * (width - 2 * MARGIN));
  make_labels (self, FALSE, max_label_w, &label_w);
  if (labels_height (self) > bottom - top)
    make_labels (self, TRUE, max_label_w, &label_w);

  avail_w = width - 2 * MARGIN - LEADER_GAP - label_w;
  avail_h = bottom - top;
  if (avail_w < 20.0 || avail_h < 20.0)
    return;

  if (to_scale)
    {
      /* The shapes of the sheet (sw-stack-drawing.c): one scale for the
       * stack and the pinned baseline beside it. */
      SwStackMasses cur, base;
      const SwStackMasses *both[2] = { &cur, &base };
      guint n_stacks = 1;
      double caption_h = 0.0;

      sw_stack_masses_from_sizing (sz, &cur);
      if (r->has_baseline && r->baseline_ok
          && sw_stack_masses_from_sizing (&r->baseline_sizing, &base))
        {
          g_autofree char *mass = sw_format_mass (r->baseline_sizing.liftoff_mass_kg);
          g_autofree char *markup = g_markup_printf_escaped (_("<b>Baseline</b>\n%s"), mass);
          int ch;

          self->base_caption = make_label (self, markup);
          pango_layout_set_alignment (self->base_caption, PANGO_ALIGN_CENTER);
          pango_layout_get_pixel_size (self->base_caption, NULL, &ch);
          caption_h = ch + 4.0;
          n_stacks = 2;
        }
      if (!sw_stack_fit (both, n_stacks, avail_w - (n_stacks > 1 ? BASELINE_GAP : 0.0),
                         avail_h - caption_h, BLOCK_GAP, UNUSED_HEIGHT, BASELINE_GAP,
                         0.6, 3.2, &self->scale))
        {
          g_clear_object (&self->base_caption);
          return;
        }
      /* The baseline's height was fitted without the gaps of unused stages. */
      self->px2_per_kg = sw_stack_area_per_kg (&self->scale);
      self->scale_ref_kg = scale_reference (self->px2_per_kg, 36.0);
      max_w = sw_stack_width (&cur, &self->scale);
      {
        double base_w = n_stacks > 1 ? sw_stack_width (&base, &self->scale) : 0.0;
        double base_room = n_stacks > 1 ? base_w + BASELINE_GAP : 0.0;
        double group = base_room + max_w + LEADER_GAP + label_w;
        double x0 = MAX (MARGIN, (width - group) / 2.0);

        if (n_stacks > 1)
          {
            sw_stack_place (&base, &self->scale, x0 + base_w / 2.0, bottom, BLOCK_GAP, 0.0,
                            &self->base_geom);
            self->n_base = self->base_geom.n;
            for (guint i = 0; i < self->n_base; i++)
              {
                const SwStackBox *bx = &self->base_geom.box[i];
                self->base_rects[i] = GRAPHENE_RECT_INIT (bx->x, bx->y, bx->width, bx->height);
              }
            self->base_caption_x = x0 + base_w / 2.0;
            self->base_caption_y = self->base_geom.top - 4.0;
            x0 += base_room;
          }
        x_axis = x0 + max_w / 2.0;
        self->stack_right = x0 + max_w;
        self->label_x = self->stack_right + LEADER_GAP;
      }
      sw_stack_place (&cur, &self->scale, x_axis, bottom, BLOCK_GAP, UNUSED_HEIGHT, &self->geom);
      g_assert (self->geom.n == self->n_items);
      for (guint i = 0; i < self->n_items; i++)
        {
          Item *it = &self->items[i];
          const SwStackBox *bx = &self->geom.box[i];
          const SwStackBox *st = &self->geom.structure[i];

          it->rect = GRAPHENE_RECT_INIT (bx->x, bx->y, bx->width, bx->height);
          it->structure = GRAPHENE_RECT_INIT (st->x, st->y, st->width, st->height);
          /* From the stored (float) rectangles, as a caller measures them. */
          if (it->kind != ITEM_PAYLOAD)
            self->stack_height = self->items[0].rect.origin.y + self->items[0].rect.size.height
                                 - it->rect.origin.y;
        }
      place_labels (self, top, bottom);
      return;
    }

  /* Not sized: equal nominal blocks, the payload half as wide. */
  {
    double n_nominal = 0.0, side;

    avail_h -= BLOCK_GAP * (self->n_items - 1);
    for (guint i = 0; i < self->n_items; i++)
      n_nominal += self->items[i].kind == ITEM_PAYLOAD ? 0.5 : 1.0;
    side = MIN (MIN (avail_h / MAX (n_nominal, 1.0), avail_w), 140.0);
    for (guint i = 0; i < self->n_items; i++)
      {
        Item *it = &self->items[i];
        double f = it->kind == ITEM_PAYLOAD ? 0.5 : 1.0;
        it->rect.size.width = side * f;
        it->rect.size.height = side * f;
        max_w = MAX (max_w, it->rect.size.width);
      }
  }
  {
    double x0 = MAX (MARGIN, (width - (max_w + LEADER_GAP + label_w)) / 2.0);
    x_axis = x0 + max_w / 2.0;
    self->stack_right = x0 + max_w;
    self->label_x = self->stack_right + LEADER_GAP;
  }
  y = bottom;
  for (guint i = 0; i < self->n_items; i++)
    {
      Item *it = &self->items[i];
      y -= it->rect.size.height;
      it->rect.origin.x = x_axis - it->rect.size.width / 2.0;
      it->rect.origin.y = y;
      if (it->kind != ITEM_PAYLOAD)
        self->stack_height = bottom - y;
      y -= BLOCK_GAP;
    }

  place_labels (self, top, bottom);
}

static void
ensure_layout (SwStackView *self)
{
  int w = gtk_widget_get_width (GTK_WIDGET (self));
  int h = gtk_widget_get_height (GTK_WIDGET (self));

  if (!self->layout_valid || w != self->layout_width || h != self->layout_height)
    stack_layout (self, w, h);
}

static void sw_stack_view_prepare (GtkWidget *widget);

/* A redraw, with the drawing made ahead of the frame (sw-raster.h). */
static void
queue_redraw (SwStackView *self)
{
  gtk_widget_queue_draw (GTK_WIDGET (self));
  sw_raster_schedule (GTK_WIDGET (self), &self->prepare_id, sw_stack_view_prepare);
}

static void
invalidate (SwStackView *self)
{
  self->layout_valid = FALSE;
  queue_redraw (self);
}

/* Hit testing */

static int
item_at (SwStackView *self, double x, double y)
{
  ensure_layout (self);
  for (guint i = 0; i < self->n_items; i++)
    {
      const graphene_rect_t *rc = &self->items[i].rect;
      double grow_y = MAX (0.0, (MIN_HIT - rc->size.height) / 2.0);
      double grow_x = MAX (0.0, (MIN_HIT - rc->size.width) / 2.0);

      if (rc->size.width <= 0.0)
        continue;
      if (x >= rc->origin.x - grow_x && x <= rc->origin.x + rc->size.width + grow_x
          && y >= rc->origin.y - grow_y && y <= rc->origin.y + rc->size.height + grow_y)
        return (int) i;
      /* The label counts as the block too. */
      if (self->items[i].label != NULL && x >= self->label_x
          && y >= self->items[i].label_y && y <= self->items[i].label_y + self->items[i].label_h)
        return (int) i;
    }
  return -1;
}

/* The border below item @lower + 1; returns the lower stage index or -1. */
static int
border_at (SwStackView *self, double x, double y)
{
  ensure_layout (self);
  if (self->result == NULL || !self->result->ok || self->to_scale)
    return -1;
  for (guint i = 0; i + 1 < self->n_items; i++)
    {
      const Item *lo = &self->items[i];
      const Item *up = &self->items[i + 1];
      double y_lo = lo->rect.origin.y;
      double y_up = up->rect.origin.y + up->rect.size.height;
      double half_w = MAX (lo->rect.size.width, up->rect.size.width) / 2.0;
      double cx = lo->rect.origin.x + lo->rect.size.width / 2.0;
      /* The gap, and a little into each block unless the block is thin. */
      double grab_up = MIN (BORDER_GRAB, up->rect.size.height / 4.0);
      double grab_lo = MIN (BORDER_GRAB, lo->rect.size.height / 4.0);

      if (up->kind == ITEM_PAYLOAD)
        break;
      if (y >= y_up - grab_up && y <= y_lo + grab_lo && fabs (x - cx) <= half_w + BORDER_GRAB)
        return lo->stage;
    }
  return -1;
}

/* Drawing */

static void
rect_path (cairo_t *cr, const graphene_rect_t *rc)
{
  cairo_rectangle (cr, rc->origin.x, rc->origin.y, rc->size.width, rc->size.height);
}

static void
hatch (cairo_t *cr, const graphene_rect_t *rc, double spacing, double line_width)
{
  double x0 = rc->origin.x, y0 = rc->origin.y;
  double w = rc->size.width, h = rc->size.height;

  cairo_save (cr);
  rect_path (cr, rc);
  cairo_clip (cr);
  cairo_set_line_width (cr, line_width);
  for (double d = -h; d < w; d += spacing)
    {
      cairo_move_to (cr, x0 + d, y0 + h);
      cairo_line_to (cr, x0 + d + h, y0);
    }
  cairo_stroke (cr);
  cairo_restore (cr);
}

static void
draw_text (cairo_t *cr, PangoLayout *layout, double x, double y)
{
  cairo_move_to (cr, x, y);
  pango_cairo_show_layout (cr, layout);
}

static void
draw_simple_text (SwStackView *self, cairo_t *cr, const char *markup, double x, double y,
                  double *w_out)
{
  PangoLayout *layout = cached_label (self, markup, -1.0);
  int w;

  pango_layout_get_pixel_size (layout, &w, NULL);
  draw_text (cr, layout, x, y);
  if (w_out != NULL)
    *w_out = w;
  g_object_unref (layout);
}

static double
legend_swatch (SwStackView *self, cairo_t *cr, double x, double y, double h,
               const GdkRGBA *fill, double alpha, gboolean hatched, const Colors *c,
               const char *text)
{
  graphene_rect_t sw = GRAPHENE_RECT_INIT (x, y + 2.0, h - 4.0, h - 4.0);
  double tw;

  set_source_alpha (cr, fill, alpha);
  rect_path (cr, &sw);
  cairo_fill (cr);
  if (hatched)
    {
      set_source_alpha (cr, &c->warning, 1.0);
      hatch (cr, &sw, 5.0, 1.5);
    }
  set_source_alpha (cr, &c->fg, 1.0);
  draw_simple_text (self, cr, text, x + h, y + 0.0, &tw);
  return x + h + tw + 16.0;
}

/* The legend's entries, wrapped to the widget's width; without @cr only
 * counts the rows. */
static guint
legend_run (SwStackView *self, cairo_t *cr, const Colors *c, int width)
{
  gboolean feasible = self->result != NULL && self->result->sizing.feasible;
  const char *names[3];
  double h = legend_height (self) - 8.0;
  double x = MARGIN, y = MARGIN;
  guint rows = 1;

  names[0] = feasible ? _("Propellant") : _("Cannot deliver");
  names[1] = feasible ? _("Structure") : _("Not sized");
  names[2] = _("Payload");
  if (self->to_scale)
    {
      gboolean solid = FALSE;
      if (self->result != NULL && self->result->ok)
        for (guint i = 0; i < self->result->shape.n_stages; i++)
          solid = solid || self->result->shape.stages[i].shape.solid;
      names[0] = solid ? _("Oxidizer tank or motor case") : _("Oxidizer tank");
      names[1] = _("Fuel tank");
      names[2] = _("Fairing");
    }
  for (guint i = 0; i < 3; i++)
    {
      PangoLayout *probe = cached_label (self, names[i], -1.0);
      int tw;

      pango_layout_get_pixel_size (probe, &tw, NULL);
      g_object_unref (probe);
      if (x > MARGIN && x + h + tw > width - MARGIN)
        {
          x = MARGIN;
          y += h + 8.0;
          rows++;
        }
      if (cr == NULL)
        {
          x += h + tw + 16.0;
          continue;
        }
      if (self->to_scale)
        x = legend_swatch (self, cr, x, y, h, i == 0 ? &c->accent : i == 1 ? &c->fuel : &c->payload,
                           i == 2 ? 0.6 : 0.55, FALSE, c, names[i]);
      else if (feasible)
        x = legend_swatch (self, cr, x, y, h, i == 0 ? &c->accent : i == 1 ? &c->fg : &c->payload,
                           i == 0 ? c->propellant_alpha : i == 1 ? c->structure_alpha : 0.75,
                           FALSE, c, names[i]);
      else
        x = legend_swatch (self, cr, x, y, h, i == 0 ? &c->warning : i == 1 ? &c->fg : &c->payload,
                           i == 0 ? 0.15 : i == 1 ? 0.08 : 0.75, i == 0, c, names[i]);
    }
  return rows;
}

static void
draw_legend (SwStackView *self, cairo_t *cr, const Colors *c)
{
  legend_run (self, cr, c, gtk_widget_get_width (GTK_WIDGET (self)));
}

static void
draw_scale (SwStackView *self, cairo_t *cr, const Colors *c, int width, int height)
{
  double side = sqrt (self->scale_ref_kg * self->px2_per_kg);
  double base = height - MARGIN;
  g_autofree char *ref = sw_format_mass (self->scale_ref_kg);
  g_autofree char *liftoff = sw_format_mass (self->result->sizing.liftoff_mass_kg);
  g_autofree char *pf = sw_format_percent (self->result->sizing.payload_fraction, 1);
  g_autofree char *scale_text = NULL;
  g_autofree char *total_text = NULL;
  PangoLayout *layout;
  int tw, th;
  double x;

  /* The scale: a square of known mass, since areas, not lengths, carry mass. */
  scale_text = g_markup_printf_escaped (_("Square = %s\n(block area ∝ mass)"), ref);
  layout = make_label (self, scale_text);
  pango_layout_get_pixel_size (layout, &tw, &th);
  x = width - MARGIN - tw - 8.0 - side;
  set_source_alpha (cr, &c->fg, 0.18);
  cairo_rectangle (cr, x, base - side, side, side);
  cairo_fill_preserve (cr);
  set_source_alpha (cr, &c->fg, 0.9);
  cairo_set_line_width (cr, 1.0);
  cairo_stroke (cr);
  draw_text (cr, layout, x + side + 8.0, base - side / 2.0 - th / 2.0);
  g_object_unref (layout);

  total_text = g_markup_printf_escaped (_("Liftoff <b>%s</b>\npayload fraction %s"),
                                        liftoff, pf);
  layout = make_label (self, total_text);
  pango_layout_get_pixel_size (layout, &tw, &th);
  if (MARGIN + tw < x - 8.0)
    draw_text (cr, layout, MARGIN, base - th);
  g_object_unref (layout);
}

/* The sized parts through the shared routine, so the screen draws the
 * sheet's shapes; Colors in the style's terms. */
static void
stack_style (const Colors *c, SwStackStyle *st)
{
#define RGBA(dst_, col_, a_) \
  G_STMT_START { dst_[0] = (col_)->red; dst_[1] = (col_)->green; dst_[2] = (col_)->blue; \
                 dst_[3] = (col_)->alpha * (a_); } G_STMT_END
  RGBA (st->propellant, &c->accent, c->propellant_alpha);
  RGBA (st->structure, &c->fg, c->structure_alpha);
  RGBA (st->payload, &c->payload, 0.75);
  RGBA (st->outline, &c->fg, 0.0);
  st->line_width = 0.0;
#undef RGBA
}

static void
draw_item (SwStackView *self, cairo_t *cr, const Item *it, const Colors *c)
{
  const graphene_rect_t *rc = &it->rect;

  if (self->px2_per_kg > 0.0 && self->geom.n == self->n_items
      && (it->kind == ITEM_STAGE || it->kind == ITEM_PAYLOAD))
    {
      SwStackStyle st;
      stack_style (c, &st);
      sw_stack_draw_part (cr, &self->geom, (guint) (it - self->items), &st, FALSE);
      return;
    }

  switch (it->kind)
    {
    case ITEM_STAGE:
    case ITEM_PAYLOAD:
      /* Not to scale: a plain block. */
      set_source_alpha (cr, &c->payload, it->kind == ITEM_PAYLOAD ? 0.75 : 0.3);
      rect_path (cr, rc);
      cairo_fill (cr);
      break;

    case ITEM_UNUSED:
      {
        static const double dash[] = { 4.0, 3.0 };
        cairo_save (cr);
        cairo_set_dash (cr, dash, 2, 0.0);
        cairo_set_line_width (cr, 1.0);
        set_source_alpha (cr, &c->fg, 0.6);
        cairo_rectangle (cr, rc->origin.x + 0.5, rc->origin.y + 0.5,
                         rc->size.width - 1.0, rc->size.height - 1.0);
        cairo_stroke (cr);
        cairo_restore (cr);
      }
      break;

    case ITEM_FAILING:
      {
        PangoLayout *mark = make_label (self, "<span size='xx-large' weight='bold'>⚠</span>");
        int mw, mh;
        set_source_alpha (cr, &c->warning, 0.12);
        rect_path (cr, rc);
        cairo_fill (cr);
        set_source_alpha (cr, &c->warning, 0.9);
        hatch (cr, rc, 9.0, 2.5);
        cairo_set_line_width (cr, 3.0);
        cairo_rectangle (cr, rc->origin.x + 1.5, rc->origin.y + 1.5,
                         rc->size.width - 3.0, rc->size.height - 3.0);
        cairo_stroke (cr);
        pango_layout_get_pixel_size (mark, &mw, &mh);
        /* The mark on a plate so the stripes do not eat it. */
        cairo_save (cr);
        cairo_arc (cr, rc->origin.x + rc->size.width / 2.0, rc->origin.y + rc->size.height / 2.0,
                   MAX (mw, mh) * 0.75, 0, 2 * G_PI);
        cairo_set_source_rgba (cr, c->warning.red, c->warning.green, c->warning.blue, 1.0);
        cairo_fill (cr);
        cairo_restore (cr);
        cairo_set_source_rgb (cr, 1.0, 1.0, 1.0);
        draw_text (cr, mark, rc->origin.x + (rc->size.width - mw) / 2.0,
                   rc->origin.y + (rc->size.height - mh) / 2.0);
        g_object_unref (mark);
      }
      break;

    case ITEM_NOMINAL:
    default:
      {
        static const double dash[] = { 6.0, 4.0 };
        set_source_alpha (cr, &c->fg, 0.08);
        rect_path (cr, rc);
        cairo_fill (cr);
        cairo_save (cr);
        cairo_set_dash (cr, dash, 2, 0.0);
        cairo_set_line_width (cr, 1.5);
        set_source_alpha (cr, &c->fg, 0.6);
        cairo_rectangle (cr, rc->origin.x + 0.75, rc->origin.y + 0.75,
                         rc->size.width - 1.5, rc->size.height - 1.5);
        cairo_stroke (cr);
        cairo_restore (cr);
      }
      break;
    }
}

static void
draw_label (SwStackView *self, cairo_t *cr, const Item *it, const Colors *c)
{
  const graphene_rect_t *rc = &it->rect;
  double by = rc->origin.y + rc->size.height / 2.0;
  double ly = it->label_y + it->label_h / 2.0;

  /* Leader: level with the block until past the widest block, then to the label. */
  set_source_alpha (cr, &c->fg, 0.45);
  cairo_set_line_width (cr, 1.0);
  cairo_move_to (cr, rc->origin.x + rc->size.width + 4.0, by);
  cairo_line_to (cr, self->stack_right + 8.0, by);
  cairo_line_to (cr, self->label_x - 4.0, ly);
  cairo_stroke (cr);

  if (it->kind == ITEM_FAILING)
    set_source_alpha (cr, &c->warning, 1.0);
  else
    set_source_alpha (cr, &c->fg, it->kind == ITEM_UNUSED ? 0.7 : 1.0);
  draw_text (cr, it->label, self->label_x, it->label_y);
}

static void
draw_selection (SwStackView *self, cairo_t *cr, const Item *it, const Colors *c)
{
  const graphene_rect_t *rc = &it->rect;

  set_source_alpha (cr, &c->select, 1.0);
  cairo_set_line_width (cr, 2.0);
  cairo_rectangle (cr, rc->origin.x - 4.0, rc->origin.y - 4.0,
                   rc->size.width + 8.0, rc->size.height + 8.0);
  cairo_stroke (cr);
  /* A bar beside the label as well, so the selection does not rest on colour. */
  cairo_rectangle (cr, self->label_x - 10.0, it->label_y, 4.0, it->label_h);
  cairo_fill (cr);
}

/* The pinned baseline: dashed outlines at the same area scale, its payload
 * in the payload's colour, captioned above. */
static void
draw_baseline (SwStackView *self, cairo_t *cr, const Colors *c)
{
  SwStackStyle st;
  int cw, ch;

  stack_style (c, &st);
  st.outline[0] = c->fg.red;
  st.outline[1] = c->fg.green;
  st.outline[2] = c->fg.blue;
  st.outline[3] = 0.75;
  st.line_width = 1.5;
  sw_stack_draw (cr, &self->base_geom, &st, TRUE);
  if (self->base_caption != NULL)
    {
      pango_layout_get_pixel_size (self->base_caption, &cw, &ch);
      set_source_alpha (cr, &c->fg, 0.85);
      draw_text (cr, self->base_caption, self->base_caption_x - cw / 2.0,
                 self->base_caption_y - ch);
    }
}

static void
draw_to_scale (SwStackView *self, cairo_t *cr, const Colors *c, int width, int height)
{
  const SwVehicleShape *v = &self->result->shape;
  const SwScaleGeometry *g = &self->sgeom;
  SwScaleStyle st;
  g_autofree char *bar = sw_format_length_m (g->bar_m);
  g_autofree char *person = sw_scale_person_label ();
  g_autofree char *tall = sw_format_length_m (v->height_m);
  g_autofree char *wide = sw_format_length_m (v->width_m);
  g_autofree char *raw = NULL, *caption = NULL;
  PangoLayout *layout;
  int tw, th;

#define RGBA(dst_, col_, a_) \
  G_STMT_START { dst_[0] = (col_)->red; dst_[1] = (col_)->green; dst_[2] = (col_)->blue; \
                 dst_[3] = (col_)->alpha * (a_); } G_STMT_END
  RGBA (st.skin, &c->fg, 0.10);
  RGBA (st.oxidizer, &c->accent, 0.55);
  RGBA (st.fuel, &c->fuel, 0.55);
  RGBA (st.fairing, &c->payload, 0.6);
  RGBA (st.outline, &c->fg, 0.7);
  RGBA (st.mark, &c->fg, 0.8);
#undef RGBA
  st.line_width = 1.0;
  sw_scale_draw (cr, v, g, &st);

  for (guint i = 0; i < self->n_items; i++)
    if (self->items[i].label != NULL)
      draw_label (self, cr, &self->items[i], c);
  for (guint i = 0; i < self->n_items; i++)
    if (self->items[i].stage >= 0 && self->items[i].stage == self->selected)
      draw_selection (self, cr, &self->items[i], c);

  set_source_alpha (cr, &c->fg, 0.9);
  layout = make_label (self, bar);
  pango_layout_get_pixel_size (layout, &tw, &th);
  draw_text (cr, layout, MARGIN, g->bar.y - th - 2.0);
  g_object_unref (layout);
  layout = make_label (self, person);
  pango_layout_get_pixel_size (layout, &tw, &th);
  draw_text (cr, layout, g->person.x, g->person.y - th - 2.0);
  g_object_unref (layout);

  raw = v->n_boosters > 0
          ? g_markup_printf_escaped (_("To scale: <b>%s</b> tall, %s wide across the boosters"),
                                     tall, wide)
          : g_markup_printf_escaped (_("To scale: <b>%s</b> tall, %s wide"), tall, wide);
  caption = sw_stack_glue_units (raw);
  layout = make_label (self, caption);
  pango_layout_set_width (layout, (int) ((width - 2 * MARGIN) * PANGO_SCALE));
  pango_layout_set_ellipsize (layout, PANGO_ELLIPSIZE_END);
  pango_layout_get_pixel_size (layout, &tw, &th);
  draw_text (cr, layout, MARGIN, height - MARGIN - th);
  g_object_unref (layout);
}


static guint64 key_bytes (guint64 h, const void *data, gsize n);
static guint64 key_layout (guint64 h, PangoLayout *layout);

static void
clear_parts (SwStackView *self)
{
  for (guint i = 0; i < N_PARTS; i++)
    g_clear_pointer (&self->parts[i], gsk_render_node_unref);
  g_clear_pointer (&self->body, gsk_render_node_unref);
  memset (self->body_of, 0, sizeof self->body_of);
}

/* Whether the picture is the plain one drawn in parts: sized, in masses,
 * without a message, baseline, boosters or a border under the pointer
 * (those draw across the parts' boxes: the whole view is one node then). */
static gboolean
parts_apply (SwStackView *self)
{
  return self->result != NULL && self->result->ok && !self->to_scale && self->message == NULL
         && self->n_base == 0 && self->px2_per_kg > 0.0 && self->geom.n == self->n_items
         && self->geom.n_boosters == 0 && self->hover_border < 0 && self->drag_lower < 0;
}

/* Part @which in @box: the kept node if @key is the same, else a new one
 * from @cr's drawing (NULL: record it).  Returns the cairo context to draw
 * the new node with, or NULL when the kept one stands. */
static cairo_t *
part_begin (SwStackView *self, guint which, const graphene_rect_t *box, guint64 key)
{
  GskRenderNode *node;

  if (self->parts[which] != NULL && self->part_keys[which] == key)
    return NULL;
  g_clear_pointer (&self->parts[which], gsk_render_node_unref);
  self->part_keys[which] = key;
  node = gsk_cairo_node_new (box);
  self->parts[which] = node;
  self->part_new[which] = TRUE;
  return gsk_cairo_node_get_draw_context (node);
}

static guint64
key_colors (const Colors *c, int width, int height)
{
  guint64 h = G_GUINT64_CONSTANT (14695981039346656037);
  int size[2] = { width, height };

  h = key_bytes (h, size, sizeof size);
  return key_bytes (h, c, sizeof *c);
}

static void
draw_label (SwStackView *self, cairo_t *cr, const Item *it, const Colors *c);
static void
draw_selection (SwStackView *self, cairo_t *cr, const Item *it, const Colors *c);
static void
draw_scale (SwStackView *self, cairo_t *cr, const Colors *c, int width, int height);

static void
draw_stack_parts (SwStackView *self, GtkSnapshot *snapshot, int width, int height,
                  const Colors *c)
{
  guint64 base = key_colors (c, width, height);
  graphene_rect_t box, col;
  gboolean have_col = FALSE;
  cairo_t *cr;
  guint64 h;

  /* The legend, above the stack. */
  box = GRAPHENE_RECT_INIT (0, 0, width, MAX (self->top_y, 1.0));
  h = key_bytes (base, &self->top_y, sizeof self->top_y);
  h = key_bytes (h, &self->result->sizing.feasible, sizeof self->result->sizing.feasible);
  if ((cr = part_begin (self, PART_LEGEND, &box, h)) != NULL)
    {
      draw_legend (self, cr, c);
      cairo_destroy (cr);
    }

  /* The column: the blocks and the selection's frame around them. */
  for (guint i = 0; i < self->n_items; i++)
    {
      const graphene_rect_t *rc = &self->items[i].rect;
      const SwStackBox *b = &self->geom.box[i];
      graphene_rect_t gb = GRAPHENE_RECT_INIT (b->x, b->y, b->width, b->height);
      if (rc->size.width <= 0.0)
        continue;
      if (have_col)
        graphene_rect_union (&col, rc, &col);
      else
        col = *rc;
      have_col = TRUE;
      graphene_rect_union (&col, &gb, &col);
    }
  h = key_bytes (base, &self->geom, sizeof self->geom);
  h = key_bytes (h, &self->selected, sizeof self->selected);
  for (guint i = 0; i < self->n_items; i++)
    {
      h = key_bytes (h, &self->items[i].kind, sizeof self->items[i].kind);
      h = key_bytes (h, &self->items[i].stage, sizeof self->items[i].stage);
      h = key_bytes (h, &self->items[i].rect, sizeof self->items[i].rect);
    }
  if (have_col)
    {
      /* Out to whole pixels and past the selection's frame (4 px out,
       * 2 px wide). */
      double x0 = floor (col.origin.x) - 8.0, y0 = floor (col.origin.y) - 8.0;
      double x1 = ceil (col.origin.x + col.size.width) + 8.0;
      double y1 = ceil (col.origin.y + col.size.height) + 8.0;
      box = GRAPHENE_RECT_INIT (x0, y0, x1 - x0, y1 - y0);
      if ((cr = part_begin (self, PART_COLUMN, &box, h)) != NULL)
        {
          for (guint i = 0; i < self->n_items; i++)
            if (self->items[i].rect.size.width > 0.0)
              draw_item (self, cr, &self->items[i], c);
          for (guint i = 0; i < self->n_items; i++)
            if (self->items[i].stage >= 0 && self->items[i].stage == self->selected)
              {
                const graphene_rect_t *rc = &self->items[i].rect;
                set_source_alpha (cr, &c->select, 1.0);
                cairo_set_line_width (cr, 2.0);
                cairo_rectangle (cr, rc->origin.x - 4.0, rc->origin.y - 4.0,
                                 rc->size.width + 8.0, rc->size.height + 8.0);
                cairo_stroke (cr);
              }
          cairo_destroy (cr);
        }
    }
  else
    g_clear_pointer (&self->parts[PART_COLUMN], gsk_render_node_unref);

  /* Each label with its leader, from the block to the right edge. */
  for (guint i = 0; i < G_N_ELEMENTS (self->items); i++)
    {
      const Item *it = &self->items[i];
      double by, y0, y1, x0;
      int lw, lh;

      if (i >= self->n_items || it->label == NULL || it->rect.size.width <= 0.0)
        {
          g_clear_pointer (&self->parts[PART_LABEL0 + i], gsk_render_node_unref);
          continue;
        }
      by = it->rect.origin.y + it->rect.size.height / 2.0;
      pango_layout_get_pixel_size (it->label, &lw, &lh);
      y0 = floor (MIN (by, it->label_y)) - 4.0;
      y1 = ceil (MAX (by, it->label_y + MAX (it->label_h, lh))) + 4.0;
      x0 = floor (MIN (it->rect.origin.x + it->rect.size.width, self->label_x - 10.0)) - 2.0;
      box = GRAPHENE_RECT_INIT (x0, y0, MAX (width - x0, 1.0), y1 - y0);
      h = key_bytes (base, &it->rect, sizeof it->rect);
      h = key_bytes (h, &it->kind, sizeof it->kind);
      h = key_bytes (h, &it->label_y, sizeof it->label_y);
      h = key_bytes (h, &it->label_h, sizeof it->label_h);
      h = key_layout (h, it->label);
      h = key_bytes (h, &self->label_x, sizeof self->label_x);
      h = key_bytes (h, &self->stack_right, sizeof self->stack_right);
      {
        gboolean sel = it->stage >= 0 && it->stage == self->selected;
        h = key_bytes (h, &sel, sizeof sel);
      }
      if ((cr = part_begin (self, PART_LABEL0 + i, &box, h)) != NULL)
        {
          draw_label (self, cr, it, c);
          if (it->stage >= 0 && it->stage == self->selected)
            {
              /* The selection's bar beside the label. */
              set_source_alpha (cr, &c->select, 1.0);
              cairo_rectangle (cr, self->label_x - 10.0, it->label_y, 4.0, it->label_h);
              cairo_fill (cr);
            }
          cairo_destroy (cr);
        }
    }

  /* The scale square and its caption, below the stack. */
  {
    double side = sqrt (self->scale_ref_kg * self->px2_per_kg);
    double y0 = floor (MIN (self->bottom_y, height - MARGIN - side)) - 2.0;
    y0 = MAX (y0, 0.0);
    box = GRAPHENE_RECT_INIT (0, y0, width, height - y0);
    h = key_bytes (base, &self->scale_ref_kg, sizeof (double));
    h = key_bytes (h, &self->px2_per_kg, sizeof (double));
    h = key_bytes (h, &self->bottom_y, sizeof (double));
    h = key_bytes (h, &self->result->sizing.liftoff_mass_kg, sizeof (double));
    h = key_bytes (h, &self->result->sizing.payload_fraction, sizeof (double));
    if ((cr = part_begin (self, PART_SCALE, &box, h)) != NULL)
      {
        draw_scale (self, cr, c, width, height);
        cairo_destroy (cr);
      }
  }

  {
    int scale = gtk_widget_get_scale_factor (GTK_WIDGET (self));
    gboolean body_new = self->body == NULL;
    double top = height;

    for (guint i = 0; i < N_PARTS; i++)
      {
        if (self->parts[i] != NULL && self->part_new[i])
          {
            self->parts[i] = sw_raster_node (self->parts[i], NULL, scale);
            body_new = body_new || i != PART_LEGEND;
          }
        self->part_new[i] = FALSE;
        /* A part gone (a stage fewer) changes the body too. */
        body_new = body_new || (i != PART_LEGEND && self->parts[i] != self->body_of[i]);
      }
    /* The legend on its own; the rest in one node from the legend down
     * (see "body" above). */
    if (self->parts[PART_LEGEND] != NULL)
      gtk_snapshot_append_node (snapshot, self->parts[PART_LEGEND]);
    if (body_new)
      {
        g_clear_pointer (&self->body, gsk_render_node_unref);
        for (guint i = 0; i < N_PARTS; i++)
          if (i != PART_LEGEND && self->parts[i] != NULL)
            {
              graphene_rect_t b;
              gsk_render_node_get_bounds (self->parts[i], &b);
              top = MIN (top, b.origin.y);
            }
        top = MAX (floor (top), 0.0);
        self->body = sw_raster_compose (self->parts + PART_COLUMN, N_PARTS - PART_COLUMN,
                                        &GRAPHENE_RECT_INIT (0, top, width, height - top), scale);
        memcpy (self->body_of, self->parts, sizeof self->body_of);
      }
    gtk_snapshot_append_node (snapshot, self->body);
  }
}

static void
draw_stack (SwStackView *self, GtkSnapshot *snapshot, int width, int height, const Colors *cc)
{
  Colors c = *cc;
  cairo_t *cr;

  if (parts_apply (self))
    {
      draw_stack_parts (self, snapshot, width, height, cc);
      return;
    }
  clear_parts (self);
  cr = gtk_snapshot_append_cairo (snapshot, &GRAPHENE_RECT_INIT (0, 0, width, height));

  if (self->result == NULL)
    goto out;

  if (!self->result->ok)
    {
      int mw, mh;
      if (self->message != NULL)
        {
          pango_layout_get_pixel_size (self->message, &mw, &mh);
          set_source_alpha (cr, &c.warning, 1.0);
          draw_text (cr, self->message, (width - pango_layout_get_width (self->message)
                                         / (double) PANGO_SCALE) / 2.0, (height - mh) / 2.0);
        }
      goto out;
    }

  /* The to-scale legend only beside a drawing. */
  if (!self->to_scale || self->scale_drawn)
    draw_legend (self, cr, &c);

  if (self->message != NULL)
    {
      const graphene_rect_t *m = &self->message_rect;
      set_source_alpha (cr, &c.warning, 0.10);
      rect_path (cr, m);
      cairo_fill (cr);
      set_source_alpha (cr, &c.warning, 1.0);
      cairo_set_line_width (cr, 2.0);
      cairo_rectangle (cr, m->origin.x + 1.0, m->origin.y + 1.0,
                       m->size.width - 2.0, m->size.height - 2.0);
      cairo_stroke (cr);
      set_source_alpha (cr, &c.fg, 1.0);
      draw_text (cr, self->message, m->origin.x + 8.0, m->origin.y + 6.0);
    }

  if (self->to_scale)
    {
      if (self->scale_drawn)
        draw_to_scale (self, cr, &c, width, height);
      goto out;
    }

  if (self->n_base > 0)
    draw_baseline (self, cr, &c);

  for (guint i = 0; i < self->n_items; i++)
    if (self->items[i].rect.size.width > 0.0)
      draw_item (self, cr, &self->items[i], &c);
  /* Strap-on boosters beside the first stage, drawn to the same rule
   * (area proportional to mass) by the shared drawing. */
  if (self->px2_per_kg > 0.0 && self->geom.n == self->n_items && self->geom.n_boosters > 0)
    {
      SwStackStyle st;
      stack_style (&c, &st);
      sw_stack_draw_boosters (cr, &self->geom, &st, FALSE);
    }
  for (guint i = 0; i < self->n_items; i++)
    if (self->items[i].label != NULL && self->items[i].rect.size.width > 0.0)
      draw_label (self, cr, &self->items[i], &c);

  for (guint i = 0; i < self->n_items; i++)
    if (self->items[i].stage >= 0 && self->items[i].stage == self->selected)
      draw_selection (self, cr, &self->items[i], &c);

  if (self->hover_border >= 0 || self->drag_lower >= 0)
    {
      int b = self->drag_lower >= 0 ? self->drag_lower : self->hover_border;
      for (guint i = 0; i + 1 < self->n_items; i++)
        if (self->items[i].stage == b)
          {
            const Item *lo = &self->items[i], *up = &self->items[i + 1];
            double y = (lo->rect.origin.y + up->rect.origin.y + up->rect.size.height) / 2.0;
            double hw = MAX (lo->rect.size.width, up->rect.size.width) / 2.0 + 6.0;
            double cx = lo->rect.origin.x + lo->rect.size.width / 2.0;
            set_source_alpha (cr, &c.select, 1.0);
            cairo_set_line_width (cr, 3.0);
            cairo_move_to (cr, cx - hw, y);
            cairo_line_to (cr, cx + hw, y);
            cairo_stroke (cr);
            /* A grip: up and down arrows at the end of the line. */
            cairo_move_to (cr, cx + hw + 4.0, y - 3.0);
            cairo_line_to (cr, cx + hw + 9.0, y - 10.0);
            cairo_line_to (cr, cx + hw + 14.0, y - 3.0);
            cairo_close_path (cr);
            cairo_move_to (cr, cx + hw + 4.0, y + 3.0);
            cairo_line_to (cr, cx + hw + 9.0, y + 10.0);
            cairo_line_to (cr, cx + hw + 14.0, y + 3.0);
            cairo_close_path (cr);
            cairo_fill (cr);
          }
    }

  if (self->px2_per_kg > 0.0)
    draw_scale (self, cr, &c, width, height);
  else
    {
      set_source_alpha (cr, &c.fg, 0.8);
      /* Without a scale: the vehicle cannot be sized, or the view has no
       * room for its blocks beside their labels. */
      draw_simple_text (self, cr,
                        self->result->sizing.feasible
                          ? _("Not to scale: too little room for the blocks beside their labels")
                          : _("Not to scale: no masses while the vehicle is infeasible"),
                        MARGIN, height - MARGIN - legend_height (self) + 8.0, NULL);
    }

out:
  cairo_destroy (cr);
}

/* FNV-1a over what the drawing shows. */
static guint64
key_bytes (guint64 h, const void *data, gsize n)
{
  const guchar *p = data;

  for (gsize i = 0; i < n; i++)
    h = (h ^ p[i]) * G_GUINT64_CONSTANT (1099511628211);
  return h;
}

static guint64
key_layout (guint64 h, PangoLayout *layout)
{
  const char *text = layout != NULL ? pango_layout_get_text (layout) : NULL;

  return text != NULL ? key_bytes (h, text, strlen (text) + 1) : key_bytes (h, "\1", 1);
}

static guint64
drawing_key (SwStackView *self, int width, int height, const Colors *c)
{
  guint64 h = G_GUINT64_CONSTANT (14695981039346656037);
  const SwAnalysis *r = self->result;
  int state[7] = { width, height, self->selected, self->hover_border, self->drag_lower,
                   r == NULL ? -1 : r->ok, self->to_scale };

  h = key_bytes (h, state, sizeof state);
  h = key_bytes (h, c, sizeof *c);
  if (r == NULL)
    return h;
  h = key_layout (h, self->message);
  h = key_bytes (h, &self->message_rect, sizeof self->message_rect);
  if (!r->ok)
    return h;
  if (self->to_scale)
    {
      h = key_bytes (h, &self->scale_drawn, sizeof self->scale_drawn);
      h = key_bytes (h, &self->sgeom, sizeof self->sgeom);
      h = key_bytes (h, &r->shape, sizeof r->shape);
    }
  h = key_bytes (h, &r->sizing.liftoff_mass_kg, sizeof (double));
  h = key_bytes (h, &r->sizing.payload_fraction, sizeof (double));
  h = key_bytes (h, &self->px2_per_kg, sizeof (double));
  h = key_bytes (h, &self->scale_ref_kg, sizeof (double));
  h = key_bytes (h, &self->scale, sizeof self->scale);
  h = key_bytes (h, &self->geom, sizeof self->geom);
  h = key_bytes (h, &self->n_items, sizeof self->n_items);
  for (guint i = 0; i < self->n_items; i++)
    {
      const Item *it = &self->items[i];
      h = key_bytes (h, &it->kind, sizeof it->kind);
      h = key_bytes (h, &it->stage, sizeof it->stage);
      h = key_bytes (h, &it->mass_kg, sizeof it->mass_kg);
      h = key_bytes (h, &it->structure_fraction, sizeof it->structure_fraction);
      h = key_bytes (h, &it->rect, sizeof it->rect);
      h = key_bytes (h, &it->structure, sizeof it->structure);
      h = key_bytes (h, &it->label_y, sizeof it->label_y);
      h = key_bytes (h, &it->label_h, sizeof it->label_h);
      h = key_layout (h, it->label);
    }
  h = key_bytes (h, &self->label_x, sizeof self->label_x);
  h = key_bytes (h, &self->stack_right, sizeof self->stack_right);
  h = key_bytes (h, &self->top_y, sizeof self->top_y);
  h = key_bytes (h, &self->bottom_y, sizeof self->bottom_y);
  h = key_bytes (h, &self->n_base, sizeof self->n_base);
  if (self->n_base > 0)
    {
      h = key_bytes (h, self->base_rects, sizeof self->base_rects);
      h = key_bytes (h, &self->base_geom, sizeof self->base_geom);
      h = key_layout (h, self->base_caption);
      h = key_bytes (h, &self->base_caption_x, sizeof (double));
      h = key_bytes (h, &self->base_caption_y, sizeof (double));
    }
  return h;
}

/* Lays out and draws the view if what it shows changed: ahead of the
 * frame (queue_redraw) and again at the snapshot. */
static void
sw_stack_view_prepare (GtkWidget *widget)
{
  SwStackView *self = SW_STACK_VIEW (widget);
  int width = gtk_widget_get_width (widget);
  int height = gtk_widget_get_height (widget);
  guint64 key;
  Colors c;

  if (width <= 0 || height <= 0)
    return;
  ensure_layout (self);
  get_colors (widget, &c);
  key = drawing_key (self, width, height, &c);
  if (self->drawing == NULL || key != self->drawing_key)
    {
      GtkSnapshot *own = gtk_snapshot_new ();
      gboolean in_parts = parts_apply (self);

      g_clear_pointer (&self->drawing, gsk_render_node_unref);
      draw_stack (self, own, width, height, &c);
      self->drawing = gtk_snapshot_free_to_node (own);
      self->drawing_key = key;
      /* The parts are rasterised each on its own (draw_stack_parts); the
       * whole-view drawing here. */
      if (self->drawing != NULL && !in_parts)
        self->drawing = sw_raster_node (self->drawing, &GRAPHENE_RECT_INIT (0, 0, width, height),
                                        gtk_widget_get_scale_factor (widget));
    }
}

GskRenderNode *
sw_stack_view_peek_drawing (SwStackView *self)
{
  g_return_val_if_fail (SW_IS_STACK_VIEW (self), NULL);
  return self->drawing;
}

static void
sw_stack_view_snapshot (GtkWidget *widget, GtkSnapshot *snapshot)
{
  SwStackView *self = SW_STACK_VIEW (widget);

  sw_stack_view_prepare (widget);
  if (self->drawing != NULL)
    gtk_snapshot_append_node (snapshot, self->drawing);
}

static void
sw_stack_view_measure (GtkWidget *widget, GtkOrientation orientation, int for_size,
                       int *minimum, int *natural, int *minimum_baseline, int *natural_baseline)
{
  if (orientation == GTK_ORIENTATION_HORIZONTAL)
    {
      *minimum = 240;
      *natural = 420;
    }
  else
    {
      *minimum = 280;
      *natural = 560;
    }
}

static void
sw_stack_view_size_allocate (GtkWidget *widget, int width, int height, int baseline)
{
  /* Nothing: the layout is keyed on the size (ensure_layout), so a relayout
   * of the window that leaves this view's size alone re-shapes no text. */
}

/* Everything shaped and drawn again, even if the texts did not change:
 * after a change of style (the font may have changed) or of scale (the
 * drawing is pixels, sw-raster.h). */
static void
redraw_all (SwStackView *self)
{
  if (self->text_cache != NULL)
    g_hash_table_remove_all (self->text_cache);
  g_clear_pointer (&self->drawing, gsk_render_node_unref);
  clear_parts (self);
  invalidate (self);
}

static void
sw_stack_view_css_changed (GtkWidget *widget, GtkCssStyleChange *change)
{
  GTK_WIDGET_CLASS (sw_stack_view_parent_class)->css_changed (widget, change);
  redraw_all (SW_STACK_VIEW (widget));
}

static void
scale_factor_cb (SwStackView *self, GParamSpec *pspec, gpointer data)
{
  redraw_all (self);
}

/* Tooltip */

static gboolean
query_tooltip_cb (SwStackView *self, int x, int y, gboolean keyboard, GtkTooltip *tooltip)
{
  SwAnalysis *r = self->result;
  const Item *it;
  const SwStageResult *s;
  g_autofree char *title = NULL;
  g_autofree char *mass = NULL, *prop = NULL, *struc = NULL, *dv = NULL, *share = NULL;
  g_autofree char *ratio = NULL, *m0 = NULL, *mb = NULL, *limit = NULL, *markup = NULL;
  int index;

  if (r == NULL || !r->ok)
    return FALSE;
  if (keyboard)
    {
      index = -1;
      for (guint i = 0; i < self->n_items; i++)
        if (self->items[i].stage >= 0 && self->items[i].stage == self->selected)
          index = (int) i;
    }
  else
    index = item_at (self, x, y);
  if (index < 0)
    return FALSE;
  it = &self->items[index];

  if (it->kind == ITEM_PAYLOAD)
    {
      mass = sw_format_mass (r->design->payload_kg);
      markup = g_markup_printf_escaped (_("<b>Payload</b>\n%s"), mass);
      gtk_tooltip_set_markup (tooltip, markup);
      return TRUE;
    }

  s = &r->sizing.stages[it->stage];
  title = stage_title_markup (r, it->stage);
  mass = sw_format_mass (s->stage_mass_kg);
  prop = sw_format_mass (s->propellant_mass_kg);
  struc = sw_format_mass (s->structural_mass_kg);
  dv = sw_format_speed (s->delta_v_m_s);
  share = sw_format_percent (s->delta_v_share, 1);
  ratio = format_ratio (s->mass_ratio);
  m0 = sw_format_mass (s->initial_mass_kg);
  mb = sw_format_mass (s->burnout_mass_kg);
  limit = sw_format_speed (s->delta_v_limit_m_s);
  markup = g_strdup_printf (_("%s\n"
                              "Stage mass: %s (propellant %s, structure %s)\n"
                              "Δv: %s (%s of the total), limit %s\n"
                              "Mass ratio: %s\n"
                              "Mass at ignition: %s, at burnout: %s%s%s"),
                            title, mass, prop, struc, dv, share, limit, ratio, m0, mb,
                            it->kind == ITEM_FAILING ? _("\n<b>⚠ Cannot deliver its Δv</b>") : "",
                            it->kind != ITEM_UNUSED ? ""
                            : r->design->split == SW_SPLIT_OPTIMAL ? _("\nUnused: no Δv at the optimum")
                            : _("\nUnused: no Δv in this split"));
  if (isfinite (stage_tw (r, it->stage)) && r->has_stage_figures)
    {
      const SwAscentStage *f = &r->stage_figures[it->stage];
      g_autofree char *tw = sw_format_ratio (stage_tw (r, it->stage), 2);
      g_autofree char *burn = sw_format_duration (f->burn_time_s);
      /* Translators: thrust-to-weight ratio, then a burn time with its unit */
      g_autofree char *more = g_strdup_printf (_("\nThrust-to-weight at ignition: %s, burn "
                                                 "time %s"), tw, burn);
      char *joined = g_strconcat (markup, more, NULL);
      g_free (markup);
      markup = joined;
    }
  gtk_tooltip_set_markup (tooltip, markup);
  return TRUE;
}

/* Input */

static void
click_pressed_cb (GtkGestureClick *gesture, int n_press, double x, double y, SwStackView *self)
{
  int index = item_at (self, x, y);

  gtk_widget_grab_focus (GTK_WIDGET (self));
  if (index < 0 || self->items[index].stage < 0 || border_at (self, x, y) >= 0)
    return;
  sw_stack_view_set_selected (self, self->items[index].stage);
  g_signal_emit (self, signals[STAGE_ACTIVATED], 0, self->items[index].stage);
}

static void
drag_begin_cb (GtkGestureDrag *gesture, double x, double y, SwStackView *self)
{
  int lower = border_at (self, x, y);

  if (lower < 0 || self->stack_height <= 0.0)
    {
      gtk_gesture_set_state (GTK_GESTURE (gesture), GTK_EVENT_SEQUENCE_DENIED);
      return;
    }
  gtk_gesture_set_state (GTK_GESTURE (gesture), GTK_EVENT_SEQUENCE_CLAIMED);
  self->drag_lower = lower;
  /* The whole stack height stands for the whole delta-v. */
  self->drag_stack_height = self->stack_height;
  queue_redraw (self);
}

static void
drag_update_cb (GtkGestureDrag *gesture, double dx, double dy, SwStackView *self)
{
  if (self->drag_lower < 0)
    return;
  /* Up (negative dy) grows the lower stage: share moves from upper to lower. */
  g_signal_emit (self, signals[SHARE_DRAGGED], 0, self->drag_lower, self->drag_lower + 1,
                 -dy / self->drag_stack_height, FALSE);
}

static void
drag_end_cb (GtkGestureDrag *gesture, double dx, double dy, SwStackView *self)
{
  int lower = self->drag_lower;

  if (lower < 0)
    return;
  self->drag_lower = -1;
  g_signal_emit (self, signals[SHARE_DRAGGED], 0, lower, lower + 1,
                 -dy / self->drag_stack_height, TRUE);
  queue_redraw (self);
}

static void
motion_cb (GtkEventControllerMotion *motion, double x, double y, SwStackView *self)
{
  int border = border_at (self, x, y);

  if (border != self->hover_border)
    {
      self->hover_border = border;
      queue_redraw (self);
    }
  if (border >= 0 || self->drag_lower >= 0)
    gtk_widget_set_cursor_from_name (GTK_WIDGET (self), "ns-resize");
  else if (item_at (self, x, y) >= 0)
    gtk_widget_set_cursor_from_name (GTK_WIDGET (self), "pointer");
  else
    gtk_widget_set_cursor (GTK_WIDGET (self), NULL);
}

static void
leave_cb (GtkEventControllerMotion *motion, SwStackView *self)
{
  if (self->hover_border >= 0)
    {
      self->hover_border = -1;
      queue_redraw (self);
    }
}

static gboolean
key_pressed_cb (GtkEventControllerKey *key, guint keyval, guint keycode, GdkModifierType state,
                SwStackView *self)
{
  int n, next;

  if (self->result == NULL || !self->result->ok)
    return FALSE;
  n = (int) self->result->sizing.n_stages;
  if (keyval == GDK_KEY_Up || keyval == GDK_KEY_KP_Up)
    next = self->selected < 0 ? 0 : MIN (self->selected + 1, n - 1);
  else if (keyval == GDK_KEY_Down || keyval == GDK_KEY_KP_Down)
    next = self->selected < 0 ? 0 : MAX (self->selected - 1, 0);
  else
    return FALSE;
  if (n <= 0)
    return FALSE;
  sw_stack_view_set_selected (self, next);
  g_signal_emit (self, signals[STAGE_ACTIVATED], 0, next);
  return TRUE;
}

/* GObject */

static void
sw_stack_view_dispose (GObject *object)
{
  SwStackView *self = SW_STACK_VIEW (object);

  g_clear_handle_id (&self->prepare_id, g_source_remove);
  clear_layout (self);
  g_clear_pointer (&self->drawing, gsk_render_node_unref);
  clear_parts (self);
  g_clear_pointer (&self->result, sw_analysis_unref);
  g_clear_pointer (&self->text_cache, g_hash_table_unref);
  G_OBJECT_CLASS (sw_stack_view_parent_class)->dispose (object);
}

static void
sw_stack_view_get_property (GObject *object, guint prop_id, GValue *value, GParamSpec *pspec)
{
  SwStackView *self = SW_STACK_VIEW (object);

  switch (prop_id)
    {
    case PROP_SELECTED_STAGE:
      g_value_set_int (value, self->selected);
      break;
    case PROP_TO_SCALE:
      g_value_set_boolean (value, self->to_scale);
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
sw_stack_view_set_property (GObject *object, guint prop_id, const GValue *value,
                            GParamSpec *pspec)
{
  SwStackView *self = SW_STACK_VIEW (object);

  switch (prop_id)
    {
    case PROP_SELECTED_STAGE:
      sw_stack_view_set_selected (self, g_value_get_int (value));
      break;
    case PROP_TO_SCALE:
      sw_stack_view_set_to_scale (self, g_value_get_boolean (value));
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
sw_stack_view_class_init (SwStackViewClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = sw_stack_view_dispose;
  object_class->get_property = sw_stack_view_get_property;
  object_class->set_property = sw_stack_view_set_property;
  widget_class->snapshot = sw_stack_view_snapshot;
  widget_class->measure = sw_stack_view_measure;
  widget_class->size_allocate = sw_stack_view_size_allocate;
  widget_class->css_changed = sw_stack_view_css_changed;

  properties[PROP_SELECTED_STAGE] =
    g_param_spec_int ("selected-stage", NULL, NULL, -1, SW_MAX_STAGES - 1, -1,
                      G_PARAM_READWRITE | G_PARAM_EXPLICIT_NOTIFY | G_PARAM_STATIC_STRINGS);
  properties[PROP_TO_SCALE] =
    g_param_spec_boolean ("to-scale", NULL, NULL, FALSE,
                          G_PARAM_READWRITE | G_PARAM_EXPLICIT_NOTIFY | G_PARAM_STATIC_STRINGS);
  g_object_class_install_properties (object_class, N_PROPS, properties);

  signals[STAGE_ACTIVATED] =
    g_signal_new ("stage-activated", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST,
                  0, NULL, NULL, NULL, G_TYPE_NONE, 1, G_TYPE_INT);
  signals[SHARE_DRAGGED] =
    g_signal_new ("share-dragged", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST,
                  0, NULL, NULL, NULL, G_TYPE_NONE, 4,
                  G_TYPE_INT, G_TYPE_INT, G_TYPE_DOUBLE, G_TYPE_BOOLEAN);

  gtk_widget_class_set_css_name (widget_class, "stackview");
  gtk_widget_class_set_accessible_role (widget_class, GTK_ACCESSIBLE_ROLE_IMG);
}

static void
sw_stack_view_init (SwStackView *self)
{
  GtkWidget *widget = GTK_WIDGET (self);
  GtkGesture *click = gtk_gesture_click_new ();
  GtkGesture *drag = gtk_gesture_drag_new ();
  GtkEventController *motion = gtk_event_controller_motion_new ();
  GtkEventController *key = gtk_event_controller_key_new ();

  self->text_cache = g_hash_table_new_full (g_str_hash, g_str_equal, g_free, g_object_unref);

  self->selected = -1;
  self->hover_border = -1;
  self->drag_lower = -1;

  gtk_gesture_single_set_button (GTK_GESTURE_SINGLE (click), GDK_BUTTON_PRIMARY);
  g_signal_connect (click, "pressed", G_CALLBACK (click_pressed_cb), self);
  g_signal_connect (self, "notify::scale-factor", G_CALLBACK (scale_factor_cb), NULL);
  gtk_widget_add_controller (widget, GTK_EVENT_CONTROLLER (click));

  gtk_gesture_single_set_button (GTK_GESTURE_SINGLE (drag), GDK_BUTTON_PRIMARY);
  g_signal_connect (drag, "drag-begin", G_CALLBACK (drag_begin_cb), self);
  g_signal_connect (drag, "drag-update", G_CALLBACK (drag_update_cb), self);
  g_signal_connect (drag, "drag-end", G_CALLBACK (drag_end_cb), self);
  gtk_widget_add_controller (widget, GTK_EVENT_CONTROLLER (drag));

  g_signal_connect (motion, "motion", G_CALLBACK (motion_cb), self);
  g_signal_connect (motion, "leave", G_CALLBACK (leave_cb), self);
  gtk_widget_add_controller (widget, motion);

  g_signal_connect (key, "key-pressed", G_CALLBACK (key_pressed_cb), self);
  gtk_widget_add_controller (widget, key);

  gtk_widget_set_focusable (widget, TRUE);
  gtk_widget_set_has_tooltip (widget, TRUE);
  g_signal_connect_swapped (widget, "query-tooltip", G_CALLBACK (query_tooltip_cb), self);
}

/* Public API */

GtkWidget *
sw_stack_view_new (void)
{
  return g_object_new (SW_TYPE_STACK_VIEW, NULL);
}

static void
update_accessible (SwStackView *self)
{
  SwAnalysis *r = self->result;
  g_autofree char *text = NULL;

  if (r == NULL)
    text = g_strdup (_("Stage stack: no design"));
  else if (!r->ok)
    text = g_strdup_printf (_("Stage stack: the design cannot be solved. %s"),
                            r->error_message);
  else if (!r->sizing.feasible)
    text = g_strdup_printf (_("Stage stack: not feasible. %s"), r->sizing.reason);
  else
    {
      g_autofree char *m = sw_format_mass (r->sizing.liftoff_mass_kg);
      text = g_strdup_printf (_("Stage stack: %u stages, liftoff mass %s"),
                              r->sizing.n_stages, m);
    }
  gtk_accessible_update_property (GTK_ACCESSIBLE (self), GTK_ACCESSIBLE_PROPERTY_LABEL, text, -1);
}

void
sw_stack_view_set_result (SwStackView *self, SwAnalysis *result)
{
  g_return_if_fail (SW_IS_STACK_VIEW (self));

  if (result == self->result)
    return;
  if (result != NULL)
    sw_analysis_ref (result);
  g_clear_pointer (&self->result, sw_analysis_unref);
  self->result = result;
  if (self->selected >= 0 && (result == NULL || !result->ok
                              || (guint) self->selected >= result->sizing.n_stages))
    sw_stack_view_set_selected (self, -1);
  update_accessible (self);
  invalidate (self);
}

SwAnalysis *
sw_stack_view_get_result (SwStackView *self)
{
  g_return_val_if_fail (SW_IS_STACK_VIEW (self), NULL);
  return self->result;
}

void
sw_stack_view_set_selected (SwStackView *self, int stage)
{
  g_return_if_fail (SW_IS_STACK_VIEW (self));

  stage = CLAMP (stage, -1, SW_MAX_STAGES - 1);
  if (stage == self->selected)
    return;
  self->selected = stage;
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_SELECTED_STAGE]);
  queue_redraw (self);
}

int
sw_stack_view_get_selected (SwStackView *self)
{
  g_return_val_if_fail (SW_IS_STACK_VIEW (self), -1);
  return self->selected;
}

static const Item *
find_item (SwStackView *self, int stage)
{
  ensure_layout (self);
  for (guint i = 0; i < self->n_items; i++)
    if (self->items[i].stage == stage && self->items[i].rect.size.width > 0.0)
      return &self->items[i];
  return NULL;
}

double
sw_stack_view_get_stage_tw (SwStackView *self, guint stage)
{
  g_return_val_if_fail (SW_IS_STACK_VIEW (self), NAN);
  return stage_tw (self->result, (int) stage);
}

gboolean
sw_stack_view_get_block_rect (SwStackView *self, guint index, graphene_rect_t *rect)
{
  const Item *it;

  g_return_val_if_fail (SW_IS_STACK_VIEW (self), FALSE);
  it = find_item (self, (int) index);
  if (it == NULL)
    return FALSE;
  if (rect != NULL)
    *rect = it->rect;
  return TRUE;
}

gboolean
sw_stack_view_get_booster_rect (SwStackView *self, guint index, graphene_rect_t *rect,
                                graphene_rect_t *structure)
{
  const SwStackBox *b, *s;

  g_return_val_if_fail (SW_IS_STACK_VIEW (self), FALSE);
  if (!(self->px2_per_kg > 0.0) || self->geom.n != self->n_items
      || index >= self->geom.n_boosters)
    return FALSE;
  b = &self->geom.booster[index];
  s = &self->geom.booster_structure[index];
  if (rect != NULL)
    *rect = GRAPHENE_RECT_INIT (b->x, b->y, b->width, b->height);
  if (structure != NULL)
    *structure = GRAPHENE_RECT_INIT (s->x, s->y, s->width, s->height);
  return TRUE;
}

gboolean
sw_stack_view_get_payload_rect (SwStackView *self, graphene_rect_t *rect)
{
  const Item *it;

  g_return_val_if_fail (SW_IS_STACK_VIEW (self), FALSE);
  it = find_item (self, -1);
  if (it == NULL)
    return FALSE;
  if (rect != NULL)
    *rect = it->rect;
  return TRUE;
}

gboolean
sw_stack_view_get_structure_rect (SwStackView *self, guint index, graphene_rect_t *rect)
{
  const Item *it;

  g_return_val_if_fail (SW_IS_STACK_VIEW (self), FALSE);
  it = find_item (self, (int) index);
  if (it == NULL || it->kind != ITEM_STAGE)
    return FALSE;
  if (rect != NULL)
    *rect = it->structure;
  return TRUE;
}

gboolean
sw_stack_view_get_baseline_rect (SwStackView *self, guint index, graphene_rect_t *rect)
{
  g_return_val_if_fail (SW_IS_STACK_VIEW (self), FALSE);

  ensure_layout (self);
  if (index >= self->n_base)
    return FALSE;
  if (rect != NULL)
    *rect = self->base_rects[index];
  return TRUE;
}

double
sw_stack_view_get_area_scale (SwStackView *self)
{
  g_return_val_if_fail (SW_IS_STACK_VIEW (self), 0.0);
  ensure_layout (self);
  return self->px2_per_kg;
}

void
sw_stack_view_set_to_scale (SwStackView *self, gboolean to_scale)
{
  g_return_if_fail (SW_IS_STACK_VIEW (self));

  to_scale = !!to_scale;
  if (self->to_scale == to_scale)
    return;
  self->to_scale = to_scale;
  self->hover_border = -1;
  invalidate (self);
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_TO_SCALE]);
}

gboolean
sw_stack_view_get_to_scale (SwStackView *self)
{
  g_return_val_if_fail (SW_IS_STACK_VIEW (self), FALSE);
  return self->to_scale;
}

double
sw_stack_view_get_metre_scale (SwStackView *self)
{
  g_return_val_if_fail (SW_IS_STACK_VIEW (self), 0.0);
  ensure_layout (self);
  return self->to_scale && self->scale_drawn ? self->sgeom.px_per_m : 0.0;
}

gboolean
sw_stack_view_get_scale_bar (SwStackView *self, graphene_rect_t *rect, double *metres)
{
  g_return_val_if_fail (SW_IS_STACK_VIEW (self) && rect != NULL && metres != NULL, FALSE);
  ensure_layout (self);
  if (!self->to_scale || !self->scale_drawn)
    return FALSE;
  *rect = GRAPHENE_RECT_INIT (self->sgeom.bar.x, self->sgeom.bar.y, self->sgeom.bar.width,
                              self->sgeom.bar.height);
  *metres = self->sgeom.bar_m;
  return TRUE;
}
