/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The sheet's charts: liftoff mass and mission success against stage count,
 * the Monte Carlo histogram and the tornado. */
#define G_LOG_DOMAIN "sw-sheet"

#include "config.h"

#include "sw-sheet-private.h"

#include "sw-format.h"

#include <glib/gi18n-lib.h>
#include <math.h>


typedef struct {
  double x, y, w, h;     /* plot area */
  double lo, hi;         /* y range (log10 when log) */
  gboolean log;
  guint  n;              /* categories 1..n on x */
} Axes;

static double
ax_x (const Axes *a, double stages)
{
  return a->x + (stages - 0.5) / a->n * a->w;
}

static double
ax_y (const Axes *a, double v)
{
  double t = a->log ? log10 (v) : v;
  return a->y + a->h - (t - a->lo) / (a->hi - a->lo) * a->h;
}

static void
draw_x_axis (cairo_t *cr, const Axes *a, guint highlight, const char *label)
{
  TextStyle tick = sw_sheet_style_w (7.0, FALSE, MUTED, PANGO_ALIGN_CENTER, 20);
  TextStyle lab = sw_sheet_style_w (7.0, FALSE, MUTED, PANGO_ALIGN_CENTER, a->w);

  sw_sheet_rule (cr, a->x, a->x + a->w, a->y + a->h, MUTED, 0.6);
  for (guint n = 1; n <= a->n; n++)
    {
      char buf[8];
      g_snprintf (buf, sizeof buf, "%u", n);
      tick.bold = n == highlight;
      tick.color = n == highlight ? INK : MUTED;
      sw_sheet_text_at (cr, buf, ax_x (a, n) - 10, a->y + a->h + 2.0, &tick);
    }
  sw_sheet_text_at (cr, label, a->x, a->y + a->h + 11.0, &lab);
}

/* A tick in tonnes: "0.5", "7", "1,500", or from 100,000 up "10⁷" and
 * "7×10⁵" (never the C library's "7e+05"). */
static char *
tick_label (double t)
{
  static const char *const sup[] = { "\342\201\260", "\302\271", "\302\262", "\302\263",
                                     "\342\201\264", "\342\201\265", "\342\201\266",
                                     "\342\201\267", "\342\201\270", "\342\201\271" };

  if (t >= 99999.0 && t < 1e100)
    {
      int k = (int) floor (log10 (t) + 1e-9);
      double m = t / pow (10.0, k);
      g_autofree char *power = k < 10 ? g_strconcat ("10", sup[k], NULL)
                                      : g_strconcat ("10", sup[k / 10], sup[k % 10], NULL);
      g_autofree char *mantissa = NULL;

      if (fabs (m - 1.0) < 1e-6)
        return g_steal_pointer (&power);
      mantissa = sw_format_number (m, fabs (m - round (m)) < 1e-6 ? 0 : 1);
      return g_strconcat (mantissa, "\303\227", power, NULL);  /* U+00D7 */
    }
  return sw_format_number (t, fabs (t - round (t)) < 1e-9 ? 0 : (t < 1.0 ? 2 : 1));
}

/* Log ticks at 1, 2, 5 x 10^k over wide ranges; 1, 1.5, 2, 3, 5, 7 x 10^k
 * over narrow ones (labels in tonnes). */
static void
draw_log_y_axis (cairo_t *cr, const Axes *a)
{
  TextStyle tick = sw_sheet_style_w (6.8, FALSE, MUTED, PANGO_ALIGN_RIGHT, 34);
  static const double fine[] = { 1.0, 1.5, 2.0, 3.0, 5.0, 7.0 };
  static const double coarse[] = { 1.0, 2.0, 5.0 };
  gboolean wide = a->hi - a->lo > 1.2;
  const double *steps = wide ? coarse : fine;
  guint n_steps = wide ? G_N_ELEMENTS (coarse) : G_N_ELEMENTS (fine);
  int k0 = (int) floor (a->lo), k1 = (int) ceil (a->hi);
  double last_y = INFINITY;

  /* From the top down: on a short axis the highest tick is kept. */
  for (int k = k1; k >= k0; k--)
    for (guint s = n_steps; s-- > 0;)
      {
        double v = steps[s] * pow (10.0, k), t = log10 (v), yy;
        g_autofree char *label = NULL;

        if (t < a->lo - 1e-9 || t > a->hi + 1e-9)
          continue;
        /* With many decades only the powers of ten. */
        if (a->hi - a->lo > 3.0 && s != 0)
          continue;
        yy = ax_y (a, v);
        /* A short axis: a tick too close to the one below is left out,
         * so no two labels are printed over each other. */
        if (fabs (last_y - yy) < 6.5)
          continue;
        last_y = yy;
        sw_sheet_rule (cr, a->x, a->x + a->w, yy, GRID, 0.5);
        label = tick_label (v / 1000.0);
        sw_sheet_text_centered_v (cr, label, a->x - 37.0, yy, &tick);
      }
}

