/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-ascent"

#include "config.h"

#include "sw-ascent.h"

#include "sw-ascent-private.h"
#include "sw-format.h"
#include "sw-atmosphere.h"
#include "sw-budget.h"
#include "sw-propulsion.h"

#include <glib/gi18n-lib.h>
#include <gsl/gsl_errno.h>
#include <gsl/gsl_min.h>
#include <gsl/gsl_multiroots.h>
#include <gsl/gsl_odeiv2.h>
#include <gsl/gsl_roots.h>
#include <math.h>
#include <string.h>

/* The model.  State in the orbit plane, inertial, polar about the Earth's
 * centre: radius r, downrange s (arc along the surface), radial and
 * horizontal velocity vr and vt, mass m, and the running integrals of the
 * loss terms.  Equations of motion of a point mass:
 *     r' = vr,   s' = R vt / r,
 *     vr' = vt^2 / r - g + (T sin(psi) - D vr / V) / m,
 *     vt' = -vr vt / r   + (T cos(psi) - D (vt - w r) / V) / m,
 *     m' = -mdot,
 * psi the thrust's pitch above the local horizontal, V the speed relative to
 * the air, which turns with the Earth at the in-plane rate w = omega cos(lat)
 * sin(azimuth) (the site's velocity across the plane is not flown; its cost
 * is reserved, see sw-ascent.h).  The Earth is a sphere of the WGS 84
 * equatorial radius, as in the budget.  GSL's adaptive Runge-Kutta-Prince-
 * Dormand 8(9) integrates from event to event; an event (pitch-over, fairing
 * drop, cutoff, impact, max-Q) is located inside the step that crosses it on
 * the state re-integrated from the step's start: aimed at with the step's
 * Hermite interpolant, bracketed by Newton steps, Brent's method if need be. */


#define KICK_RAMP_S 4.0              /* the thrust tilts to the kick angle over 4 s */
#define SINGLE_STAGE_GUIDE_M 30000.0 /* a single stage is guided above 30 km */
#define IMPACT_ALTITUDE_M (-1.0)
#define VIRTUAL_FLOOR 0.05           /* extra propellant ends at 5 % of the burnout mass */
#define MAX_DIRECT_ALTITUDE_KM 2000.0
#define MAXQ_TOP_M 80000.0

typedef enum {
  EV_NONE = -1,
  EV_IMPACT,
  EV_PITCH_OVER,
  EV_ALIGN,
  EV_FAIRING,
  EV_GUIDE_START,
  EV_CUTOFF,
  EV_MAXQ,
  N_EVENTS
} EventId;

typedef struct {
  double h;
  double r;
  double vr;
  double vt;
  double v;
  double vt_rel;
  double v_rel;
  double g;
  double p;
  double rho;
  double sound;
  double mach;
  double q;
  double drag;
  double thrust;
  double thrust_vac;
  double mdot;
  double sin_psi;
  double cos_psi;
} Derived;

/* ---- physics ----------------------------------------------------------- */

static const SwFlightSegment *
current_segment (const SwFlightSim *s)
{
  return &s->m->seg[MIN (s->f.seg, s->m->n_seg - 1)];
}

/* The stepper of the lean flights: Cash-Karp 4(5) for a solver's search,
 * Prince-Dormand 8(9) otherwise. */
static gsl_odeiv2_step *
lean_step (const SwFlightSim *s)
{
  return s->coarse ? s->step_coarse : s->step_lean;
}

static void
derive (const SwFlightSim *s, double t, const double *y, Derived *d)
{
  const SwFlightModel *m = s->m;
  const SwFlightSegment *sg = current_segment (s);
  const SwFlightStage *st = &m->st[sg->stage];
  gboolean burning = sg->burning && s->f.seg < m->n_seg;

  d->r = y[SW_Y_R];
  d->h = d->r - SW_RE;
  d->vr = y[SW_Y_VR];
  d->vt = y[SW_Y_VT];
  d->v = sqrt (d->vr * d->vr + d->vt * d->vt);
  d->vt_rel = d->vt - m->omega_p * d->r;
  d->v_rel = sqrt (d->vr * d->vr + d->vt_rel * d->vt_rel);

  switch (m->opt.gravity)
    {
    case SW_GRAVITY_NONE:
      d->g = 0.0;
      break;
    case SW_GRAVITY_CONSTANT:
      d->g = SW_G0;
      break;
    case SW_GRAVITY_INVERSE_SQUARE:
    default:
      d->g = SW_WGS84_MU / (d->r * d->r);
      break;
    }

  if (m->opt.atmosphere)
    sw_atmosphere_flight (d->h, &d->p, &d->rho, &d->sound);
  else
    {
      d->p = d->rho = 0.0;
      d->sound = 340.29;
    }
  d->mach = d->v_rel / d->sound;
  d->q = 0.5 * d->rho * d->v_rel * d->v_rel;
  {
    /* With the boosters on, the cluster's frontal area (core plus boosters). */
    double area = st->area + (sg->boosters ? m->b_area : 0.0);
    d->drag = d->q > 0.0 && area > 0.0
              ? d->q * area * sw_propulsion_drag_coefficient (&st->aero, d->mach) : 0.0;
  }

  if (burning)
    {
      d->thrust_vac = st->thrust_vac;
      d->thrust = sw_propulsion_thrust_at (st->thrust_vac, st->isp_vac, st->isp_sl, d->p);
      d->mdot = st->mdot;
      if (sg->boosters)
        {
          d->thrust_vac += m->b_thrust_vac;
          d->thrust += sw_propulsion_thrust_at (m->b_thrust_vac, m->b_isp_vac, m->b_isp_sl, d->p);
          d->mdot += m->b_mdot;
        }
    }
  else
    d->thrust = d->thrust_vac = d->mdot = 0.0;

  switch (s->f.steer)
    {
    case SW_STEER_PROGRADE:
      if (d->v > 1e-9)
        {
          d->sin_psi = d->vr / d->v;
          d->cos_psi = d->vt / d->v;
          break;
        }
      /* At rest: up. */
      G_GNUC_FALLTHROUGH;
    case SW_STEER_VERTICAL:
      d->sin_psi = 1.0;
      d->cos_psi = 0.0;
      break;
    case SW_STEER_KICK:
      {
        double psi = G_PI / 2.0 - s->kick * MIN (1.0, (t - s->f.t_po) / KICK_RAMP_S);
        d->sin_psi = sin (psi);
        d->cos_psi = cos (psi);
      }
      break;
    case SW_STEER_TURN:
      if (d->v_rel > 1e-6)
        {
          d->sin_psi = d->vr / d->v_rel;
          d->cos_psi = d->vt_rel / d->v_rel;
        }
      else
        {
          d->sin_psi = 1.0;
          d->cos_psi = 0.0;
        }
      break;
    case SW_STEER_GUIDED:
    default:
      {
        /* Linear tangent: tan(psi) runs linearly in time from tan(psi_start)
         * at the start of guidance to tan(psi_end) at the nominal end of the
         * last burn (Bryson and Ho's law for a flat Earth in vacuum). */
        double tau = (t - s->f.t_guide) / s->f.T_guide;
        double tp = s->tan_s + (s->tan_e - s->tan_s) * tau;

        /* The optimised steering's bumps: hats between the neighbouring
         * knots (0 and 1 at the ends). */
        for (guint k = 0; k < s->n_knots; k++)
          {
            double a = k > 0 ? s->knot_tau[k - 1] : 0.0, c = s->knot_tau[k];
            double b = k + 1 < s->n_knots ? s->knot_tau[k + 1] : 1.0;
            if (tau > a && tau < b)
              tp += s->knot_dtan[k] * (tau <= c ? (tau - a) / (c - a) : (b - tau) / (b - c));
          }
        double dt = t - s->f.t_guide;
        double off = dt < s->f.blend_s ? s->f.psi_stage - s->psi_s : 0.0;
        gboolean blend = fabs (off) > m->pitch_rate * dt;
        gboolean limit = m->q_alpha_max > 0.0 && d->q > 0.0 && d->v_rel > 1e-6
                         && m->q_alpha_max / d->q < G_PI;

        if (!blend && !limit)
          {
            double k = 1.0 / sqrt (1.0 + tp * tp);
            d->sin_psi = tp * k;
            d->cos_psi = k;
          }
        else
          {
            double psi = atan (tp);

            /* No jump at staging: the attitude turns from the one the stage
             * below flew to the guidance law's at a limited rate. */
            if (blend)
              psi += copysign (fabs (off) - m->pitch_rate * dt, off);
            /* q alpha limit: the thrust stays within q_alpha_max / q of the
             * air velocity. */
            if (limit)
              {
                double gam = atan2 (d->vr, d->vt_rel), amax = m->q_alpha_max / d->q;
                psi = CLAMP (psi, gam - amax, gam + amax);
              }
            d->sin_psi = sin (psi);
            d->cos_psi = cos (psi);
          }
      }
      break;
    }
}

