/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-number-field"

#include "config.h"

#include "sw-number-field.h"

#include "sw-format.h"

#include <glib/gi18n.h>
#include <locale.h>
#include <math.h>
#include <string.h>

struct _SwNumberField {
  GtkWidget   parent_instance;

  GtkWidget  *entry;
  GtkWidget  *message;
  SwLimitId   limit;
  double      min, max;
  gboolean    min_exclusive;
  gboolean    whole;
  gboolean    optional;
  guint       digits;
  double      step;
  char       *unit;
  double      value;          /* last shown or committed; NAN: empty */
  char       *shown_text;     /* the text we put there */
  char       *error;
  gboolean    error_in_emit;
  gboolean    committing;
};

G_DEFINE_FINAL_TYPE (SwNumberField, sw_number_field, GTK_TYPE_WIDGET)

enum { SIGNAL_VALUE_COMMITTED, N_SIGNALS };
static guint signals[N_SIGNALS];

/* ---- numbers as text --------------------------------------------------- */

static const char *
locale_mark (void)
{
  const char *m = localeconv ()->decimal_point;
  return m != NULL && m[0] != '\0' ? m : ".";
}

static const char *
locale_grouping (void)
{
  const char *g = localeconv ()->thousands_sep;
  return g != NULL ? g : "";
}

gboolean
sw_number_parse (const char *text, const char *mark, const char *grouping, double *value)
{
  g_autoptr (GString) t = g_string_new (NULL);
  const char *p;
  char *end = NULL;
  gboolean point_ok = g_strcmp0 (grouping, ".") != 0;
  guint digits = 0, marks = 0;
  double v;

  g_return_val_if_fail (text != NULL && mark != NULL, FALSE);
  while (g_unichar_isspace (g_utf8_get_char (text)))
    text = g_utf8_next_char (text);
  p = text;
  if (g_str_has_prefix (p, "\xe2\x88\x92"))   /* U+2212 minus sign */
    {
      g_string_append_c (t, '-');
      p += 3;
    }
  else if (*p == '-' || *p == '+')
    g_string_append_c (t, *p++);
  while (*p != '\0')
    {
      if (g_ascii_isdigit (*p))
        {
          g_string_append_c (t, *p++);
          digits++;
        }
      else if (g_str_has_prefix (p, mark) && marks == 0)
        {
          g_string_append_c (t, '.');
          p += strlen (mark);
          marks++;
        }
      else if (*p == '.' && point_ok && marks == 0)
        {
          g_string_append_c (t, '.');
          p++;
          marks++;
        }
      else if ((*p == 'e' || *p == 'E') && digits > 0)
        {
          g_string_append_c (t, 'e');
          p++;
          if (*p == '-' || *p == '+')
            g_string_append_c (t, *p++);
          if (!g_ascii_isdigit (*p))
            return FALSE;
          while (g_ascii_isdigit (*p))
            g_string_append_c (t, *p++);
          break;
        }
      else
        break;
    }
  while (g_unichar_isspace (g_utf8_get_char (p)) && *p != '\0')
    p = g_utf8_next_char (p);
  if (*p != '\0' || digits == 0)
    return FALSE;
  v = g_ascii_strtod (t->str, &end);
  if (end == NULL || *end != '\0' || !isfinite (v))
    return FALSE;
  *value = v;
  return TRUE;
}

/* From here on a value is shown with a power of ten. */
#define HUGE_SHOWN 1e15

/* @value with at most @digits decimals, trailing zeros dropped, or more
 * digits when that would not show it exactly; the locale's mark. */