typedef enum { LEGEND_DOT, LEGEND_LINE, LEGEND_BAND, LEGEND_DASH, LEGEND_CROSS } LegendKind;

typedef struct {
  LegendKind  kind;
  guint32     color;
  const char *text;
} LegendItem;

/* The width of a legend row (as draw_legend lays it out). */
static double
legend_width (cairo_t *cr, const LegendItem *items, guint n)
{
  TextStyle st = sw_sheet_style (6.5, FALSE, MUTED);
  double total = 0.0;

  for (guint i = 0; i < n; i++)
    {
      PangoLayout *l = sw_sheet_layout (cr, items[i].text, &st);
      int lw, lh;
      pango_layout_get_size (l, &lw, &lh);
      g_object_unref (l);
      total += 12.0 + (double) lw / PANGO_SCALE + (i + 1 < n ? 9.0 : 0.0);
    }
  return total;
}

/* A centred row of markers and words, the markers drawn like the plot's. */
static void
draw_legend (cairo_t *cr, const LegendItem *items, guint n, double x, double y, double w)
{
  TextStyle st = sw_sheet_style (6.5, FALSE, MUTED);
  double widths[8], total = 0.0, xx, cy = y + 4.5;

  for (guint i = 0; i < n; i++)
    {
      PangoLayout *l = sw_sheet_layout (cr, items[i].text, &st);
      int lw, lh;
      pango_layout_get_size (l, &lw, &lh);
      g_object_unref (l);
      widths[i] = (double) lw / PANGO_SCALE;
      total += 12.0 + widths[i] + (i + 1 < n ? 9.0 : 0.0);
    }
  xx = x + MAX (0.0, (w - total) / 2.0);
  for (guint i = 0; i < n; i++)
    {
      double mx = xx + 4.0;
      switch (items[i].kind)
        {
        case LEGEND_DOT:
          cairo_arc (cr, mx, cy, 3.0, 0, 2 * G_PI);
          sw_sheet_set_color (cr, items[i].color, 1.0);
          cairo_fill (cr);
          break;
        case LEGEND_LINE:
        case LEGEND_DASH:
          {
            double dash[] = { 3.0, 2.0 };
            if (items[i].kind == LEGEND_DASH)
              cairo_set_dash (cr, dash, 2, 0);
            sw_sheet_set_color (cr, items[i].color, 1.0);
            cairo_set_line_width (cr, items[i].kind == LEGEND_DASH ? 1.0 : 1.6);
            cairo_move_to (cr, mx - 4.0, cy);
            cairo_line_to (cr, mx + 4.0, cy);
            cairo_stroke (cr);
            cairo_set_dash (cr, NULL, 0, 0);
          }
          break;
        case LEGEND_BAND:
          sw_sheet_set_color (cr, items[i].color, 0.16);
          cairo_rectangle (cr, mx - 4.0, cy - 3.0, 8.0, 6.0);
          cairo_fill (cr);
          break;
        case LEGEND_CROSS:
        default:
          sw_sheet_set_color (cr, items[i].color, 1.0);
          cairo_set_line_width (cr, 1.2);
          cairo_move_to (cr, mx - 3, cy - 3);
          cairo_line_to (cr, mx + 3, cy + 3);
          cairo_move_to (cr, mx + 3, cy - 3);
          cairo_line_to (cr, mx - 3, cy + 3);
          cairo_stroke (cr);
          break;
        }
      sw_sheet_text_centered_v (cr, items[i].text, xx + 11.0, cy, &st);
      xx += 12.0 + widths[i] + 9.0;
    }
}