static int
rhs (double t, const double y[], double dydt[], void *params)
{
  const SwFlightSim *s = params;
  const double R = SW_RE;
  Derived d;
  double m = y[SW_Y_M];
  double sin_g, cos_a;

  derive (s, t, y, &d);
  if (!(m > 0.0) || !(d.r > 0.0))
    {
      return GSL_EBADFUNC;
    }

  dydt[SW_Y_R] = d.vr;
  dydt[SW_Y_S] = R * d.vt / d.r;
  dydt[SW_Y_VR] = d.vt * d.vt / d.r - d.g;
  dydt[SW_Y_VT] = -d.vr * d.vt / d.r;
  if (d.v_rel > 1e-9)
    {
      dydt[SW_Y_VR] -= d.drag * d.vr / d.v_rel / m;
      dydt[SW_Y_VT] -= d.drag * d.vt_rel / d.v_rel / m;
      sin_g = d.vr / d.v_rel;
      cos_a = (d.sin_psi * d.vr + d.cos_psi * d.vt_rel) / d.v_rel;
    }
  else
    {
      sin_g = 1.0;
      cos_a = d.sin_psi;
    }
  dydt[SW_Y_VR] += d.thrust * d.sin_psi / m;
  dydt[SW_Y_VT] += d.thrust * d.cos_psi / m;
  dydt[SW_Y_M] = -d.mdot;
  if (s->lean)
    return GSL_SUCCESS;
  /* Gravity loss with the inertial flight-path angle (the conventional
   * figure), and with the angle relative to the air. */
  dydt[SW_Y_LG] = d.v > 1e-9 ? d.g * d.vr / d.v : d.g;
  dydt[SW_Y_LGA] = d.g * sin_g;
  /* Thrust and drag are measured against the air, gravity against the
   * inertial velocity: what the air's turning adds (see sw-ascent.h). */
  if (d.v > 1e-9 && d.v_rel > 1e-9)
    {
      double cos_ai = (d.sin_psi * d.vr + d.cos_psi * d.vt) / d.v;
      double dot = (d.vr * d.vr + d.vt_rel * d.vt) / (d.v_rel * d.v);
      dydt[SW_Y_LR] = d.thrust / m * (cos_a - cos_ai) - d.drag / m * (1.0 - dot);
    }
  else
    dydt[SW_Y_LR] = 0.0;
  dydt[SW_Y_LD] = d.drag / m;
  dydt[SW_Y_LS] = d.thrust / m * (1.0 - cos_a);
  dydt[SW_Y_LP] = (d.thrust_vac - d.thrust) / m;
  dydt[SW_Y_LE] = d.thrust_vac / m;
  return GSL_SUCCESS;
}

static double
axial_accel_g (const Derived *d, double m)
{
  double cos_a = d->v_rel > 1e-9 ? (d->sin_psi * d->vr + d->cos_psi * d->vt_rel) / d->v_rel
                                 : 1.0;
  /* Thrust less the drag's component along the axis; in a coast only the
   * drag, a deceleration (negative). */
  return (d->thrust - d->drag * cos_a) / m / SW_G0;
}

/* The inertial flight-path angle; on the pad, at rest in the air, the
 * vehicle's own: 90 deg (its inertial velocity is the site's, which on a
 * retrograde azimuth points backwards). */
static double
flight_path_deg (const Derived *d)
{
  if (d->v_rel < 1e-6 && d->h < 1.0)
    return 90.0;
  return atan2 (d->vr, d->vt) / SW_DEG;
}

static void
point_of (const SwFlightSim *s, double t, const double *y, SwAscentPoint *pt)
{
  Derived d;

  derive (s, t, y, &d);
  pt->time_s = t;
  pt->altitude_m = d.h;
  pt->downrange_m = y[SW_Y_S];
  pt->speed_m_s = d.v;
  pt->air_speed_m_s = d.v_rel;
  pt->flight_path_deg = flight_path_deg (&d);
  pt->dynamic_pressure_pa = d.q;
  pt->mass_kg = y[SW_Y_M];
}

/* ---- events ------------------------------------------------------------ */

static gboolean
event_active (const SwFlightSim *s, EventId e)
{
  const SwFlightModel *m = s->m;
  const SwFlightSegment *sg = current_segment (s);

  switch (e)
    {
    case EV_IMPACT:
      return TRUE;
    case EV_PITCH_OVER:
      return s->f.steer == SW_STEER_VERTICAL && m->opt.steering == SW_STEERING_GUIDED
             && sg->burning;
    case EV_ALIGN:
      return s->f.steer == SW_STEER_KICK;
    case EV_FAIRING:
      return s->f.fairing_on && m->fairing_rule != SW_FAIRING_RULE_NONE;
    case EV_GUIDE_START:
      return m->opt.steering == SW_STEERING_GUIDED && m->n_firing == 1
             && s->f.steer != SW_STEER_GUIDED;
    case EV_CUTOFF:
      return m->has_target && s->f.steer == SW_STEER_GUIDED && sg->burning;
    case EV_MAXQ:
      return s->record && m->opt.atmosphere;
    case EV_NONE:
    case N_EVENTS:
    default:
      return FALSE;
    }
}

static int
event_direction (EventId e)
{
  switch (e)
    {
    case EV_PITCH_OVER:
    case EV_GUIDE_START:
    case EV_CUTOFF:
      return 1;
    case EV_FAIRING:
      return 0;   /* decided by the rule */
    case EV_IMPACT:
    case EV_ALIGN:
    case EV_MAXQ:
    default:
      return -1;
    }
}

/* Event @e's function at (t, y), from the derived quantities @dd there. */
static double
event_value_at (const SwFlightSim *s, EventId e, double t, const double *y, const Derived *dd)
{
  const SwFlightModel *m = s->m;
  const Derived d = *dd;

  switch (e)
    {
    case EV_IMPACT:
      return d.h - IMPACT_ALTITUDE_M;
    case EV_PITCH_OVER:
      return d.v_rel - m->pitch_over_speed;
    case EV_ALIGN:
      {
        double psi = G_PI / 2.0 - s->kick * MIN (1.0, (t - s->f.t_po) / KICK_RAMP_S);
        return atan2 (d.vr, d.vt_rel) - psi;
      }
    case EV_FAIRING:
      return m->fairing_rule == SW_FAIRING_RULE_ALTITUDE ? d.h - m->fairing_value
                                                 : d.q - m->fairing_value;
    case EV_GUIDE_START:
      return d.h - SINGLE_STAGE_GUIDE_M;
    case EV_CUTOFF:
      return 0.5 * d.v * d.v - SW_WGS84_MU / d.r - m->e_target;
    case EV_MAXQ:
      {
        /* dq/dt = 1/2 V^2 (drho/dh) vr + rho V dV/dt, positive while q grows. */
        double dydt[SW_NY], rho_up, rho_dn, dvtrel;
        SwAtmosphere a;

        if (d.h > MAXQ_TOP_M || d.q < 1.0)
          return -1.0;
        rhs (t, y, dydt, (void *) s);
        sw_atmosphere_at (d.h + 5.0, &a);
        rho_up = a.density_kg_m3;
        sw_atmosphere_at (d.h - 5.0, &a);
        rho_dn = a.density_kg_m3;
        dvtrel = dydt[SW_Y_VT] - m->omega_p * d.vr;
        return 0.5 * d.v_rel * d.v_rel * (rho_up - rho_dn) / 10.0 * d.vr
               + d.rho * (d.vr * dydt[SW_Y_VR] + d.vt_rel * dvtrel);
      }
    case EV_NONE:
    case N_EVENTS:
    default:
      return 0.0;
    }
}

static double
event_value (const SwFlightSim *s, EventId e, double t, const double *y)
{
  Derived d;

  derive (s, t, y, &d);
  return event_value_at (s, e, t, y, &d);
}

static gboolean
crossed (const SwFlightSim *s, EventId e, double g0, double g1)
{
  int dir = event_direction (e);

  if (e == EV_FAIRING)
    dir = s->m->fairing_rule == SW_FAIRING_RULE_ALTITUDE ? 1 : -1;
  return dir > 0 ? (g0 < 0.0 && g1 >= 0.0) : (g0 > 0.0 && g1 <= 0.0);
}

typedef struct {
  SwFlightSim *s;
  EventId e;
  double t0;
  const double *y0;
  double y[SW_NY];
  double yerr[SW_NY];
  const double *f0;                /* the derivatives at t0 (may be NULL) */
} Locate;

static void
state_after (Locate *l, double tau)
{
  memcpy (l->y, l->y0, sizeof l->y);
  if (tau > 0.0)
    gsl_odeiv2_step_apply (l->s->lean ? lean_step (l->s) : l->s->step, l->t0, tau, l->y,
                           l->yerr, l->f0, NULL, &l->s->sys);
}

static double
locate_fn (double tau, void *data)
{
  Locate *l = data;

  state_after (l, tau);
  return event_value (l->s, l->e, l->t0 + tau, l->y);
}

/* The step's cubic Hermite interpolant (the states and derivatives at both
 * ends): a cheap stand-in for the state inside the step, used only to aim
 * the integrator's own steps at the event. */
typedef struct {
  const SwFlightSim *s;
  EventId e;
  double t0;
  double dt;
  const double *y0;
  const double *y1;
  double f0[SW_NY];
  double f1[SW_NY];
  double y[SW_NY];
} Hermite;

static double
hermite_fn (double tau, void *data)
{
  Hermite *hm = data;
  double u = tau / hm->dt, v = 1.0 - u;
  double a = (1.0 + 2.0 * u) * v * v, b = u * v * v * hm->dt;
  double c = u * u * (3.0 - 2.0 * u), d = -u * u * v * hm->dt;

  for (int i = 0; i < SW_NY_LEAN; i++)
    hm->y[i] = a * hm->y0[i] + b * hm->f0[i] + c * hm->y1[i] + d * hm->f1[i];
  for (int i = SW_NY_LEAN; i < SW_NY; i++)
    hm->y[i] = hm->y0[i];
  return event_value (hm->s, hm->e, hm->t0 + tau, hm->y);
}

/* The event's rate of change along the flight at (t, y): central
 * differences over +-d s along the state's derivative there. */
static double
event_slope (SwFlightSim *s, EventId e, double t, const double *y, double d)
{
  double f[SW_NY], yp[SW_NY], ym[SW_NY];

  if (rhs (t, y, f, s) != GSL_SUCCESS)
    return NAN;
  for (int i = 0; i < SW_NY; i++)
    {
      double fi = i < (int) s->sys.dimension ? f[i] : 0.0;
      yp[i] = y[i] + d * fi;
      ym[i] = y[i] - d * fi;
    }
  return (event_value (s, e, t + d, yp) - event_value (s, e, t - d, ym)) / (2.0 * d);
}

/* The time after t0 at which event @e happens, within (0, dt]: the upper end
 * of a bracket no wider than the tolerance, so the event has just happened
 * there; @y_hi gets the state there.  @y1 is the state at t0 + dt (the step
 * the integrator took), @g0 and @g1 the event's values at both ends.
 *
 * The root is aimed at on the step's Hermite interpolant, then found with
 * the integrator's own steps from t0: Newton steps (the event's slope from
 * the derivatives at the state reached), each aimed 0.3 of the tolerance past the root, until a state past
 * the event lies within the tolerance of the root by its own Newton step
 * (usually the first); Brent's method on the integrator's steps, in the
 * bracket found so far, if that does not happen in a few steps. */
