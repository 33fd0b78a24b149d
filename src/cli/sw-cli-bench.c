/* SPDX-License-Identifier: GPL-3.0-or-later */
/* stagewright-cli bench: medians of the hot paths, measured on one thread. */
#include "config.h"

#include "sw-cli.h"
#include "sw-install-paths.h"

#include "sw-ascent.h"
#include "sw-ascent-montecarlo.h"
#include "sw-curves.h"
#include "sw-mass-estimate.h"
#include "sw-montecarlo.h"
#include "sw-sensitivity.h"
#include "sw-sizing.h"

#include <math.h>
#include <time.h>

static gboolean opt_json;

static GOptionEntry entries[] = {
  { "json", 0, 0, G_OPTION_ARG_NONE, &opt_json, "Print JSON for machines", NULL },
  { NULL }
};

static double
now_ns (void)
{
  struct timespec ts;
  clock_gettime (CLOCK_MONOTONIC, &ts);
  return ts.tv_sec * 1e9 + ts.tv_nsec;
}

static int
cmp_double (gconstpointer a, gconstpointer b)
{
  double x = *(const double *) a, y = *(const double *) b;
  return (x > y) - (x < y);
}

static double
median (double *v, guint n)
{
  qsort (v, n, sizeof *v, (int (*) (const void *, const void *)) cmp_double);
  return n % 2 ? v[n / 2] : 0.5 * (v[n / 2 - 1] + v[n / 2]);
}

/* Keeps the optimiser from dropping the work. */
static volatile double sink;

char *
sw_cli_find_demo (const char *basename)
{
  return sw_install_find_design (basename);
}

