/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-staging"

#include "config.h"

#include "sw-staging.h"

#include "sw-booster-sizing.h"
#include "sw-budget.h"
#include "sw-cost.h"
#include "sw-economics.h"
#include "sw-fixed-vehicle.h"
#include "sw-format.h"
#include "sw-reliability.h"
#include "sw-reuse.h"
#include "sw-sizing.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

static void
row_costs (const SwDesign *design, const SwSizing *sizing, gboolean recovered, double *dev,
           double *per_flight)
{
  SwCostVehicle vehicle;
  SwCost cost;

  sw_cost_vehicle_from_sizing (&vehicle, sizing, design);
  vehicle.recovered_first_stage = recovered;
  sw_cost_compute (design, &vehicle, &cost);
  *dev = cost.development_work_years;
  *per_flight = cost.cost_per_flight_work_years;
}

/* The best value of one criterion over the feasible rows (NAN if none). */
static double
best_of (const SwStaging *s, gsize offset)
{
  double best = NAN;

  for (guint i = 0; i < s->n_rows; i++)
    {
      double v = *(const double *) ((const char *) &s->rows[i] + offset);
      if (s->rows[i].feasible && isfinite (v) && !(v >= best))
        best = v;
    }
  return best;
}

static void
append_weight (GString *text, double weight, const char *what)
{
  if (weight <= 0.0)
    return;
  if (text->len > 0)
    g_string_append (text, ", ");
  g_string_append_printf (text, "%s %g", what, weight);
}

char *
sw_staging_dup_recovery_words (const SwStaging *staging)
{
  const char *core, *boosters;

  g_return_val_if_fail (staging != NULL, NULL);
  core = staging->reuse_mode == SW_RECOVERY_LAUNCH_SITE ? _("first stage returns to the launch site")
         : staging->reuse_mode == SW_RECOVERY_DOWNRANGE ? _("first stage lands downrange")
         : _("first stage expended");
  if (staging->booster_count == 0)
    return g_strdup (core);
  boosters = staging->booster_reuse_mode == SW_RECOVERY_LAUNCH_SITE
               ? _("boosters return to the launch site")
             : staging->booster_reuse_mode == SW_RECOVERY_DOWNRANGE ? _("boosters land downrange")
             : _("boosters expended");
  /* Translators: how the first stage and the boosters are recovered */
  return g_strdup_printf (_("%s, %s"), core, boosters);
}

const char *
sw_arrangement_to_string (SwArrangement arrangement)
{
  return arrangement == SW_ARRANGEMENT_BOOSTERS ? "boosters" : "serial";
}

const SwStagingRow *
sw_staging_row (const SwStaging *staging, SwArrangement arrangement, guint n_stages)
{
  g_return_val_if_fail (staging != NULL, NULL);
  for (guint i = 0; i < staging->n_rows; i++)
    if (staging->rows[i].arrangement == arrangement && staging->rows[i].n_stages == n_stages)
      return &staging->rows[i];
  return NULL;
}

/* A row's figures from the expendable and recovered sizings. */
static void
fill_row (SwStagingRow *row, const SwDesign *design, const SwReuse *reuse)
{
  row->feasible = reuse->expendable.feasible;
  /* A vehicle that does not close flies no mission: no success figure. */
  if (!row->feasible)
    row->success_probability = NAN;
  row->reused_feasible = reuse->reusable.feasible;
  row->boosters_optimised_away = !row->feasible && reuse->expendable.boosters.optimised_away;
  g_strlcpy (row->reason, reuse->expendable.reason, sizeof row->reason);
  if (row->feasible && !row->reused_feasible)
    g_strlcpy (row->reused_reason, reuse->reusable.reason, sizeof row->reused_reason);
  if (row->feasible)
    {
      row->liftoff_mass_kg = reuse->expendable.liftoff_mass_kg;
      row_costs (design, &reuse->expendable, FALSE, &row->development_work_years,
                 &row->cost_per_flight_work_years);
    }
  if (row->reused_feasible)
    {
      SwCostVehicle vehicle;
      SwCost cost;

      row->liftoff_mass_reused_kg = reuse->reusable.liftoff_mass_kg;
      row->payload_penalty_fraction = reuse->payload_penalty_fraction;
      if (reuse->mode != SW_RECOVERY_NONE)
        row->recovery_propellant_kg = reuse->recovery_propellant_kg;
      if (reuse->booster_mode != SW_RECOVERY_NONE)
        row->booster_recovery_propellant_kg = reuse->booster_recovery_propellant_kg;
      sw_cost_vehicle_from_sizing (&vehicle, &reuse->reusable, design);
      /* The cost model takes the landed dry mass, not the recovery
       * propellant the sizing carries as inert mass (first stage and
       * boosters alike). */
      vehicle.dry_mass_kg[0] = reuse->first_stage_dry_kg;
      vehicle.recovered_first_stage = reuse->mode != SW_RECOVERY_NONE;
      if (reuse->booster_mode != SW_RECOVERY_NONE && vehicle.booster_count > 0)
        {
          vehicle.booster_dry_mass_kg = reuse->booster_dry_kg;
          vehicle.recovered_boosters = TRUE;
        }
      sw_cost_compute (design, &vehicle, &cost);
      row->development_reused_work_years = cost.development_work_years;
      row->cost_per_flight_reused_work_years = cost.cost_per_flight_work_years;
    }
}

