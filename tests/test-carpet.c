/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Tests of the carpet grid: its values equal individual sizings of the
 * design with the two inputs set (sw_size_design, the `size` command's
 * path) at sampled points; infeasible points flagged; cancellation. */
#include "config.h"

#include "sw-carpet.h"
#include "sw-cost.h"
#include "sw-design.h"
#include "sw-economics.h"
#include "sw-staging.h"
#include "sw-sizing.h"

#include <math.h>
#include <string.h>

static const char *orbit_json =
  "{ \"format\": \"stagewright-design\", \"version\": 1, \"name\": \"carpet test\",\n"
  "  \"payload_kg\": 3000, \"split\": \"optimal\",\n"
  "  \"mission\": { \"orbit\": { \"altitude_km\": 400, \"inclination_deg\": 51.6,\n"
  "                 \"site_latitude_deg\": 45.6 }, \"losses_m_s\": 1500 },\n"
  "  \"stages\": [\n"
  "    { \"name\": \"A\", \"isp_vac_s\": 310, \"isp_sl_s\": 280, \"structural_coefficient\": 0.07 },\n"
  "    { \"name\": \"B\", \"isp_vac_s\": 340, \"structural_coefficient\": 0.09 },\n"
  "    { \"name\": \"C\", \"isp_vac_s\": 330, \"structural_coefficient\": 0.12 } ] }";

static SwDesign *
load (const char *json)
{
  g_autoptr (GError) error = NULL;
  SwDesign *d = sw_design_load_data (json, -1, "test.stagewright", NULL, &error);

  g_assert_no_error (error);
  return d;
}

static void
axis (SwCarpetAxis *a, const SwDesign *d, const char *param, double min, double max, guint n)
{
  g_autoptr (GError) error = NULL;

  memset (a, 0, sizeof *a);
  g_assert_true (sw_carpet_param_parse (param, d, a, &error));
  g_assert_no_error (error);
  a->min = min;
  a->max = max;
  a->n = n;
}

/* A sizing not linear in the payload: a fixed load, or boosters (their burn
 * time follows from their absolute thrust). */
static gboolean
has_fixed (const SwDesign *d)
{
  if (d->boosters.count > 0)
    return TRUE;
  for (guint i = 0; i < d->n_stages; i++)
    if (d->stages[i].propellant.has_propellant_kg)
      return TRUE;
  return FALSE;
}

/* The individual sizing of a point: a copy of the design with both inputs
 * set, sized as the `size` command sizes it. */
static double
individual (const SwDesign *d, const SwCarpet *c, guint i, guint j)
{
  g_autoptr (SwDesign) copy = sw_design_copy (d);
  SwSizing s, own;

  sw_carpet_apply (&c->x, copy, sw_carpet_axis_value (&c->x, i));
  sw_carpet_apply (&c->y, copy, sw_carpet_axis_value (&c->y, j));
  /* A design `size` refuses (an inclination below the site's latitude)
   * is a point that does not close. */
  if (!sw_design_validate (copy, NULL, NULL))
    return NAN;
  g_assert_true (sw_size_design (copy, &s, NULL));
  if (!s.feasible)
    return NAN;
  switch (c->output)
    {
    case SW_CARPET_PAYLOAD:
      g_assert_true (sw_size_design (d, &own, NULL));
      if (has_fixed (copy))
        {
          /* A fixed stage weighs the same whatever it carries: not linear.
           * Bisection on the payload, an independent method (the grid uses
           * the secant). */
          double lo = 0.0, hi = 10.0 * own.liftoff_mass_kg;
          for (guint k = 0; k < 200; k++)
            {
              double mid = 0.5 * (lo + hi);
              copy->payload_kg = mid;
              g_assert_true (sw_size_design (copy, &s, NULL));
              if (s.feasible && s.liftoff_mass_kg < own.liftoff_mass_kg)
                lo = mid;
              else
                hi = mid;
            }
          /* Not even an empty vehicle weighs as little (fixed loads, many
           * boosters): no payload, the point does not close. */
          return lo > 0.0 ? 0.5 * (lo + hi) : NAN;
        }
      return copy->payload_kg * own.liftoff_mass_kg / s.liftoff_mass_kg;
    case SW_CARPET_DEVELOPMENT:
    case SW_CARPET_COST_PER_FLIGHT:
      {
        SwCostVehicle v;
        SwCost cost;
        sw_cost_vehicle_from_sizing (&v, &s, copy);
        sw_cost_compute (copy, &v, &cost);
        return c->output == SW_CARPET_DEVELOPMENT ? cost.development_work_years
                                                  : cost.cost_per_flight_work_years;
      }
    case SW_CARPET_LIFTOFF_MASS:
    default:
      return s.liftoff_mass_kg;
    }
}

