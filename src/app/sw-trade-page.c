/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-trade-page"

#include "config.h"

#include "sw-trade-page.h"
#include "sw-widget-text.h"

#include "sw-narrow.h"
#include "sw-number-field.h"
#include "sw-simulated-mc.h"
#include "sw-spinner.h"

#include "sw-design-fields.h"
#include "sw-format.h"
#include "sw-limits.h"
#include "sw-trade-plots.h"

#include <glib/gi18n.h>
#include <math.h>

#define TORNADO_ROW_PX 26
#define TORNADO_EXTRA_PX 100

struct _SwTradePage {
  GtkWidget    parent_instance;

  SwDocument  *document;
  SwAnalysis    *result;
  gboolean     stale;          /* result not shown yet: the page was not mapped */
  GSettings   *settings;
  guint        updating;

  /* What the plots were given, for tests. */
  guint        n_rows;
  double       minus_kg[SW_SENSITIVITY_MAX_ITEMS];
  double       plus_kg[SW_SENSITIVITY_MAX_ITEMS];
  GStrv        row_labels;
  gboolean     has_lines;
  double       lines[3];

  GtkWidget     *scroller;
  GtkWidget     *cards;
  SwSimulatedMc *simulated_mc;   /* the switch for a simulated ascent per sample */
  GtkSpinButton *step_spin;
  GtkSpinButton *samples_spin;
  GtkSpinButton *seed_spin;
  GtkDropDown   *isp_kind;
  GtkSpinButton *isp_width;
  GtkLabel      *isp_unit;
  GtkDropDown   *eps_kind;
  GtkSpinButton *eps_width;
  GtkLabel      *eps_unit;
  GtkDropDown   *losses_kind;
  GtkSpinButton *losses_width;
  GtkLabel      *losses_unit;
  GtkLabel      *driver_caption;
  GtkLabel      *driver_value;
  GtkLabel      *driver_detail;
  GtkLabel      *spread_caption;
  GtkLabel      *spread_value;
  GtkLabel      *spread_detail;
  GtkLabel      *shortfall_caption;
  GtkLabel      *shortfall_value;
  GtkLabel      *shortfall_detail;
  GtkLabel      *success_value;
  GtkLabel      *success_detail;
  GtkLabel      *losses_note;      /* which losses the trades used */
  SwPlot        *tornado_plot;
  GtkStack      *histogram_stack;
  SwPlot        *histogram_plot;
  GtkSpinner    *histogram_spinner;
  GtkLabel      *histogram_empty;
  SwPlot        *mass_plot;
  GtkStack      *reliability_stack;
  SwPlot        *reliability_plot;
  GtkLabel      *reliability_empty;
};

G_DEFINE_FINAL_TYPE (SwTradePage, sw_trade_page, GTK_TYPE_WIDGET)

enum { PROP_0, PROP_STEP, N_PROPS };
static GParamSpec *properties[N_PROPS];

/* ---- formatting -------------------------------------------------------- */

/* The sensitivity step in percent: "5" or "2.5". */
static char *
step_percent (SwAnalysis *r)
{
  double pct = r != NULL ? 100.0 * r->sensitivity_step : NAN;

  return sw_format_number (pct, fabs (pct - round (pct)) < 1e-9 ? 0 : 1);
}

void
sw_trade_page_set_settings (SwTradePage *self, GSettings *settings)
{
  g_return_if_fail (SW_IS_TRADE_PAGE (self));
  g_return_if_fail (settings == NULL || G_IS_SETTINGS (settings));

  if (settings == self->settings)
    return;
  if (self->settings != NULL)
    g_settings_unbind (gtk_spin_button_get_adjustment (self->step_spin), "value");
  g_set_object (&self->settings, settings);
  if (settings != NULL)
    g_settings_bind (settings, "sensitivity-step-percent",
                     gtk_spin_button_get_adjustment (self->step_spin), "value",
                     G_SETTINGS_BIND_DEFAULT);
}

static void
set_label (GtkLabel *label, const char *text)
{
  if (g_strcmp0 (gtk_label_get_text (label), text) != 0)
    gtk_label_set_text (label, text);
}

/* ---- the inputs -------------------------------------------------------- */

static void
setup_spin (GtkSpinButton *spin, GtkLabel *unit, SwLimitId id, guint digits, double step,
            double page)
{
  const SwLimit *l = sw_limit_get (id);

  gtk_spin_button_set_digits (spin, digits);
  gtk_spin_button_set_range (spin, l->min, l->max);
  gtk_spin_button_set_increments (spin, step, page);
  gtk_spin_button_set_numeric (spin, FALSE);
  sw_number_field_guard_wheel (GTK_WIDGET (spin));
  gtk_editable_set_enable_undo (GTK_EDITABLE (spin), FALSE);
  gtk_editable_set_width_chars (GTK_EDITABLE (spin), digits > 0 ? 5 : 8);
  if (unit != NULL)
    gtk_label_set_text (unit, l->unit);
}

static void
show_spread (GtkDropDown *kind, GtkSpinButton *width, const SwSpread *spread)
{
  gtk_drop_down_set_selected (kind, spread->kind);
  gtk_spin_button_set_value (width, spread->width);
  gtk_widget_set_sensitive (GTK_WIDGET (width), spread->kind != SW_SPREAD_NONE);
}

