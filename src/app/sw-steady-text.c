/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-steady-text"

#include "config.h"

#include "sw-steady-text.h"

#include <glib/gi18n.h>

/* Its width, in average characters: what it needs at least, and asks for. */
#define MIN_CHARS 12
#define NAT_CHARS 40
/* Lines this close in height count as the same size (regular and bold). */
#define SAME_LINE_PX 2
/* Widths this close count as the same: the verdict's frame is a pixel
 * wider on each side when the vehicle falls short, and its text a little
 * narrower.  The height kept is a floor: a narrower text that needs more
 * lines still gets them. */
#define SAME_WIDTH_PX 8

struct _SwSteadyText {
  GtkWidget    parent_instance;
  char        *text;
  PangoLayout *layout;      /* wrapped at the width last measured or given */
  int          min_lines;
  gboolean     bold;        /* in bold type, without a change of style */
  int          line_px;     /* one line of the font, 0 until measured */
  int          char_px;     /* an average character, 0 until measured */
  /* The tallest it has been at this width since it was told to forget. */
  int          kept_width;
  int          kept_height;
  guint        fit_id;      /* asks for room once the allocation is done */
  gboolean     fit_asked;   /* ... once per text */
  GtkWidget   *menu;        /* "Copy", on a secondary click */
};

G_DEFINE_FINAL_TYPE (SwSteadyText, sw_steady_text, GTK_TYPE_WIDGET)

enum { PROP_0, PROP_TEXT, PROP_MIN_LINES, N_PROPS };
static GParamSpec *props[N_PROPS];

static void
apply_bold (SwSteadyText *self)
{
  PangoAttrList *attrs = NULL;

  if (self->bold)
    {
      attrs = pango_attr_list_new ();
      pango_attr_list_insert (attrs, pango_attr_weight_new (PANGO_WEIGHT_BOLD));
    }
  pango_layout_set_attributes (self->layout, attrs);
  if (attrs != NULL)
    pango_attr_list_unref (attrs);
}

static PangoLayout *
ensure_layout (SwSteadyText *self)
{
  if (self->layout == NULL)
    {
      self->layout = gtk_widget_create_pango_layout (GTK_WIDGET (self), self->text);
      pango_layout_set_wrap (self->layout, PANGO_WRAP_WORD_CHAR);
      apply_bold (self);
    }
  return self->layout;
}

static void
ensure_metrics (SwSteadyText *self)
{
  PangoContext *context;
  PangoFontMetrics *metrics;
  PangoLayout *probe;

  if (self->line_px > 0)
    return;
  context = gtk_widget_get_pango_context (GTK_WIDGET (self));
  metrics = pango_context_get_metrics (context, NULL, NULL);
  self->char_px = MAX (1, PANGO_PIXELS_CEIL (pango_font_metrics_get_approximate_char_width (metrics)));
  pango_font_metrics_unref (metrics);
  probe = gtk_widget_create_pango_layout (GTK_WIDGET (self), "Mg");
  pango_layout_get_pixel_size (probe, NULL, &self->line_px);
  self->line_px = MAX (1, self->line_px);
  g_object_unref (probe);
}

/* The text's height wrapped at @width, at least min_lines high. */
static int
text_height (SwSteadyText *self, int width)
{
  PangoLayout *layout = ensure_layout (self);
  int height;

  ensure_metrics (self);
  /* Pango keeps its lines when the width is the same. */
  pango_layout_set_width (layout, width > 0 ? width * PANGO_SCALE : -1);
  pango_layout_get_pixel_size (layout, NULL, &height);
  return MAX (height, self->min_lines * self->line_px);
}

static GtkSizeRequestMode
sw_steady_text_get_request_mode (GtkWidget *widget)
{
  return GTK_SIZE_REQUEST_HEIGHT_FOR_WIDTH;
}