static void
check_samples (const SwDesign *d, const SwCarpet *c)
{
  const guint samples[][2] = { { 0, 0 }, { 1, 7 }, { 13, 2 }, { 24, 24 }, { 49, 0 },
                               { 0, 49 }, { 31, 17 }, { 49, 49 } };

  for (guint s = 0; s < G_N_ELEMENTS (samples); s++)
    {
      guint i = MIN (samples[s][0], c->x.n - 1), j = MIN (samples[s][1], c->y.n - 1);
      double v = c->values[j * c->x.n + i], want = individual (d, c, i, j);

      if (isnan (want))
        {
          g_assert_false (c->feasible[j * c->x.n + i]);
          g_assert_true (isnan (v));
        }
      else
        {
          g_assert_true (c->feasible[j * c->x.n + i]);
          /* The secant of a fixed-load payload stops at 1e-9 of the mass. */
          g_assert_cmpfloat_with_epsilon (v / want, 1.0,
                                          c->output == SW_CARPET_PAYLOAD && has_fixed (d)
                                            ? 1e-7 : 1e-12);
        }
    }
}

/* A design with strap-on boosters: its carpet sizes the parallel vehicle as
 * `size` does, over the boosters' own keys and the orbit's altitude. */
static void
test_boosters_and_altitude (void)
{
  g_autofree char *path = g_build_filename (g_getenv ("SW_SOURCE_ROOT") != NULL
                                              ? g_getenv ("SW_SOURCE_ROOT") : ".",
                                            "data", "designs", "four-booster-cargo.stagewright",
                                            NULL);
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, &error);
  g_autoptr (SwDesign) serial = load (orbit_json);
  const SwCarpetOutput outputs[] = { SW_CARPET_LIFTOFF_MASS, SW_CARPET_PAYLOAD };
  SwCarpetAxis list[64];
  guint n;
  gboolean count = FALSE, thrust = FALSE, altitude = FALSE;

  g_assert_no_error (error);
  g_assert_cmpuint (d->boosters.count, >, 0);
  for (guint k = 0; k < G_N_ELEMENTS (outputs); k++)
    {
      SwCarpetOptions o = { 0 };
      g_autoptr (SwCarpet) c = NULL;

      axis (&o.x, d, "boosters.count", 1, 8, 8);
      axis (&o.y, d, "mission.orbit.altitude_km", 200, 900, 6);
      o.output = outputs[k];
      c = sw_carpet_compute (d, &o, &error);
      g_assert_no_error (error);
      check_samples (d, c);
      /* The design's own point is `size`'s answer. */
      {
        SwSizing own;
        g_assert_true (sw_size_design (d, &own, NULL));
        if (o.output == SW_CARPET_LIFTOFF_MASS)
          g_assert_cmpfloat_with_epsilon (c->design_value / own.liftoff_mass_kg, 1.0, 1e-12);
      }
      /* A higher orbit costs more at every booster count (the allowance
       * moves with the climb's energy; without it the mass would fall). */
      for (guint i = 0; i < c->x.n && o.output == SW_CARPET_LIFTOFF_MASS; i++)
        for (guint j = 1; j < c->y.n; j++)
          if (c->feasible[j * c->x.n + i] && c->feasible[(j - 1) * c->x.n + i])
            g_assert_cmpfloat (c->values[j * c->x.n + i], >, c->values[(j - 1) * c->x.n + i]);
      /* The simulate design says which allowance the grid used. */
      g_assert_nonnull (strstr (c->note, "2,500 m/s"));
    }
  {
    SwCarpetOptions o = { 0 };
    g_autoptr (SwCarpet) c = NULL;

    axis (&o.x, d, "boosters.thrust_vac_kn", 1200, 3000, 5);
    axis (&o.y, d, "boosters.structural_coefficient", 0.08, 0.16, 5);
    o.output = SW_CARPET_LIFTOFF_MASS;
    c = sw_carpet_compute (d, &o, &error);
    g_assert_no_error (error);
    check_samples (d, c);
    axis (&o.x, d, "boosters.isp_vac_s", 260, 300, 5);
    axis (&o.y, d, "stages[0].structural_coefficient", 0.05, 0.09, 3);
    sw_carpet_free (g_steal_pointer (&c));
    c = sw_carpet_compute (d, &o, &error);
    g_assert_no_error (error);
    check_samples (d, c);
  }
  /* The cost outputs include the boosters (sw-cost.h): the design's point
   * is the cost model on the sizing with its boosters, above the same
   * vehicle with them taken out, and the note no longer says they are left
   * out.  Over the booster count the development effort is flat in the
   * count only through the boosters' masses: one set is developed once. */
  {
    SwCarpetOptions o = { 0 };
    g_autoptr (SwCarpet) c = NULL;
    SwSizing own;
    SwCostVehicle v;
    SwCost with, without;

    axis (&o.x, d, "boosters.count", 2, 6, 3);
    axis (&o.y, d, "economics.production_run", 5, 20, 4);
    o.output = SW_CARPET_DEVELOPMENT;
    c = sw_carpet_compute (d, &o, &error);
    g_assert_no_error (error);
    check_samples (d, c);
    g_assert_null (strstr (c->note, "leaves the strap-on boosters out"));
    g_assert_true (sw_size_design (d, &own, NULL));
    sw_cost_vehicle_from_sizing (&v, &own, d);
    g_assert_cmpuint (v.booster_count, ==, d->boosters.count);
    sw_cost_compute (d, &v, &with);
    g_assert_cmpfloat_with_epsilon (c->design_value / with.development_work_years, 1.0, 1e-12);
    v.booster_count = 0;
    sw_cost_compute (d, &v, &without);
    g_assert_cmpfloat (with.development_work_years, >, without.development_work_years * 1.05);
  }
  /* The altitude's allowance by hand: the climb's energy per unit mass,
   * sqrt(2 mu / a - mu / r) - sqrt(mu / r) (energy equation, Curtis, Orbital
   * Mechanics for Engineering Students, ch. 2; from memory). */
  {
    g_autoptr (SwDesign) copy = sw_design_copy (d);
    SwCarpetAxis a;
    double mu = 3.986004418e14, re = 6378137.0, r4 = re + 400e3, r8 = re + 800e3;
    double climb = (sqrt (2 * mu / re - mu / r8) - sqrt (mu / r8))
                   - (sqrt (2 * mu / re - mu / r4) - sqrt (mu / r4));

    axis (&a, d, "mission.orbit.altitude_km", 200, 900, 2);
    g_assert_cmpfloat (d->mission.altitude_km, ==, 400.0);
    sw_carpet_apply (&a, copy, 800.0);
    g_assert_cmpfloat_with_epsilon (copy->mission.losses_m_s - d->mission.losses_m_s, climb, 1e-6);
    g_assert_cmpfloat (climb, >, 100.0);
  }
  /* The boosters' keys are offered for this design, not for a serial one;
   * asked for on a serial design, a clear error. */
  n = sw_carpet_list_params (d, SW_CARPET_LIFTOFF_MASS, list, G_N_ELEMENTS (list));
  for (guint i = 0; i < n; i++)
    {
      count |= list[i].kind == SW_CARPET_PARAM_BOOSTER_COUNT;
      thrust |= list[i].kind == SW_CARPET_PARAM_BOOSTER_THRUST;
      altitude |= list[i].kind == SW_CARPET_PARAM_ALTITUDE;
    }
  g_assert_true (count && thrust && altitude);
  n = sw_carpet_list_params (serial, SW_CARPET_LIFTOFF_MASS, list, G_N_ELEMENTS (list));
  for (guint i = 0; i < n; i++)
    g_assert_cmpint (list[i].kind, !=, SW_CARPET_PARAM_BOOSTER_COUNT);
  {
    SwCarpetAxis a;
    g_assert_false (sw_carpet_param_parse ("boosters.count", serial, &a, &error));
    g_assert_nonnull (strstr (error->message, "no strap-on boosters"));
  }
}