/* The design's Monte Carlo inputs into the fields (new design, undo). */
static void
refresh_inputs (SwTradePage *self)
{
  const SwDesign *d;
  const SwUncertainty *unc;

  if (self->document == NULL)
    return;
  d = sw_document_get_design (self->document);
  unc = &d->uncertainty;
  self->updating++;
  gtk_spin_button_set_value (self->samples_spin, sw_uncertainty_samples (unc));
  gtk_spin_button_set_value (self->seed_spin, sw_uncertainty_seed (unc));
  show_spread (self->isp_kind, self->isp_width, &unc->isp);
  show_spread (self->eps_kind, self->eps_width, &unc->structural_coefficient);
  show_spread (self->losses_kind, self->losses_width, &unc->losses);
  self->updating--;
}

static gboolean
can_edit (SwTradePage *self)
{
  return self->updating == 0 && self->document != NULL;
}

static void
commit (SwTradePage *self, SwDesign *design, const char *merge_key)
{
  if (sw_design_equal (design, sw_document_get_design (self->document)))
    {
      sw_design_free (design);
      return;
    }
  sw_document_commit (self->document, design, merge_key);
}

static void
samples_changed_cb (SwTradePage *self)
{
  SwDesign *d;
  guint samples = (guint) gtk_spin_button_get_value_as_int (self->samples_spin);

  if (!can_edit (self))
    return;
  d = sw_document_dup_design (self->document);
  if (d->uncertainty.has_samples && d->uncertainty.samples == samples)
    {
      sw_design_free (d);
      return;
    }
  if (!sw_design_field_set (d, SW_FIELD_MC_SAMPLES, 0, samples, NULL))
    {
      sw_design_free (d);
      return;
    }
  commit (self, d, "trade:samples");
}

static void
seed_changed_cb (SwTradePage *self)
{
  SwDesign *d;
  /* Seeds go past the range of an int. */
  guint32 seed = (guint32) CLAMP (round (gtk_spin_button_get_value (self->seed_spin)), 0.0,
                                  4294967295.0);

  if (!can_edit (self))
    return;
  d = sw_document_dup_design (self->document);
  if (d->uncertainty.has_seed && d->uncertainty.seed == seed)
    {
      sw_design_free (d);
      return;
    }
  if (!sw_design_field_set (d, SW_FIELD_MC_SEED, 0, seed, NULL))
    {
      sw_design_free (d);
      return;
    }
  commit (self, d, "trade:seed");
}

/* A spread switched on with no width gets a typical one (common practice
 * for concept work, from memory: Isp known to about 1 %, structure to 5 %,
 * losses to 100 m/s), so the choice shows at once. */
static void
read_spread (GtkDropDown *kind, GtkSpinButton *width, SwSpread *spread, double typical)
{
  guint k = gtk_drop_down_get_selected (kind);

  if (k != SW_SPREAD_NONE && spread->kind == SW_SPREAD_NONE
      && gtk_spin_button_get_value (width) == 0.0)
    gtk_spin_button_set_value (width, typical);

  spread->kind = k == 1 ? SW_SPREAD_NORMAL : k == 2 ? SW_SPREAD_UNIFORM : SW_SPREAD_NONE;
  spread->width = spread->kind == SW_SPREAD_NONE ? 0.0 : gtk_spin_button_get_value (width);
  gtk_widget_set_sensitive (GTK_WIDGET (width), spread->kind != SW_SPREAD_NONE);
}

static void
spread_changed_cb (SwTradePage *self)
{
  SwDesign *d;
  SwSpread isp, eps, losses;

  if (!can_edit (self))
    return;
  d = sw_document_dup_design (self->document);
  isp = d->uncertainty.isp;
  eps = d->uncertainty.structural_coefficient;
  losses = d->uncertainty.losses;
  self->updating++;
  read_spread (self->isp_kind, self->isp_width, &isp, 1.0);
  read_spread (self->eps_kind, self->eps_width, &eps, 5.0);
  read_spread (self->losses_kind, self->losses_width, &losses, 100.0);
  self->updating--;
  if (!sw_design_set_spread (d, 0, isp.kind, isp.width, NULL)
      || !sw_design_set_spread (d, 1, eps.kind, eps.width, NULL)
      || !sw_design_set_spread (d, 2, losses.kind, losses.width, NULL))
    {
      sw_design_free (d);
      return;
    }
  commit (self, d, "trade:spreads");
}

static void
step_changed_cb (SwTradePage *self)
{
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_STEP]);
}

/* ---- the charts -------------------------------------------------------- */

