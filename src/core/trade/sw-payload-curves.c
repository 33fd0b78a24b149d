/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-payload-curves"

#include "config.h"

#include "sw-payload-curves.h"

#include "sw-ascent.h"
#include "sw-budget.h"
#include "sw-format.h"
#include "sw-limits.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#define GRID_POINTS 19
/* The closed loop on the payload: the flown losses settle within 1 m/s
 * (the closed loop of the sizing uses the same tolerance). */
#define LOOP_MAX 8
#define LOOP_TOLERANCE_M_S 1.0

guint
sw_payload_default_altitudes (double *altitudes_km)
{
  for (guint i = 0; i < GRID_POINTS; i++)
    altitudes_km[i] = 200.0 + 100.0 * i;
  return GRID_POINTS;
}

guint
sw_payload_default_inclinations (const SwDesign *design, double *inclinations_deg)
{
  double lat = fabs (design->mission.site_latitude_deg);
  double lo = lat, hi = 180.0 - lat;

  for (guint i = 0; i < GRID_POINTS; i++)
    inclinations_deg[i] = lo + (hi - lo) * i / (GRID_POINTS - 1);
  return GRID_POINTS;
}

gboolean
sw_payload_check_grid (gboolean altitude, const double *values, guint n, const char *option,
                       GError **error)
{
  SwLimitId id = altitude ? SW_LIMIT_ALTITUDE : SW_LIMIT_INCLINATION;
  const SwLimit *l = sw_limit_get (id);

  if (n == 0 || n > SW_PAYLOAD_CURVE_MAX)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
                   _("%s: give 1 to %d values separated by commas"), option,
                   SW_PAYLOAD_CURVE_MAX);
      return FALSE;
    }
  for (guint i = 0; i < n; i++)
    if (!sw_limit_contains (id, values[i]))
      {
        g_set_error (error, SW_ERROR, SW_ERROR_RANGE,
                     _("%s: %g %s is out of range (%g to %g %s)"), option, values[i], l->unit,
                     l->min, l->max, l->unit);
        return FALSE;
      }
  return TRUE;
}

/* The payload at the allowance @losses_m_s; FALSE with @reason when the
 * orbit cannot be reached from the site or the vehicle falls short. */
static gboolean
payload_at (const SwDesign *design, double altitude_km, double inclination_deg,
            double losses_m_s, SwPayloadPoint *pt)
{
  g_autoptr (GError) error = NULL;
  SwDesign tmp = *design;    /* read only: the heap parts stay the design's */
  SwPerformance perf;

  tmp.mission.altitude_km = altitude_km;
  tmp.mission.inclination_deg = inclination_deg;
  tmp.mission.loss_model = SW_LOSS_ALLOWANCE;
  tmp.mission.losses_m_s = losses_m_s;
  tmp.mission.has_losses = TRUE;
  pt->losses_m_s = losses_m_s;
  pt->payload_kg = NAN;
  pt->reachable = FALSE;
  pt->delta_v_m_s = NAN;
  if (!sw_design_performance (&tmp, &perf, &error))
    {
      g_strlcpy (pt->reason, error->message, sizeof pt->reason);
      return FALSE;
    }
  pt->delta_v_m_s = perf.delta_v_m_s;
  if (!perf.reachable)
    {
      g_strlcpy (pt->reason, perf.reason, sizeof pt->reason);
      return FALSE;
    }
  pt->reachable = TRUE;
  pt->payload_kg = perf.payload_kg;
  pt->reason[0] = '\0';
  return TRUE;
}

/* The losses of the vehicle flown to the point's orbit with @payload_kg;
 * NAN with @reason when the flight finds no steering. */
