/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-window"

#include "config.h"

#include "sw-window.h"

#include "sw-design-edit.h"
#include "sw-file-flow.h"
#include "sw-settings.h"
#include "sw-ascent-page.h"
#include "sw-export-dialog.h"
#include "sw-format.h"
#include "sw-recovery.h"
#include "sw-staging-page.h"
#include "sw-trade-page.h"
#include "sw-trade-plots.h"
#include "sw-window-private.h"

#include <glib/gi18n.h>
#include <glib/gstdio.h>
#ifdef GDK_WINDOWING_X11
#include <gdk/x11/gdkx.h>
#endif
#include <errno.h>
#include <string.h>



struct _SwWindow {
  GtkApplicationWindow parent_instance;

  SwDocument     *document;
  SwSolver       *solver;
  SwAnalysis       *result;
  GSettings      *settings;
  gboolean        ephemeral;
  guint64         drawn_serial;
  gboolean        drawn_pending;       /* a later phase of the drawn result was pending */
  GdkFrameClock  *frame_clock;
  SwDesign       *drag_base;           /* the design when a border drag began */

  SwRecovery     *recovery;

  SwFileFlow     *file_flow;           /* new, open, save, and asking first */
  gboolean        closing;

  GtkLabel       *title_label;
  GtkLabel       *subtitle_label;
  GtkInfoBar     *recovery_bar;
  GtkLabel       *recovery_label;
  GtkInfoBar     *message_bar;
  GtkLabel       *message_label;
  SwInspector    *inspector;
  SwStackView    *stack_view;
  GtkToggleButton *scale_view_button;
  SwTotals       *totals;
  GtkNotebook    *notebook;
  SwPlot         *stage_count_plot;
  SwPlot         *sweep_plot;
  GtkLabel       *curves_note;
  SwWorkingView  *working_view;
  SwAscentPage   *ascent_page;
  SwTradePage    *trade_page;
  SwStagingPage  *staging_page;
  SwExportDialog *export_dialog;       /* weak, while open */
  GMenu          *recent_menu;
};

G_DEFINE_FINAL_TYPE (SwWindow, sw_window, GTK_TYPE_APPLICATION_WINDOW)

enum { RESULT_DRAWN, N_SIGNALS };
static guint signals[N_SIGNALS];


/* ---- messages and title ------------------------------------------------ */

static void
show_message (SwWindow *self, GtkMessageType type, const char *text)
{
  gtk_info_bar_set_message_type (self->message_bar, type);
  gtk_label_set_text (self->message_label, text);
  gtk_info_bar_set_revealed (self->message_bar, TRUE);
}

static void
hide_message (SwWindow *self)
{
  gtk_info_bar_set_revealed (self->message_bar, FALSE);
}

static void
message_response_cb (SwWindow *self, int response)
{
  hide_message (self);
}

static void
update_title (SwWindow *self)
{
  g_autofree char *name = sw_document_dup_title (self->document);
  g_autofree char *title = NULL, *window_title = NULL, *subtitle = NULL;
  gboolean modified = sw_document_get_modified (self->document);
  GFile *file = sw_document_get_file (self->document);

  /* The bullet marks unsaved changes. */
  title = modified ? g_strdup_printf ("• %s", name) : g_strdup (name);
  window_title = g_strdup_printf ("%s – Stagewright", title);
  if (file != NULL)
    {
      g_autofree char *path = g_file_get_path (file);
      const char *home = g_get_home_dir ();
      if (path != NULL && home != NULL && g_str_has_prefix (path, home) && strlen (home) > 1)
        subtitle = g_strdup_printf ("~%s", path + strlen (home));
      else
        subtitle = path != NULL ? g_strdup (path) : g_file_get_uri (file);
    }
  else
    subtitle = g_strdup (_("Not saved yet"));
  gtk_label_set_text (self->title_label, title);
  gtk_label_set_text (self->subtitle_label, subtitle);
  if (g_strcmp0 (gtk_window_get_title (GTK_WINDOW (self)), window_title) != 0)
    gtk_window_set_title (GTK_WINDOW (self), window_title);
}

/* The estimated structural coefficients of the shown analysis, when they
 * belong to the design as it is now and the design would take them (NAN for
 * a stage that was not estimated).  FALSE otherwise. */
static gboolean
eps_estimate_applicable (SwWindow *self, double *eps, double *booster_eps, gboolean *changes)
{
  const SwAnalysis *r = self->result;
  const SwDesign *now = sw_document_get_design (self->document);
  const SwMassEstimate *m = r != NULL ? &r->mass_estimate : NULL;
  g_autoptr (SwDesign) d = NULL;

  if (r == NULL || !r->ok || !m->ok || !m->any_estimated
      || m->n_stages != now->n_stages || !sw_design_equal (r->design, now))
    return FALSE;
  for (guint i = 0; i < now->n_stages; i++)
    eps[i] = m->stages[i].estimated ? m->stages[i].structural_coefficient : NAN;
  *booster_eps = m->has_boosters && m->boosters.estimated ? m->boosters.structural_coefficient
                                                          : NAN;
  d = sw_design_copy (now);
  return sw_design_accept_estimated_coefficients (d, eps, now->n_stages, *booster_eps, changes,
                                                  NULL);
}

static void
update_actions (SwWindow *self)
{
  double eps[SW_MAX_STAGES], booster_eps;
  gboolean changes = FALSE;

  gtk_widget_action_set_enabled (GTK_WIDGET (self), "design.accept-eps-estimate",
                                 eps_estimate_applicable (self, eps, &booster_eps, &changes)
                                 && changes);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "design.undo",
                                 sw_document_can_undo (self->document));
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "design.redo",
                                 sw_document_can_redo (self->document));
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "design.copy-working",
                                 self->result != NULL && self->result->ok);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "design.clear-baseline",
                                 sw_document_get_design (self->document)->baseline != NULL);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "design.export",
                                 self->result != NULL && self->result->ok);
}

