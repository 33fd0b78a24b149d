/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-staging-page"

#include "config.h"

#include "sw-staging-page.h"

#include "sw-carpet.h"
#include "sw-csv-staging.h"
#include "sw-document.h"
#include "sw-economics.h"
#include "sw-engine-types-editor.h"
#include "sw-format.h"
#include "sw-number-field.h"
#include "sw-plot-axis.h"
#include "sw-plot-palette.h"
#include "sw-staging.h"

#include <glib/gi18n.h>
#include <math.h>

/* The worker's input and output: a copy of the design in, figures out. */
typedef struct {
  gint      ref;
  SwDesign *design;
  GCancellable *cancellable;
  GMutex    lock;
  double    progress;          /* 0..1, under lock */
  SwStaging staging;
  gboolean  staging_ok;
  SwCarpet *carpet;
} Job;

static Job *
job_ref (Job *job)
{
  g_atomic_int_inc (&job->ref);
  return job;
}

static void
job_unref (Job *job)
{
  if (!g_atomic_int_dec_and_test (&job->ref))
    return;
  sw_design_free (job->design);
  g_clear_object (&job->cancellable);
  sw_carpet_free (job->carpet);
  g_mutex_clear (&job->lock);
  g_free (job);
}

struct _SwStagingPage {
  GtkWidget       parent_instance;
  GtkWidget      *box;
  GtkWidget      *statement;
  GtkWidget      *decision;
  GtkWidget      *carpet_title;
  GtkWidget      *progress;
  GtkWidget      *carpet;
  GtkWidget      *scroller;
  SwDocument     *document;     /* the edits of the economics keys go here */
  guint           updating;     /* fields being filled from a result */
  GtkWidget      *fields[SW_N_ECON_NUMBERS];
  GtkWidget      *mode;
  GtkWidget      *engine_types;  /* SwEngineTypesEditor: the economics lists */
  Job            *running;      /* the newest job, until it is shown */
  Job            *shown;        /* the job whose figures are drawn */
  guint           progress_id;
  SwAnalysis     *pending;      /* arrived while the page was hidden */
};

G_DEFINE_FINAL_TYPE (SwStagingPage, sw_staging_page, GTK_TYPE_WIDGET)

static void
job_progress_cb (double fraction, gpointer data)
{
  Job *job = data;

  g_mutex_lock (&job->lock);
  job->progress = fraction;
  g_mutex_unlock (&job->lock);
}

static void
job_thread (GTask *task, gpointer source, gpointer data, GCancellable *cancellable)
{
  Job *job = data;
  SwCarpetOptions o;

  job->staging_ok = sw_staging_compute (job->design, SW_STAGING_MAX_STAGES, &job->staging, NULL);
  sw_csv_carpet_default_axes (job->design, &o);
  o.x.n = o.y.n = 50;
  o.cancellable = cancellable;
  o.progress = job_progress_cb;
  o.progress_data = job;
  if (o.x.min < o.x.max && o.y.min < o.y.max)
    job->carpet = sw_carpet_compute (job->design, &o, NULL);
  g_task_return_boolean (task, !g_cancellable_is_cancelled (cancellable));
}

static gboolean
progress_tick_cb (gpointer data)
{
  SwStagingPage *self = data;
  double f = 0.0;

  if (self->running == NULL)
    {
      self->progress_id = 0;
      return G_SOURCE_REMOVE;
    }
  g_mutex_lock (&self->running->lock);
  f = self->running->progress;
  g_mutex_unlock (&self->running->lock);
  gtk_progress_bar_set_fraction (GTK_PROGRESS_BAR (self->progress), f);
  return G_SOURCE_CONTINUE;
}

static void
job_done_cb (GObject *source, GAsyncResult *res, gpointer data)
{
  SwStagingPage *self = SW_STAGING_PAGE (source);
  Job *job = data;

  /* Only the newest job is shown; a cancelled one is dropped. */
  if (g_task_propagate_boolean (G_TASK (res), NULL) && job == self->running)
    {
      g_clear_pointer (&self->shown, job_unref);
      self->shown = g_steal_pointer (&self->running);
      gtk_widget_set_visible (self->progress, FALSE);
      if (self->shown->staging_ok && self->shown->staging.fixed_note[0] != '\0')
        {
          g_autofree char *text = g_strconcat (self->shown->staging.weighting, " ",
                                               self->shown->staging.fixed_note, " ",
                                               self->shown->staging.reuse_note, NULL);
          gtk_label_set_text (GTK_LABEL (self->statement), text);
        }
      else
        gtk_label_set_text (GTK_LABEL (self->statement),
                            self->shown->staging_ok ? self->shown->staging.weighting : "");
      gtk_widget_queue_draw (self->decision);
      gtk_widget_queue_draw (self->carpet);
    }
  job_unref (job);
}

