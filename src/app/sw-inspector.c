/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-inspector"

#include "config.h"

#include "sw-inspector.h"

#include "sw-design-edit.h"
#include "sw-format.h"
#include "sw-limits.h"
#include "sw-sizing.h"

#include <glib/gi18n.h>
#include <math.h>
#include <string.h>

struct _SwInspector {
  GtkWidget      parent_instance;

  SwDocument    *document;
  SwAnalysis      *result;
  GSettings     *settings;
  int            selected;
  guint          updating;
  SwEpsForm      eps_form;
  guint          listed_stages;          /* rows in the stage list */

  GtkWidget     *scroller;
  GtkEntry      *name_entry;
  GtkSpinButton *payload_spin;
  GtkLabel      *payload_unit;
  GtkDropDown   *mission_dropdown;
  GtkWidget     *delta_v_label;
  GtkSpinButton *delta_v_spin;
  GtkLabel      *delta_v_unit;
  GtkWidget     *altitude_label;
  GtkSpinButton *altitude_spin;
  GtkLabel      *altitude_unit;
  GtkWidget     *inclination_label;
  GtkSpinButton *inclination_spin;
  GtkLabel      *inclination_unit;
  GtkWidget     *latitude_label;
  GtkSpinButton *latitude_spin;
  GtkLabel      *latitude_unit;
  GtkWidget     *losses_label;
  GtkSpinButton *losses_spin;
  GtkLabel      *losses_unit;
  GtkWidget     *ideal_caption;
  GtkLabel      *ideal_label;
  GtkToggleButton *split_equal;
  GtkToggleButton *split_optimal;
  GtkToggleButton *split_manual;
  GtkListBox    *stage_list;
  GtkLabel      *stage_title;
  GtkWidget     *stage_grid;
  GtkEntry      *stage_name_entry;
  GtkSpinButton *isp_vac_spin;
  GtkLabel      *isp_vac_unit;
  GtkCheckButton *isp_sl_check;
  GtkSpinButton *isp_sl_spin;
  GtkLabel      *isp_sl_unit;
  GtkDropDown   *eps_form_dropdown;
  GtkLabel      *eps_label;
  GtkSpinButton *eps_spin;
  GtkLabel      *eps_unit;
  GtkSpinButton *share_spin;
  GtkScale      *share_scale;
  GtkAdjustment *share_adjustment;
};

G_DEFINE_FINAL_TYPE (SwInspector, sw_inspector, GTK_TYPE_WIDGET)

enum { PROP_0, PROP_SELECTED_STAGE, N_PROPS };
static GParamSpec *properties[N_PROPS];

/* ---- helpers ----------------------------------------------------------- */

/* Spin-button ranges come from the one limits table. */
static void
setup_spin (GtkSpinButton *spin, GtkLabel *unit, SwLimitId id, guint digits, double step,
            double page)
{
  const SwLimit *l = sw_limit_get (id);
  double lo = l->min_exclusive ? l->min + pow (10.0, -(double) digits) : l->min;

  gtk_spin_button_set_digits (spin, digits);
  gtk_spin_button_set_range (spin, lo, l->max);
  gtk_spin_button_set_increments (spin, step, page);
  gtk_spin_button_set_numeric (spin, FALSE);
  gtk_editable_set_enable_undo (GTK_EDITABLE (spin), FALSE);
  gtk_editable_set_width_chars (GTK_EDITABLE (spin), 9);
  if (unit != NULL)
    gtk_label_set_text (unit, l->unit);
}

/* TRUE when @spin shows a value other than @current at its precision: a
 * focus change re-reads the text and must not become an edit. */
static gboolean
spin_edited (GtkSpinButton *spin, double current, double *value)
{
  double scale = pow (10.0, gtk_spin_button_get_digits (spin));

  *value = gtk_spin_button_get_value (spin);
  return !isfinite (current) || round (*value * scale) != round (current * scale);
}

static void
set_spin (GtkSpinButton *spin, double value)
{
  if (isfinite (value))
    gtk_spin_button_set_value (spin, value);
}

static gboolean
editing_ok (SwInspector *self)
{
  return self->updating == 0 && self->document != NULL;
}

static const SwDesign *
design (SwInspector *self)
{
  return sw_document_get_design (self->document);
}

static gboolean
stage_ok (SwInspector *self)
{
  return editing_ok (self) && self->selected >= 0
         && (guint) self->selected < design (self)->n_stages;
}

static void
commit (SwInspector *self, SwDesign *edited, const char *merge_key)
{
  sw_document_commit (self->document, edited, merge_key);
}

/* The split on screen, for sw_design_take_manual_shares (); 0 without one. */
static guint
screen_shares (SwInspector *self, double *shares)
{
  return self->result != NULL && self->result->ok
         ? sw_sizing_get_shares (&self->result->sizing, shares) : 0;
}

static char *
stage_key (SwInspector *self, const char *field)
{
  return g_strdup_printf ("%s:%d", field, self->selected);
}

/* ---- the eps field ----------------------------------------------------- */

