/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-ascent-page"

#include "config.h"

#include "sw-ascent-page.h"

#include "sw-format.h"
#include "sw-number-field.h"
#include "sw-spinner.h"

#include <glib/gi18n.h>
#include <math.h>
#include <string.h>

/* Loss bars whose size rounds to nothing are left out. */
#define MIN_LOSS_M_S 0.5
/* A limit line is drawn in a plot only when it lies this close above the
 * curve's peak, so it does not flatten the curve. */
#define LIMIT_LINE_REACH 1.6

struct _SwAscentPage {
  GtkWidget      parent_instance;

  SwAnalysis      *result;         /* the newest */
  SwAnalysis      *flown;          /* the newest with an ascent; older while one is pending */
  GSettings     *settings;
  char          *note;
  char          *warnings;
  char          *stages_key;     /* the texts of the stage table as shown */
  gboolean       stale;          /* a result not shown yet: the page was not mapped */
  gboolean       stale_flown;    /* ... and it brought another flight */

  GtkWidget     *scroller;
  GtkBox        *status_box;
  GtkStack      *busy_stack;
  GtkSpinner    *busy_spinner;
  GtkImage      *status_image;
  GtkLabel      *status_label;
  GtkWidget     *warnings_box;
  GtkLabel      *warnings_label;
  GtkWidget     *figures_grid;
  SwOptimisedSteering *optimised;  /* on demand, below the figures */
  GtkLabel      *orbit_caption;
  GtkLabel      *orbit_label;
  GtkLabel      *rotation_label;
  GtkLabel      *losses_label;
  GtkLabel      *allowance_label;
  GtkLabel      *max_q_label;
  GtkLabel      *max_q_when_label;
  GtkLabel      *max_accel_label;
  GtkLabel      *max_accel_when_label;
  GtkGrid       *stages_grid;
  GtkWidget     *plots_grid;
  GtkWidget     *veil;
  SwPlot        *plots[SW_ASCENT_N_PLOTS];
  GtkAdjustment *min_tw_adjustment;
  GtkAdjustment *max_q_adjustment;
  GtkAdjustment *max_g_adjustment;
  GtkWidget     *min_tw_spin;      /* the limits popover's spin buttons */
  GtkWidget     *max_q_spin;
  GtkWidget     *max_g_spin;
};

G_DEFINE_FINAL_TYPE (SwAscentPage, sw_ascent_page, GTK_TYPE_WIDGET)

enum { SUMMARY_CHANGED, N_SIGNALS };
static guint signals[N_SIGNALS];

/* ---- numbers: through the one formatter (sw-format.h) ------------------- */

static char *
fmt_time (double s)
{
  g_autofree char *d = sw_format_duration (s);

  if (!isfinite (s))
    return g_strdup (SW_NO_VALUE);
  /* Translators: time after liftoff, %s is a duration such as "152.3 s" */
  return g_strdup_printf (_("T+%s"), d);
}

static char *
fmt_orbit (double perigee_km, double apogee_km, int decimals)
{
  g_autofree char *p = sw_format_number (perigee_km, decimals);
  g_autofree char *q = sw_format_number (apogee_km, decimals);

  if (!isfinite (perigee_km) || !isfinite (apogee_km))
    return g_strdup (SW_NO_VALUE);
  /* Translators: perigee and apogee altitudes in km */
  return g_strdup_printf (_("%s × %s km"), p, q);
}

#define fmt_km(m) sw_format_distance_km (m)
#define fmt_kpa(pa) sw_format_pressure_kpa (pa)
#define fmt_g(g) sw_format_accel_g (g)
#define fmt_ratio(r) sw_format_ratio ((r), 2)
#define fmt_seconds(s) sw_format_duration (s)

static gboolean
simulates_losses (const SwAnalysis *r)
{
  return r != NULL && r->ok && r->design->mission.kind == SW_MISSION_ORBIT
         && r->design->mission.loss_model == SW_LOSS_SIMULATE;
}

/* The losses the fast phase sized with: the allowance, or the closed loop's
 * first guess. */
static double
fast_losses (const SwAnalysis *r)
{
  return r->has_budget ? r->budget.losses_m_s : NAN;
}

static const SwAscentResult *
shown_ascent (SwAscentPage *self)
{
  return self->flown != NULL ? self->flown->ascent : NULL;
}

/* ---- warnings ---------------------------------------------------------- */

char *
sw_ascent_warnings_text (const SwAnalysis *result, const SwAscentResult *ascent,
                         double min_thrust_to_weight, double max_q_pa, double max_g)
{
  GString *s = g_string_new (NULL);
  double tw = NAN;

  /* The figure the verdict and the sheet name (a stage the split leaves
   * empty does not lift off). */
  if (result != NULL && result->ok)
    tw = sw_analysis_liftoff_tw (result);
  if (!isfinite (tw) && ascent != NULL)
    tw = ascent->liftoff_thrust_to_weight;

  if (isfinite (tw) && tw < min_thrust_to_weight)
    {
      g_autofree char *a = sw_format_ratio (tw, 2), *b = sw_format_ratio (min_thrust_to_weight, 2);
      /* Translators: thrust-to-weight ratios, then the user's limit */
      g_string_append_printf (s, _("Liftoff thrust-to-weight %s is below the limit of %s "
                                   "(common practice: at least about 1.2)."), a, b);
    }
  if (ascent != NULL && isfinite (ascent->max_q_pa) && ascent->max_q_pa > max_q_pa)
    {
      if (s->len > 0)
        g_string_append_c (s, '\n');
      g_autofree char *q = sw_format_pressure_kpa (ascent->max_q_pa);
      g_autofree char *t = fmt_time (ascent->max_q_time_s);
      g_autofree char *lim = sw_format_pressure_kpa (max_q_pa);
      /* Translators: a pressure, a time after liftoff ("T+65.2 s"), the limit */
      g_string_append_printf (s, _("Max-Q %s at %s exceeds the limit of %s."), q, t, lim);
    }
  if (ascent != NULL && isfinite (ascent->max_axial_g) && ascent->max_axial_g > max_g)
    {
      if (s->len > 0)
        g_string_append_c (s, '\n');
      g_autofree char *g = sw_format_accel_g (ascent->max_axial_g);
      g_autofree char *t = fmt_time (ascent->max_axial_g_time_s);
      g_autofree char *lim = sw_format_accel_g (max_g);
      /* Translators: an acceleration, a time after liftoff ("T+65.2 s"), the limit */
      g_string_append_printf (s, _("Axial acceleration reaches %s at %s, above the limit of %s."),
                              g, t, lim);
    }
  if (s->len == 0)
    {
      g_string_free (s, TRUE);
      return NULL;
    }
  return g_string_free (s, FALSE);
}