void
sw_staging_page_set_result (SwStagingPage *self, SwAnalysis *result)
{
  g_autoptr (GTask) task = NULL;
  Job *job;

  g_return_if_fail (SW_IS_STAGING_PAGE (self));

  /* Hidden, the page only keeps the newest analysis and works when it is
   * shown: the worker and the main thread stay free for the visible views. */
  if (!gtk_widget_get_mapped (GTK_WIDGET (self)))
    {
      g_clear_pointer (&self->pending, sw_analysis_unref);
      self->pending = result != NULL ? sw_analysis_ref (result) : NULL;
      return;
    }
  /* The figures depend on the design only: a later phase of the same
   * design (Monte Carlo, ascent) changes nothing here. */
  if (result != NULL && result->design != NULL)
    {
      Job *last = self->running != NULL ? self->running : self->shown;
      if (last != NULL && sw_design_equal (last->design, result->design))
        return;
    }
  if (self->running != NULL)
    {
      g_cancellable_cancel (self->running->cancellable);
      g_clear_pointer (&self->running, job_unref);
    }
  if (result == NULL || result->design == NULL || result->design->n_stages == 0)
    return;
  /* The fields show the design the figures come from. */
  self->updating++;
  for (guint k = 0; k < SW_N_ECON_NUMBERS; k++)
    {
      double v = sw_economics_get_number (&result->design->economics, k);
      double scale = sw_limit_get (sw_economics_number_limit (k))->max <= 1.0 ? 100.0 : 1.0;
      sw_number_field_reset (SW_NUMBER_FIELD (self->fields[k]), v * scale);
    }
  gtk_drop_down_set_selected (GTK_DROP_DOWN (self->mode), result->design->economics.recovery_mode);
  self->updating--;
  job = g_new0 (Job, 1);
  job->ref = 1;
  g_mutex_init (&job->lock);
  job->design = sw_design_copy (result->design);
  job->cancellable = g_cancellable_new ();
  self->running = job;
  task = g_task_new (self, job->cancellable, job_done_cb, job_ref (job));
  g_task_set_source_tag (task, sw_staging_page_set_result);
  g_task_set_name (task, "staging decision and carpet");
  g_task_set_task_data (task, job_ref (job), (GDestroyNotify) job_unref);
  g_task_run_in_thread (task, job_thread);
  gtk_progress_bar_set_fraction (GTK_PROGRESS_BAR (self->progress), 0.0);
  gtk_widget_set_visible (self->progress, TRUE);
  if (self->progress_id == 0)
    self->progress_id = g_timeout_add (50, progress_tick_cb, self);
}

void
sw_staging_page_set_document (SwStagingPage *self, SwDocument *document)
{
  g_return_if_fail (SW_IS_STAGING_PAGE (self));
  g_set_object (&self->document, document);
  sw_engine_types_editor_set_document (SW_ENGINE_TYPES_EDITOR (self->engine_types), document);
}

GtkWidget *
sw_staging_page_get_field (SwStagingPage *self, SwEconNumber key)
{
  g_return_val_if_fail (SW_IS_STAGING_PAGE (self) && key < SW_N_ECON_NUMBERS, NULL);
  return self->fields[key];
}

GtkWidget *
sw_staging_page_get_engine_types (SwStagingPage *self)
{
  g_return_val_if_fail (SW_IS_STAGING_PAGE (self), NULL);
  return self->engine_types;
}

GtkWidget *
sw_staging_page_get_mode (SwStagingPage *self)
{
  g_return_val_if_fail (SW_IS_STAGING_PAGE (self), NULL);
  return self->mode;
}

/* A field's value into the design through the named edit, one undo step
 * per field (merged while the same field is edited). */
static void
field_committed_cb (SwNumberField *field, SwStagingPage *self)
{
  SwEconNumber key = GPOINTER_TO_UINT (g_object_get_data (G_OBJECT (field), "sw-econ-key"));
  double scale = sw_limit_get (sw_economics_number_limit (key))->max <= 1.0 ? 100.0 : 1.0;
  g_autofree char *merge = g_strdup_printf ("staging:%u", key);
  SwDesign *d;

  if (self->updating > 0 || self->document == NULL)
    return;
  d = sw_document_dup_design (self->document);
  if (!sw_economics_set_number (&d->economics, key, sw_number_field_get_value (field) / scale)
      || sw_design_equal (d, sw_document_get_design (self->document)))
    {
      sw_design_free (d);
      return;
    }
  sw_document_commit (self->document, d, merge);
}

static void
mode_cb (GtkDropDown *dd, GParamSpec *pspec, SwStagingPage *self)
{
  SwDesign *d;

  if (self->updating > 0 || self->document == NULL)
    return;
  d = sw_document_dup_design (self->document);
  sw_economics_set_recovery_mode (&d->economics, gtk_drop_down_get_selected (dd));
  if (sw_design_equal (d, sw_document_get_design (self->document)))
    {
      sw_design_free (d);
      return;
    }
  sw_document_commit (self->document, d, "staging:mode");
}

