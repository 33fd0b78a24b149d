/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Tests of the one analysis: the verdict's states and precedence, the copy
 * that shares the heap parts, cancellation. */
#include "config.h"

#include "sw-analysis.h"
#include "sw-ascent-private.h"

#include <math.h>
#include <string.h>

static SwDesign *
demo (const char *basename)
{
  const char *root = g_getenv ("SW_SOURCE_ROOT");
  g_autofree char *path = NULL;
  g_autoptr (GError) error = NULL;
  SwDesign *d;

  g_assert_nonnull (root);
  path = g_build_filename (root, "data", "designs", basename, NULL);
  d = sw_design_load (path, NULL, &error);
  g_assert_no_error (error);
  return d;
}

static void
assert_verdict (const SwAnalysis *a, const char *state, const char *word)
{
  g_assert_cmpstr (sw_verdict_state_to_string (a->verdict.state), ==, state);
  if (word != NULL && strstr (a->verdict.reason, word) == NULL)
    g_error ("verdict %s: \"%s\" not in \"%s\"", state, word, a->verdict.reason);
}

/* The five strings scripts depend on. */
static void
test_state_strings (void)
{
  g_assert_cmpstr (sw_verdict_state_to_string (SW_VERDICT_INFEASIBLE), ==, "infeasible");
  g_assert_cmpstr (sw_verdict_state_to_string (SW_VERDICT_SHORT_OF_ORBIT), ==, "short-of-orbit");
  g_assert_cmpstr (sw_verdict_state_to_string (SW_VERDICT_OVER_LIMIT), ==, "over-limit");
  g_assert_cmpstr (sw_verdict_state_to_string (SW_VERDICT_PAPER_ONLY), ==, "paper-only");
  g_assert_cmpstr (sw_verdict_state_to_string (SW_VERDICT_REACHES_ORBIT), ==, "reaches-orbit");
}

static void
test_verdicts (void)
{
  g_autoptr (SwDesign) paper = demo ("all-solid-concept.stagewright");
  g_autoptr (SwDesign) shortfall = demo ("medium-cargo.stagewright");  /* made short below */
  g_autoptr (SwDesign) reaches = demo ("three-stage-simulated.stagewright");
  g_autoptr (SwDesign) far = sw_design_copy (paper);
  g_autoptr (SwAnalysis) a1 = NULL, a2 = NULL, a3 = NULL, a4 = NULL, a5 = NULL, a6 = NULL;
  SwAnalysisOptions o;

  /* Far beyond what four solid stages give (the demo's limit is below
   * 20 km/s: c ln(1/eps) per stage is under 6.5 km/s for Isp <= 292 s and
   * eps >= 0.10): infeasible, whatever the rest says. */
  far->mission.delta_v_m_s = 25000.0;
  a1 = sw_analysis_run (far, NULL, NULL);
  assert_verdict (a1, "infeasible", "Cobbleford");

  a2 = sw_analysis_run (paper, NULL, NULL);
  assert_verdict (a2, "paper-only", "not a target orbit");
  g_assert_true (isnan (a2->simulated_margin_m_s));
  g_assert_true (isfinite (a2->headroom_m_s));

  /* The cargo demo with too small a loss allowance falls short. */
  shortfall->mission.losses_m_s = 1500.0;
  a3 = sw_analysis_run (shortfall, NULL, NULL);
  assert_verdict (a3, "short-of-orbit", "short of the orbit");
  g_assert_cmpfloat (a3->simulated_margin_m_s, <, 0.0);
  g_assert_cmpfloat (a3->simulated_margin_m_s, ==, -a3->ascent->delta_v_missing_m_s);

  a4 = sw_analysis_run (reaches, NULL, NULL);
  assert_verdict (a4, "reaches-orbit", "to spare");
  g_assert_true (a4->sized_by_ascent);
  g_assert_cmpfloat (a4->simulated_margin_m_s, ==, a4->ascent->delta_v_margin_m_s);

  /* The same flight against a max-Q limit it exceeds: over-limit, naming it. */
  sw_analysis_options_init (&o);
  o.max_q_pa = 1000.0;
  a5 = sw_analysis_run (reaches, &o, NULL);
  assert_verdict (a5, "over-limit", "Max-Q is");
  g_assert_nonnull (strstr (a5->verdict.reason, "above your limit of 1.0 kPa"));

  /* Without the ascent: paper-only, sized by the allowance. */
  o.ascent = FALSE;
  {
    /* A first stage that cannot lift off: the core's reason is a sentence
     * of its own and follows a full stop, not a colon. */
    g_autoptr (SwDesign) heavy = sw_design_copy (shortfall);
    g_autoptr (SwAnalysis) a7 = NULL;

    heavy->payload_kg = 5.0e6;
    a7 = sw_analysis_run (heavy, NULL, NULL);
    assert_verdict (a7, "short-of-orbit", "cannot lift off");
    g_assert_null (strstr (a7->verdict.reason, "orbit: The"));
    g_assert_nonnull (strstr (a7->verdict.reason, "does not reach the orbit. The vehicle cannot "
                                                 "lift off"));
  }
  a6 = sw_analysis_run (reaches, &o, NULL);
  assert_verdict (a6, "paper-only", "on request");
  g_assert_false (a6->sized_by_ascent);
  g_assert_null (a6->ascent);
}