/* The note on the sizing: what the closed loop did with the losses, or how
 * the simulated losses compare with the allowance. */
static char *
note_text (SwAscentPage *self)
{
  SwAnalysis *r = self->result;
  const SwAscentResult *a;
  g_autofree char *guess = NULL, *losses = NULL, *allowed = NULL, *diff = NULL;

  if (r == NULL || !r->ok)
    return NULL;
  a = r->ascent;
  guess = sw_format_speed (fast_losses (r));
  if (simulates_losses (r))
    {
      if (r->ascent_pending)
        /* Translators: %s is a speed such as "1,600 m/s" */
        return g_strdup_printf (_("Simulating the ascent: until it arrives, the sizing uses the "
                                  "first guess of %s of losses."), guess);
      if (r->sized_by_ascent)
        {
          losses = sw_format_speed (a->loop_sized_losses_m_s);
          /* Translators: %s is a speed; %u the number of sizing passes */
          return g_strdup_printf (g_dngettext (GETTEXT_PACKAGE,
                                               "Sized with simulated losses: %s (closed loop, "
                                               "%u pass).",
                                               "Sized with simulated losses: %s (closed loop, "
                                               "%u passes).", a->loop_iterations),
                                  losses, a->loop_iterations);
        }
      /* Translators: %s is a speed such as "1,600 m/s" */
      return g_strdup_printf (_("No simulated losses to size with: the sizing uses the first "
                                "guess of %s (see the Ascent page)."), guess);
    }
  /* The note of the last ascent stays until the next one arrives: a note
   * that changes twice per edit would relayout the totals each time (the
   * page's status line says that a simulation runs). */
  if (r->ascent_pending)
    return g_strdup (self->note);
  if (a == NULL || !isfinite (a->losses_m_s))
    return NULL;
  losses = sw_format_speed (a->losses_m_s);
  allowed = sw_format_speed (fast_losses (r));
  if (a->status == SW_ASCENT_REACHED)
    {
      diff = sw_format_speed (a->delta_v_margin_m_s);
      /* Translators: three speeds: spare delta-v, simulated losses, allowance */
      return g_strdup_printf (_("The simulated ascent reaches the orbit with %s to spare "
                                "(losses %s against the allowance of %s)."),
                              diff, losses, allowed);
    }
  if (a->status == SW_ASCENT_SHORT)
    {
      diff = sw_format_speed (a->delta_v_missing_m_s);
      /* Translators: three speeds: simulated losses, allowance, delta-v missing */
      return g_strdup_printf (_("The simulated ascent needs %s of losses against the allowance "
                                "of %s: it falls %s short of the orbit."),
                              losses, allowed, diff);
    }
  return NULL;
}

static void
set_text_box (GtkWidget *box, GtkLabel *label, const char *text)
{
  if (g_strcmp0 (gtk_label_get_text (label), text != NULL ? text : "") != 0)
    gtk_label_set_text (label, text != NULL ? text : "");
  gtk_widget_set_visible (box, text != NULL);
}

static void
update_summary (SwAscentPage *self)
{
  g_autofree char *note = note_text (self);
  g_autofree char *warnings = NULL;
  gboolean changed;

  warnings = sw_ascent_warnings_text (self->result, shown_ascent (self),
                                      gtk_adjustment_get_value (self->min_tw_adjustment),
                                      1000.0 * gtk_adjustment_get_value (self->max_q_adjustment),
                                      gtk_adjustment_get_value (self->max_g_adjustment));
  changed = g_strcmp0 (note, self->note) != 0 || g_strcmp0 (warnings, self->warnings) != 0;
  g_free (self->note);
  self->note = g_steal_pointer (&note);
  g_free (self->warnings);
  self->warnings = g_steal_pointer (&warnings);
  if (changed)
    g_signal_emit (self, signals[SUMMARY_CHANGED], 0);
}

/* ---- status line ------------------------------------------------------- */

typedef enum { STATUS_OK, STATUS_NOTE, STATUS_SHORT, STATUS_BAD } StatusKind;

static void
set_busy (SwAscentPage *self, gboolean busy)
{
  gtk_stack_set_visible_child_name (self->busy_stack, busy ? "busy" : "idle");
  sw_spinner_set_busy (self->busy_spinner, busy);
}

static void
set_status (SwAscentPage *self, StatusKind kind, const char *text)
{
  /* Short of the orbit is a failed mission, styled as one; its icon tells
   * it from a design that cannot fly at all. */
  static const char *const classes[] = { "sw-status-ok", "sw-status-note", "sw-status-bad",
                                         "sw-status-bad" };
  static const char *const icons[] = { "object-select-symbolic", "dialog-information-symbolic",
                                       "dialog-warning-symbolic", "dialog-error-symbolic" };

  for (guint i = 0; i < G_N_ELEMENTS (classes); i++)
    if (strcmp (classes[i], classes[kind]) != 0)
      gtk_widget_remove_css_class (GTK_WIDGET (self->status_box), classes[i]);
  gtk_widget_add_css_class (GTK_WIDGET (self->status_box), classes[kind]);
  gtk_image_set_from_icon_name (self->status_image, icons[kind]);
  if (g_strcmp0 (gtk_label_get_text (self->status_label), text) != 0)
    gtk_label_set_text (self->status_label, text);
}

