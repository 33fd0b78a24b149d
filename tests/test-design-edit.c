/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The edits the GUI makes to a design (sw-design-edit.h).  Expected shares
 * are worked out by hand beside each check: the arithmetic is fractions of
 * small numbers, so the checks use 1e-15 (a few ulp of values <= 1) unless
 * a division by a sum makes rounding possible, then 1e-12.  Every manual
 * design the edits leave must have shares adding up to 1 within 1e-12 and
 * pass the loader's own validation. */
#include "config.h"

#include "sw-design.h"
#include "sw-design-edit.h"
#include "sw-sizing.h"

#include <gsl/gsl_rng.h>
#include <math.h>
#include <string.h>

#define EXACT 1e-15
#define SUM_TOL 1e-12

static SwDesign *
manual_design (guint n, const double *shares)
{
  SwDesign *d = sw_design_new_default ();

  d->n_stages = n;
  d->split = SW_SPLIT_MANUAL;
  for (guint i = 0; i < n; i++)
    {
      sw_stage_init_default (&d->stages[i], i);
      g_snprintf (d->stages[i].name, sizeof d->stages[i].name, "%c", 'A' + i);
      d->stages[i].has_share = TRUE;
      d->stages[i].delta_v_share = shares[i];
    }
  return d;
}

static void
assert_shares (const SwDesign *d, guint n, const double *expected, double tol)
{
  double sum = 0.0;

  g_assert_cmpuint (d->n_stages, ==, n);
  for (guint i = 0; i < n; i++)
    {
      g_assert_true (d->stages[i].has_share);
      g_assert_cmpfloat_with_epsilon (d->stages[i].delta_v_share, expected[i], tol);
      g_assert_cmpfloat (d->stages[i].delta_v_share, >=, 0.0);
      g_assert_cmpfloat (d->stages[i].delta_v_share, <=, 1.0);
      sum += d->stages[i].delta_v_share;
    }
  if (d->split == SW_SPLIT_MANUAL)
    g_assert_cmpfloat_with_epsilon (sum, 1.0, SUM_TOL);
}

static void
assert_valid (const SwDesign *d)
{
  g_autoptr (GError) error = NULL;

  if (!sw_design_validate (d, "edited", &error))
    g_error ("an edit left a design the loader rejects: %s", error->message);
}

/* ---- taking the split on screen into the manual split ----------------- */

static void
test_take_manual_shares (void)
{
  static const double start[] = { 0.2, 0.2, 0.6 };

  /* Shares that add up to 1 are taken as they are. */
  {
    g_autoptr (SwDesign) d = manual_design (3, start);
    static const double on_screen[] = { 0.6, 0.3, 0.1 };
    d->split = SW_SPLIT_OPTIMAL;
    g_assert_true (sw_design_take_manual_shares (d, on_screen, 3));
    g_assert_cmpint (d->split, ==, SW_SPLIT_MANUAL);
    assert_shares (d, 3, on_screen, EXACT);
    assert_valid (d);
  }
  /* Shares that do not add up to 1 are scaled: 3 and 1 of 4 are 0.75, 0.25. */
  {
    g_autoptr (SwDesign) d = manual_design (2, start);
    static const double raw[] = { 3.0, 1.0 }, expected[] = { 0.75, 0.25 };
    d->split = SW_SPLIT_EQUAL;
    g_assert_true (sw_design_take_manual_shares (d, raw, 2));
    assert_shares (d, 2, expected, EXACT);
  }
  /* An optimum that gives one stage nothing: the zero is kept. */
  {
    g_autoptr (SwDesign) d = manual_design (3, start);
    static const double raw[] = { 0.55, 0.45, 0.0 };
    d->split = SW_SPLIT_OPTIMAL;
    g_assert_true (sw_design_take_manual_shares (d, raw, 3));
    assert_shares (d, 3, raw, EXACT);
  }
  /* Shares that do not fit give equal shares, 1/3 each, and FALSE; the
   * design is in the manual split either way. */
  {
    static const double third[] = { 1.0 / 3, 1.0 / 3, 1.0 / 3 };
    const double two[] = { 0.5, 0.5 };
    const double with_nan[] = { 0.5, NAN, 0.5 };
    const double with_inf[] = { 0.5, INFINITY, 0.5 };
    const double negative[] = { 0.7, -0.1, 0.4 };
    const double zeros[] = { 0.0, 0.0, 0.0 };
    const double *bad[] = { NULL, two, with_nan, with_inf, negative, zeros };
    const guint counts[] = { 3, 2, 3, 3, 3, 3 };

    for (guint k = 0; k < G_N_ELEMENTS (bad); k++)
      {
        g_autoptr (SwDesign) d = manual_design (3, start);
        d->split = SW_SPLIT_OPTIMAL;
        g_assert_false (sw_design_take_manual_shares (d, bad[k], counts[k]));
        g_assert_cmpint (d->split, ==, SW_SPLIT_MANUAL);
        assert_shares (d, 3, third, EXACT);
      }
  }
}