/* ---- design -> solver -> views ----------------------------------------- */

static void
document_changed_cb (SwWindow *self)
{
  sw_solver_post (self->solver, sw_document_get_design (self->document));
  update_title (self);
  update_actions (self);
}

static void
solved_cb (SwWindow *self, SwAnalysis *result)
{
  g_clear_pointer (&self->result, sw_analysis_unref);
  self->result = sw_analysis_ref (result);
  sw_stack_view_set_result (self->stack_view, result);
  sw_stack_view_set_selected (self->stack_view, sw_inspector_get_selected (self->inspector));
  sw_inspector_set_result (self->inspector, result);
  sw_totals_set_result (self->totals, result);
  sw_working_view_set_result (self->working_view, result);
  sw_ascent_page_set_result (self->ascent_page, result);
  sw_trade_page_set_result (self->trade_page, result);
  sw_staging_page_set_result (self->staging_page, result);
  if (self->export_dialog != NULL)
    sw_export_dialog_set_result (self->export_dialog, result);
  /* A vehicle that exists (every stage fixed): its payload against the
   * orbit in place of the curves that resize it. */
  if (result->ok && result->payload_curves.applies)
    {
      sw_trade_plots_show_payload_altitude (self->stage_count_plot, result);
      sw_trade_plots_show_payload_inclination (self->sweep_plot, result);
    }
  else
    {
      sw_trade_plots_show_stage_count (self->stage_count_plot, result);
      sw_trade_plots_show_sweep (self->sweep_plot, result);
    }
  {
    const char *note = sw_trade_plots_note (result);
    g_autofree char *joined = NULL;

    if (result->ok && !result->payload_curves.applies
        && result->stage_curve.booster_note[0] != '\0')
      note = joined = note[0] != '\0'
                        ? g_strconcat (note, " ", result->stage_curve.booster_note, NULL)
                        : g_strdup (result->stage_curve.booster_note);
    if (g_strcmp0 (gtk_label_get_text (self->curves_note), note) != 0)
      gtk_label_set_text (self->curves_note, note);
    gtk_widget_set_visible (GTK_WIDGET (self->curves_note), note[0] != '\0');
  }
  update_actions (self);
  /* A frame must follow even if no view changed, so "drawn" is reached. */
  if (self->frame_clock != NULL)
    gdk_frame_clock_request_phase (self->frame_clock, GDK_FRAME_CLOCK_PHASE_PAINT);
}

/* A later phase (Monte Carlo, ascent) of the same serial is on its way. */
static gboolean
result_pending (const SwAnalysis *r)
{
  return r->ascent_pending || r->montecarlo_pending;
}

/* Also once more for the same serial when its last phase has been painted. */
static void
after_paint_cb (SwWindow *self)
{
  if (self->result != NULL
      && (self->result->serial > self->drawn_serial
          || (self->result->serial == self->drawn_serial && self->drawn_pending
              && !result_pending (self->result))))
    {
      self->drawn_serial = self->result->serial;
      self->drawn_pending = result_pending (self->result);
      g_signal_emit (self, signals[RESULT_DRAWN], 0, self->drawn_serial);
    }
}

static void
ascent_summary_cb (SwWindow *self)
{
  sw_totals_set_ascent (self->totals, sw_ascent_page_get_note (self->ascent_page),
                        sw_ascent_page_get_warnings (self->ascent_page));
}

static void
selected_stage_cb (SwWindow *self)
{
  sw_working_view_set_selected (self->working_view, sw_inspector_get_selected (self->inspector));
}

static void
stage_activated_cb (SwWindow *self, int stage)
{
  sw_inspector_set_selected (self->inspector, stage);
}

/* A drag of the border between @lower and @upper: @amount of share moves
 * from @upper to @lower, counted from the start of the drag, so each step
 * starts from the design as it was when the drag began. */
static void
share_dragged_cb (SwWindow *self, int lower, int upper, double amount, gboolean finished)
{
  g_autoptr (SwDesign) d = NULL;
  guint n = sw_document_get_design (self->document)->n_stages;

  if (lower < 0 || upper < 0 || (guint) lower >= n || (guint) upper >= n || lower == upper)
    return;
  if (self->drag_base == NULL)
    {
      double shares[SW_MAX_STAGES];
      guint n_shares = self->result != NULL && self->result->ok
                       ? sw_sizing_get_shares (&self->result->sizing, shares) : 0;

      self->drag_base = sw_document_dup_design (self->document);
      if (self->drag_base->split != SW_SPLIT_MANUAL)
        sw_design_take_manual_shares (self->drag_base, shares, n_shares);
    }
  d = sw_design_copy (self->drag_base);
  sw_design_move_share (d, (guint) upper, (guint) lower, amount);
  sw_document_commit (self->document, g_steal_pointer (&d), "drag:share");
  if (finished)
    {
      g_clear_pointer (&self->drag_base, sw_design_free);
      sw_document_end_merge (self->document);
    }
}

/* ---- the recovery copy (sw-recovery.c) ---------------------------------- */

char *
sw_window_dup_recovery_path (SwWindow *self)
{
  g_return_val_if_fail (SW_IS_WINDOW (self), NULL);
  return sw_recovery_dup_path (self->recovery);
}

