/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-inspector"

#include "config.h"

#include "sw-inspector.h"
#include "sw-widget-text.h"

#include "sw-design-edit.h"
#include "sw-design-fields.h"
#include "sw-format.h"
#include "sw-limits.h"
#include "sw-narrow.h"
#include "sw-number-field.h"
#include "sw-sizing.h"
#include "sw-stage-thrust.h"

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
  SwNumberField *payload_spin;
  GtkLabel      *payload_unit;
  GtkDropDown   *mission_dropdown;
  GtkWidget     *delta_v_label;
  SwNumberField *delta_v_spin;
  GtkLabel      *delta_v_unit;
  GtkWidget     *altitude_label;
  SwNumberField *altitude_spin;
  GtkLabel      *altitude_unit;
  GtkWidget     *inclination_label;
  SwNumberField *inclination_spin;
  GtkLabel      *inclination_unit;
  GtkWidget     *latitude_label;
  SwNumberField *latitude_spin;
  GtkLabel      *latitude_unit;
  GtkWidget     *losses_label;
  SwNumberField *losses_spin;
  GtkLabel      *losses_unit;
  GtkWidget     *ideal_caption;
  GtkLabel      *ideal_label;
  GtkToggleButton *split_equal;
  GtkToggleButton *split_optimal;
  GtkToggleButton *split_manual;
  GtkListBox    *stage_list;
  GtkInscription *stage_title;
  GtkWidget     *stage_grid;
  GtkEntry      *stage_name_entry;
  SwNumberField *isp_vac_spin;
  GtkLabel      *isp_vac_unit;
  GtkCheckButton *isp_sl_check;
  SwNumberField *isp_sl_spin;
  GtkLabel      *isp_sl_unit;
  GtkDropDown   *eps_form_dropdown;
  GtkLabel      *eps_label;
  SwNumberField *eps_spin;
  GtkLabel      *eps_unit;
  SwNumberField *share_spin;
  GtkScale      *share_scale;
  GtkAdjustment *share_adjustment;
  GtkWidget     *content_box;

  /* built in code: notes, loss model, propulsion, reliability, ascent */
  GtkWidget     *intro_box;
  GtkTextView   *notes_view;
  guint          notes_fit_id;    /* tick callback: see notes_fit_tick */
  guint          notes_fit_frames;
  GtkLabel      *notes_message;
  GtkDropDown   *loss_model_dropdown;
  GtkWidget     *loss_model_label;
  GtkWidget     *stage_extra;
  GtkLabel      *tanks_label;     /* read-out: the selected stage's tanks and length */
  SwNumberField *thrust_field;
  SwNumberField *engine_thrust_field;
  SwNumberField *engine_count_field;
  SwNumberField *tw_field;
  GtkLabel *tw_caption;           /* with boosters, stage 1's says it is the core alone */
  GtkLabel *tw_note;              /* there, the cluster's liftoff T/W beside the field */
  SwNumberField *diameter_field;
  GtkDropDown   *propellant_dropdown;     /* SwPropellantKind order */
  GtkEntry      *propellant_name_entry;   /* a propellant of the user's own */
  GtkLabel      *propellant_name_message;
  SwNumberField *propellant_load_field;
  SwNumberField *mixture_ratio_field;
  SwNumberField *ullage_field;
  SwNumberField *oxidizer_density_field;
  SwNumberField *fuel_density_field;
  SwNumberField *coast_field;
  GtkEntry      *drag_entry;
  GtkLabel      *drag_message;
  SwNumberField *engine_rel_field;
  SwNumberField *failures_field;
  SwNumberField *ignition_rel_field;
  SwNumberField *separation_rel_field;
  SwNumberField *fairing_mass_field;
  SwNumberField *fairing_altitude_field;
  SwNumberField *fairing_pressure_field;
  SwNumberField *pitch_over_field;
  SwNumberField *pitch_kick_field;
  SwNumberField *insertion_field;
  SwNumberField *max_q_alpha_field;
  /* the strap-on boosters */
  GtkWidget     *booster_box;            /* everything but the count */
  SwNumberField *booster_count_field;
  GtkEntry      *booster_name_entry;
  SwNumberField *booster_isp_vac_field;
  SwNumberField *booster_isp_sl_field;
  SwNumberField *booster_eps_field;
  SwNumberField *booster_thrust_field;
  SwNumberField *booster_load_field;
  SwNumberField *booster_diameter_field;
  GtkCheckButton *booster_crossfeed_check;
  GtkDropDown   *booster_propellant_dropdown;
  GtkEntry      *booster_propellant_name_entry;   /* their own propellant's name */
  SwNumberField *booster_mixture_field;
  SwNumberField *booster_ullage_field;
  SwNumberField *booster_oxidizer_field;
  SwNumberField *booster_fuel_field;
  gboolean       isp_conflict;           /* the Isp pair shows a conflict */
};

G_DEFINE_FINAL_TYPE (SwInspector, sw_inspector, GTK_TYPE_WIDGET)

enum { PROP_0, PROP_SELECTED_STAGE, N_PROPS };

static void update_extra_stage_fields (SwInspector *self, const SwDesign *d, guint i,
                                       gboolean reset);
static void update_design_extra (SwInspector *self, const SwDesign *d);
static gboolean focus_within (GtkWidget *widget);
static GParamSpec *properties[N_PROPS];

/* ---- helpers ----------------------------------------------------------- */

/* Field ranges come from the one limits table. */
static void
setup_field (SwNumberField *field, GtkLabel *unit, SwLimitId id, guint digits, double step)
{
  sw_number_field_set_limit (field, id, 1.0, digits, step);
  if (unit != NULL)
    gtk_label_set_text (unit, sw_limit_get (id)->unit);
}