static void
update_status (SwAscentPage *self)
{
  SwAnalysis *r = self->result;
  const SwAscentResult *a;
  g_autofree char *text = NULL, *orbit = NULL, *missing = NULL, *cutoff = NULL;
  StatusKind kind;

  set_busy (self, r == NULL || (r->ok && r->ascent_pending));
  if (r == NULL)
    {
      set_status (self, STATUS_NOTE, _("Waiting for the first sizing…"));
      return;
    }
  if (!r->ok)
    {
      text = g_strdup_printf (_("No ascent: the design cannot be sized. %s"), r->error_message);
      set_status (self, STATUS_BAD, text);
      return;
    }
  /* While the newest is simulated, the last ascent's state stays (under
   * the spinner), so the page does not jump on every edit. */
  if (r->ascent_pending && self->flown != NULL)
    r = self->flown;
  if (r->ascent_pending)
    {
      set_status (self, STATUS_NOTE,
                  simulates_losses (r)
                  ? _("Simulating the ascent and sizing the vehicle with its losses…")
                  : _("Simulating the ascent…"));
      return;
    }
  a = r->ascent;
  if (a == NULL)
    {
      text = g_strdup_printf (_("No ascent simulated. %s"),
                              r->ascent_message);
      if (r->has_stage_figures)
        {
          char *more = g_strdup_printf ("%s\n%s", text,
                                        _("Below: thrust-to-weight and burn time from the sized "
                                          "masses (first stage at sea level with the fairing, "
                                          "upper stages in vacuum)."));
          g_free (text);
          text = more;
        }
      set_status (self, STATUS_NOTE, text);
      return;
    }

  switch (a->status)
    {
    case SW_ASCENT_REACHED:
      orbit = fmt_orbit (a->perigee_km, a->apogee_km, 1);
      cutoff = fmt_time (a->cutoff.time_s);
      /* Translators: an orbit such as "250.0 × 250.0 km", then a time such as "T+564.1 s" */
      text = g_strdup_printf (_("Orbit reached: %s, engine cutoff at %s."), orbit, cutoff);
      kind = STATUS_OK;
      break;
    case SW_ASCENT_SHORT:
      /* The core says by how much and why. */
      missing = sw_format_speed (a->delta_v_missing_m_s);
      text = a->reason[0] != '\0' ? g_strdup (a->reason)
                                  /* Translators: %s is a speed such as "722 m/s" */
                                  : g_strdup_printf (_("Short of the orbit by %s of delta-v."),
                                                     missing);
      kind = STATUS_SHORT;
      break;
    case SW_ASCENT_NO_SOLUTION:
    case SW_ASCENT_NOT_SIMULATED:
    case SW_ASCENT_UNGUIDED:
    default:
      text = g_strdup_printf (_("No ascent to the orbit. %s"), a->reason);
      kind = STATUS_BAD;
      break;
    }
  if (a->notes[0] != '\0')
    {
      char *with_notes = g_strdup_printf ("%s\n%s", text, a->notes);
      g_free (text);
      text = with_notes;
    }
  set_status (self, kind, text);
}

/* ---- figures ----------------------------------------------------------- */

static void
set_label (GtkLabel *label, const char *text)
{
  if (g_strcmp0 (gtk_label_get_text (label), text) != 0)
    gtk_label_set_text (label, text);
}

static void
update_figures (SwAscentPage *self)
{
  const SwAscentResult *a = shown_ascent (self);
  g_autofree char *orbit = NULL, *rotation = NULL, *rot = NULL, *losses = NULL;
  g_autofree char *allowance = NULL, *allow = NULL, *q = NULL, *q_when = NULL;
  g_autofree char *q_t = NULL, *q_alt = NULL, *g = NULL, *g_when = NULL, *g_t = NULL;

  set_label (self->orbit_caption, a == NULL || a->reached_orbit ? _("Orbit reached")
                                  : _("Path at burnout"));
  if (a == NULL)
    {
      set_label (self->orbit_label, SW_NO_VALUE);
      set_label (self->rotation_label, "");
      set_label (self->losses_label, SW_NO_VALUE);
      set_label (self->allowance_label, "");
      set_label (self->max_q_label, SW_NO_VALUE);
      set_label (self->max_q_when_label, "");
      set_label (self->max_accel_label, SW_NO_VALUE);
      set_label (self->max_accel_when_label, "");
      return;
    }

  orbit = fmt_orbit (a->perigee_km, a->apogee_km, 0);
  rot = sw_format_speed (a->rotation_gain_m_s);
  /* Translators: %s is a speed such as "355 m/s" */
  rotation = g_strdup_printf (_("rotation gain %s"), rot);
  losses = sw_format_speed (a->losses_m_s);
  if (a->closed_loop)
    {
      allow = sw_format_speed (a->loop_sized_losses_m_s);
      /* Translators: %s is a speed such as "1,869 m/s" */
      allowance = g_strdup_printf (_("sized with %s"), allow);
    }
  else
    {
      allow = sw_format_speed (self->flown->has_budget ? self->flown->budget.losses_m_s : NAN);
      /* Translators: %s is a speed such as "1,500 m/s" */
      allowance = g_strdup_printf (_("allowance %s"), allow);
    }
  q = fmt_kpa (a->max_q_pa);
  q_t = fmt_time (a->max_q_time_s);
  q_alt = fmt_km (a->max_q_altitude_m);
  /* Translators: a time after liftoff and an altitude */
  q_when = g_strdup_printf (_("%s, %s"), q_t, q_alt);
  g = fmt_g (a->max_axial_g);
  g_when = fmt_time (a->max_axial_g_time_s);

  set_label (self->orbit_label, orbit);
  set_label (self->rotation_label, rotation);
  set_label (self->losses_label, losses);
  set_label (self->allowance_label, allowance);
  set_label (self->max_q_label, q);
  set_label (self->max_q_when_label, q_when);
  set_label (self->max_accel_label, g);
  set_label (self->max_accel_when_label, g_when);
}

/* ---- per-stage table --------------------------------------------------- */