static const char *
eps_form_label (SwEpsForm form)
{
  switch (form)
    {
    case SW_EPS_STRUCTURE_RATIO:
      return "mₛ/mₚ";
    case SW_EPS_WET_DRY_RATIO:
      return "(mₛ + mₚ)/mₛ";
    case SW_EPS_PROPELLANT_FRACTION:
      return "mₚ/(mₛ + mₚ)";
    case SW_EPS_COEFFICIENT:
    default:
      return "ε = mₛ/(mₛ + mₚ)";
    }
}

static const char *
eps_form_tooltip (SwEpsForm form)
{
  switch (form)
    {
    case SW_EPS_STRUCTURE_RATIO:
      return _("Structure-to-propellant ratio: structural mass over propellant mass, ε/(1 − ε)");
    case SW_EPS_WET_DRY_RATIO:
      return _("Wet-to-dry mass ratio of the stage alone: (structure + propellant) over structure, 1/ε");
    case SW_EPS_PROPELLANT_FRACTION:
      return _("Propellant fraction of the stage alone: propellant over (structure + propellant), 1 − ε");
    case SW_EPS_COEFFICIENT:
    default:
      return _("Structural coefficient ε: structural mass over (structure + propellant) of the stage alone");
    }
}

static guint
eps_form_digits (SwEpsForm form)
{
  return form == SW_EPS_WET_DRY_RATIO ? 2 : 4;
}

static void
configure_eps_spin (SwInspector *self)
{
  const SwLimit *l = sw_limit_get (SW_LIMIT_STRUCTURAL_COEFFICIENT);
  double lo, hi;
  guint digits = eps_form_digits (self->eps_form);

  sw_eps_form_range (self->eps_form, l->min, l->max, &lo, &hi);
  self->updating++;
  gtk_spin_button_set_digits (self->eps_spin, digits);
  gtk_spin_button_set_range (self->eps_spin, lo, hi);
  gtk_spin_button_set_increments (self->eps_spin, self->eps_form == SW_EPS_WET_DRY_RATIO ? 0.1 : 0.001,
                                  self->eps_form == SW_EPS_WET_DRY_RATIO ? 1.0 : 0.01);
  gtk_label_set_text (self->eps_label, eps_form_label (self->eps_form));
  gtk_widget_set_tooltip_text (GTK_WIDGET (self->eps_spin), eps_form_tooltip (self->eps_form));
  gtk_widget_set_tooltip_text (GTK_WIDGET (self->eps_label), eps_form_tooltip (self->eps_form));
  gtk_label_set_text (self->eps_unit, "");
  self->updating--;
}

/* ---- showing the design ------------------------------------------------ */

static double
shown_share (SwInspector *self, guint i)
{
  const SwDesign *d = design (self);

  if (d->split == SW_SPLIT_MANUAL)
    return d->stages[i].delta_v_share;
  if (self->result != NULL && self->result->ok && self->result->sizing.n_stages == d->n_stages
      && self->result->sizing.split == d->split)
    return self->result->sizing.stages[i].delta_v_share;
  return NAN;
}

static GtkWidget *
stage_row_new (guint index)
{
  GtkWidget *row = gtk_list_box_row_new ();
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 8);
  GtkWidget *number = gtk_label_new (NULL);
  GtkWidget *name = gtk_label_new (NULL);
  /* An inscription: its size does not follow its text, so a new mass
   * repaints the row without a relayout of the window. */
  GtkWidget *mass = gtk_inscription_new (NULL);
  g_autofree char *num = g_strdup_printf ("%u", index + 1);

  gtk_label_set_text (GTK_LABEL (number), num);
  gtk_widget_add_css_class (number, "sw-stage-number");
  gtk_label_set_xalign (GTK_LABEL (name), 0.0);
  gtk_label_set_ellipsize (GTK_LABEL (name), PANGO_ELLIPSIZE_END);
  gtk_widget_set_hexpand (name, TRUE);
  gtk_inscription_set_min_chars (GTK_INSCRIPTION (mass), 8);
  gtk_inscription_set_nat_chars (GTK_INSCRIPTION (mass), 9);
  gtk_inscription_set_xalign (GTK_INSCRIPTION (mass), 1.0);
  gtk_widget_add_css_class (mass, "numeric");
  gtk_widget_add_css_class (mass, "dim-label");
  gtk_box_append (GTK_BOX (box), number);
  gtk_box_append (GTK_BOX (box), name);
  gtk_box_append (GTK_BOX (box), mass);
  gtk_widget_set_margin_start (box, 8);
  gtk_widget_set_margin_end (box, 8);
  gtk_widget_set_margin_top (box, 4);
  gtk_widget_set_margin_bottom (box, 4);
  gtk_list_box_row_set_child (GTK_LIST_BOX_ROW (row), box);
  return row;
}