static void
set_field (SwNumberField *field, double value)
{
  sw_number_field_set_value (field, value);
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
  sw_number_field_set_range (self->eps_spin, lo, hi, FALSE, "", digits,
                             self->eps_form == SW_EPS_WET_DRY_RATIO ? 0.1 : 0.001);
  gtk_label_set_text (self->eps_label, eps_form_label (self->eps_form));
  sw_widget_set_tooltip (GTK_WIDGET (self->eps_spin), eps_form_tooltip (self->eps_form));
  sw_widget_set_tooltip (GTK_WIDGET (self->eps_label), eps_form_tooltip (self->eps_form));
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

/* The selected stage's tank figures from the analysis (sw-vehicle-shape.h):
 * volumes with a propellant, lengths with a diameter too; or what is
 * missing. */
static void
update_tanks_readout (SwInspector *self)
{
  SwAnalysis *r = self->result;
  g_autofree char *text = NULL;

  if (self->tanks_label == NULL)
    return;
  if (r == NULL || !r->ok || !r->sizing.feasible || self->selected < 0
      || (guint) self->selected >= r->shape.n_stages)
    text = g_strdup (SW_NO_VALUE);
  else
    {
      const SwStageGeometry *g = &r->shape.stages[self->selected];
      const SwStageShape *sh = &g->shape;

      if (!sh->valid)
        text = g_strdup (_("choose a propellant to see them"));
      else
        {
          g_autofree char *tank = sw_format_volume_m3 (sh->tank_volume_m3);
          g_autofree char *prop = sw_format_volume_m3 (sh->propellant_volume_m3);
          if (!sh->has_length)
            text = g_strdup_printf (_("%s (propellant %s); the length needs a diameter"),
                                    tank, prop);
          else
            {
              g_autofree char *len = sw_format_length_m (sh->length_m);
              g_autofree char *d = sw_format_length_m (g->diameter_m);
              text = g_strdup_printf (_("%s (propellant %s); stage %s long, %s across"), tank,
                                      prop, len, d);
            }
        }
    }
  gtk_label_set_text (self->tanks_label, text);
}

static void
update_computed (SwInspector *self)
{
  g_autofree char *ideal = NULL;
  SwAnalysis *r = self->result;

  if (r != NULL && r->has_budget)
    ideal = sw_format_speed (r->budget.ideal_delta_v_m_s);
  gtk_label_set_text (self->ideal_label, ideal != NULL ? ideal : SW_NO_VALUE);
  update_tanks_readout (self);
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
  gtk_widget_set_sensitive (self->stage_extra, has);
  if (!has)
    {
      gtk_inscription_set_text (self->stage_title, _("No stage selected"));
      return;
    }
  s = &d->stages[self->selected];
  /* Translators: heading of the selected stage's fields: number and name */
  title = g_strdup_printf (_("Stage %d: %s"), self->selected + 1, s->name);
  gtk_inscription_set_text (self->stage_title, title);
  if (g_strcmp0 (gtk_editable_get_text (GTK_EDITABLE (self->stage_name_entry)), s->name) != 0)
    gtk_editable_set_text (GTK_EDITABLE (self->stage_name_entry), s->name);
  set_field (self->isp_vac_spin, s->isp_vac_s);
  gtk_check_button_set_active (self->isp_sl_check, s->has_isp_sl);
  gtk_widget_set_sensitive (GTK_WIDGET (self->isp_sl_spin), s->has_isp_sl);
  set_field (self->isp_sl_spin, s->has_isp_sl ? s->isp_sl_s : NAN);
  set_field (self->eps_spin, sw_eps_to_form (s->structural_coefficient, self->eps_form));
  {
    double share = shown_share (self, (guint) self->selected);
    gtk_adjustment_set_value (self->share_adjustment, isfinite (share) ? share * 100.0 : 0.0);
    set_field (self->share_spin, isfinite (share) ? share * 100.0 : NAN);
    gtk_widget_set_sensitive (GTK_WIDGET (self->share_scale), d->n_stages > 1);
    gtk_widget_set_sensitive (GTK_WIDGET (self->share_spin), d->n_stages > 1);
  }
  update_extra_stage_fields (self, d, (guint) self->selected, FALSE);
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
  set_field (self->payload_spin, d->payload_kg);
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
      set_field (self->altitude_spin, d->mission.altitude_km);
      set_field (self->inclination_spin, d->mission.inclination_deg);
      set_field (self->latitude_spin, d->mission.site_latitude_deg);
      set_field (self->losses_spin, d->mission.has_losses ? d->mission.losses_m_s : NAN);
    }
  else
    set_field (self->delta_v_spin, d->mission.delta_v_m_s);

  gtk_toggle_button_set_active (d->split == SW_SPLIT_EQUAL ? self->split_equal
                                : d->split == SW_SPLIT_OPTIMAL ? self->split_optimal
                                : self->split_manual, TRUE);

  if (self->selected >= (int) d->n_stages)
    sw_inspector_set_selected (self, (int) d->n_stages - 1);
  else if (self->selected < 0 && d->n_stages > 0)
    sw_inspector_set_selected (self, 0);
  update_stage_rows (self);
  update_stage_fields (self);
  update_design_extra (self, d);
  /* Once saved, the demonstration copy is the user's own design. */
  if (sw_document_get_file (self->document) != NULL)
    gtk_widget_set_visible (self->intro_box, FALSE);
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

/* The core's message without its leading JSON path ("stages[0].isp_vac_s: "):
 * the field it shows under is the key. */
static const char *
field_message (const char *message)
{
  const char *colon = strstr (message, ": ");

  if (colon != NULL && memchr (message, ' ', (gsize) (colon - message)) == NULL)
    return colon + 2;
  return message;
}

/* Every number field of a key: the core's named edit on a copy, committed
 * as one undo step.  A refusal shows on the field and the design stays as
 * it was. */
static gboolean
commit_field (SwInspector *self, SwNumberField *field, SwDesignField key, double value)
{
  g_autoptr (SwDesign) d = NULL;
  g_autoptr (GError) error = NULL;
  gboolean per_stage = sw_design_field_info (key)->per_stage;
  guint stage = per_stage ? (guint) self->selected : 0;
  gboolean ok;

  if (!editing_ok (self) || (per_stage && !stage_ok (self)))
    return FALSE;
  d = sw_document_dup_design (self->document);
  ok = isnan (value) ? sw_design_field_unset (d, key, stage, &error)
                     : sw_design_field_set (d, key, stage, value, &error);
  if (!ok)
    {
      sw_number_field_set_error (field, field_message (error->message));
      return FALSE;
    }
  if (!sw_design_equal (d, design (self)))
    commit (self, g_steal_pointer (&d), NULL);
  return TRUE;
}

/* The fields built in code carry their key. */
static void
number_field_cb (SwNumberField *field, SwInspector *self)
{
  SwDesignField key = GPOINTER_TO_INT (g_object_get_data (G_OBJECT (field), "sw-key")) - 1;

  commit_field (self, field, key, sw_number_field_get_value (field));
}

#define FIELD_EDIT(fn, key)                                                 \
static void                                                                 \
fn (SwInspector *self, SwNumberField *field)                                \
{                                                                           \
  commit_field (self, field, key, sw_number_field_get_value (field));       \
}

FIELD_EDIT (payload_changed_cb, SW_FIELD_PAYLOAD)
FIELD_EDIT (delta_v_changed_cb, SW_FIELD_DELTA_V)
FIELD_EDIT (altitude_changed_cb, SW_FIELD_ALTITUDE)
FIELD_EDIT (inclination_changed_cb, SW_FIELD_INCLINATION)
FIELD_EDIT (latitude_changed_cb, SW_FIELD_SITE_LATITUDE)
FIELD_EDIT (losses_changed_cb, SW_FIELD_LOSSES)

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

/* The Isp pair: a vacuum Isp below the sea-level Isp is flagged on both
 * fields and the design keeps its last valid state; neither value moves
 * the other. */
static void
show_isp_conflict (SwInspector *self, SwNumberField *typed, gboolean conflict)
{
  SwNumberField *other = typed == self->isp_vac_spin ? self->isp_sl_spin : self->isp_vac_spin;

  if (conflict)
    {
      sw_number_field_set_error (other, typed == self->isp_vac_spin
                                 ? _("Above the vacuum Isp typed: lower this first")
                                 : _("Below the sea-level Isp typed: raise this first"));
      self->isp_conflict = TRUE;
    }
  else if (self->isp_conflict)
    {
      self->isp_conflict = FALSE;
      sw_number_field_set_error (other, NULL);
      if (self->document != NULL)
        {
          self->updating++;
          update_stage_fields (self);
          self->updating--;
        }
    }
}

static void
isp_vac_changed_cb (SwInspector *self, SwNumberField *field)
{
  double v = sw_number_field_get_value (field);
  const SwStage *s;
  gboolean ok;

  if (!stage_ok (self))
    return;
  s = &design (self)->stages[self->selected];
  ok = commit_field (self, field, SW_FIELD_ISP_VAC, v);
  show_isp_conflict (self, field, !ok && s->has_isp_sl && v < s->isp_sl_s);
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
isp_sl_changed_cb (SwInspector *self, SwNumberField *field)
{
  double v = sw_number_field_get_value (field);
  const SwStage *s;
  gboolean ok;

  if (!stage_ok (self))
    return;
  s = &design (self)->stages[self->selected];
  if (!s->has_isp_sl)
    return;
  ok = commit_field (self, field, SW_FIELD_ISP_SL, v);
  show_isp_conflict (self, field, !ok && v > s->isp_vac_s);
}

static void
eps_changed_cb (SwInspector *self, SwNumberField *field)
{
  const SwLimit *l = sw_limit_get (SW_LIMIT_STRUCTURAL_COEFFICIENT);
  double eps = sw_eps_from_form (sw_number_field_get_value (field), self->eps_form);

  /* The form's range is the coefficient's: only rounding may stray out. */
  if (eps < l->min && eps > l->min - 1e-12)
    eps = l->min;
  if (eps > l->max && eps < l->max + 1e-12)
    eps = l->max;
  commit_field (self, field, SW_FIELD_STRUCTURAL_COEFFICIENT, eps);
}

/* The share typed in percent: one undo step; the other stages' shares
 * rescale so the sum stays 1 (that is what a share is, not a side effect). */
static void
share_field_cb (SwInspector *self, SwNumberField *field)
{
  g_autoptr (SwDesign) d = NULL;
  double value = sw_number_field_get_value (field) / 100.0;

  if (!stage_ok (self) || design (self)->n_stages < 2 || isnan (value))
    return;
  d = sw_document_dup_design (self->document);
  if (d->split != SW_SPLIT_MANUAL)
    {
      double shares[SW_MAX_STAGES];
      guint n = screen_shares (self, shares);
      sw_design_take_manual_shares (d, shares, n);
    }
  sw_design_set_share_rebalanced (d, (guint) self->selected, value);
  commit (self, g_steal_pointer (&d), NULL);
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

/* Ctrl+Z and Ctrl+Shift+Z in a text entry of the panel go to the window's
 * history (the entry's own undo is off: names commit as they are typed). */
static gboolean
entry_undo_key_cb (GtkEventControllerKey *controller, guint keyval, guint keycode,
                   GdkModifierType state, GtkWidget *entry)
{
  GdkModifierType mods = state & gtk_accelerator_get_default_mod_mask ();

  if (mods == GDK_CONTROL_MASK && (keyval == GDK_KEY_z || keyval == GDK_KEY_Z))
    return gtk_widget_activate_action (entry, "design.undo", NULL);
  if ((mods == (GDK_CONTROL_MASK | GDK_SHIFT_MASK) && (keyval == GDK_KEY_z || keyval == GDK_KEY_Z))
      || (mods == GDK_CONTROL_MASK && keyval == GDK_KEY_y))
    return gtk_widget_activate_action (entry, "design.redo", NULL);
  return FALSE;
}

static void
route_undo (GtkWidget *entry)
{
  GtkEventController *controller = gtk_event_controller_key_new ();

  gtk_event_controller_set_propagation_phase (controller, GTK_PHASE_CAPTURE);
  g_signal_connect (controller, "key-pressed", G_CALLBACK (entry_undo_key_cb), entry);
  gtk_widget_add_controller (entry, controller);
}

/* The share slider never takes the wheel: over the panel the wheel
 * scrolls it (a slider cannot show that it has focus well enough). */
static void
no_wheel_on_scale (GtkWidget *scale)
{
  GListModel *controllers = gtk_widget_observe_controllers (scale);

  for (guint i = 0; i < g_list_model_get_n_items (controllers); i++)
    {
      g_autoptr (GtkEventController) c = g_list_model_get_item (controllers, i);
      if (GTK_IS_EVENT_CONTROLLER_SCROLL (c))
        gtk_event_controller_set_propagation_phase (c, GTK_PHASE_NONE);
    }
  g_object_unref (controllers);
}

/* ---- the fields built in code ----------------------------------------- */

static GtkWidget *
section_title (const char *text)
{
  GtkWidget *label = gtk_label_new (text);

  gtk_label_set_xalign (GTK_LABEL (label), 0.0);
  gtk_widget_set_margin_top (label, 8);
  gtk_widget_add_css_class (label, "sw-section-title");
  return label;
}

static GtkWidget *
caption (const char *text, const char *tooltip, GtkWidget *mnemonic)
{
  GtkWidget *label = gtk_label_new_with_mnemonic (text);

  gtk_label_set_xalign (GTK_LABEL (label), 0.0);
  gtk_label_set_wrap (GTK_LABEL (label), TRUE);
  gtk_label_set_max_width_chars (GTK_LABEL (label), 16);
  gtk_widget_set_valign (label, GTK_ALIGN_START);
  gtk_widget_set_margin_top (label, 8);
  sw_widget_set_tooltip (label, tooltip);
  if (mnemonic != NULL)
    gtk_label_set_mnemonic_widget (GTK_LABEL (label), mnemonic);
  return label;
}

/* A row of @grid: caption, a number field for @key (or the limit @limit
 * when @key is SW_N_FIELDS), unit.  Optional keys show @placeholder when
 * left out. */
static SwNumberField *
add_number_row (SwInspector *self, GtkGrid *grid, int row, const char *text, const char *tooltip,
                SwDesignField key, SwLimitId limit, guint digits, double step,
                const char *placeholder)
{
  SwNumberField *field = SW_NUMBER_FIELD (sw_number_field_new ());
  GtkWidget *unit;

  if (key != SW_N_FIELDS)
    {
      const SwDesignFieldInfo *info = sw_design_field_info (key);
      limit = info->limit;
      sw_number_field_set_whole (field, info->whole);
      sw_number_field_set_optional (field, info->optional, placeholder);
      g_object_set_data (G_OBJECT (field), "sw-key", GINT_TO_POINTER (key + 1));
      g_signal_connect (field, "value-committed", G_CALLBACK (number_field_cb), self);
    }
  if (limit != SW_N_LIMITS)
    sw_number_field_set_limit (field, limit, 1.0, digits, step);
  sw_widget_set_tooltip (GTK_WIDGET (field), tooltip);
  gtk_widget_set_hexpand (GTK_WIDGET (field), TRUE);
  unit = gtk_label_new (limit != SW_N_LIMITS ? sw_limit_get (limit)->unit : "");
  gtk_label_set_xalign (GTK_LABEL (unit), 0.0);
  gtk_widget_set_valign (unit, GTK_ALIGN_START);
  gtk_widget_set_margin_top (unit, 8);
  gtk_widget_add_css_class (unit, "dim-label");
  gtk_grid_attach (grid, caption (text, tooltip, sw_number_field_get_entry (field)), 0, row, 1, 1);
  gtk_grid_attach (grid, GTK_WIDGET (field), 1, row, 1, 1);
  gtk_grid_attach (grid, unit, 2, row, 1, 1);
  return field;
}

static GtkGrid *
new_grid (void)
{
  GtkWidget *grid = gtk_grid_new ();

  gtk_grid_set_row_spacing (GTK_GRID (grid), 4);
  gtk_grid_set_column_spacing (GTK_GRID (grid), 8);
  return GTK_GRID (grid);
}

/* The notes: the design says what it is (the demos say they are
 * invented).  Committed when the view loses focus, one undo step. */
static void
notes_commit (SwInspector *self)
{
  g_autoptr (SwDesign) d = NULL;
  g_autoptr (GError) error = NULL;
  GtkTextBuffer *buffer = gtk_text_view_get_buffer (self->notes_view);
  GtkTextIter start, end;
  g_autofree char *text = NULL;

  if (!editing_ok (self))
    return;
  gtk_text_buffer_get_bounds (buffer, &start, &end);
  text = gtk_text_buffer_get_text (buffer, &start, &end, FALSE);
  if (g_strcmp0 (text, design (self)->notes != NULL ? design (self)->notes : "") == 0)
    return;
  d = sw_document_dup_design (self->document);
  if (!sw_design_set_notes_checked (d, text, &error))
    {
      gtk_label_set_text (self->notes_message, error->message);
      gtk_widget_set_visible (GTK_WIDGET (self->notes_message), TRUE);
      return;
    }
  gtk_widget_set_visible (GTK_WIDGET (self->notes_message), FALSE);
  commit (self, g_steal_pointer (&d), NULL);
}

static void
notes_leave_cb (GtkEventControllerFocus *controller, SwInspector *self)
{
  if (gtk_widget_get_mapped (GTK_WIDGET (self)))
    notes_commit (self);
}

static void
loss_model_changed_cb (SwInspector *self)
{
  g_autoptr (SwDesign) d = NULL;
  g_autoptr (GError) error = NULL;
  SwLossModel model = gtk_drop_down_get_selected (self->loss_model_dropdown) == 1
                      ? SW_LOSS_SIMULATE : SW_LOSS_ALLOWANCE;

  if (!editing_ok (self) || model == design (self)->mission.loss_model)
    return;
  d = sw_document_dup_design (self->document);
  if (!sw_design_set_loss_model (d, model, &error))
    {
      /* Refused (only an orbit mission shows the choice): show the model
       * in force again, and why in the tooltip. */
      self->updating++;
      gtk_drop_down_set_selected (self->loss_model_dropdown,
                                  design (self)->mission.loss_model == SW_LOSS_SIMULATE);
      self->updating--;
      sw_widget_set_tooltip (GTK_WIDGET (self->loss_model_dropdown), error->message);
      return;
    }
  commit (self, g_steal_pointer (&d), NULL);
}

/* The stage's propellant: none, a catalogue entry or one of the user's own. */
static void
propellant_changed_cb (SwInspector *self)
{
  g_autoptr (SwDesign) d = NULL;
  g_autoptr (GError) error = NULL;
  guint selected = gtk_drop_down_get_selected (self->propellant_dropdown);
  int stage = self->selected;

  if (!editing_ok (self) || stage < 0 || (guint) stage >= design (self)->n_stages
      || selected >= SW_N_PROPELLANTS
      || selected == design (self)->stages[stage].propellant.kind)
    return;
  d = sw_document_dup_design (self->document);
  if (!sw_design_set_propellant (d, (guint) stage, (SwPropellantKind) selected, &error))
    {
      self->updating++;
      gtk_drop_down_set_selected (self->propellant_dropdown,
                                  design (self)->stages[stage].propellant.kind);
      self->updating--;
      sw_widget_set_tooltip (GTK_WIDGET (self->propellant_dropdown), error->message);
      return;
    }
  commit (self, g_steal_pointer (&d), NULL);
}

/* Thrust as a total or per engine: one quantity, the form typed replaces
 * the other in one edit. */
static void
thrust_cb (SwNumberField *field, SwInspector *self)
{
  g_autoptr (SwDesign) d = NULL;
  g_autoptr (GError) error = NULL;

  if (!stage_ok (self))
    return;
  d = sw_document_dup_design (self->document);
  if (!sw_design_set_thrust (d, (guint) self->selected, field == self->engine_thrust_field,
                             sw_number_field_get_value (field), &error))
    {
      sw_number_field_set_error (field, field_message (error->message));
      return;
    }
  commit (self, g_steal_pointer (&d), NULL);
}

/* The thrust from the thrust-to-weight the user wants at ignition. */
static void
tw_cb (SwNumberField *field, SwInspector *self)
{
  g_autoptr (SwDesign) d = NULL;
  g_autoptr (GError) error = NULL;

  if (!stage_ok (self) || isnan (sw_number_field_get_value (field)))
    return;
  d = sw_document_dup_design (self->document);
  if (!sw_design_set_thrust_for_tw (d, (guint) self->selected, sw_number_field_get_value (field),
                                    &error))
    {
      sw_number_field_set_error (field, field_message (error->message));
      return;
    }
  commit (self, g_steal_pointer (&d), NULL);
}

static void
fairing_rule_cb (SwNumberField *field, SwInspector *self)
{
  g_autoptr (SwDesign) d = NULL;
  g_autoptr (GError) error = NULL;
  gboolean by_pressure = field == self->fairing_pressure_field;
  const SwDesignAscent *a;

  if (!editing_ok (self))
    return;
  a = &design (self)->ascent;
  /* Emptying the field of the rule not in force changes nothing. */
  if (isnan (sw_number_field_get_value (field))
      && !(by_pressure ? a->has_fairing_pressure : a->has_fairing_altitude))
    return;
  d = sw_document_dup_design (self->document);
  if (!sw_design_set_fairing_rule (d, by_pressure, sw_number_field_get_value (field), &error))
    {
      sw_number_field_set_error (field, field_message (error->message));
      return;
    }
  commit (self, g_steal_pointer (&d), NULL);
}

/* The name of a propellant of the user's own: committed on Enter or when
 * the field is left; a refused name is marked and changes nothing. */
static void
show_propellant_name_error (SwInspector *self, const char *message)
{
  gtk_label_set_text (self->propellant_name_message, message != NULL ? message : "");
  gtk_widget_set_visible (GTK_WIDGET (self->propellant_name_message), message != NULL);
  if (message != NULL)
    gtk_widget_add_css_class (GTK_WIDGET (self->propellant_name_entry), "error");
  else
    gtk_widget_remove_css_class (GTK_WIDGET (self->propellant_name_entry), "error");
}

static void
propellant_name_commit (SwInspector *self)
{
  g_autoptr (SwDesign) d = NULL;
  g_autoptr (GError) error = NULL;
  const char *text = gtk_editable_get_text (GTK_EDITABLE (self->propellant_name_entry));
  const SwStagePropellant *prop;

  if (!stage_ok (self))
    return;
  prop = &design (self)->stages[self->selected].propellant;
  if (prop->kind != SW_PROPELLANT_CUSTOM || g_strcmp0 (prop->custom_name, text) == 0)
    {
      show_propellant_name_error (self, NULL);
      return;
    }
  d = sw_document_dup_design (self->document);
  if (!sw_design_set_propellant_name (d, (guint) self->selected, text, &error))
    {
      show_propellant_name_error (self, field_message (error->message));
      return;
    }
  show_propellant_name_error (self, NULL);
  commit (self, g_steal_pointer (&d), NULL);
}

static void
propellant_name_leave_cb (GtkEventControllerFocus *controller, SwInspector *self)
{
  if (gtk_widget_get_mapped (GTK_WIDGET (self)))
    propellant_name_commit (self);
}

static void
show_drag_error (SwInspector *self, const char *message)
{
  gtk_label_set_text (self->drag_message, message != NULL ? message : "");
  gtk_widget_set_visible (GTK_WIDGET (self->drag_message), message != NULL);
  if (message != NULL)
    gtk_widget_add_css_class (GTK_WIDGET (self->drag_entry), "error");
  else
    gtk_widget_remove_css_class (GTK_WIDGET (self->drag_entry), "error");
}

static char
decimal_mark (void)
{
  g_autofree char *half = sw_format_number (0.5, 1);
  const char *p = strchr (half, '5');

  return p != NULL && p > half && p[-1] == ',' ? ',' : '.';
}

static void
drag_commit (SwInspector *self)
{
  g_autoptr (SwDesign) d = NULL;
  g_autoptr (GError) error = NULL;
  g_autofree char *current = NULL;
  const char *text = gtk_editable_get_text (GTK_EDITABLE (self->drag_entry));

  if (!stage_ok (self))
    return;
  current = sw_design_dup_drag_text (design (self), (guint) self->selected, decimal_mark ());
  if (g_strcmp0 (current, text) == 0)
    {
      show_drag_error (self, NULL);
      return;
    }
  d = sw_document_dup_design (self->document);
  if (!sw_design_set_drag_text (d, (guint) self->selected, text, &error))
    {
      show_drag_error (self, field_message (error->message));
      return;
    }
  show_drag_error (self, NULL);
  commit (self, g_steal_pointer (&d), NULL);
}

static void
drag_leave_cb (GtkEventControllerFocus *controller, SwInspector *self)
{
  if (gtk_widget_get_mapped (GTK_WIDGET (self)))
    drag_commit (self);
}

/* ---- the boosters ------------------------------------------------------ */

static void
booster_name_commit (SwInspector *self)
{
  g_autoptr (SwDesign) d = NULL;
  g_autoptr (GError) error = NULL;
  const char *text = gtk_editable_get_text (GTK_EDITABLE (self->booster_name_entry));

  if (!editing_ok (self) || design (self)->boosters.count == 0
      || g_strcmp0 (text, design (self)->boosters.name) == 0)
    return;
  d = sw_document_dup_design (self->document);
  if (!sw_design_set_booster_name (d, text, &error))
    {
      gtk_widget_add_css_class (GTK_WIDGET (self->booster_name_entry), "error");
      sw_widget_set_tooltip (GTK_WIDGET (self->booster_name_entry),
                                   field_message (error->message));
      return;
    }
  gtk_widget_remove_css_class (GTK_WIDGET (self->booster_name_entry), "error");
  commit (self, g_steal_pointer (&d), NULL);
}

static void
booster_name_leave_cb (GtkEventControllerFocus *controller, SwInspector *self)
{
  if (gtk_widget_get_mapped (GTK_WIDGET (self)))
    booster_name_commit (self);
}

/* The name of the boosters' own propellant: committed on Enter or when the
 * field is left; a refused name is marked (its tooltip says why) and
 * changes nothing. */
static void
booster_propellant_name_commit (SwInspector *self)
{
  g_autoptr (SwDesign) d = NULL;
  g_autoptr (GError) error = NULL;
  GtkWidget *entry = GTK_WIDGET (self->booster_propellant_name_entry);
  const char *text = gtk_editable_get_text (GTK_EDITABLE (entry));
  const SwStagePropellant *prop = &design (self)->boosters.propellant;

  if (!editing_ok (self) || design (self)->boosters.count == 0
      || prop->kind != SW_PROPELLANT_CUSTOM || g_strcmp0 (text, prop->custom_name) == 0)
    return;
  d = sw_document_dup_design (self->document);
  if (!sw_design_set_booster_propellant_name (d, text, &error))
    {
      gtk_widget_add_css_class (entry, "error");
      sw_widget_set_tooltip (entry, field_message (error->message));
      return;
    }
  gtk_widget_remove_css_class (entry, "error");
  sw_widget_set_tooltip (entry, _("The name of the boosters' own propellant"));
  commit (self, g_steal_pointer (&d), NULL);
}

static void
booster_propellant_name_leave_cb (GtkEventControllerFocus *controller, SwInspector *self)
{
  if (gtk_widget_get_mapped (GTK_WIDGET (self)))
    booster_propellant_name_commit (self);
}

static void
booster_crossfeed_cb (SwInspector *self)
{
  g_autoptr (SwDesign) d = NULL;
  g_autoptr (GError) error = NULL;
  gboolean on = gtk_check_button_get_active (self->booster_crossfeed_check);

  if (!editing_ok (self) || on == design (self)->boosters.crossfeed)
    return;
  d = sw_document_dup_design (self->document);
  if (!sw_design_set_booster_crossfeed (d, on, &error))
    {
      self->updating++;
      gtk_check_button_set_active (self->booster_crossfeed_check, design (self)->boosters.crossfeed);
      self->updating--;
      sw_widget_set_tooltip (GTK_WIDGET (self->booster_crossfeed_check), error->message);
      return;
    }
  commit (self, g_steal_pointer (&d), NULL);
}

static void
booster_propellant_cb (SwInspector *self)
{
  g_autoptr (SwDesign) d = NULL;
  g_autoptr (GError) error = NULL;
  guint selected = gtk_drop_down_get_selected (self->booster_propellant_dropdown);

  if (!editing_ok (self) || selected >= SW_N_PROPELLANTS
      || selected == design (self)->boosters.propellant.kind)
    return;
  d = sw_document_dup_design (self->document);
  if (!sw_design_set_booster_propellant (d, (SwPropellantKind) selected, &error))
    {
      self->updating++;
      gtk_drop_down_set_selected (self->booster_propellant_dropdown,
                                  design (self)->boosters.propellant.kind);
      self->updating--;
      sw_widget_set_tooltip (GTK_WIDGET (self->booster_propellant_dropdown),
                                   error->message);
      return;
    }
  commit (self, g_steal_pointer (&d), NULL);
}

static void
build_boosters (SwInspector *self, GtkWidget *box)
{
  GtkGrid *grid;
  GtkEventController *controller;
  int row = 0;
  const char *tip;

  gtk_box_append (GTK_BOX (box), section_title (_("Strap-on boosters")));
  grid = new_grid ();
  self->booster_count_field = add_number_row (self, grid, 0, _("Number of _boosters"),
                                              _("Boosters beside the first stage (the core), "
                                                "lit at liftoff and dropped at their burnout; "
                                                "0 for none. They need the first stage's "
                                                "thrust"),
                                              SW_FIELD_BOOSTER_COUNT, 0, 0, 1.0, NULL);
  gtk_box_append (GTK_BOX (box), GTK_WIDGET (grid));

  self->booster_box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 0);
  grid = new_grid ();
  self->booster_name_entry = GTK_ENTRY (gtk_entry_new ());
  gtk_editable_set_enable_undo (GTK_EDITABLE (self->booster_name_entry), FALSE);
  tip = _("The boosters' name, shown in the tables and the stack");
  sw_widget_set_tooltip (GTK_WIDGET (self->booster_name_entry), tip);
  g_signal_connect_swapped (self->booster_name_entry, "activate",
                            G_CALLBACK (booster_name_commit), self);
  controller = gtk_event_controller_focus_new ();
  g_signal_connect (controller, "leave", G_CALLBACK (booster_name_leave_cb), self);
  gtk_widget_add_controller (GTK_WIDGET (self->booster_name_entry), controller);
  gtk_grid_attach (grid, caption (_("Name"), tip, GTK_WIDGET (self->booster_name_entry)),
                   0, row, 1, 1);
  gtk_grid_attach (grid, GTK_WIDGET (self->booster_name_entry), 1, row++, 2, 1);
  self->booster_isp_vac_field = add_number_row (self, grid, row++, _("Vacuum Isp"),
                                                _("The boosters' specific impulse in vacuum"),
                                                SW_FIELD_BOOSTER_ISP_VAC, 0, 1, 1.0, NULL);
  self->booster_isp_sl_field = add_number_row (self, grid, row++, _("Sea-level Isp"),
                                               _("The boosters' specific impulse at sea level "
                                                 "(their thrust at liftoff); left empty, the "
                                                 "vacuum Isp"),
                                               SW_FIELD_BOOSTER_ISP_SL, 0, 1, 1.0,
                                               _("as in vacuum"));
  self->booster_eps_field = add_number_row (self, grid, row++, _("Structural coefficient"),
                                            _("eps = structure / (structure + propellant) of "
                                              "one booster"),
                                            SW_FIELD_BOOSTER_STRUCTURAL_COEFFICIENT, 0, 4, 0.005,
                                            NULL);
  self->booster_thrust_field = add_number_row (self, grid, row++, _("Thrust per booster"),
                                               _("Vacuum thrust of one booster; with the "
                                                 "propellant it sets the burn time"),
                                               SW_FIELD_BOOSTER_THRUST_VAC, 0, 1, 10.0, NULL);
  self->booster_load_field = add_number_row (self, grid, row++, _("Fixed load per booster"),
                                             _("The propellant of one booster that exists; left "
                                               "empty, the boosters are sized with the stages "
                                               "for the least liftoff mass"),
                                             SW_FIELD_BOOSTER_PROPELLANT_LOAD, 0, 0, 100.0,
                                             _("sized"));
  self->booster_diameter_field = add_number_row (self, grid, row++, _("Diameter"),
                                                 _("Outer diameter of one booster: its drag "
                                                   "area; left empty, half the core's"),
                                                 SW_FIELD_BOOSTER_DIAMETER, 0, 2, 0.1,
                                                 _("half the core's"));
  self->booster_crossfeed_check = GTK_CHECK_BUTTON (
    gtk_check_button_new_with_label (_("Crossfeed: the boosters feed the core's engines")));
  sw_widget_set_tooltip (GTK_WIDGET (self->booster_crossfeed_check),
                               _("While the boosters burn, the core's engines draw on their "
                                 "propellant, so the core starts its own burn full"));
  g_signal_connect_swapped (self->booster_crossfeed_check, "notify::active",
                            G_CALLBACK (booster_crossfeed_cb), self);
  gtk_grid_attach (grid, GTK_WIDGET (self->booster_crossfeed_check), 0, row++, 3, 1);
  {
    const char *const propellants[] = {
      _("not given"), _("LOX / kerosene"), _("LOX / hydrogen"), _("LOX / methane"),
      _("N2O4 / UDMH"), _("N2O4 / MMH"), _("Composite solid"), _("Your own (densities below)"),
      NULL
    };
    tip = _("What the boosters burn: with it and a diameter their tank volume and length "
            "follow");
    self->booster_propellant_dropdown = GTK_DROP_DOWN (gtk_drop_down_new_from_strings (propellants));
    sw_widget_set_tooltip (GTK_WIDGET (self->booster_propellant_dropdown), tip);
    g_signal_connect_swapped (self->booster_propellant_dropdown, "notify::selected",
                              G_CALLBACK (booster_propellant_cb), self);
    gtk_grid_attach (grid, caption (_("Propellant"), tip,
                                    GTK_WIDGET (self->booster_propellant_dropdown)),
                     0, row, 1, 1);
    gtk_grid_attach (grid, GTK_WIDGET (self->booster_propellant_dropdown), 1, row++, 2, 1);
  }
  self->booster_propellant_name_entry = GTK_ENTRY (gtk_entry_new ());
  gtk_editable_set_enable_undo (GTK_EDITABLE (self->booster_propellant_name_entry), FALSE);
  tip = _("The name of the boosters' own propellant");
  sw_widget_set_tooltip (GTK_WIDGET (self->booster_propellant_name_entry), tip);
  g_signal_connect_swapped (self->booster_propellant_name_entry, "activate",
                            G_CALLBACK (booster_propellant_name_commit), self);
  controller = gtk_event_controller_focus_new ();
  g_signal_connect (controller, "leave", G_CALLBACK (booster_propellant_name_leave_cb), self);
  gtk_widget_add_controller (GTK_WIDGET (self->booster_propellant_name_entry), controller);
  gtk_grid_attach (grid, caption (_("Propellant name"), tip,
                                  GTK_WIDGET (self->booster_propellant_name_entry)),
                   0, row, 1, 1);
  gtk_grid_attach (grid, GTK_WIDGET (self->booster_propellant_name_entry), 1, row++, 2, 1);
  self->booster_mixture_field = add_number_row (self, grid, row++, _("Mixture ratio O/F"),
                                                _("Oxidizer over fuel by mass, in place of the "
                                                  "propellant's own"),
                                                SW_FIELD_BOOSTER_MIXTURE_RATIO, 0, 2, 0.1,
                                                _("the propellant's"));
  self->booster_ullage_field = add_number_row (self, grid, row++, _("Ullage fraction"),
                                               _("Tank volume beyond the propellant's, as a "
                                                 "fraction of it"),
                                               SW_FIELD_BOOSTER_ULLAGE, 0, 3, 0.01, "0.03");
  self->booster_oxidizer_field = add_number_row (self, grid, row++, _("Oxidizer density"),
                                                 _("Density of the oxidizer of a propellant of "
                                                   "your own"),
                                                 SW_FIELD_BOOSTER_OXIDIZER_DENSITY, 0, 2, 10.0,
                                                 NULL);
  sw_number_field_set_optional (self->booster_oxidizer_field, TRUE, _("catalogue"));
  self->booster_fuel_field = add_number_row (self, grid, row++, _("Fuel density"),
                                             _("Density of the fuel of a propellant of your "
                                               "own"),
                                             SW_FIELD_BOOSTER_FUEL_DENSITY, 0, 2, 10.0, NULL);
  sw_number_field_set_optional (self->booster_fuel_field, TRUE, _("catalogue"));
  gtk_box_append (GTK_BOX (self->booster_box), GTK_WIDGET (grid));
  gtk_box_append (GTK_BOX (box), self->booster_box);
}

static void
update_boosters (SwInspector *self, const SwDesign *d)
{
  const SwBoosters *b = &d->boosters;
  gboolean on = b->count > 0;
  double v;

  sw_number_field_set_value (self->booster_count_field, (double) b->count);
  gtk_widget_set_visible (self->booster_box, on);
  if (!on)
    return;
  self->updating++;
  if (g_strcmp0 (gtk_editable_get_text (GTK_EDITABLE (self->booster_name_entry)), b->name) != 0
      && !focus_within (GTK_WIDGET (self->booster_name_entry)))
    gtk_editable_set_text (GTK_EDITABLE (self->booster_name_entry), b->name);
  gtk_check_button_set_active (self->booster_crossfeed_check, b->crossfeed);
  gtk_drop_down_set_selected (self->booster_propellant_dropdown, b->propellant.kind);
  {
    GtkWidget *entry = GTK_WIDGET (self->booster_propellant_name_entry);
    const char *name = b->propellant.kind == SW_PROPELLANT_CUSTOM ? b->propellant.custom_name : "";

    gtk_widget_set_sensitive (entry, b->propellant.kind == SW_PROPELLANT_CUSTOM);
    if (g_strcmp0 (gtk_editable_get_text (GTK_EDITABLE (entry)), name) != 0
        && (b->propellant.kind != SW_PROPELLANT_CUSTOM || !focus_within (entry)))
      {
        gtk_editable_set_text (GTK_EDITABLE (entry), name);
        gtk_widget_remove_css_class (entry, "error");
      }
  }
  self->updating--;
#define SHOW(field, key) \
  sw_number_field_set_value (field, sw_design_field_get (d, key, 0, &v) ? v : NAN)
  SHOW (self->booster_isp_vac_field, SW_FIELD_BOOSTER_ISP_VAC);
  SHOW (self->booster_isp_sl_field, SW_FIELD_BOOSTER_ISP_SL);
  SHOW (self->booster_eps_field, SW_FIELD_BOOSTER_STRUCTURAL_COEFFICIENT);
  SHOW (self->booster_thrust_field, SW_FIELD_BOOSTER_THRUST_VAC);
  SHOW (self->booster_load_field, SW_FIELD_BOOSTER_PROPELLANT_LOAD);
  SHOW (self->booster_diameter_field, SW_FIELD_BOOSTER_DIAMETER);
  SHOW (self->booster_mixture_field, SW_FIELD_BOOSTER_MIXTURE_RATIO);
  SHOW (self->booster_ullage_field, SW_FIELD_BOOSTER_ULLAGE);
  SHOW (self->booster_oxidizer_field, SW_FIELD_BOOSTER_OXIDIZER_DENSITY);
  SHOW (self->booster_fuel_field, SW_FIELD_BOOSTER_FUEL_DENSITY);
#undef SHOW
  gtk_widget_set_sensitive (GTK_WIDGET (self->booster_mixture_field),
                            b->propellant.kind != SW_PROPELLANT_NONE
                            && b->propellant.kind != SW_PROPELLANT_SOLID_COMPOSITE);
  gtk_widget_set_sensitive (GTK_WIDGET (self->booster_oxidizer_field),
                            b->propellant.kind == SW_PROPELLANT_CUSTOM);
  gtk_widget_set_sensitive (GTK_WIDGET (self->booster_fuel_field),
                            b->propellant.kind == SW_PROPELLANT_CUSTOM);
}

static void
build_sections (SwInspector *self)
{
  GtkWidget *box = self->content_box;
  GtkGrid *grid;
  GtkWidget *frame, *label, *button, *intro_text;
  GtkEventController *controller;
  int row;

  /* First start and the notes, at the top. */
  self->intro_box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 6);
  gtk_widget_add_css_class (self->intro_box, "sw-intro");
  intro_text = gtk_label_new (_("This is a demonstration design, opened as an unsaved copy. "
                                "Its notes below say what it is. Edit it, or start your own."));
  gtk_label_set_wrap (GTK_LABEL (intro_text), TRUE);
  gtk_label_set_xalign (GTK_LABEL (intro_text), 0.0);
  gtk_label_set_max_width_chars (GTK_LABEL (intro_text), 30);
  button = gtk_button_new_with_mnemonic (_("_New design"));
  gtk_actionable_set_action_name (GTK_ACTIONABLE (button), "design.new");
  gtk_widget_set_halign (button, GTK_ALIGN_START);
  gtk_box_append (GTK_BOX (self->intro_box), intro_text);
  gtk_box_append (GTK_BOX (self->intro_box), button);
  gtk_widget_set_visible (self->intro_box, FALSE);
  gtk_box_prepend (GTK_BOX (box), self->intro_box);

  label = section_title (_("Notes"));
  gtk_widget_set_margin_top (label, 0);
  gtk_box_insert_child_after (GTK_BOX (box), label, self->intro_box);
  self->notes_view = GTK_TEXT_VIEW (gtk_text_view_new ());
  gtk_text_view_set_wrap_mode (self->notes_view, GTK_WRAP_WORD_CHAR);
  gtk_text_view_set_left_margin (self->notes_view, 6);
  gtk_text_view_set_right_margin (self->notes_view, 6);
  gtk_text_view_set_top_margin (self->notes_view, 4);
  gtk_text_view_set_bottom_margin (self->notes_view, 4);
  gtk_widget_set_size_request (GTK_WIDGET (self->notes_view), -1, 64);
  sw_widget_set_tooltip (GTK_WIDGET (self->notes_view),
                               _("What the design is and where its numbers come from; saved in "
                                 "the file"));
  gtk_accessible_update_property (GTK_ACCESSIBLE (self->notes_view),
                                  GTK_ACCESSIBLE_PROPERTY_LABEL, _("Notes"), -1);
  controller = gtk_event_controller_focus_new ();
  g_signal_connect (controller, "leave", G_CALLBACK (notes_leave_cb), self);
  gtk_widget_add_controller (GTK_WIDGET (self->notes_view), controller);
  frame = gtk_frame_new (NULL);
  gtk_frame_set_child (GTK_FRAME (frame), GTK_WIDGET (self->notes_view));
  gtk_box_insert_child_after (GTK_BOX (box), frame, label);
  self->notes_message = GTK_LABEL (gtk_label_new (NULL));
  gtk_label_set_wrap (self->notes_message, TRUE);
  gtk_widget_add_css_class (GTK_WIDGET (self->notes_message), "error");
  gtk_widget_set_visible (GTK_WIDGET (self->notes_message), FALSE);
  gtk_box_insert_child_after (GTK_BOX (box), GTK_WIDGET (self->notes_message), frame);

  /* The loss model, in the mission grid under the losses. */
  self->loss_model_label = caption (_("Losses _from"),
                                    _("An allowance you give, or the losses of the simulated "
                                      "ascent, sized in a closed loop"), NULL);
  self->loss_model_dropdown = GTK_DROP_DOWN (gtk_drop_down_new_from_strings (
    (const char *const[]) { _("Allowance above"), _("Simulated ascent"), NULL }));
  gtk_label_set_mnemonic_widget (GTK_LABEL (self->loss_model_label),
                                 GTK_WIDGET (self->loss_model_dropdown));
  sw_widget_set_tooltip (GTK_WIDGET (self->loss_model_dropdown),
                               gtk_widget_get_tooltip_text (self->loss_model_label));
  g_signal_connect_swapped (self->loss_model_dropdown, "notify::selected",
                            G_CALLBACK (loss_model_changed_cb), self);
  {
    GtkGrid *mission = GTK_GRID (gtk_widget_get_parent (GTK_WIDGET (self->losses_spin)));
    gtk_grid_attach (mission, self->loss_model_label, 0, 9, 1, 1);
    gtk_grid_attach (mission, GTK_WIDGET (self->loss_model_dropdown), 1, 9, 2, 1);
  }

  /* The selected stage: propulsion and shape, reliability. */
  self->stage_extra = gtk_box_new (GTK_ORIENTATION_VERTICAL, 6);
  gtk_box_append (GTK_BOX (box), self->stage_extra);
  gtk_box_append (GTK_BOX (self->stage_extra), section_title (_("Propulsion and shape")));
  grid = new_grid ();
  row = 0;
  self->thrust_field = add_number_row (self, grid, row++, _("_Thrust, total"),
                                       _("Vacuum thrust of the whole stage; or give it per "
                                         "engine below"), SW_N_FIELDS, SW_LIMIT_THRUST_VAC, 1,
                                       10.0, _("not given"));
  sw_number_field_set_optional (self->thrust_field, TRUE, _("not given"));
  g_signal_connect (self->thrust_field, "value-committed", G_CALLBACK (thrust_cb), self);
  self->engine_count_field = add_number_row (self, grid, row++, _("_Engines"),
                                             _("Number of engines in the stage (also used by "
                                               "the reliability model)"),
                                             SW_FIELD_ENGINE_COUNT, 0, 0, 1.0, "1");
  self->engine_thrust_field = add_number_row (self, grid, row++, _("Thrust per en_gine"),
                                              _("Vacuum thrust of one engine; the stage's "
                                                "thrust is this times the engines"),
                                              SW_N_FIELDS, SW_LIMIT_ENGINE_THRUST_VAC, 1, 10.0,
                                              _("not given"));
  sw_number_field_set_optional (self->engine_thrust_field, TRUE, _("not given"));
  g_signal_connect (self->engine_thrust_field, "value-committed", G_CALLBACK (thrust_cb), self);
  self->tw_field = add_number_row (self, grid, row++, _("T/W at _ignition"),
                                   _("Vacuum thrust over the weight of the stage and everything "
                                     "above it at ignition. Type a value to set the thrust from "
                                     "it; common practice is 1.2 to 1.5 at liftoff and 0.6 to "
                                     "1.2 for an upper stage"),
                                   SW_N_FIELDS, SW_N_LIMITS, 2, 0.05, NULL);
  sw_number_field_set_range (self->tw_field, 0.0, SW_TW_MAX, TRUE, "", 2, 0.05);
  self->tw_caption = GTK_LABEL (gtk_grid_get_child_at (grid, 0, row - 1));
  self->tw_note = GTK_LABEL (gtk_grid_get_child_at (grid, 2, row - 1));
  gtk_label_set_wrap (self->tw_note, TRUE);
  gtk_label_set_max_width_chars (self->tw_note, 9);
  g_signal_connect (self->tw_field, "value-committed", G_CALLBACK (tw_cb), self);
  self->diameter_field = add_number_row (self, grid, row++, _("_Diameter"),
                                         _("Outer diameter, the drag reference area; an upper "
                                           "stage without one takes the diameter below"),
                                         SW_FIELD_DIAMETER, 0, 2, 0.1, _("as below"));
  self->coast_field = add_number_row (self, grid, row++, _("_Coast before ignition"),
                                      _("Unpowered flight from the separation below to this "
                                        "stage's ignition; not for the first stage"),
                                      SW_FIELD_COAST, 0, 1, 1.0, _("none"));
  {
    /* SwPropellantKind order. */
    const char *const propellants[] = {
      _("not given"), _("LOX / kerosene"), _("LOX / hydrogen"), _("LOX / methane"),
      _("N2O4 / UDMH"), _("N2O4 / MMH"), _("Composite solid"), _("Your own (densities below)"),
      NULL
    };
    const char *tip = _("What the stage burns: with it and a diameter the window knows the "
                        "stage's tank volumes and length");
    self->propellant_dropdown = GTK_DROP_DOWN (gtk_drop_down_new_from_strings (propellants));
    sw_widget_set_tooltip (GTK_WIDGET (self->propellant_dropdown), tip);
    g_signal_connect_swapped (self->propellant_dropdown, "notify::selected",
                              G_CALLBACK (propellant_changed_cb), self);
    gtk_grid_attach (grid, caption (_("Propellant"), tip, GTK_WIDGET (self->propellant_dropdown)),
                     0, row, 1, 1);
    gtk_grid_attach (grid, GTK_WIDGET (self->propellant_dropdown), 1, row++, 2, 1);
  }
  {
    GtkEventController *name_focus = gtk_event_controller_focus_new ();
    const char *tip = _("The name of your own propellant, as the file and the sheet give it");

    self->propellant_name_entry = GTK_ENTRY (gtk_entry_new ());
    gtk_editable_set_enable_undo (GTK_EDITABLE (self->propellant_name_entry), FALSE);
    sw_widget_set_tooltip (GTK_WIDGET (self->propellant_name_entry), tip);
    g_signal_connect_swapped (self->propellant_name_entry, "activate",
                              G_CALLBACK (propellant_name_commit), self);
    g_signal_connect (name_focus, "leave", G_CALLBACK (propellant_name_leave_cb), self);
    gtk_widget_add_controller (GTK_WIDGET (self->propellant_name_entry), name_focus);
    gtk_grid_attach (grid, caption (_("Propellant na_me"), tip,
                                    GTK_WIDGET (self->propellant_name_entry)), 0, row, 1, 1);
    gtk_grid_attach (grid, GTK_WIDGET (self->propellant_name_entry), 1, row++, 2, 1);
    self->propellant_name_message = GTK_LABEL (gtk_label_new (NULL));
    gtk_label_set_wrap (self->propellant_name_message, TRUE);
    gtk_label_set_xalign (self->propellant_name_message, 0.0);
    gtk_widget_add_css_class (GTK_WIDGET (self->propellant_name_message), "error");
    gtk_widget_set_visible (GTK_WIDGET (self->propellant_name_message), FALSE);
    gtk_grid_attach (grid, GTK_WIDGET (self->propellant_name_message), 1, row++, 2, 1);
  }
  self->propellant_load_field = add_number_row (self, grid, row++, _("Fixed propellant load"),
                                                _("The propellant of a stage that exists: the "
                                                  "stage is not sized, its structure follows "
                                                  "from its structural coefficient"),
                                                SW_FIELD_PROPELLANT_LOAD, 0, 0, 100.0,
                                                _("sized"));
  self->mixture_ratio_field = add_number_row (self, grid, row++, _("Mixture ratio O/F"),
                                              _("Oxidizer over fuel by mass, in place of the "
                                                "propellant's own"),
                                              SW_FIELD_MIXTURE_RATIO, 0, 2, 0.1,
                                              _("the propellant's"));
  self->ullage_field = add_number_row (self, grid, row++, _("Ullage fraction"),
                                       _("Tank volume beyond the propellant's, as a fraction of "
                                         "it; 0.02 to 0.05 is common practice"),
                                       SW_FIELD_ULLAGE, 0, 3, 0.01, "0.03");
  self->oxidizer_density_field = add_number_row (self, grid, row++, _("Oxidizer density"),
                                                 _("Density of the oxidizer of a propellant of "
                                                   "your own"),
                                                 SW_FIELD_OXIDIZER_DENSITY, 0, 2, 10.0, NULL);
  sw_number_field_set_optional (self->oxidizer_density_field, TRUE, _("catalogue"));
  self->fuel_density_field = add_number_row (self, grid, row++, _("Fuel density"),
                                             _("Density of the fuel of a propellant of your own"),
                                             SW_FIELD_FUEL_DENSITY, 0, 2, 10.0, NULL);
  sw_number_field_set_optional (self->fuel_density_field, TRUE, _("catalogue"));
  {
    const char *tip = _("Tank volume (propellant and ullage), the propellant's volume, and "
                        "the stage's length with tanks, intertank and engine section; the "
                        "working shows each part");
    self->tanks_label = GTK_LABEL (gtk_label_new (SW_NO_VALUE));
    gtk_label_set_xalign (self->tanks_label, 0.0);
    gtk_label_set_wrap (self->tanks_label, TRUE);
    gtk_label_set_max_width_chars (self->tanks_label, 24);
    gtk_widget_set_margin_top (GTK_WIDGET (self->tanks_label), 8);
    sw_widget_set_tooltip (GTK_WIDGET (self->tanks_label), tip);
    gtk_grid_attach (grid, caption (_("Tanks"), tip, NULL), 0, row, 1, 1);
    gtk_grid_attach (grid, GTK_WIDGET (self->tanks_label), 1, row++, 2, 1);
  }
  self->drag_entry = GTK_ENTRY (gtk_entry_new ());
  gtk_entry_set_placeholder_text (self->drag_entry, _("generic slender-vehicle table"));
  gtk_editable_set_enable_undo (GTK_EDITABLE (self->drag_entry), FALSE);
  sw_widget_set_tooltip (GTK_WIDGET (self->drag_entry),
                               _("Drag coefficient against Mach number as mach:cd pairs "
                                 "separated by ';', Mach increasing, e.g. 0:0.3; 1.1:0.55; "
                                 "4:0.25. Empty: the generic table"));
  g_signal_connect_swapped (self->drag_entry, "activate", G_CALLBACK (drag_commit), self);
  controller = gtk_event_controller_focus_new ();
  g_signal_connect (controller, "leave", G_CALLBACK (drag_leave_cb), self);
  gtk_widget_add_controller (GTK_WIDGET (self->drag_entry), controller);
  gtk_grid_attach (grid, caption (_("D_rag (mach:cd)"),
                                  gtk_widget_get_tooltip_text (GTK_WIDGET (self->drag_entry)),
                                  GTK_WIDGET (self->drag_entry)), 0, row, 1, 1);
  gtk_grid_attach (grid, GTK_WIDGET (self->drag_entry), 1, row++, 2, 1);
  self->drag_message = GTK_LABEL (gtk_label_new (NULL));
  gtk_label_set_wrap (self->drag_message, TRUE);
  gtk_label_set_xalign (self->drag_message, 0.0);
  gtk_widget_add_css_class (GTK_WIDGET (self->drag_message), "error");
  gtk_widget_set_visible (GTK_WIDGET (self->drag_message), FALSE);
  gtk_grid_attach (grid, GTK_WIDGET (self->drag_message), 1, row++, 2, 1);
  gtk_box_append (GTK_BOX (self->stage_extra), GTK_WIDGET (grid));

  gtk_box_append (GTK_BOX (self->stage_extra), section_title (_("Reliability")));
  grid = new_grid ();
  row = 0;
  self->engine_rel_field = add_number_row (self, grid, row++, _("Engine re_liability"),
                                           _("Probability that one engine runs its burn"),
                                           SW_FIELD_ENGINE_RELIABILITY, 0, 4, 0.001, "1");
  self->failures_field = add_number_row (self, grid, row++, _("Engine _failures tolerated"),
                                         _("Engine failures the stage survives; fewer than its "
                                           "engines"), SW_FIELD_FAILURES_TOLERATED, 0, 0, 1.0,
                                         "0");
  self->ignition_rel_field = add_number_row (self, grid, row++, _("I_gnition reliability"),
                                             _("Probability that the stage's start sequence "
                                               "succeeds"), SW_FIELD_IGNITION_RELIABILITY, 0, 4,
                                             0.001, "1");
  self->separation_rel_field = add_number_row (self, grid, row++, _("Se_paration reliability"),
                                               _("Probability that the staging event above this "
                                                 "stage succeeds (ignored for the top stage)"),
                                               SW_FIELD_SEPARATION_RELIABILITY, 0, 4, 0.001,
                                               "1");
  gtk_box_append (GTK_BOX (self->stage_extra), GTK_WIDGET (grid));

  /* The design's ascent settings. */
  gtk_box_append (GTK_BOX (box), section_title (_("Ascent")));
  grid = new_grid ();
  row = 0;
  self->fairing_mass_field = add_number_row (self, grid, row++, _("Fairing _mass"),
                                             _("Payload fairing carried on top of the vehicle "
                                               "until it is dropped"), SW_FIELD_FAIRING_MASS, 0,
                                             0, 10.0, _("none"));
  self->fairing_altitude_field = add_number_row (self, grid, row++, _("Drop fairing at _altitude"),
                                                 _("Altitude at which the fairing is dropped; "
                                                   "common practice is near 100 to 120 km. "
                                                   "Replaces a dynamic-pressure rule"),
                                                 SW_N_FIELDS, SW_LIMIT_FAIRING_ALTITUDE, 1, 1.0,
                                                 NULL);
  sw_number_field_set_optional (self->fairing_altitude_field, TRUE, _("not this rule"));
  g_signal_connect (self->fairing_altitude_field, "value-committed",
                    G_CALLBACK (fairing_rule_cb), self);
  self->fairing_pressure_field = add_number_row (self, grid, row++,
                                                 _("…or below _dynamic pressure"),
                                                 _("The fairing is dropped when the dynamic "
                                                   "pressure falls below this value after max-Q. "
                                                   "Replaces an altitude rule"),
                                                 SW_N_FIELDS, SW_LIMIT_FAIRING_DYNAMIC_PRESSURE,
                                                 0, 10.0, NULL);
  sw_number_field_set_optional (self->fairing_pressure_field, TRUE, _("not this rule"));
  g_signal_connect (self->fairing_pressure_field, "value-committed",
                    G_CALLBACK (fairing_rule_cb), self);
  self->pitch_over_field = add_number_row (self, grid, row++, _("Pitch-o_ver speed"),
                                           _("Speed relative to the air at which the vertical "
                                             "rise ends and the pitch-over begins"),
                                           SW_FIELD_PITCH_OVER_SPEED, 0, 0, 1.0, "50");
  self->pitch_kick_field = add_number_row (self, grid, row++, _("Pitch _kick"),
                                           _("Tilt of the thrust at the pitch-over; left empty, "
                                             "the solver picks the one that costs least delta-v"),
                                           SW_FIELD_PITCH_KICK, 0, 2, 0.1, _("automatic"));
  self->insertion_field = add_number_row (self, grid, row++, _("In_sertion altitude"),
                                          _("Perigee of a transfer orbit up to the target, "
                                            "circularised at apogee; left empty, direct "
                                            "insertion"), SW_FIELD_INSERTION_ALTITUDE, 0, 0,
                                          10.0, _("direct"));
  self->max_q_alpha_field = add_number_row (self, grid, row++, _("Max _q·α"),
                                            _("The guided flight keeps the dynamic pressure "
                                              "times the angle of attack below this; left "
                                              "empty, no such limit"),
                                            SW_FIELD_MAX_Q_ALPHA, 0, 0, 10.0, _("no limit"));
  gtk_box_append (GTK_BOX (box), GTK_WIDGET (grid));

  build_boosters (self, box);
}

static gboolean
focus_within (GtkWidget *widget)
{
  GtkRoot *root = gtk_widget_get_root (widget);
  GtkWidget *focus = root != NULL ? gtk_root_get_focus (root) : NULL;

  return focus != NULL && (focus == widget || gtk_widget_is_ancestor (focus, widget));
}

static void
update_extra_stage_fields (SwInspector *self, const SwDesign *d, guint i, gboolean reset)
{
  const SwStage *s = &d->stages[i];
  void (*show) (SwNumberField *, double) = reset ? sw_number_field_reset : sw_number_field_set_value;
  double v, with;
  g_autofree char *drag = sw_design_dup_drag_text (d, i, decimal_mark ());

  show (self->thrust_field, s->propulsion.has_thrust ? s->propulsion.thrust_vac_kn : NAN);
  {
    /* Given per engine, the total it makes shows as the placeholder. */
    double total = sw_stage_thrust_vac_n (&s->propulsion, s->reliability.has_engine_count
                                                          ? s->reliability.engine_count : 1);
    g_autofree char *num = isfinite (total) ? sw_format_number (total / 1000.0, 1) : NULL;
    /* Translators: placeholder of the total thrust when it is given per engine */
    g_autofree char *from = num != NULL ? g_strdup_printf (_("%s from the engines"), num) : NULL;
    sw_number_field_set_optional (self->thrust_field, TRUE,
                                  s->propulsion.has_engine_thrust ? from : _("not given"));
  }
  show (self->engine_thrust_field,
        s->propulsion.has_engine_thrust ? s->propulsion.engine_thrust_vac_kn : NAN);
  show (self->engine_count_field,
        sw_design_field_get (d, SW_FIELD_ENGINE_COUNT, i, &v) ? v : NAN);
  show (self->tw_field, sw_design_stage_tw (d, i, &with));
  if (i == 0 && d->boosters.count > 0)
    {
      /* The field is the core's thrust alone over the whole vehicle at
       * liftoff; the cluster's figure (boosters' thrust too) goes beside it. */
      g_autofree char *ratio = sw_format_ratio (with, 2);
      /* Translators: beside the core's own T/W field, %s is the liftoff
       * thrust-to-weight with the boosters ("1.71") */
      g_autofree char *note = isfinite (with) ? g_strdup_printf (_("with boosters %s"), ratio)
                                              : g_strdup ("");
      const char *tip = _("The core's vacuum thrust alone over the weight of the whole vehicle "
                          "at liftoff, boosters included; beside it, the same with the "
                          "boosters' vacuum thrust added. Type a value to set the core's thrust "
                          "from it; the boosters' thrust is not changed");

      gtk_label_set_text_with_mnemonic (self->tw_caption, _("T/W at _ignition, core alone"));
      sw_widget_set_tooltip (GTK_WIDGET (self->tw_caption), tip);
      sw_widget_set_tooltip (GTK_WIDGET (self->tw_field), tip);
      gtk_label_set_text (self->tw_note, note);
    }
  else
    {
      const char *tip = _("Vacuum thrust over the weight of the stage and everything above it "
                          "at ignition. Type a value to set the thrust from it; common practice "
                          "is 1.2 to 1.5 at liftoff and 0.6 to 1.2 for an upper stage");

      gtk_label_set_text_with_mnemonic (self->tw_caption, _("T/W at _ignition"));
      sw_widget_set_tooltip (GTK_WIDGET (self->tw_caption), tip);
      sw_widget_set_tooltip (GTK_WIDGET (self->tw_field), tip);
      gtk_label_set_text (self->tw_note, "");
    }
  show (self->diameter_field, sw_design_field_get (d, SW_FIELD_DIAMETER, i, &v) ? v : NAN);
  show (self->coast_field, sw_design_field_get (d, SW_FIELD_COAST, i, &v) ? v : NAN);
  gtk_widget_set_sensitive (GTK_WIDGET (self->coast_field), i > 0);
  self->updating++;
  gtk_drop_down_set_selected (self->propellant_dropdown, s->propellant.kind);
  self->updating--;
  show (self->propellant_load_field,
        sw_design_field_get (d, SW_FIELD_PROPELLANT_LOAD, i, &v) ? v : NAN);
  show (self->mixture_ratio_field,
        sw_design_field_get (d, SW_FIELD_MIXTURE_RATIO, i, &v) ? v : NAN);
  show (self->ullage_field, sw_design_field_get (d, SW_FIELD_ULLAGE, i, &v) ? v : NAN);
  show (self->oxidizer_density_field,
        sw_design_field_get (d, SW_FIELD_OXIDIZER_DENSITY, i, &v) ? v : NAN);
  show (self->fuel_density_field,
        sw_design_field_get (d, SW_FIELD_FUEL_DENSITY, i, &v) ? v : NAN);
  gtk_widget_set_sensitive (GTK_WIDGET (self->mixture_ratio_field),
                            s->propellant.kind != SW_PROPELLANT_NONE
                            && s->propellant.kind != SW_PROPELLANT_SOLID_COMPOSITE);
  gtk_widget_set_sensitive (GTK_WIDGET (self->propellant_name_entry),
                            s->propellant.kind == SW_PROPELLANT_CUSTOM);
  if (s->propellant.kind != SW_PROPELLANT_CUSTOM
      || !gtk_widget_has_focus (GTK_WIDGET (self->propellant_name_entry))
      || GPOINTER_TO_INT (g_object_get_data (G_OBJECT (self->propellant_name_entry),
                                             "sw-stage-shown")) != (int) i + 1)
    {
      const char *name = s->propellant.kind == SW_PROPELLANT_CUSTOM ? s->propellant.custom_name
                                                                     : "";
      if (g_strcmp0 (gtk_editable_get_text (GTK_EDITABLE (self->propellant_name_entry)), name)
          != 0)
        gtk_editable_set_text (GTK_EDITABLE (self->propellant_name_entry), name);
      show_propellant_name_error (self, NULL);
    }
  g_object_set_data (G_OBJECT (self->propellant_name_entry), "sw-stage-shown",
                     GINT_TO_POINTER ((int) i + 1));
  gtk_widget_set_sensitive (GTK_WIDGET (self->oxidizer_density_field),
                            s->propellant.kind == SW_PROPELLANT_CUSTOM);
  gtk_widget_set_sensitive (GTK_WIDGET (self->fuel_density_field),
                            s->propellant.kind == SW_PROPELLANT_CUSTOM);
  show (self->engine_rel_field,
        sw_design_field_get (d, SW_FIELD_ENGINE_RELIABILITY, i, &v) ? v : NAN);
  show (self->failures_field,
        sw_design_field_get (d, SW_FIELD_FAILURES_TOLERATED, i, &v) ? v : NAN);
  show (self->ignition_rel_field,
        sw_design_field_get (d, SW_FIELD_IGNITION_RELIABILITY, i, &v) ? v : NAN);
  show (self->separation_rel_field,
        sw_design_field_get (d, SW_FIELD_SEPARATION_RELIABILITY, i, &v) ? v : NAN);
  if ((reset || gtk_widget_get_visible (GTK_WIDGET (self->drag_message)) == FALSE)
      && g_strcmp0 (gtk_editable_get_text (GTK_EDITABLE (self->drag_entry)), drag) != 0
      && (reset || !focus_within (GTK_WIDGET (self->drag_entry))))
    {
      gtk_editable_set_text (GTK_EDITABLE (self->drag_entry), drag);
      show_drag_error (self, NULL);
    }
}

/* A text view learns its full height only once it has laid out every
 * line, a frame or two after it is shown, and does not ask for it: the
 * notes grew at the next layout of the inspector (choosing a stage, say),
 * moving every field under the pointer.  A few frames after new notes,
 * they are measured again, so they take their height at once. */
#define NOTES_FIT_FRAMES 3

static gboolean
notes_fit_tick (GtkWidget *widget, GdkFrameClock *clock, gpointer data)
{
  SwInspector *self = data;

  if (++self->notes_fit_frames < NOTES_FIT_FRAMES)
    return G_SOURCE_CONTINUE;
  self->notes_fit_id = 0;
  gtk_widget_queue_resize (widget);
  return G_SOURCE_REMOVE;
}

static void
notes_fit_later (SwInspector *self)
{
  self->notes_fit_frames = 0;
  if (self->notes_fit_id == 0)
    self->notes_fit_id = gtk_widget_add_tick_callback (GTK_WIDGET (self->notes_view),
                                                       notes_fit_tick, self, NULL);
}

static void
update_design_extra (SwInspector *self, const SwDesign *d)
{
  const SwDesignAscent *a = &d->ascent;
  g_autofree char *notes = NULL;
  GtkTextBuffer *buffer = gtk_text_view_get_buffer (self->notes_view);
  GtkTextIter start, end;
  gboolean orbit = d->mission.kind == SW_MISSION_ORBIT;

  gtk_text_buffer_get_bounds (buffer, &start, &end);
  notes = gtk_text_buffer_get_text (buffer, &start, &end, FALSE);
  if (g_strcmp0 (notes, d->notes != NULL ? d->notes : "") != 0)
    {
      gtk_text_buffer_set_text (buffer, d->notes != NULL ? d->notes : "", -1);
      notes_fit_later (self);
    }

  gtk_widget_set_visible (self->loss_model_label, orbit);
  gtk_widget_set_visible (GTK_WIDGET (self->loss_model_dropdown), orbit);
  gtk_drop_down_set_selected (self->loss_model_dropdown,
                              d->mission.loss_model == SW_LOSS_SIMULATE ? 1 : 0);

  sw_number_field_set_value (self->fairing_mass_field,
                             a->has_fairing_mass ? a->fairing_mass_kg : NAN);
  sw_number_field_set_value (self->fairing_altitude_field,
                             a->has_fairing_altitude ? a->fairing_jettison_altitude_km : NAN);
  sw_number_field_set_value (self->fairing_pressure_field,
                             a->has_fairing_pressure ? a->fairing_jettison_dynamic_pressure_pa
                                                     : NAN);
  sw_number_field_set_value (self->pitch_over_field,
                             a->has_pitch_over_speed ? a->pitch_over_speed_m_s : NAN);
  sw_number_field_set_value (self->pitch_kick_field, a->has_pitch_kick ? a->pitch_kick_deg : NAN);
  sw_number_field_set_value (self->insertion_field,
                             a->has_insertion_altitude ? a->insertion_altitude_km : NAN);
  sw_number_field_set_value (self->max_q_alpha_field,
                             a->has_max_q_alpha ? a->max_q_alpha_kpa_deg : NAN);
  update_boosters (self, d);
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
  /* Thrust from a common-practice thrust-to-weight at ignition, so the
   * ascent can be simulated; the T/W field changes it.  A vehicle that
   * cannot be sized yet gets none. */
  sw_design_set_thrust_for_tw (d, n, sw_default_ignition_tw (n), NULL);
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
    {
      g_signal_connect_swapped (document, "changed", G_CALLBACK (document_changed_cb), self);
      g_signal_connect_swapped (document, "notify::file", G_CALLBACK (document_changed_cb),
                                self);
    }
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
      /* Another stage: text being edited or an error belongs to the old one. */
      sw_number_field_reset (self->isp_vac_spin, NAN);
      sw_number_field_reset (self->isp_sl_spin, NAN);
      sw_number_field_reset (self->eps_spin, NAN);
      sw_number_field_reset (self->share_spin, NAN);
      self->isp_conflict = FALSE;
      if (stage >= 0 && (guint) stage < design (self)->n_stages)
        update_extra_stage_fields (self, design (self), (guint) stage, TRUE);
      update_stage_fields (self);
      update_actions (self);
      update_tanks_readout (self);
      self->updating--;
    }
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_SELECTED_STAGE]);
}

