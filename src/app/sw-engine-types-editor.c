/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-engine-types-editor"

#include "config.h"

#include "sw-engine-types-editor.h"
#include "sw-widget-text.h"

#include "sw-design-fields.h"
#include "sw-economics.h"
#include "sw-number-field.h"

#include <glib/gi18n.h>
#include <string.h>

#define MAX_TYPES SW_ECONOMICS_MAX_ENGINE_TYPES

struct _SwEngineTypesEditor {
  GtkWidget   parent_instance;
  GtkWidget  *box;
  GtkWidget  *grid;            /* rebuilt when the count of types or stages changes */
  GtkWidget  *add_button;
  GtkWidget  *message;
  SwDocument *document;
  gulong      changed_id;
  guint       updating;        /* widgets being filled from the design */
  guint       n_types;         /* what the grid was built for */
  guint       n_stages;
  GtkWidget  *names[MAX_TYPES];
  GtkWidget  *masses[MAX_TYPES];
  GtkWidget  *developed[MAX_TYPES];
  GtkWidget  *removes[MAX_TYPES];
  GtkWidget  *on_stage[MAX_TYPES][SW_MAX_STAGES];
  GtkWidget  *stage_developed[SW_MAX_STAGES];
  GtkWidget  *boosters_developed;  /* shown when the design has boosters */
};

G_DEFINE_FINAL_TYPE (SwEngineTypesEditor, sw_engine_types_editor, GTK_TYPE_WIDGET)

static const SwDesign *
design (SwEngineTypesEditor *self)
{
  return self->document != NULL ? sw_document_get_design (self->document) : NULL;
}

/* The part of a core message after "key.path: ", for a message beside the
 * widget that edits that key. */
static const char *
short_message (const char *message)
{
  const char *colon = strstr (message, ": ");

  if (colon != NULL && memchr (message, ' ', (gsize) (colon - message)) == NULL)
    return colon + 2;
  return message;
}

static void
show_message (SwEngineTypesEditor *self, const char *message)
{
  gtk_label_set_text (GTK_LABEL (self->message), message != NULL ? message : "");
  gtk_widget_set_visible (self->message, message != NULL);
}

/* Commits @d (taken) as one undo step, unless it equals the design. */
static void
commit (SwEngineTypesEditor *self, SwDesign *d)
{
  show_message (self, NULL);
  if (sw_design_equal (d, design (self)))
    {
      sw_design_free (d);
      return;
    }
  sw_document_commit (self->document, d, NULL);
}

static guint
index_of (GtkWidget *w, const char *key)
{
  return GPOINTER_TO_UINT (g_object_get_data (G_OBJECT (w), key));
}

static gboolean
editing_ok (SwEngineTypesEditor *self)
{
  return self->updating == 0 && self->document != NULL;
}

static void
name_commit (SwEngineTypesEditor *self, GtkWidget *entry)
{
  g_autoptr (GError) error = NULL;
  guint i = index_of (entry, "sw-type");
  const char *text = gtk_editable_get_text (GTK_EDITABLE (entry));
  SwDesign *d;

  if (!editing_ok (self) || i >= design (self)->economics.n_engine_types)
    return;
  if (g_strcmp0 (text, design (self)->economics.engine_types[i].name) == 0)
    {
      gtk_widget_remove_css_class (entry, "error");
      show_message (self, NULL);
      return;
    }
  d = sw_document_dup_design (self->document);
  if (!sw_design_rename_engine_type (d, i, text, &error))
    {
      sw_design_free (d);
      gtk_widget_add_css_class (entry, "error");
      show_message (self, short_message (error->message));
      return;
    }
  gtk_widget_remove_css_class (entry, "error");
  commit (self, d);
}

static void
name_activate_cb (GtkEntry *entry, SwEngineTypesEditor *self)
{
  name_commit (self, GTK_WIDGET (entry));
}

static void
name_leave_cb (GtkEventControllerFocus *controller, SwEngineTypesEditor *self)
{
  GtkWidget *entry = gtk_event_controller_get_widget (GTK_EVENT_CONTROLLER (controller));

  if (gtk_widget_get_mapped (entry))
    name_commit (self, entry);
}

/* Ctrl+Z in a name: back to the name in the design if it was being edited,
 * else the window's undo (the entry's own undo is off). */