static void
show_tornado (SwTradePage *self, SwAnalysis *r)
{
  const SwSensitivityTable *t = r != NULL ? &r->sensitivity : NULL;
  g_autofree char *title = NULL, *minus_name = NULL, *plus_name = NULL;
  g_autofree char *step_text = NULL;
  GPtrArray *labels = g_ptr_array_new_with_free_func (g_free);
  g_autoptr (GPtrArray) short_labels = g_ptr_array_new_with_free_func (g_free);
  double biggest = 0.0;

  sw_plot_clear (self->tornado_plot);
  self->n_rows = 0;
  g_clear_pointer (&self->row_labels, g_strfreev);

  step_text = step_percent (r);
  /* A vehicle that exists: its liftoff mass is fixed, the payload moves. */
  if (r != NULL && r->ok && t->capability)
    {
      /* Translators: %s is the step in percent, e.g. "5" */
      title = g_strdup_printf (_("Payload capability change, each input ±%s %%"), step_text);
      sw_plot_set_title (self->tornado_plot, title);
      sw_plot_set_x_axis (self->tornado_plot, _("Change of the payload capability"), FALSE);
    }
  else
    {
      /* Translators: %s is the step in percent, e.g. "5" */
      title = g_strdup_printf (_("Liftoff mass change, each input ±%s %%"), step_text);
      sw_plot_set_title (self->tornado_plot, title);
      sw_plot_set_x_axis (self->tornado_plot, _("Change of the liftoff mass"), FALSE);
    }
  sw_plot_set_y_axis (self->tornado_plot, NULL, FALSE);

  if (r != NULL && r->ok && r->has_sensitivity)
    for (guint i = 0; i < t->n_items; i++)
      {
        const SwSensitivity *item = &t->items[t->ranked[i]];
        g_autofree char *name = sw_sensitivity_dup_label (r->design, item);
        /* On the chart "Isp, stage 2" without the stage's name: the rows
         * stay short enough to read whole beside a narrow chart (the stage
         * list gives the names in the same firing order). */
        g_autofree char *short_name = sw_sensitivity_dup_label (NULL, item);

        self->minus_kg[i] = item->minus_feasible ? item->minus_kg : NAN;
        self->plus_kg[i] = item->plus_feasible ? item->plus_kg : NAN;
        if (!item->minus_feasible || !item->plus_feasible)
          /* Translators: a tornado row whose input, moved, leaves no solution */
          {
            g_ptr_array_add (labels, g_strdup_printf (_("%s (%s: no solution)"), name,
                                                      !item->minus_feasible ? "−" : "+"));
            g_ptr_array_add (short_labels,
                             g_strdup_printf (_("%s (%s: no solution)"), short_name,
                                              !item->minus_feasible ? "−" : "+"));
          }
        else
          {
            g_ptr_array_add (labels, g_steal_pointer (&name));
            g_ptr_array_add (short_labels, g_steal_pointer (&short_name));
          }
        if (isfinite (self->minus_kg[i]))
          biggest = MAX (biggest, fabs (self->minus_kg[i]));
        if (isfinite (self->plus_kg[i]))
          biggest = MAX (biggest, fabs (self->plus_kg[i]));
        self->n_rows++;
      }
  g_ptr_array_add (labels, NULL);
  self->row_labels = (GStrv) g_ptr_array_free (labels, FALSE);

  /* Kilograms for small changes, tonnes otherwise. */
  if (biggest < 5000.0)
    /* Translators: tick labels of a mass axis in kilograms */
    sw_plot_set_x_format (self->tornado_plot, _("%.0f kg"), 1.0);
  else
    sw_plot_set_x_format (self->tornado_plot, _("%.3g t"), 1000.0);
  sw_plot_set_x_range (self->tornado_plot, NAN, NAN);
  sw_plot_set_y_range (self->tornado_plot, NAN, NAN);
  gtk_widget_set_size_request (GTK_WIDGET (self->tornado_plot), 380,
                               MAX (260, TORNADO_EXTRA_PX + TORNADO_ROW_PX * (int) self->n_rows));
  if (self->n_rows == 0)
    {
      sw_plot_set_categories (self->tornado_plot, NULL, 0);
      return;
    }
  sw_plot_set_categories (self->tornado_plot, (const char *const *) short_labels->pdata,
                          self->n_rows);
  /* Translators: the legend of the tornado's bars; %s is the step in percent */
  minus_name = g_strdup_printf (_("input −%s %%"), step_text);
  plus_name = g_strdup_printf (_("input +%s %%"), step_text);
  sw_plot_add_series (self->tornado_plot, minus_name, self->minus_kg, NULL, self->n_rows,
                      SW_PLOT_HBARS, 0);
  sw_plot_add_series (self->tornado_plot, plus_name, self->plus_kg, NULL, self->n_rows,
                      SW_PLOT_HBARS, 1);
}

