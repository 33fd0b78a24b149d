/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-ascent.h: a 2-D point-mass ascent over a spherical, rotating Earth in
 * the orbit plane, with staging, coasts, the fairing drop and guidance solved
 * for the target circular orbit; and the closed loop between sizing and the
 * simulated losses.
 *
 * The losses and the budget.  sw-budget.c asks for the delta-v
 *     required = ideal + losses,  ideal = |v_orbit - v_site|   (vector difference),
 * and sizing turns "required" into stage masses by the rocket equation.  So the
 * losses here are defined the same way:
 *     losses = (rocket-equation delta-v the SIZED vehicle must carry to just
 *               reach the orbit in the simulation) - ideal.
 * The rocket-equation delta-v is computed with the sized masses, the fairing
 * where the sizing carries it (sw-sizing.h, SwFairingCarry):
 * the full sized delta-v of every stage burnt out, plus c ln(m_ignition /
 * m_cutoff) of the stage that cuts off, plus the cost of cancelling the site's
 * velocity across the orbit plane (the 2-D model flies in the plane; that
 * cost is part of the budget's ideal delta-v, so it is reserved from the last
 * stage as an impulsive equivalent).  A vehicle sized for the allowance L then
 * reaches the orbit exactly when losses <= L; the difference is its margin or
 * the delta-v it misses.  The breakdown adds up to the losses:
 *     losses = gravity + drag + steering + pressure + fairing + raising + other
 * following the usual definitions of the loss integrals (gravity loss the
 * integral of g sin(gamma) with gamma the flight-path angle, drag loss the
 * integral of D/m: Curtis, Orbital Mechanics for Engineering Students,
 * ch. 11; from memory), with the budget's ideal delta-v the speed change
 * |v_orbit - v_site|, so that ideal + losses is what the engines must give:
 *   gravity   integral of g sin(gamma) dt, gamma the INERTIAL flight-path angle
 *             (gravity_loss_air_m_s: the same with gamma relative to the air)
 *   drag      integral of D / m dt
 *   steering  integral of (T / m)(1 - cos alpha) dt, alpha between thrust and air velocity
 *   pressure  integral of (T_vac - T) / m dt, the back-pressure thrust deficit
 *   fairing   the rocket-equation delta-v lost to carrying the fairing longer than the
 *             sizing assumed (negative: dropped earlier); 0 when the flight drops it where
 *             the sizing does
 *   raising   with a transfer (ascent.insertion_altitude_km): the cutoff speed above
 *             the target's circular speed plus the circularisation burn at apogee
 *             (impulsive); 0 for direct insertion
 *   other     rotation_term_m_s, the turning atmosphere: thrust and drag are
 *             measured against the air but gravity against the inertial velocity,
 *             integral of (T/m)(cos alpha_air - cos alpha_inertial)
 *             - (D/m)(1 - cos(angle between air and inertial velocity)) dt; early in
 *             the flight the inertial velocity is the site's, horizontal, while the
 *             vehicle climbs vertically through the air, so this term is large
 *             (several hundred m/s) and the inertial gravity loss correspondingly
 *             smaller than the air-relative one.  On a retrograde azimuth it also
 *             holds -2 |v_site,in-plane|: the ideal delta-v counts the reversal of
 *             the site's backward speed, which the flown integrals count again.  Newton's law along the inertial
 *             velocity makes the sum exact; the rest of other is the cutoff's and
 *             the integrator's residual (below 0.05 m/s).
 * The rotation gain is the budget's: v_circular - ideal. */
#pragma once

#include <gio/gio.h>

#include "sw-design.h"
#include "sw-sizing.h"
#include "sw-types.h"

G_BEGIN_DECLS

/* When guidance takes over at staging, the attitude turns from the stage
 * below's to the guidance law's at this rate, not at once. */
#define SW_ASCENT_PITCH_RATE_DEG_S 2.0

typedef enum {
  SW_GRAVITY_INVERSE_SQUARE,   /* mu / r^2 (default) */
  SW_GRAVITY_CONSTANT,         /* g0 everywhere, for checks */
  SW_GRAVITY_NONE,
} SwGravityModel;

typedef enum {
  SW_STEERING_GUIDED,          /* vertical rise, pitch-over, gravity turn, then the
                                * linear-tangent law solved for the orbit (default) */
  SW_STEERING_VERTICAL,        /* thrust along the local vertical, all stages burnt out */
  SW_STEERING_PROGRADE,        /* thrust along the inertial velocity, all stages burnt out */
} SwSteeringMode;