static void
update_stage_rows (SwInspector *self)
{
  const SwDesign *d = design (self);

  while (self->listed_stages < d->n_stages)
    gtk_list_box_append (self->stage_list, stage_row_new (self->listed_stages++));
  while (self->listed_stages > d->n_stages)
    gtk_list_box_remove (self->stage_list,
                         GTK_WIDGET (gtk_list_box_get_row_at_index (self->stage_list,
                                                                    --self->listed_stages)));

  for (guint i = 0; i < d->n_stages; i++)
    {
      GtkListBoxRow *row = gtk_list_box_get_row_at_index (self->stage_list, (int) i);
      GtkWidget *box = gtk_list_box_row_get_child (row);
      GtkWidget *name = gtk_widget_get_next_sibling (gtk_widget_get_first_child (box));
      GtkWidget *mass = gtk_widget_get_last_child (box);
      g_autofree char *mass_text = NULL;

      gtk_label_set_text (GTK_LABEL (name), d->stages[i].name);
      if (self->result != NULL && self->result->ok && i < self->result->sizing.n_stages
          && self->result->sizing.n_stages == d->n_stages)
        mass_text = sw_format_mass (self->result->sizing.stages[i].stage_mass_kg);
      gtk_inscription_set_text (GTK_INSCRIPTION (mass), mass_text != NULL ? mass_text : SW_NO_VALUE);
    }
  if (self->selected >= 0)
    gtk_list_box_select_row (self->stage_list,
                             gtk_list_box_get_row_at_index (self->stage_list, self->selected));
}

static void
update_computed (SwInspector *self)
{
  g_autofree char *ideal = NULL;
  SwAnalysis *r = self->result;

  if (r != NULL && r->has_budget)
    ideal = sw_format_speed (r->budget.ideal_delta_v_m_s);
  gtk_label_set_text (self->ideal_label, ideal != NULL ? ideal : SW_NO_VALUE);
}

static void
update_actions (SwInspector *self)
{
  const SwLimit *count = sw_limit_get (SW_LIMIT_STAGE_COUNT);
  guint n = self->document != NULL ? design (self)->n_stages : 0;
  gboolean sel = self->document != NULL && self->selected >= 0 && (guint) self->selected < n;

  gtk_widget_action_set_enabled (GTK_WIDGET (self), "stage.add",
                                 self->document != NULL && n < count->max);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "stage.duplicate", sel && n < count->max);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "stage.remove", sel && n > count->min);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "stage.move-up", sel && self->selected > 0);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "stage.move-down",
                                 sel && (guint) self->selected + 1 < n);
}

static void
update_stage_fields (SwInspector *self)
{
  const SwDesign *d = design (self);
  const SwStage *s;
  g_autofree char *title = NULL;
  gboolean has = self->selected >= 0 && (guint) self->selected < d->n_stages;

  gtk_widget_set_sensitive (self->stage_grid, has);
  if (!has)
    {
      gtk_label_set_text (self->stage_title, _("No stage selected"));
      return;
    }
  s = &d->stages[self->selected];
  /* Translators: heading of the selected stage's fields: number and name */
  title = g_strdup_printf (_("Stage %d: %s"), self->selected + 1, s->name);
  gtk_label_set_text (self->stage_title, title);
  if (g_strcmp0 (gtk_editable_get_text (GTK_EDITABLE (self->stage_name_entry)), s->name) != 0)
    gtk_editable_set_text (GTK_EDITABLE (self->stage_name_entry), s->name);
  set_spin (self->isp_vac_spin, s->isp_vac_s);
  gtk_check_button_set_active (self->isp_sl_check, s->has_isp_sl);
  gtk_widget_set_sensitive (GTK_WIDGET (self->isp_sl_spin), s->has_isp_sl);
  {
    /* At most the vacuum Isp.  Set only on a change: a new range resizes the
     * spin button, and a resize costs a relayout of the whole window. */
    double lo, hi, max = MIN (sw_limit_get (SW_LIMIT_ISP_SL)->max, s->isp_vac_s);
    gtk_spin_button_get_range (self->isp_sl_spin, &lo, &hi);
    if (hi != max)
      gtk_spin_button_set_range (self->isp_sl_spin, sw_limit_get (SW_LIMIT_ISP_SL)->min, max);
  }
  if (s->has_isp_sl)
    set_spin (self->isp_sl_spin, s->isp_sl_s);
  else
    gtk_editable_set_text (GTK_EDITABLE (self->isp_sl_spin), SW_NO_VALUE);
  set_spin (self->eps_spin, sw_eps_to_form (s->structural_coefficient, self->eps_form));
  {
    double share = shown_share (self, (guint) self->selected);
    gtk_adjustment_set_value (self->share_adjustment, isfinite (share) ? share * 100.0 : 0.0);
    gtk_widget_set_sensitive (GTK_WIDGET (self->share_scale), d->n_stages > 1);
    gtk_widget_set_sensitive (GTK_WIDGET (self->share_spin), d->n_stages > 1);
  }
}