static gboolean
name_key_cb (GtkEventControllerKey *controller, guint keyval, guint keycode,
             GdkModifierType state, SwEngineTypesEditor *self)
{
  GtkWidget *entry = gtk_event_controller_get_widget (GTK_EVENT_CONTROLLER (controller));
  GdkModifierType mods = state & gtk_accelerator_get_default_mod_mask ();
  guint i = index_of (entry, "sw-type");

  if (mods == GDK_CONTROL_MASK && (keyval == GDK_KEY_z || keyval == GDK_KEY_Z))
    {
      const SwDesign *d = design (self);
      if (d != NULL && i < d->economics.n_engine_types
          && g_strcmp0 (gtk_editable_get_text (GTK_EDITABLE (entry)),
                        d->economics.engine_types[i].name) != 0)
        {
          gtk_editable_set_text (GTK_EDITABLE (entry), d->economics.engine_types[i].name);
          gtk_widget_remove_css_class (entry, "error");
          show_message (self, NULL);
          return TRUE;
        }
      return gtk_widget_activate_action (entry, "design.undo", NULL);
    }
  if ((mods == (GDK_CONTROL_MASK | GDK_SHIFT_MASK) && (keyval == GDK_KEY_z || keyval == GDK_KEY_Z))
      || (mods == GDK_CONTROL_MASK && keyval == GDK_KEY_y))
    return gtk_widget_activate_action (entry, "design.redo", NULL);
  return FALSE;
}

static void
mass_committed_cb (SwNumberField *field, SwEngineTypesEditor *self)
{
  g_autoptr (GError) error = NULL;
  guint i = index_of (GTK_WIDGET (field), "sw-type");
  SwDesign *d;

  if (!editing_ok (self))
    return;
  d = sw_document_dup_design (self->document);
  if (!sw_design_set_engine_type_dry_mass (d, i, sw_number_field_get_value (field), &error))
    {
      sw_design_free (d);
      sw_number_field_set_error (field, short_message (error->message));
      return;
    }
  commit (self, d);
}

/* A check's edit: @done commits @d; a refusal frees it and puts the check
 * back to what the design says, with the core's message. */
static void
finish_toggle (SwEngineTypesEditor *self, GtkCheckButton *check, SwDesign *d, gboolean done,
               const GError *error)
{
  if (done)
    {
      commit (self, d);
      return;
    }
  sw_design_free (d);
  self->updating++;
  gtk_check_button_set_active (check, !gtk_check_button_get_active (check));
  self->updating--;
  show_message (self, short_message (error->message));
}

static void
on_stage_toggled_cb (GtkCheckButton *check, SwEngineTypesEditor *self)
{
  g_autoptr (GError) error = NULL;
  SwDesign *d;
  gboolean done;

  if (!editing_ok (self))
    return;
  d = sw_document_dup_design (self->document);
  done = sw_design_set_engine_type_on_stage (d, index_of (GTK_WIDGET (check), "sw-type"),
                                             index_of (GTK_WIDGET (check), "sw-stage"),
                                             gtk_check_button_get_active (check), &error);
  finish_toggle (self, check, d, done, error);
}

static void
type_developed_toggled_cb (GtkCheckButton *check, SwEngineTypesEditor *self)
{
  g_autoptr (GError) error = NULL;
  SwDesign *d;
  gboolean done;

  if (!editing_ok (self))
    return;
  d = sw_document_dup_design (self->document);
  done = sw_design_set_engine_type_developed (d, index_of (GTK_WIDGET (check), "sw-type"),
                                              gtk_check_button_get_active (check), &error);
  finish_toggle (self, check, d, done, error);
}

static void
stage_developed_toggled_cb (GtkCheckButton *check, SwEngineTypesEditor *self)
{
  g_autoptr (GError) error = NULL;
  SwDesign *d;
  gboolean done;

  if (!editing_ok (self))
    return;
  d = sw_document_dup_design (self->document);
  done = sw_design_set_stage_developed (d, index_of (GTK_WIDGET (check), "sw-stage"),
                                        gtk_check_button_get_active (check), &error);
  finish_toggle (self, check, d, done, error);
}

