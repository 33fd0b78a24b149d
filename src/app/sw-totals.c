/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-totals"

#include "config.h"

#include "sw-totals.h"
#include "sw-steady-text.h"
#include "sw-tone-frame.h"
#include "sw-widget-text.h"

#include "sw-format.h"

#include <glib/gi18n.h>
#include <math.h>

/* The warnings' row: its frame's faces (sw-totals.ui) and the quiet text's
 * opacity, that of the theme's dimmed text (GTK 4.8's default theme,
 * $dim_label_opacity in gtk/theme/Default/_colors.scss: 0.55). */
enum { FACE_QUIET, FACE_WARN };
/* The verdict's states: its frame's faces and icons (sw-totals.ui). */
enum { SW_STATUS_OK, SW_STATUS_NOTE, SW_STATUS_WARN, SW_STATUS_BAD, SW_N_STATUS };
#define QUIET_OPACITY 0.55

struct _SwTotals {
  GtkWidget  parent_instance;
  GtkWidget *box;
  SwAnalysis  *result;
  GtkInscription *liftoff_label;
  GtkInscription *fraction_label;
  GtkInscription *margin_label;
  GtkInscription *required_label;
  SwSteadyText *limit_label;
  GtkWidget *status_box;
  GtkWidget *status_icons[SW_N_STATUS];
  SwSteadyText *status_label;
  const char *status_page;     /* "ok", "note", "warn" or "bad" */
  GtkWidget *ascent_note_box;
  SwSteadyText *ascent_note_label;
  GtkWidget *ascent_warning_box;
  GtkWidget *ascent_warning_icon;
  SwSteadyText *ascent_warning_label;
  /* The warnings' row keeps its place once it has shown a warning for this
   * design (sw_totals_set_ascent), and whether it shows one now. */
  gboolean   warning_row_kept;
  char      *warnings;   /* the warnings shown now, or NULL */
  GtkInscription *delta_caption;
  GtkInscription *liftoff_delta;
  GtkInscription *fraction_delta;
  GtkInscription *margin_delta;
};

G_DEFINE_FINAL_TYPE (SwTotals, sw_totals, GTK_TYPE_WIDGET)

/* The verdict's states, in the order of its frame's faces and icons
 * (sw-totals.ui). */
static const char *const status_pages[SW_N_STATUS] = { "ok", "note", "warn", "bad" };
static const char *const status_icon_ids[SW_N_STATUS] = { "status_icon_ok", "status_icon_note",
                                                          "status_icon_warn", "status_icon_bad" };

/* The state's icon, frame and weight ("ok", "note", "warn", "bad"), and the
 * text.  None of them changes the verdict's style or size: a new verdict
 * is a repaint. */
static void
set_status (SwTotals *self, const char *page, const char *text)
{
  guint index = SW_STATUS_NOTE;

  /* Two lines high even when the verdict takes one ("pending" before the
   * ascent, "short of the orbit" after it), and never lower than it has
   * been for this design: the totals keep their height, so the plots below
   * them do not move, nor get laid out and repainted, at every phase of
   * every edit.  A longer text still wraps in full. */
  sw_steady_text_set_text (self->status_label, text);
  if (g_strcmp0 (self->status_page, page) == 0)
    return;
  for (guint i = 0; i < SW_N_STATUS; i++)
    if (g_str_equal (status_pages[i], page))
      index = i;
  self->status_page = status_pages[index];
  sw_tone_frame_set_face (SW_TONE_FRAME (self->status_box), index);
  for (guint i = 0; i < SW_N_STATUS; i++)
    gtk_widget_set_opacity (self->status_icons[i], i == index ? 1.0 : 0.0);
  /* Not feasible: bold as well as the hatched frame. */
  sw_steady_text_set_bold (self->status_label, index == SW_STATUS_BAD);
}

char *
sw_totals_format_delta (SwTotal total, const SwDelta *d)
{
  g_autofree char *abs_text = NULL, *percent = NULL;
  const char *sign;

  g_return_val_if_fail (d != NULL, NULL);

  if (!isfinite (d->delta))
    return g_strdup (SW_NO_VALUE);
  sign = d->delta > 0.0 ? "+" : d->delta < 0.0 ? "−" : "";
  switch (total)
    {
    case SW_TOTAL_PAYLOAD_FRACTION:
      /* Translators: a change of a percentage in percentage points */
      abs_text = g_strdup_printf (_("%.2f pp"), 100.0 * fabs (d->delta));
      break;
    case SW_TOTAL_DELTA_V:
    case SW_TOTAL_DELTA_V_LIMIT:
      abs_text = sw_format_speed (fabs (d->delta));
      break;
    case SW_TOTAL_STAGE_COUNT:
      abs_text = g_strdup_printf ("%.0f", fabs (d->delta));
      break;
    case SW_TOTAL_LIFTOFF_MASS:
    case SW_TOTAL_PAYLOAD:
    case SW_TOTAL_PROPELLANT:
    case SW_TOTAL_STRUCTURE:
    case SW_N_TOTALS:
    default:
      abs_text = sw_format_mass (fabs (d->delta));
      break;
    }
  if (!isfinite (d->percent))
    return g_strconcat (sign, abs_text, NULL);
  /* Translators: a change and its share of the baseline's value, e.g. "+3.2 t (+11.6 %)" */
  percent = g_strdup_printf (_("%s%s (%s%.1f %%)"), sign, abs_text,
                             d->percent > 0.0 ? "+" : d->percent < 0.0 ? "−" : "",
                             fabs (d->percent));
  return g_steal_pointer (&percent);
}