static char *
format_value (double value, guint digits)
{
  char buf[G_ASCII_DTOSTR_BUF_SIZE];
  GString *s;

  if (!isfinite (value))
    return g_strdup ("");
  /* The C form, whatever LC_NUMERIC says; the locale's mark goes in below.
   * A value typed with a few more decimals than the field shows keeps them;
   * a computed one (a share from the optimum) is rounded to @digits.  A
   * huge one (typed "1e30") in six figures and a power of ten, not the
   * thirty-one digits of its binary value. */
  if (fabs (value) >= HUGE_SHOWN)
    g_ascii_formatd (buf, sizeof buf, "%.6g", value);
  else
    for (guint d = digits; d <= digits + 3; d++)
      {
        char fmt[16];
        g_snprintf (fmt, sizeof fmt, "%%.%uf", d);
        g_ascii_formatd (buf, sizeof buf, fmt, value);
        if (g_ascii_strtod (buf, NULL) == value)
          break;
        if (d == digits + 3)
          {
            g_snprintf (fmt, sizeof fmt, "%%.%uf", digits);
            g_ascii_formatd (buf, sizeof buf, fmt, value);
          }
      }
  if (strchr (buf, '.') != NULL && strchr (buf, 'e') == NULL)
    {
      char *e = buf + strlen (buf) - 1;
      while (*e == '0')
        *e-- = '\0';
      if (*e == '.')
        *e = '\0';
    }
  if (strcmp (buf, "-0") == 0)
    strcpy (buf, "0");
  s = g_string_new (NULL);
  for (const char *p = buf; *p != '\0'; p++)
    {
      if (*p == '.')
        g_string_append (s, locale_mark ());
      else
        g_string_append_c (s, *p);
    }
  return g_string_free (s, FALSE);
}

static guint
decimals_of (double v)
{
  for (guint d = 0; d < 6; d++)
    if (fabs (v * pow (10.0, d) - round (v * pow (10.0, d))) < 1e-9)
      return d;
  return 6;
}

static char *
range_text (SwNumberField *self)
{
  g_autofree char *lo = sw_format_number (self->min, (int) decimals_of (self->min));
  g_autofree char *hi = sw_format_number (self->max, (int) decimals_of (self->max));

  if (self->min_exclusive)
    /* Translators: an accepted range with an open lower end: "above 0 to 100 kN" */
    return g_strdup_printf (_("above %s to %s%s%s"), lo, hi, self->unit[0] ? " " : "",
                            self->unit);
  /* Translators: an accepted range: "50 to 1,000 s" */
  return g_strdup_printf (_("%s to %s%s%s"), lo, hi, self->unit[0] ? " " : "", self->unit);
}

/* ---- error state ------------------------------------------------------- */

static void
show_error (SwNumberField *self, const char *message)
{
  /* Nothing to undo: no relayout for nothing. */
  if (message == NULL && self->error == NULL)
    return;
  g_free (self->error);
  self->error = g_strdup (message);
  if (message != NULL)
    {
      gtk_widget_add_css_class (self->entry, "error");
      gtk_widget_add_css_class (GTK_WIDGET (self), "sw-invalid");
      gtk_label_set_text (GTK_LABEL (self->message), message);
      gtk_widget_set_visible (self->message, TRUE);
      gtk_accessible_update_state (GTK_ACCESSIBLE (self->entry), GTK_ACCESSIBLE_STATE_INVALID,
                                   GTK_ACCESSIBLE_INVALID_TRUE, -1);
    }
  else
    {
      gtk_widget_remove_css_class (self->entry, "error");
      gtk_widget_remove_css_class (GTK_WIDGET (self), "sw-invalid");
      gtk_label_set_text (GTK_LABEL (self->message), "");
      gtk_widget_set_visible (self->message, FALSE);
      gtk_accessible_reset_state (GTK_ACCESSIBLE (self->entry), GTK_ACCESSIBLE_STATE_INVALID);
    }
}

static void
show_text (SwNumberField *self, double value)
{
  g_free (self->shown_text);
  self->shown_text = format_value (value, self->digits);
  if (g_strcmp0 (gtk_editable_get_text (GTK_EDITABLE (self->entry)), self->shown_text) != 0)
    gtk_editable_set_text (GTK_EDITABLE (self->entry), self->shown_text);
}