static void
boosters_developed_toggled_cb (GtkCheckButton *check, SwEngineTypesEditor *self)
{
  g_autoptr (GError) error = NULL;
  SwDesign *d;
  gboolean done;

  if (!editing_ok (self))
    return;
  d = sw_document_dup_design (self->document);
  done = sw_design_set_boosters_developed (d, gtk_check_button_get_active (check), &error);
  finish_toggle (self, check, d, done, error);
}

static void
remove_clicked_cb (GtkButton *button, SwEngineTypesEditor *self)
{
  g_autoptr (GError) error = NULL;
  SwDesign *d;

  if (!editing_ok (self))
    return;
  d = sw_document_dup_design (self->document);
  if (!sw_design_remove_engine_type (d, index_of (GTK_WIDGET (button), "sw-type"), &error))
    {
      sw_design_free (d);
      show_message (self, short_message (error->message));
      return;
    }
  commit (self, d);
}

static void
add_clicked_cb (GtkButton *button, SwEngineTypesEditor *self)
{
  g_autoptr (GError) error = NULL;
  SwDesign *d;

  if (!editing_ok (self))
    return;
  d = sw_document_dup_design (self->document);
  if (!sw_design_add_engine_type (d, &error))
    {
      sw_design_free (d);
      show_message (self, short_message (error->message));
      return;
    }
  commit (self, d);
}

static GtkWidget *
stage_check (const SwDesign *d, guint stage)
{
  g_autofree char *number = g_strdup_printf ("%u", stage + 1);
  GtkWidget *check = gtk_check_button_new_with_label (number);

  /* Translators: tooltip of a stage's check box; %u is the stage's number, %s its name */
  g_autofree char *tip = g_strdup_printf (_("Stage %u, %s"), stage + 1, d->stages[stage].name);
  sw_widget_set_tooltip (check, tip);
  g_object_set_data (G_OBJECT (check), "sw-stage", GUINT_TO_POINTER (stage));
  return check;
}

static GtkWidget *
header (const char *text)
{
  GtkWidget *label = gtk_label_new (text);

  gtk_label_set_xalign (GTK_LABEL (label), 0.0);
  gtk_label_set_wrap (GTK_LABEL (label), TRUE);
  gtk_widget_add_css_class (label, "dim-label");
  return label;
}

/* Check boxes of the stages in a box that wraps to as many lines as it
 * needs. */
static GtkWidget *
stage_flow (void)
{
  GtkWidget *flow = gtk_flow_box_new ();

  gtk_flow_box_set_selection_mode (GTK_FLOW_BOX (flow), GTK_SELECTION_NONE);
  gtk_flow_box_set_max_children_per_line (GTK_FLOW_BOX (flow), SW_MAX_STAGES);
  gtk_flow_box_set_homogeneous (GTK_FLOW_BOX (flow), TRUE);
  gtk_flow_box_set_activate_on_single_click (GTK_FLOW_BOX (flow), FALSE);
  gtk_widget_set_hexpand (flow, TRUE);
  return flow;
}

/* @text in front of @child; the text wraps. */
static GtkWidget *
labelled (const char *text, GtkWidget *child)
{
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 8);
  GtkWidget *label = header (text);

  gtk_label_set_max_width_chars (GTK_LABEL (label), 18);
  gtk_box_append (GTK_BOX (box), label);
  gtk_box_append (GTK_BOX (box), child);
  return box;
}

