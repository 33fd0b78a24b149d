/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-atmosphere"

#include "config.h"

#include "sw-atmosphere.h"

#include <gsl/gsl_interp.h>
#include <math.h>

/* U.S. Standard Atmosphere, 1976 (NOAA-S/T 76-1562, NASA-TM-X-74335).
 *
 * Up to 86 km: the standard's seven layers of linear molecular-scale
 * temperature in geopotential altitude H = r0 Z / (r0 + Z), hydrostatic
 * pressure, rho = p M0 / (R* T_M), a = sqrt(gamma R* T_M / M0), and between
 * 80 and 86 km the kinetic temperature T = T_M (M / M0) with the standard's
 * table of the molecular-weight ratio.  The constants are the standard's own
 * (R* = 8.31432, not today's CODATA value).
 *
 * Above 86 km the standard integrates the diffusion of each species, which a
 * sizing tool does not need.  Our approximation (not the standard's method):
 * the kinetic temperature follows the standard's four closed-form segments
 * (isothermal to 91 km, elliptical to 110 km, linear to 120 km, exponential
 * approach to T_inf = 1000 K), while ln p and ln rho are monotone cubic
 * (Steffen) interpolations through the standard's tabulated values at 13
 * altitudes (86 km taken from the layered model so the two parts join).  The
 * speed of sound is not defined by the standard above 86 km; we give
 * sqrt(1.4 p / rho), continuous with the value below.  Accurate to a few
 * percent in density between the knots; drag there is negligible for an
 * ascent anyway. */

#define R_STAR 8.31432        /* J/(mol K), the 1976 value */
#define M0 0.0289644          /* kg/mol, sea-level mean molar mass */
#define GAMMA 1.4
#define R0 6356766.0          /* m, effective Earth radius of the geopotential */
#define GMR (SW_G0 * M0 / R_STAR)   /* K/m' */

typedef struct {
  double h;      /* base geopotential altitude, m' */
  double lapse;  /* K/m' */
  double t;      /* base molecular-scale temperature, K */
  double p;      /* base pressure, Pa */
} Layer;

/* The standard's layer table (reference-values.md, confirmed). */
static const Layer layers[] = {
  { 0.0,     -6.5e-3, 288.15, 101325.0 },
  { 11000.0,  0.0,    216.65, 22632.1 },
  { 20000.0,  1.0e-3, 216.65, 5474.89 },
  { 32000.0,  2.8e-3, 228.65, 868.019 },
  { 47000.0,  0.0,    270.65, 110.906 },
  { 51000.0, -2.8e-3, 270.65, 66.9389 },
  { 71000.0, -2.0e-3, 214.65, 3.95642 },
};

/* M/M0 from 80 to 86 km in 0.5 km steps (the standard's table 8; from memory). */
static const double mol_ratio[] = {
  1.000000, 0.999996, 0.999989, 0.999971, 0.999941, 0.999909, 0.999870,
  0.999829, 0.999786, 0.999741, 0.999694, 0.999641, 0.999579,
};

/* Tabulated values of the standard above 86 km (km, Pa, kg/m^3; from memory). */
static const double upper_z_km[] = {
  86.0, 90.0, 100.0, 110.0, 120.0, 150.0, 200.0, 300.0, 400.0, 500.0, 600.0, 800.0, 1000.0,
};
static const double upper_p[] = {
  0.0, 1.8359e-1, 3.2011e-2, 7.1042e-3, 2.5382e-3, 4.5422e-4, 8.4736e-5, 8.7704e-6,
  1.4518e-6, 3.0236e-7, 8.2120e-8, 1.7036e-8, 7.5138e-9,
};
static const double upper_rho[] = {
  0.0, 3.416e-6, 5.604e-7, 9.708e-8, 2.222e-8, 2.076e-9, 2.541e-10, 1.916e-11,
  2.803e-12, 5.215e-13, 1.137e-13, 1.136e-14, 3.561e-15,
};
#define N_UPPER G_N_ELEMENTS (upper_z_km)

