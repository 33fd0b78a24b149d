/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Tests of sw-vehicle-shape: an ellipsoidal-dome tank by hand (the volume of
 * a spheroid, (4/3) pi a^2 c, CRC Standard Mathematical Tables) and by GSL
 * quadrature of its cross-sections; the dome area against a GSL quadrature of
 * the surface of revolution; the reference notes' tank example (shared
 * reference values, "Bulk density and tanks") carried through a sized
 * vehicle; the vehicle's height from its parts; and a vehicle that has no
 * shape saying why. */
#include "config.h"

#include "sw-design.h"
#include "sw-sizing.h"
#include "sw-vehicle-shape.h"

#include <gsl/gsl_integration.h>
#include <math.h>
#include <string.h>

static void
assert_near (double got, double want, double tol)
{
  if (!(fabs (got - want) <= tol))
    g_error ("got %.12g, want %.12g within %g", got, want, tol);
}

/* By hand: diameter 3 m (R = 1.5), domes of aspect ratio k = 2, 20 m^3.
 * A dome is half a spheroid of semi-axes R, R, R/k: (2/3) pi R^3 / k =
 * (2/3) pi 3.375 / 2 = 3.534292 m^3.  Cylinder (20 - 7.068583) / (pi 2.25)
 * = 1.829421 m; tank 1.829421 + 2 x 0.75 = 3.329421 m. */
static void
test_tank_by_hand (void)
{
  assert_near (sw_tank_length (20.0, 3.0, 2.0), 3.329421, 5e-7);
  /* The reference notes' dome: height R/k with k = sqrt 2. */
  assert_near (sw_tank_length (0.0, 3.7, G_SQRT2), 3.7 / G_SQRT2, 1e-12);
}

typedef struct { double r, k, length; } Tank;

/* The tank's radius at height z from its bottom. */
static double
tank_radius (double z, const Tank *t)
{
  double h = t->r / t->k;
  double u;

  if (z < h)
    u = (h - z) / h;
  else if (z > t->length - h)
    u = (z - (t->length - h)) / h;
  else
    return t->r;
  return t->r * sqrt (MAX (0.0, 1.0 - u * u));
}

static double
section_area (double z, void *data)
{
  double r = tank_radius (z, data);
  return G_PI * r * r;
}

/* The volume under the length sw_tank_length gives, by GSL's adaptive
 * quadrature of the cross-sections, for several sizes and aspect ratios. */
static void
test_tank_volume_quadrature (void)
{
  gsl_integration_workspace *w = gsl_integration_workspace_alloc (1000);
  static const double cases[][3] = {   /* volume m^3, diameter m, k */
    { 20.0, 3.0, 2.0 }, { 64.90, 3.7, G_SQRT2 }, { 35.72, 3.7, G_SQRT2 },
    { 500.0, 8.4, 1.5 }, { 2.0, 1.2, G_SQRT2 },
  };

  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      Tank t = { cases[i][1] / 2.0, cases[i][2], 0.0 };
      gsl_function f = { section_area, &t };
      double v, err;

      t.length = sw_tank_length (cases[i][0], cases[i][1], cases[i][2]);
      g_assert_cmpint (gsl_integration_qags (&f, 0.0, t.length, 0.0, 1e-10, 1000, w, &v, &err),
                       ==, GSL_SUCCESS);
      assert_near (v, cases[i][0], 1e-6 * cases[i][0]);
    }
  gsl_integration_workspace_free (w);
}

static double
dome_area_integrand (double t, void *data)
{
  const Tank *d = data;
  double a = d->r, c = d->r / d->k;
  /* x = a cos t, y = c sin t: 2 pi x |(dx, dy)| */
  return 2.0 * G_PI * a * cos (t) * sqrt (a * a * sin (t) * sin (t) + c * c * cos (t) * cos (t));
}

/* The tank's surface: a cylinder and two domes whose area is the closed form
 * of an oblate spheroid; against a GSL quadrature of the surface of
 * revolution, and the sphere limit. */
static void
test_tank_area_quadrature (void)
{
  gsl_integration_workspace *w = gsl_integration_workspace_alloc (1000);
  Tank t = { 1.85, G_SQRT2, 0.0 };
  gsl_function f = { dome_area_integrand, &t };
  double half, err, len = 6.91;

  g_assert_cmpint (gsl_integration_qags (&f, 0.0, G_PI / 2.0, 0.0, 1e-12, 1000, w, &half, &err),
                   ==, GSL_SUCCESS);
  assert_near (sw_tank_surface_area (3.7, len, G_SQRT2),
               2.0 * half + G_PI * 3.7 * (len - 2.0 * 1.85 / G_SQRT2), 1e-8);
  /* A sphere: 4 pi R^2. */
  assert_near (sw_tank_surface_area (2.0, 2.0, 1.0), 4.0 * G_PI, 1e-12);
  gsl_integration_workspace_free (w);
  /* Frustum side area by hand: diameters 4 and 2, length 3: pi (2 + 1)
   * sqrt (1 + 9) = 29.80376. */
  assert_near (sw_frustum_side_area (4.0, 2.0, 3.0), 29.80376, 5e-6);
}

