/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-sizing.h: Tsiolkovsky sizing, top-down from the payload, with the equal,
 * manual and optimal (Lagrange multiplier) delta-v splits. */
#pragma once

#include "sw-design.h"
#include "sw-types.h"

G_BEGIN_DECLS

#define SW_REASON_MAX 256

/* The fairing in the sizing.  The fairing is mass that the stages below
 * its jettison carry: every stage that fires before the jettison stage
 * carries it through its whole burn, and the jettison stage carries it for
 * the first @fraction of its propellant (0: dropped at its ignition, 1: at
 * its burnout).  Without a flown ascent the sizing assumes the default of
 * sw_fairing_carry_default (); the closed loop takes the jettison point
 * from its flown ascent (README, "The fairing in the sizing"). */
typedef struct {
  double mass_kg;               /* 0: no fairing */
  guint  stage;                 /* index of the stage during whose burn it is dropped */
  double fraction;              /* of that stage's propellant burnt with it, 0..1 */
} SwFairingCarry;

struct _SwStageResult {
  double delta_v_m_s;
  double delta_v_share;
  double exhaust_velocity_m_s;  /* c = Isp_vac g0 */
  double delta_v_limit_m_s;     /* c ln(1/eps); a fixed stage's: its own load, no payload */
  double mass_ratio;            /* n = m_initial / m_burnout; for the stage that drops the
                                 * fairing during its burn, exp(delta-v / c) */
  double propellant_mass_kg;
  double structural_mass_kg;
  double stage_mass_kg;         /* propellant + structure */
  double payload_mass_kg;       /* everything above this stage */
  double initial_mass_kg;       /* at ignition, everything above included (the fairing
                                 * while it is carried) */
  double burnout_mass_kg;       /* the fairing included below its jettison stage */
  gboolean feasible;
  gboolean unused;              /* optimal split gave it no delta-v */
  gboolean fixed;               /* a fixed propellant load: not sized */
};

/* The strap-on boosters of a sizing (sw-booster-sizing.h); present FALSE
 * without boosters.  Masses per booster unless named total. */
typedef struct {
  gboolean present;
  guint    count;
  gboolean fixed;                  /* a fixed load per booster (not sized) */
  gboolean crossfeed;
  double   exhaust_velocity_m_s;   /* the boosters' c = Isp_vac g0 */
  double   propellant_mass_kg;     /* per booster */
  double   structural_mass_kg;     /* per booster */
  double   booster_mass_kg;        /* per booster: propellant + structure */
  double   total_mass_kg;          /* all boosters */
  double   thrust_vac_n;           /* per booster */
  double   core_thrust_vac_n;      /* the core's (stage 0's), vacuum */
  double   mass_flow_kg_s;         /* per booster: F_b / c_b */
  double   core_mass_flow_kg_s;    /* the core's: F / c */
  /* phase 0: boosters and core together */
  double   mixed_exhaust_velocity_m_s;   /* sum F / sum mdot */
  double   phase_delta_v_m_s;
  double   phase_initial_mass_kg;  /* liftoff */
  double   phase_final_mass_kg;    /* at booster burnout, before the boosters drop */
  double   phase_duration_s;
  double   core_propellant_in_phase_kg;  /* core propellant burnt in phase 0 (0 with crossfeed) */
  /* the core's own phase, after the boosters drop */
  double   core_phase_delta_v_m_s;
  double   core_phase_initial_mass_kg;
  double   core_phase_duration_s;
  /* A fairing the core drops (SwFairingCarry stage 0): 1 in phase 0, 2 in
   * the core's own phase, 0 none (dropped above the core, or no fairing).
   * The phases' masses above are the vehicle's, the fairing included while
   * it is on; drop_mass the vehicle's mass just before it drops. */
  guint    fairing_phase;
  double   fairing_mass_kg;
  double   fairing_drop_mass_kg;
  /* Sized boosters that the optimum gives no propellant (the vehicle is
   * as light or lighter without them): the sizing is then infeasible with
   * a reason that says so, since a vehicle whose boosters carry nothing is
   * not a vehicle with boosters; without_liftoff_mass_kg is the same
   * vehicle sized without them (NAN otherwise). */
  gboolean optimised_away;
  double   without_liftoff_mass_kg;
} SwBoosterResult;

struct _SwSizing {
  gboolean feasible;
  char     reason[SW_REASON_MAX];  /* "" when feasible */
  int      infeasible_stage;       /* index of the stage that fails, or -1 */
  SwSplitMode split;
  double   liftoff_mass_kg;        /* NAN when infeasible */
  double   payload_kg;
  double   payload_fraction;
  double   delta_v_m_s;
  /* The stages' delta-v limit with no payload, the sum of the stages'
   * own (SwStageResult): a sized stage's is c ln(1/eps), a fixed stage's
   * the rocket equation on its own load with only the fixed stages (and the
   * fairing) above it; with every stage sized the sum of c_i ln(1/eps_i).
   * With boosters the core's counts them when its load is fixed
   * (sw-booster-sizing.c, parallel_limit ()). */
  double   delta_v_limit_m_s;
  double   margin_m_s;             /* the headroom: limit - delta_v, always */
  /* The delta-v the stages give with this payload: the requirement, or
   * more when every stage is fixed; NAN when infeasible. */
  double   delta_v_given_m_s;
  double   multiplier_s_m;         /* Lagrange multiplier eta (s/m); NAN unless optimal */
  guint    n_unused;               /* stages given no delta-v by the optimum */
  guint    n_fixed;                /* stages with a fixed propellant load */
  guint    n_stages;
  SwFairingCarry fairing;          /* how the sizing carried the fairing (mass 0: none) */
  SwStageResult stages[SW_MAX_STAGES];
  /* With boosters stage 0 is the core: its delta-v is that of phase 0 and
   * of its own phase together, its initial mass the liftoff mass (boosters
   * included), its mass ratio liftoff over core burnout. */
  SwBoosterResult boosters;
};