static gboolean
dirty (SwNumberField *self)
{
  return g_strcmp0 (gtk_editable_get_text (GTK_EDITABLE (self->entry)), self->shown_text) != 0;
}

static gboolean
same_value (double a, double b)
{
  return (isnan (a) && isnan (b)) || a == b;
}

/* ---- committing -------------------------------------------------------- */

/* Checks @value; on success emits and, unless the handler refused it with
 * sw_number_field_set_error(), makes it the field's value. */
static gboolean
commit_value (SwNumberField *self, double value)
{
  double old = self->value;

  if (!isnan (value))
    {
      gboolean below = self->min_exclusive ? !(value > self->min) : value < self->min;
      if (below || value > self->max)
        {
          g_autofree char *num = format_value (value, self->digits);
          g_autofree char *range = range_text (self);
          g_autofree char *msg = g_strdup_printf (_("%s is out of range. Accepted: %s"), num,
                                                  range);
          show_error (self, msg);
          return FALSE;
        }
      if (self->whole && value != floor (value))
        {
          g_autofree char *num = format_value (value, 6);
          g_autofree char *range = range_text (self);
          g_autofree char *msg = g_strdup_printf (_("%s is not a whole number. Accepted: %s"),
                                                  num, range);
          show_error (self, msg);
          return FALSE;
        }
    }
  if (same_value (value, old) && self->error == NULL)
    {
      show_text (self, value);
      return TRUE;
    }
  self->value = value;
  self->error_in_emit = FALSE;
  show_error (self, NULL);
  self->committing = TRUE;
  g_signal_emit (self, signals[SIGNAL_VALUE_COMMITTED], 0);
  self->committing = FALSE;
  if (self->error_in_emit)
    {
      self->value = old;
      return FALSE;
    }
  show_text (self, self->value);
  return TRUE;
}

gboolean
sw_number_field_commit (SwNumberField *self)
{
  const char *text;
  double value;

  g_return_val_if_fail (SW_IS_NUMBER_FIELD (self), FALSE);

  if (self->committing)
    return FALSE;
  text = gtk_editable_get_text (GTK_EDITABLE (self->entry));
  if (!dirty (self) && self->error == NULL)
    return TRUE;
  {
    g_autofree char *stripped = g_strstrip (g_strdup (text));
    if (stripped[0] == '\0')
      {
        g_autofree char *range = range_text (self);
        g_autofree char *msg = NULL;
        if (self->optional)
          return commit_value (self, NAN);
        msg = g_strdup_printf (_("A value is needed. Accepted: %s"), range);
        show_error (self, msg);
        return FALSE;
      }
  }
  if (!sw_number_parse (text, locale_mark (), locale_grouping (), &value))
    {
      g_autofree char *range = range_text (self);
      g_autofree char *example = format_value (self->whole ? 12.0 : 0.95, self->whole ? 0 : 2);
      g_autofree char *msg = g_strdup_printf (_("“%s” is not a number; write it like %s. "
                                                "Accepted: %s"), text, example, range);
      show_error (self, msg);
      return FALSE;
    }
  return commit_value (self, value);
}

gboolean
sw_number_field_commit_value (SwNumberField *self, double value)
{
  g_autofree char *text = NULL;

  g_return_val_if_fail (SW_IS_NUMBER_FIELD (self), FALSE);
  /* All the digits it takes to read back exactly. */
  {
    char buf[G_ASCII_DTOSTR_BUF_SIZE];
    GString *t = g_string_new (NULL);

    g_ascii_dtostr (buf, sizeof buf, value);
    for (const char *p = buf; *p != '\0'; p++)
      {
        if (*p == '.')
          g_string_append (t, locale_mark ());
        else
          g_string_append_c (t, *p);
      }
    text = g_string_free (t, FALSE);
  }
  return sw_number_field_enter (self, text);
}

