/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Tests of sw-propellant: the bulk densities and the tank example of the
 * reference notes (shared/reference-values.md, "Bulk density and tanks"), the
 * catalogue, loading and saving the keys of format version 2, and the file
 * version a save writes. */
#include "config.h"

#include "sw-design.h"
#include "sw-design-fields.h"
#include "sw-propellant.h"

#include <math.h>
#include <string.h>

static void
assert_near (double got, double want, double tol)
{
  if (!(fabs (got - want) <= tol))
    g_error ("got %.9g, want %.9g within %g", got, want, tol);
}

/* Sutton and Biblarz, Rocket Propulsion Elements, 7th ed., eq. 7-2, with the
 * component densities of open property data files; the three results are
 * "computed" in the reference notes, printed to 0.1 kg/m^3. */
static void
test_bulk_density_checks (void)
{
  assert_near (sw_bulk_density (1141.17, 809.95, 2.56), 1023.6, 0.05);  /* LOX/RP-1, computed */
  assert_near (sw_bulk_density (1141.17, 70.83, 6.0), 361.3, 0.05);     /* LOX/LH2, computed */
  assert_near (sw_bulk_density (1141.17, 422.36, 3.5), 828.0, 0.05);    /* LOX/CH4, computed */
  /* The same pairs from the catalogue at those mixture ratios. */
  for (SwPropellantKind k = SW_PROPELLANT_LOX_KEROSENE; k <= SW_PROPELLANT_LOX_METHANE; k++)
    {
      const SwPropellantInfo *info = sw_propellant_info (k);
      static const double want[] = { 0, 1023.6, 361.3, 828.0 };
      static const double ratio[] = { 0, 2.56, 6.0, 3.5 };
      g_assert_nonnull (info);
      g_assert_cmpfloat (info->oxidizer_density_kg_m3, ==, 1141.17);  /* LOX, open data */
      assert_near (sw_bulk_density (info->oxidizer_density_kg_m3, info->fuel_density_kg_m3,
                                    ratio[k]),
                   want[k], 0.05);
    }
  /* Open property data (reference notes): N2O4 1441.44, UDMH 790.44, MMH 879.84. */
  g_assert_cmpfloat (sw_propellant_info (SW_PROPELLANT_N2O4_UDMH)->oxidizer_density_kg_m3, ==,
                     1441.44);
  g_assert_cmpfloat (sw_propellant_info (SW_PROPELLANT_N2O4_UDMH)->fuel_density_kg_m3, ==, 790.44);
  g_assert_cmpfloat (sw_propellant_info (SW_PROPELLANT_N2O4_MMH)->fuel_density_kg_m3, ==, 879.84);
  /* Composite solid: 1750-1820 kg/m^3 (from memory). */
  g_assert_cmpfloat (sw_propellant_info (SW_PROPELLANT_SOLID_COMPOSITE)->oxidizer_density_kg_m3,
                     >=, 1750.0);
  g_assert_cmpfloat (sw_propellant_info (SW_PROPELLANT_SOLID_COMPOSITE)->oxidizer_density_kg_m3,
                     <=, 1820.0);
  g_assert_null (sw_propellant_info (SW_PROPELLANT_NONE));
  g_assert_null (sw_propellant_info (SW_PROPELLANT_CUSTOM));
}

/* The computed tank example of the reference notes: 100 t of LOX/RP-1 at
 * r = 2.56, diameter 3.7 m, 3 % ullage, domes of aspect ratio sqrt 2: LOX
 * tank 64.90 m^3 and 6.91 m long, RP-1 tank 35.72 m^3 and 4.19 m long
 * (printed to 0.01). */