static double
flown_losses (const SwDesign *design, double altitude_km, double inclination_deg,
              double payload_kg, GCancellable *cancellable, char *reason)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (SwAscentResult) res = NULL;
  SwAscentOptions o;
  SwDesign tmp = *design;

  /* Every stage is fixed, so the allowance changes nothing of the vehicle
   * flown; none at all keeps its sizing feasible whatever the flight then
   * shows (the losses are the flight's, not the allowance's). */
  tmp.mission.altitude_km = altitude_km;
  tmp.mission.inclination_deg = inclination_deg;
  tmp.mission.loss_model = SW_LOSS_ALLOWANCE;
  tmp.mission.losses_m_s = 0.0;
  tmp.mission.has_losses = TRUE;
  tmp.payload_kg = payload_kg;
  sw_ascent_options_init (&o);
  o.record = FALSE;
  res = sw_ascent_solve (&tmp, &o, cancellable, &error);
  if (res == NULL)
    {
      g_strlcpy (reason, error->message, SW_REASON_MAX);
      return NAN;
    }
  if ((res->status != SW_ASCENT_REACHED && res->status != SW_ASCENT_SHORT)
      || !isfinite (res->losses_m_s))
    {
      g_autofree char *why = sw_format_clause (res->reason);
      g_snprintf (reason, SW_REASON_MAX, _("the ascent could not be flown: %s"), why);
      return NAN;
    }
  return res->losses_m_s;
}

/* The climb's share of the energy of a circular orbit at @altitude_km, as a
 * speed: sqrt(2 mu/R - mu/r) - sqrt(mu/r), the energy-equivalent delta-v from
 * rest at the surface less the orbital speed the budget already counts
 * (specific orbital energy, Curtis, Orbital Mechanics for Engineering
 * Students, ch. 2; from memory). */
double
sw_payload_climb_m_s (double altitude_km)
{
  double r = SW_WGS84_A + altitude_km * 1000.0;

  return sqrt (2.0 * SW_WGS84_MU / SW_WGS84_A - SW_WGS84_MU / r) - sqrt (SW_WGS84_MU / r);
}

void
sw_payload_point_compute (const SwDesign *design, double altitude_km, double inclination_deg,
                          gboolean simulate, GCancellable *cancellable, SwPayloadPoint *out)
{
  const SwMission *m = &design->mission;
  double losses = m->has_losses ? m->losses_m_s
                  : m->loss_model == SW_LOSS_SIMULATE ? SW_PAYLOAD_FIRST_GUESS_LOSSES_M_S : 0.0;
  const SwLimit *pl = sw_limit_get (SW_LIMIT_PAYLOAD);

  g_return_if_fail (design != NULL && out != NULL);

  memset (out, 0, sizeof *out);
  out->reason[0] = '\0';
  /* The allowance is the design's at its own altitude; the budget's ideal
   * delta-v counts the orbital speed but not the climb, so at another
   * altitude the allowance moves by the change in the climb's energy.
   * Without this a fixed allowance would make the payload rise with
   * altitude, which no vehicle does. */
  losses += sw_payload_climb_m_s (altitude_km) - sw_payload_climb_m_s (m->altitude_km);
  losses = MAX (losses, 0.0);
  payload_at (design, altitude_km, inclination_deg, losses, out);
  if (!simulate || !isfinite (out->delta_v_m_s))
    return;
  for (guint k = 0; k < LOOP_MAX; k++)
    {
      char why[SW_REASON_MAX] = "";
      /* A vehicle short even empty is flown with the least payload the
       * file allows, to see whether the flown losses are smaller. */
      double payload = out->reachable ? out->payload_kg * (1.0 - 1e-9) : pl->min;
      double flown = flown_losses (design, altitude_km, inclination_deg,
                                   MAX (payload, pl->min), cancellable, why);

      if (g_cancellable_is_cancelled (cancellable))
        return;
      if (!isfinite (flown))
        {
          out->reachable = FALSE;
          out->payload_kg = NAN;
          out->simulated = FALSE;
          g_strlcpy (out->reason, why, sizeof out->reason);
          return;
        }
      out->simulated = TRUE;
      payload_at (design, altitude_km, inclination_deg, flown, out);
      if (fabs (flown - losses) < LOOP_TOLERANCE_M_S)
        return;
      losses = flown;
    }
  /* Not settled: the last figures stand, and say so. */
  if (out->reason[0] == '\0')
    g_snprintf (out->reason, sizeof out->reason,
                _("the flown losses did not settle within %s in %d flights"),
                SW_SPEED (LOOP_TOLERANCE_M_S), LOOP_MAX);
}

