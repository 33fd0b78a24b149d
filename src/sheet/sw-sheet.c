/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The briefing sheet: the stack, the page layout and the files.  Text
 * helpers in sw-sheet-text.c, charts in sw-sheet-charts.c. */
#define G_LOG_DOMAIN "sw-sheet"

#include "config.h"

#include "sw-sheet.h"

#include "sw-format.h"
#include "sw-sheet-private.h"
#include "sw-sheet-staging.h"
#include "sw-stack-drawing.h"

#include <cairo-pdf.h>
#include <cairo-svg.h>
#include <errno.h>
#include <glib/gi18n-lib.h>
#include <glib/gstdio.h>
#include <math.h>
#include <pango/pangocairo.h>
#include <string.h>

/* Short names for the shared helpers within this file. */
#define set_color sw_sheet_set_color
#define make_layout sw_sheet_layout
#define text_at sw_sheet_text_at
#define text_centered_v sw_sheet_text_centered_v
#define style sw_sheet_style
#define style_w sw_sheet_style_w
#define rule sw_sheet_rule
#define heading sw_sheet_heading
#define note_in_box sw_sheet_note_in_box
#define fmt_mass sw_format_mass

/* ---- the stack --------------------------------------------------------- */

/* The same shapes as the stack view on screen: sw-stack-drawing.c. */
void
sw_sheet_draw_stack (cairo_t *cr, const SwDesign *design, const SwSizing *sizing,
                     const SwDesign *baseline_design, const SwSizing *baseline, double x,
                     double y, double w, double h)
{
  sw_stack_draw_panel (cr, design, sizing, baseline, x, y, w, h);
}

/* ---- the page ---------------------------------------------------------- */

typedef struct {
  cairo_t *cr;
  double   x, w;    /* content column */
} Page;

/* The baseline is shown only when it could be sized. */
static gboolean
has_baseline (const SwAnalysis *a)
{
  return a->has_baseline && a->baseline_ok;
}

/* One unit for a whole column or axis: tonnes when the largest value
 * reaches 10 t (the formatter's rule for a single mass), else kilograms. */
static gboolean
use_tonnes (double largest_kg)
{
  return isfinite (largest_kg) && fabs (largest_kg) >= 10000.0;
}

static char *
mass_in (double kg, gboolean tonnes)
{
  return tonnes ? sw_format_number (kg / 1000.0, 1) : sw_format_number (kg, 0);
}

static guint32
verdict_color (SwVerdictState state)
{
  switch (state)
    {
    case SW_VERDICT_REACHES_ORBIT: return GOOD;
    case SW_VERDICT_OVER_LIMIT: return SECOND;
    case SW_VERDICT_INFEASIBLE:
    case SW_VERDICT_SHORT_OF_ORBIT: return BAD;
    case SW_VERDICT_PAPER_ONLY:
    case SW_VERDICT_PENDING:
    default: return MUTED;
    }
}

/* The verdict, first thing under the title: a coloured bar, the state in
 * words and the reason.  Returns the height used. */
static double
draw_verdict (const Page *p, const SwAnalysis *a, double y)
{
  cairo_t *cr = p->cr;
  guint32 color = verdict_color (a->verdict.state);
  TextStyle title = style_w (11.0, TRUE, color, PANGO_ALIGN_LEFT, p->w - 16);
  TextStyle reason = { 8.0, FALSE, INK, PANGO_ALIGN_LEFT, p->w - 16, FALSE, 0, 0.0 };
  PangoLayout *l1 = make_layout (cr, sw_verdict_state_title (a->verdict.state), &title);
  PangoLayout *l2 = make_layout (cr, a->verdict.reason, &reason);
  int w1, h1, w2, h2;
  double h;

  pango_layout_get_size (l1, &w1, &h1);
  pango_layout_get_size (l2, &w2, &h2);
  h = (double) (h1 + h2) / PANGO_SCALE + 10.0;
  g_object_unref (l1);
  g_object_unref (l2);
  set_color (cr, color, 0.10);
  cairo_rectangle (cr, p->x, y, p->w, h);
  cairo_fill (cr);
  set_color (cr, color, 1.0);
  cairo_rectangle (cr, p->x, y, 4.0, h);
  cairo_fill (cr);
  y += 4.0;
  y += text_at (cr, sw_verdict_state_title (a->verdict.state), p->x + 10, y, &title);
  text_at (cr, a->verdict.reason, p->x + 10, y + 1.0, &reason);
  return h;
}

