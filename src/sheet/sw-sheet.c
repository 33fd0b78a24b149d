/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-sheet"

#include "config.h"

#include "sw-sheet.h"

#include "sw-stack-drawing.h"

#include <cairo-pdf.h>
#include <cairo-svg.h>
#include <errno.h>
#include <glib/gi18n-lib.h>
#include <glib/gstdio.h>
#include <math.h>
#include <pango/pangocairo.h>
#include <string.h>

const char *const sw_sheet_caution =
  "Conceptual sizing only: not for flight hardware or safety decisions. Defer to licensed "
  "engineering practice, range safety and local regulations.";

/* Colours of the sheet (0xRRGGBB). */
enum {
  INK = 0x1b2530,
  MUTED = 0x5a6672,
  RULE = 0xc5cdd5,
  GRID = 0xe3e8ed,
  ACCENT = 0x1d5a87,
  ACCENT_LIGHT = 0xd6e4f0,
  STRUCTURE = 0x5d7f99,
  PROPELLANT = 0xb9d0e3,
  PAYLOAD = 0xd79b2b,
  SECOND = 0xc0701a,
  BAD = 0xa8322a,
  GOOD = 0x2e7d4f,
  BASELINE = 0x8a96a3,
  PANEL = 0xf4f6f8,
};

#define FONT_FAMILY "DejaVu Sans, Sans"

static void
set_color (cairo_t *cr, guint32 hex, double alpha)
{
  cairo_set_source_rgba (cr, ((hex >> 16) & 0xff) / 255.0, ((hex >> 8) & 0xff) / 255.0,
                         (hex & 0xff) / 255.0, alpha);
}

/* ---- text -------------------------------------------------------------- */

typedef struct {
  double   size;          /* font size in user units (points) */
  gboolean bold;
  guint32  color;
  PangoAlignment align;
  double   width;         /* wrap or align within; <= 0: no width */
  gboolean ellipsize;     /* one line, ellipsized at width */
} TextStyle;

static PangoLayout *
make_layout (cairo_t *cr, const char *text, const TextStyle *st)
{
  PangoLayout *layout = pango_cairo_create_layout (cr);
  PangoFontDescription *fd = pango_font_description_from_string (FONT_FAMILY);
  cairo_font_options_t *fo = cairo_font_options_create ();

  /* The same metrics whatever the surface, so PDF, SVG and PNG lay out alike. */
  cairo_font_options_set_hint_metrics (fo, CAIRO_HINT_METRICS_OFF);
  cairo_font_options_set_hint_style (fo, CAIRO_HINT_STYLE_NONE);
  pango_cairo_context_set_font_options (pango_layout_get_context (layout), fo);
  pango_layout_context_changed (layout);
  cairo_font_options_destroy (fo);

  pango_font_description_set_absolute_size (fd, st->size * PANGO_SCALE);
  pango_font_description_set_weight (fd, st->bold ? PANGO_WEIGHT_BOLD : PANGO_WEIGHT_NORMAL);
  pango_layout_set_font_description (layout, fd);
  pango_font_description_free (fd);
  if (st->width > 0)
    {
      pango_layout_set_width (layout, (int) (st->width * PANGO_SCALE));
      pango_layout_set_alignment (layout, st->align);
      if (st->ellipsize)
        pango_layout_set_ellipsize (layout, PANGO_ELLIPSIZE_END);
      else
        pango_layout_set_wrap (layout, PANGO_WRAP_WORD_CHAR);
    }
  pango_layout_set_text (layout, text, -1);
  return layout;
}

/* Draws @text with its top at @y; returns its height. */
static double
text_at (cairo_t *cr, const char *text, double x, double y, const TextStyle *st)
{
  PangoLayout *layout = make_layout (cr, text, st);
  int w, h;

  pango_layout_get_size (layout, &w, &h);
  set_color (cr, st->color, 1.0);
  cairo_move_to (cr, x, y);
  pango_cairo_show_layout (cr, layout);
  g_object_unref (layout);
  return (double) h / PANGO_SCALE;
}

/* Text whose vertical centre is at @cy. */
static void
text_centered_v (cairo_t *cr, const char *text, double x, double cy, const TextStyle *st)
{
  PangoLayout *layout = make_layout (cr, text, st);
  int w, h;

  pango_layout_get_size (layout, &w, &h);
  set_color (cr, st->color, 1.0);
  cairo_move_to (cr, x, cy - (double) h / PANGO_SCALE / 2.0);
  pango_cairo_show_layout (cr, layout);
  g_object_unref (layout);
}

static TextStyle
style (double size, gboolean bold, guint32 color)
{
  TextStyle st = { size, bold, color, PANGO_ALIGN_LEFT, 0, FALSE };
  return st;
}

static TextStyle
style_w (double size, gboolean bold, guint32 color, PangoAlignment align, double width)
{
  TextStyle st = { size, bold, color, align, width, TRUE };
  return st;
}

/* ---- numbers ----------------------------------------------------------- */

/* "1,234,567.8"; "-" when not finite (no NaN reaches the sheet). */
static char *
fmt_grouped (double v, int decimals)
{
  g_autofree char *raw = NULL;
  GString *s;
  const char *p, *dot;
  int int_len;

  if (!isfinite (v))
    return g_strdup ("-");
  raw = g_strdup_printf ("%.*f", decimals, fabs (v));
  s = g_string_new (v < 0 && strtod (raw, NULL) != 0.0 ? "\342\210\222" : "");
  dot = strchr (raw, '.');
  int_len = dot != NULL ? (int) (dot - raw) : (int) strlen (raw);
  for (p = raw; *p != '\0'; p++)
    {
      int pos = (int) (p - raw);
      if (pos < int_len && pos > 0 && (int_len - pos) % 3 == 0)
        g_string_append_c (s, ',');
      g_string_append_c (s, *p);
    }
  return g_string_free (s, FALSE);
}

/* A mass for reading: tonnes from 10 t up, kilograms below. */
static char *
fmt_mass (double kg)
{
  g_autofree char *n = NULL;

  if (!isfinite (kg))
    return g_strdup ("-");
  if (fabs (kg) >= 10000.0)
    {
      n = fmt_grouped (kg / 1000.0, 1);
      return g_strdup_printf ("%s t", n);
    }
  n = fmt_grouped (kg, 0);
  return g_strdup_printf ("%s kg", n);
}

static char *
fmt_signed (double v, int decimals, const char *unit)
{
  g_autofree char *n = NULL;

  if (!isfinite (v))
    return g_strdup ("-");
  n = fmt_grouped (v, decimals);
  return g_strdup_printf ("%s%s%s%s", v > 0 ? "+" : "", n, unit[0] ? " " : "", unit);
}