static void
test_tank_example (void)
{
  SwStagePropellant p;
  SwStageShape s;

  memset (&p, 0, sizeof p);
  p.kind = SW_PROPELLANT_LOX_KEROSENE;   /* 2.56 is its own mixture ratio */
  sw_stage_shape (&p, 100000.0, 3.7, &s);
  g_assert_true (s.valid && s.has_length && !s.solid);
  assert_near (s.oxidizer_tank_m3, 64.90, 0.006);        /* reference notes, computed */
  assert_near (s.oxidizer_tank_length_m, 6.91, 0.006);   /* reference notes, computed */
  assert_near (s.fuel_tank_m3, 35.72, 0.006);            /* reference notes, computed */
  assert_near (s.fuel_tank_length_m, 4.19, 0.006);       /* reference notes, computed */
  /* Propellant volume: each component's mass over its density. */
  assert_near (s.propellant_volume_m3,
               100000.0 * 2.56 / 3.56 / 1141.17 + 100000.0 / 3.56 / 809.95, 1e-9);
  assert_near (s.tank_volume_m3, s.propellant_volume_m3 * 1.03, 1e-9);
  assert_near (s.propellant_volume_m3, 100000.0 / s.bulk_density_kg_m3, 1e-9);
  /* Stage length: tanks, an intertank of D/4 and an engine section of 0.6 D
   * (our rule, documented in sw-propellant.h). */
  assert_near (s.length_m, s.oxidizer_tank_length_m + s.fuel_tank_length_m + 0.25 * 3.7
                             + 0.6 * 3.7, 1e-9);

  /* The same with the mixture ratio given as an override and 5 % ullage. */
  p.has_mixture_ratio = TRUE;
  p.mixture_ratio = 2.0;
  p.has_ullage = TRUE;
  p.ullage_fraction = 0.05;
  sw_stage_shape (&p, 30000.0, NAN, &s);
  g_assert_true (s.valid && !s.has_length);
  assert_near (s.oxidizer_mass_kg, 20000.0, 1e-9);
  assert_near (s.tank_volume_m3, (20000.0 / 1141.17 + 10000.0 / 809.95) * 1.05, 1e-9);
  g_assert_true (isnan (s.length_m));

  /* Without a propellant there is no shape. */
  memset (&p, 0, sizeof p);
  sw_stage_shape (&p, 1000.0, 3.0, &s);
  g_assert_false (s.valid);
  g_assert_true (isnan (s.tank_volume_m3));
}

/* A tank smaller than its two domes is the domes' height, never shorter. */
static void
test_tank_length_small (void)
{
  double r = 1.0, k = G_SQRT2;
  double domes = 2.0 * (2.0 / 3.0) * G_PI * r * r * r / k;

  assert_near (sw_tank_length (domes, 2.0, k), 2.0 * r / k, 1e-12);
  assert_near (sw_tank_length (0.1, 2.0, k), 2.0 * r / k, 1e-12);
  /* One cubic metre of cylinder more adds 1 / (pi R^2). */
  assert_near (sw_tank_length (domes + 1.0, 2.0, k) - sw_tank_length (domes, 2.0, k),
               1.0 / G_PI, 1e-12);
}

static const char *v1_text =
  "{ \"format\": \"stagewright-design\", \"version\": 1, \"name\": \"T\", \"payload_kg\": 1000,"
  "  \"mission\": { \"delta_v_m_s\": 9000 }, \"split\": \"optimal\","
  "  \"stages\": [ { \"name\": \"A\", \"isp_vac_s\": 300, \"structural_coefficient\": 0.08 },"
  "                { \"name\": \"B\", \"isp_vac_s\": 340, \"structural_coefficient\": 0.1 } ] }";

static const char *v2_text =
  "{ \"format\": \"stagewright-design\", \"version\": 2, \"name\": \"T\", \"payload_kg\": 1000,"
  "  \"mission\": { \"delta_v_m_s\": 9000 }, \"split\": \"manual\","
  "  \"stages\": [ { \"name\": \"A\", \"isp_vac_s\": 300, \"structural_coefficient\": 0.08,"
  "                  \"delta_v_share\": 1, \"propellant\": \"lox-kerosene\","
  "                  \"mixture_ratio\": 2.4, \"ullage_fraction\": 0.04 },"
  "                { \"name\": \"B\", \"isp_vac_s\": 340, \"structural_coefficient\": 0.1,"
  "                  \"propellant_kg\": 9000, \"propellant\": { \"name\": \"my pair\","
  "                    \"oxidizer_density_kg_m3\": 1400, \"fuel_density_kg_m3\": 850,"
  "                    \"mixture_ratio\": 1.9 } } ] }";