void
sw_window_flush_recovery (SwWindow *self)
{
  g_return_if_fail (SW_IS_WINDOW (self));
  sw_recovery_flush (self->recovery);
}

/* A copy left by a session that ended without a clean close: offer it. */
static void
check_recovery (SwWindow *self)
{
  g_autofree char *kept = NULL, *when = NULL, *text = NULL;
  g_autoptr (GError) error = NULL;
  g_autoptr (GDateTime) mtime = NULL;
  const SwDesign *d;

  if (!sw_recovery_check (self->recovery, &kept, &error))
    {
      if (error != NULL)
        {
          text = g_strdup_printf (_("A recovery copy from an earlier session could not be read "
                                    "and was moved to %s.\n%s"), kept != NULL ? kept : "?",
                                  error->message);
          show_message (self, GTK_MESSAGE_WARNING, text);
        }
      return;
    }
  d = sw_recovery_get_offered_design (self->recovery);
  mtime = sw_recovery_dup_offered_time (self->recovery);
  when = mtime != NULL ? g_date_time_format (mtime, "%x %X") : g_strdup ("?");
  /* Translators: %s are the design's name and the date and time of the copy */
  text = g_strdup_printf (_("Stagewright did not close properly last time. Unsaved changes to "
                            "“%s” were kept (copy of %s). Restore them?"),
                          d->name[0] ? d->name : _("Untitled design"), when);
  gtk_label_set_text (self->recovery_label, text);
  gtk_info_bar_set_revealed (self->recovery_bar, TRUE);
}

gboolean
sw_window_get_recovery_offered (SwWindow *self)
{
  g_return_val_if_fail (SW_IS_WINDOW (self), FALSE);
  return sw_recovery_get_offered (self->recovery);
}

void
sw_window_answer_recovery (SwWindow *self, gboolean restore)
{
  SwDesign *design = NULL;
  GFile *origin = NULL;

  g_return_if_fail (SW_IS_WINDOW (self));

  if (!sw_recovery_answer (self->recovery, restore, &design, &origin))
    return;
  gtk_info_bar_set_revealed (self->recovery_bar, FALSE);
  if (design != NULL)
    {
      sw_document_reset (self->document, design, origin, TRUE);
      sw_inspector_set_selected (self->inspector, 0);
    }
  g_clear_object (&origin);
}

static void
recovery_response_cb (SwWindow *self, int response)
{
  sw_window_answer_recovery (self, response == 1);
}

/* ---- files: the flow is sw-file-flow.c; the window shows its messages --- */

static void
flow_message_cb (SwWindow *self, int type, const char *text)
{
  if (text != NULL)
    show_message (self, (GtkMessageType) type, text);
  else
    hide_message (self);
}

static void
flow_reset_cb (SwWindow *self, gboolean intro)
{
  sw_inspector_set_intro (self->inspector, intro);
  sw_inspector_set_selected (self->inspector, 0);
  sw_totals_forget_design (self->totals);
}

gboolean
sw_window_load (SwWindow *self, GFile *file)
{
  g_return_val_if_fail (SW_IS_WINDOW (self), FALSE);
  g_return_val_if_fail (G_IS_FILE (file), FALSE);
  return sw_file_flow_load (self->file_flow, file, FALSE);
}

gboolean
sw_window_load_template (SwWindow *self, GFile *file)
{
  g_return_val_if_fail (SW_IS_WINDOW (self), FALSE);
  g_return_val_if_fail (G_IS_FILE (file), FALSE);
  return sw_file_flow_load (self->file_flow, file, TRUE);
}

gboolean
sw_window_is_replaceable (SwWindow *self)
{
  g_return_val_if_fail (SW_IS_WINDOW (self), FALSE);
  return !sw_document_get_modified (self->document)
         && !sw_recovery_get_offered (self->recovery);
}

gboolean
sw_window_save_to (SwWindow *self, GFile *file, GError **error)
{
  g_return_val_if_fail (SW_IS_WINDOW (self), FALSE);
  return sw_file_flow_save_to (self->file_flow, file, error);
}

void
sw_window_close_discarding (SwWindow *self)
{
  g_return_if_fail (SW_IS_WINDOW (self));
  self->closing = TRUE;
  gtk_window_close (GTK_WINDOW (self));
}

/* ---- actions ----------------------------------------------------------- */

/* Commits what is typed in the focused field and not yet entered (Enter,
 * Tab or leaving the field commit it), before the design is saved,
 * exported, replaced or the window closed: else Ctrl+S saved the old value
 * and closing lost the new one without asking.  The field loses and gets
 * back the focus, which commits every kind of field the way leaving it
 * does; its cursor and selection stay where they were.  Text that does not
 * parse is marked on its field and changes nothing, as on leaving it. */
static void
commit_focused_edit (SwWindow *self)
{
  GtkWidget *focused = gtk_root_get_focus (GTK_ROOT (self));
  g_autoptr (GtkWidget) focus = focused != NULL ? g_object_ref (focused) : NULL;
  int start = 0, end = 0;

  if (focus == NULL)
    return;
  if (GTK_IS_EDITABLE (focus))
    gtk_editable_get_selection_bounds (GTK_EDITABLE (focus), &start, &end);
  gtk_window_set_focus (GTK_WINDOW (self), NULL);
  if (gtk_widget_get_root (focus) == GTK_ROOT (self) && gtk_widget_is_sensitive (focus)
      && gtk_widget_get_mapped (focus) && gtk_widget_grab_focus (focus) && GTK_IS_EDITABLE (focus))
    gtk_editable_select_region (GTK_EDITABLE (focus), start, end);
}