static double
locate (SwFlightSim *s, EventId e, double t0, const double *y0, const double *y1, double dt,
        double g0, double g1, double *y_hi)
{
  /* 0.1 us for the flight reported; 10 us for a solver's trial (8 cm along
   * the path at orbital speed, against its 10 m tolerance). */
  const double tol = s->lean ? 1e-5 : 1e-7;
  Hermite hm = { s, e, t0, dt, y0, y1 };
  Locate l = { s, e, t0, y0 };
  double lo = 0.0, hi = dt, x;

  memcpy (y_hi, y1, sizeof (double) * SW_NY);
  if (!crossed (s, e, g0, g1))
    return dt;
  if (rhs (t0, y0, hm.f0, s) != GSL_SUCCESS || rhs (t0 + dt, y1, hm.f1, s) != GSL_SUCCESS)
    goto brent;
  l.f0 = hm.f0;

  /* The root of the interpolant (its ends are the step's own states). */
  {
    gsl_function fn = { hermite_fn, &hm };
    double a = 0.0, b = dt;

    if (gsl_root_fsolver_set (s->root, &fn, 0.0, dt) != GSL_SUCCESS)
      goto brent;
    for (int i = 0; i < 60; i++)
      {
        if (gsl_root_fsolver_iterate (s->root) != GSL_SUCCESS)
          goto brent;
        a = gsl_root_fsolver_x_lower (s->root);
        b = gsl_root_fsolver_x_upper (s->root);
        if (gsl_root_test_interval (a, b, 0.01 * tol, 0.0) == GSL_SUCCESS)
          break;
      }
    x = 0.5 * (a + b);
  }

  /* Newton steps on the integrator's own states, each aimed 0.3 of the
   * tolerance past the root: done at a state past the event whose own
   * Newton step back to the root is shorter than the tolerance. */
  x += 0.3 * tol;
  for (int i = 0; i < 5 && hi - lo > tol; i++)
    {
      double gx, slope, back, d = MIN (1e-3, 0.25 * (hi - lo));

      if (!(x > lo && x < hi))
        x = 0.5 * (lo + hi);
      gx = locate_fn (x, &l);
      if (!isfinite (gx))
        goto brent;
      slope = event_slope (s, e, t0 + x, l.y, d);
      back = gx / slope;
      if (crossed (s, e, g0, gx))
        {
          hi = x;
          memcpy (y_hi, l.y, sizeof l.y);
          if (isfinite (back) && back >= 0.0 && back < tol)
            return hi;
        }
      else
        lo = x;
      x = x - back + 0.3 * tol;
    }
  if (hi - lo <= tol)
    return hi;

brent:
  /* Brent's method on the integrator's steps, within what is known. */
  {
    gsl_function fn = { locate_fn, &l };

    if (gsl_root_fsolver_set (s->root, &fn, lo, hi) != GSL_SUCCESS)
      return hi;
    for (int i = 0; i < 80; i++)
      {
        gsl_root_fsolver_iterate (s->root);
        lo = gsl_root_fsolver_x_lower (s->root);
        hi = gsl_root_fsolver_x_upper (s->root);
        if (gsl_root_test_interval (lo, hi, tol, 0.0) == GSL_SUCCESS)
          break;
      }
    /* Make sure the state at hi is past the event. */
    if (crossed (s, e, g0, locate_fn (hi, &l)))
      memcpy (y_hi, l.y, sizeof l.y);
    else
      {
        hi = dt;
        memcpy (y_hi, y1, sizeof (double) * SW_NY);
      }
    return hi;
  }
}

/* ---- flying ------------------------------------------------------------ */

static void
reset_integrator (SwFlightSim *s)
{
  gsl_odeiv2_evolve_reset (s->lean ? s->evo_lean : s->evo);
  gsl_odeiv2_step_reset (s->lean ? lean_step (s) : s->step);
}

static void
record_sample (SwFlightSim *s)
{
  SwAscentSample smp;
  Derived d;

  if (!s->record)
    return;
  derive (s, s->f.t, s->f.y, &d);
  smp.time_s = s->f.t;
  smp.altitude_m = d.h;
  smp.downrange_m = s->f.y[SW_Y_S];
  smp.speed_m_s = d.v;
  smp.air_speed_m_s = d.v_rel;
  smp.flight_path_deg = flight_path_deg (&d);
  smp.pitch_deg = atan2 (d.sin_psi, d.cos_psi) / SW_DEG;
  smp.dynamic_pressure_pa = d.q;
  smp.mach = d.mach;
  smp.axial_accel_g = axial_accel_g (&d, s->f.y[SW_Y_M]);
  smp.mass_kg = s->f.y[SW_Y_M];
  smp.thrust_n = d.thrust;
  smp.stage = current_segment (s)->stage;
  smp.beyond_load = current_segment (s)->is_virtual;
  g_array_append_val (s->samples, smp);
}

static void
track_derived (SwFlightSim *s, const Derived *dd)
{
  Derived d = *dd;
  double acc;

  if (current_segment (s)->is_virtual)
    return;
  s->f.max_alt = MAX (s->f.max_alt, d.h);
  if (d.thrust > 0.0 && d.v_rel > 1e-6)
    {
      double c = (d.sin_psi * d.vr + d.cos_psi * d.vt_rel) / d.v_rel;
      s->f.max_q_alpha = MAX (s->f.max_q_alpha, d.q * acos (CLAMP (c, -1.0, 1.0)));
    }
  if (d.q > s->f.max_q)
    {
      s->f.max_q = d.q;
      s->f.max_q_t = s->f.t;
      s->f.max_q_h = d.h;
    }
  acc = axial_accel_g (&d, s->f.y[SW_Y_M]);
  if (acc > s->f.max_acc)
    {
      s->f.max_acc = acc;
      s->f.max_acc_t = s->f.t;
    }
}

static void
track (SwFlightSim *s)
{
  Derived d;

  derive (s, s->f.t, s->f.y, &d);
  track_derived (s, &d);
}

/* The recorded flight: samples inside the step from (t0, y0) to (t1, y1),
 * every sample interval after t0 and before @t_stop (the step's end, or an
 * event inside it), on the step's cubic Hermite interpolant (the states and
 * the derivatives at both ends; every component, the loss integrals
 * included).  The integrator's step is then set by its tolerance alone,
 * not by the sampling (a 1 s cap made the recorded flight cost as much as
 * a dozen trial flights); the samples keep their spacing. */
static void
record_inside_step (SwFlightSim *s, double t0, const double *y0, double t1, const double *y1,
                    double t_stop)
{
  const double interval = s->m->opt.sample_interval_s;
  const double dt = t1 - t0;
  const size_t n = s->sys.dimension;
  double f0[SW_NY], f1[SW_NY], t_keep, y_keep[SW_NY], ya[SW_NY], yb[SW_NY];

  if (!(dt > 0.0) || !(t0 + interval < t_stop - 1e-9))
    return;
  /* Copies: either end may be the simulator's own state, written below. */
  memcpy (ya, y0, sizeof ya);
  memcpy (yb, y1, sizeof yb);
  y0 = ya;
  y1 = yb;
  if (rhs (t0, y0, f0, s) != GSL_SUCCESS || rhs (t1, y1, f1, s) != GSL_SUCCESS)
    return;
  t_keep = s->f.t;
  memcpy (y_keep, s->f.y, sizeof y_keep);
  for (double ts = t0 + interval; ts < t_stop - 1e-9; ts += interval)
    {
      double u = (ts - t0) / dt, v = 1.0 - u;
      double a = (1.0 + 2.0 * u) * v * v, b = u * v * v * dt;
      double c = u * u * (3.0 - 2.0 * u), d = -u * u * v * dt;

      for (size_t i = 0; i < n; i++)
        s->f.y[i] = a * y0[i] + b * f0[i] + c * y1[i] + d * f1[i];
      s->f.t = ts;
      /* The peaks that are no event (altitude, q alpha) see the samples
       * too; max-Q and the largest acceleration stay on the integrator's
       * own states and events. */
      if (!current_segment (s)->is_virtual)
        {
          Derived dd;

          derive (s, ts, s->f.y, &dd);
          s->f.max_alt = MAX (s->f.max_alt, dd.h);
          if (dd.thrust > 0.0 && dd.v_rel > 1e-6)
            {
              double cq = (dd.sin_psi * dd.vr + dd.cos_psi * dd.vt_rel) / dd.v_rel;
              s->f.max_q_alpha = MAX (s->f.max_q_alpha, dd.q * acos (CLAMP (cq, -1.0, 1.0)));
            }
        }
      record_sample (s);
    }
  s->f.t = t_keep;
  memcpy (s->f.y, y_keep, sizeof y_keep);
}