gboolean
sw_number_field_enter (SwNumberField *self, const char *text)
{
  g_return_val_if_fail (SW_IS_NUMBER_FIELD (self), FALSE);
  gtk_editable_set_text (GTK_EDITABLE (self->entry), text);
  return sw_number_field_commit (self);
}

/* One step up or down from the value shown (the text if it is a valid
 * number), kept in the range: one commit. */
static void
step_by (SwNumberField *self, double steps)
{
  double base = self->value, v;

  if (!sw_number_parse (gtk_editable_get_text (GTK_EDITABLE (self->entry)), locale_mark (),
                        locale_grouping (), &base) && isnan (base))
    base = self->min_exclusive ? self->min + self->step : self->min;
  if (isnan (base))
    base = self->min;
  v = round ((base + steps * self->step) / self->step) * self->step;
  if (self->min_exclusive && !(v > self->min))
    v = self->min + self->step;
  v = CLAMP (v, self->min, self->max);
  v = round (v * pow (10.0, self->digits)) / pow (10.0, self->digits);
  if (self->whole)
    v = round (v);
  commit_value (self, v);
}

static gboolean
has_focus_within (SwNumberField *self)
{
  GtkRoot *root = gtk_widget_get_root (GTK_WIDGET (self));
  GtkWidget *focus = root != NULL ? gtk_root_get_focus (root) : NULL;

  return focus != NULL && (focus == GTK_WIDGET (self) || gtk_widget_is_ancestor (focus, GTK_WIDGET (self)));
}

static gboolean
scroll_cb (GtkEventControllerScroll *controller, double dx, double dy, SwNumberField *self)
{
  /* Without focus the wheel belongs to the panel that scrolls. */
  if (!has_focus_within (self) || !gtk_widget_is_sensitive (GTK_WIDGET (self)) || dy == 0.0)
    return FALSE;
  step_by (self, dy < 0.0 ? 1.0 : -1.0);
  return TRUE;
}

static gboolean
key_cb (GtkEventControllerKey *controller, guint keyval, guint keycode, GdkModifierType state,
        SwNumberField *self)
{
  GdkModifierType mods = state & gtk_accelerator_get_default_mod_mask ();

  if (mods == 0 && (keyval == GDK_KEY_Up || keyval == GDK_KEY_KP_Up))
    {
      step_by (self, 1.0);
      return TRUE;
    }
  if (mods == 0 && (keyval == GDK_KEY_Down || keyval == GDK_KEY_KP_Down))
    {
      step_by (self, -1.0);
      return TRUE;
    }
  if (mods == 0 && keyval == GDK_KEY_Escape && (dirty (self) || self->error != NULL))
    {
      sw_number_field_reset (self, self->value);
      return TRUE;
    }
  /* Undo: uncommitted text first, then the window's history (the text
   * widget would otherwise swallow the key with its own, disabled, undo). */
  if ((mods == GDK_CONTROL_MASK && (keyval == GDK_KEY_z || keyval == GDK_KEY_Z))
      || (mods == (GDK_CONTROL_MASK | GDK_SHIFT_MASK) && (keyval == GDK_KEY_z || keyval == GDK_KEY_Z))
      || (mods == GDK_CONTROL_MASK && keyval == GDK_KEY_y))
    {
      gboolean redo = keyval == GDK_KEY_y || (mods & GDK_SHIFT_MASK) != 0;

      if (dirty (self) || self->error != NULL)
        {
          sw_number_field_reset (self, self->value);
          return TRUE;
        }
      return gtk_widget_activate_action (GTK_WIDGET (self), redo ? "design.redo" : "design.undo",
                                         NULL);
    }
  return FALSE;
}

static void
activate_cb (SwNumberField *self)
{
  sw_number_field_commit (self);
}

static void
focus_leave_cb (GtkEventControllerFocus *controller, SwNumberField *self)
{
  if (gtk_widget_get_mapped (GTK_WIDGET (self)) && gtk_widget_get_root (GTK_WIDGET (self)) != NULL)
    sw_number_field_commit (self);
}