typedef struct {
  SwGravityModel gravity;
  gboolean       atmosphere;         /* drag and back-pressure (default TRUE) */
  gboolean       rotation;           /* the Earth turns (default TRUE) */
  SwSteeringMode steering;
  gboolean       record;             /* keep the time series (default TRUE) */
  double         sample_interval_s;  /* longest spacing of recorded samples (default 1 s) */
  double         rtol;               /* relative tolerance of the integrator (default 1e-8) */
} SwAscentOptions;

typedef enum {
  SW_ASCENT_REACHED,           /* the target orbit is reached */
  SW_ASCENT_SHORT,             /* steering found, but delta_v_missing_m_s is lacking */
  SW_ASCENT_NO_SOLUTION,       /* no liftoff, or no steering reaches the orbit: see reason */
  SW_ASCENT_NOT_SIMULATED,     /* the sizing is infeasible: see reason */
  SW_ASCENT_UNGUIDED,          /* vertical or prograde check flight, burnt to depletion */
} SwAscentStatus;

/* One recorded point of the flight. */
typedef struct {
  double time_s;
  double altitude_m;
  double downrange_m;          /* along the surface */
  double speed_m_s;            /* inertial */
  double air_speed_m_s;        /* relative to the turning atmosphere */
  double flight_path_deg;      /* inertial velocity above the local horizontal (90 on
                                * the pad) */
  double dynamic_pressure_pa;
  double mach;
  double pitch_deg;            /* the thrust's pitch above the local horizontal */
  double axial_accel_g;        /* sensed along the vehicle's axis, thrust less drag, in g0;
                                * in coasts the drag's deceleration (negative) */
  double mass_kg;
  double thrust_n;
  guint  stage;                /* index of the stage at the bottom of the stack */
  gboolean beyond_load;        /* flown on propellant the last stage does not carry
                                * (a "short" result measures its shortfall so) */
} SwAscentSample;

/* The state at an event. */
typedef struct {
  double time_s;
  double altitude_m;
  double downrange_m;
  double speed_m_s;
  double air_speed_m_s;
  double flight_path_deg;
  double dynamic_pressure_pa;
  double mass_kg;
} SwAscentPoint;

typedef struct {
  gboolean fires;                    /* FALSE: the sizing gave it no propellant */
  gboolean flown;                    /* it ignited in the simulation */
  double   thrust_vac_n;
  double   thrust_sl_n;              /* at sea-level pressure; NAN without isp_sl_s */
  double   mass_flow_kg_s;
  double   burn_time_s;              /* propellant / mass flow, the full load */
  double   burn_time_flown_s;        /* to burnout or cutoff */
  double   coast_s;                  /* coast before ignition */
  double   ignition_mass_kg;         /* the fairing included while it is carried */
  double   ignition_thrust_to_weight;/* thrust at the ambient pressure / (m g0) */
  double   burnout_thrust_to_weight;
  double   propellant_left_kg;       /* at cutoff; 0 when burnt out */
  SwAscentPoint ignition;
  SwAscentPoint burnout;             /* burnout, or cutoff for the stage that cuts off */
} SwAscentStage;

#define SW_ASCENT_REASON_MAX 768
#define SW_ASCENT_MAX_KNOTS 4

/* The optimised steering (sw_ascent_optimise_steering): direct shooting
 * over the pitch kick and the offsets of tan(pitch) at knots inside the
 * guided flight (one at each upper stage's ignition after the first guided
 * one; one halfway when a single stage is guided), the two linear-tangent
 * angles solved for the orbit at every trial; GSL's Nelder-Mead simplex
 * minimises the delta-v needed (the propellant used to reach the orbit).
 * The user's q-alpha limit (ascent.max_q_alpha_kpa_deg) holds as in every
 * flight (the attitude is clamped to it). */