static void
init_row (SwStagingRow *row, guint n, SwArrangement arrangement, const SwReliabilityCurve *rel)
{
  row->n_stages = n;
  row->arrangement = arrangement;
  row->liftoff_mass_kg = row->liftoff_mass_reused_kg = NAN;
  row->payload_penalty_fraction = NAN;
  row->recovery_propellant_kg = row->booster_recovery_propellant_kg = NAN;
  row->development_work_years = row->development_reused_work_years = NAN;
  row->cost_per_flight_work_years = row->cost_per_flight_reused_work_years = NAN;
  /* With boosters: the boosters counted as perfect (no reliability keys). */
  row->success_probability = rel->given ? rel->mission[n - 1] : NAN;
  row->payload_fixed_size_kg = NAN;
  row->score = NAN;
}

static void
boosters_note (SwStaging *out, const SwDesign *design)
{
  g_autofree char *which = NULL;
  const char *rest;

  /* Translators: %u is the number of strap-on boosters, %u then a stage count */
  which = g_strdup_printf (g_dngettext (GETTEXT_PACKAGE,
                                        "Rows \"with boosters\" carry this design's %u strap-on "
                                        "booster beside the core; the one of %u stages is this "
                                        "design. The serial rows are the same stages without it.",
                                        "Rows \"with boosters\" carry this design's %u strap-on "
                                        "boosters beside the core; the one of %u stages is this "
                                        "design. The serial rows are the same stages without "
                                        "them.",
                                        design->boosters.count),
                           design->boosters.count, design->n_stages);
  if (out->booster_reuse_mode == SW_RECOVERY_NONE)
    rest = _("Mission success counts the boosters as perfect (they have no reliability keys); "
             "the recovered columns of the booster rows recover the core and expend the "
             "boosters.");
  else if (out->reuse_mode == SW_RECOVERY_NONE)
    rest = _("Mission success counts the boosters as perfect (they have no reliability keys); "
             "the recovered columns of the booster rows recover the boosters as this design "
             "does and expend the core.");
  else
    rest = _("Mission success counts the boosters as perfect (they have no reliability keys); "
             "the recovered columns of the booster rows recover the core and the boosters as "
             "this design does.");
  g_snprintf (out->boosters_note, sizeof out->boosters_note, "%s %s", which, rest);
}

static gboolean staging_compute (const SwDesign *design, guint max_stages, gboolean looped,
                                 SwStaging *out, GError **error);

gboolean
sw_staging_compute (const SwDesign *design, guint max_stages, SwStaging *out, GError **error)
{
  return staging_compute (design, max_stages, FALSE, out, error);
}

gboolean
sw_staging_compute_looped (const SwDesign *looped, guint max_stages, SwStaging *out,
                           GError **error)
{
  return staging_compute (looped, max_stages, TRUE, out, error);
}