static gboolean
every_stage_fixed (const SwDesign *design, guint *sized_stage)
{
  for (guint i = 0; i < design->n_stages; i++)
    if (!design->stages[i].propellant.has_propellant_kg)
      {
        *sized_stage = i;
        return FALSE;
      }
  return design->n_stages > 0;
}

gboolean
sw_payload_curves_compute (const SwDesign *design, const double *altitudes_km, guint n_altitudes,
                           const double *inclinations_deg, guint n_inclinations,
                           gboolean simulate, GCancellable *cancellable, SwPayloadCurves *out)
{
  double alts[SW_PAYLOAD_CURVE_MAX], incs[SW_PAYLOAD_CURVE_MAX];
  const SwMission *m;
  guint sized = 0;

  g_return_val_if_fail (design != NULL && out != NULL, FALSE);

  memset (out, 0, sizeof *out);
  m = &design->mission;
  out->altitude_km = m->kind == SW_MISSION_ORBIT ? m->altitude_km : NAN;
  out->inclination_deg = m->kind == SW_MISSION_ORBIT ? m->inclination_deg : NAN;
  if (m->kind != SW_MISSION_ORBIT)
    {
      g_strlcpy (out->note, _("No payload curves: the mission gives its delta-v directly, "
                              "not an orbit whose altitude or inclination could change."),
                 sizeof out->note);
      return TRUE;
    }
  if (!every_stage_fixed (design, &sized))
    {
      g_snprintf (out->note, sizeof out->note,
                  _("No payload curves: stage %u (%s) is sized for the payload, so the "
                    "vehicle changes with the orbit.  The curves are for a vehicle that "
                    "exists: a fixed propellant load (propellant_kg) on every stage."),
                  sized + 1, design->stages[sized].name);
      return TRUE;
    }
  if (altitudes_km == NULL || n_altitudes == 0)
    {
      n_altitudes = sw_payload_default_altitudes (alts);
      altitudes_km = alts;
    }
  if (inclinations_deg == NULL || n_inclinations == 0)
    {
      n_inclinations = sw_payload_default_inclinations (design, incs);
      inclinations_deg = incs;
    }
  out->applies = TRUE;
  out->altitude.n_points = MIN (n_altitudes, SW_PAYLOAD_CURVE_MAX);
  out->inclination.n_points = MIN (n_inclinations, SW_PAYLOAD_CURVE_MAX);
  for (guint i = 0; i < out->altitude.n_points; i++)
    {
      sw_payload_point_compute (design, altitudes_km[i], m->inclination_deg, simulate,
                                cancellable, &out->altitude.points[i]);
      out->altitude.points[i].x = altitudes_km[i];
      if (g_cancellable_is_cancelled (cancellable))
        return FALSE;
    }
  for (guint i = 0; i < out->inclination.n_points; i++)
    {
      sw_payload_point_compute (design, m->altitude_km, inclinations_deg[i], simulate,
                                cancellable, &out->inclination.points[i]);
      out->inclination.points[i].x = inclinations_deg[i];
      if (g_cancellable_is_cancelled (cancellable))
        return FALSE;
    }
  if (simulate)
    g_strlcpy (out->note, _("Each point's losses are those of an ascent flown to that orbit "
                            "with the payload the vehicle carries there."),
               sizeof out->note);
  else
    g_snprintf (out->note, sizeof out->note,
                _("Every point uses the %s of %s at the design's altitude, moved at "
                  "other altitudes by the change in the climb's energy (the budget's ideal "
                  "delta-v counts the orbital speed, not the climb); the command line's "
                  "performance --simulate flies each point instead."),
                m->loss_model == SW_LOSS_SIMULATE ? _("first-guess loss allowance")
                                                  : _("design's loss allowance"),
                SW_SPEED (m->has_losses ? m->losses_m_s
                : m->loss_model == SW_LOSS_SIMULATE ? SW_PAYLOAD_FIRST_GUESS_LOSSES_M_S : 0.0));
  return TRUE;
}