/* Version 1 loads unchanged and saves as version 1; a version-2 key makes
 * the save version 2, and every key comes back. */
static void
test_versions_round_trip (void)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) d1 = sw_design_load_data (v1_text, -1, "v1.stagewright", NULL, &error);
  g_autoptr (SwDesign) d2 = NULL, back = NULL;
  g_autofree char *data1 = NULL, *data2 = NULL;

  g_assert_no_error (error);
  g_assert_false (sw_propellant_is_used (&d1->stages[0].propellant));
  data1 = sw_design_to_data (d1, NULL);
  g_assert_nonnull (strstr (data1, "\"version\" : 1"));
  g_assert_null (strstr (data1, "propellant"));

  d2 = sw_design_load_data (v2_text, -1, "v2.stagewright", NULL, &error);
  g_assert_no_error (error);
  g_assert_cmpint (d2->stages[0].propellant.kind, ==, SW_PROPELLANT_LOX_KEROSENE);
  g_assert_true (d2->stages[0].propellant.has_mixture_ratio);
  g_assert_cmpfloat (d2->stages[0].propellant.mixture_ratio, ==, 2.4);
  g_assert_cmpfloat (d2->stages[0].propellant.ullage_fraction, ==, 0.04);
  g_assert_cmpint (d2->stages[1].propellant.kind, ==, SW_PROPELLANT_CUSTOM);
  g_assert_cmpstr (d2->stages[1].propellant.custom_name, ==, "my pair");
  g_assert_cmpfloat (d2->stages[1].propellant.propellant_kg, ==, 9000.0);
  data2 = sw_design_to_data (d2, NULL);
  g_assert_nonnull (strstr (data2, "\"version\" : 2"));
  back = sw_design_load_data (data2, -1, "back.stagewright", NULL, &error);
  g_assert_no_error (error);
  g_assert_true (sw_design_equal (d2, back));

  /* Leaving every version-2 key out saves version 1 again. */
  for (guint i = 0; i < back->n_stages; i++)
    memset (&back->stages[i].propellant, 0, sizeof back->stages[i].propellant);
  g_clear_pointer (&data2, g_free);
  data2 = sw_design_to_data (back, NULL);
  g_assert_nonnull (strstr (data2, "\"version\" : 1"));
}

/* The manual split needs shares on the sized stages only. */
static void
test_manual_shares_sized_only (void)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) d = sw_design_load_data (v2_text, -1, "v2.stagewright", NULL, &error);

  g_assert_no_error (error);
  /* Stage A is the one sized stage: its share 1 is the whole.  A share of
   * 0.5 on it no longer adds up. */
  d->stages[0].delta_v_share = 0.5;
  g_assert_false (sw_design_validate (d, NULL, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_VALUE);
}

/* Choosing a user-defined propellant starts from the one it replaces. */
static void
test_set_kind (void)
{
  SwStagePropellant p;

  memset (&p, 0, sizeof p);
  sw_propellant_set_kind (&p, SW_PROPELLANT_LOX_METHANE);
  sw_propellant_set_kind (&p, SW_PROPELLANT_CUSTOM);
  g_assert_cmpfloat (p.fuel_density_kg_m3, ==, 422.36);
  g_assert_cmpfloat (p.custom_mixture_ratio, ==, 3.5);
  g_assert_true (sw_propellant_validate_stage (&p, NULL, "stages[0]", NULL));
  p.has_mixture_ratio = TRUE;
  p.mixture_ratio = 3.0;
  sw_propellant_set_kind (&p, SW_PROPELLANT_SOLID_COMPOSITE);
  g_assert_true (p.has_mixture_ratio);   /* kept: a solid with one is refused */
  g_assert_cmpstr (p.custom_name, ==, "");
  g_assert_false (sw_propellant_validate_stage (&p, NULL, "stages[0]", NULL));
  p.has_mixture_ratio = FALSE;
  p.mixture_ratio = 0.0;
  g_assert_true (sw_propellant_validate_stage (&p, NULL, "stages[0]", NULL));
}

