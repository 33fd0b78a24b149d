/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The plot's axis maths without a display (sw-plot-axis.c is GTK-free):
 * a log axis is logarithmic, counts get whole-number ticks, tick texts
 * carry no signed zero and no powers of ten for data that rounds to zero.
 * Expected texts are written out literally. */
#include "config.h"

#include "sw-plot-axis.h"

#include <locale.h>
#include <math.h>
#include <string.h>

/* A fixed-pitch measure: 7 px per byte, 14 px high. */
static double
measure (const char *text, gboolean horizontal, gpointer user_data)
{
  return horizontal ? 7.0 * strlen (text) : 14.0;
}

static void
test_log_is_logarithmic (void)
{
  SwPlotAxis axis;

  sw_plot_axis_init (&axis);
  axis.log = TRUE;
  sw_plot_axis_compute (&axis, 1.0, 1000.0, 0.0, 300.0, TRUE, measure, NULL);
  /* 1..1000 is already 1-2-5 rounded: three decades over 300 px. */
  g_assert_cmpfloat_with_epsilon (axis.v0, 1.0, 1e-12);
  g_assert_cmpfloat_with_epsilon (axis.v1, 1000.0, 1e-9);
  /* Equal ratios take equal lengths: each decade is 100 px ... */
  g_assert_cmpfloat_with_epsilon (sw_plot_axis_map (&axis, 10.0), 100.0, 1e-9);
  g_assert_cmpfloat_with_epsilon (sw_plot_axis_map (&axis, 100.0), 200.0, 1e-9);
  /* ... and the geometric mean of 10 and 100 is halfway, not the
   * arithmetic mean 55 (which would be on a linear axis). */
  g_assert_cmpfloat_with_epsilon (sw_plot_axis_map (&axis, sqrt (1000.0)), 150.0, 1e-9);
  g_assert_cmpfloat (fabs (sw_plot_axis_map (&axis, 55.0) - 150.0), >, 20.0);
  /* Zero and negative values cannot be drawn on it. */
  g_assert_false (sw_plot_axis_valid (&axis, 0.0));
  g_assert_false (sw_plot_axis_valid (&axis, -3.0));
  /* Decades are major ticks, 2..9 minor. */
  for (guint i = 0; i < axis.ticks->len; i++)
    {
      SwPlotTick *t = &g_array_index (axis.ticks, SwPlotTick, i);
      double m = t->value / pow (10.0, floor (log10 (t->value) + 1e-9));
      g_assert_cmpint (t->major, ==, fabs (m - 1.0) < 1e-9);
    }
  sw_plot_axis_clear (&axis);

  /* The same data on a linear axis maps linearly. */
  sw_plot_axis_init (&axis);
  axis.fixed_min = 0.0;
  axis.fixed_max = 1000.0;
  sw_plot_axis_compute (&axis, 1.0, 1000.0, 0.0, 300.0, TRUE, measure, NULL);
  g_assert_cmpfloat_with_epsilon (sw_plot_axis_map (&axis, 500.0), 150.0, 1e-9);
  sw_plot_axis_clear (&axis);
}

/* A count from 1 to 8 stages, drawn from 0.5 to 8.5 as the trade page
 * does: at every width the ticks are whole numbers, and on a wide axis
 * they read 1 2 3 4 5 6 7 8. */