/* Integrates to @t_end or to the first event; *failed on integrator trouble. */
static EventId
advance (SwFlightSim *s, double t_end, gboolean *failed)
{
  double g_prev[N_EVENTS];
  gboolean active[N_EVENTS];

  {
    Derived d;

    derive (s, s->f.t, s->f.y, &d);
    for (int e = 0; e < N_EVENTS; e++)
      {
        active[e] = event_active (s, e);
        g_prev[e] = active[e] ? event_value_at (s, e, s->f.t, s->f.y, &d) : 0.0;
      }
  }

  while (s->f.t < t_end)
    {
      double t0 = s->f.t, y0[SW_NY], y_best[SW_NY], h = s->f.h;
      Derived dnow;
      EventId best = EV_NONE;
      double best_tau = G_MAXDOUBLE;
      int status;

      memcpy (y0, s->f.y, sizeof y0);
      status = s->lean
                 ? gsl_odeiv2_evolve_apply (s->evo_lean, s->ctl_lean, lean_step (s), &s->sys,
                                            &s->f.t, t_end, &h, s->f.y)
                 : gsl_odeiv2_evolve_apply (s->evo, s->ctl, s->step, &s->sys, &s->f.t, t_end, &h,
                                        s->f.y);
      if (status != GSL_SUCCESS || !isfinite (s->f.y[SW_Y_R]) || !isfinite (s->f.y[SW_Y_VT]))
        {
          *failed = TRUE;
          return EV_NONE;
        }
      if (s->f.t < t_end)
        s->f.h = h;

      derive (s, s->f.t, s->f.y, &dnow);
      for (int e = 0; e < N_EVENTS; e++)
        {
          double g1;

          if (!active[e])
            continue;
          g1 = event_value_at (s, e, s->f.t, s->f.y, &dnow);
          if (crossed (s, e, g_prev[e], g1))
            {
              double y_at[SW_NY];
              double tau = locate (s, e, t0, y0, s->f.y, s->f.t - t0, g_prev[e], g1, y_at);
              if (tau < best_tau)
                {
                  best_tau = tau;
                  best = e;
                  memcpy (y_best, y_at, sizeof y_best);
                }
            }
          g_prev[e] = g1;
        }
      /* Inside a step cut by an event, the interpolant ends at the event's
       * own state (the step beyond it may cross a change of the dynamics). */
      if (s->record && best != EV_NONE)
        record_inside_step (s, t0, y0, t0 + best_tau, y_best, t0 + best_tau);
      else if (s->record)
        record_inside_step (s, t0, y0, s->f.t, s->f.y, s->f.t);
      if (best != EV_NONE)
        {
          s->f.t = t0 + best_tau;
          memcpy (s->f.y, y_best, sizeof y_best);
          reset_integrator (s);
          track (s);
          return best;
        }
      track_derived (s, &dnow);
      record_sample (s);
    }
  return EV_NONE;
}

static double
thrust_to_weight (const SwFlightSim *s)
{
  Derived d;

  derive (s, s->f.t, s->f.y, &d);
  return d.thrust / (s->f.y[SW_Y_M] * SW_G0);
}

static void
start_segment (SwFlightSim *s)
{
  const SwFlightModel *m = s->m;
  const SwFlightSegment *sg;

  if (s->f.seg >= m->n_seg)
    return;
  sg = &m->seg[s->f.seg];
  s->f.seg_end = s->f.t + sg->duration;
  if (sg->burning && !sg->is_virtual && !s->f.ignited[sg->stage])
    {
      s->f.ignited[sg->stage] = TRUE;
      point_of (s, s->f.t, s->f.y, &s->f.ign[sg->stage]);
      s->f.tw_ign[sg->stage] = thrust_to_weight (s);
      s->f.m_ign[sg->stage] = s->f.y[SW_Y_M];
    }
}

/* The thrust's pitch above the local horizontal now, rad. */
static double
attitude (const SwFlightSim *s)
{
  Derived d;

  derive (s, s->f.t, s->f.y, &d);
  return atan2 (d.sin_psi, d.cos_psi);
}

static double
remaining_nominal_time (const SwFlightSim *s)
{
  const SwFlightModel *m = s->m;
  double T = 0.0;

  for (guint i = s->f.seg; i < m->n_seg; i++)
    if (!m->seg[i].is_virtual)
      T += i == s->f.seg ? s->f.seg_end - s->f.t : m->seg[i].duration;
  return MAX (T, 1.0);
}

/* Ends the current segment; returns TRUE when guidance starts here. */
static gboolean
end_segment (SwFlightSim *s)
{
  const SwFlightModel *m = s->m;
  const SwFlightSegment *sg = &m->seg[s->f.seg];
  gboolean guide = FALSE;
  guint next = s->f.seg + 1;

  if (sg->burning && !sg->is_virtual)
    {
      s->f.burnt[sg->stage] = TRUE;
      point_of (s, s->f.t, s->f.y, &s->f.bo[sg->stage]);
      s->f.tw_bo[sg->stage] = thrust_to_weight (s);
      if (next < m->n_seg && m->seg[next].is_virtual)
        {
          s->f.real_bo = TRUE;
          s->f.t_real_bo = s->f.t;
          memcpy (s->f.y_real_bo, s->f.y, sizeof s->f.y);
        }
    }
  if (sg->boosters && !sg->is_virtual)
    {
      /* The boosters burn out and drop away: their structure stays behind. */
      point_of (s, s->f.t, s->f.y, &s->f.boosters_pt);
      s->f.boosters_dropped = TRUE;
      s->f.y[SW_Y_M] -= m->b_dry;
    }
  if (next < m->n_seg && m->seg[next].stage != sg->stage)
    {
      /* Separation: the stage's structure stays behind. */
      s->f.y[SW_Y_M] = m->st[sg->stage].m_after + (s->f.fairing_on ? m->fairing_mass : 0.0);
      if (sg->stage == m->first && m->opt.steering == SW_STEERING_GUIDED)
        {
          s->f.psi_stage = attitude (s);
          s->f.blend_s = G_PI / m->pitch_rate;
          s->f.steer = SW_STEER_GUIDED;
          s->f.t_guide = s->f.t;
          guide = TRUE;
        }
    }
  s->f.seg = next;
  start_segment (s);
  if (guide)
    s->f.T_guide = remaining_nominal_time (s);
  reset_integrator (s);
  record_sample (s);
  return guide;
}

SwOutcome
sw_flight_run (SwFlightSim *s)
{
  const SwFlightModel *m = s->m;

  s->n_runs++;
  s->psi_s = atan (s->tan_s);
  reset_integrator (s);
  for (;;)
    {
      gboolean failed = FALSE;
      EventId e;

      if (s->f.seg >= m->n_seg)
        return SW_OUT_EXHAUSTED;
      e = advance (s, s->f.seg_end, &failed);
      if (failed)
        return SW_OUT_FAILED;
      switch (e)
        {
        case EV_NONE:
          if (end_segment (s) && s->stop_at_guide)
            return SW_OUT_GUIDE;
          continue;
        case EV_IMPACT:
          return SW_OUT_IMPACT;
        case EV_CUTOFF:
          record_sample (s);
          return SW_OUT_CUTOFF;
        case EV_PITCH_OVER:
          s->f.steer = SW_STEER_KICK;
          s->f.t_po = s->f.t;
          s->f.pitched_over = TRUE;
          if (s->stop_at_po)
            return SW_OUT_PITCH_OVER;
          break;
        case EV_ALIGN:
          s->f.steer = SW_STEER_TURN;
          break;
        case EV_FAIRING:
          s->f.fairing_on = FALSE;
          s->f.fairing_dropped = TRUE;
          point_of (s, s->f.t, s->f.y, &s->f.fairing_pt);
          {
            const SwFlightSegment *sg = &m->seg[s->f.seg];
            const SwFlightStage *fs = &m->st[sg->stage];
            double load = fs->m_ignition - fs->m_burnout;

            s->f.fairing_stage = sg->stage;
            s->f.fairing_fraction = 0.0;
            if (sg->is_virtual)
              s->f.fairing_fraction = 1.0;
            else if (sg->burning && load > 0.0)
              s->f.fairing_fraction = CLAMP ((fs->m_ignition - (s->f.y[SW_Y_M] - m->fairing_mass))
                                             / load, 0.0, 1.0);
          }
          s->f.y[SW_Y_M] -= m->fairing_mass;
          break;
        case EV_GUIDE_START:
          s->f.psi_stage = attitude (s);
          s->f.blend_s = G_PI / s->m->pitch_rate;
          s->f.steer = SW_STEER_GUIDED;
          s->f.t_guide = s->f.t;
          s->f.T_guide = remaining_nominal_time (s);
          if (s->stop_at_guide)
            return SW_OUT_GUIDE;
          break;
        case EV_MAXQ:
          /* track() saw the local maximum; carry on. */
          break;
        case N_EVENTS:
        default:
          break;
        }
      record_sample (s);
    }
}

void
sw_flight_start (SwFlightSim *s, double r, double vr, double vt, double mass, SwSteer steer)
{
  const SwFlightModel *m = s->m;

  memset (&s->f, 0, sizeof s->f);
  s->f.y[SW_Y_R] = r;
  s->f.y[SW_Y_VR] = vr;
  s->f.y[SW_Y_VT] = vt;
  s->f.y[SW_Y_M] = mass;
  s->f.h = 0.5;
  s->f.steer = steer;
  s->f.fairing_on = m->fairing_mass > 0.0;
  s->f.T_guide = 1.0;
  start_segment (s);
  record_sample (s);
}

void
sw_flight_init (SwFlightSim *s, const SwFlightModel *m)
{
  memset (s, 0, sizeof *s);
  s->m = m;
  s->sys.function = rhs;
  s->sys.jacobian = NULL;
  s->sys.dimension = SW_NY;
  s->sys.params = s;
  s->step = gsl_odeiv2_step_alloc (gsl_odeiv2_step_rk8pd, SW_NY);
  /* Absolute floor 1e-6 (m, m/s, kg), relative rtol, on the state; the
   * loss integrals ride on the steps the state needs (their floor 1e-3 m/s
   * keeps them from setting the step). */
  {
    double scale[SW_NY];

    for (int i = 0; i < SW_NY; i++)
      scale[i] = i < SW_Y_LG ? 1.0 : 1.0e3;
    s->ctl = gsl_odeiv2_control_scaled_new (1e-6, m->opt.rtol, 1.0, 0.0, scale, SW_NY);
  }
  s->evo = gsl_odeiv2_evolve_alloc (SW_NY);
  s->step_lean = gsl_odeiv2_step_alloc (gsl_odeiv2_step_rk8pd, SW_NY_LEAN);
  s->step_coarse = gsl_odeiv2_step_alloc (gsl_odeiv2_step_rkck, SW_NY_LEAN);
  s->ctl_lean = gsl_odeiv2_control_standard_new (1e-6, m->opt.rtol, 1.0, 0.0);
  s->evo_lean = gsl_odeiv2_evolve_alloc (SW_NY_LEAN);
  s->root = gsl_root_fsolver_alloc (gsl_root_fsolver_brent);
  s->samples = g_array_new (FALSE, FALSE, sizeof (SwAscentSample));
}

void
sw_flight_set_rtol (SwFlightSim *s, double rtol)
{
  gsl_odeiv2_control_init (s->ctl, 1e-6, rtol, 1.0, 0.0);
  gsl_odeiv2_control_init (s->ctl_lean, 1e-6, rtol, 1.0, 0.0);
}