static void
grid_text (GtkGrid *grid, int column, int row, const char *text, gboolean heading)
{
  GtkWidget *label = gtk_label_new (text);

  gtk_label_set_xalign (GTK_LABEL (label), column == 0 ? 0.0f : 1.0f);
  gtk_label_set_ellipsize (GTK_LABEL (label), column == 0 ? PANGO_ELLIPSIZE_END
                                                          : PANGO_ELLIPSIZE_NONE);
  gtk_widget_set_hexpand (label, column == 0);
  gtk_widget_add_css_class (label, heading ? "sw-figure-caption" : "numeric");
  gtk_grid_attach (grid, label, column, row, 1, 1);
}

#define STAGE_COLUMNS 5

/* The cells of one stage's row. */
static void
stage_row (SwAscentPage *self, const SwAscentResult *a, guint i, GPtrArray *cells)
{
  SwAnalysis *r = self->result;
  const SwDesign *d = a != NULL ? self->flown->design : r->design;
  const SwAscentStage *st = a != NULL ? &a->stages[i] : &r->stage_figures[i];
  char *name, *ignition, *tw, *burn, *burnout;

  name = d->stages[i].name[0] != '\0' ? g_strdup_printf ("%u · %s", i + 1, d->stages[i].name)
                                      : g_strdup_printf (_("Stage %u"), i + 1);
  if (!st->fires)
    {
      ignition = g_strdup (_("unused"));
      tw = g_strdup (SW_NO_VALUE);
      burn = g_strdup (SW_NO_VALUE);
      burnout = g_strdup (SW_NO_VALUE);
    }
  else if (a != NULL && !st->flown)
    {
      ignition = g_strdup (_("not reached"));
      tw = fmt_ratio (st->ignition_thrust_to_weight);
      burn = fmt_seconds (st->burn_time_s);
      burnout = g_strdup (SW_NO_VALUE);
    }
  else
    {
      ignition = a != NULL ? fmt_time (st->ignition.time_s) : g_strdup (SW_NO_VALUE);
      tw = fmt_ratio (st->ignition_thrust_to_weight);
      burn = fmt_seconds (a != NULL ? st->burn_time_flown_s : st->burn_time_s);
      if (a != NULL)
        {
          g_autofree char *alt = fmt_km (st->burnout.altitude_m);
          g_autofree char *speed = sw_format_speed (st->burnout.speed_m_s);
          /* Translators: an altitude and a speed at burnout */
          burnout = g_strdup_printf (_("%s · %s"), alt, speed);
        }
      else
        burnout = g_strdup (SW_NO_VALUE);
    }
  g_ptr_array_add (cells, name);
  g_ptr_array_add (cells, ignition);
  g_ptr_array_add (cells, tw);
  g_ptr_array_add (cells, burn);
  g_ptr_array_add (cells, burnout);
}

/* Rebuilt only when a text changes: new labels cost a relayout. */
static void
update_stages (SwAscentPage *self)
{
  SwAnalysis *r = self->result;
  const SwAscentResult *a = shown_ascent (self);
  g_autoptr (GPtrArray) cells = g_ptr_array_new_with_free_func (g_free);
  g_autofree char *key = NULL;
  GtkWidget *child;
  guint n = 0;

  /* Without a fresh ascent, the figures from the sized masses. */
  if (r != NULL && !r->ascent_pending && r->ascent == NULL)
    a = NULL;
  if (r != NULL && r->ok && (a != NULL || r->has_stage_figures))
    {
      g_ptr_array_add (cells, g_strdup (_("Stage")));
      g_ptr_array_add (cells, g_strdup (_("Ignition")));
      g_ptr_array_add (cells, g_strdup (_("T/W at ignition")));
      g_ptr_array_add (cells, g_strdup (_("Burn time")));
      g_ptr_array_add (cells, g_strdup (_("At burnout")));
      n = a != NULL ? MIN (a->n_stages, self->flown->design->n_stages) : r->design->n_stages;
      for (guint i = 0; i < n; i++)
        stage_row (self, a, i, cells);
    }
  g_ptr_array_add (cells, NULL);
  key = g_strjoinv ("\x1f", (char **) cells->pdata);
  g_ptr_array_set_size (cells, cells->len - 1);
  if (g_strcmp0 (key, self->stages_key) == 0)
    return;
  g_free (self->stages_key);
  self->stages_key = g_steal_pointer (&key);

  while ((child = gtk_widget_get_first_child (GTK_WIDGET (self->stages_grid))) != NULL)
    gtk_grid_remove (self->stages_grid, child);
  gtk_widget_set_visible (GTK_WIDGET (self->stages_grid), cells->len > 0);
  for (guint k = 0; k < cells->len; k++)
    grid_text (self->stages_grid, (int) (k % STAGE_COLUMNS), (int) (k / STAGE_COLUMNS),
               cells->pdata[k], k < STAGE_COLUMNS);
}

/* ---- plots ------------------------------------------------------------- */

static void
setup_time_plot (SwPlot *plot, const char *title, const char *y_label, const char *y_format,
                 double y_scale)
{
  sw_plot_clear (plot);
  sw_plot_set_title (plot, title);
  sw_plot_set_x_axis (plot, _("Time after liftoff"), FALSE);
  /* Translators: tick labels of a time axis in seconds */
  sw_plot_set_x_format (plot, _("%.0f s"), 1.0);
  sw_plot_set_y_axis (plot, y_label, FALSE);
  sw_plot_set_y_format (plot, y_format, y_scale);
  sw_plot_set_x_range (plot, NAN, NAN);
  sw_plot_set_y_range (plot, NAN, NAN);
}