static void
test_stage_count_integer_ticks (void)
{
  static const double lengths[] = { 120.0, 240.0, 480.0, 800.0, 1600.0, 3000.0 };

  for (guint l = 0; l < G_N_ELEMENTS (lengths); l++)
    {
      SwPlotAxis axis;
      GString *labels = g_string_new (NULL);

      sw_plot_axis_init (&axis);
      sw_plot_axis_set_format (&axis, "%.0f", 1.0);
      axis.integer = TRUE;
      axis.fixed_min = 0.5;
      axis.fixed_max = 8.5;
      sw_plot_axis_compute (&axis, 1.0, 8.0, 0.0, lengths[l], TRUE, measure, NULL);
      g_assert_cmpfloat (axis.v0, ==, 0.5);
      g_assert_cmpfloat (axis.v1, ==, 8.5);
      for (guint i = 0; i < axis.ticks->len; i++)
        {
          SwPlotTick *t = &g_array_index (axis.ticks, SwPlotTick, i);
          g_assert_cmpfloat (t->value, ==, round (t->value));
          if (t->labelled)
            g_string_append_printf (labels, "%s%s", labels->len > 0 ? " " : "", t->text);
        }
      g_test_message ("%.0f px: %s", lengths[l], labels->str);
      if (lengths[l] >= 800.0)
        g_assert_cmpstr (labels->str, ==, "1 2 3 4 5 6 7 8");
      else
        g_assert_cmpuint (labels->len, >, 0);
      g_string_free (labels, TRUE);
      sw_plot_axis_clear (&axis);
    }

  /* Without the flag a wide axis would step by 0.5: the flag is what
   * keeps the count whole. */
  {
    SwPlotAxis axis;
    gboolean half = FALSE;

    sw_plot_axis_init (&axis);
    axis.fixed_min = 0.5;
    axis.fixed_max = 8.5;
    sw_plot_axis_compute (&axis, 1.0, 8.0, 0.0, 3000.0, TRUE, measure, NULL);
    for (guint i = 0; i < axis.ticks->len; i++)
      half |= g_array_index (axis.ticks, SwPlotTick, i).value != round (g_array_index (axis.ticks, SwPlotTick, i).value);
    g_assert_true (half);
    sw_plot_axis_clear (&axis);
  }
}

static void
test_nice_step (void)
{
  /* 1, 2 or 5 times a power of ten nearest above span / count. */
  g_assert_cmpfloat (sw_plot_nice_step (7.0, 7.0), ==, 1.0);
  g_assert_cmpfloat (sw_plot_nice_step (7.0, 14.0), ==, 0.5);
  g_assert_cmpfloat (sw_plot_nice_step (100.0, 4.0), ==, 20.0);
  g_assert_cmpfloat (sw_plot_nice_step (100.0, 1.0), ==, 100.0);
  g_assert_cmpfloat_with_epsilon (sw_plot_nice_step (0.03, 3.0), 0.01, 1e-15);
}

static void
test_texts (void)
{
  SwPlotAxis axis;
  char *text;

  sw_plot_axis_init (&axis);
  sw_plot_axis_set_format (&axis, "%.1f t", 1000.0);
  text = sw_plot_axis_format (&axis, 312400.0, -1, FALSE);
  g_assert_cmpstr (text, ==, "312.4 t");
  g_free (text);
  /* No signed zero. */
  sw_plot_axis_set_format (&axis, "%.1f km", 1000.0);
  text = sw_plot_axis_format (&axis, -20.0, -1, FALSE);
  g_assert_cmpstr (text, ==, "0.0 km");
  g_free (text);
  /* A real minus sign. */
  text = sw_plot_axis_format (&axis, -2500.0, -1, FALSE);
  g_assert_cmpstr (text, ==, "\342\210\2222.5 km");
  g_free (text);
  /* Three significant digits of "%.3g": 1.23 t, 45.6 t, 789 t. */
  sw_plot_axis_set_format (&axis, "%.3g t", 1000.0);
  text = sw_plot_axis_format (&axis, 1234.0, -1, FALSE);
  g_assert_cmpstr (text, ==, "1.23 t");
  g_free (text);
  text = sw_plot_axis_format (&axis, 45600.0, -1, FALSE);
  g_assert_cmpstr (text, ==, "45.6 t");
  g_free (text);
  text = sw_plot_axis_format (&axis, 789000.0, -1, FALSE);
  g_assert_cmpstr (text, ==, "789 t");
  g_free (text);
  /* Not finite: an em dash. */
  text = sw_plot_axis_format (&axis, NAN, -1, FALSE);
  g_assert_cmpstr (text, ==, "\342\200\224");
  g_free (text);
  sw_plot_axis_clear (&axis);
}

