/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-totals"

#include "config.h"

#include "sw-totals.h"

#include "sw-format.h"

#include <glib/gi18n.h>

struct _SwTotals {
  GtkWidget  parent_instance;
  SwResult  *result;
  GtkLabel  *liftoff_label;
  GtkLabel  *fraction_label;
  GtkLabel  *margin_label;
  GtkLabel  *required_label;
  GtkLabel  *limit_label;
  GtkWidget *status_box;
  GtkImage  *status_icon;
  GtkLabel  *status_label;
};

G_DEFINE_FINAL_TYPE (SwTotals, sw_totals, GTK_TYPE_WIDGET)

static void
set_status (SwTotals *self, const char *icon, const char *css, const char *text)
{
  gtk_image_set_from_icon_name (self->status_icon, icon);
  gtk_widget_remove_css_class (self->status_box, "sw-status-ok");
  gtk_widget_remove_css_class (self->status_box, "sw-status-note");
  gtk_widget_remove_css_class (self->status_box, "sw-status-bad");
  gtk_widget_add_css_class (self->status_box, css);
  gtk_label_set_text (self->status_label, text);
}

static void
update (SwTotals *self)
{
  SwResult *r = self->result;
  const SwSizing *s;
  g_autofree char *liftoff = NULL, *fraction = NULL, *margin = NULL;
  g_autofree char *required = NULL, *limit = NULL, *dv = NULL, *lim = NULL, *status = NULL;

  if (r == NULL)
    {
      gtk_label_set_text (self->liftoff_label, SW_NO_VALUE);
      gtk_label_set_text (self->fraction_label, SW_NO_VALUE);
      gtk_label_set_text (self->margin_label, SW_NO_VALUE);
      gtk_label_set_text (self->required_label, "");
      gtk_label_set_text (self->limit_label, "");
      set_status (self, "content-loading-symbolic", "sw-status-note", _("Sizing…"));
      return;
    }
  if (!r->ok)
    {
      gtk_label_set_text (self->liftoff_label, SW_NO_VALUE);
      gtk_label_set_text (self->fraction_label, SW_NO_VALUE);
      gtk_label_set_text (self->margin_label, SW_NO_VALUE);
      gtk_label_set_text (self->required_label, "");
      gtk_label_set_text (self->limit_label, "");
      status = g_strdup_printf (_("Cannot size this design. %s"), r->error_message);
      set_status (self, "dialog-error-symbolic", "sw-status-bad", status);
      return;
    }

  s = &r->sizing;
  liftoff = sw_format_mass (s->liftoff_mass_kg);
  fraction = sw_format_fraction (s->payload_fraction, 2);
  margin = sw_format_speed (s->margin_m_s);
  dv = sw_format_speed (s->delta_v_m_s);
  lim = sw_format_speed (s->delta_v_limit_m_s);
  /* Translators: %s is a speed such as "9,400 m/s" */
  required = g_strdup_printf (_("Required delta-v %s"), dv);
  /* Translators: %s is a speed such as "12,500 m/s" */
  limit = g_strdup_printf (_("Vehicle limit %s (no payload)"), lim);
  gtk_label_set_text (self->liftoff_label, liftoff);
  gtk_label_set_text (self->fraction_label, fraction);
  gtk_label_set_text (self->margin_label, margin);
  gtk_label_set_text (self->required_label, required);
  gtk_label_set_text (self->limit_label, limit);

  if (!s->feasible)
    {
      status = g_strdup_printf (_("Not feasible. %s"), s->reason);
      set_status (self, "dialog-error-symbolic", "sw-status-bad", status);
    }
  else if (s->reason[0] != '\0')
    {
      status = g_strdup_printf (_("Feasible. %s"), s->reason);
      set_status (self, "dialog-information-symbolic", "sw-status-note", status);
    }
  else
    {
      g_autofree char *spare = sw_format_speed (s->margin_m_s);
      /* Translators: %s is a speed such as "1,200 m/s" */
      status = g_strdup_printf (_("Feasible: the stages could give %s more than required."),
                                spare);
      set_status (self, "object-select-symbolic", "sw-status-ok", status);
    }
}

GtkWidget *
sw_totals_new (void)
{
  return g_object_new (SW_TYPE_TOTALS, NULL);
}

void
sw_totals_set_result (SwTotals *self, SwResult *result)
{
  g_return_if_fail (SW_IS_TOTALS (self));

  if (self->result == result)
    return;
  g_clear_pointer (&self->result, sw_result_unref);
  self->result = result != NULL ? sw_result_ref (result) : NULL;
  update (self);
}

const char *
sw_totals_get_text (SwTotals *self, SwTotalsField field)
{
  g_return_val_if_fail (SW_IS_TOTALS (self), NULL);

  switch (field)
    {
    case SW_TOTALS_LIFTOFF: return gtk_label_get_text (self->liftoff_label);
    case SW_TOTALS_FRACTION: return gtk_label_get_text (self->fraction_label);
    case SW_TOTALS_MARGIN: return gtk_label_get_text (self->margin_label);
    case SW_TOTALS_REQUIRED: return gtk_label_get_text (self->required_label);
    case SW_TOTALS_LIMIT: return gtk_label_get_text (self->limit_label);
    case SW_TOTALS_STATUS: return gtk_label_get_text (self->status_label);
    default: return NULL;
    }
}

static void
sw_totals_dispose (GObject *object)
{
  SwTotals *self = SW_TOTALS (object);

  g_clear_pointer (&self->result, sw_result_unref);
  gtk_widget_dispose_template (GTK_WIDGET (self), SW_TYPE_TOTALS);
  G_OBJECT_CLASS (sw_totals_parent_class)->dispose (object);
}

static void
sw_totals_class_init (SwTotalsClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = sw_totals_dispose;

  gtk_widget_class_set_template_from_resource (widget_class,
                                               "/org/stagewright/Stagewright/sw-totals.ui");
  gtk_widget_class_set_layout_manager_type (widget_class, GTK_TYPE_BIN_LAYOUT);
  gtk_widget_class_set_css_name (widget_class, "sw-totals");
  gtk_widget_class_bind_template_child (widget_class, SwTotals, liftoff_label);
  gtk_widget_class_bind_template_child (widget_class, SwTotals, fraction_label);
  gtk_widget_class_bind_template_child (widget_class, SwTotals, margin_label);
  gtk_widget_class_bind_template_child (widget_class, SwTotals, required_label);
  gtk_widget_class_bind_template_child (widget_class, SwTotals, limit_label);
  gtk_widget_class_bind_template_child (widget_class, SwTotals, status_box);
  gtk_widget_class_bind_template_child (widget_class, SwTotals, status_icon);
  gtk_widget_class_bind_template_child (widget_class, SwTotals, status_label);
}

static void
sw_totals_init (SwTotals *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
  update (self);
}