/* Without a flight there is no "reaches the orbit, but": a limit the
 * figures break is told in the paper-only reason. */
static void
test_paper_only_with_limit (void)
{
  g_autoptr (SwDesign) paper = demo ("all-solid-concept.stagewright");
  g_autoptr (SwAnalysis) a = NULL;
  SwAnalysisOptions o;

  g_assert_true (paper->stages[0].propulsion.present);
  sw_analysis_options_init (&o);
  o.min_thrust_to_weight = 5.0;
  a = sw_analysis_run (paper, &o, NULL);
  assert_verdict (a, "paper-only", "below your limit of 5.00");
}

/* Precedence: a shortfall outranks a broken limit. */
static void
test_precedence (void)
{
  g_autoptr (SwDesign) shortfall = demo ("medium-cargo.stagewright");  /* made short below */
  g_autoptr (SwAnalysis) a = NULL;
  SwAnalysisOptions o;

  shortfall->mission.losses_m_s = 1500.0;   /* too small an allowance */
  sw_analysis_options_init (&o);
  o.max_q_pa = 1.0;
  o.max_axial_g = 1.0;
  o.min_thrust_to_weight = 5.0;
  a = sw_analysis_run (shortfall, &o, NULL);
  assert_verdict (a, "short-of-orbit", NULL);
}

/* A copy is a new analysis that shares the immutable heap parts; each
 * lives as long as any analysis holds it. */
static void
test_copy_shares (void)
{
  g_autoptr (SwDesign) d = demo ("small-sat-launcher.stagewright");
  SwAnalysis *a = sw_analysis_run (d, NULL, NULL);
  SwAnalysis *b;

  g_assert_nonnull (a->ascent);
  b = sw_analysis_copy (a);
  g_assert_true (a != b);
  g_assert_true (a->design == b->design);
  g_assert_true (a->ascent == b->ascent);
  g_assert_cmpstr (a->verdict.reason, ==, b->verdict.reason);
  sw_analysis_unref (a);
  /* Still readable through the copy (ASan and valgrind would see a
   * use-after-free). */
  g_assert_cmpstr (b->design->name, ==, d->name);
  g_assert_cmpuint (b->ascent->n_stages, ==, d->n_stages);
  sw_analysis_unref (b);
}

/* Every phase gives up once its cancellable is cancelled, and the fast
 * phase runs no ascent. */
static void
test_cancel_and_phases (void)
{
  g_autoptr (SwDesign) d = demo ("small-sat-launcher.stagewright");
  g_autoptr (GCancellable) c = g_cancellable_new ();
  g_autoptr (SwAnalysis) fast = NULL;
  guint runs;

  runs = sw_ascent_private_design_runs ();
  fast = sw_analysis_new (d, 7, NULL, NULL);
  g_assert_cmpuint (sw_ascent_private_design_runs (), ==, runs);
  g_assert_cmpuint (fast->serial, ==, 7);
  g_assert_cmpuint (fast->phase, ==, 0);
  g_assert_true (fast->ascent_pending);
  assert_verdict (fast, "pending", NULL);

  g_cancellable_cancel (c);
  g_assert_null (sw_analysis_new (d, 8, NULL, c));
  g_assert_null (sw_analysis_add_ascent (fast, c));
}

/* ---- one loss model everywhere (issue 11) -------------------------------- */

/* A "simulate" design: once the ascent phase closes the loop, the
 * sensitivities and the Monte Carlo are those of the vehicle the loop sized
 * (same liftoff mass to rounding), and the note says which losses they used.
 * Before that, the note names the first-guess allowance.  The expected
 * liftoff masses come from the sizing itself, an independent path
 * (sw_size_design on a copy carrying the loop's losses), not from the trade
 * code under test. */