static char *
fmt_percent (double fraction, int decimals)
{
  if (!isfinite (fraction))
    return g_strdup ("-");
  return g_strdup_printf ("%.*f %%", decimals, 100.0 * fraction);
}

/* ---- panels ------------------------------------------------------------ */

static void
rule (cairo_t *cr, double x0, double x1, double y, guint32 color, double width)
{
  set_color (cr, color, 1.0);
  cairo_set_line_width (cr, width);
  cairo_move_to (cr, x0, y);
  cairo_line_to (cr, x1, y);
  cairo_stroke (cr);
}

/* A panel heading with a rule under it; returns the height used. */
static double
heading (cairo_t *cr, const char *title, double x, double y, double w)
{
  TextStyle st = style (9.5, TRUE, ACCENT);
  double h = text_at (cr, title, x, y, &st);

  rule (cr, x, x + w, y + h + 2.0, RULE, 0.6);
  return h + 6.0;
}

static void
note_in_box (cairo_t *cr, const char *text, double x, double y, double w, double h)
{
  TextStyle st = { 8.0, FALSE, MUTED, PANGO_ALIGN_CENTER, w - 16, FALSE };
  PangoLayout *layout;
  int lw, lh;

  set_color (cr, PANEL, 1.0);
  cairo_rectangle (cr, x, y, w, h);
  cairo_fill (cr);
  layout = make_layout (cr, text, &st);
  pango_layout_get_size (layout, &lw, &lh);
  set_color (cr, MUTED, 1.0);
  cairo_move_to (cr, x + 8, y + (h - (double) lh / PANGO_SCALE) / 2.0);
  pango_cairo_show_layout (cr, layout);
  g_object_unref (layout);
}

/* ---- the stack --------------------------------------------------------- */

/* The same shapes as the stack view on screen: sw-stack-drawing.c. */
void
sw_sheet_draw_stack (cairo_t *cr, const SwDesign *design, const SwSizing *sizing,
                     const SwDesign *baseline_design, const SwSizing *baseline, double x,
                     double y, double w, double h)
{
  sw_stack_draw_panel (cr, design, sizing, baseline, x, y, w, h);
}

/* ---- charts ------------------------------------------------------------ */

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
  TextStyle tick = style_w (7.0, FALSE, MUTED, PANGO_ALIGN_CENTER, 20);
  TextStyle lab = style_w (7.0, FALSE, MUTED, PANGO_ALIGN_CENTER, a->w);

  rule (cr, a->x, a->x + a->w, a->y + a->h, MUTED, 0.6);
  for (guint n = 1; n <= a->n; n++)
    {
      char buf[8];
      g_snprintf (buf, sizeof buf, "%u", n);
      tick.bold = n == highlight;
      tick.color = n == highlight ? INK : MUTED;
      text_at (cr, buf, ax_x (a, n) - 10, a->y + a->h + 2.0, &tick);
    }
  text_at (cr, label, a->x, a->y + a->h + 11.0, &lab);
}

/* A tick in tonnes: "0.5", "7", "1,500", or "10⁷" from 100,000 up. */
static char *
tick_label (double t)
{
  static const char *const sup[] = { "\342\201\260", "\302\271", "\302\262", "\302\263",
                                     "\342\201\264", "\342\201\265", "\342\201\266",
                                     "\342\201\267", "\342\201\270", "\342\201\271" };
  int k = (int) lround (log10 (t));

  if (t >= 99999.0 && fabs (t - pow (10.0, k)) < 1e-6 * t && k < 100)
    return k < 10 ? g_strconcat ("10", sup[k], NULL)
                  : g_strconcat ("10", sup[k / 10], sup[k % 10], NULL);
  if (t >= 99999.0)
    return g_strdup_printf ("%.0e", t);
  return fmt_grouped (t, fabs (t - round (t)) < 1e-9 ? 0 : (t < 1.0 ? 2 : 1));
}

/* Log ticks at 1, 2, 5 x 10^k over wide ranges; 1, 1.5, 2, 3, 5, 7 x 10^k
 * over narrow ones (labels in tonnes). */
static void
draw_log_y_axis (cairo_t *cr, const Axes *a)
{
  TextStyle tick = style_w (6.8, FALSE, MUTED, PANGO_ALIGN_RIGHT, 34);
  static const double fine[] = { 1.0, 1.5, 2.0, 3.0, 5.0, 7.0 };
  static const double coarse[] = { 1.0, 2.0, 5.0 };
  gboolean wide = a->hi - a->lo > 1.2;
  const double *steps = wide ? coarse : fine;
  guint n_steps = wide ? G_N_ELEMENTS (coarse) : G_N_ELEMENTS (fine);
  int k0 = (int) floor (a->lo), k1 = (int) ceil (a->hi);

  for (int k = k0; k <= k1; k++)
    for (guint s = 0; s < n_steps; s++)
      {
        double v = steps[s] * pow (10.0, k), t = log10 (v), yy;
        g_autofree char *label = NULL;

        if (t < a->lo - 1e-9 || t > a->hi + 1e-9)
          continue;
        /* With many decades only the powers of ten. */
        if (a->hi - a->lo > 3.0 && s != 0)
          continue;
        yy = ax_y (a, v);
        rule (cr, a->x, a->x + a->w, yy, GRID, 0.5);
        label = tick_label (v / 1000.0);
        text_centered_v (cr, label, a->x - 37.0, yy, &tick);
      }
}

