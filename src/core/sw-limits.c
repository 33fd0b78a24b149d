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
      g_string_append_printf (s, "| `%s` | %s | %s%g to %g | %s |\n", l->key,
                              l->unit[0] ? l->unit : "-", l->min_exclusive ? "above " : "",
                              l->min, l->max, l->why);
    }
  return g_string_free (s, FALSE);
}