gboolean
sw_staging_page_is_ready (SwStagingPage *self)
{
  g_return_val_if_fail (SW_IS_STAGING_PAGE (self), FALSE);
  return self->running == NULL && self->shown != NULL;
}

const char *
sw_staging_page_get_weighting (SwStagingPage *self)
{
  g_return_val_if_fail (SW_IS_STAGING_PAGE (self), NULL);
  return gtk_label_get_text (GTK_LABEL (self->statement));
}

/* ---- drawing ------------------------------------------------------------- */

static double
measure_cb (const char *text, gboolean horizontal, gpointer data)
{
  PangoLayout *layout = data;
  int w, h;

  pango_layout_set_text (layout, text, -1);
  pango_layout_get_pixel_size (layout, &w, &h);
  return horizontal ? w : h;
}

static void
show_text (cairo_t *cr, PangoLayout *layout, const char *text, double x, double y,
           double align_x, double align_y)
{
  int w, h;

  pango_layout_set_text (layout, text, -1);
  pango_layout_get_pixel_size (layout, &w, &h);
  cairo_move_to (cr, x - align_x * w, y - align_y * h);
  pango_cairo_show_layout (cr, layout);
}

static void
set_rgba (cairo_t *cr, const GdkRGBA *c, double alpha)
{
  cairo_set_source_rgba (cr, c->red, c->green, c->blue, c->alpha * alpha);
}

typedef struct {
  const char *title;
  const char *format;
  double      scale;
  gsize       offset;       /* the row's value */
  gsize       offset2;      /* a second series (recovered), or 0 */
} Panel;

static double
row_value (const SwStagingRow *row, gsize offset)
{
  return *(const double *) ((const char *) row + offset);
}