void
sw_sheet_draw_stage_curve (cairo_t *cr, const SwStageCurve *curve, const SwMcBand *band,
                           const SwStageCurve *baseline, guint design_stages, double x, double y,
                           double w, double h)
{
  Axes a = { x + 40.0, y + 4.0, w - 46.0, h - 36.0, 0, 0, TRUE, curve->n_points };
  double vmin = INFINITY, vmax = 0.0;
  gboolean any = FALSE, first = TRUE;
  TextStyle lab = style (6.8, FALSE, MUTED);

  for (guint i = 0; i < curve->n_points; i++)
    if (curve->points[i].feasible)
      {
        vmin = MIN (vmin, curve->points[i].liftoff_mass_kg);
        vmax = MAX (vmax, curve->points[i].liftoff_mass_kg);
        any = TRUE;
      }
  if (!any)
    {
      note_in_box (cr, _("No stage count reaches the required delta-v."), x, y, w, h);
      return;
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

  draw_log_y_axis (cr, &a);
  {
    TextStyle yl = style (6.8, FALSE, MUTED);
    text_at (cr, _("liftoff mass, t (log)"), x, y - 2.0, &yl);
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
              set_color (cr, ACCENT, 0.16);
              cairo_fill (cr);
              if (i - start == 1)
                {
                  set_color (cr, ACCENT, 0.35);
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
      set_color (cr, BASELINE, 1.0);
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
  set_color (cr, ACCENT, 1.0);
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
          set_color (cr, BAD, 1.0);
          cairo_set_line_width (cr, 1.2);
          cairo_move_to (cr, px - 3, py - 3);
          cairo_line_to (cr, px + 3, py + 3);
          cairo_move_to (cr, px + 3, py - 3);
          cairo_line_to (cr, px - 3, py + 3);
          cairo_stroke (cr);
          continue;
        }
      cairo_arc (cr, px, ax_y (&a, p->liftoff_mass_kg), p->stages == design_stages ? 3.6 : 2.2,
                 0, 2 * G_PI);
      set_color (cr, p->stages == design_stages ? SECOND : ACCENT, 1.0);
      cairo_fill (cr);
    }

  draw_x_axis (cr, &a, design_stages, _("stages"));

  /* Legend: one line under the axis, where no curve can run. */
  {
    GString *legend = g_string_new (NULL);
    gboolean infeasible = FALSE;

    for (guint i = 0; i < curve->n_points; i++)
      infeasible = infeasible || !curve->points[i].feasible;
    g_string_append (legend, _("\342\227\217 this design"));
    if (band != NULL)
      g_string_append (legend, _("   \342\226\210 5\342\200\22395 % band"));
    if (baseline != NULL)
      g_string_append (legend, _("   \342\224\204 baseline"));
    if (infeasible)
      g_string_append (legend, _("   \303\227 beyond the \316\224v limit"));
    {
      TextStyle st = style_w (6.5, FALSE, MUTED, PANGO_ALIGN_CENTER, w);
      text_at (cr, legend->str, x, a.y + a.h + 21.0, &st);
    }
    g_string_free (legend, TRUE);
  }
  (void) lab;
}

void
sw_sheet_draw_reliability_curve (cairo_t *cr, const SwReliabilityCurve *curve,
                                 guint design_stages, double x, double y, double w, double h)
{
  Axes a = { x + 40.0, y + 4.0, w - 46.0, h - 36.0, 0, 1.0, FALSE, curve->n_points };
  double vmin = 1.0;
  TextStyle tick = style_w (6.8, FALSE, MUTED, PANGO_ALIGN_RIGHT, 34);
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
    TextStyle yl = style (6.8, FALSE, MUTED);
    text_at (cr, _("mission success probability"), x, y - 2.0, &yl);
  }
  for (double v = a.lo; v <= a.hi + 1e-9; v += step)
    {
      char buf[32];
      double yy = ax_y (&a, v);
      rule (cr, a.x, a.x + a.w, yy, GRID, 0.5);
      g_snprintf (buf, sizeof buf, step < 0.01 ? "%.1f %%" : "%.0f %%", 100.0 * v);
      text_centered_v (cr, buf, a.x - 37.0, yy, &tick);
    }

  set_color (cr, SECOND, 1.0);
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
      set_color (cr, i + 1 == design_stages ? ACCENT : SECOND, 1.0);
      cairo_fill (cr);
    }
  if (design_stages >= 1 && design_stages <= curve->n_points)
    {
      g_autofree char *v = fmt_percent (curve->mission[design_stages - 1], 2);
      TextStyle st = style (7.0, TRUE, INK);
      double px = ax_x (&a, design_stages) + 6.0;
      double py = ax_y (&a, curve->mission[design_stages - 1]) - 9.0;
      if (px + 40.0 > a.x + a.w)
        px -= 52.0;
      text_centered_v (cr, v, px, MAX (py, a.y + 4.0), &st);
    }
  draw_x_axis (cr, &a, design_stages, _("stages"));
  {
    TextStyle st = style_w (6.5, FALSE, MUTED, PANGO_ALIGN_CENTER, w);
    text_at (cr, _("\342\227\217 this design   stage k of N takes design stage min(k, n)"), x,
             a.y + a.h + 21.0, &st);
  }
}