static void
set_delta (GtkInscription *label, const char *text, const char *tooltip)
{
  gtk_widget_set_visible (GTK_WIDGET (label), text != NULL);
  if (g_strcmp0 (gtk_inscription_get_text (label), text) != 0)
    gtk_inscription_set_text (label, text);
  sw_widget_set_tooltip (GTK_WIDGET (label), tooltip);
}

/* The change of each figure against the pinned baseline. */
static void
update_deltas (SwTotals *self)
{
  SwAnalysis *r = self->result;
  g_autofree char *liftoff = NULL, *fraction = NULL, *margin = NULL, *tooltip = NULL;
  const char *name;

  if (r == NULL || !r->ok || !r->has_baseline)
    {
      set_delta (self->delta_caption, NULL, NULL);
      set_delta (self->liftoff_delta, NULL, NULL);
      set_delta (self->fraction_delta, NULL, NULL);
      set_delta (self->margin_delta, NULL, NULL);
      return;
    }
  name = r->design->baseline->name[0] != '\0' ? r->design->baseline->name : _("Untitled design");
  if (!r->baseline_ok)
    {
      /* Translators: %s says why the baseline cannot be sized */
      tooltip = g_strdup_printf (_("The baseline cannot be sized: %s"), r->baseline_error);
      set_delta (self->delta_caption, tooltip, tooltip);
      set_delta (self->liftoff_delta, SW_NO_VALUE, tooltip);
      set_delta (self->fraction_delta, "", NULL);
      set_delta (self->margin_delta, "", NULL);
      return;
    }
  /* Translators: %s is the baseline's name */
  tooltip = g_strdup_printf (_("Change against the pinned baseline “%s”"), name);
  liftoff = sw_totals_format_delta (SW_TOTAL_LIFTOFF_MASS,
                                    &r->comparison.totals[SW_TOTAL_LIFTOFF_MASS]);
  fraction = sw_totals_format_delta (SW_TOTAL_PAYLOAD_FRACTION,
                                     &r->comparison.totals[SW_TOTAL_PAYLOAD_FRACTION]);
  margin = sw_totals_format_delta (SW_TOTAL_DELTA_V, &r->margin_delta);
  set_delta (self->delta_caption, tooltip, NULL);
  set_delta (self->liftoff_delta, liftoff, tooltip);
  set_delta (self->fraction_delta, fraction, tooltip);
  /* The headroom's change is no change of the simulated margin above it. */
  set_delta (self->margin_delta, "", NULL);
  (void) margin;
}

