/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-ascent-private.h: what the simulator, the guidance, the closed loop and
 * the tests share beyond the public API. */
#pragma once

#include <gsl/gsl_odeiv2.h>
#include <gsl/gsl_roots.h>

#include "sw-ascent.h"

G_BEGIN_DECLS

/* Warm start of a solve, and what the solve found (in and out). */
typedef struct {
  gboolean have_kick;      /* start the kick search from kick_rad */
  double   kick_rad;
  gboolean have_psi;
  double   psi[2];         /* linear-tangent start and end pitch, rad */
  gboolean hold_kick;      /* fly kick_rad as given (no kick search) */
} SwAscentHints;

/* One ascent of the vehicle given by @sizing (the design supplies the
 * propulsion, the mission and the ascent keys).  @hints may be NULL. */
SwAscentResult *sw_ascent_solve_sized (const SwDesign *design, const SwSizing *sizing,
                                       const SwAscentOptions *options, SwAscentHints *hints,
                                       GCancellable *cancellable, GError **error);

/* First guess of the losses when the design gives none (common practice:
 * gravity 1.0-1.5 km/s, drag and steering a few hundred m/s). */
#define SW_ASCENT_FIRST_GUESS_LOSSES 1500.0
/* The loop stops when the required delta-v changes by less than this. */
#define SW_ASCENT_LOOP_TOLERANCE 1.0

void sw_ascent_result_add_note (SwAscentResult *result, const char *format, ...)
  G_GNUC_PRINTF (2, 3);

/* ---- the flight simulator, shared by sw-ascent.c (the simulator) and
 * sw-guidance.c (the solvers around it) ------------------------------------ */

#define SW_RE SW_WGS84_A           /* the sphere of the model, as in the budget */
#define SW_DEG (G_PI / 180.0)
#define SW_NY 12                   /* the state: */
#define SW_NY_LEAN 5               /* r, downrange, vr, vt, m: all a trial flight needs */
enum { SW_Y_R, SW_Y_S, SW_Y_VR, SW_Y_VT, SW_Y_M,       /* r, downrange, vr, vt, m */
       SW_Y_LG, SW_Y_LD, SW_Y_LS, SW_Y_LP, SW_Y_LE,    /* loss integrals, engines' delta-v */
       SW_Y_LGA,                                       /* gravity loss, air-relative angle */
       SW_Y_LR };                                      /* the turning atmosphere's term */

/* How the thrust points. */
typedef enum {
  SW_STEER_VERTICAL,
  SW_STEER_KICK,                   /* tilting to the pitch kick, then held */
  SW_STEER_TURN,                   /* gravity turn: along the air velocity */
  SW_STEER_GUIDED,                 /* linear tangent */
  SW_STEER_PROGRADE,               /* along the inertial velocity (checks) */
} SwSteer;

/* How a run of the simulator ends. */
typedef enum {
  SW_OUT_CUTOFF,
  SW_OUT_IMPACT,
  SW_OUT_EXHAUSTED,
  SW_OUT_PITCH_OVER,               /* stopped there on request */
  SW_OUT_GUIDE,                    /* stopped at the start of guidance on request */
  SW_OUT_FAILED,
} SwOutcome;

typedef enum {
  SW_FAIRING_RULE_NONE,
  SW_FAIRING_RULE_ALTITUDE,
  SW_FAIRING_RULE_PRESSURE,
} SwFairingRule;

/* One piece of the flight plan: a burn or a coast of one stage. */
typedef struct {
  guint    stage;
  gboolean burning;
  gboolean is_virtual;             /* propellant the vehicle does not have: measures a shortfall */
  double   duration;
  gboolean boosters;               /* phase 0: the strap-on boosters burn beside the core */
} SwFlightSegment;

