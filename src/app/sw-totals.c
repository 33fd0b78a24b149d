/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-totals"

#include "config.h"

#include "sw-totals.h"

#include "sw-format.h"

#include <glib/gi18n.h>

struct _SwTotals {
  GtkWidget  parent_instance;
  GtkWidget *box;
  SwResult  *result;
  GtkInscription *liftoff_label;
  GtkInscription *fraction_label;
  GtkInscription *margin_label;
  GtkInscription *required_label;
  GtkInscription *limit_label;
  GtkStack  *status_stack;
};

G_DEFINE_FINAL_TYPE (SwTotals, sw_totals, GTK_TYPE_WIDGET)

/* One page per state, each with its fixed icon and style. */
static void
set_status (SwTotals *self, const char *page, const char *text)
{
  GtkLabel *label = GTK_LABEL (gtk_widget_get_last_child (
    gtk_stack_get_child_by_name (self->status_stack, page)));

  if (g_strcmp0 (gtk_label_get_text (label), text) != 0)
    gtk_label_set_text (label, text);
  gtk_stack_set_visible_child_name (self->status_stack, page);
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
      gtk_inscription_set_text (self->liftoff_label, SW_NO_VALUE);
      gtk_inscription_set_text (self->fraction_label, SW_NO_VALUE);
      gtk_inscription_set_text (self->margin_label, SW_NO_VALUE);
      gtk_inscription_set_text (self->required_label, "");
      gtk_inscription_set_text (self->limit_label, "");
      set_status (self, "note", _("Sizing…"));
      return;
    }
  if (!r->ok)
    {
      gtk_inscription_set_text (self->liftoff_label, SW_NO_VALUE);
      gtk_inscription_set_text (self->fraction_label, SW_NO_VALUE);
      gtk_inscription_set_text (self->margin_label, SW_NO_VALUE);
      gtk_inscription_set_text (self->required_label, "");
      gtk_inscription_set_text (self->limit_label, "");
      status = g_strdup_printf (_("Cannot size this design. %s"), r->error_message);
      set_status (self, "bad", status);
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
  gtk_inscription_set_text (self->liftoff_label, liftoff);
  gtk_inscription_set_text (self->fraction_label, fraction);
  gtk_inscription_set_text (self->margin_label, margin);
  gtk_inscription_set_text (self->required_label, required);
  gtk_inscription_set_text (self->limit_label, limit);

  if (!s->feasible)
    {
      status = g_strdup_printf (_("Not feasible. %s"), s->reason);
      set_status (self, "bad", status);
    }
  else if (s->reason[0] != '\0')
    {
      status = g_strdup_printf (_("Feasible. %s"), s->reason);
      set_status (self, "note", status);
    }
  else
    /* A fixed text: a wrapping label that changes costs a relayout of the
     * column on every edit, and the margin is shown above anyway. */
    set_status (self, "ok", _("Feasible: every stage gives its share of the delta-v."));
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
    case SW_TOTALS_LIFTOFF: return gtk_inscription_get_text (self->liftoff_label);
    case SW_TOTALS_FRACTION: return gtk_inscription_get_text (self->fraction_label);
    case SW_TOTALS_MARGIN: return gtk_inscription_get_text (self->margin_label);
    case SW_TOTALS_REQUIRED: return gtk_inscription_get_text (self->required_label);
    case SW_TOTALS_LIMIT: return gtk_inscription_get_text (self->limit_label);
    case SW_TOTALS_STATUS:
      return gtk_label_get_text (GTK_LABEL (gtk_widget_get_last_child (
        gtk_stack_get_visible_child (self->status_stack))));
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
  gtk_widget_class_bind_template_child (widget_class, SwTotals, box);
  gtk_widget_class_bind_template_child (widget_class, SwTotals, liftoff_label);
  gtk_widget_class_bind_template_child (widget_class, SwTotals, fraction_label);
  gtk_widget_class_bind_template_child (widget_class, SwTotals, margin_label);
  gtk_widget_class_bind_template_child (widget_class, SwTotals, required_label);
  gtk_widget_class_bind_template_child (widget_class, SwTotals, limit_label);
  gtk_widget_class_bind_template_child (widget_class, SwTotals, status_stack);
}

static void
sw_totals_init (SwTotals *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
  update (self);
}
