/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-tone-frame"

#include "config.h"

#include "sw-tone-frame.h"

struct _SwToneFrame {
  GtkWidget  parent_instance;
  GPtrArray *faces;   /* GtkWidget, one per tone; children of the frame */
  char      *face_classes;   /* as given, one space between */
  guint      face;
  GtkWidget *child;
};

G_DEFINE_FINAL_TYPE (SwToneFrame, sw_tone_frame, GTK_TYPE_WIDGET)

enum { PROP_0, PROP_FACES, PROP_FACE, PROP_CHILD, N_PROPS };
static GParamSpec *props[N_PROPS];

/* The faces' padding and border in @orientation (both sides): the least
 * an empty face takes. */
static int
face_extra (SwToneFrame *self, GtkOrientation orientation)
{
  int extra = 0;

  for (guint i = 0; i < self->faces->len; i++)
    {
      int min = 0;
      gtk_widget_measure (g_ptr_array_index (self->faces, i), orientation, -1, &min, NULL,
                          NULL, NULL);
      extra = MAX (extra, min);
    }
  return extra;
}

static void
sw_tone_frame_measure (GtkWidget *widget, GtkOrientation orientation, int for_size,
                       int *minimum, int *natural, int *minimum_baseline, int *natural_baseline)
{
  SwToneFrame *self = SW_TONE_FRAME (widget);
  int extra = face_extra (self, orientation);
  int across = face_extra (self, orientation == GTK_ORIENTATION_HORIZONTAL
                                   ? GTK_ORIENTATION_VERTICAL : GTK_ORIENTATION_HORIZONTAL);
  int min = 0, nat = 0;

  if (self->child != NULL && gtk_widget_get_visible (self->child))
    gtk_widget_measure (self->child, orientation, for_size >= 0 ? MAX (0, for_size - across) : -1,
                        &min, &nat, NULL, NULL);
  *minimum = min + extra;
  *natural = nat + extra;
  *minimum_baseline = *natural_baseline = -1;
}

static void
sw_tone_frame_size_allocate (GtkWidget *widget, int width, int height, int baseline)
{
  SwToneFrame *self = SW_TONE_FRAME (widget);
  int dx = face_extra (self, GTK_ORIENTATION_HORIZONTAL);
  int dy = face_extra (self, GTK_ORIENTATION_VERTICAL);

  for (guint i = 0; i < self->faces->len; i++)
    gtk_widget_allocate (g_ptr_array_index (self->faces, i), width, height, -1, NULL);
  if (self->child != NULL && gtk_widget_get_visible (self->child))
    gtk_widget_allocate (self->child, MAX (0, width - dx), MAX (0, height - dy), -1,
                         gsk_transform_translate (NULL, &GRAPHENE_POINT_INIT (dx / 2, dy / 2)));
}

static void
sw_tone_frame_snapshot (GtkWidget *widget, GtkSnapshot *snapshot)
{
  SwToneFrame *self = SW_TONE_FRAME (widget);

  if (self->face < self->faces->len)
    gtk_widget_snapshot_child (widget, g_ptr_array_index (self->faces, self->face), snapshot);
  if (self->child != NULL)
    gtk_widget_snapshot_child (widget, self->child, snapshot);
}

static GtkSizeRequestMode
sw_tone_frame_get_request_mode (GtkWidget *widget)
{
  SwToneFrame *self = SW_TONE_FRAME (widget);

  return self->child != NULL ? gtk_widget_get_request_mode (self->child)
                             : GTK_SIZE_REQUEST_CONSTANT_SIZE;
}

static void
drop_faces (SwToneFrame *self)
{
  for (guint i = 0; i < self->faces->len; i++)
    gtk_widget_unparent (g_ptr_array_index (self->faces, i));
  g_ptr_array_set_size (self->faces, 0);
}

void
sw_tone_frame_set_faces (SwToneFrame *self, const char *faces)
{
  g_auto (GStrv) classes = NULL;
  GString *given;

  g_return_if_fail (SW_IS_TONE_FRAME (self));

  drop_faces (self);
  given = g_string_new (NULL);
  classes = g_strsplit_set (faces != NULL ? faces : "", " ", -1);
  for (guint i = 0; classes[i] != NULL; i++)
    {
      GtkWidget *face;

      if (classes[i][0] == '\0')
        continue;
      /* Drawn, never read out nor pointed at. */
      face = g_object_new (GTK_TYPE_BOX, "accessible-role", GTK_ACCESSIBLE_ROLE_PRESENTATION,
                           "can-target", FALSE, "can-focus", FALSE, NULL);
      gtk_widget_add_css_class (face, "sw-status");
      gtk_widget_add_css_class (face, classes[i]);
      /* Under the content, so the content is the last child and gets the
       * pointer first. */
      if (self->child != NULL)
        gtk_widget_insert_before (face, GTK_WIDGET (self), self->child);
      else
        gtk_widget_set_parent (face, GTK_WIDGET (self));
      g_ptr_array_add (self->faces, face);
      g_string_append_printf (given, "%s%s", given->len > 0 ? " " : "", classes[i]);
    }
  g_free (self->face_classes);
  self->face_classes = g_string_free (given, FALSE);
  gtk_widget_queue_resize (GTK_WIDGET (self));
  g_object_notify_by_pspec (G_OBJECT (self), props[PROP_FACES]);
}

