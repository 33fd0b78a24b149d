/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-sheet"

#include "config.h"

#include "sw-csv.h"

#include "sw-csv-staging.h"
#include "sw-csv-write.h"
#include "sw-format.h"

#include <errno.h>
#include <glib/gi18n-lib.h>
#include <glib/gstdio.h>
#include <math.h>
#include <string.h>

static void
csv_number (GString *s, double v, gboolean last)
{
  sw_csv_append_number (s, v, 10, last);
}

/* RFC 4180 quoting. */
static void
csv_text (GString *s, const char *text, gboolean last)
{
  if (strpbrk (text, ",\"\n\r") != NULL)
    {
      g_string_append_c (s, '"');
      for (const char *p = text; *p != '\0'; p++)
        {
          if (*p == '"')
            g_string_append_c (s, '"');
          g_string_append_c (s, *p);
        }
      g_string_append_c (s, '"');
    }
  else
    g_string_append (s, text);
  g_string_append_c (s, last ? '\n' : ',');
}

char *
sw_csv_stage_table (const SwAnalysis *b)
{
  const SwSizing *sz = &b->sizing;
  GString *s = sw_csv_begin ("stage,name,isp_vac_s,structural_coefficient,delta_v_m_s,"
                          "delta_v_share,mass_ratio,propellant_mass_kg,structural_mass_kg,"
                          "initial_mass_kg,burnout_mass_kg,feasible,unused,stage_success");

  for (guint i = 0; i < sz->n_stages; i++)
    {
      const SwStageResult *r = &sz->stages[i];
      g_string_append_printf (s, "%u,", i + 1);
      csv_text (s, b->design->stages[i].name, FALSE);
      csv_number (s, b->design->stages[i].isp_vac_s, FALSE);
      csv_number (s, b->design->stages[i].structural_coefficient, FALSE);
      csv_number (s, r->delta_v_m_s, FALSE);
      csv_number (s, r->delta_v_share, FALSE);
      csv_number (s, r->mass_ratio, FALSE);
      csv_number (s, r->propellant_mass_kg, FALSE);
      csv_number (s, r->structural_mass_kg, FALSE);
      csv_number (s, r->initial_mass_kg, FALSE);
      csv_number (s, r->burnout_mass_kg, FALSE);
      g_string_append (s, r->feasible ? "true," : "false,");
      g_string_append (s, r->unused ? "true," : "false,");
      csv_number (s, b->reliability.given ? b->reliability.stage[i] : NAN, TRUE);
    }
  /* The boosters, all of them together; no delta-v of their own (phase 0's
   * is in stage 1's, so the column still adds up to the total). */
  if (sz->boosters.present)
    {
      const SwBoosterResult *bo = &sz->boosters;
      g_string_append (s, "boosters,");
      csv_text (s, b->design->boosters.name, FALSE);
      csv_number (s, b->design->boosters.isp_vac_s, FALSE);
      csv_number (s, b->design->boosters.structural_coefficient, FALSE);
      g_string_append (s, ",,,");
      csv_number (s, bo->count * bo->propellant_mass_kg, FALSE);
      csv_number (s, bo->count * bo->structural_mass_kg, FALSE);
      csv_number (s, bo->phase_initial_mass_kg, FALSE);
      csv_number (s, bo->phase_final_mass_kg, FALSE);
      g_string_append (s, sz->feasible ? "true,false," : "false,false,");
      csv_number (s, NAN, TRUE);
    }
  g_string_append (s, "total,,,,");
  csv_number (s, sz->delta_v_m_s, FALSE);
  g_string_append (s, "1,,");
  csv_number (s, sw_sizing_total (sz, SW_TOTAL_PROPELLANT), FALSE);
  csv_number (s, sw_sizing_total (sz, SW_TOTAL_STRUCTURE), FALSE);
  csv_number (s, sz->feasible ? sz->liftoff_mass_kg : NAN, FALSE);
  g_string_append (s, ",");
  g_string_append (s, sz->feasible ? "true,," : "false,,");
  csv_number (s, b->reliability.given ? b->reliability.mission : NAN, TRUE);
  return g_string_free (s, FALSE);
}