static void
build_grid (SwEngineTypesEditor *self, const SwDesign *d)
{
  const SwEconomics *e = &d->economics;
  GtkWidget *grid = gtk_grid_new ();
  GtkWidget *row_box;
  int row = 0;

  if (self->grid != NULL)
    gtk_box_remove (GTK_BOX (self->box), self->grid);
  memset (self->names, 0, sizeof self->names);
  memset (self->masses, 0, sizeof self->masses);
  memset (self->developed, 0, sizeof self->developed);
  memset (self->removes, 0, sizeof self->removes);
  memset (self->on_stage, 0, sizeof self->on_stage);
  memset (self->stage_developed, 0, sizeof self->stage_developed);
  self->n_types = e->n_engine_types;
  self->n_stages = d->n_stages;

  gtk_grid_set_column_spacing (GTK_GRID (grid), 8);
  gtk_grid_set_row_spacing (GTK_GRID (grid), 4);
  if (e->n_engine_types > 0)
    {
      gtk_grid_attach (GTK_GRID (grid), header (_("Engine type")), 0, row, 1, 1);
      gtk_grid_attach (GTK_GRID (grid), header (_("Dry mass of one engine")), 1, row, 1, 1);
      row++;
    }
  /* Two rows a type: its name, mass, developed and remove, then the stages
   * that use it, in a box that wraps: eight stages must not widen the
   * window. */
  for (guint i = 0; i < e->n_engine_types && i < MAX_TYPES; i++, row += 2)
    {
      GtkWidget *entry = gtk_entry_new ();
      GtkWidget *mass = sw_number_field_new ();
      GtkWidget *stages = stage_flow ();
      GtkWidget *dev = gtk_check_button_new_with_label (_("Developed"));
      GtkWidget *remove = gtk_button_new_from_icon_name ("list-remove-symbolic");
      GtkEventController *controller;

      g_object_set_data (G_OBJECT (entry), "sw-type", GUINT_TO_POINTER (i));
      gtk_editable_set_enable_undo (GTK_EDITABLE (entry), FALSE);
      gtk_editable_set_width_chars (GTK_EDITABLE (entry), 10);
      gtk_widget_set_hexpand (entry, TRUE);
      sw_widget_set_tooltip (entry, _("The engine type's name: one engine design, "
                                            "developed once however many stages use it"));
      g_signal_connect (entry, "activate", G_CALLBACK (name_activate_cb), self);
      controller = gtk_event_controller_focus_new ();
      g_signal_connect (controller, "leave", G_CALLBACK (name_leave_cb), self);
      gtk_widget_add_controller (entry, controller);
      controller = gtk_event_controller_key_new ();
      gtk_event_controller_set_propagation_phase (controller, GTK_PHASE_CAPTURE);
      g_signal_connect (controller, "key-pressed", G_CALLBACK (name_key_cb), self);
      gtk_widget_add_controller (entry, controller);
      gtk_grid_attach (GTK_GRID (grid), entry, 0, row, 1, 1);
      self->names[i] = entry;

      g_object_set_data (G_OBJECT (mass), "sw-type", GUINT_TO_POINTER (i));
      sw_number_field_set_limit (SW_NUMBER_FIELD (mass), SW_LIMIT_ENGINE_DRY_MASS, 1.0, 1, 10.0);
      g_signal_connect (mass, "value-committed", G_CALLBACK (mass_committed_cb), self);
      gtk_widget_set_hexpand (mass, TRUE);
      gtk_grid_attach (GTK_GRID (grid), mass, 1, row, 1, 1);
      self->masses[i] = mass;

      g_object_set_data (G_OBJECT (dev), "sw-type", GUINT_TO_POINTER (i));
      sw_widget_set_tooltip (dev, _("Already developed: the cost model counts no "
                                          "development effort for it"));
      g_signal_connect (dev, "toggled", G_CALLBACK (type_developed_toggled_cb), self);
      gtk_grid_attach (GTK_GRID (grid), dev, 2, row, 1, 1);
      self->developed[i] = dev;

      g_object_set_data (G_OBJECT (remove), "sw-type", GUINT_TO_POINTER (i));
      sw_widget_set_tooltip (remove, _("Remove this engine type"));
      gtk_accessible_update_property (GTK_ACCESSIBLE (remove), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                      _("Remove this engine type"), -1);
      g_signal_connect (remove, "clicked", G_CALLBACK (remove_clicked_cb), self);
      gtk_grid_attach (GTK_GRID (grid), remove, 3, row, 1, 1);
      self->removes[i] = remove;

      for (guint st = 0; st < d->n_stages; st++)
        {
          GtkWidget *check = stage_check (d, st);
          g_object_set_data (G_OBJECT (check), "sw-type", GUINT_TO_POINTER (i));
          g_signal_connect (check, "toggled", G_CALLBACK (on_stage_toggled_cb), self);
          gtk_flow_box_append (GTK_FLOW_BOX (stages), check);
          self->on_stage[i][st] = check;
        }
      gtk_grid_attach (GTK_GRID (grid), labelled (_("On stages (1 lifts off)"), stages), 0,
                       row + 1, 4, 1);
    }

  row_box = stage_flow ();
  for (guint st = 0; st < d->n_stages; st++)
    {
      GtkWidget *check = stage_check (d, st);
      g_signal_connect (check, "toggled", G_CALLBACK (stage_developed_toggled_cb), self);
      gtk_flow_box_append (GTK_FLOW_BOX (row_box), check);
      self->stage_developed[st] = check;
    }
  gtk_grid_attach (GTK_GRID (grid),
                   labelled (_("Stages already developed (no development effort)"), row_box), 0,
                   row, 4, 1);

  self->grid = grid;
  gtk_box_insert_child_after (GTK_BOX (self->box), grid, gtk_widget_get_first_child (self->box));
}

