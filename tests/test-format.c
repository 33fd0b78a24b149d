/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The one formatter: literal expected text, written out by hand (never the
 * output of the formatter itself), in the C locale and, where installed, in
 * a German one. */
#include "config.h"

#include "sw-format.h"

#include <locale.h>
#include <math.h>
#include <string.h>

static void
expect (char *got, const char *want)
{
  g_assert_cmpstr (got, ==, want);
  g_free (got);
}

/* Money to three significant figures: never more digits than an estimate
 * is worth. */
static void
test_money (void)
{
  setlocale (LC_NUMERIC, "C");
  expect (sw_format_money (2582952134.0), "2,580,000,000");
  expect (sw_format_money (34748275.0), "34,700,000");
  expect (sw_format_money (999.6), "1,000");
  expect (sw_format_money (123.4), "123");
  expect (sw_format_money (12.34), "12.3");
  expect (sw_format_money (0.01234), "0.0123");
  expect (sw_format_money (0.0), "0");
  expect (sw_format_money (-4567.0), "\342\210\222" "4,570");
  expect (sw_format_money (NAN), SW_NO_VALUE);
}

static void
test_mass_rule (void)
{
  setlocale (LC_NUMERIC, "C");
  /* The smallest payload the limits accept is not "0 kg". */
  expect (sw_format_mass (0.1), "0.10 kg");
  expect (sw_format_mass (0.0), "0 kg");
  expect (sw_format_mass (2.44), "2.4 kg");
  expect (sw_format_mass (9.96), "10 kg");
  expect (sw_format_mass (-0.001), "0 kg");
  expect (sw_format_mass (5000.0), "5,000 kg");
  expect (sw_format_mass (9999.0), "9,999 kg");
  expect (sw_format_mass (10000.0), "10.0 t");
  expect (sw_format_mass (312449.0), "312.4 t");
  expect (sw_format_mass (999940.0), "999.9 t");
  expect (sw_format_mass (6396000.0), "6,396 t");
  expect (sw_format_mass (-850.0), "\342\210\222" "850 kg");
  expect (sw_format_mass (NAN), SW_NO_VALUE);
  expect (sw_format_mass (INFINITY), SW_NO_VALUE);
}

static void
test_no_signed_zero (void)
{
  setlocale (LC_NUMERIC, "C");
  expect (sw_format_mass_delta (0.0), "0 kg");
  expect (sw_format_mass_delta (-0.0), "0 kg");
  expect (sw_format_mass_delta (-0.4), "0 kg");
  expect (sw_format_mass_delta (3200.0), "+3,200 kg");
  expect (sw_format_mass_delta (-12340.0), "\342\210\222" "12.3 t");
  expect (sw_format_distance_km (-20.0), "0.0 km");
  /* The block-buffer form the ascent's messages use (a flight that ends a
   * hair below the ground once read "-0.0 km"). */
  g_assert_cmpstr (SW_KM (-0.004), ==, "0.0 km");
  g_assert_cmpstr (SW_KM (-2500.0), ==, "\342\210\222" "2.5 km");
  g_assert_cmpstr (SW_KM (185300.0), ==, "185.3 km");
  g_assert_cmpstr (SW_KM (NAN), ==, SW_NO_VALUE);
  expect (sw_format_number (-0.04, 1), "0.0");
  expect (sw_format_number (-0.06, 1), "\342\210\222" "0.1");
  expect (sw_format_speed_delta (1811.4), "+1,811 m/s");
  expect (sw_format_speed_delta (-580.0), "\342\210\222" "580 m/s");
  expect (sw_format_speed_delta (NAN), SW_NO_VALUE);
}

static void
test_units (void)
{
  setlocale (LC_NUMERIC, "C");
  expect (sw_format_speed (9400.2), "9,400 m/s");
  expect (sw_format_percent (0.0123, 2), "1.23 %");
  expect (sw_format_probability (0.95123), "95.1 %");
  expect (sw_format_probability (0.99912), "99.91 %");
  expect (sw_format_probability (1.0), "100.0 %");
  expect (sw_format_duration (152.34), "152.3 s");
  expect (sw_format_distance_km (185000.0), "185.0 km");
  expect (sw_format_pressure_kpa (32449.0), "32.4 kPa");
  expect (sw_format_accel_g (3.854), "3.85 g");
  expect (sw_format_ratio (1.35, 3), "1.350");
  expect (sw_format_isp (311.4), "311 s");
  expect (sw_format_number (1234567.891, 2), "1,234,567.89");
  expect (sw_format_value ("%.2f", NAN), SW_NO_VALUE);
  expect (sw_format_value ("%.2f", 1.5), "1.50");
}

static void
test_german_locale (void)
{
  if (setlocale (LC_NUMERIC, "de_DE.UTF-8") == NULL)
    {
      g_test_skip ("de_DE.UTF-8 is not installed");
      return;
    }
  expect (sw_format_mass (312449.0), "312,4 t");
  expect (sw_format_mass (6396000.0), "6.396 t");
  expect (sw_format_speed (9400.0), "9.400 m/s");
  setlocale (LC_NUMERIC, "C");
}

static void
test_cautions (void)
{
  const char *c = sw_format_cautions ();

  g_assert_nonnull (strstr (c, "not for flight hardware or safety decisions"));
  g_assert_nonnull (strstr (c, "range safety"));
  g_assert_nonnull (strstr (c, "local regulations"));
}

/* A reason joined after a colon starts with a small letter; symbols and
 * abbreviations in capitals keep theirs. */
static void
test_clause (void)
{
  static const struct { const char *in, *out; } cases[] = {
    { "No ascent: the first stage never reaches", "no ascent: the first stage never reaches" },
    { "The vehicle cannot lift off.", "the vehicle cannot lift off." },
    { "A stage", "a stage" },
    { "T/W below 1", "T/W below 1" },
    { "Isp too low", "Isp too low" },
    { "ΔV short", "ΔV short" },
    { "already small", "already small" },
    { "", "" },
  };

  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      g_autofree char *c = sw_format_clause (cases[i].in);
      g_assert_cmpstr (c, ==, cases[i].out);
    }
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/core/format/mass-rule", test_mass_rule);
  g_test_add_func ("/core/format/money", test_money);
  g_test_add_func ("/core/format/no-signed-zero", test_no_signed_zero);
  g_test_add_func ("/core/format/units", test_units);
  g_test_add_func ("/core/format/german-locale", test_german_locale);
  g_test_add_func ("/core/format/cautions", test_cautions);
  g_test_add_func ("/core/format/clause", test_clause);
  return g_test_run ();
}