void
sw_inspector_set_intro (SwInspector *self, gboolean shown)
{
  g_return_if_fail (SW_IS_INSPECTOR (self));
  gtk_widget_set_visible (self->intro_box, shown);
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
    case SW_INSPECTOR_NOTES: return GTK_WIDGET (self->notes_view);
    case SW_INSPECTOR_INTRO: return self->intro_box;
    case SW_INSPECTOR_LOSS_MODEL: return GTK_WIDGET (self->loss_model_dropdown);
    case SW_INSPECTOR_THRUST: return GTK_WIDGET (self->thrust_field);
    case SW_INSPECTOR_ENGINE_THRUST: return GTK_WIDGET (self->engine_thrust_field);
    case SW_INSPECTOR_ENGINE_COUNT: return GTK_WIDGET (self->engine_count_field);
    case SW_INSPECTOR_TW: return GTK_WIDGET (self->tw_field);
    case SW_INSPECTOR_DIAMETER: return GTK_WIDGET (self->diameter_field);
    case SW_INSPECTOR_COAST: return GTK_WIDGET (self->coast_field);
    case SW_INSPECTOR_DRAG: return GTK_WIDGET (self->drag_entry);
    case SW_INSPECTOR_PROPELLANT_NAME: return GTK_WIDGET (self->propellant_name_entry);
    case SW_INSPECTOR_ENGINE_RELIABILITY: return GTK_WIDGET (self->engine_rel_field);
    case SW_INSPECTOR_FAILURES_TOLERATED: return GTK_WIDGET (self->failures_field);
    case SW_INSPECTOR_IGNITION_RELIABILITY: return GTK_WIDGET (self->ignition_rel_field);
    case SW_INSPECTOR_SEPARATION_RELIABILITY: return GTK_WIDGET (self->separation_rel_field);
    case SW_INSPECTOR_FAIRING_MASS: return GTK_WIDGET (self->fairing_mass_field);
    case SW_INSPECTOR_FAIRING_ALTITUDE: return GTK_WIDGET (self->fairing_altitude_field);
    case SW_INSPECTOR_FAIRING_PRESSURE: return GTK_WIDGET (self->fairing_pressure_field);
    case SW_INSPECTOR_PITCH_OVER_SPEED: return GTK_WIDGET (self->pitch_over_field);
    case SW_INSPECTOR_PITCH_KICK: return GTK_WIDGET (self->pitch_kick_field);
    case SW_INSPECTOR_INSERTION_ALTITUDE: return GTK_WIDGET (self->insertion_field);
    case SW_INSPECTOR_MAX_Q_ALPHA: return GTK_WIDGET (self->max_q_alpha_field);
    case SW_INSPECTOR_PROPELLANT: return GTK_WIDGET (self->propellant_dropdown);
    case SW_INSPECTOR_PROPELLANT_LOAD: return GTK_WIDGET (self->propellant_load_field);
    case SW_INSPECTOR_MIXTURE_RATIO: return GTK_WIDGET (self->mixture_ratio_field);
    case SW_INSPECTOR_ULLAGE: return GTK_WIDGET (self->ullage_field);
    case SW_INSPECTOR_OXIDIZER_DENSITY: return GTK_WIDGET (self->oxidizer_density_field);
    case SW_INSPECTOR_FUEL_DENSITY: return GTK_WIDGET (self->fuel_density_field);
    case SW_INSPECTOR_TANKS_LABEL: return GTK_WIDGET (self->tanks_label);
    case SW_INSPECTOR_BOOSTER_COUNT: return GTK_WIDGET (self->booster_count_field);
    case SW_INSPECTOR_BOOSTER_NAME: return GTK_WIDGET (self->booster_name_entry);
    case SW_INSPECTOR_BOOSTER_ISP_VAC: return GTK_WIDGET (self->booster_isp_vac_field);
    case SW_INSPECTOR_BOOSTER_ISP_SL: return GTK_WIDGET (self->booster_isp_sl_field);
    case SW_INSPECTOR_BOOSTER_EPS: return GTK_WIDGET (self->booster_eps_field);
    case SW_INSPECTOR_BOOSTER_THRUST: return GTK_WIDGET (self->booster_thrust_field);
    case SW_INSPECTOR_BOOSTER_PROPELLANT_LOAD: return GTK_WIDGET (self->booster_load_field);
    case SW_INSPECTOR_BOOSTER_DIAMETER: return GTK_WIDGET (self->booster_diameter_field);
    case SW_INSPECTOR_BOOSTER_CROSSFEED: return GTK_WIDGET (self->booster_crossfeed_check);
    case SW_INSPECTOR_BOOSTER_PROPELLANT: return GTK_WIDGET (self->booster_propellant_dropdown);
    case SW_INSPECTOR_BOOSTER_PROPELLANT_NAME:
      return GTK_WIDGET (self->booster_propellant_name_entry);
    case SW_INSPECTOR_BOOSTER_MIXTURE_RATIO: return GTK_WIDGET (self->booster_mixture_field);
    case SW_INSPECTOR_BOOSTER_ULLAGE: return GTK_WIDGET (self->booster_ullage_field);
    case SW_INSPECTOR_BOOSTER_OXIDIZER_DENSITY: return GTK_WIDGET (self->booster_oxidizer_field);
    case SW_INSPECTOR_BOOSTER_FUEL_DENSITY: return GTK_WIDGET (self->booster_fuel_field);
    case SW_INSPECTOR_N_FIELDS:
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
  if (self->notes_fit_id != 0)
    {
      gtk_widget_remove_tick_callback (GTK_WIDGET (self->notes_view), self->notes_fit_id);
      self->notes_fit_id = 0;
    }
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

  g_type_ensure (SW_TYPE_NUMBER_FIELD);
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
  CHILD (content_box);
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
  gtk_widget_class_bind_template_callback (widget_class, share_field_cb);

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

  setup_field (self->payload_spin, self->payload_unit, SW_LIMIT_PAYLOAD, 1, 10.0);
  setup_field (self->delta_v_spin, self->delta_v_unit, SW_LIMIT_DELTA_V, 0, 10.0);
  setup_field (self->altitude_spin, self->altitude_unit, SW_LIMIT_ALTITUDE, 0, 10.0);
  setup_field (self->inclination_spin, self->inclination_unit, SW_LIMIT_INCLINATION, 1, 0.1);
  setup_field (self->latitude_spin, self->latitude_unit, SW_LIMIT_SITE_LATITUDE, 1, 0.1);
  setup_field (self->losses_spin, self->losses_unit, SW_LIMIT_LOSSES, 0, 10.0);
  sw_number_field_set_optional (self->losses_spin, TRUE, _("none"));
  setup_field (self->isp_vac_spin, self->isp_vac_unit, SW_LIMIT_ISP_VAC, 1, 1.0);
  setup_field (self->isp_sl_spin, self->isp_sl_unit, SW_LIMIT_ISP_SL, 1, 1.0);
  setup_field (self->eps_spin, self->eps_unit, SW_LIMIT_STRUCTURAL_COEFFICIENT, 4, 0.001);
  sw_number_field_set_limit (self->share_spin, SW_LIMIT_DELTA_V_SHARE, 100.0, 1, 0.5);
  {
    const SwLimit *l = sw_limit_get (SW_LIMIT_DELTA_V_SHARE);
    gtk_adjustment_set_lower (self->share_adjustment, l->min * 100.0);
    gtk_adjustment_set_upper (self->share_adjustment, l->max * 100.0);
  }
  /* Captions and units stay beside the entry when an error shows under it. */
  {
    GtkWidget *grids[] = { gtk_widget_get_parent (GTK_WIDGET (self->payload_spin)),
                           self->stage_grid };
    for (guint g = 0; g < G_N_ELEMENTS (grids); g++)
      for (GtkWidget *c = gtk_widget_get_first_child (grids[g]); c != NULL;
           c = gtk_widget_get_next_sibling (c))
        if (GTK_IS_LABEL (c) || GTK_IS_CHECK_BUTTON (c))
          {
            gtk_widget_set_valign (c, GTK_ALIGN_START);
            gtk_widget_set_margin_top (c, GTK_IS_LABEL (c) ? 8 : 4);
          }
  }
  build_sections (self);
  no_wheel_on_scale (GTK_WIDGET (self->share_scale));
  route_undo (GTK_WIDGET (self->name_entry));
  route_undo (GTK_WIDGET (self->stage_name_entry));
  route_undo (GTK_WIDGET (self->drag_entry));
  route_undo (GTK_WIDGET (self->propellant_name_entry));
  route_undo (GTK_WIDGET (self->booster_name_entry));
  route_undo (GTK_WIDGET (self->booster_propellant_name_entry));
  configure_eps_spin (self);
  /* Long translated captions and choices wrap or ellipsize: the window's
   * minimum width never depends on the language. */
  sw_narrow_texts (GTK_WIDGET (self));

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