void
sw_sheet_draw_histogram (cairo_t *cr, const SwMcSummary *s, double reference,
                         const char *axis_label, double x, double y, double w, double h)
{
  double px = x + 4.0, py = y + 12.0, pw = w - 8.0, ph = h - 34.0;
  guint max_count = 1;
  double span;
  TextStyle tick = style_w (6.8, FALSE, MUTED, PANGO_ALIGN_CENTER, 60);

  if (s->n == 0 || !isfinite (s->bin_lo))
    {
      note_in_box (cr, _("No feasible sample."), x, y, w, h);
      return;
    }
  for (guint b = 0; b < SW_MC_BINS; b++)
    max_count = MAX (max_count, s->bins[b]);
  span = s->bin_hi - s->bin_lo;

  set_color (cr, ACCENT, 0.55);
  for (guint b = 0; b < SW_MC_BINS; b++)
    {
      double bh = ph * s->bins[b] / max_count;
      cairo_rectangle (cr, px + pw * b / SW_MC_BINS + 0.3, py + ph - bh, pw / SW_MC_BINS - 0.6,
                       bh);
    }
  cairo_fill (cr);
  rule (cr, px, px + pw, py + ph, MUTED, 0.6);

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
        TextStyle st = style_w (6.5, i == 1, INK, PANGO_ALIGN_CENTER, 30);
        set_color (cr, INK, 1.0);
        cairo_set_line_width (cr, i == 1 ? 1.2 : 0.8);
        cairo_move_to (cr, vx, py - 1.0);
        cairo_line_to (cr, vx, py + ph);
        cairo_stroke (cr);
        text_at (cr, names[i], lx[i] - 15.0, py - 10.5, &st);
      }
  }
  if (isfinite (reference) && reference >= s->bin_lo && reference <= s->bin_hi)
    {
      double vx = px + pw * (reference - s->bin_lo) / span;
      double dash[] = { 2.0, 2.0 };
      cairo_set_dash (cr, dash, 2, 0);
      set_color (cr, SECOND, 1.0);
      cairo_set_line_width (cr, 1.0);
      cairo_move_to (cr, vx, py + 4.0);
      cairo_line_to (cr, vx, py + ph);
      cairo_stroke (cr);
      cairo_set_dash (cr, NULL, 0, 0);
    }

  /* Axis: the ends and the median, in tonnes. */
  {
    g_autofree char *lo = fmt_mass (s->bin_lo), *hi = fmt_mass (s->bin_hi);
    TextStyle l = style_w (6.8, FALSE, MUTED, PANGO_ALIGN_LEFT, 80);
    TextStyle r = style_w (6.8, FALSE, MUTED, PANGO_ALIGN_RIGHT, 80);
    TextStyle c = style_w (6.8, FALSE, MUTED, PANGO_ALIGN_CENTER, pw - 120);
    text_at (cr, lo, px, py + ph + 2.0, &l);
    text_at (cr, hi, px + pw - 80, py + ph + 2.0, &r);
    text_at (cr, axis_label, px + 60, py + ph + 2.0, &c);
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
  TextStyle lab = style_w (7.2, TRUE, INK, PANGO_ALIGN_LEFT, label_w - 4);
  TextStyle lv = style_w (6.8, FALSE, MUTED, PANGO_ALIGN_RIGHT, value_w - 3);
  TextStyle rv = style_w (6.8, FALSE, MUTED, PANGO_ALIGN_LEFT, value_w - 3);

  if (!t->feasible || rows == 0)
    {
      note_in_box (cr, _("No sensitivities: the design is infeasible."), x, y, w, h);
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

  set_color (cr, RULE, 1.0);
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
        const char *what = it->param == SW_SENS_PAYLOAD ? _("Payload")
                           : it->param == SW_SENS_DELTA_V ? _("Required \316\224v")
                           : it->param == SW_SENS_ISP ? _("Isp")
                           : _("Structural coefficient");
        if (it->stage >= 0 && row_h >= 14.0)
          {
            g_autofree char *which = g_strdup_printf (_("stage %d \302\267 %s"), it->stage + 1,
                                                      design->stages[it->stage].name);
            TextStyle ws = style_w (6.3, FALSE, MUTED, PANGO_ALIGN_LEFT, label_w - 4);
            text_centered_v (cr, what, x, cy - 3.6, &lab);
            text_centered_v (cr, which, x, cy + 4.2, &ws);
          }
        else if (it->stage >= 0)
          {
            g_autofree char *label = sw_sensitivity_dup_label (design, it);
            text_centered_v (cr, label, x, cy, &lab);
          }
        else
          text_centered_v (cr, what, x, cy, &lab);
      }
      for (guint side = 0; side < 2; side++)
        {
          double len = ok[side] ? bw / 2 * changes[side] / scale
                                : (side == 0 ? -1.0 : 1.0) * bw / 2;
          g_autofree char *v = NULL;

          set_color (cr, side == 0 ? ACCENT : SECOND, ok[side] ? 0.85 : 0.25);
          cairo_rectangle (cr, MIN (cx, cx + len), cy - bar_h / 2, fabs (len), bar_h);
          cairo_fill (cr);
          v = ok[side] ? fmt_mass (changes[side]) : g_strdup (_("infeasible"));
          if (ok[side] && changes[side] > 0)
            {
              char *plus = g_strconcat ("+", v, NULL);
              g_free (v);
              v = plus;
            }
          /* The value goes at the end of the bar, outside the plot. */
          if ((len < 0) == TRUE)
            text_centered_v (cr, v, bx - value_w, cy, &lv);
          else
            text_centered_v (cr, v, bx + bw + 3.0, cy, &rv);
        }
    }
  {
    g_autofree char *text = g_strdup_printf (_("liftoff mass change for each input at "
                                               "\342\210\222%g %% (blue) and +%g %% (amber)"),
                                             t->step * 100.0, t->step * 100.0);
    TextStyle st = style_w (6.5, FALSE, MUTED, PANGO_ALIGN_CENTER, w);
    text_at (cr, text, x, y + rows * row_h + 2.0, &st);
  }
}

/* ---- the page ---------------------------------------------------------- */

typedef struct {
  cairo_t *cr;
  double   x, w;    /* content column */
} Page;

static double
draw_header (const Page *p, const SwBriefing *b, double y)
{
  const SwDesign *d = b->design;
  TextStyle kicker = style (8.0, TRUE, ACCENT);
  TextStyle title = style_w (18.0, TRUE, INK, PANGO_ALIGN_LEFT, p->w - 120);
  TextStyle right = style_w (8.0, FALSE, MUTED, PANGO_ALIGN_RIGHT, 150);
  TextStyle sub = style_w (8.5, FALSE, MUTED, PANGO_ALIGN_LEFT, p->w);
  g_autofree char *payload = fmt_mass (d->payload_kg);
  g_autofree char *dv = fmt_grouped (b->delta_v_m_s, 0);
  g_autofree char *mission = NULL, *line = NULL, *date = NULL, *stages = NULL;
  double h;

  text_at (p->cr, _("LAUNCH VEHICLE CONCEPT \342\200\224 SIZING BRIEF"), p->x, y, &kicker);
  date = g_strdup_printf (_("%s\nStagewright %s"), b->date, PACKAGE_VERSION);
  text_at (p->cr, date, p->x + p->w - 150, y, &right);
  h = text_at (p->cr, d->name[0] ? d->name : _("Untitled design"), p->x, y + 11.0, &title);

  if (d->mission.kind == SW_MISSION_ORBIT)
    mission = g_strdup_printf (_("%.0f km circular orbit at %.1f\302\260 from a site at "
                                 "%.1f\302\260"),
                               d->mission.altitude_km, d->mission.inclination_deg,
                               d->mission.site_latitude_deg);
  else
    mission = g_strdup (_("delta-v mission"));
  stages = g_strdup_printf (ngettext ("%u stage", "%u stages", d->n_stages), d->n_stages);
  line = g_strdup_printf (_("Payload %s  \302\267  %s  \302\267  required \316\224v %s m/s  "
                            "\302\267  %s split  \302\267  %s"),
                          payload, mission, dv, sw_split_mode_to_string (d->split), stages);
  text_at (p->cr, line, p->x, y + 13.0 + h, &sub);
  y += 13.0 + h + 14.0;
  rule (p->cr, p->x, p->x + p->w, y, INK, 1.0);
  return y + 8.0;
}

typedef struct {
  const char *label;
  char       *value;
  char       *delta;    /* vs baseline, may be NULL */
  guint32     color;
} TotalRow;

static char *
delta_text (const SwDelta *d, int decimals, const char *unit, gboolean mass)
{
  g_autofree char *abs_text = NULL;

  if (!isfinite (d->delta))
    return g_strdup ("-");
  abs_text = mass ? fmt_mass (d->delta) : fmt_signed (d->delta, decimals, unit);
  if (mass && d->delta > 0)
    {
      char *t = g_strconcat ("+", abs_text, NULL);
      g_free (abs_text);
      abs_text = t;
    }
  if (isfinite (d->percent))
    return g_strdup_printf ("%s (%+.1f %%)", abs_text, d->percent);
  return g_steal_pointer (&abs_text);
}