static void
refresh (SwInspector *self)
{
  const SwDesign *d;
  gboolean orbit;

  if (self->document == NULL)
    return;
  d = design (self);
  self->updating++;

  if (g_strcmp0 (gtk_editable_get_text (GTK_EDITABLE (self->name_entry)), d->name) != 0)
    gtk_editable_set_text (GTK_EDITABLE (self->name_entry), d->name);
  set_spin (self->payload_spin, d->payload_kg);
  orbit = d->mission.kind == SW_MISSION_ORBIT;
  gtk_drop_down_set_selected (self->mission_dropdown, orbit ? 1 : 0);
  gtk_widget_set_visible (self->delta_v_label, !orbit);
  gtk_widget_set_visible (GTK_WIDGET (self->delta_v_spin), !orbit);
  gtk_widget_set_visible (GTK_WIDGET (self->delta_v_unit), !orbit);
  gtk_widget_set_visible (self->altitude_label, orbit);
  gtk_widget_set_visible (GTK_WIDGET (self->altitude_spin), orbit);
  gtk_widget_set_visible (GTK_WIDGET (self->altitude_unit), orbit);
  gtk_widget_set_visible (self->inclination_label, orbit);
  gtk_widget_set_visible (GTK_WIDGET (self->inclination_spin), orbit);
  gtk_widget_set_visible (GTK_WIDGET (self->inclination_unit), orbit);
  gtk_widget_set_visible (self->latitude_label, orbit);
  gtk_widget_set_visible (GTK_WIDGET (self->latitude_spin), orbit);
  gtk_widget_set_visible (GTK_WIDGET (self->latitude_unit), orbit);
  gtk_widget_set_visible (self->losses_label, orbit);
  gtk_widget_set_visible (GTK_WIDGET (self->losses_spin), orbit);
  gtk_widget_set_visible (GTK_WIDGET (self->losses_unit), orbit);
  gtk_widget_set_visible (self->ideal_caption, orbit);
  gtk_widget_set_visible (GTK_WIDGET (self->ideal_label), orbit);
  if (orbit)
    {
      set_spin (self->altitude_spin, d->mission.altitude_km);
      set_spin (self->inclination_spin, d->mission.inclination_deg);
      set_spin (self->latitude_spin, d->mission.site_latitude_deg);
      set_spin (self->losses_spin, d->mission.has_losses ? d->mission.losses_m_s : 0.0);
    }
  else
    set_spin (self->delta_v_spin, d->mission.delta_v_m_s);

  gtk_toggle_button_set_active (d->split == SW_SPLIT_EQUAL ? self->split_equal
                                : d->split == SW_SPLIT_OPTIMAL ? self->split_optimal
                                : self->split_manual, TRUE);

  if (self->selected >= (int) d->n_stages)
    sw_inspector_set_selected (self, (int) d->n_stages - 1);
  else if (self->selected < 0 && d->n_stages > 0)
    sw_inspector_set_selected (self, 0);
  update_stage_rows (self);
  update_stage_fields (self);
  update_computed (self);
  update_actions (self);
  self->updating--;
}

static void
document_changed_cb (SwInspector *self)
{
  refresh (self);
}

/* ---- edits: mission ---------------------------------------------------- */

static void
name_changed_cb (SwInspector *self, GtkEditable *entry)
{
  g_autoptr (SwDesign) d = NULL;

  if (!editing_ok (self))
    return;
  d = sw_document_dup_design (self->document);
  sw_design_set_name (d, gtk_editable_get_text (entry));
  commit (self, g_steal_pointer (&d), "name");
}

#define MISSION_EDIT(fn, field, setter, key)                                \
static void                                                                 \
fn (SwInspector *self, GtkSpinButton *spin)                                 \
{                                                                           \
  g_autoptr (SwDesign) d = NULL;                                            \
  double value;                                                             \
                                                                            \
  if (!editing_ok (self) || !spin_edited (spin, design (self)->field, &value)) \
    return;                                                                 \
  d = sw_document_dup_design (self->document);                              \
  setter (d, value);                                                        \
  commit (self, g_steal_pointer (&d), key);                                 \
}

MISSION_EDIT (payload_changed_cb, payload_kg, sw_design_set_payload, "payload")
MISSION_EDIT (delta_v_changed_cb, mission.delta_v_m_s, sw_design_set_mission_delta_v, "delta-v")
MISSION_EDIT (altitude_changed_cb, mission.altitude_km, sw_design_set_altitude, "altitude")
MISSION_EDIT (inclination_changed_cb, mission.inclination_deg, sw_design_set_inclination,
              "inclination")
MISSION_EDIT (latitude_changed_cb, mission.site_latitude_deg, sw_design_set_site_latitude,
              "latitude")

static void
losses_changed_cb (SwInspector *self, GtkSpinButton *spin)
{
  g_autoptr (SwDesign) d = NULL;
  const SwMission *m;
  double value;

  if (!editing_ok (self))
    return;
  m = &design (self)->mission;
  if (!spin_edited (spin, m->has_losses ? m->losses_m_s : 0.0, &value))
    return;
  d = sw_document_dup_design (self->document);
  sw_design_set_losses (d, value);
  commit (self, g_steal_pointer (&d), "losses");
}

static void
mission_kind_changed_cb (SwInspector *self)
{
  g_autoptr (SwDesign) d = NULL;
  SwMissionKind kind;

  if (!editing_ok (self))
    return;
  kind = gtk_drop_down_get_selected (self->mission_dropdown) == 1 ? SW_MISSION_ORBIT
                                                                   : SW_MISSION_DELTA_V;
  if (kind == design (self)->mission.kind)
    return;
  d = sw_document_dup_design (self->document);
  /* A field never set starts from the delta-v the orbit needed. */
  sw_design_set_mission_kind (d, kind, self->result != NULL && self->result->ok
                                       ? self->result->delta_v_m_s : NAN);
  commit (self, g_steal_pointer (&d), NULL);
}