void
sw_flight_set_coarse (SwFlightSim *s, gboolean coarse)
{
  s->coarse = coarse;
}

void
sw_flight_set_lean (SwFlightSim *s, gboolean lean)
{
  s->lean = lean;
  s->sys.dimension = lean ? SW_NY_LEAN : SW_NY;
}

void
sw_flight_clear (SwFlightSim *s)
{
  g_clear_pointer (&s->step, gsl_odeiv2_step_free);
  g_clear_pointer (&s->ctl, gsl_odeiv2_control_free);
  g_clear_pointer (&s->evo, gsl_odeiv2_evolve_free);
  g_clear_pointer (&s->step_lean, gsl_odeiv2_step_free);
  g_clear_pointer (&s->step_coarse, gsl_odeiv2_step_free);
  g_clear_pointer (&s->ctl_lean, gsl_odeiv2_control_free);
  g_clear_pointer (&s->evo_lean, gsl_odeiv2_evolve_free);
  g_clear_pointer (&s->root, gsl_root_fsolver_free);
  if (s->samples != NULL)
    g_array_unref (s->samples);
  s->samples = NULL;
}

/* ---- the model from a design ------------------------------------------ */

static void
stage_path (char *buf, gsize size, guint i)
{
  g_snprintf (buf, size, "stages[%u]", i);
}

void
sw_ascent_options_init (SwAscentOptions *o)
{
  g_return_if_fail (o != NULL);
  o->gravity = SW_GRAVITY_INVERSE_SQUARE;
  o->atmosphere = TRUE;
  o->rotation = TRUE;
  o->steering = SW_STEERING_GUIDED;
  o->record = TRUE;
  o->sample_interval_s = 1.0;
  o->rtol = 1e-8;
}

gboolean
sw_flight_check_inputs (const SwDesign *d, gboolean need_orbit, GError **error)
{
  gboolean any = FALSE;
  char path[32];

  for (guint i = 0; i < d->n_stages; i++)
    any = any || d->stages[i].propulsion.present;
  if (!any)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_MISSING,
                   _("The design has no propulsion data. The ascent needs, on every stage, "
                     "thrust_vac_kn (or engine_thrust_vac_kn with engine_count), and on the "
                     "first stage isp_sl_s and diameter_m (optional: drag_coefficients, "
                     "coast_before_ignition_s, and an \"ascent\" object with the fairing)."));
      return FALSE;
    }
  for (guint i = 0; i < d->n_stages; i++)
    {
      const SwStage *st = &d->stages[i];
      const SwStagePropulsion *p = &st->propulsion;
      guint count = st->reliability.has_engine_count ? st->reliability.engine_count : 0;

      stage_path (path, sizeof path, i);
      if (!sw_propulsion_validate_stage (p, i, NULL, path, error))
        return FALSE;
      if (p->has_engine_thrust && count == 0)
        {
          g_set_error (error, SW_ERROR, SW_ERROR_MISSING,
                       _("%s.engine_count: missing; a thrust per engine "
                         "(engine_thrust_vac_kn) needs the number of engines"),
                       path);
          return FALSE;
        }
      if (!isfinite (sw_stage_thrust_vac_n (p, count)))
        {
          g_set_error (error, SW_ERROR, SW_ERROR_MISSING,
                       _("%s.thrust_vac_kn: missing; the ascent needs the vacuum thrust of "
                         "every stage (thrust_vac_kn, or engine_thrust_vac_kn with "
                         "engine_count)"),
                       path);
          return FALSE;
        }
    }
  if (!d->stages[0].has_isp_sl)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_MISSING,
                   _("stages[0].isp_sl_s: missing; the first stage fires at sea level and the "
                     "ascent needs its sea-level Isp"));
      return FALSE;
    }
  if (!d->stages[0].propulsion.has_diameter)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_MISSING,
                   _("stages[0].diameter_m: missing; the ascent needs the first stage's "
                     "diameter for the drag (upper stages take it over unless they give "
                     "their own)"));
      return FALSE;
    }
  if (!sw_propulsion_validate_design (&d->ascent, NULL, error))
    return FALSE;
  if (need_orbit && d->mission.kind != SW_MISSION_ORBIT)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
                   _("mission: the design states its delta-v directly (mission.delta_v_m_s); "
                     "an ascent needs a target orbit (mission.orbit with altitude_km, "
                     "inclination_deg and site_latitude_deg)"));
      return FALSE;
    }
  if (need_orbit && d->ascent.has_insertion_altitude
      && d->ascent.insertion_altitude_km > d->mission.altitude_km)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                   _("ascent.insertion_altitude_km: %g km lies above the target orbit's %g km; "
                     "the transfer orbit's perigee must be at or below the target"),
                   d->ascent.insertion_altitude_km, d->mission.altitude_km);
      return FALSE;
    }
  if (need_orbit && d->mission.altitude_km > MAX_DIRECT_ALTITUDE_KM)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_RANGE,
                   _("mission.orbit.altitude_km: %g km; the ascent model flies directly "
                     "into circular orbits up to %g km; higher orbits need a transfer coast "
                     "and a second burn, which it does not model"),
                   d->mission.altitude_km, MAX_DIRECT_ALTITUDE_KM);
      return FALSE;
    }
  return TRUE;
}

gboolean
sw_ascent_check_inputs (const SwDesign *design, GError **error)
{
  g_return_val_if_fail (design != NULL, FALSE);
  return sw_flight_check_inputs (design, TRUE, error);
}