static void
show_histogram (SwTradePage *self, SwAnalysis *r)
{
  /* A vehicle that exists: the payload capability, its liftoff mass fixed. */
  gboolean capability = r != NULL && r->ok && r->all_fixed;
  const SwMcSummary *s = r == NULL ? NULL
                         : capability ? &r->montecarlo.payload : &r->montecarlo.liftoff;
  double x[SW_MC_BINS], y[SW_MC_BINS], width;
  g_autofree char *title = NULL, *samples = NULL;
  static const char *const names[3] = { N_("5th"), N_("median"), N_("95th") };
  const char *empty;

  sw_plot_clear (self->histogram_plot);
  self->has_lines = FALSE;
  sw_spinner_set_busy (self->histogram_spinner, FALSE);

  if (r == NULL || !r->ok)
    empty = _("No Monte Carlo: the design cannot be solved.");
  else if (r->montecarlo_pending)
    {
      empty = _("Running the Monte Carlo…");
      sw_spinner_set_busy (self->histogram_spinner, TRUE);
    }
  else if (!sw_uncertainty_has_spread (&r->design->uncertainty))
    empty = capability ? _("No uncertainty spreads in this design. Set them under "
                           "“Uncertainty…” to see how far the payload capability spreads.")
                       : _("No uncertainty spreads in this design. Set them under "
                           "“Uncertainty…” to see how far the liftoff mass spreads.");
  else if (!r->has_montecarlo)
    empty = r->montecarlo_error[0] != '\0' ? r->montecarlo_error
                                           : _("The Monte Carlo did not run.");
  else if (s->n == 0 || !(s->bin_hi > s->bin_lo))
    empty = capability ? _("In no sample does the vehicle reach the required delta-v.")
                       : _("No sample closes: the spread inputs leave no feasible vehicle.");
  else
    empty = NULL;

  if (empty != NULL)
    {
      set_label (self->histogram_empty, empty);
      gtk_stack_set_visible_child_name (self->histogram_stack, "empty");
      return;
    }

  samples = sw_format_number (s->n, 0);
  /* Translators: %s is the number of samples, e.g. "10,000" */
  if (capability)
    {
      /* Translators: %s is the number of samples, e.g. "10,000" */
      title = g_strdup_printf (_("Payload capability over %s samples"), samples);
      /* A sample short even with no payload has a negative capability:
       * the axis says what that means. */
      sw_plot_set_x_axis (self->histogram_plot,
                          s->min < 0.0
                            ? _("Payload that reaches the required delta-v (below 0: short even "
                                "when empty)")
                            : _("Payload that reaches the required delta-v"), FALSE);
      if (s->max < 5000.0)
        sw_plot_set_x_format (self->histogram_plot, _("%.0f kg"), 1.0);
      else
        sw_plot_set_x_format (self->histogram_plot, _("%.3g t"), 1000.0);
    }
  else
    {
      title = g_strdup_printf (_("Liftoff mass over %s samples"), samples);
      sw_plot_set_x_axis (self->histogram_plot, _("Liftoff mass for the payload"), FALSE);
      sw_plot_set_x_format (self->histogram_plot, _("%.3g t"), 1000.0);
    }
  sw_plot_set_title (self->histogram_plot, title);
  sw_plot_set_y_axis (self->histogram_plot, _("Share of the samples"), FALSE);
  /* Translators: tick labels of a share axis in percent */
  sw_plot_set_y_format (self->histogram_plot, _("%.0f %%"), 1.0);
  sw_plot_set_x_range (self->histogram_plot, NAN, NAN);
  sw_plot_set_y_range (self->histogram_plot, 0.0, NAN);

  width = (s->bin_hi - s->bin_lo) / SW_MC_BINS;
  for (guint k = 0; k < SW_MC_BINS; k++)
    {
      x[k] = s->bin_lo + (k + 0.5) * width;
      y[k] = 100.0 * s->bins[k] / s->n;
    }
  sw_plot_add_series (self->histogram_plot, _("Samples"), x, y, SW_MC_BINS, SW_PLOT_BARS, 0);

  self->lines[0] = s->p05;
  self->lines[1] = s->p50;
  self->lines[2] = s->p95;
  self->has_lines = TRUE;
  for (guint i = 0; i < 3; i++)
    {
      g_autofree char *mass = sw_format_mass (self->lines[i]);
      g_autofree char *label = g_strdup_printf ("%s %s", _(names[i]), mass);
      sw_plot_add_vline (self->histogram_plot, self->lines[i], label, i == 1 ? 7 : 1);
    }
  gtk_stack_set_visible_child_name (self->histogram_stack, "plot");
}

static void
show_reliability (SwTradePage *self, SwAnalysis *r)
{
  const SwReliabilityCurve *c = r != NULL ? &r->reliability_curve : NULL;
  double x[SW_MAX_STAGES], y[SW_MAX_STAGES], lowest = 1.0;

  sw_plot_clear (self->reliability_plot);
  if (r == NULL || !r->ok || !c->given || c->n_points == 0)
    {
      set_label (self->reliability_empty,
                 r != NULL && r->ok
                 ? _("No reliability keys in this design (engine count, engine reliability, "
                     "failures tolerated, ignition and separation reliability): no success "
                     "probability to set against the stage count.")
                 : "");
      gtk_stack_set_visible_child_name (self->reliability_stack, "empty");
      return;
    }

  sw_plot_set_title (self->reliability_plot, _("Mission success by stage count"));
  sw_plot_set_x_axis (self->reliability_plot, _("Number of stages"), FALSE);
  sw_plot_set_x_format (self->reliability_plot, "%.0f", 1.0);
  sw_plot_set_x_integer (self->reliability_plot, TRUE);
  sw_plot_set_x_range (self->reliability_plot, 0.5, SW_MAX_STAGES + 0.5);
  sw_plot_set_y_axis (self->reliability_plot, _("Success probability"), FALSE);
  /* Translators: tick labels of a probability axis in percent */
  sw_plot_set_y_format (self->reliability_plot, _("%.3g %%"), 0.01);

  for (guint k = 0; k < c->n_points; k++)
    {
      x[k] = k + 1;
      y[k] = c->mission[k];
      if (isfinite (y[k]))
        lowest = MIN (lowest, y[k]);
    }
  sw_plot_add_series (self->reliability_plot, _("Success probability"), x, y, c->n_points,
                      SW_PLOT_LINE_POINTS, 2);
  if (r->has_baseline && r->baseline_reliability_curve.given)
    {
      const SwReliabilityCurve *b = &r->baseline_reliability_curve;
      double by[SW_MAX_STAGES];
      for (guint k = 0; k < b->n_points; k++)
        {
          by[k] = b->mission[k];
          if (isfinite (by[k]))
            lowest = MIN (lowest, by[k]);
        }
      sw_plot_add_series (self->reliability_plot, _("Baseline"), x, by, b->n_points,
                          SW_PLOT_LINE, 3);
    }
  /* From a round percentage below the lowest point up to certainty. */
  sw_plot_set_y_range (self->reliability_plot, MAX (0.0, floor (lowest * 100.0 - 1.0) / 100.0),
                       1.0);
  if (r->reliability.given)
    sw_plot_add_marker (self->reliability_plot, r->design->n_stages, r->reliability.mission,
                        _("this design"), SW_MARKER_CURRENT);
  gtk_stack_set_visible_child_name (self->reliability_stack, "plot");
}