static void
sw_steady_text_measure (GtkWidget *widget, GtkOrientation orientation, int for_size,
                        int *minimum, int *natural, int *minimum_baseline, int *natural_baseline)
{
  SwSteadyText *self = SW_STEADY_TEXT (widget);

  ensure_metrics (self);
  if (orientation == GTK_ORIENTATION_HORIZONTAL)
    {
      /* Not the text's: a longer text wraps, it never widens the window. */
      *minimum = MIN_CHARS * self->char_px;
      *natural = NAT_CHARS * self->char_px;
    }
  else
    {
      int width = for_size >= 0 ? for_size : NAT_CHARS * self->char_px;
      int height = text_height (self, width);

      if (for_size >= 0 && ABS (for_size - self->kept_width) <= SAME_WIDTH_PX)
        height = MAX (height, self->kept_height);
      *minimum = *natural = height;
    }
}

static gboolean
fit_cb (gpointer data)
{
  SwSteadyText *self = data;

  self->fit_id = 0;
  gtk_widget_queue_resize (GTK_WIDGET (self));
  return G_SOURCE_REMOVE;
}

static void
sw_steady_text_size_allocate (GtkWidget *widget, int width, int height, int baseline)
{
  SwSteadyText *self = SW_STEADY_TEXT (widget);
  int needed = text_height (self, width);

  if (ABS (width - self->kept_width) > SAME_WIDTH_PX)
    self->kept_height = 0;
  self->kept_width = width;
  self->kept_height = MAX (self->kept_height, MIN (needed, height));
  /* A size GTK measured for an earlier text and kept (at a width not
   * tried since): measured again, once for each text, so that a parent
   * that gives less than was asked for is not asked again and again. */
  if (needed > height && !self->fit_asked && self->fit_id == 0)
    {
      self->fit_asked = TRUE;
      self->fit_id = g_idle_add_full (G_PRIORITY_HIGH_IDLE, fit_cb, self, NULL);
    }
  if (self->menu != NULL)
    gtk_popover_present (GTK_POPOVER (self->menu));
}

static void
sw_steady_text_snapshot (GtkWidget *widget, GtkSnapshot *snapshot)
{
  SwSteadyText *self = SW_STEADY_TEXT (widget);
  PangoLayout *layout = ensure_layout (self);

  if (self->text == NULL || self->text[0] == '\0')
    return;
  pango_layout_set_width (layout, gtk_widget_get_width (widget) * PANGO_SCALE);
  G_GNUC_BEGIN_IGNORE_DEPRECATIONS
  gtk_snapshot_render_layout (snapshot, gtk_widget_get_style_context (widget), 0, 0, layout);
  G_GNUC_END_IGNORE_DEPRECATIONS
}

/* A font, a text scale or a direction: measured and laid out afresh.  The
 * height kept stays while a line is about as high as before (the verdict
 * turns bold and back at every edit that is short of the orbit: lines a
 * pixel apart at most, a little wider); a line of another size starts it
 * anew. */
static void
style_changed (SwSteadyText *self)
{
  int old_line_px = self->line_px;

  g_clear_object (&self->layout);
  self->line_px = self->char_px = 0;
  ensure_metrics (self);
  if (ABS (self->line_px - old_line_px) > SAME_LINE_PX)
    self->kept_width = self->kept_height = 0;
  gtk_widget_queue_resize (GTK_WIDGET (self));
}

static void
sw_steady_text_css_changed (GtkWidget *widget, GtkCssStyleChange *change)
{
  GTK_WIDGET_CLASS (sw_steady_text_parent_class)->css_changed (widget, change);
  style_changed (SW_STEADY_TEXT (widget));
}

static void
sw_steady_text_direction_changed (GtkWidget *widget, GtkTextDirection previous)
{
  GTK_WIDGET_CLASS (sw_steady_text_parent_class)->direction_changed (widget, previous);
  style_changed (SW_STEADY_TEXT (widget));
}

/* ---- copying ------------------------------------------------------------ */

static void
copy_action (GtkWidget *widget, const char *action, GVariant *parameter)
{
  SwSteadyText *self = SW_STEADY_TEXT (widget);

  gdk_clipboard_set_text (gtk_widget_get_clipboard (widget), self->text != NULL ? self->text : "");
}