/* The widgets show @d; a name being edited keeps its text unless the name
 * in the design changed. */
static void
show_design (SwEngineTypesEditor *self, const SwDesign *d)
{
  const SwEconomics *e = &d->economics;

  self->updating++;
  if (self->grid == NULL || self->n_types != e->n_engine_types || self->n_stages != d->n_stages)
    build_grid (self, d);
  for (guint i = 0; i < e->n_engine_types && i < MAX_TYPES; i++)
    {
      const SwEngineType *t = &e->engine_types[i];
      const char *last = g_object_get_data (G_OBJECT (self->names[i]), "sw-shown");

      if (g_strcmp0 (last, t->name) != 0 || !gtk_widget_has_focus (self->names[i]))
        {
          if (g_strcmp0 (gtk_editable_get_text (GTK_EDITABLE (self->names[i])), t->name) != 0)
            gtk_editable_set_text (GTK_EDITABLE (self->names[i]), t->name);
          gtk_widget_remove_css_class (self->names[i], "error");
        }
      g_object_set_data_full (G_OBJECT (self->names[i]), "sw-shown", g_strdup (t->name), g_free);
      sw_number_field_set_value (SW_NUMBER_FIELD (self->masses[i]), t->dry_mass_kg);
      gtk_check_button_set_active (GTK_CHECK_BUTTON (self->developed[i]), t->developed);
      for (guint s = 0; s < d->n_stages; s++)
        gtk_check_button_set_active (GTK_CHECK_BUTTON (self->on_stage[i][s]),
                                     (t->stage_mask & (1u << s)) != 0);
    }
  for (guint s = 0; s < d->n_stages; s++)
    {
      g_autofree char *tip = g_strdup_printf (_("Stage %u, %s"), s + 1, d->stages[s].name);
      gtk_check_button_set_active (GTK_CHECK_BUTTON (self->stage_developed[s]),
                                   (e->developed_stages & (1u << s)) != 0);
      sw_widget_set_tooltip (self->stage_developed[s], tip);
      for (guint i = 0; i < e->n_engine_types && i < MAX_TYPES; i++)
        sw_widget_set_tooltip (self->on_stage[i][s], tip);
    }
  gtk_widget_set_visible (self->boosters_developed, d->boosters.count > 0);
  gtk_check_button_set_active (GTK_CHECK_BUTTON (self->boosters_developed),
                               e->developed_boosters);
  gtk_widget_set_sensitive (self->add_button, e->n_engine_types < MAX_TYPES);
  self->updating--;
}

static void
document_changed_cb (SwDocument *document, SwEngineTypesEditor *self)
{
  show_design (self, sw_document_get_design (document));
}

void
sw_engine_types_editor_set_document (SwEngineTypesEditor *self, SwDocument *document)
{
  g_return_if_fail (SW_IS_ENGINE_TYPES_EDITOR (self));

  if (self->document != NULL)
    g_clear_signal_handler (&self->changed_id, self->document);
  g_set_object (&self->document, document);
  if (document != NULL)
    {
      self->changed_id = g_signal_connect (document, "changed", G_CALLBACK (document_changed_cb),
                                           self);
      show_design (self, sw_document_get_design (document));
    }
}

GtkWidget *
sw_engine_types_editor_get_widget (SwEngineTypesEditor *self, guint index,
                                   SwEngineTypeWidget which)
{
  g_return_val_if_fail (SW_IS_ENGINE_TYPES_EDITOR (self), NULL);
  if (index >= self->n_types || index >= MAX_TYPES)
    return NULL;
  switch (which)
    {
    case SW_ENGINE_TYPE_NAME:
      return self->names[index];
    case SW_ENGINE_TYPE_DRY_MASS:
      return self->masses[index];
    case SW_ENGINE_TYPE_DEVELOPED:
      return self->developed[index];
    case SW_ENGINE_TYPE_REMOVE:
      return self->removes[index];
    default:
      return NULL;
    }
}

