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

/* A fixed propellant load is not applied to the table: one more line says so. */
static gboolean
has_fixed_load (const SwDesign *design)
{
  if (design != NULL && design->boosters.count > 0)
    return TRUE;    /* the line says that no row is this design */
  for (guint i = 0; design != NULL && i < design->n_stages; i++)
    if (design->stages[i].propellant.has_propellant_kg)
      return TRUE;
  return FALSE;
}

double
sw_sheet_staging_height (const SwDesign *design)
{
  /* Heading, column titles, six rows, the weighting and money lines (and
   * the line on fixed loads). */
  return 16.0 + ROW_H * (SW_STAGING_MAX_STAGES + 1) + 12.0 + ROW_H
         + (has_fixed_load (design) ? ROW_H : 0.0);
}

void
sw_sheet_draw_staging (cairo_t *cr, const SwDesign *design, double x, double y, double w,
                       double h)
{
  const char *titles[] = { N_("stages"), N_("liftoff"), N_("recovered"), N_("development"),
                           N_("per flight"), N_("per flight, rec."), N_("success"),
                           N_("payload, this mass") };
  const double widths[] = { 0.07, 0.12, 0.12, 0.14, 0.12, 0.14, 0.11, 0.18 };
  SwStaging s;
  double hy, cx, ty;
  TextStyle head = sw_sheet_style_w (6.5, TRUE, MUTED, PANGO_ALIGN_RIGHT, 0);
  g_autofree char *statement = NULL;

  hy = sw_sheet_heading (cr, _("Staging decision (serial stages; effort in work-years: an "
                               "estimate, never a quote)"),
                         x, y, w);
  if (design == NULL || !sw_staging_compute (design, SW_STAGING_MAX_STAGES, &s, NULL))
    {
      sw_sheet_note_in_box (cr, _("Not computed: the mission has no delta-v."), x, y + hy, w,
                            h - hy);
      return;
    }
  ty = y + hy;
  cx = x;
  for (guint c = 0; c < G_N_ELEMENTS (titles); c++)
    {
      head.width = widths[c] * w - 4.0;
      sw_sheet_text_at (cr, _(titles[c]), cx, ty, &head);
      cx += widths[c] * w;
    }
  ty += ROW_H;
  for (guint i = 0; i < s.n_rows; i++)
    {
      const SwStagingRow *r = &s.rows[i];
      gboolean best = (int) i == s.best;
      TextStyle st = sw_sheet_style_w (6.5, best, best ? ACCENT : INK, PANGO_ALIGN_RIGHT, 0);
      char *cells[8];

      if (best)
        {
          sw_sheet_set_color (cr, ACCENT_LIGHT, 1.0);
          cairo_rectangle (cr, x, ty - 0.5, w, ROW_H);
          cairo_fill (cr);
        }
      cells[0] = g_strdup_printf ("%s%u", r->n_stages == s.design_row ? "▸ " : "",
                                  r->n_stages);
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
      ty += ROW_H;
    }
  statement = g_strdup_printf (_("▸ this design; shaded: the best count; recovered: the first "
                                 "stage %s. %s."),
                               s.reuse_mode == SW_RECOVERY_LAUNCH_SITE
                                 ? _("returns to the launch site") : _("lands downrange"),
                               s.weighting);

  {
    TextStyle note = sw_sheet_style_w (6.0, FALSE, MUTED, PANGO_ALIGN_LEFT, w);
    g_autofree char *money = NULL;
    double money_y = ty + 1.0 + ROW_H;

    note.ellipsize = TRUE;
    sw_sheet_text_at (cr, statement, x, ty + 1.0, &note);
    if (design->boosters.count > 0)
      {
        /* Translators: the short form of the staging table's note on a
         * design with strap-on boosters */
        sw_sheet_text_at (cr, _("Every row is a serial vehicle without this design's "
                                "strap-on boosters: no row is this design."),
                          x, ty + 1.0 + ROW_H, &note);
        money_y += ROW_H;
      }
    for (guint i = 0; design->boosters.count == 0 && s.fixed_note[0] != '\0'
                      && i < design->n_stages; i++)
      if (design->stages[i].propellant.has_propellant_kg)
        {
          /* Translators: %u is a stage number; the short form of the staging
           * table's note on fixed loads */
          g_autofree char *fixed = g_strdup_printf (_("The fixed propellant load of stage %u "
                                                      "is not applied: every row, this "
                                                      "design's and the recovered columns "
                                                      "included, sizes every stage."), i + 1);
          sw_sheet_text_at (cr, fixed, x, ty + 1.0 + ROW_H, &note);
          money_y += ROW_H;
          break;
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