/* The reference notes' tank example as the first stage of a vehicle: 100 t
 * of LOX/RP-1 at r = 2.56, diameter 3.7 m, 3 % ullage: LOX tank 64.90 m^3 and
 * 6.91 m, RP-1 tank 35.72 m^3 and 4.19 m (computed there, printed to 0.01).
 * The height adds up from the parts by our documented rules. */
static const char *two_stage =
  "{ \"format\": \"stagewright-design\", \"version\": 2, \"name\": \"S\", \"payload_kg\": 2000,"
  "  \"mission\": { \"delta_v_m_s\": 8000 }, \"split\": \"optimal\","
  "  \"stages\": [ { \"name\": \"A\", \"isp_vac_s\": 300, \"structural_coefficient\": 0.07,"
  "                  \"propellant_kg\": 100000, \"propellant\": \"lox-kerosene\","
  "                  \"mixture_ratio\": 2.56, \"diameter_m\": 3.7 },"
  "                { \"name\": \"B\", \"isp_vac_s\": 450, \"structural_coefficient\": 0.11,"
  "                  \"propellant\": \"lox-hydrogen\", \"diameter_m\": 2.5 } ] }";

static void
test_vehicle_height (void)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) d = sw_design_load_data (two_stage, -1, "s.stagewright", NULL, &error);
  SwSizing s;
  SwVehicleShape v;
  const SwStageGeometry *a, *b;

  g_assert_no_error (error);
  g_assert_true (sw_size_design (d, &s, &error));
  g_assert_true (s.feasible);
  sw_vehicle_shape_compute (d, &s, &v);
  g_assert_true (v.complete);
  a = &v.stages[0];
  b = &v.stages[1];
  assert_near (a->shape.oxidizer_tank_m3, 64.90, 0.006);        /* reference notes, computed */
  assert_near (a->shape.oxidizer_tank_length_m, 6.91, 0.006);   /* reference notes, computed */
  assert_near (a->shape.fuel_tank_m3, 35.72, 0.006);            /* reference notes, computed */
  assert_near (a->shape.fuel_tank_length_m, 4.19, 0.006);       /* reference notes, computed */
  assert_near (a->base_m, 0.0, 0.0);
  /* Stage 1: tanks, intertank D/4, engine section 0.6 D (our rules). */
  assert_near (a->shape.length_m, 6.91 + 4.19 + 0.25 * 3.7 + 0.6 * 3.7, 0.012);
  /* Interstage: 0.3 of the larger diameter, a frustum from 3.7 to 2.5 m. */
  assert_near (a->interstage_length_m, 0.3 * 3.7, 1e-12);
  assert_near (a->interstage_top_diameter_m, 2.5, 0.0);
  assert_near (b->base_m, a->shape.length_m + 1.11, 1e-9);
  g_assert_false (b->diameter_inherited);
  /* Fairing: the top stage's diameter, 2.5 diameters long. */
  assert_near (v.fairing_diameter_m, 2.5, 0.0);
  assert_near (v.fairing_length_m, 6.25, 1e-12);
  assert_near (v.fairing_base_m, b->base_m + b->shape.length_m, 1e-9);
  assert_near (v.height_m, a->shape.length_m + 1.11 + b->shape.length_m + 6.25, 1e-9);
  assert_near (v.max_diameter_m, 3.7, 0.0);
  assert_near (v.width_m, 3.7, 0.0);
  g_assert_cmpuint (v.n_boosters, ==, 0);
}

/* A stage without a propellant, or a vehicle without any diameter: no shape,
 * and the reason names the stage and what it lacks. */
