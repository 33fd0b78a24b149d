/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The briefing sheet's staging-decision panel: the stages command's table in
 * small print, the best stage count in the accent colour, this design's
 * count marked, the weighting stated. */
#define G_LOG_DOMAIN "sw-sheet"

#include "config.h"

#include "sw-sheet-staging.h"

#include "sw-economics.h"
#include "sw-format.h"
#include "sw-sheet-private.h"
#include "sw-staging.h"

#include <glib/gi18n-lib.h>
#include <math.h>

#define ROW_H 9.5
/* With boosters: twelve rows, a little closer. */
#define ROW_H_BOOSTERS 7.2
#define NOTE_H_BOOSTERS 7.6
/* With boosters the weighting has a line of its own, wrapped to two. */
#define WEIGHTING_H 15.2
/* Serial: the legend and the weighting share up to three wrapped lines. */
#define SERIAL_STATEMENT_LINES 3
#define SERIAL_LINE_H 7.6

static gboolean
has_boosters (const SwDesign *design)
{
  return design != NULL && design->boosters.count > 0;
}

/* A design whose losses come from the simulated ascent: one more line says
 * which losses the rows use (the first guess or the closed loop's). */
static gboolean
has_losses_note (const SwDesign *design)
{
  return design != NULL && design->mission.kind == SW_MISSION_ORBIT
         && design->mission.loss_model == SW_LOSS_SIMULATE;
}

/* A fixed propellant load is not applied to the table: one more line says so. */
static gboolean
has_fixed_load (const SwDesign *design)
{
  for (guint i = 0; design != NULL && i < design->n_stages; i++)
    if (design->stages[i].propellant.has_propellant_kg)
      return TRUE;
  return FALSE;
}

static double
row_height (const SwDesign *design)
{
  return has_boosters (design) ? ROW_H_BOOSTERS : ROW_H;
}

static double
note_height (const SwDesign *design)
{
  return has_boosters (design) ? NOTE_H_BOOSTERS : ROW_H;
}

/* The legend line under the rows (serial: with the weighting). */
static char *
dup_statement (const SwStaging *s)
{
  if (s->booster_count > 0 && s->booster_reuse_mode != SW_RECOVERY_NONE)
    {
      g_autofree char *words = sw_staging_dup_recovery_words (s);
      /* Translators: %s says how the first stage and the boosters are recovered */
      return g_strdup_printf (_("▸ this design; shaded: the best row; recovered: %s."), words);
    }
  if (s->booster_count > 0)
    return g_strdup_printf (_("▸ this design; shaded: the best row; recovered: the first "
                              "stage %s."),
                            s->reuse_mode == SW_RECOVERY_LAUNCH_SITE
                              ? _("returns to the launch site") : _("lands downrange"));
  return g_strdup_printf (_("▸ this design; shaded: the best count; recovered: the first "
                            "stage %s. %s."),
                          s->reuse_mode == SW_RECOVERY_LAUNCH_SITE
                            ? _("returns to the launch site") : _("lands downrange"),
                          s->weighting);
}

static TextStyle
serial_statement_style (double w)
{
  TextStyle st = sw_sheet_style_w (6.0, FALSE, MUTED, PANGO_ALIGN_LEFT, w);

  st.max_lines = SERIAL_STATEMENT_LINES;
  return st;
}

/* Serial: the lines the legend and the weighting take (one to three). */
static guint
serial_statement_lines (cairo_t *cr, const SwStaging *s, double w)
{
  g_autofree char *statement = NULL;
  TextStyle st = serial_statement_style (w);
  PangoLayout *layout;
  guint lines;

  if (cr == NULL || s == NULL || s->booster_count > 0)
    return 1;
  statement = dup_statement (s);
  layout = sw_sheet_layout (cr, statement, &st);
  lines = (guint) CLAMP (pango_layout_get_line_count (layout), 1, SERIAL_STATEMENT_LINES);
  g_object_unref (layout);
  return lines;
}

double
sw_sheet_staging_height (cairo_t *cr, const SwAnalysis *analysis, const SwStaging *s, double w)
{
  const SwDesign *design = analysis != NULL ? analysis->design : NULL;
  guint rows = has_boosters (design) ? 2 * SW_STAGING_MAX_STAGES : SW_STAGING_MAX_STAGES;

  /* Heading, column titles, the rows, the weighting and money lines (and
   * the lines on boosters and on fixed loads). */
  return 16.0 + row_height (design) * (rows + 1) + 12.0 + note_height (design)
         + (has_boosters (design) ? WEIGHTING_H + 2.0 * note_height (design)
                                  : serial_statement_lines (cr, s, w) * SERIAL_LINE_H
                                      - note_height (design))
         + (has_fixed_load (design) ? note_height (design) : 0.0)
         + (has_losses_note (design) ? note_height (design) : 0.0);
}