/* ln p and ln rho between the knots: GSL's Steffen interpolant, kept as the
 * cubic of each interval (its Hermite form, with the slopes at the knots
 * that GSL's interpolation gives), so the hot path evaluates it without
 * GSL's search and calls. */
typedef struct {
  double z[N_UPPER];
  double lp[N_UPPER - 1][4];     /* d + x (c + x (b + x a)), x = z - z[i] */
  double lr[N_UPPER - 1][4];
} Upper;

double
sw_atmosphere_geopotential (double altitude_m)
{
  return R0 * altitude_m / (R0 + altitude_m);
}

/* The layered part: molecular-scale temperature and pressure at geometric Z. */
static void
layered (double z, double *t_m, double *p)
{
  double h = sw_atmosphere_geopotential (z);
  int i = G_N_ELEMENTS (layers) - 1;

  while (i > 0 && h < layers[i].h)
    i--;
  *t_m = layers[i].t + layers[i].lapse * (h - layers[i].h);
  if (layers[i].lapse != 0.0)
    *p = layers[i].p * pow (layers[i].t / *t_m, GMR / layers[i].lapse);
  else
    *p = layers[i].p * exp (-GMR * (h - layers[i].h) / layers[i].t);
}

static void
steffen_cubics (const double *z, const double *y, double (*out)[4])
{
  gsl_interp *it = gsl_interp_alloc (gsl_interp_steffen, N_UPPER);
  double yp[N_UPPER];

  gsl_interp_init (it, z, y, N_UPPER);
  for (guint i = 0; i < N_UPPER; i++)
    yp[i] = gsl_interp_eval_deriv (it, z, y, z[i], NULL);
  for (guint i = 0; i + 1 < N_UPPER; i++)
    {
      double h = z[i + 1] - z[i], slope = (y[i + 1] - y[i]) / h;

      out[i][0] = (yp[i] + yp[i + 1] - 2.0 * slope) / h / h;
      out[i][1] = (3.0 * slope - 2.0 * yp[i] - yp[i + 1]) / h;
      out[i][2] = yp[i];
      out[i][3] = y[i];
    }
  gsl_interp_free (it);
}

static const Upper *
upper_table (void)
{
  static Upper upper;
  static gsize init = 0;

  if (g_once_init_enter (&init))
    {
      double t_m, p, lp[N_UPPER], lr[N_UPPER];

      layered (SW_ATMOSPHERE_LAYERED_TOP_M, &t_m, &p);
      for (guint i = 0; i < N_UPPER; i++)
        {
          upper.z[i] = upper_z_km[i];
          lp[i] = log (i == 0 ? p : upper_p[i]);
          lr[i] = log (i == 0 ? p * M0 / (R_STAR * t_m) : upper_rho[i]);
        }
      steffen_cubics (upper.z, lp, upper.lp);
      steffen_cubics (upper.z, lr, upper.lr);
      g_once_init_leave (&init, 1);
    }
  return &upper;
}

/* Pressure and density from 86 to 1000 km. */
static void
upper_at (double z_km, double *p, double *rho)
{
  const Upper *u = upper_table ();
  guint i = 0;
  double x;

  while (i + 2 < N_UPPER && z_km >= u->z[i + 1])
    i++;
  x = z_km - u->z[i];
  *p = exp (u->lp[i][3] + x * (u->lp[i][2] + x * (u->lp[i][1] + x * u->lp[i][0])));
  *rho = exp (u->lr[i][3] + x * (u->lr[i][2] + x * (u->lr[i][1] + x * u->lr[i][0])));
}