static void
setup_plots (SwAscentPage *self)
{
  SwPlot *p;

  p = self->plots[SW_ASCENT_PLOT_TRAJECTORY];
  sw_plot_clear (p);
  sw_plot_set_title (p, _("Altitude against downrange"));
  sw_plot_set_x_axis (p, _("Downrange"), FALSE);
  /* Translators: tick labels of a distance axis in km */
  sw_plot_set_x_format (p, _("%.0f km"), 1000.0);
  sw_plot_set_y_axis (p, _("Altitude"), FALSE);
  sw_plot_set_y_format (p, _("%.0f km"), 1000.0);
  sw_plot_set_x_range (p, NAN, NAN);
  sw_plot_set_y_range (p, NAN, NAN);

  p = self->plots[SW_ASCENT_PLOT_LOSSES];
  sw_plot_clear (p);
  sw_plot_set_title (p, _("Losses, largest first"));
  sw_plot_set_x_axis (p, _("Delta-v lost"), FALSE);
  /* Translators: tick labels of a speed axis in m/s */
  sw_plot_set_x_format (p, _("%.0f m/s"), 1.0);
  sw_plot_set_categories (p, NULL, 0);
  sw_plot_set_x_range (p, NAN, NAN);
  sw_plot_set_y_range (p, NAN, NAN);

  /* Translators: tick labels of a speed axis in km/s */
  setup_time_plot (self->plots[SW_ASCENT_PLOT_SPEED], _("Speed"), _("Speed"),
                   _("%.1f km/s"), 1000.0);
  /* Translators: tick labels of a pressure axis in kPa */
  setup_time_plot (self->plots[SW_ASCENT_PLOT_DYNAMIC_PRESSURE], _("Dynamic pressure"),
                   _("Dynamic pressure"), _("%.0f kPa"), 1000.0);
  /* Translators: tick labels of an acceleration axis in units of standard gravity */
  setup_time_plot (self->plots[SW_ASCENT_PLOT_ACCELERATION], _("Axial acceleration"),
                   _("Acceleration"), _("%.1f g"), 1.0);
  /* Translators: tick labels of an angle axis in degrees */
  setup_time_plot (self->plots[SW_ASCENT_PLOT_FLIGHT_PATH], _("Flight-path angle, inertial"),
                   _("Flight-path angle"), _("%.0f°"), 1.0);
}

typedef struct {
  const char *name;
  double value;
} Loss;

static int
loss_cmp (gconstpointer a, gconstpointer b)
{
  double va = ((const Loss *) a)->value, vb = ((const Loss *) b)->value;

  return va < vb ? 1 : va > vb ? -1 : 0;
}

static void
show_losses (SwPlot *plot, const SwAscentResult *a)
{
  Loss losses[] = {
    { _("Gravity"), a->gravity_loss_m_s },
    { _("Drag"), a->drag_loss_m_s },
    { _("Steering"), a->steering_loss_m_s },
    { _("Back-pressure"), a->pressure_loss_m_s },
    { _("Fairing dropped off plan"), a->fairing_loss_m_s },
    { _("Orbit raising"), a->raising_loss_m_s },
    /* Thrust and drag act against the air, gravity against the inertial
     * velocity: the README's "turning atmosphere" term. */
    { _("Turning atmosphere"), a->rotation_term_m_s },
    /* What is left is the integrator's (README: below 0.05 m/s), drawn only
     * when it reaches MIN_LOSS_M_S. */
    { _("Integration residual"), a->other_loss_m_s - a->rotation_term_m_s },
  };
  char *labels[G_N_ELEMENTS (losses)];
  double x[G_N_ELEMENTS (losses)];
  guint n = 0;

  for (guint i = 0; i < G_N_ELEMENTS (losses); i++)
    if (isfinite (losses[i].value) && fabs (losses[i].value) >= MIN_LOSS_M_S)
      losses[n++] = losses[i];
  qsort (losses, n, sizeof losses[0], loss_cmp);
  for (guint i = 0; i < n; i++)
    {
      g_autofree char *v = sw_format_speed (losses[i].value);
      /* Translators: a loss category and its size, as "Gravity 1,539 m/s" */
      labels[i] = g_strdup_printf (_("%s %s"), losses[i].name, v);
      x[i] = losses[i].value;
    }
  sw_plot_set_categories (plot, (const char *const *) labels, n);
  sw_plot_add_series (plot, NULL, x, NULL, n, SW_PLOT_HBARS, 0);
  /* From zero (or the small negative rest) to just past the largest. */
  if (n > 0)
    sw_plot_set_x_range (plot, MIN (0.0, 1.15 * x[n - 1]), 1.08 * MAX (x[0], 1.0));
  for (guint i = 0; i < n; i++)
    g_free (labels[i]);
}

/* A dashed flat line at the user's limit when it is near enough to matter. */
static void
add_limit_line (SwPlot *plot, double limit, double peak, double t_end, const char *name)
{
  double x[2] = { 0.0, t_end }, y[2] = { limit, limit };

  if (!isfinite (limit) || !isfinite (peak) || !isfinite (t_end) || peak <= 0.0
      || limit > LIMIT_LINE_REACH * peak)
    return;
  sw_plot_add_series (plot, name, x, y, 2, SW_PLOT_LINE, 1);
}