/* The split on screen read from a sizing filled in by hand. */
static void
test_sizing_get_shares (void)
{
  SwSizing s;
  double shares[SW_MAX_STAGES];

  memset (&s, 0, sizeof s);
  s.n_stages = 2;
  s.delta_v_m_s = 9000.0;
  s.stages[0].delta_v_share = 0.25;
  s.stages[1].delta_v_share = 0.75;
  g_assert_cmpuint (sw_sizing_get_shares (&s, shares), ==, 2);
  g_assert_cmpfloat (shares[0], ==, 0.25);
  g_assert_cmpfloat (shares[1], ==, 0.75);

  s.stages[1].delta_v_share = NAN;
  g_assert_cmpuint (sw_sizing_get_shares (&s, shares), ==, 0);
  s.stages[1].delta_v_share = -0.01;
  g_assert_cmpuint (sw_sizing_get_shares (&s, shares), ==, 0);
  s.stages[1].delta_v_share = 0.75;
  s.delta_v_m_s = 0.0;
  g_assert_cmpuint (sw_sizing_get_shares (&s, shares), ==, 0);

  /* A real sizing: the equal split of 3 stages gives 1/3 each (by
   * definition of the equal split), and taking them into the manual split
   * leaves a design that sizes to the same stage delta-v. */
  {
    g_autoptr (SwDesign) d = sw_design_new_default ();
    g_autoptr (GError) error = NULL;
    static const double third[] = { 1.0 / 3, 1.0 / 3, 1.0 / 3 };
    SwSizing before, after;
    guint n;

    sw_design_add_stage (d);
    d->split = SW_SPLIT_EQUAL;
    g_assert_true (sw_size_design (d, &before, &error));
    n = sw_sizing_get_shares (&before, shares);
    g_assert_cmpuint (n, ==, 3);
    g_assert_true (sw_design_take_manual_shares (d, shares, n));
    assert_shares (d, 3, third, 1e-15);
    g_assert_true (sw_size_design (d, &after, &error));
    for (guint i = 0; i < 3; i++)
      g_assert_cmpfloat_with_epsilon (after.stages[i].delta_v_m_s, 9400.0 / 3, 1e-9);
  }
}

/* ---- setting one share ------------------------------------------------- */

static void
test_set_share_rebalanced (void)
{
  static const double start[] = { 0.5, 0.3, 0.2 };

  /* 0.6 for stage 0: the other two keep 3:2 of the remaining 0.4, i.e.
   * 0.24 and 0.16. */
  {
    g_autoptr (SwDesign) d = manual_design (3, start);
    static const double expected[] = { 0.6, 0.24, 0.16 };
    g_assert_true (sw_design_set_share_rebalanced (d, 0, 0.6));
    assert_shares (d, 3, expected, EXACT);
    assert_valid (d);
  }
  /* Above 1 clamps to 1, the others go to 0; then 0.4 for stage 0 with
   * the others all 0: they share 0.6 equally, 0.3 each. */
  {
    g_autoptr (SwDesign) d = manual_design (3, start);
    static const double all[] = { 1.0, 0.0, 0.0 }, split[] = { 0.4, 0.3, 0.3 };
    g_assert_true (sw_design_set_share_rebalanced (d, 0, 1.3));
    assert_shares (d, 3, all, EXACT);
    g_assert_true (sw_design_set_share_rebalanced (d, 0, 0.4));
    assert_shares (d, 3, split, EXACT);
  }
  /* Below 0 clamps to 0: stage 2 gives its 0.2 to the others, 5:3 of 1,
   * 0.625 and 0.375. */
  {
    g_autoptr (SwDesign) d = manual_design (3, start);
    static const double expected[] = { 0.625, 0.375, 0.0 };
    g_assert_true (sw_design_set_share_rebalanced (d, 2, -0.5));
    assert_shares (d, 3, expected, EXACT);
  }
  /* A single stage always has all of it. */
  {
    static const double one[] = { 1.0 };
    g_autoptr (SwDesign) d = manual_design (1, one);
    g_assert_true (sw_design_set_share_rebalanced (d, 0, 0.3));
    assert_shares (d, 1, one, EXACT);
  }
  /* An index out of range is refused and changes nothing. */
  {
    g_autoptr (SwDesign) d = manual_design (3, start);
    g_autoptr (SwDesign) before = sw_design_copy (d);
    g_assert_false (sw_design_set_share_rebalanced (d, 3, 0.5));
    g_assert_true (sw_design_equal (d, before));
  }
}

/* ---- moving share across a border -------------------------------------- */

