/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-fixed-vehicle.h: a vehicle whose propellant loads are fixed (built), and
 * the payload it can carry to a required delta-v.  The payload exchange
 * ratios and the Monte Carlo's second question use it. */
#pragma once

#include "sw-sizing.h"
#include "sw-types.h"

G_BEGIN_DECLS

typedef struct {
  guint  n_stages;
  double exhaust_velocity_m_s[SW_MAX_STAGES];
  double propellant_mass_kg[SW_MAX_STAGES];
  double structural_mass_kg[SW_MAX_STAGES];
  SwFairingCarry fairing;          /* mass 0: none (sw-sizing.h) */
} SwFixedVehicle;

/* The vehicle of a feasible sizing; FALSE when @sizing is infeasible. */
gboolean sw_fixed_vehicle_from_sizing (SwFixedVehicle *vehicle, const SwSizing *sizing);

/* The ideal delta-v of the vehicle with @payload_kg on top: the rocket
 * equation summed over the stages that carry propellant.  NAN when a burnout
 * mass is not positive. */
double   sw_fixed_vehicle_delta_v (const SwFixedVehicle *vehicle, double payload_kg);

/* The payload that the vehicle carries to exactly @delta_v_m_s (Brent's
 * method, GSL).  The answer may be negative: the vehicle falls short even
 * empty, by that much mass.  FALSE only when the vehicle has no propellant. */
gboolean sw_fixed_vehicle_payload (const SwFixedVehicle *vehicle, double delta_v_m_s,
                                   double *payload_kg);

/* Payload lost per kilogram of dry mass added to each stage, at the payload
 * that reaches @delta_v_m_s: by the root finder with +-@added_kg (central
 * difference).  Ratios are positive (payload lost); the top stage's is 1. */
gboolean sw_fixed_vehicle_exchange_ratios (const SwFixedVehicle *vehicle, double delta_v_m_s,
                                           double added_kg, double *ratios);

/* The same ratios from the implicit-function theorem:
 * dP/dms_k = -sum_{i<=k} a_i / sum_i a_i, a_i = c_i (1/mf_i - 1/m0_i). */
void     sw_fixed_vehicle_exchange_ratios_analytic (const SwFixedVehicle *vehicle,
                                                    double payload_kg, double *ratios);

G_END_DECLS