void
sw_sheet_draw_stage_curve (cairo_t *cr, const SwStageCurve *curve, const SwMcBand *band,
                           const SwStageCurve *baseline, guint design_stages,
                           double design_point, double x, double y, double w, double h)
{
  Axes a = { x + 40.0, y + 4.0, w - 46.0, h - 36.0, 0, 0, TRUE, curve->n_points };
  double vmin = INFINITY, vmax = 0.0;
  gboolean any = FALSE, first = TRUE;
  TextStyle lab = sw_sheet_style (6.8, FALSE, MUTED);
  LegendItem items[6];
  guint n = 0, first_line;
  gboolean infeasible = FALSE, two_lines;
  g_autofree char *with = NULL;

  for (guint i = 0; i < curve->n_points; i++)
    infeasible = infeasible || !curve->points[i].feasible;
  items[n++] = (LegendItem) { LEGEND_DOT, SECOND, _("this design") };
  if (curve->booster_count > 0)
    {
      with = g_strdup_printf (g_dngettext (GETTEXT_PACKAGE, "with %u booster",
                                           "with %u boosters", curve->booster_count),
                              curve->booster_count);
      items[n++] = (LegendItem) { LEGEND_DASH, SECOND, with };
      items[n++] = (LegendItem) { LEGEND_LINE, ACCENT, _("serial, no boosters") };
    }
  else
    items[n++] = (LegendItem) { LEGEND_LINE, ACCENT, _("optimal split") };
  if (band != NULL)
    items[n++] = (LegendItem) { LEGEND_BAND, ACCENT, _("5\342\200\22395 % band") };
  if (baseline != NULL)
    items[n++] = (LegendItem) { LEGEND_DASH, BASELINE, _("baseline") };
  if (infeasible)
    items[n++] = (LegendItem) { LEGEND_CROSS, BAD, _("not feasible") };
  /* Two lines with boosters (the three lines of the plot, then the rest),
   * or when one line would run out of the panel (the plot's lines, then
   * the rest). */
  first_line = curve->booster_count > 0 ? 3 : 2;
  two_lines = n > first_line && (curve->booster_count > 0 || legend_width (cr, items, n) > w);

  for (guint i = 0; i < curve->n_points; i++)
    if (curve->points[i].feasible)
      {
        vmin = MIN (vmin, curve->points[i].liftoff_mass_kg);
        vmax = MAX (vmax, curve->points[i].liftoff_mass_kg);
        any = TRUE;
      }
  if (!any)
    {
      sw_sheet_note_in_box (cr, _("No stage count reaches the required delta-v."), x, y, w, h);
      return;
    }
  if (isfinite (design_point) && design_point > 0.0)
    {
      vmin = MIN (vmin, design_point);
      vmax = MAX (vmax, design_point);
    }
  for (guint i = 0; curve->booster_count > 0 && i < curve->n_points; i++)
    if (curve->booster_points[i].feasible)
      {
        vmin = MIN (vmin, curve->booster_points[i].liftoff_mass_kg);
        vmax = MAX (vmax, curve->booster_points[i].liftoff_mass_kg);
      }
  for (guint i = 0; band != NULL && i < band->n_points; i++)
    {
      if (isfinite (band->p05[i]))
        vmin = MIN (vmin, band->p05[i]);
      if (isfinite (band->p95[i]))
        vmax = MAX (vmax, band->p95[i]);
    }
  for (guint i = 0; baseline != NULL && i < baseline->n_points; i++)
    if (baseline->points[i].feasible)
      {
        vmin = MIN (vmin, baseline->points[i].liftoff_mass_kg);
        vmax = MAX (vmax, baseline->points[i].liftoff_mass_kg);
      }
  /* At least half a decade, padded, so a flat curve still reads. */
  a.lo = log10 (vmin);
  a.hi = log10 (vmax);
  if (a.hi - a.lo < 0.5)
    {
      double mid = 0.5 * (a.lo + a.hi);
      a.lo = mid - 0.25;
      a.hi = mid + 0.25;
    }
  {
    double pad = 0.06 * (a.hi - a.lo);
    a.lo -= pad;
    a.hi += pad;
  }
  /* Room at the top for the axis title and the infeasible markers. */
  a.y += 14.0;
  a.h -= 14.0;
  if (two_lines)
    a.h -= 10.0;

  draw_log_y_axis (cr, &a);
  {
    TextStyle yl = sw_sheet_style (6.8, FALSE, MUTED);
    sw_sheet_text_at (cr, _("liftoff mass, t (log)"), x, y - 2.0, &yl);
  }

  /* The Monte Carlo band: 5th to 95th percentile. */
  if (band != NULL)
    {
      gboolean open = FALSE;
      guint start = 0;

      for (guint i = 0; i <= band->n_points; i++)
        {
          gboolean ok = i < band->n_points && isfinite (band->p05[i]) && isfinite (band->p95[i]);
          if (ok && !open)
            {
              open = TRUE;
              start = i;
            }
          if (!ok && open)
            {
              cairo_move_to (cr, ax_x (&a, start + 1), ax_y (&a, band->p95[start]));
              for (guint j = start + 1; j < i; j++)
                cairo_line_to (cr, ax_x (&a, j + 1), ax_y (&a, band->p95[j]));
              for (int j = (int) i - 1; j >= (int) start; j--)
                cairo_line_to (cr, ax_x (&a, j + 1), ax_y (&a, band->p05[j]));
              cairo_close_path (cr);
              sw_sheet_set_color (cr, ACCENT, 0.16);
              cairo_fill (cr);
              if (i - start == 1)
                {
                  sw_sheet_set_color (cr, ACCENT, 0.35);
                  cairo_set_line_width (cr, 3.0);
                  cairo_move_to (cr, ax_x (&a, start + 1), ax_y (&a, band->p95[start]));
                  cairo_line_to (cr, ax_x (&a, start + 1), ax_y (&a, band->p05[start]));
                  cairo_stroke (cr);
                }
              open = FALSE;
            }
        }
    }

  if (baseline != NULL)
    {
      double dash[] = { 3.0, 2.0 };
      first = TRUE;
      cairo_set_dash (cr, dash, 2, 0);
      sw_sheet_set_color (cr, BASELINE, 1.0);
      cairo_set_line_width (cr, 1.0);
      for (guint i = 0; i < MIN (baseline->n_points, a.n); i++)
        {
          if (!baseline->points[i].feasible)
            {
              first = TRUE;
              continue;
            }
          if (first)
            cairo_move_to (cr, ax_x (&a, i + 1), ax_y (&a, baseline->points[i].liftoff_mass_kg));
          else
            cairo_line_to (cr, ax_x (&a, i + 1), ax_y (&a, baseline->points[i].liftoff_mass_kg));
          first = FALSE;
        }
      cairo_stroke (cr);
      cairo_set_dash (cr, NULL, 0, 0);
    }

  first = TRUE;
  sw_sheet_set_color (cr, ACCENT, 1.0);
  cairo_set_line_width (cr, 1.6);
  for (guint i = 0; i < curve->n_points; i++)
    {
      const SwStageCountPoint *p = &curve->points[i];
      if (!p->feasible)
        {
          first = TRUE;
          continue;
        }
      if (first)
        cairo_move_to (cr, ax_x (&a, p->stages), ax_y (&a, p->liftoff_mass_kg));
      else
        cairo_line_to (cr, ax_x (&a, p->stages), ax_y (&a, p->liftoff_mass_kg));
      first = FALSE;
    }
  cairo_stroke (cr);

  for (guint i = 0; i < curve->n_points; i++)
    {
      const SwStageCountPoint *p = &curve->points[i];
      double px = ax_x (&a, p->stages);

      if (!p->feasible)
        {
          double py = a.y - 4.0;
          sw_sheet_set_color (cr, BAD, 1.0);
          cairo_set_line_width (cr, 1.2);
          cairo_move_to (cr, px - 3, py - 3);
          cairo_line_to (cr, px + 3, py + 3);
          cairo_move_to (cr, px + 3, py - 3);
          cairo_line_to (cr, px - 3, py + 3);
          cairo_stroke (cr);
          continue;
        }
      cairo_arc (cr, px, ax_y (&a, p->liftoff_mass_kg), 2.2, 0, 2 * G_PI);
      sw_sheet_set_color (cr, ACCENT, 1.0);
      cairo_fill (cr);
    }
  /* With boosters: the same boosters beside 1..N stages, dashed in the
   * colour of this design's point, which lies on it. */
  if (curve->booster_count > 0)
    {
      double dash[] = { 4.0, 2.0 };
      first = TRUE;
      cairo_set_dash (cr, dash, 2, 0);
      sw_sheet_set_color (cr, SECOND, 1.0);
      cairo_set_line_width (cr, 1.4);
      for (guint i = 0; i < MIN (curve->n_points, a.n); i++)
        {
          const SwStageCountPoint *p = &curve->booster_points[i];
          if (!p->feasible)
            {
              first = TRUE;
              continue;
            }
          if (first)
            cairo_move_to (cr, ax_x (&a, p->stages), ax_y (&a, p->liftoff_mass_kg));
          else
            cairo_line_to (cr, ax_x (&a, p->stages), ax_y (&a, p->liftoff_mass_kg));
          first = FALSE;
        }
      cairo_stroke (cr);
      cairo_set_dash (cr, NULL, 0, 0);
      for (guint i = 0; i < MIN (curve->n_points, a.n); i++)
        if (curve->booster_points[i].feasible)
          {
            cairo_arc (cr, ax_x (&a, curve->booster_points[i].stages),
                       ax_y (&a, curve->booster_points[i].liftoff_mass_kg), 1.8, 0, 2 * G_PI);
            cairo_fill (cr);
          }
    }
  /* This design where it is: with a split by hand or an equal split it lies
   * above the optimal curve. */
  if (isfinite (design_point) && design_point > 0.0 && design_stages >= 1
      && design_stages <= a.n)
    {
      cairo_arc (cr, ax_x (&a, design_stages), ax_y (&a, design_point), 3.6, 0, 2 * G_PI);
      sw_sheet_set_color (cr, SECOND, 1.0);
      cairo_fill_preserve (cr);
      sw_sheet_set_color (cr, INK, 1.0);
      cairo_set_line_width (cr, 0.6);
      cairo_stroke (cr);
    }

  draw_x_axis (cr, &a, design_stages, _("stages"));

  /* Legend: one line under the axis, where no curve can run; each marker is
   * drawn in the colour it has in the plot. */
  {
    if (two_lines)
      {
        draw_legend (cr, items, first_line, x, a.y + a.h + 21.0, w);
        draw_legend (cr, items + first_line, n - first_line, x, a.y + a.h + 31.0, w);
      }
    else
      draw_legend (cr, items, n, x, a.y + a.h + 21.0, w);
  }
  (void) lab;
}