static void
pressed_cb (GtkGestureClick *gesture, int n_press, double x, double y, SwSteadyText *self)
{
  if (self->text == NULL || self->text[0] == '\0')
    return;
  if (self->menu == NULL)
    {
      g_autoptr (GMenu) model = g_menu_new ();

      g_menu_append (model, _("_Copy"), "text.copy");
      self->menu = gtk_popover_menu_new_from_model (G_MENU_MODEL (model));
      gtk_popover_set_has_arrow (GTK_POPOVER (self->menu), FALSE);
      gtk_widget_set_halign (self->menu, GTK_ALIGN_START);
      gtk_widget_set_parent (self->menu, GTK_WIDGET (self));
    }
  gtk_popover_set_pointing_to (GTK_POPOVER (self->menu),
                               &(GdkRectangle) { (int) x, (int) y, 1, 1 });
  gtk_popover_popup (GTK_POPOVER (self->menu));
  gtk_gesture_set_state (GTK_GESTURE (gesture), GTK_EVENT_SEQUENCE_CLAIMED);
}

/* ---- public ------------------------------------------------------------- */

GtkWidget *
sw_steady_text_new (void)
{
  return g_object_new (SW_TYPE_STEADY_TEXT, NULL);
}

/* After a new text or weight: when the height it has at this width holds
 * it, drawn again, no layout (its measured size stays right for this
 * width, since that is never below the height kept); else measured anew. */
static void
redraw_or_resize (SwSteadyText *self)
{
  GtkWidget *widget = GTK_WIDGET (self);
  int width = gtk_widget_get_width (widget);

  if (width > 0 && width == self->kept_width && text_height (self, width) <= self->kept_height)
    gtk_widget_queue_draw (widget);
  else
    gtk_widget_queue_resize (widget);
}

void
sw_steady_text_set_text (SwSteadyText *self, const char *text)
{
  g_return_if_fail (SW_IS_STEADY_TEXT (self));

  if (text == NULL)
    text = "";
  if (g_strcmp0 (self->text, text) == 0)
    return;
  g_free (self->text);
  self->text = g_strdup (text);
  self->fit_asked = FALSE;
  if (self->layout != NULL)
    pango_layout_set_text (self->layout, text, -1);
  gtk_accessible_update_property (GTK_ACCESSIBLE (self), GTK_ACCESSIBLE_PROPERTY_LABEL, text, -1);
  g_object_notify_by_pspec (G_OBJECT (self), props[PROP_TEXT]);

  redraw_or_resize (self);
}

const char *
sw_steady_text_get_text (SwSteadyText *self)
{
  g_return_val_if_fail (SW_IS_STEADY_TEXT (self), NULL);
  return self->text != NULL ? self->text : "";
}

void
sw_steady_text_set_min_lines (SwSteadyText *self, int lines)
{
  g_return_if_fail (SW_IS_STEADY_TEXT (self));
  g_return_if_fail (lines >= 1);

  if (self->min_lines == lines)
    return;
  self->min_lines = lines;
  gtk_widget_queue_resize (GTK_WIDGET (self));
  g_object_notify_by_pspec (G_OBJECT (self), props[PROP_MIN_LINES]);
}

void
sw_steady_text_set_bold (SwSteadyText *self, gboolean bold)
{
  g_return_if_fail (SW_IS_STEADY_TEXT (self));

  bold = !!bold;
  if (self->bold == bold)
    return;
  self->bold = bold;
  if (self->layout != NULL)
    apply_bold (self);
  redraw_or_resize (self);
}

gboolean
sw_steady_text_get_bold (SwSteadyText *self)
{
  g_return_val_if_fail (SW_IS_STEADY_TEXT (self), FALSE);
  return self->bold;
}

void
sw_steady_text_forget_height (SwSteadyText *self)
{
  g_return_if_fail (SW_IS_STEADY_TEXT (self));

  if (self->kept_width == 0 && self->kept_height == 0)
    return;
  self->kept_width = self->kept_height = 0;
  gtk_widget_queue_resize (GTK_WIDGET (self));
}