static void
update (SwTotals *self)
{
  SwAnalysis *r = self->result;
  const SwSizing *s;
  g_autofree char *liftoff = NULL, *fraction = NULL, *margin = NULL;
  g_autofree char *required = NULL, *limit = NULL, *dv = NULL, *lim = NULL, *status = NULL;

  if (r == NULL)
    {
      gtk_inscription_set_text (self->liftoff_label, SW_NO_VALUE);
      gtk_inscription_set_text (self->fraction_label, SW_NO_VALUE);
      gtk_inscription_set_text (self->margin_label, SW_NO_VALUE);
      gtk_inscription_set_text (self->required_label, "");
      sw_steady_text_set_text (self->limit_label, "");
      set_status (self, "note", _("Sizing…"));
      return;
    }
  if (!r->ok)
    {
      gtk_inscription_set_text (self->liftoff_label, SW_NO_VALUE);
      gtk_inscription_set_text (self->fraction_label, SW_NO_VALUE);
      gtk_inscription_set_text (self->margin_label, SW_NO_VALUE);
      gtk_inscription_set_text (self->required_label, "");
      sw_steady_text_set_text (self->limit_label, "");
      status = g_strdup_printf (_("Cannot size this design. %s"), r->error_message);
      set_status (self, "bad", status);
      return;
    }

  s = &r->sizing;
  liftoff = sw_format_mass (s->liftoff_mass_kg);
  fraction = sw_format_percent (s->payload_fraction, 2);
  /* The headline margin is the simulated one; the headroom to the stages'
   * limit is no performance margin and stays on the line below. */
  margin = isfinite (r->simulated_margin_m_s) ? sw_format_speed_delta (r->simulated_margin_m_s)
                                              : g_strdup (SW_NO_VALUE);
  dv = sw_format_speed (r->delta_v_m_s);
  lim = sw_format_speed (s->delta_v_limit_m_s);
  /* Translators: %s is a speed such as "9,400 m/s" */
  required = g_strdup_printf (_("Required delta-v %s"), dv);
  if (s->feasible)
    {
      g_autofree char *head = sw_format_speed (r->headroom_m_s);
      /* Translators: two speeds: the stages' limit and the headroom below it */
      limit = g_strdup_printf (_("Stages' limit %s (no payload), headroom %s"), lim, head);
    }
  else
    /* Translators: %s is a speed such as "12,500 m/s" */
    limit = g_strdup_printf (_("Stages' limit %s (no payload)"), lim);
  /* A vehicle that exists: what it carries, beside what it is asked to. */
  if (r->has_performance)
    {
      g_autofree char *nominal = sw_format_mass (r->design->payload_kg);
      g_free (limit);
      if (r->performance.reachable)
        {
          g_autofree char *cap = sw_format_mass (r->performance.payload_kg);
          /* Translators: two masses: what the vehicle carries, what the design asks */
          limit = g_strdup_printf (_("Capability %s, nominal %s"), cap, nominal);
        }
      else
        /* Translators: %s is a mass such as "2,000 kg" */
        limit = g_strdup_printf (_("Capability none (short even empty), nominal %s"),
                                 nominal);
    }
  gtk_inscription_set_text (self->liftoff_label, liftoff);
  gtk_inscription_set_text (self->fraction_label, fraction);
  gtk_inscription_set_text (self->margin_label, margin);
  gtk_inscription_set_text (self->required_label, required);
  sw_steady_text_set_text (self->limit_label, limit);

  /* The verdict: icon and style by state, green only when the simulated
   * ascent reaches the orbit within the limits. */
  status = g_strdup_printf (_("%s. %s"), sw_verdict_state_title (r->verdict.state),
                            r->verdict.reason);
  set_status (self, sw_totals_status_page (r->verdict.state), status);
}

const char *
sw_totals_status_page (SwVerdictState state)
{
  switch (state)
    {
    case SW_VERDICT_REACHES_ORBIT: return "ok";
    case SW_VERDICT_OVER_LIMIT: return "warn";
    case SW_VERDICT_INFEASIBLE:
    case SW_VERDICT_SHORT_OF_ORBIT: return "bad";
    case SW_VERDICT_PAPER_ONLY:
    case SW_VERDICT_PENDING:
    default: return "note";
    }
}

GtkWidget *
sw_totals_new (void)
{
  return g_object_new (SW_TYPE_TOTALS, NULL);
}

static void update_warning_row (SwTotals *self);

void
sw_totals_set_result (SwTotals *self, SwAnalysis *result)
{
  g_return_if_fail (SW_IS_TOTALS (self));

  if (self->result == result)
    return;
  g_clear_pointer (&self->result, sw_analysis_unref);
  self->result = result != NULL ? sw_analysis_ref (result) : NULL;
  update (self);
  update_deltas (self);
  /* "None yet" becomes "none" when the ascent arrives without warnings. */
  if (self->warning_row_kept)
    update_warning_row (self);
}

static void
set_row (GtkWidget *box, SwSteadyText *label, const char *text)
{
  sw_steady_text_set_text (label, text);
  gtk_widget_set_visible (box, text != NULL);
}

/* The warnings' row: the warnings, or once the row has shown one for this
 * design, that there are none (or none yet). */
static void
update_warning_row (SwTotals *self)
{
  const char *shown;

  if (self->warnings != NULL)
    shown = self->warnings;
  else if (!self->warning_row_kept)
    shown = NULL;
  else if (self->result != NULL && self->result->ascent_pending)
    /* Not "none": the flight's own limits are not checked yet. */
    shown = _("No warnings so far; the ascent is still being checked.");
  else
    shown = _("No warnings now.");
  set_row (self->ascent_warning_box, self->ascent_warning_label, shown);
  /* Hidden but keeping its place: the text stays where the warnings were.
   * Icon, text and frame change without a change of style (opacity, the
   * frame's face): a repaint, not a restyle of the window in the next
   * frame. */
  gtk_widget_set_opacity (self->ascent_warning_icon, self->warnings != NULL ? 1.0 : 0.0);
  gtk_widget_set_opacity (GTK_WIDGET (self->ascent_warning_label),
                          self->warnings != NULL ? 1.0 : QUIET_OPACITY);
  sw_tone_frame_set_face (SW_TONE_FRAME (self->ascent_warning_box),
                          self->warnings != NULL ? FACE_WARN : FACE_QUIET);
}