static void
draw_totals (const Page *p, const SwBriefing *b, double x, double y, double w, double h)
{
  cairo_t *cr = p->cr;
  const SwSizing *s = &b->sizing;
  TotalRow rows[16];
  guint n = 0;
  double yy = y;
  TextStyle lab = style (7.5, FALSE, MUTED);

  yy += heading (cr, _("Totals"), x, yy, w);
  if (s->feasible)
    {
      g_autofree char *big = fmt_mass (s->liftoff_mass_kg);
      g_autofree char *kg = fmt_grouped (s->liftoff_mass_kg, 0);
      g_autofree char *delta = b->has_baseline
                                 ? delta_text (&b->comparison.totals[SW_TOTAL_LIFTOFF_MASS], 0,
                                               "", TRUE)
                                 : NULL;
      g_autofree char *small = delta != NULL && strcmp (delta, "-") != 0
                                 ? g_strdup_printf (_("Liftoff mass %s kg  \302\267  %s vs "
                                                      "baseline"), kg, delta)
                                 : g_strdup_printf (_("Liftoff mass %s kg"), kg);
      TextStyle bs = style (22.0, TRUE, INK);
      TextStyle ss = style (8.0, FALSE, MUTED);
      double bh = text_at (cr, big, x, yy, &bs);
      yy += bh + text_at (cr, small, x, yy + bh, &ss) + 4.0;
    }
  else
    {
      TextStyle bs = style (16.0, TRUE, BAD);
      TextStyle rs = { 7.5, FALSE, INK, PANGO_ALIGN_LEFT, w, FALSE };
      yy += text_at (cr, _("Infeasible"), x, yy, &bs);
      yy += text_at (cr, s->reason, x, yy, &rs) + 6.0;
    }

#define ADD_ROW(L, V, D, C) \
  G_STMT_START { rows[n].label = (L); rows[n].value = (V); rows[n].delta = (D); \
                 rows[n].color = (C); n++; } G_STMT_END

  {
    const SwComparison *c = b->has_baseline ? &b->comparison : NULL;
    double prop = sw_sizing_total (s, SW_TOTAL_PROPELLANT);
    double str = sw_sizing_total (s, SW_TOTAL_STRUCTURE);

    ADD_ROW (_("Payload fraction"), fmt_percent (s->payload_fraction, 2),
             c ? delta_text (&c->totals[SW_TOTAL_PAYLOAD_FRACTION], 4, "", FALSE) : NULL, INK);
    if (c != NULL && isfinite (c->totals[SW_TOTAL_PAYLOAD_FRACTION].delta))
      {
        /* The fraction is clearer in percentage points. */
        g_free (rows[n - 1].delta);
        rows[n - 1].delta = g_strdup_printf (_("%+.2f points"),
                                             100.0 * c->totals[SW_TOTAL_PAYLOAD_FRACTION].delta);
      }
    ADD_ROW (_("Propellant"), fmt_mass (prop),
             c ? delta_text (&c->totals[SW_TOTAL_PROPELLANT], 0, "", TRUE) : NULL, INK);
    ADD_ROW (_("Structure"), fmt_mass (str),
             c ? delta_text (&c->totals[SW_TOTAL_STRUCTURE], 0, "", TRUE) : NULL, INK);
    {
      g_autofree char *lim = fmt_grouped (s->delta_v_limit_m_s, 0);
      g_autofree char *mar = fmt_grouped (s->margin_m_s, 0);
      ADD_ROW (_("\316\224v limit (margin)"), g_strdup_printf ("%s m/s (%s)", lim, mar),
               c ? delta_text (&c->totals[SW_TOTAL_DELTA_V_LIMIT], 0, "m/s", FALSE) : NULL, INK);
    }
    {
      g_autofree char *dv = fmt_grouped (b->delta_v_m_s, 0);
      ADD_ROW (_("Required \316\224v"), g_strdup_printf ("%s m/s", dv),
               c ? delta_text (&c->totals[SW_TOTAL_DELTA_V], 0, "m/s", FALSE) : NULL, INK);
      ADD_ROW (_("Payload"), fmt_mass (s->payload_kg),
               c ? delta_text (&c->totals[SW_TOTAL_PAYLOAD], 0, "", TRUE) : NULL, INK);
    }
  }
  if (b->has_reliability)
    ADD_ROW (_("Mission success"), fmt_percent (b->reliability.mission, 2), NULL, INK);
  if (b->has_montecarlo && b->montecarlo.liftoff.n > 0)
    {
      g_autofree char *p05 = fmt_mass (b->montecarlo.liftoff.p05);
      g_autofree char *p95 = fmt_mass (b->montecarlo.liftoff.p95);
      ADD_ROW (_("Liftoff mass, 5\342\200\22395 %"), g_strdup_printf ("%s \342\200\223 %s", p05, p95),
               NULL, INK);
    }
  if (b->has_montecarlo && isfinite (b->montecarlo.p_negative_margin))
    ADD_ROW (_("P(payload short), no reserve"), fmt_percent (b->montecarlo.p_negative_margin, 1), NULL,
             b->montecarlo.p_negative_margin > 0.05 ? BAD : GOOD);
  for (guint i = 0; i < b->n_ascent && n < G_N_ELEMENTS (rows); i++)
    ADD_ROW (b->ascent[i].label, g_strdup (b->ascent[i].value), NULL, INK);
#undef ADD_ROW

  {
    double vx = x + w * 0.38, dx = x + w * 0.70;
    /* Tighter rows when many figures must share the panel. */
    double row_h = n > 0 ? CLAMP ((y + h - yy - (b->has_baseline ? 10.0 : 0.0)) / n, 9.6, 11.5)
                         : 11.5;
    TextStyle val = style_w (7.8, TRUE, INK, PANGO_ALIGN_LEFT, (b->has_baseline ? dx : x + w) - vx - 4);
    TextStyle dst = style_w (7.2, FALSE, MUTED, PANGO_ALIGN_LEFT, x + w - dx);

    if (b->has_baseline)
      {
        g_autofree char *bm = fmt_mass (b->baseline_sizing.feasible
                                          ? b->baseline_sizing.liftoff_mass_kg : NAN);
        g_autofree char *t = g_strdup_printf (_("Baseline: %s, liftoff mass %s"),
                                              b->design->baseline->name,
                                              b->baseline_sizing.feasible ? bm
                                                                          : _("infeasible"));
        TextStyle bs = style_w (7.2, FALSE, MUTED, PANGO_ALIGN_LEFT, w);
        TextStyle hs = style_w (6.8, TRUE, MUTED, PANGO_ALIGN_LEFT, x + w - dx);
        text_at (cr, t, x, yy, &bs);
        yy += 13.0;
        text_at (cr, _("change vs baseline"), dx, yy - 1.0, &hs);
        yy += 10.0;
      }
    for (guint i = 0; i < n && yy + row_h <= y + h; i++)
      {
        val.color = rows[i].color;
        text_at (cr, rows[i].label, x, yy, &lab);
        val.width = (rows[i].delta != NULL ? dx : x + w) - vx - 4;
        text_at (cr, rows[i].value, vx, yy, &val);
        if (rows[i].delta != NULL)
          text_at (cr, rows[i].delta, dx, yy + 0.5, &dst);
        yy += row_h;
      }
    for (guint i = 0; i < n; i++)
      {
        g_free (rows[i].value);
        g_free (rows[i].delta);
      }
  }

  if (s->feasible && s->reason[0] != '\0' && yy + 20 < y + h)
    {
      TextStyle ns = { 7.0, FALSE, MUTED, PANGO_ALIGN_LEFT, w, FALSE };
      yy += 3.0 + text_at (cr, s->reason, x, yy + 3.0, &ns);
    }
  if (b->n_ascent == 0 && b->ascent_note[0] != '\0' && yy + 12 < y + h)
    {
      TextStyle ns = { 7.0, FALSE, MUTED, PANGO_ALIGN_LEFT, w, FALSE };
      text_at (cr, b->ascent_note, x, yy + 3.0, &ns);
    }
}