static void
test_trade_uses_loop_losses (void)
{
  g_autoptr (SwDesign) d = demo ("three-stage-simulated.stagewright");
  g_autoptr (SwDesign) looped = NULL;
  g_autoptr (SwAnalysis) fast = NULL, mc = NULL, flown = NULL;
  g_autoptr (GError) error = NULL;
  SwAnalysisOptions o;
  SwSizing check;
  double guess;

  g_assert_cmpint (d->mission.loss_model, ==, SW_LOSS_SIMULATE);
  guess = d->mission.losses_m_s;
  sw_analysis_options_init (&o);
  o.montecarlo_always = TRUE;
  o.montecarlo_samples = 400;
  o.montecarlo_use_seed = TRUE;
  o.montecarlo_seed = 7;
  o.band = FALSE;
  o.threads = 1;

  fast = sw_analysis_new (d, 1, &o, NULL);
  g_assert_true (fast->ok && fast->ascent_pending && fast->has_sensitivity);
  g_assert_false (fast->trade_losses_simulated);
  g_assert_cmpfloat (fast->trade_losses_m_s, ==, guess);
  g_assert_nonnull (strstr (fast->trade_losses_note, "first-guess allowance"));
  mc = sw_analysis_add_montecarlo (fast, NULL);
  g_assert_true (mc->has_montecarlo);
  flown = sw_analysis_add_ascent (mc, NULL);
  g_assert_nonnull (flown->ascent);
  g_assert_true (flown->ascent->closed_loop && flown->ascent->loop_converged);
  g_assert_true (flown->sized_by_ascent);

  g_assert_true (flown->trade_losses_simulated);
  g_assert_cmpfloat (flown->trade_losses_m_s, ==, flown->ascent->loop_sized_losses_m_s);
  g_assert_nonnull (strstr (flown->trade_losses_note, "closed-loop losses"));
  /* The loop's losses differ from the first guess by far more than the
   * tolerance below, so this test can tell the two apart. */
  g_assert_cmpfloat (fabs (flown->trade_losses_m_s - guess), >, 20.0);

  /* The loop's vehicle: its losses and its fairing jettison point. */
  looped = sw_design_copy (d);
  sw_ascent_apply_loop (looped, flown->ascent);
  g_assert_cmpfloat (looped->mission.losses_m_s, ==, flown->ascent->loop_sized_losses_m_s);
  g_assert_true (sw_size_design (looped, &check, &error));
  g_assert_no_error (error);
  g_assert_true (check.feasible);
  g_assert_cmpfloat_with_epsilon (check.liftoff_mass_kg, flown->sizing.liftoff_mass_kg,
                                  1e-6 * check.liftoff_mass_kg);
  /* Sensitivities: recomputed about the loop's vehicle ... */
  g_assert_true (flown->has_sensitivity);
  g_assert_cmpfloat_with_epsilon (flown->sensitivity.liftoff_mass_kg, check.liftoff_mass_kg,
                                  1e-6 * check.liftoff_mass_kg);
  /* ... where the fast phase's were about the first guess's. */
  g_assert_cmpfloat (fabs (fast->sensitivity.liftoff_mass_kg - check.liftoff_mass_kg), >,
                     100.0);
  /* Monte Carlo: re-run with the loop's nominal vehicle. */
  g_assert_true (flown->has_montecarlo);
  g_assert_cmpfloat_with_epsilon (flown->montecarlo.nominal_liftoff_kg, check.liftoff_mass_kg,
                                  1e-6 * check.liftoff_mass_kg);
  g_assert_cmpfloat (fabs (mc->montecarlo.nominal_liftoff_kg - check.liftoff_mass_kg), >,
                     100.0);
}

/* Without a simulation the note names the allowance it used and why; an
 * allowance design needs no note. */
static void
test_trade_losses_note (void)
{
  g_autoptr (SwDesign) d = demo ("three-stage-simulated.stagewright");
  g_autoptr (SwDesign) allowance = demo ("medium-cargo.stagewright");
  g_autoptr (SwAnalysis) a = NULL, b = NULL;
  SwAnalysisOptions o;

  sw_analysis_options_init (&o);
  o.ascent = FALSE;
  o.montecarlo = FALSE;
  a = sw_analysis_run (d, &o, NULL);
  g_assert_false (a->trade_losses_simulated);
  g_assert_cmpfloat (a->trade_losses_m_s, ==, d->mission.losses_m_s);
  g_assert_nonnull (strstr (a->trade_losses_note, "first-guess allowance"));
  g_assert_nonnull (strstr (a->trade_losses_note, "the ascent was not simulated"));

  g_assert_cmpint (allowance->mission.loss_model, ==, SW_LOSS_ALLOWANCE);
  b = sw_analysis_run (allowance, &o, NULL);
  g_assert_cmpstr (b->trade_losses_note, ==, "");
  g_assert_false (b->trade_losses_simulated);

  /* A simulate design with boosters, not flown: the same note as a serial
   * one (flown, it takes the loop's losses: test_booster_trade_uses_loop_losses). */
  {
    g_autoptr (SwDesign) fb = demo ("four-booster-cargo.stagewright");
    g_autoptr (SwAnalysis) c = sw_analysis_run (fb, &o, NULL);

    g_assert_cmpint (fb->mission.loss_model, ==, SW_LOSS_SIMULATE);
    g_assert_nonnull (strstr (c->trade_losses_note, "first-guess allowance of 2,500 m/s"));
    g_assert_nonnull (strstr (c->trade_losses_note, "the ascent was not simulated"));
    g_assert_false (c->trade_losses_simulated);
  }
}

/* A "simulate" design with strap-on boosters (the four-booster demo, fixed
 * boosters and sized stages): after the closed loop its sensitivities, its
 * Monte Carlo and its estimated coefficients (the boosters' included) are
 * those of the loop's vehicle, as a serial design's are
 * (test_trade_uses_loop_losses); the first phase's were of the first guess.
 * The check values come from sizing the loop's design directly. */
