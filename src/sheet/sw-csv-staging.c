/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-sheet"

#include "config.h"

#include "sw-csv-staging.h"

#include "sw-csv-write.h"

#include "sw-economics.h"
#include "sw-format.h"
#include "sw-limits.h"
#include "sw-staging.h"

#include <math.h>
#include <string.h>

static void
number (GString *s, double v, gboolean last)
{
  sw_csv_append_number (s, v, 15, last);
}

char *
sw_csv_staging_decision (const SwAnalysis *b)
{
  SwStaging st;
  GString *s;

  g_return_val_if_fail (b != NULL && b->design != NULL, NULL);
  if (!sw_analysis_staging (b, SW_STAGING_MAX_STAGES, &st, NULL))
    return NULL;
  s = sw_csv_begin (NULL);
  g_string_append_printf (s, "# %s\n", st.weighting);
  if (st.fixed_note[0] != '\0')
    g_string_append_printf (s, "# %s%s%s\n", st.fixed_note, st.reuse_note[0] != '\0' ? " " : "",
                            st.reuse_note);
  if (st.boosters_note[0] != '\0')
    g_string_append_printf (s, "# %s\n", st.boosters_note);
  if (st.losses_note[0] != '\0')
    g_string_append_printf (s, "# %s\n", st.losses_note);
  {
    g_autofree char *unrecovered = sw_staging_dup_unrecovered_note (&st);
    if (unrecovered != NULL)
      g_string_append_printf (s, "# %s\n", unrecovered);
  }
  /* The money columns' unit, in words: the label may hold commas. */
  if (st.has_money)
    {
      char wy[G_ASCII_DTOSTR_BUF_SIZE];
      const char *cur = sw_economics_currency_label (&b->design->economics);

      g_ascii_formatd (wy, sizeof wy, "%.15g", st.work_year_cost);
      g_string_append_printf (s, "# money in %s at %s %s per work-year. %s\n", cur, wy, cur,
                              sw_economics_money_note ());
    }
  else
    g_string_append (s, "# money: the design gives no cost of a work-year "
                        "(economics.work_year_cost); effort in work-years only\n");
  g_string_append (s, "stage_count,closes,closes_recovered,liftoff_mass_kg,"
                      "liftoff_mass_recovered_kg,recovery_payload_penalty,"
                      "development_work_years,development_recovered_work_years,"
                      "per_flight_work_years,per_flight_recovered_work_years,mission_success,"
                      "payload_at_design_liftoff_mass_kg,weighted_score,best,this_design,"
                      "development_money,per_flight_money,per_flight_recovered_money,"
                      "arrangement\n");
  for (guint i = 0; i < st.n_rows; i++)
    {
      const SwStagingRow *r = &st.rows[i];

      g_string_append_printf (s, "%u,%s,%s,", r->n_stages, r->feasible ? "true" : "false",
                              r->reused_feasible ? "true" : "false");
      number (s, r->liftoff_mass_kg, FALSE);
      number (s, r->liftoff_mass_reused_kg, FALSE);
      number (s, r->payload_penalty_fraction, FALSE);
      number (s, r->development_work_years, FALSE);
      number (s, r->development_reused_work_years, FALSE);
      number (s, r->cost_per_flight_work_years, FALSE);
      number (s, r->cost_per_flight_reused_work_years, FALSE);
      number (s, r->success_probability, FALSE);
      number (s, r->payload_fixed_size_kg, FALSE);
      number (s, r->score, FALSE);
      g_string_append_printf (s, "%s,%s,", (int) i == st.best ? "true" : "false",
                              (int) i == st.design_index ? "true" : "false");
      number (s, st.has_money ? r->development_work_years * st.work_year_cost : NAN, FALSE);
      number (s, st.has_money ? r->cost_per_flight_work_years * st.work_year_cost : NAN, FALSE);
      number (s, st.has_money ? r->cost_per_flight_reused_work_years * st.work_year_cost : NAN,
              FALSE);
      g_string_append_printf (s, "%s\n", sw_arrangement_to_string (r->arrangement));
    }
  return g_string_free (s, FALSE);
}

