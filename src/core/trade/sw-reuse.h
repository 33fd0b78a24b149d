/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-reuse.h: a first stage recovered by landing downrange or by returning
 * to the launch site (method as formulated in the project's reference notes;
 * default delta-v and fractions from memory).
 *
 * The recovered stage keeps propellant for its return, m_rec = m_dry
 * (exp(dv_rec / c) - 1), with m_dry its landed dry mass (structure and
 * landing hardware, h times the structure) and c its vacuum exhaust velocity.
 * For the ascent the recovery propellant and the landing hardware are inert:
 * the stage's structural coefficient rises to eps' with
 *   eps' / (1 - eps') = eps / (1 - eps) (1 + h) exp(dv_rec / c),
 * and the vehicle is sized again with it (the split re-optimised).  The
 * payload penalty is stated two ways: the same liftoff mass re-optimised
 * (sizing is linear in the payload, so payload scales with 1 / liftoff mass),
 * and the expendable vehicle's own tanks flown with recovery (the recovery
 * propellant taken from the first stage's load). */
#pragma once

#include "sw-booster-sizing.h"
#include "sw-design.h"
#include "sw-sizing.h"
#include "sw-types.h"

G_BEGIN_DECLS

typedef struct {
  SwRecoveryMode mode;
  double delta_v_m_s;                  /* recovery delta-v */
  double exhaust_velocity_m_s;         /* of the first stage */
  double propellant_ratio;             /* m_rec / m_dry */
  double eps_expendable;
  double eps_effective;                /* with recovery propellant and hardware */
  SwSizing expendable;
  SwSizing reusable;                   /* same payload, split re-optimised */
  double first_stage_dry_kg;           /* reusable: structure and landing hardware */
  double landing_hardware_kg;
  double recovery_propellant_kg;
  double liftoff_mass_increase;        /* reusable / expendable - 1 */
  double payload_same_liftoff_kg;      /* reusable vehicle at the expendable liftoff mass */
  double payload_penalty_fraction;     /* 1 - that / payload */
  double payload_same_tanks_kg;        /* the expendable vehicle flown with recovery */
} SwReuse;

/* m_rec / m_dry = exp(dv / c) - 1. */
double   sw_reuse_propellant_ratio (double delta_v_m_s, double exhaust_velocity_m_s);
/* eps' of the recovered stage. */
double   sw_reuse_effective_eps (double eps, double hardware_fraction, double delta_v_m_s,
                                 double exhaust_velocity_m_s);

/* The recovery of stage 0 of @set (sized for @payload_kg to @delta_v_m_s),
 * with @mode (SW_RECOVERY_NONE gives the expendable figures twice) and the
 * design's recovery keys.  FALSE when either vehicle is infeasible (the
 * sizings still filled in). */
gboolean sw_reuse_compute (const SwStageSet *set, double payload_kg, double delta_v_m_s,
                           SwSplitMode split, const SwEconomics *econ, SwRecoveryMode mode,
                           SwReuse *out);

/* The same for a vehicle with strap-on boosters (sw_size_parallel): the
 * core (stage 0) is recovered, the boosters are expended.  The payload at
 * the expendable liftoff mass is the root of the sizing (Brent), not the
 * linear ratio; payload_same_tanks_kg is not computed (NAN). */
gboolean sw_reuse_compute_parallel (const SwParallelVehicle *v, double payload_kg,
                                    double delta_v_m_s, SwSplitMode split,
                                    const SwEconomics *econ, SwRecoveryMode mode,
                                    SwReuse *out);

G_END_DECLS