static void
split_toggled_cb (SwInspector *self, GtkToggleButton *button)
{
  g_autoptr (SwDesign) d = NULL;
  SwSplitMode split;

  if (!editing_ok (self) || !gtk_toggle_button_get_active (button))
    return;
  split = button == self->split_equal ? SW_SPLIT_EQUAL
          : button == self->split_optimal ? SW_SPLIT_OPTIMAL : SW_SPLIT_MANUAL;
  if (split == design (self)->split)
    return;
  d = sw_document_dup_design (self->document);
  {
    double shares[SW_MAX_STAGES];
    guint n = screen_shares (self, shares);
    sw_design_set_split (d, split, shares, n);  /* manual starts from the split on screen */
  }
  commit (self, g_steal_pointer (&d), NULL);
}

/* ---- edits: the selected stage ----------------------------------------- */

static void
stage_name_changed_cb (SwInspector *self, GtkEditable *entry)
{
  g_autoptr (SwDesign) d = NULL;
  g_autofree char *key = NULL;

  if (!stage_ok (self))
    return;
  d = sw_document_dup_design (self->document);
  sw_design_set_stage_name (d, (guint) self->selected, gtk_editable_get_text (entry));
  key = stage_key (self, "name");
  commit (self, g_steal_pointer (&d), key);
}

static void
isp_vac_changed_cb (SwInspector *self, GtkSpinButton *spin)
{
  g_autoptr (SwDesign) d = NULL;
  g_autofree char *key = NULL;
  double value;

  if (!stage_ok (self)
      || !spin_edited (spin, design (self)->stages[self->selected].isp_vac_s, &value))
    return;
  d = sw_document_dup_design (self->document);
  sw_design_set_stage_isp_vac (d, (guint) self->selected, value);
  key = stage_key (self, "isp-vac");
  commit (self, g_steal_pointer (&d), key);
}

static void
isp_sl_toggled_cb (SwInspector *self, GtkCheckButton *check)
{
  g_autoptr (SwDesign) d = NULL;

  if (!stage_ok (self))
    return;
  d = sw_document_dup_design (self->document);
  sw_design_set_stage_has_isp_sl (d, (guint) self->selected, gtk_check_button_get_active (check));
  commit (self, g_steal_pointer (&d), NULL);
}

static void
isp_sl_changed_cb (SwInspector *self, GtkSpinButton *spin)
{
  g_autoptr (SwDesign) d = NULL;
  g_autofree char *key = NULL;
  const SwStage *cur;
  double value;

  if (!stage_ok (self))
    return;
  cur = &design (self)->stages[self->selected];
  if (!cur->has_isp_sl || !spin_edited (spin, cur->isp_sl_s, &value))
    return;
  d = sw_document_dup_design (self->document);
  sw_design_set_stage_isp_sl (d, (guint) self->selected, value);
  key = stage_key (self, "isp-sl");
  commit (self, g_steal_pointer (&d), key);
}

static void
eps_changed_cb (SwInspector *self, GtkSpinButton *spin)
{
  g_autoptr (SwDesign) d = NULL;
  g_autofree char *key = NULL;
  double value, current;

  if (!stage_ok (self))
    return;
  current = sw_eps_to_form (design (self)->stages[self->selected].structural_coefficient,
                            self->eps_form);
  if (!spin_edited (spin, current, &value))
    return;
  d = sw_document_dup_design (self->document);
  sw_design_set_stage_structural_coefficient (d, (guint) self->selected,
                                              sw_eps_from_form (value, self->eps_form));
  key = stage_key (self, "eps");
  commit (self, g_steal_pointer (&d), key);
}

static void
share_changed_cb (SwInspector *self, GtkAdjustment *adjustment)
{
  g_autoptr (SwDesign) d = NULL;
  g_autofree char *key = NULL;
  double value = gtk_adjustment_get_value (adjustment) / 100.0;
  double current;

  if (!stage_ok (self) || design (self)->n_stages < 2)
    return;
  current = shown_share (self, (guint) self->selected);
  if (isfinite (current) && fabs (current - value) < 0.5e-3)
    return;
  d = sw_document_dup_design (self->document);
  if (d->split != SW_SPLIT_MANUAL)
    {
      double shares[SW_MAX_STAGES];
      guint n = screen_shares (self, shares);
      sw_design_take_manual_shares (d, shares, n);
    }
  sw_design_set_share_rebalanced (d, (guint) self->selected, value);
  key = stage_key (self, "share");
  commit (self, g_steal_pointer (&d), key);
}

static void
eps_form_changed_cb (SwInspector *self)
{
  guint form = gtk_drop_down_get_selected (self->eps_form_dropdown);

  if (form > SW_EPS_PROPELLANT_FRACTION || (SwEpsForm) form == self->eps_form)
    return;
  self->eps_form = form;
  configure_eps_spin (self);
  if (self->document != NULL)
    {
      self->updating++;
      update_stage_fields (self);
      self->updating--;
    }
}

static void
stage_row_selected_cb (SwInspector *self, GtkListBoxRow *row)
{
  if (self->updating > 0 || row == NULL)
    return;
  sw_inspector_set_selected (self, gtk_list_box_row_get_index (row));
}

/* ---- stage list actions ------------------------------------------------ */