static void
test_booster_trade_uses_loop_losses (void)
{
  g_autoptr (SwDesign) d = demo ("four-booster-cargo.stagewright");
  g_autoptr (SwDesign) looped = NULL;
  g_autoptr (SwAnalysis) fast = NULL, mc = NULL, flown = NULL, run = NULL;
  g_autoptr (GError) error = NULL;
  SwAnalysisOptions o;
  SwSizing check;
  SwMassEstimate m;
  double guess;

  g_assert_cmpint (d->mission.loss_model, ==, SW_LOSS_SIMULATE);
  g_assert_cmpuint (d->boosters.count, >, 0);
  guess = d->mission.losses_m_s;
  sw_analysis_options_init (&o);
  o.montecarlo_always = TRUE;
  o.montecarlo_samples = 200;
  o.montecarlo_use_seed = TRUE;
  o.montecarlo_seed = 7;
  o.band = FALSE;
  o.threads = 1;

  fast = sw_analysis_new (d, 1, &o, NULL);
  g_assert_true (fast->ok && fast->ascent_pending && fast->has_sensitivity);
  g_assert_false (fast->trade_losses_simulated);
  g_assert_nonnull (strstr (fast->trade_losses_note, "until the simulated ascent closes"));
  mc = sw_analysis_add_montecarlo (fast, NULL);
  g_assert_true (mc->has_montecarlo);
  flown = sw_analysis_add_ascent (mc, NULL);
  g_assert_true (flown->ascent->closed_loop && flown->ascent->loop_converged);
  g_assert_true (flown->sized_by_ascent && flown->sizing.boosters.present);
  g_assert_true (flown->trade_losses_simulated);
  g_assert_cmpfloat (flown->trade_losses_m_s, ==, flown->ascent->loop_sized_losses_m_s);
  g_assert_nonnull (strstr (flown->trade_losses_note, "closed-loop losses"));
  /* The loop's losses differ from the first guess (2,500 m/s) by more than
   * the tolerances below can hide. */
  g_assert_cmpfloat (fabs (flown->trade_losses_m_s - guess), >, 5.0);

  looped = sw_design_copy (d);
  sw_ascent_apply_loop (looped, flown->ascent);
  g_assert_true (sw_size_design (looped, &check, &error));
  g_assert_no_error (error);
  g_assert_true (check.feasible && check.boosters.present);
  g_assert_cmpfloat_with_epsilon (check.liftoff_mass_kg, flown->sizing.liftoff_mass_kg,
                                  1e-6 * check.liftoff_mass_kg);
  g_assert_true (flown->has_sensitivity);
  g_assert_cmpfloat_with_epsilon (flown->sensitivity.liftoff_mass_kg, check.liftoff_mass_kg,
                                  1e-6 * check.liftoff_mass_kg);
  g_assert_cmpfloat (fabs (fast->sensitivity.liftoff_mass_kg - check.liftoff_mass_kg), >,
                     100.0);
  g_assert_true (flown->has_montecarlo);
  g_assert_cmpfloat_with_epsilon (flown->montecarlo.nominal_liftoff_kg, check.liftoff_mass_kg,
                                  1e-6 * check.liftoff_mass_kg);
  g_assert_cmpfloat (fabs (mc->montecarlo.nominal_liftoff_kg - check.liftoff_mass_kg), >,
                     100.0);
  /* The estimate of the loop's vehicle, the boosters' included. */
  sw_mass_estimate_design (looped, &m);
  g_assert_true (m.ok && m.has_boosters && flown->mass_estimate.has_boosters);
  g_assert_cmpfloat (flown->mass_estimate.boosters.structural_coefficient, ==,
                     m.boosters.structural_coefficient);
  g_assert_cmpfloat (flown->mass_estimate.stages[0].structural_coefficient, ==,
                     m.stages[0].structural_coefficient);

  /* sw_analysis_run flies first and runs the Monte Carlo once, with the
   * loop's losses: the same nominal vehicle. */
  run = sw_analysis_run (d, &o, NULL);
  g_assert_true (run->trade_losses_simulated && run->has_montecarlo);
  g_assert_cmpfloat_with_epsilon (run->montecarlo.nominal_liftoff_kg, check.liftoff_mass_kg,
                                  1e-6 * check.liftoff_mass_kg);
  g_assert_cmpfloat (run->montecarlo.liftoff.mean, ==, flown->montecarlo.liftoff.mean);
}

/* "loss_model": "simulate": after the ascent phase the analysis carries the
 * closed loop's vehicle (run here on its own through the ascent module),
 * not the first guess sized with the 1,600 m/s allowance; the first phase
 * still has the first guess. */