typedef struct {
  gboolean done;                 /* it ran (the guided ascent flew) */
  gboolean improved;             /* saving_m_s > 0.1 m/s */
  double   guided_needed_m_s;    /* the guided law's delta-v needed */
  double   needed_m_s;           /* the optimised steering's */
  double   saving_m_s;           /* guided - optimised */
  double   kick_deg;
  guint    n_knots;
  double   knot_time_fraction[SW_ASCENT_MAX_KNOTS];
  double   knot_tan_offset[SW_ASCENT_MAX_KNOTS];
  double   perigee_km;           /* the optimised flight's orbit */
  double   apogee_km;
  double   cutoff_flight_path_deg;
  double   max_q_alpha_kpa_deg;
  double   max_q_alpha_guided_kpa_deg;  /* after guidance starts, where the limit holds */
  guint    evaluations;          /* steering solves of the simplex */
  guint    flights;
} SwAscentOptimised;
#define SW_ASCENT_LOOP_MAX 24

typedef struct _SwAscentResult SwAscentResult;

struct _SwAscentResult {
  SwAscentStatus status;
  gboolean reached_orbit;
  char     reason[SW_ASCENT_REASON_MAX];   /* why not reached, or "" */
  char     notes[SW_ASCENT_REASON_MAX];    /* warnings that do not stop the answer */

  /* target and budget */
  double target_altitude_km;
  double circular_velocity_m_s;
  double launch_azimuth_deg;
  double ideal_delta_v_m_s;          /* the budget's |v_orbit - v_site| */
  double rotation_gain_m_s;          /* v_circular - ideal, the budget's */

  /* the orbit reached: at cutoff (after the circularisation burn when there
   * is a transfer), or at the last real burnout when short */
  double perigee_km;                 /* NAN when no orbit (escape) */
  double apogee_km;
  SwAscentPoint cutoff;
  /* transfer profile (ascent.insertion_altitude_km); NAN for direct insertion */
  double insertion_altitude_km;
  double transfer_perigee_km;        /* the orbit at cutoff */
  double transfer_apogee_km;
  double circularization_m_s;        /* the apogee burn, impulsive */
  double circularization_time_s;     /* half a transfer orbit after cutoff */

  /* delta-v accounting, m/s (see the header comment) */
  double losses_m_s;
  double gravity_loss_m_s;           /* integral of g sin(gamma), gamma inertial */
  double gravity_loss_air_m_s;       /* the same with gamma relative to the air (secondary) */
  double drag_loss_m_s;
  double steering_loss_m_s;
  double pressure_loss_m_s;
  double fairing_loss_m_s;
  double raising_loss_m_s;
  double other_loss_m_s;             /* rotation_term_m_s plus the cutoff residual */
  double rotation_term_m_s;          /* part of other: the turning atmosphere (sw-ascent.h) */
  double engines_delta_v_m_s;        /* integral of T_vac / m: what the engines gave */
  double delta_v_needed_m_s;         /* ideal + losses */
  double sized_delta_v_m_s;          /* what the sizing gave the vehicle */
  double delta_v_margin_m_s;         /* sized - needed: > 0 spare, < 0 missing */
  double delta_v_missing_m_s;        /* max(0, -margin) */
  double propellant_beyond_load_kg;  /* a short flight reaches its cutoff burning this much
                                      * propellant beyond the last stage's load (0: none) */

  /* loads */
  double max_q_pa;
  double max_q_time_s;
  double max_q_altitude_m;
  double max_axial_g;
  double max_axial_g_time_s;
  double max_q_alpha_kpa_deg;        /* dynamic pressure times angle of attack, powered flight */
  double liftoff_thrust_to_weight;

  /* fairing */
  double   fairing_mass_kg;
  gboolean fairing_dropped;
  SwAscentPoint fairing;
  gboolean boosters_dropped;       /* strap-on boosters, dropped at their burnout */
  SwAscentPoint boosters;
  guint    fairing_stage;                /* the stage burning (or about to) at the drop */
  double   fairing_propellant_fraction;  /* of its propellant burnt by then; NAN: not dropped */

  /* guidance */
  double   pitch_over_time_s;
  double   pitch_kick_deg;
  gboolean pitch_kick_solved;        /* chosen by the minimiser (no pitch_kick_deg key) */
  double   guidance_start_s;
  double   steering_start_deg;       /* linear tangent: pitch at the start ... */
  double   steering_end_deg;         /* ... and at the nominal end of the last burn */
  guint    guidance_iterations;      /* trajectory simulations spent */

  /* optimised steering (filled by sw_ascent_optimise_steering; done FALSE
   * until then) */
  SwAscentOptimised optimised;

  /* the vehicle flown */
  SwSizing sizing;
  guint    n_stages;
  SwAscentStage stages[SW_MAX_STAGES];