static void
stage_add_action (GtkWidget *widget, const char *name, GVariant *param)
{
  SwInspector *self = SW_INSPECTOR (widget);
  g_autoptr (SwDesign) d = NULL;
  guint n;

  if (self->document == NULL)
    return;
  d = sw_document_dup_design (self->document);
  n = d->n_stages;
  if (!sw_design_add_stage (d))
    return;
  commit (self, g_steal_pointer (&d), NULL);
  sw_inspector_set_selected (self, (int) n);
}

static void
stage_duplicate_action (GtkWidget *widget, const char *name, GVariant *param)
{
  SwInspector *self = SW_INSPECTOR (widget);
  g_autoptr (SwDesign) d = NULL;
  guint sel;

  if (!stage_ok (self))
    return;
  d = sw_document_dup_design (self->document);
  sel = (guint) self->selected;
  if (!sw_design_duplicate_stage (d, sel))
    return;
  commit (self, g_steal_pointer (&d), NULL);
  sw_inspector_set_selected (self, (int) sel + 1);
}

static void
stage_remove_action (GtkWidget *widget, const char *name, GVariant *param)
{
  SwInspector *self = SW_INSPECTOR (widget);
  g_autoptr (SwDesign) d = NULL;
  guint sel;

  if (!stage_ok (self))
    return;
  d = sw_document_dup_design (self->document);
  sel = (guint) self->selected;
  if (!sw_design_remove_stage (d, sel))
    return;
  commit (self, g_steal_pointer (&d), NULL);
  sw_inspector_set_selected (self, MIN ((int) sel, (int) design (self)->n_stages - 1));
}

static void
stage_move (SwInspector *self, int offset)
{
  g_autoptr (SwDesign) d = NULL;
  int to = self->selected + offset;

  if (!stage_ok (self) || to < 0)
    return;
  d = sw_document_dup_design (self->document);
  if (!sw_design_move_stage (d, (guint) self->selected, (guint) to))
    return;
  commit (self, g_steal_pointer (&d), NULL);
  sw_inspector_set_selected (self, to);
}

static void
stage_move_up_action (GtkWidget *widget, const char *name, GVariant *param)
{
  stage_move (SW_INSPECTOR (widget), -1);
}

static void
stage_move_down_action (GtkWidget *widget, const char *name, GVariant *param)
{
  stage_move (SW_INSPECTOR (widget), +1);
}

/* ---- public ------------------------------------------------------------ */

GtkWidget *
sw_inspector_new (void)
{
  return g_object_new (SW_TYPE_INSPECTOR, NULL);
}

void
sw_inspector_set_document (SwInspector *self, SwDocument *document)
{
  g_return_if_fail (SW_IS_INSPECTOR (self));
  g_return_if_fail (document == NULL || SW_IS_DOCUMENT (document));

  if (self->document == document)
    return;
  if (self->document != NULL)
    g_signal_handlers_disconnect_by_func (self->document, document_changed_cb, self);
  g_set_object (&self->document, document);
  if (document != NULL)
    g_signal_connect_swapped (document, "changed", G_CALLBACK (document_changed_cb), self);
  refresh (self);
}

void
sw_inspector_set_result (SwInspector *self, SwAnalysis *result)
{
  g_return_if_fail (SW_IS_INSPECTOR (self));

  if (self->result == result)
    return;
  g_clear_pointer (&self->result, sw_analysis_unref);
  self->result = result != NULL ? sw_analysis_ref (result) : NULL;
  if (self->document == NULL)
    return;
  self->updating++;
  update_stage_rows (self);
  update_computed (self);
  if (design (self)->split != SW_SPLIT_MANUAL)
    update_stage_fields (self);
  self->updating--;
}

void
sw_inspector_set_selected (SwInspector *self, int stage)
{
  g_return_if_fail (SW_IS_INSPECTOR (self));

  if (self->document != NULL)
    stage = CLAMP (stage, -1, (int) design (self)->n_stages - 1);
  if (stage == self->selected)
    return;
  self->selected = stage;
  if (self->document != NULL)
    {
      self->updating++;
      if (stage >= 0 && (guint) stage < self->listed_stages)
        gtk_list_box_select_row (self->stage_list,
                                 gtk_list_box_get_row_at_index (self->stage_list, stage));
      update_stage_fields (self);
      update_actions (self);
      self->updating--;
    }
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_SELECTED_STAGE]);
}

int
sw_inspector_get_selected (SwInspector *self)
{
  g_return_val_if_fail (SW_IS_INSPECTOR (self), -1);
  return self->selected;
}