static void
draw_decision (GtkDrawingArea *area, cairo_t *cr, int width, int height, gpointer data)
{
  SwStagingPage *self = data;
  GtkWidget *w = GTK_WIDGET (area);
  const Panel panels[] = {
    { N_("Liftoff mass"), N_("%.4g t"), 1000.0, G_STRUCT_OFFSET (SwStagingRow, liftoff_mass_kg),
      G_STRUCT_OFFSET (SwStagingRow, liftoff_mass_reused_kg) },
    { N_("Development, work-years"), "%.3g", 1.0,
      G_STRUCT_OFFSET (SwStagingRow, development_work_years),
      G_STRUCT_OFFSET (SwStagingRow, development_reused_work_years) },
    { N_("Per flight, work-years"), "%.3g", 1.0,
      G_STRUCT_OFFSET (SwStagingRow, cost_per_flight_work_years),
      G_STRUCT_OFFSET (SwStagingRow, cost_per_flight_reused_work_years) },
    { N_("Mission success, %"), "%.4g", 0.01, G_STRUCT_OFFSET (SwStagingRow, success_probability),
      0 },
    { N_("Payload, this liftoff mass"), N_("%.3g t"), 1000.0,
      G_STRUCT_OFFSET (SwStagingRow, payload_fixed_size_kg), 0 },
  };
  const guint n_panels = G_N_ELEMENTS (panels);
  g_autoptr (PangoLayout) layout = gtk_widget_create_pango_layout (w, NULL);
  GdkRGBA fg, c_exp, c_rec, c_best, c_mark;
  const SwStaging *s;
  double panel_w, panel_h, left = 8.0;
  const guint cols = 3;

  sw_plot_style_fg (w, &fg);
  sw_plot_palette_color (w, 0, &c_exp);
  sw_plot_palette_color (w, 1, &c_rec);
  sw_plot_palette_color (w, 2, &c_best);
  sw_plot_palette_color (w, 4, &c_mark);
  if (self->shown == NULL || !self->shown->staging_ok)
    {
      set_rgba (cr, &fg, 0.7);
      show_text (cr, layout, _("Computing the staging decision…"), width / 2.0, height / 2.0,
                 0.5, 0.5);
      return;
    }
  s = &self->shown->staging;
  /* Three panels a row, two rows: every panel the same x scale. */
  panel_w = (width - left) / cols;
  panel_h = height / 2.0;
  cairo_set_line_width (cr, 1.0);
  for (guint p = 0; p < n_panels; p++)
    {
      SwPlotAxis xa, ya;
      double x0 = left + (p % cols) * panel_w, y0 = (p / cols) * panel_h;
      double lo = INFINITY, hi = -INFINITY;
      double plot_l = x0 + 52.0, plot_r = x0 + panel_w - 12.0, plot_t = y0 + 24.0;
      double plot_b = y0 + panel_h - 36.0;
      gboolean any = FALSE;

      for (guint i = 0; i < s->n_rows; i++)
        for (guint k = 0; k < 2; k++)
          {
            gsize off = k == 0 ? panels[p].offset : panels[p].offset2;
            double v;
            if (k == 1 && off == 0)
              continue;
            v = row_value (&s->rows[i], off);
            if (isfinite (v))
              {
                lo = MIN (lo, v);
                hi = MAX (hi, v);
                any = TRUE;
              }
          }
      set_rgba (cr, &fg, 1.0);
      show_text (cr, layout, _(panels[p].title), (plot_l + plot_r) / 2.0, y0 + 2.0, 0.5, 0.0);
      if (!any)
        {
          set_rgba (cr, &fg, 0.6);
          show_text (cr, layout, _("no reliability keys"), (plot_l + plot_r) / 2.0,
                     (plot_t + plot_b) / 2.0, 0.5, 0.5);
          continue;
        }
      if (lo == hi)
        {
          lo -= fabs (lo) * 0.05 + 1e-9;
          hi += fabs (hi) * 0.05 + 1e-9;
        }
      /* One x scale for every panel: stage counts 1 to 6. */
      sw_plot_axis_init (&xa);
      xa.integer = TRUE;
      xa.fixed_min = 0.5;
      xa.fixed_max = SW_STAGING_MAX_STAGES + 0.5;
      sw_plot_axis_set_format (&xa, "%.0f", 1.0);
      sw_plot_axis_compute (&xa, 1, SW_STAGING_MAX_STAGES, plot_l, plot_r, TRUE, measure_cb,
                            layout);
      sw_plot_axis_init (&ya);
      sw_plot_axis_set_format (&ya, _(panels[p].format), panels[p].scale);
      sw_plot_axis_compute (&ya, lo, hi, plot_b, plot_t, FALSE, measure_cb, layout);

      /* The best count, highlighted; this design's count, marked. */
      if (s->best >= 0)
        {
          double bx = sw_plot_axis_map (&xa, s->rows[s->best].n_stages);
          set_rgba (cr, &c_best, 0.25);
          double half = 0.4 * (plot_r - plot_l) / SW_STAGING_MAX_STAGES;
          cairo_rectangle (cr, bx - half, plot_t, 2.0 * half, plot_b - plot_t);
          cairo_fill (cr);
        }
      if (s->design_stages >= 1 && s->design_stages <= SW_STAGING_MAX_STAGES)
        {
          double dx = sw_plot_axis_map (&xa, s->design_stages);
          const double dash[] = { 4.0, 3.0 };
          set_rgba (cr, &c_mark, 1.0);
          cairo_set_dash (cr, dash, 2, 0.0);
          cairo_move_to (cr, dx, plot_t);
          cairo_line_to (cr, dx, plot_b);
          cairo_stroke (cr);
          cairo_set_dash (cr, NULL, 0, 0.0);
        }
      /* Frame and ticks. */
      set_rgba (cr, &fg, 0.8);
      cairo_rectangle (cr, plot_l, plot_t, plot_r - plot_l, plot_b - plot_t);
      cairo_stroke (cr);
      /* Every stage count labelled: the shared x scale. */
      for (guint n = 1; n <= SW_STAGING_MAX_STAGES; n++)
        {
          g_autofree char *text = g_strdup_printf ("%u", n);
          show_text (cr, layout, text, sw_plot_axis_map (&xa, n), plot_b + 2.0, 0.5, 0.0);
        }
      for (guint t = 0; t < ya.ticks->len; t++)
        {
          const SwPlotTick *tk = &g_array_index (ya.ticks, SwPlotTick, t);
          double ty = sw_plot_axis_map (&ya, tk->value);
          if (!tk->major || ty < plot_t - 0.5 || ty > plot_b + 0.5)
            continue;
          cairo_move_to (cr, plot_l - 3.0, ty);
          cairo_line_to (cr, plot_l, ty);
          cairo_stroke (cr);
          if (tk->labelled && tk->text != NULL)
            show_text (cr, layout, tk->text, plot_l - 4.0, ty, 1.0, 0.5);
        }
      /* The series: expendable solid, recovered dashed; a cross where the
       * vehicle does not close. */
      for (guint k = 0; k < 2; k++)
        {
          gsize off = k == 0 ? panels[p].offset : panels[p].offset2;
          gboolean pen = FALSE;
          const double dash[] = { 5.0, 3.0 };

          if (k == 1 && off == 0)
            continue;
          set_rgba (cr, k == 0 ? &c_exp : &c_rec, 1.0);
          cairo_set_line_width (cr, 2.0);
          cairo_set_dash (cr, dash, k == 1 ? 2 : 0, 0.0);
          for (guint i = 0; i < s->n_rows; i++)
            {
              double v = row_value (&s->rows[i], off);
              double px = sw_plot_axis_map (&xa, s->rows[i].n_stages);
              if (!isfinite (v))
                {
                  pen = FALSE;
                  continue;
                }
              if (pen)
                cairo_line_to (cr, px, sw_plot_axis_map (&ya, v));
              else
                cairo_move_to (cr, px, sw_plot_axis_map (&ya, v));
              pen = TRUE;
            }
          cairo_stroke (cr);
          cairo_set_dash (cr, NULL, 0, 0.0);
          for (guint i = 0; i < s->n_rows; i++)
            {
              double v = row_value (&s->rows[i], off);
              if (isfinite (v))
                {
                  cairo_arc (cr, sw_plot_axis_map (&xa, s->rows[i].n_stages),
                             sw_plot_axis_map (&ya, v), 3.0, 0, 2 * G_PI);
                  cairo_fill (cr);
                }
            }
        }
      cairo_set_line_width (cr, 1.0);
      set_rgba (cr, &fg, 0.8);
      show_text (cr, layout, _("stages"), (plot_l + plot_r) / 2.0, y0 + panel_h - 2.0, 0.5, 1.0);
      sw_plot_axis_clear (&xa);
      sw_plot_axis_clear (&ya);
    }
}