SwBuildStatus
sw_flight_model_build (SwFlightModel *m, const SwDesign *d, const SwSizing *sz,
                       const SwAscentOptions *opt, SwAscentResult *res, GError **error)
{
  gboolean guided = opt->steering == SW_STEERING_GUIDED;
  double diameter = 0.0, dmax;

  memset (m, 0, sizeof *m);
  m->opt = *opt;
  if (!(m->opt.rtol > 0.0))
    m->opt.rtol = 1e-8;
  if (!(m->opt.sample_interval_s > 0.0))
    m->opt.sample_interval_s = 1.0;
  if (!sw_flight_check_inputs (d, guided, error))
    return SW_BUILD_ERROR;

  res->sizing = *sz;
  res->sized_delta_v_m_s = sz->delta_v_m_s;
  res->n_stages = d->n_stages;
  if (!sz->feasible)
    {
      res->status = SW_ASCENT_NOT_SIMULATED;
      g_snprintf (res->reason, sizeof res->reason,
                  _("No ascent: the sizing is infeasible. %s"), sz->reason);
      return SW_BUILD_INFEASIBLE;
    }

  m->n = d->n_stages;
  m->first = G_MAXUINT;
  for (guint i = 0; i < m->n; i++)
    {
      const SwStage *st = &d->stages[i];
      const SwStageResult *r = &sz->stages[i];
      SwFlightStage *ms = &m->st[i];
      guint count = st->reliability.has_engine_count ? st->reliability.engine_count : 0;

      if (st->propulsion.has_diameter)
        diameter = st->propulsion.diameter_m;
      ms->fires = r->propellant_mass_kg > 0.0 && !r->unused;
      /* The flight adds the fairing while it is on: its masses leave out
       * what the sizing carried (sw-sizing.h, SwFairingCarry). */
      if (sz->fairing.mass_kg > 0.0 && i <= sz->fairing.stage)
        {
          double F = sz->fairing.mass_kg;
          ms->sz_fairing = F;
          ms->sz_fairing_burn = i < sz->fairing.stage
                                  ? r->propellant_mass_kg
                                  : sz->fairing.fraction * r->propellant_mass_kg;
          ms->m_ignition = r->initial_mass_kg - F;
          ms->m_burnout = r->burnout_mass_kg - (i < sz->fairing.stage ? F : 0.0);
          ms->m_after = r->payload_mass_kg - (i < sz->fairing.stage ? F : 0.0);
        }
      else
        {
          ms->m_ignition = r->initial_mass_kg;
          ms->m_burnout = r->burnout_mass_kg;
          ms->m_after = r->payload_mass_kg;
        }
      ms->thrust_vac = sw_stage_thrust_vac_n (&st->propulsion, count);
      ms->isp_vac = st->isp_vac_s;
      ms->isp_sl = st->has_isp_sl ? st->isp_sl_s : st->isp_vac_s;
      ms->has_isp_sl = st->has_isp_sl;
      ms->c = st->isp_vac_s * SW_G0;
      ms->mdot = sw_propulsion_mass_flow (ms->thrust_vac, ms->isp_vac);
      ms->burn_time = r->propellant_mass_kg / ms->mdot;
      ms->coast = st->propulsion.has_coast ? st->propulsion.coast_before_ignition_s : 0.0;
      ms->dv_sized = r->delta_v_m_s;
      ms->aero = st->propulsion;
      /* Diameter for the area: the stage's own, else the one below. */
      ms->area = diameter;
      if (ms->fires)
        {
          if (m->first == G_MAXUINT)
            m->first = i;
          m->last = i;
          m->n_firing++;
        }
    }
  /* The widest of the stack that is still attached sets the frontal area. */
  dmax = 0.0;
  for (int i = (int) m->n - 1; i >= 0; i--)
    {
      dmax = MAX (dmax, m->st[i].area);
      m->st[i].area = G_PI * dmax * dmax / 4.0;
    }
  if (sz->boosters.present && d->boosters.count > 0)
    {
      const SwBoosterResult *b = &sz->boosters;
      /* A booster without a diameter of its own: half the core's (common
       * practice for a first look, ours to choose). */
      double bd = d->boosters.has_diameter ? d->boosters.diameter_m
                                           : 0.5 * sqrt (4.0 * m->st[0].area / G_PI);

      m->has_boosters = TRUE;
      m->b_thrust_vac = b->count * b->thrust_vac_n;
      m->b_isp_vac = d->boosters.isp_vac_s;
      m->b_isp_sl = d->boosters.has_isp_sl ? d->boosters.isp_sl_s : d->boosters.isp_vac_s;
      m->b_mdot = sw_propulsion_mass_flow (m->b_thrust_vac, m->b_isp_vac);
      m->b_area = b->count * G_PI * bd * bd / 4.0;
      m->b_dry = b->count * b->structural_mass_kg;
      m->b_c_mix = b->mixed_exhaust_velocity_m_s;
      m->b_dv0 = b->phase_delta_v_m_s;
      /* Without a fairing the core drops in its own phase (the flight
       * takes the fairing off the mass it compares). */
      m->b_m1 = b->core_phase_initial_mass_kg - (b->fairing_phase == 2 ? b->fairing_mass_kg : 0.0);
      if (!m->st[0].fires || !(b->phase_duration_s > 0.0))
        {
          res->status = SW_ASCENT_NOT_SIMULATED;
          g_strlcpy (res->reason, _("No ascent: the boosters need a core that fires beside them."),
                     sizeof res->reason);
          return SW_BUILD_INFEASIBLE;
        }
    }
  if (m->n_firing == 0)
    {
      res->status = SW_ASCENT_NOT_SIMULATED;
      g_strlcpy (res->reason, _("No ascent: no stage carries propellant."), sizeof res->reason);
      return SW_BUILD_INFEASIBLE;
    }
  /* A vehicle whose every stage is fixed gives what its loads give
   * (sw_size_with_fixed); a sized stage takes up the rest, so otherwise it
   * gives the requirement. */
  m->sized_total = sz->n_stages > 0 && sz->n_fixed == sz->n_stages
                   && isfinite (sz->delta_v_given_m_s)
                     ? sz->delta_v_given_m_s : sz->delta_v_m_s;

  m->fairing_sized = sz->fairing.mass_kg > 0.0;
  if (d->ascent.has_fairing_mass && d->ascent.fairing_mass_kg > 0.0)
    {
      m->fairing_mass = d->ascent.fairing_mass_kg;
      if (d->ascent.has_fairing_altitude)
        {
          m->fairing_rule = SW_FAIRING_RULE_ALTITUDE;
          m->fairing_value = d->ascent.fairing_jettison_altitude_km * 1000.0;
        }
      else
        {
          m->fairing_rule = SW_FAIRING_RULE_PRESSURE;
          m->fairing_value = d->ascent.fairing_jettison_dynamic_pressure_pa;
        }
    }
  res->fairing_mass_kg = m->fairing_mass;
  m->pitch_over_speed = d->ascent.has_pitch_over_speed ? d->ascent.pitch_over_speed_m_s
                                                       : SW_PITCH_OVER_SPEED_DEFAULT;
  m->q_alpha_max = d->ascent.has_max_q_alpha ? d->ascent.max_q_alpha_kpa_deg * 1000.0 * SW_DEG
                                             : 0.0;
  m->pitch_rate = SW_ASCENT_PITCH_RATE_DEG_S * SW_DEG;

  res->target_altitude_km = NAN;
  res->circular_velocity_m_s = res->launch_azimuth_deg = NAN;
  res->ideal_delta_v_m_s = res->rotation_gain_m_s = NAN;
  if (d->mission.kind == SW_MISSION_ORBIT)
    {
      SwBudget b;
      double vs, u;

      if (!sw_budget_compute (d->mission.altitude_km, d->mission.inclination_deg,
                              d->mission.site_latitude_deg, 0.0, &b, error))
        return SW_BUILD_ERROR;
      vs = opt->rotation ? b.site_speed_m_s : 0.0;
      m->azimuth_deg = b.launch_azimuth_deg;
      m->omega_p = vs * sin (b.launch_azimuth_deg * SW_DEG) / SW_RE;
      m->v0 = m->omega_p * SW_RE;
      u = vs * cos (b.launch_azimuth_deg * SW_DEG);
      m->v_circ = b.circular_velocity_m_s;
      m->cross_cost = hypot (m->v_circ - m->v0, u) - (m->v_circ - m->v0);
      m->gain = m->v0 - m->cross_cost;
      m->ideal = m->v_circ - m->gain;
      m->has_target = guided;
      m->r_target = SW_RE + d->mission.altitude_km * 1000.0;
      m->r_cut = m->r_target;
      if (d->ascent.has_insertion_altitude
          && d->ascent.insertion_altitude_km < d->mission.altitude_km)
        {
          m->has_transfer = TRUE;
          m->r_cut = SW_RE + d->ascent.insertion_altitude_km * 1000.0;
        }
      /* Cut off at the energy of the orbit from r_cut to r_target. */
      m->e_target = -SW_WGS84_MU / (m->r_cut + m->r_target);
      res->target_altitude_km = d->mission.altitude_km;
      res->circular_velocity_m_s = m->v_circ;
      res->launch_azimuth_deg = m->azimuth_deg;
      res->ideal_delta_v_m_s = m->ideal;
      res->rotation_gain_m_s = m->gain;
    }
  m->m_floor = VIRTUAL_FLOOR * m->st[m->last].m_burnout;

  /* The flight plan. */
  for (guint i = 0; i < m->n; i++)
    {
      SwFlightStage *ms = &m->st[i];
      if (!ms->fires)
        continue;
      if (i != m->first && ms->coast > 0.0)
        m->seg[m->n_seg++] = (SwFlightSegment) { i, FALSE, FALSE, ms->coast, FALSE };
      if (i == 0 && m->has_boosters)
        {
          /* Phase 0 with the boosters, then the core alone: without
           * crossfeed the core has burnt its share already, with crossfeed
           * it starts its own phase full. */
          double t0 = sz->boosters.phase_duration_s;
          double rest = d->boosters.crossfeed ? ms->burn_time : ms->burn_time - t0;
          m->seg[m->n_seg++] = (SwFlightSegment) { i, TRUE, FALSE, t0, TRUE };
          if (rest > 0.0 || i == m->last)
            m->seg[m->n_seg++] = (SwFlightSegment) { i, TRUE, FALSE, MAX (rest, 0.0), FALSE };
        }
      else
        m->seg[m->n_seg++] = (SwFlightSegment) { i, TRUE, FALSE, ms->burn_time, FALSE };
      if (i == m->last && m->has_target)
        m->seg[m->n_seg++] = (SwFlightSegment) { i, TRUE, TRUE,
                                          (ms->m_burnout - m->m_floor) / ms->mdot };
    }

  /* Liftoff. */
  if (opt->gravity != SW_GRAVITY_NONE)
    {
      const SwFlightStage *ms = &m->st[m->first];
      double p0 = opt->atmosphere ? SW_ATMOSPHERE_P0 : 0.0;
      double thrust = sw_propulsion_thrust_at (ms->thrust_vac, ms->isp_vac, ms->isp_sl, p0)
                      + (m->has_boosters && m->first == 0
                           ? sw_propulsion_thrust_at (m->b_thrust_vac, m->b_isp_vac, m->b_isp_sl,
                                                      p0) : 0.0);
      double mass = ms->m_ignition + m->fairing_mass;
      double g = opt->gravity == SW_GRAVITY_CONSTANT ? SW_G0 : SW_WGS84_MU / (SW_RE * SW_RE);

      res->liftoff_thrust_to_weight = thrust / (mass * SW_G0);
      if (!(thrust > mass * g))
        {
          res->status = SW_ASCENT_NO_SOLUTION;
          g_autofree char *tw = sw_format_ratio (res->liftoff_thrust_to_weight, 3);
          g_autofree char *kn = sw_format_number (thrust / 1000.0, 0);
          g_autofree char *mass_text = sw_format_mass (mass);
          /* Translators: a ratio ("0.452"), a thrust in kN ("1,250") and a
           * mass ("155.1 t") */
          g_snprintf (res->reason, sizeof res->reason,
                      _("The vehicle cannot lift off: its thrust-to-weight at liftoff is %s "
                        "(%s kN at sea level against %s with the fairing); it must "
                        "exceed 1, and common practice is 1.2 to 1.5. Give the first stage "
                        "more thrust or the vehicle less mass."), tw, kn, mass_text);
          return SW_BUILD_INFEASIBLE;
        }
    }
  return SW_BUILD_OK;
}

/* ---- results ----------------------------------------------------------- */

SwAscentResult *
sw_ascent_result_new (void)
{
  SwAscentResult *r = g_new0 (SwAscentResult, 1);

  r->samples = g_array_new (FALSE, FALSE, sizeof (SwAscentSample));
  r->perigee_km = r->apogee_km = NAN;
  r->target_altitude_km = r->circular_velocity_m_s = r->launch_azimuth_deg = NAN;
  r->ideal_delta_v_m_s = r->rotation_gain_m_s = NAN;
  r->losses_m_s = r->gravity_loss_m_s = r->drag_loss_m_s = r->steering_loss_m_s = NAN;
  r->gravity_loss_air_m_s = r->rotation_term_m_s = NAN;
  r->pressure_loss_m_s = r->fairing_loss_m_s = r->other_loss_m_s = NAN;
  r->raising_loss_m_s = NAN;
  r->insertion_altitude_km = r->transfer_perigee_km = r->transfer_apogee_km = NAN;
  r->circularization_m_s = r->circularization_time_s = NAN;
  r->engines_delta_v_m_s = r->delta_v_needed_m_s = r->sized_delta_v_m_s = NAN;
  r->delta_v_margin_m_s = r->delta_v_missing_m_s = NAN;
  r->propellant_beyond_load_kg = NAN;
  r->max_q_pa = r->max_q_time_s = r->max_q_altitude_m = NAN;
  r->max_axial_g = r->max_axial_g_time_s = r->liftoff_thrust_to_weight = NAN;
  r->max_q_alpha_kpa_deg = NAN;
  r->fairing_propellant_fraction = NAN;
  r->optimised.guided_needed_m_s = r->optimised.needed_m_s = r->optimised.saving_m_s = NAN;
  r->optimised.perigee_km = r->optimised.apogee_km = NAN;
  r->optimised.cutoff_flight_path_deg = r->optimised.max_q_alpha_kpa_deg = NAN;
  r->optimised.kick_deg = r->optimised.max_q_alpha_guided_kpa_deg = NAN;
  r->pitch_over_time_s = r->pitch_kick_deg = r->guidance_start_s = NAN;
  r->steering_start_deg = r->steering_end_deg = NAN;
  r->loop_sized_losses_m_s = NAN;
  r->final_time_s = r->final_radius_m = r->final_downrange_m = NAN;
  r->final_radial_velocity_m_s = r->final_horizontal_velocity_m_s = r->final_mass_kg = NAN;
  return r;
}