static double
stage_table_height (const SwBriefing *b)
{
  return 18.0 + 13.0 * (b->sizing.n_stages + 1) + 4.0;
}

static void
draw_stage_table (const Page *p, const SwBriefing *b, double y)
{
  cairo_t *cr = p->cr;
  const SwSizing *s = &b->sizing;
  const SwDesign *d = b->design;
  gboolean rel = b->has_reliability;
  /* Column: header, right edge as a fraction of the width (the name column
   * is left-aligned from 0.03). */
  const char *heads[] = { "#", N_("Stage"), N_("Isp vac"), N_("Struct. coeff."), N_("\316\224v m/s"),
                          N_("Share"), N_("Mass ratio"), N_("Propellant"), N_("Structure"),
                          N_("At ignition"), N_("Success") };
  double right[] = { 0.025, 0.0, 0.335, 0.445, 0.52, 0.585, 0.67, 0.755, 0.835, 0.92, 1.0 };
  guint ncol = rel ? 11 : 10;
  double row_h = 13.0, yy = y;
  TextStyle hs = style (7.0, TRUE, MUTED);
  TextStyle cell = style (7.6, FALSE, INK);

  if (!rel)
    for (guint c = 2; c < 10; c++)
      right[c] = 0.30 + (right[c] - 0.30) * (1.0 - 0.30) / (0.92 - 0.30);
  yy += heading (cr, _("Stages, in firing order"), p->x, yy, p->w);
  for (guint c = 0; c < ncol; c++)
    {
      TextStyle st = hs;
      double x;
      if (c == 1)
        {
          text_at (cr, _(heads[c]), p->x + 0.035 * p->w, yy, &st);
          continue;
        }
      x = p->x + right[c] * p->w;
      st.width = c == 0 ? right[0] * p->w : (right[c] - (c == 2 ? 0.26 : right[c - 1])) * p->w - 3.0;
      st.align = PANGO_ALIGN_RIGHT;
      st.ellipsize = TRUE;
      text_at (cr, _(heads[c]), x - st.width, yy, &st);
    }
  yy += row_h;
  rule (cr, p->x, p->x + p->w, yy - 1.5, RULE, 0.6);

  for (guint i = 0; i < s->n_stages; i++)
    {
      const SwStageResult *r = &s->stages[i];
      char *cells[11] = { 0 };

      if (i % 2 == 1)
        {
          set_color (cr, PANEL, 1.0);
          cairo_rectangle (cr, p->x, yy - 1.0, p->w, row_h);
          cairo_fill (cr);
        }
      cells[0] = g_strdup_printf ("%u", i + 1);
      cells[1] = g_strdup (d->stages[i].name);
      cells[2] = g_strdup_printf ("%.1f s", d->stages[i].isp_vac_s);
      cells[3] = g_strdup_printf ("%.4f", d->stages[i].structural_coefficient);
      cells[4] = fmt_grouped (r->delta_v_m_s, 0);
      cells[5] = fmt_percent (r->delta_v_share, 1);
      cells[6] = isfinite (r->mass_ratio) ? g_strdup_printf ("%.3f", r->mass_ratio) : g_strdup ("-");
      cells[7] = fmt_mass (r->propellant_mass_kg);
      cells[8] = fmt_mass (r->structural_mass_kg);
      cells[9] = fmt_mass (r->initial_mass_kg);
      cells[10] = rel ? fmt_percent (b->reliability.stage[i], 2) : NULL;
      if (r->unused)
        {
          g_free (cells[1]);
          cells[1] = g_strdup_printf (_("%s (unused)"), d->stages[i].name);
        }
      for (guint c = 0; c < ncol; c++)
        {
          TextStyle st = cell;
          if (c == 1)
            {
              st.width = (0.26 - 0.035) * p->w;
              st.ellipsize = TRUE;
              st.color = r->feasible ? INK : BAD;
              text_at (cr, cells[c], p->x + 0.035 * p->w, yy, &st);
              continue;
            }
          st.width = 80;
          st.align = PANGO_ALIGN_RIGHT;
          st.ellipsize = TRUE;
          text_at (cr, cells[c], p->x + right[c] * p->w - 80, yy, &st);
        }
      for (guint c = 0; c < 11; c++)
        g_free (cells[c]);
      yy += row_h;
    }
  rule (cr, p->x, p->x + p->w, yy - 1.0, RULE, 0.6);
}

