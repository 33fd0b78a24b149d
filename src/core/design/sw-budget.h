/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-budget.h: the delta-v budget of a circular orbit from a launch site.
 * Depends on nothing but the mission's numbers; the design's own budget is
 * sw_design_budget () in sw-design.h. */
#pragma once

#include "sw-types.h"

G_BEGIN_DECLS

struct _SwBudget {
  double circular_velocity_m_s;
  double launch_azimuth_deg;
  double site_speed_m_s;
  double rotation_gain_m_s;    /* circular velocity - ideal delta-v */
  double ideal_delta_v_m_s;
  double losses_m_s;
  double delta_v_m_s;          /* ideal + losses */
};

double   sw_circular_velocity (double altitude_m);
double   sw_site_speed (double latitude_deg);
gboolean sw_launch_azimuth (double inclination_deg, double latitude_deg, double *azimuth_deg);
gboolean sw_budget_compute (double altitude_km, double inclination_deg, double latitude_deg,
                            double losses_m_s, SwBudget *out, GError **error);

G_END_DECLS