typedef struct {
  gboolean fires;
  double   m_ignition;             /* sized masses, fairing excluded */
  double   m_burnout;
  double   m_after;                /* after separation: everything above */
  double   thrust_vac;
  double   mdot;
  double   isp_vac;
  double   isp_sl;                 /* the vacuum Isp when the stage gives none */
  gboolean has_isp_sl;
  double   c;
  double   area;                   /* drag reference area while this stage is at the bottom */
  double   coast;
  double   burn_time;
  double   dv_sized;
  double   sz_fairing;             /* the fairing the sizing put on this stage at ignition */
  double   sz_fairing_burn;        /* propellant the sizing burns before dropping it */
  SwStagePropulsion aero;
} SwFlightStage;

/* The vehicle and the mission, fixed for a solve. */
typedef struct {
  SwAscentOptions opt;
  guint           n;
  SwFlightStage   st[SW_MAX_STAGES];
  guint           first;
  guint           last;
  guint           n_firing;
  SwFlightSegment seg[2 * SW_MAX_STAGES + 2];
  guint           n_seg;
  double          fairing_mass;
  SwFairingRule   fairing_rule;
  double          fairing_value;   /* m or Pa */
  double          pitch_over_speed;
  double          q_alpha_max;     /* Pa rad; 0: no limit */
  double          pitch_rate;      /* rad/s: the attitude's rate from staging to the guidance */
  double          omega_p;         /* in-plane rotation rate of the air */
  double          v0;              /* initial in-plane inertial speed */
  double          cross_cost;      /* delta-v to cancel the site's cross-plane velocity */
  gboolean        has_target;
  gboolean        has_transfer;
  double          r_cut;           /* radius of the cutoff: the target, or the transfer's perigee */
  double          r_target;
  double          e_target;
  double          v_circ;
  double          ideal;
  double          gain;
  double          azimuth_deg;
  double          sized_total;
  double          m_floor;
  /* Strap-on boosters (all of them together), burning beside stage 0 in
   * the segments marked boosters; dropped at their burnout. */
  gboolean        has_boosters;
  double          b_thrust_vac;
  double          b_isp_vac;
  double          b_isp_sl;
  double          b_mdot;
  double          b_area;          /* frontal area they add */
  double          b_dry;           /* their structure, dropped at burnout */
  double          b_c_mix;         /* phase 0's exhaust velocity (sizing) */
  double          b_dv0;           /* phase 0's sized delta-v */
  double          b_m1;            /* mass at the start of the core's own phase (sizing) */
  gboolean        fairing_sized;   /* the sizing carried the fairing (sz_fairing) */
} SwFlightModel;

/* Everything that changes along a flight: a plain struct, so a flight can be
 * resumed from a copy (the pitch-over and the start of guidance are reused
 * by every trial of the solvers). */
typedef struct {
  double        t;
  double        y[SW_NY];
  double        h;                 /* the integrator's next step */
  guint         seg;
  double        seg_end;
  SwSteer       steer;
  double        t_po;
  double        t_guide;
  double        T_guide;           /* nominal duration of the guided flight */
  gboolean      fairing_on;
  gboolean      fairing_dropped;
  guint         fairing_stage;     /* the stage at the bottom when it was dropped */
  double        fairing_fraction;  /* of that stage's propellant burnt by then */
  gboolean      pitched_over;
  SwAscentPoint fairing_pt;
  double        max_q;
  double        max_q_t;
  double        max_q_h;
  double        max_acc;
  double        max_acc_t;
  double        max_alt;           /* highest altitude so far, m */
  double        max_q_alpha;       /* Pa rad */
  double        psi_stage;         /* the attitude when guidance took over, rad */
  double        blend_s;           /* how long after it the attitude may still be turning */
  gboolean      ignited[SW_MAX_STAGES];
  gboolean      burnt[SW_MAX_STAGES];
  SwAscentPoint ign[SW_MAX_STAGES];
  SwAscentPoint bo[SW_MAX_STAGES];
  double        tw_ign[SW_MAX_STAGES];
  double        tw_bo[SW_MAX_STAGES];
  double        m_ign[SW_MAX_STAGES];
  gboolean      boosters_dropped;
  SwAscentPoint boosters_pt;       /* where they were dropped */
  gboolean      real_bo;           /* the last stage's own propellant ran out */
  double        t_real_bo;
  double        y_real_bo[SW_NY];
} SwFlightState;

