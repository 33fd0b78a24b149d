/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-budget"

#include "config.h"

#include "sw-budget.h"

#include <glib/gi18n-lib.h>
#include <math.h>

#define DEG (G_PI / 180.0)

double
sw_circular_velocity (double altitude_m)
{
  return sqrt (SW_WGS84_MU / (SW_WGS84_A + altitude_m));
}

double
sw_site_speed (double latitude_deg)
{
  return SW_WGS84_OMEGA * SW_WGS84_A * cos (latitude_deg * DEG);
}

/* Spherical trigonometry: cos i = cos(latitude) sin(azimuth).  The launch is
 * due east of north (0 < azimuth < 180 deg); the mirror southward azimuth
 * gives the same speeds. */
gboolean
sw_launch_azimuth (double inclination_deg, double latitude_deg, double *azimuth_deg)
{
  double s = cos (inclination_deg * DEG) / cos (latitude_deg * DEG);

  if (!(fabs (s) <= 1.0 + 1e-12))
    return FALSE;
  *azimuth_deg = asin (CLAMP (s, -1.0, 1.0)) / DEG;
  if (*azimuth_deg < 0.0)
    *azimuth_deg += 360.0;
  return TRUE;
}

gboolean
sw_budget_compute (double altitude_km, double inclination_deg, double latitude_deg,
                   double losses_m_s, SwBudget *out, GError **error)
{
  double az, vc, vs, ve, vn;

  g_return_val_if_fail (out != NULL, FALSE);

  if (!sw_launch_azimuth (inclination_deg, latitude_deg, &az))
    {
      g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                   _("An orbit inclined %.2f deg cannot be reached directly from a site at "
                     "latitude %.2f deg: the inclination must lie between |latitude| and "
                     "180 deg - |latitude|."),
                   inclination_deg, latitude_deg);
      return FALSE;
    }

  vc = sw_circular_velocity (altitude_km * 1000.0);
  vs = sw_site_speed (latitude_deg);
  /* Orbital velocity along the azimuth minus the site's eastward velocity,
   * in local east/north components. */
  ve = vc * sin (az * DEG) - vs;
  vn = vc * cos (az * DEG);

  out->circular_velocity_m_s = vc;
  out->launch_azimuth_deg = az;
  out->site_speed_m_s = vs;
  out->ideal_delta_v_m_s = hypot (ve, vn);
  out->rotation_gain_m_s = vc - out->ideal_delta_v_m_s;
  out->losses_m_s = losses_m_s;
  out->delta_v_m_s = out->ideal_delta_v_m_s + losses_m_s;
  return TRUE;
}