static void
draw_uncertainty (const Page *p, const SwBriefing *b, double x, double y, double w, double h)
{
  cairo_t *cr = p->cr;
  const SwMonteCarlo *mc = &b->montecarlo;
  double yy = y + heading (cr, _("Uncertainty (Monte Carlo)"), x, y, w);
  g_autofree char *line1 = NULL, *line2 = NULL, *mean = NULL, *sd = NULL, *res = NULL;
  g_autofree char *spreads = NULL;
  TextStyle st = { 7.2, FALSE, INK, PANGO_ALIGN_LEFT, w, FALSE };
  TextStyle mu = { 6.6, FALSE, MUTED, PANGO_ALIGN_LEFT, w, FALSE };
  double th;

  if (!b->has_montecarlo)
    {
      note_in_box (cr, _("Not computed: the design has no \342\200\234uncertainty\342\200\235 "
                         "spreads."),
                   x, yy, w, y + h - yy);
      return;
    }
  {
    char a[48] = "0", c[48] = "0", l[48] = "0";
    if (mc->spreads.isp.kind != SW_SPREAD_NONE)
      g_snprintf (a, sizeof a, "%s%g %%", mc->spreads.isp.kind == SW_SPREAD_NORMAL ? "\317\203 " : "\302\261",
                  mc->spreads.isp.width);
    if (mc->spreads.structural_coefficient.kind != SW_SPREAD_NONE)
      g_snprintf (c, sizeof c, "%s%g %%",
                  mc->spreads.structural_coefficient.kind == SW_SPREAD_NORMAL ? "\317\203 " : "\302\261",
                  mc->spreads.structural_coefficient.width);
    if (mc->spreads.losses.kind != SW_SPREAD_NONE)
      g_snprintf (l, sizeof l, "%s%g m/s", mc->spreads.losses.kind == SW_SPREAD_NORMAL ? "\317\203 " : "\302\261",
                  mc->spreads.losses.width);
    g_autofree char *count = fmt_grouped (mc->samples, 0);
    spreads = g_strdup_printf (_("%s samples, seed %u. Spreads: Isp %s, structural coeff. %s, "
                                 "losses %s."),
                               count, mc->seed, a, c, l);
  }
  mean = fmt_mass (mc->liftoff.mean);
  sd = fabs (mc->liftoff.mean) >= 10000.0 && isfinite (mc->liftoff.sd)
         ? g_strdup_printf ("%.2f t", mc->liftoff.sd / 1000.0) : fmt_mass (mc->liftoff.sd);
  {
    g_autofree char *inf = fmt_percent (mc->infeasible_fraction, 1);
    line1 = g_strdup_printf (_("Liftoff mass for the payload: mean %s, sd %s; %s of samples "
                               "infeasible."),
                             mean, sd, inf);
  }
  res = fmt_mass (mc->reserve_95_kg);
  if (mc->payload.n > 0)
    {
      g_autofree char *pn = fmt_percent (mc->p_negative_margin, 1);
      line2 = g_strdup_printf (_("The vehicle as sized (propellant fixed) falls short of the "
                                 "payload in %s of samples; a reserve of %s covers 95 %%."),
                               pn, res);
    }
  else
    line2 = g_strdup (_("The nominal design is infeasible: no fixed vehicle to test."));
  th = text_at (cr, spreads, x, yy, &mu);
  yy += th + 1.0;
  yy += text_at (cr, line1, x, yy, &st) + 1.0;
  yy += text_at (cr, line2, x, yy, &st) + 2.0;
  sw_sheet_draw_histogram (cr, &mc->liftoff, mc->nominal_liftoff_kg,
                           _("liftoff mass (dashed: nominal)"), x, yy, w, y + h - yy);
}

static double
draw_footer (const Page *p, double bottom)
{
  cairo_t *cr = p->cr;
  TextStyle st = { 8.0, TRUE, INK, PANGO_ALIGN_LEFT, p->w - 16, FALSE };
  TextStyle small = style_w (6.5, FALSE, MUTED, PANGO_ALIGN_LEFT, p->w);
  PangoLayout *layout = make_layout (cr, sw_sheet_caution, &st);
  int lw, lh;
  double h, top;

  pango_layout_get_size (layout, &lw, &lh);
  h = (double) lh / PANGO_SCALE + 10.0;
  top = bottom - h - 11.0;
  set_color (cr, 0xfbf3e4, 1.0);
  cairo_rectangle (cr, p->x, top, p->w, h);
  cairo_fill (cr);
  set_color (cr, SECOND, 1.0);
  cairo_rectangle (cr, p->x, top, 3.0, h);
  cairo_fill (cr);
  set_color (cr, INK, 1.0);
  cairo_move_to (cr, p->x + 10, top + 5.0);
  pango_cairo_show_layout (cr, layout);
  g_object_unref (layout);
  text_at (cr, _("Figures from the ideal rocket equation with the stated structural coefficients "
                 "and losses; Monte Carlo and reliability figures follow the stated inputs only."),
           p->x, bottom - 9.0, &small);
  return top;
}

void
sw_sheet_draw_page (cairo_t *cr, const SwBriefing *b, double width, double height)
{
  double margin = 34.0;
  Page p = { cr, margin, width - 2 * margin };
  double y, footer_top, avail, top_h, chart_h, bottom_h, table_h, gap = 12.0, col;

  g_return_if_fail (cr != NULL && b != NULL);

  cairo_save (cr);
  set_color (cr, 0xffffff, 1.0);
  cairo_paint (cr);

  y = draw_header (&p, b, margin - 4.0);
  footer_top = draw_footer (&p, height - margin + 12.0);
  table_h = stage_table_height (b);
  avail = footer_top - gap - y - table_h - 3 * gap;
  /* The totals panel grows with its figures; the charts share the rest. */
  {
    guint rows = 6 + (b->has_reliability ? 1 : 0) + (b->has_montecarlo ? 2 : 0) + b->n_ascent;
    double needed = 66.0 + (b->has_baseline ? 23.0 : 0.0) + rows * 11.0
                    + (b->sizing.reason[0] != '\0' ? 20.0 : 0.0);
    top_h = CLAMP (needed, avail * 0.34, avail * 0.46);
  }
  chart_h = (avail - top_h) * 0.49;
  bottom_h = avail - top_h - chart_h;
  col = (p.w - 18.0) / 2.0;

  /* Stack and totals. */
  {
    double sw = MIN (220.0, p.w * 0.40);
    double sy = y + heading (cr, _("Stack"), p.x, y, sw - 10);
    sw_sheet_draw_stack (cr, b->design, &b->sizing, b->has_baseline ? b->design->baseline : NULL,
                         b->has_baseline ? &b->baseline_sizing : NULL, p.x, sy, sw - 10,
                         y + top_h - sy);
    draw_totals (&p, b, p.x + sw + 8.0, y, p.w - sw - 8.0, top_h);
  }
  y += top_h + gap;

  draw_stage_table (&p, b, y);
  y += table_h + gap;

  /* The two curves side by side: mass and risk against stage count. */
  {
    double hy = heading (cr, _("Liftoff mass against stage count"), p.x, y, col);
    sw_sheet_draw_stage_curve (cr, &b->stage_curve, b->has_band ? &b->band : NULL,
                               b->has_baseline ? &b->baseline_curve : NULL, b->design->n_stages,
                               p.x, y + hy + 6.0, col, chart_h - hy - 6.0);
    hy = heading (cr, _("Mission success against stage count"), p.x + col + 18.0, y, col);
    if (b->has_reliability)
      sw_sheet_draw_reliability_curve (cr, &b->reliability_curve, b->design->n_stages,
                                       p.x + col + 18.0, y + hy + 6.0, col, chart_h - hy - 6.0);
    else
      note_in_box (cr, _("Not computed: no stage has reliability keys (engine count, engine "
                         "reliability, failures tolerated, ignition, separation)."),
                   p.x + col + 18.0, y + hy, col, chart_h - hy);
  }
  y += chart_h + gap;

  /* Uncertainty and the ranked sensitivities. */
  draw_uncertainty (&p, b, p.x, y, col, bottom_h);
  {
    double hy = heading (cr, _("What moves the liftoff mass most"), p.x + col + 18.0, y, col);
    if (b->has_sensitivity)
      sw_sheet_draw_tornado (cr, b->design, &b->sensitivity, 6, p.x + col + 18.0, y + hy + 2.0,
                             col, bottom_h - hy - 2.0);
    else
      note_in_box (cr, _("No sensitivities: the design is infeasible."), p.x + col + 18.0,
                   y + hy, col, bottom_h - hy);
  }
  cairo_restore (cr);
}