static void
test_move_share (void)
{
  static const double start[] = { 0.5, 0.3, 0.2 };
  g_autoptr (SwDesign) d = manual_design (3, start);
  g_autoptr (SwDesign) before = NULL;

  /* 0.1 from stage 1 to stage 2: 0.5, 0.2, 0.3. */
  {
    static const double expected[] = { 0.5, 0.2, 0.3 };
    g_assert_true (sw_design_move_share (d, 1, 2, 0.1));
    assert_shares (d, 3, expected, EXACT);
  }
  /* 0.5 from stage 1, which has 0.2: clamped, stage 1 ends at 0 and stage 0
   * gets 0.2 (0.7); stage 2 is untouched. */
  {
    static const double expected[] = { 0.7, 0.0, 0.3 };
    g_assert_true (sw_design_move_share (d, 1, 0, 0.5));
    assert_shares (d, 3, expected, EXACT);
    g_assert_cmpfloat (d->stages[1].delta_v_share, ==, 0.0);
  }
  /* A negative amount moves the other way: -0.4 from 0 to 2 takes 0.4 from
   * stage 2, which has 0.3: clamped to 0.3, giving 1, 0, 0. */
  {
    static const double expected[] = { 1.0, 0.0, 0.0 };
    g_assert_true (sw_design_move_share (d, 0, 2, -0.4));
    assert_shares (d, 3, expected, EXACT);
    assert_valid (d);
  }
  /* Within one stage nothing changes; an index out of range is refused. */
  before = sw_design_copy (d);
  g_assert_true (sw_design_move_share (d, 1, 1, 0.3));
  g_assert_true (sw_design_equal (d, before));
  g_assert_false (sw_design_move_share (d, 0, 3, 0.1));
  g_assert_false (sw_design_move_share (d, 5, 0, 0.1));
  g_assert_true (sw_design_equal (d, before));

  /* A long drag in small steps does not drift: 1000 steps of 0.001 across
   * the border 0/1 and back leave the sum at 1 within 1e-12. */
  for (guint k = 0; k < 1000; k++)
    sw_design_move_share (d, 0, 1, 0.001);
  for (guint k = 0; k < 1000; k++)
    sw_design_move_share (d, 1, 0, 0.001);
  {
    static const double expected[] = { 1.0, 0.0, 0.0 };
    assert_shares (d, 3, expected, 1e-12);
  }
}

/* ---- split mode -------------------------------------------------------- */

static void
test_set_split (void)
{
  static const double start[] = { 0.5, 0.5 };
  static const double on_screen[] = { 0.7, 0.3 };
  g_autoptr (SwDesign) d = manual_design (2, start);

  d->split = SW_SPLIT_OPTIMAL;
  g_assert_false (sw_design_set_split (d, SW_SPLIT_OPTIMAL, NULL, 0));
  g_assert_true (sw_design_set_split (d, SW_SPLIT_MANUAL, on_screen, 2));
  g_assert_cmpint (d->split, ==, SW_SPLIT_MANUAL);
  assert_shares (d, 2, on_screen, EXACT);
  /* Manual to manual changes nothing, even with other shares offered. */
  g_assert_false (sw_design_set_split (d, SW_SPLIT_MANUAL, start, 2));
  assert_shares (d, 2, on_screen, EXACT);
  /* Leaving the manual split keeps the stored shares (they come back when
   * the file is loaded and the user returns to manual). */
  g_assert_true (sw_design_set_split (d, SW_SPLIT_EQUAL, NULL, 0));
  g_assert_cmpint (d->split, ==, SW_SPLIT_EQUAL);
  assert_shares (d, 2, on_screen, EXACT);
  /* Into manual with nothing on screen: equal shares. */
  g_assert_true (sw_design_set_split (d, SW_SPLIT_MANUAL, NULL, 0));
  assert_shares (d, 2, start, EXACT);
  assert_valid (d);
}

/* ---- the stage list ---------------------------------------------------- */

static void
test_add_stage (void)
{
  static const double start[] = { 0.6, 0.4 };

  /* Manual: the new stage gets 1/3, the others 2/3 of what they had:
   * 0.6 * 2/3 = 0.4, 0.4 * 2/3 = 4/15. */
  {
    g_autoptr (SwDesign) d = manual_design (2, start);
    static const double expected[] = { 0.4, 4.0 / 15, 1.0 / 3 };
    g_assert_true (sw_design_add_stage (d));
    assert_shares (d, 3, expected, EXACT);
    /* The defaults of an upper stage (sw_stage_init_default). */
    g_assert_cmpfloat (d->stages[2].isp_vac_s, ==, 340.0);
    g_assert_false (d->stages[2].has_isp_sl);
    g_assert_cmpfloat (d->stages[2].structural_coefficient, ==, 0.09);
    assert_valid (d);
  }
  /* Optimal: the others' stored values are left alone. */
  {
    g_autoptr (SwDesign) d = manual_design (2, start);
    d->split = SW_SPLIT_OPTIMAL;
    g_assert_true (sw_design_add_stage (d));
    g_assert_cmpuint (d->n_stages, ==, 3);
    g_assert_cmpfloat (d->stages[0].delta_v_share, ==, 0.6);
    g_assert_cmpfloat (d->stages[1].delta_v_share, ==, 0.4);
    assert_valid (d);
  }
  /* Up to eight; the ninth is refused and changes nothing. */
  {
    g_autoptr (SwDesign) d = manual_design (2, start);
    g_autoptr (SwDesign) before = NULL;
    double sum = 0.0;

    for (guint n = 3; n <= SW_MAX_STAGES; n++)
      g_assert_true (sw_design_add_stage (d));
    g_assert_cmpuint (d->n_stages, ==, 8);
    /* The last added holds 1/8. */
    g_assert_cmpfloat_with_epsilon (d->stages[7].delta_v_share, 0.125, EXACT);
    for (guint i = 0; i < 8; i++)
      sum += d->stages[i].delta_v_share;
    g_assert_cmpfloat_with_epsilon (sum, 1.0, SUM_TOL);
    before = sw_design_copy (d);
    g_assert_false (sw_design_add_stage (d));
    g_assert_true (sw_design_equal (d, before));
    assert_valid (d);
  }
}