char *
sw_csv_stage_curve (const SwAnalysis *b)
{
  GString *s = sw_csv_begin ("stages,feasible,liftoff_mass_kg,delta_v_limit_m_s,"
                          "liftoff_mass_p05_kg,liftoff_mass_p50_kg,liftoff_mass_p95_kg,"
                          "baseline_liftoff_mass_kg,mission_success");

  for (guint i = 0; i < b->stage_curve.n_points; i++)
    {
      const SwStageCountPoint *p = &b->stage_curve.points[i];
      g_string_append_printf (s, "%u,%s,", p->stages, p->feasible ? "true" : "false");
      csv_number (s, p->liftoff_mass_kg, FALSE);
      csv_number (s, p->delta_v_limit_m_s, FALSE);
      csv_number (s, b->has_band && i < b->band.n_points ? b->band.p05[i] : NAN, FALSE);
      csv_number (s, b->has_band && i < b->band.n_points ? b->band.p50[i] : NAN, FALSE);
      csv_number (s, b->has_band && i < b->band.n_points ? b->band.p95[i] : NAN, FALSE);
      csv_number (s, b->has_baseline && b->baseline_ok && i < b->baseline_curve.n_points
                       ? b->baseline_curve.points[i].liftoff_mass_kg : NAN, FALSE);
      csv_number (s, b->reliability.given && i < b->reliability_curve.n_points
                       ? b->reliability_curve.mission[i] : NAN, TRUE);
    }
  return g_string_free (s, FALSE);
}

char *
sw_csv_sweep (const SwAnalysis *b)
{
  GString *s = sw_csv_begin ("stages,delta_v_m_s,liftoff_mass_kg");

  for (guint c = 0; c < b->sweep.n_curves; c++)
    {
      const SwSweepCurve *curve = &b->sweep.curves[c];
      for (guint j = 0; j < curve->n_points; j++)
        {
          g_string_append_printf (s, "%u,", curve->stages);
          csv_number (s, curve->delta_v_m_s[j], FALSE);
          csv_number (s, curve->liftoff_mass_kg[j], TRUE);
        }
    }
  return g_string_free (s, FALSE);
}

/* The payload curves of a vehicle that exists: one row per point, the
 * altitude curve first (curve "altitude", x in km), then the inclination
 * curve (curve "inclination", x in degrees); NULL when they do not apply. */
char *
sw_csv_payload_curves (const SwAnalysis *b)
{
  const SwPayloadCurve *curves[] = { &b->payload_curves.altitude,
                                     &b->payload_curves.inclination };
  const char *names[] = { "altitude", "inclination" };
  GString *s;

  if (!b->ok || !b->payload_curves.applies)
    return NULL;
  s = sw_csv_begin ("curve,altitude_km,inclination_deg,payload_kg,delta_v_m_s,losses_m_s,"
                    "losses_simulated,reason");
  for (guint c = 0; c < G_N_ELEMENTS (curves); c++)
    for (guint i = 0; i < curves[c]->n_points; i++)
      {
        const SwPayloadPoint *p = &curves[c]->points[i];
        g_string_append_printf (s, "%s,", names[c]);
        csv_number (s, c == 0 ? p->x : b->payload_curves.altitude_km, FALSE);
        csv_number (s, c == 1 ? p->x : b->payload_curves.inclination_deg, FALSE);
        csv_number (s, p->reachable ? p->payload_kg : NAN, FALSE);
        csv_number (s, p->delta_v_m_s, FALSE);
        csv_number (s, p->losses_m_s, FALSE);
        g_string_append (s, p->simulated ? "true," : "false,");
        csv_text (s, p->reason, TRUE);
      }
  return g_string_free (s, FALSE);
}

char *
sw_csv_reliability (const SwAnalysis *b)
{
  GString *s;

  if (!b->reliability.given)
    return NULL;
  s = sw_csv_begin ("stages,mission_success");
  for (guint i = 0; i < b->reliability_curve.n_points; i++)
    {
      g_string_append_printf (s, "%u,", i + 1);
      csv_number (s, b->reliability_curve.mission[i], TRUE);
    }
  return g_string_free (s, FALSE);
}

