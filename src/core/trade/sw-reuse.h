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
 * propellant taken from the first stage's load).
 *
 * Strap-on boosters (sw_reuse_compute_parallel) are recovered when the
 * design's economics say so ("booster_mode", SwEconomics), by the same
 * formula on each booster's own dry mass and exhaust velocity, with their
 * own recovery delta-v and the first stage's landing hardware fraction:
 * the boosters' structural coefficient rises as the stage's does, and the
 * parallel vehicle is sized again (booster loads and split re-optimised). */
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
  /* The strap-on boosters, per booster (sw_reuse_compute_parallel with
   * boosters; expended, booster_mode NONE, no recovery propellant or
   * hardware; without boosters NONE and the masses NAN). */
  SwRecoveryMode booster_mode;
  double booster_delta_v_m_s;
  double booster_exhaust_velocity_m_s;
  double booster_propellant_ratio;
  double booster_eps_expendable;
  double booster_eps_effective;
  double booster_dry_kg;               /* reusable: structure and landing hardware */
  double booster_landing_hardware_kg;
  double booster_recovery_propellant_kg;
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
 * core (stage 0) is recovered with @mode, the boosters with the economics'
 * booster_recovery_mode (expended when it is SW_RECOVERY_NONE).  The
 * payload at the expendable liftoff mass is the root of the sizing (Brent),
 * not the linear ratio; payload_same_tanks_kg is not computed (NAN). */
gboolean sw_reuse_compute_parallel (const SwParallelVehicle *v, double payload_kg,
                                    double delta_v_m_s, SwSplitMode split,
                                    const SwEconomics *econ, SwRecoveryMode mode,
                                    SwReuse *out);

G_END_DECLS