/* Contour lines by marching squares, linear interpolation on each edge. */
static void
contour (cairo_t *cr, const SwCarpet *c, const SwPlotAxis *xa, const SwPlotAxis *ya,
         double level)
{
  for (guint j = 0; j + 1 < c->y.n; j++)
    for (guint i = 0; i + 1 < c->x.n; i++)
      {
        const double v[4] = { c->values[j * c->x.n + i], c->values[j * c->x.n + i + 1],
                              c->values[(j + 1) * c->x.n + i + 1],
                              c->values[(j + 1) * c->x.n + i] };
        const double cx[4] = { i, i + 1, i + 1, i }, cy[4] = { j, j, j + 1, j + 1 };
        double px[4], py[4];
        guint n = 0;

        if (!isfinite (v[0]) || !isfinite (v[1]) || !isfinite (v[2]) || !isfinite (v[3]))
          continue;
        for (guint e = 0; e < 4 && n < 4; e++)
          {
            double a = v[e], b = v[(e + 1) % 4];
            if ((a < level) != (b < level))
              {
                double t = (level - a) / (b - a);
                double gi = cx[e] + t * (cx[(e + 1) % 4] - cx[e]);
                double gj = cy[e] + t * (cy[(e + 1) % 4] - cy[e]);
                px[n] = sw_plot_axis_map (xa, c->x.min + gi * (c->x.max - c->x.min) / (c->x.n - 1));
                py[n] = sw_plot_axis_map (ya, c->y.min + gj * (c->y.max - c->y.min) / (c->y.n - 1));
                n++;
              }
          }
        for (guint k = 0; k + 1 < n; k += 2)
          {
            cairo_move_to (cr, px[k], py[k]);
            cairo_line_to (cr, px[k + 1], py[k + 1]);
          }
      }
  cairo_stroke (cr);
}