static void
new_action (GtkWidget *widget, const char *name, GVariant *param)
{
  commit_focused_edit (SW_WINDOW (widget));
  sw_file_flow_ask_then (SW_WINDOW (widget)->file_flow, SW_FILE_FLOW_NEW, NULL);
}

static void
open_action (GtkWidget *widget, const char *name, GVariant *param)
{
  commit_focused_edit (SW_WINDOW (widget));
  sw_file_flow_ask_then (SW_WINDOW (widget)->file_flow, SW_FILE_FLOW_OPEN, NULL);
}

static void
open_recent_action (GtkWidget *widget, const char *name, GVariant *param)
{
  g_autoptr (GFile) file = g_file_new_for_uri (g_variant_get_string (param, NULL));

  commit_focused_edit (SW_WINDOW (widget));
  sw_file_flow_ask_then (SW_WINDOW (widget)->file_flow, SW_FILE_FLOW_OPEN_FILE, file);
}

static void
save_action (GtkWidget *widget, const char *name, GVariant *param)
{
  commit_focused_edit (SW_WINDOW (widget));
  sw_file_flow_save (SW_WINDOW (widget)->file_flow);
}

static void
save_as_action (GtkWidget *widget, const char *name, GVariant *param)
{
  commit_focused_edit (SW_WINDOW (widget));
  sw_file_flow_save_as (SW_WINDOW (widget)->file_flow);
}

static void
undo_action (GtkWidget *widget, const char *name, GVariant *param)
{
  sw_document_undo (SW_WINDOW (widget)->document);
}

static void
redo_action (GtkWidget *widget, const char *name, GVariant *param)
{
  sw_document_redo (SW_WINDOW (widget)->document);
}

static void
copy_working_action (GtkWidget *widget, const char *name, GVariant *param)
{
  SwWindow *self = SW_WINDOW (widget);
  g_autofree char *text = sw_working_view_dup_text (self->working_view);

  gdk_clipboard_set_text (gtk_widget_get_clipboard (widget), text);
}

static void
split_action (GtkWidget *widget, const char *name, GVariant *param)
{
  SwWindow *self = SW_WINDOW (widget);
  g_autoptr (SwDesign) d = sw_document_dup_design (self->document);
  double shares[SW_MAX_STAGES];
  guint n_shares = self->result != NULL && self->result->ok
                   ? sw_sizing_get_shares (&self->result->sizing, shares) : 0;
  SwSplitMode mode;

  if (!sw_split_mode_from_string (g_variant_get_string (param, NULL), &mode)
      || !sw_design_set_split (d, mode, shares, n_shares))
    return;
  sw_document_commit (self->document, g_steal_pointer (&d), NULL);
}

static void
page_action (GtkWidget *widget, const char *name, GVariant *param)
{
  gtk_notebook_set_current_page (SW_WINDOW (widget)->notebook, g_variant_get_int32 (param));
}

/* The structural coefficients estimated from the mass-estimating
 * relationships replace the design's, the boosters' included: one named
 * core edit, one undo step. */
static void
accept_eps_estimate_action (GtkWidget *widget, const char *name, GVariant *param)
{
  SwWindow *self = SW_WINDOW (widget);
  double eps[SW_MAX_STAGES], booster_eps;
  gboolean changes = FALSE;
  g_autoptr (SwDesign) d = NULL;

  if (!eps_estimate_applicable (self, eps, &booster_eps, &changes) || !changes)
    return;
  d = sw_document_dup_design (self->document);
  if (!sw_design_accept_estimated_coefficients (d, eps, d->n_stages, booster_eps, NULL, NULL))
    return;
  sw_document_commit (self->document, g_steal_pointer (&d), NULL);
}

/* The current design, as it is now, becomes the baseline (an undoable edit). */
static void
pin_baseline_action (GtkWidget *widget, const char *name, GVariant *param)
{
  SwWindow *self = SW_WINDOW (widget);
  g_autoptr (SwDesign) d = sw_document_dup_design (self->document);

  sw_design_pin_baseline (d);
  sw_document_commit (self->document, g_steal_pointer (&d), NULL);
}

static void
clear_baseline_action (GtkWidget *widget, const char *name, GVariant *param)
{
  SwWindow *self = SW_WINDOW (widget);
  g_autoptr (SwDesign) d = sw_document_dup_design (self->document);

  if (!sw_design_clear_baseline (d))
    return;
  sw_document_commit (self->document, g_steal_pointer (&d), NULL);
}

static void
export_action (GtkWidget *widget, const char *name, GVariant *param)
{
  SwWindow *self = SW_WINDOW (widget);

  commit_focused_edit (self);
  if (self->export_dialog == NULL)
    {
      self->export_dialog = sw_export_dialog_new (GTK_WINDOW (self), self->result,
                                                  sw_document_get_file (self->document));
      g_object_add_weak_pointer (G_OBJECT (self->export_dialog),
                                 (gpointer *) &self->export_dialog);
    }
  gtk_window_present (GTK_WINDOW (self->export_dialog));
}

/* The user's limits decide the verdict: a change is a new solve. */
static void
limits_changed_cb (SwWindow *self)
{
  SwAnalysisOptions options;

  sw_solver_get_options (self->solver, &options);
  options.min_thrust_to_weight = g_settings_get_double (self->settings, "min-thrust-to-weight");
  options.max_q_pa = 1000.0 * g_settings_get_double (self->settings, "max-dynamic-pressure-kpa");
  options.max_axial_g = g_settings_get_double (self->settings, "max-acceleration-g");
  sw_solver_set_options (self->solver, &options);
  if (sw_document_get_design (self->document) != NULL)
    sw_solver_post (self->solver, sw_document_get_design (self->document));
}