static void
test_closed_loop_sizing (void)
{
  g_autoptr (SwDesign) d = demo ("three-stage-simulated.stagewright");
  g_autoptr (SwAnalysis) fast = NULL, full = NULL;
  g_autoptr (GError) error = NULL;
  SwAscentResult *loop;
  SwAscentOptions ao;
  SwAnalysisOptions o;

  sw_analysis_options_init (&o);
  o.montecarlo = FALSE;
  o.band = FALSE;
  fast = sw_analysis_new (d, 1, &o, NULL);
  g_assert_true (fast->ok);
  g_assert_false (fast->sized_by_ascent);
  g_assert_true (fast->ascent_pending);
  full = sw_analysis_add_ascent (fast, NULL);
  g_assert_nonnull (full);

  sw_ascent_options_init (&ao);
  loop = sw_ascent_close_loop (d, &ao, NULL, &error);
  g_assert_no_error (error);
  g_assert_nonnull (loop);
  g_assert_true (loop->closed_loop);
  g_assert_true (loop->loop_converged);
  g_assert_true (loop->sizing.feasible);

  g_assert_true (full->sized_by_ascent);
  g_assert_true (full->sizing.feasible);
  /* The same computation twice: equal to rounding (1e-9 relative). */
  g_assert_cmpfloat_with_epsilon (full->sizing.liftoff_mass_kg, loop->sizing.liftoff_mass_kg,
                                  1e-9 * loop->sizing.liftoff_mass_kg);
  g_assert_cmpfloat_with_epsilon (full->delta_v_m_s, loop->sizing.delta_v_m_s, 1e-6);
  for (guint i = 0; i < loop->sizing.n_stages; i++)
    g_assert_cmpfloat_with_epsilon (full->sizing.stages[i].propellant_mass_kg,
                                    loop->sizing.stages[i].propellant_mass_kg,
                                    1e-9 * loop->sizing.liftoff_mass_kg);
  /* The required delta-v is the ideal one plus the simulated losses, not
   * the allowance. */
  g_assert_cmpfloat_with_epsilon (full->budget.losses_m_s, loop->loop_sized_losses_m_s, 1e-6);
  g_assert_cmpfloat (fabs (full->budget.losses_m_s - 1600.0), >, 1.0);
  /* ... and the first guess is a different vehicle: the delta-v moved by
   * more than the loop's 1 m/s settling bound, so the mass by more than
   * 0.01 %. */
  g_assert_cmpfloat (fabs (fast->delta_v_m_s - full->delta_v_m_s), >, 1.0);
  g_assert_cmpfloat (fabs (fast->sizing.liftoff_mass_kg - full->sizing.liftoff_mass_kg), >,
                     1e-4 * full->sizing.liftoff_mass_kg);
  /* The stage-count curve follows: its point at the design's stage count is
   * the loop's vehicle (optimal split). */
  g_assert_cmpfloat_with_epsilon (full->stage_curve.delta_v_m_s, full->delta_v_m_s, 1e-6);
  sw_ascent_result_free (loop);
}

/* A stage with a fixed propellant load: the sensitivities and the Monte
 * Carlo size every perturbed design as sw_size_design does (the fixed stage
 * keeps its load), so they are computed and say nothing is missing; the
 * liftoff mass stays their output.  Every stage fixed (the as-built demo):
 * they are of the payload capability, whose nominal value is the one the
 * analysis reports (sw_design_performance). */
static void
test_fixed_stage_trades (void)
{
  g_autoptr (SwDesign) d = demo ("small-sat-launcher.stagewright");
  g_autoptr (SwDesign) built = demo ("sallowmere-as-built.stagewright");
  g_autoptr (SwAnalysis) plain = NULL, fixed = NULL, all = NULL, run = NULL;
  SwAnalysisOptions o;

  d->uncertainty.samples = 200;
  plain = sw_analysis_new (d, 1, NULL, NULL);
  g_assert_true (plain->sizing.feasible);
  g_assert_true (plain->has_sensitivity);
  g_assert_false (plain->sensitivity.capability);
  g_assert_cmpstr (plain->montecarlo_error, ==, "");

  d->stages[2].propellant.has_propellant_kg = TRUE;
  d->stages[2].propellant.propellant_kg = 300.0;
  fixed = sw_analysis_new (d, 2, NULL, NULL);
  g_assert_true (fixed->sizing.feasible);
  g_assert_true (fixed->sizing.stages[2].fixed);
  g_assert_true (fixed->has_sensitivity);
  g_assert_false (fixed->all_fixed);
  g_assert_false (fixed->sensitivity.capability);
  g_assert_cmpfloat (fixed->sensitivity.liftoff_mass_kg, ==, fixed->sizing.liftoff_mass_kg);
  g_assert_true (fixed->montecarlo_pending);
  g_assert_cmpstr (fixed->montecarlo_error, ==, "");

  sw_analysis_options_init (&o);
  o.ascent = FALSE;
  o.montecarlo_always = TRUE;
  o.montecarlo_samples = 300;
  all = sw_analysis_new (built, 3, &o, NULL);
  g_assert_true (all->all_fixed);
  g_assert_true (all->has_performance && all->performance.reachable);
  g_assert_true (all->has_sensitivity);
  g_assert_true (all->sensitivity.capability);
  /* The one liftoff mass (the demo carries a fairing) is the sizing's. */
  g_assert_cmpfloat (fabs (all->sensitivity.liftoff_mass_kg - all->sizing.liftoff_mass_kg), <,
                     1e-9 * all->sizing.liftoff_mass_kg);
  g_assert_cmpfloat (fabs (all->sensitivity.payload_capability_kg - all->performance.payload_kg),
                     <, 1e-9 * all->performance.payload_kg);
  run = sw_analysis_run (built, &o, NULL);
  g_assert_true (run->has_montecarlo);
  g_assert_true (run->montecarlo.all_fixed);
  g_assert_cmpuint (run->montecarlo.margin.n, ==, 300);
  /* No spread: every sample is the nominal vehicle, whose margin at the
   * nominal payload is the sizing's. */
  g_assert_cmpfloat (fabs (run->montecarlo.margin.mean
                           - (run->sizing.delta_v_given_m_s - run->sizing.delta_v_m_s)), <, 1e-6);
  g_assert_cmpfloat (fabs (run->montecarlo.payload.mean - all->performance.payload_kg), <,
                     1e-6 * all->performance.payload_kg);
  g_assert_cmpfloat (run->montecarlo_success, ==, 1.0);
}