static void
test_grid_equals_sizings (void)
{
  g_autoptr (SwDesign) d = load (orbit_json);
  const SwCarpetOutput outputs[] = { SW_CARPET_LIFTOFF_MASS, SW_CARPET_PAYLOAD,
                                     SW_CARPET_DEVELOPMENT, SW_CARPET_COST_PER_FLIGHT };

  for (guint o = 0; o < G_N_ELEMENTS (outputs); o++)
    {
      SwCarpetOptions opt = { 0 };
      g_autoptr (SwCarpet) c = NULL;
      g_autoptr (GError) error = NULL;

      axis (&opt.x, d, "stages[0].structural_coefficient", 0.04, 0.16, 50);
      axis (&opt.y, d, "stages[1].isp_vac_s", 300.0, 460.0, 50);
      opt.output = outputs[o];
      c = sw_carpet_compute (d, &opt, &error);
      g_assert_no_error (error);
      g_assert_nonnull (c);
      g_assert_cmpfloat (c->design_x, ==, 0.07);
      g_assert_cmpfloat (c->design_y, ==, 340.0);
      check_samples (d, c);
    }
}

/* A design with a fixed propellant load on its top stage: the grid honours
 * it (each point equals sw_size_design of the design with the inputs set,
 * the fixed load kept); the payload output, no longer linear in the mass,
 * is checked by bisection: the vehicle sized for that payload weighs what
 * the design weighs. */