static void
test_duplicate_stage (void)
{
  static const double start[] = { 0.5, 0.3, 0.2 };

  /* Stage B (0.3) duplicated: B and its copy hold 0.15 each, after it. */
  {
    g_autoptr (SwDesign) d = manual_design (3, start);
    static const double expected[] = { 0.5, 0.15, 0.15, 0.2 };
    d->stages[1].isp_vac_s = 333.0;
    g_assert_true (sw_design_duplicate_stage (d, 1));
    assert_shares (d, 4, expected, EXACT);
    g_assert_cmpstr (d->stages[1].name, ==, "B");
    g_assert_cmpstr (d->stages[2].name, ==, "B (copy)");
    g_assert_cmpstr (d->stages[3].name, ==, "C");
    g_assert_cmpfloat (d->stages[2].isp_vac_s, ==, 333.0);
    assert_valid (d);
  }
  /* Refused at eight stages and for an index out of range. */
  {
    g_autoptr (SwDesign) d = manual_design (3, start);
    g_autoptr (SwDesign) before = NULL;

    g_assert_false (sw_design_duplicate_stage (d, 3));
    while (d->n_stages < SW_MAX_STAGES)
      g_assert_true (sw_design_duplicate_stage (d, 0));
    before = sw_design_copy (d);
    g_assert_false (sw_design_duplicate_stage (d, 0));
    g_assert_true (sw_design_equal (d, before));
    /* 0.5 halved five times: 0.5/32 left in stage 0 and in its last copy. */
    g_assert_cmpfloat_with_epsilon (d->stages[0].delta_v_share, 0.5 / 32, EXACT);
    g_assert_cmpfloat_with_epsilon (d->stages[1].delta_v_share, 0.5 / 32, EXACT);
    assert_valid (d);
  }
  /* A long name: the copy's name is cut at a whole character.  63 two-byte
   * characters fill 126 of the 127 bytes; of " (copy)" only the space would
   * fit, and a trailing space is dropped. */
  {
    g_autoptr (SwDesign) d = manual_design (3, start);
    GString *name = g_string_new (NULL);

    for (guint i = 0; i < 63; i++)
      g_string_append (name, "\xc3\xa9");  /* U+00E9, two bytes in UTF-8 */
    g_assert_true (sw_design_set_stage_name (d, 0, name->str));
    g_assert_true (sw_design_duplicate_stage (d, 0));
    g_assert_cmpstr (d->stages[1].name, ==, name->str);
    g_assert_true (g_utf8_validate (d->stages[1].name, -1, NULL));
    g_string_free (name, TRUE);
    assert_valid (d);
  }
}

static void
test_remove_stage (void)
{
  static const double start[] = { 0.5, 0.3, 0.2 };

  /* Removing A (0.5): B and C scaled from 0.3 and 0.2 of 0.5 to 0.6, 0.4. */
  {
    g_autoptr (SwDesign) d = manual_design (3, start);
    static const double expected[] = { 0.6, 0.4 };
    g_assert_true (sw_design_remove_stage (d, 0));
    assert_shares (d, 2, expected, 1e-12);
    g_assert_cmpstr (d->stages[0].name, ==, "B");
    g_assert_cmpstr (d->stages[1].name, ==, "C");
    /* The slot behind the last stage is cleared. */
    g_assert_cmpstr (d->stages[2].name, ==, "");
    g_assert_cmpfloat (d->stages[2].isp_vac_s, ==, 0.0);
    assert_valid (d);
  }
  /* The rest held nothing: they share equally, 0.5 each. */
  {
    static const double all[] = { 1.0, 0.0, 0.0 }, half[] = { 0.5, 0.5 };
    g_autoptr (SwDesign) d = manual_design (3, all);
    g_assert_true (sw_design_remove_stage (d, 0));
    assert_shares (d, 2, half, EXACT);
  }
  /* The last stage is refused, as is an index out of range. */
  {
    static const double one[] = { 1.0 };
    g_autoptr (SwDesign) d = manual_design (1, one);
    g_autoptr (SwDesign) before = sw_design_copy (d);
    g_assert_false (sw_design_remove_stage (d, 0));
    g_assert_true (sw_design_equal (d, before));
  }
  {
    g_autoptr (SwDesign) d = manual_design (3, start);
    g_autoptr (SwDesign) before = sw_design_copy (d);
    g_assert_false (sw_design_remove_stage (d, 3));
    g_assert_true (sw_design_equal (d, before));
  }
}

/* A stage that becomes the first (the one below it removed, or moved
 * above it) lifts off: it loses its coast before ignition, which the file
 * format refuses on the first stage, and keeps the rest of its propulsion;
 * the design stays one the loader takes.  An upper stage keeps its coast. */
static void
test_first_stage_lifts_off (void)
{
  static const double start[] = { 0.4, 0.35, 0.25 };

  for (int how = 0; how < 2; how++)
    {
      g_autoptr (SwDesign) d = manual_design (3, start);
      SwStagePropulsion *upper = &d->stages[1].propulsion;

      upper->present = TRUE;
      upper->has_thrust = TRUE;
      upper->thrust_vac_kn = 300.0;
      upper->has_coast = TRUE;
      upper->coast_before_ignition_s = 4.0;
      d->stages[2].propulsion.present = TRUE;
      d->stages[2].propulsion.has_coast = TRUE;
      d->stages[2].propulsion.coast_before_ignition_s = 9.0;
      assert_valid (d);
      if (how == 0)
        g_assert_true (sw_design_remove_stage (d, 0));
      else
        g_assert_true (sw_design_move_stage (d, 1, 0));
      g_assert_cmpstr (d->stages[0].name, ==, "B");
      g_assert_false (d->stages[0].propulsion.has_coast);
      g_assert_true (d->stages[0].propulsion.has_thrust);
      g_assert_cmpfloat (d->stages[0].propulsion.thrust_vac_kn, ==, 300.0);
      g_assert_true (d->stages[0].propulsion.present);
      g_assert_true (d->stages[how == 0 ? 1 : 2].propulsion.has_coast);
      g_assert_cmpfloat (d->stages[how == 0 ? 1 : 2].propulsion.coast_before_ignition_s, ==, 9.0);
      assert_valid (d);
    }
}