void
sw_sheet_draw_reliability_curve (cairo_t *cr, const SwReliabilityCurve *curve,
                                 guint design_stages, double x, double y, double w, double h)
{
  Axes a = { x + 40.0, y + 4.0, w - 46.0, h - 36.0, 0, 1.0, FALSE, curve->n_points };
  double vmin = 1.0;
  TextStyle tick = sw_sheet_style_w (6.8, FALSE, MUTED, PANGO_ALIGN_RIGHT, 34);
  double step;

  for (guint i = 0; i < curve->n_points; i++)
    vmin = MIN (vmin, curve->mission[i]);
  /* A floor in round steps so small differences stay visible. */
  step = 1.0 - vmin > 0.2 ? 0.1 : 1.0 - vmin > 0.04 ? 0.02 : 0.005;
  a.lo = MAX (0.0, floor ((vmin - step * 0.5) / step) * step);
  a.hi = 1.0;
  a.y += 9.0;
  a.h -= 9.0;

  {
    TextStyle yl = sw_sheet_style (6.8, FALSE, MUTED);
    sw_sheet_text_at (cr, _("mission success probability"), x, y - 2.0, &yl);
  }
  for (double v = a.lo; v <= a.hi + 1e-9; v += step)
    {
      g_autofree char *label = sw_format_percent (v, step < 0.01 ? 1 : 0);
      double yy = ax_y (&a, v);
      sw_sheet_rule (cr, a.x, a.x + a.w, yy, GRID, 0.5);
      sw_sheet_text_centered_v (cr, label, a.x - 37.0, yy, &tick);
    }

  sw_sheet_set_color (cr, SECOND, 1.0);
  cairo_set_line_width (cr, 1.6);
  for (guint i = 0; i < curve->n_points; i++)
    {
      if (i == 0)
        cairo_move_to (cr, ax_x (&a, i + 1), ax_y (&a, curve->mission[i]));
      else
        cairo_line_to (cr, ax_x (&a, i + 1), ax_y (&a, curve->mission[i]));
    }
  cairo_stroke (cr);
  for (guint i = 0; i < curve->n_points; i++)
    {
      cairo_arc (cr, ax_x (&a, i + 1), ax_y (&a, curve->mission[i]),
                 i + 1 == design_stages ? 3.6 : 2.2, 0, 2 * G_PI);
      sw_sheet_set_color (cr, i + 1 == design_stages ? ACCENT : SECOND, 1.0);
      cairo_fill (cr);
    }
  if (design_stages >= 1 && design_stages <= curve->n_points)
    {
      g_autofree char *v = sw_format_probability (curve->mission[design_stages - 1]);
      TextStyle st = sw_sheet_style (7.0, TRUE, INK);
      double px = ax_x (&a, design_stages) + 6.0;
      double py = ax_y (&a, curve->mission[design_stages - 1]) - 9.0;
      if (px + 40.0 > a.x + a.w)
        px -= 52.0;
      sw_sheet_text_centered_v (cr, v, px, MAX (py, a.y + 4.0), &st);
    }
  draw_x_axis (cr, &a, design_stages, _("stages"));
  {
    LegendItem items[2] = {
      { LEGEND_DOT, ACCENT, _("this design") },
      { LEGEND_LINE, SECOND, _("more stages repeat the top one") },
    };
    draw_legend (cr, items, 2, x, a.y + a.h + 21.0, w);
  }
}