static void
draw_carpet (GtkDrawingArea *area, cairo_t *cr, int width, int height, gpointer data)
{
  SwStagingPage *self = data;
  GtkWidget *w = GTK_WIDGET (area);
  g_autoptr (PangoLayout) layout = gtk_widget_create_pango_layout (w, NULL);
  GdkRGBA fg, line, mark;
  const SwCarpet *c;
  SwPlotAxis xa, ya;
  double l = 70.0, r = width - 16.0, t = 10.0, b = height - 44.0, lo = INFINITY, hi = -INFINITY;
  double step;
  g_autofree char *xn = NULL, *yn = NULL;

  sw_plot_style_fg (w, &fg);
  sw_plot_palette_color (w, 0, &line);
  sw_plot_palette_color (w, 4, &mark);
  if (self->shown == NULL || self->shown->carpet == NULL)
    {
      set_rgba (cr, &fg, 0.7);
      show_text (cr, layout, _("Computing the carpet…"), width / 2.0, height / 2.0, 0.5, 0.5);
      return;
    }
  c = self->shown->carpet;
  sw_plot_axis_init (&xa);
  sw_plot_axis_set_format (&xa, "%.3g", 1.0);
  xa.fixed_min = c->x.min;
  xa.fixed_max = c->x.max;
  sw_plot_axis_compute (&xa, c->x.min, c->x.max, l, r, TRUE, measure_cb, layout);
  sw_plot_axis_init (&ya);
  sw_plot_axis_set_format (&ya, _("%.0f s"), 1.0);
  ya.fixed_min = c->y.min;
  ya.fixed_max = c->y.max;
  sw_plot_axis_compute (&ya, c->y.min, c->y.max, b, t, FALSE, measure_cb, layout);

  /* Infeasible cells hatched. */
  cairo_save (cr);
  cairo_rectangle (cr, l, t, r - l, b - t);
  cairo_clip (cr);
  for (guint j = 0; j < c->y.n; j++)
    for (guint i = 0; i < c->x.n; i++)
      if (!c->feasible[j * c->x.n + i])
        {
          double dx = (r - l) / (c->x.n - 1), dy = (b - t) / (c->y.n - 1);
          double cx = sw_plot_axis_map (&xa, sw_carpet_axis_value (&c->x, i));
          double cy = sw_plot_axis_map (&ya, sw_carpet_axis_value (&c->y, j));
          cairo_rectangle (cr, cx - dx / 2, cy - dy / 2, dx, dy);
        }
  cairo_clip (cr);
  set_rgba (cr, &fg, 0.45);
  for (double k = -(b - t); k < (r - l); k += 8.0)
    {
      cairo_move_to (cr, l + k, b);
      cairo_line_to (cr, l + k + (b - t), t);
    }
  cairo_stroke (cr);
  cairo_restore (cr);

  /* Contours at nice levels of liftoff mass. */
  for (guint k = 0; k < c->x.n * c->y.n; k++)
    if (isfinite (c->values[k]))
      {
        lo = MIN (lo, c->values[k]);
        hi = MAX (hi, c->values[k]);
      }
  if (isfinite (lo) && hi > lo)
    {
      step = sw_plot_nice_step (hi - lo, 8.0);
      set_rgba (cr, &line, 1.0);
      cairo_set_line_width (cr, 1.5);
      for (double level = ceil (lo / step) * step; level <= hi; level += step)
        {
          g_autofree char *label = sw_format_mass (level);
          contour (cr, c, &xa, &ya, level);
          /* The level's label where its line crosses the middle row. */
          for (guint i = 0; i + 1 < c->x.n; i++)
            {
              guint j = c->y.n / 2;
              double a = c->values[j * c->x.n + i], bb = c->values[j * c->x.n + i + 1];
              if (isfinite (a) && isfinite (bb) && (a < level) != (bb < level))
                {
                  double tt = (level - a) / (bb - a);
                  double xv = sw_carpet_axis_value (&c->x, i)
                              + tt * (c->x.max - c->x.min) / (c->x.n - 1);
                  set_rgba (cr, &fg, 1.0);
                  show_text (cr, layout, label, sw_plot_axis_map (&xa, xv) + 2,
                             sw_plot_axis_map (&ya, sw_carpet_axis_value (&c->y, j)), 0.0, 1.0);
                  set_rgba (cr, &line, 1.0);
                  break;
                }
            }
        }
    }
  /* Frame, ticks, axis names. */
  cairo_set_line_width (cr, 1.0);
  set_rgba (cr, &fg, 0.8);
  cairo_rectangle (cr, l, t, r - l, b - t);
  cairo_stroke (cr);
  for (guint k = 0; k < xa.ticks->len; k++)
    {
      const SwPlotTick *tk = &g_array_index (xa.ticks, SwPlotTick, k);
      if (tk->labelled && tk->text != NULL)
        show_text (cr, layout, tk->text, sw_plot_axis_map (&xa, tk->value), b + 2, 0.5, 0.0);
    }
  for (guint k = 0; k < ya.ticks->len; k++)
    {
      const SwPlotTick *tk = &g_array_index (ya.ticks, SwPlotTick, k);
      if (tk->labelled && tk->text != NULL)
        show_text (cr, layout, tk->text, l - 4, sw_plot_axis_map (&ya, tk->value), 1.0, 0.5);
    }
  xn = sw_carpet_param_dup_label (&c->x);
  yn = sw_carpet_param_dup_label (&c->y);
  {
    g_autofree char *axes = g_strdup_printf (_("across: %s   up: %s   hatched: the vehicle "
                                               "does not close"),
                                             xn, yn);
    show_text (cr, layout, axes, (l + r) / 2, height - 2, 0.5, 1.0);
  }
  /* This design. */
  if (isfinite (c->design_x) && isfinite (c->design_y))
    {
      double dx = sw_plot_axis_map (&xa, c->design_x), dy = sw_plot_axis_map (&ya, c->design_y);
      set_rgba (cr, &mark, 1.0);
      cairo_set_line_width (cr, 2.5);
      cairo_move_to (cr, dx - 6, dy - 6);
      cairo_line_to (cr, dx + 6, dy + 6);
      cairo_move_to (cr, dx - 6, dy + 6);
      cairo_line_to (cr, dx + 6, dy - 6);
      cairo_stroke (cr);
      show_text (cr, layout, _("this design"), dx + 8, dy - 8, 0.0, 1.0);
    }
  sw_plot_axis_clear (&xa);
  sw_plot_axis_clear (&ya);
}

static void
sw_staging_page_dispose (GObject *object)
{
  SwStagingPage *self = SW_STAGING_PAGE (object);

  if (self->running != NULL)
    g_cancellable_cancel (self->running->cancellable);
  g_clear_pointer (&self->running, job_unref);
  g_clear_pointer (&self->shown, job_unref);
  g_clear_pointer (&self->pending, sw_analysis_unref);
  g_clear_handle_id (&self->progress_id, g_source_remove);
  g_clear_object (&self->document);
  g_clear_pointer (&self->scroller, gtk_widget_unparent);
  G_OBJECT_CLASS (sw_staging_page_parent_class)->dispose (object);
}