static gboolean
staging_compute (const SwDesign *design, guint max_stages, gboolean looped, SwStaging *out,
                 GError **error)
{
  const SwEconomics *e;
  SwReliabilityCurve rel;
  SwSizing own;
  SwParallelVehicle pv;
  double dv, failure_best, best_score = INFINITY;
  double best_mass, best_dev, best_cost;
  guint grounded = 0;
  g_autoptr (GString) text = g_string_new (NULL);

  g_return_val_if_fail (design != NULL && out != NULL && design->n_stages > 0, FALSE);

  if (!sw_design_required_delta_v (design, &dv, error))
    return FALSE;
  e = &design->economics;
  memset (out, 0, sizeof *out);
  out->n_counts = CLAMP (max_stages, 1, SW_STAGING_MAX_STAGES);
  out->n_rows = out->n_counts;
  out->design_stages = design->n_stages;
  out->design_row = design->n_stages;
  out->design_index = -1;
  /* A design that recovers something: the recovered columns as it does
   * (boosters only: the core expended); an expendable design: the first
   * stage landing downrange, to show what recovery would cost. */
  out->booster_reuse_mode = design->boosters.count > 0 ? e->booster_recovery_mode
                                                       : SW_RECOVERY_NONE;
  out->design_reuses = e->recovery_mode != SW_RECOVERY_NONE
                       || out->booster_reuse_mode != SW_RECOVERY_NONE;
  out->reuse_mode = e->recovery_mode != SW_RECOVERY_NONE ? e->recovery_mode
                    : out->design_reuses ? SW_RECOVERY_NONE : SW_RECOVERY_DOWNRANGE;
  out->weight_liftoff_mass = e->weight_liftoff_mass;
  out->weight_development = e->weight_development;
  out->weight_cost_per_flight = e->weight_cost_per_flight;
  out->weight_failure = e->weight_failure;
  out->has_money = e->has_work_year_cost;
  out->work_year_cost = e->has_work_year_cost ? e->work_year_cost : NAN;
  out->best = -1;
  out->core_thrust_to_weight_min = out->core_thrust_to_weight_max = NAN;

  if (!sw_size_design (design, &own, error))
    return FALSE;
  out->design_liftoff_mass_kg = own.feasible ? own.liftoff_mass_kg : NAN;

  /* sw_size_design has checked the core's thrust. */
  if (design->boosters.count > 0 && sw_parallel_vehicle_from_design (&pv, design, NULL))
    {
      out->booster_count = design->boosters.count;
      out->design_arrangement = SW_ARRANGEMENT_BOOSTERS;
      out->n_rows = 2 * out->n_counts;
      boosters_note (out, design);
      for (guint i = 0; i < SW_MAX_STAGES; i++)
        pv.fixed_kg[i] = 0.0;
    }
  if (design->n_stages <= out->n_counts)
    out->design_index = (int) (design->n_stages - 1)
                        + (out->booster_count > 0 ? (int) out->n_counts : 0);
  if (design->mission.kind == SW_MISSION_ORBIT && design->mission.loss_model == SW_LOSS_SIMULATE)
    {
      SwBudget b;
      g_autofree char *losses = sw_design_budget (design, &b, NULL)
                                  ? sw_format_speed (b.losses_m_s) : g_strdup ("?");
      if (looped)
        /* Translators: %s is a speed ("1,868 m/s") */
        g_snprintf (out->losses_note, sizeof out->losses_note,
                    _("Every row is sized with the closed loop's losses of %s, flown by this "
                      "design's own vehicle; the other stage counts are not flown."),
                    losses);
      else
        /* Translators: %s is a speed ("2,500 m/s") */
        g_snprintf (out->losses_note, sizeof out->losses_note,
                    _("Every row is sized with the loss allowance of %s, the design's first "
                      "guess for its closed loop; the totals use the closed loop's losses."),
                    losses);
    }
  sw_reliability_curve_compute (design, out->n_counts, &rel);
  out->reliability_given = rel.given;
  {
    char list[SW_FIXED_NOTE_MAX];
    guint n_fixed = sw_fixed_stages_text (design, TRUE, list, sizeof list);

    if (n_fixed > 0)
      {
        if (n_fixed == 1)
          /* Translators: %s is a stage number and its name, "2 (Upper stage)" */
          g_snprintf (out->fixed_note, sizeof out->fixed_note,
                      _("Every stage count is sized from the payload up, this design's own "
                        "included: the fixed propellant load of stage %s is not applied."),
                      list);
        else
          /* Translators: %s is a list of stage numbers with their names,
           * "1 (First stage) and 2 (Upper stage)" */
          g_snprintf (out->fixed_note, sizeof out->fixed_note,
                      _("Every stage count is sized from the payload up, this design's own "
                        "included: the fixed propellant loads of stages %s are not applied."),
                      list);
        g_strlcpy (out->reuse_note, _("The recovered columns resize every stage too."),
                   sizeof out->reuse_note);
      }
  }

  for (guint n = 1; n <= out->n_counts; n++)
    {
      SwStagingRow *row = &out->rows[n - 1];
      SwStageSet set;
      SwReuse reuse;
      SwSplitMode split = n == design->n_stages || design->split != SW_SPLIT_MANUAL
                            ? design->split : SW_SPLIT_OPTIMAL;

      init_row (row, n, SW_ARRANGEMENT_SERIAL, &rel);
      /* The design's own stages as they are (a manual split keeps its
       * shares); other counts with the stage-count curve's rule. */
      if (n == design->n_stages)
        sw_stage_set_from_design (&set, design);
      else
        sw_stage_set_extend (&set, design, n);
      sw_reuse_compute (&set, design->payload_kg, dv, split, e, out->reuse_mode, &reuse);
      fill_row (row, design, &reuse);
      /* Sizing is linear in the payload: the vehicle of the design's
       * liftoff mass carries payload times the ratio of the masses.  The
       * fixed-vehicle root finder gives the same (tests check). */
      if (row->feasible && isfinite (out->design_liftoff_mass_kg))
        row->payload_fixed_size_kg = design->payload_kg * out->design_liftoff_mass_kg
                                     / row->liftoff_mass_kg;
    }

  for (guint n = 1; out->booster_count > 0 && n <= out->n_counts; n++)
    {
      SwStagingRow *row = &out->rows[out->n_counts + n - 1];
      SwReuse reuse;
      SwSplitMode split = n == design->n_stages || design->split != SW_SPLIT_MANUAL
                            ? design->split : SW_SPLIT_OPTIMAL;

      init_row (row, n, SW_ARRANGEMENT_BOOSTERS, &rel);
      if (n == design->n_stages)
        sw_stage_set_from_design (&pv.set, design);
      else
        sw_stage_set_extend (&pv.set, design, n);
      sw_reuse_compute_parallel (&pv, design->payload_kg, dv, split, e, out->reuse_mode, &reuse);
      fill_row (row, design, &reuse);
      /* Not linear with boosters (their thrust is absolute): the root. */
      if (row->feasible && isfinite (out->design_liftoff_mass_kg))
        {
          double guess = design->payload_kg * out->design_liftoff_mass_kg / row->liftoff_mass_kg;
          if (n == design->n_stages
              && fabs (row->liftoff_mass_kg - out->design_liftoff_mass_kg)
                   <= 1e-12 * out->design_liftoff_mass_kg)
            row->payload_fixed_size_kg = design->payload_kg;
          else
            sw_parallel_payload_at_mass (&pv, dv, split, out->design_liftoff_mass_kg, guess,
                                         &row->payload_fixed_size_kg);
        }
    }

  /* Booster rows whose sized boosters are optimised away: say which. */
  {
    g_autoptr (GString) counts = g_string_new (NULL);
    guint away = 0;

    for (guint n = 1; out->booster_count > 0 && n <= out->n_counts; n++)
      if (out->rows[out->n_counts + n - 1].boosters_optimised_away)
        {
          g_string_append_printf (counts, "%s%u", away > 0 ? ", " : "", n);
          away++;
        }
    if (away > 0)
      {
        char away_text[SW_REASON_MAX];

        /* Translators: %s is a list of stage counts ("3, 4, 5"); the sentence
         * follows the note on the booster rows */
        g_snprintf (away_text, sizeof away_text,
                    g_dngettext (GETTEXT_PACKAGE,
                                 "With boosters at %s stages the sized boosters are optimised away "
                                 "(the lightest vehicle gives them no propellant): that row is no "
                                 "vehicle with boosters, left empty and no candidate.",
                                 "With boosters at %s stages the sized boosters are optimised away "
                                 "(the lightest vehicle gives them no propellant): those rows are no "
                                 "vehicle with boosters, left empty and no candidates.",
                                 away),
                    counts->str);
        g_strlcat (out->boosters_note, " ", sizeof out->boosters_note);
        g_strlcat (out->boosters_note, away_text, sizeof out->boosters_note);
      }
  }

  /* Say so when the core alone lifts not every serial row (vacuum thrust
   * over the liftoff weight; such rows are no candidates for the best). */
  if (out->booster_count > 0 && isfinite (pv.core_thrust_n) && pv.core_thrust_n > 0.0)
    {
      double lo = INFINITY, hi = -INFINITY;
      char thrust[SW_REASON_MAX];

      for (guint i = 0; i < out->n_counts; i++)
        if (out->rows[i].feasible)
          {
            double tw = pv.core_thrust_n / (out->rows[i].liftoff_mass_kg * SW_G0);
            lo = MIN (lo, tw);
            hi = MAX (hi, tw);
          }
      if (isfinite (lo))
        {
          out->core_thrust_to_weight_min = lo;
          out->core_thrust_to_weight_max = hi;
        }
      if (lo < 1.0)
        {
          if (hi < 1.0)
            /* Translators: %.2f is a ratio of thrust to weight */
            g_snprintf (thrust, sizeof thrust,
                        _("The core's engines alone lift none of the serial rows (at most "
                          "%.2f times their weight at liftoff, vacuum thrust): none of them is "
                          "a candidate for the best row."),
                        hi);
          else
            /* Translators: %.2f and %.2f are ratios of thrust to weight */
            g_snprintf (thrust, sizeof thrust,
                        _("The core's engines alone lift only some of the serial rows (%.2f "
                          "to %.2f times their weight at liftoff, vacuum thrust): those they "
                          "cannot lift are no candidates for the best row."),
                        lo, hi);
          g_strlcat (out->boosters_note, " ", sizeof out->boosters_note);
          g_strlcat (out->boosters_note, thrust, sizeof out->boosters_note);
        }
    }

  /* The liftoff thrust over each row's weight (vacuum thrust, the design's
   * first stage and, in a booster row, its boosters). */
  {
    const SwStage *first = &design->stages[0];
    guint engines = first->reliability.has_engine_count ? first->reliability.engine_count : 0;
    double f1 = sw_stage_thrust_vac_n (&first->propulsion, engines);
    double fb = design->boosters.count * design->boosters.thrust_vac_kn * 1000.0;

    for (guint i = 0; i < out->n_rows; i++)
      {
        SwStagingRow *row = &out->rows[i];
        double f = f1 + (row->arrangement == SW_ARRANGEMENT_BOOSTERS ? fb : 0.0);

        row->liftoff_thrust_to_weight = row->feasible && isfinite (f1) && f1 > 0.0
                                          ? f / (row->liftoff_mass_kg * SW_G0) : NAN;
      }
  }

  /* The score: each criterion relative to its best stage count. */
  best_mass = best_of (out, G_STRUCT_OFFSET (SwStagingRow, liftoff_mass_kg));
  best_dev = best_of (out, out->design_reuses
                             ? G_STRUCT_OFFSET (SwStagingRow, development_reused_work_years)
                             : G_STRUCT_OFFSET (SwStagingRow, development_work_years));
  best_cost = best_of (out, out->design_reuses
                              ? G_STRUCT_OFFSET (SwStagingRow, cost_per_flight_reused_work_years)
                              : G_STRUCT_OFFSET (SwStagingRow, cost_per_flight_work_years));
  failure_best = NAN;
  if (rel.given)
    for (guint i = 0; i < out->n_rows; i++)
      if (out->rows[i].feasible && !(1.0 - out->rows[i].success_probability >= failure_best))
        failure_best = 1.0 - out->rows[i].success_probability;
  for (guint i = 0; i < out->n_rows; i++)
    {
      SwStagingRow *row = &out->rows[i];
      double dev = out->design_reuses ? row->development_reused_work_years
                                      : row->development_work_years;
      double cost = out->design_reuses ? row->cost_per_flight_reused_work_years
                                       : row->cost_per_flight_work_years;
      double score = 0.0;

      if (!row->feasible || (out->design_reuses && !row->reused_feasible))
        continue;
      if (best_mass > 0.0)
        score += out->weight_liftoff_mass * row->liftoff_mass_kg / best_mass;
      if (best_dev > 0.0)
        score += out->weight_development * dev / best_dev;
      if (best_cost > 0.0)
        score += out->weight_cost_per_flight * cost / best_cost;
      if (rel.given && failure_best > 0.0)
        score += out->weight_failure * (1.0 - row->success_probability) / failure_best;
      row->score = score;
      /* A row the design's thrust cannot lift is no candidate. */
      if (row->liftoff_thrust_to_weight < 1.0)
        {
          grounded++;
          continue;
        }
      if (score < best_score)
        {
          best_score = score;
          out->best = (int) i;
        }
    }

  append_weight (text, out->weight_liftoff_mass, _("liftoff mass"));
  append_weight (text, out->weight_development, _("development effort"));
  append_weight (text, out->weight_cost_per_flight,
                 !out->design_reuses ? _("cost per flight (expendable)")
                 : out->booster_reuse_mode == SW_RECOVERY_NONE
                   ? _("cost per flight (first stage reused)")
                 : out->reuse_mode == SW_RECOVERY_NONE ? _("cost per flight (boosters reused)")
                 : _("cost per flight (first stage and boosters reused)"));
  if (rel.given)
    append_weight (text, out->weight_failure, _("failure probability"));
  if (text->len == 0)
    g_string_append (text, _("no criterion weighted"));
  if (out->booster_count > 0)
    g_snprintf (out->weighting, sizeof out->weighting,
                _("Weights: %s; each criterion divided by its best row, serial and with "
                  "boosters alike, the lowest sum wins"),
                text->str);
  else
    g_snprintf (out->weighting, sizeof out->weighting,
                _("Weights: %s; each criterion divided by its best stage count, the lowest sum "
                  "wins"),
                text->str);
  if (grounded > 0)
    g_strlcat (out->weighting,
               _("; rows the design's liftoff thrust cannot lift (vacuum thrust below their "
                 "weight) are not candidates"), sizeof out->weighting);
  return TRUE;
}