/* ---- public ------------------------------------------------------------ */

GtkWidget *
sw_number_field_new (void)
{
  return g_object_new (SW_TYPE_NUMBER_FIELD, NULL);
}

void
sw_number_field_set_range (SwNumberField *self, double min, double max, gboolean min_exclusive,
                           const char *unit, guint digits, double step)
{
  g_return_if_fail (SW_IS_NUMBER_FIELD (self));
  self->min = min;
  self->max = max;
  self->min_exclusive = min_exclusive;
  self->digits = digits;
  self->step = step > 0.0 ? step : 1.0;
  g_free (self->unit);
  self->unit = g_strdup (unit != NULL ? unit : "");
}

void
sw_number_field_set_limit (SwNumberField *self, SwLimitId id, double scale, guint digits,
                           double step)
{
  const SwLimit *l = sw_limit_get (id);

  g_return_if_fail (SW_IS_NUMBER_FIELD (self) && l != NULL);
  sw_number_field_set_range (self, l->min * scale, l->max * scale, l->min_exclusive,
                             scale == 100.0 && l->unit[0] == '\0' ? "%" : l->unit, digits, step);
  self->limit = id;
}

void
sw_number_field_get_range (SwNumberField *self, double *min, double *max)
{
  g_return_if_fail (SW_IS_NUMBER_FIELD (self));
  if (min != NULL)
    *min = self->min;
  if (max != NULL)
    *max = self->max;
}

guint
sw_number_field_get_digits (SwNumberField *self)
{
  g_return_val_if_fail (SW_IS_NUMBER_FIELD (self), 0);
  return self->digits;
}

SwLimitId
sw_number_field_get_limit (SwNumberField *self)
{
  g_return_val_if_fail (SW_IS_NUMBER_FIELD (self), SW_N_LIMITS);
  return self->limit;
}

void
sw_number_field_set_whole (SwNumberField *self, gboolean whole)
{
  g_return_if_fail (SW_IS_NUMBER_FIELD (self));
  self->whole = whole;
}

void
sw_number_field_set_optional (SwNumberField *self, gboolean optional, const char *placeholder)
{
  g_return_if_fail (SW_IS_NUMBER_FIELD (self));
  self->optional = optional;
  if (g_strcmp0 (gtk_entry_get_placeholder_text (GTK_ENTRY (self->entry)), placeholder) != 0)
    gtk_entry_set_placeholder_text (GTK_ENTRY (self->entry), placeholder);
}

void
sw_number_field_set_value (SwNumberField *self, double value)
{
  g_return_if_fail (SW_IS_NUMBER_FIELD (self));
  if (!isfinite (value))
    value = NAN;
  /* The user's unfinished text or error stays while the value behind it
   * has not changed. */
  if (same_value (value, self->value) && (dirty (self) || self->error != NULL))
    return;
  sw_number_field_reset (self, value);
}

void
sw_number_field_reset (SwNumberField *self, double value)
{
  g_return_if_fail (SW_IS_NUMBER_FIELD (self));
  if (!isfinite (value))
    value = NAN;
  self->value = value;
  show_error (self, NULL);
  show_text (self, value);
}

double
sw_number_field_get_value (SwNumberField *self)
{
  g_return_val_if_fail (SW_IS_NUMBER_FIELD (self), NAN);
  return self->value;
}

void
sw_number_field_set_error (SwNumberField *self, const char *message)
{
  g_return_if_fail (SW_IS_NUMBER_FIELD (self));
  if (self->committing && message != NULL)
    self->error_in_emit = TRUE;
  show_error (self, message);
}

const char *
sw_number_field_get_error (SwNumberField *self)
{
  g_return_val_if_fail (SW_IS_NUMBER_FIELD (self), NULL);
  return self->error;
}