void
sw_csv_carpet_default_axes (const SwDesign *d, SwCarpetOptions *o)
{
  const SwLimit *eps = sw_limit_get (SW_LIMIT_STRUCTURAL_COEFFICIENT);
  const SwLimit *isp = sw_limit_get (SW_LIMIT_ISP_VAC);
  const SwStage *top;

  g_return_if_fail (d != NULL && o != NULL && d->n_stages > 0);
  top = &d->stages[d->n_stages - 1];
  memset (o, 0, sizeof *o);
  o->x.kind = SW_CARPET_PARAM_STRUCTURAL_COEFFICIENT;
  o->x.stage = 0;
  o->x.min = MAX (eps->min, 0.5 * d->stages[0].structural_coefficient);
  o->x.max = MIN (eps->max, 1.5 * d->stages[0].structural_coefficient);
  o->x.n = 21;
  o->y.kind = SW_CARPET_PARAM_ISP_VAC;
  o->y.stage = d->n_stages - 1;
  o->y.min = MAX (MAX (isp->min, top->has_isp_sl ? top->isp_sl_s : 0.0), 0.85 * top->isp_vac_s);
  o->y.max = MIN (isp->max, 1.15 * top->isp_vac_s);
  o->y.n = 21;
  o->output = SW_CARPET_LIFTOFF_MASS;
}

char *
sw_csv_carpet_text (const SwCarpet *c)
{
  g_autofree char *xn = sw_carpet_param_dup_name (&c->x);
  g_autofree char *yn = sw_carpet_param_dup_name (&c->y);
  gboolean effort = c->output == SW_CARPET_DEVELOPMENT || c->output == SW_CARPET_COST_PER_FLIGHT;
  GString *s = sw_csv_begin (NULL);

  /* A cost output with a cost per work-year: one more column, the same
   * cost in money (named by the output: "development_money"). */
  if (c->has_money)
    {
      const char *o = sw_carpet_output_to_string (c->output);
      char wy[G_ASCII_DTOSTR_BUF_SIZE];

      g_ascii_formatd (wy, sizeof wy, "%.15g", c->work_year_cost);
      g_string_append_printf (s, "# %s_money = %s_work_years x %s (%s per work-year); %s\n", o,
                              o, wy, c->currency[0] != '\0' ? c->currency : "money units",
                              sw_economics_money_note ());
    }
  /* What the grid leaves out (which losses a simulate design's points use),
   * as the staging table's CSV carries its notes. */
  if (c->note[0] != '\0')
    g_string_append_printf (s, "# %s\n", c->note);
  g_string_append_printf (s, "%s,%s,%s_%s,%s%s%scloses\n", xn, yn,
                          sw_carpet_output_to_string (c->output), effort ? "work_years" : "kg",
                          c->has_money ? sw_carpet_output_to_string (c->output) : "",
                          c->has_money ? "_money" : "", c->has_money ? "," : "");
  for (guint j = 0; j < c->y.n; j++)
    for (guint i = 0; i < c->x.n; i++)
      {
        double v = c->values[j * c->x.n + i];

        number (s, sw_carpet_axis_value (&c->x, i), FALSE);
        number (s, sw_carpet_axis_value (&c->y, j), FALSE);
        number (s, v, FALSE);
        if (c->has_money)
          number (s, c->money[j * c->x.n + i], FALSE);
        g_string_append (s, isfinite (v) ? "true\n" : "false\n");
      }
  return g_string_free (s, FALSE);
}

char *
sw_csv_carpet (const SwAnalysis *b)
{
  SwCarpetOptions o;
  g_autoptr (SwCarpet) c = NULL;

  g_return_val_if_fail (b != NULL && b->design != NULL, NULL);
  sw_csv_carpet_default_axes (b->design, &o);
  if (!(o.x.min < o.x.max) || !(o.y.min < o.y.max))
    return NULL;
  /* With the closed loop's losses once the analysis has them (the staging
   * table's route: this design's point is the totals' vehicle). */
  c = sw_analysis_carpet (b, &o, NULL);
  return c != NULL ? sw_csv_carpet_text (c) : NULL;
}