static void
show_mass (SwTradePage *self, SwAnalysis *r)
{
  sw_trade_plots_show_stage_count (self->mass_plot, r);
  /* The window's title is too long for half the page. */
  sw_plot_set_title (self->mass_plot, _("Liftoff mass by stage count"));
}

/* ---- the cards --------------------------------------------------------- */

static void
show_cards (SwTradePage *self, SwAnalysis *r)
{
  g_autofree char *caption = NULL, *step_text = NULL;
  g_autofree char *value = NULL, *detail = NULL;

  /* The largest effect. */
  step_text = step_percent (r);
  if (r != NULL && r->ok && r->all_fixed)
    /* Translators: %s is the tornado's step in percent */
    caption = g_strdup_printf (_("Largest effect of ±%s %% on the capability"), step_text);
  else
    /* Translators: %s is the tornado's step in percent */
    caption = g_strdup_printf (_("Largest effect of ±%s %% on the liftoff mass"), step_text);
  set_label (self->driver_caption, caption);
  if (r != NULL && r->ok && r->has_sensitivity && r->sensitivity.n_items > 0)
    {
      const SwSensitivity *top = &r->sensitivity.items[r->sensitivity.ranked[0]];
      g_autofree char *lo = sw_format_mass_delta (top->minus_feasible ? top->minus_kg : NAN);
      g_autofree char *hi = sw_format_mass_delta (top->plus_feasible ? top->plus_kg : NAN);
      value = g_strdup_printf ("%s / %s", lo, hi);
      detail = sw_sensitivity_dup_label (r->design, top);
    }
  else
    {
      value = g_strdup (SW_NO_VALUE);
      detail = g_strdup (r == NULL || !r->ok ? ""
                         : r->all_fixed ? _("The vehicle carries no payload to the mission: "
                                            "no sensitivities.")
                         : _("The design does not close: no sensitivities."));
    }
  set_label (self->driver_value, value);
  set_label (self->driver_detail, detail);
  g_clear_pointer (&value, g_free);
  g_clear_pointer (&detail, g_free);

  /* The spread of the liftoff mass and the shortfall; for a vehicle that
   * exists, the delta-v margin at the nominal payload and the chance the
   * nominal payload fits. */
  set_label (self->spread_caption, r != NULL && r->ok && r->all_fixed
                                     ? _("Delta-v margin, 5th to 95th percentile")
                                     : _("Liftoff mass, 5th to 95th percentile"));
  set_label (self->shortfall_caption, r != NULL && r->ok && r->all_fixed
                                        ? _("Chance the nominal payload fits")
                                        : _("Chance the payload is carried, no reserve"));
  sw_widget_set_tooltip (GTK_WIDGET (self->shortfall_caption),
                               r != NULL && r->ok && r->all_fixed
                               ? _("Share of the samples in which the vehicle (every "
                                   "propellant load fixed) reaches the required delta-v "
                                   "with the nominal payload")
                               : _("Share of the samples in which the vehicle as sized (its "
                                   "propellant loads fixed) carries less than the required "
                                   "payload"));
  if (r != NULL && r->ok && r->has_montecarlo && r->montecarlo.all_fixed
      && r->montecarlo.margin.n > 0)
    {
      const SwMonteCarlo *mc = &r->montecarlo;
      g_autofree char *lo = sw_format_speed (mc->margin.p05);
      g_autofree char *hi = sw_format_speed (mc->margin.p95);
      g_autofree char *mean = sw_format_speed (mc->margin.mean);
      g_autofree char *n = sw_format_number (mc->samples, 0);

      value = g_strdup_printf ("%s – %s", lo, hi);
      /* Translators: a speed; number of samples; seed */
      detail = g_strdup_printf (_("at the nominal payload; mean %s (%s samples, seed %u)"),
                                mean, n, mc->seed);
    }
  else if (r != NULL && r->ok && r->has_montecarlo && r->montecarlo.liftoff.n > 0)
    {
      const SwMonteCarlo *mc = &r->montecarlo;
      g_autofree char *lo = sw_format_mass (mc->liftoff.p05);
      g_autofree char *hi = sw_format_mass (mc->liftoff.p95);
      g_autofree char *median = sw_format_mass (mc->liftoff.p50);
      g_autofree char *n = sw_format_number (mc->samples, 0);
      value = g_strdup_printf ("%s – %s", lo, hi);
      if (mc->infeasible_fraction > 0.0)
        {
          g_autofree char *bad = sw_format_percent (mc->infeasible_fraction, 1);
          /* Translators: median mass; share of samples; number of samples; seed */
          detail = g_strdup_printf (_("median %s; %s of the samples do not close (%s samples, "
                                      "seed %u)"), median, bad, n, mc->seed);
        }
      else
        /* Translators: median mass; number of samples; seed */
        detail = g_strdup_printf (_("median %s (%s samples, seed %u)"), median, n, mc->seed);
    }
  else
    {
      value = g_strdup (r != NULL && r->ok && r->montecarlo_pending ? "…" : SW_NO_VALUE);
      detail = g_strdup (r == NULL || !r->ok ? ""
                         : r->montecarlo_pending ? _("Running the Monte Carlo…")
                         : !sw_uncertainty_has_spread (&r->design->uncertainty)
                         ? _("No spreads: set them under “Uncertainty…”.")
                         : _("No sample closes."));
    }
  set_label (self->spread_value, value);
  set_label (self->spread_detail, detail);
  g_clear_pointer (&value, g_free);
  g_clear_pointer (&detail, g_free);

  if (r != NULL && r->ok && r->has_montecarlo && r->montecarlo.payload.n > 0)
    {
      const SwMonteCarlo *mc = &r->montecarlo;
      g_autofree char *reserve = sw_format_mass (mc->reserve_95_kg);
      /* What a manager asks: how likely is the payload carried as the vehicle
       * is sized, and what reserve makes it 95 %. */
      value = sw_format_probability (r->montecarlo_success);
      if (mc->all_fixed && mc->reserve_95_kg >= mc->required_payload_kg)
        detail = g_strdup (_("Even with no payload it falls short in more than 5 percent of "
                             "cases"));
      else if (mc->all_fixed && mc->reserve_95_kg > 0.0)
        /* Translators: %s is a mass */
        detail = g_strdup_printf (_("A payload %s lighter raises it to 95 %%"), reserve);
      else if (mc->all_fixed)
        detail = g_strdup (_("The capability exceeds the payload in at least 95 percent of "
                             "cases"));
      else if (mc->reserve_95_kg > 0.0)
        /* Translators: %s is a mass */
        detail = g_strdup_printf (_("Holding back %s of payload capacity raises it to 95 %%"),
                                  reserve);
      else
        detail = g_strdup (_("No payload reserve is needed for a 95 percent chance"));
    }
  else
    {
      value = g_strdup (r != NULL && r->ok && r->montecarlo_pending ? "…" : SW_NO_VALUE);
      detail = g_strdup (r != NULL && r->ok && r->has_montecarlo
                         ? _("The nominal vehicle does not close.") : "");
    }
  set_label (self->shortfall_value, value);
  set_label (self->shortfall_detail, detail);
  g_clear_pointer (&value, g_free);
  g_clear_pointer (&detail, g_free);

  /* Mission success, and what one stage more or less would give. */
  if (r != NULL && r->ok && r->reliability.given)
    {
      const SwReliabilityCurve *c = &r->reliability_curve;
      guint n = r->design->n_stages;
      GString *text = g_string_new (NULL);

      value = sw_format_probability (r->reliability.mission);
      for (guint k = n - 1; k <= n + 1; k += 2)
        if (k >= 1 && k <= c->n_points && c->given)
          {
            g_autofree char *p = sw_format_probability (c->mission[k - 1]);
            if (text->len > 0)
              g_string_append (text, " · ");
            /* Translators: a stage count and a probability, e.g. "4 stages 95.2 %" */
            g_string_append_printf (text, g_dngettext (GETTEXT_PACKAGE, "%u stage %s",
                                                       "%u stages %s", k), k, p);
          }
      detail = g_string_free (text, FALSE);
    }
  else
    {
      value = g_strdup (SW_NO_VALUE);
      detail = g_strdup (r != NULL && r->ok ? _("No reliability keys in this design") : "");
    }
  set_label (self->success_value, value);
  set_label (self->success_detail, detail);
}