static void
test_fixed_loads_honoured (void)
{
  g_autoptr (SwDesign) d = load (orbit_json);
  const SwCarpetOutput outputs[] = { SW_CARPET_LIFTOFF_MASS, SW_CARPET_DEVELOPMENT };
  SwSizing own, unfixed;

  d->stages[2].propellant.has_propellant_kg = TRUE;
  d->stages[2].propellant.propellant_kg = 9000.0;
  g_assert_true (sw_size_design (d, &own, NULL));
  g_assert_true (own.feasible && own.stages[2].fixed);
  for (guint o = 0; o < G_N_ELEMENTS (outputs); o++)
    {
      SwCarpetOptions opt = { 0 };
      g_autoptr (SwCarpet) c = NULL;

      axis (&opt.x, d, "stages[0].structural_coefficient", 0.04, 0.16, 50);
      axis (&opt.y, d, "payload_kg", 1000.0, 6000.0, 50);
      opt.output = outputs[o];
      c = sw_carpet_compute (d, &opt, NULL);
      g_assert_nonnull (c);
      check_samples (d, c);
      if (outputs[o] == SW_CARPET_LIFTOFF_MASS)
        {
          g_assert_cmpfloat_with_epsilon (c->design_value / own.liftoff_mass_kg, 1.0, 1e-12);
          /* Not the all-sized vehicle's mass: the fixed load counts. */
          {
            SwStageSet set = { 0 };
            sw_stage_set_from_design (&set, d);
            sw_size (&set, d->payload_kg, own.delta_v_m_s, d->split, &unfixed);
            g_assert_cmpfloat (fabs (c->design_value - unfixed.liftoff_mass_kg), >, 100.0);
          }
        }
    }
  {
    SwCarpetOptions opt = { 0 };
    g_autoptr (SwCarpet) c = NULL;
    const guint samples[][2] = { { 0, 0 }, { 24, 3 }, { 49, 4 } };

    axis (&opt.x, d, "stages[0].structural_coefficient", 0.04, 0.16, 50);
    axis (&opt.y, d, "stages[1].isp_vac_s", 320.0, 360.0, 5);
    opt.output = SW_CARPET_PAYLOAD;
    c = sw_carpet_compute (d, &opt, NULL);
    g_assert_nonnull (c);
    g_assert_cmpfloat_with_epsilon (c->design_value / d->payload_kg, 1.0, 1e-8);
    for (guint k = 0; k < G_N_ELEMENTS (samples); k++)
      {
        guint i = samples[k][0], j = samples[k][1];
        g_autoptr (SwDesign) copy = sw_design_copy (d);
        double lo = 1.0, hi = 1.0e5, v = c->values[j * c->x.n + i];

        sw_carpet_apply (&c->x, copy, sw_carpet_axis_value (&c->x, i));
        sw_carpet_apply (&c->y, copy, sw_carpet_axis_value (&c->y, j));
        for (int it = 0; it < 100; it++)
          {
            SwSizing sz;
            copy->payload_kg = 0.5 * (lo + hi);
            g_assert_true (sw_size_design (copy, &sz, NULL));
            if (sz.feasible && sz.liftoff_mass_kg <= own.liftoff_mass_kg)
              lo = copy->payload_kg;
            else
              hi = copy->payload_kg;
          }
        g_assert_true (c->feasible[j * c->x.n + i]);
        g_assert_cmpfloat_with_epsilon (v / lo, 1.0, 1e-7);
      }
  }
}

/* Losses on an orbit mission; delta-v on a delta-v mission, where the far
 * corner does not close: the default design's two stages (320 s, eps 0.07;
 * 340 s, eps 0.09) reach c1 ln(1/eps1) + c2 ln(1/eps2) = 8345 + 8029
 * = 16,374 m/s at most. */