void
sw_ascent_apply_loop (SwDesign *design, const SwAscentResult *loop)
{
  g_return_if_fail (design != NULL && loop != NULL);

  design->mission.losses_m_s = loop->loop_sized_losses_m_s;
  design->mission.has_losses = TRUE;
  design->ascent.has_flown_fairing = loop->sizing.fairing.mass_kg > 0.0;
  design->ascent.flown_fairing_stage = loop->sizing.fairing.stage;
  design->ascent.flown_fairing_fraction = loop->sizing.fairing.fraction;
}

double
sw_ascent_liftoff_mass (const SwAscentResult *result)
{
  g_return_val_if_fail (result != NULL, NAN);

  return result->sizing.liftoff_mass_kg
         + (result->sizing.fairing.mass_kg > 0.0 ? 0.0 : result->fairing_mass_kg);
}

void
sw_ascent_result_free (SwAscentResult *result)
{
  if (result == NULL)
    return;
  if (result->samples != NULL)
    g_array_unref (result->samples);
  g_free (result);
}

void
sw_ascent_result_add_note (SwAscentResult *result, const char *format, ...)
{
  va_list args;
  g_autofree char *text = NULL;
  gsize len = strlen (result->notes);

  va_start (args, format);
  text = g_strdup_vprintf (format, args);
  va_end (args);
  g_snprintf (result->notes + len, sizeof result->notes - len, "%s%s", len > 0 ? "\n" : "",
              text);
}

const char *
sw_ascent_status_to_string (SwAscentStatus status)
{
  switch (status)
    {
    case SW_ASCENT_REACHED:
      return "reached";
    case SW_ASCENT_SHORT:
      return "short";
    case SW_ASCENT_NO_SOLUTION:
      return "no-solution";
    case SW_ASCENT_NOT_SIMULATED:
      return "not-simulated";
    case SW_ASCENT_UNGUIDED:
    default:
      return "unguided";
    }
}

/* Perigee and apogee radii of the osculating orbit (apogee NAN when it
 * escapes); returns the semi-major axis (NAN when it escapes). */
static double
orbit_radii (const double *y, double *rp, double *ra)
{
  double r = y[SW_Y_R], vr = y[SW_Y_VR], vt = y[SW_Y_VT];
  double energy = 0.5 * (vr * vr + vt * vt) - SW_WGS84_MU / r;
  double hm = r * vt;
  double e2 = 1.0 + 2.0 * energy * hm * hm / (SW_WGS84_MU * SW_WGS84_MU);
  double e = sqrt (MAX (0.0, e2));
  double p = hm * hm / SW_WGS84_MU;
  gboolean bound = energy < 0.0 && e < 1.0;

  *rp = p / (1.0 + e);
  *ra = bound ? p / (1.0 - e) : NAN;
  return bound ? -SW_WGS84_MU / (2.0 * energy) : NAN;
}

static void
orbit_of (const double *y, double *perigee_km, double *apogee_km)
{
  double rp, ra;

  orbit_radii (y, &rp, &ra);
  *perigee_km = (rp - SW_RE) / 1000.0;
  *apogee_km = (ra - SW_RE) / 1000.0;
}

/* The rocket-equation delta-v of the sized vehicle up to the state @y in
 * segment @seg (see sw-ascent.h): the sized delta-v of the stages burnt out,
 * and of the stage burning, what the sizing's model gives for the propellant
 * it has burnt, with the fairing where the sizing carries it (where the flight
 * carries it does not matter here: a later drop than the sizing's shows as
 * the fairing loss). */
double
sw_flight_sized_delta_v (const SwFlightModel *m, guint seg, const double *y, gboolean fairing_on)
{
  const SwFlightSegment *sg = &m->seg[MIN (seg, m->n_seg - 1)];
  const SwFlightStage *st;
  guint k = sg->stage;
  double dv = 0.0, mass = y[SW_Y_M] - (fairing_on ? m->fairing_mass : 0.0);
  double m0, burnt, b, F;

  /* Stage 0 with boosters: phase 0, then the core's own phase. */
  if (k == 0 && m->has_boosters)
    return sg->boosters ? m->b_c_mix * log (m->st[0].m_ignition / mass)
                        : m->b_dv0 + m->st[0].c * log (m->b_m1 / mass);

  for (guint i = 0; i < k; i++)
    if (m->st[i].fires)
      dv += m->st[i].dv_sized;
  st = &m->st[k];
  if (!(st->sz_fairing > 0.0))
    return dv + st->c * log (st->m_ignition / mass);
  m0 = st->m_ignition;
  F = st->sz_fairing;
  burnt = m0 - mass;
  b = st->sz_fairing_burn;
  if (burnt <= b)
    return dv + st->c * log ((m0 + F) / (m0 + F - burnt));
  return dv + st->c * log ((m0 + F) / (m0 + F - b)) + st->c * log ((m0 - b) / (m0 - burnt));
}

void
sw_flight_fill_result (const SwFlightSim *s, SwOutcome out, SwAscentResult *res)
{
  const SwFlightModel *m = s->m;
  const SwFlightState *f = &s->f;

  res->final_time_s = f->t;
  res->final_radius_m = f->y[SW_Y_R];
  res->final_downrange_m = f->y[SW_Y_S];
  res->final_radial_velocity_m_s = f->y[SW_Y_VR];
  res->final_horizontal_velocity_m_s = f->y[SW_Y_VT];
  res->final_mass_kg = f->y[SW_Y_M];

  res->gravity_loss_m_s = f->y[SW_Y_LG];
  res->gravity_loss_air_m_s = f->y[SW_Y_LGA];
  /* On a retrograde azimuth the site's in-plane speed points backwards: the
   * budget's ideal counts its reversal, which the flown integrals count
   * again: v0 - |v0| = -2 |v0| belongs to the same term. */
  res->rotation_term_m_s = f->y[SW_Y_LR] + (m->v0 - fabs (m->v0));
  res->drag_loss_m_s = f->y[SW_Y_LD];
  res->steering_loss_m_s = f->y[SW_Y_LS];
  res->pressure_loss_m_s = f->y[SW_Y_LP];
  res->engines_delta_v_m_s = f->y[SW_Y_LE];
  res->sized_delta_v_m_s = m->sized_total;

  if (f->max_q > 0.0)
    {
      res->max_q_pa = f->max_q;
      res->max_q_time_s = f->max_q_t;
      res->max_q_altitude_m = f->max_q_h;
    }
  res->max_axial_g = f->max_acc;
  res->max_q_alpha_kpa_deg = f->max_q_alpha / SW_DEG / 1000.0;
  res->max_axial_g_time_s = f->max_acc_t;
  res->fairing_dropped = f->fairing_dropped;
  res->fairing = f->fairing_pt;
  res->boosters_dropped = f->boosters_dropped;
  res->boosters = f->boosters_pt;
  res->fairing_stage = f->fairing_dropped ? f->fairing_stage : 0;
  res->fairing_propellant_fraction = f->fairing_dropped ? f->fairing_fraction : NAN;
  if (f->pitched_over)
    res->pitch_over_time_s = f->t_po;

  for (guint i = 0; i < m->n; i++)
    {
      const SwFlightStage *ms = &m->st[i];
      SwAscentStage *st = &res->stages[i];

      st->fires = ms->fires;
      st->flown = f->ignited[i];
      st->thrust_vac_n = ms->thrust_vac;
      st->thrust_sl_n = ms->has_isp_sl ? sw_propulsion_thrust_at (ms->thrust_vac, ms->isp_vac,
                                                                  ms->isp_sl, SW_ATMOSPHERE_P0)
                                       : NAN;
      st->mass_flow_kg_s = ms->mdot;
      st->burn_time_s = ms->fires ? ms->burn_time : 0.0;
      st->coast_s = i == m->first ? 0.0 : ms->coast;
      st->ignition_mass_kg = f->ignited[i] ? f->m_ign[i] : NAN;
      st->ignition_thrust_to_weight = f->ignited[i] ? f->tw_ign[i] : NAN;
      st->burnout_thrust_to_weight = f->burnt[i] ? f->tw_bo[i] : NAN;
      st->ignition = f->ign[i];
      st->burnout = f->bo[i];
      st->burn_time_flown_s = f->burnt[i] ? f->bo[i].time_s - f->ign[i].time_s : NAN;
      st->propellant_left_kg = f->burnt[i] ? 0.0 : NAN;
      if (!f->ignited[i])
        {
          memset (&st->ignition, 0, sizeof st->ignition);
          memset (&st->burnout, 0, sizeof st->burnout);
          st->ignition.time_s = st->burnout.time_s = NAN;
        }
    }

  if (!m->has_target)
    {
      res->status = SW_ASCENT_UNGUIDED;
      orbit_of (f->y, &res->perigee_km, &res->apogee_km);
      return;
    }

  if (out == SW_OUT_CUTOFF)
    {
      const SwFlightSegment *sg = &m->seg[f->seg];
      SwAscentStage *st = &res->stages[sg->stage];
      double sized_at_cut = sw_flight_sized_delta_v (m, f->seg, f->y, f->fairing_on);
      double v_cut = hypot (f->y[SW_Y_VR], f->y[SW_Y_VT]), circ = 0.0, needed;
      double rp, ra, a = orbit_radii (f->y, &rp, &ra);

      if (m->has_transfer && isfinite (ra))
        {
          /* Coast half the transfer orbit, then circularise at apogee: the
           * speed there is h / ra (angular momentum), the circular sqrt(mu / ra). */
          circ = sqrt (SW_WGS84_MU / ra) - f->y[SW_Y_R] * f->y[SW_Y_VT] / ra;
          res->insertion_altitude_km = (m->r_cut - SW_RE) / 1000.0;
          res->transfer_perigee_km = (rp - SW_RE) / 1000.0;
          res->transfer_apogee_km = (ra - SW_RE) / 1000.0;
          res->circularization_m_s = circ;
          res->circularization_time_s = f->t + G_PI * sqrt (a * a * a / SW_WGS84_MU);
        }
      needed = sized_at_cut + circ + m->cross_cost;

      point_of (s, f->t, f->y, &res->cutoff);
      res->propellant_beyond_load_kg = 0.0;
      if (sg->is_virtual)
        res->propellant_beyond_load_kg = m->st[sg->stage].m_burnout
                                         + (f->fairing_on ? m->fairing_mass : 0.0) - f->y[SW_Y_M];
      if (!sg->is_virtual)
        {
          st->burnout = res->cutoff;
          st->burn_time_flown_s = f->t - f->ign[sg->stage].time_s;
          st->propellant_left_kg = f->y[SW_Y_M] - (f->fairing_on ? m->fairing_mass : 0.0)
                                   - m->st[sg->stage].m_burnout;
          st->burnout_thrust_to_weight = thrust_to_weight (s);
        }
      res->delta_v_needed_m_s = needed;
      res->losses_m_s = needed - m->ideal;
      res->fairing_loss_m_s = sized_at_cut - f->y[SW_Y_LE];
      res->raising_loss_m_s = v_cut - m->v_circ + circ;
      res->other_loss_m_s = res->losses_m_s
                            - (res->gravity_loss_m_s + res->drag_loss_m_s
                               + res->steering_loss_m_s + res->pressure_loss_m_s
                               + res->fairing_loss_m_s + res->raising_loss_m_s);
      res->delta_v_margin_m_s = m->sized_total - needed;
      res->delta_v_missing_m_s = MAX (0.0, -res->delta_v_margin_m_s);
      if (f->real_bo)
        orbit_of (f->y_real_bo, &res->perigee_km, &res->apogee_km);
      else if (m->has_transfer && isfinite (ra))
        res->perigee_km = res->apogee_km = (ra - SW_RE) / 1000.0;
      else
        orbit_of (f->y, &res->perigee_km, &res->apogee_km);
      if (res->delta_v_margin_m_s >= 0.0)
        {
          res->status = SW_ASCENT_REACHED;
          res->reached_orbit = TRUE;
        }
      else
        {
          res->status = SW_ASCENT_SHORT;
          if (f->real_bo)
            g_snprintf (res->reason, sizeof res->reason,
                        _("The vehicle falls short of the %.0f km orbit by %s of "
                          "delta-v: the simulated losses are %s where the sizing "
                          "allowed %s. The last stage burns out at T+%.0f s, %s "
                          "up at %s (perigee %.0f km); flown on to the cutoff with %.0f kg "
                          "of propellant beyond its load, to measure the shortfall."),
                        m->r_target / 1000.0 - SW_RE / 1000.0, SW_SPEED (res->delta_v_missing_m_s),
                        SW_SPEED (res->losses_m_s), SW_SPEED (m->sized_total - m->ideal), f->t_real_bo,
                        SW_KM (f->y_real_bo[SW_Y_R] - SW_RE),
                        SW_SPEED (hypot (f->y_real_bo[SW_Y_VR], f->y_real_bo[SW_Y_VT])),
                        res->perigee_km, res->propellant_beyond_load_kg);
          else
            g_snprintf (res->reason, sizeof res->reason,
                        _("The vehicle reaches the %.0f km orbit in the plane but lacks %.1f "
                          "m/s of delta-v for cancelling the site's velocity across the "
                          "orbit plane: the simulated losses are %s where the sizing "
                          "allowed %s."),
                        m->r_target / 1000.0 - SW_RE / 1000.0, res->delta_v_missing_m_s,
                        SW_SPEED (res->losses_m_s), SW_SPEED (m->sized_total - m->ideal));
        }
      return;
    }

  res->status = SW_ASCENT_NO_SOLUTION;
  orbit_of (f->y, &res->perigee_km, &res->apogee_km);
}