/* A flight that never left the pad: altitudes below a metre on a km axis
 * give a plain 0..1 km axis, not ticks like 5.0x10^-4 km. */
static void
test_rounds_to_zero (void)
{
  SwPlotAxis axis;

  sw_plot_axis_init (&axis);
  sw_plot_axis_set_format (&axis, "%.0f km", 1000.0);
  sw_plot_axis_compute (&axis, 0.0, 0.5, 400.0, 0.0, FALSE, measure, NULL);
  g_assert_cmpfloat (axis.v0, ==, 0.0);
  g_assert_cmpfloat (axis.v1, ==, 1000.0);
  for (guint i = 0; i < axis.ticks->len; i++)
    {
      SwPlotTick *t = &g_array_index (axis.ticks, SwPlotTick, i);
      g_assert_null (strstr (t->text, "\303\227"));   /* no "x10^n" */
      g_assert_null (strstr (t->text, "\342\210\222"));   /* nothing negative */
    }
  sw_plot_axis_clear (&axis);
}

/* Copies of the tick values and texts, to compare two layouts. */
static char *
ticks_text (const SwPlotAxis *axis)
{
  GString *s = g_string_new (NULL);

  for (guint i = 0; i < axis->ticks->len; i++)
    {
      SwPlotTick *t = &g_array_index (axis->ticks, SwPlotTick, i);
      g_string_append_printf (s, "%.17g:%d:%d:%s;", t->value, t->major, t->labelled, t->text);
    }
  return g_string_free (s, FALSE);
}

/* Hysteresis on a linear axis (the sweep's delta-v axis, 0 to about twice
 * the design's delta-v): a small change of the data keeps the range and
 * every tick; data that leave the range, or shrink to less than
 * SW_PLOT_AXIS_HOLD_FILL of it, get a new one, which again holds them. */
static void
test_hold_linear (void)
{
  SwPlotAxis axis;
  g_autofree char *first = NULL, *again = NULL;
  double v0, v1;

  sw_plot_axis_init (&axis);
  sw_plot_axis_set_format (&axis, "%.0f km/s", 1000.0);
  sw_plot_axis_compute (&axis, 0.0, 18300.0, 60.0, 1200.0, TRUE, measure, NULL);
  v0 = axis.v0;
  v1 = axis.v1;
  /* Rounded out to a tick: 0 to 20 km/s (1140 px: about 13 steps wanted,
   * 1 km/s, whose labels crowd one another, so 2 km/s). */
  g_assert_cmpfloat (v0, ==, 0.0);
  g_assert_cmpfloat_with_epsilon (v1, 20000.0, 1e-6);
  first = ticks_text (&axis);
  sw_plot_axis_hold (&axis);

  /* Without holding, 0..16,100 gives 0..17 km/s (checked below): held, it
   * stays 0..20 with the same ticks. */
  sw_plot_axis_compute (&axis, 0.0, 16100.0, 60.0, 1200.0, TRUE, measure, NULL);
  again = ticks_text (&axis);
  g_assert_cmpfloat (axis.v0, ==, v0);
  g_assert_cmpfloat (axis.v1, ==, v1);
  g_assert_cmpstr (again, ==, first);
  sw_plot_axis_hold (&axis);

  /* The data leave the range: a new one that holds them. */
  sw_plot_axis_compute (&axis, 0.0, 21500.0, 60.0, 1200.0, TRUE, measure, NULL);
  g_assert_cmpfloat (axis.v1, >=, 21500.0);
  g_assert_cmpfloat (axis.v1, !=, v1);
  sw_plot_axis_hold (&axis);
  v1 = axis.v1;

  /* The data shrink to less than the fill: a new, smaller range. */
  sw_plot_axis_compute (&axis, 0.0, 0.5 * v1, 60.0, 1200.0, TRUE, measure, NULL);
  g_assert_cmpfloat (axis.v1, <, v1);
  g_assert_cmpfloat (axis.v1, >=, 0.5 * v1);

  /* A fixed end is exact, held or not. */
  sw_plot_axis_hold (&axis);
  axis.fixed_max = 12345.0;
  sw_plot_axis_compute (&axis, 0.0, 12000.0, 60.0, 1200.0, TRUE, measure, NULL);
  g_assert_cmpfloat (axis.v1, ==, 12345.0);

  /* Released, the range follows the data alone again. */
  axis.fixed_max = NAN;
  sw_plot_axis_compute (&axis, 0.0, 20000.0, 60.0, 1200.0, TRUE, measure, NULL);
  sw_plot_axis_hold (&axis);
  sw_plot_axis_release (&axis);
  sw_plot_axis_compute (&axis, 0.0, 16100.0, 60.0, 1200.0, TRUE, measure, NULL);
  g_assert_cmpfloat_with_epsilon (axis.v1, 17000.0, 1e-6);
  sw_plot_axis_clear (&axis);
}