static void
test_losses_payload_infeasible (void)
{
  g_autoptr (SwDesign) d = load (orbit_json);
  g_autoptr (SwDesign) dv = sw_design_new_default ();
  SwCarpetOptions opt = { 0 };
  g_autoptr (SwCarpet) c = NULL;
  g_autoptr (SwCarpet) c2 = NULL;
  g_autoptr (GError) error = NULL;

  axis (&opt.x, d, "mission.losses_m_s", 0.0, 5000.0, 30);
  axis (&opt.y, d, "payload_kg", 100.0, 20000.0, 20);
  c = sw_carpet_compute (d, &opt, &error);
  g_assert_no_error (error);
  g_assert_cmpfloat (c->design_x, ==, 1500.0);
  check_samples (d, c);

  axis (&opt.x, dv, "mission.delta_v_m_s", 6000.0, 20000.0, 30);
  axis (&opt.y, dv, "payload_kg", 100.0, 20000.0, 20);
  c2 = sw_carpet_compute (dv, &opt, &error);
  g_assert_no_error (error);
  g_assert_cmpfloat (c2->design_x, ==, 9400.0);
  g_assert_cmpuint (c2->n_infeasible, >, 0);
  g_assert_cmpuint (c2->n_infeasible, <, 30 * 20);
  g_assert_false (c2->feasible[29]);
  g_assert_true (isnan (c2->values[29]));
  g_assert_true (c2->feasible[0]);
  check_samples (dv, c2);
}

/* The orbit's own inputs: the budget is computed again at every point, and
 * an inclination below the site's latitude (45.6 deg) cannot be reached
 * directly, so those points do not close. */