/* The tornado's step is a setting: a new step is a new solve. */
static void
trade_step_cb (SwWindow *self)
{
  SwAnalysisOptions options;

  sw_solver_get_options (self->solver, &options);
  if (options.sensitivity_step == sw_trade_page_get_step (self->trade_page))
    return;
  options.sensitivity_step = sw_trade_page_get_step (self->trade_page);
  sw_solver_set_options (self->solver, &options);
  sw_solver_post (self->solver, sw_document_get_design (self->document));
}

static void
show_page_action (GtkWidget *widget, const char *name, GVariant *param)
{
  sw_window_show_page (SW_WINDOW (widget), g_variant_get_string (param, NULL));
}

static gboolean
stage_shortcut_cb (GtkWidget *widget, GVariant *args, gpointer user_data)
{
  SwWindow *self = SW_WINDOW (widget);
  const char *action = g_variant_get_string (args, NULL);

  return gtk_widget_activate_action (GTK_WIDGET (self->inspector), action, NULL);
}

static gboolean
select_stage_cb (GtkWidget *widget, GVariant *args, gpointer user_data)
{
  SwWindow *self = SW_WINDOW (widget);
  int sel = sw_inspector_get_selected (self->inspector) + g_variant_get_int32 (args);
  GtkWidget *focus = gtk_root_get_focus (GTK_ROOT (self));

  /* Not while typing in a field: the key belongs to the field, and a new
   * stage must not replace what is being typed. */
  if (focus != NULL && (GTK_IS_EDITABLE (focus) || GTK_IS_TEXT_VIEW (focus)))
    return FALSE;
  if (sel < 0 || (guint) sel >= sw_document_get_design (self->document)->n_stages)
    return FALSE;
  sw_inspector_set_selected (self->inspector, sel);
  return TRUE;
}

/* ---- accessors for tests ----------------------------------------------- */

SwDocument *
sw_window_get_document (SwWindow *self)
{
  g_return_val_if_fail (SW_IS_WINDOW (self), NULL);
  return self->document;
}

SwSolver *
sw_window_get_solver (SwWindow *self)
{
  g_return_val_if_fail (SW_IS_WINDOW (self), NULL);
  return self->solver;
}

SwInspector *
sw_window_get_inspector (SwWindow *self)
{
  g_return_val_if_fail (SW_IS_WINDOW (self), NULL);
  return self->inspector;
}

SwStackView *
sw_window_get_stack_view (SwWindow *self)
{
  g_return_val_if_fail (SW_IS_WINDOW (self), NULL);
  return self->stack_view;
}

SwTotals *
sw_window_get_totals (SwWindow *self)
{
  g_return_val_if_fail (SW_IS_WINDOW (self), NULL);
  return self->totals;
}

GtkWidget *
sw_window_get_scale_toggle (SwWindow *self)
{
  g_return_val_if_fail (SW_IS_WINDOW (self), NULL);
  return GTK_WIDGET (self->scale_view_button);
}

SwWorkingView *
sw_window_get_working_view (SwWindow *self)
{
  g_return_val_if_fail (SW_IS_WINDOW (self), NULL);
  return self->working_view;
}

SwAscentPage *
sw_window_get_ascent_page (SwWindow *self)
{
  g_return_val_if_fail (SW_IS_WINDOW (self), NULL);
  return self->ascent_page;
}

gboolean
sw_window_show_page (SwWindow *self, const char *name)
{
  GtkWidget *page = NULL;

  g_return_val_if_fail (SW_IS_WINDOW (self), FALSE);

  if (g_strcmp0 (name, "ascent") == 0)
    page = GTK_WIDGET (self->ascent_page);
  else if (g_strcmp0 (name, "working") == 0)
    page = GTK_WIDGET (self->working_view);
  else if (g_strcmp0 (name, "trade") == 0)
    page = GTK_WIDGET (self->trade_page);
  else if (g_strcmp0 (name, "staging") == 0 || g_strcmp0 (name, "carpet") == 0)
    page = GTK_WIDGET (self->staging_page);
  else if (g_strcmp0 (name, "curves") == 0)
    page = gtk_notebook_get_nth_page (self->notebook, 0);
  if (page == NULL || gtk_notebook_page_num (self->notebook, page) < 0)
    return FALSE;
  gtk_notebook_set_current_page (self->notebook, gtk_notebook_page_num (self->notebook, page));
  return TRUE;
}

SwTradePage *
sw_window_get_trade_page (SwWindow *self)
{
  g_return_val_if_fail (SW_IS_WINDOW (self), NULL);
  return self->trade_page;
}

SwStagingPage *
sw_window_get_staging_page (SwWindow *self)
{
  g_return_val_if_fail (SW_IS_WINDOW (self), NULL);
  return self->staging_page;
}

SwExportDialog *
sw_window_get_export_dialog (SwWindow *self)
{
  g_return_val_if_fail (SW_IS_WINDOW (self), NULL);
  return self->export_dialog;
}

const char *
sw_window_get_curves_note (SwWindow *self)
{
  g_return_val_if_fail (SW_IS_WINDOW (self), NULL);
  return gtk_widget_get_visible (GTK_WIDGET (self->curves_note))
           ? gtk_label_get_text (self->curves_note) : NULL;
}

SwPlot *
sw_window_get_plot (SwWindow *self, guint which)
{
  g_return_val_if_fail (SW_IS_WINDOW (self), NULL);
  return which == 0 ? self->stage_count_plot : self->sweep_plot;
}