char *
sw_csv_tornado (const SwAnalysis *b)
{
  const SwSensitivityTable *t = &b->sensitivity;
  GString *s;

  if (!b->has_sensitivity || !t->feasible)
    return NULL;
  /* output: what the derivatives and steps are of (a vehicle whose every
   * load is fixed has a constant liftoff mass: its payload capability). */
  s = sw_csv_begin ("rank,parameter,stage,label,value,derivative_kg_per_unit,elasticity,"
                 "step_percent,minus_step_kg,plus_step_kg,exchange_ratio_kg_per_kg,output");
  for (guint r = 0; r < t->n_items; r++)
    {
      const SwSensitivity *it = &t->items[t->ranked[r]];
      g_autofree char *label = sw_sensitivity_dup_label (b->design, it);

      g_string_append_printf (s, "%u,%s,", r + 1, sw_sens_param_to_string (it->param));
      if (it->stage >= 0)
        g_string_append_printf (s, "%d,", it->stage + 1);
      else
        g_string_append_c (s, ',');
      csv_text (s, label, FALSE);
      csv_number (s, it->value, FALSE);
      csv_number (s, it->derivative, FALSE);
      csv_number (s, it->elasticity, FALSE);
      csv_number (s, t->step * 100.0, FALSE);
      csv_number (s, it->minus_kg, FALSE);
      csv_number (s, it->plus_kg, FALSE);
      csv_number (s, it->param == SW_SENS_STRUCTURAL_COEFFICIENT && it->stage >= 0
                       ? t->exchange_ratio[it->stage] : NAN, FALSE);
      csv_text (s, t->capability ? "payload_capability_kg" : "liftoff_mass_kg", TRUE);
    }
  return g_string_free (s, FALSE);
}

char *
sw_csv_histogram (const SwAnalysis *b)
{
  const SwMonteCarlo *mc = &b->montecarlo;
  GString *s;

  if (!b->has_montecarlo)
    return NULL;
  s = sw_csv_begin ("quantity,bin,lower,upper,count");
  /* A vehicle that exists: its liftoff mass is one value; its payload
   * capability (the fixed vehicle's payload) and delta-v margin at the
   * nominal payload are the outputs. */
  for (guint q = mc->all_fixed ? 1 : 0; q < (mc->all_fixed ? 3u : 2u); q++)
    {
      const SwMcSummary *sum = q == 0 ? &mc->liftoff : q == 1 ? &mc->payload : &mc->margin;
      const char *name = q == 0 ? "liftoff_mass_kg"
                         : q == 1 ? "fixed_vehicle_payload_kg" : "delta_v_margin_m_s";
      double width = (sum->bin_hi - sum->bin_lo) / SW_MC_BINS;

      for (guint i = 0; sum->n > 0 && i < SW_MC_BINS; i++)
        {
          g_string_append_printf (s, "%s,%u,", name, i + 1);
          csv_number (s, sum->bin_lo + i * width, FALSE);
          csv_number (s, sum->bin_lo + (i + 1) * width, FALSE);
          g_string_append_printf (s, "%u\n", sum->bins[i]);
        }
    }
  return g_string_free (s, FALSE);
}

gboolean
sw_csv_export (const SwAnalysis *b, const char *dir, GPtrArray *written, GError **error)
{
  struct { const char *name; char *(*make) (const SwAnalysis *); } files[] = {
    { "stages.csv", sw_csv_stage_table },
    { "stage-count.csv", sw_csv_stage_curve },
    { "delta-v-sweep.csv", sw_csv_sweep },
    { "sensitivity.csv", sw_csv_tornado },
    { "reliability.csv", sw_csv_reliability },
    { "uncertainty-histogram.csv", sw_csv_histogram },
    { "stage-decision.csv", sw_csv_staging_decision },
    { "carpet.csv", sw_csv_carpet },
    { "payload-curves.csv", sw_csv_payload_curves },
  };

  g_return_val_if_fail (b != NULL && dir != NULL, FALSE);

  if (g_mkdir_with_parents (dir, 0755) != 0)
    {
      int saved = errno;
      g_set_error (error, SW_ERROR, SW_ERROR_IO, _("Could not create the folder %s: %s"), dir,
                   g_strerror (saved));
      return FALSE;
    }
  for (guint i = 0; i < G_N_ELEMENTS (files); i++)
    {
      g_autofree char *text = files[i].make (b);
      g_autofree char *path = NULL;
      g_autoptr (GError) local = NULL;

      if (text == NULL)
        continue;
      path = g_build_filename (dir, files[i].name, NULL);
      if (!g_file_set_contents_full (path, text, -1, G_FILE_SET_CONTENTS_CONSISTENT, 0644,
                                     &local))
        {
          g_set_error (error, SW_ERROR, SW_ERROR_IO, _("Could not write %s: %s"), path,
                       local->message);
          return FALSE;
        }
      if (written != NULL)
        g_ptr_array_add (written, g_steal_pointer (&path));
    }
  return TRUE;
}