/* A vehicle that exists, on a "simulate" design: the closed loop's losses
 * (and fairing jettison point) reach the sensitivities and the Monte Carlo,
 * and the capability they start from is the one in the totals. */
static void
test_fixed_loads_loop (void)
{
  g_autoptr (SwDesign) d = demo ("sallowmere-as-built.stagewright");
  g_autoptr (SwAnalysis) a = NULL;
  SwAnalysisOptions o;

  d->mission.loss_model = SW_LOSS_SIMULATE;
  sw_analysis_options_init (&o);
  o.montecarlo_always = TRUE;
  o.montecarlo_samples = 200;
  a = sw_analysis_run (d, &o, NULL);
  g_assert_nonnull (a);
  g_assert_true (a->sized_by_ascent);
  g_assert_true (a->trade_losses_simulated);
  g_assert_nonnull (strstr (a->trade_losses_note, "closed-loop"));
  g_assert_true (a->has_sensitivity && a->sensitivity.capability);
  g_assert_true (a->has_performance && a->performance.reachable);
  g_assert_cmpfloat (fabs (a->sensitivity.payload_capability_kg - a->performance.payload_kg), <,
                     1e-9 * a->performance.payload_kg);
  g_assert_true (a->has_montecarlo && a->montecarlo.all_fixed);
  g_assert_cmpfloat (fabs (a->montecarlo.nominal_capability_kg - a->performance.payload_kg), <,
                     1e-6 * a->performance.payload_kg);
}

/* The payload curves' note says what the points use: the losses move with
 * the climb's energy, so the payload falls with altitude, and the note
 * says so (it once said it rises), before the closed loop and after. */
static void
check_payload_note (const SwAnalysis *a, const char *losses)
{
  const SwPayloadCurve *alt = &a->payload_curves.altitude;

  g_assert_true (a->payload_curves.applies);
  g_assert_nonnull (strstr (a->payload_curves.note, losses));
  g_assert_nonnull (strstr (a->payload_curves.note, "climb's energy"));
  g_assert_null (strstr (a->payload_curves.note, "rises"));
  g_assert_cmpuint (alt->n_points, >=, 2);
  for (guint i = 1; i < alt->n_points; i++)
    if (alt->points[i].reachable && alt->points[i - 1].reachable)
      g_assert_cmpfloat (alt->points[i].payload_kg, <, alt->points[i - 1].payload_kg);
}

static void
test_payload_curve_note (void)
{
  g_autoptr (SwDesign) d = demo ("sallowmere-as-built.stagewright");
  g_autoptr (SwAnalysis) a = NULL, b = NULL;
  SwAnalysisOptions o;

  sw_analysis_options_init (&o);
  o.montecarlo = FALSE;
  o.ascent = FALSE;
  a = sw_analysis_run (d, &o, NULL);
  check_payload_note (a, "design's loss allowance");

  d->mission.loss_model = SW_LOSS_SIMULATE;
  o.ascent = TRUE;
  b = sw_analysis_run (d, &o, NULL);
  g_assert_true (b->sized_by_ascent);
  check_payload_note (b, "closed loop's losses");
}

/* The shape and the estimated structural coefficients follow the sizing in
 * force: after the closed loop of a "simulate" design, the loop's vehicle
 * (the demo names its propellants and diameters). */
static void
test_shape_follows_loop (void)
{
  g_autoptr (SwDesign) d = demo ("three-stage-simulated.stagewright");
  g_autoptr (SwAnalysis) fast = sw_analysis_compute (d, 1, NULL);
  g_autoptr (SwAnalysis) a = NULL;
  g_autoptr (SwDesign) looped = NULL;
  SwAnalysisOptions o;
  SwVehicleShape v;
  SwMassEstimate m;

  sw_analysis_options_init (&o);
  o.montecarlo = FALSE;
  a = sw_analysis_run (d, &o, NULL);
  g_assert_true (fast->shape.complete && fast->mass_estimate.ok);
  g_assert_true (a->sized_by_ascent);
  sw_vehicle_shape_compute (d, &a->sizing, &v);
  g_assert_cmpfloat (a->shape.height_m, ==, v.height_m);
  /* A bigger vehicle than the first guess's: taller. */
  g_assert_cmpfloat (a->shape.height_m, >, fast->shape.height_m);
  /* The loop's vehicle: its losses and its fairing jettison point. */
  looped = sw_design_copy (d);
  sw_ascent_apply_loop (looped, a->ascent);
  g_assert_cmpfloat (looped->mission.losses_m_s, ==, a->ascent->loop_sized_losses_m_s);
  sw_mass_estimate_design (looped, &m);
  g_assert_true (a->mass_estimate.ok);
  for (guint i = 0; i < d->n_stages; i++)
    g_assert_cmpfloat (a->mass_estimate.stages[i].structural_coefficient, ==,
                       m.stages[i].structural_coefficient);
}