static void
update_plots (SwAscentPage *self)
{
  const SwAscentResult *a = shown_ascent (self);
  GArray *samples;
  guint n;
  g_autofree double *t = NULL, *alt = NULL, *down = NULL, *v = NULL, *va = NULL;
  g_autofree double *q = NULL, *acc = NULL, *gamma = NULL;
  g_autofree char *q_text = NULL, *g_text = NULL, *q_kpa = NULL, *g_val = NULL;
  g_autofree char *q_limit_name = NULL, *g_limit_name = NULL;
  double t_end, q_limit, g_limit;

  setup_plots (self);
  if (a == NULL)
    return;
  show_losses (self->plots[SW_ASCENT_PLOT_LOSSES], a);
  samples = a->samples;
  n = samples != NULL ? samples->len : 0;
  if (n == 0)
    return;

  t = g_new (double, n);
  alt = g_new (double, n);
  down = g_new (double, n);
  v = g_new (double, n);
  va = g_new (double, n);
  q = g_new (double, n);
  acc = g_new (double, n);
  gamma = g_new (double, n);
  for (guint k = 0; k < n; k++)
    {
      const SwAscentSample *s = &g_array_index (samples, SwAscentSample, k);
      t[k] = s->time_s;
      alt[k] = s->altitude_m;
      down[k] = s->downrange_m;
      v[k] = s->speed_m_s;
      va[k] = s->air_speed_m_s;
      q[k] = s->dynamic_pressure_pa;
      acc[k] = s->axial_accel_g;
      gamma[k] = s->flight_path_deg;
    }
  t_end = t[n - 1];

  /* Single curves need no legend: the title names them. */
  sw_plot_add_series (self->plots[SW_ASCENT_PLOT_TRAJECTORY], NULL, down, alt, n,
                      SW_PLOT_LINE, 0);
  sw_plot_add_series (self->plots[SW_ASCENT_PLOT_SPEED], _("Inertial"), t, v, n, SW_PLOT_LINE, 0);
  sw_plot_add_series (self->plots[SW_ASCENT_PLOT_SPEED], _("Relative to the air"), t, va, n,
                      SW_PLOT_LINE, 2);
  sw_plot_add_series (self->plots[SW_ASCENT_PLOT_DYNAMIC_PRESSURE], NULL, t, q, n,
                      SW_PLOT_LINE, 0);
  sw_plot_add_series (self->plots[SW_ASCENT_PLOT_ACCELERATION], NULL, t, acc, n,
                      SW_PLOT_LINE, 0);
  sw_plot_add_series (self->plots[SW_ASCENT_PLOT_FLIGHT_PATH], NULL, t, gamma, n,
                      SW_PLOT_LINE, 0);
  for (SwAscentPlot p = SW_ASCENT_PLOT_SPEED; p < SW_ASCENT_N_PLOTS; p++)
    sw_plot_set_x_range (self->plots[p], 0.0, t_end);
  sw_plot_set_y_range (self->plots[SW_ASCENT_PLOT_DYNAMIC_PRESSURE], 0.0, NAN);
  sw_plot_set_y_range (self->plots[SW_ASCENT_PLOT_ACCELERATION], 0.0, NAN);
  sw_plot_set_y_range (self->plots[SW_ASCENT_PLOT_TRAJECTORY], 0.0, NAN);
  sw_plot_set_x_range (self->plots[SW_ASCENT_PLOT_TRAJECTORY], 0.0, NAN);

  /* The user's limits, where they are close enough to be seen. */
  q_limit = 1000.0 * gtk_adjustment_get_value (self->max_q_adjustment);
  g_limit = gtk_adjustment_get_value (self->max_g_adjustment);
  q_kpa = fmt_kpa (q_limit);
  /* Translators: %s is the user's limit, such as "45.0 kPa" */
  q_limit_name = g_strdup_printf (_("warning limit %s"), q_kpa);
  g_val = sw_format_value ("%.1f g", g_limit);
  g_limit_name = g_strdup_printf (_("warning limit %s"), g_val);
  add_limit_line (self->plots[SW_ASCENT_PLOT_DYNAMIC_PRESSURE], q_limit, a->max_q_pa, t_end,
                  q_limit_name);
  add_limit_line (self->plots[SW_ASCENT_PLOT_ACCELERATION], g_limit, a->max_axial_g, t_end,
                  g_limit_name);

  /* Staging: where each upper stage ignites. */
  for (guint i = 1; i < a->n_stages; i++)
    {
      const SwAscentStage *st = &a->stages[i];
      g_autofree char *label = NULL;

      if (!st->flown || !isfinite (st->ignition.time_s))
        continue;
      /* Translators: a staging event: stage %u ignites */
      label = g_strdup_printf (_("stage %u"), i + 1);
      for (SwAscentPlot p = SW_ASCENT_PLOT_SPEED; p < SW_ASCENT_N_PLOTS; p++)
        sw_plot_add_vline (self->plots[p], st->ignition.time_s, label, 7);
      sw_plot_add_marker (self->plots[SW_ASCENT_PLOT_TRAJECTORY], st->ignition.downrange_m,
                          st->ignition.altitude_m, label, SW_MARKER_BASELINE);
    }
  /* Strap-on boosters drop at their burnout: a staging event too. */
  if (a->boosters_dropped && isfinite (a->boosters.time_s))
    {
      for (SwAscentPlot p = SW_ASCENT_PLOT_SPEED; p < SW_ASCENT_N_PLOTS; p++)
        sw_plot_add_vline (self->plots[p], a->boosters.time_s, _("boosters off"), 7);
      sw_plot_add_marker (self->plots[SW_ASCENT_PLOT_TRAJECTORY], a->boosters.downrange_m,
                          a->boosters.altitude_m, _("boosters off"), SW_MARKER_BASELINE);
    }
  if (a->fairing_dropped && isfinite (a->fairing.time_s))
    sw_plot_add_marker (self->plots[SW_ASCENT_PLOT_TRAJECTORY], a->fairing.downrange_m,
                        a->fairing.altitude_m, _("fairing off"), SW_MARKER_BASELINE);

  /* Max-Q and the acceleration peak. */
  if (isfinite (a->max_q_pa) && isfinite (a->max_q_time_s))
    {
      g_autofree char *kpa = fmt_kpa (a->max_q_pa);

      /* Translators: %s is a pressure such as "37.9 kPa" */
      q_text = g_strdup_printf (_("max-Q %s"), kpa);
      sw_plot_add_marker (self->plots[SW_ASCENT_PLOT_DYNAMIC_PRESSURE], a->max_q_time_s,
                          a->max_q_pa, q_text, SW_MARKER_CURRENT);
    }
  if (isfinite (a->max_axial_g) && isfinite (a->max_axial_g_time_s))
    {
      g_autofree char *gv = fmt_g (a->max_axial_g);

      /* Translators: %s is an acceleration such as "4.89 g" */
      g_text = g_strdup_printf (_("peak %s"), gv);
      sw_plot_add_marker (self->plots[SW_ASCENT_PLOT_ACCELERATION], a->max_axial_g_time_s,
                          a->max_axial_g, g_text, SW_MARKER_CURRENT);
    }
}

/* ---- the result -------------------------------------------------------- */