int
sw_cli_bench (int argc, char **argv)
{
  g_autoptr (SwDesign) d = NULL;
  g_autofree char *path = NULL;
  enum { BATCHES = 101, PER_BATCH = 2000, UPDATES = 201 };
  double samples[BATCHES], updates[UPDATES];
  double optimal_ns, live_us, dv, sensitivity_us = 0.0, montecarlo_ms = 0.0;
  double ascent_ms = NAN, loop_ms = NAN, mc_sim_s = NAN, carpet_ms, estimate_us = NAN;
  double boosters_fixed_us = NAN, boosters_sized_ms = NAN;
  guint estimate_rounds = 0;
  guint mc_sim_threads = 0;
  g_autofree char *ascent_design = NULL;
  guint mc_threads = 1;
  SwStageSet set;
  int code;

  opt_json = FALSE;
  if (!sw_cli_parse ("bench", entries, &argc, &argv, -1, &code))
    return code;
  if (argc > 2)
    {
      g_printerr ("stagewright-cli bench: expected at most one FILE\n");
      return SW_EXIT_USAGE;
    }
  path = argc == 2 ? g_strdup (argv[1]) : sw_cli_find_demo ("medium-cargo.stagewright");
  if ((d = sw_cli_load (path)) == NULL)
    return SW_EXIT_USAGE;
  if (!sw_design_required_delta_v (d, &dv, NULL))
    return SW_EXIT_USAGE;

  /* The worst case of the target: five stages, optimal split. */
  sw_stage_set_extend (&set, d, 5);
  for (guint b = 0; b < BATCHES; b++)
    {
      double t0 = now_ns ();
      for (guint i = 0; i < PER_BATCH; i++)
        {
          SwSizing s;
          sw_size (&set, d->payload_kg, dv * (1.0 + 1e-9 * i), SW_SPLIT_OPTIMAL, &s);
          sink += s.liftoff_mass_kg;
        }
      samples[b] = (now_ns () - t0) / PER_BATCH;
    }
  optimal_ns = median (samples, BATCHES);

  for (guint u = 0; u < UPDATES; u++)
    {
      SwSizing s;
      SwStageCurve curve;
      SwSweep *sweep = g_new (SwSweep, 1);
      double t0 = now_ns ();

      sw_size_design (d, &s, NULL);
      sw_stage_curve_compute (d, dv, SW_MAX_STAGES, &curve);
      sw_sweep_compute (d, SW_SWEEP_CURVES, SW_SWEEP_POINTS, sweep);
      updates[u] = (now_ns () - t0) / 1000.0;
      sink += s.liftoff_mass_kg + curve.points[0].liftoff_mass_kg + sweep->curves[0].liftoff_mass_kg[1];
      g_free (sweep);
    }
  live_us = median (updates, UPDATES);

  /* Trade studies: one sensitivity table (derivatives, tornado, exchange
   * ratios); a 10,000-sample Monte Carlo on all cores with fixed spreads
   * (Isp sigma 1 %, structural coefficient +-8 %, losses sigma 120 m/s). */
  {
    enum { TABLES = 201, RUNS = 9 };
    double tables[TABLES], runs[RUNS];
    SwUncertainty spreads;

    for (guint k = 0; k < TABLES; k++)
      {
        SwSensitivityTable t;
        double t0 = now_ns ();
        sw_sensitivity_compute (d, SW_SENSITIVITY_DEFAULT_STEP, &t, NULL);
        tables[k] = (now_ns () - t0) / 1000.0;
        sink += t.liftoff_mass_kg;
      }
    sensitivity_us = median (tables, TABLES);

    sw_uncertainty_init (&spreads);
    spreads.isp = (SwSpread) { SW_SPREAD_NORMAL, 1.0 };
    spreads.structural_coefficient = (SwSpread) { SW_SPREAD_UNIFORM, 8.0 };
    spreads.losses = (SwSpread) { SW_SPREAD_NORMAL, 120.0 };
    for (guint k = 0; k < RUNS; k++)
      {
        SwMonteCarlo mc;
        double t0 = now_ns ();
        sw_montecarlo_run (d, &spreads, 10000, TRUE, k + 1, 0, &mc, NULL, NULL, NULL);
        runs[k] = (now_ns () - t0) / 1e6;
        sink += mc.liftoff.mean;
        mc_threads = mc.threads;
      }
    montecarlo_ms = median (runs, RUNS);
  }

  /* Ascent: one guided solve of the three-stage demo (vehicle sized with its
   * first guess of the losses, pitch kick and steering solved, the flight
   * recorded), and its closed sizing-and-losses loop. */
  {
    enum { SOLVES = 15, LOOPS = 7 };
    double solves[SOLVES], loops[LOOPS];
    g_autofree char *apath = sw_cli_find_demo ("three-stage-simulated.stagewright");
    g_autoptr (SwDesign) ad = sw_design_load (apath, NULL, NULL);

    if (ad != NULL)
      {
        ascent_design = g_strdup (ad->name);
        for (guint k = 0; k < SOLVES; k++)
          {
            double t0 = now_ns ();
            g_autoptr (SwAscentResult) r = sw_ascent_solve (ad, NULL, NULL, NULL);
            solves[k] = (now_ns () - t0) / 1e6;
            sink += r != NULL ? r->losses_m_s : 0.0;
          }
        ascent_ms = median (solves, SOLVES);
        /* The structural-coefficient estimate of the same demo (it names its
         * propellants): the fixed point of the mass-estimating relationships
         * and the sizing, part of every fast analysis. */
        {
          enum { ESTIMATES = 101 };
          double est[ESTIMATES];
          for (guint k = 0; k < ESTIMATES; k++)
            {
              SwMassEstimate m;
              double t0 = now_ns ();
              sw_mass_estimate_design (ad, &m);
              est[k] = (now_ns () - t0) / 1000.0;
              sink += m.liftoff_mass_kg;
              estimate_rounds = m.iterations;
            }
          estimate_us = median (est, ESTIMATES);
        }
        for (guint k = 0; k < LOOPS; k++)
          {
            double t0 = now_ns ();
            g_autoptr (SwAscentResult) r = sw_ascent_close_loop (ad, NULL, NULL, NULL);
            loops[k] = (now_ns () - t0) / 1e6;
            sink += r != NULL ? r->losses_m_s : 0.0;
          }
        loop_ms = median (loops, LOOPS);

        /* The Monte Carlo with a simulated ascent per sample: 1,000 samples
         * on all cores, the same spreads as above (losses flown). */
        {
          double t0 = now_ns ();
          g_autoptr (SwAscentMonteCarlo) smc = NULL;

          ad->uncertainty.isp = (SwSpread) { SW_SPREAD_NORMAL, 1.0 };
          ad->uncertainty.structural_coefficient = (SwSpread) { SW_SPREAD_UNIFORM, 8.0 };
          smc = sw_ascent_montecarlo_run (ad, 1000, 1, 0, NULL, NULL, NULL, NULL);
          if (smc != NULL)
            {
              mc_sim_s = (now_ns () - t0) / 1e9;
              mc_sim_threads = smc->threads;
              sink += smc->mean_margin_m_s;
            }
        }
      }
  }

  /* Sizing with strap-on boosters (the four-booster demo): with its fixed
   * booster load (the core's root and the upper stages' minimum), and with
   * the boosters sized too (nested GSL minimisers). */
  {
    enum { FIXED = 51, SIZED = 7 };
    double fixed[FIXED], sized[SIZED];
    g_autofree char *bpath = sw_cli_find_demo ("four-booster-cargo.stagewright");
    g_autoptr (SwDesign) bd = sw_design_load (bpath, NULL, NULL);

    if (bd != NULL && bd->boosters.count > 0)
      {
        SwSizing s;
        for (guint k = 0; k < FIXED; k++)
          {
            double t0 = now_ns ();
            sw_size_design (bd, &s, NULL);
            fixed[k] = (now_ns () - t0) / 1000.0;
            sink += s.liftoff_mass_kg;
          }
        boosters_fixed_us = median (fixed, FIXED);
        bd->boosters.propellant.has_propellant_kg = FALSE;
        for (guint k = 0; k < SIZED; k++)
          {
            double t0 = now_ns ();
            sw_size_design (bd, &s, NULL);
            sized[k] = (now_ns () - t0) / 1e6;
            sink += s.liftoff_mass_kg;
          }
        boosters_sized_ms = median (sized, SIZED);
      }
  }

  carpet_ms = sw_cli_bench_carpet_ms (d);
  if (opt_json)
    {
      g_autoptr (JsonBuilder) b = json_builder_new_immutable ();
      g_autoptr (JsonNode) node = NULL;

      json_builder_begin_object (b);
      json_builder_set_member_name (b, "design");
      json_builder_add_string_value (b, d->name);
      sw_cli_add_number (b, "optimal_size_ns", optimal_ns);
      sw_cli_add_number (b, "live_update_us", live_us);
      sw_cli_add_number (b, "sensitivity_table_us", sensitivity_us);
      sw_cli_add_number (b, "montecarlo_10k_ms", montecarlo_ms);
      json_builder_set_member_name (b, "montecarlo_threads");
      json_builder_add_int_value (b, mc_threads);
      json_builder_set_member_name (b, "ascent_design");
      if (ascent_design != NULL)
        json_builder_add_string_value (b, ascent_design);
      else
        json_builder_add_null_value (b);
      sw_cli_add_number (b, "ascent_solve_ms", ascent_ms);
      sw_cli_add_number (b, "closed_loop_ms", loop_ms);
      sw_cli_add_number (b, "montecarlo_simulated_1k_s", mc_sim_s);
      json_builder_set_member_name (b, "montecarlo_simulated_threads");
      json_builder_add_int_value (b, mc_sim_threads);
      sw_cli_add_number (b, "carpet_50x50_ms", carpet_ms);
      sw_cli_add_number (b, "eps_estimate_us", estimate_us);
      sw_cli_add_number (b, "boosters_fixed_size_us", boosters_fixed_us);
      sw_cli_add_number (b, "boosters_sized_size_ms", boosters_sized_ms);
      json_builder_end_object (b);
      node = json_builder_get_root (b);
      sw_cli_print_json (node);
    }
  else
    {
      g_print ("Design: %s\n", d->name);
      g_print ("optimal sizing, 5 stages     %10.0f ns median  (target <= 2000 ns)\n",
               optimal_ns);
      g_print ("live update (size + 1..8 curve + 5 x 200 sweep) %8.1f us median  "
               "(target <= 1000 us)\n",
               live_us);
      g_print ("sensitivity table            %10.1f us median  (target <= 1000 us)\n",
               sensitivity_us);
      g_print ("Monte Carlo, 10,000 samples  %10.2f ms median  on %u thread(s) "
               "(target <= 50 ms on 2 cores)\n",
               montecarlo_ms, mc_threads);
      {
        g_autofree char *a = sw_cli_format (ascent_ms, 1);
        g_autofree char *l = sw_cli_format (loop_ms, 1);
        g_autofree char *m = sw_cli_format (mc_sim_s, 2);
        g_print ("ascent solve, three stages   %10s ms median  (target <= 10 ms)  %s\n", a,
                 ascent_design != NULL ? ascent_design : "(demo not found)");
        g_print ("closed sizing-losses loop    %10s ms median  (target <= 50 ms)\n", l);
        g_print ("Monte Carlo, simulated, 1,000 %9s s         on %u thread(s) "
                 "(target <= 5 s on 2 cores)\n", m, mc_sim_threads);
        g_print ("carpet, 50 x 50 sizings      %10.2f ms median  (target <= 50 ms)\n", carpet_ms);
        if (isfinite (boosters_fixed_us))
          g_print ("sizing with 4 boosters, fixed load %6.1f us median; boosters sized %.1f ms "
                   "median (no target yet)\n", boosters_fixed_us, boosters_sized_ms);
        if (isfinite (estimate_us))
          g_print ("structural-coefficient estimate %7.1f us median  (%u rounds; part of "
                   "every fast analysis)\n", estimate_us, estimate_rounds);
      }
    }
  return SW_EXIT_OK;
}