int
sw_steady_text_get_line_count (SwSteadyText *self)
{
  g_return_val_if_fail (SW_IS_STEADY_TEXT (self), 0);

  text_height (self, gtk_widget_get_width (GTK_WIDGET (self)));
  return pango_layout_get_line_count (self->layout);
}

/* ---- GObject ------------------------------------------------------------ */

static void
sw_steady_text_get_property (GObject *object, guint prop_id, GValue *value, GParamSpec *pspec)
{
  SwSteadyText *self = SW_STEADY_TEXT (object);

  switch (prop_id)
    {
    case PROP_TEXT: g_value_set_string (value, sw_steady_text_get_text (self)); break;
    case PROP_MIN_LINES: g_value_set_int (value, self->min_lines); break;
    default: G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
sw_steady_text_set_property (GObject *object, guint prop_id, const GValue *value,
                             GParamSpec *pspec)
{
  SwSteadyText *self = SW_STEADY_TEXT (object);

  switch (prop_id)
    {
    case PROP_TEXT: sw_steady_text_set_text (self, g_value_get_string (value)); break;
    case PROP_MIN_LINES: sw_steady_text_set_min_lines (self, g_value_get_int (value)); break;
    default: G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
sw_steady_text_dispose (GObject *object)
{
  SwSteadyText *self = SW_STEADY_TEXT (object);

  g_clear_handle_id (&self->fit_id, g_source_remove);
  g_clear_pointer (&self->menu, gtk_widget_unparent);
  g_clear_object (&self->layout);
  G_OBJECT_CLASS (sw_steady_text_parent_class)->dispose (object);
}

static void
sw_steady_text_finalize (GObject *object)
{
  SwSteadyText *self = SW_STEADY_TEXT (object);

  g_free (self->text);
  G_OBJECT_CLASS (sw_steady_text_parent_class)->finalize (object);
}

static void
sw_steady_text_class_init (SwSteadyTextClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->get_property = sw_steady_text_get_property;
  object_class->set_property = sw_steady_text_set_property;
  object_class->dispose = sw_steady_text_dispose;
  object_class->finalize = sw_steady_text_finalize;
  widget_class->get_request_mode = sw_steady_text_get_request_mode;
  widget_class->measure = sw_steady_text_measure;
  widget_class->size_allocate = sw_steady_text_size_allocate;
  widget_class->snapshot = sw_steady_text_snapshot;
  widget_class->css_changed = sw_steady_text_css_changed;
  widget_class->direction_changed = sw_steady_text_direction_changed;

  props[PROP_TEXT] = g_param_spec_string ("text", NULL, NULL, NULL,
                                          G_PARAM_READWRITE | G_PARAM_EXPLICIT_NOTIFY
                                          | G_PARAM_STATIC_STRINGS);
  props[PROP_MIN_LINES] = g_param_spec_int ("min-lines", NULL, NULL, 1, 100, 1,
                                            G_PARAM_READWRITE | G_PARAM_EXPLICIT_NOTIFY
                                            | G_PARAM_STATIC_STRINGS);
  g_object_class_install_properties (object_class, N_PROPS, props);

  gtk_widget_class_install_action (widget_class, "text.copy", NULL, copy_action);
  /* Styled as a label: the themes' and our classes (dim-label) apply. */
  gtk_widget_class_set_css_name (widget_class, "label");
  gtk_widget_class_set_accessible_role (widget_class, GTK_ACCESSIBLE_ROLE_LABEL);
}

static void
sw_steady_text_init (SwSteadyText *self)
{
  GtkGesture *click = gtk_gesture_click_new ();

  self->min_lines = 1;
  gtk_gesture_single_set_button (GTK_GESTURE_SINGLE (click), GDK_BUTTON_SECONDARY);
  g_signal_connect (click, "pressed", G_CALLBACK (pressed_cb), self);
  gtk_widget_add_controller (GTK_WIDGET (self), GTK_EVENT_CONTROLLER (click));
}