/* The staging table of a "simulate" design takes the closed loop's losses
 * once the analysis has them: this design's row is the liftoff mass of the
 * totals (the closed loop's sizing), not of the first guess; before the
 * loop closes the rows use the first guess and say so. */
static void
test_staging_follows_loop (void)
{
  g_autoptr (SwDesign) d = demo ("three-stage-simulated.stagewright");
  g_autoptr (SwAnalysis) fast = NULL, a = NULL;
  SwAnalysisOptions o;
  SwStaging first, looped;
  double closed;

  sw_analysis_options_init (&o);
  o.montecarlo = FALSE;
  fast = sw_analysis_new (d, 1, &o, NULL);
  a = sw_analysis_run (d, &o, NULL);
  g_assert_true (fast->ok && !fast->trade_losses_simulated);
  g_assert_true (a->sized_by_ascent && a->trade_losses_simulated);
  closed = a->sizing.liftoff_mass_kg;

  g_assert_true (sw_analysis_staging (fast, 6, &first, NULL));
  g_assert_true (sw_analysis_staging (a, 6, &looped, NULL));
  g_assert_cmpint (looped.design_index, ==, 2);
  /* This design's row and the design's liftoff mass are the totals'. */
  g_assert_cmpfloat_with_epsilon (looped.rows[2].liftoff_mass_kg / closed, 1.0, 1e-9);
  g_assert_cmpfloat_with_epsilon (looped.design_liftoff_mass_kg / closed, 1.0, 1e-9);
  /* Its payload at its own liftoff mass is its payload. */
  g_assert_cmpfloat_with_epsilon (looped.rows[2].payload_fixed_size_kg / d->payload_kg, 1.0,
                                  1e-9);
  /* The first guess is far enough from the loop for the test to tell
   * (about 41.5 t against 45.0 t). */
  g_assert_cmpfloat (fabs (first.rows[2].liftoff_mass_kg / closed - 1.0), >, 0.03);
  g_assert_cmpfloat_with_epsilon (first.rows[2].liftoff_mass_kg / fast->sizing.liftoff_mass_kg,
                                  1.0, 1e-9);
  g_assert_nonnull (strstr (first.losses_note, "first guess"));
  g_assert_nonnull (strstr (looped.losses_note, "closed loop's losses"));
  g_assert_null (strstr (looped.losses_note, "first guess"));
}

/* The carpet of a "simulate" design takes the same route as the staging
 * table: once the analysis has the closed loop's losses, every point is
 * sized with them (and the loop's fairing point), so this design's value is
 * the totals' liftoff mass, and a grid point is the sizing of the looped
 * vehicle with that point's inputs; before, the first guess, and the notes
 * say which. */
static void
test_carpet_follows_loop (void)
{
  g_autoptr (SwDesign) d = demo ("three-stage-simulated.stagewright");
  g_autoptr (SwDesign) looped = NULL;
  g_autoptr (SwAnalysis) fast = NULL, a = NULL;
  g_autoptr (SwCarpet) first = NULL, flown = NULL, by_losses = NULL;
  g_autoptr (GError) error = NULL;
  SwCarpetOptions o = { 0 };
  SwAnalysisOptions ao;
  double closed;

  sw_analysis_options_init (&ao);
  ao.montecarlo = FALSE;
  fast = sw_analysis_new (d, 1, &ao, NULL);
  a = sw_analysis_run (d, &ao, NULL);
  g_assert_true (fast->ok && !fast->trade_losses_simulated);
  g_assert_true (a->sized_by_ascent && a->trade_losses_simulated);
  closed = a->sizing.liftoff_mass_kg;

  o.x.kind = SW_CARPET_PARAM_STRUCTURAL_COEFFICIENT;
  o.x.stage = 0;
  o.x.min = 0.05;
  o.x.max = 0.12;
  o.x.n = 8;
  o.y.kind = SW_CARPET_PARAM_ISP_VAC;
  o.y.stage = 2;
  o.y.min = 320.0;
  o.y.max = 360.0;
  o.y.n = 5;
  o.output = SW_CARPET_LIFTOFF_MASS;
  first = sw_analysis_carpet (fast, &o, &error);
  g_assert_no_error (error);
  flown = sw_analysis_carpet (a, &o, &error);
  g_assert_no_error (error);

  /* This design's value is the totals' (the closed loop's sizing), and the
   * first guess's before the loop closes; the two are far enough apart
   * for the test to tell (about 45.0 t against 41.5 t). */
  g_assert_cmpfloat_with_epsilon (flown->design_value / closed, 1.0, 1e-9);
  g_assert_cmpfloat_with_epsilon (first->design_value / fast->sizing.liftoff_mass_kg, 1.0, 1e-9);
  g_assert_cmpfloat (fabs (first->design_value / closed - 1.0), >, 0.03);
  g_assert_nonnull (strstr (first->note, "first guess"));
  g_assert_nonnull (strstr (flown->note, "closed loop's losses"));
  g_assert_null (strstr (flown->note, "first guess"));

  /* Every point of the looped grid is the looped vehicle sized with the
   * point's inputs (sw_size_design: the loop's losses and fairing point). */
  looped = sw_analysis_dup_trade_design (a);
  g_assert_true (looped->ascent.has_flown_fairing);
  for (guint j = 0; j < o.y.n; j++)
    for (guint i = 0; i < o.x.n; i++)
      {
        g_autoptr (SwDesign) p = sw_design_copy (looped);
        SwSizing s;
        double v = flown->values[j * o.x.n + i];

        sw_carpet_apply (&o.x, p, sw_carpet_axis_value (&o.x, i));
        sw_carpet_apply (&o.y, p, sw_carpet_axis_value (&o.y, j));
        if (sw_size_design (p, &s, NULL) && s.feasible)
          g_assert_cmpfloat_with_epsilon (v / s.liftoff_mass_kg, 1.0, 1e-9);
        else
          g_assert_false (flown->feasible[j * o.x.n + i]);
      }

  /* With the losses as an axis, the mark sits at the loop's losses. */
  o.y.kind = SW_CARPET_PARAM_LOSSES;
  o.y.min = 1000.0;
  o.y.max = 2500.0;
  by_losses = sw_analysis_carpet (a, &o, &error);
  g_assert_no_error (error);
  g_assert_cmpfloat_with_epsilon (by_losses->design_y / a->trade_losses_m_s, 1.0, 1e-12);
  g_assert_cmpfloat_with_epsilon (by_losses->design_value / closed, 1.0, 1e-9);
  g_assert_nonnull (strstr (by_losses->note, "losses are an axis"));
}