static void
test_no_shape_says_why (void)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) d = sw_design_load_data (two_stage, -1, "s.stagewright", NULL, &error);
  SwSizing s;
  SwVehicleShape v;

  g_assert_no_error (error);
  d->stages[1].propellant.kind = SW_PROPELLANT_NONE;
  g_assert_true (sw_size_design (d, &s, &error));
  sw_vehicle_shape_compute (d, &s, &v);
  g_assert_false (v.complete);
  g_assert_nonnull (strstr (v.reason, "Stage 2 (B)"));
  g_assert_nonnull (strstr (v.reason, "propellant"));
  g_assert_true (isnan (v.height_m));
  /* Stage 1 still has its volumes and lengths. */
  g_assert_true (v.stages[0].has_shape);

  d->stages[1].propellant.kind = SW_PROPELLANT_LOX_HYDROGEN;
  d->stages[0].propulsion.has_diameter = FALSE;
  d->stages[1].propulsion.has_diameter = FALSE;
  sw_vehicle_shape_compute (d, &s, &v);
  g_assert_false (v.complete);
  g_assert_nonnull (strstr (v.reason, "Stage 1 (A)"));
  g_assert_nonnull (strstr (v.reason, "diameter"));
  /* Volumes need no diameter. */
  g_assert_true (v.stages[1].shape.valid);
  g_assert_true (v.stages[1].shape.tank_volume_m3 > 0.0);

  /* An upper stage without its own diameter takes the one below it. */
  d->stages[0].propulsion.has_diameter = TRUE;
  sw_vehicle_shape_compute (d, &s, &v);
  g_assert_true (v.complete);
  g_assert_true (v.stages[1].diameter_inherited);
  assert_near (v.stages[1].diameter_m, 3.7, 0.0);
}

/* Strap-on boosters beside the core: one booster's length is the shape of
 * its own propellant load (sized or fixed) at its diameter, which without
 * its own is half the core's; boosters without a propellant leave the
 * vehicle without a shape, and say so. */
static void
test_boosters_shape (void)
{
  static const char *json =
    "{ \"format\": \"stagewright-design\", \"version\": 2, \"name\": \"b\",\n"
    "  \"payload_kg\": 6000, \"mission\": { \"delta_v_m_s\": 9300 }, \"split\": \"optimal\",\n"
    "  \"stages\": [ { \"isp_vac_s\": 320, \"structural_coefficient\": 0.07,\n"
    "      \"thrust_vac_kn\": 1300, \"diameter_m\": 3.6, \"propellant\": \"lox-kerosene\" },\n"
    "    { \"isp_vac_s\": 345, \"structural_coefficient\": 0.09,\n"
    "      \"propellant\": \"lox-kerosene\" } ],\n"
    "  \"boosters\": { \"count\": 4, \"isp_vac_s\": 275, \"structural_coefficient\": 0.11,\n"
    "    \"thrust_vac_kn\": 800, \"propellant_kg\": 30000%s } }";
  double thin_length = NAN;
  const char *variants[] = { ", \"propellant\": \"solid-composite\", \"diameter_m\": 1.6",
                             ", \"propellant\": \"solid-composite\"", "" };

  for (guint k = 0; k < G_N_ELEMENTS (variants); k++)
    {
      g_autofree char *text = g_strdup_printf (json, variants[k]);
      g_autoptr (GError) error = NULL;
      g_autoptr (SwDesign) d = sw_design_load_data (text, -1, "b.stagewright", NULL, &error);
      SwVehicleShape v;
      SwStageShape want;
      SwSizing s;
      double dia = k == 0 ? 1.6 : 1.8;

      g_assert_no_error (error);
      g_assert_true (sw_size_design (d, &s, NULL));
      g_assert_true (s.feasible && s.boosters.present);
      sw_vehicle_shape_compute (d, &s, &v);
      if (k == 2)
        {
          g_assert_false (v.complete);
          g_assert_nonnull (strstr (v.reason, "boosters"));
          g_assert_cmpuint (v.n_boosters, ==, 0);
          continue;
        }
      g_assert_true (v.complete);
      g_assert_cmpuint (v.n_boosters, ==, 4);
      assert_near (v.booster_diameter_m, dia, 0.0);
      /* Seen from the side: the core with a booster on each side. */
      assert_near (v.max_diameter_m, 3.6, 0.0);
      assert_near (v.width_m, 3.6 + 2.0 * dia, 1e-12);
      sw_stage_shape (&d->boosters.propellant, 30000.0, dia, &want);
      g_assert_true (want.has_length);
      assert_near (v.booster_length_m, want.length_m, 1e-12);
      /* The same load in a wider booster (1.8 m against 1.6 m) is shorter. */
      if (k == 1)
        g_assert_cmpfloat (v.booster_length_m, <, thin_length);
      thin_length = v.booster_length_m;
    }
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/vehicle-shape/tank-by-hand", test_tank_by_hand);
  g_test_add_func ("/vehicle-shape/tank-volume-quadrature", test_tank_volume_quadrature);
  g_test_add_func ("/vehicle-shape/tank-area-quadrature", test_tank_area_quadrature);
  g_test_add_func ("/vehicle-shape/height", test_vehicle_height);
  g_test_add_func ("/vehicle-shape/no-shape-says-why", test_no_shape_says_why);
  g_test_add_func ("/vehicle-shape/boosters", test_boosters_shape);
  return g_test_run ();
}