/* The stage inputs of one sizing, in firing order. */
typedef struct {
  guint  n_stages;
  double exhaust_velocity_m_s[SW_MAX_STAGES];
  double structural_coefficient[SW_MAX_STAGES];
  double share[SW_MAX_STAGES];      /* manual split only */
  SwFairingCarry fairing;           /* mass 0: none (sw_stage_set_from_design fills it) */
} SwStageSet;

/* The design's fairing with the default jettison point: dropped at the
 * ignition of the second stage (carried by the first stage's whole burn;
 * common practice: fairings are dropped early in the second stage's burn,
 * once the heating allows), or, on a one-stage vehicle, carried to burnout;
 * or where the design's working copy says a flown ascent dropped it
 * (design->ascent.has_flown_fairing, set by the closed loop). */
void     sw_fairing_carry_default (const SwDesign *design, guint n_stages, SwFairingCarry *out);

void     sw_stage_set_from_design (SwStageSet *set, const SwDesign *design);
/* The hypothetical @n_stages vehicle of the stage-count trade: stage k takes
 * the parameters of the design's stage min(k, n_design). */
void     sw_stage_set_extend (SwStageSet *set, const SwDesign *design, guint n_stages);

/* Size the vehicle.  Never fails: an infeasible vehicle is an answer. */
void     sw_size (const SwStageSet *set, double payload_kg, double delta_v_m_s,
                  SwSplitMode split, SwSizing *out);

/* Size a vehicle in which some stages carry a fixed propellant load:
 * @fixed_propellant_kg[i] > 0 fixes stage i's load (its structure is
 * load eps / (1 - eps)); 0 or NAN sizes it.  Sizing runs top-down: a fixed
 * stage gives the delta-v of the rocket equation with everything above it as
 * its payload, and the rest of @delta_v_m_s is split among the sized stages:
 *   equal    the same delta-v for every sized stage;
 *   manual   the sized stages' shares (they add up to 1 over the sized
 *            stages; a fixed stage's share is ignored);
 *   optimal  the Lagrange optimum of the sized stages for the delta-v they
 *            give together.  This is the minimum liftoff mass when every
 *            fixed stage sits above every sized one (the sized stages then
 *            carry a fixed payload); with a fixed stage below a sized one it
 *            is the sized stages' own optimum, not the vehicle's.
 * The sized stages' delta-v D solves D + sum of the fixed stages' delta-v(D)
 * = @delta_v_m_s (a scan from D = 0, then Brent's method, GSL; with every
 * fixed stage above every sized one the fixed stages' delta-v does not depend
 * on D, and D is the rest directly).  Fixed stages
 * that alone give more than @delta_v_m_s with the sized stages empty, or a
 * vehicle that never reaches it, are infeasible answers with a reason.  With
 * every stage fixed the vehicle is feasible when it reaches @delta_v_m_s;
 * each stage's delta-v is then what it gives (their sum may exceed the
 * requirement: the margin is in margin_m_s).  Without a fixed stage this is
 * sw_size(), bit for bit. */
void     sw_size_with_fixed (const SwStageSet *set, const double *fixed_propellant_kg,
                             double payload_kg, double delta_v_m_s, SwSplitMode split,
                             SwSizing *out);

/* The design's own sizing (required delta-v from its mission; the stages'
 * propellant_kg as fixed loads; with boosters sw_size_parallel(), see
 * sw-booster-sizing.h, where this is defined). */
gboolean sw_size_design (const SwDesign *design, SwSizing *out, GError **error);
/* The same for the serial stages alone (the boosters ignored). */
gboolean sw_size_design_serial (const SwDesign *design, SwSizing *out, GError **error);
/* The serial sizing with the fairing dropped in stage @fairing_stage after
 * @fairing_fraction of its propellant (the flown jettison point); the
 * serial sizing above takes the default jettison point (SwFairingCarry). */
gboolean sw_size_design_fairing (const SwDesign *design, guint fairing_stage,
                                 double fairing_fraction, SwSizing *out, GError **error);

/* The delta-v share of each stage in @sizing, into @shares (SW_MAX_STAGES
 * values): the split on screen, for sw_design_take_manual_shares ().  A
 * stage with a fixed load gets 0 (the manual split is among the sized ones).
 * Returns the stage count, or 0 when the sizing has no usable split (no
 * delta-v, a share not finite or negative). */
guint    sw_sizing_get_shares (const SwSizing *sizing, double *shares);

/* Optimal split only: the delta-v of each stage and the multiplier. */
gboolean sw_optimal_split (const SwStageSet *set, double delta_v_m_s,
                           double *stage_delta_v, double *multiplier_s_m);

/* Liftoff mass for given per-stage delta-v (no feasibility text), NAN when a
 * stage cannot deliver its share; the set's fairing included.  Used by the
 * Monte Carlo, tests and the minimiser check. */
double   sw_liftoff_mass_for_split (const SwStageSet *set, double payload_kg,
                                    const double *stage_delta_v);

/* Structural coefficient conversions. */
double   sw_eps_to_form (double eps, SwEpsForm form);
double   sw_eps_from_form (double value, SwEpsForm form);
/* Valid range of the value in @form for eps in [eps_min, eps_max]. */
void     sw_eps_form_range (SwEpsForm form, double eps_min, double eps_max,
                            double *lo, double *hi);
const char *sw_eps_form_to_string (SwEpsForm form);

G_END_DECLS