/* The thrust-to-weight at liftoff: the sized figure of the stage that
 * lifts off, the first that burns.  With a manual split that leaves the
 * first stage empty, the upper stage lifts the whole vehicle, and the
 * sized figure is its own (within 2 % of the simulated ascent's, which
 * then stands); the empty first stage's figure (its thrust over the same
 * weight, more than twice as high) was shown beside the verdict's before. */
static void
test_liftoff_tw (void)
{
  g_autoptr (SwDesign) d = demo ("medium-cargo.stagewright");
  g_autoptr (SwAnalysis) normal = sw_analysis_compute (d, 1, NULL);
  g_autoptr (SwAnalysis) empty = NULL, flown = NULL;
  double tw;

  g_assert_true (normal->ok && normal->has_stage_figures);
  g_assert_cmpfloat (sw_analysis_liftoff_tw (normal), ==,
                     normal->stage_figures[0].ignition_thrust_to_weight);

  d->split = SW_SPLIT_MANUAL;
  d->stages[0].has_share = d->stages[1].has_share = TRUE;
  d->stages[0].delta_v_share = 0.0;
  d->stages[1].delta_v_share = 1.0;
  empty = sw_analysis_compute (d, 2, NULL);
  g_assert_true (empty->ok && empty->has_stage_figures);
  g_assert_cmpfloat (empty->sizing.stages[0].propellant_mass_kg, ==, 0.0);
  tw = sw_analysis_liftoff_tw (empty);
  g_assert_cmpfloat (tw, ==, empty->stage_figures[1].ignition_thrust_to_weight);
  g_assert_cmpfloat (tw, <, 0.5 * empty->stage_figures[0].ignition_thrust_to_weight);
  flown = sw_analysis_add_ascent (empty, NULL);
  g_assert_nonnull (flown);
  g_assert_nonnull (flown->ascent);
  g_assert_cmpfloat_with_epsilon (sw_analysis_liftoff_tw (flown), tw, 0.02 * tw);
  g_assert_cmpfloat_with_epsilon (sw_analysis_liftoff_tw (flown),
                                  flown->ascent->liftoff_thrust_to_weight, 1e-12);
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/analysis/state-strings", test_state_strings);
  g_test_add_func ("/analysis/verdicts", test_verdicts);
  g_test_add_func ("/analysis/precedence", test_precedence);
  g_test_add_func ("/analysis/paper-only-with-limit", test_paper_only_with_limit);
  g_test_add_func ("/analysis/copy-shares", test_copy_shares);
  g_test_add_func ("/analysis/liftoff-tw", test_liftoff_tw);
  g_test_add_func ("/analysis/cancel-and-phases", test_cancel_and_phases);
  g_test_add_func ("/analysis/trade-uses-loop-losses", test_trade_uses_loop_losses);
  g_test_add_func ("/analysis/trade-losses-note", test_trade_losses_note);
  g_test_add_func ("/analysis/booster-trade-uses-loop-losses",
                   test_booster_trade_uses_loop_losses);
  g_test_add_func ("/analysis/closed-loop-sizing", test_closed_loop_sizing);
  g_test_add_func ("/analysis/fixed-stage-trades", test_fixed_stage_trades);
  g_test_add_func ("/analysis/fixed-loads-loop", test_fixed_loads_loop);
  g_test_add_func ("/analysis/payload-curve-note", test_payload_curve_note);
  g_test_add_func ("/analysis/shape-follows-loop", test_shape_follows_loop);
  g_test_add_func ("/analysis/staging-follows-loop", test_staging_follows_loop);
  g_test_add_func ("/analysis/carpet-follows-loop", test_carpet_follows_loop);
  return g_test_run ();
}