GtkWidget *
sw_inspector_get_field (SwInspector *self, SwInspectorField field)
{
  g_return_val_if_fail (SW_IS_INSPECTOR (self), NULL);

  switch (field)
    {
    case SW_INSPECTOR_PAYLOAD: return GTK_WIDGET (self->payload_spin);
    case SW_INSPECTOR_MISSION_KIND: return GTK_WIDGET (self->mission_dropdown);
    case SW_INSPECTOR_DELTA_V: return GTK_WIDGET (self->delta_v_spin);
    case SW_INSPECTOR_ALTITUDE: return GTK_WIDGET (self->altitude_spin);
    case SW_INSPECTOR_INCLINATION: return GTK_WIDGET (self->inclination_spin);
    case SW_INSPECTOR_LATITUDE: return GTK_WIDGET (self->latitude_spin);
    case SW_INSPECTOR_LOSSES: return GTK_WIDGET (self->losses_spin);
    case SW_INSPECTOR_IDEAL_LABEL: return GTK_WIDGET (self->ideal_label);
    case SW_INSPECTOR_STAGE_LIST: return GTK_WIDGET (self->stage_list);
    case SW_INSPECTOR_STAGE_NAME: return GTK_WIDGET (self->stage_name_entry);
    case SW_INSPECTOR_ISP_VAC: return GTK_WIDGET (self->isp_vac_spin);
    case SW_INSPECTOR_ISP_SL: return GTK_WIDGET (self->isp_sl_spin);
    case SW_INSPECTOR_EPS_FORM: return GTK_WIDGET (self->eps_form_dropdown);
    case SW_INSPECTOR_EPS: return GTK_WIDGET (self->eps_spin);
    case SW_INSPECTOR_SHARE: return GTK_WIDGET (self->share_spin);
    case SW_INSPECTOR_SHARE_SCALE: return GTK_WIDGET (self->share_scale);
    default: return NULL;
    }
}

/* ---- GObject ----------------------------------------------------------- */

static gboolean
eps_form_get_mapping (GValue *value, GVariant *variant, gpointer user_data)
{
  const char *nick = g_variant_get_string (variant, NULL);

  for (guint f = SW_EPS_COEFFICIENT; f <= SW_EPS_PROPELLANT_FRACTION; f++)
    if (g_strcmp0 (nick, sw_eps_form_to_string (f)) == 0)
      {
        g_value_set_uint (value, f);
        return TRUE;
      }
  return FALSE;
}

static GVariant *
eps_form_set_mapping (const GValue *value, const GVariantType *type, gpointer user_data)
{
  guint f = g_value_get_uint (value);

  if (f > SW_EPS_PROPELLANT_FRACTION)
    return NULL;
  return g_variant_new_string (sw_eps_form_to_string (f));
}

static void
sw_inspector_dispose (GObject *object)
{
  SwInspector *self = SW_INSPECTOR (object);

  if (self->document != NULL)
    g_signal_handlers_disconnect_by_func (self->document, document_changed_cb, self);
  g_clear_object (&self->document);
  g_clear_pointer (&self->result, sw_analysis_unref);
  g_clear_object (&self->settings);
  gtk_widget_dispose_template (GTK_WIDGET (self), SW_TYPE_INSPECTOR);
  G_OBJECT_CLASS (sw_inspector_parent_class)->dispose (object);
}