char *
sw_staging_dup_unrecovered_note (const SwStaging *staging)
{
  GString *s = NULL;
  gboolean done[SW_STAGING_MAX_ROWS] = { FALSE };

  g_return_val_if_fail (staging != NULL, NULL);
  /* One sentence per arrangement and reason, naming its stage counts. */
  for (guint i = 0; i < staging->n_rows && i < SW_STAGING_MAX_ROWS; i++)
    {
      const SwStagingRow *r = &staging->rows[i];
      g_autoptr (GString) counts = NULL;

      if (done[i] || !r->feasible || r->reused_feasible || r->reused_reason[0] == '\0')
        continue;
      counts = g_string_new (NULL);
      for (guint j = i; j < staging->n_rows && j < SW_STAGING_MAX_ROWS; j++)
        {
          const SwStagingRow *o = &staging->rows[j];
          if (o->feasible && !o->reused_feasible && o->arrangement == r->arrangement
              && strcmp (o->reused_reason, r->reused_reason) == 0)
            {
              g_string_append_printf (counts, "%s%u", counts->len > 0 ? ", " : "", o->n_stages);
              done[j] = TRUE;
            }
        }
      if (s == NULL)
        s = g_string_new (NULL);
      else
        g_string_append_c (s, ' ');
      g_string_append_printf (s,
                              r->arrangement == SW_ARRANGEMENT_BOOSTERS
                                /* Translators: stage counts ("4, 5"), then why */
                                ? _("No recovered figures for %s stages with boosters: %s.")
                                /* Translators: stage counts ("4, 5"), then why */
                                : _("No recovered figures for %s serial stages: %s."),
                              counts->str, r->reused_reason);
    }
  return s != NULL ? g_string_free (s, FALSE) : NULL;
}

char *
sw_staging_dup_penalty_note (const SwStaging *staging)
{
  const SwStagingRow *own;
  g_autofree char *words = NULL;
  g_autofree char *pct = NULL;

  g_return_val_if_fail (staging != NULL, NULL);
  if (staging->design_index < 0)
    return NULL;
  own = &staging->rows[staging->design_index];
  if (!own->feasible || !own->reused_feasible || !isfinite (own->payload_penalty_fraction))
    return NULL;
  words = sw_staging_dup_recovery_words (staging);
  pct = sw_format_percent (own->payload_penalty_fraction, 1);
  /* Translators: how the stages are recovered, then a percentage */
  return g_strdup_printf (_("Recovered (%s), this design's vehicle carries %s less payload at "
                            "the same liftoff mass."),
                          words, pct);
}