const char *
sw_number_field_get_text (SwNumberField *self)
{
  g_return_val_if_fail (SW_IS_NUMBER_FIELD (self), NULL);
  return gtk_editable_get_text (GTK_EDITABLE (self->entry));
}

GtkWidget *
sw_number_field_get_entry (SwNumberField *self)
{
  g_return_val_if_fail (SW_IS_NUMBER_FIELD (self), NULL);
  return self->entry;
}

/* ---- GObject ----------------------------------------------------------- */

static gboolean
sw_number_field_grab_focus (GtkWidget *widget)
{
  return gtk_widget_grab_focus (SW_NUMBER_FIELD (widget)->entry);
}

static gboolean
sw_number_field_mnemonic_activate (GtkWidget *widget, gboolean group_cycling)
{
  return gtk_widget_grab_focus (SW_NUMBER_FIELD (widget)->entry);
}

static void
sw_number_field_dispose (GObject *object)
{
  SwNumberField *self = SW_NUMBER_FIELD (object);
  GtkWidget *child;

  while ((child = gtk_widget_get_first_child (GTK_WIDGET (self))) != NULL)
    gtk_widget_unparent (child);
  self->entry = self->message = NULL;
  G_OBJECT_CLASS (sw_number_field_parent_class)->dispose (object);
}

static void
sw_number_field_finalize (GObject *object)
{
  SwNumberField *self = SW_NUMBER_FIELD (object);

  g_free (self->unit);
  g_free (self->shown_text);
  g_free (self->error);
  G_OBJECT_CLASS (sw_number_field_parent_class)->finalize (object);
}

static void
sw_number_field_class_init (SwNumberFieldClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = sw_number_field_dispose;
  object_class->finalize = sw_number_field_finalize;
  widget_class->grab_focus = sw_number_field_grab_focus;
  widget_class->mnemonic_activate = sw_number_field_mnemonic_activate;

  /* "value-committed": a new valid value was committed; read it with
   * sw_number_field_get_value().  A handler that cannot take it calls
   * sw_number_field_set_error(): the field then keeps the text and its
   * value. */
  signals[SIGNAL_VALUE_COMMITTED]
    = g_signal_new ("value-committed", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST, 0, NULL,
                    NULL, NULL, G_TYPE_NONE, 0);

  gtk_widget_class_set_layout_manager_type (widget_class, GTK_TYPE_BOX_LAYOUT);
  gtk_widget_class_set_css_name (widget_class, "sw-number-field");
  gtk_widget_class_set_accessible_role (widget_class, GTK_ACCESSIBLE_ROLE_GROUP);
}