static double
draw_header (const Page *p, const SwAnalysis *a, double y)
{
  const SwDesign *d = a->design;
  TextStyle kicker = style (8.0, TRUE, ACCENT);
  /* The full width: the date is on the first line, beside the kicker.  A
   * long name is set a little smaller, then on two lines, whole. */
  TextStyle title = style_w (18.0, TRUE, INK, PANGO_ALIGN_LEFT, p->w);
  TextStyle right = style_w (8.0, FALSE, MUTED, PANGO_ALIGN_RIGHT, 200);
  TextStyle sub = style_w (8.5, FALSE, MUTED, PANGO_ALIGN_LEFT, p->w);
  g_autoptr (GDateTime) now = g_date_time_new_now_local ();
  g_autofree char *today = g_date_time_format (now, "%Y-%m-%d");
  g_autofree char *payload = sw_format_mass (d->payload_kg);
  g_autofree char *dv = sw_format_speed (a->delta_v_m_s);
  g_autofree char *mission = NULL, *line = NULL, *date = NULL, *stages = NULL;
  const char *split = d->split == SW_SPLIT_EQUAL ? _("equal split")
                      : d->split == SW_SPLIT_MANUAL ? _("split chosen by hand")
                      : _("optimal split");
  double h;

  text_at (p->cr, _("LAUNCH VEHICLE CONCEPT \342\200\224 SIZING BRIEF"), p->x, y, &kicker);
  /* Translators: the date, then the program's version, on the sheet's first line */
  date = g_strdup_printf (_("%s  \302\267  Stagewright %s"), today, PACKAGE_VERSION);
  text_at (p->cr, date, p->x + p->w - 200, y, &right);
  title.max_lines = 2;
  title.min_size = 15.0;
  h = text_at (p->cr, d->name[0] ? d->name : _("Untitled design"), p->x, y + 11.0, &title);
  y += 13.0 + h;
  y += draw_verdict (p, a, y) + 5.0;

  if (d->mission.kind == SW_MISSION_ORBIT)
    {
      g_autofree char *alt = sw_format_distance_km (d->mission.altitude_km * 1000.0);
      /* Translators: an altitude, an inclination and a latitude in degrees */
      mission = g_strdup_printf (_("%s circular orbit at %.1f\302\260 from a site at "
                                   "%.1f\302\260"),
                                 alt, d->mission.inclination_deg, d->mission.site_latitude_deg);
    }
  else
    mission = g_strdup (_("delta-v given directly"));
  stages = g_strdup_printf (ngettext ("%u stage", "%u stages", d->n_stages), d->n_stages);
  line = g_strdup_printf (_("Payload %s  \302\267  %s  \302\267  required \316\224v %s  "
                            "\302\267  %s  \302\267  %s"),
                          payload, mission, dv, split, stages);
  y += text_at (p->cr, line, p->x, y, &sub) + 4.0;
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
delta_text (const SwDelta *d, gboolean mass, gboolean speed)
{
  g_autofree char *abs_text = NULL, *pc = NULL;

  if (!isfinite (d->delta))
    return g_strdup (SW_NO_VALUE);
  abs_text = mass ? sw_format_mass_delta (d->delta)
             : speed ? sw_format_speed_delta (d->delta) : sw_format_signed (d->delta, 0);
  if (!isfinite (d->percent))
    return g_steal_pointer (&abs_text);
  pc = sw_format_signed (d->percent, 1);
  return g_strdup_printf ("%s (%s %%)", abs_text, pc);
}

static void
draw_totals (const Page *p, const SwAnalysis *a, double x, double y, double w, double h)
{
  cairo_t *cr = p->cr;
  const SwSizing *s = &a->sizing;
  gboolean base = has_baseline (a);
  const SwComparison *c = base ? &a->comparison : NULL;
  TotalRow rows[20];
  guint n = 0;
  double yy = y, tw;
  TextStyle lab = style_w (7.5, FALSE, MUTED, PANGO_ALIGN_LEFT, w * 0.42 - 4);

  yy += heading (cr, _("Totals"), x, yy, w);
  if (s->feasible)
    {
      g_autofree char *big = sw_format_mass (s->liftoff_mass_kg);
      g_autofree char *delta = base ? delta_text (&c->totals[SW_TOTAL_LIFTOFF_MASS], TRUE, FALSE)
                                    : NULL;
      g_autofree char *kg = sw_format_number (s->liftoff_mass_kg, 0);
      g_autofree char *small = delta != NULL
                                 /* Translators: a mass in kg, then its change against the
                                  * baseline */
                                 ? g_strdup_printf (_("Liftoff mass %s kg  \302\267  %s against "
                                                      "the baseline"), kg, delta)
                                 : g_strdup_printf (_("Liftoff mass %s kg"), kg);
      TextStyle bs = style (22.0, TRUE, INK);
      TextStyle ss = style_w (8.0, FALSE, MUTED, PANGO_ALIGN_LEFT, w);
      double bh = text_at (cr, big, x, yy, &bs);
      yy += bh + text_at (cr, small, x, yy + bh, &ss) + 4.0;
    }
  else
    {
      TextStyle bs = style (16.0, TRUE, BAD);
      yy += text_at (cr, _("No vehicle"), x, yy, &bs) + 4.0;
    }

#define ADD_ROW(L, V, D, C) \
  G_STMT_START { if (n < G_N_ELEMENTS (rows)) { rows[n].label = (L); rows[n].value = (V); \
                 rows[n].delta = (D); rows[n].color = (C); n++; } else { g_free (V); g_free (D); } \
  } G_STMT_END

  ADD_ROW (_("Payload"), sw_format_mass (s->payload_kg),
           c ? delta_text (&c->totals[SW_TOTAL_PAYLOAD], TRUE, FALSE) : NULL, INK);
  /* A vehicle that exists: what it carries to the mission. */
  if (a->has_performance)
    ADD_ROW (_("Payload capability"),
             a->performance.reachable ? sw_format_mass (a->performance.payload_kg)
                                      : g_strdup (_("none: short even empty")),
             NULL, a->performance.reachable && a->performance.payload_kg >= s->payload_kg
                     ? INK : BAD);
  {
    g_autofree char *pp = c != NULL
                            ? sw_format_signed (100.0 * c->totals[SW_TOTAL_PAYLOAD_FRACTION].delta,
                                                2)
                            : NULL;
    ADD_ROW (_("Payload fraction"), sw_format_percent (s->payload_fraction, 2),
             /* Translators: a change in percentage points */
             c != NULL ? g_strdup_printf (_("%s points"), pp) : NULL, INK);
  }
  ADD_ROW (_("Propellant"), sw_format_mass (sw_sizing_total (s, SW_TOTAL_PROPELLANT)),
           c ? delta_text (&c->totals[SW_TOTAL_PROPELLANT], TRUE, FALSE) : NULL, INK);
  ADD_ROW (_("Structure"), sw_format_mass (sw_sizing_total (s, SW_TOTAL_STRUCTURE)),
           c ? delta_text (&c->totals[SW_TOTAL_STRUCTURE], TRUE, FALSE) : NULL, INK);
  ADD_ROW (a->sized_by_ascent ? _("Required \316\224v (simulated losses)")
                              : _("Required \316\224v"),
           sw_format_speed (a->delta_v_m_s),
           c ? delta_text (&c->totals[SW_TOTAL_DELTA_V], FALSE, TRUE) : NULL, INK);
  if (isfinite (a->simulated_margin_m_s))
    ADD_ROW (_("Simulated \316\224v margin"), sw_format_speed_delta (a->simulated_margin_m_s),
             NULL, a->simulated_margin_m_s >= 0.0 ? GOOD : BAD);
  else if (s->feasible)
    ADD_ROW (_("Headroom to the stages' \316\224v limit"), sw_format_speed (a->headroom_m_s),
             NULL, MUTED);

  /* Thrust-to-weight at liftoff, against the user's limit. */
  tw = sw_analysis_liftoff_tw (a);
  if (isfinite (tw))
    {
      gboolean low = tw < a->options.min_thrust_to_weight;
      g_autofree char *v = sw_format_ratio (tw, 2);
      g_autofree char *lim = sw_format_ratio (a->options.min_thrust_to_weight, 2);
      /* Translators: a row label of the sheet's narrow totals column; keep it short */
      ADD_ROW (C_("sheet row", "Thrust-to-weight at liftoff"),
               low ? g_strdup_printf (_("%s, below the limit of %s"), v, lim) : g_strdup (v),
               NULL, low ? BAD : INK);
    }
  if (a->ascent != NULL && isfinite (a->ascent->losses_m_s))
    {
      g_autofree char *l = sw_format_speed (a->ascent->losses_m_s);
      g_autofree char *gl = sw_format_speed (a->ascent->gravity_loss_m_s);
      /* Translators: total losses, then the gravity loss */
      ADD_ROW (_("Simulated losses"), g_strdup_printf (_("%s (gravity %s)"), l, gl),
               NULL, INK);
    }
  if (a->ascent != NULL && isfinite (a->ascent->max_q_pa))
    {
      gboolean over = a->ascent->max_q_pa > a->options.max_q_pa;
      g_autofree char *q = sw_format_pressure_kpa (a->ascent->max_q_pa);
      ADD_ROW (_("Max-Q"), g_strdup (q), NULL, over ? BAD : INK);
    }
  if (a->ascent != NULL && isfinite (a->ascent->max_axial_g))
    {
      gboolean over = a->ascent->max_axial_g > a->options.max_axial_g;
      ADD_ROW (_("Peak acceleration"), sw_format_accel_g (a->ascent->max_axial_g), NULL,
               over ? BAD : INK);
    }
  if (a->reliability.given)
    ADD_ROW (_("Mission success (reliability)"), sw_format_probability (a->reliability.mission),
             NULL, INK);
  if (a->has_montecarlo && isfinite (a->montecarlo_success) && a->montecarlo.all_fixed)
    {
      /* A vehicle that exists: the chance its nominal payload fits, and the
       * spread of its delta-v margin with that payload. */
      g_autofree char *lo = sw_format_speed (a->montecarlo.margin.p05);
      g_autofree char *hi = sw_format_speed (a->montecarlo.margin.p95);

      ADD_ROW (_("Nominal payload fits"),
               sw_format_probability (a->montecarlo_success), NULL,
               a->montecarlo_success >= 0.95 ? GOOD : INK);
      ADD_ROW (_("Δv margin, 5th to 95th"), g_strdup_printf ("%s – %s", lo, hi), NULL, INK);
    }
  else if (a->has_montecarlo && isfinite (a->montecarlo_success))
    {
      ADD_ROW (_("Payload fits, no reserve"),
               sw_format_probability (a->montecarlo_success), NULL,
               a->montecarlo_success >= 0.95 ? GOOD : INK);
      /* xgettext:no-c-format */
      ADD_ROW (_("Reserve for a 95 % chance"), sw_format_mass (a->montecarlo.reserve_95_kg),
               NULL, INK);
    }
#undef ADD_ROW

  {
    double vx = x + w * 0.42, dx = x + w * 0.72;
    /* Closer rows before any row is left out. */
    double row_h = n > 0 ? CLAMP ((y + h - yy - (base ? 23.0 : 0.0)) / n, 8.8, 11.5) : 11.5;
    TextStyle val = style_w (7.8, TRUE, INK, PANGO_ALIGN_LEFT, (base ? dx : x + w) - vx - 4);
    TextStyle dst = style_w (7.2, FALSE, MUTED, PANGO_ALIGN_LEFT, x + w - dx);

    if (base)
      {
        g_autofree char *bm = sw_format_mass (a->baseline_sizing.feasible
                                                ? a->baseline_sizing.liftoff_mass_kg : NAN);
        /* Translators: the baseline's name and liftoff mass */
        g_autofree char *t = g_strdup_printf (_("Baseline: %s, liftoff mass %s"),
                                              a->design->baseline->name,
                                              a->baseline_sizing.feasible ? bm
                                                                          : _("not feasible"));
        TextStyle bs = style_w (7.2, FALSE, MUTED, PANGO_ALIGN_LEFT, w);
        TextStyle hs = style_w (6.8, TRUE, MUTED, PANGO_ALIGN_LEFT, x + w - dx);
        text_at (cr, t, x, yy, &bs);
        yy += 13.0;
        text_at (cr, _("against the baseline"), dx, yy - 1.0, &hs);
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
}

static double
stage_table_height (const SwAnalysis *a)
{
  return 18.0 + 13.0 * (a->sizing.n_stages + (a->sizing.boosters.present ? 2 : 1)) + 4.0;
}

static void
draw_stage_table (const Page *p, const SwAnalysis *a, double y)
{
  cairo_t *cr = p->cr;
  const SwSizing *s = &a->sizing;
  const SwDesign *d = a->design;
  gboolean rel = a->reliability.given;
  double largest = 0.0;
  gboolean tonnes;
  const char *heads[11];
  double right[] = { 0.025, 0.0, 0.335, 0.445, 0.52, 0.585, 0.67, 0.755, 0.835, 0.92, 1.0 };
  guint ncol = rel ? 11 : 10;
  double row_h = 13.0, yy = y;
  TextStyle hs = style (7.0, TRUE, MUTED);
  TextStyle cell = style (7.6, FALSE, INK);

  /* One unit for the three mass columns, from the largest mass in them. */
  for (guint i = 0; i < s->n_stages; i++)
    if (isfinite (s->stages[i].initial_mass_kg))
      largest = MAX (largest, s->stages[i].initial_mass_kg);
  tonnes = use_tonnes (largest);
  heads[0] = "#";
  heads[1] = _("Stage");
  heads[2] = _("Isp, s");
  heads[3] = _("\316\265");
  heads[4] = _("\316\224v, m/s");
  heads[5] = _("Share");
  /* Translators: a column heading of the sheet's stage table; keep it short */
  heads[6] = C_("sheet column", "Mass ratio");
  heads[7] = tonnes ? _("Prop., t") : _("Prop., kg");
  heads[8] = tonnes ? _("Struct., t") : _("Struct., kg");
  heads[9] = tonnes ? _("Ignition, t") : _("Ignition, kg");
  heads[10] = _("Success");

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
          text_at (cr, heads[c], p->x + 0.035 * p->w, yy, &st);
          continue;
        }
      x = p->x + right[c] * p->w;
      st.width = c == 0 ? right[0] * p->w
                        : (right[c] - (c == 2 ? 0.26 : right[c - 1])) * p->w - 3.0;
      st.align = PANGO_ALIGN_RIGHT;
      st.ellipsize = TRUE;
      text_at (cr, heads[c], x - st.width, yy, &st);
    }
  yy += row_h;
  rule (cr, p->x, p->x + p->w, yy - 1.5, RULE, 0.6);

  for (guint row = 0; row < s->n_stages + (s->boosters.present ? 1 : 0); row++)
    {
      /* With boosters, their row comes first: they fire at liftoff. */
      gboolean brow = s->boosters.present && row == 0;
      guint i = s->boosters.present && row > 0 ? row - 1 : row;
      const SwStageResult *r = &s->stages[i];
      char *cells[11] = { 0 };

      if (row % 2 == 1)
        {
          set_color (cr, PANEL, 1.0);
          cairo_rectangle (cr, p->x, yy - 1.0, p->w, row_h);
          cairo_fill (cr);
        }
      cells[0] = g_strdup_printf ("%u", i + 1);
      cells[1] = r->unused ? g_strdup_printf (_("%s (unused)"), d->stages[i].name)
                           : g_strdup (d->stages[i].name);
      cells[2] = sw_format_number (d->stages[i].isp_vac_s, 1);
      cells[3] = sw_format_number (d->stages[i].structural_coefficient, 4);
      cells[4] = sw_format_number (r->delta_v_m_s, 0);
      cells[5] = sw_format_percent (r->delta_v_share, 1);
      cells[6] = sw_format_ratio (r->mass_ratio, 3);
      cells[7] = mass_in (r->propellant_mass_kg, tonnes);
      cells[8] = mass_in (r->structural_mass_kg, tonnes);
      cells[9] = mass_in (r->initial_mass_kg, tonnes);
      cells[10] = rel ? sw_format_percent (a->reliability.stage[i], 2) : NULL;
      if (brow)
        {
          const SwBoosterResult *b = &s->boosters;
          for (guint c = 0; c < 11; c++)
            g_clear_pointer (&cells[c], g_free);
          cells[0] = g_strdup ("B");
          /* Translators: the boosters' row of the stage table: "Boosters, 4x beside stage 1" */
          cells[1] = g_strdup_printf (_("%s, %u\303\227 beside stage 1"), d->boosters.name,
                                      b->count);
          {
            TextStyle st = cell;

            st.width = (0.26 - 0.035) * p->w;
            st.ellipsize = TRUE;
            /* Too long for the column: the short form (the row is marked B). */
            if (!sw_sheet_fits (cr, cells[1], &st))
              {
                g_free (cells[1]);
                /* Translators: the boosters' row of the stage table, short
                 * form: "Boosters, 4x" */
                cells[1] = g_strdup_printf (_("%s, %u\303\227"), d->boosters.name, b->count);
              }
          }
          cells[2] = sw_format_number (d->boosters.isp_vac_s, 1);
          cells[3] = sw_format_number (d->boosters.structural_coefficient, 4);
          /* Phase 0's delta-v is in stage 1's: no figures of their own here. */
          cells[4] = g_strdup ("\342\200\224");
          cells[5] = g_strdup ("\342\200\224");
          cells[6] = g_strdup ("\342\200\224");
          cells[7] = mass_in (b->count * b->propellant_mass_kg, tonnes);
          cells[8] = mass_in (b->count * b->structural_mass_kg, tonnes);
          cells[9] = g_strdup ("\342\200\224");
        }
      for (guint c = 0; c < ncol; c++)
        {
          TextStyle st = cell;
          double cw;
          if (c == 1)
            {
              st.width = (0.26 - 0.035) * p->w;
              st.ellipsize = TRUE;
              st.color = brow || r->feasible ? INK : BAD;
              text_at (cr, cells[c], p->x + 0.035 * p->w, yy, &st);
              continue;
            }
          cw = (right[c] - (c == 2 ? 0.26 : c == 0 ? 0.0 : right[c - 1])) * p->w - 3.0;
          st.width = cw;
          st.align = PANGO_ALIGN_RIGHT;
          st.ellipsize = TRUE;
          text_at (cr, cells[c], p->x + right[c] * p->w - cw, yy, &st);
        }
      for (guint c = 0; c < 11; c++)
        g_free (cells[c]);
      yy += row_h;
    }
  rule (cr, p->x, p->x + p->w, yy - 1.0, RULE, 0.6);
}

static char *
spread_words (const SwSpread *sp, gboolean speed)
{
  g_autofree char *v = NULL;

  if (sp->kind == SW_SPREAD_NONE || !(sp->width > 0.0))
    return g_strdup (_("none"));
  v = speed ? sw_format_speed (sp->width) : sw_format_percent (sp->width / 100.0, 1);
  /* Translators: a spread; "σ" a standard deviation, "±" a uniform half range */
  return g_strdup_printf (sp->kind == SW_SPREAD_NORMAL ? _("\317\203 %s") : _("\302\261%s"), v);
}

static void
draw_uncertainty (const Page *p, const SwAnalysis *a, double x, double y, double w, double h)
{
  cairo_t *cr = p->cr;
  const SwMonteCarlo *mc = &a->montecarlo;
  double yy = y + heading (cr, _("Uncertainty (Monte Carlo)"), x, y, w);
  g_autofree char *line1 = NULL, *spreads = NULL, *count = NULL;
  g_autofree char *si = NULL, *sc = NULL, *sl = NULL;
  TextStyle st = { 7.2, FALSE, INK, PANGO_ALIGN_LEFT, w, FALSE, 0, 0.0 };
  TextStyle mu = { 6.6, FALSE, MUTED, PANGO_ALIGN_LEFT, w, FALSE, 0, 0.0 };
  gboolean tonnes;
  g_autofree char *axis = NULL;

  if (!a->has_montecarlo)
    {
      note_in_box (cr, _("Not computed: the design gives no uncertainty spreads."), x, yy, w,
                   y + h - yy);
      return;
    }
  count = sw_format_number (mc->samples, 0);
  si = spread_words (&mc->spreads.isp, FALSE);
  sc = spread_words (&mc->spreads.structural_coefficient, FALSE);
  sl = spread_words (&mc->spreads.losses, TRUE);
  /* Translators: a sample count, then three spreads */
  spreads = g_strdup_printf (_("%s samples. Spreads: Isp %s, structural coefficient %s, "
                               "losses %s."), count, si, sc, sl);
  if (mc->all_fixed && isfinite (a->montecarlo_success))
    {
      g_autofree char *chance = sw_format_probability (a->montecarlo_success);
      g_autofree char *m05 = sw_format_speed (mc->margin.p05);
      g_autofree char *m50 = sw_format_speed (mc->margin.p50);

      /* Translators: a probability; two speeds */
      line1 = g_strdup_printf (_("Every load fixed: one liftoff mass. The nominal payload fits "
                                 "in %s of cases; Δv margin with it: %s (5th percentile), %s "
                                 "(median)."),
                               chance, m05, m50);
    }
  else if (isfinite (a->montecarlo_success))
    {
      g_autofree char *chance = sw_format_probability (a->montecarlo_success);
      g_autofree char *res = sw_format_mass (mc->reserve_95_kg);
      /* Translators: a probability, then a mass */
      line1 = g_strdup_printf (_("Built as sized, with no payload reserve, the vehicle carries "
                                 "the whole payload in %s of cases. Holding back %s of payload "
                                 "capacity as a reserve raises that to 95 %%."),
                               chance, res);
    }
  else
    line1 = g_strdup (_("The nominal design is not feasible: no vehicle to test."));
  yy += text_at (cr, line1, x, yy, &st) + 1.0;
  yy += text_at (cr, spreads, x, yy, &mu) + 2.0;
  if (mc->all_fixed)
    {
      tonnes = use_tonnes (mc->payload.bin_hi);
      axis = g_strdup (tonnes ? _("capability, t (dashed: payload)")
                              : _("capability, kg (dashed: payload)"));
      /* A sample short even with no payload has a negative capability: the
       * axis says what that means, on a line of its own (as the window's
       * trade page says it). */
      if (mc->payload.n > 0 && mc->payload.min < 0.0)
        {
          g_autofree char *one = g_steal_pointer (&axis);
          axis = g_strdup_printf ("%s\n%s", one, _("below 0: short even when empty"));
        }
      sw_sheet_draw_histogram (cr, &mc->payload, mc->required_payload_kg, axis, x, yy, w,
                               y + h - yy);
      return;
    }
  tonnes = use_tonnes (mc->liftoff.bin_hi);
  axis = g_strdup (tonnes ? _("liftoff mass, t (dashed: as designed)")
                          : _("liftoff mass, kg (dashed: as designed)"));
  sw_sheet_draw_histogram (cr, &mc->liftoff, mc->nominal_liftoff_kg, axis, x, yy, w,
                           y + h - yy);
}

static double
draw_footer (const Page *p, double bottom)
{
  cairo_t *cr = p->cr;
  TextStyle st = { 8.0, TRUE, INK, PANGO_ALIGN_LEFT, p->w - 16, FALSE, 0, 0.0 };
  TextStyle small = style_w (6.5, FALSE, MUTED, PANGO_ALIGN_LEFT, p->w);
  PangoLayout *layout = make_layout (cr, sw_format_cautions (), &st);
  int lw, lh;
  double h, top;

  pango_layout_get_size (layout, &lw, &lh);
  h = (double) lh / PANGO_SCALE + 10.0;
  top = bottom - h - 11.0;
  g_object_unref (layout);
  set_color (cr, 0xfbf3e4, 1.0);
  cairo_rectangle (cr, p->x, top, p->w, h);
  cairo_fill (cr);
  set_color (cr, SECOND, 1.0);
  cairo_rectangle (cr, p->x, top, 3.0, h);
  cairo_fill (cr);
  text_at (cr, sw_format_cautions (), p->x + 10, top + 5.0, &st);
  text_at (cr, _("Figures from the ideal rocket equation with the stated structural coefficients "
                 "and losses; Monte Carlo and reliability figures follow the stated inputs only."),
           p->x, bottom - 9.0, &small);
  return top;
}

void
sw_sheet_draw_page (cairo_t *cr, const SwAnalysis *a, double width, double height)
{
  double margin = 34.0;
  Page p = { cr, margin, width - 2 * margin };
  double y, footer_top, avail, top_h, chart_h, bottom_h, table_h, staging_h, gap = 12.0, col;
  SwStaging staging;
  gboolean have_staging;

  g_return_if_fail (cr != NULL && a != NULL);

  cairo_save (cr);
  set_color (cr, 0xffffff, 1.0);
  cairo_paint (cr);

  y = draw_header (&p, a, margin - 4.0);
  footer_top = draw_footer (&p, height - margin + 12.0);
  table_h = stage_table_height (a);
  /* The staging decision, computed once for the panel's height and drawing. */
  have_staging = a->design != NULL
                 && sw_analysis_staging (a, SW_STAGING_MAX_STAGES, &staging, NULL);
  staging_h = sw_sheet_staging_height (cr, a, have_staging ? &staging : NULL, p.w);
  avail = footer_top - gap - y - table_h - 3 * gap - staging_h - gap;
  /* The totals panel grows with its figures; the charts share the rest. */
  {
    guint rows = 8 + (a->reliability.given ? 1 : 0) + (a->has_montecarlo ? 2 : 0)
                 + (a->ascent != NULL ? 3 : 0) + (a->has_performance ? 1 : 0);
    double needed = 60.0 + (has_baseline (a) ? 23.0 : 0.0) + rows * 11.0;
    top_h = CLAMP (needed, avail * 0.34, avail * 0.46);
  }
  /* With boosters the staging panel has twice the rows: the charts keep
   * their height, the uncertainty and sensitivity panels give it up. */
  chart_h = (avail - top_h) * (a->design->boosters.count > 0 ? 0.56 : 0.49);
  bottom_h = avail - top_h - chart_h;
  col = (p.w - 18.0) / 2.0;

  /* Stack and totals. */
  {
    /* Both pictures of the vehicle: to scale in metres at the left, area
     * proportional to mass beside it. */
    double sw = MIN (266.0, p.w * 0.49), scale_w = 58.0;
    double sy = y + heading (cr, _("Stack"), p.x, y, sw - 10);
    sw_scale_draw_panel (cr, a, p.x, sy, scale_w, y + top_h - sy);
    sw_sheet_draw_stack (cr, a->design, &a->sizing,
                         has_baseline (a) ? a->design->baseline : NULL,
                         has_baseline (a) ? &a->baseline_sizing : NULL, p.x + scale_w + 4.0, sy,
                         sw - 14 - scale_w, y + top_h - sy);
    draw_totals (&p, a, p.x + sw + 8.0, y, p.w - sw - 8.0, top_h);
  }
  y += top_h + gap;

  draw_stage_table (&p, a, y);
  y += table_h + gap;
  sw_sheet_draw_staging (cr, a, have_staging ? &staging : NULL, p.x, y, p.w, staging_h);
  y += staging_h + gap;

  /* The two curves side by side: mass and risk against stage count. */
  {
    /* The curve sizes every stage: a fixed load is left out (stage_curve.note). */
    double hy = heading (cr, a->stage_curve.note[0] != '\0'
                               ? _("Liftoff mass against stage count, all sized")
                               : _("Liftoff mass against stage count"),
                         p.x, y, col);
    sw_sheet_draw_stage_curve (cr, &a->stage_curve, a->has_band ? &a->band : NULL,
                               has_baseline (a) ? &a->baseline_curve : NULL,
                               a->design->n_stages,
                               a->sizing.feasible ? a->sizing.liftoff_mass_kg : NAN, p.x,
                               y + hy + 6.0, col, chart_h - hy - 6.0);
    hy = heading (cr, _("Mission success against stage count"), p.x + col + 18.0, y, col);
    if (a->reliability.given)
      sw_sheet_draw_reliability_curve (cr, &a->reliability_curve, a->design->n_stages,
                                       p.x + col + 18.0, y + hy + 6.0, col, chart_h - hy - 6.0);
    else
      note_in_box (cr, _("Not computed: no stage gives reliability figures (engine count, "
                         "engine reliability, failures tolerated, ignition, separation)."),
                   p.x + col + 18.0, y + hy, col, chart_h - hy);
  }
  y += chart_h + gap;

  /* Uncertainty and the ranked sensitivities. */
  draw_uncertainty (&p, a, p.x, y, col, bottom_h);
  {
    double hy = heading (cr, a->all_fixed ? _("What moves the payload capability most")
                                          : _("What moves the liftoff mass most"),
                         p.x + col + 18.0, y, col);
    if (a->has_sensitivity)
      sw_sheet_draw_tornado (cr, a->design, &a->sensitivity, 6, p.x + col + 18.0, y + hy + 2.0,
                             col, bottom_h - hy - 2.0);
    else
      note_in_box (cr, a->all_fixed ? _("No sensitivities: the vehicle carries no payload to "
                                        "the mission.")
                                    : _("No sensitivities: the design is not feasible."),
                   p.x + col + 18.0, y + hy, col, bottom_h - hy);
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

/* cairo's SVG surface draws text as glyph outlines: the sheet's texts,
 * collected as <text> elements while drawing, go in before the end. */
static gboolean
add_svg_texts (const char *tmp, const char *filename, const GString *texts, GError **error)
{
  g_autofree char *data = NULL;
  g_autoptr (GError) local = NULL;
  GString *out;
  char *end;
  gboolean ok;

  if (!g_file_get_contents (tmp, &data, NULL, &local)
      || (end = g_strrstr (data, "</svg>")) == NULL)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_IO, _("Could not write %s: %s"), filename,
                   local != NULL ? local->message : _("the SVG is incomplete"));
      return FALSE;
    }
  out = g_string_new_len (data, end - data);
  g_string_append (out, "<g id=\"text\">\n");
  g_string_append_len (out, texts->str, texts->len);
  g_string_append (out, "</g>\n");
  g_string_append (out, end);
  ok = g_file_set_contents (tmp, out->str, (gssize) out->len, &local);
  g_string_free (out, TRUE);
  if (!ok)
    g_set_error (error, SW_ERROR, SW_ERROR_IO, _("Could not write %s: %s"), filename,
                 local->message);
  return ok;
}

gboolean
sw_sheet_export (const SwAnalysis *b, SwSheetFormat format, SwPaper paper, const char *filename,
                 GError **error)
{
  g_autoptr (GString) svg_texts = NULL;
  g_autofree char *tmp = NULL;
  cairo_surface_t *surface;
  cairo_t *cr;
  double w, h;
  gboolean ok;

  g_return_val_if_fail (b != NULL && filename != NULL, FALSE);

  svg_texts = g_string_new (NULL);
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
                                          sw_format_cautions ());
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

  if (format == SW_SHEET_SVG)
    sw_sheet_svg_text_begin (cr, svg_texts);
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
  if (ok && format == SW_SHEET_SVG)
    ok = add_svg_texts (tmp, filename, svg_texts, error);
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