static void
test_move_stage (void)
{
  static const double start[] = { 0.4, 0.3, 0.2, 0.1 };
  g_autoptr (SwDesign) d = manual_design (4, start);
  g_autoptr (SwDesign) before = NULL;

  /* A B C D, A to position 2: B C A D, the shares travelling along. */
  g_assert_true (sw_design_move_stage (d, 0, 2));
  {
    static const double expected[] = { 0.3, 0.2, 0.4, 0.1 };
    assert_shares (d, 4, expected, EXACT);
    g_assert_cmpstr (d->stages[0].name, ==, "B");
    g_assert_cmpstr (d->stages[1].name, ==, "C");
    g_assert_cmpstr (d->stages[2].name, ==, "A");
    g_assert_cmpstr (d->stages[3].name, ==, "D");
  }
  /* D to the bottom: D B C A. */
  g_assert_true (sw_design_move_stage (d, 3, 0));
  g_assert_cmpstr (d->stages[0].name, ==, "D");
  g_assert_cmpstr (d->stages[1].name, ==, "B");
  g_assert_cmpstr (d->stages[2].name, ==, "C");
  g_assert_cmpstr (d->stages[3].name, ==, "A");
  /* One step, as the list's up/down buttons do: a swap. */
  g_assert_true (sw_design_move_stage (d, 1, 2));
  g_assert_cmpstr (d->stages[1].name, ==, "C");
  g_assert_cmpstr (d->stages[2].name, ==, "B");
  assert_valid (d);

  before = sw_design_copy (d);
  g_assert_true (sw_design_move_stage (d, 2, 2));
  g_assert_false (sw_design_move_stage (d, 4, 0));
  g_assert_false (sw_design_move_stage (d, 0, 4));
  g_assert_true (sw_design_equal (d, before));
}

/* Any sequence of the GUI's share and stage edits keeps a valid manual
 * design: shares in [0, 1] adding up to 1 within 1e-12. */
static void
test_random_sequences (void)
{
  gsl_rng *rng = gsl_rng_alloc (gsl_rng_mt19937);
  static const double start[] = { 0.5, 0.5 };
  g_autoptr (SwDesign) d = manual_design (2, start);

  gsl_rng_set (rng, 9);
  for (guint k = 0; k < 20000; k++)
    {
      guint n = d->n_stages;
      guint i = gsl_rng_uniform_int (rng, n + 1), j = gsl_rng_uniform_int (rng, n + 1);
      double x = -0.3 + 1.6 * gsl_rng_uniform (rng);
      double sum = 0.0;

      switch (gsl_rng_uniform_int (rng, 6))
        {
        case 0: sw_design_set_share_rebalanced (d, i, x); break;
        case 1: sw_design_move_share (d, i, j, x - 0.5); break;
        case 2: sw_design_add_stage (d); break;
        case 3: sw_design_duplicate_stage (d, i); break;
        case 4: sw_design_remove_stage (d, i); break;
        default: sw_design_move_stage (d, i, j); break;
        }
      g_assert_cmpuint (d->n_stages, >=, 1);
      g_assert_cmpuint (d->n_stages, <=, SW_MAX_STAGES);
      for (guint s = 0; s < d->n_stages; s++)
        {
          g_assert_cmpfloat (d->stages[s].delta_v_share, >=, 0.0);
          g_assert_cmpfloat (d->stages[s].delta_v_share, <=, 1.0);
          sum += d->stages[s].delta_v_share;
        }
      g_assert_cmpfloat_with_epsilon (sum, 1.0, SUM_TOL);
    }
  assert_valid (d);
  gsl_rng_free (rng);
}

/* ---- fields ------------------------------------------------------------ */

static void
test_names (void)
{
  g_autoptr (SwDesign) d = sw_design_new_default ();
  GString *long_name = g_string_new (NULL);

  g_assert_true (sw_design_set_name (d, "Test vehicle"));
  g_assert_cmpstr (d->name, ==, "Test vehicle");
  /* 200 two-byte characters: 63 fit in 127 bytes (126 bytes used). */
  for (guint i = 0; i < 200; i++)
    g_string_append (long_name, "\xc3\xa9");
  g_assert_true (sw_design_set_name (d, long_name->str));
  g_assert_cmpuint (strlen (d->name), ==, 126);
  g_assert_cmpuint (g_utf8_strlen (d->name, -1), ==, 63);
  /* 127 one-byte characters fit exactly; the 128th does not. */
  g_string_assign (long_name, "");
  for (guint i = 0; i < 130; i++)
    g_string_append_c (long_name, 'x');
  g_assert_true (sw_design_set_stage_name (d, 1, long_name->str));
  g_assert_cmpuint (strlen (d->stages[1].name), ==, 127);
  /* Not UTF-8: refused, the name stays. */
  g_assert_false (sw_design_set_name (d, "bad \xff name"));
  g_assert_cmpuint (strlen (d->name), ==, 126);
  g_assert_false (sw_design_set_stage_name (d, 0, "\xc3"));
  g_assert_false (sw_design_set_stage_name (d, 2, "no such stage"));
  g_string_free (long_name, TRUE);
  assert_valid (d);
}