void
sw_sheet_draw_histogram (cairo_t *cr, const SwMcSummary *s, double reference,
                         const char *axis_label, double x, double y, double w, double h)
{
  double px = x + 4.0, py = y + 12.0, pw = w - 8.0, ph = h - 34.0;
  guint max_count = 1;
  double span;
  TextStyle tick = sw_sheet_style_w (6.8, FALSE, MUTED, PANGO_ALIGN_CENTER, 60);

  if (s->n == 0 || !isfinite (s->bin_lo))
    {
      sw_sheet_note_in_box (cr, _("No feasible sample."), x, y, w, h);
      return;
    }
  for (guint b = 0; b < SW_MC_BINS; b++)
    max_count = MAX (max_count, s->bins[b]);
  span = s->bin_hi - s->bin_lo;

  sw_sheet_set_color (cr, ACCENT, 0.55);
  for (guint b = 0; b < SW_MC_BINS; b++)
    {
      double bh = ph * s->bins[b] / max_count;
      cairo_rectangle (cr, px + pw * b / SW_MC_BINS + 0.3, py + ph - bh, pw / SW_MC_BINS - 0.6,
                       bh);
    }
  cairo_fill (cr);
  sw_sheet_rule (cr, px, px + pw, py + ph, MUTED, 0.6);

  /* Percentile markers with their labels on top, pushed apart. */
  {
    const double values[] = { s->p05, s->p50, s->p95 };
    const char *names[] = { "5 %", "50 %", "95 %" };
    double lx[3];

    for (guint i = 0; i < 3; i++)
      lx[i] = px + pw * (values[i] - s->bin_lo) / span;
    if (lx[1] - lx[0] < 22.0)
      lx[0] = lx[1] - 22.0;
    if (lx[2] - lx[1] < 22.0)
      lx[2] = lx[1] + 22.0;
    for (guint i = 0; i < 3; i++)
      {
        double vx = px + pw * (values[i] - s->bin_lo) / span;
        TextStyle st = sw_sheet_style_w (6.5, i == 1, INK, PANGO_ALIGN_CENTER, 30);
        sw_sheet_set_color (cr, INK, 1.0);
        cairo_set_line_width (cr, i == 1 ? 1.2 : 0.8);
        cairo_move_to (cr, vx, py - 1.0);
        cairo_line_to (cr, vx, py + ph);
        cairo_stroke (cr);
        sw_sheet_text_at (cr, names[i], lx[i] - 15.0, py - 10.5, &st);
      }
  }
  if (isfinite (reference) && reference >= s->bin_lo && reference <= s->bin_hi)
    {
      double vx = px + pw * (reference - s->bin_lo) / span;
      double dash[] = { 2.0, 2.0 };
      cairo_set_dash (cr, dash, 2, 0);
      sw_sheet_set_color (cr, SECOND, 1.0);
      cairo_set_line_width (cr, 1.0);
      cairo_move_to (cr, vx, py + 4.0);
      cairo_line_to (cr, vx, py + ph);
      cairo_stroke (cr);
      cairo_set_dash (cr, NULL, 0, 0);
    }

  /* Axis: the two ends, in the one unit the axis title names. */
  {
    gboolean tonnes = fabs (s->bin_hi) >= 10000.0;
    g_autofree char *lo = tonnes ? sw_format_number (s->bin_lo / 1000.0, 1)
                                 : sw_format_number (s->bin_lo, 0);
    g_autofree char *hi = tonnes ? sw_format_number (s->bin_hi / 1000.0, 1)
                                 : sw_format_number (s->bin_hi, 0);
    TextStyle l = sw_sheet_style_w (6.8, FALSE, MUTED, PANGO_ALIGN_LEFT, 80);
    TextStyle r = sw_sheet_style_w (6.8, FALSE, MUTED, PANGO_ALIGN_RIGHT, 80);
    TextStyle c;
    double ends = 0.0, side;

    /* The title takes the width the two end numbers leave, centred. */
    for (guint k = 0; k < 2; k++)
      {
        PangoLayout *layout = sw_sheet_layout (cr, k == 0 ? lo : hi, &l);
        int lw, lh;
        pango_layout_get_pixel_size (layout, &lw, &lh);
        ends = MAX (ends, lw);
        g_object_unref (layout);
      }
    side = MIN (ends + 6.0, 60.0);
    c = sw_sheet_style_w (6.8, FALSE, MUTED, PANGO_ALIGN_CENTER, pw - 2.0 * side);
    sw_sheet_text_at (cr, lo, px, py + ph + 2.0, &l);
    sw_sheet_text_at (cr, hi, px + pw - 80, py + ph + 2.0, &r);
    /* A title of two lines ("\n" between them: what a negative value
     * means) is drawn line by line, each whole words only. */
    {
      g_auto (GStrv) lines = g_strsplit (axis_label, "\n", 2);
      double ly = py + ph + 2.0;
      for (guint k = 0; lines[k] != NULL; k++)
        ly += sw_sheet_text_at (cr, lines[k], px + side, ly, &c);
    }
  }
  (void) tick;
}