void
sw_sheet_draw_staging (cairo_t *cr, const SwAnalysis *analysis, const SwStaging *computed,
                       double x, double y, double w, double h)
{
  const SwDesign *design = analysis != NULL ? analysis->design : NULL;
  const char *titles[] = { N_("stages"), N_("liftoff"), N_("recovered"), N_("development"),
                           N_("per flight"), N_("per flight, rec."), N_("success"),
                           N_("payload, this mass") };
  const double serial_widths[] = { 0.07, 0.12, 0.12, 0.14, 0.12, 0.14, 0.11, 0.18 };
  const double booster_widths[] = { 0.14, 0.11, 0.11, 0.13, 0.11, 0.14, 0.10, 0.16 };
  const double *widths = has_boosters (design) ? booster_widths : serial_widths;
  const double row_h = row_height (design), note_h = note_height (design);
  const double font = has_boosters (design) ? 6.0 : 6.5;
  SwStaging s;
  double hy, cx, ty;
  TextStyle head;
  g_autofree char *statement = NULL;

  hy = sw_sheet_heading (cr, has_boosters (design)
                               ? _("Staging decision, serial and with boosters (work-years: an "
                                   "estimate, never a quote)")
                               : _("Staging decision (serial stages; effort in work-years: an "
                                   "estimate, never a quote)"),
                         x, y, w);
  if (design == NULL || computed == NULL)
    {
      sw_sheet_note_in_box (cr, _("Not computed: the mission has no delta-v."), x, y + hy, w,
                            h - hy);
      return;
    }
  s = *computed;
  head = sw_sheet_style_w (font, TRUE, MUTED, PANGO_ALIGN_RIGHT, 0);
  ty = y + hy;
  cx = x;
  for (guint c = 0; c < G_N_ELEMENTS (titles); c++)
    {
      head.width = widths[c] * w - 4.0;
      sw_sheet_text_at (cr, _(titles[c]), cx, ty, &head);
      cx += widths[c] * w;
    }
  ty += row_h;
  for (guint i = 0; i < s.n_rows; i++)
    {
      const SwStagingRow *r = &s.rows[i];
      gboolean best = (int) i == s.best;
      TextStyle st = sw_sheet_style_w (font, best, best ? ACCENT : INK, PANGO_ALIGN_RIGHT, 0);
      char *cells[8];

      if (best)
        {
          sw_sheet_set_color (cr, ACCENT_LIGHT, 1.0);
          cairo_rectangle (cr, x, ty - 0.5, w, row_h);
          cairo_fill (cr);
        }
      if (i == s.n_counts && s.n_rows > s.n_counts)
        {
          /* A rule between the serial rows and the booster rows. */
          sw_sheet_set_color (cr, MUTED, 1.0);
          cairo_set_line_width (cr, 0.4);
          cairo_move_to (cr, x, ty - 0.5);
          cairo_line_to (cr, x + w, ty - 0.5);
          cairo_stroke (cr);
        }
      if (r->arrangement == SW_ARRANGEMENT_BOOSTERS)
        /* Translators: a stage count with the design's strap-on boosters,
         * in a narrow column of the sheet ("2 + boosters") */
        cells[0] = g_strdup_printf (_("%s%u + boosters"), (int) i == s.design_index ? "▸ " : "",
                                    r->n_stages);
      else
        cells[0] = g_strdup_printf ("%s%u", (int) i == s.design_index ? "▸ " : "", r->n_stages);
      cells[1] = sw_format_mass (r->liftoff_mass_kg);
      cells[2] = sw_format_mass (r->liftoff_mass_reused_kg);
      cells[3] = sw_format_number (r->development_work_years, 0);
      cells[4] = sw_format_number (r->cost_per_flight_work_years, 0);
      cells[5] = sw_format_number (r->cost_per_flight_reused_work_years, 0);
      cells[6] = sw_format_probability (r->success_probability);
      cells[7] = sw_format_mass (r->payload_fixed_size_kg);
      cx = x;
      for (guint c = 0; c < G_N_ELEMENTS (cells); c++)
        {
          st.width = widths[c] * w - 4.0;
          sw_sheet_text_at (cr, cells[c], cx, ty, &st);
          cx += widths[c] * w;
          g_free (cells[c]);
        }
      ty += row_h;
    }
  statement = dup_statement (&s);

  {
    TextStyle note = sw_sheet_style_w (6.0, FALSE, MUTED, PANGO_ALIGN_LEFT, w);
    g_autofree char *money = NULL;
    TextStyle wrapped = note, serial = serial_statement_style (w);
    double money_y = ty + 1.0 + (s.booster_count > 0
                                   ? note_h : serial_statement_lines (cr, &s, w) * SERIAL_LINE_H);

    /* The weighting whole, wrapped. */
    wrapped.max_lines = 2;
    sw_sheet_text_at (cr, statement, x, ty + 1.0, s.booster_count > 0 ? &note : &serial);
    if (s.booster_count > 0)
      {
        /* The weighting in full, wrapped: the score spans both sets of rows. */
        g_autofree char *weighting = g_strconcat (s.weighting, ".", NULL);

        sw_sheet_text_at (cr, weighting, x, money_y, &wrapped);
        money_y += WEIGHTING_H;
      }
    if (s.booster_count > 0)
      {
        /* Translators: %u is the number of boosters; the short form of the
         * staging table's note on a design with strap-on boosters */
        g_autofree char *with = s.booster_reuse_mode == SW_RECOVERY_NONE
          ? g_strdup_printf (_("“+ boosters”: the same stages with this design's %u boosters "
                               "beside the core; success counts the boosters as perfect; "
                               "recovered: the core, boosters expended."),
                             s.booster_count)
          /* Translators: %u is the number of boosters */
          : g_strdup_printf (_("“+ boosters”: the same stages with this design's %u boosters "
                               "beside the core; success counts the boosters as perfect; "
                               "recovered: as this design recovers them."),
                             s.booster_count);
        sw_sheet_text_at (cr, with, x, money_y, &note);
        money_y += note_h;
        g_autofree char *thrust = NULL;

        if (s.core_thrust_to_weight_max < 1.0)
          /* Translators: %.2f is a ratio of thrust to weight */
          thrust = g_strdup_printf (_("The core alone lifts none of the serial rows (at most "
                                      "%.2f times their weight, vacuum thrust): none is a "
                                      "candidate for the best row."),
                                    s.core_thrust_to_weight_max);
        else if (s.core_thrust_to_weight_min < 1.0)
          /* Translators: %.2f and %.2f are ratios of thrust to weight */
          thrust = g_strdup_printf (_("The core alone lifts only some serial rows (%.2f to "
                                      "%.2f times their weight, vacuum thrust): those it cannot "
                                      "lift are no candidates for the best row."),
                                    s.core_thrust_to_weight_min, s.core_thrust_to_weight_max);
        else
          thrust = g_strdup (_("Rows the liftoff thrust cannot lift are no candidates for the "
                               "best row."));
        sw_sheet_text_at (cr, thrust, x, money_y, &note);
        money_y += note_h;
      }
    if (s.fixed_note[0] != '\0')
      {
        char list[SW_FIXED_NOTE_MAX];
        guint n_fixed = sw_fixed_stages_text (design, FALSE, list, sizeof list);
        g_autofree char *fixed = NULL;

        if (n_fixed == 1)
          /* Translators: %s is a stage number; the short form of the staging
           * table's note on fixed loads */
          fixed = g_strdup_printf (_("The fixed propellant load of stage %s is not applied: "
                                     "every row, this design's and the recovered columns "
                                     "included, sizes every stage."), list);
        else if (n_fixed > 1)
          /* Translators: %s is a list of stage numbers ("1 and 2"); the short
           * form of the staging table's note on fixed loads */
          fixed = g_strdup_printf (_("The fixed propellant loads of stages %s are not applied: "
                                     "every row, this design's and the recovered columns "
                                     "included, sizes every stage."), list);
        if (fixed != NULL)
          {
            sw_sheet_text_at (cr, fixed, x, money_y, &note);
            money_y += note_h;
          }
      }
    if (s.losses_note[0] != '\0')
      {
        sw_sheet_text_at (cr, s.losses_note, x, money_y, &note);
        money_y += note_h;
      }
    /* Money only with the design's cost of a work-year, in its currency. */
    if (s.has_money && s.best >= 0)
      {
        const SwStagingRow *r = &s.rows[s.best];
        const char *cur = sw_economics_currency_label (&design->economics);
        g_autofree char *wy = sw_format_number (s.work_year_cost, 0);
        g_autofree char *dev = sw_format_money (r->development_work_years * s.work_year_cost);
        g_autofree char *cpf = sw_format_money ((s.design_reuses
                                                    ? r->cost_per_flight_reused_work_years
                                                    : r->cost_per_flight_work_years)
                                                   * s.work_year_cost);
        money = g_strdup_printf (_("At %s %s per work-year, the best count: development %s %s, "
                                   "per flight %s %s. Never a quote."),
                                 wy, cur, dev, cur, cpf, cur);
      }
    else
      money = g_strdup (_("No cost of a work-year given: effort in work-years only."));
    sw_sheet_text_at (cr, money, x, money_y, &note);
  }
}