void
sw_tone_frame_set_face (SwToneFrame *self, guint index)
{
  g_return_if_fail (SW_IS_TONE_FRAME (self));

  if (index >= self->faces->len || index == self->face)
    return;
  self->face = index;
  /* Only drawn again: the faces are styled and laid out already. */
  gtk_widget_queue_draw (GTK_WIDGET (self));
  g_object_notify_by_pspec (G_OBJECT (self), props[PROP_FACE]);
}

guint
sw_tone_frame_get_face (SwToneFrame *self)
{
  g_return_val_if_fail (SW_IS_TONE_FRAME (self), 0);
  return self->face;
}

GtkWidget *
sw_tone_frame_get_face_widget (SwToneFrame *self, guint index)
{
  g_return_val_if_fail (SW_IS_TONE_FRAME (self), NULL);
  return index < self->faces->len ? g_ptr_array_index (self->faces, index) : NULL;
}

void
sw_tone_frame_set_child (SwToneFrame *self, GtkWidget *child)
{
  g_return_if_fail (SW_IS_TONE_FRAME (self));
  g_return_if_fail (child == NULL || gtk_widget_get_parent (child) == NULL);

  if (self->child == child)
    return;
  g_clear_pointer (&self->child, gtk_widget_unparent);
  if (child != NULL)
    {
      self->child = child;
      gtk_widget_set_parent (child, GTK_WIDGET (self));
    }
  g_object_notify_by_pspec (G_OBJECT (self), props[PROP_CHILD]);
}

GtkWidget *
sw_tone_frame_get_child (SwToneFrame *self)
{
  g_return_val_if_fail (SW_IS_TONE_FRAME (self), NULL);
  return self->child;
}

static void
sw_tone_frame_set_property (GObject *object, guint id, const GValue *value, GParamSpec *pspec)
{
  SwToneFrame *self = SW_TONE_FRAME (object);

  switch (id)
    {
    case PROP_FACES:
      sw_tone_frame_set_faces (self, g_value_get_string (value));
      break;
    case PROP_FACE:
      sw_tone_frame_set_face (self, g_value_get_uint (value));
      break;
    case PROP_CHILD:
      sw_tone_frame_set_child (self, g_value_get_object (value));
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, id, pspec);
    }
}

static void
sw_tone_frame_get_property (GObject *object, guint id, GValue *value, GParamSpec *pspec)
{
  SwToneFrame *self = SW_TONE_FRAME (object);

  switch (id)
    {
    case PROP_FACES:
      g_value_set_string (value, self->face_classes);
      break;
    case PROP_FACE:
      g_value_set_uint (value, self->face);
      break;
    case PROP_CHILD:
      g_value_set_object (value, self->child);
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, id, pspec);
    }
}

static void
sw_tone_frame_dispose (GObject *object)
{
  SwToneFrame *self = SW_TONE_FRAME (object);

  drop_faces (self);
  g_clear_pointer (&self->child, gtk_widget_unparent);
  G_OBJECT_CLASS (sw_tone_frame_parent_class)->dispose (object);
}

static void
sw_tone_frame_finalize (GObject *object)
{
  g_ptr_array_unref (SW_TONE_FRAME (object)->faces);
  g_free (SW_TONE_FRAME (object)->face_classes);
  G_OBJECT_CLASS (sw_tone_frame_parent_class)->finalize (object);
}

static void
sw_tone_frame_class_init (SwToneFrameClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->set_property = sw_tone_frame_set_property;
  object_class->get_property = sw_tone_frame_get_property;
  object_class->dispose = sw_tone_frame_dispose;
  object_class->finalize = sw_tone_frame_finalize;
  widget_class->measure = sw_tone_frame_measure;
  widget_class->size_allocate = sw_tone_frame_size_allocate;
  widget_class->snapshot = sw_tone_frame_snapshot;
  widget_class->get_request_mode = sw_tone_frame_get_request_mode;

  props[PROP_FACES] = g_param_spec_string ("faces", NULL, NULL, NULL,
                                           G_PARAM_READWRITE | G_PARAM_STATIC_STRINGS
                                           | G_PARAM_EXPLICIT_NOTIFY);
  props[PROP_FACE] = g_param_spec_uint ("face", NULL, NULL, 0, G_MAXUINT, 0,
                                        G_PARAM_READWRITE | G_PARAM_STATIC_STRINGS
                                        | G_PARAM_EXPLICIT_NOTIFY);
  props[PROP_CHILD] = g_param_spec_object ("child", NULL, NULL, GTK_TYPE_WIDGET,
                                           G_PARAM_READWRITE | G_PARAM_STATIC_STRINGS
                                           | G_PARAM_EXPLICIT_NOTIFY);
  g_object_class_install_properties (object_class, N_PROPS, props);
  gtk_widget_class_set_css_name (widget_class, "sw-tone-frame");
  gtk_widget_class_set_accessible_role (widget_class, GTK_ACCESSIBLE_ROLE_GROUP);
}

static void
sw_tone_frame_init (SwToneFrame *self)
{
  self->faces = g_ptr_array_new ();
}

GtkWidget *
sw_tone_frame_new (void)
{
  return g_object_new (SW_TYPE_TONE_FRAME, NULL);
}
