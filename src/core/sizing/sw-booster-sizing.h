/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-booster-sizing.h: sizing a vehicle with strap-on boosters (parallel
 * staging).  Formulas: shared/reference-values.md, "Parallel staging".
 *
 * Phase 0, boosters and core together for the boosters' burn time
 * t_b = P_b c_b / F_b: exhaust velocity c_mix = (F_core + k F_b) /
 * (mdot_core + k mdot_b) (vacuum Isp, as for the serial stages); the core
 * burns mdot_core t_b of its own propellant; delta-v_0 = c_mix ln(M_0 /
 * (M_0 - k P_b - mdot_core t_b)).  The boosters' structure is dropped.
 * Phase 1, the core alone: delta-v_1 = c_core ln(M_1 / (M_1 - (P_core -
 * mdot_core t_b))).  Then each upper stage as in the serial vehicle.
 * Crossfeed (the boosters feed the core's engines too): phase 0 lasts
 * k P_b / (k mdot_b + mdot_core), burns only booster propellant, and the
 * core starts its own phase full.
 *
 * The sizing minimises the liftoff mass over the sized loads subject to the
 * mission's delta-v.  With the core sized, its propellant follows from the
 * delta-v (a scan, then GSL's Brent root); the boosters' load (when sized)
 * and the delta-v of the upper stages (optimal split, when one of them is
 * sized) are chosen by GSL's Brent minimiser (gsl_min_fminimizer_brent),
 * nested, each started from a grid that brackets the minimum.  For a given
 * upper-stage delta-v the upper stages carry a fixed payload, so their best
 * split is the serial Lagrange optimum (sw_size_with_fixed).  Under the
 * equal and manual splits the core and the upper stages take the delta-v of
 * the serial split (the core's including phase 0); only the boosters' load
 * is then chosen.  With the core's load fixed, the upper stages' delta-v is
 * the root instead (boosters fixed), or every load is fixed.  On a fixed
 * core, sized boosters take the load of least liftoff mass (that root for
 * each load, a grid and Brent's minimiser over the load), or with every
 * stage fixed the least load whose delta-v is enough (a scan and Brent's
 * root).  Under the equal and manual splits with fixed stages the sized
 * stages (the core counting phase 0) take what the fixed ones leave, in the
 * split's proportions (the manual shares of the upper stages scaled to add
 * up to 1 over the sized ones). */
#pragma once

#include "sw-sizing.h"

G_BEGIN_DECLS

typedef struct {
  SwStageSet set;                      /* the serial stages; stage 0 is the core */
  double fixed_kg[SW_MAX_STAGES];      /* > 0: a fixed load; 0 sized */
  double core_thrust_n;                /* vacuum */
  guint  count;                        /* boosters; 0: the serial vehicle */
  double booster_exhaust_velocity_m_s;
  double booster_structural_coefficient;
  double booster_thrust_n;             /* per booster, vacuum */
  double booster_fixed_kg;             /* per booster; 0 sized */
  gboolean crossfeed;
} SwParallelVehicle;

/* The vehicle of @design (FALSE with @error when it has no stages, or has
 * boosters without a core thrust). */
gboolean sw_parallel_vehicle_from_design (SwParallelVehicle *v, const SwDesign *design,
                                          GError **error);

/* Size the vehicle.  Never fails: an infeasible vehicle is an answer.  With
 * count 0 the same machinery sizes the serial vehicle (tests compare it with
 * the exact Lagrange optimum). */
void     sw_size_parallel (const SwParallelVehicle *v, double payload_kg, double delta_v_m_s,
                           SwSplitMode split, SwSizing *out);

/* The liftoff mass and delta-v of the vehicle with the given loads (per
 * booster @booster_kg, the core's @core_kg, the upper stages sized to
 * @upper_delta_v_m_s with @payload_kg): for tests and the brute-force check.
 * NAN when the loads make no vehicle. */
double   sw_parallel_liftoff_mass (const SwParallelVehicle *v, double payload_kg,
                                   double booster_kg, double core_kg, double upper_delta_v_m_s,
                                   double *delta_v_m_s);

/* Every load fixed (stages and boosters): the payload with which the vehicle
 * gives exactly @delta_v_m_s (Brent's root, GSL).  FALSE when a load is
 * sized, or when even with no payload the vehicle gives less (then
 * *payload_kg NAN); *empty_delta_v_m_s (may be NULL) is what it gives with
 * no payload. */
gboolean sw_parallel_payload (const SwParallelVehicle *v, double delta_v_m_s, double *payload_kg,
                              double *empty_delta_v_m_s);

/* The payload with which the vehicle, sized by sw_size_parallel() for
 * @delta_v_m_s with @split, weighs @liftoff_mass_kg at liftoff: GSL's Brent
 * root, bracketed by steps of 25 % from @guess_kg (> 0).  Not linear in the
 * payload with boosters: their thrust is absolute, so their burn time and
 * the core's share of phase 0 do not scale with the vehicle.  FALSE (and
 * NAN) when no payload gives that mass. */
gboolean sw_parallel_payload_at_mass (const SwParallelVehicle *v, double delta_v_m_s,
                                      SwSplitMode split, double liftoff_mass_kg,
                                      double guess_kg, double *payload_kg);

G_END_DECLS