/* GSL's default handler aborts the program on a numerical error (a bracket
 * that does not bracket, a step that underflows).  A desktop tool must never
 * abort on odd input: every GSL call here checks its status, so the handler
 * is switched off, once, for the process. */
void
sw_ascent_gsl_errors_as_status (void)
{
  static gsize done = 0;

  if (g_once_init_enter (&done))
    {
      gsl_set_error_handler_off ();
      g_once_init_leave (&done, 1);
    }
}

gboolean
sw_ascent_stage_figures (const SwDesign *design, const SwSizing *sizing, SwAscentStage *out,
                         GError **error)
{
  double fairing;

  g_return_val_if_fail (design != NULL && sizing != NULL && out != NULL, FALSE);

  if (!sw_flight_check_inputs (design, FALSE, error))
    return FALSE;
  fairing = design->ascent.has_fairing_mass ? design->ascent.fairing_mass_kg : 0.0;
  for (guint i = 0; i < design->n_stages; i++)
    {
      const SwStage *st = &design->stages[i];
      const SwStageResult *r = &sizing->stages[i];
      SwAscentStage *o = &out[i];
      guint count = st->reliability.has_engine_count ? st->reliability.engine_count : 0;
      double isp_sl = st->has_isp_sl ? st->isp_sl_s : st->isp_vac_s;
      double mass;

      memset (o, 0, sizeof *o);
      o->thrust_vac_n = sw_stage_thrust_vac_n (&st->propulsion, count);
      o->thrust_sl_n = st->has_isp_sl ? sw_propulsion_thrust_at (o->thrust_vac_n, st->isp_vac_s,
                                                                 isp_sl, SW_ATMOSPHERE_P0)
                                      : NAN;
      o->mass_flow_kg_s = sw_propulsion_mass_flow (o->thrust_vac_n, st->isp_vac_s);
      o->fires = sizing->feasible && r->propellant_mass_kg > 0.0 && !r->unused;
      o->burn_time_s = sizing->feasible ? r->propellant_mass_kg / o->mass_flow_kg_s : NAN;
      o->coast_s = st->propulsion.has_coast ? st->propulsion.coast_before_ignition_s : 0.0;
      /* A sizing that carries the fairing has it in its masses already. */
      mass = r->initial_mass_kg + (i == 0 && !(sizing->fairing.mass_kg > 0.0) ? fairing : 0.0);
      o->ignition_mass_kg = sizing->feasible ? mass : NAN;
      o->ignition_thrust_to_weight = sizing->feasible
                                     ? (i == 0 ? o->thrust_sl_n : o->thrust_vac_n)
                                         / (mass * SW_G0)
                                     : NAN;
      /* Stage 0 with boosters: they lift off with it. */
      if (i == 0 && sizing->feasible && sizing->boosters.present)
        {
          const SwBoosters *b = &design->boosters;
          double bvac = sizing->boosters.count * sizing->boosters.thrust_vac_n;
          double bsl = sw_propulsion_thrust_at (bvac, b->isp_vac_s,
                                                b->has_isp_sl ? b->isp_sl_s : b->isp_vac_s,
                                                SW_ATMOSPHERE_P0);
          double core = isfinite (o->thrust_sl_n) ? o->thrust_sl_n : o->thrust_vac_n;
          o->ignition_thrust_to_weight = (core + bsl) / (mass * SW_G0);
          /* The core alone after the boosters drop: its burn without them. */
          o->burn_time_s = sizing->boosters.crossfeed
                             ? r->propellant_mass_kg / o->mass_flow_kg_s
                                 + sizing->boosters.phase_duration_s
                             : r->propellant_mass_kg / o->mass_flow_kg_s;
        }
      o->burnout_thrust_to_weight = sizing->feasible
                                    ? o->thrust_vac_n / (r->burnout_mass_kg * SW_G0) : NAN;
      o->burn_time_flown_s = o->propellant_left_kg = NAN;
      o->ignition.time_s = o->burnout.time_s = NAN;
    }
  return TRUE;
}

/* ---- coasting body ----------------------------------------------------- */

SwAscentResult *
sw_ascent_coast (double mass_kg, double area_m2, const SwStagePropulsion *aero,
                 double altitude_m, double radial_velocity_m_s, double horizontal_velocity_m_s,
                 double duration_s, const SwAscentOptions *options, GError **error)
{
  g_autoptr (SwAscentResult) res = sw_ascent_result_new ();
  SwFlightModel *m;
  SwFlightSim s;
  SwOutcome o;

  if (!(mass_kg > 0.0) || !(area_m2 >= 0.0) || !(duration_s > 0.0) || !isfinite (altitude_m)
      || !isfinite (radial_velocity_m_s) || !isfinite (horizontal_velocity_m_s))
    {
      g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                   _("A coast needs a positive mass and duration, a non-negative area and a "
                     "finite state."));
      return NULL;
    }
  sw_ascent_gsl_errors_as_status ();
  m = g_new0 (SwFlightModel, 1);
  if (options != NULL)
    m->opt = *options;
  else
    sw_ascent_options_init (&m->opt);
  if (!(m->opt.rtol > 0.0))
    m->opt.rtol = 1e-9;
  if (!(m->opt.sample_interval_s > 0.0))
    m->opt.sample_interval_s = 1.0;
  m->opt.steering = SW_STEERING_PROGRADE;
  m->n = 1;
  m->n_firing = 0;
  m->st[0].m_ignition = m->st[0].m_burnout = m->st[0].m_after = mass_kg;
  m->st[0].area = area_m2;
  if (aero != NULL)
    m->st[0].aero = *aero;
  m->seg[0] = (SwFlightSegment) { 0, FALSE, FALSE, duration_s };
  m->n_seg = 1;

  sw_flight_init (&s, m);
  s.record = m->opt.record;
  sw_flight_start (&s, SW_RE + altitude_m, radial_velocity_m_s, horizontal_velocity_m_s,
                   mass_kg, SW_STEER_PROGRADE);
  o = sw_flight_run (&s);
  sw_flight_fill_result (&s, o, res);
  res->n_stages = 0;
  res->status = SW_ASCENT_UNGUIDED;
  if (o == SW_OUT_IMPACT)
    g_strlcpy (res->reason, _("The body reached the ground."), sizeof res->reason);
  g_array_append_vals (res->samples, s.samples->data, s.samples->len);
  sw_flight_clear (&s);
  g_free (m);
  return g_steal_pointer (&res);
}