static void
sw_inspector_get_property (GObject *object, guint prop_id, GValue *value, GParamSpec *pspec)
{
  SwInspector *self = SW_INSPECTOR (object);

  switch (prop_id)
    {
    case PROP_SELECTED_STAGE:
      g_value_set_int (value, self->selected);
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
sw_inspector_set_property (GObject *object, guint prop_id, const GValue *value,
                           GParamSpec *pspec)
{
  SwInspector *self = SW_INSPECTOR (object);

  switch (prop_id)
    {
    case PROP_SELECTED_STAGE:
      sw_inspector_set_selected (self, g_value_get_int (value));
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
sw_inspector_class_init (SwInspectorClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = sw_inspector_dispose;
  object_class->get_property = sw_inspector_get_property;
  object_class->set_property = sw_inspector_set_property;

  properties[PROP_SELECTED_STAGE]
    = g_param_spec_int ("selected-stage", NULL, NULL, -1, SW_MAX_STAGES - 1, -1,
                        G_PARAM_READWRITE | G_PARAM_EXPLICIT_NOTIFY | G_PARAM_STATIC_STRINGS);
  g_object_class_install_properties (object_class, N_PROPS, properties);

  gtk_widget_class_set_template_from_resource (widget_class,
                                               "/org/stagewright/Stagewright/sw-inspector.ui");
  gtk_widget_class_set_layout_manager_type (widget_class, GTK_TYPE_BIN_LAYOUT);
  gtk_widget_class_set_css_name (widget_class, "sw-inspector");

#define CHILD(name) gtk_widget_class_bind_template_child (widget_class, SwInspector, name)
  CHILD (scroller);
  CHILD (name_entry);
  CHILD (payload_spin);
  CHILD (payload_unit);
  CHILD (mission_dropdown);
  CHILD (delta_v_label);
  CHILD (delta_v_spin);
  CHILD (delta_v_unit);
  CHILD (altitude_label);
  CHILD (altitude_spin);
  CHILD (altitude_unit);
  CHILD (inclination_label);
  CHILD (inclination_spin);
  CHILD (inclination_unit);
  CHILD (latitude_label);
  CHILD (latitude_spin);
  CHILD (latitude_unit);
  CHILD (losses_label);
  CHILD (losses_spin);
  CHILD (losses_unit);
  CHILD (ideal_caption);
  CHILD (ideal_label);
  CHILD (split_equal);
  CHILD (split_optimal);
  CHILD (split_manual);
  CHILD (stage_list);
  CHILD (stage_title);
  CHILD (stage_grid);
  CHILD (stage_name_entry);
  CHILD (isp_vac_spin);
  CHILD (isp_vac_unit);
  CHILD (isp_sl_check);
  CHILD (isp_sl_spin);
  CHILD (isp_sl_unit);
  CHILD (eps_form_dropdown);
  CHILD (eps_label);
  CHILD (eps_spin);
  CHILD (eps_unit);
  CHILD (share_spin);
  CHILD (share_scale);
  CHILD (share_adjustment);
#undef CHILD

  gtk_widget_class_bind_template_callback (widget_class, name_changed_cb);
  gtk_widget_class_bind_template_callback (widget_class, payload_changed_cb);
  gtk_widget_class_bind_template_callback (widget_class, mission_kind_changed_cb);
  gtk_widget_class_bind_template_callback (widget_class, delta_v_changed_cb);
  gtk_widget_class_bind_template_callback (widget_class, altitude_changed_cb);
  gtk_widget_class_bind_template_callback (widget_class, inclination_changed_cb);
  gtk_widget_class_bind_template_callback (widget_class, latitude_changed_cb);
  gtk_widget_class_bind_template_callback (widget_class, losses_changed_cb);
  gtk_widget_class_bind_template_callback (widget_class, split_toggled_cb);
  gtk_widget_class_bind_template_callback (widget_class, stage_row_selected_cb);
  gtk_widget_class_bind_template_callback (widget_class, stage_name_changed_cb);
  gtk_widget_class_bind_template_callback (widget_class, isp_vac_changed_cb);
  gtk_widget_class_bind_template_callback (widget_class, isp_sl_toggled_cb);
  gtk_widget_class_bind_template_callback (widget_class, isp_sl_changed_cb);
  gtk_widget_class_bind_template_callback (widget_class, eps_form_changed_cb);
  gtk_widget_class_bind_template_callback (widget_class, eps_changed_cb);
  gtk_widget_class_bind_template_callback (widget_class, share_changed_cb);

  gtk_widget_class_install_action (widget_class, "stage.add", NULL, stage_add_action);
  gtk_widget_class_install_action (widget_class, "stage.duplicate", NULL, stage_duplicate_action);
  gtk_widget_class_install_action (widget_class, "stage.remove", NULL, stage_remove_action);
  gtk_widget_class_install_action (widget_class, "stage.move-up", NULL, stage_move_up_action);
  gtk_widget_class_install_action (widget_class, "stage.move-down", NULL,
                                   stage_move_down_action);
}

static void
sw_inspector_init (SwInspector *self)
{
  self->selected = -1;
  self->eps_form = SW_EPS_COEFFICIENT;
  gtk_widget_init_template (GTK_WIDGET (self));

  setup_spin (self->payload_spin, self->payload_unit, SW_LIMIT_PAYLOAD, 1, 10.0, 1000.0);
  setup_spin (self->delta_v_spin, self->delta_v_unit, SW_LIMIT_DELTA_V, 0, 10.0, 100.0);
  setup_spin (self->altitude_spin, self->altitude_unit, SW_LIMIT_ALTITUDE, 0, 10.0, 100.0);
  setup_spin (self->inclination_spin, self->inclination_unit, SW_LIMIT_INCLINATION, 1, 0.1, 1.0);
  setup_spin (self->latitude_spin, self->latitude_unit, SW_LIMIT_SITE_LATITUDE, 1, 0.1, 1.0);
  setup_spin (self->losses_spin, self->losses_unit, SW_LIMIT_LOSSES, 0, 10.0, 100.0);
  setup_spin (self->isp_vac_spin, self->isp_vac_unit, SW_LIMIT_ISP_VAC, 1, 1.0, 10.0);
  setup_spin (self->isp_sl_spin, self->isp_sl_unit, SW_LIMIT_ISP_SL, 1, 1.0, 10.0);
  setup_spin (self->eps_spin, self->eps_unit, SW_LIMIT_STRUCTURAL_COEFFICIENT, 4, 0.001, 0.01);
  gtk_editable_set_enable_undo (GTK_EDITABLE (self->share_spin), FALSE);
  gtk_editable_set_width_chars (GTK_EDITABLE (self->share_spin), 9);
  {
    const SwLimit *l = sw_limit_get (SW_LIMIT_DELTA_V_SHARE);
    gtk_adjustment_set_lower (self->share_adjustment, l->min * 100.0);
    gtk_adjustment_set_upper (self->share_adjustment, l->max * 100.0);
  }
  configure_eps_spin (self);

  update_actions (self);
}

/* The structural-mass form is kept in @settings ("eps-form"). */
void
sw_inspector_set_settings (SwInspector *self, GSettings *settings)
{
  g_return_if_fail (SW_IS_INSPECTOR (self));

  if (settings == self->settings)
    return;
  if (self->settings != NULL)
    g_settings_unbind (self->eps_form_dropdown, "selected");
  g_set_object (&self->settings, settings);
  if (settings != NULL)
    g_settings_bind_with_mapping (settings, "eps-form", self->eps_form_dropdown, "selected",
                                  G_SETTINGS_BIND_DEFAULT, eps_form_get_mapping,
                                  eps_form_set_mapping, NULL, NULL);
}