/* ---- public ------------------------------------------------------------ */

GtkWidget *
sw_trade_page_new (void)
{
  return g_object_new (SW_TYPE_TRADE_PAGE, NULL);
}

static void
document_changed_cb (SwTradePage *self)
{
  refresh_inputs (self);
}

void
sw_trade_page_set_document (SwTradePage *self, SwDocument *document)
{
  g_return_if_fail (SW_IS_TRADE_PAGE (self));
  g_return_if_fail (document == NULL || SW_IS_DOCUMENT (document));

  if (self->document == document)
    return;
  if (self->document != NULL)
    g_signal_handlers_disconnect_by_func (self->document, document_changed_cb, self);
  g_set_object (&self->document, document);
  if (document != NULL)
    g_signal_connect_object (document, "changed", G_CALLBACK (document_changed_cb), self,
                             G_CONNECT_SWAPPED);
  refresh_inputs (self);
}

/* A simulate design's sensitivities and Monte Carlo use the allowance
 * until the closed loop, then its losses: the analysis says which. */
static void
show_losses_note (SwTradePage *self, const SwAnalysis *r)
{
  const char *note = r != NULL ? r->trade_losses_note : "";

  if (g_strcmp0 (gtk_label_get_text (self->losses_note), note) != 0)
    gtk_label_set_text (self->losses_note, note);
  gtk_widget_set_visible (GTK_WIDGET (self->losses_note), note[0] != '\0');
}

static void
show_result (SwTradePage *self)
{
  show_cards (self, self->result);
  show_losses_note (self, self->result);
  show_tornado (self, self->result);
  show_histogram (self, self->result);
  show_mass (self, self->result);
  show_reliability (self, self->result);
  self->stale = FALSE;
}

void
sw_trade_page_set_result (SwTradePage *self, SwAnalysis *result)
{
  g_return_if_fail (SW_IS_TRADE_PAGE (self));

  if (self->result == result)
    return;
  g_clear_pointer (&self->result, sw_analysis_unref);
  self->result = result != NULL ? sw_analysis_ref (result) : NULL;
  /* A new design restarts (or cancels) the simulated Monte Carlo at once,
   * shown or not; later phases of the same design change nothing. */
  if (result != NULL && result->ok)
    sw_simulated_mc_set_design (self->simulated_mc, result->design);
  /* Behind another page the cards' labels would cost the window a
   * relayout on every edit: the page catches up when it is shown. */
  self->stale = TRUE;
  if (gtk_widget_get_mapped (GTK_WIDGET (self)))
    show_result (self);
}