static void
update (SwAscentPage *self, gboolean flown_changed)
{
  gboolean stale;

  update_status (self);
  if (flown_changed)
    {
      update_figures (self);
      update_plots (self);
    }
  update_stages (self);
  /* The note is shown in the totals above the page. */
  set_text_box (self->warnings_box, self->warnings_label, self->warnings);

  /* The flight of an older edit stays in view, veiled, while the newest
   * is simulated. */
  stale = self->result != NULL && self->result->ascent_pending && self->flown != NULL;
  gtk_widget_set_visible (self->figures_grid, self->flown != NULL);
  gtk_widget_set_visible (self->plots_grid, self->flown != NULL);
  gtk_widget_set_visible (self->veil, stale);
}

static void
catch_up (SwAscentPage *self)
{
  if (!self->stale)
    return;
  update (self, self->stale_flown);
  self->stale = FALSE;
  self->stale_flown = FALSE;
}

static void
sw_ascent_page_map (GtkWidget *widget)
{
  SwAscentPage *self = SW_ASCENT_PAGE (widget);

  GTK_WIDGET_CLASS (sw_ascent_page_parent_class)->map (widget);
  catch_up (self);
}

void
sw_ascent_page_set_result (SwAscentPage *self, SwAnalysis *result)
{
  gboolean flown_changed = FALSE;

  g_return_if_fail (SW_IS_ASCENT_PAGE (self));

  if (self->result == result)
    return;
  g_clear_pointer (&self->result, sw_analysis_unref);
  self->result = result != NULL ? sw_analysis_ref (result) : NULL;

  if (result != NULL && result->ascent != NULL)
    {
      g_clear_pointer (&self->flown, sw_analysis_unref);
      self->flown = sw_analysis_ref (result);
      flown_changed = TRUE;
    }
  else if ((result == NULL || !result->ascent_pending) && self->flown != NULL)
    {
      g_clear_pointer (&self->flown, sw_analysis_unref);
      flown_changed = TRUE;
    }
  /* The summary reaches the totals at once, shown or not.  Behind another
   * page the figures, table and plots would cost the window a relayout on
   * every result: the page catches up when it is shown (or read). */
  update_summary (self);
  self->stale = TRUE;
  self->stale_flown |= flown_changed;
  if (gtk_widget_get_mapped (GTK_WIDGET (self)))
    catch_up (self);
  sw_optimised_steering_set_flight (self->optimised,
                                    self->flown != NULL ? self->flown->design : NULL,
                                    self->flown != NULL ? self->flown->ascent : NULL);
}

/* The limits live in the adjustments, bound to the settings when the page
 * has them: the limit lines and warnings move with them. */
static void
limits_changed_cb (SwAscentPage *self)
{
  update_summary (self);
  self->stale = TRUE;
  self->stale_flown = TRUE;
  if (gtk_widget_get_mapped (GTK_WIDGET (self)))
    catch_up (self);
}

static void
unbind_settings (SwAscentPage *self)
{
  if (self->settings == NULL)
    return;
  g_settings_unbind (self->min_tw_adjustment, "value");
  g_settings_unbind (self->max_q_adjustment, "value");
  g_settings_unbind (self->max_g_adjustment, "value");
  g_clear_object (&self->settings);
}

void
sw_ascent_page_set_settings (SwAscentPage *self, GSettings *settings)
{
  g_return_if_fail (SW_IS_ASCENT_PAGE (self));
  g_return_if_fail (settings == NULL || G_IS_SETTINGS (settings));

  if (settings == self->settings)
    return;
  unbind_settings (self);
  if (settings == NULL)
    return;
  self->settings = g_object_ref (settings);
  g_settings_bind (settings, "min-thrust-to-weight", self->min_tw_adjustment, "value",
                   G_SETTINGS_BIND_DEFAULT);
  g_settings_bind (settings, "max-dynamic-pressure-kpa", self->max_q_adjustment, "value",
                   G_SETTINGS_BIND_DEFAULT);
  g_settings_bind (settings, "max-acceleration-g", self->max_g_adjustment, "value",
                   G_SETTINGS_BIND_DEFAULT);
}

/* ---- accessors --------------------------------------------------------- */

SwOptimisedSteering *
sw_ascent_page_get_optimised (SwAscentPage *self)
{
  g_return_val_if_fail (SW_IS_ASCENT_PAGE (self), NULL);
  return self->optimised;
}

const char *
sw_ascent_page_get_note (SwAscentPage *self)
{
  g_return_val_if_fail (SW_IS_ASCENT_PAGE (self), NULL);
  return self->note;
}

const char *
sw_ascent_page_get_warnings (SwAscentPage *self)
{
  g_return_val_if_fail (SW_IS_ASCENT_PAGE (self), NULL);
  return self->warnings;
}

const char *
sw_ascent_page_get_text (SwAscentPage *self, SwAscentPageField field)
{
  g_return_val_if_fail (SW_IS_ASCENT_PAGE (self), NULL);
  catch_up (self);

  switch (field)
    {
    case SW_ASCENT_PAGE_STATUS: return gtk_label_get_text (self->status_label);
    case SW_ASCENT_PAGE_ORBIT: return gtk_label_get_text (self->orbit_label);
    case SW_ASCENT_PAGE_LOSSES: return gtk_label_get_text (self->losses_label);
    case SW_ASCENT_PAGE_ALLOWANCE: return gtk_label_get_text (self->allowance_label);
    case SW_ASCENT_PAGE_ROTATION: return gtk_label_get_text (self->rotation_label);
    case SW_ASCENT_PAGE_MAX_Q: return gtk_label_get_text (self->max_q_label);
    case SW_ASCENT_PAGE_MAX_Q_WHEN: return gtk_label_get_text (self->max_q_when_label);
    case SW_ASCENT_PAGE_MAX_ACCEL: return gtk_label_get_text (self->max_accel_label);
    case SW_ASCENT_PAGE_MAX_ACCEL_WHEN: return gtk_label_get_text (self->max_accel_when_label);
    case SW_ASCENT_PAGE_LIFTOFF_TW:
      {
        /* The first row of the stage table. */
        GtkWidget *cell = gtk_grid_get_child_at (self->stages_grid, 2, 1);
        return cell != NULL ? gtk_label_get_text (GTK_LABEL (cell)) : NULL;
      }
    default: return NULL;
    }
}