/* The named edits of the window: the propellant choice and the fields. */
static void
test_design_edits (void)
{
  g_autoptr (SwDesign) d = sw_design_new_default ();
  g_autoptr (GError) error = NULL;
  double v;

  /* The densities belong to a propellant of the user's own. */
  g_assert_false (sw_design_field_set (d, SW_FIELD_OXIDIZER_DENSITY, 0, 1100.0, &error));
  g_assert_nonnull (strstr (error->message, "stages[0].propellant.oxidizer_density_kg_m3"));
  g_clear_error (&error);
  g_assert_false (sw_design_field_get (d, SW_FIELD_FUEL_DENSITY, 0, &v));
  /* A mixture ratio needs a liquid propellant. */
  g_assert_false (sw_design_field_set (d, SW_FIELD_MIXTURE_RATIO, 0, 2.3, &error));
  g_clear_error (&error);
  g_assert_true (sw_design_set_propellant (d, 0, SW_PROPELLANT_LOX_KEROSENE, &error));
  g_assert_no_error (error);
  g_assert_true (sw_design_field_set (d, SW_FIELD_MIXTURE_RATIO, 0, 2.3, &error));
  g_assert_true (sw_design_field_get (d, SW_FIELD_MIXTURE_RATIO, 0, &v));
  g_assert_cmpfloat (v, ==, 2.3);
  g_assert_true (sw_design_set_propellant (d, 0, SW_PROPELLANT_CUSTOM, &error));
  g_assert_true (sw_design_field_get (d, SW_FIELD_FUEL_DENSITY, 0, &v));
  g_assert_cmpfloat (v, ==, 809.95);   /* open property data, RP-1 */
  g_assert_true (sw_design_field_set (d, SW_FIELD_FUEL_DENSITY, 0, 820.0, &error));
  g_assert_false (sw_design_field_unset (d, SW_FIELD_FUEL_DENSITY, 0, &error));
  g_clear_error (&error);
  /* A solid cannot keep the mixture ratio: the choice is refused, the
   * design unchanged. */
  g_assert_false (sw_design_set_propellant (d, 0, SW_PROPELLANT_SOLID_COMPOSITE, &error));
  g_assert_nonnull (error);
  g_clear_error (&error);
  g_assert_cmpint (d->stages[0].propellant.kind, ==, SW_PROPELLANT_CUSTOM);
  g_assert_true (sw_design_field_unset (d, SW_FIELD_MIXTURE_RATIO, 0, &error));
  g_assert_true (sw_design_set_propellant (d, 0, SW_PROPELLANT_SOLID_COMPOSITE, &error));
  g_assert_no_error (error);
  /* A fixed load and the ullage. */
  g_assert_true (sw_design_field_set (d, SW_FIELD_PROPELLANT_LOAD, 1, 8000.0, &error));
  g_assert_true (sw_design_field_set (d, SW_FIELD_ULLAGE, 1, 0.04, &error));
  g_assert_false (sw_design_field_set (d, SW_FIELD_ULLAGE, 1, 0.6, &error));
  g_assert_nonnull (strstr (error->message, "accepted range"));
  g_assert_cmpfloat (d->stages[1].propellant.ullage_fraction, ==, 0.04);
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/propellant/bulk-density", test_bulk_density_checks);
  g_test_add_func ("/propellant/tank-example", test_tank_example);
  g_test_add_func ("/propellant/tank-length-small", test_tank_length_small);
  g_test_add_func ("/propellant/versions-round-trip", test_versions_round_trip);
  g_test_add_func ("/propellant/manual-shares-sized-only", test_manual_shares_sized_only);
  g_test_add_func ("/propellant/set-kind", test_set_kind);
  g_test_add_func ("/propellant/design-edits", test_design_edits);
  return g_test_run ();
}