GtkWidget *
sw_engine_types_editor_get_stage_check (SwEngineTypesEditor *self, guint index, guint stage)
{
  g_return_val_if_fail (SW_IS_ENGINE_TYPES_EDITOR (self), NULL);
  if (index >= self->n_types || index >= MAX_TYPES || stage >= self->n_stages)
    return NULL;
  return self->on_stage[index][stage];
}

GtkWidget *
sw_engine_types_editor_get_developed_stage (SwEngineTypesEditor *self, guint stage)
{
  g_return_val_if_fail (SW_IS_ENGINE_TYPES_EDITOR (self), NULL);
  return stage < self->n_stages ? self->stage_developed[stage] : NULL;
}

GtkWidget *
sw_engine_types_editor_get_boosters_developed (SwEngineTypesEditor *self)
{
  g_return_val_if_fail (SW_IS_ENGINE_TYPES_EDITOR (self), NULL);
  return self->boosters_developed;
}

GtkWidget *
sw_engine_types_editor_get_add_button (SwEngineTypesEditor *self)
{
  g_return_val_if_fail (SW_IS_ENGINE_TYPES_EDITOR (self), NULL);
  return self->add_button;
}

GtkWidget *
sw_engine_types_editor_get_message (SwEngineTypesEditor *self)
{
  g_return_val_if_fail (SW_IS_ENGINE_TYPES_EDITOR (self), NULL);
  return self->message;
}

static void
sw_engine_types_editor_dispose (GObject *object)
{
  SwEngineTypesEditor *self = SW_ENGINE_TYPES_EDITOR (object);

  if (self->document != NULL)
    g_clear_signal_handler (&self->changed_id, self->document);
  g_clear_object (&self->document);
  g_clear_pointer (&self->box, gtk_widget_unparent);
  G_OBJECT_CLASS (sw_engine_types_editor_parent_class)->dispose (object);
}

static void
sw_engine_types_editor_class_init (SwEngineTypesEditorClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = sw_engine_types_editor_dispose;
  gtk_widget_class_set_layout_manager_type (widget_class, GTK_TYPE_BIN_LAYOUT);
  gtk_widget_class_set_css_name (widget_class, "sw-engine-types");
}

static void
sw_engine_types_editor_init (SwEngineTypesEditor *self)
{
  GtkWidget *title;

  self->box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 4);
  gtk_widget_set_parent (self->box, GTK_WIDGET (self));
  title = gtk_label_new (_("Engine types: stages that share an engine pay for its development "
                           "once"));
  gtk_label_set_wrap (GTK_LABEL (title), TRUE);
  gtk_label_set_xalign (GTK_LABEL (title), 0.0);
  gtk_box_append (GTK_BOX (self->box), title);
  self->add_button = gtk_button_new_with_mnemonic (_("Add _engine type"));
  gtk_widget_set_halign (self->add_button, GTK_ALIGN_START);
  g_signal_connect (self->add_button, "clicked", G_CALLBACK (add_clicked_cb), self);
  gtk_box_append (GTK_BOX (self->box), self->add_button);
  self->boosters_developed = gtk_check_button_new_with_label (
    _("Boosters and their engine already developed (no development effort)"));
  gtk_widget_set_visible (self->boosters_developed, FALSE);
  g_signal_connect (self->boosters_developed, "toggled",
                    G_CALLBACK (boosters_developed_toggled_cb), self);
  gtk_box_append (GTK_BOX (self->box), self->boosters_developed);
  self->message = gtk_label_new (NULL);
  gtk_label_set_wrap (GTK_LABEL (self->message), TRUE);
  gtk_label_set_xalign (GTK_LABEL (self->message), 0.0);
  gtk_widget_add_css_class (self->message, "error");
  gtk_widget_set_visible (self->message, FALSE);
  gtk_box_append (GTK_BOX (self->box), self->message);
}

GtkWidget *
sw_engine_types_editor_new (void)
{
  return g_object_new (SW_TYPE_ENGINE_TYPES_EDITOR, NULL);
}