SwPlot *
sw_ascent_page_get_plot (SwAscentPage *self, SwAscentPlot which)
{
  g_return_val_if_fail (SW_IS_ASCENT_PAGE (self), NULL);
  g_return_val_if_fail (which < SW_ASCENT_N_PLOTS, NULL);
  catch_up (self);
  return self->plots[which];
}

gboolean
sw_ascent_page_get_pending (SwAscentPage *self)
{
  g_return_val_if_fail (SW_IS_ASCENT_PAGE (self), FALSE);
  return self->result == NULL || self->result->ascent_pending;
}

guint64
sw_ascent_page_get_shown_serial (SwAscentPage *self)
{
  g_return_val_if_fail (SW_IS_ASCENT_PAGE (self), 0);
  return self->flown != NULL ? self->flown->serial : 0;
}

const char *
sw_ascent_page_get_message (SwAscentPage *self)
{
  g_return_val_if_fail (SW_IS_ASCENT_PAGE (self), NULL);
  catch_up (self);
  return gtk_label_get_text (self->status_label);
}

/* ---- GObject ----------------------------------------------------------- */

GtkWidget *
sw_ascent_page_new (void)
{
  return g_object_new (SW_TYPE_ASCENT_PAGE, NULL);
}

static void
sw_ascent_page_dispose (GObject *object)
{
  SwAscentPage *self = SW_ASCENT_PAGE (object);

  unbind_settings (self);
  g_clear_pointer (&self->result, sw_analysis_unref);
  g_clear_pointer (&self->flown, sw_analysis_unref);
  g_clear_pointer (&self->note, g_free);
  g_clear_pointer (&self->warnings, g_free);
  g_clear_pointer (&self->stages_key, g_free);
  gtk_widget_dispose_template (GTK_WIDGET (self), SW_TYPE_ASCENT_PAGE);
  G_OBJECT_CLASS (sw_ascent_page_parent_class)->dispose (object);
}

static void
sw_ascent_page_class_init (SwAscentPageClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = sw_ascent_page_dispose;
  widget_class->map = sw_ascent_page_map;

  signals[SUMMARY_CHANGED] = g_signal_new ("summary-changed", G_TYPE_FROM_CLASS (klass),
                                           G_SIGNAL_RUN_LAST, 0, NULL, NULL, NULL,
                                           G_TYPE_NONE, 0);

  g_type_ensure (SW_TYPE_PLOT);
  gtk_widget_class_set_template_from_resource (widget_class,
                                               "/org/stagewright/Stagewright/sw-ascent-page.ui");
  gtk_widget_class_set_layout_manager_type (widget_class, GTK_TYPE_BIN_LAYOUT);
  gtk_widget_class_set_css_name (widget_class, "sw-ascent-page");
#define CHILD(name) gtk_widget_class_bind_template_child (widget_class, SwAscentPage, name)
  CHILD (scroller);
  CHILD (status_box);
  CHILD (busy_stack);
  CHILD (busy_spinner);
  CHILD (status_image);
  CHILD (status_label);
  CHILD (warnings_box);
  CHILD (warnings_label);
  CHILD (figures_grid);
  CHILD (orbit_caption);
  CHILD (orbit_label);
  CHILD (rotation_label);
  CHILD (losses_label);
  CHILD (allowance_label);
  CHILD (max_q_label);
  CHILD (max_q_when_label);
  CHILD (max_accel_label);
  CHILD (max_accel_when_label);
  CHILD (stages_grid);
  CHILD (plots_grid);
  CHILD (veil);
  CHILD (min_tw_adjustment);
  CHILD (max_q_adjustment);
  CHILD (max_g_adjustment);
  CHILD (min_tw_spin);
  CHILD (max_q_spin);
  CHILD (max_g_spin);
#undef CHILD
#define PLOT(name, index) \
  gtk_widget_class_bind_template_child_full (widget_class, name, FALSE, \
                                             G_STRUCT_OFFSET (SwAscentPage, plots) \
                                             + (index) * sizeof (SwPlot *))
  PLOT ("trajectory_plot", SW_ASCENT_PLOT_TRAJECTORY);
  PLOT ("losses_plot", SW_ASCENT_PLOT_LOSSES);
  PLOT ("speed_plot", SW_ASCENT_PLOT_SPEED);
  PLOT ("q_plot", SW_ASCENT_PLOT_DYNAMIC_PRESSURE);
  PLOT ("accel_plot", SW_ASCENT_PLOT_ACCELERATION);
  PLOT ("path_plot", SW_ASCENT_PLOT_FLIGHT_PATH);
#undef PLOT
}

static void
sw_ascent_page_init (SwAscentPage *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
  /* The limits are edited with the keyboard or a wheel over a focused
   * spin button only: a wheel passing over the popover changes nothing. */
  sw_number_field_guard_wheel (self->min_tw_spin);
  sw_number_field_guard_wheel (self->max_q_spin);
  sw_number_field_guard_wheel (self->max_g_spin);

  /* The schema's defaults until the owner hands the settings in. */
  gtk_adjustment_set_value (self->min_tw_adjustment, 1.2);
  gtk_adjustment_set_value (self->max_q_adjustment, 45.0);
  gtk_adjustment_set_value (self->max_g_adjustment, 6.0);
  g_signal_connect_swapped (self->min_tw_adjustment, "value-changed",
                            G_CALLBACK (limits_changed_cb), self);
  g_signal_connect_swapped (self->max_q_adjustment, "value-changed",
                            G_CALLBACK (limits_changed_cb), self);
  g_signal_connect_swapped (self->max_g_adjustment, "value-changed",
                            G_CALLBACK (limits_changed_cb), self);
  setup_plots (self);
  self->optimised = SW_OPTIMISED_STEERING (sw_optimised_steering_new ());
  gtk_box_insert_child_after (GTK_BOX (gtk_widget_get_parent (self->figures_grid)),
                              GTK_WIDGET (self->optimised), self->figures_grid);
  update_summary (self);
  update (self, TRUE);
}