static void
sw_staging_page_map (GtkWidget *widget)
{
  SwStagingPage *self = SW_STAGING_PAGE (widget);

  GTK_WIDGET_CLASS (sw_staging_page_parent_class)->map (widget);
  if (self->pending != NULL)
    {
      g_autoptr (SwAnalysis) pending = g_steal_pointer (&self->pending);
      sw_staging_page_set_result (self, pending);
    }
}

static void
sw_staging_page_class_init (SwStagingPageClass *klass)
{
  G_OBJECT_CLASS (klass)->dispose = sw_staging_page_dispose;
  GTK_WIDGET_CLASS (klass)->map = sw_staging_page_map;
  gtk_widget_class_set_layout_manager_type (GTK_WIDGET_CLASS (klass), GTK_TYPE_BIN_LAYOUT);
  gtk_widget_class_set_css_name (GTK_WIDGET_CLASS (klass), "swstagingpage");
}

static void
sw_staging_page_init (SwStagingPage *self)
{
  GtkWidget *heading, *note;

  self->scroller = gtk_scrolled_window_new ();
  gtk_scrolled_window_set_policy (GTK_SCROLLED_WINDOW (self->scroller), GTK_POLICY_NEVER,
                                  GTK_POLICY_AUTOMATIC);
  gtk_widget_set_parent (self->scroller, GTK_WIDGET (self));
  self->box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 6);
  gtk_widget_set_margin_start (self->box, 8);
  gtk_widget_set_margin_end (self->box, 8);
  gtk_widget_set_margin_top (self->box, 8);
  gtk_widget_set_margin_bottom (self->box, 8);
  gtk_scrolled_window_set_child (GTK_SCROLLED_WINDOW (self->scroller), self->box);

  heading = gtk_label_new (_("The staging decision: one to six serial stages (boosters are not "
                             "modelled yet). Solid: expendable; dashed: first stage recovered. "
                             "Shaded: the best count; dashed line: this design."));
  gtk_label_set_wrap (GTK_LABEL (heading), TRUE);
  gtk_label_set_xalign (GTK_LABEL (heading), 0.0);
  gtk_box_append (GTK_BOX (self->box), heading);
  self->statement = gtk_label_new ("");
  gtk_label_set_wrap (GTK_LABEL (self->statement), TRUE);
  gtk_label_set_xalign (GTK_LABEL (self->statement), 0.0);
  gtk_box_append (GTK_BOX (self->box), self->statement);
  self->decision = gtk_drawing_area_new ();
  gtk_widget_set_size_request (self->decision, 300, 420);
  gtk_widget_set_vexpand (self->decision, TRUE);
  gtk_drawing_area_set_draw_func (GTK_DRAWING_AREA (self->decision), draw_decision, self, NULL);
  gtk_box_append (GTK_BOX (self->box), self->decision);
  note = gtk_label_new (_("Effort in work-years from the published statistical cost-model form "
                          "(coefficients from memory unless the design sets them): an estimate "
                          "for comparing concepts, never a quote."));
  gtk_label_set_wrap (GTK_LABEL (note), TRUE);
  gtk_label_set_xalign (GTK_LABEL (note), 0.0);
  gtk_widget_add_css_class (note, "dim-label");
  gtk_box_append (GTK_BOX (self->box), note);

  self->carpet_title = gtk_label_new (_("Carpet plot: liftoff mass, contour lines"));
  gtk_label_set_xalign (GTK_LABEL (self->carpet_title), 0.0);
  gtk_box_append (GTK_BOX (self->box), self->carpet_title);
  self->progress = gtk_progress_bar_new ();
  gtk_widget_set_visible (self->progress, FALSE);
  gtk_box_append (GTK_BOX (self->box), self->progress);
  self->carpet = gtk_drawing_area_new ();
  gtk_widget_set_size_request (self->carpet, 300, 380);
  gtk_widget_set_vexpand (self->carpet, TRUE);
  gtk_drawing_area_set_draw_func (GTK_DRAWING_AREA (self->carpet), draw_carpet, self, NULL);
  gtk_box_append (GTK_BOX (self->box), self->carpet);
  {
    static const char *const labels[SW_N_ECON_NUMBERS] = {
      [SW_ECON_WORK_YEAR_COST] = N_("Cost of a work-year"),
      [SW_ECON_PRODUCTION_RUN] = N_("Vehicles built"),
      [SW_ECON_LEARNING_RATE] = N_("Learning rate"),
      [SW_ECON_CER_FIRST + SW_CER_STAGE_DEV_FACTOR] = N_("Stage development a"),
      [SW_ECON_CER_FIRST + SW_CER_STAGE_DEV_EXPONENT] = N_("Stage development x"),
      [SW_ECON_CER_FIRST + SW_CER_STAGE_UNIT_FACTOR] = N_("Stage first unit b"),
      [SW_ECON_CER_FIRST + SW_CER_STAGE_UNIT_EXPONENT] = N_("Stage first unit y"),
      [SW_ECON_CER_FIRST + SW_CER_ENGINE_DEV_FACTOR] = N_("Engine development a"),
      [SW_ECON_CER_FIRST + SW_CER_ENGINE_DEV_EXPONENT] = N_("Engine development x"),
      [SW_ECON_CER_FIRST + SW_CER_ENGINE_UNIT_FACTOR] = N_("Engine first unit b"),
      [SW_ECON_CER_FIRST + SW_CER_ENGINE_UNIT_EXPONENT] = N_("Engine first unit y"),
      [SW_ECON_CER_FIRST + SW_CER_SYSTEMS_BASE] = N_("Systems factor per stage"),
      [SW_ECON_ENGINE_MASS_FRACTION] = N_("Engines in a stage's dry mass"),
      [SW_ECON_RECOVERY_DELTA_V] = N_("Recovery delta-v"),
      [SW_ECON_LANDING_HARDWARE] = N_("Landing hardware"),
      [SW_ECON_REFURBISHMENT] = N_("Refurbishment"),
      [SW_ECON_FLIGHTS_PER_STAGE] = N_("Flights per stage"),
      [SW_ECON_WEIGHT_LIFTOFF_MASS] = N_("Weight: liftoff mass"),
      [SW_ECON_WEIGHT_DEVELOPMENT] = N_("Weight: development"),
      [SW_ECON_WEIGHT_COST_PER_FLIGHT] = N_("Weight: cost per flight"),
      [SW_ECON_WEIGHT_FAILURE] = N_("Weight: failure"),
    };
    GtkWidget *title = gtk_label_new (_("Cost model, recovery and weights (the design's "
                                        "economics keys)"));
    GtkWidget *grid = gtk_grid_new ();
    const char *modes[] = { N_("Expendable"), N_("Lands downrange"),
                            N_("Returns to the launch site"), NULL };
    const char *shown[4];

    gtk_grid_set_column_spacing (GTK_GRID (grid), 8);
    gtk_grid_set_row_spacing (GTK_GRID (grid), 4);
    for (guint k = 0; k < SW_N_ECON_NUMBERS; k++)
      {
        SwLimitId id = sw_economics_number_limit (k);
        gboolean percent = sw_limit_get (id)->max <= 1.0;
        GtkWidget *label = gtk_label_new (_(labels[k]));
        GtkWidget *field = sw_number_field_new ();
        int row = (int) k + 1, col = 0;

        gtk_label_set_xalign (GTK_LABEL (label), 0.0);
        sw_number_field_set_limit (SW_NUMBER_FIELD (field), id, percent ? 100.0 : 1.0,
                                   sw_economics_number_is_whole (k) ? 0 : 3,
                                   sw_economics_number_is_whole (k) ? 1.0 : 0.01);
        sw_number_field_set_whole (SW_NUMBER_FIELD (field), sw_economics_number_is_whole (k));
        if (k == SW_ECON_WORK_YEAR_COST)
          sw_number_field_set_optional (SW_NUMBER_FIELD (field), TRUE, _("work-years only"));
        g_object_set_data (G_OBJECT (field), "sw-econ-key", GUINT_TO_POINTER (k));
        g_signal_connect (field, "value-committed", G_CALLBACK (field_committed_cb), self);
        gtk_widget_set_hexpand (field, TRUE);
        gtk_grid_attach (GTK_GRID (grid), label, col, row, 1, 1);
        gtk_grid_attach (GTK_GRID (grid), field, col + 1, row, 1, 1);
        self->fields[k] = field;
      }
    for (guint i = 0; i < 3; i++)
      shown[i] = _(modes[i]);
    shown[3] = NULL;
    self->mode = gtk_drop_down_new_from_strings (shown);
    g_signal_connect (self->mode, "notify::selected", G_CALLBACK (mode_cb), self);
    gtk_grid_attach (GTK_GRID (grid), gtk_label_new (_("First stage")), 0, 0, 1, 1);
    gtk_grid_attach (GTK_GRID (grid), self->mode, 1, 0, 1, 1);
    gtk_label_set_wrap (GTK_LABEL (title), TRUE);
    gtk_label_set_xalign (GTK_LABEL (title), 0.0);
    gtk_box_append (GTK_BOX (self->box), title);
    gtk_box_append (GTK_BOX (self->box), grid);
    self->engine_types = sw_engine_types_editor_new ();
    gtk_box_append (GTK_BOX (self->box), self->engine_types);
  }
}

GtkWidget *
sw_staging_page_new (void)
{
  return g_object_new (SW_TYPE_STAGING_PAGE, NULL);
}
