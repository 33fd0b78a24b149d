/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The shared constants and enums of the core (sw-types).  The constants
 * against /work/shared/reference-values.md, each with its source. */
#include "config.h"

#include "sw-types.h"

#include <string.h>

static void
test_constants (void)
{
  /* Standard gravity, exact by definition: 3rd CGPM (1901), confirmed. */
  g_assert_cmpfloat (SW_G0, ==, 9.80665);
  /* WGS 84 defining constants, confirmed. */
  g_assert_cmpfloat (SW_WGS84_MU, ==, 3.986004418e14);
  g_assert_cmpfloat (SW_WGS84_A, ==, 6378137.0);
  g_assert_cmpfloat (SW_WGS84_OMEGA, ==, 7.292115e-5);
  /* Equator speed omega x a = 465.10 m/s (computed in the reference file,
   * rounded to 0.01 m/s). */
  g_assert_cmpfloat_with_epsilon (SW_WGS84_OMEGA * SW_WGS84_A, 465.10, 0.005);
  /* Sea-level pressure of the 1976 U.S. Standard Atmosphere (NOAA-S/T
   * 76-1562), confirmed. */
  g_assert_cmpfloat (SW_SEA_LEVEL_PRESSURE_PA, ==, 101325.0);
  /* The design format's limits (project rules, not physics). */
  g_assert_cmpint (SW_MAX_STAGES, ==, 8);
  g_assert_cmpint (SW_NAME_MAX, ==, 128);
  g_assert_cmpint (SW_DESIGN_MAX_BYTES, ==, 1048576);
}

static void
test_split_modes (void)
{
  static const struct { SwSplitMode mode; const char *text; } modes[] = {
    { SW_SPLIT_EQUAL, "equal" }, { SW_SPLIT_OPTIMAL, "optimal" }, { SW_SPLIT_MANUAL, "manual" },
  };
  SwSplitMode m;

  for (guint i = 0; i < G_N_ELEMENTS (modes); i++)
    {
      g_assert_cmpstr (sw_split_mode_to_string (modes[i].mode), ==, modes[i].text);
      m = (SwSplitMode) 99;
      g_assert_true (sw_split_mode_from_string (modes[i].text, &m));
      g_assert_cmpint (m, ==, modes[i].mode);
    }
  /* Exact, case-sensitive words only; the mode is left alone otherwise. */
  m = SW_SPLIT_MANUAL;
  g_assert_false (sw_split_mode_from_string ("Optimal", &m));
  g_assert_false (sw_split_mode_from_string ("optimal ", &m));
  g_assert_false (sw_split_mode_from_string ("", &m));
  g_assert_false (sw_split_mode_from_string (NULL, &m));
  g_assert_cmpint (m, ==, SW_SPLIT_MANUAL);
}

static void
test_error_domain (void)
{
  g_assert_cmpstr (g_quark_to_string (SW_ERROR), ==, "sw-error-quark");
  g_assert_cmpuint (SW_ERROR, ==, sw_error_quark ());
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/core/types/constants", test_constants);
  g_test_add_func ("/core/types/split-modes", test_split_modes);
  g_test_add_func ("/core/types/error-domain", test_error_domain);
  return g_test_run ();
}