/* Hysteresis on a log axis (the liftoff masses): the fill is measured in
 * decades. */
static void
test_hold_log (void)
{
  SwPlotAxis axis;
  g_autofree char *first = NULL, *again = NULL;

  sw_plot_axis_init (&axis);
  axis.log = TRUE;
  sw_plot_axis_compute (&axis, 6000.0, 6.0e6, 600.0, 40.0, FALSE, measure, NULL);
  /* 1-2-5 rounded outwards: 5,000 to 10,000,000. */
  g_assert_cmpfloat_with_epsilon (axis.v0, 5000.0, 1e-6);
  g_assert_cmpfloat_with_epsilon (axis.v1, 1.0e7, 1e-3);
  first = ticks_text (&axis);
  sw_plot_axis_hold (&axis);

  /* A heavier payload: still inside, three of 3.3 decades. */
  sw_plot_axis_compute (&axis, 7900.0, 7.9e6, 600.0, 40.0, FALSE, measure, NULL);
  again = ticks_text (&axis);
  g_assert_cmpfloat_with_epsilon (axis.v0, 5000.0, 1e-6);
  g_assert_cmpfloat_with_epsilon (axis.v1, 1.0e7, 1e-3);
  g_assert_cmpstr (again, ==, first);
  sw_plot_axis_hold (&axis);

  /* Past the top: a new range up to 20,000,000. */
  sw_plot_axis_compute (&axis, 7900.0, 1.2e7, 600.0, 40.0, FALSE, measure, NULL);
  g_assert_cmpfloat_with_epsilon (axis.v1, 2.0e7, 1e-3);
  sw_plot_axis_hold (&axis);

  /* One decade of 3.6: less than the fill, a new range 10,000 to 100,000. */
  sw_plot_axis_compute (&axis, 1.0e4, 1.0e5, 600.0, 40.0, FALSE, measure, NULL);
  g_assert_cmpfloat_with_epsilon (axis.v0, 1.0e4, 1e-6);
  g_assert_cmpfloat_with_epsilon (axis.v1, 1.0e5, 1e-6);
  sw_plot_axis_clear (&axis);
}

int
main (int argc, char **argv)
{
  setlocale (LC_ALL, "C");
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/app/plot-axis/log-is-logarithmic", test_log_is_logarithmic);
  g_test_add_func ("/app/plot-axis/stage-count-integer-ticks", test_stage_count_integer_ticks);
  g_test_add_func ("/app/plot-axis/nice-step", test_nice_step);
  g_test_add_func ("/app/plot-axis/texts", test_texts);
  g_test_add_func ("/app/plot-axis/rounds-to-zero", test_rounds_to_zero);
  g_test_add_func ("/app/plot-axis/hold-linear", test_hold_linear);
  g_test_add_func ("/app/plot-axis/hold-log", test_hold_log);
  return g_test_run ();
}
