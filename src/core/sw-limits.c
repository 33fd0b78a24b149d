/* SPDX-License-Identifier: GPL-3.0-or-later */
#include "config.h"

#include "sw-limits.h"

#include "sw-design.h"

#include <math.h>

/* The accepted input ranges.  The loader, the GUI's spin buttons and the
 * README's table all read this one table. */
static const SwLimit limits[SW_N_LIMITS] = {
  [SW_LIMIT_PAYLOAD] = { "payload_kg", "kg", 0.1, 1.0e7, FALSE,
    "from a 100 g picosatellite to 10,000 t; beyond that the concept is not a launch vehicle" },
  [SW_LIMIT_DELTA_V] = { "delta_v_m_s", "m/s", 0.0, 30000.0, TRUE,
    "positive; 30 km/s exceeds any chemical multistage mission from the ground" },
  [SW_LIMIT_ALTITUDE] = { "altitude_km", "km", 100.0, 100000.0, FALSE,
    "a circular orbit needs at least 100 km to survive a revolution; 100,000 km covers high orbits" },
  [SW_LIMIT_INCLINATION] = { "inclination_deg", "deg", 0.0, 180.0, FALSE,
    "the full range of inclinations; it must also lie between |latitude| and 180 - |latitude|" },
  [SW_LIMIT_SITE_LATITUDE] = { "site_latitude_deg", "deg", -90.0, 90.0, FALSE,
    "any point on the globe" },
  [SW_LIMIT_LOSSES] = { "losses_m_s", "m/s", 0.0, 5000.0, FALSE,
    "gravity, drag and steering losses; over 5 km/s no ascent is sensible" },
  [SW_LIMIT_ISP_VAC] = { "isp_vac_s", "s", 50.0, 1000.0, FALSE,
    "cold gas to nuclear-thermal; chemical engines lie between 200 and 470 s" },
  [SW_LIMIT_ISP_SL] = { "isp_sl_s", "s", 0.0, 1000.0, FALSE,
    "0 for a vacuum-only nozzle; never above the stage's vacuum Isp" },
  [SW_LIMIT_STRUCTURAL_COEFFICIENT] = { "structural_coefficient", "", 0.01, 0.6, FALSE,
    "eps = structure/(structure + propellant); below 0.01 no tank survives, above 0.6 it is hardly a stage" },
  [SW_LIMIT_DELTA_V_SHARE] = { "delta_v_share", "", 0.0, 1.0, FALSE,
    "a fraction of the total; manual shares must add up to 1 within 1e-6" },
  [SW_LIMIT_STAGE_COUNT] = { "stages", "", 1.0, SW_MAX_STAGES, FALSE,
    "one to eight stages; more staging events than eight are not a concept worth sizing" },
  [SW_LIMIT_NAME_LENGTH] = { "name", "characters", 0.0, SW_NAME_MAX - 1, FALSE,
    "names are labels, not documents" },
  [SW_LIMIT_NOTES_LENGTH] = { "notes", "characters", 0.0, 65536.0, FALSE,
    "room for a page of notes" },
  [SW_LIMIT_ENGINE_COUNT] = { "engine_count", "", 1.0, 100.0, FALSE,
    "whole number of engines in the stage; clusters beyond 100 are outside concept practice" },
  [SW_LIMIT_ENGINE_RELIABILITY] = { "engine_reliability", "", 0.5, 1.0, FALSE,
    "probability that one engine runs its burn; below 0.5 the stage is not a concept" },
  [SW_LIMIT_ENGINE_FAILURES_TOLERATED] = { "engine_failures_tolerated", "", 0.0, 99.0, FALSE,
    "whole number of engine failures the stage survives; fewer than its engine count" },
  [SW_LIMIT_IGNITION_RELIABILITY] = { "ignition_reliability", "", 0.5, 1.0, FALSE,
    "probability that the stage's start sequence succeeds" },
  [SW_LIMIT_SEPARATION_RELIABILITY] = { "separation_reliability", "", 0.5, 1.0, FALSE,
    "probability that the staging event above this stage succeeds (ignored for the top stage)" },
  [SW_LIMIT_MC_SAMPLES] = { "samples", "", 100.0, 1000000.0, FALSE,
    "whole number; fewer than 100 give no percentiles worth reading, a million is plenty" },
  [SW_LIMIT_MC_SEED] = { "seed", "", 0.0, 4294967295.0, FALSE,
    "whole number that fixes the random stream, so a run can be repeated" },
  [SW_LIMIT_SPREAD_SIGMA_PERCENT] = { "sigma_percent", "%", 0.0, 30.0, FALSE,
    "standard deviation of a normal spread, in percent of the nominal value" },
  [SW_LIMIT_SPREAD_HALF_RANGE_PERCENT] = { "half_range_percent", "%", 0.0, 30.0, FALSE,
    "half width of a uniform spread (nominal plus or minus), in percent of the nominal value" },
  [SW_LIMIT_LOSSES_SIGMA] = { "sigma_m_s", "m/s", 0.0, 2000.0, FALSE,
    "standard deviation of the losses (a normal spread on the required delta-v)" },
  [SW_LIMIT_LOSSES_HALF_RANGE] = { "half_range_m_s", "m/s", 0.0, 2000.0, FALSE,
    "half width of a uniform spread of the losses (plus or minus)" },
  [SW_LIMIT_SENSITIVITY_STEP] = { "step_percent", "%", 0.1, 50.0, FALSE,
    "the plus-or-minus step of the tornado chart, in percent of each nominal value" },
  [SW_LIMIT_THRUST_VAC] = { "thrust_vac_kn", "kN", 0.0, 100000.0, TRUE,
    "total vacuum thrust of the stage; 100 MN is beyond any stage built or studied" },
  [SW_LIMIT_ENGINE_THRUST_VAC] = { "engine_thrust_vac_kn", "kN", 0.0, 20000.0, TRUE,
    "vacuum thrust of one engine (with engine_count); 20 MN covers the largest single chambers" },
  [SW_LIMIT_DIAMETER] = { "diameter_m", "m", 0.1, 30.0, FALSE,
    "outer diameter, the drag reference area; from a sounding-rocket tube to a super-heavy core" },
  [SW_LIMIT_DRAG_POINTS] = { "drag_coefficients", "points", 1.0, 32.0, FALSE,
    "a list of [mach, cd] pairs, Mach increasing; without it a generic slender-vehicle table is used" },
  [SW_LIMIT_DRAG_MACH] = { "mach", "", 0.0, 50.0, FALSE,
    "Mach number of a drag_coefficients point; the coefficient is held constant beyond the table" },
  [SW_LIMIT_DRAG_CD] = { "cd", "", 0.0, 5.0, TRUE,
    "axial drag coefficient on the stage's frontal area; slender vehicles lie between 0.1 and 1" },
  [SW_LIMIT_COAST] = { "coast_before_ignition_s", "s", 0.0, 3600.0, FALSE,
    "unpowered flight from the separation below to this stage's ignition; not for the first stage" },
  [SW_LIMIT_FAIRING_MASS] = { "fairing_mass_kg", "kg", 0.0, 100000.0, FALSE,
    "payload fairing carried on top of the sized vehicle until it is dropped" },
  [SW_LIMIT_FAIRING_ALTITUDE] = { "fairing_jettison_altitude_km", "km", 30.0, 500.0, FALSE,
    "altitude at which the fairing is dropped; common practice is near 100 to 120 km" },
  [SW_LIMIT_FAIRING_DYNAMIC_PRESSURE] = { "fairing_jettison_dynamic_pressure_pa", "Pa", 0.0,
    5000.0, TRUE,
    "the fairing is dropped when the dynamic pressure falls below this value after max-Q" },
  [SW_LIMIT_PITCH_OVER_SPEED] = { "pitch_over_speed_m_s", "m/s", 5.0, 300.0, FALSE,
    "speed relative to the air at which the vertical rise ends and the pitch-over begins" },
  [SW_LIMIT_PITCH_KICK] = { "pitch_kick_deg", "deg", 0.0, 45.0, TRUE,
    "tilt of the thrust at the pitch-over; left out, the solver picks the one that costs least delta-v" },
  [SW_LIMIT_INSERTION_ALTITUDE] = { "insertion_altitude_km", "km", 100.0, 2000.0, FALSE,
    "perigee of a transfer orbit up to the target, circularised at apogee; left out, direct insertion" },
};

const SwLimit *
sw_limit_get (SwLimitId id)
{
  g_return_val_if_fail (id < SW_N_LIMITS, NULL);
  return &limits[id];
}

gboolean
sw_limit_contains (SwLimitId id, double value)
{
  const SwLimit *l = sw_limit_get (id);

  if (l == NULL || !isfinite (value))
    return FALSE;
  if (l->min_exclusive ? !(value > l->min) : !(value >= l->min))
    return FALSE;
  return value <= l->max;
}

char *
sw_limits_dup_markdown (void)
{
  GString *s = g_string_new ("| field | unit | range | why |\n|---|---|---|---|\n");

  for (guint i = 0; i < SW_N_LIMITS; i++)
    {
      const SwLimit *l = &limits[i];
      /* A '|' in the text would end the cell: escape it as markdown does. */
      g_auto (GStrv) parts = g_strsplit (l->why, "|", -1);
      g_autofree char *why = g_strjoinv ("\\|", parts);

      g_string_append_printf (s, "| `%s` | %s | %s%g to %g | %s |\n", l->key,
                              l->unit[0] ? l->unit : "-", l->min_exclusive ? "above " : "",
                              l->min, l->max, why);
    }
  return g_string_free (s, FALSE);
}