void
sw_sheet_draw_tornado (cairo_t *cr, const SwDesign *design, const SwSensitivityTable *t,
                       guint max_rows, double x, double y, double w, double h)
{
  guint rows = MIN (max_rows, t->n_items);
  double label_w = MIN (130.0, w * 0.38), value_w = 42.0;
  double bx = x + label_w + value_w, bw = w - label_w - 2 * value_w, cx = bx + bw / 2;
  double row_h, scale = 0.0;
  TextStyle lab = sw_sheet_style_w (7.2, TRUE, INK, PANGO_ALIGN_LEFT, label_w - 4);
  TextStyle lv = sw_sheet_style_w (6.8, FALSE, MUTED, PANGO_ALIGN_RIGHT, value_w - 3);
  TextStyle rv = sw_sheet_style_w (6.8, FALSE, MUTED, PANGO_ALIGN_LEFT, value_w - 3);

  if (!t->feasible || rows == 0)
    {
      sw_sheet_note_in_box (cr, _("No sensitivities: the design is not feasible."), x, y, w, h);
      return;
    }
  for (guint r = 0; r < rows; r++)
    {
      const SwSensitivity *it = &t->items[t->ranked[r]];
      if (it->minus_feasible)
        scale = MAX (scale, fabs (it->minus_kg));
      if (it->plus_feasible)
        scale = MAX (scale, fabs (it->plus_kg));
    }
  if (!(scale > 0.0))
    scale = 1.0;
  row_h = MIN (18.0, (h - 14.0) / rows);

  sw_sheet_set_color (cr, RULE, 1.0);
  cairo_set_line_width (cr, 0.6);
  cairo_move_to (cr, cx, y);
  cairo_line_to (cr, cx, y + rows * row_h);
  cairo_stroke (cr);

  for (guint r = 0; r < rows; r++)
    {
      const SwSensitivity *it = &t->items[t->ranked[r]];
      double cy = y + (r + 0.5) * row_h, bar_h = row_h * 0.62;
      const double changes[2] = { it->minus_kg, it->plus_kg };
      const gboolean ok[2] = { it->minus_feasible, it->plus_feasible };

      /* Two lines: what, then which stage. */
      {
        gboolean booster = it->param == SW_SENS_BOOSTER_ISP
                           || it->param == SW_SENS_BOOSTER_STRUCTURAL_COEFFICIENT;
        const char *what = it->param == SW_SENS_PAYLOAD ? _("Payload")
                           : it->param == SW_SENS_DELTA_V ? _("Required \316\224v")
                           : it->param == SW_SENS_ISP || it->param == SW_SENS_BOOSTER_ISP
                             ? _("Isp")
                           : _("Structural coefficient");
        if ((it->stage >= 0 || booster) && row_h >= 14.0)
          {
            g_autofree char *which = booster
                                       ? g_strdup_printf (_("boosters \302\267 %s"),
                                                          design->boosters.name)
                                       : g_strdup_printf (_("stage %d \302\267 %s"),
                                                          it->stage + 1,
                                                          design->stages[it->stage].name);
            TextStyle ws = sw_sheet_style_w (6.3, FALSE, MUTED, PANGO_ALIGN_LEFT, label_w - 4);

            /* A name too long for the column: the stage number alone (the
             * stage table names the stages). */
            if (!sw_sheet_fits (cr, which, &ws))
              {
                g_free (which);
                which = booster ? g_strdup (_("boosters"))
                                : g_strdup_printf (_("stage %u"), (guint) it->stage + 1);
              }
            sw_sheet_text_centered_v (cr, what, x, cy - 3.6, &lab);
            sw_sheet_text_centered_v (cr, which, x, cy + 4.2, &ws);
          }
        else if (it->stage >= 0 || booster)
          {
            g_autofree char *label = sw_sensitivity_dup_label (design, it);

            /* One line: with the stage's name when it fits whole, else
             * without it (the stage table names the stages). */
            if (!sw_sheet_fits (cr, label, &lab))
              {
                g_free (label);
                label = sw_sensitivity_dup_label (NULL, it);
              }
            sw_sheet_text_centered_v (cr, label, x, cy, &lab);
          }
        else
          sw_sheet_text_centered_v (cr, what, x, cy, &lab);
      }
      {
        double len[2];
        gboolean same_side;

        for (guint side = 0; side < 2; side++)
          len[side] = ok[side] ? bw / 2 * changes[side] / scale
                               : (side == 0 ? -1.0 : 1.0) * bw / 2;
        /* Both bars on one side of the centre: each takes half the row, so
         * neither bars nor values are drawn over each other. */
        same_side = (len[0] < 0) == (len[1] < 0);
        for (guint side = 0; side < 2; side++)
          {
            double by = same_side ? cy - bar_h / 2 + side * bar_h / 2 : cy - bar_h / 2;
            double bh = same_side ? bar_h / 2 : bar_h;
            double vy = same_side ? by + bh / 2 + (side == 0 ? -1.2 : 1.2) : cy;
            g_autofree char *v = NULL;

            sw_sheet_set_color (cr, side == 0 ? ACCENT : SECOND, ok[side] ? 0.85 : 0.25);
            cairo_rectangle (cr, MIN (cx, cx + len[side]), by, fabs (len[side]), bh);
            cairo_fill (cr);
            v = ok[side] ? sw_format_mass_delta (changes[side]) : g_strdup (_("not feasible"));
            /* The value goes at the end of the bar, outside the plot. */
            if (len[side] < 0)
              sw_sheet_text_centered_v (cr, v, bx - value_w, vy, &lv);
            else
              sw_sheet_text_centered_v (cr, v, bx + bw + 3.0, vy, &rv);
          }
      }
    }
  {
    int dec = fabs (t->step * 100.0 - round (t->step * 100.0)) > 1e-9 ? 1 : 0;
    g_autofree char *minus = sw_format_percent (-t->step, dec);
    g_autofree char *plus = sw_format_percent (t->step, dec);
    /* Translators: two steps such as "−5 %" and "5 %" */
    g_autofree char *text = t->capability
                              ? g_strdup_printf (_("payload capability change for each input "
                                                   "at %s (blue) and +%s (amber)"), minus, plus)
                              : g_strdup_printf (_("liftoff mass change for each input at %s "
                                                   "(blue) and +%s (amber)"), minus, plus);
    TextStyle st = sw_sheet_style_w (6.5, FALSE, MUTED, PANGO_ALIGN_CENTER, w);
    sw_sheet_text_at (cr, text, x, y + rows * row_h + 2.0, &st);
  }
}
