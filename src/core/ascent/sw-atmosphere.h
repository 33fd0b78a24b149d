/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-atmosphere.h: the 1976 U.S. Standard Atmosphere from -5 to 86 km and a
 * smooth approximation of it from 86 to 1000 km. */
#pragma once

#include "sw-types.h"

G_BEGIN_DECLS

#define SW_ATMOSPHERE_MIN_ALTITUDE_M (-5000.0)
#define SW_ATMOSPHERE_MAX_ALTITUDE_M 1.0e6
/* Top of the standard's layered (hydrostatic, well-mixed) part: 86 km geometric. */
#define SW_ATMOSPHERE_LAYERED_TOP_M 86000.0
/* Sea-level pressure of the standard. */
#define SW_ATMOSPHERE_P0 101325.0

typedef struct {
  double temperature_k;       /* kinetic temperature */
  double pressure_pa;
  double density_kg_m3;
  double speed_of_sound_m_s;  /* above 86 km sqrt(1.4 p / rho), see the .c file */
} SwAtmosphere;

/* The state at geometric altitude @altitude_m.  Returns FALSE when the altitude
 * lies outside -5 km .. 1000 km; @out is then still filled: below, with the
 * values at -5 km; above, with zero pressure and density (vacuum) and the
 * temperature and speed of sound at 1000 km.  NaN gives FALSE and NaNs. */
gboolean sw_atmosphere_at (double altitude_m, SwAtmosphere *out);

/* The same pressure, density and speed of sound without the temperature:
 * the flight simulator's hot path.  Identical values to sw_atmosphere_at. */
void     sw_atmosphere_flight (double altitude_m, double *pressure_pa, double *density_kg_m3,
                               double *speed_of_sound_m_s);

/* Geopotential altitude (m') of geometric altitude @altitude_m (m), with the
 * standard's r0 = 6356.766 km. */
double   sw_atmosphere_geopotential (double altitude_m);

G_END_DECLS