/* The standard's kinetic temperature above 86 km (closed forms; from memory). */
static double
upper_temperature (double z_km)
{
  if (z_km < 91.0)
    return 186.8673;
  if (z_km < 110.0)
    {
      double x = (z_km - 91.0) / -19.9429;
      return 263.1905 - 76.3232 * sqrt (MAX (0.0, 1.0 - x * x));
    }
  if (z_km < 120.0)
    return 240.0 + 12.0 * (z_km - 110.0);
  {
    double r0_km = R0 / 1000.0;
    double xi = (z_km - 120.0) * (r0_km + 120.0) / (r0_km + z_km);
    return 1000.0 - (1000.0 - 360.0) * exp (-0.01875 * xi);
  }
}

gboolean
sw_atmosphere_at (double altitude_m, SwAtmosphere *out)
{
  gboolean inside = TRUE;
  double z = altitude_m;

  g_return_val_if_fail (out != NULL, FALSE);

  if (isnan (z))
    {
      out->temperature_k = out->pressure_pa = out->density_kg_m3 = NAN;
      out->speed_of_sound_m_s = NAN;
      return FALSE;
    }
  if (z < SW_ATMOSPHERE_MIN_ALTITUDE_M)
    {
      z = SW_ATMOSPHERE_MIN_ALTITUDE_M;
      inside = FALSE;
    }

  if (z <= SW_ATMOSPHERE_LAYERED_TOP_M)
    {
      double t_m, p, ratio = 1.0;

      layered (z, &t_m, &p);
      if (z > 80000.0)
        {
          double u = (z - 80000.0) / 500.0;
          guint k = MIN ((guint) u, G_N_ELEMENTS (mol_ratio) - 2);
          double f = u - k;
          ratio = mol_ratio[k] + f * (mol_ratio[k + 1] - mol_ratio[k]);
        }
      out->temperature_k = t_m * ratio;
      out->pressure_pa = p;
      out->density_kg_m3 = p * M0 / (R_STAR * t_m);
      out->speed_of_sound_m_s = sqrt (GAMMA * R_STAR * t_m / M0);
      return inside;
    }
  else
    {
      double z_km = MIN (z, SW_ATMOSPHERE_MAX_ALTITUDE_M) / 1000.0;
      double p, rho;

      upper_at (z_km, &p, &rho);

      out->temperature_k = upper_temperature (z_km);
      out->speed_of_sound_m_s = sqrt (GAMMA * p / rho);
      if (z > SW_ATMOSPHERE_MAX_ALTITUDE_M)
        {
          out->pressure_pa = 0.0;
          out->density_kg_m3 = 0.0;
          return FALSE;
        }
      out->pressure_pa = p;
      out->density_kg_m3 = rho;
      return inside;
    }
}

void
sw_atmosphere_flight (double altitude_m, double *pressure_pa, double *density_kg_m3,
                      double *speed_of_sound_m_s)
{
  double z = altitude_m;

  if (!(z <= SW_ATMOSPHERE_LAYERED_TOP_M) || isnan (z))
    {
      SwAtmosphere a;

      if (isnan (z) || z > SW_ATMOSPHERE_MAX_ALTITUDE_M)
        {
          sw_atmosphere_at (z, &a);
          *pressure_pa = a.pressure_pa;
          *density_kg_m3 = a.density_kg_m3;
          *speed_of_sound_m_s = a.speed_of_sound_m_s;
          return;
        }
      {
        double p, rho;

        upper_at (z / 1000.0, &p, &rho);

        *pressure_pa = p;
        *density_kg_m3 = rho;
        *speed_of_sound_m_s = sqrt (GAMMA * p / rho);
        return;
      }
    }
  {
    double t_m, p;

    if (z < SW_ATMOSPHERE_MIN_ALTITUDE_M)
      z = SW_ATMOSPHERE_MIN_ALTITUDE_M;
    layered (z, &t_m, &p);
    *pressure_pa = p;
    *density_kg_m3 = p * M0 / (R_STAR * t_m);
    *speed_of_sound_m_s = sqrt (GAMMA * R_STAR * t_m / M0);
  }
}