/* ---- files ------------------------------------------------------------- */

void
sw_sheet_paper_size (SwPaper paper, double *width_pt, double *height_pt)
{
  if (paper == SW_PAPER_LETTER)
    {
      *width_pt = 612.0;   /* 8.5 x 11 in */
      *height_pt = 792.0;
    }
  else
    {
      *width_pt = 210.0 / 25.4 * 72.0;   /* 210 x 297 mm (ISO 216) */
      *height_pt = 297.0 / 25.4 * 72.0;
    }
}

void
sw_sheet_png_size (SwPaper paper, int *width_px, int *height_px)
{
  double w, h;

  sw_sheet_paper_size (paper, &w, &h);
  *width_px = (int) lround (w / 72.0 * SW_SHEET_PNG_DPI);
  *height_px = (int) lround (h / 72.0 * SW_SHEET_PNG_DPI);
}

gboolean
sw_paper_from_string (const char *text, SwPaper *paper)
{
  if (g_strcmp0 (text, "a4") == 0 || g_strcmp0 (text, "A4") == 0)
    *paper = SW_PAPER_A4;
  else if (g_strcmp0 (text, "letter") == 0 || g_strcmp0 (text, "Letter") == 0)
    *paper = SW_PAPER_LETTER;
  else
    return FALSE;
  return TRUE;
}

static gboolean
check_surface (cairo_surface_t *surface, const char *filename, GError **error)
{
  cairo_status_t status = cairo_surface_status (surface);

  if (status == CAIRO_STATUS_SUCCESS)
    return TRUE;
  g_set_error (error, SW_ERROR, SW_ERROR_IO, _("Could not write %s: %s"), filename,
               cairo_status_to_string (status));
  return FALSE;
}

gboolean
sw_sheet_export (const SwBriefing *b, SwSheetFormat format, SwPaper paper, const char *filename,
                 GError **error)
{
  g_autofree char *tmp = NULL;
  cairo_surface_t *surface;
  cairo_t *cr;
  double w, h;
  gboolean ok;

  g_return_val_if_fail (b != NULL && filename != NULL, FALSE);

  sw_sheet_paper_size (paper, &w, &h);
  /* Written beside the target and renamed: never a half-written sheet. */
  tmp = g_strdup_printf ("%s.part", filename);

  if (format == SW_SHEET_PNG)
    {
      int pw, ph;
      sw_sheet_png_size (paper, &pw, &ph);
      surface = cairo_image_surface_create (CAIRO_FORMAT_RGB24, pw, ph);
      cr = cairo_create (surface);
      cairo_scale (cr, pw / w, ph / h);
    }
  else
    {
      if (format == SW_SHEET_PDF)
        {
          g_autofree char *title = g_strdup_printf (_("Sizing brief: %s"), b->design->name);
          surface = cairo_pdf_surface_create (tmp, w, h);
          cairo_pdf_surface_set_metadata (surface, CAIRO_PDF_METADATA_TITLE, title);
          cairo_pdf_surface_set_metadata (surface, CAIRO_PDF_METADATA_CREATOR,
                                          "Stagewright " PACKAGE_VERSION);
          cairo_pdf_surface_set_metadata (surface, CAIRO_PDF_METADATA_SUBJECT,
                                          sw_sheet_caution);
        }
      else
        {
          surface = cairo_svg_surface_create (tmp, w, h);
          cairo_svg_surface_set_document_unit (surface, CAIRO_SVG_UNIT_PT);
        }
      cr = cairo_create (surface);
    }
  if (!check_surface (surface, filename, error))
    {
      cairo_destroy (cr);
      cairo_surface_destroy (surface);
      g_unlink (tmp);
      return FALSE;
    }

  sw_sheet_draw_page (cr, b, w, h);
  cairo_show_page (cr);
  ok = cairo_status (cr) == CAIRO_STATUS_SUCCESS;
  cairo_destroy (cr);
  if (format == SW_SHEET_PNG && ok)
    {
      cairo_status_t st = cairo_surface_write_to_png (surface, tmp);
      if (st != CAIRO_STATUS_SUCCESS)
        {
          g_set_error (error, SW_ERROR, SW_ERROR_IO, _("Could not write %s: %s"), filename,
                       cairo_status_to_string (st));
          cairo_surface_destroy (surface);
          g_unlink (tmp);
          return FALSE;
        }
    }
  cairo_surface_finish (surface);
  ok = ok && check_surface (surface, filename, error);
  cairo_surface_destroy (surface);
  if (!ok)
    {
      g_unlink (tmp);
      return FALSE;
    }
  if (g_rename (tmp, filename) != 0)
    {
      int saved = errno;
      g_set_error (error, SW_ERROR, SW_ERROR_IO, _("Could not write %s: %s"), filename,
                   g_strerror (saved));
      g_unlink (tmp);
      return FALSE;
    }
  return TRUE;
}