SwAnalysis *
sw_window_get_shown_result (SwWindow *self)
{
  g_return_val_if_fail (SW_IS_WINDOW (self), NULL);
  return self->result;
}

guint64
sw_window_get_drawn_serial (SwWindow *self)
{
  g_return_val_if_fail (SW_IS_WINDOW (self), 0);
  return self->drawn_serial;
}

const char *
sw_window_get_message (SwWindow *self, GtkMessageType *type)
{
  g_return_val_if_fail (SW_IS_WINDOW (self), NULL);
  if (!gtk_info_bar_get_revealed (self->message_bar))
    return NULL;
  if (type != NULL)
    *type = gtk_info_bar_get_message_type (self->message_bar);
  return gtk_label_get_text (self->message_label);
}

void
sw_window_set_ephemeral (SwWindow *self)
{
  g_return_if_fail (SW_IS_WINDOW (self));

  self->ephemeral = TRUE;
  sw_file_flow_set_ephemeral (self->file_flow, TRUE);
  g_settings_unbind (self, "default-width");
  g_settings_unbind (self, "default-height");
  g_settings_unbind (self, "maximized");
  /* Leave an offered copy on disk for the next real session. */
  sw_recovery_disable (self->recovery);
  gtk_info_bar_set_revealed (self->recovery_bar, FALSE);
}

/* ---- GObject ----------------------------------------------------------- */

SwWindow *
sw_window_new (GtkApplication *application)
{
  return g_object_new (SW_TYPE_WINDOW, "application", application, NULL);
}

static gboolean
sw_window_close_request (GtkWindow *window)
{
  SwWindow *self = SW_WINDOW (window);

  if (!self->closing)
    commit_focused_edit (self);
  if (!self->closing && !self->ephemeral && sw_document_get_modified (self->document))
    {
      sw_file_flow_ask_then (self->file_flow, SW_FILE_FLOW_CLOSE, NULL);
      return TRUE;
    }
  /* A clean close: the work is saved or was discarded on purpose. */
  sw_recovery_remove (self->recovery);
  return GTK_WINDOW_CLASS (sw_window_parent_class)->close_request (window);
}

/* On X11 without a window manager (a virtual display, a kiosk), GDK asks
 * the server twice at the end of every frame whether the window manager
 * takes part in frame synchronisation: with none running the answer is
 * never kept, and each question waits until the server has shown the
 * frame (about 1 ms a frame under Xvfb).  No window manager, no
 * synchronisation to wait for: it is switched off for this window.  With
 * a window manager GDK keeps its answer and nothing changes.  (GDK cannot
 * switch it on again, so a window manager started later paces this
 * window by GDK's own timer.) */
static void
skip_absent_frame_sync (GtkWidget *widget)
{
#ifdef GDK_WINDOWING_X11
  GdkSurface *surface = gtk_native_get_surface (GTK_NATIVE (widget));
  GdkDisplay *display = gtk_widget_get_display (widget);

  if (GDK_IS_X11_SURFACE (surface) && GDK_IS_X11_DISPLAY (display)
      && !gdk_x11_screen_supports_net_wm_hint (gdk_x11_display_get_screen (display),
                                               "_NET_WM_FRAME_DRAWN"))
    gdk_x11_surface_set_frame_sync_enabled (surface, FALSE);
#endif
}

static void
sw_window_realize (GtkWidget *widget)
{
  SwWindow *self = SW_WINDOW (widget);

  GTK_WIDGET_CLASS (sw_window_parent_class)->realize (widget);
  skip_absent_frame_sync (widget);
  self->frame_clock = g_object_ref (gtk_widget_get_frame_clock (widget));
  g_signal_connect_object (self->frame_clock, "after-paint", G_CALLBACK (after_paint_cb), self,
                           G_CONNECT_SWAPPED);
}

static void
sw_window_unrealize (GtkWidget *widget)
{
  SwWindow *self = SW_WINDOW (widget);

  if (self->frame_clock != NULL)
    {
      g_signal_handlers_disconnect_by_func (self->frame_clock, after_paint_cb, self);
      g_clear_object (&self->frame_clock);
    }
  GTK_WIDGET_CLASS (sw_window_parent_class)->unrealize (widget);
}

static void
sw_window_dispose (GObject *object)
{
  SwWindow *self = SW_WINDOW (object);

  /* Gone without a clean close (the session ends, say): the recovery
   * object keeps the work when it goes. */
  if (self->recovery != NULL && self->closing)
    sw_recovery_disable (self->recovery);
  g_clear_object (&self->recovery);
  if (self->file_flow != NULL)
    sw_file_flow_abandon (self->file_flow);
  g_clear_object (&self->file_flow);
  if (self->solver != NULL)
    g_signal_handlers_disconnect_by_func (self->solver, solved_cb, self);
  g_clear_object (&self->solver);
  if (self->document != NULL)
    g_signal_handlers_disconnect_by_func (self->document, document_changed_cb, self);
  g_clear_object (&self->document);
  g_clear_pointer (&self->result, sw_analysis_unref);
  g_clear_pointer (&self->drag_base, sw_design_free);
  g_clear_object (&self->settings);
  gtk_widget_dispose_template (GTK_WIDGET (self), SW_TYPE_WINDOW);
  G_OBJECT_CLASS (sw_window_parent_class)->dispose (object);
}