static void
test_orbit_and_cost_parameters (void)
{
  g_autoptr (SwDesign) d = load (orbit_json);
  SwCarpetOptions opt = { 0 };
  g_autoptr (SwCarpet) c = NULL;
  g_autoptr (SwCarpet) c2 = NULL;
  g_autoptr (SwCarpet) c3 = NULL;
  g_autoptr (GError) error = NULL;

  axis (&opt.x, d, "mission.orbit.site_latitude_deg", 0.0, 60.0, 25);
  axis (&opt.y, d, "mission.orbit.inclination_deg", 30.0, 100.0, 50);
  c = sw_carpet_compute (d, &opt, &error);
  g_assert_no_error (error);
  g_assert_cmpfloat (c->design_x, ==, 45.6);
  g_assert_cmpfloat (c->design_y, ==, 51.6);
  /* A point closes exactly when the inclination is at least the latitude
   * (and at most 180 deg less it). */
  for (guint j = 0; j < c->y.n; j++)
    for (guint i = 0; i < c->x.n; i++)
      g_assert_true (c->feasible[j * c->x.n + i]
                     == (sw_carpet_axis_value (&c->y, j) >= sw_carpet_axis_value (&c->x, i)));
  check_samples (d, c);
  /* Less of the Earth's turn helps a more inclined orbit: on the equator
   * (column 0), liftoff mass rises with the inclination. */
  g_assert_cmpfloat (c->values[49 * 25 + 0], >, c->values[0 * 25 + 0]);

  /* Cost-model keys against a stage input, for both cost outputs; whole
   * numbers (vehicles built) rounded on the axis. */
  axis (&opt.x, d, "economics.learning_rate", 0.75, 0.99, 13);
  axis (&opt.y, d, "economics.production_run", 1.0, 60.0, 7);
  opt.output = SW_CARPET_COST_PER_FLIGHT;
  c2 = sw_carpet_compute (d, &opt, &error);
  g_assert_no_error (error);
  g_assert_cmpfloat (c2->design_x, ==, 0.9);
  g_assert_cmpfloat (c2->design_y, ==, 10.0);
  g_assert_cmpfloat (sw_carpet_axis_value (&c2->y, 1), ==, round (1.0 + 59.0 / 6.0));
  check_samples (d, c2);
  /* A steeper learning curve (smaller rate) and a longer run cost less per flight. */
  g_assert_cmpfloat (c2->values[6 * 13 + 0], <, c2->values[6 * 13 + 12]);
  g_assert_cmpfloat (c2->values[6 * 13 + 0], <, c2->values[0 * 13 + 0]);

  axis (&opt.x, d, "economics.cost_coefficients.stage_development_exponent", 0.4, 0.7, 9);
  axis (&opt.y, d, "stages[2].structural_coefficient", 0.06, 0.2, 11);
  opt.output = SW_CARPET_DEVELOPMENT;
  c3 = sw_carpet_compute (d, &opt, &error);
  g_assert_no_error (error);
  check_samples (d, c3);

  /* The cost model's keys change no mass: refused for a mass output. */
  opt.output = SW_CARPET_LIFTOFF_MASS;
  g_assert_null (sw_carpet_compute (d, &opt, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_USAGE);
  g_assert_nonnull (strstr (error->message, "change only the cost outputs"));
}

/* A stage with a fixed propellant load: its load is a parameter (and only
 * its); the grid equals the sizings of the design with the load set. */
static void
test_fixed_load_parameter (void)
{
  g_autofree char *json = g_strdup (orbit_json);
  g_autoptr (SwDesign) d = NULL;
  g_autoptr (SwCarpet) c = NULL;
  g_autoptr (GError) error = NULL;
  SwCarpetOptions opt = { 0 };
  SwCarpetAxis a = { 0 }, list[64];
  guint n;
  char *at = strstr (json, "\"name\": \"C\", ");

  /* The top stage carries a fixed 4,000 kg load. */
  g_assert_nonnull (at);
  {
    g_autofree char *head = g_strndup (json, at - json);
    g_autofree char *with = g_strconcat (head, "\"propellant_kg\": 4000, ", at, NULL);
    d = load (with);
  }
  g_assert_true (d->stages[2].propellant.has_propellant_kg);
  n = sw_carpet_list_params (d, SW_CARPET_LIFTOFF_MASS, list, G_N_ELEMENTS (list));
  g_assert_cmpuint (n, ==, 12);
  g_assert_false (sw_carpet_param_parse ("stages[0].propellant_kg", d, &a, &error));
  g_assert_nonnull (strstr (error->message, "no fixed propellant load to vary"));
  g_clear_error (&error);

  axis (&opt.x, d, "stages[2].propellant_kg", 2000.0, 8000.0, 13);
  axis (&opt.y, d, "stages[0].structural_coefficient", 0.05, 0.12, 9);
  for (SwCarpetOutput o = SW_CARPET_LIFTOFF_MASS; o <= SW_CARPET_COST_PER_FLIGHT; o++)
    {
      opt.output = o;
      g_clear_pointer (&c, sw_carpet_free);
      c = sw_carpet_compute (d, &opt, &error);
      g_assert_no_error (error);
      g_assert_cmpfloat (c->design_x, ==, 4000.0);
      check_samples (d, c);
    }
}

/* The window's menu: every stage input of each stage, the mission's inputs
 * by kind, the cost keys only for cost outputs; a default range around the
 * design's value inside the key's limit, which the grid accepts. */
static void
test_parameter_list (void)
{
  g_autoptr (SwDesign) d = load (orbit_json);
  g_autoptr (SwDesign) dv = sw_design_new_default ();
  SwCarpetAxis list[64];
  guint n_mass = sw_carpet_list_params (d, SW_CARPET_LIFTOFF_MASS, list, G_N_ELEMENTS (list));
  guint n_cost = sw_carpet_list_params (d, SW_CARPET_DEVELOPMENT, list, G_N_ELEMENTS (list));
  guint n_dv = sw_carpet_list_params (dv, SW_CARPET_PAYLOAD, list, 4);

  /* 3 stages x 2, payload, losses, altitude, inclination, latitude. */
  g_assert_cmpuint (n_mass, ==, 11);
  g_assert_cmpuint (n_cost, ==, 11 + 12);
  g_assert_cmpuint (n_dv, ==, 4);
  g_assert_cmpuint (sw_carpet_list_params (dv, SW_CARPET_PAYLOAD, NULL, 0), ==, 0);
  n_cost = sw_carpet_list_params (d, SW_CARPET_DEVELOPMENT, list, G_N_ELEMENTS (list));
  for (guint k = 0; k < n_cost; k++)
    {
      g_autofree char *name = sw_carpet_param_dup_name (&list[k]);
      SwCarpetAxis parsed = { 0 };
      SwCarpetOptions opt = { 0 };
      g_autoptr (SwCarpet) c = NULL;
      g_autoptr (GError) error = NULL;
      double v;

      /* The name reads back as the same parameter. */
      g_assert_true (sw_carpet_param_parse (name, d, &parsed, &error));
      g_assert_true (sw_carpet_param_equal (&parsed, &list[k]));
      sw_carpet_axis_default_range (&list[k], d);
      list[k].n = 5;
      g_assert_true (sw_carpet_axis_check (&list[k], d, &error));
      g_assert_no_error (error);
      v = sw_carpet_design_value (&list[k], d);
      if (list[k].kind != SW_CARPET_PARAM_LOSSES || v > 0)
        g_assert_true (list[k].min <= v && v <= list[k].max);
      opt.x = list[k];
      opt.y = list[k == 0 ? 1 : 0];
      sw_carpet_axis_default_range (&opt.y, d);
      opt.y.n = 4;
      opt.output = SW_CARPET_DEVELOPMENT;
      c = sw_carpet_compute (d, &opt, &error);
      g_assert_no_error (error);
      check_samples (d, c);
    }
}

static void
cancel_after_first_row (double fraction, gpointer data)
{
  g_cancellable_cancel (G_CANCELLABLE (data));
}

static void
count_rows (double fraction, gpointer data)
{
  guint *n = data;
  (*n)++;
}

static void
test_cancel_and_progress (void)
{
  g_autoptr (SwDesign) d = load (orbit_json);
  g_autoptr (GCancellable) cancel = g_cancellable_new ();
  SwCarpetOptions opt = { 0 };
  g_autoptr (GError) error = NULL;
  SwCarpet *c;
  guint rows = 0;

  axis (&opt.x, d, "stages[2].structural_coefficient", 0.05, 0.3, 10);
  axis (&opt.y, d, "stages[0].isp_vac_s", 290.0, 350.0, 12);
  opt.progress = count_rows;
  opt.progress_data = &rows;
  c = sw_carpet_compute (d, &opt, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (rows, ==, 12);
  sw_carpet_free (c);

  opt.cancellable = cancel;
  opt.progress = cancel_after_first_row;
  opt.progress_data = cancel;
  c = sw_carpet_compute (d, &opt, &error);
  g_assert_null (c);
  g_assert_error (error, G_IO_ERROR, G_IO_ERROR_CANCELLED);
}

static void
test_bad_axes (void)
{
  g_autoptr (SwDesign) d = load (orbit_json);
  SwCarpetAxis a = { 0 };
  SwCarpetOptions opt = { 0 };
  GError *error = NULL;

  g_assert_false (sw_carpet_param_parse ("stages[3].isp_vac_s", d, &a, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_USAGE);
  g_assert_nonnull (strstr (error->message, "the design has 3 stages"));
  g_clear_error (&error);
  g_assert_false (sw_carpet_param_parse ("thrust", d, &a, &error));
  g_assert_nonnull (strstr (error->message, "thrust: not a parameter of the carpet plot"));
  g_clear_error (&error);
  g_assert_false (sw_carpet_param_parse ("mission.delta_v_m_s", d, &a, &error));
  g_assert_nonnull (strstr (error->message, "vary mission.losses_m_s instead"));
  g_clear_error (&error);

  axis (&opt.x, d, "stages[0].structural_coefficient", 0.005, 0.2, 10);
  axis (&opt.y, d, "payload_kg", 100.0, 200.0, 10);
  g_assert_null (sw_carpet_compute (d, &opt, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_RANGE);
  g_assert_nonnull (strstr (error->message, "stages[0].structural_coefficient: the range 0.005 "
                                            "to 0.2 leaves the accepted range 0.01 to 0.6"));
  g_clear_error (&error);
  opt.x.min = 0.05;
  opt.y.n = 1;
  g_assert_null (sw_carpet_compute (d, &opt, &error));
  g_assert_nonnull (strstr (error->message, "payload_kg: 1 points; a carpet axis has 2 to 500"));
  g_clear_error (&error);
  opt.y = opt.x;
  g_assert_null (sw_carpet_compute (d, &opt, &error));
  g_assert_nonnull (strstr (error->message, "must be different parameters"));
  g_clear_error (&error);
}

/* The cost outputs in money: each point's money is its work-years times
 * the design's cost of a work-year, and equals the cost model run on the
 * individual sizing of the point; the design's own point equals the
 * staging table's row of this design (the `stages` figures).  Not for the
 * mass outputs, nor without a cost per work-year. */
static void
test_money (void)
{
  g_autoptr (SwDesign) d = load (orbit_json);
  const SwCarpetOutput outputs[] = { SW_CARPET_DEVELOPMENT, SW_CARPET_COST_PER_FLIGHT };
  const guint samples[][2] = { { 0, 0 }, { 3, 2 }, { 6, 4 }, { 2, 3 } };
  const double wyc = 250000.0;
  SwStaging st;

  g_assert_true (sw_economics_set_number (&d->economics, SW_ECON_WORK_YEAR_COST, wyc));
  g_assert_true (sw_economics_set_currency (&d->economics, "kDemo", NULL));
  g_assert_true (sw_staging_compute (d, 6, &st, NULL));
  g_assert_cmpint (st.design_index, ==, 2);
  for (guint o = 0; o < G_N_ELEMENTS (outputs); o++)
    {
      SwCarpetOptions opt = { 0 };
      g_autoptr (SwCarpet) c = NULL;
      const SwStagingRow *own = &st.rows[st.design_index];
      double own_wy = outputs[o] == SW_CARPET_DEVELOPMENT ? own->development_work_years
                                                          : own->cost_per_flight_work_years;

      axis (&opt.x, d, "stages[0].structural_coefficient", 0.04, 0.16, 7);
      axis (&opt.y, d, "stages[1].isp_vac_s", 300.0, 460.0, 5);
      opt.output = outputs[o];
      c = sw_carpet_compute (d, &opt, NULL);
      g_assert_nonnull (c);
      g_assert_true (c->has_money);
      g_assert_nonnull (c->money);
      g_assert_cmpfloat (c->work_year_cost, ==, wyc);
      g_assert_cmpstr (c->currency, ==, "kDemo");
      for (guint k = 0; k < G_N_ELEMENTS (samples); k++)
        {
          guint i = samples[k][0], j = samples[k][1];
          double money = c->money[j * c->x.n + i];
          double wy = individual (d, c, i, j);

          g_assert_true (isfinite (wy) && wy > 0.0);
          g_assert_cmpfloat (money, ==, c->values[j * c->x.n + i] * wyc);
          g_assert_cmpfloat_with_epsilon (money / (wy * wyc), 1.0, 1e-12);
        }
      /* The design's own point: the staging table's row of this design. */
      g_assert_true (isfinite (own_wy));
      g_assert_cmpfloat_with_epsilon (c->design_money / (own_wy * wyc), 1.0, 1e-9);
    }
  {
    SwCarpetOptions opt = { 0 };
    g_autoptr (SwCarpet) c = NULL;

    axis (&opt.x, d, "stages[0].structural_coefficient", 0.04, 0.16, 4);
    axis (&opt.y, d, "stages[1].isp_vac_s", 300.0, 460.0, 4);
    opt.output = SW_CARPET_LIFTOFF_MASS;
    c = sw_carpet_compute (d, &opt, NULL);
    g_assert_false (c->has_money);
    g_assert_null (c->money);
    g_assert_true (isnan (c->design_money) && isnan (c->work_year_cost));
  }
  {
    g_autoptr (SwDesign) plain = load (orbit_json);
    SwCarpetOptions opt = { 0 };
    g_autoptr (SwCarpet) c = NULL;

    axis (&opt.x, plain, "stages[0].structural_coefficient", 0.04, 0.16, 4);
    axis (&opt.y, plain, "stages[1].isp_vac_s", 300.0, 460.0, 4);
    opt.output = SW_CARPET_DEVELOPMENT;
    c = sw_carpet_compute (plain, &opt, NULL);
    g_assert_false (c->has_money);
    g_assert_null (c->money);
  }
}

/* A whole-number axis never repeats a value: "boosters.count:0.5:3:4"
 * would give 1, 1, 2, 3 (seen), so it is refused with the most points the
 * range allows; with that many the values are 1, 2, 3.  The default range
 * of a whole-number axis has at most one point per value. */
static void
test_whole_axis_distinct (void)
{
  g_autofree char *path = g_build_filename (g_getenv ("SW_SOURCE_ROOT"),
                                            "data", "designs", "four-booster-cargo.stagewright",
                                            NULL);
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, &error);
  SwCarpetAxis a = { 0 };

  g_assert_no_error (error);
  g_assert_true (sw_carpet_axis_parse ("--x", "boosters.count:0.5:3:4", d, &a, &error));
  g_assert_false (sw_carpet_axis_check (&a, d, &error));
  g_assert_error (error, SW_ERROR, SW_ERROR_USAGE);
  g_assert_nonnull (strstr (error->message, "boosters.count takes whole numbers"));
  g_assert_nonnull (strstr (error->message, "give at most 3 points"));
  g_clear_error (&error);
  a.n = 3;
  g_assert_true (sw_carpet_axis_check (&a, d, &error));
  g_assert_no_error (error);
  for (guint i = 0; i < 3; i++)
    g_assert_cmpfloat (sw_carpet_axis_value (&a, i), ==, 1.0 + i);

  a.n = 50;
  sw_carpet_axis_default_range (&a, d);
  g_assert_cmpuint (a.n, ==, (guint) (a.max - a.min) + 1);
  g_assert_true (sw_carpet_axis_check (&a, d, &error));
  g_assert_no_error (error);
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/core/carpet/grid-equals-sizings", test_grid_equals_sizings);
  g_test_add_func ("/core/carpet/losses-payload-infeasible", test_losses_payload_infeasible);
  g_test_add_func ("/core/carpet/orbit-and-cost-parameters", test_orbit_and_cost_parameters);
  g_test_add_func ("/core/carpet/parameter-list", test_parameter_list);
  g_test_add_func ("/core/carpet/fixed-load-parameter", test_fixed_load_parameter);
  g_test_add_func ("/core/carpet/cancel-and-progress", test_cancel_and_progress);
  g_test_add_func ("/core/carpet/bad-axes", test_bad_axes);
  g_test_add_func ("/core/carpet/whole-axis-distinct", test_whole_axis_distinct);
  g_test_add_func ("/core/carpet/fixed-loads-honoured", test_fixed_loads_honoured);
  g_test_add_func ("/core/carpet/boosters-and-altitude", test_boosters_and_altitude);
  g_test_add_func ("/core/carpet/money", test_money);
  return g_test_run ();
}