/* The simulator: the model, the steering parameters, the state and GSL's
 * integrator. */
typedef struct {
  const SwFlightModel *m;
  double              kick;        /* rad */
  double              tan_s;       /* linear tangent: tan(pitch) at the start ... */
  double              tan_e;       /* ... and at the nominal end */
  double              psi_s;       /* atan (tan_s), set by sw_flight_run */
  /* The optimised steering's knots: tan(pitch) of the linear-tangent law
   * plus a piecewise-linear bump, knot_dtan[k] at knot_tau[k] (fractions of
   * the nominal guided time, increasing, inside (0, 1)); 0 knots: the
   * guided law. */
  guint               n_knots;
  double              knot_tau[SW_ASCENT_MAX_KNOTS];
  double              knot_dtan[SW_ASCENT_MAX_KNOTS];
  gboolean            stop_at_po;
  gboolean            stop_at_guide;
  gboolean            record;
  SwFlightState       f;
  gsl_odeiv2_system   sys;
  gsl_odeiv2_step    *step;
  gsl_odeiv2_control *ctl;
  gsl_odeiv2_evolve  *evo;
  /* Lean flights (the solvers' trials) integrate the state only, not the
   * loss integrals, which only the flight reported needs: the same
   * integrator on the first SW_NY_LEAN components. */
  gboolean            lean;
  gsl_odeiv2_step    *step_lean;
  gsl_odeiv2_control *ctl_lean;
  gsl_odeiv2_evolve  *evo_lean;
  /* A solver's search (sw_flight_set_coarse): the lean flights with GSL's
   * Cash-Karp 4(5) stepper, cheaper per step than the 8(9) one; its
   * error at the search's tolerance is a smooth bias, not noise. */
  gboolean            coarse;
  gsl_odeiv2_step    *step_coarse;
  gsl_root_fsolver   *root;
  GArray             *samples;
  guint               n_runs;      /* trajectories flown */
} SwFlightSim;

typedef enum { SW_BUILD_OK, SW_BUILD_ERROR, SW_BUILD_INFEASIBLE } SwBuildStatus;

/* GSL reports errors as status codes from then on (no abort). */
void          sw_ascent_gsl_errors_as_status (void);
gboolean      sw_flight_check_inputs (const SwDesign *d, gboolean need_orbit, GError **error);
/* The model of @d sized by @sz; SW_BUILD_INFEASIBLE fills @res's reason. */
SwBuildStatus sw_flight_model_build (SwFlightModel *m, const SwDesign *d, const SwSizing *sz,
                                     const SwAscentOptions *opt, SwAscentResult *res,
                                     GError **error);
void          sw_flight_init (SwFlightSim *s, const SwFlightModel *m);
void          sw_flight_clear (SwFlightSim *s);
/* Relative tolerance of the integrator (both the full and the lean one). */
void          sw_flight_set_rtol (SwFlightSim *s, double rtol);
/* Lean flights with the search's stepper (see SwFlightSim.coarse). */
void          sw_flight_set_coarse (SwFlightSim *s, gboolean coarse);
/* Lean flights leave the loss integrals (y[SW_NY_LEAN..]) untouched. */
void          sw_flight_set_lean (SwFlightSim *s, gboolean lean);
void          sw_flight_start (SwFlightSim *s, double r, double vr, double vt, double mass,
                               SwSteer steer);
SwOutcome     sw_flight_run (SwFlightSim *s);
void          sw_flight_fill_result (const SwFlightSim *s, SwOutcome out, SwAscentResult *res);
/* Rocket-equation delta-v of the sized vehicle up to state @y (see sw-ascent.h). */
double        sw_flight_sized_delta_v (const SwFlightModel *m, guint seg, const double *y,
                                       gboolean fairing_on);

/* How many times sw_ascent_fly_design() ran in this process (for tests). */
guint sw_ascent_private_design_runs (void);

G_END_DECLS