static void
sw_window_class_init (SwWindowClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);
  GtkWindowClass *window_class = GTK_WINDOW_CLASS (klass);

  object_class->dispose = sw_window_dispose;
  widget_class->realize = sw_window_realize;
  widget_class->unrealize = sw_window_unrealize;
  window_class->close_request = sw_window_close_request;

  signals[RESULT_DRAWN] = g_signal_new ("result-drawn", G_TYPE_FROM_CLASS (klass),
                                        G_SIGNAL_RUN_LAST, 0, NULL, NULL, NULL,
                                        G_TYPE_NONE, 1, G_TYPE_UINT64);

  g_type_ensure (SW_TYPE_INSPECTOR);
  g_type_ensure (SW_TYPE_STACK_VIEW);
  g_type_ensure (SW_TYPE_TOTALS);
  g_type_ensure (SW_TYPE_PLOT);
  g_type_ensure (SW_TYPE_WORKING_VIEW);
  g_type_ensure (SW_TYPE_ASCENT_PAGE);
  g_type_ensure (SW_TYPE_TRADE_PAGE);

  gtk_widget_class_set_template_from_resource (widget_class,
                                               "/org/stagewright/Stagewright/sw-window.ui");
#define CHILD(name) gtk_widget_class_bind_template_child (widget_class, SwWindow, name)
  CHILD (title_label);
  CHILD (subtitle_label);
  CHILD (recovery_bar);
  CHILD (recovery_label);
  CHILD (message_bar);
  CHILD (message_label);
  CHILD (inspector);
  CHILD (stack_view);
  CHILD (scale_view_button);
  CHILD (totals);
  CHILD (notebook);
  CHILD (stage_count_plot);
  CHILD (sweep_plot);
  CHILD (curves_note);
  CHILD (working_view);
  CHILD (ascent_page);
  CHILD (trade_page);
  CHILD (recent_menu);
#undef CHILD
  gtk_widget_class_bind_template_callback (widget_class, recovery_response_cb);
  gtk_widget_class_bind_template_callback (widget_class, message_response_cb);
  gtk_widget_class_bind_template_callback (widget_class, stage_activated_cb);
  gtk_widget_class_bind_template_callback (widget_class, share_dragged_cb);
  gtk_widget_class_bind_template_callback (widget_class, ascent_summary_cb);

  gtk_widget_class_install_action (widget_class, "design.new", NULL, new_action);
  gtk_widget_class_install_action (widget_class, "design.open", NULL, open_action);
  gtk_widget_class_install_action (widget_class, "design.open-recent", "s", open_recent_action);
  gtk_widget_class_install_action (widget_class, "design.save", NULL, save_action);
  gtk_widget_class_install_action (widget_class, "design.save-as", NULL, save_as_action);
  gtk_widget_class_install_action (widget_class, "design.undo", NULL, undo_action);
  gtk_widget_class_install_action (widget_class, "design.redo", NULL, redo_action);
  gtk_widget_class_install_action (widget_class, "design.copy-working", NULL,
                                   copy_working_action);
  gtk_widget_class_install_action (widget_class, "design.split", "s", split_action);
  gtk_widget_class_install_action (widget_class, "design.accept-eps-estimate", NULL,
                                   accept_eps_estimate_action);
  gtk_widget_class_install_action (widget_class, "view.page", "i", page_action);
  gtk_widget_class_install_action (widget_class, "view.show-page", "s", show_page_action);
  gtk_widget_class_install_action (widget_class, "design.pin-baseline", NULL,
                                   pin_baseline_action);
  gtk_widget_class_install_action (widget_class, "design.clear-baseline", NULL,
                                   clear_baseline_action);
  gtk_widget_class_install_action (widget_class, "design.export", NULL, export_action);

#define BIND(key, mods, action, ...) \
  gtk_widget_class_add_binding_action (widget_class, key, mods, action, __VA_ARGS__)
  BIND (GDK_KEY_n, GDK_CONTROL_MASK, "design.new", NULL);
  BIND (GDK_KEY_o, GDK_CONTROL_MASK, "design.open", NULL);
  BIND (GDK_KEY_s, GDK_CONTROL_MASK, "design.save", NULL);
  BIND (GDK_KEY_s, GDK_CONTROL_MASK | GDK_SHIFT_MASK, "design.save-as", NULL);
  BIND (GDK_KEY_z, GDK_CONTROL_MASK, "design.undo", NULL);
  BIND (GDK_KEY_z, GDK_CONTROL_MASK | GDK_SHIFT_MASK, "design.redo", NULL);
  BIND (GDK_KEY_y, GDK_CONTROL_MASK, "design.redo", NULL);
  BIND (GDK_KEY_c, GDK_CONTROL_MASK | GDK_SHIFT_MASK, "design.copy-working", NULL);
  BIND (GDK_KEY_1, GDK_CONTROL_MASK, "design.split", "s", "equal");
  BIND (GDK_KEY_2, GDK_CONTROL_MASK, "design.split", "s", "optimal");
  BIND (GDK_KEY_3, GDK_CONTROL_MASK, "design.split", "s", "manual");
  BIND (GDK_KEY_1, GDK_ALT_MASK, "view.page", "i", 0);
  BIND (GDK_KEY_2, GDK_ALT_MASK, "view.page", "i", 1);
  BIND (GDK_KEY_3, GDK_ALT_MASK, "view.show-page", "s", "ascent");
  BIND (GDK_KEY_4, GDK_ALT_MASK, "view.show-page", "s", "trade");
  BIND (GDK_KEY_e, GDK_CONTROL_MASK, "design.export", NULL);
  BIND (GDK_KEY_w, GDK_CONTROL_MASK, "window.close", NULL);