static void
test_mission_kind (void)
{
  g_autoptr (SwDesign) d = sw_design_new_default ();

  d->mission.delta_v_m_s = 9100.0;

  /* To an orbit mission: no accepted altitude yet, so the starting orbit
   * 400 km, 30 deg, latitude 28 deg, 1500 m/s of losses. */
  g_assert_true (sw_design_set_mission_kind (d, SW_MISSION_ORBIT, 9100.0));
  g_assert_cmpint (d->mission.kind, ==, SW_MISSION_ORBIT);
  g_assert_cmpfloat (d->mission.altitude_km, ==, 400.0);
  g_assert_cmpfloat (d->mission.inclination_deg, ==, 30.0);
  g_assert_cmpfloat (d->mission.site_latitude_deg, ==, 28.0);
  g_assert_true (d->mission.has_losses);
  g_assert_cmpfloat (d->mission.losses_m_s, ==, 1500.0);
  assert_valid (d);
  g_assert_false (sw_design_set_mission_kind (d, SW_MISSION_ORBIT, 0.0));

  d->mission.altitude_km = 250.0;
  d->mission.inclination_deg = 51.5;
  d->mission.site_latitude_deg = 45.9;
  assert_valid (d);

  /* Back to delta-v: the earlier 9100 m/s is still accepted and kept. */
  g_assert_true (sw_design_set_mission_kind (d, SW_MISSION_DELTA_V, 9876.0));
  g_assert_cmpfloat (d->mission.delta_v_m_s, ==, 9100.0);
  /* Again with no accepted delta-v: the one the orbit needed, rounded to
   * 1 m/s (9312.6 -> 9313); without one (NAN), 9400 m/s. */
  sw_design_set_mission_kind (d, SW_MISSION_ORBIT, NAN);
  g_assert_cmpfloat (d->mission.altitude_km, ==, 250.0);  /* kept: accepted */
  d->mission.delta_v_m_s = 0.0;
  g_assert_true (sw_design_set_mission_kind (d, SW_MISSION_DELTA_V, 9312.6));
  g_assert_cmpfloat (d->mission.delta_v_m_s, ==, 9313.0);
  sw_design_set_mission_kind (d, SW_MISSION_ORBIT, NAN);
  d->mission.delta_v_m_s = 0.0;
  g_assert_true (sw_design_set_mission_kind (d, SW_MISSION_DELTA_V, NAN));
  g_assert_cmpfloat (d->mission.delta_v_m_s, ==, 9400.0);
  /* A suggestion outside the accepted range (30 km/s) is not taken. */
  sw_design_set_mission_kind (d, SW_MISSION_ORBIT, NAN);
  d->mission.delta_v_m_s = 0.0;
  g_assert_true (sw_design_set_mission_kind (d, SW_MISSION_DELTA_V, 45000.0));
  g_assert_cmpfloat (d->mission.delta_v_m_s, ==, 9400.0);
  assert_valid (d);
}

static void
test_sea_level_isp (void)
{
  g_autoptr (SwDesign) d = sw_design_new_default ();

  /* Stage 1 has none; given one, it starts at 0.9 x 345 = 310.5, rounded
   * half away from zero to 311. */
  d->stages[1].isp_vac_s = 345.0;
  g_assert_false (d->stages[1].has_isp_sl);
  g_assert_true (sw_design_set_stage_has_isp_sl (d, 1, TRUE));
  g_assert_true (d->stages[1].has_isp_sl);
  g_assert_cmpfloat (d->stages[1].isp_sl_s, ==, 311.0);
  assert_valid (d);
  /* An accepted value is kept when the box is ticked again. */
  d->stages[1].isp_sl_s = 290.0;
  g_assert_true (sw_design_set_stage_has_isp_sl (d, 1, FALSE));
  g_assert_false (d->stages[1].has_isp_sl);
  assert_valid (d);
  g_assert_true (sw_design_set_stage_has_isp_sl (d, 1, TRUE));
  g_assert_cmpfloat (d->stages[1].isp_sl_s, ==, 290.0);
  /* One above the vacuum Isp is not accepted: the starting value again. */
  d->stages[1].isp_sl_s = 400.0;
  g_assert_true (sw_design_set_stage_has_isp_sl (d, 1, FALSE));
  g_assert_true (sw_design_set_stage_has_isp_sl (d, 1, TRUE));
  g_assert_cmpfloat (d->stages[1].isp_sl_s, ==, 311.0);
  assert_valid (d);

  /* Past the last stage: refused. */
  g_assert_false (sw_design_set_stage_has_isp_sl (d, 2, TRUE));
  g_assert_false (d->stages[2].has_isp_sl);
}