static void
sw_trade_page_map (GtkWidget *widget)
{
  SwTradePage *self = SW_TRADE_PAGE (widget);

  GTK_WIDGET_CLASS (sw_trade_page_parent_class)->map (widget);
  if (self->stale)
    show_result (self);
}

double
sw_trade_page_get_step (SwTradePage *self)
{
  g_return_val_if_fail (SW_IS_TRADE_PAGE (self), SW_SENSITIVITY_DEFAULT_STEP);
  return gtk_spin_button_get_value (self->step_spin) / 100.0;
}

void
sw_trade_page_set_step (SwTradePage *self, double step)
{
  g_return_if_fail (SW_IS_TRADE_PAGE (self));
  gtk_spin_button_set_value (self->step_spin, 100.0 * step);
}

SwPlot *
sw_trade_page_get_plot (SwTradePage *self, SwTradePlot which)
{
  g_return_val_if_fail (SW_IS_TRADE_PAGE (self), NULL);

  switch (which)
    {
    case SW_TRADE_PLOT_TORNADO: return self->tornado_plot;
    case SW_TRADE_PLOT_HISTOGRAM: return self->histogram_plot;
    case SW_TRADE_PLOT_MASS: return self->mass_plot;
    case SW_TRADE_PLOT_RELIABILITY: return self->reliability_plot;
    default: return NULL;
    }
}

GtkWidget *
sw_trade_page_get_field (SwTradePage *self, SwTradeField field)
{
  g_return_val_if_fail (SW_IS_TRADE_PAGE (self), NULL);

  switch (field)
    {
    case SW_TRADE_FIELD_STEP: return GTK_WIDGET (self->step_spin);
    case SW_TRADE_FIELD_SAMPLES: return GTK_WIDGET (self->samples_spin);
    case SW_TRADE_FIELD_SEED: return GTK_WIDGET (self->seed_spin);
    case SW_TRADE_FIELD_ISP_KIND: return GTK_WIDGET (self->isp_kind);
    case SW_TRADE_FIELD_ISP_WIDTH: return GTK_WIDGET (self->isp_width);
    case SW_TRADE_FIELD_EPS_KIND: return GTK_WIDGET (self->eps_kind);
    case SW_TRADE_FIELD_EPS_WIDTH: return GTK_WIDGET (self->eps_width);
    case SW_TRADE_FIELD_LOSSES_KIND: return GTK_WIDGET (self->losses_kind);
    case SW_TRADE_FIELD_LOSSES_WIDTH: return GTK_WIDGET (self->losses_width);
    default: return NULL;
    }
}

const char *
sw_trade_page_get_card_text (SwTradePage *self, SwTradeCard card)
{
  g_return_val_if_fail (SW_IS_TRADE_PAGE (self), NULL);

  switch (card)
    {
    case SW_TRADE_CARD_DRIVER: return gtk_label_get_text (self->driver_value);
    case SW_TRADE_CARD_SPREAD: return gtk_label_get_text (self->spread_value);
    case SW_TRADE_CARD_SHORTFALL: return gtk_label_get_text (self->shortfall_value);
    case SW_TRADE_CARD_SUCCESS: return gtk_label_get_text (self->success_value);
    case SW_TRADE_CARD_LOSSES_NOTE:
      return gtk_widget_get_visible (GTK_WIDGET (self->losses_note))
             ? gtk_label_get_text (self->losses_note) : "";
    default: return NULL;
    }
}

guint
sw_trade_page_get_tornado (SwTradePage *self, const double **minus_kg, const double **plus_kg,
                           const char *const **labels)
{
  g_return_val_if_fail (SW_IS_TRADE_PAGE (self), 0);

  if (minus_kg != NULL)
    *minus_kg = self->minus_kg;
  if (plus_kg != NULL)
    *plus_kg = self->plus_kg;
  if (labels != NULL)
    *labels = (const char *const *) self->row_labels;
  return self->n_rows;
}

gboolean
sw_trade_page_get_percentile_lines (SwTradePage *self, double lines[3])
{
  g_return_val_if_fail (SW_IS_TRADE_PAGE (self), FALSE);

  if (!self->has_lines)
    return FALSE;
  for (guint i = 0; i < 3; i++)
    lines[i] = self->lines[i];
  return TRUE;
}

/* ---- GObject ----------------------------------------------------------- */