static void
sw_number_field_init (SwNumberField *self)
{
  GtkEventController *controller;

  gtk_orientable_set_orientation (GTK_ORIENTABLE (gtk_widget_get_layout_manager (GTK_WIDGET (self))),
                                  GTK_ORIENTATION_VERTICAL);
  self->limit = SW_N_LIMITS;
  self->value = NAN;
  self->max = G_MAXDOUBLE;
  self->min = -G_MAXDOUBLE;
  self->step = 1.0;
  self->unit = g_strdup ("");
  self->shown_text = g_strdup ("");

  self->entry = gtk_entry_new ();
  gtk_editable_set_width_chars (GTK_EDITABLE (self->entry), 8);
  gtk_editable_set_max_width_chars (GTK_EDITABLE (self->entry), 10);
  gtk_editable_set_enable_undo (GTK_EDITABLE (self->entry), FALSE);
  gtk_entry_set_input_purpose (GTK_ENTRY (self->entry), GTK_INPUT_PURPOSE_NUMBER);
  gtk_widget_add_css_class (self->entry, "numeric");
  gtk_widget_set_hexpand (self->entry, TRUE);
  gtk_widget_set_parent (self->entry, GTK_WIDGET (self));
  g_signal_connect_swapped (self->entry, "activate", G_CALLBACK (activate_cb), self);

  self->message = gtk_label_new (NULL);
  gtk_label_set_wrap (GTK_LABEL (self->message), TRUE);
  gtk_label_set_wrap_mode (GTK_LABEL (self->message), PANGO_WRAP_WORD_CHAR);
  gtk_label_set_width_chars (GTK_LABEL (self->message), 8);
  gtk_label_set_max_width_chars (GTK_LABEL (self->message), 24);
  gtk_label_set_xalign (GTK_LABEL (self->message), 0.0);
  gtk_widget_add_css_class (self->message, "error");
  gtk_widget_add_css_class (self->message, "sw-field-message");
  gtk_widget_set_visible (self->message, FALSE);
  gtk_widget_set_parent (self->message, GTK_WIDGET (self));
  gtk_accessible_update_relation (GTK_ACCESSIBLE (self->entry),
                                  GTK_ACCESSIBLE_RELATION_DESCRIBED_BY, self->message, NULL, -1);

  controller = gtk_event_controller_focus_new ();
  g_signal_connect (controller, "leave", G_CALLBACK (focus_leave_cb), self);
  gtk_widget_add_controller (self->entry, controller);

  controller = gtk_event_controller_key_new ();
  gtk_event_controller_set_propagation_phase (controller, GTK_PHASE_CAPTURE);
  g_signal_connect (controller, "key-pressed", G_CALLBACK (key_cb), self);
  gtk_widget_add_controller (GTK_WIDGET (self), controller);

  controller = gtk_event_controller_scroll_new (GTK_EVENT_CONTROLLER_SCROLL_VERTICAL
                                                | GTK_EVENT_CONTROLLER_SCROLL_DISCRETE);
  g_signal_connect (controller, "scroll", G_CALLBACK (scroll_cb), self);
  gtk_widget_add_controller (GTK_WIDGET (self), controller);
}

static gboolean
guard_scroll_cb (GtkEventControllerScroll *controller, double dx, double dy, gpointer data)
{
  GtkWidget *widget = gtk_event_controller_get_widget (GTK_EVENT_CONTROLLER (controller));
  GtkRoot *root = gtk_widget_get_root (widget);
  GtkWidget *focus = root != NULL ? gtk_root_get_focus (root) : NULL;

  /* TRUE: handled here, so the spin button never sees an unfocused wheel. */
  return focus == NULL || (focus != widget && !gtk_widget_is_ancestor (focus, widget));
}

/* GTK's spin button jumps to its maximum on Ctrl+Page Up and to its
 * minimum on Ctrl+Page Down: the window's keys for the previous and next
 * stage.  Swallowed here, as the window leaves them to a focused field. */
static gboolean
guard_key_cb (GtkEventControllerKey *controller, guint keyval, guint keycode,
              GdkModifierType state, gpointer data)
{
  GdkModifierType mods = state & gtk_accelerator_get_default_mod_mask ();

  return (mods & GDK_CONTROL_MASK) != 0
         && (keyval == GDK_KEY_Page_Up || keyval == GDK_KEY_Page_Down
             || keyval == GDK_KEY_KP_Page_Up || keyval == GDK_KEY_KP_Page_Down);
}

void
sw_number_field_guard_wheel (GtkWidget *widget)
{
  GtkEventController *controller;

  g_return_if_fail (GTK_IS_WIDGET (widget));
  controller = gtk_event_controller_scroll_new (GTK_EVENT_CONTROLLER_SCROLL_BOTH_AXES);
  gtk_event_controller_set_propagation_phase (controller, GTK_PHASE_CAPTURE);
  g_signal_connect (controller, "scroll", G_CALLBACK (guard_scroll_cb), NULL);
  gtk_widget_add_controller (widget, controller);
  controller = gtk_event_controller_key_new ();
  gtk_event_controller_set_propagation_phase (controller, GTK_PHASE_CAPTURE);
  g_signal_connect (controller, "key-pressed", G_CALLBACK (guard_key_cb), NULL);
  gtk_widget_add_controller (widget, controller);
}