  /* the closed loop (loss_model "simulate") */
  gboolean closed_loop;
  gboolean loop_converged;
  guint    loop_iterations;
  double   loop_losses_m_s[SW_ASCENT_LOOP_MAX];      /* losses the sizing used, per iteration */
  double   loop_liftoff_mass_kg[SW_ASCENT_LOOP_MAX];
  double   loop_sized_losses_m_s;                    /* the losses of the final sizing */

  /* final state, inertial polar coordinates in the orbit plane (for checks) */
  double final_time_s;
  double final_radius_m;
  double final_downrange_m;
  double final_radial_velocity_m_s;
  double final_horizontal_velocity_m_s;
  double final_mass_kg;

  GArray *samples;                   /* SwAscentSample; empty unless options->record */
};

void sw_ascent_options_init (SwAscentOptions *options);

/* Make @design (a working copy) the closed loop's vehicle: the losses it
 * was sized with and its fairing jettison point (sw-sizing.h).  Sizing the
 * copy then gives loop->sizing. */
void sw_ascent_apply_loop (SwDesign *design, const SwAscentResult *loop);

/* Optimises the steering of the vehicle of @result (a guided ascent of
 * @design that reached the cutoff: status reached or short) and fills
 * result->optimised.  Slow (hundreds of trial flights): a later phase, on
 * demand.  FALSE with @error when cancelled; TRUE with optimised.done FALSE
 * when there is nothing to optimise (no guided flight). */
gboolean sw_ascent_optimise_steering (const SwDesign *design, SwAscentResult *result,
                                      GCancellable *cancellable, GError **error);

/* The mass at liftoff of the vehicle flown: the sizing's liftoff mass, which
 * includes the fairing (sw-sizing.h, SwFairingCarry); for a sizing made
 * without it, the fairing is added. */
double sw_ascent_liftoff_mass (const SwAscentResult *result);

/* Checks that the design has what the simulation needs (thrust on every
 * stage that fires, sea-level Isp and diameter on the first, an orbit
 * mission); the error names the keys. */
gboolean sw_ascent_check_inputs (const SwDesign *design, GError **error);

/* Per-stage figures without a simulation, for the stack view: thrust, mass
 * flow, burn time and thrust-to-weight at ignition from the sized masses
 * (first stage: sea-level thrust, with the fairing; upper stages: vacuum
 * thrust, without it).  @out has room for SW_MAX_STAGES. */
gboolean sw_ascent_stage_figures (const SwDesign *design, const SwSizing *sizing,
                                  SwAscentStage *out, GError **error);

/* One ascent of the vehicle sized for @design's own required delta-v (the
 * losses_m_s allowance).  NULL with an error for missing keys or when
 * cancelled (G_IO_ERROR_CANCELLED); an infeasible vehicle is a result. */
SwAscentResult *sw_ascent_solve (const SwDesign *design, const SwAscentOptions *options,
                                 GCancellable *cancellable, GError **error);

/* The closed loop: size with a first guess of the losses (losses_m_s, or
 * 1500 m/s), simulate, resize with the simulated losses, until the required
 * delta-v settles within 1 m/s; or report why it does not. */
SwAscentResult *sw_ascent_close_loop (const SwDesign *design, const SwAscentOptions *options,
                                      GCancellable *cancellable, GError **error);

/* What the GUI calls on its solver thread: the closed loop for
 * "loss_model": "simulate", otherwise one ascent with the allowance.
 * Default options, time series recorded. */
SwAscentResult *sw_ascent_fly_design (const SwDesign *design, GCancellable *cancellable,
                                      GError **error);

/* An unpowered point mass from a state, until @duration_s or the ground: for
 * checks of the integrator and the drag model.  @area_m2 0 means no drag;
 * @aero (may be NULL) gives the drag table. */
SwAscentResult *sw_ascent_coast (double mass_kg, double area_m2, const SwStagePropulsion *aero,
                                 double altitude_m, double radial_velocity_m_s,
                                 double horizontal_velocity_m_s, double duration_s,
                                 const SwAscentOptions *options, GError **error);

const char *sw_ascent_status_to_string (SwAscentStatus status);

SwAscentResult *sw_ascent_result_new (void);
void            sw_ascent_result_free (SwAscentResult *result);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (SwAscentResult, sw_ascent_result_free)

G_END_DECLS