#undef BIND
  gtk_widget_class_add_binding (widget_class, GDK_KEY_n, GDK_CONTROL_MASK | GDK_SHIFT_MASK,
                                stage_shortcut_cb, "s", "stage.add");
  gtk_widget_class_add_binding (widget_class, GDK_KEY_d, GDK_CONTROL_MASK,
                                stage_shortcut_cb, "s", "stage.duplicate");
  gtk_widget_class_add_binding (widget_class, GDK_KEY_Delete, GDK_CONTROL_MASK,
                                stage_shortcut_cb, "s", "stage.remove");
  gtk_widget_class_add_binding (widget_class, GDK_KEY_Up, GDK_ALT_MASK,
                                stage_shortcut_cb, "s", "stage.move-up");
  gtk_widget_class_add_binding (widget_class, GDK_KEY_Down, GDK_ALT_MASK,
                                stage_shortcut_cb, "s", "stage.move-down");
  gtk_widget_class_add_binding (widget_class, GDK_KEY_Page_Up, GDK_CONTROL_MASK,
                                select_stage_cb, "i", -1);
  gtk_widget_class_add_binding (widget_class, GDK_KEY_Page_Down, GDK_CONTROL_MASK,
                                select_stage_cb, "i", +1);
}

static void
sw_window_init (SwWindow *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));

  /* One settings object, handed to the views. */
  self->settings = sw_settings_new ();
  sw_inspector_set_settings (self->inspector, self->settings);
  sw_ascent_page_set_settings (self->ascent_page, self->settings);
  sw_trade_page_set_settings (self->trade_page, self->settings);
  g_settings_bind (self->settings, "stack-to-scale", self->scale_view_button, "active",
                   G_SETTINGS_BIND_DEFAULT);
  g_object_bind_property (self->scale_view_button, "active", self->stack_view, "to-scale",
                          G_BINDING_SYNC_CREATE);
  g_settings_bind (self->settings, "window-width", self, "default-width",
                   G_SETTINGS_BIND_DEFAULT);
  g_settings_bind (self->settings, "window-height", self, "default-height",
                   G_SETTINGS_BIND_DEFAULT);
  g_settings_bind (self->settings, "window-maximized", self, "maximized",
                   G_SETTINGS_BIND_DEFAULT);

  self->document = sw_document_new ();
  self->solver = sw_solver_new ();
  g_signal_connect_swapped (self->document, "changed", G_CALLBACK (document_changed_cb), self);
  g_signal_connect_swapped (self->solver, "solved", G_CALLBACK (solved_cb), self);
  sw_inspector_set_document (self->inspector, self->document);
  sw_trade_page_set_document (self->trade_page, self->document);
  self->staging_page = SW_STAGING_PAGE (sw_staging_page_new ());
  sw_staging_page_set_document (self->staging_page, self->document);
  gtk_notebook_append_page (self->notebook, GTK_WIDGET (self->staging_page),
                            gtk_label_new_with_mnemonic (_("Stagin_g decision")));
  /* Five tabs: let the tab row scroll rather than widen the window. */
  gtk_notebook_set_scrollable (self->notebook, TRUE);
  {
    SwAnalysisOptions options;
    sw_solver_get_options (self->solver, &options);
    options.sensitivity_step = sw_trade_page_get_step (self->trade_page);
    options.min_thrust_to_weight = g_settings_get_double (self->settings, "min-thrust-to-weight");
    options.max_q_pa = 1000.0 * g_settings_get_double (self->settings,
                                                       "max-dynamic-pressure-kpa");
    options.max_axial_g = g_settings_get_double (self->settings, "max-acceleration-g");
    sw_solver_set_options (self->solver, &options);
  }
  g_signal_connect_swapped (self->settings, "changed::min-thrust-to-weight",
                            G_CALLBACK (limits_changed_cb), self);
  g_signal_connect_swapped (self->settings, "changed::max-dynamic-pressure-kpa",
                            G_CALLBACK (limits_changed_cb), self);
  g_signal_connect_swapped (self->settings, "changed::max-acceleration-g",
                            G_CALLBACK (limits_changed_cb), self);
  g_signal_connect_swapped (self->trade_page, "notify::step", G_CALLBACK (trade_step_cb), self);
  /* One way: the stack view may refuse a stage its older result does not
   * have yet; its clicks come back through "stage-activated". */
  g_object_bind_property (self->inspector, "selected-stage", self->stack_view, "selected-stage",
                          G_BINDING_SYNC_CREATE);
  g_signal_connect_swapped (self->inspector, "notify::selected-stage",
                            G_CALLBACK (selected_stage_cb), self);
  selected_stage_cb (self);

  self->recovery = sw_recovery_new (self->document);
  self->file_flow = sw_file_flow_new (GTK_WINDOW (self), self->document, self->recovery,
                                      self->settings, self->recent_menu);
  g_signal_connect_swapped (self->file_flow, "message", G_CALLBACK (flow_message_cb), self);
  g_signal_connect_swapped (self->file_flow, "reset", G_CALLBACK (flow_reset_cb), self);
  g_signal_connect_swapped (self->file_flow, "close",
                            G_CALLBACK (sw_window_close_discarding), self);
  check_recovery (self);

  update_title (self);
  update_actions (self);
  sw_solver_post (self->solver, sw_document_get_design (self->document));

  /* Start with the stage list focused, not with a text field selected. */
  {
    GtkListBox *list = GTK_LIST_BOX (sw_inspector_get_field (self->inspector,
                                                             SW_INSPECTOR_STAGE_LIST));
    GtkListBoxRow *row = gtk_list_box_get_row_at_index (list, 0);
    if (row != NULL)
      gtk_window_set_focus (GTK_WINDOW (self), GTK_WIDGET (row));
  }
}