void
sw_totals_set_ascent (SwTotals *self, const char *note, const char *warnings)
{
  g_return_if_fail (SW_IS_TOTALS (self));
  set_row (self->ascent_note_box, self->ascent_note_label, note);
  /* The warnings change from one line to two between the phases of an
   * edit (as flown, or from the sized masses): two lines high for the same
   * reason as the verdict.  And once a warning has been shown for this
   * design the row keeps its place when the warnings go (saying there are
   * none), so that dragging a value back and forth across a limit does not
   * move the plots below by a row each time, nor make them be laid out and
   * drawn again at every crossing. */
  if (warnings != NULL)
    self->warning_row_kept = TRUE;
  g_free (self->warnings);
  self->warnings = g_strdup (warnings);
  update_warning_row (self);
}

void
sw_totals_forget_design (SwTotals *self)
{
  g_return_if_fail (SW_IS_TOTALS (self));
  self->warning_row_kept = FALSE;
  sw_steady_text_forget_height (self->status_label);
  sw_steady_text_forget_height (self->limit_label);
  sw_steady_text_forget_height (self->ascent_note_label);
  sw_steady_text_forget_height (self->ascent_warning_label);
  update_warning_row (self);
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
    case SW_TOTALS_LIMIT: return sw_steady_text_get_text (self->limit_label);
    case SW_TOTALS_STATUS_PAGE:
      return self->status_page;
    case SW_TOTALS_STATUS:
      return sw_steady_text_get_text (self->status_label);
    case SW_TOTALS_ASCENT_NOTE:
      return gtk_widget_get_visible (self->ascent_note_box)
             ? sw_steady_text_get_text (self->ascent_note_label) : NULL;
    case SW_TOTALS_LIFTOFF_DELTA:
      return gtk_widget_get_visible (GTK_WIDGET (self->liftoff_delta))
             ? gtk_inscription_get_text (self->liftoff_delta) : NULL;
    case SW_TOTALS_FRACTION_DELTA:
      return gtk_widget_get_visible (GTK_WIDGET (self->fraction_delta))
             ? gtk_inscription_get_text (self->fraction_delta) : NULL;
    case SW_TOTALS_MARGIN_DELTA:
      return gtk_widget_get_visible (GTK_WIDGET (self->margin_delta))
             ? gtk_inscription_get_text (self->margin_delta) : NULL;
    case SW_TOTALS_ASCENT_WARNINGS:
      return self->warnings;
    default: return NULL;
    }
}

static void
sw_totals_dispose (GObject *object)
{
  SwTotals *self = SW_TOTALS (object);

  g_clear_pointer (&self->result, sw_analysis_unref);
  g_clear_pointer (&self->warnings, g_free);
  gtk_widget_dispose_template (GTK_WIDGET (self), SW_TYPE_TOTALS);
  G_OBJECT_CLASS (sw_totals_parent_class)->dispose (object);
}

static void
sw_totals_class_init (SwTotalsClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = sw_totals_dispose;

  g_type_ensure (SW_TYPE_STEADY_TEXT);
  g_type_ensure (SW_TYPE_TONE_FRAME);
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
  gtk_widget_class_bind_template_child (widget_class, SwTotals, status_box);
  for (guint i = 0; i < SW_N_STATUS; i++)
    gtk_widget_class_bind_template_child_full (widget_class, status_icon_ids[i], FALSE,
                                              G_STRUCT_OFFSET (SwTotals, status_icons)
                                              + i * sizeof (GtkWidget *));
  gtk_widget_class_bind_template_child (widget_class, SwTotals, status_label);
  gtk_widget_class_bind_template_child (widget_class, SwTotals, ascent_note_box);
  gtk_widget_class_bind_template_child (widget_class, SwTotals, ascent_note_label);
  gtk_widget_class_bind_template_child (widget_class, SwTotals, ascent_warning_box);
  gtk_widget_class_bind_template_child (widget_class, SwTotals, ascent_warning_icon);
  gtk_widget_class_bind_template_child (widget_class, SwTotals, ascent_warning_label);
  gtk_widget_class_bind_template_child (widget_class, SwTotals, delta_caption);
  gtk_widget_class_bind_template_child (widget_class, SwTotals, liftoff_delta);
  gtk_widget_class_bind_template_child (widget_class, SwTotals, fraction_delta);
  gtk_widget_class_bind_template_child (widget_class, SwTotals, margin_delta);
}

static void
sw_totals_init (SwTotals *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
  update (self);
}