static void
test_baseline (void)
{
  g_autoptr (SwDesign) d = sw_design_new_default ();
  g_autoptr (SwDesign) plain = NULL;

  g_assert_false (sw_design_clear_baseline (d));
  sw_design_pin_baseline (d);
  g_assert_nonnull (d->baseline);
  g_assert_null (d->baseline->baseline);
  plain = sw_design_copy (d);
  g_clear_pointer (&plain->baseline, sw_design_free);
  g_assert_true (sw_design_equal (d->baseline, plain));

  /* Pinning again replaces the baseline with the design as it is now, and
   * never nests one baseline in another. */
  d->payload_kg = 4321.0;
  sw_design_pin_baseline (d);
  g_assert_null (d->baseline->baseline);
  g_assert_cmpfloat (d->baseline->payload_kg, ==, 4321.0);
  assert_valid (d);

  g_assert_true (sw_design_clear_baseline (d));
  g_assert_null (d->baseline);
  g_assert_false (sw_design_clear_baseline (d));
}


/* Accepting estimated structural coefficients: rounded to 4 decimals, NAN
 * keeps a stage's, all or nothing on a wrong count or a value out of the
 * limits table's range (0.01 to 0.6), "changed" only when one moved. */
static void
test_accept_structural_coefficients (void)
{
  static const double shares[] = { 0.5, 0.3, 0.2 };
  g_autoptr (SwDesign) d = manual_design (3, shares);
  g_autoptr (SwDesign) before = NULL;
  g_autoptr (GError) error = NULL;
  double eps[3] = { 0.067829, NAN, 0.176207 };
  double bad[3] = { 0.05, 0.08, 0.7 };
  gboolean changed = TRUE;

  d->stages[1].structural_coefficient = 0.09;
  g_assert_true (sw_design_accept_structural_coefficients (d, eps, 3, &changed, &error));
  g_assert_no_error (error);
  g_assert_true (changed);
  g_assert_cmpfloat (d->stages[0].structural_coefficient, ==, 0.0678);
  g_assert_cmpfloat (d->stages[1].structural_coefficient, ==, 0.09);
  g_assert_cmpfloat (d->stages[2].structural_coefficient, ==, 0.1762);

  /* Again: nothing moves. */
  g_assert_true (sw_design_accept_structural_coefficients (d, eps, 3, &changed, &error));
  g_assert_false (changed);

  before = sw_design_copy (d);
  g_assert_false (sw_design_accept_structural_coefficients (d, bad, 3, &changed, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_RANGE);
  g_assert_nonnull (strstr (error->message, "stages[2].structural_coefficient"));
  g_assert_true (sw_design_equal (d, before));
  g_clear_error (&error);

  g_assert_false (sw_design_accept_structural_coefficients (d, eps, 2, NULL, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_RANGE);
  g_assert_true (sw_design_equal (d, before));
}

/* The boosters' estimate joins the stages' in one edit: rounded to 4
 * decimals alike, NAN keeps it, all or nothing when either is out of range,
 * and an estimate for boosters the design does not have is refused. */
static void
test_accept_estimated_coefficients (void)
{
  static const double shares[] = { 0.6, 0.4 };
  g_autoptr (SwDesign) d = manual_design (2, shares);
  g_autoptr (SwDesign) before = NULL;
  g_autoptr (GError) error = NULL;
  double eps[2] = { NAN, NAN };
  double good[2] = { 0.05, 0.08 };
  gboolean changed = TRUE;

  /* Without boosters: NAN for them keeps the design as it is. */
  g_assert_true (sw_design_accept_estimated_coefficients (d, eps, 2, NAN, &changed, &error));
  g_assert_no_error (error);
  g_assert_false (changed);
  before = sw_design_copy (d);
  g_assert_false (sw_design_accept_estimated_coefficients (d, good, 2, 0.14, &changed, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_RANGE);
  g_assert_nonnull (strstr (error->message, "boosters.structural_coefficient"));
  g_assert_true (sw_design_equal (d, before));
  g_clear_error (&error);

  d->boosters.count = 2;
  sw_boosters_init_default (&d->boosters);
  d->boosters.structural_coefficient = 0.11;
  g_clear_pointer (&before, sw_design_free);
  before = sw_design_copy (d);
  /* Only the boosters move: 0.144574 rounds to 0.1446. */
  g_assert_true (sw_design_accept_estimated_coefficients (d, eps, 2, 0.144574, &changed,
                                                          &error));
  g_assert_no_error (error);
  g_assert_true (changed);
  g_assert_cmpfloat (d->boosters.structural_coefficient, ==, 0.1446);
  g_assert_cmpfloat (d->stages[0].structural_coefficient, ==,
                     before->stages[0].structural_coefficient);
  /* The same again moves nothing. */
  g_assert_true (sw_design_accept_estimated_coefficients (d, eps, 2, 0.144574, &changed,
                                                          &error));
  g_assert_false (changed);
  /* Out of range (limits table 0.01 to 0.6): nothing moves, the stages'
   * good values included. */
  g_clear_pointer (&before, sw_design_free);
  before = sw_design_copy (d);
  g_assert_false (sw_design_accept_estimated_coefficients (d, good, 2, 0.71, &changed, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_RANGE);
  g_assert_nonnull (strstr (error->message, "boosters.structural_coefficient"));
  g_assert_true (sw_design_equal (d, before));
  g_clear_error (&error);
  /* Stages and boosters together. */
  g_assert_true (sw_design_accept_estimated_coefficients (d, good, 2, 0.12, &changed, &error));
  g_assert_true (changed);
  g_assert_cmpfloat (d->stages[0].structural_coefficient, ==, 0.05);
  g_assert_cmpfloat (d->stages[1].structural_coefficient, ==, 0.08);
  g_assert_cmpfloat (d->boosters.structural_coefficient, ==, 0.12);
}

/* The economics object's stage indices follow their stages: engine type A
 * on stages {0, 1}, B on {3}, stages {2, 3} developed, in a 4-stage design.
 * Each expected mask is worked out by hand beside the call. */
static void
test_economics_follow_stages (void)
{
  const double shares[] = { 0.25, 0.25, 0.25, 0.25 };
  g_autoptr (SwDesign) d = manual_design (4, shares);
  SwEconomics *e = &d->economics;

  e->present = TRUE;
  e->n_engine_types = 2;
  g_strlcpy (e->engine_types[0].name, "A", sizeof e->engine_types[0].name);
  e->engine_types[0].dry_mass_kg = 500.0;
  e->engine_types[0].stage_mask = 0x3;
  g_strlcpy (e->engine_types[1].name, "B", sizeof e->engine_types[1].name);
  e->engine_types[1].dry_mass_kg = 200.0;
  e->engine_types[1].stage_mask = 0x8;
  e->developed_stages = 0xc;
  assert_valid (d);

  /* Stage 3 moves to 0: old order 0 1 2 3 becomes 3 0 1 2. A on old 0, 1
   * -> new 1, 2 (0x6); B on old 3 -> new 0 (0x1); developed old 2, 3 -> new
   * 3, 0 (0x9). */
  g_assert_true (sw_design_move_stage (d, 3, 0));
  g_assert_cmpuint (e->engine_types[0].stage_mask, ==, 0x6);
  g_assert_cmpuint (e->engine_types[1].stage_mask, ==, 0x1);
  g_assert_cmpuint (e->developed_stages, ==, 0x9);
  assert_valid (d);
  /* And back (0 to 3). */
  g_assert_true (sw_design_move_stage (d, 0, 3));
  g_assert_cmpuint (e->engine_types[0].stage_mask, ==, 0x3);
  g_assert_cmpuint (e->engine_types[1].stage_mask, ==, 0x8);
  g_assert_cmpuint (e->developed_stages, ==, 0xc);

  /* Duplicating stage 1: the copy (new 2) has A's engines and is not
   * developed; old 2, 3 become 3, 4. A 0x7, B 0x10, developed 0x18. */
  g_assert_true (sw_design_duplicate_stage (d, 1));
  g_assert_cmpuint (e->engine_types[0].stage_mask, ==, 0x7);
  g_assert_cmpuint (e->engine_types[1].stage_mask, ==, 0x10);
  g_assert_cmpuint (e->developed_stages, ==, 0x18);
  assert_valid (d);

  /* Removing the last stage (4) takes B off every stage and stage 4 out of
   * the developed list: a file naming a stage the design no longer has
   * would not load. */
  g_assert_true (sw_design_remove_stage (d, 4));
  g_assert_cmpuint (e->engine_types[0].stage_mask, ==, 0x7);
  g_assert_cmpuint (e->engine_types[1].stage_mask, ==, 0x0);
  g_assert_cmpuint (e->developed_stages, ==, 0x8);
  assert_valid (d);
  /* Removing stage 0: A on old 1, 2 -> 0, 1; developed old 3 -> 2. */
  g_assert_true (sw_design_remove_stage (d, 0));
  g_assert_cmpuint (e->engine_types[0].stage_mask, ==, 0x3);
  g_assert_cmpuint (e->developed_stages, ==, 0x4);
  assert_valid (d);
}

int
main (int argc, char **argv)
{
  g_setenv ("LANGUAGE", "C", TRUE);
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/core/design-edit/take-manual-shares", test_take_manual_shares);
  g_test_add_func ("/core/design-edit/sizing-get-shares", test_sizing_get_shares);
  g_test_add_func ("/core/design-edit/set-share-rebalanced", test_set_share_rebalanced);
  g_test_add_func ("/core/design-edit/move-share", test_move_share);
  g_test_add_func ("/core/design-edit/set-split", test_set_split);
  g_test_add_func ("/core/design-edit/add-stage", test_add_stage);
  g_test_add_func ("/core/design-edit/duplicate-stage", test_duplicate_stage);
  g_test_add_func ("/core/design-edit/remove-stage", test_remove_stage);
  g_test_add_func ("/core/design-edit/move-stage", test_move_stage);
  g_test_add_func ("/core/design-edit/first-stage-lifts-off", test_first_stage_lifts_off);
  g_test_add_func ("/core/design-edit/random-sequences", test_random_sequences);
  g_test_add_func ("/core/design-edit/names", test_names);
  g_test_add_func ("/core/design-edit/mission-kind", test_mission_kind);
  g_test_add_func ("/core/design-edit/sea-level-isp", test_sea_level_isp);
  g_test_add_func ("/core/design-edit/baseline", test_baseline);
  g_test_add_func ("/core/design-edit/accept-structural-coefficients",
                   test_accept_structural_coefficients);
  g_test_add_func ("/core/design-edit/accept-estimated-coefficients",
                   test_accept_estimated_coefficients);
  g_test_add_func ("/core/design-edit/economics-follow-stages", test_economics_follow_stages);
  return g_test_run ();
}