static void
sw_trade_page_get_property (GObject *object, guint prop_id, GValue *value, GParamSpec *pspec)
{
  SwTradePage *self = SW_TRADE_PAGE (object);

  switch (prop_id)
    {
    case PROP_STEP:
      g_value_set_double (value, sw_trade_page_get_step (self));
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
sw_trade_page_set_property (GObject *object, guint prop_id, const GValue *value,
                            GParamSpec *pspec)
{
  SwTradePage *self = SW_TRADE_PAGE (object);

  switch (prop_id)
    {
    case PROP_STEP:
      sw_trade_page_set_step (self, g_value_get_double (value));
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
sw_trade_page_dispose (GObject *object)
{
  SwTradePage *self = SW_TRADE_PAGE (object);

  if (self->document != NULL)
    g_signal_handlers_disconnect_by_func (self->document, document_changed_cb, self);
  g_clear_object (&self->document);
  g_clear_pointer (&self->result, sw_analysis_unref);
  sw_trade_page_set_settings (self, NULL);
  g_clear_pointer (&self->row_labels, g_strfreev);
  gtk_widget_dispose_template (GTK_WIDGET (self), SW_TYPE_TRADE_PAGE);
  G_OBJECT_CLASS (sw_trade_page_parent_class)->dispose (object);
}

static void
sw_trade_page_class_init (SwTradePageClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = sw_trade_page_dispose;
  object_class->get_property = sw_trade_page_get_property;
  object_class->set_property = sw_trade_page_set_property;
  widget_class->map = sw_trade_page_map;

  properties[PROP_STEP] =
    g_param_spec_double ("step", NULL, NULL, 0.001, 0.5, SW_SENSITIVITY_DEFAULT_STEP,
                         G_PARAM_READWRITE | G_PARAM_EXPLICIT_NOTIFY | G_PARAM_STATIC_STRINGS);
  g_object_class_install_properties (object_class, N_PROPS, properties);

  g_type_ensure (SW_TYPE_PLOT);
  gtk_widget_class_set_template_from_resource (widget_class,
                                               "/org/stagewright/Stagewright/sw-trade-page.ui");
  gtk_widget_class_set_layout_manager_type (widget_class, GTK_TYPE_BIN_LAYOUT);
  gtk_widget_class_set_css_name (widget_class, "sw-trade-page");
#define CHILD(name) gtk_widget_class_bind_template_child (widget_class, SwTradePage, name)
  CHILD (scroller);
  CHILD (cards);
  CHILD (step_spin);
  CHILD (samples_spin);
  CHILD (seed_spin);
  CHILD (isp_kind);
  CHILD (isp_width);
  CHILD (isp_unit);
  CHILD (eps_kind);
  CHILD (eps_width);
  CHILD (eps_unit);
  CHILD (losses_kind);
  CHILD (losses_width);
  CHILD (losses_unit);
  CHILD (driver_caption);
  CHILD (driver_value);
  CHILD (driver_detail);
  CHILD (spread_caption);
  CHILD (spread_value);
  CHILD (spread_detail);
  CHILD (shortfall_caption);
  CHILD (shortfall_value);
  CHILD (shortfall_detail);
  CHILD (success_value);
  CHILD (success_detail);
  CHILD (losses_note);
  CHILD (tornado_plot);
  CHILD (histogram_stack);
  CHILD (histogram_plot);
  CHILD (histogram_spinner);
  CHILD (histogram_empty);
  CHILD (mass_plot);
  CHILD (reliability_stack);
  CHILD (reliability_plot);
  CHILD (reliability_empty);
#undef CHILD
  gtk_widget_class_bind_template_callback (widget_class, step_changed_cb);
  gtk_widget_class_bind_template_callback (widget_class, samples_changed_cb);
  gtk_widget_class_bind_template_callback (widget_class, seed_changed_cb);
  gtk_widget_class_bind_template_callback (widget_class, spread_changed_cb);
}

static void
sw_trade_page_init (SwTradePage *self)
{
  self->updating++;
  gtk_widget_init_template (GTK_WIDGET (self));

  setup_spin (self->step_spin, NULL, SW_LIMIT_SENSITIVITY_STEP, 1, 0.5, 5.0);
  setup_spin (self->samples_spin, NULL, SW_LIMIT_MC_SAMPLES, 0, 1000.0, 10000.0);
  setup_spin (self->seed_spin, NULL, SW_LIMIT_MC_SEED, 0, 1.0, 100.0);
  /* The normal and the uniform spreads share one range in the table. */
  setup_spin (self->isp_width, self->isp_unit, SW_LIMIT_SPREAD_SIGMA_PERCENT, 1, 0.1, 1.0);
  setup_spin (self->eps_width, self->eps_unit, SW_LIMIT_SPREAD_SIGMA_PERCENT, 1, 0.5, 5.0);
  setup_spin (self->losses_width, self->losses_unit, SW_LIMIT_LOSSES_SIGMA, 0, 10.0, 100.0);

  /* Long translated button labels wrap: the window's minimum width never
   * depends on the language. */
  sw_narrow_texts (GTK_WIDGET (self));
  self->updating--;

  /* Below the cards: the Monte Carlo with a simulated ascent per sample. */
  self->simulated_mc = SW_SIMULATED_MC (sw_simulated_mc_new ());
  gtk_box_insert_child_after (GTK_BOX (gtk_widget_get_parent (self->cards)),
                              GTK_WIDGET (self->simulated_mc), self->cards);

  show_result (self);
}

SwSimulatedMc *
sw_trade_page_get_simulated_mc (SwTradePage *self)
{
  g_return_val_if_fail (SW_IS_TRADE_PAGE (self), NULL);
  return self->simulated_mc;
}

GtkWidget *
sw_trade_page_get_samples_field (SwTradePage *self)
{
  g_return_val_if_fail (SW_IS_TRADE_PAGE (self), NULL);
  return GTK_WIDGET (self->samples_spin);
}

GtkWidget *
sw_trade_page_get_seed_field (SwTradePage *self)
{
  g_return_val_if_fail (SW_IS_TRADE_PAGE (self), NULL);
  return GTK_WIDGET (self->seed_spin);
}
